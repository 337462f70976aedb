#include "session_autosave.h"

#include <QApplication>
#include <QDateTime>
#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QLocale>
#include <QLockFile>
#include <QMessageBox>
#include <QSettings>
#include <QStandardPaths>
#include <QTimer>
#include <exception>

#include "campaign_document.h"
#include "formats/campaign_json.h"

namespace gramline::gui {

namespace {
QString autosave_dir() {
  return QStandardPaths::writableLocation(QStandardPaths::AppDataLocation) +
         QStringLiteral("/autosave");
}
}  // namespace

SessionAutosave::SessionAutosave(CampaignDocument* document, QWidget* window)
    : QObject(window), document_(document), window_(window) {
  // This session's file is locked while we run, so a later start can tell a crashed session's
  // autosave from a running one's.
  QDir().mkpath(autosave_dir());
  lock_ = std::make_unique<QLockFile>(path() + QStringLiteral(".lock"));
  lock_->setStaleLockTime(0);
  lock_->tryLock(0);
  timer_ = new QTimer(this);
  timer_->setInterval(30000);
  connect(timer_, &QTimer::timeout, this, &SessionAutosave::write);
  timer_->start();
}

SessionAutosave::~SessionAutosave() {
  remove();
  lock_->unlock();
}

QString SessionAutosave::path() const {
  return autosave_dir() + QStringLiteral("/session-%1.json").arg(QApplication::applicationPid());
}

void SessionAutosave::write() {
  if (!document_->modified()) return;
  try {
    formats::save_campaign(document_->campaign(), path());
    QSettings(path() + QStringLiteral(".ini"), QSettings::IniFormat)
        .setValue(QStringLiteral("original"), document_->path());
  } catch (const std::exception&) {
    // An autosave that cannot be written must never interrupt the user's work.
  }
}

void SessionAutosave::remove() {
  QFile::remove(path());
  QFile::remove(path() + QStringLiteral(".ini"));
}

void SessionAutosave::offer_recovery(const QString& opening) {
  const QString dir = autosave_dir();
  const QStringList files =
      QDir(dir).entryList({QStringLiteral("session-*.json")}, QDir::Files, QDir::Time);
  for (const QString& name : files) {
    const QString path = dir + QLatin1Char('/') + name;
    if (path == this->path()) continue;
    const QString original =
        QSettings(path + QStringLiteral(".ini"), QSettings::IniFormat).value("original").toString();
    // Another file's autosave is not offered while the user opens this one.
    if (!opening.isEmpty() &&
        QFileInfo(original).absoluteFilePath() != QFileInfo(opening).absoluteFilePath())
      continue;
    QLockFile lock(path + QStringLiteral(".lock"));
    lock.setStaleLockTime(0);        // stale only when its process is gone
    if (!lock.tryLock(0)) continue;  // that session is still running
    const auto answer = QMessageBox::question(
        window_, tr("Recover unsaved work?"),
        tr("Gramline found unsaved changes from a session that did not close properly (%1, "
           "saved %2). Recover them?")
            .arg(original.isEmpty() ? tr("untitled campaign") : QFileInfo(original).fileName())
            .arg(QLocale().toString(QFileInfo(path).lastModified(), QLocale::ShortFormat)),
        QMessageBox::Yes | QMessageBox::No, QMessageBox::Yes);
    if (answer == QMessageBox::Yes) {
      try {
        document_->replace(formats::load_campaign(path), original, true);
      } catch (const std::exception& e) {
        QMessageBox::warning(window_, tr("Cannot recover"), QString::fromStdString(e.what()));
        continue;
      }
    }
    QFile::remove(path);
    QFile::remove(path + QStringLiteral(".ini"));
    lock.unlock();
    QFile::remove(path + QStringLiteral(".lock"));
    if (answer == QMessageBox::Yes) break;
  }
}

}  // namespace gramline::gui
