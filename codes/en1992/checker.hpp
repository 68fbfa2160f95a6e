// The EN 1992-1-1 session of one request, private to the plug-in: one
// object gives the code's combination, section and member rules (they
// read the same resolved materials, covers and NDPs). Its member functions
// are defined by topic: materials.cpp (what begin() resolves), section.cpp
// (SectionRules: the checks of a section), members.cpp (MemberRules:
// deflection, fire, equilibrium, support design moment) and plugin.cpp
// (combinations, loads, bars, defaults); the clause functions are in
// rules.hpp.
#pragma once

#include <array>
#include <cstddef>
#include <mutex>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "armature/code.hpp"
#include "armature/steps.hpp"
#include "en1990.hpp"
#include "ndp.hpp"
#include "punching_rules.hpp"
#include "rules.hpp"

namespace armature::en1992 {

inline constexpr double default_fyk = 500.0;

inline std::string num(double v) { return step_number(v); }

// The bar catalogue (materials.cpp): nullopt for a designation not in it.
std::optional<double> bar_diameter(const std::string& designation);
double bar_area(double phi);
std::vector<BarOption> bar_options_of(const std::vector<std::string>& names);
const std::vector<BarOption>& default_bar_options();

using Steps = StepRecorder;

struct Materials {
  double fck, fyk, fcd, fyd, fctm, eta, lambda, eps_cu2;
};

// Defaults of the calculated deflection's inputs (serviceability): an
// indoor floor (3.1.4(5) Note: indoor RH 50 %), loaded at 28 days, normal
// cement (3.1.2(6) class N), partitions built at 90 days (common
// practice), drying from 7 days, the end of curing (common practice).
inline constexpr double default_relative_humidity = 50.0;
inline constexpr double default_age_at_loading_days = 28.0;
inline constexpr double default_partitions_age_days = 90.0;
inline constexpr double drying_start_days = 7.0;

// Creep coefficient and shrinkage strain of the request's calculated
// deflection at two ages: the long term (t = ∞) and when the partitions go
// in (t_p); given, or by 3.1.4 and Annex B (members.cpp).
struct CreepShrinkage {
  bool creep_given = false, shrinkage_given = false;
  Cement cement = Cement::N;
  double RH = 0.0, t0 = 0.0, t0_adj = 0.0, t_p = 0.0, h0 = 0.0, fcm = 0.0;
  double phi_RH = 0.0, beta_fcm = 0.0, beta_t0 = 0.0, phi0 = 0.0, beta_H = 0.0, beta_c_p = 0.0;
  double kh = 0.0, eps_cd0 = 0.0, eps_cd_inf = 0.0, eps_ca_inf = 0.0, beta_ds_p = 0.0, beta_as_p = 0.0;
  double eps_cs_calc_inf = 0.0, eps_cs_calc_p = 0.0;
  double phi_inf = 0.0, phi_p = 0.0;        // used
  double eps_cs_inf = 0.0, eps_cs_p = 0.0;  // used
};
CreepShrinkage creep_shrinkage_of(const ServiceabilityInput& s, double fck, double h);



class Checker final : public SlabChecker,
                      private CombinationRules,
                      private SectionRules,
                      private MemberRules,
                      private PunchingRules,
                      private DetailingRules {
 public:
  Checker(const Ndp& ndp, const En1990Factors& en1990, const Request& req);  // materials.cpp

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
  DetailLength end_top_bar_extent(const BarDetailDemand& bar, double span_mm) const override;
  DetailLength hooked_anchorage(const BarDetailDemand& bar) const override;
  ContinuousTopRule fire_continuous_top(int minutes) const override;

  // plugin.cpp
  LoadBasis load_basis() const override;
  std::vector<Combination> combinations(const std::vector<Action>& actions,
                                        CombinationLabels labels) const override;
  std::vector<std::vector<bool>> load_arrangements(std::size_t span_count) const override;
  std::vector<BayArrangement> bay_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                    const std::vector<Action>& actions) const override;
  std::vector<BayArrangement> flat_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                     const std::vector<Action>& actions) const override;
  const std::vector<BarOption>& bar_options() const override { return *bars_; }
  std::optional<BarOption> catalogue_bar(const std::string& designation) const override;
  std::vector<InputDefault> defaults_used() const override;
  std::vector<std::string> warnings() const override;

  // section.cpp
  double nominal_cover_mm(Face face, double bar_diameter_mm) const override;
  double max_spacing_mm(const RegionDemand&) const override;
  double minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const override;
  SectionOutcome check_section(const Section& sec, const RegionDemand& g, Detail detail) const override;
  DistributionNeed distribution(double main_As_prov) const override;

  // members.cpp
  MemberSectionOutcome check_with_section(const Section& sec, const RegionDemand& g,
                                          const SectionOutcome& outcome, Detail detail) const override;
  std::vector<Check> equilibrium_checks(const EquilibriumDemand& d, Detail detail) const override;
  double support_design_moment(const RegionDemand& g) const override;
  std::optional<SpanDeflection> deflection_diagram(const Section& sec, const RegionDemand& g) const override;
  std::vector<PlateDeflectionState> plate_deflection_states() const override;
  PlateSectionResponse plate_section_response(const Section& sec, double M_Nmm, std::size_t state) const override;
  std::vector<Check> plate_deflection_checks(const PlateDeflectionDemand& d, Detail detail) const override;
  std::vector<Check> span_checks(const std::string& span_where) const override;
  double pinned_end_fixity_fraction() const override;
  CornerRule corner_rule() const override;
  FreeEdgeRule free_edge_rule() const override;
  FlatStripRule flat_strip_rule() const override;

  // punching.cpp (PunchingRules: EN 1992-1-1 6.4)
  double steel_ratio_width_mm(const PunchingDemand& p, bool along_x) const override;
  PunchingOutcome check_punching(const PunchingDemand& p, Detail detail) const override;
  std::optional<TransferBand> moment_transfer_band(const PunchingDemand& demand, bool bars_x) const override;

 private:
  // Cover of bars of diameter phi (4.4.1): c_nom is the request's cover
  // when given, else c_min + Δc_dev rounded up to 5 mm.
  struct CoverOf {
    double c_bond, c_min, c_req, c_nom;
  };
  // 5.3.2.2 at a support with a width t, in the load case that governs:
  // (3) at a monolithic support, the moment at the face, not below 0.65 of
  // the full fixed-end moment; (4) over a support giving no rotational
  // restraint, the centreline moment less F_Ed,sup t/8. A fixed end is
  // built in: (3). An interior support or a cantilever's root may be
  // either (the request does not say which): the larger of the two
  // moments, i.e. the smaller reduction.
  struct SupportMoment {
    double M_Ed = 0.0;
    std::size_t governing = 0;  // index of the load case
    double by_3 = 0.0, by_4 = 0.0;  // of the governing case
    bool reduced_by_4 = false;
  };
  SupportMoment support_moment(const RegionDemand& g) const;  // members.cpp
  void support_moment_steps(Steps& st, const RegionDemand& g, const SupportMoment& m) const;

  // What depends on a face's exposure and cover (durability.top, .bottom).
  struct FaceData {
    std::string exposure;
    std::optional<double> cover_mm;  // given
    int structural_class = 0;        // Table 4.3N
    double c_min_dur = 0.0;          // Table 4.4N
    double w_max = 0.0;              // Table 7.1N
    std::vector<std::pair<double, CoverOf>> covers;  // per candidate bar diameter
  };
  const FaceData& face_data(Face face) const { return faces_[static_cast<std::size_t>(face)]; }

  CoverOf cover_of(double phi, const FaceData& f) const;  // materials.cpp

  // The limit of bending without compression steel at redistribution
  // ratio δ (5.5(4), 6.1).
  struct BendingLimit {
    bool normal;  // fck ≤ 50 MPa
    double k_a, k_b, xi, K_lim;
  };
  BendingLimit bending_limit(double delta) const;  // section.cpp

  // cover_of, worked out once per candidate bar of the request.
  CoverOf cover_for(double phi, Face face) const {
    const FaceData& f = face_data(face);
    for (const auto& [diameter, cover] : f.covers)
      if (diameter == phi) return cover;
    return cover_of(phi, f);
  }

  // A clause whose value here was set by the variant's data file, and the
  // key that set it (Step text, free to carry the variant's name).
  std::string variant_ndp(const char* clause, const std::string& key) const {
    return std::string(clause) + "; " + ndp_.variant + " variant NDP " + key;
  }

  // section.cpp
  void min_crack_steel_check(CheckCollector& checks, const RegionDemand& g, double As_prov) const;
  void crack_check(CheckCollector& checks, const RegionDemand& g, double phi, double s, double d,
                   double As_req, double As_prov) const;
  void crack_width_check(CheckCollector& checks, const Section& sec, const RegionDemand& g) const;

  // detailing.cpp: lb,rqd at a stress σsd with its steps (bond by 8.4.2).
  struct BasicAnchorage {
    double fbd = 0.0, lb_rqd = 0.0, alpha2 = 1.0;
  };
  // straight false: a bent bar, without the straight bar's cd and α2 (α2 1.0).
  BasicAnchorage basic_anchorage(Steps& st, const BarDetailDemand& bar, double sigma_sd, bool straight = true) const;
  // 9.2.1.4(2), (3): σsd = FE/As ≤ fyd at an end support, with its steps.
  double end_support_stress(Steps& st, const BarDetailDemand& bar) const;

  // members.cpp
  void fire_axis_distance_check(CheckCollector& checks, const RegionDemand& g, double c_nom, double phi) const;
  void deflection_check(CheckCollector& checks, const RegionDemand& g, double d, double As_req,
                        double As_prov) const;
  void calculated_deflection_check(CheckCollector& checks, const Section& sec, const RegionDemand& g) const;
  void cantilever_deflection_check(CheckCollector& checks, const Section& sec, const RegionDemand& g) const;
  void long_term_section_steps(Steps& st, const LongTermSection& s, const std::string& tag, double h) const;
  void creep_shrinkage_steps(Steps& st, double h) const;
  void partitions_age_steps(Steps& st) const;

  const Ndp& ndp_;       // of the Code, which outlives this checker
  const En1990Factors& en1990_;  // of the Code, likewise
  const Request& req_;   // kept alive by the caller of Code::begin
  Materials m_{};
  PsiFactors psi_{};
  std::vector<BarOption> own_bars_;  // when the request names its bars
  const std::vector<BarOption>* bars_ = &default_bar_options();
  std::array<FaceData, 2> faces_{};  // by Face
  CreepShrinkage long_term_{};       // when the deflection is calculated
  // Spans whose allowed l/d (7.4.2) exceeds the range the rule was
  // calibrated for, noted as the checks are recorded (Detail::checks and
  // on) for warnings(); only when the request names
  // serviceability.deflection (a version 1 result is unchanged).
  mutable std::mutex span_depth_notes_mutex_;
  mutable std::vector<std::pair<std::string, std::string>> span_depth_notes_;  // span, note
  void note_span_depth_range(const RegionDemand& g, double allowed, double K) const;  // members.cpp
};

}  // namespace armature::en1992
