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
#include "armature/plate.hpp"
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

// The same single and five-span designs with the deflection calculated
// (EN 1992-1-1 7.4.3, creep and shrinkage by Annex B and 3.1.4, the
// partitions' check too), against the span/depth designs above.
nlohmann::json calculated(nlohmann::json j) {
  j["serviceability"] = {{"deflection", "calculated"}, {"partitions", true}};
  return j;
}

void single_span_calculated_deflection_design(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(calculated(single_span));
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(single_span_calculated_deflection_design);

void five_span_calculated_deflection_design(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(calculated(five_spans));
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(five_span_calculated_deflection_design);

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
// Plate analysis of a two-way floor: build the model (mesh, element
// matrices, assembly, one factorisation), solve 20 load cases (pattern
// loads over the bays: all bays, checkerboards, each bay alone, and a few
// with a partition line load and a point load), and read every case's
// bay sagging, line hogging and line reactions. 200 mm slab, E 33 000 MPa,
// ν 0.2, the default mesh.
std::vector<armature::PlateLoadCase> plate_cases(const armature::PlateModel& model) {
  std::vector<armature::PlateLoadCase> cases(20);
  const std::size_t bays = model.bay_count();
  for (std::size_t c = 0; c < cases.size(); ++c) {
    auto& lc = cases[c];
    lc.bay_pressures_MPa.assign(bays, 0.0052);  // dead everywhere (kPa as MPa)
    for (std::size_t b = 0; b < bays; ++b) {
      const std::size_t i = b % model.bays_x(), j = b / model.bays_x();
      const bool loaded = c == 0 || (c == 1 && (i + j) % 2 == 0) || (c == 2 && (i + j) % 2 == 1) ||
                          (c >= 3 && b == (c - 3) % bays);
      if (loaded) lc.bay_pressures_MPa[b] += 0.006;  // imposed
    }
    if (c % 4 == 3) {
      const double x1 = model.x_grid_mm().back(), y1 = model.y_grid_mm().back();
      lc.lines.push_back({armature::PlanAxis::x, 0.4 * y1, 0.1 * x1, 0.9 * x1, 4.5});
      lc.points.push_back({0.3 * x1, 0.7 * y1, 12000.0});
    }
  }
  return cases;
}

void analyse_plate(benchmark::State& state, std::vector<double> x_spans, std::vector<double> y_spans) {
  armature::PlateGeometry g;
  g.x_spans_mm = std::move(x_spans);
  g.y_spans_mm = std::move(y_spans);
  g.edges = {armature::EndSupport::pinned, armature::EndSupport::fixed, armature::EndSupport::pinned,
             armature::EndSupport::pinned};
  g.thickness_mm = 200;
  g.elastic_modulus_MPa = 33000;
  g.poisson_ratio = 0.2;
  for (auto _ : state) {
    const armature::PlateModel model(g);
    const auto field = model.solve(plate_cases(model));
    double sum = 0;
    for (std::size_t c = 0; c < field.case_count(); ++c) {
      const auto results = field.case_results(c);
      for (const auto& bay : results.bays) sum += bay.mx.value + bay.my.value;
      for (const auto& line : results.line_hogging) sum += line[0].value;
      for (const auto& line : results.line_reactions) sum += line.front().N_per_mm;
    }
    benchmark::DoNotOptimize(sum);
  }
}

void plate_single_bay_analysis(benchmark::State& state) { analyse_plate(state, {5400}, {4200}); }
ARMATURE_BENCHMARK(plate_single_bay_analysis)->Unit(benchmark::kMillisecond);

void plate_3x3_bays_analysis(benchmark::State& state) {
  analyse_plate(state, {5400, 6000, 5400}, {4200, 4800, 4200});
}
ARMATURE_BENCHMARK(plate_3x3_bays_analysis)->Unit(benchmark::kMillisecond);
}  // namespace

// Two-way slabs designed whole (analysis of every pattern, Wood–Armer
// envelope, bar search of every region with its depth, the checks): one
// 5.4 × 4.2 m bay, and a 3 × 3 floor under the EN recommended variant's
// patterns (every bay, both checkerboards, both sides of each line).
const nlohmann::json two_way_single_bay = nlohmann::json::parse(R"({
  "code": "EN1992-1-1", "variant": "UK",
  "slab": {"type": "two_way", "x_spans_m": [5.4], "y_spans_m": [4.2], "thickness_mm": 200},
  "concrete": {"class": "C30/37"},
  "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0}
})");
const nlohmann::json two_way_3x3 = nlohmann::json::parse(R"({
  "code": "EN1992-1-1", "variant": "recommended",
  "slab": {"type": "two_way", "x_spans_m": [5.4, 6.0, 5.4], "y_spans_m": [4.2, 4.8, 4.2], "thickness_mm": 225},
  "concrete": {"class": "C30/37"},
  "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0}
})");

void two_way_single_bay_design(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(two_way_single_bay);
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(two_way_single_bay_design)->Unit(benchmark::kMillisecond);

void two_way_3x3_bays_design(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(two_way_3x3);
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(two_way_3x3_bays_design)->Unit(benchmark::kMillisecond);

// A flat slab of 3 × 3 bays on columns all round (request to design
// record: the code's patterns on the plate with its 16 column patches,
// the strip integrals per case, the bar search of every strip region, and
// punching at every column), EN 1992 UK variant and ACI 318-19 (whose
// punching needs the columns restrained: storey heights given).
const nlohmann::json flat_3x3_en = nlohmann::json::parse(R"({
  "code": "EN1992-1-1", "variant": "UK",
  "slab": {"type": "flat", "x_spans_m": [6.0, 6.0, 6.0], "y_spans_m": [5.5, 5.5, 5.5],
           "columns": {"size_mm": [400, 400]}, "thickness_mm": 250},
  "concrete": {"class": "C30/37"},
  "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0}
})");
const nlohmann::json flat_3x3_aci = nlohmann::json::parse(R"({
  "code": "ACI318-19", "variant": "SI",
  "slab": {"type": "flat", "x_spans_m": [6.0, 6.0, 6.0], "y_spans_m": [5.5, 5.5, 5.5],
           "columns": {"size_mm": [400, 400], "height_m": 3.5}, "thickness_mm": 250},
  "concrete": {"cylinder_strength_MPa": 30},
  "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0}
})");

void flat_3x3_bays_design_en(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(flat_3x3_en);
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(flat_3x3_bays_design_en)->Unit(benchmark::kMillisecond);

void flat_3x3_bays_design_aci(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(flat_3x3_aci);
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(flat_3x3_bays_design_aci)->Unit(benchmark::kMillisecond);

// The same floors with the deflection calculated on the plate (the plate
// solved again per state with each element's cracked rigidity, until the
// deflection settles): against the designs above, the cost of the
// calculation (EN: three states with the partitions' check; ACI: D and
// D + L), with `calculated` above.

void two_way_3x3_bays_calculated_deflection_design(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(calculated(two_way_3x3));
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(two_way_3x3_bays_calculated_deflection_design)->Unit(benchmark::kMillisecond);

void flat_3x3_bays_calculated_deflection_design_en(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(calculated(flat_3x3_en));
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(flat_3x3_bays_calculated_deflection_design_en)->Unit(benchmark::kMillisecond);

void flat_3x3_bays_calculated_deflection_design_aci(benchmark::State& state) {
  auto& reg = armature::Registry::shared();
  const auto req = parsed(calculated(flat_3x3_aci));
  for (auto _ : state) benchmark::DoNotOptimize(armature::design(reg, req));
}
ARMATURE_BENCHMARK(flat_3x3_bays_calculated_deflection_design_aci)->Unit(benchmark::kMillisecond);

BENCHMARK_MAIN();
