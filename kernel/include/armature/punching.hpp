// Punching shear at one column of a flat slab: what a member gives the
// code's punching rules (PunchingDemand), what they give back
// (PunchingOutcome), and the plan geometry of control perimeters that the
// codes build their perimeters from. Units: N, mm, MPa. Plan axes: x and y
// of the slab, origin at the column's centre.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "armature/record.hpp"

namespace armature {

enum class ColumnPosition { internal, edge, corner };

// The faces of a column that lie on the slab's free edge (the slab edge
// flush with that face): x0 the face at the column's smaller x, x1 at its
// larger x, y0 and y1 likewise. None: an internal column; one: an edge
// column; two adjacent: a corner column. Two opposite faces are refused.
struct FreeFaces {
  bool x0 = false, x1 = false, y0 = false, y1 = false;
};

// Position of a column with these free faces; throws std::invalid_argument
// for opposite free faces or more than two.
ColumnPosition column_position(const FreeFaces& free);

// Everything the punching rules need at one column. Materials are the
// session's (the request's concrete and reinforcement, as the code
// resolved them).
struct PunchingDemand {
  std::string where;            // "column 2,1"
  FreeFaces free{};
  double cx_mm = 0.0;           // column size along x
  double cy_mm = 0.0;           // column size along y
  double h_mm = 0.0;            // slab thickness
  double dx_mm = 0.0;           // effective depth of the top bars running along x
  double dy_mm = 0.0;           // effective depth of the top bars running along y
  // Top steel ratios of the bars running along x and along y, over the
  // width the code names (PunchingRules::steel_ratio_width_mm).
  double rho_x = 0.0;
  double rho_y = 0.0;
  double V_N = 0.0;             // design shear the column takes from the slab (VEd, Vu)
  // Unbalanced moments transferred between slab and column (magnitudes):
  // M_x_Nmm bends in the x direction (eccentricity along x, about the y
  // axis), M_y_Nmm in the y direction. None: not given (a code that needs
  // them refuses the demand).
  std::optional<double> M_x_Nmm;
  std::optional<double> M_y_Nmm;
  // The structure is braced against sway and adjacent spans differ by no
  // more than 25 % (a code may then use fixed moment-transfer factors).
  bool braced_regular_spans = false;
  // Shear reinforcement may be used where the concrete alone does not do.
  bool shear_reinforcement_allowed = true;
  // Spacing of the perimeters (lines) of shear reinforcement; none: the
  // largest the code allows.
  std::optional<double> reinforcement_spacing_mm;
};

// Refuses a demand no code can check: sizes, depths and the shear not
// positive (or the shear negative), a depth not less than the slab, a
// negative steel ratio or moment. Throws std::invalid_argument naming the
// field ("punching demand: dx_mm ...").
void validate_punching_demand(const PunchingDemand& demand);

// One piece of a perimeter in plan: a straight segment from a to b, or an
// arc about `centre` of `radius` from angle start_rad sweeping sweep_rad
// (counter-clockwise positive).
struct PerimeterPiece {
  bool arc = false;
  std::array<double, 2> a{}, b{};
  std::array<double, 2> centre{};
  double radius = 0.0, start_rad = 0.0, sweep_rad = 0.0;
};

// A perimeter around a column (open where it meets a free edge).
struct PunchingPerimeter {
  std::string name;           // the code's symbol: "u1", "b0"
  double distance_mm = 0.0;   // from the column's faces
  double length_mm = 0.0;
  bool closed = true;
  std::vector<PerimeterPiece> pieces;
  std::vector<std::array<double, 2>> points;  // for drawing, arcs as short chords
};

// How a control perimeter turns round a column's corner.
enum class PerimeterCorner { round, square, chamfer };

// The column outline a perimeter is drawn round: a rectangle in the
// column's axes (a code may take only part of the column).
struct ColumnOutline {
  double x_min = 0.0, x_max = 0.0, y_min = 0.0, y_max = 0.0;
};
inline ColumnOutline centred_outline(double cx, double cy) { return {-cx / 2, cx / 2, -cy / 2, cy / 2}; }

// The perimeter at `distance` from the faces of `column` that are not
// free, running to the slab edge at the free faces, turning the corners
// as asked. Throws std::invalid_argument for opposite free faces.
PunchingPerimeter offset_perimeter(const std::string& name, const ColumnOutline& column, const FreeFaces& free,
                                   double distance, PerimeterCorner corner);

// ∫ |e| dl over the perimeter, e the distance from the line through
// `origin` across the direction asked (along_x: e = x − origin; else y − origin).
double perimeter_first_moment(const PunchingPerimeter& p, bool along_x, double origin);
// ∫ e dl / ∫ dl: the centroid of the perimeter along x (along_x) or y.
double perimeter_centroid(const PunchingPerimeter& p, bool along_x);
// The polar-moment analogue of a critical section of depth d made of
// straight faces (no arcs), about its centroidal axis across the
// direction asked: d ∫ e² dl + d³/12 Σ |Δe| of each face. Throws for arcs.
double critical_section_polar_moment(const PunchingPerimeter& p, double d, bool along_x);
// The largest |e| of the perimeter's points from its centroid.
double critical_section_extreme_distance(const PunchingPerimeter& p, bool along_x);
// Extent of the perimeter's points along x or y.
double perimeter_extent(const PunchingPerimeter& p, bool along_x);

// Shear reinforcement where the concrete alone does not carry the shear.
struct PunchingReinforcement {
  double spacing_mm = 0.0;                 // between perimeters (lines) of reinforcement
  double area_per_perimeter_mm2 = 0.0;     // required on each perimeter (line)
  double design_strength_MPa = 0.0;        // the reinforcement's stress in the code's rule
  double min_leg_area_mm2 = 0.0;           // least area of one leg the code allows (0: none given)
  double outer_perimeter_distance_mm = 0.0;  // the perimeter where reinforcement is no longer needed
  double outermost_line_distance_mm = 0.0;   // the outermost line of reinforcement, at most
};

struct PunchingOutcome {
  std::string where;
  ColumnPosition position = ColumnPosition::internal;
  double d_mm = 0.0;                       // effective depth the rules use
  double transfer_factor = 0.0;            // β (EN) or the largest γv (ACI); 0 where none
  std::vector<PunchingPerimeter> perimeters;
  double v_face_MPa = 0.0;                 // shear stress at the column's perimeter (0 where the code checks none)
  double v_max_MPa = 0.0;                  // the largest stress any reinforcement allows there
  double v_MPa = 0.0;                      // shear stress at the control perimeter
  double v_concrete_MPa = 0.0;             // resistance of the concrete alone there
  bool reinforcement_needed = false;
  std::optional<PunchingReinforcement> reinforcement;
  std::vector<Check> checks;               // filled from Detail::checks, steps at Detail::steps
  bool pass = false;
};

}  // namespace armature
