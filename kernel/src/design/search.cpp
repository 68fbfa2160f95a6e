// The bar search of contract.md and its variants (contract-v2 3): one
// region's least-area arrangement on the spacing grid, one arrangement
// shared by several regions (rationalisation), the distribution bars, and
// every region of a strip with one nominal cover per face and the
// request's given bars.
#include "search.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <optional>

#include "armature/two_way.hpp"
#include "arrangement.hpp"
#include "call_code.hpp"

namespace armature {

namespace {

// What the search asks of the code's session, fetched once per design:
// the section rules, the member rules and the sections' thickness.
struct SearchRules {
  const SectionRules& section;
  const MemberRules& member;
  double thickness_mm;
};

SearchRules rules_of(const SlabChecker& checker, const CodeIdentity& code) {
  return {call_code(code, "section rules", [&]() -> const SectionRules& { return checker.section_rules(); }),
          call_code(code, "member rules", [&]() -> const MemberRules& { return checker.member_rules(); }),
          call_code(code, "the request", [&]() -> const Request& { return checker.request(); }).slab.thickness_mm};
}

// A region's section, made once per search and given each candidate's
// bar (with the face's cover for it) and spacing in turn.
class CandidateSection {
 public:
  CandidateSection(const SearchRules& rules, const CodeIdentity& code, const RegionDemand& region,
                   double width_mm)
      : rules_(rules), code_(code), region_(region) {
    section_.b_mm = width_mm;
    section_.h_mm = rules.thickness_mm;
    section_.layers.resize(1);
    section_.layers[0].face = region.face;
    section_.layers[0].direction = region.direction;
  }
  // The bar of the candidates that follow, at its cover.
  void set_bar(const BarOption& bar) {
    SectionLayer& layer = section_.layers[0];
    layer.cover_mm =
        call_code(code_, "nominal cover", [&] { return region_cover_mm(rules_.section, region_, bar); });
    layer.bar = bar;
    layer.d_mm = region_effective_depth_mm(region_, section_.h_mm, layer.cover_mm, bar.diameter_mm);
  }
  void set_spacing(double spacing_mm) { section_.layers[0].spacing_mm = spacing_mm; }

  RegionVerdict verdict() const {
    return call_code(code_, "the bar search",
                     [&] { return arrangement_verdict(rules_.section, rules_.member, section_, region_); });
  }
  RegionOutcome checks() const {
    return call_code(code_, "the bar search", [&] {
      return check_arrangement(rules_.section, rules_.member, section_, region_, Detail::checks);
    });
  }

 private:
  const SearchRules& rules_;
  const CodeIdentity& code_;
  const RegionDemand& region_;
  Section section_;
};

// The tie rule of contract.md on plain values: least area, then the larger
// spacing, then the smaller bar.
bool preferred_values(double area_a, double s_a, double phi_a, double area_b, double s_b, double phi_b) {
  const double tol = 1e-9 * std::max(area_a, area_b);
  if (area_a < area_b - tol) return true;
  if (area_a > area_b + tol) return false;
  if (s_a != s_b) return s_a > s_b;
  return phi_a < phi_b;
}

// One arrangement the search has seen, pointing at its bar in the
// checker's list (which outlives the search); no bar: none yet.
struct Trial {
  const BarOption* bar = nullptr;
  double spacing_mm = 0.0;
  double As_prov_mm2 = 0.0;

  bool found() const { return bar != nullptr; }
  SearchCandidate candidate() const { return {*bar, spacing_mm, As_prov_mm2}; }
};

void consider(Trial& best, const Trial& c) {
  if (!best.found() || preferred_values(c.As_prov_mm2, c.spacing_mm, c.bar->diameter_mm, best.As_prov_mm2,
                                        best.spacing_mm, best.bar->diameter_mm))
    best = c;
}

void keep_largest(Trial& largest, const Trial& c) {
  if (!largest.found() || c.As_prov_mm2 > largest.As_prov_mm2) largest = c;
}

std::string format_mm(double mm) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g mm", mm);
  return buf;
}

// The last k of the grid a region's search tries: up to the code's largest
// spacing, and at least the first spacing, which then fails the code's
// spacing check (a min_spacing_mm above the code's limit is no input
// error, like one below a code's minimum).
int searched_steps(const SpacingGrid& grid, double max_spacing_mm) {
  return std::max(grid.last_step(max_spacing_mm), 0);
}

// How an arrangement fares with all its checks counted (the record's
// detail: the verdict alone stops at the first failure).
struct Failures {
  bool strength_pass = true;  // bending and minimum steel
  std::size_t count = 0;      // checks failed
};
Failures failures_of(const CandidateSection& candidate) {
  const RegionOutcome out = candidate.checks();
  Failures f{out.verdict.strength_pass, 0};
  auto count = [&](const std::vector<Check>& checks) {
    for (const auto& c : checks) f.count += c.pass ? 0 : 1;
  };
  count(out.checks);
  count(out.span_checks);
  for (const auto& s : out.supports) count(s.checks);
  return f;
}

// When no arrangement passes: among those that pass bending and minimum
// steel (at least `least`, the least-area one), the one failing the fewest
// checks, then by the tie rule. Checks that fail whatever the bars (a
// thickness limit, say) fail for every arrangement alike, so this keeps an
// arrangement that passes every check the bars can satisfy where there is
// one, and the failures shown are the real causes.
Trial fewest_failures(const SlabChecker& checker, const SearchRules& rules, const CodeIdentity& code,
                      const RegionDemand& region, double width_mm, double s_max, const Trial& least,
                      const SpacingGrid& grid, const SearchLimit& limit) {
  CandidateSection candidate(rules, code, region, width_mm);
  Trial best = least;
  candidate.set_bar(*least.bar);
  candidate.set_spacing(least.spacing_mm);
  std::size_t best_failures = failures_of(candidate).count;
  const auto& bars = call_code(code, "bar options",
                               [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  const int steps = searched_steps(grid, s_max);
  for (const auto& bar : bars) {
    if (limit.excludes_bar(bar.diameter_mm)) continue;
    const double floor =
        call_code(code, "minimum area", [&] { return rules.section.minimum_area_mm2(region, bar); }) * (1 - 1e-12);
    bool bar_set = false;
    for (int k = steps; k >= 0 && best_failures > 0; --k) {
      const double s = grid.at(k);
      const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
      if (limit.excludes_spacing(s) || c.As_prov_mm2 < floor || (c.bar == best.bar && s == best.spacing_mm))
        continue;
      if (!bar_set) {
        candidate.set_bar(bar);
        bar_set = true;
      }
      candidate.set_spacing(s);
      const Failures got = failures_of(candidate);
      if (!got.strength_pass) continue;
      const std::size_t f = got.count;
      if (f < best_failures || (f == best_failures && preferred_values(c.As_prov_mm2, s, bar.diameter_mm,
                                                                       best.As_prov_mm2, best.spacing_mm,
                                                                       best.bar->diameter_mm))) {
        best = c;
        best_failures = f;
      }
    }
  }
  return best;
}

}  // namespace

int SpacingGrid::last_step(double max_spacing_mm) const {
  if (!(max_spacing_mm >= first_mm)) return -1;
  return static_cast<int>(std::floor((max_spacing_mm - first_mm) / step_mm + 1e-9));
}

namespace {

// search_bars with the rules already fetched (once per design).
SearchCandidate search_region(const SlabChecker& checker, const SearchRules& rules, const CodeIdentity& code,
                              const RegionDemand& region, double width_mm, std::vector<std::string>& warnings,
                              const SpacingGrid& grid, const SearchLimit& limit = {}) {
  const auto& bars = call_code(code, "bar options",
                               [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  const double s_max =
      call_code(code, "maximum spacing", [&] { return rules.section.max_spacing_mm(region); });
  CandidateSection candidate(rules, code, region, width_mm);
  // Every arrangement is a candidate, but one with more steel than an
  // arrangement already known to pass can never be chosen, so it is not
  // checked. Each bar is tried from its widest spacing (least steel) down.
  Trial passing, fallback, largest;
  const int steps = searched_steps(grid, s_max);
  for (const auto& bar : bars) {
    if (limit.excludes_bar(bar.diameter_mm)) continue;
    // Arrangements below the code's strength floor fail bending or minimum
    // steel: no verdict is needed (the margin keeps a rounding tie with the
    // check's own ratio on the checked side). Asked for only when this bar
    // has an arrangement left to check.
    std::optional<double> floor;
    bool bar_set = false;
    for (int k = steps; k >= 0; --k) {
      const double s = grid.at(k);
      if (limit.excludes_spacing(s)) continue;
      const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
      keep_largest(largest, c);
      if (passing.found() && c.As_prov_mm2 > passing.As_prov_mm2 * (1 + 1e-9)) break;
      if (!floor)
        floor = call_code(code, "minimum area", [&] { return rules.section.minimum_area_mm2(region, bar); }) *
                (1 - 1e-12);
      if (c.As_prov_mm2 < *floor) continue;
      if (!bar_set) {
        candidate.set_bar(bar);
        bar_set = true;
      }
      candidate.set_spacing(s);
      const RegionVerdict v = candidate.verdict();
      if (v.strength_pass) consider(fallback, c);
      if (v.all_pass) {
        consider(passing, c);
        break;  // closer spacings of this bar carry more steel
      }
    }
  }
  if (passing.found()) return passing.candidate();
  if (fallback.found())
    return fewest_failures(checker, rules, code, region, width_mm, s_max, fallback, grid, limit).candidate();
  if (!largest.found())
    throw DesignError(code.id + " (" + code.variant + "): no bar arrangement to try at " +
                      region.where + " (maximum spacing " + std::to_string(s_max) + " mm)");
  warnings.push_back(region.where + ": no candidate bar arrangement satisfies bending and "
                     "minimum steel; the arrangement with the most steel is reported");
  SearchCandidate most = largest.candidate();
  most.strength_pass = false;
  return most;
}

// search_common_bars with the rules already fetched.
SearchCandidate search_shared(const SlabChecker& checker, const SearchRules& rules, const CodeIdentity& code,
                              const std::vector<const RegionDemand*>& regions, double width_mm,
                              std::vector<std::string>& warnings, const SpacingGrid& grid,
                              const SearchLimit& limit = {}) {
  if (regions.empty()) throw DesignError("no region for a common bar arrangement");
  const auto& bars = call_code(code, "bar options",
                               [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  // The widest spacing any region allows: a wider one than a region's own
  // limit fails that region's spacing check, like any other check.
  double s_max = 0.0;
  for (const RegionDemand* g : regions)
    s_max = std::max(s_max, call_code(code, "maximum spacing", [&] { return rules.section.max_spacing_mm(*g); }));
  const int steps = searched_steps(grid, s_max);
  // One section per region: the same bars, each at its own face's cover.
  std::vector<CandidateSection> candidates;
  candidates.reserve(regions.size());
  for (const RegionDemand* g : regions) candidates.emplace_back(rules, code, *g, width_mm);
  auto set_arrangement = [&](const BarOption& bar, double s) {
    for (auto& candidate : candidates) {
      candidate.set_bar(bar);
      candidate.set_spacing(s);
    }
  };
  // As search_bars, every region at once: each bar from its widest spacing
  // down, none heavier than an arrangement known to pass everywhere.
  Trial passing, largest;
  bool any_strong = false;  // some arrangement passes bending and minimum steel in every region
  for (const auto& bar : bars) {
    if (limit.excludes_bar(bar.diameter_mm)) continue;
    std::optional<double> floor;  // below it, some region fails a strength check
    bool bar_set = false;
    for (int k = steps; k >= 0; --k) {
      const double s = grid.at(k);
      if (limit.excludes_spacing(s)) continue;
      const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
      keep_largest(largest, c);
      if (passing.found() && c.As_prov_mm2 > passing.As_prov_mm2 * (1 + 1e-9)) break;
      if (!floor) {
        floor = 0.0;
        for (const RegionDemand* g : regions)
          floor = std::max(*floor, call_code(code, "minimum area",
                                             [&] { return rules.section.minimum_area_mm2(*g, bar); }) *
                                       (1 - 1e-12));
      }
      if (c.As_prov_mm2 < *floor) continue;
      if (!bar_set) {
        for (auto& candidate : candidates) candidate.set_bar(bar);
        bar_set = true;
      }
      bool all = true, strong = true;
      for (auto& candidate : candidates) {
        candidate.set_spacing(s);
        const RegionVerdict v = candidate.verdict();
        all = all && v.all_pass;
        strong = strong && v.strength_pass;
        if (!strong) break;
      }
      any_strong = any_strong || strong;
      if (all) {
        consider(passing, c);
        break;  // closer spacings of this bar carry more steel
      }
    }
  }
  if (passing.found()) return passing.candidate();
  std::string names;
  for (const RegionDemand* g : regions) names += (names.empty() ? "" : ", ") + g->where;
  if (any_strong) {
    // The fewest failed checks over all regions, then the tie rule.
    Trial best;
    std::size_t best_failures = 0;
    for (const auto& bar : bars)
      for (int k = steps; k >= 0 && !limit.excludes_bar(bar.diameter_mm); --k) {
        const double s = grid.at(k);
        if (limit.excludes_spacing(s)) continue;
        const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
        std::size_t failed = 0;
        bool strong = true;
        set_arrangement(bar, s);
        for (const auto& candidate : candidates) {
          const Failures f = failures_of(candidate);
          strong = strong && f.strength_pass;
          failed += f.count;
          if (!strong) break;
        }
        if (!strong) continue;
        if (!best.found() || failed < best_failures ||
            (failed == best_failures && preferred_values(c.As_prov_mm2, s, bar.diameter_mm, best.As_prov_mm2,
                                                         best.spacing_mm, best.bar->diameter_mm))) {
          best = c;
          best_failures = failed;
        }
      }
    return best.candidate();
  }
  if (!largest.found())
    throw DesignError(code.id + " (" + code.variant + "): no bar arrangement to try at " + names +
                      " (maximum spacing " + std::to_string(s_max) + " mm)");
  warnings.push_back(names + ": no common bar arrangement satisfies bending and minimum steel in every "
                     "one of these regions; the arrangement with the most steel is reported");
  SearchCandidate most = largest.candidate();
  most.strength_pass = false;
  return most;
}

}  // namespace

SearchCandidate search_bars(const SlabChecker& checker, const CodeIdentity& code, const RegionDemand& region,
                            double width_mm, std::vector<std::string>& warnings, const SpacingGrid& grid) {
  return search_region(checker, rules_of(checker, code), code, region, width_mm, warnings, grid);
}

SearchCandidate search_common_bars(const SlabChecker& checker, const CodeIdentity& code,
                                   const std::vector<const RegionDemand*>& regions, double width_mm,
                                   std::vector<std::string>& warnings, const SpacingGrid& grid) {
  return search_shared(checker, rules_of(checker, code), code, regions, width_mm, warnings, grid);
}

// Distribution bars: the least area that meets the need, at a spacing of
// the search's grid within the code's limit; for each bar that is its
// widest spacing providing the area, so one candidate per bar is compared.
DistributionRecord choose_distribution(const SlabChecker& checker, const CodeIdentity& code,
                                       double main_As_prov, double width_mm, const SpacingGrid& grid,
                                       std::vector<std::string>& warnings, bool& ok) {
  DistributionNeed need = call_code(code, "distribution steel",
                                    [&] { return checker.section_rules().distribution(main_As_prov); });
  const auto& bars = call_code(code, "bar options",
                               [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  // The distribution bars have no spacing check of their own: when even
  // the grid's first spacing is above the code's limit, the first is
  // reported and the design fails with a warning.
  const bool grid_fits = grid.last_step(need.max_spacing_mm) >= 0;
  const int steps = searched_steps(grid, need.max_spacing_mm);
  Trial best, largest;
  for (const auto& bar : bars) {
    // The closest spacing of the grid gives this bar's most steel.
    keep_largest(largest, {&bar, grid.first_mm, provided_area_mm2(bar.area_mm2, grid.first_mm, width_mm)});
    // Widest spacing on the grid whose area still meets the need.
    for (int k = steps; k >= 0; --k) {
      const double s = grid.at(k);
      const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
      if (c.As_prov_mm2 >= need.As_req_mm2) {
        consider(best, c);
        break;
      }
    }
  }
  ok = best.found() && grid_fits;
  if (!grid_fits)
    warnings.push_back("distribution steel: the least spacing of the search grid (reinforcement.min_spacing_mm, " +
                       format_mm(grid.first_mm) + ") is above the code's largest distribution spacing (" +
                       format_mm(need.max_spacing_mm) + "); the design fails until it is reduced");
  if (!largest.found())
    throw DesignError(code.id + " (" + code.variant + "): no distribution bar arrangement to try "
                      "(maximum spacing " + std::to_string(need.max_spacing_mm) + " mm)");
  const SearchCandidate pick = best.found() ? best.candidate() : largest.candidate();
  if (!best.found())
    warnings.push_back("distribution steel: no candidate bar provides the required area; "
                       "the design fails until larger bars are allowed");
  DistributionRecord d;
  d.As_req_mm2 = need.As_req_mm2;
  d.bars = {pick.bar.designation, pick.bar.diameter_mm, pick.spacing_mm, pick.As_prov_mm2};
  return d;
}

// The bar search of every region with one nominal cover per face. Where
// the code works cover out from the bar size (no cover given), it is told
// the largest bar chosen on the face (RegionDemand::cover_bar_mm), and each
// region of the face whose cover bar that raises is searched again (its
// smaller bars now have the larger cover too), until bars and covers
// agree. The largest bar of a face never shrinks (its own region keeps its
// cover), so this ends within as many rounds as there are bar sizes. A
// region where no arrangement passes bending and minimum steel does not
// set its face's cover: its heaviest bars would push every other region of
// the face to a larger cover; it keeps its own, and a warning says so.
// Given bars are in the slab whatever their checks say: they always take
// part in setting their face's cover. The regions sharing one arrangement
// are searched again together when any of them is.
std::vector<SearchCandidate> search_with_face_covers(const SlabChecker& checker, const CodeIdentity& code,
                                                     std::vector<RegionDemand>& demands, double width_mm,
                                                     const DurabilityInput& durability, const BarPlan& plan,
                                                     std::vector<std::string>& warnings) {
  const SearchRules rules = rules_of(checker, code);
  const std::size_t n = demands.size();
  std::vector<SearchCandidate> picks(n);
  std::vector<std::vector<std::string>> region_warnings(n);
  const std::size_t groups = plan.common.size();
  std::vector<std::vector<std::string>> common_warnings(groups);
  constexpr std::size_t none = static_cast<std::size_t>(-1);
  std::vector<std::size_t> group_of(n, none);
  for (std::size_t k = 0; k < groups; ++k)
    for (const std::size_t i : plan.common[k]) group_of[i] = k;
  auto is_given = [&](std::size_t i) { return plan.given[i].has_value(); };
  auto limit_of = [&](std::size_t i) { return i < plan.limits.size() ? plan.limits[i] : SearchLimit{}; };
  auto search_common = [&](std::size_t k) {
    std::vector<const RegionDemand*> regions;
    SearchLimit limit;  // the tightest of the group's limits
    for (const std::size_t i : plan.common[k]) {
      regions.push_back(&demands[i]);
      limit = limit.with(limit_of(i));
    }
    common_warnings[k].clear();
    const SearchCandidate pick =
        search_shared(checker, rules, code, regions, width_mm, common_warnings[k], plan.grid, limit);
    for (const std::size_t i : plan.common[k]) picks[i] = pick;
  };
  for (std::size_t i = 0; i < n; ++i) {
    if (is_given(i)) picks[i] = *plan.given[i];
    else if (group_of[i] == none)
      picks[i] = search_region(checker, rules, code, demands[i], width_mm, region_warnings[i], plan.grid, limit_of(i));
  }
  for (std::size_t k = 0; k < groups; ++k)
    if (!plan.common[k].empty()) search_common(k);
  const std::size_t rounds =
      durability.cover_given(Face::bottom) && durability.cover_given(Face::top)
          ? 0
          : call_code(code, "bar options", [&]() -> const std::vector<BarOption>& {
              return checker.bar_options();
            }).size() + 1;
  auto sets_cover = [&](std::size_t i) { return is_given(i) || picks[i].strength_pass; };
  for (std::size_t round = 0; round < rounds; ++round) {
    bool searched_again = false;
    std::vector<bool> common_again(groups, false);
    for (const Face face : {Face::bottom, Face::top}) {
      if (durability.cover_given(face)) continue;  // a given cover does not follow the bars
      double largest = 0.0;
      for (std::size_t i = 0; i < n; ++i)
        if (demands[i].face == face && sets_cover(i)) largest = std::max(largest, picks[i].bar.diameter_mm);
      for (std::size_t i = 0; i < n; ++i) {
        RegionDemand& g = demands[i];
        if (g.face != face || g.cover_bar_mm >= largest) continue;
        g.cover_bar_mm = largest;
        if (is_given(i)) continue;  // checked with the face's cover, never searched
        if (picks[i].bar.diameter_mm >= largest && picks[i].strength_pass) continue;  // it set the cover
        if (group_of[i] != none) {
          common_again[group_of[i]] = true;
          continue;
        }
        region_warnings[i].clear();
        picks[i] = search_region(checker, rules, code, g, width_mm, region_warnings[i], plan.grid, limit_of(i));
        searched_again = true;
      }
    }
    bool any_common_again = false;
    for (std::size_t k = 0; k < groups; ++k)
      if (common_again[k]) {
        search_common(k);
        any_common_again = true;
      }
    if (!searched_again && !any_common_again) break;
  }
  for (std::size_t i = 0; i < n; ++i) {
    warnings.insert(warnings.end(), region_warnings[i].begin(), region_warnings[i].end());
    for (std::size_t k = 0; k < groups; ++k)
      if (!plan.common[k].empty() && i == plan.common[k].front())
        warnings.insert(warnings.end(), common_warnings[k].begin(), common_warnings[k].end());
    const bool shares_face = std::any_of(demands.begin(), demands.end(), [&](const RegionDemand& o) {
      return &o != &demands[i] && o.face == demands[i].face;
    });
    if (!durability.cover_given(demands[i].face) && shares_face && !sets_cover(i) && picks[i].bar.diameter_mm > demands[i].cover_bar_mm)
      warnings.push_back(demands[i].where + ": its bars' cover is not applied to the rest of the " +
                         to_string(demands[i].face) + " face, since no arrangement there passes "
                         "bending and minimum steel");
  }
  return picks;
}

RegionRecord region_record(const RegionDemand& demand, const SearchCandidate& pick, RegionOutcome& outcome,
                           bool bars_given) {
  RegionRecord region;
  region.where = demand.where;
  region.face = demand.face;
  region.direction = demand.direction;
  region.x_mm = demand.x_mm;
  region.y_mm = demand.y_mm;
  region.M_Ed = demand.M_Ed;
  region.d_mm = outcome.d_mm;
  region.As_req_mm2 = outcome.As_req_mm2;
  region.As_min_mm2 = outcome.As_min_mm2;
  region.As_max_mm2 = outcome.As_max_mm2;
  region.cover_mm = outcome.cover_mm;
  region.bars = {pick.bar.designation, pick.bar.diameter_mm, pick.spacing_mm, pick.As_prov_mm2};
  region.bars_given = bars_given;
  region.checks = std::move(outcome.checks);
  return region;
}

void settle_verdict(DesignRecord& rec, bool pass) {
  rec.pass = pass;
  rec.max_utilisation = 0.0;
  bool first = true;
  for (const Check* c : rec.all_checks()) {
    if (!c->pass) rec.pass = false;
    if (is_arrangement_limit(c->id.str()) && c->pass) continue;
    if (first || c->utilisation > rec.max_utilisation) {
      rec.max_utilisation = c->utilisation;
      rec.governing_check = c->id;
      rec.governing_where = c->where;
      first = false;
    }
  }
}

void add_uniform_bottom_groups(const std::vector<RegionDemand>& demands, BarPlan& plan) {
  for (const BarDirection dir : {BarDirection::span, BarDirection::x, BarDirection::y}) {
    std::vector<std::size_t> group;
    for (std::size_t i = 0; i < demands.size(); ++i)
      if (demands[i].face == Face::bottom && demands[i].direction == dir && !plan.given[i] &&
          !is_plate_corner_name(demands[i].where))
        group.push_back(i);
    if (!group.empty()) plan.common.push_back(std::move(group));
  }
}

double provided_area_mm2(double bar_area_mm2, double spacing_mm, double width_mm) {
  return bar_area_mm2 * width_mm / spacing_mm;
}

bool preferred(const SearchCandidate& a, const SearchCandidate& b) {
  return preferred_values(a.As_prov_mm2, a.spacing_mm, a.bar.diameter_mm, b.As_prov_mm2, b.spacing_mm,
                          b.bar.diameter_mm);
}

void apply_bar_limits(const std::vector<BarLimit>& limits, const std::vector<RegionDemand>& demands, BarPlan& plan) {
  plan.limits.assign(demands.size(), SearchLimit{});
  for (const BarLimit& l : limits)
    for (std::size_t i = 0; i < demands.size(); ++i)
      if (same_region(demands[i], l))
        plan.limits[i] = {l.max_diameter_mm, l.max_spacing_mm};
}

}  // namespace armature
