#include "gramline/entries.h"

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

namespace {
constexpr EnumNames<Block, 3> kBlockNames{
    {{Block::train, "train"}, {Block::test, "test"}, {Block::none, "none"}}};
}  // namespace

std::string to_string(Block b) { return enum_text(kBlockNames, b); }
bool from_string(const std::string& t, Block& out) { return enum_from_text(kBlockNames, t, out); }

}  // namespace gramline
