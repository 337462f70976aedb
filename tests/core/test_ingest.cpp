// Ingest: simulated counts for a planned campaign come back as the kernel they were drawn from.
#include <gtest/gtest.h>

#include <cmath>
#include <random>

#include "gramline/demo.h"
#include "gramline/detection.h"
#include "gramline/ingest.h"
#include "gramline/jones.h"
#include "gramline/plan.h"

namespace gramline {
namespace {

// Draws the counts of every step from the rig model: the pass channel and the rest as
// independent Poisson counts, which makes the pass count binomial given the total (the
// standard Poisson-splitting fact, e.g. Feller, An Introduction to Probability Theory, vol. 1).
std::vector<StepRecord> simulate(const Campaign& c, const Plan& plan, std::uint64_t seed,
                                 double rate_scale_at_end = 1.0) {
  std::mt19937_64 rng(seed);
  const int photons = c.encoding.photon_count();
  const double span = plan.summary.total_s > 0 ? plan.summary.total_s : 1.0;
  std::vector<StepRecord> out;
  for (size_t k = 0; k < plan.steps.size(); ++k) {
    const Step& s = plan.steps[k];
    if (s.kind == StepKind::dark || s.kind == StepKind::park) continue;
    StepRecord r;
    r.step = static_cast<int>(k);
    r.start_s = s.start_s + s.move_s;
    r.end_s = r.start_s + s.dwell_s;
    std::vector<double> overlaps(photons, 1.0);
    if (s.kind == StepKind::measure) {
      const Eigen::VectorXd a = c.data.point(s.prep_point), b = c.data.point(s.analysis_point);
      for (int p = 0; p < photons; ++p) {
        const BlochAngles sa = c.encoding.angles(p, a), sb = c.encoding.angles(p, b);
        overlaps[p] =
            overlap(bloch_state(sa.theta_deg, sa.phi_deg), bloch_state(sb.theta_deg, sb.phi_deg));
      }
    }
    double kappa = 1.0;
    for (double o : overlaps) kappa *= o;
    const SettingRates rates = setting_rates(c.rig, photons, kappa, overlaps);
    // Optional slow drift of the pair rate, linear over the campaign.
    const double scale = 1.0 + (rate_scale_at_end - 1.0) * (r.start_s / span);
    const double r_pairs = rates.pair_detect_rate_per_s * scale;
    const double t = s.dwell_s;
    std::poisson_distribution<long> pass(t *
                                         (r_pairs * rates.p_pass + rates.accidental_rate_per_s));
    std::poisson_distribution<long> rest(t * (r_pairs * (1.0 - rates.p_pass) +
                                              rates.accidental_total_rate_per_s -
                                              rates.accidental_rate_per_s));
    r.channel_counts.assign(channel_count(c.rig.scheme, photons), 0.0);
    r.channel_counts[0] = static_cast<double>(pass(rng));
    r.channel_counts[1] = static_cast<double>(rest(rng));
    out.push_back(r);
  }
  return out;
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
  const IngestResult res = ingest_records(c, plan, simulate(c, plan, 12, 0.8));
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
