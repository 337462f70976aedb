// Files of `plan --out`: steps.json round trip and reader errors, steps.csv, kernel.csv.
#include <gtest/gtest.h>

#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <cmath>
#include <functional>
#include <sstream>
#include <string>
#include <vector>

#include "formats/input_error.h"
#include "formats/plan_files.h"
#include "formats/text_io.h"

namespace {

using namespace gramline;
using formats::InputError;

Rig two_motor_rig() {
  Rig rig;
  Motor a;
  a.name = "arm A half-wave";
  a.photon = 0;
  a.stage = Stage::prep;
  a.plate = Plate::HWP;
  a.speed_deg_per_s = 12.5;
  a.accel_deg_per_s2 = 1.0 / 3.0;
  a.range = TravelRange{-10.0, 350.0};
  a.backlash = Backlash::from_below;
  a.overshoot_deg = 1.25;
  a.initial_deg = 0.1;
  a.retardance_error_deg = -2.0 / 3.0;
  a.axis_offset_sd_deg = 0.25;
  a.repeatability_sd_deg = 0.02;
  Motor b;
  b.name = "B,quarter";  // a comma: steps.csv must quote the column name
  b.photon = 1;
  b.stage = Stage::analysis;
  b.plate = Plate::QWP;
  b.speed_deg_per_s = 20.0;
  b.accel_deg_per_s2 = 45.0;
  rig.motors = {a, b};
  rig.controller = Controller{MoveMode::sequential, 0.45, 0.05};
  return rig;
}

std::vector<Step> three_steps() {
  Step dark;
  dark.kind = StepKind::dark;
  dark.block = Block::none;
  dark.position_deg = {0.1, 0.0};
  dark.dwell_s = 30.0;
  dark.move_s = 0.05;
  Step train;
  train.kind = StepKind::measure;
  train.block = Block::train;
  train.prep_point = 0;
  train.analysis_point = 5;
  train.position_deg = {1.0 / 3.0, -179.99999999999997};
  train.kernel_ideal = 0.8123456789012345;
  train.kernel_rig = 0.8123456789012345 - 1.0 / 3e3;
  train.p_pass = 0.79;
  train.pairs = 5200.5;
  train.dwell_s = 2.6;
  train.move_s = 1.9;
  train.start_s = 30.05;
  Step test = train;
  test.block = Block::test;
  test.prep_point = 7;
  test.analysis_point = 2;
  test.start_s = 1e5 + 0.1;
  test.night = 2;
  return {dark, train, test};
}

TEST(StepsJson, WriteThenReadGivesTheSameRigAndSteps) {
  const Rig rig = two_motor_rig();
  const std::vector<Step> steps = three_steps();
  const formats::StepsFile back =
      formats::parse_steps_json(formats::format_steps_json(rig, steps), "steps.json");
  EXPECT_EQ(back.conventions, formats::steps_conventions_text());
  ASSERT_EQ(back.rig.motors.size(), 2u);
  for (size_t m = 0; m < 2; ++m) {
    const Motor& x = rig.motors[m];
    const Motor& y = back.rig.motors[m];
    EXPECT_EQ(x.name, y.name);
    EXPECT_EQ(x.photon, y.photon);
    EXPECT_EQ(x.stage, y.stage);
    EXPECT_EQ(x.plate, y.plate);
    EXPECT_EQ(x.speed_deg_per_s, y.speed_deg_per_s);
    EXPECT_EQ(x.accel_deg_per_s2, y.accel_deg_per_s2);
    EXPECT_EQ(x.range.has_value(), y.range.has_value());
    EXPECT_EQ(x.backlash, y.backlash);
    EXPECT_EQ(x.overshoot_deg, y.overshoot_deg);
    EXPECT_EQ(x.initial_deg, y.initial_deg);
    EXPECT_EQ(x.retardance_error_deg, y.retardance_error_deg);
    EXPECT_EQ(x.axis_offset_sd_deg, y.axis_offset_sd_deg);
    EXPECT_EQ(x.repeatability_sd_deg, y.repeatability_sd_deg);
  }
  EXPECT_EQ(back.rig.motors[0].range->low_deg, -10.0);
  EXPECT_EQ(back.rig.motors[0].range->high_deg, 350.0);
  EXPECT_EQ(back.rig.controller.moves, MoveMode::sequential);
  EXPECT_EQ(back.rig.controller.settle_s, 0.45);
  EXPECT_EQ(back.rig.controller.overhead_s, 0.05);
  ASSERT_EQ(back.steps.size(), steps.size());
  for (size_t i = 0; i < steps.size(); ++i) {
    const Step& x = steps[i];
    const Step& y = back.steps[i];
    EXPECT_EQ(x.kind, y.kind);
    EXPECT_EQ(x.block, y.block);
    EXPECT_EQ(x.prep_point, y.prep_point);
    EXPECT_EQ(x.analysis_point, y.analysis_point);
    EXPECT_EQ(x.position_deg, y.position_deg);
    EXPECT_EQ(x.kernel_ideal, y.kernel_ideal);
    EXPECT_EQ(x.kernel_rig, y.kernel_rig);
    EXPECT_EQ(x.p_pass, y.p_pass);
    EXPECT_EQ(x.pairs, y.pairs);
    EXPECT_EQ(x.dwell_s, y.dwell_s);
    EXPECT_EQ(x.move_s, y.move_s);
    EXPECT_EQ(x.start_s, y.start_s);
    EXPECT_EQ(x.night, y.night);
  }
}

TEST(StepsJson, FollowsTheDocumentedLayout) {
  const QJsonObject root =
      QJsonDocument::fromJson(
          QByteArray::fromStdString(formats::format_steps_json(two_motor_rig(), three_steps())))
          .object();
  EXPECT_EQ(root["format"].toString(), "gramline-steps");
  EXPECT_EQ(root["version"].toInt(), 1);
  EXPECT_EQ(root["controller"].toObject()["moves"].toString(), "sequential");
  const QJsonObject motor = root["motors"].toArray()[0].toObject();
  EXPECT_EQ(motor["stage"].toString(), "prep");
  EXPECT_EQ(motor["plate"].toString(), "HWP");
  EXPECT_EQ(motor["backlash"].toString(), "from-below");  // docs/motion-model.md spelling
  EXPECT_TRUE(root["motors"].toArray()[1].toObject()["range_deg"].isNull());
  const QJsonArray steps = root["steps"].toArray();
  EXPECT_TRUE(steps[0].toObject()["prep_point"].isNull());
  EXPECT_TRUE(steps[0].toObject()["analysis_point"].isNull());
  EXPECT_EQ(steps[0].toObject()["kind"].toString(), "dark");
  EXPECT_EQ(steps[0].toObject()["block"].toString(), "none");
  EXPECT_EQ(steps[2].toObject()["index"].toInt(), 2);
  EXPECT_EQ(steps[2].toObject()["position_deg"].toObject()["B,quarter"].toDouble(),
            -179.99999999999997);
}

std::string steps_error(const std::function<void(QJsonObject&)>& spoil) {
  QJsonObject root = QJsonDocument::fromJson(QByteArray::fromStdString(formats::format_steps_json(
                                                 two_motor_rig(), three_steps())))
                         .object();
  spoil(root);
  try {
    formats::parse_steps_json(QJsonDocument(root).toJson().toStdString(), "s.json");
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

void edit_step(QJsonObject& root, int index, const std::function<void(QJsonObject&)>& edit) {
  QJsonArray steps = root["steps"].toArray();
  QJsonObject step = steps[index].toObject();
  edit(step);
  steps[index] = step;
  root["steps"] = steps;
}

TEST(StepsJson, ReaderErrorsNameTheFieldPath) {
  EXPECT_EQ(steps_error([](QJsonObject& r) {
              edit_step(r, 1, [](QJsonObject& s) {
                QJsonObject p = s["position_deg"].toObject();
                p.remove("B,quarter");
                s["position_deg"] = p;
              });
            }),
            "s.json: steps[1].position_deg.B,quarter: missing (required)");
  EXPECT_NE(steps_error([](QJsonObject& r) {
              edit_step(r, 2, [](QJsonObject& s) {
                QJsonObject p = s["position_deg"].toObject();
                p["C"] = 3.0;
                s["position_deg"] = p;
              });
            }).find("s.json: steps[2].position_deg: 'C' is not a motor"),
            std::string::npos);
  EXPECT_NE(steps_error([](QJsonObject& r) {
              edit_step(r, 2, [](QJsonObject& s) { s["index"] = 5; });
            }).find("s.json: steps[2].index:"),
            std::string::npos);
  EXPECT_EQ(steps_error([](QJsonObject& r) {
              edit_step(r, 0, [](QJsonObject& s) { s["kind"] = "wait"; });
            }).rfind("s.json: steps[0].kind: 'wait' is not one of", 0),
            0u);
  EXPECT_NE(steps_error([](QJsonObject& r) { r["version"] = 3; }).find("s.json: version:"),
            std::string::npos);
  EXPECT_EQ(steps_error([](QJsonObject& r) {
              QJsonArray motors = r["motors"].toArray();
              QJsonObject m = motors[0].toObject();
              m["accel_deg_per_s2"] = QJsonValue::Null;
              motors[0] = m;
              r["motors"] = motors;
            }),
            "s.json: motors[0].accel_deg_per_s2: expected a number (found null)");
}

std::vector<std::string> split(const std::string& line) {
  // Fields of one CSV line; quoted fields may hold commas (no doubled quotes in these tests).
  std::vector<std::string> out;
  std::string field;
  bool quoted = false;
  for (char c : line) {
    if (c == '"') {
      quoted = !quoted;
    } else if (c == ',' && !quoted) {
      out.push_back(field);
      field.clear();
    } else {
      field += c;
    }
  }
  out.push_back(field);
  return out;
}

TEST(StepsCsv, OneRowPerStepOneColumnPerMotorUnitsInHeader) {
  const std::string text = formats::format_steps_csv(two_motor_rig(), three_steps());
  std::istringstream in(text);
  std::string line;
  std::vector<std::vector<std::string>> rows;
  while (std::getline(in, line)) rows.push_back(split(line));
  ASSERT_EQ(rows.size(), 4u);
  const std::vector<std::string> header = rows[0];
  EXPECT_EQ(header, (std::vector<std::string>{
                        "index", "kind", "block", "prep_point", "analysis_point",
                        "arm A half-wave_deg", "B,quarter_deg", "kernel_ideal", "kernel_rig",
                        "p_pass", "pairs", "dwell_s", "move_s", "start_s", "night"}));
  for (size_t r = 1; r < rows.size(); ++r) EXPECT_EQ(rows[r].size(), header.size());
  EXPECT_EQ(rows[1][3], "");  // null prep_point
  EXPECT_EQ(rows[2][3], "0");
  EXPECT_EQ(rows[2][4], "5");
  EXPECT_EQ(std::stod(rows[2][5]), 1.0 / 3.0);
  EXPECT_EQ(std::stod(rows[2][6]), -179.99999999999997);
  EXPECT_EQ(rows[3][14], "2");
  EXPECT_EQ(std::stod(rows[3][13]), 1e5 + 0.1);
}

TEST(KernelCsv, NoHeaderCommaSeparatedAtLeastFifteenDigits) {
  Eigen::MatrixXd k(2, 2);
  k << 1.0, 0.1234567890123456789, 0.1234567890123456789, 1.0 / 3.0;
  const std::string text = formats::format_kernel_csv(k);
  std::istringstream in(text);
  std::string line;
  std::vector<std::vector<std::string>> rows;
  while (std::getline(in, line)) rows.push_back(split(line));
  ASSERT_EQ(rows.size(), 2u);
  ASSERT_EQ(rows[1].size(), 2u);
  EXPECT_EQ(std::stod(rows[0][1]), k(0, 1));
  EXPECT_EQ(std::stod(rows[1][1]), k(1, 1));
  // 1/3 needs 17 digits to read back exactly; at least 15 are asked for.
  EXPECT_GE(rows[1][1].size(), 17u);
}

}  // namespace
