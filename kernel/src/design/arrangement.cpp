// One bar arrangement of a region as a section, checked by the code's
// section rules and member rules together.
#include "arrangement.hpp"

#include <algorithm>
#include <iterator>
#include <utility>

namespace armature {

double region_cover_mm(const SectionRules& rules, const RegionDemand& region, const BarOption& bar) {
  return rules.nominal_cover_mm(region.face, std::max(bar.diameter_mm, region.cover_bar_mm));
}

double region_effective_depth_mm(const RegionDemand& region, double h_mm, double cover_mm, double bar_mm) {
  if (region.outer_bar_mm > 0.0) return inner_layer_effective_depth_mm(h_mm, cover_mm, region.outer_bar_mm, bar_mm);
  return outer_layer_effective_depth_mm(h_mm, cover_mm, bar_mm);
}

Section region_section(const SectionRules& rules, const RegionDemand& region, double width_mm,
                       double thickness_mm, const BarOption& bar, double spacing_mm) {
  Section section = one_layer_section(width_mm, thickness_mm, region.face, bar, spacing_mm,
                                      region_cover_mm(rules, region, bar));
  SectionLayer& layer = section.layers[0];
  layer.direction = region.direction;
  layer.d_mm = region_effective_depth_mm(region, thickness_mm, layer.cover_mm, bar.diameter_mm);
  return section;
}

RegionOutcome check_arrangement(const SectionRules& section_rules, const MemberRules& member_rules,
                                const Section& section, const RegionDemand& region, Detail detail) {
  SectionOutcome s = section_rules.check_section(section, region, detail);
  const SectionLayer& layer = section.outer_layer(region.face);
  RegionOutcome out;
  out.verdict = s.verdict;
  out.cover_mm = layer.cover_mm;
  out.d_mm = layer.d_mm;
  out.As_req_mm2 = s.As_req_mm2;
  out.As_min_mm2 = s.As_min_mm2;
  out.As_max_mm2 = s.As_max_mm2;
  // Bars that do not fit fail bending, and no member check reads them; the
  // search's verdict needs no more once it has failed.
  const bool member_checks = layer.d_mm > 0.0 && (detail != Detail::verdict || out.verdict.all_pass);
  if (!member_checks) {
    out.checks = std::move(s.checks);
    out.supports = std::move(s.supports);
    return out;
  }
  MemberSectionOutcome m = member_rules.check_with_section(section, region, s, detail);
  out.verdict.all_pass = out.verdict.all_pass && m.verdict.all_pass;
  out.verdict.strength_pass = out.verdict.strength_pass && m.verdict.strength_pass;
  out.checks = std::move(s.checks);
  out.checks.insert(out.checks.end(), std::make_move_iterator(m.checks.begin()),
                    std::make_move_iterator(m.checks.end()));
  out.span_checks = std::move(m.span_checks);
  out.supports = std::move(s.supports);
  return out;
}

RegionVerdict arrangement_verdict(const SectionRules& section_rules, const MemberRules& member_rules,
                                  const Section& section, const RegionDemand& region) {
  const SectionOutcome s = section_rules.check_section(section, region, Detail::verdict);
  if (!s.verdict.all_pass || !(section.outer_layer(region.face).d_mm > 0.0)) return s.verdict;
  const MemberSectionOutcome m = member_rules.check_with_section(section, region, s, Detail::verdict);
  return {s.verdict.all_pass && m.verdict.all_pass, s.verdict.strength_pass && m.verdict.strength_pass};
}

RegionOutcome SlabChecker::check_region(const RegionDemand& region, const BarOption& bar, double spacing_mm,
                                        Detail detail) const {
  const SectionRules& rules = section_rules();
  const SlabInput& slab = request().slab;
  const Section section = region_section(rules, region, slab.strip_width_mm, slab.thickness_mm, bar, spacing_mm);
  return check_arrangement(rules, member_rules(), section, region, detail);
}

std::optional<SpanDeflection> SlabChecker::deflection_diagram(const RegionDemand& region, const BarOption& bar,
                                                              double spacing_mm) const {
  const SectionRules& rules = section_rules();
  const SlabInput& slab = request().slab;
  const Section section = region_section(rules, region, slab.strip_width_mm, slab.thickness_mm, bar, spacing_mm);
  if (!(section.outer_layer(region.face).d_mm > 0.0)) return std::nullopt;
  return member_rules().deflection_diagram(section, region);
}

}  // namespace armature
