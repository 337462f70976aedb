#include "gramline/new_campaign.h"

#include <algorithm>
#include <stdexcept>
#include <string>

namespace gramline {

namespace {
Motor default_mount(const std::string& name, int photon, Stage stage, Plate plate) {
  Motor m;
  m.name = name;
  m.photon = photon;
  m.stage = stage;
  m.plate = plate;
  m.speed_deg_per_s = 15.0;
  m.accel_deg_per_s2 = 30.0;
  m.backlash = Backlash::shortest;
  m.initial_deg = 0.0;
  return m;
}

void check_photons(int photons) {
  if (photons < 1 || photons > 4)
    throw std::invalid_argument("photons: " + std::to_string(photons) + "; 1 to 4 are supported");
}

// The part of a motor's name after its photon's letter when the name follows the letter
// scheme ("A-prep-HWP" -> "-prep-HWP"), else empty.
std::string lettered_tail(const Motor& m) {
  if (m.name.size() < 2 || m.name[0] != photon_letter(m.photon) || m.name[1] != '-') return {};
  return m.name.substr(1);
}
}  // namespace

char photon_letter(int photon) { return static_cast<char>('A' + photon); }

std::vector<Motor> photon_motors(int photon) {
  const std::string a(1, photon_letter(photon));
  return {default_mount(a + "-prep-HWP", photon, Stage::prep, Plate::HWP),
          default_mount(a + "-prep-QWP", photon, Stage::prep, Plate::QWP),
          default_mount(a + "-ana-QWP", photon, Stage::analysis, Plate::QWP),
          default_mount(a + "-ana-HWP", photon, Stage::analysis, Plate::HWP)};
}

Rig default_rig(int photons) {
  check_photons(photons);
  Rig r;
  for (int p = 0; p < photons; ++p) {
    for (Motor& m : photon_motors(p)) r.motors.push_back(std::move(m));
    r.detectors.push_back(Detector{0.15, 200.0});
  }
  r.controller = Controller{MoveMode::simultaneous, 0.5, 0.1};
  r.source.pair_rate_per_s = 100000.0;
  r.source.visibility = 0.97;
  r.coincidence_window_s = 2e-9;
  r.scheme = DetectionScheme::both_ports;
  return r;
}

Rig resize_rig(const Rig& rig, int photons) {
  check_photons(photons);
  Rig out = rig;
  out.motors.clear();
  int last = -1;
  for (const Motor& m : rig.motors) {
    if (m.photon < photons) out.motors.push_back(m);
    if (m.photon < photons) last = std::max(last, m.photon);
  }
  const int had = last + 1;
  for (int p = had; p < photons; ++p) {
    for (Motor fresh : photon_motors(p)) {
      // Copy the mount of the same plate of the last photon kept, if any.
      for (const Motor& m : rig.motors) {
        if (m.photon != last || m.stage != fresh.stage || m.plate != fresh.plate) continue;
        const std::string tail = lettered_tail(m);
        const std::string name = fresh.name;
        fresh = m;
        fresh.photon = p;
        fresh.name = tail.empty() ? name : std::string(1, photon_letter(p)) + tail;
      }
      out.motors.push_back(std::move(fresh));
    }
  }
  out.detectors.resize(static_cast<size_t>(photons),
                       rig.detectors.empty() ? Detector{0.15, 200.0} : rig.detectors.back());
  return out;
}

void set_usual_settings(Campaign& c) {
  c.precision.budget = BudgetOptions{BudgetMethod::wilson, 0.01, 0.95, false};
  c.nights.start_min = 20 * 60;
  c.nights.end_min = 6 * 60;
  c.nights.max_nights = 3;
  c.schedule.reference_interval_min = 20.0;
  c.schedule.dark_steps = true;
  c.schedule.dark_dwell_s = 30.0;
  c.schedule.park = true;
}

Campaign make_campaign_for_data(const DataSet& data, const NewCampaignOptions& options) {
  if (const std::string problem = validate(data); !problem.empty())
    throw std::invalid_argument("data: " + problem);
  const int d = data.feature_count();
  int photons = options.photons;
  if (photons == 0) {
    if (options.rig) {
      for (const Motor& m : options.rig->motors) photons = std::max(photons, m.photon + 1);
      photons = std::max(photons, static_cast<int>(options.rig->detectors.size()));
    }
    if (photons == 0) photons = 2;
  }
  check_photons(photons);
  const EncodingPreset preset = options.preset.value_or(default_preset(d, photons));
  if (const int needed = preset_photons(preset, d); options.photons == 0 && needed != 0)
    photons = needed;  // the preset fixes P when no photon count was asked for
  check_photons(photons);

  Campaign c;
  c.name = "New campaign";
  c.notes = "";
  c.data = data;
  Eigen::VectorXd low, high;
  feature_ranges(data.train, low, high);
  c.encoding = make_encoding(preset, photons, low, high, options.theta_span, options.phi_span);
  c.rig = options.rig ? *options.rig : default_rig(photons);
  if (options.rig && c.rig.check(photons) != "") c.rig = resize_rig(c.rig, photons);
  set_usual_settings(c);
  if (const std::string problem = c.check_consistency(); !problem.empty())
    throw std::invalid_argument(problem);
  return c;
}

EncodingMap encoding_for_features(const EncodingMap& current, const DataSet& data) {
  return encoding_for_photons(current, data, current.photon_count());
}

EncodingMap encoding_for_photons(const EncodingMap& current, const DataSet& data, int photons) {
  const int d = data.feature_count();
  if (current.check(d).empty() && current.photon_count() == photons) return current;
  check_photons(photons);
  if (d == 0) {
    // No data yet: photons that read nothing, ready for the data to come.
    EncodingMap empty;
    empty.preset = current.preset;
    empty.photons.assign(static_cast<size_t>(photons),
                         PhotonEncoding{Eigen::VectorXd(), 0.0, Eigen::VectorXd(), 0.0});
    return empty;
  }
  Eigen::VectorXd low, high;
  feature_ranges(data.train, low, high);
  return make_encoding(default_preset(d, photons), photons, low, high, kNewThetaSpan, kNewPhiSpan);
}

}  // namespace gramline
