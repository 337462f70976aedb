// Tests of the margin check's Monte Carlo (core/src/margin.cpp).
#include <gtest/gtest.h>

#include <Eigen/Eigenvalues>
#include <boost/math/distributions/normal.hpp>
#include <cmath>

#include "gramline/demo.h"
#include "gramline/margin.h"
#include "gramline/plan.h"
#include "gramline/random.h"

namespace {

using gramline::EntryNoise;
using gramline::MarginProblem;

// A one-dimensional Gaussian kernel exp(-(x - y)^2 / (2 w^2)): positive definite, values in
// (0, 1], unit diagonal, so it behaves like a measured quantum kernel.
Eigen::MatrixXd gauss_cross(const Eigen::VectorXd& a, const Eigen::VectorXd& b, double width) {
  Eigen::MatrixXd k(a.size(), b.size());
  for (int i = 0; i < a.size(); ++i)
    for (int j = 0; j < b.size(); ++j)
      k(i, j) = std::exp(-std::pow(a[i] - b[j], 2) / (2 * width * width));
  return k;
}

// Visibility 1, no accidentals: the pass probability is the kernel itself and the estimator's
// single-pair variance is kappa (1 - kappa) (binomial, both ports).
EntryNoise ideal_noise(double kappa, double rate_per_s = 1000.0) {
  EntryNoise noise;
  noise.p_pass = kappa;
  noise.calibration.pair_detect_rate_per_s = rate_per_s;
  noise.calibration.visibility = 1.0;
  return noise;
}

MarginProblem line_problem(const Eigen::VectorXd& train_x, const Eigen::VectorXi& train_y,
                           const Eigen::VectorXd& test_x, const Eigen::VectorXi& test_y,
                           double width, double pairs) {
  MarginProblem p;
  p.scheme = gramline::DetectionScheme::both_ports;
  p.photons = 2;
  p.kernel_train = gauss_cross(train_x, train_x, width);
  p.kernel_test = gauss_cross(test_x, train_x, width);
  p.train_labels = train_y;
  p.test_labels = test_y;
  const int n = static_cast<int>(train_x.size()), m = static_cast<int>(test_x.size());
  p.pairs_train = Eigen::MatrixXd::Constant(n, n, pairs);
  p.pairs_train.diagonal().setZero();
  p.pairs_test = Eigen::MatrixXd::Constant(m, n, pairs);
  for (int i = 0; i < n; ++i)
    for (int j = 0; j < n; ++j) p.noise_train.push_back(ideal_noise(p.kernel_train(i, j)));
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j) p.noise_test.push_back(ideal_noise(p.kernel_test(t, j)));
  return p;
}

// Twenty points on a line, class -1 left of 4.75, +1 right; five test points.
MarginProblem twenty_points(double pairs) {
  Eigen::VectorXd x(20);
  Eigen::VectorXi y(20);
  for (int i = 0; i < 20; ++i) {
    x[i] = 0.5 * i;
    y[i] = x[i] < 4.75 ? -1 : 1;
  }
  Eigen::VectorXd tx(5);
  tx << 1.2, 3.9, 5.6, 7.3, 8.8;
  Eigen::VectorXi ty(5);
  ty << -1, -1, 1, 1, 1;
  return line_problem(x, y, tx, ty, 1.2, pairs);
}

gramline::SvmModel ideal_model(const MarginProblem& p, double C = 10.0) {
  gramline::SvmOptions o;
  o.C = C;
  return gramline::train_svm(p.kernel_train, p.train_labels, o);
}

TEST(Margin, FlipProbabilityMatchesTheGaussianClosedForm) {
  // Training Gram taken exactly (pairs 0); only the test row is measured. Then the noisy
  // decision value is f0 + sum_i a_i e_i with independent e_i of variance
  // K_i (1 - K_i) / n (binomial estimator, V = 1, no accidentals; Poisson total adds O(1/n^2)),
  // so P(flip) = Phi(-|f0| / sigma_f) to the accuracy of the normal approximation.
  Eigen::VectorXd x(6);
  x << 0, 1, 2, 3, 4, 5;
  Eigen::VectorXi y(6);
  y << -1, -1, -1, 1, 1, 1;
  Eigen::VectorXd tx(1);
  tx << 2.53;
  Eigen::VectorXi ty(1);
  ty << 1;
  MarginProblem p = line_problem(x, y, tx, ty, 1.5, 1.0);
  p.pairs_train.setZero();
  const gramline::SvmModel ideal = ideal_model(p, 5.0);
  const double f0 = ideal.decision(p.kernel_test)[0];
  double unit_variance = 0.0;  // sigma_f^2 at one pair
  for (int i = 0; i < 6; ++i) {
    const double k = p.kernel_test(0, i);
    unit_variance += ideal.dual_coef[i] * ideal.dual_coef[i] * k * (1 - k);
  }
  // Choose the pairs so that |f0| / sigma_f = 1.2 (a flip probability near 11%).
  const double z = 1.2;
  const double pairs = unit_variance * z * z / (f0 * f0);
  ASSERT_GT(pairs, 300.0) << "set-up: too few pairs for the normal approximation";
  p.pairs_test.setConstant(pairs);

  gramline::TrialOptions options;
  options.trials = 40000;
  options.seed = 2024;
  options.svm.C = 5.0;
  const gramline::TrialSummary s = gramline::run_margin_trials(p, ideal, options);
  const boost::math::normal standard;
  const double expected = boost::math::cdf(standard, -z);
  const double se = std::sqrt(expected * (1 - expected) / options.trials);
  ASSERT_EQ(s.points.size(), 1u);
  EXPECT_NEAR(s.points[0].flip_probability.value, expected, 4 * se);
  EXPECT_LE(s.points[0].flip_probability.low, s.points[0].flip_probability.value);
  EXPECT_GE(s.points[0].flip_probability.high, s.points[0].flip_probability.value);
  EXPECT_NEAR(s.points[0].decision_sd, std::sqrt(unit_variance / pairs),
              0.03 * std::sqrt(unit_variance / pairs));
  // With the training Gram exact the classifier never changes.
  EXPECT_NEAR(s.margin_ratio_median.value, 1.0, 1e-6);
  EXPECT_NEAR(s.support_jaccard_median.value, 1.0, 1e-12);
}

TEST(Margin, HugeBudgetPassesAndStarvedBudgetFails) {
  gramline::CheckSettings settings;  // 1% flips, margin ratio 0.9
  {
    const MarginProblem p = twenty_points(1e8);
    gramline::TrialOptions o;
    o.trials = 200;
    o.svm.C = 10.0;
    const auto s = gramline::run_margin_trials(p, ideal_model(p), o);
    EXPECT_LE(s.flip_probability_max.value, 0.0);
    EXPECT_LT(s.flip_probability_max.high, 0.03);  // Wilson upper bound at 0 of 200
    EXPECT_NEAR(s.margin_ratio_median.value, 1.0, 0.02);
    EXPECT_GE(s.accuracy_median.value, 1.0);
    const gramline::Verdict v = gramline::judge(s, settings, 20);
    EXPECT_TRUE(v.pass);
    EXPECT_TRUE(v.reasons.empty());
  }
  {
    const MarginProblem p = twenty_points(5.0);
    gramline::TrialOptions o;
    o.trials = 200;
    o.svm.C = 10.0;
    const auto s = gramline::run_margin_trials(p, ideal_model(p), o);
    EXPECT_GT(s.flip_probability_max.value, 0.05);
    const gramline::Verdict v = gramline::judge(s, settings, 20);
    EXPECT_FALSE(v.pass);
    ASSERT_FALSE(v.reasons.empty());
    // The point nearest the boundary (3.9, test point 1) is among those named.
    bool named = false;
    for (const std::string& r : v.reasons) named |= r.find("test point 1 ") != std::string::npos;
    EXPECT_TRUE(named);
  }
}

TEST(Margin, ResultsDoNotDependOnTheThreadCount) {
  const MarginProblem p = twenty_points(400.0);
  const gramline::SvmModel ideal = ideal_model(p);
  gramline::TrialOptions o;
  o.trials = 60;
  o.seed = 99;
  o.svm.C = 10.0;
  o.threads = 1;
  const auto one = gramline::run_margin_trials(p, ideal, o);
  for (int threads : {2, 3, 8}) {
    o.threads = threads;
    const auto many = gramline::run_margin_trials(p, ideal, o);
    EXPECT_EQ(one.accuracy, many.accuracy);
    EXPECT_EQ(one.margin_ratio, many.margin_ratio);
    EXPECT_EQ(one.support_jaccard, many.support_jaccard);
    for (std::size_t t = 0; t < one.points.size(); ++t)
      EXPECT_EQ(one.points[t].flips, many.points[t].flips);
  }
  o.seed = 100;
  const auto other = gramline::run_margin_trials(p, ideal, o);
  EXPECT_NE(one.margin_ratio, other.margin_ratio);
}

TEST(Margin, DrawnEntriesAreUnbiasedWithThePredictedSpread) {
  // Both detection schemes, with accidentals and visibility below 1: the mean of the drawn
  // estimates is the ideal kernel (the estimator is unbiased) and the spread is the predicted
  // sigma (detection.h formulas; pass_only Poisson, both_ports binomial given the total).
  for (auto scheme :
       {gramline::DetectionScheme::both_ports, gramline::DetectionScheme::pass_only}) {
    MarginProblem p = twenty_points(2000.0);
    p.scheme = scheme;
    for (auto* noise : {&p.noise_train, &p.noise_test})
      for (EntryNoise& e : *noise) {
        e.calibration.visibility = 0.9;
        e.p_pass = 0.9 * e.p_pass + 0.1 / 4;  // depolarized, two photons
        e.calibration.accidental_pass_rate_per_s = 20.0;
        e.calibration.accidental_total_rate_per_s = 60.0;
      }
    const Eigen::MatrixXd sigma = p.sigma_test();
    const int trials = 4000;
    Eigen::MatrixXd sum = Eigen::MatrixXd::Zero(5, 20), sum_sq = Eigen::MatrixXd::Zero(5, 20);
    Eigen::MatrixXd train, test;
    for (int t = 0; t < trials; ++t) {
      gramline::draw_measured_kernels(p, gramline::stream_seed(5, t), train, test);
      sum += test;
      sum_sq += test.cwiseProduct(test);
      if (t == 0) {
        EXPECT_TRUE(train.isApprox(train.transpose()));
        EXPECT_EQ(train.diagonal(), Eigen::VectorXd::Ones(20));
      }
    }
    for (int i = 0; i < 5; ++i)
      for (int j = 0; j < 20; j += 3) {
        const double mean = sum(i, j) / trials;
        const double sd = std::sqrt(sum_sq(i, j) / trials - mean * mean);
        EXPECT_NEAR(mean, p.kernel_test(i, j), 4.5 * sigma(i, j) / std::sqrt(trials));
        EXPECT_NEAR(sd, sigma(i, j), 0.1 * sigma(i, j));
      }
  }
}

TEST(Margin, PsdRepairIsTheNearestPsdMatrix) {
  // Higham (1988): clipping negative eigenvalues gives the nearest PSD matrix in Frobenius
  // norm, at distance sqrt(sum of the squared negative eigenvalues).
  Eigen::MatrixXd k(3, 3);
  k << 1.0, 0.9, 0.1, 0.9, 1.0, 0.9, 0.1, 0.9, 1.0;
  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> before(k);
  ASSERT_LT(before.eigenvalues().minCoeff(), 0.0);
  double negative_sq = 0.0;
  for (double l : before.eigenvalues()) negative_sq += l < 0 ? l * l : 0.0;
  Eigen::MatrixXd clipped = k;
  EXPECT_TRUE(gramline::repair_psd(clipped, false));
  EXPECT_NEAR((clipped - k).norm(), std::sqrt(negative_sq), 1e-12);
  EXPECT_GE(Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd>(clipped).eigenvalues().minCoeff(),
            -1e-12);
  Eigen::MatrixXd unit = k;
  EXPECT_TRUE(gramline::repair_psd(unit, true));
  EXPECT_NEAR((unit.diagonal() - Eigen::VectorXd::Ones(3)).norm(), 0.0, 1e-12);
  EXPECT_GE(Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd>(unit).eigenvalues().minCoeff(), -1e-12);
  Eigen::MatrixXd fine = Eigen::MatrixXd::Identity(3, 3);
  EXPECT_FALSE(gramline::repair_psd(fine, true));
  EXPECT_EQ(fine, Eigen::MatrixXd::Identity(3, 3));
}

TEST(Margin, AllocationsKeepTheTotalAndFollowTheirWeights) {
  MarginProblem p = twenty_points(100.0);
  const gramline::SvmModel ideal = ideal_model(p);
  const double total = gramline::total_pairs(p);
  EXPECT_DOUBLE_EQ(total, 100.0 * (190 + 100));
  for (auto a : {gramline::Allocation::uniform, gramline::Allocation::neyman,
                 gramline::Allocation::margin_aware}) {
    gramline::allocate_pairs(p, a, ideal, total);
    EXPECT_NEAR(gramline::total_pairs(p), total, 1e-6 * total);
    EXPECT_TRUE(p.pairs_train.isApprox(p.pairs_train.transpose()));
    EXPECT_GT(p.pairs_test.minCoeff(), 0.0);
  }
  // Neyman with V = 1 and no accidentals: pairs in proportion sqrt(p (1 - p)) (Neyman 1934).
  gramline::allocate_pairs(p, gramline::Allocation::neyman, ideal, total);
  const double k1 = p.kernel_test(0, 0), k2 = p.kernel_test(0, 5);
  EXPECT_NEAR(p.pairs_test(0, 0) / p.pairs_test(0, 5),
              std::sqrt(k1 * (1 - k1)) / std::sqrt(k2 * (1 - k2)), 1e-9);
  // Margin-aware: a test row entry on a support vector gets more than one off the support set.
  gramline::allocate_pairs(p, gramline::Allocation::margin_aware, ideal, total);
  const int sv = ideal.support.front();
  int non_sv = 0;
  while (ideal.dual_coef[non_sv] != 0.0) ++non_sv;
  EXPECT_GT(p.pairs_test(1, sv) / std::sqrt(p.kernel_test(1, sv) * (1 - p.kernel_test(1, sv))),
            p.pairs_test(1, non_sv) /
                std::sqrt(p.kernel_test(1, non_sv) * (1 - p.kernel_test(1, non_sv))));
}

TEST(Margin, CancelStopsTheTrials) {
  const MarginProblem p = twenty_points(400.0);
  gramline::CancelFlag cancel{true};
  gramline::TrialOptions o;
  o.trials = 50;
  o.svm.C = 10.0;
  o.hooks.cancel = &cancel;
  EXPECT_THROW(gramline::run_margin_trials(p, ideal_model(p), o), gramline::Cancelled);
}

}  // namespace

namespace {

TEST(MarginCheck, DemoCampaignEndToEndAndTheMinimumBudgetIsTheBoundary) {
  const gramline::Campaign campaign = gramline::make_demo_campaign();
  const gramline::Plan plan = gramline::plan_campaign(campaign);
  gramline::MarginCheckOptions options;
  options.trials = 120;
  options.search_trials = 120;
  options.scale_factors = {0.5, 1.0};
  std::vector<double> progress;
  options.hooks.progress = [&](double f) { progress.push_back(f); };
  const gramline::MarginCheck check = gramline::check_margin(campaign, plan, options);

  const int n = campaign.data.train_count(), m = campaign.data.test_count();
  EXPECT_EQ(check.ideal.dual_coef.size(), n);
  EXPECT_EQ(check.decision_test.size(), m);
  EXPECT_EQ(static_cast<int>(check.trials.points.size()), m);
  EXPECT_EQ(check.trials.trials, 120);
  // docs/plan-files.md: f(x) = sum_i dual_coef_i K(x_i, x) + bias on the ideal kernel.
  const Eigen::VectorXd f = plan.kernel_test * check.ideal.dual_coef;
  for (int t = 0; t < m; ++t) EXPECT_NEAR(check.decision_test[t], f[t] + check.ideal.bias, 1e-12);
  EXPECT_EQ(check.verdict.pass, check.verdict.reasons.empty());
  ASSERT_FALSE(progress.empty());
  EXPECT_DOUBLE_EQ(progress.back(), 1.0);
  EXPECT_EQ(check.allocations.size(), 3u);
  EXPECT_EQ(check.scale_scan.size(), 2u);
  EXPECT_FALSE(check.report().empty());

  // The search's bracket holds when re-evaluated independently with the same trial seeds: the
  // budget found passes, the failing end (within the 5% step below it) fails, and a quarter of
  // it fails too.
  ASSERT_TRUE(check.minimum_uniform.found);
  gramline::MarginProblem p = gramline::make_margin_problem(campaign, plan);
  gramline::TrialOptions o;
  o.trials = 120;
  o.seed = campaign.seed;
  o.svm.C = check.C;
  o.keep_unit_diagonal = campaign.check.keep_unit_diagonal;
  auto verdict_at = [&](double pairs) {
    p.pairs_train.setConstant(pairs);
    p.pairs_train.diagonal().setZero();
    p.pairs_test.setConstant(pairs);
    return gramline::judge(gramline::run_margin_trials(p, check.ideal, o), campaign.check, n).pass;
  };
  const double found = check.minimum_uniform.pairs_per_entry;
  EXPECT_TRUE(verdict_at(found));
  const double below = check.minimum_uniform.failing_below;
  ASSERT_GT(below, 0.0);
  EXPECT_LE(found / below, 1.0 + gramline::BudgetSearchOptions{}.relative_step);
  EXPECT_FALSE(verdict_at(below));
  EXPECT_FALSE(verdict_at(found / 4));
  EXPECT_NEAR(check.minimum_uniform.integration_s,
              found * (n * (n - 1) / 2.0 + m * n) / check.pair_detect_rate_per_s, 1e-6);
}

}  // namespace

namespace {

TEST(MarginCheck, NonPositiveCIsChosenByCrossValidation) {
  gramline::Campaign campaign = gramline::make_demo_campaign();
  campaign.check.C = 0.0;
  const gramline::Plan plan = gramline::plan_campaign(campaign);
  gramline::MarginCheckOptions options;
  options.trials = 20;
  options.minimum_budget = false;
  options.compare_allocations = false;
  options.scan_scale = false;
  const gramline::MarginCheck check = gramline::check_margin(campaign, plan, options);
  EXPECT_TRUE(check.C_from_cross_validation);
  EXPECT_EQ(check.C, check.cross_validation.best_C);
  EXPECT_EQ(check.ideal.C, check.C);
  const auto& cv = check.cross_validation;
  for (double a : cv.accuracy) EXPECT_LE(a, cv.best_accuracy);
  EXPECT_EQ(cv.folds, campaign.check.cv_folds);
  EXPECT_FALSE(check.minimum_uniform.found);
  EXPECT_TRUE(check.allocations.empty());
}

}  // namespace
