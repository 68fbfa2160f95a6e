// Helpers for code plug-ins that build Check records with their Steps.
#pragma once

#include <cstdio>
#include <string>
#include <utility>
#include <vector>

#include "armature/record.hpp"

namespace armature {

// A number as a derivation shows it: four significant figures.
inline std::string step_number(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.4g", v);
  return buf;
}

// Collects the steps of one check's derivation (built only at
// Detail::steps: see CheckCollector).
class StepRecorder {
 public:
  void add(const std::string& symbol, const std::string& expression, const std::string& substituted,
           double result, const std::string& unit, const std::string& clause) {
    items_.push_back({symbol, expression, substituted, result, unit, clause});
  }
  std::vector<Step> take() { return std::move(items_); }

 private:
  std::vector<Step> items_;
};

}  // namespace armature
