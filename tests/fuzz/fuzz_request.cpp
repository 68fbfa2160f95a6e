// Fuzz target: the request entry point. Any bytes go through JSON parsing,
// validation and design; the only acceptable outcomes are a result or an
// InputError. A crash, a hang or any other exception is a finding.
#include <cstddef>
#include <cstdint>
#include <string>

#include <nlohmann/json.hpp>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  static armature::Registry& registry = armature::Registry::shared();
  const std::string text(reinterpret_cast<const char*>(data), size);
  nlohmann::json request;
  try {
    request = nlohmann::json::parse(text);
  } catch (const nlohmann::json::exception&) {  // parse errors and number overflow
    return 0;  // refused at the boundary, as the CLI refuses it
  }
  try {
    const auto record = armature::design(registry, request);
    // The result must serialise (valid UTF-8), and the direct text writer
    // must say the same as the JSON library.
    const std::string expected = armature::result_to_json(record).dump();
    if (nlohmann::json::parse(armature::result_to_json_text(record)).dump() != expected) __builtin_trap();
  } catch (const armature::InputError& e) {
    if (e.problems().empty()) __builtin_trap();  // an input error must say what is wrong
  }
  return 0;
}
