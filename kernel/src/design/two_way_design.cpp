// The design of a two-way slab: the code's combinations and bay load
// arrangements, the plate member (members/two_way.cpp), the bar search of
// each region with its own effective depth (the inner layer's from the
// outer layer's bars), and the code's checks of the chosen arrangements.
#include "two_way_design.hpp"

#include <algorithm>
#include <cmath>

#include "armature/two_way.hpp"
#include "call_code.hpp"
#include "loads.hpp"
#include "search.hpp"

namespace armature {

namespace {

// The U-bars along each free outer edge, bay by bay (FreeEdgeRule): the
// bay's bottom bars across the edge bent into a U whose top leg runs
// leg × h into the slab, and the bay's bottom bars along the edge in each
// face inside the U (EN 1992-1-1 9.3.1.4(2): the slab's own bars serve).
std::vector<PlateFreeEdgeRecord> free_edge_bars(const PlateRecord& p, const std::vector<RegionRecord>& regions,
                                                const Request& req, const FreeEdgeRule& rule) {
  std::vector<PlateFreeEdgeRecord> out;
  const std::size_t nx = p.x_lines_mm.size() - 1, ny = p.y_lines_mm.size() - 1;
  const char* names[4] = {"edge x0", "edge x1", "edge y0", "edge y1"};
  for (std::size_t e = 0; e < 4; ++e) {
    if (p.edges[e] != EndSupport::free) continue;
    const bool along_y = e < 2;  // x0, x1 run along y
    const std::size_t count = along_y ? ny : nx;
    for (std::size_t k = 0; k < count; ++k) {
      const std::size_t i = along_y ? (e == 0 ? 0 : nx - 1) : k;
      const std::size_t j = along_y ? k : (e == 2 ? 0 : ny - 1);
      PlateFreeEdgeRecord f;
      f.edge = names[e];
      f.bay = plate_bay_name(i, j);
      f.from_mm = along_y ? p.y_lines_mm[j] : p.x_lines_mm[i];
      f.to_mm = along_y ? p.y_lines_mm[j + 1] : p.x_lines_mm[i + 1];
      f.leg_mm = rule.u_bar_leg_over_h * req.slab.thickness_mm;
      f.clause = rule.clause;
      for (const auto& g : regions) {
        if (g.where != f.bay || g.face != Face::bottom) continue;
        const bool across = (g.direction == BarDirection::x) == along_y;
        if (across) {
          f.u_bar = g.bars.bar;
          f.u_bar_diameter_mm = g.bars.diameter_mm;
          f.u_bar_spacing_mm = g.bars.spacing_mm;
          f.u_bar_area_mm2 = g.bars.As_prov_mm2;
        } else {
          f.edge_bar = g.bars.bar;
          f.edge_bar_diameter_mm = g.bars.diameter_mm;
        }
      }
      out.push_back(std::move(f));
    }
  }
  return out;
}

PlateGeometry checked_geometry(const Request& req) {
  PlateGeometry g;
  g.x_spans_mm = req.two_way.x_spans_mm;
  g.y_spans_mm = req.two_way.y_spans_mm;
  g.edges = {req.two_way.edges[0], req.two_way.edges[1], req.two_way.edges[2], req.two_way.edges[3]};
  g.thickness_mm = req.slab.thickness_mm;
  g.elastic_modulus_MPa = two_way_nominal_modulus_MPa;
  g.poisson_ratio = req.two_way.poisson_ratio;
  if (req.two_way.mesh_per_bay > 0) g.mesh_per_bay = req.two_way.mesh_per_bay;
  return g;
}

}  // namespace

void add_two_way_problems(const Request& req, InputProblems& problems) {
  add_plate_problems(checked_geometry(req), problems);
  double X = 0.0, Y = 0.0;
  for (double s : req.two_way.x_spans_mm) X += s;
  for (double s : req.two_way.y_spans_mm) Y += s;
  for (std::size_t i = 0; i < req.loads.actions.size(); ++i) {
    const Action& a = req.loads.actions[i];
    const std::string path = a.field.empty() ? "loads.actions[" + std::to_string(i) + "]" : a.field;
    if (a.span) problems.add(path + ".span", "belongs to one-way slabs; a two_way slab places loads by plan position");
    if (a.distribution != Distribution::uniform && !a.plan_mm)
      problems.add(path, "a line or point load on a two_way slab needs its plan position");
    if (!a.plan_mm) continue;
    const auto& p = *a.plan_mm;
    const bool finite = std::all_of(p.begin(), p.end(), [](double v) { return std::isfinite(v); });
    if (!finite || p[0] < 0.0 || p[1] < 0.0 || p[2] > X * (1 + 1e-12) || p[3] > Y * (1 + 1e-12) || p[0] > p[2] ||
        p[1] > p[3])
      problems.add(path + (a.distribution == Distribution::point ? ".x_m" : ".from_m"),
                   "must lie on the slab (x from 0 to Σ x_spans, y from 0 to Σ y_spans)");
  }
}

DesignRecord design_two_way(const SlabChecker& checker, CodeIdentity id, const Request& req, Detail detail) {
  if (detail == Detail::verdict) detail = Detail::checks;
  DesignRecord rec;
  rec.code = std::move(id);
  rec.report_units = req.report_units;
  rec.strip_width_mm = 1000.0;
  const double b = rec.strip_width_mm;
  const LoadBasis basis = call_code(rec.code, "load basis", [&] { return checker.load_basis(); });
  const CombinationRules& combination_rules = call_code(
      rec.code, "combination rules", [&]() -> const CombinationRules& { return checker.combination_rules(); });
  const MemberRules& member_rules =
      call_code(rec.code, "member rules", [&]() -> const MemberRules& { return checker.member_rules(); });
  rec.actions = all_actions(req, basis.density_kN_m3);
  rec.list_actions = req.loads.actions_given;
  const CombinationLabels labels =
      rec.list_actions || detail == Detail::steps ? CombinationLabels::all : CombinationLabels::strength;
  rec.combinations =
      call_code(rec.code, "combinations", [&] { return combination_rules.combinations(rec.actions, labels); });
  for (const auto& c : rec.combinations)
    if (c.factors.size() != rec.actions.size())
      throw DesignError(rec.code.id + ": combination '" + c.label + "' does not give a factor for every action");
  if (std::none_of(rec.combinations.begin(), rec.combinations.end(),
                   [](const Combination& c) { return c.limit_state == LimitState::uls; }))
    throw DesignError(rec.code.id + ": the code gave no ULS combination");
  rec.loads = total_loads(basis, rec.actions, rec.combinations);
  if (detail == Detail::steps) rec.defaults_used = call_code(rec.code, "defaults", [&] { return checker.defaults_used(); });

  TwoWayPlate plate(req, two_way_nominal_modulus_MPa);
  const std::size_t nx = plate.bays_x(), ny = plate.bays_y();
  const auto arrangements = call_code(rec.code, "bay load arrangements",
                                      [&] { return combination_rules.bay_load_arrangements(nx, ny, rec.actions); });
  if (arrangements.empty())
    throw DesignError(rec.code.id + " (" + rec.code.variant + "): the code gives no load arrangements for two-way slabs");
  for (const auto& a : arrangements)
    if (a.loaded.size() != nx * ny || !(a.variable_fraction >= 0.0 && a.variable_fraction <= 1.0))
      throw DesignError(rec.code.id + ": a bay load arrangement does not match the bays");
  const double ratio = rec.loads.uls > 0.0 ? rec.loads.sls_quasi_permanent / rec.loads.uls : 0.0;
  rec.load_cases = plate.analyse(rec.actions, rec.combinations, arrangements, ratio);
  rec.load_arrangements = arrangements.size();
  rec.crack_width = req.serviceability.crack_width;
  rec.project = req.project;
  rec.thickness_mm = req.slab.thickness_mm;
  rec.rationalise = req.reinforcement.rationalise;

  const double fraction = call_code(rec.code, "end fixity", [&] { return member_rules.pinned_end_fixity_fraction(); });
  const CornerRule corners = call_code(rec.code, "corner rule", [&] { return member_rules.corner_rule(); });
  auto demands = plate.design_regions(fraction, corners, rec.warnings);

  // Bars: search every region; a face's inner direction lies on the
  // largest bar of its outer direction, so search again until the two agree.
  BarPlan plan;
  plan.grid = {req.reinforcement.min_spacing_mm, req.reinforcement.spacing_step_mm};
  plan.given.resize(demands.size());
  // Check mode: reinforcement.given by region, face and direction.
  InputProblems given_problems;
  for (std::size_t k = 0; k < req.reinforcement.given.size(); ++k) {
    const GivenBars& gb = req.reinforcement.given[k];
    const std::string path = "reinforcement.given[" + std::to_string(k) + "]";
    std::size_t found = demands.size();
    for (std::size_t i = 0; i < demands.size(); ++i)
      if (demands[i].where == gb.where && to_string(demands[i].direction) == gb.direction) found = i;
    if (found == demands.size()) {
      const bool named = std::any_of(demands.begin(), demands.end(), [&](const RegionDemand& d) { return d.where == gb.where; });
      if (named) given_problems.add(path + ".direction", "'" + gb.where + "' has no region with bars in " + gb.direction);
      else
        given_problems.add(path + ".where", "no region '" + gb.where + "' in this slab; its regions are the bays "
                                            "('bay 1,1', ...), the supported line segments ('edge x0 segment 1', "
                                            "'grid x1 segment 2', ...) and, where two pinned edges meet, the "
                                            "corners ('corner x0 y0', ...)");
      continue;
    }
    if (demands[found].face != gb.face) {
      given_problems.add(path + ".face", "'" + gb.where + "' is a " + to_string(demands[found].face) + " region; got " +
                                             to_string(gb.face));
      continue;
    }
    if (plan.given[found]) {
      given_problems.add(path, "'" + gb.where + "' bars in " + gb.direction + " are already given");
      continue;
    }
    const auto bar = call_code(rec.code, "catalogue bar", [&] { return checker.catalogue_bar(gb.bar); });
    if (!bar) {
      given_problems.add(path + ".bar", "no bar '" + gb.bar + "' in the code's catalogue");
      continue;
    }
    plan.given[found] = SearchCandidate{*bar, gb.spacing_mm, provided_area_mm2(bar->area_mm2, gb.spacing_mm, b)};
  }
  given_problems.raise_if_any();
  if (req.reinforcement.rationalise == Rationalise::uniform_bottom) add_uniform_bottom_groups(demands, plan);
  const auto& options = call_code(rec.code, "bar options",
                                  [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  double smallest = options.empty() ? 0.0 : options.front().diameter_mm;
  for (const auto& o : options) smallest = std::min(smallest, o.diameter_mm);
  auto inner = [&](const RegionDemand& g) { return g.direction != plate.outer_direction(g.face); };
  for (auto& g : demands)
    if (inner(g)) g.outer_bar_mm = smallest;
  std::vector<SearchCandidate> picks;
  std::vector<std::string> search_warnings;
  for (std::size_t round = 0; round <= options.size() + 1; ++round) {
    search_warnings.clear();
    picks = search_with_face_covers(checker, rec.code, demands, b, req.durability, plan, search_warnings);
    bool changed = false;
    for (const Face face : {Face::bottom, Face::top}) {
      double largest = 0.0;
      for (std::size_t i = 0; i < demands.size(); ++i)
        if (demands[i].face == face && !inner(demands[i])) largest = std::max(largest, picks[i].bar.diameter_mm);
      if (largest <= 0.0) continue;
      for (auto& g : demands)
        if (g.face == face && inner(g) && g.outer_bar_mm < largest) {
          g.outer_bar_mm = largest;
          changed = true;
        }
    }
    if (!changed) break;
  }
  rec.warnings.insert(rec.warnings.end(), search_warnings.begin(), search_warnings.end());

  rec.regions.reserve(demands.size());
  std::vector<SpanRecord> spans;
  for (std::size_t i = 0; i < demands.size(); ++i) {
    const RegionDemand& demand = demands[i];
    const SearchCandidate& pick = picks[i];
    RegionOutcome out = call_code(
        rec.code, "the checks", [&] { return checker.check_region(demand, pick.bar, pick.spacing_mm, detail); },
        demand.where);
    rec.regions.push_back(region_record(demand, pick, out, plan.given[i].has_value()));
    if (!demand.span_where.empty()) spans.push_back({demand.span_where, std::move(out.span_checks)});
    for (auto& s : out.supports) rec.supports.push_back({s.where, s.V_Ed, s.V_Rd, std::move(s.checks)});
  }
  for (auto& s : spans) {
    auto extra = call_code(rec.code, "span checks", [&] { return member_rules.span_checks(s.where); });
    for (auto& c : extra) s.checks.push_back(std::move(c));
    rec.spans.push_back(std::move(s));
  }
  for (const auto& r : rec.regions) {
    double& c = rec.face_cover_mm[static_cast<std::size_t>(r.face)];
    c = std::max(c, r.cover_mm);
  }
  PlateRecord plate_record = plate.record();
  const FreeEdgeRule free_rule = call_code(rec.code, "free-edge rule", [&] { return member_rules.free_edge_rule(); });
  if (!free_rule.clause.empty()) plate_record.free_edges = free_edge_bars(plate_record, rec.regions, req, free_rule);
  rec.plate = std::make_shared<const PlateRecord>(std::move(plate_record));

  settle_verdict(rec, true);
  auto code_warnings = call_code(rec.code, "warnings", [&] { return checker.warnings(); });
  rec.warnings.insert(rec.warnings.begin(), code_warnings.begin(), code_warnings.end());
  return rec;
}

}  // namespace armature
