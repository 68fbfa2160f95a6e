// The design driver. Loads are totalled from the code's factors, the strip is
// analysed, each region gets the bar search of contract.md (design/search.cpp),
// and the code's checks of the chosen arrangements make the design record.
#include "armature/design.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <optional>
#include <string_view>
#include <limits>
#include <numbers>

#include <boost/container/small_vector.hpp>

#include "armature/analysis.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "call_code.hpp"
#include "search.hpp"

#ifndef ARMATURE_VERSION
#define ARMATURE_VERSION "0.0.0"
#endif

namespace armature {

const char* version_string() { return ARMATURE_VERSION; }

namespace {

std::string number_text(double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.6g", v);
  return buf;
}

constexpr double max_support_width_mm = 3000.0;

// slab.support_widths_mm against the strip, for every entry path (the JSON
// reader makes the same checks; a Request built in C++ meets them here): one
// width per support, n + 1 for n spans, each finite and from 0 to 3 m, 0 at
// a free end, and each span's two faces (t/2 from the supports'
// centrelines) leaving part of the span clear.
void add_support_width_problems(const SlabInput& slab, InputProblems& problems) {
  const auto& t = slab.support_widths_mm;
  const std::string name = "slab.support_widths_mm";
  if (t.empty()) return;
  const std::size_t n = slab.spans_mm.size();
  if (t.size() != n + 1) {
    problems.add(name, "must list one width per support, " + std::to_string(n + 1) + " for " + std::to_string(n) +
                           (n == 1 ? " span" : " spans") + " (0 at a free end), got " + std::to_string(t.size()));
    return;
  }
  bool values_ok = true;
  for (std::size_t j = 0; j < t.size(); ++j) {
    if (std::isfinite(t[j]) && t[j] >= 0.0 && t[j] <= max_support_width_mm) continue;
    problems.add(name + "[" + std::to_string(j) + "]",
                 "must be between 0 and " + number_text(max_support_width_mm) + " mm, got " +
                     (std::isfinite(t[j]) ? number_text(t[j]) : std::string("a value that is not finite")));
    values_ok = false;
  }
  if (!values_ok) return;
  for (std::size_t k = 0; k < 2; ++k) {
    const std::size_t j = k == 0 ? 0 : n;
    if (slab.ends[k] == EndSupport::free && t[j] != 0.0)
      problems.add(name + "[" + std::to_string(j) + "]",
                   "must be 0: slab.ends[" + std::to_string(k) + "] is free, so there is no support there, got " +
                       number_text(t[j]));
  }
  for (std::size_t e = 0; e < n; ++e) {
    const double faces = t[e] / 2.0 + t[e + 1] / 2.0;
    if (faces >= slab.spans_mm[e])
      problems.add(name + "[" + std::to_string(t[e] >= t[e + 1] ? e : e + 1) + "]",
                   "the support faces of span " + std::to_string(e + 1) + " (half of " + number_text(t[e]) +
                       " mm and half of " + number_text(t[e + 1]) + " mm from the supports' centrelines) "
                       "must leave part of its " + number_text(slab.spans_mm[e]) + " mm clear");
  }
}

// Geometry the kernel cannot analyse, redistribution where there is no
// support to take it from, and support widths that do not fit the strip.
void add_scope_problems(const Request& req, InputProblems& problems) {
  add_support_width_problems(req.slab, problems);
  const StripModel model{req.slab.spans_mm, req.slab.ends[0], req.slab.ends[1]};
  if (const auto why = stability_problem(model); !why.empty())
    problems.add("slab.ends", why + " (the strip would be a mechanism)");
  if (req.design.redistribution_percent > 0.0) {
    const auto nodes = redistributable_nodes(model);
    if (std::none_of(nodes.begin(), nodes.end(), [](bool b) { return b; }))
      problems.add("design.redistribution_percent",
                   "this strip has no interior support whose moment can be redistributed "
                   "(cantilever roots are statically determinate); the largest allowed value is 0");
  }
}

// For a request that passed validation; `id` is the code's identity,
// `checker` the code's checker for this request.
DesignRecord design_validated(const SlabChecker& checker, CodeIdentity id, const Request& req, Detail detail);

std::string span_name(std::size_t e) { return "span " + std::to_string(e + 1); }
std::string support_name(std::size_t j) { return "support " + std::to_string(j + 1); }

// A design region by name and face, as regions_of makes them.
struct RegionName {
  std::string where;
  Face face;
  bool certain;  // false: a pinned end whose top region depends on the code's rule, not yet known
};

// The regions of a strip, in order along it (as regions_of): a top region
// at each support but a pinned end, which has one when the code asks for
// partial-fixity steel (`pinned_end_steel`; unknown: listed as uncertain),
// and a bottom region in each span that is not a cantilever.
std::vector<RegionName> region_names(const StripModel& m, std::optional<bool> pinned_end_steel) {
  std::vector<RegionName> out;
  const std::size_t n = m.span_count();
  for (std::size_t j = 0; j <= n; ++j) {
    if (m.has_support(j)) {
      const bool pinned_end = (j == 0 || j == n) && !m.is_restrained(j);
      if (!pinned_end) out.push_back({support_name(j), Face::top, true});
      else if (pinned_end_steel.value_or(true)) out.push_back({support_name(j), Face::top, pinned_end_steel.has_value()});
    }
    if (j < n && !m.is_cantilever(j)) out.push_back({span_name(j), Face::bottom, true});
  }
  return out;
}

// Each region of reinforcement.given must be one of the strip's, at its
// face. `pinned_end_steel`: whether pinned ends carry top bars (the code's
// rule; unknown until the request is valid, when such names pass here).
void add_given_region_problems(const Request& req, std::optional<bool> pinned_end_steel, InputProblems& problems) {
  const auto& given = req.reinforcement.given;
  if (given.empty() || req.slab.spans_mm.empty()) return;
  for (const auto& p : problems.items())
    if (p.field.rfind("slab", 0) == 0) return;  // the strip itself is in doubt
  const StripModel model{req.slab.spans_mm, req.slab.ends[0], req.slab.ends[1]};
  const auto names = region_names(model, pinned_end_steel);
  std::string listed;
  for (const auto& r : names)
    if (r.certain) listed += (listed.empty() ? "" : ", ") + r.where + " (" + to_string(r.face) + ")";
  for (std::size_t i = 0; i < given.size(); ++i) {
    const std::string path = "reinforcement.given[" + std::to_string(i) + "]";
    if (given[i].where.empty()) continue;  // refused as it was read
    const auto it = std::find_if(names.begin(), names.end(), [&](const RegionName& r) { return r.where == given[i].where; });
    if (it == names.end()) {
      const auto with_ends = region_names(model, true);
      const bool pinned_support = pinned_end_steel.has_value() && !*pinned_end_steel &&
                                  std::any_of(with_ends.begin(), with_ends.end(),
                                              [&](const RegionName& r) { return r.where == given[i].where; });
      problems.add(path + ".where",
                   "no region '" + given[i].where + "' in this strip" +
                       (pinned_support ? std::string(" (a pinned end carries no top bars under this code)") : "") +
                       "; its regions are " + listed);
    } else if (it->certain && it->face != given[i].face && !problems.has_field(path + ".face")) {
      problems.add(path + ".face", "'" + it->where + "' is a " + to_string(it->face) + " region; got " +
                                       to_string(given[i].face));
    }
  }
}

// Opens the code's checker for a request that passed every other check,
// and checks the regions of reinforcement.given against the strip (which
// needs the code's rule for pinned ends).
std::unique_ptr<SlabChecker> begin_checked(const DesignCode& code, const CodeIdentity& id, const Request& req) {
  auto checker = call_code(id, "set-up", [&] { return code.begin(req); });
  if (!req.reinforcement.given.empty()) {
    const double fixity =
        call_code(id, "end fixity", [&] { return checker->pinned_end_fixity_fraction(); });
    InputProblems problems;
    add_given_region_problems(req, fixity > 0.0, problems);
    problems.raise_if_any();
  }
  return checker;
}

}  // namespace

std::vector<const Check*> DesignRecord::all_checks() const {
  std::size_t count = 0;
  for (const auto& r : regions) count += r.checks.size();
  for (const auto& s : supports) count += s.checks.size();
  for (const auto& s : spans) count += s.checks.size();
  std::vector<const Check*> out;
  out.reserve(count);
  for (const auto& r : regions)
    for (const auto& c : r.checks) out.push_back(&c);
  for (const auto& s : supports)
    for (const auto& c : s.checks) out.push_back(&c);
  for (const auto& s : spans)
    for (const auto& c : s.checks) out.push_back(&c);
  return out;
}

DesignRecord design(const Registry& registry, const nlohmann::json& j, Detail detail) {
  InputProblems problems;
  Request req = request_from_json(j, problems);
  std::shared_ptr<const DesignCode> code;
  if (!problems.has_field("code")) {
    try {
      code = registry.open(req.code, req.variant.value_or(""));
    } catch (const InputError& e) {
      for (const auto& p : e.problems()) problems.add(p.field, p.message);
    }
  }
  CodeIdentity id;
  if (code) {
    id = call_code(CodeIdentity{req.code, req.variant.value_or(""), ""}, "identity",
                   [&] { return code->identity(); });
    call_code(id, "input validation", [&] { code->validate(req, problems); });
  }
  if (problems.empty()) add_scope_problems(req, problems);
  // With other problems the code's checker cannot be opened: the regions
  // given are checked against the strip alone, now, so that they are
  // reported with the rest (pinned ends wait for a valid request).
  if (!problems.empty()) add_given_region_problems(req, std::nullopt, problems);
  problems.raise_if_any();
  const auto checker = begin_checked(*code, id, req);
  return design_validated(*checker, std::move(id), req, detail);
}

DesignRecord design(const Registry& registry, const Request& req, Detail detail) {
  auto code = registry.open(req.code, req.variant.value_or(""));
  InputProblems problems;
  CodeIdentity id = call_code(CodeIdentity{req.code, req.variant.value_or(""), ""}, "identity",
                              [&] { return code->identity(); });
  call_code(id, "input validation", [&] { code->validate(req, problems); });
  add_scope_problems(req, problems);
  if (!problems.empty()) add_given_region_problems(req, std::nullopt, problems);
  problems.raise_if_any();
  const auto checker = begin_checked(*code, id, req);
  return design_validated(*checker, std::move(id), req, detail);
}

namespace {

SpanKind span_kind_of(const StripModel& m, std::size_t e) {
  if (m.is_cantilever(e)) return SpanKind::cantilever;
  const bool left = m.is_restrained(e), right = m.is_restrained(e + 1);
  if (left && right) return SpanKind::interior_span;
  if (left || right) return SpanKind::end_span;
  return SpanKind::simply_supported;
}

bool whole_strip_uniform(const Action& a) { return a.distribution == Distribution::uniform && !a.span; }

// Uniform over the whole of span e (a whole-strip action, or one on that
// span with no from/to).
bool uniform_on_span(const Action& a, std::size_t e) {
  return a.distribution == Distribution::uniform && (!a.span || (*a.span == e && !a.from_mm && !a.to_mm));
}

double factor_of(const Action& a, const ActionFactor& f, bool loaded) {
  if (loaded) return f.loaded;
  return is_variable(a.kind) ? 0.0 : f.unloaded;
}

// Σ factor × value over the actions `on` selects: the permanent ones summed
// first and factored once per distinct factor, then each variable one, so
// that G and Q alone give γG Gk + γQ Qk operation for operation (version 1).
template <class On>
double factored_sum(const std::vector<Action>& actions, const std::vector<ActionFactor>& f, bool loaded, On on) {
  boost::container::small_vector<std::pair<double, double>, 4> groups;  // factor, Σ values
  for (std::size_t i = 0; i < actions.size(); ++i) {
    if (is_variable(actions[i].kind) || !on(actions[i])) continue;
    const double k = factor_of(actions[i], f[i], loaded);
    auto g = std::find_if(groups.begin(), groups.end(), [&](const auto& p) { return p.first == k; });
    if (g == groups.end()) groups.emplace_back(k, actions[i].value);
    else g->second += actions[i].value;
  }
  double total = 0.0;
  bool first = true;
  auto add = [&](double term) {
    total = first ? term : total + term;
    first = false;
  };
  for (const auto& [k, sum] : groups) add(k * sum);
  for (std::size_t i = 0; i < actions.size(); ++i)
    if (is_variable(actions[i].kind) && on(actions[i])) add(factor_of(actions[i], f[i], loaded) * actions[i].value);
  return total;
}

// The loads of one combination and arrangement on the strip's spans, for
// the strip width b: uniform actions over a whole span in `w`, partial
// ones as partial loads, line loads (value × b) and point loads (value ×
// b / effective width: the load per width of the loaded band) as
// concentrated loads.
std::vector<SpanLoading> loading_of(const std::vector<Action>& actions, const Combination& c,
                                    const std::vector<bool>& loaded, const std::vector<double>& spans_mm,
                                    double b) {
  std::vector<SpanLoading> out(loaded.size());
  for (std::size_t e = 0; e < loaded.size(); ++e) {
    SpanLoading& s = out[e];
    s.w = factored_sum(actions, c.factors, loaded[e], [e](const Action& a) { return uniform_on_span(a, e); }) * b;
    for (std::size_t i = 0; i < actions.size(); ++i) {
      const Action& a = actions[i];
      if (!a.span || *a.span != e || uniform_on_span(a, e)) continue;
      const double k = factor_of(a, c.factors[i], loaded[e]);
      if (k == 0.0 || a.value == 0.0) continue;
      switch (a.distribution) {
        case Distribution::uniform:
          s.loads.push_back(partial_uniform_load(k * a.value * b, a.from_mm.value_or(0.0),
                                                 a.to_mm.value_or(spans_mm[e])));
          break;
        case Distribution::line: s.loads.push_back(concentrated_load(k * a.value * b, a.at_mm)); break;
        case Distribution::point:
          s.loads.push_back(concentrated_load(k * a.value * b / a.effective_width_mm, a.at_mm));
          break;
      }
    }
  }
  return out;
}

bool same_loads(const std::vector<SpanLoading>& x, const std::vector<SpanLoading>& y) {
  if (x.size() != y.size()) return false;
  for (std::size_t e = 0; e < x.size(); ++e) {
    if (x[e].w != y[e].w || x[e].loads.size() != y[e].loads.size()) return false;
    for (std::size_t k = 0; k < x[e].loads.size(); ++k) {
      const SpanLoad &p = x[e].loads[k], &q = y[e].loads[k];
      if (p.shape != q.shape || p.value != q.value || p.a_mm != q.a_mm || p.b_mm != q.b_mm) return false;
    }
  }
  return true;
}

// Load cases: every arrangement of every combination of one limit state.
// The same loads twice (a single span's "alternate" and "all spans"
// arrangements) add nothing to the envelope and are kept once.
std::vector<std::vector<SpanLoading>> load_cases(const std::vector<Action>& actions,
                                                 const std::vector<Combination>& combinations, LimitState state,
                                                 const std::vector<std::vector<bool>>& arrangements,
                                                 const std::vector<double>& spans_mm, double b) {
  std::vector<std::vector<SpanLoading>> cases;
  for (const auto& c : combinations) {
    if (c.limit_state != state) continue;
    for (const auto& a : arrangements) {
      auto loads = loading_of(actions, c, a, spans_mm, b);
      if (std::none_of(cases.begin(), cases.end(), [&](const auto& k) { return same_loads(k, loads); }))
        cases.push_back(std::move(loads));
    }
  }
  return cases;
}

// The same for a strip whose actions are all uniform over the whole strip
// (every version 1 request): one uniform load per span and case, the same
// values as load_cases gives, for the uniform-load analysis (the design
// path that must stay fastest).
std::vector<std::vector<double>> uniform_load_cases(const std::vector<Action>& actions,
                                                    const std::vector<Combination>& combinations, LimitState state,
                                                    const std::vector<std::vector<bool>>& arrangements, double b) {
  std::vector<std::vector<double>> cases;
  for (const auto& c : combinations) {
    if (c.limit_state != state) continue;
    const double loaded = factored_sum(actions, c.factors, true, whole_strip_uniform) * b;
    const double unloaded = factored_sum(actions, c.factors, false, whole_strip_uniform) * b;
    for (const auto& a : arrangements) {
      std::vector<double> w(a.size());
      for (std::size_t i = 0; i < a.size(); ++i) w[i] = a[i] ? loaded : unloaded;
      if (std::find(cases.begin(), cases.end(), w) == cases.end()) cases.push_back(std::move(w));
    }
  }
  return cases;
}

// Uniform totals of the whole-strip actions (the version 1 `loads`).
LoadTotals total_loads(const LoadBasis& basis, const std::vector<Action>& actions,
                       const std::vector<Combination>& combinations) {
  LoadTotals t;
  t.self_weight = actions.front().value;
  const std::vector<ActionFactor> unit(actions.size(), ActionFactor{1.0, 1.0});
  t.Gk = factored_sum(actions, unit, true,
                      [](const Action& a) { return whole_strip_uniform(a) && !is_variable(a.kind); });
  t.Qk = factored_sum(actions, unit, true,
                      [](const Action& a) { return whole_strip_uniform(a) && is_variable(a.kind); });
  t.uls = -1.0;
  t.sls_quasi_permanent = -1.0;
  for (const auto& c : combinations) {
    if (c.limit_state != LimitState::uls && c.limit_state != LimitState::quasi_permanent) continue;
    const double full = factored_sum(actions, c.factors, true, whole_strip_uniform);
    if (c.limit_state == LimitState::uls && full > t.uls) {
      t.uls = full;
      t.combination = c.label;
    }
    if (c.limit_state == LimitState::quasi_permanent) t.sls_quasi_permanent = std::max(t.sls_quasi_permanent, full);
  }
  if (t.sls_quasi_permanent < 0.0) t.sls_quasi_permanent = t.Gk;
  t.density_kN_m3 = basis.density_kN_m3;
  t.long_term_load_name = basis.long_term_load_name;
  return t;
}

// x where positive, else +0 (never −0, whose reciprocal is −inf).
double positive_part(double x) { return x > 0.0 ? x : 0.0; }

// The regions of contract.md in order along the strip: a top region at each
// support that carries hogging (and at pinned ends when the code asks for
// partial-fixity steel), a bottom region in each span that is not a cantilever.
// qp_to_uls(face, span or node, x from the span's left end (spans only)).
template <class QpRatio>
std::vector<RegionDemand> regions_of(const StripModel& m, const Envelope& env,
                                     double fixity_fraction, double delta,
                                     const std::vector<bool>& redistributed, QpRatio qp_to_uls,
                                     std::vector<std::string>& warnings) {
  std::vector<RegionDemand> out;
  const std::size_t n = m.span_count();
  for (std::size_t j = 0; j <= n; ++j) {
    if (m.has_support(j)) {
      const bool end = j == 0 || j == n;
      const bool pinned_end = end && !m.is_restrained(j);
      RegionDemand g;
      g.where = support_name(j);
      g.face = Face::top;
      g.x_mm = m.node_position_mm(j);
      if (pinned_end) {
        if (fixity_fraction > 0.0) {
          const std::size_t e = j == 0 ? 0 : n - 1;
          // Its moment is a fraction of the span's: the span's ratio.
          g.quasi_permanent_to_uls = qp_to_uls(Face::bottom, e, env.span_x_max_sagging[e]);
          g.M_Ed = fixity_fraction * positive_part(env.span_max_sagging[e]);
          out.push_back(std::move(g));
        }
      } else {
        g.quasi_permanent_to_uls = qp_to_uls(Face::top, j, 0.0);
        g.M_Ed = env.node_max_hogging[j];
        g.supports = {{support_name(j), env.node_max_shear[j]}};
        g.redistribution_delta = redistributed[j] ? delta : 1.0;
        for (std::size_t e : {j - 1, j}) {
          if (e < n && m.is_cantilever(e)) {  // j − 1 wraps past n at j = 0
            g.span_where = span_name(e);
            g.span_mm = m.spans_mm[e];
            g.span_kind = SpanKind::cantilever;
          }
        }
        out.push_back(std::move(g));
      }
    }
    if (j < n && !m.is_cantilever(j)) {
      RegionDemand g;
      g.where = span_name(j);
      g.face = Face::bottom;
      if (env.span_max_sagging[j] <= 0.0)
        warnings.push_back(span_name(j) + ": no sagging moment under any arrangement; top bars "
                                          "must run through the span");
      g.M_Ed = positive_part(env.span_max_sagging[j]);
      g.x_mm = m.node_position_mm(j) + env.span_x_max_sagging[j];
      g.span_where = span_name(j);
      g.span_mm = m.spans_mm[j];
      g.span_kind = span_kind_of(m, j);
      g.quasi_permanent_to_uls = qp_to_uls(Face::bottom, j, env.span_x_max_sagging[j]);
      // Pinned end supports rely on the bottom bars of their span.
      for (std::size_t k : {j, j + 1})
        if ((k == 0 || k == n) && m.has_support(k) && !m.is_restrained(k))
          g.supports.push_back({support_name(k), env.node_max_shear[k]});
      out.push_back(std::move(g));
    }
  }
  return out;
}

// Static equilibrium of each cantilever's back span (EQU combinations):
// the cantilever alone loaded (permanent actions at the `loaded`,
// unfavourable factor there, variable actions there only), the other spans
// at the `unloaded`, favourable factor. The reaction at the far support of
// the back span is split by superposition into what the other spans' loads
// give and what the cantilever's loads take away; the combination with the
// least reaction is checked by the code. A fixed far end is built in and
// is not checked.
void add_equilibrium_checks(const SlabChecker& checker, DesignRecord& rec, const StripModel& m, double b,
                            Detail detail) {
  const std::size_t n = m.span_count();
  if (n < 2) return;
  for (std::size_t c = 0; c < n; ++c) {
    if (!m.is_cantilever(c)) continue;
    const std::size_t far = c == 0 ? 2 : n - 2;  // the back span's other end
    if (far > n || !m.has_support(far) || ((far == 0 || far == n) && m.is_restrained(far))) continue;
    std::vector<bool> loaded(n, false);
    loaded[c] = true;
    std::vector<std::vector<SpanLoading>> cases;
    std::vector<const Combination*> used;
    for (const auto& k : rec.combinations) {
      if (k.limit_state != LimitState::equilibrium) continue;
      auto all = loading_of(rec.actions, k, loaded, rec.spans_mm, b);
      std::vector<SpanLoading> stabilising = all, destabilising(n);
      stabilising[c] = SpanLoading{};
      destabilising[c] = all[c];
      cases.push_back(std::move(stabilising));
      cases.push_back(std::move(destabilising));
      used.push_back(&k);
    }
    if (used.empty()) continue;
    const auto results = analyse_load_cases(m, cases);
    EquilibriumDemand worst;
    double least = std::numeric_limits<double>::infinity();
    for (std::size_t k = 0; k < used.size(); ++k) {
      const double R_stb = results[2 * k].reactions[far], R_dst = -results[2 * k + 1].reactions[far];
      if (R_stb - R_dst < least) {
        least = R_stb - R_dst;
        worst = {support_name(far), used[k]->label, R_stb, R_dst};
      }
    }
    auto checks = call_code(rec.code, "equilibrium", [&] { return checker.equilibrium_checks(worst, detail); },
                            worst.where);
    auto s = std::find_if(rec.supports.begin(), rec.supports.end(),
                          [&](const SupportRecord& r) { return r.where == worst.where; });
    if (s == rec.supports.end()) continue;
    for (auto& chk : checks) s->checks.push_back(std::move(chk));
  }
}

// Hogging moment magnitude of a span at x (mm from its left end).
double hogging_at(const SpanForces& s, double x) { return -s.moment_at(x); }

// The moments of each load case at support j of width t (t > 0): at the
// centreline, at the faces t/2 either side (the larger), the adjacent
// spans' fixed-end moments there, and the reaction.
std::vector<SupportMomentCase> support_moment_cases(const StripModel& m, const std::vector<CaseResult>& cases,
                                                    std::size_t j, double t) {
  const std::size_t n = m.span_count();
  std::vector<SupportMomentCase> out;
  out.reserve(cases.size());
  for (const auto& c : cases) {
    SupportMomentCase k;
    k.M_centre = -INFINITY;
    k.M_face = -INFINITY;
    k.M_fixed_end = 0.0;
    if (j > 0) {  // the span to the left ends here
      const SpanForces& s = c.spans[j - 1];
      k.M_centre = std::max(k.M_centre, hogging_at(s, s.L));
      k.M_face = std::max(k.M_face, hogging_at(s, s.L - t / 2.0));
      const double fe = m.is_cantilever(j - 1) ? hogging_at(s, s.L)
                                               : -fixed_end_actions(s.L, SpanLoading{s.w, s.loads}).M_right;
      k.M_fixed_end = std::max(k.M_fixed_end, fe);
    }
    if (j < n) {  // the span to the right starts here
      const SpanForces& s = c.spans[j];
      k.M_centre = std::max(k.M_centre, hogging_at(s, 0.0));
      k.M_face = std::max(k.M_face, hogging_at(s, t / 2.0));
      const double fe = m.is_cantilever(j) ? hogging_at(s, 0.0)
                                           : -fixed_end_actions(s.L, SpanLoading{s.w, s.loads}).M_left;
      k.M_fixed_end = std::max(k.M_fixed_end, fe);
    }
    k.reaction = c.reactions[j];
    out.push_back(k);
  }
  return out;
}

// Support regions of a strip given support widths: the code's design
// moment from the moments of every load case at the support's faces
// (supports of width 0 keep the centreline moment, as without widths).
void apply_support_widths(const SlabChecker& checker, const CodeIdentity& code, const StripModel& m,
                          const std::vector<CaseResult>& cases, const std::vector<double>& widths,
                          std::vector<RegionDemand>& demands, std::vector<std::string>& warnings) {
  const std::size_t n = m.span_count();
  for (std::size_t j = 0; j <= n; ++j) {
    const double t = widths[j];
    const bool end = j == 0 || j == n;
    if (t <= 0.0 || !m.has_support(j)) continue;
    if (end && !m.is_restrained(j)) {  // a pinned end carries no hogging moment to reduce
      warnings.push_back(support_name(j) + ": the support width of " + number_text(t) +
                         " mm is not used (pinned end: no hogging moment to reduce)");
      continue;
    }
    const std::string where = support_name(j);
    for (auto& g : demands) {
      if (g.where != where || g.face != Face::top) continue;
      SupportFace& f = g.support_face;
      f.width_mm = t;
      f.built_in = end;  // a restrained end of the strip is a fixed end
      f.cantilever_root = (j > 0 && m.is_cantilever(j - 1)) || (j < n && m.is_cantilever(j));
      f.M_centre = g.M_Ed;
      f.cases = support_moment_cases(m, cases, j, t);
      const double M = call_code(code, "support design moment", [&] { return checker.support_design_moment(g); },
                                 where);
      if (!std::isfinite(M))
        throw DesignError(code.id + " (" + code.variant + "): the design moment at " + where + " is not finite");
      g.M_Ed = positive_part(M);
    }
  }
}

// Which regions take given bars (reinforcement.given, by region name) and
// which share one arrangement (rationalise: every bottom region not given).
BarPlan plan_bars(const SlabChecker& checker, const CodeIdentity& code, const ReinforcementInput& r,
                  const std::vector<RegionDemand>& demands, double width_mm) {
  BarPlan plan;
  plan.grid = {r.min_spacing_mm, r.spacing_step_mm};
  plan.given.resize(demands.size());
  for (const auto& g : r.given) {
    const auto it = std::find_if(demands.begin(), demands.end(), [&](const RegionDemand& d) { return d.where == g.where; });
    if (it == demands.end())  // validated against region_names: the two disagree
      throw DesignError("reinforcement.given names " + g.where + ", which the design has no region for");
    const auto bar = call_code(code, "catalogue bar", [&] { return checker.catalogue_bar(g.bar); });
    if (!bar)
      throw DesignError(code.id + " (" + code.variant + "): no catalogue bar '" + g.bar +
                        "', which its input validation accepted");
    plan.given[static_cast<std::size_t>(it - demands.begin())] =
        SearchCandidate{*bar, g.spacing_mm, provided_area_mm2(bar->area_mm2, g.spacing_mm, width_mm)};
  }
  if (r.rationalise == Rationalise::uniform_bottom)
    for (std::size_t i = 0; i < demands.size(); ++i)
      if (demands[i].face == Face::bottom && !plan.given[i]) plan.common.push_back(i);
  return plan;
}

DesignRecord design_validated(const SlabChecker& code_checker, CodeIdentity id, const Request& req, Detail detail) {
  if (detail == Detail::verdict) detail = Detail::checks;
  DesignRecord rec;
  rec.code = std::move(id);
  rec.report_units = req.report_units;
  rec.strip_width_mm = req.slab.strip_width_mm;
  const SlabChecker* const checker = &code_checker;
  const LoadBasis basis = call_code(rec.code, "load basis", [&] { return checker->load_basis(); });
  rec.actions = all_actions(req, basis.density_kN_m3);
  rec.list_actions = req.loads.actions_given;
  // Every label where the combinations are listed (the record, a result
  // listing its actions) or an equilibrium check names its combination (a
  // strip with a cantilever); otherwise a design needs the ULS labels alone.
  const bool has_cantilever = req.slab.ends[0] == EndSupport::free || req.slab.ends[1] == EndSupport::free;
  const CombinationLabels labels = rec.list_actions || detail == Detail::steps || has_cantilever
                                       ? CombinationLabels::all
                                       : CombinationLabels::strength;
  rec.combinations =
      call_code(rec.code, "combinations", [&] { return checker->combinations(rec.actions, labels); });
  for (const auto& c : rec.combinations)
    if (c.factors.size() != rec.actions.size())
      throw DesignError(rec.code.id + ": combination '" + c.label + "' does not give a factor for every action");
  if (std::none_of(rec.combinations.begin(), rec.combinations.end(),
                   [](const Combination& c) { return c.limit_state == LimitState::uls; }))
    throw DesignError(rec.code.id + ": the code gave no ULS combination");
  rec.loads = total_loads(basis, rec.actions, rec.combinations);
  if (detail == Detail::steps)  // only the calculation record lists them
    rec.defaults_used = call_code(rec.code, "defaults", [&] { return checker->defaults_used(); });

  const double b = req.slab.strip_width_mm;
  const StripModel model{req.slab.spans_mm, req.slab.ends[0], req.slab.ends[1]};
  const std::size_t n = model.span_count();
  const auto arrangements =
      call_code(rec.code, "load arrangements", [&] { return checker->load_arrangements(n); });
  for (const auto& a : arrangements)
    if (a.size() != n) throw DesignError(rec.code.id + ": a load arrangement does not match the spans");
  if (arrangements.empty()) throw DesignError(rec.code.id + ": the code gave no load arrangement");

  const double delta = 1.0 - req.design.redistribution_percent / 100.0;
  const auto redistributed = redistributable_nodes(model);
  const bool all_uniform = std::all_of(rec.actions.begin(), rec.actions.end(), whole_strip_uniform);
  std::vector<CaseResult> cases;
  if (all_uniform) {
    const auto uls_cases = uniform_load_cases(rec.actions, rec.combinations, LimitState::uls, arrangements, b);
    rec.load_cases = uls_cases.size();
    cases = analyse_cases(model, uls_cases);
  } else {
    const auto uls_cases =
        load_cases(rec.actions, rec.combinations, LimitState::uls, arrangements, req.slab.spans_mm, b);
    rec.load_cases = uls_cases.size();
    cases = analyse_load_cases(model, uls_cases);
  }
  if (delta < 1.0)
    for (auto& c : cases) c = redistribute(model, c, redistributed, delta);
  const Envelope env = envelope_of(model, cases);
  if (detail == Detail::steps) rec.diagrams = envelope_diagrams(model, cases);  // for the record
  rec.spans_mm = req.slab.spans_mm;
  rec.load_arrangements = arrangements.size();
  rec.ends = req.slab.ends;
  rec.redistribution_percent = req.design.redistribution_percent;
  rec.project = req.project;
  rec.thickness_mm = req.slab.thickness_mm;
  const double fixity = call_code(rec.code, "end fixity", [&] { return checker->pinned_end_fixity_fraction(); });
  // The ratio of the quasi-permanent moment to the ULS moment at a region.
  // With every action uniform over the whole strip the moments are in the
  // ratio of the loads, taken from the loads (as version 1, exactly).
  // Otherwise both come from analyses with every span loaded: the
  // quasi-permanent combination(s) and the ULS combination giving the
  // largest moment of the region's sense there; bounded to [0, 1], and the
  // load ratio where that ULS moment is nil or of the other sense.
  const double load_ratio = rec.loads.sls_quasi_permanent / rec.loads.uls;
  std::vector<CaseResult> qp_all, uls_all;
  if (!all_uniform) {
    const std::vector<std::vector<bool>> all_loaded{all_spans_loaded(n)};
    qp_all = analyse_load_cases(model, load_cases(rec.actions, rec.combinations, LimitState::quasi_permanent,
                                                  all_loaded, req.slab.spans_mm, b));
    uls_all = analyse_load_cases(
        model, load_cases(rec.actions, rec.combinations, LimitState::uls, all_loaded, req.slab.spans_mm, b));
  }
  double longest = 0.0;
  for (double L : req.slab.spans_mm) longest = std::max(longest, L);
  const double nil_moment = 1e-9 * rec.loads.uls * b * longest * longest;
  auto moment_in = [&](const CaseResult& c, Face face, std::size_t index, double x) {
    const double M = face == Face::bottom ? c.spans[index].moment_at(x)
                     : index < n          ? c.spans[index].M_left
                                          : c.spans[n - 1].M_right();
    return face == Face::bottom ? M : -M;
  };
  auto qp_ratio = [&](Face face, std::size_t index, double x) {
    if (all_uniform || qp_all.empty()) return load_ratio;
    double M_uls = -std::numeric_limits<double>::infinity(), M_qp = -std::numeric_limits<double>::infinity();
    for (const auto& c : uls_all) M_uls = std::max(M_uls, moment_in(c, face, index, x));
    for (const auto& c : qp_all) M_qp = std::max(M_qp, moment_in(c, face, index, x));
    if (!(M_uls > nil_moment)) return load_ratio;
    return std::clamp(M_qp / M_uls, 0.0, 1.0);
  };
  auto demands = regions_of(model, env, fixity, delta, redistributed, qp_ratio, rec.warnings);
  if (!req.slab.support_widths_mm.empty())
    apply_support_widths(*checker, rec.code, model, cases, req.slab.support_widths_mm, demands, rec.warnings);
  rec.rationalise = req.reinforcement.rationalise;
  const BarPlan plan = plan_bars(*checker, rec.code, req.reinforcement, demands, b);
  const std::vector<SearchCandidate> picks = search_with_face_covers(
      *checker, rec.code, demands, b, req.durability, plan, rec.warnings);

  std::vector<std::string> span_names, support_names;
  for (std::size_t e = 0; e < n; ++e) span_names.push_back(span_name(e));
  for (std::size_t j = 0; j <= n; ++j) support_names.push_back(support_name(j));
  std::vector<std::vector<Check>> span_checks(n);
  std::vector<SupportRecord> supports(n + 1);
  rec.regions.reserve(demands.size());
  rec.spans.reserve(n);
  rec.supports.reserve(n + 1);
  double max_main_As = 0.0;
  for (std::size_t i = 0; i < demands.size(); ++i) {
    const RegionDemand& demand = demands[i];
    const SearchCandidate& pick = picks[i];
    RegionOutcome out = call_code(
        rec.code, "the checks",
        [&] { return checker->check_region(demand, pick.bar, pick.spacing_mm, detail); }, demand.where);
    RegionRecord region;
    region.where = demand.where;
    region.face = demand.face;
    region.x_mm = demand.x_mm;
    region.M_Ed = demand.M_Ed;
    region.d_mm = out.d_mm;
    region.As_req_mm2 = out.As_req_mm2;
    region.As_min_mm2 = out.As_min_mm2;
    region.As_max_mm2 = out.As_max_mm2;
    region.cover_mm = out.cover_mm;
    region.bars = {pick.bar.designation, pick.bar.diameter_mm, pick.spacing_mm, pick.As_prov_mm2};
    region.bars_given = plan.given[i].has_value();
    region.checks = std::move(out.checks);
    rec.regions.push_back(std::move(region));
    max_main_As = std::max(max_main_As, pick.As_prov_mm2);
    for (std::size_t e = 0; e < n; ++e)
      if (demand.span_where == span_names[e])
        for (auto& c : out.span_checks) span_checks[e].push_back(std::move(c));
    for (auto& s : out.supports)
      for (std::size_t j = 0; j <= n; ++j)
        if (s.where == support_names[j]) supports[j] = {s.where, s.V_Ed, s.V_Rd, std::move(s.checks)};
  }
  for (std::size_t j = 0; j <= n; ++j)
    if (model.has_support(j) && !supports[j].where.empty()) rec.supports.push_back(std::move(supports[j]));
  for (std::size_t e = 0; e < n; ++e) {
    SpanRecord span{span_names[e], std::move(span_checks[e])};
    auto extra = call_code(rec.code, "span checks", [&] { return checker->span_checks(span.where); });
    for (auto& c : extra) span.checks.push_back(std::move(c));
    rec.spans.push_back(std::move(span));
  }

  // EQU of every cantilever's back span (DEVELOPERS.md, "Actions and
  // combinations").
  add_equilibrium_checks(*checker, rec, model, b, detail);

  bool distribution_ok = true;
  rec.distribution = choose_distribution(*checker, rec.code, max_main_As, b, plan.grid, rec.warnings,
                                         distribution_ok);

  for (const auto& r : rec.regions) {
    double& c = rec.face_cover_mm[static_cast<std::size_t>(r.face)];
    c = std::max(c, r.cover_mm);
  }

  rec.pass = distribution_ok;
  rec.max_utilisation = 0.0;
  bool first = true;
  for (const Check* c : rec.all_checks()) {
    if (!c->pass) rec.pass = false;
    // The search takes the widest spacing allowed, so a passing spacing
    // limit sits near 1 by construction and says nothing: it stays in the
    // checks but heads the result only when it fails.
    if (is_arrangement_limit(c->id.str()) && c->pass) continue;
    if (first || c->utilisation > rec.max_utilisation) {
      rec.max_utilisation = c->utilisation;
      rec.governing_check = c->id;
      rec.governing_where = c->where;
      first = false;
    }
  }
  auto code_warnings = call_code(rec.code, "warnings", [&] { return checker->warnings(); });
  rec.warnings.insert(rec.warnings.begin(), code_warnings.begin(), code_warnings.end());
  return rec;
}
}  // namespace

}  // namespace armature
