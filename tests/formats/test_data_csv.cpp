// Data CSV of `--data` (README, "Files"): parsing, label rules and the documented errors.
#include <gtest/gtest.h>

#include <QString>
#include <cctype>
#include <string>

#include "formats/data_csv.h"
#include "formats/input_error.h"

namespace {

using gramline::DataSet;
using gramline::formats::InputError;
using gramline::formats::parse_data_csv;
using gramline::formats::read_data_csv;

std::string data_path(const char* name) { return std::string(GRAMLINE_TEST_DATA) + "/" + name; }

/// The message of the InputError thrown by parsing `text`, or "" if nothing was thrown.
std::string error_of_text(const std::string& text) {
  try {
    parse_data_csv(text, "inline.csv");
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

std::string error_of_file(const char* name) {
  try {
    read_data_csv(QString::fromStdString(data_path(name)));
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

TEST(DataCsv, NamedClassesFirstMetIsPositiveAndSetColumnSplits) {
  const DataSet d = read_data_csv(QString::fromStdString(data_path("good_names.csv")));
  ASSERT_EQ(d.train_count(), 3);  // the empty set field defaults to train
  ASSERT_EQ(d.test_count(), 1);
  ASSERT_EQ(d.feature_count(), 2);
  EXPECT_EQ(d.feature_names, (std::vector<std::string>{"x", "y"}));
  EXPECT_EQ(d.positive_name, "red");
  EXPECT_EQ(d.negative_name, "blue");
  EXPECT_EQ(d.train_labels(0), 1);
  EXPECT_EQ(d.train_labels(1), -1);
  EXPECT_EQ(d.train_labels(2), -1);  // line 5, blue, no set
  EXPECT_EQ(d.test_labels(0), 1);
  EXPECT_EQ(d.train(2, 0), 0.7);
  EXPECT_EQ(d.test(0, 1), 0.6);
}

TEST(DataCsv, NumericLabelsKeepTheirSignWhateverComesFirst) {
  const DataSet d = parse_data_csv("a,label\n1,-1\n2,+1\n3,1.0\n4,-1e0\n", "n.csv");
  ASSERT_EQ(d.train_count(), 4);
  EXPECT_EQ(d.train_labels(0), -1);
  EXPECT_EQ(d.train_labels(1), 1);
  EXPECT_EQ(d.train_labels(2), 1);
  EXPECT_EQ(d.train_labels(3), -1);
}

TEST(DataCsv, LabelColumnAnywhereQuotesCrlfBlankLinesAndByteOrderMark) {
  const std::string text =
      "\xEF\xBB\xBF"
      "label, \"width, cm\" ,Set,h\r\n"
      "\r\n"
      "yes,\"1.5\",TRAIN,2\r\n"
      "no,2.5,test,3\r\n"
      "no,3.5,,4\r\n";
  const DataSet d = parse_data_csv(text, "q.csv");
  EXPECT_EQ(d.feature_names, (std::vector<std::string>{"width, cm", "h"}));
  ASSERT_EQ(d.train_count(), 2);
  ASSERT_EQ(d.test_count(), 1);
  EXPECT_EQ(d.train(0, 0), 1.5);
  EXPECT_EQ(d.train(1, 1), 4.0);
  EXPECT_EQ(d.test(0, 0), 2.5);
  EXPECT_EQ(d.train_labels(0), 1);
  EXPECT_EQ(d.train_labels(1), -1);
}

TEST(DataCsv, DuplicateTestPointsAreAllowed) {
  const DataSet d = parse_data_csv("x,label,set\n1,a,train\n2,b,train\n5,a,test\n5,b,test\n", "t");
  EXPECT_EQ(d.test_count(), 2);
}

TEST(DataCsv, WriteThenParseGivesTheSamePointsBitForBit) {
  DataSet d;
  d.feature_names = {"alpha", "beta, with comma"};
  d.train.resize(3, 2);
  d.train << 0.1, 1.0 / 3.0, -2.5e-300, 7.0, 123456789.123456789, -0.0;
  d.train_labels.resize(3);
  d.train_labels << 1, -1, 1;
  d.test.resize(1, 2);
  d.test << 2.0 / 7.0, 1e300;
  d.test_labels.resize(1);
  d.test_labels << -1;
  const DataSet back = parse_data_csv(gramline::formats::format_data_csv(d), "round.csv");
  EXPECT_EQ(back.feature_names, d.feature_names);
  ASSERT_EQ(back.train.rows(), 3);
  ASSERT_EQ(back.test.rows(), 1);
  for (int i = 0; i < 3; ++i) {
    for (int f = 0; f < 2; ++f) EXPECT_EQ(back.train(i, f), d.train(i, f));
    EXPECT_EQ(back.train_labels(i), d.train_labels(i));
  }
  EXPECT_EQ(back.test(0, 0), d.test(0, 0));
  EXPECT_EQ(back.test(0, 1), d.test(0, 1));
  EXPECT_EQ(back.test_labels(0), -1);
}

struct ErrorCase {
  const char* file;
  const char* where;    // "FILE:LINE:" prefix expected in the message
  const char* column;   // column text expected in the message
  const char* meaning;  // a word saying what is wrong
};

class DataCsvErrors : public ::testing::TestWithParam<ErrorCase> {};

TEST_P(DataCsvErrors, NameFileLineAndColumn) {
  const ErrorCase c = GetParam();
  const std::string message = error_of_file(c.file);
  ASSERT_FALSE(message.empty()) << c.file << " was accepted";
  EXPECT_NE(message.find(data_path(c.file) + ":" + c.where), std::string::npos) << message;
  EXPECT_NE(message.find(c.column), std::string::npos) << message;
  EXPECT_NE(message.find(c.meaning), std::string::npos) << message;
}

// Line and column numbers counted by hand in the fixture files (lines and columns from 1).
INSTANTIATE_TEST_SUITE_P(
    Fixtures, DataCsvErrors,
    ::testing::Values(ErrorCase{"bad_not_a_number.csv", "4:", "column 1 (x)", "not a number"},
                      ErrorCase{"bad_nan.csv", "3:", "column 2 (y)", "not a finite number"},
                      ErrorCase{"bad_inf.csv", "5:", "column 1 (x)", "not a finite number"},
                      ErrorCase{"bad_missing_label.csv", "3:", "column 3 (label)", "missing label"},
                      ErrorCase{"bad_third_class.csv", "5:", "column 3 (label)", "third class"},
                      ErrorCase{"bad_single_class.csv", "4:", "column 3 (label)", "single class"},
                      ErrorCase{"bad_duplicate.csv", "4:", "columns 1-2", "duplicate"},
                      ErrorCase{"bad_ragged.csv", "3:", "column 3 (label)", "missing"},
                      ErrorCase{"bad_extra_field.csv", "2:", "column 4", "extra field"},
                      ErrorCase{"empty.csv", "1:", "", "empty"},
                      ErrorCase{"bad_no_label_column.csv", "1:", "'label' column", "no"},
                      ErrorCase{"bad_set.csv", "3:", "column 4 (set)", "neither train nor test"}),
    [](const ::testing::TestParamInfo<ErrorCase>& info) {
      // Test names from the fixture file: bad_not_a_number.csv -> bad_not_a_number.
      std::string name = info.param.file;
      name = name.substr(0, name.find('.'));
      for (char& ch : name)
        if (!std::isalnum(static_cast<unsigned char>(ch))) ch = '_';
      return name;
    });

TEST(DataCsv, DuplicateNamesTheEarlierLine) {
  const std::string m = error_of_file("bad_duplicate.csv");
  EXPECT_NE(m.find("line 2"), std::string::npos) << m;
}

TEST(DataCsv, InlineErrorsNameLineAndColumn) {
  EXPECT_NE(error_of_text("a,b,label\n1,2,x\n3,4,y\n5,,x\n").find("inline.csv:4: column 2 (b)"),
            std::string::npos);
  EXPECT_NE(error_of_text("a,label\n1,x\n2,y\n0x10,x\n").find("inline.csv:4: column 1 (a)"),
            std::string::npos);
  EXPECT_NE(error_of_text("a,label\n1,x\n2,y\n3,x\n4,inf\n").find("inline.csv:5"),
            std::string::npos);  // a third class, not a number: labels are text
  EXPECT_NE(error_of_text("  \n\n").find("inline.csv:1:"), std::string::npos);
  EXPECT_NE(error_of_text("a,label\n").find("inline.csv:1:"), std::string::npos);  // no rows
  EXPECT_NE(error_of_text("label\n1\n-1\n").find("no feature columns"), std::string::npos);
  EXPECT_NE(error_of_text("a,,label\n1,2,1\n").find("inline.csv:1: column 2"), std::string::npos);
  EXPECT_NE(error_of_text("a,A,label\n1,2,1\n").find("inline.csv:1: column 2 (A)"),
            std::string::npos);  // repeated name
  EXPECT_NE(error_of_text("a,label\n\"1,x\n").find("inline.csv:2: column 1"), std::string::npos);
  // Every row a test point: no training points.
  EXPECT_NE(error_of_text("a,label,set\n1,x,test\n2,y,test\n").find("no training points"),
            std::string::npos);
  // Two classes in the file, but the training points hold only one.
  EXPECT_NE(error_of_text("a,label,set\n1,x,train\n2,y,test\n").find("inline.csv:3"),
            std::string::npos);
}

TEST(DataCsv, NeverCrashesOnOddBytes) {
  // Truncations of a valid file and random bytes either parse or give an InputError.
  const std::string valid = "x,\"y\",label,set\n0.1,0.2,a,train\n0.3,0.4,b,test\n0.5,0.6,b,\n";
  for (size_t n = 0; n <= valid.size(); ++n) {
    try {
      parse_data_csv(valid.substr(0, n), "cut.csv");
    } catch (const InputError&) {
    }
  }
  unsigned state = 12345;
  for (int trial = 0; trial < 300; ++trial) {
    std::string text;
    for (int i = 0; i < 40; ++i) {
      state = state * 1103515245u + 12345u;
      const char alphabet[] = "0123456789.,-+eE\"\r\n abxlabelsetrain";
      text += alphabet[(state >> 16) % (sizeof alphabet - 1)];
    }
    try {
      parse_data_csv("x,label,set\n" + text, "random.csv");
    } catch (const InputError&) {
    }
  }
}

}  // namespace
