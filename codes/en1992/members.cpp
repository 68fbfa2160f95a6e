// EN 1992-1-1 member rules, the checks of the member rather than of one
// section: span/depth deflection, fire (EN 1992-1-2), equilibrium of a
// cantilever's back span (EN 1990), the design moment at a support with a
// width, the top steel at pinned ends.
#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "armature/deflection.hpp"
#include "checker.hpp"

namespace armature::en1992 {

namespace {

// Relative change of the largest deflection at which the integration
// stops doubling its segments (deflection.hpp).
constexpr double integration_tolerance = 0.005;

// The largest later − early deflection at the later state's points (the
// early one linearly between its own points), and where: never less than
// the difference of the two largest deflections.
std::pair<double, double> largest_increment(const SpanDeflection& later, const SpanDeflection& early) {
  double increment = 0.0, x_at = 0.0;
  const auto& pts = early.points;
  for (const auto& pt : later.points) {
    const auto it = std::lower_bound(pts.begin(), pts.end(), pt.x_mm,
                                     [](const DeflectionPoint& a, double x) { return a.x_mm < x; });
    double w_early = 0.0;
    if (it == pts.begin()) w_early = it->deflection_mm;
    else if (it == pts.end()) w_early = pts.back().deflection_mm;
    else {
      const auto& hi = *it;
      const auto& lo = *(it - 1);
      const double t = hi.x_mm > lo.x_mm ? (pt.x_mm - lo.x_mm) / (hi.x_mm - lo.x_mm) : 1.0;
      w_early = lo.deflection_mm + t * (hi.deflection_mm - lo.deflection_mm);
    }
    if (pt.deflection_mm - w_early > increment) {
      increment = pt.deflection_mm - w_early;
      x_at = pt.x_mm;
    }
  }
  return {increment, x_at};
}

StructuralSystem system_of(SpanKind kind) {
  switch (kind) {
    case SpanKind::simply_supported: return StructuralSystem::simply_supported;
    case SpanKind::end_span: return StructuralSystem::end_span;
    case SpanKind::interior_span: return StructuralSystem::interior_span;
    case SpanKind::cantilever: return StructuralSystem::cantilever;
    case SpanKind::flat_exterior_panel:
    case SpanKind::flat_interior_panel: return StructuralSystem::flat_slab;
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
    case SpanKind::flat_exterior_panel:
    case SpanKind::flat_interior_panel: return "flat slab, on the longer span";
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
  // Deflection of the span these bars govern: by span/depth (7.4.2),
  // calculated (7.4.3), or both. A check carries its method only when the
  // request names one (a version 1 request's result is unchanged).
  if (!g.span_where.empty()) {
    CheckCollector span(out.span_checks, out.verdict, detail);
    const auto& sv = req_.serviceability;
    // A cantilever turns with its back span, or from a built-in root
    // where the strip has no other span.
    // A plate's panel is calculated by the kernel on the whole plate
    // (plate_deflection_checks), not here.
    const bool plate = g.direction != BarDirection::span;
    const bool calculated = sv.calculated_deflection() && (plate || g.long_term_span.has_value());
    if (sv.deflection_method() != DeflectionMethod::calculated || !calculated) {
      const std::size_t before = out.span_checks.size();
      run_check("deflection",
                [&] { deflection_check(span, g, layer.d_mm, outcome.As_req_mm2, layer.area_mm2(sec.b_mm)); });
      if (sv.deflection)
        for (std::size_t i = before; i < out.span_checks.size(); ++i) out.span_checks[i].method = "span_depth";
    }
    if (calculated && !plate && !span.verdict_settled()) {
      const std::size_t before = out.span_checks.size();
      run_check("deflection", [&] {
        if (g.span_kind == SpanKind::cantilever) cantilever_deflection_check(span, sec, g);
        else calculated_deflection_check(span, sec, g);
      });
      for (std::size_t i = before; i < out.span_checks.size(); ++i) out.span_checks[i].method = "calculated";
    }
  }
  return out;
}

// The allowed l/d above 40 K is outside the range the span/depth rule was
// calibrated for: the bound is the cap of UK NA Table NA.5 Note 6 (value
// from memory), given as a warning where the variant does not cap.
void Checker::note_span_depth_range(const RegionDemand& g, double allowed, double K) const {
  constexpr double calibrated_K_multiple = 40.0;
  if (allowed <= calibrated_K_multiple * K) return;
  const std::string note = g.span_where + ": the allowed span/depth ratio " + num(allowed) +
                           " (EN 1992-1-1 7.4.2) exceeds 40 K = " + num(calibrated_K_multiple * K) +
                           ", beyond the range the rule was calibrated for (the cap of UK NA Table NA.5 Note 6): "
                           "calculate the deflection (serviceability.deflection \"calculated\")";
  const std::lock_guard<std::mutex> lock(span_depth_notes_mutex_);
  // One note per span, of the arrangement last recorded (the design's).
  for (auto& [where, text] : span_depth_notes_)
    if (where == g.span_where) {
      text = note;
      return;
    }
  span_depth_notes_.emplace_back(g.span_where, note);
}

// ---- Deflection by calculation (7.4.3) --------------------------------------

CreepShrinkage creep_shrinkage_of(const ServiceabilityInput& s, double fck, double h) {
  CreepShrinkage c;
  c.cement = s.cement_class == CementClass::S ? Cement::S : s.cement_class == CementClass::R ? Cement::R : Cement::N;
  c.RH = s.relative_humidity_percent.value_or(default_relative_humidity);
  c.t0 = s.age_at_loading_days.value_or(default_age_at_loading_days);
  c.t_p = s.partitions_age_days.value_or(default_partitions_age_days);
  c.fcm = mean_compressive_strength(fck);
  // A slab strip dries from both faces: Ac = b h, u = 2 b (its edges are
  // inside the floor), so h0 = h.
  c.h0 = notional_size(h * 1000.0, 2.0 * 1000.0);
  // Creep, Annex B: φ(∞, t0) = φ0; at t_p, φ0 βc(t_p, t0).
  c.t0_adj = cement_adjusted_age(c.t0, c.cement);
  c.phi_RH = creep_humidity_factor(c.RH, c.h0, c.fcm);
  c.beta_fcm = creep_strength_factor(c.fcm);
  c.beta_t0 = creep_loading_age_factor(c.t0_adj);
  c.phi0 = notional_creep_coefficient(c.phi_RH, c.beta_fcm, c.beta_t0);
  c.beta_H = creep_humidity_time_factor(c.RH, c.h0, c.fcm);
  c.beta_c_p = creep_development(c.t_p, c.t0, c.beta_H);
  // Shrinkage, 3.1.4(6): drying kh εcd,0 βds and autogenous εca(∞) βas.
  c.kh = shrinkage_size_factor(c.h0);
  c.eps_cd0 = basic_drying_shrinkage(c.fcm, c.RH, c.cement);
  c.eps_cd_inf = c.kh * c.eps_cd0;
  c.eps_ca_inf = final_autogenous_shrinkage(fck);
  c.beta_ds_p = drying_shrinkage_development(c.t_p, std::min(drying_start_days, c.t0), c.h0);
  c.beta_as_p = autogenous_shrinkage_development(c.t_p);
  c.eps_cs_calc_inf = c.eps_cd_inf + c.eps_ca_inf;
  c.eps_cs_calc_p = c.beta_ds_p * c.eps_cd_inf + c.beta_as_p * c.eps_ca_inf;
  // A given final value develops as the calculated one does.
  c.creep_given = s.creep_coefficient.has_value();
  c.shrinkage_given = s.shrinkage_strain.has_value();
  c.phi_inf = c.creep_given ? *s.creep_coefficient : c.phi0;
  c.phi_p = c.phi_inf * c.beta_c_p;
  c.eps_cs_inf = c.shrinkage_given ? *s.shrinkage_strain : c.eps_cs_calc_inf;
  c.eps_cs_p = c.eps_cs_calc_inf > 0.0 ? c.eps_cs_inf * c.eps_cs_calc_p / c.eps_cs_calc_inf : 0.0;
  return c;
}

std::optional<SpanDeflection> Checker::deflection_diagram(const Section& sec, const RegionDemand& g) const {
  if (!req_.serviceability.calculated_deflection() || !g.long_term_span || g.span_kind == SpanKind::cantilever)
    return std::nullopt;
  const SectionLayer& layer = sec.outer_layer(Face::bottom);
  const double b = sec.b_mm;
  const LongTermSection total = long_term_section(b, sec.h_mm, layer.area_mm2(b), layer.d_mm,
                                                  secant_modulus_MPa(m_.fck), m_.fctm, long_term_.phi_inf,
                                                  long_term_.eps_cs_inf);
  return span_deflection(*g.long_term_span, [&](double M) { return total.curvature(M); }, integration_tolerance,
                         {total.Mcr, -total.Mcr});
}

// The section's long-term properties as the record shows them (7.4.3).
void Checker::long_term_section_steps(Steps& st, const LongTermSection& s, const std::string& tag, double h) const {
  const double Ecm = secant_modulus_MPa(m_.fck);
  st.add("Ec,eff" + tag, "Ecm/(1 + φ)", num(Ecm) + "/(1 + " + num(s.Ec_eff > 0 ? Ecm / s.Ec_eff - 1.0 : 0.0) + ")",
         s.Ec_eff, "MPa", "EN 1992-1-1 7.4.3(5) (7.20)");
  st.add("αe" + tag, "Es/Ec,eff", num(steel_modulus_MPa) + "/" + num(s.Ec_eff), s.alpha_e, "-",
         "EN 1992-1-1 7.4.3(5)");
  st.add("x_I" + tag, "uncracked: b h plus (αe − 1) As at d", "", s.uncracked.x, "mm", "EN 1992-1-1 7.4.3");
  st.add("I_I" + tag, "uncracked transformed section", "", s.uncracked.I * 1e-6, "10⁶ mm⁴", "EN 1992-1-1 7.4.3");
  st.add("x_II" + tag, "b x²/2 = αe As (d − x)", "", s.cracked.x, "mm", "EN 1992-1-1 7.4.3");
  st.add("I_II" + tag, "b x³/3 + αe As (d − x)²", "", s.cracked.I * 1e-6, "10⁶ mm⁴", "EN 1992-1-1 7.4.3");
  st.add("Mcr" + tag, "fctm I_I/(h − x_I)",
         num(m_.fctm) + " × " + num(s.uncracked.I * 1e-6) + " × 10⁶/(" + num(h) + " − " + num(s.uncracked.x) + ")",
         s.Mcr * 1e-6, "kNm", "EN 1992-1-1 7.4.3(3)");
  st.add("1/r_cs,I" + tag, "εcs αe S_I/I_I, S_I = As (d − x_I)", "", s.kcs_I * 1e6, "1/km",
         "EN 1992-1-1 7.4.3(6) (7.21)");
  st.add("1/r_cs,II" + tag, "εcs αe S_II/I_II, S_II = As (d − x_II)", "", s.kcs_II * 1e6, "1/km",
         "EN 1992-1-1 7.4.3(6) (7.21)");
}

// Creep and shrinkage of the request (given, or 3.1.4 and Annex B).
void Checker::creep_shrinkage_steps(Steps& st, double h) const {
  const CreepShrinkage& c = long_term_;
  if (c.creep_given) {
    st.add("φ(∞,t0)", "given (serviceability.creep_coefficient)", "", c.phi_inf, "-", "EN 1992-1-1 3.1.4(2)");
  } else {
    st.add("h0", "2 Ac/u, both faces drying", "2 × " + num(h) + " × b/(2 b)", c.h0, "mm", "EN 1992-1-1 3.1.4(5), (B.6)");
    st.add("fcm", "fck + 8", num(m_.fck) + " + 8", c.fcm, "MPa", "EN 1992-1-1 3.1.2 Table 3.1");
    st.add("φRH", c.fcm <= 35.0 ? "1 + (1 − RH/100)/(0.1 h0^(1/3))" : "[1 + (1 − RH/100)/(0.1 h0^(1/3)) α1] α2",
           "RH = " + num(c.RH) + " %, h0 = " + num(c.h0), c.phi_RH, "-",
           c.fcm <= 35.0 ? "EN 1992-1-1 Annex B (B.3a)" : "EN 1992-1-1 Annex B (B.3b)");
    st.add("β(fcm)", "16.8/√fcm", "16.8/√" + num(c.fcm), c.beta_fcm, "-", "EN 1992-1-1 Annex B (B.4)");
    st.add("t0", "t0,T (9/(2 + t0,T^1.2) + 1)^α ≥ 0.5, cement " +
                     std::string(c.cement == Cement::S ? "S" : c.cement == Cement::N ? "N" : "R"),
           "t0,T = " + num(c.t0) + " days", c.t0_adj, "days", "EN 1992-1-1 Annex B (B.9)");
    st.add("β(t0)", "1/(0.1 + t0^0.20)", "1/(0.1 + " + num(c.t0_adj) + "^0.20)", c.beta_t0, "-",
           "EN 1992-1-1 Annex B (B.5)");
    st.add("φ(∞,t0)", "φ0 = φRH β(fcm) β(t0)",
           num(c.phi_RH) + " × " + num(c.beta_fcm) + " × " + num(c.beta_t0), c.phi_inf, "-",
           "EN 1992-1-1 Annex B (B.1), (B.2)");
  }
  if (c.shrinkage_given) {
    st.add("εcs(∞)", "given (serviceability.shrinkage_strain)", "", c.eps_cs_inf * 1e6, "10⁻⁶", "EN 1992-1-1 3.1.4(6)");
  } else {
    if (c.creep_given) st.add("h0", "2 Ac/u, both faces drying", "", c.h0, "mm", "EN 1992-1-1 3.1.4(5)");
    st.add("εcd,0", "0.85 [(220 + 110 αds1) exp(−αds2 fcm/10)] 10⁻⁶ βRH", "fcm = " + num(c.fcm) + ", RH = " + num(c.RH) + " %",
           c.eps_cd0 * 1e6, "10⁻⁶", "EN 1992-1-1 Annex B (B.11), (B.12)");
    st.add("kh", "Table 3.3 at h0", "h0 = " + num(c.h0), c.kh, "-", "EN 1992-1-1 3.1.4(6) Table 3.3");
    st.add("εcd,∞", "kh εcd,0", num(c.kh) + " × " + num(c.eps_cd0 * 1e6), c.eps_cd_inf * 1e6, "10⁻⁶",
           "EN 1992-1-1 3.1.4(6) (3.9)");
    st.add("εca(∞)", "2.5 (fck − 10) 10⁻⁶", "2.5 × (" + num(m_.fck) + " − 10)", c.eps_ca_inf * 1e6, "10⁻⁶",
           "EN 1992-1-1 3.1.4(6) (3.12)");
    st.add("εcs(∞)", "εcd,∞ + εca(∞)", num(c.eps_cd_inf * 1e6) + " + " + num(c.eps_ca_inf * 1e6),
           c.eps_cs_inf * 1e6, "10⁻⁶", "EN 1992-1-1 3.1.4(6) (3.8)");
  }
}

// The development of creep and shrinkage to the age the partitions go in.
void Checker::partitions_age_steps(Steps& st) const {
  const CreepShrinkage& c = long_term_;
  st.add("t_p", "age when the partitions are built", "", c.t_p, "days", "serviceability.partitions_age_days");
  st.add("βH", c.fcm <= 35.0 ? "1.5 [1 + (0.012 RH)^18] h0 + 250 ≤ 1500"
                           : "1.5 [1 + (0.012 RH)^18] h0 + 250 α3 ≤ 1500 α3",
         "RH = " + num(c.RH) + " %, h0 = " + num(c.h0), c.beta_H, "-",
         c.fcm <= 35.0 ? "EN 1992-1-1 Annex B (B.8a)" : "EN 1992-1-1 Annex B (B.8b)");
  st.add("βc(t_p,t0)", "((t_p − t0)/(βH + t_p − t0))^0.3",
         "((" + num(c.t_p) + " − " + num(c.t0) + ")/(" + num(c.beta_H) + " + " + num(c.t_p) + " − " + num(c.t0) +
             "))^0.3",
         c.beta_c_p, "-", "EN 1992-1-1 Annex B (B.7)");
  st.add("φ(t_p,t0)", "φ(∞,t0) βc(t_p,t0)", num(c.phi_inf) + " × " + num(c.beta_c_p), c.phi_p, "-",
         "EN 1992-1-1 Annex B (B.1)");
  st.add("βds(t_p,ts)", "(t_p − ts)/((t_p − ts) + 0.04 √h0³), ts = " + num(std::min(drying_start_days, c.t0)) + " days",
         "", c.beta_ds_p, "-", "EN 1992-1-1 3.1.4(6) (3.10)");
  st.add("βas(t_p)", "1 − exp(−0.2 t_p^0.5)", "", c.beta_as_p, "-", "EN 1992-1-1 3.1.4(6) (3.13)");
  st.add("εcs(t_p)", "εcs(∞) (βds εcd,∞ + βas εca,∞)/(εcd,∞ + εca,∞)", "", c.eps_cs_p * 1e6, "10⁻⁶",
         "EN 1992-1-1 3.1.4(6) (3.8)");
}

void Checker::calculated_deflection_check(CheckCollector& checks, const Section& sec, const RegionDemand& g) const {
  const SectionLayer& layer = sec.outer_layer(Face::bottom);
  const double b = sec.b_mm, h = sec.h_mm, d = layer.d_mm, As = layer.area_mm2(b);
  const double Ecm = secant_modulus_MPa(m_.fck);
  const SpanForces& qp = *g.long_term_span;
  const CreepShrinkage& c = long_term_;
  const LongTermSection total = long_term_section(b, h, As, d, Ecm, m_.fctm, c.phi_inf, c.eps_cs_inf);
  const SpanDeflection w = span_deflection(qp, [&](double M) { return total.curvature(M); }, integration_tolerance,
                                           {total.Mcr, -total.Mcr});
  const double limit = g.span_mm / total_deflection_span_ratio;
  double x_crit = 0.0;
  const double M_crit = qp.max_moment(&x_crit);
  const double zeta_crit = distribution_coefficient(M_crit, total.Mcr, beta_sustained);
  checks.add("deflection", g.span_where, "EN 1992-1-1 7.4.3, 7.4.1(4) (span/250)", w.max_mm, limit, "mm", [&] {
    Steps st;
    creep_shrinkage_steps(st, h);
    long_term_section_steps(st, total, "", h);
    st.add("M_qp", "largest quasi-permanent moment of the span, all spans loaded",
           "at " + num(x_crit * 1e-3) + " m from its left support", M_crit * 1e-6, "kNm", "EN 1990 (6.16b)");
    st.add("ζ", M_crit > total.Mcr ? "1 − β (Mcr/M)², β = 0.5" : "0 (M ≤ Mcr)",
           "Mcr = " + num(total.Mcr * 1e-6) + ", M = " + num(M_crit * 1e-6), zeta_crit, "-",
           "EN 1992-1-1 7.4.3(3) (7.19)");
    st.add("1/r", "ζ (1/r)II + (1 − ζ) (1/r)I, load and shrinkage", "at M_qp", total.curvature(M_crit) * 1e6,
           "1/km", "EN 1992-1-1 7.4.3(3) (7.18), (7.21)");
    st.add("n", "equal segments, ζ at every section, the jumps at ±Mcr placed exactly, converged to 0.5 %",
           "change " + num(w.change * 100.0) + " %", static_cast<double>(w.segments), "-", "EN 1992-1-1 7.4.3(7)");
    st.add("δ", "double integration of 1/r between the supports",
           "largest at " + num(w.x_at_mm * 1e-3) + " m", w.max_mm, "mm", "EN 1992-1-1 7.4.3(7)");
    st.add("δ_lim", "span/250", num(g.span_mm) + "/250", limit, "mm", "EN 1992-1-1 7.4.1(4)");
    return st.take();
  });
  if (!req_.serviceability.partitions || checks.verdict_settled()) return;
  // The part after the partitions: the long-term total less the deflection
  // when they are built (creep and shrinkage developed to t_p).
  const LongTermSection early = long_term_section(b, h, As, d, Ecm, m_.fctm, c.phi_p, c.eps_cs_p);
  const SpanDeflection w_p = span_deflection(qp, [&](double M) { return early.curvature(M); }, integration_tolerance,
                                             {early.Mcr, -early.Mcr});
  // Cracks open by t_p stay open: for the increment, the long-term state
  // cracks at no higher a moment than the state at t_p (its larger αe
  // raises Mcr), so ζ(∞) ≥ ζ(t_p) at every section and the increment is
  // not negative (DEVELOPERS.md).
  LongTermSection later = total;
  later.Mcr = std::min(total.Mcr, early.Mcr);
  const SpanDeflection w_later =
      later.Mcr < total.Mcr ? span_deflection(qp, [&](double M) { return later.curvature(M); }, integration_tolerance,
                                              {later.Mcr, -later.Mcr})
                            : w;
  // The increment at every point of the long-term state (w(t_p) linearly
  // between its own points), its largest.
  const auto [increment, x_increment] = largest_increment(w_later, w_p);
  const double limit_p = g.span_mm / partitions_deflection_span_ratio;
  checks.add("deflection", g.span_where, "EN 1992-1-1 7.4.3, 7.4.1(5) (span/500 after the partitions)", increment,
             limit_p, "mm", [&] {
               Steps st;
               partitions_age_steps(st);
               long_term_section_steps(st, early, " (t_p)", h);
               st.add("δ(t_p)", "double integration of 1/r at t_p", "", w_p.max_mm, "mm", "EN 1992-1-1 7.4.3(7)");
               if (later.Mcr < total.Mcr)
                 st.add("δ(∞)", "long-term, cracked where cracked at t_p (Mcr = Mcr(t_p) = " + num(later.Mcr * 1e-6) +
                            " kNm)", "", w_later.max_mm, "mm", "EN 1992-1-1 7.4.3(3), (7)");
               else
                 st.add("δ(∞)", "long-term total", "", w.max_mm, "mm", "EN 1992-1-1 7.4.3(7)");
               st.add("Δδ", "largest δ(∞) − δ(t_p) along the span",
                      "at " + num(x_increment * 1e-3) + " m (largest δ(∞) " + num(w_later.max_mm) + ", δ(t_p) " +
                          num(w_p.max_mm) + ")",
                      increment, "mm", "EN 1992-1-1 7.4.1(5)");
               st.add("δ_lim", "span/500", num(g.span_mm) + "/500", limit_p, "mm", "EN 1992-1-1 7.4.1(5)");
               return st.take();
             });
}

// ---- Calculated deflection of two-way and flat slabs (7.4.3 on a plate) ---------
// The kernel solves the plate with each element's secant rigidity from
// these responses (plate_deflection.cpp); the states: the long term, and
// with partitions the state at t_p and the long term cracked where it
// was cracked at t_p (as for a span: the increment is never negative).
namespace {
enum PlateState : std::size_t { plate_long_term = 0, plate_at_partitions = 1, plate_long_term_after = 2 };
}  // namespace

std::vector<PlateDeflectionState> Checker::plate_deflection_states() const {
  if (!req_.serviceability.calculated_deflection()) return {};
  const double Ecm = secant_modulus_MPa(m_.fck);
  const CreepShrinkage& c = long_term_;
  std::vector<PlateDeflectionState> states{
      {"long-term (φ(∞,t0), εcs(∞))", LimitState::quasi_permanent, effective_modulus(Ecm, c.phi_inf), 1.0}};
  if (req_.serviceability.partitions) {
    states.push_back({"when the partitions are built (φ(t_p,t0), εcs(t_p))", LimitState::quasi_permanent,
                      effective_modulus(Ecm, c.phi_p)});
    states.push_back({"long-term, cracked where cracked at t_p", LimitState::quasi_permanent,
                      effective_modulus(Ecm, c.phi_inf)});
  }
  return states;
}

// 7.4.3(3): the secant rigidity 1/(ζ/(Ec,eff I_II) + (1 − ζ)/(Ec,eff I_I))
// and the shrinkage curvature ζ (1/r_cs)II + (1 − ζ) (1/r_cs)I of the
// section's bars under M, as a span's section takes them.
PlateSectionResponse Checker::plate_section_response(const Section& sec, double M, std::size_t state) const {
  const SectionLayer& layer = sec.layers.front();
  const double b = sec.b_mm, As = layer.area_mm2(b), Ecm = secant_modulus_MPa(m_.fck);
  const CreepShrinkage& c = long_term_;
  const bool early = state == plate_at_partitions;
  LongTermSection s = long_term_section(b, sec.h_mm, As, layer.d_mm, Ecm, m_.fctm, early ? c.phi_p : c.phi_inf,
                                        early ? c.eps_cs_p : c.eps_cs_inf);
  if (state == plate_long_term_after)
    s.Mcr = std::min(s.Mcr, long_term_section(b, sec.h_mm, As, layer.d_mm, Ecm, m_.fctm, c.phi_p, c.eps_cs_p).Mcr);
  const double zeta = distribution_coefficient(M, s.Mcr, beta_sustained);
  const double flexibility = zeta / (s.Ec_eff * s.cracked.I) + (1.0 - zeta) / (s.Ec_eff * s.uncracked.I);
  return {1.0 / flexibility, interpolated_parameter(zeta, s.kcs_II, s.kcs_I), zeta > 0.0};
}

std::vector<Check> Checker::plate_deflection_checks(const PlateDeflectionDemand& d, Detail detail) const {
  std::vector<Check> out;
  RegionVerdict verdict;
  CheckCollector checks(out, verdict, detail);
  if (d.w_mm.empty() || d.w_mm.front().empty()) return out;
  const auto& w = d.w_mm[plate_long_term];
  const std::size_t at = static_cast<std::size_t>(std::max_element(w.begin(), w.end()) - w.begin());
  const double delta = std::max(w[at], 0.0), limit = d.span_mm / total_deflection_span_ratio;
  const SectionLayer& layer = d.section.layers.front();
  const double b = d.section.b_mm, h = d.section.h_mm;
  const CreepShrinkage& c = long_term_;
  const LongTermSection total = long_term_section(b, h, layer.area_mm2(b), layer.d_mm, secant_modulus_MPa(m_.fck),
                                                  m_.fctm, c.phi_inf, c.eps_cs_inf);
  const std::string span_name = is_flat_panel(d.span_kind) ? "the panel's longer span" : "the panel's shorter span";
  auto where_at = [&](std::size_t n) { return "at x = " + num(d.x_mm[n] * 1e-3) + " m, y = " + num(d.y_mm[n] * 1e-3) + " m"; };
  auto iteration_steps = [&](Steps& st, std::size_t state, const char* tag) {
    const auto& it = d.iterations[state];
    st.add(std::string("M_qp") + tag, "the panel's largest quasi-permanent moment per metre, every bay loaded", "",
           it.M_max_Nmm * 1e-6, "kNm", "EN 1990 (6.16b)");
    st.add(std::string("cracked") + tag, "share of the panel's elements with ζ > 0 in x or y", "",
           it.cracked_share * 100.0, "%", "EN 1992-1-1 7.4.3(3)");
    st.add(std::string("n") + tag, d.model, "change " + num(it.change * 100.0) + " % in the last round",
           static_cast<double>(it.rounds), "-", "EN 1992-1-1 7.4.3(3), (7)");
  };
  checks.add("deflection", d.where, "EN 1992-1-1 7.4.3, 7.4.1(4) (span/250)", delta, limit, "mm", [&] {
    Steps st;
    creep_shrinkage_steps(st, h);
    long_term_section_steps(st, total, " (bottom bars)", h);
    iteration_steps(st, plate_long_term, "");
    const double zeta = distribution_coefficient(d.iterations[plate_long_term].M_max_Nmm, total.Mcr, beta_sustained);
    st.add("ζ", "1 − β (Mcr/M)², β = 0.5 (0 for M ≤ Mcr), at M_qp with the bottom bars", "", zeta, "-",
           "EN 1992-1-1 7.4.3(3) (7.19)");
    st.add("δ", "largest deflection in the panel", where_at(at), delta, "mm", "EN 1992-1-1 7.4.3(7)");
    st.add("δ_lim", "span/250, " + span_name, num(d.span_mm) + "/250", limit, "mm", "EN 1992-1-1 7.4.1(4)");
    return st.take();
  });
  if (d.w_mm.size() <= plate_long_term_after || checks.verdict_settled()) return out;
  const auto& w_p = d.w_mm[plate_at_partitions];
  const auto& w_later = d.w_mm[plate_long_term_after];
  std::size_t at_p = 0;
  for (std::size_t n = 1; n < w_p.size(); ++n)
    if (w_later[n] - w_p[n] > w_later[at_p] - w_p[at_p]) at_p = n;
  const double increment = std::max(w_later[at_p] - w_p[at_p], 0.0);
  const double limit_p = d.span_mm / partitions_deflection_span_ratio;
  checks.add("deflection", d.where, "EN 1992-1-1 7.4.3, 7.4.1(5) (span/500 after the partitions)", increment, limit_p,
             "mm", [&] {
               Steps st;
               partitions_age_steps(st);
               iteration_steps(st, plate_at_partitions, " (t_p)");
               iteration_steps(st, plate_long_term_after, " (∞, cracked as at t_p)");
               st.add("Δδ", "largest δ(∞) − δ(t_p) in the panel",
                      where_at(at_p) + " (δ(∞) " + num(w_later[at_p]) + ", δ(t_p) " + num(w_p[at_p]) + ")", increment,
                      "mm", "EN 1992-1-1 7.4.1(5)");
               st.add("δ_lim", "span/500, " + span_name, num(d.span_mm) + "/500", limit_p, "mm",
                      "EN 1992-1-1 7.4.1(5)");
               return st.take();
             });
  return out;
}

// A cantilever (7.4.3 as for spans): its curvature from its own top bars
// (the section flipped: hogging as the tension face), ζ at every section
// and the top steel's shrinkage curvature; integrated from its root, which
// turns as the back span bends. The back span's bars are another region's:
// its hogging parts take the cantilever's top bars (they run into it past
// the hogging), its sagging parts the uncracked section with the top bars'
// shrinkage curvature — the least sagging curvature there can be, so the
// least the root turns back and the tip rises (on the safe side,
// DEVELOPERS.md). Limits: the cantilever's length / 250 (7.4.1(4)); with
// partitions the part after them / 500 (7.4.1(5)).
void Checker::cantilever_deflection_check(CheckCollector& checks, const Section& sec, const RegionDemand& g) const {
  const SectionLayer& layer = sec.outer_layer(Face::top);
  const double b = sec.b_mm, h = sec.h_mm, d = layer.d_mm, As = layer.area_mm2(b);
  const double Ecm = secant_modulus_MPa(m_.fck);
  const CreepShrinkage& c = long_term_;
  // The back span with every span loaded, and with the variable actions on
  // the cantilever only (its root then turns back the least): the worse.
  // None (null): a cantilever of one span, its root built in.
  std::vector<const SpanForces*> backs{g.back_span ? &*g.back_span : nullptr};
  if (g.back_span_unloaded) backs.push_back(&*g.back_span_unloaded);
  auto tip_of = [&](const LongTermSection& s, const SpanForces* back_forces, double* root_out) {
    // Hogging magnitude m ≥ 0 as the flipped section's sagging.
    const auto hog = [&s](double M) { return -s.curvature(-M); };
    const auto back = [&s](double M) {
      return M <= 0.0 ? -s.curvature(-M) : M / (s.Ec_eff * s.uncracked.I) - s.kcs_I;
    };
    double root_slope = 0.0;
    if (back_forces) {
      const SpanDeflection bs = span_deflection(*back_forces, back, integration_tolerance * 0.1, {-s.Mcr});
      root_slope = g.cantilever_root_at_start ? bs.slope_end : bs.slope_start;
    }
    if (root_out) *root_out = g.cantilever_root_at_start ? root_slope : -root_slope;
    return cantilever_deflection(*g.long_term_span, hog, g.cantilever_root_at_start, root_slope,
                                 integration_tolerance, {-s.Mcr});
  };
  const LongTermSection total = long_term_section(b, h, As, d, Ecm, m_.fctm, c.phi_inf, c.eps_cs_inf);
  std::size_t governing = 0;
  double theta_root = 0.0;
  SpanDeflection w;
  for (std::size_t k = 0; k < backs.size(); ++k) {
    double theta = 0.0;
    SpanDeflection wk = tip_of(total, backs[k], &theta);
    if (k == 0 || wk.max_mm > w.max_mm) {
      w = std::move(wk);
      theta_root = theta;
      governing = k;
    }
  }
  const double limit = g.span_mm / total_deflection_span_ratio;
  const double M_root = -std::min(g.long_term_span->M_left, g.long_term_span->M_right());
  checks.add("deflection", g.span_where, "EN 1992-1-1 7.4.3, 7.4.1(4) (cantilever, length/250)", w.max_mm, limit, "mm",
             [&] {
               Steps st;
               st.add("φ(∞,t0)", c.creep_given ? "given" : "Annex B (B.1)–(B.9)", "", c.phi_inf, "-",
                      "EN 1992-1-1 3.1.4(2), Annex B");
               st.add("εcs(∞)", c.shrinkage_given ? "given" : "3.1.4(6) (3.8)–(3.13)", "", c.eps_cs_inf * 1e6,
                      "10⁻⁶", "EN 1992-1-1 3.1.4(6)");
               st.add("Ec,eff", "Ecm/(1 + φ)", "", total.Ec_eff, "MPa", "EN 1992-1-1 7.4.3(5) (7.20)");
               st.add("d", "the top bars' depth from the top face (the section flipped)", "", d, "mm",
                      "EN 1992-1-1 7.4.3");
               st.add("I_I", "uncracked transformed section, top bars", "", total.uncracked.I * 1e-6, "10⁶ mm⁴",
                      "EN 1992-1-1 7.4.3");
               st.add("I_II", "cracked: b x³/3 + αe As (d − x)²", "", total.cracked.I * 1e-6, "10⁶ mm⁴",
                      "EN 1992-1-1 7.4.3");
               st.add("Mcr", "fctm I_I/(h − x_I), tension at the top", "", total.Mcr * 1e-6, "kNm",
                      "EN 1992-1-1 7.4.3(3)");
               st.add("M_root", "quasi-permanent hogging at the root", "", M_root * 1e-6, "kNm", "EN 1990 (6.16b)");
               if (g.back_span)
                 st.add("θ_root", std::string("rotation of the back span at the root, tip down positive, with ") +
                                      (governing == 0 ? "every span loaded"
                                                      : "the variable actions on the cantilever only (the worse)") +
                                      ": its curvature integrated between its supports (hogging: these top bars; "
                                      "sagging: uncracked, on the safe side)",
                        "", theta_root * 1e3, "mrad", "EN 1992-1-1 7.4.3(7)");
               else
                 st.add("θ_root", "the root built in (a strip of one span, its end fixed)", "", 0.0, "mrad",
                        "EN 1992-1-1 7.4.3(7)");
               st.add("δ", "θ_root × length + double integration of 1/r from the root", "at the tip", w.max_mm,
                      "mm", "EN 1992-1-1 7.4.3(7)");
               st.add("δ_lim", "length/250", num(g.span_mm) + "/250", limit, "mm", "EN 1992-1-1 7.4.1(4)");
               return st.take();
             });
  if (!req_.serviceability.partitions || checks.verdict_settled()) return;
  LongTermSection early = long_term_section(b, h, As, d, Ecm, m_.fctm, c.phi_p, c.eps_cs_p);
  LongTermSection later = total;
  later.Mcr = std::min(total.Mcr, early.Mcr);  // cracks open at t_p stay open
  // The largest change along the cantilever (the tip's, as a rule), with
  // the deflections as they are (a tip that rose at t_p counts its rise).
  double increment = 0.0, w_inf = 0.0, w_tp = 0.0;
  for (const SpanForces* bk : backs) {
    const SpanDeflection a = tip_of(later, bk, nullptr), e = tip_of(early, bk, nullptr);
    const double inc = largest_increment(a, e).first;
    if (inc >= increment) {
      increment = inc;
      w_inf = g.cantilever_root_at_start ? a.points.back().deflection_mm : a.points.front().deflection_mm;
      w_tp = g.cantilever_root_at_start ? e.points.back().deflection_mm : e.points.front().deflection_mm;
    }
  }
  checks.add("deflection", g.span_where, "EN 1992-1-1 7.4.3, 7.4.1(5) (cantilever, length/500 after the partitions)",
             increment, g.span_mm / partitions_deflection_span_ratio, "mm", [&] {
               Steps st;
               st.add("φ(t_p,t0)", "φ(∞,t0) βc(t_p,t0)", "", c.phi_p, "-", "EN 1992-1-1 Annex B (B.1), (B.7)");
               st.add("εcs(t_p)", "3.1.4(6) at t_p", "", c.eps_cs_p * 1e6, "10⁻⁶", "EN 1992-1-1 3.1.4(6)");
               st.add("δ(t_p)", "tip deflection at t_p (negative: up)", "", w_tp, "mm", "EN 1992-1-1 7.4.3(7)");
               st.add("δ(∞)", "tip deflection at ∞, cracked where cracked at t_p", "", w_inf, "mm",
                      "EN 1992-1-1 7.4.3(7)");
               st.add("Δδ", "largest δ(∞) − δ(t_p) along the cantilever", "", increment, "mm",
                      "EN 1992-1-1 7.4.1(5)");
               st.add("δ_lim", "length/500", num(g.span_mm) + "/500", g.span_mm / partitions_deflection_span_ratio,
                      "mm", "EN 1992-1-1 7.4.1(5)");
               return st.take();
             });
}

double Checker::pinned_end_fixity_fraction() const { return partial_fixity_fraction; }

// 9.3.1.3(1): where the supports keep a slab's corner from lifting,
// suitable reinforcement is provided. The clause sets no quantity: the
// corner zone's top and bottom bars take the Wood–Armer moments there (the
// torsion of the analysis). No extent in the clause either: a fifth of the
// longer span, as ACI 318-19 8.7.3.1.2 sets (common practice, DEVELOPERS.md).
CornerRule Checker::corner_rule() const { return {0.0, 0.2, true, "EN 1992-1-1 9.3.1.3"}; }

// 9.3.1.4: along a free edge, longitudinal and transverse reinforcement as
// Figure 9.8 shows: U-bars with legs of 2h, the slab's own bars serving
// (9.3.1.4(2)).
FreeEdgeRule Checker::free_edge_rule() const { return {2.0, "EN 1992-1-1 9.3.1.4, Figure 9.8"}; }

// Annex I.1.2 Figure I.1 (from memory): column strips 0.25 lx each side of
// the column line, lx the panel's shorter span; 9.4.1(2): over internal
// columns half the top steel of the whole panel width within 0.125 × the
// panel width each side.
FlatStripRule Checker::flat_strip_rule() const {
  return {0.25, "EN 1992-1-1 Annex I.1.2, Figure I.1", 0.125, 0.5, "EN 1992-1-1 9.4.1(2)"};
}

std::vector<Check> Checker::span_checks(const std::string& span_where) const {
  std::vector<Check> out;
  if (req_.fire.resistance_min && req_.slab_type == SlabType::flat) {
    out.push_back(run_check("fire", [&] {
      const int t = *req_.fire.resistance_min;
      const double h_min = fire_min_thickness_flat(t);
      std::vector<Step> st;
      st.push_back({"h_s,min", "Table 5.9, flat slab", "REI " + std::to_string(t), h_min, "mm",
                    "EN 1992-1-2 5.7.4 Table 5.9"});
      return make_check("fire", span_where, "EN 1992-1-2 5.7.4 Table 5.9 (thickness)", h_min, req_.slab.thickness_mm,
                        "mm", std::move(st));
    }));
    return out;
  }
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
  if (req_.slab_type == SlabType::flat) {  // 5.7.4: every bottom strip of a flat slab
    const double a = c_nom + phi / 2.0, a_min = fire_min_axis_distance_flat(t);
    checks.add("fire", g.where, "EN 1992-1-2 5.7.4 Table 5.9 (axis distance)", a_min, a, "mm", [&] {
      Steps st;
      st.add("a", "c_nom + φ/2 (the face's cover; an inner layer lies deeper)", num(c_nom) + " + " + num(phi) + "/2",
             a, "mm", "EN 1992-1-2 5.7.4");
      st.add("a_min", "Table 5.9, flat slab", "REI " + std::to_string(t), a_min, "mm", "EN 1992-1-2 5.7.4 Table 5.9");
      return st.take();
    });
    return;
  }
  if (g.direction != BarDirection::span && g.long_span_mm > 0.0) {  // a two-way bay on four edges
    const double ratio = g.long_span_mm / g.span_mm;
    const int column = fire_two_way_column(ratio);
    const double a2 = c_nom + phi / 2.0, a2_min = fire_min_axis_distance_two_way(t, ratio);
    const std::string clause = "EN 1992-1-2 5.7.2 Table 5.8 column " + std::to_string(column) + " (axis distance)";
    checks.add("fire", g.where, clause, a2_min, a2, "mm", [&] {
      Steps st;
      st.add("a", "c_nom + φ/2 (the face's cover; an inner layer lies deeper)", num(c_nom) + " + " + num(phi) + "/2",
             a2, "mm", "EN 1992-1-2 5.7.2");
      st.add("ly/lx", "longer/shorter span", num(g.long_span_mm) + "/" + num(g.span_mm), ratio, "-",
             "EN 1992-1-2 5.7.2 Table 5.8");
      st.add("a_min", "Table 5.8 column " + std::to_string(column) + ", slab supported on four edges",
             "REI " + std::to_string(t), a2_min, "mm", clause);
      return st.take();
    });
    return;
  }
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
  const bool flat = is_flat_panel(g.span_kind);
  const double f_long = flat ? flat_slab_long_span_factor(g.span_mm) : long_span_factor(g.span_mm);
  const double f_steel = steel_stress_factor(m_.fyk, As_prov, As_req, ndp_.steel_stress_factor_cap);
  const double modified = basic * f_long * f_steel;
  const double allowed = capped_span_depth_ratio(modified, K, ndp_.span_depth_cap_K);
  const bool capped = allowed < modified;
  const double actual = g.span_mm / d;
  const char* clause = capped ? "EN 1992-1-1 7.4.2 (7.16), Table 7.4N; l/d capped by variant NDP"
                              : "EN 1992-1-1 7.4.2 (7.16), Table 7.4N";
  if (checks.detail() != Detail::verdict && req_.serviceability.deflection) note_span_depth_range(g, allowed, K);
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
    st.add("F_l", flat ? "8.5/leff when leff > 8.5 m (flat slab)" : "7/leff when leff > 7 m",
           num(g.span_mm * 1e-3) + " m", f_long, "-", "EN 1992-1-1 7.4.2(2)");
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

