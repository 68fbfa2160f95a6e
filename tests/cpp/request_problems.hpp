// Test helpers: the input problems a request's design raises, as
// "field: message" lines, and a search among them.
#pragma once

#include <algorithm>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "armature/design.hpp"
#include "armature/errors.hpp"
#include "armature/registry.hpp"

namespace armature::testing {

// The registry of the build tree's code plug-ins, one per test program.
inline Registry& build_registry() {
  static Registry reg({ARMATURE_CODE_DIR});
  return reg;
}

// Every problem of the InputError the design throws; none when it designs.
inline std::vector<std::string> problem_fields(const Registry& registry, const nlohmann::json& request) {
  try {
    design(registry, request);
  } catch (const InputError& e) {
    std::vector<std::string> out;
    for (const auto& p : e.problems()) out.push_back(p.field + ": " + p.message);
    return out;
  }
  return {};
}

// Whether a problem names `field` with `text` in its message.
inline bool has_problem(const std::vector<std::string>& problems, const std::string& field, const std::string& text = "") {
  return std::any_of(problems.begin(), problems.end(), [&](const std::string& p) {
    return p.rfind(field + ": ", 0) == 0 && p.find(text) != std::string::npos;
  });
}

}  // namespace armature::testing
