// Continuous-beam analysis against standard beam-table results (value from
// memory, standard beam tables) and an independent three-moment solution.
#include <catch2/catch.hpp>

#include <cmath>
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
