#include "punching_rules.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

namespace armature::en1992 {

double punching_effective_depth(double dy, double dz) { return (dy + dz) / 2.0; }

double punching_steel_ratio(double rho_y, double rho_z) { return std::min(std::sqrt(rho_y * rho_z), 0.02); }

double punching_steel_ratio_width(double c, double d, int sides_not_free) { return c + 3.0 * d * sides_not_free; }

double punching_resistance_concrete(double C_Rd_c, double k, double rho_l, double fck, double v_min) {
  return std::max(C_Rd_c * k * std::cbrt(100.0 * rho_l * fck), v_min);
}

double simplified_beta(ColumnPosition position) {
  switch (position) {
    case ColumnPosition::internal: return 1.15;
    case ColumnPosition::edge: return 1.4;
    case ColumnPosition::corner: return 1.5;
  }
  return 1.5;
}

double moment_transfer_k(double r) {
  const double x[] = {0.5, 1.0, 2.0, 3.0}, k[] = {0.45, 0.60, 0.70, 0.80};
  if (r <= x[0]) return k[0];
  for (int i = 1; i < 4; ++i)
    if (r <= x[i]) return k[i - 1] + (k[i] - k[i - 1]) * (r - x[i - 1]) / (x[i] - x[i - 1]);
  return k[3];
}

double internal_w1(double c1, double c2, double d) {
  return c1 * c1 / 2.0 + c1 * c2 + 4.0 * c2 * d + 16.0 * d * d + 2.0 * std::numbers::pi * d * c1;
}

double edge_w1(double c1, double c2, double d) {
  return c2 * c2 / 4.0 + c1 * c2 + 4.0 * c1 * d + 8.0 * d * d + std::numbers::pi * d * c2;
}

double beta_term(double k, double M, double V, double u1, double W1) { return k * (M / V) * u1 / W1; }

double reduced_column_depth(double c1, double d) { return std::min(0.5 * c1, 1.5 * d); }

double punching_shear_stress(double beta, double V, double u, double d) { return beta * V / (u * d); }

double strength_reduction_factor(double fck) { return 0.6 * (1.0 - fck / 250.0); }

double punching_max_stress(double factor, double nu, double fcd) { return factor * nu * fcd; }

double edge_column_face_perimeter(double c1, double c2, double d) { return c2 + std::min(3.0 * d, 2.0 * c1); }

double corner_column_face_perimeter(double c1, double c2, double d) { return std::min(3.0 * d, c1 + c2); }

double effective_link_strength(double d, double fywd) { return std::min(250.0 + 0.25 * d, fywd); }

double max_link_perimeter_spacing(double d) { return 0.75 * d; }

double punching_resistance_with_links(double v_Rd_c, double d, double sr, double Asw, double fywd_ef, double u1) {
  return 0.75 * v_Rd_c + 1.5 * (d / sr) * Asw * fywd_ef / (u1 * d);
}

double required_links_per_perimeter(double v_Ed, double v_Rd_c, double u1, double sr, double fywd_ef) {
  return std::max(v_Ed - 0.75 * v_Rd_c, 0.0) * u1 * sr / (1.5 * fywd_ef);
}

double min_link_leg_area(double fck, double fyk, double sr, double st) {
  return 0.08 * std::sqrt(fck) * sr * st / (1.5 * fyk);
}

double max_link_tangential_spacing(double d) { return 1.5 * d; }

double outer_perimeter_length(double beta, double V, double v_Rd_c, double d) { return beta * V / (v_Rd_c * d); }

double edge_column_effective_width(double c_along_edge, double c_across_edge) { return c_along_edge + c_across_edge; }
double corner_column_effective_width(double c_along_edge, double c_across_edge) {
  return c_along_edge + c_across_edge / 2.0;
}

double edge_moment_transfer_limit(double be, double d, double fck) { return 0.17 * be * d * d * fck; }

}  // namespace armature::en1992
