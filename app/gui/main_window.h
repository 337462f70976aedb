#pragma once
// The main window: the campaign editor on the left, the views on the right, planning in the
// background after every edit.
#include <QLockFile>
#include <QMainWindow>
#include <QPointer>
#include <memory>

#include "gramline/campaign.h"
#include "gramline/plan.h"

class QAction;
class QLabel;
class QMenu;
class QProgressBar;
class QPushButton;
class QTabWidget;

namespace gramline::gui {

class CampaignDocument;
class EditorPanel;
class GramView;
class HandOff;
class MarginView;
class MarginRunner;
class MeasuredView;
class PlanRunner;
class StepsView;
class SummaryView;
class TimelineView;
class ViewFrame;

class MainWindow : public QMainWindow {
  Q_OBJECT

 public:
  enum View { kSummary, kSteps, kTimeline, kGram, kMargin, kMeasured, kCautions, kViewCount };

  explicit MainWindow(QWidget* parent = nullptr);
  ~MainWindow() override;

  CampaignDocument* document() const { return document_; }
  PlanRunner* runner() const { return runner_; }
  MarginRunner* margin_runner() const { return margin_runner_; }
  MarginView* margin_view() const { return margin_; }
  SummaryView* summary_view() const { return summary_; }
  StepsView* steps_view() const { return steps_; }
  MeasuredView* measured_view() const { return measured_; }
  HandOff* hand_off() const { return hand_off_; }
  EditorPanel* editor() const { return editor_; }
  ViewFrame* frame(View view) const { return frames_[view]; }
  QTabWidget* views() const { return tabs_; }

  /// Opens a campaign file; false (after telling the user) when it cannot be read.
  bool open_file(const QString& path);
  /// Saves to `path`; false (after telling the user) on failure.
  bool save_to(const QString& path);
  /// Replaces the campaign with the bundled demo.
  void load_demo();
  /// Looks for autosaves of sessions that ended without closing and offers to restore them.
  void offer_recovery();
  /// Renders every view (and every editor page) into `dir` as PNG files once the plan is
  /// ready, then calls `done`.
  void take_screenshots(const QString& dir, const std::function<void(bool ok)>& done);

 protected:
  void closeEvent(QCloseEvent* event) override;

 private:
  void build_actions();
  void build_status_bar();
  void on_campaign_changed();
  void on_plan_finished(std::shared_ptr<const Plan> plan);
  void on_plan_failed(const QString& message);
  void on_margin_finished();
  void set_all_stale(bool stale, const QString& message);
  void update_title();
  bool confirm_discard();
  void new_campaign();
  void open_dialog();
  bool save();
  bool save_as();
  void import_data();
  void export_plan();
  void show_cautions();
  bool cautions_acknowledged();
  void add_recent(const QString& path);
  void rebuild_recent_menu();
  void write_autosave();
  void remove_autosave();
  QString autosave_path() const;

  CampaignDocument* document_;
  PlanRunner* runner_;
  MarginRunner* margin_runner_;
  QProgressBar* margin_progress_;
  QPushButton* margin_cancel_;
  QLabel* margin_status_;
  EditorPanel* editor_ = nullptr;
  QTabWidget* tabs_;
  ViewFrame* frames_[kViewCount] = {};
  SummaryView* summary_;
  StepsView* steps_;
  TimelineView* timeline_ = nullptr;
  GramView* gram_ = nullptr;
  MarginView* margin_ = nullptr;
  MeasuredView* measured_ = nullptr;
  HandOff* hand_off_ = nullptr;

  QLabel* status_;
  QProgressBar* progress_;
  QPushButton* cancel_;
  QMenu* recent_menu_ = nullptr;
  QAction* save_action_ = nullptr;
  QTimer* autosave_timer_ = nullptr;
  std::unique_ptr<QLockFile> session_lock_;
  bool cautions_seen_ = false;
};

}  // namespace gramline::gui
