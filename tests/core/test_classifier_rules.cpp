// The classifier rules every part of the engine shares: the predicted label, C fixed or by
// cross-validation with one fold clamping, the classifier trained on a measured Gram matrix and
// the decision function drawn over the feature plane.
#include <gtest/gtest.h>

#include <cmath>
#include <limits>

#include "gramline/decision_grid.h"
#include "gramline/demo.h"
#include "gramline/ingest.h"
#include "gramline/kernel.h"
#include "gramline/plan.h"
#include "gramline/svm.h"

namespace gramline {
namespace {

// libsvm (svm.cpp, svm_predict_values) gives a binary vote to the first label when the decision
// value is strictly positive, else to the second; with f oriented so that f > 0 means +1, a
// value of exactly 0 is predicted -1 (from memory of the libsvm source).
TEST(PredictedLabel, LibsvmRuleSendsZeroToMinusOne) {
  EXPECT_EQ(libsvm_label(0.0), -1);
  EXPECT_EQ(libsvm_label(-0.0), -1);
  EXPECT_EQ(libsvm_label(std::numeric_limits<double>::denorm_min()), 1);
  EXPECT_EQ(libsvm_label(-std::numeric_limits<double>::denorm_min()), -1);
  EXPECT_EQ(libsvm_label(2.5), 1);
  EXPECT_EQ(libsvm_label(-2.5), -1);
}

TEST(PredictedLabel, AccuracyCountsAZeroDecisionAsMinusOne) {
  Eigen::VectorXd f(4);
  f << 0.0, 0.0, 1.0, -1.0;
  Eigen::VectorXi y(4);
  y << -1, 1, 1, -1;
  EXPECT_DOUBLE_EQ(classification_accuracy(f, y), 0.75);
  EXPECT_TRUE(std::isnan(classification_accuracy(Eigen::VectorXd(), Eigen::VectorXi())));
  EXPECT_THROW(classification_accuracy(f, Eigen::VectorXi::Ones(3)), std::invalid_argument);
}

TEST(ChoiceOfC, AFixedCIsUsedAsGivenAndOtherwiseCrossValidationChooses) {
  Eigen::MatrixXd k = Eigen::MatrixXd::Identity(6, 6);
  for (int i = 0; i < 6; ++i)
    for (int j = 0; j < 6; ++j)
      if (i != j) k(i, j) = ((i < 3) == (j < 3)) ? 0.8 : 0.1;
  Eigen::VectorXi y(6);
  y << -1, -1, -1, 1, 1, 1;
  const CChoice fixed = fixed_or_cross_validated_C(k, y, 2.5, 5, 1);
  EXPECT_EQ(fixed.C, 2.5);
  EXPECT_FALSE(fixed.from_cross_validation);
  EXPECT_TRUE(fixed.cross_validation.C_values.empty());

  const CChoice chosen = fixed_or_cross_validated_C(k, y, 0.0, 50, 3);
  EXPECT_TRUE(chosen.from_cross_validation);
  EXPECT_EQ(chosen.C, chosen.cross_validation.best_C);
  // 50 folds asked for over 6 points: one point per fold (leave-one-out) at most.
  EXPECT_EQ(chosen.cross_validation.folds, 6);
  EXPECT_EQ(cross_validation_folds(50, 6), 6);
  EXPECT_EQ(cross_validation_folds(5, 48), 5);
  EXPECT_EQ(chosen.cross_validation.seed, 3u);
  // The same folds, the same seed: the same choice.
  EXPECT_EQ(fixed_or_cross_validated_C(k, y, -1.0, 50, 3).cross_validation.accuracy,
            chosen.cross_validation.accuracy);
}

// A measured Gram matrix with a negative eigenvalue is repaired before training; the campaign's
// keep_unit_diagonal reaches the repair through IngestOptions.
TEST(MeasuredClassifier, RepairFollowsKeepUnitDiagonal) {
  const Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  IngestResult measured;
  measured.gram_measured = plan.kernel_train;
  measured.test_measured = plan.kernel_test;
  // Push two nearly identical points' entry above 1: no longer positive semidefinite.
  int a = 0, b = 1;
  for (int i = 0; i < plan.kernel_train.rows(); ++i)
    for (int j = i + 1; j < plan.kernel_train.cols(); ++j)
      if (plan.kernel_train(i, j) > plan.kernel_train(a, b)) a = i, b = j;
  measured.gram_measured(a, b) = measured.gram_measured(b, a) = 1.05;

  for (bool keep : {true, false}) {
    IngestOptions options;
    options.keep_unit_diagonal = keep;
    const MeasuredClassifier m = train_measured_classifier(c, plan, measured, options);
    ASSERT_TRUE(m.svm_trained) << m.svm_skipped_reason;
    EXPECT_TRUE(m.psd_repaired);
    EXPECT_EQ(m.keep_unit_diagonal, keep);
    Eigen::MatrixXd repaired = measured.gram_measured;
    ASSERT_TRUE(repair_psd(repaired, keep));
    SvmOptions so;
    so.C = c.check.C;
    const SvmModel expected = train_svm(repaired, c.data.train_labels, so);
    EXPECT_TRUE(m.svm.dual_coef.isApprox(expected.dual_coef, 1e-9)) << keep;
    EXPECT_EQ(m.unmeasured_train, 0);
    EXPECT_EQ(m.unmeasured_test, 0);
    // Predictions follow the libsvm rule on the measured test block.
    EXPECT_DOUBLE_EQ(m.test_accuracy, classification_accuracy(m.decision_test, c.data.test_labels));
  }
  // An unmeasured training entry: no classifier, and the report says why.
  measured.gram_measured(2, 3) = measured.gram_measured(3, 2) =
      std::numeric_limits<double>::quiet_NaN();
  const MeasuredClassifier none = train_measured_classifier(c, plan, measured);
  EXPECT_FALSE(none.svm_trained);
  EXPECT_EQ(none.unmeasured_train, 1);
  EXPECT_NE(none.report().find("No classifier"), std::string::npos);
}

TEST(DecisionGrid, SamplesTheClassifierOverThePaddedFeaturePlane) {
  const Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  SvmOptions so;
  so.C = 1.0;
  const SvmModel svm = train_svm(plan.kernel_train, c.data.train_labels, so);
  const DecisionGrid g = decision_grid(c, svm, 5);
  ASSERT_EQ(g.values.size(), 25);
  const Eigen::MatrixXd& x = c.data.train;
  EXPECT_LT(g.x_low, std::min(x.col(0).minCoeff(), c.data.test.col(0).minCoeff()));
  EXPECT_GT(g.y_high, std::max(x.col(1).maxCoeff(), c.data.test.col(1).maxCoeff()));
  // Node (row 4, column 0) is (x_low, y_high): f there is sum_i a_i K(x_i, node) + b, each
  // kernel value taken point by point through ideal_kernel.
  Eigen::VectorXd node(2);
  node << g.x_low, g.y_high;
  double f = svm.bias;
  for (int i = 0; i < x.rows(); ++i)
    f += svm.dual_coef[i] * ideal_kernel(c.encoding, x.row(i).transpose(), node);
  EXPECT_NEAR(g.values[4 * 5 + 0], f, 1e-12);
  EXPECT_THROW(decision_grid(c, svm, 1), std::invalid_argument);
}

}  // namespace
}  // namespace gramline
