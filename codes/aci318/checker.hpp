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
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "armature/code.hpp"
#include "armature/steps.hpp"
#include "armature/units.hpp"
#include "punching_rules.hpp"
#include "rules.hpp"

namespace armature::aci318 {

inline std::string num(double v) { return step_number(v); }

class Checker final : public SlabChecker,
                      private CombinationRules,
                      private SectionRules,
                      private MemberRules,
                      private PunchingRules,
                      private DetailingRules {
 public:
  // `us`: the US variant, following the in-lb edition (us_customary.hpp).
  Checker(const Request& req, bool us);  // plugin.cpp

  const CombinationRules& combination_rules() const override { return *this; }
  const SectionRules& section_rules() const override { return *this; }
  const MemberRules& member_rules() const override { return *this; }
  const PunchingRules& punching_rules() const override { return *this; }
  const DetailingRules* detailing_rules() const override { return this; }
  const Request& request() const override { return req_; }

  // detailing.cpp
  DetailLength shift(const BarDetailDemand& bar) const override;
  DetailLength anchorage(const BarDetailDemand& bar) const override;
  DetailLength end_support_anchorage(const BarDetailDemand& bar) const override;
  DetailLength interior_support_embedment(const BarDetailDemand& bar) const override;
  DetailLength lap(const BarDetailDemand& bar) const override;
  DetailLength hooked_anchorage(const BarDetailDemand& bar) const override;
  DetailLimit zero_moment_development(const BarDetailDemand& bar, const ZeroMomentSite& site) const override;

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
  CornerRule corner_rule() const override;
  FlatStripRule flat_strip_rule() const override;
  std::optional<SpanDeflection> deflection_diagram(const Section& sec, const RegionDemand& g) const override;
  std::vector<PlateDeflectionState> plate_deflection_states() const override;
  PlateSectionResponse plate_section_response(const Section& sec, double M_Nmm, std::size_t state) const override;
  std::vector<Check> plate_deflection_checks(const PlateDeflectionDemand& d, Detail detail) const override;

  // punching.cpp (PunchingRules: ACI 318-19 22.6, 8.4.4.2)
  double steel_ratio_width_mm(const PunchingDemand&, bool) const override { return 0.0; }
  PunchingOutcome check_punching(const PunchingDemand& p, Detail detail) const override;
  std::optional<TransferBand> moment_transfer_band(const PunchingDemand& demand, bool bars_x) const override;

 private:
  // members.cpp
  void deflection_check(CheckCollector& span, const RegionDemand& g, double h) const;
  void calculated_deflection_check(CheckCollector& span, const Section& sec, const RegionDemand& g) const;
  void cantilever_deflection_check(CheckCollector& span, const Section& sec, const RegionDemand& g) const;
  // 24.2.3.5 of a section for calculated deflection, with the outer bars
  // of `tension_face` in tension: Ec, fr, n = Es/Ec, Ig, Mcr = fr Ig/(h/2)
  // and the cracked section with n As.
  struct DeflectionSection {
    double b = 0.0, h = 0.0, d = 0.0, As = 0.0;
    double Ec = 0.0, fr = 0.0, n = 0.0, Ig = 0.0, Mcr = 0.0;
    CrackedSection cracked{};
  };
  DeflectionSection deflection_section(const Section& sec, Face tension_face) const;
  struct DeflectionPair {
    double sustained = 0.0, all = 0.0;  // Δ(D), Δ(D + L)
  };
  void deflection_checks(CheckCollector& span, const std::string& where, const std::string& kind,
                         const std::string& span_note, DeflectionPair deltas, double live, double long_term, double lambda_delta, double L,
                         const std::function<void(StepRecorder&)>& steps) const;
  void two_way_deflection_check(CheckCollector& span, const RegionDemand& g, double h) const;
  static std::size_t governing_face_case(const SupportFace& f);

  const std::string& exposure_of(Face face) const { return exposure_[static_cast<std::size_t>(face)]; }

  // editions.cpp: the provisions whose SI and in-lb forms differ, in
  // kernel units (mm, MPa, N) whichever edition computes them.
  double yield_strain_of_steel() const;                        // 21.2.2.1
  double slab_min_strain() const { return yield_strain_of_steel() + 0.003; }  // 7.3.3.1
  double steel_at_slab_strain_limit(double b, double d) const;  // 7.3.3.1
  double max_bar_spacing(double h) const;                       // 7.7.2.3
  double two_way_max_bar_spacing(double h) const;               // 8.7.2.2
  std::vector<BayArrangement> bay_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                    const std::vector<Action>& actions) const override;
  std::vector<BayArrangement> flat_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                     const std::vector<Action>& actions) const override;
  double min_clear_spacing(double db, double aggregate) const;  // 25.2.1
  double crack_spacing(double fs, double clear_cover) const;    // 24.3.2
  double max_distribution_spacing(double h) const;              // 24.4.3.3
  double shear_size_factor(double d) const;                     // 22.5.5.1.3
  double shear_strength(double lambda_s, double rho_w, double b, double d) const;  // 22.5.5.1
  double min_thickness(double span, SupportCondition condition) const;            // 7.3.1.1
  double two_way_min_thickness(double long_span, double short_span) const;         // 8.3.1.2
  void flat_slab_deflection_check(CheckCollector& span, const RegionDemand& g, double h) const;
  double cover_for(const std::string& exposure, double bar_diameter) const;       // 20.5.1.3.1
  double root_fc_limited() const;                               // √f'c ≤ 8.3 MPa (100 psi), 22.5.3.1
  double concrete_modulus() const;                              // 19.2.2.1: Ec, MPa
  double rupture_modulus() const;                               // 19.2.3.1: fr, MPa
  double reinforcement_modulus() const;                         // 20.2.2.2: Es, MPa

  // detailing.cpp: ld of 25.4.2 (the smaller of 25.4.2.3 and 25.4.2.4,
  // not less than 300 mm / 12 in), with its steps.
  // 25.4.2.1: ld with the 12 in / 300 mm floor of (b), or (a) alone
  // (with_floor false) as 25.5.2.1 asks for a lap.
  double development_length(StepRecorder& st, const BarDetailDemand& bar, bool with_floor = true) const;
  double support_embedment() const;

  // Numbers and units of the derivation steps: the SI variant prints the
  // kernel's units, the US variant those of the in-lb edition.
  std::string len(double mm) const { return num(us_ ? mm / mm_per_in : mm); }
  double len_v(double mm) const { return us_ ? mm / mm_per_in : mm; }
  const char* len_u() const { return us_ ? "in" : "mm"; }
  std::string area(double mm2) const { return num(area_v(mm2)); }
  double area_v(double mm2) const { return us_ ? mm2 / (mm_per_in * mm_per_in) : mm2; }
  const char* area_u() const { return us_ ? "in2" : "mm2"; }
  std::string stress(double MPa) const { return num(stress_v(MPa)); }
  double stress_v(double MPa) const { return us_ ? MPa / MPa_per_psi : MPa; }
  const char* stress_u() const { return us_ ? "psi" : "MPa"; }
  std::string moment(double Nmm) const { return num(moment_v(Nmm)); }
  double moment_v(double Nmm) const { return us_ ? Nmm * 1e-6 / kNm_per_kipft : Nmm * 1e-6; }
  const char* moment_u() const { return us_ ? "kip-ft" : "kNm"; }
  double force_v(double N) const { return us_ ? N * 1e-3 / kN_per_kip : N * 1e-3; }
  std::string force(double N) const { return num(force_v(N)); }
  const char* force_u() const { return us_ ? "kip" : "kN"; }
  // " psi" after a substituted value in the US variant (the SI text names no unit there).
  std::string us_unit(const char* unit) const { return us_ ? std::string(" ") + unit : std::string(); }

  const Request& req_;  // kept alive by the caller of Code::begin
  bool us_ = false;
  double fc_ = 0.0, fy_ = 0.0, beta1_ = 0.0;
  std::array<std::string, 2> exposure_;  // by Face
  std::vector<BarOption> bars_;
  std::vector<std::string> warnings_;
};

}  // namespace armature::aci318
