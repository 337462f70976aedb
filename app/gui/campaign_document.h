#pragma once
// The open campaign: its value, its file, and the undo history of every edit.
#include <QElapsedTimer>
#include <QObject>
#include <QString>
#include <QUndoStack>
#include <functional>

#include "gramline/campaign.h"

namespace gramline::gui {

/// Holds the campaign being edited. Every change goes through edit(), which records a whole
/// snapshot before and after on the undo stack, so undo restores exactly what was there.
class CampaignDocument : public QObject {
  Q_OBJECT

 public:
  explicit CampaignDocument(QObject* parent = nullptr);

  const Campaign& campaign() const { return campaign_; }
  QUndoStack* undo_stack() { return &undo_; }

  /// Applies `change` to a copy of the campaign and pushes it as one undoable step named
  /// `text`. Consecutive edits with the same non-empty `merge_key` within two seconds merge
  /// into one step (a spin box stepped five times is one undo). Exceptions from `change`
  /// propagate and leave the campaign untouched.
  void edit(const QString& text, const std::function<void(Campaign&)>& change,
            const QString& merge_key = {});

  /// Replaces the campaign (new, open, recovery) and clears the history. `modified` marks a
  /// campaign that differs from its file (a recovered autosave, a new campaign).
  void replace(const Campaign& campaign, const QString& path, bool modified);

  const QString& path() const { return path_; }
  /// Called after a successful save to `path`.
  void mark_saved(const QString& path);
  bool modified() const { return !undo_.isClean() || modified_without_history_; }
  /// File name without folder, or "Untitled".
  QString display_name() const;

 signals:
  /// The campaign value changed (edit, undo, redo, replace).
  void changed();
  /// The file path or the modified state changed.
  void state_changed();

 private:
  friend class SnapshotCommand;
  void set_campaign(const Campaign& campaign);

  Campaign campaign_;
  QUndoStack undo_;
  QString path_;
  bool modified_without_history_ = false;
  QElapsedTimer last_edit_;
};

}  // namespace gramline::gui
