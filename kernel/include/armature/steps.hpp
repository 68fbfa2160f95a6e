// Helpers for code plug-ins that build Check records with their Steps.
#pragma once

#include <string>
#include <utility>
#include <vector>

#include "armature/format.hpp"
#include "armature/record.hpp"

namespace armature {

// A number as a derivation shows it: plain_number (four significant
// figures, no exponent), as the record prints each step's result.
inline std::string step_number(double v) { return plain_number(v); }

// Collects the steps of one check's derivation (built only at
// Detail::steps: see CheckCollector).
class StepRecorder {
 public:
  // `substituted` is empty when there is nothing to substitute (a value
  // read from a table, or given): the record then prints the result once.
  void add(const std::string& symbol, const std::string& expression, const std::string& substituted,
           double result, const std::string& unit, const std::string& clause) {
    items_.push_back({symbol, expression, substituted, result, unit, clause});
  }
  std::vector<Step> take() { return std::move(items_); }

 private:
  std::vector<Step> items_;
};

}  // namespace armature
