// The section value (section.hpp): layers and their effective depths.
#include "armature/section.hpp"

namespace armature {

const char* to_string(BarDirection direction) {
  switch (direction) {
    case BarDirection::span: return "span";
    case BarDirection::x: return "x";
    case BarDirection::y: return "y";
  }
  return "";
}

SectionLayer outer_layer(const Section& section, Face face, BarDirection direction, const BarOption& bar,
                         double spacing_mm, double cover_mm) {
  return {face, direction, bar, spacing_mm, cover_mm,
          outer_layer_effective_depth_mm(section.h_mm, cover_mm, bar.diameter_mm)};
}

SectionLayer inner_layer(const Section& section, const SectionLayer& outer, BarDirection direction,
                         const BarOption& bar, double spacing_mm) {
  return {outer.face, direction, bar, spacing_mm, outer.cover_mm,
          inner_layer_effective_depth_mm(section.h_mm, outer.cover_mm, outer.bar.diameter_mm, bar.diameter_mm)};
}

Section one_layer_section(double b_mm, double h_mm, Face face, const BarOption& bar, double spacing_mm,
                          double cover_mm) {
  Section section{b_mm, h_mm, {}};
  section.layers.push_back(outer_layer(section, face, BarDirection::span, bar, spacing_mm, cover_mm));
  return section;
}

}  // namespace armature
