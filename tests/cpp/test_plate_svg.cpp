// The record's drawings of a two-way slab (kernel/src/record/plate_svg.hpp):
// a colour map fed the kernel's own plate analysis (plate.hpp) of a simply
// supported bay, and plans with every edge condition. Sources, beside each
// check:
//   - Navier's double series for a simply supported rectangle
//     (Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, §30;
//     the series, from memory), computed here for the centre moment.
//   - The symmetry of a simply supported rectangle under a uniform load:
//     the largest mx at the centre, the twisting moment mxy largest in
//     magnitude at the corners with opposite signs at neighbouring corners
//     (same source, §30, from memory).
// Our scenario: a bay of the workshop floor, 4.2 m (x) by 5.4 m (y), 200 mm
// slab, E = 30 000 MPa, ν = 0.2, 14.8 kPa (about 1.35 × 6.5 + 1.5 × 4.0).
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <string>
#include <vector>

#include "../../kernel/src/record/plate_svg.hpp"
#include "armature/design.hpp"
#include "armature/format.hpp"
#include "armature/plate.hpp"

using armature::EndSupport;

namespace {

constexpr double pi = 3.14159265358979323846;

// A small well-formedness check: every tag closes in order, attribute
// values are quoted, '<' never appears in text or values and '&' only
// starts one of the five predefined entities (XML 1.0 §2.1, 2.4; common
// practice for a check of this size).
bool well_formed(const std::string& s, std::string& why) {
  std::vector<std::string> open;
  auto entity_ok = [&](std::size_t at) {
    for (const char* e : {"&amp;", "&lt;", "&gt;", "&quot;", "&apos;"})
      if (s.compare(at, std::char_traits<char>::length(e), e) == 0) return true;
    return false;
  };
  std::size_t k = 0;
  while (k < s.size()) {
    if (s[k] == '&' && !entity_ok(k)) return why = "bare & at " + std::to_string(k), false;
    if (s[k] == '>') return why = "bare > in text at " + std::to_string(k), false;
    if (s[k] != '<') {
      ++k;
      continue;
    }
    const bool closing = k + 1 < s.size() && s[k + 1] == '/';
    std::size_t p = k + (closing ? 2 : 1), name_start = p;
    while (p < s.size() && (std::isalnum(static_cast<unsigned char>(s[p])) || s[p] == '-' || s[p] == ':')) ++p;
    const std::string name = s.substr(name_start, p - name_start);
    if (name.empty()) return why = "tag without a name at " + std::to_string(k), false;
    if (closing) {
      if (p >= s.size() || s[p] != '>') return why = "bad closing tag " + name, false;
      if (open.empty() || open.back() != name) return why = "</" + name + "> closes nothing open", false;
      open.pop_back();
      k = p + 1;
      continue;
    }
    // Attributes: name="value" pairs up to '>' or '/>'.
    for (;;) {
      while (p < s.size() && s[p] == ' ') ++p;
      if (p >= s.size()) return why = "unterminated tag " + name, false;
      if (s[p] == '>') {
        open.push_back(name);
        ++p;
        break;
      }
      if (s.compare(p, 2, "/>") == 0) {
        p += 2;
        break;
      }
      const std::size_t eq = s.find('=', p);
      if (eq == std::string::npos || eq + 1 >= s.size() || s[eq + 1] != '"')
        return why = "unquoted attribute in " + name, false;
      const std::size_t end = s.find('"', eq + 2);
      if (end == std::string::npos) return why = "unterminated attribute in " + name, false;
      for (std::size_t c = eq + 2; c < end; ++c) {
        if (s[c] == '<') return why = "< in an attribute of " + name, false;
        if (s[c] == '&' && !entity_ok(c)) return why = "bare & in an attribute of " + name, false;
      }
      p = end + 1;
    }
    k = p;
  }
  if (!open.empty()) return why = "<" + open.back() + "> never closed", false;
  if (s.rfind("<svg", 0) != 0) return why = "does not start with <svg", false;
  return true;
}

std::size_t count(const std::string& s, const std::string& what) {
  std::size_t n = 0;
  for (std::size_t at = s.find(what); at != std::string::npos; at = s.find(what, at + what.size())) ++n;
  return n;
}

// The text of every <text> element after each occurrence of `marker`
// (up to the end of the group that follows it), joined by spaces.
std::vector<std::string> texts_after(const std::string& s, const std::string& marker) {
  std::vector<std::string> out;
  for (std::size_t at = s.find(marker); at != std::string::npos; at = s.find(marker, at + 1)) {
    // The marker may be an attribute of the <text> itself.
    const std::size_t tag = s.rfind('<', at);
    const std::size_t t = s.compare(tag, 5, "<text") == 0 ? tag : s.find("<text", at);
    const std::size_t gt = s.find('>', t), end = s.find("</text>", gt);
    std::string body = s.substr(gt + 1, end - gt - 1);
    for (std::size_t a = body.find("&amp;"); a != std::string::npos; a = body.find("&amp;", a + 1))
      body.replace(a, 5, "&");
    out.push_back(body);
  }
  return out;
}

// The contents of the first element that starts with `open` up to its
// matching close `</g>` (groups hold no nested groups here).
std::string group(const std::string& s, const std::string& open) {
  const std::size_t at = s.find(open);
  if (at == std::string::npos) return {};
  return s.substr(at, s.find("</g>", at) - at);
}

std::string caution_of(const std::string& svg) {
  const std::string g = group(svg, "<g class=\"caution\"");
  std::string all;
  for (std::size_t at = g.find("<text"); at != std::string::npos; at = g.find("<text", at + 1)) {
    const std::size_t gt = g.find('>', at), end = g.find("</text>", gt);
    all += (all.empty() ? "" : " ") + g.substr(gt + 1, end - gt - 1);
  }
  return all;
}

struct Analysed {
  armature::PlatePlan plan;
  armature::ScalarMap mx, mxy, bottom_x;
  double D = 0;
};

// The workshop bay, simply supported, analysed at the default mesh; maps
// in metres and kNm/m (1 N·mm/mm = 10⁻³ kNm/m).
Analysed simply_supported_bay() {
  armature::PlateGeometry g;
  g.x_spans_mm = {4200};
  g.y_spans_mm = {5400};
  g.thickness_mm = 200;
  g.elastic_modulus_MPa = 30000;
  g.poisson_ratio = 0.2;
  const armature::PlateModel model(g);
  armature::PlateLoadCase lc;
  lc.bay_pressures_MPa = {0.0148};
  const auto field = model.solve({lc});
  const auto nodes = field.node_moments(0);
  Analysed a;
  a.D = armature::plate_flexural_rigidity(30000, 200, 0.2);
  a.plan.x_lines = {0, 4.2};
  a.plan.y_lines = {0, 5.4};
  a.plan.bays = {{"bay 1,1", 0, 4.2, 0, 5.4}};
  for (double x : model.node_x_mm()) a.mx.x.push_back(x / 1000);
  for (double y : model.node_y_mm()) a.mx.y.push_back(y / 1000);
  a.mxy.x = a.bottom_x.x = a.mx.x;
  a.mxy.y = a.bottom_x.y = a.mx.y;
  for (const auto& m : nodes) {
    a.mx.values.push_back(m.mx * 1e-3);
    a.mxy.values.push_back(m.mxy * 1e-3);
    a.bottom_x.values.push_back(armature::wood_armer(m).bottom_x * 1e-3);
  }
  return a;
}

}  // namespace

TEST_CASE("Plate map of mx of a simply supported bay prints the field's extremes and locates the maximum at the centre",
          "[plate][record]") {
  const Analysed a = simply_supported_bay();
  const std::string svg = armature::plate_map_svg(a.plan, a.mx, "mx, largest of the load cases", "kNm/m");
  std::string why;
  INFO(why);
  REQUIRE(well_formed(svg, why));

  const auto [lo, hi] = std::minmax_element(a.mx.values.begin(), a.mx.values.end());
  // The field itself against Navier's series at the centre (x = a/2,
  // y = b/2, odd m, n, αm = mπ/a, βn = nπ/b): mx = Σ 16 q (αm² + ν βn²)
  // (−1)^((m+n)/2−1) / (π² m n (αm² + βn²)²), in N·mm/mm with a, b in mm;
  // within 1 % at the default mesh (plate.hpp).
  double navier = 0;
  const double qa = 0.0148, a_mm = 4200, b_mm = 5400;
  for (int m = 1; m <= 301; m += 2)
    for (int n = 1; n <= 301; n += 2) {
      const double am = m * pi / a_mm, bn = n * pi / b_mm, k = am * am + bn * bn;
      const double sign = ((m + n) / 2 - 1) % 2 == 0 ? 1.0 : -1.0;
      navier += 16 * qa / (pi * pi * m * n * k * k) * (am * am + 0.2 * bn * bn) * sign;
    }
  CHECK(*hi == Approx(navier * 1e-3).epsilon(0.01));

  // The colour bar prints the field's own minimum and maximum.
  CHECK(texts_after(svg, "class=\"scale-max\"").at(0) == "max " + armature::plain_number(*hi));
  CHECK(texts_after(svg, "class=\"scale-min\"").at(0) == "min " + armature::plain_number(*lo));
  // The maximum is marked at the centre of the bay (2.1, 2.7 m).
  const auto peak = texts_after(svg, "<g class=\"peak-max\"");
  REQUIRE(peak.size() == 1);
  CHECK(peak[0] == "max " + armature::plain_number(*hi) + " kNm/m at x = 2.1, y = 2.7 m");
  // One cell per sample: nx · ny.
  CHECK(count(svg, "class=\"cell\"") == a.mx.x.size() * a.mx.y.size());
  CHECK(a.mx.x.size() * a.mx.y.size() == 121);
  // The recovered mx dips just below zero at the corners (the twist
  // there), so the scale is the signed one: both extremes marked.
  CHECK(count(svg, "peak-min") == (*lo < -1e-9 * *hi ? 1u : 0u));
  // Every edge pinned: four pinned edges, a legend of pinned only, no
  // interior support line.
  CHECK(count(svg, "<g class=\"edge pinned\"") == 4);
  CHECK(count(svg, "class=\"edge fixed\"") + count(svg, "class=\"edge free\"") == 0);
  CHECK(count(svg, "<g class=\"legend\"") == 1);
  CHECK(count(svg, "data-condition=\"pinned\"") == 1);
  CHECK(count(svg, "class=\"support-line\"") == 0);
  CHECK(caution_of(svg) == std::string("Caution: ") + armature::caution_text);
}

TEST_CASE("Plate map of a design moment (of one sign) takes a sequential scale from its smallest value",
          "[plate][record]") {
  const Analysed a = simply_supported_bay();
  const std::string svg = armature::plate_map_svg(a.plan, a.bottom_x, "bottom x design moment", "kNm/m");
  std::string why;
  INFO(why);
  REQUIRE(well_formed(svg, why));
  const auto [lo, hi] = std::minmax_element(a.bottom_x.values.begin(), a.bottom_x.values.end());
  // Wood–Armer design moments are magnitudes (plate.hpp): none below zero.
  REQUIRE(*lo >= 0);
  CHECK(texts_after(svg, "class=\"scale-max\"").at(0) == "max " + armature::plain_number(*hi));
  CHECK(texts_after(svg, "class=\"scale-min\"").at(0) == "min " + armature::plain_number(*lo));
  // At the centre mxy = 0, so the bottom x moment is mx + |mxy| = mx there
  // (Wood–Armer, the general case; Wood 1968, from memory), the largest.
  CHECK(texts_after(svg, "<g class=\"peak-max\"").at(0) ==
        "max " + armature::plain_number(*hi) + " kNm/m at x = 2.1, y = 2.7 m");
  CHECK(count(svg, "peak-min") == 0);
  CHECK(count(svg, ">0</text>") == 0);
  // The smallest value is white (the sequential scale starts there), the
  // largest the darkest red of the scale.
  CHECK(count(svg, "fill=\"#ffffff\"") >= 1);
  CHECK(count(svg, "fill=\"#b2182b\"") >= 1);
  CHECK(count(svg, "fill=\"#2166ac\"") == 0);
}

TEST_CASE("Plate map of a signed field takes a diverging scale with both extremes marked at the corners",
          "[plate][record]") {
  const Analysed a = simply_supported_bay();
  const std::string svg = armature::plate_map_svg(a.plan, a.mxy, "mxy", "kNm/m");
  std::string why;
  INFO(why);
  REQUIRE(well_formed(svg, why));
  const auto [lo, hi] = std::minmax_element(a.mxy.values.begin(), a.mxy.values.end());
  REQUIRE(*lo < 0);
  REQUIRE(*hi > 0);
  // Opposite corners alike, neighbouring corners opposite (symmetry), so
  // max and min are equal and opposite to four figures.
  CHECK(*hi == Approx(-*lo).epsilon(1e-6));
  CHECK(texts_after(svg, "class=\"scale-max\"").at(0) == "max " + armature::plain_number(*hi));
  CHECK(texts_after(svg, "class=\"scale-min\"").at(0) == "min " + armature::plain_number(*lo));
  const auto max_label = texts_after(svg, "<g class=\"peak-max\"");
  const auto min_label = texts_after(svg, "<g class=\"peak-min\"");
  REQUIRE(max_label.size() == 1);
  REQUIRE(min_label.size() == 1);
  // mxy = −D(1 − ν) w,xy: at the corner (0, 0) w,xy > 0 for a sagging
  // plate, so mxy is negative there and at (a, b), positive at (a, 0)
  // and (0, b) (which of each pair is marked depends on the last bits).
  const std::string lo_text = "min " + armature::plain_number(*lo) + " kNm/m at ";
  const std::string hi_text = "max " + armature::plain_number(*hi) + " kNm/m at ";
  CHECK((min_label[0] == lo_text + "x = 0, y = 0 m" || min_label[0] == lo_text + "x = 4.2, y = 5.4 m"));
  CHECK((max_label[0] == hi_text + "x = 4.2, y = 0 m" || max_label[0] == hi_text + "x = 0, y = 5.4 m"));
  // The zero of the scale is drawn: white in the middle of the bar.
  CHECK(count(svg, "fill=\"#ffffff\"") > 0);
  CHECK(count(svg, ">0</text>") == 1);
}

TEST_CASE("Plate plan draws each edge by its condition, names the bays, prints their bars",
          "[plate][record]") {
  armature::PlatePlan plan;
  plan.x_lines = {0, 5.4, 11.4};
  plan.y_lines = {0, 4.2, 8.4};
  plan.edges = {EndSupport::pinned, EndSupport::fixed, EndSupport::pinned, EndSupport::free};
  plan.bays = {{"bay 1,1", 0, 5.4, 0, 4.2, "ø12 @ 200 mm", "ø10 @ 250 mm"},
               {"bay 2,1", 5.4, 11.4, 0, 4.2, "ø12 @ 175 mm", "ø10 @ 250 mm"},
               {"bay 1,2", 0, 5.4, 4.2, 8.4, "ø12 @ 200 mm", "ø10 @ 200 mm"},
               {"bay 2,2", 5.4, 11.4, 4.2, 8.4, "ø16 @ 250 mm", "ø10 @ 200 mm"}};
  plan.marks = {{5.4, 2.1, "top x ø12 @ 150 mm", true}, {2.7, 4.2, "top y ø10 @ 200 mm"}};
  const std::string svg = armature::plate_plan_svg(plan);
  std::string why;
  INFO(why);
  REQUIRE(well_formed(svg, why));

  CHECK(count(svg, "<g class=\"edge pinned\" data-edge=\"x0\"") == 1);
  CHECK(count(svg, "<g class=\"edge fixed\" data-edge=\"x1\"") == 1);
  CHECK(count(svg, "<g class=\"edge pinned\" data-edge=\"y0\"") == 1);
  CHECK(count(svg, "<g class=\"edge free\" data-edge=\"y1\"") == 1);
  // Styles: the fixed edge hatched (many short lines), the pinned edges
  // with triangles, the free edge one thin line.
  CHECK(count(group(svg, "<g class=\"edge fixed\""), "<line") > 20);
  CHECK(count(group(svg, "<g class=\"edge fixed\""), "<polygon") == 0);
  CHECK(count(group(svg, "<g class=\"edge pinned\" data-edge=\"x0\""), "<polygon") >= 2);
  const std::string free_edge = group(svg, "<g class=\"edge free\"");
  CHECK(count(free_edge, "<line") == 1);
  CHECK(count(free_edge, "stroke-width=\"0.6\"") == 1);
  // The legend: the three conditions used and the interior line supports,
  // each once, each sample drawn as its edges are.
  CHECK(count(svg, "<g class=\"legend\"") == 4);
  for (const char* c : {"fixed", "pinned", "free", "interior"})
    CHECK(count(svg, std::string("<g class=\"legend\" data-condition=\"") + c + "\"") == 1);
  CHECK(count(group(svg, "<g class=\"legend\" data-condition=\"fixed\""), "<line") > 2);
  CHECK(count(group(svg, "<g class=\"legend\" data-condition=\"pinned\""), "<polygon") >= 1);
  // Interior grid lines x = 5.4 and y = 4.2.
  CHECK(count(svg, "class=\"support-line\"") == 2);
  // Bays and bars.
  for (const auto& b : plan.bays) {
    CHECK(count(svg, ">" + b.name + "</text>") == 1);
  }
  CHECK(count(svg, ">x: ø16 @ 250 mm</text>") == 1);
  CHECK(count(svg, ">y: ø10 @ 200 mm</text>") == 2);
  CHECK(count(svg, ">top x ø12 @ 150 mm</text>") == 1);
  CHECK(count(svg, ">top y ø10 @ 200 mm</text>") == 1);
  CHECK(count(svg, "class=\"mark\"") == 2);
  CHECK(count(group(svg, "<g class=\"mark\""), "rotate(-90") == 1);  // the label along the line x = 5.4
  // Spans dimensioned: 5.4 and 6 m along x, 4.2 m twice along y.
  CHECK(count(svg, ">5.4 m</text>") == 1);
  CHECK(count(svg, ">6 m</text>") == 1);
  CHECK(count(svg, ">4.2 m</text>") == 2);
  CHECK(caution_of(svg) == std::string("Caution: ") + armature::caution_text);
}

TEST_CASE("Plate drawings refuse a map whose sizes disagree and a grid that does not ascend", "[plate][record]") {
  armature::PlatePlan plan;
  plan.x_lines = {0, 4.2};
  plan.y_lines = {0, 5.4};
  armature::ScalarMap map{{0, 2.1, 4.2}, {0, 5.4}, {1, 2, 3, 4, 5}};
  CHECK_THROWS_AS(armature::plate_map_svg(plan, map, "mx", "kNm/m"), std::invalid_argument);
  map.values.push_back(std::nan(""));
  CHECK_THROWS_AS(armature::plate_map_svg(plan, map, "mx", "kNm/m"), std::invalid_argument);
  map.values.back() = 6;
  CHECK_NOTHROW(armature::plate_map_svg(plan, map, "mx", "kNm/m"));
  map.x = {0, 2.1, 4.5};  // off the plate
  CHECK_THROWS_AS(armature::plate_map_svg(plan, map, "mx", "kNm/m"), std::invalid_argument);
  plan.x_lines = {0, 4.2, 4.2};
  CHECK_THROWS_AS(armature::plate_plan_svg(plan), std::invalid_argument);
}

TEST_CASE("Plate map over a bay fixed on one edge and free on another draws those edges and finds the hogging at the fixed edge",
          "[plate][record]") {
  // The workshop bay with x1 fixed (a wall built in) and y1 free (a
  // balcony edge), the rest pinned: mx hogs along the fixed edge, most at
  // its middle part, and nowhere else as much (a propped plate; common
  // practice, as the one-way propped cantilever's support moment).
  armature::PlateGeometry g;
  g.x_spans_mm = {4200};
  g.y_spans_mm = {5400};
  g.edges = {EndSupport::pinned, EndSupport::fixed, EndSupport::pinned, EndSupport::free};
  g.thickness_mm = 200;
  g.elastic_modulus_MPa = 30000;
  g.poisson_ratio = 0.2;
  const armature::PlateModel model(g);
  armature::PlateLoadCase lc;
  lc.bay_pressures_MPa = {0.0148};
  const auto nodes = model.solve({lc}).node_moments(0);
  armature::PlatePlan plan;
  plan.x_lines = {0, 4.2};
  plan.y_lines = {0, 5.4};
  plan.edges = g.edges;
  plan.bays = {{"bay 1,1", 0, 4.2, 0, 5.4}};
  armature::ScalarMap map;
  for (double x : model.node_x_mm()) map.x.push_back(x / 1000);
  for (double y : model.node_y_mm()) map.y.push_back(y / 1000);
  for (const auto& m : nodes) map.values.push_back(m.mx * 1e-3);
  const std::string svg = armature::plate_map_svg(plan, map, "mx", "kNm/m");
  std::string why;
  INFO(why);
  REQUIRE(well_formed(svg, why));
  CHECK(count(svg, "<g class=\"edge pinned\" data-edge=\"x0\"") == 1);
  CHECK(count(svg, "<g class=\"edge fixed\" data-edge=\"x1\"") == 1);
  CHECK(count(svg, "<g class=\"edge pinned\" data-edge=\"y0\"") == 1);
  CHECK(count(svg, "<g class=\"edge free\" data-edge=\"y1\"") == 1);
  CHECK(count(svg, "<g class=\"legend\"") == 3);
  for (const char* c : {"fixed", "pinned", "free"})
    CHECK(count(svg, std::string("<g class=\"legend\" data-condition=\"") + c + "\"") == 1);
  const auto [lo, hi] = std::minmax_element(map.values.begin(), map.values.end());
  REQUIRE(*lo < 0);
  CHECK(texts_after(svg, "class=\"scale-min\"").at(0) == "min " + armature::plain_number(*lo));
  const std::string min_label = texts_after(svg, "<g class=\"peak-min\"").at(0);
  const std::string prefix = "min " + armature::plain_number(*lo) + " kNm/m at x = 4.2, y = ";
  CHECK(min_label.rfind(prefix, 0) == 0);
  // ... and away from the corners, where the fixed edge meets the others.
  const double y_min = std::stod(min_label.substr(prefix.size()));
  CHECK(y_min > 0.5);
  CHECK(y_min < 5.4 - 0.5);
  CHECK(texts_after(svg, "class=\"scale-max\"").at(0) == "max " + armature::plain_number(*hi));
}
