#pragma once
// Autosave and crash recovery: while the app runs, a modified campaign is written every 30 s to
// this session's autosave file, which a lock file marks as belonging to a running session. A
// later start finds the autosaves of sessions that ended without closing and offers them back.
#include <QObject>
#include <QString>
#include <memory>

class QLockFile;
class QTimer;
class QWidget;

namespace gramline::gui {

class CampaignDocument;

class SessionAutosave : public QObject {
  Q_OBJECT

 public:
  /// Locks this session's autosave and starts the timer; questions are asked over `window`.
  SessionAutosave(CampaignDocument* document, QWidget* window);
  /// Removes this session's autosave: the session ended properly.
  ~SessionAutosave() override;

  /// Writes the campaign when it has changes that are not saved.
  void write();
  /// Removes this session's autosave (after a save, on close).
  void remove();
  /// Looks for autosaves of sessions that ended without closing and offers to restore them;
  /// the first one the user takes replaces the document. With `opening` (the file the user
  /// asked to open), only autosaves of that file are offered; the others wait for a later start.
  void offer_recovery(const QString& opening = QString());

 private:
  QString path() const;

  CampaignDocument* document_;
  QWidget* window_;
  QTimer* timer_;
  std::unique_ptr<QLockFile> lock_;
};

}  // namespace gramline::gui
