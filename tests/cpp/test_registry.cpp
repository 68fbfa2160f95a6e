// The plug-in registry: good plug-ins load, every broken one is reported
// against its file, and the kernel goes on with the rest.
#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <fstream>

#include <nlohmann/json.hpp>

#include "armature/code.hpp"
#include "armature/design.hpp"
#include "armature/plugin.hpp"
#include "armature/registry.hpp"
#include "../../kernel/src/record/label_cache.hpp"

namespace fs = std::filesystem;
using armature::Registry;

namespace {
const armature::PluginFailure* failure_for(const Registry& r, const std::string& file_part) {
  for (const auto& f : r.failures())
    if (f.path.find(file_part) != std::string::npos) return &f;
  return nullptr;
}

fs::path junk_plugin_dir() {
  fs::path dir = fs::temp_directory_path() / "armature-registry-test";
  fs::create_directories(dir);
  std::ofstream(dir / "armature_code_junk.so") << "this is not a shared library\n";
  std::ofstream(dir / "unrelated.txt") << "ignored: not named like a plug-in\n";
  return dir;
}

nlohmann::json simple_request(const std::string& code) {
  return {{"code", code},
          {"slab", {{"spans_m", {4.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 200}}},
          {"concrete", {{"class", "C30/37"}}},
          {"loads", {{"imposed_kPa", 2.5}}}};
}
}  // namespace

TEST_CASE("Broken plug-ins are reported and the good ones load", "[registry]") {
  const fs::path missing = fs::temp_directory_path() / "armature-no-such-directory";
  Registry reg({ARMATURE_TEST_PLUGIN_DIR, junk_plugin_dir(), missing, ARMATURE_CODE_DIR});

  std::vector<std::string> ids;
  for (const auto& c : reg.codes()) ids.push_back(c.id);
  CHECK(std::find(ids.begin(), ids.end(), "EN1992-1-1") != ids.end());
  CHECK(std::find(ids.begin(), ids.end(), "TEST-THROWING") != ids.end());

  const auto* abi = failure_for(reg, "armature_code_wrongabi.so");
  REQUIRE(abi != nullptr);
  CHECK_THAT(abi->reason, Catch::Contains("ABI version " + std::to_string(armature::plugin_abi_version + 100)) &&
                              Catch::Contains("expects " + std::to_string(armature::plugin_abi_version)));

  const auto* noentry = failure_for(reg, "armature_code_noentry.so");
  REQUIRE(noentry != nullptr);
  CHECK_THAT(noentry->reason, Catch::Contains("no entry point"));

  const auto* junk = failure_for(reg, "armature_code_junk.so");
  REQUIRE(junk != nullptr);
  CHECK_THAT(junk->reason, Catch::Contains("not a loadable library"));

  const auto* dir = failure_for(reg, "armature-no-such-directory");
  REQUIRE(dir != nullptr);
  CHECK_THAT(dir->reason, Catch::Contains("does not exist"));

  CHECK(failure_for(reg, "unrelated.txt") == nullptr);
  CHECK(reg.failures().size() == 4);

  // The kernel goes on: the EN 1992 design runs with the same registry.
  auto rec = armature::design(reg, simple_request("EN1992-1-1"));
  CHECK(rec.code.variant == "recommended");
  CHECK(rec.regions.size() == 3);  // support 1 (top), span 1, support 2 (top)
}

TEST_CASE("A plug-in that throws inside a check becomes a design error", "[registry]") {
  Registry reg({ARMATURE_TEST_PLUGIN_DIR, ARMATURE_CODE_DIR});
  try {
    armature::design(reg, simple_request("TEST-THROWING"));
    FAIL("expected a design error");
  } catch (const armature::DesignError& e) {
    const std::string what = e.what();
    CHECK_THAT(what, Catch::Contains("TEST-THROWING") && Catch::Contains("'bending'") &&
                         Catch::Contains("deliberate failure"));
  }
  // And the other code still designs.
  CHECK(armature::design(reg, simple_request("EN1992-1-1")).regions.at(1).where == "span 1");
}

TEST_CASE("Unknown code and variant name their field", "[registry]") {
  Registry reg({ARMATURE_CODE_DIR});
  try {
    reg.open("EN1992-1-9", "");
    FAIL("expected an input error");
  } catch (const armature::InputError& e) {
    REQUIRE(e.problems().size() == 1);
    CHECK(e.problems()[0].field == "code");
    CHECK_THAT(e.problems()[0].message, Catch::Contains("EN1992-1-9") && Catch::Contains("EN1992-1-1"));
  }
  try {
    reg.open("EN1992-1-1", "Atlantis");
    FAIL("expected an input error");
  } catch (const armature::InputError& e) {
    CHECK(e.problems()[0].field == "variant");
    CHECK_THAT(e.problems()[0].message, Catch::Contains("Atlantis") && Catch::Contains("UK") &&
                                            Catch::Contains("recommended"));
  }
}

TEST_CASE("A code keeps its library loaded after the registry is gone", "[registry]") {
  std::shared_ptr<const armature::DesignCode> code;
  {
    Registry reg({ARMATURE_CODE_DIR});
    code = reg.open("EN1992-1-1", "UK");
  }
  // The vtable still lives: the library was not unloaded.
  CHECK(code->identity().variant == "UK");
  CHECK(code->identity().id == "EN1992-1-1");
}

TEST_CASE("A directory named twice on the path is searched once", "[registry]") {
  Registry reg({ARMATURE_CODE_DIR, ARMATURE_CODE_DIR "/../codes"});
  // Both entries are the same directory: it is searched once.
  CHECK(reg.search_dirs().size() == 1);
  CHECK(reg.failures().empty());
}

TEST_CASE("The first plug-in on the path wins and a second copy is reported", "[registry]") {
  // A copy of the ACI 318 plug-in in a directory later on the path.
  const fs::path dir = fs::temp_directory_path() / "armature-registry-copy";
  fs::create_directories(dir);
  const fs::path first = fs::path(ARMATURE_CODE_DIR) / "armature_code_aci318.so";
  const fs::path copy = dir / "armature_code_aci318.so";
  fs::copy_file(first, copy, fs::copy_options::overwrite_existing);
  Registry reg({ARMATURE_CODE_DIR, dir});
  const auto& codes = reg.codes();
  const auto aci = std::find_if(codes.begin(), codes.end(), [](const auto& c) { return c.id == "ACI318-19"; });
  REQUIRE(aci != codes.end());
  CHECK(fs::path(aci->path) == fs::weakly_canonical(first));
  CHECK(std::count_if(codes.begin(), codes.end(), [](const auto& c) { return c.id == "ACI318-19"; }) == 1);
  REQUIRE(reg.failures().size() == 1);
  CHECK(fs::path(reg.failures()[0].path) == fs::weakly_canonical(copy));
  CHECK_THAT(reg.failures()[0].reason, Catch::Contains("code 'ACI318-19' is already provided by") &&
                                           Catch::Contains("this file is ignored"));
}

// Labels remember string literals by address. A library's literals vanish
// when it is unloaded and another library may put other text at the same
// address: the registry makes labels forget what they remembered first.
TEST_CASE("A label made at a remembered address after forgetting has the new text", "[registry][labels]") {
  // Stands for a plug-in's literal: text at a fixed address.
  static char text[] = "first text";
  CHECK(armature::Label(static_cast<const char*>(text)).str() == "first text");
  CHECK(armature::Label(static_cast<const char*>(text)).str() == "first text");  // remembered
  // The library "unloads" and another puts its own text at that address.
  armature::forget_remembered_literals();
  std::copy_n("other text", sizeof text, text);
  CHECK(armature::Label(static_cast<const char*>(text)).str() == "other text");
  CHECK(armature::Label(static_cast<const char*>(text)) == armature::Label(std::string("other text")));
}

TEST_CASE("Labels stay right when plug-ins are unloaded and others loaded", "[registry][labels]") {
  const auto aci_request = nlohmann::json{
      {"code", "ACI318-19"},
      {"slab", {{"spans_m", {4.0}}, {"ends", {"pinned", "pinned"}}, {"thickness_mm", 200}}},
      {"concrete", {{"cylinder_strength_MPa", 28}}},
      {"loads", {{"imposed_kPa", 2.5}}}};
  // Every check cites its own code (a text from the other would show a
  // label taken from a forgotten address).
  auto clauses_cite = [](const armature::DesignRecord& rec, const std::string& code) {
    std::size_t n = 0;
    for (const auto* c : rec.all_checks()) {
      ++n;
      if (c->clause.str().find(code) == std::string::npos) {
        FAIL_CHECK("check " << c->id.str() << " at " << c->where << " cites '" << c->clause.str() << "'");
        return false;
      }
    }
    return n > 0;
  };
  // Each round loads the plug-ins afresh (a registry of its own, dropped at
  // the end of the round, unloads them), designs with one code, then the
  // other: their literals come and go at addresses the other may reuse.
  for (int round = 0; round < 3; ++round) {
    {
      Registry reg({ARMATURE_CODE_DIR});
      const auto rec = armature::design(reg, simple_request("EN1992-1-1"));
      CHECK(clauses_cite(rec, "EN 199"));
      CHECK(rec.regions.at(1).where == "span 1");
    }
    {
      Registry reg({ARMATURE_CODE_DIR});
      const auto rec = armature::design(reg, aci_request);
      CHECK(clauses_cite(rec, "ACI 318"));
    }
  }
}

// A clause built at run time is given to CheckCollector::add as a
// std::string: its label is looked up by its text, never by the address of
// a buffer that the next clause reuses.
TEST_CASE("Checks with clauses built at run time keep their own texts", "[labels]") {
  std::vector<armature::Check> out;
  armature::RegionVerdict verdict;
  armature::CheckCollector checks(out, verdict, armature::Detail::checks);
  std::string clause;
  for (int rule = 1; rule <= 3; ++rule) {
    clause = "house rule HR-" + std::to_string(rule);  // the same buffer each time (short-string storage)
    checks.add("spacing", "span 1", clause, 100.0, 150.0 + rule, "mm");
  }
  REQUIRE(out.size() == 3);
  CHECK(out[0].clause.str() == "house rule HR-1");
  CHECK(out[1].clause.str() == "house rule HR-2");
  CHECK(out[2].clause.str() == "house rule HR-3");
  CHECK(out[2].capacity == 153.0);
}
