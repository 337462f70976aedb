#include "campaign_files.h"

#include <QCoreApplication>
#include <QDir>
#include <QFileDialog>
#include <QFileInfo>
#include <QMainWindow>
#include <QMessageBox>
#include <QSettings>
#include <QStatusBar>
#include <exception>

#include "campaign_document.h"
#include "formats/campaign_json.h"
#include "formats/data_csv.h"
#include "formats/plan_files.h"
#include "gramline/demo.h"
#include "gramline/new_campaign.h"
#include "new_campaign_dialog.h"
#include "plan_runner.h"
#include "recent_files.h"
#include "session_autosave.h"

namespace gramline::gui {

namespace {

const char* kFileFilter =
    QT_TRANSLATE_NOOP("gramline::gui", "Gramline campaign (*.json);;All files (*)");

QString gui_tr(const char* text) { return QCoreApplication::translate("gramline::gui", text); }

QString last_dir() { return QSettings().value(QStringLiteral("files/last_dir")).toString(); }

void remember_dir(const QString& path) {
  QSettings().setValue(QStringLiteral("files/last_dir"), QFileInfo(path).absolutePath());
}

}  // namespace

CampaignFiles::CampaignFiles(QMainWindow* window, CampaignDocument* document, PlanRunner* planner,
                             RecentFiles* recent, SessionAutosave* autosave,
                             std::function<bool()> cautions_acknowledged)
    : QObject(window),
      window_(window),
      document_(document),
      planner_(planner),
      recent_(recent),
      autosave_(autosave),
      cautions_acknowledged_(std::move(cautions_acknowledged)) {}

bool CampaignFiles::confirm_discard() {
  if (!document_->modified()) return true;
  const auto answer = QMessageBox::question(
      window_, tr("Unsaved changes"),
      tr("“%1” has changes that are not saved. Save them first?").arg(document_->display_name()),
      QMessageBox::Save | QMessageBox::Discard | QMessageBox::Cancel, QMessageBox::Save);
  if (answer == QMessageBox::Save) return save();
  return answer == QMessageBox::Discard;
}

void CampaignFiles::new_campaign() {
  // A new campaign keeps a usable two-photon rig and the usual settings; only data is missing.
  Campaign c = make_demo_campaign();
  c.name = tr("untitled").toStdString();
  c.notes.clear();
  c.data = DataSet{};
  document_->replace(c, QString(), false);
}

void CampaignFiles::new_campaign_from_csv() {
  NewCampaignDialog dialog(window_);
  if (dialog.exec() != QDialog::Accepted) return;
  if (const std::optional<Campaign> c = dialog.build()) document_->replace(*c, QString(), true);
}

void CampaignFiles::load_demo() { document_->replace(make_demo_campaign(), QString(), false); }

bool CampaignFiles::open(const QString& path) {
  try {
    const Campaign c = formats::load_campaign(path);
    document_->replace(c, QFileInfo(path).absoluteFilePath(), false);
    recent_->add(QFileInfo(path).absoluteFilePath());
    return true;
  } catch (const std::exception& e) {
    QMessageBox::warning(window_, tr("Cannot open campaign"), QString::fromStdString(e.what()));
    return false;
  }
}

void CampaignFiles::open_dialog() {
  if (!confirm_discard()) return;
  const QString path =
      QFileDialog::getOpenFileName(window_, tr("Open Campaign"), last_dir(), gui_tr(kFileFilter));
  if (path.isEmpty()) return;
  remember_dir(path);
  open(path);
}

bool CampaignFiles::save_to(const QString& path) {
  try {
    formats::save_campaign(document_->campaign(), path);
    document_->mark_saved(QFileInfo(path).absoluteFilePath());
    recent_->add(QFileInfo(path).absoluteFilePath());
    autosave_->remove();
    window_->statusBar()->showMessage(tr("Saved %1").arg(QDir::toNativeSeparators(path)), 4000);
    return true;
  } catch (const std::exception& e) {
    QMessageBox::warning(window_, tr("Cannot save campaign"), QString::fromStdString(e.what()));
    return false;
  }
}

bool CampaignFiles::save() {
  if (document_->path().isEmpty()) return save_as();
  return save_to(document_->path());
}

bool CampaignFiles::save_as() {
  QString start = document_->path();
  if (start.isEmpty()) {
    start = last_dir() + QLatin1Char('/') + QString::fromStdString(document_->campaign().name) +
            QStringLiteral(".json");
  }
  QString path =
      QFileDialog::getSaveFileName(window_, tr("Save Campaign"), start, gui_tr(kFileFilter));
  if (path.isEmpty()) return false;
  if (QFileInfo(path).suffix().isEmpty()) path += QStringLiteral(".json");
  remember_dir(path);
  return save_to(path);
}

void CampaignFiles::import_data() {
  const QString path = QFileDialog::getOpenFileName(window_, tr("Import Data"), last_dir(),
                                                    tr("CSV files (*.csv);;All files (*)"));
  if (path.isEmpty()) return;
  try {
    const DataSet data = formats::read_data_csv(path);
    const int features = data.feature_count();
    const bool encoding_fits = document_->campaign().encoding.check(features).empty();
    document_->edit(tr("Import data"), [data, encoding_fits](Campaign& c) {
      c.data = data;
      // The old map reads another number of features: the rig and its photons stay and the
      // features are spread over them (docs/conventions.md, "Encoding presets").
      if (!encoding_fits) c.encoding = encoding_for_features(c.encoding, c.data);
    });
    if (!encoding_fits) {
      window_->statusBar()->showMessage(
          tr("The encoding was rebuilt for %1 features on the rig's %2 photon(s).")
              .arg(features)
              .arg(document_->campaign().encoding.photon_count()),
          8000);
    }
  } catch (const std::exception& e) {
    QMessageBox::warning(window_, tr("Cannot import data"), QString::fromStdString(e.what()));
  }
}

void CampaignFiles::export_plan() {
  const auto plan = planner_->plan();
  if (!plan || planner_->busy()) {
    QMessageBox::information(window_, tr("No current plan"),
                             tr("Wait until the plan is up to date, then export it."));
    return;
  }
  if (!cautions_acknowledged_()) return;
  // Start in the campaign's own folder; an untitled campaign starts where the user last was.
  const QString start =
      document_->path().isEmpty() ? last_dir() : QFileInfo(document_->path()).absolutePath();
  const QString dir = QFileDialog::getExistingDirectory(window_, tr("Export Plan Files To"),
                                                        start.isEmpty() ? QDir::homePath() : start);
  if (dir.isEmpty()) return;
  try {
    formats::write_plan_files(planner_->planned_campaign(), *plan, dir);
    window_->statusBar()->showMessage(
        tr("Wrote steps.json, steps.csv, summary.json and kernel.csv to %1")
            .arg(QDir::toNativeSeparators(dir)),
        6000);
  } catch (const std::exception& e) {
    QMessageBox::warning(window_, tr("Cannot export"), QString::fromStdString(e.what()));
  }
}

}  // namespace gramline::gui
