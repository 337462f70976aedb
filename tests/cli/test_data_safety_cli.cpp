// Through gramline-cli: overflowing inputs and reserved feature names are refused with status 2
// naming the field (docs/parameter-ranges.md); the lab key signs and checks bundles
// (docs/bundle-integrity.md).
#include <gtest/gtest.h>

#include <QDir>
#include <QFile>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>
#include <string>
#include <vector>

#include "cli_run.h"
#include "formats/bundle.h"
#include "formats/counts_csv.h"
#include "formats/signature.h"
#include "handoff_fixtures.h"

namespace {

using namespace gramline;
using cli_test::run_cli;

using cli_test::read_text;

void write_text(const QString& path, const std::string& text) {
  ASSERT_TRUE(cli_test::write_text(path, text)) << path.toStdString();
}

class DataSafetyCli : public ::testing::Test {
 protected:
  void SetUp() override {
    campaign_ = dir_.filePath("demo.json");
    ASSERT_EQ(run_cli({"demo", "--out", campaign_}).status, 0);
    demo_ = QJsonDocument::fromJson(QByteArray::fromStdString(read_text(campaign_))).object();
  }
  /// The demo campaign with `edit` applied, saved under `name`.
  template <class F>
  QString edited(const char* name, F&& edit) {
    QJsonObject o = demo_;
    edit(o);
    const QString path = dir_.filePath(name);
    write_text(path, QJsonDocument(o).toJson().toStdString());
    return path;
  }
  QTemporaryDir dir_;
  QString campaign_;
  QJsonObject demo_;
};

TEST_F(DataSafetyCli, AFeatureOf1e308IsRefusedAndNothingIsWritten) {
  const QString path = edited("huge.json", [](QJsonObject& o) {
    QJsonObject data = o["data"].toObject();
    QJsonArray points = data["points"].toArray();
    QJsonObject p = points[0].toObject();
    p["features"] = QJsonArray{1e308, 0.5};
    points[0] = p;
    data["points"] = points;
    o["data"] = data;
  });
  const QString out = dir_.filePath("plan");
  const auto plan = run_cli({"plan", path, "--out", out});
  EXPECT_EQ(plan.status, 2) << plan.err;
  EXPECT_NE(plan.err.find("encoding.photons["), std::string::npos) << plan.err;
  EXPECT_FALSE(QFileInfo::exists(QDir(out).filePath("steps.json")));
  const auto exported = run_cli({"export", path, "--out", dir_.filePath("huge.zip")});
  EXPECT_EQ(exported.status, 2) << exported.err;
  EXPECT_FALSE(QFileInfo::exists(dir_.filePath("huge.zip")));
}

TEST_F(DataSafetyCli, AMotorSpeedOf5e324IsRefusedNamingTheField) {
  const QString path = edited("slow.json", [](QJsonObject& o) {
    QJsonObject rig = o["rig"].toObject();
    QJsonArray motors = rig["motors"].toArray();
    QJsonObject m = motors[2].toObject();
    m["speed_deg_per_s"] = 4.9e-324;
    motors[2] = m;
    rig["motors"] = motors;
    o["rig"] = rig;
  });
  const auto plan = run_cli({"plan", path});
  EXPECT_EQ(plan.status, 2) << plan.out;
  EXPECT_NE(plan.err.find("rig.motors[2].speed_deg_per_s: must lie in [0.01, 10000] deg/s"),
            std::string::npos)
      << plan.err;
}

TEST_F(DataSafetyCli, AQuotedLabelHeaderIsRefusedByTheReaderNotByExport) {
  const QString csv = dir_.filePath("names.csv");
  write_text(csv, "x,\" label \",label\n0.1,0.2,a\n0.3,0.1,b\n0.5,0.9,a\n0.7,0.4,b\n");
  const auto run = run_cli({"export", campaign_, "--data", csv, "--out", dir_.filePath("n.zip")});
  EXPECT_EQ(run.status, 2) << run.err;  // it was 1 (internal failure) when export refused it
  EXPECT_NE(run.err.find("names.csv:1: column 2"), std::string::npos) << run.err;
}

TEST_F(DataSafetyCli, ExportSignsAndIngestChecksWithTheLabKey) {
  const QString key = dir_.filePath("lab.key");
  write_text(key, "a shared secret of the lab, 2026\n");
  const QString signed_zip = dir_.filePath("signed.zip");
  const QString plain_zip = dir_.filePath("plain.zip");
  ASSERT_EQ(run_cli({"export", campaign_, "--out", signed_zip, "--lab-key", key}).status, 0);
  ASSERT_EQ(run_cli({"export", campaign_, "--out", plain_zip}).status, 0);
  const formats::Bundle bundle = formats::read_bundle(signed_zip);
  ASSERT_EQ(bundle.entries.count(formats::kSignatureEntry), 1u);
  const std::vector<StepRecord> records =
      handoff_test::simulate_counts(bundle.campaign, bundle.steps.steps, 5);
  const QString counts = dir_.filePath("counts.csv");
  write_text(counts, formats::format_counts_csv(records, bundle.steps.steps,
                                                formats::counts_layout(bundle.campaign)));
  // The first half of the night, for resume.
  const QString half = dir_.filePath("half.csv");
  const std::vector<StepRecord> first(records.begin(), records.begin() + records.size() / 2);
  write_text(half, formats::format_counts_csv(first, bundle.steps.steps,
                                              formats::counts_layout(bundle.campaign)));
  const auto ok =
      run_cli({"ingest", signed_zip, counts, "--out", dir_.filePath("in1"), "--lab-key", key});
  EXPECT_EQ(ok.status, 0) << ok.err;
  // The plain bundle under a key: refused, nothing written.
  const auto unsigned_run =
      run_cli({"ingest", plain_zip, counts, "--out", dir_.filePath("in2"), "--lab-key", key});
  EXPECT_EQ(unsigned_run.status, 2);
  EXPECT_NE(unsigned_run.err.find("signature.json: missing"), std::string::npos)
      << unsigned_run.err;
  EXPECT_FALSE(QFileInfo::exists(QDir(dir_.filePath("in2")).filePath("ingest.json")));
  // Resume checks the parent and signs the child with the same key.
  const QString child = dir_.filePath("child.zip");
  const auto resumed = run_cli({"resume", signed_zip, half, "--out", child, "--lab-key", key});
  ASSERT_EQ(resumed.status, 0) << resumed.err;
  EXPECT_EQ(formats::read_bundle(child).entries.count(formats::kSignatureEntry), 1u);
  // A key file that is too short is bad input.
  const QString weak = dir_.filePath("weak.key");
  write_text(weak, "1234\n");
  const auto weak_run =
      run_cli({"export", campaign_, "--out", dir_.filePath("w.zip"), "--lab-key", weak});
  EXPECT_EQ(weak_run.status, 2);
  EXPECT_NE(weak_run.err.find("at least 16"), std::string::npos) << weak_run.err;
}

}  // namespace
