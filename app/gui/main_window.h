#pragma once
// The main window: the campaign editor on the left, the views on the right, planning in the
// background as soon as the campaign changes. The window's other jobs have their own classes:
// CampaignFiles (the File menu), RecentFiles, SessionAutosave (autosave and crash recovery),
// HandOff (bundles and counts) and take_screenshots.
#include <QMainWindow>
#include <memory>

#include "gramline/campaign.h"
#include "gramline/plan.h"

class QTabWidget;

namespace gramline::gui {

class CampaignDocument;
class CampaignFiles;
class CompareView;
class EditorPanel;
class GramView;
class HandOff;
class MarginView;
class MarginRunner;
class MeasuredView;
class PlanRunner;
class RecentFiles;
class SessionAutosave;
class StatusIndicator;
class StepsView;
class SummaryView;
class TimelineView;
class ViewFrame;

class MainWindow : public QMainWindow {
  Q_OBJECT

 public:
  enum View {
    kSummary,
    kSteps,
    kTimeline,
    kGram,
    kMargin,
    kMeasured,
    kCompare,
    kCautions,
    kViewCount
  };

  explicit MainWindow(QWidget* parent = nullptr);

  CampaignDocument* document() const { return document_; }
  PlanRunner* runner() const { return runner_; }
  MarginRunner* margin_runner() const { return margin_runner_; }
  MarginView* margin_view() const { return margin_; }
  SummaryView* summary_view() const { return summary_; }
  StepsView* steps_view() const { return steps_; }
  TimelineView* timeline_view() const { return timeline_; }
  MeasuredView* measured_view() const { return measured_; }
  GramView* gram_view() const { return gram_; }
  CompareView* compare_view() const { return compare_; }
  HandOff* hand_off() const { return hand_off_; }
  EditorPanel* editor() const { return editor_; }
  ViewFrame* frame(View view) const { return frames_[view]; }
  QTabWidget* views() const { return tabs_; }
  /// The status bar's planning line (progress and cancel while a plan runs).
  StatusIndicator* plan_status() const { return plan_status_; }

  /// Opens a campaign file; false (after telling the user) when it cannot be read.
  bool open_file(const QString& path);
  /// Saves to `path`; false (after telling the user) on failure.
  bool save_to(const QString& path);
  /// Replaces the campaign with the bundled demo.
  void load_demo();
  /// Looks for autosaves of sessions that ended without closing and offers to restore them;
  /// with `opening`, only those of that file.
  void offer_recovery(const QString& opening = QString());

 protected:
  void closeEvent(QCloseEvent* event) override;
  bool eventFilter(QObject* watched, QEvent* event) override;

 private:
  void build_views();
  void build_actions();
  void build_status_bar();
  void follow_planning();
  void follow_margin_check();
  void on_campaign_changed();
  void on_plan_finished();
  void on_plan_failed(const QString& message);
  void on_margin_finished();
  void set_all_stale(bool stale, const QString& message);
  /// Puts `reason` in place of every plan view (no plan for this campaign); empty: the views.
  void withdraw_views(const QString& reason);
  void update_title();
  bool cautions_acknowledged();

  CampaignDocument* document_;
  PlanRunner* runner_;
  MarginRunner* margin_runner_;
  EditorPanel* editor_ = nullptr;
  QTabWidget* tabs_ = nullptr;
  ViewFrame* frames_[kViewCount] = {};
  SummaryView* summary_ = nullptr;
  StepsView* steps_ = nullptr;
  TimelineView* timeline_ = nullptr;
  GramView* gram_ = nullptr;
  MarginView* margin_ = nullptr;
  MeasuredView* measured_ = nullptr;
  CompareView* compare_ = nullptr;
  HandOff* hand_off_ = nullptr;
  SessionAutosave* autosave_ = nullptr;
  RecentFiles* recent_ = nullptr;
  CampaignFiles* files_ = nullptr;
  StatusIndicator* plan_status_ = nullptr;
  StatusIndicator* margin_status_ = nullptr;
  bool cautions_seen_ = false;
};

}  // namespace gramline::gui
