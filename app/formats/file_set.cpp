#include "formats/file_set.h"

#include <pthread.h>
#include <signal.h>

#include <QCryptographicHash>
#include <QDir>
#include <QFileInfo>
#include <memory>

#include "formats/bundle.h"
#include "formats/input_error.h"
#include "formats/json_field.h"
#include "formats/limits.h"
#include "formats/text_io.h"

namespace gramline::formats {

void save_file_set(const QString& dir, const std::vector<SetFile>& files, Overwrite overwrite) {
  refuse_unusable_output_folder(dir);
  const QDir folder(dir);
  // Refuse before anything is written: a refused save changes nothing.
  for (const SetFile& f : files)
    refuse_existing(folder.filePath(QString::fromStdString(f.name)), overwrite);
  if (!QDir().mkpath(dir)) throw InputError(path_text(dir) + ": cannot create the folder");
  std::vector<std::unique_ptr<PendingFile>> pending;
  pending.reserve(files.size());
  for (const SetFile& f : files) {
    const QString target = folder.filePath(QString::fromStdString(f.name));
    remove_stale_temporaries(target);
    pending.push_back(std::make_unique<PendingFile>(target));
    pending.back()->write(f.bytes);
    pending.back()->finish();
  }
  // Every file is complete on the disk: only now are the old ones replaced. Ctrl-C, SIGTERM and
  // SIGHUP wait until every rename is done, so that they cannot split the set; a rename that
  // fails still leaves each file whole, and the set's index tells the mix apart.
  sigset_t stop_signals, previous;
  sigemptyset(&stop_signals);
  for (int s : {SIGINT, SIGTERM, SIGHUP}) sigaddset(&stop_signals, s);
  pthread_sigmask(SIG_BLOCK, &stop_signals, &previous);
  try {
    for (auto& p : pending) p->move_into_place();
  } catch (...) {
    pthread_sigmask(SIG_SETMASK, &previous, nullptr);
    throw;
  }
  pthread_sigmask(SIG_SETMASK, &previous, nullptr);
}

std::string content_set_id(const std::vector<std::string>& parts) {
  QCryptographicHash hash(QCryptographicHash::Sha256);
  for (const std::string& part : parts) {
    // Each part's length first, so that moving bytes from one part to the next changes the id.
    hash.addData(QByteArray::number(static_cast<qint64>(part.size())) + '\n');
    hash.addData(QByteArrayView(part.data(), static_cast<qsizetype>(part.size())));
  }
  return hash.result().toHex().left(32).toStdString();
}

std::string verify_file_set(const QString& dir, const std::string& index) {
  const QDir folder(dir);
  const QString index_path = folder.filePath(QString::fromStdString(index));
  const JsonField root = parse_json_document(read_whole_file(index_path, limits::kSmallJsonBytes),
                                             path_text(index_path));
  if (!root.has(kSetIdKey) || !root.has(kSetFilesKey))
    root.fail(std::string("has no ") + kSetIdKey + " and " + kSetFilesKey +
              " (not saved as a set by this version); the set cannot be checked");
  const std::string id = root[kSetIdKey].text();
  const JsonField files = root[kSetFilesKey];
  if (!files.value().isObject()) files.fail("expected an object (file name: SHA-256)");
  for (const QString& key : files.value().toObject().keys()) {
    const std::string name = key.toStdString();
    const QString path = folder.filePath(key);
    const QFileInfo info(path);
    if (!info.isFile())
      throw InputError(path_text(path) + ": missing; the set saved as " + id + " is incomplete");
    const std::string bytes = read_whole_file(path, limits::kBundleTotalBytes);
    if (sha256_hex(bytes) != files[name.c_str()].text())
      throw InputError(path_text(path) + ": does not belong to the set saved as " + id + " (" +
                       index +
                       " lists another SHA-256): the folder holds files of different saves; "
                       "save the set again");
  }
  return id;
}

}  // namespace gramline::formats
