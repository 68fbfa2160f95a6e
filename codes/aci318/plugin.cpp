// The ACI 318-19 (SI) code plug-in for one-way solid slabs. This file holds
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

namespace armature::aci318 {

namespace {

constexpr const char* code_id = "ACI318-19";
constexpr const char* variant_name = "SI";
const std::vector<std::string> default_bars{"#3", "#4", "#5", "#6", "#7", "#8"};
constexpr double default_density_kN_m3 = 23.6;  // 150 lb/ft³ (common practice)
constexpr double default_fy = 420.0;             // Grade 60

}  // namespace

Checker::Checker(const Request& req) : req_(req) {
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

LoadBasis Checker::load_basis() const {
  LoadBasis basis;
  basis.density_kN_m3 = req_.concrete.density_kN_m3.value_or(default_density_kN_m3);
  basis.long_term_load_name = "sustained";  // ACI 318-19 24.2.4.1, Table 24.2.2
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


std::optional<BarOption> Checker::catalogue_bar(const std::string& designation) const {
  const auto bar = find_bar(designation);
  if (!bar) return std::nullopt;
  return BarOption{designation, bar->diameter_mm, bar->area_mm2};
}

std::vector<std::string> Checker::warnings() const { return warnings_; }

std::vector<InputDefault> Checker::defaults_used() const {
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

namespace {

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

