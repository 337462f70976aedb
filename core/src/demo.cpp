#include "gramline/demo.h"

#include <cmath>
#include <random>

namespace gramline {

namespace {
// Uniform double in [0, 1) from 53 random bits: identical on every standard library, unlike
// std::uniform_real_distribution.
double unit(std::mt19937_64& rng) { return static_cast<double>(rng() >> 11) * 0x1.0p-53; }

// The invented scenario: two kinds of samples on either side of a parabola in the unit square.
double boundary(double x0) { return 0.22 + 1.3 * (x0 - 0.5) * (x0 - 0.5); }

Motor mount(const std::string& name, int photon, Stage stage, Plate plate) {
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
}  // namespace

Campaign make_demo_campaign(std::uint64_t seed) {
  Campaign c;
  c.name = "Demo: two-arm rig, curved boundary";
  c.notes =
      "Invented scenario: 48 training and 16 test points on either side of a parabola, one "
      "feature per photon as linear polarization, eight stepper-driven mounts.";
  c.seed = seed;

  std::mt19937_64 rng(seed);
  const int n_train = 48, n_test = 16;
  DataSet& d = c.data;
  d.feature_names = {"x0", "x1"};
  d.positive_name = "above";
  d.negative_name = "below";
  d.train.resize(n_train, 2);
  d.test.resize(n_test, 2);
  d.train_labels.resize(n_train);
  d.test_labels.resize(n_test);
  auto draw = [&](Eigen::MatrixXd& x, Eigen::VectorXi& y, int count) {
    int i = 0;
    while (i < count) {
      const double x0 = unit(rng), x1 = unit(rng);
      const double gap = x1 - boundary(x0);
      if (std::abs(gap) < 0.06) continue;  // keep a visible margin around the boundary
      // Alternate classes so both are always present and balanced.
      if ((gap > 0) != (i % 2 == 0)) continue;
      x(i, 0) = std::round(x0 * 1000.0) / 1000.0;
      x(i, 1) = std::round(x1 * 1000.0) / 1000.0;
      y(i) = gap > 0 ? 1 : -1;
      ++i;
    }
  };
  draw(d.train, d.train_labels, n_train);
  draw(d.test, d.test_labels, n_test);

  Eigen::VectorXd lo(2), hi(2);
  lo << 0.0, 0.0;
  hi << 1.0, 1.0;
  c.encoding =
      make_preset(EncodingPreset::one_feature_per_photon_linear, lo, hi, AngleSpan{10.0, 170.0});

  Rig& r = c.rig;
  const char* arm[] = {"A", "B"};
  for (int p = 0; p < 2; ++p) {
    const std::string a = arm[p];
    r.motors.push_back(mount(a + "-prep-HWP", p, Stage::prep, Plate::HWP));
    r.motors.push_back(mount(a + "-prep-QWP", p, Stage::prep, Plate::QWP));
    r.motors.push_back(mount(a + "-ana-QWP", p, Stage::analysis, Plate::QWP));
    r.motors.push_back(mount(a + "-ana-HWP", p, Stage::analysis, Plate::HWP));
  }
  r.controller = Controller{MoveMode::simultaneous, 0.5, 0.1};
  r.source.pair_rate_per_s = 100000.0;
  r.source.visibility = 0.97;
  r.detectors = {Detector{0.15, 200.0}, Detector{0.15, 200.0}};
  r.coincidence_window_s = 2e-9;
  r.scheme = DetectionScheme::both_ports;

  c.precision.budget = BudgetOptions{BudgetMethod::wilson, 0.01, 0.95, false};
  c.nights.first_date = "2026-12-07";
  c.nights.start_min = 20 * 60;
  c.nights.end_min = 6 * 60;
  c.nights.max_nights = 3;
  c.schedule.reference_interval_min = 20.0;
  c.schedule.dark_steps = true;
  c.schedule.dark_dwell_s = 30.0;
  c.schedule.park = true;
  return c;
}

}  // namespace gramline
