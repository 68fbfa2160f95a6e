#include "rules.hpp"

#include "armature/code.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <stdexcept>
#include <string_view>

namespace armature::en1992 {

// ---- Materials -------------------------------------------------------------
std::optional<double> fck_of_strength_class(const std::string& name) {
  // Table 3.1 strength classes: C fck / fck,cube.
  struct Class {
    std::string_view name;  // compared by length first: few text compares
    double fck;
  };
  static constexpr Class classes[] = {{"C12/15", 12}, {"C16/20", 16}, {"C20/25", 20}, {"C25/30", 25},
                                      {"C30/37", 30}, {"C35/45", 35}, {"C40/50", 40}, {"C45/55", 45},
                                      {"C50/60", 50}, {"C55/67", 55}, {"C60/75", 60}, {"C70/85", 70},
                                      {"C80/95", 80}, {"C90/105", 90}};
  for (const auto& c : classes)
    if (name == c.name) return c.fck;
  return std::nullopt;
}

double mean_compressive_strength(double fck) { return fck + 8.0; }

double mean_tensile_strength(double fck) {
  if (fck <= 50.0) return 0.30 * std::pow(fck, 2.0 / 3.0);
  return 2.12 * std::log(1.0 + mean_compressive_strength(fck) / 10.0);
}

double secant_modulus_MPa(double fck) {
  return 22000.0 * std::pow(mean_compressive_strength(fck) / 10.0, 0.3);
}

double ultimate_compressive_strain(double fck) {
  if (fck <= 50.0) return 0.0035;
  return (2.6 + 35.0 * std::pow((90.0 - fck) / 100.0, 4.0)) * 1e-3;
}

double stress_block_depth_factor(double fck) {
  return fck <= 50.0 ? 0.8 : 0.8 - (fck - 50.0) / 400.0;
}

double stress_block_strength_factor(double fck) {
  return fck <= 50.0 ? 1.0 : 1.0 - (fck - 50.0) / 200.0;
}

double design_compressive_strength(double fck, double alpha_cc, double gamma_c) {
  return alpha_cc * fck / gamma_c;
}

double design_yield_strength(double fyk, double gamma_s) { return fyk / gamma_s; }

// ---- Actions ---------------------------------------------------------------
std::optional<std::size_t> imposed_load_category_index(const std::string& category) {
  for (std::size_t i = 0; i < imposed_load_categories.size(); ++i)
    if (category == imposed_load_categories[i]) return i;
  return std::nullopt;
}

// ---- Load arrangements -----------------------------------------------------
std::vector<std::vector<bool>> load_arrangements(std::size_t spans, bool adjacent_pairs) {
  auto out = alternate_span_arrangements(spans);
  if (adjacent_pairs) {
    for (auto& a : adjacent_pair_arrangements(spans)) out.push_back(std::move(a));
  } else {
    out.push_back(all_spans_loaded(spans));
  }
  return out;
}

std::vector<std::vector<bool>> bay_load_arrangements(std::size_t bays_x, std::size_t bays_y, bool adjacent_pairs) {
  std::vector<std::vector<bool>> out{all_bays_loaded(bays_x, bays_y)};
  for (auto& a : checkerboard_bay_arrangements(bays_x, bays_y)) out.push_back(std::move(a));
  if (adjacent_pairs)
    for (auto& a : adjacent_bays_across_lines(bays_x, bays_y)) out.push_back(std::move(a));
  return out;
}

// ---- Bending ---------------------------------------------------------------
double minimum_redistribution_ratio(DuctilityClass ductility, double k5, double k6) {
  return ductility == DuctilityClass::A ? k6 : k5;
}

bool adjacent_span_ratio_allows_redistribution(double span_a, double span_b) {
  const double ratio = span_a / span_b;
  return ratio >= 0.5 * (1 - 1e-9) && ratio <= 2.0 * (1 + 1e-9);
}

double redistribution_coefficient(double factor, double eps_cu2) {
  return factor * (0.6 + 0.0014 / eps_cu2);
}

double redistribution_neutral_axis_limit(double delta, double k1, double k2) { return (delta - k1) / k2; }

double limiting_neutral_axis_ratio(double delta, double k1, double k2, double fck) {
  const double cap = fck <= 50.0 ? 0.45 : 0.35;
  return std::min(redistribution_neutral_axis_limit(delta, k1, k2), cap);
}

double neutral_axis_depth(double As, double fyd, double fcd, double eta, double lambda, double b) {
  return As * fyd / (lambda * eta * fcd * b);
}

double limiting_K(double eta, double alpha_cc, double gamma_c, double lambda, double xi) {
  return eta * (alpha_cc / gamma_c) * lambda * xi * (1.0 - lambda * xi / 2.0);
}

double moment_factor_K(double M_Nmm, double b, double d, double fck) {
  return M_Nmm / (b * d * d * fck);
}

double lever_arm(double d, double K, double eta, double alpha_cc, double gamma_c) {
  const double root = std::sqrt(std::max(0.25 - K / (2.0 * eta * alpha_cc / gamma_c), 0.0));
  return std::min(d * (0.5 + root), 0.95 * d);
}

double required_tension_steel(double M_Nmm, double fyd, double z) { return M_Nmm / (fyd * z); }

double moment_resistance(double As, double fyd, double fcd, double eta, double b, double d) {
  const double block_depth = As * fyd / (eta * fcd * b);  // λx from equilibrium
  const double z = std::min(d - block_depth / 2.0, 0.95 * d);
  return As * fyd * std::max(z, 0.0);
}

// ---- Detailing -------------------------------------------------------------
double minimum_tension_steel(double fctm, double fyk, double b, double d) {
  return std::max(0.26 * fctm / fyk, 0.0013) * b * d;
}

double maximum_steel(double b, double h) { return 0.04 * b * h; }

double max_main_bar_spacing_max_moment(double h) { return std::min(2.0 * h, 250.0); }

double max_distribution_bar_spacing_max_moment(double h) { return std::min(3.0 * h, 400.0); }

double minimum_distribution_steel(double main_As_prov) { return 0.2 * main_As_prov; }

double minimum_clear_bar_spacing(double phi, double aggregate) {
  return std::max({phi, aggregate + 5.0, 20.0});
}

// ---- Crack control ---------------------------------------------------------
bool crack_check_needed(double h) { return h > 200.0; }

double quasi_permanent_steel_stress(double fyd, double qp_to_uls, double As_req, double As_prov,
                                    double delta) {
  return fyd * qp_to_uls * (As_req / As_prov) / delta;
}

namespace {
constexpr double missing = -1.0;  // "–" in a table

int wk_column(double wk) {
  if (std::abs(wk - 0.4) < 1e-9) return 0;
  if (std::abs(wk - 0.3) < 1e-9) return 1;
  if (std::abs(wk - 0.2) < 1e-9) return 2;
  return -1;
}

template <std::size_t N>
std::optional<double> interpolate_table(const std::array<std::array<double, 4>, N>& rows,
                                        double sigma, int col) {
  if (col < 0) return std::nullopt;
  const int c = col + 1;
  if (sigma <= rows[0][0]) return rows[0][c] == missing ? std::nullopt : std::optional(rows[0][c]);
  for (std::size_t i = 1; i < N; ++i) {
    if (sigma <= rows[i][0]) {
      const double lo = rows[i - 1][c], hi = rows[i][c];
      if (lo == missing || hi == missing) return std::nullopt;
      const double t = (sigma - rows[i - 1][0]) / (rows[i][0] - rows[i - 1][0]);
      return lo + t * (hi - lo);
    }
  }
  return std::nullopt;  // past the last row
}
}  // namespace

std::optional<double> max_bar_diameter_table_7_2N(double sigma_s, double wk) {
  // σs, then φ*s for wk = 0.4, 0.3, 0.2 mm.
  static constexpr std::array<std::array<double, 4>, 8> table{{{160, 40, 32, 25},
                                                               {200, 32, 25, 16},
                                                               {240, 20, 16, 12},
                                                               {280, 16, 12, 8},
                                                               {320, 12, 10, 6},
                                                               {360, 10, 8, 5},
                                                               {400, 8, 6, 4},
                                                               {450, 6, 5, missing}}};
  return interpolate_table(table, sigma_s, wk_column(wk));
}

std::optional<double> max_bar_spacing_table_7_3N(double sigma_s, double wk) {
  // σs, then s_max for wk = 0.4, 0.3, 0.2 mm.
  static constexpr std::array<std::array<double, 4>, 6> table{{{160, 300, 300, 200},
                                                               {200, 300, 250, 150},
                                                               {240, 250, 200, 100},
                                                               {280, 200, 150, 50},
                                                               {320, 150, 100, missing},
                                                               {360, 100, 50, missing}}};
  return interpolate_table(table, sigma_s, wk_column(wk));
}

double adjusted_max_bar_diameter(double phi_star, double fctm, double h, double d) {
  constexpr double kc = kc_bending_rectangular;
  const double h_cr = h / 2.0;
  return phi_star * (fctm / 2.9) * kc * h_cr / (2.0 * (h - d));
}

double crack_control_depth_factor(double h) {
  if (h <= 300.0) return 1.0;
  if (h >= 800.0) return 0.65;
  return 1.0 - 0.35 * (h - 300.0) / 500.0;
}

double tension_zone_area_rectangular_bending(double b, double h) { return b * h / 2.0; }

double minimum_crack_control_steel(double kc, double k, double fct_eff, double A_ct, double sigma_s) {
  return kc * k * fct_eff * A_ct / sigma_s;
}

double cracked_neutral_axis_depth(double alpha_e, double As, double b, double d) {
  const double a = alpha_e * As / (b * d);
  return d * (-a + std::sqrt(a * a + 2.0 * a));
}

double cracked_steel_stress(double M_Nmm, double As, double d, double x) { return M_Nmm / (As * (d - x / 3.0)); }

double effective_tension_depth(double h, double d, double x) {
  return std::min({2.5 * (h - d), (h - x) / 3.0, h / 2.0});
}

double effective_reinforcement_ratio(double As, double Ac_eff) { return As / Ac_eff; }

double mean_strain_difference(double sigma_s, double kt, double fct_eff, double rho_p_eff, double alpha_e,
                              double Es) {
  const double full = (sigma_s - kt * fct_eff / rho_p_eff * (1.0 + alpha_e * rho_p_eff)) / Es;
  return std::max(full, 0.6 * sigma_s / Es);
}

double max_crack_spacing(double k3, double c, double k1, double k2, double k4, double phi, double rho_p_eff) {
  return k3 * c + k1 * k2 * k4 * phi / rho_p_eff;
}

double bonded_spacing_limit(double c, double phi) { return 5.0 * (c + phi / 2.0); }

double max_crack_spacing_wide(double h, double x) { return 1.3 * (h - x); }

double crack_width(double sr_max, double strain_difference) { return sr_max * strain_difference; }

// ---- Deflection ------------------------------------------------------------
double reference_reinforcement_ratio(double fck) { return std::sqrt(fck) * 1e-3; }

double structural_system_factor(StructuralSystem s) {
  switch (s) {
    case StructuralSystem::simply_supported: return 1.0;
    case StructuralSystem::end_span: return 1.3;
    case StructuralSystem::interior_span: return 1.5;
    case StructuralSystem::cantilever: return 0.4;
    case StructuralSystem::flat_slab: return 1.2;
  }
  return 1.0;
}

double basic_span_depth_ratio(double K, double fck, double rho, double rho_compression) {
  const double rho0 = reference_reinforcement_ratio(fck);
  const double root_fck = std::sqrt(fck);
  if (rho <= rho0)
    return K * (11.0 + 1.5 * root_fck * rho0 / rho +
                3.2 * root_fck * (rho0 / rho - 1.0) * std::sqrt(rho0 / rho - 1.0));
  return K * (11.0 + 1.5 * root_fck * rho0 / (rho - rho_compression) +
              root_fck * std::sqrt(rho_compression / rho0) / 12.0);
}

double capped_span_depth_ratio(double allowed, double K, std::optional<double> cap_K) {
  return cap_K ? std::min(allowed, *cap_K * K) : allowed;
}

double long_span_factor(double span_mm) { return span_mm > 7000.0 ? 7000.0 / span_mm : 1.0; }
double flat_slab_long_span_factor(double span_mm) { return span_mm > 8500.0 ? 8500.0 / span_mm : 1.0; }

double steel_stress_factor(double fyk, double As_prov, double As_req, double cap) {
  // No steel required (no moment): the steel is unstressed, the cap applies.
  if (!(As_req > 0.0)) return cap;
  return std::min((500.0 / fyk) * (As_prov / As_req), cap);
}

// ---- Shear -----------------------------------------------------------------
double shear_depth_factor(double d) { return std::min(1.0 + std::sqrt(200.0 / d), 2.0); }

double shear_strength_fck(double fck, std::optional<double> cap_MPa) {
  return cap_MPa ? std::min(fck, *cap_MPa) : fck;
}

double minimum_shear_strength(double k, double fck, double v_min_factor) {
  return v_min_factor * k * std::sqrt(k) * std::sqrt(fck);  // k^1.5
}

double shear_resistance_without_links(double C_Rd_c, double k, double rho_l, double fck,
                                      double v_min, double b, double d) {
  const double rho = std::min(rho_l, 0.02);
  const double v = C_Rd_c * k * std::cbrt(100.0 * rho * fck);
  return std::max(v, v_min) * b * d;
}

// ---- Cover -----------------------------------------------------------------
namespace {
// Column of Table 4.4N: X0, XC1, XC2/XC3, XC4, XD1/XS1, XD2/XS2, XD3/XS3.
int exposure_column(const std::string& e) {
  if (e == "X0") return 0;
  if (e == "XC1") return 1;
  if (e == "XC2" || e == "XC3") return 2;
  if (e == "XC4") return 3;
  if (e == "XD1" || e == "XS1") return 4;
  if (e == "XD2" || e == "XS2") return 5;
  if (e == "XD3" || e == "XS3") return 6;
  return -1;
}

// Table 4.3N: strength class at or above which the class drops by one.
double strength_for_reduction(const std::string& e) {
  if (e == "X0" || e == "XC1") return 30.0;
  if (e == "XC2" || e == "XC3") return 35.0;
  if (e == "XC4" || e == "XD1" || e == "XD2" || e == "XS1") return 40.0;
  return 45.0;  // XD3, XS2, XS3
}
}  // namespace

double monolithic_support_design_moment(double M_face, double M_fixed_end) {
  return std::max(M_face, face_moment_fixed_end_fraction * M_fixed_end);
}

double support_moment_reduction(double F_sup, double t) { return F_sup * t / 8.0; }

bool is_exposure_class(const std::string& exposure) { return exposure_column(exposure) >= 0; }

int structural_class(double design_life_years, const std::string& exposure, double fck) {
  int s = 4;
  if (design_life_years > 50.0) s += 2;  // Table 4.3N: 100 years
  s -= 1;                                // member with slab geometry
  if (fck >= strength_for_reduction(exposure)) s -= 1;
  return std::clamp(s, 1, 6);
}

double minimum_cover_durability(int structural_class, const std::string& exposure) {
  static constexpr std::array<std::array<double, 7>, 6> table{{{10, 10, 10, 15, 20, 25, 30},
                                                               {10, 10, 15, 20, 25, 30, 35},
                                                               {10, 10, 20, 25, 30, 35, 40},
                                                               {10, 15, 25, 30, 35, 40, 45},
                                                               {15, 20, 30, 35, 40, 45, 50},
                                                               {20, 25, 35, 40, 45, 50, 55}}};
  return table.at(static_cast<std::size_t>(structural_class - 1))
      .at(static_cast<std::size_t>(exposure_column(exposure)));
}

double minimum_cover_bond(double phi, double aggregate) {
  return phi + (aggregate > 32.0 ? 5.0 : 0.0);
}

double minimum_cover(double c_min_b, double c_min_dur) {
  return std::max({c_min_b, c_min_dur, 10.0});
}

double round_up_to_5(double x) { return std::ceil(x / 5.0 - 1e-9) * 5.0; }

// ---- Fire ------------------------------------------------------------------
namespace {
struct FireRow {
  int minutes;
  double h, a;
};
constexpr std::array<FireRow, 6> table_5_8{
    {{30, 60, 10}, {60, 80, 20}, {90, 100, 30}, {120, 120, 40}, {180, 150, 55}, {240, 175, 65}}};

const FireRow& fire_row(int minutes) {
  for (const auto& r : table_5_8)
    if (r.minutes == minutes) return r;
  throw std::invalid_argument("fire resistance " + std::to_string(minutes) +
                              " min is not in EN 1992-1-2 Table 5.8");
}
}  // namespace

bool is_tabulated_fire_resistance(int minutes) {
  return std::any_of(table_5_8.begin(), table_5_8.end(),
                     [&](const FireRow& r) { return r.minutes == minutes; });
}
double fire_min_thickness(int minutes) { return fire_row(minutes).h; }
double fire_min_axis_distance(int minutes) { return fire_row(minutes).a; }

namespace {
// Table 5.9 (from memory): flat slabs, REI 30 to 240: hs and a.
constexpr std::array<FireRow, 6> table_5_9{
    {{30, 150, 10}, {60, 180, 15}, {90, 200, 25}, {120, 200, 35}, {180, 200, 45}, {240, 200, 50}}};
const FireRow& flat_fire_row(int minutes) {
  for (const auto& r : table_5_9)
    if (r.minutes == minutes) return r;
  throw std::invalid_argument("fire resistance " + std::to_string(minutes) +
                              " min is not in EN 1992-1-2 Table 5.9");
}
}  // namespace

double fire_min_thickness_flat(int minutes) { return flat_fire_row(minutes).h; }
double fire_min_axis_distance_flat(int minutes) { return flat_fire_row(minutes).a; }

// ---- Deflection by calculation (EN 1992-1-1 7.4.3) ------------------------
double effective_modulus(double Ecm, double phi) { return Ecm / (1.0 + phi); }  // (7.20)

TransformedSection uncracked_section(double b, double h, double As, double d, double alpha_e) {
  const double As_extra = (alpha_e - 1.0) * As;
  const double A = b * h + As_extra;
  TransformedSection s;
  s.x = (b * h * h / 2.0 + As_extra * d) / A;
  s.I = b * h * h * h / 12.0 + b * h * (h / 2.0 - s.x) * (h / 2.0 - s.x) + As_extra * (d - s.x) * (d - s.x);
  s.S = As * (d - s.x);
  return s;
}

TransformedSection cracked_section(double b, double As, double d, double alpha_e) {
  TransformedSection s;
  s.x = cracked_neutral_axis_depth(alpha_e, As, b, d);
  s.I = b * s.x * s.x * s.x / 3.0 + alpha_e * As * (d - s.x) * (d - s.x);
  s.S = As * (d - s.x);
  return s;
}

double cracking_moment(double fctm, const TransformedSection& uncracked, double h) {  // 7.4.3(3)
  return fctm * uncracked.I / (h - uncracked.x);
}

double distribution_coefficient(double M, double Mcr, double beta) {  // (7.19)
  const double m = std::abs(M);
  if (m <= Mcr) return 0.0;
  return 1.0 - beta * (Mcr / m) * (Mcr / m);
}

double interpolated_parameter(double zeta, double cracked, double uncracked) {  // (7.18)
  return zeta * cracked + (1.0 - zeta) * uncracked;
}

double shrinkage_curvature(double eps_cs, double alpha_e, const TransformedSection& s) {  // (7.21)
  return eps_cs * alpha_e * s.S / s.I;
}

LongTermSection long_term_section(double b, double h, double As, double d, double Ecm, double fctm, double phi,
                                  double eps_cs) {
  LongTermSection s;
  s.Ec_eff = effective_modulus(Ecm, phi);
  s.alpha_e = steel_modulus_MPa / s.Ec_eff;
  s.eps_cs = eps_cs;
  s.uncracked = uncracked_section(b, h, As, d, s.alpha_e);
  s.cracked = cracked_section(b, As, d, s.alpha_e);
  s.Mcr = cracking_moment(fctm, s.uncracked, h);
  s.kcs_I = shrinkage_curvature(eps_cs, s.alpha_e, s.uncracked);
  s.kcs_II = shrinkage_curvature(eps_cs, s.alpha_e, s.cracked);
  return s;
}

double LongTermSection::curvature(double M) const {
  const double zeta = distribution_coefficient(M, Mcr, beta_sustained);
  const double k_load = interpolated_parameter(zeta, M / (Ec_eff * cracked.I), M / (Ec_eff * uncracked.I));
  return k_load + interpolated_parameter(zeta, kcs_II, kcs_I);
}

// ---- Creep and shrinkage (EN 1992-1-1 3.1.4, Annex B) -----------------------
double notional_size(double Ac, double u) { return 2.0 * Ac / u; }  // (B.6)

double creep_humidity_factor(double RH, double h0, double fcm) {  // (B.3a), (B.3b)
  const double base = (1.0 - RH / 100.0) / (0.1 * std::cbrt(h0));
  if (fcm <= 35.0) return 1.0 + base;
  const double a1 = std::pow(35.0 / fcm, 0.7), a2 = std::pow(35.0 / fcm, 0.2);
  return (1.0 + base * a1) * a2;
}

double creep_strength_factor(double fcm) { return 16.8 / std::sqrt(fcm); }  // (B.4)

double creep_loading_age_factor(double t0) { return 1.0 / (0.1 + std::pow(t0, 0.20)); }  // (B.5)

double cement_adjusted_age(double t0_T, Cement cement) {  // (B.9)
  const double alpha = cement == Cement::S ? -1.0 : cement == Cement::N ? 0.0 : 1.0;
  return std::max(t0_T * std::pow(9.0 / (2.0 + std::pow(t0_T, 1.2)) + 1.0, alpha), 0.5);
}

double notional_creep_coefficient(double phi_RH, double beta_fcm, double beta_t0) {  // (B.2)
  return phi_RH * beta_fcm * beta_t0;
}

double creep_humidity_time_factor(double RH, double h0, double fcm) {  // (B.8a), (B.8b)
  const double base = 1.5 * (1.0 + std::pow(0.012 * RH, 18.0)) * h0;
  if (fcm <= 35.0) return std::min(base + 250.0, 1500.0);
  const double a3 = std::sqrt(35.0 / fcm);
  return std::min(base + 250.0 * a3, 1500.0 * a3);
}

double creep_development(double t, double t0, double beta_H) {  // (B.7)
  if (t <= t0) return 0.0;
  return std::pow((t - t0) / (beta_H + t - t0), 0.3);
}

double basic_drying_shrinkage(double fcm, double RH, Cement cement) {  // (B.11), (B.12)
  const double a1 = cement == Cement::S ? 3.0 : cement == Cement::N ? 4.0 : 6.0;
  const double a2 = cement == Cement::S ? 0.13 : cement == Cement::N ? 0.12 : 0.11;
  const double beta_RH = 1.55 * (1.0 - std::pow(RH / 100.0, 3.0));
  return 0.85 * ((220.0 + 110.0 * a1) * std::exp(-a2 * fcm / 10.0)) * 1e-6 * beta_RH;
}

double shrinkage_size_factor(double h0) {  // Table 3.3
  constexpr std::array<std::pair<double, double>, 4> rows{{{100.0, 1.0}, {200.0, 0.85}, {300.0, 0.75}, {500.0, 0.70}}};
  if (h0 <= rows.front().first) return rows.front().second;
  for (std::size_t i = 1; i < rows.size(); ++i)
    if (h0 <= rows[i].first) {
      const auto [x0, y0] = rows[i - 1];
      const auto [x1, y1] = rows[i];
      return y0 + (y1 - y0) * (h0 - x0) / (x1 - x0);
    }
  return rows.back().second;
}

double drying_shrinkage_development(double t, double ts, double h0) {  // (3.10)
  if (t <= ts) return 0.0;
  return (t - ts) / ((t - ts) + 0.04 * std::sqrt(h0 * h0 * h0));
}

double final_autogenous_shrinkage(double fck) { return std::max(2.5 * (fck - 10.0) * 1e-6, 0.0); }  // (3.12)

double autogenous_shrinkage_development(double t) { return 1.0 - std::exp(-0.2 * std::sqrt(t)); }  // (3.13)

// ---- Anchorage and laps ------------------------------------------------------

double design_tensile_strength(double fctm, double alpha_ct, double gamma_c) {
  return alpha_ct * 0.7 * fctm / gamma_c;
}

double bond_mean_tensile_strength(double fctm) { return std::min(fctm, mean_tensile_strength(60.0)); }

bool good_bond_position(double h, double height_above_bottom) {
  if (h <= 250.0) return true;
  if (height_above_bottom <= 250.0) return true;
  return h > 600.0 && h - height_above_bottom > 300.0;
}

double bond_quality_factor(bool good_bond) { return good_bond ? 1.0 : 0.7; }

double bar_size_bond_factor(double phi) { return phi <= 32.0 ? 1.0 : (132.0 - phi) / 100.0; }

double design_bond_stress(double eta1, double eta2, double fctd) { return 2.25 * eta1 * eta2 * fctd; }

double basic_anchorage_length(double phi, double sigma_sd, double fbd) { return phi / 4.0 * sigma_sd / fbd; }

double cover_factor_straight(double cd, double phi) {
  return std::clamp(1.0 - 0.15 * (cd - phi) / phi, 0.7, 1.0);
}

double minimum_anchorage_length(double lb_rqd, double phi) {
  return std::max({0.3 * lb_rqd, 10.0 * phi, 100.0});
}

double design_anchorage_length(double alpha1, double alpha2, double alpha3, double alpha4, double alpha5,
                               double lb_rqd, double lb_min) {
  const double a235 = std::max(alpha2 * alpha3 * alpha5, 0.7);
  return std::max(alpha1 * a235 * alpha4 * lb_rqd, lb_min);
}

double lap_share_factor(double percent_lapped) {
  return std::clamp(std::sqrt(percent_lapped / 25.0), 1.0, 1.5);
}

double minimum_lap_length(double alpha6, double lb_rqd, double phi) {
  return std::max({0.3 * alpha6 * lb_rqd, 15.0 * phi, 200.0});
}

double design_lap_length(double alpha1, double alpha2, double alpha3, double alpha5, double alpha6,
                         double lb_rqd, double l0_min) {
  const double a235 = std::max(alpha2 * alpha3 * alpha5, 0.7);
  return std::max(alpha1 * a235 * alpha6 * lb_rqd, l0_min);
}

double tensile_force_shift(double d) { return d; }

double end_support_tensile_force(double V_Ed, double al, double z) { return std::abs(V_Ed) * al / z; }

double interior_support_minimum_embedment(double phi) { return 10.0 * phi; }

double partial_fixity_bar_extent(double span) { return 0.2 * span; }

double minimum_mandrel_diameter(double phi) { return (phi <= 16.0 + 1e-9 ? 4.0 : 7.0) * phi; }

double shape_factor_bent(double cd, double phi) { return cd > 3.0 * phi ? 0.7 : 1.0; }

double equivalent_anchorage_length_bent(double alpha1, double lb_rqd) { return alpha1 * lb_rqd; }

double standard_bend_extension(double phi) { return 5.0 * phi; }

double fire_continuous_top_share(int minutes) { return minutes >= 90 ? 0.2 : 0.0; }

double bend_bearing_mandrel_diameter(double Fbt, double ab, double phi, double fcd) {
  return Fbt * (1.0 / ab + 1.0 / (2.0 * phi)) / fcd;
}

// Table 5.8 columns 4 (ly/lx ≤ 1.5) and 5 (1.5 < ly/lx ≤ 2), REI 30 to 240.
int fire_two_way_column(double ly_over_lx) { return ly_over_lx <= 1.5 ? 4 : ly_over_lx <= 2.0 ? 5 : 3; }
double fire_min_axis_distance_two_way(int minutes, double ly_over_lx) {
  constexpr std::array<double, 6> column_4{10, 10, 15, 20, 30, 40}, column_5{10, 15, 20, 25, 40, 50};
  const int column = fire_two_way_column(ly_over_lx);
  if (column == 3) return fire_min_axis_distance(minutes);
  for (std::size_t k = 0; k < table_5_8.size(); ++k)
    if (table_5_8[k].minutes == minutes) return column == 4 ? column_4[k] : column_5[k];
  return fire_row(minutes).a;  // throws: not tabulated
}

}  // namespace armature::en1992
