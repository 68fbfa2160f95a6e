// Designs from several threads on one shared registry (as design_many does)
// give exactly the sequential results; scripts/tsan.sh runs this under
// ThreadSanitizer.
#include <catch2/catch.hpp>

#include <random>
#include <thread>

#include <nlohmann/json.hpp>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

TEST_CASE("Parallel designs with mixed codes equal sequential designs", "[threads]") {
  armature::Registry& reg = armature::Registry::shared();
  std::mt19937 rng(77);
  std::uniform_real_distribution<double> span(2.5, 6.0), q(1.5, 7.0);
  std::vector<nlohmann::json> reqs;
  for (int i = 0; i < 240; ++i) {
    const int kind = i % 3;
    nlohmann::json r = {{"slab", {{"spans_m", {span(rng), span(rng)}}, {"ends", {"pinned", "fixed"}},
                                  {"thickness_mm", 225}}},
                        {"loads", {{"dead_kPa", 1.0}, {"imposed_kPa", q(rng)}}}};
    if (kind == 2) {
      r["code"] = "ACI318-19";
      r["concrete"] = {{"cylinder_strength_MPa", 28}};
    } else {
      r["code"] = "EN1992-1-1";
      r["variant"] = kind == 0 ? "UK" : "recommended";
      r["concrete"] = {{"class", "C30/37"}};
    }
    reqs.push_back(r);
  }
  std::vector<nlohmann::json> sequential;
  for (const auto& r : reqs) sequential.push_back(armature::result_to_json(armature::design(reg, r)));
  std::vector<nlohmann::json> parallel(reqs.size());
  std::vector<std::thread> threads;
  for (int t = 0; t < 4; ++t)
    threads.emplace_back([&, t] {
      for (std::size_t i = static_cast<std::size_t>(t); i < reqs.size(); i += 4)
        parallel[i] = armature::result_to_json(armature::design(reg, reqs[i], armature::Detail::steps));
    });
  for (auto& th : threads) th.join();
  for (std::size_t i = 0; i < reqs.size(); ++i) {
    INFO("request " << i);
    CHECK(parallel[i] == sequential[i]);
  }
}
