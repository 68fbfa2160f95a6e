// Load cases from actions × combinations × arrangements (loads.hpp).
#include "loads.hpp"

namespace armature {

namespace {

bool same_loads(const std::vector<SpanLoading>& x, const std::vector<SpanLoading>& y) {
  if (x.size() != y.size()) return false;
  for (std::size_t e = 0; e < x.size(); ++e) {
    if (x[e].w != y[e].w || x[e].loads.size() != y[e].loads.size()) return false;
    for (std::size_t k = 0; k < x[e].loads.size(); ++k) {
      const SpanLoad &p = x[e].loads[k], &q = y[e].loads[k];
      if (p.shape != q.shape || p.value != q.value || p.a_mm != q.a_mm || p.b_mm != q.b_mm) return false;
    }
  }
  return true;
}

}  // namespace

// The loads of one combination and arrangement on the strip's spans, for
// the strip width b: uniform actions over a whole span in `w`, partial
// ones as partial loads, line loads (value × b) and point loads (value ×
// b / effective width: the load per width of the loaded band) as
// concentrated loads.
std::vector<SpanLoading> loading_of(const std::vector<Action>& actions, const Combination& c,
                                    const std::vector<bool>& loaded, const std::vector<double>& spans_mm,
                                    double b) {
  std::vector<SpanLoading> out(loaded.size());
  for (std::size_t e = 0; e < loaded.size(); ++e) {
    SpanLoading& s = out[e];
    s.w = factored_sum(actions, c.factors, loaded[e], [e](const Action& a) { return uniform_on_span(a, e); }) * b;
    for (std::size_t i = 0; i < actions.size(); ++i) {
      const Action& a = actions[i];
      if (!a.span || *a.span != e || uniform_on_span(a, e)) continue;
      const double k = factor_of(a, c.factors[i], loaded[e]);
      if (k == 0.0 || a.value == 0.0) continue;
      switch (a.distribution) {
        case Distribution::uniform:
          s.loads.push_back(partial_uniform_load(k * a.value * b, a.from_mm.value_or(0.0),
                                                 a.to_mm.value_or(spans_mm[e])));
          break;
        case Distribution::line: s.loads.push_back(concentrated_load(k * a.value * b, a.at_mm)); break;
        case Distribution::point:
          s.loads.push_back(concentrated_load(k * a.value * b / a.effective_width_mm, a.at_mm));
          break;
      }
    }
  }
  return out;
}

// Load cases: every arrangement of every combination of one limit state.
// The same loads twice (a single span's "alternate" and "all spans"
// arrangements) add nothing to the envelope and are kept once.
std::vector<std::vector<SpanLoading>> load_cases(const std::vector<Action>& actions,
                                                 const std::vector<Combination>& combinations, LimitState state,
                                                 const std::vector<std::vector<bool>>& arrangements,
                                                 const std::vector<double>& spans_mm, double b) {
  std::vector<std::vector<SpanLoading>> cases;
  for (const auto& c : combinations) {
    if (c.limit_state != state) continue;
    for (const auto& a : arrangements) {
      auto loads = loading_of(actions, c, a, spans_mm, b);
      if (std::none_of(cases.begin(), cases.end(), [&](const auto& k) { return same_loads(k, loads); }))
        cases.push_back(std::move(loads));
    }
  }
  return cases;
}

// The same for a strip whose actions are all uniform over the whole strip
// (every version 1 request): one uniform load per span and case, the same
// values as load_cases gives, for the uniform-load analysis (the design
// path that must stay fastest).
std::vector<std::vector<double>> uniform_load_cases(const std::vector<Action>& actions,
                                                    const std::vector<Combination>& combinations, LimitState state,
                                                    const std::vector<std::vector<bool>>& arrangements, double b) {
  std::vector<std::vector<double>> cases;
  for (const auto& c : combinations) {
    if (c.limit_state != state) continue;
    const double loaded = factored_sum(actions, c.factors, true, whole_strip_uniform) * b;
    const double unloaded = factored_sum(actions, c.factors, false, whole_strip_uniform) * b;
    for (const auto& a : arrangements) {
      std::vector<double> w(a.size());
      for (std::size_t i = 0; i < a.size(); ++i) w[i] = a[i] ? loaded : unloaded;
      if (std::find(cases.begin(), cases.end(), w) == cases.end()) cases.push_back(std::move(w));
    }
  }
  return cases;
}

// Uniform totals of the whole-strip actions (the version 1 `loads`).
LoadTotals total_loads(const LoadBasis& basis, const std::vector<Action>& actions,
                       const std::vector<Combination>& combinations) {
  LoadTotals t;
  t.self_weight = actions.front().value;
  const std::vector<ActionFactor> unit(actions.size(), ActionFactor{1.0, 1.0});
  t.Gk = factored_sum(actions, unit, true,
                      [](const Action& a) { return whole_strip_uniform(a) && !is_variable(a.kind); });
  t.Qk = factored_sum(actions, unit, true,
                      [](const Action& a) { return whole_strip_uniform(a) && is_variable(a.kind); });
  t.uls = -1.0;
  t.sls_quasi_permanent = -1.0;
  for (const auto& c : combinations) {
    if (c.limit_state != LimitState::uls && c.limit_state != LimitState::quasi_permanent) continue;
    const double full = factored_sum(actions, c.factors, true, whole_strip_uniform);
    if (c.limit_state == LimitState::uls && full > t.uls) {
      t.uls = full;
      t.combination = c.label;
    }
    if (c.limit_state == LimitState::quasi_permanent) t.sls_quasi_permanent = std::max(t.sls_quasi_permanent, full);
  }
  if (t.sls_quasi_permanent < 0.0) t.sls_quasi_permanent = t.Gk;
  t.density_kN_m3 = basis.density_kN_m3;
  t.long_term_load_name = basis.long_term_load_name;
  t.permanent_load_name = basis.permanent_load_name;
  t.variable_load_name = basis.variable_load_name;
  t.action_kind_names = basis.action_kind_names;
  return t;
}

}  // namespace armature
