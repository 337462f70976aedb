// Ingest: simulated counts for a planned campaign come back as the kernel they were drawn from.
#include <gtest/gtest.h>

#include <cmath>

#include "gramline/demo.h"
#include "gramline/detection.h"
#include "gramline/ingest.h"
#include "gramline/jones.h"
#include "gramline/plan.h"
#include "gramline/simulate.h"

namespace gramline {
namespace {

// Counts of every step from the rig model, drawn by the engine's one simulator
// (gramline/simulate.h); `fade_per_hour` lets the pair rate fall.
std::vector<StepRecord> simulate(const Campaign& c, const Plan& plan, std::uint64_t seed,
                                 double fade_per_hour = 0.0) {
  CountSimulationOptions options;
  options.seed = seed;
  options.fade_per_hour = fade_per_hour;
  return simulate_counts(c, plan.steps, options);
}

TEST(Ingest, SimulatedDemoCountsRecoverTheKernelWithStandardNormalZScores) {
  Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  const IngestResult res = ingest_records(c, plan, simulate(c, plan, 11));
  EXPECT_EQ(res.measured_entries, plan.summary.settings);
  // z-scores of unbiased estimates with the right variance are standard normal: with ~1900
  // entries the sample mean has standard error ~0.023 and the sample sd ~0.016.
  EXPECT_NEAR(res.z_mean, 0.0, 0.1);
  EXPECT_NEAR(res.z_std, 1.0, 0.08);
  // Every measured training entry lies within 5 predicted sigma of the ideal kernel.
  for (int i = 0; i < c.data.train_count(); ++i)
    for (int j = i + 1; j < c.data.train_count(); ++j)
      EXPECT_LT(std::abs(res.gram_measured(i, j) - plan.kernel_train(i, j)),
                5.0 * plan.sigma_train(i, j) + 1e-12);
  EXPECT_LE(res.outliers.size(), 2u);  // |z| > 4 has probability ~6e-5 per entry
  for (const DriftPoint& d : res.drift) EXPECT_FALSE(d.drifted);
}

TEST(Ingest, DriftingPairRateIsFlaggedAndTrackedByTheReferences) {
  Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  // The pair rate falls by 20 % over the campaign; the references must see it.
  const double hours = plan.summary.total_s / 3600.0;
  const IngestResult res =
      ingest_records(c, plan, simulate(c, plan, 12, 1.0 - std::pow(0.8, 1.0 / hours)));
  ASSERT_GE(res.drift.size(), 3u);
  EXPECT_TRUE(res.drift.back().drifted);
  EXPECT_LT(res.drift.back().pair_detect_rate_per_s,
            0.9 * res.drift.front().pair_detect_rate_per_s);
  // Both ports: the kernel estimate depends on the pass fraction, so it stays unbiased.
  EXPECT_NEAR(res.z_mean, 0.0, 0.15);
}

TEST(Ingest, RecordsThatDoNotFitThePlanAreRefusedByNumber) {
  Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  std::vector<StepRecord> recs = simulate(c, plan, 13);
  recs.resize(3);
  recs[2].step = static_cast<int>(plan.steps.size()) + 5;
  try {
    ingest_records(c, plan, recs);
    FAIL() << "expected an error";
  } catch (const std::invalid_argument& e) {
    EXPECT_NE(std::string(e.what()).find("record 3"), std::string::npos) << e.what();
  }
  recs.resize(2);
  recs[1].channel_counts.push_back(1.0);
  EXPECT_THROW(ingest_records(c, plan, recs), std::invalid_argument);
}

}  // namespace
}  // namespace gramline
