// One overwrite policy for every command that writes: an existing output is left byte for byte
// as it was unless --force is given, and the refusal names the file and the way out.
#include <gtest/gtest.h>

#include <QDir>
#include <QFile>
#include <QTemporaryDir>
#include <string>

#include "cli_run.h"

namespace {

using cli_test::CliRun;
using cli_test::run_cli;

QString data_file(const char* name) { return QString(GRAMLINE_TEST_DATA) + "/" + name; }

std::string read_text(const QString& path) {
  QFile f(path);
  if (!f.open(QIODevice::ReadOnly)) return {};
  return f.readAll().toStdString();
}

void write_text(const QString& path, const std::string& text) {
  QFile f(path);
  ASSERT_TRUE(f.open(QIODevice::WriteOnly));
  f.write(text.data(), static_cast<qint64>(text.size()));
}

void expect_refused(const CliRun& run, const QString& path) {
  EXPECT_EQ(run.status, 2) << run.err;
  EXPECT_NE(run.err.find(path.toStdString()), std::string::npos) << run.err;
  EXPECT_NE(run.err.find("--force"), std::string::npos) << run.err;
}

class Overwrite : public ::testing::Test {
 protected:
  void SetUp() override {
    campaign_ = dir_.filePath("demo.json");
    ASSERT_EQ(run_cli({"demo", "--out", campaign_}).status, 0);
  }
  QTemporaryDir dir_;
  QString campaign_;
  const std::string mine_ = "the user's own bytes\n";
};

TEST_F(Overwrite, DemoKeepsAnExistingFileUnlessForced) {
  const QString path = dir_.filePath("taken.json");
  write_text(path, mine_);
  expect_refused(run_cli({"demo", "--out", path}), path);
  EXPECT_EQ(read_text(path), mine_);
  ASSERT_EQ(run_cli({"demo", "--out", path, "--force"}).status, 0);
  EXPECT_EQ(read_text(path), read_text(campaign_));
}

TEST_F(Overwrite, PlanKeepsAFolderHoldingAnyPlanFileUnlessForced) {
  const QString out = dir_.filePath("plan");
  ASSERT_TRUE(QDir().mkpath(out));
  const QDir dir(out);
  write_text(dir.filePath("kernel.csv"), mine_);
  const CliRun refused = run_cli({"plan", campaign_, "--out", out});
  expect_refused(refused, dir.filePath("kernel.csv"));
  EXPECT_EQ(read_text(dir.filePath("kernel.csv")), mine_);
  for (const char* name : {"steps.json", "steps.csv", "summary.json"}) {
    EXPECT_FALSE(QFile::exists(dir.filePath(name))) << name;  // nothing of the set was written
  }
  const CliRun forced = run_cli({"plan", campaign_, "--out", out, "--force"});
  ASSERT_EQ(forced.status, 0) << forced.err;
  EXPECT_NE(read_text(dir.filePath("kernel.csv")), mine_);
}

TEST_F(Overwrite, PlanWritesBesideTheUsersOtherFiles) {
  const QString out = dir_.filePath("shared folder");
  ASSERT_TRUE(QDir().mkpath(out));
  const QString notes = QDir(out).filePath("notes.txt");
  write_text(notes, mine_);
  const CliRun run = run_cli({"plan", campaign_, "--out", out});
  ASSERT_EQ(run.status, 0) << run.err;
  EXPECT_TRUE(QFile::exists(QDir(out).filePath("steps.json")));
  EXPECT_EQ(read_text(notes), mine_);
}

TEST_F(Overwrite, CheckKeepsAnExistingFileUnlessForced) {
  const QString path = dir_.filePath("check.json");
  write_text(path, mine_);
  const QStringList check = {"check",    campaign_, "--data", data_file("small_two_features.csv"),
                             "--trials", "20",      "--out",  path};
  expect_refused(run_cli(check), path);
  EXPECT_EQ(read_text(path), mine_);
  const CliRun forced = run_cli(check + QStringList{"--force"});
  ASSERT_EQ(forced.status, 0) << forced.err;
  EXPECT_NE(read_text(path).find("\"verdict\""), std::string::npos);
}

TEST_F(Overwrite, ExportIngestAndResumeFollowTheSamePolicy) {
  const QString path = dir_.filePath("taken.zip");
  write_text(path, mine_);
  expect_refused(run_cli({"export", campaign_, "--out", path}), path);
  EXPECT_EQ(read_text(path), mine_);
  // The bundle is read after the refusal, so none is needed to see it.
  expect_refused(run_cli({"resume", "no-bundle.zip", "no-counts.csv", "--out", path}), path);
  EXPECT_EQ(read_text(path), mine_);
  const QString results = dir_.filePath("measured");
  ASSERT_TRUE(QDir().mkpath(results));
  const QString drift = QDir(results).filePath("drift.csv");
  write_text(drift, mine_);
  expect_refused(run_cli({"ingest", "no-bundle.zip", "no-counts.csv", "--out", results}), drift);
  EXPECT_EQ(read_text(drift), mine_);
}

}  // namespace
