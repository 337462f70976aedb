#pragma once
// The campaign's files, as the File menu handles them: new, open, save, save as, import a data
// set, export the plan files; and the question before unsaved changes are dropped.
#include <QObject>
#include <QString>
#include <functional>

class QMainWindow;

namespace gramline::gui {

class CampaignDocument;
class PlanRunner;
class RecentFiles;
class SessionAutosave;

class CampaignFiles : public QObject {
  Q_OBJECT

 public:
  /// Dialogs and messages go to `window`; `cautions_acknowledged` shows the cautions before the
  /// first export of a session and says whether the user went on.
  CampaignFiles(QMainWindow* window, CampaignDocument* document, PlanRunner* planner,
                RecentFiles* recent, SessionAutosave* autosave,
                std::function<bool()> cautions_acknowledged);

  /// Asks to save unsaved changes; false when the user cancels (or the save fails).
  bool confirm_discard();
  /// A usable two-photon rig and the usual settings, without data.
  void new_campaign();
  /// File ▸ New Campaign from CSV…: the dialog, then the campaign it makes (unsaved).
  void new_campaign_from_csv();
  /// Replaces the campaign with the bundled demo.
  void load_demo();
  /// Opens a campaign file; false (after telling the user) when it cannot be read.
  bool open(const QString& path);
  void open_dialog();
  /// Saves to `path`; false (after telling the user) on failure.
  bool save_to(const QString& path);
  bool save();
  bool save_as();
  /// File ▸ Import Data CSV…: replaces the data set (one undoable edit).
  void import_data();
  /// File ▸ Export Plan Files…: the current plan's steps, summary and kernel files.
  void export_plan();

 private:
  QMainWindow* window_;
  CampaignDocument* document_;
  PlanRunner* planner_;
  RecentFiles* recent_;
  SessionAutosave* autosave_;
  std::function<bool()> cautions_acknowledged_;
};

}  // namespace gramline::gui
