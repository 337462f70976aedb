// gramline-cli simulate: a rehearsal of export -> run -> ingest -> resume without a rig
// (docs/counts-format.md, "Simulated counts").
#include <gtest/gtest.h>

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>
#include <cmath>
#include <iostream>
#include <sstream>
#include <string>
#include <vector>

#include "cli_run.h"
#include "formats/bundle.h"
#include "gramline/plan.h"

namespace {

using namespace gramline;
using cli_test::run_cli;

using cli_test::read_json;
using cli_test::read_text;
using cli_test::write_text;

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> out;
  std::istringstream s(text);
  for (std::string l; std::getline(s, l);) out.push_back(l);
  return out;
}

QJsonObject read_json_entry(const gramline::formats::Bundle& b, const char* name) {
  return QJsonDocument::fromJson(QByteArray::fromStdString(b.entries.at(name))).object();
}

struct ZStats {
  int count = 0;
  double mean = 0.0, sd = 0.0;
};

// z-scores recomputed from zscores.csv with the planner's own predicted sigma and ideal kernel
// (not ingest's figures): unbiased estimates with the predicted variance are standard normal.
ZStats z_from_files(const QString& ingest_dir, const Plan& plan) {
  ZStats z;
  double sum = 0, sq = 0;
  const std::vector<std::string> lines =
      lines_of(read_text(QDir(ingest_dir).filePath("zscores.csv")));
  for (size_t i = 1; i < lines.size(); ++i) {
    std::vector<std::string> f;
    std::stringstream fields(lines[i]);
    for (std::string x; std::getline(fields, x, ',');) f.push_back(x);
    if (f.size() != 8) continue;
    const int row = std::stoi(f[1]), col = std::stoi(f[2]);
    const bool train = f[0] == "train";
    const double ideal = train ? plan.kernel_train(row, col) : plan.kernel_test(row, col);
    const double sigma = train ? plan.sigma_train(row, col) : plan.sigma_test(row, col);
    const double zz = (std::stod(f[4]) - ideal) / sigma;
    sum += zz;
    sq += zz * zz;
    ++z.count;
  }
  if (z.count > 0) {
    z.mean = sum / z.count;
    z.sd = std::sqrt(sq / z.count - z.mean * z.mean);
  }
  return z;
}

class Rehearsal : public ::testing::Test {
 protected:
  static void SetUpTestSuite() {
    dir_ = new QTemporaryDir();
    const QString campaign = dir_->filePath("demo.json");
    demo_ = run_cli({"demo", "--out", campaign});
    // The demo for each scheme, with long reference steps: the predicted sigma of an entry
    // takes the pair rate and visibility as known, and 400 000 reference pairs (against a few
    // thousand per entry) make the calibration's own noise negligible. (At the demo's default
    // reference length a pass-only night's z-scores spread wider, sd ~1.15, because each
    // entry's rate comes from noisy references.)
    const QJsonObject demo =
        QJsonDocument::fromJson(QByteArray::fromStdString(read_text(campaign))).object();
    auto variant = [&](const char* scheme, const char* file) {
      QJsonObject root = demo, rig = demo["rig"].toObject(), schedule = demo["schedule"].toObject();
      rig["scheme"] = scheme;
      schedule["reference_pairs"] = 400000;
      root["rig"] = rig;
      root["schedule"] = schedule;
      const QString out = dir_->filePath(file);
      write_text(out, QJsonDocument(root).toJson().toStdString());
      return out;
    };
    const QString both = variant("both-ports", "both ports.json");
    const QString pass_only = variant("pass-only", "pass only.json");
    both_path_ = dir_->filePath("both.zip");
    pass_path_ = dir_->filePath("pass.zip");
    export_both_ = run_cli({"export", both, "--out", both_path_});
    export_pass_ = run_cli({"export", pass_only, "--out", pass_path_});
  }
  static void TearDownTestSuite() { delete dir_; }
  void SetUp() override {
    ASSERT_EQ(demo_.status, 0) << demo_.err;
    ASSERT_EQ(export_both_.status, 0) << export_both_.err;
    ASSERT_EQ(export_pass_.status, 0) << export_pass_.err;
  }
  static QString path(const char* name) { return dir_->filePath(name); }
  static inline QTemporaryDir* dir_ = nullptr;
  static inline QString both_path_, pass_path_;
  static inline cli_test::CliRun demo_, export_both_, export_pass_;
};

TEST_F(Rehearsal, SimulatedCountsIngestWithStandardNormalZScoresForBothSchemes) {
  struct Case {
    QString bundle;
    const char* counts;
    const char* out;
    const char* seed;
  };
  for (const Case& k : {Case{both_path_, "both.csv", "ingest both", "5"},
                        Case{pass_path_, "pass.csv", "ingest pass", "6"}}) {
    SCOPED_TRACE(k.counts);
    const auto sim = run_cli({"simulate", k.bundle, "--out", path(k.counts), "--seed", k.seed});
    ASSERT_EQ(sim.status, 0) << sim.err;
    const formats::Bundle bundle = formats::read_bundle(k.bundle);
    // First line names the bundle, second marks the file as simulated.
    const std::vector<std::string> lines = lines_of(read_text(path(k.counts)));
    ASSERT_GE(lines.size(), 3u);
    EXPECT_EQ(lines[0], "# bundle file: " + QFileInfo(k.bundle).fileName().toStdString() +
                            ", manifest SHA-256 " + bundle.manifest_sha256);
    EXPECT_EQ(lines[1].rfind("# simulated: ", 0), 0u) << lines[1];
    EXPECT_NE(lines[1].find("seed " + std::string(k.seed)), std::string::npos) << lines[1];

    const auto ingest = run_cli({"ingest", k.bundle, path(k.counts), "--out", path(k.out)});
    ASSERT_EQ(ingest.status, 0) << ingest.err;
    EXPECT_NE(ingest.out.find("simulated counts"), std::string::npos) << ingest.out;
    const QJsonObject j = read_json(QDir(path(k.out)).filePath("ingest.json"));
    EXPECT_TRUE(j["simulated"].toBool());
    EXPECT_EQ(j["missing_steps"].toArray().size(), 0);
    // ~1900 entries: mean 0 +- 0.023, sd 1 +- 0.016 (sampling error, common practice); the
    // limits are about five of those.
    const ZStats z = z_from_files(path(k.out), formats::plan_from_bundle(bundle));
    const int n = bundle.campaign.data.train_count(), m = bundle.campaign.data.test_count();
    EXPECT_EQ(z.count, n * (n - 1) / 2 + m * n);
    EXPECT_NEAR(z.mean, 0.0, 0.1);
    EXPECT_NEAR(z.sd, 1.0, 0.08);
    std::cout << "[ z-scores ] " << k.counts << ": " << z.count << " entries, mean " << z.mean
              << ", sd " << z.sd << "\n";
  }
}

TEST_F(Rehearsal, TheSameSeedGivesTheSameFileAndOutputsAreNotReplacedWithoutForce) {
  ASSERT_EQ(run_cli({"simulate", both_path_, "--out", path("a.csv"), "--seed", "9"}).status, 0);
  ASSERT_EQ(run_cli({"simulate", both_path_, "--out", path("b.csv"), "--seed", "9"}).status, 0);
  EXPECT_EQ(read_text(path("a.csv")), read_text(path("b.csv")));
  ASSERT_EQ(run_cli({"simulate", both_path_, "--out", path("c.csv"), "--seed", "10"}).status, 0);
  EXPECT_NE(read_text(path("a.csv")), read_text(path("c.csv")));
  const auto again = run_cli({"simulate", both_path_, "--out", path("a.csv"), "--seed", "10"});
  EXPECT_EQ(again.status, 2);
  EXPECT_NE(again.err.find("a.csv"), std::string::npos) << again.err;
  EXPECT_EQ(
      run_cli({"simulate", both_path_, "--out", path("a.csv"), "--seed", "10", "--force"}).status,
      0);
  EXPECT_EQ(read_text(path("a.csv")), read_text(path("c.csv")));
}

TEST_F(Rehearsal, BadOptionsAreRefusedNamingTheOption) {
  for (const char* fade : {"1", "-0.1", "nan", "half"}) {
    const auto r =
        run_cli({"simulate", both_path_, "--out", path("x.csv"), "--fade-per-hour", fade});
    EXPECT_EQ(r.status, 2) << fade;
    EXPECT_NE(r.err.find("--fade-per-hour"), std::string::npos) << r.err;
  }
  const auto r =
      run_cli({"simulate", both_path_, "--out", path("x.csv"), "--stop-after-hours", "-2"});
  EXPECT_EQ(r.status, 2);
  EXPECT_NE(r.err.find("--stop-after-hours"), std::string::npos) << r.err;
  EXPECT_FALSE(QFile::exists(path("x.csv")));
  const auto missing = run_cli({"simulate", path("no such.zip"), "--out", path("x.csv")});
  EXPECT_EQ(missing.status, 2);
  EXPECT_NE(missing.err.find("no such.zip"), std::string::npos) << missing.err;
}

TEST_F(Rehearsal, AFadingSourceIsFlaggedAsDrift) {
  ASSERT_EQ(run_cli({"simulate", both_path_, "--out", path("steady.csv"), "--seed", "3"}).status,
            0);
  ASSERT_EQ(run_cli({"simulate", both_path_, "--out", path("fading.csv"), "--seed", "3",
                     "--fade-per-hour", "0.3"})
                .status,
            0);
  ASSERT_EQ(run_cli({"ingest", both_path_, path("steady.csv"), "--out", path("steady")}).status, 0);
  const auto fading = run_cli({"ingest", both_path_, path("fading.csv"), "--out", path("fading")});
  ASSERT_EQ(fading.status, 0) << fading.err;
  const QJsonObject steady = read_json(QDir(path("steady")).filePath("ingest.json"));
  const QJsonObject faded = read_json(QDir(path("fading")).filePath("ingest.json"));
  EXPECT_LE(steady["drift_flagged"].toInt(), 1);
  EXPECT_GE(faded["drift_flagged"].toInt(), 1);
  // The references see the pair rate fall, as (1 - 0.3)^hours says.
  const QJsonArray drift = faded["drift"].toArray();
  ASSERT_GE(drift.size(), 2);
  const QJsonObject first = drift.first().toObject(), last = drift.last().toObject();
  const double hours = (last["time_s"].toDouble() - first["time_s"].toDouble()) / 3600.0;
  ASSERT_GT(hours, 0.0);
  const double ratio =
      last["pair_detect_rate_per_s"].toDouble() / first["pair_detect_rate_per_s"].toDouble();
  EXPECT_NEAR(ratio, std::pow(0.7, hours), 0.05 + 0.1 * (1.0 - std::pow(0.7, hours)));
  EXPECT_LT(ratio, 1.0);
}

TEST_F(Rehearsal, AnInterruptedSimulatedNightResumesAndTheRestIngests) {
  const formats::Bundle bundle = formats::read_bundle(both_path_);
  const std::vector<Step>& steps = bundle.steps.steps;
  ASSERT_FALSE(steps.empty());
  // Stop 40 % into the first night.
  double night1_end_s = 0.0;
  for (const Step& s : steps)
    if (s.night == 1) night1_end_s = std::max(night1_end_s, s.start_s + s.move_s + s.dwell_s);
  const double stop_h = 0.4 * (night1_end_s - steps.front().start_s) / 3600.0;
  const auto sim = run_cli({"simulate", both_path_, "--out", path("cut.csv"), "--seed", "12",
                            "--stop-after-hours", QString::number(stop_h, 'g', 17)});
  ASSERT_EQ(sim.status, 0) << sim.err;
  EXPECT_NE(sim.out.find("stops early"), std::string::npos) << sim.out;
  // No counted step ends after the stop.
  const std::vector<std::string> lines = lines_of(read_text(path("cut.csv")));
  int rows = 0;
  for (size_t i = 3; i < lines.size(); ++i) {
    std::vector<std::string> f;
    std::stringstream fields(lines[i]);
    for (std::string x; std::getline(fields, x, ',');) f.push_back(x);
    ASSERT_GE(f.size(), 4u);
    EXPECT_LE(std::stod(f[3]), steps.front().start_s + stop_h * 3600.0 + 1e-6) << lines[i];
    ++rows;
  }
  EXPECT_GT(rows, 10);

  const QString child = path("cut resumed.zip");
  const auto resume = run_cli({"resume", both_path_, path("cut.csv"), "--out", child});
  ASSERT_EQ(resume.status, 0) << resume.err;
  EXPECT_NE(resume.out.find("simulated counts"), std::string::npos) << resume.out;
  const formats::Bundle next = formats::read_bundle(child);
  EXPECT_EQ(static_cast<int>(next.measured_records.size()), rows);
  EXPECT_FALSE(next.measured_simulated_note.empty());
  EXPECT_TRUE(read_json_entry(next, "resume.json")["simulated_counts"].toBool());

  // Rehearse the rest on the resumed bundle and ingest it: every entry measured.
  ASSERT_EQ(run_cli({"simulate", child, "--out", path("rest.csv"), "--seed", "13"}).status, 0);
  const auto ingest = run_cli({"ingest", child, path("rest.csv"), "--out", path("rest")});
  ASSERT_EQ(ingest.status, 0) << ingest.err;
  const QJsonObject j = read_json(QDir(path("rest")).filePath("ingest.json"));
  const int n = bundle.campaign.data.train_count(), m = bundle.campaign.data.test_count();
  EXPECT_EQ(j["measured_entries"].toInt(), n * (n - 1) / 2 + m * n);
  EXPECT_TRUE(j["simulated"].toBool());
  EXPECT_TRUE(j["earlier_simulated"].toBool());
  EXPECT_NEAR(j["z_mean"].toDouble(), 0.0, 0.1);
  EXPECT_NEAR(j["z_std"].toDouble(), 1.0, 0.08);
}

}  // namespace
