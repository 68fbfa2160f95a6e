// Plan and colour-map drawings of a two-way slab (see plate_svg.hpp). The
// look follows the record's other drawings: serif type at 10 px, black
// lines on white; colour only where a map needs it, on a scale whose
// lightness grows towards zero so that it still reads in grey.
#include "plate_svg.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <cstdio>
#include <stdexcept>

#include "armature/design.hpp"
#include "armature/format.hpp"

namespace armature {

namespace {

std::string n4(double v) { return plain_number(v); }

std::string esc(const std::string& s) {
  std::string o;
  for (char c : s) {
    switch (c) {
      case '&': o += "&amp;"; break;
      case '<': o += "&lt;"; break;
      case '>': o += "&gt;"; break;
      case '"': o += "&quot;"; break;
      default: o += c;
    }
  }
  return o;
}

// ---- frame ---------------------------------------------------------------------

// The plate to scale in a box of at most 440 × 320 px, room above for the
// title, left and below for the dimensions, right for a colour bar.
struct PlanFrame {
  double ox = 64, oy = 50, scale = 1, width = 0, depth = 0;  // plate size in px
  double x_min = 0, y_min = 0, y_max = 0;
  double sx(double x) const { return ox + (x - x_min) * scale; }
  double sy(double y) const { return oy + (y_max - y) * scale; }
  double bottom() const { return oy + depth; }
  double right() const { return ox + width; }
};

void check_lines(const std::vector<double>& lines, const char* name) {
  if (lines.size() < 2) throw std::invalid_argument(std::string("plate drawing: ") + name + " needs two grid lines or more");
  for (std::size_t k = 0; k < lines.size(); ++k) {
    if (!std::isfinite(lines[k])) throw std::invalid_argument(std::string("plate drawing: ") + name + " not finite");
    if (k > 0 && !(lines[k] > lines[k - 1]))
      throw std::invalid_argument(std::string("plate drawing: ") + name + " not ascending");
  }
}

PlanFrame frame_of(const PlatePlan& plan) {
  check_lines(plan.x_lines, "x_lines");
  check_lines(plan.y_lines, "y_lines");
  PlanFrame f;
  f.x_min = plan.x_lines.front();
  f.y_min = plan.y_lines.front();
  f.y_max = plan.y_lines.back();
  const double lx = plan.x_lines.back() - f.x_min, ly = f.y_max - f.y_min;
  f.scale = std::min(440.0 / lx, 320.0 / ly);
  f.width = lx * f.scale;
  f.depth = ly * f.scale;
  return f;
}

std::string line(double x1, double y1, double x2, double y2, const std::string& style) {
  return "<line x1=\"" + n4(x1) + "\" y1=\"" + n4(y1) + "\" x2=\"" + n4(x2) + "\" y2=\"" + n4(y2) + "\" " +
         style + "/>";
}

std::string text(double x, double y, const std::string& body, const std::string& attributes = "") {
  return "<text x=\"" + n4(x) + "\" y=\"" + n4(y) + "\"" + (attributes.empty() ? "" : " " + attributes) + ">" +
         esc(body) + "</text>";
}

// Text readable over a coloured cell: a white halo under the glyphs.
const char* halo = "stroke=\"#fff\" stroke-width=\"2.5\" paint-order=\"stroke\"";

// ---- edges ---------------------------------------------------------------------

// An edge from (x1, y1) to (x2, y2) in px, with the outward normal (nx, ny)
// in px directions.
struct EdgeLine {
  const char* name;
  EndSupport support;
  double x1, y1, x2, y2, nx, ny;
};

std::array<EdgeLine, 4> edges_of(const PlatePlan& plan, const PlanFrame& f) {
  const double l = f.ox, r = f.right(), t = f.oy, b = f.bottom();
  return {{{"x0", plan.edges.x0, l, b, l, t, -1, 0},
           {"x1", plan.edges.x1, r, b, r, t, 1, 0},
           {"y0", plan.edges.y0, l, b, r, b, 0, 1},
           {"y1", plan.edges.y1, l, t, r, t, 0, -1}}};
}

// Fixed: a heavy line hatched on the outside. Pinned: a support line with
// small open triangles outside, apex on the edge. Free: a thin line.
std::string edge_marks(EndSupport s, double x1, double y1, double x2, double y2, double nx, double ny) {
  const double len = std::hypot(x2 - x1, y2 - y1);
  const double tx = (x2 - x1) / len, ty = (y2 - y1) / len;
  std::string o;
  if (s == EndSupport::fixed) {
    o += line(x1, y1, x2, y2, "stroke=\"#000\" stroke-width=\"2.2\"");
    for (double d = 3; d < len; d += 7) {
      const double px = x1 + tx * d, py = y1 + ty * d;
      o += line(px, py, px + 6 * nx - 4 * tx, py + 6 * ny - 4 * ty, "stroke=\"#000\" stroke-width=\"0.8\"");
    }
  } else if (s == EndSupport::pinned) {
    o += line(x1, y1, x2, y2, "stroke=\"#000\" stroke-width=\"1.5\"");
    const int count = std::max(2, static_cast<int>(len / 48));
    for (int k = 0; k < count; ++k) {
      const double d = len * (k + 0.5) / count, px = x1 + tx * d, py = y1 + ty * d;
      const double bx = px + 7 * nx, by = py + 7 * ny;
      o += "<polygon points=\"" + n4(px) + "," + n4(py) + " " + n4(bx + 4 * tx) + "," + n4(by + 4 * ty) + " " +
           n4(bx - 4 * tx) + "," + n4(by - 4 * ty) + "\" fill=\"#fff\" stroke=\"#000\" stroke-width=\"0.8\"/>";
    }
  } else {
    o += line(x1, y1, x2, y2, "stroke=\"#000\" stroke-width=\"0.6\"");
  }
  return o;
}

const char* interior_style = "stroke=\"#000\" stroke-width=\"1\" stroke-dasharray=\"8 3 2 3\"";
const char* column_line_style = "stroke=\"#777\" stroke-width=\"0.6\" stroke-dasharray=\"3 3\"";

// Interior grid lines (line supports, or a flat slab's column lines and
// its columns), then the four edges on top.
std::string supports_svg(const PlatePlan& plan, const PlanFrame& f) {
  std::string o;
  const char* style = plan.interior_lines_supported ? interior_style : column_line_style;
  const char* kind = plan.interior_lines_supported ? "support-line" : "column-line";
  for (std::size_t k = 1; k + 1 < plan.x_lines.size(); ++k) {
    const double px = f.sx(plan.x_lines[k]);
    o += std::string("<g class=\"") + kind + "\">" + line(px, f.oy, px, f.bottom(), style) + "</g>";
  }
  for (std::size_t k = 1; k + 1 < plan.y_lines.size(); ++k) {
    const double py = f.sy(plan.y_lines[k]);
    o += std::string("<g class=\"") + kind + "\">" + line(f.ox, py, f.right(), py, style) + "</g>";
  }
  for (const auto& c : plan.columns) {
    const double x0 = f.sx(c[0]), x1 = f.sx(c[1]), y0 = f.sy(c[3]), y1 = f.sy(c[2]);
    o += "<rect class=\"column\" x=\"" + n4(x0) + "\" y=\"" + n4(y0) + "\" width=\"" + n4(x1 - x0) + "\" height=\"" +
         n4(y1 - y0) + "\" fill=\"#000\"/>";
  }
  for (const auto& e : edges_of(plan, f))
    o += std::string("<g class=\"edge ") + to_string(e.support) + "\" data-edge=\"" + e.name + "\">" +
         edge_marks(e.support, e.x1, e.y1, e.x2, e.y2, e.nx, e.ny) + "</g>";
  return o;
}

// Span lengths between grid lines, below the plate and to its left.
std::string dimensions_svg(const PlatePlan& plan, const PlanFrame& f) {
  std::string o;
  const double yd = f.bottom() + 22;
  o += line(f.ox, yd, f.right(), yd, "stroke=\"#000\" stroke-width=\"0.6\"");
  for (double x : plan.x_lines) o += line(f.sx(x), yd - 4, f.sx(x), yd + 4, "stroke=\"#000\" stroke-width=\"0.6\"");
  for (std::size_t k = 0; k + 1 < plan.x_lines.size(); ++k)
    o += text((f.sx(plan.x_lines[k]) + f.sx(plan.x_lines[k + 1])) / 2, yd - 3,
              n4(plan.x_lines[k + 1] - plan.x_lines[k]) + " " + plan.length_unit,
              "text-anchor=\"middle\" class=\"span-x\"");
  const double xd = f.ox - 22;
  o += line(xd, f.oy, xd, f.bottom(), "stroke=\"#000\" stroke-width=\"0.6\"");
  for (double y : plan.y_lines) o += line(xd - 4, f.sy(y), xd + 4, f.sy(y), "stroke=\"#000\" stroke-width=\"0.6\"");
  for (std::size_t k = 0; k + 1 < plan.y_lines.size(); ++k) {
    const double py = (f.sy(plan.y_lines[k]) + f.sy(plan.y_lines[k + 1])) / 2;
    o += text(xd - 3, py, n4(plan.y_lines[k + 1] - plan.y_lines[k]) + " " + plan.length_unit,
              "text-anchor=\"middle\" class=\"span-y\" transform=\"rotate(-90 " + n4(xd - 3) + " " + n4(py) + ")\"");
  }
  o += text(f.right() + 6, yd + 3, "x");
  o += text(xd - 3, f.oy - 6, "y", "text-anchor=\"middle\"");
  return o;
}

// A legend row of the styles the drawing uses; returns its height in px.
std::string legend_svg(const PlatePlan& plan, double x, double y) {
  const std::array<EndSupport, 3> kinds{EndSupport::fixed, EndSupport::pinned, EndSupport::free};
  const char* words[3] = {"fixed edge (hatched)", "pinned edge (triangles)", "free edge (thin line)"};
  std::string o;
  double at = x;
  for (std::size_t k = 0; k < kinds.size(); ++k) {
    const EndSupport s = kinds[k];
    if (plan.edges.x0 != s && plan.edges.x1 != s && plan.edges.y0 != s && plan.edges.y1 != s) continue;
    o += std::string("<g class=\"legend\" data-condition=\"") + to_string(s) + "\">" +
         edge_marks(s, at, y, at + 28, y, 0, 1) + text(at + 34, y + 4, words[k]) + "</g>";
    at += 40 + 6.0 * static_cast<double>(std::char_traits<char>::length(words[k]));
  }
  if (!plan.interior_lines_supported)
    o += "<g class=\"legend\" data-condition=\"column\">" + line(at, y, at + 28, y, column_line_style) +
         text(at + 34, y + 4, "column line (columns filled)") + "</g>";
  else if (plan.x_lines.size() > 2 || plan.y_lines.size() > 2)
    o += "<g class=\"legend\" data-condition=\"interior\">" + line(at, y, at + 28, y, interior_style) +
         text(at + 34, y + 4, "interior line support") + "</g>";
  return o;
}

// The caution, in lines of at most 118 characters, from baseline y.
std::string caution_svg(double y, double& height) {
  const std::string all = std::string("Caution: ") + caution_text;
  std::vector<std::string> lines{""};
  std::size_t start = 0;
  while (start < all.size()) {
    std::size_t end = all.find(' ', start);
    if (end == std::string::npos) end = all.size();
    const std::string word = all.substr(start, end - start);
    if (!lines.back().empty() && lines.back().size() + 1 + word.size() > 118) lines.emplace_back();
    lines.back() += (lines.back().empty() ? "" : " ") + word;
    start = end + 1;
  }
  std::string o = "<g class=\"caution\" font-size=\"8\">";
  for (std::size_t k = 0; k < lines.size(); ++k) o += text(4, y + 10.0 * static_cast<double>(k), lines[k]);
  height = 10.0 * static_cast<double>(lines.size());
  return o + "</g>";
}

std::string open_svg(double width, double height, const std::string& label) {
  return "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + n4(width) + "\" height=\"" + n4(height) +
         "\" viewBox=\"0 0 " + n4(width) + " " + n4(height) +
         "\" font-family=\"Georgia, serif\" font-size=\"10\" role=\"img\" aria-label=\"" + esc(label) + "\">";
}

// Legend, caution and the closing tag under a drawing whose lowest part is
// at `bottom`; `width` the drawing's.
std::string foot_svg(const PlatePlan& plan, double bottom, double width, std::string& head, const std::string& label) {
  double caution_height = 0;
  std::string o = legend_svg(plan, 8, bottom + 16);
  o += caution_svg(bottom + 40, caution_height);
  head = open_svg(width, bottom + 40 + caution_height, label);
  return o + "</svg>";
}

// ---- colour scale --------------------------------------------------------------

// Five stops from blue (most negative) through white (zero) to red (most
// positive); lightness falls away from the middle on both sides.
struct Rgb {
  double r, g, b;
};
constexpr std::array<Rgb, 5> stops{{{33, 102, 172}, {146, 197, 222}, {255, 255, 255}, {244, 165, 130}, {178, 24, 43}}};

std::string colour_at(double u) {
  u = std::clamp(u, 0.0, 1.0) * 4.0;
  const std::size_t k = std::min<std::size_t>(3, static_cast<std::size_t>(u));
  const double t = u - static_cast<double>(k);
  const Rgb& a = stops[k];
  const Rgb& b = stops[k + 1];
  char buf[8];
  std::snprintf(buf, sizeof buf, "#%02x%02x%02x", static_cast<unsigned>(std::lround(a.r + (b.r - a.r) * t)),
                static_cast<unsigned>(std::lround(a.g + (b.g - a.g) * t)),
                static_cast<unsigned>(std::lround(a.b + (b.b - a.b) * t)));
  return buf;
}

// Where a value sits on the stops (0 … 1).
struct ColourScale {
  double lo = 0, hi = 0;
  enum class Kind { signed_both, positive, negative } kind = Kind::positive;
  double position(double v) const {
    switch (kind) {
      case Kind::signed_both: return v >= 0 ? 0.5 + 0.5 * v / hi : 0.5 - 0.5 * v / lo;
      case Kind::positive: return hi > lo ? 0.5 + 0.5 * (v - lo) / (hi - lo) : 0.5;
      case Kind::negative: return hi > lo ? 0.5 * (v - lo) / (hi - lo) : 0.5;
    }
    return 0.5;
  }
};

// Signed when values lie on both sides of zero beyond rounding noise (a
// billionth of the largest magnitude).
ColourScale scale_of(double lo, double hi) {
  const double noise = 1e-9 * std::max(std::abs(lo), std::abs(hi));
  ColourScale s{lo, hi, ColourScale::Kind::positive};
  if (lo < -noise && hi > noise)
    s.kind = ColourScale::Kind::signed_both;
  else if (lo < -noise)
    s.kind = ColourScale::Kind::negative;
  return s;
}

// Cell bounds along one axis: halfway to the neighbours, the ends clipped
// to the plate.
std::vector<double> cell_bounds(const std::vector<double>& at, double lo, double hi) {
  std::vector<double> b(at.size() + 1);
  b.front() = lo;
  b.back() = hi;
  for (std::size_t k = 1; k < at.size(); ++k) b[k] = (at[k - 1] + at[k]) / 2;
  if (at.size() > 1) {
    b.front() = std::max(lo, at.front() - (at[1] - at[0]) / 2);
    b.back() = std::min(hi, at.back() + (at.back() - at[at.size() - 2]) / 2);
  }
  return b;
}

void check_samples(const std::vector<double>& at, double lo, double hi, const char* name) {
  if (at.empty()) throw std::invalid_argument(std::string("plate map: no ") + name + " samples");
  for (std::size_t k = 0; k < at.size(); ++k) {
    if (!std::isfinite(at[k]) || at[k] < lo - 1e-9 * (hi - lo) || at[k] > hi + 1e-9 * (hi - lo))
      throw std::invalid_argument(std::string("plate map: ") + name + " sample off the plate");
    if (k > 0 && !(at[k] > at[k - 1])) throw std::invalid_argument(std::string("plate map: ") + name + " not ascending");
  }
}

// A marked extreme: the sentence "max 12.3 kNm/m at x = 2.1, y = 2.7 m"
// on the line under the title (at x = `line_x`), and a dot at the point
// tagged "max" or "min" on the side towards the plate's middle.
std::string peak_svg(const PlanFrame& f, const char* cls, const char* word, double value, double x, double y,
                     const std::string& unit, const std::string& length_unit, double line_x) {
  const double px = f.sx(x), py = f.sy(y);
  const bool left = px > f.ox + f.width / 2;
  const bool below = py < f.oy + f.depth / 2;
  return std::string("<g class=\"") + cls + "\">" +
         text(line_x, 29,
              std::string(word) + " " + n4(value) + " " + unit + " at x = " + n4(x) + ", y = " + n4(y) + " " +
                  length_unit) +
         "<circle cx=\"" + n4(px) + "\" cy=\"" + n4(py) + "\" r=\"3\" fill=\"#000\" stroke=\"#fff\" stroke-width=\"1\"/>" +
         text(left ? px - 5 : px + 5, below ? py + 13 : py - 5, word,
              std::string("text-anchor=\"") + (left ? "end" : "start") + "\" " + halo) +
         "</g>";
}

}  // namespace

std::string plate_plan_svg(const PlatePlan& plan) {
  const PlanFrame f = frame_of(plan);
  std::string body =
      plan.columns.empty()
          ? text(4, 14, "Plan of the slab, to scale: edges by condition, bays named" +
                            std::string(plan.bays.empty() || plan.bays.front().bars_x.empty() ? ""
                                                                                            : ", bottom bars per bay"))
          : text(4, 14, "Plan to scale: edges by condition, columns, column strips shaded, punching perimeters dashed");
  body += "<rect x=\"" + n4(f.ox) + "\" y=\"" + n4(f.oy) + "\" width=\"" + n4(f.width) + "\" height=\"" +
          n4(f.depth) + "\" fill=\"#fff\" stroke=\"none\"/>";
  for (const auto& s : plan.column_strips)
    body += "<rect class=\"column-strip\" x=\"" + n4(f.sx(s[0])) + "\" y=\"" + n4(f.sy(s[3])) + "\" width=\"" +
            n4(f.sx(s[1]) - f.sx(s[0])) + "\" height=\"" + n4(f.sy(s[2]) - f.sy(s[3])) +
            "\" fill=\"#6a8fc7\" fill-opacity=\"0.12\" stroke=\"none\"/>";
  body += supports_svg(plan, f);
  for (const auto& p : plan.perimeters) {
    std::string pts;
    for (const auto& q : p) pts += n4(f.sx(q[0])) + "," + n4(f.sy(q[1])) + " ";
    body += "<polyline class=\"perimeter\" points=\"" + pts +
            "\" fill=\"none\" stroke=\"#b03020\" stroke-width=\"0.7\" stroke-dasharray=\"4 2\"/>";
  }
  if (plan.governing_column && *plan.governing_column < plan.columns.size()) {
    const auto& c = plan.columns[*plan.governing_column];
    const double cx = (f.sx(c[0]) + f.sx(c[1])) / 2, cy = (f.sy(c[2]) + f.sy(c[3])) / 2;
    body += "<g class=\"governing\"><circle cx=\"" + n4(cx) + "\" cy=\"" + n4(cy) +
            "\" r=\"9\" fill=\"none\" stroke=\"#b03020\" stroke-width=\"1.6\"/>" +
            text(cx + 11, cy - 9, plan.governing_label, std::string("fill=\"#b03020\" ") + halo) + "</g>";
  }
  for (const auto& b : plan.bays) {
    const double cx = (f.sx(b.x0) + f.sx(b.x1)) / 2, cy = (f.sy(b.y0) + f.sy(b.y1)) / 2;
    body += "<g class=\"bay\">" + text(cx, cy - 8, b.name, "text-anchor=\"middle\" font-weight=\"bold\"");
    if (!b.bars_x.empty()) body += text(cx, cy + 6, "x: " + b.bars_x, "text-anchor=\"middle\" class=\"bars-x\"");
    if (!b.bars_y.empty()) body += text(cx, cy + 18, "y: " + b.bars_y, "text-anchor=\"middle\" class=\"bars-y\"");
    body += "</g>";
  }
  for (const auto& m : plan.marks) {
    // The label runs along the mark's line (rotated a quarter turn for a
    // line along y), just beside it, clear of the bay's text in the middle.
    const double px = f.sx(m.x), py = f.sy(m.y);
    const std::string turn =
        m.along_y ? " transform=\"rotate(-90 " + n4(px - 4) + " " + n4(py) + ")\"" : std::string();
    body += "<g class=\"mark\"><circle cx=\"" + n4(px) + "\" cy=\"" + n4(py) + "\" r=\"2.5\" fill=\"#000\"/>" +
            text(m.along_y ? px - 4 : px + 4, m.along_y ? py : py - 4, m.label,
                 std::string(m.along_y ? "text-anchor=\"middle\" " : "") + halo + turn) +
            "</g>";
  }
  body += dimensions_svg(plan, f);
  std::string head;
  const std::string foot = foot_svg(plan, f.bottom() + 30, std::max(660.0, f.right() + 60), head, "plan of the slab");
  return head + body + foot;
}

std::string plate_map_svg(const PlatePlan& plan, const ScalarMap& map, const std::string& title,
                          const std::string& unit) {
  const PlanFrame f = frame_of(plan);
  const double x_lo = plan.x_lines.front(), x_hi = plan.x_lines.back();
  const double y_lo = plan.y_lines.front(), y_hi = plan.y_lines.back();
  check_samples(map.x, x_lo, x_hi, "x");
  check_samples(map.y, y_lo, y_hi, "y");
  const std::size_t nx = map.x.size(), ny = map.y.size();
  if (map.values.size() != nx * ny)
    throw std::invalid_argument("plate map: " + std::to_string(map.values.size()) + " values for " +
                                std::to_string(nx) + " × " + std::to_string(ny) + " samples");
  std::size_t k_max = 0, k_min = 0;
  for (std::size_t k = 0; k < map.values.size(); ++k) {
    if (!std::isfinite(map.values[k])) throw std::invalid_argument("plate map: a value is not finite");
    if (map.values[k] > map.values[k_max]) k_max = k;
    if (map.values[k] < map.values[k_min]) k_min = k;
  }
  const double lo = map.values[k_min], hi = map.values[k_max];
  const ColourScale cs = scale_of(lo, hi);

  std::string body = text(4, 14, title + ", " + unit);
  const auto bx = cell_bounds(map.x, x_lo, x_hi), by = cell_bounds(map.y, y_lo, y_hi);
  body += "<g class=\"cells\" stroke=\"none\">";
  for (std::size_t j = 0; j < ny; ++j)
    for (std::size_t i = 0; i < nx; ++i) {
      const double left = f.sx(bx[i]), top = f.sy(by[j + 1]);
      // A hair wider than the cell so that no seam of white shows between cells.
      body += "<rect class=\"cell\" x=\"" + n4(left) + "\" y=\"" + n4(top) + "\" width=\"" +
              n4(f.sx(bx[i + 1]) - left + 0.3) + "\" height=\"" + n4(f.sy(by[j]) - top + 0.3) + "\" fill=\"" +
              colour_at(cs.position(map.values[i + nx * j])) + "\"/>";
    }
  body += "</g>";
  body += supports_svg(plan, f);
  for (const auto& b : plan.bays)
    body += "<g class=\"bay\">" + text(f.sx(b.x0) + 5, f.sy(b.y1) + 13, b.name, std::string("font-weight=\"bold\" ") + halo) +
            "</g>";

  // Colour bar: minimum at the foot, maximum at the head, zero marked on a
  // signed scale.
  const double bar_x = f.right() + 36, bar_top = f.oy, bar_h = std::min(std::max(f.depth, 120.0), 240.0);
  const int steps = 48;
  body += "<g class=\"colour-bar\">";
  for (int s = 0; s < steps; ++s) {
    const double v = lo + (hi - lo) * (s + 0.5) / steps;
    const double y = bar_top + bar_h * (1.0 - static_cast<double>(s + 1) / steps);
    body += "<rect x=\"" + n4(bar_x) + "\" y=\"" + n4(y) + "\" width=\"14\" height=\"" + n4(bar_h / steps + 0.3) +
            "\" fill=\"" + colour_at(cs.position(v)) + "\" stroke=\"none\"/>";
  }
  body += "<rect x=\"" + n4(bar_x) + "\" y=\"" + n4(bar_top) + "\" width=\"14\" height=\"" + n4(bar_h) +
          "\" fill=\"none\" stroke=\"#000\" stroke-width=\"0.6\"/>";
  body += text(bar_x + 18, bar_top + 8, "max " + n4(hi), "class=\"scale-max\"");
  body += text(bar_x + 18, bar_top + bar_h, "min " + n4(lo), "class=\"scale-min\"");
  if (cs.kind == ColourScale::Kind::signed_both) {
    const double yz = bar_top + bar_h * (hi / (hi - lo));
    body += line(bar_x - 3, yz, bar_x + 17, yz, "stroke=\"#000\" stroke-width=\"0.8\"");
    if (yz > bar_top + 16 && yz < bar_top + bar_h - 12) body += text(bar_x + 18, yz + 3, "0");
  }
  body += text(bar_x, bar_top + bar_h + 14, unit);
  body += "</g>";

  const std::size_t i_max = k_max % nx, j_max = k_max / nx;
  body += peak_svg(f, "peak-max", "max", hi, map.x[i_max], map.y[j_max], unit, plan.length_unit, 4);
  if (cs.kind != ColourScale::Kind::positive) {
    const std::size_t i_min = k_min % nx, j_min = k_min / nx;
    body += peak_svg(f, "peak-min", "min", lo, map.x[i_min], map.y[j_min], unit, plan.length_unit, 330);
  }
  body += dimensions_svg(plan, f);
  std::string head;
  const std::string foot = foot_svg(plan, std::max(f.bottom() + 30, bar_top + bar_h + 20),
                                    std::max(660.0, bar_x + 120), head, title);
  return head + body + foot;
}

}  // namespace armature
