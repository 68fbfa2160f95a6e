// Deflection of a span between supports by double integration of the
// curvature the code gives for each moment (deflection.hpp).
#include "armature/deflection.hpp"

#include <algorithm>
#include <cmath>
#include <iterator>
#include <stdexcept>

namespace armature {

namespace {

DeflectionPoint point_at(const CurvatureOfMoment& curvature, double x, double M) {
  DeflectionPoint p;
  p.x_mm = x;
  p.moment = M;
  p.curvature = curvature(M);
  if (!std::isfinite(p.curvature)) throw std::runtime_error("span deflection: curvature not finite");
  return p;
}

// Curvature at the ends of n equal segments, the even points taken from
// `coarse` (n/2 segments) where given.
std::vector<DeflectionPoint> grid_of(const SpanForces& span, const CurvatureOfMoment& curvature, std::size_t n,
                                     const std::vector<DeflectionPoint>* coarse) {
  const double h = span.L / static_cast<double>(n);
  std::vector<DeflectionPoint> points(n + 1);
  for (std::size_t i = 0; i <= n; ++i) {
    if (coarse && i % 2 == 0) {
      points[i] = (*coarse)[i / 2];
      continue;
    }
    const double x = i == n ? span.L : h * static_cast<double>(i);
    points[i] = point_at(curvature, x, span.moment_at(x));
  }
  return points;
}

// Where the moment passes through one of the break moments: two points at
// the same x, with the curvature just before and just after the break, so
// that the jump is integrated exactly instead of smeared over a segment.
// The moment is a polynomial between the span's load breakpoints: each
// piece is scanned and every change of side refined by bisection.
std::vector<DeflectionPoint> break_points_of(const SpanForces& span, const CurvatureOfMoment& curvature,
                                             const std::vector<double>& breaks) {
  std::vector<DeflectionPoint> out;
  if (breaks.empty()) return out;
  constexpr int scan_per_piece = 64;
  const std::vector<double> pieces = span.breakpoints();
  for (std::size_t p = 0; p + 1 < pieces.size(); ++p) {
    const double a = pieces[p], b = pieces[p + 1];
    // Inside the piece (its ends may carry a jump of shear, not of moment).
    double x0 = a, m0 = span.moment_at(a + 1e-9 * (b - a));
    for (int k = 1; k <= scan_per_piece; ++k) {
      const double x1 = k == scan_per_piece ? b : a + (b - a) * k / scan_per_piece;
      const double m1 = span.moment_at(k == scan_per_piece ? b - 1e-9 * (b - a) : x1);
      for (double level : breaks) {
        // A change of side (a crossing on a scan point counts in one cell).
        if ((m0 < level) == (m1 < level)) continue;
        double lo = x0, hi = x1, m_lo = m0;
        for (int it = 0; it < 60 && hi - lo > 1e-9 * span.L; ++it) {
          const double mid = 0.5 * (lo + hi), m_mid = span.moment_at(mid);
          if ((m_lo - level) * (m_mid - level) <= 0.0) {
            hi = mid;
          } else {
            lo = mid;
            m_lo = m_mid;
          }
        }
        const double x = 0.5 * (lo + hi);
        const double nudge = 1e-9 * std::max(std::abs(level), 1.0);
        const double before = m0 < level ? level - nudge : level + nudge;
        const double after = m0 < level ? level + nudge : level - nudge;
        out.push_back(point_at(curvature, x, before));
        out.push_back(point_at(curvature, x, after));
      }
      x0 = x1;
      m0 = m1;
    }
  }
  std::stable_sort(out.begin(), out.end(),
                   [](const DeflectionPoint& l, const DeflectionPoint& r) { return l.x_mm < r.x_mm; });
  return out;
}

// The grid with the break points placed in order of x (a break point
// after any grid point at the same x).
std::vector<DeflectionPoint> merged(const std::vector<DeflectionPoint>& grid,
                                    const std::vector<DeflectionPoint>& breaks) {
  if (breaks.empty()) return grid;
  std::vector<DeflectionPoint> out;
  out.reserve(grid.size() + breaks.size());
  std::merge(grid.begin(), grid.end(), breaks.begin(), breaks.end(), std::back_inserter(out),
             [](const DeflectionPoint& b, const DeflectionPoint& g) { return b.x_mm < g.x_mm; });
  return out;
}

// F(x) = ∫0^x ∫0^s κ (slope, then its integral, by trapezoids over the
// points' intervals, zero-length ones at the breaks); the deflection with
// zero at both supports, w(x) = (x/L) F(L) − F(x), downward positive for
// sagging curvature.
SpanDeflection integrate(const SpanForces& span, std::vector<DeflectionPoint> points, std::size_t segments) {
  const std::size_t n = points.size() - 1;
  SpanDeflection out;
  out.segments = segments;
  std::vector<double> Fx(n + 1, 0.0);
  double slope = 0.0, F = 0.0;
  for (std::size_t i = 1; i <= n; ++i) {
    const double h = points[i].x_mm - points[i - 1].x_mm;
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
  // w' = F(L)/L − ∫0^x κ: at 0 and at L.
  out.slope_start = Fx[n] / span.L;
  out.slope_end = Fx[n] / span.L - slope;
  out.points = std::move(points);
  return out;
}

// From the root: w = 0 and dw/dξ = s0 there (ξ the distance from the
// root), w'' = −κ along ξ as along x; trapezoids as above.
SpanDeflection integrate_cantilever(std::vector<DeflectionPoint> points, bool root_at_start, double root_slope,
                                    std::size_t segments) {
  const std::size_t n = points.size() - 1;
  SpanDeflection out;
  out.segments = segments;
  const double s0 = root_at_start ? root_slope : -root_slope;  // along ξ
  auto at = [&](std::size_t k) -> DeflectionPoint& { return points[root_at_start ? k : n - k]; };
  const double x_root = at(0).x_mm;
  double slope = s0, w = 0.0;
  at(0).deflection_mm = 0.0;
  out.max_mm = 0.0;
  out.x_at_mm = x_root;
  for (std::size_t k = 1; k <= n; ++k) {
    const double h = std::abs(at(k).x_mm - at(k - 1).x_mm);
    const double slope_next = slope - h * (at(k - 1).curvature + at(k).curvature) / 2.0;
    w += h * (slope + slope_next) / 2.0;
    slope = slope_next;
    at(k).deflection_mm = w;
    if (w > out.max_mm) {
      out.max_mm = w;
      out.x_at_mm = at(k).x_mm;
    }
  }
  out.points = std::move(points);
  return out;
}

}  // namespace

SpanDeflection span_deflection_fixed(const SpanForces& span, const CurvatureOfMoment& curvature,
                                     std::size_t segments, const std::vector<double>& moment_breaks) {
  if (segments == 0 || !(span.L > 0.0)) throw std::invalid_argument("span deflection: no segments or no span");
  const auto breaks = break_points_of(span, curvature, moment_breaks);
  return integrate(span, merged(grid_of(span, curvature, segments, nullptr), breaks), segments);
}

SpanDeflection cantilever_deflection(const SpanForces& span, const CurvatureOfMoment& curvature, bool root_at_start,
                                     double root_slope, double tolerance, const std::vector<double>& moment_breaks) {
  if (!(span.L > 0.0) || !std::isfinite(root_slope)) throw std::invalid_argument("cantilever deflection: no span");
  constexpr std::size_t first = 16, last = std::size_t{1} << 16;
  const auto breaks = break_points_of(span, curvature, moment_breaks);
  std::vector<DeflectionPoint> grid = grid_of(span, curvature, first, nullptr);
  SpanDeflection previous = integrate_cantilever(merged(grid, breaks), root_at_start, root_slope, first);
  for (std::size_t n = 2 * first;; n *= 2) {
    grid = grid_of(span, curvature, n, &grid);
    SpanDeflection next = integrate_cantilever(merged(grid, breaks), root_at_start, root_slope, n);
    const double scale = std::max(std::abs(next.max_mm), 1e-9);
    next.change = std::abs(next.max_mm - previous.max_mm) / scale;
    if (next.change <= tolerance || n >= last) return next;
    previous = std::move(next);
  }
}

SpanDeflection span_deflection(const SpanForces& span, const CurvatureOfMoment& curvature, double tolerance,
                               const std::vector<double>& moment_breaks) {
  if (!(span.L > 0.0)) throw std::invalid_argument("span deflection: no span");
  constexpr std::size_t first = 16, last = std::size_t{1} << 16;
  const auto breaks = break_points_of(span, curvature, moment_breaks);
  std::vector<DeflectionPoint> grid = grid_of(span, curvature, first, nullptr);
  SpanDeflection previous = integrate(span, merged(grid, breaks), first);
  for (std::size_t n = 2 * first;; n *= 2) {
    grid = grid_of(span, curvature, n, &grid);
    SpanDeflection next = integrate(span, merged(grid, breaks), n);
    const double scale = std::max(std::abs(next.max_mm), 1e-9);
    next.change = std::abs(next.max_mm - previous.max_mm) / scale;
    if (next.change <= tolerance || n >= last) return next;
    previous = std::move(next);
  }
}

}  // namespace armature
