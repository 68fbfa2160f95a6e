// OneWayStrip: the one-way strip as a Member. Its geometry (StripModel),
// the load cases of actions × combinations × arrangements on its spans,
// their analysis (one factorisation for all), the design regions with their
// demands, support faces and the equilibrium of cantilevers' back spans.
#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <limits>

#include "armature/member.hpp"
#include "../design/loads.hpp"

namespace armature {

namespace {

// "span 2", "support 3": written with to_chars straight into the text
// (these names are made many times in each design).
std::string numbered_name(std::string_view word, std::size_t number) {
  char text[40];
  const std::size_t n = word.copy(text, 16);
  text[n] = ' ';
  const auto end = std::to_chars(text + n + 1, text + sizeof text, number).ptr;
  return std::string(text, end);
}
std::string span_name(std::size_t e) { return numbered_name("span", e + 1); }
std::string support_name(std::size_t j) { return numbered_name("support", j + 1); }

std::string number_text(double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.6g", v);
  return buf;
}

constexpr double max_support_width_mm = 3000.0;

SpanKind span_kind_of(const StripModel& m, std::size_t e) {
  if (m.is_cantilever(e)) return SpanKind::cantilever;
  const bool left = m.is_restrained(e), right = m.is_restrained(e + 1);
  if (left && right) return SpanKind::interior_span;
  if (left || right) return SpanKind::end_span;
  return SpanKind::simply_supported;
}

// x where positive, else +0 (never −0, whose reciprocal is −inf).
double positive_part(double x) { return x > 0.0 ? x : 0.0; }

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

}  // namespace

// slab.support_widths_mm against the strip, for every entry path (the JSON
// reader makes the same checks; a Request built in C++ meets them here): one
// width per support, n + 1 for n spans, each finite and from 0 to 3 m, 0 at
// a free end, and each span's two faces (t/2 from the supports'
// centrelines) leaving part of the span clear.
void add_support_width_problems(const std::vector<double>& spans_mm, const std::array<EndSupport, 2>& ends,
                                const std::vector<double>& t, bool geometry_known, InputProblems& problems) {
  const std::string name = "slab.support_widths_mm";
  if (t.empty()) return;
  const StripModel m{spans_mm, ends[0], ends[1]};
  const std::size_t n = m.span_count();
  if (!geometry_known) {  // the values alone
    for (std::size_t j = 0; j < t.size(); ++j)
      if (!(std::isfinite(t[j]) && t[j] >= 0.0 && t[j] <= max_support_width_mm))
        problems.add(name + "[" + std::to_string(j) + "]",
                     "must be between 0 and " + number_text(max_support_width_mm) + " mm, got " +
                         (std::isfinite(t[j]) ? number_text(t[j]) : std::string("a value that is not finite")));
    return;
  }
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
    if (ends[k] == EndSupport::free && t[j] != 0.0)
      problems.add(name + "[" + std::to_string(j) + "]",
                   "must be 0: slab.ends[" + std::to_string(k) + "] is free, so there is no support there, got " +
                       number_text(t[j]));
  }
  for (std::size_t e = 0; e < n; ++e) {
    const double faces = t[e] / 2.0 + t[e + 1] / 2.0;
    if (faces >= m.spans_mm[e])
      problems.add(name + "[" + std::to_string(t[e] >= t[e + 1] ? e : e + 1) + "]",
                   "the support faces of span " + std::to_string(e + 1) + " (half of " + number_text(t[e]) +
                       " mm and half of " + number_text(t[e + 1]) + " mm from the supports' centrelines) "
                       "must leave part of its " + number_text(m.spans_mm[e]) + " mm clear");
  }
}


OneWayStrip::OneWayStrip(const SlabInput& slab, double redistribution_percent)
    : model_{slab.spans_mm, slab.ends[0], slab.ends[1]},
      width_mm_(slab.strip_width_mm),
      support_widths_mm_(slab.support_widths_mm),
      redistribution_percent_(redistribution_percent),
      delta_(1.0 - redistribution_percent / 100.0) {}

// Geometry the strip cannot analyse, redistribution where there is no
// support to take it from, and support widths that do not fit the strip.
void OneWayStrip::add_scope_problems(InputProblems& problems) const {
  add_support_width_problems(model_.spans_mm, {model_.left, model_.right}, support_widths_mm_, true, problems);
  if (const auto why = stability_problem(model_); !why.empty())
    problems.add("slab.ends", why + " (the strip would be a mechanism)");
  if (redistribution_percent_ > 0.0) {
    const auto nodes = redistributable_nodes(model_);
    if (std::none_of(nodes.begin(), nodes.end(), [](bool b) { return b; }))
      problems.add("design.redistribution_percent",
                   "this strip has no interior support whose moment can be redistributed "
                   "(cantilever roots are statically determinate); the largest allowed value is 0");
  }
}

std::vector<std::string> OneWayStrip::span_names() const {
  std::vector<std::string> out;
  out.reserve(model_.span_count());
  for (std::size_t e = 0; e < model_.span_count(); ++e) out.push_back(span_name(e));
  return out;
}

// Every node but a free end, in order.
std::vector<std::string> OneWayStrip::support_names() const {
  std::vector<std::string> out;
  out.reserve(model_.node_count());
  for (std::size_t j = 0; j < model_.node_count(); ++j)
    if (model_.has_support(j)) out.push_back(support_name(j));
  return out;
}

// The regions of a strip, in order along it (as design_regions): a top
// region at each support but a pinned end, which has one when the code asks
// for partial-fixity steel (`pinned_end_steel`; unknown: listed as
// uncertain), and a bottom region in each span that is not a cantilever.
std::vector<RegionName> OneWayStrip::region_names(std::optional<bool> pinned_end_steel) const {
  const StripModel& m = model_;
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

std::size_t OneWayStrip::analyse(const MemberLoads& loads) {
  const StripModel& model = model_;
  const double b = width_mm_;
  const std::size_t n = model.span_count();
  redistributed_ = redistributable_nodes(model);
  all_uniform_ = std::all_of(loads.actions.begin(), loads.actions.end(), whole_strip_uniform);
  std::size_t count = 0;
  if (all_uniform_) {
    const auto uls_cases =
        uniform_load_cases(loads.actions, loads.combinations, LimitState::uls, loads.arrangements, b);
    count = uls_cases.size();
    cases_ = analyse_cases(model, uls_cases);
  } else {
    const auto uls_cases =
        load_cases(loads.actions, loads.combinations, LimitState::uls, loads.arrangements, model.spans_mm, b);
    count = uls_cases.size();
    cases_ = analyse_load_cases(model, uls_cases);
  }
  if (delta_ < 1.0)
    for (auto& c : cases_) c = redistribute(model, c, redistributed_, delta_);
  env_ = envelope_of(model, cases_);
  // The ratio of the quasi-permanent moment to the ULS moment at a region.
  // With every action uniform over the whole strip the moments are in the
  // ratio of the loads, taken from the loads (as version 1, exactly).
  // Otherwise both come from analyses with every span loaded: the
  // quasi-permanent combination(s) and the ULS combination giving the
  // largest moment of the region's sense there; bounded to [0, 1], and the
  // load ratio where that ULS moment is nil or of the other sense.
  load_ratio_ = loads.totals.sls_quasi_permanent / loads.totals.uls;
  qp_all_.clear();
  uls_all_.clear();
  if (!all_uniform_) {
    const std::vector<std::vector<bool>> all_loaded{all_spans_loaded(n)};
    qp_all_ = analyse_load_cases(model, load_cases(loads.actions, loads.combinations, LimitState::quasi_permanent,
                                                   all_loaded, model.spans_mm, b));
    uls_all_ = analyse_load_cases(
        model, load_cases(loads.actions, loads.combinations, LimitState::uls, all_loaded, model.spans_mm, b));
  }
  long_term_.clear();
  long_term_cantilevers_.clear();
  service_cantilevers_.clear();
  service_.clear();
  if (loads.long_term_moments) {
    long_term_ = analyse_load_cases(model, load_cases(loads.actions, loads.combinations, LimitState::quasi_permanent,
                                                      {all_spans_loaded(n)}, model.spans_mm, b));
    std::vector<bool> cantilevers_only(n, false);
    bool any = false;
    for (std::size_t e = 0; e < n; ++e) any = (cantilevers_only[e] = model.is_cantilever(e)) || any;
    if (any) {
      long_term_cantilevers_ = analyse_load_cases(
          model, load_cases(loads.actions, loads.combinations, LimitState::quasi_permanent, {cantilevers_only},
                            model.spans_mm, b));
      service_cantilevers_ = analyse_load_cases(
          model, load_cases(loads.actions, loads.combinations, LimitState::characteristic, {cantilevers_only},
                            model.spans_mm, b));
    }
    service_ = analyse_load_cases(model, load_cases(loads.actions, loads.combinations, LimitState::characteristic,
                                                    {all_spans_loaded(n)}, model.spans_mm, b));
  }
  double longest = 0.0;
  for (double L : model.spans_mm) longest = std::max(longest, L);
  nil_moment_ = 1e-9 * loads.totals.uls * b * longest * longest;
  return count;
}

std::vector<std::vector<DiagramPoint>> OneWayStrip::diagrams() const { return envelope_diagrams(model_, cases_); }

double OneWayStrip::qp_ratio(Face face, std::size_t index, double x) const {
  if (all_uniform_ || qp_all_.empty()) return load_ratio_;
  const std::size_t n = model_.span_count();
  auto moment_in = [&](const CaseResult& c) {
    const double M = face == Face::bottom ? c.spans[index].moment_at(x)
                     : index < n          ? c.spans[index].M_left
                                          : c.spans[n - 1].M_right();
    return face == Face::bottom ? M : -M;
  };
  double M_uls = -std::numeric_limits<double>::infinity(), M_qp = -std::numeric_limits<double>::infinity();
  for (const auto& c : uls_all_) M_uls = std::max(M_uls, moment_in(c));
  for (const auto& c : qp_all_) M_qp = std::max(M_qp, moment_in(c));
  if (!(M_uls > nil_moment_)) return load_ratio_;
  return std::clamp(M_qp / M_uls, 0.0, 1.0);
}

// The regions of contract.md in order along the strip: a top region at each
// support that carries hogging (and at pinned ends when the code asks for
// partial-fixity steel), a bottom region in each span that is not a cantilever.
std::vector<RegionDemand> OneWayStrip::design_regions(const RegionRules& rules,
                                                      std::vector<std::string>& warnings) const {
  const StripModel& m = model_;
  const Envelope& env = env_;
  const double fixity_fraction = rules.pinned_end_fixity_fraction;
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
          g.quasi_permanent_to_uls = qp_ratio(Face::bottom, e, env.span_x_max_sagging[e]);
          g.M_Ed = fixity_fraction * positive_part(env.span_max_sagging[e]);
          out.push_back(std::move(g));
        }
      } else {
        g.quasi_permanent_to_uls = qp_ratio(Face::top, j, 0.0);
        g.M_Ed = env.node_max_hogging[j];
        g.supports = {{support_name(j), env.node_max_shear[j]}};
        g.redistribution_delta = redistributed_[j] ? delta_ : 1.0;
        for (std::size_t e : {j - 1, j}) {
          if (e < n && m.is_cantilever(e)) {  // j − 1 wraps past n at j = 0
            g.span_where = span_name(e);
            g.span_mm = m.spans_mm[e];
            g.span_kind = SpanKind::cantilever;
            // The long-term case with the most hogging at the root: the
            // cantilever's forces and its back span's.
            const std::size_t back = e == j ? j - 1 : j;  // the span on the other side of support j
            if (back < n && !m.is_cantilever(back)) {
              for (std::size_t k = 0; k < long_term_.size(); ++k) {
                const auto& c = long_term_[k];
                if (!g.long_term_span || c.spans[e].min_moment() < g.long_term_span->min_moment()) {
                  g.long_term_span = c.spans[e];
                  g.back_span = c.spans[back];
                  if (k < long_term_cantilevers_.size()) g.back_span_unloaded = long_term_cantilevers_[k].spans[back];
                }
              }
              for (std::size_t k = 0; k < service_.size(); ++k) {
                const auto& c = service_[k];
                if (!g.service_span || c.spans[e].min_moment() < g.service_span->min_moment()) {
                  g.service_span = c.spans[e];
                  g.back_service_span = c.spans[back];
                  if (k < service_cantilevers_.size()) g.back_service_span_unloaded = service_cantilevers_[k].spans[back];
                }
              }
              g.cantilever_root_at_start = e == j;  // the cantilever starts at support j
            } else if (n == 1) {
              // A cantilever of one span: its root is built in (fixed end),
              // no back span turns it.
              for (const auto& c : long_term_)
                if (!g.long_term_span || c.spans[e].min_moment() < g.long_term_span->min_moment())
                  g.long_term_span = c.spans[e];
              for (const auto& c : service_)
                if (!g.service_span || c.spans[e].min_moment() < g.service_span->min_moment())
                  g.service_span = c.spans[e];
              g.cantilever_root_at_start = e == j;
            }
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
      g.quasi_permanent_to_uls = qp_ratio(Face::bottom, j, env.span_x_max_sagging[j]);
      // The long-term case with the largest sagging moment in this span.
      for (const auto& c : long_term_)
        if (!g.long_term_span || c.spans[j].max_moment() > g.long_term_span->max_moment())
          g.long_term_span = c.spans[j];
      for (const auto& c : service_)
        if (!g.service_span || c.spans[j].max_moment() > g.service_span->max_moment()) g.service_span = c.spans[j];
      // Pinned end supports rely on the bottom bars of their span.
      for (std::size_t k : {j, j + 1})
        if ((k == 0 || k == n) && m.has_support(k) && !m.is_restrained(k))
          g.supports.push_back({support_name(k), env.node_max_shear[k]});
      out.push_back(std::move(g));
    }
  }
  if (!support_widths_mm_.empty()) apply_support_widths(rules, out, warnings);
  return out;
}

// Support regions of a strip given support widths: the code's design
// moment from the moments of every load case at the support's faces
// (supports of width 0 keep the centreline moment, as without widths).
void OneWayStrip::apply_support_widths(const RegionRules& rules, std::vector<RegionDemand>& demands,
                                       std::vector<std::string>& warnings) const {
  const StripModel& m = model_;
  const std::size_t n = m.span_count();
  for (std::size_t j = 0; j <= n; ++j) {
    const double t = support_widths_mm_[j];
    const bool end = j == 0 || j == n;
    if (t <= 0.0 || !m.has_support(j)) continue;
    if (end && !m.is_restrained(j)) {  // a pinned end carries no hogging moment to reduce
      warnings.push_back(support_name(j) + ": the support width of " + number_text(t) +
                         " mm is not used for the design moment (pinned end: no hogging moment to reduce)");
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
      f.cases = support_moment_cases(m, cases_, j, t);
      g.M_Ed = positive_part(rules.support_design_moment(g));
    }
  }
}

// Static equilibrium of each cantilever's back span (EQU combinations),
// at the back span's far support (a fixed far end is built in and is not
// checked). The reaction there is a sum over the spans (superposition),
// and the influence of a load on it keeps one sign within a span: spans
// whose loads lower it are destabilising and take the permanent actions at
// the unfavourable factor (`loaded`) with the variable actions; the others
// are stabilising and take the permanent actions at the favourable factor
// (`unloaded`) alone. R_stabilising sums the second, R_destabilising what
// the first take away; the combination with the largest ratio of the two
// is the demand.
std::vector<EquilibriumDemand> OneWayStrip::equilibrium_demands(const MemberLoads& loads) const {
  const StripModel& m = model_;
  const double b = width_mm_;
  std::vector<EquilibriumDemand> out;
  const std::size_t n = m.span_count();
  if (n < 2) return out;
  for (std::size_t c = 0; c < n; ++c) {
    if (!m.is_cantilever(c)) continue;
    const std::size_t far = c == 0 ? 2 : n - 2;  // the back span's other end
    if (far > n || !m.has_support(far) || ((far == 0 || far == n) && m.is_restrained(far))) continue;
    // Per combination, each span's loads alone: unfavourable, favourable.
    std::vector<std::vector<SpanLoading>> cases;
    std::vector<const Combination*> used;
    for (const auto& k : loads.combinations) {
      if (k.limit_state != LimitState::equilibrium) continue;
      const auto unfavourable = loading_of(loads.actions, k, std::vector<bool>(n, true), m.spans_mm, b);
      const auto favourable = loading_of(loads.actions, k, std::vector<bool>(n, false), m.spans_mm, b);
      for (std::size_t e = 0; e < n; ++e) {
        std::vector<SpanLoading> one(n);
        one[e] = unfavourable[e];
        cases.push_back(one);
        one[e] = favourable[e];
        cases.push_back(std::move(one));
      }
      used.push_back(&k);
    }
    if (used.empty()) continue;
    const auto results = analyse_load_cases(m, cases);
    EquilibriumDemand worst;
    double worst_ratio = -std::numeric_limits<double>::infinity();
    for (std::size_t k = 0; k < used.size(); ++k) {
      double R_stb = 0.0, R_dst = 0.0;
      for (std::size_t e = 0; e < n; ++e) {
        const double R_unfavourable = results[2 * (k * n + e)].reactions[far];
        const double R_favourable = results[2 * (k * n + e) + 1].reactions[far];
        if (R_unfavourable < 0.0 || R_favourable < 0.0) R_dst -= std::min(R_unfavourable, R_favourable);
        else R_stb += R_favourable;
      }
      const double ratio = R_stb > 0.0 ? R_dst / R_stb : std::numeric_limits<double>::infinity();
      if (ratio > worst_ratio) {
        worst_ratio = ratio;
        worst = {support_name(far), used[k]->label, R_stb, R_dst};
      }
    }
    out.push_back(std::move(worst));
  }
  return out;
}

// Each cantilever under every EQU combination, loaded (unfavourable) while
// every other span carries its permanent actions at the favourable factor
// alone: the hogging then reaches farthest into the back span.
std::vector<std::vector<DiagramPoint>> OneWayStrip::detailing_diagrams(const MemberLoads& loads) const {
  const StripModel& m = model_;
  const std::size_t n = m.span_count();
  std::vector<CaseResult> cases = cases_;
  std::vector<std::vector<SpanLoading>> held;
  for (std::size_t c = 0; c < n; ++c) {
    if (!m.is_cantilever(c) || n < 2) continue;
    std::vector<bool> loaded(n, false);
    loaded[c] = true;
    for (const auto& k : loads.combinations)
      if (k.limit_state == LimitState::equilibrium)
        held.push_back(loading_of(loads.actions, k, loaded, m.spans_mm, width_mm_));
  }
  if (!held.empty())
    for (auto& r : analyse_load_cases(m, held)) cases.push_back(std::move(r));
  return envelope_diagrams(m, cases, 96);
}

}  // namespace armature
