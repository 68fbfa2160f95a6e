// Quantity strings against exact conversion factors (by definition:
// 1 in = 25.4 mm, 1 ft = 0.3048 m, 1 lbf = 4.4482216152605 N; hence
// 1 psf = 0.047880259 kPa and 1 psi = 0.0068947573 MPa to the figures quoted).
#include <catch2/catch.hpp>

#include "armature/units.hpp"

namespace {
double si(const std::string& text) {
  std::string error;
  auto q = armature::parse_quantity(text, error);
  INFO(text << ": " << error);
  REQUIRE(q.has_value());
  return q->si;
}
std::string error_of(const std::string& text) {
  std::string error;
  CHECK_FALSE(armature::parse_quantity(text, error).has_value());
  return error;
}
}  // namespace

TEST_CASE("Lengths", "[units]") {
  CHECK(si("8 in") == Approx(0.2032).epsilon(1e-15));
  CHECK(si("14 ft") == Approx(4.2672).epsilon(1e-15));
  CHECK(si("15 ft 6 in") == Approx(15 * 0.3048 + 6 * 0.0254).epsilon(1e-15));
  CHECK(si("0.75 in") == Approx(0.01905).epsilon(1e-15));
  CHECK(si("200 mm") == Approx(0.2));
  CHECK(si("4.2 m") == Approx(4.2));
  CHECK(si("20cm") == Approx(0.2));  // no space needed
}

TEST_CASE("Pressures, stresses and unit weights", "[units]") {
  CHECK(si("1 psf") / 1000 == Approx(0.047880259).epsilon(1e-9));
  CHECK(si("50 psf") / 1000 == Approx(2.39401295).epsilon(1e-9));
  CHECK(si("1 psi") / 1e6 == Approx(0.0068947573).epsilon(1e-9));
  CHECK(si("4000 psi") / 1e6 == Approx(27.5790292).epsilon(1e-9));
  CHECK(si("60 ksi") / 1e6 == Approx(413.685438).epsilon(1e-9));
  CHECK(si("2.5 kPa") == Approx(2500));
  CHECK(si("30 MPa") == Approx(30e6));
  CHECK(si("30 N/mm2") == Approx(30e6));
  // 150 lb/ft³ = 150 × 4.4482216 N / 0.0283168 m³ = 23.563 kN/m³.
  CHECK(si("150 pcf") / 1000 == Approx(23.5631).epsilon(1e-5));
  CHECK(si("150 lb/ft3") == si("150 pcf"));
}

TEST_CASE("Bad quantities say why", "[units]") {
  CHECK_THAT(error_of("8 kg"), Catch::Contains("unknown unit 'kg'"));
  CHECK_THAT(error_of("8"), Catch::Contains("a unit is needed"));
  CHECK_THAT(error_of("eight in"), Catch::Contains("expected a number"));
  CHECK_THAT(error_of("2 ft 3 psf"), Catch::Contains("mixes"));
  CHECK_THAT(error_of("2 kPa 3 kPa"), Catch::Contains("only lengths"));
  CHECK_THAT(error_of(""), Catch::Contains("empty"));
  CHECK_THAT(error_of("1e999 mm"), Catch::Contains("finite"));
}
