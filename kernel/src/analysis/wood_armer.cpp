// Design moments for orthogonal reinforcement from a plate's moment field
// (Wood 1968 and Armer's discussion of it; from memory). Sagging positive:
// bottom bars resist positive normal moments, top bars negative ones. The
// bars of each face resist m*x cos²θ + m*y sin²θ about any direction θ,
// which must be at least the normal moment mx cos²θ + my sin²θ + mxy sin 2θ
// there (the yield criterion the rule comes from).
#include <cmath>

#include "armature/plate.hpp"

namespace armature {

namespace {

struct FacePair {
  double x = 0.0, y = 0.0;
};

// Bottom face, sagging positive: m*x = mx + |mxy|, m*y = my + |mxy|; where
// one comes out negative it is set to zero and the other becomes
// m + mxy²/|m_other| (zero too when that is negative: nothing sags).
FacePair bottom_design_moments(double mx, double my, double mxy) {
  const double t = std::abs(mxy);
  FacePair d{mx + t, my + t};
  if (d.x < 0.0 && d.y < 0.0) return {0.0, 0.0};
  if (d.x < 0.0) {
    const double y = my + mxy * mxy / std::abs(mx);
    return {0.0, y > 0.0 ? y : 0.0};
  }
  if (d.y < 0.0) {
    const double x = mx + mxy * mxy / std::abs(my);
    return {x > 0.0 ? x : 0.0, 0.0};
  }
  return d;
}

}  // namespace

// The top face is the bottom face's rule for the moments reversed in sign.
WoodArmerMoments wood_armer(const PlateMoments& m) {
  const FacePair bottom = bottom_design_moments(m.mx, m.my, m.mxy);
  const FacePair top = bottom_design_moments(-m.mx, -m.my, m.mxy);
  return {bottom.x, bottom.y, top.x, top.y};
}

}  // namespace armature
