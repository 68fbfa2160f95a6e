// Example house rules over EN 1992-1-1 with the UK National Annex. The
// plug-in opens EN 1992 (UK) through the registry and wraps it: every EN
// check stays as EN computes it, and the house tightens or adds:
//   HR-1  allowed span/depth ratio × 0.9
//   HR-2  bar spacing ≤ 200 mm
//   HR-3  slab thickness ≥ 175 mm (acoustic separation between floors)
//   HR-4  nominal cover ≥ 30 mm
// No EN 1992 rule is copied here.
#include <algorithm>
#include <string>

#include <armature/plugin.hpp>
#include <armature/steps.hpp>

namespace house {
namespace {
using namespace armature;

constexpr const char* code_id = "HOUSE-RULES";
constexpr const char* variant_name = "EN1992-UK";
constexpr double deflection_factor = 0.9;  // HR-1
constexpr double max_spacing = 200.0;      // HR-2, mm
constexpr double min_thickness = 175.0;    // HR-3, mm
constexpr double min_cover = 30.0;         // HR-4, mm

Check scaled_deflection(Check c) {
  const double allowed = c.capacity * deflection_factor;
  std::vector<Step> steps = std::move(c.steps);
  steps.push_back({"l/d allowed (house)", "EN allowed l/d × 0.9", step_number(c.capacity) + " × 0.9",
                   allowed, "-", "house rule HR-1"});
  return make_check(c.id, c.where, c.clause + "; house rule HR-1", c.demand, allowed, c.unit,
                    std::move(steps));
}

class Checker final : public SlabChecker {
 public:
  // EN's checkers may refer to their requests: the request with the house
  // cover is kept here, beside the checker made for it.
  Checker(const DesignCode& en, const Request& req) : req_(req), inner_(en.begin(req)) {
    if (!req.durability.cover_given(Face::bottom) || !req.durability.cover_given(Face::top)) {
      with_min_cover_ = req;
      for (auto& face : with_min_cover_.durability.faces)
        if (!face.cover_mm) face.cover_mm = min_cover;
      min_cover_ = en.begin(with_min_cover_);
    }
  }

  LoadBasis load_basis() const override { return inner_->load_basis(); }
  std::vector<Combination> combinations(const std::vector<Action>& actions,
                                        CombinationLabels labels) const override {
    return inner_->combinations(actions, labels);
  }
  std::vector<Check> equilibrium_checks(const EquilibriumDemand& d, Detail detail) const override {
    return inner_->equilibrium_checks(d, detail);
  }
  std::vector<std::vector<bool>> load_arrangements(std::size_t n) const override {
    return inner_->load_arrangements(n);
  }
  double pinned_end_fixity_fraction() const override { return inner_->pinned_end_fixity_fraction(); }
  const std::vector<BarOption>& bar_options() const override { return inner_->bar_options(); }
  std::optional<BarOption> catalogue_bar(const std::string& designation) const override {
    return inner_->catalogue_bar(designation);
  }
  double max_spacing_mm(const RegionDemand& g) const override {
    return std::min(inner_->max_spacing_mm(g), max_spacing);
  }

  // EN's minimum steel, at the depth of whichever cover HR-4 leads to:
  // the lesser of the two is a floor for both.
  double minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const override {
    const double own = inner_->minimum_area_mm2(g, bar);
    return min_cover_ ? std::min(own, min_cover_->minimum_area_mm2(g, bar)) : own;
  }

  double support_design_moment(const RegionDemand& g) const override { return inner_->support_design_moment(g); }

  RegionOutcome check_region(const RegionDemand& g, const BarOption& bar, double s,
                             Detail detail) const override {
    // The house changes EN's checks, so it always asks for them.
    const Detail inner_detail = detail == Detail::steps ? Detail::steps : Detail::checks;
    RegionOutcome out = inner_->check_region(g, bar, s, inner_detail);
    // HR-4: where EN's own cover is less than 30 mm, design with 30 mm
    // given (EN then checks that 30 mm meets its own minimum).
    if (min_cover_ && out.cover_mm < min_cover)
      out = min_cover_->check_region(g, bar, s, inner_detail);
    for (auto& c : out.span_checks)
      if (c.id == "deflection") c = scaled_deflection(std::move(c));
    out.checks.push_back(run_check("spacing", [&] {
      return make_check("spacing", g.where, "house rule HR-2", s, max_spacing, "mm",
                        {{"s_max", "house limit", "", max_spacing, "mm", "house rule HR-2"}});
    }));
    out.checks.push_back(run_check("cover", [&] {
      return make_check("cover", g.where, "house rule HR-4", min_cover, out.cover_mm, "mm",
                        {{"c_nom,min", "house minimum", "", min_cover, "mm", "house rule HR-4"}});
    }));
    out.verdict = verdict_of(out);
    return out;
  }

  std::vector<Check> span_checks(const std::string& span) const override {
    auto out = inner_->span_checks(span);
    out.push_back(run_check("acoustic_thickness", [&] {
      return make_check("acoustic_thickness", span, "house rule HR-3", min_thickness,
                        req_.slab.thickness_mm, "mm",
                        {{"h_min", "house minimum for acoustic separation", "", min_thickness, "mm",
                          "house rule HR-3"}});
    }));
    return out;
  }

  DistributionNeed distribution(double main_As) const override {
    auto need = inner_->distribution(main_As);
    need.max_spacing_mm = std::min(need.max_spacing_mm, max_spacing);
    return need;
  }

  std::vector<std::string> warnings() const override { return inner_->warnings(); }

  // EN's defaults, with HR-4's floor on a cover the request leaves out.
  std::vector<InputDefault> defaults_used() const override {
    auto out = inner_->defaults_used();
    for (auto& d : out)
      if (d.field == "durability.cover_mm")
        d = {d.field, "EN's c_nom, at least " + step_number(min_cover) + " mm", "house rule HR-4"};
    return out;
  }

 private:
  const Request& req_;        // kept alive by the caller of Code::begin
  Request with_min_cover_;    // req_ with HR-4's cover, when req_ gives none
  std::unique_ptr<SlabChecker> inner_, min_cover_;
};

class Code final : public DesignCode {
 public:
  explicit Code(std::shared_ptr<const DesignCode> en) : en_(std::move(en)) {}

  CodeIdentity identity() const override {
    return {code_id, variant_name, "House rules HR-1 to HR-4 over " + en_->identity().title};
  }

  void validate(const Request& req, InputProblems& problems) const override {
    en_->validate(req, problems);
  }

  std::unique_ptr<SlabChecker> begin(const Request& req) const override {
    return std::make_unique<Checker>(*en_, req);
  }

  PracticeDefaults practice_defaults() const override { return en_->practice_defaults(); }

 private:
  std::shared_ptr<const DesignCode> en_;
};

class Factory final : public CodeFactory {
 public:
  std::string id() const override { return code_id; }
  std::string title() const override { return "Example house rules over EN 1992-1-1 (UK)"; }
  std::string edition() const override { return "house rules, issue 1"; }
  std::vector<std::string> variants() const override { return {variant_name}; }
  std::string default_variant() const override { return variant_name; }
  std::shared_ptr<const DesignCode> make(const std::string& variant, const CodeHost& host) const override {
    if (variant != variant_name) throw std::invalid_argument("no house-rules variant '" + variant + "'");
    return std::make_shared<Code>(host.open("EN1992-1-1", "UK"));
  }
};

std::unique_ptr<CodeFactory> create(const PluginContext&) { return std::make_unique<Factory>(); }
}  // namespace

const PluginEntry* entry() {
  static const PluginEntry e{plugin_abi_version, &create};
  return &e;
}
}  // namespace house

ARMATURE_CODE_PLUGIN(house::entry)
