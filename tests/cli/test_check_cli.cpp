// End to end: gramline-cli check writes the JSON of docs/plan-files.md. The decision values are
// checked against the definition f(x) = sum_i dual_coef_i K(x_i, x) + bias with kernel values read
// from the plan files, and the verdict against the campaign's thresholds.
#include <gtest/gtest.h>

#include <QFile>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>
#include <cmath>
#include <map>
#include <string>
#include <vector>

#include "cli_run.h"
#include "formats/campaign_json.h"
#include "gramline/demo.h"

namespace {

// Exit status of one gramline-cli run.
int run(const QStringList& arguments) { return cli_test::run_cli(arguments).status; }

QJsonObject read_json(const QString& path) {
  QFile f(path);
  if (!f.open(QIODevice::ReadOnly)) return {};
  return QJsonDocument::fromJson(f.readAll()).object();
}

std::vector<double> numbers(const QJsonValue& v) {
  std::vector<double> out;
  for (const QJsonValue& x : v.toArray()) out.push_back(x.toDouble());
  return out;
}

TEST(CheckCli, DecisionValuesFollowTheDefinitionAndTheVerdictTheThresholds) {
  QTemporaryDir dir;
  const QString campaign = dir.filePath("demo.json");
  ASSERT_EQ(run({"demo", "--out", campaign}), 0);
  ASSERT_EQ(run({"plan", campaign, "--out", dir.filePath("plan")}), 0);
  ASSERT_EQ(run({"check", campaign, "--trials", "200", "--out", dir.filePath("check.json")}), 0);
  const QJsonObject check = read_json(dir.filePath("check.json"));
  for (const char* key :
       {"verdict", "C", "dual_coef", "bias", "decision_train", "decision_test", "flip_probability",
        "flip_probability_max", "accuracy_median", "margin_ratio_median", "trials"})
    EXPECT_TRUE(check.contains(key)) << key;
  EXPECT_EQ(check["trials"].toInt(), 200);

  // Kernel values from the plan's steps: K(a, b) = kernel_ideal of the step measuring (a, b).
  const QJsonObject steps = read_json(dir.filePath("plan/steps.json"));
  std::map<std::pair<int, int>, double> k;
  for (const QJsonValue& v : steps["steps"].toArray()) {
    const QJsonObject s = v.toObject();
    if (s["kind"].toString() != "measure") continue;
    const int a = s["prep_point"].toInt(), b = s["analysis_point"].toInt();
    k[{std::min(a, b), std::max(a, b)}] = s["kernel_ideal"].toDouble();
  }
  auto kernel = [&](int a, int b) { return a == b ? 1.0 : k.at({std::min(a, b), std::max(a, b)}); };
  const std::vector<double> coef = numbers(check["dual_coef"]);
  const double bias = check["bias"].toDouble();
  const std::vector<double> f_train = numbers(check["decision_train"]);
  const std::vector<double> f_test = numbers(check["decision_test"]);
  ASSERT_EQ(coef.size(), 48u);
  ASSERT_EQ(f_train.size(), 48u);
  ASSERT_EQ(f_test.size(), 16u);
  for (int x = 0; x < 64; ++x) {
    double f = bias;
    for (int i = 0; i < 48; ++i) f += coef[i] * kernel(i, x);
    EXPECT_NEAR(x < 48 ? f_train[x] : f_test[x - 48], f, 1e-6) << "point " << x;
  }
  // Dual coefficients alpha_i y_i: 0 <= alpha_i <= C and sum_i alpha_i y_i = 0 (the C-SVC
  // dual constraints; Cortes & Vapnik, Machine Learning 20 (1995) 273).
  double sum = 0;
  for (double a : coef) {
    EXPECT_LE(std::abs(a), check["C"].toDouble() * (1 + 1e-9));
    sum += a;
  }
  EXPECT_NEAR(sum, 0.0, 1e-6);

  const double flip_max = check["flip_probability_max"].toDouble();
  double largest = 0;
  for (double p : numbers(check["flip_probability"])) largest = std::max(largest, p);
  EXPECT_DOUBLE_EQ(flip_max, largest);
  const bool pass =
      flip_max <= check["flip_threshold"].toDouble() &&
      check["margin_ratio_median"].toDouble() >= check["margin_ratio_threshold"].toDouble();
  EXPECT_EQ(check["verdict"].toString(), pass ? "pass" : "fail");
}

TEST(CheckCli, AStarvedBudgetFailsAndNamesItsPoints) {
  QTemporaryDir dir;
  gramline::Campaign c = gramline::make_demo_campaign();
  c.precision.fixed_pairs = 40;  // a few dozen pairs: sigma ~0.08 per entry
  const QString path = dir.filePath("starved.json");
  gramline::formats::save_campaign(c, path);
  ASSERT_EQ(run({"check", path, "--trials", "200", "--out", dir.filePath("check.json")}), 0);
  const QJsonObject check = read_json(dir.filePath("check.json"));
  EXPECT_EQ(check["verdict"].toString(), "fail");
  EXPECT_GT(check["flip_probability_max"].toDouble(), 0.01);
  EXPECT_FALSE(check["failing_points"].toArray().isEmpty());
}

TEST(CheckCli, WithoutOutTheJsonGoesToStandardOutputAndTheReportToStandardError) {
  QTemporaryDir dir;
  const QString campaign = dir.filePath("demo.json");
  ASSERT_EQ(run({"demo", "--out", campaign}), 0);
  const QString small = QString(GRAMLINE_TEST_DATA) + "/small_two_features.csv";
  const cli_test::CliRun piped =
      cli_test::run_cli({"check", campaign, "--data", small, "--trials", "60"});
  ASSERT_EQ(piped.status, 0) << piped.err;
  QJsonParseError error;
  QJsonObject from_stdout =
      QJsonDocument::fromJson(QByteArray::fromStdString(piped.out), &error).object();
  ASSERT_EQ(error.error, QJsonParseError::NoError) << piped.out;
  EXPECT_NE(piped.err.find("Margin check:"), std::string::npos) << piped.err;
  EXPECT_EQ(piped.out.find("Margin check:"), std::string::npos);

  // The same check with --out: the same JSON in the file (but for its own timing), the report
  // on standard output.
  const cli_test::CliRun to_file = cli_test::run_cli(
      {"check", campaign, "--data", small, "--trials", "60", "--out", dir.filePath("c.json")});
  ASSERT_EQ(to_file.status, 0) << to_file.err;
  EXPECT_NE(to_file.out.find("Margin check:"), std::string::npos) << to_file.out;
  EXPECT_NE(to_file.out.find("wrote the margin check to"), std::string::npos) << to_file.out;
  QJsonObject from_file = read_json(dir.filePath("c.json"));
  ASSERT_TRUE(from_file.contains("check_ms"));
  from_stdout.remove("check_ms");
  from_file.remove("check_ms");
  EXPECT_EQ(from_stdout, from_file);
}

}  // namespace
