#pragma once
// A campaign on one photon: the given rig cut to its first photon's motors and detector, one
// feature "theta" encoded as the linear polarization angle in degrees (kernel
// cos^2((theta_a - theta_b)/2)). Used by engine tests and benchmarks that want a campaign other
// than the demo.
#include <random>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/demo.h"

namespace one_photon_test {

inline gramline::Campaign one_photon_linear(gramline::Campaign c, const Eigen::MatrixXd& train,
                                            const Eigen::VectorXi& train_labels,
                                            const Eigen::MatrixXd& test,
                                            const Eigen::VectorXi& test_labels) {
  c.data.feature_names = {"theta"};
  c.data.train = train;
  c.data.train_labels = train_labels;
  c.data.test = test;
  c.data.test_labels = test_labels;
  gramline::PhotonEncoding e;
  e.theta_weights_deg = Eigen::VectorXd::Ones(1);
  e.phi_weights_deg = Eigen::VectorXd::Zero(1);
  c.encoding = {};
  c.encoding.photons = {e};
  std::vector<gramline::Motor> motors;
  for (const gramline::Motor& m : c.rig.motors)
    if (m.photon == 0) motors.push_back(m);
  c.rig.motors = motors;
  c.rig.detectors.resize(1);
  return c;
}

/// Not the demo: n training and m test points of random angles in [0, 170] deg (seeded, labelled
/// by theta < 85), a brighter source (20 000 pairs/s, V 0.95, one detector of efficiency 0.3 and
/// 500 dark counts/s), epsilon 0.02 and one-hour nights with references every 5 minutes.
inline gramline::Campaign one_photon_short_nights(gramline::DetectionScheme scheme, int n, int m) {
  std::mt19937_64 rng(7);
  std::uniform_real_distribution<double> angle(0.0, 170.0);
  Eigen::MatrixXd x(n + m, 1);
  Eigen::VectorXi y(n + m);
  for (int i = 0; i < n + m; ++i) {
    x(i, 0) = angle(rng);
    y(i) = x(i, 0) < 85.0 ? 1 : -1;
  }
  gramline::Campaign c = one_photon_linear(gramline::make_demo_campaign(), x.topRows(n), y.head(n),
                                           x.bottomRows(m), y.tail(m));
  c.rig.detectors = {gramline::Detector{0.3, 500.0}};
  c.rig.source.pair_rate_per_s = 20000.0;
  c.rig.source.visibility = 0.95;
  c.rig.scheme = scheme;
  c.precision.budget.epsilon = 0.02;
  c.nights.start_min = 21 * 60;
  c.nights.end_min = 22 * 60;
  c.nights.max_nights = 50;
  c.schedule.reference_interval_min = 5.0;
  return c;
}

}  // namespace one_photon_test
