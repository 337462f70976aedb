#pragma once
// The data CSV of `--data` (README, "Files"): a header row, numeric feature columns, a `label`
// column with exactly two classes, an optional `set` column (`train` or `test`).
#include <QString>
#include <string>

#include "gramline/dataset.h"

namespace gramline::formats {

/// Parses data CSV text. `source_name` is the file name used in messages. Labels: when the two
/// classes are -1 and +1 (any numeric spelling of them) they keep their sign; otherwise the
/// first class met in the file is +1. Rows without a `set` value are training points.
/// Column names `label` and `set` are matched without regard to case or edge spaces.
/// Throws InputError naming source_name, the line and the column for: an empty file, a header
/// without a `label` column or without feature columns, empty or repeated column names, a
/// ragged row, a feature that is not a finite number, a missing label, a third class, a single
/// class among the training points, a `set` value other than train/test, no training points,
/// and duplicate training points.
DataSet parse_data_csv(const std::string& text, const std::string& source_name);

/// Reads and parses a data CSV file.
DataSet read_data_csv(const QString& path);

/// CSV text of a data set in the same format. Labels are written as -1 and +1 (the class names
/// live in the campaign file), numbers in their shortest exact form, so parsing the text gives
/// the same points and labels back.
std::string format_data_csv(const DataSet& data);

/// Writes format_data_csv atomically. Throws InputError when the file cannot be written.
void write_data_csv(const DataSet& data, const QString& path);

}  // namespace gramline::formats
