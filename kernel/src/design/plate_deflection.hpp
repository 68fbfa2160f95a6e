// Calculated deflection of a two-way or flat slab (the code's
// MemberRules::plate_deflection_*): the plate solved again with each
// element's rigidity from its bars and its moment, in each of the code's
// states, until the deflection settles; then the code's checks per panel.
#pragma once

#include <string>
#include <vector>

#include "armature/code.hpp"
#include "armature/design.hpp"
#include "armature/plate.hpp"
#include "armature/two_way.hpp"

namespace armature {

// The bars an element of the plate takes in one direction: the index of
// the region of its bottom bars and of its top bars in `regions` (npos:
// none; hogging then takes the bottom bars, as a one-way span does).
struct ElementBars {
  std::size_t bottom = static_cast<std::size_t>(-1), top = static_cast<std::size_t>(-1);
  // The top bars are a pinned outer edge's: hogging there (twist near a
  // corner) keeps the bottom bars' sagging shrinkage curvature.
  bool top_at_pinned_edge = false;
};

// Everything the calculation reads from the design: the model and the
// request plan's offset into it, the loads, the regions with their chosen
// bars (`records`, parallel to `demands`), per element and direction
// (x, y) the regions whose bars it takes, and the panels (bays) of the
// plate record.
struct PlateDeflectionInput {
  const PlateModel* model = nullptr;
  double dx_mm = 0.0, dy_mm = 0.0;
  const std::vector<Action>* actions = nullptr;
  const std::vector<Combination>* combinations = nullptr;
  const std::vector<RegionDemand>* demands = nullptr;
  const std::vector<RegionRecord>* records = nullptr;
  std::vector<std::array<ElementBars, 2>> element_bars;
  const std::vector<PlateBayRecord>* bays = nullptr;
  double thickness_mm = 0.0;
  double strip_width_mm = 1000.0;
};

// Which regions' bars each element takes (PlateDeflectionInput::element_bars):
// a two-way slab's bay bottom bars and the top bars of the supported line
// nearer along the bars; a flat slab's strip (column or middle) over the
// element, its span's bottom bars and the top bars at the nearer column line.
std::vector<std::array<ElementBars, 2>> element_bars_of(const PlateModel& model, const PlateRecord& plate,
                                                        const std::vector<RegionDemand>& demands, double dx_mm,
                                                        double dy_mm);

// The checks of every panel (bay), and the long-term deflection at every node
// (PlateRecord::long_term_deflection_mm). Throws InputError naming
// serviceability.deflection when the code gives no states.
struct PlateDeflectionOutcome {
  std::vector<SpanRecord> spans;
  std::vector<double> long_term_mm;
  std::vector<std::string> warnings;
};
PlateDeflectionOutcome plate_deflection_checks(const MemberRules& rules, const CodeIdentity& code,
                                               const PlateDeflectionInput& in, Detail detail);

}  // namespace armature
