#include "formats/text_io.h"

#include <QFile>
#include <QFileInfo>
#include <algorithm>
#include <QJsonArray>
#include <QJsonObject>
#include <QSaveFile>
#include <array>
#include <charconv>
#include <cmath>
#include <cstdio>

#include "formats/atomic_file.h"
#include "formats/input_error.h"

namespace gramline::formats {

std::string exact_number_text(double value) {
  std::array<char, 64> buffer{};
  const auto result = std::to_chars(buffer.data(), buffer.data() + buffer.size(), value);
  return std::string(buffer.data(), result.ptr);
}

std::string seventeen_digit_text(double value) {
  std::array<char, 64> buffer{};
  const int length = std::snprintf(buffer.data(), buffer.size(), "%.17g", value);
  return std::string(buffer.data(), static_cast<size_t>(length));
}

namespace {

[[noreturn]] void refuse_non_finite(double value, const std::string& field) {
  throw NonFiniteOutput(field + ": " + seventeen_digit_text(value) +
                        " is not a finite number; nothing was written");
}

}  // namespace

std::string finite_number_text(double value, const std::string& field) {
  if (!std::isfinite(value)) refuse_non_finite(value, field);
  return exact_number_text(value);
}

std::string finite_seventeen_digit_text(double value, const std::string& field) {
  if (!std::isfinite(value)) refuse_non_finite(value, field);
  return seventeen_digit_text(value);
}

void require_finite_json(const QJsonValue& value, const std::string& file,
                         const std::string& path) {
  if (value.isDouble()) {
    if (!std::isfinite(value.toDouble())) refuse_non_finite(value.toDouble(), file + ": " + path);
  } else if (value.isArray()) {
    const QJsonArray array = value.toArray();
    for (qsizetype i = 0; i < array.size(); ++i)
      require_finite_json(array.at(i), file, path + "[" + std::to_string(i) + "]");
  } else if (value.isObject()) {
    const QJsonObject object = value.toObject();
    for (auto it = object.begin(); it != object.end(); ++it) {
      require_finite_json(it.value(), file,
                          path + (path.empty() ? "" : ".") + it.key().toStdString());
    }
  }
}

bool parse_number(std::string_view text, double& out) {
  if (text.empty()) return false;
  // from_chars refuses a leading '+', which people do write in data files.
  if (text.front() == '+') {
    text.remove_prefix(1);
    if (text.empty() || text.front() == '-' || text.front() == '+') return false;
  }
  const char* end = text.data() + text.size();
  const auto result = std::from_chars(text.data(), end, out, std::chars_format::general);
  return result.ec == std::errc() && result.ptr == end;
}

std::string csv_field(std::string_view text) {
  const bool needs_quotes = text.find_first_of(",\"\r\n") != std::string_view::npos ||
                            (!text.empty() && (text.front() == ' ' || text.back() == ' '));
  if (!needs_quotes) return std::string(text);
  std::string quoted = "\"";
  for (char c : text) {
    if (c == '"') quoted += '"';
    quoted += c;
  }
  quoted += '"';
  return quoted;
}

std::string_view trim(std::string_view text) {
  while (!text.empty() && (text.front() == ' ' || text.front() == '\t')) text.remove_prefix(1);
  while (!text.empty() && (text.back() == ' ' || text.back() == '\t')) text.remove_suffix(1);
  return text;
}

std::string path_text(const QString& path) { return path.toStdString(); }

std::string read_whole_file(const QString& path, std::int64_t limit_bytes) {
  const QFileInfo info(path);
  // Checked before opening: opening a FIFO would wait for a writer, a device never ends.
  if (info.exists() && !info.isFile()) {
    throw InputError(path_text(path) +
                     (info.isDir() ? ": is a folder, not a file"
                                   : ": is not a regular file (a device, a FIFO or a socket); "
                                     "only regular files are read"));
  }
  const auto too_large = [&] {
    return InputError(path_text(path) + ": larger than the limit of " +
                      std::to_string(limit_bytes) +
                      " bytes for this kind of file (docs/limits.md)");
  };
  if (info.exists() && info.size() > limit_bytes) throw too_large();
  QFile file(path);
  if (!file.open(QIODevice::ReadOnly)) {
    throw InputError(path_text(path) + ": cannot read the file (" +
                     file.errorString().toStdString() + ")");
  }
  // The file may have grown since it was measured: read in pieces, never past the limit.
  std::string bytes;
  bytes.reserve(static_cast<size_t>(std::min<std::int64_t>(info.size(), limit_bytes)));
  std::array<char, 1 << 16> piece{};
  while (true) {
    const qint64 got = file.read(piece.data(), static_cast<qint64>(piece.size()));
    if (got < 0) {
      throw InputError(path_text(path) + ": cannot read the file (" +
                       file.errorString().toStdString() + ")");
    }
    if (got == 0) break;
    if (static_cast<std::int64_t>(bytes.size()) + got > limit_bytes) throw too_large();
    bytes.append(piece.data(), static_cast<size_t>(got));
  }
  return bytes;
}

void write_whole_file(const QString& path, const std::string& bytes) {
  save_atomically(path, bytes, Overwrite::allow);
}

}  // namespace gramline::formats
