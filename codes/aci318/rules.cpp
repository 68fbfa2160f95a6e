#include "rules.hpp"

#include <algorithm>
#include <cmath>

namespace armature::aci318 {

const std::vector<Bar>& bar_catalogue() {
  static const std::vector<Bar> bars{
      {"#3", "No.10", 9.5, 71},    {"#4", "No.13", 12.7, 129},  {"#5", "No.16", 15.9, 199},
      {"#6", "No.19", 19.1, 284},  {"#7", "No.22", 22.2, 387},  {"#8", "No.25", 25.4, 510},
      {"#9", "No.29", 28.7, 645},  {"#10", "No.32", 32.3, 819}, {"#11", "No.36", 35.8, 1006}};
  return bars;
}

std::optional<Bar> find_bar(const std::string& designation) {
  for (const auto& b : bar_catalogue())
    if (designation == b.number || designation == b.metric) return b;
  return std::nullopt;
}

double modulus_of_elasticity(double fc) { return 4700.0 * std::sqrt(fc); }
double modulus_of_rupture(double fc, double lambda) { return 0.62 * lambda * std::sqrt(fc); }

double stress_block_factor_beta1(double fc) {
  if (fc <= 28.0) return 0.85;
  if (fc >= 55.0) return 0.65;
  return 0.85 - 0.05 * (fc - 28.0) / 7.0;
}

std::optional<double> required_flexural_steel(double Mu, double fc, double fy, double b, double d) {
  const double radicand = d * d - 2.0 * Mu / (0.9 * 0.85 * fc * b);
  if (radicand < 0.0) return std::nullopt;
  return 0.85 * fc * b / fy * (d - std::sqrt(radicand));
}

double stress_block_depth(double As, double fy, double fc, double b) {
  return As * fy / (0.85 * fc * b);
}

double net_tensile_strain(double d, double c) { return 0.003 * (d - c) / c; }

double yield_strain(double fy) { return fy / steel_modulus_MPa; }

double strength_reduction_factor(double eps_t, double eps_ty) {
  if (eps_t >= eps_ty + 0.003) return 0.90;
  if (eps_t <= eps_ty) return 0.65;
  return 0.65 + 0.25 * (eps_t - eps_ty) / 0.003;
}

double nominal_moment(double As, double fy, double d, double a) { return As * fy * (d - a / 2.0); }

double slab_min_net_tensile_strain(double fy) { return yield_strain(fy) + 0.003; }

double steel_at_strain_limit(double fc, double fy, double b, double d) {
  // εt = 0.003 (d − c)/c = εt,min → c = 0.003 d/(0.003 + εt,min); a = β1 c; As = 0.85 f'c b a/fy.
  const double c = 0.003 * d / (0.003 + slab_min_net_tensile_strain(fy));
  return 0.85 * fc * b * stress_block_factor_beta1(fc) * c / fy;
}

double minimum_flexural_steel(double b, double h) { return 0.0018 * b * h; }
double max_flexural_bar_spacing(double h) { return std::min(3.0 * h, 450.0); }

double two_way_min_thickness(double long_span, double short_span, double fy) {
  const double beta = long_span / short_span;
  return std::max(long_span * (0.8 + fy / 1400.0) / (36.0 + 9.0 * beta), 90.0);
}

double flat_slab_thickness_divisor(double fy, const std::array<double, 3>& rows, bool exterior) {
  const std::array<double, 3> d = exterior ? std::array<double, 3>{33.0, 30.0, 28.0} : std::array<double, 3>{36.0, 33.0, 31.0};
  if (fy <= rows[0]) return d[0];
  if (fy >= rows[2]) return d[2];
  const std::size_t k = fy <= rows[1] ? 0 : 1;
  return d[k] + (d[k + 1] - d[k]) * (fy - rows[k]) / (rows[k + 1] - rows[k]);
}

// 8.7.2.2 (value from memory): at critical sections of two-way slabs.
double two_way_max_flexural_bar_spacing(double h) { return std::min(2.0 * h, 450.0); }

// 6.4.3.1–6.4.3.2 (from memory): with L ≤ 0.75 D the full factored live
// load on every panel suffices.
bool two_way_pattern_loading_required(double L, double D) { return L > 0.75 * D; }

double minimum_clear_bar_spacing(double db, double aggregate) {
  return std::max({25.0, db, 4.0 / 3.0 * aggregate});
}

double service_steel_stress(double fy) { return 2.0 / 3.0 * fy; }

double crack_control_spacing(double fs, double clear_cover) {
  return std::min(380.0 * (280.0 / fs) - 2.5 * clear_cover, 300.0 * (280.0 / fs));
}

double shrinkage_temperature_steel(double b, double h) { return 0.0018 * b * h; }
double max_shrinkage_bar_spacing(double h) { return std::min(5.0 * h, 450.0); }

double size_effect_factor(double d) { return std::min(std::sqrt(2.0 / (1.0 + 0.004 * d)), 1.0); }

double one_way_shear_strength(const OneWayShearConstants& form, double lambda_s, double lambda,
                              double rho_w, double fc, double b, double d) {
  const double root_fc = std::min(std::sqrt(fc), form.root_fc_cap);
  const double vc = form.k * lambda_s * lambda * std::cbrt(rho_w) * root_fc;
  return std::min(vc, form.k_max * lambda * root_fc) * b * d;
}

double one_way_shear_strength(double lambda_s, double lambda, double rho_w, double fc, double b,
                              double d) {
  return one_way_shear_strength({0.66, 0.42, 8.3}, lambda_s, lambda, rho_w, fc, b, d);
}

double minimum_thickness_divisor(SupportCondition condition) {
  switch (condition) {
    case SupportCondition::simply_supported: return 20.0;
    case SupportCondition::one_end_continuous: return 24.0;
    case SupportCondition::both_ends_continuous: return 28.0;
    case SupportCondition::cantilever: return 10.0;
  }
  return 20.0;
}

double minimum_slab_thickness(double span, SupportCondition condition, double fy) {
  return span / minimum_thickness_divisor(condition) * (0.4 + fy / 700.0);
}

bool is_exposure(const std::string& e) { return e == "interior" || e == "weather" || e == "ground"; }

double specified_cover(const std::string& exposure, double bar_diameter) {
  if (exposure == "ground") return 75.0;
  if (exposure == "weather") return bar_diameter >= 19.0 ? 50.0 : 40.0;  // No.19 and larger
  return 20.0;  // interior slabs, No.36 and smaller
}

// ---- Calculated deflection (24.2) -------------------------------------------
double gross_moment_of_inertia(double b, double h) { return b * h * h * h / 12.0; }  // 24.2.3.5

double cracking_moment(double fr, double Ig, double yt) { return fr * Ig / yt; }  // 24.2.3.5(b)

CrackedSection cracked_section(double b, double As, double d, double n) {
  const double a = n * As / (b * d);
  CrackedSection s;
  s.x = d * (-a + std::sqrt(a * a + 2.0 * a));
  s.Icr = b * s.x * s.x * s.x / 3.0 + n * As * (d - s.x) * (d - s.x);
  return s;
}

double effective_moment_of_inertia(double Ma, double Mcr, double Ig, double Icr) {  // Table 24.2.3.5
  const double m = std::abs(Ma);
  if (m <= 2.0 / 3.0 * Mcr) return Ig;
  const double r = (2.0 / 3.0) * Mcr / m;
  return Icr / (1.0 - r * r * (1.0 - Icr / Ig));
}

double long_term_multiplier(double xi, double rho_compression) {  // 24.2.4.1.1
  return xi / (1.0 + 50.0 * rho_compression);
}


// ---- Development and splices ---------------------------------------------------

double casting_position_factor(double concrete_below_mm) { return concrete_below_mm > 300.0 ? 1.3 : 1.0; }

double bar_size_factor(double db) { return db <= 19.1 + 1e-9 ? 0.8 : 1.0; }

double reinforcement_grade_factor(double fy) {
  if (fy <= 420.0 + 1e-9) return 1.0;
  if (fy <= 551.6 + 1e-9) return 1.15;  // Grade 550 (SI) and Grade 80 (80 000 psi = 551.6 MPa)
  return 1.3;
}

double development_length_simplified(double fy, double root_fc, double psi_t, double psi_e, double psi_g,
                                     double lambda, double db, bool spacing_and_cover_ample) {
  const bool small = db <= 19.1 + 1e-9;
  const double k = spacing_and_cover_ample ? (small ? 2.1 : 1.7) : (small ? 1.4 : 1.1);
  return fy * std::min(psi_t * psi_e, 1.7) * psi_g * db / (k * lambda * root_fc);
}

double development_length_general(double fy, double root_fc, double psi_t, double psi_e, double psi_s,
                                  double psi_g, double lambda, double db, double cb) {
  const double confinement = std::min(cb / db, 2.5);
  return fy * std::min(psi_t * psi_e, 1.7) * psi_s * psi_g * db / (1.1 * lambda * root_fc * confinement);
}

double tension_lap_length(double ld, bool class_a) { return std::max((class_a ? 1.0 : 1.3) * ld, 300.0); }

double extension_beyond_cutoff(double d, double db) { return std::max(d, 12.0 * db); }

double hook_inside_bend_diameter(double db) {
  if (db <= 25.4 + 1e-6) return 6.0 * db;  // No. 10 to No. 25 (#3 to #8)
  if (db <= 35.8 + 1e-6) return 8.0 * db;  // No. 29 to No. 36 (#9 to #11)
  return 10.0 * db;                        // No. 43, No. 57
}

double hook_extension_90(double db) { return 12.0 * db; }

double hook_concrete_strength_factor(double fc) { return fc < 40.0 ? fc / 105.0 + 0.6 : 1.0; }

double hook_confinement_factor(double spacing, double db) {
  return spacing >= 6.0 * db ? hook_confinement_factor_spaced : hook_confinement_factor_none;
}

double hooked_development_length(double fy, double root_fc, double psi_e, double psi_r, double psi_o, double psi_c,
                                 double lambda, double db) {
  const double a = fy * psi_e * psi_r * psi_o * psi_c / (23.0 * lambda * root_fc) * std::pow(db, 1.5);
  return std::max({a, 8.0 * db, 150.0});
}

double zero_moment_development_limit(double Mn, double Vu, double la, bool confined) {
  return (confined ? 1.3 : 1.0) * Mn / Vu + la;
}

double inflection_embedment_limit(double d, double db) { return std::max(d, 12.0 * db); }

}  // namespace armature::aci318
