#pragma once
// Small text helpers shared by the file formats: numbers that read back exactly, CSV fields,
// and whole-file reads and atomic writes.
#include <QString>
#include <cstdint>
#include <string>
#include <string_view>

namespace gramline::formats {

/// Shortest decimal text that reads back as exactly `value` (locale-independent).
std::string exact_number_text(double value);

/// `value` with 17 significant digits (printf %.17g): enough to read back exactly.
std::string seventeen_digit_text(double value);

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
