// Durability per face (durability.top, durability.bottom) and hogging design
// moments at the support face (slab.support_widths_mm), through complete
// designs. Scenarios are our own: the balcony and the floor of the small
// community workshop building.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <set>

#include "armature/code.hpp"
#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

using nlohmann::json;

namespace {
armature::Registry& registry() {
  static armature::Registry reg({ARMATURE_CODE_DIR});
  return reg;
}

armature::DesignRecord design_steps(const json& req) {
  return armature::design(registry(), req, armature::Detail::steps);
}

const armature::RegionRecord& find_region(const armature::DesignRecord& r, const std::string& where) {
  for (const auto& g : r.regions)
    if (g.where == where) return g;
  throw std::runtime_error("no region " + where);
}

const armature::Check& find_check(const armature::RegionRecord& g, const std::string& id,
                                  const std::string& clause_part = "") {
  for (const auto& c : g.checks)
    if (c.id == id && c.clause.str().find(clause_part) != std::string::npos) return c;
  throw std::runtime_error("no check " + id + " at " + g.where);
}

const armature::Step& find_step(const armature::Check& c, const std::string& symbol) {
  for (const auto& s : c.steps)
    if (s.symbol == symbol) return s;
  throw std::runtime_error("no step " + symbol);
}

// The fields of the input problems of a request (nothing designed).
std::set<std::string> problem_fields(const json& req) {
  try {
    armature::design(registry(), req, armature::Detail::checks);
  } catch (const armature::InputError& e) {
    std::set<std::string> out;
    for (const auto& p : e.problems()) out.insert(p.field);
    return out;
  }
  return {};
}

// A balcony: a 1.5 m cantilever off the end of a 4.0 m floor span, h = 220
// mm (above 200 mm, so crack control applies, EN 7.3.3(1)).
json balcony_en() {
  return json::parse(R"({
    "code": "EN1992-1-1",
    "slab": {"spans_m": [1.5, 4.0], "ends": ["free", "pinned"], "thickness_mm": 220},
    "concrete": {"class": "C30/37"},
    "reinforcement": {"bars": ["10", "12"]},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0, "imposed_category": "C"}
  })");
}

json balcony_aci() {
  return json::parse(R"({
    "code": "ACI318-19",
    "slab": {"spans_m": [1.5, 4.0], "ends": ["free", "pinned"], "thickness_mm": 220},
    "concrete": {"cylinder_strength_MPa": 28},
    "reinforcement": {"bars": ["#4"]},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0}
  })");
}
}  // namespace

// EN 1992-1-1, C30/37, 50 years, recommended values:
//   top XC3: Table 4.3N S4, −1 slab geometry, no strength reduction (XC3
//     needs C35/45) → S3; Table 4.4N S3, XC2/XC3 → c_min,dur = 20 mm;
//     c_min = max(φ ≤ 12, 20, 10) = 20; + Δc_dev 10 (4.4.1.3) → c_nom 30.
//   bottom XC1: S4 − 1 − 1 (C30/37 for XC1) = S2; Table 4.4N S2, XC1 →
//     10 mm; c_min = max(φ, 10, 10) = φ: the same as the all-XC1 design.
//   Table 7.1N (recommended): w_max 0.3 mm for XC2–XC4, 0.4 mm for X0, XC1.
// (Values by the tables of EN 1992-1-1, from memory.)
TEST_CASE("Balcony EN with the top face XC3 takes the top cover and crack limit of XC3", "[faces][en]") {
  json per_face = balcony_en();
  per_face["durability"] = {{"top", {{"exposure", "XC3"}}}, {"bottom", {{"exposure", "XC1"}}}};
  json plain = balcony_en();
  plain["durability"] = {{"exposure", "XC1"}};
  const auto r = design_steps(per_face);
  const auto base = design_steps(plain);

  CHECK(r.cover_mm(armature::Face::top) == 30.0);
  CHECK(base.cover_mm(armature::Face::top) < 30.0);
  CHECK(r.cover_mm(armature::Face::bottom) == base.cover_mm(armature::Face::bottom));

  const auto& root = find_region(r, "support 2");
  REQUIRE(root.face == armature::Face::top);
  CHECK(root.cover_mm == 30.0);
  const auto& bending = find_check(root, "bending");
  CHECK(find_step(bending, "c_min,dur").result == 20.0);   // Table 4.4N S3, XC3
  CHECK(find_step(bending, "S").result == 3.0);            // Table 4.3N
  CHECK(find_step(bending, "c_min,dur").substituted.find("XC3 (top face)") != std::string::npos);
  CHECK(find_step(find_check(root, "cracking", "7.3.3 Table"), "w_max").result == Approx(0.3));  // Table 7.1N

  // The bottom face keeps XC1: its cover derivation, crack limit, bars
  // and checks are those of the all-XC1 design.
  const auto& span = find_region(r, "span 2");
  const auto& span_base = find_region(base, "span 2");
  CHECK(find_step(find_check(span, "bending"), "c_min,dur").result == 10.0);  // Table 4.4N S2, XC1
  CHECK(find_step(find_check(span, "cracking", "7.3.3 Table"), "w_max").result == Approx(0.4));  // Table 7.1N
  CHECK(span.bars.bar == span_base.bars.bar);
  CHECK(span.bars.spacing_mm == span_base.bars.spacing_mm);
  CHECK(span.d_mm == span_base.d_mm);
  REQUIRE(span.checks.size() == span_base.checks.size());
  for (std::size_t i = 0; i < span.checks.size(); ++i) {
    CHECK(span.checks[i].demand == span_base.checks[i].demand);
    CHECK(span.checks[i].capacity == span_base.checks[i].capacity);
  }
  // d of the top bars follows from the top face's cover.
  CHECK(root.d_mm == 220.0 - 30.0 - root.bars.diameter_mm / 2.0);
}

// The plain form applies to both faces: durability.exposure XC3 gives the
// same design as XC3 given per face on both.
TEST_CASE("Plain durability applies to both faces", "[faces][en]") {
  json plain = balcony_en();
  plain["durability"] = {{"exposure", "XC3"}, {"cover_mm", 35}};
  json per_face = balcony_en();
  per_face["durability"] = {{"top", {{"exposure", "XC3"}, {"cover_mm", 35}}},
                            {"bottom", {{"exposure", "XC3"}, {"cover_mm", 35}}}};
  const auto a = design_steps(plain), b = design_steps(per_face);
  REQUIRE(a.regions.size() == b.regions.size());
  for (std::size_t i = 0; i < a.regions.size(); ++i) {
    CHECK(a.regions[i].cover_mm == 35.0);
    CHECK(a.regions[i].bars.bar == b.regions[i].bars.bar);
    CHECK(a.regions[i].bars.spacing_mm == b.regions[i].bars.spacing_mm);
  }
  // A cover given on one face only: that face has it, the other is computed.
  json one = balcony_en();
  one["durability"] = {{"top", {{"cover_mm", 40}}}};
  const auto c = design_steps(one);
  CHECK(c.cover_mm(armature::Face::top) == 40.0);
  CHECK(find_check(find_region(c, "support 2"), "cover").capacity == 40.0);
  const auto computed = design_steps(balcony_en());
  CHECK(c.cover_mm(armature::Face::bottom) == computed.cover_mm(armature::Face::bottom));
  CHECK(c.cover_mm(armature::Face::bottom) < 40.0);
}

// ACI 318-19 Table 20.5.1.3.1 (from memory): not exposed to weather or in
// contact with ground, slabs with No.36 and smaller: 20 mm; exposed to
// weather, No.16 and smaller: 40 mm. #4 = No.13. 24.3.2 spacing with
// fs = 2/3 fy = 280 MPa: min(380 (280/fs) − 2.5 cc, 300 (280/fs)) =
// min(380 − 2.5 × 40, 300) = 280 mm at the top, min(330, 300) = 300 at the
// bottom (evaluated by hand).
TEST_CASE("Balcony ACI with the top face exposed to weather", "[faces][aci]") {
  json req = balcony_aci();
  req["durability"] = {{"top", {{"exposure", "weather"}}}};
  const auto r = design_steps(req);
  CHECK(r.cover_mm(armature::Face::top) == 40.0);
  CHECK(r.cover_mm(armature::Face::bottom) == 20.0);
  const auto& root = find_region(r, "support 2");
  CHECK(find_check(root, "cracking").capacity == Approx(280.0));
  CHECK(find_check(find_region(r, "span 2"), "cracking").capacity == Approx(300.0));
  CHECK(find_step(find_check(root, "bending"), "c").substituted == "weather (top face)");
}

// Two equal spans of 4.0 m, pinned ends, interior support 300 mm wide.
//   Gk = 25 × 0.2 + 1.0 = 6.0 kPa, Qk = 4.0 kPa; 6.10: w = 1.35 × 6.0 +
//   1.5 × 4.0 = 14.1 kN/m on the 1 m strip, both spans loaded governs.
//   Two equal spans under w (beam tables, from memory): M_c = wL²/8 =
//   28.2 kNm, R = 5wL/4 = 70.5 kN, V beside the support 5wL/8 = 35.25 kN.
//   Hand statics at the face a = t/2 = 0.15 m: M_face = M_c − V a + w a²/2
//     = 28.2 − 35.25 × 0.15 + 14.1 × 0.15²/2 = 23.071125 kNm.
//   5.3.2.2(3): max(M_face, 0.65 wL²/12 = 12.22) = 23.071125 kNm.
//   5.3.2.2(4) (5.9): 28.2 − 70.5 × 0.3/8 = 25.55625 kNm (the smaller
//   reduction, taken at an interior support whose kind is not given).
TEST_CASE("Support width EN interior support takes the smaller reduction of 5.3.2.2", "[faces][widths][en]") {
  json req = json::parse(R"({
    "code": "EN1992-1-1",
    "slab": {"spans_m": [4.0, 4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200,
             "support_widths_mm": [200, 300, 200]},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 4.0, "imposed_category": "C"}
  })");
  const auto r = design_steps(req);
  const auto& g = find_region(r, "support 2");
  CHECK(g.M_Ed * 1e-6 == Approx(25.55625).epsilon(1e-9));
  const auto& bending = find_check(g, "bending");
  CHECK(bending.clause.str() == "EN 1992-1-1 6.1; M_Ed 5.3.2.2(4)");
  CHECK(find_step(bending, "M_Ed,c").result == Approx(28.2).epsilon(1e-9));
  CHECK(find_step(bending, "M_Ed,face").result == Approx(23.071125).epsilon(1e-9));
  CHECK(find_step(bending, "M_fe").result == Approx(18.8).epsilon(1e-9));  // wL²/12
  CHECK(find_step(bending, "ΔM_Ed").result == Approx(70.5 * 0.3 / 8).epsilon(1e-9));
  CHECK(find_step(bending, "M_Ed,(3)").result == Approx(23.071125).epsilon(1e-9));

  // The spans and their shear are unchanged by the width (shear stays at
  // the centreline); a list of zeros is the design without widths.
  req["slab"].erase("support_widths_mm");
  const auto plain = design_steps(req);
  CHECK(find_region(plain, "support 2").M_Ed * 1e-6 == Approx(28.2).epsilon(1e-9));
  CHECK(find_region(plain, "span 1").M_Ed == find_region(r, "span 1").M_Ed);
  CHECK(plain.supports[1].V_Ed == r.supports[1].V_Ed);
  req["slab"]["support_widths_mm"] = {0, 0, 0};
  const auto zeros = design_steps(req);
  for (std::size_t i = 0; i < zeros.regions.size(); ++i) {
    CHECK(zeros.regions[i].M_Ed == plain.regions[i].M_Ed);
    CHECK(zeros.regions[i].bars.spacing_mm == plain.regions[i].bars.spacing_mm);
  }
}

// A 4.0 m span built in at both ends (fixed): w = 14.1 kN/m as above.
//   Beam tables (from memory): M_c = wL²/12 = 18.8 kNm, V = wL/2 = 28.2 kN.
//   t = 300: M_face = 18.8 − 28.2 × 0.15 + 14.1 × 0.15²/2 = 14.728625 kNm
//     ≥ 0.65 × 18.8 = 12.22 → 14.728625 kNm (5.3.2.2(3), at the face).
//   t = 1200: M_face = 18.8 − 28.2 × 0.6 + 14.1 × 0.6²/2 = 4.418 kNm
//     < 12.22: the note's lower bound 0.65 M_fe governs, 12.22 kNm.
TEST_CASE("Support width EN fixed end at the face with the 0.65 lower bound", "[faces][widths][en]") {
  json req = json::parse(R"({
    "code": "EN1992-1-1",
    "slab": {"spans_m": [4.0], "ends": ["fixed", "fixed"], "thickness_mm": 200,
             "support_widths_mm": [300, 300]},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 4.0, "imposed_category": "C"}
  })");
  auto r = design_steps(req);
  const auto& g = find_region(r, "support 1");
  CHECK(g.M_Ed * 1e-6 == Approx(14.728625).epsilon(1e-9));
  CHECK(find_check(g, "bending").clause.str() == "EN 1992-1-1 6.1; M_Ed at the face 5.3.2.2(3)");
  CHECK(find_region(r, "support 2").M_Ed * 1e-6 == Approx(14.728625).epsilon(1e-9));
  req["slab"]["support_widths_mm"] = {1200, 300};
  r = design_steps(req);
  CHECK(find_region(r, "support 1").M_Ed * 1e-6 == Approx(0.65 * 18.8).epsilon(1e-9));
  CHECK(find_region(r, "support 2").M_Ed * 1e-6 == Approx(14.728625).epsilon(1e-9));
}

// ACI 318-19 7.4.1.3 (from memory): slabs built integrally with supports,
// Mu at the face. Two 4.0 m spans, interior support 300 mm wide:
//   D = 23.6 × 0.2 + 1.0 = 5.72 kPa, L = 4.0 kPa; (5.3.1b) 1.2 D + 1.6 L =
//   13.264 kN/m, both spans loaded governs; M_c = wL²/8 = 26.528 kNm,
//   V = 5wL/8 = 33.16 kN; hand statics at a = 0.15 m:
//   Mu = 26.528 − 33.16 × 0.15 + 13.264 × 0.15²/2 = 21.70322 kNm.
TEST_CASE("Support width ACI moment at the face of support", "[faces][widths][aci]") {
  json req = json::parse(R"({
    "code": "ACI318-19",
    "slab": {"spans_m": [4.0, 4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200,
             "support_widths_mm": [200, 300, 200]},
    "concrete": {"cylinder_strength_MPa": 28},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 4.0}
  })");
  const auto r = design_steps(req);
  const auto& g = find_region(r, "support 2");
  CHECK(g.M_Ed * 1e-6 == Approx(21.70322).epsilon(1e-9));
  const auto& bending = find_check(g, "bending");
  CHECK(bending.clause.str() == "ACI 318-19 22.2, 21.2.2; Mu at the face 7.4.1.3");
  CHECK(find_step(bending, "Mu,c").result == Approx(26.528).epsilon(1e-9));
}

TEST_CASE("Bad durability per face and support widths are input errors naming the field", "[faces][input]") {
  auto en = balcony_en();
  auto fields = [&](json req) { return problem_fields(req); };
  using S = std::set<std::string>;

  json a = en;
  a["durability"] = {{"exposure", "XC1"}, {"top", {{"exposure", "XC3"}, {"colour", "grey"}}},
                     {"bottom", {{"exposure", "XC7"}}}};
  CHECK(fields(a) == S{"durability.top.exposure", "durability.top.colour", "durability.bottom.exposure"});

  json b = en;
  b["durability"] = {{"cover_mm", 25}, {"bottom", {{"cover_mm", 30}}}, {"top", "XC3"}};
  CHECK(fields(b) == S{"durability.bottom.cover_mm", "durability.top"});

  json c = en;
  c["durability"] = {{"top", {{"cover_mm", 120}}}, {"bottom", {{"cover_mm", -5}}}};
  CHECK(fields(c) == S{"durability.top.cover_mm", "durability.bottom.cover_mm"});

  json d = en;
  d["durability"] = {{"top", {{"exposure", 3}}}};
  CHECK(fields(d) == S{"durability.top.exposure"});

  json e = balcony_aci();
  e["durability"] = {{"top", {{"exposure", "XC3"}}}};
  CHECK(fields(e) == S{"durability.top.exposure"});

  json f = en;  // spans [1.5, 4.0], free left end
  f["slab"]["support_widths_mm"] = {0, 300};
  CHECK(fields(f) == S{"slab.support_widths_mm"});
  f["slab"]["support_widths_mm"] = {100, 300, 200};
  CHECK(fields(f) == S{"slab.support_widths_mm[0]"});
  f["slab"]["support_widths_mm"] = {0, -300, "wide"};
  CHECK(fields(f) == S{"slab.support_widths_mm[1]", "slab.support_widths_mm[2]"});
  f["slab"]["support_widths_mm"] = {0, 3000, 200};  // the root's face past the 1.5 m cantilever's tip
  CHECK(fields(f) == S{"slab.support_widths_mm[1]"});
  f["slab"]["support_widths_mm"] = "300";
  CHECK(fields(f) == S{"slab.support_widths_mm"});

  // Everything at once, nothing designed.
  json g = en;
  g["slab"]["support_widths_mm"] = {0, 300};
  g["durability"] = {{"exposure", "XC1"}, {"top", {{"exposure", "XC3"}}}};
  g["loads"]["imposed_kPa"] = -1;
  CHECK(fields(g) == S{"slab.support_widths_mm", "durability.top.exposure", "loads.imposed_kPa"});
}

// A 1.5 m cantilever built into a wall 300 mm thick (ends free, fixed):
// the root is a fixed end, so 5.3.2.2(3). w = 14.1 kN/m as above; hand
// statics of a cantilever under w, a from the root: M = w (L − a)²/2:
//   centreline 14.1 × 1.5²/2 = 15.8625 kNm; face (a = 0.15 m)
//   14.1 × 1.35²/2 = 12.848625 kNm ≥ 0.65 × 15.8625 = 10.31 → 12.848625.
TEST_CASE("Support width EN cantilever built into a wall at the face", "[faces][widths][en]") {
  json req = json::parse(R"({
    "code": "EN1992-1-1",
    "slab": {"spans_m": [1.5], "ends": ["free", "fixed"], "thickness_mm": 200,
             "support_widths_mm": [0, 300]},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 4.0, "imposed_category": "C"}
  })");
  const auto r = design_steps(req);
  const auto& g = find_region(r, "support 2");
  CHECK(g.M_Ed * 1e-6 == Approx(12.848625).epsilon(1e-9));
  const auto& bending = find_check(g, "bending");
  CHECK(bending.clause.str() == "EN 1992-1-1 6.1; M_Ed at the face 5.3.2.2(3)");
  CHECK(find_step(bending, "M_Ed,c").result == Approx(15.8625).epsilon(1e-9));
  CHECK(find_step(bending, "M_fe").result == Approx(15.8625).epsilon(1e-9));
}

TEST_CASE("the durability defaults are named by the field a request leaves out", "[faces]") {
  // The record lists the defaults a request leaves out, by field: a value
  // given on one face only leaves the other face's field (not the plain
  // one, which would read as if both faces took the default).
  auto defaults_of = [](const json& durability) {
    armature::InputProblems problems;
    json j = {{"code", "EN1992-1-1"},
              {"slab", {{"spans_m", {4.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 200}}},
              {"concrete", {{"class", "C30/37"}}},
              {"loads", {{"dead_kPa", 1.0}, {"imposed_kPa", 3.0}}}};
    if (!durability.is_null()) j["durability"] = durability;
    const armature::Request req = armature::request_from_json(j, problems);
    REQUIRE(problems.empty());
    std::set<std::string> fields;
    for (const auto& d : armature::durability_defaults(req, {"XC1", "XC1"}, "basis", "cover", "basis"))
      fields.insert(d.field);
    return fields;
  };
  CHECK(defaults_of(json()) == std::set<std::string>{"durability.exposure", "durability.cover_mm"});
  CHECK(defaults_of({{"top", {{"exposure", "XC1"}, {"cover_mm", 30}}}}) ==
        std::set<std::string>{"durability.bottom.exposure", "durability.bottom.cover_mm"});
  CHECK(defaults_of({{"top", {{"cover_mm", 30}}}, {"bottom", {{"cover_mm", 25}}}}) ==
        std::set<std::string>{"durability.exposure"});
  CHECK(defaults_of({{"exposure", "XC1"}, {"cover_mm", 25}}).empty());
}

// The support-width checks hold for a Request built in C++ as for JSON
// (the kernel's scope checks): every problem an input error naming
// slab.support_widths_mm, nothing designed. Spans [1.5, 4.0], free left end.
TEST_CASE("Support widths of a Request built in C++ are checked against the strip", "[faces][widths][input]") {
  armature::InputProblems read;
  const armature::Request base = armature::request_from_json(balcony_en(), read);
  REQUIRE(read.empty());
  using S = std::set<std::string>;
  auto fields = [&](std::vector<double> widths) {
    armature::Request req = base;
    req.slab.support_widths_mm = std::move(widths);
    S out;
    try {
      armature::design(registry(), req);
    } catch (const armature::InputError& e) {
      for (const auto& p : e.problems()) out.insert(p.field);
    }
    return out;
  };
  CHECK(fields({0, 300}) == S{"slab.support_widths_mm"});        // 2 entries for 2 spans: 3 needed
  CHECK(fields({0, 300, 200, 0}) == S{"slab.support_widths_mm"});  // one too many
  CHECK(fields({100, 300, 200}) == S{"slab.support_widths_mm[0]"});  // width at the free end
  CHECK(fields({0, -300, NAN}) == S{"slab.support_widths_mm[1]", "slab.support_widths_mm[2]"});
  CHECK(fields({0, INFINITY, 200}) == S{"slab.support_widths_mm[1]"});
  CHECK(fields({0, 3000, 200}) == S{"slab.support_widths_mm[1]"});  // the root's face past the tip
  CHECK(fields({0, 300, 200}).empty());  // the same widths accepted: a design
}

// A pinned end has no hogging moment for a width to reduce: a width given
// there is not used, and the result says so (the pinned end of the
// analysis carries no moment: common practice).
TEST_CASE("A support width at a pinned end is not used and the result says so", "[faces][widths]") {
  json req = json::parse(R"({
    "code": "EN1992-1-1",
    "slab": {"spans_m": [4.0, 4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200,
             "support_widths_mm": [200, 300, 250]},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 4.0, "imposed_category": "C"}
  })");
  const auto r = design_steps(req);
  auto has = [](const armature::DesignRecord& rec, const std::string& text) {
    return std::any_of(rec.warnings.begin(), rec.warnings.end(),
                       [&](const std::string& w) { return w.find(text) != std::string::npos; });
  };
  CHECK(has(r, "support 1: the support width of 200 mm is not used for the design moment (pinned end: no hogging moment to reduce)"));
  CHECK(has(r, "support 3: the support width of 250 mm is not used for the design moment (pinned end: no hogging moment to reduce)"));
  CHECK_FALSE(has(r, "support 2: the support width"));
  // The same design as with no width at the ends: nothing else changes.
  req["slab"]["support_widths_mm"] = {0, 300, 0};
  const auto inner = design_steps(req);
  CHECK_FALSE(has(inner, "is not used (pinned end"));
  REQUIRE(inner.regions.size() == r.regions.size());
  for (std::size_t i = 0; i < r.regions.size(); ++i) {
    CHECK(r.regions[i].M_Ed == inner.regions[i].M_Ed);
    CHECK(r.regions[i].bars.spacing_mm == inner.regions[i].bars.spacing_mm);
  }
  CHECK(r.max_utilisation == inner.max_utilisation);
}

// loads.actions of a Request built in C++ are checked as the JSON reader
// checks them: each bad field an input error naming it, nothing designed
// (a point load spread over no width would divide by zero).
TEST_CASE("Actions of a Request built in C++ are checked against the strip", "[actions][input]") {
  armature::InputProblems read;
  json j = balcony_en();
  j["loads"]["actions"] = json::array({{{"name", "kiln"}, {"kind", "imposed"}, {"category", "E"},
                                        {"point_kN", 8.0}, {"span", 2}, {"at_m", 2.0},
                                        {"effective_width_m", 1.2}}});
  const armature::Request base = armature::request_from_json(j, read);
  REQUIRE(read.empty());
  using S = std::set<std::string>;
  auto fields = [&](auto edit) {
    armature::Request req = base;
    edit(req.loads.actions.at(0));
    S out;
    try {
      armature::design(registry(), req);
    } catch (const armature::InputError& e) {
      for (const auto& p : e.problems()) out.insert(p.field);
    }
    return out;
  };
  CHECK(fields([](armature::Action& a) { a.effective_width_mm = 0.0; }) ==
        S{"loads.actions[0].effective_width_m"});
  CHECK(fields([](armature::Action& a) { a.span = 7; }) == S{"loads.actions[0].span"});
  CHECK(fields([](armature::Action& a) { a.at_mm = 4500.0; }) == S{"loads.actions[0].at_m"});  // span 4.0 m
  CHECK(fields([](armature::Action& a) { a.category = "Z"; }).count("loads.actions[0].category") == 1);
  CHECK(fields([](armature::Action& a) { a.value = NAN; }) == S{"loads.actions[0]"});
  CHECK(fields([](armature::Action&) {}).empty());  // as read: a design
}
