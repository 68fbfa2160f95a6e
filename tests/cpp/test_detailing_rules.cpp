// Detailing rules of both codes (anchorage, shift, laps, support
// embedment) against the clauses evaluated by hand and the ACI development
// length values.
#include <catch2/catch.hpp>

#include <cmath>
#include <nlohmann/json.hpp>

#include "aci318/rules.hpp"
#include "aci318/us_customary.hpp"
#include "armature/code.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "en1992/rules.hpp"

namespace {

struct Session {
  armature::Request request;
  std::shared_ptr<const armature::DesignCode> code;
  std::unique_ptr<armature::SlabChecker> checker;
};

Session session_of(const nlohmann::json& req) {
  static armature::Registry reg({ARMATURE_CODE_DIR});
  Session out;
  armature::InputProblems problems;
  out.request = armature::request_from_json(req, problems);
  REQUIRE(problems.empty());
  out.code = reg.open(out.request.code, out.request.variant.value_or(""));
  out.code->validate(out.request, problems);
  REQUIRE(problems.empty());
  out.checker = out.code->begin(out.request);
  return out;
}

// The workshop floor: a 200 mm strip over 4.2 m (our own scenario).
nlohmann::json workshop_en(double h, const char* cls) {
  return {{"code", "EN1992-1-1"},
          {"variant", "recommended"},
          {"slab", {{"spans_m", {4.2}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", h}}},
          {"concrete", {{"class", cls}}},
          {"loads", {{"dead_kPa", 1.5}, {"imposed_kPa", 4.0}}}};
}

// The same floor to ACI 318-19 (SI): 180 mm, f'c 28 MPa.
nlohmann::json aci_strip_request() {
  return {{"code", "ACI318-19"},
          {"slab", {{"spans_m", {4.2}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 180}}},
          {"concrete", {{"cylinder_strength_MPa", 28}}},
          {"loads", {{"dead_kPa", 1.5}, {"imposed_kPa", 4.0}}}};
}

// No. 13 bars at 200 mm in the 180 mm ACI strip, 20 mm cover: d = 180 −
// 20 − 12.7/2 = 153.65 mm, As = 129 × 1000/200 = 645 mm²/m.
armature::BarDetailDemand no13_at_200() {
  armature::BarDetailDemand b;
  b.where = "span 1";
  b.diameter_mm = 12.7;
  b.spacing_mm = 200;
  b.cover_mm = 20;
  b.d_mm = 153.65;
  b.As_prov_mm2 = 129 * 1000 / 200.0;
  return b;
}

armature::BarDetailDemand bar12(armature::Face face, double cover) {
  armature::BarDetailDemand b;
  b.where = "span 1";
  b.face = face;
  b.diameter_mm = 12;
  b.spacing_mm = 175;
  b.cover_mm = cover;
  b.d_mm = 200 - cover - 6;
  b.As_prov_mm2 = 113.1 * 1000 / 175;
  return b;
}

}  // namespace

TEST_CASE("EN 8.4 bond stress and basic anchorage, 12 mm bar in C30/37", "[detailing][en1992]") {
  using namespace armature::en1992;
  const double fctm = mean_tensile_strength(30);
  const double fctd = design_tensile_strength(fctm, 1.0, 1.5);
  // 3.1.6(2): 1.0 × 0.7 × 2.896 / 1.5 = 1.352 (clause evaluated by hand).
  CHECK(fctd == Approx(1.3515).epsilon(0.001));
  const double fbd = design_bond_stress(bond_quality_factor(true), bar_size_bond_factor(12), fctd);
  // fbd ≈ 3.0 MPa for C30/37, good bond (value from memory).
  CHECK(fbd == Approx(3.0).epsilon(0.02));
  CHECK(fbd == Approx(3.041).epsilon(0.001));  // 2.25 × 1.3515, by hand
  const double fyd = 500.0 / 1.15;
  const double lb = basic_anchorage_length(12, fyd, fbd);
  // lb,rqd ≈ 435 mm (value from memory, with fbd = 3.0); 3 × 434.8 / 3.041 = 428.9 by hand.
  CHECK(lb == Approx(435).epsilon(0.02));
  CHECK(lb == Approx(428.9).epsilon(0.001));
  // Poor bond: η1 = 0.7, so lb,rqd is 1/0.7 times as long (8.4.2(2)).
  const double fbd_poor = design_bond_stress(bond_quality_factor(false), 1.0, fctd);
  CHECK(basic_anchorage_length(12, fyd, fbd_poor) == Approx(lb / 0.7).epsilon(1e-9));
  // η2 for large bars: (132 − 40)/100 = 0.92 (8.4.2(2)).
  CHECK(bar_size_bond_factor(40) == Approx(0.92));
  CHECK(bar_size_bond_factor(32) == 1.0);
  // 8.4.2(2): fctk,0.05 for bond no higher than C60/75's. fctm(C60/75) =
  // 2.12 ln(1 + 68/10) = 4.35 MPa (Table 3.1, by hand); C50/60 is below it.
  CHECK(bond_mean_tensile_strength(mean_tensile_strength(70)) == Approx(4.355).epsilon(0.001));
  CHECK(bond_mean_tensile_strength(mean_tensile_strength(90)) == Approx(4.355).epsilon(0.001));
  CHECK(bond_mean_tensile_strength(mean_tensile_strength(50)) == Approx(mean_tensile_strength(50)));
  // lb,min = max(0.3 × 428.9, 120, 100) = 128.7 (8.6, by hand).
  CHECK(minimum_anchorage_length(lb, 12) == Approx(128.67).epsilon(0.001));
  CHECK(minimum_anchorage_length(200, 16) == 160);
  CHECK(minimum_anchorage_length(200, 8) == 100);
}

TEST_CASE("EN 8.4.4 design anchorage by hand, 12 mm bar in C25/30", "[detailing][en1992]") {
  using namespace armature::en1992;
  // EN 1992-1-1 evaluated by hand for φ 12, C25/30, σsd = 434.78 MPa:
  // fctm = 0.30 × 25^(2/3) = 2.565, fctk,0.05 = 0.7 × 2.565 = 1.795 (Table 3.1),
  // fctd = 1.795 / 1.5 = 1.197 (3.1.6(2)); good bond fbd = 2.25 × 1.197 = 2.69 (8.2);
  // lb,rqd = (12/4)(434.78 / 2.69) = 484 mm (8.3); cd = 35 mm: α2 = 1 − 0.15 (35 − 12)/12
  // = 0.7125 (Table 8.2); lb,min = max(0.3 × 484, 120, 100) = 145 mm (8.6);
  // lbd = 0.7125 × 484 = 345 mm (8.4). Poor bond (η1 = 0.7): lb,rqd = 692 mm, lbd = 493 mm.
  const double fctd = design_tensile_strength(mean_tensile_strength(25), 1.0, 1.5);
  const double fbd = design_bond_stress(1.0, 1.0, fctd);
  CHECK(fbd == Approx(2.69).epsilon(0.005));
  const double lb = basic_anchorage_length(12, 434.78, fbd);
  CHECK(lb == Approx(484).epsilon(0.005));
  const double a2 = cover_factor_straight(35, 12);
  CHECK(a2 == Approx(0.71).epsilon(0.005));
  const double lb_min = minimum_anchorage_length(lb, 12);
  CHECK(lb_min == Approx(145).epsilon(0.005));
  CHECK(design_anchorage_length(1, a2, 1, 1, 1, lb, lb_min) == Approx(345).epsilon(0.005));
  const double lb_poor = basic_anchorage_length(12, 434.78, design_bond_stress(0.7, 1.0, fctd));
  CHECK(lb_poor == Approx(692).epsilon(0.005));
  CHECK(design_anchorage_length(1, a2, 1, 1, 1, lb_poor, minimum_anchorage_length(lb_poor, 12)) ==
        Approx(493).epsilon(0.005));
  // α2 within 0.7 to 1.0 (Table 8.2): cover at most φ gives 1.0; large cover 0.7.
  CHECK(cover_factor_straight(10, 12) == 1.0);
  CHECK(cover_factor_straight(100, 12) == 0.7);
  // α2 α3 α5 ≥ 0.7 (8.4.4(1)).
  CHECK(design_anchorage_length(1, 0.7, 0.9, 1, 1, 400, 100) == Approx(280));
}

TEST_CASE("EN Figure 8.2 bond conditions of horizontal bars", "[detailing][en1992]") {
  using namespace armature::en1992;
  // 8.4.2(2), Figure 8.2 (value from memory).
  CHECK(good_bond_position(200, 170));   // h ≤ 250 mm: good throughout
  CHECK(good_bond_position(250, 220));
  CHECK(good_bond_position(300, 40));    // within 250 mm of the bottom
  CHECK_FALSE(good_bond_position(300, 265));
  CHECK(good_bond_position(700, 380));   // over 600 mm: more than 300 mm below the top
  CHECK_FALSE(good_bond_position(700, 650));
}

TEST_CASE("EN 8.7.3 lap lengths and alpha6", "[detailing][en1992]") {
  using namespace armature::en1992;
  // Table 8.3 (value from memory): < 25 % 1.0, 33 % 1.15, 50 % 1.4, > 50 % 1.5.
  CHECK(lap_share_factor(25) == 1.0);
  CHECK(lap_share_factor(33) == Approx(1.15).epsilon(0.005));
  CHECK(lap_share_factor(50) == Approx(1.4).epsilon(0.011));
  CHECK(lap_share_factor(100) == 1.5);
  // (8.11): l0,min = max(0.3 α6 lb,rqd, 15 φ, 200): 0.3 × 1.5 × 429 = 193 < 15 × 12 = 180? no: 200 mm.
  CHECK(minimum_lap_length(1.5, 429, 12) == Approx(200));
  CHECK(minimum_lap_length(1.5, 600, 12) == Approx(270));
  CHECK(minimum_lap_length(1.0, 300, 16) == Approx(240));
  // (8.10): 1.0 × 0.8375 × 1.414 × 428.9 = 508 mm, by hand.
  CHECK(design_lap_length(1, 0.8375, 1, 1, std::sqrt(2.0), 428.9, 200) == Approx(508.0).epsilon(0.002));
  // 9.2.1.3(2): al = d; 9.2.1.4(2): FE = V al/z; 9.2.1.5(1): 10 φ.
  CHECK(tensile_force_shift(168) == 168);
  CHECK(end_support_tensile_force(-30e3, 168, 0.9 * 168) == Approx(33333.3).epsilon(1e-4));
  CHECK(interior_support_minimum_embedment(12) == 120);
}

TEST_CASE("EN detailing rules of a session give the clause values with their steps", "[detailing][en1992]") {
  const Session s = session_of(workshop_en(200, "C30/37"));
  const armature::DetailingRules* rules = s.checker->detailing_rules();
  REQUIRE(rules != nullptr);
  auto b = bar12(armature::Face::bottom, 25);
  // cd = min(163/2, 25) = 25, α2 = 1 − 0.15 × 13/12 = 0.8375; lbd = 0.8375 × 428.9 = 359.2 (by hand).
  const auto a = rules->anchorage(b);
  CHECK(a.length_mm == Approx(359.2).epsilon(0.002));
  CHECK(a.clause == "EN 1992-1-1 8.4.4");
  CHECK(a.steps.size() >= 7);
  // Poor bond as the request states: lb,rqd / 0.7.
  b.bond = armature::BondChoice::poor;
  CHECK(rules->anchorage(b).length_mm == Approx(359.2 / 0.7).epsilon(0.002));
  b.bond = armature::BondChoice::automatic;
  // Shift al = d = 169 mm.
  CHECK(rules->shift(b).length_mm == 169);
  // End support: FE = 30 kN × d/(0.9 d) = 33.3 kN, σ = 33 333 / 646.3 = 51.6 MPa,
  // lb,rqd = 3 × 51.6 / 3.041 = 50.9, × α2 = 42.6; lb,min = max(0.3 × 428.9, 120, 100) = 128.7.
  b.V_Ed_N = 30e3;
  CHECK(rules->end_support_anchorage(b).length_mm == Approx(128.7).epsilon(0.002));
  CHECK(rules->interior_support_embedment(b).length_mm == 120);
  // Lap, alternate bars lapped (50 %): α6 = √2, l0 = 0.8375 × 1.414 × 428.9 = 508.
  b.lapped_share = 0.5;
  const auto lap = rules->lap(b);
  CHECK(lap.length_mm == Approx(508.0).epsilon(0.002));
  CHECK(lap.clause == "EN 1992-1-1 8.7.3");
}

TEST_CASE("EN bond of top bars in a thick slab is poor by Figure 8.2", "[detailing][en1992]") {
  const Session s = session_of(workshop_en(320, "C30/37"));
  const armature::DetailingRules* rules = s.checker->detailing_rules();
  auto top = bar12(armature::Face::top, 25);
  top.d_mm = 320 - 31;
  auto bottom = bar12(armature::Face::bottom, 25);
  // Top bar 289 mm above the bottom of a 320 mm slab: poor (η1 = 0.7).
  CHECK(rules->anchorage(top).length_mm == Approx(rules->anchorage(bottom).length_mm / 0.7).epsilon(1e-6));
}

TEST_CASE("A forwarding detailing rules object changes only what it overrides", "[detailing]") {
  const Session s = session_of(workshop_en(200, "C30/37"));
  struct LongerLaps : armature::ForwardingDetailingRules {
    using ForwardingDetailingRules::ForwardingDetailingRules;
    armature::DetailLength lap(const armature::BarDetailDemand& b) const override {
      auto l = inner().lap(b);
      l.length_mm *= 1.2;
      return l;
    }
  };
  const LongerLaps house(*s.checker->detailing_rules());
  const auto b = bar12(armature::Face::bottom, 25);
  CHECK(house.anchorage(b).length_mm == s.checker->detailing_rules()->anchorage(b).length_mm);
  CHECK(house.lap(b).length_mm == Approx(1.2 * s.checker->detailing_rules()->lap(b).length_mm));
}

TEST_CASE("ACI 25.4.2.3 development length of a No. 13 bar, f'c 28 MPa, fy 420", "[detailing][aci318]") {
  using namespace armature::aci318;
  // ld = fy ψt ψe db / (2.1 λ √f'c) = 420 × 12.7 / (2.1 × 5.292) = 480 mm
  // (25.4.2.3, value from memory of the clause; ≈ 38 db).
  const double rf = std::sqrt(28.0);
  const double ld = development_length_simplified(420, rf, 1.0, 1.0, 1.0, 1.0, 12.7, true);
  CHECK(ld == Approx(480.0).epsilon(0.002));
  // Top bars (more than 300 mm of concrete below): ψt = 1.3.
  CHECK(casting_position_factor(310) == 1.3);
  CHECK(casting_position_factor(150) == 1.0);
  CHECK(development_length_simplified(420, rf, 1.3, 1.0, 1.0, 1.0, 12.7, true) == Approx(1.3 * ld));
  // ψt ψe ≤ 1.7 (25.4.2.2).
  CHECK(development_length_simplified(420, rf, 1.3, 1.5, 1.0, 1.0, 12.7, true) == Approx(1.7 * ld));
  // No. 22 and larger: 1.7 in place of 2.1; other cases 1.4 and 1.1.
  CHECK(development_length_simplified(420, rf, 1, 1, 1, 1, 22.2, true) == Approx(420 * 22.2 / (1.7 * rf)));
  CHECK(development_length_simplified(420, rf, 1, 1, 1, 1, 12.7, false) == Approx(420 * 12.7 / (1.4 * rf)));
  // ψg by grade (25.4.2.5): 1.0, 1.15, 1.3.
  CHECK(reinforcement_grade_factor(420) == 1.0);
  CHECK(reinforcement_grade_factor(550) == 1.15);
  CHECK(reinforcement_grade_factor(690) == 1.3);
  CHECK(bar_size_factor(19.1) == 0.8);
  CHECK(bar_size_factor(22.2) == 1.0);
  // 25.4.2.4: cb = min(20 + 6.35, 100) = 26.35, /12.7 = 2.075;
  // ld = 420 × 0.8 × 12.7 / (1.1 × 5.292 × 2.075) = 353.3 mm (by hand).
  CHECK(development_length_general(420, rf, 1, 1, 0.8, 1, 1.0, 12.7, 26.35) == Approx(353.3).epsilon(0.002));
  // (cb + Ktr)/db ≤ 2.5.
  CHECK(development_length_general(420, rf, 1, 1, 1, 1, 1.0, 12.7, 100) ==
        Approx(420 * 12.7 / (1.1 * rf * 2.5)));
  // Laps (25.5.2.1): Class B 1.3 ld; at least 300 mm.
  CHECK(tension_lap_length(480, false) == Approx(624));
  CHECK(tension_lap_length(480, true) == Approx(480));
  CHECK(tension_lap_length(200, true) == 300);
  // 7.7.3.3: max(d, 12 db).
  CHECK(extension_beyond_cutoff(150, 12.7) == Approx(152.4));
  CHECK(extension_beyond_cutoff(180, 12.7) == 180);
}

TEST_CASE("ACI in-lb development length of a #4 bar, 4000 psi, Grade 60", "[detailing][aci318]") {
  using namespace armature::aci318::inch_pound;
  // 25.4.2.3: 60 000 × 0.5 / (25 × 63.25) = 18.97 in, about 19 in (value from memory).
  const double ld = development_length_simplified(60000, std::sqrt(4000.0), 1, 1, 1, 1, 0.5, true);
  CHECK(ld == Approx(18.97).epsilon(0.002));
  CHECK(tension_lap_length(ld, false) == Approx(1.3 * ld));
  CHECK(tension_lap_length(8, false) == 12);  // 12 in minimum
  CHECK(casting_position_factor(12.5) == 1.3);
}

TEST_CASE("ACI detailing rules of a session, SI and US variants", "[detailing][aci318]") {
  nlohmann::json req = aci_strip_request();
  const Session si = session_of(req);
  const armature::DetailingRules* rules = si.checker->detailing_rules();
  REQUIRE(rules != nullptr);
  armature::BarDetailDemand b = no13_at_200();
  // min(480.0 by 25.4.2.3, 353.3 by 25.4.2.4) = 353.3 mm ≥ 300 mm.
  CHECK(rules->anchorage(b).length_mm == Approx(353.3).epsilon(0.002));
  CHECK(rules->lap(b).length_mm == Approx(1.3 * 353.3).epsilon(0.002));
  CHECK(rules->shift(b).length_mm == Approx(153.65));
  CHECK(rules->end_support_anchorage(b).length_mm == 150);
  // A small bar at wide spacing: the 300 mm floor of 25.4.2.1.
  b.diameter_mm = 9.5;
  b.spacing_mm = 300;
  b.cover_mm = 40;
  CHECK(rules->anchorage(b).length_mm == Approx(std::max(300.0, 420 * 0.8 * 9.5 / (1.1 * std::sqrt(28.0) * 2.5))));
  CHECK(rules->anchorage(b).length_mm == 300);
  // 25.5.2.1 takes ld of 25.4.2.1(a), without the 300 mm floor:
  // 9.5 mm bar, cb = min(40 + 4.75, 150) = 44.75, /9.5 = 4.71 → 2.5;
  // ld = 420 × 0.8 × 9.5 / (1.1 × 5.292 × 2.5) = 219.3 mm; lst = 1.3 × 219.3 = 285.1 < 300 mm → 300 mm;
  // 12.7 mm bar at 450 mm, cover 40: ld = 420 × 0.8 × 12.7 / (1.1 × 5.292 × 2.5) = 293.2 mm (below the floor),
  // lst = 1.3 × 293.2 = 381.2 mm, not 1.3 × 300 = 390 mm (by hand).
  CHECK(rules->lap(b).length_mm == 300);
  b.diameter_mm = 12.7;
  b.spacing_mm = 450;
  CHECK(rules->anchorage(b).length_mm == 300);
  CHECK(rules->lap(b).length_mm == Approx(381.2).epsilon(0.002));

  req["variant"] = "US";
  req["concrete"] = {{"cylinder_strength", "4000 psi"}};
  req["slab"] = {{"spans", {"14 ft"}}, {"ends", {"pinned", "pinned"}}, {"thickness", "7 in"}};
  req["loads"] = {{"dead", "15 psf"}, {"imposed", "65 psf"}};
  const Session us = session_of(req);
  const armature::DetailingRules* usr = us.checker->detailing_rules();
  armature::BarDetailDemand u;
  u.where = "span 1";
  u.face = armature::Face::top;
  u.diameter_mm = 0.5 * 25.4;
  u.spacing_mm = 12 * 25.4;
  u.cover_mm = 0.75 * 25.4;
  u.d_mm = 6.0 * 25.4;
  u.As_prov_mm2 = 0.2 * 645.16;
  u.bond = armature::BondChoice::poor;  // ψt = 1.3
  // 25.4.2.3: 1.3 × 18.97 = 24.66 in; 25.4.2.4: cb = min(1.0, 6) = 1.0 in, /0.5 = 2;
  // (3/40)(60 000/63.25) × 1.3 × 0.8 × 0.5 / 2 = 18.50 in: the smaller, 18.50 in.
  CHECK(usr->anchorage(u).length_mm / 25.4 == Approx(18.50).epsilon(0.002));
  CHECK(usr->end_support_anchorage(u).length_mm == Approx(6 * 25.4));
}

TEST_CASE("EN 9.3.1.2(2) top bars at a simple end run 0.2 of the span", "[detailing][en1992]") {
  CHECK(armature::en1992::partial_fixity_bar_extent(4200) == Approx(840));
  const Session s = session_of(workshop_en(200, "C30/37"));
  const auto l = s.checker->detailing_rules()->end_top_bar_extent(bar12(armature::Face::top, 25), 4200);
  CHECK(l.length_mm == Approx(840));
  CHECK(l.clause == "EN 1992-1-1 9.3.1.2(2)");
  // The forwarding base passes it on.
  const armature::ForwardingDetailingRules fwd(*s.checker->detailing_rules());
  CHECK(fwd.end_top_bar_extent(bar12(armature::Face::top, 25), 3000).length_mm == Approx(600));
}

TEST_CASE("EN 8.3 and 8.4.4(2) standard bend clause functions", "[detailing][en1992][hooks]") {
  using namespace armature::en1992;
  // Table 8.1N (value from memory): φm,min = 4 φ for φ ≤ 16 mm, 7 φ above.
  CHECK(minimum_mandrel_diameter(12) == Approx(48));
  CHECK(minimum_mandrel_diameter(16) == Approx(64));
  CHECK(minimum_mandrel_diameter(20) == Approx(140));
  // Table 8.2 (value from memory): α1 = 0.7 for a bent bar where cd > 3 φ, else 1.0.
  CHECK(shape_factor_bent(37, 12) == 0.7);
  CHECK(shape_factor_bent(36, 12) == 1.0);
  // 8.4.4(2): lb,eq = α1 lb,rqd; 0.7 × 428.9 = 300.2 mm (hand evaluation of EN 1992-1-1 8.4.4).
  CHECK(equivalent_anchorage_length_bent(0.7, 428.88) == Approx(300.22).epsilon(0.001));
  // Figure 8.1 b (value from memory): 5 φ past the bend.
  CHECK(standard_bend_extension(12) == Approx(60));
}

TEST_CASE("EN hooked anchorage of a session: 12 mm and 20 mm bars in C30/37", "[detailing][en1992][hooks]") {
  const Session s = session_of(workshop_en(200, "C30/37"));
  const armature::DetailingRules* rules = s.checker->detailing_rules();
  auto b = bar12(armature::Face::bottom, 25);
  // At fyd: cd = a/2 = (175 − 12)/2 = 81.5 > 3 × 12 = 36, α1 = 0.7;
  // lb,eq = 0.7 × 428.9 = 300.2 mm (hand evaluation of EN 1992-1-1 8.4.4(2), lb,rqd of the test above).
  const auto h = rules->hooked_anchorage(b);
  CHECK(h.length_mm == Approx(300.2).epsilon(0.002));
  CHECK(h.length_mm == Approx(0.7 * rules->anchorage(b).length_mm / 0.8375).epsilon(0.002));  // α2 = 0.8375 straight
  CHECK(h.bend_diameter_mm == Approx(48));  // 4 φ, Table 8.1N (value from memory)
  CHECK(h.extension_mm == Approx(60));      // 5 φ, Figure 8.1 b (value from memory)
  CHECK(h.clause == "EN 1992-1-1 8.3, 8.4.4(2)");
  // At an end support, at σsd = FE/As: 3 × 51.6 / 3.041 = 50.9 mm, × 0.7 = 35.6 mm (by hand, as above),
  // below lb,min = max(0.3 × 428.9, 10 × 12, 100) = 128.7 mm (8.6, lb,rqd at fyd), which governs.
  b.V_Ed_N = 30e3;
  b.at_end_support = true;
  CHECK(rules->hooked_anchorage(b).length_mm == Approx(128.66).epsilon(0.002));
  // 20 mm bars at 100 mm: cd = 40 ≤ 60, α1 = 1.0: lb,eq = lb,rqd = 5 × 434.8 / 3.041 = 714.8 mm; mandrel 7 φ.
  armature::BarDetailDemand t = bar12(armature::Face::bottom, 25);
  t.diameter_mm = 20;
  t.spacing_mm = 100;
  const auto h20 = rules->hooked_anchorage(t);
  CHECK(h20.length_mm == Approx(714.8).epsilon(0.002));
  CHECK(h20.bend_diameter_mm == Approx(140));
  CHECK(h20.extension_mm == Approx(100));
  // EN sets no limit of the kind of ACI 7.7.3.8.3.
  CHECK_FALSE(rules->zero_moment_development(t, armature::ZeroMomentSite{}).applies);
}

TEST_CASE("ACI 25.3 and 25.4.3.1 standard hook clause functions", "[detailing][aci318][hooks]") {
  using namespace armature::aci318;
  // #4 bar, Grade 60, 4000 psi: ψc = 4000/15 000 + 0.6 = 0.8667; ldh = 60 000 × 1.0 × 1.6 × 1.0 × 0.8667
  // × 0.5^1.5 / (55 × 1.0 × 63.25) = 8.456 in, above 8 db = 4 in and 6 in (hand evaluation of 25.4.3.1,
  // value from memory).
  const double psi_c = inch_pound::hook_concrete_strength_factor(4000);
  CHECK(psi_c == Approx(0.86667).epsilon(1e-4));
  CHECK(inch_pound::hooked_development_length(60000, std::sqrt(4000.0), 1.0, 1.6, 1.0, psi_c, 1.0, 0.5) ==
        Approx(8.456).epsilon(0.001));
  // ψc = 1.0 from 6000 psi; a #3 bar in 8000 psi: 4.48 in by (a), so the 6 in of (c) governs.
  CHECK(inch_pound::hook_concrete_strength_factor(8000) == 1.0);
  CHECK(inch_pound::hooked_development_length(60000, std::sqrt(8000.0), 1.0, 1.6, 1.0, 1.0, 1.0, 0.375) == 6.0);
  // SI: No. 13 in 28 MPa, Grade 420: ψc = 28/105 + 0.6 = 0.8667; 420 × 1.6 × 0.8667 × 12.7^1.5 / (23 × 5.292)
  // = 216.6 mm; No. 10: 140.1 mm, so 150 mm governs (hand evaluation of 25.4.3.1, value from memory).
  CHECK(hook_concrete_strength_factor(28) == Approx(0.86667).epsilon(1e-4));
  CHECK(hook_concrete_strength_factor(45) == 1.0);
  // The SI edition's break at 40 MPa: 39.9/105 + 0.6 = 0.98 below it, 1.0 from it.
  CHECK(hook_concrete_strength_factor(39.9) == Approx(0.98).epsilon(1e-3));
  CHECK(hook_concrete_strength_factor(40.0) == 1.0);
  // ψr (Table 25.4.3.2, value from memory): 1.0 with hooked bars at s ≥ 6 db, else 1.6.
  CHECK(hook_confinement_factor(200, 12.7) == 1.0);
  CHECK(hook_confinement_factor(75, 12.7) == 1.6);
  const double rf = std::sqrt(28.0);
  CHECK(hooked_development_length(420, rf, 1.0, 1.6, 1.0, 0.86667, 1.0, 12.7) == Approx(216.6).epsilon(0.001));
  CHECK(hooked_development_length(420, rf, 1.0, 1.6, 1.0, 0.86667, 1.0, 9.5) == 150.0);
  // Table 25.3.2 (value from memory): 6 db to No. 25, 8 db No. 29 to No. 36; Table 25.3.1: 12 db extension.
  CHECK(hook_inside_bend_diameter(12.7) == Approx(76.2));
  CHECK(hook_inside_bend_diameter(25.4) == Approx(152.4));
  CHECK(hook_inside_bend_diameter(28.7) == Approx(229.6));
  CHECK(hook_extension_90(12.7) == Approx(152.4));
  // 7.7.3.8.3 (value from memory): 1.3 Mn/Vu + ℓa confined, Mn/Vu + ℓa not; ℓa at a point of inflection ≤ max(d, 12 db).
  CHECK(zero_moment_development_limit(100e6, 100e3, 150, true) == Approx(1450));
  CHECK(zero_moment_development_limit(100e6, 100e3, 150, false) == Approx(1150));
  CHECK(inflection_embedment_limit(150, 12.7) == Approx(152.4));
  CHECK(inflection_embedment_limit(180, 12.7) == 180);
}

TEST_CASE("ACI hooked anchorage and the 7.7.3.8.3 limit of a session", "[detailing][aci318][hooks]") {
  nlohmann::json req = aci_strip_request();
  const Session si = session_of(req);
  const armature::DetailingRules* rules = si.checker->detailing_rules();
  armature::BarDetailDemand b = no13_at_200();
  // No. 13 @ 200 mm ≥ 6 db: ψr = 1.0, 216.6/1.6 = 135.4 mm, so the 150 mm minimum governs; at 75 mm
  // (< 6 db = 76.2 mm) ψr = 1.6: 216.6 mm (as by hand above).
  const auto h = rules->hooked_anchorage(b);
  CHECK(h.length_mm == Approx(150.0));
  armature::BarDetailDemand close = b;
  close.spacing_mm = 75;
  CHECK(rules->hooked_anchorage(close).length_mm == Approx(216.6).epsilon(0.001));
  CHECK(h.bend_diameter_mm == Approx(76.2));
  CHECK(h.extension_mm == Approx(152.4));
  CHECK(h.clause == "ACI 318-19 25.3, 25.4.3");
  // 7.7.3.8.3: a = 645 × 420 / (0.85 × 28 × 1000) = 11.38 mm, Mn = 645 × 420 × (153.65 − 5.69) = 40.08 kNm;
  // ld = 353.3 mm (above). Vu = 200 kN: 1.3 × 200.4 + 150 = 410.5 mm ≥ 353.3, met; Vu = 300 kN: 1.3 × 133.6
  // + 150 = 323.7 mm < 353.3, not met (hand evaluation of 7.7.3.8.3, value from memory).
  armature::ZeroMomentSite site{true, true, false, 150.0};
  b.V_Ed_N = 200e3;
  auto lim = rules->zero_moment_development(b, site);
  CHECK(lim.applies);
  CHECK(lim.met);
  CHECK(lim.length_mm == Approx(353.3).epsilon(0.002));
  CHECK(lim.limit_mm == Approx(410.5).epsilon(0.002));
  CHECK(lim.clause == "ACI 318-19 7.7.3.8.3");
  b.V_Ed_N = 300e3;
  lim = rules->zero_moment_development(b, site);
  CHECK_FALSE(lim.met);
  CHECK(lim.limit_mm == Approx(323.7).epsilon(0.002));
  // Not confined (a point of inflection): Mn/Vu + ℓa, ℓa ≤ max(d, 12 db) = 153.65: 133.6 + 153.65 = 287.3 mm.
  lim = rules->zero_moment_development(b, armature::ZeroMomentSite{false, false, false, 400.0});
  CHECK(lim.limit_mm == Approx(287.3).epsilon(0.002));
  // A standard hook past the centreline of a simple support: need not be met.
  lim = rules->zero_moment_development(b, armature::ZeroMomentSite{true, true, true, 80.0});
  CHECK(lim.applies);
  CHECK(lim.met);

  req["variant"] = "US";
  req["concrete"] = {{"cylinder_strength", "4000 psi"}};
  req["slab"] = {{"spans", {"14 ft"}}, {"ends", {"pinned", "pinned"}}, {"thickness", "7 in"}};
  req["loads"] = {{"dead", "15 psf"}, {"imposed", "65 psf"}};
  const Session us = session_of(req);
  armature::BarDetailDemand u = b;
  u.diameter_mm = 0.5 * 25.4;
  // #4, Grade 60, 4000 psi, at 2.9 in (< 6 db = 3 in: ψr = 1.6): 8.456 in (by hand above).
  u.spacing_mm = 2.9 * 25.4;
  CHECK(us.checker->detailing_rules()->hooked_anchorage(u).length_mm / 25.4 == Approx(8.456).epsilon(0.001));
}

TEST_CASE("A forwarding detailing rules object forwards the hook and the zero-moment limit", "[detailing][hooks]") {
  nlohmann::json req = aci_strip_request();
  const Session s = session_of(req);
  const armature::ForwardingDetailingRules fwd(*s.checker->detailing_rules());
  armature::BarDetailDemand b = no13_at_200();
  b.V_Ed_N = 300e3;
  CHECK(fwd.hooked_anchorage(b).length_mm == Approx(150.0));  // ψr = 1.0 at s ≥ 6 db: the 150 mm minimum
  const auto lim = fwd.zero_moment_development(b, armature::ZeroMomentSite{true, true, false, 150.0});
  CHECK(lim.applies);
  CHECK_FALSE(lim.met);
}
