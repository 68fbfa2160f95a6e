// The EN 1992-1-1 code plug-in: variants are NDP data files; every check
// is drawn from the clause functions of rules.hpp.
#include <algorithm>
#include <array>
#include <cmath>
#include <cstring>
#include <filesystem>
#include <limits>
#include <cstdio>
#include <numbers>

#include "armature/analysis.hpp"
#include "armature/plugin.hpp"
#include "armature/steps.hpp"
#include "en1990.hpp"
#include "ndp.hpp"
#include "rules.hpp"

namespace armature::en1992 {
namespace {

constexpr const char* code_id = "EN1992-1-1";
const std::vector<double> bar_catalogue_mm{6, 8, 10, 12, 16, 20, 25, 32, 40};
const std::vector<std::string> default_bars{"8", "10", "12", "16", "20", "25"};
constexpr double default_density_kN_m3 = 25.0;  // EN 1991-1-1 Table A.1
constexpr double default_fyk = 500.0;

std::string num(double v) { return step_number(v); }

std::optional<double> bar_diameter(const std::string& designation) {
  static const char* const names[] = {"6", "8", "10", "12", "16", "20", "25", "32", "40"};
  for (std::size_t i = 0; i < bar_catalogue_mm.size(); ++i)
    if (designation == names[i]) return bar_catalogue_mm[i];
  return std::nullopt;
}

// EN bars are specified by diameter: area π φ²/4.
double bar_area(double phi) { return std::numbers::pi * phi * phi / 4.0; }

// For designations already validated.
std::vector<BarOption> bar_options_of(const std::vector<std::string>& names) {
  std::vector<BarOption> out;
  for (const auto& name : names) {
    const double phi = *bar_diameter(name);
    out.push_back({name, phi, bar_area(phi)});
  }
  return out;
}

const std::vector<BarOption>& default_bar_options() {
  static const std::vector<BarOption> bars = bar_options_of(default_bars);
  return bars;
}

StructuralSystem system_of(SpanKind kind) {
  switch (kind) {
    case SpanKind::simply_supported: return StructuralSystem::simply_supported;
    case SpanKind::end_span: return StructuralSystem::end_span;
    case SpanKind::interior_span: return StructuralSystem::interior_span;
    case SpanKind::cantilever: return StructuralSystem::cantilever;
  }
  return StructuralSystem::simply_supported;
}

// The row of Table 7.4N, as the deflection derivation names it.
const char* system_name(SpanKind kind) {
  switch (kind) {
    case SpanKind::simply_supported: return "simply supported span";
    case SpanKind::end_span: return "end span";
    case SpanKind::interior_span: return "interior span";
    case SpanKind::cantilever: return "cantilever";
  }
  return "";
}

using Steps = StepRecorder;


struct Materials {
  double fck, fyk, fcd, fyd, fctm, eta, lambda, eps_cu2;
};

class Checker final : public SlabChecker {
 public:
  Checker(const Ndp& ndp, const Request& req)
      : ndp_(ndp), req_(req) {
    const double fck = req.concrete.cylinder_strength_MPa
                           ? *req.concrete.cylinder_strength_MPa
                           : *fck_of_class(ndp, *req.concrete.strength_class);
    const double fyk = req.reinforcement.yield_strength_MPa.value_or(default_fyk);
    m_ = {fck,
          fyk,
          design_compressive_strength(fck, ndp.alpha_cc, ndp.gamma_c),
          design_yield_strength(fyk, ndp.gamma_s),
          mean_tensile_strength(fck),
          stress_block_strength_factor(fck),
          stress_block_depth_factor(fck),
          ultimate_compressive_strain(fck)};
    psi_ = *psi_of_category(ndp, req.loads.imposed_category);
    if (req.reinforcement.bars) {
      own_bars_ = bar_options_of(*req.reinforcement.bars);
      bars_ = &own_bars_;
    }
    // Each face by its own exposure: Table 4.3N, Table 4.4N and Table 7.1N.
    for (Face face : {Face::bottom, Face::top}) {
      FaceData& f = faces_[static_cast<std::size_t>(face)];
      f.exposure = req.durability.face(face).exposure.value_or("XC1");
      f.cover_mm = req.durability.face(face).cover_mm;
      f.w_max = (f.exposure == "X0" || f.exposure == "XC1") ? ndp.w_max_X0_XC1_mm : ndp.w_max_other_mm;
      f.structural_class = structural_class(req.durability.design_life_years, f.exposure, m_.fck);
      f.c_min_dur = minimum_cover_durability(f.structural_class, f.exposure);
      f.covers.reserve(bars_->size());
      for (const auto& bar : *bars_) f.covers.push_back({bar.diameter_mm, cover_of(bar.diameter_mm, f)});
    }
  }

  LoadBasis load_basis() const override {
    LoadBasis basis;
    basis.density_kN_m3 = req_.concrete.density_kN_m3.value_or(default_density_kN_m3);
    basis.long_term_load_name = "quasi-permanent";  // EN 1990 6.5.3 (6.16b)
    return basis;
  }

  std::vector<Combination> combinations(const std::vector<Action>& actions,
                                        CombinationLabels labels) const override {
    return en1990_combinations(en1990_factors(ndp_), req_.design.combination.value_or("6.10") != "6.10", actions,
                               labels);
  }

  // EN 1990 6.4.2(1) (6.7): Ed,dst ≤ Ed,stb, here as the reaction the
  // cantilever's loads take from the back span's far support against the
  // reaction the back span's loads give it (utilisation > 1: uplift).
  std::vector<Check> equilibrium_checks(const EquilibriumDemand& d, Detail detail) const override {
    std::vector<Check> out;
    RegionVerdict verdict;
    CheckCollector checks(out, verdict, detail == Detail::verdict ? Detail::checks : detail);
    run_check("equilibrium", [&] {
      checks.add("equilibrium", d.where, "EN 1990 6.4.2(1) (6.7), Table A1.2(A)", d.R_destabilising * 1e-3,
                 d.R_stabilising * 1e-3, "kN", [&] {
                   Steps st;
                   st.add("R,stb", "reaction from the loads off the cantilever (γG,inf)", "", d.R_stabilising * 1e-3,
                          "kN", variant_ndp("EN 1990 6.4.2(1), Table A1.2(A)", "equ_gamma_G_inf"));
                   st.add("R,dst", "reaction taken away by the cantilever's loads", "", d.R_destabilising * 1e-3,
                          "kN", "EN 1990 6.4.2(1)");
                   st.add("R,min", "R,stb − R,dst under " + d.combination + " (negative: uplift)",
                          num(d.R_stabilising * 1e-3) + " − " + num(d.R_destabilising * 1e-3),
                          (d.R_stabilising - d.R_destabilising) * 1e-3, "kN", "EN 1990 6.4.2(1) (6.7)");
                   return st.take();
                 });
    });
    return out;
  }

  std::vector<std::vector<bool>> load_arrangements(std::size_t span_count) const override {
    return en1992::load_arrangements(span_count, ndp_.pattern_loading == "adjacent_pairs");
  }

  double pinned_end_fixity_fraction() const override { return partial_fixity_fraction; }

  const std::vector<BarOption>& bar_options() const override { return *bars_; }
  std::optional<BarOption> catalogue_bar(const std::string& designation) const override {
    const auto phi = bar_diameter(designation);
    if (!phi) return std::nullopt;
    return BarOption{designation, *phi, bar_area(*phi)};
  }

  double max_spacing_mm(const RegionDemand&) const override {
    return max_main_bar_spacing_max_moment(req_.slab.thickness_mm);
  }

  // Below this area the bar fails bending or minimum steel, as checked in
  // check_region: the larger of As,min (9.2.1.1) and the As,req of bending
  // (6.1), where M_Rd = M_Ed (the same equilibrium, and M_Rd grows with
  // As); no area passes when K > K'.
  double minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const override {
    const double b = req_.slab.strip_width_mm;
    const double d = req_.slab.thickness_mm -
                     cover_for(std::max(bar.diameter_mm, g.cover_bar_mm), g.face).c_nom - bar.diameter_mm / 2.0;
    if (d <= 0.0) return 0.0;  // bending fails unless M_Ed = 0: left to the check
    const double K = moment_factor_K(g.M_Ed, b, d, m_.fck);
    if (K > bending_limit(g.redistribution_delta).K_lim) return std::numeric_limits<double>::infinity();
    const double z = lever_arm(d, K, m_.eta, ndp_.alpha_cc, ndp_.gamma_c);
    const double As_bending = required_tension_steel(g.M_Ed, m_.fyd, z) * (1.0 - 1e-9);  // a rounding margin
    return std::max(minimum_tension_steel(m_.fctm, m_.fyk, b, d), As_bending);
  }

  double support_design_moment(const RegionDemand& g) const override { return support_moment(g).M_Ed; }

  RegionOutcome check_region(const RegionDemand& g, const BarOption& bar, double s,
                             Detail detail) const override {
    RegionOutcome out;
    if (detail != Detail::verdict) out.checks.reserve(8);  // as many as a region has, nearly always
    CheckCollector checks(out.checks, out.verdict, detail);
    const double h = req_.slab.thickness_mm, b = req_.slab.strip_width_mm;
    const double phi = bar.diameter_mm, dg = req_.concrete.aggregate_mm;
    const double As_prov = bar.area_mm2 * b / s;

    // Cover (4.4.1), by this face's exposure
    const FaceData& fd = face_data(g.face);
    const std::string& exposure = fd.exposure;
    const int s_class = fd.structural_class;
    const double c_dur = fd.c_min_dur;
    // One nominal cover per face (computed cover): that of the largest bar
    // the kernel has chosen on this face, when larger than this one.
    const bool cover_given = fd.cover_mm.has_value();
    const double phi_cover = cover_given ? phi : std::max(phi, g.cover_bar_mm);
    const CoverOf cover = cover_for(phi_cover, g.face);
    const double c_bond = cover.c_bond, c_min = cover.c_min, c_req = cover.c_req, c_nom = cover.c_nom;
    auto cover_steps = [&] {
      Steps st;
      st.add("S", "structural class (S4, life, slab geometry, strength)",
             "S" + std::to_string(s_class) + " for " + exposure + " (" + to_string(g.face) + " face), " +
                 num(req_.durability.design_life_years) + " years, fck " + num(m_.fck),
             s_class, "-", "EN 1992-1-1 4.4.1.2 Table 4.3N");
      st.add("c_min,dur", "Table 4.4N (S, exposure)",
             "S" + std::to_string(s_class) + ", " + exposure + " (" + to_string(g.face) + " face)",
             c_dur, "mm", "EN 1992-1-1 4.4.1.2 Table 4.4N");
      st.add("c_min,b", "φ (+5 if dg > 32)",
             num(phi_cover) + (phi_cover > phi ? " mm bar (the largest on this face), dg " : " mm bar, dg ") +
                 num(dg),
             c_bond, "mm",
             "EN 1992-1-1 4.4.1.2 Table 4.2");
      st.add("c_min", "max(c_min,b, c_min,dur, 10)", "max(" + num(c_bond) + ", " + num(c_dur) + ", 10)",
             c_min, "mm", "EN 1992-1-1 4.4.1.2 (4.2)");
      st.add("c_min + Δc_dev", "c_min + Δc_dev", num(c_min) + " + " + num(ndp_.delta_c_dev_mm), c_req,
             "mm", variant_ndp("EN 1992-1-1 4.4.1.3(1)P", "delta_c_dev_mm"));
      st.add("c_nom", cover_given ? "given" : "c_min + Δc_dev rounded up to 5 mm",
             cover_given ? "" : num(c_req) + " rounded up", c_nom, "mm", "EN 1992-1-1 4.4.1.1");
      return st.take();
    };
    out.cover_mm = c_nom;
    out.d_mm = h - c_nom - phi / 2.0;
    const double d = out.d_mm;
    out.As_min_mm2 = minimum_tension_steel(m_.fctm, m_.fyk, b, d);
    out.As_max_mm2 = maximum_steel(b, h);
    if (d <= 0.0) {  // the bar does not fit: nothing can resist
      checks.add("bending", g.where, "EN 1992-1-1 6.1", g.M_Ed * 1e-6, 0.0, "kNm", cover_steps);
      return out;
    }

    // Bending (6.1) and ductility (5.5(4))
    const double delta = g.redistribution_delta;
    const BendingLimit limit = bending_limit(delta);
    const bool normal = limit.normal;
    const double k_a = limit.k_a, k_b = limit.k_b, xi = limit.xi, K_lim = limit.K_lim;
    const double K = moment_factor_K(g.M_Ed, b, d, m_.fck);
    const double z = lever_arm(d, std::min(K, K_lim), m_.eta, ndp_.alpha_cc, ndp_.gamma_c);
    out.As_req_mm2 = required_tension_steel(g.M_Ed, m_.fyd, z);
    const double M_lim = K_lim * m_.fck * b * d * d;
    const double M_Rd = std::min(moment_resistance(As_prov, m_.fyd, m_.fcd, m_.eta, b, d), M_lim);

    // K's substitution, in bending and again in ductility.
    auto K_substituted = [&] {
      return num(g.M_Ed * 1e-6) + " × 10⁶ / (" + num(b) + " × " + num(d) + "² × " + num(m_.fck) + ")";
    };
    // A support with a width: M_Ed at its face (5.3.2.2), derived at the
    // head of the bending steps.
    const bool at_face = g.support_face.width_mm > 0.0;
    const SupportMoment face_moment = at_face && detail != Detail::verdict ? support_moment(g) : SupportMoment{};
    const char* bending_clause = !at_face                  ? "EN 1992-1-1 6.1"
                                 : face_moment.reduced_by_4 ? "EN 1992-1-1 6.1; M_Ed 5.3.2.2(4)"
                                                            : "EN 1992-1-1 6.1; M_Ed at the face 5.3.2.2(3)";
    run_check("bending", [&] {
      checks.add("bending", g.where, bending_clause, g.M_Ed * 1e-6, M_Rd * 1e-6, "kNm", [&] {
        // A computed cover is no check of its own: its derivation leads the
        // bending steps, where it sets d.
        Steps st;
        if (at_face) support_moment_steps(st, g, face_moment);
        if (!cover_given)
          for (auto& x : cover_steps()) st.add(x.symbol, x.expression, x.substituted, x.result, x.unit, x.clause);
        st.add("d", "h − c_nom − φ/2", num(h) + " − " + num(c_nom) + " − " + num(phi) + "/2", d, "mm",
               "EN 1992-1-1 6.1");
        st.add("fcd", "αcc fck / γc", num(ndp_.alpha_cc) + " × " + num(m_.fck) + " / " + num(ndp_.gamma_c),
               m_.fcd, "MPa", variant_ndp("EN 1992-1-1 3.1.6(1), 2.4.2.4", "alpha_cc, gamma_c"));
        st.add("fyd", "fyk / γs", num(m_.fyk) + " / " + num(ndp_.gamma_s), m_.fyd, "MPa",
               variant_ndp("EN 1992-1-1 3.2.7(2), 2.4.2.4", "gamma_s"));
        st.add("K", "M_Ed / (b d² fck)", K_substituted(), K, "-", "EN 1992-1-1 6.1");
        st.add("z", "d [0.5 + √(0.25 − K/(2η αcc/γc))] ≤ 0.95 d",
               num(d) + " [0.5 + √(0.25 − " + num(std::min(K, K_lim)) + "/(2 × " + num(m_.eta) + " × " +
                   num(ndp_.alpha_cc) + "/" + num(ndp_.gamma_c) + "))]",
               z, "mm", "EN 1992-1-1 6.1, 3.1.7(3)");
        st.add("As,req", "M_Ed / (fyd z)",
               num(g.M_Ed * 1e-6) + " × 10⁶ / (" + num(m_.fyd) + " × " + num(z) + ")", out.As_req_mm2, "mm2",
               "EN 1992-1-1 6.1");
        st.add("As,prov", "π φ²/4 × b/s", "π × " + num(phi) + "²/4 × " + num(b) + "/" + num(s), As_prov,
               "mm2", "");
        st.add("M_Rd", "min(As fyd z_prov, K' fck b d²), z_prov = d − As fyd/(2η fcd b) ≤ 0.95d",
               num(As_prov) + " × " + num(m_.fyd) + " × z_prov, limit " + num(M_lim * 1e-6) + " kNm",
               M_Rd * 1e-6, "kNm", "EN 1992-1-1 6.1, 3.1.7(3)");
        return st.take();
      });
    });
    run_check("ductility", [&] {
      checks.add("ductility", g.where, "EN 1992-1-1 5.5(4), 6.1", K, K_lim, "-", [&] {
        Steps st;
        st.add("ξ_lim", normal ? "min((δ − k1)/k2, 0.45)" : "min((δ − k3)/k4, 0.35)",
               "min((" + num(delta) + " − " + num(k_a) + ")/" + num(k_b) + ", " + (normal ? "0.45" : "0.35") +
                   ")",
               xi, "-", variant_ndp("EN 1992-1-1 5.5(4)", normal ? "k1, k2_factor" : "k3, k4_factor"));
        st.add("K'", "η (αcc/γc) λ ξ (1 − λ ξ/2)",
               num(m_.eta) + " × " + num(ndp_.alpha_cc) + "/" + num(ndp_.gamma_c) + " × " + num(m_.lambda) +
                   " × " + num(xi) + " × (1 − " + num(m_.lambda) + " × " + num(xi) + "/2)",
               K_lim, "-", variant_ndp("EN 1992-1-1 5.5(4), 6.1, 3.1.6(1)", "alpha_cc, gamma_c"));
        st.add("K", "M_Ed / (b d² fck)", K_substituted(), K, "-", "EN 1992-1-1 6.1");
        return st.take();
      });
    });

    // At a redistributed support, 5.5(4) with the neutral axis of the bars
    // provided: δ ≥ k1 + k2 xu/d, as xu/d ≤ (δ − k1)/k2.
    if (delta < 1.0) {
      run_check("ductility", [&] {
        const double xu_lim = redistribution_neutral_axis_limit(delta, k_a, k_b);
        const double xu = neutral_axis_depth(As_prov, m_.fyd, m_.fcd, m_.eta, m_.lambda, b);
        const char* clause = normal ? "EN 1992-1-1 5.5(4) (5.10a)" : "EN 1992-1-1 5.5(4) (5.10b)";
        checks.add("ductility", g.where, clause, xu / d, xu_lim, "-", [&] {
          const std::string k1 = normal ? "k1" : "k3", k2 = normal ? "k2" : "k4";
          const double factor = normal ? ndp_.k2_factor : ndp_.k4_factor;
          Steps st;
          st.add("δ", "1 − redistribution/100", "1 − " + num(req_.design.redistribution_percent) + "/100", delta,
                 "-", "EN 1992-1-1 5.5(4)");
          st.add(k1, "national choice", ndp_.variant, k_a, "-", "EN 1992-1-1 5.5(4)");
          st.add(k2, num(factor) + " (0.6 + 0.0014/εcu2)",
                 num(factor) + " × (0.6 + 0.0014/" + num(m_.eps_cu2) + ")", k_b, "-", "EN 1992-1-1 5.5(4)");
          st.add("xu", "As,prov fyd / (λ η fcd b)",
                 num(As_prov) + " × " + num(m_.fyd) + " / (" + num(m_.lambda) + " × " + num(m_.eta) + " × " +
                     num(m_.fcd) + " × " + num(b) + ")",
                 xu, "mm", "EN 1992-1-1 3.1.7(3), 6.1");
          st.add("xu/d", "xu / d", num(xu) + " / " + num(d), xu / d, "-", "EN 1992-1-1 5.5(4)");
          st.add("(xu/d)max", "(δ − " + k1 + ")/" + k2,
                 "(" + num(delta) + " − " + num(k_a) + ")/" + num(k_b), xu_lim, "-", clause);
          return st.take();
        });
      });
    }

    // Minimum and maximum steel (9.2.1.1)
    run_check("min_steel", [&] {
      checks.add("min_steel", g.where, "EN 1992-1-1 9.2.1.1(1), 9.3.1.1(1)", out.As_min_mm2, As_prov,
                 "mm2", [&] {
                   Steps st;
                   st.add("fctm", "0.30 fck^(2/3) (≤ C50/60), 2.12 ln(1 + fcm/10) above", "fck = " + num(m_.fck),
                          m_.fctm, "MPa", "EN 1992-1-1 Table 3.1");
                   st.add("As,min", "max(0.26 fctm/fyk, 0.0013) b d",
                          "max(0.26 × " + num(m_.fctm) + "/" + num(m_.fyk) + ", 0.0013) × " + num(b) +
                              " × " + num(d),
                          out.As_min_mm2, "mm2", "EN 1992-1-1 9.2.1.1(1), 9.3.1.1(1)");
                   return st.take();
                 });
    });
    run_check("max_steel", [&] {
      checks.add("max_steel", g.where, "EN 1992-1-1 9.2.1.1(3)", As_prov, out.As_max_mm2, "mm2", [&] {
        Steps st;
        st.add("As,max", "0.04 b h", "0.04 × " + num(b) + " × " + num(h), out.As_max_mm2, "mm2",
               "EN 1992-1-1 9.2.1.1(3)");
        return st.take();
      });
    });

    // The bar search needs no more once an arrangement has failed: bending
    // and minimum steel (its fallback) are known by now.
    if (checks.verdict_settled()) return out;

    // Spacing (9.3.1.1(3), 8.2(2))
    run_check("spacing", [&] {
      const double s_max = max_main_bar_spacing_max_moment(h);
      checks.add("spacing", g.where, "EN 1992-1-1 9.3.1.1(3)", s, s_max, "mm", [&] {
        Steps st;
        st.add("s_max,slabs", "min(2h, 250) in areas of maximum moment", "min(2 × " + num(h) + ", 250)",
               s_max, "mm", "EN 1992-1-1 9.3.1.1(3)");
        return st.take();
      });
      const double clear_min = minimum_clear_bar_spacing(phi, dg);
      checks.add("spacing", g.where, "EN 1992-1-1 8.2(2)", clear_min, s - phi, "mm", [&] {
        Steps st;
        st.add("a_min", "max(φ, dg + 5, 20)", "max(" + num(phi) + ", " + num(dg) + " + 5, 20)", clear_min,
               "mm", "EN 1992-1-1 8.2(2)");
        st.add("a", "s − φ", num(s) + " − " + num(phi), s - phi, "mm", "EN 1992-1-1 8.2(2)");
        return st.take();
      });
    });

    if (checks.verdict_settled()) return out;

    // Crack control (7.3.3)
    if (crack_check_needed(h))
      run_check("cracking", [&] {
        crack_check(checks, g, phi, s, d, out.As_req_mm2, As_prov);
        min_crack_steel_check(checks, g, As_prov);
      });

    // Cover (4.4.1), when the request gives it
    if (cover_given)
      run_check("cover", [&] { checks.add("cover", g.where, "EN 1992-1-1 4.4.1", c_req, c_nom, "mm", cover_steps); });

    // Fire (EN 1992-1-2 Table 5.8): axis distance of the bottom bars
    if (req_.fire.resistance_min && g.face == Face::bottom) {
      run_check("fire", [&] {
        const int t = *req_.fire.resistance_min;
        const double a = c_nom + phi / 2.0, a_min = fire_min_axis_distance(t);
        // Column 3 (one-way slabs) for every span: 5.7.3 would allow
        // column 4 for continuous slabs under conditions; it is not used.
        const bool continuous = g.span_kind != SpanKind::simply_supported;
        const char* clause = continuous ? "EN 1992-1-2 5.7.2 Table 5.8 column 3 (axis distance); "
                                          "conservative for continuous slabs, 5.7.3 not used"
                                        : "EN 1992-1-2 5.7.2 Table 5.8 column 3 (axis distance)";
        checks.add("fire", g.where, clause, a_min, a, "mm", [&] {
          Steps st;
          st.add("a", "c_nom + φ/2", num(c_nom) + " + " + num(phi) + "/2", a, "mm", "EN 1992-1-2 5.7.2");
          st.add("a_min", "Table 5.8 column 3, one-way slab", "REI " + std::to_string(t), a_min, "mm",
                 continuous ? "EN 1992-1-2 5.7.2 Table 5.8 column 3 (5.7.3 column 4 not used)"
                            : "EN 1992-1-2 5.7.2 Table 5.8 column 3");
          return st.take();
        });
      });
    }

    // Deflection (7.4.2) of the span these bars govern
    if (!g.span_where.empty()) {
      CheckCollector span(out.span_checks, out.verdict, detail);
      run_check("deflection", [&] { deflection_check(span, g, d, out.As_req_mm2, As_prov); });
    }

    // Shear (6.2.2) at the supports where these bars are the tension steel
    for (const auto& sup : g.supports) {
      SupportOutcome so;
      so.where = sup.where;
      so.V_Ed = sup.V_Ed;
      CheckCollector support(so.checks, out.verdict, detail);
      run_check("shear", [&] {
        const double rho_l = As_prov / (b * d);
        const double k = shear_depth_factor(d);
        const double fck_v = shear_strength_fck(m_.fck, ndp_.shear_fck_cap_MPa);
        const double v_min = minimum_shear_strength(k, fck_v, ndp_.v_min_factor);
        const double C = ndp_.C_Rd_c_factor / ndp_.gamma_c;
        so.V_Rd = shear_resistance_without_links(C, k, rho_l, fck_v, v_min, b, d);
        support.add("shear", sup.where, "EN 1992-1-1 6.2.2(1)", sup.V_Ed * 1e-3, so.V_Rd * 1e-3, "kN", [&] {
          Steps st;
          st.add("k", "1 + √(200/d) ≤ 2", "1 + √(200/" + num(d) + ")", k, "-", "EN 1992-1-1 6.2.2(1)");
          st.add("ρl", "Asl/(b d) ≤ 0.02", num(As_prov) + "/(" + num(b) + " × " + num(d) + ")", rho_l, "-",
                 "EN 1992-1-1 6.2.2(1)");
          if (ndp_.shear_fck_cap_MPa)
            st.add("fck,v", "min(fck, cap) for VRd,c and v_min",
                   "min(" + num(m_.fck) + ", " + num(*ndp_.shear_fck_cap_MPa) + ")", fck_v, "MPa",
                   variant_ndp("EN 1992-1-1 6.2.2(1); NA to 3.1.2(2)P", "shear_fck_cap_MPa"));
          st.add("CRd,c", "factor / γc", num(ndp_.C_Rd_c_factor) + " / " + num(ndp_.gamma_c), C, "-",
                 variant_ndp("EN 1992-1-1 6.2.2(1)", "C_Rd_c_factor, gamma_c"));
          const bool capped = ndp_.shear_fck_cap_MPa.has_value();
          st.add("v_min", num(ndp_.v_min_factor) + (capped ? " k^1.5 fck,v^0.5" : " k^1.5 fck^0.5"),
                 num(ndp_.v_min_factor) + " × " + num(k) + "^1.5 × " + num(fck_v) + "^0.5", v_min, "MPa",
                 variant_ndp("EN 1992-1-1 6.2.2(1) (6.3N)", "v_min_factor"));
          st.add("V_Rd,c", capped ? "max(CRd,c k (100 ρl fck,v)^(1/3), v_min) b d"
                                  : "max(CRd,c k (100 ρl fck)^(1/3), v_min) b d",
                 "max(" + num(C) + " × " + num(k) + " × (100 × " + num(std::min(rho_l, 0.02)) + " × " +
                     num(fck_v) + ")^(1/3), " + num(v_min) + ") × " + num(b) + " × " + num(d),
                 so.V_Rd * 1e-3, "kN", "EN 1992-1-1 6.2.2(1) (6.2)");
          return st.take();
        });
      });
      if (detail != Detail::verdict) out.supports.push_back(std::move(so));  // the search needs only the verdict
    }
    return out;
  }

  std::vector<Check> span_checks(const std::string& span_where) const override {
    std::vector<Check> out;
    if (req_.fire.resistance_min) {
      out.push_back(run_check("fire", [&] {
        const int t = *req_.fire.resistance_min;
        const double h_min = fire_min_thickness(t);
        std::vector<Step> st;
        st.push_back({"h_s,min", "Table 5.8 column 2", "REI " + std::to_string(t), h_min, "mm",
                      "EN 1992-1-2 5.7.2 Table 5.8 column 2"});
        return make_check("fire", span_where, "EN 1992-1-2 5.7.2 Table 5.8 column 2 (thickness)", h_min,
                          req_.slab.thickness_mm, "mm", std::move(st));
      }));
    }
    return out;
  }

  DistributionNeed distribution(double main_As_prov) const override {
    return {minimum_distribution_steel(main_As_prov),
            max_distribution_bar_spacing_max_moment(req_.slab.thickness_mm)};
  }

  std::vector<InputDefault> defaults_used() const override {
    std::string bars;
    for (const auto& bar : *bars_) bars += (bars.empty() ? "" : ", ") + bar.designation;
    std::vector<InputDefault> out{
        {"design.combination", req_.design.combination.value_or("6.10"), "EN 1990 (6.10), plug-in default"},
        {"concrete.density_kN_m3", num(req_.concrete.density_kN_m3.value_or(default_density_kN_m3)) + " kN/m³",
         "EN 1991-1-1 Table A.1, normal-weight reinforced concrete"},
        {"concrete.aggregate_mm", num(req_.concrete.aggregate_mm) + " mm", "armature default"},
        {"reinforcement.yield_strength_MPa", num(m_.fyk) + " MPa", "grade B500, plug-in default"},
        {"reinforcement.bars", bars, "plug-in default set"},
        {"reinforcement.ductility_class", to_string(req_.reinforcement.ductility_class), "armature default"},
        {"durability.design_life_years", num(req_.durability.design_life_years) + " years", "armature default"},
    };
    // The category of the shorthand imposed load, where there is one to use it.
    if (req_.loads.imposed_MPa > 0.0)
      out.insert(out.begin() + 6,
                 {"loads.imposed_category", req_.loads.imposed_category, "armature default (EN 1990 Table A1.1)"});
    for (auto& d : durability_defaults(req_, {face_data(Face::bottom).exposure, face_data(Face::top).exposure},
                                       "plug-in default (EN 1992-1-1 Table 4.1, dry inside buildings)",
                                       "c_nom from the exposure and each bar (see the bending steps)",
                                       "EN 1992-1-1 4.4.1"))
      out.push_back(std::move(d));
    return out;
  }

  std::vector<std::string> warnings() const override {
    if (ndp_.durability_note.empty()) return {};
    return {ndp_.durability_note};
  }

 private:
  // Cover of bars of diameter phi (4.4.1): c_nom is the request's cover
  // when given, else c_min + Δc_dev rounded up to 5 mm.
  struct CoverOf {
    double c_bond, c_min, c_req, c_nom;
  };
  // 5.3.2.2 at a support with a width t, in the load case that governs:
  // (3) at a monolithic support, the moment at the face, not below 0.65 of
  // the full fixed-end moment; (4) over a support giving no rotational
  // restraint, the centreline moment less F_Ed,sup t/8. A fixed end is
  // built in: (3). An interior support or a cantilever's root may be
  // either (the request does not say which): the larger of the two
  // moments, i.e. the smaller reduction.
  struct SupportMoment {
    double M_Ed = 0.0;
    std::size_t governing = 0;  // index of the load case
    double by_3 = 0.0, by_4 = 0.0;  // of the governing case
    bool reduced_by_4 = false;
  };
  SupportMoment support_moment(const RegionDemand& g) const {
    const SupportFace& f = g.support_face;
    SupportMoment out;
    out.M_Ed = -std::numeric_limits<double>::infinity();
    for (std::size_t i = 0; i < f.cases.size(); ++i) {
      const SupportMomentCase& c = f.cases[i];
      const double by_3 = monolithic_support_design_moment(c.M_face, c.M_fixed_end);
      const double by_4 = c.M_centre - support_moment_reduction(c.reaction, f.width_mm);
      const bool use_4 = !f.built_in && by_4 > by_3;
      const double M = use_4 ? by_4 : by_3;
      if (M > out.M_Ed) out = {M, i, by_3, by_4, use_4};
    }
    if (f.cases.empty()) out.M_Ed = f.M_centre;
    return out;
  }
  void support_moment_steps(Steps& st, const RegionDemand& g, const SupportMoment& m) const {
    const SupportFace& f = g.support_face;
    if (f.cases.empty()) return;
    const SupportMomentCase& c = f.cases[m.governing];
    const char* kind = f.built_in ? "fixed end, built in (monolithic)"
                                  : "support monolithic or giving no rotational restraint: the smaller reduction";
    st.add("t", "breadth of the support", kind, f.width_mm, "mm", "EN 1992-1-1 5.3.2.2(3), (4)");
    st.add("M_Ed,c", "hogging at the centreline, governing load case", "", c.M_centre * 1e-6, "kNm",
           "EN 1992-1-1 5.3.2.2");
    st.add("M_Ed,face", "hogging at the face, t/2 from the centreline (larger side)", "", c.M_face * 1e-6, "kNm",
           "EN 1992-1-1 5.3.2.2(3)");
    st.add("M_fe", "full fixed-end moment of the adjacent span (cantilever: its root moment)", "",
           c.M_fixed_end * 1e-6, "kNm", "EN 1992-1-1 5.3.2.2(3) Note");
    st.add("M_Ed,(3)", "max(M_Ed,face, 0.65 M_fe)",
           "max(" + num(c.M_face * 1e-6) + ", 0.65 × " + num(c.M_fixed_end * 1e-6) + ")", m.by_3 * 1e-6, "kNm",
           "EN 1992-1-1 5.3.2.2(3)");
    if (!f.built_in) {
      st.add("ΔM_Ed", "F_Ed,sup t/8", num(c.reaction * 1e-3) + " kN × " + num(f.width_mm) + " mm / 8",
             support_moment_reduction(c.reaction, f.width_mm) * 1e-6, "kNm", "EN 1992-1-1 5.3.2.2(4) (5.9)");
      st.add("M_Ed,(4)", "M_Ed,c − ΔM_Ed",
             num(c.M_centre * 1e-6) + " − " + num(support_moment_reduction(c.reaction, f.width_mm) * 1e-6),
             m.by_4 * 1e-6, "kNm", "EN 1992-1-1 5.3.2.2(4)");
      st.add("M_Ed", "max(M_Ed,(3), M_Ed,(4)), the smaller reduction",
             "max(" + num(m.by_3 * 1e-6) + ", " + num(m.by_4 * 1e-6) + ")", g.M_Ed * 1e-6, "kNm",
             m.reduced_by_4 ? "EN 1992-1-1 5.3.2.2(4)" : "EN 1992-1-1 5.3.2.2(3)");
    } else {
      st.add("M_Ed", "M_Ed,(3)", "", g.M_Ed * 1e-6, "kNm", "EN 1992-1-1 5.3.2.2(3)");
    }
  }

  // What depends on a face's exposure and cover (durability.top, .bottom).
  struct FaceData {
    std::string exposure;
    std::optional<double> cover_mm;  // given
    int structural_class = 0;        // Table 4.3N
    double c_min_dur = 0.0;          // Table 4.4N
    double w_max = 0.0;              // Table 7.1N
    std::vector<std::pair<double, CoverOf>> covers;  // per candidate bar diameter
  };
  const FaceData& face_data(Face face) const { return faces_[static_cast<std::size_t>(face)]; }

  CoverOf cover_of(double phi, const FaceData& f) const {
    CoverOf c;
    c.c_bond = minimum_cover_bond(phi, req_.concrete.aggregate_mm);
    c.c_min = minimum_cover(c.c_bond, f.c_min_dur);
    c.c_req = c.c_min + ndp_.delta_c_dev_mm;
    c.c_nom = f.cover_mm ? *f.cover_mm : round_up_to_5(c.c_req);
    return c;
  }

  // The limit of bending without compression steel at redistribution
  // ratio δ (5.5(4), 6.1).
  struct BendingLimit {
    bool normal;  // fck ≤ 50 MPa
    double k_a, k_b, xi, K_lim;
  };
  BendingLimit bending_limit(double delta) const {
    BendingLimit l;
    l.normal = m_.fck <= 50.0;
    l.k_a = l.normal ? ndp_.k1 : ndp_.k3;
    l.k_b = redistribution_coefficient(l.normal ? ndp_.k2_factor : ndp_.k4_factor, m_.eps_cu2);
    l.xi = limiting_neutral_axis_ratio(delta, l.k_a, l.k_b, m_.fck);
    l.K_lim = limiting_K(m_.eta, ndp_.alpha_cc, ndp_.gamma_c, m_.lambda, l.xi);
    return l;
  }

  // cover_of, worked out once per candidate bar of the request.
  CoverOf cover_for(double phi, Face face) const {
    const FaceData& f = face_data(face);
    for (const auto& [diameter, cover] : f.covers)
      if (diameter == phi) return cover;
    return cover_of(phi, f);
  }

  // A clause whose value here was set by the variant's data file, and the
  // key that set it (Step text, free to carry the variant's name).
  std::string variant_ndp(const char* clause, const std::string& key) const {
    return std::string(clause) + "; " + ndp_.variant + " variant NDP " + key;
  }

  // 7.3.2(2): minimum steel for crack control, As,min σs = kc k fct,eff Act,
  // with kc = 0.4 (rectangular section in bending), fct,eff = fctm,
  // Act = b h/2 and σs = fyk. Checked where crack control applies (h >
  // 200 mm, 7.3.3(1)).
  void min_crack_steel_check(CheckCollector& checks, const RegionDemand& g, double As_prov) const {
    const double h = req_.slab.thickness_mm, b = req_.slab.strip_width_mm;
    const double k = crack_control_depth_factor(h);
    const double A_ct = tension_zone_area_rectangular_bending(b, h);
    const double As_min = minimum_crack_control_steel(kc_bending_rectangular, k, m_.fctm, A_ct, m_.fyk);
    checks.add("cracking", g.where, "EN 1992-1-1 7.3.2(2) (7.1) (minimum steel)", As_min, As_prov, "mm2", [&] {
      Steps st;
      st.add("kc", "0.4 (1 − σc/(k1 (h/h*) fct,eff)), rectangular section in bending", "0.4 × (1 − 0), σc = 0",
             kc_bending_rectangular, "-", "EN 1992-1-1 7.3.2(2) (7.2)");
      st.add("k", "1.0 for h ≤ 300, 0.65 for h ≥ 800, linear between", "h = " + num(h), k, "-",
             "EN 1992-1-1 7.3.2(2)");
      st.add("Act", "b h/2 (tension zone before cracking)", num(b) + " × " + num(h) + "/2", A_ct, "mm2",
             "EN 1992-1-1 7.3.2(2)");
      st.add("As,min", "kc k fct,eff Act / σs, fct,eff = fctm, σs = fyk",
             num(kc_bending_rectangular) + " × " + num(k) + " × " + num(m_.fctm) + " × " + num(A_ct) + " / " +
                 num(m_.fyk),
             As_min, "mm2", "EN 1992-1-1 7.3.2(2) (7.1)");
      return st.take();
    });
  }

  void crack_check(CheckCollector& checks, const RegionDemand& g, double phi, double s, double d,
                   double As_req, double As_prov) const {
    const double h = req_.slab.thickness_mm;
    const double sigma = quasi_permanent_steel_stress(m_.fyd, g.quasi_permanent_to_uls, As_req,
                                                      As_prov, g.redistribution_delta);
    // A limit past the end of its table is zero: that route cannot pass.
    const FaceData& fd = face_data(g.face);
    const auto s_lim = max_bar_spacing_table_7_3N(sigma, fd.w_max);
    const auto phi_star = max_bar_diameter_table_7_2N(sigma, fd.w_max);
    const double s_limit = s_lim.value_or(0.0);
    const double phi_limit = phi_star ? adjusted_max_bar_diameter(*phi_star, m_.fctm, h, d) : 0.0;
    auto steps = [&] {
      Steps st;
      st.add("w_max", "Table 7.1N for the exposure class", fd.exposure + " (" + to_string(g.face) + " face)",
             fd.w_max, "mm",
             variant_ndp("EN 1992-1-1 7.3.1(5) Table 7.1N",
                         fd.exposure == "X0" || fd.exposure == "XC1" ? "w_max_X0_XC1_mm" : "w_max_other_mm"));
      if (req_.loads.actions_given)  // the ratio comes from the combinations of the actions
        st.add("n_qp/n_uls", "quasi-permanent over ULS moment at the region (combinations of the actions)",
               "", g.quasi_permanent_to_uls, "-", "EN 1990 (6.16b), (6.10)");
      else
        st.add("ψ2", "quasi-permanent factor, category " + req_.loads.imposed_category,
               "category " + req_.loads.imposed_category, psi_.psi2, "-",
               variant_ndp("EN 1990 Table A1.1", "psi_factors." + req_.loads.imposed_category + ".psi2"));
      st.add("σs", "fyd (n_qp/n_uls)(As,req/As,prov)/δ",
             num(m_.fyd) + " × " + num(g.quasi_permanent_to_uls) + " × " + num(As_req) + "/" + num(As_prov) +
                 " / " + num(g.redistribution_delta),
             sigma, "MPa", "EN 1992-1-1 7.3.3 (common practice estimate)");
      st.add("s_max", "Table 7.3N(σs, w_max)", num(sigma) + " MPa", s_limit, "mm", "EN 1992-1-1 7.3.3 Table 7.3N");
      st.add("φ*s", "Table 7.2N(σs, w_max)", num(sigma) + " MPa", phi_star.value_or(0.0), "mm",
             "EN 1992-1-1 7.3.3 Table 7.2N");
      st.add("φs", "φ*s (fctm/2.9) kc hcr/(2(h − d)), kc = 0.4, hcr = h/2",
             num(phi_star.value_or(0.0)) + " × (" + num(m_.fctm) + "/2.9) × 0.4 × " + num(h / 2) + "/(2 × (" +
                 num(h) + " − " + num(d) + "))",
             phi_limit, "mm", "EN 1992-1-1 7.3.3 (7.6N)");
      return st.take();
    };
    // Either route passes the check; the one with the lower utilisation is reported.
    if (utilisation_of(s, s_limit) <= utilisation_of(phi, phi_limit))
      checks.add("cracking", g.where, "EN 1992-1-1 7.3.3 Table 7.3N (bar spacing)", s, s_limit, "mm", steps);
    else
      checks.add("cracking", g.where, "EN 1992-1-1 7.3.3 Table 7.2N (bar diameter)", phi, phi_limit, "mm", steps);
  }

  void deflection_check(CheckCollector& checks, const RegionDemand& g, double d, double As_req,
                        double As_prov) const {
    // A region with no moment has As,req = 0; a floor of 1e-6 keeps (7.16a)
    // finite (the ratio is then far above any actual l/d).
    const double rho = std::max(As_req / (req_.slab.strip_width_mm * d), 1e-6);
    const double rho0 = reference_reinforcement_ratio(m_.fck);
    const double K = structural_system_factor(system_of(g.span_kind));
    const double basic = basic_span_depth_ratio(K, m_.fck, rho, 0.0);
    const double f_long = long_span_factor(g.span_mm);
    const double f_steel = steel_stress_factor(m_.fyk, As_prov, As_req, ndp_.steel_stress_factor_cap);
    const double modified = basic * f_long * f_steel;
    const double allowed = capped_span_depth_ratio(modified, K, ndp_.span_depth_cap_K);
    const bool capped = allowed < modified;
    const double actual = g.span_mm / d;
    const char* clause = capped ? "EN 1992-1-1 7.4.2 (7.16), Table 7.4N; l/d capped by variant NDP"
                                : "EN 1992-1-1 7.4.2 (7.16), Table 7.4N";
    checks.add("deflection", g.span_where, clause, actual, allowed, "-", [&] {
      Steps st;
      st.add("ρ0", "√fck × 10⁻³", "√" + num(m_.fck) + " × 10⁻³", rho0, "-", "EN 1992-1-1 7.4.2(2)");
      st.add("ρ", "As,req/(b d)", num(As_req) + "/(" + num(req_.slab.strip_width_mm) + " × " + num(d) + ")", rho,
             "-", "EN 1992-1-1 7.4.2(2)");
      st.add("K", "Table 7.4N structural system", system_name(g.span_kind), K, "-",
             "EN 1992-1-1 7.4.2 Table 7.4N");
      st.add("l/d basic",
             rho <= rho0 ? "K[11 + 1.5√fck ρ0/ρ + 3.2√fck (ρ0/ρ − 1)^1.5]"
                         : "K[11 + 1.5√fck ρ0/(ρ − ρ') + √fck √(ρ'/ρ0)/12], ρ' = 0",
             "K = " + num(K) + ", fck = " + num(m_.fck) + ", ρ0 = " + num(rho0) + ", ρ = " + num(rho), basic, "-",
             rho <= rho0 ? "EN 1992-1-1 7.4.2 (7.16a)" : "EN 1992-1-1 7.4.2 (7.16b)");
      st.add("F_l", "7/leff when leff > 7 m", num(g.span_mm * 1e-3) + " m", f_long, "-", "EN 1992-1-1 7.4.2(2)");
      st.add("310/σs", "(500/fyk)(As,prov/As,req) ≤ cap",
             "(500/" + num(m_.fyk) + ")(" + num(As_prov) + "/" + num(As_req) + ") ≤ " +
                 num(ndp_.steel_stress_factor_cap),
             f_steel, "-", variant_ndp("EN 1992-1-1 7.4.2(2) (7.17)", "steel_stress_factor_cap"));
      if (ndp_.span_depth_cap_K) {
        st.add("l/d modified", "l/d basic × F_l × 310/σs",
               num(basic) + " × " + num(f_long) + " × " + num(f_steel), modified, "-", "EN 1992-1-1 7.4.2");
        st.add("l/d cap", "cap × K", num(*ndp_.span_depth_cap_K) + " × " + num(K), *ndp_.span_depth_cap_K * K,
               "-", variant_ndp("EN 1992-1-1 7.4.2(2); NA Table NA.5 Note 6", "span_depth_cap_K"));
        st.add("l/d allowed", "min(l/d modified, l/d cap)",
               "min(" + num(modified) + ", " + num(*ndp_.span_depth_cap_K * K) + ")", allowed, "-",
               "EN 1992-1-1 7.4.2");
      } else {
        st.add("l/d allowed", "l/d basic × F_l × 310/σs",
               num(basic) + " × " + num(f_long) + " × " + num(f_steel), allowed, "-", "EN 1992-1-1 7.4.2");
      }
      st.add("l/d actual", "leff/d", num(g.span_mm) + "/" + num(d), actual, "-", "EN 1992-1-1 7.4.2");
      return st.take();
    });
  }

  const Ndp& ndp_;       // of the Code, which outlives this checker
  const Request& req_;   // kept alive by the caller of Code::begin
  Materials m_{};
  PsiFactors psi_{};
  std::vector<BarOption> own_bars_;  // when the request names its bars
  const std::vector<BarOption>* bars_ = &default_bar_options();
  std::array<FaceData, 2> faces_{};  // by Face
};

std::string format_range(double lo, double hi, const char* unit) {
  return "must be between " + num(lo) + " and " + num(hi) + " " + unit;
}

class Code final : public DesignCode {
 public:
  explicit Code(Ndp ndp)
      : ndp_(std::move(ndp)) {}

  CodeIdentity identity() const override { return {code_id, ndp_.variant, ndp_.title}; }

  void validate(const Request& req, InputProblems& problems) const override {
    const auto& c = req.concrete;
    if (c.strength_class && !fck_of_class(ndp_, *c.strength_class)) {
      std::string extra;
      for (const auto& [name, fck] : ndp_.extra_strength_classes) extra += (extra.empty() ? "" : ", ") + name;
      problems.add("concrete.class",
                   "unknown strength class '" + *c.strength_class +
                       "'; EN 1992-1-1 Table 3.1 classes run C12/15 to C90/105" +
                       (extra.empty() ? "" : " (the " + ndp_.variant + " variant adds " + extra + ")") +
                       "; for another concrete give concrete.cylinder_strength_MPa (fck) instead");
    }
    if (c.cylinder_strength_MPa && (*c.cylinder_strength_MPa < 12 || *c.cylinder_strength_MPa > 90))
      problems.add("concrete.cylinder_strength_MPa",
                   format_range(12, 90, "MPa") + " (EN 1992-1-1 3.1.2), got " +
                       num(*c.cylinder_strength_MPa));
    const auto& fy = req.reinforcement.yield_strength_MPa;
    if (fy && (*fy < 400 || *fy > 600))
      problems.add("reinforcement.yield_strength_MPa",
                   format_range(400, 600, "MPa") + " (EN 1992-1-1 Annex C), got " + num(*fy));
    double smallest_bar = 1e9;
    if (req.reinforcement.bars) {
      const auto& bars = *req.reinforcement.bars;
      for (std::size_t i = 0; i < bars.size(); ++i) {
        auto d = bar_diameter(bars[i]);
        if (!d)
          problems.add("reinforcement.bars[" + std::to_string(i) + "]",
                       "unknown bar '" + bars[i] + "'; EN 1992 bars are 6, 8, 10, 12, 16, 20, 25, 32, 40");
        else
          smallest_bar = std::min(smallest_bar, *d);
      }
    } else {
      smallest_bar = 8.0;
    }
    // Bars given in check mode: any bar of the catalogue, whether or not
    // it is a candidate of the search.
    for (std::size_t i = 0; i < req.reinforcement.given.size(); ++i) {
      const std::string& bar = req.reinforcement.given[i].bar;
      if (!bar.empty() && !bar_diameter(bar))
        problems.add("reinforcement.given[" + std::to_string(i) + "].bar",
                     "unknown bar '" + bar + "'; EN 1992 bars are 6, 8, 10, 12, 16, 20, 25, 32, 40");
    }
    if (!psi_of_category(ndp_, req.loads.imposed_category))
      problems.add("loads.imposed_category", "must be one of A to H (EN 1990 Table A1.1), got '" +
                                                 req.loads.imposed_category + "'");
    for (Face face : {Face::bottom, Face::top}) {
      const FaceDurability& fd = req.durability.face(face);
      if (face == Face::top && fd.exposure_field == req.durability.face(Face::bottom).exposure_field)
        continue;  // the plain form, judged once
      if (fd.exposure && !is_exposure_class(*fd.exposure))
        problems.add(fd.exposure_field, "unknown exposure class '" + *fd.exposure +
                                            "'; use X0, XC1-XC4, XD1-XD3 or XS1-XS3 (EN 1992-1-1 Table 4.1)");
    }
    if (smallest_bar < 1e9) add_cover_fit_problems(req, smallest_bar, problems);
    if (req.fire.resistance_min && !is_tabulated_fire_resistance(*req.fire.resistance_min))
      problems.add("fire.resistance_min",
                   "must be 30, 60, 90, 120, 180 or 240 (EN 1992-1-2 Table 5.8), got " +
                       std::to_string(*req.fire.resistance_min));
    if (req.design.redistribution_percent > 0.0) add_redistribution_problems(req, problems);
    if (const auto& comb = req.design.combination; comb && *comb != "6.10" && *comb != "6.10a/b")
      problems.add("design.combination", "must be \"6.10\" or \"6.10a/b\" (EN 1990 Table A1.2(B)), got '" +
                                             *comb + "'");
  }

  std::unique_ptr<SlabChecker> begin(const Request& req) const override {
    return std::make_unique<Checker>(ndp_, req);
  }

 private:
  // The conditions of 5.5(4) under which moments may be redistributed
  // without a check of rotation capacity; the neutral-axis condition
  // depends on the bars and is the `ductility` check of each redistributed
  // support.
  void add_redistribution_problems(const Request& req, InputProblems& problems) const {
    const double p = req.design.redistribution_percent;
    const DuctilityClass ductility = req.reinforcement.ductility_class;
    const double delta_min = minimum_redistribution_ratio(ductility, ndp_.k5, ndp_.k6);
    const double max_percent = (1.0 - delta_min) * 100.0;
    if (p > max_percent + 1e-9)
      problems.add("design.redistribution_percent",
                   "must be at most " + num(max_percent) + " % with class " + to_string(ductility) +
                       " reinforcement (EN 1992-1-1 5.5(4): δ ≥ " + num(delta_min) + " for class " +
                       to_string(ductility) + "; variant " + ndp_.variant + ": k5 = " + num(ndp_.k5) +
                       " for class B and C, k6 = " + num(ndp_.k6) + " for class A), got " + num(p));
    const double fyk = req.reinforcement.yield_strength_MPa.value_or(default_fyk);
    if (const auto& fyk_max = ndp_.redistribution_max_fyk_MPa; fyk_max && fyk > *fyk_max + 1e-9)
      problems.add("design.redistribution_percent",
                   "must be 0 with fyk " + num(fyk) + " MPa: variant " + ndp_.variant +
                       " gives the limits of EN 1992-1-1 5.5(4) (k1 to k4) for fyk up to " + num(*fyk_max) +
                       " MPa only, got " + num(p));
    // 5.5(4) b): the spans either side of each redistributed support. The
    // pairs are numbered from the spans as parsed, so not when a span or
    // an end was refused.
    for (const auto& problem : problems.items())
      if (problem.field.rfind("slab.", 0) == 0) return;
    const StripModel model{req.slab.spans_mm, req.slab.ends[0], req.slab.ends[1]};
    const auto nodes = redistributable_nodes(model);
    for (std::size_t j = 1; j + 1 < nodes.size(); ++j) {
      if (!nodes[j]) continue;
      const double left = req.slab.spans_mm[j - 1], right = req.slab.spans_mm[j];
      if (adjacent_span_ratio_allows_redistribution(left, right)) continue;
      problems.add("design.redistribution_percent",
                   "must be 0 for this strip: spans " + std::to_string(j) + " and " + std::to_string(j + 1) +
                       " (" + num(left * 1e-3) + " m and " + num(right * 1e-3) + " m, ratio " +
                       num(left / right) + ") meet at support " + std::to_string(j + 1) +
                       ", whose moment would be redistributed; EN 1992-1-1 5.5(4) allows "
                       "redistribution only between adjacent spans in the ratio 0.5 to 2, got " + num(p));
    }
  }

  Ndp ndp_;
};

// A firm's own national-annex variant: a file <name>.en1992.json in any
// directory of the search path, with every NDP of the shipped files.
constexpr const char* data_variant_suffix = ".en1992.json";

class Factory final : public CodeFactory {
 public:
  explicit Factory(const PluginContext& context)
      : variants_(read_ndp_directory(context.plugin_file.parent_path() / "en1992")) {
    if (variants_.empty())
      throw std::invalid_argument("no NDP files in " +
                                  (context.plugin_file.parent_path() / "en1992").string());
    for (const auto& dir : context.search_dirs) add_data_variants(dir);
  }
  std::vector<std::pair<std::string, std::string>> data_problems() const override { return problems_; }
  std::string id() const override { return code_id; }
  std::string title() const override { return "Eurocode 2: design of concrete structures, part 1-1 (with EN 1992-1-2 fire, EN 1990 actions)"; }
  std::string edition() const override { return "EN 1992-1-1:2004+AC:2010"; }
  std::vector<std::string> variants() const override {
    std::vector<std::string> names;
    for (const auto& v : variants_) names.push_back(v.variant);
    return names;
  }
  std::string default_variant() const override { return "recommended"; }
  std::shared_ptr<const DesignCode> make(const std::string& variant, const CodeHost&) const override {
    for (const auto& v : variants_)
      if (v.variant == variant) return std::make_shared<Code>(v);
    throw std::invalid_argument("no EN 1992-1-1 variant '" + variant + "'");
  }

 private:
  void add_data_variants(const std::filesystem::path& dir) {
    std::error_code ec;
    std::vector<std::filesystem::path> files;
    for (const auto& entry : std::filesystem::directory_iterator(dir, ec)) {
      const std::string name = entry.path().filename().string();
      if (name.size() > std::strlen(data_variant_suffix) &&
          name.compare(name.size() - std::strlen(data_variant_suffix), std::string::npos,
                       data_variant_suffix) == 0)
        files.push_back(entry.path());
    }
    std::sort(files.begin(), files.end());
    for (const auto& f : files) {
      try {
        Ndp ndp = read_ndp_file(f);
        const bool taken = std::any_of(variants_.begin(), variants_.end(),
                                       [&](const Ndp& v) { return v.variant == ndp.variant; });
        if (taken)
          problems_.push_back({f.string(), "variant: '" + ndp.variant +
                                               "' is already defined; this file is ignored"});
        else
          variants_.push_back(std::move(ndp));
      } catch (const std::exception& e) {
        std::string reason = e.what();
        const std::string prefix = f.string() + ": ";
        if (reason.rfind(prefix, 0) == 0) reason = reason.substr(prefix.size());
        problems_.push_back({f.string(), reason});
      }
    }
  }

  std::vector<Ndp> variants_;
  std::vector<std::pair<std::string, std::string>> problems_;
};

std::unique_ptr<CodeFactory> create_factory(const PluginContext& context) {
  return std::make_unique<Factory>(context);
}

}  // namespace

const PluginEntry* plugin_entry() {
  static const PluginEntry entry{plugin_abi_version, &create_factory};
  return &entry;
}

}  // namespace armature::en1992

ARMATURE_CODE_PLUGIN(armature::en1992::plugin_entry)
