// Code-independent structural analysis of a slab strip: an elastic
// continuous beam of uniform EI on knife-edge supports, ends pinned, fixed
// or free (a free end makes that end span a cantilever), uniform load per
// span per load case. Units: N, mm. Moments are sagging-positive and
// V = dM/dx.
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

// Internal forces of one span under one load case.
struct SpanForces {
  double L = 0.0;        // mm
  double w = 0.0;        // N/mm
  double M_left = 0.0;   // N·mm at x = 0
  double V_left = 0.0;   // N at x = 0+

  double moment_at(double x) const { return M_left + V_left * x - w * x * x / 2.0; }
  double shear_at(double x) const { return V_left - w * x; }
  double M_right() const { return moment_at(L); }
  double V_right() const { return shear_at(L); }
  // Largest sagging moment along the span and where it occurs (exact: at
  // V = 0 when that lies inside the span, else at an end).
  double max_moment(double* x_at = nullptr) const;
};

// Span forces from the end moments and the load (statics of one span).
SpanForces span_from_end_moments(double L, double w, double M_left, double M_right);

struct CaseResult {
  std::vector<SpanForces> spans;
  std::vector<double> reactions;  // N, upward, per node (0 where no support)
};

// Stiffness solution for one load case; w_N_per_mm has one entry per span.
CaseResult analyse(const StripModel& model, const std::vector<double>& w_N_per_mm);
// The same for several load cases (one load per span each), sharing one
// factorisation of the stiffness matrix.
std::vector<CaseResult> analyse_cases(const StripModel& model,
                                      const std::vector<std::vector<double>>& w_N_per_mm);

// Nodes whose support moment may be redistributed: interior supports not
// next to a cantilever (a cantilever root moment is statically fixed).
std::vector<bool> redistributable_nodes(const StripModel& model);

// Moment redistribution (δ times the support moment at the given nodes),
// spans rebalanced by equilibrium with their own loads.
CaseResult redistribute(const StripModel& model, const CaseResult& elastic,
                        const std::vector<bool>& nodes, double delta);

// Envelope over load cases.
struct Envelope {
  std::vector<double> span_max_sagging;     // N·mm, per span (may be ≤ 0)
  std::vector<double> span_x_max_sagging;   // mm from the span's left end
  std::vector<double> node_max_hogging;     // N·mm magnitude, per node (≥ 0)
  std::vector<double> node_max_shear;       // N magnitude, worse face, per node
};
Envelope envelope_of(const StripModel& model, const std::vector<CaseResult>& cases);

// The envelope sampled along one span, for diagrams (both ends included).
struct DiagramPoint {
  double x_mm = 0.0;  // along the strip
  double M_max = 0.0, M_min = 0.0;  // N·mm
  double V_max = 0.0, V_min = 0.0;  // N
};
std::vector<std::vector<DiagramPoint>> envelope_diagrams(const StripModel& model,
                                                         const std::vector<CaseResult>& cases,
                                                         int segments_per_span = 24);

}  // namespace armature
