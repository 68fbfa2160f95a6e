// Detailing of a one-way strip: each region's bars run over the part of
// the strip where the envelope needs them, past it by the code's shift and
// anchorage (or past a support line, or a given support's face, by the
// code's length there), ending in the code's standard bend where a given
// end support is too narrow for the straight length, lapped where longer
// than the stock; then marks, counts, schedule and mass.
#include "detailing.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <map>
#include <numbers>
#include <optional>
#include <string>
#include <tuple>
#include <utility>

#include "armature/format.hpp"
#include "armature/units.hpp"
#include "call_code.hpp"

namespace armature {

namespace {

constexpr double unit_mass_kg_per_m_mm2 = 0.00617;  // kg/m of a bar of d mm: 0.00617 d² (common practice)
constexpr double length_step_mm = 25.0;             // cut lengths rounded up to 25 mm (common practice)
constexpr double lapped_share_staggered = 0.5;      // alternate bars lapped at one section

struct Point {
  double x, sag, hog, shear;
};

// The units of the kernel's own derivation steps (bends, curtailment):
// those of the code's edition (DesignRecord::step_units), so that each
// derivation reads in one system beside the code's steps (in-lb: inches,
// in², kip-ft, positions along the strip in ft). Every conversion of those
// steps is here; the values the detailing holds stay in mm, mm², N·mm.
struct StepUnits {
  bool us = false;
  double length_v(double mm) const { return us ? mm / mm_per_in : mm; }
  std::string length(double mm) const { return plain_number(length_v(mm)); }
  const char* length_u() const { return us ? "in" : "mm"; }
  double area_v(double mm2) const { return us ? mm2 / (mm_per_in * mm_per_in) : mm2; }
  std::string area(double mm2) const { return plain_number(area_v(mm2)); }
  const char* area_u() const { return us ? "in2" : "mm2"; }
  double moment_v(double Nmm) const { return us ? Nmm * 1e-6 / kNm_per_kipft : Nmm * 1e-6; }
  std::string moment(double Nmm) const { return plain_number(moment_v(Nmm)); }
  const char* moment_u() const { return us ? "kip-ft" : "kNm"; }
  double along_v(double mm) const { return us ? mm * 1e-3 / m_per_ft : mm * 1e-3; }
  std::string along(double mm) const { return plain_number(along_v(mm)); }
  const char* along_u() const { return us ? "ft" : "m"; }
};

// x where f falls from above tol (at b) to tol or below (at a), linearly.
double crossing(double xa, double fa, double xb, double fb) {
  if (fb == fa) return xa;
  const double t = std::clamp(fa / (fa - fb), 0.0, 1.0);
  return xa + t * (xb - xa);
}

// The run of one region's bars before laps and marks.
struct Run {
  std::string where;
  Face face = Face::bottom;
  BarChoice bars;
  BarDetailDemand demand;
  double start = 0.0, end = 0.0;
  bool start_fixed = false, end_fixed = false;  // at a free tip or a bend: rounding extends the other end
  double anch_start = 0.0, anch_end = 0.0, shift = 0.0;
  double lbd = 0.0;  // the bars' straight anchorage (a bent end's anch_* may be less: measured along a bend)
  double leg_start = 0.0, leg_end = 0.0;  // bent ends: the leg to the outside of the bend
  double bend_start = 0.0, bend_end = 0.0;  // a bent end's mandrel where wider than the code's standard (0: none)
  std::string clause;
  bool distribution = false;
  bool curtailed = false;  // the alternate bars stopped inside the span
  double along_from = 0.0, along_to = 0.0;  // distribution bars: the part of the strip they are spread over
  int count = 0;
  int preset_count = 0;  // an alternate set's share of the bars (else counted from the spacing)
  int strip = 0;         // DetailingRecord::strips (−1: not drawn)
  BarDirection direction = BarDirection::span;
  double across_from = 0.0, across_to = 0.0;  // two-way: the band the bars are spread over (plan)
  std::vector<DetailLap> joins;                // laps with the next support's top bars (both runs carry it)
  int span = -1, support = -1;                 // the strip's span (bottom) or support (top) of the run
  bool edge_loop = false;                      // a U-bar round a free edge (legs flat in the faces)
  // The slab's ends less the cover, where the strip has them (a free end,
  // an end support with a width): rounding a cut length never passes them.
  double lo_limit = -std::numeric_limits<double>::infinity();
  double hi_limit = std::numeric_limits<double>::infinity();
  double body = 0.0;                           // its part across the slab's depth
};

// What the detailing of one line of bars reads: its spans and ends, the
// regions of its spans (bottom) and supports (top) by position, their
// names, and the width its bars are counted over.
struct StripLayout {
  DetailingStrip strip;
  bool free_ends_are_edges = false;  // a free end is a slab edge the bars stop at (a plate), not a cantilever
  bool join_top_bars = false;        // lap neighbouring supports' top bars that overlap (a plate's rows)
  bool join_bottom_bars = false;     // lap the spans' bottom bars over the interior supports (a flat slab's column strips)
  // Per span the band across the bars (plan; empty: strip.across for every
  // span); a support's bars span the union of its two spans' bands.
  std::vector<std::array<double, 2>> span_across;
  // Per support the code's least reach of its top bars past the support's
  // line on each side (0: none), and the clause.
  std::vector<double> top_reach_before, top_reach_after;
  std::string top_reach_clause;
  bool draw = true;             // drawn in elevation (a band's bars: in the tables only)
  bool legs_into_support = true;  // a top bar's leg at a built-in end turns down into the support (a wall)
  bool cover_all_hogging = true;  // carry the nearest top bars over hogging no support's bars reach
  std::vector<double> support_widths_mm;  // one per support, or none
  std::vector<std::string> span_names, support_names;
  std::vector<const RegionRecord*> bottom, top;  // per span, per support (null: none)
  const BarChoice* distribution = nullptr;
  double width_mm = 0.0;  // across the strip: its distribution bars' length (a one-way strip)
};

std::string face_name(Face f) { return f == Face::top ? "top" : "bottom"; }

// A run's straight anchorage: its own, or for a run without one the
// anchorage at one of its ends.
double straight_anchorage(const Run& r) {
  return r.lbd > 0.0 ? r.lbd : r.anch_start > 0.0 ? r.anch_start : r.anch_end;
}

int count_over(double extent_mm, double spacing_mm) {
  return static_cast<int>(std::floor(extent_mm / spacing_mm + 1e-9)) + 1;
}

// The shape of a bar by its bent ends.
std::string shape_of(double leg_start, double leg_end) {
  const int bends = (leg_start > 0.0 ? 1 : 0) + (leg_end > 0.0 ? 1 : 0);
  return bends == 0 ? "straight" : bends == 1 ? "L-bar" : "U-bar";
}

// The shear envelope of a span's points at x (linear between points).
double shear_at(const std::vector<DiagramPoint>& pts, double x) {
  auto V = [](const DiagramPoint& p) { return std::max(std::abs(p.V_max), std::abs(p.V_min)); };
  for (std::size_t k = 1; k < pts.size(); ++k)
    if (pts[k].x_mm >= x) {
      const double dx = pts[k].x_mm - pts[k - 1].x_mm;
      const double t = dx > 0.0 ? std::clamp((x - pts[k - 1].x_mm) / dx, 0.0, 1.0) : 1.0;
      return V(pts[k - 1]) + t * (V(pts[k]) - V(pts[k - 1]));
    }
  return pts.empty() ? 0.0 : V(pts.back());
}

// The plan position of a plate's outer edge ("edge x0", "edge y1") and
// whether it lies at x (bars across it run in x).
struct OuterEdge {
  bool x_edge = true;
  double position_mm = 0.0;
};
OuterEdge outer_edge(const PlateRecord& plate, const std::string& edge) {
  const bool x_edge = edge.find(" x") != std::string::npos;
  const bool high = edge.back() == '1';
  if (plate.flat) return {x_edge, plate.outline_mm[(x_edge ? 0 : 2) + (high ? 1 : 0)]};  // flush with the columns
  const auto& lines = x_edge ? plate.x_lines_mm : plate.y_lines_mm;
  return {x_edge, high ? lines.back() : lines.front()};
}

class Detailer {
 public:
  Detailer(const DetailingRules& code_rules, const CodeIdentity& code_id, const DetailingInput& in,
           double thickness_mm, std::array<double, 2> cover_mm, ReportUnits step_units, DetailingRecord& record)
      : rules(code_rules),
        code(code_id),
        in_(in),
        thickness_(thickness_mm),
        cover_(cover_mm),
        u_{step_units == ReportUnits::US},
        out(record) {}

  std::vector<Run> runs;

  double cover(Face face) const { return cover_[static_cast<std::size_t>(face)]; }
  // A length the code gave, kept for the record (none: no rule).
  double derive(const std::string& where, const std::string& what, const DetailLength& l) {
    if (l.length_mm != 0.0 || !l.clause.empty()) out.derivations.push_back({where, what, l});
    return l.length_mm;
  }
  template <class F>
  auto ask(const char* stage, const std::string& where, F&& fn) {
    return call_code(code, stage, std::forward<F>(fn), where);
  }
  BarDetailDemand demand_of(const RegionRecord& r) const {
    BarDetailDemand b;
    b.where = r.where;
    b.face = r.face;
    b.diameter_mm = r.bars.diameter_mm;
    b.spacing_mm = r.bars.spacing_mm;
    b.cover_mm = r.cover_mm;
    b.d_mm = r.d_mm;
    b.As_prov_mm2 = r.bars.As_prov_mm2;
    b.As_req_mm2 = r.As_req_mm2;
    b.bond = in_.bond;
    b.lapped_share = lapped_share_staggered;
    return b;
  }

  void add_strip(const StripLayout& L, const std::vector<std::vector<DiagramPoint>>& envelope);
  void add_corner_bars(const PlateRecord& plate, const std::vector<RegionRecord>& regions);
  void add_free_edge_bars(const PlateRecord& plate, const std::vector<RegionRecord>& regions);
  void add_fire_continuity(const PlateRecord& plate, const std::vector<RegionRecord>& regions, int minutes);
  // Laps, marks, the schedule and the total mass.
  void finish();

 private:
  const DetailingRules& rules;
  const CodeIdentity& code;
  const DetailingInput& in_;
  double thickness_;
  std::array<double, 2> cover_;
  StepUnits u_;  // of the kernel's own steps
  DetailingRecord& out;
};

void Detailer::add_strip(const StripLayout& L, const std::vector<std::vector<DiagramPoint>>& envelope) {
  const std::size_t first_run = runs.size();
  const int strip_index = L.draw ? static_cast<int>(out.strips.size()) : -1;
  DetailingStrip drawn = L.strip;
  drawn.envelope.clear();
  const std::vector<double>& spans = L.strip.spans_mm;
  const std::size_t n = spans.size();
  std::vector<double> X(n + 1, 0.0);
  for (std::size_t e = 0; e < n; ++e) X[e + 1] = X[e] + spans[e];
  const double total = X[n];
  const bool left_free = L.strip.ends[0] == EndSupport::free;
  const bool right_free = L.strip.ends[1] == EndSupport::free;
  // A cantilever: a span past a free end of a strip (on a plate a free end
  // is the edge of a bay that spans the other way: no cantilever).
  auto cantilever = [&](std::size_t e) {
    return !L.free_ends_are_edges && ((e == 0 && left_free) || (e + 1 == n && right_free));
  };
  // Support widths (one per support; none or 0: a knife edge, the bars
  // measured from its line and free to run past it). The slab ends flush
  // with an end support's outer face.
  auto width_at = [&](std::size_t j) {
    return L.support_widths_mm.size() == n + 1 ? L.support_widths_mm[j] : 0.0;
  };
  auto support_label = [&](std::size_t j) { return L.support_names[j]; };
  // Where bars stop at a free end: the slab's edge less the cover; on a
  // plate the edge lies half the end's width past its line (a flat slab's
  // edge flush with its columns' outer faces).
  auto free_stop = [&](int side, Face face) {
    const std::size_t node = side == 0 ? 0 : n;
    const double dir = side == 0 ? -1.0 : 1.0;
    return X[node] + dir * ((L.free_ends_are_edges ? width_at(node) / 2.0 : 0.0) - cover(face));
  };
  auto across_of_span = [&](std::size_t e) {
    return L.span_across.size() == n ? L.span_across[e]
                                     : std::array<double, 2>{L.strip.across_from_mm, L.strip.across_to_mm};
  };
  auto across_of_support = [&](std::size_t j) {
    if (L.span_across.size() != n) return std::array<double, 2>{L.strip.across_from_mm, L.strip.across_to_mm};
    const auto a = across_of_span(j == 0 ? 0 : j - 1), b = across_of_span(j == n ? n - 1 : j);
    return std::array<double, 2>{std::min(a[0], b[0]), std::max(a[1], b[1])};
  };

  // The envelope along the strip, span by span (a support appears twice).
  std::vector<Point> P;
  double peak = 0.0;
  for (const auto& span : envelope)
    for (const auto& p : span) {
      P.push_back({p.x_mm, p.M_max, -p.M_min, std::max(std::abs(p.V_max), std::abs(p.V_min))});
      drawn.envelope.push_back(p);
      peak = std::max({peak, std::abs(p.M_max), std::abs(p.M_min)});
    }
  const double tol = 1e-6 * peak;
  auto first_at = [&](double x) {
    for (std::size_t k = 0; k < P.size(); ++k)
      if (P[k].x >= x - 1e-6) return k;
    return P.size() - 1;
  };
  auto last_at = [&](double x) {
    for (std::size_t k = P.size(); k-- > 0;)
      if (P[k].x <= x + 1e-6) return k;
    return std::size_t{0};
  };

  // An end of a bar at end support j (dir outward) given a width t: the
  // bar runs straight to `want` where that lies within the slab's end less
  // the cover (t/2 − c past the centreline); else it stops there in the
  // code's standard bend, whose anchorage (`demand`, measured from
  // `origin`, to the outside of the bend) the bar then provides as far
  // as the support allows: an `anchorage` check of the support, and a
  // note where the leg (bottom bars up into the slab; top bars down, into
  // the support at a built-in end) does not fit the slab's depth.
  struct EndFit {
    double reach = 0.0, anchorage = 0.0, leg = 0.0;
    bool bent = false;
    double wide_bend = 0.0;  // a mandrel wider than the standard (0: the standard)
  };
  auto fit_end = [&](const std::string& label, const std::string& side, std::size_t j, double dir, Face face,
                     double want, double anchorage, double origin, bool from_face,
                     const BarDetailDemand& demand) -> EndFit {
    const double t = width_at(j);
    const double c = cover(face);
    const double outer = X[j] + dir * (t / 2.0 - c);
    if (t <= 0.0 || dir * (want - outer) <= 1e-6) return {want, anchorage, 0.0, false, 0.0};
    const std::string where = demand.where;
    const DetailLength hook =
        ask("detailing hooked anchorage", where, [&] { return rules.hooked_anchorage(demand); });
    derive(label, "hooked anchorage (" + side + ")", hook);
    const double provided = dir * (outer - origin);
    const double phi = demand.diameter_mm;
    const double leg_standard = hook.bend_diameter_mm / 2.0 + phi + hook.extension_mm;
    const bool leg_in_slab =
        !(face == Face::top && L.strip.ends[j == 0 ? 0 : 1] == EndSupport::fixed && L.legs_into_support);
    // Room for the leg: from the bar's own face of the layer it lies in (an
    // inner layer of a plate lies a bar deeper) to the opposite cover.
    const Face opposite = face == Face::top ? Face::bottom : Face::top;
    const double room = demand.d_mm > 0.0 ? demand.d_mm + phi / 2.0 - cover(opposite)
                                          : thickness_ - cover(Face::top) - cover(Face::bottom);
    DetailLength bend;
    bend.length_mm = provided;
    bend.clause = hook.clause;
    const std::string length_u = u_.length_u();
    bend.steps = {
        {"t", "breadth of " + support_label(j) + " (the slab ends flush with its outer face)", "", u_.length_v(t),
         length_u, ""},
        {"c", "cover at the slab's end (the " + face_name(face) + " face's nominal cover)", "", u_.length_v(c),
         length_u, ""},
        {"l,straight", "the straight length the code requires here, past " +
                           std::string(from_face ? "the support's face" : "the shifted zero point"),
         "", u_.length_v(dir * (want - origin)), length_u, ""},
        {"lb,prov", "from there to the slab's end less the cover: the outside of the bend",
         u_.length(dir * (X[j] - origin) + t / 2.0) + " − " + u_.length(c), u_.length_v(provided), length_u, ""},
        {"lb,req", "the bent bar's anchorage (above)", "", u_.length_v(hook.length_mm), length_u, hook.clause},
        {"D", "inside diameter of the bend (above)", "", u_.length_v(hook.bend_diameter_mm), length_u, hook.clause}};
    if (leg_in_slab)
      bend.steps.push_back({"h,legs", "room for the leg: from the bar's outer face (d + φ/2) to the opposite cover",
                            u_.length(demand.d_mm) + " + " + u_.length(phi) + "/2 − " + u_.length(cover(opposite)),
                            u_.length_v(room), length_u, ""});
    bool anchored = provided >= hook.length_mm - 1e-6;
    double capacity = provided, leg = leg_standard;
    bool lengthened = false;
    double wide_bend = 0.0;
    // A code measuring the anchorage along the bar's centreline (EN 1992-1-1
    // Figure 8.1 a): where the bend measured to its outside falls short, the
    // leg is lengthened until the length along the centreline (the straight
    // part to the bend, the bend's arc, the leg) is the anchorage, as far
    // as the slab's depth allows (a top bar's leg into a built-in end's
    // wall: as far as needed).
    if (!anchored && !hook.centreline_clause.empty()) {
      // The leg's straight part past a bend of inside diameter D.
      auto straight_leg = [&](double D) {
        const double l1 = provided - phi - D / 2.0;
        return hook.length_mm - l1 - std::numbers::pi / 2.0 * (D / 2.0 + phi / 2.0);
      };
      // A leg anchoring more than the extension past the bend needs the
      // code's larger mandrel against crushing inside it (EN 8.3(3)); a
      // bend wide enough that the extension alone makes up the anchorage
      // (the arc grows faster than the straight part shrinks) needs none,
      // so the smaller of the two.
      double D = hook.bend_diameter_mm;
      const bool bearing = straight_leg(D) > hook.extension_mm + 1e-6 && hook.long_leg_bend_diameter_mm > D;
      if (bearing) {
        const double k = std::numbers::pi / 4.0 - 0.5;  // d(l1 + arc)/dD
        const double D_ext = (hook.length_mm - provided + phi - std::numbers::pi / 4.0 * phi - hook.extension_mm) / k;
        D = D_ext >= D && D_ext <= hook.long_leg_bend_diameter_mm && provided - phi - D_ext / 2.0 >= 0.0
                ? D_ext
                : hook.long_leg_bend_diameter_mm;
      }
      const double R = D / 2.0 + phi / 2.0;
      const double l1 = provided - phi - D / 2.0;
      const double arc = std::numbers::pi / 2.0 * R;
      const double l2 = std::max(hook.extension_mm, straight_leg(D));
      const double l2_room = leg_in_slab ? room - R - phi / 2.0 : std::numeric_limits<double>::infinity();
      if (l1 >= 0.0 && l2 <= l2_room + 1e-6) {
        capacity = l1 + arc + l2;
        leg = D / 2.0 + phi + l2;
        anchored = capacity >= hook.length_mm - 1e-6;
        if (bearing) {
          wide_bend = D;
          bend.steps.push_back({"D", "a wider bend: the least of the mandrel against crushing inside the bend (above) "
                                     "and the one whose extension alone completes the anchorage",
                                "", u_.length_v(D), length_u, hook.clause});
          out.notes.push_back(label + ": at " + support_label(j) + " the bend's inside diameter is " +
                              plain_number(D) + " mm (" + plain_number(D / phi) +
                              " φ), more than the standard, for the concrete inside the bend (the code's mandrel "
                              "rule): state it on the bar schedule");
        }
        bend.steps.push_back({"R", "D/2 + φ/2: the bend's radius to the bar's centreline",
                              u_.length(D) + "/2 + " + u_.length(phi) + "/2", u_.length_v(R), length_u, ""});
        bend.steps.push_back({"l1", "lb,prov − φ − D/2: straight, to where the bend starts",
                              u_.length(provided) + " − " + u_.length(phi) + " − " + u_.length(D) + "/2",
                              u_.length_v(l1), length_u, ""});
        bend.steps.push_back({"l,arc", "π/2 × R", "π/2 × " + u_.length(R), u_.length_v(arc), length_u, ""});
        bend.steps.push_back({"l2", std::string("the leg's straight part: lb,req − l1 − l,arc, at least the extension") +
                                        (leg_in_slab ? ", within the slab's depth" : ", down into the support"),
                              "max(" + u_.length(hook.extension_mm) + ", " + u_.length(hook.length_mm) + " − " +
                                  u_.length(l1) + " − " + u_.length(arc) + ")",
                              u_.length_v(l2), length_u, ""});
        bend.steps.push_back({"lb,prov", "l1 + l,arc + l2, along the bar's centreline",
                              u_.length(l1) + " + " + u_.length(arc) + " + " + u_.length(l2), u_.length_v(capacity),
                              length_u, hook.centreline_clause});
        bend.steps.push_back({"leg", "D/2 + φ + l2, to the outside of the bend",
                              u_.length(D) + "/2 + " + u_.length(phi) + " + " + u_.length(l2), u_.length_v(leg),
                              length_u, ""});
        bend.length_mm = capacity;
        bend.clause += "; " + hook.centreline_clause;
        lengthened = true;
      }
    }
    if (!lengthened)
      bend.steps.push_back({"leg", "D/2 + φ + extension, to the outside of the bend",
                            u_.length(hook.bend_diameter_mm) + "/2 + " + u_.length(phi) + " + " +
                                u_.length(hook.extension_mm),
                            u_.length_v(leg), length_u, ""});
    bend.steps.push_back({"lb,req/lb,prov",
                          anchored ? "the bend anchors the bar" : "short: the bend does not anchor the bar",
                          u_.length(hook.length_mm) + " / " + u_.length(capacity),
                          capacity > 0.0 ? hook.length_mm / capacity : std::numeric_limits<double>::infinity(), "-",
                          ""});
    derive(label, "bend (" + side + ")", bend);
    // A check of the support, so that a bar the bend does not anchor fails
    // the design (a second reading found it passing with a warning).
    Check anchorage_check;
    anchorage_check.id = "anchorage";
    anchorage_check.where = support_label(j);
    anchorage_check.clause = bend.clause;
    anchorage_check.demand = hook.length_mm;
    anchorage_check.capacity = capacity;
    anchorage_check.unit = "mm";
    anchorage_check.utilisation = utilisation_of(hook.length_mm, capacity);
    anchorage_check.pass = anchored;
    anchorage_check.steps = bend.steps;
    // Which bar: a support may check its bottom and its top bars' bends.
    anchorage_check.steps.insert(anchorage_check.steps.begin(),
                                 Step{"φ", "the bar: " + label + ", " + side + " end", "", u_.length_v(phi),
                                      length_u, ""});
    out.checks.push_back(std::move(anchorage_check));
    if (!anchored) out.short_bends.push_back({demand.where, face, L.strip.direction, phi, support_label(j), hook.length_mm});
    if (leg_in_slab && leg > room + 1e-6)
      out.notes.push_back(label + ": at " + support_label(j) + " the bend's leg of " + plain_number(leg) +
                          " mm does not fit the slab's depth (" + plain_number(room) + " mm from the bar to the opposite cover)");
    return {outer, capacity, leg, true, wide_bend};
  };
  // 7.7.3.8.3-like limits of the code on the bottom bars where the moment
  // falls to zero: at a pinned end (its reaction, a bearing below the
  // slab, confines the bars' ends) and at a point of inflection inside
  // the span; a note where not met.
  auto zero_moment_limit = [&](const std::string& label, std::size_t e, const std::string& side,
                               const BarDetailDemand& demand, const ZeroMomentSite& site, double V_N,
                               const std::string& at) {
    BarDetailDemand d = demand;
    d.V_Ed_N = V_N;
    const DetailLimit lim =
        ask("detailing zero moment", demand.where, [&] { return rules.zero_moment_development(d, site); });
    if (!lim.applies) return;
    DetailLength limit;
    limit.length_mm = lim.limit_mm;
    limit.clause = lim.clause;
    limit.steps = lim.steps;
    derive(label, "bar size at zero moment (" + side + ")", limit);
    if (!lim.met)
      out.notes.push_back(L.span_names[e] + ": the bottom bars' development length " +
                          plain_number(lim.length_mm) + " mm exceeds the limit " + plain_number(lim.limit_mm) +
                          " mm at " + at + " (" + lim.clause + "): use smaller bars" +
                          (site.simple_support ? ", or end them in a standard hook past the support's centreline"
                                               : ""));
  };

  // Bottom bars of span e (bars and demand as given: all the region's
  // bars, or one of the two alternate sets): the sagging zone, shifted and
  // anchored; at an end support past its line by the code's length there,
  // at an interior support at least the code's embedment past its line.
  auto bottom_run = [&](std::size_t e, const BarChoice& bars, const BarDetailDemand& demand,
                        const std::string& label) {
    const std::string where = L.span_names[e];
    Run run;
    run.where = where;
    run.face = Face::bottom;
    run.bars = bars;
    run.demand = demand;
    run.across_from = across_of_span(e)[0];
    run.across_to = across_of_span(e)[1];
    run.span = static_cast<int>(e);
    const double al = derive(label, "shift", ask("detailing shift", where, [&] { return rules.shift(run.demand); }));
    const double lbd =
        derive(label, "anchorage", ask("detailing anchorage", where, [&] { return rules.anchorage(run.demand); }));
    run.shift = al;
    run.lbd = lbd;
    run.clause = out.derivations[out.derivations.size() - 2].length.clause + "; " + out.derivations.back().length.clause;
    const auto& pts = envelope[e];
    std::size_t i0 = pts.size(), i1 = pts.size();
    for (std::size_t k = 0; k < pts.size(); ++k)
      if (pts[k].M_max > tol) {
        if (i0 == pts.size()) i0 = k;
        i1 = k;
      }
    const bool sags = i0 < pts.size();
    const double zs = !sags ? X[e] : i0 == 0 ? pts[0].x_mm : crossing(pts[i0].x_mm, pts[i0].M_max, pts[i0 - 1].x_mm, pts[i0 - 1].M_max);
    const double ze = !sags ? X[e + 1]
                      : i1 + 1 == pts.size()
                          ? pts.back().x_mm
                          : crossing(pts[i1].x_mm, pts[i1].M_max, pts[i1 + 1].x_mm, pts[i1 + 1].M_max);
    for (int side = 0; side < 2; ++side) {
      const std::size_t node = side == 0 ? e : e + 1;
      const bool strip_end = node == 0 || node == n;
      const double zero = side == 0 ? zs : ze;
      const double dir = side == 0 ? -1.0 : 1.0;  // outward
      // Sagging up to the support's line; on a plate whose envelope starts
      // at the support's faces (a flat slab's columns), up to a face.
      const bool at_support_line =
          std::abs(zero - X[node]) < 1e-6 ||
          (L.free_ends_are_edges && sags && std::abs(zero - (side == 0 ? pts.front().x_mm : pts.back().x_mm)) < 1e-6 &&
           std::abs(zero - X[node]) <= width_at(node) / 2.0 + 1e-6);
      // How far out the bars must reach: past the shifted zero point by the anchorage.
      const double reach_env = sags && !at_support_line ? zero + dir * (al + lbd) : X[node];
      double reach = reach_env;
      double anch = lbd;
      const std::string side_word = side == 0 ? "start" : "end";
      if (strip_end && L.free_ends_are_edges && L.strip.ends[side == 0 ? 0 : 1] == EndSupport::free) {
        // A plate's free edge: the bars stop at the edge less the cover,
        // inside the edge's U-bars.
        reach = free_stop(side, Face::bottom);
        anch = 0.0;
        (side == 0 ? run.start_fixed : run.end_fixed) = true;
      } else if (strip_end) {
        BarDetailDemand d = run.demand;
        d.V_Ed_N = std::max(std::abs(pts[side == 0 ? 0 : pts.size() - 1].V_max),
                            std::abs(pts[side == 0 ? 0 : pts.size() - 1].V_min));
        const double ea = derive(label, "end support anchorage (" + side_word + ")",
                                 ask("detailing end support", where, [&] { return rules.end_support_anchorage(d); }));
        const double face = X[node] - dir * width_at(node) / 2.0;  // the line where no width is given
        const double past = face + dir * ea;
        const bool by_support = at_support_line || !sags || dir * (past - reach_env) >= 0.0;
        if (at_support_line || !sags) {
          reach = face;  // anchored from the face (EN 9.2.1.4(3): the line of contact); the line without a width
          anch = ea;
          run.clause += "; " + out.derivations.back().length.clause;
        }
        reach = dir < 0 ? std::min(reach, past) : std::max(reach, past);
        // Bottom bars the code asks continuous through the columns (a flat
        // slab's column strip, ACI 318-19 8.7.4.2.2): at an end column
        // developed past its inner face by their full anchorage.
        const bool integrity = L.join_bottom_bars && width_at(node) > 0.0;
        if (integrity && dir * (face + dir * lbd - reach) > 0.0) {
          reach = face + dir * lbd;
          anch = lbd;
        }
        // A given width: the bar ends within the slab, bent where the straight length does not fit.
        const bool from_face = by_support || integrity;
        BarDetailDemand hd = by_support && !integrity ? d : run.demand;
        hd.at_end_support = by_support && !integrity;
        const EndFit fit = fit_end(label, side_word, node, dir, Face::bottom, reach, anch,
                                   from_face ? face : zero + dir * al, from_face, hd);
        if (fit.bent) {
          reach = fit.reach;
          anch = fit.anchorage;
          (side == 0 ? run.leg_start : run.leg_end) = fit.leg;
          (side == 0 ? run.bend_start : run.bend_end) = fit.wide_bend;
          (side == 0 ? run.start_fixed : run.end_fixed) = true;
          if (run.clause.find(out.derivations.back().length.clause) == std::string::npos)
            run.clause += "; " + out.derivations.back().length.clause;
        }
        if (L.strip.ends[side == 0 ? 0 : 1] == EndSupport::pinned && sags && at_support_line)
          zero_moment_limit(label, e, side_word, run.demand,
                            ZeroMomentSite{true, true, fit.bent, dir * (reach - X[node])}, d.V_Ed_N,
                            support_label(node));
        else if (sags && !at_support_line)
          zero_moment_limit(label, e, side_word, run.demand, ZeroMomentSite{false, false, false, dir * (reach - zero)},
                            shear_at(pts, zero), "the point of inflection at " + plain_number(zero / 1000.0) + " m");
      } else {
        const double emb = derive(label, "interior support embedment",
                                  ask("detailing embedment", where, [&] { return rules.interior_support_embedment(run.demand); }));
        if (run.clause.find(out.derivations.back().length.clause) == std::string::npos)
          run.clause += "; " + out.derivations.back().length.clause;
        const double past = X[node] + dir * emb;
        reach = dir < 0 ? std::min(reach, past) : std::max(reach, past);
        if (sags && !at_support_line)
          zero_moment_limit(label, e, side_word, run.demand, ZeroMomentSite{false, false, false, dir * (reach - zero)},
                            shear_at(pts, zero), "the point of inflection at " + plain_number(zero / 1000.0) + " m");
      }
      if (side == 0) {
        run.start = reach;
        run.anch_start = anch;
      } else {
        run.end = reach;
        run.anch_end = anch;
      }
    }
    return run;
  };
  // detailing.curtail "alternate": every other bar (the curtailed set)
  // stops where the rest (the continuing set, at twice the spacing) carry
  // the sagging envelope, past that point by the shift and its anchorage;
  // the continuing set runs as all the bars would. As,req(M) ≤ M
  // As,req(M_Ed)/M_Ed below the region's moment (the lever arm grows as
  // the moment falls), so the continuing set suffices wherever M ≤ M_A =
  // M_Ed As,prov/(2 As,req). None (every bar runs through, with a note)
  // where the continuing set alone would be below the region's minimum
  // steel or beyond its spacing limit, or carries the whole envelope.
  auto alternate_sets = [&](std::size_t e, const RegionRecord& r) -> std::optional<std::pair<Run, Run>> {
    const std::string where = L.span_names[e];
    const double As_half = r.bars.As_prov_mm2 / 2.0, s2 = 2.0 * r.bars.spacing_mm;
    double s_max = std::numeric_limits<double>::infinity();
    for (const auto& c : r.checks)  // the upper limits (demand: the spacing itself; not the least clear gap)
      if (c.id.str() == "spacing" && std::abs(c.demand - r.bars.spacing_mm) < 1e-6) s_max = std::min(s_max, c.capacity);
    std::string why;
    if (As_half < r.As_min_mm2)
      why = "half the bars, " + plain_number(As_half) + " mm²/m, would be below the minimum steel " +
            plain_number(r.As_min_mm2) + " mm²/m";
    else if (s2 > s_max)
      why = "the continuing bars at " + plain_number(s2) + " mm would exceed the spacing limit " +
            plain_number(s_max) + " mm";
    else if (!(r.As_req_mm2 > As_half) || !(r.M_Ed > 0.0))
      why = "half the bars carry the whole sagging envelope in bending; the others serve the other checks";
    const auto& pts = envelope[e];
    const double M_A = r.As_req_mm2 > 0.0 ? r.M_Ed * As_half / r.As_req_mm2 : 0.0;
    std::size_t i0 = pts.size(), i1 = pts.size();
    for (std::size_t k = 0; k < pts.size() && why.empty(); ++k)
      if (pts[k].M_max > M_A) {
        if (i0 == pts.size()) i0 = k;
        i1 = k;
      }
    if (why.empty() && i0 == pts.size()) why = "the envelope nowhere exceeds what half the bars carry";
    if (!why.empty()) {
      out.notes.push_back(where + ": every bottom bar runs through (detailing.curtail \"alternate\"): " + why);
      return std::nullopt;
    }
    BarChoice half = r.bars;
    half.spacing_mm = s2;
    half.As_prov_mm2 = As_half;
    BarDetailDemand dem = demand_of(r);
    dem.spacing_mm = s2;
    dem.As_prov_mm2 = As_half;
    Run a = bottom_run(e, half, dem, where + ", bottom (continuing bars)");
    Run b;
    b.where = where;
    b.face = Face::bottom;
    b.across_from = a.across_from;
    b.across_to = a.across_to;
    b.bars = half;
    b.demand = dem;
    b.curtailed = true;
    const std::string label = where + ", bottom (curtailed bars)";
    const double al = derive(label, "shift", ask("detailing shift", where, [&] { return rules.shift(dem); }));
    const std::string shift_clause = out.derivations.back().length.clause;
    const double lbd = derive(label, "anchorage", ask("detailing anchorage", where, [&] { return rules.anchorage(dem); }));
    b.shift = al;
    b.clause = shift_clause + "; " + out.derivations.back().length.clause;
    const double z0 = i0 == 0 ? pts[0].x_mm : crossing(pts[i0].x_mm, pts[i0].M_max - M_A, pts[i0 - 1].x_mm,
                                                        pts[i0 - 1].M_max - M_A);
    const double z1 = i1 + 1 == pts.size() ? pts.back().x_mm
                                           : crossing(pts[i1].x_mm, pts[i1].M_max - M_A, pts[i1 + 1].x_mm,
                                                      pts[i1 + 1].M_max - M_A);
    b.start = std::max(z0 - al - lbd, a.start);
    b.end = std::min(z1 + al + lbd, a.end);
    b.anch_start = b.start > a.start ? lbd : a.anch_start;
    b.anch_end = b.end < a.end ? lbd : a.anch_end;
    // The split of the count: the continuing set takes the odd bars.
    const auto band = across_of_span(e);
    const int all = count_over(band[1] - band[0], r.bars.spacing_mm);
    a.preset_count = (all + 1) / 2;
    b.preset_count = all / 2;
    DetailLength stop;
    stop.length_mm = z1 - z0;
    stop.clause = shift_clause;
    stop.steps = {
        {"As,A", "As,prov / 2 (the continuing bars, at twice the spacing)", u_.area(r.bars.As_prov_mm2) + " / 2",
         u_.area_v(As_half), u_.area_u(), ""},
        {"M_A", "M_Ed As,A / As,req (As,req(M) ≤ M As,req(M_Ed)/M_Ed below M_Ed)",
         u_.moment(r.M_Ed) + " × " + u_.area(As_half) + " / " + u_.area(r.As_req_mm2), u_.moment_v(M_A),
         u_.moment_u(), ""},
        {"x0", "the sagging envelope rises past M_A", "", u_.along_v(z0), u_.along_u(), ""},
        {"x1", "the sagging envelope falls back to M_A", "", u_.along_v(z1), u_.along_u(), ""},
        {"l", "x1 − x0: where the curtailed bars are needed, before the shift and anchorage",
         u_.along(z1) + " − " + u_.along(z0), u_.along_v(z1 - z0), u_.along_u(), ""}};
    out.derivations.push_back({label, "curtailment", stop});
    return std::make_pair(std::move(a), std::move(b));
  };
  for (std::size_t e = 0; e < n; ++e) {
    if (cantilever(e)) continue;
    const std::string where = L.span_names[e];
    const RegionRecord* r = L.bottom[e];
    if (!r || r->bars.spacing_mm <= 0.0) continue;
    if (in_.curtail == Curtailment::alternate && L.join_bottom_bars) {
      out.notes.push_back(where + ": every bottom bar runs through (detailing.curtail \"alternate\"): the code asks "
                          "the column strip's bottom bars continuous over the columns");
    } else if (in_.curtail == Curtailment::alternate) {
      if (auto sets = alternate_sets(e, *r)) {
        runs.push_back(std::move(sets->first));
        runs.push_back(std::move(sets->second));
        continue;
      }
    }
    runs.push_back(bottom_run(e, r->bars, demand_of(*r), where + ", bottom"));
  }

  // Top bars over each support: the hogging zone on both sides, shifted and
  // anchored; to a free tip less the cover; into an end support past its
  // line by the anchorage.
  for (std::size_t j = 0; j <= n; ++j) {
    const std::string where = L.support_names[j];
    const RegionRecord* r = L.top[j];
    if (!r || r->bars.spacing_mm <= 0.0) continue;
    Run run;
    run.where = where;
    run.support = static_cast<int>(j);
    run.across_from = across_of_support(j)[0];
    run.across_to = across_of_support(j)[1];
    run.face = Face::top;
    run.bars = r->bars;
    run.demand = demand_of(*r);
    const std::string label = where + ", top";
    const double al = derive(label, "shift", ask("detailing shift", where, [&] { return rules.shift(run.demand); }));
    const double lbd =
        derive(label, "anchorage", ask("detailing anchorage", where, [&] { return rules.anchorage(run.demand); }));
    run.shift = al;
    run.lbd = lbd;
    run.clause = out.derivations[out.derivations.size() - 2].length.clause + "; " + out.derivations.back().length.clause;
    const std::size_t kL = first_at(X[j]), kR = last_at(X[j]);
    // Top bars at an end support bend down (into the support at a built-in end).
    // Leftwards.
    {
      std::size_t k = kL;
      bool hog = P[k].hog > tol;
      double zl = X[j];
      bool reached_end = false;
      if (hog) {
        while (k > 0 && P[k - 1].hog > tol) --k;
        if (k == 0) reached_end = true, zl = P[0].x;
        else zl = crossing(P[k].x, P[k].hog, P[k - 1].x, P[k - 1].hog);
      }
      if (reached_end || (j == 0 && !hog)) {
        if (left_free) {
          run.start = free_stop(0, Face::top), run.anch_start = 0.0, run.start_fixed = true;
        } else {
          const double face = width_at(0) / 2.0;  // the line where no width is given
          const EndFit fit = fit_end(label, "start", 0, -1.0, Face::top, face - lbd, lbd, face, true, run.demand);
          run.start = fit.reach, run.anch_start = fit.anchorage;
          if (fit.bent) run.leg_start = fit.leg, run.start_fixed = true, run.bend_start = fit.wide_bend;
        }
      } else {
        run.start = (hog ? zl : X[j]) - al - lbd;
        run.anch_start = lbd;
        // The code's least extent at an end taken as simple: no hogging at
        // it, or a pinned end (on a plate the twist gives it some).
        if (j == n && n > 0 && (!hog || L.strip.ends[1] == EndSupport::pinned)) {
          const double ext = derive(label, "extent into the span",
                                    ask("detailing end top bars", where,
                                        [&] { return rules.end_top_bar_extent(run.demand, spans[n - 1]); }));
          run.start = std::min(run.start, X[j] - width_at(j) / 2.0 - ext);
        }
      }
    }
    // Rightwards.
    {
      std::size_t k = kR;
      bool hog = P[k].hog > tol;
      double zr = X[j];
      bool reached_end = false;
      if (hog) {
        while (k + 1 < P.size() && P[k + 1].hog > tol) ++k;
        if (k + 1 == P.size()) reached_end = true, zr = P.back().x;
        else zr = crossing(P[k].x, P[k].hog, P[k + 1].x, P[k + 1].hog);
      }
      if (reached_end || (j == n && !hog)) {
        if (right_free) {
          run.end = free_stop(1, Face::top), run.anch_end = 0.0, run.end_fixed = true;
        } else {
          const double face = total - width_at(n) / 2.0;  // the line where no width is given
          const EndFit fit = fit_end(label, "end", n, 1.0, Face::top, face + lbd, lbd, face, true, run.demand);
          run.end = fit.reach, run.anch_end = fit.anchorage;
          if (fit.bent) run.leg_end = fit.leg, run.end_fixed = true, run.bend_end = fit.wide_bend;
        }
      } else {
        run.end = (hog ? zr : X[j]) + al + lbd;
        run.anch_end = lbd;
        if (j == 0 && n > 0 && (!hog || L.strip.ends[0] == EndSupport::pinned)) {  // likewise
          const double ext = derive(label, "extent into the span",
                                    ask("detailing end top bars", where,
                                        [&] { return rules.end_top_bar_extent(run.demand, spans[0]); }));
          run.end = std::max(run.end, X[j] + width_at(j) / 2.0 + ext);
        }
      }
    }
    // A bar cannot pass a free end: it stops at the tip less the cover.
    if (left_free && run.start < free_stop(0, Face::top))
      run.start = free_stop(0, Face::top), run.anch_start = 0.0, run.start_fixed = true;
    if (right_free && run.end > free_stop(1, Face::top))
      run.end = free_stop(1, Face::top), run.anch_end = 0.0, run.end_fixed = true;
    // Nor the slab's end at a support with a width (the end ends flush
    // with its outer face): a top bar whose anchorage past its zero point
    // would run out of the slab there ends in the code's bend, and its
    // anchorage is checked there.
    // Where the shifted zero point itself lies past the support's face,
    // the bar is anchored from the face, as one reaching the support.
    if (!left_free && !run.start_fixed && width_at(0) > 0.0 && run.start < X[0] - (width_at(0) / 2.0 - cover(Face::top))) {
      const double face = X[0] + width_at(0) / 2.0;
      const double origin = std::max(run.start + run.anch_start, face);
      const EndFit fit = fit_end(label, "start", 0, -1.0, Face::top, origin - run.anch_start, run.anch_start, origin,
                                 origin >= face - 1e-6, run.demand);
      run.start = fit.reach, run.anch_start = fit.anchorage;
      if (fit.bent) run.leg_start = fit.leg, run.start_fixed = true, run.bend_start = fit.wide_bend;
    }
    if (!right_free && !run.end_fixed && width_at(n) > 0.0 && run.end > total + (width_at(n) / 2.0 - cover(Face::top))) {
      const double face = total - width_at(n) / 2.0;
      const double origin = std::min(run.end - run.anch_end, face);
      const EndFit fit = fit_end(label, "end", n, 1.0, Face::top, origin + run.anch_end, run.anch_end, origin,
                                 origin <= face + 1e-6, run.demand);
      run.end = fit.reach, run.anch_end = fit.anchorage;
      if (fit.bent) run.leg_end = fit.leg, run.end_fixed = true, run.bend_end = fit.wide_bend;
    }
    runs.push_back(std::move(run));
  }

  // The code's least reach of top bars past a support's line (a flat
  // slab's: ACI 318-19 Figure 8.7.4.1.3), where the envelope asks less;
  // never past a free end.
  for (std::size_t i = first_run; i < runs.size(); ++i) {
    Run& r = runs[i];
    if (r.face != Face::top || r.support < 0) continue;
    const std::size_t j = static_cast<std::size_t>(r.support);
    const double before = j < L.top_reach_before.size() ? L.top_reach_before[j] : 0.0;
    const double after = j < L.top_reach_after.size() ? L.top_reach_after[j] : 0.0;
    const double lbd = straight_anchorage(r);
    if (before > 0.0 && X[j] - before < r.start && !r.start_fixed) {
      r.start = left_free ? std::max(X[j] - before, free_stop(0, Face::top)) : X[j] - before;
      r.anch_start = lbd;
      if (r.clause.find(L.top_reach_clause) == std::string::npos) r.clause += "; " + L.top_reach_clause;
    }
    if (after > 0.0 && X[j] + after > r.end && !r.end_fixed) {
      r.end = right_free ? std::min(X[j] + after, free_stop(1, Face::top)) : X[j] + after;
      r.anch_end = lbd;
      if (r.clause.find(L.top_reach_clause) == std::string::npos) r.clause += "; " + L.top_reach_clause;
    }
  }

  // Hogging the top bars do not reach (on a plate a hogging zone need not
  // touch a support line: a bay's twist, a corner zone across the whole
  // row): the nearest top run of the strip is carried over it, past it by
  // its shift and anchorage; with no top run in the strip, a note.
  if (L.cover_all_hogging) {
    std::size_t k = 0;
    while (k < P.size()) {
      if (!(P[k].hog > tol)) {
        ++k;
        continue;
      }
      std::size_t m = k;
      while (m + 1 < P.size() && P[m + 1].hog > tol) ++m;
      const double z0 = k == 0 ? P[0].x : crossing(P[k].x, P[k].hog, P[k - 1].x, P[k - 1].hog);
      const double z1 = m + 1 == P.size() ? P.back().x : crossing(P[m].x, P[m].hog, P[m + 1].x, P[m + 1].hog);
      // Where the zone reaches a strip end, that end's rule holds: to the
      // free tip or edge less the cover, or past the support's face (its
      // line without a width) by the anchorage; a bar ended there in a
      // bend or at a free end covers it.
      const bool at_start = z0 <= P.front().x + 1e-6, at_end = z1 >= P.back().x - 1e-6;
      k = m + 1;
      auto need_start = [&](const Run& r, double lbd) {
        return at_start ? (left_free ? free_stop(0, Face::top) : X[0] + width_at(0) / 2.0 - lbd) : z0 - r.shift - lbd;
      };
      auto need_end = [&](const Run& r, double lbd) {
        return at_end ? (right_free ? free_stop(1, Face::top) : total - width_at(n) / 2.0 + lbd) : z1 + r.shift + lbd;
      };
      Run* nearest = nullptr;
      double gap = std::numeric_limits<double>::infinity(), peak_hog = 0.0;
      for (std::size_t i = first_run; i < runs.size(); ++i) {
        Run& r = runs[i];
        if (r.face != Face::top || r.distribution) continue;
        const double lbd = straight_anchorage(r);
        const bool start_ok = r.start <= need_start(r, lbd) + 1e-6 || (at_start && r.start_fixed);
        const bool end_ok = r.end >= need_end(r, lbd) - 1e-6 || (at_end && r.end_fixed);
        if (start_ok && end_ok) {
          nearest = nullptr, gap = -1.0;  // covered
          break;
        }
        const double g = std::max({0.0, r.start - z0, z1 - r.end});
        if (g < gap) gap = g, nearest = &r;
      }
      if (gap < 0.0) continue;
      for (std::size_t q = 0; q < P.size(); ++q)
        if (P[q].x >= z0 - 1e-6 && P[q].x <= z1 + 1e-6) peak_hog = std::max(peak_hog, P[q].hog);
      if (!nearest) {
        out.notes.push_back((L.strip.name.empty() ? std::string("the strip") : L.strip.name) + ": hogging of up to " +
                            plain_number(peak_hog * 1e-6) + " kNm/m between " + plain_number(z0 / 1000.0) + " and " +
                            plain_number(z1 / 1000.0) + " m has no top bars in this direction: provide them");
        continue;
      }
      const double lbd = straight_anchorage(*nearest);
      const double s0 = need_start(*nearest, lbd), s1 = need_end(*nearest, lbd);
      if (s0 < nearest->start && !nearest->start_fixed) {
        nearest->start = left_free ? std::max(s0, free_stop(0, Face::top)) : s0;
        nearest->anch_start = at_start && left_free ? 0.0 : lbd;
        if (at_start && left_free) nearest->start_fixed = true;
      }
      if (s1 > nearest->end && !nearest->end_fixed) {
        nearest->end = right_free ? std::min(s1, free_stop(1, Face::top)) : s1;
        nearest->anch_end = at_end && right_free ? 0.0 : lbd;
        if (at_end && right_free) nearest->end_fixed = true;
      }
      out.notes.push_back((L.strip.name.empty() ? std::string("the strip") : L.strip.name) + ": the top bars of " +
                          nearest->where + " carried over hogging of up to " + plain_number(peak_hog * 1e-6) +
                          " kNm/m between " + plain_number(z0 / 1000.0) + " and " + plain_number(z1 / 1000.0) +
                          " m that reaches no support line");
    }
  }

  // Top bars of neighbouring supports that overlap by more than a lap:
  // lapped where the hogging between the two lines is least (all the bars
  // at that section), instead of two layers over the overlap.
  if (L.join_top_bars) {
    std::vector<std::size_t> tops;
    for (std::size_t i = first_run; i < runs.size(); ++i)
      if (runs[i].face == Face::top && !runs[i].distribution) tops.push_back(i);
    for (std::size_t t = 0; t + 1 < tops.size(); ++t) {
      Run& a = runs[tops[t]];
      Run& b = runs[tops[t + 1]];
      BarDetailDemand da = a.demand, db = b.demand;
      da.lapped_share = db.lapped_share = 1.0;
      const double lap_a = ask("detailing lap", a.where, [&] { return rules.lap(da); }).length_mm;
      const double lap_b = ask("detailing lap", b.where, [&] { return rules.lap(db); }).length_mm;
      const bool a_governs = lap_a >= lap_b;
      const double lap = std::max(lap_a, lap_b);
      if (!(a.end - b.start > lap + 1e-6)) continue;
      if (a.end_fixed || b.start_fixed) continue;  // an end held at a free edge or bent (its bend checked): kept
      // Where between the two supports the hogging is least (their lines).
      const std::size_t ja = static_cast<std::size_t>(
          std::find(L.support_names.begin(), L.support_names.end(), a.where) - L.support_names.begin());
      const std::size_t jb = static_cast<std::size_t>(
          std::find(L.support_names.begin(), L.support_names.end(), b.where) - L.support_names.begin());
      if (ja > n || jb > n) continue;
      double m = (X[ja] + X[jb]) / 2.0, least = std::numeric_limits<double>::infinity();
      for (const Point& q : P)
        if (q.x > X[ja] + lap / 2.0 && q.x < X[jb] - lap / 2.0 && q.hog < least) least = q.hog, m = q.x;
      if (!(m - lap / 2.0 >= b.start - 1e-6 && m + lap / 2.0 <= a.end + 1e-6)) continue;  // the lap must lie in both
      derive(a.where + ", top, and " + b.where + ", top", "lap (all bars at one section)",
             ask("detailing lap", a_governs ? a.where : b.where, [&] { return rules.lap(a_governs ? da : db); }));
      a.end = m + lap / 2.0;
      a.anch_end = 0.0;
      b.start = m - lap / 2.0;
      b.anch_start = 0.0;
      a.joins.push_back({m - lap / 2.0, m + lap / 2.0});
      b.joins.push_back({m - lap / 2.0, m + lap / 2.0});
    }
  }

  // The bottom bars of neighbouring spans lapped over each interior
  // support (every bar, centred on the line), where the code asks them
  // continuous there (a flat slab's column strips: ACI 318-19 8.7.4.2.1,
  // EN 1992-1-1 9.4.1(3)).
  if (L.join_bottom_bars) {
    for (std::size_t j = 1; j < n; ++j) {
      Run* a = nullptr;
      Run* b = nullptr;
      for (std::size_t i = first_run; i < runs.size(); ++i) {
        Run& r = runs[i];
        if (r.face != Face::bottom || r.distribution || r.curtailed) continue;
        if (r.span == static_cast<int>(j) - 1) a = &r;
        if (r.span == static_cast<int>(j)) b = &r;
      }
      if (!a || !b) continue;
      BarDetailDemand da = a->demand, db = b->demand;
      da.lapped_share = db.lapped_share = 1.0;
      const double lap_a = ask("detailing lap", a->where, [&] { return rules.lap(da); }).length_mm;
      const double lap_b = ask("detailing lap", b->where, [&] { return rules.lap(db); }).length_mm;
      const bool a_governs = lap_a >= lap_b;
      const double lap = derive(a->where + ", bottom, and " + b->where + ", bottom, over " + L.support_names[j],
                                "lap (all bars at one section)",
                                ask("detailing lap", a_governs ? a->where : b->where,
                                    [&] { return rules.lap(a_governs ? da : db); }));
      a->end = std::max(a->end, X[j] + lap / 2.0);
      b->start = std::min(b->start, X[j] - lap / 2.0);
      a->anch_end = 0.0;
      b->anch_start = 0.0;
      a->joins.push_back({X[j] - lap / 2.0, X[j] + lap / 2.0});
      b->joins.push_back({X[j] - lap / 2.0, X[j] + lap / 2.0});
    }
  }

  // Counts across each run's band.
  for (std::size_t i = first_run; i < runs.size(); ++i)
    runs[i].count = runs[i].preset_count > 0
                        ? runs[i].preset_count
                        : count_over(runs[i].across_to - runs[i].across_from, runs[i].bars.spacing_mm);

  // Distribution bars: across the strip, under or over the main bars,
  // spread over the bottom bars' extent and each top bar's.
  if (L.distribution && L.distribution->spacing_mm > 0.0) {
    const BarChoice& db = *L.distribution;
    auto add_distribution = [&](Face face, double from, double to, const std::string& where) {
      Run run;
      run.where = where;
      run.face = face;
      run.bars = db;
      run.distribution = true;
      const double c = cover(face);
      run.start = c;  // across the strip, cover to cover
      run.end = L.width_mm - c;
      run.along_from = std::max(from, 0.0);
      run.along_to = std::min(to, total);
      run.count = count_over(std::max(0.0, run.along_to - run.along_from), db.spacing_mm);
      run.demand.where = where;
      run.demand.face = face;
      run.demand.diameter_mm = db.diameter_mm;
      run.demand.spacing_mm = db.spacing_mm;
      run.demand.cover_mm = c;
      run.demand.bond = in_.bond;
      run.demand.lapped_share = lapped_share_staggered;
      runs.push_back(std::move(run));
    };
    double lo = total, hi = 0.0;
    for (std::size_t i = first_run; i < runs.size(); ++i)
      if (runs[i].face == Face::bottom && !runs[i].distribution)
        lo = std::min(lo, runs[i].start), hi = std::max(hi, runs[i].end);
    const std::size_t main_count = runs.size();
    if (lo < hi) add_distribution(Face::bottom, lo, hi, "distribution, bottom");
    for (std::size_t i = first_run; i < main_count; ++i)
      if (runs[i].face == Face::top)
        add_distribution(Face::top, runs[i].start, runs[i].end, "distribution, top (" + runs[i].where + ")");
  }
  // The strip's runs: where they are drawn, their direction and the band
  // across them (plan).
  for (std::size_t i = first_run; i < runs.size(); ++i) {
    runs[i].strip = strip_index;
    runs[i].direction = L.strip.direction;
    if (!runs[i].distribution) {
      const Face f = runs[i].face;
      if (left_free) runs[i].lo_limit = free_stop(0, f);
      else if (width_at(0) > 0.0) runs[i].lo_limit = X[0] - (width_at(0) / 2.0 - cover(f));
      if (right_free) runs[i].hi_limit = free_stop(1, f);
      else if (width_at(n) > 0.0) runs[i].hi_limit = total + (width_at(n) / 2.0 - cover(f));
    }
    if (runs[i].distribution) {
      runs[i].across_from = L.strip.across_from_mm;
      runs[i].across_to = L.strip.across_to_mm;
    }
  }
  if (L.draw) out.strips.push_back(std::move(drawn));
}

void Detailer::finish() {
  // Laps where a run is longer than the stock: alternate bars lapped at
  // staggered positions (set A: laps at k L/n; set B halfway between).
  InputProblems problems;
  std::vector<DetailedBar> bars;
  for (auto& run : runs) {
    const double length = run.end - run.start;
    const double legs = run.leg_start + run.leg_end;
    DetailedBar base;
    base.where = run.where;
    base.face = run.face;
    base.distribution = run.distribution;
    base.curtailed = run.curtailed;
    base.bar = run.bars.bar;
    base.diameter_mm = run.bars.diameter_mm;
    base.spacing_mm = run.bars.spacing_mm;
    base.shift_mm = run.shift;
    base.anchorage_start_mm = run.anch_start;
    base.anchorage_end_mm = run.anch_end;
    base.clause = run.clause;
    base.along_from_mm = run.along_from;
    base.along_to_mm = run.along_to;
    base.strip = run.strip;
    base.direction = run.direction;
    base.across_from_mm = run.across_from;
    base.across_to_mm = run.across_to;
    if (run.edge_loop) {  // a U round a free edge: its two flat legs and its body across the depth, no laps
      DetailedBar b = base;
      b.edge_loop = true;
      b.count = run.count;
      b.start_mm = run.start;
      b.end_mm = run.end;
      b.leg_start_mm = run.leg_start;
      b.leg_end_mm = run.leg_end;
      b.length_mm = std::ceil((run.leg_start + run.leg_end + run.body) / length_step_mm - 1e-9) * length_step_mm;
      b.shape = "U-bar";
      bars.push_back(std::move(b));
      continue;
    }
    // The cut length: the run and its legs, each to the outside of its
    // bend, rounded up; the extra goes to the end that is free to move
    // (both bent: to the end's leg). A straight bar held at both ends (a
    // free tip or edge each side: cover to cover) is rounded down instead,
    // each end moving in by half the difference, so that it keeps its
    // cover.
    auto rounded = [&](DetailedBar& b, bool start_fixed, bool end_fixed) {
      const double legs_b = b.leg_start_mm + b.leg_end_mm;
      const double raw = b.end_mm - b.start_mm + legs_b;
      if (start_fixed && end_fixed && legs_b <= 0.0) {
        const double cut = std::max(std::floor(raw / length_step_mm + 1e-9) * length_step_mm, length_step_mm);
        b.start_mm += (raw - cut) / 2.0;
        b.end_mm -= (raw - cut) / 2.0;
        b.length_mm = cut;
        b.shape = shape_of(0.0, 0.0);
        return;
      }
      const double cut = std::ceil(raw / length_step_mm - 1e-9) * length_step_mm;
      if (start_fixed && end_fixed && legs_b > 0.0) (b.leg_end_mm > 0.0 ? b.leg_end_mm : b.leg_start_mm) += cut - raw;
      else if (end_fixed && !start_fixed) b.start_mm = b.end_mm - (cut - legs_b);
      else b.end_mm = b.start_mm + (cut - legs_b);
      // Not past the slab's end less the cover: the extra goes to the
      // other end where that is free, else the bar keeps its raw length.
      if (b.end_mm > run.hi_limit + 1e-6) {
        const double over = b.end_mm - run.hi_limit;
        b.end_mm = run.hi_limit;
        if (!start_fixed && b.start_mm - over >= run.lo_limit - 1e-6) b.start_mm -= over;
        else {
          b.length_mm = b.end_mm - b.start_mm + b.leg_start_mm + b.leg_end_mm;
          b.shape = shape_of(b.leg_start_mm, b.leg_end_mm);
          return;
        }
      } else if (b.start_mm < run.lo_limit - 1e-6) {
        const double over = run.lo_limit - b.start_mm;
        b.start_mm = run.lo_limit;
        if (!end_fixed && b.end_mm + over <= run.hi_limit + 1e-6) b.end_mm += over;
        else {
          b.length_mm = b.end_mm - b.start_mm + b.leg_start_mm + b.leg_end_mm;
          b.shape = shape_of(b.leg_start_mm, b.leg_end_mm);
          return;
        }
      }
      b.length_mm = cut;
      b.shape = shape_of(b.leg_start_mm, b.leg_end_mm);
    };
    if (length + legs <= out.stock_length_mm) {
      DetailedBar b = base;
      b.laps = run.joins;
      b.count = run.count;
      b.start_mm = run.start;
      b.end_mm = run.end;
      b.leg_start_mm = run.leg_start;
      b.leg_end_mm = run.leg_end;
      b.bend_diameter_mm = std::max(run.bend_start, run.bend_end);
      rounded(b, run.start_fixed, run.end_fixed);
      if (b.length_mm > out.stock_length_mm) {  // rounding took it past the stock: keep the raw length
        b.start_mm = run.start;
        b.end_mm = run.end;
        b.leg_start_mm = run.leg_start;
        b.leg_end_mm = run.leg_end;
        b.length_mm = length + legs;
      }
      bars.push_back(std::move(b));
      continue;
    }
    const std::string label = run.where + ", " + face_name(run.face);
    const double lap = derive(label, "lap", ask("detailing lap", run.where, [&] { return rules.lap(run.demand); }));
    if (lap >= out.stock_length_mm / 2.0) {
      problems.add("detailing.stock_length_m",
                   "must be more than twice the lap of the bars at " + label + " (" + plain_number(lap) +
                       " mm), got " + plain_number(out.stock_length_mm / 1000.0) + " m");
      continue;
    }
    // n pieces of set A, each at most the stock: L/n + lap ≤ stock.
    const int pieces = static_cast<int>(std::ceil((length + legs) / (out.stock_length_mm - lap) - 1e-9));
    const double pitch = length / pieces;
    const int count_a = (run.count + 1) / 2, count_b = run.count / 2;
    for (int set = 0; set < 2; ++set) {
      const int count = set == 0 ? count_a : count_b;
      if (count == 0) continue;
      std::vector<double> centres;  // lap centres
      for (int k = 1; k < pieces; ++k) centres.push_back(run.start + k * pitch - (set == 1 ? pitch / 2.0 : 0.0));
      if (set == 1) centres.push_back(run.start + pieces * pitch - pitch / 2.0);
      double a = run.start;
      for (std::size_t k = 0; k <= centres.size(); ++k) {
        DetailedBar b = base;
        b.count = count;
        b.start_mm = a;
        b.end_mm = k < centres.size() ? centres[k] + lap / 2.0 : run.end;
        if (k == 0) b.leg_start_mm = run.leg_start, b.bend_diameter_mm = run.bend_start;
        if (k == centres.size()) b.leg_end_mm = run.leg_end, b.bend_diameter_mm = std::max(b.bend_diameter_mm, run.bend_end);
        for (const DetailLap& j : run.joins)  // a join with the next support's bars at this piece's end
          if ((k == 0 && j.from_mm <= a + 1e-6) || (k == centres.size() && j.to_mm >= run.end - 1e-6))
            b.laps.push_back(j);
        if (k > 0) {
          b.anchorage_start_mm = 0.0;
          b.laps.push_back({b.start_mm, b.start_mm + lap});
        }
        if (k < centres.size()) {
          b.anchorage_end_mm = 0.0;
          b.laps.push_back({centres[k] - lap / 2.0, centres[k] + lap / 2.0});
        }
        rounded(b, k == 0 && run.start_fixed, k == centres.size() && run.end_fixed);
        if (k < centres.size()) a = centres[k] - lap / 2.0;
        bars.push_back(std::move(b));
      }
    }
  }
  problems.raise_if_any();

  // Marks: one per distinct diameter, shape and cut length, in order along the strip.
  // (Bent bars: their legs too, either way round, and a mandrel wider than the standard.)
  std::map<std::tuple<double, std::string, double, double, double, double>, std::string> marks;
  for (auto& b : bars) {
    const auto key = std::make_tuple(b.diameter_mm, b.shape, b.length_mm, std::max(b.leg_start_mm, b.leg_end_mm),
                                     std::min(b.leg_start_mm, b.leg_end_mm), b.bend_diameter_mm);
    auto it = marks.find(key);
    if (it == marks.end()) {
      const std::size_t k = marks.size() + 1;
      std::string m = std::to_string(k);
      if (m.size() < 2) m = "0" + m;
      it = marks.emplace(key, m).first;
      out.schedule.push_back({m, b.bar, b.diameter_mm, 0, b.length_mm, b.shape, 0.0, std::get<3>(key),
                              std::get<4>(key), b.bend_diameter_mm});
    }
    b.mark = it->second;
    for (auto& row : out.schedule)
      if (row.mark == b.mark) row.count += b.count;
  }
  for (auto& row : out.schedule) {
    row.mass_kg = row.count * row.length_mm / 1000.0 * unit_mass_kg_per_m_mm2 * row.diameter_mm * row.diameter_mm;
    out.total_mass_kg += row.mass_kg;
  }
  out.bars = std::move(bars);
}

// The corner zones' bars (two-way slabs): each corner region's bars run
// over the zone in their direction, past the slab's edge line by their
// anchorage (as top bars at an end support without a width) and past the
// zone's inner side by their anchorage; counted over the zone's width.
void Detailer::add_corner_bars(const PlateRecord& plate, const std::vector<RegionRecord>& regions) {
  for (const auto& c : plate.corners)
    for (const auto& r : regions) {
      if (r.where != c.name || r.bars.spacing_mm <= 0.0) continue;
      const bool in_x = r.direction == BarDirection::x;
      const double lo = in_x ? c.x0_mm : c.y0_mm, hi = in_x ? c.x1_mm : c.y1_mm;
      Run run;
      run.where = c.name;
      run.face = r.face;
      run.bars = r.bars;
      run.demand = demand_of(r);
      const std::string label = c.name + ", " + face_name(r.face) + " " + to_string(r.direction);
      const double lbd =
          derive(label, "anchorage", ask("detailing anchorage", c.name, [&] { return rules.anchorage(run.demand); }));
      run.clause = (c.clause.empty() ? "" : c.clause + "; ") + out.derivations.back().length.clause;
      run.start = lo - lbd;
      run.end = hi + lbd;
      run.anch_start = run.anch_end = run.lbd = lbd;  // both ends alike: past the edge line and past the zone
      run.strip = -1;
      run.direction = r.direction;
      run.across_from = in_x ? c.y0_mm : c.x0_mm;
      run.across_to = in_x ? c.y1_mm : c.x1_mm;
      run.count = count_over(run.across_to - run.across_from, r.bars.spacing_mm);
      runs.push_back(std::move(run));
    }
}

// Free edges (two-way slabs): the U-bars of each bay's edge (their flat
// legs in the two faces reach the rule's leg from the edge; the body
// stands across the depth between the covers) and, per edge, one bar in
// each face inside the U along the whole free edge, lapped where longer
// than the stock.
// A flat slab in fire (the code's ContinuousTopRule): in each column strip
// bars of their own run the strip's whole length, from the slab's end to
// its other end less the cover, with the code's share of the top
// reinforcement over the intermediate supports that falls to the strip:
// at each interior column line the strip's top bars over its width (a
// band's within the band's width, in place of the strip's) and half of
// each neighbouring middle strip's; the largest line governs. The
// strip's largest top bar at those lines, as many as the area needs (at
// least two), spread over the strip's narrowest width. Their area is not
// taken off the hogging bars (on the safe side).
void Detailer::add_fire_continuity(const PlateRecord& plate, const std::vector<RegionRecord>& regions, int minutes) {
  const ContinuousTopRule rule = ask("detailing fire continuity", "the slab", [&] { return rules.fire_continuous_top(minutes); });
  if (rule.share <= 0.0) return;
  for (const auto& s : plate.strips) {
    if (!s.column || s.pieces.empty()) continue;
    const bool in_x = s.direction == BarDirection::x;
    const std::string axis = in_x ? "x" : "y";
    const std::vector<double>& along = in_x ? plate.x_lines_mm : plate.y_lines_mm;
    const std::size_t n = along.size() - 1;
    if (n < 2 || s.pieces.size() != n) continue;  // no intermediate support
    auto across = [&](const std::array<double, 4>& p) {
      return in_x ? std::array<double, 2>{p[2], p[3]} : std::array<double, 2>{p[0], p[1]};
    };
    // A line's width across: the union of its two spans' widths.
    auto width_at_line = [](const std::array<double, 2>& a, const std::array<double, 2>& b) {
      return std::array<double, 2>{std::min(a[0], b[0]), std::max(a[1], b[1])};
    };
    double lo = -std::numeric_limits<double>::infinity(), hi = std::numeric_limits<double>::infinity();
    for (const auto& piece : s.pieces) {
      const auto a = across(piece);
      lo = std::max(lo, a[0]);
      hi = std::min(hi, a[1]);
    }
    if (!(hi > lo)) continue;
    std::vector<Step> st;
    const std::string area_u = u_.area_u();
    double need = 0.0;
    const RegionRecord* largest = nullptr;
    for (std::size_t k = 1; k < n; ++k) {
      const std::string line = s.name + " at " + axis + std::to_string(k);
      const RegionRecord* own = plate_region(regions, line, Face::top, s.direction);
      if (!own) continue;
      const auto w = width_at_line(across(s.pieces[k - 1]), across(s.pieces[k]));
      double total = own->bars.As_prov_mm2 * (w[1] - w[0]) / 1000.0;
      std::string how = u_.area(total);
      for (const auto& band : plate.bands) {
        if (band.direction != s.direction || band.pieces.empty()) continue;
        const auto& q = band.pieces.front();
        const auto bw = across(q);
        if (std::abs((in_x ? q[0] : q[2]) - along[k]) > 1.0 || bw[0] < w[0] - 1.0 || bw[1] > w[1] + 1.0) continue;
        if (const RegionRecord* g = plate_region(regions, band.name, Face::top, s.direction)) {
          const double extra = (g->bars.As_prov_mm2 - own->bars.As_prov_mm2) * (bw[1] - bw[0]) / 1000.0;
          total += extra;
          how += " + " + u_.area(extra);
        }
      }
      // A middle strip's share: half to each neighbouring column strip, the
      // whole where it has one (beside a wall).
      auto touches = [](const std::array<double, 2>& a, const std::array<double, 2>& b) {
        return std::abs(a[1] - b[0]) <= 1.0 || std::abs(a[0] - b[1]) <= 1.0;
      };
      for (const auto& m : plate.strips) {
        if (m.column || m.direction != s.direction || m.pieces.size() != n) continue;
        const auto mw = width_at_line(across(m.pieces[k - 1]), across(m.pieces[k]));
        if (!touches(mw, w)) continue;  // not a neighbour
        int neighbours = 0;
        for (const auto& o : plate.strips)
          if (o.column && o.direction == s.direction && o.pieces.size() == n &&
              touches(mw, width_at_line(across(o.pieces[k - 1]), across(o.pieces[k]))))
            ++neighbours;
        if (const RegionRecord* g = plate_region(regions, m.name + " at " + axis + std::to_string(k), Face::top, s.direction)) {
          const double part = g->bars.As_prov_mm2 * (mw[1] - mw[0]) / std::max(neighbours, 1) / 1000.0;
          total += part;
          how += " + " + u_.area(part);
        }
      }
      st.push_back({"As,top " + axis + std::to_string(k),
                    "the top bars over line " + axis + std::to_string(k) +
                        " that fall to the strip: its own over its width, a band's more within the band's, half of "
                        "each neighbouring middle strip's (the whole of one beside a wall)",
                    how, u_.area_v(total), area_u, ""});
      need = std::max(need, rule.share * total);
      if (!largest || own->bars.diameter_mm > largest->bars.diameter_mm) largest = own;
    }
    if (!largest || need <= 0.0) continue;
    const double phi = largest->bars.diameter_mm;
    const double area = std::numbers::pi * phi * phi / 4.0;
    const int count = std::max(2, static_cast<int>(std::ceil(need / area - 1e-9)));
    st.push_back({"As,cont", "share × the largest As,top of the interior lines",
                  plain_number(rule.share) + " × max(As,top)", u_.area_v(need), area_u, rule.clause});
    st.push_back({"n", "bars of the strip's largest top bar (" + largest->bars.bar + "): As,cont / (π φ²/4), at least 2",
                  "⌈" + u_.area(need) + " / " + u_.area(area) + "⌉", static_cast<double>(count), "-", ""});
    st.push_back({"b", "the strip's narrowest width, over which they are spread", "", u_.along_v(hi - lo),
                  u_.along_u(), ""});
    Run r;
    r.where = s.name + ", fire continuity";
    r.face = Face::top;
    const double spacing = (hi - lo) / (count - 1);
    r.bars = BarChoice{largest->bars.bar, phi, spacing, area * 1000.0 / spacing};
    r.demand = demand_of(*largest);
    r.demand.where = r.where;
    r.demand.spacing_mm = spacing;
    r.demand.As_prov_mm2 = r.bars.As_prov_mm2;
    r.demand.As_req_mm2 = r.bars.As_prov_mm2;  // lapped for their full strength
    const double c = cover(Face::top);
    const double o_lo = plate.outline_mm[in_x ? 0 : 2], o_hi = plate.outline_mm[in_x ? 1 : 3];
    r.start = r.lo_limit = o_lo + c;
    r.end = r.hi_limit = o_hi - c;
    r.start_fixed = r.end_fixed = true;
    r.clause = rule.clause;
    r.strip = -1;
    r.direction = s.direction;
    r.across_from = lo;
    r.across_to = hi;
    r.count = r.preset_count = count;
    // The derivation's length: the bars' run, end to end (the area is its step As,cont).
    out.derivations.push_back(
        {r.where, "continuous top bars for fire", DetailLength{r.end - r.start, rule.clause, std::move(st)}});
    runs.push_back(std::move(r));
  }
}

void Detailer::add_free_edge_bars(const PlateRecord& plate, const std::vector<RegionRecord>& regions) {
  const double c = std::max(cover(Face::top), cover(Face::bottom));
  const double body = thickness_ - cover(Face::top) - cover(Face::bottom);
  std::map<std::string, std::pair<double, double>> edge_extent;  // edge → (from, to)
  std::map<std::string, const PlateFreeEdgeRecord*> edge_bar;     // edge → the record of its largest bar
  for (const auto& f : plate.free_edges) {
    const auto [x_edge, pos] = outer_edge(plate, f.edge);
    const double dir = f.edge.back() == '1' ? 1.0 : -1.0;  // outward
    Run u;
    u.where = f.edge + ", " + f.bay;
    u.face = Face::top;
    u.bars = BarChoice{f.u_bar, f.u_bar_diameter_mm, f.u_bar_spacing_mm, f.u_bar_area_mm2};
    u.edge_loop = true;
    // The flat legs lap the bay's bars that stop at the edge (all of them
    // at that section): each at least the rule's leg less the cover and
    // the code's lap of the U-bar.
    if (const RegionRecord* bay =
            plate_region(regions, f.bay, Face::bottom, x_edge ? BarDirection::x : BarDirection::y))
      u.demand = demand_of(*bay);
    u.demand.where = u.where;
    u.demand.diameter_mm = f.u_bar_diameter_mm;
    u.demand.spacing_mm = f.u_bar_spacing_mm;
    u.demand.cover_mm = c;
    u.demand.bond = in_.bond;
    u.demand.lapped_share = 1.0;
    const double lap = derive(u.where + ", U-bars", "lap with the bay's bars (all at the edge)",
                              ask("detailing lap", u.where, [&] { return rules.lap(u.demand); }));
    u.leg_start = u.leg_end = std::max(f.leg_mm - c, lap);
    // ... and reach the bars across the edge by the lap where they stop
    // short of it (a flat slab's column strip, anchored past the column).
    for (const Run& r : runs)
      if (r.face == Face::bottom && !r.distribution && !r.edge_loop && r.where == f.bay &&
          r.direction == (x_edge ? BarDirection::x : BarDirection::y)) {
        const double gap = dir < 0.0 ? r.start - (pos + c) : (pos - c) - r.end;
        if (gap > 1e-6) u.leg_start = u.leg_end = std::max(u.leg_start, gap + lap);
      }
    if (lap > f.leg_mm - c)
      out.notes.push_back(u.where + ": the U-bars' legs run " + plain_number(lap) +
                          " mm, the lap with the bay's bars, more than the edge rule's " + plain_number(f.leg_mm) +
                          " mm less the cover");
    u.start = std::min(pos - dir * (c + u.leg_start), pos - dir * c);
    u.end = std::max(pos - dir * (c + u.leg_start), pos - dir * c);
    u.body = body;
    u.clause = f.clause + "; " + out.derivations.back().length.clause;
    u.strip = -1;
    u.direction = x_edge ? BarDirection::x : BarDirection::y;
    u.across_from = f.from_mm;
    u.across_to = f.to_mm;
    u.count = count_over(f.to_mm - f.from_mm, f.u_bar_spacing_mm);
    runs.push_back(std::move(u));
    auto [it, fresh] = edge_extent.try_emplace(f.edge, f.from_mm, f.to_mm);
    if (!fresh) it->second = {std::min(it->second.first, f.from_mm), std::max(it->second.second, f.to_mm)};
    auto& big = edge_bar[f.edge];
    if (!big || f.edge_bar_diameter_mm > big->edge_bar_diameter_mm) big = &f;
  }
  for (const auto& [edge, extent] : edge_extent) {
    const PlateFreeEdgeRecord& f = *edge_bar[edge];
    const auto [x_edge, pos] = outer_edge(plate, edge);
    const double area = std::numbers::pi * f.edge_bar_diameter_mm * f.edge_bar_diameter_mm / 4.0;
    // At a crossing edge that is free too (a flat slab's on columns) the
    // bar stops at it less the cover.
    const std::size_t k_lo = x_edge ? 2 : 0, k_hi = x_edge ? 3 : 1;
    const bool free_lo = plate.edges[k_lo] == EndSupport::free || (plate.flat && plate.column_edges[k_lo]);
    const bool free_hi = plate.edges[k_hi] == EndSupport::free || (plate.flat && plate.column_edges[k_hi]);
    const double lo_edge = plate.flat ? plate.outline_mm[k_lo] : x_edge ? plate.y_lines_mm.front() : plate.x_lines_mm.front();
    const double hi_edge = plate.flat ? plate.outline_mm[k_hi] : x_edge ? plate.y_lines_mm.back() : plate.x_lines_mm.back();
    for (const Face face : {Face::bottom, Face::top}) {
      Run e;
      e.where = edge + ", edge bar";
      e.face = face;
      e.bars = BarChoice{f.edge_bar, f.edge_bar_diameter_mm, 0.0, area};
      e.start = extent.first;
      e.end = extent.second;
      if (free_lo && extent.first <= lo_edge + 1e-6) e.start = lo_edge + c, e.start_fixed = true;
      if (free_hi && extent.second >= hi_edge - 1e-6) e.end = hi_edge - c, e.end_fixed = true;
      e.clause = f.clause;
      e.strip = -1;
      e.direction = x_edge ? BarDirection::y : BarDirection::x;  // along the edge
      e.across_from = e.across_to = pos;
      e.count = 1;
      e.preset_count = 1;
      e.demand.where = e.where;
      e.demand.face = face;
      e.demand.diameter_mm = f.edge_bar_diameter_mm;
      e.demand.cover_mm = cover(face);
      e.demand.d_mm = thickness_ - cover(face) - f.edge_bar_diameter_mm / 2.0;
      e.demand.As_prov_mm2 = area;
      e.demand.As_req_mm2 = area;  // nominal bars: lapped for their full strength
      e.demand.bond = in_.bond;
      e.demand.lapped_share = 1.0;  // one bar per face: its lap is the whole section's
      runs.push_back(std::move(e));
    }
  }
}

}  // namespace

const RegionRecord* plate_region(const std::vector<RegionRecord>& regions, const std::string& where, Face face,
                                 BarDirection dir) {
  for (const auto& r : regions)
    if (r.where == where && r.face == face && r.direction == dir) return &r;
  return nullptr;
}

DetailingRecord detail_strip(const DetailingRules& rules, const CodeIdentity& code, const Request& req,
                             const DesignRecord& rec, const std::vector<std::vector<DiagramPoint>>& envelope) {
  DetailingRecord out;
  out.slab_width_mm = req.detailing.slab_width_mm;
  out.stock_length_mm = req.detailing.stock_length_mm;
  const std::size_t n = req.slab.spans_mm.size();
  StripLayout L;
  L.strip.direction = BarDirection::span;
  L.strip.across_to_mm = req.detailing.slab_width_mm;
  L.strip.spans_mm = req.slab.spans_mm;
  L.strip.ends = req.slab.ends;
  L.support_widths_mm = req.slab.support_widths_mm;
  L.width_mm = req.detailing.slab_width_mm;
  auto region = [&](const std::string& where, Face face) -> const RegionRecord* {
    for (const auto& r : rec.regions)
      if (r.where == where && r.face == face) return &r;
    return nullptr;
  };
  for (std::size_t e = 0; e < n; ++e) {
    L.span_names.push_back("span " + std::to_string(e + 1));
    L.bottom.push_back(region(L.span_names.back(), Face::bottom));
  }
  for (std::size_t j = 0; j <= n; ++j) {
    L.support_names.push_back("support " + std::to_string(j + 1));
    L.top.push_back(region(L.support_names.back(), Face::top));
  }
  L.distribution = &rec.distribution.bars;
  Detailer detailer(rules, code, req.detailing, req.slab.thickness_mm, rec.face_cover_mm, rec.step_units, out);
  detailer.add_strip(L, envelope);
  detailer.finish();
  out.envelope = out.strips.front().envelope;
  for (double s : req.slab.spans_mm) out.strip_length_mm += s;
  out.mass_per_area_kg_m2 = out.total_mass_kg / (out.slab_width_mm / 1000.0 * out.strip_length_mm / 1000.0);
  return out;
}

namespace {

// A flat slab: each design strip (column and middle strips, bars along
// them) detailed as a strip on its own envelope, its bands per span; the
// bands over internal columns and the transfer bands at edge columns as
// strips of their own with the column strip's envelope and ends.
DetailingRecord detail_flat(const DetailingRules& rules, const CodeIdentity& code, const Request& req,
                            const DesignRecord& rec, const PlateRecord& plate) {
  DetailingRecord out;
  out.plan = true;
  out.stock_length_mm = req.detailing.stock_length_mm;
  Detailer detailer(rules, code, req.detailing, req.slab.thickness_mm, rec.face_cover_mm, rec.step_units, out);
  const double tol = 1e-6;
  const double cx = plate.columns.empty() ? 0.0 : plate.columns.front().cx_mm;
  const double cy = plate.columns.empty() ? 0.0 : plate.columns.front().cy_mm;
  auto region = [&](const std::string& where, Face face, BarDirection dir) {
    return plate_region(rec.regions, where, face, dir);
  };
  // The strip's layout, regions looked up by `name` (a band: its one top
  // region at `band_line`), and its envelope per span with the shear of
  // each span read from the envelope's slope (V = dM/dx; its largest in
  // the span, on the safe side).
  struct Built {
    StripLayout layout;
    std::vector<std::vector<DiagramPoint>> envelope;
  };
  auto build = [&](const FlatStripRecord& s, const std::string& band, std::size_t band_line,
                   const std::array<double, 2>& band_across) {
    Built b;
    StripLayout& L = b.layout;
    const bool in_x = s.direction == BarDirection::x;
    const char axis = in_x ? 'x' : 'y';
    const std::vector<double>& along = in_x ? plate.x_lines_mm : plate.y_lines_mm;
    const std::size_t n = along.size() - 1;
    const double c = in_x ? cx : cy;
    L.strip.name = band.empty() ? s.name : band;
    L.strip.direction = s.direction;
    for (std::size_t e = 0; e < n; ++e) L.strip.spans_mm.push_back(along[e + 1] - along[e]);
    L.free_ends_are_edges = true;
    L.support_widths_mm.assign(n + 1, 0.0);
    for (int side = 0; side < 2; ++side) {
      const std::size_t k = in_x ? static_cast<std::size_t>(side) : static_cast<std::size_t>(2 + side);
      if (plate.column_edges[k]) {
        // On columns: the slab's edge flush with their outer faces; a
        // column strip holds the edge column, a middle strip ends at the
        // free edge between columns.
        L.strip.ends[static_cast<std::size_t>(side)] =
            !s.column ? EndSupport::free : plate.columns_restrained ? EndSupport::fixed : EndSupport::pinned;
        L.support_widths_mm[side == 0 ? 0 : n] = c;
      } else {
        L.strip.ends[static_cast<std::size_t>(side)] = plate.edges[k];
      }
    }
    for (const auto& piece : s.pieces)
      L.span_across.push_back(in_x ? std::array<double, 2>{piece[2], piece[3]}
                                   : std::array<double, 2>{piece[0], piece[1]});
    if (L.span_across.size() != n) L.span_across.clear();
    if (!band.empty()) L.span_across.assign(n, band_across);
    L.strip.across_from_mm = L.span_across.empty() ? 0.0 : L.span_across.front()[0];
    L.strip.across_to_mm = L.span_across.empty() ? 0.0 : L.span_across.front()[1];
    for (std::size_t e = 0; e < n; ++e) {
      L.span_names.push_back(s.name + " span " + std::to_string(e + 1));
      L.bottom.push_back(band.empty() ? region(L.span_names.back(), Face::bottom, s.direction) : nullptr);
    }
    L.top_reach_before.assign(n + 1, 0.0);
    L.top_reach_after.assign(n + 1, 0.0);
    for (std::size_t k = 0; k <= n; ++k) {
      const std::string line = s.name + " at " + axis + std::to_string(k);
      L.support_names.push_back(band.empty() ? line : band);
      L.top.push_back(band.empty() || k == band_line ? region(band.empty() ? line : band, Face::top, s.direction)
                                                      : nullptr);
      // The code's least reach past the faces (a column line; a wall's line is its face).
      const bool wall = (k == 0 && !plate.column_edges[in_x ? 0 : 2]) || (k == n && !plate.column_edges[in_x ? 1 : 3]);
      for (const auto& t : plate.top_extents) {
        if (t.where != line || t.direction != s.direction) continue;
        const double face = wall ? 0.0 : c / 2.0;
        if (t.before_mm > 0.0) L.top_reach_before[k] = std::max(L.top_reach_before[k], face + t.before_mm);
        if (t.after_mm > 0.0) L.top_reach_after[k] = std::max(L.top_reach_after[k], face + t.after_mm);
      }
    }
    L.top_reach_clause = plate.extents_clause;
    L.join_top_bars = band.empty();
    L.join_bottom_bars = band.empty() && s.column && !plate.integrity.empty();
    L.draw = band.empty();
    L.legs_into_support = false;  // most of a strip's bars lie beside the column, their legs in the slab
    L.cover_all_hogging = band.empty();
    b.envelope.resize(n);
    for (std::size_t e = 0; e < n; ++e) {
      for (const auto& q : s.envelope)
        if (q[0] >= along[e] - tol && q[0] <= along[e + 1] + tol) {
          DiagramPoint p{};
          p.x_mm = q[0];
          p.M_max = q[1];
          p.M_min = q[2];
          b.envelope[e].push_back(p);
        }
      double V = 0.0;
      auto& pts = b.envelope[e];
      for (std::size_t k = 1; k < pts.size(); ++k) {
        const double dx = pts[k].x_mm - pts[k - 1].x_mm;
        if (dx > tol)
          V = std::max({V, std::abs(pts[k].M_max - pts[k - 1].M_max) / dx, std::abs(pts[k].M_min - pts[k - 1].M_min) / dx});
      }
      for (auto& p : pts) p.V_max = V, p.V_min = -V;
    }
    return b;
  };
  for (const auto& s : plate.strips) {
    Built b = build(s, "", 0, {});
    detailer.add_strip(b.layout, b.envelope);
  }
  // Bands: the column strip of the band's column line gives the ends and the envelope.
  for (const auto& band : plate.bands) {
    if (band.pieces.empty()) continue;
    const bool in_x = band.direction == BarDirection::x;
    const auto& q = band.pieces.front();
    const double at_line = in_x ? q[0] : q[2];
    const double mid = in_x ? (q[2] + q[3]) / 2.0 : (q[0] + q[1]) / 2.0;
    const std::array<double, 2> across = in_x ? std::array<double, 2>{q[2], q[3]} : std::array<double, 2>{q[0], q[1]};
    const std::vector<double>& along = in_x ? plate.x_lines_mm : plate.y_lines_mm;
    std::size_t line = along.size();
    for (std::size_t k = 0; k < along.size(); ++k)
      if (std::abs(along[k] - at_line) < 1.0) line = k;
    const FlatStripRecord* strip = nullptr;
    for (const auto& s : plate.strips)
      if (s.column && s.direction == band.direction)
        for (const auto& piece : s.pieces) {
          const double lo = in_x ? piece[2] : piece[0], hi = in_x ? piece[3] : piece[1];
          if (mid >= lo - tol && mid <= hi + tol) strip = &s;
        }
    if (!strip || line == along.size()) continue;
    Built b = build(*strip, band.name, line, across);
    const std::size_t first = detailer.runs.size();
    detailer.add_strip(b.layout, b.envelope);
    // The band's bars take the place of the column strip's within its
    // width (the band is designed for at least the strip's moment there):
    // the strip's bars over the line keep the parts of its band beside
    // the band, each from a spacing off the band's edge bar.
    for (std::size_t i = first; i < detailer.runs.size(); ++i) {
      const Run& bandrun = detailer.runs[i];
      if (bandrun.face != Face::top || bandrun.support < 0) continue;
      for (Run& r : detailer.runs) {
        if (&r == &bandrun || r.strip < 0 || r.face != Face::top || r.distribution || r.support != bandrun.support ||
            r.direction != bandrun.direction || r.where.rfind(strip->name + " at ", 0) != 0)
          continue;
        if (!(r.across_from <= mid + tol && r.across_to >= mid - tol)) continue;
        const double sp = r.bars.spacing_mm;
        const double left = bandrun.across_from - r.across_from, right = r.across_to - bandrun.across_to;
        r.count = (left > tol ? static_cast<int>(std::floor(left / sp + 1e-9)) : 0) +
                  (right > tol ? static_cast<int>(std::floor(right / sp + 1e-9)) : 0);
        r.preset_count = r.count;
      }
    }
  }
  // A strip's top bars a band took the whole place of: none.
  detailer.runs.erase(std::remove_if(detailer.runs.begin(), detailer.runs.end(),
                                     [](const Run& r) { return !r.distribution && !r.edge_loop && r.count <= 0; }),
                      detailer.runs.end());
  // The free edges between the edge columns: U-bars and edge bars; the
  // code's continuous top bars for fire.
  detailer.add_free_edge_bars(plate, rec.regions);
  if (req.fire.resistance_min) detailer.add_fire_continuity(plate, rec.regions, *req.fire.resistance_min);
  detailer.finish();
  const auto& o = plate.outline_mm;
  out.mass_per_area_kg_m2 = out.total_mass_kg / ((o[1] - o[0]) * (o[3] - o[2]) * 1e-6);
  return out;
}

}  // namespace

DetailingRecord detail_plate(const DetailingRules& rules, const CodeIdentity& code, const Request& req,
                             const DesignRecord& rec, const PlateRecord& plate) {
  if (plate.flat) return detail_flat(rules, code, req, rec, plate);
  constexpr double per_metre = 1000.0;  // N·mm/mm → N·mm per metre width
  DetailingRecord out;
  out.plan = true;
  out.stock_length_mm = req.detailing.stock_length_mm;
  Detailer detailer(rules, code, req.detailing, req.slab.thickness_mm, rec.face_cover_mm, rec.step_units, out);
  const PlateFieldRecord& f = plate.field;
  const std::size_t nx = f.x_mm.size();
  const double tol = 1e-6;
  // Strictly inside a corner zone: its bars are the corner's (as the
  // regions' design reads the zones).
  auto in_corner = [&](double x, double y) {
    return strictly_in_corner_zone(plate.corners, plate.x_lines_mm.front(), plate.y_lines_mm.front(), x, y);
  };
  auto region = [&](const std::string& where, Face face, BarDirection dir) {
    return plate_region(rec.regions, where, face, dir);
  };
  auto reaction_N_per_mm = [&](const std::string& name) {
    for (const auto& l : plate.reactions)
      if (l.name == name) return l.max_N_per_mm;
    return 0.0;
  };
  for (const BarDirection dir : {BarDirection::x, BarDirection::y}) {
    const bool in_x = dir == BarDirection::x;
    const std::vector<double>& along = in_x ? plate.x_lines_mm : plate.y_lines_mm;
    const std::vector<double>& across = in_x ? plate.y_lines_mm : plate.x_lines_mm;
    const std::vector<double>& node_along = in_x ? f.x_mm : f.y_mm;
    const std::vector<double>& node_across = in_x ? f.y_mm : f.x_mm;
    const std::vector<double>& bottom = in_x ? f.bottom_x : f.bottom_y;
    const std::vector<double>& top = in_x ? f.top_x : f.top_y;
    const std::size_t n = along.size() - 1;
    const char axis = in_x ? 'x' : 'y';
    for (std::size_t row = 0; row + 1 < across.size(); ++row) {
      StripLayout L;
      const std::string first = in_x ? plate_bay_name(0, row) : plate_bay_name(row, 0);
      const std::string last = in_x ? plate_bay_name(n - 1, row) : plate_bay_name(row, n - 1);
      L.strip.name = (n == 1 ? first : first + " to " + last.substr(4)) + ", bars in " + axis;
      L.strip.direction = dir;
      L.strip.across_from_mm = across[row];
      L.strip.across_to_mm = across[row + 1];
      for (std::size_t e = 0; e < n; ++e) L.strip.spans_mm.push_back(along[e + 1] - along[e]);
      L.strip.ends = in_x ? std::array<EndSupport, 2>{plate.edges[0], plate.edges[1]}
                          : std::array<EndSupport, 2>{plate.edges[2], plate.edges[3]};
      L.free_ends_are_edges = true;
      L.join_top_bars = true;
      for (std::size_t e = 0; e < n; ++e) {
        L.span_names.push_back(in_x ? plate_bay_name(e, row) : plate_bay_name(row, e));
        L.bottom.push_back(region(L.span_names.back(), Face::bottom, dir));
      }
      std::vector<double> V_end(n + 1, 0.0);  // the line's largest reaction, N per metre
      for (std::size_t k = 0; k <= n; ++k) {
        const std::string line = k == 0   ? std::string("edge ") + axis + "0"
                                 : k == n ? std::string("edge ") + axis + "1"
                                          : std::string("grid ") + axis + std::to_string(k);
        L.support_names.push_back(line + " segment " + std::to_string(row + 1));
        L.top.push_back(region(L.support_names.back(), Face::top, dir));
        V_end[k] = reaction_N_per_mm(L.support_names.back()) * per_metre;
      }
      // The envelope along the row: at each node line across it the
      // largest Wood–Armer design moments over the row's width (its sides
      // included), per metre; the hogging leaves out the nodes strictly
      // inside a corner zone (the corner bars'). The shear, which only the
      // points of inflection read, is taken between the lines' largest
      // reactions (more than the span's: on the safe side).
      std::vector<std::vector<DiagramPoint>> envelope(n);
      for (std::size_t e = 0; e < n; ++e)
        for (std::size_t a = 0; a < node_along.size(); ++a) {
          const double s = node_along[a];
          if (s < along[e] - tol || s > along[e + 1] + tol) continue;
          double sag = 0.0, hog = 0.0;
          for (std::size_t b = 0; b < node_across.size(); ++b) {
            const double t = node_across[b];
            if (t < across[row] - tol || t > across[row + 1] + tol) continue;
            const std::size_t node = in_x ? a + nx * b : b + nx * a;
            sag = std::max(sag, bottom[node]);
            if (!(in_x ? in_corner(s, t) : in_corner(t, s))) hog = std::max(hog, top[node]);
          }
          const double u = (s - along[e]) / (along[e + 1] - along[e]);
          const double V = V_end[e] + u * (V_end[e + 1] - V_end[e]);
          DiagramPoint p{};
          p.x_mm = s;
          p.M_max = sag * per_metre;
          p.M_min = -hog * per_metre;
          p.V_max = V;
          p.V_min = -V;
          envelope[e].push_back(p);
        }
      detailer.add_strip(L, envelope);
    }
  }
  detailer.add_corner_bars(plate, rec.regions);
  detailer.add_free_edge_bars(plate, rec.regions);
  detailer.finish();
  const double area_m2 = (plate.x_lines_mm.back() - plate.x_lines_mm.front()) *
                         (plate.y_lines_mm.back() - plate.y_lines_mm.front()) * 1e-6;
  out.mass_per_area_kg_m2 = out.total_mass_kg / area_m2;
  return out;
}

const DetailingRules& detailing_rules_of(const SlabChecker& checker, const CodeIdentity& code) {
  const DetailingRules* rules = call_code(code, "detailing rules", [&] { return checker.detailing_rules(); });
  if (!rules) {
    InputProblems problems;
    problems.add("detailing", code.id + " (" + code.variant + ") gives no detailing rules");
    problems.raise_if_any();
  }
  return *rules;
}

void adopt_detailing(DesignRecord& rec, DetailingRecord d) {
  rec.warnings.insert(rec.warnings.end(), d.notes.begin(), d.notes.end());
  for (const Check& c : d.checks) {
    const auto at = std::find_if(rec.supports.begin(), rec.supports.end(),
                                 [&](const SupportRecord& s) { return s.where == c.where; });
    if (at != rec.supports.end()) at->checks.push_back(c);
    else rec.supports.push_back({c.where, 0.0, 0.0, {c}});
  }
  rec.detailing = std::move(d);
}

}  // namespace armature
