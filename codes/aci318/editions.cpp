// The provisions of ACI 318-19 whose SI and in-lb editions differ by more
// than a unit conversion (their constants are rounded apart): the SI
// variant computes them from rules.hpp, the US variant from the in-lb
// forms of us_customary.hpp, converting at this boundary only. Inputs and
// results are in kernel units (mm, MPa, N) for both.
#include <algorithm>
#include <cmath>

#include "checker.hpp"
#include "us_customary.hpp"

namespace armature::aci318 {

namespace {
constexpr double lambda_normal_weight = 1.0;  // 19.2.4
constexpr double lb_per_N = 1.0 / N_per_lbf;
}  // namespace

double Checker::yield_strain_of_steel() const {
  return us_ ? inch_pound::yield_strain(fy_ / MPa_per_psi) : yield_strain(fy_);
}

double Checker::steel_at_slab_strain_limit(double b, double d) const {
  if (!us_) return steel_at_strain_limit(fc_, fy_, b, d);
  // c at εt,min: 0.003 d/(0.003 + εt,min); a = β1 c; As = 0.85 f'c b a/fy (units cancel).
  const double c = 0.003 * d / (0.003 + slab_min_strain());
  return 0.85 * fc_ * b * beta1_ * c / fy_;
}

double Checker::max_bar_spacing(double h) const {
  return us_ ? inch_pound::max_flexural_bar_spacing(h / mm_per_in) * mm_per_in : max_flexural_bar_spacing(h);
}

double Checker::two_way_max_bar_spacing(double h) const {
  return us_ ? inch_pound::two_way_max_flexural_bar_spacing(h / mm_per_in) * mm_per_in
             : two_way_max_flexural_bar_spacing(h);
}

double Checker::min_clear_spacing(double db, double aggregate) const {
  return us_ ? inch_pound::minimum_clear_bar_spacing(db / mm_per_in, aggregate / mm_per_in) * mm_per_in
             : minimum_clear_bar_spacing(db, aggregate);
}

double Checker::crack_spacing(double fs, double clear_cover) const {
  return us_ ? inch_pound::crack_control_spacing(fs / MPa_per_psi, clear_cover / mm_per_in) * mm_per_in
             : crack_control_spacing(fs, clear_cover);
}

double Checker::max_distribution_spacing(double h) const {
  return us_ ? inch_pound::max_shrinkage_bar_spacing(h / mm_per_in) * mm_per_in : max_shrinkage_bar_spacing(h);
}

double Checker::shear_size_factor(double d) const {
  return us_ ? inch_pound::size_effect_factor(d / mm_per_in) : size_effect_factor(d);
}

double Checker::shear_strength(double lambda_s, double rho_w, double b, double d) const {
  if (!us_) return one_way_shear_strength(lambda_s, lambda_normal_weight, rho_w, fc_, b, d);
  const double Vc_lb = inch_pound::one_way_shear_strength(lambda_s, lambda_normal_weight, rho_w, fc_ / MPa_per_psi,
                                                          b / mm_per_in, d / mm_per_in);
  return Vc_lb / lb_per_N;
}

double Checker::root_fc_limited() const {
  return us_ ? std::min(std::sqrt(fc_ / MPa_per_psi), 100.0) : std::min(std::sqrt(fc_), 8.3);
}

double Checker::min_thickness(double span, SupportCondition condition) const {
  return us_ ? inch_pound::minimum_slab_thickness(span / mm_per_in, condition, fy_ / MPa_per_psi) * mm_per_in
             : minimum_slab_thickness(span, condition, fy_);
}

double Checker::two_way_min_thickness(double long_span, double short_span) const {
  return us_ ? inch_pound::two_way_min_thickness(long_span / mm_per_in, short_span / mm_per_in, fy_ / MPa_per_psi) *
                   mm_per_in
             : aci318::two_way_min_thickness(long_span, short_span, fy_);
}

double Checker::cover_for(const std::string& exposure, double bar_diameter) const {
  return us_ ? inch_pound::specified_cover(exposure, bar_diameter / mm_per_in) * mm_per_in
             : specified_cover(exposure, bar_diameter);
}

// 19.2.2.1, 19.2.3.1, 20.2.2.2 (normalweight concrete, λ = 1).
double Checker::concrete_modulus() const {
  return us_ ? inch_pound::modulus_of_elasticity(fc_ / MPa_per_psi) * MPa_per_psi : modulus_of_elasticity(fc_);
}

double Checker::rupture_modulus() const {
  return us_ ? inch_pound::modulus_of_rupture(fc_ / MPa_per_psi, lambda_normal_weight) * MPa_per_psi
             : modulus_of_rupture(fc_, lambda_normal_weight);
}

double Checker::reinforcement_modulus() const {
  return us_ ? inch_pound::steel_modulus_psi * MPa_per_psi : steel_modulus_MPa;
}

}  // namespace armature::aci318
