// The interface between the kernel and a design code. A code plug-in
// implements DesignCode (immutable, shareable across threads) and, for each
// request, a SlabChecker: the code's session for that request, holding its
// resolved materials and giving the code's rules in three parts, each of
// which a house plug-in can wrap on its own: CombinationRules
// (combinations.hpp), SectionRules (the checks of a Section) and
// MemberRules (the checks of a member that are not a section's).
// The kernel owns loads, analysis, sections and the bar search; the code
// owns every factor, limit and clause.
#pragma once

#include <array>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "armature/analysis.hpp"
#include "armature/combinations.hpp"
#include "armature/deflection.hpp"
#include "armature/errors.hpp"
#include "armature/punching.hpp"
#include "armature/record.hpp"
#include "armature/request.hpp"
#include "armature/section.hpp"

namespace armature {

struct CodeIdentity {
  std::string id;       // "EN1992-1-1"
  std::string variant;  // "UK"
  std::string title;    // human-readable title of code and variant
};

// What the code says about loads besides the combinations.
struct LoadBasis {
  double density_kN_m3 = 0.0;             // for self-weight
  // What the code calls the load of its long-term checks (the
  // quasi-permanent combination), as the summary and the record name it:
  // "quasi-permanent" (EN 1990), "sustained" (ACI 318). Empty: the kernel
  // says "long-term".
  std::string long_term_load_name;
  // The code's names, as the record prints them, of the uniform permanent
  // and variable loads ("D (self-weight + superimposed dead)") and of each
  // action kind, indexed by ActionKind ("D (dead)"). Empty: the kernel's
  // "Gk (self-weight + superimposed)", "Qk (imposed)" and the kind's name.
  std::string permanent_load_name;
  std::string variable_load_name;
  std::array<std::string, 4> action_kind_names{};
};

// The values the kernel takes for its own fields that a request leaves out
// (slab.strip_width_mm, reinforcement.spacing_step_mm and .min_spacing_mm,
// concrete.aggregate_mm, report_units), where a code's practice differs from the contract's
// defaults: a variant drawn in inches designs a 12 in strip with bars at
// half-inch steps. Read from the request's JSON only (a C++ Request states
// every value it uses).
struct PracticeDefaults {
  double strip_width_mm = 1000.0;
  double spacing_step_mm = 25.0;
  double min_spacing_mm = 75.0;
  double aggregate_mm = 20.0;
  ReportUnits report_units = ReportUnits::SI;
  // The concrete strength taken when the request gives neither a class nor
  // a cylinder strength (none: the request must give one).
  std::optional<double> cylinder_strength_MPa;
};

// Combined loads of one request, per unit area (N/mm²): the actions
// uniform over the whole strip (the self-weight, the shorthands and any
// such action of loads.actions).
struct LoadTotals {
  double self_weight = 0.0;
  double Gk = 0.0;
  double Qk = 0.0;
  double uls = 0.0;             // governing ULS load, all spans loaded
  std::string combination;      // label of the ULS combination giving it
  double sls_quasi_permanent = 0.0;
  double density_kN_m3 = 0.0;       // of the self-weight, from LoadBasis
  std::string long_term_load_name;  // from LoadBasis
  std::string permanent_load_name;  // from LoadBasis
  std::string variable_load_name;   // from LoadBasis
  std::array<std::string, 4> action_kind_names{};  // from LoadBasis
};

// How a span is supported, for span/depth rules.
// The span's structural system for span/depth rules. Flat slabs: a panel
// on columns, exterior where a side lies on the slab's free edge (the
// columns' edge), interior otherwise (a wall counts as a stiff edge).
enum class SpanKind {
  simply_supported,
  end_span,
  interior_span,
  cantilever,
  flat_exterior_panel,
  flat_interior_panel
};
inline bool is_flat_panel(SpanKind k) { return k == SpanKind::flat_exterior_panel || k == SpanKind::flat_interior_panel; }

struct SupportDemand {
  std::string where;   // "support 1"
  double V_Ed = 0.0;   // N, for the strip width, at the support centreline
};

// The moments of one load case at a support given a width
// (slab.support_widths_mm), from which the code takes its design hogging
// moment there. Hogging moments are magnitudes (negative where the case
// sags there).
struct SupportMomentCase {
  double M_centre = 0.0;      // N·mm, at the support's centreline
  double M_face = 0.0;        // N·mm, the larger at the two faces, t/2 either side
  double M_fixed_end = 0.0;   // N·mm, the largest of the adjacent spans' moments
                              // at this support were they built in at both ends
                              // (a cantilever: its root moment)
  double reaction = 0.0;      // N, the support's reaction (upward)
};

// A support region's width and the moments the code needs to decide its
// design moment; width 0: no width given, M_Ed is at the centreline.
struct SupportFace {
  double width_mm = 0.0;
  bool built_in = false;      // a fixed end: the strip is built into this support
  bool cantilever_root = false;
  double M_centre = 0.0;      // N·mm, envelope at the centreline (what M_Ed was)
  std::vector<SupportMomentCase> cases{};  // one per load case
};

// Everything the code needs to check one design region.
struct RegionDemand {
  std::string where;       // "span 1" or "support 2"
  Face face = Face::bottom;
  double x_mm = 0.0;       // position along the strip
  double M_Ed = 0.0;       // N·mm, magnitude, for the strip width
  // The span whose deflection these bars govern (span regions only).
  std::string span_where;
  double span_mm = 0.0;
  SpanKind span_kind = SpanKind::simply_supported;
  // Supports whose shear resistance relies on these bars as tension steel.
  std::vector<SupportDemand> supports;
  double quasi_permanent_to_uls = 0.0;  // ratio of SLS quasi-permanent to ULS moment
  double redistribution_delta = 1.0;    // δ of 5.5 at this region
  // One nominal cover per face: where the code works cover out from the
  // bar size, it uses bars of at least this diameter (the largest the
  // kernel has chosen on this face; 0: each bar its own).
  double cover_bar_mm = 0.0;
  // Support regions of a strip given support widths: M_Ed is the code's
  // support_design_moment() of these numbers.
  SupportFace support_face{};
  // For a calculated deflection (request.serviceability), span regions
  // only: the span's internal forces under the code's long-term load
  // (quasi-permanent) on every span, with no redistribution; x from the
  // span's left support. None when the request asks for no calculated
  // deflection.
  std::optional<SpanForces> long_term_span{};
  // The same under the code's service load (characteristic: ACI D + L).
  std::optional<SpanForces> service_span{};
  // A cantilever's root support region (span_kind cantilever): long_term_span
  // is the cantilever's, back_span the span behind its root under the same
  // load, and whether the root is at the cantilever's x = 0 (a cantilever
  // beyond the strip's right end) or at its x = L.
  std::optional<SpanForces> back_span{};
  // The back span with the variable actions on the cantilevers only: the
  // root turns back the least, the tip deflects the most.
  std::optional<SpanForces> back_span_unloaded{};
  // The same two under the service load (service_span: the cantilever's).
  std::optional<SpanForces> back_service_span{};
  std::optional<SpanForces> back_service_span_unloaded{};
  bool cantilever_root_at_start = true;
  // Two-way slabs: the direction the region's bars run (span: a strip),
  // the plan position's y (x in x_mm), and the bar of the face's outer
  // layer when these bars lie on it (0: these bars are the outer layer),
  // from which the kernel takes their effective depth.
  BarDirection direction = BarDirection::span;
  double y_mm = 0.0;
  double outer_bar_mm = 0.0;
  // Two-way slabs: the longer span of the bay whose deflection these bars
  // govern (span_mm is its shorter span), for codes whose two-way rules
  // read both. Flat slab panels (span_kind flat_*): span_mm and
  // long_span_mm are the panel's longer span between column lines, and
  // clear_span_mm the clear span in that direction, face to face.
  double long_span_mm = 0.0;
  double clear_span_mm = 0.0;
};

// How much a code reports for one bar arrangement: the bar search needs
// only the verdict; the result needs the checks; the record their steps.
enum class Detail { verdict, checks, steps };

struct RegionVerdict {
  bool all_pass = true;       // every check of the arrangement passes
  bool strength_pass = true;  // bending and minimum steel pass
};

inline bool is_strength_check(std::string_view id) { return id == "bending" || id == "min_steel"; }
// Limits on the bar arrangement itself (spacing): the search works up to
// them, so they are left out of the governing check unless they fail.
inline bool is_arrangement_limit(std::string_view id) { return id == "spacing"; }

struct SupportOutcome {
  std::string where;
  double V_Ed = 0.0;  // N
  double V_Rd = 0.0;  // N
  std::vector<Check> checks;
};

// The section rules' verdict on one section under a region's demand. At
// Detail::verdict only `verdict` counts (and As_req_mm2, which the member
// rules read); the records are filled from Detail::checks on.
struct SectionOutcome {
  RegionVerdict verdict;       // always filled, at every detail
  double As_req_mm2 = 0.0;
  double As_min_mm2 = 0.0;
  double As_max_mm2 = 0.0;
  std::vector<Check> checks;             // section checks of the region
  std::vector<SupportOutcome> supports;  // shear at the supports these bars anchor
};

// The member rules' checks that read a region's section.
struct MemberSectionOutcome {
  RegionVerdict verdict;          // always filled, at every detail
  std::vector<Check> checks;      // of the region (its bars' fire axis distance, ...)
  std::vector<Check> span_checks; // of region.span_where (deflection, ...)
};

// Every check of one bar arrangement in one region, as the kernel puts
// the section's and the member's together (SlabChecker::check_region).
struct RegionOutcome {
  RegionVerdict verdict;       // always filled, at every detail
  double cover_mm = 0.0;       // nominal cover used for these bars
  double d_mm = 0.0;           // effective depth
  double As_req_mm2 = 0.0;
  double As_min_mm2 = 0.0;
  double As_max_mm2 = 0.0;
  std::vector<Check> checks;        // section checks of the region, then the member's
  std::vector<Check> span_checks;   // deflection etc. of span_where
  std::vector<SupportOutcome> supports;
};

// Requirement for the distribution (secondary) bars.
struct DistributionNeed {
  double As_req_mm2 = 0.0;
  double max_spacing_mm = 0.0;
};

// The value a design takes for a request field left out: "25 kN/m³" for
// concrete.density_kN_m3, with where that value comes from.
struct InputDefault {
  std::string field;  // request path, as in InputProblems: "concrete.density_kN_m3"
  std::string value;  // as the record prints it, with its unit: "25 kN/m³"
  std::string basis;  // "EN 1991-1-1 Table A.1", "armature default"
};

// Static equilibrium of a strip with a cantilever under one EQU
// combination: the reaction at the far support of the cantilever's back
// span, split into what the loads that hold it down give (permanent
// actions on the back span, favourable) and what the cantilever's loads
// take away (permanent unfavourable and variable actions on it).
struct EquilibriumDemand {
  std::string where;               // "support 1"
  std::string combination;         // label of the EQU combination
  double R_stabilising = 0.0;      // N, upward reaction from the spans that hold the support down
  double R_destabilising = 0.0;    // N, the reduction the other spans' loads (the cantilever's) cause
};

// The code's checks of a section (section.hpp) under a region's demand,
// and what the bar search needs to build and try sections.
class SectionRules {
 public:
  virtual ~SectionRules() = default;
  // Nominal cover (mm) of bars of this diameter on a face. The kernel
  // keeps one cover per face: it passes the largest bar it has chosen on
  // the face where that is larger (RegionDemand::cover_bar_mm).
  virtual double nominal_cover_mm(Face face, double bar_diameter_mm) const = 0;
  // Largest bar spacing the code allows in this region (mm).
  virtual double max_spacing_mm(const RegionDemand& region) const = 0;
  // An area (mm², for the strip width) below which this bar certainly
  // fails a strength check (bending or min_steel) in this region; +inf
  // when no area of it passes. The bar search asks no verdict of such
  // arrangements, so it must never exceed the true threshold. 0 when the
  // code gives none.
  virtual double minimum_area_mm2(const RegionDemand&, const BarOption&) const { return 0.0; }
  // Every section check of a section under the region's demand, at the
  // detail asked for (the verdict is filled at every detail): cover,
  // bending, ductility, minimum and maximum steel, spacing, cracking, and
  // the shear without links at region.supports, which rely on the bars of
  // the region's face as tension steel. The section's bars on region.face
  // are in tension.
  virtual SectionOutcome check_section(const Section& section, const RegionDemand& region,
                                       Detail detail) const = 0;
  // Distribution (secondary) bars for main bars of this area.
  virtual DistributionNeed distribution(double main_As_prov_mm2) const = 0;
};

// Two-way slabs: reinforcement at an outer corner of the slab where two
// pinned (discontinuous, held down) edges meet, against the torsion there
// (or any two supported edges, with fixed_edges_too).
// The corner zone reaches `extent_of_longer_span` of the corner bay's
// longer span from the corner along each edge (at most the bay). Its top
// bars in x and y, and its bottom bars too where `bottom`, are designed
// for the larger of the Wood–Armer moment of that face and direction in
// the zone and `panel_moment_fraction` × the bay's largest sagging design
// moment (either direction). An empty `clause`: no corner regions.
struct CornerRule {
  double panel_moment_fraction = 0.0;
  double extent_of_longer_span = 0.2;
  bool bottom = false;  // false: the bay's bottom bars, designed over the whole bay, serve
  std::string clause{};
  bool fixed_edges_too = false;  // every exterior corner of two supported edges, fixed ones included
};

// Two-way slabs: the reinforcement along a free (unsupported) outer edge:
// U-bars whose legs run `u_bar_leg_over_h` × h into the slab on each face,
// made of the bay's own bars across the edge, with bars along the edge
// inside the U (the slab's bars parallel to the edge). An empty `clause`:
// the code sets no such rule.
struct FreeEdgeRule {
  double u_bar_leg_over_h = 2.0;
  std::string clause{};
};

// Flat slabs: the widths of the design strips and the concentration of
// top steel over internal columns. A column strip reaches
// `column_strip_each_side` × the lesser of the two spans of the panel on
// that side (along and across the strip) from the column line; the middle
// strip is the rest of the panel. Where `band_each_side` > 0, over each
// internal column a band reaching band_each_side × the panel's width (the
// span across the strip) each side of the column line takes top steel for
// at least `band_share` of the hogging of the whole panel width
// (band_clause). An empty `clause`: the code designs no flat slabs.
// The code may also set how far the top bars over a column line reach
// into each adjacent span, as shares of the bars with the reach in clear
// spans from the face (`extents_clause`; none where empty), and state what
// it asks of the bottom bars through the columns (`integrity`).
struct FlatBarExtent {
  double share = 1.0;             // of the region's bars (the remainder after the earlier entries)
  double of_clear_span = 0.0;     // reach past the face, × the clear span
};
struct FlatStripRule {
  double column_strip_each_side = 0.25;
  std::string clause{};
  double band_each_side = 0.0;
  double band_share = 0.0;
  std::string band_clause{};
  std::vector<FlatBarExtent> column_strip_top{};
  std::vector<FlatBarExtent> middle_strip_top{};
  std::string extents_clause{};
  std::string integrity{};
};

// ---- Calculated deflection of plates (two-way and flat slabs) ----------------

// One state of a plate's calculated deflection: every bay under the code's
// combination of `load` (of several, the one with the largest total load),
// the section response the code gives for the state's index, and the
// concrete's modulus in this state (a flat slab's columns turn against
// 4 E Ic/H with it: creep softens them as it does the slab).
struct PlateDeflectionState {
  std::string name;  // as the record prints it: "long-term", "D + L"
  LimitState load = LimitState::quasi_permanent;
  double modulus_MPa = 0.0;
  // The record maps the long-term deflection over the plan as Σ
  // record_weight × this state's deflection (EN: 1 for the long term;
  // ACI: λΔ Δ(D) + Δ(D + L) − Δ(D)).
  double record_weight = 0.0;
};

// A section's response, in one direction of a plate, to a moment M (N·mm
// for the section's width b, ≥ 0) that puts its bars' face in tension: the
// secant rigidity M/(κ − κ_free) (N·mm² for the width b; at M = 0 the
// uncracked one), the free curvature (1/mm, ≥ 0 in the sense of M: the
// shrinkage curvature with those bars), and whether M cracks it.
struct PlateSectionResponse {
  double rigidity_Nmm2 = 0.0;
  double free_curvature = 0.0;
  bool cracked = false;
};

// What the kernel found for one panel (a span region's span_where), per
// state of plate_deflection_states(): the deflection (mm, downward, from
// the level of the supports) at every mesh node of the panel, at x_mm,
// y_mm (request plan), and how its iteration ended. `section` holds the
// panel's span region's bars (the record's section properties).
struct PlateDeflectionDemand {
  std::string where;
  double span_mm = 0.0;  // the span region's span_mm, the span the limits read
  SpanKind span_kind = SpanKind::simply_supported;
  std::vector<double> x_mm, y_mm;
  std::vector<std::vector<double>> w_mm;
  struct Iteration {
    std::size_t rounds = 0;       // solutions until converged
    double change = 0.0;          // relative change of the largest deflection in the last round
    double cracked_share = 0.0;   // share of the panel's elements cracked in either direction
    double M_max_Nmm = 0.0;       // the panel's largest sagging moment for the width b
  };
  std::vector<Iteration> iterations;
  Section section;
  std::string model;  // the kernel's statement of the analysis, for the record
};

// The code's checks of a member that are not a section's.
class MemberRules {
 public:
  virtual ~MemberRules() = default;
  // Checks of the member that read the section of a region: the span's
  // deflection by span/depth ratio where the region governs a span
  // (region.span_where not empty), the axis distance of its bars in fire.
  // `section` is the region's outcome from the section rules (As_req).
  // The kernel asks only for a section whose bars fit (d > 0).
  virtual MemberSectionOutcome check_with_section(const Section& section, const RegionDemand& region,
                                                  const SectionOutcome& outcome, Detail detail) const = 0;
  // Checks of a span that do not depend on the bars (fire thickness, ...).
  virtual std::vector<Check> span_checks(const std::string& span_where) const = 0;
  // The check of static equilibrium (uplift at the support) for one EQU
  // combination; none when the code checks none.
  virtual std::vector<Check> equilibrium_checks(const EquilibriumDemand&, Detail) const { return {}; }
  // Top steel at pinned ends, as a fraction of the largest adjacent span
  // moment; 0 when the code asks for none.
  virtual double pinned_end_fixity_fraction() const = 0;
  // Corner reinforcement of two-way slabs (CornerRule); none by default.
  virtual CornerRule corner_rule() const { return {}; }
  // Free-edge reinforcement of two-way slabs (FreeEdgeRule); none by default.
  virtual FreeEdgeRule free_edge_rule() const { return {}; }
  // Design strips of flat slabs (FlatStripRule); none by default.
  virtual FlatStripRule flat_strip_rule() const { return {}; }
  // The design hogging moment (N·mm, magnitude) of a support region whose
  // support has a width (region.support_face.width_mm > 0), from the
  // moments the kernel gives per load case; called once per such region,
  // before the bar search, and the result becomes region.M_Ed. Default:
  // the centreline moment (no reduction).
  virtual double support_design_moment(const RegionDemand& region) const { return region.support_face.M_centre; }
  // For the record: the curvature and deflection along the span a region
  // governs (region.long_term_span), as the code's calculated deflection
  // integrates them for this section (the long-term total); none where
  // the code calculates none.
  virtual std::optional<SpanDeflection> deflection_diagram(const Section&, const RegionDemand&) const {
    return std::nullopt;
  }
  // Calculated deflection of two-way and flat slabs: the states the kernel
  // solves the plate for (none: the code calculates no plate deflection),
  // a section's response in each, and the checks of one panel from the
  // deflections found.
  virtual std::vector<PlateDeflectionState> plate_deflection_states() const { return {}; }
  virtual PlateSectionResponse plate_section_response(const Section&, double /*M_Nmm*/, std::size_t /*state*/) const {
    return {};
  }
  virtual std::vector<Check> plate_deflection_checks(const PlateDeflectionDemand&, Detail) const { return {}; }
};

// A band of top bars over a column for the moment it takes (see
// PunchingRules::moment_transfer_band).
struct TransferBand {
  double width_mm = 0.0;
  double share = 1.0;
  std::string clause{};
};

// The code's punching shear rules at a column of a flat slab
// (punching.hpp): the perimeters, stresses and resistances, and the shear
// reinforcement where the concrete alone does not do.
class PunchingRules {
 public:
  virtual ~PunchingRules() = default;
  // The width (mm) over which the code takes the top steel ratio of bars
  // running in the direction asked (along_x: the bars along x), for a
  // member working out PunchingDemand::rho_x and rho_y; 0 when the code's
  // punching resistance does not read the steel ratio.
  virtual double steel_ratio_width_mm(const PunchingDemand& demand, bool along_x) const = 0;
  // The punching checks at one column, at the detail asked for (the
  // numbers and pass are filled at every detail). Throws
  // std::invalid_argument naming the demand's field when it lacks what
  // the code needs.
  virtual PunchingOutcome check_punching(const PunchingDemand& demand, Detail detail) const = 0;
  // Where a column takes a moment from the slab (the analysis gives it):
  // the width of slab over the column whose top bars running along x
  // (bars_x) or y carry `share` of that moment, the code's clause; none
  // where the code sets no such width for this column and direction. The
  // demand gives the column, the slab's thickness and the free faces (its
  // depths may be 0: the band is chosen before the bars).
  virtual std::optional<TransferBand> moment_transfer_band(const PunchingDemand&, bool /*bars_x*/) const {
    return std::nullopt;
  }
};

class ForwardingPunchingRules : public PunchingRules {
 public:
  explicit ForwardingPunchingRules(const PunchingRules& inner) : inner_(&inner) {}
  double steel_ratio_width_mm(const PunchingDemand& demand, bool along_x) const override {
    return inner_->steel_ratio_width_mm(demand, along_x);
  }
  PunchingOutcome check_punching(const PunchingDemand& demand, Detail detail) const override {
    return inner_->check_punching(demand, detail);
  }
  std::optional<TransferBand> moment_transfer_band(const PunchingDemand& demand, bool bars_x) const override {
    return inner_->moment_transfer_band(demand, bars_x);
  }

 protected:
  const PunchingRules& inner() const { return *inner_; }

 private:
  const PunchingRules* inner_;
};

// ---- Detailing: the lengths of bars (DetailingRules) ----------------------
// One bar of a region as the detailing rules see it: its size, spacing,
// position in the section and the demand where it is anchored.
struct BarDetailDemand {
  std::string where;         // "span 1", "support 2"
  Face face = Face::bottom;  // the face the bar lies at
  double diameter_mm = 0.0;
  double spacing_mm = 0.0;   // centre to centre
  double cover_mm = 0.0;     // nominal cover to the bar
  double d_mm = 0.0;         // effective depth of the region
  double As_prov_mm2 = 0.0;  // of the region, for the strip width
  BondChoice bond = BondChoice::automatic;
  // End supports: the design shear at the support (N, for the strip width)
  // whose tensile force the bottom bars anchor there.
  double V_Ed_N = 0.0;
  // Laps: the share of the bars lapped at one section (0.5: alternate
  // laps staggered).
  double lapped_share = 1.0;
  // hooked_anchorage: a bottom bar anchored at an end support (the force
  // of V_Ed_N there, as end_support_anchorage), else a bar at the stress
  // its region's design asks of it (As_req_mm2 over As_prov_mm2 of its
  // strength; 0: not known, its full strength).
  bool at_end_support = false;
  double As_req_mm2 = 0.0;  // of the region, for the strip width
};

// A length the code requires, with its clause and the steps of its
// derivation (always filled: the record prints every anchorage and lap).
struct DetailLength {
  double length_mm = 0.0;
  std::string clause;
  std::vector<Step> steps;
  // A bent bar's end (hooked_anchorage only; 0 for straight lengths): the
  // inside diameter of the bend and the straight extension past it.
  double bend_diameter_mm = 0.0;
  double extension_mm = 0.0;
  // hooked_anchorage: where the code also lets the same anchorage be
  // measured along the bar's centreline whatever its shape (so that a leg
  // longer than the extension counts where the bend measured to its
  // outside falls short), the clause that says so; empty where it does not.
  std::string centreline_clause{};
  // ... and the least inside diameter of that bend where the leg must
  // anchor more than the extension past it (the concrete inside the bend
  // then bears the bar's force; 0: the bend's own).
  double long_leg_bend_diameter_mm = 0.0;
};

// A share of a slab's top reinforcement the code asks to run continuous
// (share 0: none), with its clause.
struct ContinuousTopRule {
  double share = 0.0;
  std::string clause{};
};

// A limit the code sets on a bar where the code asks it (met or not), with
// its derivation; `applies` false where the code sets none.
struct DetailLimit {
  bool applies = false;
  bool met = true;
  double length_mm = 0.0;  // the length the code limits (e.g. ld)
  double limit_mm = 0.0;   // its limit (0: none at this section)
  std::string clause;
  std::vector<Step> steps;
};

// The end of a bottom (positive-moment) bar at a point of zero moment: a
// simple support or a point of inflection.
struct ZeroMomentSite {
  bool simple_support = true;  // else a point of inflection
  bool confined = false;       // the bar's end confined by a compressive reaction
  bool hooked = false;         // the bar ends past the support's centreline in a standard hook
  double embedment_mm = 0.0;   // past the support's centreline, or past the point of inflection
};

// The code's rules for the lengths of bars: how far past the point where
// a bar is no longer needed it runs (the shift), its anchorage there, at
// end and interior supports, its laps, and the standard bend or hook a bar
// ends in where a straight anchorage does not fit.
class DetailingRules {
 public:
  virtual ~DetailingRules() = default;
  // The shift of the tensile force beyond the point where the bar is no
  // longer needed.
  virtual DetailLength shift(const BarDetailDemand& bar) const = 0;
  // Anchorage (development) length of a straight bar in tension at its
  // full design strength.
  virtual DetailLength anchorage(const BarDetailDemand& bar) const = 0;
  // How far bottom bars run past an end (simple) support: past its
  // centreline where no support width is given, past its face (the line
  // of contact) where one is.
  virtual DetailLength end_support_anchorage(const BarDetailDemand& bar) const = 0;
  // The least embedment of bottom bars past the centreline of an
  // interior support.
  virtual DetailLength interior_support_embedment(const BarDetailDemand& bar) const = 0;
  // Lap length of bars in tension, bar.lapped_share of them lapped at one
  // section.
  virtual DetailLength lap(const BarDetailDemand& bar) const = 0;
  // How far past the line of an end support that the design takes as
  // simple the top bars there (the code's steel for partial fixity) run
  // into the span of length span_mm at least; none (0) when the code sets
  // no such length (the shift and anchorage then govern).
  virtual DetailLength end_top_bar_extent(const BarDetailDemand&, double /*span_mm*/) const { return {}; }
  // A bar that ends in the code's standard bend or hook where a straight
  // anchorage does not fit: the anchorage it needs past the section (the
  // support's face), measured to the outside of the bend, with the
  // bend's inside diameter and the straight extension past the bend
  // (bar.at_end_support: a bottom bar at an end support).
  virtual DetailLength hooked_anchorage(const BarDetailDemand& bar) const = 0;
  // A limit on the development of bottom bars where the moment falls to
  // zero (a simple support or a point of inflection), bar.V_Ed_N the
  // shear there; none (applies false) by default.
  virtual DetailLimit zero_moment_development(const BarDetailDemand&, const ZeroMomentSite&) const { return {}; }
  // A flat slab of fire resistance `minutes`: the share of the top
  // reinforcement over the intermediate supports, in each direction, that
  // runs continuous over the whole span, placed in the column strips;
  // none by default.
  virtual ContinuousTopRule fire_continuous_top(int /*minutes*/) const { return {}; }
};

class ForwardingDetailingRules : public DetailingRules {
 public:
  explicit ForwardingDetailingRules(const DetailingRules& inner) : inner_(&inner) {}
  DetailLength shift(const BarDetailDemand& bar) const override { return inner_->shift(bar); }
  DetailLength anchorage(const BarDetailDemand& bar) const override { return inner_->anchorage(bar); }
  DetailLength end_support_anchorage(const BarDetailDemand& bar) const override {
    return inner_->end_support_anchorage(bar);
  }
  DetailLength interior_support_embedment(const BarDetailDemand& bar) const override {
    return inner_->interior_support_embedment(bar);
  }
  DetailLength lap(const BarDetailDemand& bar) const override { return inner_->lap(bar); }
  DetailLength end_top_bar_extent(const BarDetailDemand& bar, double span_mm) const override {
    return inner_->end_top_bar_extent(bar, span_mm);
  }
  DetailLength hooked_anchorage(const BarDetailDemand& bar) const override { return inner_->hooked_anchorage(bar); }
  DetailLimit zero_moment_development(const BarDetailDemand& bar, const ZeroMomentSite& site) const override {
    return inner_->zero_moment_development(bar, site);
  }
  ContinuousTopRule fire_continuous_top(int minutes) const override { return inner_->fire_continuous_top(minutes); }

 protected:
  const DetailingRules& inner() const { return *inner_; }

 private:
  const DetailingRules* inner_;
};

// The code's session for one request: the request's resolved materials,
// bars and defaults, and the code's rules in three parts. A house plug-in
// wraps the part it changes and hands back the others as they are
// (ForwardingSlabChecker and the Forwarding*Rules below do the forwarding).
class SlabChecker {
 public:
  virtual ~SlabChecker() = default;
  virtual const CombinationRules& combination_rules() const = 0;
  virtual const SectionRules& section_rules() const = 0;
  virtual const MemberRules& member_rules() const = 0;
  virtual const PunchingRules& punching_rules() const = 0;
  // The lengths of bars (detailing); none when the code gives no
  // detailing rules (the kernel then refuses a request for detailing).
  virtual const DetailingRules* detailing_rules() const { return nullptr; }
  // The request this session was opened for (Code::begin), whose slab
  // gives the sections their width and thickness.
  virtual const Request& request() const = 0;
  virtual LoadBasis load_basis() const = 0;
  // Candidate bars of the request (or the code's default set); the list
  // lives as long as the checker.
  virtual const std::vector<BarOption>& bar_options() const = 0;
  // A bar of the code's catalogue by its designation (a bar given in check
  // mode need not be a candidate of the search); none when the catalogue
  // has no such bar. The code's validate() has refused unknown given bars
  // (reinforcement.given[i].bar). By default: a candidate bar of that name.
  virtual std::optional<BarOption> catalogue_bar(const std::string& designation) const {
    for (const auto& bar : bar_options())
      if (bar.designation == designation) return bar;
    return std::nullopt;
  }
  virtual std::vector<std::string> warnings() const = 0;
  // For each field of the request that this code reads and that a request
  // may leave out (the code's own defaults and the kernel's alike), the
  // value this design takes for it: the default, when the request leaves
  // it out. Listed whether or not the request gives the field (a code
  // cannot tell a kernel default from a given value); the record shows
  // those the request left out. A decorator forwards its inner code's list.
  virtual std::vector<InputDefault> defaults_used() const { return {}; }

  // What the kernel asks of the rules, for callers holding a session (not
  // virtual: a plug-in changes them through its rules).
  double max_spacing_mm(const RegionDemand& region) const { return section_rules().max_spacing_mm(region); }
  double minimum_area_mm2(const RegionDemand& region, const BarOption& bar) const {
    return section_rules().minimum_area_mm2(region, bar);
  }
  DistributionNeed distribution(double main_As_prov_mm2) const {
    return section_rules().distribution(main_As_prov_mm2);
  }
  // Every check of one arrangement in a region, as the bar search and the
  // design record see it: the kernel builds the region's section (the
  // face's cover from the section rules, one layer along the span), asks
  // the section rules, then the member rules (only while the verdict is
  // open at Detail::verdict, and only for bars that fit).
  RegionOutcome check_region(const RegionDemand& region, const BarOption& bar, double spacing_mm,
                             Detail detail) const;
  // The member rules' deflection_diagram for the section check_region builds.
  std::optional<SpanDeflection> deflection_diagram(const RegionDemand& region, const BarOption& bar,
                                                   double spacing_mm) const;
};

// Bases for a house plug-in's rules: each forwards every call to the
// rules it wraps, so a wrapper overrides only what it changes.
class ForwardingSectionRules : public SectionRules {
 public:
  explicit ForwardingSectionRules(const SectionRules& inner) : inner_(&inner) {}
  double nominal_cover_mm(Face face, double bar_diameter_mm) const override {
    return inner_->nominal_cover_mm(face, bar_diameter_mm);
  }
  double max_spacing_mm(const RegionDemand& region) const override { return inner_->max_spacing_mm(region); }
  double minimum_area_mm2(const RegionDemand& region, const BarOption& bar) const override {
    return inner_->minimum_area_mm2(region, bar);
  }
  SectionOutcome check_section(const Section& section, const RegionDemand& region, Detail detail) const override {
    return inner_->check_section(section, region, detail);
  }
  DistributionNeed distribution(double main_As_prov_mm2) const override {
    return inner_->distribution(main_As_prov_mm2);
  }

 protected:
  const SectionRules& inner() const { return *inner_; }

 private:
  const SectionRules* inner_;
};

class ForwardingMemberRules : public MemberRules {
 public:
  explicit ForwardingMemberRules(const MemberRules& inner) : inner_(&inner) {}
  MemberSectionOutcome check_with_section(const Section& section, const RegionDemand& region,
                                          const SectionOutcome& outcome, Detail detail) const override {
    return inner_->check_with_section(section, region, outcome, detail);
  }
  std::vector<Check> span_checks(const std::string& span_where) const override {
    return inner_->span_checks(span_where);
  }
  std::vector<Check> equilibrium_checks(const EquilibriumDemand& demand, Detail detail) const override {
    return inner_->equilibrium_checks(demand, detail);
  }
  double pinned_end_fixity_fraction() const override { return inner_->pinned_end_fixity_fraction(); }
  CornerRule corner_rule() const override { return inner_->corner_rule(); }
  FreeEdgeRule free_edge_rule() const override { return inner_->free_edge_rule(); }
  FlatStripRule flat_strip_rule() const override { return inner_->flat_strip_rule(); }
  double support_design_moment(const RegionDemand& region) const override {
    return inner_->support_design_moment(region);
  }
  std::optional<SpanDeflection> deflection_diagram(const Section& section, const RegionDemand& region) const override {
    return inner_->deflection_diagram(section, region);
  }
  std::vector<PlateDeflectionState> plate_deflection_states() const override {
    return inner_->plate_deflection_states();
  }
  PlateSectionResponse plate_section_response(const Section& section, double M_Nmm, std::size_t state) const override {
    return inner_->plate_section_response(section, M_Nmm, state);
  }
  std::vector<Check> plate_deflection_checks(const PlateDeflectionDemand& demand, Detail detail) const override {
    return inner_->plate_deflection_checks(demand, detail);
  }

 protected:
  const MemberRules& inner() const { return *inner_; }

 private:
  const MemberRules* inner_;
};

// A session that forwards everything to the session it wraps (which it
// owns); a house plug-in overrides the parts it changes.
class ForwardingSlabChecker : public SlabChecker {
 public:
  explicit ForwardingSlabChecker(std::unique_ptr<SlabChecker> inner) : inner_(std::move(inner)) {}
  const CombinationRules& combination_rules() const override { return inner_->combination_rules(); }
  const SectionRules& section_rules() const override { return inner_->section_rules(); }
  const MemberRules& member_rules() const override { return inner_->member_rules(); }
  const PunchingRules& punching_rules() const override { return inner_->punching_rules(); }
  const DetailingRules* detailing_rules() const override { return inner_->detailing_rules(); }
  const Request& request() const override { return inner_->request(); }
  LoadBasis load_basis() const override { return inner_->load_basis(); }
  const std::vector<BarOption>& bar_options() const override { return inner_->bar_options(); }
  std::optional<BarOption> catalogue_bar(const std::string& designation) const override {
    return inner_->catalogue_bar(designation);
  }
  std::vector<std::string> warnings() const override { return inner_->warnings(); }
  std::vector<InputDefault> defaults_used() const override { return inner_->defaults_used(); }

 protected:
  const SlabChecker& inner() const { return *inner_; }

 private:
  std::unique_ptr<SlabChecker> inner_;
};

class DesignCode {
 public:
  virtual ~DesignCode() = default;
  virtual CodeIdentity identity() const = 0;
  // Adds one problem per code-specific field that is out of range or unknown.
  virtual void validate(const Request& request, InputProblems& problems) const = 0;
  // For a request that passed validate(). The checker may refer to the
  // request and to this code: the caller keeps both alive while the
  // checker lives.
  virtual std::unique_ptr<SlabChecker> begin(const Request& request) const = 0;
  // The kernel fields' defaults under this code (see PracticeDefaults).
  virtual PracticeDefaults practice_defaults() const { return {}; }
};

// Collects the checks of one arrangement at a detail: always the verdict,
// the Check records from Detail::checks, their steps at Detail::steps only
// (`make_steps` is not called otherwise).
class CheckCollector {
 public:
  CheckCollector(std::vector<Check>& out, RegionVerdict& verdict, Detail detail)
      : out_(out), verdict_(verdict), detail_(detail) {}
  Detail detail() const { return detail_; }
  // True when only the verdict is wanted and it is already settled: the
  // strength checks are in and something has failed.
  bool verdict_settled() const { return detail_ == Detail::verdict && !verdict_.all_pass; }

  // Records the requirement demand ≤ capacity. The id, the clause and
  // the unit given as `const char*` must be string literals (their labels
  // are remembered by address, record.hpp); a clause built at run time is
  // given as a std::string (its label is looked up by its text).
  template <class StepsFn>
  void add(const char* id, const std::string& where, const char* clause, double demand,
           double capacity, const char* unit, StepsFn&& make_steps) {
    record(id, where, clause, demand, capacity, unit, std::forward<StepsFn>(make_steps));
  }
  template <class StepsFn>
  void add(const char* id, const std::string& where, const std::string& clause, double demand,
           double capacity, const char* unit, StepsFn&& make_steps) {
    record(id, where, clause, demand, capacity, unit, std::forward<StepsFn>(make_steps));
  }
  void add(const char* id, const std::string& where, const char* clause, double demand,
           double capacity, const char* unit) {
    record(id, where, clause, demand, capacity, unit, [] { return std::vector<Step>{}; });
  }
  void add(const char* id, const std::string& where, const std::string& clause, double demand,
           double capacity, const char* unit) {
    record(id, where, clause, demand, capacity, unit, [] { return std::vector<Step>{}; });
  }

 private:
  template <class ClauseText, class StepsFn>
  void record(const char* id, const std::string& where, const ClauseText& clause, double demand,
              double capacity, const char* unit, StepsFn&& make_steps) {
    const double utilisation = utilisation_of(demand, capacity);
    const bool pass = utilisation <= 1.0;
    verdict_.all_pass = verdict_.all_pass && pass;
    if (is_strength_check(id)) verdict_.strength_pass = verdict_.strength_pass && pass;
    if (detail_ == Detail::verdict) return;
    // Made in place with every field: no default labels to overwrite.
    out_.emplace_back(Label(id), where, Label(clause), demand, capacity, Label(unit), utilisation, pass,
                      detail_ == Detail::steps ? make_steps() : std::vector<Step>{}, Label());
  }

  std::vector<Check>& out_;
  RegionVerdict& verdict_;
  Detail detail_;
};

// The verdict of an outcome's checks (for a decorator that changed them).
RegionVerdict verdict_of(const RegionOutcome& outcome);
RegionVerdict verdict_of(const SectionOutcome& outcome);
RegionVerdict verdict_of(const std::vector<Check>& checks);

// Geometry every code refuses: a given cover of half the slab or more, or
// a slab no thicker than cover plus the smallest candidate bar.
void add_cover_fit_problems(const Request& request, double smallest_bar_mm, InputProblems& problems);

// The defaults_used() entries of durability, named by the field a request
// would give for them: one entry for both faces where neither face gives
// the value (durability.exposure, durability.cover_mm), else one for each
// face that leaves it out (durability.top.exposure, ...). `exposure` is
// the exposure each face takes (indexed by Face); `cover` the text of the
// cover the code works out where none is given.
std::vector<InputDefault> durability_defaults(const Request& request, const std::array<std::string, 2>& exposure,
                                              const std::string& exposure_basis, const std::string& cover,
                                              const std::string& cover_basis);

// Building blocks of load arrangements over a two-way slab's bays (bay
// index i + nx·j), for the code's bay_load_arrangements: every bay; the
// two checkerboards; for each interior grid line, the bays on both sides
// of it (the row of bays either side, over the whole width).
std::vector<bool> all_bays_loaded(std::size_t bays_x, std::size_t bays_y);
std::vector<std::vector<bool>> checkerboard_bay_arrangements(std::size_t bays_x, std::size_t bays_y);
std::vector<std::vector<bool>> adjacent_bays_across_lines(std::size_t bays_x, std::size_t bays_y);
// Alternate columns of bays (every other i, all j) and alternate rows of
// bays (every other j, all i), both parities where there are two or more:
// the frames of a flat slab loaded span by span over the whole width.
std::vector<std::vector<bool>> alternate_bay_strips(std::size_t bays_x, std::size_t bays_y);

// Building blocks of load arrangements (each marks the loaded spans): the
// code chooses which it uses.
std::vector<std::vector<bool>> alternate_span_arrangements(std::size_t span_count);  // both ways
std::vector<std::vector<bool>> adjacent_pair_arrangements(std::size_t span_count);
std::vector<bool> all_spans_loaded(std::size_t span_count);

// Runs one check; any exception escapes as CheckError naming the check.
template <class Fn>
auto run_check(const char* check_id, Fn&& fn) -> decltype(fn()) {
  try {
    return fn();
  } catch (const CheckError&) {
    throw;
  } catch (const std::exception& e) {
    throw CheckError(check_id, e.what());
  } catch (...) {
    throw CheckError(check_id, "unknown exception");
  }
}

// Lets a plug-in open another code through the registry (decorators).
class CodeHost {
 public:
  virtual ~CodeHost() = default;
  virtual std::shared_ptr<const DesignCode> open(const std::string& id,
                                                 const std::string& variant) const = 0;
};

}  // namespace armature
