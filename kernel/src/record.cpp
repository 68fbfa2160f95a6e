#include "armature/record.hpp"

#include <limits>

#include "armature/code.hpp"
#include "armature/errors.hpp"
#include "armature/request.hpp"

namespace armature {

Check make_check(std::string id, std::string where, std::string clause, double demand,
                 double capacity, std::string unit, std::vector<Step> steps) {
  Check c;
  c.id = std::move(id);
  c.where = std::move(where);
  c.clause = std::move(clause);
  c.demand = demand;
  c.capacity = capacity;
  c.unit = std::move(unit);
  c.utilisation = utilisation_of(demand, capacity);
  c.pass = c.utilisation <= 1.0;
  c.steps = std::move(steps);
  return c;
}

bool InputProblems::has_field(const std::string& field) const {
  for (const auto& p : items_)
    if (p.field == field) return true;
  return false;
}

void InputProblems::raise_if_any() const {
  if (!items_.empty()) throw InputError(items_);
}

static std::string join_problems(const std::vector<InputProblem>& problems) {
  std::string text;
  for (const auto& p : problems) {
    if (!text.empty()) text += '\n';
    text += p.text();
  }
  return text;
}

InputError::InputError(std::vector<InputProblem> problems)
    : std::invalid_argument(join_problems(problems)), problems_(std::move(problems)) {}

const char* to_string(EndSupport end) {
  switch (end) {
    case EndSupport::pinned: return "pinned";
    case EndSupport::fixed: return "fixed";
    case EndSupport::free: return "free";
  }
  return "?";
}

const char* to_string(Face face) { return face == Face::bottom ? "bottom" : "top"; }

}  // namespace armature
