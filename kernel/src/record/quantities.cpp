#include "armature/quantities.hpp"

#include <algorithm>
#include <string>

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
}  // namespace

double steel_mass_kg_per_m2(const DesignRecord& r) {
  // A detailed design: the bar schedule's mass (every bar as cut) over the floor.
  if (r.detailing) return r.detailing->mass_per_area_kg_m2;
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
