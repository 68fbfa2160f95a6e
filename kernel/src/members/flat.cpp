// FlatPlate: the flat slab as a member. The plate model with its columns
// is built once (mesh lines through the located loads and the columns'
// faces), every ULS case of combinations × bay arrangements and the
// quasi-permanent cases are solved on its one factorisation, and each
// strip's moments are integrated across its width at its sections
// (DEVELOPERS.md, "Flat slabs").
#include "armature/flat.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

namespace armature {

namespace {

constexpr double per_metre = 1000.0;  // N·mm/mm → N·mm per metre width

// One direction of the grid as the strips see it (model coordinates).
struct Axis {
  std::vector<double> lines;  // column lines (grid lines)
  bool wall_lo = false, wall_hi = false;
  double c = 0.0;  // column size along this axis
  std::size_t spans() const { return lines.size() - 1; }
  double span(std::size_t k) const { return lines[k + 1] - lines[k]; }
  bool wall(std::size_t line) const { return (line == 0 && wall_lo) || (line + 1 == lines.size() && wall_hi); }
  // Where the slab begins beside a line toward larger (+1) or smaller (−1)
  // coordinates: the column's face, or the wall's line.
  double face(std::size_t line, int toward) const { return wall(line) ? lines[line] : lines[line] + toward * c / 2.0; }
};

std::vector<std::size_t> nodes_strictly_within(const std::vector<double>& nodes, double lo, double hi) {
  std::vector<std::size_t> out;
  const double tol = 1e-6 * std::max(1.0, std::abs(hi));
  for (std::size_t k = 0; k < nodes.size(); ++k)
    if (nodes[k] > lo + tol && nodes[k] < hi - tol) out.push_back(k);
  return out;
}

}  // namespace

std::string flat_column_name(std::size_t i, std::size_t j) {
  return "column " + std::to_string(i + 1) + "," + std::to_string(j + 1);
}

namespace {

// The plate of a flat slab and its columns (FlatPlate's constructor).
struct FlatLayout {
  PlateGeometry geometry;
  std::vector<FlatColumn> columns;
  std::vector<double> x_lines, y_lines;  // model coordinates
  double ox = 0.0, oy = 0.0;
};

FlatLayout flat_layout(const Request& request, double elastic_modulus_MPa) {
  FlatLayout out;
  const TwoWayInput& t = request.two_way;
  const auto& on_columns = t.column_edges;
  const double cx = t.columns.x_mm, cy = t.columns.y_mm;
  const double ox = on_columns[0] ? cx / 2.0 : 0.0, oy = on_columns[2] ? cy / 2.0 : 0.0;
  out.ox = ox;
  out.oy = oy;
  auto& x_lines = out.x_lines;
  auto& y_lines = out.y_lines;
  auto& columns = out.columns;
  PlateGeometry& g = out.geometry;
  g.x_spans_mm = t.x_spans_mm;
  g.y_spans_mm = t.y_spans_mm;
  if (g.x_spans_mm.empty() || g.y_spans_mm.empty()) return out;
  g.x_spans_mm.front() += ox;
  g.x_spans_mm.back() += on_columns[1] ? cx / 2.0 : 0.0;
  g.y_spans_mm.front() += oy;
  g.y_spans_mm.back() += on_columns[3] ? cy / 2.0 : 0.0;
  g.edges = {t.edges[0], t.edges[1], t.edges[2], t.edges[3]};
  g.interior_lines_supported = false;
  g.thickness_mm = request.slab.thickness_mm;
  g.elastic_modulus_MPa = elastic_modulus_MPa;
  g.poisson_ratio = t.poisson_ratio;
  if (t.mesh_per_bay > 0) g.mesh_per_bay = t.mesh_per_bay;
  x_lines = {ox};
  for (double s : t.x_spans_mm) x_lines.push_back(x_lines.back() + s);
  y_lines = {oy};
  for (double s : t.y_spans_mm) y_lines.push_back(y_lines.back() + s);
  // Columns at every grid intersection off the walls; 4 E Ic / H of each
  // column given (far ends fixed), Ic of the gross section.
  const double E = elastic_modulus_MPa;
  auto k_of = [&](double I) {
    double k = 0.0;
    for (double H : {t.columns.below_mm, t.columns.above_mm})
      if (H > 0.0) k += 4.0 * E * I / H;
    return k;
  };
  const double kx = k_of(cy * cx * cx * cx / 12.0), ky = k_of(cx * cy * cy * cy / 12.0);
  const std::size_t nx = t.x_spans_mm.size(), ny = t.y_spans_mm.size();
  for (std::size_t j = 0; j <= ny; ++j)
    for (std::size_t i = 0; i <= nx; ++i) {
      const bool on_wall = (i == 0 && !on_columns[0]) || (i == nx && !on_columns[1]) ||
                           (j == 0 && !on_columns[2]) || (j == ny && !on_columns[3]);
      if (on_wall) continue;
      FlatColumn c;
      c.name = flat_column_name(i, j);
      c.i = i;
      c.j = j;
      c.x_mm = x_lines[i] - ox;
      c.y_mm = y_lines[j] - oy;
      c.free = {i == 0, i == nx, j == 0, j == ny};
      columns.push_back(c);
      g.columns.push_back({x_lines[i] - cx / 2.0, x_lines[i] + cx / 2.0, y_lines[j] - cy / 2.0,
                           y_lines[j] + cy / 2.0, kx, ky});
    }
  for (const auto& a : request.loads.actions) {
    if (!a.plan_mm) continue;
    const auto& p = *a.plan_mm;
    g.mesh_lines_x_mm.push_back(p[0] + ox);
    g.mesh_lines_y_mm.push_back(p[1] + oy);
    if (p[2] != p[0]) g.mesh_lines_x_mm.push_back(p[2] + ox);
    if (p[3] != p[1]) g.mesh_lines_y_mm.push_back(p[3] + oy);
  }
  return out;
}

}  // namespace

PlateGeometry flat_plate_geometry(const Request& request, double elastic_modulus_MPa) {
  return flat_layout(request, elastic_modulus_MPa).geometry;
}

FlatPlate::FlatPlate(const Request& request, double elastic_modulus_MPa, const FlatStripRule& rule)
    : model_(flat_plate_geometry(request, elastic_modulus_MPa)),
      rule_(rule),
      requested_outer_(request.two_way.outer_layer) {
  const TwoWayInput& t = request.two_way;
  column_edges_ = t.column_edges;
  cx_ = t.columns.x_mm;
  cy_ = t.columns.y_mm;
  restrained_ = t.columns.restrained();
  FlatLayout layout = flat_layout(request, elastic_modulus_MPa);
  ox_ = layout.ox;
  oy_ = layout.oy;
  x_lines_ = std::move(layout.x_lines);
  y_lines_ = std::move(layout.y_lines);
  columns_ = std::move(layout.columns);

  // The strips and their regions' sections.
  const Axis ax{x_lines_, !column_edges_[0], !column_edges_[1], cx_};
  const Axis ay{y_lines_, !column_edges_[2], !column_edges_[3], cy_};
  for (const BarDirection dir : {BarDirection::x, BarDirection::y}) {
    const bool along_x = dir == BarDirection::x;
    const Axis& A = along_x ? ax : ay;  // the strips run along A
    const Axis& B = along_x ? ay : ax;  // and lie side by side across B
    const char a_name = along_x ? 'x' : 'y', b_name = along_x ? 'y' : 'x';
    const PlanAxis normal = along_x ? PlanAxis::x : PlanAxis::y;
    const auto& a_nodes = along_x ? model_.node_x_mm() : model_.node_y_mm();
    const double b_off = along_x ? oy_ : ox_, a_off = along_x ? ox_ : oy_;
    // Half-width of the column strip on line j toward `side` in span k of A.
    auto half = [&](std::size_t j, int side, std::size_t k) {
      if (side > 0) return j < B.spans() ? rule_.column_strip_each_side * std::min(A.span(k), B.span(j)) : B.c / 2.0;
      return j > 0 ? rule_.column_strip_each_side * std::min(A.span(k), B.span(j - 1)) : B.c / 2.0;
    };
    auto half_at_line = [&](std::size_t j, int side, std::size_t l) {
      double w = std::numeric_limits<double>::infinity();
      if (l > 0) w = std::min(w, half(j, side, l - 1));
      if (l < A.spans()) w = std::min(w, half(j, side, l));
      return w;
    };
    // A strip's extent across B in span k (or at line l): [lo, hi].
    struct Strip {
      bool column = true;
      std::size_t j = 0;  // the column line, or the row (middle strip between j and j + 1)
    };
    std::vector<Strip> strips;
    for (std::size_t j = 0; j <= B.spans(); ++j) {
      if (!B.wall(j)) strips.push_back({true, j});
      if (j < B.spans()) strips.push_back({false, j});
    }
    auto extent = [&](const Strip& s, auto&& width_of) -> std::array<double, 2> {
      if (s.column) return {B.lines[s.j] - width_of(s.j, -1), B.lines[s.j] + width_of(s.j, +1)};
      const double lo = B.wall(s.j) ? B.lines[s.j] : B.lines[s.j] + width_of(s.j, +1);
      const double hi = B.wall(s.j + 1) ? B.lines[s.j + 1] : B.lines[s.j + 1] - width_of(s.j + 1, -1);
      return {lo, hi};
    };
    for (const Strip& s : strips) {
      const std::string name = s.column ? "column strip " + std::string(1, b_name) + std::to_string(s.j)
                                        : "middle strip " + std::string(1, b_name) + std::to_string(s.j) + "-" +
                                              std::string(1, b_name) + std::to_string(s.j + 1);
      FlatStripRecord rec;
      rec.name = name;
      rec.direction = dir;
      rec.column = s.column;
      const std::size_t strip_index = strips_.size();
      // Bottom: per span, every node line between the faces.
      for (std::size_t k = 0; k < A.spans(); ++k) {
        const auto e = extent(s, [&](std::size_t j, int side) { return half(j, side, k); });
        const double a0 = A.face(k, +1), a1 = A.face(k + 1, -1);
        rec.pieces.push_back(along_x ? std::array<double, 4>{A.lines[k] - a_off, A.lines[k + 1] - a_off, e[0] - b_off, e[1] - b_off}
                                     : std::array<double, 4>{e[0] - b_off, e[1] - b_off, A.lines[k] - a_off, A.lines[k + 1] - a_off});
        Target tg;
        tg.demand.where = name + " span " + std::to_string(k + 1);
        tg.demand.face = Face::bottom;
        tg.demand.direction = dir;
        tg.sign = 1;
        tg.width_mm = e[1] - e[0];
        tg.strip = strip_index;
        tg.span = k;
        for (std::size_t n : nodes_strictly_within(a_nodes, a0, a1)) tg.sections.push_back({normal, a_nodes[n], e[0], e[1], 1});
        if (tg.sections.empty()) tg.sections.push_back({normal, (a0 + a1) / 2.0, e[0], e[1], 1});
        const double b_mid = s.column ? B.lines[s.j] : (e[0] + e[1]) / 2.0;
        (along_x ? tg.demand.y_mm : tg.demand.x_mm) = b_mid - b_off;
        (along_x ? tg.demand.x_mm : tg.demand.y_mm) = (A.lines[k] + A.lines[k + 1]) / 2.0 - a_off;
        targets_.push_back(std::move(tg));
      }
      // Top: per column line, at the faces (the wall's line).
      for (std::size_t l = 0; l <= A.spans(); ++l) {
        const auto e = extent(s, [&](std::size_t j, int side) { return half_at_line(j, side, l); });
        Target tg;
        tg.demand.where = name + " at " + std::string(1, a_name) + std::to_string(l);
        tg.demand.face = Face::top;
        tg.demand.direction = dir;
        tg.sign = -1;
        tg.width_mm = e[1] - e[0];
        tg.strip = strip_index;
        tg.span = l;
        tg.top = true;
        if (l > 0) tg.sections.push_back({normal, A.face(l, -1), e[0], e[1], -1});
        if (l < A.spans()) tg.sections.push_back({normal, A.face(l, +1), e[0], e[1], +1});
        const double b_mid = s.column ? B.lines[s.j] : (e[0] + e[1]) / 2.0;
        (along_x ? tg.demand.y_mm : tg.demand.x_mm) = b_mid - b_off;
        (along_x ? tg.demand.x_mm : tg.demand.y_mm) = A.lines[l] - a_off;
        targets_.push_back(std::move(tg));
      }
      strips_.push_back(std::move(rec));
    }
    // Bands over internal columns: band_each_side × each panel's width
    // either side of the column line; the whole panel width is half of
    // each panel either side.
    if (rule_.band_each_side > 0.0 && rule_.band_share > 0.0)
      for (std::size_t j = 1; j < B.spans(); ++j)
        for (std::size_t l = 1; l < A.spans(); ++l) {
          Target tg;
          const std::size_t i_col = along_x ? l : j, j_col = along_x ? j : l;
          tg.demand.where = flat_column_name(i_col, j_col) + " band";
          tg.demand.face = Face::top;
          tg.demand.direction = dir;
          tg.sign = -1;
          const double lo = B.lines[j] - rule_.band_each_side * B.span(j - 1);
          const double hi = B.lines[j] + rule_.band_each_side * B.span(j);
          tg.width_mm = hi - lo;
          tg.top = true;
          tg.span = l;
          tg.strip = std::numeric_limits<std::size_t>::max();
          const double p0 = B.lines[j] - B.span(j - 1) / 2.0, p1 = B.lines[j] + B.span(j) / 2.0;
          for (const int side : {-1, +1}) {
            tg.sections.push_back({normal, A.face(l, side), lo, hi, side});
            tg.panel.push_back({normal, A.face(l, side), p0, p1, side});
          }
          tg.panel_width_share = rule_.band_share;
          (along_x ? tg.demand.y_mm : tg.demand.x_mm) = B.lines[j] - b_off;
          (along_x ? tg.demand.x_mm : tg.demand.y_mm) = A.lines[l] - a_off;
          FlatStripRecord band{tg.demand.where, dir, true, {}};
          const double a = A.lines[l] - a_off;
          band.pieces.push_back(along_x ? std::array<double, 4>{a, a, lo - b_off, hi - b_off}
                                        : std::array<double, 4>{lo - b_off, hi - b_off, a, a});
          bands_.push_back(std::move(band));
          targets_.push_back(std::move(tg));
        }
  }
}

bool FlatPlate::regular_spans() const {
  for (const auto* lines : {&x_lines_, &y_lines_})
    for (std::size_t k = 0; k + 2 < lines->size(); ++k) {
      const double a = (*lines)[k + 1] - (*lines)[k], b = (*lines)[k + 2] - (*lines)[k + 1];
      if (std::max(a, b) > 1.25 * std::min(a, b) * (1.0 + 1e-12)) return false;
    }
  return true;
}

std::size_t FlatPlate::analyse(const std::vector<Action>& actions, const std::vector<Combination>& combinations,
                               const std::vector<BayArrangement>& arrangements, double uniform_load_ratio) {
  uniform_ratio_ = uniform_load_ratio;
  arrangements_ = arrangements.size();
  const PlateCaseSet set = plate_case_set(model_, actions, combinations, arrangements, ox_, oy_);
  uls_cases_ = set.uls;
  const PlateField field = model_.solve(set.cases);
  const double inf = std::numeric_limits<double>::infinity();
  start_field(field_, model_, ox_, oy_);
  for (auto& t : targets_) {
    t.uls = t.uls_all = t.qp = t.panel_uls = -inf;
    t.section_max.assign(t.sections.size(), -inf);
    t.section_min.assign(t.sections.size(), inf);
  }
  for (auto& c : columns_) c.V_N = c.M_x_Nmm = c.M_y_Nmm = 0.0;

  for (std::size_t c = 0; c < set.cases.size(); ++c) {
    const bool uls = set.is_uls(c), uls_all = set.is_uls_all_bays(c), qp = set.is_quasi_permanent(c);
    for (auto& t : targets_) {
      double best = -inf;
      for (std::size_t k = 0; k < t.sections.size(); ++k) {
        const Section& s = t.sections[k];
        const double m = field.section_moment(c, s.normal, s.at_mm, s.from_mm, s.to_mm, s.side);
        best = std::max(best, t.sign * m);
        if (uls) {
          t.section_max[k] = std::max(t.section_max[k], m);
          t.section_min[k] = std::min(t.section_min[k], m);
        }
      }
      if (uls) t.uls = std::max(t.uls, best);
      if (uls_all) t.uls_all = std::max(t.uls_all, best);
      if (qp) t.qp = std::max(t.qp, best);
      if (uls)
        for (const auto& s : t.panel)
          t.panel_uls = std::max(t.panel_uls, t.sign * field.section_moment(c, s.normal, s.at_mm, s.from_mm, s.to_mm, s.side));
    }
    if (!uls) continue;
    add_to_field(field_, field.node_moments(c));
    const auto R = field.column_reactions(c);
    const auto M = field.column_moments(c);
    for (std::size_t k = 0; k < columns_.size(); ++k) {
      columns_[k].V_N = std::max(columns_[k].V_N, R[k]);
      columns_[k].M_x_Nmm = std::max(columns_[k].M_x_Nmm, std::abs(M[k][0]));
      columns_[k].M_y_Nmm = std::max(columns_[k].M_y_Nmm, std::abs(M[k][1]));
    }
    // Wall reactions under each strip's end: kept on the top target there.
    const auto reactions = field.line_reactions(c);
    const auto& lines = model_.support_lines();
    for (auto& t : targets_) {
      if (!t.top || t.strip == std::numeric_limits<std::size_t>::max()) continue;
      const bool along_x = t.demand.direction == BarDirection::x;
      const auto& A = along_x ? x_lines_ : y_lines_;
      const double at = A[t.span];
      for (std::size_t l = 0; l < lines.size(); ++l) {
        const bool crosses = (lines[l].runs_along == PlanAxis::y) == along_x;
        if (!crosses || std::abs(lines[l].position_mm - at) > 1e-6 * std::max(1.0, at)) continue;
        const auto& s = t.sections.front();
        for (const auto& r : reactions[l]) {
          const double b = along_x ? r.y_mm : r.x_mm;
          if (b < s.from_mm - 1e-6 || b > s.to_mm + 1e-6) continue;
          if (t.demand.supports.empty()) t.demand.supports.push_back({t.demand.where, 0.0});
          t.demand.supports[0].V_Ed = std::max(t.demand.supports[0].V_Ed, r.N_per_mm * per_metre);
        }
      }
    }
  }
  return uls_cases_;
}

std::vector<RegionDemand> FlatPlate::design_regions(double pinned_edge_fraction, std::vector<std::string>& warnings) {
  std::vector<RegionDemand> out;
  const std::size_t none = std::numeric_limits<std::size_t>::max();
  // Bottom targets by (strip, span), to find a top target's end span.
  auto bottom_of = [&](std::size_t strip, std::size_t span) -> std::size_t {
    for (std::size_t k = 0; k < targets_.size(); ++k)
      if (!targets_[k].top && targets_[k].strip == strip && targets_[k].span == span) return k;
    return none;
  };
  std::vector<std::size_t> region_of(targets_.size(), none);
  for (std::size_t k = 0; k < targets_.size(); ++k) {
    Target& t = targets_[k];
    RegionDemand g = t.demand;
    g.supports.clear();
    const double M = std::max(t.uls, 0.0);
    g.M_Ed = M / t.width_mm * per_metre;
    if (!t.panel.empty()) g.M_Ed = std::max(g.M_Ed, t.panel_width_share * std::max(t.panel_uls, 0.0) / t.width_mm * per_metre);
    const bool ratio_known = t.uls_all > 1e-9 * std::max(1.0, std::abs(t.uls));
    g.quasi_permanent_to_uls = ratio_known ? std::clamp(t.qp / t.uls_all, 0.0, 1.0) : uniform_ratio_;
    if (!t.top && !(g.M_Ed > 0.0)) warnings.push_back(g.where + ": no sagging moment under any arrangement");
    region_of[k] = out.size();
    out.push_back(std::move(g));
  }
  // A band replaces the column strip's bars over its width: at least the
  // column strip's moment per metre there.
  for (std::size_t k = 0; k < targets_.size(); ++k) {
    const Target& t = targets_[k];
    if (t.panel.empty()) continue;
    RegionDemand& band = out[region_of[k]];
    for (std::size_t m = 0; m < targets_.size(); ++m) {
      const Target& s = targets_[m];
      if (!s.top || s.strip == none || !strips_[s.strip].column || s.demand.direction != t.demand.direction ||
          s.span != t.span)
        continue;
      const bool along_x = t.demand.direction == BarDirection::x;
      const double b_at = along_x ? t.demand.y_mm : t.demand.x_mm, b_strip = along_x ? s.demand.y_mm : s.demand.x_mm;
      if (std::abs(b_at - b_strip) > 1e-6 * std::max(1.0, std::abs(b_at))) continue;
      const RegionDemand& strip = out[region_of[m]];
      if (strip.M_Ed > band.M_Ed) {
        band.M_Ed = strip.M_Ed;
        band.quasi_permanent_to_uls = strip.quasi_permanent_to_uls;
      }
    }
  }
  // Outer lines where the slab is free to turn (a wall; columns given no
  // stiffness): at least the fraction of the strip's end span, and the
  // wall's shear on that span's bottom bars.
  for (std::size_t k = 0; k < targets_.size(); ++k) {
    const Target& t = targets_[k];
    if (!t.top || t.strip == none) continue;
    const bool along_x = t.demand.direction == BarDirection::x;
    const std::size_t spans = along_x ? bays_x() : bays_y();
    if (t.span != 0 && t.span != spans) continue;
    const std::size_t edge = along_x ? (t.span == 0 ? 0 : 1) : (t.span == 0 ? 2 : 3);
    const bool wall = !column_edges_[edge];
    const std::size_t b = bottom_of(t.strip, t.span == 0 ? 0 : spans - 1);
    if (b == none) continue;
    RegionDemand& top = out[region_of[k]];
    RegionDemand& bottom = out[region_of[b]];
    if ((wall || !restrained_) && pinned_edge_fraction > 0.0 && pinned_edge_fraction * bottom.M_Ed > top.M_Ed) {
      top.M_Ed = pinned_edge_fraction * bottom.M_Ed;
      top.quasi_permanent_to_uls = bottom.quasi_permanent_to_uls;
    }
    if (wall && !t.demand.supports.empty()) bottom.supports.push_back({t.demand.where, t.demand.supports[0].V_Ed});
  }
  // Span/depth per bay: on the longer span, carried by the bottom region
  // with the largest moment among the strips of the bay in that
  // direction not already carrying a bay (the bay's middle strip is its own).
  const std::size_t nx = bays_x(), ny = bays_y();
  for (std::size_t j = 0; j < ny; ++j)
    for (std::size_t i = 0; i < nx; ++i) {
      const double lx = x_lines_[i + 1] - x_lines_[i], ly = y_lines_[j + 1] - y_lines_[j];
      const bool in_x = lx >= ly;
      const BarDirection dir = in_x ? BarDirection::x : BarDirection::y;
      const std::size_t span = in_x ? i : j, row = in_x ? j : i;
      const char b_name = in_x ? 'y' : 'x';
      const std::string names[3] = {"column strip " + std::string(1, b_name) + std::to_string(row),
                                    "middle strip " + std::string(1, b_name) + std::to_string(row) + "-" +
                                        std::string(1, b_name) + std::to_string(row + 1),
                                    "column strip " + std::string(1, b_name) + std::to_string(row + 1)};
      std::size_t best = none;
      for (std::size_t k = 0; k < targets_.size(); ++k) {
        const Target& t = targets_[k];
        if (t.top || t.demand.direction != dir || t.span != span) continue;
        const std::string strip = strips_[t.strip].name;
        if (strip != names[0] && strip != names[1] && strip != names[2]) continue;
        const RegionDemand& g = out[region_of[k]];
        if (!g.span_where.empty() && strip != names[1]) continue;
        if (best == none || g.M_Ed > out[best].M_Ed || (strip == names[1] && !out[best].span_where.empty()))
          best = region_of[k];
      }
      if (best == none) continue;
      RegionDemand& g = out[best];
      const bool exterior = (i == 0 && column_edges_[0]) || (i + 1 == nx && column_edges_[1]) ||
                            (j == 0 && column_edges_[2]) || (j + 1 == ny && column_edges_[3]);
      const double L = std::max(lx, ly);
      g.span_where = plate_bay_name(i, j);
      g.span_kind = exterior ? SpanKind::flat_exterior_panel : SpanKind::flat_interior_panel;
      g.span_mm = L;
      g.long_span_mm = L;
      // The clear span in the long direction: the larger of the two
      // directions' clear spans (rectangular columns may turn the order).
      auto clear = [&](bool x) {
        const std::size_t k = x ? i : j, last = x ? nx : ny;
        const std::size_t edge0 = x ? 0 : 2, edge1 = x ? 1 : 3;
        const double c_dir = x ? cx_ : cy_;
        const double span_len = x ? lx : ly;
        return span_len - (k == 0 && !column_edges_[edge0] ? 0.0 : c_dir / 2.0) -
               (k + 1 == last && !column_edges_[edge1] ? 0.0 : c_dir / 2.0);
      };
      g.clear_span_mm = std::max(clear(true), clear(false));
      if (L > 2.0 * std::min(lx, ly))
        warnings.push_back(g.span_where + ": its longer span is more than twice the shorter: the panel works mostly "
                           "one way, beyond the span/depth rules for flat slab panels (ACI 318-19 8.3.1.1 is limited "
                           "to a ratio of 2); check its deflection by calculation");
    }
  outer_ = outer_layers(out, requested_outer_);
  return out;
}

PlateRecord FlatPlate::record() const {
  PlateRecord r;
  for (double x : x_lines_) r.x_lines_mm.push_back(x - ox_);
  for (double y : y_lines_) r.y_lines_mm.push_back(y - oy_);
  const PlateGeometry& g = model_.geometry();
  r.edges = {g.edges.x0, g.edges.x1, g.edges.y0, g.edges.y1};
  r.flat = true;
  r.column_edges = column_edges_;
  r.columns_restrained = restrained_;
  r.outline_mm = {-ox_, model_.x_grid_mm().back() - ox_, -oy_, model_.y_grid_mm().back() - oy_};
  for (std::size_t j = 0; j < bays_y(); ++j)
    for (std::size_t i = 0; i < bays_x(); ++i)
      r.bays.push_back({plate_bay_name(i, j), r.x_lines_mm[i], r.x_lines_mm[i + 1], r.y_lines_mm[j], r.y_lines_mm[j + 1]});
  r.field = field_;
  r.poisson_ratio = g.poisson_ratio;
  r.mesh_per_bay = g.mesh_per_bay;
  r.outer_layer = {to_string(outer_[0]), to_string(outer_[1])};
  r.arrangements = arrangements_;
  r.strips = strips_;
  r.bands = bands_;
  for (std::size_t s = 0; s < r.strips.size(); ++s) {
    auto& env = r.strips[s].envelope;
    for (const auto& t : targets_) {
      if (t.strip != s) continue;
      const double off = t.demand.direction == BarDirection::x ? ox_ : oy_;
      for (std::size_t k = 0; k < t.sections.size(); ++k)
        if (std::isfinite(t.section_max[k]))
          env.push_back({t.sections[k].at_mm - off, t.section_max[k] / t.width_mm * 1000.0,
                         t.section_min[k] / t.width_mm * 1000.0});
    }
    std::sort(env.begin(), env.end(), [](const auto& a, const auto& b) { return a[0] < b[0]; });
  }
  for (const auto& c : columns_) r.columns.push_back({c.name, c.x_mm, c.y_mm, cx_, cy_});
  r.strip_clause = rule_.clause;
  // The code's reach of the top bars past the faces, in clear spans.
  r.extents_clause = rule_.extents_clause;
  r.integrity = rule_.integrity;
  if (!rule_.extents_clause.empty())
    for (const auto& t : targets_) {
      if (!t.top || t.strip == std::numeric_limits<std::size_t>::max()) continue;
      const bool along_x = t.demand.direction == BarDirection::x;
      const auto& lines = along_x ? x_lines_ : y_lines_;
      const double c = along_x ? cx_ : cy_;
      const std::size_t last = lines.size() - 1;
      const bool wall_lo = !column_edges_[along_x ? 0 : 2], wall_hi = !column_edges_[along_x ? 1 : 3];
      auto face = [&](std::size_t l, int side) {
        const bool wall = (l == 0 && wall_lo) || (l == last && wall_hi);
        return wall ? lines[l] : lines[l] + side * c / 2.0;
      };
      auto clear = [&](std::size_t k) { return face(k + 1, -1) - face(k, +1); };
      const auto& list = strips_[t.strip].column ? rule_.column_strip_top : rule_.middle_strip_top;
      for (const auto& e : list)
        r.top_extents.push_back({t.demand.where, t.demand.direction, e.share,
                                 t.span > 0 ? e.of_clear_span * clear(t.span - 1) : 0.0,
                                 t.span < last ? e.of_clear_span * clear(t.span) : 0.0});
    }
  if (rule_.band_each_side > 0.0) r.band_clause = rule_.band_clause;
  return r;
}

}  // namespace armature
