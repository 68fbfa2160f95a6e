// The design of a two-way or flat slab: the code's combinations and bay
// load arrangements, the plate member (members/two_way.cpp, flat.cpp), the
// bar search of each region with its own effective depth (the inner
// layer's from the outer layer's bars), the code's checks of the chosen
// arrangements, and a flat slab's punching at every column.
#include "two_way_design.hpp"

#include <algorithm>
#include <cmath>
#include <type_traits>

#include "armature/flat.hpp"
#include "armature/two_way.hpp"
#include "call_code.hpp"
#include "detailing.hpp"
#include "loads.hpp"
#include "plate_deflection.hpp"
#include "search.hpp"

namespace armature {

namespace {

// The U-bars along each free outer edge, bay by bay (FreeEdgeRule): the
// bay's bottom bars across the edge bent into a U whose top leg runs
// leg × h into the slab, and the bay's bottom bars along the edge in each
// face inside the U (EN 1992-1-1 9.3.1.4(2): the slab's own bars serve).
std::vector<PlateFreeEdgeRecord> free_edge_bars(const PlateRecord& p, const std::vector<RegionRecord>& regions,
                                                const Request& req, const FreeEdgeRule& rule) {
  std::vector<PlateFreeEdgeRecord> out;
  const std::size_t nx = p.x_lines_mm.size() - 1, ny = p.y_lines_mm.size() - 1;
  const char* names[4] = {"edge x0", "edge x1", "edge y0", "edge y1"};
  for (std::size_t e = 0; e < 4; ++e) {
    if (p.edges[e] != EndSupport::free) continue;
    const bool along_y = e < 2;  // x0, x1 run along y
    const std::size_t count = along_y ? ny : nx;
    for (std::size_t k = 0; k < count; ++k) {
      const std::size_t i = along_y ? (e == 0 ? 0 : nx - 1) : k;
      const std::size_t j = along_y ? k : (e == 2 ? 0 : ny - 1);
      PlateFreeEdgeRecord f;
      f.edge = names[e];
      f.bay = plate_bay_name(i, j);
      f.from_mm = along_y ? p.y_lines_mm[j] : p.x_lines_mm[i];
      f.to_mm = along_y ? p.y_lines_mm[j + 1] : p.x_lines_mm[i + 1];
      f.leg_mm = rule.u_bar_leg_over_h * req.slab.thickness_mm;
      f.clause = rule.clause;
      for (const auto& g : regions) {
        if (g.where != f.bay || g.face != Face::bottom) continue;
        const bool across = (g.direction == BarDirection::x) == along_y;
        if (across) {
          f.u_bar = g.bars.bar;
          f.u_bar_diameter_mm = g.bars.diameter_mm;
          f.u_bar_spacing_mm = g.bars.spacing_mm;
          f.u_bar_area_mm2 = g.bars.As_prov_mm2;
        } else {
          f.edge_bar = g.bars.bar;
          f.edge_bar_diameter_mm = g.bars.diameter_mm;
        }
      }
      out.push_back(std::move(f));
    }
  }
  return out;
}

// A flat slab's free edges between its edge columns (FreeEdgeRule), strip
// by strip: the U-bars of each design strip ending at the edge (column and
// middle strips alike) are its bottom bars of the end span, over the
// strip's width there; the bars along the edge inside the U are the
// largest bottom bars of the column strip along that edge.
std::vector<PlateFreeEdgeRecord> flat_free_edge_bars(const PlateRecord& p, const std::vector<RegionRecord>& regions,
                                                     const Request& req, const FreeEdgeRule& rule) {
  std::vector<PlateFreeEdgeRecord> out;
  const char* names[4] = {"edge x0", "edge x1", "edge y0", "edge y1"};
  const std::size_t nx = p.x_lines_mm.size() - 1, ny = p.y_lines_mm.size() - 1;
  for (std::size_t e = 0; e < 4; ++e) {
    if (!p.column_edges[e]) continue;
    const bool across_x = e < 2;  // edges x0, x1 run along y: the bars across them run in x
    const BarDirection across = across_x ? BarDirection::x : BarDirection::y;
    const std::size_t end_span = (e == 0 || e == 2) ? 1 : (across_x ? nx : ny);
    const std::string along_strip =
        "column strip " + std::string(across_x ? "x" : "y") +
        std::to_string(e == 0 || e == 2 ? std::size_t{0} : (across_x ? nx : ny)) + " span ";
    const RegionRecord* edge_bar = nullptr;
    for (const auto& g : regions)
      if (g.face == Face::bottom && g.direction != across && g.where.rfind(along_strip, 0) == 0 &&
          (!edge_bar || g.bars.diameter_mm > edge_bar->bars.diameter_mm))
        edge_bar = &g;
    const double lo = across_x ? p.outline_mm[2] : p.outline_mm[0], hi = across_x ? p.outline_mm[3] : p.outline_mm[1];
    for (const auto& strip : p.strips) {
      if (strip.direction != across || strip.pieces.size() < end_span) continue;
      const auto& piece = strip.pieces[end_span - 1];
      const RegionRecord* g = plate_region(regions, strip.name + " span " + std::to_string(end_span), Face::bottom, across);
      if (!g) continue;
      PlateFreeEdgeRecord f;
      f.edge = names[e];
      f.bay = g->where;
      f.from_mm = std::max(lo, across_x ? piece[2] : piece[0]);
      f.to_mm = std::min(hi, across_x ? piece[3] : piece[1]);
      f.leg_mm = rule.u_bar_leg_over_h * req.slab.thickness_mm;
      f.clause = rule.clause;
      f.u_bar = g->bars.bar;
      f.u_bar_diameter_mm = g->bars.diameter_mm;
      f.u_bar_spacing_mm = g->bars.spacing_mm;
      f.u_bar_area_mm2 = g->bars.As_prov_mm2;
      if (edge_bar) {
        f.edge_bar = edge_bar->bars.bar;
        f.edge_bar_diameter_mm = edge_bar->bars.diameter_mm;
      }
      if (f.to_mm > f.from_mm) out.push_back(std::move(f));
    }
  }
  return out;
}

// The column strip's top region over a column, bars in x or y.
std::string column_strip_at(const FlatColumn& col, bool bars_x) {
  return bars_x ? "column strip y" + std::to_string(col.j) + " at x" + std::to_string(col.i)
                : "column strip x" + std::to_string(col.i) + " at y" + std::to_string(col.j);
}

// A column's geometry as the punching rules read it (depths and steel
// still to come).
PunchingDemand column_demand(const FlatColumn& col, const Request& req) {
  PunchingDemand d;
  d.where = col.name;
  d.free = col.free;
  d.cx_mm = req.two_way.columns.x_mm;
  d.cy_mm = req.two_way.columns.y_mm;
  d.h_mm = req.slab.thickness_mm;
  return d;
}

// A band of top bars over the middle of a column strip: its region's
// name and its width across the strip.
struct ColumnBand {
  std::string where;
  BarDirection direction = BarDirection::x;
  double below_mm = 0.0, above_mm = 0.0;  // its reach either side of the column line
  double width() const { return below_mm + above_mm; }
};

// Where the columns take moments (restrained columns), the code's bands of
// top bars for them (PunchingRules::moment_transfer_band): one region
// "column i,j transfer" per column and direction the code names, for
// share × the moment over the band's width per metre, and at least the
// column strip's own moment there (the band's bars replace the strip's).
void add_transfer_regions(const SlabChecker& checker, const CodeIdentity& code, const FlatPlate& plate,
                          const Request& req, std::vector<RegionDemand>& demands, std::vector<ColumnBand>& bands,
                          std::vector<PlateRecord::Transfer>& transfers) {
  if (!plate.columns_restrained()) return;
  const PunchingRules& rules =
      call_code(code, "punching rules", [&]() -> const PunchingRules& { return checker.punching_rules(); });
  for (const FlatColumn& col : plate.columns()) {
    for (const bool bars_x : {true, false}) {
      const PunchingDemand geometry = column_demand(col, req);
      const auto band = call_code(code, "moment transfer band", [&] { return rules.moment_transfer_band(geometry, bars_x); },
                                  col.name);
      if (!band) continue;
      if (!(band->width_mm > 0.0) || !(band->share >= 0.0 && band->share <= 1.0))
        throw DesignError(code.id + ": the moment transfer band at " + col.name + " is out of range");
      const std::string strip = column_strip_at(col, bars_x);
      const BarDirection dir = bars_x ? BarDirection::x : BarDirection::y;
      const auto under = std::find_if(demands.begin(), demands.end(), [&](const RegionDemand& g) {
        return g.where == strip && g.direction == dir && g.face == Face::top;
      });
      if (under == demands.end()) throw DesignError("flat slab: no top region over " + col.name);
      RegionDemand g = *under;
      g.where = col.name + " transfer";
      g.supports.clear();
      g.span_where.clear();
      g.x_mm = col.x_mm;
      g.y_mm = col.y_mm;
      const double M_column = bars_x ? col.M_x_Nmm : col.M_y_Nmm;
      const double M_band = band->share * M_column / band->width_mm * 1000.0;
      g.M_Ed = std::max(M_band, under->M_Ed);
      transfers.push_back({g.where, dir, band->width_mm, band->share, M_column, M_band, under->M_Ed, band->clause});
      demands.push_back(std::move(g));
      bands.push_back({col.name + " transfer", dir, band->width_mm / 2.0, band->width_mm / 2.0});
    }
  }
}

// The punching checks at every column of a flat slab, from its envelope
// and the top bars over it: their depth the band's over the column (the
// moment transfer band, else 9.4.1(2)'s, else the column strip's), the
// steel ratio over the code's width the band's bars within the band and
// the column strip's beyond.
std::vector<ColumnRecord> column_checks(const SlabChecker& checker, const CodeIdentity& code, const FlatPlate& plate,
                                        const std::vector<RegionRecord>& regions, const std::vector<ColumnBand>& bands,
                                        const Request& req, Detail detail) {
  const PunchingRules& rules =
      call_code(code, "punching rules", [&]() -> const PunchingRules& { return checker.punching_rules(); });
  std::vector<ColumnRecord> out;
  auto region = [&](const std::string& where, BarDirection dir) -> const RegionRecord* {
    for (const auto& r : regions)
      if (r.where == where && r.direction == dir && r.face == Face::top) return &r;
    return nullptr;
  };
  for (const FlatColumn& col : plate.columns()) {
    PunchingDemand d = column_demand(col, req);
    // Per direction: the column strip's region and the band over the column.
    const RegionRecord* strip[2]{};
    const RegionRecord* over[2]{};
    const ColumnBand* band[2]{};
    for (const bool bars_x : {true, false}) {
      const BarDirection dir = bars_x ? BarDirection::x : BarDirection::y;
      const std::size_t k = bars_x ? 0 : 1;
      strip[k] = region(column_strip_at(col, bars_x), dir);
      if (!strip[k]) throw DesignError("flat slab: no top region over " + col.name);
      over[k] = strip[k];
      for (const auto& b : bands)
        if (b.direction == dir && (b.where == col.name + " transfer" || b.where == col.name + " band"))
          if (const RegionRecord* r = region(b.where, dir); r && (over[k] == strip[k] || b.where == col.name + " transfer")) {
            over[k] = r;
            band[k] = &b;
          }
    }
    if (!(over[0]->d_mm > 0.0) || !(over[1]->d_mm > 0.0))
      throw InputError({{"slab.thickness_mm", "too thin for the top bars over " + col.name +
                                                  " (no effective depth left for punching)"}});
    d.dx_mm = over[0]->d_mm;
    d.dy_mm = over[1]->d_mm;
    for (const bool bars_x : {true, false}) {
      const std::size_t k = bars_x ? 0 : 1;
      const double W = call_code(code, "punching steel width", [&] { return rules.steel_ratio_width_mm(d, bars_x); });
      // The band's part of the width, taken symmetric about the column
      // line (the width reaches W/2 each side at the internal columns
      // where 9.4.1(2)'s bands, perhaps uneven, lie; an edge or corner
      // column's band and width both start at the free edge: the smaller).
      const double wb = !band[k] ? 0.0 : std::min(band[k]->below_mm, W / 2.0) + std::min(band[k]->above_mm, W / 2.0);
      const double rho_band = over[k]->bars.As_prov_mm2 / (1000.0 * over[k]->d_mm);
      const double rho_strip = strip[k]->bars.As_prov_mm2 / (1000.0 * strip[k]->d_mm);
      (bars_x ? d.rho_x : d.rho_y) = W > 0.0 && wb > 0.0 ? (rho_band * wb + rho_strip * (W - wb)) / W
                                     : over[k] == strip[k] ? rho_strip
                                                           : rho_band;
    }
    d.V_N = col.V_N;
    if (plate.columns_restrained()) {
      d.M_x_Nmm = col.M_x_Nmm;
      d.M_y_Nmm = col.M_y_Nmm;
    }
    d.braced_regular_spans = plate.regular_spans();
    d.shear_reinforcement_allowed = req.two_way.columns.shear_reinforcement;
    ColumnRecord c;
    c.name = col.name;
    c.x_mm = col.x_mm;
    c.y_mm = col.y_mm;
    c.cx_mm = d.cx_mm;
    c.cy_mm = d.cy_mm;
    c.V_Ed_N = col.V_N;
    c.M_x_Nmm = d.M_x_Nmm;
    c.M_y_Nmm = d.M_y_Nmm;
    c.regular_spans = d.braced_regular_spans;
    try {
      c.punching = rules.check_punching(d, detail);
    } catch (const InputError&) {
      throw;
    } catch (const std::invalid_argument& e) {
      const std::string what = e.what();
      if (!plate.columns_restrained() && (what.find("M_x_Nmm") != std::string::npos || what.find("M_y_Nmm") != std::string::npos))
        throw InputError({{"slab.columns.height_m",
                           code.id + " (" + code.variant + ") needs the moment each column takes from the slab for "
                           "punching (" + what + "); give the storey heights so that the analysis restrains the "
                           "columns"}});
      throw DesignError(code.id + " (" + code.variant + "): failed during punching of " + col.name + ": " + what);
    } catch (const std::exception& e) {
      throw DesignError(code.id + " (" + code.variant + "): failed during punching of " + col.name + ": " + e.what());
    }
    out.push_back(std::move(c));
  }
  return out;
}

PlateGeometry checked_geometry(const Request& req) {
  PlateGeometry g;
  g.x_spans_mm = req.two_way.x_spans_mm;
  g.y_spans_mm = req.two_way.y_spans_mm;
  g.edges = {req.two_way.edges[0], req.two_way.edges[1], req.two_way.edges[2], req.two_way.edges[3]};
  g.thickness_mm = req.slab.thickness_mm;
  g.elastic_modulus_MPa = two_way_nominal_modulus_MPa;
  g.poisson_ratio = req.two_way.poisson_ratio;
  if (req.two_way.mesh_per_bay > 0) g.mesh_per_bay = req.two_way.mesh_per_bay;
  return g;
}

}  // namespace

void add_two_way_problems(const Request& req, InputProblems& problems) {
  const bool flat = req.slab_type == SlabType::flat;
  const TwoWayInput& t = req.two_way;
  if (flat) {
    const double cx = t.columns.x_mm, cy = t.columns.y_mm;
    if (!(cx > 0.0 && cy > 0.0)) {
      problems.add("slab.columns.size_mm", "must give the columns' sides, both above 0 mm");
      return;
    }
    const double sx = t.x_spans_mm.empty() ? 0.0 : *std::min_element(t.x_spans_mm.begin(), t.x_spans_mm.end());
    const double sy = t.y_spans_mm.empty() ? 0.0 : *std::min_element(t.y_spans_mm.begin(), t.y_spans_mm.end());
    if (cx >= 0.5 * sx || cy >= 0.5 * sy)
      problems.add("slab.columns.size_mm", "must be less than half the shortest span in its direction (" +
                                               std::to_string(static_cast<long>(sx)) + " mm along x, " +
                                               std::to_string(static_cast<long>(sy)) + " mm along y)");
  }
  if (flat && t.mesh_per_bay > 0 && t.mesh_per_bay < min_flat_mesh_per_bay)
    problems.add("analysis.mesh_per_bay", "must be at least " + std::to_string(min_flat_mesh_per_bay) +
                                              " for a flat slab (the moments at the column faces converge more "
                                              "slowly than a bay's), got " + std::to_string(t.mesh_per_bay));
  const PlateGeometry geometry = flat ? flat_plate_geometry(req, two_way_nominal_modulus_MPa) : checked_geometry(req);
  if (flat && geometry.columns.empty() && !t.x_spans_mm.empty() && !t.y_spans_mm.empty())
    problems.add("slab.edges", "a flat slab needs columns: every grid intersection lies on a wall (make an edge "
                               "\"columns\", or design the slab as two_way)");
  add_plate_problems(geometry, problems);
  double X = 0.0, Y = 0.0;
  for (double s : req.two_way.x_spans_mm) X += s;
  for (double s : req.two_way.y_spans_mm) Y += s;
  // A flat slab's edges on columns lie half a column past the grid lines.
  const double x0 = flat && t.column_edges[0] ? -t.columns.x_mm / 2.0 : 0.0;
  const double y0 = flat && t.column_edges[2] ? -t.columns.y_mm / 2.0 : 0.0;
  if (flat && t.column_edges[1]) X += t.columns.x_mm / 2.0;
  if (flat && t.column_edges[3]) Y += t.columns.y_mm / 2.0;
  for (std::size_t i = 0; i < req.loads.actions.size(); ++i) {
    const Action& a = req.loads.actions[i];
    const std::string path = a.field.empty() ? "loads.actions[" + std::to_string(i) + "]" : a.field;
    if (a.span) problems.add(path + ".span", "belongs to one-way slabs; a two_way slab places loads by plan position");
    if (a.distribution != Distribution::uniform && !a.plan_mm)
      problems.add(path, "a line or point load on a two_way slab needs its plan position");
    if (!a.plan_mm) continue;
    const auto& p = *a.plan_mm;
    const bool finite = std::all_of(p.begin(), p.end(), [](double v) { return std::isfinite(v); });
    if (!finite || p[0] < x0 * (1 + 1e-12) || p[1] < y0 * (1 + 1e-12) || p[2] > X * (1 + 1e-12) ||
        p[3] > Y * (1 + 1e-12) || p[0] > p[2] || p[1] > p[3])
      problems.add(path + (a.distribution == Distribution::point ? ".x_m" : ".from_m"),
                   flat ? "must lie on the slab (from grid lines x0, y0; half a column past them at edges on columns)"
                        : "must lie on the slab (x from 0 to Σ x_spans, y from 0 to Σ y_spans)");
  }
}

namespace {

template <class Member>
DesignRecord design_plate(const SlabChecker& checker, CodeIdentity id, const Request& req, Detail detail,
                          ReportUnits step_units, const std::vector<BarLimit>& limits) {
  constexpr bool flat = std::is_same_v<Member, FlatPlate>;
  if (detail == Detail::verdict) detail = Detail::checks;
  DesignRecord rec;
  rec.code = std::move(id);
  rec.report_units = req.report_units;
  rec.step_units = step_units;
  rec.strip_width_mm = 1000.0;
  const double b = rec.strip_width_mm;
  const LoadBasis basis = call_code(rec.code, "load basis", [&] { return checker.load_basis(); });
  const CombinationRules& combination_rules = call_code(
      rec.code, "combination rules", [&]() -> const CombinationRules& { return checker.combination_rules(); });
  const MemberRules& member_rules =
      call_code(rec.code, "member rules", [&]() -> const MemberRules& { return checker.member_rules(); });
  rec.actions = all_actions(req, basis.density_kN_m3);
  rec.list_actions = req.loads.actions_given;
  const CombinationLabels labels =
      rec.list_actions || detail == Detail::steps || req.serviceability.calculated_deflection()
          ? CombinationLabels::all
          : CombinationLabels::strength;
  rec.combinations =
      call_code(rec.code, "combinations", [&] { return combination_rules.combinations(rec.actions, labels); });
  for (const auto& c : rec.combinations)
    if (c.factors.size() != rec.actions.size())
      throw DesignError(rec.code.id + ": combination '" + c.label + "' does not give a factor for every action");
  if (std::none_of(rec.combinations.begin(), rec.combinations.end(),
                   [](const Combination& c) { return c.limit_state == LimitState::uls; }))
    throw DesignError(rec.code.id + ": the code gave no ULS combination");
  rec.loads = total_loads(basis, rec.actions, rec.combinations);
  if (detail == Detail::steps) rec.defaults_used = call_code(rec.code, "defaults", [&] { return checker.defaults_used(); });

  Member plate = [&] {
    if constexpr (flat) {
      const FlatStripRule rule = call_code(rec.code, "flat strip rule", [&] { return member_rules.flat_strip_rule(); });
      if (rule.clause.empty())
        throw DesignError(rec.code.id + " (" + rec.code.variant + "): the code designs no flat slabs");
      if (!(rule.column_strip_each_side > 0.0 && rule.column_strip_each_side <= 0.5) || !(rule.band_each_side >= 0.0) ||
          !(rule.band_share >= 0.0 && rule.band_share <= 1.0))
        throw DesignError(rec.code.id + ": the flat strip rule's widths are out of range");
      return FlatPlate(req, two_way_nominal_modulus_MPa, rule);
    } else {
      return TwoWayPlate(req, two_way_nominal_modulus_MPa);
    }
  }();
  const std::size_t nx = plate.bays_x(), ny = plate.bays_y();
  const auto arrangements = call_code(rec.code, "bay load arrangements",
                                      [&] {
                                        return flat ? combination_rules.flat_load_arrangements(nx, ny, rec.actions)
                                                    : combination_rules.bay_load_arrangements(nx, ny, rec.actions);
                                      });
  if (arrangements.empty())
    throw DesignError(rec.code.id + " (" + rec.code.variant + "): the code gives no load arrangements for two-way slabs");
  for (const auto& a : arrangements)
    if (a.loaded.size() != nx * ny || !(a.variable_fraction >= 0.0 && a.variable_fraction <= 1.0))
      throw DesignError(rec.code.id + ": a bay load arrangement does not match the bays");
  const double ratio = rec.loads.uls > 0.0 ? rec.loads.sls_quasi_permanent / rec.loads.uls : 0.0;
  rec.load_cases = plate.analyse(rec.actions, rec.combinations, arrangements, ratio);
  rec.load_arrangements = arrangements.size();
  rec.crack_width = req.serviceability.crack_width;
  rec.project = req.project;
  rec.thickness_mm = req.slab.thickness_mm;
  rec.rationalise = req.reinforcement.rationalise;

  const double fraction = call_code(rec.code, "end fixity", [&] { return member_rules.pinned_end_fixity_fraction(); });
  std::vector<RegionDemand> demands;
  std::vector<ColumnBand> column_bands;  // flat slabs: the bands over columns
  std::vector<PlateRecord::Transfer> transfers;
  if constexpr (flat) {
    demands = plate.design_regions(fraction, rec.warnings);
    for (const auto& band : plate.bands()) {
      const auto& q = band.pieces.front();
      const bool along_x = band.direction == BarDirection::x;
      const auto col = std::find_if(plate.columns().begin(), plate.columns().end(),
                                    [&](const FlatColumn& c) { return c.name + " band" == band.name; });
      const double line = col == plate.columns().end() ? 0.0 : along_x ? col->y_mm : col->x_mm;
      column_bands.push_back(
          {band.name, band.direction, line - (along_x ? q[2] : q[0]), (along_x ? q[3] : q[1]) - line});
    }
    add_transfer_regions(checker, rec.code, plate, req, demands, column_bands, transfers);
    if (!plate.columns_restrained() &&
        std::any_of(plate.columns().begin(), plate.columns().end(), [](const FlatColumn& c) {
          return c.free.x0 || c.free.x1 || c.free.y0 || c.free.y1;
        }))
      rec.warnings.push_back("the columns are free to turn (slab.columns.height_m not given): the analysis gives the "
                             "edge and corner columns no moment, so no bars are designed for the moment they take "
                             "from the slab in practice; give the storey heights to design them");
    // What the two-way rules add at walls meeting and free edges, not yet
    // designed for flat slabs: said, not left out silently.
    const auto& e = req.two_way.column_edges;
    const bool walls_meet = (!e[0] || !e[1]) && (!e[2] || !e[3]);
    if (walls_meet && !call_code(rec.code, "corner rule", [&] { return member_rules.corner_rule(); }).clause.empty())
      rec.warnings.push_back("two walls meet at a corner of the slab: the corner bars against torsion of the "
                             "two-way rules are not designed for flat slabs yet; provide them as for a slab on walls");
  } else {
    const CornerRule corners = call_code(rec.code, "corner rule", [&] { return member_rules.corner_rule(); });
    demands = plate.design_regions(fraction, corners, rec.warnings);
  }

  // Bars: search every region; a face's inner direction lies on the
  // largest bar of its outer direction, so search again until the two agree.
  BarPlan plan;
  plan.grid = {req.reinforcement.min_spacing_mm, req.reinforcement.spacing_step_mm};
  plan.given.resize(demands.size());
  // Check mode: reinforcement.given by region, face and direction.
  InputProblems given_problems;
  for (std::size_t k = 0; k < req.reinforcement.given.size(); ++k) {
    const GivenBars& gb = req.reinforcement.given[k];
    const std::string path = "reinforcement.given[" + std::to_string(k) + "]";
    std::size_t found = demands.size();
    for (std::size_t i = 0; i < demands.size(); ++i)
      if (demands[i].where == gb.where && to_string(demands[i].direction) == gb.direction) found = i;
    if (found == demands.size()) {
      const bool named = std::any_of(demands.begin(), demands.end(), [&](const RegionDemand& d) { return d.where == gb.where; });
      if (named) given_problems.add(path + ".direction", "'" + gb.where + "' has no region with bars in " + gb.direction);
      else if (flat)
        given_problems.add(path + ".where", "no region '" + gb.where + "' in this slab; its regions are the strips' "
                                            "spans and column lines ('column strip y1 span 2', 'middle strip "
                                            "y0-y1 at x1', ...) and the bands over internal columns "
                                            "('column 2,2 band', where the code sets them)");
      else
        given_problems.add(path + ".where", "no region '" + gb.where + "' in this slab; its regions are the bays "
                                            "('bay 1,1', ...), the supported line segments ('edge x0 segment 1', "
                                            "'grid x1 segment 2', ...) and, where two pinned edges meet, the "
                                            "corners ('corner x0 y0', ...)");
      continue;
    }
    if (demands[found].face != gb.face) {
      given_problems.add(path + ".face", "'" + gb.where + "' is a " + to_string(demands[found].face) + " region; got " +
                                             to_string(gb.face));
      continue;
    }
    if (plan.given[found]) {
      given_problems.add(path, "'" + gb.where + "' bars in " + gb.direction + " are already given");
      continue;
    }
    const auto bar = call_code(rec.code, "catalogue bar", [&] { return checker.catalogue_bar(gb.bar); });
    if (!bar) {
      given_problems.add(path + ".bar", "no bar '" + gb.bar + "' in the code's catalogue");
      continue;
    }
    plan.given[found] = SearchCandidate{*bar, gb.spacing_mm, provided_area_mm2(bar->area_mm2, gb.spacing_mm, b)};
  }
  given_problems.raise_if_any();
  if (req.reinforcement.rationalise == Rationalise::uniform_bottom) add_uniform_bottom_groups(demands, plan);
  apply_bar_limits(limits, demands, plan);
  const auto& options = call_code(rec.code, "bar options",
                                  [&]() -> const std::vector<BarOption>& { return checker.bar_options(); });
  double smallest = options.empty() ? 0.0 : options.front().diameter_mm;
  for (const auto& o : options) smallest = std::min(smallest, o.diameter_mm);
  auto inner = [&](const RegionDemand& g) { return g.direction != plate.outer_direction(g.face); };
  for (auto& g : demands)
    if (inner(g)) g.outer_bar_mm = smallest;
  std::vector<SearchCandidate> picks;
  std::vector<std::string> search_warnings;
  for (std::size_t round = 0; round <= options.size() + 1; ++round) {
    search_warnings.clear();
    picks = search_with_face_covers(checker, rec.code, demands, b, req.durability, plan, search_warnings);
    bool changed = false;
    for (const Face face : {Face::bottom, Face::top}) {
      double largest = 0.0;
      for (std::size_t i = 0; i < demands.size(); ++i)
        if (demands[i].face == face && !inner(demands[i])) largest = std::max(largest, picks[i].bar.diameter_mm);
      if (largest <= 0.0) continue;
      for (auto& g : demands)
        if (g.face == face && inner(g) && g.outer_bar_mm < largest) {
          g.outer_bar_mm = largest;
          changed = true;
        }
    }
    if (!changed) break;
  }
  rec.warnings.insert(rec.warnings.end(), search_warnings.begin(), search_warnings.end());

  rec.regions.reserve(demands.size());
  std::vector<SpanRecord> spans;
  for (std::size_t i = 0; i < demands.size(); ++i) {
    const RegionDemand& demand = demands[i];
    const SearchCandidate& pick = picks[i];
    RegionOutcome out = call_code(
        rec.code, "the checks", [&] { return checker.check_region(demand, pick.bar, pick.spacing_mm, detail); },
        demand.where);
    rec.regions.push_back(region_record(demand, pick, out, plan.given[i].has_value()));
    if (!demand.span_where.empty()) spans.push_back({demand.span_where, std::move(out.span_checks)});
    for (auto& s : out.supports) rec.supports.push_back({s.where, s.V_Ed, s.V_Rd, std::move(s.checks)});
  }
  for (auto& s : spans) {
    auto extra = call_code(rec.code, "span checks", [&] { return member_rules.span_checks(s.where); });
    for (auto& c : extra) s.checks.push_back(std::move(c));
    rec.spans.push_back(std::move(s));
  }
  for (const auto& r : rec.regions) {
    double& c = rec.face_cover_mm[static_cast<std::size_t>(r.face)];
    c = std::max(c, r.cover_mm);
  }
  PlateRecord plate_record = plate.record();
  if constexpr (flat) {
    rec.columns = column_checks(checker, rec.code, plate, rec.regions, column_bands, req, detail);
    // The transfer bands among the plate's bands (quantities, JSON), with
    // their derivation.
    for (const auto& t : transfers) {
      const auto col = std::find_if(rec.columns.begin(), rec.columns.end(),
                                    [&](const ColumnRecord& c) { return c.name + " transfer" == t.where; });
      if (col == rec.columns.end()) continue;
      const auto& o = plate_record.outline_mm;
      const auto member_col = std::find_if(plate.columns().begin(), plate.columns().end(),
                                           [&](const FlatColumn& c) { return c.name == col->name; });
      const bool along_x = t.direction == BarDirection::x;
      // Across the bars: centred on the column, or from the free edge at a
      // corner (the band and the slab both start there).
      const bool free_lo = along_x ? member_col->free.y0 : member_col->free.x0;
      const bool free_hi = along_x ? member_col->free.y1 : member_col->free.x1;
      const double at = along_x ? col->y_mm : col->x_mm, lo_edge = along_x ? o[2] : o[0], hi_edge = along_x ? o[3] : o[1];
      const double lo = free_lo ? lo_edge : free_hi ? hi_edge - t.width_mm : at - t.width_mm / 2.0;
      const double hi = std::min(lo + t.width_mm, hi_edge);
      FlatStripRecord transfer_band{t.where, t.direction, true, {}, {}};
      transfer_band.pieces.push_back(along_x ? std::array<double, 4>{col->x_mm, col->x_mm, std::max(lo, lo_edge), hi}
                                             : std::array<double, 4>{std::max(lo, lo_edge), hi, col->y_mm, col->y_mm});
      plate_record.bands.push_back(std::move(transfer_band));
    }
    plate_record.transfers = std::move(transfers);
    const FreeEdgeRule free_rule =
        call_code(rec.code, "free-edge rule", [&] { return member_rules.free_edge_rule(); });
    if (!free_rule.clause.empty())
      plate_record.free_edges = flat_free_edge_bars(plate_record, rec.regions, req, free_rule);
  } else {
    const FreeEdgeRule free_rule =
        call_code(rec.code, "free-edge rule", [&] { return member_rules.free_edge_rule(); });
    if (!free_rule.clause.empty()) plate_record.free_edges = free_edge_bars(plate_record, rec.regions, req, free_rule);
  }
  // Calculated deflection: the plate again with the chosen bars' cracked
  // rigidities, per panel (plate_deflection.cpp).
  if (req.serviceability.calculated_deflection()) {
    PlateDeflectionInput in;
    in.model = &plate.model();
    if constexpr (flat) {
      in.dx_mm = plate.offset_x_mm();
      in.dy_mm = plate.offset_y_mm();
    }
    in.actions = &rec.actions;
    in.combinations = &rec.combinations;
    in.demands = &demands;
    in.records = &rec.regions;
    in.bays = &plate_record.bays;
    in.element_bars = element_bars_of(plate.model(), plate_record, demands, in.dx_mm, in.dy_mm);
    in.thickness_mm = req.slab.thickness_mm;
    in.strip_width_mm = b;
    PlateDeflectionOutcome calc = plate_deflection_checks(member_rules, rec.code, in, detail);
    for (auto& s : calc.spans) {
      const auto at = std::find_if(rec.spans.begin(), rec.spans.end(), [&](const SpanRecord& r) { return r.where == s.where; });
      if (at == rec.spans.end()) rec.spans.push_back(std::move(s));
      else at->checks.insert(at->checks.end(), s.checks.begin(), s.checks.end());
    }
    plate_record.long_term_deflection_mm = std::move(calc.long_term_mm);
    rec.warnings.insert(rec.warnings.end(), calc.warnings.begin(), calc.warnings.end());
  }
  // Detailing: the bars of each row and column of bays, the corners' and
  // the free edges' (detailing.cpp).
  if (req.detailing.requested) {
    adopt_detailing(rec, detail_plate(detailing_rules_of(checker, rec.code), rec.code, req, rec, plate_record));
    if constexpr (flat) {
      std::string linked;
      for (const auto& c : rec.columns)
        if (c.punching.reinforcement && c.punching.reinforcement->spacing_mm > 0.0)
          linked += (linked.empty() ? "" : ", ") + c.name;
      if (!linked.empty())
        rec.warnings.push_back("the punching reinforcement of " + linked +
                               " is not in the bar schedule (its legs are not chosen; columns[].punching gives the "
                               "area per perimeter); sweep and optimise rows add it as estimated");
    }
    if (req.detailing.slab_width_mm > 0.0)
      rec.warnings.push_back(std::string("detailing.slab_width_m is not used for a ") +
                             (flat ? "flat slab: each strip" : "two-way slab: each row or column of bays") +
                             " counts its bars over its own width on the plan");
  }
  rec.plate = std::make_shared<const PlateRecord>(std::move(plate_record));

  settle_verdict(rec, true);
  auto code_warnings = call_code(rec.code, "warnings", [&] { return checker.warnings(); });
  rec.warnings.insert(rec.warnings.begin(), code_warnings.begin(), code_warnings.end());
  return rec;
}

}  // namespace

DesignRecord design_two_way(const SlabChecker& checker, CodeIdentity id, const Request& req, Detail detail,
                            ReportUnits step_units, const std::vector<BarLimit>& limits) {
  if (req.slab_type == SlabType::flat)
    return design_plate<FlatPlate>(checker, std::move(id), req, detail, step_units, limits);
  return design_plate<TwoWayPlate>(checker, std::move(id), req, detail, step_units, limits);
}

}  // namespace armature
