// Actions of a request: names of kinds and distributions, and the list the
// combinations refer to (self-weight, shorthands, the request's actions).
#include "armature/actions.hpp"

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
