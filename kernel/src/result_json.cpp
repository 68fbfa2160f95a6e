// The result of contract.md from a DesignRecord. Units convert here.
#include "armature/json_io.hpp"

namespace armature {

using nlohmann::json;

namespace {
constexpr double kPa_per_MPa = 1000.0;
constexpr double kNm_per_Nmm = 1e-6;
constexpr double kN_per_N = 1e-3;
constexpr double m_per_mm = 1e-3;

json bars_to_json(const BarChoice& b) {
  return json{{"bar", b.bar},
              {"diameter_mm", b.diameter_mm},
              {"spacing_mm", b.spacing_mm},
              {"As_prov_mm2", b.As_prov_mm2}};
}

json checks_to_json(const std::vector<Check>& checks, bool with_steps) {
  json a = json::array();
  for (const auto& c : checks) a.push_back(check_to_json(c, with_steps));
  return a;
}
}  // namespace

json check_to_json(const Check& c, bool with_steps) {
  json j{{"id", c.id},         {"where", c.where},       {"clause", c.clause},
         {"demand", c.demand}, {"capacity", c.capacity}, {"unit", c.unit},
         {"utilisation", c.utilisation}, {"pass", c.pass}};
  if (with_steps) {
    json steps = json::array();
    for (const auto& s : c.steps)
      steps.push_back({{"symbol", s.symbol},
                       {"expression", s.expression},
                       {"substituted", s.substituted},
                       {"result", s.result},
                       {"unit", s.unit},
                       {"clause", s.clause}});
    j["steps"] = std::move(steps);
  }
  return j;
}

json result_to_json(const DesignRecord& r, bool with_steps) {
  json j;
  j["code"] = r.code.id;
  j["variant"] = r.code.variant;
  j["armature_version"] = version_string();
  j["status"] = r.pass ? "pass" : "fail";
  j["max_utilisation"] = r.max_utilisation;
  j["governing"] = {{"check", r.governing_check}, {"where", r.governing_where}};
  j["loads"] = {{"self_weight_kPa", r.loads.self_weight * kPa_per_MPa},
                {"uls_kPa", r.loads.uls * kPa_per_MPa},
                {"sls_quasi_permanent_kPa", r.loads.sls_quasi_permanent * kPa_per_MPa},
                {"combination", r.loads.combination}};
  j["cover_mm"] = r.cover_mm;
  json regions = json::array();
  for (const auto& g : r.regions)
    regions.push_back({{"where", g.where},
                       {"face", to_string(g.face)},
                       {"x_m", g.x_mm * m_per_mm},
                       {"design_moment_kNm", g.M_Ed * kNm_per_Nmm},
                       {"effective_depth_mm", g.d_mm},
                       {"As_req_mm2", g.As_req_mm2},
                       {"As_min_mm2", g.As_min_mm2},
                       {"As_max_mm2", g.As_max_mm2},
                       {"bars", bars_to_json(g.bars)},
                       {"checks", checks_to_json(g.checks, with_steps)}});
  j["regions"] = std::move(regions);
  json supports = json::array();
  for (const auto& s : r.supports)
    supports.push_back({{"where", s.where},
                        {"design_shear_kN", s.V_Ed * kN_per_N},
                        {"shear_resistance_kN", s.V_Rd * kN_per_N},
                        {"checks", checks_to_json(s.checks, with_steps)}});
  j["supports"] = std::move(supports);
  json spans = json::array();
  for (const auto& s : r.spans)
    spans.push_back({{"where", s.where}, {"checks", checks_to_json(s.checks, with_steps)}});
  j["spans"] = std::move(spans);
  json dist = bars_to_json(r.distribution.bars);
  dist["As_req_mm2"] = r.distribution.As_req_mm2;
  j["distribution"] = std::move(dist);
  json all = json::array();
  for (const Check* c : r.all_checks()) all.push_back(check_to_json(*c, with_steps));
  j["checks"] = std::move(all);
  j["warnings"] = r.warnings;
  j["caution"] = caution_text;
  return j;
}

}  // namespace armature
