// The design of a two-way slab (driver.cpp hands a validated request here).
#pragma once

#include <vector>

#include "armature/design.hpp"

namespace armature {

// The nominal elastic modulus the plate is analysed with: moments and
// reactions of the rigidly supported plate do not depend on it, and no
// check reads its deflections.
inline constexpr double two_way_nominal_modulus_MPa = 30000.0;

// The coarsest mesh a flat slab may ask for (analysis.mesh_per_bay): at 4
// per bay the column strips' hogging at the faces is some 6 % low, at 8
// within 1 % of a fine mesh (DEVELOPERS.md, "Flat slabs").
inline constexpr int min_flat_mesh_per_bay = 8;

// Problems of a two-way request the reader cannot see (a request built in
// C++, or the plate as a whole): the plate's geometry (mechanisms, mesh
// size) and located loads off the plate, each named by its request path.
void add_two_way_problems(const Request& request, InputProblems& problems);

struct BarLimit;  // search.hpp

// `step_units`: the units of the code's edition (DesignRecord::step_units);
// `limits`: regions whose bars the search keeps below a size (bends too
// short at a support in an earlier design of the request; driver.cpp).
DesignRecord design_two_way(const SlabChecker& checker, CodeIdentity id, const Request& request, Detail detail,
                            ReportUnits step_units, const std::vector<BarLimit>& limits);

}  // namespace armature
