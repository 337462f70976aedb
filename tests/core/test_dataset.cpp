// DataSet invariants (dataset.h): validate() accepts a good set and names the offending point
// and feature otherwise.
#include <gtest/gtest.h>

#include <limits>
#include <string>

#include "gramline/dataset.h"

namespace {

using gramline::DataSet;

// Six training points (three per class) and two test points, features "alpha" and "beta".
DataSet good_set() {
  DataSet d;
  d.feature_names = {"alpha", "beta"};
  d.train.resize(6, 2);
  d.train << 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0, 1.1, 1.2;
  d.train_labels.resize(6);
  d.train_labels << 1, -1, 1, -1, 1, -1;
  d.test.resize(2, 2);
  d.test << 0.15, 0.25, 0.35, 0.45;
  d.test_labels.resize(2);
  d.test_labels << 1, -1;
  return d;
}

bool contains(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

// The message names point `index` (0-based in our data), in either 0- or 1-based counting.
bool names_point(const std::string& msg, int index) {
  return contains(msg, std::to_string(index)) || contains(msg, std::to_string(index + 1));
}

// The message names feature `index` by its name or as "feature <index>" (0- or 1-based).
bool names_feature(const std::string& msg, const std::string& name, int index) {
  return contains(msg, name) || contains(msg, "feature " + std::to_string(index)) ||
         contains(msg, "feature " + std::to_string(index + 1));
}

TEST(DataSet, GoodSetIsValid) {
  const DataSet d = good_set();
  EXPECT_EQ(gramline::validate(d), "");
  EXPECT_EQ(d.train_count(), 6);
  EXPECT_EQ(d.test_count(), 2);
  EXPECT_EQ(d.feature_count(), 2);
}

// docs/plan-files.md: training points first in file order, then test points.
TEST(DataSet, PointIndexesTrainingThenTest) {
  const DataSet d = good_set();
  EXPECT_EQ(d.point(0), d.train.row(0).transpose());
  EXPECT_EQ(d.point(5), d.train.row(5).transpose());
  EXPECT_EQ(d.point(6), d.test.row(0).transpose());
  EXPECT_EQ(d.point(7), d.test.row(1).transpose());
}

TEST(DataSet, SingleClassIsRejected) {
  DataSet d = good_set();
  d.train_labels.setConstant(1);
  EXPECT_NE(gramline::validate(d), "");
  d.train_labels.setConstant(-1);
  EXPECT_NE(gramline::validate(d), "");
  // Both classes present only among test points is still a single training class.
  d.test_labels << 1, -1;
  EXPECT_NE(gramline::validate(d), "");
}

TEST(DataSet, BadLabelNamesThePoint) {
  DataSet d = good_set();
  d.train_labels(3) = 2;
  const std::string msg = gramline::validate(d);
  EXPECT_NE(msg, "");
  EXPECT_TRUE(names_point(msg, 3)) << msg;

  DataSet t = good_set();
  t.test_labels(1) = 0;
  EXPECT_NE(gramline::validate(t), "");
}

TEST(DataSet, NonFiniteFeatureNamesPointAndFeature) {
  for (double bad :
       {std::numeric_limits<double>::quiet_NaN(), std::numeric_limits<double>::infinity(),
        -std::numeric_limits<double>::infinity()}) {
    DataSet d = good_set();
    d.train(4, 1) = bad;
    const std::string msg = gramline::validate(d);
    EXPECT_NE(msg, "");
    EXPECT_TRUE(names_point(msg, 4)) << msg;
    EXPECT_TRUE(names_feature(msg, "beta", 1)) << msg;

    DataSet t = good_set();
    t.test(1, 0) = bad;
    const std::string tmsg = gramline::validate(t);
    EXPECT_NE(tmsg, "");
    // Test point 1 is global point 7 (training points first, docs/plan-files.md).
    EXPECT_TRUE(names_point(tmsg, 1) || names_point(tmsg, 7)) << tmsg;
    EXPECT_TRUE(names_feature(tmsg, "alpha", 0)) << tmsg;
  }
}

TEST(DataSet, DuplicateTrainingPointsNamed) {
  DataSet d = good_set();
  d.train.row(4) = d.train.row(1);
  const std::string msg = gramline::validate(d);
  EXPECT_NE(msg, "");
  EXPECT_TRUE(names_point(msg, 4) || names_point(msg, 1)) << msg;
  // Same features with the same label are duplicates as well.
  DataSet same = good_set();
  same.train.row(2) = same.train.row(0);
  EXPECT_NE(gramline::validate(same), "");
}

// A test point equal to a training point is legitimate (it is a question, not a duplicate).
TEST(DataSet, TestPointEqualToTrainingPointIsAllowed) {
  DataSet d = good_set();
  d.test.row(0) = d.train.row(2);
  EXPECT_EQ(gramline::validate(d), "");
}

TEST(DataSet, RaggedWidthsRejected) {
  DataSet d = good_set();
  d.test.resize(2, 3);
  d.test.setConstant(0.5);
  EXPECT_NE(gramline::validate(d), "");

  DataSet names = good_set();
  names.feature_names = {"alpha"};
  EXPECT_NE(gramline::validate(names), "");

  DataSet labels = good_set();
  labels.train_labels.resize(5);
  labels.train_labels << 1, -1, 1, -1, 1;
  EXPECT_NE(gramline::validate(labels), "");

  DataSet test_labels = good_set();
  test_labels.test_labels.resize(1);
  test_labels.test_labels << 1;
  EXPECT_NE(gramline::validate(test_labels), "");
}

TEST(DataSet, EmptyTrainingSetRejected) {
  DataSet d = good_set();
  d.train.resize(0, 2);
  d.train_labels.resize(0);
  EXPECT_NE(gramline::validate(d), "");
}

}  // namespace
