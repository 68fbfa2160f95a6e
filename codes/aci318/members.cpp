// ACI 318-19 member rules, the checks of the member rather than of one
// section: minimum thickness for deflection, equilibrium of a cantilever's
// back span, the design moment at a support with a width.
#include <cmath>
#include <string>

#include "armature/deflection.hpp"
#include "checker.hpp"

namespace armature::aci318 {

namespace {

SupportCondition condition_of(SpanKind kind) {
  switch (kind) {
    case SpanKind::simply_supported: return SupportCondition::simply_supported;
    case SpanKind::end_span: return SupportCondition::one_end_continuous;
    case SpanKind::interior_span: return SupportCondition::both_ends_continuous;
    case SpanKind::cantilever: return SupportCondition::cantilever;
    case SpanKind::flat_exterior_panel:
    case SpanKind::flat_interior_panel: break;  // Table 8.3.1.1, flat_slab_deflection_check
  }
  return SupportCondition::simply_supported;
}

const char* condition_name(SupportCondition c) {
  switch (c) {
    case SupportCondition::simply_supported: return "simply supported, ℓ/20";
    case SupportCondition::one_end_continuous: return "one end continuous, ℓ/24";
    case SupportCondition::both_ends_continuous: return "both ends continuous, ℓ/28";
    case SupportCondition::cantilever: return "cantilever, ℓ/10";
  }
  return "";
}

}  // namespace

// Uplift at the back span's far support under the 5.3.1 combinations
// with the live loads on the spans that lift it (ACI 318-19 has no factor
// below 1.2 on D without W or E: 0.9D of (f), (g) is not used).
std::vector<Check> Checker::equilibrium_checks(const EquilibriumDemand& d, Detail detail) const {
  std::vector<Check> out;
  RegionVerdict verdict;
  CheckCollector checks(out, verdict, detail == Detail::verdict ? Detail::checks : detail);
  run_check("equilibrium", [&] {
    checks.add("equilibrium", d.where, "ACI 318-19 5.3.1, L on the spans that lift the support", d.R_destabilising * 1e-3,
               d.R_stabilising * 1e-3, "kN", [&] {
                 StepRecorder st;
                 st.add("R,stb", "reaction from the spans that hold the support down", "", force_v(d.R_stabilising),
                        force_u(), "ACI 318-19 5.3.1");
                 st.add("R,dst", "reaction taken away by the spans that lift it (with L)", "",
                        force_v(d.R_destabilising), force_u(), "ACI 318-19 5.3.1");
                 st.add("R,min", "R,stb − R,dst under " + d.combination + " (negative: uplift)",
                        force(d.R_stabilising) + " − " + force(d.R_destabilising),
                        force_v(d.R_stabilising - d.R_destabilising), force_u(), "ACI 318-19 5.3.1");
                 return st.take();
               });
  });
  return out;
}

// 8.3.1.2: the minimum thickness of a two-way slab on walls or stiff
// beams (clear spans taken as the spans given).
void Checker::two_way_deflection_check(CheckCollector& span, const RegionDemand& g, double h) const {
  const double h_min = two_way_min_thickness(g.long_span_mm, g.span_mm);
  span.add("deflection", g.span_where, "ACI 318-19 8.3.1.2", h_min, h, "mm", [&] {
    StepRecorder st;
    st.add("β", "ℓn,long/ℓn,short", len(g.long_span_mm) + "/" + len(g.span_mm), g.long_span_mm / g.span_mm, "-",
           "ACI 318-19 8.3.1.2");
    st.add("h_min", us_ ? "ℓn (0.8 + fy/200 000)/(36 + 9β) ≥ 3.5 in" : "ℓn (0.8 + fy/1400)/(36 + 9β) ≥ 90 mm",
           "ℓn = " + len(g.long_span_mm) + us_unit(len_u()) + ", fy = " + stress(fy_) + us_unit(stress_u()),
           len_v(h_min), len_u(), "ACI 318-19 8.3.1.2 (αfm > 2: walls or stiff beams)");
    return st.take();
  });
}

// Table 8.3.1.1: the minimum thickness of a flat slab without drop panels
// (no interior beams), from the clear span in the long direction;
// exterior panels without edge beams, interior panels (a wall edge counts
// as an edge beam: the interior column of the table).
void Checker::flat_slab_deflection_check(CheckCollector& span, const RegionDemand& g, double h) const {
  const bool exterior = g.span_kind == SpanKind::flat_exterior_panel;
  const double divisor = us_ ? flat_slab_thickness_divisor(fy_ / MPa_per_psi, {40000.0, 60000.0, 75000.0}, exterior)
                             : flat_slab_thickness_divisor(fy_, {280.0, 420.0, 520.0}, exterior);
  const double floor = us_ ? 5.0 * mm_per_in : 125.0;
  const double h_min = std::max(g.clear_span_mm / divisor, floor);
  span.add("deflection", g.span_where, "ACI 318-19 8.3.1.1 Table 8.3.1.1", h_min, h, "mm", [&] {
    StepRecorder st;
    st.add("ℓn", "clear span in the long direction, face to face of the columns", len(g.clear_span_mm) + us_unit(len_u()),
           len_v(g.clear_span_mm), len_u(), "ACI 318-19 8.3.1.1");
    st.add("ℓn/h", exterior ? "Table 8.3.1.1, exterior panel without edge beams" : "Table 8.3.1.1, interior panel",
           "fy = " + stress(fy_) + us_unit(stress_u()) + " (between the rows: linear)", divisor, "-",
           "ACI 318-19 Table 8.3.1.1 (from memory)");
    st.add("h_min", us_ ? "max(ℓn/(ℓn/h), 5 in)" : "max(ℓn/(ℓn/h), 125 mm)", len(g.clear_span_mm) + "/" + num(divisor),
           len_v(h_min), len_u(), "ACI 318-19 8.3.1.1 (a)");
    return st.take();
  });
}

// 7.3.1.1: the minimum thickness of a solid one-way slab of this span.
void Checker::deflection_check(CheckCollector& span, const RegionDemand& g, double h) const {
  const SupportCondition cond = condition_of(g.span_kind);
  const double h_min = min_thickness(g.span_mm, cond);
  span.add("deflection", g.span_where, "ACI 318-19 7.3.1.1", h_min, h, "mm", [&] {
    StepRecorder st;
    st.add("h_min",
           std::string("Table 7.3.1.1: ") + condition_name(cond) + (us_ ? ", × (0.4 + fy/100 000)" : ", × (0.4 + fy/700)"),
           "ℓ = " + len(g.span_mm) + us_unit(len_u()) + ", fy = " + stress(fy_) + us_unit(stress_u()), len_v(h_min),
           len_u(), "ACI 318-19 7.3.1.1");
    return st.take();
  });
}

// The check that reads a region's section: the minimum thickness of the
// span these bars govern.
MemberSectionOutcome Checker::check_with_section(const Section& sec, const RegionDemand& g, const SectionOutcome&,
                                                 Detail detail) const {
  MemberSectionOutcome out;
  if (!g.span_where.empty()) {
    CheckCollector span(out.span_checks, out.verdict, detail);
    // Minimum thickness (7.3.1.1), calculated (24.2), or both; a check
    // carries its method only when the request names one.
    const auto& sv = req_.serviceability;
    // A cantilever turns with its back span at both load levels, or from a
    // built-in root where the strip has no other span.
    // A plate's panel is calculated by the kernel on the whole plate
    // (plate_deflection_checks), not here.
    const bool plate = g.direction != BarDirection::span;
    const bool calculated =
        sv.calculated_deflection() &&
        (plate || (g.long_term_span && (g.span_kind != SpanKind::cantilever || (g.back_span && g.back_service_span) ||
                                        (!g.back_span && g.service_span))));
    if (sv.deflection_method() != DeflectionMethod::calculated || !calculated) {
      const std::size_t before = out.span_checks.size();
      run_check("deflection", [&] {
        if (is_flat_panel(g.span_kind)) flat_slab_deflection_check(span, g, sec.h_mm);
        else if (g.direction != BarDirection::span) two_way_deflection_check(span, g, sec.h_mm);
        else deflection_check(span, g, sec.h_mm);
      });
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

Checker::DeflectionSection Checker::deflection_section(const Section& sec, Face tension_face) const {
  const SectionLayer& layer = sec.outer_layer(tension_face);
  DeflectionSection ds;
  ds.b = sec.b_mm;
  ds.h = sec.h_mm;
  ds.d = layer.d_mm;
  ds.As = layer.area_mm2(ds.b);
  ds.Ec = concrete_modulus();
  ds.fr = rupture_modulus();
  ds.n = reinforcement_modulus() / ds.Ec;
  ds.Ig = gross_moment_of_inertia(ds.b, ds.h);
  ds.Mcr = cracking_moment(ds.fr, ds.Ig, ds.h / 2.0);
  ds.cracked = cracked_section(ds.b, ds.As, ds.d, ds.n);
  return ds;
}

// 24.2 (values from memory of ACI 318-19): immediate deflections under D
// and D + L with Ie of Table 24.2.3.5, each load level's Ie from its own
// largest positive moment in the span (the midspan section, 24.2.3.6),
// constant along the span, integrated over the span's moment diagram by
// the kernel; the live part by difference; long term by 24.2.4.1 with
// ρ' = 0. The sustained load is the plug-in's sustained combination (D).
void Checker::calculated_deflection_check(CheckCollector& span, const Section& sec, const RegionDemand& g) const {
  const DeflectionSection ds = deflection_section(sec, Face::bottom);
  const double b = ds.b, h = ds.h, d = ds.d, As = ds.As, Ec = ds.Ec, fr = ds.fr, n = ds.n, Ig = ds.Ig, Mcr = ds.Mcr;
  const CrackedSection& cr = ds.cracked;
  const SpanForces& sustained = *g.long_term_span;
  const SpanForces& service = g.service_span ? *g.service_span : sustained;
  struct Level {
    double Ma, Ie, delta;
  };
  auto level_of = [&](const SpanForces& f) {
    Level l;
    l.Ma = std::max(f.max_moment(), 0.0);
    l.Ie = effective_moment_of_inertia(l.Ma, Mcr, Ig, cr.Icr);
    const double EI = Ec * l.Ie;
    l.delta = span_deflection(f, [EI](double M) { return M / EI; }).max_mm;
    return l;
  };
  const Level sus = level_of(sustained), all = level_of(service);
  const double live = all.delta - sus.delta;
  const double lambda_delta = long_term_multiplier(time_dependent_factor_five_years, 0.0);
  const double long_term = lambda_delta * sus.delta + live;
  const double L = g.span_mm;
  auto common_steps = [&](StepRecorder& st) {
    st.add("Ec", us_ ? "57 000 √f'c" : "4700 √f'c", "√" + stress(fc_), stress_v(Ec), stress_u(),
           "ACI 318-19 19.2.2.1");
    st.add("fr", us_ ? "7.5 λ √f'c, λ = 1" : "0.62 λ √f'c, λ = 1", "√" + stress(fc_), stress_v(fr), stress_u(),
           "ACI 318-19 19.2.3.1");
    st.add("Ig", "b h³/12", "b = " + len(b) + ", h = " + len(h), us_ ? Ig / std::pow(mm_per_in, 4) : Ig * 1e-6,
           us_ ? "in4" : "10⁶ mm⁴", "ACI 318-19 24.2.3.5");
    st.add("Mcr", "fr Ig/yt, yt = h/2", "", moment_v(Mcr), moment_u(), "ACI 318-19 24.2.3.5");
    st.add("n", "Es/Ec", "", n, "-", "ACI 318-19 20.2.2.2");
    st.add("x", "b x²/2 = n As (d − x)", "As = " + area(As) + ", d = " + len(d), len_v(cr.x), len_u(),
           "ACI 318-19 24.2.3.5");
    st.add("Icr", "b x³/3 + n As (d − x)²", "", us_ ? cr.Icr / std::pow(mm_per_in, 4) : cr.Icr * 1e-6,
           us_ ? "in4" : "10⁶ mm⁴", "ACI 318-19 24.2.3.5");
    for (const auto& [name, l] : {std::pair<const char*, const Level&>{"D (sustained)", sus}, {"D + L", all}}) {
      const std::string tag = std::string(" (") + name + ")";
      st.add("Ma" + tag, "largest positive moment of the span, all spans loaded", "", moment_v(l.Ma), moment_u(),
             "ACI 318-19 24.2.3.6");
      st.add("Ie" + tag, l.Ma > 2.0 / 3.0 * Mcr ? "Icr/(1 − ((2/3) Mcr/Ma)² (1 − Icr/Ig))" : "Ig (Ma ≤ (2/3) Mcr)", "",
             us_ ? l.Ie / std::pow(mm_per_in, 4) : l.Ie * 1e-6, us_ ? "in4" : "10⁶ mm⁴", "ACI 318-19 Table 24.2.3.5");
      st.add("Δ" + tag, "double integration of M/(Ec Ie) between the supports", "", len_v(l.delta), len_u(),
             "ACI 318-19 24.2.3.1");
    }
  };
  deflection_checks(span, g.span_where, "", "", DeflectionPair{sus.delta, all.delta}, live, long_term, lambda_delta, L,
                    common_steps);
}

// For the record: the long-term deflection of 24.2.4.1 along the span,
// λΔ Δ(D)(x) + (Δ(D + L)(x) − Δ(D)(x)), and the curvature whose double
// integral it is, λΔ M_D/(Ec Ie,D) + M_D+L/(Ec Ie,D+L) − M_D/(Ec Ie,D), each
// load level with its own Ie as the check takes it; both levels on the
// same segments (the finer of their converged integrations).
std::optional<SpanDeflection> Checker::deflection_diagram(const Section& sec, const RegionDemand& g) const {
  if (!req_.serviceability.calculated_deflection() || !g.long_term_span || g.span_kind == SpanKind::cantilever ||
      g.direction != BarDirection::span)
    return std::nullopt;
  const DeflectionSection ds = deflection_section(sec, Face::bottom);
  const double Ec = ds.Ec, Ig = ds.Ig, Mcr = ds.Mcr, Icr = ds.cracked.Icr;
  const SpanForces& sustained = *g.long_term_span;
  const SpanForces& service = g.service_span ? *g.service_span : sustained;
  auto EI_of = [&](const SpanForces& f) {
    return Ec * effective_moment_of_inertia(std::max(f.max_moment(), 0.0), Mcr, Ig, Icr);
  };
  const double EI_sus = EI_of(sustained), EI_all = EI_of(service);
  const auto k_sus = [EI_sus](double M) { return M / EI_sus; };
  const auto k_all = [EI_all](double M) { return M / EI_all; };
  const std::size_t segments =
      std::max(span_deflection(sustained, k_sus).segments, span_deflection(service, k_all).segments);
  SpanDeflection sus = span_deflection_fixed(sustained, k_sus, segments);
  const SpanDeflection all = span_deflection_fixed(service, k_all, segments);
  const double lambda_delta = long_term_multiplier(time_dependent_factor_five_years, 0.0);
  SpanDeflection out = sus;
  out.max_mm = 0.0;
  for (std::size_t i = 0; i < out.points.size() && i < all.points.size(); ++i) {
    DeflectionPoint& p = out.points[i];
    const DeflectionPoint &s_ = sus.points[i], &a = all.points[i];
    p.moment = a.moment;
    p.curvature = lambda_delta * s_.curvature + a.curvature - s_.curvature;
    p.deflection_mm = lambda_delta * s_.deflection_mm + a.deflection_mm - s_.deflection_mm;
    if (i == 0 || p.deflection_mm > out.max_mm) {
      out.max_mm = p.deflection_mm;
      out.x_at_mm = p.x_mm;
    }
  }
  return out;
}

// ---- Calculated deflection of two-way and flat slabs (24.2 on a plate) ----------
// The kernel solves the plate at D and at D + L with each element's Ec Ie
// (Table 24.2.3.5 from the element's own moment: the plate's counterpart
// of Ie at every section) and these checks read the panel's nodes: the
// immediate live deflection Δ(D + L) − Δ(D) and the long-term λΔ Δ(D) +
// live, each at its largest node.
namespace {
enum PlateLevel : std::size_t { plate_dead = 0, plate_service = 1 };
}  // namespace

std::vector<PlateDeflectionState> Checker::plate_deflection_states() const {
  if (!req_.serviceability.calculated_deflection()) return {};
  const double Ec = concrete_modulus();
  const double lambda_delta = long_term_multiplier(time_dependent_factor_five_years, 0.0);
  return {{"D (sustained)", LimitState::quasi_permanent, Ec, lambda_delta - 1.0},
          {"D + L (service)", LimitState::characteristic, Ec, 1.0}};
}

PlateSectionResponse Checker::plate_section_response(const Section& sec, double M, std::size_t) const {
  const DeflectionSection ds = deflection_section(sec, sec.layers.front().face);
  const double Ie = effective_moment_of_inertia(M, ds.Mcr, ds.Ig, ds.cracked.Icr);
  return {ds.Ec * Ie, 0.0, Ie < ds.Ig};
}

std::vector<Check> Checker::plate_deflection_checks(const PlateDeflectionDemand& d, Detail detail) const {
  std::vector<Check> out;
  RegionVerdict verdict;
  CheckCollector span(out, verdict, detail);
  if (d.w_mm.size() <= plate_service || d.w_mm.front().empty()) return out;
  const auto& wD = d.w_mm[plate_dead];
  const auto& wDL = d.w_mm[plate_service];
  const double lambda_delta = long_term_multiplier(time_dependent_factor_five_years, 0.0);
  DeflectionPair deltas;
  double live = 0.0, long_term = 0.0;
  for (std::size_t n = 0; n < wD.size(); ++n) {
    deltas.sustained = std::max(deltas.sustained, wD[n]);
    deltas.all = std::max(deltas.all, wDL[n]);
    live = std::max(live, wDL[n] - wD[n]);
    long_term = std::max(long_term, lambda_delta * wD[n] + wDL[n] - wD[n]);
  }
  const DeflectionSection ds = deflection_section(d.section, Face::bottom);
  auto steps = [&](StepRecorder& st) {
    st.add("Ig", "b h³/12", "", us_ ? ds.Ig / std::pow(mm_per_in, 4) : ds.Ig * 1e-6, us_ ? "in4" : "10⁶ mm⁴",
           "ACI 318-19 24.2.3.5");
    st.add("Mcr", "fr Ig/yt, yt = h/2", "", moment_v(ds.Mcr), moment_u(), "ACI 318-19 24.2.3.5");
    st.add("Icr", "b x³/3 + n As (d − x)², the panel's bottom bars", "As = " + area(ds.As) + ", d = " + len(ds.d),
           us_ ? ds.cracked.Icr / std::pow(mm_per_in, 4) : ds.cracked.Icr * 1e-6, us_ ? "in4" : "10⁶ mm⁴",
           "ACI 318-19 24.2.3.5");
    for (const std::size_t level : {plate_dead, plate_service}) {
      const auto& it = d.iterations[level];
      const std::string tag = level == plate_dead ? " (D)" : " (D + L)";
      st.add("Ma" + tag, "the panel's largest moment per " + std::string(us_ ? "foot" : "metre") + ", every bay loaded",
             "", moment_v(it.M_max_Nmm), moment_u(), "ACI 318-19 24.2.3.7");
      st.add("cracked" + tag, "share of the panel's elements with Ma > (2/3) Mcr in x or y", "",
             it.cracked_share * 100.0, "%", "ACI 318-19 Table 24.2.3.5");
      st.add("n" + tag, d.model, "change " + num(it.change * 100.0) + " % in the last round",
             static_cast<double>(it.rounds), "-", "ACI 318-19 24.2.3");
    }
    st.add("Δ (D)", "largest in the panel", "", len_v(deltas.sustained), len_u(), "ACI 318-19 24.2.3.1");
    st.add("Δ (D + L)", "largest in the panel", "", len_v(deltas.all), len_u(), "ACI 318-19 24.2.3.1");
  };
  const std::string panel = is_flat_panel(d.span_kind) ? "panel, ℓ its longer span" : "panel, ℓ its shorter span";
  deflection_checks(span, d.where, panel + ", ", " (" + panel + ")", deltas, live, long_term, lambda_delta, d.span_mm,
                    steps);
  return out;
}

// A cantilever (24.2, values from memory): Ie of Table 24.2.3.5 from the
// moment at the support (24.2.3.7) with the top bars' Icr, per load level;
// integrated from its root, which turns with the back span. The back
// span's bars are another region's: its hogging parts take the
// cantilever's Ie, its sagging parts Ig (the least sagging curvature, so
// the least the root turns back: on the safe side, as for EN). D + L with
// the live load on every span and on the cantilever only: the worse.
// Immediate live by difference against ℓ/360, long term λΔ Δ(D) + live
// against ℓ/240 or ℓ/480, ℓ the cantilever's length.
void Checker::cantilever_deflection_check(CheckCollector& span, const Section& sec, const RegionDemand& g) const {
  const DeflectionSection ds = deflection_section(sec, Face::top);
  const double Ec = ds.Ec, Ig = ds.Ig, Mcr = ds.Mcr, Icr = ds.cracked.Icr;
  const bool at_start = g.cantilever_root_at_start;
  // The tip from the root, which turns with the back span (none: a
  // cantilever of one span, its root built in).
  auto tip = [&](const SpanForces& cant, const SpanForces* back, double Ie) {
    const double EIe = Ec * Ie, EIg = Ec * Ig;
    const auto k_back = [EIe, EIg](double M) { return M <= 0.0 ? M / EIe : M / EIg; };
    double root = 0.0;
    if (back) {
      const SpanDeflection bs = span_deflection(*back, k_back, 0.0005);
      root = at_start ? bs.slope_end : bs.slope_start;
    }
    return cantilever_deflection(cant, [EIe](double M) { return M / EIe; }, at_start, root).max_mm;
  };
  const SpanForces* back_D = g.back_span ? &*g.back_span : nullptr;
  const SpanForces* back_DL = g.back_service_span ? &*g.back_service_span : nullptr;
  auto root_moment = [](const SpanForces& f) { return std::max(-std::min(f.M_left, f.M_right()), 0.0); };
  const double Ma_D = root_moment(*g.long_term_span), Ma_DL = root_moment(*g.service_span);
  const double Ie_D = effective_moment_of_inertia(Ma_D, Mcr, Ig, Icr);
  const double Ie_DL = effective_moment_of_inertia(Ma_DL, Mcr, Ig, Icr);
  double d_D = tip(*g.long_term_span, back_D, Ie_D);
  if (g.back_span_unloaded) d_D = std::max(d_D, tip(*g.long_term_span, &*g.back_span_unloaded, Ie_D));
  double d_DL = tip(*g.service_span, back_DL, Ie_DL);
  if (g.back_service_span_unloaded) d_DL = std::max(d_DL, tip(*g.service_span, &*g.back_service_span_unloaded, Ie_DL));
  const double live = std::max(d_DL - d_D, 0.0);
  const double lambda_delta = long_term_multiplier(time_dependent_factor_five_years, 0.0);
  const double long_term = lambda_delta * d_D + live;
  const double L = g.span_mm;
  auto steps = [&](StepRecorder& st) {
    st.add("Ig", "b h³/12", "", us_ ? Ig / std::pow(mm_per_in, 4) : Ig * 1e-6, us_ ? "in4" : "10⁶ mm⁴",
           "ACI 318-19 24.2.3.5");
    st.add("Mcr", "fr Ig/yt, yt = h/2", "", moment_v(Mcr), moment_u(), "ACI 318-19 24.2.3.5");
    st.add("Icr", "b x³/3 + n As (d − x)², the top bars", "As = " + area(ds.As) + ", d = " + len(ds.d),
           us_ ? Icr / std::pow(mm_per_in, 4) : Icr * 1e-6, us_ ? "in4" : "10⁶ mm⁴", "ACI 318-19 24.2.3.5");
    st.add("Ma (D)", "moment at the support", "", moment_v(Ma_D), moment_u(), "ACI 318-19 24.2.3.7");
    st.add("Ie (D)", "Table 24.2.3.5 at Ma (D)", "", us_ ? Ie_D / std::pow(mm_per_in, 4) : Ie_D * 1e-6,
           us_ ? "in4" : "10⁶ mm⁴", "ACI 318-19 Table 24.2.3.5");
    st.add("Ma (D + L)", "moment at the support", "", moment_v(Ma_DL), moment_u(), "ACI 318-19 24.2.3.7");
    st.add("Ie (D + L)", "Table 24.2.3.5 at Ma (D + L)", "", us_ ? Ie_DL / std::pow(mm_per_in, 4) : Ie_DL * 1e-6,
           us_ ? "in4" : "10⁶ mm⁴", "ACI 318-19 Table 24.2.3.5");
    st.add("Δ (D)", back_D ? "at the tip, from the root, which turns with the back span (its sagging with Ig)"
                           : "at the tip, from the built-in root (a strip of one span, its end fixed)",
           "", len_v(d_D), len_u(), "ACI 318-19 24.2.3.1");
    st.add("Δ (D + L)", "likewise; live load on every span or on the cantilever only, the worse", "",
           len_v(d_DL), len_u(), "ACI 318-19 24.2.3.1");
  };
  deflection_checks(span, g.span_where, "cantilever, ", ", ℓ the cantilever's length", DeflectionPair{d_D, d_DL}, live,
                    long_term, lambda_delta, L, steps);
}

// The two checks of 24.2 (Table 24.2.2): the immediate live deflection
// against ℓ/360, then, unless the verdict is settled, the part after
// attachment, λΔ Δ(D) + live, against ℓ/240 or ℓ/480 with partitions.
// `kind` opens the clause's parenthesis ("cantilever, " or empty),
// `span_note` follows ℓ/360 in the limit's step (what ℓ is); `steps`
// writes the derivation both share.
void Checker::deflection_checks(CheckCollector& span, const std::string& where, const std::string& kind,
                                const std::string& span_note, DeflectionPair deltas, double live, double long_term, double lambda_delta, double L,
                                const std::function<void(StepRecorder&)>& steps) const {
  const bool damageable = req_.serviceability.partitions;
  const double ratio = damageable ? after_attachment_damageable_span_ratio : after_attachment_span_ratio;
  span.add("deflection", where, "ACI 318-19 24.2.3, Table 24.2.2 (" + kind + "immediate live, ℓ/360)", live,
           L / immediate_live_span_ratio, "mm", [&] {
             StepRecorder st;
             steps(st);
             st.add("ΔL", "Δ(D + L) − Δ(D)", len(deltas.all) + " − " + len(deltas.sustained), len_v(live), len_u(),
                    "ACI 318-19 24.2.3");
             st.add("Δ_lim", "ℓ/360" + span_note, len(L) + "/360", len_v(L / immediate_live_span_ratio), len_u(),
                    "ACI 318-19 Table 24.2.2");
             return st.take();
           });
  if (span.verdict_settled()) return;
  span.add("deflection", where,
           damageable ? "ACI 318-19 24.2.4, Table 24.2.2 (" + kind + "after attachment, damageable, ℓ/480)"
                      : "ACI 318-19 24.2.4, Table 24.2.2 (" + kind + "after attachment, ℓ/240)",
           long_term, L / ratio, "mm", [&] {
             StepRecorder st;
             steps(st);
             st.add("λΔ", "ξ/(1 + 50 ρ'), ξ = 2.0 (5 years), ρ' = 0", "", lambda_delta, "-",
                    "ACI 318-19 24.2.4.1.1, Table 24.2.4.1.3");
             st.add("Δ", "λΔ Δ(D) + (Δ(D + L) − Δ(D))",
                    num(lambda_delta) + " × " + len(deltas.sustained) + " + " + len(live), len_v(long_term), len_u(),
                    "ACI 318-19 24.2.4.1");
             st.add("Δ_lim", damageable ? "ℓ/480 (partitions likely to be damaged)" : "ℓ/240",
                    len(L) + (damageable ? "/480" : "/240"), len_v(L / ratio), len_u(), "ACI 318-19 Table 24.2.2");
             return st.take();
           });
}

std::vector<Check> Checker::span_checks(const std::string&) const { return {}; }

// Top steel at pinned ends: none asked for.
double Checker::pinned_end_fixity_fraction() const { return 0.0; }

// 8.7.3.1 (value from memory): at exterior corners of slabs on edge walls
// (or stiff edge beams), top and bottom reinforcement for a moment per unit
// width equal to the largest positive moment per unit width in the panel,
// over one-fifth of the longer span from the corner each way (8.7.3.1.2);
// bars in two layers parallel to the sides (8.7.3.1.3's alternative).
// Every exterior corner of two supported edges: the clause reads "slabs
// supported by edge walls", whatever the walls' restraint.
CornerRule Checker::corner_rule() const { return {1.0, 0.2, true, "ACI 318-19 8.7.3.1", true}; }

// 8.4.1.5 (from memory): a column strip reaches 0.25 of the lesser of ℓ1
// and ℓ2 each side of the column line; no concentration band over columns.
// 8.7.4.1.3 Figure 8.7.4.1.3 (from memory), slabs without drop panels:
// column strip top bars, at least half 0.30 ℓn past the face and the rest
// 0.20 ℓn; middle strip top bars 0.22 ℓn. 8.7.4.2: the integrity bars.
FlatStripRule Checker::flat_strip_rule() const {
  FlatStripRule r{0.25, "ACI 318-19 8.4.1.5"};
  r.column_strip_top = {{0.5, 0.30}, {0.5, 0.20}};
  r.middle_strip_top = {{1.0, 0.22}};
  r.extents_clause = "ACI 318-19 8.7.4.1.3, Figure 8.7.4.1.3 (from memory)";
  r.integrity = "ACI 318-19 8.7.4.2: every bottom bar of the column strips continuous or spliced (Class B tension "
                "lap, mechanical or welded splices), at least two of them in each direction through the column "
                "within its longitudinal bars and anchored at exterior supports";
  return r;
}

// 7.4.1.3 (from memory): for slabs built integrally with supports, Mu at
// the support may be taken at the face of support. A support given a
// width is taken as built integrally (a slab resting on a wall that is
// not should be given no width there).
double Checker::support_design_moment(const RegionDemand& g) const {
  const SupportFace& f = g.support_face;
  const std::size_t i = governing_face_case(f);
  return i < f.cases.size() ? f.cases[i].M_face : f.M_centre;
}

// The load case with the largest moment at a face (cases.size() when none).
std::size_t Checker::governing_face_case(const SupportFace& f) {
  std::size_t best = f.cases.size();
  for (std::size_t i = 0; i < f.cases.size(); ++i)
    if (best == f.cases.size() || f.cases[i].M_face > f.cases[best].M_face) best = i;
  return best;
}

}  // namespace armature::aci318

