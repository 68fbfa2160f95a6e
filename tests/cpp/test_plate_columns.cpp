// A plate on columns (armature/plate.hpp, PlateGeometry::columns): the
// first step of flat slabs. Sources, beside each check:
//   - Statics: the reactions equal the load; on a section across the whole
//     width the integrated moment is the beam moment of the free body, so
//     between the faces of an interior bay of a floor symmetric about the
//     bay's centre line, M_mid + (|M_left| + |M_right|)/2 = q Y ln²/8: the
//     total static moment of ACI 318-19 8.10.3.2 (Mo = qu l2 ln²/8, value
//     from memory) for the whole width Y.
//   - Symmetry of a symmetric floor.
// Our scenario: the workshop's upper floor on columns, 3 × 3 bays of
// 6.0 × 5.5 m, 250 mm slab, 400 mm square columns at every grid point
// (those on the edges clipped to the slab), E = 30 000 MPa, ν = 0.2.
#include <catch2/catch.hpp>

#include <cmath>
#include <vector>

#include "armature/plate.hpp"

using namespace armature;

namespace {

constexpr double column = 400.0, q = 0.012;  // mm; MPa (12 kPa)

PlateGeometry floor_on_columns(int mesh) {
  PlateGeometry g;
  g.x_spans_mm = {6000, 6000, 6000};
  g.y_spans_mm = {5500, 5500, 5500};
  g.edges = {EndSupport::free, EndSupport::free, EndSupport::free, EndSupport::free};
  g.interior_lines_supported = false;
  g.thickness_mm = 250;
  g.elastic_modulus_MPa = 30000;
  g.poisson_ratio = 0.2;
  g.mesh_per_bay = mesh;
  const double X = 18000, Y = 16500;
  for (double y : {0.0, 5500.0, 11000.0, 16500.0})
    for (double x : {0.0, 6000.0, 12000.0, 18000.0})
      g.columns.push_back({std::max(0.0, x - column / 2), std::min(X, x + column / 2), std::max(0.0, y - column / 2),
                           std::min(Y, y + column / 2)});
  return g;
}

PlateLoadCase uniform() {
  PlateLoadCase lc;
  lc.bay_pressures_MPa.assign(9, q);
  return lc;
}

// ∫ mx dy over the whole width at x, read on the side `side` of the section.
double width_moment(const PlateField& field, double x, int side) {
  return field.section_moment(0, PlanAxis::x, x, 0.0, 16500.0, side);
}

}  // namespace

TEST_CASE("Plate on columns: the column reactions carry the load, symmetrically", "[plate][flat]") {
  const PlateModel model(floor_on_columns(8));
  const auto field = model.solve({uniform()});
  const auto R = field.column_reactions(0);
  REQUIRE(R.size() == 16);
  double total = 0.0;
  for (double r : R) total += r;
  // Statics: Σ R = q X Y.
  CHECK(total == Approx(q * 18000.0 * 16500.0).epsilon(1e-9));
  CHECK(field.reaction_resultant(0).force_N == Approx(total).epsilon(1e-9));
  // Symmetry: the four interior columns alike, the four corners alike.
  CHECK(R[5] == Approx(R[6]).epsilon(1e-6));
  CHECK(R[5] == Approx(R[9]).epsilon(1e-6));
  CHECK(R[5] == Approx(R[10]).epsilon(1e-6));
  CHECK(R[0] == Approx(R[3]).epsilon(1e-6));
  CHECK(R[0] == Approx(R[15]).epsilon(1e-6));
  // An interior column takes more than its tributary area's load (q × 6.0
  // × 5.5 m): the first interior columns of a continuous floor do
  // (continuity), common practice; less than 1.5 times it.
  CHECK(R[5] > q * 6000.0 * 5500.0);
  CHECK(R[5] < 1.5 * q * 6000.0 * 5500.0);
}

TEST_CASE("Plate on columns: the middle bay's moments add up to the total static moment", "[plate][flat]") {
  for (const int mesh : {8, 12}) {
    const PlateModel model(floor_on_columns(mesh));
    const auto field = model.solve({uniform()});
    const double faceL = 6000.0 + column / 2, faceR = 12000.0 - column / 2, ln = faceR - faceL;
    const double ML = width_moment(field, faceL, +1), MR = width_moment(field, faceR, -1);
    const double Mmid = width_moment(field, 9000.0, +1);
    INFO("mesh " << mesh << ": M_left " << ML * 1e-6 << " kNm, M_mid " << Mmid * 1e-6 << " kNm");
    CHECK(ML < 0.0);
    CHECK(Mmid > 0.0);
    CHECK(ML == Approx(MR).epsilon(1e-6));  // symmetry
    const double M0 = q * 16500.0 * ln * ln / 8.0;
    CHECK(Mmid - (ML + MR) / 2.0 == Approx(M0).epsilon(0.02));
    // In y likewise, across the middle bay row (ln = 5.5 − 0.4 m, width X).
    const double fy0 = 5500.0 + column / 2, fy1 = 11000.0 - column / 2, lny = fy1 - fy0;
    const double My0 = field.section_moment(0, PlanAxis::y, fy0, 0.0, 18000.0, +1);
    const double My1 = field.section_moment(0, PlanAxis::y, fy1, 0.0, 18000.0, -1);
    const double Mymid = field.section_moment(0, PlanAxis::y, 8250.0, 0.0, 18000.0, +1);
    CHECK(Mymid - (My0 + My1) / 2.0 == Approx(q * 18000.0 * lny * lny / 8.0).epsilon(0.02));
    // Read inside the column (the rigid patch) the section would lose the
    // hogging there: the side matters at a face.
    CHECK(std::abs(field.section_moment(0, PlanAxis::x, faceL, 5300.0, 5700.0, -1)) <
          0.01 * std::abs(field.section_moment(0, PlanAxis::x, faceL, 5300.0, 5700.0, +1)));
  }
}

TEST_CASE("Plate on columns: bad columns and mechanisms are named", "[plate][flat]") {
  PlateGeometry g = floor_on_columns(8);
  g.columns.push_back({17000, 19000, 100, 300});  // off the slab
  g.columns.push_back({500, 400, 100, 300});      // reversed
  InputProblems p;
  add_plate_problems(g, p);
  bool off = false, reversed = false;
  for (const auto& x : p.items()) {
    off = off || (x.field == "slab.columns[16]" && x.message.find("on the slab") != std::string::npos);
    reversed = reversed || (x.field == "slab.columns[17]" && x.message.find("positive") != std::string::npos);
  }
  CHECK(off);
  CHECK(reversed);
  // Two columns only: the slab turns about the line through them.
  PlateGeometry two = floor_on_columns(8);
  two.columns.resize(2);
  InputProblems q2;
  add_plate_problems(two, q2);
  REQUIRE(q2.items().size() == 1);
  CHECK(q2.items()[0].field == "slab.edges");
  // A column on a wall edge is refused.
  PlateGeometry wall = floor_on_columns(8);
  wall.edges.y0 = EndSupport::pinned;
  InputProblems q3;
  add_plate_problems(wall, q3);
  CHECK_FALSE(q3.items().empty());
  CHECK(q3.items()[0].message.find("touches a supported line") != std::string::npos);
}

TEST_CASE("Plate on columns: node moments on a column's face are the slab's", "[plate][flat]") {
  // On the face x = 6.2 m of the column at (6.0, 5.5) m the node moments
  // are the slab's just outside the column (the rule of node_moments), not
  // averaged with the rigid patch's zero curvature: the hogging there is
  // the largest along the x line through the column (it falls away from
  // the face: common practice), and the section over the face's width is
  // hogging.
  const PlateModel model(floor_on_columns(12));
  const auto field = model.solve({uniform()});
  const auto nodes = field.node_moments(0);
  const auto& xs = model.node_x_mm();
  const auto& ys = model.node_y_mm();
  const double face = 6000.0 + column / 2;
  std::size_t ix = 0, iy = 0;
  while (ix < xs.size() && std::abs(xs[ix] - face) > 1e-6) ++ix;
  while (iy < ys.size() && std::abs(ys[iy] - 5500.0) > 1e-6) ++iy;
  REQUIRE(ix + 1 < xs.size());
  REQUIRE(iy < ys.size());
  const double at_face = nodes[ix + xs.size() * iy].mx;
  CHECK(at_face == Approx(field.moments_at(0, face + 1e-3, 5500.0).mx).epsilon(1e-3));
  CHECK(at_face < nodes[ix + 1 + xs.size() * iy].mx);  // more hogging at the face than an element away
  CHECK(at_face < 0.5 * nodes[ix - 1 + xs.size() * iy].mx - 1.0);  // the patch's value inside is not the slab's
  CHECK(field.section_moment(0, PlanAxis::x, face, 5300.0, 5700.0, +1) < 0.0);
}
