// Actions of a request: names of kinds and distributions, and the list the
// combinations refer to (self-weight, shorthands, the request's actions).
#include "armature/actions.hpp"

#include <cmath>
#include <string>

#include "armature/combinations.hpp"
#include "armature/request.hpp"

namespace armature {

const char* to_string(ActionKind kind) {
  switch (kind) {
    case ActionKind::permanent: return "permanent";
    case ActionKind::imposed: return "imposed";
    case ActionKind::snow: return "snow";
    case ActionKind::roof: return "roof";
  }
  return "";
}

const char* to_string(Distribution distribution) {
  switch (distribution) {
    case Distribution::uniform: return "uniform";
    case Distribution::line: return "line";
    case Distribution::point: return "point";
  }
  return "";
}

const char* to_string(LimitState state) {
  switch (state) {
    case LimitState::uls: return "ULS";
    case LimitState::characteristic: return "SLS characteristic";
    case LimitState::frequent: return "SLS frequent";
    case LimitState::quasi_permanent: return "SLS quasi-permanent";
    case LimitState::equilibrium: return "EQU";
  }
  return "";
}

std::vector<Action> all_actions(const Request& req, double density_kN_m3) {
  std::vector<Action> out;
  out.reserve(req.loads.actions.size() + 3);
  Action sw;
  sw.name = self_weight_action_name;
  sw.kind = ActionKind::permanent;
  // density kN/m³ = 1e-6 N/mm³; times h in mm gives N/mm².
  sw.value = density_kN_m3 * 1e-6 * req.slab.thickness_mm;
  sw.source = ActionSource::self_weight;
  out.push_back(sw);
  if (req.loads.dead_MPa > 0.0) {
    Action g;
    g.name = dead_shorthand_action_name;
    g.kind = ActionKind::permanent;
    g.value = req.loads.dead_MPa;
    g.source = ActionSource::shorthand;
    g.field = "loads.dead_kPa";
    out.push_back(g);
  }
  if (req.loads.imposed_MPa > 0.0) {
    Action q;
    q.name = imposed_shorthand_action_name;
    q.kind = ActionKind::imposed;
    q.category = req.loads.imposed_category;
    q.value = req.loads.imposed_MPa;
    q.source = ActionSource::shorthand;
    q.field = "loads.imposed_kPa";
    out.push_back(q);
  }
  for (const auto& a : req.loads.actions) out.push_back(a);
  return out;
}

}  // namespace armature

namespace armature {

void add_action_problems(const Request& req, InputProblems& problems) {
  const std::vector<double>& spans = req.slab.spans_mm;
  for (std::size_t i = 0; i < req.loads.actions.size(); ++i) {
    const Action& a = req.loads.actions[i];
    const std::string at = "loads.actions[" + std::to_string(i) + "]";
    if (a.name.empty()) problems.add(at + ".name", "must be a non-empty name");
    if (!std::isfinite(a.value) || a.value < 0.0)
      problems.add(at, "its value must be a finite number of 0 or more");
    if (a.kind == ActionKind::imposed &&
        (a.category.size() != 1 || a.category[0] < 'A' || a.category[0] > 'H'))
      problems.add(at + ".category", "must be one of A to H (EN 1990 Table A1.1), got '" + a.category + "'");
    if (!a.span) {
      if (a.distribution != Distribution::uniform)
        problems.add(at + ".span", "a line or point load needs the span it is in");
      continue;
    }
    if (*a.span >= spans.size()) {
      problems.add(at + ".span", "must be 1 to " + std::to_string(spans.size()) + " (1-based), got " +
                                     std::to_string(*a.span + 1));
      continue;
    }
    const double L = spans[*a.span];
    auto within = [&](double x) { return std::isfinite(x) && x >= 0.0 && x <= L; };
    if (a.distribution == Distribution::uniform) {
      const double from = a.from_mm.value_or(0.0), to = a.to_mm.value_or(L);
      if (!within(from)) problems.add(at + ".from_m", "must lie within the span");
      if (!within(to)) problems.add(at + ".to_m", "must lie within the span");
      if (within(from) && within(to) && !(from < to)) problems.add(at + ".to_m", "must be beyond from_m");
    } else if (!within(a.at_mm)) {
      problems.add(at + ".at_m", "must lie within the span");
    }
    if (a.distribution == Distribution::point &&
        !(std::isfinite(a.effective_width_mm) && a.effective_width_mm > 0.0))
      problems.add(at + ".effective_width_m", "must be a finite width greater than 0");
  }
}

}  // namespace armature
