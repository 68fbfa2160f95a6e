// Deflection of a span by double integration of curvature (code
// independent): the code gives the curvature of the section under a
// moment; the kernel integrates it along the span between its supports.
#pragma once

#include <cstddef>
#include <functional>
#include <vector>

#include "armature/analysis.hpp"

namespace armature {

struct DeflectionPoint {
  double x_mm = 0.0;          // from the span's left support
  double moment = 0.0;        // N·mm, sagging positive
  double curvature = 0.0;     // 1/mm, sagging positive
  double deflection_mm = 0.0; // downward positive
};

struct SpanDeflection {
  double max_mm = 0.0;         // the largest downward deflection along the span
  double x_at_mm = 0.0;        // where it occurs
  std::size_t segments = 0;    // equal segments of the converged integration (break points besides)
  double change = 0.0;         // relative change of max_mm from half as many segments
  std::vector<DeflectionPoint> points;  // at every segment end of the converged integration
  // Between supports: dw/dx (downward positive, per mm along x) at x = 0
  // and at x = L, the rotations a cantilever beyond either end starts from.
  double slope_start = 0.0, slope_end = 0.0;
};

// Curvature (1/mm, sagging positive) of the span's section under a moment
// (N·mm, sagging positive).
using CurvatureOfMoment = std::function<double(double)>;

// A span between two supports (zero deflection at both): curvature at the
// ends of equal segments from the span's moment diagram, integrated twice
// by the trapezoidal rule; the segments double from 16 until the largest
// deflection changes by no more than `tolerance` (relative) or 2^16
// segments are reached. `moment_breaks` are moments at which the
// curvature jumps (the cracking moments): where the span's moment passes
// one, two points at that x carry the curvature either side of the jump
// (DeflectionPoint twice at one x_mm in `points`), so the jump is
// integrated exactly and the rule converges as for a smooth curvature.
SpanDeflection span_deflection(const SpanForces& span, const CurvatureOfMoment& curvature,
                               double tolerance = 0.005, const std::vector<double>& moment_breaks = {});

// A cantilever: zero deflection at its root and the slope there given
// (`root_slope`: dw/dx at the root along the strip's x, downward positive,
// from the back span's slope_start or slope_end); `root_at_start` when
// the root is at x = 0 (a cantilever beyond the strip's right end), else
// at x = L. The deflection is measured from the root; its largest
// downward value is max_mm (at the tip, as a rule). Converged as
// span_deflection; slope_start and slope_end are not set.
SpanDeflection cantilever_deflection(const SpanForces& span, const CurvatureOfMoment& curvature, bool root_at_start,
                                     double root_slope, double tolerance = 0.005,
                                     const std::vector<double>& moment_breaks = {});

// The same integration on a given number of segments (no convergence).
SpanDeflection span_deflection_fixed(const SpanForces& span, const CurvatureOfMoment& curvature,
                                     std::size_t segments, const std::vector<double>& moment_breaks = {});

}  // namespace armature
