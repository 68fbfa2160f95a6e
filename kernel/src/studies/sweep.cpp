// The product of a study's axes over a base request, designed on all cores.
#include <algorithm>
#include <atomic>
#include <cctype>
#include <optional>
#include <thread>

#include "armature/design.hpp"
#include "armature/quantities.hpp"
#include "armature/studies.hpp"

namespace armature {

using nlohmann::json;

unsigned worker_count(unsigned threads) {
  return threads ? threads : std::max(1u, std::thread::hardware_concurrency());
}

void parallel_for(std::size_t n, unsigned threads, const std::function<void(std::size_t, unsigned)>& fn) {
  const auto t = static_cast<unsigned>(std::min<std::size_t>(worker_count(threads), std::max<std::size_t>(n, 1)));
  std::atomic<std::size_t> next{0};
  auto work = [&](unsigned worker) {
    for (std::size_t i; (i = next.fetch_add(1)) < n;) fn(i, worker);
  };
  std::vector<std::thread> pool;
  for (unsigned k = 1; k < t; ++k) pool.emplace_back(work, k);
  work(0);
  for (auto& th : pool) th.join();
}

namespace {

// Sets a value at a dotted path with list indices: "slab.spans_m[0]";
// objects missing on the way are made.
void set_path(json& j, const std::string& path, const json& value) {
  json* node = &j;
  std::size_t i = 0;
  auto fail = [&](const std::string& why) { throw InputError({{path, why}}); };
  while (i < path.size()) {
    if (path[i] == '[') {
      const std::size_t close = path.find(']', i);
      if (close == std::string::npos) fail("unclosed [ in the axis path");
      const std::string digits = path.substr(i + 1, close - i - 1);
      if (digits.empty() || digits.size() > 6 ||
          !std::all_of(digits.begin(), digits.end(), [](unsigned char c) { return std::isdigit(c); }))
        fail("a list entry is written [0], [1], ...");
      const std::size_t k = std::stoul(digits);
      if (!node->is_array() || k >= node->size())
        fail("the base request has no list entry " + std::to_string(k) + " here");
      node = &(*node)[k];
      i = close + 1;
      if (i < path.size() && path[i] == '.') ++i;
    } else {
      std::size_t end = path.find_first_of(".[", i);
      if (end == std::string::npos) end = path.size();
      const std::string key = path.substr(i, end - i);
      if (key.empty()) fail("empty name in the axis path");
      if (node->is_null()) *node = json::object();  // "design.redistribution_percent" with no "design" yet
      if (!node->is_object()) fail("'" + key + "' is not inside an object");
      node = &(*node)[key];
      i = end;
      if (i < path.size() && path[i] == '.') ++i;
    }
  }
  *node = value;
}

}  // namespace

void set_axis_value(json& req, const json& base, const std::string& path, const json& value) {
  if (path == "code" && value.is_string()) {  // "ID" or "ID:variant"
    // "ID" alone keeps the base's variant when the base is of that code,
    // else takes the code's default (another code's variant means nothing
    // to it).
    const std::string spec = value.get<std::string>();
    const auto colon = spec.find(':');
    const std::string id = spec.substr(0, colon);
    req["code"] = id;
    if (colon != std::string::npos) req["variant"] = spec.substr(colon + 1);
    else if (base.is_object() && base.contains("variant") && base.value("code", json()) == id)
      req["variant"] = base["variant"];
    else if (req.is_object()) req.erase("variant");
    return;
  }
  set_path(req, path, value);
}

Study::Study(json base, std::vector<StudyAxis> axes) : base_(std::move(base)), axes_(std::move(axes)) {
  stride_.assign(axes_.size(), 1);
  for (std::size_t a = axes_.size(); a-- > 0;) {
    stride_[a] = size_;
    size_ *= axes_[a].values.size();
  }
}

std::size_t Study::value_index(std::size_t candidate, std::size_t axis) const {
  return candidate / stride_[axis] % axes_[axis].values.size();
}

void Study::apply(json& request, std::size_t candidate) const {
  for (std::size_t a = 0; a < axes_.size(); ++a)
    set_axis_value(request, base_, axes_[a].path, axes_[a].values[value_index(candidate, a)]);
}

json Study::request(std::size_t candidate) const {
  json req = base_;
  apply(req, candidate);
  return req;
}

StudyRow design_row(const Registry& registry, const json& request) {
  StudyRow row;
  try {
    const auto r = design(registry, request);
    row.designed = true;
    row.pass = r.pass;
    row.max_utilisation = r.max_utilisation;
    row.governing_check = r.governing_check;
    row.governing_where = r.governing_where;
    row.steel_kg_m2 = steel_mass_kg_per_m2(r);
    row.concrete_m3_m2 = concrete_volume_m3_per_m2(r);
    row.thickness_mm = r.thickness_mm;
    row.regions.reserve(r.regions.size());
    for (const auto& g : r.regions)  // a two-way region is named with its direction: "bay 1,1 x"
      row.regions.push_back({g.direction == BarDirection::span ? g.where : g.where + " " + to_string(g.direction),
                             g.bars.bar, g.bars.spacing_mm, g.bars.As_prov_mm2, g.bars_given});
  } catch (const InputError& e) {
    row.error = e.what();
  } catch (const std::exception& e) {
    row.error = std::string("design error: ") + e.what();
  }
  return row;
}

std::vector<StudyRow> sweep(const Registry& registry, const Study& study, unsigned threads) {
  std::vector<StudyRow> rows(study.size());
  // One request per worker, copied from the base once: every axis field is
  // set again for each candidate, and nothing else changes.
  std::vector<std::optional<json>> scratch(worker_count(threads));
  parallel_for(rows.size(), threads, [&](std::size_t i, unsigned worker) {
    if (!scratch[worker]) scratch[worker] = study.base();
    json& req = *scratch[worker];
    try {
      study.apply(req, i);
    } catch (const InputError& e) {
      rows[i].error = e.what();
      return;
    }
    rows[i] = design_row(registry, req);
  });
  return rows;
}

}  // namespace armature
