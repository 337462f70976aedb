#include "hand_off.h"

#include <QAction>
#include <QApplication>
#include <QCheckBox>
#include <QDateEdit>
#include <QDialog>
#include <QDialogButtonBox>
#include <QDir>
#include <QFileDialog>
#include <QFileInfo>
#include <QFontDatabase>
#include <QFormLayout>
#include <QLabel>
#include <QMainWindow>
#include <QMenu>
#include <QMessageBox>
#include <QPlainTextEdit>
#include <QPushButton>
#include <QRegularExpression>
#include <QSettings>
#include <QStatusBar>
#include <QVBoxLayout>
#include <exception>
#include <stdexcept>

#include "formats/simulate_run.h"
#include "gui_text.h"
#include "measured_view.h"
#include "plan_runner.h"
#include "status_indicator.h"

namespace gramline::gui {

namespace {

const char* kBundleFilter =
    QT_TRANSLATE_NOOP("gramline::gui", "Gramline bundle (*.zip);;All files (*)");
const char* kCountsFilter =
    QT_TRANSLATE_NOOP("gramline::gui", "Counts file (*.csv);;All files (*)");

// The filters marked above share the context of gui_text.cpp.
QString gui_tr(const char* text) { return QCoreApplication::translate("gramline::gui", text); }

QString message_of(const std::exception& e) { return QString::fromStdString(e.what()); }

}  // namespace

formats::IngestRun load_and_ingest(const QString& bundle_path, const QString& counts_path) {
  try {
    const formats::Bundle bundle = formats::read_bundle(bundle_path);
    const formats::CountsFile counts =
        formats::read_counts_csv(counts_path, formats::counts_layout(bundle.campaign));
    return formats::ingest_counts(bundle, counts);
  } catch (const std::exception&) {
    throw;
  } catch (...) {
    throw std::runtime_error(
        QCoreApplication::translate("gramline::gui", "%1: unexpected error while ingesting")
            .arg(counts_path)
            .toStdString());
  }
}

ResumeOutcome load_and_resume(const QString& bundle_path, const QString& counts_path,
                              const QString& first_night) {
  try {
    ResumeOutcome out;
    out.bundle_path = bundle_path;
    auto bundle = std::make_shared<const formats::Bundle>(formats::read_bundle(bundle_path));
    const formats::CountsFile counts =
        formats::read_counts_csv(counts_path, formats::counts_layout(bundle->campaign));
    formats::ResumeOptions options;
    options.first_night = first_night.toStdString();
    out.run = std::make_shared<const formats::ResumeRun>(
        formats::plan_resume(*bundle, counts, {}, options));
    out.bundle = std::move(bundle);
    return out;
  } catch (const std::exception&) {
    throw;
  } catch (...) {
    throw std::runtime_error(
        QCoreApplication::translate("gramline::gui", "%1: unexpected error while planning the rest")
            .arg(counts_path)
            .toStdString());
  }
}

QString file_stem(const QString& name) {
  QString stem = name.trimmed();
  stem.replace(QRegularExpression(QStringLiteral("[^\\w.-]+")), QStringLiteral("-"));
  stem.remove(QRegularExpression(QStringLiteral("^[-.]+|[-.]+$")));
  return stem.isEmpty() ? QStringLiteral("campaign") : stem;
}

HandOff::HandOff(QMainWindow* window, PlanRunner* planner, MeasuredView* view,
                 std::function<bool()> cautions_acknowledged)
    : QObject(window),
      window_(window),
      planner_(planner),
      view_(view),
      cautions_acknowledged_(std::move(cautions_acknowledged)) {
  StatusIndicator::Look look;
  look.text_name = tr("Hand-off status");
  look.progress_name = tr("Working on the counts");
  look.bar_width = 140;
  look.measured = false;  // the formats calls report no progress: a busy indicator
  status_ = new StatusIndicator(look);
  window_->statusBar()->addPermanentWidget(status_);
  ingest_ = new JobRunner<std::shared_ptr<const formats::IngestRun>>(0, this);
  resume_ = new JobRunner<ResumeOutcome>(0, this);
  status_->follow(ingest_);
  status_->follow(resume_);
  connect(ingest_, &JobRunnerBase::succeeded, this, &HandOff::show_ingested);
  connect(resume_, &JobRunnerBase::succeeded, this, [this] {
    clear_busy();
    last_error_.clear();
    resumed_ = *resume_->result();
    emit resumed();
    show_resume_dialog();
  });
  connect(ingest_, &JobRunnerBase::failed, this, [this](const QString& message) {
    clear_busy();
    show_error(tr("Cannot ingest the counts"),
               tr("Nothing was ingested; your campaign and the Measured view are "
                  "unchanged.\n\n%1")
                   .arg(message));
  });
  connect(resume_, &JobRunnerBase::failed, this, [this](const QString& message) {
    clear_busy();
    show_error(tr("Cannot resume"),
               tr("Nothing was planned; your campaign is unchanged.\n\n%1").arg(message));
  });
  connect(view_, &MeasuredView::ingest_requested, this, &HandOff::ingest);
}

void HandOff::add_actions(QMenu* menu) {
  QAction* bundle = menu->addAction(tr("Export &Bundle…"));
  bundle->setShortcut(QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_E));
  bundle->setStatusTip(
      tr("Write one zip file for the rig: steps, campaign, data, checksums "
         "and a printable summary"));
  connect(bundle, &QAction::triggered, this, [this] { export_bundle(); });
  menu->addSeparator();
  QAction* ingest_a = menu->addAction(tr("Ingest &Counts…"));
  ingest_a->setShortcut(QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_I));
  ingest_a->setStatusTip(tr("Compare the counts a rig wrote for a bundle with the prediction"));
  connect(ingest_a, &QAction::triggered, this, [this] { ingest(); });
  QAction* resume_a = menu->addAction(tr("Res&ume from Counts…"));
  resume_a->setStatusTip(tr("Plan the steps a partial night did not count, as a new bundle"));
  connect(resume_a, &QAction::triggered, this, [this] { resume(); });
  QAction* rehearse_a = menu->addAction(tr("Rehearse with a Simulated &Rig…"));
  rehearse_a->setStatusTip(
      tr("Play a bundle against the rig model, save the counts it would record (marked as "
         "simulated) and ingest them, to try the hand-off before booking the laser"));
  connect(rehearse_a, &QAction::triggered, this, [this] { rehearse(); });
  actions_ = {bundle, ingest_a, resume_a, rehearse_a};
}

QString HandOff::export_dir() const {
  const QString campaign = campaign_path_ ? campaign_path_() : QString();
  if (!campaign.isEmpty()) return QFileInfo(campaign).absolutePath();
  const QString last = last_dir();
  return last.isEmpty() ? QDir::homePath() : last;
}

QString HandOff::last_dir() const {
  return QSettings().value(QStringLiteral("files/last_dir")).toString();
}

void HandOff::remember_dir(const QString& path) const {
  QSettings().setValue(QStringLiteral("files/last_dir"), QFileInfo(path).absolutePath());
}

void HandOff::show_error(const QString& title, const QString& message) {
  last_error_ = message;
  emit failed(message);
  // Not exec(): the window keeps running (and tests can read and close the box).
  auto* box = new QMessageBox(QMessageBox::Warning, title, message, QMessageBox::Ok, window_);
  box->setAttribute(Qt::WA_DeleteOnClose);
  box->setObjectName(QStringLiteral("hand_off_error"));
  box->open();
}

void HandOff::set_busy(const QString& what) {
  status_->set_text(what);
  for (QAction* a : actions_) a->setEnabled(false);
}

void HandOff::clear_busy() {
  status_->set_text(QString());
  for (QAction* a : actions_) a->setEnabled(true);
}

void HandOff::export_bundle() {
  if (!planner_->plan() || planner_->busy()) {
    QMessageBox::information(window_, tr("No current plan"),
                             tr("Wait until the plan is up to date, then export it."));
    return;
  }
  if (!cautions_acknowledged_()) return;
  const QString start = export_dir() + QLatin1Char('/') +
                        file_stem(QString::fromStdString(planner_->planned_campaign().name)) +
                        QStringLiteral(".zip");
  // The dialog asks before replacing an existing file.
  QString path =
      QFileDialog::getSaveFileName(window_, tr("Export Bundle"), start, gui_tr(kBundleFilter));
  if (path.isEmpty()) return;
  if (QFileInfo(path).suffix().isEmpty()) path += QStringLiteral(".zip");
  remember_dir(path);
  export_bundle_to(path);
}

bool HandOff::export_bundle_to(const QString& path) {
  const auto plan = planner_->plan();
  if (!plan || planner_->busy()) {
    show_error(tr("Cannot export the bundle"),
               tr("%1: the plan is not up to date yet; nothing was written.")
                   .arg(QDir::toNativeSeparators(path)));
    return false;
  }
  QApplication::setOverrideCursor(Qt::WaitCursor);
  try {
    formats::BundleWriteOptions options;
    options.overwrite = formats::Overwrite::allow;  // the user agreed in the file dialog
    const formats::BundleWritten written =
        formats::write_bundle(planner_->planned_campaign(), *plan, path, options);
    QApplication::restoreOverrideCursor();
    last_error_.clear();
    window_->statusBar()->showMessage(
        tr("Wrote the bundle %1 (%2 files, manifest SHA-256 %3…)")
            .arg(QDir::toNativeSeparators(path))
            .arg(written.entries.size())
            .arg(QString::fromStdString(written.manifest_sha256.substr(0, 12))),
        8000);
    return true;
  } catch (const std::exception& e) {
    QApplication::restoreOverrideCursor();
    show_error(tr("Cannot export the bundle"),
               tr("The bundle %1 was not written.\n\n%2")
                   .arg(QDir::toNativeSeparators(path), message_of(e)));
    return false;
  }
}

bool HandOff::choose_bundle_and_counts(const QString& bundle_title, const QString& counts_title,
                                       QString& bundle, QString& counts) {
  bundle = QFileDialog::getOpenFileName(window_, bundle_title, last_dir(), gui_tr(kBundleFilter));
  if (bundle.isEmpty()) return false;
  remember_dir(bundle);
  counts = QFileDialog::getOpenFileName(window_, counts_title.arg(QFileInfo(bundle).fileName()),
                                        QFileInfo(bundle).absolutePath(), gui_tr(kCountsFilter));
  return !counts.isEmpty();
}

void HandOff::ingest() {
  QString bundle, counts;
  if (!busy() &&
      choose_bundle_and_counts(tr("Ingest Counts: Choose the Bundle the Rig Ran"),
                               tr("Ingest Counts: Choose the Counts File for %1"), bundle, counts))
    ingest_files(bundle, counts);
}

void HandOff::ingest_files(const QString& bundle_path, const QString& counts_path) {
  if (busy()) return;
  set_busy(tr("Ingesting %1…").arg(QFileInfo(counts_path).fileName()));
  ingest_->run([bundle_path, counts_path](const WorkHooks&) {
    return std::make_shared<const formats::IngestRun>(load_and_ingest(bundle_path, counts_path));
  });
}

void HandOff::show_ingested() {
  clear_busy();
  const auto run = *ingest_->result();
  last_error_.clear();
  view_->set_run(run);
  window_->statusBar()->showMessage(
      tr("Ingested %1: %2 of %3 entries measured.")
          .arg(QFileInfo(QString::fromStdString(run->counts_source)).fileName())
          .arg(count_text(run->result.measured_entries), count_text(run->result.expected_entries)),
      8000);
  emit ingested();
}

void HandOff::resume() {
  QString bundle, counts;
  if (!busy() && choose_bundle_and_counts(tr("Resume: Choose the Bundle the Rig Ran"),
                                          tr("Resume: Choose the Partial Counts File for %1"),
                                          bundle, counts)) {
    QString first_night;
    if (ask_first_night(first_night)) resume_files(bundle, counts, first_night);
  }
}

void HandOff::rehearse() {
  if (busy()) return;
  const QString bundle = QFileDialog::getOpenFileName(
      window_, tr("Rehearse: Choose the Bundle to Play"), last_dir(), gui_tr(kBundleFilter));
  if (bundle.isEmpty()) return;
  remember_dir(bundle);
  const QFileInfo info(bundle);
  const QString counts = QFileDialog::getSaveFileName(
      window_, tr("Rehearse: Save the Simulated Counts"),
      info.absoluteDir().filePath(info.completeBaseName() + tr("-simulated") + ".csv"),
      gui_tr(kCountsFilter));
  if (!counts.isEmpty()) rehearse_files(bundle, counts);
}

bool HandOff::rehearse_files(const QString& bundle_path, const QString& counts_path) {
  if (busy()) return false;
  try {
    const formats::Bundle bundle = formats::read_bundle(bundle_path);
    CountSimulationOptions options;
    options.seed = bundle.manifest.seed;
    const formats::SimulatedNight night = formats::simulate_night(bundle, options);
    // The save dialog already asked before replacing an existing file.
    formats::write_simulated_counts(night, counts_path, formats::Overwrite::allow);
  } catch (const std::exception& e) {
    show_error(tr("Cannot rehearse"), tr("No counts file was written.\n\n%1").arg(message_of(e)));
    return false;
  }
  ingest_files(bundle_path, counts_path);
  return true;
}

bool HandOff::ask_first_night(QString& first_night) {
  QDialog dialog(window_);
  dialog.setObjectName(QStringLiteral("first_night_dialog"));
  dialog.setWindowTitle(tr("Resume: First Night of the Rest"));
  auto* layout = new QVBoxLayout(&dialog);
  auto* text =
      new QLabel(tr("When can the rig measure again? The rest is laid on the nights "
                    "from that date, leaving out the campaign's nights to skip."));
  text->setWordWrap(true);
  layout->addWidget(text);
  auto* form = new QFormLayout;
  auto* after = new QCheckBox(tr("The day after the last night counted"));
  after->setChecked(true);
  auto* date = new QDateEdit(QDate::currentDate());
  date->setCalendarPopup(true);
  date->setDisplayFormat(QStringLiteral("yyyy-MM-dd"));
  date->setAccessibleName(tr("First night of the rest"));
  date->setEnabled(false);
  connect(after, &QCheckBox::toggled, date, [date](bool on) { date->setEnabled(!on); });
  form->addRow(after);
  form->addRow(tr("First night"), date);
  layout->addLayout(form);
  auto* buttons = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel);
  connect(buttons, &QDialogButtonBox::accepted, &dialog, &QDialog::accept);
  connect(buttons, &QDialogButtonBox::rejected, &dialog, &QDialog::reject);
  layout->addWidget(buttons);
  if (dialog.exec() != QDialog::Accepted) return false;
  first_night = after->isChecked() ? QString() : date->date().toString(Qt::ISODate);
  return true;
}

void HandOff::resume_files(const QString& bundle_path, const QString& counts_path,
                           const QString& first_night) {
  if (busy()) return;
  set_busy(tr("Planning the rest after %1…").arg(QFileInfo(counts_path).fileName()));
  resume_->run([bundle_path, counts_path, first_night](const WorkHooks&) {
    return load_and_resume(bundle_path, counts_path, first_night);
  });
}

void HandOff::show_resume_dialog() {
  const formats::ResumeRun& run = *resumed_.run;
  const PlanSummary& s = run.plan.summary;
  auto* dialog = new QDialog(window_);
  dialog->setObjectName(QStringLiteral("resume_dialog"));
  dialog->setAttribute(Qt::WA_DeleteOnClose);
  dialog->setWindowTitle(tr("Resume from Counts"));
  auto* layout = new QVBoxLayout(dialog);
  auto* head = new QLabel(tr("<b>%1 entries are measured; %2 remain.</b> The remaining entries "
                             "are planned from where the motors stopped. Save the new bundle "
                             "and run it on the rig; it names %3 as its parent and carries the "
                             "counts measured so far.")
                              .arg(count_text(run.measured_entries))
                              .arg(count_text(run.remaining_entries))
                              .arg(QFileInfo(resumed_.bundle_path).fileName()));
  head->setWordWrap(true);
  layout->addWidget(head);
  auto* form = new QFormLayout;
  const auto add = [form](const QString& label, const QString& value) {
    auto* v = new QLabel(value);
    v->setTextInteractionFlags(Qt::TextSelectableByMouse);
    v->setAccessibleName(label);
    form->addRow(label, v);
  };
  add(tr("Steps to run"), count_text(static_cast<double>(s.steps)));
  add(tr("Nights"), tr("%1 of %2 allowed").arg(s.nights).arg(run.campaign.nights.max_nights));
  add(tr("Total time"), duration_text(s.total_s));
  add(tr("Counting time"), duration_text(s.integration_s));
  add(tr("Moving time"), duration_text(s.move_s));
  add(tr("Gram error of the new plan (Frobenius σ)"), number_text(s.gram_sigma_frobenius, 4));
  layout->addLayout(form);
  layout->addWidget(new QLabel(tr("The same report as the command line prints:")));
  auto* report = new QPlainTextEdit(QString::fromStdString(run.report()));
  report->setReadOnly(true);
  report->setAccessibleName(tr("Resume report"));
  report->setFont(QFontDatabase::systemFont(QFontDatabase::FixedFont));
  layout->addWidget(report, 1);
  auto* buttons = new QDialogButtonBox;
  QPushButton* save = buttons->addButton(tr("Save New Bundle…"), QDialogButtonBox::AcceptRole);
  save->setAccessibleName(tr("Save the new bundle"));
  buttons->addButton(QDialogButtonBox::Close);
  connect(buttons, &QDialogButtonBox::rejected, dialog, &QDialog::reject);
  connect(buttons, &QDialogButtonBox::accepted, dialog, [this, dialog] {
    if (!cautions_acknowledged_()) return;
    const QFileInfo parent(resumed_.bundle_path);
    QString path = QFileDialog::getSaveFileName(dialog, tr("Save the Resumed Bundle"),
                                                parent.absolutePath() + QLatin1Char('/') +
                                                    parent.completeBaseName() + tr("-resumed") +
                                                    QStringLiteral(".zip"),
                                                gui_tr(kBundleFilter));
    if (path.isEmpty()) return;
    if (QFileInfo(path).suffix().isEmpty()) path += QStringLiteral(".zip");
    if (save_resumed_to(path)) dialog->accept();
  });
  layout->addWidget(buttons);
  dialog->resize(620, 480);
  dialog->open();
}

bool HandOff::save_resumed_to(const QString& path) {
  if (!resumed_.run || !resumed_.bundle) return false;
  QApplication::setOverrideCursor(Qt::WaitCursor);
  try {
    const formats::BundleWritten written = formats::write_resumed_bundle(
        *resumed_.run, *resumed_.bundle, resumed_.bundle_path, path, formats::Overwrite::allow);
    QApplication::restoreOverrideCursor();
    last_error_.clear();
    window_->statusBar()->showMessage(tr("Wrote the resumed bundle %1 (%2 files)")
                                          .arg(QDir::toNativeSeparators(path))
                                          .arg(written.entries.size()),
                                      8000);
    return true;
  } catch (const std::exception& e) {
    QApplication::restoreOverrideCursor();
    show_error(tr("Cannot save the resumed bundle"),
               tr("The bundle %1 was not written.\n\n%2")
                   .arg(QDir::toNativeSeparators(path), message_of(e)));
    return false;
  }
}

}  // namespace gramline::gui
