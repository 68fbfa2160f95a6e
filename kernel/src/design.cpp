// The design driver. Loads are totalled from the code's factors, the strip is
// analysed, each region gets the bar search of contract.md, and the code's
// checks of the chosen arrangements make the design record.
#include "armature/design.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <optional>
#include <string_view>
#include <numbers>

#include "armature/analysis.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

#ifndef ARMATURE_VERSION
#define ARMATURE_VERSION "0.0.0"
#endif

namespace armature {

const char* version_string() { return ARMATURE_VERSION; }

namespace {

// Calls into a code plug-in; any failure becomes a DesignError that names
// the code, the variant and the check or stage (with the place, if given).
template <class Fn>
auto call_code(const CodeIdentity& code, std::string_view stage, Fn&& fn,
               std::string_view place = {}) -> decltype(fn()) {
  // The message is built only on failure: this sits on the bar search's path.
  auto who = [&] { return code.id + " (" + code.variant + ")"; };
  auto during = [&] {
    std::string s(stage);
    if (!place.empty()) s.append(" of ").append(place);
    return s;
  };
  try {
    return fn();
  } catch (const InputError&) {
    throw;
  } catch (const CheckError& e) {
    throw DesignError(who() + ": check '" + e.check_id() + "' failed during " + during() + ": " + e.what());
  } catch (const std::exception& e) {
    throw DesignError(who() + ": failed during " + during() + ": " + e.what());
  } catch (...) {
    throw DesignError(who() + ": failed during " + during() + " with an unknown exception");
  }
}

// Geometry the kernel cannot analyse, and redistribution where there is
// no support to take it from.
void add_scope_problems(const Request& req, InputProblems& problems) {
  const StripModel model{req.slab.spans_mm, req.slab.ends[0], req.slab.ends[1]};
  if (const auto why = stability_problem(model); !why.empty())
    problems.add("slab.ends", why + " (the strip would be a mechanism)");
  if (req.design.redistribution_percent > 0.0) {
    const auto nodes = redistributable_nodes(model);
    if (std::none_of(nodes.begin(), nodes.end(), [](bool b) { return b; }))
      problems.add("design.redistribution_percent",
                   "this strip has no interior support whose moment can be redistributed "
                   "(cantilever roots are statically determinate); the largest allowed value is 0");
  }
}

LoadTotals total_loads(const LoadBasis& basis, const Request& req) {
  LoadTotals t;
  // density kN/m³ = 1e-6 N/mm³; times h in mm gives N/mm².
  t.self_weight = basis.density_kN_m3 * 1e-6 * req.slab.thickness_mm;
  t.Gk = t.self_weight + req.loads.dead_MPa;
  t.Qk = req.loads.imposed_MPa;
  t.uls = -1.0;
  for (const auto& e : basis.uls) {
    double full = e.gamma_G_loaded * t.Gk + e.gamma_Q * t.Qk;
    if (full > t.uls) {
      t.uls = full;
      t.combination = e.label;
    }
  }
  t.sls_quasi_permanent = t.Gk + basis.psi2 * t.Qk;
  t.density_kN_m3 = basis.density_kN_m3;
  t.long_term_load_name = basis.long_term_load_name;
  return t;
}

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

// The last k of the grid a region's search tries: up to the code's largest
// spacing, and at least the first spacing, which then fails the code's
// spacing check (a min_spacing_mm above the code's limit is no input
// error, like one below a code's minimum).
std::string format_mm(double mm) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g mm", mm);
  return buf;
}

int searched_steps(const SpacingGrid& grid, double max_spacing_mm) {
  return std::max(grid.last_step(max_spacing_mm), 0);
}

// How an arrangement fares with all its checks counted (the record's
// detail: the verdict alone stops at the first failure).
struct Failures {
  bool strength_pass = true;  // bending and minimum steel
  std::size_t count = 0;      // checks failed
};
Failures failures_of(const SlabChecker& checker, const CodeIdentity& code, const RegionDemand& region,
                     const BarOption& bar, double spacing_mm) {
  const RegionOutcome out = call_code(code, "the bar search", [&] {
    return checker.check_region(region, bar, spacing_mm, Detail::checks);
  });
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
Trial fewest_failures(const SlabChecker& checker, const CodeIdentity& code, const RegionDemand& region,
                      double width_mm, double s_max, const Trial& least, const SpacingGrid& grid) {
  Trial best = least;
  std::size_t best_failures = failures_of(checker, code, region, *least.bar, least.spacing_mm).count;
  const auto& bars = call_code(code, "bar options",
                               [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  const int steps = searched_steps(grid, s_max);
  for (const auto& bar : bars) {
    const double floor =
        call_code(code, "minimum area", [&] { return checker.minimum_area_mm2(region, bar); }) * (1 - 1e-12);
    for (int k = steps; k >= 0 && best_failures > 0; --k) {
      const double s = grid.at(k);
      const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
      if (c.As_prov_mm2 < floor || (c.bar == best.bar && s == best.spacing_mm)) continue;
      const Failures got = failures_of(checker, code, region, bar, s);
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

SearchCandidate search_bars(const SlabChecker& checker, const CodeIdentity& code,
                            const RegionDemand& region, double width_mm,
                            std::vector<std::string>& warnings, const SpacingGrid& grid) {
  const auto& bars = call_code(code, "bar options",
                               [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  const double s_max =
      call_code(code, "maximum spacing", [&] { return checker.max_spacing_mm(region); });
  // Every arrangement is a candidate, but one with more steel than an
  // arrangement already known to pass can never be chosen, so it is not
  // checked. Each bar is tried from its widest spacing (least steel) down.
  Trial passing, fallback, largest;
  const int steps = searched_steps(grid, s_max);
  for (const auto& bar : bars) {
    // Arrangements below the code's strength floor fail bending or minimum
    // steel: no verdict is needed (the margin keeps a rounding tie with the
    // check's own ratio on the checked side). Asked for only when this bar
    // has an arrangement left to check.
    std::optional<double> floor;
    for (int k = steps; k >= 0; --k) {
      const double s = grid.at(k);
      const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
      keep_largest(largest, c);
      if (passing.found() && c.As_prov_mm2 > passing.As_prov_mm2 * (1 + 1e-9)) break;
      if (!floor)
        floor = call_code(code, "minimum area", [&] { return checker.minimum_area_mm2(region, bar); }) *
                (1 - 1e-12);
      if (c.As_prov_mm2 < *floor) continue;
      const RegionVerdict v = call_code(code, "the bar search", [&] {
        return checker.check_region(region, bar, s, Detail::verdict).verdict;
      });
      if (v.strength_pass) consider(fallback, c);
      if (v.all_pass) {
        consider(passing, c);
        break;  // closer spacings of this bar carry more steel
      }
    }
  }
  if (passing.found()) return passing.candidate();
  if (fallback.found())
    return fewest_failures(checker, code, region, width_mm, s_max, fallback, grid).candidate();
  if (!largest.found())
    throw DesignError(code.id + " (" + code.variant + "): no bar arrangement to try at " +
                      region.where + " (maximum spacing " + std::to_string(s_max) + " mm)");
  warnings.push_back(region.where + ": no candidate bar arrangement satisfies bending and "
                     "minimum steel; the arrangement with the most steel is reported");
  SearchCandidate most = largest.candidate();
  most.strength_pass = false;
  return most;
}

SearchCandidate search_common_bars(const SlabChecker& checker, const CodeIdentity& code,
                                   const std::vector<const RegionDemand*>& regions, double width_mm,
                                   std::vector<std::string>& warnings, const SpacingGrid& grid) {
  if (regions.empty()) throw DesignError("no region for a common bar arrangement");
  const auto& bars = call_code(code, "bar options",
                               [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  // The widest spacing any region allows: a wider one than a region's own
  // limit fails that region's spacing check, like any other check.
  double s_max = 0.0;
  for (const RegionDemand* g : regions)
    s_max = std::max(s_max, call_code(code, "maximum spacing", [&] { return checker.max_spacing_mm(*g); }));
  const int steps = searched_steps(grid, s_max);
  // As search_bars, every region at once: each bar from its widest spacing
  // down, none heavier than an arrangement known to pass everywhere.
  Trial passing, largest;
  bool any_strong = false;  // some arrangement passes bending and minimum steel in every region
  for (const auto& bar : bars) {
    std::optional<double> floor;  // below it, some region fails a strength check
    for (int k = steps; k >= 0; --k) {
      const double s = grid.at(k);
      const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
      keep_largest(largest, c);
      if (passing.found() && c.As_prov_mm2 > passing.As_prov_mm2 * (1 + 1e-9)) break;
      if (!floor) {
        floor = 0.0;
        for (const RegionDemand* g : regions)
          floor = std::max(*floor, call_code(code, "minimum area",
                                             [&] { return checker.minimum_area_mm2(*g, bar); }) *
                                       (1 - 1e-12));
      }
      if (c.As_prov_mm2 < *floor) continue;
      bool all = true, strong = true;
      for (const RegionDemand* g : regions) {
        const RegionVerdict v = call_code(code, "the bar search", [&] {
          return checker.check_region(*g, bar, s, Detail::verdict).verdict;
        });
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
      for (int k = steps; k >= 0; --k) {
        const double s = grid.at(k);
        const Trial c{&bar, s, provided_area_mm2(bar.area_mm2, s, width_mm)};
        std::size_t failed = 0;
        bool strong = true;
        for (const RegionDemand* g : regions) {
          const Failures f = failures_of(checker, code, *g, bar, s);
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

namespace {

// Distribution bars: the least area that meets the need, at a spacing of
// the search's grid within the code's limit; for each bar that is its
// widest spacing providing the area, so one candidate per bar is compared.
DistributionRecord choose_distribution(const SlabChecker& checker, const CodeIdentity& code,
                                       double main_As_prov, double width_mm, const SpacingGrid& grid,
                                       std::vector<std::string>& warnings, bool& ok) {
  DistributionNeed need =
      call_code(code, "distribution steel", [&] { return checker.distribution(main_As_prov); });
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

// How each region gets its bars: searched on its own, given by the
// request (checked, never searched), or one of the regions sharing one
// arrangement (reinforcement.rationalise).
struct BarPlan {
  std::vector<std::optional<SearchCandidate>> given;  // per region
  std::vector<std::size_t> common;                    // regions sharing one arrangement
  SpacingGrid grid;
};

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
                                                     bool cover_given, const BarPlan& plan,
                                                     std::vector<std::string>& warnings) {
  const std::size_t n = demands.size();
  std::vector<SearchCandidate> picks(n);
  std::vector<std::vector<std::string>> region_warnings(n);
  std::vector<std::string> common_warnings;
  std::vector<bool> in_common(n, false);
  for (const std::size_t i : plan.common) in_common[i] = true;
  auto is_given = [&](std::size_t i) { return plan.given[i].has_value(); };
  auto search_common = [&] {
    std::vector<const RegionDemand*> regions;
    for (const std::size_t i : plan.common) regions.push_back(&demands[i]);
    common_warnings.clear();
    const SearchCandidate pick = search_common_bars(checker, code, regions, width_mm, common_warnings, plan.grid);
    for (const std::size_t i : plan.common) picks[i] = pick;
  };
  for (std::size_t i = 0; i < n; ++i) {
    if (is_given(i)) picks[i] = *plan.given[i];
    else if (!in_common[i]) picks[i] = search_bars(checker, code, demands[i], width_mm, region_warnings[i], plan.grid);
  }
  if (!plan.common.empty()) search_common();
  const std::size_t rounds =
      cover_given ? 0
                  : call_code(code, "bar options", [&]() -> const std::vector<BarOption>& {
                      return checker.bar_options();
                    }).size() + 1;
  auto sets_cover = [&](std::size_t i) { return is_given(i) || picks[i].strength_pass; };
  for (std::size_t round = 0; round < rounds; ++round) {
    bool searched_again = false, common_again = false;
    for (const Face face : {Face::bottom, Face::top}) {
      double largest = 0.0;
      for (std::size_t i = 0; i < n; ++i)
        if (demands[i].face == face && sets_cover(i)) largest = std::max(largest, picks[i].bar.diameter_mm);
      for (std::size_t i = 0; i < n; ++i) {
        RegionDemand& g = demands[i];
        if (g.face != face || g.cover_bar_mm >= largest) continue;
        g.cover_bar_mm = largest;
        if (is_given(i)) continue;  // checked with the face's cover, never searched
        if (picks[i].bar.diameter_mm >= largest && picks[i].strength_pass) continue;  // it set the cover
        if (in_common[i]) {
          common_again = true;
          continue;
        }
        region_warnings[i].clear();
        picks[i] = search_bars(checker, code, g, width_mm, region_warnings[i], plan.grid);
        searched_again = true;
      }
    }
    if (common_again) search_common();
    if (!searched_again && !common_again) break;
  }
  for (std::size_t i = 0; i < n; ++i) {
    warnings.insert(warnings.end(), region_warnings[i].begin(), region_warnings[i].end());
    if (!plan.common.empty() && i == plan.common.front())
      warnings.insert(warnings.end(), common_warnings.begin(), common_warnings.end());
    const bool shares_face = std::any_of(demands.begin(), demands.end(), [&](const RegionDemand& o) {
      return &o != &demands[i] && o.face == demands[i].face;
    });
    if (!cover_given && shares_face && !sets_cover(i) && picks[i].bar.diameter_mm > demands[i].cover_bar_mm)
      warnings.push_back(demands[i].where + ": its bars' cover is not applied to the rest of the " +
                         to_string(demands[i].face) + " face, since no arrangement there passes "
                         "bending and minimum steel");
  }
  return picks;
}

// For a request that passed validation; `id` is the code's identity,
// `checker` the code's checker for this request.
DesignRecord design_validated(const SlabChecker& checker, CodeIdentity id, const Request& req, Detail detail);

std::string span_name(std::size_t e) { return "span " + std::to_string(e + 1); }
std::string support_name(std::size_t j) { return "support " + std::to_string(j + 1); }

// A design region by name and face, as regions_of makes them.
struct RegionName {
  std::string where;
  Face face;
  bool certain;  // false: a pinned end whose top region depends on the code's rule, not yet known
};

// The regions of a strip, in order along it (as regions_of): a top region
// at each support but a pinned end, which has one when the code asks for
// partial-fixity steel (`pinned_end_steel`; unknown: listed as uncertain),
// and a bottom region in each span that is not a cantilever.
std::vector<RegionName> region_names(const StripModel& m, std::optional<bool> pinned_end_steel) {
  std::vector<RegionName> out;
  const std::size_t n = m.span_count();
  for (std::size_t j = 0; j <= n; ++j) {
    if (m.has_support(j)) {
      const bool pinned_end = (j == 0 || j == n) && !m.is_restrained(j);
      if (!pinned_end) out.push_back({support_name(j), Face::top, true});
      else if (pinned_end_steel.value_or(true)) out.push_back({support_name(j), Face::top, pinned_end_steel.has_value()});
    }
    if (j < n && !m.is_cantilever(j)) out.push_back({span_name(j), Face::bottom, true});
  }
  return out;
}

// Each region of reinforcement.given must be one of the strip's, at its
// face. `pinned_end_steel`: whether pinned ends carry top bars (the code's
// rule; unknown until the request is valid, when such names pass here).
void add_given_region_problems(const Request& req, std::optional<bool> pinned_end_steel, InputProblems& problems) {
  const auto& given = req.reinforcement.given;
  if (given.empty() || req.slab.spans_mm.empty()) return;
  for (const auto& p : problems.items())
    if (p.field.rfind("slab", 0) == 0) return;  // the strip itself is in doubt
  const StripModel model{req.slab.spans_mm, req.slab.ends[0], req.slab.ends[1]};
  const auto names = region_names(model, pinned_end_steel);
  std::string listed;
  for (const auto& r : names)
    if (r.certain) listed += (listed.empty() ? "" : ", ") + r.where + " (" + to_string(r.face) + ")";
  for (std::size_t i = 0; i < given.size(); ++i) {
    const std::string path = "reinforcement.given[" + std::to_string(i) + "]";
    if (given[i].where.empty()) continue;  // refused as it was read
    const auto it = std::find_if(names.begin(), names.end(), [&](const RegionName& r) { return r.where == given[i].where; });
    if (it == names.end()) {
      const auto with_ends = region_names(model, true);
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
        call_code(id, "end fixity", [&] { return checker->pinned_end_fixity_fraction(); });
    InputProblems problems;
    add_given_region_problems(req, fixity > 0.0, problems);
    problems.raise_if_any();
  }
  return checker;
}

}  // namespace

double provided_area_mm2(double bar_area_mm2, double spacing_mm, double width_mm) {
  return bar_area_mm2 * width_mm / spacing_mm;
}

bool preferred(const SearchCandidate& a, const SearchCandidate& b) {
  return preferred_values(a.As_prov_mm2, a.spacing_mm, a.bar.diameter_mm, b.As_prov_mm2, b.spacing_mm,
                          b.bar.diameter_mm);
}

std::vector<const Check*> DesignRecord::all_checks() const {
  std::size_t count = 0;
  for (const auto& r : regions) count += r.checks.size();
  for (const auto& s : supports) count += s.checks.size();
  for (const auto& s : spans) count += s.checks.size();
  std::vector<const Check*> out;
  out.reserve(count);
  for (const auto& r : regions)
    for (const auto& c : r.checks) out.push_back(&c);
  for (const auto& s : supports)
    for (const auto& c : s.checks) out.push_back(&c);
  for (const auto& s : spans)
    for (const auto& c : s.checks) out.push_back(&c);
  return out;
}

DesignRecord design(const Registry& registry, const nlohmann::json& j, Detail detail) {
  InputProblems problems;
  Request req = request_from_json(j, problems);
  std::shared_ptr<const DesignCode> code;
  if (!problems.has_field("code")) {
    try {
      code = registry.open(req.code, req.variant.value_or(""));
    } catch (const InputError& e) {
      for (const auto& p : e.problems()) problems.add(p.field, p.message);
    }
  }
  CodeIdentity id;
  if (code) {
    id = call_code(CodeIdentity{req.code, req.variant.value_or(""), ""}, "identity",
                   [&] { return code->identity(); });
    call_code(id, "input validation", [&] { code->validate(req, problems); });
  }
  if (problems.empty()) add_scope_problems(req, problems);
  // With other problems the code's checker cannot be opened: the regions
  // given are checked against the strip alone, now, so that they are
  // reported with the rest (pinned ends wait for a valid request).
  if (!problems.empty()) add_given_region_problems(req, std::nullopt, problems);
  problems.raise_if_any();
  const auto checker = begin_checked(*code, id, req);
  return design_validated(*checker, std::move(id), req, detail);
}

DesignRecord design(const Registry& registry, const Request& req, Detail detail) {
  auto code = registry.open(req.code, req.variant.value_or(""));
  InputProblems problems;
  CodeIdentity id = call_code(CodeIdentity{req.code, req.variant.value_or(""), ""}, "identity",
                              [&] { return code->identity(); });
  call_code(id, "input validation", [&] { code->validate(req, problems); });
  add_scope_problems(req, problems);
  if (!problems.empty()) add_given_region_problems(req, std::nullopt, problems);
  problems.raise_if_any();
  const auto checker = begin_checked(*code, id, req);
  return design_validated(*checker, std::move(id), req, detail);
}

namespace {

SpanKind span_kind_of(const StripModel& m, std::size_t e) {
  if (m.is_cantilever(e)) return SpanKind::cantilever;
  const bool left = m.is_restrained(e), right = m.is_restrained(e + 1);
  if (left && right) return SpanKind::interior_span;
  if (left || right) return SpanKind::end_span;
  return SpanKind::simply_supported;
}

// Load cases: every arrangement of every ULS expression, as line loads.
std::vector<std::vector<double>> load_cases(const LoadBasis& basis, const LoadTotals& t,
                                            const std::vector<std::vector<bool>>& arrangements,
                                            double width_mm) {
  std::vector<std::vector<double>> cases;
  for (const auto& e : basis.uls) {
    const double loaded = (e.gamma_G_loaded * t.Gk + e.gamma_Q * t.Qk) * width_mm;
    const double unloaded = e.gamma_G_unloaded * t.Gk * width_mm;
    for (const auto& a : arrangements) {
      std::vector<double> w(a.size());
      for (std::size_t i = 0; i < a.size(); ++i) w[i] = a[i] ? loaded : unloaded;
      // The same loads twice (a single span's "alternate" and "all spans"
      // arrangements) add nothing to the envelope.
      if (std::find(cases.begin(), cases.end(), w) == cases.end()) cases.push_back(std::move(w));
    }
  }
  return cases;
}

// x where positive, else +0 (never −0, whose reciprocal is −inf).
double positive_part(double x) { return x > 0.0 ? x : 0.0; }

// The regions of contract.md in order along the strip: a top region at each
// support that carries hogging (and at pinned ends when the code asks for
// partial-fixity steel), a bottom region in each span that is not a cantilever.
std::vector<RegionDemand> regions_of(const StripModel& m, const Envelope& env,
                                     double fixity_fraction, double delta,
                                     const std::vector<bool>& redistributed, double qp_to_uls,
                                     std::vector<std::string>& warnings) {
  std::vector<RegionDemand> out;
  const std::size_t n = m.span_count();
  for (std::size_t j = 0; j <= n; ++j) {
    if (m.has_support(j)) {
      const bool end = j == 0 || j == n;
      const bool pinned_end = end && !m.is_restrained(j);
      RegionDemand g;
      g.where = support_name(j);
      g.face = Face::top;
      g.x_mm = m.node_position_mm(j);
      g.quasi_permanent_to_uls = qp_to_uls;
      if (pinned_end) {
        if (fixity_fraction > 0.0) {
          const std::size_t e = j == 0 ? 0 : n - 1;
          g.M_Ed = fixity_fraction * positive_part(env.span_max_sagging[e]);
          out.push_back(std::move(g));
        }
      } else {
        g.M_Ed = env.node_max_hogging[j];
        g.supports = {{support_name(j), env.node_max_shear[j]}};
        g.redistribution_delta = redistributed[j] ? delta : 1.0;
        for (std::size_t e : {j - 1, j}) {
          if (e < n && m.is_cantilever(e)) {  // j − 1 wraps past n at j = 0
            g.span_where = span_name(e);
            g.span_mm = m.spans_mm[e];
            g.span_kind = SpanKind::cantilever;
          }
        }
        out.push_back(std::move(g));
      }
    }
    if (j < n && !m.is_cantilever(j)) {
      RegionDemand g;
      g.where = span_name(j);
      g.face = Face::bottom;
      if (env.span_max_sagging[j] <= 0.0)
        warnings.push_back(span_name(j) + ": no sagging moment under any arrangement; top bars "
                                          "must run through the span");
      g.M_Ed = positive_part(env.span_max_sagging[j]);
      g.x_mm = m.node_position_mm(j) + env.span_x_max_sagging[j];
      g.span_where = span_name(j);
      g.span_mm = m.spans_mm[j];
      g.span_kind = span_kind_of(m, j);
      g.quasi_permanent_to_uls = qp_to_uls;
      // Pinned end supports rely on the bottom bars of their span.
      for (std::size_t k : {j, j + 1})
        if ((k == 0 || k == n) && m.has_support(k) && !m.is_restrained(k))
          g.supports.push_back({support_name(k), env.node_max_shear[k]});
      out.push_back(std::move(g));
    }
  }
  return out;
}

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
  if (r.rationalise == Rationalise::uniform_bottom)
    for (std::size_t i = 0; i < demands.size(); ++i)
      if (demands[i].face == Face::bottom && !plan.given[i]) plan.common.push_back(i);
  return plan;
}

DesignRecord design_validated(const SlabChecker& code_checker, CodeIdentity id, const Request& req, Detail detail) {
  if (detail == Detail::verdict) detail = Detail::checks;
  DesignRecord rec;
  rec.code = std::move(id);
  rec.report_units = req.report_units;
  rec.strip_width_mm = req.slab.strip_width_mm;
  const SlabChecker* const checker = &code_checker;
  LoadBasis basis = call_code(rec.code, "load basis", [&] { return checker->load_basis(); });
  if (basis.uls.empty()) throw DesignError(rec.code.id + ": the code gave no ULS expression");
  rec.loads = total_loads(basis, req);
  if (detail == Detail::steps)  // only the calculation record lists them
    rec.defaults_used = call_code(rec.code, "defaults", [&] { return checker->defaults_used(); });

  const double b = req.slab.strip_width_mm;
  const StripModel model{req.slab.spans_mm, req.slab.ends[0], req.slab.ends[1]};
  const std::size_t n = model.span_count();
  const auto arrangements =
      call_code(rec.code, "load arrangements", [&] { return checker->load_arrangements(n); });
  for (const auto& a : arrangements)
    if (a.size() != n) throw DesignError(rec.code.id + ": a load arrangement does not match the spans");
  if (arrangements.empty()) throw DesignError(rec.code.id + ": the code gave no load arrangement");

  const double delta = 1.0 - req.design.redistribution_percent / 100.0;
  const auto redistributed = redistributable_nodes(model);
  std::vector<CaseResult> cases = analyse_cases(model, load_cases(basis, rec.loads, arrangements, b));
  if (delta < 1.0)
    for (auto& c : cases) c = redistribute(model, c, redistributed, delta);
  const Envelope env = envelope_of(model, cases);
  if (detail == Detail::steps) rec.diagrams = envelope_diagrams(model, cases);  // for the record
  rec.spans_mm = req.slab.spans_mm;
  rec.uls_expressions = std::move(basis.uls);  // basis is not used below
  rec.load_arrangements = arrangements.size();
  rec.ends = req.slab.ends;
  rec.redistribution_percent = req.design.redistribution_percent;
  rec.project = req.project;
  rec.thickness_mm = req.slab.thickness_mm;
  const double fixity = call_code(rec.code, "end fixity", [&] { return checker->pinned_end_fixity_fraction(); });
  auto demands = regions_of(model, env, fixity, delta, redistributed,
                            rec.loads.sls_quasi_permanent / rec.loads.uls, rec.warnings);
  rec.rationalise = req.reinforcement.rationalise;
  const BarPlan plan = plan_bars(*checker, rec.code, req.reinforcement, demands, b);
  const std::vector<SearchCandidate> picks = search_with_face_covers(
      *checker, rec.code, demands, b, req.durability.cover_mm.has_value(), plan, rec.warnings);

  std::vector<std::string> span_names, support_names;
  for (std::size_t e = 0; e < n; ++e) span_names.push_back(span_name(e));
  for (std::size_t j = 0; j <= n; ++j) support_names.push_back(support_name(j));
  std::vector<std::vector<Check>> span_checks(n);
  std::vector<SupportRecord> supports(n + 1);
  rec.regions.reserve(demands.size());
  rec.spans.reserve(n);
  rec.supports.reserve(n + 1);
  double max_main_As = 0.0;
  for (std::size_t i = 0; i < demands.size(); ++i) {
    const RegionDemand& demand = demands[i];
    const SearchCandidate& pick = picks[i];
    RegionOutcome out = call_code(
        rec.code, "the checks",
        [&] { return checker->check_region(demand, pick.bar, pick.spacing_mm, detail); }, demand.where);
    RegionRecord region;
    region.where = demand.where;
    region.face = demand.face;
    region.x_mm = demand.x_mm;
    region.M_Ed = demand.M_Ed;
    region.d_mm = out.d_mm;
    region.As_req_mm2 = out.As_req_mm2;
    region.As_min_mm2 = out.As_min_mm2;
    region.As_max_mm2 = out.As_max_mm2;
    region.cover_mm = out.cover_mm;
    region.bars = {pick.bar.designation, pick.bar.diameter_mm, pick.spacing_mm, pick.As_prov_mm2};
    region.bars_given = plan.given[i].has_value();
    region.checks = std::move(out.checks);
    rec.regions.push_back(std::move(region));
    max_main_As = std::max(max_main_As, pick.As_prov_mm2);
    for (std::size_t e = 0; e < n; ++e)
      if (demand.span_where == span_names[e])
        for (auto& c : out.span_checks) span_checks[e].push_back(std::move(c));
    for (auto& s : out.supports)
      for (std::size_t j = 0; j <= n; ++j)
        if (s.where == support_names[j]) supports[j] = {s.where, s.V_Ed, s.V_Rd, std::move(s.checks)};
  }
  for (std::size_t j = 0; j <= n; ++j)
    if (model.has_support(j) && !supports[j].where.empty()) rec.supports.push_back(std::move(supports[j]));
  for (std::size_t e = 0; e < n; ++e) {
    SpanRecord span{span_names[e], std::move(span_checks[e])};
    auto extra = call_code(rec.code, "span checks", [&] { return checker->span_checks(span.where); });
    for (auto& c : extra) span.checks.push_back(std::move(c));
    rec.spans.push_back(std::move(span));
  }

  bool distribution_ok = true;
  rec.distribution = choose_distribution(*checker, rec.code, max_main_As, b, plan.grid, rec.warnings,
                                         distribution_ok);

  for (const auto& r : rec.regions) {
    double& c = rec.face_cover_mm[static_cast<std::size_t>(r.face)];
    c = std::max(c, r.cover_mm);
  }

  rec.pass = distribution_ok;
  rec.max_utilisation = 0.0;
  bool first = true;
  for (const Check* c : rec.all_checks()) {
    if (!c->pass) rec.pass = false;
    // The search takes the widest spacing allowed, so a passing spacing
    // limit sits near 1 by construction and says nothing: it stays in the
    // checks but heads the result only when it fails.
    if (is_arrangement_limit(c->id.str()) && c->pass) continue;
    if (first || c->utilisation > rec.max_utilisation) {
      rec.max_utilisation = c->utilisation;
      rec.governing_check = c->id;
      rec.governing_where = c->where;
      first = false;
    }
  }
  auto code_warnings = call_code(rec.code, "warnings", [&] { return checker->warnings(); });
  rec.warnings.insert(rec.warnings.begin(), code_warnings.begin(), code_warnings.end());
  return rec;
}
}  // namespace

}  // namespace armature
