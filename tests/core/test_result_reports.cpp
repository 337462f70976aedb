// Every result records the options it ran with, and its report() prints them.
#include <gtest/gtest.h>

#include <string>

#include "gramline/demo.h"
#include "gramline/gram_error.h"
#include "gramline/ingest.h"
#include "gramline/margin.h"
#include "gramline/plan.h"

namespace gramline {
namespace {

bool contains(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

MarginProblem small_problem() {
  MarginProblem p;
  const int n = 6;
  Eigen::VectorXd x(n);
  x << 0, 1, 2, 3, 4, 5;
  p.kernel_train.resize(n, n);
  for (int i = 0; i < n; ++i)
    for (int j = 0; j < n; ++j) p.kernel_train(i, j) = std::exp(-std::pow(x[i] - x[j], 2) / 4.5);
  p.kernel_test = p.kernel_train.topRows(2);
  p.train_labels.resize(n);
  p.train_labels << -1, -1, -1, 1, 1, 1;
  p.test_labels = p.train_labels.head(2);
  p.pairs_train = Eigen::MatrixXd::Constant(n, n, 500.0);
  p.pairs_train.diagonal().setZero();
  p.pairs_test = Eigen::MatrixXd::Constant(2, n, 500.0);
  EntryNoise e;
  e.p_pass = 0.5;
  e.calibration.pair_detect_rate_per_s = 100.0;
  p.noise_train.assign(n * n, e);
  p.noise_test.assign(2 * n, e);
  return p;
}

TEST(Reports, TrialSummaryPrintsTheConfidenceSeedAndThreadsItRanWith) {
  const MarginProblem p = small_problem();
  SvmOptions so;
  so.C = 3.0;
  const SvmModel ideal = train_svm(p.kernel_train, p.train_labels, so);
  TrialOptions o;
  o.trials = 30;
  o.seed = 4242;
  o.threads = 2;
  o.confidence = 0.9;
  o.keep_unit_diagonal = false;
  const TrialSummary s = run_margin_trials(p, ideal, o);
  EXPECT_EQ(s.options.seed, 4242u);
  EXPECT_EQ(s.options.confidence, 0.9);
  EXPECT_EQ(s.options.svm.C, 3.0);  // the ideal classifier's C, as the trials retrain with it
  EXPECT_EQ(s.threads_used, 2);
  const std::string r = s.report();
  EXPECT_TRUE(contains(r, "(90% intervals")) << r;
  EXPECT_FALSE(contains(r, "95%")) << r;
  EXPECT_TRUE(contains(r, "seed 4242")) << r;
  EXPECT_TRUE(contains(r, "2 thread(s)")) << r;
  EXPECT_TRUE(contains(r, "C = 3")) << r;
  EXPECT_TRUE(contains(r, "not keeping the unit diagonal")) << r;
}

TEST(Reports, MarginCheckRecordsTheResolvedOptionsAndTheSearchLimits) {
  const Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  MarginCheckOptions o;
  o.trials = 12;
  o.search_trials = 50;  // more than the trials: the trials win
  o.compare_allocations = false;
  o.scan_scale = false;
  o.budget_search.relative_step = 0.5;
  o.budget_search.low_pairs = 20.0;
  const MarginCheck check = check_margin(c, plan, o);
  EXPECT_EQ(check.options.trials, 12);
  EXPECT_EQ(check.options.seed, c.seed);  // 0 asked for: the campaign's
  EXPECT_EQ(check.options.search_trials, 12);
  EXPECT_EQ(check.options.budget_search.relative_step, 0.5);
  // The search stopped within its own step: the bracket is no wider than 1.5.
  ASSERT_TRUE(check.minimum_uniform.found);
  if (check.minimum_uniform.failing_below > 0) {
    EXPECT_LE(check.minimum_uniform.pairs_per_entry / check.minimum_uniform.failing_below, 1.5);
  }
  EXPECT_GE(check.minimum_uniform.pairs_per_entry, 20.0);
  const std::string r = check.report();
  EXPECT_TRUE(contains(r, "searched from 20 to 1e+09 pairs per entry, to within 50%")) << r;
  EXPECT_TRUE(contains(r, "seed " + std::to_string(c.seed))) << r;
}

TEST(Reports, GramErrorSaysHowItsProbabilityWasFound) {
  Eigen::MatrixXd k = Eigen::MatrixXd::Identity(3, 3);
  const Eigen::MatrixXd sigma = Eigen::MatrixXd::Constant(3, 3, 0.1);
  GramErrorOptions o;
  o.draws = 200;
  o.seed = 31;
  o.threads = 1;
  const GramError e = predict_gram_error(k, sigma, o);
  EXPECT_EQ(e.options.draws, 200);
  const std::string r = e.report();
  EXPECT_TRUE(contains(r, "200 noise draws")) << r;
  EXPECT_TRUE(contains(r, "seed 31")) << r;
  EXPECT_TRUE(contains(r, "1 thread(s)")) << r;
}

TEST(Reports, PlanAndIngestPrintTheirOptions) {
  const Campaign c = make_demo_campaign();
  PlanOptions po;
  po.seed = 99;
  po.optimize_order = false;
  const Plan plan = plan_campaign(c, po);
  ASSERT_TRUE(plan.options.has_value());
  EXPECT_EQ(plan.options->seed, 99u);
  EXPECT_TRUE(contains(plan.report(), "Options: seed 99, row-by-row motor order")) << plan.report();

  IngestOptions io;
  io.outlier_z = 3.5;
  const IngestResult r = ingest_records(c, plan, {}, io);
  EXPECT_EQ(r.options.outlier_z, 3.5);
  EXPECT_TRUE(contains(r.report(), "|z| above 3.5")) << r.report();
}

TEST(Reports, CrossValidationPrintsItsFoldSeed) {
  Eigen::MatrixXd k = Eigen::MatrixXd::Identity(6, 6);
  Eigen::VectorXi y(6);
  y << -1, 1, -1, 1, -1, 1;
  CrossValidationOptions o;
  o.folds = 3;
  o.seed = 17;
  const CrossValidationResult cv = choose_C(k, y, o);
  EXPECT_TRUE(contains(cv.report(), "3-fold")) << cv.report();
  EXPECT_TRUE(contains(cv.report(), "seeded 17")) << cv.report();
}

}  // namespace
}  // namespace gramline
