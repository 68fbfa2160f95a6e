// Load cases from actions × combinations × arrangements, for any member
// whose variable actions are patterned over spans (or, later, bays): the
// factored loads on each part, and the uniform totals of the record.
#pragma once

#include <algorithm>
#include <utility>
#include <vector>

#include <boost/container/small_vector.hpp>

#include "armature/actions.hpp"
#include "armature/analysis.hpp"
#include "armature/code.hpp"
#include "armature/combinations.hpp"

namespace armature {

inline bool whole_strip_uniform(const Action& a) {
  return a.distribution == Distribution::uniform && !a.span && !a.plan_mm;  // a two-way patch is located
}

// Uniform over the whole of span e (a whole-strip action, or one on that
// span with no from/to).
inline bool uniform_on_span(const Action& a, std::size_t e) {
  return a.distribution == Distribution::uniform && (!a.span || (*a.span == e && !a.from_mm && !a.to_mm));
}

inline double factor_of(const Action& a, const ActionFactor& f, bool loaded) {
  if (loaded) return f.loaded;
  return is_variable(a.kind) ? 0.0 : f.unloaded;
}

// Σ factor × value over the actions `on` selects: the permanent ones summed
// first and factored once per distinct factor, then each variable one, so
// that G and Q alone give γG Gk + γQ Qk operation for operation (version 1).
template <class On>
double factored_sum(const std::vector<Action>& actions, const std::vector<ActionFactor>& f, bool loaded, On on) {
  boost::container::small_vector<std::pair<double, double>, 4> groups;  // factor, Σ values
  for (std::size_t i = 0; i < actions.size(); ++i) {
    if (is_variable(actions[i].kind) || !on(actions[i])) continue;
    const double k = factor_of(actions[i], f[i], loaded);
    auto g = std::find_if(groups.begin(), groups.end(), [&](const auto& p) { return p.first == k; });
    if (g == groups.end()) groups.emplace_back(k, actions[i].value);
    else g->second += actions[i].value;
  }
  double total = 0.0;
  bool first = true;
  auto add = [&](double term) {
    total = first ? term : total + term;
    first = false;
  };
  for (const auto& [k, sum] : groups) add(k * sum);
  for (std::size_t i = 0; i < actions.size(); ++i)
    if (is_variable(actions[i].kind) && on(actions[i])) add(factor_of(actions[i], f[i], loaded) * actions[i].value);
  return total;
}

// The loads of one combination and arrangement on the strip's spans, for
// the strip width b: uniform actions over a whole span in `w`, partial
// ones as partial loads, line loads (value × b) and point loads (value ×
// b / effective width: the load per width of the loaded band) as
// concentrated loads.
std::vector<SpanLoading> loading_of(const std::vector<Action>& actions, const Combination& c,
                                    const std::vector<bool>& loaded, const std::vector<double>& spans_mm,
                                    double b);

// Load cases: every arrangement of every combination of one limit state.
// The same loads twice (a single span's "alternate" and "all spans"
// arrangements) add nothing to the envelope and are kept once.
std::vector<std::vector<SpanLoading>> load_cases(const std::vector<Action>& actions,
                                                 const std::vector<Combination>& combinations, LimitState state,
                                                 const std::vector<std::vector<bool>>& arrangements,
                                                 const std::vector<double>& spans_mm, double b);

// The same for a strip whose actions are all uniform over the whole strip
// (every version 1 request): one uniform load per span and case, the same
// values as load_cases gives, for the uniform-load analysis (the design
// path that must stay fastest).
std::vector<std::vector<double>> uniform_load_cases(const std::vector<Action>& actions,
                                                    const std::vector<Combination>& combinations, LimitState state,
                                                    const std::vector<std::vector<bool>>& arrangements, double b);

// Uniform totals of the whole-strip actions (the version 1 `loads`).
LoadTotals total_loads(const LoadBasis& basis, const std::vector<Action>& actions,
                       const std::vector<Combination>& combinations);

}  // namespace armature
