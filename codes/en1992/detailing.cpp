// DetailingRules of EN 1992-1-1: the shift (9.2.1.3), anchorage (8.4),
// end and interior supports (9.2.1.4, 9.2.1.5) and laps (8.7.3) of
// straight bars in slabs without shear reinforcement, and the standard
// bend (8.3, 8.4.4(2)) where a straight anchorage does not fit, each with
// its steps.
#include <algorithm>
#include <numbers>
#include <string>

#include "checker.hpp"

namespace armature::en1992 {

namespace {
// 8.4.4(1) Table 8.2: α1 = 1.0 for a straight bar; α3 = 1.0 (the
// distribution bars are not counted as transverse reinforcement: common
// practice, conservative); α4 = 1.0 (no welded transverse bars); α5 = 1.0
// (no transverse pressure is taken, even where the support's width is
// given: the pressure over it is not worked out).
constexpr double alpha1_straight = 1.0;
constexpr double alpha3_none = 1.0;
constexpr double alpha4_none = 1.0;
constexpr double alpha5_none = 1.0;
// 9.2.1.3(2): z = 0.9 d for the force to anchor at an end support (common practice).
constexpr double lever_arm_fraction = 0.9;
}  // namespace

Checker::BasicAnchorage Checker::basic_anchorage(Steps& st, const BarDetailDemand& bar, double sigma_sd,
                                                 bool straight) const {
  const double phi = bar.diameter_mm;
  const double h = req_.slab.thickness_mm;
  const double above_bottom = bar.face == Face::bottom ? bar.cover_mm + phi / 2.0 : h - bar.cover_mm - phi / 2.0;
  const bool by_position = good_bond_position(h, above_bottom);
  const bool good = bar.bond == BondChoice::automatic ? by_position : bar.bond == BondChoice::good;
  const double fctm = bond_mean_tensile_strength(m_.fctm);
  if (fctm < m_.fctm)
    st.add("fctm for bond", "fctm of C60/75 (fctk,0.05 limited to the C60/75 value for bond)", "", fctm, "MPa",
           "EN 1992-1-1 8.4.2(2)");
  const double fctd = design_tensile_strength(fctm, ndp_.alpha_ct, ndp_.gamma_c);
  st.add("fctd", "αct 0.7 fctm / γc",
         num(ndp_.alpha_ct) + " × 0.7 × " + num(fctm) + " / " + num(ndp_.gamma_c), fctd, "MPa",
         "EN 1992-1-1 3.1.6(2)");
  const double eta1 = bond_quality_factor(good);
  std::string why = bar.bond == BondChoice::automatic
                        ? std::string(good ? "good" : "poor") + " bond: bar " + num(above_bottom) +
                              " mm above the bottom of a " + num(h) + " mm slab"
                        : std::string(good ? "good" : "poor") + " bond as the request states";
  st.add("η1", why, "", eta1, "-", "EN 1992-1-1 8.4.2(2), Figure 8.2");
  const double eta2 = bar_size_bond_factor(phi);
  st.add("η2", phi <= 32.0 ? "1.0 for φ ≤ 32 mm" : "(132 − φ)/100", "", eta2, "-", "EN 1992-1-1 8.4.2(2)");
  const double fbd = design_bond_stress(eta1, eta2, fctd);
  st.add("fbd", "2.25 η1 η2 fctd", "2.25 × " + num(eta1) + " × " + num(eta2) + " × " + num(fctd), fbd, "MPa",
         "EN 1992-1-1 8.4.2(2) (8.2)");
  const double lb_rqd = basic_anchorage_length(phi, sigma_sd, fbd);
  st.add("lb,rqd", "(φ/4)(σsd/fbd)", "(" + num(phi) + "/4) × (" + num(sigma_sd) + "/" + num(fbd) + ")", lb_rqd,
         "mm", "EN 1992-1-1 8.4.3(2) (8.3)");
  if (!straight) return {fbd, lb_rqd, 1.0};  // a bent bar: its own cd and α1 (hooked_anchorage)
  const double clear = bar.spacing_mm - phi;
  const double cd = std::min(clear / 2.0, bar.cover_mm);
  st.add("cd", "min(a/2, c) (a clear spacing, c cover; no side edge in a strip)",
         "min(" + num(clear) + "/2, " + num(bar.cover_mm) + ")", cd, "mm", "EN 1992-1-1 Figure 8.3");
  const double alpha2 = cover_factor_straight(cd, phi);
  st.add("α2", "1 − 0.15 (cd − φ)/φ, 0.7 ≤ α2 ≤ 1.0",
         "1 − 0.15 × (" + num(cd) + " − " + num(phi) + ")/" + num(phi), alpha2, "-", "EN 1992-1-1 Table 8.2");
  return {fbd, lb_rqd, alpha2};
}

DetailLength Checker::shift(const BarDetailDemand& bar) const {
  Steps st;
  const double al = tensile_force_shift(bar.d_mm);
  st.add("al", "d (slab without shear reinforcement)", "", al, "mm", "EN 1992-1-1 9.2.1.3(2), 9.3.1.1(4)");
  return {al, "EN 1992-1-1 9.2.1.3(2)", st.take()};
}

DetailLength Checker::anchorage(const BarDetailDemand& bar) const {
  Steps st;
  st.add("σsd", "fyd (the bar at its design strength)", "", m_.fyd, "MPa", "EN 1992-1-1 8.4.3(2)");
  const BasicAnchorage b = basic_anchorage(st, bar, m_.fyd);
  const double lb_min = minimum_anchorage_length(b.lb_rqd, bar.diameter_mm);
  st.add("lb,min", "max(0.3 lb,rqd, 10 φ, 100 mm)",
         "max(0.3 × " + num(b.lb_rqd) + ", 10 × " + num(bar.diameter_mm) + ", 100)", lb_min, "mm",
         "EN 1992-1-1 8.4.4(1) (8.6)");
  const double lbd = design_anchorage_length(alpha1_straight, b.alpha2, alpha3_none, alpha4_none, alpha5_none,
                                             b.lb_rqd, lb_min);
  st.add("lbd", "α1 α2 α3 α4 α5 lb,rqd ≥ lb,min (α1 = α3 = α4 = α5 = 1, straight bar)",
         "max(" + num(b.alpha2) + " × " + num(b.lb_rqd) + ", " + num(lb_min) + ")", lbd, "mm",
         "EN 1992-1-1 8.4.4(1) (8.4)");
  return {lbd, "EN 1992-1-1 8.4.4", st.take()};
}

double Checker::end_support_stress(Steps& st, const BarDetailDemand& bar) const {
  const double al = tensile_force_shift(bar.d_mm);
  const double z = lever_arm_fraction * bar.d_mm;
  const double FE = end_support_tensile_force(bar.V_Ed_N, al, z);
  st.add("FE", "|VEd| al / z (al = d, z = 0.9 d)",
         num(bar.V_Ed_N * 1e-3) + " × " + num(al) + " / " + num(z), FE * 1e-3, "kN", "EN 1992-1-1 9.2.1.4(2) (9.3)");
  const double sigma = std::min(FE / bar.As_prov_mm2, m_.fyd);
  st.add("σsd", "FE / As ≤ fyd", num(FE) + " / " + num(bar.As_prov_mm2), sigma, "MPa", "EN 1992-1-1 9.2.1.4(3)");
  return sigma;
}

DetailLength Checker::end_support_anchorage(const BarDetailDemand& bar) const {
  Steps st;
  const double sigma = end_support_stress(st, bar);
  const BasicAnchorage b = basic_anchorage(st, bar, sigma);
  // lb,min from lb,rqd at fyd: the bar's full strength (conservative choice, DEVELOPERS.md).
  const double lb_rqd_full = basic_anchorage_length(bar.diameter_mm, m_.fyd, b.fbd);
  const double lb_min = minimum_anchorage_length(lb_rqd_full, bar.diameter_mm);
  st.add("lb,min", "max(0.3 lb,rqd(fyd), 10 φ, 100 mm)",
         "max(0.3 × " + num(lb_rqd_full) + ", 10 × " + num(bar.diameter_mm) + ", 100)", lb_min, "mm",
         "EN 1992-1-1 8.4.4(1) (8.6)");
  const double lbd = design_anchorage_length(alpha1_straight, b.alpha2, alpha3_none, alpha4_none, alpha5_none,
                                             b.lb_rqd, lb_min);
  st.add("lbd", "α1 α2 α3 α4 α5 lb,rqd ≥ lb,min, past the support's face, or its line where no width is given "
         "(all span bars run to the support)",
         "max(" + num(b.alpha2) + " × " + num(b.lb_rqd) + ", " + num(lb_min) + ")", lbd, "mm",
         "EN 1992-1-1 9.2.1.4(3), 9.3.1.2(1)");
  return {lbd, "EN 1992-1-1 9.2.1.4, 9.3.1.2", st.take()};
}

DetailLength Checker::interior_support_embedment(const BarDetailDemand& bar) const {
  Steps st;
  const double l = interior_support_minimum_embedment(bar.diameter_mm);
  st.add("l", "10 φ (straight bottom bars past an interior support)", "10 × " + num(bar.diameter_mm), l, "mm",
         "EN 1992-1-1 9.2.1.5(1)");
  return {l, "EN 1992-1-1 9.2.1.5", st.take()};
}

DetailLength Checker::end_top_bar_extent(const BarDetailDemand&, double span_mm) const {
  Steps st;
  const double l = partial_fixity_bar_extent(span_mm);
  st.add("l", "0.2 × the adjacent span (from the support's face, or its line where no width is given)",
         "0.2 × " + num(span_mm), l, "mm", "EN 1992-1-1 9.3.1.2(2)");
  return {l, "EN 1992-1-1 9.3.1.2(2)", st.take()};
}

// A standard bend (Figure 8.1 b, 90°) at the end of a bar whose straight
// anchorage does not fit: the equivalent anchorage lb,eq = α1 lb,rqd of
// 8.4.4(2), measured from the section to the outside of the bend, at the
// stress the bar carries there (FE/As at an end support, else fyd); the
// least mandrel of Table 8.1N and the tail of Figure 8.1 b.
DetailLength Checker::hooked_anchorage(const BarDetailDemand& bar) const {
  Steps st;
  const double phi = bar.diameter_mm;
  double sigma = m_.fyd;
  if (bar.at_end_support) {
    sigma = end_support_stress(st, bar);
  } else if (bar.As_req_mm2 > 0.0 && bar.As_req_mm2 < bar.As_prov_mm2) {
    // 8.4.3(2): the design stress where the anchorage starts, the face:
    // the region's design needs As,req of the As,prov there (the nominal
    // top bars at a pinned end, sized by minimum steel, work far below fyd).
    sigma = m_.fyd * bar.As_req_mm2 / bar.As_prov_mm2;
    st.add("σsd", "fyd As,req/As,prov (the stress the design asks of the bars at the face)",
           num(m_.fyd) + " × " + num(bar.As_req_mm2) + "/" + num(bar.As_prov_mm2), sigma, "MPa", "EN 1992-1-1 8.4.3(2)");
  } else {
    st.add("σsd", "fyd (the bar at its design strength)", "", m_.fyd, "MPa", "EN 1992-1-1 8.4.3(2)");
  }
  const BasicAnchorage b = basic_anchorage(st, bar, sigma, false);
  const double phi_m = minimum_mandrel_diameter(phi);
  st.add("φm,min", phi <= 16.0 + 1e-9 ? "4 φ (φ ≤ 16 mm)" : "7 φ (φ > 16 mm)",
         (phi <= 16.0 + 1e-9 ? "4 × " : "7 × ") + num(phi), phi_m, "mm",
         "EN 1992-1-1 8.3(2) Table 8.1N (value from memory)");
  const double cd = (bar.spacing_mm - phi) / 2.0;
  st.add("cd", "min(a/2, c1): a/2 (c1, the cover beside the plane of the bend, is a slab edge's: none in a strip)",
         "(" + num(bar.spacing_mm) + " − " + num(phi) + ")/2", cd, "mm", "EN 1992-1-1 Figure 8.3 b");
  const double alpha1 = shape_factor_bent(cd, phi);
  st.add("α1", cd > 3.0 * phi ? "0.7 (bent bar, cd > 3 φ)" : "1.0 (bent bar, cd ≤ 3 φ)",
         num(cd) + (cd > 3.0 * phi ? " > 3 × " : " ≤ 3 × ") + num(phi), alpha1, "-",
         "EN 1992-1-1 8.4.4(1) Table 8.2 (value from memory)");
  // lb,min as for a straight bar (lb,rqd at fyd: the bar's full strength),
  // so that a bend never anchors with less than a straight bar would need
  // (8.4.4(2) is silent; a second reading found bends of 40 mm otherwise).
  const double lb_rqd_full = basic_anchorage_length(phi, m_.fyd, b.fbd);
  const double lb_min = minimum_anchorage_length(lb_rqd_full, phi);
  st.add("lb,min", "max(0.3 lb,rqd(fyd), 10 φ, 100 mm)",
         "max(0.3 × " + num(lb_rqd_full) + ", 10 × " + num(phi) + ", 100)", lb_min, "mm", "EN 1992-1-1 8.4.4(1) (8.6)");
  const double lb_eq = std::max(equivalent_anchorage_length_bent(alpha1, b.lb_rqd), lb_min);
  st.add("lb,eq", "α1 lb,rqd ≥ lb,min, from the face of the support to the outside of the bend",
         "max(" + num(alpha1) + " × " + num(b.lb_rqd) + ", " + num(lb_min) + ")", lb_eq, "mm",
         "EN 1992-1-1 8.4.4(2), Figure 8.1 b");
  const double ext = standard_bend_extension(phi);
  st.add("extension", "5 φ past the bend (90° standard bend)", "5 × " + num(phi), ext, "mm",
         "EN 1992-1-1 Figure 8.1 b (value from memory)");
  // 8.3(3): a bar anchored by more than 5φ past the end of its bend (a leg
  // lengthened to anchor it along the centreline) needs the mandrel of
  // (8.1) against crushing inside the bend; Fbt = As σsd, the whole force
  // at the start of the bend (no bond credited before it), ab = s/2 (the
  // bars side by side across the slab).
  const double area = std::numbers::pi * phi * phi / 4.0;
  const double Fbt = area * sigma;
  st.add("Fbt", "As σsd of one bar at the start of the bend (where the leg anchors more than 5 φ past it)",
         num(area) + " × " + num(sigma), Fbt * 1e-3, "kN", "EN 1992-1-1 8.3(3)");
  const double ab = bar.spacing_mm / 2.0;
  st.add("ab", "half the bars' centre-to-centre spacing, perpendicular to the plane of the bend",
         num(bar.spacing_mm) + "/2", ab, "mm", "EN 1992-1-1 8.3(3)");
  // fcd not above C55/67's (8.3(3), value from memory).
  const double fcd = std::min(m_.fcd, design_compressive_strength(55.0, ndp_.alpha_cc, ndp_.gamma_c));
  const double phi_m_bearing = std::max(phi_m, bend_bearing_mandrel_diameter(Fbt, ab, phi, fcd));
  st.add("φm,min (8.1)", "Fbt (1/ab + 1/(2φ)) / fcd (fcd ≤ that of C55/67), not less than Table 8.1N's",
         num(Fbt) + " × (1/" + num(ab) + " + 1/(2 × " + num(phi) + ")) / " + num(fcd), phi_m_bearing, "mm",
         "EN 1992-1-1 8.3(3) (8.1) (value from memory)");
  DetailLength out{lb_eq, "EN 1992-1-1 8.3, 8.4.4(2)", st.take()};
  out.bend_diameter_mm = phi_m;
  out.extension_mm = ext;
  out.long_leg_bend_diameter_mm = phi_m_bearing;
  // Figure 8.1 a: lb (here lbd = α1 lb,rqd ≥ lb,min, the same length) may
  // be measured along the bar's centreline for any shape: a longer leg
  // counts where the bend measured to its outside falls short.
  out.centreline_clause = "EN 1992-1-1 8.4.4(1), Figure 8.1 a";
  return out;
}

ContinuousTopRule Checker::fire_continuous_top(int minutes) const {
  const double share = fire_continuous_top_share(minutes);
  if (share <= 0.0) return {};
  return {share, "EN 1992-1-2 5.7.4(2)"};
}

DetailLength Checker::lap(const BarDetailDemand& bar) const {
  Steps st;
  st.add("σsd", "fyd (the bar at its design strength)", "", m_.fyd, "MPa", "EN 1992-1-1 8.4.3(2)");
  const BasicAnchorage b = basic_anchorage(st, bar, m_.fyd);
  const double rho1 = 100.0 * bar.lapped_share;
  const double alpha6 = lap_share_factor(rho1);
  st.add("α6", "(ρ1/25)^0.5, 1.0 ≤ α6 ≤ 1.5 (ρ1 % of bars lapped at one section)",
         "(" + num(rho1) + "/25)^0.5", alpha6, "-", "EN 1992-1-1 8.7.3(1) Table 8.3");
  const double l0_min = minimum_lap_length(alpha6, b.lb_rqd, bar.diameter_mm);
  st.add("l0,min", "max(0.3 α6 lb,rqd, 15 φ, 200 mm)",
         "max(0.3 × " + num(alpha6) + " × " + num(b.lb_rqd) + ", 15 × " + num(bar.diameter_mm) + ", 200)",
         l0_min, "mm", "EN 1992-1-1 8.7.3(1) (8.11)");
  const double l0 = design_lap_length(alpha1_straight, b.alpha2, alpha3_none, alpha5_none, alpha6, b.lb_rqd, l0_min);
  st.add("l0", "α1 α2 α3 α5 α6 lb,rqd ≥ l0,min",
         "max(" + num(b.alpha2) + " × " + num(alpha6) + " × " + num(b.lb_rqd) + ", " + num(l0_min) + ")", l0, "mm",
         "EN 1992-1-1 8.7.3(1) (8.10)");
  return {l0, "EN 1992-1-1 8.7.3", st.take()};
}

}  // namespace armature::en1992
