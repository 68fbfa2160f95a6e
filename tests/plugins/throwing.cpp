// A code whose bending check throws: the kernel must report a design error
// naming the code and the check, and carry on with other codes.
#include <stdexcept>

#include "armature/plugin.hpp"

namespace {
using namespace armature;

class ThrowingChecker final : public SlabChecker,
                              private CombinationRules,
                              private SectionRules,
                              private MemberRules,
                              private PunchingRules {
 public:
  explicit ThrowingChecker(const Request& req) : req_(req) {}
  const CombinationRules& combination_rules() const override { return *this; }
  const SectionRules& section_rules() const override { return *this; }
  const MemberRules& member_rules() const override { return *this; }
  const PunchingRules& punching_rules() const override { return *this; }
  const Request& request() const override { return req_; }
  LoadBasis load_basis() const override { return {25.0, ""}; }
  const std::vector<BarOption>& bar_options() const override { return bars_; }
  std::vector<std::string> warnings() const override { return {}; }

 private:
  std::vector<Combination> combinations(const std::vector<Action>& actions, CombinationLabels) const override {
    return {{"all: 1.0 Gk + 1.0 Qk", LimitState::uls, std::vector<ActionFactor>(actions.size(), {1.0, 1.0})}};
  }
  std::vector<std::vector<bool>> load_arrangements(std::size_t n) const override {
    return {std::vector<bool>(n, true)};
  }
  double nominal_cover_mm(Face, double) const override { return 25.0; }
  double max_spacing_mm(const RegionDemand&) const override { return 200.0; }
  SectionOutcome check_section(const Section&, const RegionDemand&, Detail) const override {
    SectionOutcome out;
    out.checks.push_back(run_check("bending", []() -> Check {
      throw std::runtime_error("deliberate failure inside the bending check");
    }));
    return out;
  }
  DistributionNeed distribution(double) const override { return {0.0, 300.0}; }
  MemberSectionOutcome check_with_section(const Section&, const RegionDemand&, const SectionOutcome&,
                                          Detail) const override {
    return {};
  }
  std::vector<Check> span_checks(const std::string&) const override { return {}; }
  double pinned_end_fixity_fraction() const override { return 0.0; }
  double steel_ratio_width_mm(const PunchingDemand&, bool) const override { return 0.0; }
  PunchingOutcome check_punching(const PunchingDemand&, Detail) const override {
    throw std::runtime_error("deliberate failure: this code has no punching rules");
  }

  const Request& req_;
  std::vector<BarOption> bars_{{"10", 10.0, 78.5}};
};

class ThrowingCode final : public DesignCode {
 public:
  CodeIdentity identity() const override { return {"TEST-THROWING", "default", "test code that throws"}; }
  void validate(const Request&, InputProblems&) const override {}
  std::unique_ptr<SlabChecker> begin(const Request& req) const override {
    return std::make_unique<ThrowingChecker>(req);
  }
};

class ThrowingFactory final : public CodeFactory {
 public:
  std::string id() const override { return "TEST-THROWING"; }
  std::string title() const override { return "test code that throws"; }
  std::string edition() const override { return "test"; }
  std::vector<std::string> variants() const override { return {"default"}; }
  std::string default_variant() const override { return "default"; }
  std::shared_ptr<const DesignCode> make(const std::string&, const CodeHost&) const override {
    return std::make_shared<ThrowingCode>();
  }
};

std::unique_ptr<CodeFactory> create(const PluginContext&) { return std::make_unique<ThrowingFactory>(); }
}  // namespace

namespace throwing {
const PluginEntry* entry() {
  static const PluginEntry e{plugin_abi_version, &create};
  return &e;
}
}  // namespace throwing

ARMATURE_CODE_PLUGIN(throwing::entry)
