#pragma once
// Source and detector model, the unbiased kernel estimator and its variance.
// One formula, one place: every estimate and every sigma in Gramline comes from here.
#include <Eigen/Core>
#include <vector>

#include "gramline/rig.h"

namespace gramline {

/// Expected rates of one setting, per second.
struct SettingRates {
  double p_pass = 0.0;                       ///< probability that all P photons take the pass port
  double pair_detect_rate_per_s = 0.0;       ///< rate of P-fold detections of real pairs, all ports
  double coincidence_rate_per_s = 0.0;       ///< real P-fold coincidences in the pass channel
  double accidental_rate_per_s = 0.0;        ///< accidental coincidences in the pass channel
  double accidental_total_rate_per_s = 0.0;  ///< both_ports: accidentals over all 2^P channels
  std::vector<double> singles_per_s;         ///< singles rate of each pass-port detector
};

/// Global depolarizing model: p = V kappa + (1 - V) / 2^P (docs/conventions.md).
double pass_probability(double kappa, double visibility, int photons);
/// Inverse of pass_probability: kappa from p.
double kernel_from_pass_probability(double p, double visibility, int photons);

/// Rates for a setting with ideal kernel `kappa`. `photon_overlaps` holds the per-photon ideal
/// overlaps (their product is kappa); singles use V kappa_p + (1 - V)/2 per photon.
/// Accidentals: S_A S_B tau for two photons (common practice); for P > 2 the leading term
/// tau^(P-1) prod S_p; none for one photon.
SettingRates setting_rates(const Rig& rig, int photons, double kappa,
                           const std::vector<double>& photon_overlaps);

/// Leading-order rate of accidental P-fold coincidences among independent detectors with
/// singles rates s_p (per s) and full coincidence window tau (s): tau^(P-1) prod_p s_p
/// (S_A S_B tau for two photons, common practice); 0 for fewer than two detectors.
double accidental_rate_per_s(const std::vector<double>& singles_per_s, double window_s);

/// Rate of P-fold detections of real pairs summed over all ports: R prod eta_p. The number of
/// "pairs" of an entry is this rate times its dwell time.
double pair_detect_rate_per_s(const Rig& rig, int photons);

/// Counts observed for one setting.
struct SettingCounts {
  double dwell_s = 0.0;
  double pass_counts = 0.0;   ///< coincidences in the all-pass channel
  double total_counts = 0.0;  ///< both_ports: sum over all 2^P channels; pass_only: unused
};

/// Calibration used to turn counts into a kernel value: from references or the rig model.
struct Calibration {
  double pair_detect_rate_per_s = 0.0;  ///< R prod eta (pass_only normalisation)
  double visibility = 1.0;
  double accidental_pass_rate_per_s = 0.0;   ///< accidentals in the pass channel
  double accidental_total_rate_per_s = 0.0;  ///< accidentals summed over all channels
};

/// Calibration implied by the rig model for a setting (accidentals depend on the setting).
Calibration model_calibration(const Rig& rig, int photons, const SettingRates& rates);

/// Unbiased kernel estimate from counts (given the calibration):
///  pass_only:  kappa = ((n - a t) / (r t) - (1 - V)/2^P) / V   (E[n] = r t p + a t, Poisson)
///  both_ports: p_obs = n_pass / n_total, p = (p_obs (r + a_tot) - a_pass) / r,
///              kappa = (p - (1 - V)/2^P) / V   (unbiased given n_total, binomial)
double estimate_kernel(DetectionScheme scheme, int photons, const Calibration& cal,
                       const SettingCounts& counts);

/// Variance of estimate_kernel for a setting with pass probability p_pass and `pairs` detected
/// pairs (pairs = r t):
///  pass_only:  (p + a/r) / (pairs V^2)                       (Poisson)
///  both_ports: p_o (1 - p_o) / n_tot * ((r + a_tot)/(r V))^2,  p_o = (p r + a_pass)/(r + a_tot),
///              n_tot = pairs (1 + a_tot / r)                   (binomial)
double kernel_variance(DetectionScheme scheme, int photons, const Calibration& cal, double p_pass,
                       double pairs);

/// Pair rate and visibility estimated from the counts of one reference (diagonal, kernel 1)
/// step, given the accidentals of `model`:
///  both_ports: r = n_total / t - a_tot; p from the pass fraction as in estimate_kernel;
///              V = (p - 1/2^P) / (1 - 1/2^P)
///  pass_only:  V is the model's (one channel cannot separate it);
///              r = (n_pass / t - a_pass) / (V + (1 - V)/2^P)
/// The result is `model` with those two values replaced.
Calibration reference_calibration(DetectionScheme scheme, int photons, const Calibration& model,
                                  const SettingCounts& counts);

/// Covariance of the pair rate and visibility that reference_calibration gives from a reference
/// step of `pairs` detected pairs, to first order (delta method) around the expected counts.
struct CalibrationCovariance {
  double rate_var = 0.0;        ///< (pairs/s)^2
  double visibility_var = 0.0;  ///< 0 for pass_only
  double rate_visibility_cov = 0.0;
  CalibrationCovariance& operator+=(const CalibrationCovariance& o);
  CalibrationCovariance scaled(double factor) const;
};
CalibrationCovariance reference_covariance(DetectionScheme scheme, int photons,
                                           const Calibration& cal, double pairs);

/// Derivatives of estimate_kernel with respect to the calibration's pair rate and visibility,
/// at the expected counts of a setting with pass probability p_pass:
///  pass_only:  d/dr = -p / (r V)
///  both_ports: d/dr = (a_pass - p_o a_tot) / (r^2 V), d/dV = -kappa / V
struct CalibrationGradient {
  double d_rate = 0.0;
  double d_visibility = 0.0;
};
CalibrationGradient kernel_calibration_gradient(DetectionScheme scheme, int photons,
                                                const Calibration& cal, double p_pass);

/// Variance a calibration of covariance `cov` adds to an estimate of gradient `g`: g' cov g.
double calibration_variance(const CalibrationGradient& g, const CalibrationCovariance& cov);

}  // namespace gramline
