// Simulated nights against the plan's promise (docs/error-budget.md): for the demo and a
// one-photon campaign with one-hour nights, both detection schemes, plans the campaign, draws
// NIGHTS independent runs with the engine's count simulator, ingests each and prints the
// standard deviation of the pooled z-scores (each entry's z with its own marginal sigma; goal
// [0.95, 1.05]), the share of |z| > 2 and > 4 against the normal tails, the largest calibration
// share and what the references cost.
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <random>
#include <string>

#include "gramline/demo.h"
#include "gramline/estimates.h"
#include "gramline/ingest.h"
#include "gramline/plan.h"
#include "gramline/simulate.h"

using namespace gramline;

namespace {

Campaign one_photon(DetectionScheme scheme) {
  Campaign c = make_demo_campaign();
  std::mt19937_64 rng(7);
  std::uniform_real_distribution<double> angle(0.0, 170.0);
  const int n = 30, m = 10;
  c.data.feature_names = {"theta"};
  c.data.train.resize(n, 1);
  c.data.train_labels.resize(n);
  c.data.test.resize(m, 1);
  c.data.test_labels.resize(m);
  for (int i = 0; i < n + m; ++i) {
    const double x = angle(rng);
    if (i < n) {
      c.data.train(i, 0) = x;
      c.data.train_labels(i) = x < 85.0 ? 1 : -1;
    } else {
      c.data.test(i - n, 0) = x;
      c.data.test_labels(i - n) = x < 85.0 ? 1 : -1;
    }
  }
  PhotonEncoding e;
  e.theta_weights_deg = Eigen::VectorXd::Ones(1);
  e.phi_weights_deg = Eigen::VectorXd::Zero(1);
  c.encoding = {};
  c.encoding.photons = {e};
  std::vector<Motor> motors;
  for (const Motor& mo : c.rig.motors)
    if (mo.photon == 0) motors.push_back(mo);
  c.rig.motors = motors;
  c.rig.detectors = {Detector{0.3, 500.0}};
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

void run(const char* name, const Campaign& c, int nights) {
  const auto t0 = std::chrono::steady_clock::now();
  PlanOptions po;
  po.simulate_gram_error = false;
  const Plan plan = plan_campaign(c, po);
  SampleMoments z;
  long over2 = 0, over4 = 0;
  for (int k = 0; k < nights; ++k) {
    CountSimulationOptions so;
    so.seed = 500 + k;
    const IngestResult r = ingest_records(c, plan, simulate_counts(c, plan.steps, so));
    auto add = [&](double x) {
      if (!std::isfinite(x)) return;
      z.add(x);
      over2 += std::abs(x) > 2.0;
      over4 += std::abs(x) > 4.0;
    };
    for (int i = 0; i < r.gram_z.rows(); ++i)
      for (int j = i + 1; j < r.gram_z.cols(); ++j) add(r.gram_z(i, j));
    for (int t = 0; t < r.test_z.rows(); ++t)
      for (int j = 0; j < r.test_z.cols(); ++j) add(r.test_z(t, j));
  }
  const double secs = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
  const PlanSummary& s = plan.summary;
  std::printf(
      "%-28s z sd %.4f (mean %+.4f, %d values, %d nights); |z|>2 %.4f (normal %.4f), |z|>4 %ld "
      "(normal expects %.2f); calibration share max %.3f; %ld references of %.0f pairs, "
      "references/dark/park %.2f h of %.2f h busy; %.1f s\n",
      name, z.standard_deviation(), z.mean(), z.count, nights, static_cast<double>(over2) / z.count,
      std::erfc(2.0 / std::sqrt(2.0)), over4, z.count * std::erfc(4.0 / std::sqrt(2.0)),
      s.calibration_share_max, s.reference_steps, s.reference_pairs, s.reference_s / 3600.0,
      (s.integration_s + s.move_s + s.reference_s) / 3600.0, secs);
}

}  // namespace

int main(int argc, char** argv) {
  const int nights = argc > 1 ? std::atoi(argv[1]) : 8;
  for (DetectionScheme scheme : {DetectionScheme::pass_only, DetectionScheme::both_ports}) {
    Campaign demo = make_demo_campaign();
    demo.rig.scheme = scheme;
    run(("demo, " + to_string(scheme)).c_str(), demo, nights);
    run(("one photon, " + to_string(scheme)).c_str(), one_photon(scheme), nights);
  }
  return 0;
}
