// PunchingRules of the ACI 318-19 session: two-way shear at one column of
// a flat slab (22.6) with the moment transferred by eccentric shear
// (8.4.2.2, 8.4.4.2), and stirrups where the concrete alone does not do
// (22.6.6–22.6.8). The SI variant computes with the SI constants, the US
// variant with those of the in-lb edition (punching_rules.hpp); both in
// kernel units outside the stress constants.
#include <algorithm>
#include <cmath>
#include <stdexcept>

#include "checker.hpp"

namespace armature::aci318 {

namespace {
constexpr double lambda_normal_weight = 1.0;  // 19.2.4
using Steps = StepRecorder;

double moment_of(const std::optional<double>& M, const char* field) {
  if (!M) throw std::invalid_argument(std::string("punching demand: ") + field +
                                      " is needed (ACI 318-19 8.4.4.2: the moment transferred by eccentric shear)");
  return *M;
}

// The stress of moment transfer across one direction of a critical section.
struct Transfer {
  double b1 = 0.0, b2 = 0.0, gamma_v = 0.0, c = 0.0, J = 0.0, M = 0.0;
  double stress() const { return J > 0.0 ? gamma_v * M * c / J : 0.0; }
};

Transfer transfer_of(const PunchingPerimeter& section, double d, bool along_x, double M) {
  Transfer t;
  t.b1 = perimeter_extent(section, along_x);
  t.b2 = perimeter_extent(section, !along_x);
  t.gamma_v = moment_transfer_by_shear(moment_transfer_by_flexure(t.b1, t.b2));
  t.c = critical_section_extreme_distance(section, along_x);
  t.J = critical_section_polar_moment(section, d, along_x);
  t.M = M;
  return t;
}

// vu at a section: Vu/(b0 d) plus both directions' moment transfer,
// added at the corner where both are largest.
double stress_at(const PunchingPerimeter& s, double d, double V, const Transfer& tx, const Transfer& ty) {
  return V / (s.length_mm * d) + tx.stress() + ty.stress();
}
}  // namespace

// 8.4.2.2.3: γf Msc is resisted by the top bars within bslab, the
// column's side across the moment plus 1.5 h each side where the slab
// continues. γf (8.4.2.2.2) from the critical section at d/2, d not yet
// known: the larger of its values at d = 0 and d = h (γf is monotonic in
// d), so that the band is never short of the moment.
std::optional<TransferBand> Checker::moment_transfer_band(const PunchingDemand& p, bool bars_x) const {
  const ColumnOutline column = centred_outline(p.cx_mm, p.cy_mm);
  double gamma_f = 0.0;
  for (const double d : {0.0, p.h_mm}) {
    const PunchingPerimeter s = offset_perimeter("b0", column, p.free, critical_section_distance_factor * d,
                                                 PerimeterCorner::square);
    gamma_f = std::max(gamma_f, moment_transfer_by_flexure(perimeter_extent(s, bars_x), perimeter_extent(s, !bars_x)));
  }
  const int sides = bars_x ? 2 - int(p.free.y0) - int(p.free.y1) : 2 - int(p.free.x0) - int(p.free.x1);
  const double c2 = bars_x ? p.cy_mm : p.cx_mm;
  return TransferBand{moment_transfer_slab_width(c2, p.h_mm, sides), gamma_f, "ACI 318-19 8.4.2.2.2, 8.4.2.2.3"};
}

PunchingOutcome Checker::check_punching(const PunchingDemand& p, Detail detail) const {
  validate_punching_demand(p);
  const double Mx = moment_of(p.M_x_Nmm, "M_x_Nmm"), My = moment_of(p.M_y_Nmm, "M_y_Nmm");
  PunchingOutcome out;
  out.where = p.where;
  out.position = column_position(p.free);
  const ColumnPosition pos = out.position;
  const TwoWayShearConstants& form = us_ ? two_way_inch_pound : two_way_si;
  // Stresses of the form's constants are in psi (US) or MPa: to MPa.
  const double to_MPa = us_ ? MPa_per_psi : 1.0;
  const double fc_form = us_ ? fc_ / MPa_per_psi : fc_;
  const double phi = shear_strength_reduction;

  // 22.6.2.1: d the mean of the two directions; 22.6.4.1: b0 at d/2, square corners.
  const double d = (p.dx_mm + p.dy_mm) / 2.0;
  out.d_mm = d;
  const ColumnOutline column = centred_outline(p.cx_mm, p.cy_mm);
  PunchingPerimeter b0 =
      offset_perimeter("b0", column, p.free, critical_section_distance_factor * d, PerimeterCorner::square);
  const Transfer tx = transfer_of(b0, d, true, Mx), ty = transfer_of(b0, d, false, My);
  out.transfer_factor = std::max(Mx > 0.0 ? tx.gamma_v : 0.0, My > 0.0 ? ty.gamma_v : 0.0);
  const double vu = stress_at(b0, d, p.V_N, tx, ty);

  const double lambda_s = shear_size_factor(d);
  const double beta = std::max(p.cx_mm, p.cy_mm) / std::min(p.cx_mm, p.cy_mm);
  const double alpha_s = column_location_factor(pos);
  const double vc = two_way_shear_strength(form, lambda_s, lambda_normal_weight, fc_form, beta, alpha_s, d,
                                           b0.length_mm) * to_MPa;
  out.v_MPa = vu;
  out.v_concrete_MPa = phi * vc;
  out.reinforcement_needed = vu > phi * vc;

  RegionVerdict verdict;
  CheckCollector checks(out.checks, verdict, detail);
  const std::string sqrt_fc = "√f'c";
  auto stress_steps = [&](Steps& st) {
    st.add("d", "(dx + dy)/2", "(" + len(p.dx_mm) + " + " + len(p.dy_mm) + ")/2", len_v(d), len_u(),
           "ACI 318-19 22.6.2.1");
    st.add("b0", "critical section at d/2 from the column", "", len_v(b0.length_mm), len_u(), "ACI 318-19 22.6.4.1");
    for (const Transfer* t : {&tx, &ty}) {
      if (t->M <= 0.0) continue;
      const bool x = t == &tx;
      st.add(x ? "γv,x" : "γv,y", "1 − 1/(1 + (2/3) √(b1/b2))",
             "1 − 1/(1 + (2/3) × √(" + len(t->b1) + "/" + len(t->b2) + "))", t->gamma_v, "-",
             "ACI 318-19 8.4.2.2.2, 8.4.4.2.2");
      st.add(x ? "Jc,x" : "Jc,y", "d ∫ e² dl + d³/12 per face along the moment", "",
             us_ ? t->J / std::pow(mm_per_in, 4) : t->J, us_ ? "in4" : "mm4", "ACI 318-19 R8.4.4.2.3");
    }
    st.add("vu", "Vu/(b0 d) + γv,x Mx c/Jc,x + γv,y My c/Jc,y",
           force(p.V_N) + "/(" + len(b0.length_mm) + " × " + len(d) + ") + …", stress_v(vu), stress_u(),
           "ACI 318-19 8.4.4.2.3");
  };
  auto concrete_steps = [&](Steps& st) {
    st.add("λs", us_ ? "√(2/(1 + d/10)) ≤ 1" : "√(2/(1 + 0.004 d)) ≤ 1", "", lambda_s, "-", "ACI 318-19 22.5.5.1.3");
    st.add("β", "long/short side of the column", "", beta, "-", "ACI 318-19 22.6.5.2");
    st.add("αs", "40 interior, 30 edge, 20 corner", "", alpha_s, "-", "ACI 318-19 22.6.5.3");
    st.add("vc", us_ ? "least of 4, 2 + 4/β, 2 + αs d/b0 × λs λ " + sqrt_fc
                     : "least of 0.33, 0.17 (1 + 2/β), 0.083 (2 + αs d/b0) × λs λ " + sqrt_fc,
           "", stress_v(vc), stress_u(), "ACI 318-19 22.6.5.2");
    st.add("φ vc", "0.75 vc", "0.75 × " + stress(vc), stress_v(phi * vc), stress_u(), "ACI 318-19 21.2.1");
  };

  if (!out.reinforcement_needed || !p.shear_reinforcement_allowed) {
    run_check("punching", [&] {
      checks.add("punching", p.where, "ACI 318-19 22.6.1, 22.6.5", stress_v(vu), stress_v(phi * vc), stress_u(), [&] {
        Steps st;
        stress_steps(st);
        concrete_steps(st);
        return st.take();
      });
    });
  } else {
    // Stirrups (22.6.6–22.6.8): vc drops to k_stirrups λs λ √f'c, vn is capped.
    const double vc_r = two_way_concrete_with_stirrups(form, lambda_s, lambda_normal_weight, fc_form) * to_MPa;
    const double vn_max = two_way_max_with_stirrups(form, fc_form) * to_MPa;
    out.v_face_MPa = vu;
    out.v_max_MPa = phi * vn_max;
    PunchingReinforcement r;
    r.spacing_mm = p.reinforcement_spacing_mm.value_or(max_stirrup_line_spacing(d));
    r.design_strength_MPa = std::min(fy_, form.fyt_max * to_MPa);
    // Rounded up to the whole mm² (the area stated then carries vu).
    r.area_per_perimeter_mm2 =
        std::ceil(required_stirrup_area(vu, phi, vc_r, b0.length_mm, r.spacing_mm, r.design_strength_MPa));
    const double vs = stirrup_shear_stress(r.area_per_perimeter_mm2, r.design_strength_MPa, b0.length_mm, r.spacing_mm);
    // The outer critical section (22.6.4.2), corners cut at 45°, where vu
    // ≤ φ k_stirrups λs λ √f'c with the moment transfer of that section.
    const double v_out_limit = phi * vc_r;
    auto vu_out = [&](double a) {
      const PunchingPerimeter s = offset_perimeter("b0,out", column, p.free, a, PerimeterCorner::chamfer);
      return stress_at(s, d, p.V_N, transfer_of(s, d, true, Mx), transfer_of(s, d, false, My));
    };
    double lo = critical_section_distance_factor * d, hi = lo;
    for (int i = 0; i < 60 && vu_out(hi) > v_out_limit; ++i) hi *= 1.5;
    for (int i = 0; i < 60; ++i) {
      const double mid = (lo + hi) / 2.0;
      (vu_out(mid) > v_out_limit ? lo : hi) = mid;
    }
    r.outer_perimeter_distance_mm = hi;
    r.outermost_line_distance_mm = hi - critical_section_distance_factor * d;
    out.perimeters.push_back(offset_perimeter("b0,out", column, p.free, hi, PerimeterCorner::chamfer));
    out.reinforcement = r;
    run_check("punching_max", [&] {
      checks.add("punching_max", p.where, "ACI 318-19 22.6.6.2", stress_v(vu), stress_v(phi * vn_max), stress_u(), [&] {
        Steps st;
        stress_steps(st);
        st.add("φ vn,max", us_ ? "0.75 × 6 " + sqrt_fc : "0.75 × 0.5 " + sqrt_fc, "", stress_v(phi * vn_max),
               stress_u(), "ACI 318-19 22.6.6.2, 21.2.1");
        return st.take();
      });
    });
    run_check("punching_links", [&] {
      checks.add("punching_links", p.where, "ACI 318-19 22.6.6, 22.6.8", stress_v(vu), stress_v(phi * (vc_r + vs)),
                 stress_u(), [&] {
                   Steps st;
                   stress_steps(st);
                   concrete_steps(st);
                   st.add("vc", us_ ? "2 λs λ " + sqrt_fc + " with stirrups" : "0.17 λs λ " + sqrt_fc + " with stirrups",
                          "", stress_v(vc_r), stress_u(), "ACI 318-19 22.6.6.1");
                   st.add("s", p.reinforcement_spacing_mm ? "given" : "d/2", "", len_v(r.spacing_mm), len_u(),
                          "ACI 318-19 8.7.6.3");
                   st.add("fyt", "fy ≤ the shear limit", "", stress_v(r.design_strength_MPa), stress_u(),
                          "ACI 318-19 20.2.2.4");
                   st.add("Av", "(vu/φ − vc) b0 s/fyt",
                          "(" + stress(vu) + "/0.75 − " + stress(vc_r) + ") × " + len(b0.length_mm) + " × " +
                              len(r.spacing_mm) + "/" + stress(r.design_strength_MPa),
                          area_v(r.area_per_perimeter_mm2), area_u(), "ACI 318-19 22.6.8.2");
                   st.add("b0,out distance", "where vu ≤ φ vc (stirrups' vc) on the outer section", "",
                          len_v(r.outer_perimeter_distance_mm), len_u(), "ACI 318-19 22.6.4.2");
                   return st.take();
                 });
    });
    // 22.6.7.1 (from memory): stirrups only in slabs with d ≥ 6 in (150 mm)
    // (and d ≥ 16 db of the stirrup, whose size is not chosen here).
    const double d_min = us_ ? 6.0 * mm_per_in : 150.0;
    run_check("punching_links", [&] {
      checks.add("punching_links", p.where, "ACI 318-19 22.6.7.1", len_v(d_min), len_v(d), len_u(), [&] {
        Steps st;
        st.add("d_min", us_ ? "6 in for stirrups" : "150 mm for stirrups", "", len_v(d_min), len_u(),
               "ACI 318-19 22.6.7.1 (from memory)");
        st.add("d", "(dx + dy)/2", "", len_v(d), len_u(), "ACI 318-19 22.6.2.1");
        return st.take();
      });
    });
  }
  out.perimeters.insert(out.perimeters.begin(), std::move(b0));
  out.pass = verdict.all_pass;
  return out;
}

}  // namespace armature::aci318
