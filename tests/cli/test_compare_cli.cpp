// End to end: gramline-cli compare (docs/plan-files.md, "Comparing two plans"). Each side's
// figures are checked against the summary.json that `plan --out` writes for the same campaign,
// and the differences against b - a.
#include <gtest/gtest.h>

#include <QFile>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>

#include "cli_run.h"
#include "formats/campaign_json.h"

namespace {

QJsonObject read_json(const QString& path) {
  QFile f(path);
  if (!f.open(QIODevice::ReadOnly)) return {};
  return QJsonDocument::fromJson(f.readAll()).object();
}

// The demo, and the demo with every motor at half its speed.
struct TwoCampaigns {
  QTemporaryDir dir;
  QString a, b;
  TwoCampaigns() {
    a = dir.filePath("fast.json");
    b = dir.filePath("slow.json");
    EXPECT_EQ(cli_test::run_cli({"demo", "--out", a}).status, 0);
    gramline::Campaign slow = gramline::formats::load_campaign(a);
    slow.name = "demo, motors at half speed";
    for (auto& m : slow.rig.motors) m.speed_deg_per_s /= 2.0;
    gramline::formats::save_campaign(slow, b);
  }
};

TEST(CompareCli, SidesMatchEachPlansSummaryAndDifferencesAreBMinusA) {
  TwoCampaigns c;
  const QString out = c.dir.filePath("compare.json");
  const cli_test::CliRun run = cli_test::run_cli({"compare", c.a, c.b, "--out", out});
  ASSERT_EQ(run.status, 0) << run.err;
  // The table: a header and one row per figure, on standard output.
  EXPECT_NE(run.out.find("move time"), std::string::npos) << run.out;
  EXPECT_NE(run.out.find("B - A"), std::string::npos) << run.out;

  ASSERT_EQ(cli_test::run_cli({"plan", c.a, "--out", c.dir.filePath("plan_a")}).status, 0);
  ASSERT_EQ(cli_test::run_cli({"plan", c.b, "--out", c.dir.filePath("plan_b")}).status, 0);
  const QJsonObject json = read_json(out);
  ASSERT_TRUE(json.contains("a") && json.contains("b") && json.contains("difference"));
  const QJsonObject a = json["a"].toObject(), b = json["b"].toObject();
  const QJsonObject d = json["difference"].toObject();
  EXPECT_EQ(a["name"].toString(), "Demo: two-arm rig, curved boundary");
  EXPECT_EQ(b["name"].toString(), "demo, motors at half speed");

  const QJsonObject summary[2] = {read_json(c.dir.filePath("plan_a/summary.json")),
                                  read_json(c.dir.filePath("plan_b/summary.json"))};
  const QJsonObject side[2] = {a, b};
  for (int i = 0; i < 2; ++i) {
    for (const char* key :
         {"nights", "total_s", "move_s", "integration_s", "reference_s", "epsilon_reached",
          "gram_sigma_frobenius", "pairs_total", "settings", "steps"})
      EXPECT_DOUBLE_EQ(side[i][key].toDouble(), summary[i][key].toDouble()) << key;
    // Busy time: the sum of the nights' busy time in summary.json.
    double busy_s = 0.0;
    for (const QJsonValue& n : summary[i]["night_use"].toArray())
      busy_s += n.toObject()["busy_s"].toDouble();
    EXPECT_NEAR(side[i]["busy_s"].toDouble(), busy_s, 1e-6 * busy_s);
    EXPECT_EQ(side[i]["fits"].toBool(), summary[i]["fits"].toBool());
  }
  // Every numeric figure of a side has its difference, b - a.
  int numeric = 0;
  for (const QString& key : a.keys()) {
    if (!a[key].isDouble()) continue;
    ++numeric;
    ASSERT_TRUE(d.contains(key)) << key.toStdString();
    EXPECT_DOUBLE_EQ(d[key].toDouble(), b[key].toDouble() - a[key].toDouble()) << key.toStdString();
  }
  EXPECT_EQ(numeric, d.size());
  // Slower motors take longer to move (the move time is distance over speed plus ramps,
  // docs/motion-model.md); the settings measured and their counting do not depend on the motors.
  EXPECT_GT(d["move_s"].toDouble(), 0.0);
  EXPECT_DOUBLE_EQ(d["settings"].toDouble(), 0.0);
  EXPECT_NEAR(d["integration_s"].toDouble(), 0.0, 1e-6 * a["integration_s"].toDouble());
}

TEST(CompareCli, RefusesAnExistingOutputAndNamesABadFile) {
  TwoCampaigns c;
  const QString out = c.dir.filePath("compare.json");
  {
    QFile f(out);
    ASSERT_TRUE(f.open(QIODevice::WriteOnly));
    f.write("keep me");
  }
  const cli_test::CliRun refused = cli_test::run_cli({"compare", c.a, c.b, "--out", out});
  EXPECT_EQ(refused.status, 2);
  QFile kept(out);
  ASSERT_TRUE(kept.open(QIODevice::ReadOnly));
  EXPECT_EQ(kept.readAll(), QByteArray("keep me"));
  EXPECT_EQ(cli_test::run_cli({"compare", c.a, c.b, "--out", out, "--force"}).status, 0);

  const QString missing = c.dir.filePath("missing.json");
  const cli_test::CliRun bad = cli_test::run_cli({"compare", c.a, missing});
  EXPECT_EQ(bad.status, 2);
  EXPECT_NE(bad.err.find("missing.json"), std::string::npos) << bad.err;
  // Without --out only the table is written.
  const cli_test::CliRun table = cli_test::run_cli({"compare", c.a, c.a});
  EXPECT_EQ(table.status, 0);
  EXPECT_NE(table.out.find("nights"), std::string::npos);
}

}  // namespace
