#pragma once
// Whole files as text, for tests that compare what was on disk before and after a command.
#include <QFile>
#include <QString>
#include <string>

namespace test_files {

/// The file's bytes; empty when it cannot be opened.
inline std::string read_text(const QString& path) {
  QFile f(path);
  if (!f.open(QIODevice::ReadOnly)) return {};
  return f.readAll().toStdString();
}

/// Writes `text` to `path`; false when it cannot.
inline bool write_text(const QString& path, const std::string& text) {
  QFile f(path);
  return f.open(QIODevice::WriteOnly) &&
         f.write(text.data(), static_cast<qint64>(text.size())) == static_cast<qint64>(text.size());
}

}  // namespace test_files
