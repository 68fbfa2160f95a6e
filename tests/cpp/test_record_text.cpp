// How numbers, bars and derivation steps are written in the calculation
// record, the CLI summary and the codes' steps (issue 12, item 14).
#include <catch2/catch.hpp>

#include <limits>
#include <regex>

#include "armature/design.hpp"
#include "armature/format.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "armature/steps.hpp"

using armature::bar_arrangement;
using armature::plain_number;
using nlohmann::json;

namespace {
armature::Registry& registry() {
  static armature::Registry reg({ARMATURE_CODE_DIR});
  return reg;
}
}  // namespace

// Four significant figures of the value held, as printf rounds it (common
// practice for a calculation record: no more figures than the data
// justify), never in exponent form.
TEST_CASE("plain_number writes four significant figures in plain notation", "[format]") {
  CHECK(plain_number(8000) == "8000");          // printf %.4g gave 8000, %.3g gave 8e+03
  CHECK(plain_number(125000) == "125000");      // %.4g gives 1.25e+05
  CHECK(plain_number(0.006637) == "0.006637");
  CHECK(plain_number(1.0) == "1");
  CHECK(plain_number(0.0051) == "0.0051");
  CHECK(plain_number(-12.5) == "-12.5");
  CHECK(plain_number(3.725e-15) == "0");       // rounding noise of a zero moment
  // Rounding to four figures, in each decade.
  CHECK(plain_number(0.00663749) == "0.006637");
  CHECK(plain_number(0.0066375) == "0.006638");
  CHECK(plain_number(123456) == "123500");
  CHECK(plain_number(9999.7) == "10000");
  CHECK(plain_number(21.97e6) == "21970000");
  CHECK(plain_number(434.78) == "434.8");
  CHECK(plain_number(0.45) == "0.45");
  CHECK(plain_number(-0.08574) == "-0.08574");
  CHECK(plain_number(-0.0) == "0");
  // Noise is judged against the scale of the quantity printed beside it:
  // 2e-8 kNm beside 25 kNm is noise, 2e-8 alone is a value.
  CHECK(plain_number(-2.421e-8, 25.0) == "0");
  CHECK(plain_number(2e-8) == "0.00000002");
  CHECK(plain_number(0.001, 1.0) == "0.001");
  CHECK(plain_number(std::numeric_limits<double>::infinity()) == "inf");
}

TEST_CASE("bar_arrangement names bars by diameter or by catalogue name", "[format]") {
  CHECK(bar_arrangement("12", 175) == "ø12 @ 175 mm");
  CHECK(bar_arrangement("#4", 300) == "#4 @ 300 mm");
  CHECK(bar_arrangement("No.13", 300) == "No.13 @ 300 mm");
  CHECK(bar_arrangement("#4", 300 / 25.4, "in") == "#4 @ 11.81 in");  // 300 mm = 11.811 in
}

// The codes' derivations substitute values; a step with nothing to
// substitute leaves `substituted` empty rather than repeating its result,
// and writes no number in exponent form (21.97 × 10⁶, not 21.97e6).
TEST_CASE("No code step substitutes its own result or writes an exponent", "[format][record]") {
  const json requests[] = {
      // EN, UK: three spans with a cantilever, h 220 (crack control), 6.10a/b,
      // 10 % redistribution (5.5(4) steps), fire, computed cover.
      json::parse(R"({"code": "EN1992-1-1", "variant": "UK",
        "slab": {"spans_m": [3.9, 4.4, 1.3], "ends": ["pinned", "free"], "thickness_mm": 220},
        "concrete": {"class": "C28/35"}, "loads": {"dead_kPa": 1.2, "imposed_kPa": 3.5},
        "durability": {"exposure": "XC3"}, "fire": {"resistance_min": 60},
        "design": {"combination": "6.10a/b", "redistribution_percent": 10}})"),
      // EN, recommended values, cover given.
      json::parse(R"({"code": "EN1992-1-1",
        "slab": {"spans_m": [3.4, 3.4], "ends": ["pinned", "fixed"], "thickness_mm": 170},
        "concrete": {"class": "C30/37"}, "loads": {"imposed_kPa": 2.2},
        "durability": {"cover_mm": 30}})"),
      // ACI 318-19, two spans.
      json::parse(R"({"code": "ACI318-19",
        "slab": {"spans_m": [3.6, 4.1], "ends": ["pinned", "pinned"], "thickness_mm": 190},
        "concrete": {"cylinder_strength_MPa": 28}, "loads": {"dead_kPa": 0.8, "imposed_kPa": 2.4}})"),
  };
  const std::regex exponent("[0-9][eE][+-]?[0-9]");
  for (const auto& req : requests) {
    const auto rec = armature::design(registry(), req, armature::Detail::steps);
    std::size_t steps = 0;
    for (const armature::Check* c : rec.all_checks())
      for (const auto& s : c->steps) {
        ++steps;
        INFO(c->id.str() + " at " + c->where + ": " + s.symbol + " = " + s.expression + " = " + s.substituted);
        CHECK(s.substituted != armature::step_number(s.result));
        CHECK_FALSE(std::regex_search(s.substituted, exponent));
        CHECK_FALSE(std::regex_search(s.expression, exponent));
      }
    CHECK(steps > 30);
  }
}
