// The bundle: manifest checksums, tamper refusal, unsafe and oversized entries, atomic saves
// that survive being killed, the printable summary.
#include <gtest/gtest.h>
#include <quazip/quazip.h>
#include <quazip/quazipfile.h>
#include <quazip/quazipnewinfo.h>
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <QBuffer>
#include <QCryptographicHash>
#include <QDateTime>
#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QRegularExpression>
#include <QTemporaryDir>
#include <algorithm>
#include <map>
#include <string>

#include "formats/atomic_file.h"
#include "formats/bundle.h"
#include "formats/input_error.h"
#include "formats/limits.h"
#include "formats/report_html.h"
#include "gramline/demo.h"
#include "gramline/plan.h"

namespace {

using namespace gramline;
using formats::InputError;

std::string read_text(const QString& path) {
  QFile f(path);
  if (!f.open(QIODevice::ReadOnly)) return {};
  return f.readAll().toStdString();
}

// A zip written by QuaZip directly, so entry names and contents are whatever the test wants.
std::string raw_zip(const std::map<std::string, std::string>& entries) {
  QBuffer buffer;
  QuaZip zip(&buffer);
  EXPECT_TRUE(zip.open(QuaZip::mdCreate));
  for (const auto& [name, bytes] : entries) {
    QuaZipFile f(&zip);
    EXPECT_TRUE(f.open(QIODevice::WriteOnly, QuaZipNewInfo(QString::fromStdString(name))));
    f.write(bytes.data(), static_cast<qint64>(bytes.size()));
    f.close();
  }
  zip.close();
  return buffer.data().toStdString();
}

std::string error_of(const std::string& zip, formats::BundleReadLimits limits = {}) {
  try {
    formats::parse_bundle(zip, "b.zip", limits);
  } catch (const InputError& e) {
    return e.what();
  }
  return "(accepted)";
}

class DemoBundle : public ::testing::Test {
 protected:
  static void SetUpTestSuite() {
    campaign_ = new Campaign(make_demo_campaign());
    plan_ = new Plan(plan_campaign(*campaign_));
    dir_ = new QTemporaryDir();
    path_ = dir_->filePath("demo.zip");
    formats::write_bundle(*campaign_, *plan_, path_);
    bytes_ = read_text(path_);
    entries_ = formats::unzip_entries(bytes_, "demo.zip");
  }
  static void TearDownTestSuite() {
    delete campaign_;
    delete plan_;
    delete dir_;
  }
  static inline Campaign* campaign_ = nullptr;
  static inline Plan* plan_ = nullptr;
  static inline QTemporaryDir* dir_ = nullptr;
  static inline QString path_;
  static inline std::string bytes_;
  static inline std::map<std::string, std::string> entries_;
};

TEST(Sha256, MatchesTheFipsExample) {
  // FIPS 180-2, appendix B.1: SHA-256("abc").
  EXPECT_EQ(formats::sha256_hex("abc"),
            "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
}

TEST_F(DemoBundle, ManifestListsEveryOtherFileWithItsSizeAndSha256) {
  for (const char* name : {"manifest.json", "campaign.json", "data.csv", "steps.json", "steps.csv",
                           "summary.json", "kernel.csv", "summary.html", "CAUTIONS.txt"})
    EXPECT_TRUE(entries_.count(name)) << name;
  const QJsonObject m =
      QJsonDocument::fromJson(QByteArray::fromStdString(entries_["manifest.json"])).object();
  EXPECT_EQ(m["format"].toString(), "gramline-bundle");
  // docs/plan-files.md, "Bundles": 32 lowercase hexadecimal digits.
  const QString id = m["bundle_id"].toString();
  EXPECT_EQ(id.size(), 32);
  EXPECT_TRUE(QRegularExpression("^[0-9a-f]{32}$").match(id).hasMatch()) << id.toStdString();
  EXPECT_EQ(m["tool_version"].toString(), GRAMLINE_VERSION);
  EXPECT_TRUE(m["parent"].isNull());
  EXPECT_FALSE(m["conventions"].toString().isEmpty());
  const QDateTime created = QDateTime::fromString(m["created_utc"].toString(), Qt::ISODate);
  ASSERT_TRUE(created.isValid()) << m["created_utc"].toString().toStdString();
  EXPECT_TRUE(m["created_utc"].toString().endsWith("Z"));
  EXPECT_LT(std::abs(created.secsTo(QDateTime::currentDateTimeUtc())), 600);
  const QJsonArray files = m["files"].toArray();
  EXPECT_EQ(files.size(), static_cast<qsizetype>(entries_.size() - 1));
  for (const QJsonValue& v : files) {
    const std::string name = v["name"].toString().toStdString();
    ASSERT_TRUE(entries_.count(name)) << name;
    const std::string& bytes = entries_[name];
    EXPECT_EQ(v["bytes"].toInteger(), static_cast<qint64>(bytes.size()));
    EXPECT_EQ(v["sha256"].toString().toStdString(),
              QCryptographicHash::hash(QByteArray::fromStdString(bytes), QCryptographicHash::Sha256)
                  .toHex()
                  .toStdString());
  }
}

TEST_F(DemoBundle, ReadsBackTheCampaignAndTheSteps) {
  const formats::Bundle b = formats::read_bundle(path_);
  EXPECT_EQ(b.campaign.data.train_count(), campaign_->data.train_count());
  ASSERT_EQ(b.steps.steps.size(), plan_->steps.size());
  const Plan p = formats::plan_from_bundle(b);
  EXPECT_EQ(p.summary.settings, plan_->summary.settings);
  // The predicted sigma rebuilt from the steps' pairs is the planner's (same detection.h formula).
  EXPECT_LT((p.sigma_train - plan_->sigma_train).cwiseAbs().maxCoeff(), 1e-9);
  EXPECT_LT((p.sigma_test - plan_->sigma_test).cwiseAbs().maxCoeff(), 1e-9);
}

TEST_F(DemoBundle, ChangingOneByteOfStepsCsvIsRefusedNamingTheFile) {
  std::map<std::string, std::string> changed = entries_;
  std::string& csv = changed["steps.csv"];
  const size_t at = csv.find("measure");
  ASSERT_NE(at, std::string::npos);
  csv[at] = 'M';  // a well-formed zip whose steps.csv differs from the manifest
  const std::string e = error_of(raw_zip(changed));
  EXPECT_NE(e.find("steps.csv"), std::string::npos) << e;
  EXPECT_NE(e.find("SHA-256"), std::string::npos) << e;
}

TEST_F(DemoBundle, FlippingAByteInsideTheArchiveIsRefusedNamingTheEntry) {
  // Entries are deflated; one changed byte in steps.csv's data breaks its CRC or its stream.
  const QByteArray zip = QByteArray::fromStdString(bytes_);
  const qsizetype header = zip.indexOf("steps.csv");
  ASSERT_GE(header, 0);
  std::string damaged = bytes_;
  damaged[static_cast<size_t>(header) + 9 + 200] ^= 0x5a;
  const std::string e = error_of(damaged);
  EXPECT_NE(e.find("steps.csv"), std::string::npos) << e;
}

TEST_F(DemoBundle, AnEntryTheManifestDoesNotListIsRefused) {
  std::map<std::string, std::string> more = entries_;
  more["resume.json"] = "{}";  // an entry the format defines, for resumed bundles
  EXPECT_NE(error_of(raw_zip(more)).find("resume.json: not listed"), std::string::npos);
}

TEST_F(DemoBundle, OversizedEntriesAreRefused) {
  formats::BundleReadLimits small;
  small.entry_bytes = 600000;  // only steps.json of the demo (~0.9 MB) is larger
  const std::string e = error_of(bytes_, small);
  EXPECT_NE(e.find("steps.json"), std::string::npos) << e;
  EXPECT_NE(e.find("limit"), std::string::npos) << e;
  // A small archive that inflates to far more than the limit (all zeros compress ~1000:1).
  const std::string bomb = raw_zip({{"manifest.json", std::string(4 << 20, '\0')}});
  EXPECT_LT(bomb.size(), 100000u);
  EXPECT_NE(error_of(bomb, small).find("limit"), std::string::npos);
}

TEST_F(DemoBundle, StepsNamingPointsThatDoNotExistAreRefusedEvenWithAValidManifest) {
  // A reference step naming point 999 would make the ingest engine read past the data set.
  std::map<std::string, std::string> changed = entries_;
  changed.erase("manifest.json");
  std::string& steps = changed["steps.json"];
  const size_t ref = steps.find("\"kind\":\"reference\"");
  ASSERT_NE(ref, std::string::npos);
  // Each step is one line with its keys in the documented order (docs/plan-files.md), so its
  // prep_point follows its kind.
  const size_t prep = steps.find("\"prep_point\":", ref);
  ASSERT_NE(prep, std::string::npos);
  const size_t value = prep + std::string("\"prep_point\":").size();
  steps.replace(value, steps.find(',', value) - value, "999");
  changed["manifest.json"] = formats::format_manifest(changed, 1, {});
  const std::string e = error_of(raw_zip(changed));
  EXPECT_NE(e.find("steps.json"), std::string::npos) << e;
  EXPECT_NE(e.find("point 999 does not exist"), std::string::npos) << e;
}

TEST(BundleReader, EntriesThatEscapeTheFolderAreRefused) {
  for (const char* name :
       {"../evil.txt", "a/../../evil.txt", "/etc/passwd", "C:/x.txt", "a\\..\\b", "./x", "a//b"}) {
    EXPECT_FALSE(formats::is_safe_entry_name(name)) << name;
    const std::string e = error_of(raw_zip({{name, "x"}}));
    EXPECT_NE(e.find("escape"), std::string::npos) << name << ": " << e;
  }
  for (const char* name : {"steps.json", "history/steps.json", "a..b.txt"})
    EXPECT_TRUE(formats::is_safe_entry_name(name)) << name;
}

TEST(BundleReader, GarbageIsRefusedWithoutCrashing) {
  EXPECT_NE(error_of("").find("b.zip"), std::string::npos);
  EXPECT_NE(error_of("PK\x03\x04 not really a zip").find("b.zip"), std::string::npos);
  EXPECT_NE(error_of(raw_zip({{"campaign.json", "{}"}})).find("no manifest"), std::string::npos);
}

TEST_F(DemoBundle, AnExistingFileIsNotOverwrittenWithoutPermission) {
  const QString path = dir_->filePath("keep.zip");
  {
    QFile f(path);
    ASSERT_TRUE(f.open(QIODevice::WriteOnly));
    f.write("precious");
  }
  EXPECT_THROW(formats::write_bundle(*campaign_, *plan_, path), InputError);
  EXPECT_EQ(read_text(path), "precious");
  formats::BundleWriteOptions force;
  force.overwrite = formats::Overwrite::allow;
  formats::write_bundle(*campaign_, *plan_, path, force);
  EXPECT_EQ(read_text(path).substr(0, 2), "PK");
}

TEST(AtomicFile, ASaveKilledHalfWayLeavesTheOldFileWhole) {
  QTemporaryDir dir;
  const QString path = dir.filePath("campaign.zip");
  const std::string old_bytes = "the user's previous bundle";
  formats::save_atomically(path, old_bytes, formats::Overwrite::refuse);
  int ready[2];
  ASSERT_EQ(pipe(ready), 0);
  const pid_t child = fork();
  ASSERT_GE(child, 0);
  if (child == 0) {
    // The child writes a large file through the same atomic writer and never finishes.
    close(ready[0]);
    try {
      formats::AtomicFile file(path, formats::Overwrite::allow);
      const std::string chunk(1 << 20, 'z');
      for (int i = 0;; ++i) {
        file.write(chunk);
        if (i == 3) {
          const char go = 'g';
          if (write(ready[1], &go, 1) != 1) _exit(3);
        }
        usleep(1000);
        if (i > 4000) break;
      }
    } catch (...) {
      _exit(4);
    }
    _exit(5);
  }
  close(ready[1]);
  char go = 0;
  ASSERT_EQ(read(ready[0], &go, 1), 1);  // the child has written 4 MiB by now
  close(ready[0]);
  ASSERT_EQ(kill(child, SIGKILL), 0);
  int status = 0;
  ASSERT_EQ(waitpid(child, &status, 0), child);
  ASSERT_TRUE(WIFSIGNALED(status));
  EXPECT_EQ(read_text(path), old_bytes);
  // Whatever the child left behind is under another name, never under the final one.
  EXPECT_EQ(QFileInfo(path).size(), static_cast<qint64>(old_bytes.size()));
}

TEST(SummaryHtml, LargeHeatmapsAreAveragedDownToAtMost200CellsASide) {
  // 450 x 450 entries valued by their row: blocks of 3 x 3 average to 3 i + 1.
  Eigen::MatrixXd m(450, 450);
  for (int i = 0; i < 450; ++i) m.row(i).setConstant(i);
  const std::string svg = formats::heatmap_svg(m, "rows");
  size_t rects = 0;
  for (size_t at = svg.find("<rect"); at != std::string::npos; at = svg.find("<rect", at + 1))
    ++rects;
  EXPECT_EQ(rects, 150u * 150u + 20u);  // 150 x 150 cells and the 20-step colour key
  EXPECT_NE(svg.find("mean of a 3 x 3 block"), std::string::npos);
  EXPECT_NE(svg.find(">448<"), std::string::npos);  // largest block mean: rows 447..449
  EXPECT_NE(svg.find(">1<"), std::string::npos);    // smallest: rows 0..2
}

TEST_F(DemoBundle, PrintableSummaryCarriesFiguresPlotsAndCautions) {
  Campaign c = *campaign_;
  c.name = "<script>alert(1)</script>";
  const std::string html = formats::format_summary_html(c, *plan_);
  EXPECT_EQ(html.find("<script>"), std::string::npos);
  EXPECT_NE(html.find("&lt;script&gt;"), std::string::npos);
  EXPECT_NE(html.find(std::to_string(plan_->summary.settings)), std::string::npos);
  EXPECT_GE(std::count(html.begin(), html.end(), '\n'), 10);
  size_t svgs = 0;
  for (size_t at = html.find("<svg"); at != std::string::npos; at = html.find("<svg", at + 1))
    ++svgs;
  EXPECT_EQ(svgs, 3u);  // timeline, training map, test map
  EXPECT_NE(html.find("laser safety officer"), std::string::npos);
  EXPECT_NE(html.find("nterlock"), std::string::npos);
  EXPECT_NE(html.find("without a person in the lab"), std::string::npos);
}

// Limits (docs/limits.md).

TEST(BundleLimits, EntriesTheFormatDoesNotDefineAreRefusedBeforeInflating) {
  // 8 MiB of zeros under an unknown name: refused by name, whatever its size.
  const std::string zip =
      raw_zip({{"manifest.json", "{}"}, {"padding.bin", std::string(8 << 20, '\0')}});
  const std::string e = error_of(zip);
  EXPECT_NE(e.find("padding.bin"), std::string::npos) << e;
  EXPECT_NE(e.find("not an entry the bundle format defines"), std::string::npos) << e;
}

TEST(BundleLimits, AKnownEntryLargerThanItsLimitIsRefusedByItsDeclaredSize) {
  const std::int64_t limit = formats::bundle_entry_limit("summary.json");
  ASSERT_EQ(limit, formats::limits::kSmallJsonBytes);
  const std::string zip =
      raw_zip({{"manifest.json", "{}"},
               {"summary.json", std::string(static_cast<size_t>(limit + 1), ' ')}});
  const std::string e = error_of(zip);
  EXPECT_NE(e.find("summary.json"), std::string::npos) << e;
  EXPECT_NE(e.find("declares"), std::string::npos) << e;
  EXPECT_NE(e.find(std::to_string(limit)), std::string::npos) << e;
}

TEST(BundleLimits, TheDeclaredTotalIsBounded) {
  formats::BundleReadLimits small;
  small.total_bytes = 1000;
  const std::string zip =
      raw_zip({{"manifest.json", std::string(600, ' ')}, {"campaign.json", std::string(600, ' ')}});
  const std::string e = error_of(zip, small);
  EXPECT_NE(e.find("together"), std::string::npos) << e;
  EXPECT_EQ(formats::bundle_entry_limit("notes.txt"), -1);
  EXPECT_GT(formats::bundle_entry_limit("steps.json"), 0);
}

}  // namespace
