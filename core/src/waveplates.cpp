#include "gramline/waveplates.h"

#include <algorithm>
#include <cmath>

#include "gramline/units.h"

namespace gramline {

namespace {
// Stokes vector (S1, S2, S3) of |psi(theta, phi)>: (cos theta, sin theta cos phi,
// sin theta sin phi) (docs/conventions.md).
Eigen::Vector3d target_stokes(double theta_deg, double phi_deg) {
  const double theta = deg_to_rad(theta_deg);
  const double phi = deg_to_rad(phi_deg);
  return {std::cos(theta), std::sin(theta) * std::cos(phi), std::sin(theta) * std::sin(phi)};
}
}  // namespace

StageSolutions preparation_solutions(double theta_deg, double phi_deg) {
  // Ellipse azimuth psi_e = atan2(S2, S1)/2 and ellipticity chi with sin 2 chi = S3 (Born &
  // Wolf, Principles of Optics, sec. 1.4), taken as 2 chi = atan2(S3, hypot(S1, S2)): asin(S3)
  // loses half the digits near the circular poles, where S3 is within rounding of 1.
  const Eigen::Vector3d s = target_stokes(theta_deg, phi_deg);
  const double equator = std::hypot(s(0), s(1));
  // On the circular poles the azimuth is undefined: any QWP axis works; pick 0. (Below 1e-15
  // the choice moves the realised state by less than 2e-15 on the Poincare sphere.)
  const double azimuth_deg = equator < 1e-15 ? 0.0 : rad_to_deg(std::atan2(s(1), s(0))) / 2.0;
  const double chi_deg = rad_to_deg(std::atan2(s(2), equator)) / 2.0;
  // HWP(h)|H> is linear at 2h. A QWP with its fast axis at q turns linear light at q + u into
  // an ellipse of ellipticity u and azimuth q when |u| <= 45 (azimuth q + 90 when |u| > 45).
  // Two choices follow: fast axis on the major axis (input linear at psi + chi) or on the
  // minor axis (input linear at psi + 180 - chi, i.e. psi - chi mod 180).
  StageSolutions out;
  out[0].qwp_deg = wrap_deg(azimuth_deg, kQwpPeriodDeg);
  out[0].hwp_deg = wrap_deg((azimuth_deg + chi_deg) / 2.0, kHwpPeriodDeg);
  out[1].qwp_deg = wrap_deg(azimuth_deg + 90.0, kQwpPeriodDeg);
  out[1].hwp_deg = wrap_deg((azimuth_deg - chi_deg) / 2.0, kHwpPeriodDeg);
  return out;
}

StageSolutions analysis_solutions(double theta_deg, double phi_deg) {
  // The pass port projects onto QWP(q)^dagger HWP(h) |H> (an HWP is Hermitian), and
  // QWP(q)^dagger equals QWP(q + 90) up to a global phase. So the analysis of a state uses the
  // preparation HWP angle and the preparation QWP angle shifted by 90.
  StageSolutions out = preparation_solutions(theta_deg, phi_deg);
  for (PlatePair& s : out) s.qwp_deg = wrap_deg(s.qwp_deg - 90.0, kQwpPeriodDeg);
  return out;
}

double synthesis_fidelity(double theta_deg, double phi_deg) {
  const JonesVector target = bloch_state(theta_deg, phi_deg);
  double worst = 1.0;
  for (const PlatePair& s : preparation_solutions(theta_deg, phi_deg)) {
    worst = std::min(worst, overlap(prepared_state(s.hwp_deg, s.qwp_deg), target));
  }
  for (const PlatePair& s : analysis_solutions(theta_deg, phi_deg)) {
    worst = std::min(worst, analysis_pass_probability(s.qwp_deg, s.hwp_deg, target));
  }
  return worst;
}

double synthesis_kernel_error(double theta_deg, double phi_deg) {
  // A stage that realises the state with Stokes vector s' instead of s changes the pass
  // probability (1 + s . u)/2 of any partner state u by (s' - s) . u / 2, at most |s' - s|/2.
  const Eigen::Vector3d target = target_stokes(theta_deg, phi_deg);
  const JonesVector h(1.0, 0.0);
  double worst = 0.0;
  for (const PlatePair& p : preparation_solutions(theta_deg, phi_deg))
    worst = std::max(worst,
                     (stokes_vector(prepared_state(p.hwp_deg, p.qwp_deg)) - target).norm() / 2.0);
  for (const PlatePair& p : analysis_solutions(theta_deg, phi_deg)) {
    // The pass port passes (HWP QWP)^dagger |H>.
    const JonesVector passed = (hwp(p.hwp_deg) * qwp(p.qwp_deg)).adjoint() * h;
    worst = std::max(worst, (stokes_vector(passed) - target).norm() / 2.0);
  }
  return worst;
}

}  // namespace gramline
