// Code-independent structural analysis of a slab strip.
#pragma once

namespace armature {

// A simply supported span under a uniform line load w (N/mm):
// M = w L² / 8 at mid-span, V = w L / 2 at each support (standard result).
struct SimpleSpanActions {
  double max_moment_Nmm = 0.0;
  double x_max_moment_mm = 0.0;
  double end_shear_N = 0.0;
};

inline SimpleSpanActions simply_supported_actions(double span_mm, double w_N_per_mm) {
  return {w_N_per_mm * span_mm * span_mm / 8.0, span_mm / 2.0, w_N_per_mm * span_mm / 2.0};
}

}  // namespace armature
