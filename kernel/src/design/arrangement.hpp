// One bar arrangement of a region as a section, and its checks: what the
// bar search, check mode and the design record ask of the code's section
// and member rules (arrangement.cpp).
#pragma once

#include "armature/code.hpp"
#include "armature/section.hpp"

namespace armature {

// The nominal cover of a region's bars: one cover per face, that of the
// largest bar the kernel has chosen on the face (RegionDemand::cover_bar_mm)
// where it is larger than this bar.
double region_cover_mm(const SectionRules& rules, const RegionDemand& region, const BarOption& bar);

// The effective depth of a region's bars: the face's outer layer, or a
// layer laid on the outer layer's bars (RegionDemand::outer_bar_mm > 0,
// a two-way slab's inner direction).
double region_effective_depth_mm(const RegionDemand& region, double h_mm, double cover_mm, double bar_mm);

// The section of a region for one arrangement: one layer, the region's
// own (along the span of a strip, in x or y of a plate), on the region's
// face at the face's cover, at its effective depth.
Section region_section(const SectionRules& rules, const RegionDemand& region, double width_mm,
                       double thickness_mm, const BarOption& bar, double spacing_mm);

// The section rules' checks of the section, then the member rules' (only
// for bars that fit, d > 0, and at Detail::verdict only while the verdict
// is open), put together.
RegionOutcome check_arrangement(const SectionRules& section_rules, const MemberRules& member_rules,
                                const Section& section, const RegionDemand& region, Detail detail);

// The verdict of check_arrangement at Detail::verdict, without putting
// the outcomes together (the bar search's path).
RegionVerdict arrangement_verdict(const SectionRules& section_rules, const MemberRules& member_rules,
                                  const Section& section, const RegionDemand& region);

}  // namespace armature
