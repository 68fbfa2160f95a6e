// The Check and Step records every code returns; the JSON result, the
// Python objects and the calculation record are all drawn from these.
#pragma once

#include <iosfwd>
#include <limits>
#include <string>
#include <string_view>
#include <vector>

namespace armature {

// A short text that repeats from check to check: an id, a clause, a unit.
// Each distinct text is stored once for the life of the process, so a
// Label is one pointer and copying it allocates nothing. Labels are for
// fixed vocabularies; numbers belong in the steps.
class Label {
 public:
  Label();
  // For string literals (and other text that keeps its address and its
  // characters while its library is loaded): the text is remembered by
  // address. Text in a buffer or a std::string goes by string_view.
  Label(const char* text);  // NOLINT: implicit, as a string would be
  Label(std::string_view text);
  Label(const std::string& text) : Label(std::string_view(text)) {}  // NOLINT

  const std::string& str() const { return *text_; }
  operator const std::string&() const { return *text_; }  // NOLINT
  const char* c_str() const { return text_->c_str(); }
  bool empty() const { return text_->empty(); }
  std::size_t size() const { return text_->size(); }

  friend bool operator==(const Label& a, const Label& b) { return a.text_ == b.text_; }
  friend bool operator==(const Label& a, const char* b) { return *a.text_ == b; }
  friend bool operator==(const Label& a, const std::string& b) { return *a.text_ == b; }
  friend bool operator==(const Label& a, std::string_view b) { return *a.text_ == b; }

 private:
  const std::string* text_;
};

inline std::string operator+(const Label& a, const std::string& b) { return a.str() + b; }
inline std::string operator+(const Label& a, const char* b) { return a.str() + b; }
inline std::string operator+(const std::string& a, const Label& b) { return a + b.str(); }
inline std::string operator+(const char* a, const Label& b) { return a + b.str(); }
std::ostream& operator<<(std::ostream& out, const Label& label);

// One line of a derivation: symbol = expression = substituted values = result.
struct Step {
  std::string symbol;       // e.g. "K"
  std::string expression;   // e.g. "M_Ed / (b d² fck)"
  std::string substituted;  // e.g. "15.2 × 10⁶ / (1000 × 170² × 30)"; empty: nothing to substitute
  double result = 0.0;
  std::string unit;         // kernel or report unit of result, "-" if none
  std::string clause;       // e.g. "EN 1992-1-1 6.1"
};

// One verified requirement: demand ≤ capacity.
struct Check {
  Label id;            // bending, ductility, min_steel, ... (contract.md)
  std::string where;   // "span 1", "support 2"
  Label clause;        // "EN 1992-1-1 6.2.2(1)"
  double demand = 0.0;    // in report units (kNm, kN, mm, mm2, -)
  double capacity = 0.0;  // same unit as demand
  Label unit;
  double utilisation = 0.0;  // demand / capacity
  bool pass = false;
  std::vector<Step> steps;
  // How the requirement was worked out where a check id has more than one
  // way (deflection: "span_depth", "calculated"); empty otherwise, and
  // left out of the result.
  Label method{};
};

// utilisation = demand / capacity; a capacity of zero or less gives +inf
// unless the demand is also zero.
inline double utilisation_of(double demand, double capacity) {
  if (capacity > 0.0) return demand / capacity;
  if (demand <= 0.0) return 0.0;
  return std::numeric_limits<double>::infinity();
}

// Builds a Check with utilisation and pass derived from demand and capacity.
Check make_check(Label id, std::string where, Label clause, double demand, double capacity,
                 Label unit, std::vector<Step> steps = {});

}  // namespace armature
