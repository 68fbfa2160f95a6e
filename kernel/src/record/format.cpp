#include "armature/format.hpp"

#include <charconv>
#include <cmath>
#include <string_view>

namespace armature {

std::string plain_number(double v, double scale) {
  if (std::isnan(v)) return "-";
  if (std::isinf(v)) return v > 0 ? "inf" : "-inf";
  if (v == 0.0 || std::abs(v) <= 1e-9 * std::abs(scale)) return "0";
  // Rounded once, correctly, to four significant figures (d.ddde±x), then
  // written out in full. std::to_chars: no locale, no printf machinery.
  // Most numbers printed (factors, spacings, table values) have four
  // digits or fewer; their shortest form is then already the rounded one
  // (the value lies within an ulp of it, far inside half a unit of the
  // fourth digit), and the shortest form is the cheaper to find.
  char buf[48];
  auto sci = std::to_chars(buf, buf + sizeof buf, std::abs(v), std::chars_format::scientific);
  std::string_view s(buf, static_cast<std::size_t>(sci.ptr - buf));
  std::size_t e = s.find('e');
  char digits[4] = {'0', '0', '0', '0'};
  if (e <= 5) {  // d, or d.d to d.ddd: four digits at most
    digits[0] = s[0];
    for (std::size_t k = 2; k < e; ++k) digits[k - 1] = s[k];
  } else {
    sci = std::to_chars(buf, buf + sizeof buf, std::abs(v), std::chars_format::scientific, 3);
    s = std::string_view(buf, static_cast<std::size_t>(sci.ptr - buf));
    e = s.find('e');
    digits[0] = s[0];
    digits[1] = s[2];
    digits[2] = s[3];
    digits[3] = s[4];
  }
  int exponent = 0;
  std::from_chars(s.data() + e + (s[e + 1] == '+' ? 2 : 1), s.data() + s.size(), exponent);
  if (exponent < -12 || exponent > 15) {
    const auto g = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::general, 4);
    return std::string(buf, g.ptr);
  }
  std::string out;
  out.reserve(24);
  if (v < 0) out += '-';
  if (exponent >= 3) {
    out.append(digits, 4);
    out.append(static_cast<std::size_t>(exponent - 3), '0');
  } else {
    if (exponent >= 0) {
      out.append(digits, static_cast<std::size_t>(exponent + 1));
      out += '.';
      out.append(digits + exponent + 1, static_cast<std::size_t>(3 - exponent));
    } else {
      out += "0.";
      out.append(static_cast<std::size_t>(-exponent - 1), '0');
      out.append(digits, 4);
    }
    while (out.back() == '0') out.pop_back();
    if (out.back() == '.') out.pop_back();
  }
  return out;
}

std::string bar_arrangement(const std::string& bar, double spacing, const std::string& unit) {
  const bool by_diameter = !bar.empty() && bar[0] >= '0' && bar[0] <= '9';
  return (by_diameter ? "ø" : "") + bar + " @ " + plain_number(spacing) + " " + unit;
}

}  // namespace armature
