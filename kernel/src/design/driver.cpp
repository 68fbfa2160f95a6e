// The design driver, on a Member and the code. Loads are totalled from the
// code's factors, the member is analysed (members/), each of its regions
// gets the bar search of contract.md (design/search.cpp), and the code's
// checks of the chosen arrangements make the design record.
#include "armature/design.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>
#include <optional>
#include <set>
#include <tuple>
#include <string_view>
#include <limits>
#include <numbers>

#include <boost/container/small_vector.hpp>

#include "armature/analysis.hpp"
#include "armature/format.hpp"
#include "armature/member.hpp"
#include "detailing.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "call_code.hpp"
#include "loads.hpp"
#include "search.hpp"
#include "two_way_design.hpp"

#ifndef ARMATURE_VERSION
#define ARMATURE_VERSION "0.0.0"
#endif

namespace armature {

const char* version_string() { return ARMATURE_VERSION; }

namespace {

// For a request that passed validation; `id` is the code's identity,
// `checker` the code's checker for this request, `step_units` the units of
// its edition (DesignRecord::step_units), `limits` the regions whose bars
// the search keeps below a size (with_anchored_bends).
DesignRecord design_validated(const SlabChecker& checker, CodeIdentity id, const Request& req, Member& member,
                              Detail detail, ReportUnits step_units, const std::vector<BarLimit>& limits);

// The request's spacing grid.
SpacingGrid grid_of(const Request& req) { return {req.reinforcement.min_spacing_mm, req.reinforcement.spacing_step_mm}; }

// A region's name with its face (and on a plate its bars' direction).
std::string region_words(const std::string& where, Face face, BarDirection direction) {
  return where + " (" + to_string(face) +
         (direction == BarDirection::span ? std::string() : std::string(", bars in ") + to_string(direction)) + ")";
}

// Bars whose bends the detailing found too short at a support (a narrow
// wall or column; DetailingRecord::short_bends): the request designed
// again with each such region's bars kept below the size whose bend
// failed, one size smaller each round while a bend is short and a smaller
// size is left, then one grid step closer (`grid`) while that lowers the
// bend's demand. Given bars, and regions failing a check of their own in
// the first design, are never limited; a limit under which its region
// fails a check it passed is undone and not tried again. A design
// replaces the one kept only when it fails fewer checks, none that the
// kept one passes and none by more; warnings say what the kept design
// takes and which bends stay short, and why (DEVELOPERS.md, "Detailing").
// `design_with(limits)` designs the request.
template <class DesignWith>
DesignRecord with_anchored_bends(const SlabChecker& checker, const CodeIdentity& code, const SpacingGrid& grid,
                                 DesignWith&& design_with) {
  std::vector<BarLimit> limits;
  DesignRecord best = design_with(limits);
  if (!best.detailing || best.detailing->short_bends.empty()) return best;
  const auto& options =
      call_code(code, "bar options", [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  // A failed check: id, where, and its first step's text, which tells the
  // bars apart where one support checks several bends.
  using Key = std::tuple<std::string, std::string, std::string>;
  struct Failed {
    int count = 0;
    double worst = 0.0;  // the largest utilisation among them
  };
  auto failures = [](const DesignRecord& r) {
    std::map<Key, Failed> out;
    for (const Check* c : r.all_checks())
      if (!c->pass) {
        Failed& f = out[{c->id, c->where, c->steps.empty() ? std::string() : c->steps.front().expression}];
        ++f.count;
        f.worst = std::max(f.worst, c->utilisation);
      }
    return out;
  };
  auto total = [](const std::map<Key, Failed>& f) {
    int n = 0;
    for (const auto& [k, v] : f) n += v.count;
    return n;
  };
  // Fewer failures, none new, none more often and none worse.
  auto better = [&](const std::map<Key, Failed>& next, const std::map<Key, Failed>& kept) {
    for (const auto& [k, v] : next) {
      const auto it = kept.find(k);
      if (it == kept.end() || it->second.count < v.count || v.worst > it->second.worst + 1e-9) return false;
    }
    return total(next) < total(kept);
  };
  auto region_failures = [&](const DesignRecord& r, const BarLimit& l) {
    std::set<std::string> out;
    for (const auto& g : r.regions)
      if (same_region(g, l))
        for (const auto& c : g.checks)
          if (!c.pass) out.insert(c.id);
    return out;
  };
  auto name_of = [&](double diameter_mm) {
    for (const auto& o : options)
      if (std::abs(o.diameter_mm - diameter_mm) < 1e-9) return o.designation;
    return plain_number(diameter_mm) + " mm";
  };
  const DesignRecord first = best;  // its regions: which bars are given, which checks pass
  auto given = [&](const BarLimit& l) {
    return std::any_of(first.regions.begin(), first.regions.end(),
                       [&](const RegionRecord& g) { return same_region(g, l) && g.bars_given; });
  };
  // A region failing a check of its own in the first design (bending,
  // say) is not limited: smaller bars would only make it worse.
  auto failing_already = [&](const BarLimit& l) { return !region_failures(first, l).empty(); };
  std::map<Key, Failed> best_failures = failures(best);
  std::vector<BarLimit> best_limits;
  std::vector<BarLimit> frozen;  // limits undone: their regions keep the size they had
  auto is_frozen = [&](const BarLimit& l) {
    return std::any_of(frozen.begin(), frozen.end(), [&](const BarLimit& f) { return same_region(f, l); });
  };
  std::vector<ShortBend> short_bends = best.detailing->short_bends;
  std::vector<RegionRecord> latest = best.regions;  // the bars of the design the short bends are from
  // A closer spacing tried: the bend's demand then, so that a code whose
  // demand does not fall with it (ACI's hook) stops there.
  std::map<std::tuple<std::string, Face, BarDirection>, double> spacing_demand;
  bool tried = false;
  const std::size_t rounds = options.size() + 12;  // sizes, then a few spacings closer
  for (std::size_t round = 0; round < rounds && !short_bends.empty(); ++round) {
    std::vector<std::pair<std::size_t, std::optional<BarLimit>>> tightened;  // limit, as it was (none: new)
    for (const ShortBend& s : short_bends) {
      const BarLimit wanted{s.where, s.face, s.direction, 0.0, 0.0, s.diameter_mm, s.support};
      if (given(wanted) || failing_already(wanted) || is_frozen(wanted)) continue;
      auto it = std::find_if(limits.begin(), limits.end(), [&](const BarLimit& l) { return same_region(l, s); });
      if (std::any_of(tightened.begin(), tightened.end(),
                      [&](const auto& t) { return it != limits.end() && t.first == std::size_t(it - limits.begin()); }))
        continue;  // a region with two short bends: tightened once a round
      double smaller = 0.0;
      for (const auto& o : options)
        if (o.diameter_mm < s.diameter_mm - 1e-9) smaller = std::max(smaller, o.diameter_mm);
      BarLimit next_limit = it == limits.end() ? wanted : *it;
      if (smaller > 0.0) {
        next_limit.max_diameter_mm = smaller;
        next_limit.max_spacing_mm = 0.0;
      } else {
        // The smallest size: a closer spacing, where the code's demand falls
        // with the stress the bars work at (EN 8.4.3(2)).
        const auto g =
            std::find_if(latest.begin(), latest.end(), [&](const RegionRecord& r) { return same_region(r, s); });
        const auto key = std::make_tuple(s.where, s.face, s.direction);
        const auto tried_at = spacing_demand.find(key);
        if (g == latest.end() || (tried_at != spacing_demand.end() && s.demand_mm >= tried_at->second - 1e-6))
          continue;
        const double closer = g->bars.spacing_mm - grid.step_mm;
        if (closer < grid.first_mm - 1e-9) continue;
        spacing_demand[key] = s.demand_mm;
        next_limit.max_diameter_mm = s.diameter_mm;
        next_limit.max_spacing_mm = closer;
      }
      if (it == limits.end()) {
        limits.push_back(next_limit);
        tightened.emplace_back(limits.size() - 1, std::nullopt);
      } else {
        tightened.emplace_back(static_cast<std::size_t>(it - limits.begin()), *it);
        *it = next_limit;
      }
    }
    if (tightened.empty()) break;
    tried = true;
    DesignRecord next = design_with(limits);
    // Undo the limits under which their region fails a check of its own
    // that it passed in the first design.
    bool undone = false;
    for (auto t = tightened.rbegin(); t != tightened.rend(); ++t) {
      const BarLimit l = limits[t->first];
      const std::set<std::string> before = region_failures(first, l);
      const std::set<std::string> now = region_failures(next, l);
      if (std::includes(before.begin(), before.end(), now.begin(), now.end())) continue;
      frozen.push_back(l);
      if (t->second) limits[t->first] = *t->second;
      else limits.erase(limits.begin() + static_cast<std::ptrdiff_t>(t->first));
      undone = true;
    }
    if (undone) next = design_with(limits);
    const std::map<Key, Failed> f = failures(next);
    short_bends = next.detailing ? next.detailing->short_bends : std::vector<ShortBend>{};
    latest = next.regions;
    if (better(f, best_failures)) {
      best = std::move(next);
      best_failures = f;
      best_limits = limits;
    }
  }
  // What was done: each limit the kept design takes, and whether its
  // bends now anchor; each region whose bend is still short and why
  // smaller bars were not taken.
  const std::vector<ShortBend> still =
      best.detailing ? best.detailing->short_bends : std::vector<ShortBend>{};
  auto short_in = [&](const BarLimit& l) {
    return std::find_if(still.begin(), still.end(), [&](const ShortBend& s) { return same_region(s, l); });
  };
  for (const BarLimit& l : best_limits) {
    const auto s = short_in(l);
    const bool closer_only = l.max_spacing_mm > 0.0 && std::abs(l.max_diameter_mm - l.first_diameter_mm) < 1e-9;
    best.warnings.push_back(region_words(l.where, l.face, l.direction) + ": bars searched " +
                            (closer_only ? std::string("at ")
                                         : "among " + name_of(l.max_diameter_mm) + " and smaller" +
                                               (l.max_spacing_mm > 0.0 ? std::string(" at ") : std::string())) +
                            (l.max_spacing_mm > 0.0 ? plain_number(l.max_spacing_mm) +
                                                          " mm or closer (the bend's anchorage falls with the stress "
                                                          "the bars work at)"
                                                    : std::string()) +
                            ", since the bend of the " +
                            name_of(l.first_diameter_mm) + " bars first chosen is too short to anchor them at " +
                            l.support + (s == still.end() ? std::string() : "; the bend at " + s->support +
                                                                               " is still too short"));
  }
  std::vector<BarLimit> said;
  for (const ShortBend& s : still) {
    const BarLimit l{s.where, s.face, s.direction, 0.0, 0.0, s.diameter_mm, s.support};
    const bool limited =
        std::any_of(best_limits.begin(), best_limits.end(), [&](const BarLimit& b) { return same_region(b, l); });
    const bool repeated = std::any_of(said.begin(), said.end(), [&](const BarLimit& b) { return same_region(b, l); });
    if (limited || repeated) continue;
    said.push_back(l);
    const bool smallest = std::none_of(options.begin(), options.end(),
                                       [&](const BarOption& o) { return o.diameter_mm < s.diameter_mm - 1e-9; });
    const std::string why = given(l)             ? "the bars are given (reinforcement.given)"
                            : failing_already(l) ? "the region fails a check of its own already"
                            : smallest           ? "no smaller bar is among the options, nor does a closer spacing help"
                            : tried              ? "smaller bars do not anchor either, or fail other checks"
                                                 : "smaller bars were not tried";
    best.warnings.push_back(region_words(s.where, s.face, s.direction) + ": the bend at " + s.support +
                            " is too short to anchor the " + name_of(s.diameter_mm) + " bars, and smaller bars "
                            "are not taken: " + why + " (a wider support, or other bars, are needed)");
  }
  return best;
}

// Each region of reinforcement.given must be one of the strip's, at its
// face. `pinned_end_steel`: whether pinned ends carry top bars (the code's
// rule; unknown until the request is valid, when such names pass here).
void add_given_region_problems(const Request& req, std::optional<bool> pinned_end_steel, InputProblems& problems) {
  const auto& given = req.reinforcement.given;
  if (given.empty() || req.slab.spans_mm.empty()) return;
  for (const auto& p : problems.items())
    if (p.field.rfind("slab", 0) == 0) return;  // the strip itself is in doubt
  const OneWayStrip member(req.slab, req.design.redistribution_percent);
  const auto names = member.region_names(pinned_end_steel);
  std::string listed;
  for (const auto& r : names)
    if (r.certain) listed += (listed.empty() ? "" : ", ") + r.where + " (" + to_string(r.face) + ")";
  for (std::size_t i = 0; i < given.size(); ++i) {
    const std::string path = "reinforcement.given[" + std::to_string(i) + "]";
    if (given[i].where.empty()) continue;  // refused as it was read
    const auto it = std::find_if(names.begin(), names.end(), [&](const RegionName& r) { return r.where == given[i].where; });
    if (it == names.end()) {
      const auto with_ends = member.region_names(true);
      const bool pinned_support = pinned_end_steel.has_value() && !*pinned_end_steel &&
                                  std::any_of(with_ends.begin(), with_ends.end(),
                                              [&](const RegionName& r) { return r.where == given[i].where; });
      problems.add(path + ".where",
                   "no region '" + given[i].where + "' in this strip" +
                       (pinned_support ? std::string(" (a pinned end carries no top bars under this code)") : "") +
                       "; its regions are " + listed);
    } else if (it->certain && it->face != given[i].face && !problems.has_field(path + ".face")) {
      problems.add(path + ".face", "'" + it->where + "' is a " + to_string(it->face) + " region; got " +
                                       to_string(given[i].face));
    }
  }
}

// Opens the code's checker for a request that passed every other check,
// and checks the regions of reinforcement.given against the strip (which
// needs the code's rule for pinned ends).
std::unique_ptr<SlabChecker> begin_checked(const DesignCode& code, const CodeIdentity& id, const Request& req) {
  auto checker = call_code(id, "set-up", [&] { return code.begin(req); });
  if (!req.reinforcement.given.empty()) {
    const double fixity =
        call_code(id, "end fixity", [&] { return checker->member_rules().pinned_end_fixity_fraction(); });
    InputProblems problems;
    add_given_region_problems(req, fixity > 0.0, problems);
    problems.raise_if_any();
  }
  return checker;
}

// The code's practice defaults for the kernel's fields the request's JSON
// leaves out (slab.strip_width_mm, the search grid, the aggregate size,
// report_units).
void apply_practice_defaults(const PracticeDefaults& practice, const nlohmann::json& j, Request& req) {
  if (!request_gives(j, "slab.strip_width_mm")) req.slab.strip_width_mm = practice.strip_width_mm;
  if (!request_gives(j, "reinforcement.spacing_step_mm"))
    req.reinforcement.spacing_step_mm = practice.spacing_step_mm;
  if (!request_gives(j, "reinforcement.min_spacing_mm"))
    req.reinforcement.min_spacing_mm = practice.min_spacing_mm;
  if (!request_gives(j, "concrete.aggregate_mm")) req.concrete.aggregate_mm = practice.aggregate_mm;
  if (!request_gives(j, "report_units")) req.report_units = practice.report_units;
}

// A code's default concrete strength for a request's JSON that gives none
// (neither concrete.class nor a cylinder strength): the reader's
// "required" problems of the concrete are withdrawn.
void apply_default_strength(const PracticeDefaults& practice, const nlohmann::json& j, Request& req,
                            InputProblems& problems) {
  if (!practice.cylinder_strength_MPa || request_gives(j, "concrete.class") ||
      request_gives(j, "concrete.cylinder_strength_MPa"))
    return;
  if (j.is_object() && j.contains("concrete") && !j["concrete"].is_object()) return;  // a wrong type stays an error
  req.concrete.cylinder_strength_MPa = practice.cylinder_strength_MPa;
  InputProblems kept;
  for (const auto& p : problems.items()) {
    const bool strength_required = (p.field == "concrete" && p.message == "required") ||
                                   (p.field == "concrete.class" && p.message.rfind("required", 0) == 0);
    if (!strength_required) kept.add(p.field, p.message);
  }
  problems = std::move(kept);
}

// A slab type the code does not design is a problem on slab.type
// (LoadedCodeInfo::slab_types, from the plug-in).
void add_slab_type_problem(const Registry& registry, const Request& req, InputProblems& problems) {
  const char* type = req.slab_type == SlabType::flat      ? "flat"
                     : req.slab_type == SlabType::two_way ? "two_way"
                                                          : "one_way";
  for (const auto& info : registry.codes()) {
    if (info.id != req.code) continue;
    if (std::find(info.slab_types.begin(), info.slab_types.end(), type) != info.slab_types.end()) return;
    std::string listed;
    for (const auto& t : info.slab_types) listed += (listed.empty() ? "" : ", ") + t;
    problems.add(req.slab_type == SlabType::one_way ? "code" : "slab.type",
                 info.id + " does not design " + type + " slabs (it designs: " + listed + ")");
    return;
  }
}

// Whether the result states its strip width (DesignRecord::state_strip_width).
bool states_strip_width(const PracticeDefaults& practice) {
  return practice.strip_width_mm != PracticeDefaults{}.strip_width_mm;
}

// A one-way strip's design, each round on a strip of its own.
DesignRecord design_strip(const SlabChecker& checker, const CodeIdentity& id, const Request& req, Detail detail,
                          ReportUnits step_units) {
  return with_anchored_bends(checker, id, grid_of(req), [&](const std::vector<BarLimit>& limits) {
    OneWayStrip member(req.slab, req.design.redistribution_percent);
    return design_validated(checker, id, req, member, detail, step_units, limits);
  });
}

}  // namespace

std::vector<const Check*> DesignRecord::all_checks() const {
  std::size_t count = 0;
  for (const auto& r : regions) count += r.checks.size();
  for (const auto& s : supports) count += s.checks.size();
  for (const auto& s : spans) count += s.checks.size();
  for (const auto& c : columns) count += c.punching.checks.size();
  std::vector<const Check*> out;
  out.reserve(count);
  for (const auto& r : regions)
    for (const auto& c : r.checks) out.push_back(&c);
  for (const auto& s : supports)
    for (const auto& c : s.checks) out.push_back(&c);
  for (const auto& s : spans)
    for (const auto& c : s.checks) out.push_back(&c);
  for (const auto& col : columns)
    for (const auto& c : col.punching.checks) out.push_back(&c);
  return out;
}

DesignRecord design(const Registry& registry, const nlohmann::json& j, Detail detail) {
  InputProblems problems;
  Request req = request_from_json(j, problems);
  std::shared_ptr<const DesignCode> code;
  if (!problems.has_field("code")) {
    try {
      code = registry.open(req.code, req.variant.value_or(""));
      add_slab_type_problem(registry, req, problems);
    } catch (const InputError& e) {
      for (const auto& p : e.problems()) problems.add(p.field, p.message);
    }
  }
  CodeIdentity id;
  PracticeDefaults practice;
  if (code) {
    id = call_code(CodeIdentity{req.code, req.variant.value_or(""), ""}, "identity",
                   [&] { return code->identity(); });
    practice = call_code(id, "practice defaults", [&] { return code->practice_defaults(); });
    apply_practice_defaults(practice, j, req);
    apply_default_strength(practice, j, req, problems);
    call_code(id, "input validation", [&] { code->validate(req, problems); });
  }
  if (req.plate()) {                   // a two-way or flat slab: its own path (two_way_design.cpp)
    req.slab.strip_width_mm = 1000.0;  // every result per metre, whatever the practice strip
    if (problems.empty()) add_two_way_problems(req, problems);
    problems.raise_if_any();
    const auto checker = call_code(id, "set-up", [&] { return code->begin(req); });
    return with_anchored_bends(*checker, id, grid_of(req), [&](const std::vector<BarLimit>& limits) {
      return design_two_way(*checker, id, req, detail, practice.report_units, limits);
    });
  }
  OneWayStrip member(req.slab, req.design.redistribution_percent);
  if (problems.empty()) member.add_scope_problems(problems);
  // With other problems the code's checker cannot be opened: the regions
  // given are checked against the strip alone, now, so that they are
  // reported with the rest (pinned ends wait for a valid request).
  if (!problems.empty()) add_given_region_problems(req, std::nullopt, problems);
  problems.raise_if_any();
  const auto checker = begin_checked(*code, id, req);
  DesignRecord rec = design_strip(*checker, id, req, detail, practice.report_units);
  rec.state_strip_width = states_strip_width(practice);
  return rec;
}

DesignRecord design(const Registry& registry, const Request& req, Detail detail) {
  auto code = registry.open(req.code, req.variant.value_or(""));
  InputProblems problems;
  add_slab_type_problem(registry, req, problems);
  CodeIdentity id = call_code(CodeIdentity{req.code, req.variant.value_or(""), ""}, "identity",
                              [&] { return code->identity(); });
  call_code(id, "input validation", [&] { code->validate(req, problems); });
  const PracticeDefaults practice = call_code(id, "practice defaults", [&] { return code->practice_defaults(); });
  if (req.plate()) {  // a two-way or flat slab: its own path (two_way_design.cpp)
    add_two_way_problems(req, problems);
    problems.raise_if_any();
    const auto checker = call_code(id, "set-up", [&] { return code->begin(req); });
    return with_anchored_bends(*checker, id, grid_of(req), [&](const std::vector<BarLimit>& limits) {
      return design_two_way(*checker, id, req, detail, practice.report_units, limits);
    });
  }
  OneWayStrip member(req.slab, req.design.redistribution_percent);
  add_action_problems(req, problems);
  member.add_scope_problems(problems);
  if (!problems.empty()) add_given_region_problems(req, std::nullopt, problems);
  problems.raise_if_any();
  const auto checker = begin_checked(*code, id, req);
  DesignRecord rec = design_strip(*checker, id, req, detail, practice.report_units);
  rec.state_strip_width = states_strip_width(practice);
  return rec;
}

namespace {

// Which regions take given bars (reinforcement.given, by region name) and
// which share one arrangement (rationalise: every bottom region not given).
BarPlan plan_bars(const SlabChecker& checker, const CodeIdentity& code, const ReinforcementInput& r,
                  const std::vector<RegionDemand>& demands, double width_mm) {
  BarPlan plan;
  plan.grid = {r.min_spacing_mm, r.spacing_step_mm};
  plan.given.resize(demands.size());
  for (const auto& g : r.given) {
    const auto it = std::find_if(demands.begin(), demands.end(), [&](const RegionDemand& d) { return d.where == g.where; });
    if (it == demands.end())  // validated against region_names: the two disagree
      throw DesignError("reinforcement.given names " + g.where + ", which the design has no region for");
    const auto bar = call_code(code, "catalogue bar", [&] { return checker.catalogue_bar(g.bar); });
    if (!bar)
      throw DesignError(code.id + " (" + code.variant + "): no catalogue bar '" + g.bar +
                        "', which its input validation accepted");
    plan.given[static_cast<std::size_t>(it - demands.begin())] =
        SearchCandidate{*bar, g.spacing_mm, provided_area_mm2(bar->area_mm2, g.spacing_mm, width_mm)};
  }
  if (r.rationalise == Rationalise::uniform_bottom) add_uniform_bottom_groups(demands, plan);
  return plan;
}

// detailing of the request: the code's detailing rules on the member's
// detailing envelope (a code giving none refuses the request's field).
void detail_design(const SlabChecker& checker, const Request& req, const Member& member, const MemberLoads& loads,
                   DesignRecord& rec) {
  const DetailingRules& rules = detailing_rules_of(checker, rec.code);
  adopt_detailing(rec, detail_strip(rules, rec.code, req, rec, member.detailing_diagrams(loads)));
}

DesignRecord design_validated(const SlabChecker& code_checker, CodeIdentity id, const Request& req, Member& member,
                              Detail detail, ReportUnits step_units, const std::vector<BarLimit>& limits) {
  if (detail == Detail::verdict) detail = Detail::checks;
  DesignRecord rec;
  rec.code = std::move(id);
  rec.report_units = req.report_units;
  rec.step_units = step_units;
  rec.strip_width_mm = req.slab.strip_width_mm;
  rec.support_widths_given = !req.slab.support_widths_mm.empty();
  const SlabChecker* const checker = &code_checker;
  const LoadBasis basis = call_code(rec.code, "load basis", [&] { return checker->load_basis(); });
  // The code's rules, each asked for once: a plug-in may hand out its own
  // for one of them and the inner code's for the others.
  const CombinationRules& combination_rules = call_code(
      rec.code, "combination rules", [&]() -> const CombinationRules& { return checker->combination_rules(); });
  const MemberRules& member_rules =
      call_code(rec.code, "member rules", [&]() -> const MemberRules& { return checker->member_rules(); });
  rec.actions = all_actions(req, basis.density_kN_m3);
  rec.list_actions = req.loads.actions_given;
  // Every label where the combinations are listed (the record, a result
  // listing its actions) or an equilibrium check names its combination (a
  // strip with a cantilever), and every combination where a calculated
  // deflection reads the service ones; otherwise a design needs the ULS
  // labels alone.
  const bool has_cantilever = req.slab.ends[0] == EndSupport::free || req.slab.ends[1] == EndSupport::free;
  const CombinationLabels labels = rec.list_actions || detail == Detail::steps || has_cantilever ||
                                           req.serviceability.calculated_deflection()
                                       ? CombinationLabels::all
                                       : CombinationLabels::strength;
  rec.combinations =
      call_code(rec.code, "combinations", [&] { return combination_rules.combinations(rec.actions, labels); });
  for (const auto& c : rec.combinations)
    if (c.factors.size() != rec.actions.size())
      throw DesignError(rec.code.id + ": combination '" + c.label + "' does not give a factor for every action");
  if (std::none_of(rec.combinations.begin(), rec.combinations.end(),
                   [](const Combination& c) { return c.limit_state == LimitState::uls; }))
    throw DesignError(rec.code.id + ": the code gave no ULS combination");
  rec.loads = total_loads(basis, rec.actions, rec.combinations);
  if (detail == Detail::steps)  // only the calculation record lists them
    rec.defaults_used = call_code(rec.code, "defaults", [&] { return checker->defaults_used(); });

  const double b = req.slab.strip_width_mm;
  const std::size_t parts = member.pattern_count();
  const auto arrangements =
      call_code(rec.code, "load arrangements", [&] { return combination_rules.load_arrangements(parts); });
  for (const auto& a : arrangements)
    if (a.size() != parts) throw DesignError(rec.code.id + ": a load arrangement does not match the spans");
  if (arrangements.empty()) throw DesignError(rec.code.id + ": the code gave no load arrangement");

  const MemberLoads loads{rec.actions, rec.combinations, arrangements, rec.loads,
                          req.serviceability.calculated_deflection()};
  rec.load_cases = member.analyse(loads);
  if (detail == Detail::steps) rec.diagrams = member.diagrams();  // for the record
  rec.spans_mm = req.slab.spans_mm;
  rec.load_arrangements = arrangements.size();
  rec.ends = req.slab.ends;
  rec.redistribution_percent = req.design.redistribution_percent;
  rec.crack_width = req.serviceability.crack_width;
  rec.project = req.project;
  rec.thickness_mm = req.slab.thickness_mm;
  RegionRules rules;
  rules.pinned_end_fixity_fraction =
      call_code(rec.code, "end fixity", [&] { return member_rules.pinned_end_fixity_fraction(); });
  rules.support_design_moment = [&](const RegionDemand& g) {
    const double M =
        call_code(rec.code, "support design moment", [&] { return member_rules.support_design_moment(g); }, g.where);
    if (!std::isfinite(M))
      throw DesignError(rec.code.id + " (" + rec.code.variant + "): the design moment at " + g.where +
                        " is not finite");
    return M;
  };
  auto demands = member.design_regions(rules, rec.warnings);
  rec.rationalise = req.reinforcement.rationalise;
  BarPlan plan = plan_bars(*checker, rec.code, req.reinforcement, demands, b);
  apply_bar_limits(limits, demands, plan);
  const std::vector<SearchCandidate> picks = search_with_face_covers(
      *checker, rec.code, demands, b, req.durability, plan, rec.warnings);

  const std::vector<std::string> span_names = member.span_names(), support_names = member.support_names();
  const std::size_t n = span_names.size(), m = support_names.size();
  std::vector<std::vector<Check>> span_checks(n);
  std::vector<SupportRecord> supports(m);
  rec.regions.reserve(demands.size());
  rec.spans.reserve(n);
  rec.supports.reserve(m);
  double max_main_As = 0.0;
  for (std::size_t i = 0; i < demands.size(); ++i) {
    const RegionDemand& demand = demands[i];
    const SearchCandidate& pick = picks[i];
    RegionOutcome out = call_code(
        rec.code, "the checks",
        [&] { return checker->check_region(demand, pick.bar, pick.spacing_mm, detail); }, demand.where);
    if (detail == Detail::steps && demand.long_term_span && !demand.span_where.empty()) {
      auto diagram = call_code(
          rec.code, "the deflection diagram",
          [&] { return checker->deflection_diagram(demand, pick.bar, pick.spacing_mm); }, demand.where);
      if (diagram) {
        double x0 = 0.0;
        for (std::size_t e = 0; e < n && span_names[e] != demand.span_where; ++e) x0 += req.slab.spans_mm[e];
        rec.deflection_diagrams.push_back({demand.span_where, x0, std::move(*diagram)});
      }
    }
    rec.regions.push_back(region_record(demand, pick, out, plan.given[i].has_value()));
    max_main_As = std::max(max_main_As, pick.As_prov_mm2);
    for (std::size_t e = 0; e < n; ++e)
      if (demand.span_where == span_names[e])
        for (auto& c : out.span_checks) span_checks[e].push_back(std::move(c));
    for (auto& s : out.supports)
      for (std::size_t j = 0; j < m; ++j)
        if (s.where == support_names[j]) supports[j] = {s.where, s.V_Ed, s.V_Rd, std::move(s.checks)};
  }
  for (std::size_t j = 0; j < m; ++j)
    if (!supports[j].where.empty()) rec.supports.push_back(std::move(supports[j]));
  for (std::size_t e = 0; e < n; ++e) {
    SpanRecord span{span_names[e], std::move(span_checks[e])};
    auto extra = call_code(rec.code, "span checks", [&] { return member_rules.span_checks(span.where); });
    for (auto& c : extra) span.checks.push_back(std::move(c));
    rec.spans.push_back(std::move(span));
  }

  // EQU of every cantilever's back span (DEVELOPERS.md, "Actions and
  // combinations").
  for (const auto& worst : member.equilibrium_demands(loads)) {
    auto checks = call_code(rec.code, "equilibrium", [&] { return member_rules.equilibrium_checks(worst, detail); },
                            worst.where);
    auto s = std::find_if(rec.supports.begin(), rec.supports.end(),
                          [&](const SupportRecord& r) { return r.where == worst.where; });
    if (s == rec.supports.end())  // the member names a support the design has no record of
      throw DesignError("the equilibrium check names " + worst.where + ", which the design has no support for");
    for (auto& chk : checks) s->checks.push_back(std::move(chk));
  }

  bool distribution_ok = true;
  rec.distribution = choose_distribution(*checker, rec.code, max_main_As, b, plan.grid, rec.warnings,
                                         distribution_ok);

  for (const auto& r : rec.regions) {
    double& c = rec.face_cover_mm[static_cast<std::size_t>(r.face)];
    c = std::max(c, r.cover_mm);
  }

  if (req.detailing.requested) detail_design(*checker, req, member, loads, rec);

  settle_verdict(rec, distribution_ok);
  auto code_warnings = call_code(rec.code, "warnings", [&] { return checker->warnings(); });
  rec.warnings.insert(rec.warnings.begin(), code_warnings.begin(), code_warnings.end());
  return rec;
}
}  // namespace

}  // namespace armature
