// Material quantities of a design, for studies (not a bar schedule).
#pragma once

#include "armature/design.hpp"

namespace armature {

inline constexpr double steel_density_kg_m3 = 7850.0;

// Reinforcement mass per m² of slab, estimated from the provided areas:
// bottom bars over their whole span, top bars at a support over 0.3 of each
// adjacent span (the whole cantilever at a cantilever root), distribution
// bars over the whole strip (common practice estimate: no laps, anchorage
// or curtailment detail). Two-way slabs: per bay and line segment; flat
// slabs: per strip and span, top bars over their strip's (band's) width,
// and the punching links (each perimeter's area over a leg between the
// covers). A design with detailing: the bar schedule's total
// mass over slab width × strip length instead.
double steel_mass_kg_per_m2(const DesignRecord& record);

// Concrete volume per m² of slab (m³/m²): the thickness.
double concrete_volume_m3_per_m2(const DesignRecord& record);

}  // namespace armature
