// EN 1992-1-1 section rules: the checks of a section under a region's
// demand (cover, bending, ductility, minimum and maximum steel, spacing,
// cracking, shear without links), the nominal cover, the search's limits
// and the distribution steel.
#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "checker.hpp"

namespace armature::en1992 {

double Checker::nominal_cover_mm(Face face, double bar_diameter_mm) const {
  return cover_for(bar_diameter_mm, face).c_nom;
}

double Checker::max_spacing_mm(const RegionDemand&) const {
  return max_main_bar_spacing_max_moment(req_.slab.thickness_mm);
}

// Below this area the bar fails bending or minimum steel, as checked in
// check_section: the larger of As,min (9.2.1.1) and the As,req of bending
// (6.1), where M_Rd = M_Ed (the same equilibrium, and M_Rd grows with
// As); no area passes when K > K'.
double Checker::minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const {
  const double b = req_.slab.strip_width_mm;
  const double d = req_.slab.thickness_mm -
                   cover_for(std::max(bar.diameter_mm, g.cover_bar_mm), g.face).c_nom - bar.diameter_mm / 2.0;
  if (d <= 0.0) return 0.0;  // bending fails unless M_Ed = 0: left to the check
  const double K = moment_factor_K(g.M_Ed, b, d, m_.fck);
  if (K > bending_limit(g.redistribution_delta).K_lim) return std::numeric_limits<double>::infinity();
  const double z = lever_arm(d, K, m_.eta, ndp_.alpha_cc, ndp_.gamma_c);
  const double As_bending = required_tension_steel(g.M_Ed, m_.fyd, z) * (1.0 - 1e-9);  // a rounding margin
  return std::max(minimum_tension_steel(m_.fctm, m_.fyk, b, d), As_bending);
}

SectionOutcome Checker::check_section(const Section& sec, const RegionDemand& g, Detail detail) const {
  SectionOutcome out;
  if (detail != Detail::verdict) out.checks.reserve(8);  // as many as a region has, nearly always
  CheckCollector checks(out.checks, out.verdict, detail);
  const SectionLayer& layer = sec.outer_layer(g.face);
  const BarOption& bar = layer.bar;
  const double h = sec.h_mm, b = sec.b_mm, s = layer.spacing_mm;
  const double phi = bar.diameter_mm, dg = req_.concrete.aggregate_mm;
  const double As_prov = bar.area_mm2 * b / s;

  // Cover (4.4.1), by this face's exposure
  const FaceData& fd = face_data(g.face);
  const std::string& exposure = fd.exposure;
  const int s_class = fd.structural_class;
  const double c_dur = fd.c_min_dur;
  // One nominal cover per face (computed cover): that of the largest bar
  // the kernel has chosen on this face, when larger than this one. A
  // section whose cover is not the one worked out here (the request's, or
  // one a wrapping plug-in sets) is checked as a given cover.
  const double phi_face = std::max(phi, g.cover_bar_mm);
  const bool cover_given = fd.cover_mm.has_value() || layer.cover_mm != cover_for(phi_face, g.face).c_nom;
  const double phi_cover = cover_given ? phi : phi_face;
  const CoverOf cover = cover_for(phi_cover, g.face);
  const double c_bond = cover.c_bond, c_min = cover.c_min, c_req = cover.c_req, c_nom = layer.cover_mm;
  auto cover_steps = [&] {
    Steps st;
    st.add("S", "structural class (S4, life, slab geometry, strength)",
           "S" + std::to_string(s_class) + " for " + exposure + " (" + to_string(g.face) + " face), " +
               num(req_.durability.design_life_years) + " years, fck " + num(m_.fck),
           s_class, "-", "EN 1992-1-1 4.4.1.2 Table 4.3N");
    st.add("c_min,dur", "Table 4.4N (S, exposure)",
           "S" + std::to_string(s_class) + ", " + exposure + " (" + to_string(g.face) + " face)",
           c_dur, "mm", "EN 1992-1-1 4.4.1.2 Table 4.4N");
    st.add("c_min,b", "φ (+5 if dg > 32)",
           num(phi_cover) + (phi_cover > phi ? " mm bar (the largest on this face), dg " : " mm bar, dg ") +
               num(dg),
           c_bond, "mm",
           "EN 1992-1-1 4.4.1.2 Table 4.2");
    st.add("c_min", "max(c_min,b, c_min,dur, 10)", "max(" + num(c_bond) + ", " + num(c_dur) + ", 10)",
           c_min, "mm", "EN 1992-1-1 4.4.1.2 (4.2)");
    st.add("c_min + Δc_dev", "c_min + Δc_dev", num(c_min) + " + " + num(ndp_.delta_c_dev_mm), c_req,
           "mm", variant_ndp("EN 1992-1-1 4.4.1.3(1)P", "delta_c_dev_mm"));
    st.add("c_nom", cover_given ? "given" : "c_min + Δc_dev rounded up to 5 mm",
           cover_given ? "" : num(c_req) + " rounded up", c_nom, "mm", "EN 1992-1-1 4.4.1.1");
    return st.take();
  };
  const double d = layer.d_mm;
  out.As_min_mm2 = minimum_tension_steel(m_.fctm, m_.fyk, b, d);
  out.As_max_mm2 = maximum_steel(b, h);
  if (d <= 0.0) {  // the bar does not fit: nothing can resist
    checks.add("bending", g.where, "EN 1992-1-1 6.1", g.M_Ed * 1e-6, 0.0, "kNm", cover_steps);
    return out;
  }

  // Bending (6.1) and ductility (5.5(4))
  const double delta = g.redistribution_delta;
  const BendingLimit limit = bending_limit(delta);
  const bool normal = limit.normal;
  const double k_a = limit.k_a, k_b = limit.k_b, xi = limit.xi, K_lim = limit.K_lim;
  const double K = moment_factor_K(g.M_Ed, b, d, m_.fck);
  const double z = lever_arm(d, std::min(K, K_lim), m_.eta, ndp_.alpha_cc, ndp_.gamma_c);
  out.As_req_mm2 = required_tension_steel(g.M_Ed, m_.fyd, z);
  const double M_lim = K_lim * m_.fck * b * d * d;
  const double M_Rd = std::min(moment_resistance(As_prov, m_.fyd, m_.fcd, m_.eta, b, d), M_lim);

  // K's substitution, in bending and again in ductility.
  auto K_substituted = [&] {
    return num(g.M_Ed * 1e-6) + " × 10⁶ / (" + num(b) + " × " + num(d) + "² × " + num(m_.fck) + ")";
  };
  // A support with a width: M_Ed at its face (5.3.2.2), derived at the
  // head of the bending steps.
  const bool at_face = g.support_face.width_mm > 0.0;
  const SupportMoment face_moment = at_face && detail != Detail::verdict ? support_moment(g) : SupportMoment{};
  const char* bending_clause = !at_face                  ? "EN 1992-1-1 6.1"
                               : face_moment.reduced_by_4 ? "EN 1992-1-1 6.1; M_Ed 5.3.2.2(4)"
                                                          : "EN 1992-1-1 6.1; M_Ed at the face 5.3.2.2(3)";
  run_check("bending", [&] {
    checks.add("bending", g.where, bending_clause, g.M_Ed * 1e-6, M_Rd * 1e-6, "kNm", [&] {
      // A computed cover is no check of its own: its derivation leads the
      // bending steps, where it sets d.
      Steps st;
      if (at_face) support_moment_steps(st, g, face_moment);
      if (!cover_given)
        for (auto& x : cover_steps()) st.add(x.symbol, x.expression, x.substituted, x.result, x.unit, x.clause);
      st.add("d", "h − c_nom − φ/2", num(h) + " − " + num(c_nom) + " − " + num(phi) + "/2", d, "mm",
             "EN 1992-1-1 6.1");
      st.add("fcd", "αcc fck / γc", num(ndp_.alpha_cc) + " × " + num(m_.fck) + " / " + num(ndp_.gamma_c),
             m_.fcd, "MPa", variant_ndp("EN 1992-1-1 3.1.6(1), 2.4.2.4", "alpha_cc, gamma_c"));
      st.add("fyd", "fyk / γs", num(m_.fyk) + " / " + num(ndp_.gamma_s), m_.fyd, "MPa",
             variant_ndp("EN 1992-1-1 3.2.7(2), 2.4.2.4", "gamma_s"));
      st.add("K", "M_Ed / (b d² fck)", K_substituted(), K, "-", "EN 1992-1-1 6.1");
      st.add("z", "d [0.5 + √(0.25 − K/(2η αcc/γc))] ≤ 0.95 d",
             num(d) + " [0.5 + √(0.25 − " + num(std::min(K, K_lim)) + "/(2 × " + num(m_.eta) + " × " +
                 num(ndp_.alpha_cc) + "/" + num(ndp_.gamma_c) + "))]",
             z, "mm", "EN 1992-1-1 6.1, 3.1.7(3)");
      st.add("As,req", "M_Ed / (fyd z)",
             num(g.M_Ed * 1e-6) + " × 10⁶ / (" + num(m_.fyd) + " × " + num(z) + ")", out.As_req_mm2, "mm2",
             "EN 1992-1-1 6.1");
      st.add("As,prov", "π φ²/4 × b/s", "π × " + num(phi) + "²/4 × " + num(b) + "/" + num(s), As_prov,
             "mm2", "");
      st.add("M_Rd", "min(As fyd z_prov, K' fck b d²), z_prov = d − As fyd/(2η fcd b) ≤ 0.95d",
             num(As_prov) + " × " + num(m_.fyd) + " × z_prov, limit " + num(M_lim * 1e-6) + " kNm",
             M_Rd * 1e-6, "kNm", "EN 1992-1-1 6.1, 3.1.7(3)");
      return st.take();
    });
  });
  run_check("ductility", [&] {
    checks.add("ductility", g.where, "EN 1992-1-1 5.5(4), 6.1", K, K_lim, "-", [&] {
      Steps st;
      st.add("ξ_lim", normal ? "min((δ − k1)/k2, 0.45)" : "min((δ − k3)/k4, 0.35)",
             "min((" + num(delta) + " − " + num(k_a) + ")/" + num(k_b) + ", " + (normal ? "0.45" : "0.35") +
                 ")",
             xi, "-", variant_ndp("EN 1992-1-1 5.5(4)", normal ? "k1, k2_factor" : "k3, k4_factor"));
      st.add("K'", "η (αcc/γc) λ ξ (1 − λ ξ/2)",
             num(m_.eta) + " × " + num(ndp_.alpha_cc) + "/" + num(ndp_.gamma_c) + " × " + num(m_.lambda) +
                 " × " + num(xi) + " × (1 − " + num(m_.lambda) + " × " + num(xi) + "/2)",
             K_lim, "-", variant_ndp("EN 1992-1-1 5.5(4), 6.1, 3.1.6(1)", "alpha_cc, gamma_c"));
      st.add("K", "M_Ed / (b d² fck)", K_substituted(), K, "-", "EN 1992-1-1 6.1");
      return st.take();
    });
  });

  // At a redistributed support, 5.5(4) with the neutral axis of the bars
  // provided: δ ≥ k1 + k2 xu/d, as xu/d ≤ (δ − k1)/k2.
  if (delta < 1.0) {
    run_check("ductility", [&] {
      const double xu_lim = redistribution_neutral_axis_limit(delta, k_a, k_b);
      const double xu = neutral_axis_depth(As_prov, m_.fyd, m_.fcd, m_.eta, m_.lambda, b);
      const char* clause = normal ? "EN 1992-1-1 5.5(4) (5.10a)" : "EN 1992-1-1 5.5(4) (5.10b)";
      checks.add("ductility", g.where, clause, xu / d, xu_lim, "-", [&] {
        const std::string k1 = normal ? "k1" : "k3", k2 = normal ? "k2" : "k4";
        const double factor = normal ? ndp_.k2_factor : ndp_.k4_factor;
        Steps st;
        st.add("δ", "1 − redistribution/100", "1 − " + num(req_.design.redistribution_percent) + "/100", delta,
               "-", "EN 1992-1-1 5.5(4)");
        st.add(k1, "national choice", ndp_.variant, k_a, "-", "EN 1992-1-1 5.5(4)");
        st.add(k2, num(factor) + " (0.6 + 0.0014/εcu2)",
               num(factor) + " × (0.6 + 0.0014/" + num(m_.eps_cu2) + ")", k_b, "-", "EN 1992-1-1 5.5(4)");
        st.add("xu", "As,prov fyd / (λ η fcd b)",
               num(As_prov) + " × " + num(m_.fyd) + " / (" + num(m_.lambda) + " × " + num(m_.eta) + " × " +
                   num(m_.fcd) + " × " + num(b) + ")",
               xu, "mm", "EN 1992-1-1 3.1.7(3), 6.1");
        st.add("xu/d", "xu / d", num(xu) + " / " + num(d), xu / d, "-", "EN 1992-1-1 5.5(4)");
        st.add("(xu/d)max", "(δ − " + k1 + ")/" + k2,
               "(" + num(delta) + " − " + num(k_a) + ")/" + num(k_b), xu_lim, "-", clause);
        return st.take();
      });
    });
  }

  // Minimum and maximum steel (9.2.1.1)
  run_check("min_steel", [&] {
    checks.add("min_steel", g.where, "EN 1992-1-1 9.2.1.1(1), 9.3.1.1(1)", out.As_min_mm2, As_prov,
               "mm2", [&] {
                 Steps st;
                 st.add("fctm", "0.30 fck^(2/3) (≤ C50/60), 2.12 ln(1 + fcm/10) above", "fck = " + num(m_.fck),
                        m_.fctm, "MPa", "EN 1992-1-1 Table 3.1");
                 st.add("As,min", "max(0.26 fctm/fyk, 0.0013) b d",
                        "max(0.26 × " + num(m_.fctm) + "/" + num(m_.fyk) + ", 0.0013) × " + num(b) +
                            " × " + num(d),
                        out.As_min_mm2, "mm2", "EN 1992-1-1 9.2.1.1(1), 9.3.1.1(1)");
                 return st.take();
               });
  });
  run_check("max_steel", [&] {
    checks.add("max_steel", g.where, "EN 1992-1-1 9.2.1.1(3)", As_prov, out.As_max_mm2, "mm2", [&] {
      Steps st;
      st.add("As,max", "0.04 b h", "0.04 × " + num(b) + " × " + num(h), out.As_max_mm2, "mm2",
             "EN 1992-1-1 9.2.1.1(3)");
      return st.take();
    });
  });

  // The bar search needs no more once an arrangement has failed: bending
  // and minimum steel (its fallback) are known by now.
  if (checks.verdict_settled()) return out;

  // Spacing (9.3.1.1(3), 8.2(2))
  run_check("spacing", [&] {
    const double s_max = max_main_bar_spacing_max_moment(h);
    checks.add("spacing", g.where, "EN 1992-1-1 9.3.1.1(3)", s, s_max, "mm", [&] {
      Steps st;
      st.add("s_max,slabs", "min(2h, 250) in areas of maximum moment", "min(2 × " + num(h) + ", 250)",
             s_max, "mm", "EN 1992-1-1 9.3.1.1(3)");
      return st.take();
    });
    const double clear_min = minimum_clear_bar_spacing(phi, dg);
    checks.add("spacing", g.where, "EN 1992-1-1 8.2(2)", clear_min, s - phi, "mm", [&] {
      Steps st;
      st.add("a_min", "max(φ, dg + 5, 20)", "max(" + num(phi) + ", " + num(dg) + " + 5, 20)", clear_min,
             "mm", "EN 1992-1-1 8.2(2)");
      st.add("a", "s − φ", num(s) + " − " + num(phi), s - phi, "mm", "EN 1992-1-1 8.2(2)");
      return st.take();
    });
  });

  if (checks.verdict_settled()) return out;

  // Crack control (7.3.3): by Tables 7.2N/7.3N, or the calculated crack
  // width (7.3.4) in their place where the request asks for it; the
  // minimum steel (7.3.2) either way.
  if (crack_check_needed(h)) {
    const bool calculated = req_.serviceability.crack_width == CrackWidthMethod::calculated;
    if (calculated) run_check("crack_width", [&] { crack_width_check(checks, sec, g); });
    run_check("cracking", [&] {
      if (!calculated) crack_check(checks, g, phi, s, d, out.As_req_mm2, As_prov);
      min_crack_steel_check(checks, g, As_prov);
    });
  }

  // Cover (4.4.1), when the request gives it
  if (cover_given)
    run_check("cover", [&] { checks.add("cover", g.where, "EN 1992-1-1 4.4.1", c_req, c_nom, "mm", cover_steps); });

  // Shear (6.2.2) at the supports where these bars are the tension steel
  for (const auto& sup : g.supports) {
    SupportOutcome so;
    so.where = sup.where;
    so.V_Ed = sup.V_Ed;
    CheckCollector support(so.checks, out.verdict, detail);
    run_check("shear", [&] {
      const double rho_l = As_prov / (b * d);
      const double k = shear_depth_factor(d);
      const double fck_v = shear_strength_fck(m_.fck, ndp_.shear_fck_cap_MPa);
      const double v_min = minimum_shear_strength(k, fck_v, ndp_.v_min_factor);
      const double C = ndp_.C_Rd_c_factor / ndp_.gamma_c;
      so.V_Rd = shear_resistance_without_links(C, k, rho_l, fck_v, v_min, b, d);
      support.add("shear", sup.where, "EN 1992-1-1 6.2.2(1)", sup.V_Ed * 1e-3, so.V_Rd * 1e-3, "kN", [&] {
        Steps st;
        st.add("k", "1 + √(200/d) ≤ 2", "1 + √(200/" + num(d) + ")", k, "-", "EN 1992-1-1 6.2.2(1)");
        st.add("ρl", "Asl/(b d) ≤ 0.02", num(As_prov) + "/(" + num(b) + " × " + num(d) + ")", rho_l, "-",
               "EN 1992-1-1 6.2.2(1)");
        if (ndp_.shear_fck_cap_MPa)
          st.add("fck,v", "min(fck, cap) for VRd,c and v_min",
                 "min(" + num(m_.fck) + ", " + num(*ndp_.shear_fck_cap_MPa) + ")", fck_v, "MPa",
                 variant_ndp("EN 1992-1-1 6.2.2(1); NA to 3.1.2(2)P", "shear_fck_cap_MPa"));
        st.add("CRd,c", "factor / γc", num(ndp_.C_Rd_c_factor) + " / " + num(ndp_.gamma_c), C, "-",
               variant_ndp("EN 1992-1-1 6.2.2(1)", "C_Rd_c_factor, gamma_c"));
        const bool capped = ndp_.shear_fck_cap_MPa.has_value();
        st.add("v_min", num(ndp_.v_min_factor) + (capped ? " k^1.5 fck,v^0.5" : " k^1.5 fck^0.5"),
               num(ndp_.v_min_factor) + " × " + num(k) + "^1.5 × " + num(fck_v) + "^0.5", v_min, "MPa",
               variant_ndp("EN 1992-1-1 6.2.2(1) (6.3N)", "v_min_factor"));
        st.add("V_Rd,c", capped ? "max(CRd,c k (100 ρl fck,v)^(1/3), v_min) b d"
                                : "max(CRd,c k (100 ρl fck)^(1/3), v_min) b d",
               "max(" + num(C) + " × " + num(k) + " × (100 × " + num(std::min(rho_l, 0.02)) + " × " +
                   num(fck_v) + ")^(1/3), " + num(v_min) + ") × " + num(b) + " × " + num(d),
               so.V_Rd * 1e-3, "kN", "EN 1992-1-1 6.2.2(1) (6.2)");
        return st.take();
      });
    });
    if (detail != Detail::verdict) out.supports.push_back(std::move(so));  // the search needs only the verdict
  }
  return out;
}

DistributionNeed Checker::distribution(double main_As_prov) const {
  return {minimum_distribution_steel(main_As_prov),
          max_distribution_bar_spacing_max_moment(req_.slab.thickness_mm)};
}

Checker::BendingLimit Checker::bending_limit(double delta) const {
  BendingLimit l;
  l.normal = m_.fck <= 50.0;
  l.k_a = l.normal ? ndp_.k1 : ndp_.k3;
  l.k_b = redistribution_coefficient(l.normal ? ndp_.k2_factor : ndp_.k4_factor, m_.eps_cu2);
  l.xi = limiting_neutral_axis_ratio(delta, l.k_a, l.k_b, m_.fck);
  l.K_lim = limiting_K(m_.eta, ndp_.alpha_cc, ndp_.gamma_c, m_.lambda, l.xi);
  return l;
}

// 7.3.2(2): minimum steel for crack control, As,min σs = kc k fct,eff Act,
// with kc = 0.4 (rectangular section in bending), fct,eff = fctm,
// Act = b h/2 and σs = fyk. Checked where crack control applies (h >
// 200 mm, 7.3.3(1)).
void Checker::min_crack_steel_check(CheckCollector& checks, const RegionDemand& g, double As_prov) const {
  const double h = req_.slab.thickness_mm, b = req_.slab.strip_width_mm;
  const double k = crack_control_depth_factor(h);
  const double A_ct = tension_zone_area_rectangular_bending(b, h);
  const double As_min = minimum_crack_control_steel(kc_bending_rectangular, k, m_.fctm, A_ct, m_.fyk);
  checks.add("cracking", g.where, "EN 1992-1-1 7.3.2(2) (7.1) (minimum steel)", As_min, As_prov, "mm2", [&] {
    Steps st;
    st.add("kc", "0.4 (1 − σc/(k1 (h/h*) fct,eff)), rectangular section in bending", "0.4 × (1 − 0), σc = 0",
           kc_bending_rectangular, "-", "EN 1992-1-1 7.3.2(2) (7.2)");
    st.add("k", "1.0 for h ≤ 300, 0.65 for h ≥ 800, linear between", "h = " + num(h), k, "-",
           "EN 1992-1-1 7.3.2(2)");
    st.add("Act", "b h/2 (tension zone before cracking)", num(b) + " × " + num(h) + "/2", A_ct, "mm2",
           "EN 1992-1-1 7.3.2(2)");
    st.add("As,min", "kc k fct,eff Act / σs, fct,eff = fctm, σs = fyk",
           num(kc_bending_rectangular) + " × " + num(k) + " × " + num(m_.fctm) + " × " + num(A_ct) + " / " +
               num(m_.fyk),
           As_min, "mm2", "EN 1992-1-1 7.3.2(2) (7.1)");
    return st.take();
  });
}

void Checker::crack_check(CheckCollector& checks, const RegionDemand& g, double phi, double s, double d,
                          double As_req, double As_prov) const {
  const double h = req_.slab.thickness_mm;
  const double sigma = quasi_permanent_steel_stress(m_.fyd, g.quasi_permanent_to_uls, As_req,
                                                    As_prov, g.redistribution_delta);
  // A limit past the end of its table is zero: that route cannot pass.
  const FaceData& fd = face_data(g.face);
  const auto s_lim = max_bar_spacing_table_7_3N(sigma, fd.w_max);
  const auto phi_star = max_bar_diameter_table_7_2N(sigma, fd.w_max);
  const double s_limit = s_lim.value_or(0.0);
  const double phi_limit = phi_star ? adjusted_max_bar_diameter(*phi_star, m_.fctm, h, d) : 0.0;
  auto steps = [&] {
    Steps st;
    st.add("w_max", "Table 7.1N for the exposure class", fd.exposure + " (" + to_string(g.face) + " face)",
           fd.w_max, "mm",
           variant_ndp("EN 1992-1-1 7.3.1(5) Table 7.1N",
                       fd.exposure == "X0" || fd.exposure == "XC1" ? "w_max_X0_XC1_mm" : "w_max_other_mm"));
    if (req_.loads.actions_given)  // the ratio comes from the combinations of the actions
      st.add("n_qp/n_uls", "quasi-permanent over ULS moment at the region (combinations of the actions)",
             "", g.quasi_permanent_to_uls, "-", "EN 1990 (6.16b), (6.10)");
    else
      st.add("ψ2", "quasi-permanent factor, category " + req_.loads.imposed_category,
             "category " + req_.loads.imposed_category, psi_.psi2, "-",
             variant_ndp("EN 1990 Table A1.1", "psi_factors." + req_.loads.imposed_category + ".psi2"));
    st.add("σs", "fyd (n_qp/n_uls)(As,req/As,prov)/δ",
           num(m_.fyd) + " × " + num(g.quasi_permanent_to_uls) + " × " + num(As_req) + "/" + num(As_prov) +
               " / " + num(g.redistribution_delta),
           sigma, "MPa", "EN 1992-1-1 7.3.3 (common practice estimate)");
    st.add("s_max", "Table 7.3N(σs, w_max)", num(sigma) + " MPa", s_limit, "mm", "EN 1992-1-1 7.3.3 Table 7.3N");
    st.add("φ*s", "Table 7.2N(σs, w_max)", num(sigma) + " MPa", phi_star.value_or(0.0), "mm",
           "EN 1992-1-1 7.3.3 Table 7.2N");
    st.add("φs", "φ*s (fctm/2.9) kc hcr/(2(h − d)), kc = 0.4, hcr = h/2",
           num(phi_star.value_or(0.0)) + " × (" + num(m_.fctm) + "/2.9) × 0.4 × " + num(h / 2) + "/(2 × (" +
               num(h) + " − " + num(d) + "))",
           phi_limit, "mm", "EN 1992-1-1 7.3.3 (7.6N)");
    return st.take();
  };
  // Either route passes the check; the one with the lower utilisation is reported.
  if (utilisation_of(s, s_limit) <= utilisation_of(phi, phi_limit))
    checks.add("cracking", g.where, "EN 1992-1-1 7.3.3 Table 7.3N (bar spacing)", s, s_limit, "mm", steps);
  else
    checks.add("cracking", g.where, "EN 1992-1-1 7.3.3 Table 7.2N (bar diameter)", phi, phi_limit, "mm", steps);
}

// 7.3.4: the calculated crack width wk = sr,max (εsm − εcm) of the face's
// outer layer under the quasi-permanent moment, against w_max. The
// quasi-permanent moment is the one the tables check reads: the region's
// quasi-permanent to ULS ratio times M_Ed, before redistribution (/δ).
void Checker::crack_width_check(CheckCollector& checks, const Section& sec, const RegionDemand& g) const {
  const SectionLayer& layer = sec.outer_layer(g.face);
  const double h = sec.h_mm, b = sec.b_mm, d = layer.d_mm, s = layer.spacing_mm, c = layer.cover_mm;
  const double phi = layer.bar.diameter_mm;
  const double As = layer.area_mm2(b);
  const double M_qp = g.quasi_permanent_to_uls * g.M_Ed / g.redistribution_delta;
  const double Es = steel_modulus_MPa, Ecm = secant_modulus_MPa(m_.fck), alpha_e = Es / Ecm;
  const double x = cracked_neutral_axis_depth(alpha_e, As, b, d);
  const double sigma_s = cracked_steel_stress(M_qp, As, d, x);
  const double hc_eff = effective_tension_depth(h, d, x);
  const double Ac_eff = b * hc_eff;
  const double rho_p_eff = effective_reinforcement_ratio(As, Ac_eff);
  const double fct_eff = m_.fctm;
  const double strain = mean_strain_difference(sigma_s, kt_long_term, fct_eff, rho_p_eff, alpha_e, Es);
  const double s_bonded = bonded_spacing_limit(c, phi);
  const bool wide = s > s_bonded;
  const double sr_max = wide ? max_crack_spacing_wide(h, x)
                             : max_crack_spacing(k3_crack_spacing, c, k1_high_bond, k2_bending, k4_crack_spacing,
                                                 phi, rho_p_eff);
  const double wk = crack_width(sr_max, strain);
  const FaceData& fd = face_data(g.face);
  const char* clause = wide ? "EN 1992-1-1 7.3.4 (7.8), (7.9), (7.14)" : "EN 1992-1-1 7.3.4 (7.8), (7.9), (7.11)";
  checks.add("crack_width", g.where, clause, wk, fd.w_max, "mm", [&] {
    Steps st;
    st.add("w_max", "Table 7.1N for the exposure class", fd.exposure + " (" + to_string(g.face) + " face)",
           fd.w_max, "mm",
           variant_ndp("EN 1992-1-1 7.3.1(5) Table 7.1N",
                       fd.exposure == "X0" || fd.exposure == "XC1" ? "w_max_X0_XC1_mm" : "w_max_other_mm"));
    if (req_.loads.actions_given)
      st.add("n_qp/n_uls", "quasi-permanent over ULS moment at the region (combinations of the actions)", "",
             g.quasi_permanent_to_uls, "-", "EN 1990 (6.16b), (6.10)");
    else
      st.add("n_qp/n_uls", "quasi-permanent over ULS load, imposed category " + req_.loads.imposed_category,
             "ψ2 = " + num(psi_.psi2), g.quasi_permanent_to_uls, "-",
             variant_ndp("EN 1990 (6.16b), Table A1.1", "psi_factors." + req_.loads.imposed_category + ".psi2"));
    st.add("M_qp", "(n_qp/n_uls) M_Ed / δ",
           num(g.quasi_permanent_to_uls) + " × " + num(g.M_Ed * 1e-6) + " / " + num(g.redistribution_delta),
           M_qp * 1e-6, "kNm", "EN 1990 (6.16b)");
    st.add("Ecm", "22 (fcm/10)^0.3 GPa", "fcm = " + num(mean_compressive_strength(m_.fck)), Ecm, "MPa",
           "EN 1992-1-1 Table 3.1");
    st.add("αe", "Es / Ecm, Es = 200 GPa", num(Es) + " / " + num(Ecm), alpha_e, "-",
           "EN 1992-1-1 7.3.4(2), 3.2.7(4)");
    st.add("As,prov", "π φ²/4 × b/s", "π × " + num(phi) + "²/4 × " + num(b) + "/" + num(s), As, "mm2", "");
    st.add("x", "d (−αe ρ + √((αe ρ)² + 2 αe ρ)), ρ = As/(b d) (cracked section)",
           num(d) + " × (−αe ρ + √((αe ρ)² + 2 αe ρ)), αe ρ = " + num(alpha_e * As / (b * d)), x, "mm",
           "EN 1992-1-1 7.3.4(2) (cracked section, concrete in tension ignored)");
    st.add("σs", "M_qp / (As (d − x/3))",
           num(M_qp * 1e-6) + " × 10⁶ / (" + num(As) + " × (" + num(d) + " − " + num(x) + "/3))", sigma_s, "MPa",
           "EN 1992-1-1 7.3.4(2)");
    st.add("hc,ef", "min(2.5 (h − d), (h − x)/3, h/2)",
           "min(2.5 × (" + num(h) + " − " + num(d) + "), (" + num(h) + " − " + num(x) + ")/3, " + num(h) + "/2)",
           hc_eff, "mm", "EN 1992-1-1 7.3.2(3)");
    st.add("ρp,eff", "As / Ac,eff, Ac,eff = b hc,ef", num(As) + " / (" + num(b) + " × " + num(hc_eff) + ")",
           rho_p_eff, "-", "EN 1992-1-1 7.3.4(2) (7.10)");
    st.add("fct,eff", "fctm", "fck = " + num(m_.fck), fct_eff, "MPa", "EN 1992-1-1 7.3.4(2), Table 3.1");
    st.add("εsm − εcm", "max((σs − kt fct,eff/ρp,eff (1 + αe ρp,eff))/Es, 0.6 σs/Es), kt = 0.4",
           "max((" + num(sigma_s) + " − 0.4 × " + num(fct_eff) + "/" + num(rho_p_eff) + " × (1 + " + num(alpha_e) +
               " × " + num(rho_p_eff) + "))/" + num(Es) + ", 0.6 × " + num(sigma_s) + "/" + num(Es) + ")",
           strain, "-", "EN 1992-1-1 7.3.4(2) (7.9)");
    st.add("5 (c + φ/2)", "largest spacing for (7.11)", "5 × (" + num(c) + " + " + num(phi) + "/2), s = " + num(s),
           s_bonded, "mm", "EN 1992-1-1 7.3.4(3)");
    if (wide)
      st.add("sr,max", "1.3 (h − x), spacing over 5 (c + φ/2)", "1.3 × (" + num(h) + " − " + num(x) + ")", sr_max,
             "mm", "EN 1992-1-1 7.3.4(3) (7.14)");
    else
      st.add("sr,max", "k3 c + k1 k2 k4 φ/ρp,eff, k1 = 0.8, k2 = 0.5, k3 = 3.4, k4 = 0.425",
             "3.4 × " + num(c) + " + 0.8 × 0.5 × 0.425 × " + num(phi) + "/" + num(rho_p_eff), sr_max, "mm",
             "EN 1992-1-1 7.3.4(3) (7.11); k3, k4 recommended values");
    st.add("wk", "sr,max (εsm − εcm)", num(sr_max) + " × " + num(strain), wk, "mm", "EN 1992-1-1 7.3.4(1) (7.8)");
    return st.take();
  });
}

}  // namespace armature::en1992
