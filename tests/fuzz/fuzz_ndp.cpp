// Fuzz target: national-annex (NDP) data files. Any bytes either make a
// variant or are refused with std::invalid_argument naming the file.
#include <cstddef>
#include <cstdint>
#include <stdexcept>
#include <string>

#include "en1992/ndp.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    const auto ndp = armature::en1992::parse_ndp(text, "fuzz.en1992.json");
    if (ndp.variant.empty() || !(ndp.gamma_c >= 1.0)) __builtin_trap();  // accepted means valid
  } catch (const std::invalid_argument& e) {
    if (std::string(e.what()).rfind("fuzz.en1992.json: ", 0) != 0) __builtin_trap();  // names the file
  }
  return 0;
}
