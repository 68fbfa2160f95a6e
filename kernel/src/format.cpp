#include "armature/format.hpp"

#include <cmath>
#include <cstdio>
#include <cstdlib>

namespace armature {

std::string plain_number(double v, double scale) {
  if (std::isnan(v)) return "-";
  if (std::isinf(v)) return v > 0 ? "inf" : "-inf";
  if (v == 0.0 || std::abs(v) <= 1e-9 * std::abs(scale)) return "0";
  char buf[48];
  // Rounded once, by the C library: d.ddde±x, then written out in full.
  std::snprintf(buf, sizeof buf, "%.3e", std::abs(v));
  const std::string s(buf);
  const std::size_t e = s.find('e');
  const int exponent = std::atoi(s.c_str() + e + 1);
  if (exponent < -12 || exponent > 15) {
    std::snprintf(buf, sizeof buf, "%.4g", v);
    return buf;
  }
  const std::string digits = s.substr(0, 1) + s.substr(2, e - 2);  // four digits
  std::string out;
  if (exponent >= 3)
    out = digits + std::string(static_cast<std::size_t>(exponent - 3), '0');
  else if (exponent >= 0)
    out = digits.substr(0, static_cast<std::size_t>(exponent + 1)) + "." +
          digits.substr(static_cast<std::size_t>(exponent + 1));
  else
    out = "0." + std::string(static_cast<std::size_t>(-exponent - 1), '0') + digits;
  if (out.find('.') != std::string::npos) {
    while (out.back() == '0') out.pop_back();
    if (out.back() == '.') out.pop_back();
  }
  return (v < 0 ? "-" : "") + out;
}

std::string bar_arrangement(const std::string& bar, double spacing, const std::string& unit) {
  const bool by_diameter = !bar.empty() && bar[0] >= '0' && bar[0] <= '9';
  return (by_diameter ? "ø" : "") + bar + " @ " + plain_number(spacing) + " " + unit;
}

}  // namespace armature
