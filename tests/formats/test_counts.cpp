// The counts file (docs/counts-format.md): round trip, every refusal names file, line and
// column, and rows are matched against the plan's steps.
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "formats/counts_csv.h"
#include "formats/input_error.h"

namespace {

using namespace gramline;
using formats::CountsLayout;
using formats::InputError;

CountsLayout two_photons_both_ports() {
  CountsLayout l;
  l.channels = 4;
  l.photons = 2;
  l.scheme_text = "both-ports";
  return l;
}

std::vector<Step> three_steps() {
  std::vector<Step> steps(4);
  steps[0].kind = StepKind::reference;
  steps[1].kind = StepKind::measure;
  steps[2].kind = StepKind::measure;
  steps[3].kind = StepKind::park;
  return steps;
}

std::string error_of(const std::string& text,
                     const CountsLayout& layout = two_photons_both_ports()) {
  try {
    formats::parse_counts_csv(text, "night1.csv", layout);
  } catch (const InputError& e) {
    return e.what();
  }
  return "(accepted)";
}

const char* const kHeader = "step,kind,start_s,end_s,ch0,ch1,ch2,ch3\n";

TEST(CountsCsv, WrittenRecordsReadBackExactly) {
  std::vector<StepRecord> records(2);
  records[0] = {0, 1.5, 4.25, {1200, 3, 4, 0}, {}};
  records[1] = {2, 10.0, 12.0, {7, 800, 912, 1000}, {}};
  records[1].singles_per_s = {41000.5, 39000.0};
  const std::string text =
      formats::format_counts_csv(records, three_steps(), two_photons_both_ports());
  const formats::CountsFile f = formats::parse_counts_csv(text, "x.csv", two_photons_both_ports());
  ASSERT_EQ(f.rows.size(), 2u);
  EXPECT_TRUE(f.has_singles_columns);
  EXPECT_EQ(f.rows[0].kind, StepKind::reference);
  EXPECT_EQ(f.rows[1].kind, StepKind::measure);
  EXPECT_EQ(f.rows[1].line, 3);
  for (int k = 0; k < 2; ++k) {
    EXPECT_EQ(f.rows[k].record.step, records[k].step);
    EXPECT_EQ(f.rows[k].record.start_s, records[k].start_s);
    EXPECT_EQ(f.rows[k].record.end_s, records[k].end_s);
    EXPECT_EQ(f.rows[k].record.channel_counts, records[k].channel_counts);
    EXPECT_EQ(f.rows[k].record.singles_per_s, records[k].singles_per_s);
  }
}

TEST(CountsCsv, CommentsBlankLinesCrlfAndColumnOrderAreAccepted) {
  const std::string text =
      "# written by the rig controller\r\n\r\nkind,step,ch3,ch2,ch1,ch0,end_s,start_s\r\n"
      "measure,1,4,3,2,1,20,10\r\n";
  const formats::CountsFile f = formats::parse_counts_csv(text, "x.csv", two_photons_both_ports());
  ASSERT_EQ(f.rows.size(), 1u);
  EXPECT_EQ(f.rows[0].line, 4);
  EXPECT_EQ(f.rows[0].record.channel_counts, (std::vector<double>{1, 2, 3, 4}));
  EXPECT_EQ(f.rows[0].record.start_s, 10.0);
  EXPECT_EQ(f.rows[0].record.end_s, 20.0);
}

TEST(CountsCsv, RefusalsNameFileLineAndColumn) {
  struct Case {
    std::string text;
    std::string where;
    std::string what;
  };
  const std::vector<Case> cases = {
      {std::string(kHeader) + "1,measure,0,2,5,x7,0,0\n", "line 2, column 6 (ch1)", "not a number"},
      {std::string(kHeader) + "1,measure,0,2,5,-3,0,0\n", "line 2, column 6 (ch1)", "negative"},
      {std::string(kHeader) + "1,measure,0,2,5,2.5,0,0\n", "line 2, column 6 (ch1)", "whole"},
      {std::string(kHeader) + "1,measure,5,2,5,3,0,0\n", "line 2, column 4 (end_s)",
       "end before start"},
      {std::string(kHeader) + "1,measure,5,5,5,3,0,0\n", "line 2, column 4 (end_s)",
       "end before start"},
      {std::string(kHeader) + "1,mesure,0,2,5,3,0,0\n", "line 2, column 2 (kind)", "not one of"},
      {std::string(kHeader) + "one,measure,0,2,5,3,0,0\n", "line 2, column 1 (step)", "step index"},
      {std::string(kHeader) + "-1,measure,0,2,5,3,0,0\n", "line 2, column 1 (step)", "step index"},
      {std::string(kHeader) + "1,measure,0,nan,5,3,0,0\n", "line 2, column 4 (end_s)", "time"},
      {std::string(kHeader) + "\n1,measure,0,2,5,3,0\n", "line 3, column 8", "7 fields"},
      {"step,kind,start_s,end_s,ch0,ch1\n", "line 1", "wrong channel count"},
      {"step,kind,start_s,end_s,ch0,ch1,ch2,ch3,ch4\n", "line 1, column 9 (ch4)",
       "wrong channel count"},
      {"step,kind,start_s,ch0,ch1,ch2,ch3\n", "line 1", "no 'end_s' column"},
      {"step,kind,start_s,end_s,ch0,ch1,ch2,ch3,colour\n", "line 1, column 9 (colour)",
       "unknown column"},
      {"step,kind,start_s,end_s,ch0,ch1,ch2,ch3,singles0_per_s\n", "line 1", "every photon"},
      {"step,kind,start_s,end_s,ch0,ch1,ch2,ch3,singles0_per_s,singles1_per_s\n"
       "1,measure,0,2,5,3,0,0,100,\n",
       "line 2, column 10 (singles1_per_s)", "missing"},
      {"step,kind,start_s,end_s,ch0,ch1,ch2,ch3,singles0_per_s,singles1_per_s\n"
       "1,measure,0,2,5,3,0,0,100,-4\n",
       "line 2, column 10 (singles1_per_s)", "negative"},
      {"", "night1.csv", "no header"},
  };
  for (const Case& c : cases) {
    const std::string e = error_of(c.text);
    EXPECT_EQ(e.rfind("night1.csv", 0), 0u) << e;
    EXPECT_NE(e.find(c.where), std::string::npos) << "expected '" << c.where << "' in: " << e;
    EXPECT_NE(e.find(c.what), std::string::npos) << "expected '" << c.what << "' in: " << e;
  }
}

TEST(CountsCsv, PassOnlyRigsHaveOneChannel) {
  CountsLayout l;
  l.channels = 1;
  l.photons = 2;
  l.scheme_text = "pass-only";
  EXPECT_NO_THROW(
      formats::parse_counts_csv("step,kind,start_s,end_s,ch0\n1,measure,0,1,9\n", "p.csv", l));
  EXPECT_NE(error_of(kHeader, l).find("wrong channel count"), std::string::npos);
}

TEST(CountsCsv, MissingExtraDuplicatedAndMismatchedStepsAreReportedByLine) {
  const std::string text = std::string(kHeader) +
                           "1,measure,0,2,5,3,0,0\n"  // line 2: fine
                           "1,measure,3,4,5,3,0,0\n"  // line 3: duplicate of line 2
                           "9,measure,5,6,5,3,0,0\n"  // line 4: no step 9
                           "0,measure,7,8,5,3,0,0\n"  // line 5: step 0 is a reference
                           "3,park,9,10,0,0,0,0\n";   // line 6: park steps count nothing
  const formats::CountsFile f = formats::parse_counts_csv(text, "n.csv", two_photons_both_ports());
  const formats::CountsCheck c = formats::check_counts(f, three_steps());
  EXPECT_FALSE(c.consistent());
  ASSERT_EQ(c.duplicated.size(), 1u);
  EXPECT_EQ(c.duplicated[0].line, 3);
  EXPECT_NE(c.duplicated[0].message.find("already counted on line 2"), std::string::npos);
  ASSERT_EQ(c.extra.size(), 2u);
  EXPECT_EQ(c.extra[0].line, 4);
  EXPECT_EQ(c.extra[0].step, 9);
  EXPECT_EQ(c.extra[1].line, 6);
  ASSERT_EQ(c.kind_mismatch.size(), 1u);
  EXPECT_EQ(c.kind_mismatch[0].line, 5);
  EXPECT_NE(c.kind_mismatch[0].message.find("'reference' step in the plan"), std::string::npos);
  // Step 0 (reference) has no acceptable row, step 2 none at all; park steps are never missing.
  EXPECT_EQ(c.missing, (std::vector<int>{0, 2}));
  ASSERT_EQ(c.records.size(), 1u);
  EXPECT_EQ(c.records[0].start_s, 0.0);  // the first row of step 1 is kept
  const std::string report = c.report();
  EXPECT_NE(report.find("n.csv: line 4"), std::string::npos) << report;
  EXPECT_NE(report.find("2 step(s) to count have no row: 0 2"), std::string::npos) << report;
}

}  // namespace
