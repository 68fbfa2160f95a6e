#include "armature/summary.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <string>

#include "armature/format.hpp"
#include "armature/two_way.hpp"
#include "armature/units.hpp"

namespace armature {

namespace {
std::string fmt(const char* format, double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, format, v);
  return buf;
}
std::string pad(std::string s, std::size_t width) {
  // Width counted in code points so that "ø" and "²" do not skew columns.
  std::size_t points = 0;
  for (unsigned char c : s)
    if ((c & 0xC0) != 0x80) ++points;
  s.append(points < width ? width - points : 1, ' ');
  return s;
}
std::string rpad(const std::string& s, std::size_t width) {
  return std::string(s.size() < width ? width - s.size() : 1, ' ') + s;
}
std::string util(double u) { return std::isfinite(u) ? fmt("%.2f", u) : std::string("inf"); }

// Units of the summary: SI as the kernel's report units (for the strip
// width), or US customary per foot of slab (the strip's moments, shears
// and areas times 12 in/b).
struct Show {
  bool us;
  double per_ft = 1.0;  // 12 in / strip width (US)
  const char* load_unit() const { return us ? "psf" : "kPa"; }
  const char* moment_unit() const { return us ? "kip-ft/ft" : "kNm"; }
  const char* length_unit() const { return us ? "in" : "mm"; }
  const char* area_unit() const { return us ? "in2/ft" : "mm2"; }
  const char* force_unit() const { return us ? "kip/ft" : "kN"; }
  double load(double MPa) const { return us ? MPa * 1e3 / kPa_per_psf : MPa * 1e3; }
  double moment(double Nmm) const { return us ? Nmm * 1e-6 / kNm_per_kipft * per_ft : Nmm * 1e-6; }
  double length(double mm) const { return us ? mm / mm_per_in : mm; }
  double area(double mm2) const { return us ? mm2 / (mm_per_in * mm_per_in) * per_ft : mm2; }
  double force(double N) const { return us ? N * 1e-3 / kN_per_kip * per_ft : N * 1e-3; }
  const char* length_format() const { return us ? "%.2f" : "%.1f"; }
  const char* area_format() const { return us ? "%.3f" : "%.1f"; }
  // A check value in its report unit, converted (per foot where it is for
  // the strip width).
  std::pair<double, std::string> check_value(double v, const std::string& unit) const {
    if (!us) return {v, unit};
    if (unit == "kNm") return {v / kNm_per_kipft * per_ft, "kip-ft/ft"};
    if (unit == "kN") return {v / kN_per_kip * per_ft, "kip/ft"};
    if (unit == "mm") return {v / mm_per_in, "in"};
    if (unit == "mm2") return {v / (mm_per_in * mm_per_in) * per_ft, "in2/ft"};
    return {v, unit};
  }
  // As the calculation record writes them: "ø12 @ 175 mm", "#4 @ 300 mm".
  std::string bars(const BarChoice& b) const {
    return bar_arrangement(b.bar, length(b.spacing_mm), length_unit());
  }
};

// The bar schedule's totals, where the request asked for detailing.
std::string detailing_line(const DesignRecord& r) {
  if (!r.detailing) return "";
  const DetailingRecord& d = *r.detailing;
  return "Bars       " + std::to_string(d.schedule.size()) + " marks, " + plain_number(d.total_mass_kg) + " kg, " +
         plain_number(d.mass_per_area_kg_m2) + " kg/m2 of floor (the schedule: --schedule FILE.csv, or the record)\n";
}

// The summary of a two-way slab: per metre, by bay (its bottom bars in x
// and y), then the supported line segments (top bars across each) with
// their largest line reaction, the checks, the status.
std::string format_two_way_summary(const DesignRecord& r, const Show& u) {
  const PlateRecord& p = *r.plate;
  const std::string L = u.length_unit(), A = u.area_unit();
  std::string o;
  o += "armature " + std::string(version_string()) + " | " + r.code.id + " (" + r.code.variant + ") | " +
       r.code.title + "\n";
  o += u.us ? "Units      US customary (the JSON result stays SI)\n" : "";
  o += "\n";
  const std::string bays = std::to_string(p.x_lines_mm.size() - 1) + " x " + std::to_string(p.y_lines_mm.size() - 1);
  const std::string analysis = "plate analysis, " + std::to_string(p.mesh_per_bay) + " elements per bay side, Poisson's ratio " +
                               fmt("%.2f", p.poisson_ratio);
  if (p.flat) {
    auto edge = [&](std::size_t k) { return p.column_edges[k] ? "columns" : "wall"; };
    const std::string size = r.columns.empty() ? std::string("-")
                                               : fmt(u.length_format(), u.length(r.columns.front().cx_mm)) + " x " +
                                                     fmt(u.length_format(), u.length(r.columns.front().cy_mm)) + " " + L;
    o += "Slab       flat, " + bays + " bays on columns " + size + " (" +
         (p.columns_restrained ? "restrained by the storeys above and below" : "free to turn") + "), edges x0 " +
         edge(0) + ", x1 " + edge(1) + ", y0 " + edge(2) + ", y1 " + edge(3) + "; " + analysis +
         "; strip moments integrated over column and middle strips (" + p.strip_clause + ")\n";
  } else {
    o += "Slab       two-way, " + bays + " bays, edges x0 " + to_string(p.edges[0]) + ", x1 " + to_string(p.edges[1]) +
         ", y0 " + to_string(p.edges[2]) + ", y1 " + to_string(p.edges[3]) + "; " + analysis +
         "; Wood–Armer design moments\n";
  }
  o += "Loads      self-weight " + fmt("%.2f", u.load(r.loads.self_weight)) + " " + u.load_unit() + ", ULS " +
       fmt("%.2f", u.load(r.loads.uls)) + " " + u.load_unit() + " [" + r.loads.combination + "], " +
       std::to_string(r.load_arrangements) + " bay load arrangements, " + std::to_string(r.load_cases) +
       " ULS load cases\n";
  o += "Cover     ";
  for (const Face face : {Face::top, Face::bottom})
    if (r.cover_mm(face) > 0.0)
      o += std::string(" ") + to_string(face) + " " + fmt(u.us ? "%.2f" : "%.0f", u.length(r.cover_mm(face))) + " " +
           L + (face == Face::top && r.cover_mm(Face::bottom) > 0.0 ? "," : "");
  o += "; outer layers: bottom " + p.outer_layer[0] + ", top " + p.outer_layer[1] + "\n\n";
  const std::string per_m = u.us ? "" : "/m";
  std::size_t name_width = 20;
  for (const auto& g : r.regions) name_width = std::max(name_width, g.where.size() + 2);
  o += pad("Region", name_width) + pad("face", 8) + pad("dir", 5) + rpad("x m", 7) + rpad("y m", 7) +
       rpad(std::string("M_Ed ") + u.moment_unit() + per_m, 14) + rpad("d " + L, 8) + rpad("As,req", 9) + "   " +
       pad("bars", 16) + rpad("As,prov " + A + per_m, 14) + "\n";
  for (const auto& g : r.regions)
    o += pad(g.where, name_width) + pad(to_string(g.face), 8) + pad(to_string(g.direction), 5) +
         rpad(fmt("%.2f", g.x_mm * 1e-3), 7) + rpad(fmt("%.2f", g.y_mm * 1e-3), 7) +
         rpad(fmt("%.2f", u.moment(g.M_Ed)), 14) + rpad(fmt(u.length_format(), u.length(g.d_mm)), 8) +
         rpad(fmt(u.area_format(), u.area(g.As_req_mm2)), 9) + "   " + pad(u.bars(g.bars), 16) +
         rpad(fmt(u.area_format(), u.area(g.bars.As_prov_mm2)), 14) + "\n";
  if (!p.reactions.empty()) {
    o += "\n" + pad("Line reactions (ULS)", 28) + rpad("max kN/m", 10) + rpad("total kN", 10) + "\n";
    for (const auto& l : p.reactions)
      o += pad(l.name, 28) + rpad(fmt("%.1f", l.max_N_per_mm), 10) + rpad(fmt("%.1f", l.max_total_N * 1e-3), 10) + "\n";
  }
  if (!r.columns.empty()) {
    // Whole quantities at a column (not per strip width): kN or kip, MPa
    // or psi, mm² or in² per perimeter, mm or in.
    const char* force_u = u.us ? "kip" : "kN";
    const char* stress_u = u.us ? "psi" : "MPa";
    auto force = [&](double N) { return u.us ? N * 1e-3 / kN_per_kip : N * 1e-3; };
    auto stress = [&](double MPa) { return u.us ? MPa / MPa_per_psi : MPa; };
    auto area = [&](double mm2) { return u.us ? mm2 / (mm_per_in * mm_per_in) : mm2; };
    o += "\n" + pad("Columns (ULS)", 14) + pad("position", 10) + rpad(std::string("reaction ") + force_u, 13) +
         rpad("d " + L, 8) + rpad("factor", 8) + rpad(std::string("v ") + stress_u, 9) +
         rpad(std::string("vc ") + stress_u, 9) + "  shear reinforcement\n";
    for (const auto& c : r.columns) {
      const PunchingOutcome& q = c.punching;
      std::string links = "none needed";
      if (q.reinforcement_needed)
        links = q.reinforcement
                    ? fmt(u.us ? "%.2f" : "%.0f", area(q.reinforcement->area_per_perimeter_mm2)) + (u.us ? " in2" : " mm2") +
                          " per perimeter at " + fmt(u.length_format(), u.length(q.reinforcement->spacing_mm)) + " " + L +
                          ", to " + fmt(u.length_format(), u.length(q.reinforcement->outermost_line_distance_mm)) + " " + L
                    : "needed, not provided";
      o += pad(c.name, 14) +
           pad(q.position == ColumnPosition::internal ? "internal" : q.position == ColumnPosition::edge ? "edge" : "corner", 10) +
           rpad(fmt("%.1f", force(c.V_Ed_N)), 13) + rpad(fmt(u.length_format(), u.length(q.d_mm)), 8) +
           rpad(fmt("%.2f", q.transfer_factor), 8) + rpad(fmt(u.us ? "%.0f" : "%.2f", stress(q.v_MPa)), 9) +
           rpad(fmt(u.us ? "%.0f" : "%.2f", stress(q.v_concrete_MPa)), 9) + "  " + links + (q.pass ? "" : "  FAILS") + "\n";
    }
  }
  o += "\n";
  o += pad("Check", 12) + pad("where", 20) + rpad("demand", 10) + rpad("capacity", 10) + "  " + pad("unit", u.us ? 10 : 7) +
       rpad("util", 6) + "  " + pad("", 5) + "clause\n";
  for (const Check* c : r.all_checks()) {
    const auto [demand, unit] = u.check_value(c->demand, c->unit);
    const double capacity = u.check_value(c->capacity, c->unit).first;
    const double scale = std::max(std::abs(demand), std::abs(capacity));
    o += pad(c->id, 12) + pad(c->where, 20) + rpad(plain_number(demand, scale), 10) +
         rpad(plain_number(capacity, scale), 10) + "  " + pad(unit, u.us ? 10 : 7) + rpad(util(c->utilisation), 6) +
         "  " + pad(c->pass ? "ok" : "FAIL", 5) + c->clause + "\n";
  }
  o += "\nStatus     " + std::string(r.pass ? "PASS" : "FAIL") + ", max utilisation " + util(r.max_utilisation) + " (" +
       r.governing_check + ", " + r.governing_where + ")\n";
  o += detailing_line(r);
  if (r.plate) {
    // One line per edge: the U-bars of each bay or strip along it.
    for (std::size_t i = 0; i < r.plate->free_edges.size(); ++i) {
      const auto& f = r.plate->free_edges[i];
      if (i > 0 && r.plate->free_edges[i - 1].edge == f.edge) continue;
      std::string arrangements;
      const PlateFreeEdgeRecord* largest = &f;  // the bar along the edge: the largest of its bays' (as detailed)
      for (std::size_t k = i; k < r.plate->free_edges.size() && r.plate->free_edges[k].edge == f.edge; ++k) {
        const auto& g = r.plate->free_edges[k];
        if (g.edge_bar_diameter_mm > largest->edge_bar_diameter_mm) largest = &g;
        const std::string a =
            bar_arrangement(g.u_bar, u.us ? g.u_bar_spacing_mm / mm_per_in : g.u_bar_spacing_mm, u.us ? "in" : "mm");
        arrangements += (arrangements.empty() ? "" : ", ") + a + " (" + g.bay + ")";
      }
      o += "Free edge  " + f.edge + ": U-bars " + arrangements + ", the bottom bars across it, legs " +
           (u.us ? plain_number(f.leg_mm / mm_per_in) + " in" : plain_number(f.leg_mm) + " mm") + " on each face; bar " +
           largest->edge_bar + " along the edge in each face inside the U (" + f.clause + ")\n";
    }
    const bool free = std::find(r.plate->edges.begin(), r.plate->edges.end(), EndSupport::free) != r.plate->edges.end();
    if (!r.plate->integrity.empty()) o += "Detailing  " + r.plate->integrity + "\n";
    if (!r.plate->top_extents.empty())
      o += "Detailing  top bars past the faces by " + r.plate->extents_clause + ": see the record or plate.top_bar_extents\n";
    if (free && r.plate->free_edges.empty() && !r.plate->flat)
      o += "Free edge  the code sets no reinforcement rule of its own for a free edge: the bars as designed\n";
  }
  for (const auto& w : r.warnings) o += "Warning    " + w + "\n";
  o += "\nCaution    " + std::string(caution_text) + "\n";
  return o;
}
}  // namespace

std::string format_summary(const DesignRecord& r) {
  const bool us = r.report_units == ReportUnits::US;
  const Show u{us, us ? m_per_ft * 1000.0 / r.strip_width_mm : 1.0};
  if (r.plate) return format_two_way_summary(r, u);
  const std::string L = u.length_unit(), A = u.area_unit();
  std::string o;
  o += "armature " + std::string(version_string()) + " | " + r.code.id + " (" + r.code.variant +
       ") | " + r.code.title + "\n";
  o += u.us ? "Units      US customary (the JSON result stays SI)\n" : "";
  o += "\n";
  o += "Loads      self-weight " + fmt("%.2f", u.load(r.loads.self_weight)) + " " + u.load_unit() +
       ", ULS " + fmt("%.2f", u.load(r.loads.uls)) + " " + u.load_unit() + " [" +
       r.loads.combination + "], " +
       (r.loads.long_term_load_name.empty() ? std::string("long-term") : r.loads.long_term_load_name) + " " +
       fmt("%.2f", u.load(r.loads.sls_quasi_permanent)) +
       " " + u.load_unit() + "\n";
  o += "Cover     ";
  for (const Face face : {Face::top, Face::bottom})
    if (r.cover_mm(face) > 0.0)
      o += std::string(" ") + to_string(face) + " " + fmt(u.us ? "%.2f" : "%.0f", u.length(r.cover_mm(face))) +
           " " + L + (face == Face::top && r.cover_mm(Face::bottom) > 0.0 ? "," : "");
  o += "\n\n";

  // Given bars are marked "given" beside them (a wider column then).
  const bool any_given =
      std::any_of(r.regions.begin(), r.regions.end(), [](const RegionRecord& g) { return g.bars_given; });
  const std::size_t bars_width = any_given ? 22 : 16;
  o += pad("Region", 12) + pad("face", 8) + rpad(std::string("M_Ed ") + u.moment_unit(), 12) +
       rpad("d " + L, 8) + rpad("As,req", 9) + rpad("As,min", 9) + "   " + pad("bars", bars_width) +
       rpad("As,prov " + A, 12) + "\n";
  for (const auto& g : r.regions)
    o += pad(g.where, 12) + pad(to_string(g.face), 8) + rpad(fmt("%.2f", u.moment(g.M_Ed)), 12) +
         rpad(fmt(u.length_format(), u.length(g.d_mm)), 8) +
         rpad(fmt(u.area_format(), u.area(g.As_req_mm2)), 9) +
         rpad(fmt(u.area_format(), u.area(g.As_min_mm2)), 9) + "   " + pad(u.bars(g.bars) + (g.bars_given ? " given" : ""), bars_width) +
         rpad(fmt(u.area_format(), u.area(g.bars.As_prov_mm2)), 12) + "\n";
  if (any_given)
    o += "given: the request's bars (reinforcement.given), checked, not searched\n";
  if (r.rationalise == Rationalise::uniform_bottom)
    o += r.plate ? "Bottom bars: one arrangement in x and one in y for every bay not given "
                   "(reinforcement.rationalise)\n"
                 : "Bottom bars: one arrangement for every span region not given (reinforcement.rationalise)\n";
  for (const auto& s : r.supports)
    o += pad(s.where, 12) + "V_Ed " + fmt("%.1f", u.force(s.V_Ed)) + " " + u.force_unit() +
         ", resistance " + fmt("%.1f", u.force(s.V_Rd)) + " " + u.force_unit() + "\n";
  o += "Distribution bars " + u.bars(r.distribution.bars) + " (As,req " +
       fmt(u.area_format(), u.area(r.distribution.As_req_mm2)) + ", As,prov " +
       fmt(u.area_format(), u.area(r.distribution.bars.As_prov_mm2)) + " " + A + ")\n";
  if (u.us) o += "Quantities are per foot of slab (design strip " + fmt("%.1f", u.length(r.strip_width_mm)) +
                 " in wide).\n";
  o += "\n";

  o += pad("Check", 12) + pad("where", 11) + rpad("demand", 10) + rpad("capacity", 10) + "  " +
       pad("unit", u.us ? 10 : 7) + rpad("util", 6) + "  " + pad("", 5) + "clause\n";
  for (const Check* c : r.all_checks()) {
    const auto [demand, unit] = u.check_value(c->demand, c->unit);
    const double capacity = u.check_value(c->capacity, c->unit).first;
    const double scale = std::max(std::abs(demand), std::abs(capacity));  // noise beside it is 0
    o += pad(c->id, 12) + pad(c->where, 11) + rpad(plain_number(demand, scale), 10) +
         rpad(plain_number(capacity, scale), 10) + "  " + pad(unit, u.us ? 10 : 7) + rpad(util(c->utilisation), 6) +
         "  " + pad(c->pass ? "ok" : "FAIL", 5) + c->clause + "\n";
  }
  o += "\nStatus     " + std::string(r.pass ? "PASS" : "FAIL") + ", max utilisation " +
       util(r.max_utilisation) + " (" + r.governing_check + ", " + r.governing_where + ")\n";
  o += detailing_line(r);
  for (const auto& w : r.warnings) o += "Warning    " + w + "\n";
  o += "\nCaution    " + std::string(caution_text) + "\n";
  return o;
}

}  // namespace armature
