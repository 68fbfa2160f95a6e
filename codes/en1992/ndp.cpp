#include "ndp.hpp"

#include <algorithm>
#include <cstdio>
#include <cmath>
#include <fstream>
#include <iterator>
#include <map>
#include <stdexcept>
#include <utility>

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
      {"equ_gamma_G_sup", {&Ndp::equ_gamma_G_sup, 1.0, 1.5}},
      {"equ_gamma_G_inf", {&Ndp::equ_gamma_G_inf, 0.7, 1.0}},
      {"equ_gamma_Q", {&Ndp::equ_gamma_Q, 1.0, 1.8}},
      {"k1", {&Ndp::k1, 0.3, 0.6}},
      {"k2_factor", {&Ndp::k2_factor, 0.8, 1.5}},
      {"k3", {&Ndp::k3, 0.3, 0.7}},
      {"k4_factor", {&Ndp::k4_factor, 0.8, 1.5}},
      {"k5", {&Ndp::k5, 0.5, 1.0}},
      {"k6", {&Ndp::k6, 0.5, 1.0}},
      {"w_max_X0_XC1_mm", {&Ndp::w_max_X0_XC1_mm, 0.2, 0.4}},
      {"w_max_other_mm", {&Ndp::w_max_other_mm, 0.2, 0.4}},
      {"steel_stress_factor_cap", {&Ndp::steel_stress_factor_cap, 1.0, 2.0}},
      {"C_Rd_c_factor", {&Ndp::C_Rd_c_factor, 0.1, 0.2}},
      {"v_min_factor", {&Ndp::v_min_factor, 0.02, 0.05}},
      {"k1_shear", {&Ndp::k1_shear, 0.0, 0.3}},
      {"punching_v_max_factor", {&Ndp::punching_v_max_factor, 0.3, 0.6}},
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

// Keys that are not plain numbers: each is read by its own code below.
const std::vector<std::string>& other_keys() {
  static const std::vector<std::string> keys{"variant",          "title",
                                             "pattern_loading",  "durability_note",
                                             "psi_factors",      "psi_snow",         "span_depth_cap_K",
                                             "shear_fck_cap_MPa", "extra_strength_classes"};
  return keys;
}

// "C28/35" → 28 and 35: the designation of a class of EN 206 / Table 3.1.
std::optional<std::pair<int, int>> class_designation(const std::string& name) {
  // Two numbers of one to three digits, no leading zero.
  auto number = [&](std::size_t& i, int& out) {
    const std::size_t start = i;
    out = 0;
    while (i < name.size() && name[i] >= '0' && name[i] <= '9' && i - start < 3)
      out = out * 10 + (name[i++] - '0');
    return i > start && name[start] != '0';
  };
  std::size_t i = 1;
  int fck = 0, cube = 0;
  if (name.empty() || name[0] != 'C' || !number(i, fck)) return std::nullopt;
  if (i >= name.size() || name[i++] != '/' || !number(i, cube) || i != name.size()) return std::nullopt;
  return std::pair{fck, cube};
}
}  // namespace

std::optional<PsiFactors> psi_of_category(const Ndp& ndp, const std::string& category) {
  const auto i = imposed_load_category_index(category);
  if (!i) return std::nullopt;
  return ndp.psi[*i];
}

std::optional<double> fck_of_class(const Ndp& ndp, const std::string& name) {
  if (auto fck = fck_of_strength_class(name)) return fck;
  if (auto it = ndp.extra_strength_classes.find(name); it != ndp.extra_strength_classes.end())
    return it->second;
  return std::nullopt;
}

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
  const auto& others = other_keys();
  const auto& optional_specs = optional_number_specs();
  for (auto it = j.begin(); it != j.end(); ++it)
    if (!specs.count(it.key()) && !optional_specs.count(it.key()) &&
        std::find(others.begin(), others.end(), it.key()) == others.end())
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

  auto in_range = [&](const std::string& key, double x, double lo, double hi) {
    if (!(x >= lo && x <= hi))
      fail(key, "must be between " + short_number(lo) + " and " + short_number(hi) + ", got " +
                    short_number(x));
    return x;
  };
  // A cap is required in every file: null says "no cap" explicitly, so a
  // copied file cannot lose one by omission.
  auto optional_number = [&](const std::string& key, double lo, double hi) -> std::optional<double> {
    if (!j.contains(key)) fail(key, "missing (null for none)");
    const auto& v = j[key];
    if (v.is_null()) return std::nullopt;
    if (!v.is_number()) fail(key, "must be a number or null");
    return in_range(key, v.get<double>(), lo, hi);
  };
  ndp.span_depth_cap_K = optional_number("span_depth_cap_K", 20.0, 60.0);
  ndp.shear_fck_cap_MPa = optional_number("shear_fck_cap_MPa", 12.0, 90.0);

  // EN 1990 Table A1.1: every category A–H with ψ0, ψ1, ψ2 in [0, 1].
  if (!j.contains("psi_factors")) fail("psi_factors", "missing");
  const auto& psi = j["psi_factors"];
  if (!psi.is_object()) fail("psi_factors", "must be an object of categories A to H");
  for (auto it = psi.begin(); it != psi.end(); ++it)
    if (!imposed_load_category_index(it.key()))
      fail("psi_factors." + it.key(), "unknown category (A to H)");
  for (std::size_t i = 0; i < imposed_load_categories.size(); ++i) {
    const std::string cat = imposed_load_categories[i];
    const std::string where_cat = "psi_factors." + cat;
    if (!psi.contains(cat)) fail(where_cat, "missing");
    const auto& row = psi[cat];
    if (!row.is_object()) fail(where_cat, "must be an object with psi0, psi1 and psi2");
    for (auto it = row.begin(); it != row.end(); ++it)
      if (it.key() != "psi0" && it.key() != "psi1" && it.key() != "psi2")
        fail(where_cat + "." + it.key(), "unknown parameter");
    double values[3] = {0, 0, 0};
    const char* names[3] = {"psi0", "psi1", "psi2"};
    for (int k = 0; k < 3; ++k) {
      const std::string key = where_cat + "." + names[k];
      if (!row.contains(names[k])) fail(key, "missing");
      if (!row[names[k]].is_number()) fail(key, "must be a number");
      values[k] = in_range(key, row[names[k]].get<double>(), 0.0, 1.0);
    }
    // EN 1990 4.1.3: the quasi-permanent value is not above the frequent one.
    if (values[2] > values[1])
      fail(where_cat + ".psi2", "must not exceed psi1 (" + short_number(values[1]) + "), got " +
                                    short_number(values[2]));
    ndp.psi[i] = {values[0], values[1], values[2]};
  }

  // EN 1990 Table A1.1, snow: ψ0, ψ1, ψ2 in [0, 1], ψ2 ≤ ψ1.
  if (!j.contains("psi_snow")) fail("psi_snow", "missing");
  {
    const auto& row = j["psi_snow"];
    if (!row.is_object()) fail("psi_snow", "must be an object with psi0, psi1 and psi2");
    for (auto it = row.begin(); it != row.end(); ++it)
      if (it.key() != "psi0" && it.key() != "psi1" && it.key() != "psi2")
        fail("psi_snow." + it.key(), "unknown parameter");
    double values[3] = {0, 0, 0};
    const char* names[3] = {"psi0", "psi1", "psi2"};
    for (int k = 0; k < 3; ++k) {
      const std::string key = std::string("psi_snow.") + names[k];
      if (!row.contains(names[k])) fail(key, "missing");
      if (!row[names[k]].is_number()) fail(key, "must be a number");
      values[k] = in_range(key, row[names[k]].get<double>(), 0.0, 1.0);
    }
    if (values[2] > values[1])
      fail("psi_snow.psi2", "must not exceed psi1 (" + short_number(values[1]) + "), got " + short_number(values[2]));
    ndp.psi_snow = {values[0], values[1], values[2]};
  }
  if (ndp.equ_gamma_G_inf > ndp.equ_gamma_G_sup)
    fail("equ_gamma_G_inf", "must not exceed equ_gamma_G_sup (" + short_number(ndp.equ_gamma_G_sup) + "), got " +
                                short_number(ndp.equ_gamma_G_inf));

  // Strength classes the variant adds: "C<fck>/<fck,cube>": fck.
  if (!j.contains("extra_strength_classes")) fail("extra_strength_classes", "missing ({} for none)");
  const auto& extra = j["extra_strength_classes"];
  if (!extra.is_object()) fail("extra_strength_classes", "must be an object of class: fck (MPa)");
  for (auto it = extra.begin(); it != extra.end(); ++it) {
    const std::string key = "extra_strength_classes." + it.key();
    const auto designation = class_designation(it.key());
    if (!designation) fail(key, "must be named C<fck>/<fck,cube>, as C28/35");
    if (fck_of_strength_class(it.key())) fail(key, "is already a class of EN 1992-1-1 Table 3.1");
    if (!it.value().is_number()) fail(key, "must be a number (fck, MPa)");
    const double fck = in_range(key, it.value().get<double>(), 12.0, 90.0);
    if (std::abs(fck - designation->first) > 1e-9)
      fail(key, "fck must be the class's first number, " + std::to_string(designation->first) +
                    ", got " + short_number(fck));
    if (designation->second <= designation->first)
      fail(key, "the cube strength must exceed fck");
    ndp.extra_strength_classes[it.key()] = fck;
  }
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
