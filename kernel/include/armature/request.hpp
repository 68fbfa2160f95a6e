// The request model of contract.md, in kernel units (N, mm, MPa).
// Loads per unit area are held in MPa (N/mm²): 1 kPa = 1e-3 MPa.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "armature/actions.hpp"
#include "armature/errors.hpp"

namespace armature {

enum class EndSupport { pinned, fixed, free };

const char* to_string(EndSupport end);

// Ductility class of the reinforcement (A, B or C, as a steel is sold);
// a code with no such notion ignores it.
enum class DuctilityClass { A, B, C };

const char* to_string(DuctilityClass ductility);

// The two faces of the slab (bottom: soffit, top: upper surface).
enum class Face { bottom, top };
const char* to_string(Face face);

struct SlabInput {
  std::vector<double> spans_mm;  // effective spans, left to right
  std::array<EndSupport, 2> ends{EndSupport::pinned, EndSupport::pinned};
  double thickness_mm = 0.0;
  double strip_width_mm = 1000.0;
  // Breadth of each support along the strip, left to right (n + 1 for n
  // spans; 0 at a free end or a knife edge). Empty when not given: then
  // every moment is taken at the support centrelines.
  std::vector<double> support_widths_mm{};
};

struct ConcreteInput {
  std::optional<std::string> strength_class;      // "C30/37"
  std::optional<double> cylinder_strength_MPa;    // fck or f'c
  std::optional<double> density_kN_m3;            // code default when absent
  double aggregate_mm = 20.0;
};

// Check mode: the user's bars in one design region (no search there).
struct GivenBars {
  std::string where;       // a region of the member: "span 2", "support 3"
  Face face = Face::bottom;
  std::string bar;         // a designation of the code's catalogue
  double spacing_mm = 0.0;
  std::string direction;   // two-way slabs: "x" or "y", the direction the bars run
};

// How the bar search treats the regions together.
enum class Rationalise {
  none,            // each region its own least-area arrangement
  uniform_bottom,  // one bottom arrangement for every span region
};

const char* to_string(Rationalise rationalise);

struct ReinforcementInput {
  std::optional<double> yield_strength_MPa;       // code default when absent
  std::optional<std::vector<std::string>> bars;   // code default set when absent
  DuctilityClass ductility_class = DuctilityClass::B;
  // The search's spacings: min_spacing_mm + k spacing_step_mm up to the
  // code's largest (distribution bars alike).
  double spacing_step_mm = 25.0;
  double min_spacing_mm = 75.0;
  std::vector<GivenBars> given;                   // in the request's order
  Rationalise rationalise = Rationalise::none;
};

struct LoadsInput {
  double dead_MPa = 0.0;      // superimposed permanent load, N/mm² (shorthand)
  double imposed_MPa = 0.0;   // imposed load, N/mm² (shorthand; 0: none)
  std::string imposed_category = "B";
  std::vector<Action> actions;  // loads.actions, in the request's order
  bool actions_given = false;   // loads.actions was in the request
};

// Names the kernel gives the actions it makes: the self-weight and the
// shorthands loads.dead_kPa and loads.imposed_kPa.
inline constexpr const char* self_weight_action_name = "self-weight";
inline constexpr const char* dead_shorthand_action_name = "superimposed dead";
inline constexpr const char* imposed_shorthand_action_name = "imposed";


// Durability of one face: the per-face form (durability.top, .bottom) where
// given, else the plain form (durability.cover_mm, .exposure), which applies
// to both faces.
struct FaceDurability {
  std::optional<double> cover_mm;       // nominal cover given for this face
  std::optional<std::string> exposure;  // code default when absent
  // The request paths the values came from, for the codes' input errors:
  // "durability.top.exposure", or the plain "durability.exposure".
  std::string cover_field = "durability.cover_mm";
  std::string exposure_field = "durability.exposure";
};

struct DurabilityInput {
  std::array<FaceDurability, 2> faces{};  // indexed by Face (bottom, top)
  double design_life_years = 50.0;

  const FaceDurability& face(Face f) const { return faces[static_cast<std::size_t>(f)]; }
  FaceDurability& face(Face f) { return faces[static_cast<std::size_t>(f)]; }
  bool cover_given(Face f) const { return face(f).cover_mm.has_value(); }
  bool any_cover_given() const { return cover_given(Face::bottom) || cover_given(Face::top); }
};

struct FireInput {
  std::optional<int> resistance_min;
};

struct DesignOptions {
  std::optional<std::string> combination;  // EN: "6.10" or "6.10a/b"
  double redistribution_percent = 0.0;
};

// How the serviceability checks are made (serviceability of the request).
// The crack width: by the code's tables (bar size and spacing against the
// steel stress) or calculated from the cracked section.
enum class CrackWidthMethod { tables, calculated };

const char* to_string(CrackWidthMethod method);

// The deflection: by the code's span/depth rule, calculated from the
// curvature along the spans, or both reported.
enum class DeflectionMethod { span_depth, calculated, both };

const char* to_string(DeflectionMethod method);

// Cement class of EN 1992-1-1 3.1.2(6) for creep and shrinkage: S (slow),
// N (normal), R (rapid).
enum class CementClass { S, N, R };

struct ServiceabilityInput {
  CrackWidthMethod crack_width = CrackWidthMethod::tables;
  // Not given: span/depth, and its checks carry no "method" (as version 1).
  std::optional<DeflectionMethod> deflection;
  bool partitions = false;                 // non-structural partitions the deflection could damage
  std::optional<double> creep_coefficient;  // final φ; none: the code's method
  std::optional<double> shrinkage_strain;   // final total εcs (positive); none: the code's method
  std::optional<double> relative_humidity_percent;
  std::optional<double> age_at_loading_days;
  std::optional<double> partitions_age_days;  // age of the slab when partitions are built
  std::optional<CementClass> cement_class;

  DeflectionMethod deflection_method() const { return deflection.value_or(DeflectionMethod::span_depth); }
  bool calculated_deflection() const { return deflection_method() != DeflectionMethod::span_depth; }
};

// Detailing of the bars (detailing of the request, contract-v2 section 5).
// The bond condition asked for (detailing.bond): the code's rule by the
// bar's position ("auto"), or good or poor throughout.
enum class BondChoice { automatic, good, poor };
// Where bars stop (detailing.curtail): "none", every bar runs through its
// region's whole zone; "alternate", every other bottom bar of a span stops
// where the rest carry the sagging envelope.
enum class Curtailment { none, alternate };
struct DetailingInput {
  bool requested = false;        // the request gives `detailing`
  double slab_width_mm = 0.0;    // width of the floor detailed (slab_width_m)
  double stock_length_mm = 12000.0;
  BondChoice bond = BondChoice::automatic;
  Curtailment curtail = Curtailment::none;
};

// Title-block information of the calculation record (all optional).
struct ProjectInfo {
  std::string name, reference, designer, checker;
};

// Units of the readable summary and calculation record (the JSON result is
// always SI).
enum class ReportUnits { SI, US };

// ---- two-way slabs (contract-v2 section 2) ---------------------------------

// slab.type: the version 1 strip, a grid of bays on line supports, or a
// flat slab on columns.
enum class SlabType { one_way, two_way, flat };

// Flat slabs: the columns at the grid intersections (slab.columns).
struct ColumnsInput {
  double x_mm = 0.0, y_mm = 0.0;  // size_mm: along x, along y
  // height_m: the storey heights below and above the slab, as mm; 0: no
  // column on that side. Both 0: the columns are free to turn (none given).
  double below_mm = 0.0, above_mm = 0.0;
  bool restrained() const { return below_mm > 0.0 || above_mm > 0.0; }
  // shear_reinforcement: "links" (the default: links or stirrups where the
  // concrete alone does not carry the punching shear) or "none".
  bool shear_reinforcement = true;
};

// The geometry and analysis options of a two-way slab (slab.x_spans_m,
// slab.y_spans_m, slab.edges, analysis.*, reinforcement.outer_layer).
struct TwoWayInput {
  std::vector<double> x_spans_mm;
  std::vector<double> y_spans_mm;
  // Outer edges in the order x0, x1, y0, y1 (x0: the edge at x = 0). A
  // flat slab's "wall" edge is pinned; its "columns" edge is free (the
  // slab ends flush with the columns' outer faces): column_edges.
  std::array<EndSupport, 4> edges{EndSupport::pinned, EndSupport::pinned, EndSupport::pinned,
                                  EndSupport::pinned};
  std::array<bool, 4> column_edges{};
  ColumnsInput columns{};
  double poisson_ratio = 0.2;
  int mesh_per_bay = 0;     // 0: the kernel's default
  std::string outer_layer;  // "x", "y" or empty: the direction of the larger moment
};

struct Request {
  std::string code;
  std::optional<std::string> variant;
  SlabInput slab;
  ConcreteInput concrete;
  ReinforcementInput reinforcement;
  LoadsInput loads;
  DurabilityInput durability;
  FireInput fire;
  DesignOptions design;
  ServiceabilityInput serviceability;
  DetailingInput detailing;
  ReportUnits report_units = ReportUnits::SI;
  ProjectInfo project;
  // Two-way and flat slabs (slab.type "two_way", "flat"); slab.thickness_mm
  // holds the thickness and slab.strip_width_mm the metre width of every
  // result.
  SlabType slab_type = SlabType::one_way;
  TwoWayInput two_way{};
  bool plate() const { return slab_type != SlabType::one_way; }
};

// Every action of a request, in the order combinations refer to them: the
// self-weight (density kN/m³ times the thickness), the shorthands that are
// given (a value above 0), then loads.actions.
std::vector<Action> all_actions(const Request& request, double density_kN_m3);

// The checks the JSON reader makes of loads.actions, for a Request built
// in C++ (which does not pass through the reader): one problem per field
// (loads.actions[i].span, .at_m, ...), none for a valid list.
void add_action_problems(const Request& request, InputProblems& problems);

}  // namespace armature
