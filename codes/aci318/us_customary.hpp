// ACI 318-19 in inch-pound units: the forms of the in-lb edition where its
// constants are not the SI edition's converted (they are rounded apart:
// 0.4 + fy/100 000 against 0.4 + fy/700), the in-lb bar catalogue and
// cover table. One small pure function per provision. Units: in, in², psi,
// lb. Every value is from memory of the standard (see the tests).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "rules.hpp"

namespace armature::aci318::inch_pound {

// ASTM A615/A706 bars, nominal dimensions (from memory of the standard's
// Appendix table of bar sizes).
struct Bar {
  const char* number;  // "#4"
  double diameter_in;
  double area_in2;
};
const std::vector<Bar>& bar_catalogue();
std::optional<Bar> find_bar(const std::string& number);  // "#3" to "#11" only

constexpr double steel_modulus_psi = 29'000'000.0;       // 20.2.2.2
constexpr double grade_60_psi = 60'000.0;                // Grade 60
constexpr double default_fc_psi = 4000.0;                // common practice for floors
constexpr double normalweight_density_pcf = 150.0;       // common practice
constexpr double design_strip_in = 12.0;                 // a foot of slab, common practice
constexpr double first_spacing_in = 3.0;                 // common practice
constexpr double spacing_step_in = 0.5;                  // common practice
constexpr double aggregate_in = 0.75;                    // nominal maximum size, common practice

double stress_block_factor_beta1(double fc_psi);         // Table 22.2.2.4.3
double modulus_of_elasticity(double fc_psi);             // 19.2.2.1: 57 000 √f'c psi
double modulus_of_rupture(double fc_psi, double lambda); // 19.2.3.1: 7.5 λ √f'c psi
double yield_strain(double fy_psi);                      // 21.2.2.1: εty = fy/Es
double max_flexural_bar_spacing(double h_in);            // 7.7.2.3: min(3h, 18 in)
double two_way_max_flexural_bar_spacing(double h_in);    // 8.7.2.2: min(2h, 18 in)
// 8.3.1.2: ln (0.8 + fy/200 000)/(36 + 9β) ≥ 3.5 in (fy psi; from memory).
double two_way_min_thickness(double long_span_in, double short_span_in, double fy_psi);
// 25.2.1: clear spacing ≥ max(1 in, db, 4/3 dagg).
double minimum_clear_bar_spacing(double db_in, double aggregate_in);
// 24.3.2: s ≤ min(15 (40 000/fs) − 2.5 cc, 12 (40 000/fs)), fs in psi.
double crack_control_spacing(double fs_psi, double clear_cover_in);
double max_shrinkage_bar_spacing(double h_in);           // 24.4.3.3: min(5h, 18 in)
double size_effect_factor(double d_in);                  // 22.5.5.1.3: √(2/(1 + d/10)) ≤ 1
// 22.5.5.1: Vc = 8 λs λ ρw^(1/3) √f'c b d ≤ 5 λ √f'c b d, √f'c ≤ 100 psi (22.5.3.1); lb.
double one_way_shear_strength(double lambda_s, double lambda, double rho_w, double fc_psi, double b_in,
                              double d_in);
// Table 7.3.1.1: ℓ/20, ℓ/24, ℓ/28, ℓ/10, times (0.4 + fy/100 000) (7.3.1.1.1).
double minimum_slab_thickness(double span_in, SupportCondition condition, double fy_psi);
// Table 20.5.1.3.1: interior ¾ in (#11 and smaller); weather 1½ in (#5
// and smaller), 2 in (#6 and larger); cast against ground 3 in.
double specified_cover(const std::string& exposure, double bar_diameter_in);

// 25.4.2.3: ld = fy ψt ψe ψg db / (k λ √f'c) with k = 25 (#6 and
// smaller) or 20 (larger) where clear spacing ≥ 2 db and clear cover ≥ db,
// else 50/3 or 40/3; ψt ψe ≤ 1.7; in, psi.
double development_length_simplified(double fy_psi, double root_fc_psi, double psi_t, double psi_e, double psi_g,
                                     double lambda, double db_in, bool spacing_and_cover_ample);
// 25.4.2.4 (25.4.2.4a): ld = (3/40)(fy/(λ √f'c)) ψt ψe ψs ψg db / ((cb + Ktr)/db), ≤ 2.5, Ktr = 0.
double development_length_general(double fy_psi, double root_fc_psi, double psi_t, double psi_e, double psi_s,
                                  double psi_g, double lambda, double db_in, double cb_in);
constexpr double minimum_development_length_in = 12.0;      // 25.4.2.1(b)
double tension_lap_length(double ld_in, bool class_a);      // 25.5.2.1: 1.0 or 1.3 ld, ≥ 12 in
// 25.4.2.5 Table: ψt = 1.3 with more than 12 in of fresh concrete below.
double casting_position_factor(double concrete_below_in);
constexpr double support_embedment_in = 6.0;                // 7.7.3.8.2 (value from memory)
// 25.4.3.2 Table (value from memory): ψc = f'c/15 000 + 0.6 for f'c below
// 6000 psi, 1.0 from there: min(f'c/15 000 + 0.6, 1.0).
double hook_concrete_strength_factor(double fc_psi);
// 25.4.3.1 (value from memory): ldh = the largest of (a) fy ψe ψr ψo ψc
// db^1.5 / (55 λ √f'c), (b) 8 db, (c) 6 in; psi, in.
double hooked_development_length(double fy_psi, double root_fc_psi, double psi_e, double psi_r, double psi_o,
                                 double psi_c, double lambda, double db_in);

}  // namespace armature::aci318::inch_pound
