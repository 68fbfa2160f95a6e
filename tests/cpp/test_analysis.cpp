// Continuous-beam analysis against standard beam-table results (value from
// memory, standard beam tables) and an independent three-moment solution.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <functional>
#include <numeric>
#include <random>

#include "armature/analysis.hpp"

using armature::EndSupport;
using armature::StripModel;

namespace {
constexpr double w = 10.0;   // N/mm
constexpr double L = 5000.0; // mm

double max_sag(const armature::CaseResult& r, std::size_t span) { return r.spans[span].max_moment(); }
}  // namespace

TEST_CASE("Two equal spans: support wL²/8, span 9wL²/128", "[analysis]") {
  StripModel m{{L, L}, EndSupport::pinned, EndSupport::pinned};
  auto r = armature::analyse(m, {w, w});
  CHECK(r.spans[0].M_right() == Approx(-w * L * L / 8));
  CHECK(max_sag(r, 0) == Approx(9 * w * L * L / 128));
  CHECK(max_sag(r, 1) == Approx(9 * w * L * L / 128));
  // Reactions 3wL/8, 10wL/8, 3wL/8.
  CHECK(r.reactions[0] == Approx(3 * w * L / 8));
  CHECK(r.reactions[1] == Approx(10 * w * L / 8));
  CHECK(r.reactions[2] == Approx(3 * w * L / 8));
  // Largest sagging 3L/8 from the end support.
  double x = 0;
  r.spans[0].max_moment(&x);
  CHECK(x == Approx(3 * L / 8));
}

TEST_CASE("Three equal spans: supports 0.1wL², end spans 0.08wL², middle 0.025wL²", "[analysis]") {
  StripModel m{{L, L, L}, EndSupport::pinned, EndSupport::pinned};
  auto r = armature::analyse(m, {w, w, w});
  CHECK(r.spans[0].M_right() == Approx(-0.1 * w * L * L));
  CHECK(r.spans[2].M_left == Approx(-0.1 * w * L * L));
  CHECK(max_sag(r, 0) == Approx(0.08 * w * L * L));
  CHECK(max_sag(r, 1) == Approx(0.025 * w * L * L));
  CHECK(max_sag(r, 2) == Approx(0.08 * w * L * L));
}

TEST_CASE("Propped cantilever: fixed end wL²/8, span 9wL²/128", "[analysis]") {
  StripModel m{{L}, EndSupport::fixed, EndSupport::pinned};
  auto r = armature::analyse(m, {w});
  CHECK(r.spans[0].M_left == Approx(-w * L * L / 8));
  CHECK(max_sag(r, 0) == Approx(9 * w * L * L / 128));
  CHECK(r.reactions[0] == Approx(5 * w * L / 8));
  CHECK(r.reactions[1] == Approx(3 * w * L / 8));
}

TEST_CASE("Fixed at both ends: ends wL²/12, mid-span wL²/24", "[analysis]") {
  StripModel m{{L}, EndSupport::fixed, EndSupport::fixed};
  auto r = armature::analyse(m, {w});
  CHECK(r.spans[0].M_left == Approx(-w * L * L / 12));
  CHECK(r.spans[0].M_right() == Approx(-w * L * L / 12));
  CHECK(max_sag(r, 0) == Approx(w * L * L / 24));
}

TEST_CASE("Cantilever: root wL²/2, tip free", "[analysis]") {
  StripModel m{{L}, EndSupport::fixed, EndSupport::free};
  auto r = armature::analyse(m, {w});
  CHECK(r.spans[0].M_left == Approx(-w * L * L / 2));
  CHECK(r.spans[0].M_right() == Approx(0.0).margin(1e-6 * w * L * L));
  CHECK(r.reactions[0] == Approx(w * L));
  // A span with a cantilever: the root moment is the cantilever's wLc²/2.
  StripModel m2{{1500.0, L}, EndSupport::free, EndSupport::pinned};
  auto r2 = armature::analyse(m2, {w, w});
  CHECK(r2.spans[0].M_right() == Approx(-w * 1500.0 * 1500.0 / 2));
  CHECK(r2.spans[1].M_left == Approx(-w * 1500.0 * 1500.0 / 2));
}

TEST_CASE("Mechanisms are refused", "[analysis]") {
  CHECK_FALSE(armature::stability_problem({{L}, EndSupport::pinned, EndSupport::free}).empty());
  CHECK_FALSE(armature::stability_problem({{L}, EndSupport::free, EndSupport::free}).empty());
  CHECK_FALSE(armature::stability_problem({{L, L}, EndSupport::free, EndSupport::free}).empty());
  CHECK(armature::stability_problem({{L, L, L}, EndSupport::free, EndSupport::free}).empty());
  CHECK(armature::stability_problem({{L}, EndSupport::fixed, EndSupport::free}).empty());
}

TEST_CASE("Redistribution rebalances the spans by equilibrium", "[analysis]") {
  // Two equal spans, δ = 0.85: support 0.85 wL²/8; span reaction
  // R = wL/2 − 0.85 wL/8, largest sagging R²/(2w) (statics).
  StripModel m{{L, L}, EndSupport::pinned, EndSupport::pinned};
  auto elastic = armature::analyse(m, {w, w});
  auto nodes = armature::redistributable_nodes(m);
  CHECK(nodes == std::vector<bool>{false, true, false});
  auto r = armature::redistribute(m, elastic, nodes, 0.85);
  CHECK(r.spans[0].M_right() == Approx(-0.85 * w * L * L / 8));
  const double R = w * L / 2 - 0.85 * w * L / 8;
  CHECK(max_sag(r, 0) == Approx(R * R / (2 * w)));
  CHECK(r.reactions[0] + r.reactions[1] + r.reactions[2] == Approx(2 * w * L));
  // A cantilever root is never redistributed.
  StripModel c{{1500.0, L, L}, EndSupport::free, EndSupport::pinned};
  CHECK(armature::redistributable_nodes(c) == std::vector<bool>{false, false, true, false});
}

namespace {
// Independent solution by the three-moment equation (Clapeyron):
// M[j-1] L1 + 2 M[j] (L1 + L2) + M[j+1] L2 = −w1 L1³/4 − w2 L2³/4,
// a fixed end as a zero-length span, a cantilever root moment −w Lc²/2.
std::vector<double> three_moment(const StripModel& m, const std::vector<double>& q) {
  const std::size_t n = m.spans_mm.size();
  std::vector<double> M(n + 1, 0.0);
  std::vector<bool> known(n + 1, false);
  known[0] = m.left != EndSupport::fixed;  // a pinned end or a free tip carries no moment
  known[n] = m.right != EndSupport::fixed;
  if (m.left == EndSupport::free) M[1] = -q[0] * m.spans_mm[0] * m.spans_mm[0] / 2, known[1] = true;
  if (m.right == EndSupport::free)
    M[n - 1] = -q[n - 1] * m.spans_mm[n - 1] * m.spans_mm[n - 1] / 2, known[n - 1] = true;
  std::vector<std::size_t> unknowns;
  for (std::size_t j = 0; j <= n; ++j)
    if (!known[j]) unknowns.push_back(j);
  const std::size_t k = unknowns.size();
  std::vector<std::vector<double>> A(k, std::vector<double>(k + 1, 0.0));
  auto col = [&](std::size_t node) -> long {
    for (std::size_t i = 0; i < k; ++i)
      if (unknowns[i] == node) return static_cast<long>(i);
    return -1;
  };
  for (std::size_t r = 0; r < k; ++r) {
    const std::size_t j = unknowns[r];
    const double L1 = j > 0 ? m.spans_mm[j - 1] : 0.0, L2 = j < n ? m.spans_mm[j] : 0.0;
    const double w1 = j > 0 ? q[j - 1] : 0.0, w2 = j < n ? q[j] : 0.0;
    double rhs = -w1 * L1 * L1 * L1 / 4 - w2 * L2 * L2 * L2 / 4;
    A[r][r] = 2 * (L1 + L2);
    if (j > 0) {
      if (col(j - 1) >= 0) A[r][col(j - 1)] += L1; else rhs -= M[j - 1] * L1;
    }
    if (j < n) {
      if (col(j + 1) >= 0) A[r][col(j + 1)] += L2; else rhs -= M[j + 1] * L2;
    }
    A[r][k] = rhs;
  }
  for (std::size_t i = 0; i < k; ++i) {  // Gauss-Jordan
    std::size_t p = i;
    for (std::size_t r = i + 1; r < k; ++r)
      if (std::abs(A[r][i]) > std::abs(A[p][i])) p = r;
    std::swap(A[i], A[p]);
    for (std::size_t r = 0; r < k; ++r) {
      if (r == i) continue;
      const double f = A[r][i] / A[i][i];
      for (std::size_t c = i; c <= k; ++c) A[r][c] -= f * A[i][c];
    }
  }
  for (std::size_t i = 0; i < k; ++i) M[unknowns[i]] = A[i][k] / A[i][i];
  return M;
}
}  // namespace

TEST_CASE("Random strips agree with the three-moment equation", "[analysis][property]") {
  std::mt19937 rng(4242);
  std::uniform_int_distribution<int> spans(1, 8), end(0, 2);
  std::uniform_real_distribution<double> len(1000, 9000), load(0, 30);
  const EndSupport ends[] = {EndSupport::pinned, EndSupport::fixed, EndSupport::free};
  int checked = 0;
  while (checked < 400) {
    StripModel m;
    const int n = spans(rng);
    for (int i = 0; i < n; ++i) m.spans_mm.push_back(len(rng));
    m.left = ends[end(rng)];
    m.right = ends[end(rng)];
    if (!armature::stability_problem(m).empty()) continue;
    std::vector<double> q(n);
    for (auto& v : q) v = load(rng);
    INFO("spans " << n << " ends " << armature::to_string(m.left) << "/" << armature::to_string(m.right));
    const auto r = armature::analyse(m, q);
    const auto M = three_moment(m, q);
    const double scale = 30.0 * 9000.0 * 9000.0;
    for (int e = 0; e < n; ++e) {
      CHECK(r.spans[e].M_left == Approx(M[e]).margin(1e-9 * scale));
      CHECK(r.spans[e].M_right() == Approx(M[e + 1]).margin(1e-9 * scale));
      const auto statics = armature::span_from_end_moments(m.spans_mm[e], q[e], M[e], M[e + 1]);
      CHECK(r.spans[e].V_left == Approx(statics.V_left).margin(1e-9 * 30 * 9000));
      CHECK(r.spans[e].max_moment() == Approx(statics.max_moment()).margin(1e-9 * scale));
    }
    double total = 0;
    for (int e = 0; e < n; ++e) total += q[e] * m.spans_mm[e];
    CHECK(std::accumulate(r.reactions.begin(), r.reactions.end(), 0.0) == Approx(total));
    ++checked;
  }
}

// ---- Every load shape: partial uniform and concentrated loads ----------------
// Beam-table closed forms, values from memory (standard beam tables for
// simple, fixed-ended, propped and two-span continuous beams); statics where
// marked. Our own strip: 4.3 m span, P = 17.5 kN (a wall across the strip,
// N for the strip's width), q = 9.4 N/mm.

using armature::SpanLoading;
using armature::concentrated_load;
using armature::partial_uniform_load;

namespace {
constexpr double Ls = 4300.0, P = 17500.0, q = 9.4;
constexpr double a = 1650.0, b = Ls - a;
}  // namespace

TEST_CASE("Simply supported point load: M = P a b / L under the load, reactions P b/L and P a/L", "[analysis][shapes]") {
  // Beam tables, simple beam with a concentrated load at any point (from memory).
  StripModel m{{Ls}, EndSupport::pinned, EndSupport::pinned};
  const auto r = armature::analyse_loads(m, {SpanLoading{0.0, {concentrated_load(P, a)}}});
  double x = 0;
  CHECK(r.spans[0].max_moment(&x) == Approx(P * a * b / Ls));
  CHECK(x == Approx(a));
  CHECK(r.reactions[0] == Approx(P * b / Ls));
  CHECK(r.reactions[1] == Approx(P * a / Ls));
  CHECK(r.spans[0].M_left == Approx(0.0).margin(1e-9 * P * Ls));
  CHECK(r.spans[0].M_right() == Approx(0.0).margin(1e-9 * P * Ls));
  // The shear jumps by P under the load: P b/L to its left, −P a/L to its right.
  CHECK(r.spans[0].shear_left_of(a) == Approx(P * b / Ls));
  CHECK(r.spans[0].shear_at(a) == Approx(-P * a / Ls));
  // The diagrams carry the point under the load twice, once each side.
  const auto d = armature::envelope_diagrams(m, {r});
  std::vector<armature::DiagramPoint> under;
  for (const auto& p : d[0])
    if (p.x_mm == a) under.push_back(p);
  REQUIRE(under.size() == 2);
  CHECK(under[0].M_max == Approx(P * a * b / Ls));
  CHECK(under[0].V_max == Approx(P * b / Ls));
  CHECK(under[1].V_min == Approx(-P * a / Ls));
}

TEST_CASE("Fixed-end moments of a point load: P a b²/L² and P a² b/L²", "[analysis][shapes]") {
  // Beam tables, beam fixed at both ends, concentrated load at any point
  // (from memory): reactions P b²(3a + b)/L³ and P a²(a + 3b)/L³; moment
  // under the load 2 P a² b²/L³.
  const auto f = armature::fixed_end_concentrated(Ls, P, a);
  CHECK(f.M_left == Approx(-P * a * b * b / (Ls * Ls)));
  CHECK(f.M_right == Approx(-P * a * a * b / (Ls * Ls)));
  CHECK(f.R_left == Approx(P * b * b * (3 * a + b) / (Ls * Ls * Ls)));
  CHECK(f.R_right == Approx(P * a * a * (a + 3 * b) / (Ls * Ls * Ls)));
  StripModel m{{Ls}, EndSupport::fixed, EndSupport::fixed};
  const auto r = armature::analyse_loads(m, {SpanLoading{0.0, {concentrated_load(P, a)}}});
  CHECK(r.spans[0].M_left == Approx(-P * a * b * b / (Ls * Ls)));
  CHECK(r.spans[0].M_right() == Approx(-P * a * a * b / (Ls * Ls)));
  CHECK(r.reactions[0] == Approx(P * b * b * (3 * a + b) / (Ls * Ls * Ls)));
  CHECK(r.spans[0].max_moment() == Approx(2 * P * a * a * b * b / (Ls * Ls * Ls)));
}

namespace {
// Fixed-end moments (magnitudes) of a uniform load q over the first c of a
// span L, beam tables (from memory):
//   at the loaded end  q c² (6L² − 8cL + 3c²)/(12 L²),
//   at the far end     q c³ (4L − 3c)/(12 L²).
double fem_near(double l, double u, double c) { return u * c * c * (6 * l * l - 8 * c * l + 3 * c * c) / (12 * l * l); }
double fem_far(double l, double u, double c) { return u * c * c * c * (4 * l - 3 * c) / (12 * l * l); }
}  // namespace

TEST_CASE("Fixed-end moments of a partial uniform load", "[analysis][shapes]") {
  // Over the first 1.2 m: the table's forms directly.
  const double c = 1200.0;
  auto f = armature::fixed_end_partial_uniform(Ls, q, 0.0, c);
  CHECK(f.M_left == Approx(-fem_near(Ls, q, c)));
  CHECK(f.M_right == Approx(-fem_far(Ls, q, c)));
  CHECK(f.R_left + f.R_right == Approx(q * c));
  // Over the whole span the table gives wL²/12 at both ends.
  f = armature::fixed_end_partial_uniform(Ls, q, 0.0, Ls);
  CHECK(f.M_left == Approx(-q * Ls * Ls / 12));
  CHECK(f.M_right == Approx(-q * Ls * Ls / 12));
  // From 0.9 m to 3.1 m: the load over [0, 3.1] less the load over [0, 0.9]
  // (superposition of the table's forms), and the mirror image from the
  // right end.
  const double s = 900.0, t = 3100.0;
  f = armature::fixed_end_partial_uniform(Ls, q, s, t);
  CHECK(f.M_left == Approx(-(fem_near(Ls, q, t) - fem_near(Ls, q, s))));
  CHECK(f.M_right == Approx(-(fem_far(Ls, q, t) - fem_far(Ls, q, s))));
  const auto mirror = armature::fixed_end_partial_uniform(Ls, q, Ls - t, Ls - s);
  CHECK(mirror.M_left == Approx(f.M_right));
  CHECK(mirror.R_left == Approx(f.R_right));
  // The strip's analysis of a fixed-ended span takes the same moments.
  StripModel m{{Ls}, EndSupport::fixed, EndSupport::fixed};
  const auto r = armature::analyse_loads(m, {SpanLoading{0.0, {partial_uniform_load(q, s, t)}}});
  CHECK(r.spans[0].M_left == Approx(f.M_left));
  CHECK(r.spans[0].M_right() == Approx(f.M_right));
}

TEST_CASE("Simply supported partial uniform load: peak R1 (a + R1/2q) at a + R1/q", "[analysis][shapes]") {
  // Beam tables, simple beam with a uniform load partially distributed
  // (from memory): R1 = q c (2 e + c)/(2L), e = distance from the load's end
  // to the right support; M max = R1 (s + R1/(2q)) at x = s + R1/q.
  const double s = 700.0, c = 2100.0, e = Ls - s - c;
  StripModel m{{Ls}, EndSupport::pinned, EndSupport::pinned};
  const auto r = armature::analyse_loads(m, {SpanLoading{0.0, {partial_uniform_load(q, s, s + c)}}});
  const double R1 = q * c * (2 * e + c) / (2 * Ls);
  CHECK(r.reactions[0] == Approx(R1));
  double x = 0;
  CHECK(r.spans[0].max_moment(&x) == Approx(R1 * (s + R1 / (2 * q))));
  CHECK(x == Approx(s + R1 / q));
}

TEST_CASE("Two equal spans, central point load on each: support 3PL/16", "[analysis][shapes]") {
  // Beam tables, continuous beam of two equal spans, concentrated load at
  // the centre of each (from memory): support −3PL/16, reactions 5P/16,
  // 22P/16, 5P/16, moment under each load 5PL/32.
  StripModel m{{Ls, Ls}, EndSupport::pinned, EndSupport::pinned};
  const SpanLoading centre{0.0, {concentrated_load(P, Ls / 2)}};
  const auto r = armature::analyse_loads(m, {centre, centre});
  CHECK(r.spans[0].M_right() == Approx(-3 * P * Ls / 16));
  CHECK(r.spans[1].M_left == Approx(-3 * P * Ls / 16));
  CHECK(r.reactions[0] == Approx(5 * P / 16));
  CHECK(r.reactions[1] == Approx(22 * P / 16));
  CHECK(r.reactions[2] == Approx(5 * P / 16));
  double x = 0;
  CHECK(r.spans[1].max_moment(&x) == Approx(5 * P * Ls / 32));
  CHECK(x == Approx(Ls / 2));
  // Redistribution keeps the loads: support 0.85 · 3PL/16, and under the
  // load PL/4 + M_support/2 (statics of the span).
  const auto nodes = armature::redistributable_nodes(m);
  const auto rd = armature::redistribute(m, r, nodes, 0.85);
  CHECK(rd.spans[0].M_right() == Approx(-0.85 * 3 * P * Ls / 16));
  CHECK(rd.spans[0].max_moment() == Approx(P * Ls / 4 - 0.85 * 3 * P * Ls / 16 / 2));
  CHECK(rd.reactions[0] + rd.reactions[1] + rd.reactions[2] == Approx(2 * P));
  // The envelope over this case and one with the second span unloaded
  // (first span: support −3PL/32 alone, beam tables as above by
  // superposition of one loaded span: 3PL/32; span peak P L/4 − 3PL/64).
  const auto one = armature::analyse_loads(m, {centre, SpanLoading{}});
  CHECK(one.spans[0].M_right() == Approx(-3 * P * Ls / 32));
  const auto env = armature::envelope_of(m, {r, one});
  CHECK(env.span_max_sagging[0] == Approx(P * Ls / 4 - 3 * P * Ls / 64));
  CHECK(env.span_x_max_sagging[0] == Approx(Ls / 2));
  CHECK(env.node_max_hogging[1] == Approx(3 * P * Ls / 16));
  CHECK(env.node_max_shear[1] == Approx(11 * P / 16));
}

TEST_CASE("Propped cantilever with a point load", "[analysis][shapes]") {
  // Beam tables, beam fixed at one end and supported at the other,
  // concentrated load at any point (from memory): prop reaction
  // P a² (3L − a)/(2L³), fixed-end moment −P a b (L + b)/(2L²), moment under
  // the load R_prop · b.
  StripModel m{{Ls}, EndSupport::fixed, EndSupport::pinned};
  const auto r = armature::analyse_loads(m, {SpanLoading{0.0, {concentrated_load(P, a)}}});
  const double R_prop = P * a * a * (3 * Ls - a) / (2 * Ls * Ls * Ls);
  CHECK(r.reactions[1] == Approx(R_prop));
  CHECK(r.reactions[0] == Approx(P - R_prop));
  CHECK(r.spans[0].M_left == Approx(-P * a * b * (Ls + b) / (2 * Ls * Ls)));
  double x = 0;
  CHECK(r.spans[0].max_moment(&x) == Approx(R_prop * b));
  CHECK(x == Approx(a));
}

TEST_CASE("Loads at a span's end act on the node", "[analysis][shapes]") {
  // A parapet at a cantilever's tip: root moment −P Lc, root reaction P
  // (statics). The same load on an interior support only adds to its
  // reaction.
  const double Lc = 1350.0;
  StripModel c{{Lc}, EndSupport::fixed, EndSupport::free};
  auto r = armature::analyse_loads(c, {SpanLoading{0.0, {concentrated_load(P, Lc)}}});
  CHECK(r.spans[0].M_left == Approx(-P * Lc));
  CHECK(r.spans[0].V_right() == Approx(P));
  CHECK(r.reactions[0] == Approx(P));
  StripModel back{{Lc, Ls}, EndSupport::free, EndSupport::pinned};
  r = armature::analyse_loads(back, {SpanLoading{0.0, {concentrated_load(P, 0.0)}}, SpanLoading{}});
  CHECK(r.spans[1].M_left == Approx(-P * Lc));
  CHECK(r.reactions[1] + r.reactions[2] == Approx(P));
  CHECK(r.reactions[2] == Approx(-P * Lc / Ls));  // the back span's far end lifts
  StripModel two{{Ls, Ls}, EndSupport::pinned, EndSupport::pinned};
  r = armature::analyse_loads(two, {SpanLoading{0.0, {concentrated_load(P, Ls)}}, SpanLoading{}});
  CHECK(r.reactions[1] == Approx(P));
  CHECK(r.spans[0].max_moment() == Approx(0.0).margin(1e-9 * P * Ls));
  CHECK(r.spans[0].V_right() == Approx(0.0).margin(1e-9 * P));
}

TEST_CASE("Loads outside their span are refused", "[analysis][shapes]") {
  StripModel m{{Ls}, EndSupport::pinned, EndSupport::pinned};
  CHECK_THROWS_AS(armature::analyse_loads(m, {SpanLoading{0.0, {concentrated_load(P, Ls + 1)}}}),
                  std::invalid_argument);
  CHECK_THROWS_AS(armature::analyse_loads(m, {SpanLoading{0.0, {partial_uniform_load(q, -1, 900)}}}),
                  std::invalid_argument);
  CHECK_THROWS_AS(armature::analyse_loads(m, {SpanLoading{0.0, {partial_uniform_load(q, 900, 800)}}}),
                  std::invalid_argument);
  CHECK_THROWS_AS(armature::analyse_loads(m, {SpanLoading{NAN, {}}}), std::invalid_argument);
}

namespace {
// An independent solution for strips with mixed loads, written here from
// first principles: the simple-span moment M0(x) of each span by statics,
// the three-moment equation (Clapeyron) with its load terms
//   6/L1 ∫ M0 x dx (span left of the support, x from its far end) and
//   6/L2 ∫ M0 (L2 − x) dx (span right of it, x from the support),
// integrated by Simpson's rule between the load discontinuities (exact: the
// integrand is a cubic on each piece); a fixed end as a zero-length span; a
// cantilever's root moment by statics.
double simple_moment(double Lspan, const SpanLoading& s, double x) {
  double M = s.w * x * (Lspan - x) / 2;
  for (const auto& l : s.loads) {
    if (l.shape == armature::SpanLoad::Shape::concentrated) {
      M += x <= l.a_mm ? l.value * (Lspan - l.a_mm) * x / Lspan : l.value * l.a_mm * (Lspan - x) / Lspan;
    } else {
      const double W = l.value * (l.b_mm - l.a_mm), R1 = W * (Lspan - (l.a_mm + l.b_mm) / 2) / Lspan;
      const double left = std::clamp(x, l.a_mm, l.b_mm) - l.a_mm;  // loaded length left of x
      M += R1 * x - l.value * left * (x - l.a_mm - left / 2);
    }
  }
  return M;
}

std::vector<double> pieces(double Lspan, const SpanLoading& s) {
  std::vector<double> x{0.0, Lspan};
  for (const auto& l : s.loads) {
    x.push_back(l.a_mm);
    if (l.shape == armature::SpanLoad::Shape::partial_uniform) x.push_back(l.b_mm);
  }
  std::sort(x.begin(), x.end());
  return x;
}

template <class F>
double simpson(const std::vector<double>& xs, F f) {
  double sum = 0.0;
  for (std::size_t i = 0; i + 1 < xs.size(); ++i) {
    const double x0 = xs[i], x1 = xs[i + 1];
    if (x1 > x0) sum += (x1 - x0) / 6 * (f(x0) + 4 * f((x0 + x1) / 2) + f(x1));
  }
  return sum;
}

// Moment of a span's loads about its left end (lever x) or right end (L − x).
double load_moment(double Lspan, const SpanLoading& s, bool about_left) {
  double sum = s.w * Lspan * Lspan / 2;
  for (const auto& l : s.loads) {
    const double lever_a = about_left ? l.a_mm : Lspan - l.a_mm;
    if (l.shape == armature::SpanLoad::Shape::concentrated) {
      sum += l.value * lever_a;
    } else {
      const double c = (l.a_mm + l.b_mm) / 2;
      sum += l.value * (l.b_mm - l.a_mm) * (about_left ? c : Lspan - c);
    }
  }
  return sum;
}

std::vector<double> three_moment_mixed(const StripModel& m, const std::vector<SpanLoading>& s) {
  const std::size_t n = m.spans_mm.size();
  std::vector<double> M(n + 1, 0.0);
  std::vector<bool> known(n + 1, false);
  known[0] = m.left != EndSupport::fixed;
  known[n] = m.right != EndSupport::fixed;
  if (m.left == EndSupport::free) M[1] = -load_moment(m.spans_mm[0], s[0], false), known[1] = true;
  if (m.right == EndSupport::free) M[n - 1] = -load_moment(m.spans_mm[n - 1], s[n - 1], true), known[n - 1] = true;
  std::vector<std::size_t> unknowns;
  for (std::size_t j = 0; j <= n; ++j)
    if (!known[j]) unknowns.push_back(j);
  const std::size_t k = unknowns.size();
  std::vector<std::vector<double>> A(k, std::vector<double>(k + 1, 0.0));
  auto col = [&](std::size_t node) -> long {
    for (std::size_t i = 0; i < k; ++i)
      if (unknowns[i] == node) return static_cast<long>(i);
    return -1;
  };
  for (std::size_t r = 0; r < k; ++r) {
    const std::size_t j = unknowns[r];
    const double L1 = j > 0 ? m.spans_mm[j - 1] : 0.0, L2 = j < n ? m.spans_mm[j] : 0.0;
    double rhs = 0.0;
    if (j > 0)
      rhs -= 6 / L1 * simpson(pieces(L1, s[j - 1]), [&](double x) { return simple_moment(L1, s[j - 1], x) * x; });
    if (j < n)
      rhs -= 6 / L2 * simpson(pieces(L2, s[j]), [&](double x) { return simple_moment(L2, s[j], x) * (L2 - x); });
    A[r][r] = 2 * (L1 + L2);
    if (j > 0) {
      if (col(j - 1) >= 0) A[r][col(j - 1)] += L1; else rhs -= M[j - 1] * L1;
    }
    if (j < n) {
      if (col(j + 1) >= 0) A[r][col(j + 1)] += L2; else rhs -= M[j + 1] * L2;
    }
    A[r][k] = rhs;
  }
  for (std::size_t i = 0; i < k; ++i) {  // Gauss-Jordan
    std::size_t p = i;
    for (std::size_t r = i + 1; r < k; ++r)
      if (std::abs(A[r][i]) > std::abs(A[p][i])) p = r;
    std::swap(A[i], A[p]);
    for (std::size_t r = 0; r < k; ++r) {
      if (r == i) continue;
      const double f = A[r][i] / A[i][i];
      for (std::size_t c = i; c <= k; ++c) A[r][c] -= f * A[i][c];
    }
  }
  for (std::size_t i = 0; i < k; ++i) M[unknowns[i]] = A[i][k] / A[i][i];
  return M;
}

// The extreme of sign·M on a span whose M is quadratic between pieces: on
// each piece, the parabola through both ends and the middle; its vertex
// when it lies inside and is an extreme of the wanted kind.
double extreme_by_parabolas(const std::vector<double>& xs, const std::function<double(double)>& M, double sign) {
  double best = sign * M(xs.front());
  for (std::size_t i = 0; i + 1 < xs.size(); ++i) {
    const double x0 = xs[i], x1 = xs[i + 1];
    best = std::max(best, sign * M(x1));
    if (!(x1 > x0)) continue;
    const double m0 = M(x0), mm = M((x0 + x1) / 2), m1 = M(x1);
    const double A = 2 * (m1 + m0 - 2 * mm), B = m1 - m0 - A;  // M = A t² + B t + m0
    if (sign * A < 0) {
      const double t = -B / (2 * A);
      if (t > 0 && t < 1) best = std::max(best, sign * M(x0 + t * (x1 - x0)));
    }
  }
  return sign * best;
}
}  // namespace

TEST_CASE("Random strips with mixed loads agree with an independent three-moment solution", "[analysis][shapes][property]") {
  std::mt19937 rng(13013);
  std::uniform_int_distribution<int> spans(1, 6), end(0, 2), count(0, 2), tenth(0, 9);
  std::uniform_real_distribution<double> len(1000, 8000), unit(0, 1);
  const EndSupport ends[] = {EndSupport::pinned, EndSupport::fixed, EndSupport::free};
  int checked = 0;
  while (checked < 300) {
    StripModel m;
    const int n = spans(rng);
    for (int i = 0; i < n; ++i) m.spans_mm.push_back(len(rng));
    m.left = ends[end(rng)];
    m.right = ends[end(rng)];
    if (!armature::stability_problem(m).empty()) continue;
    // Three load cases on the same strip, solved together.
    std::vector<std::vector<SpanLoading>> cases(3, std::vector<SpanLoading>(static_cast<std::size_t>(n)));
    for (auto& c : cases)
      for (int e = 0; e < n; ++e) {
        const double Lspan = m.spans_mm[e];
        SpanLoading& s = c[e];
        s.w = tenth(rng) < 3 ? 0.0 : 25 * unit(rng);
        for (int k = count(rng); k > 0; --k) {  // partial uniform, sometimes upward
          double x0 = Lspan * unit(rng), x1 = Lspan * unit(rng);
          if (x1 < x0) std::swap(x0, x1);
          s.loads.push_back(partial_uniform_load((tenth(rng) == 0 ? -15 : 40) * unit(rng), x0, x1));
        }
        for (int k = count(rng); k > 0; --k) {  // line loads across the strip; some on a node
          const int where = tenth(rng);
          const double at = where == 0 ? 0.0 : where == 1 ? Lspan : Lspan * unit(rng);
          s.loads.push_back(concentrated_load(60000 * unit(rng), at));
        }
      }
    INFO("strip " << checked << ": spans " << n << " ends " << armature::to_string(m.left) << "/"
                  << armature::to_string(m.right));
    const auto results = armature::analyse_load_cases(m, cases);
    for (std::size_t c = 0; c < cases.size(); ++c) {
      const auto& r = results[c];
      const auto M = three_moment_mixed(m, cases[c]);
      auto moment_of = [&](int e) -> std::function<double(double)> {
        const double Lspan = m.spans_mm[e];
        const SpanLoading& s = cases[c][e];
        return [=, &s](double x) { return simple_moment(Lspan, s, x) + M[e] * (1 - x / Lspan) + M[e + 1] * x / Lspan; };
      };
      // Tolerances are relative to the largest moment of the strip in this case.
      double scale = 1.0;
      for (int e = 0; e < n; ++e)
        for (double x : pieces(m.spans_mm[e], cases[c][e])) scale = std::max(scale, std::abs(moment_of(e)(x)));
      double total = 0;
      for (int e = 0; e < n; ++e) {
        const double Lspan = m.spans_mm[e];
        const SpanLoading& s = cases[c][e];
        const auto xs = pieces(Lspan, s);
        const auto Mx = moment_of(e);
        CHECK(std::abs(r.spans[e].M_left - M[e]) <= 1e-6 * scale);
        CHECK(std::abs(r.spans[e].M_right() - M[e + 1]) <= 1e-6 * scale);
        double x_at = 0;
        const double peak = r.spans[e].max_moment(&x_at);
        CHECK(std::abs(peak - extreme_by_parabolas(xs, Mx, 1.0)) <= 1e-6 * scale);
        CHECK(std::abs(Mx(x_at) - peak) <= 1e-6 * scale);  // the peak is where it says
        CHECK(std::abs(r.spans[e].min_moment() - extreme_by_parabolas(xs, Mx, -1.0)) <= 1e-6 * scale);
        total += s.w * Lspan;
        for (const auto& l : s.loads)
          total += l.shape == armature::SpanLoad::Shape::concentrated ? l.value : l.value * (l.b_mm - l.a_mm);
      }
      CHECK(std::accumulate(r.reactions.begin(), r.reactions.end(), 0.0) == Approx(total));
    }
    ++checked;
  }
}
