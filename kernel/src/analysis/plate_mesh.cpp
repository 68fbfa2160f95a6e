// The plate's input problems, its structured mesh and its supports.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <stdexcept>
#include <string>
#include <array>

#include "plate_internal.hpp"

namespace armature {

namespace {
constexpr std::size_t max_bays_per_direction = 20;
constexpr int min_mesh_per_bay = 2;
constexpr int max_mesh_per_bay = 40;
constexpr std::size_t max_elements = 40000;

std::string metres(double mm) {
  char text[32];
  std::snprintf(text, sizeof text, "%g m", mm / 1000.0);
  return text;
}

void add_span_problems(const std::vector<double>& spans_mm, const std::string& field,
                       InputProblems& problems) {
  if (spans_mm.empty()) {
    problems.add(field, "needs at least one span");
    return;
  }
  if (spans_mm.size() > max_bays_per_direction) {
    problems.add(field, "at most " + std::to_string(max_bays_per_direction) + " spans, got " +
                            std::to_string(spans_mm.size()));
  }
  for (std::size_t i = 0; i < spans_mm.size(); ++i) {
    const double L = spans_mm[i];
    if (!std::isfinite(L) || L <= 0.0) {
      problems.add(field + "[" + std::to_string(i) + "]",
                   std::isfinite(L) ? "must be a positive length, got " + metres(L)
                                    : std::string("must be a finite number"));
    }
  }
}

bool supported(EndSupport e) { return e != EndSupport::free; }
}  // namespace

void add_plate_problems(const PlateGeometry& g, InputProblems& problems) {
  add_span_problems(g.x_spans_mm, "slab.x_spans_m", problems);
  add_span_problems(g.y_spans_mm, "slab.y_spans_m", problems);
  if (!std::isfinite(g.thickness_mm) || g.thickness_mm <= 0.0)
    problems.add("slab.thickness_mm", "must be a positive thickness");
  // The modulus is the concrete's (the member takes it from the code's
  // material); moments do not depend on it, deflections do.
  if (!std::isfinite(g.elastic_modulus_MPa) || g.elastic_modulus_MPa <= 0.0)
    problems.add("concrete", "the elastic modulus must be positive");
  if (!std::isfinite(g.poisson_ratio) || g.poisson_ratio < 0.0 || g.poisson_ratio >= 0.5)
    problems.add("analysis.poisson_ratio", "must be at least 0 and less than 0.5");
  if (g.mesh_per_bay < min_mesh_per_bay || g.mesh_per_bay > max_mesh_per_bay) {
    problems.add("analysis.mesh_per_bay",
                 "must be a whole number from " + std::to_string(min_mesh_per_bay) + " to " +
                     std::to_string(max_mesh_per_bay) + ", got " + std::to_string(g.mesh_per_bay));
  } else {
    const std::size_t n = static_cast<std::size_t>(g.mesh_per_bay);
    const std::size_t elements = g.x_spans_mm.size() * g.y_spans_mm.size() * n * n;
    if (elements > max_elements) {
      problems.add("analysis.mesh_per_bay",
                   std::to_string(g.mesh_per_bay) + " elements per bay side make " +
                       std::to_string(elements) + " elements over " +
                       std::to_string(g.x_spans_mm.size() * g.y_spans_mm.size()) +
                       " bays; at most " + std::to_string(max_elements) +
                       " are analysed: use fewer");
    }
  }

  // Columns: positive outlines inside the plate, clear of supported lines.
  double X = 0.0, Y = 0.0;
  for (double L : g.x_spans_mm) X += L;
  for (double L : g.y_spans_mm) Y += L;
  const double tol = 1e-9 * std::max(X, Y);
  const PlateEdges& e = g.edges;
  for (std::size_t k = 0; k < g.columns.size(); ++k) {
    const PlateColumn& c = g.columns[k];
    const std::string field = "slab.columns[" + std::to_string(k) + "]";
    if (!(std::isfinite(c.x0_mm) && std::isfinite(c.x1_mm) && std::isfinite(c.y0_mm) && std::isfinite(c.y1_mm)) ||
        !(c.x1_mm > c.x0_mm) || !(c.y1_mm > c.y0_mm)) {
      problems.add(field, "needs a positive outline");
      continue;
    }
    if (!(std::isfinite(c.k_x_Nmm) && std::isfinite(c.k_y_Nmm) && c.k_x_Nmm >= 0.0 && c.k_y_Nmm >= 0.0)) {
      problems.add(field, "needs a rotational stiffness of at least 0");
      continue;
    }
    if (c.x0_mm < -tol || c.x1_mm > X + tol || c.y0_mm < -tol || c.y1_mm > Y + tol) {
      problems.add(field, "must lie on the slab");
      continue;
    }
    bool touches = (supported(e.x0) && c.x0_mm <= tol) || (supported(e.x1) && c.x1_mm >= X - tol) ||
                   (supported(e.y0) && c.y0_mm <= tol) || (supported(e.y1) && c.y1_mm >= Y - tol);
    if (g.interior_lines_supported) {
      double at = 0.0;
      for (std::size_t i = 0; i + 1 < g.x_spans_mm.size(); ++i)
        if (at += g.x_spans_mm[i]; c.x0_mm <= at + tol && c.x1_mm >= at - tol) touches = true;
      at = 0.0;
      for (std::size_t j = 0; j + 1 < g.y_spans_mm.size(); ++j)
        if (at += g.y_spans_mm[j]; c.y0_mm <= at + tol && c.y1_mm >= at - tol) touches = true;
    }
    if (touches) problems.add(field, "touches a supported line (a wall or edge): a column there is not modelled");
  }

  // The plate is a rigid body w = a + b x + c y until held: it needs three
  // held points not on one line (a supported line holds its two ends; a
  // column, which lets the slab turn over it, its centre), or a fixed edge.
  const bool any_fixed = e.x0 == EndSupport::fixed || e.x1 == EndSupport::fixed ||
                         e.y0 == EndSupport::fixed || e.y1 == EndSupport::fixed;
  if (!any_fixed && X > 0.0 && Y > 0.0) {
    std::vector<std::array<double, 2>> held;
    auto line_x = [&](double x) { held.push_back({x, 0.0}), held.push_back({x, Y}); };  // a line along y at x
    auto line_y = [&](double y) { held.push_back({0.0, y}), held.push_back({X, y}); };
    if (supported(e.x0)) line_x(0.0);
    if (supported(e.x1)) line_x(X);
    if (supported(e.y0)) line_y(0.0);
    if (supported(e.y1)) line_y(Y);
    if (g.interior_lines_supported) {
      double at = 0.0;
      for (std::size_t i = 0; i + 1 < g.x_spans_mm.size(); ++i) line_x(at += g.x_spans_mm[i]);
      at = 0.0;
      for (std::size_t j = 0; j + 1 < g.y_spans_mm.size(); ++j) line_y(at += g.y_spans_mm[j]);
    }
    for (const auto& c : g.columns) held.push_back({(c.x0_mm + c.x1_mm) / 2.0, (c.y0_mm + c.y1_mm) / 2.0});
    bool stable = false;
    for (std::size_t a = 0; a < held.size() && !stable; ++a)
      for (std::size_t b = a + 1; b < held.size() && !stable; ++b)
        for (std::size_t k = b + 1; k < held.size() && !stable; ++k) {
          const double area = (held[b][0] - held[a][0]) * (held[k][1] - held[a][1]) -
                              (held[b][1] - held[a][1]) * (held[k][0] - held[a][0]);
          stable = std::abs(area) > 1e-6 * X * Y;
        }
    if (!stable)
      problems.add("slab.edges", held.empty() ? "no edge, grid line or column supports the slab: it is a mechanism"
                                              : "the slab's supports lie on one line and it would turn about it "
                                                "(a mechanism): support or fix another edge");
  }
}

namespace detail {

std::array<std::size_t, 16> PlateMesh::element_dofs(std::size_t ex, std::size_t ey) const {
  std::array<std::size_t, 16> dofs{};
  const std::size_t nodes[4] = {node(ex, ey), node(ex + 1, ey), node(ex, ey + 1),
                                node(ex + 1, ey + 1)};
  for (std::size_t k = 0; k < 4; ++k)
    for (std::size_t d = 0; d < dofs_per_node; ++d)
      dofs[dofs_per_node * k + d] = dofs_per_node * nodes[k] + d;
  return dofs;
}

std::vector<std::size_t> PlateMesh::elements_containing(const std::vector<double>& grid, double v) {
  const double tol = 1e-9 * (grid.back() - grid.front());
  const std::size_t count = grid.size() - 1;
  if (v < grid.front() - tol || v > grid.back() + tol) return {};
  const auto above = std::upper_bound(grid.begin(), grid.end(), v);
  std::size_t e = above == grid.begin() ? 0 : static_cast<std::size_t>(above - grid.begin()) - 1;
  e = std::min(e, count - 1);
  std::vector<std::size_t> out;
  if (e > 0 && std::abs(v - grid[e]) <= tol) out.push_back(e - 1);
  out.push_back(e);
  if (e + 1 < count && std::abs(v - grid[e + 1]) <= tol) out.push_back(e + 1);
  return out;
}

namespace {
std::vector<double> grid_lines(const std::vector<double>& spans) {
  std::vector<double> grid{0.0};
  for (double L : spans) grid.push_back(grid.back() + L);
  return grid;
}

// Node coordinates along one axis: n equal elements per bay, then each
// extra position inside a bay either takes the nearest interior node of
// that bay (within a quarter of an element, if no other position has it)
// or adds a node. grid_nodes gets the node index of each grid line.
std::vector<double> node_lines(const std::vector<double>& grid, std::size_t n,
                               const std::vector<double>& extra, const char* axis,
                               std::vector<std::size_t>& grid_nodes) {
  const double tol = 1e-9 * (grid.back() - grid.front());
  for (double p : extra) {
    if (!std::isfinite(p) || p < grid.front() - tol || p > grid.back() + tol)
      throw std::invalid_argument(std::string("plate mesh line ") + axis + " = " +
                                  std::to_string(p) + " mm is off the plate");
  }
  std::vector<double> nodes;
  grid_nodes.clear();
  for (std::size_t i = 0; i + 1 < grid.size(); ++i) {
    const double g0 = grid[i], g1 = grid[i + 1], h = (g1 - g0) / static_cast<double>(n);
    std::vector<double> bay;
    std::vector<bool> taken(n + 1, false);
    for (std::size_t k = 0; k <= n; ++k) bay.push_back(g0 + h * static_cast<double>(k));
    bay.back() = g1;
    std::vector<double> added;
    for (double p : extra) {
      if (p <= g0 + tol || p >= g1 - tol) continue;
      const auto k = static_cast<std::size_t>(std::lround((p - g0) / h));
      if (k >= 1 && k + 1 <= n && !taken[k] && std::abs(bay[k] - p) <= 0.25 * h) {
        bay[k] = p;
        taken[k] = true;
      } else {
        added.push_back(p);
      }
    }
    bay.insert(bay.end(), added.begin(), added.end());
    std::sort(bay.begin(), bay.end());
    bay.erase(std::unique(bay.begin(), bay.end(), [tol](double a, double b) { return b - a <= tol; }),
              bay.end());
    grid_nodes.push_back(nodes.size());
    nodes.insert(nodes.end(), bay.begin(), bay.end() - 1);
  }
  grid_nodes.push_back(nodes.size());
  nodes.push_back(grid.back());
  return nodes;
}

// Each element column's bay and size class (sizes equal to 1e-12 share one).
void classify(const std::vector<double>& nodes, const std::vector<std::size_t>& grid_nodes,
              std::vector<std::size_t>& bay_of, std::vector<std::size_t>& class_of,
              std::vector<double>& sizes) {
  bay_of.assign(nodes.size() - 1, 0);
  class_of.assign(nodes.size() - 1, 0);
  sizes.clear();
  for (std::size_t b = 0; b + 1 < grid_nodes.size(); ++b)
    for (std::size_t e = grid_nodes[b]; e < grid_nodes[b + 1]; ++e) bay_of[e] = b;
  for (std::size_t e = 0; e + 1 < nodes.size(); ++e) {
    const double size = nodes[e + 1] - nodes[e];
    std::size_t c = 0;
    while (c < sizes.size() && std::abs(sizes[c] - size) > 1e-12 * size) ++c;
    if (c == sizes.size()) sizes.push_back(size);
    class_of[e] = c;
  }
}
}  // namespace

void build_mesh(PlateMesh& m) {
  const PlateGeometry& g = m.geometry;
  m.D = plate_flexural_rigidity(g.elastic_modulus_MPa, g.thickness_mm, g.poisson_ratio);
  m.nx = g.x_spans_mm.size();
  m.ny = g.y_spans_mm.size();
  const auto n = static_cast<std::size_t>(g.mesh_per_bay);
  m.x_grid = grid_lines(g.x_spans_mm);
  m.y_grid = grid_lines(g.y_spans_mm);
  // Columns' faces are mesh lines, so that their patches have nodes on them.
  std::vector<double> extra_x = g.mesh_lines_x_mm, extra_y = g.mesh_lines_y_mm;
  for (const auto& c : g.columns) {
    extra_x.push_back(c.x0_mm), extra_x.push_back(c.x1_mm);
    extra_y.push_back(c.y0_mm), extra_y.push_back(c.y1_mm);
  }
  m.node_x = node_lines(m.x_grid, n, extra_x, "x", m.grid_node_x);
  m.node_y = node_lines(m.y_grid, n, extra_y, "y", m.grid_node_y);
  classify(m.node_x, m.grid_node_x, m.column_bay, m.column_class, m.widths);
  classify(m.node_y, m.grid_node_y, m.row_bay, m.row_class, m.heights);
  m.stiffness.clear();
  for (double b : m.heights)
    for (double a : m.widths)
      m.stiffness.push_back(plate_element_stiffness(a, b, m.D, g.poisson_ratio));

  // Support lines: those running along y (x = const) by grid line, then
  // those running along x.
  m.lines.clear();
  m.line_nodes.clear();
  const std::size_t node_count = m.columns() * m.rows();
  std::vector<unsigned char> held(node_count * dofs_per_node, 0);
  m.lines_through_node.assign(node_count, 0);
  auto add_line = [&](PlanAxis along, std::size_t grid, bool interior, EndSupport support) {
    SupportLine line;
    line.runs_along = along;
    line.grid = grid;
    line.position_mm = along == PlanAxis::y ? m.x_grid[grid] : m.y_grid[grid];
    line.interior = interior;
    line.support = interior ? EndSupport::pinned : support;
    line.segment_count = along == PlanAxis::y ? m.ny : m.nx;
    std::vector<std::size_t> nodes;
    const Dof along_slope = along == PlanAxis::y ? dof_wy : dof_wx;
    if (along == PlanAxis::y) {
      for (std::size_t iy = 0; iy < m.rows(); ++iy) nodes.push_back(m.node(m.grid_node_x[grid], iy));
    } else {
      for (std::size_t ix = 0; ix < m.columns(); ++ix) nodes.push_back(m.node(ix, m.grid_node_y[grid]));
    }
    for (std::size_t nd : nodes) {
      // w = 0 along the line makes the slope along it 0 too; a fixed edge
      // holds the slope across it, and so the twist.
      held[dofs_per_node * nd + dof_w] = 1;
      held[dofs_per_node * nd + along_slope] = 1;
      if (line.support == EndSupport::fixed) {
        for (std::size_t d = 0; d < dofs_per_node; ++d) held[dofs_per_node * nd + d] = 1;
      }
      ++m.lines_through_node[nd];
    }
    m.lines.push_back(line);
    m.line_nodes.push_back(std::move(nodes));
  };
  if (supported(g.edges.x0)) add_line(PlanAxis::y, 0, false, g.edges.x0);
  if (g.interior_lines_supported)
    for (std::size_t i = 1; i < m.nx; ++i) add_line(PlanAxis::y, i, true, EndSupport::pinned);
  if (supported(g.edges.x1)) add_line(PlanAxis::y, m.nx, false, g.edges.x1);
  if (supported(g.edges.y0)) add_line(PlanAxis::x, 0, false, g.edges.y0);
  if (g.interior_lines_supported)
    for (std::size_t j = 1; j < m.ny; ++j) add_line(PlanAxis::x, j, true, EndSupport::pinned);
  if (supported(g.edges.y1)) add_line(PlanAxis::x, m.ny, false, g.edges.y1);

  // Column patches: every node on or inside the outline follows the
  // patch's rotations θx, θy about its centre (xc, yc), which does not move
  // down: w = θx (x − xc) + θy (y − yc), w,x = θx, w,y = θy, w,xy = 0.
  constexpr unsigned char follows = 2;
  m.column_nodes.assign(g.columns.size(), {});
  for (std::size_t k = 0; k < g.columns.size(); ++k) {
    const PlateColumn& c = g.columns[k];
    const double tol = 1e-9 * std::max(m.x_grid.back(), m.y_grid.back());
    for (std::size_t iy = 0; iy < m.rows(); ++iy)
      for (std::size_t ix = 0; ix < m.columns(); ++ix) {
        const double x = m.node_x[ix], y = m.node_y[iy];
        if (x < c.x0_mm - tol || x > c.x1_mm + tol || y < c.y0_mm - tol || y > c.y1_mm + tol) continue;
        const std::size_t nd = m.node(ix, iy);
        m.column_nodes[k].push_back(nd);
        for (std::size_t d = 0; d < dofs_per_node; ++d) held[dofs_per_node * nd + d] = follows;
      }
  }
  m.free_index.assign(held.size(), -1);
  m.free_count = 0;
  for (std::size_t k = 0; k < held.size(); ++k) {
    if (!held[k]) m.free_index[k] = static_cast<long>(m.free_count++);
    else if (held[k] == follows) m.free_index[k] = -2;
  }
  m.constraint.assign(held.size(), {});
  m.column_unknowns.assign(g.columns.size(), {});
  for (std::size_t k = 0; k < g.columns.size(); ++k) {
    const PlateColumn& c = g.columns[k];
    const double xc = (c.x0_mm + c.x1_mm) / 2.0, yc = (c.y0_mm + c.y1_mm) / 2.0;
    const long tx = static_cast<long>(m.free_count++), ty = static_cast<long>(m.free_count++);
    m.column_unknowns[k] = {tx, ty};
    for (std::size_t nd : m.column_nodes[k]) {
      const double x = m.node_x[nd % m.columns()], y = m.node_y[nd / m.columns()];
      const std::size_t base = dofs_per_node * nd;
      m.constraint[base + dof_w] = {{tx, x - xc}, {ty, y - yc}};
      m.constraint[base + dof_wx] = {{tx, 1.0}};
      m.constraint[base + dof_wy] = {{ty, 1.0}};
      // w,xy = 0: no unknown.
    }
  }
}

}  // namespace detail

// ---- PlateModel accessors --------------------------------------------------------

PlateModel::~PlateModel() = default;
PlateModel::PlateModel(const PlateModel&) = default;
PlateModel& PlateModel::operator=(const PlateModel&) = default;
PlateModel::PlateModel(PlateModel&&) noexcept = default;
PlateModel& PlateModel::operator=(PlateModel&&) noexcept = default;

const PlateGeometry& PlateModel::geometry() const { return mesh_->geometry; }
std::size_t PlateModel::bays_x() const { return mesh_->nx; }
std::size_t PlateModel::bays_y() const { return mesh_->ny; }
const std::vector<double>& PlateModel::x_grid_mm() const { return mesh_->x_grid; }
const std::vector<double>& PlateModel::y_grid_mm() const { return mesh_->y_grid; }
const std::vector<double>& PlateModel::node_x_mm() const { return mesh_->node_x; }
const std::vector<double>& PlateModel::node_y_mm() const { return mesh_->node_y; }
std::size_t PlateModel::unknown_count() const { return mesh_->free_count; }
const std::vector<SupportLine>& PlateModel::support_lines() const { return mesh_->lines; }

}  // namespace armature
