// The kernel's bar search for the driver (driver.cpp): the public parts
// (search_bars, search_common_bars, SpacingGrid) are in armature/design.hpp.
#pragma once

#include <algorithm>
#include <optional>
#include <string>
#include <vector>

#include "armature/design.hpp"

namespace armature {

// The largest bar and the widest spacing a region's search may choose
// (0: no limit): where the detailing found its bend too short (BarLimit).
struct SearchLimit {
  double max_bar_mm = 0.0;
  double max_spacing_mm = 0.0;
  bool excludes_bar(double diameter_mm) const { return max_bar_mm > 0.0 && diameter_mm > max_bar_mm + 1e-9; }
  bool excludes_spacing(double spacing_mm) const {
    return max_spacing_mm > 0.0 && spacing_mm > max_spacing_mm + 1e-9;
  }
  // The tighter of two limits.
  SearchLimit with(const SearchLimit& o) const {
    auto tighter = [](double a, double b) { return a > 0.0 && b > 0.0 ? std::min(a, b) : std::max(a, b); };
    return {tighter(max_bar_mm, o.max_bar_mm), tighter(max_spacing_mm, o.max_spacing_mm)};
  }
};

// How each region gets its bars: searched on its own, given by the
// request (checked, never searched), or one of the regions sharing one
// arrangement (reinforcement.rationalise).
struct BarPlan {
  std::vector<std::optional<SearchCandidate>> given;  // per region
  std::vector<std::vector<std::size_t>> common;       // groups of regions, each sharing one arrangement
  SpacingGrid grid;
  // Per region the largest bar and widest spacing the search may choose:
  // bars whose bends the detailing found too short at a support (BarLimit).
  std::vector<SearchLimit> limits;
};

// A region's bars limited in size: where its bend at a support was too
// short to anchor bars of the size first chosen (DetailingRecord::short_bends).
struct BarLimit {
  std::string where;
  Face face = Face::bottom;
  BarDirection direction = BarDirection::span;
  double max_diameter_mm = 0.0;
  double max_spacing_mm = 0.0;     // 0: none (a closer spacing, where no smaller size is left)
  double first_diameter_mm = 0.0;  // the size whose bend was short
  std::string support;             // where
};

// The same region by name, face and bars' direction (RegionDemand,
// RegionRecord, BarLimit, ShortBend alike).
template <class A, class B>
bool same_region(const A& a, const B& b) {
  return a.where == b.where && a.face == b.face && a.direction == b.direction;
}

// The plan's limits from the BarLimits (by region name, face and direction).
void apply_bar_limits(const std::vector<BarLimit>& limits, const std::vector<RegionDemand>& demands, BarPlan& plan);

// uniform_bottom: every bottom region not given shares one arrangement
// per bar direction (a strip's spans; a two-way slab's bays in x, and in
// y; its corner zones keep their own), each region at its own depth.
void add_uniform_bottom_groups(const std::vector<RegionDemand>& demands, BarPlan& plan);

// Distribution bars: the least area meeting the code's need, on the grid
// (`ok` false, with a warning, when none does).
DistributionRecord choose_distribution(const SlabChecker& checker, const CodeIdentity& code,
                                       double main_As_prov, double width_mm, const SpacingGrid& grid,
                                       std::vector<std::string>& warnings, bool& ok);

// Every region's bars (given, shared or searched) with one nominal cover
// per face; `demands` get the cover bar of their face.
std::vector<SearchCandidate> search_with_face_covers(const SlabChecker& checker, const CodeIdentity& code,
                                                     std::vector<RegionDemand>& demands, double width_mm,
                                                     const DurabilityInput& durability, const BarPlan& plan,
                                                     std::vector<std::string>& warnings);

// The result's record of one region: the demand, the chosen bars and the
// code's outcome for them (its checks moved out of `outcome`).
RegionRecord region_record(const RegionDemand& demand, const SearchCandidate& pick, RegionOutcome& outcome,
                           bool bars_given);

// pass (every check, and `pass` to start from), the largest utilisation
// and the governing check of a design record. The search takes the widest
// spacing allowed, so a passing spacing limit sits near 1 by construction
// and says nothing: it stays in the checks but heads the result only when
// it fails.
void settle_verdict(DesignRecord& rec, bool pass);

}  // namespace armature
