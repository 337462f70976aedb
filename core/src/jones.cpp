#include "gramline/jones.h"

#include <cmath>
#include <numbers>

#include "gramline/units.h"

namespace gramline {

namespace {
Eigen::Matrix2d rotation(double t_rad) {
  Eigen::Matrix2d r;
  r << std::cos(t_rad), std::sin(t_rad), -std::sin(t_rad), std::cos(t_rad);
  return r;
}
}  // namespace

JonesMatrix waveplate(double axis_deg, double retardance_rad) {
  const double t = deg_to_rad(axis_deg);
  const Eigen::Matrix2cd r = rotation(t).cast<std::complex<double>>();
  const Eigen::Matrix2cd r_inv = rotation(-t).cast<std::complex<double>>();
  Eigen::Matrix2cd d = Eigen::Matrix2cd::Zero();
  d(0, 0) = 1.0;
  d(1, 1) = std::polar(1.0, retardance_rad);
  return r_inv * d * r;
}

JonesMatrix hwp(double axis_deg) { return waveplate(axis_deg, std::numbers::pi); }
JonesMatrix qwp(double axis_deg) { return waveplate(axis_deg, std::numbers::pi / 2.0); }

JonesVector bloch_state(double theta_deg, double phi_deg) {
  const double half = deg_to_rad(theta_deg) / 2.0;
  JonesVector v;
  v << std::cos(half), std::polar(std::sin(half), deg_to_rad(phi_deg));
  return v;
}

BlochAngles bloch_angles(const JonesVector& state) {
  const JonesVector s = state / state.norm();
  // Remove the global phase so the H component is real and non-negative.
  const double a = std::abs(s(0));
  const double b = std::abs(s(1));
  BlochAngles out;
  out.theta_deg = rad_to_deg(2.0 * std::atan2(b, a));
  if (b > 0 && a > 0) {
    out.phi_deg = wrap_deg(rad_to_deg(std::arg(s(1)) - std::arg(s(0))), 360.0);
  } else {
    out.phi_deg = 0.0;
  }
  return out;
}

double overlap(const JonesVector& a, const JonesVector& b) {
  const double na = a.squaredNorm();
  const double nb = b.squaredNorm();
  if (na == 0 || nb == 0) return 0.0;
  return std::norm(a.dot(b)) / (na * nb);
}

Eigen::Vector3d stokes_vector(const JonesVector& s) {
  const std::complex<double> c = std::conj(s(0)) * s(1);
  return Eigen::Vector3d(std::norm(s(0)) - std::norm(s(1)), 2.0 * c.real(), 2.0 * c.imag()) /
         s.squaredNorm();
}

JonesVector prepared_state(double hwp_deg, double qwp_deg) {
  const JonesVector h(1.0, 0.0);
  return qwp(qwp_deg) * (hwp(hwp_deg) * h);
}

double analysis_pass_probability(double qwp_deg, double hwp_deg, const JonesVector& in) {
  const JonesVector out = hwp(hwp_deg) * (qwp(qwp_deg) * in);
  return std::norm(out(0));
}

}  // namespace gramline
