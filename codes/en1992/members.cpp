// EN 1992-1-1 member rules, the checks of the member rather than of one
// section: span/depth deflection, fire (EN 1992-1-2), equilibrium of a
// cantilever's back span (EN 1990), the design moment at a support with a
// width, the top steel at pinned ends.
#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "checker.hpp"

namespace armature::en1992 {

namespace {

StructuralSystem system_of(SpanKind kind) {
  switch (kind) {
    case SpanKind::simply_supported: return StructuralSystem::simply_supported;
    case SpanKind::end_span: return StructuralSystem::end_span;
    case SpanKind::interior_span: return StructuralSystem::interior_span;
    case SpanKind::cantilever: return StructuralSystem::cantilever;
  }
  return StructuralSystem::simply_supported;
}

// The row of Table 7.4N, as the deflection derivation names it.
const char* system_name(SpanKind kind) {
  switch (kind) {
    case SpanKind::simply_supported: return "simply supported span";
    case SpanKind::end_span: return "end span";
    case SpanKind::interior_span: return "interior span";
    case SpanKind::cantilever: return "cantilever";
  }
  return "";
}

}  // namespace

// EN 1990 6.4.2(1) (6.7): Ed,dst ≤ Ed,stb, here as the reaction the
// destabilising spans' loads (the cantilever's, and any other span whose
// loads lift it) take from the back span's far support against the
// reaction the other spans' loads give it (utilisation > 1: uplift).
std::vector<Check> Checker::equilibrium_checks(const EquilibriumDemand& d, Detail detail) const {
  std::vector<Check> out;
  RegionVerdict verdict;
  CheckCollector checks(out, verdict, detail == Detail::verdict ? Detail::checks : detail);
  run_check("equilibrium", [&] {
    checks.add("equilibrium", d.where, "EN 1990 6.4.2(1) (6.7), Table A1.2(A)", d.R_destabilising * 1e-3,
               d.R_stabilising * 1e-3, "kN", [&] {
                 Steps st;
                 st.add("R,stb", "reaction from the spans that hold the support down (γG,inf)", "", d.R_stabilising * 1e-3,
                        "kN", variant_ndp("EN 1990 6.4.2(1), Table A1.2(A)", "equ_gamma_G_inf"));
                 st.add("R,dst", "reaction taken away by the spans that lift it (γG,sup, γQ)", "", d.R_destabilising * 1e-3,
                        "kN", "EN 1990 6.4.2(1)");
                 st.add("R,min", "R,stb − R,dst under " + d.combination + " (negative: uplift)",
                        num(d.R_stabilising * 1e-3) + " − " + num(d.R_destabilising * 1e-3),
                        (d.R_stabilising - d.R_destabilising) * 1e-3, "kN", "EN 1990 6.4.2(1) (6.7)");
                 return st.take();
               });
  });
  return out;
}

double Checker::support_design_moment(const RegionDemand& g) const { return support_moment(g).M_Ed; }

Checker::SupportMoment Checker::support_moment(const RegionDemand& g) const {
  const SupportFace& f = g.support_face;
  SupportMoment out;
  out.M_Ed = -std::numeric_limits<double>::infinity();
  for (std::size_t i = 0; i < f.cases.size(); ++i) {
    const SupportMomentCase& c = f.cases[i];
    const double by_3 = monolithic_support_design_moment(c.M_face, c.M_fixed_end);
    const double by_4 = c.M_centre - support_moment_reduction(c.reaction, f.width_mm);
    const bool use_4 = !f.built_in && by_4 > by_3;
    const double M = use_4 ? by_4 : by_3;
    if (M > out.M_Ed) out = {M, i, by_3, by_4, use_4};
  }
  if (f.cases.empty()) out.M_Ed = f.M_centre;
  return out;
}

void Checker::support_moment_steps(Steps& st, const RegionDemand& g, const SupportMoment& m) const {
  const SupportFace& f = g.support_face;
  if (f.cases.empty()) return;
  const SupportMomentCase& c = f.cases[m.governing];
  const char* kind = f.built_in ? "fixed end, built in (monolithic)"
                                : "support monolithic or giving no rotational restraint: the smaller reduction";
  st.add("t", "breadth of the support", kind, f.width_mm, "mm", "EN 1992-1-1 5.3.2.2(3), (4)");
  st.add("M_Ed,c", "hogging at the centreline, governing load case", "", c.M_centre * 1e-6, "kNm",
         "EN 1992-1-1 5.3.2.2");
  st.add("M_Ed,face", "hogging at the face, t/2 from the centreline (larger side)", "", c.M_face * 1e-6, "kNm",
         "EN 1992-1-1 5.3.2.2(3)");
  st.add("M_fe", "full fixed-end moment of the adjacent span (cantilever: its root moment)", "",
         c.M_fixed_end * 1e-6, "kNm", "EN 1992-1-1 5.3.2.2(3) Note");
  st.add("M_Ed,(3)", "max(M_Ed,face, 0.65 M_fe)",
         "max(" + num(c.M_face * 1e-6) + ", 0.65 × " + num(c.M_fixed_end * 1e-6) + ")", m.by_3 * 1e-6, "kNm",
         "EN 1992-1-1 5.3.2.2(3)");
  if (!f.built_in) {
    st.add("ΔM_Ed", "F_Ed,sup t/8", num(c.reaction * 1e-3) + " kN × " + num(f.width_mm) + " mm / 8",
           support_moment_reduction(c.reaction, f.width_mm) * 1e-6, "kNm", "EN 1992-1-1 5.3.2.2(4) (5.9)");
    st.add("M_Ed,(4)", "M_Ed,c − ΔM_Ed",
           num(c.M_centre * 1e-6) + " − " + num(support_moment_reduction(c.reaction, f.width_mm) * 1e-6),
           m.by_4 * 1e-6, "kNm", "EN 1992-1-1 5.3.2.2(4)");
    st.add("M_Ed", "max(M_Ed,(3), M_Ed,(4)), the smaller reduction",
           "max(" + num(m.by_3 * 1e-6) + ", " + num(m.by_4 * 1e-6) + ")", g.M_Ed * 1e-6, "kNm",
           m.reduced_by_4 ? "EN 1992-1-1 5.3.2.2(4)" : "EN 1992-1-1 5.3.2.2(3)");
  } else {
    st.add("M_Ed", "M_Ed,(3)", "", g.M_Ed * 1e-6, "kNm", "EN 1992-1-1 5.3.2.2(3)");
  }
}

// The checks that read a region's section: the axis distance of bottom
// bars in fire, and the span/depth ratio of the span these bars govern.
MemberSectionOutcome Checker::check_with_section(const Section& sec, const RegionDemand& g,
                                                 const SectionOutcome& outcome, Detail detail) const {
  MemberSectionOutcome out;
  const SectionLayer& layer = sec.outer_layer(g.face);
  // Fire (EN 1992-1-2 Table 5.8): axis distance of the bottom bars
  if (req_.fire.resistance_min && g.face == Face::bottom) {
    CheckCollector checks(out.checks, out.verdict, detail);
    run_check("fire", [&] { fire_axis_distance_check(checks, g, layer.cover_mm, layer.bar.diameter_mm); });
  }
  // Deflection (7.4.2) of the span these bars govern
  if (!g.span_where.empty()) {
    CheckCollector span(out.span_checks, out.verdict, detail);
    run_check("deflection",
              [&] { deflection_check(span, g, layer.d_mm, outcome.As_req_mm2, layer.area_mm2(sec.b_mm)); });
  }
  return out;
}

double Checker::pinned_end_fixity_fraction() const { return partial_fixity_fraction; }

std::vector<Check> Checker::span_checks(const std::string& span_where) const {
  std::vector<Check> out;
  if (req_.fire.resistance_min) {
    out.push_back(run_check("fire", [&] {
      const int t = *req_.fire.resistance_min;
      const double h_min = fire_min_thickness(t);
      std::vector<Step> st;
      st.push_back({"h_s,min", "Table 5.8 column 2", "REI " + std::to_string(t), h_min, "mm",
                    "EN 1992-1-2 5.7.2 Table 5.8 column 2"});
      return make_check("fire", span_where, "EN 1992-1-2 5.7.2 Table 5.8 column 2 (thickness)", h_min,
                        req_.slab.thickness_mm, "mm", std::move(st));
    }));
  }
  return out;
}

// EN 1992-1-2 5.7.2 Table 5.8: the axis distance of the bottom bars.
void Checker::fire_axis_distance_check(CheckCollector& checks, const RegionDemand& g, double c_nom,
                                       double phi) const {
  const int t = *req_.fire.resistance_min;
  const double a = c_nom + phi / 2.0, a_min = fire_min_axis_distance(t);
  // Column 3 (one-way slabs) for every span: 5.7.3 would allow
  // column 4 for continuous slabs under conditions; it is not used.
  const bool continuous = g.span_kind != SpanKind::simply_supported;
  const char* clause = continuous ? "EN 1992-1-2 5.7.2 Table 5.8 column 3 (axis distance); "
                                    "conservative for continuous slabs, 5.7.3 not used"
                                  : "EN 1992-1-2 5.7.2 Table 5.8 column 3 (axis distance)";
  checks.add("fire", g.where, clause, a_min, a, "mm", [&] {
    Steps st;
    st.add("a", "c_nom + φ/2", num(c_nom) + " + " + num(phi) + "/2", a, "mm", "EN 1992-1-2 5.7.2");
    st.add("a_min", "Table 5.8 column 3, one-way slab", "REI " + std::to_string(t), a_min, "mm",
           continuous ? "EN 1992-1-2 5.7.2 Table 5.8 column 3 (5.7.3 column 4 not used)"
                      : "EN 1992-1-2 5.7.2 Table 5.8 column 3");
    return st.take();
  });
}

void Checker::deflection_check(CheckCollector& checks, const RegionDemand& g, double d, double As_req,
                               double As_prov) const {
  // A region with no moment has As,req = 0; a floor of 1e-6 keeps (7.16a)
  // finite (the ratio is then far above any actual l/d).
  const double rho = std::max(As_req / (req_.slab.strip_width_mm * d), 1e-6);
  const double rho0 = reference_reinforcement_ratio(m_.fck);
  const double K = structural_system_factor(system_of(g.span_kind));
  const double basic = basic_span_depth_ratio(K, m_.fck, rho, 0.0);
  const double f_long = long_span_factor(g.span_mm);
  const double f_steel = steel_stress_factor(m_.fyk, As_prov, As_req, ndp_.steel_stress_factor_cap);
  const double modified = basic * f_long * f_steel;
  const double allowed = capped_span_depth_ratio(modified, K, ndp_.span_depth_cap_K);
  const bool capped = allowed < modified;
  const double actual = g.span_mm / d;
  const char* clause = capped ? "EN 1992-1-1 7.4.2 (7.16), Table 7.4N; l/d capped by variant NDP"
                              : "EN 1992-1-1 7.4.2 (7.16), Table 7.4N";
  checks.add("deflection", g.span_where, clause, actual, allowed, "-", [&] {
    Steps st;
    st.add("ρ0", "√fck × 10⁻³", "√" + num(m_.fck) + " × 10⁻³", rho0, "-", "EN 1992-1-1 7.4.2(2)");
    st.add("ρ", "As,req/(b d)", num(As_req) + "/(" + num(req_.slab.strip_width_mm) + " × " + num(d) + ")", rho,
           "-", "EN 1992-1-1 7.4.2(2)");
    st.add("K", "Table 7.4N structural system", system_name(g.span_kind), K, "-",
           "EN 1992-1-1 7.4.2 Table 7.4N");
    st.add("l/d basic",
           rho <= rho0 ? "K[11 + 1.5√fck ρ0/ρ + 3.2√fck (ρ0/ρ − 1)^1.5]"
                       : "K[11 + 1.5√fck ρ0/(ρ − ρ') + √fck √(ρ'/ρ0)/12], ρ' = 0",
           "K = " + num(K) + ", fck = " + num(m_.fck) + ", ρ0 = " + num(rho0) + ", ρ = " + num(rho), basic, "-",
           rho <= rho0 ? "EN 1992-1-1 7.4.2 (7.16a)" : "EN 1992-1-1 7.4.2 (7.16b)");
    st.add("F_l", "7/leff when leff > 7 m", num(g.span_mm * 1e-3) + " m", f_long, "-", "EN 1992-1-1 7.4.2(2)");
    st.add("310/σs", "(500/fyk)(As,prov/As,req) ≤ cap",
           "(500/" + num(m_.fyk) + ")(" + num(As_prov) + "/" + num(As_req) + ") ≤ " +
               num(ndp_.steel_stress_factor_cap),
           f_steel, "-", variant_ndp("EN 1992-1-1 7.4.2(2) (7.17)", "steel_stress_factor_cap"));
    if (ndp_.span_depth_cap_K) {
      st.add("l/d modified", "l/d basic × F_l × 310/σs",
             num(basic) + " × " + num(f_long) + " × " + num(f_steel), modified, "-", "EN 1992-1-1 7.4.2");
      st.add("l/d cap", "cap × K", num(*ndp_.span_depth_cap_K) + " × " + num(K), *ndp_.span_depth_cap_K * K,
             "-", variant_ndp("EN 1992-1-1 7.4.2(2); NA Table NA.5 Note 6", "span_depth_cap_K"));
      st.add("l/d allowed", "min(l/d modified, l/d cap)",
             "min(" + num(modified) + ", " + num(*ndp_.span_depth_cap_K * K) + ")", allowed, "-",
             "EN 1992-1-1 7.4.2");
    } else {
      st.add("l/d allowed", "l/d basic × F_l × 310/σs",
             num(basic) + " × " + num(f_long) + " × " + num(f_steel), allowed, "-", "EN 1992-1-1 7.4.2");
    }
    st.add("l/d actual", "leff/d", num(g.span_mm) + "/" + num(d), actual, "-", "EN 1992-1-1 7.4.2");
    return st.take();
  });
}

}  // namespace armature::en1992

