// Calls from the kernel into a code plug-in (the driver and the bar search).
#pragma once

#include <string>
#include <string_view>

#include "armature/code.hpp"
#include "armature/errors.hpp"

namespace armature {

// Calls into a code plug-in; any failure becomes a DesignError that names
// the code, the variant and the check or stage (with the place, if given).
template <class Fn>
auto call_code(const CodeIdentity& code, std::string_view stage, Fn&& fn,
               std::string_view place = {}) -> decltype(fn()) {
  // The message is built only on failure: this sits on the bar search's path.
  auto who = [&] { return code.id + " (" + code.variant + ")"; };
  auto during = [&] {
    std::string s(stage);
    if (!place.empty()) s.append(" of ").append(place);
    return s;
  };
  try {
    return fn();
  } catch (const InputError&) {
    throw;
  } catch (const CheckError& e) {
    throw DesignError(who() + ": check '" + e.check_id() + "' failed during " + during() + ": " + e.what());
  } catch (const std::exception& e) {
    throw DesignError(who() + ": failed during " + during() + ": " + e.what());
  } catch (...) {
    throw DesignError(who() + ": failed during " + during() + " with an unknown exception");
  }
}

}  // namespace armature
