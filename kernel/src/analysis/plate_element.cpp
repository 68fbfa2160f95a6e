// The Bogner–Fox–Schmit plate element: bicubic Hermite interpolation of w
// on a rectangle, products of the cubic Hermite functions in x and y, with
// w, w,x, w,y and w,xy at each corner. w and its normal slope are
// continuous across element sides (a conforming Kirchhoff element).
#include <cmath>

#include "plate_internal.hpp"

namespace armature {
namespace detail {

namespace {
// Gauss–Legendre, 4 points on [0, 1]: exact for polynomials of degree 7,
// which covers the element's stiffness (degree 6 in each direction) and
// its loads (degree 3).
constexpr std::array<double, 4> gauss_s{0.0694318442029737, 0.3300094782075719, 0.6699905217924281,
                                        0.9305681557970263};
constexpr std::array<double, 4> gauss_w{0.1739274225687269, 0.3260725774312731, 0.3260725774312731,
                                        0.1739274225687269};

// Element dof k = 4·node + d; node = p + 2q with p, q the x and y ends.
// The x function of dof d at end p is hermite index 2p (value) or 2p + 1
// (slope); likewise in y.
constexpr std::size_t x_function(std::size_t node, std::size_t d) {
  return 2 * (node % 2) + ((d == dof_wx || d == dof_wxy) ? 1 : 0);
}
constexpr std::size_t y_function(std::size_t node, std::size_t d) {
  return 2 * (node / 2) + ((d == dof_wy || d == dof_wxy) ? 1 : 0);
}
}  // namespace

Hermite hermite(double s, double L) {
  Hermite h;
  const double s2 = s * s, s3 = s2 * s;
  h.N = {1 - 3 * s2 + 2 * s3, L * (s - 2 * s2 + s3), 3 * s2 - 2 * s3, L * (s3 - s2)};
  h.dN = {(6 * s2 - 6 * s) / L, 1 - 4 * s + 3 * s2, (6 * s - 6 * s2) / L, 3 * s2 - 2 * s};
  h.d2N = {(12 * s - 6) / (L * L), (6 * s - 4) / L, (6 - 12 * s) / (L * L), (6 * s - 2) / L};
  return h;
}

ElementShape element_shape(double a, double b, double s, double t) {
  const Hermite hx = hermite(s, a), hy = hermite(t, b);
  ElementShape e;
  for (std::size_t node = 0; node < 4; ++node) {
    for (std::size_t d = 0; d < dofs_per_node; ++d) {
      const std::size_t k = dofs_per_node * node + d;
      const std::size_t i = x_function(node, d), j = y_function(node, d);
      e.w[k] = hx.N[i] * hy.N[j];
      e.wxx[k] = hx.d2N[i] * hy.N[j];
      e.wyy[k] = hx.N[i] * hy.d2N[j];
      e.wxy[k] = hx.dN[i] * hy.dN[j];
    }
  }
  return e;
}

std::array<double, 16> element_patch_load(double a, double b, double xa, double xb, double ya,
                                          double yb, double p) {
  std::array<double, 16> f{};
  const double lx = xb - xa, ly = yb - ya;
  for (std::size_t i = 0; i < 4; ++i) {
    for (std::size_t j = 0; j < 4; ++j) {
      const double x = xa + gauss_s[i] * lx, y = ya + gauss_s[j] * ly;
      const double weight = gauss_w[i] * gauss_w[j] * lx * ly * p;
      const ElementShape e = element_shape(a, b, x / a, y / b);
      for (std::size_t k = 0; k < 16; ++k) f[k] += weight * e.w[k];
    }
  }
  return f;
}

std::array<double, 16> element_line_load(double a, double b, PlanAxis runs_along, double at,
                                         double from, double to, double q) {
  std::array<double, 16> f{};
  const double length = to - from;
  for (std::size_t i = 0; i < 4; ++i) {
    const double along = from + gauss_s[i] * length;
    const double x = runs_along == PlanAxis::x ? along : at;
    const double y = runs_along == PlanAxis::x ? at : along;
    const ElementShape e = element_shape(a, b, x / a, y / b);
    const double weight = gauss_w[i] * length * q;
    for (std::size_t k = 0; k < 16; ++k) f[k] += weight * e.w[k];
  }
  return f;
}

std::array<double, 16> element_point_load(double a, double b, double x, double y, double P) {
  std::array<double, 16> f{};
  const ElementShape e = element_shape(a, b, x / a, y / b);
  for (std::size_t k = 0; k < 16; ++k) f[k] = P * e.w[k];
  return f;
}

}  // namespace detail

double plate_flexural_rigidity(double E_MPa, double h_mm, double nu) {
  return E_MPa * h_mm * h_mm * h_mm / (12.0 * (1.0 - nu * nu));
}

// k = ∫ Bᵀ C B dA with B = (w,xx; w,yy; 2 w,xy) and
// C = D [1 ν 0; ν 1 0; 0 0 (1 − ν)/2] (Kirchhoff plate, isotropic).
std::array<double, 256> plate_element_stiffness(double a_mm, double b_mm, double D_Nmm, double nu) {
  using namespace detail;
  std::array<double, 256> k{};
  for (std::size_t i = 0; i < 4; ++i) {
    for (std::size_t j = 0; j < 4; ++j) {
      const ElementShape e = element_shape(a_mm, b_mm, gauss_s[i], gauss_s[j]);
      const double weight = gauss_w[i] * gauss_w[j] * a_mm * b_mm * D_Nmm;
      for (std::size_t r = 0; r < 16; ++r) {
        for (std::size_t c = 0; c < 16; ++c) {
          k[16 * r + c] += weight * (e.wxx[r] * e.wxx[c] + e.wyy[r] * e.wyy[c] +
                                     nu * (e.wxx[r] * e.wyy[c] + e.wyy[r] * e.wxx[c]) +
                                     2.0 * (1.0 - nu) * e.wxy[r] * e.wxy[c]);
        }
      }
    }
  }
  return k;
}

}  // namespace armature

namespace armature::detail {

// Orthotropic Kirchhoff plate with ν = 0: energy density ½ (Dx w,xx² +
// Dy w,yy² + Dt (2 w,xy)²), so k = Dx kxx + Dy kyy + Dt ktt; a free
// curvature κ0 (sagging positive, w,xx = −κ0 unloaded) loads the element
// with −(Dx κ0x ∫ w,xx + Dy κ0y ∫ w,yy).
OrthotropicParts orthotropic_parts(double a, double b) {
  OrthotropicParts p{};
  for (std::size_t i = 0; i < 4; ++i) {
    for (std::size_t j = 0; j < 4; ++j) {
      const ElementShape e = element_shape(a, b, gauss_s[i], gauss_s[j]);
      const double weight = gauss_w[i] * gauss_w[j] * a * b;
      for (std::size_t r = 0; r < 16; ++r) {
        p.ixx[r] += weight * e.wxx[r];
        p.iyy[r] += weight * e.wyy[r];
        for (std::size_t c = 0; c < 16; ++c) {
          p.kxx[16 * r + c] += weight * e.wxx[r] * e.wxx[c];
          p.kyy[16 * r + c] += weight * e.wyy[r] * e.wyy[c];
          p.ktt[16 * r + c] += weight * 4.0 * e.wxy[r] * e.wxy[c];
        }
      }
    }
  }
  return p;
}

}  // namespace armature::detail
