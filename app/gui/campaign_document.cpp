#include "campaign_document.h"

#include <QFileInfo>
#include <QHash>
#include <QUndoCommand>

namespace gramline::gui {

/// One undoable edit: the whole campaign before and after.
class SnapshotCommand : public QUndoCommand {
 public:
  SnapshotCommand(CampaignDocument* document, const QString& text, Campaign before, Campaign after,
                  int merge_id, bool may_merge)
      : QUndoCommand(text),
        document_(document),
        before_(std::move(before)),
        after_(std::move(after)),
        merge_id_(merge_id),
        may_merge_(may_merge) {}

  void undo() override { document_->set_campaign(before_); }
  void redo() override { document_->set_campaign(after_); }
  int id() const override { return merge_id_; }
  bool mergeWith(const QUndoCommand* other) override {
    const auto* next = static_cast<const SnapshotCommand*>(other);
    if (!next->may_merge_) return false;
    after_ = next->after_;
    return true;
  }

 private:
  CampaignDocument* document_;
  Campaign before_;
  Campaign after_;
  int merge_id_;
  bool may_merge_;
};

namespace {

// Small positive ids for merge keys; -1 means "never merge" to QUndoStack.
int merge_id_of(const QString& key) {
  static QHash<QString, int> ids;
  if (key.isEmpty()) return -1;
  auto it = ids.find(key);
  if (it == ids.end()) it = ids.insert(key, static_cast<int>(ids.size()) + 1);
  return it.value();
}

}  // namespace

CampaignDocument::CampaignDocument(QObject* parent) : QObject(parent) {
  connect(&undo_, &QUndoStack::cleanChanged, this, &CampaignDocument::state_changed);
}

void CampaignDocument::edit(const QString& text, const std::function<void(Campaign&)>& change,
                            const QString& merge_key) {
  Campaign after = campaign_;
  change(after);
  const bool recent = last_edit_.isValid() && last_edit_.elapsed() < 2000;
  last_edit_.restart();
  undo_.push(
      new SnapshotCommand(this, text, campaign_, std::move(after), merge_id_of(merge_key), recent));
}

void CampaignDocument::replace(const Campaign& campaign, const QString& path, bool modified) {
  undo_.clear();
  undo_.setClean();
  path_ = path;
  modified_without_history_ = modified;
  set_campaign(campaign);
  emit state_changed();
}

void CampaignDocument::mark_saved(const QString& path) {
  path_ = path;
  modified_without_history_ = false;
  undo_.setClean();
  emit state_changed();
}

QString CampaignDocument::display_name() const {
  return path_.isEmpty() ? tr("Untitled") : QFileInfo(path_).fileName();
}

void CampaignDocument::set_campaign(const Campaign& campaign) {
  campaign_ = campaign;
  emit changed();
}

}  // namespace gramline::gui
