#include "gramline/detection.h"

#include <cmath>
#include <limits>

namespace gramline {

double pass_probability(double kappa, double visibility, int photons) {
  return visibility * kappa + (1.0 - visibility) / std::ldexp(1.0, photons);
}

double kernel_from_pass_probability(double p, double visibility, int photons) {
  return (p - (1.0 - visibility) / std::ldexp(1.0, photons)) / visibility;
}

double pair_detect_rate_per_s(const Rig& rig, int photons) {
  double r = rig.source.pair_rate_per_s;
  for (int p = 0; p < photons; ++p) r *= rig.detectors.at(p).efficiency;
  return r;
}

double accidental_rate_per_s(const std::vector<double>& singles_per_s, double window_s) {
  if (singles_per_s.size() < 2) return 0.0;
  double a = std::pow(window_s, static_cast<double>(singles_per_s.size() - 1));
  for (double s : singles_per_s) a *= s;
  return a;
}

SettingRates setting_rates(const Rig& rig, int photons, double kappa,
                           const std::vector<double>& photon_overlaps) {
  SettingRates r;
  const double v = rig.source.visibility;
  r.p_pass = pass_probability(kappa, v, photons);
  r.pair_detect_rate_per_s = pair_detect_rate_per_s(rig, photons);
  r.coincidence_rate_per_s = r.pair_detect_rate_per_s * r.p_pass;
  std::vector<double> all_ports(photons);
  r.singles_per_s.resize(photons);
  for (int p = 0; p < photons; ++p) {
    const Detector& d = rig.detectors.at(p);
    // One photon of a depolarized pair passes with probability V kappa_p + (1 - V)/2.
    const double q = pass_probability(photon_overlaps.at(p), v, 1);
    r.singles_per_s[p] = rig.source.pair_rate_per_s * d.efficiency * q + d.dark_rate_per_s;
    // Summed over both ports (each port has its own detector and dark counts).
    all_ports[p] = rig.source.pair_rate_per_s * d.efficiency + 2.0 * d.dark_rate_per_s;
  }
  const double tau = rig.coincidence_window_s;
  r.accidental_rate_per_s = accidental_rate_per_s(r.singles_per_s, tau);
  r.accidental_total_rate_per_s = accidental_rate_per_s(all_ports, tau);
  return r;
}

Calibration model_calibration(const Rig& rig, int photons, const SettingRates& rates) {
  Calibration c;
  c.pair_detect_rate_per_s = rates.pair_detect_rate_per_s;
  c.visibility = rig.source.visibility;
  c.accidental_pass_rate_per_s = rates.accidental_rate_per_s;
  c.accidental_total_rate_per_s = rates.accidental_total_rate_per_s;
  (void)photons;
  return c;
}

double estimate_kernel(DetectionScheme scheme, int photons, const Calibration& cal,
                       const SettingCounts& counts) {
  const double r = cal.pair_detect_rate_per_s;
  double p = 0.0;
  if (scheme == DetectionScheme::pass_only) {
    const double t = counts.dwell_s;
    if (!(t > 0) || !(r > 0)) return std::numeric_limits<double>::quiet_NaN();
    // E[n] = r t p + a t (Poisson), so this p is unbiased.
    p = (counts.pass_counts - cal.accidental_pass_rate_per_s * t) / (r * t);
  } else {
    if (!(counts.total_counts > 0) || !(r > 0)) return std::numeric_limits<double>::quiet_NaN();
    // Given the total, the pass count is binomial with p_obs = (r p + a_pass)/(r + a_tot).
    const double p_obs = counts.pass_counts / counts.total_counts;
    p = (p_obs * (r + cal.accidental_total_rate_per_s) - cal.accidental_pass_rate_per_s) / r;
  }
  return kernel_from_pass_probability(p, cal.visibility, photons);
}

double kernel_variance(DetectionScheme scheme, int photons, const Calibration& cal, double p_pass,
                       double pairs) {
  (void)photons;
  const double r = cal.pair_detect_rate_per_s;
  const double v = cal.visibility;
  if (!(pairs > 0) || !(r > 0)) return std::numeric_limits<double>::infinity();
  if (scheme == DetectionScheme::pass_only) {
    return (p_pass + cal.accidental_pass_rate_per_s / r) / (pairs * v * v);
  }
  const double ratio_total = cal.accidental_total_rate_per_s / r;
  const double p_obs = (p_pass + cal.accidental_pass_rate_per_s / r) / (1.0 + ratio_total);
  const double n_total = pairs * (1.0 + ratio_total);
  const double scale = (1.0 + ratio_total) / v;
  return p_obs * (1.0 - p_obs) / n_total * scale * scale;
}

}  // namespace gramline
