// ACI 318-19 section rules: the checks of a section under a region's
// demand (cover, bending, ductility (tension-controlled), minimum steel,
// spacing, cracking, one-way shear), the nominal cover, the search's
// limits and the distribution (shrinkage and temperature) steel.
#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "checker.hpp"

namespace armature::aci318 {

double Checker::nominal_cover_mm(Face face, double bar_diameter_mm) const {
  return req_.durability.face(face).cover_mm.value_or(cover_for(exposure_of(face), bar_diameter_mm));
}

double Checker::max_spacing_mm(const RegionDemand& g) const {
  if (g.direction != BarDirection::span) return two_way_max_bar_spacing(req_.slab.thickness_mm);
  return max_bar_spacing(req_.slab.thickness_mm);
}

// Below this area the bar fails bending or minimum steel, as checked in
// check_section: the larger of As,min (7.6.1.1) and the As,req of bending
// at φ = 0.9 (φ never exceeds 0.9 and Mn grows with As below a = d);
// no area passes when even a = d cannot carry Mu.
double Checker::minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const {
  const double h = req_.slab.thickness_mm, b = req_.slab.strip_width_mm;
  const double d = h - req_.durability.face(g.face).cover_mm.value_or(cover_for(
                           exposure_of(g.face), std::max(bar.diameter_mm, g.cover_bar_mm))) -
                   bar.diameter_mm / 2.0;
  if (d <= 0.0) return 0.0;  // bending fails unless M_Ed = 0: left to the check
  const auto As_bending = required_flexural_steel(g.M_Ed, fc_, fy_, b, d);
  if (!As_bending) return std::numeric_limits<double>::infinity();
  return std::max(minimum_flexural_steel(b, h), *As_bending * (1.0 - 1e-9));  // a rounding margin
}

SectionOutcome Checker::check_section(const Section& sec, const RegionDemand& g, Detail detail) const {
  SectionOutcome out;
  if (detail != Detail::verdict) out.checks.reserve(8);  // as many as a region has, nearly always
  CheckCollector checks(out.checks, out.verdict, detail);
  const SectionLayer& layer = sec.outer_layer(g.face);
  const BarOption& bar = layer.bar;
  const double h = sec.h_mm, b = sec.b_mm, db = bar.diameter_mm, s = layer.spacing_mm;
  const double As = bar.area_mm2 * b / s;
  // One cover per face: a computed cover is that of the largest bar the
  // kernel has chosen on this face, when larger than this one; a given
  // cover is checked against this bar's own requirement.
  const std::string& exposure = exposure_of(g.face);
  // A section whose cover is not the one worked out here (the request's,
  // or one a wrapping plug-in sets) is checked as a given cover.
  const double db_face = std::max(db, g.cover_bar_mm);
  const bool cover_given = req_.durability.face(g.face).cover_mm.has_value() ||
                           layer.cover_mm != cover_for(exposure, db_face);
  const double c_req = cover_for(exposure, cover_given ? db : db_face);
  const double cover = layer.cover_mm;  // the section's: given, else c_req
  auto cover_steps = [&] {
    StepRecorder st;
    const bool face_bar = !cover_given && g.cover_bar_mm > db;
    st.add("c",
           "Table 20.5.1.3.1 (" + exposure + ", bar " +
               (face_bar ? "of " + len(g.cover_bar_mm) + " " + len_u() + ", the largest on this face)"
                         : bar.designation + ")"),
           exposure + " (" + to_string(g.face) + " face)", len_v(c_req), len_u(),
           "ACI 318-19 20.5.1.3.1");
    return st.take();
  };
  const double d = layer.d_mm;
  out.As_min_mm2 = minimum_flexural_steel(b, h);
  if (d <= 0.0) {  // the bar does not fit: nothing can resist
    checks.add("bending", g.where, "ACI 318-19 22.2, 21.2.2", g.M_Ed * 1e-6, 0.0, "kNm", cover_steps);
    return out;
  }
  out.As_max_mm2 = steel_at_slab_strain_limit(b, d);
  const auto As_root = required_flexural_steel(g.M_Ed, fc_, fy_, b, d);
  out.As_req_mm2 = As_root.value_or(0.85 * fc_ * b * d / fy_);
  const double a = stress_block_depth(As, fy_, fc_, b);
  const double c = a / beta1_;
  const double eps_t = net_tensile_strain(d, c);
  const double eps_ty = yield_strain_of_steel();
  const double phi = strength_reduction_factor(eps_t, eps_ty);
  const double phi_Mn = phi * nominal_moment(As, fy_, d, a);

  const bool at_face = g.support_face.width_mm > 0.0;
  run_check("bending", [&] {
    checks.add("bending", g.where, at_face ? "ACI 318-19 22.2, 21.2.2; Mu at the face 7.4.1.3" : "ACI 318-19 22.2, 21.2.2",
               g.M_Ed * 1e-6, phi_Mn * 1e-6, "kNm", [&] {
      StepRecorder st;
      if (at_face) {
        const SupportFace& f = g.support_face;
        const std::size_t i = governing_face_case(f);
        st.add("t", "breadth of the support (built integrally)", "", len_v(f.width_mm), len_u(), "ACI 318-19 7.4.1.3");
        if (i < f.cases.size())
          st.add("Mu,c", "at the centreline, governing load case", "", moment_v(f.cases[i].M_centre), moment_u(),
                 "ACI 318-19 7.4.1.3");
        st.add("Mu", "at the face of support, t/2 from the centreline (larger side)", "", moment_v(g.M_Ed),
               moment_u(), "ACI 318-19 7.4.1.3");
      }
      if (!cover_given)
        for (auto& x : cover_steps()) st.add(x.symbol, x.expression, x.substituted, x.result, x.unit, x.clause);
      st.add("d", "h − cover − db/2", len(h) + " − " + len(cover) + " − " + len(db) + "/2", len_v(d), len_u(),
             "ACI 318-19 22.2");
      st.add("As,req", "(0.85 f'c b/fy)(d − √(d² − 2Mu/(0.9 × 0.85 f'c b)))",
             "Mu = " + moment(g.M_Ed) + " " + moment_u() + ", f'c = " + stress(fc_) + us_unit(stress_u()) +
                 ", fy = " + stress(fy_) + us_unit(stress_u()),
             area_v(out.As_req_mm2), area_u(), "ACI 318-19 22.2.2");
      st.add("As", "bar area × b/s", area(bar.area_mm2) + " × " + len(b) + "/" + len(s), area_v(As), area_u(), "");
      st.add("a", "As fy/(0.85 f'c b)",
             area(As) + " × " + stress(fy_) + "/(0.85 × " + stress(fc_) + " × " + len(b) + ")", len_v(a), len_u(),
             "ACI 318-19 22.2.2.4.1");
      st.add("φ", "Table 21.2.2 from εt", "εt = " + num(eps_t) + ", εty = " + num(eps_ty), phi, "-",
             "ACI 318-19 21.2.2");
      st.add("φMn", "φ As fy (d − a/2)",
             num(phi) + " × " + area(As) + " × " + stress(fy_) + " × (" + len(d) + " − " + len(a) + "/2)" +
                 us_unit("lb-in"),
             moment_v(phi_Mn), moment_u(), "ACI 318-19 22.2");
      return st.take();
    });
  });
  run_check("ductility", [&] {
    const double eps_min = slab_min_strain();
    checks.add("ductility", g.where, "ACI 318-19 7.3.3.1, 21.2.2", eps_min, As_root ? eps_t : 0.0, "-", [&] {
                 StepRecorder st;
                 st.add("εty", "fy/Es", stress(fy_) + "/" + (us_ ? std::string("29 000 000") : num(steel_modulus_MPa)),
                        eps_ty, "-",
                        "ACI 318-19 21.2.2.1");
                 st.add("εt,min", "εty + 0.003 (slab tension-controlled)", num(eps_ty) + " + 0.003", eps_min, "-",
                        "ACI 318-19 7.3.3.1, Table 21.2.2");
                 st.add("β1", "Table 22.2.2.4.3", "f'c = " + stress(fc_) + us_unit(stress_u()), beta1_, "-",
                        "ACI 318-19 22.2.2.4.3");
                 st.add("c", "a/β1", len(a) + "/" + num(beta1_), len_v(c), len_u(), "ACI 318-19 22.2.2.4.2");
                 st.add("εt", "0.003 (d − c)/c", "0.003 × (" + len(d) + " − " + len(c) + ")/" + len(c), eps_t,
                        "-", "ACI 318-19 22.2.1.2");
                 st.add("As,max", "0.85 f'c b β1 c_lim/fy, c_lim = 0.003 d/(0.003 + εt,min)",
                        "f'c = " + stress(fc_) + ", b = " + len(b) + ", β1 = " + num(beta1_) + ", d = " + len(d) +
                            ", fy = " + stress(fy_),
                        area_v(out.As_max_mm2), area_u(), "ACI 318-19 7.3.3.1");
                 if (!As_root)
                   st.add("As,req", "no real root: the section cannot reach Mu with φ = 0.9",
                          moment(g.M_Ed), 0.0, area_u(), "ACI 318-19 22.2.2");
                 return st.take();
               });
  });
  run_check("min_steel", [&] {
    checks.add("min_steel", g.where, "ACI 318-19 7.6.1.1", out.As_min_mm2, As, "mm2", [&] {
      StepRecorder st;
      st.add("As,min", "0.0018 Ag", "0.0018 × " + len(b) + " × " + len(h), area_v(out.As_min_mm2), area_u(),
             "ACI 318-19 7.6.1.1");
      return st.take();
    });
  });
  // The bar search needs no more once an arrangement has failed: bending
  // and minimum steel (its fallback) are known by now.
  if (checks.verdict_settled()) return out;
  run_check("spacing", [&] {
    if (g.direction == BarDirection::span) {
      const double s_max = max_bar_spacing(h);
      checks.add("spacing", g.where, "ACI 318-19 7.7.2.3", s, s_max, "mm", [&] {
        StepRecorder st;
        st.add("s_max", us_ ? "min(3h, 18 in)" : "min(3h, 450)",
               "min(3 × " + len(h) + ", " + (us_ ? "18" : "450") + ")", len_v(s_max), len_u(), "ACI 318-19 7.7.2.3");
        return st.take();
      });
    } else {  // a two-way slab's bars at the critical section of their region
      const double s_max = two_way_max_bar_spacing(h);
      checks.add("spacing", g.where, "ACI 318-19 8.7.2.2", s, s_max, "mm", [&] {
        StepRecorder st;
        st.add("s_max", us_ ? "min(2h, 18 in)" : "min(2h, 450)",
               "min(2 × " + len(h) + ", " + (us_ ? "18" : "450") + ")", len_v(s_max), len_u(), "ACI 318-19 8.7.2.2");
        return st.take();
      });
    }
    const double dagg = req_.concrete.aggregate_mm;
    const double clear_min = min_clear_spacing(db, dagg);
    checks.add("spacing", g.where, "ACI 318-19 25.2.1", clear_min, s - db, "mm", [&] {
      StepRecorder st;
      st.add("s_clear,min", us_ ? "max(1 in, db, 4/3 dagg)" : "max(25 mm, db, 4/3 dagg)",
             "max(" + std::string(us_ ? "1" : "25") + ", " + len(db) + ", 4/3 × " + len(dagg) + ")",
             len_v(clear_min), len_u(), "ACI 318-19 25.2.1");
      st.add("s_clear", "s − db", len(s) + " − " + len(db), len_v(s - db), len_u(), "ACI 318-19 25.2.1");
      return st.take();
    });
  });
  run_check("cracking", [&] {
    const double fs = service_steel_stress(fy_);
    const double s_crack = crack_spacing(fs, cover);
    checks.add("cracking", g.where, "ACI 318-19 24.3.2", s, s_crack, "mm", [&] {
      StepRecorder st;
      st.add("fs", "2/3 fy", "2/3 × " + stress(fy_), stress_v(fs), stress_u(), "ACI 318-19 24.3.2.1");
      if (us_)
        st.add("s", "min(15 (40 000/fs) − 2.5 cc, 12 (40 000/fs))",
               "min(15 × 40 000/" + stress(fs) + " − 2.5 × " + len(cover) + ", 12 × 40 000/" + stress(fs) + ")",
               len_v(s_crack), len_u(), "ACI 318-19 24.3.2");
      else
        st.add("s", "min(380 (280/fs) − 2.5 cc, 300 (280/fs))",
               "min(380 × 280/" + num(fs) + " − 2.5 × " + num(cover) + ", 300 × 280/" + num(fs) + ")", s_crack,
               "mm", "ACI 318-19 24.3.2");
      return st.take();
    });
  });
  if (cover_given)
    run_check("cover", [&] { checks.add("cover", g.where, "ACI 318-19 20.5.1.3.1", c_req, cover, "mm", cover_steps); });
  for (const auto& sup : g.supports) {
    SupportOutcome so;
    so.where = sup.where;
    so.V_Ed = sup.V_Ed;
    CheckCollector support(so.checks, out.verdict, detail);
    run_check("shear", [&] {
      const double rho_w = As / (b * d);
      const double ls = shear_size_factor(d);
      const double Vc = shear_strength(ls, rho_w, b, d);
      so.V_Rd = shear_strength_reduction * Vc;
      support.add("shear", sup.where, "ACI 318-19 22.5.5.1", sup.V_Ed * 1e-3, so.V_Rd * 1e-3, "kN", [&] {
        StepRecorder st;
        st.add("λs", us_ ? "√(2/(1 + d/10)) ≤ 1 (d in in)" : "√(2/(1 + 0.004 d)) ≤ 1",
               "d = " + len(d) + us_unit(len_u()), ls, "-", "ACI 318-19 22.5.5.1.3");
        st.add("ρw", "As/(b d)", area(As) + "/(" + len(b) + " × " + len(d) + ")", rho_w, "-",
               "ACI 318-19 22.5.5.1");
        st.add("Vc",
               us_ ? "8 λs λ ρw^(1/3) √f'c b d ≤ 5 λ √f'c b d (psi, in, lb)"
                   : "0.66 λs λ ρw^(1/3) √f'c b d ≤ 0.42 λ √f'c b d",
               "λs = " + num(ls) + ", √f'c = " + num(root_fc_limited()) +
                   (us_ ? ", b = " + len(b) + ", d = " + len(d) : std::string()),
               force_v(Vc), force_u(), "ACI 318-19 22.5.5.1");
        st.add("φVc", "0.75 Vc", "0.75 × " + force(Vc), force_v(so.V_Rd), force_u(), "ACI 318-19 21.2.1");
        return st.take();
      });
    });
    if (detail != Detail::verdict) out.supports.push_back(std::move(so));  // the search needs only the verdict
  }
  return out;
}

DistributionNeed Checker::distribution(double) const {
  return {shrinkage_temperature_steel(req_.slab.strip_width_mm, req_.slab.thickness_mm),
          max_distribution_spacing(req_.slab.thickness_mm)};
}

}  // namespace armature::aci318

