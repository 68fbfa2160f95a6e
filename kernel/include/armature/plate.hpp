// Code-independent analysis of a two-way slab: a linear-elastic Kirchhoff
// plate over a grid of rectangular bays, by finite elements.
//
// Model:
//   - Bays: x_spans_mm along x, y_spans_mm along y; bay (i, j) has index
//     i + nx·j (i along x, j along y, from 0). Grid line x_i is at
//     x = Σ x_spans[0..i), so x_0 = 0 and x_nx = Σ x_spans.
//   - Rigid line supports (w = 0) on every interior grid line; the slopes
//     across a line are continuous and not restrained.
//   - Outer edges x0 (x = 0), x1 (x = Σ x_spans), y0, y1: pinned (w = 0 and
//     so the slope along the edge is 0; the slope across and the twist
//     w,xy are free), fixed (w and every slope held, so the twist too) or
//     free. Where two supported lines meet the plate is held down (w = 0
//     at the node): the concentrated force there is reported, and may pull
//     down (a lifting corner held by the supports).
//   - Element: Bogner–Fox–Schmit rectangle (bicubic Hermite; w, w,x, w,y,
//     w,xy at each node; conforming), mesh_per_bay × mesh_per_bay per bay,
//     with mesh lines moved or added through given positions (loads).
//
// Sign conventions (units N, mm, MPa, N·mm):
//   - w and every load are positive downward (gravity).
//   - Moments per unit width (N·mm/mm), sagging positive (tension at the
//     bottom face): mx = −D (w,xx + ν w,yy) acts on faces normal to x and
//     is resisted by bars running in x; my likewise; mxy = −D (1 − ν) w,xy,
//     so that the moment on a section normal to n = (cos θ, sin θ) is
//     mx cos²θ + my sin²θ + 2 mxy sin θ cos θ.
//   - Hogging moments along a support line are reported as magnitudes
//     (≥ 0): −mx along a line x = const, −my along a line y = const.
//   - Reactions are positive upward.
#pragma once

#include <array>
#include <cstddef>
#include <memory>
#include <vector>

#include "armature/errors.hpp"
#include "armature/request.hpp"

namespace armature {

// Elements per bay side when the request does not say: the bay moments of
// the tests' plates, and the hogging on the interior lines of continuous
// floors (the least accurate), are then within 1 % of a fine mesh
// (DEVELOPERS.md, "Plate analysis").
inline constexpr int default_plate_mesh_per_bay = 10;

struct PlateEdges {
  EndSupport x0 = EndSupport::pinned;
  EndSupport x1 = EndSupport::pinned;
  EndSupport y0 = EndSupport::pinned;
  EndSupport y1 = EndSupport::pinned;
};

// A column under the plate: its outline in plan (mm from x = 0, y = 0),
// inside the plate. The part of the plate over it moves as a rigid patch
// that cannot move down at the column's centre and turns against the
// column's rotational stiffness (0: free to turn, a column pinned at the
// slab): k_x resists the patch's turn θx = w,x (bending in x, about the y
// axis), k_y its turn θy = w,y; N·mm per radian.
struct PlateColumn {
  double x0_mm = 0.0, x1_mm = 0.0, y0_mm = 0.0, y1_mm = 0.0;
  double k_x_Nmm = 0.0, k_y_Nmm = 0.0;
};

struct PlateGeometry {
  std::vector<double> x_spans_mm;
  std::vector<double> y_spans_mm;
  PlateEdges edges{};
  // Rigid line supports on every interior grid line (two-way slabs); false
  // for a plate on columns, whose interior grid lines are not supported.
  bool interior_lines_supported = true;
  // Columns (flat slabs); their faces become mesh lines. A column must not
  // touch a supported line.
  std::vector<PlateColumn> columns{};
  double thickness_mm = 0.0;
  double elastic_modulus_MPa = 0.0;
  double poisson_ratio = 0.2;
  int mesh_per_bay = default_plate_mesh_per_bay;
  // Positions (mm from x = 0, from y = 0) that mesh lines must pass
  // through: where line loads run and point loads act, so that the node
  // moments keep the peak under them. Each bay is divided into
  // mesh_per_bay equal elements, then the mesh line nearest each position
  // moves onto it (when within a quarter of an element) or a mesh line is
  // added there. A position on a grid line needs nothing; one off the
  // plate or not finite is refused (std::invalid_argument).
  std::vector<double> mesh_lines_x_mm{};
  std::vector<double> mesh_lines_y_mm{};
};

// What cannot be analysed, each problem named by its contract-v2 request
// path (slab.x_spans_m[1], slab.edges, analysis.mesh_per_bay, ...); a
// mechanism (too few supports to hold the plate) is a problem on
// slab.edges.
void add_plate_problems(const PlateGeometry& geometry, InputProblems& problems);

// ---- loads -------------------------------------------------------------------

enum class PlanAxis { x, y };

// Pressure (MPa, downward) on a rectangle x0 ≤ x ≤ x1, y0 ≤ y ≤ y1.
struct PlatePatchLoad {
  double x0_mm = 0.0, x1_mm = 0.0, y0_mm = 0.0, y1_mm = 0.0;
  double pressure_MPa = 0.0;
};
// A line load (N/mm, downward) running along `runs_along` at the other
// coordinate `at_mm`, from `from_mm` to `to_mm` along its own axis.
struct PlateLineLoad {
  PlanAxis runs_along = PlanAxis::x;
  double at_mm = 0.0;
  double from_mm = 0.0, to_mm = 0.0;
  double N_per_mm = 0.0;
};
// A point load (N, downward) at a plan position.
struct PlatePointLoad {
  double x_mm = 0.0, y_mm = 0.0;
  double force_N = 0.0;
};
// Everything one load case puts on the plate. bay_pressures_MPa is empty or
// has one uniform pressure per bay (by bay index), for pattern loading.
struct PlateLoadCase {
  std::vector<double> bay_pressures_MPa{};
  std::vector<PlatePatchLoad> patches{};
  std::vector<PlateLineLoad> lines{};
  std::vector<PlatePointLoad> points{};
};

// Resultant of a set of vertical forces: Σ F, and its first moments Σ F·x
// and Σ F·y (about the y and x axes through the origin).
struct ForceResultant {
  double force_N = 0.0;
  double force_x_Nmm = 0.0;
  double force_y_Nmm = 0.0;
};

// ---- results -----------------------------------------------------------------

struct PlateMoments {
  double mx = 0.0, my = 0.0, mxy = 0.0;  // N·mm/mm, sagging positive
};

// A peak value and where it occurs.
struct PlanPeak {
  double value = 0.0;  // N·mm/mm
  double x_mm = 0.0, y_mm = 0.0;
};

struct BaySagging {
  PlanPeak mx{};  // largest mx in the bay (may be ≤ 0 if none sags)
  PlanPeak my{};
};

// A supported edge or an interior grid line, in the model's order: the
// lines running along y by grid line (edge x0 if supported, the interior
// lines, edge x1), then those running along x. A line running along y lies
// at x = x_grid_mm[grid] and has one segment per y span (segment j from
// y_j to y_j+1); a line running along x likewise.
struct SupportLine {
  PlanAxis runs_along = PlanAxis::y;
  std::size_t grid = 0;
  double position_mm = 0.0;
  bool interior = false;                    // an interior grid line
  EndSupport support = EndSupport::pinned;  // for an edge: pinned or fixed
  std::size_t segment_count = 0;
};

// The line reaction at one node of a support line.
struct LineReaction {
  double x_mm = 0.0, y_mm = 0.0;
  double N_per_mm = 0.0;  // upward
};

// A concentrated reaction where two supported lines meet.
struct PointReaction {
  double x_mm = 0.0, y_mm = 0.0;
  double force_N = 0.0;  // upward; negative: the support holds the plate down
};

// ---- element and Wood–Armer (pure) ---------------------------------------------

// Bogner–Fox–Schmit element a × b (mm), flexural rigidity D (N·mm), ν:
// stiffness (16 × 16, row-major), dofs per node w, w,x, w,y, w,xy, nodes in
// the order (0,0), (a,0), (0,b), (a,b). Exact: 4 × 4 Gauss points.
std::array<double, 256> plate_element_stiffness(double a_mm, double b_mm, double D_Nmm, double nu);

// Flexural rigidity D = E h³ / (12 (1 − ν²)).
double plate_flexural_rigidity(double E_MPa, double h_mm, double nu);

// Design moments for orthogonal bars in x and y, magnitudes ≥ 0: what the
// bottom bars (sagging) and the top bars (hogging) of each direction must
// resist so that in every direction the bars resist at least the normal
// moment (Wood 1968, with the cases where one design moment would be
// negative).
struct WoodArmerMoments {
  double bottom_x = 0.0, bottom_y = 0.0;
  double top_x = 0.0, top_y = 0.0;
};
WoodArmerMoments wood_armer(const PlateMoments& m);

// ---- cracked analysis ------------------------------------------------------------

// One element's rigidities for a calculated deflection (an orthotropic
// Kirchhoff plate, ν = 0): bending in x and in y (N·mm: moment per unit
// width over curvature), the twist taking √(Dx Dy)/2 (Huber's
// orthotropic plate), and the free curvatures (1/mm, sagging positive:
// shrinkage) the element would take unloaded.
struct ElementRigidity {
  double Dx_Nmm = 0.0, Dy_Nmm = 0.0;
  double free_curvature_x = 0.0, free_curvature_y = 0.0;
};

// The deflection (mm, downward) at every mesh node (index ix + (node_x
// count)·iy) and the moments at every element's centre (index ex +
// elements_x·ey): mx = Dx (κx − κ0x) with κx = −w,xx, likewise my, and
// mxy = −√(Dx Dy) w,xy.
struct OrthotropicSolution {
  std::vector<double> w_mm;
  std::vector<PlateMoments> element_moments;
};

// ---- model and field -----------------------------------------------------------

namespace detail {
struct PlateMesh;
struct PlateSolution;
}  // namespace detail

class PlateField;
class OrthotropicSolver;

// Everything the peaks and reactions of one load case give, read at once
// (the node moments are recovered once for all of them).
struct PlateCaseResults {
  std::vector<PlateMoments> node_moments;
  std::vector<BaySagging> bays;
  std::vector<std::vector<PlanPeak>> line_hogging;
  std::vector<std::vector<LineReaction>> line_reactions;
  std::vector<PointReaction> point_reactions;
  std::vector<PointReaction> corner_forces;
};

// The plate of one request: mesh, element matrices, supports and the
// factorised stiffness matrix, built once; solve() for any load cases.
class PlateModel {
 public:
  // Throws InputError (every problem of add_plate_problems), and
  // std::invalid_argument for a mesh line position off the plate.
  explicit PlateModel(PlateGeometry geometry);
  ~PlateModel();
  PlateModel(const PlateModel&);
  PlateModel& operator=(const PlateModel&);
  PlateModel(PlateModel&&) noexcept;
  PlateModel& operator=(PlateModel&&) noexcept;

  const PlateGeometry& geometry() const;
  std::size_t bays_x() const;
  std::size_t bays_y() const;
  std::size_t bay_count() const { return bays_x() * bays_y(); }
  std::size_t bay_index(std::size_t i, std::size_t j) const { return i + bays_x() * j; }
  const std::vector<double>& x_grid_mm() const;  // nx + 1 grid line positions
  const std::vector<double>& y_grid_mm() const;
  const std::vector<double>& node_x_mm() const;  // mesh node coordinates
  const std::vector<double>& node_y_mm() const;
  std::size_t node_count() const { return node_x_mm().size() * node_y_mm().size(); }
  std::size_t unknown_count() const;  // free degrees of freedom
  const std::vector<SupportLine>& support_lines() const;

  // The applied load of a case, worked out from the loads themselves
  // (areas and lengths), not from the finite elements.
  ForceResultant load_resultant(const PlateLoadCase& load_case) const;

  // Every case against the one factorisation. Throws std::invalid_argument
  // on a load off the plate, an empty or reversed extent, a value that is
  // not finite or a bay pressure list of the wrong length (the member must
  // name the field first).
  PlateField solve(const std::vector<PlateLoadCase>& cases) const;

  // Elements along x and y (element (ex, ey) lies between node lines ex,
  // ex + 1 and ey, ey + 1).
  std::size_t elements_x() const;
  std::size_t elements_y() const;
  // One load case with a rigidity per element (index ex + elements_x·ey)
  // and the columns' rotational stiffness × column_factor (the state's
  // modulus over the model's): assembled and factorised anew, the
  // supports and columns as for solve(). Throws std::invalid_argument on a
  // list of the wrong length, a rigidity not positive and finite, or a
  // load as solve() refuses it.
  OrthotropicSolution solve_orthotropic(const std::vector<ElementRigidity>& elements, const PlateLoadCase& load,
                                        double column_factor = 1.0) const;

 private:
  friend class OrthotropicSolver;
  std::shared_ptr<const detail::PlateMesh> mesh_;
};

// solve_orthotropic again and again on one model (an iteration on the
// rigidities): the sparse ordering is worked out at the first solve and
// kept, each call factorises anew. Not for use from several threads at once.
class OrthotropicSolver {
 public:
  explicit OrthotropicSolver(const PlateModel& model);
  ~OrthotropicSolver();
  OrthotropicSolver(const OrthotropicSolver&) = delete;
  OrthotropicSolver& operator=(const OrthotropicSolver&) = delete;
  OrthotropicSolution solve(const std::vector<ElementRigidity>& elements, const PlateLoadCase& load,
                            double column_factor = 1.0);

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

// The solution of every load case; queries by case index.
class PlateField {
 public:
  std::size_t case_count() const;

  // Deflection (mm, downward) and moments at a plan point from the
  // element's shape functions; on an element boundary the elements that
  // share the point are averaged. At a node the recovered node_moments
  // are the more accurate (the element's own moments at its corners are
  // off by about the fixed-end moment of its load: +0.6 % at the centre
  // of a simply supported square at the default mesh).
  double deflection_at(std::size_t c, double x_mm, double y_mm) const;
  PlateMoments moments_at(std::size_t c, double x_mm, double y_mm) const;
  // Moments at every mesh node (index ix + (node_x count)·iy), recovered
  // from the elements' Gauss points by patches of 2 × 2 elements in each
  // bay beside the node (averaged across a support line), along a fixed
  // edge from the edge's reaction moments, and on a column's outline from
  // the element just outside it (DEVELOPERS.md, "Plate analysis").
  std::vector<PlateMoments> node_moments(std::size_t c) const;

  // Per bay (bay index): the largest mx and my in the bay, found between
  // the nodes (the largest node value, moved to the top of the parabola
  // through it and its neighbours along each axis within the bay, except
  // across a mesh line a line or point load kinks).
  std::vector<BaySagging> bay_sagging(std::size_t c) const;
  // Per support line (model order), per segment: the largest hogging
  // moment about the line's axis along the segment, found between the
  // nodes likewise (along the line only).
  std::vector<std::vector<PlanPeak>> line_hogging(std::size_t c) const;
  // Per support line: the reaction per unit length at each of its nodes
  // except those with a point reaction: the node's vertical reaction over
  // its tributary length. Within an element or two of a free edge these
  // values depend on the mesh (the reaction is concentrated at the line's
  // end), farther on they converge.
  std::vector<std::vector<LineReaction>> line_reactions(std::size_t c) const;
  // The node's whole reaction where two supported lines meet (corners of
  // supported edges, grid lines crossing or meeting a supported edge) and
  // where a supported line ends at a free edge. It includes the line
  // reactions of the node's tributary lengths, so at a corner it
  // approaches Kirchhoff's corner force only as the mesh refines. Where
  // interior lines cross, theory has no concentrated force: the small
  // downward values there shrink as the mesh refines.
  std::vector<PointReaction> point_reactions(std::size_t c) const;
  // Kirchhoff's corner force at each corner of the plate where a supported
  // edge meets a supported or a free edge: 2 mxy nx ny upward (n the
  // outward normals), mxy from the element's twist dof at the corner;
  // negative where the corner would lift and the supports hold it down.
  // Zero at a fixed edge's corner. None where two free edges meet.
  std::vector<PointReaction> corner_forces(std::size_t c) const;
  // Resultant of every support reaction (forces and, at fixed edges and
  // along lines, the reaction moments' contribution to the first moments),
  // the columns' included.
  ForceResultant reaction_resultant(std::size_t c) const;
  // The moment resultant (N·mm) on a straight section of the plate: with
  // `normal` x, mx integrated along y from from_mm to to_mm at x = at_mm;
  // with `normal` y, my along x at y = at_mm. Read on one side of the
  // section (side +1: just past it toward larger coordinates, −1: toward
  // smaller), so that a section at a column's face reads the slab and not
  // the column's rigid patch, and one across a kinked line reads the side
  // it means. Three Gauss points per element along the section.
  double section_moment(std::size_t c, PlanAxis normal, double at_mm, double from_mm, double to_mm,
                        int side) const;
  // Per column (geometry order): its upward reaction (N), the sum of the
  // vertical forces the rigid patch over it takes from the plate.
  std::vector<double> column_reactions(std::size_t c) const;
  // Per column: the moments its rotational stiffness takes from the
  // slab, {k_x θx, k_y θy} (N·mm; positive where the slab turns toward
  // larger x, larger y going down). Zero for a column free to turn.
  std::vector<std::array<double, 2>> column_moments(std::size_t c) const;

  // All of the above but the resultant for one case, each computed once.
  PlateCaseResults case_results(std::size_t c) const;

 private:
  friend class PlateModel;
  PlateField(std::shared_ptr<const detail::PlateMesh> mesh,
             std::shared_ptr<const detail::PlateSolution> solution);
  std::shared_ptr<const detail::PlateMesh> mesh_;
  std::shared_ptr<const detail::PlateSolution> solution_;
};

}  // namespace armature
