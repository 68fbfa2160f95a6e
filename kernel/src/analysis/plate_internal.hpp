// Private to the plate analysis (kernel/src/analysis/plate_*.cpp): the
// mesh with its factorised stiffness matrix, the solution of a set of load
// cases, and the element's shape functions. Eigen stays behind this header.
#pragma once

#include <array>
#include <cstddef>
#include <memory>
#include <utility>
#include <vector>

#include <Eigen/Dense>
#include <Eigen/SparseCholesky>
#include <Eigen/SparseCore>

#include "armature/plate.hpp"

namespace armature::detail {

constexpr std::size_t dofs_per_node = 4;  // w, w,x, w,y, w,xy
enum Dof : std::size_t { dof_w = 0, dof_wx = 1, dof_wy = 2, dof_wxy = 3 };

// ---- element (plate_element.cpp) ----------------------------------------------

// The four cubic Hermite functions of a segment of length L at s = t/L in
// [0, 1] (value at 0, slope at 0, value at L, slope at L) and their first
// and second derivatives with respect to the physical coordinate.
struct Hermite {
  std::array<double, 4> N{}, dN{}, d2N{};
};
Hermite hermite(double s, double L);

// The 16 shape functions of the element a × b at local (s, t) in [0, 1]²,
// and the rows giving w,xx, w,yy and w,xy from the element's dofs.
struct ElementShape {
  std::array<double, 16> w{}, wxx{}, wyy{}, wxy{};
};
ElementShape element_shape(double a, double b, double s, double t);

// Consistent nodal loads of the element a × b:
//   a pressure p over the local rectangle [xa, xb] × [ya, yb] (mm from the
//   element's corner), a line load q (N/mm) along x at local y from xa to
//   xb, or along y at local x from ya to yb, and a force P at local (x, y).
std::array<double, 16> element_patch_load(double a, double b, double xa, double xb, double ya,
                                          double yb, double p);
std::array<double, 16> element_line_load(double a, double b, PlanAxis runs_along, double at,
                                         double from, double to, double q);
std::array<double, 16> element_point_load(double a, double b, double x, double y, double P);

// The parts of an orthotropic element's stiffness (ν = 0) per unit
// rigidity, k = Dx kxx + Dy kyy + Dt ktt, and ∫ w,xx dA, ∫ w,yy dA for the
// load of a free curvature.
struct OrthotropicParts {
  std::array<double, 256> kxx, kyy, ktt;
  std::array<double, 16> ixx, iyy;
};
OrthotropicParts orthotropic_parts(double a, double b);

// ---- mesh and solution (plate_mesh.cpp, plate_solve.cpp) -----------------------

struct PlateMesh {
  PlateGeometry geometry;
  double D = 0.0;                      // flexural rigidity, N·mm
  std::size_t nx = 0, ny = 0;          // bays
  std::vector<double> x_grid, y_grid;  // bay grid lines
  std::vector<double> node_x, node_y;  // node coordinates
  // Node index of each grid line along x and along y (nx + 1, ny + 1):
  // bay i spans nodes grid_node_x[i] to grid_node_x[i + 1].
  std::vector<std::size_t> grid_node_x, grid_node_y;
  // Per element column (row): its bay, and its width (height) class; the
  // element stiffness for class pair (cx, cy) is stiffness[cx + widths·cy].
  std::vector<std::size_t> column_bay, row_bay, column_class, row_class;
  std::vector<double> widths, heights;
  std::vector<std::array<double, 256>> stiffness;

  // Free dof number of each global dof, −1 where the dof is held, −2
  // where it follows a column's rotations (constraint below).
  std::vector<long> free_index;
  std::size_t free_count = 0;
  // For each dof with free_index −2: the free unknowns it follows and their
  // coefficients (a column's two rotations, numbered after the node dofs).
  std::vector<std::vector<std::pair<long, double>>> constraint;
  // Per column: the nodes of its patch, and the unknowns of its two
  // rotations θx, θy.
  std::vector<std::vector<std::size_t>> column_nodes;
  std::vector<std::array<long, 2>> column_unknowns;
  // The free unknowns a dof's value is made of: itself, its constraint, or
  // none (held).
  template <class F>
  void for_each_unknown(std::size_t dof, F&& f) const {
    const long i = free_index[dof];
    if (i >= 0) f(i, 1.0);
    else if (i == -2)
      for (const auto& [j, c] : constraint[dof]) f(j, c);
  }
  std::vector<SupportLine> lines;
  std::vector<std::vector<std::size_t>> line_nodes;  // nodes along each line, in order
  std::vector<unsigned char> lines_through_node;     // supported lines through each node

  Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>> factor;
  // Per support line, for a fixed outer edge only (else null): the mass
  // matrix of the cubic Hermite interpolation along the edge (value and
  // derivative at each node), with the values known to be zero held,
  // factorised; the edge moment is recovered from the edge's reaction
  // moments with it (plate_solve.cpp, node_moments).
  std::vector<std::shared_ptr<Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>>>> edge_mass;
  // Per support line: the rows of edge_mass held at zero.
  std::vector<std::vector<unsigned char>> edge_mass_held;

  std::size_t columns() const { return node_x.size(); }
  std::size_t rows() const { return node_y.size(); }
  std::size_t node(std::size_t ix, std::size_t iy) const { return ix + columns() * iy; }
  std::size_t elements_x() const { return columns() - 1; }
  std::size_t elements_y() const { return rows() - 1; }
  std::size_t bay_of_element(std::size_t ex, std::size_t ey) const {
    return column_bay[ex] + nx * row_bay[ey];
  }
  std::size_t element_class(std::size_t ex, std::size_t ey) const {
    return column_class[ex] + widths.size() * row_class[ey];
  }
  std::size_t class_count() const { return widths.size() * heights.size(); }
  const std::array<double, 256>& element_stiffness(std::size_t ex, std::size_t ey) const {
    return stiffness[element_class(ex, ey)];
  }
  // Global dof numbers of element (ex, ey) in element order.
  std::array<std::size_t, 16> element_dofs(std::size_t ex, std::size_t ey) const;
  // Elements along one axis that contain the coordinate v: one, or two
  // when v lies on an interior mesh line.
  static std::vector<std::size_t> elements_containing(const std::vector<double>& grid, double v);
};

// Builds everything but the factorisation (plate_mesh.cpp).
void build_mesh(PlateMesh& mesh);
// Assembles and factorises the stiffness of the free dofs (plate_solve.cpp).
void factorise(PlateMesh& mesh);

struct PlateSolution {
  std::size_t cases = 0;
  std::size_t dofs = 0;
  std::vector<double> u;  // displacements, dofs × cases (column-major)
  std::vector<double> f;  // applied nodal loads, dofs × cases
  std::vector<PlateLoadCase> load_cases;  // where their moments are kinked
  const double* displacement(std::size_t c) const { return u.data() + c * dofs; }
  const double* load(std::size_t c) const { return f.data() + c * dofs; }
};

}  // namespace armature::detail
