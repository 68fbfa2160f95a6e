// Published worked examples run end to end through the design driver.
//
// Each value below is read from a publication (named beside it) and compared
// with what armature reports, either as a field of the result or as a line of
// the chosen arrangement's derivation (Detail::steps). The tolerance beside
// each value is set from the way the publication rounds or looks up that
// value, and says so. Where the publication's method differs from armature's
// (a chart instead of a formula, a different clause for the same quantity),
// only the quantities that follow the same clause are compared, and the
// reason is written beside the test.
//
// ACI 318-19: no published one-way slab worked example could be found in the
// public pages available to the search tool with enough of its inputs and
// results legible to reproduce end to end, so none is here (see the report of
// issue 12, item 17). A check not implemented is absent, never faked.
#include <catch2/catch.hpp>

#include <stdexcept>
#include <string>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

using nlohmann::json;

namespace {
armature::Registry& registry() {
  static armature::Registry reg({ARMATURE_CODE_DIR});
  return reg;
}

// The check with this id at this place whose clause contains `clause_part`.
const armature::Check& check_at(const armature::DesignRecord& r, const std::string& id,
                                const std::string& where, const std::string& clause_part = "") {
  for (const armature::Check* c : r.all_checks())
    if (c->id == id && c->where == where && c->clause.str().find(clause_part) != std::string::npos)
      return *c;
  throw std::runtime_error("no check " + id + " at " + where + " (" + clause_part + ")");
}

// The result of the derivation line whose symbol is `symbol`.
double step(const armature::Check& c, const std::string& symbol) {
  for (const auto& s : c.steps)
    if (s.symbol == symbol) return s.result;
  throw std::runtime_error("no step " + symbol + " in " + c.id.str() + " at " + c.where);
}

const armature::RegionRecord& region(const armature::DesignRecord& r, const std::string& where) {
  for (const auto& g : r.regions)
    if (g.where == where) return g;
  throw std::runtime_error("no region " + where);
}
}  // namespace

// The Concrete Centre, "Worked Examples to Eurocode 2: Volume 1" (CCIP-041,
// 2009), Section 3.1 "Simply supported one-way slab", pp. 36-37, as
// reproduced at https://www.scribd.com/doc/260829904/Worked-Example-Extract-Slabs
// (and https://www.scribd.com/document/458244764/Pages-from-Worked-Eurocode-2).
// Below "[WE 3.1 p.NN]".
//
// Inputs of the example: h = 175 mm, span 4800 mm on load-bearing walls
// (pinned-pinned), fck = 30 MPa (C30/37), fyk = 500 MPa, concrete 25 kN/m³;
// 50 mm screed 1.0 + finishes and services 0.5 kPa; offices B1 2.5 kPa +
// movable partitions 0.8 kPa = qk 3.3 kPa; XC1, 50 years, REI 60; UK National
// Annex, BS EN 1990 Exp. (6.10a/b); 12 mm main bars; cnom = 25 mm.
//
// How the request is made fair:
// - cover_mm is given as 25: the example takes cmin,dur = 15 mm from BS 8500-1
//   (Table A4), which armature does not reproduce (its UK variant uses Table
//   4.4N and warns); with cnom given, d follows from the same rule
//   d = h − cnom − φ/2 in both.
// - bars are limited to ø12, the size the example assumes from the start.
// - Office floors are EN 1991-1-1 category B (ψ0 = 0.7, ψ2 = 0.3); the
//   example's partition allowance is part of qk, as in the request.
//
// Not compared, because the method differs:
// - The final bar arrangement and the allowed l/d: the example takes
//   F3 = 310/σs with σs worked out from the quasi-permanent load (continued
//   on p. 38, not in the reproduction), armature uses the conservative
//   (7.17), 310/σs = (500/fyk)(As,prov/As,req) ≤ 1.5, which EN 1992-1-1
//   7.4.2(2) allows. Armature therefore ends with ø12 @ 125 where the
//   example's first trial is H12 @ 175; both are correct applications.
// - "Basic span-to-effective-depth ratio for ρ = 0.41% = 20" (p. 37) is the
//   book's quick first look, read from its design chart; armature evaluates
//   Exp. (7.16a) instead (N below, which the example also works).
// - cmin,dur (BS 8500-1 in the example, Table 4.4N in armature).
//
// Pending changes of issue 12 that touch nothing asserted here: the UK cap
// l/d ≤ 40K (allowed 37.6 here, and not asserted), ψ per variant (category B
// ψ0 unchanged), the UK shear fck ≤ 50 cap (fck 30). Reported cover per face
// would change only how cover_mm is reported, not d = 144 mm.
TEST_CASE("TCC Worked Examples to EC2 Vol 1 section 3.1 simply supported one-way slab",
          "[published][en1992]") {
  json req = json::parse(R"({
    "code": "EN1992-1-1", "variant": "UK",
    "slab": {"spans_m": [4.8], "ends": ["pinned", "pinned"], "thickness_mm": 175},
    "concrete": {"class": "C30/37", "density_kN_m3": 25},
    "reinforcement": {"yield_strength_MPa": 500, "bars": ["12"]},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.3, "imposed_category": "B"},
    "durability": {"cover_mm": 25, "exposure": "XC1", "design_life_years": 50},
    "fire": {"resistance_min": 60},
    "design": {"combination": "6.10a/b"}
  })");
  const auto r = armature::design(registry(), req, armature::Detail::steps);

  // 3.1.1 Actions [WE 3.1 p.36]: self-weight 0.175 × 25 = 4.4 kPa and
  // gk = 5.9 kPa, both printed to 0.1 kPa (±0.05).
  CHECK(r.loads.self_weight * 1e3 == Approx(4.4).margin(0.05));
  CHECK(r.loads.Gk * 1e3 == Approx(5.9).margin(0.05));

  // 3.1.3 Load combination [WE 3.1 p.37]: "By inspection, BS EN 1990 Exp.
  // (6.10b) governs, n = 1.25 × 5.9 + 1.5 × 3.3 = 12.3 kN/m²". The example
  // writes ξγG = 0.925 × 1.35 = 1.249 as 1.25 and n to 0.1 kPa (±0.05).
  CHECK(r.loads.combination.rfind("6.10b", 0) == 0);
  CHECK(r.loads.uls * 1e3 == Approx(12.3).margin(0.05));

  // 3.1.4 Analysis [WE 3.1 p.37]: MEd = 12.3 × 4.8²/8 = 35.4 kNm/m and
  // V = 12.3 × 4.8/2 = 29.5 kN/m, both to 0.1 (±0.05). Statics of a simple
  // span: armature's elastic analysis follows the same equilibrium.
  const auto& span = region(r, "span 1");
  CHECK(span.M_Ed * 1e-6 == Approx(35.4).margin(0.05));
  REQUIRE(r.supports.size() == 2);
  CHECK(r.supports[0].V_Ed * 1e-3 == Approx(29.5).margin(0.05));
  CHECK(r.supports[1].V_Ed * 1e-3 == Approx(29.5).margin(0.05));

  // 3.1.5 Flexural design [WE 3.1 p.37]: d = 175 − 25 − 12/2 = 144 mm, exact.
  CHECK(span.d_mm == Approx(144.0));
  CHECK(span.bars.bar == "12");
  const auto& bending = check_at(r, "bending", "span 1");
  // K = 35.4e6/(1000 × 144² × 30) = 0.057, printed to three decimals (±0.0005).
  CHECK(step(bending, "K") == Approx(0.057).margin(0.0005));
  // z = 0.95 × 144 = 137 mm: the example reads z/d = 0.95 from a table
  // (Fig. 3.5, Appendix A1, Table C5) tabulated to two decimals, so its z is
  // good to ±0.005 d = ±0.72 mm; armature evaluates the formula of the
  // rectangular block (z/d = 0.947 at K = 0.0569).
  CHECK(step(bending, "z") == Approx(0.95 * 144).margin(0.005 * 144));
  // As = 35.4e6/(137 × 500/1.15) = 594 mm²/m (ρ = 0.41%). Tolerance 1%: z
  // carries ±0.5% from the table above and MEd ±0.15% from its rounding.
  // (p. 37 also writes As,req = 599 in the deflection check; both lie within.)
  CHECK(span.As_req_mm2 == Approx(594).epsilon(0.01));
  CHECK(step(bending, "As,req") == Approx(594).epsilon(0.01));

  // 3.1.6 Deflection [WE 3.1 p.37], the quantities of the same clause:
  const auto& defl = check_at(r, "deflection", "span 1");
  // ρ = 0.41%, printed to 0.01% (±0.005%); armature ρ = As,req/(b d).
  CHECK(step(defl, "ρ") * 100 == Approx(0.41).margin(0.005));
  // N = 25.6 for ρ = 0.41%, fck = 30 (Exp. (7.16a) through Appendix C
  // Tables C10-C13). With ρ only known to ±0.005%, (7.16a) itself spans
  // 25.0 (ρ = 0.415%) to 25.8 (ρ = 0.405%); the tolerance is that band.
  CHECK(step(defl, "l/d basic") == Approx(25.6).margin(0.6));
  // K = 1.0 (simply supported, Table 7.4N), F2 = 1.0 (span < 7.0 m), exact.
  CHECK(step(defl, "K") == Approx(1.0));
  CHECK(step(defl, "F_l") == Approx(1.0));
  // Actual span/depth 4800/144 (the example's "max. span ... × 144").
  CHECK(defl.demand == Approx(4800.0 / 144.0));

  // 3.1.2 Fire [WE 3.1 p.37], EN 1992-1-2 Table 5.8, REI 60: "Thickness,
  // hs,min = 80 mm cf. 175 mm proposed" and "Axis distance, amin = 20 mm cf.
  // 25 + φ/2 = 31", exact.
  const auto& axis = check_at(r, "fire", "span 1", "axis distance");
  CHECK(axis.demand == Approx(20.0));
  CHECK(axis.capacity == Approx(31.0));
  const auto& thickness = check_at(r, "fire", "span 1", "thickness");
  CHECK(thickness.demand == Approx(80.0));
  CHECK(thickness.capacity == Approx(175.0));

  // Shear resistance of the same slab section (h = 175, d = 144, fck = 30) is
  // worked in the book's continuous one-way slab example (Section 3.2; number
  // from memory), reproduced at
  // https://www.eurocode.us/concrete-structures-eurocode-3/shear.html:
  // "k = 1 + (200/d)^0.5 ≤ 2.0 ... k = 2.0" (exact) and
  // "VRd,c,min = 0.035 × 2^1.5 × 30^0.5 × 1000 × 144 = 0.54 × 1000 × 144",
  // vmin printed to two decimals (±0.005 MPa). Its VRd,c from ρ is not
  // compared: it takes ρ = 0.26% after curtailing half the span bars, while
  // armature takes the bars it provides at the support.
  for (const char* end : {"support 1", "support 2"}) {
    INFO(end);
    const auto& shear = check_at(r, "shear", end);
    CHECK(step(shear, "k") == Approx(2.0));
    CHECK(step(shear, "v_min") == Approx(0.54).margin(0.005));
  }
}
