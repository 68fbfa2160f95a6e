// ACI 318-19 (SI) rules for one-way solid slabs, one small pure function
// per section. Units: N, mm, MPa. Values are as written in aci318-basis.md
// (from memory of the standard; see the tests for the check values).
#pragma once

#include <optional>
#include <string>
#include <vector>

namespace armature::aci318 {

// ASTM A615/A615M bars: inch-pound number, metric number, diameter, area.
struct Bar {
  const char* number;  // "#4"
  const char* metric;  // "No.13"
  double diameter_mm;
  double area_mm2;
};
const std::vector<Bar>& bar_catalogue();
std::optional<Bar> find_bar(const std::string& designation);  // either name

// ---- Materials (19.2, 20.2) -------------------------------------------------
double modulus_of_elasticity(double fc);                  // 19.2.2.1: 4700 √f'c
double modulus_of_rupture(double fc, double lambda);      // 19.2.3.1: 0.62 λ √f'c
constexpr double steel_modulus_MPa = 200000.0;            // 20.2.2.2

// ---- Flexure (22.2, 21.2, 7.3.3) ---------------------------------------------
double stress_block_factor_beta1(double fc);              // Table 22.2.2.4.3
// As for Mu with φ = 0.9: (0.85 f'c b/fy)(d − √(d² − 2Mu/(0.9 · 0.85 f'c b)));
// nullopt when there is no real root (the section is too shallow).
std::optional<double> required_flexural_steel(double Mu, double fc, double fy, double b, double d);
double stress_block_depth(double As, double fy, double fc, double b);  // a = As fy/(0.85 f'c b)
double net_tensile_strain(double d, double c);            // εt = 0.003 (d − c)/c
double yield_strain(double fy);                           // 21.2.2.1: εty = fy/Es
double strength_reduction_factor(double eps_t, double eps_ty);  // Table 21.2.2
double nominal_moment(double As, double fy, double d, double a);  // Mn = As fy (d − a/2)
// 7.3.3.1: nonprestressed slabs tension-controlled, εt ≥ εty + 0.003 (Table 21.2.2).
double slab_min_net_tensile_strain(double fy);
// The steel area at which εt falls to the slab limit of 7.3.3.1.
double steel_at_strain_limit(double fc, double fy, double b, double d);

// ---- Reinforcement limits and detailing ------------------------------------
double minimum_flexural_steel(double b, double h);        // 7.6.1.1: 0.0018 Ag
double max_flexural_bar_spacing(double h);                // 7.7.2.3: min(3h, 450)
// 25.2.1: clear spacing of parallel bars in a layer ≥ max(25 mm, db, 4/3 dagg).
double minimum_clear_bar_spacing(double db, double aggregate);
double service_steel_stress(double fy);                   // 24.3.2.1: fs = 2/3 fy
// 24.3.2: s ≤ min(380 (280/fs) − 2.5 cc, 300 (280/fs)).
double crack_control_spacing(double fs, double clear_cover);
double shrinkage_temperature_steel(double b, double h);   // 24.4.3.2: 0.0018 Ag
double max_shrinkage_bar_spacing(double h);               // 24.4.3.3: min(5h, 450)

// ---- Shear (22.5.5.1) ----------------------------------------------------------
double size_effect_factor(double d);                      // λs = √(2/(1 + 0.004 d)) ≤ 1
// The form of 22.5.5.1 in either unit system: Vc = k λs λ ρw^(1/3) √f'c b d
// ≤ k_max λ √f'c b d, with √f'c capped (22.5.3.1).
struct OneWayShearConstants {
  double k;             // 0.66 (MPa) or 8 (psi)
  double k_max;         // 0.42 (MPa) or 5 (psi)
  double root_fc_cap;   // 8.3 MPa or 100 psi
};
double one_way_shear_strength(const OneWayShearConstants& form, double lambda_s, double lambda,
                              double rho_w, double fc, double b, double d);
// Vc = 0.66 λs λ ρw^(1/3) √f'c b d ≤ 0.42 λ √f'c b d, √f'c ≤ 8.3 MPa (22.5.3.1).
double one_way_shear_strength(double lambda_s, double lambda, double rho_w, double fc, double b,
                              double d);
constexpr double shear_strength_reduction = 0.75;         // 21.2.1

// ---- Deflection by minimum thickness (Table 7.3.1.1) -----------------------
enum class SupportCondition { simply_supported, one_end_continuous, both_ends_continuous, cantilever };
// The divisor of Table 7.3.1.1: ℓ/20, ℓ/24, ℓ/28, ℓ/10 (both unit systems).
double minimum_thickness_divisor(SupportCondition condition);
// ℓ/divisor × (0.4 + fy/700) (7.3.1.1.1).
double minimum_slab_thickness(double span, SupportCondition condition, double fy);

// ---- Cover (20.5.1.3.1) -----------------------------------------------------
bool is_exposure(const std::string& exposure);            // interior, weather, ground
double specified_cover(const std::string& exposure, double bar_diameter);

// ---- Calculated deflection (24.2; values from memory of ACI 318-19) --------
// 24.2.3.5: Ig of the gross section, b h³/12 (yt = h/2).
double gross_moment_of_inertia(double b, double h);
// 24.2.3.5(b): Mcr = fr Ig / yt.
double cracking_moment(double fr, double Ig, double yt);
// Cracked transformed section, n As at d: x from b x²/2 = n As (d − x),
// Icr = b x³/3 + n As (d − x)².
struct CrackedSection {
  double x = 0.0, Icr = 0.0;
};
CrackedSection cracked_section(double b, double As, double d, double n);
// Table 24.2.3.5: Ie = Ig for Ma ≤ (2/3) Mcr, else
// Icr / (1 − ((2/3) Mcr/Ma)² (1 − Icr/Ig)).
double effective_moment_of_inertia(double Ma, double Mcr, double Ig, double Icr);
// 24.2.4.1.1: λΔ = ξ/(1 + 50 ρ'); Table 24.2.4.1.3: ξ = 2.0 at five years or more.
constexpr double time_dependent_factor_five_years = 2.0;
double long_term_multiplier(double xi, double rho_compression);
// Table 24.2.2: ℓ/360 immediate live (floors); after the attachment of
// non-structural elements, ℓ/480 where they are likely to be damaged by
// large deflections, ℓ/240 where not.
constexpr double immediate_live_span_ratio = 360.0;
constexpr double after_attachment_damageable_span_ratio = 480.0;
constexpr double after_attachment_span_ratio = 240.0;

// ---- Loads (5.3.1): combinations.hpp



}  // namespace armature::aci318
