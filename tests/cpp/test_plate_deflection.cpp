// Calculated deflection of two-way and flat slabs (serviceability.deflection
// "calculated" or "both"): the plate solved again with each element's
// cracked rigidity (plate_deflection.cpp, the codes' plate_section_response).
// Checks against closed forms and the one-way calculation:
//   - a plate pinned along two opposite edges and free along the others
//     bends as a strip (ν = 0 in the cracked analysis): uncracked, its
//     deflection is 5 q L⁴/(384 E I) plus EN's shrinkage curvature
//     κcs L²/8 (beam tables, value from memory), with I_I, αe, κcs worked
//     out here from EN 1992-1-1 7.4.3 (7.20), (7.21) and ACI's Ig = b h³/12,
//     Ec = 4700 √f'c (ACI 318-19 19.2.2.1, value from memory);
//   - cracked, the same strip against the one-way strip's calculated
//     deflection (tests/cpp/test_design.cpp checks that one against closed
//     forms): EN the same ζ interpolation, so within the plate's element
//     discretisation; ACI with Ie element by element, between the strip
//     with Ig and the strip with Ie of its largest moment throughout.
// Our scenarios: bays of the community workshop floor.
#include <catch2/catch.hpp>

#include <algorithm>
#include <array>
#include <cmath>
#include <string>

#include "armature/design.hpp"
#include "armature/flat.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "request_problems.hpp"

using nlohmann::json;
using namespace armature;

namespace {
Registry& registry() { return testing::build_registry(); }

constexpr double L = 4000.0;  // mm, the supported span
constexpr double h = 200.0;   // mm
constexpr double b = 1000.0;  // mm, per metre
constexpr double Es = 200000.0;

// One bay 4.0 × 6.0 m pinned along x0 and x1, free along y0 and y1: a
// strip spanning x. Bars in x given (bottom, ø12 @ 200 or No.13 @ 200),
// cover 25 mm.
json strip_plate(const std::string& code, double dead_kPa, double imposed_kPa) {
  const bool en = code == "EN1992-1-1";
  json r = {{"code", code},
            {"variant", en ? "UK" : "SI"},
            {"slab",
             {{"type", "two_way"},
              {"x_spans_m", {L / 1000.0}},
              {"y_spans_m", {6.0}},
              {"thickness_mm", h},
              {"edges", {{"x0", "pinned"}, {"x1", "pinned"}, {"y0", "free"}, {"y1", "free"}}}}},
            {"loads", {{"dead_kPa", dead_kPa}, {"imposed_kPa", imposed_kPa}, {"imposed_category", "A"}}},
            {"durability", {{"cover_mm", 25}}},
            {"serviceability", {{"deflection", "calculated"}}}};
  r["concrete"] = en ? json{{"class", "C30/37"}} : json{{"cylinder_strength_MPa", 28}};
  r["reinforcement"] = {{"given",
                         {{{"where", "bay 1,1"}, {"face", "bottom"}, {"direction", "x"}, {"bar", en ? "12" : "No.13"},
                           {"spacing_mm", 200}}}}};
  if (en) {
    r["serviceability"]["creep_coefficient"] = 2.0;
    r["serviceability"]["shrinkage_strain"] = 0.0003;
  }
  return r;
}

// The same strip as a one-way slab of one span, the same bars.
json strip_one_way(json plate) {
  plate["slab"] = {{"spans_m", {L / 1000.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", h}};
  plate["reinforcement"]["given"][0].erase("direction");
  plate["reinforcement"]["given"][0]["where"] = "span 1";
  return plate;
}

const RegionRecord& bottom_x(const DesignRecord& r) {
  for (const auto& g : r.regions)
    if (g.where == "bay 1,1" && g.face == Face::bottom && g.direction == BarDirection::x) return g;
  throw std::runtime_error("no bottom x region in bay 1,1");
}

std::vector<const Check*> calculated(const DesignRecord& r, const std::string& where) {
  std::vector<const Check*> out;
  for (const auto& s : r.spans)
    if (s.where == where)
      for (const auto& c : s.checks)
        if (c.id == "deflection" && c.method == "calculated") out.push_back(&c);
  return out;
}

// Uncracked transformed section b h plus (αe − 1) As at d (EN 1992-1-1
// 7.4.3), worked out here.
struct Uncracked {
  double x, I, S;
};
Uncracked uncracked(double As, double d, double alpha_e) {
  const double A = b * h + (alpha_e - 1.0) * As;
  const double x = (b * h * h / 2.0 + (alpha_e - 1.0) * As * d) / A;
  const double I = b * h * h * h / 12.0 + b * h * (h / 2.0 - x) * (h / 2.0 - x) + (alpha_e - 1.0) * As * (d - x) * (d - x);
  return {x, I, As * (d - x)};
}
}  // namespace

TEST_CASE("EN plate deflection of an uncracked strip: 5 q L^4/(384 Ec_eff I_I)", "[plate_deflection][en1992]") {
  // Quasi-permanent load: self-weight 25 kN/m³ × 0.2 m (EN 1991-1-1 Table
  // A.1, the code's default) + 0.5 kPa dead + ψ2 = 0.3 (EN 1990 Table A1.1,
  // category A) × 1.5 kPa: 5.95 kPa, M = q L²/8 = 11.9 kNm/m, under Mcr.
  // No shrinkage here: the bars across the span would curl the free edges
  // (a plate effect the strip has not); the cracked strip below compares
  // shrinkage and all with the one-way calculation.
  json req = strip_plate("EN1992-1-1", 0.5, 1.5);
  req["serviceability"]["shrinkage_strain"] = 0.0;
  const DesignRecord r = design(registry(), req);
  const double q = (25.0 * h / 1000.0 + 0.5 + 0.3 * 1.5) * 1e-3;  // MPa
  const RegionRecord& g = bottom_x(r);
  const double Ecm = 22000.0 * std::pow((30.0 + 8.0) / 10.0, 0.3);  // EN 1992-1-1 Table 3.1
  const double Ec_eff = Ecm / (1.0 + 2.0);                         // (7.20)
  const double alpha_e = Es / Ec_eff;
  const Uncracked s = uncracked(g.bars.As_prov_mm2, g.d_mm, alpha_e);
  const double fctm = 0.30 * std::pow(30.0, 2.0 / 3.0);  // Table 3.1
  REQUIRE(q * L * L / 8.0 * b < fctm * s.I / (h - s.x));  // uncracked throughout
  const double expected = 5.0 * q * b * std::pow(L, 4) / (384.0 * Ec_eff * s.I);
  const auto checks = calculated(r, "bay 1,1");
  REQUIRE(checks.size() == 1);
  CHECK(checks[0]->demand == Approx(expected).epsilon(1e-3));
  CHECK(checks[0]->capacity == Approx(L / 250.0));  // 7.4.1(4), the panel's shorter span
  // "calculated" alone: no span/depth check of the panel.
  for (const auto& sp : r.spans)
    for (const auto& c : sp.checks) CHECK_FALSE((c.id == "deflection" && c.method != "calculated"));
}

TEST_CASE("EN plate deflection of a cracked strip against the one-way calculation", "[plate_deflection][en1992]") {
  // 3.5 kPa dead + 0.3 × 5 kPa: M_qp = 20 kNm/m over Mcr ≈ 13 kNm/m; the
  // strip cracks over the middle of the span.
  const json plate = strip_plate("EN1992-1-1", 3.5, 5.0);
  const DesignRecord p = design(registry(), plate);
  const DesignRecord s = design(registry(), strip_one_way(plate));
  const auto pc = calculated(p, "bay 1,1");
  const Check* sc = nullptr;
  for (const auto& sp : s.spans)
    for (const auto& c : sp.checks)
      if (c.id == "deflection" && c.method == "calculated") sc = &c;
  REQUIRE(pc.size() == 1);
  REQUIRE(sc != nullptr);
  INFO("plate " << pc[0]->demand << " mm, strip " << sc->demand << " mm");
  // The plate takes ζ element by element (ten elements along the span,
  // each at its centre's moment, which the cubic element reads q a²/24
  // low), the strip at every section: within 2 %.
  CHECK(pc[0]->demand == Approx(sc->demand).epsilon(0.02));
  // More load deflects more: well over the lighter strip's (whose
  // quasi-permanent load, 5.95 kPa, is 0.6 of this one's 10.0 kPa).
  CHECK(pc[0]->demand > 1.2 * design(registry(), strip_plate("EN1992-1-1", 0.5, 1.5)).spans[0].checks[0].demand);
}

TEST_CASE("EN plate deflection with partitions: the part after them against span/500", "[plate_deflection][en1992]") {
  json req = strip_plate("EN1992-1-1", 3.5, 5.0);
  req["serviceability"]["partitions"] = true;
  const DesignRecord r = design(registry(), req);
  const auto checks = calculated(r, "bay 1,1");
  REQUIRE(checks.size() == 2);
  CHECK(checks[1]->capacity == Approx(L / 500.0));  // 7.4.1(5)
  // The part after t_p = 90 days is a share of the total: creep and
  // shrinkage go on (φ(t_p) < φ(∞)), and the load was there from t0.
  CHECK(checks[1]->demand > 0.1 * checks[0]->demand);
  CHECK(checks[1]->demand < checks[0]->demand);
}

TEST_CASE("ACI plate deflection of an uncracked strip: 5 w L^4/(384 Ec Ig) per load level", "[plate_deflection][aci318]") {
  // D = self-weight (ACI's default density, read from the result's
  // totals, MPa) + 0.2 kPa; L = 1.0 kPa: Ma (D + L) = 11.8 kNm/m under
  // (2/3) Mcr = 2/3 × 0.62 √28 × b h²/6 = 14.6 kNm/m (19.2.3.1, 24.2.3.5):
  // Ie = Ig at both levels.
  const DesignRecord r = design(registry(), strip_plate("ACI318-19", 0.2, 1.0));
  const double Ec = 4700.0 * std::sqrt(28.0);
  const double Ig = b * h * h * h / 12.0;
  const double D = r.loads.Gk, Live = r.loads.Qk;
  CHECK(D == Approx(r.loads.self_weight + 0.0002));
  REQUIRE((D + Live) * L * L / 8.0 * b < 2.0 / 3.0 * 0.62 * std::sqrt(28.0) * b * h * h / 6.0);
  const double k = 5.0 * b * std::pow(L, 4) / (384.0 * Ec * Ig);
  const auto checks = calculated(r, "bay 1,1");
  REQUIRE(checks.size() == 2);
  // Immediate live Δ(D + L) − Δ(D) against ℓ/360; long term λΔ Δ(D) +
  // live with λΔ = 2.0 (24.2.4.1, ξ = 2.0 at five years, ρ' = 0) against ℓ/240.
  CHECK(checks[0]->demand == Approx(k * Live).epsilon(1e-3));
  CHECK(checks[0]->capacity == Approx(L / 360.0));
  CHECK(checks[1]->demand == Approx(k * (2.0 * D + Live)).epsilon(1e-3));
  CHECK(checks[1]->capacity == Approx(L / 240.0));
}

TEST_CASE("ACI plate deflection of a cracked strip lies between Ig and the largest moment's Ie", "[plate_deflection][aci318]") {
  // 3.0 kPa dead, 4.0 kPa live: Ma (D + L) = 23.8 kNm/m over (2/3) Mcr.
  // Element by element Ie (Table 24.2.3.5) is Ig where the moment is low
  // and the largest moment's Ie at mid-span: the plate's live deflection
  // must lie between the strip's with Ig and the strip's with Ie (Ma,max)
  // throughout, which the one-way check uses for a simple span (24.2.3.6).
  const json plate = strip_plate("ACI318-19", 3.0, 4.0);
  const DesignRecord p = design(registry(), plate);
  const DesignRecord s = design(registry(), strip_one_way(plate));
  const auto pc = calculated(p, "bay 1,1");
  std::vector<const Check*> sc;
  for (const auto& sp : s.spans)
    for (const auto& c : sp.checks)
      if (c.id == "deflection" && c.method == "calculated") sc.push_back(&c);
  REQUIRE(pc.size() == 2);
  REQUIRE(sc.size() == 2);
  const double Ec = 4700.0 * std::sqrt(28.0), Ig = b * h * h * h / 12.0;
  const double uncracked_live = 5.0 * p.loads.Qk * b * std::pow(L, 4) / (384.0 * Ec * Ig);
  INFO("plate " << pc[0]->demand << " mm, strip " << sc[0]->demand << " mm, Ig " << uncracked_live << " mm");
  CHECK(pc[0]->demand > 1.05 * uncracked_live);
  CHECK(pc[0]->demand < sc[0]->demand);
  CHECK(pc[1]->demand < sc[1]->demand);
}

TEST_CASE("ACI flat slab uncracked: the panel deflects as the elastic plate with Ec Ig", "[plate_deflection][aci318][flat]") {
  // A 350 mm flat slab on 4.0 m bays under its own weight, 0.2 kPa and
  // 1.0 kPa live stays under (2/3) Mcr everywhere (Mcr = 0.62 √28 b h²/6 =
  // 67 kNm/m): Ie = Ig in every element, so each panel deflects as the
  // plate (ν = 0, D = Ec h³/12, test_plate.cpp checks the plate against
  // Navier's series) under a uniform load, scaled by the load levels; the
  // columns (3.0 m storeys) turn against 4 Ec Ic/H.
  json req = {{"code", "ACI318-19"},
              {"variant", "SI"},
              {"slab",
               {{"type", "flat"},
                {"x_spans_m", {4.0, 4.0}},
                {"y_spans_m", {4.0, 4.0}},
                {"columns", {{"size_mm", {400, 400}}, {"height_m", 3.0}}},
                {"thickness_mm", 350}}},
              {"loads", {{"dead_kPa", 0.2}, {"imposed_kPa", 1.0}, {"imposed_category", "A"}}},
              {"durability", {{"cover_mm", 25}}},
              {"concrete", {{"cylinder_strength_MPa", 28}}},
              {"serviceability", {{"deflection", "calculated"}}}};
  const DesignRecord r = design(registry(), req);
  InputProblems problems;
  const Request request = request_from_json(req, problems);
  REQUIRE(problems.empty());
  const double Ec = 4700.0 * std::sqrt(28.0);
  const FlatPlate member(request, Ec, FlatStripRule{0.25, "test"});
  PlateGeometry g = member.model().geometry();
  g.poisson_ratio = 0.0;
  const PlateModel model(g);
  PlateLoadCase unit;
  unit.patches.push_back({0.0, model.x_grid_mm().back(), 0.0, model.y_grid_mm().back(), 1.0});
  const PlateField field = model.solve({unit});
  // The largest deflection over the nodes of bay 1,1 (request plan 0..4 m).
  double w_unit = 0.0;
  for (double x : model.node_x_mm())
    for (double y : model.node_y_mm()) {
      const double xr = x - member.offset_x_mm(), yr = y - member.offset_y_mm();
      if (xr >= -1e-6 && xr <= 4000.0 + 1e-6 && yr >= -1e-6 && yr <= 4000.0 + 1e-6)
        w_unit = std::max(w_unit, field.deflection_at(0, x, y));
    }
  const auto checks = calculated(r, "bay 1,1");
  REQUIRE(checks.size() == 2);
  CHECK(checks[0]->demand == Approx(w_unit * r.loads.Qk).epsilon(1e-3));
  CHECK(checks[1]->demand == Approx(w_unit * (2.0 * r.loads.Gk + r.loads.Qk)).epsilon(1e-3));
  // ℓ: the panel's longer span (both 4.0 m here), /360 and /240.
  CHECK(checks[0]->capacity == Approx(4000.0 / 360.0));
}

TEST_CASE("A two-way bay spanning to a free edge is calculated on its shorter side", "[plate_deflection][en1992]") {
  // 4.0 × 7.0 m, built in along x0, free along x1, pinned along y0 and
  // y1: no span/depth check (the bay is no two-way panel of 7.4.2), but
  // its deflection is calculated, against its shorter side/250 (7.4.1(4)).
  json req = strip_plate("EN1992-1-1", 1.5, 3.0);
  req["slab"]["y_spans_m"] = {7.0};
  req["slab"]["edges"] = {{"x0", "fixed"}, {"x1", "free"}, {"y0", "pinned"}, {"y1", "pinned"}};
  req["reinforcement"].erase("given");
  const DesignRecord r = design(registry(), req);
  const auto checks = calculated(r, "bay 1,1");
  REQUIRE(checks.size() == 1);
  CHECK(checks[0]->capacity == Approx(4000.0 / 250.0));
  CHECK(checks[0]->demand > 0.0);
}

TEST_CASE("A cracked flat slab symmetric about its diagonal deflects alike in x and y", "[plate_deflection][en1992][flat]") {
  // 3 × 3 square bays of 6.0 m on columns all round, 220 mm, cracked under
  // its quasi-permanent load: mirrored about the diagonal (outer layer x
  // becoming y), every panel must deflect as its mirror image (within the
  // iteration's tolerance) — a check of the bars each element takes in
  // each direction.
  json req = {{"code", "EN1992-1-1"},
              {"variant", "UK"},
              {"slab",
               {{"type", "flat"},
                {"x_spans_m", {6.0, 6.0, 6.0}},
                {"y_spans_m", {6.0, 6.0, 6.0}},
                {"columns", {{"size_mm", {400, 400}}, {"height_m", 3.5}}},
                {"thickness_mm", 220}}},
              {"loads", {{"dead_kPa", 2.0}, {"imposed_kPa", 4.0}, {"imposed_category", "C"}}},
              {"durability", {{"cover_mm", 25}}},
              {"concrete", {{"class", "C30/37"}}},
              {"reinforcement", {{"outer_layer", "x"}}},
              {"serviceability", {{"deflection", "calculated"}, {"creep_coefficient", 2.5}, {"shrinkage_strain", 0.0004}}}};
  const DesignRecord r = design(registry(), req);
  req["reinforcement"]["outer_layer"] = "y";
  const DesignRecord mirrored = design(registry(), req);
  // Mirrored about the diagonal, bay (i, j) is bay (j, i) with the bars'
  // layers swapped: outer x there is outer y here.
  const std::array<std::array<const char*, 2>, 3> mirror_pairs{
      {{"bay 1,2", "bay 2,1"}, {"bay 1,1", "bay 1,1"}, {"bay 3,2", "bay 2,3"}}};
  for (const auto& pair : mirror_pairs) {
    const auto a = calculated(r, pair[0]), m = calculated(mirrored, pair[1]);
    REQUIRE(a.size() == 1);
    REQUIRE(m.size() == 1);
    INFO(pair[0] << " " << a[0]->demand << " mm, mirrored " << pair[1] << " " << m[0]->demand << " mm");
    CHECK(a[0]->demand == Approx(m[0]->demand).epsilon(0.005));
  }
  // A corner panel, with two edges on columns, deflects the most.
  const auto corner = calculated(r, "bay 1,1"), middle = calculated(r, "bay 2,2");
  REQUIRE(middle.size() == 1);
  CHECK(corner[0]->demand > middle[0]->demand);
  CHECK(corner[0]->capacity == Approx(6000.0 / 250.0));
}
