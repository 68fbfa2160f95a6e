// The two-way slab member: requests, patterns, regions and their effective
// depths, through the registry and both code plug-ins. Our own scenarios:
// floors of the community workshop building.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "request_problems.hpp"
#include "armature/summary.hpp"
#include "armature/two_way.hpp"

using nlohmann::json;
using namespace armature;

namespace {
Registry& registry() { return testing::build_registry(); }

json two_way_request(const std::string& code, const std::string& variant, json x_spans, json y_spans,
                     json edges = json::object()) {
  json slab = {{"type", "two_way"}, {"x_spans_m", x_spans}, {"y_spans_m", y_spans}, {"thickness_mm", 200}};
  if (!edges.empty()) slab["edges"] = edges;
  json r = {{"code", code},
            {"variant", variant},
            {"slab", slab},
            {"loads", {{"dead_kPa", 1.5}, {"imposed_kPa", 3.0}, {"imposed_category", "C"}}},
            {"durability", {{"cover_mm", 25}}}};
  r["concrete"] = code == "EN1992-1-1" ? json{{"class", "C30/37"}} : json{{"cylinder_strength_MPa", 28}};
  return r;
}

const RegionRecord& region(const DesignRecord& r, const std::string& where, BarDirection d) {
  for (const auto& g : r.regions)
    if (g.where == where && g.direction == d) return g;
  throw std::runtime_error("no region " + where + " " + to_string(d));
}

std::vector<std::string> problem_fields(const json& request) { return testing::problem_fields(registry(), request); }
using testing::has_problem;

Action action(const char* name, ActionKind kind, const char* category, Distribution d, double value) {
  Action a;
  a.name = name;
  a.kind = kind;
  a.category = category;
  a.distribution = d;
  a.value = value;
  return a;
}

struct CodeCase {
  const char* code;
  const char* variant;
};
const CodeCase both_codes[] = {{"EN1992-1-1", "UK"}, {"ACI318-19", "SI"}};
}  // namespace

// A single bay ly/lx = 4, every edge pinned, against the one-way strip of
// the short span: the plate's centre moment tends to the strip's q l²/8 as
// ly/lx grows. At ly/lx = 4 the series solution gives 0.1235 q a² against
// 0.125 (Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells,
// Table 8, ν = 0.3; value from memory), about 1 % less; at ν = 0.2 the
// Wood–Armer peak (mx + |mxy|, largest a little off the centre line) stays
// within 3 % below the strip, which is the tolerance taken.
TEST_CASE("Two-way: a bay of ly/lx = 4 approaches the one-way strip of its short span") {
  for (const auto& cc : both_codes) {
    const json plate_req = two_way_request(cc.code, cc.variant, {3.0}, {12.0});
    json strip_req = plate_req;
    strip_req["slab"] = {{"spans_m", {3.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 200}};
    const DesignRecord plate = design(registry(), plate_req);
    const DesignRecord strip = design(registry(), strip_req);
    double M_strip = 0.0;
    for (const auto& g : strip.regions)
      if (g.where == "span 1") M_strip = g.M_Ed;
    const double M_plate = region(plate, "bay 1,1", BarDirection::x).M_Ed;
    INFO(cc.code << ": plate " << M_plate << " strip " << M_strip);
    CHECK(M_plate <= M_strip * 1.001);
    CHECK(M_plate >= M_strip * 0.97);
    // Nearly cylindrical bending at the centre: my a little above ν mx
    // (ν = 0.2) for the bay's finite length. At b/a = 4 the series gives
    // my/mx = 0.0394/0.1235 = 0.319 at ν = 0.3, 6 % above ν (Timoshenko &
    // Woinowsky-Krieger Table 8; values from memory): between ν and 1.1 ν.
    const auto& f = plate.plate->field;
    const auto ix = static_cast<std::size_t>(std::find_if(f.x_mm.begin(), f.x_mm.end(), [](double x) {
                                               return std::abs(x - 1500.0) < 1e-6;
                                             }) - f.x_mm.begin());
    const auto iy = static_cast<std::size_t>(std::find_if(f.y_mm.begin(), f.y_mm.end(), [](double y) {
                                               return std::abs(y - 6000.0) < 1e-6;
                                             }) - f.y_mm.begin());
    REQUIRE(ix < f.x_mm.size());
    REQUIRE(iy < f.y_mm.size());
    const std::size_t n = ix + f.x_mm.size() * iy;
    CHECK(f.my_max[n] > 0.2 * f.mx_max[n]);
    CHECK(f.my_max[n] < 1.1 * 0.2 * f.mx_max[n]);
    CHECK(f.mx_max[n] * 1000.0 == Approx(M_plate).epsilon(0.01));
  }
}

// Equilibrium: the line reactions (over their tributary lengths) and the
// concentrated reactions where supported lines meet add up to the load
// (statics; the load worked out from areas, not from the elements).
TEST_CASE("Two-way: the reactions of a bay equal its load") {
  Request req;
  req.slab_type = SlabType::two_way;
  req.slab.thickness_mm = 200;
  req.two_way.x_spans_mm = {4200.0};
  req.two_way.y_spans_mm = {5400.0};
  req.two_way.edges = {EndSupport::pinned, EndSupport::fixed, EndSupport::pinned, EndSupport::pinned};
  const Action g = action("self-weight", ActionKind::permanent, "", Distribution::uniform, 5.0e-3);
  const Action q = action("imposed", ActionKind::imposed, "C", Distribution::uniform, 3.0e-3);
  Action p = action("tank", ActionKind::imposed, "E", Distribution::point, 12.0e3);
  p.plan_mm = std::array<double, 4>{1500.0, 2000.0, 1500.0, 2000.0};
  req.loads.actions = {p};
  const std::vector<Action> actions{g, q, p};
  const Combination uls{"1.35 G + 1.5 Q", LimitState::uls, {{1.35, 1.35}, {1.5, 0.0}, {1.5, 0.0}}};
  TwoWayPlate plate(req, 30000.0);
  const std::vector<BayArrangement> all{{{true}, 1.0}};
  plate.analyse(actions, {uls}, all, 0.6);
  std::vector<std::string> warnings;
  plate.design_regions(0.0, armature::CornerRule{}, warnings);
  const PlateRecord rec = plate.record();
  const PlateLoadCase lc = plate.load_case(actions, uls, all[0]);
  const double load = plate.model().load_resultant(lc).force_N;
  CHECK(load == Approx(1.35 * 5.0e-3 * 4200 * 5400 + 1.5 * 3.0e-3 * 4200 * 5400 + 1.5 * 12.0e3).epsilon(1e-9));
  double lines = 0.0;
  for (const auto& l : rec.reactions) lines += l.max_total_N;
  double points = 0.0;
  const PlateField field = plate.model().solve({lc});
  for (const auto& r : field.point_reactions(0)) points += r.force_N;
  CHECK(lines + points == Approx(load).epsilon(1e-6));
  // The fixed edge x1 carries more than the pinned edge x0 opposite.
  CHECK(rec.reactions[1].max_total_N > rec.reactions[0].max_total_N);
  CHECK(rec.reactions[0].name == "edge x0 segment 1");
  CHECK(rec.reactions[1].name == "edge x1 segment 1");
}

// A square floor of 3 × 3 equal bays with every edge pinned is symmetric
// about both centre lines and the diagonal: its regions must be too.
TEST_CASE("Two-way: a symmetric floor gives symmetric regions, both codes") {
  for (const auto& cc : both_codes) {
    const DesignRecord r = design(registry(), two_way_request(cc.code, cc.variant, {4.0, 4.0, 4.0}, {4.0, 4.0, 4.0}));
    INFO(cc.code);
    const double corner = region(r, "bay 1,1", BarDirection::x).M_Ed;
    CHECK(region(r, "bay 3,3", BarDirection::x).M_Ed == Approx(corner).epsilon(1e-6));
    CHECK(region(r, "bay 3,1", BarDirection::x).M_Ed == Approx(corner).epsilon(1e-6));
    CHECK(region(r, "bay 1,1", BarDirection::y).M_Ed == Approx(corner).epsilon(1e-6));
    CHECK(region(r, "bay 2,1", BarDirection::y).M_Ed == Approx(region(r, "bay 1,2", BarDirection::x).M_Ed).epsilon(1e-6));
    const double line = region(r, "grid x1 segment 2", BarDirection::x).M_Ed;
    CHECK(line > 0.0);
    CHECK(region(r, "grid x2 segment 2", BarDirection::x).M_Ed == Approx(line).epsilon(1e-6));
    CHECK(region(r, "grid y1 segment 2", BarDirection::y).M_Ed == Approx(line).epsilon(1e-6));
    CHECK(region(r, "grid y1 segment 1", BarDirection::y).M_Ed ==
          Approx(region(r, "grid x1 segment 3", BarDirection::x).M_Ed).epsilon(1e-6));
    // The positions mirror too.
    CHECK(region(r, "bay 3,3", BarDirection::x).x_mm == Approx(12000.0 - region(r, "bay 1,1", BarDirection::x).x_mm));
    REQUIRE(r.plate);
    CHECK(r.plate->bays.size() == 9);
    CHECK(r.plate->reactions.size() == 8 * 3);  // 4 lines each way, 3 segments each
  }
}

// A region's steel by hand from its design moment and effective depth.
// EN 1992-1-1 6.1 with the rectangular block (3.1.7(3), fck ≤ 50): K =
// M/(b d² fck), z = d [0.5 + √(0.25 − K/1.134)] ≤ 0.95 d, As = M/(0.87 fyk
// z) (γs = 1.15). ACI 318-19 22.2 (Whitney block, φ = 0.9 tension-
// controlled, 21.2.2): As = (0.85 f'c b/fy)(d − √(d² − 2 Mu/(φ 0.85 f'c b))).
TEST_CASE("Two-way: a region's As,req checked by hand from its M_Ed and d, both codes") {
  {
    const DesignRecord r = design(registry(), two_way_request("EN1992-1-1", "UK", {5.4, 6.0}, {4.2, 4.2}));
    const RegionRecord& g = region(r, "grid y1 segment 1", BarDirection::y);
    const double b = 1000.0, d = g.d_mm, M = g.M_Ed, fck = 30.0;
    const double K = M / (b * d * d * fck);
    const double z = std::min(d * (0.5 + std::sqrt(0.25 - K / 1.134)), 0.95 * d);
    const double As = M / (500.0 / 1.15 * z);
    CHECK(g.M_Ed > 10e6);
    CHECK(g.As_req_mm2 == Approx(As).epsilon(2e-3));
  }
  {
    const DesignRecord r = design(registry(), two_way_request("ACI318-19", "SI", {5.4, 6.0}, {4.2, 4.2}));
    const RegionRecord& g = region(r, "grid y1 segment 1", BarDirection::y);
    const double b = 1000.0, d = g.d_mm, Mu = g.M_Ed, fc = 28.0, fy = 420.0;
    const double As = 0.85 * fc * b / fy * (d - std::sqrt(d * d - 2.0 * Mu / (0.9 * 0.85 * fc * b)));
    CHECK(g.M_Ed > 10e6);
    CHECK(g.As_req_mm2 == Approx(As).epsilon(2e-3));
  }
}

// The two layers of a face: the outer at d = h − c − φo/2, the inner on
// it at d = h − c − φo − φi/2 (geometry of the section; cover given 25 mm).
TEST_CASE("Two-way: outer and inner layers take their own effective depths") {
  json req = two_way_request("EN1992-1-1", "UK", {3.6}, {6.0});  // short span x: x carries more
  const DesignRecord r = design(registry(), req);
  REQUIRE(r.plate);
  CHECK(r.plate->outer_layer[0] == "x");
  const RegionRecord& gx = region(r, "bay 1,1", BarDirection::x);
  const RegionRecord& gy = region(r, "bay 1,1", BarDirection::y);
  CHECK(gx.M_Ed > gy.M_Ed);
  CHECK(gx.d_mm == Approx(200.0 - 25.0 - gx.bars.diameter_mm / 2.0));
  CHECK(gy.d_mm == Approx(200.0 - 25.0 - gx.bars.diameter_mm - gy.bars.diameter_mm / 2.0));
  // reinforcement.outer_layer turns the layers over.
  req["reinforcement"] = {{"outer_layer", "y"}};
  const DesignRecord flipped = design(registry(), req);
  const RegionRecord& fx = region(flipped, "bay 1,1", BarDirection::x);
  const RegionRecord& fy = region(flipped, "bay 1,1", BarDirection::y);
  CHECK(flipped.plate->outer_layer[0] == "y");
  CHECK(fy.d_mm == Approx(200.0 - 25.0 - fy.bars.diameter_mm / 2.0));
  CHECK(fx.d_mm == Approx(200.0 - 25.0 - fy.bars.diameter_mm - fx.bars.diameter_mm / 2.0));
}

// The codes' bay patterns: EN 1992-1-1 5.1.3 as the variants read it (UK
// NA: all bays and alternate bays; recommended: alternate and adjacent
// bays, all bays too), ACI 318-19 6.4.3.2 (75 % of factored L where L >
// 0.75 D, else every panel fully loaded; from memory).
TEST_CASE("Two-way: the number of bay load arrangements per code") {
  auto arrangements = [](const char* code, const char* variant, double imposed_kPa) {
    json req = two_way_request(code, variant, {4.0, 4.0, 4.0}, {4.0, 4.0, 4.0});
    req["loads"]["imposed_kPa"] = imposed_kPa;
    return design(registry(), req).plate->arrangements;
  };
  CHECK(arrangements("EN1992-1-1", "UK", 3.0) == 3);                 // all + 2 checkerboards
  CHECK(arrangements("EN1992-1-1", "recommended", 3.0) == 1 + 2 + 4);  // + both sides of 4 interior lines
  // D = 25 × 0.2 + 1.5 = 6.5 kPa: L = 3.0 ≤ 0.75 D, L = 6.0 > 0.75 D.
  CHECK(arrangements("ACI318-19", "SI", 3.0) == 1);
  CHECK(arrangements("ACI318-19", "SI", 6.0) == 1 + 2 + 4);
}

// The envelope over the patterns is never below every bay loaded, and the
// checkerboard raises the bay moments of a continuous floor (the bay's
// neighbours unloaded let it rotate more at the lines).
TEST_CASE("Two-way: the pattern envelope is at least the all-bays case") {
  Request req;
  req.slab_type = SlabType::two_way;
  req.slab.thickness_mm = 200;
  req.two_way.x_spans_mm = {4000.0, 5000.0, 4000.0};
  req.two_way.y_spans_mm = {4500.0, 4500.0};
  const std::vector<Action> actions{action("self-weight", ActionKind::permanent, "", Distribution::uniform, 5.0e-3),
                                    action("imposed", ActionKind::imposed, "C", Distribution::uniform, 5.0e-3)};
  const Combination uls{"1.35 G + 1.5 Q", LimitState::uls, {{1.35, 1.35}, {1.5, 0.0}}};
  const std::vector<BayArrangement> all{{std::vector<bool>(6, true), 1.0}};
  std::vector<BayArrangement> patterns = all;
  for (auto& a : checkerboard_bay_arrangements(3, 2)) patterns.push_back({a, 1.0});
  for (auto& a : adjacent_bays_across_lines(3, 2)) patterns.push_back({a, 1.0});
  CHECK(patterns.size() == 1 + 2 + 3);
  std::vector<std::string> warnings;
  TwoWayPlate one(req, 30000.0), many(req, 30000.0);
  CHECK(one.analyse(actions, {uls}, all, 0.5) == 1);
  CHECK(many.analyse(actions, {uls}, patterns, 0.5) == 6);
  const auto a = one.design_regions(0.0, armature::CornerRule{}, warnings), b = many.design_regions(0.0, armature::CornerRule{}, warnings);
  REQUIRE(a.size() == b.size());
  bool raised = false;
  for (std::size_t i = 0; i < a.size(); ++i) {
    CHECK(b[i].M_Ed >= a[i].M_Ed * (1.0 - 1e-12));
    if (a[i].face == Face::bottom && b[i].M_Ed > a[i].M_Ed * 1.05) raised = true;
  }
  CHECK(raised);
}

// Bad input: every problem named by its request path, together.
TEST_CASE("Two-way: bad input is named field by field") {
  json req = two_way_request("EN1992-1-1", "UK", {5.4, -2.0}, {4.2});
  req["slab"]["edges"] = {{"x0", "hinged"}};
  req["slab"]["spans_m"] = {4.0};
  req["analysis"] = {{"mesh_per_bay", 1}, {"poisson_ratio", 0.6}};
  req["fire"] = {{"resistance_min", 45}};
  req["loads"]["actions"] = {
      {{"name", "tank"}, {"kind", "imposed"}, {"category", "E"}, {"point_kN", 12.0}, {"x_m", 20.0}, {"y_m", 1.0}},
      {{"name", "wall"}, {"kind", "permanent"}, {"line_kN_per_m", 7.5}, {"from_m", {1.0, 1.0}}, {"to_m", {2.0, 3.0}}},
      {{"name", "plant"}, {"kind", "imposed"}, {"category", "E"}, {"kPa", 5.0}, {"span", 1}, {"from_m", {1.0, 1.0}}}};
  const auto p = problem_fields(req);
  INFO(json(p).dump(1));
  CHECK(has_problem(p, "slab.x_spans_m[1]", "greater than 0"));
  CHECK(has_problem(p, "slab.edges.x0", "\"pinned\", \"fixed\" or \"free\""));
  CHECK(has_problem(p, "slab.spans_m", "one-way"));
  CHECK(has_problem(p, "analysis.mesh_per_bay"));
  CHECK(has_problem(p, "analysis.poisson_ratio"));
  CHECK(has_problem(p, "fire.resistance_min"));  // not a period of Table 5.8
  CHECK(has_problem(p, "loads.actions[1].to_m", "parallel to x or y"));
  CHECK(has_problem(p, "loads.actions[2].span", "one-way"));
  CHECK(has_problem(p, "loads.actions[2].to_m", "required"));
  // x_m of the tank is off the plate once the spans are good.
  json off = two_way_request("EN1992-1-1", "UK", {5.4, 6.0}, {4.2});
  off["loads"]["actions"] = {
      {{"name", "tank"}, {"kind", "imposed"}, {"category", "E"}, {"point_kN", 12.0}, {"x_m", 20.0}, {"y_m", 1.0}}};
  const auto q = problem_fields(off);
  CHECK(has_problem(q, "loads.actions[0].x_m", "must lie on the slab"));
  // A two-way slab's detailing counts its bars on the plan: slab_width_m
  // is not required (a strip's is), and a bad value is still named.
  json plan = two_way_request("EN1992-1-1", "UK", {5.4, 6.0}, {4.2});
  plan["detailing"] = json::object();
  CHECK_FALSE(has_problem(problem_fields(plan), "detailing"));
  plan["detailing"] = {{"slab_width_m", -1.0}, {"curtail", "every third"}};
  const auto r = problem_fields(plan);
  CHECK(has_problem(r, "detailing.slab_width_m"));
  CHECK(has_problem(r, "detailing.curtail", "\"none\" or \"alternate\""));
  // A one-way request takes no analysis options.
  json strip = two_way_request("EN1992-1-1", "UK", {4.0}, {4.0});
  strip["slab"] = {{"spans_m", {4.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 200}};
  strip["analysis"] = {{"mesh_per_bay", 8}};
  CHECK(has_problem(problem_fields(strip), "analysis", "two_way and flat slabs only"));
  // A mechanism: one pinned edge, the others free.
  json loose = two_way_request("EN1992-1-1", "UK", {4.0}, {4.0},
                               {{"x0", "pinned"}, {"x1", "free"}, {"y0", "free"}, {"y1", "free"}});
  CHECK(has_problem(problem_fields(loose), "slab.edges"));
}

// Located loads: a point load raises the bay moment under it, and the
// mesh passes through it (its position is a node line).
TEST_CASE("Two-way: a point load placed in plan raises the moments under it") {
  json req = two_way_request("EN1992-1-1", "UK", {4.0}, {4.0});
  const DesignRecord base = design(registry(), req);
  req["loads"]["actions"] = {
      {{"name", "tank"}, {"kind", "imposed"}, {"category", "E"}, {"point_kN", 20.0}, {"x_m", 1.3}, {"y_m", 2.0}}};
  const DesignRecord loaded = design(registry(), req);
  const RegionRecord& g = region(loaded, "bay 1,1", BarDirection::x);
  CHECK(g.M_Ed > 1.2 * region(base, "bay 1,1", BarDirection::x).M_Ed);
  CHECK(g.x_mm == Approx(1300.0));
  CHECK(g.y_mm == Approx(2000.0));
  const auto& xs = loaded.plate->field.x_mm;
  CHECK(std::any_of(xs.begin(), xs.end(), [](double x) { return std::abs(x - 1300.0) < 1e-9; }));
}

// Shear at the supports from the line reactions per metre (both codes'
// shear without links, as for strips) and deflection by span/depth on
// each bay's shorter span: EN 1992-1-1 7.4.2 (l/d = span/d, Table 7.4N K
// for the bay's continuity) and ACI 318-19 8.3.1.2 (αfm > 2: h_min = ℓn
// (0.8 + fy/1400)/(36 + 9β) ≥ 90 mm; from memory).
TEST_CASE("Two-way: shear at the lines from their reactions, deflection on the shorter span, both codes") {
  for (const auto& cc : both_codes) {
    INFO(cc.code);
    const DesignRecord r = design(registry(), two_way_request(cc.code, cc.variant, {5.4, 6.0}, {4.2, 4.2}));
    REQUIRE(r.plate);
    for (const auto& l : r.plate->reactions) {
      const auto s = std::find_if(r.supports.begin(), r.supports.end(),
                                  [&](const SupportRecord& x) { return x.where == l.name; });
      REQUIRE(s != r.supports.end());
      CHECK(s->V_Ed == Approx(l.max_N_per_mm * 1000.0));
      CHECK(s->V_Rd > 0.0);
    }
    const auto V = [&](const std::string& name) {
      for (const auto& s : r.supports)
        if (s.where == name) return s.V_Ed;
      return 0.0;
    };
    CHECK(V("grid x1 segment 1") > 2.0 * V("edge x0 segment 1"));
    // Bay 2,1: 6.0 × 4.2 m, shorter span 4.2 m in y, continuous across
    // grid y1 only.
    const SpanRecord* span = nullptr;
    for (const auto& s : r.spans)
      if (s.where == "bay 2,1") span = &s;
    REQUIRE(span);
    REQUIRE(!span->checks.empty());
    const Check& c = span->checks.front();
    CHECK(c.id == "deflection");
    if (std::string(cc.code) == "EN1992-1-1") {
      const double d = region(r, "bay 2,1", BarDirection::y).d_mm;
      CHECK(c.demand == Approx(4200.0 / d));
    } else {
      const double beta = 6000.0 / 4200.0;
      CHECK(c.demand == Approx(6000.0 * (0.8 + 420.0 / 1400.0) / (36.0 + 9.0 * beta)));
      CHECK(c.capacity == Approx(200.0));
    }
  }
}

// Check mode on a two-way slab: the bars given for a region and direction
// are checked as they are (their As by the catalogue's area, EN 1992-1-1
// bar ø12: 113.1 mm², at 150 mm: 754 mm²/m), the others searched; a given
// region is named by where, face and direction.
TEST_CASE("Two-way: check mode by region and direction") {
  json req = two_way_request("EN1992-1-1", "UK", {5.4, 6.0}, {4.2});
  req["reinforcement"] = {{"given",
                           {{{"where", "bay 1,1"}, {"face", "bottom"}, {"direction", "x"}, {"bar", "12"}, {"spacing_mm", 150}},
                            {{"where", "grid x1 segment 1"}, {"face", "top"}, {"direction", "x"}, {"bar", "16"},
                             {"spacing_mm", 200}}}}};
  const DesignRecord r = design(registry(), req);
  const RegionRecord& gx = region(r, "bay 1,1", BarDirection::x);
  CHECK(gx.bars_given);
  CHECK(gx.bars.bar == "12");
  CHECK(gx.bars.spacing_mm == 150.0);
  CHECK(gx.bars.As_prov_mm2 == Approx(113.097 * 1000.0 / 150.0).epsilon(1e-4));
  CHECK_FALSE(region(r, "bay 1,1", BarDirection::y).bars_given);
  CHECK(region(r, "grid x1 segment 1", BarDirection::x).bars_given);
  CHECK(region(r, "grid x1 segment 1", BarDirection::x).bars.bar == "16");
  // Wrong direction, unknown region, missing direction: each named.
  json bad = req;
  bad["reinforcement"]["given"] = {
      {{"where", "grid x1 segment 1"}, {"face", "top"}, {"direction", "y"}, {"bar", "12"}, {"spacing_mm", 150}},
      {{"where", "bay 9,9"}, {"face", "bottom"}, {"direction", "x"}, {"bar", "12"}, {"spacing_mm", 150}}};
  const auto p = problem_fields(bad);
  INFO(json(p).dump(1));
  CHECK(has_problem(p, "reinforcement.given[0].direction", "no region with bars in y"));
  CHECK(has_problem(p, "reinforcement.given[1].where", "no region 'bay 9,9'"));
  bad["reinforcement"]["given"] = {{{"where", "bay 1,1"}, {"face", "bottom"}, {"bar", "12"}, {"spacing_mm", 150}}};
  CHECK(has_problem(problem_fields(bad), "reinforcement.given[0].direction", "required"));
}

// Fire on a two-way slab (EN 1992-1-2 5.7.2 Table 5.8): the thickness of
// column 2 for each bay, the axis distance of the bottom bars by ly/lx for
// a slab supported on four edges: column 4 (ly/lx ≤ 1.5: REI 90 15 mm),
// column 5 (1.5–2: REI 90 20 mm), column 3 above 2 (REI 90 30 mm).
TEST_CASE("Two-way: fire by Table 5.8's two-way columns") {
  auto a_min = [](double lx, double ly) {
    json req = two_way_request("EN1992-1-1", "UK", {lx}, {ly});
    req["fire"] = {{"resistance_min", 90}};
    const DesignRecord r = design(registry(), req);
    const Check* fire = nullptr;
    for (const auto& c : region(r, "bay 1,1", BarDirection::x).checks)
      if (c.id == "fire") fire = &c;
    REQUIRE(fire);
    CHECK(fire->capacity == Approx(25.0 + region(r, "bay 1,1", BarDirection::x).bars.diameter_mm / 2.0));
    bool thickness = false;
    for (const auto& s : r.spans)
      for (const auto& c : s.checks)
        if (c.id == "fire" && s.where == "bay 1,1") thickness = c.demand == Approx(100.0) && c.capacity == Approx(200.0);
    CHECK(thickness);
    return fire->demand;
  };
  CHECK(a_min(4.0, 5.0) == Approx(15.0));
  CHECK(a_min(4.0, 7.0) == Approx(20.0));
  CHECK(a_min(3.0, 7.5) == Approx(30.0));
}

// uniform_bottom: one arrangement per direction for every bay's bottom
// bars. Bottom bars of one direction lie in one layer at one depth, so the
// shared arrangement is the one each bay would take alone for the largest
// moment of that direction (the lightest that passes the worst bay), and
// every bay passes with it.
TEST_CASE("Two-way: uniform_bottom shares one arrangement per direction over the bays") {
  json req = two_way_request("EN1992-1-1", "UK", {3.0, 6.6, 4.2}, {7.2},
                             {{"x0", "pinned"}, {"x1", "fixed"}, {"y0", "pinned"}, {"y1", "pinned"}});
  req["loads"]["imposed_kPa"] = 5.0;
  const DesignRecord alone = design(registry(), req);
  req["reinforcement"] = {{"rationalise", "uniform_bottom"}};
  const DesignRecord shared = design(registry(), req);
  for (const BarDirection d : {BarDirection::x, BarDirection::y}) {
    const RegionRecord* worst = nullptr;
    for (const auto& g : alone.regions)
      if (g.face == Face::bottom && g.direction == d && !is_plate_corner_name(g.where) &&
          (!worst || g.M_Ed > worst->M_Ed))
        worst = &g;
    REQUIRE(worst);
    INFO(to_string(d) << ": worst " << worst->where << " " << worst->bars.bar << " @ " << worst->bars.spacing_mm);
    std::size_t bays = 0;
    for (const auto& g : shared.regions) {
      if (g.face != Face::bottom || g.direction != d || is_plate_corner_name(g.where)) continue;  // corners keep their own
      ++bays;
      CHECK(g.bars.bar == worst->bars.bar);
      CHECK(g.bars.spacing_mm == worst->bars.spacing_mm);
      for (const auto& c : g.checks) CHECK(c.pass);
      // At least as much steel as the bay took alone.
      CHECK(g.bars.As_prov_mm2 >= region(alone, g.where, d).bars.As_prov_mm2 - 1e-9);
    }
    CHECK(bays == 3);
  }
  // The bays differ alone (otherwise the test shows nothing).
  CHECK(region(alone, "bay 1,1", BarDirection::x).bars.As_prov_mm2 <
        region(alone, "bay 2,1", BarDirection::x).bars.As_prov_mm2);
  // Top bars are not shared.
  for (const auto& g : shared.regions)
    if (g.face == Face::top) CHECK(g.bars.As_prov_mm2 == region(alone, g.where, g.direction).bars.As_prov_mm2);
}

// Corners held down where two pinned edges meet (EN 1992-1-1 9.3.1.3,
// ACI 318-19 8.7.3.1). A simply supported square plate, ν = 0.3, uniform
// q (Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, Table 8,
// value from memory): centre Mx = My = 0.0479 q a², corner reaction R =
// 0.065 q a² = 2 Mxy, so Mxy = 0.0325 q a² at the corner, where Mx = My =
// 0 and the Wood–Armer top moment is |Mxy|. One bay loads every case
// alike: q = 1.35 (25 × 0.2 + 1.5) + 1.5 × 3.0 = 13.275 kPa (EN 1990
// (6.10), UK NA Table NA.A1.2(B); 25 kN/m³ from EN 1991-1-1 Table A.1).
TEST_CASE("Two-way: corner bars where two pinned edges meet by EN 9.3.1.3 and ACI 8.7.3.1") {
  json en = two_way_request("EN1992-1-1", "UK", {4.5}, {4.5});
  en["analysis"] = {{"poisson_ratio", 0.3}};
  const DesignRecord r = design(registry(), en);
  const double qa2 = 13.275e-3 * 4500.0 * 4500.0 * 1000.0;  // N·mm per metre width
  REQUIRE(r.plate);
  REQUIRE(r.plate->corners.size() == 4);
  for (const auto& c : r.plate->corners) {
    INFO(c.name);
    CHECK(c.clause == "EN 1992-1-1 9.3.1.3");
    // A fifth of the longer span from the corner each way (ACI 318-19
    // 8.7.3.1.2, value from memory; EN sets none).
    CHECK(c.x1_mm - c.x0_mm == Approx(900.0));
    CHECK(c.y1_mm - c.y0_mm == Approx(900.0));
    for (const BarDirection d : {BarDirection::x, BarDirection::y}) {
      const RegionRecord* top = nullptr;
      for (const auto& g : r.regions)
        if (g.where == c.name && g.face == Face::top && g.direction == d) top = &g;
      REQUIRE(top);
      CHECK(top->M_Ed / qa2 == Approx(0.0325).epsilon(0.03));
    }
  }
  // The bay's bottom bars take the centre moment, not the corner twist.
  CHECK(region(r, "bay 1,1", BarDirection::x).M_Ed / qa2 == Approx(0.0479).epsilon(0.02));
  CHECK(region(r, "bay 1,1", BarDirection::y).M_Ed / qa2 == Approx(0.0479).epsilon(0.02));

  // ACI: top and bottom corner bars for the panel's largest positive
  // moment per unit width (8.7.3.1, value from memory), over a fifth of
  // the longer span (9.0 m: 1.8 m) each way.
  const DesignRecord a = design(registry(), two_way_request("ACI318-19", "SI", {4.5}, {9.0}));
  REQUIRE(a.plate);
  REQUIRE(a.plate->corners.size() == 4);
  const double panel = std::max(region(a, "bay 1,1", BarDirection::x).M_Ed, region(a, "bay 1,1", BarDirection::y).M_Ed);
  std::size_t corner_regions = 0;
  for (const auto& g : a.regions) {
    if (!is_plate_corner_name(g.where)) continue;
    ++corner_regions;
    CHECK(g.M_Ed >= panel * (1.0 - 1e-9));
    for (const auto& c : g.checks) CHECK(c.pass);
  }
  CHECK(corner_regions == 4 * 4);  // top and bottom, x and y
  CHECK(a.plate->corners[0].x1_mm - a.plate->corners[0].x0_mm == Approx(1800.0));

  // Only where two pinned edges meet: a fixed or a free edge holds none.
  const DesignRecord m = design(registry(), two_way_request("EN1992-1-1", "UK", {5.4}, {4.2},
                                                            {{"x0", "pinned"}, {"x1", "fixed"},
                                                             {"y0", "pinned"}, {"y1", "free"}}));
  REQUIRE(m.plate);
  REQUIRE(m.plate->corners.size() == 1);
  CHECK(m.plate->corners[0].name == "corner x0 y0");
  // The free edge's U-bars in the summary, only where there is a free edge.
  CHECK(format_summary(m).find("EN 1992-1-1 9.3.1.4") != std::string::npos);
  CHECK(format_summary(r).find("9.3.1.4") == std::string::npos);
}

// Free edges (EN 1992-1-1 9.3.1.4, Figure 9.8, value from memory): U-bars
// with legs of 2h on each face, the slab's own bars serving (9.3.1.4(2)),
// with bars along the edge inside the U. ACI 318-19 sets no such rule.
TEST_CASE("Two-way: U-bars along a free edge by EN 9.3.1.4") {
  json req = two_way_request("EN1992-1-1", "UK", {5.4, 6.0}, {4.2},
                             {{"x0", "pinned"}, {"x1", "pinned"}, {"y0", "fixed"}, {"y1", "free"}});
  req["slab"]["thickness_mm"] = 225;
  const DesignRecord r = design(registry(), req);
  REQUIRE(r.plate);
  REQUIRE(r.plate->free_edges.size() == 2);  // one per bay along edge y1
  for (const auto& f : r.plate->free_edges) {
    INFO(f.bay);
    CHECK(f.edge == "edge y1");
    CHECK(f.leg_mm == Approx(2.0 * 225.0));
    CHECK(f.clause == "EN 1992-1-1 9.3.1.4, Figure 9.8");
    // Edge y1 runs along x: the bars across it run in y.
    CHECK(f.u_bar == region(r, f.bay, BarDirection::y).bars.bar);
    CHECK(f.u_bar_spacing_mm == region(r, f.bay, BarDirection::y).bars.spacing_mm);
    CHECK(f.edge_bar == region(r, f.bay, BarDirection::x).bars.bar);
  }
  CHECK(r.plate->free_edges[0].from_mm == 0.0);
  CHECK(r.plate->free_edges[1].to_mm == Approx(11400.0));
  // One summary line for the edge, naming each bay's U-bars.
  const std::string summary = format_summary(r);
  const auto line = summary.find("Free edge  edge y1: U-bars");
  REQUIRE(line != std::string::npos);
  const std::string text = summary.substr(line, summary.find('\n', line) - line);
  CHECK(text.find("(bay 1,1)") != std::string::npos);
  CHECK(text.find("(bay 2,1)") != std::string::npos);
  CHECK(summary.find("Free edge", line + 1) == std::string::npos);
  // ACI: no rule, and the summary says so.
  const DesignRecord a = design(registry(), two_way_request("ACI318-19", "SI", {5.4, 6.0}, {4.2},
                                                            {{"x0", "pinned"}, {"x1", "pinned"},
                                                             {"y0", "fixed"}, {"y1", "free"}}));
  REQUIRE(a.plate);
  CHECK(a.plate->free_edges.empty());
  CHECK(format_summary(a).find("no reinforcement rule of its own for a free edge") != std::string::npos);
}

// The corner zones take nothing from the bays' and lines' own regions that
// their bars would not cover: an interior line keeps the peak of its whole
// segment (its bars cross into the next bay, the corner bars stop at the
// line), the nodes on a zone's inner boundary stay in the bay, and the
// rules that read the largest moment of the panel (EN 9.3.1.2(2) at a
// pinned edge: 0.25 of it; ACI 8.7.3.1 at a corner: all of it) read it over
// the whole bay. A point load near a corner makes the corner twist and the
// sagging there the largest of the bay.
TEST_CASE("Two-way: corner zones with a point load near a corner keep every peak covered") {
  auto peak = [](const DesignRecord& r, const std::vector<double>& f, double x0, double x1, double y0, double y1) {
    const auto& p = r.plate->field;
    double best = 0.0;
    for (std::size_t j = 0; j < p.y_mm.size(); ++j)
      for (std::size_t i = 0; i < p.x_mm.size(); ++i)
        if (p.x_mm[i] >= x0 - 1e-6 && p.x_mm[i] <= x1 + 1e-6 && p.y_mm[j] >= y0 - 1e-6 && p.y_mm[j] <= y1 + 1e-6)
          best = std::max(best, f[i + p.x_mm.size() * j]);
    return best * 1000.0;  // N·mm/mm → per metre
  };
  json req = two_way_request("EN1992-1-1", "UK", {1.0, 6.0, 6.0}, {6.0, 6.0});
  req["loads"]["actions"] = {
      {{"name", "plant"}, {"kind", "imposed"}, {"category", "E"}, {"point_kN", 100.0}, {"x_m", 1.4}, {"y_m", 0.8}}};
  const DesignRecord r = design(registry(), req);
  REQUIRE(r.plate);
  const auto& f = r.plate->field;
  // grid x1 (x = 1.0 m), segment 1 (y from 0 to 6 m): the whole segment's top_x.
  CHECK(region(r, "grid x1 segment 1", BarDirection::x).M_Ed ==
        Approx(peak(r, f.top_x, 1000.0, 1000.0, 0.0, 6000.0)).epsilon(1e-9));

  json one = two_way_request("EN1992-1-1", "UK", {6.0}, {6.0});
  one["loads"]["actions"] = {
      {{"name", "plant"}, {"kind", "imposed"}, {"category", "E"}, {"point_kN", 100.0}, {"x_m", 0.6}, {"y_m", 0.6}}};
  const DesignRecord e = design(registry(), one);
  REQUIRE(e.plate);
  const auto& c = e.plate->corners.front();  // corner x0 y0: 1.2 m each way
  REQUIRE(c.x1_mm == Approx(1200.0));
  // The bay's bottom x: at least every node outside the zone or on its inner boundary.
  const double outside = std::max(peak(e, e.plate->field.bottom_x, 1200.0, 6000.0, 0.0, 6000.0),
                                  peak(e, e.plate->field.bottom_x, 0.0, 6000.0, 1200.0, 6000.0));
  CHECK(region(e, "bay 1,1", BarDirection::x).M_Ed >= outside * (1.0 - 1e-9));
  // EN 9.3.1.2(2): the pinned edge's top at least 0.25 of the bay's largest sagging (whole bay).
  const double whole = std::max(peak(e, e.plate->field.bottom_x, 0, 6000, 0, 6000),
                                peak(e, e.plate->field.bottom_y, 0, 6000, 0, 6000));
  CHECK(region(e, "edge x0 segment 1", BarDirection::x).M_Ed >= 0.25 * peak(e, e.plate->field.bottom_x, 0, 6000, 0, 6000) * (1.0 - 1e-9));
  // ACI 8.7.3.1: every corner's bars at least the panel's largest positive moment, whole bay.
  json aci = one;
  aci["code"] = "ACI318-19";
  aci["variant"] = "SI";
  aci["concrete"] = {{"cylinder_strength_MPa", 28}};
  const DesignRecord a = design(registry(), aci);
  REQUIRE(a.plate);
  const double panel = std::max(peak(a, a.plate->field.bottom_x, 0, 6000, 0, 6000),
                                peak(a, a.plate->field.bottom_y, 0, 6000, 0, 6000));
  for (const auto& g : a.regions)
    if (is_plate_corner_name(g.where)) CHECK(g.M_Ed >= panel * (1.0 - 1e-9));
  CHECK(whole > 0.0);
}
