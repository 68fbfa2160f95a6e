// The request model of contract.md, in kernel units (N, mm, MPa).
// Loads per unit area are held in MPa (N/mm²): 1 kPa = 1e-3 MPa.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "armature/errors.hpp"

namespace armature {

enum class EndSupport { pinned, fixed, free };

const char* to_string(EndSupport end);

// Ductility class of the reinforcement (A, B or C, as a steel is sold);
// a code with no such notion ignores it.
enum class DuctilityClass { A, B, C };

const char* to_string(DuctilityClass ductility);

// The face of the slab a layer of main bars lies at.
enum class Face { bottom, top };
const char* to_string(Face face);

struct SlabInput {
  std::vector<double> spans_mm;  // effective spans, left to right
  std::array<EndSupport, 2> ends{EndSupport::pinned, EndSupport::pinned};
  double thickness_mm = 0.0;
  double strip_width_mm = 1000.0;
};

struct ConcreteInput {
  std::optional<std::string> strength_class;      // "C30/37"
  std::optional<double> cylinder_strength_MPa;    // fck or f'c
  std::optional<double> density_kN_m3;            // code default when absent
  double aggregate_mm = 20.0;
};

// Check mode: the user's bars in one design region (no search there).
struct GivenBars {
  std::string where;       // a region of the member: "span 2", "support 3"
  Face face = Face::bottom;
  std::string bar;         // a designation of the code's catalogue
  double spacing_mm = 0.0;
};

// How the bar search treats the regions together.
enum class Rationalise {
  none,            // each region its own least-area arrangement
  uniform_bottom,  // one bottom arrangement for every span region
};

const char* to_string(Rationalise rationalise);

struct ReinforcementInput {
  std::optional<double> yield_strength_MPa;       // code default when absent
  std::optional<std::vector<std::string>> bars;   // code default set when absent
  DuctilityClass ductility_class = DuctilityClass::B;
  // The search's spacings: min_spacing_mm + k spacing_step_mm up to the
  // code's largest (distribution bars alike).
  double spacing_step_mm = 25.0;
  double min_spacing_mm = 75.0;
  std::vector<GivenBars> given;                   // in the request's order
  Rationalise rationalise = Rationalise::none;
};

struct LoadsInput {
  double dead_MPa = 0.0;      // superimposed permanent load, N/mm²
  double imposed_MPa = 0.0;   // imposed load, N/mm²
  std::string imposed_category = "B";
};

struct DurabilityInput {
  std::optional<double> cover_mm;
  std::optional<std::string> exposure;  // code default when absent
  double design_life_years = 50.0;
};

struct FireInput {
  std::optional<int> resistance_min;
};

struct DesignOptions {
  std::optional<std::string> combination;  // EN: "6.10" or "6.10a/b"
  double redistribution_percent = 0.0;
};

// Title-block information of the calculation record (all optional).
struct ProjectInfo {
  std::string name, reference, designer, checker;
};

// Units of the readable summary and calculation record (the JSON result is
// always SI).
enum class ReportUnits { SI, US };

struct Request {
  std::string code;
  std::optional<std::string> variant;
  SlabInput slab;
  ConcreteInput concrete;
  ReinforcementInput reinforcement;
  LoadsInput loads;
  DurabilityInput durability;
  FireInput fire;
  DesignOptions design;
  ReportUnits report_units = ReportUnits::SI;
  ProjectInfo project;
};

}  // namespace armature
