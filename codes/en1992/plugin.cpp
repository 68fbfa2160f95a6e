// The EN 1992-1-1 code plug-in: variants are NDP data files; every check
// is drawn from the clause functions of rules.hpp. This file holds the
// Code, its validation and defaults, the entry point, and the parts of the
// checker that are neither materials, section nor member checks.
#include <algorithm>
#include <cstring>
#include <filesystem>
#include <memory>
#include <stdexcept>
#include <string>

#include "armature/analysis.hpp"
#include "armature/plugin.hpp"
#include "checker.hpp"
#include "en1990.hpp"

namespace armature::en1992 {

namespace {

constexpr const char* code_id = "EN1992-1-1";
constexpr double default_density_kN_m3 = 25.0;  // EN 1991-1-1 Table A.1

}  // namespace

LoadBasis Checker::load_basis() const {
  LoadBasis basis;
  basis.density_kN_m3 = req_.concrete.density_kN_m3.value_or(default_density_kN_m3);
  basis.long_term_load_name = "quasi-permanent";  // EN 1990 6.5.3 (6.16b)
  return basis;
}

std::vector<Combination> Checker::combinations(const std::vector<Action>& actions,
                                               CombinationLabels labels) const {
  return en1990_combinations(en1990_, req_.design.combination.value_or("6.10") != "6.10", actions, labels);
}

std::vector<std::vector<bool>> Checker::load_arrangements(std::size_t span_count) const {
  return en1992::load_arrangements(span_count, ndp_.pattern_loading == "adjacent_pairs");
}

std::vector<BayArrangement> Checker::bay_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                           const std::vector<Action>&) const {
  std::vector<BayArrangement> out;
  for (auto& a : en1992::bay_load_arrangements(bays_x, bays_y, ndp_.pattern_loading == "adjacent_pairs"))
    out.push_back({std::move(a), 1.0});
  return out;
}

// 5.1.3(1)P for a flat slab (its frames by Annex I.1): the two-way
// arrangements, and alternate spans of each frame loaded across the whole
// width (its adjacent spans are the whole-width pairs of the two-way set
// where the variant asks for them).
std::vector<BayArrangement> Checker::flat_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                            const std::vector<Action>& actions) const {
  auto out = bay_load_arrangements(bays_x, bays_y, actions);
  for (auto& a : alternate_bay_strips(bays_x, bays_y)) out.push_back({std::move(a), 1.0});
  return out;
}

std::optional<BarOption> Checker::catalogue_bar(const std::string& designation) const {
  const auto phi = bar_diameter(designation);
  if (!phi) return std::nullopt;
  return BarOption{designation, *phi, bar_area(*phi)};
}

std::vector<InputDefault> Checker::defaults_used() const {
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

std::vector<std::string> Checker::warnings() const {
  std::vector<std::string> out;
  if (!ndp_.durability_note.empty()) out.push_back(ndp_.durability_note);
  // A calculated crack width asked for where 7.3.3(1) asks for no crack
  // control: said, so that the record's "calculated" is not read as checked.
  if (req_.serviceability.crack_width == CrackWidthMethod::calculated && !crack_check_needed(req_.slab.thickness_mm))
    out.push_back("serviceability.crack_width is \"calculated\", but the slab is " + num(req_.slab.thickness_mm) +
                  " mm thick: EN 1992-1-1 7.3.3(1) asks for no crack control in slabs of 200 mm or less "
                  "(with 9.3 satisfied), so no crack width is checked");
  // Span/depth alone on a slab carrying partitions: 7.4.2 gives no check of
  // the part of the deflection after they are built (7.4.1(5)).
  if (req_.serviceability.partitions && req_.serviceability.deflection_method() == DeflectionMethod::span_depth)
    out.push_back("serviceability.partitions is true, but the deflection is checked by the span/depth ratio "
                  "(EN 1992-1-1 7.4.2) alone, which does not check the part after the partitions are built "
                  "(7.4.1(5), span/500): give serviceability.deflection \"calculated\" or \"both\"");
  // A flat slab in fire: Table 5.9 holds only with the top steel that
  // 5.7.4(2) asks for from REI 90, which the detailing provides (bars of
  // their own in the column strips); without detailing, said.
  if (req_.fire.resistance_min && req_.slab_type == SlabType::flat && !req_.detailing.requested &&
      fire_continuous_top_share(*req_.fire.resistance_min) > 0.0)
    out.push_back("EN 1992-1-2 5.7.4(2): for the fire resistance of Table 5.9, at least 20 % of the top "
                  "reinforcement over the intermediate supports in each direction must run continuous over the whole "
                  "span, in the column strip; ask for detailing to have these bars, or make sure the drawings do");
  {
    const std::lock_guard<std::mutex> lock(span_depth_notes_mutex_);
    for (const auto& [where, note] : span_depth_notes_) out.push_back(note);
  }
  return out;
}

namespace {

std::string format_range(double lo, double hi, const char* unit) {
  return "must be between " + num(lo) + " and " + num(hi) + " " + unit;
}

// The calculated deflection's inputs against the strip: a cantilever needs
// a back span (its root turns with it), the partitions after the loading. Creep, shrinkage and
// humidity ranges are the request reader's.
void add_deflection_input_problems(const Request& req, InputProblems& problems) {
  const auto& s = req.serviceability;
  if (!s.calculated_deflection()) {
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
                     "belongs to the calculated deflection: give serviceability.deflection \"calculated\" or "
                     "\"both\", or leave the field out");
    return;
  }
  const double t0 = s.age_at_loading_days.value_or(default_age_at_loading_days);
  const double tp = s.partitions_age_days.value_or(default_partitions_age_days);
  if (s.partitions && tp <= t0)
    problems.add(s.partitions_age_days ? "serviceability.partitions_age_days" : "serviceability.age_at_loading_days",
                 "the partitions (at " + num(tp) + " days" + (s.partitions_age_days ? "" : ", the default") +
                     ") must be built after the loading (at " + num(t0) + " days)");
}

class Code final : public DesignCode {
 public:
  explicit Code(Ndp ndp)
      : ndp_(std::move(ndp)), en1990_(en1990_factors(ndp_)) {}

  CodeIdentity identity() const override { return {code_id, ndp_.variant, ndp_.title}; }

  void validate(const Request& req, InputProblems& problems) const override {
    add_deflection_input_problems(req, problems);
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
    return std::make_unique<Checker>(ndp_, en1990_, req);
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
  En1990Factors en1990_;  // of ndp_, with the factors' printed texts: made once
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
  std::vector<std::string> slab_types() const override { return {"one_way", "two_way", "flat"}; }
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

