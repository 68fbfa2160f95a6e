// Nationally Determined Parameters of one EN 1992 variant, read from a data
// file so that a national annex is data, not code.
#pragma once

#include <array>
#include <filesystem>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "rules.hpp"

namespace armature::en1992 {

struct Ndp {
  std::string variant;           // "UK"
  std::string title;             // "UK National Annex"
  double gamma_c = 0.0;          // 2.4.2.4
  double gamma_s = 0.0;          // 2.4.2.4
  double alpha_cc = 0.0;         // 3.1.6(1), bending
  double alpha_ct = 0.0;         // 3.1.6(2)
  double gamma_G = 0.0;          // EN 1990 Table A1.2(B)
  double gamma_Q = 0.0;          // EN 1990 Table A1.2(B)
  double xi = 0.0;               // EN 1990 Table A1.2(B), 6.10b
  double equ_gamma_G_sup = 0.0;  // EN 1990 Table A1.2(A), permanent unfavourable
  double equ_gamma_G_inf = 0.0;  // EN 1990 Table A1.2(A), permanent favourable
  double equ_gamma_Q = 0.0;      // EN 1990 Table A1.2(A), variable unfavourable
  double k1 = 0.0;               // 5.5(4)
  double k2_factor = 0.0;        // k2 = k2_factor (0.6 + 0.0014/εcu2)
  double k3 = 0.0;
  double k4_factor = 0.0;
  double k5 = 0.0;               // 5.5(4): δ ≥ k5, ductility classes B and C
  double k6 = 0.0;               // 5.5(4): δ ≥ k6, ductility class A
  // 5.5(4): the largest fyk for which the variant states k1…k4; none
  // (null in the file) when they hold for every grade.
  std::optional<double> redistribution_max_fyk_MPa;
  std::string pattern_loading;   // 5.1.3(1)P: "adjacent_pairs" or "all_spans"
  double w_max_X0_XC1_mm = 0.0;  // Table 7.1N
  double w_max_other_mm = 0.0;   // Table 7.1N
  double steel_stress_factor_cap = 0.0;  // 7.4.2(2)
  double C_Rd_c_factor = 0.0;    // 6.2.2(1): CRd,c = factor / γc
  double v_min_factor = 0.0;     // 6.2.2(1): vmin = factor k^1.5 fck^0.5
  double k1_shear = 0.0;         // 6.2.2(1)
  double punching_v_max_factor = 0.0;  // 6.4.5(3): vRd,max = factor ν fcd (0.4 recommended, UK NA 0.5)
  double delta_c_dev_mm = 0.0;   // 4.4.1.3(1)P
  std::string durability_note;   // warning given with every design, "" for none
  // EN 1990 Table A1.1: ψ0, ψ1, ψ2 of imposed-load categories A–H, in
  // that order (imposed_load_categories).
  std::array<PsiFactors, 8> psi{};
  // EN 1990 Table A1.1: ψ0, ψ1, ψ2 of snow (sites at altitude ≤ 1000 m).
  PsiFactors psi_snow{0.0, 0.0, 0.0};
  // UK NA Table NA.5 Note 6 (A1:2009): allowed l/d ≤ cap × K (Table 7.4N K); none
  // when the variant sets no cap (JSON null).
  std::optional<double> span_depth_cap_K;
  // UK NA to 3.1.2(2)P (from memory): fck in VRd,c and vmin taken as no more than this;
  // none when the variant sets no cap (JSON null).
  std::optional<double> shear_fck_cap_MPa;
  // Strength classes the variant adds to Table 3.1 ("C28/35" → 28); their
  // properties follow from the Table 3.1 formulas.
  std::map<std::string, double> extra_strength_classes;
};

// ψ factors of an imposed-load category under a variant; nullopt for a
// category outside A–H.
std::optional<PsiFactors> psi_of_category(const Ndp& ndp, const std::string& category);

// fck of a strength class: Table 3.1, then the variant's own classes.
std::optional<double> fck_of_class(const Ndp& ndp, const std::string& name);

// Reads and validates one NDP file; throws std::invalid_argument naming
// the file and the key for a missing, unknown or out-of-range parameter.
Ndp read_ndp_file(const std::filesystem::path& file);

// The same from the text of such a file; `where` names it in messages.
Ndp parse_ndp(const std::string& text, const std::string& where);

// Every *.json file of a directory, sorted by variant name.
std::vector<Ndp> read_ndp_directory(const std::filesystem::path& dir);

}  // namespace armature::en1992
