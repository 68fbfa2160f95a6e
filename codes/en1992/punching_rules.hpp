// EN 1992-1-1 6.4 punching shear, one small pure function per clause.
// Units: N, mm, MPa. Values are from memory of EN 1992-1-1:2004 (+A1:2014);
// see test_punching.cpp for the check values.
#pragma once

#include "armature/punching.hpp"

namespace armature::en1992 {

// 6.4.2(1): the basic control perimeter is at 2d from the loaded area.
constexpr double basic_control_distance_factor = 2.0;
// 6.4.4(1) (6.32): d_eff = (dy + dz)/2.
double punching_effective_depth(double dy, double dz);
// 6.4.4(1): ρl = √(ρly ρlz) ≤ 0.02.
double punching_steel_ratio(double rho_y, double rho_z);
// 6.4.4(1): the top steel ratio is taken over the column width plus 3d
// each side (not past a free edge): c + 3d per side that is not free.
double punching_steel_ratio_width(double c, double d, int sides_not_free);
// 6.4.4(1) (6.47): vRd,c = CRd,c k (100 ρl fck)^(1/3) ≥ vmin (no σcp).
double punching_resistance_concrete(double C_Rd_c, double k, double rho_l, double fck, double v_min);
// Figure 6.21N: β of a braced structure whose adjacent spans differ by no
// more than 25 %: 1.15 internal, 1.4 edge, 1.5 corner.
double simplified_beta(ColumnPosition position);
// Table 6.1: k of (6.39) from c1/c2 (0.45 at ≤ 0.5, 0.60 at 1, 0.70 at 2,
// 0.80 at ≥ 3; linear between: common practice).
double moment_transfer_k(double c1_over_c2);
// (6.41): W1 of the basic control perimeter of an internal rectangular
// column, c1 parallel to the eccentricity.
double internal_w1(double c1, double c2, double d);
// (6.45): W1 of the basic control perimeter of an edge column for the
// eccentricity parallel to the edge, c1 perpendicular to the edge.
double edge_w1(double c1, double c2, double d);
// (6.39): β = 1 + k (MEd/VEd) u1/W1, one direction.
double beta_term(double k, double M, double V, double u1, double W1);
// Figure 6.20: the reduced depth of the column taken for u1*,
// min(0.5 c1, 1.5 d), c1 perpendicular to the free edge.
double reduced_column_depth(double c1, double d);
// 6.4.3(3) (6.38): vEd = β VEd/(ui d).
double punching_shear_stress(double beta, double V, double u, double d);
// 6.2.2(6) (6.6N): ν = 0.6 (1 − fck/250).
double strength_reduction_factor(double fck);
// 6.4.5(3): vRd,max = factor ν fcd (recommended 0.4, an NDP).
double punching_max_stress(double factor, double nu, double fcd);
// 6.4.5(3): u0 of an edge column, c2 + 3d ≤ c2 + 2c1 (c2 along the
// edge); of a corner column 3d ≤ c1 + c2.
double edge_column_face_perimeter(double c1, double c2, double d);
double corner_column_face_perimeter(double c1, double c2, double d);
// 6.4.5(1): fywd,ef = 250 + 0.25 d ≤ fywd.
double effective_link_strength(double d, double fywd);
// 9.4.3(1): radial spacing of perimeters of links ≤ 0.75 d.
double max_link_perimeter_spacing(double d);
// 6.4.5(1) (6.52) with α = 90°: vRd,cs = 0.75 vRd,c + 1.5 (d/sr) Asw fywd,ef /(u1 d).
double punching_resistance_with_links(double v_Rd_c, double d, double sr, double Asw, double fywd_ef, double u1);
// (6.52) solved for Asw per perimeter: (vEd − 0.75 vRd,c) u1 sr /(1.5 fywd,ef), ≥ 0.
double required_links_per_perimeter(double v_Ed, double v_Rd_c, double u1, double sr, double fywd_ef);
// 9.4.3(2) (9.11) with vertical links (α = 90°): the least area of one
// leg, Asw,min = 0.08 √fck sr st/(1.5 fyk).
double min_link_leg_area(double fck, double fyk, double sr, double st);
// 9.4.3(1): tangential spacing of legs within the basic control perimeter ≤ 1.5 d.
double max_link_tangential_spacing(double d);
// 6.4.5(4) (6.54): uout,ef = β VEd/(vRd,c d).
double outer_perimeter_length(double beta, double V, double v_Rd_c, double d);
// 6.4.5(4): the outermost perimeter of links no further than k d inside
// uout (k = 1.5 recommended).
constexpr double outer_link_perimeter_k = 1.5;
// 9.3.2(1): the least depth of a slab with shear reinforcement (mm).
constexpr double slab_min_depth_with_shear_reinforcement = 200.0;
// 9.4.1(3) Figure 9.9 (from memory): the effective width be of the slab
// for bars across a free edge at an edge column, cz + y (cz the column's
// side along the edge, y the slab edge to the column's inner face: the
// column's other side where the edge is flush); at a corner column z +
// y/2 (z the slab's other edge to the column's inner face).
double edge_column_effective_width(double c_along_edge, double c_across_edge);
double corner_column_effective_width(double c_along_edge, double c_across_edge);
// Annex I.1.2(5): the largest moment an edge or corner column takes from
// the slab, Mt,max = 0.17 be d² fck.
double edge_moment_transfer_limit(double be, double d, double fck);

}  // namespace armature::en1992
