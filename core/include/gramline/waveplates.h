#pragma once
// Waveplate synthesis: the HWP/QWP angles that prepare or project onto a polarization state
// (docs/conventions.md). All angles in degrees.
#include <array>
#include <vector>

#include "gramline/jones.h"

namespace gramline {

/// Plate periods: an HWP at t and t + 90 k, a QWP at t and t + 180 k act alike
/// (docs/conventions.md).
inline constexpr double kHwpPeriodDeg = 90.0;
inline constexpr double kQwpPeriodDeg = 180.0;

/// Angles of the two plates of one stage, degrees, canonical: hwp in [0, 90), qwp in [0, 180).
struct PlatePair {
  double hwp_deg = 0.0;
  double qwp_deg = 0.0;
};

/// The discrete alternative solutions for one stage. Every state has exactly two (they may
/// coincide in HWP angle for linear states); the plate periods multiply them further and are
/// left to the caller. For circular states the QWP axis is free; we return the two solutions
/// with the QWP axis at 0 and 90 degrees.
using StageSolutions = std::array<PlatePair, 2>;

/// Preparation angles: HWP(h) then QWP(q) on |H> gives |psi(theta, phi)> (up to phase).
StageSolutions preparation_solutions(double theta_deg, double phi_deg);

/// Analysis angles: QWP(q) then HWP(h) before the PBS pass only |psi(theta, phi)> (up to phase).
StageSolutions analysis_solutions(double theta_deg, double phi_deg);

/// Worst fidelity over both solutions of both stages, checked by the Jones product.
double synthesis_fidelity(double theta_deg, double phi_deg);

/// Largest change, over both solutions of both stages and over every partner state, of one
/// photon's kernel factor |<partner|psi>|^2 when the stage's plates (Jones products of
/// jones.h) stand in for the exact state psi(theta, phi): |s_realised - s_target| / 2 for the
/// Stokes vectors. A kernel of P photons built from such stages differs from the ideal by at
/// most the sum of the 2 P errors of its points (each factor lies in [0, 1]). Unlike the
/// fidelity, whose shortfall 1 - F is the square of this, it resolves errors near 1e-12.
double synthesis_kernel_error(double theta_deg, double phi_deg);

}  // namespace gramline
