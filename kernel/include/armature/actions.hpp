// Named actions on a member: what acts (kind, imposed-load category), how
// it is distributed and its characteristic value, in kernel units. The
// code's combination rules (combinations.hpp) give the factors; the kernel
// turns factored actions into loads on the member.
#pragma once

#include <array>
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace armature {

// permanent: G (ACI D); imposed: Q of an occupancy category (ACI L);
// snow: S; roof: imposed load on a roof, category H (ACI Lr).
enum class ActionKind { permanent, imposed, snow, roof };
const char* to_string(ActionKind kind);
inline bool is_variable(ActionKind kind) { return kind != ActionKind::permanent; }

enum class Distribution {
  uniform,  // value N/mm² (per area): the whole member, or one span (from/to)
  line,     // value N/mm, across the strip's width, at one position of a span
  point,    // value N at one position of a span, spread over an effective width
};
const char* to_string(Distribution distribution);

// Where an action was given: the request's list, a shorthand of the
// request (loads.dead_kPa, loads.imposed_kPa) or derived by the kernel
// (the self-weight from thickness and density).
enum class ActionSource { given, shorthand, self_weight };

struct Action {
  std::string name;                 // unique among a request's actions
  ActionKind kind = ActionKind::permanent;
  std::string category;             // imposed: "A"–"H"; roof: "H"; otherwise empty
  Distribution distribution = Distribution::uniform;
  double value = 0.0;               // characteristic: N/mm² (uniform), N/mm (line), N (point)
  // 0-based span; none: the whole member (uniform actions only).
  std::optional<std::size_t> span;
  // Uniform on a span: the loaded part, from the span's left support (mm);
  // none: the whole span.
  std::optional<double> from_mm, to_mm;
  double at_mm = 0.0;               // line and point: from the span's left support
  double effective_width_mm = 0.0;  // point: the width it is spread over
  ActionSource source = ActionSource::given;
  std::string field;                // request path ("loads.actions[2]"); empty for derived ones
  // Two-way slabs: the plan position (mm) x0, y0, x1, y1. A patch (uniform)
  // covers the rectangle, a line runs from (x0, y0) to (x1, y1) parallel
  // to x or y, a point acts at (x0, y0). None: uniform over the whole slab.
  std::optional<std::array<double, 4>> plan_mm;
};

}  // namespace armature
