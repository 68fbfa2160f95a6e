// ACI 318-19 (SI) rules for one-way solid slabs, one small pure function
// per section. Units: N, mm, MPa. Values are as written in aci318-basis.md
// (from memory of the standard; see the tests for the check values).
#pragma once

#include <array>
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
double two_way_max_flexural_bar_spacing(double h);        // 8.7.2.2: min(2h, 450) at critical sections
// 8.3.1.2 (αfm > 2, slabs on walls or stiff beams; from memory): h_min =
// ln (0.8 + fy/1400)/(36 + 9β), not less than 90 mm; ln the longer clear
// span, β the ratio of the longer to the shorter.
double two_way_min_thickness(double long_span, double short_span, double fy);
// Table 8.3.1.1 (from memory): ℓn/h of a flat slab without drop panels,
// for fy at the table's three rows (280, 420, 520 MPa or 40, 60, 75 ksi:
// `rows`), linear between them, the end rows beyond: exterior panels
// without edge beams 33, 30, 28; interior panels 36, 33, 31.
double flat_slab_thickness_divisor(double fy, const std::array<double, 3>& rows, bool exterior);
// 6.4.3.2: pattern live load on two-way slabs only where L > 0.75 D.
bool two_way_pattern_loading_required(double L, double D);
// 6.4.3.2: the fraction of the factored live load the patterns carry.
inline constexpr double two_way_pattern_live_fraction = 0.75;
// 25.2.1: clear spacing of parallel bars in a layer ≥ max(25 mm, db, 4/3 dagg).
double minimum_clear_bar_spacing(double db, double aggregate);
double service_steel_stress(double fy);                   // 24.3.2.1: fs = 2/3 fy
// 24.3.2: s ≤ min(380 (280/fs) − 2.5 cc, 300 (280/fs)).
double crack_control_spacing(double fs, double clear_cover);
double shrinkage_temperature_steel(double b, double h);   // 24.4.3.2: 0.0018 Ag
double max_shrinkage_bar_spacing(double h);               // 24.4.3.3: min(5h, 450)

// ---- Development and splices of straight bars in tension (25.4, 25.5, 7.7.3)
// 25.4.2.5 Table: ψt = 1.3 for horizontal bars with more than 300 mm of
// fresh concrete placed below them, else 1.0.
double casting_position_factor(double concrete_below_mm);
constexpr double coating_factor_uncoated = 1.0;             // 25.4.2.5 Table: ψe, uncoated bars
// 25.4.2.5 Table: ψs = 0.8 for No. 19 and smaller, 1.0 for larger (25.4.2.4 only).
double bar_size_factor(double db);
// 25.4.2.5 Table: ψg = 1.0 for Grade 280 and 420, 1.15 for 550 (and the
// in-lb Grade 80, 551.6 MPa), 1.3 for 690.
double reinforcement_grade_factor(double fy);
// 25.4.2.3: ld = fy ψt ψe ψg db / (k λ √f'c) with k = 2.1 (No. 19 and
// smaller) or 1.7 (larger) where clear spacing ≥ 2 db and clear cover
// ≥ db, else 1.4 or 1.1; ψt ψe ≤ 1.7 (25.4.2.2). √f'c as given (≤ 8.3 MPa, 25.4.1.4).
double development_length_simplified(double fy, double root_fc, double psi_t, double psi_e, double psi_g,
                                     double lambda, double db, bool spacing_and_cover_ample);
// 25.4.2.4 (25.4.2.4a): ld = fy ψt ψe ψs ψg db / (1.1 λ √f'c ((cb + Ktr)/db)),
// (cb + Ktr)/db ≤ 2.5, Ktr = 0 (no transverse reinforcement taken).
double development_length_general(double fy, double root_fc, double psi_t, double psi_e, double psi_s,
                                  double psi_g, double lambda, double db, double cb);
constexpr double minimum_development_length_mm = 300.0;     // 25.4.2.1(b)
// 25.5.2.1 Table 25.5.2.1: Class A (1.0 ld) where As,prov/As,req ≥ 2 over
// the lap and at most half the bars are lapped there; Class B (1.3 ld)
// otherwise; not less than 300 mm.
double tension_lap_length(double ld, bool class_a);
// 7.7.3.3: reinforcement extends beyond the point where it is no longer
// required by max(d, 12 db).
double extension_beyond_cutoff(double d, double db);
// 7.7.3.8.2 (value from memory): bottom bars extend at least 150 mm into
// the support; taken past the line of every support.
constexpr double support_embedment_mm = 150.0;

// ---- Standard hooks (25.3, 25.4.3) and bars at zero moment (7.7.3.8.3) -----
// Table 25.3.2 (value from memory): the least inside bend diameter of a
// standard hook, 6 db for No. 10 to No. 25, 8 db for No. 29 to No. 36,
// 10 db for No. 43 and No. 57 (db in mm).
double hook_inside_bend_diameter(double db);
// Table 25.3.1 (value from memory): the straight extension of a 90° standard hook, 12 db.
double hook_extension_90(double db);
// 25.4.3.2 Table (value from memory): ψr = 1.0 for No. 36 and smaller
// hooked bars at centre-to-centre spacing s ≥ 6 db (or confined by ties),
// 1.6 otherwise; any consistent length unit.
constexpr double hook_confinement_factor_none = 1.6;
constexpr double hook_confinement_factor_spaced = 1.0;
double hook_confinement_factor(double spacing, double db);
constexpr double hook_location_factor_side_cover = 1.0;  // 25.4.3.2 Table: ψo, side cover ≥ 6 db
// 25.4.3.2 Table (value from memory): ψc = f'c/105 + 0.6 for f'c below
// 40 MPa, 1.0 from there (the SI edition's break; 0.98 just below it).
double hook_concrete_strength_factor(double fc);
// 25.4.3.1 (value from memory): ldh = the largest of (a) fy ψe ψr ψo ψc
// db^1.5 / (23 λ √f'c), (b) 8 db, (c) 150 mm; MPa, mm.
double hooked_development_length(double fy, double root_fc, double psi_e, double psi_r, double psi_o, double psi_c,
                                 double lambda, double db);
// 7.7.3.8.3 (value from memory): at a simple support or a point of
// inflection, ld of the positive-moment bars ≤ 1.3 Mn/Vu + ℓa where a
// compressive reaction confines their ends, else Mn/Vu + ℓa (any
// consistent units).
double zero_moment_development_limit(double Mn, double Vu, double la, bool confined);
// 7.7.3.8.3 (value from memory): ℓa at a point of inflection is at most the larger of d and 12 db.
double inflection_embedment_limit(double d, double db);

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
