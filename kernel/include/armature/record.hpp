// The Check and Step records every code returns; the JSON result, the
// Python objects and the calculation record are all drawn from these.
#pragma once

#include <limits>
#include <string>
#include <vector>

namespace armature {

// One line of a derivation: symbol = expression = substituted values = result.
struct Step {
  std::string symbol;       // e.g. "K"
  std::string expression;   // e.g. "M_Ed / (b d² fck)"
  std::string substituted;  // e.g. "15.2e6 / (1000 × 170² × 30)"
  double result = 0.0;
  std::string unit;         // kernel or report unit of result, "-" if none
  std::string clause;       // e.g. "EN 1992-1-1 6.1"
};

// One verified requirement: demand ≤ capacity.
struct Check {
  std::string id;      // bending, ductility, min_steel, ... (contract.md)
  std::string where;   // "span 1", "support 2"
  std::string clause;  // "EN 1992-1-1 6.2.2(1)"
  double demand = 0.0;    // in report units (kNm, kN, mm, mm2, -)
  double capacity = 0.0;  // same unit as demand
  std::string unit;
  double utilisation = 0.0;  // demand / capacity
  bool pass = false;
  std::vector<Step> steps;
};

// utilisation = demand / capacity; a capacity of zero or less gives +inf
// unless the demand is also zero.
inline double utilisation_of(double demand, double capacity) {
  if (capacity > 0.0) return demand / capacity;
  if (demand <= 0.0) return 0.0;
  return std::numeric_limits<double>::infinity();
}

// Builds a Check with utilisation and pass derived from demand and capacity.
Check make_check(std::string id, std::string where, std::string clause, double demand,
                 double capacity, std::string unit, std::vector<Step> steps = {});

}  // namespace armature
