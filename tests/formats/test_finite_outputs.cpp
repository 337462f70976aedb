// Outputs never hold NaN or an infinity (docs/parameter-ranges.md), one feature-name rule in
// every reader, and the keyed bundle signature (docs/bundle-integrity.md).
#include <gtest/gtest.h>

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>
#include <cmath>
#include <limits>
#include <map>
#include <optional>
#include <string>

#include "formats/bundle.h"
#include "formats/campaign_json.h"
#include "formats/check_json.h"
#include "formats/data_csv.h"
#include "formats/input_error.h"
#include "formats/plan_files.h"
#include "formats/signature.h"
#include "formats/text_io.h"
#include "gramline/demo.h"
#include "gramline/plan.h"

namespace {

using namespace gramline;
using formats::InputError;
using formats::NonFiniteOutput;

const double kNaN = std::numeric_limits<double>::quiet_NaN();
const double kInf = std::numeric_limits<double>::infinity();

template <class E, class F>
std::string message_of(F&& body) {
  try {
    body();
  } catch (const E& e) {
    return e.what();
  }
  return "(no error)";
}

class DemoPlan : public ::testing::Test {
 protected:
  static void SetUpTestSuite() {
    campaign_ = new Campaign(make_demo_campaign());
    plan_ = new Plan(plan_campaign(*campaign_));
  }
  static void TearDownTestSuite() {
    delete campaign_;
    delete plan_;
  }
  static Campaign* campaign_;
  static Plan* plan_;
};
Campaign* DemoPlan::campaign_ = nullptr;
Plan* DemoPlan::plan_ = nullptr;

// --- No NaN or infinity in any output -------------------------------------------------------

TEST_F(DemoPlan, StepsWritersRefuseANonFiniteFigureNamingIt) {
  std::vector<Step> steps = plan_->steps;
  steps[4].position_deg[1] = kNaN;
  const std::string json =
      message_of<NonFiniteOutput>([&] { formats::format_steps_json(campaign_->rig, steps); });
  EXPECT_NE(json.find("steps.json: steps[4].position_deg." + campaign_->rig.motors[1].name),
            std::string::npos)
      << json;
  const std::string csv =
      message_of<NonFiniteOutput>([&] { formats::format_steps_csv(campaign_->rig, steps); });
  EXPECT_NE(csv.find("steps.csv: line 6, " + campaign_->rig.motors[1].name + "_deg"),
            std::string::npos)
      << csv;
  steps = plan_->steps;
  steps[0].move_s = -kInf;
  EXPECT_NE(message_of<NonFiniteOutput>([&] {
              formats::format_steps_json(campaign_->rig, steps);
            }).find("steps[0].move_s"),
            std::string::npos);
}

TEST_F(DemoPlan, SummaryAndKernelRefuseNonFiniteFigures) {
  Plan p = *plan_;
  p.gram_error.sigma_max = kNaN;
  EXPECT_NE(message_of<NonFiniteOutput>([&] {
              formats::format_summary_json(*campaign_, p);
            }).find("summary.json: gram_sigma_max"),
            std::string::npos);
  Eigen::MatrixXd k = plan_->kernel_train;
  k(2, 3) = kInf;
  EXPECT_NE(message_of<NonFiniteOutput>([&] {
              formats::format_kernel_csv(k);
            }).find("kernel.csv: row 3, column 4"),
            std::string::npos);
}

TEST_F(DemoPlan, PlanFilesWriteNothingWhenOneFigureIsNotFinite) {
  Plan p = *plan_;
  p.kernel_train(0, 1) = kNaN;  // kernel.csv is the last file of the set
  QTemporaryDir dir;
  const QString out = dir.filePath("plan");
  EXPECT_THROW(formats::write_plan_files(*campaign_, p, out), NonFiniteOutput);
  EXPECT_FALSE(QFileInfo::exists(QDir(out).filePath("steps.json")));
}

TEST(FiniteJson, EveryNestedNumberIsChecked) {
  // Qt writes a NaN double as null: JSON has no NaN (RFC 8259, section 6), and our readers
  // refuse null where a number belongs. The check finds it at any depth and names the path.
  const QJsonObject o{
      {"a", 1.0}, {"b", QJsonArray{1.0, QJsonObject{{"c", kNaN}}}}, {"d", QJsonValue::Null}};
  EXPECT_EQ(message_of<NonFiniteOutput>([&] {
              formats::require_finite_json(o, "x.json");
            }).rfind("x.json: b[1].c: ", 0),
            0u);
  EXPECT_NO_THROW(formats::require_finite_json(QJsonObject{{"d", QJsonValue::Null}}, "x.json"));
  EXPECT_EQ(formats::finite_number_text(0.1, "f"), "0.1");
  EXPECT_THROW(formats::finite_seventeen_digit_text(-kInf, "f"), NonFiniteOutput);
}

// --- One feature-name rule ------------------------------------------------------------------

TEST(FeatureNameRule, DataCsvRefusesAQuotedReservedHeaderNamingTheColumn) {
  // The quoted header " label " is a feature column to the CSV splitter, which would collide
  // with the class column once written back: export used to fail with status 1 on it.
  for (const char* text : {"\" label \",label\n0,a\n1,b\n", "x,\"SET \",label\n0,1,a\n1,2,b\n"}) {
    const std::string e =
        message_of<InputError>([&] { formats::parse_data_csv(text, "names.csv"); });
    EXPECT_NE(e.find("names.csv:1: column "), std::string::npos) << e;
    EXPECT_NE(e.find("reserved"), std::string::npos) << e;
  }
  // A name that merely contains the word is fine.
  EXPECT_NO_THROW(formats::parse_data_csv("labels,label\n0,a\n1,b\n", "ok.csv"));
}

TEST(FeatureNameRule, CampaignJsonRefusesReservedNamesNamingTheField) {
  const Campaign demo = make_demo_campaign();
  for (const char* bad : {"label", " Set ", ""}) {
    QJsonObject root =
        QJsonDocument::fromJson(QByteArray::fromStdString(formats::format_campaign(demo))).object();
    QJsonObject data = root["data"].toObject();
    QJsonArray names = data["feature_names"].toArray();
    names[1] = QString::fromStdString(bad);
    data["feature_names"] = names;
    root["data"] = data;
    const std::string text = QJsonDocument(root).toJson().toStdString();
    const std::string e = message_of<InputError>([&] { formats::parse_campaign(text, "c.json"); });
    EXPECT_NE(e.find("data.feature_names[1]"), std::string::npos) << e;
  }
}

// --- Keyed signature ------------------------------------------------------------------------

std::string unhex(const std::string& hex) {
  return QByteArray::fromHex(QByteArray::fromStdString(hex)).toStdString();
}

TEST(Signature, HmacSha256MatchesRfc4231TestVectors) {
  // RFC 4231, section 4: test cases 1-4, 6 and 7 (case 5 truncates the output, not used here).
  struct Vector {
    std::string key, data, hmac;
  };
  const std::string aa131(131, '\xaa');
  const Vector vectors[] = {
      {std::string(20, '\x0b'), "Hi There",
       "b0344c61d8db38535ca8afceaf0bf12b881dc200c9833da726e9376c2e32cff7"},
      {"Jefe", "what do ya want for nothing?",
       "5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843"},
      {std::string(20, '\xaa'), std::string(50, '\xdd'),
       "773ea91e36800e46854db8ebd09181a72959098b3ef8c122d9635514ced565fe"},
      {unhex("0102030405060708090a0b0c0d0e0f10111213141516171819"), std::string(50, '\xcd'),
       "82558a389a443c0ea4cc819899f2083a85f0faa3e578f8077a2e3ff46729665b"},
      {aa131, "Test Using Larger Than Block-Size Key - Hash Key First",
       "60e431591ee0b67f0d8a26aacbf5b77f8e0bc6213728c5140546040f0ee37f54"},
      {aa131,
       "This is a test using a larger than block-size key and a larger than block-size data. "
       "The key needs to be hashed before being used by the HMAC algorithm.",
       "9b09ffa71b942fcb27635fbcd5b0e944bfdc63644f0713938a7f51535c3a35e2"},
  };
  for (const Vector& v : vectors) EXPECT_EQ(formats::hmac_sha256_hex(v.key, v.data), v.hmac);
}

class SignedBundle : public DemoPlan {
 protected:
  const std::string key_ = "lab key: 7f3a91c0 d2e4 tuesday";
  QTemporaryDir dir_;
  QString write(const std::optional<std::string>& key, const char* name) {
    const QString path = dir_.filePath(name);
    formats::BundleWriteOptions options;
    options.lab_key = key;
    formats::write_bundle(*campaign_, *plan_, path, options);
    return path;
  }
  static std::string read(const QString& path) {
    QFile f(path);
    EXPECT_TRUE(f.open(QIODevice::ReadOnly));
    return f.readAll().toStdString();
  }
};

TEST_F(SignedBundle, SignedWithTheKeyIsAcceptedAndUnsignedIsRefusedWhenAKeyIsGiven) {
  const QString signed_path = write(key_, "signed.zip");
  const QString plain_path = write(std::nullopt, "plain.zip");
  EXPECT_NO_THROW(formats::read_bundle_checked(signed_path, key_));
  // Without a key both are read as before: the signature is optional.
  EXPECT_NO_THROW(formats::read_bundle_checked(signed_path, std::nullopt));
  EXPECT_NO_THROW(formats::read_bundle_checked(plain_path, std::nullopt));
  const std::string missing =
      message_of<InputError>([&] { formats::read_bundle_checked(plain_path, key_); });
  EXPECT_NE(missing.find("signature.json: missing"), std::string::npos) << missing;
  const std::string other = message_of<InputError>([&] {
    formats::read_bundle_checked(signed_path, std::string("another key of the lab ..."));
  });
  EXPECT_NE(other.find("another lab key"), std::string::npos) << other;
}

TEST_F(SignedBundle, ARehashedManifestOverAChangedStepsFileIsRefused) {
  // The attack plain checksums cannot stop: change steps.json, recompute its SHA-256 in the
  // manifest, zip again. The manifest checks pass; the signature does not.
  const QString path = write(key_, "signed.zip");
  std::map<std::string, std::string> entries = formats::unzip_entries(read(path), "signed.zip");
  std::string& steps = entries.at(formats::kStepsJsonEntry);
  const size_t at = steps.find("\"dwell_s\":");
  ASSERT_NE(at, std::string::npos);
  steps.insert(at + 10, "9");  // one dwell ten times longer (or more)
  std::map<std::string, std::string> listed = entries;
  listed.erase(formats::kManifestEntry);
  listed.erase(formats::kSignatureEntry);
  formats::BundleWriteOptions o;
  o.created_utc = QDateTime::currentDateTimeUtc();
  entries[formats::kManifestEntry] = formats::format_manifest(listed, campaign_->seed, o);
  const std::string forged = formats::zip_entries(entries, o.created_utc);
  EXPECT_NO_THROW(formats::parse_bundle(forged, "forged.zip"));  // checksums agree
  const std::string e = message_of<InputError>([&] {
    formats::verify_signature(formats::parse_bundle(forged, "forged.zip").entries, key_,
                              "forged.zip");
  });
  EXPECT_NE(e.find("forged.zip: signature.json: hmac"), std::string::npos) << e;
}

TEST(LabKey, ShortMissingAndOversizedKeyFilesAreRefused) {
  QTemporaryDir dir;
  auto file = [&](const char* name, const std::string& bytes) {
    QFile f(dir.filePath(name));
    EXPECT_TRUE(f.open(QIODevice::WriteOnly));
    f.write(bytes.data(), static_cast<qint64>(bytes.size()));
    return dir.filePath(name);
  };
  EXPECT_EQ(formats::read_lab_key(file("ok.key", "0123456789abcdef0123\n")),
            "0123456789abcdef0123");
  EXPECT_NE(message_of<InputError>([&] {
              formats::read_lab_key(file("short.key", "pass\n"));
            }).find("at least 16"),
            std::string::npos);
  EXPECT_THROW(formats::read_lab_key(file("big.key", std::string(5000, 'k'))), InputError);
  EXPECT_THROW(formats::read_lab_key(dir.filePath("none.key")), InputError);
  EXPECT_THROW(formats::read_lab_key(dir.path()), InputError);
}

}  // namespace
