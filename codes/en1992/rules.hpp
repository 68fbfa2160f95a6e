// EN 1992-1-1 / EN 1992-1-2 / EN 1990 rules for one-way solid slabs, one
// small pure function per clause. Units: N, mm, MPa unless a name says
// otherwise. Values of tables are as written in en1992-basis.md (from
// memory of the standards; see the tests for the check values).
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "armature/request.hpp"

namespace armature::en1992 {

// ---- Materials (EN 1992-1-1 3.1, 3.2) ------------------------------------
// "C30/37" → 30; nullopt unless the class is one of Table 3.1.
std::optional<double> fck_of_strength_class(const std::string& name);
double mean_compressive_strength(double fck);           // 3.1.2 Table 3.1: fcm
double mean_tensile_strength(double fck);               // 3.1.2 Table 3.1: fctm
double secant_modulus_MPa(double fck);                  // 3.1.3 Table 3.1: Ecm
double ultimate_compressive_strain(double fck);         // 3.1.3 Table 3.1: εcu2 = εcu3
double stress_block_depth_factor(double fck);           // 3.1.7(3): λ
double stress_block_strength_factor(double fck);        // 3.1.7(3): η
double design_compressive_strength(double fck, double alpha_cc, double gamma_c);  // 3.1.6(1)
double design_yield_strength(double fyk, double gamma_s);                         // 3.2.7(2)

// ---- Actions (EN 1990) ----------------------------------------------------
struct PsiFactors {
  double psi0, psi1, psi2;
};
// Categories of imposed load (EN 1991-1-1 6.3.1.1, 6.3.2.1, 6.3.4.1) that
// EN 1990 Table A1.1 gives ψ for; the values are NDPs of each variant.
constexpr std::array<const char*, 8> imposed_load_categories{"A", "B", "C", "D", "E", "F", "G", "H"};
// Position of a category in imposed_load_categories; nullopt if none.
std::optional<std::size_t> imposed_load_category_index(const std::string& category);

// ---- Load arrangements (EN 1992-1-1 5.1.3) --------------------------------
// (a) alternate spans loaded, both ways; (b) every pair of adjacent spans
// loaded (recommended) or all spans loaded (UK NA).
std::vector<std::vector<bool>> load_arrangements(std::size_t spans, bool adjacent_pairs);
// 5.1.3 read for the bays of a two-way slab: every bay, the two
// checkerboards (alternate bays both ways) and, where the variant's rule
// (b) loads adjacent spans, the bays on both sides of each interior line.
std::vector<std::vector<bool>> bay_load_arrangements(std::size_t bays_x, std::size_t bays_y, bool adjacent_pairs);
// 9.3.1.2(2): top steel at simple supports for 25 % of the span moment.
constexpr double partial_fixity_fraction = 0.25;
// 5.5(4): δ ≥ k5 for ductility classes B and C, k6 for class A (NDPs;
// recommended 0.7 and 0.8, which the UK NA keeps: value from memory).
double minimum_redistribution_ratio(DuctilityClass ductility, double k5, double k6);
// 5.5(4) b): adjacent spans in the ratio 0.5 to 2 (ends included).
bool adjacent_span_ratio_allows_redistribution(double span_a, double span_b);

// ---- Bending (EN 1992-1-1 6.1, 5.5) ---------------------------------------
// 5.5(4): k2 or k4 = factor × (0.6 + 0.0014/εcu2).
double redistribution_coefficient(double factor, double eps_cu2);
// 5.5(4) (5.10a), (5.10b) rearranged: the largest xu/d at ratio δ,
// (δ − k1)/k2 (k3, k4 above C50/60).
double redistribution_neutral_axis_limit(double delta, double k1, double k2);
// Limiting xu/d from δ ≥ k1 + k2 xu/d, capped (0.45 to C50/60, 0.35 above:
// common practice).
double limiting_neutral_axis_ratio(double delta, double k1, double k2, double fck);
// 3.1.7(3), 6.1: neutral axis depth of As at fyd with the rectangular
// block, xu = As fyd / (λ η fcd b).
double neutral_axis_depth(double As, double fyd, double fcd, double eta, double lambda, double b);
// K' = η (αcc/γc) λ ξ (1 − λ ξ / 2): limit of K for a singly reinforced section.
double limiting_K(double eta, double alpha_cc, double gamma_c, double lambda, double xi);
double moment_factor_K(double M_Nmm, double b, double d, double fck);  // K = M/(b d² fck)
// z = d [0.5 + √(0.25 − K/(2 η αcc/γc))] ≤ 0.95 d (the cap: common practice).
double lever_arm(double d, double K, double eta, double alpha_cc, double gamma_c);
double required_tension_steel(double M_Nmm, double fyd, double z);  // As = M/(fyd z)
// Resistance of As with the rectangular block, z ≤ 0.95 d: MRd = As fyd z.
double moment_resistance(double As, double fyd, double fcd, double eta, double b, double d);

// ---- Detailing (EN 1992-1-1 9.2.1.1, 9.3.1.1, 8.2) -----------------------
double minimum_tension_steel(double fctm, double fyk, double b, double d);  // 9.2.1.1(1)
double maximum_steel(double b, double h);                                   // 9.2.1.1(3)
double max_main_bar_spacing_max_moment(double h);          // 9.3.1.1(3): min(2h, 250)
double max_distribution_bar_spacing_max_moment(double h);  // 9.3.1.1(3): min(3h, 400)
double minimum_distribution_steel(double main_As_prov);    // 9.3.1.1(2): 20 %
double minimum_clear_bar_spacing(double phi, double aggregate);  // 8.2(2)

// ---- Anchorage and laps (EN 1992-1-1 8.4, 8.7, 9.2.1) ----------------------
// 3.1.6(2) (3.16), Table 3.1: fctd = αct fctk,0.05/γc, fctk,0.05 = 0.7 fctm.
double design_tensile_strength(double fctm, double alpha_ct, double gamma_c);
// 8.4.2(2): for bond, fctk,0.05 is limited to the value of C60/75 (higher
// strengths are more brittle); taken here on fctm, of which it is 0.7.
double bond_mean_tensile_strength(double fctm);
// 8.4.2(2), Figure 8.2 (b)–(d): a horizontal bar is in good bond in a
// member up to 250 mm deep; deeper, good within 250 mm of the bottom,
// and (over 600 mm) anywhere more than 300 mm below the top.
bool good_bond_position(double h, double height_above_bottom);
double bond_quality_factor(bool good_bond);                 // 8.4.2(2): η1 = 1.0 good, 0.7 poor
double bar_size_bond_factor(double phi);                    // 8.4.2(2): η2 = 1.0, (132 − φ)/100 for φ > 32
double design_bond_stress(double eta1, double eta2, double fctd);  // 8.4.2(2) (8.2): fbd = 2.25 η1 η2 fctd
// 8.4.3(2) (8.3): lb,rqd = (φ/4)(σsd/fbd).
double basic_anchorage_length(double phi, double sigma_sd, double fbd);
// 8.4.4(1) Table 8.2: α2 = 1 − 0.15 (cd − φ)/φ for a straight bar in
// tension, within 0.7 to 1.0; cd = min(a/2, c1, c) (Figure 8.3 a).
double cover_factor_straight(double cd, double phi);
// 8.4.4(1) (8.5): lb,min = max(0.3 lb,rqd, 10 φ, 100 mm) in tension.
double minimum_anchorage_length(double lb_rqd, double phi);
// 8.4.4(1) (8.4): lbd = α1 α2 α3 α4 α5 lb,rqd, α2 α3 α5 ≥ 0.7, ≥ lb,min.
double design_anchorage_length(double alpha1, double alpha2, double alpha3, double alpha4, double alpha5,
                               double lb_rqd, double lb_min);
// 8.7.3(1) Table 8.3 and (8.11 note): α6 = (ρ1/25)^0.5 within 1.0 to 1.5,
// ρ1 the percentage of bars lapped within 0.65 l0 of the lap's centre.
double lap_share_factor(double percent_lapped);
// 8.7.3(1) (8.11): l0,min = max(0.3 α6 lb,rqd, 15 φ, 200 mm).
double minimum_lap_length(double alpha6, double lb_rqd, double phi);
// 8.7.3(1) (8.10): l0 = α1 α2 α3 α5 α6 lb,rqd ≥ l0,min (α2 α3 α5 ≥ 0.7).
double design_lap_length(double alpha1, double alpha2, double alpha3, double alpha5, double alpha6,
                         double lb_rqd, double l0_min);
// 9.2.1.3(2), 9.3.1.1(4): the shift al = d in slabs without shear reinforcement.
double tensile_force_shift(double d);
// 9.2.1.4(2) (9.3): FE = |VEd| al/z + NEd, z = 0.9 d (common practice), NEd = 0.
double end_support_tensile_force(double V_Ed, double al, double z);
// 9.2.1.5(1): bottom bars at an interior support run at least 10 φ past
// the face (straight bars).
double interior_support_minimum_embedment(double phi);
// 9.3.1.2(2): top steel at a simple end support runs at least 0.2 of the
// adjacent span from the face of the support.
double partial_fixity_bar_extent(double span);
// 8.3(2) Table 8.1N (value from memory): the least mandrel diameter of a
// bend or hook, φm,min = 4 φ for φ ≤ 16 mm, 7 φ for φ > 16 mm.
double minimum_mandrel_diameter(double phi);
// 8.4.4(1) Table 8.2 (value from memory): α1 = 0.7 for a bent or hooked
// bar in tension where cd > 3 φ (cd of Figure 8.3 b, c), else 1.0.
double shape_factor_bent(double cd, double phi);
// 8.4.4(2): the equivalent anchorage length of a standard bend (Figure
// 8.1 b), lb,eq = α1 lb,rqd, measured from the section to the outside of
// the bend.
double equivalent_anchorage_length_bent(double alpha1, double lb_rqd);
// Figure 8.1 b (value from memory): the straight extension past a
// standard bend, 5 φ.
double standard_bend_extension(double phi);
// 8.3(3) (8.1) (value from memory): the least mandrel diameter against
// failure of the concrete inside the bend, φm,min = Fbt (1/ab + 1/(2φ)) /
// fcd, Fbt (N) the bar's force at the start of the bend, ab (mm) half the
// centre-to-centre spacing of the bars perpendicular to the plane of the
// bend (cover + φ/2 next to a face), fcd (MPa).
double bend_bearing_mandrel_diameter(double Fbt, double ab, double phi, double fcd);
// EN 1992-1-2 5.7.4(2) (value from memory): in a flat slab of fire
// resistance REI 90 and above, at least 20 % of the top reinforcement in
// each direction over the intermediate supports runs continuous over the
// full span, in the column strip; below REI 90, none (0).
double fire_continuous_top_share(int minutes);

// ---- Crack control (EN 1992-1-1 7.3) --------------------------------------
bool crack_check_needed(double h);  // 7.3.3(1): none for h ≤ 200 mm
// σs,qp ≈ fyd (n_qp/n_uls)(As,req/As,prov)/δ (common practice estimate).
double quasi_permanent_steel_stress(double fyd, double qp_to_uls, double As_req, double As_prov,
                                    double delta);
// Table 7.2N φ*s and Table 7.3N s_max for wk 0.4, 0.3 or 0.2 mm; linear
// interpolation; below the first row the first row; nullopt past the table.
std::optional<double> max_bar_diameter_table_7_2N(double sigma_s, double wk);
std::optional<double> max_bar_spacing_table_7_3N(double sigma_s, double wk);
// 7.3.2(2) (7.2): kc = 0.4 for bending of a rectangular section (σc = 0).
constexpr double kc_bending_rectangular = 0.4;
// (7.6N) with kc = 0.4, hcr = h/2: φs = φ*s (fctm/2.9) kc hcr / (2 (h − d)).
double adjusted_max_bar_diameter(double phi_star, double fctm, double h, double d);
// 7.3.2(2): k = 1.0 for h ≤ 300 mm, 0.65 for h ≥ 800 mm, linear between.
double crack_control_depth_factor(double h);
// 7.3.2(2): Act of a rectangular section in bending, the tension half b h/2
// (uncracked, neutral axis at mid-depth, steel ignored).
double tension_zone_area_rectangular_bending(double b, double h);
// 7.3.2(2) (7.1): As,min = kc k fct,eff Act / σs.
double minimum_crack_control_steel(double kc, double k, double fct_eff, double A_ct, double sigma_s);

// ---- Crack width by calculation (EN 1992-1-1 7.3.4) ------------------------
// 3.2.7(4): design value of the modulus of elasticity of reinforcing steel.
constexpr double steel_modulus_MPa = 200000.0;
// 7.3.4(2): kt for long-term loading.
constexpr double kt_long_term = 0.4;
// 7.3.4(3): k1 for bars of high bond, k2 for bending.
constexpr double k1_high_bond = 0.8;
constexpr double k2_bending = 0.5;
// 7.3.4(3) Note: recommended values of the NDPs k3 and k4 (the UK NA
// keeps them: value from memory).
constexpr double k3_crack_spacing = 3.4;
constexpr double k4_crack_spacing = 0.425;
// Cracked rectangular section, concrete in tension ignored, steel As at
// depth d transformed by αe: x = d(−αe ρ + √((αe ρ)² + 2 αe ρ)), ρ = As/(b d).
double cracked_neutral_axis_depth(double alpha_e, double As, double b, double d);
// Steel stress of the cracked section under M: σs = M / (As (d − x/3)).
double cracked_steel_stress(double M_Nmm, double As, double d, double x);
// 7.3.2(3): hc,ef = min(2.5 (h − d), (h − x)/3, h/2).
double effective_tension_depth(double h, double d, double x);
// 7.3.4(2) (7.10): ρp,eff = As / Ac,eff (no prestressing steel).
double effective_reinforcement_ratio(double As, double Ac_eff);
// 7.3.4(2) (7.9): εsm − εcm = max((σs − kt fct,eff/ρp,eff (1 + αe ρp,eff))/Es, 0.6 σs/Es).
double mean_strain_difference(double sigma_s, double kt, double fct_eff, double rho_p_eff, double alpha_e,
                              double Es);
// 7.3.4(3) (7.11): sr,max = k3 c + k1 k2 k4 φ / ρp,eff.
double max_crack_spacing(double k3, double c, double k1, double k2, double k4, double phi, double rho_p_eff);
// 7.3.4(3): (7.11) holds for a bonded spacing up to 5 (c + φ/2).
double bonded_spacing_limit(double c, double phi);
// 7.3.4(3) (7.14): sr,max = 1.3 (h − x) beyond that spacing.
double max_crack_spacing_wide(double h, double x);
// 7.3.4(1) (7.8): wk = sr,max (εsm − εcm).
double crack_width(double sr_max, double strain_difference);

// ---- Deflection (EN 1992-1-1 7.4.2) ---------------------------------------
enum class StructuralSystem { simply_supported, end_span, interior_span, cantilever, flat_slab };
double reference_reinforcement_ratio(double fck);      // ρ0 = √fck × 10⁻³
double structural_system_factor(StructuralSystem s);   // Table 7.4N: K
// (7.16a) for ρ ≤ ρ0, (7.16b) otherwise.
double basic_span_depth_ratio(double K, double fck, double rho, double rho_compression);
double long_span_factor(double span_mm);               // 7.4.2(2): 7/leff beyond 7 m
double flat_slab_long_span_factor(double span_mm);     // 7.4.2(2): 8.5/leff beyond 8.5 m
// UK NA Table NA.5 Note 6 (A1:2009): l/d allowed ≤ cap_K × K; no cap when nullopt.
double capped_span_depth_ratio(double allowed, double K, std::optional<double> cap_K);
// 7.4.2(2), (7.17): 310/σs ≈ (500/fyk)(As,prov/As,req), capped.
double steel_stress_factor(double fyk, double As_prov, double As_req, double cap);

// ---- Deflection by calculation (EN 1992-1-1 7.4.3) ------------------------
// 7.4.3(5) (7.20): Ec,eff = Ecm / (1 + φ(∞, t0)).
double effective_modulus(double Ecm, double phi);
// A rectangular section b × h with one layer As at depth d transformed by
// αe (concrete in tension ignored or not); x from the compression face, I
// about the centroid, S = As (d − x) the steel's first moment about it.
struct TransformedSection {
  double x = 0.0, I = 0.0, S = 0.0;
};
// Uncracked: b h plus (αe − 1) As at d.
TransformedSection uncracked_section(double b, double h, double As, double d, double alpha_e);
// Fully cracked: x from b x²/2 = αe As (d − x), I = b x³/3 + αe As (d − x)².
TransformedSection cracked_section(double b, double As, double d, double alpha_e);
// 7.4.3(3): cracking moment Mcr = fctm I_I / (h − x_I) (fctm, not fctm,fl).
double cracking_moment(double fctm, const TransformedSection& uncracked, double h);
// 7.4.3(3) (7.19): ζ = 1 − β (Mcr/M)², 0 for M ≤ Mcr; β = 0.5 sustained.
constexpr double beta_sustained = 0.5;
double distribution_coefficient(double M, double Mcr, double beta);
// 7.4.3(3) (7.18): α = ζ αII + (1 − ζ) αI.
double interpolated_parameter(double zeta, double cracked, double uncracked);
// 7.4.3(6) (7.21): 1/r_cs = εcs αe S / I.
double shrinkage_curvature(double eps_cs, double alpha_e, const TransformedSection& s);
// 7.4.1(4), (5): span/250 for the total, span/500 after the partitions.
constexpr double total_deflection_span_ratio = 250.0;
constexpr double partitions_deflection_span_ratio = 500.0;

// 7.4.3: the section of a span for its long-term curvature under one creep
// coefficient and shrinkage strain (7.4.3): both states, Mcr, the
// shrinkage curvatures.
struct LongTermSection {
  double Ec_eff = 0.0, alpha_e = 0.0, eps_cs = 0.0;
  TransformedSection uncracked, cracked;
  double Mcr = 0.0, kcs_I = 0.0, kcs_II = 0.0;
  // 1/r (1/mm, sagging positive) under M (N·mm, sagging positive); the
  // span's bottom bars wherever the moment acts (their own and the
  // shrinkage curvature keep the sagging sense), ζ at each section.
  double curvature(double M) const;
};
LongTermSection long_term_section(double b, double h, double As, double d, double Ecm, double fctm, double phi,
                                  double eps_cs);

// ---- Creep and shrinkage (EN 1992-1-1 3.1.4, Annex B) -----------------------
enum class Cement { S, N, R };
// 3.1.4(5), (B.6): h0 = 2 Ac / u.
double notional_size(double Ac, double u);
// (B.3a), (B.3b): φRH.
double creep_humidity_factor(double RH, double h0, double fcm);
// (B.4): β(fcm) = 16.8 / √fcm.
double creep_strength_factor(double fcm);
// (B.5): β(t0) = 1 / (0.1 + t0^0.20).
double creep_loading_age_factor(double t0);
// (B.9): t0 adjusted for the cement class, ≥ 0.5 days (α = −1, 0, 1).
double cement_adjusted_age(double t0_T, Cement cement);
// (B.2): φ0 = φRH β(fcm) β(t0).
double notional_creep_coefficient(double phi_RH, double beta_fcm, double beta_t0);
// (B.8a), (B.8b): βH.
double creep_humidity_time_factor(double RH, double h0, double fcm);
// (B.7): βc(t, t0) = ((t − t0)/(βH + t − t0))^0.3.
double creep_development(double t, double t0, double beta_H);
// (B.11), (B.12): εcd,0 (positive).
double basic_drying_shrinkage(double fcm, double RH, Cement cement);
// Table 3.3: kh by h0, linear between the rows.
double shrinkage_size_factor(double h0);
// (3.10): βds(t, ts) = (t − ts) / ((t − ts) + 0.04 √(h0³)).
double drying_shrinkage_development(double t, double ts, double h0);
// (3.12): εca(∞) = 2.5 (fck − 10) × 10⁻⁶.
double final_autogenous_shrinkage(double fck);
// (3.13): βas(t) = 1 − exp(−0.2 t^0.5).
double autogenous_shrinkage_development(double t);

// ---- Support moments (EN 1992-1-1 5.3.2.2) ---------------------------------
// 5.3.2.2(3) Note (value from memory): the moment at the face of a monolithic
// support is at least 0.65 of the full fixed-end moment.
constexpr double face_moment_fixed_end_fraction = 0.65;
// 5.3.2.2(3): monolithic support, design moment at the face, not below
// 0.65 M_fixed_end (hogging magnitudes).
double monolithic_support_design_moment(double M_face, double M_fixed_end);
// 5.3.2.2(4) (5.9): ΔM_Ed = F_Ed,sup t/8, support giving no rotational restraint.
double support_moment_reduction(double F_sup, double t);

// ---- Shear (EN 1992-1-1 6.2.2) --------------------------------------------
double shear_depth_factor(double d);                    // k = 1 + √(200/d) ≤ 2
// UK NA to 3.1.2(2)P (from memory): fck used for VRd,c and vmin, min(fck, cap); fck when nullopt.
double shear_strength_fck(double fck, std::optional<double> cap_MPa);
double minimum_shear_strength(double k, double fck, double v_min_factor);  // (6.3N)
// (6.2a)/(6.2b) without axial force: VRd,c in N for width b.
double shear_resistance_without_links(double C_Rd_c, double k, double rho_l, double fck,
                                      double v_min, double b, double d);

// ---- Cover (EN 1992-1-1 4.4.1) --------------------------------------------
bool is_exposure_class(const std::string& exposure);
// Table 4.3N: S4, +2 beyond 50 years, −1 slab geometry, −1 strength; S1–S6.
int structural_class(double design_life_years, const std::string& exposure, double fck);
double minimum_cover_durability(int structural_class, const std::string& exposure);  // Table 4.4N
double minimum_cover_bond(double phi, double aggregate);  // Table 4.2: φ (+5 if dg > 32)
double minimum_cover(double c_min_b, double c_min_dur);   // (4.2) without additions
double round_up_to_5(double x);

// ---- Fire (EN 1992-1-2 5.7.2, Table 5.8, one-way slabs) -------------------
bool is_tabulated_fire_resistance(int minutes);
double fire_min_thickness(int minutes);       // hs
double fire_min_axis_distance(int minutes);   // a
double fire_min_thickness_flat(int minutes);      // Table 5.9: hs of a flat slab
double fire_min_axis_distance_flat(int minutes);  // Table 5.9: a of a flat slab
// Table 5.8 columns 4 and 5: two-way slabs supported on four edges, by
// ly/lx (≤ 1.5: column 4; ≤ 2.0: column 5); above 2 the one-way column 3.
double fire_min_axis_distance_two_way(int minutes, double ly_over_lx);
int fire_two_way_column(double ly_over_lx);

}  // namespace armature::en1992
