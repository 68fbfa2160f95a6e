// The Member interface through OneWayStrip: regions and their demands for
// a strip under located loads, against beam-table statics. Our own
// scenario: two 4.0 m bays of the workshop floor, each with a partition
// line load across the strip at mid-span.
#include <catch2/catch.hpp>

#include "armature/member.hpp"

namespace {

// Two equal spans L, a concentrated load P at the middle of each (beam
// tables, from memory): support moment 3PL/16, end reactions P/2 − 3P/16 =
// 5P/16, mid-span moment 5P/16 × L/2 = 5PL/32, shear beside the interior
// support P/2 + 3P/16 = 11P/16.
TEST_CASE("OneWayStrip regions and demands under central line loads on two spans", "[member]") {
  armature::SlabInput slab;
  slab.spans_mm = {4000.0, 4000.0};
  slab.ends = {armature::EndSupport::pinned, armature::EndSupport::pinned};
  slab.thickness_mm = 200.0;
  slab.strip_width_mm = 1000.0;
  armature::OneWayStrip strip(slab, 0.0);

  CHECK(strip.pattern_count() == 2);
  CHECK(strip.span_names() == std::vector<std::string>{"span 1", "span 2"});
  CHECK(strip.support_names() == std::vector<std::string>{"support 1", "support 2", "support 3"});
  const auto names = strip.region_names(false);
  REQUIRE(names.size() == 3);
  CHECK(names[0].where == "span 1");
  CHECK(names[1].where == "support 2");
  CHECK(names[1].face == armature::Face::top);
  CHECK(names[2].where == "span 2");

  // A line load of 10 N/mm across a 1000 mm strip: P = 10 kN per span.
  std::vector<armature::Action> actions(2);
  for (std::size_t e = 0; e < 2; ++e) {
    actions[e].name = "partition " + std::to_string(e + 1);
    actions[e].distribution = armature::Distribution::line;
    actions[e].value = 10.0;
    actions[e].span = e;
    actions[e].at_mm = 2000.0;
  }
  const std::vector<armature::Combination> combinations{
      {"unit", armature::LimitState::uls, {{1.0, 1.0}, {1.0, 1.0}}}};
  const std::vector<std::vector<bool>> arrangements{{true, true}};
  armature::LoadTotals totals;
  totals.uls = 1.0;
  totals.sls_quasi_permanent = 0.5;
  const armature::MemberLoads loads{actions, combinations, arrangements, totals, false};
  CHECK(strip.analyse(loads) == 1);

  armature::RegionRules rules;
  std::vector<std::string> warnings;
  const auto regions = strip.design_regions(rules, warnings);
  CHECK(warnings.empty());
  REQUIRE(regions.size() == 3);
  const double P = 10000.0, L = 4000.0;
  CHECK(regions[0].where == "span 1");
  CHECK(regions[0].M_Ed == Approx(5.0 * P * L / 32.0).epsilon(1e-12));
  CHECK(regions[0].x_mm == Approx(2000.0).epsilon(1e-12));  // the peak under the load, not a sample
  REQUIRE(regions[0].supports.size() == 1);
  CHECK(regions[0].supports[0].where == "support 1");
  CHECK(regions[0].supports[0].V_Ed == Approx(5.0 * P / 16.0).epsilon(1e-12));
  CHECK(regions[1].where == "support 2");
  CHECK(regions[1].M_Ed == Approx(3.0 * P * L / 16.0).epsilon(1e-12));
  CHECK(regions[1].x_mm == Approx(4000.0).epsilon(1e-12));
  REQUIRE(regions[1].supports.size() == 1);
  CHECK(regions[1].supports[0].V_Ed == Approx(11.0 * P / 16.0).epsilon(1e-12));
  CHECK(regions[2].M_Ed == Approx(regions[0].M_Ed).epsilon(1e-12));
  CHECK(regions[2].x_mm == Approx(6000.0).epsilon(1e-12));
  // No quasi-permanent combination: the σs ratio falls back to the loads'.
  CHECK(regions[1].quasi_permanent_to_uls == Approx(0.5));
  // No cantilever: nothing can overturn.
  CHECK(strip.equilibrium_demands(loads).empty());
}

}  // namespace
