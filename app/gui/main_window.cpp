#include "main_window.h"

#include <QAction>
#include <QApplication>
#include <QCloseEvent>
#include <QDockWidget>
#include <QKeyEvent>
#include <QKeySequence>
#include <QLocale>
#include <QMenu>
#include <QMenuBar>
#include <QSettings>
#include <QStatusBar>
#include <QTabWidget>
#include <QToolBar>
#include <QUndoStack>

#include "app_icon.h"
#include "campaign_document.h"
#include "campaign_files.h"
#include "cautions.h"
#include "compare_view.h"
#include "editor_panel.h"
#include "gram_view.h"
#include "gui_text.h"
#include "hand_off.h"
#include "help_view.h"
#include "margin_runner.h"
#include "margin_view.h"
#include "measured_view.h"
#include "plan_runner.h"
#include "preferences.h"
#include "recent_files.h"
#include "session_autosave.h"
#include "status_indicator.h"
#include "steps_view.h"
#include "summary_view.h"
#include "timeline_view.h"
#include "view_frame.h"

namespace gramline::gui {

MainWindow::MainWindow(QWidget* parent) : QMainWindow(parent) {
  setObjectName(QStringLiteral("gramline_main_window"));
  setWindowIcon(app_icon());
  document_ = new CampaignDocument(this);
  runner_ = new PlanRunner(this);
  margin_runner_ = new MarginRunner(this);
  // Connected before the editor refreshes itself from the document: planning starts first and
  // runs while the editor and the views catch up.
  connect(document_, &CampaignDocument::changed, this, &MainWindow::on_campaign_changed);
  build_views();

  editor_ = new EditorPanel(document_);
  auto* dock = new QDockWidget(tr("Campaign"), this);
  dock->setObjectName(QStringLiteral("campaign_dock"));
  dock->setWidget(editor_);
  dock->setFeatures(QDockWidget::DockWidgetMovable | QDockWidget::DockWidgetFloatable |
                    QDockWidget::DockWidgetClosable);
  addDockWidget(Qt::LeftDockWidgetArea, dock);

  hand_off_ = new HandOff(this, runner_, measured_, [this] { return cautions_acknowledged(); });
  hand_off_->set_campaign_path([this] { return document_->path(); });
  connect(hand_off_, &HandOff::ingested, this, [this] { tabs_->setCurrentIndex(kMeasured); });
  autosave_ = new SessionAutosave(document_, this);
  recent_ = new RecentFiles(new QMenu(tr("Open &Recent"), this), this);
  files_ = new CampaignFiles(this, document_, runner_, recent_, autosave_,
                             [this] { return cautions_acknowledged(); });
  connect(recent_, &RecentFiles::open_requested, this, [this](const QString& path) {
    if (files_->confirm_discard()) files_->open(path);
  });
  build_actions();
  build_status_bar();
  auto* show_editor = dock->toggleViewAction();
  show_editor->setText(tr("Show &Campaign Editor"));
  show_editor->setShortcut(QKeySequence(Qt::CTRL | Qt::Key_E));
  menuBar()->actions().at(2)->menu()->addAction(show_editor);

  connect(document_, &CampaignDocument::state_changed, this, &MainWindow::update_title);
  connect(editor_, &EditorPanel::import_requested, files_, &CampaignFiles::import_data);
  connect(editor_, &EditorPanel::demo_requested, this, [this] {
    if (files_->confirm_discard()) files_->load_demo();
  });
  follow_planning();
  follow_margin_check();
  // The comparison's advice buttons are ordinary, undoable edits of the campaign.
  connect(compare_, &CompareView::minimum_budget_requested, this, [this](double pairs) {
    document_->edit(tr("Use the minimum budget that passes"), [pairs](Campaign& c) {
      c.precision.fixed_pairs = pairs;
      c.precision.allocation = Allocation::uniform;
    });
  });
  connect(compare_, &CompareView::margin_aware_requested, this, [this] {
    document_->edit(tr("Use margin-aware sharing"),
                    [](Campaign& c) { c.precision.allocation = Allocation::margin_aware; });
  });
  // Ctrl+Z in a field of the editor undoes the campaign edit, not the field's typing.
  qApp->installEventFilter(this);

  QSettings settings;
  restoreGeometry(settings.value(QStringLiteral("window/geometry")).toByteArray());
  restoreState(settings.value(QStringLiteral("window/state")).toByteArray());
  tabs_->setCurrentIndex(settings.value(QStringLiteral("window/view"), 0).toInt());
  if (!settings.contains(QStringLiteral("window/geometry"))) {
    resize(1400, 860);
    resizeDocks({dock}, {640}, Qt::Horizontal);
  }
  update_title();
  set_all_stale(false, QString());
}

void MainWindow::build_views() {
  summary_ = new SummaryView;
  steps_ = new StepsView;
  timeline_ = new TimelineView;
  gram_ = new GramView;
  margin_ = new MarginView;
  measured_ = new MeasuredView;
  compare_ = new CompareView;

  tabs_ = new QTabWidget;
  tabs_->setAccessibleName(tr("Views of the plan"));
  tabs_->setDocumentMode(true);
  const auto add_view = [this](View v, QWidget* w, const QString& title, const QString& tip) {
    frames_[v] = new ViewFrame(w);
    const int i = tabs_->addTab(frames_[v], title);
    tabs_->setTabToolTip(i, tip);
  };
  add_view(kSummary, summary_, tr("Summary"), tr("The figures to check before booking the lab"));
  add_view(kSteps, steps_, tr("Steps"), tr("Every step of the plan, in order"));
  add_view(kTimeline, timeline_, tr("Timeline"), tr("Where each night's time goes"));
  add_view(kGram, gram_, tr("Gram error"), tr("Kernel, predicted error and pairs per entry"));
  add_view(kMargin, margin_, tr("Margin"), tr("Whether the classifier survives the noise"));
  add_view(kMeasured, measured_, tr("Measured"),
           tr("A night's counts against the prediction, and the drift of the night"));
  add_view(kCompare, compare_, tr("Compare"),
           tr("A pinned plan beside the current one: what a change costs or gains"));
  add_view(kCautions, make_cautions_page(), tr("Cautions"),
           tr("Laser safety and unattended operation"));
  setCentralWidget(tabs_);
}

void MainWindow::build_actions() {
  QMenu* file = menuBar()->addMenu(tr("&File"));
  QMenu* edit = menuBar()->addMenu(tr("&Edit"));
  QMenu* view = menuBar()->addMenu(tr("&View"));
  QMenu* help = menuBar()->addMenu(tr("&Help"));
  QToolBar* bar = addToolBar(tr("Main"));
  bar->setObjectName(QStringLiteral("main_toolbar"));
  bar->setToolButtonStyle(Qt::ToolButtonTextOnly);

  const auto action = [this](QMenu* menu, const QString& text, QKeySequence key, auto slot) {
    QAction* a = menu->addAction(text);
    a->setShortcut(key);
    connect(a, &QAction::triggered, this, slot);
    return a;
  };
  QAction* new_a = action(file, tr("&New"), QKeySequence::New, [this] {
    if (!files_->confirm_discard()) return;
    files_->new_campaign();
    editor_->pages()->setCurrentIndex(0);
  });
  action(file, tr("New Campaign from &CSV…"), QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_N),
         [this] {
           if (!files_->confirm_discard()) return;
           files_->new_campaign_from_csv();
         });
  QAction* demo_a = action(file, tr("Open &Demo"), QKeySequence(), [this] {
    if (files_->confirm_discard()) files_->load_demo();
  });
  QAction* open_a =
      action(file, tr("&Open…"), QKeySequence::Open, [this] { files_->open_dialog(); });
  file->addMenu(recent_->menu());
  file->addSeparator();
  QAction* save_a = action(file, tr("&Save"), QKeySequence::Save, [this] { files_->save(); });
  action(file, tr("Save &As…"), QKeySequence::SaveAs, [this] { files_->save_as(); });
  file->addSeparator();
  action(file, tr("&Import Data CSV…"), QKeySequence(Qt::CTRL | Qt::Key_I),
         [this] { files_->import_data(); });
  QAction* export_a = action(file, tr("&Export Plan Files…"), QKeySequence(Qt::CTRL | Qt::Key_R),
                             [this] { files_->export_plan(); });
  hand_off_->add_actions(file);
  file->addSeparator();
  action(file, tr("&Quit"), QKeySequence::Quit, [this] { close(); });

  QAction* undo = document_->undo_stack()->createUndoAction(this, tr("&Undo"));
  undo->setShortcuts(QKeySequence::Undo);
  QAction* redo = document_->undo_stack()->createRedoAction(this, tr("&Redo"));
  redo->setShortcuts(QKeySequence::Redo);  // every binding of the desktop (Ctrl+Y, Ctrl+Shift+Z)
  edit->addAction(undo);
  edit->addAction(redo);
  edit->addSeparator();
  QAction* replan = action(edit, tr("Plan &Again"), QKeySequence::Refresh,
                           [this] { runner_->request(document_->campaign()); });
  action(edit, tr("&Cancel Planning"), QKeySequence(Qt::Key_Escape), [this] { runner_->cancel(); });
  edit->addSeparator();
  action(edit, tr("&Preferences…"), QKeySequence::Preferences,
         [this] { PreferencesDialog(this).exec(); });

  const QStringList names = {tr("&Summary"), tr("S&teps"),    tr("T&imeline"), tr("&Gram Error"),
                             tr("&Margin"),  tr("M&easured"), tr("C&ompare"),  tr("&Cautions")};
  for (int v = 0; v < kViewCount; ++v) {
    QAction* a = view->addAction(names[v]);
    a->setShortcut(QKeySequence(Qt::ALT | static_cast<Qt::Key>(Qt::Key_1 + v)));
    connect(a, &QAction::triggered, this, [this, v] { tabs_->setCurrentIndex(v); });
  }
  view->addSeparator();

  action(help, tr("&User Guide"), QKeySequence(), [this] { show_user_guide(this); });
  action(help, tr("&Cautions"), QKeySequence::HelpContents,
         [this] { tabs_->setCurrentIndex(kCautions); });
  help->addSeparator();
  action(help, tr("&About Gramline"), QKeySequence(), [this] { show_about(this); });
  action(help, tr("About &Qt"), QKeySequence(), [] { QApplication::aboutQt(); });

  for (QAction* a : {new_a, demo_a, open_a, save_a}) bar->addAction(a);
  bar->addSeparator();
  bar->addAction(undo);
  bar->addAction(redo);
  bar->addSeparator();
  bar->addAction(replan);
  bar->addAction(export_a);
}

void MainWindow::build_status_bar() {
  StatusIndicator::Look plan;
  plan.text_name = tr("Planning status");
  plan.progress_name = tr("Planning progress");
  plan.cancel_text = tr("Cancel");
  plan.cancel_name = tr("Cancel planning");
  plan.bar_width = 220;
  plan.stretch = true;
  plan_status_ = new StatusIndicator(plan);
  plan_status_->follow(runner_);
  StatusIndicator::Look margin;
  margin.progress_name = tr("Margin check progress");
  margin.cancel_text = tr("Stop Check");
  margin.cancel_name = tr("Cancel the margin check");
  margin.percent = true;
  margin_status_ = new StatusIndicator(margin);
  margin_status_->follow(margin_runner_);
  statusBar()->addWidget(plan_status_, 1);
  statusBar()->addPermanentWidget(margin_status_);
}

void MainWindow::follow_planning() {
  connect(runner_, &PlanRunner::stale, this, [this] {
    margin_runner_->cancel();
    editor_->clear_scale_scan();
    set_all_stale(true, tr("Recomputing: the figures below belong to the campaign before your "
                           "last edit."));
  });
  connect(runner_, &PlanRunner::started, this, [this] { plan_status_->set_text(tr("Planning…")); });
  connect(runner_, &PlanRunner::succeeded, this, &MainWindow::on_plan_finished);
  connect(runner_, &PlanRunner::failed, this, &MainWindow::on_plan_failed);
  connect(runner_, &PlanRunner::cancelled, this, [this] {
    plan_status_->set_text(tr("Planning cancelled. Edit anything, or press F5, to plan again."));
    set_all_stale(true, tr("Planning was cancelled: the figures below belong to an older "
                           "campaign. Press F5 to plan again."));
  });
}

void MainWindow::follow_margin_check() {
  connect(margin_runner_, &MarginRunner::started, this, [this] {
    margin_status_->set_text(tr("Margin check…"));
    margin_->set_status(
        tr("<b>Margin check running…</b> Simulating the measurement many times "
           "with the planned pairs; progress is shown at the bottom right."));
    summary_->set_margin_verdict(tr("Margin check: running…"), false);
  });
  connect(margin_runner_, &MarginRunner::succeeded, this, &MainWindow::on_margin_finished);
  connect(margin_runner_, &MarginRunner::failed, this, [this](const QString& m) {
    margin_status_->set_text(QString());
    margin_->set_status(tr("<b>Margin check failed:</b> %1").arg(m.toHtmlEscaped()));
    summary_->set_margin_verdict(tr("Margin check failed: %1").arg(m), false);
  });
  connect(margin_runner_, &MarginRunner::cancelled, this, [this] {
    margin_status_->set_text(QString());
    if (!runner_->busy()) {
      margin_->set_status(tr("<b>Margin check cancelled.</b> Press F5 to plan and check again."));
      summary_->set_margin_verdict(tr("Margin check: cancelled."), false);
    }
  });
}

void MainWindow::on_campaign_changed() {
  const Campaign& c = document_->campaign();
  const bool has_data = c.data.train_count() > 0;
  if (has_data) runner_->request(c);  // first: the rest below runs while it plans
  margin_->set_campaign(c);
  if (!has_data) {
    runner_->cancel();
    set_all_stale(true, tr("No data yet: import a CSV (Ctrl+I) or open the demo to plan."));
    withdraw_views(
        tr("This campaign has no points yet, so nothing is planned. The figures of "
           "the previous campaign are not shown."));
    plan_status_->set_text(tr("No data."));
  }
}

void MainWindow::on_plan_finished() {
  const auto plan = runner_->plan();
  const Campaign& c = runner_->planned_campaign();
  summary_->set_plan(plan, c);
  steps_->set_plan(plan, c);
  timeline_->set_plan(plan, c);
  gram_->set_plan(plan, c);
  margin_->set_plan(plan, c);
  compare_->set_plan(plan, c);
  set_all_stale(false, QString());
  withdraw_views(QString());
  margin_runner_->start(c, plan);
  if (!plan->summary.fits) {
    frames_[kSummary]->set_banner(tr("The plan needs more nights than allowed (%1). Allow more "
                                     "nights, loosen ε, or turn on “Scale pairs to fit”.")
                                      .arg(c.nights.max_nights),
                                  true);
  }
  plan_status_->set_text(tr("Planned %1 steps in %2 ms.")
                             .arg(plan->steps.size())
                             .arg(static_cast<long>(plan->summary.plan_ms)));
}

void MainWindow::on_margin_finished() {
  margin_status_->set_text(QString());
  const auto check = margin_runner_->check();
  margin_->set_check(check, margin_runner_->grid());
  compare_->set_check(check);
  if (!check) return;
  QString line = check->verdict.pass ? tr("Margin check: pass") : tr("Margin check: fail");
  line += tr(" (largest flip probability %1 %, median margin ratio %2)")
              .arg(QLocale().toString(100.0 * check->trials.flip_probability_max.value, 'f', 2))
              .arg(QLocale().toString(check->trials.margin_ratio_median.value, 'f', 3));
  if (check->minimum_uniform.found)
    line += tr("; the minimum budget needs %1 of counting")
                .arg(duration_text(check->minimum_uniform.integration_s));
  summary_->set_margin_verdict(line + QLatin1Char('.'), check->verdict.pass);
  editor_->set_scale_scan(check->scale_scan, check->advised_scale);
}

void MainWindow::on_plan_failed(const QString& message) {
  plan_status_->set_text(tr("Cannot plan this campaign."));
  set_all_stale(true, tr("Cannot plan this campaign: %1").arg(message));
  for (ViewFrame* f : frames_) {
    if (f != frames_[kCautions] && f != frames_[kMeasured])
      f->set_banner(tr("Cannot plan this campaign: %1").arg(message), true);
  }
  withdraw_views(
      tr("There is no plan for this campaign, so there is nothing to show here. "
         "Correct the campaign as the message above says; the figures of the "
         "previous campaign are not shown."));
}

void MainWindow::withdraw_views(const QString& reason) {
  for (int v = 0; v < kViewCount; ++v) {
    if (v == kCautions || v == kMeasured) continue;  // neither depends on the plan
    frames_[v]->set_withdrawn(reason);
  }
}

void MainWindow::set_all_stale(bool stale, const QString& message) {
  for (int v = 0; v < kViewCount; ++v) {
    if (v == kCautions || v == kMeasured) continue;  // neither depends on the plan
    frames_[v]->set_stale(stale && runner_->plan() != nullptr);
    frames_[v]->set_banner(message);
  }
}

void MainWindow::update_title() {
  setWindowTitle(tr("%1[*] — Gramline").arg(document_->display_name()));
  setWindowModified(document_->modified());
}

bool MainWindow::cautions_acknowledged() {
  if (!cautions_seen_) cautions_seen_ = acknowledge_cautions(this);
  return cautions_seen_;
}

bool MainWindow::open_file(const QString& path) { return files_->open(path); }

bool MainWindow::save_to(const QString& path) { return files_->save_to(path); }

void MainWindow::load_demo() { files_->load_demo(); }

void MainWindow::offer_recovery(const QString& opening) { autosave_->offer_recovery(opening); }

bool MainWindow::eventFilter(QObject* watched, QEvent* event) {
  if (event->type() == QEvent::ShortcutOverride && editor_) {
    auto* key = static_cast<QKeyEvent*>(event);
    auto* widget = qobject_cast<QWidget*>(watched);
    const bool undo_key = key->matches(QKeySequence::Undo) || key->matches(QKeySequence::Redo);
    if (undo_key && widget && (widget == editor_ || editor_->isAncestorOf(widget))) {
      // Leave the event unclaimed: the window's Undo and Redo actions take the key. Every
      // finished value of a field is already a campaign edit (CampaignDocument::edit).
      event->ignore();
      return true;
    }
  }
  return QMainWindow::eventFilter(watched, event);
}

void MainWindow::closeEvent(QCloseEvent* event) {
  if (!files_->confirm_discard()) {
    event->ignore();
    return;
  }
  runner_->cancel();
  QSettings settings;
  settings.setValue(QStringLiteral("window/geometry"), saveGeometry());
  settings.setValue(QStringLiteral("window/state"), saveState());
  settings.setValue(QStringLiteral("window/view"), tabs_->currentIndex());
  autosave_->remove();
  event->accept();
}

}  // namespace gramline::gui
