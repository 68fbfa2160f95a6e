// PunchingRules of the EN 1992-1-1 session: 6.4 at one column of a flat
// slab. The clause functions are in punching_rules.hpp; this file puts
// them together with the session's materials and NDPs.
#include <cmath>
#include <numbers>
#include <stdexcept>

#include "checker.hpp"

namespace armature::en1992 {

namespace {

constexpr const char* clause_u1 = "EN 1992-1-1 6.4.2";

// The edge of an edge column runs along x when a y face is free.
bool edge_along_x(const FreeFaces& f) { return f.y0 || f.y1; }

// Figure 6.20: the column outline taken for u1*, only min(0.5 c1, 1.5 d)
// deep from each free face.
ColumnOutline reduced_outline(const PunchingDemand& p, double d) {
  ColumnOutline o = centred_outline(p.cx_mm, p.cy_mm);
  const double ax = reduced_column_depth(p.cx_mm, d), ay = reduced_column_depth(p.cy_mm, d);
  if (p.free.x0) o.x_max = o.x_min + ax;
  if (p.free.x1) o.x_min = o.x_max - ax;
  if (p.free.y0) o.y_max = o.y_min + ay;
  if (p.free.y1) o.y_min = o.y_max - ay;
  return o;
}

double moment_of(const std::optional<double>& M, const char* field) {
  if (!M) throw std::invalid_argument(std::string("punching demand: ") + field +
                                      " is needed where the structure is not braced with regular spans");
  return *M;
}

const char* position_name(ColumnPosition pos) {
  return pos == ColumnPosition::internal ? "internal" : pos == ColumnPosition::edge ? "edge" : "corner";
}

}  // namespace

double Checker::steel_ratio_width_mm(const PunchingDemand& p, bool along_x) const {
  const double d = punching_effective_depth(p.dx_mm, p.dy_mm);
  // Bars along x are spread across y: the width is the column's y size
  // plus 3d past each y face that is not free.
  if (along_x) return punching_steel_ratio_width(p.cy_mm, d, int(!p.free.y0) + int(!p.free.y1));
  return punching_steel_ratio_width(p.cx_mm, d, int(!p.free.x0) + int(!p.free.x1));
}

// 9.4.1(3): at an edge or corner column, the bars across a free edge that
// carry the moment into the column lie within be (Figure 9.9); the whole
// moment. None at internal columns (9.4.1(2)'s band serves there) or along
// the edge.
std::optional<TransferBand> Checker::moment_transfer_band(const PunchingDemand& p, bool bars_x) const {
  const ColumnPosition pos = column_position(p.free);
  const bool across_free = bars_x ? (p.free.x0 || p.free.x1) : (p.free.y0 || p.free.y1);
  if (pos == ColumnPosition::internal || !across_free) return std::nullopt;
  const double c_along = bars_x ? p.cy_mm : p.cx_mm, c_across = bars_x ? p.cx_mm : p.cy_mm;
  const double be = pos == ColumnPosition::edge ? edge_column_effective_width(c_along, c_across)
                                                : corner_column_effective_width(c_along, c_across);
  return TransferBand{be, 1.0, "EN 1992-1-1 9.4.1(3), Figure 9.9"};
}

PunchingOutcome Checker::check_punching(const PunchingDemand& p, Detail detail) const {
  validate_punching_demand(p);
  PunchingOutcome out;
  out.where = p.where;
  out.position = column_position(p.free);
  const ColumnPosition pos = out.position;
  const double d = punching_effective_depth(p.dx_mm, p.dy_mm);
  out.d_mm = d;
  const double V = p.V_N;

  // Perimeters: u1 at 2d (6.4.2, Figure 6.13, 6.15), u0 at the column (6.4.5(3)).
  const ColumnOutline column = centred_outline(p.cx_mm, p.cy_mm);
  PunchingPerimeter u1 =
      offset_perimeter("u1", column, p.free, basic_control_distance_factor * d, PerimeterCorner::round);
  PunchingPerimeter u0 = offset_perimeter("u0", column, p.free, 0.0, PerimeterCorner::square);
  const bool along_x = edge_along_x(p.free);
  const double c1 = along_x ? p.cy_mm : p.cx_mm;  // across the free edge
  const double c2 = along_x ? p.cx_mm : p.cy_mm;  // along it
  if (pos == ColumnPosition::edge) u0.length_mm = edge_column_face_perimeter(c1, c2, d);
  if (pos == ColumnPosition::corner) u0.length_mm = corner_column_face_perimeter(p.cx_mm, p.cy_mm, d);
  std::optional<PunchingPerimeter> u1_reduced;
  if (pos != ColumnPosition::internal)
    u1_reduced = offset_perimeter("u1*", reduced_outline(p, d), p.free, basic_control_distance_factor * d,
                                  PerimeterCorner::round);

  // β: 6.4.3(3)–(5) from the moments; Figure 6.21N where it applies
  // (6.4.3(6)), or the larger of the two where the moments are known too.
  struct Beta {
    double value = 1.0;
    std::string expression, substituted, clause;
  };
  auto computed_beta = [&]() {
    Beta b;
    if (pos == ColumnPosition::internal) {
      const double Mx = moment_of(p.M_x_Nmm, "M_x_Nmm"), My = moment_of(p.M_y_Nmm, "M_y_Nmm");
      const double kx = moment_transfer_k(p.cx_mm / p.cy_mm), ky = moment_transfer_k(p.cy_mm / p.cx_mm);
      const double Wx = perimeter_first_moment(u1, true, 0.0), Wy = perimeter_first_moment(u1, false, 0.0);
      const double tx = V > 0.0 ? beta_term(kx, Mx, V, u1.length_mm, Wx) : 0.0;
      const double ty = V > 0.0 ? beta_term(ky, My, V, u1.length_mm, Wy) : 0.0;
      b.value = 1.0 + tx + ty;
      b.expression = "1 + kx (Mx/VEd) u1/W1x + ky (My/VEd) u1/W1y";
      b.substituted = "1 + " + num(kx) + " × (" + num(Mx * 1e-6) + "/" + num(V * 1e-3) + ") × " +
                      num(u1.length_mm) + "/" + num(Wx) + " + " + num(ky) + " × (" + num(My * 1e-6) + "/" +
                      num(V * 1e-3) + ") × " + num(u1.length_mm) + "/" + num(Wy);
      b.clause = "EN 1992-1-1 6.4.3(3) (6.39), Table 6.1, (6.41)";
    } else if (pos == ColumnPosition::edge) {
      const double M_par = moment_of(along_x ? p.M_x_Nmm : p.M_y_Nmm, along_x ? "M_x_Nmm" : "M_y_Nmm");
      const double k = moment_transfer_k(c1 / (2.0 * c2));
      const double W = perimeter_first_moment(u1, along_x, 0.0);
      const double t = V > 0.0 ? beta_term(k, M_par, V, u1.length_mm, W) : 0.0;
      b.value = u1.length_mm / u1_reduced->length_mm + t;
      b.expression = "u1/u1* + k (Mpar/VEd) u1/W1";
      b.substituted = num(u1.length_mm) + "/" + num(u1_reduced->length_mm) + " + " + num(k) + " × (" +
                      num(M_par * 1e-6) + "/" + num(V * 1e-3) + ") × " + num(u1.length_mm) + "/" + num(W);
      b.clause = "EN 1992-1-1 6.4.3(4) (6.44), Table 6.1 with c1/2c2, (6.45)";
    } else {
      b.value = u1.length_mm / u1_reduced->length_mm;
      b.expression = "u1/u1*";
      b.substituted = num(u1.length_mm) + "/" + num(u1_reduced->length_mm);
      b.clause = "EN 1992-1-1 6.4.3(5) (6.46)";
    }
    return b;
  };
  Beta chosen;
  if (p.braced_regular_spans) {
    chosen.value = simplified_beta(pos);
    chosen.expression = std::string("Figure 6.21N, ") + position_name(pos) + " column";
    chosen.clause = "EN 1992-1-1 6.4.3(6) Figure 6.21N";
    if (p.M_x_Nmm && p.M_y_Nmm) {  // the moments are known: the larger
      const Beta c = computed_beta();
      if (c.value > chosen.value) {
        chosen.expression = "max(Figure 6.21N " + num(chosen.value) + ", " + c.expression + ")";
        chosen.substituted = c.substituted;
        chosen.value = c.value;
        chosen.clause = c.clause + "; 6.4.3(6)";
      } else {
        chosen.expression += " (not less than " + c.expression + " = " + num(c.value) + ")";
      }
    }
  } else {
    chosen = computed_beta();
  }
  const double beta = chosen.value;
  const std::string& beta_expression = chosen.expression;
  const std::string& beta_substituted = chosen.substituted;
  const std::string& beta_clause = chosen.clause;
  out.transfer_factor = beta;

  // Stresses and resistances.
  const double v_Ed = punching_shear_stress(beta, V, u1.length_mm, d);
  const double v_Ed0 = punching_shear_stress(beta, V, u0.length_mm, d);
  const double k = shear_depth_factor(d);
  const double rho_l = punching_steel_ratio(p.rho_x, p.rho_y);
  const double fck_v = shear_strength_fck(m_.fck, ndp_.shear_fck_cap_MPa);
  const double v_min = minimum_shear_strength(k, fck_v, ndp_.v_min_factor);
  const double C = ndp_.C_Rd_c_factor / ndp_.gamma_c;
  const double v_Rdc = punching_resistance_concrete(C, k, rho_l, fck_v, v_min);
  const double nu = strength_reduction_factor(m_.fck);
  const double v_Rd_max = punching_max_stress(ndp_.punching_v_max_factor, nu, m_.fcd);
  out.v_MPa = v_Ed;
  out.v_concrete_MPa = v_Rdc;
  out.v_face_MPa = v_Ed0;
  out.v_max_MPa = v_Rd_max;
  out.reinforcement_needed = v_Ed > v_Rdc;

  RegionVerdict verdict;
  CheckCollector checks(out.checks, verdict, detail);
  auto stress_steps = [&](Steps& st) {
    st.add("d", "(dx + dy)/2", "(" + num(p.dx_mm) + " + " + num(p.dy_mm) + ")/2", d, "mm", "EN 1992-1-1 6.4.2(1) (6.32)");
    st.add("u1", std::string("basic control perimeter at 2d, ") + position_name(pos) + " column", "", u1.length_mm, "mm",
           clause_u1);
    if (u1_reduced)
      st.add("u1*", "reduced perimeter, min(0.5 c1, 1.5 d) of the column from the free edge", "",
             u1_reduced->length_mm, "mm", "EN 1992-1-1 6.4.3(4) Figure 6.20");
    st.add("β", beta_expression, beta_substituted, beta, "-", beta_clause);
    st.add("vEd", "β VEd/(u1 d)",
           num(beta) + " × " + num(V) + "/(" + num(u1.length_mm) + " × " + num(d) + ")", v_Ed, "MPa",
           "EN 1992-1-1 6.4.3(3) (6.38)");
  };
  auto concrete_steps = [&](Steps& st) {
    st.add("k", "1 + √(200/d) ≤ 2", "1 + √(200/" + num(d) + ")", k, "-", "EN 1992-1-1 6.4.4(1)");
    st.add("ρl", "√(ρlx ρly) ≤ 0.02", "√(" + num(p.rho_x) + " × " + num(p.rho_y) + ")", rho_l, "-",
           "EN 1992-1-1 6.4.4(1)");
    st.add("CRd,c", "factor / γc", num(ndp_.C_Rd_c_factor) + " / " + num(ndp_.gamma_c), C, "-",
           variant_ndp("EN 1992-1-1 6.4.4(1)", "C_Rd_c_factor, gamma_c"));
    st.add("vmin", num(ndp_.v_min_factor) + " k^1.5 fck^0.5",
           num(ndp_.v_min_factor) + " × " + num(k) + "^1.5 × " + num(fck_v) + "^0.5", v_min, "MPa",
           variant_ndp("EN 1992-1-1 6.4.4(1) (6.3N)", "v_min_factor"));
    st.add("vRd,c", "max(CRd,c k (100 ρl fck)^(1/3), vmin)",
           "max(" + num(C) + " × " + num(k) + " × (100 × " + num(rho_l) + " × " + num(fck_v) + ")^(1/3), " +
               num(v_min) + ")",
           v_Rdc, "MPa", "EN 1992-1-1 6.4.4(1) (6.47)");
  };

  run_check("punching_max", [&] {
    checks.add("punching_max", p.where, "EN 1992-1-1 6.4.5(3)", v_Ed0, v_Rd_max, "MPa", [&] {
      Steps st;
      st.add("u0", pos == ColumnPosition::internal ? "column perimeter"
                   : pos == ColumnPosition::edge   ? "c2 + 3d ≤ c2 + 2c1"
                                                   : "3d ≤ c1 + c2",
             "", u0.length_mm, "mm", "EN 1992-1-1 6.4.5(3)");
      st.add("vEd,0", "β VEd/(u0 d)", num(beta) + " × " + num(V) + "/(" + num(u0.length_mm) + " × " + num(d) + ")",
             v_Ed0, "MPa", "EN 1992-1-1 6.4.5(3) (6.53)");
      st.add("ν", "0.6 (1 − fck/250)", "0.6 × (1 − " + num(m_.fck) + "/250)", nu, "-", "EN 1992-1-1 6.2.2(6) (6.6N)");
      st.add("vRd,max", num(ndp_.punching_v_max_factor) + " ν fcd",
             num(ndp_.punching_v_max_factor) + " × " + num(nu) + " × " + num(m_.fcd), v_Rd_max, "MPa",
             variant_ndp("EN 1992-1-1 6.4.5(3)", "punching_v_max_factor"));
      return st.take();
    });
  });

  if (!out.reinforcement_needed || !p.shear_reinforcement_allowed) {
    run_check("punching", [&] {
      checks.add("punching", p.where, "EN 1992-1-1 6.4.3(2), 6.4.4(1)", v_Ed, v_Rdc, "MPa", [&] {
        Steps st;
        stress_steps(st);
        concrete_steps(st);
        return st.take();
      });
    });
  } else {
    // 6.4.5: links on perimeters sr apart, from (6.52), out to uout,ef.
    PunchingReinforcement r;
    r.spacing_mm = p.reinforcement_spacing_mm.value_or(max_link_perimeter_spacing(d));
    r.design_strength_MPa = effective_link_strength(d, m_.fyd);
    // Rounded up to the whole mm², so that vRd,cs of the area stated is
    // not below vEd by the rounding of the arithmetic.
    r.area_per_perimeter_mm2 = std::ceil(
        required_links_per_perimeter(v_Ed, v_Rdc, u1.length_mm, r.spacing_mm, r.design_strength_MPa));
    const double st_max = max_link_tangential_spacing(d);
    r.min_leg_area_mm2 = min_link_leg_area(m_.fck, m_.fyk, r.spacing_mm, st_max);
    const double v_Rdcs = punching_resistance_with_links(v_Rdc, d, r.spacing_mm, r.area_per_perimeter_mm2,
                                                         r.design_strength_MPa, u1.length_mm);
    const double u_out = outer_perimeter_length(beta, V, v_Rdc, d);
    // The perimeter at distance a round the column: the column's faces
    // that are not free plus a quarter circle of radius a per corner.
    const double faces = pos == ColumnPosition::internal ? 2.0 * (p.cx_mm + p.cy_mm)
                         : pos == ColumnPosition::edge   ? c2 + 2.0 * c1
                                                         : p.cx_mm + p.cy_mm;
    const double corners = pos == ColumnPosition::internal ? 4.0 : pos == ColumnPosition::edge ? 2.0 : 1.0;
    r.outer_perimeter_distance_mm = (u_out - faces) / (corners * std::numbers::pi / 2.0);
    r.outermost_line_distance_mm = r.outer_perimeter_distance_mm - outer_link_perimeter_k * d;
    out.perimeters.push_back(offset_perimeter("uout,ef", column, p.free, r.outer_perimeter_distance_mm,
                                              PerimeterCorner::round));
    out.reinforcement = r;
    run_check("punching_links", [&] {
      checks.add("punching_links", p.where, "EN 1992-1-1 6.4.5(1)", v_Ed, v_Rdcs, "MPa", [&] {
        Steps st;
        stress_steps(st);
        concrete_steps(st);
        st.add("sr", p.reinforcement_spacing_mm ? "given" : "0.75 d", p.reinforcement_spacing_mm ? "" : "0.75 × " + num(d),
               r.spacing_mm, "mm", "EN 1992-1-1 9.4.3(1)");
        st.add("fywd,ef", "250 + 0.25 d ≤ fywd", "min(250 + 0.25 × " + num(d) + ", " + num(m_.fyd) + ")",
               r.design_strength_MPa, "MPa", "EN 1992-1-1 6.4.5(1)");
        st.add("Asw", "(vEd − 0.75 vRd,c) u1 sr/(1.5 fywd,ef), up to the whole mm²",
               "(" + num(v_Ed) + " − 0.75 × " + num(v_Rdc) + ") × " + num(u1.length_mm) + " × " + num(r.spacing_mm) +
                   "/(1.5 × " + num(r.design_strength_MPa) + ")",
               r.area_per_perimeter_mm2, "mm2", "EN 1992-1-1 6.4.5(1) (6.52)");
        st.add("Asw,min", "0.08 √fck sr st/(1.5 fyk), st = 1.5 d",
               "0.08 × √" + num(m_.fck) + " × " + num(r.spacing_mm) + " × " + num(st_max) + "/(1.5 × " +
                   num(m_.fyk) + ")",
               r.min_leg_area_mm2, "mm2", "EN 1992-1-1 9.4.3(1), (2) (9.11)");
        st.add("vRd,cs", "0.75 vRd,c + 1.5 (d/sr) Asw fywd,ef/(u1 d)", "", v_Rdcs, "MPa", "EN 1992-1-1 6.4.5(1) (6.52)");
        st.add("uout,ef", "β VEd/(vRd,c d)",
               num(beta) + " × " + num(V) + "/(" + num(v_Rdc) + " × " + num(d) + ")", u_out, "mm",
               "EN 1992-1-1 6.4.5(4) (6.54)");
        st.add("a_out", "distance of uout,ef from the column", "", r.outer_perimeter_distance_mm, "mm",
               "EN 1992-1-1 6.4.5(4)");
        st.add("a_links", "a_out − 1.5 d: outermost perimeter of links, at most", "", r.outermost_line_distance_mm, "mm",
               "EN 1992-1-1 6.4.5(4)");
        return st.take();
      });
    });
    // 9.3.2(1): a slab with shear reinforcement at least 200 mm deep.
    run_check("punching_links", [&] {
      checks.add("punching_links", p.where, "EN 1992-1-1 9.3.2(1)", slab_min_depth_with_shear_reinforcement,
                 p.h_mm, "mm", [&] {
                   Steps st;
                   st.add("h_min", "slab with shear reinforcement", "", slab_min_depth_with_shear_reinforcement, "mm",
                          "EN 1992-1-1 9.3.2(1)");
                   return st.take();
                 });
    });
  }
  // Moment transfer at an edge or corner column, across each free edge,
  // where the analysis gives the moments: Annex I.1.2(5) Mt,max = 0.17 be
  // d² fck (the bars within be are a region of the member's, designed for
  // the moment: moment_transfer_band).
  if (pos != ColumnPosition::internal && p.M_x_Nmm && p.M_y_Nmm) {
    for (const bool bars_x : {true, false}) {
      const bool across_free = bars_x ? (p.free.x0 || p.free.x1) : (p.free.y0 || p.free.y1);
      if (!across_free) continue;
      const double M = bars_x ? *p.M_x_Nmm : *p.M_y_Nmm;
      const double c_along = bars_x ? p.cy_mm : p.cx_mm, c_across = bars_x ? p.cx_mm : p.cy_mm;
      const double be = pos == ColumnPosition::edge ? edge_column_effective_width(c_along, c_across)
                                                    : corner_column_effective_width(c_along, c_across);
      const double db = bars_x ? p.dx_mm : p.dy_mm;
      const double Mt_max = edge_moment_transfer_limit(be, db, m_.fck);
      const std::string dir = bars_x ? "x" : "y";
      auto width_steps = [&](Steps& st) {
        st.add("M" + dir, "moment the column takes across the free edge (analysis)", "", M * 1e-6, "kNm",
               "EN 1992-1-1 5.1.1, Annex I.1.2(5)");
        st.add("be", pos == ColumnPosition::edge ? "cz + y (the edge flush with the column)" : "z + y/2 (corner)",
               num(c_along) + " + " + num(c_across) + (pos == ColumnPosition::edge ? "" : "/2"), be, "mm",
               "EN 1992-1-1 9.4.1(3) Figure 9.9 (from memory)");
      };
      run_check("moment_transfer", [&] {
        checks.add("moment_transfer", p.where, "EN 1992-1-1 Annex I.1.2(5)", M * 1e-6, Mt_max * 1e-6, "kNm", [&] {
          Steps st;
          width_steps(st);
          st.add("Mt,max", "0.17 be d² fck", "0.17 × " + num(be) + " × " + num(db) + "² × " + num(m_.fck),
                 Mt_max * 1e-6, "kNm", "EN 1992-1-1 Annex I.1.2(5)");
          return st.take();
        });
      });
    }
  }
  out.perimeters.insert(out.perimeters.begin(), std::move(u1));
  out.perimeters.insert(out.perimeters.begin(), std::move(u0));
  if (u1_reduced) out.perimeters.push_back(std::move(*u1_reduced));
  out.pass = verdict.all_pass;
  return out;
}

}  // namespace armature::en1992
