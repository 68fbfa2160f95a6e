// Load combinations of ACI 318-19 5.3.1 for the actions of a one-way slab.
#pragma once

#include <vector>

#include "armature/combinations.hpp"

namespace armature::aci318 {

// Factors of 5.3.1 (and the service and sustained loads of 24.2).
inline constexpr double factor_D_a = 1.4;                   // (5.3.1a)
inline constexpr double factor_D = 1.2;                     // (5.3.1b) to (5.3.1e)
inline constexpr double factor_L_b = 1.6;                   // (5.3.1b)
inline constexpr double factor_roof_or_snow_b = 0.5;        // (5.3.1b): 0.5 (Lr or S)
inline constexpr double factor_roof_or_snow_c = 1.6;        // (5.3.1c): 1.6 (Lr or S)
inline constexpr double factor_L_c = 1.0;                   // (5.3.1c): 1.0 L (5.3.3's 0.5 L not taken)

// Permanent actions are D, imposed L, roof Lr, snow S. ULS: (a) 1.4 D;
// (b) 1.2 D + 1.6 L + 0.5 (Lr or S), each of Lr and S in turn; (c) 1.2 D
// + 1.6 (Lr or S) + 1.0 L. (d) and (e) without W and E differ from (b)
// only by smaller factors on L and S, and (f), (g) (0.9 D) go only with W
// or E: none of them is listed. Service (characteristic): D + L + (Lr or
// S); sustained (quasi-permanent): D (the sustained part of L is not
// defined); EQU: the ULS combinations, the kernel placing the live loads
// on the spans that lift the far support (D at the same factor on every
// span).
std::vector<Combination> aci_combinations(const std::vector<Action>& actions,
                                          CombinationLabels labels = CombinationLabels::all);

}  // namespace armature::aci318
