// End to end through gramline-cli: export, counts drawn from the rig model, ingest, resume.
#include <gtest/gtest.h>

#include <QDateTime>
#include <QDir>
#include <QFile>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>
#include <cmath>
#include <map>
#include <set>
#include <sstream>
#include <string>
#include <vector>

#include "cli_run.h"
#include "formats/bundle.h"
#include "formats/counts_csv.h"
#include "gramline/motion.h"
#include "handoff_fixtures.h"

namespace {

using namespace gramline;
using cli_test::run_cli;
using handoff_test::simulate_counts;

using cli_test::read_json;
using cli_test::read_text;
using cli_test::write_text;

class Handoff : public ::testing::Test {
 protected:
  static void SetUpTestSuite() {
    dir_ = new QTemporaryDir();
    campaign_path_ = dir_->filePath("demo.json");
    bundle_path_ = dir_->filePath("night.zip");
    demo_ = run_cli({"demo", "--out", campaign_path_});
    export_ = run_cli({"export", campaign_path_, "--out", bundle_path_});
    if (export_.status == 0) bundle_ = new formats::Bundle(formats::read_bundle(bundle_path_));
  }
  static void TearDownTestSuite() {
    delete bundle_;
    delete dir_;
  }
  void SetUp() override {
    ASSERT_EQ(demo_.status, 0) << demo_.err;
    ASSERT_EQ(export_.status, 0) << export_.err;
    ASSERT_NE(bundle_, nullptr);
  }
  static QString counts_file(const std::string& name, const std::vector<StepRecord>& records) {
    const QString path = dir_->filePath(QString::fromStdString(name));
    EXPECT_TRUE(
        write_text(path, formats::format_counts_csv(records, bundle_->steps.steps,
                                                    formats::counts_layout(bundle_->campaign))));
    return path;
  }
  static inline QTemporaryDir* dir_ = nullptr;
  static inline QString campaign_path_, bundle_path_;
  static inline cli_test::CliRun demo_, export_;
  static inline formats::Bundle* bundle_ = nullptr;
};

TEST_F(Handoff, SimulatedCountsComeBackAsTheKernelWithinThePredictedError) {
  const std::vector<StepRecord> records =
      simulate_counts(bundle_->campaign, bundle_->steps.steps, 21);
  const QString counts = counts_file("full.csv", records);
  const QString out = dir_->filePath("ingest full");
  const auto run = run_cli({"ingest", bundle_path_, counts, "--out", out});
  ASSERT_EQ(run.status, 0) << run.err;
  const QJsonObject j = read_json(QDir(out).filePath("ingest.json"));
  const Campaign& c = bundle_->campaign;
  const int n = c.data.train_count(), m = c.data.test_count();
  EXPECT_EQ(j["measured_entries"].toInt(), n * (n - 1) / 2 + m * n);
  EXPECT_EQ(j["unmeasured_train_entries"].toInt(), 0);
  EXPECT_EQ(j["missing_steps"].toArray().size(), 0);
  // z-scores recomputed here from zscores.csv and the planner's own predicted sigma: unbiased
  // estimates with the predicted variance are standard normal, so ~1900 of them have mean
  // 0 +- 0.023 and standard deviation 1 +- 0.016 (sampling error, common practice).
  const Plan plan = formats::plan_from_bundle(*bundle_);
  std::istringstream z(read_text(QDir(out).filePath("zscores.csv")));
  std::string line;
  std::getline(z, line);
  EXPECT_EQ(line, "block,row,col,step,measured,predicted,sigma_measured,z");
  double sum = 0, sq = 0;
  int count = 0, beyond5 = 0;
  while (std::getline(z, line)) {
    std::vector<std::string> f;
    std::stringstream fields(line);
    for (std::string x; std::getline(fields, x, ',');) f.push_back(x);
    ASSERT_EQ(f.size(), 8u) << line;
    const int row = std::stoi(f[1]), col = std::stoi(f[2]);
    const double measured = std::stod(f[4]);
    const bool train = f[0] == "train";
    const double ideal = train ? plan.kernel_train(row, col) : plan.kernel_test(row, col);
    const double sigma = train ? plan.sigma_train(row, col) : plan.sigma_test(row, col);
    const double zz = (measured - ideal) / sigma;
    sum += zz;
    sq += zz * zz;
    beyond5 += std::abs(zz) > 5 ? 1 : 0;
    ++count;
  }
  ASSERT_EQ(count, n * (n - 1) / 2 + m * n);
  const double mean = sum / count, sd = std::sqrt(sq / count - mean * mean);
  EXPECT_NEAR(mean, 0.0, 0.1);
  EXPECT_NEAR(sd, 1.0, 0.08);
  EXPECT_EQ(beyond5, 0);
  EXPECT_NEAR(j["z_mean"].toDouble(), 0.0, 0.1);
  EXPECT_NEAR(j["z_std"].toDouble(), 1.0, 0.08);
  // The measured kernel file has the unit diagonal and is symmetric.
  std::istringstream k(read_text(QDir(out).filePath("measured_kernel.csv")));
  int rows = 0;
  while (std::getline(k, line)) ++rows;
  EXPECT_EQ(rows, n);
  // The classifier was trained on the measured kernel and scored on the test labels.
  const QJsonObject svm = j["svm"].toObject();
  ASSERT_FALSE(svm.isEmpty()) << j["svm_skipped_reason"].toString().toStdString();
  EXPECT_EQ(svm["dual_coef"].toArray().size(), n);
  EXPECT_EQ(svm["decision_test"].toArray().size(), m);
  EXPECT_GE(svm["test_accuracy"].toDouble(), 0.0);
  EXPECT_LE(svm["test_accuracy"].toDouble(), 1.0);
  // No drift was simulated: at most a chance flag among the references.
  int flagged = 0;
  for (const QJsonValue& d : j["drift"].toArray()) flagged += d["drifted"].toBool() ? 1 : 0;
  EXPECT_LE(flagged, 1);
  EXPECT_GE(j["drift"].toArray().size(), 2);
  EXPECT_NE(run.out.find("Measured"), std::string::npos);
  // Ingesting again into the same folder is refused without --force, allowed with it.
  const auto again = run_cli({"ingest", bundle_path_, counts, "--out", out});
  EXPECT_EQ(again.status, 2);
  EXPECT_NE(again.err.find("--force"), std::string::npos) << again.err;
  EXPECT_EQ(run_cli({"ingest", bundle_path_, counts, "--out", out, "--force"}).status, 0);
}

TEST_F(Handoff, IngestSaysWhetherTheDecisionsAreStableEnoughToStop) {
  // The stop rule (docs/adaptive.md): stop only when no test point's flip probability is above
  // the campaign's threshold and the median margin ratio is at or above its threshold. Half a
  // night leaves half the entries unknown, which holds the campaign open.
  const Campaign& c = bundle_->campaign;
  const std::vector<StepRecord> all = simulate_counts(c, bundle_->steps.steps, 33);
  for (const bool half : {false, true}) {
    const std::vector<StepRecord> records(all.begin(),
                                          all.begin() + (half ? all.size() / 2 : all.size()));
    const std::string name = half ? "stop half" : "stop full";
    const QString out = dir_->filePath(QString::fromStdString(name));
    const auto run =
        run_cli({"ingest", bundle_path_, counts_file(name + ".csv", records), "--out", out});
    ASSERT_EQ(run.status, 0) << run.err;
    const QJsonObject j = read_json(QDir(out).filePath("ingest.json"));
    ASSERT_TRUE(j["stop"].isBool());
    const QJsonObject rule = j["stop_rule"].toObject();
    const QJsonArray holding = j["holding_points"].toArray();
    for (const QJsonValue& t : holding) {
      EXPECT_GE(t.toInt(), 0);
      EXPECT_LT(t.toInt(), c.data.test_count());
    }
    const bool stable = holding.isEmpty() && rule["margin_ratio_median"].toDouble() >=
                                                 rule["margin_ratio_threshold"].toDouble();
    EXPECT_EQ(j["stop"].toBool(), stable) << name;
    EXPECT_EQ(rule["flip_threshold"].toDouble(), c.check.flip_threshold);
    if (half) {
      EXPECT_GT(rule["unmeasured_entries"].toInt(), 0);
      EXPECT_FALSE(j["stop"].toBool());
      EXPECT_NE(run.out.find("not done yet"), std::string::npos) << run.out;
    } else {
      EXPECT_EQ(rule["unmeasured_entries"].toInt(), 0);
      EXPECT_NE(run.out.find(j["stop"].toBool() ? "decisions stable, stop" : "not done yet"),
                std::string::npos)
          << run.out;
    }
  }
}

TEST_F(Handoff, ATamperedBundleIsRefusedNamingTheFile) {
  std::map<std::string, std::string> entries =
      formats::unzip_entries(read_text(bundle_path_), "night.zip");
  std::string& csv = entries["steps.csv"];
  csv[csv.size() / 2] = csv[csv.size() / 2] == '1' ? '2' : '1';
  const QString tampered = dir_->filePath("tampered.zip");
  ASSERT_TRUE(write_text(tampered, formats::zip_entries(entries, QDateTime::currentDateTimeUtc())));
  const QString counts =
      counts_file("few.csv", simulate_counts(bundle_->campaign, bundle_->steps.steps, 1));
  const auto run = run_cli({"ingest", tampered, counts, "--out", dir_->filePath("never")});
  EXPECT_EQ(run.status, 2);
  EXPECT_NE(run.err.find("steps.csv"), std::string::npos) << run.err;
  EXPECT_FALSE(QDir(dir_->filePath("never")).exists());
}

TEST_F(Handoff, ExtraAndDuplicatedRowsAreRefusedByLineAndMissingStepsReported) {
  std::vector<StepRecord> records = simulate_counts(bundle_->campaign, bundle_->steps.steps, 5);
  const int steps = static_cast<int>(bundle_->steps.steps.size());
  // Extra: a step the bundle does not have (line 3 of the file); duplicated: the first row again.
  std::vector<StepRecord> bad = records;
  StepRecord extra = records[1];
  extra.step = steps + 7;
  bad.insert(bad.begin() + 1, extra);
  bad.push_back(records[0]);
  const auto run = run_cli(
      {"ingest", bundle_path_, counts_file("bad.csv", bad), "--out", dir_->filePath("bad out")});
  EXPECT_EQ(run.status, 2);
  EXPECT_NE(run.err.find("bad.csv: line 3, column 1 (step): step " + std::to_string(steps + 7) +
                         " is not in the plan"),
            std::string::npos)
      << run.err;
  EXPECT_NE(run.err.find("line " + std::to_string(bad.size() + 1)), std::string::npos) << run.err;
  EXPECT_NE(run.err.find("already counted on line 2"), std::string::npos) << run.err;

  // Missing only: every third measure step left out is reported, the rest is ingested.
  std::vector<StepRecord> partial;
  std::set<int> left_out;
  int measure_seen = 0;
  for (const StepRecord& r : records) {
    const bool measure = bundle_->steps.steps[r.step].kind == StepKind::measure;
    if (measure && measure_seen++ % 3 == 0) {
      left_out.insert(r.step);
      continue;
    }
    partial.push_back(r);
  }
  const QString out = dir_->filePath("partial out");
  const auto ok =
      run_cli({"ingest", bundle_path_, counts_file("partial.csv", partial), "--out", out});
  ASSERT_EQ(ok.status, 0) << ok.err;
  const QJsonObject j = read_json(QDir(out).filePath("ingest.json"));
  std::set<int> reported;
  for (const QJsonValue& v : j["missing_steps"].toArray()) reported.insert(v.toInt());
  EXPECT_EQ(reported, left_out);
  EXPECT_GT(j["unmeasured_train_entries"].toInt(), 0);
  EXPECT_TRUE(j["svm"].isNull());
  EXPECT_FALSE(j["svm_skipped_reason"].toString().isEmpty());
  EXPECT_NE(ok.out.find(std::to_string(left_out.size()) + " step(s) of the bundle have no counts"),
            std::string::npos)
      << ok.out;
}

TEST_F(Handoff, ExportRefusesToOverwriteWithoutForce) {
  const std::string before = read_text(bundle_path_);
  const auto run = run_cli({"export", campaign_path_, "--out", bundle_path_});
  EXPECT_EQ(run.status, 2);
  EXPECT_NE(run.err.find("night.zip"), std::string::npos) << run.err;
  EXPECT_EQ(read_text(bundle_path_), before);
  const QString other = dir_->filePath("other.zip");
  ASSERT_TRUE(write_text(other, "old"));
  EXPECT_EQ(run_cli({"export", campaign_path_, "--out", other, "--force"}).status, 0);
  EXPECT_EQ(read_text(other).substr(0, 2), "PK");
}

TEST_F(Handoff, ResumePlansTheRestFromTheLastPositionsAndNamesItsParent) {
  const Campaign& c = bundle_->campaign;
  const std::vector<StepRecord> all = simulate_counts(c, bundle_->steps.steps, 31);
  // The night stops after the first 40 % of the counted steps.
  const std::vector<StepRecord> first(all.begin(),
                                      all.begin() + static_cast<long>(all.size() * 2 / 5));
  const QString counts = counts_file("half.csv", first);
  const QString child_path = dir_->filePath("night2.zip");
  const auto run = run_cli({"resume", bundle_path_, counts, "--out", child_path});
  ASSERT_EQ(run.status, 0) << run.err;
  const formats::Bundle child = formats::read_bundle(child_path);
  ASSERT_TRUE(child.manifest.parent.has_value());
  EXPECT_EQ(child.manifest.parent->file_name, "night.zip");
  EXPECT_EQ(child.manifest.parent->manifest_sha256,
            formats::sha256_hex(bundle_->entries.at("manifest.json")));
  // Measured entries are not planned again; together they cover every entry exactly once.
  std::multiset<std::pair<int, int>> entries;
  auto key = [](const Step& s) {
    return std::make_pair(std::min(s.prep_point, s.analysis_point),
                          std::max(s.prep_point, s.analysis_point));
  };
  for (const StepRecord& r : first)
    if (bundle_->steps.steps[r.step].kind == StepKind::measure)
      entries.insert(key(bundle_->steps.steps[r.step]));
  for (const Step& s : child.steps.steps)
    if (s.kind == StepKind::measure) entries.insert(key(s));
  const int n = c.data.train_count(), m = c.data.test_count();
  EXPECT_EQ(entries.size(), static_cast<size_t>(n * (n - 1) / 2 + m * n));
  const std::set<std::pair<int, int>> distinct(entries.begin(), entries.end());
  EXPECT_EQ(distinct.size(), entries.size());
  // The first move starts where the motors stopped: the last counted step's positions
  // (the move model of docs/motion-model.md, recomputed here with motion.h).
  const std::vector<double>& stop = bundle_->steps.steps[first.back().step].position_deg;
  ASSERT_FALSE(child.steps.steps.empty());
  EXPECT_NEAR(child.steps.steps[0].move_s,
              step_move_s(c.rig, stop, child.steps.steps[0].position_deg), 1e-9);
  // What was measured travels with the child.
  EXPECT_EQ(child.measured_records.size(), first.size());

  // Counts for the rest, then ingest the child: every entry measured, z-scores standard normal.
  const std::vector<StepRecord> rest = simulate_counts(c, child.steps.steps, 32);
  const QString rest_path = dir_->filePath("rest.csv");
  ASSERT_TRUE(write_text(
      rest_path, formats::format_counts_csv(rest, child.steps.steps, formats::counts_layout(c))));
  const QString out = dir_->filePath("ingest child");
  const auto ingest = run_cli({"ingest", child_path, rest_path, "--out", out});
  ASSERT_EQ(ingest.status, 0) << ingest.err;
  const QJsonObject j = read_json(QDir(out).filePath("ingest.json"));
  EXPECT_EQ(j["measured_entries"].toInt(), n * (n - 1) / 2 + m * n);
  EXPECT_EQ(j["unmeasured_train_entries"].toInt(), 0);
  EXPECT_NEAR(j["z_mean"].toDouble(), 0.0, 0.1);
  EXPECT_NEAR(j["z_std"].toDouble(), 1.0, 0.08);
  EXPECT_FALSE(j["svm"].isNull());

  // The child is not overwritten without --force.
  EXPECT_EQ(run_cli({"resume", bundle_path_, counts, "--out", child_path}).status, 2);
}

}  // namespace
