// Plan geometry of punching perimeters round a rectangular column.
#include "armature/punching.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <string>

namespace armature {

ColumnPosition column_position(const FreeFaces& f) {
  if ((f.x0 && f.x1) || (f.y0 && f.y1))
    throw std::invalid_argument("free faces: a column cannot have two opposite faces on the slab edge");
  const int n = int(f.x0) + int(f.x1) + int(f.y0) + int(f.y1);
  return n == 0 ? ColumnPosition::internal : n == 1 ? ColumnPosition::edge : ColumnPosition::corner;
}

namespace {
void require_positive(double v, const char* field) {
  if (!(v > 0.0) || !std::isfinite(v))
    throw std::invalid_argument(std::string("punching demand: ") + field + " must be a positive number");
}
void require_magnitude(double v, const char* field) {
  if (!(v >= 0.0) || !std::isfinite(v))
    throw std::invalid_argument(std::string("punching demand: ") + field + " must be zero or more");
}
}  // namespace

void validate_punching_demand(const PunchingDemand& p) {
  column_position(p.free);
  require_positive(p.cx_mm, "cx_mm");
  require_positive(p.cy_mm, "cy_mm");
  require_positive(p.h_mm, "h_mm");
  require_positive(p.dx_mm, "dx_mm");
  require_positive(p.dy_mm, "dy_mm");
  if (p.dx_mm >= p.h_mm) throw std::invalid_argument("punching demand: dx_mm must be less than h_mm");
  if (p.dy_mm >= p.h_mm) throw std::invalid_argument("punching demand: dy_mm must be less than h_mm");
  require_magnitude(p.rho_x, "rho_x");
  require_magnitude(p.rho_y, "rho_y");
  require_magnitude(p.V_N, "V_N");
  if (p.M_x_Nmm) require_magnitude(*p.M_x_Nmm, "M_x_Nmm");
  if (p.M_y_Nmm) require_magnitude(*p.M_y_Nmm, "M_y_Nmm");
  if (p.reinforcement_spacing_mm) require_positive(*p.reinforcement_spacing_mm, "reinforcement_spacing_mm");
}

namespace {
using Point = std::array<double, 2>;

PerimeterPiece segment(Point a, Point b) {
  PerimeterPiece p;
  p.a = a;
  p.b = b;
  return p;
}

double piece_length(const PerimeterPiece& p) {
  if (p.arc) return p.radius * std::abs(p.sweep_rad);
  return std::hypot(p.b[0] - p.a[0], p.b[1] - p.a[1]);
}

Point arc_point(const PerimeterPiece& p, double t) {
  const double th = p.start_rad + t * p.sweep_rad;
  return {p.centre[0] + p.radius * std::cos(th), p.centre[1] + p.radius * std::sin(th)};
}

// ∫ |u| dl along a straight piece where u goes linearly from ua to ub.
double abs_linear_integral(double ua, double ub, double length) {
  if (ua * ub >= 0.0) return length * std::abs(ua + ub) / 2.0;
  return length * (ua * ua + ub * ub) / (2.0 * std::abs(ub - ua));
}
}  // namespace

PunchingPerimeter offset_perimeter(const std::string& name, const ColumnOutline& c, const FreeFaces& free,
                                   double a, PerimeterCorner corner) {
  column_position(free);  // refuses opposite faces
  // Faces counter-clockwise: y0 (bottom), x1 (right), y1 (top), x0 (left);
  // each offset outward by a, spanning the face's length.
  const std::array<bool, 4> is_free{free.y0, free.x1, free.y1, free.x0};
  const std::array<std::array<Point, 2>, 4> faces{{
      {{{c.x_min, c.y_min - a}, {c.x_max, c.y_min - a}}},
      {{{c.x_max + a, c.y_min}, {c.x_max + a, c.y_max}}},
      {{{c.x_max, c.y_max + a}, {c.x_min, c.y_max + a}}},
      {{{c.x_min - a, c.y_max}, {c.x_min - a, c.y_min}}},
  }};
  // The column corner between face i and face i+1, and the angle at which
  // the arc round it starts (outward normal of face i).
  const std::array<Point, 4> corners{{{c.x_max, c.y_min}, {c.x_max, c.y_max}, {c.x_min, c.y_max}, {c.x_min, c.y_min}}};
  const double pi = std::numbers::pi;
  const std::array<double, 4> start_angle{-pi / 2, 0.0, pi / 2, pi};
  // Start after a free face, so that an open perimeter runs in one piece.
  std::size_t first = 0;
  for (std::size_t i = 0; i < 4; ++i)
    if (is_free[i]) first = (i + 1) % 4;
  PunchingPerimeter out;
  out.name = name;
  out.distance_mm = a;
  out.closed = std::none_of(is_free.begin(), is_free.end(), [](bool b) { return b; });
  for (std::size_t k = 0; k < 4; ++k) {
    const std::size_t i = (first + k) % 4;
    if (is_free[i]) continue;
    out.pieces.push_back(segment(faces[i][0], faces[i][1]));
    const std::size_t j = (i + 1) % 4;
    if (is_free[j] || a <= 0.0) continue;  // at a = 0 the faces meet at the corner itself
    const Point from = faces[i][1], to = faces[j][0];
    switch (corner) {
      case PerimeterCorner::round: {
        PerimeterPiece arc;
        arc.arc = true;
        arc.centre = corners[i];
        arc.radius = a;
        arc.start_rad = start_angle[i];
        arc.sweep_rad = pi / 2;
        arc.a = from;
        arc.b = to;
        out.pieces.push_back(arc);
        break;
      }
      case PerimeterCorner::square: {
        // The corner point: outward along both normals.
        const Point mid{from[0] + to[0] - corners[i][0], from[1] + to[1] - corners[i][1]};
        out.pieces.push_back(segment(from, mid));
        out.pieces.push_back(segment(mid, to));
        break;
      }
      case PerimeterCorner::chamfer:
        out.pieces.push_back(segment(from, to));
        break;
    }
  }
  for (const auto& p : out.pieces) {
    out.length_mm += piece_length(p);
    if (out.points.empty()) out.points.push_back(p.a);
    if (p.arc) {
      constexpr int chords = 8;
      for (int s = 1; s <= chords; ++s) out.points.push_back(arc_point(p, double(s) / chords));
    } else {
      out.points.push_back(p.b);
    }
  }
  return out;
}

double perimeter_first_moment(const PunchingPerimeter& p, bool along_x, double origin) {
  const std::size_t axis = along_x ? 0 : 1;
  double sum = 0.0;
  for (const auto& piece : p.pieces) {
    if (!piece.arc) {
      sum += abs_linear_integral(piece.a[axis] - origin, piece.b[axis] - origin, piece_length(piece));
      continue;
    }
    // Arcs: short chords, each integrated exactly.
    constexpr int n = 256;
    Point prev = arc_point(piece, 0.0);
    for (int s = 1; s <= n; ++s) {
      const Point next = arc_point(piece, double(s) / n);
      sum += abs_linear_integral(prev[axis] - origin, next[axis] - origin,
                                 piece.radius * std::abs(piece.sweep_rad) / n);
      prev = next;
    }
  }
  return sum;
}

double perimeter_centroid(const PunchingPerimeter& p, bool along_x) {
  const std::size_t axis = along_x ? 0 : 1;
  double moment = 0.0, length = 0.0;
  for (const auto& piece : p.pieces) {
    const double l = piece_length(piece);
    length += l;
    if (!piece.arc) {
      moment += l * (piece.a[axis] + piece.b[axis]) / 2.0;
    } else {
      // ∫ (c + r cos θ) r dθ (x) or ∫ (c + r sin θ) r dθ (y).
      const double t0 = piece.start_rad, t1 = piece.start_rad + piece.sweep_rad, r = piece.radius;
      const double trig = along_x ? std::sin(t1) - std::sin(t0) : std::cos(t0) - std::cos(t1);
      moment += r * (piece.centre[axis] * piece.sweep_rad + r * trig);
    }
  }
  if (length <= 0.0) throw std::invalid_argument("perimeter of no length");
  return moment / length;
}

double critical_section_polar_moment(const PunchingPerimeter& p, double d, bool along_x) {
  const std::size_t axis = along_x ? 0 : 1;
  const double e0 = perimeter_centroid(p, along_x);
  double J = 0.0;
  for (const auto& piece : p.pieces) {
    if (piece.arc) throw std::invalid_argument("critical section with curved faces");
    const double ua = piece.a[axis] - e0, ub = piece.b[axis] - e0, l = piece_length(piece);
    J += d * l * (ua * ua + ua * ub + ub * ub) / 3.0;  // d ∫ e² dl, e linear along the face
    J += std::abs(ub - ua) * d * d * d / 12.0;          // the face's own depth, for faces along the direction
  }
  return J;
}

double critical_section_extreme_distance(const PunchingPerimeter& p, bool along_x) {
  const std::size_t axis = along_x ? 0 : 1;
  const double e0 = perimeter_centroid(p, along_x);
  double c = 0.0;
  for (const auto& pt : p.points) c = std::max(c, std::abs(pt[axis] - e0));
  return c;
}

double perimeter_extent(const PunchingPerimeter& p, bool along_x) {
  const std::size_t axis = along_x ? 0 : 1;
  double lo = INFINITY, hi = -INFINITY;
  for (const auto& pt : p.points) {
    lo = std::min(lo, pt[axis]);
    hi = std::max(hi, pt[axis]);
  }
  return p.points.empty() ? 0.0 : hi - lo;
}

}  // namespace armature
