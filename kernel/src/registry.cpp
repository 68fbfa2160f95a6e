// Plug-in discovery and loading with Boost.DLL. Every failure is recorded
// against the file or directory and loading goes on with the rest.
#include "armature/registry.hpp"

#include <algorithm>
#include <cstdlib>
#include <map>
#include <mutex>
#include <system_error>

#include <boost/dll/runtime_symbol_info.hpp>
#include <boost/dll/shared_library.hpp>

#include "armature/plugin.hpp"
#include "record/label_cache.hpp"

#ifndef ARMATURE_BUILD_CODE_DIR
#define ARMATURE_BUILD_CODE_DIR ""
#endif
#ifndef ARMATURE_BUILD_LIB_DIR
#define ARMATURE_BUILD_LIB_DIR ""
#endif

namespace armature {

namespace fs = std::filesystem;

namespace {
constexpr const char* entry_symbol = "armature_code_entry";
constexpr const char* file_prefix = "armature_code_";
constexpr const char* file_suffix = ".so";

bool is_plugin_file_name(const std::string& name) {
  return name.size() > std::string(file_prefix).size() + std::string(file_suffix).size() &&
         name.rfind(file_prefix, 0) == 0 &&
         name.compare(name.size() - 3, 3, file_suffix) == 0;
}

std::vector<std::string> split_path_list(const std::string& list) {
  std::vector<std::string> parts;
  std::string current;
  for (char ch : list) {
    if (ch == ':') {
      if (!current.empty()) parts.push_back(current);
      current.clear();
    } else {
      current += ch;
    }
  }
  if (!current.empty()) parts.push_back(current);
  return parts;
}
}  // namespace

struct LoadedPlugin {
  // Order matters: the factory is destroyed before the library it came from.
  std::shared_ptr<boost::dll::shared_library> library;
  std::unique_ptr<CodeFactory> factory;
  LoadedCodeInfo info;
};

struct Registry::Impl {
  std::vector<fs::path> dirs;
  std::vector<LoadedPlugin> plugins;
  std::vector<LoadedCodeInfo> infos;
  std::vector<PluginFailure> failures;
  // DesignCodes are immutable: each (id, variant) is made once and shared.
  mutable std::mutex opened_mutex;
  mutable std::map<std::pair<std::string, std::string>, std::shared_ptr<const DesignCode>> opened;

  void load_file(const fs::path& file);
};

void Registry::Impl::load_file(const fs::path& file) {
  auto fail = [&](const std::string& reason) { failures.push_back({file.string(), reason}); };
  // Labels remember string literals by address: they forget them before
  // the library is unloaded, as a later library may reuse its addresses
  // (and again after, for a label its static destructors may have made).
  std::shared_ptr<boost::dll::shared_library> library(new boost::dll::shared_library(),
                                                      [](boost::dll::shared_library* unloading) {
                                                        forget_remembered_literals();
                                                        delete unloading;
                                                        forget_remembered_literals();
                                                      });
  try {
    library->load(file, boost::dll::load_mode::rtld_now | boost::dll::load_mode::rtld_local);
  } catch (const std::exception& e) {
    fail(std::string("not a loadable library: ") + e.what());
    return;
  }
  if (!library->has(entry_symbol)) {
    fail(std::string("no entry point '") + entry_symbol + "': not an armature code plug-in");
    return;
  }
  const PluginEntry* entry = nullptr;
  try {
    entry = library->get_alias<PluginEntryFunction>(entry_symbol)();
  } catch (const std::exception& e) {
    fail(std::string("entry point failed: ") + e.what());
    return;
  }
  if (entry == nullptr) {
    fail("entry point returned nothing");
    return;
  }
  if (entry->abi_version != plugin_abi_version) {
    fail("plug-in ABI version " + std::to_string(entry->abi_version) +
         ", this kernel expects " + std::to_string(plugin_abi_version) +
         ": rebuild the plug-in against this kernel");
    return;
  }
  LoadedPlugin plugin;
  plugin.library = library;
  try {
    plugin.factory = entry->create_factory(PluginContext{file, dirs});
    if (!plugin.factory) {
      fail("plug-in made no code factory");
      return;
    }
    plugin.info.id = plugin.factory->id();
    plugin.info.title = plugin.factory->title();
    plugin.info.edition = plugin.factory->edition();
    plugin.info.variants = plugin.factory->variants();
    plugin.info.default_variant = plugin.factory->default_variant();
    plugin.info.slab_types = plugin.factory->slab_types();
    plugin.info.path = file.string();
  } catch (const std::exception& e) {
    fail(std::string("plug-in failed while starting: ") + e.what());
    return;
  } catch (...) {
    fail("plug-in failed while starting with an unknown exception");
    return;
  }
  for (const auto& other : infos) {
    if (other.id == plugin.info.id) {
      fail("code '" + plugin.info.id + "' is already provided by " + other.path +
           " (earlier on the search path); this file is ignored");
      return;
    }
  }
  try {
    for (const auto& [data_file, reason] : plugin.factory->data_problems())
      failures.push_back({data_file, reason});
  } catch (const std::exception& e) {
    failures.push_back({file.string(), std::string("plug-in failed to list its data problems: ") + e.what()});
  }
  infos.push_back(plugin.info);
  plugins.push_back(std::move(plugin));
}

Registry::Registry(std::vector<fs::path> search_dirs) : impl_(std::make_unique<Impl>()) {
  // Drop repeated directories (the install and build locations may coincide).
  for (auto& d : search_dirs) {
    std::error_code ec;
    fs::path canonical = fs::weakly_canonical(d, ec);
    if (ec) canonical = d;
    if (std::find(impl_->dirs.begin(), impl_->dirs.end(), canonical) == impl_->dirs.end())
      impl_->dirs.push_back(canonical);
  }
  for (const auto& dir : impl_->dirs) {
    std::error_code ec;
    if (!fs::is_directory(dir, ec)) {
      impl_->failures.push_back({dir.string(), "plug-in directory does not exist"});
      continue;
    }
    std::vector<fs::path> files;
    for (const auto& entry : fs::directory_iterator(dir, ec))
      if (is_plugin_file_name(entry.path().filename().string())) files.push_back(entry.path());
    if (ec) {
      impl_->failures.push_back({dir.string(), "cannot read directory: " + ec.message()});
      continue;
    }
    std::sort(files.begin(), files.end());
    for (const auto& f : files) impl_->load_file(f);
  }
}

Registry::~Registry() = default;

std::vector<fs::path> Registry::default_search_dirs() {
  std::vector<fs::path> dirs;
  if (const char* env = std::getenv("ARMATURE_CODE_PATH"))
    for (const auto& part : split_path_list(env)) dirs.emplace_back(part);
  // Install location: <libdir>/armature/codes beside the kernel library.
  std::error_code ec;
  fs::path here = boost::dll::this_line_location(ec);
  fs::path installed = here.parent_path() / "armature" / "codes";
  if (!ec && fs::is_directory(installed, ec)) dirs.push_back(installed);
  // The build tree, only for the kernel library of that build tree (an
  // installed kernel never reaches back into the tree it was built in).
  fs::path build_tree = ARMATURE_BUILD_CODE_DIR;
  const bool in_build_tree =
      !ec && fs::weakly_canonical(here.parent_path(), ec) == fs::weakly_canonical(ARMATURE_BUILD_LIB_DIR, ec);
  if (in_build_tree && !build_tree.empty() && fs::is_directory(build_tree, ec)) dirs.push_back(build_tree);
  return dirs;
}

Registry& Registry::shared() {
  static Registry registry(default_search_dirs());
  return registry;
}

const std::vector<LoadedCodeInfo>& Registry::codes() const { return impl_->infos; }
const std::vector<PluginFailure>& Registry::failures() const { return impl_->failures; }
const std::vector<fs::path>& Registry::search_dirs() const { return impl_->dirs; }

std::shared_ptr<const DesignCode> Registry::open(const std::string& id,
                                                 const std::string& variant) const {
  for (const auto& p : impl_->plugins) {
    if (p.info.id != id) continue;
    const std::string& v = variant.empty() ? p.info.default_variant : variant;
    {
      std::lock_guard<std::mutex> lock(impl_->opened_mutex);
      auto it = impl_->opened.find({id, v});
      if (it != impl_->opened.end()) return it->second;
    }
    if (std::find(p.info.variants.begin(), p.info.variants.end(), v) == p.info.variants.end()) {
      std::string list;
      for (const auto& name : p.info.variants) list += (list.empty() ? "" : ", ") + name;
      throw InputError({{"variant", "code " + id + " has no variant '" + v +
                                        "'; it offers: " + list}});
    }
    std::shared_ptr<const DesignCode> code;
    try {
      code = p.factory->make(v, *this);
    } catch (const InputError&) {
      throw;
    } catch (const std::exception& e) {
      throw DesignError("code " + id + " (" + v + ") from " + p.info.path +
                        " failed to start: " + e.what());
    }
    if (!code) throw DesignError("code " + id + " (" + v + ") from " + p.info.path + " made nothing");
    // Keep the library loaded for as long as the code object lives.
    auto holder = std::make_shared<
        std::pair<std::shared_ptr<boost::dll::shared_library>, std::shared_ptr<const DesignCode>>>(
        p.library, std::move(code));
    std::shared_ptr<const DesignCode> shared(holder, holder->second.get());
    // Made outside the lock (a wrapping code opens another through this
    // registry); if two threads made it at once, the first one kept wins.
    std::lock_guard<std::mutex> lock(impl_->opened_mutex);
    return impl_->opened.emplace(std::make_pair(id, v), shared).first->second;
  }
  std::string list;
  for (const auto& info : impl_->infos) list += (list.empty() ? "" : ", ") + info.id;
  throw InputError({{"code", "unknown code '" + id + "'; loaded codes: " +
                                 (list.empty() ? std::string("none") : list)}});
}

}  // namespace armature
