// The ACI 318-19 (SI) code plug-in for one-way solid slabs.
#include <algorithm>
#include <array>
#include <limits>
#include <cmath>

#include "armature/plugin.hpp"
#include "armature/steps.hpp"
#include "combinations.hpp"
#include "rules.hpp"

namespace armature::aci318 {
namespace {

constexpr const char* code_id = "ACI318-19";
constexpr const char* variant_name = "SI";
const std::vector<std::string> default_bars{"#3", "#4", "#5", "#6", "#7", "#8"};
constexpr double default_density_kN_m3 = 23.6;  // 150 lb/ft³ (common practice)
constexpr double default_fy = 420.0;             // Grade 60
constexpr double lambda_normal_weight = 1.0;     // 19.2.4

std::string num(double v) { return step_number(v); }

SupportCondition condition_of(SpanKind kind) {
  switch (kind) {
    case SpanKind::simply_supported: return SupportCondition::simply_supported;
    case SpanKind::end_span: return SupportCondition::one_end_continuous;
    case SpanKind::interior_span: return SupportCondition::both_ends_continuous;
    case SpanKind::cantilever: return SupportCondition::cantilever;
  }
  return SupportCondition::simply_supported;
}

const char* condition_name(SupportCondition c) {
  switch (c) {
    case SupportCondition::simply_supported: return "simply supported, ℓ/20";
    case SupportCondition::one_end_continuous: return "one end continuous, ℓ/24";
    case SupportCondition::both_ends_continuous: return "both ends continuous, ℓ/28";
    case SupportCondition::cantilever: return "cantilever, ℓ/10";
  }
  return "";
}

class Checker final : public SlabChecker {
 public:
  explicit Checker(const Request& req) : req_(req) {
    fc_ = *req.concrete.cylinder_strength_MPa;
    fy_ = req.reinforcement.yield_strength_MPa.value_or(default_fy);
    beta1_ = stress_block_factor_beta1(fc_);
    for (Face face : {Face::bottom, Face::top})
      exposure_[static_cast<std::size_t>(face)] = req.durability.face(face).exposure.value_or("interior");
    for (const auto& name : req.reinforcement.bars.value_or(default_bars)) {
      const Bar bar = *find_bar(name);
      bars_.push_back({name, bar.diameter_mm, bar.area_mm2});
    }
    if (req.fire.resistance_min)
      warnings_.push_back("fire resistance is not checked by this code: for US slabs it is set by "
                          "ACI/TMS 216.1, which armature does not implement");
  }

  LoadBasis load_basis() const override {
    LoadBasis basis;
    basis.density_kN_m3 = req_.concrete.density_kN_m3.value_or(default_density_kN_m3);
    basis.long_term_load_name = "sustained";  // ACI 318-19 24.2.4.1, Table 24.2.2
    return basis;
  }

  std::vector<Combination> combinations(const std::vector<Action>& actions,
                                        CombinationLabels labels) const override {
    return aci_combinations(actions, labels);
  }

  // Uplift at the back span's far support under the 5.3.1 combinations
  // with the live loads on the cantilever only (ACI 318-19 has no factor
  // below 1.2 on D without W or E: 0.9D of (f), (g) is not used).
  std::vector<Check> equilibrium_checks(const EquilibriumDemand& d, Detail detail) const override {
    std::vector<Check> out;
    RegionVerdict verdict;
    CheckCollector checks(out, verdict, detail == Detail::verdict ? Detail::checks : detail);
    run_check("equilibrium", [&] {
      checks.add("equilibrium", d.where, "ACI 318-19 5.3.1, L on the cantilever only", d.R_destabilising * 1e-3,
                 d.R_stabilising * 1e-3, "kN", [&] {
                   StepRecorder st;
                   st.add("R,stb", "reaction from the loads off the cantilever", "", d.R_stabilising * 1e-3, "kN",
                          "ACI 318-19 5.3.1");
                   st.add("R,dst", "reaction taken away by the cantilever's loads", "", d.R_destabilising * 1e-3, "kN",
                          "ACI 318-19 5.3.1");
                   st.add("R,min", "R,stb − R,dst under " + d.combination + " (negative: uplift)",
                          num(d.R_stabilising * 1e-3) + " − " + num(d.R_destabilising * 1e-3),
                          (d.R_stabilising - d.R_destabilising) * 1e-3, "kN", "ACI 318-19 5.3.1");
                   return st.take();
                 });
    });
    return out;
  }

  std::vector<std::vector<bool>> load_arrangements(std::size_t n) const override {
    // 6.4.3.2: (a) the span and alternate spans loaded, both ways; (b) the
    // two spans adjacent to each support loaded.
    auto out = alternate_span_arrangements(n);
    for (auto& a : adjacent_pair_arrangements(n)) out.push_back(std::move(a));
    return out;
  }

  double pinned_end_fixity_fraction() const override { return 0.0; }

  const std::vector<BarOption>& bar_options() const override { return bars_; }
  std::optional<BarOption> catalogue_bar(const std::string& designation) const override {
    const auto bar = find_bar(designation);
    if (!bar) return std::nullopt;
    return BarOption{designation, bar->diameter_mm, bar->area_mm2};
  }

  double max_spacing_mm(const RegionDemand&) const override {
    return max_flexural_bar_spacing(req_.slab.thickness_mm);
  }

  // Below this area the bar fails bending or minimum steel, as checked in
  // check_region: the larger of As,min (7.6.1.1) and the As,req of bending
  // at φ = 0.9 (φ never exceeds 0.9 and Mn grows with As below a = d);
  // no area passes when even a = d cannot carry Mu.
  double minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const override {
    const double h = req_.slab.thickness_mm, b = req_.slab.strip_width_mm;
    const double d = h - req_.durability.face(g.face).cover_mm.value_or(specified_cover(
                             exposure_of(g.face), std::max(bar.diameter_mm, g.cover_bar_mm))) -
                     bar.diameter_mm / 2.0;
    if (d <= 0.0) return 0.0;  // bending fails unless M_Ed = 0: left to the check
    const auto As_bending = required_flexural_steel(g.M_Ed, fc_, fy_, b, d);
    if (!As_bending) return std::numeric_limits<double>::infinity();
    return std::max(minimum_flexural_steel(b, h), *As_bending * (1.0 - 1e-9));  // a rounding margin
  }

  RegionOutcome check_region(const RegionDemand& g, const BarOption& bar, double s,
                             Detail detail) const override {
    RegionOutcome out;
    if (detail != Detail::verdict) out.checks.reserve(8);  // as many as a region has, nearly always
    CheckCollector checks(out.checks, out.verdict, detail);
    const double h = req_.slab.thickness_mm, b = req_.slab.strip_width_mm, db = bar.diameter_mm;
    const double As = bar.area_mm2 * b / s;
    // One cover per face: a computed cover is that of the largest bar the
    // kernel has chosen on this face, when larger than this one; a given
    // cover is checked against this bar's own requirement.
    const std::string& exposure = exposure_of(g.face);
    const auto& given_cover = req_.durability.face(g.face).cover_mm;
    const bool cover_given = given_cover.has_value();
    const double c_req = specified_cover(exposure, cover_given ? db : std::max(db, g.cover_bar_mm));
    const double cover = given_cover.value_or(c_req);
    auto cover_steps = [&] {
      StepRecorder st;
      const bool face_bar = !cover_given && g.cover_bar_mm > db;
      st.add("c",
             "Table 20.5.1.3.1 (" + exposure + ", bar " +
                 (face_bar ? "of " + num(g.cover_bar_mm) + " mm, the largest on this face)" : bar.designation + ")"),
             exposure + " (" + to_string(g.face) + " face)", c_req, "mm",
             "ACI 318-19 20.5.1.3.1");
      return st.take();
    };
    out.cover_mm = cover;
    out.d_mm = h - cover - db / 2.0;
    const double d = out.d_mm;
    out.As_min_mm2 = minimum_flexural_steel(b, h);
    if (d <= 0.0) {  // the bar does not fit: nothing can resist
      checks.add("bending", g.where, "ACI 318-19 22.2, 21.2.2", g.M_Ed * 1e-6, 0.0, "kNm", cover_steps);
      return out;
    }
    out.As_max_mm2 = steel_at_strain_limit(fc_, fy_, b, d);
    const auto As_root = required_flexural_steel(g.M_Ed, fc_, fy_, b, d);
    out.As_req_mm2 = As_root.value_or(0.85 * fc_ * b * d / fy_);
    const double a = stress_block_depth(As, fy_, fc_, b);
    const double c = a / beta1_;
    const double eps_t = net_tensile_strain(d, c);
    const double eps_ty = yield_strain(fy_);
    const double phi = strength_reduction_factor(eps_t, eps_ty);
    const double phi_Mn = phi * nominal_moment(As, fy_, d, a);

    const bool at_face = g.support_face.width_mm > 0.0;
    run_check("bending", [&] {
      checks.add("bending", g.where, at_face ? "ACI 318-19 22.2, 21.2.2; Mu at the face 7.4.1.3" : "ACI 318-19 22.2, 21.2.2",
                 g.M_Ed * 1e-6, phi_Mn * 1e-6, "kNm", [&] {
        StepRecorder st;
        if (at_face) {
          const SupportFace& f = g.support_face;
          const std::size_t i = governing_face_case(f);
          st.add("t", "breadth of the support (built integrally)", "", f.width_mm, "mm", "ACI 318-19 7.4.1.3");
          if (i < f.cases.size())
            st.add("Mu,c", "at the centreline, governing load case", "", f.cases[i].M_centre * 1e-6, "kNm",
                   "ACI 318-19 7.4.1.3");
          st.add("Mu", "at the face of support, t/2 from the centreline (larger side)", "", g.M_Ed * 1e-6, "kNm",
                 "ACI 318-19 7.4.1.3");
        }
        if (!cover_given)
          for (auto& x : cover_steps()) st.add(x.symbol, x.expression, x.substituted, x.result, x.unit, x.clause);
        st.add("d", "h − cover − db/2", num(h) + " − " + num(cover) + " − " + num(db) + "/2", d, "mm",
               "ACI 318-19 22.2");
        st.add("As,req", "(0.85 f'c b/fy)(d − √(d² − 2Mu/(0.9 × 0.85 f'c b)))",
               "Mu = " + num(g.M_Ed * 1e-6) + " kNm, f'c = " + num(fc_) + ", fy = " + num(fy_), out.As_req_mm2,
               "mm2", "ACI 318-19 22.2.2");
        st.add("As", "bar area × b/s", num(bar.area_mm2) + " × " + num(b) + "/" + num(s), As, "mm2", "");
        st.add("a", "As fy/(0.85 f'c b)",
               num(As) + " × " + num(fy_) + "/(0.85 × " + num(fc_) + " × " + num(b) + ")", a, "mm",
               "ACI 318-19 22.2.2.4.1");
        st.add("φ", "Table 21.2.2 from εt", "εt = " + num(eps_t) + ", εty = " + num(eps_ty), phi, "-",
               "ACI 318-19 21.2.2");
        st.add("φMn", "φ As fy (d − a/2)",
               num(phi) + " × " + num(As) + " × " + num(fy_) + " × (" + num(d) + " − " + num(a) + "/2)",
               phi_Mn * 1e-6, "kNm", "ACI 318-19 22.2");
        return st.take();
      });
    });
    run_check("ductility", [&] {
      const double eps_min = slab_min_net_tensile_strain(fy_);
      checks.add("ductility", g.where, "ACI 318-19 7.3.3.1, 21.2.2", eps_min, As_root ? eps_t : 0.0, "-", [&] {
                   StepRecorder st;
                   st.add("εty", "fy/Es", num(fy_) + "/" + num(steel_modulus_MPa), eps_ty, "-",
                          "ACI 318-19 21.2.2.1");
                   st.add("εt,min", "εty + 0.003 (slab tension-controlled)", num(eps_ty) + " + 0.003", eps_min, "-",
                          "ACI 318-19 7.3.3.1, Table 21.2.2");
                   st.add("β1", "Table 22.2.2.4.3", "f'c = " + num(fc_), beta1_, "-", "ACI 318-19 22.2.2.4.3");
                   st.add("c", "a/β1", num(a) + "/" + num(beta1_), c, "mm", "ACI 318-19 22.2.2.4.2");
                   st.add("εt", "0.003 (d − c)/c", "0.003 × (" + num(d) + " − " + num(c) + ")/" + num(c), eps_t,
                          "-", "ACI 318-19 22.2.1.2");
                   st.add("As,max", "0.85 f'c b β1 c_lim/fy, c_lim = 0.003 d/(0.003 + εt,min)",
                          "f'c = " + num(fc_) + ", b = " + num(b) + ", β1 = " + num(beta1_) + ", d = " + num(d) +
                              ", fy = " + num(fy_),
                          out.As_max_mm2, "mm2", "ACI 318-19 7.3.3.1");
                   if (!As_root)
                     st.add("As,req", "no real root: the section cannot reach Mu with φ = 0.9",
                            num(g.M_Ed * 1e-6), 0.0, "mm2", "ACI 318-19 22.2.2");
                   return st.take();
                 });
    });
    run_check("min_steel", [&] {
      checks.add("min_steel", g.where, "ACI 318-19 7.6.1.1", out.As_min_mm2, As, "mm2", [&] {
        StepRecorder st;
        st.add("As,min", "0.0018 Ag", "0.0018 × " + num(b) + " × " + num(h), out.As_min_mm2, "mm2",
               "ACI 318-19 7.6.1.1");
        return st.take();
      });
    });
    // The bar search needs no more once an arrangement has failed: bending
    // and minimum steel (its fallback) are known by now.
    if (checks.verdict_settled()) return out;
    run_check("spacing", [&] {
      const double s_max = max_flexural_bar_spacing(h);
      checks.add("spacing", g.where, "ACI 318-19 7.7.2.3", s, s_max, "mm", [&] {
        StepRecorder st;
        st.add("s_max", "min(3h, 450)", "min(3 × " + num(h) + ", 450)", s_max, "mm", "ACI 318-19 7.7.2.3");
        return st.take();
      });
      const double dagg = req_.concrete.aggregate_mm;
      const double clear_min = minimum_clear_bar_spacing(db, dagg);
      checks.add("spacing", g.where, "ACI 318-19 25.2.1", clear_min, s - db, "mm", [&] {
        StepRecorder st;
        st.add("s_clear,min", "max(25 mm, db, 4/3 dagg)",
               "max(25, " + num(db) + ", 4/3 × " + num(dagg) + ")", clear_min, "mm", "ACI 318-19 25.2.1");
        st.add("s_clear", "s − db", num(s) + " − " + num(db), s - db, "mm", "ACI 318-19 25.2.1");
        return st.take();
      });
    });
    run_check("cracking", [&] {
      const double fs = service_steel_stress(fy_);
      const double s_crack = crack_control_spacing(fs, cover);
      checks.add("cracking", g.where, "ACI 318-19 24.3.2", s, s_crack, "mm", [&] {
        StepRecorder st;
        st.add("fs", "2/3 fy", "2/3 × " + num(fy_), fs, "MPa", "ACI 318-19 24.3.2.1");
        st.add("s", "min(380 (280/fs) − 2.5 cc, 300 (280/fs))",
               "min(380 × 280/" + num(fs) + " − 2.5 × " + num(cover) + ", 300 × 280/" + num(fs) + ")", s_crack,
               "mm", "ACI 318-19 24.3.2");
        return st.take();
      });
    });
    if (cover_given)
      run_check("cover", [&] { checks.add("cover", g.where, "ACI 318-19 20.5.1.3.1", c_req, cover, "mm", cover_steps); });
    if (!g.span_where.empty()) {
      CheckCollector span(out.span_checks, out.verdict, detail);
      run_check("deflection", [&] {
        const SupportCondition cond = condition_of(g.span_kind);
        const double h_min = minimum_slab_thickness(g.span_mm, cond, fy_);
        span.add("deflection", g.span_where, "ACI 318-19 7.3.1.1", h_min, h, "mm", [&] {
          StepRecorder st;
          st.add("h_min", std::string("Table 7.3.1.1: ") + condition_name(cond) + ", × (0.4 + fy/700)",
                 "ℓ = " + num(g.span_mm) + ", fy = " + num(fy_), h_min, "mm", "ACI 318-19 7.3.1.1");
          return st.take();
        });
      });
    }
    for (const auto& sup : g.supports) {
      SupportOutcome so;
      so.where = sup.where;
      so.V_Ed = sup.V_Ed;
      CheckCollector support(so.checks, out.verdict, detail);
      run_check("shear", [&] {
        const double rho_w = As / (b * d);
        const double ls = size_effect_factor(d);
        const double Vc = one_way_shear_strength(ls, lambda_normal_weight, rho_w, fc_, b, d);
        so.V_Rd = shear_strength_reduction * Vc;
        support.add("shear", sup.where, "ACI 318-19 22.5.5.1", sup.V_Ed * 1e-3, so.V_Rd * 1e-3, "kN", [&] {
          StepRecorder st;
          st.add("λs", "√(2/(1 + 0.004 d)) ≤ 1", "d = " + num(d), ls, "-", "ACI 318-19 22.5.5.1.3");
          st.add("ρw", "As/(b d)", num(As) + "/(" + num(b) + " × " + num(d) + ")", rho_w, "-",
                 "ACI 318-19 22.5.5.1");
          st.add("Vc", "0.66 λs λ ρw^(1/3) √f'c b d ≤ 0.42 λ √f'c b d",
                 "λs = " + num(ls) + ", √f'c = " + num(std::min(std::sqrt(fc_), 8.3)), Vc * 1e-3, "kN",
                 "ACI 318-19 22.5.5.1");
          st.add("φVc", "0.75 Vc", "0.75 × " + num(Vc * 1e-3), so.V_Rd * 1e-3, "kN", "ACI 318-19 21.2.1");
          return st.take();
        });
      });
      if (detail != Detail::verdict) out.supports.push_back(std::move(so));  // the search needs only the verdict
    }
    return out;
  }

  std::vector<Check> span_checks(const std::string&) const override { return {}; }

  DistributionNeed distribution(double) const override {
    return {shrinkage_temperature_steel(req_.slab.strip_width_mm, req_.slab.thickness_mm),
            max_shrinkage_bar_spacing(req_.slab.thickness_mm)};
  }

  std::vector<std::string> warnings() const override { return warnings_; }

  std::vector<InputDefault> defaults_used() const override {
    std::string bars;
    for (const auto& bar : bars_) bars += (bars.empty() ? "" : ", ") + bar.designation;
    std::vector<InputDefault> out{
        {"concrete.density_kN_m3", num(req_.concrete.density_kN_m3.value_or(default_density_kN_m3)) + " kN/m³",
         "150 lb/ft³ normal-weight concrete, common practice"},
        {"concrete.aggregate_mm", num(req_.concrete.aggregate_mm) + " mm", "armature default (25.2.1)"},
        {"reinforcement.yield_strength_MPa", num(fy_) + " MPa", "Grade 420 (Grade 60), plug-in default"},
        {"reinforcement.bars", bars, "plug-in default set"},
    };
    for (auto& d : durability_defaults(req_, {exposure_of(Face::bottom), exposure_of(Face::top)},
                                       "plug-in default (not exposed to weather or ground)",
                                       "from the exposure and each bar (see the bending steps)",
                                       "ACI 318-19 20.5.1.3.1"))
      out.push_back(std::move(d));
    return out;
  }

  // 7.4.1.3 (from memory): for slabs built integrally with supports, Mu at
  // the support may be taken at the face of support. A support given a
  // width is taken as built integrally (a slab resting on a wall that is
  // not should be given no width there).
  double support_design_moment(const RegionDemand& g) const override {
    const SupportFace& f = g.support_face;
    const std::size_t i = governing_face_case(f);
    return i < f.cases.size() ? f.cases[i].M_face : f.M_centre;
  }

 private:
  // The load case with the largest moment at a face (cases.size() when none).
  static std::size_t governing_face_case(const SupportFace& f) {
    std::size_t best = f.cases.size();
    for (std::size_t i = 0; i < f.cases.size(); ++i)
      if (best == f.cases.size() || f.cases[i].M_face > f.cases[best].M_face) best = i;
    return best;
  }
  const std::string& exposure_of(Face face) const { return exposure_[static_cast<std::size_t>(face)]; }

  const Request& req_;  // kept alive by the caller of Code::begin
  double fc_ = 0.0, fy_ = 0.0, beta1_ = 0.0;
  std::array<std::string, 2> exposure_;  // by Face
  std::vector<BarOption> bars_;
  std::vector<std::string> warnings_;
};

class Code final : public DesignCode {
 public:
  CodeIdentity identity() const override {
    return {code_id, variant_name, "ACI 318-19, SI units"};
  }

  void validate(const Request& req, InputProblems& problems) const override {
    if (req.concrete.strength_class)
      problems.add("concrete.class", "ACI 318-19 specifies concrete by f'c: give "
                                     "concrete.cylinder_strength_MPa instead");
    if (const auto& fc = req.concrete.cylinder_strength_MPa; fc && (*fc < 17 || *fc > 100))
      problems.add("concrete.cylinder_strength_MPa",
                   "must be between 17 and 100 MPa (ACI 318-19 19.2.1.1), got " + num(*fc));
    if (const auto& fy = req.reinforcement.yield_strength_MPa; fy && (*fy < 280 || *fy > 550))
      problems.add("reinforcement.yield_strength_MPa",
                   "must be between 280 and 550 MPa (ACI 318-19 20.2.2.4), got " + num(*fy));
    double smallest_bar = 9.5;
    if (req.reinforcement.bars) {
      smallest_bar = 1e9;
      const auto& bars = *req.reinforcement.bars;
      for (std::size_t i = 0; i < bars.size(); ++i) {
        if (auto bar = find_bar(bars[i]))
          smallest_bar = std::min(smallest_bar, bar->diameter_mm);
        else
          problems.add("reinforcement.bars[" + std::to_string(i) + "]",
                       "unknown bar '" + bars[i] + "'; ACI 318 bars are #3 to #11 (or No.10 to No.36)");
      }
    }
    for (Face face : {Face::bottom, Face::top}) {
      const FaceDurability& fd = req.durability.face(face);
      if (face == Face::top && fd.exposure_field == req.durability.face(Face::bottom).exposure_field)
        continue;  // the plain form, judged once
      if (fd.exposure && !is_exposure(*fd.exposure))
        problems.add(fd.exposure_field,
                     "unknown exposure '" + *fd.exposure + "'; ACI 318 uses interior, weather or ground");
    }
    // Bars given in check mode: any bar of the catalogue, whether or not
    // it is a candidate of the search.
    for (std::size_t i = 0; i < req.reinforcement.given.size(); ++i) {
      const std::string& bar = req.reinforcement.given[i].bar;
      if (!bar.empty() && !find_bar(bar))
        problems.add("reinforcement.given[" + std::to_string(i) + "].bar",
                     "unknown bar '" + bar + "'; ACI 318 bars are #3 to #11 (or No.10 to No.36)");
    }
    if (smallest_bar < 1e9) add_cover_fit_problems(req, smallest_bar, problems);
    if (req.design.combination)
      problems.add("design.combination", "ACI 318-19 has no choice of combination rule (5.3.1 "
                                         "applies); remove the field");
    if (req.design.redistribution_percent > 0.0)
      problems.add("design.redistribution_percent",
                   "moment redistribution is not implemented for ACI 318-19; the largest allowed "
                   "value is 0");
  }

  std::unique_ptr<SlabChecker> begin(const Request& req) const override {
    return std::make_unique<Checker>(req);
  }
};

class Factory final : public CodeFactory {
 public:
  std::string id() const override { return code_id; }
  std::string title() const override { return "Building Code Requirements for Structural Concrete (SI)"; }
  std::string edition() const override { return "ACI 318-19"; }
  std::vector<std::string> variants() const override { return {variant_name}; }
  std::string default_variant() const override { return variant_name; }
  std::shared_ptr<const DesignCode> make(const std::string& variant, const CodeHost&) const override {
    if (variant != variant_name) throw std::invalid_argument("no ACI 318-19 variant '" + variant + "'");
    return std::make_shared<Code>();
  }
};

std::unique_ptr<CodeFactory> create_factory(const PluginContext&) { return std::make_unique<Factory>(); }

}  // namespace

const PluginEntry* plugin_entry() {
  static const PluginEntry entry{plugin_abi_version, &create_factory};
  return &entry;
}

}  // namespace armature::aci318

ARMATURE_CODE_PLUGIN(armature::aci318::plugin_entry)
