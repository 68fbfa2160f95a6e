// EN 1992-1-1 materials of one request, resolved when the checker begins:
// the bar catalogue, fck, fyk, fcd, fyd, fctm, η, λ, εcu2 and each face's
// exposure with its covers.
#include <numbers>
#include <string>

#include "checker.hpp"

namespace armature::en1992 {

namespace {

const std::vector<double> bar_catalogue_mm{6, 8, 10, 12, 16, 20, 25, 32, 40};
const std::vector<std::string> default_bars{"8", "10", "12", "16", "20", "25"};

}  // namespace

std::optional<double> bar_diameter(const std::string& designation) {
  static const char* const names[] = {"6", "8", "10", "12", "16", "20", "25", "32", "40"};
  for (std::size_t i = 0; i < bar_catalogue_mm.size(); ++i)
    if (designation == names[i]) return bar_catalogue_mm[i];
  return std::nullopt;
}

// EN bars are specified by diameter: area π φ²/4.
double bar_area(double phi) { return std::numbers::pi * phi * phi / 4.0; }

// For designations already validated.
std::vector<BarOption> bar_options_of(const std::vector<std::string>& names) {
  std::vector<BarOption> out;
  for (const auto& name : names) {
    const double phi = *bar_diameter(name);
    out.push_back({name, phi, bar_area(phi)});
  }
  return out;
}

const std::vector<BarOption>& default_bar_options() {
  static const std::vector<BarOption> bars = bar_options_of(default_bars);
  return bars;
}

Checker::Checker(const Ndp& ndp, const En1990Factors& en1990, const Request& req)
    : ndp_(ndp), en1990_(en1990), req_(req) {
  const double fck = req.concrete.cylinder_strength_MPa
                         ? *req.concrete.cylinder_strength_MPa
                         : *fck_of_class(ndp, *req.concrete.strength_class);
  const double fyk = req.reinforcement.yield_strength_MPa.value_or(default_fyk);
  m_ = {fck,
        fyk,
        design_compressive_strength(fck, ndp.alpha_cc, ndp.gamma_c),
        design_yield_strength(fyk, ndp.gamma_s),
        mean_tensile_strength(fck),
        stress_block_strength_factor(fck),
        stress_block_depth_factor(fck),
        ultimate_compressive_strain(fck)};
  psi_ = *psi_of_category(ndp, req.loads.imposed_category);
  if (req.reinforcement.bars) {
    own_bars_ = bar_options_of(*req.reinforcement.bars);
    bars_ = &own_bars_;
  }
  // Each face by its own exposure: Table 4.3N, Table 4.4N and Table 7.1N.
  for (Face face : {Face::bottom, Face::top}) {
    FaceData& f = faces_[static_cast<std::size_t>(face)];
    f.exposure = req.durability.face(face).exposure.value_or("XC1");
    f.cover_mm = req.durability.face(face).cover_mm;
    f.w_max = (f.exposure == "X0" || f.exposure == "XC1") ? ndp.w_max_X0_XC1_mm : ndp.w_max_other_mm;
    f.structural_class = structural_class(req.durability.design_life_years, f.exposure, m_.fck);
    f.c_min_dur = minimum_cover_durability(f.structural_class, f.exposure);
    f.covers.reserve(bars_->size());
    for (const auto& bar : *bars_) f.covers.push_back({bar.diameter_mm, cover_of(bar.diameter_mm, f)});
  }
  if (req.serviceability.calculated_deflection())
    long_term_ = creep_shrinkage_of(req.serviceability, m_.fck, req.slab.thickness_mm);
}

Checker::CoverOf Checker::cover_of(double phi, const FaceData& f) const {
  CoverOf c;
  c.c_bond = minimum_cover_bond(phi, req_.concrete.aggregate_mm);
  c.c_min = minimum_cover(c.c_bond, f.c_min_dur);
  c.c_req = c.c_min + ndp_.delta_c_dev_mm;
  c.c_nom = f.cover_mm ? *f.cover_mm : round_up_to_5(c.c_req);
  return c;
}

}  // namespace armature::en1992

