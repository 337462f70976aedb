#include "main_window.h"

#include <QAction>
#include <QApplication>
#include <QCloseEvent>
#include <QDialog>
#include <QDialogButtonBox>
#include <QDir>
#include <QDockWidget>
#include <QFileDialog>
#include <QFileInfo>
#include <QKeySequence>
#include <QLabel>
#include <QMenu>
#include <QMenuBar>
#include <QMessageBox>
#include <QProgressBar>
#include <QPushButton>
#include <QSettings>
#include <QStandardPaths>
#include <QStatusBar>
#include <QTabWidget>
#include <QTextBrowser>
#include <QTimer>
#include <QToolBar>
#include <QUndoStack>
#include <QVBoxLayout>

#include "app_icon.h"
#include "campaign_document.h"
#include "cautions.h"
#include "editor_panel.h"
#include "formats/campaign_json.h"
#include "formats/data_csv.h"
#include "formats/plan_files.h"
#include "gram_view.h"
#include "gramline/demo.h"
#include "gui_text.h"
#include "hand_off.h"
#include "help_view.h"
#include "margin_runner.h"
#include "margin_view.h"
#include "measured_view.h"
#include "plan_runner.h"
#include "preferences.h"
#include "steps_view.h"
#include "summary_view.h"
#include "timeline_view.h"
#include "view_frame.h"

namespace gramline::gui {

namespace {
constexpr int kMaxRecent = 8;
const char* kFileFilter =
    QT_TRANSLATE_NOOP("gramline::gui", "Gramline campaign (*.json);;All files (*)");
}  // namespace

MainWindow::MainWindow(QWidget* parent) : QMainWindow(parent) {
  setObjectName(QStringLiteral("gramline_main_window"));
  setWindowIcon(app_icon());
  document_ = new CampaignDocument(this);
  runner_ = new PlanRunner(this);
  margin_runner_ = new MarginRunner(this);

  summary_ = new SummaryView;
  steps_ = new StepsView;
  timeline_ = new TimelineView;
  gram_ = new GramView;
  margin_ = new MarginView;
  measured_ = new MeasuredView;

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
  add_view(kCautions, make_cautions_page(), tr("Cautions"),
           tr("Laser safety and unattended operation"));
  setCentralWidget(tabs_);

  editor_ = new EditorPanel(document_);
  auto* dock = new QDockWidget(tr("Campaign"), this);
  dock->setObjectName(QStringLiteral("campaign_dock"));
  dock->setWidget(editor_);
  dock->setFeatures(QDockWidget::DockWidgetMovable | QDockWidget::DockWidgetFloatable |
                    QDockWidget::DockWidgetClosable);
  addDockWidget(Qt::LeftDockWidgetArea, dock);

  hand_off_ = new HandOff(this, runner_, measured_, [this] { return cautions_acknowledged(); });
  connect(hand_off_, &HandOff::ingested, this, [this] { tabs_->setCurrentIndex(kMeasured); });
  build_actions();
  build_status_bar();
  auto* show_editor = dock->toggleViewAction();
  show_editor->setText(tr("Show &Campaign Editor"));
  show_editor->setShortcut(QKeySequence(Qt::CTRL | Qt::Key_E));
  menuBar()->actions().at(2)->menu()->addAction(show_editor);

  connect(document_, &CampaignDocument::changed, this, &MainWindow::on_campaign_changed);
  connect(document_, &CampaignDocument::state_changed, this, &MainWindow::update_title);
  connect(editor_, &EditorPanel::import_requested, this, &MainWindow::import_data);
  connect(editor_, &EditorPanel::demo_requested, this, [this] {
    if (confirm_discard()) load_demo();
  });
  connect(runner_, &PlanRunner::stale, this, [this] {
    margin_runner_->cancel();
    editor_->clear_scale_scan();
    set_all_stale(true, tr("Recomputing: the figures below belong to the campaign before your "
                           "last edit."));
  });
  connect(runner_, &PlanRunner::started, this, [this] {
    status_->setText(tr("Planning…"));
    progress_->setValue(0);
    progress_->show();
    cancel_->show();
  });
  connect(runner_, &PlanRunner::progress, this,
          [this](double f) { progress_->setValue(static_cast<int>(f * 1000.0)); });
  connect(runner_, &PlanRunner::finished, this, &MainWindow::on_plan_finished);
  connect(runner_, &PlanRunner::failed, this, &MainWindow::on_plan_failed);
  connect(runner_, &PlanRunner::cancelled, this, [this] {
    progress_->hide();
    cancel_->hide();
    status_->setText(tr("Planning cancelled. Edit anything, or press F5, to plan again."));
    set_all_stale(true, tr("Planning was cancelled: the figures below belong to an older "
                           "campaign. Press F5 to plan again."));
  });

  connect(margin_runner_, &MarginRunner::started, this, [this] {
    margin_status_->setText(tr("Margin check…"));
    margin_status_->show();
    margin_progress_->setValue(0);
    margin_progress_->show();
    margin_cancel_->show();
    margin_->set_status(
        tr("<b>Margin check running…</b> Simulating the measurement many times "
           "with the planned pairs; progress is shown at the bottom right."));
    summary_->set_margin_verdict(tr("Margin check: running…"), false);
  });
  connect(margin_runner_, &MarginRunner::progress, this,
          [this](double f) { margin_progress_->setValue(static_cast<int>(f * 1000.0)); });
  connect(margin_runner_, &MarginRunner::finished, this, &MainWindow::on_margin_finished);
  const auto margin_done = [this] {
    margin_status_->hide();
    margin_progress_->hide();
    margin_cancel_->hide();
  };
  connect(margin_runner_, &MarginRunner::failed, this, [this, margin_done](const QString& m) {
    margin_done();
    margin_->set_status(tr("<b>Margin check failed:</b> %1").arg(m.toHtmlEscaped()));
    summary_->set_margin_verdict(tr("Margin check failed: %1").arg(m), false);
  });
  connect(margin_runner_, &MarginRunner::cancelled, this, [this, margin_done] {
    margin_done();
    if (!runner_->busy()) {
      margin_->set_status(tr("<b>Margin check cancelled.</b> Press F5 to plan and check again."));
      summary_->set_margin_verdict(tr("Margin check: cancelled."), false);
    }
  });

  QSettings settings;
  restoreGeometry(settings.value(QStringLiteral("window/geometry")).toByteArray());
  restoreState(settings.value(QStringLiteral("window/state")).toByteArray());
  tabs_->setCurrentIndex(settings.value(QStringLiteral("window/view"), 0).toInt());
  if (!settings.contains(QStringLiteral("window/geometry"))) {
    resize(1400, 860);
    resizeDocks({dock}, {560}, Qt::Horizontal);
  }

  // Autosave: this session's file is locked while we run, so a later start can tell a
  // crashed session's autosave from a running one's.
  const QString dir = QStandardPaths::writableLocation(QStandardPaths::AppDataLocation);
  QDir().mkpath(dir + QStringLiteral("/autosave"));
  session_lock_ = std::make_unique<QLockFile>(autosave_path() + QStringLiteral(".lock"));
  session_lock_->setStaleLockTime(0);
  session_lock_->tryLock(0);
  autosave_timer_ = new QTimer(this);
  autosave_timer_->setInterval(30000);
  connect(autosave_timer_, &QTimer::timeout, this, &MainWindow::write_autosave);
  autosave_timer_->start();

  update_title();
  set_all_stale(false, QString());
}

MainWindow::~MainWindow() {
  remove_autosave();
  if (session_lock_) session_lock_->unlock();
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
    if (confirm_discard()) new_campaign();
  });
  QAction* demo_a = action(file, tr("Open &Demo"), QKeySequence(), [this] {
    if (confirm_discard()) load_demo();
  });
  QAction* open_a = action(file, tr("&Open…"), QKeySequence::Open, [this] { open_dialog(); });
  recent_menu_ = file->addMenu(tr("Open &Recent"));
  rebuild_recent_menu();
  file->addSeparator();
  save_action_ = action(file, tr("&Save"), QKeySequence::Save, [this] { save(); });
  action(file, tr("Save &As…"), QKeySequence::SaveAs, [this] { save_as(); });
  file->addSeparator();
  action(file, tr("&Import Data CSV…"), QKeySequence(Qt::CTRL | Qt::Key_I),
         [this] { import_data(); });
  QAction* export_a = action(file, tr("&Export Plan Files…"), QKeySequence(Qt::CTRL | Qt::Key_R),
                             [this] { export_plan(); });
  hand_off_->add_actions(file);
  file->addSeparator();
  action(file, tr("&Quit"), QKeySequence::Quit, [this] { close(); });

  QAction* undo = document_->undo_stack()->createUndoAction(this, tr("&Undo"));
  undo->setShortcut(QKeySequence::Undo);
  QAction* redo = document_->undo_stack()->createRedoAction(this, tr("&Redo"));
  redo->setShortcut(QKeySequence::Redo);
  edit->addAction(undo);
  edit->addAction(redo);
  edit->addSeparator();
  QAction* replan = action(edit, tr("Plan &Again"), QKeySequence::Refresh,
                           [this] { runner_->request_now(document_->campaign()); });
  action(edit, tr("&Cancel Planning"), QKeySequence(Qt::Key_Escape), [this] { runner_->cancel(); });
  edit->addSeparator();
  action(edit, tr("&Preferences…"), QKeySequence::Preferences,
         [this] { PreferencesDialog(this).exec(); });

  const QStringList names = {tr("&Summary"), tr("S&teps"),    tr("T&imeline"), tr("&Gram Error"),
                             tr("&Margin"),  tr("M&easured"), tr("&Cautions")};
  for (int v = 0; v < kViewCount; ++v) {
    QAction* a = view->addAction(names[v]);
    a->setShortcut(QKeySequence(Qt::ALT | static_cast<Qt::Key>(Qt::Key_1 + v)));
    connect(a, &QAction::triggered, this, [this, v] { tabs_->setCurrentIndex(v); });
  }
  view->addSeparator();

  action(help, tr("&User Guide"), QKeySequence(), [this] { show_user_guide(this); });
  action(help, tr("&Cautions"), QKeySequence::HelpContents, [this] { show_cautions(); });
  help->addSeparator();
  action(help, tr("&About Gramline"), QKeySequence(), [this] { show_about(this); });
  action(help, tr("About &Qt"), QKeySequence(), [] { QApplication::aboutQt(); });

  for (QAction* a : {new_a, demo_a, open_a, save_action_}) bar->addAction(a);
  bar->addSeparator();
  bar->addAction(undo);
  bar->addAction(redo);
  bar->addSeparator();
  bar->addAction(replan);
  bar->addAction(export_a);
}

void MainWindow::build_status_bar() {
  status_ = new QLabel;
  status_->setAccessibleName(tr("Planning status"));
  progress_ = new QProgressBar;
  progress_->setRange(0, 1000);
  progress_->setMaximumWidth(220);
  progress_->setTextVisible(false);
  progress_->setAccessibleName(tr("Planning progress"));
  progress_->hide();
  cancel_ = new QPushButton(tr("Cancel"));
  cancel_->setAccessibleName(tr("Cancel planning"));
  cancel_->hide();
  connect(cancel_, &QPushButton::clicked, runner_, &PlanRunner::cancel);
  margin_status_ = new QLabel;
  margin_status_->hide();
  margin_progress_ = new QProgressBar;
  margin_progress_->setRange(0, 1000);
  margin_progress_->setMaximumWidth(180);
  margin_progress_->setAccessibleName(tr("Margin check progress"));
  margin_progress_->hide();
  margin_cancel_ = new QPushButton(tr("Stop Check"));
  margin_cancel_->setAccessibleName(tr("Cancel the margin check"));
  margin_cancel_->hide();
  connect(margin_cancel_, &QPushButton::clicked, margin_runner_, &MarginRunner::cancel);
  statusBar()->addWidget(status_, 1);
  statusBar()->addPermanentWidget(progress_);
  statusBar()->addPermanentWidget(cancel_);
  statusBar()->addPermanentWidget(margin_status_);
  statusBar()->addPermanentWidget(margin_progress_);
  statusBar()->addPermanentWidget(margin_cancel_);
}

void MainWindow::on_campaign_changed() {
  const Campaign& c = document_->campaign();
  margin_->set_campaign(c);
  if (c.data.train_count() == 0) {
    runner_->cancel();
    set_all_stale(true, tr("No data yet: import a CSV (Ctrl+I) or open the demo to plan."));
    status_->setText(tr("No data."));
    return;
  }
  runner_->request(c);
}

void MainWindow::on_plan_finished(std::shared_ptr<const Plan> plan) {
  progress_->hide();
  cancel_->hide();
  const Campaign& c = runner_->planned_campaign();
  summary_->set_plan(plan, c);
  steps_->set_plan(plan, c);
  timeline_->set_plan(plan, c);
  gram_->set_plan(plan, c);
  margin_->set_plan(plan, c);
  set_all_stale(false, QString());
  margin_runner_->start(c, plan);
  if (!plan->summary.fits) {
    frames_[kSummary]->set_banner(tr("The plan needs more nights than allowed (%1). Allow more "
                                     "nights, loosen ε, or turn on “Scale pairs to fit”.")
                                      .arg(c.nights.max_nights),
                                  true);
  }
  status_->setText(tr("Planned %1 steps in %2 ms.")
                       .arg(plan->steps.size())
                       .arg(static_cast<long>(plan->summary.plan_ms)));
}

void MainWindow::on_margin_finished() {
  margin_status_->hide();
  margin_progress_->hide();
  margin_cancel_->hide();
  const auto check = margin_runner_->check();
  margin_->set_check(check, margin_runner_->grid());
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
  progress_->hide();
  cancel_->hide();
  status_->setText(tr("Cannot plan this campaign."));
  set_all_stale(true, tr("Cannot plan this campaign: %1").arg(message));
  for (ViewFrame* f : frames_) {
    if (f != frames_[kCautions] && f != frames_[kMeasured])
      f->set_banner(tr("Cannot plan this campaign: %1").arg(message), true);
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

bool MainWindow::confirm_discard() {
  if (!document_->modified()) return true;
  const auto answer = QMessageBox::question(
      this, tr("Unsaved changes"),
      tr("“%1” has changes that are not saved. Save them first?").arg(document_->display_name()),
      QMessageBox::Save | QMessageBox::Discard | QMessageBox::Cancel, QMessageBox::Save);
  if (answer == QMessageBox::Save) return save();
  return answer == QMessageBox::Discard;
}

void MainWindow::new_campaign() {
  // A new campaign keeps a usable two-photon rig and the usual settings; only data is missing.
  Campaign c = make_demo_campaign();
  c.name = tr("untitled").toStdString();
  c.notes.clear();
  c.data = DataSet{};
  document_->replace(c, QString(), false);
  editor_->pages()->setCurrentIndex(0);
}

void MainWindow::load_demo() { document_->replace(make_demo_campaign(), QString(), false); }

bool MainWindow::open_file(const QString& path) {
  try {
    const Campaign c = formats::load_campaign(path);
    document_->replace(c, QFileInfo(path).absoluteFilePath(), false);
    add_recent(QFileInfo(path).absoluteFilePath());
    return true;
  } catch (const std::exception& e) {
    QMessageBox::warning(this, tr("Cannot open campaign"), QString::fromStdString(e.what()));
    return false;
  }
}

void MainWindow::open_dialog() {
  if (!confirm_discard()) return;
  const QString path = QFileDialog::getOpenFileName(
      this, tr("Open Campaign"), QSettings().value(QStringLiteral("files/last_dir")).toString(),
      tr(kFileFilter));
  if (path.isEmpty()) return;
  QSettings().setValue(QStringLiteral("files/last_dir"), QFileInfo(path).absolutePath());
  open_file(path);
}

bool MainWindow::save_to(const QString& path) {
  try {
    formats::save_campaign(document_->campaign(), path);
    document_->mark_saved(QFileInfo(path).absoluteFilePath());
    add_recent(QFileInfo(path).absoluteFilePath());
    remove_autosave();
    statusBar()->showMessage(tr("Saved %1").arg(QDir::toNativeSeparators(path)), 4000);
    return true;
  } catch (const std::exception& e) {
    QMessageBox::warning(this, tr("Cannot save campaign"), QString::fromStdString(e.what()));
    return false;
  }
}

bool MainWindow::save() {
  if (document_->path().isEmpty()) return save_as();
  return save_to(document_->path());
}

bool MainWindow::save_as() {
  QString start = document_->path();
  if (start.isEmpty()) {
    start = QSettings().value(QStringLiteral("files/last_dir")).toString() + QLatin1Char('/') +
            QString::fromStdString(document_->campaign().name) + QStringLiteral(".json");
  }
  QString path = QFileDialog::getSaveFileName(this, tr("Save Campaign"), start, tr(kFileFilter));
  if (path.isEmpty()) return false;
  if (QFileInfo(path).suffix().isEmpty()) path += QStringLiteral(".json");
  QSettings().setValue(QStringLiteral("files/last_dir"), QFileInfo(path).absolutePath());
  return save_to(path);
}

void MainWindow::import_data() {
  const QString path = QFileDialog::getOpenFileName(
      this, tr("Import Data"), QSettings().value(QStringLiteral("files/last_dir")).toString(),
      tr("CSV files (*.csv);;All files (*)"));
  if (path.isEmpty()) return;
  try {
    const DataSet data = formats::read_data_csv(path);
    const int features = data.feature_count();
    const bool encoding_fits = document_->campaign().encoding.check(features).empty();
    document_->edit(tr("Import data"), [data, encoding_fits](Campaign& c) {
      c.data = data;
      if (!encoding_fits) {
        // The old map reads another number of features: start from the first preset.
        Eigen::VectorXd low, high;
        feature_ranges(c.data.train, low, high);
        c.encoding =
            make_preset(c.data.feature_count() == 2 ? EncodingPreset::one_feature_per_photon_linear
                                                    : EncodingPreset::one_feature_per_photon_linear,
                        low, high);
      }
    });
    if (!encoding_fits) {
      statusBar()->showMessage(
          tr("The encoding was rebuilt for %1 features (one feature per photon).").arg(features),
          8000);
    }
  } catch (const std::exception& e) {
    QMessageBox::warning(this, tr("Cannot import data"), QString::fromStdString(e.what()));
  }
}

bool MainWindow::cautions_acknowledged() {
  if (cautions_seen_) return true;
  QDialog dialog(this);
  dialog.setWindowTitle(tr("Before the first export"));
  auto* layout = new QVBoxLayout(&dialog);
  auto* text = new QTextBrowser;
  text->setHtml(cautions_html());
  layout->addWidget(text);
  auto* buttons = new QDialogButtonBox;
  buttons->addButton(tr("I have read this"), QDialogButtonBox::AcceptRole);
  buttons->addButton(QDialogButtonBox::Cancel);
  connect(buttons, &QDialogButtonBox::accepted, &dialog, &QDialog::accept);
  connect(buttons, &QDialogButtonBox::rejected, &dialog, &QDialog::reject);
  layout->addWidget(buttons);
  dialog.resize(640, 560);
  if (dialog.exec() != QDialog::Accepted) return false;
  cautions_seen_ = true;
  return true;
}

void MainWindow::export_plan() {
  const auto plan = runner_->plan();
  if (!plan || runner_->busy()) {
    QMessageBox::information(this, tr("No current plan"),
                             tr("Wait until the plan is up to date, then export it."));
    return;
  }
  if (!cautions_acknowledged()) return;
  const QString dir = QFileDialog::getExistingDirectory(
      this, tr("Export Plan Files To"),
      QSettings().value(QStringLiteral("files/last_dir")).toString());
  if (dir.isEmpty()) return;
  try {
    formats::write_plan_files(runner_->planned_campaign(), *plan, dir);
    statusBar()->showMessage(tr("Wrote steps.json, steps.csv, summary.json and kernel.csv to %1")
                                 .arg(QDir::toNativeSeparators(dir)),
                             6000);
  } catch (const std::exception& e) {
    QMessageBox::warning(this, tr("Cannot export"), QString::fromStdString(e.what()));
  }
}

void MainWindow::show_cautions() { tabs_->setCurrentIndex(kCautions); }

void MainWindow::add_recent(const QString& path) {
  QSettings settings;
  QStringList list = settings.value(QStringLiteral("files/recent")).toStringList();
  list.removeAll(path);
  list.prepend(path);
  while (list.size() > kMaxRecent) list.removeLast();
  settings.setValue(QStringLiteral("files/recent"), list);
  rebuild_recent_menu();
}

void MainWindow::rebuild_recent_menu() {
  recent_menu_->clear();
  const QStringList list = QSettings().value(QStringLiteral("files/recent")).toStringList();
  int n = 0;
  for (const QString& path : list) {
    QAction* a = recent_menu_->addAction(tr("&%1 %2").arg(++n).arg(QDir::toNativeSeparators(path)));
    connect(a, &QAction::triggered, this, [this, path] {
      if (confirm_discard()) open_file(path);
    });
  }
  recent_menu_->setEnabled(!list.isEmpty());
  if (!list.isEmpty()) {
    recent_menu_->addSeparator();
    connect(recent_menu_->addAction(tr("Clear List")), &QAction::triggered, this, [this] {
      QSettings().remove(QStringLiteral("files/recent"));
      rebuild_recent_menu();
    });
  }
}

QString MainWindow::autosave_path() const {
  return QStandardPaths::writableLocation(QStandardPaths::AppDataLocation) +
         QStringLiteral("/autosave/session-%1.json").arg(QApplication::applicationPid());
}

void MainWindow::write_autosave() {
  if (!document_->modified()) return;
  try {
    formats::save_campaign(document_->campaign(), autosave_path());
    QSettings(autosave_path() + QStringLiteral(".ini"), QSettings::IniFormat)
        .setValue(QStringLiteral("original"), document_->path());
  } catch (const std::exception&) {
    // An autosave that cannot be written must never interrupt the user's work.
  }
}

void MainWindow::remove_autosave() {
  QFile::remove(autosave_path());
  QFile::remove(autosave_path() + QStringLiteral(".ini"));
}

void MainWindow::offer_recovery() {
  const QString dir = QStandardPaths::writableLocation(QStandardPaths::AppDataLocation) +
                      QStringLiteral("/autosave");
  const QStringList files =
      QDir(dir).entryList({QStringLiteral("session-*.json")}, QDir::Files, QDir::Time);
  for (const QString& name : files) {
    const QString path = dir + QLatin1Char('/') + name;
    if (path == autosave_path()) continue;
    QLockFile lock(path + QStringLiteral(".lock"));
    lock.setStaleLockTime(0);        // stale only when its process is gone
    if (!lock.tryLock(0)) continue;  // that session is still running
    const QString original =
        QSettings(path + QStringLiteral(".ini"), QSettings::IniFormat).value("original").toString();
    const auto answer = QMessageBox::question(
        this, tr("Recover unsaved work?"),
        tr("Gramline found unsaved changes from a session that did not close properly (%1, "
           "saved %2). Recover them?")
            .arg(original.isEmpty() ? tr("untitled campaign") : QFileInfo(original).fileName())
            .arg(QLocale().toString(QFileInfo(path).lastModified(), QLocale::ShortFormat)),
        QMessageBox::Yes | QMessageBox::No, QMessageBox::Yes);
    if (answer == QMessageBox::Yes) {
      try {
        document_->replace(formats::load_campaign(path), original, true);
      } catch (const std::exception& e) {
        QMessageBox::warning(this, tr("Cannot recover"), QString::fromStdString(e.what()));
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

void MainWindow::closeEvent(QCloseEvent* event) {
  if (!confirm_discard()) {
    event->ignore();
    return;
  }
  runner_->cancel();
  QSettings settings;
  settings.setValue(QStringLiteral("window/geometry"), saveGeometry());
  settings.setValue(QStringLiteral("window/state"), saveState());
  settings.setValue(QStringLiteral("window/view"), tabs_->currentIndex());
  remove_autosave();
  event->accept();
}

}  // namespace gramline::gui

namespace gramline::gui {

void MainWindow::take_screenshots(const QString& dir, const std::function<void(bool ok)>& done) {
  const auto shoot = [this, dir, done] {
    QDir().mkpath(dir);
    bool ok = true;
    const QStringList names = {QStringLiteral("summary"),  QStringLiteral("steps"),
                               QStringLiteral("timeline"), QStringLiteral("gram-error"),
                               QStringLiteral("margin"),   QStringLiteral("measured"),
                               QStringLiteral("cautions")};
    const auto save = [&](const QString& name) {
      QApplication::processEvents();
      ok = grab().save(dir + QLatin1Char('/') + name + QStringLiteral(".png")) && ok;
    };
    for (int v = 0; v < kViewCount; ++v) {
      tabs_->setCurrentIndex(v);
      save(QStringLiteral("%1-view-%2").arg(v + 1, 2, 10, QLatin1Char('0')).arg(names[v]));
    }
    const QStringList pages = {QStringLiteral("data"), QStringLiteral("encoding"),
                               QStringLiteral("rig"), QStringLiteral("precision"),
                               QStringLiteral("nights")};
    tabs_->setCurrentIndex(kSummary);
    for (int p = 0; p < editor_->pages()->count() && p < pages.size(); ++p) {
      editor_->pages()->setCurrentIndex(p);
      save(QStringLiteral("%1-editor-%2").arg(p + 11, 2, 10, QLatin1Char('0')).arg(pages[p]));
    }
    editor_->pages()->setCurrentIndex(0);
    done(ok);
  };
  // The Measured view shows the counts named by the screenshot script (empty page without).
  const QString bundle = qEnvironmentVariable("GRAMLINE_SCREENSHOT_BUNDLE");
  const QString counts = qEnvironmentVariable("GRAMLINE_SCREENSHOT_COUNTS");
  if (!bundle.isEmpty() && !counts.isEmpty()) hand_off_->ingest_files(bundle, counts);
  // Wait until the plan and its margin check are done, polling so a failed plan also ends.
  auto* poll = new QTimer(this);
  poll->setInterval(200);
  connect(poll, &QTimer::timeout, this, [this, poll, shoot] {
    if (runner_->busy() || margin_runner_->busy() || hand_off_->busy()) return;
    poll->stop();
    poll->deleteLater();
    shoot();
  });
  poll->start();
}

}  // namespace gramline::gui
