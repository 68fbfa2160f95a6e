// Calculation record writer. Layout and wording are our own: a plain,
// typographic page that prints in black and white on A4 or Letter.
#include "armature/report.hpp"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <ctime>
#include <fstream>
#include <random>
#include <sstream>
#include <utility>

#include <nlohmann/json.hpp>

#include "armature/errors.hpp"
#include "armature/format.hpp"
#include "armature/json_io.hpp"
#include "armature/two_way.hpp"
#include "armature/units.hpp"
#include "plate_svg.hpp"

namespace armature {

namespace {
using nlohmann::json;

// Every number of the record: four significant figures, plain notation.
std::string n4(double v, double scale = 1.0) {
  if (std::isinf(v) && v < 0) return "-";
  return plain_number(v, scale);
}

// The units of the record's own tables and text (report_units); the
// derivation steps are printed as written, in the units of the code's
// edition (the kernel's own steps too: DesignRecord::step_units).
struct RecordUnits {
  bool us = false;
  std::string load(double MPa) const { return us ? n4(MPa * 1e3 / kPa_per_psf) + " psf" : n4(MPa * 1e3) + " kPa"; }
  double load_v(double MPa) const { return us ? MPa * 1e3 / kPa_per_psf : MPa * 1e3; }
  const char* load_u() const { return us ? "psf" : "kPa"; }
  std::string along(double mm) const { return us ? n4(mm * 1e-3 / m_per_ft) + " ft" : n4(mm / 1e3) + " m"; }
  double along_v(double mm) const { return us ? mm * 1e-3 / m_per_ft : mm / 1e3; }
  const char* along_u() const { return us ? "ft" : "m"; }
  std::string length(double mm) const { return n4(length_v(mm)) + " " + length_u(); }
  double length_v(double mm) const { return us ? mm / mm_per_in : mm; }
  const char* length_u() const { return us ? "in" : "mm"; }
  std::string area(double mm2) const { return n4(area_v(mm2)) + " " + area_u(); }
  double area_v(double mm2) const { return us ? mm2 / (mm_per_in * mm_per_in) : mm2; }
  const char* area_u() const { return us ? "in2" : "mm2"; }
  double moment_v(double Nmm) const { return us ? Nmm * 1e-6 / kNm_per_kipft : Nmm * 1e-6; }
  const char* moment_u() const { return us ? "kip-ft" : "kNm"; }
  std::string moment(double Nmm) const { return n4(moment_v(Nmm)) + " " + moment_u(); }
  double force_v(double N) const { return us ? N * 1e-3 / kN_per_kip : N * 1e-3; }
  const char* force_u() const { return us ? "kip" : "kN"; }
  std::string force(double N) const { return n4(force_v(N)) + " " + force_u(); }
  std::string line(double N_per_mm) const {
    return us ? n4(N_per_mm / kN_per_kip * m_per_ft) + " kip/ft" : n4(N_per_mm) + " kN/m";
  }
  std::string density(double kN_m3) const {
    return us ? n4(kN_m3 * 1e3 / N_per_lbf * m_per_ft * m_per_ft * m_per_ft) + " pcf" : n4(kN_m3) + " kN/m³";
  }
  // A check's value in its kernel report unit (kNm, kN, mm, mm2), converted.
  std::pair<double, std::string> check_value(double v, const std::string& unit) const {
    if (!us) return {v, unit};
    if (unit == "kNm") return {v / kNm_per_kipft, "kip-ft"};
    if (unit == "kN") return {v / kN_per_kip, "kip"};
    if (unit == "mm") return {v / mm_per_in, "in"};
    if (unit == "mm2") return {v / (mm_per_in * mm_per_in), "in2"};
    return {v, unit};
  }
  std::string bars(const BarChoice& b) const { return bar_arrangement(b.bar, length_v(b.spacing_mm), length_u()); }
};

RecordUnits units_of(const DesignRecord& r) { return RecordUnits{r.report_units == ReportUnits::US}; }

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

// Markdown table cells may not hold a bare '|'.
std::string md(const std::string& s) {
  std::string o;
  for (char c : s) o += c == '|' ? std::string("\\|") : std::string(1, c);
  return o;
}

void flatten(const json& j, const std::string& path, std::vector<std::pair<std::string, std::string>>& out) {
  if (j.is_object()) {
    for (auto it = j.begin(); it != j.end(); ++it)
      flatten(it.value(), path.empty() ? it.key() : path + "." + it.key(), out);
  } else {
    out.push_back({path, j.is_string() ? j.get<std::string>() : j.dump()});
  }
}

// A unit as printed after a number: nothing for a pure number.
std::string unit_text(const std::string& unit) { return unit == "-" ? std::string() : " " + unit; }

// The substituted values of a step, or nothing when they would only repeat
// its result (a value read from a table or given: "K = … = 0.006637").
std::string substitution(const Step& s) {
  const std::string result = n4(s.result);
  if (s.substituted == result || s.substituted == result + unit_text(s.unit)) return {};
  return s.substituted;
}

// A step's expression, or nothing when it only repeats the symbol.
std::string expression_of(const Step& s) { return s.expression == s.symbol ? std::string() : s.expression; }

// One derivation line: symbol [= expression] [= substituted] = result unit.
std::string step_line(const Step& s) {
  const std::string ex = expression_of(s), sub = substitution(s);
  return s.symbol + (ex.empty() ? "" : " = " + ex) + (sub.empty() ? "" : " = " + sub) + " = " +
         n4(s.result) + unit_text(s.unit);
}

// "quasi-permanent" → "Quasi-permanent load": the code's name for the
// load of its long-term checks.
std::string long_term_load_label(const LoadTotals& loads) {
  std::string name = loads.long_term_load_name.empty() ? "long-term" : loads.long_term_load_name;
  if (name[0] >= 'a' && name[0] <= 'z') name[0] = static_cast<char>(name[0] - 'a' + 'A');
  return name + " load";
}

// The superimposed dead load of the shorthand loads.dead_kPa (0: none).
double shorthand_dead_MPa(const DesignRecord& r) {
  for (const auto& a : r.actions)
    if (a.source == ActionSource::shorthand && !is_variable(a.kind)) return a.value;
  return 0.0;
}

// The defaults the design took for fields the request left out: the
// kernel's own (variant, strip width, superimposed dead load,
// redistribution), then the code's (defaults_used), each field once.
std::vector<InputDefault> defaults_left_out(const DesignRecord& r, const json& request) {
  const RecordUnits u = units_of(r);
  std::vector<InputDefault> all{
      {"variant", r.code.variant, "the code's default variant"},
      {"slab.strip_width_mm", u.length(r.strip_width_mm), "armature default"},
      {"loads.dead_kPa", u.load(shorthand_dead_MPa(r)), "armature default (no superimposed dead load)"},
      {"design.redistribution_percent", n4(r.redistribution_percent) + " %", "armature default"}};
  // A code's own value for a kernel field (its practice) takes the
  // kernel's place.
  for (auto& d : all)
    for (const auto& c : r.defaults_used)
      if (c.field == d.field) d = c;
  all.insert(all.end(), r.defaults_used.begin(), r.defaults_used.end());
  std::vector<InputDefault> out;
  for (auto& d : all) {
    if (request_gives(request, d.field)) continue;
    if (std::any_of(out.begin(), out.end(), [&](const InputDefault& o) { return o.field == d.field; })) continue;
    out.push_back(std::move(d));
  }
  return out;
}

// A check's demand or capacity: noise beside the larger of the two is 0.
std::string check_number(const RecordUnits& u, const Check& c, double v) {
  const double demand = u.check_value(c.demand, c.unit).first, capacity = u.check_value(c.capacity, c.unit).first;
  return n4(u.check_value(v, c.unit).first, std::max(std::abs(demand), std::abs(capacity)));
}
std::string check_unit(const RecordUnits& u, const Check& c) { return u.check_value(0.0, c.unit).second; }

const char* outcome(const Check& c) { return c.pass ? "satisfied" : "NOT SATISFIED"; }

struct Part {
  std::string title;           // "span 1 — bottom steel"
  const RegionRecord* region;  // or null
  std::vector<const Check*> checks;
};

std::vector<Part> parts_of(const DesignRecord& r) {
  std::vector<Part> parts;
  for (const auto& g : r.regions) {
    Part p{g.where + (g.direction != BarDirection::span ? std::string(", bars in ") + to_string(g.direction) : "") +
               (g.face == Face::bottom ? ": bottom steel (sagging)" : ": top steel (hogging)"),
           &g, {}};
    for (const auto& c : g.checks) p.checks.push_back(&c);
    parts.push_back(std::move(p));
  }
  for (const auto& s : r.supports) {
    Part p{s.where + ": shear at the support", nullptr, {}};
    for (const auto& c : s.checks) p.checks.push_back(&c);
    parts.push_back(std::move(p));
  }
  for (const auto& s : r.spans) {
    if (s.checks.empty()) continue;
    Part p{s.where + ": span checks", nullptr, {}};
    for (const auto& c : s.checks) p.checks.push_back(&c);
    parts.push_back(std::move(p));
  }
  for (const auto& col : r.columns) {
    Part p{col.name + ": punching, reaction " + n4(col.V_Ed_N * 1e-3) + " kN" +
               (col.M_x_Nmm ? ", moments taken " + n4(*col.M_x_Nmm * 1e-6) + " kNm (x), " + n4(*col.M_y_Nmm * 1e-6) +
                                  " kNm (y)"
                            : ", the column free to turn (no moment by the analysis)") +
               (col.regular_spans ? "; braced, adjacent spans within 25 %" : ""),
           nullptr, {}};
    for (const auto& c : col.punching.checks) p.checks.push_back(&c);
    parts.push_back(std::move(p));
  }
  return parts;
}

// ---- SVG --------------------------------------------------------------------
struct Frame {
  double width = 660, height = 190, pad_x = 30, pad_y = 28;
  double length = 1;   // mm
  double extent = 1;   // largest |value|
  double sx(double x_mm) const { return pad_x + (width - 2 * pad_x) * x_mm / length; }
  // Value axis: `down` positive draws positive values below the axis.
  double sy(double v, bool down) const {
    const double half = (height - 2 * pad_y) / 2;
    return pad_y + half + (down ? 1 : -1) * half * v / extent;
  }
};

std::string polyline(const std::vector<std::pair<double, double>>& pts, const char* style) {
  std::string o = "<polyline fill=\"none\" " + std::string(style) + " points=\"";
  for (const auto& [x, y] : pts) o += n4(x) + "," + n4(y) + " ";
  return o + "\"/>";
}

std::string supports_svg(const DesignRecord& r, const Frame& f) {
  std::string o;
  double x = 0;
  const double y0 = f.sy(0, true);
  for (std::size_t j = 0; j <= r.spans_mm.size(); ++j) {
    const bool free = (j == 0 && r.ends[0] == EndSupport::free) ||
                      (j == r.spans_mm.size() && r.ends[1] == EndSupport::free);
    const bool fixed = (j == 0 && r.ends[0] == EndSupport::fixed) ||
                       (j == r.spans_mm.size() && r.ends[1] == EndSupport::fixed);
    const double px = f.sx(x);
    if (fixed)
      o += "<line x1=\"" + n4(px) + "\" y1=\"" + n4(y0 - 9) + "\" x2=\"" + n4(px) + "\" y2=\"" +
           n4(y0 + 9) + "\" stroke=\"#000\" stroke-width=\"3\"/>";
    else if (!free)
      o += "<polygon points=\"" + n4(px) + "," + n4(y0) + " " + n4(px - 5) + "," + n4(y0 + 8) + " " +
           n4(px + 5) + "," + n4(y0 + 8) + "\" fill=\"none\" stroke=\"#000\"/>";
    if (j < r.spans_mm.size()) x += r.spans_mm[j];
  }
  return o;
}

std::string diagram_svg(const DesignRecord& r, bool moment) {
  Frame f;
  for (double L : r.spans_mm) f.length += L;
  f.length -= 1;
  f.extent = 1e-9;
  for (const auto& span : r.diagrams)
    for (const auto& p : span)
      f.extent = std::max({f.extent, std::abs(moment ? p.M_max : p.V_max),
                           std::abs(moment ? p.M_min : p.V_min)});
  const bool down = moment;  // sagging drawn below the axis, on the tension side
  std::string o = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + n4(f.width) + "\" height=\"" +
                  n4(f.height) + "\" viewBox=\"0 0 " + n4(f.width) + " " + n4(f.height) +
                  "\" font-family=\"Georgia, serif\" font-size=\"10\" role=\"img\" aria-label=\"" +
                  (moment ? "bending moment envelope" : "shear force envelope") + "\">";
  const RecordUnits u = units_of(r);
  o += "<text x=\"4\" y=\"12\">" +
       (moment ? "Bending moment envelope, " + std::string(u.moment_u()) + " (sagging below the axis)"
               : "Shear force envelope, " + std::string(u.force_u())) +
       "</text>";
  o += "<line x1=\"" + n4(f.sx(0)) + "\" y1=\"" + n4(f.sy(0, down)) + "\" x2=\"" + n4(f.sx(f.length)) +
       "\" y2=\"" + n4(f.sy(0, down)) + "\" stroke=\"#000\" stroke-width=\"1.2\"/>";
  o += supports_svg(r, f);
  for (const auto& span : r.diagrams) {
    std::vector<std::pair<double, double>> hi, lo;
    for (const auto& p : span) {
      hi.push_back({f.sx(p.x_mm), f.sy(moment ? p.M_max : p.V_max, down)});
      lo.push_back({f.sx(p.x_mm), f.sy(moment ? p.M_min : p.V_min, down)});
    }
    o += polyline(hi, "stroke=\"#000\" stroke-width=\"1\"");
    o += polyline(lo, "stroke=\"#000\" stroke-width=\"1\" stroke-dasharray=\"4 2\"");
  }
  if (moment) {
    for (const auto& g : r.regions) {
      const double v = g.face == Face::bottom ? g.M_Ed : -g.M_Ed;
      const double px = f.sx(g.x_mm), py = f.sy(v, down);
      o += "<circle cx=\"" + n4(px) + "\" cy=\"" + n4(py) + "\" r=\"2.5\" fill=\"#000\"/>";
      o += "<text x=\"" + n4(px + 3) + "\" y=\"" + n4(g.face == Face::bottom ? py + 12 : py - 5) +
           "\">" + esc(n4(u.moment_v(g.M_Ed))) + "</text>";
    }
  } else {
    for (const auto& s : r.supports) {
      const std::size_t j = static_cast<std::size_t>(std::stoi(s.where.substr(8))) - 1;
      double x = 0;
      for (std::size_t k = 0; k < j && k < r.spans_mm.size(); ++k) x += r.spans_mm[k];
      const double px = f.sx(x), py = f.sy(s.V_Ed, down);
      o += "<circle cx=\"" + n4(px) + "\" cy=\"" + n4(py) + "\" r=\"2.5\" fill=\"#000\"/>";
      o += "<text x=\"" + n4(px + 3) + "\" y=\"" + n4(py - 4) + "\">" + esc(n4(u.force_v(s.V_Ed))) + "</text>";
    }
  }
  o += "<text x=\"4\" y=\"" + n4(f.height - 4) + "\">solid: largest, dashed: smallest of " +
       std::to_string(r.load_cases) +
       " load cases; dots: design values</text>";
  return o + "</svg>";
}

// ---- Detailing ----------------------------------------------------------------
// The strip in elevation, lengths to scale: the slab's outline, the
// supports, every main bar as a line with its mark (bottom bars below the
// slab's middle, top bars above, each on a row of its own so they read
// apart), a bent end as a short leg towards the slab (its length not to
// scale), laps drawn heavy, distribution bars as a row of dots each.
std::string detailing_svg(const DesignRecord& r, const DetailingRecord& d, std::size_t which) {
  const RecordUnits u = units_of(r);
  const DetailingStrip& strip = d.strips[which];
  double length = 0.0;
  for (double s : strip.spans_mm) length += s;
  std::vector<const DetailedBar*> bars;
  for (const auto& b : d.bars)
    if (b.strip == static_cast<int>(which)) bars.push_back(&b);
  double lo = 0.0, hi = length;
  for (const DetailedBar* b : bars)
    if (!b->distribution) lo = std::min(lo, b->start_mm), hi = std::max(hi, b->end_mm);
  const double width = 660, pad = 30, row = 13;
  std::size_t tops = 0, bottoms = 0;
  for (const DetailedBar* b : bars)
    if (!b->distribution) (b->face == Face::top ? tops : bottoms) += 1;
  const double slab_top = 24 + row * static_cast<double>(tops + 1), slab_h = 22;
  const double height = slab_top + slab_h + row * static_cast<double>(bottoms + 1) + 34;
  auto sx = [&](double x) { return pad + (width - 2 * pad) * (x - lo) / (hi - lo); };
  std::string o = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + n4(width) + "\" height=\"" + n4(height) +
                  "\" viewBox=\"0 0 " + n4(width) + " " + n4(height) +
                  "\" font-family=\"Georgia, serif\" font-size=\"10\" role=\"img\" aria-label=\"bar layout in elevation\">";
  o += "<text x=\"4\" y=\"12\">" + (strip.name.empty() ? std::string("Bars") : esc(strip.name) + ": bars") +
       " in elevation, lengths to scale (" + std::string(u.along_u()) + "); marks at each bar, laps heavy</text>";
  o += "<rect x=\"" + n4(sx(0)) + "\" y=\"" + n4(slab_top) + "\" width=\"" + n4(sx(length) - sx(0)) +
       "\" height=\"" + n4(slab_h) + "\" fill=\"none\" stroke=\"#000\" stroke-width=\"1\"/>";
  double x = 0.0;
  for (std::size_t j = 0; j <= strip.spans_mm.size(); ++j) {
    const bool free = (j == 0 && strip.ends[0] == EndSupport::free) ||
                      (j == strip.spans_mm.size() && strip.ends[1] == EndSupport::free);
    if (!free) {
      const double px = sx(x), py = slab_top + slab_h;
      o += "<polygon points=\"" + n4(px) + "," + n4(py) + " " + n4(px - 5) + "," + n4(py + 8) + " " + n4(px + 5) +
           "," + n4(py + 8) + "\" fill=\"none\" stroke=\"#000\"/>";
    }
    if (j < strip.spans_mm.size()) x += strip.spans_mm[j];
  }
  std::size_t t = 0, bt = 0;
  for (const DetailedBar* bp : bars) {
    const DetailedBar& b = *bp;
    if (b.distribution) continue;
    const double y = b.face == Face::top ? slab_top - row * static_cast<double>(++t) + 4
                                         : slab_top + slab_h + row * static_cast<double>(++bt) + 6;
    o += "<line x1=\"" + n4(sx(b.start_mm)) + "\" y1=\"" + n4(y) + "\" x2=\"" + n4(sx(b.end_mm)) + "\" y2=\"" +
         n4(y) + "\" stroke=\"#000\" stroke-width=\"1\"/>";
    const double leg_dy = b.face == Face::top ? 8.0 : -8.0;  // towards the slab
    for (const auto& [x_end, leg] : {std::pair{b.start_mm, b.leg_start_mm}, std::pair{b.end_mm, b.leg_end_mm}})
      if (leg > 0.0)
        o += "<line x1=\"" + n4(sx(x_end)) + "\" y1=\"" + n4(y) + "\" x2=\"" + n4(sx(x_end)) + "\" y2=\"" +
             n4(y + leg_dy) + "\" stroke=\"#000\" stroke-width=\"1\"/>";
    for (const auto& l : b.laps)
      o += "<line x1=\"" + n4(sx(l.from_mm)) + "\" y1=\"" + n4(y) + "\" x2=\"" + n4(sx(l.to_mm)) + "\" y2=\"" + n4(y) +
           "\" stroke=\"#000\" stroke-width=\"3\"/>";
    o += "<text x=\"" + n4(sx(b.start_mm) + 2) + "\" y=\"" + n4(y - 2) + "\">" + esc(b.mark) + "</text>";
  }
  // Distribution bars: dots spread over their extent (at most 60 a set), inside the main bars.
  for (const DetailedBar* bp : bars) {
    const DetailedBar& b = *bp;
    if (!b.distribution || b.count < 1) continue;
    const double y = b.face == Face::top ? slab_top + 4 : slab_top + slab_h - 4;
    const int dots = std::min(b.count, 60);
    for (int k = 0; k < dots; ++k) {
      const double xx = dots == 1 ? b.along_from_mm
                                  : b.along_from_mm + (b.along_to_mm - b.along_from_mm) * k / (dots - 1);
      o += "<circle cx=\"" + n4(sx(xx)) + "\" cy=\"" + n4(y) + "\" r=\"1.2\" fill=\"#000\"/>";
    }
  }
  o += "<text x=\"4\" y=\"" + n4(height - 4) + "\">strip " + esc(u.along(length)) +
       " between its ends; dots: distribution bars (marks in the table)" +
       (std::any_of(bars.begin(), bars.end(), [](const DetailedBar* b) { return b->shape != "straight"; })
            ? "; short ticks: bent ends"
            : "") +
       "</text>";
  return o + "</svg>";
}

std::string detail_position(const RecordUnits& u, double mm) { return n4(u.along_v(mm)); }

// The bar's place in the tables: its region, and on a two-way slab its
// direction and the band across it.
std::string detail_where(const RecordUnits& u, const DetailedBar& b) {
  std::string w = b.where + (b.curtailed ? " (curtailed)" : "");
  if (b.direction != BarDirection::span && !b.distribution)
    w += std::string(", in ") + to_string(b.direction) + ", across " + detail_position(u, b.across_from_mm) +
         (b.across_to_mm != b.across_from_mm ? " to " + detail_position(u, b.across_to_mm) : std::string()) + " " +
         u.along_u();
  return w;
}

// The widths the counts are over.
std::string detail_widths(const RecordUnits& u, const DetailingRecord& d) {
  return d.plan ? std::string("Counts over each row's or column's width on the plan")
                : "Slab width " + u.along(d.slab_width_mm);
}

// A schedule row's shape, with its mandrel where wider than the standard.
std::string shape_text(const ScheduleRow& row) {
  return row.shape + (row.bend_diameter_mm > 0.0 ? ", bent on " + n4(row.bend_diameter_mm) + " mm" : std::string());
}

std::string detailing_html(const DesignRecord& r, const DetailingRecord& d) {
  const RecordUnits u = units_of(r);
  std::string o = "<h3>Detailing: bars, laps and schedule</h3>\n";
  o += "<p>" + esc(detail_widths(u, d)) + ", stock length " + esc(u.along(d.stock_length_mm)) +
       "; each bar covers the moment envelope (with a cantilever's EQU cases) past its zero points by the shift "
       "and the anchorage.</p>\n";
  for (std::size_t k = 0; k < d.strips.size(); ++k) o += detailing_svg(r, d, k) + "\n";
  if (d.plan)
    o += "<p>Each row of bays (bars in x) and column of bays (bars in y), or each design strip of a flat slab, in "
         "elevation, positions from grid line x0 or y0; corner, free-edge and band bars in the table only.</p>\n";
  o += "<table>\n<tr><th>mark</th><th>where</th><th>face</th><th>bar</th><th class=\"num\">count</th><th "
       "class=\"num\">from, " + std::string(u.along_u()) + "</th><th class=\"num\">to, " + u.along_u() +
       "</th><th class=\"num\">length, mm</th><th>anchorage, mm (start, end)</th><th>laps</th></tr>\n";
  for (const auto& b : d.bars) {
    std::string laps;
    for (const auto& l : b.laps)
      laps += (laps.empty() ? "" : "; ") + detail_position(u, l.from_mm) + " to " + detail_position(u, l.to_mm);
    o += "<tr><td>" + esc(b.mark) + "</td><td>" + esc(detail_where(u, b)) + "</td><td>" +
         (b.face == Face::top ? "top" : "bottom") +
         "</td><td>" + esc(u.bars({b.bar, b.diameter_mm, b.spacing_mm, 0.0})) + "</td><td class=\"num\">" +
         std::to_string(b.count) + "</td><td class=\"num\">" +
         detail_position(u, b.distribution ? b.along_from_mm : b.start_mm) + "</td><td class=\"num\">" +
         detail_position(u, b.distribution ? b.along_to_mm : b.end_mm) + "</td><td class=\"num\">" + n4(b.length_mm) +
         "</td><td>" + (b.distribution ? std::string("across the strip") : n4(b.anchorage_start_mm) + ", " +
                                                                            n4(b.anchorage_end_mm)) +
         "</td><td>" + esc(laps.empty() ? "none" : laps) + "</td></tr>\n";
  }
  o += "</table>\n<h4>Bar schedule</h4>\n<table>\n<tr><th>mark</th><th>bar</th><th class=\"num\">count</th><th "
       "class=\"num\">length, mm</th><th>shape</th><th class=\"num\">mass, kg</th></tr>\n";
  for (const auto& row : d.schedule)
    o += "<tr><td>" + esc(row.mark) + "</td><td>" + esc(row.bar) + "</td><td class=\"num\">" + std::to_string(row.count) +
         "</td><td class=\"num\">" + n4(row.length_mm) + "</td><td>" + esc(shape_text(row)) + "</td><td class=\"num\">" +
         n4(row.mass_kg) + "</td></tr>\n";
  o += "</table>\n<p>Total " + n4(d.total_mass_kg) + " kg, " + n4(d.mass_per_area_kg_m2) +
       " kg/m² of floor (0.00617 d² kg/m, common practice).</p>\n";
  for (const auto& dv : d.derivations) {
    o += "<div class=\"check\">\n<h4>" + esc(dv.what) + " of " + esc(dv.where) + ": " + esc(dv.length.clause) +
         "</h4>\n<table class=\"steps\">\n";
    for (const auto& s : dv.length.steps) {
      const std::string ex = expression_of(s), sub = substitution(s);
      o += "<tr><td>" + esc(s.symbol) + "</td><td>" + (ex.empty() ? "" : "= " + esc(ex)) + "</td><td>" +
           (sub.empty() ? "" : "= " + esc(sub)) + "</td><td class=\"num\">= " + esc(n4(s.result) + unit_text(s.unit)) +
           "</td><td class=\"clause\">" + esc(s.clause) + "</td></tr>\n";
    }
    o += "</table>\n</div>\n";
  }
  return o;
}

std::string detailing_markdown(const DesignRecord& r, const DetailingRecord& d) {
  const RecordUnits u = units_of(r);
  std::string o = "\n### Detailing: bars, laps and schedule\n\n" + detail_widths(u, d) +
                  ", stock length " + u.along(d.stock_length_mm) +
                  "; each bar covers the moment envelope (with a cantilever's EQU cases) past its zero points by "
                  "the shift and the anchorage.\n\n| mark | where | face | bar | count | from, " +
                  std::string(u.along_u()) + " | to, " + u.along_u() + " | length, mm | anchorage, mm | laps |\n"
                  "|---|---|---|---|---:|---:|---:|---:|---|---|\n";
  for (const auto& b : d.bars) {
    std::string laps;
    for (const auto& l : b.laps)
      laps += (laps.empty() ? "" : "; ") + detail_position(u, l.from_mm) + " to " + detail_position(u, l.to_mm);
    o += "| " + b.mark + " | " + detail_where(u, b) + " | " +
         (b.face == Face::top ? "top" : "bottom") + " | " +
         u.bars({b.bar, b.diameter_mm, b.spacing_mm, 0.0}) + " | " + std::to_string(b.count) + " | " +
         detail_position(u, b.distribution ? b.along_from_mm : b.start_mm) + " | " +
         detail_position(u, b.distribution ? b.along_to_mm : b.end_mm) + " | " + n4(b.length_mm) + " | " +
         (b.distribution ? std::string("across the strip") : n4(b.anchorage_start_mm) + ", " + n4(b.anchorage_end_mm)) +
         " | " + (laps.empty() ? "none" : laps) + " |\n";
  }
  o += "\n**Bar schedule**\n\n| mark | bar | count | length, mm | shape | mass, kg |\n|---|---|---:|---:|---|---:|\n";
  for (const auto& row : d.schedule)
    o += "| " + row.mark + " | " + row.bar + " | " + std::to_string(row.count) + " | " + n4(row.length_mm) + " | " +
         shape_text(row) + " | " + n4(row.mass_kg) + " |\n";
  o += "\nTotal " + n4(d.total_mass_kg) + " kg, " + n4(d.mass_per_area_kg_m2) +
       " kg/m² of floor (0.00617 d² kg/m, common practice).\n";
  for (const auto& dv : d.derivations) {
    o += "\n**" + dv.what + " of " + dv.where + "** (" + dv.length.clause + ")\n\n";
    for (const auto& s : dv.length.steps)
      o += "- " + step_line(s) + (s.clause.empty() ? "" : " (" + s.clause + ")") + "\n";
  }
  return o;
}

// Cross-section of the strip, to scale, with the region's bars.
// Long-term curvature (1/km) or deflection along the spans whose
// deflection the code calculates, in the style of the envelopes: sagging
// curvature and downward deflection drawn below the axis.
std::string deflection_svg(const DesignRecord& r, bool curvature) {
  Frame f;
  for (double L : r.spans_mm) f.length += L;
  f.length -= 1;
  f.extent = 1e-12;
  for (const auto& d : r.deflection_diagrams)
    for (const auto& p : d.span.points)
      f.extent = std::max(f.extent, std::abs(curvature ? p.curvature : p.deflection_mm));
  const RecordUnits u = units_of(r);
  std::string o = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + n4(f.width) + "\" height=\"" +
                  n4(f.height) + "\" viewBox=\"0 0 " + n4(f.width) + " " + n4(f.height) +
                  "\" font-family=\"Georgia, serif\" font-size=\"10\" role=\"img\" aria-label=\"" +
                  (curvature ? "long-term curvature" : "long-term deflection") + "\">";
  o += "<text x=\"4\" y=\"12\">" +
       (curvature ? std::string("Long-term curvature, 1/km (sagging below the axis)")
                  : "Long-term deflection, " + std::string(u.length_u()) + " (downward below the axis)") +
       "</text>";
  o += "<line x1=\"" + n4(f.sx(0)) + "\" y1=\"" + n4(f.sy(0, true)) + "\" x2=\"" + n4(f.sx(f.length)) +
       "\" y2=\"" + n4(f.sy(0, true)) + "\" stroke=\"#000\" stroke-width=\"1.2\"/>";
  o += supports_svg(r, f);
  for (const auto& d : r.deflection_diagrams) {
    std::vector<std::pair<double, double>> pts;
    for (const auto& p : d.span.points)
      pts.push_back({f.sx(d.x0_mm + p.x_mm), f.sy(curvature ? p.curvature : p.deflection_mm, true)});
    o += polyline(pts, "stroke=\"#000\" stroke-width=\"1\"");
    if (!curvature) {
      const double px = f.sx(d.x0_mm + d.span.x_at_mm), py = f.sy(d.span.max_mm, true);
      o += "<circle cx=\"" + n4(px) + "\" cy=\"" + n4(py) + "\" r=\"2.5\" fill=\"#000\"/>";
      o += "<text x=\"" + n4(px + 3) + "\" y=\"" + n4(py + 12) + "\">" + esc(n4(u.length_v(d.span.max_mm))) +
           "</text>";
    }
  }
  o += "<text x=\"" + n4(4) + "\" y=\"" + n4(f.height - 4) + "\">" +
       (curvature ? std::string("the long-term load on every span, ζ at every section, shrinkage included")
                  : std::string("double integration of the curvature between the supports; dots: largest")) +
       "</text>";
  return o + "</svg>";
}

std::string section_svg(const DesignRecord& r, const RegionRecord& g) {
  const double b = r.strip_width_mm, h = r.thickness_mm;
  const double scale = std::min(500.0 / b, 160.0 / h);
  const double W = b * scale, H = h * scale, ox = 60, oy = 24;
  const double phi = g.bars.diameter_mm, c = g.cover_mm;
  const double yc = g.face == Face::bottom ? h - c - phi / 2 : c + phi / 2;  // bar centre from top
  std::string o = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + n4(W + 200) + "\" height=\"" +
                  n4(H + 48) + "\" font-family=\"Georgia, serif\" font-size=\"10\" role=\"img\" "
                  "aria-label=\"cross-section of the strip at " + esc(g.where) + "\">";
  o += "<rect x=\"" + n4(ox) + "\" y=\"" + n4(oy) + "\" width=\"" + n4(W) + "\" height=\"" + n4(H) +
       "\" fill=\"none\" stroke=\"#000\" stroke-width=\"1.2\"/>";
  for (double x = g.bars.spacing_mm / 2; x < b; x += g.bars.spacing_mm)
    o += "<circle cx=\"" + n4(ox + x * scale) + "\" cy=\"" + n4(oy + yc * scale) + "\" r=\"" +
         n4(std::max(phi / 2 * scale, 1.5)) + "\" fill=\"#000\"/>";
  const double xd = ox + W + 12;
  const double face_y = g.face == Face::bottom ? oy : oy + H;  // compression face
  const double bar_y = oy + yc * scale;
  const double tension_face = g.face == Face::bottom ? oy + H : oy;
  o += "<line x1=\"" + n4(xd) + "\" y1=\"" + n4(face_y) + "\" x2=\"" + n4(xd) + "\" y2=\"" + n4(bar_y) +
       "\" stroke=\"#000\"/>";
  const RecordUnits u = units_of(r);
  o += "<text x=\"" + n4(xd + 4) + "\" y=\"" + n4((face_y + bar_y) / 2 + 3) + "\">d = " + u.length(g.d_mm) +
       "</text>";
  const double bar_face = oy + (g.face == Face::bottom ? h - c : c) * scale;
  o += "<line x1=\"" + n4(xd + 60) + "\" y1=\"" + n4(tension_face) + "\" x2=\"" + n4(xd + 60) +
       "\" y2=\"" + n4(bar_face) + "\" stroke=\"#000\" stroke-width=\"2\"/>";
  o += "<text x=\"" + n4(xd + 66) + "\" y=\"" + n4((tension_face + bar_face) / 2 + 3) + "\">cover " +
       u.length(c) + "</text>";
  o += "<text x=\"" + n4(ox) + "\" y=\"14\">b = " + u.length(b) + ", h = " + u.length(h) + ", bars " +
       esc(u.bars(g.bars)) + " (" +
       (g.face == Face::bottom ? "bottom" : "top") + "), to scale</text>";
  o += "<text x=\"4\" y=\"" + n4(oy + H / 2 + 3) + "\">h = " + n4(u.length_v(h)) + "</text>";
  return o + "</svg>";
}

// ---- two-way slabs ---------------------------------------------------------------
// What the record says of a plate where a strip's text would not fit.

const char* record_heading(const DesignRecord& r) {
  return r.plate ? "Calculation record: two-way slab" : "Calculation record: one-way slab strip";
}

std::string plate_slab_text(const DesignRecord& r) {
  const PlateRecord& p = *r.plate;
  const RecordUnits u = units_of(r);
  std::string t = std::to_string(p.x_lines_mm.size() - 1) + " × " + std::to_string(p.y_lines_mm.size() - 1) +
                  " bays; x spans ";
  for (std::size_t i = 0; i + 1 < p.x_lines_mm.size(); ++i)
    t += (i ? ", " : "") + u.along(p.x_lines_mm[i + 1] - p.x_lines_mm[i]);
  t += "; y spans ";
  for (std::size_t j = 0; j + 1 < p.y_lines_mm.size(); ++j)
    t += (j ? ", " : "") + u.along(p.y_lines_mm[j + 1] - p.y_lines_mm[j]);
  if (p.flat) {
    auto edge = [&](std::size_t k) { return p.column_edges[k] ? "columns" : "wall"; };
    t += "; flat slab on columns" +
         (r.columns.empty() ? std::string() : " " + u.length(r.columns.front().cx_mm) + " × " + u.length(r.columns.front().cy_mm)) +
         " at the grid intersections; edges x0 " + edge(0) + ", x1 " + edge(1) + ", y0 " + edge(2) + ", y1 " + edge(3) +
         " (on columns the slab ends flush with their outer faces); plan positions from grid lines x0, y0";
  } else {
    t += "; edges x0 " + std::string(to_string(p.edges[0])) + ", x1 " + to_string(p.edges[1]) + ", y0 " +
         to_string(p.edges[2]) + ", y1 " + to_string(p.edges[3]);
  }
  t += "; h = " + u.length(r.thickness_mm) + "; every result per metre width";
  return t;
}

// The corner zones, where the code sets corner bars.
std::string corner_text(const DesignRecord& r) {
  const PlateRecord& p = *r.plate;
  if (p.corners.empty()) return "";
  const RecordUnits u = units_of(r);
  std::string t = " Corners held down where two pinned edges meet (" + p.corners.front().clause + "): ";
  for (std::size_t k = 0; k < p.corners.size(); ++k) {
    const auto& c = p.corners[k];
    t += (k ? "; " : "") + c.name + " of " + c.bay + ", " + u.along(c.x1_mm - c.x0_mm) + " × " +
         u.along(c.y1_mm - c.y0_mm);
  }
  const bool bottom = std::any_of(r.regions.begin(), r.regions.end(), [&](const RegionRecord& g) {
    return g.face == Face::bottom && is_plate_corner_name(g.where);
  });
  return t + "; top" + (bottom ? " and bottom" : "") +
         " bars in x and y for the larger of the Wood–Armer moment in the zone and the code's share of the "
         "panel's largest sagging moment.";
}

// The reinforcement along free edges (the code's free-edge rule).
std::string free_edge_text(const DesignRecord& r) {
  const PlateRecord& p = *r.plate;
  const RecordUnits u = units_of(r);
  std::string t;
  for (const auto& f : p.free_edges)
    t += (t.empty() ? "" : " ") + f.edge + " of " + f.bay + ": U-bars " +
         bar_arrangement(f.u_bar, u.length_v(f.u_bar_spacing_mm), u.length_u()) +
         " (the bottom bars across the edge there, bent up), legs " + u.length(f.leg_mm) +
         " on each face; bar " + f.edge_bar + " along the edge in each face inside the U (" + f.clause + ").";
  if (t.empty() && !p.flat && std::find(p.edges.begin(), p.edges.end(), EndSupport::free) != p.edges.end())
    t = "The code sets no reinforcement rule of its own for a free edge: the bars as designed.";
  return t;
}

std::string plate_analysis_text(const DesignRecord& r) {
  const PlateRecord& p = *r.plate;
  if (p.flat)
    return "Linear-elastic Kirchhoff plate by finite elements (Bogner–Fox–Schmit rectangles, " +
           std::to_string(p.mesh_per_bay) + " per bay side, mesh lines through located loads and the columns' "
           "faces), Poisson's ratio " + n4(p.poisson_ratio) + "; each column a rigid patch of the slab that "
           "cannot move down and " +
           (p.columns_restrained ? std::string("turns against the columns above and below (4 E Ic / H each, far "
                                               "ends fixed, gross sections)")
                                 : std::string("is free to turn (no storey heights given)")) +
           "; walls as pinned line supports. " + std::to_string(p.arrangements) +
           " bay load arrangements of the code × the ULS combinations (" + std::to_string(r.load_cases) +
           " load cases, one factorisation). Strips (" + p.strip_clause + "): a column strip reaches a quarter "
           "of the lesser span of the panel on each side of its column line, the middle strip is the rest. "
           "Each strip's moment is the plate's mx (my) integrated over the strip's width: hogging at the "
           "column faces (the wall's line), the larger face; sagging the largest over the mesh lines of the span; "
           "per metre over the strip's width. An outer line where the slab is free to turn takes at least the "
           "code's partial-fixity fraction of the strip's end span." +
           (p.band_clause.empty() ? std::string()
                                  : " Over internal columns a band takes at least half the hogging of the whole "
                                    "panel width within 0.125 × each panel's width of the column line (" +
                                        p.band_clause + ").") +
           " Outer layers: bottom " + p.outer_layer[0] + ", top " + p.outer_layer[1] + ".";
  return "Linear-elastic Kirchhoff plate by finite elements (Bogner–Fox–Schmit rectangles, " +
         std::to_string(p.mesh_per_bay) + " per bay side, mesh lines through located loads), Poisson's ratio " +
         n4(p.poisson_ratio) + "; rigid line supports on every interior grid line; supported lines meeting hold "
         "the plate down (corners cannot lift). " + std::to_string(p.arrangements) +
         " bay load arrangements of the code × the ULS combinations (" + std::to_string(r.load_cases) +
         " load cases, one factorisation), enveloped at the mesh nodes. Design moments by Wood–Armer for bars in "
         "x and y: bottom mx + |mxy|, my + |mxy| and top −mx + |mxy|, −my + |mxy|, with the cases where one of "
         "them would be negative. Regions: per bay the largest bottom design moment in x and in y; per supported "
         "line segment the largest top design moment across the line (a pinned edge at least the code's "
         "partial-fixity fraction of the adjacent bay's). Outer layers: bottom " + p.outer_layer[0] + ", top " +
         p.outer_layer[1] + "." + corner_text(r);
}

// A flat slab's strips of one direction, one row each, to a common scale:
// the ULS envelope of each strip's moment per metre along it (largest
// solid, least dashed, sagging below the axis), the column lines ticked,
// each row's largest sagging and hogging printed; the caution at the foot.
std::string flat_strip_diagrams_svg(const DesignRecord& r, BarDirection dir) {
  const PlateRecord& p = *r.plate;
  const bool us = r.report_units == ReportUnits::US;
  const double to_unit = us ? 1e-3 / kN_per_kip : 1e-3;  // N·mm/mm → kNm/m or kip-ft/ft
  const std::string unit = us ? "kip-ft/ft" : "kNm/m";
  std::vector<const FlatStripRecord*> strips;
  double extent = 1e-9;
  for (const auto& s : p.strips)
    if (s.direction == dir && !s.envelope.empty()) {
      strips.push_back(&s);
      for (const auto& e : s.envelope) extent = std::max({extent, std::abs(e[1]), std::abs(e[2])});
    }
  if (strips.empty()) return "";
  const bool along_x = dir == BarDirection::x;
  const double lo = along_x ? p.outline_mm[0] : p.outline_mm[2], hi = along_x ? p.outline_mm[1] : p.outline_mm[3];
  const auto& lines = along_x ? p.x_lines_mm : p.y_lines_mm;
  const double width = 660, left = 150, right = 90, row = 70, top = 22;
  const double height = top + row * static_cast<double>(strips.size()) + 36;
  auto sx = [&](double v) { return left + (width - left - right) * (v - lo) / (hi - lo); };
  std::string o = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + n4(width) + "\" height=\"" + n4(height) +
                  "\" viewBox=\"0 0 " + n4(width) + " " + n4(height) +
                  "\" font-family=\"Georgia, serif\" font-size=\"10\" role=\"img\" aria-label=\"strip moments\">";
  o += "<text x=\"4\" y=\"12\">" + esc("Strips with bars in " + std::string(to_string(dir)) + ": ULS moment per metre, " +
                                          unit + ", along " + (along_x ? "x" : "y") + " (sagging below the axis)") +
       "</text>";
  for (std::size_t k = 0; k < strips.size(); ++k) {
    const FlatStripRecord& s = *strips[k];
    const double y0 = top + row * (static_cast<double>(k) + 0.5);
    auto sy = [&](double v) { return y0 + (row * 0.42) * v / extent; };  // sagging (positive) down
    o += "<text x=\"4\" y=\"" + n4(y0 + 3) + "\">" + esc(s.name) + "</text>";
    o += "<line x1=\"" + n4(sx(lo)) + "\" y1=\"" + n4(y0) + "\" x2=\"" + n4(sx(hi)) + "\" y2=\"" + n4(y0) +
         "\" stroke=\"#000\" stroke-width=\"0.8\"/>";
    for (double l : lines)
      o += "<line x1=\"" + n4(sx(l)) + "\" y1=\"" + n4(y0 - 4) + "\" x2=\"" + n4(sx(l)) + "\" y2=\"" + n4(y0 + 4) +
           "\" stroke=\"#777\" stroke-width=\"0.8\"/>";
    std::vector<std::pair<double, double>> hi_pts, lo_pts;
    double sag = 0.0, hog = 0.0;
    for (const auto& e : s.envelope) {
      hi_pts.push_back({sx(e[0]), sy(e[1])});
      lo_pts.push_back({sx(e[0]), sy(e[2])});
      sag = std::max(sag, e[1]);
      hog = std::min(hog, e[2]);
    }
    o += polyline(hi_pts, "stroke=\"#000\" stroke-width=\"1\"");
    o += polyline(lo_pts, "stroke=\"#000\" stroke-width=\"1\" stroke-dasharray=\"4 2\"");
    o += "<text x=\"" + n4(width - right + 6) + "\" y=\"" + n4(y0 - 6) + "\">" + esc("hog " + n4(-hog * 1e-3 * to_unit)) +
         "</text><text x=\"" + n4(width - right + 6) + "\" y=\"" + n4(y0 + 12) + "\">" +
         esc("sag " + n4(sag * 1e-3 * to_unit)) + "</text>";
  }
  // The caution in two lines at the foot.
  const std::string caution = std::string("Caution: ") + caution_text;
  std::size_t cut = caution.find(' ', caution.size() / 2);
  if (cut == std::string::npos) cut = caution.size();
  o += "<text x=\"4\" y=\"" + n4(height - 18) + "\" font-size=\"8\">" + esc(caution.substr(0, cut)) + "</text>";
  o += "<text x=\"4\" y=\"" + n4(height - 7) + "\" font-size=\"8\">" +
       esc(cut < caution.size() ? caution.substr(cut + 1) : std::string()) + "</text></svg>";
  return o;
}

// The plan (bays named with their bottom bars, the top bars marked at their
// design positions) and colour maps of the ULS envelope of mx and my and
// of the four Wood–Armer design moments, in the record's units (m or ft
// along; kNm/m or kip-ft/ft).
std::string plate_drawings_html(const DesignRecord& r) {
  const PlateRecord& p = *r.plate;
  const RecordUnits u = units_of(r);
  PlatePlan plan;
  // A flat slab reaches past its outer column lines: the outline's edges
  // bound the drawing, every column line inside it.
  auto lines_of = [&](const std::vector<double>& grid, double lo, double hi) {
    std::vector<double> out;
    if (lo < grid.front()) out.push_back(u.along_v(lo));
    for (double v : grid) out.push_back(u.along_v(v));
    if (hi > grid.back()) out.push_back(u.along_v(hi));
    return out;
  };
  plan.x_lines = lines_of(p.x_lines_mm, p.outline_mm[0], p.outline_mm[1]);
  plan.y_lines = lines_of(p.y_lines_mm, p.outline_mm[2], p.outline_mm[3]);
  plan.edges = {p.edges[0], p.edges[1], p.edges[2], p.edges[3]};
  plan.interior_lines_supported = !p.flat;
  for (const auto& c : p.columns)
    plan.columns.push_back({u.along_v(c.x_mm - c.cx_mm / 2), u.along_v(c.x_mm + c.cx_mm / 2),
                            u.along_v(c.y_mm - c.cy_mm / 2), u.along_v(c.y_mm + c.cy_mm / 2)});
  for (const auto& s : p.strips)
    if (s.column)
      for (const auto& q : s.pieces)
        plan.column_strips.push_back({u.along_v(q[0]), u.along_v(q[1]), u.along_v(q[2]), u.along_v(q[3])});
  // Every column's perimeters (column-centred in the outcome) and the
  // column whose punching check is the most utilised.
  double worst = -1.0;
  for (std::size_t k = 0; k < r.columns.size(); ++k) {
    const ColumnRecord& c = r.columns[k];
    for (const auto& per : c.punching.perimeters) {
      std::vector<std::array<double, 2>> pts;
      for (const auto& q : per.points) pts.push_back({u.along_v(c.x_mm + q[0]), u.along_v(c.y_mm + q[1])});
      plan.perimeters.push_back(std::move(pts));
    }
    for (const auto& chk : c.punching.checks)
      if (chk.utilisation > worst) {
        worst = chk.utilisation;
        plan.governing_column = k;
        plan.governing_label = c.name + ", " + chk.id + " " + n4(chk.utilisation);
      }
  }
  plan.length_unit = u.along_u();
  for (const auto& b : p.bays) {
    PlanBay bay{b.name, u.along_v(b.x0_mm), u.along_v(b.x1_mm), u.along_v(b.y0_mm), u.along_v(b.y1_mm)};
    for (const auto& g : r.regions) {
      if (g.where != b.name || g.face != Face::bottom) continue;
      (g.direction == BarDirection::x ? bay.bars_x : bay.bars_y) = u.bars(g.bars);
    }
    plan.bays.push_back(std::move(bay));
  }
  for (const auto& g : r.regions)
    if (g.face == Face::top && !p.flat)  // a flat slab's strips are tabled, not marked
      plan.marks.push_back({u.along_v(g.x_mm), u.along_v(g.y_mm), u.bars(g.bars) + " top " + to_string(g.direction),
                            g.direction == BarDirection::x});
  const bool us = r.report_units == ReportUnits::US;
  const std::string unit = us ? "kip-ft/ft" : "kNm/m";
  // N·mm/mm = 10⁻³ kNm/m; 1 kip-ft/ft = 1 kip · ft/ft in kNm/m = kN_per_kip.
  const double to_unit = us ? 1e-3 / kN_per_kip : 1e-3;
  auto map_of = [&](const std::vector<double>& values) {
    ScalarMap m;
    for (double x : p.field.x_mm) m.x.push_back(u.along_v(x));
    for (double y : p.field.y_mm) m.y.push_back(u.along_v(y));
    for (double v : values) m.values.push_back(v * to_unit);
    return m;
  };
  std::string o = "<h3>Plan and bars</h3>\n" + plate_plan_svg(plan) + "\n";
  if (p.flat) {
    o += "<h3>Strip moments (ULS envelope)</h3>\n<p>Each strip's moment integrated across its width at its "
         "sections (the column faces and the mesh lines between them), per metre of the strip; the regions "
         "take their design moments from these.</p>\n";
    for (const BarDirection d : {BarDirection::x, BarDirection::y}) o += flat_strip_diagrams_svg(r, d) + "\n";
    if (!p.top_extents.empty()) {
      o += "<h3>Top bars past the faces</h3>\n<p>" + esc(p.extents_clause) +
           ": the reach of each share of a top region's bars past the face of the column (the wall) into the span "
           "before the line and after it, from the clear spans.</p>\n<table>\n<tr><th>region</th><th>bars in</th>"
           "<th class=\"num\">share</th><th class=\"num\">before</th><th class=\"num\">after</th></tr>\n";
      for (const auto& e : p.top_extents)
        o += "<tr><td>" + esc(e.where) + "</td><td>" + to_string(e.direction) + "</td><td class=\"num\">" +
             esc(n4(e.share)) + "</td><td class=\"num\">" + esc(e.before_mm > 0.0 ? u.length(e.before_mm) : "–") +
             "</td><td class=\"num\">" + esc(e.after_mm > 0.0 ? u.length(e.after_mm) : "–") + "</td></tr>\n";
      o += "</table>\n";
    }
    if (!p.integrity.empty()) o += "<p>" + esc(p.integrity) + ".</p>\n";
    if (!p.transfers.empty()) {
      const std::string mu = us ? "kip-ft/ft" : "kNm/m";
      const double per_unit = to_unit;  // per metre / 1000 → kNm/m or kip-ft/ft
      o += "<h3>Bands for the moment the columns take</h3>\n<p>Top bars over each restrained column for the "
           "code's share of the moment the column takes from the slab (the analysis's ULS envelope), over the "
           "code's width: M_Ed = max(share × M / width, the column strip's moment there).</p>\n<table>\n"
           "<tr><th>region</th><th>bars in</th><th>clause</th><th class=\"num\">width</th><th class=\"num\">share"
           "</th><th class=\"num\">M column</th><th class=\"num\">share × M / width, " + mu +
           "</th><th class=\"num\">column strip, " + mu + "</th></tr>\n";
      for (const auto& t : p.transfers)
        o += "<tr><td>" + esc(t.where) + "</td><td>" + to_string(t.direction) + "</td><td>" + esc(t.clause) +
             "</td><td class=\"num\">" + esc(u.length(t.width_mm)) + "</td><td class=\"num\">" + esc(n4(t.share)) +
             "</td><td class=\"num\">" + esc(u.moment(t.M_column_Nmm)) + "</td><td class=\"num\">" +
             esc(n4(t.M_per_m_Nmm * 1e-3 * per_unit)) + "</td><td class=\"num\">" +
             esc(n4(t.M_strip_per_m_Nmm * 1e-3 * per_unit)) + "</td></tr>\n";
      o += "</table>\n";
    }
  }
  o += "<h3>Moment fields (ULS envelope)</h3>\n<p>Elastic moments per metre at the mesh nodes, the largest "
       "(most sagging) of the load cases, and the Wood–Armer design moments that the regions take their "
       "largest values from.</p>\n";
  const std::pair<const std::vector<double>*, const char*> maps[] = {
      {&p.field.mx_max, "mx, largest of the load cases"},
      {&p.field.my_max, "my, largest of the load cases"},
      {&p.field.bottom_x, "design moment, bottom bars in x (Wood–Armer)"},
      {&p.field.bottom_y, "design moment, bottom bars in y (Wood–Armer)"},
      {&p.field.top_x, "design moment, top bars in x (Wood–Armer)"},
      {&p.field.top_y, "design moment, top bars in y (Wood–Armer)"}};
  for (const auto& [values, title] : maps)
    if (!values->empty()) o += plate_map_svg(plan, map_of(*values), title, unit) + "\n";
  if (!p.long_term_deflection_mm.empty()) {
    o += "<h3>Calculated deflection</h3>\n<p>The deflection the long-term check of each panel reads, at the mesh "
         "nodes, from the plate solved with each element's cracked rigidity (every bay loaded): EN 1992-1-1 the "
         "long-term total; ACI 318-19 the part after attachment, λΔ Δ(D) + Δ(D + L) − Δ(D). Each panel's "
         "deflection checks give the states, the limits and the derivation.</p>\n";
    ScalarMap m;
    for (double x : p.field.x_mm) m.x.push_back(u.along_v(x));
    for (double y : p.field.y_mm) m.y.push_back(u.along_v(y));
    for (double v : p.long_term_deflection_mm) m.values.push_back(u.length_v(v));
    o += plate_map_svg(plan, m, "deflection of the long-term check, downward", u.length_u()) + "\n";
  }
  return o;
}

// Line reactions per segment (ULS envelope).
std::vector<std::pair<std::string, std::string>> plate_reaction_rows(const DesignRecord& r) {
  std::vector<std::pair<std::string, std::string>> out;
  for (const auto& l : r.plate->reactions)
    out.push_back({l.name, "largest " + n4(l.max_N_per_mm) + " kN/m, resultant up to " + n4(l.max_total_N * 1e-3) +
                               " kN"});
  return out;
}

// The rows a plate region adds: where, which layer, its depth derived.
std::vector<std::pair<std::string, std::string>> plate_region_rows(const DesignRecord& r, const RegionRecord& g) {
  const RecordUnits u = units_of(r);
  const std::size_t f = static_cast<std::size_t>(g.face);
  const bool outer = r.plate->outer_layer[f] == to_string(g.direction);
  std::vector<std::pair<std::string, std::string>> out{
      {"Bars run in", std::string(to_string(g.direction)) + ", " + (outer ? "outer" : "inner") + " layer of the " +
                          to_string(g.face) + " face"},
      {"Plan position", "x = " + u.along(g.x_mm) + ", y = " + u.along(g.y_mm)}};
  if (outer) {
    out.push_back({"d", "h − c − φ/2 = " + u.length(r.thickness_mm) + " − " + u.length(g.cover_mm) + " − " +
                            u.length(g.bars.diameter_mm / 2.0) + " = " + u.length(g.d_mm)});
  } else {
    const double phi_outer = r.thickness_mm - g.cover_mm - g.bars.diameter_mm / 2.0 - g.d_mm;
    out.push_back({"d", "h − c − φouter − φ/2 = " + u.length(r.thickness_mm) + " − " + u.length(g.cover_mm) + " − " +
                            u.length(phi_outer) + " − " + u.length(g.bars.diameter_mm / 2.0) + " = " +
                            u.length(g.d_mm) + " (φouter: the largest outer bar of the face)"});
  }
  return out;
}

// ---- shared content ------------------------------------------------------------
struct Title {
  std::vector<std::pair<std::string, std::string>> rows;
};

Title title_of(const DesignRecord& r, const json& request, const std::string& date) {
  Title t;
  auto add = [&](const std::string& k, const std::string& v) {
    if (!v.empty()) t.rows.push_back({k, v});
  };
  add("Project", r.project.name);
  add("Reference", r.project.reference);
  const RecordUnits u = units_of(r);
  std::string strip = std::to_string(r.spans_mm.size()) + (r.spans_mm.size() == 1 ? " span" : " spans") + ": ";
  for (std::size_t i = 0; i < r.spans_mm.size(); ++i) strip += (i ? ", " : "") + u.along(r.spans_mm[i]);
  strip += "; ends " + std::string(to_string(r.ends[0])) + " / " + to_string(r.ends[1]) + "; h = " +
           u.length(r.thickness_mm) + "; strip width " + u.length(r.strip_width_mm);
  if (r.plate) add("Slab", plate_slab_text(r));
  else add("Slab strip", strip);
  add("Design code", r.code.id + " (" + r.code.variant + "): " + r.code.title);
  if (u.us) add("Units", "US customary (the JSON result stays SI); derivations in the units of the code's edition");
  add("armature version", version_string());
  add("Date", date);
  add("Request fingerprint", request_fingerprint(request) + " (FNV-1a 64 of the request JSON)");
  add("Designer", r.project.designer.empty() ? "—" : r.project.designer);
  add("Checker", r.project.checker.empty() ? "—" : r.project.checker);
  add("Outcome", std::string(r.pass ? "every check satisfied" : "SOME CHECKS NOT SATISFIED") +
                     "; largest utilisation " + n4(r.max_utilisation) + " (" + r.governing_check + ", " +
                     r.governing_where + ")");
  return t;
}

// "imposed, category C, 4 kPa over the whole strip"
std::string action_text(const DesignRecord& r, const Action& a) {
  const RecordUnits u = units_of(r);
  // An imposed load of category H (roofs, EN 1991-1-1 Table 6.9) is a roof
  // load: where the code names the kinds, it takes the roof kind's name.
  const ActionKind named_kind =
      a.kind == ActionKind::imposed && a.category == "H" ? ActionKind::roof : a.kind;
  const std::string& kind_name = r.loads.action_kind_names[static_cast<std::size_t>(named_kind)];
  std::string t = kind_name.empty() ? std::string(to_string(a.kind)) : kind_name;
  // The category of EN 1991 (loads.imposed_category, an action's
  // category) only where the code does not name the kinds itself.
  if (!a.category.empty() && kind_name.empty()) t += ", category " + a.category;
  t += ", ";
  const std::string span = a.span ? "span " + std::to_string(*a.span + 1) : std::string();
  if (r.plate) {  // a two-way slab: over the slab, or placed in plan
    if (!a.plan_mm) return t + u.load(a.value) + " over the whole slab";
    const auto& p = *a.plan_mm;
    const std::string from = "(" + u.along(p[0]) + ", " + u.along(p[1]) + ")";
    const std::string to = "(" + u.along(p[2]) + ", " + u.along(p[3]) + ")";
    switch (a.distribution) {
      case Distribution::uniform: return t + u.load(a.value) + " on the patch " + from + " to " + to;
      case Distribution::line: return t + u.line(a.value) + " along the line " + from + " to " + to;
      case Distribution::point: return t + u.force(a.value) + " at " + from;
    }
  }
  switch (a.distribution) {
    case Distribution::uniform:
      t += u.load(a.value);
      if (!a.span) t += " over the whole strip";
      else if (!a.from_mm && !a.to_mm) t += " over " + span;
      else
        t += " on " + span + " from " + u.along(a.from_mm.value_or(0.0)) +
             (a.to_mm ? " to " + u.along(*a.to_mm) : std::string(" to its end"));
      break;
    case Distribution::line:
      t += u.line(a.value) + " across the strip, " + span + " at " + u.along(a.at_mm);
      break;
    case Distribution::point:
      t += u.force(a.value) + ", " + span + " at " + u.along(a.at_mm) + ", spread over " +
           u.along(a.effective_width_mm) + " (the strip takes P b/beff)";
      break;
  }
  return t;
}

// The factor on each action; permanent actions on unloaded spans where
// that differs; and the whole-strip uniform total on loaded spans.
std::string combination_text(const DesignRecord& r, const Combination& c) {
  std::string t;
  double uniform = 0.0;
  for (std::size_t i = 0; i < r.actions.size() && i < c.factors.size(); ++i) {
    const Action& a = r.actions[i];
    const ActionFactor& f = c.factors[i];
    if (!t.empty()) t += "; ";
    t += a.name + " × " + n4(f.loaded);
    if (!is_variable(a.kind) && f.unloaded != f.loaded)
      t += (c.limit_state == LimitState::equilibrium ? " (cantilever), × "
                                                     : r.plate ? " (loaded bays), × " : " (loaded spans), × ") +
           n4(f.unloaded) +
           (c.limit_state == LimitState::equilibrium ? " (back span)" : r.plate ? " (unloaded bays)" : " (unloaded spans)");
    if (a.distribution == Distribution::uniform && !a.span) uniform += f.loaded * a.value;
  }
  return t + "; uniform over the whole " + (r.plate ? "slab " : "strip ") + units_of(r).load(uniform);
}

std::vector<std::pair<std::string, std::string>> action_rows(const DesignRecord& r) {
  std::vector<std::pair<std::string, std::string>> rows;
  const RecordUnits u = units_of(r);
  rows.push_back({"Self-weight", "density × h = " + u.density(r.loads.density_kN_m3) + " × " +
                                     (u.us ? u.along(r.thickness_mm) : n4(r.thickness_mm / 1000) + " m") + " = " +
                                     u.load(r.loads.self_weight)});
  rows.push_back({r.loads.permanent_load_name.empty() ? "Gk (self-weight + superimposed)" : r.loads.permanent_load_name,
                  n4(u.load_v(r.loads.self_weight)) + " + " +
                      n4(u.load_v(r.loads.Gk - r.loads.self_weight), u.load_v(r.loads.Gk)) + " = " +
                      u.load(r.loads.Gk)});
  rows.push_back({r.loads.variable_load_name.empty() ? "Qk (imposed)" : r.loads.variable_load_name, u.load(r.loads.Qk)});
  for (const auto& a : r.actions) {
    if (a.source == ActionSource::self_weight) continue;
    rows.push_back({"Action: " + a.name, action_text(r, a)});
  }
  for (const auto& c : r.combinations) {
    // The code's label names the combination ("6.10: ...", "characteristic:
    // ...", "sustained: ...", "EQU: ..."); the row says which limit state
    // it serves where the label does not.
    const char* prefix = c.limit_state == LimitState::uls           ? "ULS "
                         : c.limit_state == LimitState::equilibrium ? ""
                                                                     : "SLS ";
    rows.push_back({prefix + c.label, combination_text(r, c)});
  }
  rows.push_back({"Governing ULS load", u.load(r.loads.uls) + " [" + r.loads.combination + "]"});
  rows.push_back({long_term_load_label(r.loads), u.load(r.loads.sls_quasi_permanent)});
  rows.push_back({"Load arrangements", std::to_string(r.load_arrangements) +
                                           " per ULS combination (code's pattern rules); " +
                                           std::to_string(r.load_cases) + " distinct load cases"});
  if (r.redistribution_percent > 0)
    rows.push_back({"Moment redistribution", n4(r.redistribution_percent) + " % at interior supports"});
  if (r.crack_width == CrackWidthMethod::calculated)
    rows.push_back({"Crack width", "calculated from the cracked section under the quasi-permanent moment, in "
                                   "place of the code's tables (serviceability.crack_width)"});
  return rows;
}

// Where a region's bars come from, when not from its own bar search.
std::string bars_source(const DesignRecord& r, const RegionRecord& g) {
  if (g.bars_given) return " (given: the request's bars, checked, not searched)";
  if (r.rationalise == Rationalise::uniform_bottom && g.face == Face::bottom)
    return r.plate ? " (one arrangement in " + std::string(to_string(g.direction)) +
                         " for every bay not given: reinforcement.rationalise uniform_bottom)"
                   : std::string(" (one arrangement for every span region not given: reinforcement.rationalise "
                                 "uniform_bottom)");
  return "";
}

std::vector<std::pair<std::string, std::string>> region_rows(const DesignRecord& r, const RegionRecord& g) {
  const RecordUnits u = units_of(r);
  if (r.plate) {  // per metre, in plan
    auto rows = plate_region_rows(r, g);
    for (auto& row : std::vector<std::pair<std::string, std::string>>{
             {"Design moment M_Ed", u.moment(g.M_Ed) + " per metre"},
             {"Cover", u.length(g.cover_mm)},
             {"As,req", u.area(g.As_req_mm2)},
             {"As,min", u.area(g.As_min_mm2)},
             {"As,max", u.area(g.As_max_mm2)},
             {"Bars", u.bars(g.bars) + ", As,prov = " + u.area(g.bars.As_prov_mm2) + bars_source(r, g)}})
      rows.push_back(std::move(row));
    return rows;
  }
  return {{"Design moment M_Ed", u.moment(g.M_Ed) + " at x = " + u.along(g.x_mm)},
          {"Cover", u.length(g.cover_mm)},
          {"Effective depth d", u.length(g.d_mm)},
          {"As,req", u.area(g.As_req_mm2)},
          {"As,min", u.area(g.As_min_mm2)},
          {"As,max", u.area(g.As_max_mm2)},
          {"Bars", u.bars(g.bars) + ", As,prov = " + u.area(g.bars.As_prov_mm2) + bars_source(r, g)}};
}

const char* css =
    "body{font-family:Georgia,'Times New Roman',serif;color:#000;background:#fff;max-width:180mm;"
    "margin:10mm auto;padding:0 4mm;font-size:10.5pt;line-height:1.35}"
    "h1{font-size:16pt;margin:0 0 4pt}h2{font-size:12.5pt;border-bottom:1pt solid #000;margin:16pt 0 6pt}"
    "h3{font-size:11pt;margin:12pt 0 4pt}h4{font-size:10.5pt;font-style:italic;margin:8pt 0 2pt}"
    "table{border-collapse:collapse;width:100%;margin:2pt 0 6pt}td,th{padding:1.5pt 4pt;text-align:left;"
    "vertical-align:top;border-bottom:0.5pt solid #aaa}th{border-bottom:1pt solid #000}"
    ".num{text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap}"
    ".title td{border:none;padding:1pt 4pt}.title td:first-child{width:34%;font-variant:small-caps}"
    ".caution{border:1pt solid #000;padding:4pt 6pt;margin:8pt 0}"
    ".steps td{border:none;padding:0.5pt 4pt}.steps td.clause{font-size:9pt;color:#333}"
    ".verdict{margin:2pt 0 8pt}.no{font-weight:bold;text-decoration:underline}"
    "svg{display:block;margin:4pt 0;max-width:100%;height:auto}"
    "@page{margin:12mm}@media print{body{margin:0 auto}h2,h3,h4{break-after:avoid}.check{break-inside:avoid}}";

std::string html_record(const DesignRecord& r, const json& request, const std::string& date) {
  const RecordUnits u = units_of(r);
  std::string o = "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>";
  o += esc("Calculation record: " + (r.project.reference.empty() ? r.code.id : r.project.reference)) +
       "</title>\n<style>" + css + "</style>\n</head>\n<body>\n";
  o += "<h1>" + std::string(record_heading(r)) + "</h1>\n<table class=\"title\">\n";
  for (const auto& [k, v] : title_of(r, request, date).rows)
    o += "<tr><td>" + esc(k) + "</td><td>" + esc(v) + "</td></tr>\n";
  o += "</table>\n<p class=\"caution\"><strong>Caution.</strong> " + esc(caution_text) + "</p>\n";

  o += "<h2>1 Inputs</h2>\n<table>\n<tr><th>field</th><th>value</th></tr>\n";
  std::vector<std::pair<std::string, std::string>> inputs;
  flatten(request, "", inputs);
  for (const auto& [k, v] : inputs) o += "<tr><td>" + esc(k) + "</td><td>" + esc(v) + "</td></tr>\n";
  o += "</table>\n<h3>Defaults used (fields the request left out)</h3>\n";
  const auto defaults = defaults_left_out(r, request);
  if (defaults.empty()) o += "<p>None.</p>\n";
  else {
    o += "<table>\n<tr><th>field</th><th>value used</th><th>from</th></tr>\n";
    for (const auto& d : defaults)
      o += "<tr><td>" + esc(d.field) + "</td><td>" + esc(d.value) + "</td><td>" + esc(d.basis) + "</td></tr>\n";
    o += "</table>\n";
  }

  o += "<h2>2 Actions and combinations</h2>\n<table>\n";
  for (const auto& [k, v] : action_rows(r)) o += "<tr><td>" + esc(k) + "</td><td>" + esc(v) + "</td></tr>\n";
  o += "</table>\n";

  if (r.plate) {
    o += "<h2>3 Analysis</h2>\n<p>" + esc(plate_analysis_text(r)) + "</p>\n<h3>Line reactions (ULS)</h3>\n<table>\n";
    for (const auto& [k, v] : plate_reaction_rows(r)) o += "<tr><td>" + esc(k) + "</td><td>" + esc(v) + "</td></tr>\n";
    o += "</table>\n";
    if (const std::string fe = free_edge_text(r); !fe.empty()) o += "<h3>Free edges</h3>\n<p>" + esc(fe) + "</p>\n";
    o += plate_drawings_html(r);
  } else
  o += "<h2>3 Analysis</h2>\n<p>Elastic continuous beam, uniform stiffness, knife-edge supports; moments and "
       "shears at support centrelines, for the strip width of " + u.length(r.strip_width_mm) +
       (r.support_widths_given ? "; hogging design moments at the faces of supports given a width (see each "
                                 "support's bending check)"
                               : "") +
       ".</p>\n";
  if (!r.plate) o += diagram_svg(r, true) + "\n" + diagram_svg(r, false) + "\n";
  if (!r.deflection_diagrams.empty())
    o += "<p>Calculated deflection: the long-term curvature and deflection of each span with the bars chosen "
         "(see each span's deflection check).</p>\n" +
         deflection_svg(r, true) + "\n" + deflection_svg(r, false) + "\n";

  o += "<h2>4 Design of regions, supports and spans</h2>\n";
  for (const auto& part : parts_of(r)) {
    o += "<h3>" + esc(part.title) + "</h3>\n";
    if (part.region) {
      o += "<table>\n";
      for (const auto& [k, v] : region_rows(r, *part.region))
        o += "<tr><td>" + esc(k) + "</td><td class=\"num\">" + esc(v) + "</td></tr>\n";
      o += "</table>\n" + (r.plate ? std::string() : section_svg(r, *part.region)) + "\n";
    }
    for (const Check* c : part.checks) {
      o += "<div class=\"check\">\n<h4>" + esc(c->id) + " at " + esc(c->where) + ": " + esc(c->clause) + "</h4>\n";
      o += "<table class=\"steps\">\n";
      for (const auto& s : c->steps) {
        const std::string ex = expression_of(s), sub = substitution(s);
        o += "<tr><td>" + esc(s.symbol) + "</td><td>" + (ex.empty() ? "" : "= " + esc(ex)) + "</td><td>" +
             (sub.empty() ? "" : "= " + esc(sub)) + "</td><td class=\"num\">= " +
             esc(n4(s.result) + unit_text(s.unit)) + "</td><td class=\"clause\">" + esc(s.clause) +
             "</td></tr>\n";
      }
      o += "</table>\n<p class=\"verdict\">demand " + esc(check_number(u, *c, c->demand) + unit_text(check_unit(u, *c))) +
           " against capacity " + esc(check_number(u, *c, c->capacity) + unit_text(check_unit(u, *c))) + ": utilisation " +
           esc(n4(c->utilisation)) + ", <span" + (c->pass ? "" : " class=\"no\"") + ">" + outcome(*c) +
           "</span></p>\n</div>\n";
    }
  }
  if (!r.plate)
  o += "<h3>Distribution bars</h3>\n<p>" + esc(u.bars(r.distribution.bars)) + ": As,prov " +
       u.area(r.distribution.bars.As_prov_mm2) + " against As,req " + u.area(r.distribution.As_req_mm2) + ".</p>\n";
  if (r.detailing) o += detailing_html(r, *r.detailing);

  o += "<h2>5 Summary of checks</h2>\n<table>\n<tr><th>check</th><th>where</th><th>clause</th>"
       "<th class=\"num\">demand</th><th class=\"num\">capacity</th><th>unit</th><th class=\"num\">"
       "utilisation</th><th>outcome</th></tr>\n";
  for (const Check* c : r.all_checks())
    o += "<tr><td>" + esc(c->id) + "</td><td>" + esc(c->where) + "</td><td>" + esc(c->clause) +
         "</td><td class=\"num\">" + esc(check_number(u, *c, c->demand)) + "</td><td class=\"num\">" +
         esc(check_number(u, *c, c->capacity)) +
         "</td><td>" + esc(check_unit(u, *c)) + "</td><td class=\"num\">" + esc(n4(c->utilisation)) + "</td><td" +
         (c->pass ? "" : " class=\"no\"") + ">" + (c->pass ? "ok" : "fails") + "</td></tr>\n";
  o += "</table>\n";

  o += "<h2>6 Warnings</h2>\n";
  if (r.warnings.empty()) o += "<p>None.</p>\n";
  else {
    o += "<ul>\n";
    for (const auto& w : r.warnings) o += "<li>" + esc(w) + "</li>\n";
    o += "</ul>\n";
  }
  o += "<p class=\"caution\"><strong>Caution.</strong> " + esc(caution_text) + "</p>\n</body>\n</html>\n";
  return o;
}

std::string markdown_record(const DesignRecord& r, const json& request, const std::string& date) {
  const RecordUnits u = units_of(r);
  std::string o = "# " + std::string(record_heading(r)) + "\n\n";
  for (const auto& [k, v] : title_of(r, request, date).rows) o += "- **" + k + ":** " + v + "\n";
  o += "\n> **Caution.** " + std::string(caution_text) + "\n\n## 1 Inputs\n\n| field | value |\n|---|---|\n";
  std::vector<std::pair<std::string, std::string>> inputs;
  flatten(request, "", inputs);
  for (const auto& [k, v] : inputs) o += "| " + md(k) + " | " + md(v) + " |\n";
  o += "\n### Defaults used (fields the request left out)\n\n";
  const auto defaults = defaults_left_out(r, request);
  if (defaults.empty()) o += "None.\n";
  else {
    o += "| field | value used | from |\n|---|---|---|\n";
    for (const auto& d : defaults) o += "| " + md(d.field) + " | " + md(d.value) + " | " + md(d.basis) + " |\n";
  }
  o += "\n## 2 Actions and combinations\n\n| item | value |\n|---|---|\n";
  for (const auto& [k, v] : action_rows(r)) o += "| " + md(k) + " | " + md(v) + " |\n";
  if (r.plate) {
    o += "\n## 3 Analysis\n\n" + plate_analysis_text(r) + "\n\n| line reactions (ULS) | value |\n|---|---|\n";
    for (const auto& [k, v] : plate_reaction_rows(r)) o += "| " + md(k) + " | " + md(v) + " |\n";
    if (const std::string fe = free_edge_text(r); !fe.empty()) o += "\nFree edges: " + fe + "\n";
  } else
  o += "\n## 3 Analysis\n\nEnvelopes of the strip (" + std::string(u.moment_u()) + ", " + u.force_u() +
       "), sampled along each span:\n\n| x " + u.along_u() + " | M max | M min | V max | V min |\n|---:|---:|---:|---:|---:|\n";
  // Noise beside the envelope's largest value prints as 0.
  double M_scale = 0, V_scale = 0;
  for (const auto& span : r.diagrams)
    for (const auto& p : span) {
      M_scale = std::max({M_scale, std::abs(p.M_max), std::abs(p.M_min)});
      V_scale = std::max({V_scale, std::abs(p.V_max), std::abs(p.V_min)});
    }
  M_scale = u.moment_v(M_scale);
  V_scale = u.force_v(V_scale);
  for (const auto& span : r.diagrams)
    for (const auto& p : span)
      o += "| " + n4(u.along_v(p.x_mm)) + " | " + n4(u.moment_v(p.M_max), M_scale) + " | " +
           n4(u.moment_v(p.M_min), M_scale) + " | " + n4(u.force_v(p.V_max), V_scale) + " | " +
           n4(u.force_v(p.V_min), V_scale) + " |\n";
  o += "\n## 4 Design of regions, supports and spans\n";
  for (const auto& part : parts_of(r)) {
    o += "\n### " + part.title + "\n\n";
    if (part.region) {
      for (const auto& [k, v] : region_rows(r, *part.region)) o += "- " + k + ": " + v + "\n";
      if (!r.plate)
      o += "- Section: h = " + u.length(r.thickness_mm) + ", " +
           (part.region->face == Face::bottom ? "bottom" : "top") + " bars at d = " +
           u.length(part.region->d_mm) + " from the compression face\n";
    }
    for (const Check* c : part.checks) {
      o += "\n**" + c->id + " at " + c->where + "** (" + c->clause + ")\n\n";
      for (const auto& s : c->steps)
        o += "- " + step_line(s) + (s.clause.empty() ? "" : " (" + s.clause + ")") + "\n";
      o += "- demand " + check_number(u, *c, c->demand) + unit_text(check_unit(u, *c)) + " against capacity " +
           check_number(u, *c, c->capacity) +
           unit_text(check_unit(u, *c)) + ": utilisation " + n4(c->utilisation) + ", " + outcome(*c) + "\n";
    }
  }
  if (!r.plate)
  o += "\n### Distribution bars\n\n" + u.bars(r.distribution.bars) + ": As,prov " +
       u.area(r.distribution.bars.As_prov_mm2) + " against As,req " + u.area(r.distribution.As_req_mm2) + ".\n";
  if (r.detailing) o += detailing_markdown(r, *r.detailing);
  o += "\n## 5 Summary of checks\n\n| check | where | clause | demand | capacity | unit | utilisation | outcome |\n"
       "|---|---|---|---:|---:|---|---:|---|\n";
  for (const Check* c : r.all_checks())
    o += "| " + c->id + " | " + c->where + " | " + md(c->clause) + " | " + check_number(u, *c, c->demand) +
         " | " + check_number(u, *c, c->capacity) + " | " + check_unit(u, *c) + " | " + n4(c->utilisation) + " | " + (c->pass ? "ok" : "fails") + " |\n";
  o += "\n## 6 Warnings\n\n";
  if (r.warnings.empty()) o += "None.\n";
  for (const auto& w : r.warnings) o += "- " + w + "\n";
  o += "\n> **Caution.** " + std::string(caution_text) + "\n";
  return o;
}
}  // namespace

RecordFormat record_format_for(const std::filesystem::path& path) {
  const std::string ext = path.extension().string();
  if (ext == ".html" || ext == ".htm") return RecordFormat::html;
  if (ext == ".md") return RecordFormat::markdown;
  throw InputError({{"report", "the record is written as .html or .md, got '" + path.string() + "'"}});
}

std::string calculation_record(const DesignRecord& record, const json& request, RecordFormat format,
                               const std::string& date) {
  return format == RecordFormat::html ? html_record(record, request, date)
                                      : markdown_record(record, request, date);
}

std::string request_fingerprint(const json& request) {
  std::uint64_t h = 14695981039346656037ull;
  for (unsigned char c : request.dump()) {
    h ^= c;
    h *= 1099511628211ull;
  }
  char buf[17];
  std::snprintf(buf, sizeof buf, "%016llx", static_cast<unsigned long long>(h));
  return buf;
}

std::string today_iso() {
  const std::time_t t = std::chrono::system_clock::to_time_t(std::chrono::system_clock::now());
  std::tm tm{};
  gmtime_r(&t, &tm);
  char buf[16];
  std::strftime(buf, sizeof buf, "%Y-%m-%d", &tm);
  return buf;
}

void write_file_atomically(const std::filesystem::path& path, const std::string& content) {
  namespace fs = std::filesystem;
  const fs::path dir = path.has_parent_path() ? path.parent_path() : fs::path(".");
  std::random_device rd;
  const fs::path tmp = dir / ("." + path.filename().string() + ".tmp" + std::to_string(rd()));
  {
    std::ofstream out(tmp, std::ios::binary | std::ios::trunc);
    if (!out) throw std::runtime_error("cannot write " + tmp.string());
    out << content;
    out.flush();
    if (!out) {
      std::error_code ec;
      fs::remove(tmp, ec);
      throw std::runtime_error("cannot write " + tmp.string());
    }
  }
  std::error_code ec;
  fs::rename(tmp, path, ec);
  if (ec) {
    fs::remove(tmp, ec);
    throw std::runtime_error("cannot replace " + path.string() + ": " + ec.message());
  }
}

}  // namespace armature
