// The result of contract.md, written once for any output: the JSON of the
// CLI (nlohmann::json) and the Python dicts of the binding walk the same
// schema through a Writer with these members:
//   begin_object(), begin_array(), end(), key(const char*),
//   value(double), value(bool), value(const std::string&), value(const char*)
// and, optionally, value(const Label&) (else a Label is written as its text).
// Units convert here: m, kPa, kN, kNm outside; mm, MPa, N, N·mm inside.
#pragma once

#include <concepts>
#include <string>

#include "armature/design.hpp"

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
      if (a.span) w.key("span"), w.value(static_cast<double>(*a.span + 1));
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
  w.key("distribution");
  w.begin_object();
  write_bars(w, r.distribution.bars);
  w.key("As_req_mm2"), w.value(r.distribution.As_req_mm2);
  w.end();
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
