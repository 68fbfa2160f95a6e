// Combinations of actions, as a design code gives them: for each limit
// state a list of combinations, each a label and a factor per action. The
// code states the factors; the kernel applies them with the code's load
// arrangements: a variable action is present on a span exactly when the
// arrangement loads that span (factor `loaded`, otherwise 0); a permanent
// action acts on every span, with `loaded` on loaded spans and `unloaded`
// on the others.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "armature/actions.hpp"

namespace armature {

enum class LimitState {
  uls,                  // strength, fundamental combinations
  characteristic,       // serviceability, characteristic (ACI: service loads)
  frequent,             // serviceability, frequent
  quasi_permanent,      // serviceability, quasi-permanent (ACI: sustained)
  equilibrium,          // static equilibrium (EQU)
};
const char* to_string(LimitState state);

struct ActionFactor {
  double loaded = 0.0;    // on spans the arrangement loads
  double unloaded = 0.0;  // on the other spans (0 for a variable action)
};

struct Combination {
  std::string label;                  // "6.10: 1.35 Gk + 1.5 Qk" (see CombinationLabels)
  LimitState limit_state = LimitState::uls;
  std::vector<ActionFactor> factors;  // one per action, in the actions' order
};

// What a code answers about combinations, for the actions of one request
// (the self-weight first, then the shorthands, then the request's list).
// Which combinations a code labels: a design needs the label of its
// governing strength combination only (the result's loads.combination);
// the list of every combination (the calculation record, a result listing
// its actions) needs them all. Labels are the costly part of a code's
// answer, and a design asks for its combinations every time.
enum class CombinationLabels {
  // What a design uses: the ULS combinations labelled, the quasi-permanent
  // and EQU ones (labels may be empty); the characteristic and frequent
  // ones may be left out (only a calculated deflection reads them, and it
  // asks for `all`).
  strength,
  all,  // every combination, every label
};

// A load arrangement over a two-way slab's bays (bay index i + nx·j): the
// bays whose variable actions are present, and the fraction of their
// factored value they carry there (a code's reduced pattern load; 1: all).
// Permanent actions act on every bay at their `loaded` factor.
struct BayArrangement {
  std::vector<bool> loaded;
  double variable_fraction = 1.0;
};

class CombinationRules {
 public:
  virtual ~CombinationRules() = default;
  virtual std::vector<Combination> combinations(const std::vector<Action>& actions,
                                                CombinationLabels labels) const = 0;
  // Load arrangements (pattern rules) over a member's span_count parts:
  // each marks the loaded spans (variable actions present, permanent
  // actions at their `loaded` factor); the others carry the permanent
  // actions at their `unloaded` factor. Envelope over all.
  virtual std::vector<std::vector<bool>> load_arrangements(std::size_t span_count) const = 0;
  // The code's load arrangements over the bays_x × bays_y bays of a
  // two-way slab, for these actions (a rule may depend on the ratio of
  // variable to permanent load); the envelope over all is designed. Empty:
  // the code gives none, and two-way slabs cannot be designed under it.
  virtual std::vector<BayArrangement> bay_load_arrangements(std::size_t /*bays_x*/, std::size_t /*bays_y*/,
                                                            const std::vector<Action>& /*actions*/) const {
    return {};
  }
  // The same for a flat slab on columns, whose frames along each column
  // line are loaded span by span across the whole width (alternate spans,
  // adjacent spans) as well as by bays. Default: the two-way arrangements.
  virtual std::vector<BayArrangement> flat_load_arrangements(std::size_t bays_x, std::size_t bays_y,
                                                             const std::vector<Action>& actions) const {
    return bay_load_arrangements(bays_x, bays_y, actions);
  }
};

}  // namespace armature
