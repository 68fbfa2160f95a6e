// ACI 318-19 5.3.1 load combinations.
#include "combinations.hpp"

#include <cstdio>
#include <string>

namespace armature::aci318 {
namespace {

std::string num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", v);
  return buf;
}

enum class Symbol { D, L, Lr, S };
Symbol symbol_of(const Action& a) {
  switch (a.kind) {
    case ActionKind::permanent: return Symbol::D;
    // EN category H (roofs not accessible but for maintenance) is ACI's
    // roof live load Lr, whichever kind the request names it by.
    case ActionKind::imposed: return a.category == "H" ? Symbol::Lr : Symbol::L;
    case ActionKind::roof: return Symbol::Lr;
    case ActionKind::snow: return Symbol::S;
  }
  return Symbol::D;
}
const char* name_of(Symbol s) {
  switch (s) {
    case Symbol::D: return "D";
    case Symbol::L: return "L";
    case Symbol::Lr: return "Lr";
    case Symbol::S: return "S";
  }
  return "";
}

struct Term {
  Symbol symbol;
  double factor;
};

// A combination from its terms; a symbol left out has factor 0.
Combination combination_of(const std::string& clause, LimitState state, const std::vector<Term>& terms,
                           const std::vector<Action>& actions, CombinationLabels labels) {
  Combination c;
  c.limit_state = state;
  const bool labelled = labels == CombinationLabels::all || state == LimitState::uls;
  if (labelled) c.label = clause + ": ";
  bool first = true;
  for (const auto& t : terms) {
    if (!labelled) break;
    c.label += (first ? "" : " + ") + (t.factor == 1.0 && state != LimitState::uls && state != LimitState::equilibrium
                                           ? std::string()
                                           : num(t.factor) + " ") +
               name_of(t.symbol);
    first = false;
  }
  c.factors.resize(actions.size());
  for (std::size_t i = 0; i < actions.size(); ++i)
    for (const auto& t : terms)
      if (symbol_of(actions[i]) == t.symbol)
        c.factors[i] = {t.factor, t.symbol == Symbol::D ? t.factor : 0.0};
  return c;
}

}  // namespace

std::vector<Combination> aci_combinations(const std::vector<Action>& actions, CombinationLabels labels) {
  bool has[4] = {false, false, false, false};
  for (const auto& a : actions) has[static_cast<int>(symbol_of(a))] = true;
  const bool L = has[1];
  std::vector<Symbol> others;  // Lr, S: each in turn
  for (Symbol s : {Symbol::Lr, Symbol::S})
    if (has[static_cast<int>(s)]) others.push_back(s);
  std::vector<Combination> out;
  for (const LimitState state : {LimitState::uls, LimitState::equilibrium}) {
    const std::string tag = state == LimitState::equilibrium ? " (equilibrium)" : "";
    out.push_back(combination_of("5.3.1a" + tag, state, {{Symbol::D, factor_D_a}}, actions, labels));
    if (L) {
      if (others.empty())
        out.push_back(combination_of("5.3.1b" + tag, state, {{Symbol::D, factor_D}, {Symbol::L, factor_L_b}}, actions, labels));
      for (Symbol x : others)
        out.push_back(combination_of("5.3.1b" + tag, state,
                                     {{Symbol::D, factor_D}, {Symbol::L, factor_L_b}, {x, factor_roof_or_snow_b}},
                                     actions, labels));
    }
    for (Symbol x : others) {
      std::vector<Term> t{{Symbol::D, factor_D}, {x, factor_roof_or_snow_c}};
      if (L) t.push_back({Symbol::L, factor_L_c});
      out.push_back(combination_of("5.3.1c" + tag, state, t, actions, labels));
    }
  }
  // Service loads (unfactored; listed, not used by a design yet) and the
  // sustained load.
  if (labels == CombinationLabels::all) {
    if (others.empty())
      out.push_back(
          combination_of("service", LimitState::characteristic, {{Symbol::D, 1.0}, {Symbol::L, 1.0}}, actions, labels));
    for (Symbol x : others)
      out.push_back(combination_of("service", LimitState::characteristic,
                                   {{Symbol::D, 1.0}, {Symbol::L, 1.0}, {x, 1.0}}, actions, labels));
  }
  out.push_back(combination_of("sustained", LimitState::quasi_permanent, {{Symbol::D, 1.0}}, actions, labels));
  return out;
}

}  // namespace armature::aci318
