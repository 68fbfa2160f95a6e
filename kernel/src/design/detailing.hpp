// Detailing (private to the kernel): bars along one-way strips and along
// the rows and columns of bays of a two-way slab, from the moment
// envelope, with the code's lengths (DetailingRules).
#pragma once

#include <vector>

#include "armature/design.hpp"
#include "armature/two_way.hpp"

namespace armature {

// The bars, schedule and mass of a designed strip. `envelope` per span
// (Member::detailing_diagrams); `rec` the design with its regions and
// distribution bars. Throws InputError naming detailing.stock_length_m when
// the stock is too short for the laps.
DetailingRecord detail_strip(const DetailingRules& rules, const CodeIdentity& code, const Request& req,
                             const DesignRecord& rec, const std::vector<std::vector<DiagramPoint>>& envelope);

// The bars of a two-way slab on walls or beams: each row of bays (bars in
// x) and each column of bays (bars in y) detailed as a strip on the
// plate's Wood–Armer envelope over its width, counted over that width;
// then the corner zones' bars and the U-bars and edge bars of free edges.
// `rec` the design with its regions and covers; `plate` its record.
DetailingRecord detail_plate(const DetailingRules& rules, const CodeIdentity& code, const Request& req,
                             const DesignRecord& rec, const PlateRecord& plate);

// The region of a plate by its name, face and the direction of its bars
// (null: none).
const RegionRecord* plate_region(const std::vector<RegionRecord>& regions, const std::string& where, Face face,
                                 BarDirection dir);

// The code's detailing rules (an InputError naming `detailing` where the
// code gives none).
const DetailingRules& detailing_rules_of(const SlabChecker& checker, const CodeIdentity& code);

// Puts a detailing into the design: its notes among the warnings, its
// anchorage checks among their supports' checks (a support the design has
// no record for gets one).
void adopt_detailing(DesignRecord& rec, DetailingRecord detailing);

}  // namespace armature
