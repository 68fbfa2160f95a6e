#include "punching_rules.hpp"

#include <algorithm>
#include <cmath>

namespace armature::aci318 {

double column_location_factor(ColumnPosition position) {
  switch (position) {
    case ColumnPosition::internal: return 40.0;
    case ColumnPosition::edge: return 30.0;
    case ColumnPosition::corner: return 20.0;
  }
  return 20.0;
}

double two_way_root_fc(const TwoWayShearConstants& form, double fc) {
  return std::min(std::sqrt(fc), form.root_fc_cap);
}

double two_way_shear_strength(const TwoWayShearConstants& form, double lambda_s, double lambda, double fc,
                              double beta, double alpha_s, double d, double b0) {
  const double r = lambda_s * lambda * two_way_root_fc(form, fc);
  return std::min({form.k_max * r, form.k_beta * (1.0 + 2.0 / beta) * r, form.k_alpha * (2.0 + alpha_s * d / b0) * r});
}

double moment_transfer_by_flexure(double b1, double b2) { return 1.0 / (1.0 + (2.0 / 3.0) * std::sqrt(b1 / b2)); }

double moment_transfer_by_shear(double gamma_f) { return 1.0 - gamma_f; }

double interior_polar_moment(double b1, double b2, double d) {
  return d * b1 * b1 * b1 / 6.0 + b1 * d * d * d / 6.0 + d * b2 * b1 * b1 / 2.0;
}

double two_way_shear_stress(double Vu, double b0, double d, double gamma_v, double Msc, double c, double Jc) {
  return Vu / (b0 * d) + gamma_v * Msc * c / Jc;
}

double two_way_concrete_with_stirrups(const TwoWayShearConstants& form, double lambda_s, double lambda, double fc) {
  return form.k_stirrups * lambda_s * lambda * two_way_root_fc(form, fc);
}

double two_way_max_with_stirrups(const TwoWayShearConstants& form, double fc) {
  return form.k_vn_max * two_way_root_fc(form, fc);
}

double required_stirrup_area(double vu, double phi, double vc, double b0, double s, double fyt) {
  return std::max(vu / phi - vc, 0.0) * b0 * s / fyt;
}

double moment_transfer_slab_width(double c2, double h, int sides_with_slab) { return c2 + 1.5 * h * sides_with_slab; }

double stirrup_shear_stress(double Av, double fyt, double b0, double s) { return Av * fyt / (b0 * s); }

double max_stirrup_line_spacing(double d) { return d / 2.0; }

}  // namespace armature::aci318
