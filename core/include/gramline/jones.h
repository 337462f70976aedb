#pragma once
// Jones calculus for waveplates in the H/V basis (docs/conventions.md).
// H = (1, 0), V = (0, 1); global phases are ignored throughout.
#include <Eigen/Core>
#include <complex>

namespace gramline {

using JonesMatrix = Eigen::Matrix2cd;
using JonesVector = Eigen::Vector2cd;

/// Jones matrix of a retarder with fast axis at axis_deg (degrees from horizontal) and
/// retardance retardance_rad (radians): J = R(-t) diag(1, e^{iG}) R(t),
/// R(t) = [[cos t, sin t], [-sin t, cos t]] (docs/conventions.md; Hecht, Optics, ch. 8).
JonesMatrix waveplate(double axis_deg, double retardance_rad);
/// Half-wave plate (G = pi) with fast axis at axis_deg degrees.
JonesMatrix hwp(double axis_deg);
/// Quarter-wave plate (G = pi/2) with fast axis at axis_deg degrees.
JonesMatrix qwp(double axis_deg);

/// |psi(theta, phi)> = cos(theta/2)|H> + e^{i phi} sin(theta/2)|V>, angles in degrees.
JonesVector bloch_state(double theta_deg, double phi_deg);

/// Bloch angles (theta_deg in [0, 180], phi_deg in [0, 360)) of a normalised Jones vector.
struct BlochAngles {
  double theta_deg = 0.0;
  double phi_deg = 0.0;
};
BlochAngles bloch_angles(const JonesVector& state);

/// |<a|b>|^2 / (|a|^2 |b|^2): the overlap of two pure states, in [0, 1].
double overlap(const JonesVector& a, const JonesVector& b);

/// Stokes vector (S1, S2, S3) of a Jones vector, normalised: (|h|^2 - |v|^2, 2 Re(h* v),
/// 2 Im(h* v)) / (|h|^2 + |v|^2) (docs/conventions.md).
Eigen::Vector3d stokes_vector(const JonesVector& state);

/// State made from |H> by HWP(hwp_deg) then QWP(qwp_deg) (the preparation stage).
JonesVector prepared_state(double hwp_deg, double qwp_deg);

/// Probability that a photon in state `in` leaves the PBS pass (H) port after
/// QWP(qwp_deg) then HWP(hwp_deg) (the analysis stage): |<H| HWP QWP |in>|^2.
double analysis_pass_probability(double qwp_deg, double hwp_deg, const JonesVector& in);

}  // namespace gramline
