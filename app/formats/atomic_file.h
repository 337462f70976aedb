#pragma once
// Saving user files safely: the bytes go to a temporary file in the target's folder, which is
// flushed to the disk, checked and renamed over the target only when every byte is written. A
// save that fails or is killed half-way leaves the old file whole and no partial file under
// the final name. Sets of files: file_set.h.
#include <QString>
#include <memory>
#include <string>
#include <string_view>

namespace gramline::formats {

/// Whether an existing file may be replaced.
enum class Overwrite { refuse, allow };

/// Throws InputError naming `path` when it exists and `policy` is refuse. The message tells the
/// user how to replace it (`--force`). Also refuses (whatever the policy) a path that exists and
/// is not a regular file: a folder, a device node, a FIFO, a socket.
void refuse_existing(const QString& path, Overwrite policy);

/// A temporary file beside `target`, named `.<target name>.part-<process id>-<n>`. write() as
/// often as needed, finish() to flush it to the disk, then move_into_place(); destroying it
/// before that removes the temporary. Failures throw SystemError naming the target and the
/// system's error text.
class PendingFile {
 public:
  explicit PendingFile(const QString& target);
  ~PendingFile();
  PendingFile(const PendingFile&) = delete;
  PendingFile& operator=(const PendingFile&) = delete;

  void write(std::string_view bytes);
  /// Flushes and closes the temporary, reporting any error the disk gave.
  void finish();
  /// Renames the finished temporary over the target.
  void move_into_place();
  const QString& target() const { return target_; }

 private:
  [[noreturn]] void fail(const char* what, int error);
  void discard();
  QString target_;
  std::string temp_;  ///< path of the temporary, local 8-bit encoding
  int fd_ = -1;
  bool placed_ = false;
};

/// Removes temporaries of `target` left by a process that no longer runs (killed mid-save).
void remove_stale_temporaries(const QString& target);

/// An atomic save in progress. write() as often as needed, then commit(); destroying it without
/// commit() discards everything written.
class AtomicFile {
 public:
  /// Opens the temporary file. Throws InputError naming `path` when it exists and `policy` is
  /// refuse or it is not a regular file, or when the folder cannot be written.
  AtomicFile(const QString& path, Overwrite policy);
  ~AtomicFile();
  AtomicFile(const AtomicFile&) = delete;
  AtomicFile& operator=(const AtomicFile&) = delete;

  /// Appends bytes. Throws SystemError when the disk refuses them.
  void write(std::string_view bytes);
  /// Flushes, checks and renames the temporary file over the target. Throws SystemError on
  /// failure (the target is then untouched).
  void commit();

 private:
  std::unique_ptr<PendingFile> file_;
};

/// Writes `bytes` to `path` in one atomic save.
void save_atomically(const QString& path, std::string_view bytes, Overwrite policy);

}  // namespace gramline::formats
