// A plug-in that wraps EN 1992-1-1 (recommended) in one part only, by
// variant: "section" adds a section check of its own, "members" tightens
// the span/depth ratio, "combinations" raises every ULS factor, "punching"
// refuses punching shear reinforcement. Each wraps
// one interface through the kernel's forwarding bases and copies nothing
// else (tests/cpp/test_section.cpp holds each to changing only its part).
#include <memory>
#include <stdexcept>
#include <string>
#include <utility>
#include <vector>

#include "armature/plugin.hpp"
#include "armature/steps.hpp"

namespace {
using namespace armature;

constexpr double spacing_limit_mm = 300.0;  // the test's own rule: bars at most 300 mm apart
constexpr double span_depth_factor = 0.9;    // allowed l/d × 0.9
constexpr double uls_factor = 1.1;           // every ULS factor × 1.1

// A section check of the wrapper's own, after EN's.
class SpacingSection final : public ForwardingSectionRules {
 public:
  using ForwardingSectionRules::ForwardingSectionRules;
  SectionOutcome check_section(const Section& section, const RegionDemand& g, Detail detail) const override {
    SectionOutcome out = inner().check_section(section, g, detail == Detail::verdict ? Detail::checks : detail);
    const double s = section.outer_layer(g.face).spacing_mm;
    out.checks.push_back(make_check("spacing", g.where, "test wrap: bars at most 300 mm apart", s,
                                    spacing_limit_mm, "mm",
                                    {{"s_max", "wrapper's limit", "", spacing_limit_mm, "mm", "test wrap"}}));
    out.verdict = verdict_of(out);
    return out;
  }
};

// EN's span/depth check with 0.9 of its allowed ratio.
class TighterDeflection final : public ForwardingMemberRules {
 public:
  using ForwardingMemberRules::ForwardingMemberRules;
  MemberSectionOutcome check_with_section(const Section& section, const RegionDemand& g,
                                          const SectionOutcome& outcome, Detail detail) const override {
    MemberSectionOutcome out =
        inner().check_with_section(section, g, outcome, detail == Detail::verdict ? Detail::checks : detail);
    for (auto& c : out.span_checks)
      if (c.id == "deflection")
        c = make_check(c.id, c.where, c.clause + "; test wrap × 0.9", c.demand,
                       c.capacity * span_depth_factor, c.unit, std::move(c.steps));
    const RegionVerdict own = verdict_of(out.checks), span = verdict_of(out.span_checks);
    out.verdict = {own.all_pass && span.all_pass, own.strength_pass && span.strength_pass};
    return out;
  }
};

// EN's combinations with every ULS factor × 1.1.
class RaisedCombinations final : public CombinationRules {
 public:
  explicit RaisedCombinations(const CombinationRules& en) : en_(en) {}
  std::vector<Combination> combinations(const std::vector<Action>& actions,
                                        CombinationLabels labels) const override {
    auto out = en_.combinations(actions, labels);
    for (auto& c : out)
      if (c.limit_state == LimitState::uls) {
        c.label += " (× 1.1)";
        for (auto& f : c.factors) f = {f.loaded * uls_factor, f.unloaded * uls_factor};
      }
    return out;
  }
  std::vector<std::vector<bool>> load_arrangements(std::size_t n) const override {
    return en_.load_arrangements(n);
  }

 private:
  const CombinationRules& en_;
};

// EN's punching rules, with no shear reinforcement at any column.
class NoPunchingLinks final : public ForwardingPunchingRules {
 public:
  using ForwardingPunchingRules::ForwardingPunchingRules;
  PunchingOutcome check_punching(const PunchingDemand& demand, Detail detail) const override {
    PunchingDemand without = demand;
    without.shear_reinforcement_allowed = false;
    return inner().check_punching(without, detail);
  }
};

class Session final : public ForwardingSlabChecker {
 public:
  Session(std::unique_ptr<SlabChecker> en, const std::string& part)
      : ForwardingSlabChecker(std::move(en)),
        part_(part),
        section_(inner().section_rules()),
        members_(inner().member_rules()),
        combinations_(inner().combination_rules()),
        punching_(inner().punching_rules()) {}
  const SectionRules& section_rules() const override {
    return part_ == "section" ? section_ : inner().section_rules();
  }
  const MemberRules& member_rules() const override {
    return part_ == "members" ? members_ : inner().member_rules();
  }
  const CombinationRules& combination_rules() const override {
    return part_ == "combinations" ? combinations_ : inner().combination_rules();
  }
  const PunchingRules& punching_rules() const override {
    return part_ == "punching" ? punching_ : inner().punching_rules();
  }

 private:
  std::string part_;
  SpacingSection section_;
  TighterDeflection members_;
  RaisedCombinations combinations_;
  NoPunchingLinks punching_;
};

class Code final : public DesignCode {
 public:
  Code(std::shared_ptr<const DesignCode> en, std::string part) : en_(std::move(en)), part_(std::move(part)) {}
  CodeIdentity identity() const override { return {"TEST-WRAPS", part_, "EN 1992-1-1 wrapped in one part"}; }
  void validate(const Request& req, InputProblems& problems) const override { en_->validate(req, problems); }
  std::unique_ptr<SlabChecker> begin(const Request& req) const override {
    return std::make_unique<Session>(en_->begin(req), part_);
  }

 private:
  std::shared_ptr<const DesignCode> en_;
  std::string part_;
};

class Factory final : public CodeFactory {
 public:
  std::string id() const override { return "TEST-WRAPS"; }
  std::string title() const override { return "EN 1992-1-1 wrapped in one part"; }
  std::string edition() const override { return "test"; }
  std::vector<std::string> variants() const override { return {"section", "members", "combinations", "punching"}; }
  std::string default_variant() const override { return "section"; }
  std::shared_ptr<const DesignCode> make(const std::string& variant, const CodeHost& host) const override {
    if (variant != "section" && variant != "members" && variant != "combinations" && variant != "punching")
      throw std::invalid_argument("no TEST-WRAPS variant '" + variant + "'");
    return std::make_shared<Code>(host.open("EN1992-1-1", "recommended"), variant);
  }
};

std::unique_ptr<CodeFactory> create(const PluginContext&) { return std::make_unique<Factory>(); }
}  // namespace

namespace wraps {
const PluginEntry* entry() {
  static const PluginEntry e{plugin_abi_version, &create};
  return &e;
}
}  // namespace wraps

ARMATURE_CODE_PLUGIN(wraps::entry)
