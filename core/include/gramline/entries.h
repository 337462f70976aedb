#pragma once
// Per-entry count statistics. An entry of the Gram matrix is measured by one setting that
// prepares one point and analyses another; from the points' per-photon states follow the
// per-photon overlaps (which set the singles and so the accidentals), the ideal kernel, the rig
// model's rates and calibration, the budget model and the predicted sigma at a number of pairs.
// Planning, the margin check and ingest take every entry's statistics from here.
#include <string>
#include <vector>

#include "gramline/budget.h"
#include "gramline/campaign.h"
#include "gramline/detection.h"
#include "gramline/jones.h"

namespace gramline {

/// Block of the Gram matrix an entry (or a step measuring it) belongs to.
enum class Block { train, test, none };

/// Count statistics of one kernel entry, independent of its pairs.
struct EntryNoise {
  double p_pass = 0.0;      ///< predicted pass probability of the setting
  Calibration calibration;  ///< pair rate r (per s), visibility, accidentals (per s)
};

/// The entry as the shot budget sees it (budget.h): pass probability, visibility and the
/// accidentals per detected pair.
EntryModel entry_model(DetectionScheme scheme, int photons, const EntryNoise& noise);

/// Predicted standard deviation of the entry's kernel estimate from `pairs` detected pairs: the
/// square root of kernel_variance (detection.h) at the entry's pass probability and
/// calibration, the calibration taken as known. Infinite for pairs <= 0.
double entry_sigma(DetectionScheme scheme, int photons, const EntryNoise& noise, double pairs);

/// Where a step's calibration comes from: the reference steps around the middle of its counting
/// interval, interpolated linearly in time (the nearest one alone outside their span). Indices
/// are into the list of reference times; -1 and weight 0 where unused.
struct CalibrationWeights {
  int low = -1;
  int high = -1;
  double w_low = 0.0;
  double w_high = 0.0;
};
/// The weights at time t among references at `reference_times_s` (ascending). No reference:
/// both indices -1 (the rig model calibrates).
CalibrationWeights calibration_weights(const std::vector<double>& reference_times_s, double t);
/// The covariance of the interpolated calibration: w_low^2 C_low + w_high^2 C_high (the
/// references are independent counts).
CalibrationCovariance interpolated_covariance(const CalibrationWeights& w,
                                              const std::vector<CalibrationCovariance>& refs);

/// `base` with its pair rate and visibility interpolated from the references' calibrations by
/// the weights; `base` unchanged when the weights name no reference.
Calibration interpolated_calibration(Calibration base, const CalibrationWeights& w,
                                     const std::vector<Calibration>& refs);

/// The rig-model statistics of every entry of one campaign. The per-point, per-photon states
/// are computed once, at construction; an entry then costs one overlap per photon. Points are
/// named by global index: training points first, then test points.
class EntryStatistics {
 public:
  explicit EntryStatistics(const Campaign& campaign);

  DetectionScheme scheme() const { return rig_.scheme; }
  int photons() const { return photons_; }

  /// |<psi_p(b)|psi_p(a)>|^2 for each photon p of the setting preparing a and analysing b. A
  /// negative index (no point, as in a hand-written reference step) counts as the diagonal:
  /// every overlap 1.
  std::vector<double> overlaps(int a, int b) const;
  /// The rig model's rates of that setting (setting_rates, detection.h).
  SettingRates rates(int a, int b) const;
  /// Its count statistics under the rig model (model_calibration, detection.h).
  EntryNoise noise(int a, int b) const;
  /// entry_model and entry_sigma with this campaign's scheme and photons.
  EntryModel model(const EntryNoise& noise) const;
  double sigma(const EntryNoise& noise, double pairs) const;
  /// How the entry's estimate moves with the calibration (kernel_calibration_gradient).
  CalibrationGradient calibration_gradient(const EntryNoise& noise) const;
  /// The calibration's covariance from a reference step (a diagonal setting) of `pairs` pairs
  /// under the rig model (reference_covariance, detection.h).
  CalibrationCovariance reference_covariance(double pairs) const;
  /// Variance the calibration `cov` adds to the entry's estimate (calibration_variance).
  double calibration_variance(const EntryNoise& noise, const CalibrationCovariance& cov) const;

 private:
  Rig rig_;
  int photons_ = 0;
  std::vector<JonesVector> states_;  // photon p of point i at i P + p
};

std::string to_string(Block);
bool from_string(const std::string&, Block&);

}  // namespace gramline
