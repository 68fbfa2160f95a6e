// The Member interface (architecture.md, "Version 2"): a member's geometry,
// its analysis under the load cases of actions × combinations ×
// arrangements, and its design regions with their demands. One class per
// member type; no clause inside. What a code decides reaches a member as a
// number or a narrow callback given by the driver (RegionRules).
#pragma once

#include <array>
#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "armature/actions.hpp"
#include "armature/analysis.hpp"
#include "armature/code.hpp"
#include "armature/combinations.hpp"
#include "armature/request.hpp"

namespace armature {

// A design region by name and face, known from the geometry alone.
struct RegionName {
  std::string where;
  Face face = Face::bottom;
  bool certain = true;  // false: its presence depends on a code rule not yet known
};

// What a member is analysed for: the actions, the code's combinations, the
// code's load arrangements over the member's pattern parts (one flag per
// part: loaded or not), and the uniform totals of the whole-member actions.
struct MemberLoads {
  const std::vector<Action>& actions;
  const std::vector<Combination>& combinations;
  const std::vector<std::vector<bool>>& arrangements;
  const LoadTotals& totals;
  // The code's long-term (quasi-permanent) and service (characteristic)
  // loads on every span are analysed as well, and each span region carries
  // their forces (RegionDemand::long_term_span, service_span), for a
  // calculated deflection.
  bool long_term_moments = false;
};

// What the code decides about a member's regions, passed in by the driver.
struct RegionRules {
  // Top steel at a pinned end as a fraction of the adjacent span's
  // sagging moment (0: no top region there).
  double pinned_end_fixity_fraction = 0.0;
  // The code's design moment of a top region at a support of non-zero
  // width (RegionDemand::support_face filled in by the member).
  std::function<double(const RegionDemand&)> support_design_moment;
};

class Member {
 public:
  virtual ~Member() = default;

  // Input the member cannot analyse (a mechanism, redistribution with
  // nowhere to go, support widths that do not fit), as field-named problems.
  virtual void add_scope_problems(InputProblems& problems) const = 0;
  // How many parts the code's load arrangements pattern variable actions
  // over (a strip's spans; a plate's bays).
  virtual std::size_t pattern_count() const = 0;
  // Names of the parts that carry the code's member checks (spans), and of
  // the supports that carry reactions, in order.
  virtual std::vector<std::string> span_names() const = 0;
  virtual std::vector<std::string> support_names() const = 0;
  // The design regions by name and face before any analysis (for
  // reinforcement.given); `pinned_end_steel` as RegionRules, unknown:
  // such regions listed as uncertain.
  virtual std::vector<RegionName> region_names(std::optional<bool> pinned_end_steel) const = 0;

  // Analyses every ULS load case (one factorisation for all); returns the
  // number of distinct load cases.
  virtual std::size_t analyse(const MemberLoads& loads) = 0;
  // After analyse: envelope diagrams per span for the record.
  virtual std::vector<std::vector<DiagramPoint>> diagrams() const = 0;
  // After analyse: the design regions in order along the member, each with
  // its demands (moment, position, face, supports it carries, span, σs
  // ratio, support face).
  virtual std::vector<RegionDemand> design_regions(const RegionRules& rules,
                                                   std::vector<std::string>& warnings) const = 0;
  // Static equilibrium (EQU combinations) of each part that can overturn.
  virtual std::vector<EquilibriumDemand> equilibrium_demands(const MemberLoads& loads) const = 0;
  // After analyse: the moment envelope the bars are detailed to, per span,
  // finely sampled: the ULS cases and, where a part can overturn, its EQU
  // cases with the parts that hold it down unloaded (their permanent
  // actions at the favourable factor alone).
  virtual std::vector<std::vector<DiagramPoint>> detailing_diagrams(const MemberLoads& loads) const = 0;
};

// slab.support_widths_mm against a strip's spans and ends, for every entry
// path (the JSON reader and a Request built in C++): one width per support,
// n + 1 for n spans, each finite and from 0 to 3 m, 0 at a free end, each
// span's two faces leaving part of it clear. Without a known geometry
// (spans or ends in error) the values alone are judged.
void add_support_width_problems(const std::vector<double>& spans_mm, const std::array<EndSupport, 2>& ends,
                                const std::vector<double>& widths_mm, bool geometry_known, InputProblems& problems);

// A one-way strip: continuous spans on line supports, ends pinned, fixed
// or free (cantilevers), of width `strip_width_mm`.
class OneWayStrip final : public Member {
 public:
  OneWayStrip(const SlabInput& slab, double redistribution_percent);

  void add_scope_problems(InputProblems& problems) const override;
  std::size_t pattern_count() const override { return model_.span_count(); }
  std::vector<std::string> span_names() const override;
  std::vector<std::string> support_names() const override;
  std::vector<RegionName> region_names(std::optional<bool> pinned_end_steel) const override;
  std::size_t analyse(const MemberLoads& loads) override;
  std::vector<std::vector<DiagramPoint>> diagrams() const override;
  std::vector<RegionDemand> design_regions(const RegionRules& rules,
                                           std::vector<std::string>& warnings) const override;
  std::vector<EquilibriumDemand> equilibrium_demands(const MemberLoads& loads) const override;
  std::vector<std::vector<DiagramPoint>> detailing_diagrams(const MemberLoads& loads) const override;

  const StripModel& model() const { return model_; }

 private:
  double qp_ratio(Face face, std::size_t index, double x) const;
  void apply_support_widths(const RegionRules& rules, std::vector<RegionDemand>& demands,
                            std::vector<std::string>& warnings) const;

  StripModel model_;
  double width_mm_;
  std::vector<double> support_widths_mm_;
  double redistribution_percent_;
  double delta_;
  std::vector<bool> redistributed_;
  // After analyse:
  bool all_uniform_ = true;
  std::vector<CaseResult> cases_;  // ULS cases, redistributed
  Envelope env_;
  std::vector<CaseResult> qp_all_, uls_all_;  // every span loaded (located loads only)
  std::vector<CaseResult> long_term_;  // quasi-permanent, every span loaded, when asked for
  // The same with the variable actions on the cantilevers only (the back
  // spans unloaded turn a cantilever's root the least), when there is one.
  std::vector<CaseResult> long_term_cantilevers_;
  std::vector<CaseResult> service_cantilevers_;  // likewise under the service load
  std::vector<CaseResult> service_;    // characteristic, every span loaded, when asked for
  double load_ratio_ = 0.0, nil_moment_ = 0.0;
};

}  // namespace armature
