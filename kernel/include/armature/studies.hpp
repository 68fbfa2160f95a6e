// Studies over many requests: the product of a few axes (dotted request
// paths and their values) applied to a base request, designed on all
// cores (sweep), and the search of that product for the best passing
// design under an objective (optimise). The CLI and the Python binding
// share this; they only convert.
#pragma once

#include <cstddef>
#include <functional>
#include <limits>
#include <map>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "armature/errors.hpp"

namespace armature {

class Registry;

// Runs fn(i, worker) for i in [0, n) on `threads` threads (0: all cores);
// `worker` numbers the thread from 0 and is below worker_count(threads).
void parallel_for(std::size_t n, unsigned threads,
                  const std::function<void(std::size_t, unsigned)>& fn);
unsigned worker_count(unsigned threads);

// Sets `value` at a dotted path with list indices ("slab.spans_m[0]");
// objects missing on the way are made, list entries must exist (an
// InputError naming the path otherwise). The path "code" takes "ID" or
// "ID:variant": "ID" alone keeps the variant of `base` when `base` is of
// that code, else none (the code's default). The Python twin is
// armature._paths._set_path; both set a path the same way.
void set_axis_value(nlohmann::json& request, const nlohmann::json& base, const std::string& path,
                    const nlohmann::json& value);

// One axis of a study: a request path and the values it takes.
struct StudyAxis {
  std::string path;
  std::vector<nlohmann::json> values;
};

// The product of the axes over a base request; candidates are numbered
// from 0 with the first axis varying slowest.
class Study {
 public:
  Study(nlohmann::json base, std::vector<StudyAxis> axes);
  const nlohmann::json& base() const { return base_; }
  const std::vector<StudyAxis>& axes() const { return axes_; }
  std::size_t size() const { return size_; }
  // The index into axes()[axis].values of candidate i.
  std::size_t value_index(std::size_t candidate, std::size_t axis) const;
  // Sets every axis value of candidate i on `request` (a copy of the base,
  // reused: each axis field is set again for every candidate).
  void apply(nlohmann::json& request, std::size_t candidate) const;
  nlohmann::json request(std::size_t candidate) const;

 private:
  nlohmann::json base_;
  std::vector<StudyAxis> axes_;
  std::vector<std::size_t> stride_;  // candidates per step of each axis
  std::size_t size_ = 1;
};

// What a study keeps of one design: the summary row, not the record.
struct StudyRegion {
  std::string where, bar;
  double spacing_mm = 0.0, As_prov_mm2 = 0.0;
  bool bars_given = false;  // the request's bars (reinforcement.given), checked, not searched
};
inline constexpr double not_known = std::numeric_limits<double>::quiet_NaN();
struct StudyRow {
  bool designed = false, pass = false;  // designed false: not a valid request (see error)
  double max_utilisation = not_known, steel_kg_m2 = not_known, concrete_m3_m2 = not_known;
  double thickness_mm = not_known;
  std::string governing_check, governing_where, error;
  std::vector<StudyRegion> regions;
};

// Designs one request into a row; a request that is not valid (or whose
// design fails) gives designed = false and the message in `error`.
StudyRow design_row(const Registry& registry, const nlohmann::json& request);

// Every candidate of the study designed on `threads` threads (0: all cores).
std::vector<StudyRow> sweep(const Registry& registry, const Study& study, unsigned threads = 0);

// ---- optimise ----------------------------------------------------------------

enum class Objective { cost, carbon, depth, steel_mass };

// The user's rates (no rate or factor is built in). Cost: currency per m³
// of concrete (one rate, or one per strength class), per tonne of steel,
// per m² of formwork (soffit). Carbon: kgCO2e per m³ of concrete by
// strength class, per kg of steel.
struct ObjectiveRates {
  Objective objective = Objective::cost;
  double concrete_per_m3 = 0.0, steel_per_tonne = 0.0, formwork_per_m2 = 0.0;
  std::map<std::string, double> concrete_per_m3_by_class;  // given: used instead of concrete_per_m3
  std::map<std::string, double> carbon_concrete_per_m3;
  double carbon_steel_per_kg = 0.0;
};

// "cost", "carbon", "depth", "steel_mass" and the unit of each value.
const char* objective_name(Objective objective);
const char* objective_unit(Objective objective);

// Reads the objective and the rates JSON (shape in DEVELOPERS.md
// "Optimise"). Problems name their field ("objective",
// "rates.concrete_per_m3", "rates.carbon.steel_per_kg"); the carbon factor
// of each concrete class is checked against the study by optimise().
ObjectiveRates objective_from_json(const std::string& objective, const nlohmann::json& rates,
                                   InputProblems& problems);

// Cost per m² of slab: concrete (thickness × rate), steel (mass × rate),
// formwork (one m² of soffit per m² of slab).
double cost_per_m2(double concrete_per_m3, double steel_per_tonne, double formwork_per_m2, double thickness_mm,
                   double steel_kg_m2);
// kgCO2e per m² of slab: concrete (thickness × the class's factor) and steel.
double carbon_per_m2(double concrete_kgCO2e_per_m3, double steel_kgCO2e_per_kg, double thickness_mm,
                     double steel_kg_m2);

// The carbon factors are keyed by concrete.class, or "<fck> MPa" when the
// request gives cylinder_strength_MPa instead; empty when it gives neither.
std::string concrete_key(const nlohmann::json& request);

// The objective of a design of this thickness and steel mass.
double objective_value(const ObjectiveRates& rates, const std::string& concrete, double thickness_mm,
                       double steel_kg_m2);
// A lower bound on the objective of any design of this thickness: the
// objective with no steel. It never decreases with the thickness.
double objective_lower_bound(const ObjectiveRates& rates, const std::string& concrete,
                             double thickness_mm);

struct OptimiseRow : StudyRow {
  bool pruned = false;  // not designed: its bound exceeds a thinner passing design's objective
  bool pareto = false;  // on the front of objective against thickness (passing designs)
  double objective = not_known;
};

struct Optimisation {
  Objective objective = Objective::cost;
  std::vector<OptimiseRow> rows;
  std::size_t chosen = 0;
  bool chosen_passes = false;
  std::size_t designed = 0, pruned = 0, invalid = 0;
  std::string message;  // what was chosen and why, in a sentence
};

// The axis searched by thickness, when the study varies it.
inline constexpr const char* thickness_axis = "slab.thickness_mm";

// The best passing candidate of the study under the objective (least
// objective, then the thinner, then the earlier candidate), every
// candidate's row and the Pareto front. With `prune`, thicknesses are
// designed thinnest first and a candidate is not designed when its lower
// bound exceeds the objective of a passing candidate no thicker than it.
// When none passes, the least-failing (least max utilisation, then the
// objective) with chosen_passes false. Throws InputError naming every bad
// rate, objective and axis together, before anything is designed.
Optimisation optimise(const Registry& registry, const Study& study, const std::string& objective,
                      const nlohmann::json& rates, unsigned threads = 0, bool prune = true);

}  // namespace armature
