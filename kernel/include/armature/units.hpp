// Quantities with units at the request boundary: "8 in", "15 ft 6 in",
// "50 psf", "4000 psi", "200 mm", "2.5 kPa". Exact conversion factors:
// 1 in = 25.4 mm, 1 ft = 0.3048 m, 1 lbf = 4.4482216152605 N.
#pragma once

#include <optional>
#include <string>

namespace armature {

enum class Dimension { length, pressure, unit_weight };

const char* to_string(Dimension d);
// The units accepted for a dimension, for messages: "mm, cm, m, in, ft".
const char* units_of(Dimension d);

struct Quantity {
  double si = 0.0;  // in m, Pa or N/m³
  Dimension dimension = Dimension::length;
};

// Parses one quantity; on failure returns nullopt and sets `error`.
// Several terms of one dimension add up ("15 ft 6 in").
std::optional<Quantity> parse_quantity(const std::string& text, std::string& error);

// Converts a value in SI base units to and from the units of a report.
inline constexpr double mm_per_in = 25.4;
inline constexpr double N_per_lbf = 4.4482216152605;
inline constexpr double m_per_ft = 0.3048;
inline constexpr double kPa_per_psf = N_per_lbf / (m_per_ft * m_per_ft) / 1000.0;
inline constexpr double MPa_per_psi = N_per_lbf / (mm_per_in * mm_per_in);
inline constexpr double kNm_per_kipft = N_per_lbf * m_per_ft;  // kip·ft → kN·m
inline constexpr double kN_per_kip = N_per_lbf;                // kip → kN

}  // namespace armature
