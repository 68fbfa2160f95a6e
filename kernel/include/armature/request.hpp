// The request model of contract.md, in kernel units (N, mm, MPa).
// Loads per unit area are held in MPa (N/mm²): 1 kPa = 1e-3 MPa.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "armature/actions.hpp"
#include "armature/errors.hpp"

namespace armature {

enum class EndSupport { pinned, fixed, free };

const char* to_string(EndSupport end);

// Ductility class of the reinforcement (A, B or C, as a steel is sold);
// a code with no such notion ignores it.
enum class DuctilityClass { A, B, C };

const char* to_string(DuctilityClass ductility);

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

struct ReinforcementInput {
  std::optional<double> yield_strength_MPa;       // code default when absent
  std::optional<std::vector<std::string>> bars;   // code default set when absent
  DuctilityClass ductility_class = DuctilityClass::B;
};

struct LoadsInput {
  double dead_MPa = 0.0;      // superimposed permanent load, N/mm² (shorthand)
  double imposed_MPa = 0.0;   // imposed load, N/mm² (shorthand; 0: none)
  std::string imposed_category = "B";
  std::vector<Action> actions;  // loads.actions, in the request's order
  bool actions_given = false;   // loads.actions was in the request
};

// Names the kernel gives the actions it makes: the self-weight and the
// shorthands loads.dead_kPa and loads.imposed_kPa.
inline constexpr const char* self_weight_action_name = "self-weight";
inline constexpr const char* dead_shorthand_action_name = "superimposed dead";
inline constexpr const char* imposed_shorthand_action_name = "imposed";


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

// Every action of a request, in the order combinations refer to them: the
// self-weight (density kN/m³ times the thickness), the shorthands that are
// given (a value above 0), then loads.actions.
std::vector<Action> all_actions(const Request& request, double density_kN_m3);

}  // namespace armature
