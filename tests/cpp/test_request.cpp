// Request parsing and validation: one message per problem, each naming its
// field; unknown keys are errors.
#include <catch2/catch.hpp>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

using nlohmann::json;

namespace {
json base() {
  return json::parse(R"({
    "code": "EN1992-1-1", "variant": "UK",
    "slab": {"spans_m": [4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 2.5}
  })");
}

std::vector<armature::InputProblem> problems_of(const json& request) {
  armature::Registry reg({ARMATURE_CODE_DIR});
  try {
    armature::design(reg, request);
  } catch (const armature::InputError& e) {
    return e.problems();
  }
  return {};
}
}  // namespace

TEST_CASE("A valid request parses into kernel units", "[request]") {
  armature::InputProblems problems;
  auto req = armature::request_from_json(base(), problems);
  CHECK(problems.empty());
  CHECK(req.slab.spans_mm.at(0) == Approx(4000.0));
  CHECK(req.loads.imposed_MPa == Approx(2.5e-3));  // 1 kPa = 1e-3 N/mm²
  CHECK(req.slab.strip_width_mm == 1000.0);        // contract default
  CHECK(req.loads.imposed_category == "B");        // contract default
}

TEST_CASE("Every problem is reported with its field path", "[request]") {
  json r = base();
  r["slab"]["thickness_mm"] = -200;
  r["slab"]["spanz"] = 3;
  r["loads"]["imposed_kPa"] = "lots";
  r["concrete"]["class"] = "C31/38";
  auto ps = problems_of(r);
  std::vector<std::string> fields;
  for (const auto& p : ps) fields.push_back(p.field);
  CHECK_THAT(fields, Catch::UnorderedEquals(std::vector<std::string>{
                         "slab.thickness_mm", "slab.spanz", "loads.imposed_kPa", "concrete.class"}));
  for (const auto& p : ps)
    if (p.field == "slab.thickness_mm")
      CHECK(p.text() == "slab.thickness_mm: must be between 50 and 1500 mm, got -200");
}

TEST_CASE("Code-specific ranges come from the code", "[request]") {
  json r = base();
  r["concrete"] = {{"cylinder_strength_MPa", 95}};
  r["reinforcement"] = {{"yield_strength_MPa", 650}, {"bars", {"10", "11"}}};
  r["durability"] = {{"exposure", "XC9"}, {"cover_mm", 150}};
  auto ps = problems_of(r);
  std::vector<std::string> fields;
  for (const auto& p : ps) fields.push_back(p.field);
  CHECK_THAT(fields, Catch::UnorderedEquals(std::vector<std::string>{
                         "concrete.cylinder_strength_MPa", "reinforcement.yield_strength_MPa",
                         "reinforcement.bars[1]", "durability.exposure", "durability.cover_mm"}));
}
