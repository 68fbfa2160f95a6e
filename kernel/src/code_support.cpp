// Helpers the kernel offers to code plug-ins (code.hpp): verdicts of
// checks, geometry every code refuses, building blocks of load arrangements.
#include <algorithm>
#include <cstdio>
#include <string>

#include "armature/code.hpp"

namespace armature {

namespace {
void take_verdict(RegionVerdict& v, const std::vector<Check>& checks) {
  for (const auto& c : checks) {
    v.all_pass = v.all_pass && c.pass;
    if (is_strength_check(c.id.str())) v.strength_pass = v.strength_pass && c.pass;
  }
}
}  // namespace

RegionVerdict verdict_of(const RegionOutcome& o) {
  RegionVerdict v;
  take_verdict(v, o.checks);
  take_verdict(v, o.span_checks);
  for (const auto& s : o.supports) take_verdict(v, s.checks);
  return v;
}

RegionVerdict verdict_of(const SectionOutcome& o) {
  RegionVerdict v;
  take_verdict(v, o.checks);
  for (const auto& s : o.supports) take_verdict(v, s.checks);
  return v;
}

RegionVerdict verdict_of(const std::vector<Check>& checks) {
  RegionVerdict v;
  take_verdict(v, checks);
  return v;
}

void add_cover_fit_problems(const Request& req, double smallest_bar_mm, InputProblems& problems) {
  const double h = req.slab.thickness_mm;
  if (h <= 0) return;
  auto num = [](double v) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.4g", v);
    return std::string(buf);
  };
  // Each face's given cover, once per field (the plain form sets both).
  double largest_fitting = -1.0;
  for (Face face : {Face::bottom, Face::top}) {
    const FaceDurability& fd = req.durability.face(face);
    if (!fd.cover_mm) continue;
    if (face == Face::top && req.durability.face(Face::bottom).cover_field == fd.cover_field) continue;
    if (*fd.cover_mm >= h / 2)
      problems.add(fd.cover_field, "must be less than half the slab thickness (" + num(h / 2) + " mm), got " +
                                       num(*fd.cover_mm));
    else
      largest_fitting = std::max(largest_fitting, *fd.cover_mm);
  }
  if (largest_fitting >= 0.0 && largest_fitting + smallest_bar_mm >= h)
    problems.add("slab.thickness_mm", "must exceed cover plus the smallest bar (" +
                                          num(largest_fitting + smallest_bar_mm) + " mm), got " + num(h));
}

std::vector<std::vector<bool>> alternate_span_arrangements(std::size_t n) {
  std::vector<std::vector<bool>> out;
  for (std::size_t parity = 0; parity < 2; ++parity) {
    std::vector<bool> a(n);
    for (std::size_t i = 0; i < n; ++i) a[i] = i % 2 == parity;
    out.push_back(std::move(a));
  }
  return out;
}

std::vector<std::vector<bool>> adjacent_pair_arrangements(std::size_t n) {
  std::vector<std::vector<bool>> out;
  for (std::size_t i = 0; i + 1 < n; ++i) {
    std::vector<bool> a(n, false);
    a[i] = a[i + 1] = true;
    out.push_back(std::move(a));
  }
  return out;
}

std::vector<bool> all_spans_loaded(std::size_t n) { return std::vector<bool>(n, true); }

}  // namespace armature

namespace armature {

std::vector<InputDefault> durability_defaults(const Request& request, const std::array<std::string, 2>& exposure,
                                              const std::string& exposure_basis, const std::string& cover,
                                              const std::string& cover_basis) {
  const DurabilityInput& d = request.durability;
  std::vector<InputDefault> out;
  auto face_field = [](Face f, const char* key) { return std::string("durability.") + to_string(f) + "." + key; };
  const bool exposure_given[2] = {d.face(Face::bottom).exposure.has_value(), d.face(Face::top).exposure.has_value()};
  if (!exposure_given[0] && !exposure_given[1] && exposure[0] == exposure[1]) {
    out.push_back({"durability.exposure", exposure[0], exposure_basis});
  } else {
    for (const Face f : {Face::bottom, Face::top})
      if (!exposure_given[static_cast<std::size_t>(f)])
        out.push_back({face_field(f, "exposure"), exposure[static_cast<std::size_t>(f)], exposure_basis});
  }
  if (!d.any_cover_given()) {
    out.push_back({"durability.cover_mm", cover, cover_basis});
  } else {
    for (const Face f : {Face::bottom, Face::top})
      if (!d.cover_given(f)) out.push_back({face_field(f, "cover_mm"), cover, cover_basis});
  }
  return out;
}

}  // namespace armature

namespace armature {

std::vector<bool> all_bays_loaded(std::size_t bays_x, std::size_t bays_y) {
  return std::vector<bool>(bays_x * bays_y, true);
}

std::vector<std::vector<bool>> checkerboard_bay_arrangements(std::size_t bays_x, std::size_t bays_y) {
  std::vector<std::vector<bool>> out;
  if (bays_x * bays_y < 2) return out;
  for (std::size_t parity = 0; parity < 2; ++parity) {
    std::vector<bool> a(bays_x * bays_y);
    for (std::size_t j = 0; j < bays_y; ++j)
      for (std::size_t i = 0; i < bays_x; ++i) a[i + bays_x * j] = (i + j) % 2 == parity;
    out.push_back(std::move(a));
  }
  return out;
}

std::vector<std::vector<bool>> alternate_bay_strips(std::size_t bays_x, std::size_t bays_y) {
  std::vector<std::vector<bool>> out;
  for (const bool along_x : {true, false}) {
    if ((along_x ? bays_x : bays_y) < 2) continue;
    for (std::size_t parity = 0; parity < 2; ++parity) {
      std::vector<bool> a(bays_x * bays_y);
      for (std::size_t j = 0; j < bays_y; ++j)
        for (std::size_t i = 0; i < bays_x; ++i) a[i + bays_x * j] = (along_x ? i : j) % 2 == parity;
      out.push_back(std::move(a));
    }
  }
  return out;
}

std::vector<std::vector<bool>> adjacent_bays_across_lines(std::size_t bays_x, std::size_t bays_y) {
  std::vector<std::vector<bool>> out;
  for (std::size_t k = 1; k < bays_x; ++k) {  // the line between columns k − 1 and k
    std::vector<bool> a(bays_x * bays_y, false);
    for (std::size_t j = 0; j < bays_y; ++j) a[k - 1 + bays_x * j] = a[k + bays_x * j] = true;
    out.push_back(std::move(a));
  }
  for (std::size_t k = 1; k < bays_y; ++k) {  // the line between rows k − 1 and k
    std::vector<bool> a(bays_x * bays_y, false);
    for (std::size_t i = 0; i < bays_x; ++i) a[i + bays_x * (k - 1)] = a[i + bays_x * k] = true;
    out.push_back(std::move(a));
  }
  return out;
}

}  // namespace armature
