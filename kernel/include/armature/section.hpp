// A reinforced concrete section, as the kernel builds it for the code's
// section rules: a width and a thickness with layers of bars, each on a
// face, in a direction, at a spacing, with its nominal cover and effective
// depth. The kernel works out the geometry (the code gives the cover); the
// code reads it and checks it (SectionRules, code.hpp).
#pragma once

#include <stdexcept>
#include <string>

#include <boost/container/small_vector.hpp>

#include "armature/request.hpp"

namespace armature {

// One bar of the code's catalogue, as a request names it.
struct BarOption {
  std::string designation;  // as in the request: "12", "#4"
  double diameter_mm = 0.0;
  double area_mm2 = 0.0;    // the catalogue's area of one bar
};

// The direction a layer's bars run in: along a strip's span; along x or y
// of a plate (a two-way member's layers).
enum class BarDirection { span, x, y };
const char* to_string(BarDirection direction);

// One layer of bars: a face's outer layer lies at the cover, an inner one
// on top of the outer layer's bars.
struct SectionLayer {
  Face face = Face::bottom;
  BarDirection direction = BarDirection::span;
  BarOption bar;
  double spacing_mm = 0.0;  // centres
  double cover_mm = 0.0;    // nominal cover of the face (to its outer layer's bars)
  double d_mm = 0.0;        // effective depth: from the compressed face to this layer's axis

  // Area of the layer over a width (mm²).
  double area_mm2(double width_mm) const { return bar.area_mm2 * width_mm / spacing_mm; }
};

struct Section {
  double b_mm = 0.0;  // width (a strip's width)
  double h_mm = 0.0;  // thickness
  // In place for up to four layers (a plate's two directions on each
  // face): the bar search builds a section for every candidate.
  boost::container::small_vector<SectionLayer, 4> layers;

  // The layer of a face nearest it (the first given on that face, which is
  // the outer one the kernel builds first). Throws std::invalid_argument
  // when the section has no bars on that face.
  const SectionLayer& outer_layer(Face face) const {
    for (const auto& layer : layers)
      if (layer.face == face) return layer;
    throw std::invalid_argument(std::string("the section has no bars on its ") + to_string(face) + " face");
  }
};

// Effective depth of a face's outer layer: d = h − c − φ/2.
inline double outer_layer_effective_depth_mm(double h_mm, double cover_mm, double bar_mm) {
  return h_mm - cover_mm - bar_mm / 2.0;
}

// Effective depth of a layer laid on the outer one: d = h − c − φouter − φinner/2.
inline double inner_layer_effective_depth_mm(double h_mm, double cover_mm, double outer_bar_mm,
                                             double inner_bar_mm) {
  return h_mm - cover_mm - outer_bar_mm - inner_bar_mm / 2.0;
}

// A face's outer layer with its effective depth.
SectionLayer outer_layer(const Section& section, Face face, BarDirection direction, const BarOption& bar,
                         double spacing_mm, double cover_mm);
// A layer laid on `outer` (same face and cover), with its effective depth.
SectionLayer inner_layer(const Section& section, const SectionLayer& outer, BarDirection direction,
                         const BarOption& bar, double spacing_mm);

// The section of a one-way strip's region: one layer along the span on
// the face in tension.
Section one_layer_section(double b_mm, double h_mm, Face face, const BarOption& bar, double spacing_mm,
                          double cover_mm);

}  // namespace armature
