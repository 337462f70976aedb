#pragma once
// Saving user files safely: the bytes go to a temporary file in the target's folder, which is
// renamed over the target only when every byte is written (QSaveFile). A save that fails or is
// killed half-way leaves the old file whole and no partial file under the final name.
#include <QSaveFile>
#include <QString>
#include <memory>
#include <string>
#include <string_view>

namespace gramline::formats {

/// Whether an existing file may be replaced.
enum class Overwrite { refuse, allow };

/// Throws InputError naming `path` when it exists and `policy` is refuse. The message tells the
/// user how to replace it (`--force`).
void refuse_existing(const QString& path, Overwrite policy);

/// An atomic save in progress. write() as often as needed, then commit(); destroying it without
/// commit() discards everything written.
class AtomicFile {
 public:
  /// Opens the temporary file. Throws InputError naming `path` when it exists and `policy` is
  /// refuse, or when the folder cannot be written.
  AtomicFile(const QString& path, Overwrite policy);
  ~AtomicFile();
  AtomicFile(const AtomicFile&) = delete;
  AtomicFile& operator=(const AtomicFile&) = delete;

  /// Appends bytes. Throws InputError when the disk refuses them.
  void write(std::string_view bytes);
  /// Renames the temporary file over the target. Throws InputError on failure (the target is
  /// then untouched).
  void commit();

 private:
  [[noreturn]] void fail(const char* what);
  QString path_;
  std::unique_ptr<QSaveFile> file_;
  bool committed_ = false;
};

/// Writes `bytes` to `path` in one atomic save.
void save_atomically(const QString& path, std::string_view bytes, Overwrite policy);

}  // namespace gramline::formats
