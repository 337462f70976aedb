#include "gramline/demo.h"

#include <cmath>
#include <random>

#include "gramline/new_campaign.h"

namespace gramline {

namespace {
// Uniform double in [0, 1) from 53 random bits: identical on every standard library, unlike
// std::uniform_real_distribution.
double unit(std::mt19937_64& rng) { return static_cast<double>(rng() >> 11) * 0x1.0p-53; }

// The invented scenario: two kinds of samples on either side of a parabola in the unit square.
double boundary(double x0) { return 0.22 + 1.3 * (x0 - 0.5) * (x0 - 0.5); }

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

  c.rig = default_rig(2);

  set_usual_settings(c);
  c.nights.first_date = "2026-12-07";
  return c;
}

}  // namespace gramline
