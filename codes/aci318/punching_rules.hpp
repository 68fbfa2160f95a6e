// ACI 318-19 two-way (punching) shear at a column, 22.6 with the moment
// transfer of 8.4.2.2 and 8.4.4.2, one small pure function per provision.
// The forms are written once with the constants of either edition (SI:
// MPa, mm; in-lb: psi, in). Every value is from memory of the standard
// (see test_punching.cpp).
#pragma once

#include "armature/punching.hpp"

namespace armature::aci318 {

// The constants of 22.6 in one edition's units.
struct TwoWayShearConstants {
  double k_max;        // Table 22.6.5.2 (a): 0.33 (MPa) or 4 (psi)
  double k_beta;       // (b): 0.17 (1 + 2/β) or 2 (1 + 2/β), i.e. 2 + 4/β in psi
  double k_alpha;      // (c): 0.083 (2 + αs d/b0) or 1 (2 + αs d/b0)
  double k_stirrups;   // Table 22.6.6.1: vc with stirrups, 0.17 or 2
  double k_vn_max;     // 22.6.6.2: vn ≤ 0.5 √f'c or 6 √f'c with stirrups
  double root_fc_cap;  // 22.6.3.1: √f'c ≤ 8.3 MPa or 100 psi
  double fyt_max;      // 20.2.2.4: fyt ≤ 420 MPa or 60 000 psi for shear
};
inline constexpr TwoWayShearConstants two_way_si{0.33, 0.17, 0.083, 0.17, 0.5, 8.3, 420.0};
inline constexpr TwoWayShearConstants two_way_inch_pound{4.0, 2.0, 1.0, 2.0, 6.0, 100.0, 60000.0};

// 22.6.5.3: αs = 40 interior, 30 edge, 20 corner columns.
double column_location_factor(ColumnPosition position);
// √f'c ≤ the cap of 22.6.3.1.
double two_way_root_fc(const TwoWayShearConstants& form, double fc);
// Table 22.6.5.2: vc = the least of k_max λs λ √f'c, k_beta (1 + 2/β) λs λ √f'c
// and k_alpha (2 + αs d/b0) λs λ √f'c; β the long over the short side of the column.
double two_way_shear_strength(const TwoWayShearConstants& form, double lambda_s, double lambda, double fc,
                              double beta, double alpha_s, double d, double b0);
// 8.4.2.2.2: γf = 1/(1 + (2/3) √(b1/b2)), b1 the critical section's side
// along the span of the moment, b2 across.
double moment_transfer_by_flexure(double b1, double b2);
// 8.4.4.2.2: γv = 1 − γf.
double moment_transfer_by_shear(double gamma_f);
// R8.4.4.2.3: Jc of the critical section of an interior column,
// d b1³/6 + b1 d³/6 + d b2 b1²/2.
double interior_polar_moment(double b1, double b2, double d);
// 8.4.4.2.3: vu = Vu/(b0 d) + γv Msc c/Jc.
double two_way_shear_stress(double Vu, double b0, double d, double gamma_v, double Msc, double c, double Jc);
// Table 22.6.6.1: vc where stirrups are provided, k_stirrups λs λ √f'c.
double two_way_concrete_with_stirrups(const TwoWayShearConstants& form, double lambda_s, double lambda, double fc);
// 22.6.6.2: the largest vn with stirrups, k_vn_max √f'c.
double two_way_max_with_stirrups(const TwoWayShearConstants& form, double fc);
// 22.6.8.2: vs = Av fyt/(b0 s) solved for Av on each peripheral line:
// (vu/φ − vc) b0 s/fyt, ≥ 0.
double required_stirrup_area(double vu, double phi, double vc, double b0, double s, double fyt);
// 22.6.8.2 direct: vs = Av fyt/(b0 s).
double stirrup_shear_stress(double Av, double fyt, double b0, double s);
// 8.7.6.3 (from memory): peripheral lines of stirrups no more than d/2 apart.
double max_stirrup_line_spacing(double d);
// 22.6.4.1: the critical section at d/2 from the column's faces.
constexpr double critical_section_distance_factor = 0.5;
// 8.4.2.2.3: bslab, the slab resisting γf Msc, the column's side across
// the moment plus 1.5 h on each side where the slab continues.
double moment_transfer_slab_width(double c2, double h, int sides_with_slab);

}  // namespace armature::aci318
