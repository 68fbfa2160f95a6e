// ACI 318-19 (SI) clause functions (values from memory of ACI 318-19, as
// recorded in aci318-basis.md) and one single span worked by hand.
#include <catch2/catch.hpp>

#include <nlohmann/json.hpp>

#include "armature/design.hpp"
#include "armature/registry.hpp"
#include "aci318/rules.hpp"

using namespace armature::aci318;

TEST_CASE("beta1 of Table 22.2.2.4.3", "[aci318][flexure]") {
  CHECK(stress_block_factor_beta1(21) == Approx(0.85));
  CHECK(stress_block_factor_beta1(28) == Approx(0.85));
  CHECK(stress_block_factor_beta1(35) == Approx(0.80));  // 0.85 − 0.05 × 7/7
  CHECK(stress_block_factor_beta1(42) == Approx(0.75));
  CHECK(stress_block_factor_beta1(55) == Approx(0.65));
  CHECK(stress_block_factor_beta1(70) == Approx(0.65));
}

TEST_CASE("phi from the net tensile strain, Table 21.2.2", "[aci318][flexure]") {
  const double eps_ty = 420.0 / steel_modulus_MPa;  // 0.0021 for Grade 420
  CHECK(strength_reduction_factor(0.0051, eps_ty) == Approx(0.90));  // εty + 0.003
  CHECK(strength_reduction_factor(0.0200, eps_ty) == Approx(0.90));
  CHECK(strength_reduction_factor(0.0021, eps_ty) == Approx(0.65));
  CHECK(strength_reduction_factor(0.0010, eps_ty) == Approx(0.65));
  // Linear between: εt = 0.0036 → 0.65 + 0.25 × 0.0015/0.003 = 0.775.
  CHECK(strength_reduction_factor(0.0036, eps_ty) == Approx(0.775));
  // The slab strain limit 0.004 (7.3.3.1) lies in the transition: φ = 0.8083.
  CHECK(strength_reduction_factor(0.004, eps_ty) == Approx(0.65 + 0.25 * 0.0019 / 0.003));
}

TEST_CASE("Minimum thickness of Table 7.3.1.1 with the fy factor", "[aci318][deflection]") {
  // 4.0 m simply supported at Grade 420: ℓ/20 = 200 mm.
  CHECK(minimum_slab_thickness(4000, SupportCondition::simply_supported, 420) == Approx(200));
  // Grade 520: × (0.4 + 520/700) = 1.1429 → 228.6 mm. The issue and the
  // design basis quote 232 mm, which the stated factor does not give (it
  // would need fy ≈ 532 MPa); the formula of 7.3.1.1.1 is followed here.
  CHECK(minimum_slab_thickness(4000, SupportCondition::simply_supported, 520) == Approx(228.571).epsilon(1e-5));
  CHECK(minimum_slab_thickness(4800, SupportCondition::one_end_continuous, 420) == Approx(200));
  CHECK(minimum_slab_thickness(5600, SupportCondition::both_ends_continuous, 420) == Approx(200));
  CHECK(minimum_slab_thickness(1500, SupportCondition::cantilever, 420) == Approx(150));
  CHECK(minimum_slab_thickness(4000, SupportCondition::simply_supported, 280) == Approx(200 * 0.8));
}

TEST_CASE("Size-effect factor lambda_s (22.5.5.1.3)", "[aci318][shear]") {
  CHECK(size_effect_factor(100) == Approx(1.0));         // √(2/1.4) > 1 → 1
  CHECK(size_effect_factor(250) == Approx(1.0));         // √(2/2)
  CHECK(size_effect_factor(500) == Approx(0.8165).epsilon(1e-4));  // √(2/3)
  CHECK(size_effect_factor(1000) == Approx(0.6325).epsilon(1e-4)); // √(2/5)
  // Vc cap 0.42 √f'c b d and √f'c ≤ 8.3 MPa (22.5.3.1).
  CHECK(one_way_shear_strength(1.0, 1.0, 0.5, 28, 1000, 200) == Approx(0.42 * std::sqrt(28.0) * 200000));
  CHECK(one_way_shear_strength(1.0, 1.0, 0.002, 100, 1000, 200) ==
        Approx(0.66 * std::cbrt(0.002) * 8.3 * 200000));
}

TEST_CASE("Bars, cover and spacing rules", "[aci318][detailing]") {
  CHECK(find_bar("#4")->area_mm2 == 129);
  CHECK(find_bar("No.13")->diameter_mm == Approx(12.7));
  CHECK(find_bar("No.36")->area_mm2 == 1006);
  CHECK_FALSE(find_bar("#12").has_value());
  CHECK(specified_cover("interior", 35.8) == 20);
  CHECK(specified_cover("weather", 15.9) == 40);   // No.16 and smaller
  CHECK(specified_cover("weather", 19.1) == 50);   // No.19 and larger
  CHECK(specified_cover("ground", 12.7) == 75);
  CHECK(max_flexural_bar_spacing(120) == 360);     // 3h
  CHECK(max_flexural_bar_spacing(200) == 450);
  CHECK(max_shrinkage_bar_spacing(80) == 400);     // 5h
  // 24.3.2 at Grade 420 (fs = 280): min(380 − 2.5 × 20, 300) = 300 mm;
  // Grade 520 (fs = 346.7): min(306.9 − 50, 242.3) = 242.3 mm.
  CHECK(crack_control_spacing(service_steel_stress(420), 20) == Approx(300));
  CHECK(crack_control_spacing(service_steel_stress(520), 20) == Approx(300.0 * 280 / (2.0 / 3 * 520)));
  CHECK(crack_control_spacing(service_steel_stress(420), 50) == Approx(255));
  CHECK(minimum_flexural_steel(1000, 200) == Approx(360));
  CHECK(modulus_of_elasticity(28) == Approx(24870).epsilon(1e-4));  // 4700 √28
}

// A single span worked by hand (ACI 318-19 SI; our own case):
//   h = 200, f'c = 28, fy = 420, span 4.0 m, interior: cover 20 mm
//   D = 23.6 × 0.2 + 1.0 = 5.72 kPa; L = 2.4 kPa
//   U = max(1.4 × 5.72 = 8.008, 1.2 × 5.72 + 1.6 × 2.4 = 10.704) = 10.704 kPa
//   Mu = 10.704 × 4² / 8 = 21.408 kNm; Vu = 21.408 kN
//   #3: d = 200 − 20 − 9.5/2 = 175.25
//     As,req = 56.667 (175.25 − √(175.25² − 2 × 21.408e6/21420)) = 328.6 mm²
//     As,min = 0.0018 × 1000 × 200 = 360 mm²; #3 @ 175 = 405.7 (@ 200 = 355 < 360)
//   #4 @ 350 = 368.6 would be lighter but 350 > 300 (24.3.2 at fs = 280);
//   #4 @ 300 = 430 > 405.7 → #3 @ 175
//   a = 405.7 × 420/23800 = 7.160; c = 8.423; εt = 0.003 (175.25 − 8.423)/8.423 = 0.0594 → φ 0.9
//   φMn = 0.9 × 405.7 × 420 × (175.25 − 3.580) = 26.33 kNm
//   h,min = 4000/20 × 1.0 = 200 = h (utilisation 1.0)
//   shear: ρw = 0.002315, λs = 1 (d < 250), Vc = 0.66 × 0.13229 × 5.2915 × 175250 = 80.97 kN
//     φVc = 60.73 kN
//   distribution: 0.0018 Ag = 360 mm², s ≤ min(5h, 450) = 450 → #4 @ 350 (368.6)
TEST_CASE("ACI single span worked by hand", "[aci318][design][worked]") {
  armature::Registry reg({ARMATURE_CODE_DIR});
  auto r = armature::design(reg, nlohmann::json::parse(R"({
    "code": "ACI318-19",
    "slab": {"spans_m": [4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
    "concrete": {"cylinder_strength_MPa": 28},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 2.4}
  })"));
  CHECK(r.code.variant == "SI");
  CHECK(r.loads.uls * 1e3 == Approx(10.704));
  CHECK(r.loads.combination == "5.3.1b: 1.2 D + 1.6 L");
  REQUIRE(r.regions.size() == 1);  // ACI asks for no partial-fixity steel
  const auto& g = r.regions[0];
  CHECK(g.M_Ed * 1e-6 == Approx(21.408));
  CHECK(g.d_mm == Approx(175.25));
  CHECK(g.As_req_mm2 == Approx(328.6).epsilon(1e-3));
  CHECK(g.As_min_mm2 == Approx(360));
  CHECK(g.bars.bar == "#3");
  CHECK(g.bars.spacing_mm == 175);
  CHECK(g.bars.As_prov_mm2 == Approx(405.71).epsilon(1e-4));
  CHECK(g.checks.at(0).id == "bending");
  CHECK(g.checks.at(0).capacity == Approx(26.33).epsilon(1e-3));
  CHECK(r.supports.at(0).V_Rd * 1e-3 == Approx(60.73).epsilon(1e-3));
  CHECK(r.spans.at(0).checks.at(0).id == "deflection");
  CHECK(r.spans.at(0).checks.at(0).demand == Approx(200));
  CHECK(r.distribution.bars.bar == "#4");
  CHECK(r.distribution.bars.spacing_mm == 350);
  CHECK(r.pass);
  CHECK(r.governing_check == "deflection");
}
