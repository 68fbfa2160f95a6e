// A published worked example reproduced with the ACI 318-19 (SI) plug-in.
//
// Source: J. C. McCormac and R. H. Brown, "Design of Reinforced Concrete",
// 9th edition (Wiley; written to ACI 318-11, ASCE/SEI 7-10), Chapter 4,
// section 4.7 "One-Way Slabs", Example 4.6 and its Figure 4.8: a one-way
// slab inside a building, simply supported over 10 ft, h = 6 in, live load
// 200 psf, no other dead load than the slab, concrete counted at 150 pcf
// (145 pcf plus 5 pcf for the steel, as the example says), #4 main bars with
// 3/4 in clear cover. The copy read is the text of that chapter found by the
// search tool's public-repository index (Figure 4.8 itself is a picture).
// f'c and fy come from the example's own text: ρ is read from Appendix
// Table A.13, the table the same chapter uses for f'c = 4000 psi with
// fy = 60 000 psi (Examples 4.2 and 4.3), and ρmin = 0.0033 = 200/fy.
//
// The example follows ACI 318-11. Only values that ACI 318-19 did not
// change are compared: load factors (5.3.1), Table 7.3.1.1, the flexural
// strength of 22.2, 3h/18 in spacing (7.7.2.3) and 0.0018 Ag shrinkage and
// temperature steel at Grade 60 (24.4.3.2). Its ρmin = 0.0033 is the beam
// rule and is not compared (slabs: 7.6.1.1).
//
// Tolerances follow the publication's rounding, stated beside each value.
// Inputs are given in US units and converted exactly by the request parser
// (1 in = 25.4 mm, 1 lbf = 4.4482216152605 N).
//
// Three values differ because armature implements ACI 318-19 in SI units
// (ACI 318M), whose figures are not exact conversions of the inch-pound ones;
// each is asserted at its SI value, with the published value beside it:
//   * h,min: (0.4 + fy/700) with fy = 60 ksi = 413.685 MPa is 0.99098, where
//     the inch-pound factor (0.4 + fy/100 000) is exactly 1 (Table 7.3.1.1);
//   * s,max: min(3h, 450 mm) = 450 mm, where the inch-pound rule gives
//     min(3h, 18 in) = 18 in = 457.2 mm (7.7.2.3);
//   * cover: 20 mm for interior slabs, where the inch-pound table gives 3/4 in
//     = 19.05 mm (Table 20.5.1.3.1), so the example's cover fails the SI check.
#include <catch2/catch.hpp>

#include <nlohmann/json.hpp>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "aci318/rules.hpp"
#include "aci318/us_customary.hpp"

namespace {
// Exact unit definitions, for stating the published US values in kernel units.
constexpr double inch = 25.4;                     // mm
constexpr double foot = 12.0 * inch;              // mm
constexpr double lbf = 4.4482216152605;           // N
constexpr double psf = lbf / (foot * foot);       // N/mm² (MPa)
constexpr double in2 = inch * inch;               // mm²
constexpr double kip_ft = 1000.0 * lbf * foot;    // N·mm
constexpr double fy_60ksi = 60000.0 * lbf / in2;  // 413.685 MPa

armature::Registry& registry() {
  static armature::Registry reg({ARMATURE_CODE_DIR});
  return reg;
}

// Example 4.6 as a request: one 12-in strip (b = 12 in, as the example designs).
nlohmann::json example_4_6(bool cover_given, const std::vector<std::string>& bars) {
  nlohmann::json req = {
      {"code", "ACI318-19"},
      {"slab", {{"spans", {"10 ft"}}, {"ends", {"pinned", "pinned"}}, {"thickness", "6 in"}, {"strip_width", "12 in"}}},
      {"concrete", {{"cylinder_strength", "4000 psi"}, {"density", "150 pcf"}}},
      {"reinforcement", {{"yield_strength", "60 ksi"}, {"bars", bars}}},
      {"loads", {{"dead", "0 psf"}, {"imposed", "200 psf"}}}};
  if (cover_given) req["durability"] = {{"cover", "0.75 in"}};
  return req;
}

const armature::Check& check_at(const std::vector<armature::Check>& checks, const std::string& id,
                                const std::string& clause) {
  for (const auto& c : checks)
    if (c.id == id && c.clause == clause) return c;
  FAIL("no check " << id << " (" << clause << ")");
  throw;
}

const armature::Step& step_named(const armature::Check& check, const std::string& symbol) {
  for (const auto& s : check.steps)
    if (s.symbol == symbol) return s;
  FAIL("no step " << symbol << " in " << check.id);
  throw;
}
}  // namespace

TEST_CASE("McCormac & Brown Example 4.6 end to end: loads, Mu, h,min, bars", "[aci318][published]") {
  // Cover as armature sets it (20 mm, Table 20.5.1.3.1 SI), so that the whole
  // design passes; the section at the example's 3/4 in cover is the next test.
  const auto r = armature::design(registry(), example_4_6(false, {"#3", "#4"}));

  // "DL = slab wt = (6 in/12)(150 pcf) = 75 psf": exact, no rounding in the example.
  CHECK(r.loads.self_weight == Approx(75.0 * psf).epsilon(1e-9));
  // "wu = (1.2)(75 psf) + (1.6)(200 psf) = 410 psf": exact; 1.4 D = 105 psf does not govern.
  CHECK(r.loads.uls == Approx(410.0 * psf).epsilon(1e-9));
  CHECK(r.loads.combination == "5.3.1b: 1.2 D + 1.6 L");

  // "Mu = (0.410 klf)(10 ft)²/8 = 5.125 ft-k" per 12-in strip: printed to all its digits.
  REQUIRE(r.regions.size() == 1);
  const auto& g = r.regions[0];
  CHECK(g.M_Ed == Approx(5.125 * kip_ft).epsilon(1e-9));

  // "h = ℓ/20 = (12 in/ft)(10 ft)/20 = 6 in": the table's ℓ/20 reproduces it
  // exactly at Grade 420, for which 318M writes the table (factor 1)...
  CHECK(armature::aci318::minimum_slab_thickness(10 * foot, armature::aci318::SupportCondition::simply_supported,
                                                 420.0) == Approx(6.0 * inch).epsilon(1e-12));
  // ...while at fy = 60 ksi exactly the SI factor is 0.4 + 413.685/700 = 0.99098
  // (the inch-pound one is 1): h,min = 6 in × 0.99098 = 151.03 mm (5.946 in), so
  // the published 6 in slab passes with a little to spare. By hand from 7.3.1.1.
  REQUIRE(r.spans.size() == 1);
  const auto& deflection = check_at(r.spans[0].checks, "deflection", "ACI 318-19 7.3.1.1");
  CHECK(deflection.demand == Approx(6.0 * inch * (0.4 + fy_60ksi / 700.0)).epsilon(1e-9));
  CHECK(deflection.demand == Approx(151.025).epsilon(1e-5));
  CHECK(deflection.capacity == Approx(6.0 * inch));
  CHECK(deflection.pass);

  // Transverse steel "As = 0.0018 (12 in)(6 in) = 0.1296 in²/ft": printed to 4
  // significant figures (±0.00005 in²), 318-19 24.4.3.2 unchanged at Grade 60.
  CHECK(r.distribution.As_req_mm2 == Approx(0.1296 * in2).epsilon(0.00005 / 0.1296));
  // The example uses #3 for it ("#3 @ 10 in."): armature's least area on its
  // 25 mm grid is also #3, at 250 mm (71 × 304.8/250 = 86.56 mm² ≥ 83.61 mm²;
  // #4 would need 450 mm for 87.38 mm²). By hand from the search rule.
  CHECK(r.distribution.bars.bar == "#3");
  CHECK(r.distribution.bars.spacing_mm == 250);

  // Main bars: the example chooses #4 ("Use #4 @ 10 in."). With 20 mm cover
  // d = 152.4 − 20 − 6.35 = 126.05 mm, As,req = 153.47 mm² (by hand, 22.2), and
  // the widest grid spacing of #4 giving it is 250 mm (157.28 mm²); the
  // example's 10 in = 254 mm lies between grid steps.
  CHECK(g.bars.bar == "#4");
  CHECK(g.bars.spacing_mm == 250);
  CHECK(g.As_req_mm2 == Approx(153.47).epsilon(1e-4));

  // Spacing limit 7.7.2.3 ("maximum of 18 in."): in SI min(3h, 450) = 450 mm,
  // not 18 in = 457.2 mm (see the file's head).
  CHECK(check_at(g.checks, "spacing", "ACI 318-19 7.7.2.3").capacity == Approx(450.0));

  // The example finds the 6 in slab adequate; so does armature with its cover.
  CHECK(r.pass);
}

TEST_CASE("McCormac & Brown Example 4.6: the section at d = 5.0 in with #4 @ 10 in", "[aci318][published]") {
  // The example's own section: 3/4 in clear cover, #4 bars at 10 in, checked
  // at the published Mu = 5.125 ft-k per 12-in strip.
  armature::InputProblems problems;
  const auto request = armature::request_from_json(example_4_6(true, {"#3", "#4"}), problems);
  REQUIRE(problems.empty());
  const auto code = registry().open("ACI318-19", "");
  code->validate(request, problems);
  REQUIRE(problems.empty());
  const auto checker = code->begin(request);
  const armature::BarOption* bar4 = nullptr;
  const armature::BarOption* bar3 = nullptr;
  for (const auto& b : checker->bar_options()) {
    if (b.designation == "#4") bar4 = &b;
    if (b.designation == "#3") bar3 = &b;
  }
  REQUIRE(bar4);
  REQUIRE(bar3);

  armature::RegionDemand g;
  g.where = "span 1";
  g.face = armature::Face::bottom;
  g.M_Ed = 5.125 * kip_ft;  // the published Mu
  const double b = 12.0 * inch, s = 10.0 * inch;
  const auto out = checker->check_region(g, *bar4, s, armature::Detail::steps);

  // "d = 6 in − 3/4 in cover − 1/4 in = 5.0 in": exact for a #4 bar (12.7 mm).
  CHECK(out.d_mm == Approx(5.0 * inch).epsilon(1e-12));
  CHECK(out.cover_mm == Approx(0.75 * inch));

  // "Mu/φbd² = 227.8 psi, ρ = 0.00393 (Table A.13), As = ρbd = 0.236 in²/ft".
  // ρ is printed to 3 significant figures (±0.000005, ±0.13 %), As to 3 (±0.0005 in², ±0.21 %).
  CHECK(out.As_req_mm2 / (b * out.d_mm) == Approx(0.00393).epsilon(0.000005 / 0.00393));
  CHECK(out.As_req_mm2 == Approx(0.236 * in2).epsilon(0.0005 / 0.236));

  // "Use #4 @ 10 in. (As = 0.24 in²/ft)": printed to 0.01 in² (±0.005, ±2.1 %).
  const auto& bending = check_at(out.checks, "bending", "ACI 318-19 22.2, 21.2.2");
  CHECK(step_named(bending, "As").result == Approx(0.24 * in2).epsilon(0.005 / 0.24));
  CHECK(armature::provided_area_mm2(bar4->area_mm2, s, b) == Approx(0.24 * in2).epsilon(0.005 / 0.24));
  // The example designs with φ = 0.9 throughout; the bars are tension-controlled,
  // so φ = 0.90 here too (εt = 0.003 × (127 − 10.544)/10.544 = 0.0331 by hand,
  // past εty + 0.003 = 0.00507 of 7.3.3.1).
  CHECK(step_named(bending, "φ").result == Approx(0.90));
  const auto& ductility = check_at(out.checks, "ductility", "ACI 318-19 7.3.3.1, 21.2.2");
  CHECK(ductility.capacity == Approx(0.03313).epsilon(1e-3));
  CHECK(ductility.pass);
  // The published Mu is the demand, and #4 @ 10 in carries it (φMn = 5.21 ft-k by hand).
  CHECK(bending.demand == Approx(5.125 * kip_ft * 1e-6).epsilon(1e-9));
  CHECK(bending.capacity == Approx(5.208 * kip_ft * 1e-6).epsilon(1e-3));
  CHECK(bending.pass);

  // "Spacing < maximum of 18 in." — 10 in passes; the SI limit is 450 mm.
  const auto& spacing = check_at(out.checks, "spacing", "ACI 318-19 7.7.2.3");
  CHECK(spacing.demand == Approx(s));
  CHECK(spacing.capacity == Approx(450.0));
  CHECK(spacing.pass);

  // "Use #3 @ 10 in. (0.13 in²/ft)" for shrinkage and temperature steel:
  // printed to 0.01 in² (±0.005); armature's #3 area gives 0.132 in²/ft.
  CHECK(armature::provided_area_mm2(bar3->area_mm2, s, b) == Approx(0.13 * in2).epsilon(0.005 / 0.13));
  CHECK(armature::provided_area_mm2(bar3->area_mm2, s, b) >= checker->distribution(0.0).As_req_mm2);

  // The example's 3/4 in cover meets the inch-pound Table 20.5.1.3.1 but not
  // the SI one (20 mm for interior slabs): the cover check reports it.
  const auto& cover = check_at(out.checks, "cover", "ACI 318-19 20.5.1.3.1");
  CHECK(cover.demand == Approx(20.0));
  CHECK(cover.capacity == Approx(19.05));
  CHECK_FALSE(cover.pass);
}

// Source: the same book, Chapter 6 "Serviceability", Example 6.1 (the beam
// of Example 2.3: b = 12 in, h = 20 in, d = 17 in, As = 3.00 in², f'c =
// 3000 psi, n = 9; a 20 ft simple span), read from the same public text.
// The example follows ACI 318-11, whose effective moment of inertia
// (Branson's, 318-11 (9-8)) ACI 318-19 replaced (Table 24.2.3.5), so its
// Ie and deflections are not compared; what 318-19 kept is: Ig, fr =
// 7.5 √f'c psi (19.2.3.1), Mcr = fr Ig/yt (24.2.3.5), the cracked section
// with n As, Ec = 57 000 √f'c psi (19.2.2.1(b)) and λΔ = ξ/(1 + 50 ρ') with
// ξ = 2.0 (24.2.4.1). The book rounds to three or four figures.
TEST_CASE("McCormac & Brown Example 6.1: the section's Ig, Mcr, Icr, Ec and the long-term multiplier",
          "[aci318][published][deflection]") {
  namespace ip = armature::aci318::inch_pound;
  const double Ig = armature::aci318::gross_moment_of_inertia(12.0, 20.0);  // in⁴
  CHECK(Ig == Approx(8000.0));
  const double fr = ip::modulus_of_rupture(3000.0, 1.0);  // psi
  const double Mcr = armature::aci318::cracking_moment(fr, Ig, 10.0);  // in-lb
  CHECK(Mcr == Approx(328633.0).epsilon(1e-4));  // printed 328,633 in-lb
  CHECK(Mcr / 12000.0 == Approx(27.4).epsilon(0.002));  // printed 27.4 ft-k
  const auto cracked = armature::aci318::cracked_section(12.0, 3.00, 17.0, 9.0);
  CHECK(cracked.x == Approx(6.78).epsilon(0.001));    // printed 6.78 in
  CHECK(cracked.Icr == Approx(4067.0).epsilon(0.001));  // printed 4067 in⁴
  CHECK(ip::modulus_of_elasticity(3000.0) == Approx(3.122e6).epsilon(0.001));  // printed 3.122 × 10⁶ psi
  CHECK(armature::aci318::long_term_multiplier(armature::aci318::time_dependent_factor_five_years, 0.0) == 2.0);
}
