// Finds and loads code plug-ins; opens DesignCodes by id and variant.
// Search order: ARMATURE_CODE_PATH (colon-separated), the install location
// relative to the kernel library, then the build tree.
#pragma once

#include <filesystem>
#include <memory>
#include <string>
#include <vector>

#include "armature/code.hpp"

namespace armature {

struct LoadedCodeInfo {
  std::string id;
  std::string title;
  std::string edition;
  std::vector<std::string> variants;
  std::string default_variant;
  std::string path;  // the plug-in file it came from
  std::vector<std::string> slab_types;  // "one_way", "two_way", "flat" (CodeFactory::slab_types)
};

struct PluginFailure {
  std::string path;    // file or directory
  std::string reason;
};

class Registry final : public CodeHost {
 public:
  // Loads every plug-in found in the directories, in order. The first
  // plug-in to claim a code id wins; later ones are reported as shadowed.
  explicit Registry(std::vector<std::filesystem::path> search_dirs);
  ~Registry() override;
  Registry(const Registry&) = delete;
  Registry& operator=(const Registry&) = delete;

  // The default search path: $ARMATURE_CODE_PATH, install, build tree.
  static std::vector<std::filesystem::path> default_search_dirs();
  // Directories named in ARMATURE_CODE_PATH that do not exist are failures.
  static Registry& shared();  // process-wide registry on the default path

  const std::vector<LoadedCodeInfo>& codes() const;
  const std::vector<PluginFailure>& failures() const;
  const std::vector<std::filesystem::path>& search_dirs() const;

  // Empty variant: the plug-in's default. Throws InputError naming the
  // field `code` or `variant` when either is unknown.
  std::shared_ptr<const DesignCode> open(const std::string& id,
                                         const std::string& variant) const override;

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace armature
