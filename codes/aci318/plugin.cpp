// The ACI 318-19 code plug-in for one-way solid slabs, in two variants:
// SI (the SI edition) and US (the in-lb edition, us_customary.hpp). This file holds
// the Code, its validation, the entry point, and the parts of the checker
// that are neither section nor member checks: materials, loads, bars,
// defaults.
#include <algorithm>
#include <memory>
#include <stdexcept>
#include <string>

#include "armature/plugin.hpp"
#include "checker.hpp"
#include "combinations.hpp"
#include "us_customary.hpp"

namespace armature::aci318 {

namespace {

constexpr const char* code_id = "ACI318-19";
constexpr const char* variant_si = "SI";
constexpr const char* variant_us = "US";
const std::vector<std::string> default_bars{"#3", "#4", "#5", "#6", "#7", "#8"};
const std::vector<std::string> default_bars_us{"#4", "#5", "#6"};  // common practice for slabs
constexpr double default_density_kN_m3 = 23.6;  // 150 lb/ft³ (common practice)
constexpr double default_fy = 420.0;             // Grade 60
// The US variant's defaults, exactly in kernel units.
constexpr double default_density_us_kN_m3 =
    inch_pound::normalweight_density_pcf * N_per_lbf / (m_per_ft * m_per_ft * m_per_ft) * 1e-3;
constexpr double default_fy_us = inch_pound::grade_60_psi * MPa_per_psi;

// A bar of the variant's catalogue, in kernel units: the SI variant takes
// either name of its metric-converted bars, the US variant the inch-pound
// numbers with their nominal in-lb dimensions.
std::optional<BarOption> variant_bar(const std::string& name, bool us) {
  if (us) {
    const auto bar = inch_pound::find_bar(name);
    if (!bar) return std::nullopt;
    return BarOption{name, bar->diameter_in * mm_per_in, bar->area_in2 * mm_per_in * mm_per_in};
  }
  const auto bar = find_bar(name);
  if (!bar) return std::nullopt;
  return BarOption{name, bar->diameter_mm, bar->area_mm2};
}

// The kernel's fields under the US variant: a 12 in design strip, bars
// from 3 in at half-inch steps, records in US units (common practice).
PracticeDefaults us_practice_defaults() {
  PracticeDefaults p;
  p.strip_width_mm = inch_pound::design_strip_in * mm_per_in;
  p.spacing_step_mm = inch_pound::spacing_step_in * mm_per_in;
  p.min_spacing_mm = inch_pound::first_spacing_in * mm_per_in;
  p.aggregate_mm = inch_pound::aggregate_in * mm_per_in;
  p.cylinder_strength_MPa = inch_pound::default_fc_psi * MPa_per_psi;
  p.report_units = ReportUnits::US;
  return p;
}

}  // namespace

Checker::Checker(const Request& req, bool us) : req_(req), us_(us) {
  fc_ = *req.concrete.cylinder_strength_MPa;
  fy_ = req.reinforcement.yield_strength_MPa.value_or(us ? default_fy_us : default_fy);
  beta1_ = us ? inch_pound::stress_block_factor_beta1(fc_ / MPa_per_psi) : stress_block_factor_beta1(fc_);
  for (Face face : {Face::bottom, Face::top})
    exposure_[static_cast<std::size_t>(face)] = req.durability.face(face).exposure.value_or("interior");
  for (const auto& name : req.reinforcement.bars.value_or(us ? default_bars_us : default_bars))
    bars_.push_back(*variant_bar(name, us));
  if (req.slab_type == SlabType::flat)
    warnings_.push_back("ACI 318-19 8.6.1.2 (the least flexural steel over bslab at a column where the shear stress "
                        "vuv is high) is not checked: check it at the columns");
  if (req.fire.resistance_min)
    warnings_.push_back("fire resistance is not checked by this code: for US slabs it is set by "
                        "ACI/TMS 216.1, which armature does not implement");
}

LoadBasis Checker::load_basis() const {
  LoadBasis basis;
  basis.density_kN_m3 = req_.concrete.density_kN_m3.value_or(us_ ? default_density_us_kN_m3 : default_density_kN_m3);
  basis.long_term_load_name = "sustained";  // ACI 318-19 24.2.4.1, Table 24.2.2
  // The names of 5.3.1 (D, L, Lr, S); imposed actions of category H are Lr.
  basis.permanent_load_name = "D (self-weight + superimposed dead)";
  basis.variable_load_name = "L, Lr, S (live, roof live, snow)";
  basis.action_kind_names = {"D (dead)", "L (live)", "S (snow)", "Lr (roof live)"};
  return basis;
}

std::vector<Combination> Checker::combinations(const std::vector<Action>& actions,
                                               CombinationLabels labels) const {
  return aci_combinations(actions, labels);
}

std::vector<std::vector<bool>> Checker::load_arrangements(std::size_t n) const {
  // 6.4.3.2: (a) the span and alternate spans loaded, both ways; (b) the
  // two spans adjacent to each support loaded.
  auto out = alternate_span_arrangements(n);
  for (auto& a : adjacent_pair_arrangements(n)) out.push_back(std::move(a));
  return out;
}


// 6.4.3.2 for two-way slabs (from memory): with L > 0.75 D, 75 % of the
// factored live load on the panel and alternate panels (the two
// checkerboards) and on the panels adjacent to each support line; the
// moments are not taken less than with the full factored live load on
// every panel (6.4.3.3), which is always an arrangement. L and D are the
// characteristic loads uniform over the whole slab; a live load placed in
// plan (a patch, line or point) has no such intensity to compare, so the
// patterns are taken whenever there is one (on the safe side).
std::vector<BayArrangement> Checker::bay_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                           const std::vector<Action>& actions) const {
  std::vector<BayArrangement> out{{all_bays_loaded(bays_x, bays_y), 1.0}};
  double D = 0.0, L = 0.0;
  bool located_live = false;  // a live load placed in plan has no intensity over the slab to compare
  for (const auto& a : actions) {
    if (a.kind == ActionKind::imposed && (a.distribution != Distribution::uniform || a.plan_mm || a.span))
      located_live = true;
    if (a.distribution != Distribution::uniform || a.plan_mm || a.span) continue;
    if (a.kind == ActionKind::permanent) D += a.value;
    else if (a.kind == ActionKind::imposed) L += a.value;
  }
  if (!located_live && !two_way_pattern_loading_required(L, D)) return out;
  for (auto& a : checkerboard_bay_arrangements(bays_x, bays_y))
    out.push_back({std::move(a), two_way_pattern_live_fraction});
  for (auto& a : adjacent_bays_across_lines(bays_x, bays_y))
    out.push_back({std::move(a), two_way_pattern_live_fraction});
  return out;
}

// 6.4.3.2 for a flat slab: as for two-way slabs, and with L > 0.75 D the
// panel and alternate panels of each frame loaded across the whole width
// at 75 % of the factored live load.
std::vector<BayArrangement> Checker::flat_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                            const std::vector<Action>& actions) const {
  auto out = bay_load_arrangements(bays_x, bays_y, actions);
  if (out.size() == 1) return out;  // L ≤ 0.75 D: every panel at the full live load only
  for (auto& a : alternate_bay_strips(bays_x, bays_y)) out.push_back({std::move(a), two_way_pattern_live_fraction});
  return out;
}

std::optional<BarOption> Checker::catalogue_bar(const std::string& designation) const {
  return variant_bar(designation, us_);
}

std::vector<std::string> Checker::warnings() const {
  std::vector<std::string> out = warnings_;
  // 7.3.1.1 (value from memory): the minimum thicknesses are for slabs not
  // supporting or attached to partitions likely to be damaged by large
  // deflections.
  if (req_.serviceability.partitions && req_.serviceability.deflection_method() == DeflectionMethod::span_depth)
    out.push_back("serviceability.partitions is true, but the minimum thickness of ACI 318-19 Table 7.3.1.1 is "
                  "for slabs not supporting or attached to partitions likely to be damaged by large deflections: "
                  "give serviceability.deflection \"calculated\" or \"both\" (24.2, Table 24.2.2 ℓ/480)");
  return out;
}

std::vector<InputDefault> Checker::defaults_used() const {
  std::string bars;
  for (const auto& bar : bars_) bars += (bars.empty() ? "" : ", ") + bar.designation;
  if (us_) {
    const PracticeDefaults practice = us_practice_defaults();
    std::vector<InputDefault> out{
        {"concrete.cylinder_strength_MPa", num(fc_ / MPa_per_psi) + " psi", "US variant default, common practice"},
        {"concrete.density_kN_m3", num(inch_pound::normalweight_density_pcf) + " pcf",
         "normalweight concrete, common practice"},
        {"concrete.aggregate_mm", num(req_.concrete.aggregate_mm / mm_per_in) + " in",
         "3/4 in nominal maximum size, US variant, common practice (25.2.1)"},
        {"reinforcement.yield_strength_MPa", num(fy_ / MPa_per_psi / 1000.0) + " ksi", "Grade 60, plug-in default"},
        {"reinforcement.bars", bars, "plug-in default set for slabs (US variant)"},
        {"slab.strip_width_mm", num(practice.strip_width_mm / mm_per_in) + " in", "a foot of slab (US variant)"},
        {"reinforcement.min_spacing_mm", num(practice.min_spacing_mm / mm_per_in) + " in",
         "US variant, common practice"},
        {"reinforcement.spacing_step_mm", num(practice.spacing_step_mm / mm_per_in) + " in",
         "half-inch steps, US variant, common practice"},
        {"report_units", "US", "US variant"},
    };
    for (auto& d : durability_defaults(req_, {exposure_of(Face::bottom), exposure_of(Face::top)},
                                       "plug-in default (not exposed to weather or ground)",
                                       "from the exposure and each bar (see the bending steps)",
                                       "ACI 318-19 20.5.1.3.1 (in-lb)"))
      out.push_back(std::move(d));
    return out;
  }
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

namespace {

// Why a bar name is refused under a variant.
std::string unknown_bar_message(const std::string& name, bool us) {
  if (us && find_bar(name))
    return "'" + name + "' is a bar of the SI variant; the US variant (inch-pound bars) takes #3 to #11";
  return us ? "unknown bar '" + name + "'; ACI 318 inch-pound bars are #3 to #11"
            : "unknown bar '" + name + "'; ACI 318 bars are #3 to #11 (or No.10 to No.36)";
}

// The calculated deflection (24.2): the creep and shrinkage inputs are
// EN's (24.2.4 takes ξ of Table 24.2.4.1.3 instead): refused, not ignored.
void add_deflection_input_problems(const Request& req, InputProblems& problems) {
  const auto& s = req.serviceability;
  const std::pair<const char*, bool> keys[] = {
      {"creep_coefficient", s.creep_coefficient.has_value()},
      {"shrinkage_strain", s.shrinkage_strain.has_value()},
      {"relative_humidity_percent", s.relative_humidity_percent.has_value()},
      {"age_at_loading_days", s.age_at_loading_days.has_value()},
      {"partitions_age_days", s.partitions_age_days.has_value()},
      {"cement_class", s.cement_class.has_value()}};
  for (const auto& [key, given] : keys)
    if (given)
      problems.add(std::string("serviceability.") + key,
                   "is not used by ACI 318-19, whose long-term deflection takes ξ of Table 24.2.4.1.3 "
                   "(24.2.4.1); leave the field out");
}

class Code final : public DesignCode {
 public:
  explicit Code(bool us) : us_(us) {}

  CodeIdentity identity() const override {
    return us_ ? CodeIdentity{code_id, variant_us, "ACI 318-19, inch-pound units (US customary)"}
               : CodeIdentity{code_id, variant_si, "ACI 318-19, SI units"};
  }

  PracticeDefaults practice_defaults() const override { return us_ ? us_practice_defaults() : PracticeDefaults{}; }

  void validate(const Request& req, InputProblems& problems) const override {
    if (req.concrete.strength_class)
      problems.add("concrete.class", "ACI 318-19 specifies concrete by f'c: give "
                                     "concrete.cylinder_strength_MPa instead");
    const auto& fc = req.concrete.cylinder_strength_MPa;
    const auto& fy = req.reinforcement.yield_strength_MPa;
    if (us_) {
      // 19.2.1.1: f'c at least 2500 psi; 20.2.2.4: Grades 40 to 80 (in-lb).
      if (fc && (*fc < 2500 * MPa_per_psi * (1 - 1e-9) || *fc > 15000 * MPa_per_psi * (1 + 1e-9)))
        problems.add("concrete.cylinder_strength_MPa", "must be between 2500 and 15 000 psi (ACI 318-19 "
                                                       "19.2.1.1), got " + num(*fc / MPa_per_psi) + " psi");
      if (fy && (*fy < 40000 * MPa_per_psi * (1 - 1e-9) || *fy > 80000 * MPa_per_psi * (1 + 1e-9)))
        problems.add("reinforcement.yield_strength_MPa", "must be between 40 and 80 ksi (ACI 318-19 "
                                                         "20.2.2.4), got " + num(*fy / MPa_per_psi / 1000) + " ksi");
    } else {
      if (fc && (*fc < 17 || *fc > 100))
        problems.add("concrete.cylinder_strength_MPa",
                     "must be between 17 and 100 MPa (ACI 318-19 19.2.1.1), got " + num(*fc));
      if (fy && (*fy < 280 || *fy > 550))
        problems.add("reinforcement.yield_strength_MPa",
                     "must be between 280 and 550 MPa (ACI 318-19 20.2.2.4), got " + num(*fy));
    }
    // 24.3.2 controls cracking by the spacing of the bars: the code gives no
    // crack width to calculate.
    if (req.serviceability.crack_width == CrackWidthMethod::calculated)
      problems.add("serviceability.crack_width",
                   "ACI 318-19 controls cracking by bar spacing (24.3.2) and gives no crack width to "
                   "calculate: give \"tables\" or leave the field out");
    add_deflection_input_problems(req, problems);
    double smallest_bar = us_ ? 0.375 * mm_per_in : 9.5;
    if (req.reinforcement.bars) {
      smallest_bar = 1e9;
      const auto& bars = *req.reinforcement.bars;
      for (std::size_t i = 0; i < bars.size(); ++i) {
        if (auto bar = variant_bar(bars[i], us_))
          smallest_bar = std::min(smallest_bar, bar->diameter_mm);
        else
          problems.add("reinforcement.bars[" + std::to_string(i) + "]", unknown_bar_message(bars[i], us_));
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
      if (!bar.empty() && !variant_bar(bar, us_))
        problems.add("reinforcement.given[" + std::to_string(i) + "].bar", unknown_bar_message(bar, us_));
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
    return std::make_unique<Checker>(req, us_);
  }

 private:
  bool us_;
};

class Factory final : public CodeFactory {
 public:
  std::string id() const override { return code_id; }
  std::string title() const override { return "Building Code Requirements for Structural Concrete"; }
  std::string edition() const override { return "ACI 318-19"; }
  std::vector<std::string> variants() const override { return {variant_si, variant_us}; }
  std::string default_variant() const override { return variant_si; }
  std::vector<std::string> slab_types() const override { return {"one_way", "two_way", "flat"}; }
  std::shared_ptr<const DesignCode> make(const std::string& variant, const CodeHost&) const override {
    if (variant != variant_si && variant != variant_us)
      throw std::invalid_argument("no ACI 318-19 variant '" + variant + "'");
    return std::make_shared<Code>(variant == variant_us);
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

