#include "armature/units.hpp"

#include <cctype>
#include <cstdlib>
#include <cstring>

namespace armature {

namespace {
struct UnitEntry {
  const char* name;
  Dimension dimension;
  double si;  // value of one unit in m, Pa or N/m³
};

constexpr double lbf = N_per_lbf;
constexpr double ft = m_per_ft;
constexpr double in = mm_per_in / 1000.0;

const UnitEntry units[] = {
    {"mm", Dimension::length, 1e-3},
    {"cm", Dimension::length, 1e-2},
    {"m", Dimension::length, 1.0},
    {"in", Dimension::length, in},
    {"ft", Dimension::length, ft},
    {"Pa", Dimension::pressure, 1.0},
    {"kPa", Dimension::pressure, 1e3},
    {"MPa", Dimension::pressure, 1e6},
    {"N/mm2", Dimension::pressure, 1e6},
    {"kN/m2", Dimension::pressure, 1e3},
    {"psf", Dimension::pressure, lbf / (ft * ft)},
    {"psi", Dimension::pressure, lbf / (in * in)},
    {"ksi", Dimension::pressure, 1000.0 * lbf / (in * in)},
    {"kN/m3", Dimension::unit_weight, 1e3},
    {"pcf", Dimension::unit_weight, lbf / (ft * ft * ft)},
    {"lb/ft3", Dimension::unit_weight, lbf / (ft * ft * ft)},
};

const UnitEntry* find_unit(const std::string& name) {
  for (const auto& u : units)
    if (name == u.name) return &u;
  return nullptr;
}
}  // namespace

const char* to_string(Dimension d) {
  switch (d) {
    case Dimension::length: return "a length";
    case Dimension::pressure: return "a pressure or stress";
    case Dimension::unit_weight: return "a unit weight";
  }
  return "?";
}

const char* units_of(Dimension d) {
  switch (d) {
    case Dimension::length: return "mm, cm, m, in, ft";
    case Dimension::pressure: return "Pa, kPa, MPa, N/mm2, kN/m2, psf, psi, ksi";
    case Dimension::unit_weight: return "kN/m3, pcf, lb/ft3";
  }
  return "";
}

std::optional<Quantity> parse_quantity(const std::string& text, std::string& error) {
  Quantity q;
  bool any = false;
  std::size_t i = 0;
  auto skip_space = [&] {
    while (i < text.size() && std::isspace(static_cast<unsigned char>(text[i]))) ++i;
  };
  skip_space();
  while (i < text.size()) {
    const char* start = text.c_str() + i;
    char* end = nullptr;
    const double value = std::strtod(start, &end);
    if (end == start || (*start != '-' && *start != '+' && *start != '.' &&
                         !std::isdigit(static_cast<unsigned char>(*start)))) {
      error = "expected a number followed by a unit, such as \"8 in\" or \"200 mm\", got \"" + text + "\"";
      return std::nullopt;
    }
    i += static_cast<std::size_t>(end - start);
    skip_space();
    std::size_t u0 = i;
    while (i < text.size() && !std::isspace(static_cast<unsigned char>(text[i]))) ++i;
    const std::string unit_name = text.substr(u0, i - u0);
    if (unit_name.empty()) {
      error = "a unit is needed after " + text.substr(0, u0) + " (such as mm, in, kPa, psf)";
      return std::nullopt;
    }
    const UnitEntry* unit = find_unit(unit_name);
    if (!unit) {
      error = "unknown unit '" + unit_name + "' in \"" + text + "\"";
      return std::nullopt;
    }
    if (any && unit->dimension != q.dimension) {
      error = "mixes " + std::string(to_string(q.dimension)) + " and " + to_string(unit->dimension) +
              " in \"" + text + "\"";
      return std::nullopt;
    }
    if (any && unit->dimension != Dimension::length) {
      error = "only lengths may be given in several terms (\"15 ft 6 in\"), got \"" + text + "\"";
      return std::nullopt;
    }
    if (!(value == value) || value > 1e300 || value < -1e300) {
      error = "must be a finite number, got \"" + text + "\"";
      return std::nullopt;
    }
    q.dimension = unit->dimension;
    q.si += value * unit->si;
    any = true;
    skip_space();
  }
  if (!any) {
    error = "expected a number followed by a unit, got an empty string";
    return std::nullopt;
  }
  return q;
}

}  // namespace armature
