// The ACI 318-19 checker of one request, private to the plug-in. Its
// member functions are defined by topic: section.cpp (the checks of a
// section), members.cpp (the checks of the member: deflection, equilibrium,
// support design moment) and plugin.cpp (materials, loads, bars, defaults);
// the clause functions are in rules.hpp.
#pragma once

#include <array>
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "armature/code.hpp"
#include "armature/steps.hpp"
#include "rules.hpp"

namespace armature::aci318 {

inline std::string num(double v) { return step_number(v); }

class Checker final : public SlabChecker {
 public:
  explicit Checker(const Request& req);  // plugin.cpp

  // plugin.cpp
  LoadBasis load_basis() const override;
  std::vector<Combination> combinations(const std::vector<Action>& actions,
                                        CombinationLabels labels) const override;
  std::vector<std::vector<bool>> load_arrangements(std::size_t n) const override;
  double pinned_end_fixity_fraction() const override;
  const std::vector<BarOption>& bar_options() const override { return bars_; }
  std::optional<BarOption> catalogue_bar(const std::string& designation) const override;
  std::vector<std::string> warnings() const override;
  std::vector<InputDefault> defaults_used() const override;

  // section.cpp
  double max_spacing_mm(const RegionDemand&) const override;
  double minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const override;
  RegionOutcome check_region(const RegionDemand& g, const BarOption& bar, double s,
                             Detail detail) const override;
  DistributionNeed distribution(double) const override;

  // members.cpp
  std::vector<Check> equilibrium_checks(const EquilibriumDemand& d, Detail detail) const override;
  std::vector<Check> span_checks(const std::string&) const override;
  double support_design_moment(const RegionDemand& g) const override;

 private:
  // members.cpp
  void deflection_check(CheckCollector& span, const RegionDemand& g, double h) const;
  static std::size_t governing_face_case(const SupportFace& f);

  const std::string& exposure_of(Face face) const { return exposure_[static_cast<std::size_t>(face)]; }

  const Request& req_;  // kept alive by the caller of Code::begin
  double fc_ = 0.0, fy_ = 0.0, beta1_ = 0.0;
  std::array<std::string, 2> exposure_;  // by Face
  std::vector<BarOption> bars_;
  std::vector<std::string> warnings_;
};

}  // namespace armature::aci318
