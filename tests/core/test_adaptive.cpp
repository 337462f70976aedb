// Tests of the adaptive campaign's engine part (core/src/adaptive.cpp, docs/adaptive.md): the
// stop rule on kernels drawn from the counts' uncertainty, the influence of each entry on the
// test decisions, and the top-up allocation.
#include <gtest/gtest.h>

#include <boost/math/distributions/normal.hpp>
#include <cmath>
#include <numeric>

#include "gramline/adaptive.h"
#include "gramline/demo.h"
#include "gramline/ingest.h"
#include "gramline/plan.h"
#include "gramline/simulate.h"

namespace {

using gramline::KernelBelief;

// A one-dimensional Gaussian kernel exp(-(x - y)^2 / (2 w^2)): positive definite, values in
// (0, 1], unit diagonal, like a measured quantum kernel.
Eigen::MatrixXd gauss_cross(const Eigen::VectorXd& a, const Eigen::VectorXd& b, double width) {
  Eigen::MatrixXd k(a.size(), b.size());
  for (int i = 0; i < a.size(); ++i)
    for (int j = 0; j < b.size(); ++j)
      k(i, j) = std::exp(-std::pow(a[i] - b[j], 2) / (2 * width * width));
  return k;
}

struct Line {
  Eigen::VectorXd x, tx;
  Eigen::VectorXi y, ty;
};

// Twenty training points on a line, class -1 left of 4.75 and +1 right, and test points.
Line twenty_points(std::vector<double> test_x) {
  Line l;
  l.x.resize(20);
  l.y.resize(20);
  for (int i = 0; i < 20; ++i) {
    l.x[i] = 0.5 * i;
    l.y[i] = l.x[i] < 4.75 ? -1 : 1;
  }
  l.tx = Eigen::Map<Eigen::VectorXd>(test_x.data(), static_cast<int>(test_x.size()));
  l.ty.resize(l.tx.size());
  for (int t = 0; t < l.tx.size(); ++t) l.ty[t] = l.tx[t] < 4.75 ? -1 : 1;
  return l;
}

KernelBelief exact_belief(const Line& l, double width, double train_sigma, double test_sigma) {
  KernelBelief b;
  b.train_value = gauss_cross(l.x, l.x, width);
  b.train_sigma = Eigen::MatrixXd::Constant(l.x.size(), l.x.size(), train_sigma);
  b.train_sigma.diagonal().setZero();
  b.test_value = gauss_cross(l.tx, l.x, width);
  b.test_sigma = Eigen::MatrixXd::Constant(l.tx.size(), l.x.size(), test_sigma);
  return b;
}

gramline::SvmModel reference_model(const KernelBelief& b, const Line& l, double C) {
  gramline::SvmOptions o;
  o.C = C;
  return gramline::train_svm(b.train_value, l.y, o);
}

TEST(StopRule, FlipProbabilityMatchesTheGaussianClosedForm) {
  // Training kernel exact, test row drawn with sigma s per entry: the drawn decision value is
  // f0 + sum_i a_i s z_i, normal with sd s ||a||, so P(flip) = Phi(-|f0| / (s ||a||)) (a linear
  // combination of independent normals is normal; Boost.Math for Phi).
  const Line l = twenty_points({4.3});
  KernelBelief b = exact_belief(l, 1.2, 0.0, 0.0);
  const gramline::SvmModel ideal = reference_model(b, l, 10.0);
  const double f0 = ideal.decision(b.test_value)[0];
  const double z = 1.1;
  const double s = std::abs(f0) / (z * ideal.dual_coef.norm());
  b.test_sigma.setConstant(s);
  gramline::StopRuleOptions options;
  options.trials = 20000;
  options.seed = 77;
  options.C = 10.0;
  const gramline::StopRuleResult r = gramline::evaluate_stop_rule(b, l.y, l.ty, options);
  const double expected = boost::math::cdf(boost::math::normal(), -z);
  const double se = std::sqrt(expected * (1 - expected) / options.trials);
  ASSERT_EQ(r.trials.points.size(), 1u);
  EXPECT_NEAR(r.trials.points[0].flip_probability.value, expected, 4 * se);
  EXPECT_FALSE(r.stop);
  ASSERT_EQ(r.holding_points.size(), 1u);
  EXPECT_EQ(r.holding_points[0], 0);
}

TEST(StopRule, FiresFarFromTheBoundaryAndNotWithAPointOnIt) {
  const Line far = twenty_points({1.2, 2.1, 7.4, 8.8});
  gramline::StopRuleOptions options;
  options.trials = 400;
  options.seed = 5;
  options.C = 10.0;
  const gramline::StopRuleResult stable =
      gramline::evaluate_stop_rule(exact_belief(far, 1.2, 0.002, 0.002), far.y, far.ty, options);
  EXPECT_TRUE(stable.stop) << stable.report();
  EXPECT_TRUE(stable.holding_points.empty());
  EXPECT_NE(stable.report().find("decisions stable, stop"), std::string::npos);

  // The same campaign with one test point on the class boundary (4.75 sits halfway between
  // the classes): its decision is a coin toss under any noise.
  const Line on = twenty_points({1.2, 2.1, 4.75, 7.4, 8.8});
  const gramline::StopRuleResult open =
      gramline::evaluate_stop_rule(exact_belief(on, 1.2, 0.002, 0.002), on.y, on.ty, options);
  EXPECT_FALSE(open.stop);
  ASSERT_EQ(open.holding_points.size(), 1u);
  EXPECT_EQ(open.holding_points[0], 2);
}

TEST(StopRule, SameResultOnOneThreadAndOnFour) {
  const Line l = twenty_points({3.9, 4.6, 5.6});
  const KernelBelief b = exact_belief(l, 1.2, 0.01, 0.01);
  gramline::StopRuleOptions options;
  options.trials = 64;
  options.C = 10.0;
  options.threads = 1;
  const gramline::StopRuleResult one = gramline::evaluate_stop_rule(b, l.y, l.ty, options);
  options.threads = 4;
  const gramline::StopRuleResult four = gramline::evaluate_stop_rule(b, l.y, l.ty, options);
  EXPECT_EQ(one.trials.decision_trials, four.trials.decision_trials);
  EXPECT_EQ(one.influence.train, four.influence.train);
  EXPECT_EQ(one.influence.test, four.influence.test);
}

TEST(StopRule, UnmeasuredEntriesAreUnknownNotIdeal) {
  // Far from the boundary and tiny noise, but the test block has not been measured: drawn
  // anywhere in [0, 1] those entries decide nothing, so the campaign is not done.
  const Line l = twenty_points({1.2, 8.8});
  KernelBelief b = exact_belief(l, 1.2, 0.001, 0.001);
  b.test_value.setConstant(std::nan(""));
  gramline::StopRuleOptions options;
  options.trials = 400;
  options.C = 10.0;
  const gramline::StopRuleResult r = gramline::evaluate_stop_rule(b, l.y, l.ty, options);
  EXPECT_EQ(r.unmeasured_entries, 40);
  EXPECT_FALSE(r.stop);
}

TEST(DecisionDerivatives, MatchFiniteDifferencesOfARetrainedClassifier) {
  // Reference: libsvm itself. Retrain with K(i, j) = K(j, i) moved by +-h (tight tolerance) and
  // take the central difference of the test decisions; the support set does not change for a
  // small h, so the implicit derivative must agree.
  const Line l = twenty_points({3.9, 5.6, 8.1});
  const KernelBelief b = exact_belief(l, 1.2, 0.0, 0.0);
  gramline::SvmOptions o;
  o.C = 10.0;
  o.tolerance = 1e-12;
  const gramline::SvmModel model = gramline::train_svm(b.train_value, l.y, o);
  const gramline::DecisionDerivatives d(model, b.train_value, b.test_value);
  ASSERT_GE(d.free_support().size(), 2u) << "set-up: the line needs free support vectors";
  const int fi = d.free_support().front(), fj = d.free_support().back();
  for (auto [i, j] : {std::pair{fi, fj}, std::pair{fi, 6}, std::pair{fj, 12}}) {
    const double h = 1e-5;
    Eigen::MatrixXd up = b.train_value, down = b.train_value;
    up(i, j) = up(j, i) = up(i, j) + h;
    down(i, j) = down(j, i) = down(i, j) - h;
    const Eigen::VectorXd fd = (gramline::train_svm(up, l.y, o).decision(b.test_value) -
                                gramline::train_svm(down, l.y, o).decision(b.test_value)) /
                               (2 * h);
    const Eigen::VectorXd g = d.train_entry(std::min(i, j), std::max(i, j));
    // The free coefficients' equations are ill-conditioned on a smooth kernel, which magnifies
    // the solver's own tolerance in the difference: agree within 2% of the largest value.
    const double scale = fd.cwiseAbs().maxCoeff() + 1e-3;
    for (int t = 0; t < fd.size(); ++t)
      EXPECT_NEAR(g[t], fd[t], 0.02 * scale) << "entry " << i << "," << j;
  }
  // A test entry moves its own decision by the dual coefficient (the decision function).
  for (int j = 0; j < 20; ++j) EXPECT_EQ(d.test_entry(j), model.dual_coef[j]);
}

TEST(TopUp, SpendsTheRemainderAndMeetsTheLagrangeCondition) {
  // Minimising sum_e c_e / n_e (c_e = w_e^2 s_e^2) for a fixed sum of n_e with n_e >= done_e:
  // at the optimum c_e / n_e^2 is the same for every entry that is given pairs and no larger
  // for the entries left as they were (Karush-Kuhn-Tucker conditions, Boyd & Vandenberghe,
  // Convex Optimization, 2004, 5.5.3).
  const std::vector<double> done = {0, 100, 5000, 20, 0};
  const std::vector<double> weight = {1.0, 2.0, 0.5, 3.0, 0.0};
  const std::vector<double> sigma = {0.5, 0.4, 0.5, 0.3, 0.5};
  const double remaining = 3000;
  const std::vector<double> add = gramline::top_up_pairs(done, weight, sigma, remaining);
  EXPECT_NEAR(std::accumulate(add.begin(), add.end(), 0.0), remaining, 1e-6 * remaining);
  double level = -1.0;
  for (size_t e = 0; e < add.size(); ++e) {
    const double c = std::pow(weight[e] * sigma[e], 2);
    const double n = done[e] + add[e];
    if (add[e] > 0) {
      if (level < 0) level = c / (n * n);
      EXPECT_NEAR(c / (n * n), level, 1e-6 * level) << "entry " << e;
    }
  }
  ASSERT_GT(level, 0);
  EXPECT_EQ(add[2], 0.0);  // already holds far more than its share
  EXPECT_EQ(add[4], 0.0);  // weighs nothing
  for (size_t e = 0; e < add.size(); ++e)
    if (add[e] == 0 && weight[e] > 0) {
      EXPECT_LE(std::pow(weight[e] * sigma[e], 2) / (done[e] * done[e]), level * (1 + 1e-9));
    }
}

TEST(Adaptive, AfterAFirstNightPairsMoveToTheSupportVectorsRows) {
  // A seeded simulated first night of the demo that counts every entry at a quarter of its
  // planned pairs, ingested; the stop rule's influence then shares the other three quarters as
  // top-ups. Entries in the columns of the measured classifier's support vectors should get
  // more pairs than the rest: the decision function is a sum over support vectors only
  // (Vapnik, Statistical Learning Theory, 1998), so only their kernel rows move it.
  const gramline::Campaign c = gramline::make_demo_campaign();
  gramline::PlanOptions po;
  po.simulate_gram_error = false;
  const gramline::Plan plan = gramline::plan_campaign(c, po);
  std::vector<gramline::Step> quarter = plan.steps;
  for (gramline::Step& s : quarter) s.dwell_s *= 0.25;
  gramline::CountSimulationOptions so;
  so.seed = 3;
  const auto records = gramline::simulate_counts(c, quarter, so);
  const gramline::IngestResult ingest = gramline::ingest_records(c, plan, records);
  KernelBelief belief;
  belief.train_value = ingest.gram_measured;
  belief.train_sigma = ingest.gram_sigma;
  belief.test_value = ingest.test_measured;
  belief.test_sigma = ingest.test_sigma;
  ASSERT_EQ(belief.unmeasured_entries(), 0);
  const Eigen::VectorXi train_y = c.data.train_labels, test_y = c.data.test_labels;
  gramline::StopRuleOptions options;
  options.trials = 400;
  options.seed = 9;
  options.C = c.check.C > 0 ? c.check.C : 1.0;
  const gramline::StopRuleResult r = gramline::evaluate_stop_rule(belief, train_y, test_y, options);
  ASSERT_GT(r.influence.test.size(), 0);
  Eigen::MatrixXd best_train, best_test;
  belief.point_estimate(best_train, best_test);
  gramline::SvmOptions svm;
  svm.C = options.C;
  gramline::repair_psd(best_train, true);
  const gramline::SvmModel model = gramline::train_svm(best_train, train_y, svm);
  std::vector<bool> support(train_y.size(), false);
  for (int s : model.support) support[s] = true;

  // Top-ups over every entry: done = the quarter counted, remaining = the other three quarters;
  // unit sigma from the rig model (entries.h).
  const gramline::MarginProblem problem = gramline::make_margin_problem(c, plan);
  const int m = static_cast<int>(test_y.size()), n = static_cast<int>(train_y.size());
  std::vector<double> done, weight, sigma;
  std::vector<bool> on_support;
  double remaining = 0;
  auto add_entry = [&](double planned, double w, const gramline::EntryNoise& noise, bool on) {
    done.push_back(0.25 * planned);
    remaining += 0.75 * planned;
    weight.push_back(w);
    sigma.push_back(gramline::entry_sigma(problem.scheme, problem.photons, noise, 1.0));
    on_support.push_back(on);
  };
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j)
      add_entry(plan.pairs_train(i, j), r.influence.train(i, j), problem.noise_train[i * n + j],
                support[i] || support[j]);
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j)
      add_entry(plan.pairs_test(t, j), r.influence.test(t, j), problem.noise_test[t * n + j],
                support[j]);
  const std::vector<double> add = gramline::top_up_pairs(done, weight, sigma, remaining);
  double on_sum = 0, off_sum = 0;
  int on_count = 0, off_count = 0;
  for (size_t e = 0; e < add.size(); ++e) {
    (on_support[e] ? on_sum : off_sum) += add[e];
    (on_support[e] ? on_count : off_count) += 1;
  }
  ASSERT_GT(on_count, 0);
  ASSERT_GT(off_count, 0);
  EXPECT_GT(on_sum / on_count, 2.0 * off_sum / off_count);
}

}  // namespace
