// Continuous-beam analysis by the direct stiffness method (two degrees of
// freedom per node: deflection and rotation), with fixed-end forces for a
// uniform load; internal forces then follow from each span's statics.
#include "armature/analysis.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <stdexcept>

namespace armature {

bool StripModel::has_support(std::size_t node) const {
  if (node == 0) return left != EndSupport::free;
  if (node == span_count()) return right != EndSupport::free;
  return true;
}

bool StripModel::is_cantilever(std::size_t span) const {
  return (span == 0 && left == EndSupport::free) ||
         (span + 1 == span_count() && right == EndSupport::free);
}

bool StripModel::is_restrained(std::size_t node) const {
  if (node == 0) return left == EndSupport::fixed;
  if (node == span_count()) return right == EndSupport::fixed;
  return true;
}

double StripModel::node_position_mm(std::size_t node) const {
  double x = 0.0;
  for (std::size_t i = 0; i < node; ++i) x += spans_mm[i];
  return x;
}

std::string stability_problem(const StripModel& m) {
  std::size_t supports = 0;
  for (std::size_t j = 0; j < m.node_count(); ++j) supports += m.has_support(j) ? 1 : 0;
  const bool fixed_end = m.left == EndSupport::fixed || m.right == EndSupport::fixed;
  if (supports >= 2 || (supports == 1 && fixed_end)) return {};
  if (supports == 0) return "a strip with both ends free has no support";
  return "a strip with a free end and a single support needs that support fixed";
}

double SpanForces::max_moment(double* x_at) const {
  double best_x = 0.0, best = M_left;
  if (M_right() > best) {
    best = M_right();
    best_x = L;
  }
  if (w > 0.0) {
    const double x0 = V_left / w;  // where V = 0
    if (x0 > 0.0 && x0 < L && moment_at(x0) > best) {
      best = moment_at(x0);
      best_x = x0;
    }
  }
  if (x_at) *x_at = best_x;
  return best;
}

SpanForces span_from_end_moments(double L, double w, double M_left, double M_right) {
  // M(x) = M_left (1 − x/L) + M_right x/L + w x (L − x)/2
  return {L, w, M_left, (M_right - M_left) / L + w * L / 2.0};
}

namespace {
// LU factors of a dense matrix with partial pivoting: factored once, then
// solved for as many load vectors as there are load cases.
class DenseLu {
 public:
  explicit DenseLu(std::vector<double> A, std::size_t n) : a_(std::move(A)), n_(n), pivot_(n) {
    for (std::size_t k = 0; k < n; ++k) {
      std::size_t p = k;
      for (std::size_t i = k + 1; i < n; ++i)
        if (std::abs(a_[i * n + k]) > std::abs(a_[p * n + k])) p = i;
      if (std::abs(a_[p * n + k]) < 1e-300) throw std::runtime_error("strip is a mechanism");
      pivot_[k] = p;
      if (p != k)
        for (std::size_t j = 0; j < n; ++j) std::swap(a_[k * n + j], a_[p * n + j]);
      for (std::size_t i = k + 1; i < n; ++i) {
        const double f = a_[i * n + k] / a_[k * n + k];
        a_[i * n + k] = f;  // the multiplier, kept for the solves
        if (f == 0.0) continue;
        for (std::size_t j = k + 1; j < n; ++j) a_[i * n + j] -= f * a_[k * n + j];
      }
    }
  }
  // x with A x = b; b is overwritten by x.
  void solve(std::vector<double>& b) const {
    const std::size_t n = n_;
    // Rows were exchanged whole (multipliers too): P first, then L, then U.
    for (std::size_t k = 0; k < n; ++k) std::swap(b[k], b[pivot_[k]]);
    for (std::size_t k = 0; k < n; ++k)
      for (std::size_t i = k + 1; i < n; ++i) b[i] -= a_[i * n + k] * b[k];
    for (std::size_t i = n; i-- > 0;) {
      double s = b[i];
      for (std::size_t j = i + 1; j < n; ++j) s -= a_[i * n + j] * b[j];
      b[i] = s / a_[i * n + i];
    }
  }

 private:
  std::vector<double> a_;
  std::size_t n_;
  std::vector<std::size_t> pivot_;
};
}  // namespace

CaseResult analyse(const StripModel& m, const std::vector<double>& w_N_per_mm) {
  return std::move(analyse_cases(m, {w_N_per_mm}).front());
}

std::vector<CaseResult> analyse_cases(const StripModel& m, const std::vector<std::vector<double>>& loads) {
  const std::size_t n_spans = m.span_count(), n_nodes = m.node_count();
  for (const auto& w : loads)
    if (w.size() != n_spans) throw std::invalid_argument("one load per span is needed");
  if (const auto why = stability_problem(m); !why.empty()) throw std::invalid_argument(why);
  constexpr double EI = 1e12;  // N·mm²; uniform, so it cancels from the forces

  // Degrees of freedom: 2j = deflection (up), 2j+1 = rotation (anticlockwise).
  std::vector<int> index(2 * n_nodes, -1);
  int free_dofs = 0;
  for (std::size_t j = 0; j < n_nodes; ++j) {
    if (!m.has_support(j)) index[2 * j] = free_dofs++;
    const bool fixed = (j == 0 && m.left == EndSupport::fixed) ||
                       (j == n_spans && m.right == EndSupport::fixed);
    if (!fixed) index[2 * j + 1] = free_dofs++;
  }
  const std::size_t nf = static_cast<std::size_t>(free_dofs);
  auto dofs_of = [&](std::size_t e) {
    return std::array<int, 4>{index[2 * e], index[2 * e + 1], index[2 * e + 2], index[2 * e + 3]};
  };
  std::vector<double> K(nf * nf, 0.0);
  for (std::size_t e = 0; e < n_spans; ++e) {
    const double L = m.spans_mm[e];
    const double k[4][4] = {{12 / (L * L * L), 6 / (L * L), -12 / (L * L * L), 6 / (L * L)},
                            {6 / (L * L), 4 / L, -6 / (L * L), 2 / L},
                            {-12 / (L * L * L), -6 / (L * L), 12 / (L * L * L), -6 / (L * L)},
                            {6 / (L * L), 2 / L, -6 / (L * L), 4 / L}};
    const auto dofs = dofs_of(e);
    for (int a = 0; a < 4; ++a) {
      if (dofs[a] < 0) continue;
      for (int b = 0; b < 4; ++b)
        if (dofs[b] >= 0) K[dofs[a] * nf + dofs[b]] += EI * k[a][b];
    }
  }
  const DenseLu lu(std::move(K), nf);

  std::vector<CaseResult> results;
  results.reserve(loads.size());
  std::vector<double> u(nf);
  for (const auto& w : loads) {
    // Equivalent nodal loads of a downward uniform load (minus the fixed-end forces).
    std::fill(u.begin(), u.end(), 0.0);
    for (std::size_t e = 0; e < n_spans; ++e) {
      const double L = m.spans_mm[e], q = w[e];
      const double f[4] = {-q * L / 2, -q * L * L / 12, -q * L / 2, q * L * L / 12};
      const auto dofs = dofs_of(e);
      for (int a = 0; a < 4; ++a)
        if (dofs[a] >= 0) u[dofs[a]] += f[a];
    }
    lu.solve(u);
    auto disp = [&](std::size_t dof) { return index[dof] < 0 ? 0.0 : u[index[dof]]; };

    CaseResult& r = results.emplace_back();
    r.spans.reserve(n_spans);
    r.reactions.assign(n_nodes, 0.0);
    for (std::size_t e = 0; e < n_spans; ++e) {
      const double L = m.spans_mm[e], q = w[e];
      const double d[4] = {disp(2 * e), disp(2 * e + 1), disp(2 * e + 2), disp(2 * e + 3)};
      // End forces on the element: k d + fixed-end forces.
      const double F1 = EI * (12 * d[0] / (L * L * L) + 6 * d[1] / (L * L) - 12 * d[2] / (L * L * L) +
                              6 * d[3] / (L * L)) + q * L / 2;
      const double M1 = EI * (6 * d[0] / (L * L) + 4 * d[1] / L - 6 * d[2] / (L * L) + 2 * d[3] / L) +
                        q * L * L / 12;
      SpanForces s{L, q, -M1, F1};  // anticlockwise end moment on the left = hogging
      r.spans.push_back(s);
      r.reactions[e] += s.V_left;
      r.reactions[e + 1] -= s.V_right();
    }
    for (std::size_t j = 0; j < n_nodes; ++j)
      if (!m.has_support(j)) r.reactions[j] = 0.0;
  }
  return results;
}

std::vector<bool> redistributable_nodes(const StripModel& m) {
  std::vector<bool> nodes(m.node_count(), false);
  for (std::size_t j = 1; j + 1 < m.node_count(); ++j)
    nodes[j] = !m.is_cantilever(j - 1) && !m.is_cantilever(j);
  return nodes;
}

CaseResult redistribute(const StripModel& m, const CaseResult& elastic,
                        const std::vector<bool>& nodes, double delta) {
  const std::size_t n = m.span_count();
  std::vector<double> node_moment(n + 1);
  for (std::size_t e = 0; e < n; ++e) {
    node_moment[e] = elastic.spans[e].M_left;
    node_moment[e + 1] = elastic.spans[e].M_right();
  }
  for (std::size_t j = 0; j <= n; ++j)
    if (nodes[j] && node_moment[j] < 0.0) node_moment[j] *= delta;  // hogging only
  CaseResult r;
  r.reactions.assign(n + 1, 0.0);
  for (std::size_t e = 0; e < n; ++e) {
    auto s = span_from_end_moments(m.spans_mm[e], elastic.spans[e].w, node_moment[e], node_moment[e + 1]);
    r.spans.push_back(s);
    r.reactions[e] += s.V_left;
    r.reactions[e + 1] -= s.V_right();
  }
  for (std::size_t j = 0; j <= n; ++j)
    if (!m.has_support(j)) r.reactions[j] = 0.0;
  return r;
}

Envelope envelope_of(const StripModel& m, const std::vector<CaseResult>& cases) {
  const std::size_t n = m.span_count();
  Envelope env;
  env.span_max_sagging.assign(n, -INFINITY);
  env.span_x_max_sagging.assign(n, 0.0);
  env.node_max_hogging.assign(n + 1, 0.0);
  env.node_max_shear.assign(n + 1, 0.0);
  for (const auto& c : cases) {
    for (std::size_t e = 0; e < n; ++e) {
      const auto& s = c.spans[e];
      double x = 0.0;
      const double M = s.max_moment(&x);
      if (M > env.span_max_sagging[e]) {
        env.span_max_sagging[e] = M;
        env.span_x_max_sagging[e] = x;
      }
      env.node_max_hogging[e] = std::max(env.node_max_hogging[e], -s.M_left);
      env.node_max_hogging[e + 1] = std::max(env.node_max_hogging[e + 1], -s.M_right());
      env.node_max_shear[e] = std::max(env.node_max_shear[e], std::abs(s.V_left));
      env.node_max_shear[e + 1] = std::max(env.node_max_shear[e + 1], std::abs(s.V_right()));
    }
  }
  return env;
}

std::vector<std::vector<DiagramPoint>> envelope_diagrams(const StripModel& m,
                                                         const std::vector<CaseResult>& cases,
                                                         int segments) {
  std::vector<std::vector<DiagramPoint>> out(m.span_count());
  for (std::size_t e = 0; e < m.span_count(); ++e) {
    const double x0 = m.node_position_mm(e), L = m.spans_mm[e];
    for (int k = 0; k <= segments; ++k) {
      const double x = L * k / segments;
      DiagramPoint p{x0 + x, -INFINITY, INFINITY, -INFINITY, INFINITY};
      for (const auto& c : cases) {
        const double M = c.spans[e].moment_at(x), V = c.spans[e].shear_at(x);
        p.M_max = std::max(p.M_max, M);
        p.M_min = std::min(p.M_min, M);
        p.V_max = std::max(p.V_max, V);
        p.V_min = std::min(p.V_min, V);
      }
      out[e].push_back(p);
    }
  }
  return out;
}

}  // namespace armature
