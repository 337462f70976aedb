#pragma once
// Measured: a night's counts against the plan's prediction. The z-score of every measured entry
// against the standard normal curve, the entries beyond the outlier limit, the pair rate and
// visibility of the reference steps over the night, and the figures of the ingest. Every number
// comes from formats::ingest_counts; this view only draws them.
#include <QHash>
#include <QWidget>
#include <memory>

#include "formats/ingest_run.h"

class QChartView;
class QLabel;
class QGridLayout;
class QStackedWidget;
class QTableWidget;

namespace gramline::gui {

class FigureGrid;

class MeasuredView : public QWidget {
  Q_OBJECT

 public:
  explicit MeasuredView(QWidget* parent = nullptr);

  /// Shows `run` (null: back to the page that explains how to ingest).
  void set_run(std::shared_ptr<const formats::IngestRun> run);
  std::shared_ptr<const formats::IngestRun> run() const { return run_; }

  /// The text shown for a figure: "entries", "missing", "z_mean", "z_sd", "outliers",
  /// "drifted", "accuracy", "psd". Empty for an unknown key.
  QString figure(const QString& key) const;
  QString headline() const;
  /// Where the counts came from (and whether they were simulated), as shown.
  QString sources() const;
  int outlier_rows() const;
  /// Number of z-scores in the histogram, and of reference steps in the drift charts.
  int histogram_count() const { return histogram_count_; }
  int drift_count() const { return drift_count_; }

 signals:
  /// The "Ingest Counts…" button of the empty page.
  void ingest_requested();

 private:
  void set_figure(const QString& key, const QString& value, const QString& note = {});
  void draw_histogram();
  void draw_drift();
  void fill_outliers();

  std::shared_ptr<const formats::IngestRun> run_;
  QStackedWidget* pages_;
  QLabel* headline_;
  QLabel* sources_;
  FigureGrid* figures_;
  QChartView* histogram_;
  QChartView* rate_;
  QChartView* visibility_;
  QLabel* drift_note_;
  QLabel* outliers_caption_;
  QTableWidget* outliers_;
  int histogram_count_ = 0;
  int drift_count_ = 0;
};

}  // namespace gramline::gui
