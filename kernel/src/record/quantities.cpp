#include "armature/quantities.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "armature/two_way.hpp"

namespace armature {

namespace {
constexpr double top_bar_reach = 0.3;  // of each adjacent span (common practice)

// Length of strip (mm) that a region's bars run over.
double bar_length_mm(const DesignRecord& r, const RegionRecord& g) {
  const std::size_t n = r.spans_mm.size();
  if (g.face == Face::bottom) {
    const std::size_t e = static_cast<std::size_t>(std::stoul(g.where.substr(5))) - 1;  // "span k"
    return r.spans_mm.at(e);
  }
  const std::size_t j = static_cast<std::size_t>(std::stoul(g.where.substr(8))) - 1;  // "support k"
  double length = 0.0;
  for (std::size_t e : {j - 1, j}) {  // j − 1 wraps past n at j = 0
    if (e >= n) continue;
    const bool cantilever = (e == 0 && r.ends[0] == EndSupport::free) ||
                            (e + 1 == n && r.ends[1] == EndSupport::free);
    length += cantilever ? r.spans_mm[e] : top_bar_reach * r.spans_mm[e];
  }
  return length;
}
// A two-way slab: bottom bars over their bay (length in their direction,
// the bay's width across), top bars along each supported segment reaching
// top_bar_reach of each adjacent span across the line, corner bars over
// their zone (counted in full, beside the bars they overlap), and the top
// leg and bend of the U-bars at free edges.
// A flat slab: bottom bars over their strip in each span, top bars over
// the strip's width at the column line reaching top_bar_reach of each
// adjacent span (a band likewise, counted in full beside the column
// strip's bars it overlaps), and the punching links: each perimeter's
// area over a leg of the slab's depth between the covers.
// The punching links of a flat slab's columns: each perimeter's area over
// a leg of the slab's depth between the covers (the bar schedule has no
// links: their legs are not chosen).
double punching_link_volume_mm3(const DesignRecord& r) {
  const double leg = r.thickness_mm - r.cover_mm(Face::top) - r.cover_mm(Face::bottom);
  double volume_mm3 = 0.0;
  for (const auto& c : r.columns) {
    const auto& s = c.punching.reinforcement;
    if (!s || !(s->spacing_mm > 0.0)) continue;
    const double perimeters = std::floor(s->outermost_line_distance_mm / s->spacing_mm) + 1.0;
    volume_mm3 += perimeters * s->area_per_perimeter_mm2 * std::max(leg, 0.0);
  }
  return volume_mm3;
}

double flat_steel_mass_kg_per_m2(const DesignRecord& r) {
  const PlateRecord& p = *r.plate;
  const auto& o = p.outline_mm;
  const double area = (o[1] - o[0]) * (o[3] - o[2]);
  if (!(area > 0.0)) return 0.0;
  auto strip_named = [&](const std::string& name, const std::vector<FlatStripRecord>& list) -> const FlatStripRecord* {
    for (const auto& s : list)
      if (s.name == name) return &s;
    return nullptr;
  };
  double volume_mm3 = 0.0;
  for (const auto& g : r.regions) {
    const bool along_x = g.direction == BarDirection::x;
    const auto& lines = along_x ? p.x_lines_mm : p.y_lines_mm;
    const std::size_t cut = g.where.rfind(g.face == Face::bottom ? " span " : " at ");
    const FlatStripRecord* band = strip_named(g.where, p.bands);
    const FlatStripRecord* strip = cut == std::string::npos ? nullptr : strip_named(g.where.substr(0, cut), p.strips);
    double area_mm2 = 0.0;
    if (g.face == Face::bottom && strip) {
      const std::size_t k = static_cast<std::size_t>(std::stoul(g.where.substr(cut + 6))) - 1;
      if (k < strip->pieces.size()) {
        const auto& q = strip->pieces[k];
        area_mm2 = (q[1] - q[0]) * (q[3] - q[2]);
      }
    } else if (band || strip) {
      const double at = along_x ? g.x_mm : g.y_mm;
      double width = 0.0;
      if (band) {
        const auto& q = band->pieces.front();
        width = along_x ? q[3] - q[2] : q[1] - q[0];
      } else {
        width = std::numeric_limits<double>::infinity();
        for (const auto& q : strip->pieces) width = std::min(width, along_x ? q[3] - q[2] : q[1] - q[0]);
      }
      double reach = 0.0;
      for (std::size_t k = 0; k < lines.size(); ++k) {
        if (std::abs(lines[k] - at) > 1e-6) continue;
        if (k > 0) reach += top_bar_reach * (lines[k] - lines[k - 1]);
        if (k + 1 < lines.size()) reach += top_bar_reach * (lines[k + 1] - lines[k]);
      }
      area_mm2 = width * reach;
    }
    volume_mm3 += g.bars.As_prov_mm2 * area_mm2 / 1000.0;
  }
  // U-bars at the free edges between the edge columns: as on a two-way slab.
  for (const auto& f : p.free_edges)
    volume_mm3 += f.u_bar_area_mm2 * (f.to_mm - f.from_mm) * (f.leg_mm + r.thickness_mm) / 1000.0;
  volume_mm3 += punching_link_volume_mm3(r);
  return volume_mm3 / area * 1e-3 * steel_density_kg_m3;
}

double plate_steel_mass_kg_per_m2(const DesignRecord& r) {
  const PlateRecord& p = *r.plate;
  if (p.flat) return flat_steel_mass_kg_per_m2(r);
  const double X = p.x_lines_mm.back() - p.x_lines_mm.front(), Y = p.y_lines_mm.back() - p.y_lines_mm.front();
  if (!(X > 0.0 && Y > 0.0)) return 0.0;
  double volume_mm3 = 0.0;  // As_prov per metre (mm²/m) × area (mm²) / 1000 mm
  for (const auto& g : r.regions) {
    double area_mm2 = 0.0;
    const auto corner = std::find_if(p.corners.begin(), p.corners.end(),
                                     [&](const PlateCornerRecord& c) { return c.name == g.where; });
    if (corner != p.corners.end()) {
      area_mm2 = (corner->x1_mm - corner->x0_mm) * (corner->y1_mm - corner->y0_mm);
    } else if (g.face == Face::bottom) {
      for (const auto& b : p.bays)
        if (b.name == g.where) area_mm2 = (b.x1_mm - b.x0_mm) * (b.y1_mm - b.y0_mm);
    } else {
      for (const auto& l : p.reactions) {
        if (l.name != g.where) continue;
        const auto& across = l.runs_along == PlanAxis::y ? p.x_lines_mm : p.y_lines_mm;
        double reach = 0.0;
        for (std::size_t k = 0; k < across.size(); ++k) {
          if (std::abs(across[k] - l.position_mm) > 1e-6) continue;
          if (k > 0) reach += top_bar_reach * (across[k] - across[k - 1]);
          if (k + 1 < across.size()) reach += top_bar_reach * (across[k + 1] - across[k]);
        }
        area_mm2 = (l.to_mm - l.from_mm) * reach;
      }
    }
    volume_mm3 += g.bars.As_prov_mm2 * area_mm2 / 1000.0;
  }
  // U-bars at free edges: the top leg and the bend (h) beyond the bottom
  // bars already counted over the bay.
  for (const auto& f : p.free_edges)
    volume_mm3 += f.u_bar_area_mm2 * (f.to_mm - f.from_mm) * (f.leg_mm + r.thickness_mm) / 1000.0;
  return volume_mm3 / (X * Y) * 1e-3 * steel_density_kg_m3;  // mm³/mm² = mm → m
}
}  // namespace

double steel_mass_kg_per_m2(const DesignRecord& r) {
  // A detailed design: the bar schedule's mass (every bar as cut) over the
  // floor, and a flat slab's punching links as estimated (not scheduled).
  if (r.detailing) {
    double links = 0.0;
    if (r.plate && r.plate->flat) {
      const auto& o = r.plate->outline_mm;
      const double area = (o[1] - o[0]) * (o[3] - o[2]);
      if (area > 0.0) links = punching_link_volume_mm3(r) / area * 1e-3 * steel_density_kg_m3;
    }
    return r.detailing->mass_per_area_kg_m2 + links;
  }
  if (r.plate) return plate_steel_mass_kg_per_m2(r);
  double strip_length = 0.0;
  for (double L : r.spans_mm) strip_length += L;
  if (strip_length <= 0.0 || r.strip_width_mm <= 0.0) return 0.0;
  double volume_mm3 = r.distribution.bars.As_prov_mm2 * strip_length;
  for (const auto& g : r.regions) volume_mm3 += g.bars.As_prov_mm2 * bar_length_mm(r, g);
  const double area_mm2 = r.strip_width_mm * strip_length;
  return volume_mm3 / area_mm2 * 1e-3 * steel_density_kg_m3;  // mm³/mm² = mm → m
}

double concrete_volume_m3_per_m2(const DesignRecord& r) { return r.thickness_mm * 1e-3; }

}  // namespace armature
