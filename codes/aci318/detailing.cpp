// DetailingRules of ACI 318-19: the extension beyond the cutoff (7.7.3.3),
// development length of straight bars in tension (25.4.2), embedment at
// supports (7.7.3.8), tension lap splices (25.5.2), standard hooks (25.3,
// 25.4.3) and the size of bottom bars at zero moment (7.7.3.8.3), each with
// its steps; the US variant by the in-lb forms (us_customary.hpp).
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
  st.add("l",
         us_ ? "bottom bars into the support, at least 6 in (past its face, or its line where no width is given)"
             : "bottom bars into the support, at least 150 mm (past its face, or its line where no width is given)",
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

// A 90° standard hook (25.3.1) at the end of a bar whose straight
// development does not fit: ldh of 25.4.3.1 past the critical section (the
// support's face), measured to the outside of the hook, at the bar's full
// fy (25.4.10's reduction for excess steel is not taken, and not allowed
// at a noncontinuous support); bend and extension of Tables 25.3.1, 25.3.2.
DetailLength Checker::hooked_anchorage(const BarDetailDemand& bar) const {
  StepRecorder st;
  const double db = bar.diameter_mm;
  const double psi_e = coating_factor_uncoated;
  st.add("ψe", "uncoated bars", "", psi_e, "-", "ACI 318-19 25.4.3.2");
  const double psi_r = hook_confinement_factor(bar.spacing_mm, db);
  st.add("ψr", psi_r == hook_confinement_factor_spaced ? "1.0: hooked bars at s ≥ 6 db (no ties in a slab)"
                                                       : "1.6: hooked bars at s < 6 db, no ties (a slab)",
         len(bar.spacing_mm) + (psi_r == hook_confinement_factor_spaced ? " ≥ 6 × " : " < 6 × ") + len(db), psi_r, "-",
         "ACI 318-19 25.4.3.2 (value from memory)");
  const double psi_o = hook_location_factor_side_cover;
  st.add("ψo", "side cover normal to the plane of the hook ≥ 6 db (within a slab's width)", "", psi_o, "-",
         "ACI 318-19 25.4.3.2 (value from memory)");
  const double fc_v = stress_v(fc_);
  const double psi_c = us_ ? inch_pound::hook_concrete_strength_factor(fc_v) : hook_concrete_strength_factor(fc_);
  st.add("ψc", us_ ? "f'c/15 000 + 0.6 below 6000 psi, else 1.0" : "f'c/105 + 0.6 below 40 MPa, else 1.0",
         us_ ? num(fc_v) + "/15000 + 0.6" : num(fc_v) + "/105 + 0.6", psi_c, "-",
         "ACI 318-19 25.4.3.2 (value from memory)");
  const double rf = root_fc_limited();
  const double ldh = us_ ? inch_pound::hooked_development_length(fy_ / MPa_per_psi, rf, psi_e, psi_r, psi_o, psi_c,
                                                                 lambda_normal_weight, db / mm_per_in) * mm_per_in
                         : hooked_development_length(fy_, rf, psi_e, psi_r, psi_o, psi_c, lambda_normal_weight, db);
  st.add("ldh", us_ ? "max(fy ψe ψr ψo ψc db^1.5 / (55 λ √f'c), 8 db, 6 in), to the outside of the hook"
                    : "max(fy ψe ψr ψo ψc db^1.5 / (23 λ √f'c), 8 db, 150 mm), to the outside of the hook",
         "max(" + stress(fy_) + " × " + num(psi_e) + " × " + num(psi_r) + " × " + num(psi_o) + " × " + num(psi_c) +
             " × " + len(db) + "^1.5 / (" + (us_ ? "55" : "23") + " × 1.0 × " + num(rf) + "), 8 × " + len(db) +
             ", " + (us_ ? "6" : "150") + ")",
         len_v(ldh), len_u(), "ACI 318-19 25.4.3.1 (value from memory)");
  const double bend = hook_inside_bend_diameter(db);
  const char* bend_text = db <= 25.4 + 1e-6 ? "6 db (No. 25 / #8 and smaller)"
                          : db <= 35.8 + 1e-6 ? "8 db (No. 29 to No. 36 / #9 to #11)"
                                              : "10 db (No. 43, No. 57 / #14, #18)";
  st.add("D", std::string("inside bend diameter ") + bend_text, "", len_v(bend), len_u(),
         "ACI 318-19 Table 25.3.2 (value from memory)");
  const double ext = hook_extension_90(db);
  st.add("extension", "12 db past the bend (90° hook)", "12 × " + len(db), len_v(ext), len_u(),
         "ACI 318-19 Table 25.3.1 (value from memory)");
  DetailLength out{ldh, "ACI 318-19 25.3, 25.4.3", st.take()};
  out.bend_diameter_mm = bend;
  out.extension_mm = ext;
  return out;
}

// 7.7.3.8.3: at a simple support or a point of inflection the bottom bars'
// ld ≤ 1.3 Mn/Vu + ℓa (ends confined by a compressive reaction) or
// Mn/Vu + ℓa; need not be met where the bars end past the centreline of a
// simple support in a standard hook. Mn of the bars there, nominal.
DetailLimit Checker::zero_moment_development(const BarDetailDemand& bar, const ZeroMomentSite& site) const {
  DetailLimit out;
  out.applies = true;
  out.clause = "ACI 318-19 7.7.3.8.3";
  StepRecorder st;
  if (site.simple_support && site.hooked) {
    st.add("ℓa", "the bars end past the support's centreline in a standard hook: the limit need not be met", "",
           len_v(site.embedment_mm), len_u(), "ACI 318-19 7.7.3.8.3 (value from memory)");
    out.steps = st.take();
    return out;
  }
  const double ld = development_length(st, bar);
  const double b = req_.slab.strip_width_mm;
  const double a = stress_block_depth(bar.As_prov_mm2, fy_, fc_, b);
  st.add("a", "As fy / (0.85 f'c b)",
         area(bar.As_prov_mm2) + " × " + stress(fy_) + " / (0.85 × " + stress(fc_) + " × " + len(b) + ")", len_v(a),
         len_u(), "ACI 318-19 22.2.2");
  const double Mn = nominal_moment(bar.As_prov_mm2, fy_, bar.d_mm, a);
  st.add("Mn", "As fy (d − a/2), the bars at the section",
         area(bar.As_prov_mm2) + " × " + stress(fy_) + " × (" + len(bar.d_mm) + " − " + len(a) + "/2)", moment_v(Mn),
         moment_u(), "ACI 318-19 22.2");
  const double Vu = std::abs(bar.V_Ed_N);
  st.add("Vu", site.simple_support ? "factored shear at the support" : "factored shear at the point of inflection", "",
         force_v(Vu), force_u(), "ACI 318-19 7.7.3.8.3");
  double la = site.embedment_mm;
  if (site.simple_support) {
    st.add("ℓa", "embedment past the centre of the support", "", len_v(la), len_u(),
           "ACI 318-19 7.7.3.8.3 (value from memory)");
  } else {
    const double cap = inflection_embedment_limit(bar.d_mm, bar.diameter_mm);
    la = std::min(la, cap);
    st.add("ℓa", "embedment past the point of inflection, at most max(d, 12 db)",
           "min(" + len(site.embedment_mm) + ", max(" + len(bar.d_mm) + ", 12 × " + len(bar.diameter_mm) + "))",
           len_v(la), len_u(), "ACI 318-19 7.7.3.8.3 (value from memory)");
  }
  if (!(Vu > 0.0)) {
    st.add("ld,max", "no shear at the section: no limit", "", 0.0, len_u(), "ACI 318-19 7.7.3.8.3");
    out.steps = st.take();
    return out;
  }
  const double limit = zero_moment_development_limit(Mn, Vu, la, site.confined);
  const char* k = site.confined ? "1.3" : "1.0";
  st.add("ld,max",
         std::string(k) + " Mn/Vu + ℓa" +
             (site.confined ? " (ends confined by a compressive reaction)" : " (ends not confined by a reaction)"),
         std::string(k) + " × " + len(Mn / Vu) + " + " + len(la), len_v(limit), len_u(),
         "ACI 318-19 7.7.3.8.3 (value from memory)");
  out.length_mm = ld;
  out.limit_mm = limit;
  out.met = ld <= limit;
  st.add("ld/ld,max", out.met ? "ld ≤ ld,max: met" : "ld > ld,max: not met (smaller bars, or a hook past the centreline)",
         len(ld) + " / " + len(limit), ld / limit, "-", "ACI 318-19 7.7.3.8.3");
  out.steps = st.take();
  return out;
}

}  // namespace armature::aci318
