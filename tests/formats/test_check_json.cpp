// The check JSON writer, fed a margin check built by hand so every expected value is known.
#include <gtest/gtest.h>

#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>
#include <cstdint>
#include <limits>
#include <string>

#include "formats/check_json.h"
#include "formats/limits.h"
#include "formats/text_io.h"
#include "gramline/demo.h"

namespace {

using namespace gramline;

TestPointOutcome outcome(int index, double flip_probability) {
  TestPointOutcome p;
  p.test_index = index;
  p.flip_probability = {flip_probability, flip_probability / 2, flip_probability * 2};
  p.decision_ideal = 0.25 * (index + 1);
  p.decision_sd = 0.125;
  return p;
}

MarginCheck hand_made_check() {
  MarginCheck check;
  check.C = 2.5;
  check.verdict.pass = false;
  check.verdict.reasons = {"test point 1 flips too often"};
  check.decision_test = Eigen::VectorXd(2);
  check.decision_test << 0.5, std::numeric_limits<double>::quiet_NaN();
  check.trials.trials = 40;
  check.trials.points = {outcome(0, 0.005), outcome(1, 0.2)};
  check.trials.flip_probability_max = {0.2, 0.1, 0.4};
  check.trials.margin_ratio_median = {std::numeric_limits<double>::infinity(), 0.0, 1.0};
  check.minimum_uniform.found = false;
  check.minimum_uniform.evaluations = 7;
  return check;
}

TEST(CheckJson, VerdictFailingPointsAndNonFiniteFigures) {
  const Campaign campaign = make_demo_campaign();
  ASSERT_EQ(campaign.data.train_count(), 48);
  Campaign strict = campaign;
  strict.check.flip_threshold = 0.01;
  const QJsonObject o = formats::check_json(strict, hand_made_check(), 12345, 0.9);
  EXPECT_EQ(o["verdict"].toString(), "fail");
  EXPECT_EQ(o["C"].toDouble(), 2.5);
  EXPECT_EQ(o["trials"].toInt(), 40);
  EXPECT_EQ(o["confidence"].toDouble(), 0.9);
  EXPECT_EQ(o["seed"].toString(), "12345");
  // JSON has no NaN or infinity: null instead.
  const QJsonArray decision = o["decision_test"].toArray();
  ASSERT_EQ(decision.size(), 2);
  EXPECT_EQ(decision[0].toDouble(), 0.5);
  EXPECT_TRUE(decision[1].isNull());
  EXPECT_TRUE(o["margin_ratio_median"].isNull());
  // Only the point above the threshold fails; it is numbered among all points (48 training
  // points come first).
  const QJsonArray failing = o["failing_points"].toArray();
  ASSERT_EQ(failing.size(), 1);
  EXPECT_EQ(failing[0].toObject()["test_point"].toInt(), 1);
  EXPECT_EQ(failing[0].toObject()["point"].toInt(), 49);
  EXPECT_EQ(failing[0].toObject()["flip_probability"].toDouble(), 0.2);
  const QJsonArray interval = o["flip_probability_max_interval"].toArray();
  ASSERT_EQ(interval.size(), 2);
  EXPECT_EQ(interval[0].toDouble(), 0.1);
  EXPECT_EQ(interval[1].toDouble(), 0.4);
  EXPECT_EQ(o["reasons"].toArray()[0].toString(), "test point 1 flips too often");
  // A budget search that found nothing has no figures.
  const QJsonObject budget = o["minimum_uniform_budget"].toObject();
  EXPECT_FALSE(budget["found"].toBool());
  EXPECT_TRUE(budget["pairs_per_entry"].isNull());
  EXPECT_EQ(budget["evaluations"].toInt(), 7);
}

TEST(CheckJson, SeedsBeyondDoublePrecisionSurviveAsText) {
  const std::uint64_t seed = std::numeric_limits<std::uint64_t>::max();
  const QJsonObject o = formats::check_json(make_demo_campaign(), hand_made_check(), seed, 0.95);
  EXPECT_EQ(o["seed"].toString(), "18446744073709551615");
}

TEST(CheckJson, WrittenFileIsTheFormattedText) {
  QTemporaryDir dir;
  const QString path = dir.filePath("check.json");
  const Campaign campaign = make_demo_campaign();
  const MarginCheck check = hand_made_check();
  formats::write_check_json(campaign, check, 3, 0.95, path);
  const std::string bytes = formats::read_whole_file(path, formats::limits::kSmallJsonBytes);
  EXPECT_EQ(bytes, formats::format_check_json(campaign, check, 3, 0.95));
  QJsonParseError error;
  const QJsonDocument doc = QJsonDocument::fromJson(QByteArray::fromStdString(bytes), &error);
  ASSERT_EQ(error.error, QJsonParseError::NoError);
  EXPECT_EQ(doc.object()["verdict"].toString(), "fail");
}

}  // namespace
