// Per-entry statistics (core/src/entries.cpp) and the allocation over a list of entries
// (core/src/allocation.cpp): one home that the planner, the margin check and ingest share.
#include <gtest/gtest.h>

#include <cmath>
#include <random>

#include "gramline/allocation.h"
#include "gramline/demo.h"
#include "gramline/entries.h"
#include "gramline/kernel.h"
#include "gramline/margin.h"
#include "gramline/plan.h"

namespace gramline {
namespace {

// Three photons, one feature each (linear states), pass-only detection: not the demo's shape.
Campaign three_photon_campaign() {
  Campaign c = make_demo_campaign();
  std::mt19937_64 rng(5);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  const int n = 12, m = 4;
  c.data.feature_names = {"a", "b", "c"};
  c.data.train.resize(n, 3);
  c.data.test.resize(m, 3);
  c.data.train_labels.resize(n);
  c.data.test_labels.resize(m);
  for (int i = 0; i < n + m; ++i) {
    Eigen::RowVector3d x(u(rng), u(rng), u(rng));
    const int label = x.sum() > 1.5 ? 1 : -1;
    if (i < n) {
      c.data.train.row(i) = x;
      c.data.train_labels[i] = i < 2 ? (i == 0 ? 1 : -1) : label;  // both classes present
    } else {
      c.data.test.row(i - n) = x;
      c.data.test_labels[i - n] = label;
    }
  }
  Eigen::VectorXd low, high;
  feature_ranges(c.data.train, low, high);
  c.encoding = make_preset(EncodingPreset::one_feature_per_photon_linear, low, high);
  // Photon 2 gets a copy of photon 0's motors and detector.
  std::vector<Motor> extra;
  for (const Motor& mo : c.rig.motors)
    if (mo.photon == 0) {
      Motor copy = mo;
      copy.photon = 2;
      copy.name += "-third";
      extra.push_back(copy);
    }
  c.rig.motors.insert(c.rig.motors.end(), extra.begin(), extra.end());
  c.rig.detectors.push_back(c.rig.detectors.front());
  c.rig.scheme = DetectionScheme::pass_only;
  return c;
}

TEST(Entries, TheStatisticsFollowTheIdealKernelAndTheDepolarizingModel) {
  for (const Campaign& c : {make_demo_campaign(), three_photon_campaign()}) {
    ASSERT_EQ(c.check_consistency(), "");
    const EntryStatistics stats(c);
    const int n = c.data.train_count();
    const int photons = c.encoding.photon_count();
    EXPECT_EQ(stats.photons(), photons);
    for (auto [a, b] : {std::pair{0, 1}, std::pair{3, n - 1}, std::pair{n, 2}}) {
      const std::vector<double> o = stats.overlaps(a, b);
      ASSERT_EQ(static_cast<int>(o.size()), photons);
      double kappa = 1.0;
      for (double x : o) kappa *= x;
      EXPECT_NEAR(kappa, ideal_kernel(c.encoding, c.data.point(a), c.data.point(b)), 1e-15);
      // p = V kappa + (1 - V) / 2^P, the global depolarizing model (detection.h).
      const EntryNoise e = stats.noise(a, b);
      const double v = c.rig.source.visibility;
      EXPECT_NEAR(e.p_pass, v * kappa + (1 - v) / std::pow(2.0, photons), 1e-15);
      EXPECT_EQ(e.calibration.pair_detect_rate_per_s, pair_detect_rate_per_s(c.rig, photons));
      EXPECT_EQ(e.calibration.visibility, v);
    }
    // A negative index is the diagonal: every overlap 1.
    for (double x : stats.overlaps(-1, 0)) EXPECT_EQ(x, 1.0);
  }
}

// pass_only counts are Poisson with mean (r p + a) t (detection.h); the spread of the estimates
// over seeded draws must match the predicted sigma of the three-photon entries.
TEST(Entries, PredictedSigmaMatchesSimulatedPassOnlyCountsForThreePhotons) {
  const Campaign c = three_photon_campaign();
  const EntryStatistics stats(c);
  std::mt19937_64 rng(77);
  for (auto [a, b] : {std::pair{0, 1}, std::pair{4, 9}, std::pair{12, 3}}) {
    const EntryNoise e = stats.noise(a, b);
    const double pairs = 4000.0;
    const double t = pairs / e.calibration.pair_detect_rate_per_s;
    std::poisson_distribution<long> counts(t * (e.calibration.pair_detect_rate_per_s * e.p_pass +
                                                e.calibration.accidental_pass_rate_per_s));
    const int draws = 6000;
    double sum = 0.0, sum_sq = 0.0;
    for (int k = 0; k < draws; ++k) {
      SettingCounts n;
      n.dwell_s = t;
      n.pass_counts = static_cast<double>(counts(rng));
      const double kappa = estimate_kernel(c.rig.scheme, 3, e.calibration, n);
      sum += kappa;
      sum_sq += kappa * kappa;
    }
    const double mean = sum / draws;
    const double sd = std::sqrt((sum_sq - draws * mean * mean) / (draws - 1));
    const double sigma = stats.sigma(e, pairs);
    // The sample sd of 6000 normal-ish draws has a relative standard error of ~0.9%.
    EXPECT_NEAR(sd / sigma, 1.0, 0.04) << a << "," << b;
    double kappa = 1.0;
    for (double x : stats.overlaps(a, b)) kappa *= x;
    EXPECT_NEAR(mean, kappa, 4.5 * sigma / std::sqrt(draws));
  }
}

TEST(Entries, PlanMarginCheckAndRebuiltPlanShareEveryEntrysSigma) {
  const Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  const MarginProblem problem = make_margin_problem(c, plan);
  EXPECT_EQ(problem.sigma_train(), plan.sigma_train);
  EXPECT_EQ(problem.sigma_test(), plan.sigma_test);
  const Plan rebuilt = plan_from_steps(c, plan.steps);
  EXPECT_EQ(rebuilt.sigma_train, plan.sigma_train);
  EXPECT_EQ(rebuilt.sigma_test, plan.sigma_test);
  EXPECT_FALSE(rebuilt.options.has_value());
  ASSERT_TRUE(plan.options.has_value());
}

TEST(Allocation, OnlyTheListedEntriesShareTheTotal) {
  const Campaign c = make_demo_campaign();
  const EntryStatistics stats(c);
  AllocationInput in;
  in.scheme = stats.scheme();
  in.photons = stats.photons();
  in.train_count = c.data.train_count();
  in.test_count = c.data.test_count();
  const int n = in.train_count;
  for (auto [i, j] : {std::pair{0, 1}, std::pair{2, 7}, std::pair{5, 40}})
    in.entries.push_back({Block::train, i, j, stats.noise(i, j)});
  in.entries.push_back({Block::test, 3, 11, stats.noise(n + 3, 11)});
  const double total = 1e6;
  for (Allocation a : {Allocation::uniform, Allocation::neyman}) {
    const std::vector<double> pairs = allocate_pairs(in, a, total);
    ASSERT_EQ(pairs.size(), in.entries.size());
    double sum = 0.0;
    for (double p : pairs) sum += p;
    EXPECT_NEAR(sum, total, 1e-9 * total);
    if (a == Allocation::uniform) {
      for (double p : pairs) EXPECT_NEAR(p, total / 4, 1e-9 * total);
    } else {
      // Neyman (J. R. Stat. Soc. 97 (1934) 558): in proportion to the one-pair sigma.
      EXPECT_NEAR(pairs[0] / pairs[1],
                  stats.sigma(in.entries[0].noise, 1.0) / stats.sigma(in.entries[1].noise, 1.0),
                  1e-12);
    }
  }
  EXPECT_THROW(allocate_pairs(in, Allocation::margin_aware, total), std::invalid_argument);
}

// After a resume only the entries left are planned; Neyman and the margin-aware rule share the
// same total time among them as the uniform plan does (they used to give every such entry one
// pair, as the measured entries' empty statistics weighed infinitely).
TEST(Allocation, ResumedPlansShareTheTimeAmongTheEntriesLeft) {
  Campaign c = make_demo_campaign();
  const Plan full = plan_campaign(c);
  ResumeState resume;
  int taken = 0;
  for (const Step& s : full.steps) {
    if (s.kind != StepKind::measure || taken == 400) continue;
    resume.measured.emplace_back(s.prep_point, s.analysis_point);
    ++taken;
  }
  PlanOptions o;
  o.resume = &resume;
  auto measure_pairs = [](const Plan& p, double& most, double& sum, int& count) {
    most = sum = 0.0;
    count = 0;
    for (const Step& s : p.steps)
      if (s.kind == StepKind::measure) {
        most = std::max(most, s.pairs);
        sum += s.pairs;
        ++count;
      }
  };
  double most_u, sum_u;
  int count_u;
  measure_pairs(plan_campaign(c, o), most_u, sum_u, count_u);
  for (Allocation a : {Allocation::neyman, Allocation::margin_aware}) {
    c.precision.allocation = a;
    double most, sum;
    int count;
    measure_pairs(plan_campaign(c, o), most, sum, count);
    EXPECT_EQ(count, count_u);
    // Rounding each entry to whole pairs moves the total by at most half a pair per entry.
    EXPECT_NEAR(sum, sum_u, 0.5 * count) << to_string(a);
    EXPECT_GT(most, 100.0) << to_string(a);
  }
}

}  // namespace
}  // namespace gramline
