// Studies: the product of axes, the objective of a candidate, the rates
// read from JSON, and the optimiser's thickness pruning against an
// exhaustive search. The scenario is our own: the workshop's hall floor,
// two spans over a wall. Expected objectives are the arithmetic of the
// objective's definition (DEVELOPERS.md "Optimise"), done by hand here;
// the rates are invented for the test.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include <nlohmann/json.hpp>

#include "armature/registry.hpp"
#include "armature/studies.hpp"

using nlohmann::json;

namespace {

json hall() {
  return {{"code", "EN1992-1-1"},
          {"variant", "UK"},
          {"slab", {{"spans_m", {5.4, 6.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 200}}},
          {"concrete", {{"class", "C30/37"}}},
          {"loads", {{"dead_kPa", 1.5}, {"imposed_kPa", 4.0}, {"imposed_category", "C"}}}};
}

json invented_rates() {
  return {{"concrete_per_m3", 120.0},
          {"steel_per_tonne", 1100.0},
          {"formwork_per_m2", 25.0},
          {"carbon", {{"concrete_per_m3", {{"C25/30", 230.0}, {"C30/37", 260.0}, {"C40/50", 320.0}}},
                      {"steel_per_kg", 1.5}}}};
}

std::vector<std::string> fields(const armature::InputProblems& p) {
  std::vector<std::string> out;
  for (const auto& i : p.items()) out.push_back(i.field);
  return out;
}

armature::Study hall_study(std::vector<json> thicknesses, std::vector<json> classes) {
  std::vector<armature::StudyAxis> axes;
  axes.push_back({"slab.thickness_mm", std::move(thicknesses)});
  axes.push_back({"concrete.class", std::move(classes)});
  return armature::Study(hall(), axes);
}

}  // namespace

TEST_CASE("A study numbers its candidates with the first axis slowest", "[studies]") {
  const armature::Study s(hall(), {{"slab.thickness_mm", {160, 180, 200}}, {"concrete.class", {"C25/30", "C30/37"}}});
  REQUIRE(s.size() == 6);
  CHECK(s.value_index(3, 0) == 1);  // 180 mm
  CHECK(s.value_index(3, 1) == 1);  // C30/37
  const json r = s.request(4);
  CHECK(r["slab"]["thickness_mm"] == 200);
  CHECK(r["concrete"]["class"] == "C25/30");
  CHECK(r["loads"] == hall()["loads"]);  // the rest is the base's
  json req = hall();
  CHECK_THROWS_AS(armature::set_axis_value(req, hall(), "slab.spans_m[4]", 3.0), armature::InputError);
  armature::set_axis_value(req, hall(), "design.redistribution_percent", 10);  // made on the way
  CHECK(req["design"]["redistribution_percent"] == 10);
}

TEST_CASE("Cost and carbon per m2 follow their definitions", "[studies]") {
  // 0.2 m of concrete at 120 per m3 = 24; 9 kg of steel at 1100 per tonne
  // = 9.9; formwork 25 per m2 of soffit: 58.9 per m2 (hand arithmetic).
  CHECK(armature::cost_per_m2(120.0, 1100.0, 25.0, 200.0, 9.0) == Approx(58.9).epsilon(1e-12));
  // 0.2 m × 260 kgCO2e/m3 = 52; 9 kg × 1.5 = 13.5: 65.5 kgCO2e per m2.
  CHECK(armature::carbon_per_m2(260.0, 1.5, 200.0, 9.0) == Approx(65.5).epsilon(1e-12));
  armature::InputProblems p;
  const auto rates = armature::objective_from_json("cost", invented_rates(), p);
  REQUIRE(p.empty());
  // The bound is the objective without steel and grows with the thickness.
  CHECK(armature::objective_lower_bound(rates, "C30/37", 200.0) == Approx(49.0));
  CHECK(armature::objective_lower_bound(rates, "C30/37", 210.0) > armature::objective_lower_bound(rates, "C30/37", 200.0));
  const auto carbon = armature::objective_from_json("carbon", invented_rates(), p);
  CHECK(armature::objective_value(carbon, "C40/50", 250.0, 10.0) == Approx(0.25 * 320.0 + 15.0));
  const auto depth = armature::objective_from_json("depth", json(), p);
  CHECK(armature::objective_value(depth, "", 230.0, 10.0) == 230.0);
  const auto steel = armature::objective_from_json("steel_mass", json(), p);
  CHECK(armature::objective_value(steel, "", 230.0, 10.5) == 10.5);
  CHECK(p.empty());
  // Concrete priced per class.
  json by_class = invented_rates();
  by_class["concrete_per_m3"] = {{"C25/30", 110.0}, {"C30/37", 118.0}};
  const auto per_class = armature::objective_from_json("cost", by_class, p);
  REQUIRE(p.empty());
  CHECK(armature::objective_value(per_class, "C25/30", 200.0, 9.0) == Approx(22.0 + 9.9 + 25.0));
}

TEST_CASE("Missing and bad rates are named by their field, all together", "[studies]") {
  armature::InputProblems p;
  armature::objective_from_json("cost", json{{"steel_per_tonne", -3}, {"formwork", 20}}, p);
  CHECK(fields(p) == std::vector<std::string>{"rates.formwork", "rates.concrete_per_m3", "rates.steel_per_tonne",
                                              "rates.formwork_per_m2"});
  CHECK(p.items()[2].message == "must be zero or more, got -3");
  armature::InputProblems q;
  armature::objective_from_json("carbon", json{{"carbon", {{"concrete_per_m3", {{"C30/37", "lots"}}}}}}, q);
  CHECK(fields(q) == std::vector<std::string>{"rates.carbon.steel_per_kg", "rates.carbon.concrete_per_m3[\"C30/37\"]"});
  armature::InputProblems r;
  armature::objective_from_json("price", json(), r);
  CHECK(fields(r) == std::vector<std::string>{"objective"});
  // A concrete class the study reaches with no factor, and a bad axis, together.
  auto& reg = armature::Registry::shared();
  const auto study = armature::Study(hall(), {{"slab.thickness_mm", {180, "thick"}}, {"concrete.class", {"C30/37", "C35/45"}},
                                             {"slab.thicknes_mm", {200}}});
  try {
    armature::optimise(reg, study, "carbon", invented_rates());
    FAIL("no InputError");
  } catch (const armature::InputError& e) {
    std::vector<std::string> f;
    for (const auto& i : e.problems()) f.push_back(i.field);
    CHECK(f == std::vector<std::string>{"vary.slab.thickness_mm[1]"});
  }
  const auto misspelt = armature::Study(hall(), {{"slab.thicknes_mm", {180}}});
  CHECK_THROWS_WITH(armature::optimise(reg, misspelt, "depth", json()),
                    "vary.slab.thicknes_mm: not a request field");
  const auto no_factor = hall_study({180, 200}, {"C30/37", "C35/45"});
  CHECK_THROWS_WITH(armature::optimise(reg, no_factor, "carbon", invented_rates()),
                    Catch::Contains("rates.carbon.concrete_per_m3[\"C35/45\"]: missing"));
}

TEST_CASE("The pruned search chooses what the exhaustive search chooses", "[studies]") {
  auto& reg = armature::Registry::shared();
  const auto study = hall_study({150, 160, 170, 180, 190, 200, 220, 240, 260, 280, 300},
                                {"C25/30", "C30/37", "C40/50"});
  for (const char* objective : {"cost", "carbon", "depth"}) {
    INFO(objective);
    const auto pruned = armature::optimise(reg, study, objective, invented_rates(), 2, true);
    const auto full = armature::optimise(reg, study, objective, invented_rates(), 2, false);
    REQUIRE(full.pruned == 0);
    REQUIRE(full.chosen_passes);
    CHECK(pruned.pruned > 0);  // the bound did leave some thicknesses undesigned
    CHECK(pruned.designed + pruned.pruned + pruned.invalid == study.size());
    CHECK(pruned.chosen == full.chosen);
    CHECK(pruned.rows[pruned.chosen].objective == full.rows[full.chosen].objective);
    for (std::size_t i = 0; i < study.size(); ++i) {
      const auto& a = pruned.rows[i];
      const auto& b = full.rows[i];
      if (a.pruned) {
        // Its objective exceeds a passing candidate's, no thicker: not
        // optimal, not on the front.
        CHECK(b.objective > full.rows[full.chosen].objective);
        CHECK_FALSE(b.pareto);
        continue;
      }
      CHECK(a.objective == b.objective);
      CHECK(a.pareto == b.pareto);
    }
  }
}

TEST_CASE("With no passing candidate the least-failing is returned, with status fail", "[studies]") {
  auto& reg = armature::Registry::shared();
  const auto study = hall_study({120, 130, 140}, {"C25/30", "C30/37"});  // all too thin for 6 m
  const auto found = armature::optimise(reg, study, "cost", invented_rates());
  CHECK_FALSE(found.chosen_passes);
  CHECK(found.pruned == 0);
  double least = INFINITY;
  for (const auto& r : found.rows) {
    REQUIRE(r.designed);
    CHECK_FALSE(r.pass);
    least = std::min(least, r.max_utilisation);
  }
  CHECK(found.rows[found.chosen].max_utilisation == least);
  CHECK(found.message.rfind("no candidate passes every check: the least-failing is returned, with status fail", 0) == 0);
}

TEST_CASE("Sweeps and searches on several threads equal one thread", "[studies][threads]") {
  auto& reg = armature::Registry::shared();
  const auto study = hall_study({150, 170, 190, 210, 230}, {"C25/30", "C30/37", "C40/50"});
  const auto one = armature::sweep(reg, study, 1);
  const auto three = armature::sweep(reg, study, 3);
  REQUIRE(one.size() == study.size());
  for (std::size_t i = 0; i < one.size(); ++i) {
    CHECK(one[i].designed == three[i].designed);
    CHECK(one[i].pass == three[i].pass);
    CHECK(one[i].steel_kg_m2 == three[i].steel_kg_m2);
    CHECK(one[i].governing_check == three[i].governing_check);
  }
  const auto a = armature::optimise(reg, study, "carbon", invented_rates(), 1);
  const auto b = armature::optimise(reg, study, "carbon", invented_rates(), 3);
  CHECK(a.chosen == b.chosen);
  CHECK(a.pruned == b.pruned);
  for (std::size_t i = 0; i < a.rows.size(); ++i) {
    CHECK(a.rows[i].pruned == b.rows[i].pruned);
    CHECK((a.rows[i].pruned || a.rows[i].objective == b.rows[i].objective));
  }
}
