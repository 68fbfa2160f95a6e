// Request parsing and structural validation. Every problem is recorded with
// its field path; nothing is thrown from here and nothing is defaulted
// silently (defaults are the documented ones of contract.md).
#include <cmath>
#include <cstdio>
#include <algorithm>
#include <initializer_list>
#include <string_view>

#include "armature/json_io.hpp"
#include "armature/member.hpp"
#include "armature/units.hpp"

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

// A field that may also be given under its plain name as a quantity string:
// "thickness": "8 in" for "thickness_mm": 203.2.
struct PlainAlias {
  const char* plain;
  const char* canonical;
  Dimension dimension;
  double unit_si;  // one canonical unit in SI base units
};

const std::vector<PlainAlias>& plain_aliases() {
  static const std::vector<PlainAlias> aliases{
      {"spans", "spans_m", Dimension::length, 1.0},
      {"thickness", "thickness_mm", Dimension::length, 1e-3},
      {"strip_width", "strip_width_mm", Dimension::length, 1e-3},
      {"cylinder_strength", "cylinder_strength_MPa", Dimension::pressure, 1e6},
      {"density", "density_kN_m3", Dimension::unit_weight, 1e3},
      {"aggregate", "aggregate_mm", Dimension::length, 1e-3},
      {"yield_strength", "yield_strength_MPa", Dimension::pressure, 1e6},
      {"dead", "dead_kPa", Dimension::pressure, 1e3},
      {"imposed", "imposed_kPa", Dimension::pressure, 1e3},
      {"cover", "cover_mm", Dimension::length, 1e-3},
  };
  return aliases;
}

// Reads the members of one JSON object, recording problems under `path`.
class ObjectReader {
 public:
  ObjectReader(const json& object, std::string path, InputProblems& problems,
               std::initializer_list<std::string_view> known)
      : object_(object), path_(std::move(path)), problems_(problems), known_(known) {
    for (auto it = object_.begin(); it != object_.end(); ++it)
      if (!is_known(it.key()) && !alias_named(it.key())) problems_.add(field(it.key()), "unknown field");
  }

  bool is_known(std::string_view key) const {
    return std::find(known_.begin(), known_.end(), key) != known_.end();
  }
  // The plain-name alias of one of this object's fields, by its plain name.
  const PlainAlias* alias_named(std::string_view plain) const {
    for (const auto& a : plain_aliases())
      if (plain == a.plain && is_known(a.canonical)) return &a;
    return nullptr;
  }

  const PlainAlias* alias_of(const std::string& canonical) const {
    for (const auto& a : plain_aliases())
      if (canonical == a.canonical && is_known(a.canonical)) return &a;
    return nullptr;
  }

  // The plain-name form of a field, if given: "thickness": "8 in". Sets
  // `given` when the plain name is present (even if it is wrong).
  const json* plain_form(const std::string& canonical, const PlainAlias*& alias, bool& given) {
    alias = alias_of(canonical);
    given = false;
    if (!alias) return nullptr;
    const json* v = find(alias->plain);
    if (!v) return nullptr;
    given = true;
    if (find(canonical)) {
      problems_.add(field(alias->plain), std::string("give either ") + alias->plain + " or " +
                                             canonical + ", not both");
      return nullptr;
    }
    return v;
  }

  // Converts one quantity string to the canonical unit of `alias`.
  std::optional<double> quantity_value(const json& v, const std::string& f, const PlainAlias& alias) {
    if (!v.is_string()) {
      problems_.add(f, std::string("must be a quantity with a unit such as \"8 in\" or \"200 mm\", got ") +
                           describe(v));
      return std::nullopt;
    }
    std::string error;
    auto q = parse_quantity(v.get<std::string>(), error);
    if (!q) {
      problems_.add(f, error);
      return std::nullopt;
    }
    if (q->dimension != alias.dimension) {
      problems_.add(f, std::string("must be ") + to_string(alias.dimension) + " (" +
                           units_of(alias.dimension) + "), got " + to_string(q->dimension) + " \"" +
                           v.get<std::string>() + "\"");
      return std::nullopt;
    }
    return q->si / alias.unit_si;
  }

  std::string field(const std::string& key) const {
    return path_.empty() ? key : path_ + "." + key;
  }
  const json* find(const std::string& key) const {
    auto it = object_.find(key);
    return it == object_.end() ? nullptr : &*it;
  }

  std::optional<double> number(const std::string& key, bool required = false) {
    const PlainAlias* alias = nullptr;
    bool plain_given = false;
    if (const json* p = plain_form(key, alias, plain_given))
      return quantity_value(*p, field(alias->plain), *alias);
    const json* v = find(key);
    if (!v) {
      if (required && !plain_given) problems_.add(field(key), "required");
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
      std::string name = field(key);
      if (const PlainAlias* a = alias_of(key); a && find(a->plain)) name = field(a->plain);
      if (lo_open)
        problems_.add(name, "must be greater than " + format_number(lo) + u +
                                      " and at most " + format_number(hi) + u + ", got " +
                                      format_number(*v));
      else
        problems_.add(name, "must be between " + format_number(lo) + " and " +
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
  std::vector<std::string_view> known_;
};

constexpr std::size_t max_spans = 20;


// slab.support_widths_mm: the numbers here; what they must be against the
// strip (add_support_width_problems, member.hpp), judged against the spans
// and ends only when those were read without a problem (`geometry_ok`).
void read_support_widths(const json& widths, InputProblems& problems, bool geometry_ok, SlabInput& slab) {
  const std::string name = "slab.support_widths_mm";
  std::vector<double> t;
  bool numbers = true;
  for (std::size_t i = 0; i < widths.size(); ++i) {
    const json& v = widths[i];
    if (!v.is_number()) {
      problems.add(name + "[" + std::to_string(i) + "]", "must be a number (mm), got " + describe(v));
      numbers = false;
      t.push_back(0.0);  // a placeholder no check refuses, so the others are judged
      continue;
    }
    t.push_back(v.get<double>());
  }
  const std::size_t before = problems.items().size();
  add_support_width_problems(slab.spans_mm, slab.ends, t, geometry_ok && numbers, problems);
  if (!numbers) return;
  if (problems.items().size() == before) slab.support_widths_mm = std::move(t);
}

void read_slab(const json& j, InputProblems& problems, SlabInput& slab) {
  ObjectReader r(j, "slab", problems,
                 {"type", "spans_m", "ends", "thickness_mm", "strip_width_mm", "support_widths_mm"});
  if (auto type = r.text("type"); type && *type != "one_way")  // "two_way", "flat": read_two_way_slab
    problems.add("slab.type", "must be \"one_way\", \"two_way\" or \"flat\", got \"" + *type + "\"");
  const std::size_t problems_before = problems.items().size();
  const PlainAlias* alias = nullptr;
  bool plain_given = false;
  const json* plain_spans = r.plain_form("spans_m", alias, plain_given);
  const std::string spans_name = plain_spans ? "slab.spans" : "slab.spans_m";
  const json* spans = nullptr;
  if (plain_spans) {
    if (plain_spans->is_array()) spans = plain_spans;
    else problems.add(spans_name, "must be a list, got " + describe(*plain_spans));
  } else if (!plain_given) {
    spans = r.array("spans_m", true);
  }
  if (spans) {
    if (spans->empty() || spans->size() > max_spans) {
      problems.add(spans_name, "must list 1 to " + std::to_string(max_spans) +
                                   " spans, got " + std::to_string(spans->size()));
    } else {
      for (std::size_t i = 0; i < spans->size(); ++i) {
        std::string f = spans_name + "[" + std::to_string(i) + "]";
        auto v = plain_spans ? r.quantity_value((*spans)[i], f, *alias) : r.number_value((*spans)[i], f);
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
  // The widths are judged against the spans and ends alone: a problem in
  // another field of the slab must not hide theirs.
  const bool geometry_ok = problems.items().size() == problems_before;
  if (auto h = r.in_range(r.number("thickness_mm", true), "thickness_mm", 50, 1500, "mm"))
    slab.thickness_mm = *h;
  if (auto b = r.in_range(r.number("strip_width_mm"), "strip_width_mm", 100, 10000, "mm"))
    slab.strip_width_mm = *b;
  if (const json* widths = r.array("support_widths_mm")) read_support_widths(*widths, problems, geometry_ok, slab);
}

void read_concrete(const json& j, InputProblems& problems, ConcreteInput& c) {
  ObjectReader r(j, "concrete", problems,
                 {"class", "cylinder_strength_MPa", "density_kN_m3", "aggregate_mm"});
  c.strength_class = r.text("class");
  c.cylinder_strength_MPa = r.number("cylinder_strength_MPa");
  bool has_class = r.find("class") != nullptr;
  bool has_fck = r.find("cylinder_strength_MPa") != nullptr || r.find("cylinder_strength") != nullptr;
  if (has_class && has_fck)
    problems.add("concrete", "give either class or a cylinder strength, not both");
  if (!has_class && !has_fck)
    problems.add("concrete.class", "required (or give concrete.cylinder_strength_MPa)");
  c.density_kN_m3 = r.in_range(r.number("density_kN_m3"), "density_kN_m3", 18, 30, "kN/m3");
  if (auto dg = r.in_range(r.number("aggregate_mm"), "aggregate_mm", 4, 63, "mm"))
    c.aggregate_mm = *dg;
}

// Check mode: reinforcement.given, one entry per region, kept in the
// request's order (its index names it in later problems). Whether the
// region exists and matches its face (design(), with the strip and the
// code's rule for pinned ends) and whether the bar is in the catalogue
// (the code's validate) are checked later; a field with a problem here is
// left empty, and those checks pass over it.
void read_given(const json& list, InputProblems& problems, std::vector<GivenBars>& out, bool two_way) {
  for (std::size_t i = 0; i < list.size(); ++i) {
    const std::string path = "reinforcement.given[" + std::to_string(i) + "]";
    const json& entry = list[i];
    GivenBars& g = out.emplace_back();
    if (!entry.is_object()) {
      problems.add(path, "must be an object {\"where\", \"face\", \"bar\", \"spacing_mm\"}, got " +
                             describe(entry));
      continue;
    }
    ObjectReader r(entry, path, problems, {"where", "face", "direction", "bar", "spacing_mm"});
    const auto where = r.text("where", true);
    if (where && where->empty())
      problems.add(path + ".where", "must name a region such as \"span 1\" or \"support 2\"");
    if (auto face = r.text("face", true)) {
      if (*face == "bottom") g.face = Face::bottom;
      else if (*face == "top") g.face = Face::top;
      else problems.add(path + ".face", "must be \"top\" or \"bottom\", got \"" + *face + "\"");
    }
    // A one-way strip's main bars run along it (x, as the regions' x_m);
    // its distribution bars are no design region.
    if (two_way) {  // a two-way slab's region has bars in x and in y
      if (auto direction = r.text("direction", true)) {
        if (*direction == "x" || *direction == "y") g.direction = *direction;
        else problems.add(path + ".direction", "must be \"x\" or \"y\", got \"" + *direction + "\"");
      }
    } else if (auto direction = r.text("direction"); direction && *direction != "x")
      problems.add(path + ".direction",
                   "a one-way strip's main bars run along the strip: \"x\" (or leave it out), got \"" +
                       *direction + "\"");
    // Listed once: a strip's region by its name; a plate's by its name,
    // face and direction (a bay has bars in x and in y, on both faces).
    if (where && !where->empty()) {
      const auto same = std::find_if(out.begin(), out.end() - 1, [&](const GivenBars& o) {
        return o.where == *where && (!two_way || (o.face == g.face && o.direction == g.direction));
      });
      if (same != out.end() - 1)
        problems.add(path + ".where", "the region '" + *where + "'" +
                                          (two_way ? " (" + std::string(to_string(g.face)) + ", bars in " + g.direction + ")" : std::string()) +
                                          " is already listed in reinforcement.given[" +
                                          std::to_string(same - out.begin()) + "]");
      else
        g.where = *where;
    }
    if (auto bar = r.text("bar", true)) {
      if (bar->empty()) problems.add(path + ".bar", "must be a bar designation such as \"12\" or \"#4\"");
      else g.bar = *bar;
    }
    if (auto s = r.in_range(r.number("spacing_mm", true), "spacing_mm", 0, 1000, "mm", true))
      g.spacing_mm = *s;
  }
}

void read_reinforcement(const json& j, InputProblems& problems, ReinforcementInput& s, bool two_way = false) {
  ObjectReader r(j, "reinforcement", problems,
                 {"yield_strength_MPa", "bars", "ductility_class", "spacing_step_mm", "min_spacing_mm",
                  "given", "rationalise", "outer_layer"});
  s.yield_strength_MPa = r.number("yield_strength_MPa");
  if (auto c = r.text("ductility_class")) {
    if (*c == "A") s.ductility_class = DuctilityClass::A;
    else if (*c == "B") s.ductility_class = DuctilityClass::B;
    else if (*c == "C") s.ductility_class = DuctilityClass::C;
    else problems.add("reinforcement.ductility_class", "must be \"A\", \"B\" or \"C\", got \"" + *c + "\"");
  }
  if (auto step = r.in_range(r.number("spacing_step_mm"), "spacing_step_mm", 5, 100, "mm"))
    s.spacing_step_mm = *step;
  if (auto first = r.in_range(r.number("min_spacing_mm"), "min_spacing_mm", 20, 300, "mm"))
    s.min_spacing_mm = *first;
  if (auto how = r.text("rationalise")) {
    if (*how == "none") s.rationalise = Rationalise::none;
    else if (*how == "uniform_bottom") s.rationalise = Rationalise::uniform_bottom;
    else problems.add("reinforcement.rationalise",
                      "must be \"none\" or \"uniform_bottom\", got \"" + *how + "\"");
  }
  if (const json* given = r.array("given")) read_given(*given, problems, s.given, two_way);
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

// The largest characteristic value of an action of each distribution: a
// bound against a mistyped unit, not an engineering limit.
constexpr double max_action_kPa = 100.0;
constexpr double max_action_line_kN_per_m = 1000.0;
constexpr double max_action_point_kN = 10000.0;
constexpr double max_effective_width_m = 100.0;

bool is_imposed_category(const std::string& c) {
  return c.size() == 1 && c[0] >= 'A' && c[0] <= 'H';
}

// One entry of loads.actions; nullopt when it has a problem (recorded).
std::optional<Action> read_action(const json& e, const std::string& path, const std::vector<double>& spans_mm,
                                  bool spans_known, InputProblems& problems) {
  if (!e.is_object()) {
    problems.add(path, "must be an object with name, kind and one of kPa, line_kN_per_m or point_kN, got " +
                           describe(e));
    return std::nullopt;
  }
  const std::size_t before = problems.items().size();
  ObjectReader r(e, path, problems,
                 {"name", "kind", "category", "kPa", "line_kN_per_m", "point_kN", "span", "from_m", "to_m",
                  "at_m", "effective_width_m"});
  Action a;
  a.field = path;
  if (auto name = r.text("name", true)) {
    if (name->find_first_not_of(" \t") == std::string::npos)
      problems.add(r.field("name"), "must not be empty");
    else
      a.name = *name;
  }
  if (auto kind = r.text("kind", true)) {
    if (*kind == "permanent") a.kind = ActionKind::permanent;
    else if (*kind == "imposed") a.kind = ActionKind::imposed;
    else if (*kind == "snow") a.kind = ActionKind::snow;
    else if (*kind == "roof") a.kind = ActionKind::roof;
    else
      problems.add(r.field("kind"), "must be \"permanent\", \"imposed\", \"snow\" or \"roof\", got \"" +
                                        *kind + "\"");
    if (auto cat = r.text("category")) {
      if (a.kind == ActionKind::imposed) {
        if (is_imposed_category(*cat)) a.category = *cat;
        else
          problems.add(r.field("category"), "must be an imposed-load category A to H (EN 1990 Table A1.1), got \"" +
                                                *cat + "\"");
      } else if (a.kind == ActionKind::roof) {
        if (*cat != "H")
          problems.add(r.field("category"), "a roof action is category H; leave category out or give \"H\", got \"" +
                                                *cat + "\"");
      } else {
        problems.add(r.field("category"), "applies to imposed and roof actions only, not to " + *kind);
      }
    } else if (*kind == "imposed") {
      problems.add(r.field("category"), "required for an imposed action: A to H (EN 1990 Table A1.1)");
    }
    if (a.kind == ActionKind::roof) a.category = "H";
  }
  // Exactly one distribution.
  const bool uniform = r.find("kPa") != nullptr, line = r.find("line_kN_per_m") != nullptr,
             point = r.find("point_kN") != nullptr;
  const int shapes = int(uniform) + int(line) + int(point);
  if (shapes == 0) {
    problems.add(path, "give one of kPa (uniform), line_kN_per_m (line load) or point_kN (point load)");
    return std::nullopt;
  }
  if (shapes > 1) {
    problems.add(path, "give only one of kPa, line_kN_per_m and point_kN: one entry is one action "
                       "of one distribution");
    return std::nullopt;
  }
  auto value_in = [&](const char* key, double hi, const char* unit) -> std::optional<double> {
    auto v = r.number(key);
    if (v && *v < 0.0) {
      problems.add(r.field(key), std::string("must not be negative (loads act downward), got ") + format_number(*v));
      return std::nullopt;
    }
    return r.in_range(v, key, 0, hi, unit);
  };
  if (uniform) {
    a.distribution = Distribution::uniform;
    if (auto v = value_in("kPa", max_action_kPa, "kPa")) a.value = *v * 1e-3;
  } else if (line) {
    a.distribution = Distribution::line;
    if (auto v = value_in("line_kN_per_m", max_action_line_kN_per_m, "kN/m")) a.value = *v;  // kN/m = N/mm
  } else {
    a.distribution = Distribution::point;
    if (auto v = value_in("point_kN", max_action_point_kN, "kN")) a.value = *v * 1e3;
  }
  // The span, 1-based in the request.
  std::optional<double> span_length_mm;
  if (const json* sp = r.find("span")) {
    if (!sp->is_number() || !std::isfinite(sp->get<double>()) || sp->get<double>() != std::floor(sp->get<double>())) {
      problems.add(r.field("span"), "must be a whole span number (1 for the first span), got " + describe(*sp));
    } else if (spans_known) {
      const double k = sp->get<double>();
      if (k < 1 || k > static_cast<double>(spans_mm.size()))
        problems.add(r.field("span"), "must be a span number from 1 to " + std::to_string(spans_mm.size()) +
                                          " (slab.spans_m), got " + format_number(k));
      else {
        a.span = static_cast<std::size_t>(k) - 1;
        span_length_mm = spans_mm[*a.span];
      }
    }
  } else if (line || point) {
    problems.add(r.field("span"), std::string("required for a ") + (line ? "line" : "point") +
                                      " load: the span it acts on (1 for the first span)");
  }
  // A position on the span, from its left support, in m.
  auto position = [&](const char* key) -> std::optional<double> {
    auto v = r.number(key);
    if (!v) return std::nullopt;
    if (*v < 0.0) {
      problems.add(r.field(key), "must not be negative (measured from the span's left support), got " +
                                     format_number(*v) + " m");
      return std::nullopt;
    }
    if (span_length_mm && *v * 1000.0 > *span_length_mm * (1 + 1e-12)) {
      problems.add(r.field(key), "must be within the span (0 to " + format_number(*span_length_mm / 1000.0) +
                                     " m, from its left support), got " + format_number(*v) + " m");
      return std::nullopt;
    }
    return std::min(*v * 1000.0, span_length_mm.value_or(*v * 1000.0));
  };
  auto not_with = [&](const char* key, const std::string& why) {
    if (r.find(key)) problems.add(r.field(key), why);
  };
  if (uniform) {
    not_with("at_m", "applies to line and point loads; a uniform load on part of a span takes from_m and to_m");
    not_with("effective_width_m", "applies to point loads only");
    if (!r.find("span")) {
      not_with("from_m", "needs span: from_m and to_m place a uniform load within one span");
      not_with("to_m", "needs span: from_m and to_m place a uniform load within one span");
    } else {
      a.from_mm = position("from_m");
      a.to_mm = position("to_m");
      if (span_length_mm && (r.find("from_m") || r.find("to_m"))) {
        const double from = a.from_mm.value_or(0.0), to = a.to_mm.value_or(*span_length_mm);
        const bool from_ok = !r.find("from_m") || a.from_mm, to_ok = !r.find("to_m") || a.to_mm;
        if (from_ok && to_ok && !(from < to))
          problems.add(r.field(r.find("to_m") ? "to_m" : "from_m"),
                       "the loaded part must have a length: from_m (" + format_number(from / 1000.0) +
                           " m) must be less than to_m (" + format_number(to / 1000.0) + " m)");
      }
    }
  } else {
    not_with("from_m", "applies to uniform loads (kPa) only");
    not_with("to_m", "applies to uniform loads (kPa) only");
    if (r.find("at_m")) {
      if (auto at = position("at_m")) a.at_mm = *at;
    } else {
      problems.add(r.field("at_m"), "required: the load's position from the left support of its span, in m");
    }
    if (line) {
      not_with("effective_width_m", "applies to point loads only (a line load acts across the strip's width)");
    } else if (const json* w = r.find("effective_width_m")) {
      auto v = r.number_value(*w, r.field("effective_width_m"));
      if (v && (*v <= 0.0 || *v > max_effective_width_m))
        problems.add(r.field("effective_width_m"), "must be greater than 0 m and at most " +
                                                       format_number(max_effective_width_m) + " m, got " +
                                                       format_number(*v));
      else if (v)
        a.effective_width_mm = *v * 1000.0;
    } else {
      problems.add(r.field("effective_width_m"),
                   "required for a point load: neither EN 1992-1-1 nor ACI 318-19 gives the width over "
                   "which a point load spreads in a one-way slab, so give the effective width (m)");
    }
  }
  if (problems.items().size() != before) return std::nullopt;
  return a;
}

// A slab's extent in plan, mm: x_min, y_min, x_max, y_max.
using PlanExtent = std::array<double, 4>;

std::optional<Action> read_plan_action(const json& e, const std::string& path,
                                       const std::optional<PlanExtent>& plan, InputProblems& problems);

// `plan`: a two-way or flat slab's actions are placed in plan
// (read_plan_action), against its extent where known.
void read_loads(const json& j, InputProblems& problems, LoadsInput& l, const std::vector<double>& spans_mm,
                bool spans_known, const std::optional<PlanExtent>* plan = nullptr) {
  ObjectReader r(j, "loads", problems, {"dead_kPa", "imposed_kPa", "imposed_category", "actions"});
  const bool actions_given = r.find("actions") != nullptr;
  if (auto g = r.in_range(r.number("dead_kPa"), "dead_kPa", 0, 100, "kPa")) l.dead_MPa = *g * 1e-3;
  // The shorthand imposed load is required unless the actions are listed.
  if (auto q = r.in_range(r.number("imposed_kPa", !actions_given), "imposed_kPa", 0, 100, "kPa", true))
    l.imposed_MPa = *q * 1e-3;
  if (auto c = r.text("imposed_category")) l.imposed_category = *c;
  if (const json* list = r.array("actions")) {
    l.actions_given = true;
    std::vector<std::string> names{self_weight_action_name, dead_shorthand_action_name,
                                   imposed_shorthand_action_name};
    for (std::size_t i = 0; i < list->size(); ++i) {
      const std::string path = "loads.actions[" + std::to_string(i) + "]";
      const json& e = (*list)[i];
      if (e.is_object())
        if (auto it = e.find("name"); it != e.end() && it->is_string()) {
          const std::string name = it->get<std::string>();
          const auto found = std::find(names.begin(), names.end(), name);
          if (!name.empty() && found != names.end()) {
            const auto k = static_cast<std::size_t>(found - names.begin());
            problems.add(path + ".name",
                         "the name \"" + name + "\" is already taken" +
                             (k < 3 ? std::string(" by the action the kernel makes for ") +
                                          (k == 0 ? "the self-weight" : k == 1 ? "loads.dead_kPa" : "loads.imposed_kPa")
                                    : " by loads.actions[" + std::to_string(k - 3) + "]") +
                             "; names must be unique");
          }
          names.push_back(name);
        } else {
          names.push_back(std::string());
        }
      else
        names.push_back(std::string());
      if (auto a = plan ? read_plan_action(e, path, *plan, problems) : read_action(e, path, spans_mm, spans_known, problems))
        l.actions.push_back(std::move(*a));
    }
  }
}

// The plain form (cover_mm, exposure) applies to both faces; a face object
// (top, bottom: cover_mm, exposure) sets that face. One key given both ways
// for the same face is an error on the face's field.
void read_durability(const json& j, InputProblems& problems, DurabilityInput& d) {
  ObjectReader r(j, "durability", problems, {"cover_mm", "exposure", "design_life_years", "top", "bottom"});
  const auto cover = r.in_range(r.number("cover_mm"), "cover_mm", 0, 200, "mm", true);
  const auto exposure = r.text("exposure");
  const std::string cover_name = "durability.cover_mm";
  const bool cover_plain = r.find("cover_mm") || r.find("cover");
  const bool exposure_plain = r.find("exposure") != nullptr;
  for (Face face : {Face::bottom, Face::top}) {
    FaceDurability& fd = d.face(face);
    fd.cover_mm = cover;
    fd.exposure = exposure;
    fd.cover_field = cover_name;
    fd.exposure_field = "durability.exposure";
    const std::string path = std::string("durability.") + to_string(face);
    const json* f = r.object(to_string(face));
    if (!f) continue;
    ObjectReader fr(*f, path, problems, {"cover_mm", "exposure"});
    const bool face_cover = fr.find("cover_mm") || fr.find("cover");
    const std::string face_cover_name = path + (fr.find("cover") ? ".cover" : ".cover_mm");
    if (face_cover && cover_plain)
      problems.add(face_cover_name, "give either " + cover_name + " (both faces) or " + face_cover_name +
                                        ", not both");
    else if (face_cover) {
      fd.cover_mm = fr.in_range(fr.number("cover_mm"), "cover_mm", 0, 200, "mm", true);
      fd.cover_field = face_cover_name;
    }
    if (fr.find("exposure") && exposure_plain)
      problems.add(path + ".exposure",
                   "give either durability.exposure (both faces) or " + path + ".exposure, not both");
    else if (fr.find("exposure")) {
      fd.exposure = fr.text("exposure");
      fd.exposure_field = path + ".exposure";
    }
  }
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

// serviceability (contract-v2 section 4): the deflection's method and the
// creep and shrinkage inputs of the calculated deflection, the crack
// width's method. A null creep coefficient or shrinkage strain is the
// code's method, as if left out. Whether a code builds the calculated
// deflection is the code's to say (its validate).
void read_serviceability(const json& j, InputProblems& problems, ServiceabilityInput& s) {
  ObjectReader r(j, "serviceability", problems,
                 {"deflection", "partitions", "creep_coefficient", "relative_humidity_percent",
                  "age_at_loading_days", "partitions_age_days", "cement_class", "shrinkage_strain",
                  "crack_width"});
  if (auto deflection = r.text("deflection")) {
    if (*deflection == "span_depth") s.deflection = DeflectionMethod::span_depth;
    else if (*deflection == "calculated") s.deflection = DeflectionMethod::calculated;
    else if (*deflection == "both") s.deflection = DeflectionMethod::both;
    else problems.add("serviceability.deflection",
                      "must be \"span_depth\", \"calculated\" or \"both\", got \"" + *deflection + "\"");
  }
  if (const json* p = r.find("partitions")) {
    if (p->is_boolean()) s.partitions = p->get<bool>();
    else problems.add("serviceability.partitions", "must be true or false, got " + describe(*p));
  }
  auto optional_number = [&](const char* key) -> std::optional<double> {
    const json* v = r.find(key);
    if (!v || v->is_null()) return std::nullopt;
    return r.number(key);
  };
  s.creep_coefficient = r.in_range(optional_number("creep_coefficient"), "creep_coefficient", 0, 6, "");
  s.shrinkage_strain = r.in_range(optional_number("shrinkage_strain"), "shrinkage_strain", 0, 0.002, "");
  s.relative_humidity_percent =
      r.in_range(r.number("relative_humidity_percent"), "relative_humidity_percent", 40, 100, "%");
  s.age_at_loading_days = r.in_range(r.number("age_at_loading_days"), "age_at_loading_days", 1, 3650, "days");
  s.partitions_age_days = r.in_range(r.number("partitions_age_days"), "partitions_age_days", 1, 36500, "days");
  if (s.age_at_loading_days && s.partitions_age_days && *s.partitions_age_days <= *s.age_at_loading_days) {
    problems.add("serviceability.partitions_age_days",
                 "must be later than serviceability.age_at_loading_days (" +
                     format_number(*s.age_at_loading_days) + " days), got " + format_number(*s.partitions_age_days));
    s.partitions_age_days.reset();
  }
  if (auto cement = r.text("cement_class")) {
    if (*cement == "S") s.cement_class = CementClass::S;
    else if (*cement == "N") s.cement_class = CementClass::N;
    else if (*cement == "R") s.cement_class = CementClass::R;
    else problems.add("serviceability.cement_class", "must be \"S\", \"N\" or \"R\", got \"" + *cement + "\"");
  }
  if (auto method = r.text("crack_width")) {
    if (*method == "tables") s.crack_width = CrackWidthMethod::tables;
    else if (*method == "calculated") s.crack_width = CrackWidthMethod::calculated;
    else problems.add("serviceability.crack_width",
                      "must be \"tables\" or \"calculated\", got \"" + *method + "\"");
  }
}

// detailing (contract-v2 section 5).
// slab_width_m: required for a strip; a plate's widths come from its plan.
void read_detailing(const json& j, InputProblems& problems, DetailingInput& d, bool width_required) {
  ObjectReader r(j, "detailing", problems, {"slab_width_m", "stock_length_m", "bond", "curtail"});
  d.requested = true;
  if (auto w = r.in_range(r.number("slab_width_m", width_required), "slab_width_m", 0, 1000, "m", true))
    d.slab_width_mm = *w * 1000.0;
  if (auto s = r.in_range(r.number("stock_length_m"), "stock_length_m", 0, 100, "m", true))
    d.stock_length_mm = *s * 1000.0;
  if (auto b = r.text("bond")) {
    if (*b == "auto") d.bond = BondChoice::automatic;
    else if (*b == "good") d.bond = BondChoice::good;
    else if (*b == "poor") d.bond = BondChoice::poor;
    else problems.add("detailing.bond", "must be \"auto\", \"good\" or \"poor\", got \"" + *b + "\"");
  }
  if (auto c = r.text("curtail")) {
    if (*c == "none") d.curtail = Curtailment::none;
    else if (*c == "alternate") d.curtail = Curtailment::alternate;
    else problems.add("detailing.curtail", "must be \"none\" or \"alternate\", got \"" + *c + "\"");
  }
}

// ---- two-way slabs (contract-v2 section 2) ---------------------------------

std::string not_yet(const Request& req) {
  return std::string("not available yet for ") + (req.slab_type == SlabType::flat ? "flat" : "two_way") + " slabs";
}

// slab.columns of a flat slab: size_mm [along x, along y], height_m, the
// storey heights below and above (one number: both; [below, above]; 0 on
// a side: no column there), and shear_reinforcement ("links" or "none").
void read_columns(const json& j, InputProblems& problems, ColumnsInput& c) {
  ObjectReader r(j, "slab.columns", problems, {"size_mm", "height_m", "shear_reinforcement"});
  if (auto s = r.text("shear_reinforcement")) {
    if (*s == "links") c.shear_reinforcement = true;
    else if (*s == "none") c.shear_reinforcement = false;
    else problems.add("slab.columns.shear_reinforcement", "must be \"links\" or \"none\", got \"" + *s + "\"");
  }
  if (const json* size = r.array("size_mm", true)) {
    if (size->size() != 2) {
      problems.add("slab.columns.size_mm", "must list the column's two sides [along x, along y] in mm, got " +
                                               std::to_string(size->size()) + " values");
    } else {
      for (std::size_t k = 0; k < 2; ++k) {
        const std::string f = "slab.columns.size_mm[" + std::to_string(k) + "]";
        auto v = r.number_value((*size)[k], f);
        if (!v) continue;
        if (*v < 100.0 || *v > 3000.0)
          problems.add(f, "must be from 100 mm to 3000 mm, got " + format_number(*v));
        else
          (k == 0 ? c.x_mm : c.y_mm) = *v;
      }
    }
  }
  if (const json* h = r.find("height_m")) {
    std::vector<std::pair<const json*, std::string>> values;
    if (h->is_array() && h->size() == 2) {
      values = {{&(*h)[0], "slab.columns.height_m[0]"}, {&(*h)[1], "slab.columns.height_m[1]"}};
    } else if (h->is_number()) {
      values = {{h, "slab.columns.height_m"}, {h, "slab.columns.height_m"}};
    } else {
      problems.add("slab.columns.height_m", "must be a storey height in m, or [below, above], got " + describe(*h));
    }
    for (std::size_t k = 0; k < values.size(); ++k) {
      auto v = r.number_value(*values[k].first, values[k].second);
      if (!v) continue;
      if (*v != 0.0 && (*v < 1.5 || *v > 20.0)) {
        if (k == 0 || values[1].second != values[0].second)
          problems.add(values[k].second, "must be 0 (no column on that side) or from 1.5 m to 20 m, got " +
                                             format_number(*v));
        continue;
      }
      (k == 0 ? c.below_mm : c.above_mm) = *v * 1000.0;
    }
  }
}

// slab of a two-way or flat slab: x_spans_m, y_spans_m, edges,
// thickness_mm (and columns for a flat slab). The one-way keys are
// refused, naming what a two-way slab takes instead.
void read_two_way_slab(const json& j, InputProblems& problems, Request& req, bool flat) {
  ObjectReader r(j, "slab", problems,
                 {"type", "x_spans_m", "y_spans_m", "edges", "thickness_mm", "spans_m", "ends", "strip_width_mm",
                  "support_widths_mm", "columns"});
  req.slab_type = flat ? SlabType::flat : SlabType::two_way;
  const std::string kind = flat ? "a flat slab" : "a two_way slab";
  TwoWayInput& t = req.two_way;
  auto spans = [&](const char* key, std::vector<double>& out) {
    const json* list = r.array(key, true);
    if (!list) return;
    const std::string name = std::string("slab.") + key;
    if (list->empty() || list->size() > max_spans) {
      problems.add(name, "must list 1 to " + std::to_string(max_spans) + " bays, got " + std::to_string(list->size()));
      return;
    }
    for (std::size_t i = 0; i < list->size(); ++i) {
      const std::string f = name + "[" + std::to_string(i) + "]";
      auto v = r.number_value((*list)[i], f);
      if (!v) continue;
      if (*v <= 0.0 || *v > 30.0) {
        problems.add(f, "must be greater than 0 m and at most 30 m, got " + format_number(*v));
        continue;
      }
      out.push_back(*v * 1000.0);
    }
  };
  spans("x_spans_m", t.x_spans_mm);
  spans("y_spans_m", t.y_spans_mm);
  if (flat) {  // default: columns along every edge
    t.edges.fill(EndSupport::free);
    t.column_edges.fill(true);
    if (const json* c = r.object("columns", true)) read_columns(*c, problems, t.columns);
  } else if (r.find("columns")) {
    problems.add("slab.columns", "applies to flat slabs only (slab.type \"flat\")");
  }
  if (const json* edges = r.object("edges")) {
    ObjectReader e(*edges, "slab.edges", problems, {"x0", "x1", "y0", "y1"});
    const char* keys[4] = {"x0", "x1", "y0", "y1"};
    for (std::size_t k = 0; k < 4; ++k) {
      auto name = e.text(keys[k]);
      if (!name) continue;
      if (flat) {
        if (*name == "columns") t.edges[k] = EndSupport::free, t.column_edges[k] = true;
        else if (*name == "wall") t.edges[k] = EndSupport::pinned, t.column_edges[k] = false;
        else problems.add(e.field(keys[k]), "must be \"columns\" or \"wall\" on a flat slab, got \"" + *name + "\"");
        continue;
      }
      if (*name == "pinned") t.edges[k] = EndSupport::pinned;
      else if (*name == "fixed") t.edges[k] = EndSupport::fixed;
      else if (*name == "free") t.edges[k] = EndSupport::free;
      else problems.add(e.field(keys[k]), "must be \"pinned\", \"fixed\" or \"free\", got \"" + *name + "\"");
    }
  }
  if (auto h = r.in_range(r.number("thickness_mm", true), "thickness_mm", 50, 1500, "mm")) req.slab.thickness_mm = *h;
  req.slab.strip_width_mm = 1000.0;  // every result per metre
  if (r.find("spans_m")) problems.add("slab.spans_m", "belongs to one-way slabs; " + kind + " takes x_spans_m and y_spans_m");
  if (r.find("ends")) problems.add("slab.ends", "belongs to one-way slabs; " + kind + " takes edges (x0, x1, y0, y1)");
  if (r.find("strip_width_mm"))
    problems.add("slab.strip_width_mm", "does not apply to " + std::string(flat ? "flat" : "two_way") +
                                            " slabs: every result is per metre width");
  if (r.find("support_widths_mm")) problems.add("slab.support_widths_mm", not_yet(req));
}

// analysis (two-way slabs): poisson_ratio, mesh_per_bay.
void read_analysis(const json& j, InputProblems& problems, Request& req) {
  ObjectReader r(j, "analysis", problems, {"poisson_ratio", "mesh_per_bay"});
  if (!req.plate()) {
    problems.add("analysis", "applies to two_way and flat slabs only (slab.type)");
    return;
  }
  if (auto nu = r.number("poisson_ratio")) {
    if (*nu < 0.0 || *nu >= 0.5)
      problems.add("analysis.poisson_ratio", "must be at least 0 and less than 0.5, got " + format_number(*nu));
    else
      req.two_way.poisson_ratio = *nu;
  }
  if (auto n = r.number("mesh_per_bay")) {
    if (*n != std::floor(*n) || *n < 2 || *n > 40)
      problems.add("analysis.mesh_per_bay", "must be a whole number from 2 to 40, got " + format_number(*n));
    else
      req.two_way.mesh_per_bay = static_cast<int>(*n);
  }
}

// A plan point [x, y] in m, as mm; problems named by `f`.
std::optional<std::array<double, 2>> plan_point(const json* v, const std::string& f, InputProblems& problems) {
  if (!v->is_array() || v->size() != 2 || !(*v)[0].is_number() || !(*v)[1].is_number()) {
    problems.add(f, "must be a plan point [x, y] in m, got " + describe(*v));
    return std::nullopt;
  }
  const double x = (*v)[0].get<double>(), y = (*v)[1].get<double>();
  if (!std::isfinite(x) || !std::isfinite(y)) {
    problems.add(f, "must be finite");
    return std::nullopt;
  }
  return std::array<double, 2>{x * 1000.0, y * 1000.0};
}

// One entry of loads.actions on a two-way slab: a uniform load over the
// whole slab (kPa) or a patch (kPa with from_m and to_m, opposite corners
// [x, y]), a line load (line_kN_per_m from from_m to to_m, parallel to x or
// y) or a point load (point_kN at x_m, y_m). Positions are checked against
// the plate (Σ x_spans, Σ y_spans) when `plan` is known.
std::optional<Action> read_plan_action(const json& e, const std::string& path,
                                       const std::optional<PlanExtent>& plan, InputProblems& problems) {
  if (!e.is_object()) {
    problems.add(path, "must be an object with name, kind and one of kPa, line_kN_per_m or point_kN, got " +
                           describe(e));
    return std::nullopt;
  }
  const std::size_t before = problems.items().size();
  // The version 1 fields go through read_action with no spans; its
  // problems about span, at_m and the positions are replaced by ours.
  json stripped = e;
  for (const char* k : {"from_m", "to_m", "x_m", "y_m", "span", "at_m", "effective_width_m"}) stripped.erase(k);
  // A strip's line and point loads need a span and a position there: given
  // placeholders here (no spans to check them against), cleared below.
  if (stripped.contains("line_kN_per_m") || stripped.contains("point_kN")) {
    stripped["span"] = 1;
    stripped["at_m"] = 0.0;
    if (stripped.contains("point_kN")) stripped["effective_width_m"] = 1.0;
  }
  InputProblems own;
  auto a = read_action(stripped, path, {}, false, own);
  if (a) {
    a->span.reset();
    a->at_mm = 0.0;
    a->effective_width_mm = 0.0;
  }
  for (const auto& p : own.items())
    if (p.field != path + ".span" && p.field != path + ".at_m" && p.field != path + ".effective_width_m")
      problems.add(p.field, p.message);
  Action out = a.value_or(Action{});
  out.field = path;
  if (!a) {  // the distribution still decides which positions apply
    if (e.contains("kPa")) out.distribution = Distribution::uniform;
    else if (e.contains("line_kN_per_m")) out.distribution = Distribution::line;
    else out.distribution = Distribution::point;
  }
  for (const char* k : {"span", "at_m", "effective_width_m"})
    if (e.contains(k))
      problems.add(path + "." + k, "belongs to one-way slabs; a two_way or flat slab places loads by plan position "
                                   "(from_m and to_m as [x, y], or x_m and y_m)");
  auto inside = [&](const std::array<double, 2>& p, const std::string& f) {
    if (!plan) return true;
    const PlanExtent& q = *plan;
    const double tol = 1e-9 * (q[2] - q[0] + q[3] - q[1]);
    if (p[0] < q[0] - tol || p[1] < q[1] - tol || p[0] > q[2] + tol || p[1] > q[3] + tol) {
      problems.add(f, "must lie on the slab (x from " + format_number(q[0] / 1000.0) + " to " +
                          format_number(q[2] / 1000.0) + " m, y from " + format_number(q[1] / 1000.0) + " to " +
                          format_number(q[3] / 1000.0) + " m), got [" + format_number(p[0] / 1000.0) + ", " +
                          format_number(p[1] / 1000.0) + "]");
      return false;
    }
    return true;
  };
  const bool from = e.contains("from_m"), to = e.contains("to_m");
  if (out.distribution == Distribution::point) {
    for (const char* k : {"from_m", "to_m"})
      if (e.contains(k)) problems.add(path + "." + k, "applies to patches and line loads; a point load takes x_m and y_m");
    std::optional<double> x, y;
    for (const char* k : {"x_m", "y_m"}) {
      const auto it = e.find(k);
      if (it == e.end()) {
        problems.add(path + "." + k, "required: the point load's plan position, in m");
        continue;
      }
      if (!it->is_number() || !std::isfinite(it->get<double>())) {
        problems.add(path + "." + k, "must be a number (m), got " + describe(*it));
        continue;
      }
      (k[0] == 'x' ? x : y) = it->get<double>() * 1000.0;
    }
    if (x && y && inside({*x, *y}, path + ".x_m")) out.plan_mm = std::array<double, 4>{*x, *y, *x, *y};
  } else {
    for (const char* k : {"x_m", "y_m"})
      if (e.contains(k)) problems.add(path + "." + k, "applies to point loads; patches and line loads take from_m and to_m");
    const bool line = out.distribution == Distribution::line;
    if (from != to || (line && !from)) {
      problems.add(path + "." + (from ? "to_m" : "from_m"),
                   line ? "required: a line load runs from from_m to to_m, each [x, y] in m"
                        : "required with the other: a patch is the rectangle with corners from_m and to_m, [x, y] in m");
    } else if (from) {
      const auto p = plan_point(&e.at("from_m"), path + ".from_m", problems);
      const auto q = plan_point(&e.at("to_m"), path + ".to_m", problems);
      if (p && q && inside(*p, path + ".from_m") && inside(*q, path + ".to_m")) {
        if (line) {
          const bool along_x = (*p)[1] == (*q)[1], along_y = (*p)[0] == (*q)[0];
          if (along_x == along_y)
            problems.add(path + ".to_m", along_x ? "must differ from from_m: a line load has a length"
                                                 : "must share x or y with from_m: a line load runs parallel to x or y");
          else
            out.plan_mm = std::array<double, 4>{std::min((*p)[0], (*q)[0]), std::min((*p)[1], (*q)[1]),
                                                std::max((*p)[0], (*q)[0]), std::max((*p)[1], (*q)[1])};
        } else if ((*p)[0] == (*q)[0] || (*p)[1] == (*q)[1]) {
          problems.add(path + ".to_m", "a patch must have an area: from_m and to_m are opposite corners");
        } else {
          out.plan_mm = std::array<double, 4>{std::min((*p)[0], (*q)[0]), std::min((*p)[1], (*q)[1]),
                                              std::max((*p)[0], (*q)[0]), std::max((*p)[1], (*q)[1])};
        }
      }
    }
  }
  if (problems.items().size() != before) return std::nullopt;
  return out;
}

// loads of a two-way slab: as a strip's, each action placed in plan.
void read_two_way_loads(const json& j, InputProblems& problems, Request& req) {
  std::optional<PlanExtent> plan;
  const bool spans_ok = std::none_of(problems.items().begin(), problems.items().end(), [](const InputProblem& p) {
    return p.field.rfind("slab.x_spans_m", 0) == 0 || p.field.rfind("slab.y_spans_m", 0) == 0;
  });
  if (spans_ok && !req.two_way.x_spans_mm.empty() && !req.two_way.y_spans_mm.empty()) {
    double X = 0.0, Y = 0.0;
    for (double s : req.two_way.x_spans_mm) X += s;
    for (double s : req.two_way.y_spans_mm) Y += s;
    // A flat slab's edge on columns lies flush with their outer faces.
    const TwoWayInput& t = req.two_way;
    const bool flat = req.slab_type == SlabType::flat;
    const double hx = flat ? t.columns.x_mm / 2.0 : 0.0, hy = flat ? t.columns.y_mm / 2.0 : 0.0;
    plan = PlanExtent{t.column_edges[0] ? -hx : 0.0, t.column_edges[2] ? -hy : 0.0, X + (t.column_edges[1] ? hx : 0.0),
                      Y + (t.column_edges[3] ? hy : 0.0)};
  }
  read_loads(j, problems, req.loads, {}, false, &plan);
}

// What a two-way slab does not take yet, named (never ignored).
void add_two_way_scope_problems(const Request& req, InputProblems& problems) {
  if (req.design.redistribution_percent > 0.0) problems.add("design.redistribution_percent", not_yet(req));
}

}  // namespace

bool request_gives(const json& j, const std::string& field) {
  const json* at = &j;
  std::size_t start = 0;
  while (true) {
    const std::size_t dot = field.find('.', start);
    const std::string key = field.substr(start, dot == std::string::npos ? std::string::npos : dot - start);
    if (!at->is_object()) return false;
    if (dot == std::string::npos) {
      if (at->contains(key)) return true;
      for (const auto& a : plain_aliases())
        if (key == a.canonical && at->contains(a.plain)) return true;
      return false;
    }
    const auto it = at->find(key);
    if (it == at->end()) return false;
    at = &*it;
    start = dot + 1;
  }
}

Request request_from_json(const json& j, InputProblems& problems) {
  Request req;
  if (!j.is_object()) {
    problems.add("(request)", "must be a JSON object, got " + describe(j));
    return req;
  }
  ObjectReader r(j, "", problems,
                 {"code", "variant", "slab", "concrete", "reinforcement", "loads", "durability",
                  "fire", "design", "serviceability", "report_units", "project", "detailing", "analysis"});
  if (const json* p = r.object("project")) {
    ObjectReader pr(*p, "project", problems, {"name", "reference", "designer", "checker"});
    req.project.name = pr.text("name").value_or("");
    req.project.reference = pr.text("reference").value_or("");
    req.project.designer = pr.text("designer").value_or("");
    req.project.checker = pr.text("checker").value_or("");
  }
  if (auto code = r.text("code", true)) req.code = *code;
  if (auto units = r.text("report_units")) {
    if (*units == "SI") req.report_units = ReportUnits::SI;
    else if (*units == "US") req.report_units = ReportUnits::US;
    else problems.add("report_units", "must be \"SI\" or \"US\", got \"" + *units + "\"");
  }
  req.variant = r.text("variant");
  const json* slab = r.object("slab", true);
  const bool flat = slab && slab->contains("type") && (*slab)["type"] == "flat";
  const bool two_way = slab && slab->contains("type") && ((*slab)["type"] == "two_way" || flat);
  if (slab && two_way) read_two_way_slab(*slab, problems, req, flat);
  else if (slab) read_slab(*slab, problems, req.slab);
  if (const json* a = r.object("analysis")) read_analysis(*a, problems, req);
  if (const json* c = r.object("concrete", true)) read_concrete(*c, problems, req.concrete);
  if (const json* s = r.object("reinforcement")) read_reinforcement(*s, problems, req.reinforcement, two_way);
  if (two_way) {
    if (const json* l = r.object("loads", true)) read_two_way_loads(*l, problems, req);
  } else if (const json* l = r.object("loads", true)) {
    // Positions of actions are checked against the spans when those are good.
    const bool spans_known = !req.slab.spans_mm.empty() && !problems.has_field("slab.spans_m") &&
                             !problems.has_field("slab.spans") &&
                             std::none_of(problems.items().begin(), problems.items().end(),
                                          [](const InputProblem& p) { return p.field.rfind("slab.spans", 0) == 0; });
    read_loads(*l, problems, req.loads, req.slab.spans_mm, spans_known);
  }
  if (const json* d = r.object("durability")) read_durability(*d, problems, req.durability);
  if (const json* f = r.object("fire")) read_fire(*f, problems, req.fire);
  if (const json* d = r.object("design")) read_design(*d, problems, req.design);
  if (const json* s = r.object("serviceability")) read_serviceability(*s, problems, req.serviceability);
  if (const json* d = r.object("detailing")) read_detailing(*d, problems, req.detailing, !two_way);
  if (two_way) add_two_way_scope_problems(req, problems);
  if (request_gives(j, "reinforcement.outer_layer")) {
    const json& o = j["reinforcement"]["outer_layer"];
    if (!two_way) problems.add("reinforcement.outer_layer", "applies to two_way and flat slabs only (slab.type)");
    else if (o == "x" || o == "y") req.two_way.outer_layer = o.get<std::string>();
    else problems.add("reinforcement.outer_layer", "must be \"x\" or \"y\", got " + describe(o));
  }
  return req;
}

}  // namespace armature
