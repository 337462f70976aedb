#pragma once
// Small text helpers shared by the file formats: numbers that read back exactly, CSV fields,
// and whole-file reads and atomic writes.
#include <QJsonValue>
#include <QString>
#include <cstdint>
#include <stdexcept>
#include <string>
#include <string_view>

namespace gramline::formats {

/// Shortest decimal text that reads back as exactly `value` (locale-independent).
std::string exact_number_text(double value);

/// `value` with 17 significant digits (printf %.17g): enough to read back exactly.
std::string seventeen_digit_text(double value);

/// exact_number_text, for writers: a value that is not finite is never written (no output file
/// holds NaN or an infinity, docs/parameter-ranges.md). Throws NonFiniteOutput naming `field`.
std::string finite_number_text(double value, const std::string& field);
/// seventeen_digit_text with the same refusal as finite_number_text.
std::string finite_seventeen_digit_text(double value, const std::string& field);
/// Throws NonFiniteOutput naming the file and the path (e.g. `summary.json: gram_sigma_max`)
/// of the first number inside `value` that is not finite.
void require_finite_json(const QJsonValue& value, const std::string& file,
                         const std::string& path = {});

/// A figure about to be written is NaN or infinite: an internal failure (exit status 1), since
/// the inputs that could cause it are refused by the readers.
class NonFiniteOutput : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

/// Parses a whole decimal number (optional sign, no surrounding text). False on anything else.
/// NaN and infinities parse (the caller decides whether they are allowed).
bool parse_number(std::string_view text, double& out);

/// A CSV field, quoted when it holds a comma, a quote, a line break or edge spaces.
std::string csv_field(std::string_view text);

/// Removes spaces and tabs at both ends.
std::string_view trim(std::string_view text);

/// Whole file as bytes. Reads regular files only (a FIFO, a device such as /dev/zero or a folder
/// is refused, not read) and at most `limit_bytes` (formats/limits.h): a larger file is refused
/// before it is read. Throws InputError naming the file (and the limit).
std::string read_whole_file(const QString& path, std::int64_t limit_bytes);

/// Writes `bytes` to `path` atomically (save_atomically, atomic_file.h): the old file stays
/// whole if anything fails. Throws InputError naming the file when the path cannot be used,
/// SystemError naming the system's error when the disk refuses the bytes.
void write_whole_file(const QString& path, const std::string& bytes);

/// Path as UTF-8 text for messages.
std::string path_text(const QString& path);

}  // namespace gramline::formats
