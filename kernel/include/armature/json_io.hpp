// JSON at the boundary: request in (with validation), result out.
// Units convert here: m, kPa, kN, kNm outside; mm, MPa, N, N·mm inside.
#pragma once

#include <nlohmann/json.hpp>

#include "armature/design.hpp"
#include "armature/errors.hpp"
#include "armature/request.hpp"

namespace armature {

// Structural validation: types, required fields, unknown keys, generic
// ranges. Code-specific ranges are the code's validate(). Problems are
// added, never thrown.
Request request_from_json(const nlohmann::json& j, InputProblems& problems);

// True when the request gives `field` ("concrete.density_kN_m3"), under
// that name or its plain-name alias ("concrete.density": "150 pcf").
bool request_gives(const nlohmann::json& j, const std::string& field);

// The result of contract.md. Steps are included only when asked for.
nlohmann::json result_to_json(const DesignRecord& record, bool with_steps = false);
// The same result as JSON text, written directly (keys in the schema's
// order): compact when indent < 0, else pretty with that many spaces.
std::string result_to_json_text(const DesignRecord& record, int indent = -1, bool with_steps = false);

}  // namespace armature
