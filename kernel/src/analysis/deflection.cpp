// Deflection of a span between supports by double integration of the
// curvature the code gives for each moment (deflection.hpp).
#include "armature/deflection.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace armature {

namespace {

// Curvature at the ends of n equal segments, the even points taken from
// `coarse` (n/2 segments) where given.
std::vector<DeflectionPoint> points_of(const SpanForces& span, const CurvatureOfMoment& curvature, std::size_t n,
                                       const std::vector<DeflectionPoint>* coarse) {
  const double h = span.L / static_cast<double>(n);
  std::vector<DeflectionPoint> points(n + 1);
  for (std::size_t i = 0; i <= n; ++i) {
    DeflectionPoint& p = points[i];
    if (coarse && i % 2 == 0) {
      p = (*coarse)[i / 2];
      continue;
    }
    p.x_mm = i == n ? span.L : h * static_cast<double>(i);
    p.moment = span.moment_at(p.x_mm);
    p.curvature = curvature(p.moment);
    if (!std::isfinite(p.curvature)) throw std::runtime_error("span deflection: curvature not finite");
  }
  return points;
}

// F(x) = ∫0^x ∫0^s κ (slope, then its integral, by trapezoids); the
// deflection with zero at both supports, w(x) = (x/L) F(L) − F(x),
// downward positive for sagging curvature.
SpanDeflection integrate(const SpanForces& span, std::vector<DeflectionPoint> points) {
  const std::size_t n = points.size() - 1;
  const double h = span.L / static_cast<double>(n);
  SpanDeflection out;
  out.segments = n;
  std::vector<double> Fx(n + 1, 0.0);
  double slope = 0.0, F = 0.0;
  for (std::size_t i = 1; i <= n; ++i) {
    const double slope_next = slope + h * (points[i - 1].curvature + points[i].curvature) / 2.0;
    F += h * (slope + slope_next) / 2.0;
    slope = slope_next;
    Fx[i] = F;
  }
  for (std::size_t i = 0; i <= n; ++i) {
    DeflectionPoint& p = points[i];
    p.deflection_mm = p.x_mm / span.L * Fx[n] - Fx[i];
    if (i == 0 || p.deflection_mm > out.max_mm) {
      out.max_mm = p.deflection_mm;
      out.x_at_mm = p.x_mm;
    }
  }
  out.points = std::move(points);
  return out;
}

}  // namespace

SpanDeflection span_deflection_fixed(const SpanForces& span, const CurvatureOfMoment& curvature,
                                     std::size_t segments) {
  if (segments == 0 || !(span.L > 0.0)) throw std::invalid_argument("span deflection: no segments or no span");
  return integrate(span, points_of(span, curvature, segments, nullptr));
}

SpanDeflection span_deflection(const SpanForces& span, const CurvatureOfMoment& curvature, double tolerance) {
  if (!(span.L > 0.0)) throw std::invalid_argument("span deflection: no span");
  constexpr std::size_t first = 16, last = std::size_t{1} << 16;
  SpanDeflection previous = integrate(span, points_of(span, curvature, first, nullptr));
  for (std::size_t n = 2 * first;; n *= 2) {
    SpanDeflection next = integrate(span, points_of(span, curvature, n, &previous.points));
    const double scale = std::max(std::abs(next.max_mm), 1e-9);
    next.change = std::abs(next.max_mm - previous.max_mm) / scale;
    if (next.change <= tolerance || n >= last) return next;
    previous = std::move(next);
  }
}

}  // namespace armature
