// The JSON text of a result, written directly, against the same result
// built as a nlohmann::json value (the JSON library is the reference).
#include <catch2/catch.hpp>

#include <cmath>
#include <limits>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

using nlohmann::json;

namespace {
armature::Registry& registry() {
  static armature::Registry reg({ARMATURE_CODE_DIR});
  return reg;
}

armature::DesignRecord designed(const json& request, armature::Detail detail) {
  return armature::design(registry(), request, detail);
}

// Both texts read back by the JSON library and written again by it.
void same_as_library(const armature::DesignRecord& r, bool with_steps) {
  const json reference = json::parse(armature::result_to_json(r, with_steps).dump());
  for (int indent : {-1, 0, 2}) {
    INFO("indent " << indent);
    const std::string text = armature::result_to_json_text(r, indent, with_steps);
    CHECK(json::parse(text) == reference);
  }
}
}  // namespace

TEST_CASE("result JSON text: the same values as the JSON library writes", "[json]") {
  const json single = {{"code", "EN1992-1-1"}, {"variant", "UK"},
                       {"slab", {{"spans_m", {4.5}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 200}}},
                       {"concrete", {{"class", "C30/37"}}},
                       {"loads", {{"dead_kPa", 1.5}, {"imposed_kPa", 3.0}}}};
  json continuous = single;
  continuous["slab"]["spans_m"] = {4.2, 4.8, 3.6};
  continuous["slab"]["ends"] = {"fixed", "free"};
  json aci = {{"code", "ACI318-19"},
              {"slab", {{"spans_m", {4.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 180}}},
              {"concrete", {{"cylinder_strength_MPa", 28}}},
              {"loads", {{"dead_kPa", 1.0}, {"imposed_kPa", 4.8}}}};
  for (const json& req : {single, continuous, aci}) {
    INFO(req.dump());
    same_as_library(designed(req, armature::Detail::checks), false);
    same_as_library(designed(req, armature::Detail::steps), true);  // steps hold φ, √, ² …
  }
}

TEST_CASE("result JSON text: escapes, whole numbers and non-finite values", "[json]") {
  const json req = {{"code", "EN1992-1-1"},
                    {"slab", {{"spans_m", {4.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 200}}},
                    {"concrete", {{"class", "C25/30"}}},
                    {"loads", {{"dead_kPa", 1.0}, {"imposed_kPa", 2.5}}}};
  auto r = designed(req, armature::Detail::checks);
  // Every character JSON must escape, and text beyond ASCII.
  r.warnings.push_back("quote \" backslash \\ newline \n tab \t return \r bell \x07 unit \x1f ≤ φ");
  r.regions.at(0).checks.at(0).utilisation = std::numeric_limits<double>::infinity();
  r.regions.at(0).checks.at(0).demand = std::nan("");
  r.regions.at(0).x_mm = 2000.0;  // a whole number
  same_as_library(r, false);
  const std::string text = armature::result_to_json_text(r);
  CHECK(text.find("\"x_m\":2.0") != std::string::npos);        // whole numbers keep ".0"
  CHECK(text.find("\"utilisation\":null") != std::string::npos);  // as the library writes inf
  CHECK(text.find("\\u0007") != std::string::npos);
  CHECK(text.find("\\u001f") != std::string::npos);
}
