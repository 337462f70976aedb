// Options validation: every options struct of the engine refuses an unusable value with a
// message that names the struct and the field (core/include/gramline/field_check.h).
#include <gtest/gtest.h>

#include <cmath>
#include <stdexcept>
#include <string>

#include "gramline/budget.h"
#include "gramline/field_check.h"
#include "gramline/gram_error.h"
#include "gramline/ingest.h"
#include "gramline/margin.h"
#include "gramline/svm.h"

namespace {

bool contains(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

template <class Options>
std::string failure_of(const Options& o) {
  try {
    o.validate();
  } catch (const std::invalid_argument& e) {
    return e.what();
  }
  return {};
}

TEST(FieldCheck, NamesTheOwnerTheFieldAndTheValue) {
  gramline::FieldCheck check("Widget");
  check.positive("width_mm", 3.0).at_least("count", -2, 0).positive("depth_mm", -1.0);
  EXPECT_FALSE(check.ok());
  // The first failing rule is reported, not a later one.
  EXPECT_EQ(check.message(), "Widget.count: must be at least 0 (got -2)");
  EXPECT_THROW(check.throw_if_failed(), std::invalid_argument);
}

TEST(FieldCheck, PassesWhenEveryRuleHolds) {
  gramline::FieldCheck check("Widget");
  check.positive("a", 1e-9)
      .at_least("b", 0.0, 0.0)
      .inside("c", 0.5, 0.0, 1.0)
      .require(true, "d", "must hold");
  EXPECT_TRUE(check.ok());
  EXPECT_NO_THROW(check.throw_if_failed());
}

TEST(FieldCheck, RejectsNotANumberAndBoundaryValues) {
  EXPECT_FALSE(gramline::FieldCheck("W").positive("x", 0.0).ok());
  EXPECT_FALSE(gramline::FieldCheck("W").positive("x", std::nan("")).ok());
  EXPECT_FALSE(gramline::FieldCheck("W").positive("x", INFINITY).ok());
  EXPECT_FALSE(gramline::FieldCheck("W").inside("x", 1.0, 0.0, 1.0).ok());
  EXPECT_FALSE(gramline::FieldCheck("W").at_least("x", std::nan(""), 0.0).ok());
  EXPECT_EQ(gramline::FieldCheck("W").require(false, "x", "must be even").message(),
            "W.x: must be even");
}

TEST(FieldCheck, EveryOptionsStructNamesItsOffendingField) {
  gramline::TrialOptions trial;
  trial.trials = 0;
  EXPECT_TRUE(contains(failure_of(trial), "TrialOptions.trials")) << failure_of(trial);
  trial = {};
  trial.confidence = 1.0;
  EXPECT_TRUE(contains(failure_of(trial), "TrialOptions.confidence"));

  gramline::MarginCheckOptions check;
  check.threads = -1;
  EXPECT_TRUE(contains(failure_of(check), "MarginCheckOptions.threads"));
  check = {};
  check.scale_factors = {1.0, 0.0};
  EXPECT_TRUE(contains(failure_of(check), "MarginCheckOptions.scale_factors"));
  check = {};
  check.budget_search.relative_step = 0.0;
  EXPECT_TRUE(contains(failure_of(check), "BudgetSearchOptions.relative_step"));

  gramline::BudgetSearchOptions search;
  search.high_pairs = 5.0;  // below low_pairs
  EXPECT_TRUE(contains(failure_of(search), "BudgetSearchOptions.high_pairs"));

  gramline::GramErrorOptions gram;
  gram.draws = -3;
  EXPECT_TRUE(contains(failure_of(gram), "GramErrorOptions.draws"));

  gramline::IngestOptions ingest;
  ingest.outlier_z = 0.0;
  EXPECT_TRUE(contains(failure_of(ingest), "IngestOptions.outlier_z"));

  gramline::SvmOptions svm;
  svm.C = -1.0;
  EXPECT_TRUE(contains(failure_of(svm), "SvmOptions.C"));

  gramline::CrossValidationOptions cv;
  cv.folds = 1;
  EXPECT_TRUE(contains(failure_of(cv), "CrossValidationOptions.folds"));
  cv = {};
  cv.C_values.clear();
  EXPECT_TRUE(contains(failure_of(cv), "CrossValidationOptions.C_values"));

  gramline::BudgetOptions budget;
  budget.epsilon = 0.0;
  EXPECT_TRUE(contains(failure_of(budget), "BudgetOptions.epsilon"));

  // Defaults are usable.
  EXPECT_EQ(failure_of(gramline::TrialOptions{}), "");
  EXPECT_EQ(failure_of(gramline::MarginCheckOptions{}), "");
  EXPECT_EQ(failure_of(gramline::GramErrorOptions{}), "");
  EXPECT_EQ(failure_of(gramline::IngestOptions{}), "");
  EXPECT_EQ(failure_of(gramline::SvmOptions{}), "");
  EXPECT_EQ(failure_of(gramline::CrossValidationOptions{}), "");
  EXPECT_EQ(failure_of(gramline::BudgetOptions{}), "");
}

TEST(FieldCheck, TheCallsThemselvesRefuseBadOptionsByField) {
  Eigen::MatrixXd k = Eigen::MatrixXd::Identity(4, 4);
  Eigen::VectorXi y(4);
  y << -1, -1, 1, 1;
  gramline::SvmOptions svm;
  svm.tolerance = 0.0;
  try {
    gramline::train_svm(k, y, svm);
    FAIL() << "expected an error";
  } catch (const std::invalid_argument& e) {
    EXPECT_TRUE(contains(e.what(), "SvmOptions.tolerance")) << e.what();
  }
  gramline::GramErrorOptions gram;
  gram.full_size_limit = 0;
  try {
    gramline::predict_gram_error(k, Eigen::MatrixXd::Zero(4, 4), gram);
    FAIL() << "expected an error";
  } catch (const std::invalid_argument& e) {
    EXPECT_TRUE(contains(e.what(), "GramErrorOptions.full_size_limit")) << e.what();
  }
}

}  // namespace
