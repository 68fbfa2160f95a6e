// The flat slab member (contract-v2 section 2): a grid of bays on columns
// at every grid intersection (walls along the edges marked so), analysed
// as a plate (plate.hpp) whose columns are rigid patches, under the
// code's combinations and bay load arrangements, and designed in column
// and middle strips whose moments are integrated from the plate over each
// strip's width. No clause inside: the strip widths and the band over
// internal columns arrive from the code (FlatStripRule).
//
// Plan coordinates of the request and the result start at the first
// column lines (grid lines x0 and y0 through the columns' centres); where
// an edge is on columns the slab reaches half a column past that line, so
// the model's own coordinates (starting at the slab's edge) are the
// request's moved by offset_x_mm(), offset_y_mm().
#pragma once

#include <array>
#include <cstddef>
#include <string>
#include <vector>

#include "armature/code.hpp"
#include "armature/combinations.hpp"
#include "armature/plate.hpp"
#include "armature/punching.hpp"
#include "armature/request.hpp"
#include "armature/two_way.hpp"

namespace armature {

// A column of the slab as the member sees it: its name ("column i,j", i
// along x and j along y from 1 at grid lines x0, y0), centre (request
// plan), the faces on the slab's free edge, and the ULS envelope of what
// it takes from the slab: the largest reaction and, for columns given a
// rotational stiffness, the largest moments (magnitudes; N, N·mm).
struct FlatColumn {
  std::string name;
  std::size_t i = 0, j = 0;  // grid line indices from 0
  double x_mm = 0.0, y_mm = 0.0;
  FreeFaces free{};
  double V_N = 0.0;
  double M_x_Nmm = 0.0, M_y_Nmm = 0.0;
};

// The plate of a flat-slab request (model coordinates from the slab's
// edge), for its problems to be found before a member is built.
PlateGeometry flat_plate_geometry(const Request& request, double elastic_modulus_MPa);

// Name of a column at grid lines x_i, y_j (from 0): "column i+1,j+1".
std::string flat_column_name(std::size_t i, std::size_t j);

class FlatPlate {
 public:
  // The plate of a valid flat-slab request with columns of the request's
  // size (rigid patches), turning against 4 E Ic / H of the columns above
  // and below (far ends fixed) where slab.columns.height_m is given, free
  // to turn otherwise. Strips per `rule`. Mesh lines pass through the
  // located loads.
  FlatPlate(const Request& request, double elastic_modulus_MPa, const FlatStripRule& rule);

  std::size_t bays_x() const { return model_.bays_x(); }
  std::size_t bays_y() const { return model_.bays_y(); }
  const PlateModel& model() const { return model_; }
  double offset_x_mm() const { return ox_; }
  double offset_y_mm() const { return oy_; }
  bool columns_restrained() const { return restrained_; }
  // Adjacent spans in each direction differ by no more than 25 % (of the
  // shorter).
  bool regular_spans() const;

  // Every ULS case (combination × arrangement), the ULS with every bay
  // loaded and the quasi-permanent cases, solved on one factorisation;
  // the strips' section moments and the columns' reactions enveloped.
  // Returns the number of ULS cases.
  std::size_t analyse(const std::vector<Action>& actions, const std::vector<Combination>& combinations,
                      const std::vector<BayArrangement>& arrangements, double uniform_load_ratio);

  // The design regions (after analyse): per strip and span, bottom at the
  // largest sagging moment across the strip's width; per strip and column
  // line, top at the larger hogging moment of the two column faces (the
  // wall line at a wall), an outer line at least `pinned_edge_fraction`
  // of the strip's end span where the slab is free to turn there; bands
  // over internal columns where the rule sets them. Moments per metre.
  std::vector<RegionDemand> design_regions(double pinned_edge_fraction, std::vector<std::string>& warnings);

  // The columns with their envelopes (after analyse).
  const std::vector<FlatColumn>& columns() const { return columns_; }
  // The bands over internal columns (the rule's), one piece each.
  const std::vector<FlatStripRecord>& bands() const { return bands_; }
  // After design_regions.
  PlateRecord record() const;
  BarDirection outer_direction(Face face) const { return outer_[static_cast<std::size_t>(face)]; }

  // A section's moment of the strip integration (exposed for tests): the
  // moment resultant across the section (model coordinates), sagging
  // positive, N·mm.
  struct Section {
    PlanAxis normal = PlanAxis::x;
    double at_mm = 0.0, from_mm = 0.0, to_mm = 0.0;
    int side = 1;
  };
  // One region's sources: the sections whose moments (× sign: +1
  // sagging, −1 hogging) it takes the largest of, over the strip's width;
  // a band also reads the whole panel width's hogging (panel × share).
  struct Target {
    RegionDemand demand;
    std::vector<Section> sections;
    int sign = 1;
    double width_mm = 0.0;
    std::vector<Section> panel;
    double panel_width_share = 0.0;
    std::size_t strip = 0;        // index into the strips
    std::size_t span = 0;         // along the strip (bottom), or the column line (top)
    bool top = false;
    double uls = 0.0, uls_all = 0.0, qp = 0.0, panel_uls = 0.0;  // N·mm over the width (or panel)
    std::vector<double> section_max, section_min;  // per section, the ULS envelope of its moment (N·mm)
  };

 private:
  PlateModel model_;
  FlatStripRule rule_;
  std::string requested_outer_;
  double ox_ = 0.0, oy_ = 0.0;
  double cx_ = 0.0, cy_ = 0.0;
  bool restrained_ = false;
  std::array<bool, 4> column_edges_{};
  std::vector<double> x_lines_, y_lines_;  // column lines, model coordinates
  std::vector<FlatColumn> columns_;
  std::vector<Target> targets_;
  std::vector<FlatStripRecord> strips_, bands_;
  std::size_t uls_cases_ = 0, arrangements_ = 0;
  double uniform_ratio_ = 0.0;
  PlateFieldRecord field_;
  std::array<BarDirection, 2> outer_{BarDirection::x, BarDirection::x};
};

}  // namespace armature
