// Code-independent structural analysis of a slab strip: an elastic
// continuous beam of uniform EI on knife-edge supports, ends pinned, fixed
// or free (a free end makes that end span a cantilever).
//
// Loads of each load case, per span: a uniform load over the whole span,
// partial uniform loads over part of it and concentrated loads (a line load
// across the strip, or a point load the driver has spread over its
// effective width, becomes a concentrated load on the beam model: N for the
// strip's width).
//
// Sign conventions (units N, mm, N/mm, N·mm):
//   - x runs along the strip; positions on a span (`a_mm`, `b_mm`, the x of
//     moment_at) are measured from the span's left support (its left node).
//   - Loads are positive downward (gravity).
//   - Bending moments are sagging-positive (tension at the bottom face), so
//     support moments of a gravity-loaded continuous strip are negative;
//     "hogging" values reported as magnitudes say so.
//   - Shear V = dM/dx: positive where the moment rises to the right, so a
//     simply supported span under gravity has V > 0 at its left end. At a
//     concentrated load V jumps down by P; shear_at(x) is the value just to
//     the right of x, shear_left_of(x) the value just to the left.
//   - Reactions are positive upward.
//   - A concentrated load exactly at a span's end (a = 0 or a = L) acts on
//     the node: at a support it goes straight into the reaction; at a free
//     end (a cantilever's tip) it loads the cantilever through the node.
//     Span internal forces then hold only loads inside the span, so V_left
//     and V_right() are the shears just inside the span's ends.
#pragma once

#include <string>
#include <vector>

#include "armature/request.hpp"

namespace armature {

struct StripModel {
  std::vector<double> spans_mm;
  EndSupport left = EndSupport::pinned;
  EndSupport right = EndSupport::pinned;

  std::size_t span_count() const { return spans_mm.size(); }
  std::size_t node_count() const { return spans_mm.size() + 1; }
  bool has_support(std::size_t node) const;   // a vertical support at this node
  bool is_cantilever(std::size_t span) const; // the span ends at a free end
  // Moment continuity or fixity at the node (for span/depth rules).
  bool is_restrained(std::size_t node) const;
  double node_position_mm(std::size_t node) const;
};

// Empty when the strip can be analysed; otherwise why not (a mechanism).
std::string stability_problem(const StripModel& model);

// A load on a span other than its full-length uniform load.
struct SpanLoad {
  enum class Shape {
    partial_uniform,  // value N/mm from a_mm to b_mm (0 ≤ a < b ≤ L)
    concentrated,     // value N at a_mm (0 ≤ a ≤ L); b_mm unused
  };
  Shape shape = Shape::concentrated;
  double value = 0.0;
  double a_mm = 0.0;
  double b_mm = 0.0;
};
SpanLoad partial_uniform_load(double q_N_per_mm, double from_mm, double to_mm);
SpanLoad concentrated_load(double P_N, double at_mm);

// Everything one load case puts on one span.
struct SpanLoading {
  double w = 0.0;               // N/mm over the whole span
  std::vector<SpanLoad> loads{};  // partial uniform and concentrated loads
};

// Fixed-end actions of a span built in at both ends (closed forms): end
// moments sagging-positive (so ≤ 0 under gravity) and upward end reactions.
struct FixedEndActions {
  double M_left = 0.0, M_right = 0.0;  // N·mm
  double R_left = 0.0, R_right = 0.0;  // N
  FixedEndActions& operator+=(const FixedEndActions& o);
};
// w over the whole span: M = −wL²/12 at both ends, R = wL/2.
FixedEndActions fixed_end_uniform(double L, double w);
// P at a (b = L − a): M_left = −P a b²/L², M_right = −P a² b/L².
FixedEndActions fixed_end_concentrated(double L, double P, double a);
// q from a to b: the concentrated-load moments integrated over [a, b].
FixedEndActions fixed_end_partial_uniform(double L, double q, double a, double b);
FixedEndActions fixed_end_actions(double L, const SpanLoad& load);
FixedEndActions fixed_end_actions(double L, const SpanLoading& loading);

// Internal forces of one span under one load case: statics of the span
// from its left-end forces and its loads (M and V piecewise polynomial).
struct SpanForces {
  double L = 0.0;        // mm
  double w = 0.0;        // N/mm over the whole span
  double M_left = 0.0;   // N·mm at x = 0
  double V_left = 0.0;   // N at x = 0+
  // Partial uniform loads, and concentrated loads strictly inside the span
  // (0 < a < L; loads at the ends act on the nodes).
  std::vector<SpanLoad> loads{};

  double moment_at(double x) const;
  double shear_at(double x) const;       // just right of x (x = L: just left of the end)
  double shear_left_of(double x) const;  // just left of x (x = 0: just right of the end)
  double M_right() const { return moment_at(L); }
  double V_right() const { return shear_left_of(L); }
  // Largest sagging moment along the span and where it occurs. Exact: the
  // greatest of M at the span's ends, at every load discontinuity (under a
  // concentrated load, where V may change sign) and at V = 0 inside a piece.
  double max_moment(double* x_at = nullptr) const;
  // Least (most hogging) moment along the span, exact in the same way.
  double min_moment(double* x_at = nullptr) const;
  // Where the piecewise polynomials change: 0, L and every load's ends or
  // position, sorted and unique.
  std::vector<double> breakpoints() const;
};

// Span forces from the end moments and the loads (statics of one span).
SpanForces span_from_end_moments(double L, double w, double M_left, double M_right);
SpanForces span_from_end_moments(double L, const SpanLoading& loading, double M_left, double M_right);

struct CaseResult {
  std::vector<SpanForces> spans;
  std::vector<double> reactions;   // N, upward, per node (0 where no support)
  // Concentrated loads acting on the nodes (N, downward; see above), per
  // node; empty when there are none.
  std::vector<double> node_loads{};
};

// Stiffness solution for one load case; w_N_per_mm has one entry per span.
CaseResult analyse(const StripModel& model, const std::vector<double>& w_N_per_mm);
// Any loads: one SpanLoading per span. (Named apart from analyse: a braced
// list of loads per span would otherwise be ambiguous.)
CaseResult analyse_loads(const StripModel& model, const std::vector<SpanLoading>& loading);
// The same for several load cases, sharing one factorisation of the
// stiffness matrix. Uniform loads only (one per span per case), or any loads.
// Throws std::invalid_argument on a load outside its span or not finite.
std::vector<CaseResult> analyse_cases(const StripModel& model,
                                      const std::vector<std::vector<double>>& w_N_per_mm);
std::vector<CaseResult> analyse_load_cases(const StripModel& model,
                                           const std::vector<std::vector<SpanLoading>>& cases);

// Nodes whose support moment may be redistributed: interior supports not
// next to a cantilever (a cantilever root moment is statically fixed).
std::vector<bool> redistributable_nodes(const StripModel& model);

// Moment redistribution (δ times the support moment at the given nodes),
// spans rebalanced by equilibrium with their own loads (every shape).
CaseResult redistribute(const StripModel& model, const CaseResult& elastic,
                        const std::vector<bool>& nodes, double delta);

// Envelope over load cases.
struct Envelope {
  std::vector<double> span_max_sagging;     // N·mm, per span (may be ≤ 0)
  std::vector<double> span_x_max_sagging;   // mm from the span's left end
  std::vector<double> span_max_hogging;     // N·mm magnitude along the span, ends included (≥ 0)
  std::vector<double> node_max_hogging;     // N·mm magnitude, per node (≥ 0)
  std::vector<double> node_max_shear;       // N magnitude, worse face, per node
};
Envelope envelope_of(const StripModel& model, const std::vector<CaseResult>& cases);

// The envelope sampled along one span, for diagrams: both ends, equal
// segments, and every load discontinuity of any case; under a concentrated
// load two points at the same x, the first with the shear just left of the
// load, the second with the shear just right of it.
struct DiagramPoint {
  double x_mm = 0.0;  // along the strip
  double M_max = 0.0, M_min = 0.0;  // N·mm
  double V_max = 0.0, V_min = 0.0;  // N
};
std::vector<std::vector<DiagramPoint>> envelope_diagrams(const StripModel& model,
                                                         const std::vector<CaseResult>& cases,
                                                         int segments_per_span = 24);

}  // namespace armature
