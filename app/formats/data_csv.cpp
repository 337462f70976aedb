#include "formats/data_csv.h"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdint>
#include <map>
#include <optional>
#include <stdexcept>
#include <vector>

#include "formats/input_error.h"
#include "formats/limits.h"
#include "formats/text_io.h"

namespace gramline::formats {
namespace {

struct Record {
  int line = 0;
  std::vector<std::string> fields;
};

std::string lower(std::string_view text) {
  std::string out(text);
  std::transform(out.begin(), out.end(), out.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return out;
}

class CsvSource {
 public:
  CsvSource(const std::string& text, const std::string& name) : text_(text), name_(name) {}

  [[noreturn]] void fail(int line, const std::string& message) const {
    throw InputError(name_ + ":" + std::to_string(line) + ": " + message);
  }

  /// Splits the text into records. Quoted fields may hold commas and doubled quotes but not
  /// line breaks; lines holding only white space are skipped.
  std::vector<Record> records() const {
    std::vector<Record> out;
    size_t pos = 0;
    if (text_.compare(0, 3, "\xEF\xBB\xBF") == 0) pos = 3;  // UTF-8 byte order mark
    int line = 0;
    while (pos < text_.size()) {
      ++line;
      size_t end = text_.find('\n', pos);
      if (end == std::string::npos) end = text_.size();
      std::string_view row(text_.data() + pos, end - pos);
      pos = end + 1;
      if (!row.empty() && row.back() == '\r') row.remove_suffix(1);
      if (trim(row).empty()) continue;
      out.push_back({line, split(row, line)});
    }
    return out;
  }

 private:
  std::vector<std::string> split(std::string_view row, int line) const {
    std::vector<std::string> fields;
    std::string field;
    size_t i = 0;
    while (true) {
      field.clear();
      size_t start = i;
      while (start < row.size() && (row[start] == ' ' || row[start] == '\t')) ++start;
      if (start < row.size() && row[start] == '"') {
        i = start + 1;
        bool closed = false;
        while (i < row.size()) {
          if (row[i] == '"') {
            if (i + 1 < row.size() && row[i + 1] == '"') {
              field += '"';
              i += 2;
              continue;
            }
            closed = true;
            ++i;
            break;
          }
          field += row[i++];
        }
        if (!closed) {
          fail(line, "column " + std::to_string(fields.size() + 1) +
                         ": a quoted field is not closed on this line");
        }
        while (i < row.size() && (row[i] == ' ' || row[i] == '\t')) ++i;
        if (i < row.size() && row[i] != ',') {
          fail(line,
               "column " + std::to_string(fields.size() + 1) + ": text after the closing quote");
        }
        fields.push_back(field);
      } else {
        const size_t comma = row.find(',', i);
        const size_t stop = comma == std::string_view::npos ? row.size() : comma;
        fields.emplace_back(trim(row.substr(i, stop - i)));
        i = stop;
      }
      if (i >= row.size()) break;
      ++i;  // past the comma
      if (i == row.size()) {
        fields.emplace_back();  // a trailing comma ends with an empty field
        break;
      }
    }
    return fields;
  }

  const std::string& text_;
  const std::string& name_;
};

std::string column_text(size_t index, const std::string& name) {
  return "column " + std::to_string(index + 1) + " (" + name + ")";
}

/// "+1" or "-1" when the label is a number equal to +-1, else nothing.
std::optional<std::string> numeric_class(std::string_view label) {
  double value = 0.0;
  if (!parse_number(label, value)) return std::nullopt;
  if (value == 1.0) return std::string("+1");
  if (value == -1.0) return std::string("-1");
  return std::nullopt;
}

struct Row {
  int line = 0;
  std::vector<double> features;
  int class_index = 0;  // 0: first class met, 1: second
  bool test = false;
};

}  // namespace

DataSet parse_data_csv(const std::string& text, const std::string& source_name) {
  const CsvSource source(text, source_name);
  const std::vector<Record> records = source.records();
  if (records.empty()) source.fail(1, "the file is empty; expected a header row");

  // Header: which column is the label, which the set, which are features.
  const Record& header = records.front();
  std::optional<size_t> label_column;
  std::optional<size_t> set_column;
  std::vector<size_t> feature_columns;
  std::map<std::string, size_t> seen_names;
  for (size_t c = 0; c < header.fields.size(); ++c) {
    const std::string name = header.fields[c];
    if (name.empty())
      source.fail(header.line, "column " + std::to_string(c + 1) + ": empty column name");
    const std::string key = lower(name);
    if (auto it = seen_names.find(key); it != seen_names.end()) {
      source.fail(header.line, column_text(c, name) + ": the name is already used by column " +
                                   std::to_string(it->second + 1));
    }
    seen_names.emplace(key, c);
    if (key == "label") {
      label_column = c;
    } else if (key == "set") {
      set_column = c;
    } else {
      // One name rule for every reader (docs/parameter-ranges.md): a quoted " label " is a
      // feature column here but would collide with the class column once written back.
      if (const std::string why = feature_name_problem(name); !why.empty())
        source.fail(header.line, column_text(c, name) + ": " + why);
      feature_columns.push_back(c);
    }
  }
  if (!label_column) source.fail(header.line, "the header has no 'label' column");
  if (feature_columns.empty()) source.fail(header.line, "the header has no feature columns");
  if (records.size() == 1) source.fail(header.line, "no data rows after the header");
  // The largest supported campaign bounds what is read (docs/limits.md).
  if (feature_columns.size() > static_cast<size_t>(limits::kFeatures))
    source.fail(header.line, std::to_string(feature_columns.size()) +
                                 " feature columns, more than the limit of " +
                                 std::to_string(limits::kFeatures) + " (docs/limits.md)");
  if (records.size() - 1 > static_cast<size_t>(limits::kPoints))
    source.fail(records[static_cast<size_t>(limits::kPoints) + 1].line,
                std::to_string(records.size() - 1) + " data rows, more than the limit of " +
                    std::to_string(limits::kPoints) + " points (" +
                    std::to_string(limits::kTrainPoints) + " training and " +
                    std::to_string(limits::kTestPoints) + " test; docs/limits.md)");

  const size_t width = header.fields.size();
  std::vector<std::string> classes;  // canonical class names, in the order met
  std::vector<Row> rows;
  rows.reserve(records.size() - 1);
  for (size_t r = 1; r < records.size(); ++r) {
    const Record& record = records[r];
    if (record.fields.size() < width) {
      const size_t missing = record.fields.size();
      source.fail(record.line, column_text(missing, header.fields[missing]) +
                                   ": missing; the row has " +
                                   std::to_string(record.fields.size()) + " fields, the header " +
                                   std::to_string(width));
    }
    if (record.fields.size() > width) {
      source.fail(record.line, "column " + std::to_string(width + 1) +
                                   ": extra field; the row has " +
                                   std::to_string(record.fields.size()) + " fields, the header " +
                                   std::to_string(width));
    }
    Row row;
    row.line = record.line;
    for (size_t c : feature_columns) {
      const std::string& field = record.fields[c];
      double value = 0.0;
      if (field.empty())
        source.fail(record.line, column_text(c, header.fields[c]) + ": missing value");
      if (!parse_number(field, value)) {
        source.fail(record.line,
                    column_text(c, header.fields[c]) + ": '" + field + "' is not a number");
      }
      if (!std::isfinite(value)) {
        source.fail(record.line,
                    column_text(c, header.fields[c]) + ": '" + field + "' is not a finite number");
      }
      row.features.push_back(value);
    }
    const std::string& label = record.fields[*label_column];
    const std::string where = column_text(*label_column, header.fields[*label_column]);
    if (label.empty()) source.fail(record.line, where + ": missing label");
    const std::string cls = numeric_class(label).value_or(label);
    auto found = std::find(classes.begin(), classes.end(), cls);
    if (found == classes.end()) {
      if (classes.size() == 2) {
        source.fail(record.line, where + ": a third class '" + label +
                                     "'; the file may hold only two ('" + classes[0] + "' and '" +
                                     classes[1] + "')");
      }
      classes.push_back(cls);
      found = classes.end() - 1;
    }
    row.class_index = static_cast<int>(found - classes.begin());
    if (set_column) {
      const std::string set = lower(record.fields[*set_column]);
      if (set == "test") {
        row.test = true;
      } else if (!set.empty() && set != "train") {
        source.fail(record.line, column_text(*set_column, header.fields[*set_column]) + ": '" +
                                     record.fields[*set_column] + "' is neither train nor test");
      }
    }
    rows.push_back(std::move(row));
  }

  const int last_line = records.back().line;
  const auto test_rows_seen =
      std::count_if(rows.begin(), rows.end(), [](const Row& r) { return r.test; });
  const auto train_rows_seen = static_cast<std::int64_t>(rows.size()) - test_rows_seen;
  if (train_rows_seen > limits::kTrainPoints || test_rows_seen > limits::kTestPoints)
    source.fail(last_line, std::to_string(train_rows_seen) + " training and " +
                               std::to_string(test_rows_seen) +
                               " test points, more than the limits of " +
                               std::to_string(limits::kTrainPoints) + " and " +
                               std::to_string(limits::kTestPoints) + " (docs/limits.md)");
  const std::string label_where = column_text(*label_column, header.fields[*label_column]);
  bool train_has[2] = {false, false};
  for (const Row& row : rows) {
    if (!row.test) train_has[row.class_index] = true;
  }
  if (!train_has[0] && !train_has[1]) {
    source.fail(last_line, column_text(*set_column, header.fields[*set_column]) +
                               ": no training points; every row is a test point");
  }
  if (classes.size() < 2 || !train_has[0] || !train_has[1]) {
    source.fail(last_line, label_where + ": the training points hold a single class ('" +
                               classes[train_has[0] ? 0 : 1] + "'); two are needed");
  }

  // Duplicate training points make the Gram matrix singular.
  std::map<std::vector<double>, int> first_line_of;
  for (const Row& row : rows) {
    if (row.test) continue;
    auto [it, inserted] = first_line_of.emplace(row.features, row.line);
    if (!inserted) {
      const size_t first = feature_columns.front();
      const size_t last = feature_columns.back();
      source.fail(row.line, "columns " + std::to_string(first + 1) + "-" +
                                std::to_string(last + 1) +
                                " (features): duplicate training point; line " +
                                std::to_string(it->second) + " has the same features");
    }
  }

  // Numeric classes keep their sign; named classes: the first one met is +1.
  const bool numeric =
      (classes[0] == "+1" && classes[1] == "-1") || (classes[0] == "-1" && classes[1] == "+1");
  int label_of[2] = {1, -1};
  if (numeric) {
    label_of[0] = classes[0] == "+1" ? 1 : -1;
    label_of[1] = -label_of[0];
  }

  DataSet data;
  for (size_t c : feature_columns) data.feature_names.push_back(header.fields[c]);
  data.positive_name = numeric ? "+1" : classes[0];
  data.negative_name = numeric ? "-1" : classes[1];
  const long train_rows =
      std::count_if(rows.begin(), rows.end(), [](const Row& r) { return !r.test; });
  const long test_rows = static_cast<long>(rows.size()) - train_rows;
  const long d = static_cast<long>(feature_columns.size());
  data.train.resize(train_rows, d);
  data.test.resize(test_rows, d);
  data.train_labels.resize(train_rows);
  data.test_labels.resize(test_rows);
  long i_train = 0;
  long i_test = 0;
  for (const Row& row : rows) {
    Eigen::MatrixXd& x = row.test ? data.test : data.train;
    Eigen::VectorXi& y = row.test ? data.test_labels : data.train_labels;
    long& i = row.test ? i_test : i_train;
    for (long f = 0; f < d; ++f) x(i, f) = row.features[static_cast<size_t>(f)];
    y(i) = label_of[row.class_index];
    ++i;
  }
  return data;
}

DataSet read_data_csv(const QString& path) {
  return parse_data_csv(read_whole_file(path, limits::kDataCsvBytes), path_text(path));
}

std::string format_data_csv(const DataSet& data) {
  const int d = data.feature_count();
  std::vector<std::string> names = data.feature_names;
  if (static_cast<int>(names.size()) != d) {
    names.clear();
    for (int f = 0; f < d; ++f) names.push_back("x" + std::to_string(f + 1));
  }
  for (const std::string& name : names) {
    if (const std::string why = feature_name_problem(name); !why.empty())
      throw std::invalid_argument("data CSV: feature name '" + name + "': " + why);
  }
  std::string out;
  for (const std::string& name : names) out += csv_field(name) + ",";
  out += "label,set\n";
  long line = 1;
  auto write_rows = [&](const Eigen::MatrixXd& x, const Eigen::VectorXi& y, const char* set) {
    for (long i = 0; i < x.rows(); ++i) {
      ++line;
      for (long f = 0; f < x.cols(); ++f) {
        out += finite_number_text(x(i, f), "data CSV: line " + std::to_string(line) + ", column " +
                                               std::to_string(f + 1)) +
               ",";
      }
      out += (y(i) > 0 ? "+1," : "-1,");
      out += set;
      out += "\n";
    }
  };
  write_rows(data.train, data.train_labels, "train");
  write_rows(data.test, data.test_labels, "test");
  return out;
}

void write_data_csv(const DataSet& data, const QString& path) {
  write_whole_file(path, format_data_csv(data));
}

}  // namespace gramline::formats
