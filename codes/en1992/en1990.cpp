// Combinations of actions, EN 1990 Annex A1.
#include "en1990.hpp"

#include <string_view>

#include "armature/steps.hpp"
#include "ndp.hpp"

namespace armature::en1992 {
namespace {

std::string num(double v) { return step_number(v); }

bool is_roof_imposed(const Action& a) { return is_variable(a.kind) && a.category == "H"; }

// The groups that lead in turn: the imposed actions together, snow.
enum class Group { none, imposed, snow };
Group group_of(const Action& a) {
  if (!is_variable(a.kind)) return Group::none;
  return a.kind == ActionKind::snow ? Group::snow : Group::imposed;
}
const char* group_name(Group g) { return g == Group::snow ? "snow" : "imposed"; }

// One way of combining: the variable actions that may act together, and
// the group leading (none when no variable action acts).
struct Choice {
  std::vector<bool> acts;
  Group leading = Group::none;
};

std::vector<Choice> choices_of(const std::vector<Action>& actions) {
  bool roof = false, snow = false;
  for (const auto& a : actions) {
    roof = roof || is_roof_imposed(a);
    snow = snow || a.kind == ActionKind::snow;
  }
  std::vector<std::vector<bool>> sets;
  auto set_without = [&](auto excluded) {
    std::vector<bool> s(actions.size());
    for (std::size_t i = 0; i < actions.size(); ++i) s[i] = is_variable(actions[i].kind) && !excluded(actions[i]);
    return s;
  };
  if (roof && snow) {  // EN 1991-1-1 3.3.2(1): roof imposed loads or snow, not both
    sets.push_back(set_without([](const Action& a) { return a.kind == ActionKind::snow; }));
    sets.push_back(set_without(is_roof_imposed));
  } else {
    sets.push_back(set_without([](const Action&) { return false; }));
  }
  std::vector<Choice> out;
  for (const auto& s : sets) {
    bool any = false;
    for (Group g : {Group::imposed, Group::snow}) {
      bool present = false;
      for (std::size_t i = 0; i < actions.size(); ++i) present = present || (s[i] && group_of(actions[i]) == g);
      if (present) out.push_back({s, g});
      any = any || present;
    }
    if (!any) out.push_back({s, Group::none});
  }
  return out;
}

std::size_t variable_count(const std::vector<Action>& actions) {
  std::size_t k = 0;
  for (const auto& a : actions) k += is_variable(a.kind) ? 1 : 0;
  return k;
}

// "1.35 Gk + 1.5 Qk" with one variable action; "1.35 Gk + 1.5 office +
// 0.75 snow" with several (each by name, those acting).
// ULS labels print every factor of a single variable action, 0 and 1
// included (as version 1 did).
// A factor as the labels print it: γG, γQ and ξ γG from those written
// once, any other (ψ0 γQ, ...) now.
std::string factor_text(const En1990Factors& f, double v) {
  for (const auto& [value, text] : f.printed)
    if (value == v) return text;
  return num(v);
}

std::string terms(const En1990Factors& f, const std::string& permanent, const std::vector<Action>& actions,
                  const std::vector<ActionFactor>& factors, bool every_factor = false) {
  std::string s;
  s.reserve(64);
  s += permanent;
  const bool one = variable_count(actions) == 1;
  for (std::size_t i = 0; i < actions.size(); ++i) {
    if (!is_variable(actions[i].kind)) continue;
    if (factors[i].loaded == 0.0 && !(one && every_factor)) continue;
    s += " + ";
    if (factors[i].loaded != 1.0 || (one && every_factor)) s.append(factor_text(f, factors[i].loaded)).append(" ");
    s += one ? std::string_view("Qk") : std::string_view(actions[i].name);
  }
  return s;
}

std::string leading_note(const std::vector<Action>& actions, const Choice& c) {
  std::size_t groups = 0;
  for (Group g : {Group::imposed, Group::snow})
    for (const auto& a : actions)
      if (group_of(a) == g) {
        ++groups;
        break;
      }
  if (groups < 2 && variable_count(actions) < 2) return {};
  return c.leading == Group::none ? std::string() : std::string(", leading ") + group_name(c.leading);
}

}  // namespace

En1990Factors en1990_factors(const Ndp& ndp) {
  En1990Factors f;
  f.gamma_G = ndp.gamma_G;
  f.gamma_Q = ndp.gamma_Q;
  f.xi = ndp.xi;
  f.gamma_G_sup_equ = ndp.equ_gamma_G_sup;
  f.gamma_G_inf_equ = ndp.equ_gamma_G_inf;
  f.gamma_Q_equ = ndp.equ_gamma_Q;
  f.psi_imposed = ndp.psi;
  f.psi_snow = ndp.psi_snow;
  f.variant = ndp.variant;
  f.printed = {{{f.gamma_G, num(f.gamma_G)}, {f.gamma_Q, num(f.gamma_Q)}, {f.xi * f.gamma_G, num(f.xi * f.gamma_G)}}};
  return f;
}

PsiFactors psi_of_action(const En1990Factors& f, const Action& a) {
  if (a.kind == ActionKind::snow) return f.psi_snow;
  if (!is_variable(a.kind)) return {0.0, 0.0, 0.0};
  const auto i = imposed_load_category_index(a.kind == ActionKind::roof ? std::string("H") : a.category);
  return i ? f.psi_imposed[*i] : PsiFactors{0.0, 0.0, 0.0};
}

std::vector<Combination> en1990_combinations(const En1990Factors& f, bool six_ten_ab,
                                             const std::vector<Action>& actions, CombinationLabels labels) {
  const auto choices = choices_of(actions);
  const std::size_t n = actions.size();
  // The single variable action, for the labels of 6.10a.
  const Action* single = nullptr;
  if (variable_count(actions) == 1)
    for (const auto& a : actions)
      if (is_variable(a.kind)) single = &a;
  std::vector<Combination> out;
  out.reserve(7 * choices.size());  // 6.10 (or 6.10a and b), SLS ×3, EQU per choice
  // Keeps a combination unless one of the same limit state has the same
  // factors; returns it when it is to be labelled (kept, and its label
  // asked for: the label is the costly part).
  auto add = [&](Combination c) -> Combination* {
    for (const auto& o : out) {
      if (o.limit_state != c.limit_state) continue;
      bool same = true;
      for (std::size_t i = 0; i < n && same; ++i)
        same = o.factors[i].loaded == c.factors[i].loaded && o.factors[i].unloaded == c.factors[i].unloaded;
      if (same) return nullptr;
    }
    out.push_back(std::move(c));
    Combination* kept = &out.back();
    return labels == CombinationLabels::all || kept->limit_state == LimitState::uls ? kept : nullptr;
  };
  // Factors of one choice: permanent (loaded, unloaded), the leading
  // group's factor, and the accompanying factor of each other action.
  std::vector<PsiFactors> psi_of(n);
  for (std::size_t i = 0; i < n; ++i) psi_of[i] = psi_of_action(f, actions[i]);
  auto make = [&](LimitState state, const Choice& c, double g_loaded, double g_unloaded, auto lead, auto accompany) {
    Combination k;
    k.limit_state = state;
    k.factors.resize(n);
    for (std::size_t i = 0; i < n; ++i) {
      const Action& a = actions[i];
      const PsiFactors psi = psi_of[i];
      if (!is_variable(a.kind)) k.factors[i] = {g_loaded, g_unloaded};
      else if (!c.acts[i]) k.factors[i] = {0.0, 0.0};
      else if (group_of(a) == c.leading) k.factors[i] = {lead(psi), 0.0};
      else k.factors[i] = {accompany(psi), 0.0};
    }
    return k;
  };
  const double gG = f.gamma_G, gQ = f.gamma_Q;
  for (const auto& c : choices) {
    const std::string note = leading_note(actions, c);
    if (!six_ten_ab) {  // (6.10)
      Combination k = make(LimitState::uls, c, gG, gG, [&](PsiFactors) { return gQ; },
                           [&](PsiFactors p) { return gQ * p.psi0; });
      if (Combination* kept = add(std::move(k))) kept->label = "6.10" + note + ": " + terms(f, factor_text(f, gG) + " Gk", actions, kept->factors, true);
    }
  }
  if (six_ten_ab) {
    for (const auto& c : choices) {  // (6.10a): every variable action with ψ0
      Combination k = make(LimitState::uls, c, gG, gG, [&](PsiFactors p) { return gQ * p.psi0; },
                           [&](PsiFactors p) { return gQ * p.psi0; });
      Combination* kept = add(std::move(k));
      if (!kept) continue;  // a duplicate
      kept->label = "6.10a: " + terms(f, factor_text(f, gG) + " Gk", actions, kept->factors, true);
      if (single)
        kept->label += " (ψ0 = " + num(psi_of_action(f, *single).psi0) + " for " +
                       (single->kind == ActionKind::snow ? std::string("snow") : "category " + single->category) +
                       ", " + f.variant + " variant NDP)";
      else
        kept->label += " (ψ0 by action, " + f.variant + " variant NDP)";
    }
    for (const auto& c : choices) {  // (6.10b): ξ γG, one leading action
      const double gGb = f.xi * gG;
      Combination k = make(LimitState::uls, c, gGb, gGb, [&](PsiFactors) { return gQ; },
                           [&](PsiFactors p) { return gQ * p.psi0; });
      if (Combination* kept = add(std::move(k))) kept->label = "6.10b" + leading_note(actions, c) + ": " + terms(f, factor_text(f, gGb) + " Gk", actions, kept->factors, true) +
                " (ξ = " + num(f.xi) + ", " + f.variant + " variant NDP)";
    }
  }
  const bool serviceability = labels == CombinationLabels::all;  // characteristic and frequent
  for (const auto& c : choices) {  // (6.14b)
    if (!serviceability) break;
    Combination k = make(LimitState::characteristic, c, 1.0, 1.0, [](PsiFactors) { return 1.0; },
                         [](PsiFactors p) { return p.psi0; });
    if (Combination* kept = add(std::move(k))) kept->label = "characteristic" + leading_note(actions, c) + ": " + terms(f, "Gk", actions, kept->factors);
  }
  for (const auto& c : choices) {  // (6.15b)
    if (!serviceability) break;
    Combination k = make(LimitState::frequent, c, 1.0, 1.0, [](PsiFactors p) { return p.psi1; },
                         [](PsiFactors p) { return p.psi2; });
    if (Combination* kept = add(std::move(k))) kept->label = "frequent" + leading_note(actions, c) + ": " + terms(f, "Gk", actions, kept->factors);
  }
  for (const auto& c : choices) {  // (6.16b): no leading action
    Combination k = make(LimitState::quasi_permanent, c, 1.0, 1.0, [](PsiFactors p) { return p.psi2; },
                         [](PsiFactors p) { return p.psi2; });
    if (Combination* kept = add(std::move(k))) kept->label = "quasi-permanent: " + terms(f, "Gk", actions, kept->factors);
  }
  for (const auto& c : choices) {  // Table A1.2(A)
    Combination k = make(LimitState::equilibrium, c, f.gamma_G_sup_equ, f.gamma_G_inf_equ,
                         [&](PsiFactors) { return f.gamma_Q_equ; },
                         [&](PsiFactors p) { return f.gamma_Q_equ * p.psi0; });
    if (Combination* kept = add(std::move(k))) kept->label = "EQU" + leading_note(actions, c) + ": " +
              terms(f, num(f.gamma_G_sup_equ) + " Gk,sup + " + num(f.gamma_G_inf_equ) + " Gk,inf", actions,
                    kept->factors);
  }
  return out;
}

}  // namespace armature::en1992
