// The best passing candidate of a study under the user's objective, with
// thicker candidates left undesigned once a thinner one passes below their
// bound. The rates are the user's: none is built in.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>
#include <optional>

#include "armature/format.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "armature/studies.hpp"

namespace armature {

using nlohmann::json;

const char* objective_name(Objective o) {
  switch (o) {
    case Objective::cost: return "cost";
    case Objective::carbon: return "carbon";
    case Objective::depth: return "depth";
    case Objective::steel_mass: return "steel_mass";
  }
  return "";
}

const char* objective_unit(Objective o) {
  switch (o) {
    case Objective::cost: return "per m2";  // in the currency of the rates
    case Objective::carbon: return "kgCO2e/m2";
    case Objective::depth: return "mm";
    case Objective::steel_mass: return "kg/m2";
  }
  return "";
}

namespace {

std::string as_text(const json& j) { return j.dump(-1, ' ', false, json::error_handler_t::replace); }

// A rate: a finite number, zero or more. Absent: nullopt (the caller says
// whether the objective needs it).
std::optional<double> read_rate(const json& parent, const std::string& key, const std::string& field,
                                InputProblems& problems) {
  if (!parent.is_object()) return std::nullopt;
  const auto it = parent.find(key);
  if (it == parent.end()) return std::nullopt;
  if (!it->is_number() || !std::isfinite(it->get<double>())) {
    problems.add(field, "must be a number, got " + as_text(*it));
    return 0.0;
  }
  const double v = it->get<double>();
  if (v < 0.0) {
    problems.add(field, "must be zero or more, got " + plain_number(v));
    return 0.0;
  }
  return v;
}

void unknown_keys(const json& j, const std::vector<std::string>& known, const std::string& at,
                  InputProblems& problems) {
  if (!j.is_object()) return;
  for (auto it = j.begin(); it != j.end(); ++it)
    if (std::find(known.begin(), known.end(), it.key()) == known.end())
      problems.add(at + "." + it.key(), "unknown field");
}


// An object of concrete class (or "<fck> MPa") to a rate.
void read_by_class(const json& j, const std::string& field, std::map<std::string, double>& out,
                   InputProblems& problems) {
  if (j.empty()) problems.add(field, "give the rate of at least one concrete class ({\"C30/37\": ...})");
  for (auto it = j.begin(); it != j.end(); ++it) {
    const auto v = read_rate(j, it.key(), field + "[\"" + it.key() + "\"]", problems);
    out[it.key()] = v.value_or(0.0);
  }
}

}  // namespace

ObjectiveRates objective_from_json(const std::string& objective, const json& rates, InputProblems& problems) {
  ObjectiveRates r;
  if (objective == "cost") r.objective = Objective::cost;
  else if (objective == "carbon") r.objective = Objective::carbon;
  else if (objective == "depth") r.objective = Objective::depth;
  else if (objective == "steel_mass") r.objective = Objective::steel_mass;
  else {
    problems.add("objective", "must be one of cost, carbon, depth, steel_mass, got " + as_text(json(objective)));
    return r;
  }
  if (!rates.is_null() && !rates.is_object()) {
    problems.add("rates", "must be an object of rates (see the request reference), got " + as_text(rates));
    return r;
  }
  unknown_keys(rates, {"concrete_per_m3", "steel_per_tonne", "formwork_per_m2", "carbon"}, "rates", problems);
  const bool cost = r.objective == Objective::cost, carbon = r.objective == Objective::carbon;
  auto need = [&](const json& parent, const std::string& key, const std::string& field, bool needed,
                  const char* what) {
    const auto v = read_rate(parent, key, field, problems);
    if (!v && needed)
      problems.add(field, std::string("missing: the ") + objective + " objective needs " + what +
                              " (no rate or factor is built in)");
    return v.value_or(0.0);
  };
  const json none;
  const json& root = rates.is_object() ? rates : none;
  const auto by_class = root.is_object() ? root.find("concrete_per_m3") : root.end();
  if (root.is_object() && by_class != root.end() && by_class->is_object())
    read_by_class(*by_class, "rates.concrete_per_m3", r.concrete_per_m3_by_class, problems);
  else
    r.concrete_per_m3 = need(root, "concrete_per_m3", "rates.concrete_per_m3", cost, "the rate for concrete per m3");
  r.steel_per_tonne = need(root, "steel_per_tonne", "rates.steel_per_tonne", cost, "the rate for reinforcement per tonne");
  r.formwork_per_m2 = need(root, "formwork_per_m2", "rates.formwork_per_m2", cost, "the rate for soffit formwork per m2");
  const auto c = root.is_object() ? root.find("carbon") : root.end();
  const json& carbon_json = root.is_object() && c != root.end() ? *c : none;
  if (!carbon_json.is_null() && !carbon_json.is_object()) {
    problems.add("rates.carbon", "must be an object with concrete_per_m3 and steel_per_kg, got " + as_text(carbon_json));
    return r;
  }
  if (carbon && carbon_json.is_null()) {
    problems.add("rates.carbon", "missing: the carbon objective needs the factors (kgCO2e) for concrete per m3 "
                                 "by class and for steel per kg (no factor is built in)");
    return r;
  }
  unknown_keys(carbon_json, {"concrete_per_m3", "steel_per_kg"}, "rates.carbon", problems);
  r.carbon_steel_per_kg = need(carbon_json, "steel_per_kg", "rates.carbon.steel_per_kg", carbon,
                               "the factor for reinforcement (kgCO2e per kg)");
  if (carbon_json.is_object()) {
    const auto k = carbon_json.find("concrete_per_m3");
    if (k == carbon_json.end()) {
      if (carbon)
        problems.add("rates.carbon.concrete_per_m3", "missing: the carbon objective needs the factor of each "
                                                     "concrete class (kgCO2e per m3, no factor is built in)");
    } else if (!k->is_object()) {
      problems.add("rates.carbon.concrete_per_m3",
                   "must be an object of concrete class to kgCO2e per m3 ({\"C30/37\": ...}), got " + as_text(*k));
    } else {
      read_by_class(*k, "rates.carbon.concrete_per_m3", r.carbon_concrete_per_m3, problems);
    }
  }
  return r;
}

// Concrete at the rate per m³ (m³ per m² of slab = thickness in m), steel at
// the rate per tonne, and one m² of soffit formwork per m² of slab.
double cost_per_m2(double concrete_per_m3, double steel_per_tonne, double formwork_per_m2, double thickness_mm,
                   double steel_kg_m2) {
  return concrete_per_m3 * thickness_mm * 1e-3 + steel_per_tonne * steel_kg_m2 * 1e-3 + formwork_per_m2;
}

double carbon_per_m2(double concrete_kgCO2e_per_m3, double steel_kgCO2e_per_kg, double thickness_mm,
                     double steel_kg_m2) {
  return concrete_kgCO2e_per_m3 * thickness_mm * 1e-3 + steel_kgCO2e_per_kg * steel_kg_m2;
}

std::string concrete_key(const json& request) {
  if (!request.is_object()) return "";
  const auto c = request.find("concrete");
  if (c == request.end() || !c->is_object()) return "";
  const auto k = c->find("class");
  if (k != c->end() && k->is_string()) return k->get<std::string>();
  const auto f = c->find("cylinder_strength_MPa");
  if (f != c->end() && f->is_number()) return plain_number(f->get<double>()) + " MPa";
  return "";
}

double objective_value(const ObjectiveRates& r, const std::string& concrete, double thickness_mm,
                       double steel_kg_m2) {
  switch (r.objective) {
    case Objective::cost: {
      double concrete_rate = r.concrete_per_m3;
      if (!r.concrete_per_m3_by_class.empty()) {
        const auto it = r.concrete_per_m3_by_class.find(concrete);
        concrete_rate = it == r.concrete_per_m3_by_class.end() ? not_known : it->second;
      }
      return cost_per_m2(concrete_rate, r.steel_per_tonne, r.formwork_per_m2, thickness_mm, steel_kg_m2);
    }
    case Objective::carbon: {
      const auto it = r.carbon_concrete_per_m3.find(concrete);
      const double factor = it == r.carbon_concrete_per_m3.end() ? not_known : it->second;
      return carbon_per_m2(factor, r.carbon_steel_per_kg, thickness_mm, steel_kg_m2);
    }
    case Objective::depth: return thickness_mm;
    case Objective::steel_mass: return steel_kg_m2;
  }
  return not_known;
}

double objective_lower_bound(const ObjectiveRates& r, const std::string& concrete, double thickness_mm) {
  return objective_value(r, concrete, thickness_mm, 0.0);  // steel mass is never negative
}

namespace {

bool is_concrete_path(const std::string& p) {
  return p == "concrete" || p.rfind("concrete.", 0) == 0 || p.rfind("concrete[", 0) == 0;
}

// The concrete key of every candidate, from the axes that touch concrete.
std::vector<std::string> concrete_keys(const Study& study) {
  const auto& axes = study.axes();
  std::vector<std::size_t> touching;
  std::size_t combos = 1;
  for (std::size_t a = 0; a < axes.size(); ++a)
    if (is_concrete_path(axes[a].path)) {
      touching.push_back(a);
      combos *= axes[a].values.size();
    }
  std::vector<std::string> by_combo(combos);
  for (std::size_t c = 0; c < combos; ++c) {
    json req = study.base();
    std::size_t rest = c;
    try {
      for (std::size_t k = touching.size(); k-- > 0;) {
        const auto& axis = axes[touching[k]];
        set_axis_value(req, study.base(), axis.path, axis.values[rest % axis.values.size()]);
        rest /= axis.values.size();
      }
      by_combo[c] = concrete_key(req);
    } catch (const InputError&) {
      // not a valid request: the design says so in its row
    }
  }
  std::vector<std::string> keys(study.size());
  for (std::size_t i = 0; i < keys.size(); ++i) {
    std::size_t c = 0;
    for (std::size_t a : touching) c = c * axes[a].values.size() + study.value_index(i, a);
    keys[i] = by_combo[c];
  }
  return keys;
}

void check_axes(const Study& study, InputProblems& problems) {
  const auto& axes = study.axes();
  if (axes.empty()) problems.add("vary", "give at least one axis to search");
  for (std::size_t a = 0; a < axes.size(); ++a) {
    const std::string field = "vary." + axes[a].path;
    if (axes[a].path.empty()) problems.add("vary", "an axis has an empty path");
    for (std::size_t b = 0; b < a; ++b)
      if (axes[b].path == axes[a].path) problems.add(field, "given twice");
    if (axes[a].values.empty()) problems.add(field, "has no values");
    if (axes[a].path == thickness_axis)
      for (std::size_t k = 0; k < axes[a].values.size(); ++k)
        if (!axes[a].values[k].is_number())
          problems.add(field + "[" + std::to_string(k) + "]",
                       "a thickness must be a number of mm, got " + as_text(axes[a].values[k]));
  }
}

// An axis whose path is not a request field (a misspelling) would make
// every candidate invalid: named once, before anything is designed. The
// kernel's request parser judges, on the base with every axis at its first
// value.
void check_axis_fields(const Study& study, InputProblems& problems) {
  json req = study.base();
  for (const auto& axis : study.axes()) {
    try {
      set_axis_value(req, study.base(), axis.path, axis.values.front());
    } catch (const InputError& e) {
      problems.add("vary." + axis.path, e.problems().front().message);
    }
  }
  if (!problems.empty()) return;
  InputProblems parsed;
  request_from_json(req, parsed);
  for (const auto& axis : study.axes())
    for (const auto& p : parsed.items()) {
      const bool within = axis.path == p.field || axis.path.rfind(p.field + ".", 0) == 0 ||
                          axis.path.rfind(p.field + "[", 0) == 0;
      if (p.message == "unknown field" && within)
        problems.add("vary." + axis.path, p.field == axis.path ? "not a request field"
                                                                : "not a request field (" + p.field + " is unknown)");
    }
}

// Passing rows not dominated by another passing row (no thicker and no
// more objective, one of the two strictly less).
void mark_pareto(std::vector<OptimiseRow>& rows) {
  std::vector<std::size_t> passing;
  for (std::size_t i = 0; i < rows.size(); ++i)
    if (rows[i].designed && rows[i].pass) passing.push_back(i);
  std::sort(passing.begin(), passing.end(), [&](std::size_t a, std::size_t b) {
    if (rows[a].thickness_mm != rows[b].thickness_mm) return rows[a].thickness_mm < rows[b].thickness_mm;
    return rows[a].objective < rows[b].objective;
  });
  double best_thinner = std::numeric_limits<double>::infinity();
  for (std::size_t k = 0; k < passing.size();) {
    std::size_t end = k;
    while (end < passing.size() && rows[passing[end]].thickness_mm == rows[passing[k]].thickness_mm) ++end;
    const double least = rows[passing[k]].objective;  // sorted: the first of this thickness
    if (least < best_thinner)
      for (std::size_t m = k; m < end && rows[passing[m]].objective == least; ++m) rows[passing[m]].pareto = true;
    best_thinner = std::min(best_thinner, least);
    k = end;
  }
}

}  // namespace

Optimisation optimise(const Registry& registry, const Study& study, const std::string& objective,
                      const json& rates_json, unsigned threads, bool prune) {
  InputProblems problems;
  const ObjectiveRates rates = objective_from_json(objective, rates_json, problems);
  check_axes(study, problems);
  if (problems.empty()) check_axis_fields(study, problems);
  std::vector<std::string> keys;
  if (problems.empty()) {
    keys = concrete_keys(study);
    // Rates by concrete: every concrete the study reaches needs its own.
    const std::map<std::string, double>* by_class = nullptr;
    std::string field;
    if (rates.objective == Objective::carbon) {
      by_class = &rates.carbon_concrete_per_m3;
      field = "rates.carbon.concrete_per_m3";
    } else if (rates.objective == Objective::cost && !rates.concrete_per_m3_by_class.empty()) {
      by_class = &rates.concrete_per_m3_by_class;
      field = "rates.concrete_per_m3";
    }
    if (by_class) {
      std::vector<std::string> named;
      bool keyless = false;
      for (const auto& k : keys) {
        if (k.empty()) keyless = true;
        else if (!by_class->count(k) && std::find(named.begin(), named.end(), k) == named.end())
          named.push_back(k);
      }
      if (keyless)
        problems.add(field, std::string("the ") + objective_name(rates.objective) +
                                " objective needs concrete.class (or concrete.cylinder_strength_MPa) in every "
                                "candidate: its rates are per concrete");
      for (const auto& k : named)
        problems.add(field + "[\"" + k + "\"]", std::string("missing: the ") + objective_name(rates.objective) +
                                                    " objective needs the rate of concrete " + k +
                                                    (rates.objective == Objective::carbon ? " (kgCO2e per m3" : " (per m3") +
                                                    ", no rate or factor is built in)");
    }
  }
  problems.raise_if_any();

  Optimisation out;
  out.objective = rates.objective;
  out.rows.resize(study.size());
  // Thickness levels, thinnest first; without a thickness axis (or without
  // pruning) one level holds every candidate.
  std::size_t t_axis = study.axes().size();
  for (std::size_t a = 0; a < study.axes().size(); ++a)
    if (study.axes()[a].path == thickness_axis) t_axis = a;
  std::vector<std::vector<std::size_t>> levels;
  std::vector<double> level_thickness;
  if (t_axis < study.axes().size()) {
    const auto& values = study.axes()[t_axis].values;
    for (const auto& v : values) level_thickness.push_back(v.get<double>());
    std::sort(level_thickness.begin(), level_thickness.end());
    level_thickness.erase(std::unique(level_thickness.begin(), level_thickness.end()), level_thickness.end());
  }
  if (prune && !level_thickness.empty()) {
    levels.resize(level_thickness.size());
    for (std::size_t i = 0; i < study.size(); ++i) {
      const double h = study.axes()[t_axis].values[study.value_index(i, t_axis)].get<double>();
      const auto at = std::lower_bound(level_thickness.begin(), level_thickness.end(), h);
      levels[static_cast<std::size_t>(at - level_thickness.begin())].push_back(i);
      out.rows[i].thickness_mm = h;
    }
  } else {
    levels.emplace_back(study.size());
    for (std::size_t i = 0; i < study.size(); ++i) levels[0][i] = i;
  }

  std::vector<std::optional<json>> scratch(worker_count(threads));
  double best_thinner = std::numeric_limits<double>::infinity();  // least passing objective so far
  std::vector<std::size_t> todo;
  for (const auto& level : levels) {
    todo.clear();
    for (std::size_t i : level) {
      if (std::isfinite(best_thinner) && objective_lower_bound(rates, keys[i], out.rows[i].thickness_mm) > best_thinner) {
        out.rows[i].pruned = true;
        continue;
      }
      todo.push_back(i);
    }
    parallel_for(todo.size(), threads, [&](std::size_t k, unsigned worker) {
      const std::size_t i = todo[k];
      if (!scratch[worker]) scratch[worker] = study.base();
      json& req = *scratch[worker];
      OptimiseRow& row = out.rows[i];
      try {
        study.apply(req, i);
        static_cast<StudyRow&>(row) = design_row(registry, req);
      } catch (const InputError& e) {
        row.error = e.what();
      }
      if (row.designed) row.objective = objective_value(rates, keys[i], row.thickness_mm, row.steel_kg_m2);
    });
    for (std::size_t i : todo)
      if (out.rows[i].designed && out.rows[i].pass) best_thinner = std::min(best_thinner, out.rows[i].objective);
  }

  // The choice: the least objective among passing candidates, then the
  // thinner, then the earlier; when none passes, the least max utilisation,
  // then the least objective, then the earlier.
  std::optional<std::size_t> best;
  auto better = [&](std::size_t a, std::size_t b) {
    const auto &ra = out.rows[a], &rb = out.rows[b];
    if (ra.pass) {
      if (ra.objective != rb.objective) return ra.objective < rb.objective;
      if (ra.thickness_mm != rb.thickness_mm) return ra.thickness_mm < rb.thickness_mm;
      return a < b;
    }
    if (ra.max_utilisation != rb.max_utilisation) return ra.max_utilisation < rb.max_utilisation;
    if (ra.objective != rb.objective) return ra.objective < rb.objective;
    return a < b;
  };
  bool any_pass = false;
  for (std::size_t i = 0; i < out.rows.size(); ++i) {
    const auto& r = out.rows[i];
    if (r.pruned) ++out.pruned;
    else if (r.designed) ++out.designed;
    else ++out.invalid;
    if (r.designed && r.pass) any_pass = true;
  }
  for (std::size_t i = 0; i < out.rows.size(); ++i) {
    const auto& r = out.rows[i];
    if (!r.designed || (any_pass && !r.pass)) continue;
    if (!best || better(i, *best)) best = i;
  }
  if (!best) {
    const std::string first = out.rows.empty() ? std::string() : out.rows[0].error;
    throw InputError({{"vary", "no candidate is a valid request (the first: " + first + ")"}});
  }
  out.chosen = *best;
  out.chosen_passes = any_pass;
  mark_pareto(out.rows);
  const auto& c = out.rows[out.chosen];
  const std::string counts = std::to_string(out.rows.size()) + " candidates: " + std::to_string(out.designed) +
                             " designed, " + std::to_string(out.pruned) + " pruned by the thickness bound, " +
                             std::to_string(out.invalid) + " not valid requests";
  if (any_pass)
    out.message = std::string("the passing candidate of least ") + objective_name(rates.objective) + ", " +
                  plain_number(c.objective) + " " + objective_unit(rates.objective) + ", among " + counts;
  else
    out.message = "no candidate passes every check: the least-failing is returned, with status fail (max "
                  "utilisation " + plain_number(c.max_utilisation) + ", " + c.governing_check + " at " +
                  c.governing_where + "), among " + counts;
  return out;
}

}  // namespace armature
