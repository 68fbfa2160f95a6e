// The result of contract.md, written once for any output: the JSON of the
// CLI (nlohmann::json) and the Python dicts of the binding walk the same
// schema through a Writer with these members:
//   begin_object(), begin_array(), end(), key(const char*),
//   value(double), value(long long) (counts and indices), value(bool),
//   value(const std::string&), value(const char*)
// and, optionally, value(const Label&) (else a Label is written as its text).
// Units convert here: m, kPa, kN, kNm outside; mm, MPa, N, N·mm inside.
#pragma once

#include <concepts>
#include <string>

#include "armature/design.hpp"
#include "armature/two_way.hpp"

namespace armature {

namespace result_units {
inline constexpr double kPa_per_MPa = 1000.0;
inline constexpr double kNm_per_Nmm = 1e-6;
inline constexpr double kN_per_N = 1e-3;
inline constexpr double m_per_mm = 1e-3;
}  // namespace result_units

// A key that is not a string literal (an action's name): a writer that
// keeps keys by address (the binding's) takes it through key_text.
template <class W>
void write_text_key(W& w, const std::string& k) {
  if constexpr (requires { w.key_text(k); }) w.key_text(k);
  else w.key(k.c_str());
}

// A writer may share one output object between the places a check appears
// (the result lists each check twice: in its region, support or span, and
// in the top-level list, as the same object) by offering reuse/remember.
template <class W>
concept SharesChecks = requires(W& w, const Check* c) {
  { w.reuse(c) } -> std::same_as<bool>;
  w.remember(c);
};

template <class W>
void write_check(W& w, const Check& c, bool with_steps) {
  if constexpr (SharesChecks<W>) {
    if (w.reuse(&c)) return;
  }
  w.begin_object();
  w.key("id"), w.value(c.id);
  w.key("where"), w.value(c.where);
  w.key("clause"), w.value(c.clause);
  w.key("demand"), w.value(c.demand);
  w.key("capacity"), w.value(c.capacity);
  w.key("unit"), w.value(c.unit);
  w.key("utilisation"), w.value(c.utilisation);
  w.key("pass"), w.value(c.pass);
  if (!c.method.empty()) w.key("method"), w.value(c.method);
  if (with_steps) {
    w.key("steps");
    w.begin_array();
    for (const auto& s : c.steps) {
      w.begin_object();
      w.key("symbol"), w.value(s.symbol);
      w.key("expression"), w.value(s.expression);
      w.key("substituted"), w.value(s.substituted);
      w.key("result"), w.value(s.result);
      w.key("unit"), w.value(s.unit);
      w.key("clause"), w.value(s.clause);
      w.end();
    }
    w.end();
  }
  w.end();
  if constexpr (SharesChecks<W>) w.remember(&c);
}

template <class W>
void write_bars(W& w, const BarChoice& b) {
  w.key("bar"), w.value(b.bar);
  w.key("diameter_mm"), w.value(b.diameter_mm);
  w.key("spacing_mm"), w.value(b.spacing_mm);
  w.key("As_prov_mm2"), w.value(b.As_prov_mm2);
}

template <class W>
void write_checks(W& w, const std::vector<Check>& checks, bool with_steps) {
  w.begin_array();
  for (const auto& c : checks) write_check(w, c, with_steps);
  w.end();
}

// detailing of the result (contract-v2 section 5): lengths along the
// strip in metres from its left end, cut lengths in mm.
// key: {"from": …, "to": …} in metres.
template <class W>
void write_range_m(W& w, const char* key, double from_mm, double to_mm) {
  using namespace result_units;
  w.key(key);
  w.begin_object();
  w.key("from"), w.value(from_mm * m_per_mm);
  w.key("to"), w.value(to_mm * m_per_mm);
  w.end();
}

template <class W>
void write_detailing(W& w, const DetailingRecord& d, bool with_steps) {
  using namespace result_units;
  w.begin_object();
  if (!d.plan) w.key("slab_width_m"), w.value(d.slab_width_mm * m_per_mm);  // a plate counts on its plan
  w.key("stock_length_m"), w.value(d.stock_length_mm * m_per_mm);
  w.key("bars");
  w.begin_array();
  for (const auto& b : d.bars) {
    w.begin_object();
    w.key("mark"), w.value(b.mark);
    w.key("where"), w.value(b.where);
    w.key("face"), w.value(b.face == Face::top ? "top" : "bottom");
    w.key("role"), w.value(b.distribution ? "distribution" : b.curtailed ? "curtailed" : "main");
    w.key("bar"), w.value(b.bar);
    w.key("diameter_mm"), w.value(b.diameter_mm);
    w.key("spacing_mm"), w.value(b.spacing_mm);
    w.key("count"), w.value(static_cast<long long>(b.count));
    // Along the strip (distribution bars: the part they are spread over,
    // with their own extent across the strip in across_m).
    w.key("start_m"), w.value((b.distribution ? b.along_from_mm : b.start_mm) * m_per_mm);
    w.key("end_m"), w.value((b.distribution ? b.along_to_mm : b.end_mm) * m_per_mm);
    if (b.distribution) write_range_m(w, "across_m", b.start_mm, b.end_mm);
    if (b.direction != BarDirection::span) {  // a two-way slab: the bars' direction and the band across them
      w.key("direction"), w.value(to_string(b.direction));
      if (!b.distribution) write_range_m(w, "across_m", b.across_from_mm, b.across_to_mm);
    }
    w.key("length_mm"), w.value(b.length_mm);
    w.key("shape"), w.value(b.shape);
    if (b.edge_loop) w.key("body_mm"), w.value(b.length_mm - b.leg_start_mm - b.leg_end_mm);  // across the depth
    // The legs of a bent bar, each to the outside of its bend (a U round a
    // free edge: its flat legs; its body stands across the depth).
    w.key("legs_mm");
    w.begin_object();
    w.key("start"), w.value(b.leg_start_mm);
    w.key("end"), w.value(b.leg_end_mm);
    w.end();
    if (b.bend_diameter_mm > 0.0) w.key("bend_diameter_mm"), w.value(b.bend_diameter_mm);  // wider than the standard
    w.key("anchorage_mm");
    w.begin_object();
    w.key("start"), w.value(b.anchorage_start_mm);
    w.key("end"), w.value(b.anchorage_end_mm);
    w.end();
    w.key("shift_mm"), w.value(b.shift_mm);
    w.key("laps");
    w.begin_array();
    for (const auto& l : b.laps) {
      w.begin_object();
      w.key("from_m"), w.value(l.from_mm * m_per_mm);
      w.key("to_m"), w.value(l.to_mm * m_per_mm);
      w.key("length_mm"), w.value(l.to_mm - l.from_mm);
      w.end();
    }
    w.end();
    w.key("clause"), w.value(b.clause);
    w.end();
  }
  w.end();
  w.key("schedule");
  w.begin_array();
  for (const auto& row : d.schedule) {
    w.begin_object();
    w.key("mark"), w.value(row.mark);
    w.key("bar"), w.value(row.bar);
    w.key("diameter_mm"), w.value(row.diameter_mm);
    w.key("count"), w.value(static_cast<long long>(row.count));
    w.key("length_mm"), w.value(row.length_mm);
    w.key("shape"), w.value(row.shape);
    w.key("legs_mm");  // the bends' legs, the longer first (none: straight)
    w.begin_array();
    for (double leg : {row.leg_a_mm, row.leg_b_mm})
      if (leg > 0.0) w.value(leg);
    w.end();
    if (row.bend_diameter_mm > 0.0) w.key("bend_diameter_mm"), w.value(row.bend_diameter_mm);
    w.key("mass_kg"), w.value(row.mass_kg);
    w.end();
  }
  w.end();
  w.key("total_mass_kg"), w.value(d.total_mass_kg);
  w.key("mass_per_area_kg_m2"), w.value(d.mass_per_area_kg_m2);
  auto write_envelope = [&](const std::vector<DiagramPoint>& points) {
    w.begin_array();
    for (const auto& p : points) {
      w.begin_object();
      w.key("x_m"), w.value(p.x_mm * m_per_mm);
      w.key("M_max_kNm"), w.value(p.M_max * kNm_per_Nmm);
      w.key("M_min_kNm"), w.value(p.M_min * kNm_per_Nmm);
      w.end();
    }
    w.end();
  };
  if (!d.plan) {
    w.key("envelope"), write_envelope(d.envelope);
  } else {
    // A plate: each row (bars in x) and column (bars in y) of bays, the
    // band it spans across and the envelope (per metre) its bars cover.
    w.key("strips");
    w.begin_array();
    for (const auto& st : d.strips) {
      w.begin_object();
      w.key("name"), w.value(st.name);
      w.key("direction"), w.value(to_string(st.direction));
      write_range_m(w, "across_m", st.across_from_mm, st.across_to_mm);
      w.key("envelope"), write_envelope(st.envelope);
      w.end();
    }
    w.end();
  }
  w.key("derivations");
  w.begin_array();
  for (const auto& dv : d.derivations) {
    w.begin_object();
    w.key("where"), w.value(dv.where);
    w.key("what"), w.value(dv.what);
    w.key("length_mm"), w.value(dv.length.length_mm);
    w.key("clause"), w.value(dv.length.clause);
    if (with_steps) {
      w.key("steps");
      w.begin_array();
      for (const auto& s : dv.length.steps) {
        w.begin_object();
        w.key("symbol"), w.value(s.symbol);
        w.key("expression"), w.value(s.expression);
        w.key("substituted"), w.value(s.substituted);
        w.key("result"), w.value(s.result);
        w.key("unit"), w.value(s.unit);
        w.key("clause"), w.value(s.clause);
        w.end();
      }
      w.end();
    }
    w.end();
  }
  w.end();
  w.end();
}

// A list of numbers scaled by k.
template <class W>
void write_numbers(W& w, const std::vector<double>& v, double k) {
  w.begin_array();
  for (double x : v) w.value(x * k);
  w.end();
}

// A node field (index ix + nx·iy) as rows by y index, columns by x index.
template <class W>
void write_node_grid(W& w, const std::vector<double>& v, std::size_t nx, double k) {
  w.begin_array();
  for (std::size_t j = 0; nx > 0 && j < v.size() / nx; ++j) {
    w.begin_array();
    for (std::size_t i = 0; i < nx; ++i) w.value(v[i + nx * j] * k);
    w.end();
  }
  w.end();
}

// The plate of a two-way slab: grid, edges, bays, the ULS envelopes at the
// mesh node lines (kNm/m) and the line reactions per segment.
template <class W>
void write_plate(W& w, const PlateRecord& p) {
  using namespace result_units;
  constexpr double kNm_per_m = 1e-3;  // N·mm/mm → kNm/m
  w.key("plate");
  w.begin_object();
  w.key("x_lines_m"), write_numbers(w, p.x_lines_mm, m_per_mm);
  w.key("y_lines_m"), write_numbers(w, p.y_lines_mm, m_per_mm);
  w.key("edges");
  w.begin_object();
  const char* edge_keys[4] = {"x0", "x1", "y0", "y1"};
  for (std::size_t k = 0; k < 4; ++k)
    w.key(edge_keys[k]), w.value(p.flat ? (p.column_edges[k] ? "columns" : "wall") : to_string(p.edges[k]));
  w.end();
  if (p.flat) {
    w.key("outline_m");
    w.begin_object();
    for (std::size_t k = 0; k < 4; ++k) w.key(edge_keys[k]), w.value(p.outline_mm[k] * m_per_mm);
    w.end();
    w.key("columns_restrained"), w.value(p.columns_restrained);
    w.key("strips");
    w.begin_array();
    for (const auto& s : p.strips) {
      w.begin_object();
      w.key("name"), w.value(s.name);
      w.key("kind"), w.value(s.column ? "column" : "middle");
      w.key("direction"), w.value(to_string(s.direction));
      w.key("spans");
      w.begin_array();
      for (const auto& q : s.pieces) {
        w.begin_object();
        w.key("x0_m"), w.value(q[0] * m_per_mm);
        w.key("x1_m"), w.value(q[1] * m_per_mm);
        w.key("y0_m"), w.value(q[2] * m_per_mm);
        w.key("y1_m"), w.value(q[3] * m_per_mm);
        w.end();
      }
      w.end();
      w.end();
    }
    w.end();
    w.key("bands");
    w.begin_array();
    for (const auto& b : p.bands) {
      const auto& q = b.pieces.front();
      w.begin_object();
      w.key("name"), w.value(b.name);
      w.key("direction"), w.value(to_string(b.direction));
      w.key("x0_m"), w.value(q[0] * m_per_mm);
      w.key("x1_m"), w.value(q[1] * m_per_mm);
      w.key("y0_m"), w.value(q[2] * m_per_mm);
      w.key("y1_m"), w.value(q[3] * m_per_mm);
      w.end();
    }
    w.end();
    w.key("strip_clause"), w.value(p.strip_clause);
    if (!p.extents_clause.empty()) {
      w.key("top_bar_extents");
      w.begin_array();
      for (const auto& e : p.top_extents) {
        w.begin_object();
        w.key("where"), w.value(e.where);
        w.key("direction"), w.value(to_string(e.direction));
        w.key("share"), w.value(e.share);
        w.key("before_mm"), w.value(e.before_mm);
        w.key("after_mm"), w.value(e.after_mm);
        w.end();
      }
      w.end();
      w.key("top_bar_extents_clause"), w.value(p.extents_clause);
    }
    if (!p.integrity.empty()) w.key("integrity"), w.value(p.integrity);
    if (!p.band_clause.empty()) w.key("band_clause"), w.value(p.band_clause);
  }
  w.key("bays");
  w.begin_array();
  for (const auto& b : p.bays) {
    w.begin_object();
    w.key("name"), w.value(b.name);
    w.key("x0_m"), w.value(b.x0_mm * m_per_mm);
    w.key("x1_m"), w.value(b.x1_mm * m_per_mm);
    w.key("y0_m"), w.value(b.y0_mm * m_per_mm);
    w.key("y1_m"), w.value(b.y1_mm * m_per_mm);
    w.end();
  }
  w.end();
  const PlateFieldRecord& f = p.field;
  const std::size_t nx = f.x_mm.size();
  w.key("field");
  w.begin_object();
  w.key("x_m"), write_numbers(w, f.x_mm, m_per_mm);
  w.key("y_m"), write_numbers(w, f.y_mm, m_per_mm);
  auto pair = [&](const char* name, const std::vector<double>& hi, const std::vector<double>& lo) {
    w.key(name);
    w.begin_object();
    w.key("max"), write_node_grid(w, hi, nx, kNm_per_m);
    w.key("min"), write_node_grid(w, lo, nx, kNm_per_m);
    w.end();
  };
  pair("mx", f.mx_max, f.mx_min);
  pair("my", f.my_max, f.my_min);
  pair("mxy", f.mxy_max, f.mxy_min);
  w.key("design");
  w.begin_object();
  w.key("bottom_x"), write_node_grid(w, f.bottom_x, nx, kNm_per_m);
  w.key("bottom_y"), write_node_grid(w, f.bottom_y, nx, kNm_per_m);
  w.key("top_x"), write_node_grid(w, f.top_x, nx, kNm_per_m);
  w.key("top_y"), write_node_grid(w, f.top_y, nx, kNm_per_m);
  w.end();
  w.end();
  w.key("reactions");
  w.begin_array();
  for (const auto& l : p.reactions) {
    w.begin_object();
    w.key("line"), w.value(l.name);
    w.key("runs_along"), w.value(l.runs_along == PlanAxis::x ? "x" : "y");
    w.key("at_m"), w.value(l.position_mm * m_per_mm);
    w.key("from_m"), w.value(l.from_mm * m_per_mm);
    w.key("to_m"), w.value(l.to_mm * m_per_mm);
    w.key("max_kN_per_m"), w.value(l.max_N_per_mm);  // N/mm = kN/m
    w.key("max_total_kN"), w.value(l.max_total_N * kN_per_N);
    w.end();
  }
  w.end();
  w.key("corners");
  w.begin_array();
  for (const auto& c : p.corners) {
    w.begin_object();
    w.key("name"), w.value(c.name);
    w.key("bay"), w.value(c.bay);
    w.key("x0_m"), w.value(c.x0_mm * m_per_mm);
    w.key("x1_m"), w.value(c.x1_mm * m_per_mm);
    w.key("y0_m"), w.value(c.y0_mm * m_per_mm);
    w.key("y1_m"), w.value(c.y1_mm * m_per_mm);
    w.key("clause"), w.value(c.clause);
    w.end();
  }
  w.end();
  w.key("free_edges");
  w.begin_array();
  for (const auto& fe : p.free_edges) {
    w.begin_object();
    w.key("edge"), w.value(fe.edge);
    w.key("bay"), w.value(fe.bay);
    w.key("from_m"), w.value(fe.from_mm * m_per_mm);
    w.key("to_m"), w.value(fe.to_mm * m_per_mm);
    w.key("u_bar"), w.value(fe.u_bar);
    w.key("u_bar_spacing_mm"), w.value(fe.u_bar_spacing_mm);
    w.key("u_bar_leg_mm"), w.value(fe.leg_mm);
    w.key("edge_bar"), w.value(fe.edge_bar);
    w.key("clause"), w.value(fe.clause);
    w.end();
  }
  w.end();
  w.key("poisson_ratio"), w.value(p.poisson_ratio);
  w.key("mesh_per_bay"), w.value(static_cast<long long>(p.mesh_per_bay));
  w.key("outer_layer");
  w.begin_object();
  w.key("bottom"), w.value(p.outer_layer[0]);
  w.key("top"), w.value(p.outer_layer[1]);
  w.end();
  w.key("load_arrangements"), w.value(static_cast<long long>(p.arrangements));
  w.end();
}

// A flat slab's columns: reaction, moments taken (restrained columns),
// and the punching checks with their perimeters and any reinforcement.
template <class W>
void write_columns(W& w, const std::vector<ColumnRecord>& columns, bool with_steps) {
  using namespace result_units;
  w.key("columns");
  w.begin_array();
  for (const auto& c : columns) {
    const PunchingOutcome& p = c.punching;
    w.begin_object();
    w.key("name"), w.value(c.name);
    w.key("x_m"), w.value(c.x_mm * m_per_mm);
    w.key("y_m"), w.value(c.y_mm * m_per_mm);
    w.key("size_mm");
    w.begin_array();
    w.value(c.cx_mm), w.value(c.cy_mm);
    w.end();
    w.key("position"), w.value(p.position == ColumnPosition::internal ? "internal"
                               : p.position == ColumnPosition::edge ? "edge" : "corner");
    w.key("reaction_kN"), w.value(c.V_Ed_N * kN_per_N);
    if (c.M_x_Nmm) w.key("M_x_kNm"), w.value(*c.M_x_Nmm * 1e-6);
    if (c.M_y_Nmm) w.key("M_y_kNm"), w.value(*c.M_y_Nmm * 1e-6);
    w.key("d_mm"), w.value(p.d_mm);
    w.key("transfer_factor"), w.value(p.transfer_factor);
    w.key("perimeters");
    w.begin_array();
    for (const auto& q : p.perimeters) {
      w.begin_object();
      w.key("name"), w.value(q.name);
      w.key("distance_mm"), w.value(q.distance_mm);
      w.key("length_mm"), w.value(q.length_mm);
      w.end();
    }
    w.end();
    w.key("v_MPa"), w.value(p.v_MPa);
    w.key("v_concrete_MPa"), w.value(p.v_concrete_MPa);
    w.key("v_face_MPa"), w.value(p.v_face_MPa);
    w.key("v_max_MPa"), w.value(p.v_max_MPa);
    w.key("reinforcement_needed"), w.value(p.reinforcement_needed);
    if (p.reinforcement) {
      const PunchingReinforcement& s = *p.reinforcement;
      w.key("reinforcement");
      w.begin_object();
      w.key("spacing_mm"), w.value(s.spacing_mm);
      w.key("area_per_perimeter_mm2"), w.value(s.area_per_perimeter_mm2);
      w.key("design_strength_MPa"), w.value(s.design_strength_MPa);
      w.key("outer_perimeter_distance_mm"), w.value(s.outer_perimeter_distance_mm);
      w.key("outermost_line_distance_mm"), w.value(s.outermost_line_distance_mm);
      w.end();
    }
    w.key("pass"), w.value(p.pass);
    w.key("checks"), write_checks(w, p.checks, with_steps);
    w.end();
  }
  w.end();
}

template <class W>
void write_result(W& w, const DesignRecord& r, bool with_steps = false) {
  using namespace result_units;
  w.begin_object();
  w.key("code"), w.value(r.code.id);
  w.key("variant"), w.value(r.code.variant);
  // Every force, moment and area below is for this width (stated where the
  // code's practice strip is not the 1000 mm of contract.md).
  if (r.state_strip_width) w.key("strip_width_mm"), w.value(r.strip_width_mm);
  w.key("armature_version"), w.value(version_string());
  w.key("status"), w.value(r.pass ? "pass" : "fail");
  w.key("max_utilisation"), w.value(r.max_utilisation);
  w.key("governing");
  w.begin_object();
  w.key("check"), w.value(r.governing_check);
  w.key("where"), w.value(r.governing_where);
  w.end();
  w.key("loads");
  w.begin_object();
  w.key("self_weight_kPa"), w.value(r.loads.self_weight * kPa_per_MPa);
  w.key("uls_kPa"), w.value(r.loads.uls * kPa_per_MPa);
  w.key("sls_quasi_permanent_kPa"), w.value(r.loads.sls_quasi_permanent * kPa_per_MPa);
  w.key("combination"), w.value(r.loads.combination);
  // Listed when the request lists its actions (loads.actions): every
  // action with its characteristic value, and every combination used.
  if (r.list_actions) {
    w.key("actions");
    w.begin_array();
    for (const auto& a : r.actions) {
      w.begin_object();
      w.key("name"), w.value(a.name);
      w.key("kind"), w.value(to_string(a.kind));
      if (!a.category.empty()) w.key("category"), w.value(a.category);
      w.key("distribution"), w.value(to_string(a.distribution));
      switch (a.distribution) {
        case Distribution::uniform: w.key("kPa"), w.value(a.value * kPa_per_MPa); break;
        case Distribution::line: w.key("line_kN_per_m"), w.value(a.value); break;  // N/mm = kN/m
        case Distribution::point: w.key("point_kN"), w.value(a.value * kN_per_N); break;
      }
      if (a.span) w.key("span"), w.value(static_cast<long long>(*a.span + 1));
      if (a.from_mm) w.key("from_m"), w.value(*a.from_mm * m_per_mm);
      if (a.to_mm) w.key("to_m"), w.value(*a.to_mm * m_per_mm);
      if (a.distribution != Distribution::uniform) w.key("at_m"), w.value(a.at_mm * m_per_mm);
      if (a.distribution == Distribution::point)
        w.key("effective_width_m"), w.value(a.effective_width_mm * m_per_mm);
      w.end();
    }
    w.end();
    w.key("combinations");
    w.begin_array();
    for (const auto& c : r.combinations) {
      w.begin_object();
      w.key("label"), w.value(c.label);
      w.key("limit_state"), w.value(to_string(c.limit_state));
      w.key("factors");
      w.begin_object();
      for (std::size_t i = 0; i < c.factors.size() && i < r.actions.size(); ++i)
        write_text_key(w, r.actions[i].name), w.value(c.factors[i].loaded);
      w.end();
      // Permanent actions on the spans an arrangement leaves unloaded
      // (EQU: the back span), where that factor differs.
      w.key("factors_unloaded_spans");
      w.begin_object();
      for (std::size_t i = 0; i < c.factors.size() && i < r.actions.size(); ++i)
        if (!is_variable(r.actions[i].kind)) write_text_key(w, r.actions[i].name), w.value(c.factors[i].unloaded);
      w.end();
      w.end();
    }
    w.end();
  }
  w.end();
  // One nominal cover per face that has main bars (contract-v2 3).
  w.key("cover_mm");
  w.begin_object();
  for (const Face face : {Face::top, Face::bottom})
    if (r.cover_mm(face) > 0.0) w.key(to_string(face)), w.value(r.cover_mm(face));
  w.end();
  w.key("regions");
  w.begin_array();
  for (const auto& g : r.regions) {
    w.begin_object();
    w.key("where"), w.value(g.where);
    w.key("face"), w.value(to_string(g.face));
    w.key("x_m"), w.value(g.x_mm * m_per_mm);
    if (g.direction != BarDirection::span) {  // a two-way slab's region: per metre, in plan
      w.key("direction"), w.value(to_string(g.direction));
      w.key("y_m"), w.value(g.y_mm * m_per_mm);
    }
    w.key("design_moment_kNm"), w.value(g.M_Ed * kNm_per_Nmm);
    w.key("effective_depth_mm"), w.value(g.d_mm);
    w.key("As_req_mm2"), w.value(g.As_req_mm2);
    w.key("As_min_mm2"), w.value(g.As_min_mm2);
    w.key("As_max_mm2"), w.value(g.As_max_mm2);
    w.key("bars");
    w.begin_object();
    write_bars(w, g.bars);
    w.end();
    w.key("bars_given"), w.value(g.bars_given);
    w.key("checks"), write_checks(w, g.checks, with_steps);
    w.end();
  }
  w.end();
  w.key("supports");
  w.begin_array();
  for (const auto& s : r.supports) {
    w.begin_object();
    w.key("where"), w.value(s.where);
    w.key("design_shear_kN"), w.value(s.V_Ed * kN_per_N);
    w.key("shear_resistance_kN"), w.value(s.V_Rd * kN_per_N);
    w.key("checks"), write_checks(w, s.checks, with_steps);
    w.end();
  }
  w.end();
  w.key("spans");
  w.begin_array();
  for (const auto& s : r.spans) {
    w.begin_object();
    w.key("where"), w.value(s.where);
    w.key("checks"), write_checks(w, s.checks, with_steps);
    w.end();
  }
  w.end();
  if (!r.plate) {  // a two-way slab designs both directions: no distribution bars
    w.key("distribution");
    w.begin_object();
    write_bars(w, r.distribution.bars);
    w.key("As_req_mm2"), w.value(r.distribution.As_req_mm2);
    w.end();
  }
  if (r.plate) write_plate(w, *r.plate);
  if (r.plate && r.plate->flat) write_columns(w, r.columns, with_steps);
  if (r.detailing) w.key("detailing"), write_detailing(w, *r.detailing, with_steps);
  w.key("checks");
  w.begin_array();
  for (const Check* c : r.all_checks()) write_check(w, *c, with_steps);
  w.end();
  w.key("warnings");
  w.begin_array();
  for (const auto& text : r.warnings) w.value(text);
  w.end();
  w.key("caution"), w.value(caution_text);
  w.end();
}

}  // namespace armature
