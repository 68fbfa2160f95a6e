#include "ndp.hpp"

#include <algorithm>
#include <cstdio>
#include <cmath>
#include <fstream>
#include <iterator>
#include <map>
#include <stdexcept>

#include <nlohmann/json.hpp>

namespace armature::en1992 {

namespace {
struct NumberSpec {
  double Ndp::*member;
  double lo, hi;
};

const std::map<std::string, NumberSpec>& number_specs() {
  static const std::map<std::string, NumberSpec> specs{
      {"gamma_c", {&Ndp::gamma_c, 1.0, 2.0}},
      {"gamma_s", {&Ndp::gamma_s, 1.0, 1.5}},
      {"alpha_cc", {&Ndp::alpha_cc, 0.8, 1.0}},
      {"alpha_ct", {&Ndp::alpha_ct, 0.8, 1.0}},
      {"gamma_G", {&Ndp::gamma_G, 1.0, 1.6}},
      {"gamma_Q", {&Ndp::gamma_Q, 1.0, 1.8}},
      {"xi", {&Ndp::xi, 0.7, 1.0}},
      {"k1", {&Ndp::k1, 0.3, 0.6}},
      {"k2_factor", {&Ndp::k2_factor, 0.8, 1.5}},
      {"k3", {&Ndp::k3, 0.3, 0.7}},
      {"k4_factor", {&Ndp::k4_factor, 0.8, 1.5}},
      {"w_max_X0_XC1_mm", {&Ndp::w_max_X0_XC1_mm, 0.2, 0.4}},
      {"w_max_other_mm", {&Ndp::w_max_other_mm, 0.2, 0.4}},
      {"steel_stress_factor_cap", {&Ndp::steel_stress_factor_cap, 1.0, 2.0}},
      {"C_Rd_c_factor", {&Ndp::C_Rd_c_factor, 0.1, 0.2}},
      {"v_min_factor", {&Ndp::v_min_factor, 0.02, 0.05}},
      {"k1_shear", {&Ndp::k1_shear, 0.0, 0.3}},
      {"delta_c_dev_mm", {&Ndp::delta_c_dev_mm, 0.0, 20.0}},
  };
  return specs;
}

// Numbers a variant may set to null (no such limit).
struct OptionalNumberSpec {
  std::optional<double> Ndp::*member;
  double lo, hi;
};

const std::map<std::string, OptionalNumberSpec>& optional_number_specs() {
  static const std::map<std::string, OptionalNumberSpec> specs{
      {"redistribution_max_fyk_MPa", {&Ndp::redistribution_max_fyk_MPa, 400.0, 600.0}},
  };
  return specs;
}

std::string short_number(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", v);
  return buf;
}

bool is_crack_width_column(double w) {
  return std::abs(w - 0.2) < 1e-9 || std::abs(w - 0.3) < 1e-9 || std::abs(w - 0.4) < 1e-9;
}
}  // namespace

Ndp read_ndp_file(const std::filesystem::path& file) {
  std::ifstream in(file, std::ios::binary);
  if (!in) throw std::invalid_argument(file.string() + ": cannot be read");
  const std::string text((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  return parse_ndp(text, file.string());
}

Ndp parse_ndp(const std::string& text, const std::string& where) {
  nlohmann::json j;
  try {
    j = nlohmann::json::parse(text);
  } catch (const std::exception& e) {
    throw std::invalid_argument(where + ": not valid JSON: " + e.what());
  }
  if (!j.is_object()) throw std::invalid_argument(where + ": must hold a JSON object");
  auto fail = [&](const std::string& key, const std::string& msg) {
    throw std::invalid_argument(where + ": " + key + ": " + msg);
  };
  Ndp ndp;
  const auto& specs = number_specs();
  const std::vector<std::string> text_keys{"variant", "title", "pattern_loading",
                                           "durability_note"};
  const auto& optional_specs = optional_number_specs();
  for (auto it = j.begin(); it != j.end(); ++it)
    if (!specs.count(it.key()) && !optional_specs.count(it.key()) &&
        std::find(text_keys.begin(), text_keys.end(), it.key()) == text_keys.end())
      fail(it.key(), "unknown parameter");
  for (const auto& [key, spec] : specs) {
    if (!j.contains(key)) fail(key, "missing");
    const auto& v = j[key];
    if (!v.is_number()) fail(key, "must be a number");
    const double x = v.get<double>();
    if (!(x >= spec.lo && x <= spec.hi))
      fail(key, "must be between " + short_number(spec.lo) + " and " + short_number(spec.hi) +
                    ", got " + short_number(x));
    ndp.*spec.member = x;
  }
  for (const auto& [key, spec] : optional_specs) {
    if (!j.contains(key)) fail(key, "missing (null for none)");
    const auto& v = j[key];
    if (v.is_null()) continue;
    if (!v.is_number()) fail(key, "must be a number or null");
    const double x = v.get<double>();
    if (!(x >= spec.lo && x <= spec.hi))
      fail(key, "must be between " + short_number(spec.lo) + " and " + short_number(spec.hi) +
                    " or null, got " + short_number(x));
    ndp.*spec.member = x;
  }
  for (const auto& key : text_keys) {
    if (!j.contains(key)) fail(key, "missing");
    if (!j[key].is_string()) fail(key, "must be a string");
  }
  ndp.variant = j["variant"].get<std::string>();
  ndp.title = j["title"].get<std::string>();
  ndp.pattern_loading = j["pattern_loading"].get<std::string>();
  ndp.durability_note = j["durability_note"].get<std::string>();
  if (ndp.variant.empty()) fail("variant", "must not be empty");
  if (ndp.pattern_loading != "adjacent_pairs" && ndp.pattern_loading != "all_spans")
    fail("pattern_loading", "must be \"adjacent_pairs\" or \"all_spans\"");
  if (!is_crack_width_column(ndp.w_max_X0_XC1_mm))
    fail("w_max_X0_XC1_mm", "must be 0.2, 0.3 or 0.4 (a column of Tables 7.2N and 7.3N)");
  if (!is_crack_width_column(ndp.w_max_other_mm))
    fail("w_max_other_mm", "must be 0.2, 0.3 or 0.4 (a column of Tables 7.2N and 7.3N)");
  return ndp;
}

std::vector<Ndp> read_ndp_directory(const std::filesystem::path& dir) {
  std::vector<Ndp> out;
  std::error_code ec;
  for (const auto& entry : std::filesystem::directory_iterator(dir, ec))
    if (entry.path().extension() == ".json") out.push_back(read_ndp_file(entry.path()));
  if (ec) throw std::invalid_argument(dir.string() + ": cannot read NDP directory: " + ec.message());
  std::sort(out.begin(), out.end(), [](const Ndp& a, const Ndp& b) { return a.variant < b.variant; });
  for (std::size_t i = 1; i < out.size(); ++i)
    if (out[i].variant == out[i - 1].variant)
      throw std::invalid_argument(dir.string() + ": variant '" + out[i].variant +
                                  "' is defined twice");
  return out;
}

}  // namespace armature::en1992
