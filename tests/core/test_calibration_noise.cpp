// The reference calibration in the error budget (docs/error-budget.md): the calibration's own
// variance, its share of each entry's variance, and simulated nights whose z-scores (each with
// the entry's marginal sigma) have the spread the plan promises.
#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <random>
#include <stdexcept>
#include <string>
#include <vector>

#include "../shared/one_photon.h"
#include "gramline/demo.h"
#include "gramline/detection.h"
#include "gramline/estimates.h"
#include "gramline/ingest.h"
#include "gramline/plan.h"
#include "gramline/simulate.h"

namespace gramline {
namespace {

// The demo's first `train` training and `test` test points (a small campaign for quick nights).
Campaign demo_subset(int train, int test, DetectionScheme scheme) {
  Campaign c = make_demo_campaign();
  c.data.train = c.data.train.topRows(train).eval();
  c.data.train_labels = c.data.train_labels.head(train).eval();
  c.data.test = c.data.test.topRows(test).eval();
  c.data.test_labels = c.data.test_labels.head(test).eval();
  c.rig.scheme = scheme;
  return c;
}

// Not the demo: one photon, one feature as the linear polarization angle (degrees), a brighter
// source, a looser target and one-hour nights with references every 5 minutes.
Campaign one_photon(DetectionScheme scheme) {
  return one_photon_test::one_photon_short_nights(scheme, 14, 6);
}

struct Pooled {
  SampleMoments z;
  long flagged = 0;
  long count = 0;
};

// Simulates `nights` independent runs of the plan (gramline/simulate.h), ingests each and pools
// every entry's z-score.
Pooled simulate_nights(const Campaign& c, const Plan& plan, int nights, double outlier_z) {
  Pooled out;
  IngestOptions io;
  io.outlier_z = outlier_z;
  for (int k = 0; k < nights; ++k) {
    CountSimulationOptions so;
    so.seed = 1000 + k;
    const IngestResult r = ingest_records(c, plan, simulate_counts(c, plan.steps, so), io);
    const int n = static_cast<int>(r.gram_z.rows());
    for (int i = 0; i < n; ++i)
      for (int j = i + 1; j < n; ++j)
        if (std::isfinite(r.gram_z(i, j))) out.z.add(r.gram_z(i, j));
    for (int t = 0; t < r.test_z.rows(); ++t)
      for (int j = 0; j < r.test_z.cols(); ++j)
        if (std::isfinite(r.test_z(t, j))) out.z.add(r.test_z(t, j));
    out.flagged += static_cast<long>(r.outliers.size());
  }
  out.count = out.z.count;
  return out;
}

// Two-sided normal tail P(|Z| > z) (common practice).
double normal_two_sided_tail(double z) { return std::erfc(z / std::sqrt(2.0)); }

void expect_honest_z(const Campaign& c, const char* what) {
  PlanOptions po;
  po.simulate_gram_error = false;
  const Plan plan = plan_campaign(c, po);
  ASSERT_GT(plan.summary.reference_steps, 1) << what;
  // The calibration stays within its planned share (10 % by default) of every entry.
  EXPECT_LE(plan.summary.calibration_share_max, c.schedule.calibration_share + 1e-9) << what;
  EXPECT_GT(plan.summary.calibration_share_max, 0.0) << what;
  const double outlier_z = 2.0;
  const Pooled p = simulate_nights(c, plan, 8, outlier_z);
  ASSERT_GT(p.count, 600) << what;
  std::printf(
      "[%s] z sd %.4f, mean %+.4f over %ld entries of 8 nights; |z| > 2: %.4f; "
      "calibration share up to %.3f\n",
      what, p.z.standard_deviation(), p.z.mean(), p.count, static_cast<double>(p.flagged) / p.count,
      plan.summary.calibration_share_max);
  // A z-score with the right sigma is standard normal: sd 1 (the goal is [0.95, 1.05]).
  EXPECT_GE(p.z.standard_deviation(), 0.95) << what;
  EXPECT_LE(p.z.standard_deviation(), 1.05) << what;
  // The mean moves with each night's references, which every entry shares (about a tenth of
  // each entry's variance): over 8 nights its spread is near sqrt(0.1 / 8) = 0.11.
  EXPECT_NEAR(p.z.mean(), 0.0, 0.4) << what;
  // Flagged at the nominal rate P(|Z| > 2) = 4.55 %, within four binomial standard errors.
  const double nominal = normal_two_sided_tail(outlier_z);
  const double se = std::sqrt(nominal * (1 - nominal) / static_cast<double>(p.count));
  EXPECT_NEAR(static_cast<double>(p.flagged) / p.count, nominal, 4 * se) << what;
}

// The demo's rig and encoding on a part of its points; references every 3 minutes so that
// entries share and interpolate several of them in the short run.
TEST(CalibrationNoise, SimulatedNightsGiveStandardNormalZScoresOnTheDemo) {
  for (DetectionScheme scheme : {DetectionScheme::pass_only, DetectionScheme::both_ports}) {
    Campaign c = demo_subset(20, 8, scheme);
    c.schedule.reference_interval_min = 3.0;
    expect_honest_z(c, ("demo, " + to_string(scheme)).c_str());
  }
}

TEST(CalibrationNoise, SimulatedNightsGiveStandardNormalZScoresOnOnePhotonShortNights) {
  expect_honest_z(one_photon(DetectionScheme::pass_only), "one photon, pass only");
  expect_honest_z(one_photon(DetectionScheme::both_ports), "one photon, both ports");
}

// The reference's calibration spread, predicted to first order, against counts drawn from the
// model: Poisson counts (common practice) turned into a rate and a visibility.
TEST(CalibrationNoise, ReferenceCovarianceMatchesDrawnReferenceCounts) {
  for (DetectionScheme scheme : {DetectionScheme::pass_only, DetectionScheme::both_ports}) {
    const int photons = 2;
    Calibration cal;
    cal.pair_detect_rate_per_s = 2000.0;
    cal.visibility = 0.96;
    cal.accidental_pass_rate_per_s = 20.0;
    cal.accidental_total_rate_per_s = 80.0;
    const double pairs = 40000.0, t = pairs / cal.pair_detect_rate_per_s;
    const double p = pass_probability(1.0, cal.visibility, photons);
    const CalibrationCovariance cov = reference_covariance(scheme, photons, cal, pairs);
    std::mt19937_64 rng(11);
    std::poisson_distribution<long> pass(
        t * (cal.pair_detect_rate_per_s * p + cal.accidental_pass_rate_per_s));
    std::poisson_distribution<long> rest(t * (cal.pair_detect_rate_per_s * (1 - p) +
                                              cal.accidental_total_rate_per_s -
                                              cal.accidental_pass_rate_per_s));
    SampleMoments rate, vis;
    const int draws = 20000;
    for (int d = 0; d < draws; ++d) {
      SettingCounts counts;
      counts.dwell_s = t;
      counts.pass_counts = static_cast<double>(pass(rng));
      counts.total_counts = counts.pass_counts + static_cast<double>(rest(rng));
      const Calibration got = reference_calibration(scheme, photons, cal, counts);
      rate.add(got.pair_detect_rate_per_s);
      vis.add(got.visibility);
    }
    // A sample variance of `draws` normal values has relative standard error sqrt(2 / draws)
    // (common practice): 1 % here; allow 5 %.
    EXPECT_NEAR(std::pow(rate.standard_deviation(), 2) / cov.rate_var, 1.0, 0.05)
        << to_string(scheme);
    EXPECT_NEAR(rate.mean(), cal.pair_detect_rate_per_s, 4 * std::sqrt(cov.rate_var / draws));
    if (scheme == DetectionScheme::both_ports)
      EXPECT_NEAR(std::pow(vis.standard_deviation(), 2) / cov.visibility_var, 1.0, 0.05);
    else
      EXPECT_EQ(cov.visibility_var, 0.0);
  }
}

// With the reference pairs fixed by the campaign the plan reports the share they leave; fewer
// reference pairs leave a larger share.
TEST(CalibrationNoise, FixedReferencePairsReportTheirShare) {
  Campaign c = demo_subset(8, 2, DetectionScheme::pass_only);
  PlanOptions po;
  po.simulate_gram_error = false;
  c.schedule.reference_pairs = 2000.0;
  const Plan few = plan_campaign(c, po);
  c.schedule.reference_pairs = 200000.0;
  const Plan many = plan_campaign(c, po);
  EXPECT_EQ(few.summary.reference_pairs, 2000.0);
  EXPECT_EQ(few.summary.calibration_share_target, 0.0);
  EXPECT_GT(few.summary.calibration_share_max, many.summary.calibration_share_max);
  // Pass only, no visibility term: an entry of pass probability p calibrated by one reference of
  // N pairs has calibration variance (p / V)^2 (p_ref + a/r) / (N p_ref^2) (Poisson, delta
  // method). With a = 0 the share of the entry at the reference (p = p_ref) is
  // (1/(N V^2) p_ref) / (1/(N V^2) p_ref + p_ref / (n V^2)) = n / (n + N) for n entry pairs.
}

// The parts of the time add up to the busy time of the nights.
TEST(CalibrationNoise, TimePartsAddUpToTheBusyTime) {
  const Campaign c = demo_subset(10, 3, DetectionScheme::both_ports);
  PlanOptions po;
  po.simulate_gram_error = false;
  const Plan plan = plan_campaign(c, po);
  double busy = 0.0, busy_nights = 0.0;
  for (const Step& s : plan.steps) busy += s.move_s + s.dwell_s;
  for (const NightUse& u : plan.summary.night_use) {
    busy_nights += u.busy_s;
    EXPECT_NEAR(u.integration_s + u.move_s + u.reference_s, u.busy_s, 1e-6 * u.busy_s);
  }
  const PlanSummary& s = plan.summary;
  EXPECT_NEAR(s.integration_s + s.move_s + s.reference_s, busy, 1e-6 * busy);
  EXPECT_NEAR(busy_nights, busy, 1e-6 * busy);
}

std::string planning_error(const Campaign& c) {
  try {
    PlanOptions po;
    po.simulate_gram_error = false;
    plan_campaign(c, po);
  } catch (const std::invalid_argument& e) {
    return e.what();
  }
  return {};
}

TEST(CalibrationNoise, PassOnlyWithoutReferencesIsRefusedWhenPlanning) {
  Campaign c = demo_subset(6, 2, DetectionScheme::pass_only);
  c.schedule.reference_interval_min = 0.0;
  EXPECT_NE(planning_error(c).find("schedule.reference_interval_min"), std::string::npos);
  c.rig.scheme = DetectionScheme::both_ports;
  EXPECT_EQ(planning_error(c), "");
}

TEST(CalibrationNoise, LongCountingNamesItsRealCause) {
  Campaign wide = demo_subset(6, 2, DetectionScheme::both_ports);
  wide.rig.coincidence_window_s = 2.0;
  std::string e = planning_error(wide);
  EXPECT_NE(e.find("rig.coincidence_window_s"), std::string::npos) << e;
  EXPECT_EQ(e.find("reference_pairs"), std::string::npos) << e;

  Campaign dim = demo_subset(6, 2, DetectionScheme::both_ports);
  dim.rig.source.pair_rate_per_s = 5.0;
  dim.rig.detectors = {Detector{0.15, 0.0}, Detector{0.15, 0.0}};
  e = planning_error(dim);
  EXPECT_NE(e.find("rig.source.pair_rate_per_s"), std::string::npos) << e;
  EXPECT_EQ(e.find("reference_pairs"), std::string::npos) << e;

  Campaign fine = demo_subset(6, 2, DetectionScheme::both_ports);
  fine.precision.budget.epsilon = 1e-4;
  e = planning_error(fine);
  EXPECT_NE(e.find("precision.epsilon"), std::string::npos) << e;
  EXPECT_EQ(e.find("reference_pairs"), std::string::npos) << e;
}

TEST(CalibrationNoise, WarnsOnDarkCountsAboveSinglesAndFarFeatures) {
  Campaign c = demo_subset(6, 2, DetectionScheme::both_ports);
  EXPECT_TRUE(c.warnings().empty());
  c.rig.detectors[1].dark_rate_per_s = 1e5;  // the demo's singles are 1.5e4 per second
  c.data.test(0, 0) = 40.0;                  // the demo's features lie in [0, 1]
  const std::vector<std::string> w = c.warnings();
  ASSERT_EQ(w.size(), 2u);
  EXPECT_NE(w[0].find("rig.detectors[1].dark_rate_per_s"), std::string::npos);
  EXPECT_NE(w[1].find("test point 0"), std::string::npos);
}

}  // namespace
}  // namespace gramline
