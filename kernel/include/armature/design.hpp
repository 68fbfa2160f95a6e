// The design driver: request → loads → analysis → regions → bar search →
// design record. Nothing here knows a clause; the code plug-in does.
#pragma once

#include <array>
#include <optional>
#include <memory>
#include <string>
#include <vector>

#include <nlohmann/json_fwd.hpp>

#include "armature/analysis.hpp"
#include "armature/code.hpp"
#include "armature/record.hpp"
#include "armature/request.hpp"

namespace armature {

class Registry;
struct PlateRecord;  // two_way.hpp

// The one place the caution lives: result JSON, record, summary, CLI help,
// Python (armature.CAUTION: DataFrames, plots) all take it from here.
inline constexpr const char* caution_text =
    "A design aid: its results must be checked and adopted by an engineer qualified, "
    "and where required licensed or registered, for the place of the works, under the "
    "codes that govern it, local rules first.";

const char* version_string();

struct BarChoice {
  std::string bar;
  double diameter_mm = 0.0;
  double spacing_mm = 0.0;
  double As_prov_mm2 = 0.0;
};

struct RegionRecord {
  std::string where;
  Face face = Face::bottom;
  double x_mm = 0.0;
  double M_Ed = 0.0;  // N·mm
  double d_mm = 0.0;
  double As_req_mm2 = 0.0;
  double As_min_mm2 = 0.0;
  double As_max_mm2 = 0.0;
  double cover_mm = 0.0;
  BarChoice bars;
  bool bars_given = false;  // the request's bars (reinforcement.given), checked, not searched
  std::vector<Check> checks;
  // Two-way slabs: the direction the bars run and the plan position's y
  // (x in x_mm); span for a strip.
  BarDirection direction = BarDirection::span;
  double y_mm = 0.0;
};

struct SupportRecord {
  std::string where;
  double V_Ed = 0.0;  // N
  double V_Rd = 0.0;  // N
  std::vector<Check> checks;
};

struct SpanRecord {
  std::string where;
  std::vector<Check> checks;
};

// A column of a flat slab: what it takes from the slab (the ULS envelope)
// and its punching checks.
struct ColumnRecord {
  std::string name;                  // "column i,j"
  double x_mm = 0.0, y_mm = 0.0;     // centre, request plan
  double cx_mm = 0.0, cy_mm = 0.0;   // size along x, along y
  double V_Ed_N = 0.0;               // largest ULS reaction
  // Largest ULS moments the column takes (restrained columns; none where
  // the columns are free to turn).
  std::optional<double> M_x_Nmm, M_y_Nmm;
  bool regular_spans = false;        // the demand's braced_regular_spans
  PunchingOutcome punching;          // its checks are the column's
};

struct DistributionRecord {
  BarChoice bars;
  double As_req_mm2 = 0.0;
};

// Detailing (detailing of the request): every bar of the strip with its
// extent along it, and the schedule. Positions are from the strip's left
// end (support 1, or a left cantilever's tip); on a two-way slab along the
// bar's direction in the request's plan (from grid line x0 or y0).
struct DetailLap {
  double from_mm = 0.0, to_mm = 0.0;  // along the strip
};
struct DetailedBar {
  std::string mark;
  std::string where;          // "span 1", "support 2", "distribution, bottom"
  Face face = Face::bottom;
  bool distribution = false;  // a distribution bar (runs across the strip)
  bool curtailed = false;     // detailing.curtail "alternate": the alternate bars stopped inside the span
  std::string bar;
  double diameter_mm = 0.0;
  double spacing_mm = 0.0;
  int count = 0;              // floor(extent across / spacing) + 1, or its share of alternate laps
  double start_mm = 0.0, end_mm = 0.0;  // main bars: along the strip; distribution: across it
  double along_from_mm = 0.0, along_to_mm = 0.0;  // distribution: the part of the strip they are spread over
  double length_mm = 0.0;     // cut length, the legs of bent ends included
  std::string shape = "straight";  // "straight", "L-bar" (one bent end), "U-bar" (both)
  // past the shifted zero point, the support's line or (with a width) its
  // face; at a bent end what the bar provides past the face to the outside
  // of the bend
  double anchorage_start_mm = 0.0, anchorage_end_mm = 0.0;
  // A bent end's leg, measured to the outside of the bend (0: straight end).
  double leg_start_mm = 0.0, leg_end_mm = 0.0;
  // The inside diameter of its bends where wider than the code's standard
  // one (the concrete inside the bend; 0: the standard mandrel).
  double bend_diameter_mm = 0.0;
  double shift_mm = 0.0;
  std::vector<DetailLap> laps;  // lap zones at this bar's ends
  std::string clause;
  // A two-way slab: the bars' direction in plan and the band across them
  // they are spread over (plan, mm); the strip of DetailingRecord::strips
  // the bar is drawn in (−1: corner and free-edge bars, in the tables only).
  BarDirection direction = BarDirection::span;
  double across_from_mm = 0.0, across_to_mm = 0.0;
  int strip = 0;
  // A U-bar round a free edge: its legs lie flat in the two faces and its
  // body stands across the slab's depth (leg_start/end are its flat legs).
  bool edge_loop = false;
};
struct ScheduleRow {
  std::string mark;
  std::string bar;
  double diameter_mm = 0.0;
  int count = 0;
  double length_mm = 0.0;
  std::string shape;
  double mass_kg = 0.0;
  double leg_a_mm = 0.0, leg_b_mm = 0.0;  // the legs of a bent bar, the longer first (0: none)
  double bend_diameter_mm = 0.0;          // a mandrel wider than the standard (0: the standard)
};
// A bar whose bend at a support is too short to anchor it (the support's
// width leaves less than the code's length): its region (name, face, bar
// direction), its size and the support.
struct ShortBend {
  std::string where;
  Face face = Face::bottom;
  BarDirection direction = BarDirection::span;
  double diameter_mm = 0.0;
  std::string support;
  double demand_mm = 0.0;  // the anchorage the bend must give
};
// One line of bars drawn in elevation: a one-way strip, or on a two-way
// slab the bays of one row (bars in x) or column (bars in y).
struct DetailingStrip {
  std::string name;                          // "" for a one-way strip; "bays 1,1 to 2,1, bars in x"
  BarDirection direction = BarDirection::span;
  double across_from_mm = 0.0, across_to_mm = 0.0;  // plan, across the bars (two-way)
  std::vector<double> spans_mm;
  std::array<EndSupport, 2> ends{EndSupport::pinned, EndSupport::pinned};
  std::vector<DiagramPoint> envelope;        // the moment envelope the bars cover
};
// A length the code gave, for the record: which bar, what, the code's derivation.
struct DetailDerivation {
  std::string where;  // "span 1, bottom"
  std::string what;   // "anchorage", "lap", ...
  DetailLength length;
};
struct DetailingRecord {
  double slab_width_mm = 0.0;
  double stock_length_mm = 0.0;
  double strip_length_mm = 0.0;  // between the strip's ends
  std::vector<DetailedBar> bars;
  std::vector<ScheduleRow> schedule;
  double total_mass_kg = 0.0;
  double mass_per_area_kg_m2 = 0.0;      // over slab width × strip length (two-way: the plan's area)
  std::vector<DiagramPoint> envelope;    // the moment envelope the bars cover (a one-way strip)
  std::vector<DetailingStrip> strips;    // the lines of bars drawn (one for a one-way strip)
  bool plan = false;                     // a two-way slab: counts from the plan, not slab_width_m
  std::vector<DetailDerivation> derivations;
  std::vector<std::string> notes;        // for the result's warnings (where bars were not curtailed, ...)
  // The anchorage of each bent bar end (check id "anchorage", where the
  // support): demand the code's length for the bend, capacity what the
  // support's width leaves; the driver puts them among the support's checks.
  std::vector<Check> checks;
  // The bars of those failing checks, for the design to try smaller ones.
  std::vector<ShortBend> short_bends;
};

struct DesignRecord {
  CodeIdentity code;
  bool pass = false;
  double max_utilisation = 0.0;
  std::string governing_check;
  std::string governing_where;
  LoadTotals loads;
  // One nominal cover per face, indexed by Face (0: no bars on that face).
  std::array<double, 2> face_cover_mm{0.0, 0.0};
  double cover_mm(Face face) const { return face_cover_mm[static_cast<std::size_t>(face)]; }
  std::vector<RegionRecord> regions;
  std::vector<SupportRecord> supports;
  std::vector<SpanRecord> spans;
  DistributionRecord distribution;
  std::vector<std::string> warnings;
  ReportUnits report_units = ReportUnits::SI;  // of the summary, as requested
  // The units of the code's edition (its practice's report units,
  // PracticeDefaults::report_units): the kernel writes its own derivation
  // steps (detailing's bends and curtailment) in them, so that each
  // derivation of the record reads in the units of the code's steps beside
  // it, whatever report_units asks. The values held stay in mm, N·mm.
  ReportUnits step_units = ReportUnits::SI;
  double strip_width_mm = 1000.0;
  // The result states strip_width_mm: the code's practice strip is not
  // the contract's 1000 mm (a variant drawn in inches), so a reader of
  // its results must not take them per metre.
  bool state_strip_width = false;
  bool support_widths_given = false;  // slab.support_widths_mm: hogging at the faces
  double thickness_mm = 0.0;
  std::vector<double> spans_mm;
  std::vector<std::vector<DiagramPoint>> diagrams;  // M and V envelopes per span (Detail::steps)
  // Long-term curvature and deflection along each span whose deflection
  // the code calculates (Detail::steps), x from the strip's left end.
  struct DeflectionDiagram {
    std::string where;   // "span 2"
    double x0_mm = 0.0;  // the span's left support along the strip
    SpanDeflection span;
  };
  std::vector<DeflectionDiagram> deflection_diagrams;
  std::vector<Action> actions;                      // every action, self-weight first
  std::vector<Combination> combinations;            // every combination the code gave
  bool list_actions = false;                        // loads.actions given: the result lists both
  std::size_t load_cases = 0;                       // distinct ULS load cases enveloped
  std::size_t load_arrangements = 0;                // per combination
  std::array<EndSupport, 2> ends{EndSupport::pinned, EndSupport::pinned};
  double redistribution_percent = 0.0;
  Rationalise rationalise = Rationalise::none;  // as requested
  CrackWidthMethod crack_width = CrackWidthMethod::tables;  // serviceability.crack_width
  ProjectInfo project;
  // The code's defaults_used() (at Detail::steps only): the record lists those the request left out.
  std::vector<InputDefault> defaults_used;

  // A two-way slab's plate: grid, edges, bays, the ULS moment envelopes
  // and the line reactions (two_way.hpp); null for a strip.
  std::shared_ptr<const PlateRecord> plate;
  // A flat slab's columns (empty otherwise).
  std::vector<ColumnRecord> columns;

  // Every check of every region, support, span and column, in that order.
  std::vector<const Check*> all_checks() const;
  std::optional<DetailingRecord> detailing;  // when the request asks for it
};

// Parses and validates a JSON request (throws InputError listing every
// problem), opens its code through the registry and designs it. The chosen
// arrangements' checks carry their steps only at Detail::steps (the
// calculation record); Detail::verdict is treated as Detail::checks.
DesignRecord design(const Registry& registry, const nlohmann::json& request,
                    Detail detail = Detail::checks);
// The same for a request already parsed; the code's validation still runs.
DesignRecord design(const Registry& registry, const Request& request,
                    Detail detail = Detail::checks);

// The spacings the bar search tries (contract-v2 3): first_mm,
// first_mm + step_mm, … up to the code's largest; distribution bars alike.
struct SpacingGrid {
  double first_mm = 75.0;  // reinforcement.min_spacing_mm
  double step_mm = 25.0;   // reinforcement.spacing_step_mm
  double at(int k) const { return first_mm + step_mm * k; }
  // The k of the widest spacing within max_spacing_mm (−1: not even the first).
  int last_step(double max_spacing_mm) const;
};

// Bar search of contract.md, exposed for tests: the chosen arrangement.
struct SearchCandidate {
  BarOption bar;
  double spacing_mm = 0.0;
  double As_prov_mm2 = 0.0;
  bool strength_pass = true;  // false: no arrangement passes bending and minimum steel
};
// True when a is preferred to b on equal standing: least area, then the
// larger spacing, then the smaller bar.
bool preferred(const SearchCandidate& a, const SearchCandidate& b);
// Area per strip width of bars of one area at one spacing.
double provided_area_mm2(double bar_area_mm2, double spacing_mm, double width_mm);
// The bar search of contract.md for one region, as design() runs it: the
// chosen arrangement (a warning is added when none passes every check).
SearchCandidate search_bars(const SlabChecker& checker, const CodeIdentity& code,
                            const RegionDemand& region, double width_mm,
                            std::vector<std::string>& warnings, const SpacingGrid& grid = {});
// One arrangement for several regions (reinforcement.rationalise): the
// least area, by the tie rule of preferred(), that passes every check in
// every region. When none does, the rule of a failed region applies across
// them: among the arrangements passing bending and minimum steel in every
// region, the fewest failed checks summed over the regions, then the tie
// rule; when none passes those everywhere, the most steel (and a warning
// naming the regions).
SearchCandidate search_common_bars(const SlabChecker& checker, const CodeIdentity& code,
                                   const std::vector<const RegionDemand*>& regions, double width_mm,
                                   std::vector<std::string>& warnings, const SpacingGrid& grid = {});

}  // namespace armature
