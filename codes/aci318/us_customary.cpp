#include "us_customary.hpp"

#include <algorithm>
#include <cmath>

namespace armature::aci318::inch_pound {

const std::vector<Bar>& bar_catalogue() {
  static const std::vector<Bar> bars{{"#3", 0.375, 0.11}, {"#4", 0.500, 0.20}, {"#5", 0.625, 0.31},
                                     {"#6", 0.750, 0.44}, {"#7", 0.875, 0.60}, {"#8", 1.000, 0.79},
                                     {"#9", 1.128, 1.00}, {"#10", 1.270, 1.27}, {"#11", 1.410, 1.56}};
  return bars;
}

std::optional<Bar> find_bar(const std::string& number) {
  for (const auto& b : bar_catalogue())
    if (number == b.number) return b;
  return std::nullopt;
}

double stress_block_factor_beta1(double fc) {
  if (fc <= 4000.0) return 0.85;
  if (fc >= 8000.0) return 0.65;
  return 0.85 - 0.05 * (fc - 4000.0) / 1000.0;
}

double yield_strain(double fy) { return fy / steel_modulus_psi; }

double modulus_of_elasticity(double fc) { return 57000.0 * std::sqrt(fc); }  // 19.2.2.1

double modulus_of_rupture(double fc, double lambda) { return 7.5 * lambda * std::sqrt(fc); }  // 19.2.3.1

double max_flexural_bar_spacing(double h) { return std::min(3.0 * h, 18.0); }

double two_way_max_flexural_bar_spacing(double h) { return std::min(2.0 * h, 18.0); }

double two_way_min_thickness(double long_span, double short_span, double fy) {
  const double beta = long_span / short_span;
  return std::max(long_span * (0.8 + fy / 200000.0) / (36.0 + 9.0 * beta), 3.5);
}

double minimum_clear_bar_spacing(double db, double aggregate) {
  return std::max({1.0, db, 4.0 / 3.0 * aggregate});
}

double crack_control_spacing(double fs, double clear_cover) {
  return std::min(15.0 * (40000.0 / fs) - 2.5 * clear_cover, 12.0 * (40000.0 / fs));
}

double max_shrinkage_bar_spacing(double h) { return std::min(5.0 * h, 18.0); }

double size_effect_factor(double d) { return std::min(std::sqrt(2.0 / (1.0 + d / 10.0)), 1.0); }

double one_way_shear_strength(double lambda_s, double lambda, double rho_w, double fc, double b, double d) {
  return aci318::one_way_shear_strength({8.0, 5.0, 100.0}, lambda_s, lambda, rho_w, fc, b, d);
}

double minimum_slab_thickness(double span, SupportCondition condition, double fy) {
  return span / minimum_thickness_divisor(condition) * (0.4 + fy / 100000.0);
}

double specified_cover(const std::string& exposure, double bar_diameter) {
  if (exposure == "ground") return 3.0;
  if (exposure == "weather") return bar_diameter > 0.7 ? 2.0 : 1.5;  // #6 (0.750 in) and larger
  return 0.75;  // interior slabs, #11 and smaller
}


double development_length_simplified(double fy_psi, double root_fc_psi, double psi_t, double psi_e, double psi_g,
                                     double lambda, double db_in, bool spacing_and_cover_ample) {
  const bool small = db_in <= 0.75 + 1e-9;
  const double k = spacing_and_cover_ample ? (small ? 25.0 : 20.0) : (small ? 50.0 / 3.0 : 40.0 / 3.0);
  return fy_psi * std::min(psi_t * psi_e, 1.7) * psi_g * db_in / (k * lambda * root_fc_psi);
}

double development_length_general(double fy_psi, double root_fc_psi, double psi_t, double psi_e, double psi_s,
                                  double psi_g, double lambda, double db_in, double cb_in) {
  const double confinement = std::min(cb_in / db_in, 2.5);
  return 3.0 / 40.0 * fy_psi / (lambda * root_fc_psi) * std::min(psi_t * psi_e, 1.7) * psi_s * psi_g * db_in /
         confinement;
}

double tension_lap_length(double ld_in, bool class_a) { return std::max((class_a ? 1.0 : 1.3) * ld_in, 12.0); }

double casting_position_factor(double concrete_below_in) { return concrete_below_in > 12.0 ? 1.3 : 1.0; }

double hook_concrete_strength_factor(double fc_psi) { return std::min(fc_psi / 15000.0 + 0.6, 1.0); }

double hooked_development_length(double fy_psi, double root_fc_psi, double psi_e, double psi_r, double psi_o,
                                 double psi_c, double lambda, double db_in) {
  const double a = fy_psi * psi_e * psi_r * psi_o * psi_c / (55.0 * lambda * root_fc_psi) * std::pow(db_in, 1.5);
  return std::max({a, 8.0 * db_in, 6.0});
}

}  // namespace armature::aci318::inch_pound
