#include "formats/atomic_file.h"

#include <fcntl.h>
#include <signal.h>
#include <sys/stat.h>
#include <unistd.h>

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <array>
#include <atomic>
#include <cerrno>
#include <cstdio>
#include <cstdlib>
#include <cstring>

#include "formats/file_set.h"
#include "formats/input_error.h"
#include "formats/text_io.h"

namespace gramline::formats {
namespace {

/// Paths of the temporaries open in this process, for the signal handler. A slot holds a
/// strdup'ed path or null.
std::array<std::atomic<char*>, 64> g_temporaries{};

void register_temporary(const std::string& path) {
  char* copy = strdup(path.c_str());
  for (auto& slot : g_temporaries) {
    char* expected = nullptr;
    if (slot.compare_exchange_strong(expected, copy)) return;
  }
  std::free(copy);  // more saves at once than slots: this one is only cleaned up normally
}

void unregister_temporary(const std::string& path) {
  for (auto& slot : g_temporaries) {
    char* held = slot.load();
    if (held && path == held && slot.compare_exchange_strong(held, nullptr)) {
      std::free(held);
      return;
    }
  }
}

extern "C" void remove_temporaries_and_reraise(int signal_number) {
  for (auto& slot : g_temporaries) {
    if (char* path = slot.load()) ::unlink(path);
  }
  ::signal(signal_number, SIG_DFL);
  ::raise(signal_number);
}

std::atomic<unsigned> g_temporary_counter{0};

std::string local_path(const QString& path) { return QFile::encodeName(path).toStdString(); }

/// Prefix of the temporaries of `target`: ".<file name>.part-".
QString temporary_prefix(const QString& target) {
  return "." + QFileInfo(target).fileName() + ".part-";
}

bool is_disk_failure(int error) {
  return error == ENOSPC || error == EDQUOT || error == EIO || error == EFBIG || error == ENOMEM;
}

}  // namespace

void refuse_unusable_output_file(const QString& path) {
  const QFileInfo info(path);
  if (!info.exists()) return;
  if (info.isDir()) throw InputError(path_text(path) + ": is a folder, not a file");
  if (!info.isFile()) {
    throw InputError(path_text(path) +
                     ": exists and is not a regular file (a device, a FIFO or a socket); "
                     "refused as an output");
  }
}

void refuse_unusable_output_folder(const QString& path) {
  const QFileInfo info(path);
  if (info.exists() && !info.isDir())
    throw InputError(path_text(path) + ": exists and is not a folder; refused as an output");
}

void refuse_existing(const QString& path, Overwrite policy) {
  refuse_unusable_output_file(path);
  if (policy == Overwrite::refuse && QFileInfo::exists(path)) {
    throw InputError(path_text(path) +
                     ": the file exists; it is left as it is (give --force to replace it)");
  }
}

void remove_stale_temporaries(const QString& target) {
  const QFileInfo info(target);
  const QString prefix = temporary_prefix(target);
  const QDir dir = info.absoluteDir();
  for (const QString& name : dir.entryList({prefix + "*"}, QDir::Files | QDir::Hidden)) {
    // ".<name>.part-<pid>-<n>": remove it only when that process no longer runs.
    const QString rest = name.mid(prefix.size());
    bool ok = false;
    const long pid = rest.section('-', 0, 0).toLong(&ok);
    if (!ok || pid <= 0) continue;
    if (::kill(static_cast<pid_t>(pid), 0) == 0 || errno != ESRCH) continue;
    QFile::remove(dir.filePath(name));
  }
}

PendingFile::PendingFile(const QString& target) : target_(target) {
  const QFileInfo info(target);
  const QString temp =
      info.absoluteDir().filePath(temporary_prefix(target) + QString::number(::getpid()) + "-" +
                                  QString::number(g_temporary_counter.fetch_add(1)));
  temp_ = local_path(temp);
  // The mode a new file gets (the umask applies); an existing target keeps its own.
  mode_t mode = 0666;
  struct stat old {};
  if (::stat(local_path(target).c_str(), &old) == 0) mode = old.st_mode & 07777;
  fd_ = ::open(temp_.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC, mode);
  if (fd_ < 0) {
    const int error = errno;
    const std::string message =
        path_text(target) + ": cannot write the file (" + std::strerror(error) + ")";
    if (is_disk_failure(error)) throw SystemError(message);
    throw InputError(message);
  }
  if (old.st_mode != 0) ::fchmod(fd_, mode);
  register_temporary(temp_);
}

PendingFile::~PendingFile() {
  if (!placed_) discard();
}

void PendingFile::discard() {
  if (fd_ >= 0) ::close(fd_);
  fd_ = -1;
  if (!temp_.empty()) {
    ::unlink(temp_.c_str());
    unregister_temporary(temp_);
    temp_.clear();
  }
}

void PendingFile::fail(const char* what, int error) {
  discard();
  throw SystemError(path_text(target_) + ": " + what + " (" + std::strerror(error) +
                    "); the old file, if any, is unchanged");
}

void PendingFile::write(std::string_view bytes) {
  if (fd_ < 0) throw std::logic_error("PendingFile::write after finish");
  while (!bytes.empty()) {
    const ssize_t done = ::write(fd_, bytes.data(), bytes.size());
    if (done < 0) {
      if (errno == EINTR) continue;
      fail("cannot write the file", errno);
    }
    if (done == 0) fail("cannot write the file", EIO);
    bytes.remove_prefix(static_cast<size_t>(done));
  }
}

void PendingFile::finish() {
  if (fd_ < 0) throw std::logic_error("PendingFile::finish twice");
  // fsync reports what delayed allocation found too (a full disk noticed at write-back).
  if (::fsync(fd_) != 0 && errno != EINVAL && errno != EROFS) fail("cannot save the file", errno);
  const int fd = fd_;
  fd_ = -1;
  if (::close(fd) != 0 && errno != EINTR) fail("cannot save the file", errno);
}

void PendingFile::move_into_place() {
  if (fd_ >= 0) finish();
  if (::rename(temp_.c_str(), local_path(target_).c_str()) != 0) {
    fail("cannot put the file in place", errno);
  }
  unregister_temporary(temp_);
  temp_.clear();
  placed_ = true;
}

AtomicFile::AtomicFile(const QString& path, Overwrite policy) {
  refuse_existing(path, policy);
  remove_stale_temporaries(path);
  file_ = std::make_unique<PendingFile>(path);
}

AtomicFile::~AtomicFile() = default;

void AtomicFile::write(std::string_view bytes) { file_->write(bytes); }

void AtomicFile::commit() { file_->move_into_place(); }

void save_atomically(const QString& path, std::string_view bytes, Overwrite policy) {
  AtomicFile file(path, policy);
  file.write(bytes);
  file.commit();
}

void remove_temporaries_on_signals() {
  for (int s : {SIGINT, SIGTERM, SIGHUP}) {
    struct sigaction action {};
    action.sa_handler = remove_temporaries_and_reraise;
    sigemptyset(&action.sa_mask);
    ::sigaction(s, &action, nullptr);
  }
}

}  // namespace gramline::formats
