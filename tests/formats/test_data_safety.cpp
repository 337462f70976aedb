// Data safety of the file layer (docs/limits.md): strict JSON, bounded counts (bundle limits:
// test_bundle.cpp), error lists cut short, sets of files saved and checked as one.
#include <gtest/gtest.h>
#include <unistd.h>

#include <QDir>
#include <QFile>
#include <QTemporaryDir>
#include <map>
#include <string>
#include <vector>

#include "formats/campaign_json.h"
#include "formats/counts_csv.h"
#include "formats/input_error.h"
#include "formats/json_field.h"
#include "formats/limits.h"
#include "formats/plan_files.h"
#include "gramline/demo.h"
#include "gramline/plan.h"
#include "text_files.h"

namespace {

using namespace gramline;
using formats::InputError;
namespace limits = formats::limits;

template <class F>
std::string error_of(F&& f) {
  try {
    f();
  } catch (const InputError& e) {
    return e.what();
  }
  return "(accepted)";
}

using test_files::read_text;

void write_text(const QString& path, const std::string& text) {
  ASSERT_TRUE(test_files::write_text(path, text)) << path.toStdString();
}

// --- JSON -----------------------------------------------------------------------------------

TEST(StrictJson, AKeyGivenTwiceIsRefusedNamingIt) {
  const std::string campaign = formats::format_campaign(make_demo_campaign());
  const size_t at = campaign.find("\"epsilon\"");
  ASSERT_NE(at, std::string::npos);
  std::string twice = campaign;
  twice.insert(at, "\"epsilon\": 0.5,\n        ");
  const std::string e = error_of([&] { formats::parse_campaign(twice, "campaign.json"); });
  EXPECT_NE(e.find("precision.epsilon"), std::string::npos) << e;
  EXPECT_NE(e.find("twice"), std::string::npos) << e;
  // The same key spelt with an escape is the same key (RFC 8259, section 7).
  EXPECT_NE(error_of([] {
              formats::parse_json_document(R"({"a": 1, "\u0061": 2})", "x.json");
            }).find("twice"),
            std::string::npos);
  // The same name in two different objects is fine.
  EXPECT_EQ(
      error_of([] { formats::parse_json_document(R"({"a": {"b": 1}, "c": {"b": 2}})", "x"); }),
      "(accepted)");
}

TEST(StrictJson, ARawNulInsideAStringIsRefusedNamingTheKey) {
  std::string text = "{\"name\": \"ab";
  text += '\0';
  text += "cd\"}";
  const std::string e = error_of([&] { formats::parse_json_document(text, "x.json"); });
  EXPECT_NE(e.find("name"), std::string::npos) << e;
  EXPECT_NE(e.find("control character"), std::string::npos) << e;
  // Escaped, the same character is valid JSON (RFC 8259, section 7).
  EXPECT_EQ(error_of([] { formats::parse_json_document(R"({"name": "ab\u0001cd"})", "x"); }),
            "(accepted)");
}

// --- Counts ---------------------------------------------------------------------------------

formats::CountsLayout two_photons() {
  formats::CountsLayout l;
  l.channels = 4;
  l.photons = 2;
  l.scheme_text = "both-ports";
  return l;
}

std::string counts_error(const std::string& rows) {
  const std::string text =
      "step,kind,start_s,end_s,ch0,ch1,ch2,ch3,singles0_per_s,singles1_per_s\n" + rows;
  return error_of([&] { formats::parse_counts_csv(text, "night.csv", two_photons()); });
}

TEST(CountsLimits, AbsurdRatesIntervalsAndTimesAreRefusedNamingTheColumn) {
  EXPECT_EQ(counts_error("0,measure,0,1,10,20,30,40,50000,60000\n"), "(accepted)");
  const std::string singles = counts_error("0,measure,0,1,10,20,30,40,1e308,60000\n");
  EXPECT_NE(singles.find("singles0_per_s"), std::string::npos) << singles;
  const std::string interval = counts_error("0,measure,0,5e-324,10,20,30,40,5,6\n");
  EXPECT_NE(interval.find("end_s"), std::string::npos) << interval;
  EXPECT_NE(interval.find("shorter"), std::string::npos) << interval;
  const std::string time = counts_error("0,measure,1e308,1.5e308,10,20,30,40,5,6\n");
  EXPECT_NE(time.find("start_s"), std::string::npos) << time;
  // 10^12 coincidences in one second: a thousand times what any detector counts.
  const std::string counts = counts_error("0,measure,0,1,1000000000000,20,30,40,5,6\n");
  EXPECT_NE(counts.find("ch0"), std::string::npos) << counts;
}

TEST(CountsLimits, AProblemListShowsTheFirstFiftyAndCountsTheRest) {
  std::vector<Step> steps(2);
  steps[0].kind = StepKind::measure;
  steps[1].kind = StepKind::measure;
  std::string text = "step,kind,start_s,end_s,ch0,ch1,ch2,ch3\n";
  for (int i = 0; i < 200; ++i)
    text += "0,measure," + std::to_string(i) + "," + std::to_string(i + 1) + ",1,2,3,4\n";
  const formats::CountsFile file = formats::parse_counts_csv(text, "night.csv", two_photons());
  const formats::CountsCheck check = formats::check_counts(file, steps);
  ASSERT_EQ(check.duplicated.size(), 199u);
  const std::string report = check.report();
  size_t lines = 0;
  for (size_t at = report.find("was already counted"); at != std::string::npos;
       at = report.find("was already counted", at + 1))
    ++lines;
  EXPECT_EQ(lines, static_cast<size_t>(limits::kListedErrors));
  EXPECT_NE(report.find("and 149 more"), std::string::npos) << report.substr(report.size() - 200);
}

TEST(CountsLimits, MoreRowsThanTheLargestCampaignHasStepsAreRefused) {
  std::string text = "step,kind,start_s,end_s,ch0,ch1,ch2,ch3\n";
  const std::string row = "0,measure,0,1,1,2,3,4\n";
  text.reserve(text.size() + row.size() * static_cast<size_t>(limits::kCountsRows + 1));
  for (std::int64_t i = 0; i <= limits::kCountsRows; ++i) text += row;
  const std::string e =
      error_of([&] { formats::parse_counts_csv(text, "night.csv", two_photons()); });
  EXPECT_NE(e.find(std::to_string(limits::kCountsRows)), std::string::npos) << e;
}

// --- Limits derive from the largest campaign --------------------------------------------------

TEST(Limits, DeriveFromTheLargestSupportedCampaign) {
  // 1000 training points: 1000 x 999 / 2 pairs; 250 test points against each training point.
  EXPECT_EQ(limits::kEntries, 499500 + 250000);
  EXPECT_GE(limits::kSteps, limits::kEntries);
  // The largest Gram matrix file holds a million numbers.
  EXPECT_GE(limits::kKernelCsvBytes, 1000 * 1000 * 18);
  // A real plan's steps fit the per-step budget: the demo's steps.json, per step.
  const Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  const std::string steps = formats::format_steps_json(c.rig, plan.steps);
  EXPECT_LT(
      static_cast<std::int64_t>(steps.size()),
      limits::kHeaderBytes + static_cast<std::int64_t>(plan.steps.size()) * limits::kStepJsonBytes);
}

// --- Sets of files --------------------------------------------------------------------------

class PlanSet : public ::testing::Test {
 protected:
  static void SetUpTestSuite() {
    campaign_ = new Campaign(make_demo_campaign());
    plan_ = new Plan(plan_campaign(*campaign_));
  }
  static void TearDownTestSuite() {
    delete plan_;
    delete campaign_;
  }
  QTemporaryDir dir_;
  static inline Campaign* campaign_ = nullptr;
  static inline Plan* plan_ = nullptr;
};

TEST_F(PlanSet, AFolderMixingTwoSavesIsRefusedNamingTheStrayFile) {
  const QString a = dir_.filePath("a"), b = dir_.filePath("b");
  formats::write_plan_files(*campaign_, *plan_, a);
  const formats::StepsFile read = formats::read_plan_folder(a);
  EXPECT_EQ(read.steps.size(), plan_->steps.size());
  EXPECT_EQ(read.set_id.size(), 32u);
  // The same plan saved again is the same set, byte for byte (a seed gives one plan).
  formats::write_plan_files(*campaign_, *plan_, b);
  EXPECT_EQ(read_text(QDir(b).filePath("steps.json")), read_text(QDir(a).filePath("steps.json")));
  // Another campaign's plan: its steps.json does not belong to the first set.
  const Campaign other = make_demo_campaign(11);
  formats::write_plan_files(other, plan_campaign(other), b);
  const std::string stray = read_text(QDir(b).filePath("steps.json"));
  write_text(QDir(a).filePath("steps.json"), stray);
  const std::string e = error_of([&] { formats::read_plan_folder(a); });
  EXPECT_NE(e.find("steps.json"), std::string::npos) << e;
  EXPECT_NE(e.find("different saves"), std::string::npos) << e;
  // A CSV of another plan is told apart too.
  formats::write_plan_files(*campaign_, *plan_, a);
  write_text(QDir(a).filePath("kernel.csv"), "1,0\n0,1\n");
  EXPECT_NE(error_of([&] { formats::read_plan_folder(a); }).find("kernel.csv"), std::string::npos);
}

TEST_F(PlanSet, ASaveReplacesOnlyItsOwnFilesAndLeavesNoTemporary) {
  const QString out = dir_.filePath("shared");
  ASSERT_TRUE(QDir().mkpath(out));
  write_text(QDir(out).filePath("notes.txt"), "mine");
  // A temporary left by a process that no longer runs (pid 2^22 + 1 is above Linux's default
  // pid_max, so it names no process) is cleaned up; one of a running process is not.
  const QString stale = QDir(out).filePath(".steps.csv.part-4194305-0");
  const QString live =
      QDir(out).filePath(".steps.csv.part-" + QString::number(getpid()) + "-999999");
  write_text(stale, "half");
  write_text(live, "in progress");
  formats::write_plan_files(*campaign_, *plan_, out, formats::Overwrite::refuse);
  EXPECT_EQ(read_text(QDir(out).filePath("notes.txt")), "mine");
  EXPECT_FALSE(QFile::exists(stale));
  EXPECT_TRUE(QFile::exists(live));
  QFile::remove(live);
  const QStringList names = QDir(out).entryList(QDir::Files | QDir::Hidden);
  EXPECT_EQ(names,
            (QStringList{"kernel.csv", "notes.txt", "steps.csv", "steps.json", "summary.json"}));
  // Refused as a whole: an existing member stops the save before anything is written.
  const std::string before = read_text(QDir(out).filePath("summary.json"));
  EXPECT_THROW(formats::write_plan_files(*campaign_, *plan_, out, formats::Overwrite::refuse),
               InputError);
  EXPECT_EQ(read_text(QDir(out).filePath("summary.json")), before);
}

TEST_F(PlanSet, AFolderInPlaceOfAMemberStopsTheWholeSave) {
  const QString out = dir_.filePath("blocked");
  ASSERT_TRUE(QDir().mkpath(QDir(out).filePath("summary.json")));
  EXPECT_THROW(formats::write_plan_files(*campaign_, *plan_, out), InputError);
  EXPECT_FALSE(QFile::exists(QDir(out).filePath("steps.json")));
  EXPECT_EQ(QDir(out).entryList(QDir::Files | QDir::Hidden).size(), 0);
}

}  // namespace
