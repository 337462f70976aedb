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

Calibration reference_calibration(DetectionScheme scheme, int photons, const Calibration& model,
                                  const SettingCounts& counts) {
  Calibration cal = model;
  const double t = counts.dwell_s;
  const double floor = 1.0 / std::ldexp(1.0, photons);  // pass probability of a mixed state
  if (scheme == DetectionScheme::both_ports) {
    const double rate = counts.total_counts / t - model.accidental_total_rate_per_s;
    const double p_obs = counts.total_counts > 0 ? counts.pass_counts / counts.total_counts
                                                 : std::numeric_limits<double>::quiet_NaN();
    const double p =
        (p_obs * (rate + model.accidental_total_rate_per_s) - model.accidental_pass_rate_per_s) /
        rate;
    cal.pair_detect_rate_per_s = rate;
    // A reference has kernel 1, so p = V + (1 - V) / 2^P.
    cal.visibility = (p - floor) / (1.0 - floor);
  } else {
    const double p_ref = pass_probability(1.0, model.visibility, photons);
    cal.pair_detect_rate_per_s =
        (counts.pass_counts / t - model.accidental_pass_rate_per_s) / p_ref;
  }
  return cal;
}

CalibrationCovariance& CalibrationCovariance::operator+=(const CalibrationCovariance& o) {
  rate_var += o.rate_var;
  visibility_var += o.visibility_var;
  rate_visibility_cov += o.rate_visibility_cov;
  return *this;
}

CalibrationCovariance CalibrationCovariance::scaled(double factor) const {
  return {rate_var * factor, visibility_var * factor, rate_visibility_cov * factor};
}

CalibrationCovariance reference_covariance(DetectionScheme scheme, int photons,
                                           const Calibration& cal, double pairs) {
  CalibrationCovariance out;
  const double r = cal.pair_detect_rate_per_s;
  const double v = cal.visibility;
  if (!(pairs > 0) || !(r > 0)) {
    const double inf = std::numeric_limits<double>::infinity();
    return {inf, scheme == DetectionScheme::both_ports ? inf : 0.0, 0.0};
  }
  const double p_ref = pass_probability(1.0, v, photons);
  // kernel_variance is the variance of (p_hat - floor) / V; the reference's own p_hat follows.
  const double p_var = kernel_variance(scheme, photons, cal, p_ref, pairs) * v * v;
  if (scheme == DetectionScheme::pass_only) {
    // r_hat = (n/t - a) / p_ref with n Poisson: Var = (r p_ref + a) / (t p_ref^2), which is
    // r^2 Var(p_hat) / p_ref^2 at pairs = r t.
    out.rate_var = r * r * p_var / (p_ref * p_ref);
    return out;
  }
  const double floor = 1.0 / std::ldexp(1.0, photons);
  const double ratio_total = cal.accidental_total_rate_per_s / r;
  // r_hat = n_tot / t - a_tot, n_tot Poisson of mean (r + a_tot) t: Var = r^2 (1 + a_tot/r) /
  // pairs. The pass fraction is independent of the total (Poisson splitting).
  out.rate_var = r * r * (1.0 + ratio_total) / pairs;
  const double p_obs = (p_ref + cal.accidental_pass_rate_per_s / r) / (1.0 + ratio_total);
  // dp_hat/dr at fixed pass fraction, and V_hat = (p_hat - floor) / (1 - floor).
  const double dp_dr =
      (cal.accidental_pass_rate_per_s - p_obs * cal.accidental_total_rate_per_s) / (r * r);
  const double dv_dr = dp_dr / (1.0 - floor);
  out.visibility_var = p_var / ((1.0 - floor) * (1.0 - floor)) + dv_dr * dv_dr * out.rate_var;
  out.rate_visibility_cov = dv_dr * out.rate_var;
  return out;
}

CalibrationGradient kernel_calibration_gradient(DetectionScheme scheme, int photons,
                                                const Calibration& cal, double p_pass) {
  CalibrationGradient g;
  const double r = cal.pair_detect_rate_per_s;
  const double v = cal.visibility;
  if (!(r > 0)) return g;
  if (scheme == DetectionScheme::pass_only) {
    // kappa = (p_hat - floor) / V with p_hat = (n - a t) / (r t) = p at the expected counts.
    g.d_rate = -p_pass / (r * v);
    return g;
  }
  const double p_obs =
      (p_pass * r + cal.accidental_pass_rate_per_s) / (r + cal.accidental_total_rate_per_s);
  g.d_rate =
      (cal.accidental_pass_rate_per_s - p_obs * cal.accidental_total_rate_per_s) / (r * r * v);
  g.d_visibility = -kernel_from_pass_probability(p_pass, v, photons) / v;
  return g;
}

double calibration_variance(const CalibrationGradient& g, const CalibrationCovariance& cov) {
  // A zero derivative takes nothing from its term, even an infinite one.
  double v = 0.0;
  if (g.d_rate != 0.0) v += g.d_rate * g.d_rate * cov.rate_var;
  if (g.d_visibility != 0.0) v += g.d_visibility * g.d_visibility * cov.visibility_var;
  if (g.d_rate != 0.0 && g.d_visibility != 0.0)
    v += 2.0 * g.d_rate * g.d_visibility * cov.rate_visibility_cov;
  return v;
}

}  // namespace gramline
