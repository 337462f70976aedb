#pragma once
// The hand-off to the rig and back, as the app does it: export the current plan as a bundle,
// ingest the counts a rig wrote for a bundle (into the Measured view), and resume an
// interrupted campaign from a partial counts file. Reading, ingesting and re-planning run on a
// worker thread; the formats layer does all the work (formats::write_bundle, ingest_counts,
// plan_resume, write_resumed_bundle), so the app and gramline-cli give the same numbers.
#include <QObject>
#include <QString>
#include <functional>
#include <memory>

#include "formats/bundle.h"
#include "formats/ingest_run.h"
#include "formats/resume_run.h"
#include "job_runner.h"

class QAction;
class QMainWindow;
class QMenu;

namespace gramline::gui {

class MeasuredView;
class PlanRunner;
class StatusIndicator;

/// read_bundle, read_counts_csv and ingest_counts. Throws std::exception with a message that
/// names the file (and the line for a counts file).
formats::IngestRun load_and_ingest(const QString& bundle_path, const QString& counts_path);

/// A resumed campaign, with the bundle it continues.
struct ResumeOutcome {
  std::shared_ptr<const formats::Bundle> bundle;
  std::shared_ptr<const formats::ResumeRun> run;
  QString bundle_path;
};
/// read_bundle, read_counts_csv and plan_resume from `first_night` (YYYY-MM-DD; empty: the day
/// after the last night counted); throws like load_and_ingest.
ResumeOutcome load_and_resume(const QString& bundle_path, const QString& counts_path,
                              const QString& first_night = QString());

/// A file-name-safe version of a campaign name, for default file names.
QString file_stem(const QString& name);

class HandOff : public QObject {
  Q_OBJECT

 public:
  /// Where the campaign file is (empty: untitled); exports start in its folder.
  void set_campaign_path(std::function<QString()> path) { campaign_path_ = std::move(path); }
  /// `cautions_acknowledged` shows the cautions before the first export of a session and says
  /// whether the user went on.
  HandOff(QMainWindow* window, PlanRunner* planner, MeasuredView* view,
          std::function<bool()> cautions_acknowledged);

  /// Adds Export Bundle…, Ingest Counts… and Resume from Counts… to `menu`.
  void add_actions(QMenu* menu);

  /// File ▸ Export Bundle…: cautions (once a session), file dialog, then export_bundle_to.
  void export_bundle();
  /// Writes the bundle of the current plan to `path`, replacing a file the user agreed to
  /// replace. False (after telling the user, naming the file) on failure.
  bool export_bundle_to(const QString& path);

  /// File ▸ Ingest Counts…: choose a bundle and a counts file, then ingest_files.
  void ingest();
  /// Ingests in the background; the Measured view shows the result (or a message box the
  /// error). The view keeps its previous result when this fails.
  void ingest_files(const QString& bundle_path, const QString& counts_path);

  /// File ▸ Resume from Counts…: choose a bundle and a partial counts file, re-plan the rest in
  /// the background, show its summary and offer to save the new bundle.
  void resume();
  void resume_files(const QString& bundle_path, const QString& counts_path,
                    const QString& first_night = QString());
  /// Asks for the first night of the rest: false when the user cancels; `first_night` empty
  /// for "the day after the last night counted".
  bool ask_first_night(QString& first_night);
  /// Writes the new bundle of the last resume to `path` (cautions already acknowledged).
  bool save_resumed_to(const QString& path);
  std::shared_ptr<const formats::ResumeRun> last_resume() const { return resumed_.run; }

  /// File ▸ Rehearse with a Simulated Rig…: choose a bundle and where its simulated counts go,
  /// then rehearse_files.
  void rehearse();
  /// Draws the counts a rig following the bundle would record from the rig model
  /// (formats::simulate_night, the bundle's seed), writes them to `counts_path` marked as
  /// simulated and ingests them like a rig's. False (after telling the user) on failure.
  bool rehearse_files(const QString& bundle_path, const QString& counts_path);

  bool busy() const { return ingest_->busy() || resume_->busy(); }
  /// The last error shown to the user (empty after a success).
  QString last_error() const { return last_error_; }

 signals:
  /// The Measured view shows a new run.
  void ingested();
  /// A resume was planned and is held for saving.
  void resumed();
  void failed(const QString& message);

 private:
  void set_busy(const QString& what);
  void show_ingested();
  void clear_busy();
  void show_error(const QString& title, const QString& message);
  void show_resume_dialog();
  /// Asks for a bundle, then for a counts file beside it (`counts_title` takes the bundle's
  /// file name as %1); false when the user cancels either.
  bool choose_bundle_and_counts(const QString& bundle_title, const QString& counts_title,
                                QString& bundle, QString& counts);
  QString last_dir() const;
  /// The folder an export starts in: the campaign's own folder when it has a file.
  QString export_dir() const;
  std::function<QString()> campaign_path_;
  void remember_dir(const QString& path) const;

  QMainWindow* window_;
  PlanRunner* planner_;
  MeasuredView* view_;
  std::function<bool()> cautions_acknowledged_;
  StatusIndicator* status_;
  QList<QAction*> actions_;
  JobRunner<std::shared_ptr<const formats::IngestRun>>* ingest_;
  JobRunner<ResumeOutcome>* resume_;
  ResumeOutcome resumed_;  ///< the last resume, held for saving
  QString last_error_;
};

}  // namespace gramline::gui
