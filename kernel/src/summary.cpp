#include "armature/summary.hpp"

#include <cmath>
#include <cstdio>
#include <string>

namespace armature {

namespace {
std::string fmt(const char* format, double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, format, v);
  return buf;
}
std::string pad(std::string s, std::size_t width) {
  // Width counted in code points so that "≤" and "²" do not skew columns.
  std::size_t points = 0;
  for (unsigned char c : s)
    if ((c & 0xC0) != 0x80) ++points;
  if (points < width) s.append(width - points, ' ');
  return s;
}
std::string rpad(const std::string& s, std::size_t width) {
  return s.size() < width ? std::string(width - s.size(), ' ') + s : s;
}
// EN bars are named by diameter ("ø12"); catalogue names stay as they are ("#4").
std::string bar_label(const BarChoice& b) {
  const bool by_diameter = !b.bar.empty() && b.bar[0] >= '0' && b.bar[0] <= '9';
  return (by_diameter ? "ø" : "") + b.bar + " @ " + fmt("%.0f", b.spacing_mm);
}
std::string util(double u) { return std::isfinite(u) ? fmt("%.2f", u) : std::string("inf"); }
}  // namespace

std::string format_summary(const DesignRecord& r) {
  std::string o;
  o += "armature " + std::string(version_string()) + " | " + r.code.id + " (" + r.code.variant +
       ") | " + r.code.title + "\n\n";
  o += "Loads      self-weight " + fmt("%.2f", r.loads.self_weight * 1e3) + " kPa, ULS " +
       fmt("%.2f", r.loads.uls * 1e3) + " kPa [" + r.loads.combination +
       "], quasi-permanent " + fmt("%.2f", r.loads.sls_quasi_permanent * 1e3) + " kPa\n";
  o += "Cover      " + fmt("%.0f", r.cover_mm) + " mm\n\n";

  o += pad("Region", 12) + pad("face", 8) + rpad("M_Ed kNm", 9) + rpad("d mm", 8) +
       rpad("As,req", 9) + rpad("As,min", 9) + "   " + pad("bars", 12) + rpad("As,prov mm2", 12) + "\n";
  for (const auto& g : r.regions)
    o += pad(g.where, 12) + pad(to_string(g.face), 8) + rpad(fmt("%.2f", g.M_Ed * 1e-6), 9) +
         rpad(fmt("%.1f", g.d_mm), 8) + rpad(fmt("%.1f", g.As_req_mm2), 9) +
         rpad(fmt("%.1f", g.As_min_mm2), 9) + "   " +
         pad(bar_label(g.bars), 12) +
         rpad(fmt("%.1f", g.bars.As_prov_mm2), 12) + "\n";
  for (const auto& s : r.supports)
    o += pad(s.where, 12) + "V_Ed " + fmt("%.1f", s.V_Ed * 1e-3) + " kN, resistance " +
         fmt("%.1f", s.V_Rd * 1e-3) + " kN\n";
  o += "Distribution bars " + bar_label(r.distribution.bars) + " (As,req " +
       fmt("%.1f", r.distribution.As_req_mm2) + ", As,prov " +
       fmt("%.1f", r.distribution.bars.As_prov_mm2) + " mm2)\n\n";

  o += pad("Check", 12) + pad("where", 11) + rpad("demand", 10) + rpad("capacity", 10) + "  " +
       pad("unit", 6) + rpad("util", 6) + "  " + pad("", 5) + "clause\n";
  for (const Check* c : r.all_checks())
    o += pad(c->id, 12) + pad(c->where, 11) + rpad(fmt("%.3g", c->demand), 10) +
         rpad(fmt("%.3g", c->capacity), 10) + "  " + pad(c->unit, 6) + rpad(util(c->utilisation), 6) +
         "  " + pad(c->pass ? "ok" : "FAIL", 5) + c->clause + "\n";
  o += "\nStatus     " + std::string(r.pass ? "PASS" : "FAIL") + ", max utilisation " +
       util(r.max_utilisation) + " (" + r.governing_check + ", " + r.governing_where + ")\n";
  for (const auto& w : r.warnings) o += "Warning    " + w + "\n";
  o += "\nCaution    " + std::string(caution_text) + "\n";
  return o;
}

}  // namespace armature
