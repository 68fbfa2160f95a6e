// Detailing of a one-way strip (private to the kernel): bars along the
// strip from the moment envelope, with the code's lengths (DetailingRules).
#pragma once

#include <vector>

#include "armature/design.hpp"

namespace armature {

// The bars, schedule and mass of a designed strip. `envelope` per span
// (Member::detailing_diagrams); `rec` the design with its regions and
// distribution bars. Throws InputError naming detailing.stock_length_m when
// the stock is too short for the laps.
DetailingRecord detail_strip(const DetailingRules& rules, const CodeIdentity& code, const Request& req,
                             const DesignRecord& rec, const std::vector<std::vector<DiagramPoint>>& envelope);

}  // namespace armature
