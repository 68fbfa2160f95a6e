// Drawings of a two-way slab for the calculation record: the plan of the
// grid of bays (edges by condition, bays named, bars per bay) and a colour
// map of one scalar field over it (mx, my, mxy or a design moment).
//
// Private to the record. The inputs are plain values in the units the
// record prints (the caller converts: metres or feet along, kNm/m or
// kip-ft/ft for moments), so that the drawings hold no unit logic: every
// length is in `length_unit`, every value of a map in the map's unit.
//
// Plan coordinates: x to the right, y up the page (the SVG's own y runs
// down; the drawing flips it), x = 0 and y = 0 at the plate's corner.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "armature/plate.hpp"

namespace armature {

// One bay: its name as the record writes it ("bay 1,1"), its extent, and
// the bottom bars of each direction as printed ("ø12 @ 200 mm"), empty
// when not known (the map drawings leave them out).
struct PlanBay {
  std::string name;
  double x0 = 0.0, x1 = 0.0, y0 = 0.0, y1 = 0.0;
  std::string bars_x{};
  std::string bars_y{};
};

// A marked point with its label (a top region's design position and bars).
// along_y: the label runs up the page beside the point (a point on a line
// along y), else along x just above it.
struct PlanMark {
  double x = 0.0, y = 0.0;
  std::string label;
  bool along_y = false;
};

struct PlatePlan {
  std::vector<double> x_lines;  // grid lines along x, ascending, the first 0
  std::vector<double> y_lines;
  PlateEdges edges{};  // the analysis's own: x0 at x = 0, x1 at the largest x, y0, y1
  std::vector<PlanBay> bays{};
  std::vector<PlanMark> marks{};
  std::string length_unit = "m";
  // A flat slab: the interior lines are column lines (not supports) and
  // the columns are drawn filled (x0, x1, y0, y1 each).
  bool interior_lines_supported = true;
  std::vector<std::array<double, 4>> columns{};
  // The column strips (x0, x1, y0, y1, shaded), the punching perimeters
  // (closed or open polylines in plan) and the governing column's index
  // in `columns` (none: no column governs), drawn by plate_plan_svg only.
  std::vector<std::array<double, 4>> column_strips{};
  std::vector<std::vector<std::array<double, 2>>> perimeters{};
  std::optional<std::size_t> governing_column{};
  std::string governing_label{};
};

// A scalar field sampled at the nodes of a rectangular mesh: x and y the
// mesh lines (ascending, inside the plate), values row-major by y:
// values[i + x.size() · j] at (x[i], y[j]).
struct ScalarMap {
  std::vector<double> x;
  std::vector<double> y;
  std::vector<double> values;
};

// The plan to scale: bays named, with their bars when given; outer edges
// drawn by condition (fixed hatched on the outside, pinned a support line
// with small triangles, free a thin line), interior grid lines as line
// supports (dash-dot), a legend of the styles used, the spans dimensioned,
// the marks, and the caution. Throws std::invalid_argument when the grid
// has fewer than two lines in a direction or is not ascending.
std::string plate_plan_svg(const PlatePlan& plan);

// A colour map of `map` over the plan: one cell per sample (nx · ny cells),
// each cell reaching halfway to the neighbouring samples (clipped to the
// plate), coloured by its sample's value. Signed values (some below zero,
// some above) take a diverging scale, white at zero, blue to the minimum
// and red to the maximum (each side scaled to its own extreme); values of
// one sign take a sequential scale from white at the smallest magnitude.
// A colour bar prints the minimum and maximum; the maximum (and, for a
// signed field, the minimum) is marked and labelled with its value and
// position; grid, edges and bay names are drawn on top; the caution at the
// foot. Throws std::invalid_argument when the sizes do not agree or a
// value is not finite.
std::string plate_map_svg(const PlatePlan& plan, const ScalarMap& map, const std::string& title,
                          const std::string& unit);

}  // namespace armature
