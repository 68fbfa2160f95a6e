// The ACI 318-19 session of one request, private to the plug-in: one
// object gives the code's combination, section and member rules (they
// read the same resolved materials). Its member functions are defined by
// topic: section.cpp (SectionRules: the checks of a section), members.cpp
// (MemberRules: minimum thickness for deflection, equilibrium, support
// design moment) and plugin.cpp (materials, combinations, loads, bars,
// defaults); the clause functions are in rules.hpp.
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

class Checker final : public SlabChecker,
                      private CombinationRules,
                      private SectionRules,
                      private MemberRules {
 public:
  explicit Checker(const Request& req);  // plugin.cpp

  const CombinationRules& combination_rules() const override { return *this; }
  const SectionRules& section_rules() const override { return *this; }
  const MemberRules& member_rules() const override { return *this; }
  const Request& request() const override { return req_; }

  // plugin.cpp
  LoadBasis load_basis() const override;
  std::vector<Combination> combinations(const std::vector<Action>& actions,
                                        CombinationLabels labels) const override;
  std::vector<std::vector<bool>> load_arrangements(std::size_t n) const override;
  const std::vector<BarOption>& bar_options() const override { return bars_; }
  std::optional<BarOption> catalogue_bar(const std::string& designation) const override;
  std::vector<std::string> warnings() const override;
  std::vector<InputDefault> defaults_used() const override;

  // section.cpp
  double nominal_cover_mm(Face face, double bar_diameter_mm) const override;
  double max_spacing_mm(const RegionDemand&) const override;
  double minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const override;
  SectionOutcome check_section(const Section& sec, const RegionDemand& g, Detail detail) const override;
  DistributionNeed distribution(double) const override;

  // members.cpp
  MemberSectionOutcome check_with_section(const Section& sec, const RegionDemand& g,
                                          const SectionOutcome& outcome, Detail detail) const override;
  std::vector<Check> equilibrium_checks(const EquilibriumDemand& d, Detail detail) const override;
  std::vector<Check> span_checks(const std::string&) const override;
  double support_design_moment(const RegionDemand& g) const override;
  double pinned_end_fixity_fraction() const override;

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
