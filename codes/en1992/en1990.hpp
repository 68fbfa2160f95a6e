// Combinations of actions by EN 1990 (Annex A1, buildings), with the
// factors of one variant.
#pragma once

#include <array>
#include <string>
#include <utility>
#include <vector>

#include "armature/combinations.hpp"
#include "rules.hpp"

namespace armature::en1992 {

struct Ndp;

struct En1990Factors {
  double gamma_G = 0.0, gamma_Q = 0.0, xi = 0.0;  // Table A1.2(B)
  double gamma_G_sup_equ = 0.0;                  // Table A1.2(A), unfavourable permanent
  double gamma_G_inf_equ = 0.0;                  // Table A1.2(A), favourable permanent
  double gamma_Q_equ = 0.0;                      // Table A1.2(A), variable
  std::array<PsiFactors, 8> psi_imposed{};       // Table A1.1, categories A–H
  PsiFactors psi_snow{0.0, 0.0, 0.0};            // Table A1.1, snow (altitude ≤ 1000 m)
  std::string variant;                           // named in the labels of 6.10a/b
  // γG, γQ and ξ γG as the labels print them, written once (a design asks
  // for its combinations every time; the labels are the costly part).
  std::array<std::pair<double, std::string>, 3> printed{};
};
En1990Factors en1990_factors(const Ndp& ndp);

// Table A1.1: ψ of a variable action (imposed by its category, roof as
// category H, snow); zeros for a permanent one.
PsiFactors psi_of_action(const En1990Factors& f, const Action& action);

// Every combination for these actions: ULS by 6.10 or by 6.10a and 6.10b
// (Table A1.2(B)), SLS characteristic (6.14b), frequent (6.15b),
// quasi-permanent (6.16b), EQU (Table A1.2(A)). Each variable action leads
// in turn with the others accompanying; the imposed actions (every
// category, roof included) act together as one action (EN 1991-1-1
// 3.3.1(2)), each with its own ψ; roof imposed loads (category H) are not
// combined with snow (EN 1991-1-1 3.3.2(1)). Combinations with the same
// factors are listed once.
std::vector<Combination> en1990_combinations(const En1990Factors& f, bool six_ten_ab,
                                             const std::vector<Action>& actions,
                                             CombinationLabels labels = CombinationLabels::all);

}  // namespace armature::en1992
