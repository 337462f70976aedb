// Campaign file: save then load gives the same campaign; bad files name the field path.
#include <gtest/gtest.h>

#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>
#include <cmath>
#include <limits>
#include <string>

#include "formats/campaign_json.h"
#include "formats/input_error.h"
#include "gramline/demo.h"

namespace {

using namespace gramline;
using formats::InputError;

/// A campaign whose every field differs from its default, with doubles that need all 17 digits.
Campaign awkward_campaign() {
  Campaign c;
  c.name = "awkward \"quoted\" name, ünïcode";
  c.notes = "line one\nline two";
  c.seed = (std::uint64_t{1} << 60) + 3;  // above 2^53: must not pass through a double
  c.data.feature_names = {"f0", "f1", "f2"};
  c.data.positive_name = "up";
  c.data.negative_name = "down";
  c.data.train.resize(3, 3);
  c.data.train << 0.1, 1.0 / 3.0, -1e-300, 2.0 / 3.0, 5e-324, 1e300, std::nextafter(1.0, 2.0), -0.0,
      12345.678901234567;
  c.data.train_labels.resize(3);
  c.data.train_labels << 1, -1, -1;
  c.data.test.resize(2, 3);
  c.data.test << 0.7, 0.8, 0.9, 3.14159265358979, 2.718281828459045, -1.5;
  c.data.test_labels.resize(2);
  c.data.test_labels << -1, 1;
  c.encoding.preset = EncodingPreset::custom;
  for (int p = 0; p < 3; ++p) {
    PhotonEncoding e;
    e.theta_weights_deg = Eigen::Vector3d(180.0 / 7.0 + p, 0.3, -0.1 * p);
    e.theta_offset_deg = 1.0 / 7.0 + p;
    e.phi_weights_deg = Eigen::Vector3d(0.0, 360.0 / 11.0, 2.0 * p);
    e.phi_offset_deg = -10.0 / 3.0;
    c.encoding.photons.push_back(e);
  }
  for (int p = 0; p < 3; ++p) {
    for (Stage s : {Stage::prep, Stage::analysis}) {
      for (Plate plate : {Plate::HWP, Plate::QWP}) {
        Motor m;
        m.name = "m" + std::to_string(c.rig.motors.size());
        m.photon = p;
        m.stage = s;
        m.plate = plate;
        m.speed_deg_per_s = 12.345678901234567 + static_cast<double>(c.rig.motors.size());
        m.accel_deg_per_s2 = 29.999999999999996;
        if (c.rig.motors.size() % 2 == 0) m.range = TravelRange{-170.25, 170.0 + 1.0 / 3.0};
        m.backlash = c.rig.motors.size() % 3 == 0 ? Backlash::from_below : Backlash::shortest;
        m.overshoot_deg = 2.0 / 3.0;
        m.initial_deg = -0.1 * static_cast<double>(c.rig.motors.size());
        m.retardance_error_deg = -1.0 / 3.0 + static_cast<double>(c.rig.motors.size()) / 7.0;
        m.axis_offset_sd_deg = 0.1 + 1.0 / 30.0;
        m.repeatability_sd_deg = 0.01 / 3.0;
        c.rig.motors.push_back(m);
      }
    }
    c.rig.detectors.push_back(Detector{0.1 + 0.01 * p, 123.456 + p, 0.001 / 3.0 + 0.01 * p});
  }
  c.rig.controller = Controller{MoveMode::sequential, 0.7000000000000001, 0.12345};
  c.rig.source = Source{76543.21, 0.9731};
  c.rig.coincidence_window_s = 1.7e-9;
  c.rig.scheme = DetectionScheme::pass_only;
  c.rig.compensate_plates = false;
  c.precision.budget = BudgetOptions{BudgetMethod::hoeffding, 0.0123, 0.987, true};
  c.precision.fixed_pairs = 4321.5;
  c.precision.allocation = Allocation::neyman;
  c.nights.first_date = "2027-02-28";
  c.nights.start_min = 21 * 60 + 7;
  c.nights.end_min = 5 * 60 + 59;
  c.nights.max_nights = 11;
  c.schedule = ScheduleSettings{12.5, 999.0, 0.25, false, 17.25, false, true, true, 3.5, 54321};
  c.check = CheckSettings{2.5, 7, 0.025, 0.85, false, 321};
  return c;
}

void expect_same_matrix(const Eigen::MatrixXd& a, const Eigen::MatrixXd& b, const char* what) {
  ASSERT_EQ(a.rows(), b.rows()) << what;
  ASSERT_EQ(a.cols(), b.cols()) << what;
  for (long i = 0; i < a.rows(); ++i) {
    for (long j = 0; j < a.cols(); ++j) {
      // The sign of a zero is not kept (Qt reads "-0" as the integer 0) and means nothing here.
      EXPECT_EQ(a(i, j), b(i, j)) << what << "(" << i << "," << j << ")";
    }
  }
}

void expect_same_campaign(const Campaign& a, const Campaign& b) {
  EXPECT_EQ(a.name, b.name);
  EXPECT_EQ(a.notes, b.notes);
  EXPECT_EQ(a.seed, b.seed);
  EXPECT_EQ(a.data.feature_names, b.data.feature_names);
  EXPECT_EQ(a.data.positive_name, b.data.positive_name);
  EXPECT_EQ(a.data.negative_name, b.data.negative_name);
  expect_same_matrix(a.data.train, b.data.train, "train");
  expect_same_matrix(a.data.test, b.data.test, "test");
  EXPECT_EQ(a.data.train_labels, b.data.train_labels);
  EXPECT_EQ(a.data.test_labels, b.data.test_labels);
  EXPECT_EQ(a.encoding.preset, b.encoding.preset);
  ASSERT_EQ(a.encoding.photons.size(), b.encoding.photons.size());
  for (size_t p = 0; p < a.encoding.photons.size(); ++p) {
    const PhotonEncoding& x = a.encoding.photons[p];
    const PhotonEncoding& y = b.encoding.photons[p];
    expect_same_matrix(x.theta_weights_deg, y.theta_weights_deg, "theta weights");
    expect_same_matrix(x.phi_weights_deg, y.phi_weights_deg, "phi weights");
    EXPECT_EQ(x.theta_offset_deg, y.theta_offset_deg);
    EXPECT_EQ(x.phi_offset_deg, y.phi_offset_deg);
  }
  ASSERT_EQ(a.rig.motors.size(), b.rig.motors.size());
  for (size_t m = 0; m < a.rig.motors.size(); ++m) {
    const Motor& x = a.rig.motors[m];
    const Motor& y = b.rig.motors[m];
    EXPECT_EQ(x.name, y.name);
    EXPECT_EQ(x.photon, y.photon);
    EXPECT_EQ(x.stage, y.stage);
    EXPECT_EQ(x.plate, y.plate);
    EXPECT_EQ(x.speed_deg_per_s, y.speed_deg_per_s);
    EXPECT_EQ(x.accel_deg_per_s2, y.accel_deg_per_s2);
    ASSERT_EQ(x.range.has_value(), y.range.has_value()) << x.name;
    if (x.range) {
      EXPECT_EQ(x.range->low_deg, y.range->low_deg);
      EXPECT_EQ(x.range->high_deg, y.range->high_deg);
    }
    EXPECT_EQ(x.backlash, y.backlash);
    EXPECT_EQ(x.overshoot_deg, y.overshoot_deg);
    EXPECT_EQ(x.initial_deg, y.initial_deg);
    EXPECT_EQ(x.retardance_error_deg, y.retardance_error_deg);
    EXPECT_EQ(x.axis_offset_sd_deg, y.axis_offset_sd_deg);
    EXPECT_EQ(x.repeatability_sd_deg, y.repeatability_sd_deg);
  }
  EXPECT_EQ(a.rig.compensate_plates, b.rig.compensate_plates);
  EXPECT_EQ(a.rig.controller.moves, b.rig.controller.moves);
  EXPECT_EQ(a.rig.controller.settle_s, b.rig.controller.settle_s);
  EXPECT_EQ(a.rig.controller.overhead_s, b.rig.controller.overhead_s);
  EXPECT_EQ(a.rig.source.pair_rate_per_s, b.rig.source.pair_rate_per_s);
  EXPECT_EQ(a.rig.source.visibility, b.rig.source.visibility);
  ASSERT_EQ(a.rig.detectors.size(), b.rig.detectors.size());
  for (size_t d = 0; d < a.rig.detectors.size(); ++d) {
    EXPECT_EQ(a.rig.detectors[d].efficiency, b.rig.detectors[d].efficiency);
    EXPECT_EQ(a.rig.detectors[d].dark_rate_per_s, b.rig.detectors[d].dark_rate_per_s);
    EXPECT_EQ(a.rig.detectors[d].pbs_leakage, b.rig.detectors[d].pbs_leakage);
  }
  EXPECT_EQ(a.rig.coincidence_window_s, b.rig.coincidence_window_s);
  EXPECT_EQ(a.rig.scheme, b.rig.scheme);
  EXPECT_EQ(a.precision.budget.method, b.precision.budget.method);
  EXPECT_EQ(a.precision.budget.epsilon, b.precision.budget.epsilon);
  EXPECT_EQ(a.precision.budget.confidence, b.precision.budget.confidence);
  EXPECT_EQ(a.precision.budget.worst_case, b.precision.budget.worst_case);
  EXPECT_EQ(a.precision.fixed_pairs, b.precision.fixed_pairs);
  EXPECT_EQ(a.precision.allocation, b.precision.allocation);
  EXPECT_EQ(a.nights.first_date, b.nights.first_date);
  EXPECT_EQ(a.nights.start_min, b.nights.start_min);
  EXPECT_EQ(a.nights.end_min, b.nights.end_min);
  EXPECT_EQ(a.nights.max_nights, b.nights.max_nights);
  EXPECT_EQ(a.schedule.reference_interval_min, b.schedule.reference_interval_min);
  EXPECT_EQ(a.schedule.reference_pairs, b.schedule.reference_pairs);
  EXPECT_EQ(a.schedule.calibration_share, b.schedule.calibration_share);
  EXPECT_EQ(a.schedule.dark_steps, b.schedule.dark_steps);
  EXPECT_EQ(a.schedule.dark_dwell_s, b.schedule.dark_dwell_s);
  EXPECT_EQ(a.schedule.park, b.schedule.park);
  EXPECT_EQ(a.schedule.fit_to_nights, b.schedule.fit_to_nights);
  EXPECT_EQ(a.schedule.truncation_safe, b.schedule.truncation_safe);
  EXPECT_EQ(a.schedule.optimizer_time_cap_s, b.schedule.optimizer_time_cap_s);
  EXPECT_EQ(a.schedule.search_evaluations, b.schedule.search_evaluations);
  EXPECT_EQ(a.check.C, b.check.C);
  EXPECT_EQ(a.check.cv_folds, b.check.cv_folds);
  EXPECT_EQ(a.check.flip_threshold, b.check.flip_threshold);
  EXPECT_EQ(a.check.margin_ratio_threshold, b.check.margin_ratio_threshold);
  EXPECT_EQ(a.check.keep_unit_diagonal, b.check.keep_unit_diagonal);
  EXPECT_EQ(a.check.trials, b.check.trials);
}

TEST(CampaignJson, SaveThenLoadGivesTheSameCampaignFieldByField) {
  QTemporaryDir dir;
  ASSERT_TRUE(dir.isValid());
  const QString path = dir.filePath("awkward.gramline.json");
  const Campaign original = awkward_campaign();
  formats::save_campaign(original, path);
  const Campaign loaded = formats::load_campaign(path);
  expect_same_campaign(original, loaded);
}

TEST(CampaignJson, DemoCampaignSurvivesTheRoundTrip) {
  const Campaign demo = make_demo_campaign();
  expect_same_campaign(demo, formats::parse_campaign(formats::format_campaign(demo), "demo"));
}

TEST(CampaignJson, KeysCarryUnitsAndClockTimes) {
  const std::string text = formats::format_campaign(awkward_campaign());
  for (const char* key : {"\"speed_deg_per_s\"", "\"accel_deg_per_s2\"", "\"range_deg\"",
                          "\"overshoot_deg\"", "\"initial_deg\"", "\"settle_s\"", "\"overhead_s\"",
                          "\"pair_rate_per_s\"", "\"dark_rate_per_s\"", "\"coincidence_window_s\"",
                          "\"reference_interval_min\"", "\"dark_dwell_s\"", "\"first_date\"",
                          "\"max_nights\"", "\"epsilon\"", "\"confidence\"", "\"method\""}) {
    EXPECT_NE(text.find(key), std::string::npos) << key;
  }
  EXPECT_NE(text.find("\"21:07\""), std::string::npos);
  EXPECT_NE(text.find("\"05:59\""), std::string::npos);
  EXPECT_NE(text.find("\"gramline-campaign\""), std::string::npos);
}

TEST(CampaignJson, ClockTextAndBack) {
  int minutes = -1;
  EXPECT_TRUE(formats::parse_clock("00:00", minutes));
  EXPECT_EQ(minutes, 0);
  EXPECT_TRUE(formats::parse_clock("23:59", minutes));
  EXPECT_EQ(minutes, 23 * 60 + 59);
  EXPECT_FALSE(formats::parse_clock("24:00", minutes));
  EXPECT_FALSE(formats::parse_clock("7:30", minutes));
  EXPECT_FALSE(formats::parse_clock("07:60", minutes));
  EXPECT_EQ(formats::clock_text(20 * 60 + 5), "20:05");
}

/// Message of loading a JSON object as a campaign named "bad.json", or "" if it loaded.
std::string load_error(const QJsonObject& object) {
  const QByteArray bytes = QJsonDocument(object).toJson();
  try {
    formats::parse_campaign(bytes.toStdString(), "bad.json");
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

std::string text_error(const std::string& text) {
  try {
    formats::parse_campaign(text, "bad.json");
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

QJsonObject good_object() { return formats::campaign_to_json(awkward_campaign()); }

TEST(CampaignJson, WrongTypeNamesTheFieldPath) {
  QJsonObject root = good_object();
  QJsonObject rig = root["rig"].toObject();
  QJsonArray motors = rig["motors"].toArray();
  QJsonObject motor = motors[3].toObject();
  motor["speed_deg_per_s"] = "fast";
  motors[3] = motor;
  rig["motors"] = motors;
  root["rig"] = rig;
  EXPECT_EQ(load_error(root),
            "bad.json: rig.motors[3].speed_deg_per_s: expected a number (found a string)");
}

TEST(CampaignJson, MissingFieldNamesTheFieldPath) {
  QJsonObject root = good_object();
  QJsonObject nights = root["nights"].toObject();
  nights.remove("start");
  root["nights"] = nights;
  EXPECT_EQ(load_error(root), "bad.json: nights.start: missing (required)");

  QJsonObject root2 = good_object();
  root2.remove("rig");
  EXPECT_EQ(load_error(root2), "bad.json: rig: missing (required)");
}

TEST(CampaignJson, NestedArrayErrorsNameTheElement) {
  QJsonObject root = good_object();
  QJsonObject data = root["data"].toObject();
  QJsonArray points = data["points"].toArray();
  QJsonObject point = points[2].toObject();
  point["features"] = QJsonArray{1.0, 2.0};  // three features expected
  points[2] = point;
  data["points"] = points;
  root["data"] = data;
  const std::string m = load_error(root);
  EXPECT_NE(m.find("bad.json: data.points[2].features: expected 3 numbers"), std::string::npos)
      << m;
}

TEST(CampaignJson, BadEnumTextListsTheChoices) {
  QJsonObject root = good_object();
  QJsonObject rig = root["rig"].toObject();
  QJsonObject controller = rig["controller"].toObject();
  controller["moves"] = "all-at-once";
  rig["controller"] = controller;
  root["rig"] = rig;
  const std::string m = load_error(root);
  EXPECT_NE(m.find("bad.json: rig.controller.moves: 'all-at-once' is not one of"),
            std::string::npos)
      << m;
}

TEST(CampaignJson, NewerVersionIsRefusedNamingTheVersionField) {
  QJsonObject root = good_object();
  root["version"] = 2;
  const std::string m = load_error(root);
  EXPECT_NE(m.find("bad.json: version:"), std::string::npos) << m;
  EXPECT_NE(m.find("newer"), std::string::npos) << m;
}

TEST(CampaignJson, OtherFormatIsRefused) {
  QJsonObject root = good_object();
  root["format"] = "gramline-steps";
  EXPECT_NE(load_error(root).find("bad.json: format:"), std::string::npos);
}

TEST(CampaignJson, BadClockDateIntegerAndLabel) {
  QJsonObject root = good_object();
  QJsonObject nights = root["nights"].toObject();
  nights["end"] = "25:00";
  root["nights"] = nights;
  EXPECT_NE(load_error(root).find("bad.json: nights.end:"), std::string::npos);

  nights["end"] = "05:00";
  nights["first_date"] = "2027-02-30";
  root["nights"] = nights;
  EXPECT_NE(load_error(root).find("bad.json: nights.first_date:"), std::string::npos);

  nights["first_date"] = "2027-02-03";
  nights["max_nights"] = 2.5;
  root["nights"] = nights;
  EXPECT_NE(load_error(root).find("bad.json: nights.max_nights: expected an integer"),
            std::string::npos);

  QJsonObject root2 = good_object();
  QJsonObject data = root2["data"].toObject();
  QJsonArray points = data["points"].toArray();
  QJsonObject point = points[0].toObject();
  point["label"] = 0;
  points[0] = point;
  data["points"] = points;
  root2["data"] = data;
  EXPECT_NE(load_error(root2).find("bad.json: data.points[0].label:"), std::string::npos);
}

TEST(CampaignJson, MalformedJsonNamesLineAndColumn) {
  // The missing comma is on line 3; the parser notices it at the start of "version".
  const std::string m = text_error("{\n  \"format\": \"gramline-campaign\"\n  \"version\": 1\n}\n");
  EXPECT_NE(m.find("bad.json:3:"), std::string::npos) << m;
  EXPECT_NE(text_error("[1, 2]").find("bad.json: (top level): expected an object"),
            std::string::npos);
  EXPECT_NE(text_error("").find("bad.json:"), std::string::npos);
}

TEST(CampaignJson, NeverCrashesOnTruncatedFiles) {
  const std::string text = formats::format_campaign(awkward_campaign());
  // Every cut that loses at least the closing brace (the text ends with "}\n").
  for (size_t n = 0; n + 1 < text.size(); n += 7) {
    EXPECT_THROW(formats::parse_campaign(text.substr(0, n), "cut.json"), InputError);
  }
}

TEST(CampaignJson, OptionalSectionsTakeDefaults) {
  QJsonObject root = good_object();
  root.remove("schedule");
  root.remove("check");
  root.remove("seed");
  root.remove("name");
  const Campaign c = formats::parse_campaign(QJsonDocument(root).toJson().toStdString(), "x");
  const Campaign defaults;
  EXPECT_EQ(c.seed, defaults.seed);
  EXPECT_EQ(c.name, defaults.name);
  EXPECT_EQ(c.schedule.dark_dwell_s, defaults.schedule.dark_dwell_s);
  EXPECT_EQ(c.check.trials, defaults.check.trials);
}

// A version-1 file without schedule.calibration_share takes the documented default 0.10
// (docs/plan-files.md); an unknown key at any depth is refused naming its path.
TEST(CampaignJson, NewKeysAreOptionalAndUnknownKeysAreRefused) {
  QJsonObject root = good_object();
  QJsonObject schedule = root["schedule"].toObject();
  schedule.remove("calibration_share");
  root["schedule"] = schedule;
  EXPECT_EQ(formats::parse_campaign(QJsonDocument(root).toJson().toStdString(), "x")
                .schedule.calibration_share,
            0.10);
  QJsonObject rig = root["rig"].toObject();
  rig["foo"] = 1;
  root["rig"] = rig;
  try {
    formats::parse_campaign(QJsonDocument(root).toJson().toStdString(), "x.json");
    ADD_FAILURE() << "an unknown key was accepted";
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("x.json: rig.foo"), std::string::npos) << e.what();
  }
}

TEST(CampaignJson, PlateImperfectionsAreOptionalAndDefaultToExactPlates) {
  // A campaign written before plates were modelled opens with exact plates, a leak-free PBS and
  // compensation on (docs/conventions.md, "Real plates").
  QJsonObject root = good_object();
  QJsonObject rig = root["rig"].toObject();
  QJsonArray motors = rig["motors"].toArray();
  for (int m = 0; m < motors.size(); ++m) {
    QJsonObject o = motors[m].toObject();
    o.remove("retardance_error_deg");
    o.remove("axis_offset_sd_deg");
    o.remove("repeatability_sd_deg");
    motors[m] = o;
  }
  rig["motors"] = motors;
  QJsonArray detectors = rig["detectors"].toArray();
  for (int d = 0; d < detectors.size(); ++d) {
    QJsonObject o = detectors[d].toObject();
    o.remove("pbs_leakage");
    detectors[d] = o;
  }
  rig["detectors"] = detectors;
  rig.remove("compensate_plates");
  root["rig"] = rig;
  const Campaign c = formats::parse_campaign(QJsonDocument(root).toJson().toStdString(), "x");
  for (const Motor& m : c.rig.motors) {
    EXPECT_EQ(m.retardance_error_deg, 0.0);
    EXPECT_EQ(m.axis_offset_sd_deg, 0.0);
    EXPECT_EQ(m.repeatability_sd_deg, 0.0);
  }
  for (const Detector& d : c.rig.detectors) EXPECT_EQ(d.pbs_leakage, 0.0);
  EXPECT_TRUE(c.rig.compensate_plates);

  // A wrong type names the path.
  QJsonObject bad = good_object();
  QJsonObject bad_rig = bad["rig"].toObject();
  QJsonArray bad_detectors = bad_rig["detectors"].toArray();
  QJsonObject first = bad_detectors[1].toObject();
  first["pbs_leakage"] = "some";
  bad_detectors[1] = first;
  bad_rig["detectors"] = bad_detectors;
  bad["rig"] = bad_rig;
  EXPECT_EQ(load_error(bad),
            "bad.json: rig.detectors[1].pbs_leakage: expected a number (found a string)");
}

TEST(CampaignJson, UnwritablePathIsAnInputErrorNamingTheFile) {
  try {
    formats::save_campaign(awkward_campaign(), "/nonexistent-dir/sub/c.json");
    FAIL() << "no error";
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("/nonexistent-dir/sub/c.json"), std::string::npos);
  }
}

}  // namespace
