// The plate's stiffness assembled sparse and factorised once, load cases as
// columns of one right-hand side, and what is read from the solution:
// moments, bay and line peaks, reactions.
#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

#include "plate_internal.hpp"

namespace armature {

namespace detail {

namespace {

// ∫ Nᵢ Nⱼ ds of the cubic Hermite functions over each segment (value and
// derivative at each node): L/420 [156 22L 54 −13L; 22L 4L² 13L −3L²;
// 54 13L 156 −22L; −13L −3L² −22L 4L²], the beam's consistent mass matrix
// for unit mass per length (value from memory; its entries are the
// integrals of products of the functions in plate_element.cpp). Rows
// marked in `held` are set to zero (row and column cleared, 1 on the
// diagonal, so the matrix stays symmetric).
void factorise_line_mass(const std::vector<double>& nodes, const std::vector<unsigned char>& held,
                         Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>>& factor) {
  std::vector<Eigen::Triplet<double>> triplets;
  for (std::size_t e = 0; e + 1 < nodes.size(); ++e) {
    const double L = nodes[e + 1] - nodes[e];
    const double k[4][4] = {{156, 22 * L, 54, -13 * L},
                            {22 * L, 4 * L * L, 13 * L, -3 * L * L},
                            {54, 13 * L, 156, -22 * L},
                            {-13 * L, -3 * L * L, -22 * L, 4 * L * L}};
    for (std::size_t r = 0; r < 4; ++r) {
      for (std::size_t c = 0; c <= r; ++c) {
        const std::size_t gr = 2 * e + r, gc = 2 * e + c;
        if (held[gr] || held[gc]) continue;
        triplets.emplace_back(static_cast<int>(gr), static_cast<int>(gc), k[r][c] * L / 420.0);
      }
    }
  }
  for (std::size_t r = 0; r < held.size(); ++r)
    if (held[r]) triplets.emplace_back(static_cast<int>(r), static_cast<int>(r), 1.0);
  const auto size = static_cast<Eigen::Index>(2 * nodes.size());
  Eigen::SparseMatrix<double> M(size, size);
  M.setFromTriplets(triplets.begin(), triplets.end());
  factor.compute(M);
}

// For each fixed outer edge, its mass matrix. Where the edge meets another
// supported line, w = 0 along both makes every curvature but the twist
// zero at the node, and the twist is held by the fixed edge: the moment
// there is zero. Where the other line is a fixed edge too, the moment
// also starts flat along the edge (a clamped corner): its derivative is
// zero. Those nodes' reactions mix the two lines' and are not used.
void factorise_edge_masses(PlateMesh& m) {
  m.edge_mass.assign(m.lines.size(), nullptr);
  m.edge_mass_held.assign(m.lines.size(), {});
  for (std::size_t l = 0; l < m.lines.size(); ++l) {
    const auto& line = m.lines[l];
    if (line.interior || line.support != EndSupport::fixed) continue;
    const auto& nodes = m.line_nodes[l];
    const bool along_y = line.runs_along == PlanAxis::y;
    const EndSupport first = along_y ? m.geometry.edges.y0 : m.geometry.edges.x0;
    const EndSupport last = along_y ? m.geometry.edges.y1 : m.geometry.edges.x1;
    std::vector<unsigned char> held(2 * nodes.size(), 0);
    for (std::size_t k = 0; k < nodes.size(); ++k) {
      if (m.lines_through_node[nodes[k]] < 2) continue;
      held[2 * k] = 1;
      if ((k == 0 && first == EndSupport::fixed) ||
          (k + 1 == nodes.size() && last == EndSupport::fixed))
        held[2 * k + 1] = 1;
    }
    auto factor = std::make_shared<Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>>>();
    factorise_line_mass(along_y ? m.node_y : m.node_x, held, *factor);
    m.edge_mass[l] = std::move(factor);
    m.edge_mass_held[l] = std::move(held);
  }
}

// The stiffness of the free dofs, lower triangle only (SimplicialLDLT
// reads that one): each element's matrix (element(ex, ey)) through the
// constraints, and the columns' rotational stiffness × column_factor.
template <class ElementMatrix>
Eigen::SparseMatrix<double> assemble(const PlateMesh& m, ElementMatrix&& element, double column_factor) {
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(m.elements_x() * m.elements_y() * 136);
  for (std::size_t ey = 0; ey < m.elements_y(); ++ey) {
    for (std::size_t ex = 0; ex < m.elements_x(); ++ex) {
      const std::array<double, 256>& k = element(ex, ey);
      const auto dofs = m.element_dofs(ex, ey);
      for (std::size_t r = 0; r < 16; ++r) {
        const long fr = m.free_index[dofs[r]];
        if (fr >= 0) {  // the common case, without the constraint's indirection
          for (std::size_t c = 0; c < 16; ++c) {
            const long fc = m.free_index[dofs[c]];
            if (fc >= 0) {
              if (fc <= fr) triplets.emplace_back(static_cast<int>(fr), static_cast<int>(fc), k[16 * r + c]);
            } else if (fc == -2) {
              m.for_each_unknown(dofs[c], [&](long j, double cj) {
                if (j <= fr) triplets.emplace_back(static_cast<int>(fr), static_cast<int>(j), cj * k[16 * r + c]);
              });
            }
          }
        } else if (fr == -2) {  // a column patch's dof: its rotations' rows
          m.for_each_unknown(dofs[r], [&](long i, double ci) {
            for (std::size_t c = 0; c < 16; ++c)
              m.for_each_unknown(dofs[c], [&](long j, double cj) {
                if (j <= i) triplets.emplace_back(static_cast<int>(i), static_cast<int>(j), ci * cj * k[16 * r + c]);
              });
          });
        }
      }
    }
  }
  // The columns' rotational stiffness on their patches' rotations.
  for (std::size_t k = 0; k < m.column_unknowns.size(); ++k) {
    const PlateColumn& col = m.geometry.columns[k];
    const auto [tx, ty] = m.column_unknowns[k];
    if (col.k_x_Nmm > 0.0) triplets.emplace_back(static_cast<int>(tx), static_cast<int>(tx), column_factor * col.k_x_Nmm);
    if (col.k_y_Nmm > 0.0) triplets.emplace_back(static_cast<int>(ty), static_cast<int>(ty), column_factor * col.k_y_Nmm);
  }
  const auto size = static_cast<Eigen::Index>(m.free_count);
  Eigen::SparseMatrix<double> K(size, size);
  K.setFromTriplets(triplets.begin(), triplets.end());
  return K;
}

constexpr const char* mechanism_message =
    "the plate's stiffness matrix could not be factorised: the supports do not hold the slab (a mechanism)";

}  // namespace

void factorise(PlateMesh& m) {
  m.factor.compute(
      assemble(m, [&m](std::size_t ex, std::size_t ey) -> const auto& { return m.element_stiffness(ex, ey); }, 1.0));
  if (m.factor.info() != Eigen::Success) throw std::runtime_error(mechanism_message);
  factorise_edge_masses(m);
}

}  // namespace detail

PlateModel::PlateModel(PlateGeometry geometry) {
  InputProblems problems;
  add_plate_problems(geometry, problems);
  problems.raise_if_any();
  auto mesh = std::make_shared<detail::PlateMesh>();
  mesh->geometry = std::move(geometry);
  detail::build_mesh(*mesh);
  detail::factorise(*mesh);
  mesh_ = std::move(mesh);
}

namespace {

using detail::PlateMesh;

void require(bool ok, std::size_t c, const std::string& what) {
  if (!ok) throw std::invalid_argument("plate load case " + std::to_string(c + 1) + ": " + what);
}

bool finite(std::initializer_list<double> values) {
  return std::all_of(values.begin(), values.end(), [](double v) { return std::isfinite(v); });
}

// Refuses what cannot be put on the plate (see PlateModel::solve).
void check_case(const PlateMesh& m, const PlateLoadCase& lc, std::size_t c) {
  const double Lx = m.x_grid.back(), Ly = m.y_grid.back();
  const double tol = 1e-9 * std::max(Lx, Ly);
  auto in_x = [&](double v) { return v >= -tol && v <= Lx + tol; };
  auto in_y = [&](double v) { return v >= -tol && v <= Ly + tol; };
  require(lc.bay_pressures_MPa.empty() || lc.bay_pressures_MPa.size() == m.nx * m.ny, c,
          "one bay pressure per bay is needed");
  for (double p : lc.bay_pressures_MPa)
    require(std::isfinite(p), c, "a bay pressure is not finite");
  for (std::size_t i = 0; i < lc.patches.size(); ++i) {
    const auto& p = lc.patches[i];
    const std::string what = "patch " + std::to_string(i + 1);
    require(finite({p.x0_mm, p.x1_mm, p.y0_mm, p.y1_mm, p.pressure_MPa}), c,
            what + " is not finite");
    require(p.x0_mm < p.x1_mm && p.y0_mm < p.y1_mm, c, what + " has no area");
    require(in_x(p.x0_mm) && in_x(p.x1_mm) && in_y(p.y0_mm) && in_y(p.y1_mm), c,
            what + " is off the plate");
  }
  for (std::size_t i = 0; i < lc.lines.size(); ++i) {
    const auto& l = lc.lines[i];
    const std::string what = "line load " + std::to_string(i + 1);
    require(finite({l.at_mm, l.from_mm, l.to_mm, l.N_per_mm}), c, what + " is not finite");
    require(l.from_mm < l.to_mm, c, what + " has no length");
    const bool along_x = l.runs_along == PlanAxis::x;
    require(along_x ? in_y(l.at_mm) && in_x(l.from_mm) && in_x(l.to_mm)
                    : in_x(l.at_mm) && in_y(l.from_mm) && in_y(l.to_mm),
            c, what + " is off the plate");
  }
  for (std::size_t i = 0; i < lc.points.size(); ++i) {
    const auto& p = lc.points[i];
    const std::string what = "point load " + std::to_string(i + 1);
    require(finite({p.x_mm, p.y_mm, p.force_N}), c, what + " is not finite");
    require(in_x(p.x_mm) && in_y(p.y_mm), c, what + " is off the plate");
  }
}

// Elements whose span along one axis overlaps (lo, hi) with positive length.
std::pair<std::size_t, std::size_t> overlapping(const std::vector<double>& nodes, double lo,
                                                double hi) {
  const auto first = std::upper_bound(nodes.begin(), nodes.end(), lo);
  const auto last = std::lower_bound(nodes.begin(), nodes.end(), hi);
  std::size_t a = first == nodes.begin() ? 0 : static_cast<std::size_t>(first - nodes.begin()) - 1;
  std::size_t b = static_cast<std::size_t>(last - nodes.begin());
  b = std::min(b, nodes.size() - 1);
  return {a, b};  // elements a .. b − 1
}

// Consistent nodal loads of one case, element by element:
// scatter(ex, ey, element load vector).
template <class Scatter>
void element_loads(const PlateMesh& m, const PlateLoadCase& lc, Scatter&& scatter) {
  // A uniform pressure's element vector depends on the element's size:
  // once per size class (for a unit pressure), then scaled.
  std::vector<std::array<double, 16>> unit(m.class_count());
  std::vector<bool> made(m.class_count(), false);
  for (std::size_t bay = 0; bay < lc.bay_pressures_MPa.size(); ++bay) {
    const double p = lc.bay_pressures_MPa[bay];
    if (p == 0.0) continue;
    const std::size_t i = bay % m.nx, j = bay / m.nx;
    for (std::size_t ey = m.grid_node_y[j]; ey < m.grid_node_y[j + 1]; ++ey) {
      for (std::size_t ex = m.grid_node_x[i]; ex < m.grid_node_x[i + 1]; ++ex) {
        const std::size_t cls = m.element_class(ex, ey);
        if (!made[cls]) {
          const double a = m.node_x[ex + 1] - m.node_x[ex], b = m.node_y[ey + 1] - m.node_y[ey];
          unit[cls] = detail::element_patch_load(a, b, 0.0, a, 0.0, b, 1.0);
          made[cls] = true;
        }
        std::array<double, 16> fe = unit[cls];
        for (double& v : fe) v *= p;
        scatter(ex, ey, fe);
      }
    }
  }
  for (const auto& p : lc.patches) {
    const double x0 = std::max(p.x0_mm, 0.0), x1 = std::min(p.x1_mm, m.node_x.back());
    const double y0 = std::max(p.y0_mm, 0.0), y1 = std::min(p.y1_mm, m.node_y.back());
    const auto [ex0, ex1] = overlapping(m.node_x, x0, x1);
    const auto [ey0, ey1] = overlapping(m.node_y, y0, y1);
    for (std::size_t ey = ey0; ey < ey1; ++ey) {
      for (std::size_t ex = ex0; ex < ex1; ++ex) {
        const double xa = std::max(x0, m.node_x[ex]), xb = std::min(x1, m.node_x[ex + 1]);
        const double ya = std::max(y0, m.node_y[ey]), yb = std::min(y1, m.node_y[ey + 1]);
        if (xb <= xa || yb <= ya) continue;
        const double ox = m.node_x[ex], oy = m.node_y[ey];
        scatter(ex, ey,
                detail::element_patch_load(m.node_x[ex + 1] - ox, m.node_y[ey + 1] - oy, xa - ox,
                                           xb - ox, ya - oy, yb - oy, p.pressure_MPa));
      }
    }
  }
  for (const auto& l : lc.lines) {
    const bool along_x = l.runs_along == PlanAxis::x;
    const auto& across_nodes = along_x ? m.node_y : m.node_x;
    const auto& along_nodes = along_x ? m.node_x : m.node_y;
    // On a mesh line both neighbours interpolate w alike: one is loaded.
    const std::size_t e_across = PlateMesh::elements_containing(across_nodes, l.at_mm).front();
    const double lo = std::max(l.from_mm, 0.0), hi = std::min(l.to_mm, along_nodes.back());
    const auto [e0, e1] = overlapping(along_nodes, lo, hi);
    for (std::size_t e = e0; e < e1; ++e) {
      const double from = std::max(lo, along_nodes[e]), to = std::min(hi, along_nodes[e + 1]);
      if (to <= from) continue;
      const std::size_t ex = along_x ? e : e_across, ey = along_x ? e_across : e;
      const double ox = m.node_x[ex], oy = m.node_y[ey];
      const double a = m.node_x[ex + 1] - ox, b = m.node_y[ey + 1] - oy;
      const double at = l.at_mm - (along_x ? oy : ox);
      const double origin = along_x ? ox : oy;
      scatter(ex, ey,
              detail::element_line_load(a, b, l.runs_along, std::clamp(at, 0.0, along_x ? b : a),
                                        from - origin, to - origin, l.N_per_mm));
    }
  }
  for (const auto& p : lc.points) {
    const std::size_t ex = PlateMesh::elements_containing(m.node_x, p.x_mm).front();
    const std::size_t ey = PlateMesh::elements_containing(m.node_y, p.y_mm).front();
    const double ox = m.node_x[ex], oy = m.node_y[ey];
    const double a = m.node_x[ex + 1] - ox, b = m.node_y[ey + 1] - oy;
    scatter(ex, ey,
            detail::element_point_load(a, b, std::clamp(p.x_mm - ox, 0.0, a),
                                       std::clamp(p.y_mm - oy, 0.0, b), p.force_N));
  }
}

}  // namespace

ForceResultant PlateModel::load_resultant(const PlateLoadCase& lc) const {
  const auto& m = *mesh_;
  ForceResultant r;
  auto add = [&r](double F, double x, double y) {
    r.force_N += F;
    r.force_x_Nmm += F * x;
    r.force_y_Nmm += F * y;
  };
  for (std::size_t bay = 0; bay < lc.bay_pressures_MPa.size(); ++bay) {
    const std::size_t i = bay % m.nx, j = bay / m.nx;
    add(lc.bay_pressures_MPa[bay] * m.geometry.x_spans_mm[i] * m.geometry.y_spans_mm[j],
        0.5 * (m.x_grid[i] + m.x_grid[i + 1]), 0.5 * (m.y_grid[j] + m.y_grid[j + 1]));
  }
  for (const auto& p : lc.patches)
    add(p.pressure_MPa * (p.x1_mm - p.x0_mm) * (p.y1_mm - p.y0_mm), 0.5 * (p.x0_mm + p.x1_mm),
        0.5 * (p.y0_mm + p.y1_mm));
  for (const auto& l : lc.lines) {
    const double mid = 0.5 * (l.from_mm + l.to_mm);
    const bool along_x = l.runs_along == PlanAxis::x;
    add(l.N_per_mm * (l.to_mm - l.from_mm), along_x ? mid : l.at_mm, along_x ? l.at_mm : mid);
  }
  for (const auto& p : lc.points) add(p.force_N, p.x_mm, p.y_mm);
  return r;
}

PlateField PlateModel::solve(const std::vector<PlateLoadCase>& cases) const {
  const auto& m = *mesh_;
  for (std::size_t c = 0; c < cases.size(); ++c) check_case(m, cases[c], c);
  auto solution = std::make_shared<detail::PlateSolution>();
  solution->cases = cases.size();
  solution->load_cases = cases;
  solution->dofs = m.free_index.size();
  solution->f.assign(solution->dofs * cases.size(), 0.0);
  solution->u.assign(solution->dofs * cases.size(), 0.0);

  const auto free_count = static_cast<Eigen::Index>(m.free_count);
  Eigen::MatrixXd F(free_count, static_cast<Eigen::Index>(cases.size()));
  for (std::size_t c = 0; c < cases.size(); ++c) {
    double* f = solution->f.data() + c * solution->dofs;
    element_loads(m, cases[c],
                  [&](std::size_t ex, std::size_t ey, const std::array<double, 16>& fe) {
                    const auto dofs = m.element_dofs(ex, ey);
                    for (std::size_t k = 0; k < 16; ++k) f[dofs[k]] += fe[k];
                  });
    F.col(static_cast<Eigen::Index>(c)).setZero();
    for (std::size_t k = 0; k < solution->dofs; ++k)
      m.for_each_unknown(k, [&](long i, double ci) { F(i, static_cast<Eigen::Index>(c)) += ci * f[k]; });
  }
  if (!cases.empty()) {
    const Eigen::MatrixXd U = m.factor.solve(F);
    for (std::size_t c = 0; c < cases.size(); ++c) {
      double* u = solution->u.data() + c * solution->dofs;
      for (std::size_t k = 0; k < solution->dofs; ++k)
        m.for_each_unknown(k, [&](long i, double ci) { u[k] += ci * U(i, static_cast<Eigen::Index>(c)); });
    }
  }
  return PlateField(mesh_, std::move(solution));
}

// ---- the cracked (orthotropic) analysis -------------------------------------------

std::size_t PlateModel::elements_x() const { return mesh_->elements_x(); }
std::size_t PlateModel::elements_y() const { return mesh_->elements_y(); }

struct OrthotropicSolver::Impl {
  std::shared_ptr<const detail::PlateMesh> mesh;
  std::vector<detail::OrthotropicParts> parts;  // per element size class
  Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>> factor;
  bool analysed = false;
};

OrthotropicSolver::OrthotropicSolver(const PlateModel& model) : impl_(std::make_unique<Impl>()) {
  impl_->mesh = model.mesh_;
  const auto& m = *impl_->mesh;
  impl_->parts.reserve(m.class_count());
  for (std::size_t cy = 0; cy < m.heights.size(); ++cy)
    for (std::size_t cx = 0; cx < m.widths.size(); ++cx)
      impl_->parts.push_back(detail::orthotropic_parts(m.widths[cx], m.heights[cy]));
}
OrthotropicSolver::~OrthotropicSolver() = default;

OrthotropicSolution OrthotropicSolver::solve(const std::vector<ElementRigidity>& elements, const PlateLoadCase& load,
                                             double column_factor) {
  const auto& m = *impl_->mesh;
  const auto& parts = impl_->parts;
  const std::size_t ne = m.elements_x() * m.elements_y();
  if (elements.size() != ne)
    throw std::invalid_argument("plate rigidities: " + std::to_string(elements.size()) + " given for " +
                                std::to_string(ne) + " elements");
  for (const auto& e : elements)
    if (!(e.Dx_Nmm > 0.0 && e.Dy_Nmm > 0.0 && std::isfinite(e.Dx_Nmm) && std::isfinite(e.Dy_Nmm) &&
          std::isfinite(e.free_curvature_x) && std::isfinite(e.free_curvature_y)))
      throw std::invalid_argument("plate rigidities: every element needs positive, finite rigidities");
  if (!(column_factor > 0.0 && std::isfinite(column_factor)))
    throw std::invalid_argument("plate rigidities: the columns' stiffness factor must be positive");
  check_case(m, load, 0);
  std::array<double, 256> k{};
  auto element = [&](std::size_t ex, std::size_t ey) -> const std::array<double, 256>& {
    const ElementRigidity& r = elements[ex + m.elements_x() * ey];
    const auto& p = parts[m.element_class(ex, ey)];
    const double Dt = 0.5 * std::sqrt(r.Dx_Nmm * r.Dy_Nmm);
    for (std::size_t i = 0; i < 256; ++i) k[i] = r.Dx_Nmm * p.kxx[i] + r.Dy_Nmm * p.kyy[i] + Dt * p.ktt[i];
    return k;
  };
  // The pattern (and so the ordering) is the same for every rigidity:
  // analysed once, factorised per call.
  const Eigen::SparseMatrix<double> K = detail::assemble(m, element, column_factor);
  auto& factor = impl_->factor;
  if (!impl_->analysed) {
    factor.analyzePattern(K);
    impl_->analysed = true;
  }
  factor.factorize(K);
  if (factor.info() != Eigen::Success) throw std::runtime_error(detail::mechanism_message);
  const std::size_t dofs = m.free_index.size();
  std::vector<double> f(dofs, 0.0);
  element_loads(m, load, [&](std::size_t ex, std::size_t ey, const std::array<double, 16>& fe) {
    const auto d = m.element_dofs(ex, ey);
    for (std::size_t i = 0; i < 16; ++i) f[d[i]] += fe[i];
  });
  for (std::size_t ey = 0; ey < m.elements_y(); ++ey)
    for (std::size_t ex = 0; ex < m.elements_x(); ++ex) {
      const ElementRigidity& r = elements[ex + m.elements_x() * ey];
      if (r.free_curvature_x == 0.0 && r.free_curvature_y == 0.0) continue;
      const auto& p = parts[m.element_class(ex, ey)];
      const auto d = m.element_dofs(ex, ey);
      for (std::size_t i = 0; i < 16; ++i)
        f[d[i]] -= r.Dx_Nmm * r.free_curvature_x * p.ixx[i] + r.Dy_Nmm * r.free_curvature_y * p.iyy[i];
    }
  Eigen::VectorXd F = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(m.free_count));
  for (std::size_t i = 0; i < dofs; ++i) m.for_each_unknown(i, [&](long j, double c) { F(j) += c * f[i]; });
  const Eigen::VectorXd U = factor.solve(F);
  std::vector<double> u(dofs, 0.0);
  for (std::size_t i = 0; i < dofs; ++i) m.for_each_unknown(i, [&](long j, double c) { u[i] += c * U(j); });

  OrthotropicSolution out;
  out.w_mm.resize(m.columns() * m.rows());
  for (std::size_t n = 0; n < out.w_mm.size(); ++n) out.w_mm[n] = u[detail::dofs_per_node * n + detail::dof_w];
  out.element_moments.resize(ne);
  for (std::size_t ey = 0; ey < m.elements_y(); ++ey)
    for (std::size_t ex = 0; ex < m.elements_x(); ++ex) {
      const double a = m.node_x[ex + 1] - m.node_x[ex], b = m.node_y[ey + 1] - m.node_y[ey];
      const auto shape = detail::element_shape(a, b, 0.5, 0.5);
      const auto d = m.element_dofs(ex, ey);
      double wxx = 0, wyy = 0, wxy = 0;
      for (std::size_t i = 0; i < 16; ++i) {
        wxx += shape.wxx[i] * u[d[i]];
        wyy += shape.wyy[i] * u[d[i]];
        wxy += shape.wxy[i] * u[d[i]];
      }
      const ElementRigidity& r = elements[ex + m.elements_x() * ey];
      out.element_moments[ex + m.elements_x() * ey] = {-r.Dx_Nmm * (wxx + r.free_curvature_x),
                                                       -r.Dy_Nmm * (wyy + r.free_curvature_y),
                                                       -std::sqrt(r.Dx_Nmm * r.Dy_Nmm) * wxy};
    }
  return out;
}


OrthotropicSolution PlateModel::solve_orthotropic(const std::vector<ElementRigidity>& elements,
                                                  const PlateLoadCase& load, double column_factor) const {
  OrthotropicSolver solver(*this);
  return solver.solve(elements, load, column_factor);
}

// ---- the field ---------------------------------------------------------------

PlateField::PlateField(std::shared_ptr<const detail::PlateMesh> mesh,
                       std::shared_ptr<const detail::PlateSolution> solution)
    : mesh_(std::move(mesh)), solution_(std::move(solution)) {}

std::size_t PlateField::case_count() const { return solution_->cases; }

namespace {

struct ElementValues {
  double w = 0.0;
  PlateMoments m{};
};

ElementValues element_values(const PlateMesh& m, const double* u, std::size_t ex, std::size_t ey,
                             double x, double y) {
  const double ox = m.node_x[ex], oy = m.node_y[ey];
  const double a = m.node_x[ex + 1] - ox, b = m.node_y[ey + 1] - oy;
  const auto shape = detail::element_shape(a, b, std::clamp((x - ox) / a, 0.0, 1.0),
                                           std::clamp((y - oy) / b, 0.0, 1.0));
  const auto dofs = m.element_dofs(ex, ey);
  double w = 0, wxx = 0, wyy = 0, wxy = 0;
  for (std::size_t k = 0; k < 16; ++k) {
    const double d = u[dofs[k]];
    w += shape.w[k] * d;
    wxx += shape.wxx[k] * d;
    wyy += shape.wyy[k] * d;
    wxy += shape.wxy[k] * d;
  }
  const double nu = m.geometry.poisson_ratio;
  return {w, {-m.D * (wxx + nu * wyy), -m.D * (wyy + nu * wxx), -m.D * (1.0 - nu) * wxy}};
}

ElementValues averaged_values(const PlateMesh& m, const double* u, double x, double y) {
  const auto exs = PlateMesh::elements_containing(m.node_x, x);
  const auto eys = PlateMesh::elements_containing(m.node_y, y);
  if (exs.empty() || eys.empty())
    throw std::invalid_argument("plate point (" + std::to_string(x) + ", " + std::to_string(y) +
                                ") mm is off the plate");
  ElementValues sum;
  for (std::size_t ey : eys) {
    for (std::size_t ex : exs) {
      const auto v = element_values(m, u, ex, ey, x, y);
      sum.w += v.w;
      sum.m.mx += v.m.mx;
      sum.m.my += v.m.my;
      sum.m.mxy += v.m.mxy;
    }
  }
  const double count = static_cast<double>(exs.size() * eys.size());
  return {sum.w / count, {sum.m.mx / count, sum.m.my / count, sum.m.mxy / count}};
}

void check_case_index(std::size_t c, std::size_t cases) {
  if (c >= cases)
    throw std::out_of_range("plate load case " + std::to_string(c + 1) + " of " +
                            std::to_string(cases));
}

// Upward reaction at every held dof (zero at free ones): f − K u, with
// K u summed element by element at the held dofs.
std::vector<double> held_reactions(const PlateMesh& m, const detail::PlateSolution& s,
                                   std::size_t c) {
  const double* u = s.displacement(c);
  const double* f = s.load(c);
  std::vector<double> Ku(s.dofs, 0.0);
  for (std::size_t ey = 0; ey < m.elements_y(); ++ey) {
    for (std::size_t ex = 0; ex < m.elements_x(); ++ex) {
      const auto dofs = m.element_dofs(ex, ey);
      bool any_held = false;
      for (std::size_t k : dofs) any_held = any_held || m.free_index[k] < 0;
      if (!any_held) continue;
      const auto& k = m.element_stiffness(ex, ey);
      for (std::size_t r = 0; r < 16; ++r) {
        if (m.free_index[dofs[r]] >= 0) continue;
        double sum = 0.0;
        for (std::size_t col = 0; col < 16; ++col) sum += k[16 * r + col] * u[dofs[col]];
        Ku[dofs[r]] += sum;
      }
    }
  }
  std::vector<double> R(s.dofs, 0.0);
  for (std::size_t k = 0; k < s.dofs; ++k)
    if (m.free_index[k] < 0) R[k] = f[k] - Ku[k];
  return R;
}

}  // namespace

double PlateField::deflection_at(std::size_t c, double x_mm, double y_mm) const {
  check_case_index(c, solution_->cases);
  return averaged_values(*mesh_, solution_->displacement(c), x_mm, y_mm).w;
}

PlateMoments PlateField::moments_at(std::size_t c, double x_mm, double y_mm) const {
  check_case_index(c, solution_->cases);
  return averaged_values(*mesh_, solution_->displacement(c), x_mm, y_mm).m;
}

namespace {
// Tributary length of node k of a mesh line: half of each element beside it.
double tributary(const std::vector<double>& along, std::size_t k) {
  return 0.5 * ((k > 0 ? along[k] - along[k - 1] : 0.0) +
                (k + 1 < along.size() ? along[k + 1] - along[k] : 0.0));
}

// Superconvergent patch recovery of the moments at the nodes (Zienkiewicz
// and Zhu's patch recovery, 1992): inside each element the moments are
// sampled at the 2 × 2 Gauss points, where the element's curvatures are
// most accurate (for a beam element under uniform load, exact), and a
// biquadratic is fitted by least squares through the 16 samples of a
// block of 2 × 2 elements of one bay around the node, then evaluated at
// the node. At a node on a bay's side (a support line or an edge) each
// bay beside it extrapolates from its own side, and the bays are
// averaged: the moment is continuous across a line support but kinked,
// so no fit spans one.
//
// The fit and the evaluation factorise by axis: along one axis a patch
// is two elements from node `start`, with samples at the two Gauss points
// of each, and the weights of a quadratic least-squares fit through those
// four points, evaluated at the node, are all it takes.
std::array<double, 4> patch_weights(const std::vector<double>& nodes, std::size_t start,
                                    std::size_t node) {
  const double g = 0.5 - 0.5 / std::sqrt(3.0);
  const double x0 = nodes[start], h = nodes[start + 1] - x0, h2 = nodes[start + 2] - nodes[start + 1];
  // Coordinates in units of the first element, from its start.
  const double u[4] = {g, 1 - g, 1 + g * h2 / h, 1 + (1 - g) * h2 / h};
  Eigen::Matrix<double, 4, 3> A;
  for (int i = 0; i < 4; ++i) A.row(i) << 1.0, u[i], u[i] * u[i];
  const double t = (nodes[node] - x0) / h;
  const Eigen::RowVector3d at(1.0, t, t * t);
  const Eigen::RowVector4d row = at * (A.transpose() * A).inverse() * A.transpose();
  return {row(0), row(1), row(2), row(3)};
}

// Bays (along one axis) whose closed range holds mesh line k (grid_nodes:
// the node index of each grid line).
std::array<std::size_t, 2> bays_beside(std::size_t k, const std::vector<std::size_t>& grid_nodes,
                                       std::size_t* count) {
  std::array<std::size_t, 2> out{};
  *count = 0;
  const auto above = std::upper_bound(grid_nodes.begin(), grid_nodes.end(), k);
  const auto bay = static_cast<std::size_t>(above - grid_nodes.begin()) - 1;  // grid line ≤ k
  if (grid_nodes[bay] == k && bay > 0) out[(*count)++] = bay - 1;
  if (bay + 1 < grid_nodes.size()) out[(*count)++] = bay;
  return out;
}

// The patches (two elements along one axis) for mesh line k, in each bay
// beside it: centred on the line where the bay has elements on both
// sides, unless the moment is kinked along the line (a line or point load
// on it), where one patch on each side extrapolates to the line rather
// than fitting across the kink. A side with fewer than two elements
// between the line and the bay's side has no room for a patch of its own
// (moved into the bay it would straddle the kink): the other side alone
// extrapolates. With their weights at the line.
struct Patches {
  std::array<std::size_t, 4> start{};
  std::array<std::array<double, 4>, 4> weight{};
  std::size_t count = 0;
};
Patches patches_for(std::size_t k, const std::vector<double>& nodes,
                    const std::vector<std::size_t>& grid_nodes, bool kinked) {
  Patches out;
  std::size_t bay_count = 0;
  const auto bays = bays_beside(k, grid_nodes, &bay_count);
  auto add = [&](std::size_t start) {
    out.start[out.count] = start;
    out.weight[out.count] = patch_weights(nodes, start, k);
    ++out.count;
  };
  for (std::size_t a = 0; a < bay_count; ++a) {
    const std::size_t lo = grid_nodes[bays[a]], hi = grid_nodes[bays[a] + 1];
    const std::size_t first = lo, last = hi - 2;  // patch starts within the bay
    const bool before = k > lo, after = k < hi;
    if (before && after && !kinked) {
      add(std::clamp(k - 1, first, last));
      continue;
    }
    const bool room_before = before && k >= lo + 2, room_after = after && k + 2 <= hi;
    if (room_before) add(k - 2);
    if (room_after) add(k);
    if (room_before || room_after) continue;
    // Fewer than two elements on either side (a bay of two or three
    // elements): the nearest patch within the bay.
    if (before) add(std::clamp(k < 2 ? 0 : k - 2, first, last));
    if (after) add(std::clamp(k, first, last));
  }
  return out;
}

// Mesh lines along which a load case's moments are kinked: those a line
// load runs along or a point load sits on (kinked_x: lines x = const).
void kinked_lines(const PlateMesh& m, const PlateLoadCase& lc, std::vector<bool>& kinked_x,
                  std::vector<bool>& kinked_y) {
  kinked_x.assign(m.columns(), false);
  kinked_y.assign(m.rows(), false);
  const double tol = 1e-9 * std::max(m.node_x.back(), m.node_y.back());
  auto mark = [tol](const std::vector<double>& nodes, double v, std::vector<bool>& kinked) {
    const auto it = std::lower_bound(nodes.begin(), nodes.end(), v - tol);
    if (it != nodes.end() && std::abs(*it - v) <= tol)
      kinked[static_cast<std::size_t>(it - nodes.begin())] = true;
  };
  for (const auto& l : lc.lines) {
    if (l.runs_along == PlanAxis::y)
      mark(m.node_x, l.at_mm, kinked_x);
    else
      mark(m.node_y, l.at_mm, kinked_y);
  }
  for (const auto& p : lc.points) {
    mark(m.node_x, p.x_mm, kinked_x);
    mark(m.node_y, p.y_mm, kinked_y);
  }
}

}  // namespace

std::vector<PlateMoments> PlateField::node_moments(std::size_t c) const {
  check_case_index(c, solution_->cases);
  const auto& m = *mesh_;
  const double* u = solution_->displacement(c);
  const double nu = m.geometry.poisson_ratio;
  const std::size_t ex_count = m.elements_x(), ey_count = m.elements_y();

  // Moments at each element's Gauss points (index gx + 2 gy); the shapes
  // there depend on the element's size only, so once per size class.
  const double g = 0.5 - 0.5 / std::sqrt(3.0);
  std::vector<std::array<detail::ElementShape, 4>> gauss(m.class_count());
  for (std::size_t cy = 0; cy < m.heights.size(); ++cy)
    for (std::size_t cx = 0; cx < m.widths.size(); ++cx)
      for (std::size_t k = 0; k < 4; ++k)
        gauss[cx + m.widths.size() * cy][k] = detail::element_shape(
            m.widths[cx], m.heights[cy], k % 2 == 0 ? g : 1 - g, k / 2 == 0 ? g : 1 - g);
  std::vector<PlateMoments> samples(ex_count * ey_count * 4);
  for (std::size_t ey = 0; ey < ey_count; ++ey) {
    for (std::size_t ex = 0; ex < ex_count; ++ex) {
      const auto dofs = m.element_dofs(ex, ey);
      const auto& shapes = gauss[m.element_class(ex, ey)];
      for (std::size_t k = 0; k < 4; ++k) {
        double wxx = 0, wyy = 0, wxy = 0;
        for (std::size_t d = 0; d < 16; ++d) {
          const double v = u[dofs[d]];
          wxx += shapes[k].wxx[d] * v;
          wyy += shapes[k].wyy[d] * v;
          wxy += shapes[k].wxy[d] * v;
        }
        samples[4 * (ex + ex_count * ey) + k] = {-m.D * (wxx + nu * wyy), -m.D * (wyy + nu * wxx),
                                                 -m.D * (1.0 - nu) * wxy};
      }
    }
  }

  std::vector<bool> kinked_x, kinked_y;
  kinked_lines(m, solution_->load_cases[c], kinked_x, kinked_y);
  std::vector<Patches> column_patches(m.columns());
  for (std::size_t ix = 0; ix < m.columns(); ++ix)
    column_patches[ix] = patches_for(ix, m.node_x, m.grid_node_x, kinked_x[ix]);
  std::vector<PlateMoments> out(m.columns() * m.rows());
  for (std::size_t iy = 0; iy < m.rows(); ++iy) {
    const Patches ys = patches_for(iy, m.node_y, m.grid_node_y, kinked_y[iy]);
    for (std::size_t ix = 0; ix < m.columns(); ++ix) {
      const Patches& xs = column_patches[ix];
      PlateMoments sum;
      for (std::size_t a = 0; a < xs.count; ++a) {
        const std::size_t bx = xs.start[a];
        for (std::size_t b = 0; b < ys.count; ++b) {
          const std::size_t by = ys.start[b];
          for (std::size_t ey = by; ey < by + 2; ++ey) {
            for (std::size_t ex = bx; ex < bx + 2; ++ex) {
              const PlateMoments* s = samples.data() + 4 * (ex + ex_count * ey);
              for (std::size_t k = 0; k < 4; ++k) {
                const double weight =
                    xs.weight[a][2 * (ex - bx) + k % 2] * ys.weight[b][2 * (ey - by) + k / 2];
                sum.mx += weight * s[k].mx;
                sum.my += weight * s[k].my;
                sum.mxy += weight * s[k].mxy;
              }
            }
          }
        }
      }
      const double count = static_cast<double>(xs.count * ys.count);
      out[m.node(ix, iy)] = {sum.mx / count, sum.my / count, sum.mxy / count};
    }
  }

  // Along a fixed edge the moment across it is the support's: its
  // reaction moments at the held slope across the edge (w,x on an edge
  // along y) and at the twist are the consistent nodal values ∫ m N ds of
  // the edge moment along the edge (w,x is interpolated along the edge by
  // w,x and w,xy). The edge moment is their L2 projection on the edge's
  // cubic Hermite functions. Extrapolating the patches to the edge is
  // less accurate there (about 1.5 % low at the middle of a clamped
  // square's edge at the default mesh, against 0.2 % this way).
  std::vector<double> R;
  for (std::size_t l = 0; l < m.lines.size(); ++l) {
    const auto& line = m.lines[l];
    if (line.interior || line.support != EndSupport::fixed) continue;
    if (R.empty()) R = held_reactions(m, *solution_, c);
    const bool along_y = line.runs_along == PlanAxis::y;
    const auto& nodes = m.line_nodes[l];
    // The plate lies beyond an edge at 0 and before one at the far end.
    const double beyond = line.grid == 0 ? 1.0 : -1.0;
    const std::size_t across = along_y ? detail::dof_wx : detail::dof_wy;
    const auto& held = m.edge_mass_held[l];
    Eigen::VectorXd rhs(static_cast<Eigen::Index>(2 * nodes.size()));
    for (std::size_t k = 0; k < nodes.size(); ++k) {
      const double* Rn = R.data() + detail::dofs_per_node * nodes[k];
      rhs(static_cast<Eigen::Index>(2 * k)) = held[2 * k] ? 0.0 : beyond * Rn[across];
      rhs(static_cast<Eigen::Index>(2 * k + 1)) =
          held[2 * k + 1] ? 0.0 : beyond * Rn[detail::dof_wxy];
    }
    const Eigen::VectorXd hogging = m.edge_mass[l]->solve(rhs);
    for (std::size_t k = 0; k < nodes.size(); ++k) {
      const double value = -hogging(static_cast<Eigen::Index>(2 * k));
      (along_y ? out[nodes[k]].mx : out[nodes[k]].my) = value;
    }
  }

  // On a column's outline the patches would average the rigid patch's zero
  // curvature in: the slab's own moment there is the element's just outside
  // the column (across the face; at a corner of the column, diagonally),
  // where the slab continues. Nodes strictly inside a column keep the
  // patch's value, which means nothing for the slab.
  const double X = m.x_grid.back(), Y = m.y_grid.back(), tol = 1e-9 * std::max(X, Y);
  const double step = 1e-6 * std::max(X, Y);
  for (std::size_t k = 0; k < m.geometry.columns.size(); ++k) {
    const PlateColumn& col = m.geometry.columns[k];
    for (std::size_t nd : m.column_nodes[k]) {
      const double x = m.node_x[nd % m.columns()], y = m.node_y[nd / m.columns()];
      double dx = 0.0, dy = 0.0;
      if (std::abs(x - col.x0_mm) <= tol && col.x0_mm > tol) dx = -step;
      if (std::abs(x - col.x1_mm) <= tol && col.x1_mm < X - tol) dx = step;
      if (std::abs(y - col.y0_mm) <= tol && col.y0_mm > tol) dy = -step;
      if (std::abs(y - col.y1_mm) <= tol && col.y1_mm < Y - tol) dy = step;
      if (dx == 0.0 && dy == 0.0) continue;  // inside, or on the slab's own edge
      out[nd] = averaged_values(m, u, x + dx, y + dy).m;
    }
  }
  return out;
}

namespace {

// The rise of the parabola through (x0, v0), (x1, v1), (x2, v2), x0 < x1 <
// x2, above the middle value, and where its top is; none (at x1, rise 0)
// unless the middle value is the largest and the parabola opens
// downward. The peak between mesh nodes is found so
// (common practice: three-point interpolation of a maximum).
struct PeakShift {
  double at = 0.0;  // position of the top
  double rise = 0.0;
};
PeakShift parabola_top(double x0, double x1, double x2, double v0, double v1, double v2) {
  if (v1 < v0 || v1 < v2) return {x1, 0.0};
  const double f01 = (v1 - v0) / (x1 - x0), f12 = (v2 - v1) / (x2 - x1);
  const double c = (f12 - f01) / (x2 - x0);  // half the second derivative
  if (!(c < 0.0)) return {x1, 0.0};
  const double at = std::clamp(0.5 * (x0 + x1) - f01 / (2.0 * c), x0, x2);
  const double value = v0 + f01 * (at - x0) + c * (at - x0) * (at - x1);
  return {at, std::max(value - v1, 0.0)};
}

// The peak of a node value v(ix, iy) at node (ix, iy), moved between the
// nodes: along each axis where the node has neighbours on both sides
// within [lo, hi] and none of the three lies on a kinked mesh line, the
// parabola through the three; the rises along x and y add (a biquadratic
// without its cross term, which the symmetric top of a bay's moment
// hardly has).
template <class Value>
PlanPeak peak_between_nodes(const PlateMesh& m, Value&& v, std::size_t ix, std::size_t iy,
                            std::array<std::size_t, 2> x_range, std::array<std::size_t, 2> y_range,
                            const std::vector<bool>& kinked_x, const std::vector<bool>& kinked_y) {
  PlanPeak peak{v(ix, iy), m.node_x[ix], m.node_y[iy]};
  if (ix > x_range[0] && ix < x_range[1] && !kinked_x[ix - 1] && !kinked_x[ix] &&
      !kinked_x[ix + 1]) {
    const auto s = parabola_top(m.node_x[ix - 1], m.node_x[ix], m.node_x[ix + 1],
                                v(ix - 1, iy), v(ix, iy), v(ix + 1, iy));
    peak.value += s.rise;
    peak.x_mm = s.at;
  }
  if (iy > y_range[0] && iy < y_range[1] && !kinked_y[iy - 1] && !kinked_y[iy] &&
      !kinked_y[iy + 1]) {
    const auto s = parabola_top(m.node_y[iy - 1], m.node_y[iy], m.node_y[iy + 1],
                                v(ix, iy - 1), v(ix, iy), v(ix, iy + 1));
    peak.value += s.rise;
    peak.y_mm = s.at;
  }
  return peak;
}

std::vector<BaySagging> bay_peaks(const PlateMesh& m, const std::vector<PlateMoments>& moments,
                                  const std::vector<bool>& kinked_x,
                                  const std::vector<bool>& kinked_y) {
  std::vector<BaySagging> bays(m.nx * m.ny);
  auto mx = [&](std::size_t ix, std::size_t iy) { return moments[m.node(ix, iy)].mx; };
  auto my = [&](std::size_t ix, std::size_t iy) { return moments[m.node(ix, iy)].my; };
  for (std::size_t j = 0; j < m.ny; ++j) {
    for (std::size_t i = 0; i < m.nx; ++i) {
      const std::array<std::size_t, 2> xr{m.grid_node_x[i], m.grid_node_x[i + 1]};
      const std::array<std::size_t, 2> yr{m.grid_node_y[j], m.grid_node_y[j + 1]};
      std::size_t bx = xr[0], by = yr[0], cx = xr[0], cy = yr[0];
      for (std::size_t iy = yr[0]; iy <= yr[1]; ++iy) {
        for (std::size_t ix = xr[0]; ix <= xr[1]; ++ix) {
          if (mx(ix, iy) > mx(bx, by)) bx = ix, by = iy;
          if (my(ix, iy) > my(cx, cy)) cx = ix, cy = iy;
        }
      }
      BaySagging& b = bays[i + m.nx * j];
      b.mx = peak_between_nodes(m, mx, bx, by, xr, yr, kinked_x, kinked_y);
      b.my = peak_between_nodes(m, my, cx, cy, xr, yr, kinked_x, kinked_y);
    }
  }
  return bays;
}

std::vector<std::vector<PlanPeak>> line_peaks(const PlateMesh& m,
                                              const std::vector<PlateMoments>& moments,
                                              const std::vector<bool>& kinked_x,
                                              const std::vector<bool>& kinked_y) {
  std::vector<std::vector<PlanPeak>> out;
  const std::vector<bool> none_x(m.columns(), false), none_y(m.rows(), false);
  for (std::size_t l = 0; l < m.lines.size(); ++l) {
    const auto& line = m.lines[l];
    const bool along_y = line.runs_along == PlanAxis::y;
    // Hogging about the line's axis, read along the line only.
    auto hogging = [&](std::size_t ix, std::size_t iy) {
      const auto& mm = moments[m.node(ix, iy)];
      return along_y ? -mm.mx : -mm.my;
    };
    const std::size_t fixed_index = along_y ? m.grid_node_x[line.grid] : m.grid_node_y[line.grid];
    const auto& ends = along_y ? m.grid_node_y : m.grid_node_x;
    std::vector<PlanPeak> segments(line.segment_count);
    for (std::size_t s = 0; s < line.segment_count; ++s) {
      std::size_t best = ends[s];
      for (std::size_t k = ends[s]; k <= ends[s + 1]; ++k) {
        const double v = along_y ? hogging(fixed_index, k) : hogging(k, fixed_index);
        const double b = along_y ? hogging(fixed_index, best) : hogging(best, fixed_index);
        if (v > b) best = k;
      }
      const std::array<std::size_t, 2> along{ends[s], ends[s + 1]};
      const std::array<std::size_t, 2> at{fixed_index, fixed_index};  // never across the line
      segments[s] = along_y ? peak_between_nodes(m, hogging, fixed_index, best, at, along,
                                                 none_x, kinked_y)
                            : peak_between_nodes(m, hogging, best, fixed_index, along, at,
                                                 kinked_x, none_y);
    }
    out.push_back(std::move(segments));
  }
  return out;
}

// Nodes whose reaction is a point reaction: where two supported lines
// meet, and where a supported line ends at a free edge (Kirchhoff's
// concentrated force there, 2 mxy at a plate corner, is in the node's
// reaction and does not belong in a value per unit length).
std::vector<bool> point_nodes(const PlateMesh& m) {
  std::vector<bool> out(m.lines_through_node.size(), false);
  for (std::size_t nd = 0; nd < out.size(); ++nd) out[nd] = m.lines_through_node[nd] >= 2;
  const auto& e = m.geometry.edges;
  for (std::size_t l = 0; l < m.lines.size(); ++l) {
    const auto& nodes = m.line_nodes[l];
    const bool along_y = m.lines[l].runs_along == PlanAxis::y;
    if ((along_y ? e.y0 : e.x0) == EndSupport::free) out[nodes.front()] = true;
    if ((along_y ? e.y1 : e.x1) == EndSupport::free) out[nodes.back()] = true;
  }
  return out;
}

std::vector<std::vector<LineReaction>> line_values(const PlateMesh& m,
                                                   const std::vector<double>& R) {
  const auto points = point_nodes(m);
  std::vector<std::vector<LineReaction>> out;
  for (std::size_t l = 0; l < m.lines.size(); ++l) {
    const auto& nodes = m.line_nodes[l];
    const auto& along = m.lines[l].runs_along == PlanAxis::y ? m.node_y : m.node_x;
    std::vector<LineReaction> line;
    for (std::size_t k = 0; k < nodes.size(); ++k) {
      const std::size_t nd = nodes[k];
      if (points[nd]) continue;
      line.push_back({m.node_x[nd % m.columns()], m.node_y[nd / m.columns()],
                      R[detail::dofs_per_node * nd + detail::dof_w] / tributary(along, k)});
    }
    out.push_back(std::move(line));
  }
  return out;
}

std::vector<PointReaction> point_values(const PlateMesh& m, const std::vector<double>& R) {
  const auto points = point_nodes(m);
  std::vector<PointReaction> out;
  for (std::size_t nd = 0; nd < points.size(); ++nd)
    if (points[nd])
      out.push_back({m.node_x[nd % m.columns()], m.node_y[nd / m.columns()],
                     R[detail::dofs_per_node * nd + detail::dof_w]});
  return out;
}

}  // namespace

std::vector<BaySagging> PlateField::bay_sagging(std::size_t c) const {
  const auto moments = node_moments(c);
  std::vector<bool> kinked_x, kinked_y;
  kinked_lines(*mesh_, solution_->load_cases[c], kinked_x, kinked_y);
  return bay_peaks(*mesh_, moments, kinked_x, kinked_y);
}

std::vector<std::vector<PlanPeak>> PlateField::line_hogging(std::size_t c) const {
  const auto moments = node_moments(c);
  std::vector<bool> kinked_x, kinked_y;
  kinked_lines(*mesh_, solution_->load_cases[c], kinked_x, kinked_y);
  return line_peaks(*mesh_, moments, kinked_x, kinked_y);
}

std::vector<std::vector<LineReaction>> PlateField::line_reactions(std::size_t c) const {
  check_case_index(c, solution_->cases);
  return line_values(*mesh_, held_reactions(*mesh_, *solution_, c));
}

std::vector<PointReaction> PlateField::point_reactions(std::size_t c) const {
  check_case_index(c, solution_->cases);
  return point_values(*mesh_, held_reactions(*mesh_, *solution_, c));
}

PlateCaseResults PlateField::case_results(std::size_t c) const {
  PlateCaseResults r;
  r.node_moments = node_moments(c);
  std::vector<bool> kinked_x, kinked_y;
  kinked_lines(*mesh_, solution_->load_cases[c], kinked_x, kinked_y);
  r.bays = bay_peaks(*mesh_, r.node_moments, kinked_x, kinked_y);
  r.line_hogging = line_peaks(*mesh_, r.node_moments, kinked_x, kinked_y);
  const auto R = held_reactions(*mesh_, *solution_, c);
  r.line_reactions = line_values(*mesh_, R);
  r.point_reactions = point_values(*mesh_, R);
  r.corner_forces = corner_forces(c);
  return r;
}

std::vector<PointReaction> PlateField::corner_forces(std::size_t c) const {
  check_case_index(c, solution_->cases);
  const auto& m = *mesh_;
  const double* u = solution_->displacement(c);
  const auto& e = m.geometry.edges;
  std::vector<PointReaction> out;
  for (std::size_t corner = 0; corner < 4; ++corner) {
    const bool far_x = corner % 2 == 1, far_y = corner / 2 == 1;
    const EndSupport ex = far_x ? e.x1 : e.x0, ey = far_y ? e.y1 : e.y0;
    if (ex == EndSupport::free && ey == EndSupport::free) continue;
    const std::size_t nd = m.node(far_x ? m.columns() - 1 : 0, far_y ? m.rows() - 1 : 0);
    const double mxy =
        -m.D * (1.0 - m.geometry.poisson_ratio) * u[detail::dofs_per_node * nd + detail::dof_wxy];
    const double nx = far_x ? 1.0 : -1.0, ny = far_y ? 1.0 : -1.0;
    out.push_back({m.node_x[nd % m.columns()], m.node_y[nd / m.columns()], 2.0 * mxy * nx * ny});
  }
  return out;
}

// Σ over the held dofs of the reaction times the rigid-body motions
// w = 1, w = x, w = y (whose dofs are (1, 0, 0, 0), (x, 1, 0, 0) and
// (y, 0, 1, 0) at each node): by virtual work these equal the load's
// resultant, whatever the mesh.
double PlateField::section_moment(std::size_t c, PlanAxis normal, double at_mm, double from_mm, double to_mm,
                                  int side) const {
  check_case_index(c, solution_->cases);
  const auto& m = *mesh_;
  if (!(to_mm >= from_mm) || !std::isfinite(at_mm) || (side != 1 && side != -1))
    throw std::invalid_argument("plate section: an empty or reversed extent, or no side");
  const bool across_x = normal == PlanAxis::x;  // the section runs along y
  const std::vector<double>& along = across_x ? m.node_y : m.node_x;
  const double extent = std::max(m.x_grid.back(), m.y_grid.back());
  const double at = at_mm + side * 1e-6 * extent;  // past the mesh tolerance (1e-9 of the grid)
  const double g[3] = {-std::sqrt(0.6), 0.0, std::sqrt(0.6)}, w[3] = {5.0 / 9.0, 8.0 / 9.0, 5.0 / 9.0};
  double sum = 0.0;
  for (std::size_t k = 0; k + 1 < along.size(); ++k) {
    const double a = std::max(along[k], from_mm), b = std::min(along[k + 1], to_mm);
    if (!(b > a)) continue;
    const double mid = (a + b) / 2.0, half = (b - a) / 2.0;
    for (int p = 0; p < 3; ++p) {
      const double s_ = mid + g[p] * half;
      const PlateMoments mm = across_x ? moments_at(c, at, s_) : moments_at(c, s_, at);
      sum += w[p] * half * (across_x ? mm.mx : mm.my);
    }
  }
  return sum;
}

std::vector<double> PlateField::column_reactions(std::size_t c) const {
  check_case_index(c, solution_->cases);
  const auto& m = *mesh_;
  const auto R = held_reactions(m, *solution_, c);
  std::vector<double> out;
  for (const auto& nodes : m.column_nodes) {
    double F = 0.0;
    for (std::size_t nd : nodes) F += R[detail::dofs_per_node * nd + detail::dof_w];
    out.push_back(F);
  }
  return out;
}

std::vector<std::array<double, 2>> PlateField::column_moments(std::size_t c) const {
  check_case_index(c, solution_->cases);
  const auto& m = *mesh_;
  const double* u = solution_->displacement(c);
  std::vector<std::array<double, 2>> out;
  for (std::size_t k = 0; k < m.column_nodes.size(); ++k) {
    const PlateColumn& col = m.geometry.columns[k];
    const std::size_t base = detail::dofs_per_node * m.column_nodes[k].front();
    out.push_back({col.k_x_Nmm * u[base + detail::dof_wx], col.k_y_Nmm * u[base + detail::dof_wy]});
  }
  return out;
}

ForceResultant PlateField::reaction_resultant(std::size_t c) const {
  check_case_index(c, solution_->cases);
  const auto& m = *mesh_;
  const auto R = held_reactions(m, *solution_, c);
  ForceResultant r;
  for (std::size_t nd = 0; nd < m.lines_through_node.size(); ++nd) {
    const double* Rn = R.data() + detail::dofs_per_node * nd;
    const double x = m.node_x[nd % m.columns()], y = m.node_y[nd / m.columns()];
    r.force_N += Rn[detail::dof_w];
    r.force_x_Nmm += Rn[detail::dof_w] * x + Rn[detail::dof_wx];
    r.force_y_Nmm += Rn[detail::dof_w] * y + Rn[detail::dof_wy];
  }
  return r;
}

}  // namespace armature
