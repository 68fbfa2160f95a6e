// Plug-in ABI. A code plug-in is a shared library named
// armature_code_<name>.so exporting, through Boost.DLL, one alias
// `armature_code_entry`: a function returning a pointer to a PluginEntry.
// The kernel reads abi_version first and touches nothing else when it
// differs from plugin_abi_version.
#pragma once

#include <cstdint>
#include <filesystem>
#include <memory>
#include <string>
#include <utility>
#include <vector>

#include <boost/dll/alias.hpp>

#include "armature/code.hpp"

namespace armature {

// Bump whenever anything in code.hpp, record.hpp, request.hpp or this file
// changes layout or meaning.
inline constexpr std::uint32_t plugin_abi_version = 12;

struct PluginContext {
  std::filesystem::path plugin_file;                 // the .so being loaded
  std::vector<std::filesystem::path> search_dirs;    // the registry's search path
};

// Made once per loaded plug-in; describes it and makes DesignCodes.
class CodeFactory {
 public:
  virtual ~CodeFactory() = default;
  virtual std::string id() const = 0;
  virtual std::string title() const = 0;
  virtual std::string edition() const = 0;
  virtual std::vector<std::string> variants() const = 0;
  virtual std::string default_variant() const = 0;
  // Throws std::invalid_argument for an unknown variant.
  virtual std::shared_ptr<const DesignCode> make(const std::string& variant,
                                                 const CodeHost& host) const = 0;
  // Data files the plug-in found but refused (file, reason); the registry
  // lists them with the load failures, and the plug-in works without them.
  virtual std::vector<std::pair<std::string, std::string>> data_problems() const { return {}; }
  // The slab types (contract-v2 slab.type) the code designs: a request for
  // another fails validation on slab.type. Default: the one-way strip.
  virtual std::vector<std::string> slab_types() const { return {"one_way"}; }
};

struct PluginEntry {
  std::uint32_t abi_version;
  // May throw; the kernel reports the message against the plug-in file.
  std::unique_ptr<CodeFactory> (*create_factory)(const PluginContext& context);
};

using PluginEntryFunction = const PluginEntry*();

}  // namespace armature

// Use once in a plug-in: ARMATURE_CODE_PLUGIN(my_entry_function)
#define ARMATURE_CODE_PLUGIN(entry_function) BOOST_DLL_ALIAS(entry_function, armature_code_entry)
