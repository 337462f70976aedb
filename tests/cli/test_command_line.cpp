// The words of gramline-cli: every usage error exits 2 with a message that names the command and
// the option at fault, and both spellings of an option value work.
#include <gtest/gtest.h>

#include <QFile>
#include <QTemporaryDir>
#include <string>

#include "cli_run.h"

namespace {

using cli_test::CliRun;
using cli_test::run_cli;

QString data_file(const char* name) { return QString(GRAMLINE_TEST_DATA) + "/" + name; }

// Exit status 2 and a message holding every one of `parts`.
void expect_usage_error(const QStringList& arguments, std::initializer_list<const char*> parts) {
  const CliRun run = run_cli(arguments);
  EXPECT_EQ(run.status, 2) << arguments.join(' ').toStdString();
  for (const char* part : parts) {
    EXPECT_NE(run.err.find(part), std::string::npos)
        << arguments.join(' ').toStdString() << ": " << run.err;
  }
  EXPECT_TRUE(run.out.empty()) << run.out;
}

TEST(CommandLine, UnknownOptionIsNamed) {
  expect_usage_error({"plan", "x.json", "--colour", "red"}, {"gramline-cli plan", "'--colour'"});
  expect_usage_error({"ingest", "a.zip", "c.csv", "--out", "d", "--seed", "3"},
                     {"gramline-cli ingest", "'--seed'"});
  expect_usage_error({"demo", "--out", "a.json", "-q"}, {"gramline-cli demo", "'-q'"});
}

TEST(CommandLine, MissingValueIsNamed) {
  expect_usage_error({"plan", "x.json", "--seed"}, {"--seed", "needs a value"});
  expect_usage_error({"demo", "--out"}, {"--out", "needs a value"});
}

TEST(CommandLine, ValueOptionGivenTwiceIsRefused) {
  expect_usage_error({"plan", "x.json", "--seed", "3", "--seed", "4"}, {"--seed", "twice"});
  expect_usage_error({"resume", "a.zip", "c.csv", "--out=z.zip", "--out", "y.zip"},
                     {"--out", "twice"});
}

TEST(CommandLine, FlagGivenAValueIsRefused) {
  expect_usage_error({"export", "x.json", "--out", "a.zip", "--force=yes"},
                     {"--force", "takes no value"});
}

TEST(CommandLine, BadNumbersAndMissingWordsAreNamed) {
  expect_usage_error({"plan", "x.json", "--seed=abc"}, {"--seed", "'abc'"});
  expect_usage_error({"check", "x.json", "--trials", "0", "--out", "c.json"}, {"--trials", "'0'"});
  expect_usage_error({"ingest", "a.zip"}, {"the bundle and the counts file"});
  expect_usage_error({"plan", "x.json", "y.json"}, {"unexpected argument 'y.json'"});
  expect_usage_error({"export", "x.json"}, {"--out FILE.zip is required"});
  expect_usage_error({"frobnicate"}, {"unknown command 'frobnicate'"});
}

TEST(CommandLine, OptionsMayComeFirstAndTakeTheirValueAfterAnEqualsSign) {
  QTemporaryDir dir;
  const QString campaign = dir.filePath("demo.json");
  const CliRun demo = run_cli({"demo", "--out=" + campaign, "--seed=7"});
  ASSERT_EQ(demo.status, 0) << demo.err;
  ASSERT_TRUE(QFile::exists(campaign));
  const QString out = dir.filePath("plan");
  const CliRun plan = run_cli({"plan", "--seed", "3", "--out=" + out, "--data",
                               data_file("small_two_features.csv"), campaign});
  ASSERT_EQ(plan.status, 0) << plan.err;
  EXPECT_TRUE(QFile::exists(out + "/steps.json"));
}

TEST(CommandLine, HelpOfOneCommandShowsThatCommandOnly) {
  const CliRun overview = run_cli({"help"});
  ASSERT_EQ(overview.status, 0);
  for (const char* usage : {"demo --out FILE", "new --data CSV", "plan CAMPAIGN", "check CAMPAIGN",
                            "export CAMPAIGN", "ingest BUNDLE COUNTS", "resume BUNDLE COUNTS"}) {
    EXPECT_NE(overview.out.find(usage), std::string::npos) << usage;
  }
  const CliRun resume = run_cli({"help", "resume"});
  ASSERT_EQ(resume.status, 0) << resume.err;
  EXPECT_NE(
      resume.out.find("gramline-cli resume BUNDLE COUNTS --out FILE.zip [--first-night YYYY-MM-DD] "
                      "[--force]"),
      std::string::npos)
      << resume.out;
  EXPECT_NE(resume.out.find("--force"), std::string::npos);
  for (const char* other : {"plan CAMPAIGN", "ingest BUNDLE", "--data", "--trials", "--seed"}) {
    EXPECT_EQ(resume.out.find(other), std::string::npos) << other << " in\n" << resume.out;
  }
  // COMMAND --help (or -h, anywhere among the words) is the same text.
  EXPECT_EQ(run_cli({"resume", "--help"}).out, resume.out);
  EXPECT_EQ(run_cli({"resume", "a.zip", "-h"}).out, resume.out);
  const CliRun check = run_cli({"check", "--help"});
  EXPECT_NE(check.out.find("--trials"), std::string::npos);
  EXPECT_EQ(check.out.find("resume BUNDLE"), std::string::npos);
}

TEST(CommandLine, HelpOfAnUnknownCommandIsBadInput) {
  expect_usage_error({"help", "frobnicate"}, {"unknown command 'frobnicate'", "resume"});
  expect_usage_error({"help", "plan", "check"}, {"unexpected argument 'check'"});
}

}  // namespace
