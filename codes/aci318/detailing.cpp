// DetailingRules of ACI 318-19: the extension beyond the cutoff (7.7.3.3),
// development length of straight bars in tension (25.4.2), embedment at
// supports (7.7.3.8) and tension lap splices (25.5.2), each with its
// steps; the US variant by the in-lb forms (us_customary.hpp).
#include <algorithm>
#include <string>

#include "checker.hpp"
#include "us_customary.hpp"

namespace armature::aci318 {

namespace {
constexpr double lambda_normal_weight = 1.0;  // 25.4.2.5 Table: λ, normalweight concrete
}  // namespace

double Checker::support_embedment() const {
  return us_ ? inch_pound::support_embedment_in * mm_per_in : support_embedment_mm;
}

double Checker::development_length(StepRecorder& st, const BarDetailDemand& bar, bool with_floor) const {
  const double db = bar.diameter_mm;
  const double h = req_.slab.thickness_mm;
  const double below = bar.face == Face::bottom ? bar.cover_mm : h - bar.cover_mm - db;
  double psi_t = us_ ? inch_pound::casting_position_factor(below / mm_per_in) : casting_position_factor(below);
  std::string why = std::string("fresh concrete below the bar ") + len(below) + " " + len_u();
  if (bar.bond != BondChoice::automatic) {
    psi_t = bar.bond == BondChoice::poor ? 1.3 : 1.0;
    why = bar.bond == BondChoice::poor ? "top-bar effect as the request states (bond poor)"
                                       : "no top-bar effect as the request states (bond good)";
  }
  st.add("ψt", why, "", psi_t, "-", "ACI 318-19 25.4.2.5");
  const double psi_e = coating_factor_uncoated;
  st.add("ψe", "uncoated bars", "", psi_e, "-", "ACI 318-19 25.4.2.5");
  const double psi_g = reinforcement_grade_factor(fy_);
  st.add("ψg", "by the grade of fy = " + stress(fy_) + " " + stress_u(), "", psi_g, "-", "ACI 318-19 25.4.2.5");
  const double psi_s = bar_size_factor(db);
  st.add("ψs", db <= 19.1 + 1e-9 ? "No. 19 (#6) and smaller" : "No. 22 (#7) and larger", "", psi_s, "-",
         "ACI 318-19 25.4.2.5");
  const double rf = root_fc_limited();
  const double clear = bar.spacing_mm - db;
  const bool ample = clear >= 2.0 * db && bar.cover_mm >= db;
  double ld_simple = 0.0, ld_general = 0.0, ld_min = 0.0;
  const double cb = std::min(bar.cover_mm + db / 2.0, bar.spacing_mm / 2.0);
  if (us_) {
    const double fy_psi = fy_ / MPa_per_psi;
    ld_simple = inch_pound::development_length_simplified(fy_psi, rf, psi_t, psi_e, psi_g, lambda_normal_weight,
                                                          db / mm_per_in, ample) * mm_per_in;
    ld_general = inch_pound::development_length_general(fy_psi, rf, psi_t, psi_e, psi_s, psi_g, lambda_normal_weight,
                                                        db / mm_per_in, cb / mm_per_in) * mm_per_in;
    ld_min = inch_pound::minimum_development_length_in * mm_per_in;
  } else {
    ld_simple = development_length_simplified(fy_, rf, psi_t, psi_e, psi_g, lambda_normal_weight, db, ample);
    ld_general = development_length_general(fy_, rf, psi_t, psi_e, psi_s, psi_g, lambda_normal_weight, db, cb);
    ld_min = minimum_development_length_mm;
  }
  const bool small = db <= 19.1 + 1e-9;
  const char* k_text = us_ ? (ample ? (small ? "25" : "20") : (small ? "50/3" : "40/3"))
                           : (ample ? (small ? "2.1" : "1.7") : (small ? "1.4" : "1.1"));
  st.add("ld,a", std::string("fy ψt ψe ψg db / (") + k_text + " λ √f'c)" +
                     (ample ? " (clear spacing ≥ 2 db, cover ≥ db)" : " (other cases)"),
         stress(fy_) + " × " + num(psi_t) + " × " + num(psi_e) + " × " + num(psi_g) + " × " + len(db) + " / (" +
             k_text + " × 1.0 × " + num(rf) + ")",
         len_v(ld_simple), len_u(), "ACI 318-19 25.4.2.3");
  st.add("cb", "min(cover + db/2, s/2)", "min(" + len(bar.cover_mm) + " + " + len(db) + "/2, " + len(bar.spacing_mm) + "/2)",
         len_v(cb), len_u(), "ACI 318-19 25.4.2.4");
  st.add("ld,b", us_ ? "(3/40)(fy/(λ √f'c)) ψt ψe ψs ψg db / ((cb + Ktr)/db), Ktr = 0, ≤ 2.5"
                     : "fy ψt ψe ψs ψg db / (1.1 λ √f'c (cb + Ktr)/db), Ktr = 0, (cb + Ktr)/db ≤ 2.5",
         "", len_v(ld_general), len_u(), "ACI 318-19 25.4.2.4");
  if (!with_floor) {
    const double ld_a = std::min(ld_simple, ld_general);
    st.add("ld", "min(ld,a, ld,b) (25.4.2.1(a), without the floor of (b), as 25.5.2.1 asks)",
           "min(" + len(ld_simple) + ", " + len(ld_general) + ")", len_v(ld_a), len_u(), "ACI 318-19 25.4.2.1(a)");
    return ld_a;
  }
  const double ld = std::max(std::min(ld_simple, ld_general), ld_min);
  st.add("ld", us_ ? "max(min(ld,a, ld,b), 12 in)" : "max(min(ld,a, ld,b), 300 mm)",
         "max(min(" + len(ld_simple) + ", " + len(ld_general) + "), " + len(ld_min) + ")", len_v(ld), len_u(),
         "ACI 318-19 25.4.2.1");
  return ld;
}

DetailLength Checker::shift(const BarDetailDemand& bar) const {
  StepRecorder st;
  const double e = extension_beyond_cutoff(bar.d_mm, bar.diameter_mm);
  st.add("e", "max(d, 12 db)", "max(" + len(bar.d_mm) + ", 12 × " + len(bar.diameter_mm) + ")", len_v(e), len_u(),
         "ACI 318-19 7.7.3.3");
  return {e, "ACI 318-19 7.7.3.3", st.take()};
}

DetailLength Checker::anchorage(const BarDetailDemand& bar) const {
  StepRecorder st;
  const double ld = development_length(st, bar);
  return {ld, "ACI 318-19 25.4.2", st.take()};
}

DetailLength Checker::end_support_anchorage(const BarDetailDemand&) const {
  StepRecorder st;
  const double l = support_embedment();
  st.add("l", us_ ? "bottom bars into the support, at least 6 in" : "bottom bars into the support, at least 150 mm",
         "", len_v(l), len_u(), "ACI 318-19 7.7.3.8");
  return {l, "ACI 318-19 7.7.3.8", st.take()};
}

DetailLength Checker::interior_support_embedment(const BarDetailDemand& bar) const {
  return end_support_anchorage(bar);
}

DetailLength Checker::lap(const BarDetailDemand& bar) const {
  StepRecorder st;
  const double ld = development_length(st, bar, false);
  // Class A needs As,prov/As,req ≥ 2 over the whole lap, which the
  // demand does not give: Class B (Table 25.5.2.1, "all other cases").
  const bool class_a = false;
  const double l = us_ ? inch_pound::tension_lap_length(ld / mm_per_in, class_a) * mm_per_in
                       : tension_lap_length(ld, class_a);
  st.add("lst", us_ ? "Class B: 1.3 ld ≥ 12 in" : "Class B: 1.3 ld ≥ 300 mm", "1.3 × " + len(ld), len_v(l), len_u(),
         "ACI 318-19 25.5.2.1");
  return {l, "ACI 318-19 25.5.2", st.take()};
}

}  // namespace armature::aci318
