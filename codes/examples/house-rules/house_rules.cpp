// Example house rules over EN 1992-1-1 with the UK National Annex. The
// plug-in opens EN 1992 (UK) through the registry and wraps it: every EN
// check stays as EN computes it, and the house tightens or adds:
//   HR-1  allowed span/depth ratio × 0.9
//   HR-2  bar spacing ≤ 200 mm
//   HR-3  slab thickness ≥ 175 mm (acoustic separation between floors)
//   HR-4  nominal cover ≥ 30 mm
// It wraps EN's section rules (HR-2, HR-4) and member rules (HR-1, HR-3)
// and nothing else: EN's combinations, loads and bars pass through as
// they are. No EN 1992 rule is copied here.
#include <algorithm>
#include <memory>
#include <string>
#include <utility>

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

// HR-2 and HR-4 change EN's section rules; everything else of them is EN's.
class HouseSection final : public ForwardingSectionRules {
 public:
  HouseSection(const SectionRules& en, const Request& req) : ForwardingSectionRules(en), req_(req) {}

  // HR-4: where EN's own cover is less than 30 mm and the request gives
  // none, 30 mm (EN checks a cover other than its own as a given one:
  // that 30 mm meets its own minimum).
  double nominal_cover_mm(Face face, double bar_mm) const override {
    const double en = inner().nominal_cover_mm(face, bar_mm);
    return raised(face, en) ? min_cover : en;
  }
  double max_spacing_mm(const RegionDemand& g) const override {
    return std::min(inner().max_spacing_mm(g), max_spacing);
  }
  // EN's floor is worked out at EN's own cover; at HR-4's larger one the
  // depth is less, and so may be the floor: none is given there.
  double minimum_area_mm2(const RegionDemand& g, const BarOption& bar) const override {
    const double cover_bar = std::max(bar.diameter_mm, g.cover_bar_mm);
    return raised(g.face, inner().nominal_cover_mm(g.face, cover_bar)) ? 0.0 : inner().minimum_area_mm2(g, bar);
  }
  SectionOutcome check_section(const Section& section, const RegionDemand& g, Detail detail) const override {
    // The house adds checks to EN's, so it always asks for them.
    const Detail inner_detail = detail == Detail::steps ? Detail::steps : Detail::checks;
    SectionOutcome out = inner().check_section(section, g, inner_detail);
    const SectionLayer& layer = section.outer_layer(g.face);
    out.checks.push_back(run_check("spacing", [&] {
      return make_check("spacing", g.where, "house rule HR-2", layer.spacing_mm, max_spacing, "mm",
                        {{"s_max", "house limit", "", max_spacing, "mm", "house rule HR-2"}});
    }));
    out.checks.push_back(run_check("cover", [&] {
      return make_check("cover", g.where, "house rule HR-4", min_cover, layer.cover_mm, "mm",
                        {{"c_nom,min", "house minimum", "", min_cover, "mm", "house rule HR-4"}});
    }));
    out.verdict = verdict_of(out);
    return out;
  }
  DistributionNeed distribution(double main_As) const override {
    auto need = inner().distribution(main_As);
    need.max_spacing_mm = std::min(need.max_spacing_mm, max_spacing);
    return need;
  }

 private:
  // Whether HR-4 raises EN's cover on a face (a given cover is kept).
  bool raised(Face face, double en_cover) const {
    return !req_.durability.cover_given(face) && en_cover < min_cover;
  }

  const Request& req_;  // kept alive by the caller of Code::begin
};

// HR-1 and HR-3 change EN's member rules; everything else of them is EN's.
class HouseMembers final : public ForwardingMemberRules {
 public:
  HouseMembers(const MemberRules& en, const Request& req) : ForwardingMemberRules(en), req_(req) {}

  MemberSectionOutcome check_with_section(const Section& section, const RegionDemand& g,
                                          const SectionOutcome& outcome, Detail detail) const override {
    const Detail inner_detail = detail == Detail::steps ? Detail::steps : Detail::checks;
    MemberSectionOutcome out = inner().check_with_section(section, g, outcome, inner_detail);
    for (auto& c : out.span_checks)
      if (c.id == "deflection") c = scaled_deflection(std::move(c));
    const RegionVerdict own = verdict_of(out.checks), span = verdict_of(out.span_checks);
    out.verdict = {own.all_pass && span.all_pass, own.strength_pass && span.strength_pass};
    return out;
  }
  std::vector<Check> span_checks(const std::string& span) const override {
    auto out = inner().span_checks(span);
    out.push_back(run_check("acoustic_thickness", [&] {
      return make_check("acoustic_thickness", span, "house rule HR-3", min_thickness,
                        req_.slab.thickness_mm, "mm",
                        {{"h_min", "house minimum for acoustic separation", "", min_thickness, "mm",
                          "house rule HR-3"}});
    }));
    return out;
  }

 private:
  const Request& req_;  // kept alive by the caller of Code::begin
};

// EN's session with the house's section and member rules; EN's
// combinations, loads, bars and warnings as they are.
class Checker final : public ForwardingSlabChecker {
 public:
  Checker(const DesignCode& en, const Request& req)
      : ForwardingSlabChecker(en.begin(req)),
        section_(inner().section_rules(), req),
        members_(inner().member_rules(), req) {}

  const SectionRules& section_rules() const override { return section_; }
  const MemberRules& member_rules() const override { return members_; }

  // EN's defaults, with HR-4's floor on a cover the request leaves out.
  std::vector<InputDefault> defaults_used() const override {
    auto out = inner().defaults_used();
    for (auto& d : out)
      if (d.field == "durability.cover_mm")
        d = {d.field, "EN's c_nom, at least " + step_number(min_cover) + " mm", "house rule HR-4"};
    return out;
  }

 private:
  HouseSection section_;
  HouseMembers members_;
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
  std::vector<std::string> slab_types() const override { return {"one_way", "two_way", "flat"}; }
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
