// Calculated deflection of a two-way or flat slab: per state of the code,
// the plate under that state's load on every bay, each element's rigidity
// in x and y the code's secant rigidity of the bars there under the
// element's own moment, solved again until the deflection settles.
#include "plate_deflection.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <tuple>

#include "armature/format.hpp"
#include "call_code.hpp"

namespace armature {

namespace {

constexpr std::size_t none = static_cast<std::size_t>(-1);
// The iteration stops when, in every panel, no node's deflection changed
// in the last round by more than settled_change of the panel's largest,
// and no element's rigidity falls by more than settled_rigidity with the
// moments found: the rigidities only fall, so a small step alone could
// still be a slow creep (DEVELOPERS.md).
constexpr double settled_change = 0.001;
constexpr double settled_rigidity = 0.005;
constexpr std::size_t max_rounds = 200;

// The index of the first value above v in sorted lines, less one, within
// [0, lines.size() − 2]: the bay (span) v lies in.
std::size_t bay_along(const std::vector<double>& lines, double v) {
  const auto it = std::upper_bound(lines.begin(), lines.end(), v);
  const std::size_t k = it == lines.begin() ? 0 : static_cast<std::size_t>(it - lines.begin()) - 1;
  return std::min(k, lines.size() - 2);
}

Section section_of(const RegionRecord& r, double h_mm, double b_mm) {
  Section s;
  s.b_mm = b_mm;
  s.h_mm = h_mm;
  SectionLayer layer;
  layer.face = r.face;
  layer.direction = r.direction;
  layer.bar = BarOption{r.bars.bar, r.bars.diameter_mm, r.bars.As_prov_mm2 * r.bars.spacing_mm / b_mm};
  layer.spacing_mm = r.bars.spacing_mm;
  layer.cover_mm = r.cover_mm;
  layer.d_mm = r.d_mm;
  s.layers.push_back(layer);
  return s;
}

}  // namespace

std::vector<std::array<ElementBars, 2>> element_bars_of(const PlateModel& model, const PlateRecord& plate,
                                                        const std::vector<RegionDemand>& demands, double dx_mm,
                                                        double dy_mm) {
  std::map<std::tuple<std::string, Face, BarDirection>, std::size_t> index;
  for (std::size_t i = 0; i < demands.size(); ++i)
    index.emplace(std::make_tuple(demands[i].where, demands[i].face, demands[i].direction), i);
  auto find = [&](const std::string& where, Face face, BarDirection d) {
    const auto it = index.find({where, face, d});
    return it == index.end() ? none : it->second;
  };
  const auto& X = plate.x_lines_mm;
  const auto& Y = plate.y_lines_mm;
  const double tol = 1e-6 * (X.back() - X.front() + Y.back() - Y.front());
  const auto& nx = model.node_x_mm();
  const auto& ny = model.node_y_mm();
  std::vector<std::array<ElementBars, 2>> out(model.elements_x() * model.elements_y());
  for (std::size_t ey = 0; ey < model.elements_y(); ++ey)
    for (std::size_t ex = 0; ex < model.elements_x(); ++ex) {
      // The element's centre in the request's plan, onto the grid (a flat
      // slab's edge strip beyond the first column line takes the first span).
      const double x = std::clamp(0.5 * (nx[ex] + nx[ex + 1]) - dx_mm, X.front(), X.back());
      const double y = std::clamp(0.5 * (ny[ey] + ny[ey + 1]) - dy_mm, Y.front(), Y.back());
      const std::size_t i = bay_along(X, x), j = bay_along(Y, y);
      auto& e = out[ex + model.elements_x() * ey];
      for (const BarDirection d : {BarDirection::x, BarDirection::y}) {
        const bool in_x = d == BarDirection::x;
        ElementBars& bars = e[in_x ? 0 : 1];
        // The line nearer along the bars.
        const std::size_t k = in_x ? i : j;
        const auto& L = in_x ? X : Y;
        const double along = in_x ? x : y, across = in_x ? y : x;
        const std::size_t l = along - L[k] <= L[k + 1] - along ? k : k + 1;
        if (!plate.flat) {
          bars.bottom = find(plate_bay_name(i, j), Face::bottom, d);
          const bool outer = l == 0 || l + 1 == L.size();
          const EndSupport edge = in_x ? plate.edges[l == 0 ? 0 : 1] : plate.edges[l == 0 ? 2 : 3];
          for (const auto& line : plate.reactions)
            if ((line.runs_along == PlanAxis::y) == in_x && std::abs(line.position_mm - L[l]) <= tol &&
                across >= line.from_mm - tol && across <= line.to_mm + tol) {
              bars.top = find(line.name, Face::top, d);
              bars.top_at_pinned_edge = outer && edge == EndSupport::pinned;
            }
          continue;
        }
        for (const auto& strip : plate.strips) {
          if (strip.direction != d || strip.pieces.size() <= k) continue;
          const auto& p = strip.pieces[k];
          const double lo = in_x ? p[2] : p[0], hi = in_x ? p[3] : p[1];
          if (across < lo - tol || across > hi + tol) continue;
          bars.bottom = find(strip.name + " span " + std::to_string(k + 1), Face::bottom, d);
          bars.top = find(strip.name + " at " + (in_x ? "x" : "y") + std::to_string(l), Face::top, d);
          break;
        }
      }
    }
  return out;
}

PlateDeflectionOutcome plate_deflection_checks(const MemberRules& rules, const CodeIdentity& code,
                                               const PlateDeflectionInput& in, Detail detail) {
  const auto states = call_code(code, "plate deflection states", [&] { return rules.plate_deflection_states(); });
  if (states.empty()) {
    InputProblems problems;
    problems.add("serviceability.deflection", code.id + " (" + code.variant +
                                                  ") calculates no deflection of two-way or flat slabs; give "
                                                  "\"span_depth\" or leave the field out");
    problems.raise_if_any();
  }
  const PlateModel& model = *in.model;
  const auto& demands = *in.demands;
  const auto& records = *in.records;
  const double b = in.strip_width_mm;
  std::vector<Section> sections;
  sections.reserve(records.size());
  for (const auto& r : records) sections.push_back(section_of(r, in.thickness_mm, b));
  const std::size_t n_el = model.elements_x() * model.elements_y();
  for (std::size_t e = 0; e < n_el; ++e)
    for (const auto& bars : in.element_bars[e])
      if (bars.bottom == none)
        throw DesignError("calculated deflection: an element of the plate lies under no region's bottom bars");

  // The panels: every bay. Its span region (span_where) gives the span
  // the limits read and the bars the record shows; a bay without one (a
  // two-way bay spanning to a free edge in its shorter direction) is read
  // on its shorter side, with its bottom bars across that side.
  struct Panel {
    std::string name;
    std::size_t region = 0;
    double span_mm = 0.0;
    SpanKind kind = SpanKind::simply_supported;
    std::vector<std::size_t> nodes, elements;
  };
  std::vector<Panel> panels;
  const auto& node_x = model.node_x_mm();
  const auto& node_y = model.node_y_mm();
  for (const PlateBayRecord& bay : *in.bays) {
    Panel p;
    p.name = bay.name;
    const auto span_region = std::find_if(demands.begin(), demands.end(), [&](const RegionDemand& g) {
      return g.span_where == bay.name && g.span_mm > 0.0;
    });
    if (span_region != demands.end()) {
      p.region = static_cast<std::size_t>(span_region - demands.begin());
      p.span_mm = span_region->span_mm;
      p.kind = span_region->span_kind;
    } else {
      const double lx = bay.x1_mm - bay.x0_mm, ly = bay.y1_mm - bay.y0_mm;
      const BarDirection across = lx <= ly ? BarDirection::x : BarDirection::y;
      const auto bottom = std::find_if(demands.begin(), demands.end(), [&](const RegionDemand& g) {
        return g.where == bay.name && g.face == Face::bottom && g.direction == across;
      });
      if (bottom == demands.end())
        throw DesignError("calculated deflection: " + bay.name + " has neither a span region nor bottom bars");
      p.region = static_cast<std::size_t>(bottom - demands.begin());
      p.span_mm = std::min(lx, ly);
    }
    const double tol = 1e-6 * (bay.x1_mm - bay.x0_mm + bay.y1_mm - bay.y0_mm);
    auto inside = [&](double x, double y) {
      return x >= bay.x0_mm - tol && x <= bay.x1_mm + tol && y >= bay.y0_mm - tol && y <= bay.y1_mm + tol;
    };
    for (std::size_t iy = 0; iy < node_y.size(); ++iy)
      for (std::size_t ix = 0; ix < node_x.size(); ++ix)
        if (inside(node_x[ix] - in.dx_mm, node_y[iy] - in.dy_mm)) p.nodes.push_back(ix + node_x.size() * iy);
    for (std::size_t ey = 0; ey < model.elements_y(); ++ey)
      for (std::size_t ex = 0; ex < model.elements_x(); ++ex)
        if (inside(0.5 * (node_x[ex] + node_x[ex + 1]) - in.dx_mm, 0.5 * (node_y[ey] + node_y[ey + 1]) - in.dy_mm))
          p.elements.push_back(ex + model.elements_x() * ey);
    panels.push_back(std::move(p));
  }
  if (panels.empty()) return {};
  PlateDeflectionOutcome result;
  result.long_term_mm.assign(node_x.size() * node_y.size(), 0.0);

  std::vector<PlateDeflectionDemand> out(panels.size());
  for (std::size_t k = 0; k < panels.size(); ++k) {
    PlateDeflectionDemand& d = out[k];
    d.where = panels[k].name;
    d.span_mm = panels[k].span_mm;
    d.span_kind = panels[k].kind;
    d.section = sections[panels[k].region];
    for (std::size_t n : panels[k].nodes) {
      d.x_mm.push_back(node_x[n % node_x.size()] - in.dx_mm);
      d.y_mm.push_back(node_y[n / node_x.size()] - in.dy_mm);
    }
    d.model = "orthotropic Kirchhoff plate (ν = 0; twist rigidity √(Dx Dy)/2), " + std::to_string(model.elements_x()) +
              " × " + std::to_string(model.elements_y()) +
              " elements, each with the code's secant rigidity of its bars in x and in y under the largest moment "
              "it has had (Wood–Armer's mx ± |mxy|; bottom bars sagging, the top bars over the nearer support or "
              "column line hogging, with their shrinkage curvature where the code has one), every "
              "bay loaded, solved again until no panel's deflection changes by more than 0.1 % and no rigidity "
              "falls by more than 0.5 %";
  }

  for (std::size_t s = 0; s < states.size(); ++s) {
    const PlateDeflectionState& state = states[s];
    if (!(state.modulus_MPa > 0.0 && std::isfinite(state.modulus_MPa)))
      throw DesignError(code.id + ": plate deflection state '" + state.name + "' has no modulus");
    // Every bay under the state's combination (the heaviest of several).
    std::optional<PlateLoadCase> load;
    double heaviest = -1.0;
    BayArrangement all;
    all.loaded.assign(model.bay_count(), true);
    for (const Combination& c : *in.combinations) {
      if (c.limit_state != state.load) continue;
      PlateLoadCase lc = plate_load_case(model, *in.actions, c, all, in.dx_mm, in.dy_mm);
      const double total = model.load_resultant(lc).force_N;
      if (total > heaviest) {
        heaviest = total;
        load = std::move(lc);
      }
    }
    if (!load)
      throw DesignError(code.id + ": plate deflection state '" + state.name + "' needs a " + to_string(state.load) +
                        " combination, and the code gave none");
    const double column_factor = state.modulus_MPa / model.geometry().elastic_modulus_MPa;

    // Each element and direction: its bars for the moment's sense, the
    // code's response, the rigidity per unit width.
    auto respond = [&](std::size_t region, double M_per_mm, bool& cracked) {
      const PlateSectionResponse r = call_code(
          code, "plate section response", [&] { return rules.plate_section_response(sections[region], M_per_mm * b, s); },
          records[region].where);
      if (!(r.rigidity_Nmm2 > 0.0 && std::isfinite(r.rigidity_Nmm2) && std::isfinite(r.free_curvature)))
        throw DesignError(code.id + ": the plate section response at " + records[region].where +
                          " is not a positive rigidity");
      cracked = cracked || r.cracked;
      const double sense = records[region].face == Face::bottom ? 1.0 : -1.0;
      return std::pair<double, double>{r.rigidity_Nmm2 / b, sense * r.free_curvature};
    };
    std::vector<ElementRigidity> rig(n_el);
    std::vector<unsigned char> cracked(n_el, 0);
    // The largest sagging and hogging moment each element has had in each
    // direction during the iteration: a crack once open stays open, so the
    // rigidities only fall and the iteration settles (DEVELOPERS.md).
    std::vector<std::array<double, 4>> seen(n_el, {0.0, 0.0, 0.0, 0.0});  // sag x, hog x, sag y, hog y
    auto update = [&](const std::vector<PlateMoments>* moments) {
      for (std::size_t e = 0; e < n_el; ++e) {
        bool c = false;
        ElementRigidity& r = rig[e];
        for (std::size_t dir = 0; dir < 2; ++dir) {
          const ElementBars& bars = in.element_bars[e][dir];
          double& sag = seen[e][2 * dir];
          double& hog = seen[e][2 * dir + 1];
          if (moments) {
            const PlateMoments& m = (*moments)[e];
            const double normal = dir == 0 ? m.mx : m.my;
            sag = std::max(sag, normal + std::abs(m.mxy));
            hog = std::max(hog, -normal + std::abs(m.mxy));
          }
          // The face the moments crack more (the lower rigidity) gives the
          // rigidity and the shrinkage curvature, in that face's sense: the
          // top bars' hogging curvature over a support of a continuous or
          // flat slab turns the slab down from it; at a pinned outer edge
          // it would lift the span, so the bottom bars' sagging curvature
          // stays (DEVELOPERS.md).
          bool c_sag = false;
          auto chosen = respond(bars.bottom, sag, c_sag);
          if (hog > 0.0) {
            bool c_hog = false;
            const auto hogging = respond(bars.top != none ? bars.top : bars.bottom, hog, c_hog);
            if (hogging.first < chosen.first) {
              chosen.first = hogging.first;
              if (bars.top_at_pinned_edge) {
                bool unused = false;
                chosen.second = respond(bars.bottom, hog, unused).second;
              } else {
                chosen.second = hogging.second;
              }
              c_sag = c_hog;
            }
          }
          c = c || c_sag;
          (dir == 0 ? r.Dx_Nmm : r.Dy_Nmm) = chosen.first;
          (dir == 0 ? r.free_curvature_x : r.free_curvature_y) = chosen.second;
        }
        cracked[e] = c ? 1 : 0;
      }
    };
    update(nullptr);
    OrthotropicSolution solution;
    std::vector<double> last;
    std::vector<double> panel_change(panels.size(), 1.0);
    std::size_t rounds = 0;
    bool settled = false;
    OrthotropicSolver solver(model);
    while (rounds < max_rounds) {
      solution = solver.solve(rig, *load, column_factor);
      ++rounds;
      // Each panel's largest change of a node's deflection since the last
      // round, over the panel's own largest deflection.
      if (!last.empty())
        for (std::size_t k = 0; k < panels.size(); ++k) {
          double largest = 0.0, moved = 0.0;
          for (std::size_t n : panels[k].nodes) {
            largest = std::max(largest, std::abs(solution.w_mm[n]));
            moved = std::max(moved, std::abs(solution.w_mm[n] - last[n]));
          }
          panel_change[k] = largest > 0.0 ? moved / largest : 0.0;
        }
      last = solution.w_mm;
      const std::vector<ElementRigidity> before = rig;
      update(&solution.element_moments);
      // The largest fall of an element's rigidity the new moments bring.
      double fall = 0.0;
      for (std::size_t e = 0; e < n_el; ++e)
        fall = std::max({fall, 1.0 - rig[e].Dx_Nmm / before[e].Dx_Nmm, 1.0 - rig[e].Dy_Nmm / before[e].Dy_Nmm});
      const double change = *std::max_element(panel_change.begin(), panel_change.end());
      if (rounds > 1 && change <= settled_change && fall <= settled_rigidity) {
        settled = true;
        break;
      }
    }
    if (!settled)
      result.warnings.push_back("calculated deflection, " + state.name + ": the cracked plate had not settled after " +
                                std::to_string(max_rounds) +
                                " solutions (see each panel's rounds and last change); the deflections may be low");
    if (state.record_weight != 0.0)
      for (std::size_t n = 0; n < result.long_term_mm.size(); ++n)
        result.long_term_mm[n] += state.record_weight * solution.w_mm[n];
    for (std::size_t k = 0; k < panels.size(); ++k) {
      PlateDeflectionDemand& d = out[k];
      std::vector<double> w;
      for (std::size_t n : panels[k].nodes) w.push_back(solution.w_mm[n]);
      d.w_mm.push_back(std::move(w));
      PlateDeflectionDemand::Iteration it;
      it.rounds = rounds;
      it.change = panel_change[k];
      std::size_t count = 0;
      for (std::size_t e : panels[k].elements) {
        count += cracked[e];
        const auto& m = solution.element_moments[e];
        it.M_max_Nmm = std::max({it.M_max_Nmm, m.mx * b, m.my * b});
      }
      it.cracked_share = panels[k].elements.empty() ? 0.0 : static_cast<double>(count) / static_cast<double>(panels[k].elements.size());
      d.iterations.push_back(it);
    }
  }

  for (const auto& d : out) {
    auto checks = call_code(code, "plate deflection checks", [&] { return rules.plate_deflection_checks(d, detail); },
                            d.where);
    for (auto& c : checks) c.method = "calculated";
    result.spans.push_back({d.where, std::move(checks)});
  }
  return result;
}

}  // namespace armature
