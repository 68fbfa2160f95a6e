// ACI 318-19 member rules, the checks of the member rather than of one
// section: minimum thickness for deflection, equilibrium of a cantilever's
// back span, the design moment at a support with a width.
#include <string>

#include "checker.hpp"

namespace armature::aci318 {

namespace {

SupportCondition condition_of(SpanKind kind) {
  switch (kind) {
    case SpanKind::simply_supported: return SupportCondition::simply_supported;
    case SpanKind::end_span: return SupportCondition::one_end_continuous;
    case SpanKind::interior_span: return SupportCondition::both_ends_continuous;
    case SpanKind::cantilever: return SupportCondition::cantilever;
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
    run_check("deflection", [&] { deflection_check(span, g, sec.h_mm); });
  }
  return out;
}

std::vector<Check> Checker::span_checks(const std::string&) const { return {}; }

// Top steel at pinned ends: none asked for.
double Checker::pinned_end_fixity_fraction() const { return 0.0; }

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

