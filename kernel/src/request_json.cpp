// Request parsing and structural validation. Every problem is recorded with
// its field path; nothing is thrown from here and nothing is defaulted
// silently (defaults are the documented ones of contract.md).
#include <cmath>
#include <cstdio>
#include <set>

#include "armature/json_io.hpp"

namespace armature {
namespace {

using nlohmann::json;

std::string format_number(double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.6g", v);
  return buf;
}

std::string describe(const json& v) {
  if (v.is_string()) return "string \"" + v.get<std::string>() + "\"";
  if (v.is_number()) return format_number(v.get<double>());
  if (v.is_boolean()) return v.get<bool>() ? "true" : "false";
  return v.type_name();
}

// Reads the members of one JSON object, recording problems under `path`.
class ObjectReader {
 public:
  ObjectReader(const json& object, std::string path, InputProblems& problems,
               std::set<std::string> known)
      : object_(object), path_(std::move(path)), problems_(problems), known_(std::move(known)) {
    for (auto it = object_.begin(); it != object_.end(); ++it)
      if (!known_.count(it.key())) problems_.add(field(it.key()), "unknown field");
  }

  std::string field(const std::string& key) const {
    return path_.empty() ? key : path_ + "." + key;
  }
  const json* find(const std::string& key) const {
    auto it = object_.find(key);
    return it == object_.end() ? nullptr : &*it;
  }

  std::optional<double> number(const std::string& key, bool required = false) {
    const json* v = find(key);
    if (!v) {
      if (required) problems_.add(field(key), "required");
      return std::nullopt;
    }
    return number_value(*v, field(key));
  }

  std::optional<double> number_value(const json& v, const std::string& f) {
    if (!v.is_number()) {
      problems_.add(f, "must be a number, got " + describe(v));
      return std::nullopt;
    }
    double x = v.get<double>();
    if (!std::isfinite(x)) {
      problems_.add(f, "must be a finite number");
      return std::nullopt;
    }
    return x;
  }

  std::optional<std::string> text(const std::string& key, bool required = false) {
    const json* v = find(key);
    if (!v) {
      if (required) problems_.add(field(key), "required");
      return std::nullopt;
    }
    if (!v->is_string()) {
      problems_.add(field(key), "must be a string, got " + describe(*v));
      return std::nullopt;
    }
    return v->get<std::string>();
  }

  // Returns the member if it is an object; records a problem otherwise.
  const json* object(const std::string& key, bool required = false) {
    const json* v = find(key);
    if (!v) {
      if (required) problems_.add(field(key), "required");
      return nullptr;
    }
    if (!v->is_object()) {
      problems_.add(field(key), "must be an object, got " + describe(*v));
      return nullptr;
    }
    return v;
  }

  const json* array(const std::string& key, bool required = false) {
    const json* v = find(key);
    if (!v) {
      if (required) problems_.add(field(key), "required");
      return nullptr;
    }
    if (!v->is_array()) {
      problems_.add(field(key), "must be a list, got " + describe(*v));
      return nullptr;
    }
    return v;
  }

  // Range check; returns the value when it is inside [lo, hi].
  std::optional<double> in_range(std::optional<double> v, const std::string& key, double lo,
                                 double hi, const char* unit, bool lo_open = false) {
    if (!v) return v;
    bool below = lo_open ? *v <= lo : *v < lo;
    if (below || *v > hi) {
      std::string u = unit[0] ? std::string(" ") + unit : std::string();
      if (lo_open)
        problems_.add(field(key), "must be greater than " + format_number(lo) + u +
                                      " and at most " + format_number(hi) + u + ", got " +
                                      format_number(*v));
      else
        problems_.add(field(key), "must be between " + format_number(lo) + " and " +
                                      format_number(hi) + u + ", got " + format_number(*v));
      return std::nullopt;
    }
    return v;
  }

  InputProblems& problems() { return problems_; }

 private:
  const json& object_;
  std::string path_;
  InputProblems& problems_;
  std::set<std::string> known_;
};

constexpr std::size_t max_spans = 20;

void read_slab(const json& j, InputProblems& problems, SlabInput& slab) {
  ObjectReader r(j, "slab", problems, {"spans_m", "ends", "thickness_mm", "strip_width_mm"});
  if (const json* spans = r.array("spans_m", true)) {
    if (spans->empty() || spans->size() > max_spans) {
      problems.add("slab.spans_m", "must list 1 to " + std::to_string(max_spans) +
                                       " spans, got " + std::to_string(spans->size()));
    } else {
      for (std::size_t i = 0; i < spans->size(); ++i) {
        std::string f = "slab.spans_m[" + std::to_string(i) + "]";
        auto v = r.number_value((*spans)[i], f);
        if (!v) continue;
        if (*v <= 0.0 || *v > 30.0) {
          problems.add(f, "must be greater than 0 m and at most 30 m, got " + format_number(*v));
          continue;
        }
        slab.spans_mm.push_back(*v * 1000.0);
      }
    }
  }
  if (const json* ends = r.array("ends", true)) {
    if (ends->size() != 2) {
      problems.add("slab.ends", "must list exactly two end supports, got " +
                                    std::to_string(ends->size()));
    } else {
      for (std::size_t i = 0; i < 2; ++i) {
        std::string f = "slab.ends[" + std::to_string(i) + "]";
        const json& e = (*ends)[i];
        std::string name = e.is_string() ? e.get<std::string>() : std::string();
        if (name == "pinned") slab.ends[i] = EndSupport::pinned;
        else if (name == "fixed") slab.ends[i] = EndSupport::fixed;
        else if (name == "free") slab.ends[i] = EndSupport::free;
        else problems.add(f, "must be \"pinned\", \"fixed\" or \"free\", got " + describe(e));
      }
    }
  }
  if (auto h = r.in_range(r.number("thickness_mm", true), "thickness_mm", 50, 1500, "mm"))
    slab.thickness_mm = *h;
  if (auto b = r.in_range(r.number("strip_width_mm"), "strip_width_mm", 100, 10000, "mm"))
    slab.strip_width_mm = *b;
}

void read_concrete(const json& j, InputProblems& problems, ConcreteInput& c) {
  ObjectReader r(j, "concrete", problems,
                 {"class", "cylinder_strength_MPa", "density_kN_m3", "aggregate_mm"});
  c.strength_class = r.text("class");
  c.cylinder_strength_MPa = r.number("cylinder_strength_MPa");
  bool has_class = r.find("class") != nullptr;
  bool has_fck = r.find("cylinder_strength_MPa") != nullptr;
  if (has_class && has_fck)
    problems.add("concrete", "give either class or cylinder_strength_MPa, not both");
  if (!has_class && !has_fck)
    problems.add("concrete.class", "required (or give concrete.cylinder_strength_MPa)");
  c.density_kN_m3 = r.in_range(r.number("density_kN_m3"), "density_kN_m3", 18, 30, "kN/m3");
  if (auto dg = r.in_range(r.number("aggregate_mm"), "aggregate_mm", 4, 63, "mm"))
    c.aggregate_mm = *dg;
}

void read_reinforcement(const json& j, InputProblems& problems, ReinforcementInput& s) {
  ObjectReader r(j, "reinforcement", problems, {"yield_strength_MPa", "bars"});
  s.yield_strength_MPa = r.number("yield_strength_MPa");
  if (const json* bars = r.array("bars")) {
    if (bars->empty()) {
      problems.add("reinforcement.bars", "must list at least one bar");
      return;
    }
    std::vector<std::string> names;
    for (std::size_t i = 0; i < bars->size(); ++i) {
      const json& b = (*bars)[i];
      std::string f = "reinforcement.bars[" + std::to_string(i) + "]";
      if (!b.is_string()) {
        problems.add(f, "must be a bar designation string such as \"12\", got " + describe(b));
        continue;
      }
      names.push_back(b.get<std::string>());
    }
    s.bars = names;
  }
}

void read_loads(const json& j, InputProblems& problems, LoadsInput& l) {
  ObjectReader r(j, "loads", problems, {"dead_kPa", "imposed_kPa", "imposed_category"});
  if (auto g = r.in_range(r.number("dead_kPa"), "dead_kPa", 0, 100, "kPa")) l.dead_MPa = *g * 1e-3;
  if (auto q = r.in_range(r.number("imposed_kPa", true), "imposed_kPa", 0, 100, "kPa"))
    l.imposed_MPa = *q * 1e-3;
  if (auto c = r.text("imposed_category")) l.imposed_category = *c;
}

void read_durability(const json& j, InputProblems& problems, DurabilityInput& d) {
  ObjectReader r(j, "durability", problems, {"cover_mm", "exposure", "design_life_years"});
  d.cover_mm = r.in_range(r.number("cover_mm"), "cover_mm", 0, 200, "mm", true);
  d.exposure = r.text("exposure");
  if (auto life = r.in_range(r.number("design_life_years"), "design_life_years", 1, 200, "years"))
    d.design_life_years = *life;
}

void read_fire(const json& j, InputProblems& problems, FireInput& f) {
  ObjectReader r(j, "fire", problems, {"resistance_min"});
  if (auto t = r.number("resistance_min")) {
    if (*t != std::floor(*t) || *t <= 0 || *t > 1000)
      problems.add("fire.resistance_min", "must be a whole number of minutes, got " +
                                              format_number(*t));
    else
      f.resistance_min = static_cast<int>(*t);
  }
}

void read_design(const json& j, InputProblems& problems, DesignOptions& d) {
  ObjectReader r(j, "design", problems, {"combination", "redistribution_percent"});
  d.combination = r.text("combination");
  if (auto p = r.in_range(r.number("redistribution_percent"), "redistribution_percent", 0, 50, "%"))
    d.redistribution_percent = *p;
}

}  // namespace

Request request_from_json(const json& j, InputProblems& problems) {
  Request req;
  if (!j.is_object()) {
    problems.add("(request)", "must be a JSON object, got " + describe(j));
    return req;
  }
  ObjectReader r(j, "", problems,
                 {"code", "variant", "slab", "concrete", "reinforcement", "loads", "durability",
                  "fire", "design"});
  if (auto code = r.text("code", true)) req.code = *code;
  req.variant = r.text("variant");
  if (const json* s = r.object("slab", true)) read_slab(*s, problems, req.slab);
  if (const json* c = r.object("concrete", true)) read_concrete(*c, problems, req.concrete);
  if (const json* s = r.object("reinforcement")) read_reinforcement(*s, problems, req.reinforcement);
  if (const json* l = r.object("loads", true)) read_loads(*l, problems, req.loads);
  if (const json* d = r.object("durability")) read_durability(*d, problems, req.durability);
  if (const json* f = r.object("fire")) read_fire(*f, problems, req.fire);
  if (const json* d = r.object("design")) read_design(*d, problems, req.design);
  return req;
}

}  // namespace armature
