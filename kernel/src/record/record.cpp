#include "armature/record.hpp"

#include <cstdint>
#include <cstring>
#include <limits>
#include <mutex>
#include <ostream>
#include <unordered_set>

#include "armature/code.hpp"
#include "armature/errors.hpp"
#include "armature/request.hpp"

namespace armature {

namespace {

// Every label's text, kept for the life of the process (never destroyed:
// labels may be used from static destructors). Elements of an
// unordered_set keep their address when it grows.
struct LabelStore {
  std::mutex mutex;
  std::unordered_set<std::string> texts;
};
LabelStore& label_store() {
  static auto* store = new LabelStore();
  return *store;
}

const std::string* stored_text(std::string_view text) {
  auto& store = label_store();
  std::lock_guard<std::mutex> lock(store.mutex);
  return &*store.texts.emplace(text).first;
}

// Labels are mostly made from string literals, again and again: each
// thread remembers, by address, the stored text of the literals it has
// seen. The text is compared on every hit, so a different text at a
// remembered address (a plug-in unloaded and another loaded) is looked up
// afresh, never mistaken.
struct LiteralCache {
  static constexpr std::size_t size = 512;  // 2^9 slots
  const char* address[size] = {};
  const std::string* text[size] = {};
};

const std::string* text_of_literal(const char* literal) {
  thread_local LiteralCache cache;
  // Literals sit side by side at any alignment: a multiplicative hash
  // spreads neighbouring addresses over the slots, and a few neighbouring
  // slots are tried so that two literals rarely take turns at one.
  const std::uint64_t address = reinterpret_cast<std::uintptr_t>(literal);
  const std::size_t home = static_cast<std::size_t>((address * 0x9E3779B97F4A7C15ull) >> 55);  // 9 bits
  std::size_t free_slot = home;
  for (std::size_t probe = 0; probe < 4; ++probe) {
    const std::size_t slot = (home + probe) % LiteralCache::size;
    if (cache.address[slot] == literal) {
      if (std::strcmp(cache.text[slot]->c_str(), literal) == 0) return cache.text[slot];
      free_slot = slot;  // another text at a remembered address: replace it
      break;
    }
    if (!cache.address[slot]) {
      free_slot = slot;
      break;
    }
  }
  const std::string* stored = stored_text(literal);
  cache.address[free_slot] = literal;
  cache.text[free_slot] = stored;
  return stored;
}

}  // namespace

Label::Label() {
  static const std::string* const empty = stored_text("");
  text_ = empty;
}
Label::Label(const char* text) : text_(text_of_literal(text ? text : "")) {}
Label::Label(std::string_view text) : text_(stored_text(text)) {}

std::ostream& operator<<(std::ostream& out, const Label& label) { return out << label.str(); }

Check make_check(Label id, std::string where, Label clause, double demand, double capacity,
                 Label unit, std::vector<Step> steps) {
  Check c;
  c.id = id;
  c.where = std::move(where);
  c.clause = clause;
  c.demand = demand;
  c.capacity = capacity;
  c.unit = unit;
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

const char* to_string(DuctilityClass ductility) {
  switch (ductility) {
    case DuctilityClass::A: return "A";
    case DuctilityClass::B: return "B";
    case DuctilityClass::C: return "C";
  }
  return "?";
}

const char* to_string(Face face) { return face == Face::bottom ? "bottom" : "top"; }

const char* to_string(Rationalise rationalise) {
  switch (rationalise) {
    case Rationalise::none: return "none";
    case Rationalise::uniform_bottom: return "uniform_bottom";
  }
  return "?";
}

const char* to_string(CrackWidthMethod method) {
  return method == CrackWidthMethod::tables ? "tables" : "calculated";
}

}  // namespace armature
