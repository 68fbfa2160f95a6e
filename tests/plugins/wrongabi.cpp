// A plug-in built against a different ABI version: must be refused on load.
#include "armature/plugin.hpp"

namespace {
std::unique_ptr<armature::CodeFactory> no_factory(const armature::PluginContext&) { return nullptr; }
}  // namespace

namespace wrongabi {
const armature::PluginEntry* entry() {
  static const armature::PluginEntry e{armature::plugin_abi_version + 100, &no_factory};
  return &e;
}
}  // namespace wrongabi

ARMATURE_CODE_PLUGIN(wrongabi::entry)
