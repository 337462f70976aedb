#include "gramline/waveplates.h"

#include <algorithm>
#include <cmath>

#include "gramline/units.h"

namespace gramline {

StageSolutions preparation_solutions(double theta_deg, double phi_deg) {
  // Stokes vector of |psi(theta, phi)>: S1 = cos theta, S2 = sin theta cos phi,
  // S3 = sin theta sin phi. Ellipse azimuth psi_e = atan2(S2, S1)/2, ellipticity
  // chi = asin(S3)/2 (Born & Wolf, Principles of Optics, sec. 1.4).
  const double theta = deg_to_rad(theta_deg);
  const double phi = deg_to_rad(phi_deg);
  const double s1 = std::cos(theta);
  const double s2 = std::sin(theta) * std::cos(phi);
  const double s3 = std::clamp(std::sin(theta) * std::sin(phi), -1.0, 1.0);
  // On the circular poles the azimuth is undefined: any QWP axis works; pick 0.
  const double azimuth_deg =
      (s1 * s1 + s2 * s2 < 1e-24) ? 0.0 : rad_to_deg(std::atan2(s2, s1)) / 2.0;
  const double chi_deg = rad_to_deg(std::asin(s3)) / 2.0;
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

}  // namespace gramline
