#include "armature/record.hpp"

#include <atomic>
#include <cstdint>
#include <cstring>
#include <limits>
#include <memory>
#include <mutex>
#include <ostream>
#include <unordered_map>
#include <unordered_set>
#include <vector>

#include "armature/code.hpp"
#include "armature/errors.hpp"
#include "armature/request.hpp"
#include "label_cache.hpp"

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

// Labels are mostly made from string literals, again and again: one
// table for the whole process remembers, by address, the stored text of
// the literals seen. It is read without a lock (one atomic load per probe;
// a per-thread table cost a `__tls_get_addr` per label), so a slot holds a
// pointer to an entry that is never changed or freed once published.
// A literal's address keeps its text for as long as its library is
// loaded; the registry calls `forget_remembered_literals` before it
// unloads a plug-in, so a text at a reused address is never mistaken.
struct LiteralEntry {
  const char* address;
  const std::string* text;
};

// The slots are a constant-initialised array (no start-up guard to test
// on each look-up; trivially destroyed, so usable from static destructors).
constexpr std::size_t literal_slot_count = 512;  // 2^9 slots
constinit std::atomic<const LiteralEntry*> literal_slots[literal_slot_count] = {};

struct LiteralTable {
  // Owns every entry ever published (guarded by the label store's mutex).
  // Entries are not freed when forgotten: a reader may still hold one.
  std::vector<std::unique_ptr<LiteralEntry>> entries;
  // The entry of each address remembered since the last forgetting, so a
  // literal that lost its slot to another comes back without a new entry.
  std::unordered_map<const char*, const LiteralEntry*> by_address;
};
LiteralTable& literal_table() {
  static auto* table = new LiteralTable();  // never destroyed, as the store
  return *table;
}

// Literals sit side by side at any alignment: a multiplicative hash
// spreads neighbouring addresses over the slots, and a few neighbouring
// slots are tried so that two literals rarely take turns at one.
std::size_t home_slot(const char* literal) {
  const std::uint64_t address = reinterpret_cast<std::uintptr_t>(literal);
  return static_cast<std::size_t>((address * 0x9E3779B97F4A7C15ull) >> 55);  // 9 bits
}
constexpr std::size_t literal_probes = 4;

// A literal not remembered: store its text and publish its entry, under
// the lock. Kept out of line so that the look-up stays a few instructions.
[[gnu::noinline]] const std::string* remember_literal(const char* literal, std::size_t home) {
  auto& table = literal_table();
  auto& store = label_store();
  std::lock_guard<std::mutex> lock(store.mutex);
  const LiteralEntry*& known = table.by_address[literal];
  if (!known) {
    const std::string* text = &*store.texts.emplace(literal).first;
    table.entries.push_back(std::make_unique<LiteralEntry>(LiteralEntry{literal, text}));
    known = table.entries.back().get();
  }
  // The first free slot of the probe sequence, or the home slot if all
  // are taken (the literal it held is looked up afresh next time).
  std::size_t chosen = home;
  for (std::size_t probe = 0; probe < literal_probes; ++probe) {
    const std::size_t slot = (home + probe) % literal_slot_count;
    const LiteralEntry* e = literal_slots[slot].load(std::memory_order_relaxed);
    if (!e || e == known) {
      chosen = slot;
      break;
    }
  }
  literal_slots[chosen].store(known, std::memory_order_release);
  return known->text;
}

const std::string* text_of_literal(const char* literal) {
  const std::size_t home = home_slot(literal);
  for (std::size_t probe = 0; probe < literal_probes; ++probe) {
    const LiteralEntry* e = literal_slots[(home + probe) % literal_slot_count].load(std::memory_order_acquire);
    if (!e) break;
    if (e->address == literal) return e->text;
  }
  return remember_literal(literal, home);
}

}  // namespace

void forget_remembered_literals() {
  std::lock_guard<std::mutex> lock(label_store().mutex);
  for (auto& slot : literal_slots) slot.store(nullptr, std::memory_order_release);
  literal_table().by_address.clear();
}

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

const char* to_string(DeflectionMethod method) {
  switch (method) {
    case DeflectionMethod::span_depth: return "span_depth";
    case DeflectionMethod::calculated: return "calculated";
    case DeflectionMethod::both: return "both";
  }
  return "span_depth";
}

const char* to_string(CrackWidthMethod method) {
  return method == CrackWidthMethod::tables ? "tables" : "calculated";
}

}  // namespace armature
