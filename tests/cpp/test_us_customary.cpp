// The US variant of ACI 318-19: the in-lb edition's forms, its bar and
// cover tables, and whole designs checked by hand from the in-lb equations.
//
// Sources: ACI 318-19 (inch-pound edition), the sections named beside each
// check; every value of the standard is from memory. The published example
// is the one of test_published_examples_aci.cpp (McCormac and Brown, "Design
// of Reinforced Concrete", 9th edition, Example 4.6), whose in-lb values the
// US variant now meets without the SI edition's departures listed there.
// The other slabs are our own (the community workshop's US sister building).
#include <catch2/catch.hpp>

#include <cmath>

#include <nlohmann/json.hpp>

#include "aci318/us_customary.hpp"
#include "armature/design.hpp"
#include "armature/errors.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

namespace {
namespace ip = armature::aci318::inch_pound;
using armature::aci318::SupportCondition;

constexpr double inch = 25.4;                     // mm
constexpr double foot = 12.0 * inch;              // mm
constexpr double lbf = 4.4482216152605;           // N
constexpr double psi = lbf / (inch * inch);       // MPa
constexpr double psf = lbf / (foot * foot);       // MPa
constexpr double in2 = inch * inch;               // mm²
constexpr double kip_ft = 1000.0 * lbf * foot;    // N·mm

armature::Registry& registry() {
  static armature::Registry reg({ARMATURE_CODE_DIR});
  return reg;
}

const armature::Check& check_at(const std::vector<armature::Check>& checks, const std::string& id,
                                const std::string& clause) {
  for (const auto& c : checks)
    if (c.id == id && c.clause == clause) return c;
  FAIL("no check " << id << " (" << clause << ")");
  throw;
}

bool has_problem(const armature::InputError& e, const std::string& field, const std::string& words) {
  for (const auto& p : e.problems())
    if (p.field == field && p.message.find(words) != std::string::npos) return true;
  return false;
}
}  // namespace

TEST_CASE("In-lb bar table: ASTM A615 nominal diameters and areas", "[aci318][us]") {
  // ASTM A615/A615M nominal dimensions of #3 to #11 (value from memory).
  const struct {
    const char* number;
    double d_in, A_in2;
  } expected[] = {{"#3", 0.375, 0.11}, {"#4", 0.500, 0.20}, {"#5", 0.625, 0.31},
                  {"#6", 0.750, 0.44}, {"#7", 0.875, 0.60}, {"#8", 1.000, 0.79},
                  {"#9", 1.128, 1.00}, {"#10", 1.270, 1.27}, {"#11", 1.410, 1.56}};
  REQUIRE(ip::bar_catalogue().size() == 9);
  for (const auto& e : expected) {
    const auto bar = ip::find_bar(e.number);
    REQUIRE(bar);
    CHECK(bar->diameter_in == Approx(e.d_in));
    CHECK(bar->area_in2 == Approx(e.A_in2));
  }
  CHECK_FALSE(ip::find_bar("No.13"));  // the SI name is not an in-lb bar
  CHECK_FALSE(ip::find_bar("#14"));
}

TEST_CASE("In-lb Table 20.5.1.3.1: cover of slabs", "[aci318][us]") {
  // ACI 318-19 Table 20.5.1.3.1, in-lb (value from memory).
  CHECK(ip::specified_cover("interior", 1.410) == 0.75);  // #11 and smaller
  CHECK(ip::specified_cover("interior", 0.5) == 0.75);
  CHECK(ip::specified_cover("weather", 0.625) == 1.5);    // #5 and smaller
  CHECK(ip::specified_cover("weather", 0.750) == 2.0);    // #6 and larger
  CHECK(ip::specified_cover("ground", 0.5) == 3.0);       // cast against earth
}

TEST_CASE("In-lb forms whose constants the SI edition rounds apart", "[aci318][us]") {
  // Table 7.3.1.1 with 7.3.1.1.1: ℓ/20 × (0.4 + fy/100 000): exactly 1 at
  // 60 000 psi (the SI form 0.4 + 413.685/700 is 0.991). By hand.
  CHECK(ip::minimum_slab_thickness(120.0, SupportCondition::simply_supported, 60000.0) == Approx(6.0));
  CHECK(ip::minimum_slab_thickness(168.0, SupportCondition::one_end_continuous, 60000.0) == Approx(7.0));
  CHECK(ip::minimum_slab_thickness(168.0, SupportCondition::both_ends_continuous, 60000.0) == Approx(6.0));
  CHECK(ip::minimum_slab_thickness(60.0, SupportCondition::cantilever, 60000.0) == Approx(6.0));
  // Grade 40: 0.4 + 40 000/100 000 = 0.8.
  CHECK(ip::minimum_slab_thickness(120.0, SupportCondition::simply_supported, 40000.0) == Approx(4.8));
  // 24.3.2: s = min(15 (40 000/fs) − 2.5 cc, 12 (40 000/fs)); fs = 40 000 psi
  // (2/3 of Grade 60): 12 in at 3/4 in cover, 15 − 2.5 × 2 = 10 in at 2 in.
  CHECK(ip::crack_control_spacing(40000.0, 0.75) == Approx(12.0));
  CHECK(ip::crack_control_spacing(40000.0, 2.0) == Approx(10.0));
  // 7.7.2.3 min(3h, 18 in); 24.4.3.3 min(5h, 18 in); 25.2.1 max(1 in, db, 4/3 dagg).
  CHECK(ip::max_flexural_bar_spacing(5.0) == Approx(15.0));
  CHECK(ip::max_flexural_bar_spacing(8.0) == Approx(18.0));
  CHECK(ip::max_shrinkage_bar_spacing(3.0) == Approx(15.0));
  CHECK(ip::max_shrinkage_bar_spacing(7.0) == Approx(18.0));
  CHECK(ip::minimum_clear_bar_spacing(0.5, 0.75) == Approx(1.0));
  CHECK(ip::minimum_clear_bar_spacing(0.5, 1.0) == Approx(4.0 / 3.0));
  // Table 22.2.2.4.3: 0.85 to 4000 psi, 0.85 − 0.05 (f'c − 4000)/1000, 0.65 from 8000 psi.
  CHECK(ip::stress_block_factor_beta1(4000.0) == Approx(0.85));
  CHECK(ip::stress_block_factor_beta1(5000.0) == Approx(0.80));
  CHECK(ip::stress_block_factor_beta1(9000.0) == Approx(0.65));
  // 22.5.5.1.3: λs = √(2/(1 + d/10)) ≤ 1, d in inches: 1 at 10 in, √(2/3) at 20 in.
  CHECK(ip::size_effect_factor(6.0) == Approx(1.0));
  CHECK(ip::size_effect_factor(20.0) == Approx(std::sqrt(2.0 / 3.0)));
  // 22.5.5.1: Vc = 8 λs λ ρw^(1/3) √f'c b d ≤ 5 λ √f'c b d. ρw = 0.008 (cube
  // root 0.2): 8 × 0.2 × √4000 × 12 × 6 = 7286 lb; the cap 5 √f'c b d = 22 768 lb.
  CHECK(ip::one_way_shear_strength(1.0, 1.0, 0.008, 4000.0, 12.0, 6.0) ==
        Approx(8.0 * 0.2 * std::sqrt(4000.0) * 72.0));
  CHECK(ip::one_way_shear_strength(1.0, 1.0, 0.3, 4000.0, 12.0, 6.0) == Approx(5.0 * std::sqrt(4000.0) * 72.0));
  // 22.5.3.1: √f'c at most 100 psi.
  CHECK(ip::one_way_shear_strength(1.0, 1.0, 0.3, 12000.0, 12.0, 6.0) == Approx(5.0 * 100.0 * 72.0));
}

namespace {
// McCormac and Brown Example 4.6 (see the file's head) under the US
// variant, leaving the strip, cover and grid to the variant.
nlohmann::json example_4_6_us() {
  return {{"code", "ACI318-19"},
          {"variant", "US"},
          {"slab", {{"spans", {"10 ft"}}, {"ends", {"pinned", "pinned"}}, {"thickness", "6 in"}}},
          {"concrete", {{"cylinder_strength", "4000 psi"}}},
          {"reinforcement", {{"bars", {"#3", "#4"}}}},
          {"loads", {{"imposed", "200 psf"}}}};
}
}  // namespace

TEST_CASE("US variant: McCormac and Brown Example 4.6 as a US engineer draws it", "[aci318][us][published]") {
  const auto r = armature::design(registry(), example_4_6_us());
  CHECK(r.code.variant == "US");
  CHECK(r.report_units == armature::ReportUnits::US);
  // The variant's strip: 12 in, the example's own b ("per 12-in strip").
  CHECK(r.strip_width_mm == Approx(12.0 * inch));
  CHECK(r.state_strip_width);
  // "DL = (6 in/12)(150 pcf) = 75 psf" with the variant's 150 pcf default;
  // "wu = 1.2 × 75 + 1.6 × 200 = 410 psf"; "Mu = 0.410 × 10²/8 = 5.125 ft-k".
  CHECK(r.loads.self_weight == Approx(75.0 * psf).epsilon(1e-12));
  CHECK(r.loads.uls == Approx(410.0 * psf).epsilon(1e-12));
  REQUIRE(r.regions.size() == 1);
  const auto& g = r.regions[0];
  CHECK(g.M_Ed == Approx(5.125 * kip_ft).epsilon(1e-12));
  // Table 20.5.1.3.1 (in-lb): 3/4 in, the example's cover; d = 6 − 0.75 − 0.25 = 5.0 in.
  CHECK(g.cover_mm == Approx(0.75 * inch));
  CHECK(g.d_mm == Approx(5.0 * inch));
  // "As = 0.236 in²/ft" (3 significant figures, ±0.0005 in²); "Use #4 @ 10 in.":
  // the widest half-inch step of #4 giving it is 0.20 × 12/0.236 = 10.2 → 10 in.
  CHECK(g.As_req_mm2 == Approx(0.236 * in2).epsilon(0.0005 / 0.236));
  CHECK(g.bars.bar == "#4");
  CHECK(g.bars.spacing_mm == Approx(10.0 * inch));
  CHECK(g.bars.As_prov_mm2 == Approx(0.24 * in2));  // 0.20 in² × 12/10, nominal area
  // Table 7.3.1.1: ℓ/20 × (0.4 + 60 000/100 000) = 120/20 × 1.0 = 6 in exactly.
  const auto& deflection = check_at(r.spans[0].checks, "deflection", "ACI 318-19 7.3.1.1");
  CHECK(deflection.demand == Approx(6.0 * inch).epsilon(1e-12));
  // 7.7.2.3 "maximum of 18 in": min(3 × 6, 18) = 18 in.
  CHECK(check_at(g.checks, "spacing", "ACI 318-19 7.7.2.3").capacity == Approx(18.0 * inch));
  // "0.0018 (12)(6) = 0.1296 in²/ft ... Use #3 @ 10 in.": 0.11 × 12/0.1296 = 10.19 → 10 in.
  CHECK(r.distribution.As_req_mm2 == Approx(0.1296 * in2));
  CHECK(r.distribution.bars.bar == "#3");
  CHECK(r.distribution.bars.spacing_mm == Approx(10.0 * inch));
  CHECK(r.pass);
}

TEST_CASE("US variant: a workshop floor by hand from the in-lb equations", "[aci318][us]") {
  // Our slab: one 14 ft span, both ends pinned, h = 7 in, f'c = 4000 psi,
  // D = 15 psf + self-weight, L = 65 psf; #4 bars only.
  const nlohmann::json req = {{"code", "ACI318-19"},
                              {"variant", "US"},
                              {"slab", {{"spans", {"14 ft"}}, {"ends", {"pinned", "pinned"}}, {"thickness", "7 in"}}},
                              {"concrete", {{"cylinder_strength", "4000 psi"}}},
                              {"reinforcement", {{"bars", {"#4"}}}},
                              {"loads", {{"dead", "15 psf"}, {"imposed", "65 psf"}}}};
  const auto r = armature::design(registry(), req, armature::Detail::steps);
  // Self-weight 7/12 × 150 = 87.5 psf; 5.3.1b: 1.2 × 102.5 + 1.6 × 65 = 227 psf.
  CHECK(r.loads.uls == Approx(227.0 * psf).epsilon(1e-12));
  // Mu = 0.227 × 14²/8 = 5.5615 kip-ft per foot.
  const auto& g = r.regions[0];
  CHECK(g.M_Ed == Approx(0.227 * 14.0 * 14.0 / 8.0 * kip_ft).epsilon(1e-9));
  // d = 7 − 0.75 − 0.25 = 6 in; As,req from 22.2 (Whitney block):
  // As = (0.85 × 4 × 12/60)(6 − √(36 − 2 × 66.738/(0.9 × 0.85 × 4 × 12))) in², Mu = 66.738 kip-in.
  const double Mu_kip_in = 0.227 * 196.0 / 8.0 * 12.0;
  const double As_req = 0.85 * 4.0 * 12.0 / 60.0 * (6.0 - std::sqrt(36.0 - 2.0 * Mu_kip_in / (0.9 * 0.85 * 4.0 * 12.0)));
  CHECK(g.As_req_mm2 == Approx(As_req * in2).epsilon(1e-9));
  // Widest half-inch step of #4 (0.20 in²) with 0.20 × 12/s ≥ As,req and
  // s ≤ 12 in (24.3.2 at 3/4 in cover): 0.20 × 12/0.2115 = 11.35 → 11 in.
  CHECK(As_req == Approx(0.2115).epsilon(1e-3));
  CHECK(g.bars.spacing_mm == Approx(11.0 * inch));
  // 24.3.2: min(15 × 40 000/40 000 − 2.5 × 0.75, 12 × 40 000/40 000) = 12 in.
  CHECK(check_at(g.checks, "cracking", "ACI 318-19 24.3.2").capacity == Approx(12.0 * inch));
  // 22.5.5.1 at support 1: Vu = 0.227 × 14/2 = 1.589 kip; ρw = 0.2 × 12/11/(12 × 6);
  // λs = 1 (d = 6 in); φVc = 0.75 × 8 × ρw^(1/3) × √4000 × 12 × 6 lb.
  const double rho_w = 0.2 * 12.0 / 11.0 / (12.0 * 6.0);
  const double phiVc_lb = 0.75 * 8.0 * std::cbrt(rho_w) * std::sqrt(4000.0) * 72.0;
  REQUIRE(!r.supports.empty());
  CHECK(r.supports[0].V_Ed == Approx(0.227 * 7.0 * 1000.0 * lbf).epsilon(1e-9));
  CHECK(r.supports[0].V_Rd == Approx(phiVc_lb * lbf).epsilon(1e-9));
  // 7.3.1.1: 14 ft simply supported, 168/20 × 1.0 = 8.4 in > 7 in: fails, as the table says.
  const auto& deflection = check_at(r.spans[0].checks, "deflection", "ACI 318-19 7.3.1.1");
  CHECK(deflection.demand == Approx(8.4 * inch).epsilon(1e-12));
  CHECK_FALSE(deflection.pass);
  // The derivation is printed in the in-lb form and units.
  bool found = false;
  for (const auto& s : deflection.steps)
    if (s.symbol == "h_min") {
      found = true;
      CHECK(s.expression.find("(0.4 + fy/100 000)") != std::string::npos);
      CHECK(s.unit == "in");
      CHECK(s.result == Approx(8.4));
    }
  CHECK(found);
}

TEST_CASE("The same slab in the SI and US variants agrees where the editions agree", "[aci318][us]") {
  // Same inputs stated in full (strip, density, cover, grid, fy): loads,
  // moments, As,req and As,min are the same equations in both editions;
  // Table 7.3.1.1 is not (0.4 + fy/700 against 0.4 + fy/100 000).
  auto request = [](const char* variant) {
    return nlohmann::json{{"code", "ACI318-19"},
                          {"variant", variant},
                          {"slab", {{"spans", {"12 ft", "12 ft"}}, {"ends", {"pinned", "pinned"}}, {"thickness", "6.5 in"},
                                    {"strip_width", "12 in"}}},
                          {"concrete", {{"cylinder_strength", "4000 psi"}, {"density", "150 pcf"}, {"aggregate", "0.75 in"}}},
                          {"reinforcement", {{"yield_strength", "60 ksi"}, {"bars", {"#4"}}, {"spacing_step_mm", 12.7},
                                             {"min_spacing_mm", 76.2}}},
                          {"durability", {{"cover", "0.75 in"}}},
                          {"loads", {{"dead", "20 psf"}, {"imposed", "80 psf"}}},
                          {"report_units", "SI"}};
  };
  const auto si = armature::design(registry(), request("SI"));
  const auto us = armature::design(registry(), request("US"));
  CHECK(si.loads.uls == Approx(us.loads.uls).epsilon(1e-12));
  REQUIRE(si.regions.size() == us.regions.size());
  for (std::size_t i = 0; i < si.regions.size(); ++i) {
    CHECK(si.regions[i].M_Ed == Approx(us.regions[i].M_Ed).epsilon(1e-12));
    CHECK(si.regions[i].d_mm == Approx(us.regions[i].d_mm).epsilon(1e-12));  // #4: 12.7 mm both
    CHECK(si.regions[i].As_req_mm2 == Approx(us.regions[i].As_req_mm2).epsilon(1e-12));
    CHECK(si.regions[i].As_min_mm2 == Approx(us.regions[i].As_min_mm2).epsilon(1e-12));
  }
  // Where they differ: h,min of the end span (ℓ/24) × 0.99098 (SI) against × 1 (in-lb).
  const auto& d_si = check_at(si.spans[0].checks, "deflection", "ACI 318-19 7.3.1.1");
  const auto& d_us = check_at(us.spans[0].checks, "deflection", "ACI 318-19 7.3.1.1");
  CHECK(d_us.demand == Approx(6.0 * inch).epsilon(1e-12));
  CHECK(d_si.demand == Approx(6.0 * inch * (0.4 + 60000.0 * psi / 700.0)).epsilon(1e-12));
  // The given 3/4 in cover: the in-lb Table 20.5.1.3.1 asks 3/4 in (passes), the SI
  // one 20 mm (fails by 0.95 mm): the "cover 0.787 vs 0.75 in FAIL".
  const auto& c_us = check_at(us.regions[0].checks, "cover", "ACI 318-19 20.5.1.3.1");
  const auto& c_si = check_at(si.regions[0].checks, "cover", "ACI 318-19 20.5.1.3.1");
  CHECK(c_us.demand == Approx(0.75 * inch));
  CHECK(c_us.pass);
  CHECK(c_si.demand == Approx(20.0));
  CHECK_FALSE(c_si.pass);
  // The result states the US strip; the SI variant's (a metre by practice) is not stated.
  CHECK(us.state_strip_width);
  CHECK_FALSE(si.state_strip_width);
}

TEST_CASE("US variant input errors name the field", "[aci318][us]") {
  nlohmann::json req = example_4_6_us();
  req["reinforcement"]["bars"] = {"No.13", "#4", "#14"};
  req["reinforcement"]["given"] = {{{"where", "span 1"}, {"face", "bottom"}, {"bar", "No.16"}, {"spacing_mm", 250}}};
  req["reinforcement"]["yield_strength"] = "90 ksi";
  try {
    armature::design(registry(), req);
    FAIL("expected an input error");
  } catch (const armature::InputError& e) {
    CHECK(has_problem(e, "reinforcement.bars[0]", "SI variant"));
    CHECK(has_problem(e, "reinforcement.bars[2]", "unknown bar '#14'"));
    CHECK(has_problem(e, "reinforcement.given[0].bar", "SI variant"));
    CHECK(has_problem(e, "reinforcement.yield_strength_MPa", "40 and 80 ksi"));
  }
  nlohmann::json unknown = example_4_6_us();
  unknown["variant"] = "USA";
  try {
    armature::design(registry(), unknown);
    FAIL("expected an input error");
  } catch (const armature::InputError& e) {
    CHECK(has_problem(e, "variant", "USA"));
  }
}
