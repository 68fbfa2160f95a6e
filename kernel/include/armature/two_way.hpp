// The two-way slab member (contract-v2 section 2): a grid of bays on line
// supports, analysed as a plate (plate.hpp) under the code's combinations
// and bay load arrangements, designed by Wood–Armer moments in regions per
// bay (bottom, x and y) and per supported line segment (top). No clause
// inside: what a code decides arrives as numbers.
#pragma once

#include <array>
#include <cstddef>
#include <string>
#include <vector>

#include "armature/code.hpp"
#include "armature/combinations.hpp"
#include "armature/plate.hpp"
#include "armature/request.hpp"

namespace armature {

// A supported line segment of the result (and its reactions).
struct PlateLineRecord {
  std::string name;                   // "edge x0 segment 1", "grid y2 segment 3"
  PlanAxis runs_along = PlanAxis::y;
  double position_mm = 0.0;           // x of a line running along y; y of one along x
  double from_mm = 0.0, to_mm = 0.0;  // along the line
  double max_N_per_mm = 0.0;          // largest ULS line reaction along the segment (upward)
  double max_total_N = 0.0;           // largest ULS resultant of the segment's line reactions
};

// Node-line samples of the ULS envelope, node index ix + (x count)·iy,
// moments N·mm/mm (sagging positive; design moments ≥ 0).
struct PlateFieldRecord {
  std::vector<double> x_mm, y_mm;
  std::vector<double> mx_max, mx_min, my_max, my_min, mxy_max, mxy_min;
  std::vector<double> bottom_x, bottom_y, top_x, top_y;  // Wood–Armer envelope
};

// A corner zone of the slab with its own bars against torsion (CornerRule):
// named "corner x0 y0" (the two edges meeting), the zone's extent, the
// bay it lies in and the code's clause.
struct PlateCornerRecord {
  std::string name;
  std::string bay;
  double x0_mm = 0.0, x1_mm = 0.0, y0_mm = 0.0, y1_mm = 0.0;
  std::string clause;
};

// Reinforcement along a free edge of one bay (FreeEdgeRule): U-bars of the
// bay's bars across the edge with legs `leg_mm` on each face, and the bay's
// bars along the edge inside the U.
struct PlateFreeEdgeRecord {
  std::string edge;  // "edge x1"
  std::string bay;
  double from_mm = 0.0, to_mm = 0.0;  // along the edge
  std::string u_bar;                  // designation
  double u_bar_diameter_mm = 0.0, u_bar_spacing_mm = 0.0, u_bar_area_mm2 = 0.0;  // area per metre
  std::string edge_bar;               // the bars along the edge, one in each face inside the U
  double edge_bar_diameter_mm = 0.0;
  double leg_mm = 0.0;
  std::string clause;
};

// A design strip of a flat slab: its bars run in `direction` (a strip
// along x has bars in x); one plan rectangle per span (x0, x1, y0, y1,
// the request's plan), the widths varying with the spans.
struct FlatStripRecord {
  std::string name;  // "column strip y1", "middle strip y0-y1"
  BarDirection direction = BarDirection::x;
  bool column = true;
  std::vector<std::array<double, 4>> pieces;
  // The ULS envelope of the strip's moment per metre at its sections
  // (the column faces and the mesh lines between them), in order along
  // the strip: position along it (request plan, mm), largest and least
  // moment (N·mm per metre, sagging positive).
  std::vector<std::array<double, 3>> envelope{};
};

// How far a flat slab's top bars over a column line reach past the faces
// (the code's FlatStripRule extents): a share of the region's bars, its
// reach into the span before the line and after it (0 where none).
struct FlatTopExtent {
  std::string where;
  BarDirection direction = BarDirection::x;
  double share = 1.0;
  double before_mm = 0.0, after_mm = 0.0;
};

// A column of a flat slab, for the record's plan (request plan).
struct FlatColumnOutline {
  std::string name;
  double x_mm = 0.0, y_mm = 0.0, cx_mm = 0.0, cy_mm = 0.0;
};

struct PlateBayRecord {
  std::string name;  // "bay i,j"
  double x0_mm = 0.0, x1_mm = 0.0, y0_mm = 0.0, y1_mm = 0.0;
};

// What the result, the summary and the record show of the plate.
struct PlateRecord {
  std::vector<double> x_lines_mm, y_lines_mm;
  std::array<EndSupport, 4> edges{};  // x0, x1, y0, y1
  std::vector<PlateBayRecord> bays;
  PlateFieldRecord field;
  std::vector<PlateLineRecord> reactions;
  std::vector<PlateCornerRecord> corners;
  std::vector<PlateFreeEdgeRecord> free_edges;
  double poisson_ratio = 0.2;
  int mesh_per_bay = 0;
  std::array<std::string, 2> outer_layer{};  // per face (bottom, top): "x" or "y"
  std::size_t arrangements = 0;              // bay load arrangements of the code
  // Flat slabs: the slab's outline (x0, x1, y0, y1; the grid's for a
  // two-way slab), the edges on columns, strips and columns. Plan
  // positions (field, bays, strips) are the request's, from grid lines x0, y0.
  bool flat = false;
  std::array<double, 4> outline_mm{};
  std::array<bool, 4> column_edges{};
  bool columns_restrained = false;
  std::vector<FlatStripRecord> strips;
  // The bands over internal columns, each one piece: its width across the
  // column line (a band along x spans x0 = x1 = the column line).
  std::vector<FlatStripRecord> bands;
  std::vector<FlatColumnOutline> columns;
  std::string strip_clause, band_clause;
  std::vector<FlatTopExtent> top_extents;
  // The bands for the moment each restrained column takes (their regions
  // "column i,j transfer"): the code's width and share, the column's
  // moment and the band's design moment per metre.
  struct Transfer {
    std::string where;
    BarDirection direction = BarDirection::x;
    double width_mm = 0.0, share = 1.0;
    double M_column_Nmm = 0.0;    // the column's moment in this direction (ULS envelope)
    double M_per_m_Nmm = 0.0;     // share × M / width, per metre
    double M_strip_per_m_Nmm = 0.0;  // the column strip's there, per metre
    std::string clause;
  };
  std::vector<Transfer> transfers;
  std::string extents_clause, integrity;
  // Calculated deflection: the long-term deflection (mm, downward) at the
  // field's nodes (field.x_mm, field.y_mm), as the code's states weigh it;
  // empty when not calculated.
  std::vector<double> long_term_deflection_mm;
};

// The plate's load case of one combination and arrangement: permanent
// actions everywhere at their `loaded` factor, variable actions on the
// loaded bays at `loaded` × variable_fraction (a patch or line across
// several bays split at the model's grid lines). Plan positions of the
// request are moved by (dx_mm, dy_mm) into the model's (a flat slab's
// model starts at its edge, the request's plan at the first column line).
PlateLoadCase plate_load_case(const PlateModel& model, const std::vector<Action>& actions,
                              const Combination& combination, const BayArrangement& arrangement, double dx_mm = 0.0,
                              double dy_mm = 0.0);

// The load cases a plate member solves on one factorisation: every ULS
// combination × arrangement; the ULS combinations with every bay loaded
// where no arrangement loads them all (the quasi-permanent to ULS ratios
// need them); the quasi-permanent combinations with every bay loaded.
// Cases [0, uls) are the ULS envelope's, [uls, uls + extra_uls) the extra
// all-bays ULS ones, the rest quasi-permanent.
struct PlateCaseSet {
  std::vector<PlateLoadCase> cases;
  std::vector<bool> all_bays_uls;  // per ULS case: every bay at its full load
  std::size_t uls = 0, extra_uls = 0;
  bool is_uls(std::size_t c) const { return c < uls; }
  bool is_uls_all_bays(std::size_t c) const { return c < uls ? all_bays_uls[c] : c < uls + extra_uls; }
  bool is_quasi_permanent(std::size_t c) const { return c >= uls + extra_uls; }
};
PlateCaseSet plate_case_set(const PlateModel& model, const std::vector<Action>& actions,
                            const std::vector<Combination>& combinations,
                            const std::vector<BayArrangement>& arrangements, double dx_mm = 0.0, double dy_mm = 0.0);

// The ULS envelope of the node moments (PlateFieldRecord): start_field
// sizes it for the model's nodes (positions moved by −dx, −dy into the
// request's plan), add_to_field takes one case's node moments in.
void start_field(PlateFieldRecord& field, const PlateModel& model, double dx_mm = 0.0, double dy_mm = 0.0);
void add_to_field(PlateFieldRecord& field, const std::vector<PlateMoments>& node_moments);

// The outer layer of each face (indexed by Face): `requested` ("x" or
// "y", reinforcement.outer_layer), else the direction of the face's
// larger design moment among the regions (x on a tie).
std::array<BarDirection, 2> outer_layers(const std::vector<RegionDemand>& regions, const std::string& requested);

// Name of an outer edge or interior grid line: "edge x0", "edge x1",
// "grid x2" (the line at x = Σ x_spans[0..2)), "edge y0", "grid y1", ...
std::string plate_line_name(const SupportLine& line, std::size_t bays_x, std::size_t bays_y);
// "bay i,j" (from 1).
std::string plate_bay_name(std::size_t i, std::size_t j);
// Whether a region's name is a corner zone's ("corner x0 y0", ...).
bool is_plate_corner_name(const std::string& where);
// Whether (x, y) lies strictly inside one of the corner zones of a plate
// whose grid starts at (x_front, y_front): a point on a zone's inner
// boundary stays with the bay's and the line's bars (the corner bars end
// there).
bool strictly_in_corner_zone(const std::vector<PlateCornerRecord>& corners, double x_front, double y_front, double x,
                             double y);

class TwoWayPlate {
 public:
  // The plate of a valid request; `elastic_modulus_MPa` only scales
  // deflections, which no check reads (moments and reactions do not
  // depend on it). Mesh lines pass through the located loads.
  TwoWayPlate(const Request& request, double elastic_modulus_MPa);

  std::size_t bays_x() const { return model_.bays_x(); }
  std::size_t bays_y() const { return model_.bays_y(); }
  const PlateModel& model() const { return model_; }

  // The plate's load case of one combination and arrangement (exposed
  // for tests): plate_load_case.
  PlateLoadCase load_case(const std::vector<Action>& actions, const Combination& combination,
                          const BayArrangement& arrangement) const {
    return plate_load_case(model_, actions, combination, arrangement);
  }

  // Every ULS case (combination × arrangement) and the quasi-permanent
  // cases with every bay loaded, solved on one factorisation and
  // enveloped; returns the number of ULS cases.
  std::size_t analyse(const std::vector<Action>& actions, const std::vector<Combination>& combinations,
                      const std::vector<BayArrangement>& arrangements, double uniform_load_ratio);

  // The design regions: per bay, bottom x and y at the largest Wood–Armer
  // sagging design moment; per supported line segment, top across the
  // line at the largest hogging design moment (a pinned edge at least
  // `pinned_edge_fraction` of the adjacent bay's bottom moment). The outer
  // layer of each face runs in the direction of its larger moment unless
  // reinforcement.outer_layer says; regions of the inner layer carry
  // outer_bar_mm (the driver sets it from the bars chosen). At each outer
  // corner where two pinned edges meet, the code's corner regions
  // (CornerRule; none when its clause is empty): "corner x0 y0" top x and
  // y, and bottom x and y where the rule asks.
  std::vector<RegionDemand> design_regions(double pinned_edge_fraction, const CornerRule& corner_rule,
                                           std::vector<std::string>& warnings);

  // After design_regions.
  PlateRecord record() const;
  // The outer layer's direction of a face, after design_regions.
  BarDirection outer_direction(Face face) const { return outer_[static_cast<std::size_t>(face)]; }

 private:
  PlateModel model_;
  std::string requested_outer_;
  std::size_t uls_cases_ = 0, arrangements_ = 0;
  double uniform_ratio_ = 0.0;
  // Envelopes per node (ULS), and per node the largest design moments
  // with every bay loaded: ULS and quasi-permanent.
  PlateFieldRecord field_;
  std::vector<WoodArmerMoments> all_bays_uls_, all_bays_qp_;
  std::vector<PlateLineRecord> lines_;
  std::vector<PlateCornerRecord> corners_;
  std::array<BarDirection, 2> outer_{BarDirection::x, BarDirection::x};
};

}  // namespace armature
