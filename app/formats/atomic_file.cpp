#include "formats/atomic_file.h"

#include <QFileInfo>

#include "formats/input_error.h"
#include "formats/text_io.h"

namespace gramline::formats {

void refuse_existing(const QString& path, Overwrite policy) {
  if (policy == Overwrite::refuse && QFileInfo::exists(path)) {
    throw InputError(path_text(path) +
                     ": the file exists; it is left as it is (give --force to replace it)");
  }
}

AtomicFile::AtomicFile(const QString& path, Overwrite policy)
    : path_(path), file_(std::make_unique<QSaveFile>(path)) {
  refuse_existing(path, policy);
  if (QFileInfo(path).isDir()) {
    throw InputError(path_text(path) + ": is a folder, not a file");
  }
  if (!file_->open(QIODevice::WriteOnly)) fail("cannot write the file");
}

AtomicFile::~AtomicFile() {
  if (!committed_ && file_->isOpen()) file_->cancelWriting();
}

void AtomicFile::fail(const char* what) {
  const std::string reason = file_->errorString().toStdString();
  if (file_->isOpen()) file_->cancelWriting();
  throw InputError(path_text(path_) + ": " + what + " (" + reason + ")");
}

void AtomicFile::write(std::string_view bytes) {
  const auto size = static_cast<qint64>(bytes.size());
  if (file_->write(bytes.data(), size) != size) fail("cannot write the file");
}

void AtomicFile::commit() {
  if (!file_->commit()) {
    committed_ = true;  // QSaveFile has already discarded the temporary file
    throw InputError(path_text(path_) + ": cannot save the file (" +
                     file_->errorString().toStdString() + ")");
  }
  committed_ = true;
}

void save_atomically(const QString& path, std::string_view bytes, Overwrite policy) {
  AtomicFile file(path, policy);
  file.write(bytes);
  file.commit();
}

}  // namespace gramline::formats
