// Continuous-beam analysis by the direct stiffness method (two degrees of
// freedom per node: deflection and rotation), with closed-form fixed-end
// actions for uniform, partial uniform and concentrated loads. One
// factorisation serves every load case; member-end forces are k d plus the
// fixed-end actions (superposition), and internal forces then follow from
// each span's statics. Sign conventions: analysis.hpp.
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

SpanLoad partial_uniform_load(double q, double from, double to) {
  return {SpanLoad::Shape::partial_uniform, q, from, to};
}
SpanLoad concentrated_load(double P, double at) { return {SpanLoad::Shape::concentrated, P, at, at}; }

FixedEndActions& FixedEndActions::operator+=(const FixedEndActions& o) {
  M_left += o.M_left;
  M_right += o.M_right;
  R_left += o.R_left;
  R_right += o.R_right;
  return *this;
}

FixedEndActions fixed_end_uniform(double L, double w) {
  return {-w * L * L / 12, w * L * L / -12, w * L / 2, w * L / 2};
}

FixedEndActions fixed_end_concentrated(double L, double P, double a) {
  const double b = L - a;
  // Reactions: P b²(3a + b)/L³ and P a²(a + 3b)/L³.
  return {-P * a * b * b / (L * L), -P * a * a * b / (L * L), P * b * b * (3 * a + b) / (L * L * L),
          P * a * a * (a + 3 * b) / (L * L * L)};
}

FixedEndActions fixed_end_partial_uniform(double L, double q, double a, double b) {
  // ∫ q x (L − x)²/L² dx and ∫ q x² (L − x)/L² dx over [a, b]; the
  // reactions by statics from the simple-span reactions and those moments.
  auto left = [L](double x) { return L * L * x * x / 2 - 2 * L * x * x * x / 3 + x * x * x * x / 4; };
  auto right = [L](double x) { return L * x * x * x / 3 - x * x * x * x / 4; };
  const double M_left = -q * (left(b) - left(a)) / (L * L);
  const double M_right = -q * (right(b) - right(a)) / (L * L);
  const double W = q * (b - a), centroid = (a + b) / 2;
  const double R0_left = W * (L - centroid) / L, R0_right = W * centroid / L;
  return {M_left, M_right, R0_left + (M_right - M_left) / L, R0_right - (M_right - M_left) / L};
}

FixedEndActions fixed_end_actions(double L, const SpanLoad& load) {
  return load.shape == SpanLoad::Shape::concentrated
             ? fixed_end_concentrated(L, load.value, load.a_mm)
             : fixed_end_partial_uniform(L, load.value, load.a_mm, load.b_mm);
}

FixedEndActions fixed_end_actions(double L, const SpanLoading& loading) {
  FixedEndActions f = fixed_end_uniform(L, loading.w);
  for (const auto& load : loading.loads) f += fixed_end_actions(L, load);
  return f;
}

namespace {
// The part of a partial uniform load left of x: its length and the moment
// about x of what lies left of x (per unit intensity).
struct PartLeftOf {
  double length = 0.0, moment = 0.0;
};
PartLeftOf part_left_of(const SpanLoad& l, double x) {
  if (x <= l.a_mm) return {};
  const double c = std::min(x, l.b_mm) - l.a_mm;
  return {c, c * (x - l.a_mm - c / 2)};
}
}  // namespace

double SpanForces::moment_at(double x) const {
  double M = M_left + V_left * x - w * x * x / 2.0;
  for (const auto& l : loads) {
    if (l.shape == SpanLoad::Shape::concentrated) {
      if (x > l.a_mm) M -= l.value * (x - l.a_mm);
    } else {
      M -= l.value * part_left_of(l, x).moment;
    }
  }
  return M;
}

double SpanForces::shear_at(double x) const {
  double V = V_left - w * x;
  for (const auto& l : loads) {
    if (l.shape == SpanLoad::Shape::concentrated) {
      if (l.a_mm <= x) V -= l.value;
    } else {
      V -= l.value * part_left_of(l, x).length;
    }
  }
  return V;
}

double SpanForces::shear_left_of(double x) const {
  double V = V_left - w * x;
  for (const auto& l : loads) {
    if (l.shape == SpanLoad::Shape::concentrated) {
      if (l.a_mm < x) V -= l.value;
    } else {
      V -= l.value * part_left_of(l, x).length;
    }
  }
  return V;
}

std::vector<double> SpanForces::breakpoints() const {
  std::vector<double> x{0.0, L};
  for (const auto& l : loads) {
    x.push_back(l.a_mm);
    if (l.shape == SpanLoad::Shape::partial_uniform) x.push_back(l.b_mm);
  }
  std::sort(x.begin(), x.end());
  x.erase(std::unique(x.begin(), x.end()), x.end());
  return x;
}

namespace {
// The largest of sign·M along the span (sign = +1: sagging, −1: hogging).
// M is a polynomial of degree ≤ 2 between breakpoints with intensity q
// there: the extreme lies at a breakpoint or where V = 0 inside a piece on
// which sign·M is concave (sign·q > 0).
double extreme_moment(const SpanForces& s, double sign, double* x_at) {
  double best_x = 0.0, best = s.M_left;
  if (s.loads.empty()) {  // one piece (kept in the order of version 1)
    if (sign * s.M_right() > sign * best) {
      best = s.M_right();
      best_x = s.L;
    }
    if (sign * s.w > 0.0) {
      const double x0 = s.V_left / s.w;  // where V = 0
      if (x0 > 0.0 && x0 < s.L && sign * s.moment_at(x0) > sign * best) {
        best = s.moment_at(x0);
        best_x = x0;
      }
    }
    if (x_at) *x_at = best_x;
    return best;
  }
  const auto xs = s.breakpoints();
  for (std::size_t i = 0; i + 1 < xs.size(); ++i) {
    const double x0 = xs[i], x1 = xs[i + 1];
    double q = s.w;  // intensity on (x0, x1)
    for (const auto& l : s.loads)
      if (l.shape == SpanLoad::Shape::partial_uniform && l.a_mm <= x0 && l.b_mm >= x1) q += l.value;
    if (sign * q > 0.0) {
      const double x = x0 + s.shear_at(x0) / q;  // V = 0
      if (x > x0 && x < x1) {
        const double M = s.moment_at(x);
        if (sign * M > sign * best) best = M, best_x = x;
      }
    }
    const double M1 = s.moment_at(x1);
    if (sign * M1 > sign * best) best = M1, best_x = x1;
  }
  if (x_at) *x_at = best_x;
  return best;
}
}  // namespace

double SpanForces::max_moment(double* x_at) const { return extreme_moment(*this, 1.0, x_at); }
double SpanForces::min_moment(double* x_at) const { return extreme_moment(*this, -1.0, x_at); }

SpanForces span_from_end_moments(double L, double w, double M_left, double M_right) {
  // M(x) = M_left (1 − x/L) + M_right x/L + w x (L − x)/2
  return {L, w, M_left, (M_right - M_left) / L + w * L / 2.0, {}};
}

namespace {
bool at_span_end(const SpanLoad& l, double L) {
  return l.shape == SpanLoad::Shape::concentrated && (l.a_mm <= 0.0 || l.a_mm >= L);
}

// Reactions: the loads on supported nodes go straight into them; a node
// without a support has none.
void add_node_loads(const StripModel& m, CaseResult& r) {
  for (std::size_t j = 0; j < r.reactions.size(); ++j) {
    if (!m.has_support(j)) r.reactions[j] = 0.0;
    else if (!r.node_loads.empty()) r.reactions[j] += r.node_loads[j];
  }
}

// A span from its end moments by statics: V_left is the simple-span left
// reaction of the loads inside the span plus (M_right − M_left)/L.
SpanForces span_by_statics(double L, double w, std::vector<SpanLoad> inside, double M_left, double M_right) {
  double R0 = w * L / 2.0;
  for (const auto& l : inside) {
    if (l.shape == SpanLoad::Shape::concentrated) {
      R0 += l.value * (L - l.a_mm) / L;
    } else {
      R0 += l.value * (l.b_mm - l.a_mm) * (L - (l.a_mm + l.b_mm) / 2) / L;
    }
  }
  return {L, w, M_left, (M_right - M_left) / L + R0, std::move(inside)};
}
}  // namespace

SpanForces span_from_end_moments(double L, const SpanLoading& loading, double M_left, double M_right) {
  std::vector<SpanLoad> inside;
  for (const auto& l : loading.loads)
    if (!at_span_end(l, L)) inside.push_back(l);
  return span_by_statics(L, loading.w, std::move(inside), M_left, M_right);
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

namespace {
// What one load case puts on one span, without copying the uniform-only
// load cases of version 1.
struct SpanLoadView {
  double w = 0.0;
  const std::vector<SpanLoad>* loads = nullptr;  // null: none
};

template <class LoadOf>  // LoadOf(case, span) → SpanLoadView
std::vector<CaseResult> solve_cases(const StripModel& m, std::size_t n_cases, LoadOf load_of) {
  const std::size_t n_spans = m.span_count(), n_nodes = m.node_count();
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
  results.reserve(n_cases);
  std::vector<double> u(nf);
  std::vector<FixedEndActions> fea(n_spans);
  for (std::size_t c = 0; c < n_cases; ++c) {
    CaseResult& r = results.emplace_back();
    // Fixed-end actions of each span, and concentrated loads at the span
    // ends, which act on the nodes.
    for (std::size_t e = 0; e < n_spans; ++e) {
      const SpanLoadView v = load_of(c, e);
      const double L = m.spans_mm[e];
      fea[e] = fixed_end_uniform(L, v.w);
      if (!v.loads) continue;
      for (const auto& l : *v.loads) {
        if (at_span_end(l, L)) {
          if (r.node_loads.empty()) r.node_loads.assign(n_nodes, 0.0);
          r.node_loads[l.a_mm <= 0.0 ? e : e + 1] += l.value;
        } else {
          fea[e] += fixed_end_actions(L, l);
        }
      }
    }
    // Equivalent nodal loads: minus the fixed-end forces on the element
    // (upward forces, anticlockwise moments), plus the loads on the nodes.
    std::fill(u.begin(), u.end(), 0.0);
    for (std::size_t e = 0; e < n_spans; ++e) {
      const FixedEndActions& f = fea[e];
      const double g[4] = {-f.R_left, f.M_left, -f.R_right, -f.M_right};
      const auto dofs = dofs_of(e);
      for (int a = 0; a < 4; ++a)
        if (dofs[a] >= 0) u[dofs[a]] += g[a];
    }
    for (std::size_t j = 0; j < r.node_loads.size(); ++j)
      if (index[2 * j] >= 0) u[index[2 * j]] -= r.node_loads[j];
    lu.solve(u);
    auto disp = [&](std::size_t dof) { return index[dof] < 0 ? 0.0 : u[index[dof]]; };

    r.spans.reserve(n_spans);
    r.reactions.assign(n_nodes, 0.0);
    for (std::size_t e = 0; e < n_spans; ++e) {
      const SpanLoadView v = load_of(c, e);
      const double L = m.spans_mm[e];
      const double d[4] = {disp(2 * e), disp(2 * e + 1), disp(2 * e + 2), disp(2 * e + 3)};
      // Left-end forces on the element: k d + fixed-end forces (superposition).
      const double F1 = EI * (12 * d[0] / (L * L * L) + 6 * d[1] / (L * L) - 12 * d[2] / (L * L * L) +
                              6 * d[3] / (L * L)) + fea[e].R_left;
      const double M1 = EI * (6 * d[0] / (L * L) + 4 * d[1] / L - 6 * d[2] / (L * L) + 2 * d[3] / L) -
                        fea[e].M_left;
      // An anticlockwise end moment on the left = hogging.
      SpanForces& s = r.spans.emplace_back(SpanForces{L, v.w, -M1, F1, {}});
      if (v.loads)
        for (const auto& l : *v.loads)
          if (!at_span_end(l, L)) s.loads.push_back(l);
      r.reactions[e] += s.V_left;
      r.reactions[e + 1] -= s.V_right();
    }
    add_node_loads(m, r);
  }
  return results;
}

void check_loading(const StripModel& m, const std::vector<SpanLoading>& spans) {
  if (spans.size() != m.span_count()) throw std::invalid_argument("one loading per span is needed");
  for (std::size_t e = 0; e < spans.size(); ++e) {
    const double L = m.spans_mm[e];
    const std::string where = "span " + std::to_string(e + 1) + ": ";
    if (!std::isfinite(spans[e].w)) throw std::invalid_argument(where + "uniform load is not finite");
    for (const auto& l : spans[e].loads) {
      if (!std::isfinite(l.value) || !std::isfinite(l.a_mm) || !std::isfinite(l.b_mm))
        throw std::invalid_argument(where + "a load or its position is not finite");
      if (l.a_mm < 0.0 || l.a_mm > L)
        throw std::invalid_argument(where + "a load starts or acts outside the span");
      if (l.shape == SpanLoad::Shape::partial_uniform && (l.b_mm < l.a_mm || l.b_mm > L))
        throw std::invalid_argument(where + "a partial load ends outside the span or before it starts");
    }
  }
}
}  // namespace

CaseResult analyse(const StripModel& m, const std::vector<double>& w_N_per_mm) {
  return std::move(analyse_cases(m, std::vector<std::vector<double>>{w_N_per_mm}).front());
}

CaseResult analyse_loads(const StripModel& m, const std::vector<SpanLoading>& loading) {
  return std::move(analyse_load_cases(m, std::vector<std::vector<SpanLoading>>{loading}).front());
}

std::vector<CaseResult> analyse_cases(const StripModel& m, const std::vector<std::vector<double>>& loads) {
  for (const auto& w : loads)
    if (w.size() != m.span_count()) throw std::invalid_argument("one load per span is needed");
  return solve_cases(m, loads.size(), [&](std::size_t c, std::size_t e) {
    return SpanLoadView{loads[c][e], nullptr};
  });
}

std::vector<CaseResult> analyse_load_cases(const StripModel& m,
                                           const std::vector<std::vector<SpanLoading>>& cases) {
  for (const auto& c : cases) check_loading(m, c);
  return solve_cases(m, cases.size(), [&](std::size_t c, std::size_t e) {
    const SpanLoading& s = cases[c][e];
    return SpanLoadView{s.w, s.loads.empty() ? nullptr : &s.loads};
  });
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
  r.node_loads = elastic.node_loads;
  for (std::size_t e = 0; e < n; ++e) {
    const auto& el = elastic.spans[e];
    auto s = el.loads.empty()
                 ? span_from_end_moments(m.spans_mm[e], el.w, node_moment[e], node_moment[e + 1])
                 : span_by_statics(m.spans_mm[e], el.w, el.loads, node_moment[e], node_moment[e + 1]);
    r.reactions[e] += s.V_left;
    r.reactions[e + 1] -= s.V_right();
    r.spans.push_back(std::move(s));
  }
  add_node_loads(m, r);
  return r;
}

Envelope envelope_of(const StripModel& m, const std::vector<CaseResult>& cases) {
  const std::size_t n = m.span_count();
  Envelope env;
  env.span_max_sagging.assign(n, -INFINITY);
  env.span_x_max_sagging.assign(n, 0.0);
  env.span_max_hogging.assign(n, 0.0);
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
      const double M_left = s.M_left, M_right = s.M_right();
      env.span_max_hogging[e] = std::max(env.span_max_hogging[e], -s.min_moment());
      env.node_max_hogging[e] = std::max(env.node_max_hogging[e], -M_left);
      env.node_max_hogging[e + 1] = std::max(env.node_max_hogging[e + 1], -M_right);
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
    // Stations: equal segments, the ends of partial loads, and concentrated
    // loads (flagged: drawn twice, with the shear either side).
    std::vector<std::pair<double, bool>> stations;
    for (int k = 0; k <= segments; ++k) stations.push_back({L * k / segments, false});
    for (const auto& c : cases)
      for (const auto& l : c.spans[e].loads) {
        const bool point = l.shape == SpanLoad::Shape::concentrated;
        stations.push_back({l.a_mm, point});
        if (!point) stations.push_back({l.b_mm, false});
      }
    if (stations.size() > static_cast<std::size_t>(segments) + 1) {
      std::sort(stations.begin(), stations.end());
      // One station per x, flagged when any case has a concentrated load there.
      std::vector<std::pair<double, bool>> merged;
      for (const auto& st : stations) {
        if (!merged.empty() && merged.back().first == st.first) merged.back().second |= st.second;
        else merged.push_back(st);
      }
      stations = std::move(merged);
    }
    auto point_at = [&](double x, int side) {  // side −1: shear left of x, +1 (or 0): right of x
      DiagramPoint p{x0 + x, -INFINITY, INFINITY, -INFINITY, INFINITY};
      for (const auto& c : cases) {
        const auto& s = c.spans[e];
        const double M = s.moment_at(x), V = side < 0 ? s.shear_left_of(x) : s.shear_at(x);
        p.M_max = std::max(p.M_max, M);
        p.M_min = std::min(p.M_min, M);
        p.V_max = std::max(p.V_max, V);
        p.V_min = std::min(p.V_min, V);
      }
      return p;
    };
    for (const auto& [x, point] : stations) {
      if (point) {
        out[e].push_back(point_at(x, -1));
        out[e].push_back(point_at(x, +1));
      } else {
        out[e].push_back(point_at(x, 0));
      }
    }
  }
  return out;
}

}  // namespace armature
