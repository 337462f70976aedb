// End to end: gramline-cli demo, then plan --out; the written files are checked against the
// physics of docs/conventions.md and docs/motion-model.md recomputed here from the motor positions
// alone.
#include <gtest/gtest.h>

#include <QDir>
#include <QFile>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QProcess>
#include <QStringList>
#include <QTemporaryDir>
#include <cmath>
#include <set>
#include <sstream>
#include <string>
#include <utility>
#include <vector>

#include "cli_run.h"
#include "formats/campaign_json.h"
#include "formats/plan_files.h"
#include "gramline/jones.h"
#include "gramline/motion.h"
#include "gramline/units.h"

namespace {

using namespace gramline;

using cli_test::CliRun;
using cli_test::run_cli;

QString data_file(const char* name) { return QString(GRAMLINE_TEST_DATA) + "/" + name; }

std::string read_text(const QString& path) {
  QFile file(path);
  if (!file.open(QIODevice::ReadOnly)) return {};
  return file.readAll().toStdString();
}

std::vector<std::vector<double>> read_number_csv(const QString& path) {
  std::vector<std::vector<double>> rows;
  std::istringstream in(read_text(path));
  std::string line;
  while (std::getline(in, line)) {
    std::vector<double> row;
    std::istringstream fields(line);
    std::string field;
    while (std::getline(fields, field, ',')) row.push_back(std::stod(field));
    rows.push_back(row);
  }
  return rows;
}

/// One demo campaign planned once for every test of this suite.
class PlannedDemo : public ::testing::Test {
 protected:
  static void SetUpTestSuite() {
    dir_ = new QTemporaryDir();
    campaign_path_ = dir_->filePath("my demo.campaign");  // any file name, even with a space
    out_dir_ = dir_->filePath("plan out");
    demo_ = run_cli({"demo", "--out", campaign_path_});
    plan_ = run_cli({"plan", campaign_path_, "--out", out_dir_});
  }
  static void TearDownTestSuite() {
    delete dir_;
    dir_ = nullptr;
  }
  static QString out(const char* name) { return QDir(out_dir_).filePath(name); }

  static QTemporaryDir* dir_;
  static QString campaign_path_;
  static QString out_dir_;
  static CliRun demo_;
  static CliRun plan_;
};
QTemporaryDir* PlannedDemo::dir_ = nullptr;
QString PlannedDemo::campaign_path_;
QString PlannedDemo::out_dir_;
CliRun PlannedDemo::demo_;
CliRun PlannedDemo::plan_;

TEST_F(PlannedDemo, DemoAndPlanSucceedAndWriteFourFiles) {
  ASSERT_EQ(demo_.status, 0) << demo_.err;
  ASSERT_EQ(plan_.status, 0) << plan_.err;
  EXPECT_FALSE(plan_.out.empty());
  for (const char* name : {"steps.json", "steps.csv", "summary.json", "kernel.csv"}) {
    EXPECT_TRUE(QFile::exists(out(name))) << name;
  }
}

TEST_F(PlannedDemo, MotorPositionsReproduceEveryKernelByJonesCalculus) {
  ASSERT_EQ(plan_.status, 0) << plan_.err;
  const formats::StepsFile file = formats::read_steps_json(out("steps.json"));
  const Campaign campaign = formats::load_campaign(campaign_path_);
  const int photons = campaign.encoding.photon_count();
  ASSERT_EQ(photons, 2);
  int checked = 0;
  for (size_t i = 0; i < file.steps.size(); ++i) {
    const Step& s = file.steps[i];
    if (s.prep_point < 0 || s.analysis_point < 0) continue;
    // docs/conventions.md: prepare |H> with HWP then QWP; analyse with QWP then HWP, pass = H.
    double from_plates = 1.0;
    double from_states = 1.0;
    for (int p = 0; p < photons; ++p) {
      const int hp = file.rig.motor_index(p, Stage::prep, Plate::HWP);
      const int qp = file.rig.motor_index(p, Stage::prep, Plate::QWP);
      const int qa = file.rig.motor_index(p, Stage::analysis, Plate::QWP);
      const int ha = file.rig.motor_index(p, Stage::analysis, Plate::HWP);
      ASSERT_TRUE(hp >= 0 && qp >= 0 && qa >= 0 && ha >= 0);
      // The plates with their actual retardances (nominal plus the motor's retardance error,
      // docs/conventions.md "Real plates"): the positions realise the ideal kernel on them.
      auto plate = [&](int m) {
        const Motor& mo = file.rig.motors[m];
        const double nominal_deg = mo.plate == Plate::HWP ? 180.0 : 90.0;
        return waveplate(s.position_deg[m], deg_to_rad(nominal_deg + mo.retardance_error_deg));
      };
      const JonesVector out =
          plate(ha) * (plate(qa) * (plate(qp) * (plate(hp) * JonesVector(1.0, 0.0))));
      from_plates *= std::norm(out(0));
      // The states the points stand for, straight from the encoding: |<psi(b)|psi(a)>|^2.
      const BlochAngles a = campaign.encoding.angles(p, campaign.data.point(s.prep_point));
      const BlochAngles b = campaign.encoding.angles(p, campaign.data.point(s.analysis_point));
      from_states *=
          overlap(bloch_state(b.theta_deg, b.phi_deg), bloch_state(a.theta_deg, a.phi_deg));
    }
    ASSERT_NEAR(from_plates, s.kernel_ideal, 1e-9) << "step " << i;
    ASSERT_NEAR(from_states, s.kernel_ideal, 1e-9) << "step " << i;
    ASSERT_NEAR(from_plates, s.kernel_rig, 1e-12) << "step " << i;  // no PBS leakage here
    ++checked;
  }
  EXPECT_GT(checked, 1000);
}

TEST_F(PlannedDemo, MoveTimesFollowFromThePositionsInTheFile) {
  ASSERT_EQ(plan_.status, 0) << plan_.err;
  const formats::StepsFile file = formats::read_steps_json(out("steps.json"));
  std::vector<double> at;
  for (const Motor& m : file.rig.motors) at.push_back(m.initial_deg);
  double end_of_previous_s = 0.0;
  for (size_t i = 0; i < file.steps.size(); ++i) {
    const Step& s = file.steps[i];
    ASSERT_NEAR(step_move_s(file.rig, at, s.position_deg), s.move_s, 1e-9) << "step " << i;
    // A step occupies [start_s, start_s + move_s + dwell_s]; steps do not overlap.
    EXPECT_GE(s.start_s, end_of_previous_s - 1e-6) << "step " << i;
    end_of_previous_s = s.start_s + s.move_s + s.dwell_s;
    at = s.position_deg;
  }
}

TEST_F(PlannedDemo, MeasureStepsCoverEveryPairOnce) {
  ASSERT_EQ(plan_.status, 0) << plan_.err;
  const formats::StepsFile file = formats::read_steps_json(out("steps.json"));
  const int n = 48;  // the demo: 48 training and 16 test points (core/src/demo.cpp)
  const int m = 16;
  std::set<std::pair<int, int>> train_pairs;
  std::set<std::pair<int, int>> test_pairs;
  for (const Step& s : file.steps) {
    if (s.kind != StepKind::measure) continue;
    const int lo = std::min(s.prep_point, s.analysis_point);
    const int hi = std::max(s.prep_point, s.analysis_point);
    if (s.block == Block::train) {
      EXPECT_TRUE(lo >= 0 && hi < n && lo != hi);
      EXPECT_TRUE(train_pairs.emplace(lo, hi).second) << "pair measured twice";
    } else {
      ASSERT_EQ(s.block, Block::test);
      EXPECT_TRUE(lo >= 0 && lo < n && hi >= n && hi < n + m);
      EXPECT_TRUE(test_pairs.emplace(hi, lo).second) << "pair measured twice";
    }
  }
  EXPECT_EQ(train_pairs.size(), static_cast<size_t>(n * (n - 1) / 2));
  EXPECT_EQ(test_pairs.size(), static_cast<size_t>(m * n));
}

TEST_F(PlannedDemo, KernelCsvMatchesTheTrainSteps) {
  ASSERT_EQ(plan_.status, 0) << plan_.err;
  const formats::StepsFile file = formats::read_steps_json(out("steps.json"));
  const std::vector<std::vector<double>> k = read_number_csv(out("kernel.csv"));
  ASSERT_EQ(k.size(), 48u);
  for (size_t i = 0; i < k.size(); ++i) {
    ASSERT_EQ(k[i].size(), 48u);
    EXPECT_NEAR(k[i][i], 1.0, 1e-12);  // unit diagonal: docs/plan-files.md
  }
  int matched = 0;
  for (const Step& s : file.steps) {
    if (s.kind != StepKind::measure || s.block != Block::train) continue;
    EXPECT_NEAR(k[s.prep_point][s.analysis_point], s.kernel_ideal, 1e-12);
    EXPECT_NEAR(k[s.analysis_point][s.prep_point], s.kernel_ideal, 1e-12);
    ++matched;
  }
  EXPECT_EQ(matched, 48 * 47 / 2);
}

TEST_F(PlannedDemo, SummaryHasTheDocumentedKeysAndAgreesWithTheSteps) {
  ASSERT_EQ(plan_.status, 0) << plan_.err;
  const QJsonObject summary =
      QJsonDocument::fromJson(QByteArray::fromStdString(read_text(out("summary.json")))).object();
  for (const char* key :
       {"settings", "steps", "pairs_total", "integration_s", "move_s", "reference_s", "total_s",
        "nights", "move_lower_bound_s", "move_naive_s", "gram_sigma_frobenius", "plan_ms",
        "gram_error_ms", "gram_spectral_estimate", "p_negative_eigenvalue"}) {
    EXPECT_TRUE(summary[key].isDouble()) << key;
  }
  const formats::StepsFile file = formats::read_steps_json(out("steps.json"));
  double move_s = 0.0;
  double measure_move_s = 0.0;
  double integration_s = 0.0;
  double end_s = 0.0;
  int settings = 0;
  int last_night = 0;
  for (const Step& s : file.steps) {
    move_s += s.move_s;
    end_s = std::max(end_s, s.start_s + s.move_s + s.dwell_s);
    last_night = std::max(last_night, s.night);
    if (s.kind == StepKind::measure) {
      ++settings;
      measure_move_s += s.move_s;
      integration_s += s.dwell_s;
    }
  }
  EXPECT_EQ(summary["steps"].toDouble(), static_cast<double>(file.steps.size()));
  EXPECT_EQ(summary["settings"].toDouble(), settings);
  EXPECT_EQ(summary["nights"].toDouble(), last_night);
  EXPECT_NEAR(summary["move_s"].toDouble(), move_s, 1e-6);
  EXPECT_NEAR(summary["integration_s"].toDouble(), integration_s, 1e-6);
  EXPECT_NEAR(summary["total_s"].toDouble(), end_s, 1e-6);
  EXPECT_LE(summary["move_lower_bound_s"].toDouble(), measure_move_s + 1e-6);
  // The parts of the time add up to the busy time: every step's move and dwell once
  // (docs/plan-files.md).
  double busy_s = 0.0;
  for (const Step& s : file.steps) busy_s += s.move_s + s.dwell_s;
  EXPECT_NEAR(summary["integration_s"].toDouble() + summary["move_s"].toDouble() +
                  summary["reference_s"].toDouble(),
              busy_s, 1e-6);
  double nights_busy_s = 0.0;
  for (const QJsonValue n : summary["night_use"].toArray())
    nights_busy_s += n.toObject()["busy_s"].toDouble();
  EXPECT_NEAR(nights_busy_s, busy_s, 1e-6);
}

TEST_F(PlannedDemo, StepsCsvCarriesTheSameRows) {
  ASSERT_EQ(plan_.status, 0) << plan_.err;
  const formats::StepsFile file = formats::read_steps_json(out("steps.json"));
  std::istringstream in(read_text(out("steps.csv")));
  std::string line;
  std::getline(in, line);
  EXPECT_NE(line.find("move_s"), std::string::npos);
  size_t rows = 0;
  while (std::getline(in, line)) {
    std::vector<std::string> fields;
    std::istringstream f(line);
    std::string field;
    while (std::getline(f, field, ',')) fields.push_back(field);
    ASSERT_LT(rows, file.steps.size());
    const Step& s = file.steps[rows];
    ASSERT_GE(fields.size(), 5 + file.rig.motors.size());
    for (size_t m = 0; m < file.rig.motors.size(); ++m) {
      EXPECT_EQ(std::stod(fields[5 + m]), s.position_deg[m]) << "row " << rows;
    }
    ++rows;
  }
  EXPECT_EQ(rows, file.steps.size());
}

TEST_F(PlannedDemo, SameSeedGivesTheSameSteps) {
  ASSERT_EQ(plan_.status, 0) << plan_.err;
  const QString again = dir_->filePath("again");
  const CliRun run = run_cli({"plan", campaign_path_, "--out", again});
  ASSERT_EQ(run.status, 0) << run.err;
  EXPECT_EQ(read_text(QDir(again).filePath("steps.json")), read_text(out("steps.json")));
}

TEST_F(PlannedDemo, DataCsvReplacesThePoints) {
  ASSERT_EQ(demo_.status, 0) << demo_.err;
  const QString dir = dir_->filePath("small");
  const CliRun run = run_cli(
      {"plan", campaign_path_, "--data", data_file("small_two_features.csv"), "--out", dir});
  ASSERT_EQ(run.status, 0) << run.err;
  // 4 training and 2 test points in the fixture.
  EXPECT_EQ(read_number_csv(QDir(dir).filePath("kernel.csv")).size(), 4u);
  const formats::StepsFile file = formats::read_steps_json(QDir(dir).filePath("steps.json"));
  int measure = 0;
  for (const Step& s : file.steps) measure += s.kind == StepKind::measure ? 1 : 0;
  EXPECT_EQ(measure, 4 * 3 / 2 + 2 * 4);
}

TEST_F(PlannedDemo, BadDataCsvExitsTwoNamingTheLine) {
  ASSERT_EQ(demo_.status, 0) << demo_.err;
  const CliRun run = run_cli({"plan", campaign_path_, "--data", data_file("bad_not_a_number.csv")});
  EXPECT_EQ(run.status, 2);
  EXPECT_NE(run.err.find("bad_not_a_number.csv:4:"), std::string::npos) << run.err;
  EXPECT_NE(run.err.find("column 1"), std::string::npos) << run.err;
}

// docs/conventions.md, "Encoding presets": another feature count keeps the rig and its photons
// and spreads the features over them, saying so on standard error.
TEST_F(PlannedDemo, AnotherFeatureCountIsSpreadOverTheRigsPhotons) {
  ASSERT_EQ(demo_.status, 0) << demo_.err;
  const CliRun run = run_cli({"plan", campaign_path_, "--data", data_file("three_features.csv")});
  EXPECT_EQ(run.status, 0) << run.err;
  EXPECT_NE(run.err.find("three_features.csv"), std::string::npos) << run.err;
  EXPECT_NE(run.err.find("2 photon(s)"), std::string::npos) << run.err;
  EXPECT_NE(run.err.find("'spread' preset"), std::string::npos) << run.err;
}

TEST(Cli, BadCampaignFileExitsTwoNamingTheField) {
  QTemporaryDir dir;
  const QString path = dir.filePath("c.json");
  ASSERT_EQ(run_cli({"demo", "--out", path}).status, 0);
  QJsonObject root = QJsonDocument::fromJson(QByteArray::fromStdString(read_text(path))).object();
  QJsonObject precision = root["precision"].toObject();
  precision["epsilon"] = "small";
  root["precision"] = precision;
  QFile file(path);
  ASSERT_TRUE(file.open(QIODevice::WriteOnly | QIODevice::Truncate));
  file.write(QJsonDocument(root).toJson());
  file.close();
  const CliRun run = run_cli({"plan", path});
  EXPECT_EQ(run.status, 2);
  EXPECT_NE(run.err.find("precision.epsilon"), std::string::npos) << run.err;
}

// Writes the demo campaign to `path` after `edit` changes its JSON.
template <class Edit>
void write_edited_demo(const QString& path, Edit edit) {
  ASSERT_EQ(run_cli({"demo", "--out", path, "--force"}).status, 0);
  QJsonObject root = QJsonDocument::fromJson(QByteArray::fromStdString(read_text(path))).object();
  edit(root);
  QFile file(path);
  ASSERT_TRUE(file.open(QIODevice::WriteOnly | QIODevice::Truncate));
  file.write(QJsonDocument(root).toJson());
}

TEST(Cli, UnknownCampaignKeyExitsTwoNamingItsPath) {
  QTemporaryDir dir;
  const QString path = dir.filePath("c.json");
  write_edited_demo(path, [](QJsonObject& root) {
    QJsonObject rig = root["rig"].toObject();
    rig["foo"] = 1;
    root["rig"] = rig;
  });
  const CliRun run = run_cli({"plan", path});
  EXPECT_EQ(run.status, 2);
  EXPECT_NE(run.err.find("rig.foo"), std::string::npos) << run.err;
}

// A plan that needs more nights than allowed writes its files and exits 3 (README, "Exit
// status"); plan and export alike.
TEST(Cli, PlanThatDoesNotFitExitsThreeWithItsFilesWritten) {
  QTemporaryDir dir;
  const QString path = dir.filePath("c.json");
  write_edited_demo(path, [](QJsonObject& root) {
    QJsonObject nights = root["nights"].toObject();
    nights["start"] = "20:00";
    nights["end"] = "21:00";
    nights["max_nights"] = 1;
    root["nights"] = nights;
  });
  const QString out_dir = dir.filePath("plan");
  const CliRun run = run_cli({"plan", path, "--out", out_dir});
  EXPECT_EQ(run.status, 3) << run.err;
  EXPECT_NE(run.out.find("DOES NOT FIT"), std::string::npos);
  for (const char* name : {"steps.json", "steps.csv", "summary.json", "kernel.csv"})
    EXPECT_TRUE(QFile::exists(QDir(out_dir).filePath(name))) << name;
  const QString bundle = dir.filePath("b.zip");
  EXPECT_EQ(run_cli({"export", path, "--out", bundle}).status, 3);
  EXPECT_TRUE(QFile::exists(bundle));
}

TEST(Cli, UsageErrorsExitTwo) {
  EXPECT_EQ(run_cli({}).status, 2);
  EXPECT_EQ(run_cli({"frobnicate"}).status, 2);
  EXPECT_EQ(run_cli({"demo"}).status, 2);  // --out is required
  EXPECT_EQ(run_cli({"plan"}).status, 2);  // no campaign
  EXPECT_EQ(run_cli({"plan", "x.json", "--colour", "red"}).status, 2);
  EXPECT_EQ(run_cli({"plan", "x.json", "--seed", "-3"}).status, 2);
  EXPECT_EQ(run_cli({"plan", "x.json", "--seed"}).status, 2);
  EXPECT_EQ(run_cli({"check", "x.json"}).status, 2);  // no such campaign
  const CliRun missing = run_cli({"plan", "/no/such/campaign.json"});
  EXPECT_EQ(missing.status, 2);
  EXPECT_NE(missing.err.find("/no/such/campaign.json"), std::string::npos);
}

TEST(Cli, HelpAndVersion) {
  const CliRun help = run_cli({"--help"});
  EXPECT_EQ(help.status, 0);
  EXPECT_NE(help.out.find("plan CAMPAIGN"), std::string::npos);
  EXPECT_EQ(run_cli({"help"}).status, 0);
  const CliRun version = run_cli({"--version"});
  EXPECT_EQ(version.status, 0);
  EXPECT_NE(version.out.find(GRAMLINE_VERSION), std::string::npos);
}

}  // namespace
