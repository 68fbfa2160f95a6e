// Design throughput on one core (Google Benchmark). Prints its figures;
// nothing here asserts a time. Run: scripts/bench.sh
// Each figure is measured in ten repetitions and reported as their median
// and their minimum: on a shared virtual machine the minimum is the
// figure least disturbed by other work, the median the typical one.
#include <benchmark/benchmark.h>

#include <algorithm>

#include <nlohmann/json.hpp>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"

namespace {
double minimum(const std::vector<double>& v) { return *std::min_element(v.begin(), v.end()); }

#define ARMATURE_BENCHMARK(fn) \
  BENCHMARK(fn)->Repetitions(10)->ReportAggregatesOnly(true)->ComputeStatistics("min", minimum)

const nlohmann::json single_span = nlohmann::json::parse(R"({
  "code": "EN1992-1-1", "variant": "UK",
  "slab": {"spans_m": [4.5], "ends": ["pinned", "pinned"], "thickness_mm": 200},
  "concrete": {"class": "C30/37"},
  "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0}
})");
const nlohmann::json five_spans = nlohmann::json::parse(R"({
  "code": "EN1992-1-1", "variant": "UK",
  "slab": {"spans_m": [4.2, 4.8, 4.2, 4.8, 4.2], "ends": ["pinned", "pinned"], "thickness_mm": 225},
  "concrete": {"class": "C30/37"},
  "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0}
})");

armature::Request parsed(const nlohmann::json& j) {
  armature::InputProblems problems;
  return armature::request_from_json(j, problems);
}

void single_span_design(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(single_span);
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(single_span_design);

void five_span_design(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(five_spans);
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(five_span_design);

// The parts of the JSON route, apart: text to Request, and record to text.
void json_request_parse(benchmark::State& state) {
  const std::string text = single_span.dump();
  for (auto _ : state) benchmark::DoNotOptimize(parsed(nlohmann::json::parse(text)));
}
ARMATURE_BENCHMARK(json_request_parse);

void json_result_serialise(benchmark::State& state) {
  const auto record = armature::design(armature::Registry::shared(), parsed(single_span));
  for (auto _ : state) benchmark::DoNotOptimize(armature::result_to_json_text(record));
}
ARMATURE_BENCHMARK(json_result_serialise);

void json_parse_design_serialise(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const std::string text = single_span.dump();
  for (auto _ : state) {
    const auto record = armature::design(reg, nlohmann::json::parse(text));
    benchmark::DoNotOptimize(armature::result_to_json_text(record));
  }
}
ARMATURE_BENCHMARK(json_parse_design_serialise);
}  // namespace

BENCHMARK_MAIN();
