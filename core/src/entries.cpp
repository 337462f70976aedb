#include "gramline/entries.h"

#include <algorithm>
#include <cmath>

#include "gramline/enum_names.h"
#include "gramline/kernel.h"

namespace gramline {

EntryModel entry_model(DetectionScheme scheme, int photons, const EntryNoise& noise) {
  const Calibration& cal = noise.calibration;
  EntryModel e;
  e.scheme = scheme;
  e.photons = photons;
  e.p_pass = noise.p_pass;
  e.visibility = cal.visibility;
  e.accidental_ratio = cal.accidental_pass_rate_per_s / cal.pair_detect_rate_per_s;
  e.accidental_total_ratio = cal.accidental_total_rate_per_s / cal.pair_detect_rate_per_s;
  return e;
}

double entry_sigma(DetectionScheme scheme, int photons, const EntryNoise& noise, double pairs) {
  return std::sqrt(kernel_variance(scheme, photons, noise.calibration, noise.p_pass, pairs));
}

EntryStatistics::EntryStatistics(const Campaign& campaign)
    : rig_(campaign.rig), photons_(campaign.encoding.photon_count()) {
  const DataSet& data = campaign.data;
  states_ = photon_states(campaign.encoding, data.train);
  const std::vector<JonesVector> test = photon_states(campaign.encoding, data.test);
  states_.insert(states_.end(), test.begin(), test.end());
}

std::vector<double> EntryStatistics::overlaps(int a, int b) const {
  std::vector<double> out(photons_, 1.0);
  if (a < 0 || b < 0) return out;
  const std::size_t pa = static_cast<std::size_t>(a) * photons_;
  const std::size_t pb = static_cast<std::size_t>(b) * photons_;
  for (int p = 0; p < photons_; ++p) out[p] = overlap(states_.at(pa + p), states_.at(pb + p));
  return out;
}

SettingRates EntryStatistics::rates(int a, int b) const {
  const std::vector<double> per_photon = overlaps(a, b);
  double kappa = 1.0;
  for (double o : per_photon) kappa *= o;
  return setting_rates(rig_, photons_, kappa, per_photon);
}

EntryNoise EntryStatistics::noise(int a, int b) const {
  const SettingRates r = rates(a, b);
  return EntryNoise{r.p_pass, model_calibration(rig_, photons_, r)};
}

EntryModel EntryStatistics::model(const EntryNoise& noise) const {
  return entry_model(rig_.scheme, photons_, noise);
}

double EntryStatistics::sigma(const EntryNoise& noise, double pairs) const {
  return entry_sigma(rig_.scheme, photons_, noise, pairs);
}

CalibrationGradient EntryStatistics::calibration_gradient(const EntryNoise& noise) const {
  return kernel_calibration_gradient(rig_.scheme, photons_, noise.calibration, noise.p_pass);
}

CalibrationCovariance EntryStatistics::reference_covariance(double pairs) const {
  return gramline::reference_covariance(rig_.scheme, photons_, noise(-1, -1).calibration, pairs);
}

double EntryStatistics::calibration_variance(const EntryNoise& noise,
                                             const CalibrationCovariance& cov) const {
  return gramline::calibration_variance(calibration_gradient(noise), cov);
}

CalibrationWeights calibration_weights(const std::vector<double>& times, double t) {
  CalibrationWeights w;
  if (times.empty()) return w;
  const int last = static_cast<int>(times.size()) - 1;
  if (t <= times.front()) return {0, -1, 1.0, 0.0};
  if (t >= times.back()) return {last, -1, 1.0, 0.0};
  const int hi = static_cast<int>(std::upper_bound(times.begin(), times.end(), t) - times.begin());
  const int lo = hi - 1;
  const double span = times[hi] - times[lo];
  const double x = span > 0 ? (t - times[lo]) / span : 0.0;
  return {lo, hi, 1.0 - x, x};
}

CalibrationCovariance interpolated_covariance(const CalibrationWeights& w,
                                              const std::vector<CalibrationCovariance>& refs) {
  CalibrationCovariance c;
  if (w.low >= 0) c += refs.at(w.low).scaled(w.w_low * w.w_low);
  if (w.high >= 0) c += refs.at(w.high).scaled(w.w_high * w.w_high);
  return c;
}

Calibration interpolated_calibration(Calibration base, const CalibrationWeights& w,
                                     const std::vector<Calibration>& refs) {
  if (w.low < 0) return base;
  base.pair_detect_rate_per_s = w.w_low * refs.at(w.low).pair_detect_rate_per_s;
  base.visibility = w.w_low * refs.at(w.low).visibility;
  if (w.high >= 0) {
    base.pair_detect_rate_per_s += w.w_high * refs.at(w.high).pair_detect_rate_per_s;
    base.visibility += w.w_high * refs.at(w.high).visibility;
  }
  return base;
}

namespace {
constexpr EnumNames<Block, 3> kBlockNames{
    {{Block::train, "train"}, {Block::test, "test"}, {Block::none, "none"}}};
}  // namespace

std::string to_string(Block b) { return enum_text(kBlockNames, b); }
bool from_string(const std::string& t, Block& out) { return enum_from_text(kBlockNames, t, out); }

}  // namespace gramline
