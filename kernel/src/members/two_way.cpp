// TwoWayPlate: the two-way slab as a member. The plate model is built once
// (mesh lines through the located loads), every ULS case of combinations ×
// bay arrangements and the quasi-permanent cases are solved on its one
// factorisation, the Wood–Armer design moments are enveloped at the mesh
// nodes, and the regions take their peaks (DEVELOPERS.md, "Two-way slabs").
#include "armature/two_way.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <optional>

namespace armature {

namespace {

bool on_or_between(double v, double lo, double hi) {
  const double tol = 1e-9 * std::max(1.0, std::abs(hi));
  return v >= lo - tol && v <= hi + tol;
}

// The index of the interval [grid[k], grid[k+1]] holding v (the first).
std::size_t interval_of(const std::vector<double>& grid, double v) {
  for (std::size_t k = 0; k + 1 < grid.size(); ++k)
    if (on_or_between(v, grid[k], grid[k + 1])) return k;
  return grid.size() >= 2 ? grid.size() - 2 : 0;
}

// The node lines within [lo, hi].
std::vector<std::size_t> nodes_within(const std::vector<double>& nodes, double lo, double hi) {
  std::vector<std::size_t> out;
  for (std::size_t k = 0; k < nodes.size(); ++k)
    if (on_or_between(nodes[k], lo, hi)) out.push_back(k);
  return out;
}

std::size_t nearest_node(const std::vector<double>& nodes, double v) {
  std::size_t best = 0;
  for (std::size_t k = 1; k < nodes.size(); ++k)
    if (std::abs(nodes[k] - v) < std::abs(nodes[best] - v)) best = k;
  return best;
}

PlateGeometry geometry_of(const Request& req, double E_MPa) {
  PlateGeometry g;
  g.x_spans_mm = req.two_way.x_spans_mm;
  g.y_spans_mm = req.two_way.y_spans_mm;
  g.edges = {req.two_way.edges[0], req.two_way.edges[1], req.two_way.edges[2], req.two_way.edges[3]};
  g.thickness_mm = req.slab.thickness_mm;
  g.elastic_modulus_MPa = E_MPa;
  g.poisson_ratio = req.two_way.poisson_ratio;
  if (req.two_way.mesh_per_bay > 0) g.mesh_per_bay = req.two_way.mesh_per_bay;
  for (const auto& a : req.loads.actions) {
    if (!a.plan_mm) continue;
    const auto& p = *a.plan_mm;
    g.mesh_lines_x_mm.push_back(p[0]);
    g.mesh_lines_y_mm.push_back(p[1]);
    if (p[2] != p[0]) g.mesh_lines_x_mm.push_back(p[2]);
    if (p[3] != p[1]) g.mesh_lines_y_mm.push_back(p[3]);
  }
  return g;
}

}  // namespace

PlateCaseSet plate_case_set(const PlateModel& model, const std::vector<Action>& actions,
                            const std::vector<Combination>& combinations,
                            const std::vector<BayArrangement>& arrangements, double dx_mm, double dy_mm) {
  PlateCaseSet set;
  const BayArrangement every_bay{std::vector<bool>(model.bay_count(), true), 1.0};
  for (const auto& c : combinations) {
    if (c.limit_state != LimitState::uls) continue;
    for (const auto& a : arrangements) {
      set.cases.push_back(plate_load_case(model, actions, c, a, dx_mm, dy_mm));
      set.all_bays_uls.push_back(a.variable_fraction == 1.0 &&
                                 std::all_of(a.loaded.begin(), a.loaded.end(), [](bool b) { return b; }));
    }
  }
  set.uls = set.cases.size();
  if (std::none_of(set.all_bays_uls.begin(), set.all_bays_uls.end(), [](bool b) { return b; }))
    for (const auto& c : combinations)
      if (c.limit_state == LimitState::uls) set.cases.push_back(plate_load_case(model, actions, c, every_bay, dx_mm, dy_mm));
  set.extra_uls = set.cases.size() - set.uls;
  for (const auto& c : combinations)
    if (c.limit_state == LimitState::quasi_permanent)
      set.cases.push_back(plate_load_case(model, actions, c, every_bay, dx_mm, dy_mm));
  return set;
}

void start_field(PlateFieldRecord& field, const PlateModel& model, double dx_mm, double dy_mm) {
  field = {};
  for (double x : model.node_x_mm()) field.x_mm.push_back(x - dx_mm);
  for (double y : model.node_y_mm()) field.y_mm.push_back(y - dy_mm);
  const std::size_t nn = model.node_count();
  const double inf = std::numeric_limits<double>::infinity();
  for (auto* v : {&field.mx_max, &field.my_max, &field.mxy_max}) v->assign(nn, -inf);
  for (auto* v : {&field.mx_min, &field.my_min, &field.mxy_min}) v->assign(nn, inf);
  for (auto* v : {&field.bottom_x, &field.bottom_y, &field.top_x, &field.top_y}) v->assign(nn, 0.0);
}

void add_to_field(PlateFieldRecord& field, const std::vector<PlateMoments>& m) {
  for (std::size_t n = 0; n < m.size() && n < field.mx_max.size(); ++n) {
    const WoodArmerMoments w = wood_armer(m[n]);
    field.mx_max[n] = std::max(field.mx_max[n], m[n].mx);
    field.mx_min[n] = std::min(field.mx_min[n], m[n].mx);
    field.my_max[n] = std::max(field.my_max[n], m[n].my);
    field.my_min[n] = std::min(field.my_min[n], m[n].my);
    field.mxy_max[n] = std::max(field.mxy_max[n], m[n].mxy);
    field.mxy_min[n] = std::min(field.mxy_min[n], m[n].mxy);
    field.bottom_x[n] = std::max(field.bottom_x[n], w.bottom_x);
    field.bottom_y[n] = std::max(field.bottom_y[n], w.bottom_y);
    field.top_x[n] = std::max(field.top_x[n], w.top_x);
    field.top_y[n] = std::max(field.top_y[n], w.top_y);
  }
}

std::array<BarDirection, 2> outer_layers(const std::vector<RegionDemand>& regions, const std::string& requested) {
  std::array<BarDirection, 2> out{BarDirection::x, BarDirection::x};
  for (const Face face : {Face::bottom, Face::top}) {
    BarDirection dir = BarDirection::x;
    if (requested == "y") {
      dir = BarDirection::y;
    } else if (requested.empty()) {
      double mx = 0.0, my = 0.0;
      for (const auto& g : regions)
        if (g.face == face) {
          double& m = g.direction == BarDirection::x ? mx : my;
          m = std::max(m, g.M_Ed);
        }
      dir = my > mx ? BarDirection::y : BarDirection::x;
    }
    out[static_cast<std::size_t>(face)] = dir;
  }
  return out;
}

bool is_plate_corner_name(const std::string& where) { return where.rfind("corner ", 0) == 0; }

bool strictly_in_corner_zone(const std::vector<PlateCornerRecord>& corners, double x_front, double y_front, double x,
                             double y) {
  constexpr double tol = 1e-6;
  return std::any_of(corners.begin(), corners.end(), [&](const PlateCornerRecord& c) {
    const bool inner_x = c.x0_mm <= x_front + tol ? x < c.x1_mm - tol : x > c.x0_mm + tol;
    const bool inner_y = c.y0_mm <= y_front + tol ? y < c.y1_mm - tol : y > c.y0_mm + tol;
    return inner_x && inner_y;
  });
}

std::string plate_bay_name(std::size_t i, std::size_t j) {
  return "bay " + std::to_string(i + 1) + "," + std::to_string(j + 1);
}

std::string plate_line_name(const SupportLine& line, std::size_t bays_x, std::size_t bays_y) {
  const char axis = line.runs_along == PlanAxis::y ? 'x' : 'y';  // the coordinate the line sits at
  const std::size_t last = line.runs_along == PlanAxis::y ? bays_x : bays_y;
  if (line.interior) return std::string("grid ") + axis + std::to_string(line.grid);
  return std::string("edge ") + axis + (line.grid == 0 ? "0" : line.grid == last ? "1" : "?");
}

TwoWayPlate::TwoWayPlate(const Request& request, double elastic_modulus_MPa)
    : model_(geometry_of(request, elastic_modulus_MPa)), requested_outer_(request.two_way.outer_layer) {}

PlateLoadCase plate_load_case(const PlateModel& model, const std::vector<Action>& actions,
                              const Combination& combination, const BayArrangement& arrangement, double dx_mm,
                              double dy_mm) {
  const std::size_t nx = model.bays_x(), ny = model.bays_y(), nb = nx * ny;
  const auto& xg = model.x_grid_mm();
  const auto& yg = model.y_grid_mm();
  PlateLoadCase lc;
  lc.bay_pressures_MPa.assign(nb, 0.0);
  for (std::size_t k = 0; k < actions.size() && k < combination.factors.size(); ++k) {
    const Action& a = actions[k];
    const double f = combination.factors[k].loaded;
    const bool variable = is_variable(a.kind);
    auto factor_on = [&](std::size_t bay) {
      if (!variable) return f;
      return bay < arrangement.loaded.size() && arrangement.loaded[bay] ? f * arrangement.variable_fraction : 0.0;
    };
    if (a.distribution == Distribution::uniform && !a.plan_mm) {
      for (std::size_t b = 0; b < nb; ++b) lc.bay_pressures_MPa[b] += factor_on(b) * a.value;
      continue;
    }
    if (!a.plan_mm) continue;  // a strip's located load: refused on the way in
    const std::array<double, 4> p{(*a.plan_mm)[0] + dx_mm, (*a.plan_mm)[1] + dy_mm, (*a.plan_mm)[2] + dx_mm,
                                  (*a.plan_mm)[3] + dy_mm};
    if (a.distribution == Distribution::uniform) {  // a patch, split at the grid lines
      for (std::size_t j = 0; j < ny; ++j)
        for (std::size_t i = 0; i < nx; ++i) {
          const double x0 = std::max(p[0], xg[i]), x1 = std::min(p[2], xg[i + 1]);
          const double y0 = std::max(p[1], yg[j]), y1 = std::min(p[3], yg[j + 1]);
          const double w = factor_on(i + nx * j) * a.value;
          if (x1 > x0 && y1 > y0 && w != 0.0) lc.patches.push_back({x0, x1, y0, y1, w});
        }
    } else if (a.distribution == Distribution::line) {
      const bool along_x = p[1] == p[3];
      const auto& along = along_x ? xg : yg;
      const std::size_t across = interval_of(along_x ? yg : xg, along_x ? p[1] : p[0]);
      const double from = along_x ? p[0] : p[1], to = along_x ? p[2] : p[3];
      for (std::size_t k2 = 0; k2 + 1 < along.size(); ++k2) {
        const double s0 = std::max(from, along[k2]), s1 = std::min(to, along[k2 + 1]);
        const std::size_t bay = along_x ? k2 + nx * across : across + nx * k2;
        const double w = factor_on(bay) * a.value;
        if (s1 > s0 && w != 0.0)
          lc.lines.push_back({along_x ? PlanAxis::x : PlanAxis::y, along_x ? p[1] : p[0], s0, s1, w});
      }
    } else {
      const std::size_t bay = interval_of(xg, p[0]) + nx * interval_of(yg, p[1]);
      const double w = factor_on(bay) * a.value;
      if (w != 0.0) lc.points.push_back({p[0], p[1], w});
    }
  }
  return lc;
}

std::size_t TwoWayPlate::analyse(const std::vector<Action>& actions, const std::vector<Combination>& combinations,
                                 const std::vector<BayArrangement>& arrangements, double uniform_load_ratio) {
  uniform_ratio_ = uniform_load_ratio;
  arrangements_ = arrangements.size();
  const PlateCaseSet set = plate_case_set(model_, actions, combinations, arrangements);
  uls_cases_ = set.uls;
  const PlateField field = model_.solve(set.cases);
  const auto& xs = model_.node_x_mm();
  const auto& ys = model_.node_y_mm();
  const std::size_t nn = xs.size() * ys.size();
  start_field(field_, model_);
  all_bays_uls_.assign(nn, WoodArmerMoments{});
  all_bays_qp_.assign(nn, WoodArmerMoments{});
  auto take_max = [](WoodArmerMoments& into, const WoodArmerMoments& w) {
    into.bottom_x = std::max(into.bottom_x, w.bottom_x);
    into.bottom_y = std::max(into.bottom_y, w.bottom_y);
    into.top_x = std::max(into.top_x, w.top_x);
    into.top_y = std::max(into.top_y, w.top_y);
  };

  // Line segments of the supported lines, in the model's order.
  lines_.clear();
  const auto& xg = model_.x_grid_mm();
  const auto& yg = model_.y_grid_mm();
  for (const auto& line : model_.support_lines()) {
    const auto& grid = line.runs_along == PlanAxis::y ? yg : xg;
    for (std::size_t s = 0; s < line.segment_count; ++s)
      lines_.push_back({plate_line_name(line, bays_x(), bays_y()) + " segment " + std::to_string(s + 1),
                        line.runs_along, line.position_mm, grid[s], grid[s + 1], 0.0, 0.0});
  }

  for (std::size_t c = 0; c < set.cases.size(); ++c) {
    const auto m = field.node_moments(c);
    const bool uls = set.is_uls(c), uls_all = set.is_uls_all_bays(c), qp = set.is_quasi_permanent(c);
    if (uls) add_to_field(field_, m);
    if (uls_all || qp)
      for (std::size_t n = 0; n < nn; ++n) take_max(uls_all ? all_bays_uls_[n] : all_bays_qp_[n], wood_armer(m[n]));
    if (!uls) continue;
    // Line reactions per segment: the largest value per length, and the
    // resultant (each node's value over its tributary length, split at
    // the segment ends).
    const auto reactions = field.line_reactions(c);
    std::size_t first = 0;
    const auto& support_lines = model_.support_lines();
    for (std::size_t l = 0; l < support_lines.size(); ++l) {
      const auto& line = support_lines[l];
      const auto& nodes = line.runs_along == PlanAxis::y ? ys : xs;
      std::vector<double> totals(line.segment_count, 0.0);
      for (const auto& r : reactions[l]) {
        const double at = line.runs_along == PlanAxis::y ? r.y_mm : r.x_mm;
        const std::size_t k = nearest_node(nodes, at);
        const double before = k > 0 ? (nodes[k] - nodes[k - 1]) / 2.0 : 0.0;
        const double after = k + 1 < nodes.size() ? (nodes[k + 1] - nodes[k]) / 2.0 : 0.0;
        for (std::size_t s = 0; s < line.segment_count; ++s) {
          PlateLineRecord& seg = lines_[first + s];
          if (on_or_between(at, seg.from_mm, seg.to_mm)) seg.max_N_per_mm = std::max(seg.max_N_per_mm, r.N_per_mm);
          if (before > 0.0 && on_or_between(at - before / 2.0, seg.from_mm, seg.to_mm)) totals[s] += r.N_per_mm * before;
          if (after > 0.0 && on_or_between(at + after / 2.0, seg.from_mm, seg.to_mm)) totals[s] += r.N_per_mm * after;
        }
      }
      for (std::size_t s = 0; s < line.segment_count; ++s)
        lines_[first + s].max_total_N = std::max(lines_[first + s].max_total_N, totals[s]);
      first += line.segment_count;
    }
  }
  return uls_cases_;
}

std::vector<RegionDemand> TwoWayPlate::design_regions(double pinned_edge_fraction, const CornerRule& corner_rule,
                                                      std::vector<std::string>& warnings) {
  const std::size_t nx = bays_x(), ny = bays_y();
  const auto& xs = field_.x_mm;
  const auto& ys = field_.y_mm;
  const auto& xg = model_.x_grid_mm();
  const auto& yg = model_.y_grid_mm();
  const std::size_t row = xs.size();
  constexpr double per_metre = 1000.0;  // N·mm/mm → N·mm per metre width
  // The quasi-permanent to ULS ratio of a design moment at a node: from
  // the analyses with every bay loaded, bounded to [0, 1]; the ratio of
  // the uniform loads where the ULS moment there is nil.
  auto ratio_at = [&](std::size_t n, double WoodArmerMoments::*which) {
    const double u = all_bays_uls_[n].*which, q = all_bays_qp_[n].*which;
    if (!(u > 1e-9 * std::max(1.0, field_.bottom_x[n] + field_.bottom_y[n] + field_.top_x[n] + field_.top_y[n])) ||
        u <= 0.0)
      return uniform_ratio_;
    return std::clamp(q / u, 0.0, 1.0);
  };
  struct Peak {
    double value = 0.0;
    std::size_t node = 0;
  };
  auto peak_over = [&](const std::vector<std::size_t>& ix, const std::vector<std::size_t>& iy,
                       const std::vector<double>& values) {
    Peak p{-1.0, ix.front() + row * iy.front()};
    for (std::size_t j : iy)
      for (std::size_t i : ix)
        if (values[i + row * j] > p.value) p = {values[i + row * j], i + row * j};
    return p;
  };
  // Corner zones first (geometry only): where two pinned edges meet (any
  // two supported edges with fixed_edges_too) and the code sets corner
  // bars (CornerRule). The corner regions take their peaks inside a zone;
  // the outer pinned edges' top regions, and the bays' bottom ones where
  // the rule sets bottom corner bars, take theirs outside every zone (all
  // their nodes when none lies outside).
  corners_.clear();
  std::vector<std::array<std::size_t, 2>> corner_bays;
  if (!corner_rule.clause.empty()) {
    const PlateEdges& edges = model_.geometry().edges;
    for (const bool far_y : {false, true})
      for (const bool far_x : {false, true}) {
        const EndSupport ex = far_x ? edges.x1 : edges.x0, ey = far_y ? edges.y1 : edges.y0;
        const bool held = corner_rule.fixed_edges_too ? ex != EndSupport::free && ey != EndSupport::free
                                                      : ex == EndSupport::pinned && ey == EndSupport::pinned;
        if (!held) continue;
        const std::size_t i = far_x ? nx - 1 : 0, j = far_y ? ny - 1 : 0;
        const double lx = xg[i + 1] - xg[i], ly = yg[j + 1] - yg[j];
        const double reach = corner_rule.extent_of_longer_span * std::max(lx, ly);
        // At most half of the bay's side, so that two corners of a narrow
        // bay do not claim the same zone.
        const bool single_x = nx == 1, single_y = ny == 1;
        const double cap_x = single_x ? lx / 2.0 : lx, cap_y = single_y ? ly / 2.0 : ly;
        const double cx = far_x ? xg.back() : xg.front(), cy = far_y ? yg.back() : yg.front();
        PlateCornerRecord c;
        c.name = std::string("corner ") + (far_x ? "x1" : "x0") + " " + (far_y ? "y1" : "y0");
        c.bay = plate_bay_name(i, j);
        c.x0_mm = far_x ? cx - std::min(reach, cap_x) : cx;
        c.x1_mm = far_x ? cx : cx + std::min(reach, cap_x);
        c.y0_mm = far_y ? cy - std::min(reach, cap_y) : cy;
        c.y1_mm = far_y ? cy : cy + std::min(reach, cap_y);
        c.clause = corner_rule.clause;
        corners_.push_back(std::move(c));
        corner_bays.push_back({i, j});
      }
  }
  // Strictly inside a zone: a node on the zone's inner boundary stays in
  // the bay's and the line's regions (their bars cover it; the corner bars
  // end there).
  auto in_corner = [&](std::size_t n) {
    return strictly_in_corner_zone(corners_, xg.front(), yg.front(), xs[n % row], ys[n / row]);
  };
  auto peak_outside = [&](const std::vector<std::size_t>& ix, const std::vector<std::size_t>& iy,
                          const std::vector<double>& values) {
    bool found = false;
    Peak p{-1.0, 0};
    for (std::size_t j : iy)
      for (std::size_t i : ix) {
        const std::size_t n = i + row * j;
        if (in_corner(n)) continue;
        if (!found || values[n] > p.value) p = {values[n], n};
        found = true;
      }
    return found ? p : peak_over(ix, iy, values);
  };
  const bool bottom_corners = corner_rule.bottom && !corners_.empty();

  auto demand = [&](const std::string& where, Face face, BarDirection dir, const Peak& p,
                    double WoodArmerMoments::*which) {
    RegionDemand g;
    g.where = where;
    g.face = face;
    g.direction = dir;
    g.x_mm = xs[p.node % row];
    g.y_mm = ys[p.node / row];
    g.M_Ed = std::max(p.value, 0.0) * per_metre;
    g.quasi_permanent_to_uls = ratio_at(p.node, which);
    return g;
  };

  std::vector<RegionDemand> out;
  // bay_x, bay_y: the bays' regions' peaks (outside the corner zones where
  // the rule sets bottom corner bars); whole_x, whole_y: over the whole
  // bay, for the rules that read "the largest moment in the span or panel"
  // (the pinned edges' fraction, the ACI corner moment).
  std::vector<Peak> bay_x(nx * ny), bay_y(nx * ny), whole_x(nx * ny), whole_y(nx * ny);
  for (std::size_t j = 0; j < ny; ++j)
    for (std::size_t i = 0; i < nx; ++i) {
      const auto ix = nodes_within(xs, xg[i], xg[i + 1]), iy = nodes_within(ys, yg[j], yg[j + 1]);
      const std::string name = plate_bay_name(i, j);
      whole_x[i + nx * j] = peak_over(ix, iy, field_.bottom_x);
      whole_y[i + nx * j] = peak_over(ix, iy, field_.bottom_y);
      bay_x[i + nx * j] = bottom_corners ? peak_outside(ix, iy, field_.bottom_x) : whole_x[i + nx * j];
      bay_y[i + nx * j] = bottom_corners ? peak_outside(ix, iy, field_.bottom_y) : whole_y[i + nx * j];
      out.push_back(demand(name, Face::bottom, BarDirection::x, bay_x[i + nx * j], &WoodArmerMoments::bottom_x));
      out.push_back(demand(name, Face::bottom, BarDirection::y, bay_y[i + nx * j], &WoodArmerMoments::bottom_y));
      for (const BarDirection d : {BarDirection::x, BarDirection::y})
        if (!(out[out.size() - (d == BarDirection::x ? 2 : 1)].M_Ed > 0.0))
          warnings.push_back(name + ": no sagging moment in " + to_string(d) + " under any arrangement");
      // The span/depth of the bay: its shorter span, governed by the
      // bottom bars spanning it; continuous at a side on an interior grid
      // line or a fixed edge.
      const double lx = xg[i + 1] - xg[i], ly = yg[j + 1] - yg[j];
      const bool short_x = lx <= ly;
      RegionDemand& g = out[out.size() - (short_x ? 2 : 1)];
      // The outer edge at one side of the shorter span; none on an interior grid line.
      const auto side_edge = [&](bool low_side) -> std::optional<EndSupport> {
        const std::size_t k = short_x ? (low_side ? i : i + 1) : (low_side ? j : j + 1);
        const std::size_t last = short_x ? nx : ny;
        if (k > 0 && k < last) return std::nullopt;
        return model_.geometry().edges.*(short_x ? (k == 0 ? &PlateEdges::x0 : &PlateEdges::x1)
                                                 : (k == 0 ? &PlateEdges::y0 : &PlateEdges::y1));
      };
      const auto continuous = [&](bool low_side) {
        const auto e = side_edge(low_side);
        return !e || *e == EndSupport::fixed;
      };
      const auto free_side = [&](bool low_side) {
        const auto e = side_edge(low_side);
        return e && *e == EndSupport::free;
      };
      // A bay spanning to a free edge in its shorter direction is no
      // two-way panel of the span/depth rules: no such check (stated).
      // Both bottom regions know the bay's spans where it is supported on
      // four edges (fire by ly/lx); long_span_mm 0: a side is free.
      bool any_free = false;
      for (const EndSupport e : {i == 0 ? model_.geometry().edges.x0 : EndSupport::pinned,
                                 i + 1 == nx ? model_.geometry().edges.x1 : EndSupport::pinned,
                                 j == 0 ? model_.geometry().edges.y0 : EndSupport::pinned,
                                 j + 1 == ny ? model_.geometry().edges.y1 : EndSupport::pinned})
        any_free = any_free || e == EndSupport::free;
      if (!any_free)
        for (std::size_t k = out.size() - 2; k < out.size(); ++k) {
          out[k].span_mm = std::min(lx, ly);
          out[k].long_span_mm = std::max(lx, ly);
        }
      if (free_side(true) || free_side(false)) {
        warnings.push_back(name + ": a free edge across its shorter span; deflection by span/depth is not checked");
      } else {
        const int sides = int(continuous(true)) + int(continuous(false));
        g.span_where = name;
        g.span_mm = std::min(lx, ly);
        g.long_span_mm = std::max(lx, ly);
        g.span_kind = sides == 2 ? SpanKind::interior_span : sides == 1 ? SpanKind::end_span : SpanKind::simply_supported;
      }
    }
  std::size_t seg = 0;
  for (const auto& line : model_.support_lines()) {
    const bool along_y = line.runs_along == PlanAxis::y;  // bars across it run in x
    const std::size_t at = nearest_node(along_y ? xs : ys, line.position_mm);
    for (std::size_t s = 0; s < line.segment_count; ++s, ++seg) {
      const PlateLineRecord& rec = lines_[seg];
      const auto along = nodes_within(along_y ? ys : xs, rec.from_mm, rec.to_mm);
      const std::vector<std::size_t> fixed{at};
      const auto& values = along_y ? field_.top_x : field_.top_y;
      // An outer pinned edge's segment leaves the corner zones to the corner
      // bars; an interior line or a fixed edge keeps its whole segment
      // (its bars cross into the next bay, or hold a built-in edge).
      const bool leave_corners = !line.interior && line.support == EndSupport::pinned;
      Peak p = leave_corners ? (along_y ? peak_outside(fixed, along, values) : peak_outside(along, fixed, values))
                             : (along_y ? peak_over(fixed, along, values) : peak_over(along, fixed, values));
      const auto which = along_y ? &WoodArmerMoments::top_x : &WoodArmerMoments::top_y;
      RegionDemand g = demand(rec.name, Face::top, along_y ? BarDirection::x : BarDirection::y, p, which);
      // Shear at the line: its largest reaction per metre, all of it on
      // one face (DEVELOPERS.md, "Two-way slabs"). A pinned edge relies on
      // the bottom bars of the bay beside it, as a strip's pinned end.
      const SupportDemand shear{rec.name, rec.max_N_per_mm * per_metre};
      if (!line.interior && line.support == EndSupport::pinned) {
        const std::size_t i = along_y ? (line.grid == 0 ? 0 : nx - 1) : s;
        const std::size_t j = along_y ? s : (line.grid == 0 ? 0 : ny - 1);
        out[2 * (i + nx * j) + (along_y ? 0 : 1)].supports.push_back(shear);
      } else {
        g.supports.push_back(shear);
      }
      if (!line.interior && line.support == EndSupport::pinned && pinned_edge_fraction > 0.0) {
        // Partial fixity along a pinned edge: a fraction of the adjacent
        // bay's bottom moment across the edge, where that is larger.
        const std::size_t i = along_y ? (line.grid == 0 ? 0 : nx - 1) : s;
        const std::size_t j = along_y ? s : (line.grid == 0 ? 0 : ny - 1);
        const Peak& bay = along_y ? whole_x[i + nx * j] : whole_y[i + nx * j];
        const double M_fixity = pinned_edge_fraction * std::max(bay.value, 0.0) * per_metre;
        if (M_fixity > g.M_Ed) {
          g.M_Ed = M_fixity;
          g.quasi_permanent_to_uls = ratio_at(bay.node, along_y ? &WoodArmerMoments::bottom_x : &WoodArmerMoments::bottom_y);
        }
      }
      out.push_back(std::move(g));
    }
  }
  // The corner regions: top bars in x and y (and bottom where the rule
  // says) for the larger of the Wood–Armer moment in the zone and the
  // rule's share of the panel's largest sagging moment.
  for (std::size_t k = 0; k < corners_.size(); ++k) {
    const PlateCornerRecord& c = corners_[k];
    const auto [i, j] = corner_bays[k];
    const auto ix = nodes_within(xs, c.x0_mm, c.x1_mm), iy = nodes_within(ys, c.y0_mm, c.y1_mm);
    const Peak& px = whole_x[i + nx * j];
    const Peak& py = whole_y[i + nx * j];
    const Peak& panel = px.value >= py.value ? px : py;
    const auto panel_which = px.value >= py.value ? &WoodArmerMoments::bottom_x : &WoodArmerMoments::bottom_y;
    const double M_panel = corner_rule.panel_moment_fraction * std::max(panel.value, 0.0) * per_metre;
    for (const Face face : {Face::top, Face::bottom}) {
      if (face == Face::bottom && !corner_rule.bottom) continue;
      for (const BarDirection dir : {BarDirection::x, BarDirection::y}) {
        const bool top = face == Face::top, in_x = dir == BarDirection::x;
        const auto& values = top ? (in_x ? field_.top_x : field_.top_y) : (in_x ? field_.bottom_x : field_.bottom_y);
        const auto which = top ? (in_x ? &WoodArmerMoments::top_x : &WoodArmerMoments::top_y)
                               : (in_x ? &WoodArmerMoments::bottom_x : &WoodArmerMoments::bottom_y);
        RegionDemand g = demand(c.name, face, dir, peak_over(ix, iy, values), which);
        if (M_panel > g.M_Ed) {
          g.M_Ed = M_panel;
          g.quasi_permanent_to_uls = ratio_at(panel.node, panel_which);
        }
        out.push_back(std::move(g));
      }
    }
  }
  outer_ = outer_layers(out, requested_outer_);
  return out;
}

PlateRecord TwoWayPlate::record() const {
  PlateRecord r;
  r.x_lines_mm = model_.x_grid_mm();
  r.y_lines_mm = model_.y_grid_mm();
  r.outline_mm = {r.x_lines_mm.front(), r.x_lines_mm.back(), r.y_lines_mm.front(), r.y_lines_mm.back()};
  const PlateGeometry& g = model_.geometry();
  r.edges = {g.edges.x0, g.edges.x1, g.edges.y0, g.edges.y1};
  for (std::size_t j = 0; j < bays_y(); ++j)
    for (std::size_t i = 0; i < bays_x(); ++i)
      r.bays.push_back({plate_bay_name(i, j), r.x_lines_mm[i], r.x_lines_mm[i + 1], r.y_lines_mm[j], r.y_lines_mm[j + 1]});
  r.field = field_;
  r.reactions = lines_;
  r.corners = corners_;
  r.poisson_ratio = g.poisson_ratio;
  r.mesh_per_bay = g.mesh_per_bay;
  r.outer_layer = {to_string(outer_[0]), to_string(outer_[1])};
  r.arrangements = arrangements_;
  return r;
}

}  // namespace armature
