#include "measured_view.h"

#include <QAreaSeries>
#include <QChart>
#include <QChartView>
#include <QFileInfo>
#include <QFrame>
#include <QGridLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLegendMarker>
#include <QLineSeries>
#include <QPushButton>
#include <QScatterSeries>
#include <QSplitter>
#include <QStackedWidget>
#include <QTableWidget>
#include <QVBoxLayout>
#include <QValueAxis>
#include <algorithm>
#include <cmath>
#include <numbers>
#include <vector>

#include "chart_style.h"
#include "figure_grid.h"
#include "gui_text.h"

namespace gramline::gui {

namespace {

// Histogram of the z-scores: bins of half a standard deviation out to five of them.
constexpr double kBinWidth = 0.5;
constexpr double kZLimit = 5.0;
// Error bars are drawn one series each; beyond this many reference steps only the points are.
constexpr int kMaxErrorBars = 400;

QChartView* make_chart_view(const QString& accessible_name) {
  auto* view = new QChartView;
  view->setRenderHint(QPainter::Antialiasing);
  view->setAccessibleName(accessible_name);
  view->setMinimumHeight(200);
  return view;
}

void hide_from_legend(QChart* chart, QAbstractSeries* series) {
  for (QLegendMarker* m : chart->legend()->markers(series)) m->setVisible(false);
}

QTableWidgetItem* cell(const QString& text, bool number = true) {
  auto* item = new QTableWidgetItem(text);
  if (number) item->setTextAlignment(Qt::AlignRight | Qt::AlignVCenter);
  return item;
}

QString shortened_steps(const std::vector<int>& steps, int shown) {
  QStringList list;
  for (std::size_t i = 0; i < steps.size() && static_cast<int>(i) < shown; ++i)
    list << QString::number(steps[i]);
  if (static_cast<int>(steps.size()) > shown) list << QStringLiteral("…");
  return list.join(QStringLiteral(", "));
}

}  // namespace

MeasuredView::MeasuredView(QWidget* parent) : QWidget(parent) {
  // The page shown before anything is ingested says what this view is for.
  auto* empty = new QWidget;
  auto* el = new QVBoxLayout(empty);
  auto* title = new QLabel(tr("<h3>No counts ingested yet</h3>"));
  auto* explain = new QLabel(
      tr("After a night on the rig, bring its counts back here. Choose the bundle you exported "
         "for that night and the counts file the rig controller wrote. Gramline checks that the "
         "bundle is unchanged and that the counts fit its steps, builds the measured Gram "
         "matrix, compares every entry with the predicted error and follows the pair rate and "
         "visibility of the reference steps through the night. Your campaign is not changed."));
  explain->setWordWrap(true);
  auto* ingest = new QPushButton(tr("Ingest Counts…"));
  ingest->setAccessibleName(tr("Ingest counts"));
  ingest->setToolTip(tr("Choose a bundle and the counts file the rig wrote for it"));
  connect(ingest, &QPushButton::clicked, this, &MeasuredView::ingest_requested);
  auto* button_row = new QHBoxLayout;
  button_row->addWidget(ingest);
  button_row->addStretch(1);
  el->addWidget(title);
  el->addWidget(explain);
  el->addLayout(button_row);
  el->addStretch(1);

  headline_ = new QLabel;
  headline_->setWordWrap(true);
  QFont big = font();
  big.setPointSizeF(big.pointSizeF() * 1.2);
  big.setBold(true);
  headline_->setFont(big);
  headline_->setAccessibleName(tr("Measured verdict"));
  sources_ = new QLabel;
  sources_->setWordWrap(true);
  sources_->setForegroundRole(QPalette::PlaceholderText);
  sources_->setTextInteractionFlags(Qt::TextSelectableByMouse);
  sources_->setAccessibleName(tr("Ingested files"));

  figures_ = new FigureGrid(4, 1.4);
  figures_->grid()->setContentsMargins(0, 0, 0, 0);
  figures_->grid()->setVerticalSpacing(6);
  figures_->add(QStringLiteral("entries"), tr("Entries measured"),
                tr("Kernel entries with counts, out of those the bundle plans"));
  figures_->add(
      QStringLiteral("missing"), tr("Steps without counts"),
      tr("Measure and reference steps of the bundle that have no row in the counts file"));
  figures_->add(QStringLiteral("z_mean"), tr("Mean z-score"),
                tr("Mean of (measured − predicted) ÷ predicted σ over the measured entries"));
  figures_->add(QStringLiteral("z_sd"), tr("Standard deviation of z-scores"),
                tr("Standard deviation of the z-scores; the predicted errors are right when it is "
                   "near 1"));
  figures_->add(QStringLiteral("outliers"), tr("Outlier entries"),
                tr("Entries whose z-score is beyond the outlier limit"));
  figures_->add(QStringLiteral("drifted"), tr("Drifted reference steps"),
                tr("Reference steps whose pair rate or visibility differs from the first reference "
                   "by more than 3 combined σ"));
  figures_->add(
      QStringLiteral("accuracy"), tr("Test accuracy (measured kernel)"),
      tr("The classifier trained on the measured Gram matrix, scored on the test points"));

  histogram_ = make_chart_view(tr("Histogram of the z-scores against the standard normal curve"));
  rate_ = make_chart_view(tr("Pair rate of the reference steps over the night"));
  visibility_ = make_chart_view(tr("Visibility of the reference steps over the night"));
  drift_note_ = new QLabel;
  drift_note_->setWordWrap(true);
  drift_note_->setForegroundRole(QPalette::PlaceholderText);

  outliers_caption_ = new QLabel;
  outliers_caption_->setWordWrap(true);
  outliers_ = new QTableWidget;
  outliers_->setAccessibleName(tr("Outlier entries"));
  outliers_->setEditTriggers(QAbstractItemView::NoEditTriggers);
  outliers_->setSelectionBehavior(QAbstractItemView::SelectRows);
  outliers_->verticalHeader()->setVisible(false);
  outliers_->horizontalHeader()->setStretchLastSection(true);
  outliers_->setColumnCount(6);
  outliers_->setHorizontalHeaderLabels({tr("Block"), tr("Entry (row, column)"), tr("Step"),
                                        tr("Measured"), tr("Predicted"), tr("z")});

  auto* left = new QSplitter(Qt::Vertical);
  left->addWidget(histogram_);
  auto* table_box = new QWidget;
  auto* tl = new QVBoxLayout(table_box);
  tl->setContentsMargins(0, 0, 0, 0);
  tl->addWidget(outliers_caption_);
  tl->addWidget(outliers_, 1);
  left->addWidget(table_box);
  left->setStretchFactor(0, 3);
  left->setStretchFactor(1, 2);

  auto* right_box = new QWidget;
  auto* rl = new QVBoxLayout(right_box);
  rl->setContentsMargins(0, 0, 0, 0);
  auto* right = new QSplitter(Qt::Vertical);
  right->addWidget(rate_);
  right->addWidget(visibility_);
  rl->addWidget(right, 1);
  rl->addWidget(drift_note_);

  auto* split = new QSplitter(Qt::Horizontal);
  split->addWidget(left);
  split->addWidget(right_box);
  split->setStretchFactor(0, 1);
  split->setStretchFactor(1, 1);
  split->setSizes({1000, 1000});  // half each; the splitter would go by size hints otherwise

  auto* results = new QWidget;
  auto* layout = new QVBoxLayout(results);
  layout->addWidget(headline_);
  layout->addWidget(sources_);
  auto* line = new QFrame;
  line->setFrameShape(QFrame::HLine);
  line->setFrameShadow(QFrame::Sunken);
  layout->addWidget(line);
  layout->addWidget(figures_);
  layout->addWidget(split, 1);

  pages_ = new QStackedWidget;
  pages_->addWidget(empty);
  pages_->addWidget(results);
  auto* outer = new QVBoxLayout(this);
  outer->setContentsMargins(0, 0, 0, 0);
  outer->addWidget(pages_);
}

void MeasuredView::set_figure(const QString& key, const QString& value, const QString& note) {
  figures_->set(key, value, note);
}

QString MeasuredView::figure(const QString& key) const { return figures_->value(key); }

QString MeasuredView::headline() const { return headline_->text(); }

QString MeasuredView::sources() const { return sources_->text(); }

int MeasuredView::outlier_rows() const { return outliers_->rowCount(); }

void MeasuredView::set_run(std::shared_ptr<const formats::IngestRun> run) {
  run_ = std::move(run);
  if (!run_) {
    pages_->setCurrentIndex(0);
    histogram_count_ = drift_count_ = 0;
    return;
  }
  pages_->setCurrentIndex(1);
  const formats::IngestRun& g = *run_;
  const IngestResult& r = g.result;
  headline_->setText(tr("Measured %1 of %2 entries. The z-scores have mean %3 and standard "
                        "deviation %4; when the predicted errors are right they are near 0 "
                        "and 1.")
                         .arg(count_text(r.measured_entries))
                         .arg(count_text(r.expected_entries))
                         .arg(number_text(r.z_mean, 2))
                         .arg(number_text(r.z_std, 2)));
  const QString bundle = QString::fromStdString(g.bundle_source);
  const QString counts = QString::fromStdString(g.counts_source);
  sources_->setText(tr("Counts file %1 for the bundle %2 (checksums verified; manifest SHA-256 "
                       "%3…).")
                        .arg(QFileInfo(counts).fileName(), QFileInfo(bundle).fileName(),
                             QString::fromStdString(g.manifest_sha256.substr(0, 12))));
  sources_->setToolTip(tr("Counts: %1\nBundle: %2").arg(counts, bundle));
  if (!g.simulated_note.empty() || !g.earlier_simulated_note.empty())
    sources_->setText(sources_->text() + " " +
                      tr("These are simulated counts, drawn from the rig model, not a rig's."));

  QString entries_note;
  if (g.unmeasured_train + g.unmeasured_test > 0)
    entries_note = tr("not measured: %1 training, %2 test")
                       .arg(count_text(g.unmeasured_train))
                       .arg(count_text(g.unmeasured_test));
  else
    entries_note = tr("every planned entry has counts");
  if (g.earlier_steps > 0)
    entries_note += tr("; %1 steps from earlier bundles included").arg(g.earlier_steps);
  set_figure(QStringLiteral("entries"),
             tr("%1 of %2").arg(count_text(r.measured_entries), count_text(r.expected_entries)),
             entries_note);
  const std::vector<int>& missing = g.check.missing;
  set_figure(
      QStringLiteral("missing"), count_text(static_cast<double>(missing.size())),
      missing.empty()
          ? tr("the night is complete")
          : tr("steps %1; File ▸ Resume from Counts plans them").arg(shortened_steps(missing, 8)));
  set_figure(QStringLiteral("z_mean"), number_text(r.z_mean, 3), tr("expected near 0"));
  set_figure(QStringLiteral("z_sd"), number_text(r.z_std, 3), tr("expected near 1"));
  set_figure(QStringLiteral("outliers"), count_text(static_cast<double>(r.outliers.size())),
             tr("|z| above %1").arg(number_text(IngestOptions{}.outlier_z, 0)));
  int drifted = 0;
  for (const DriftPoint& d : r.drift) drifted += d.drifted ? 1 : 0;
  set_figure(QStringLiteral("drifted"),
             tr("%1 of %2").arg(drifted).arg(static_cast<int>(r.drift.size())),
             r.drift.empty() ? tr("no reference steps were counted")
                             : tr("compared with the first reference step"));
  if (g.svm_trained && std::isfinite(g.test_accuracy)) {
    QString note = tr("%1 with the ideal kernel")
                       .arg(tr("%1 %").arg(number_text(100.0 * g.ideal_test_accuracy, 1)));
    if (g.psd_repaired)
      note +=
          tr("; the measured Gram matrix had negative eigenvalues, set to zero before "
             "training");
    set_figure(QStringLiteral("accuracy"), tr("%1 %").arg(number_text(100.0 * g.test_accuracy, 1)),
               note);
  } else if (g.svm_trained) {
    set_figure(QStringLiteral("accuracy"), QStringLiteral("–"),
               g.unmeasured_test > 0 ? tr("trained, but the test block is incomplete")
                                     : tr("trained; the campaign has no test points"));
  } else {
    set_figure(QStringLiteral("accuracy"), QStringLiteral("–"),
               tr("not trained: %1").arg(QString::fromStdString(g.svm_skipped_reason)));
  }
  draw_histogram();
  draw_drift();
  fill_outliers();
}

void MeasuredView::draw_histogram() {
  const IngestResult& r = run_->result;
  std::vector<double> z;
  for (long i = 0; i < r.gram_z.rows(); ++i)
    for (long j = i + 1; j < r.gram_z.cols(); ++j)
      if (std::isfinite(r.gram_z(i, j))) z.push_back(r.gram_z(i, j));
  for (long i = 0; i < r.test_z.rows(); ++i)
    for (long j = 0; j < r.test_z.cols(); ++j)
      if (std::isfinite(r.test_z(i, j))) z.push_back(r.test_z(i, j));
  histogram_count_ = static_cast<int>(z.size());

  const int bins = static_cast<int>(std::lround(2 * kZLimit / kBinWidth));
  std::vector<int> counts(static_cast<std::size_t>(bins), 0);
  int beyond = 0;
  for (double x : z) {
    if (std::abs(x) >= kZLimit) {
      ++beyond;
      continue;
    }
    counts[static_cast<std::size_t>(std::floor((x + kZLimit) / kBinWidth))]++;
  }

  auto* chart = new QChart;
  chart->setTitle(tr("z-scores of the measured entries"));
  auto* upper = new QLineSeries;
  double top = 0;
  for (int b = 0; b < bins; ++b) {
    const double left = -kZLimit + b * kBinWidth;
    upper->append(left, counts[b]);
    upper->append(left + kBinWidth, counts[b]);
    top = std::max(top, static_cast<double>(counts[b]));
  }
  auto* lower = new QLineSeries;
  lower->append(-kZLimit, 0);
  lower->append(kZLimit, 0);
  auto* bars = new QAreaSeries(upper, lower);
  bars->setName(tr("measured entries per bin"));
  QColor fill = work_colour::counting();
  fill.setAlphaF(0.55);
  bars->setBrush(fill);
  bars->setPen(QPen(work_colour::counting(), 1.2));
  chart->addSeries(bars);

  // The reference: the standard normal density scaled to the number of z-scores and the bin
  // width, which is what the histogram approaches when the predicted errors are right.
  auto* curve = new QLineSeries;
  curve->setName(tr("standard normal curve"));
  const double scale = static_cast<double>(z.size()) * kBinWidth / std::sqrt(2 * std::numbers::pi);
  for (int k = 0; k <= 200; ++k) {
    const double x = -kZLimit + k * (2 * kZLimit / 200.0);
    const double y = scale * std::exp(-0.5 * x * x);
    curve->append(x, y);
    top = std::max(top, y);
  }
  curve->setPen(QPen(palette().color(QPalette::Text), 2.0, Qt::DashLine));
  chart->addSeries(curve);

  auto* x_axis = new QValueAxis;
  x_axis->setRange(-kZLimit, kZLimit);
  x_axis->setTickCount(11);
  x_axis->setLabelFormat(QStringLiteral("%.0f"));
  x_axis->setTitleText(beyond > 0 ? tr("z = (measured − predicted) ÷ predicted σ; %1 beyond ±%2 "
                                       "not drawn")
                                        .arg(beyond)
                                        .arg(number_text(kZLimit, 0))
                                  : tr("z = (measured − predicted) ÷ predicted σ"));
  auto* y_axis = new QValueAxis;
  y_axis->setRange(0, std::max(1.0, top * 1.08));
  y_axis->applyNiceNumbers();
  y_axis->setLabelFormat(QStringLiteral("%.0f"));
  y_axis->setTitleText(tr("entries"));
  chart->addAxis(x_axis, Qt::AlignBottom);
  chart->addAxis(y_axis, Qt::AlignLeft);
  for (QAbstractSeries* s : chart->series()) {
    s->attachAxis(x_axis);
    s->attachAxis(y_axis);
  }
  chart->legend()->setAlignment(Qt::AlignBottom);
  style_chart(chart, palette());
  QChart* old = histogram_->chart();
  histogram_->setChart(chart);
  delete old;
}

void MeasuredView::draw_drift() {
  const std::vector<DriftPoint>& drift = run_->result.drift;
  drift_count_ = static_cast<int>(drift.size());
  const bool bars = drift_count_ <= kMaxErrorBars;
  bool visibility_known = false;
  for (const DriftPoint& d : drift) visibility_known = visibility_known || d.visibility_sigma > 0;

  // One chart per quantity: points with ±1 σ error bars, drifted points in another colour and
  // shape, and a dashed line at the first reference step's value (what drift is measured from).
  const auto draw = [&](QChartView* view, const QString& title, const QString& unit,
                        double DriftPoint::*value, double DriftPoint::*sigma, double factor,
                        const QString& decimals_format) {
    auto* chart = new QChart;
    chart->setTitle(title);
    auto* steady = new QScatterSeries;
    steady->setName(tr("reference, ±1 σ"));
    steady->setMarkerSize(8);
    steady->setColor(work_colour::reference());
    steady->setBorderColor(work_colour::reference().darker(140));
    auto* moved = new QScatterSeries;
    moved->setName(tr("drifted"));
    moved->setMarkerShape(QScatterSeries::MarkerShapeRectangle);
    moved->setMarkerSize(10);
    moved->setColor(work_colour::moving());
    moved->setBorderColor(work_colour::moving().darker(140));
    double low = 1e300, high = -1e300, t_end = 0;
    std::vector<QLineSeries*> whiskers;
    for (const DriftPoint& d : drift) {
      const double t_h = d.time_s / 3600.0;
      const double v = d.*value * factor, s = d.*sigma * factor;
      if (!std::isfinite(v)) continue;
      (d.drifted ? moved : steady)->append(t_h, v);
      low = std::min(low, v - s);
      high = std::max(high, v + s);
      t_end = std::max(t_end, t_h);
      if (bars && s > 0) {
        auto* w = new QLineSeries;
        w->append(t_h, v - s);
        w->append(t_h, v + s);
        w->setPen(QPen(d.drifted ? work_colour::moving() : work_colour::reference(), 1.4));
        whiskers.push_back(w);
      }
    }
    for (QLineSeries* w : whiskers) chart->addSeries(w);
    chart->addSeries(steady);
    chart->addSeries(moved);
    if (!drift.empty() && std::isfinite(drift.front().*value)) {
      auto* first = new QLineSeries;
      first->setName(tr("first reference"));
      first->append(0, drift.front().*value * factor);
      first->append(std::max(t_end, 1e-3) * 10, drift.front().*value * factor);  // clipped
      QColor c = palette().color(QPalette::Text);
      c.setAlphaF(0.6);
      first->setPen(QPen(c, 1.0, Qt::DashLine));
      chart->addSeries(first);
    }
    for (QLineSeries* w : whiskers) hide_from_legend(chart, w);
    if (moved->count() == 0) hide_from_legend(chart, moved);
    auto* x_axis = new QValueAxis;
    x_axis->setRange(0, std::max(t_end, 1e-3) * 1.02);
    x_axis->applyNiceNumbers();
    x_axis->setTitleText(tr("hours since the start of night 1"));
    x_axis->setLabelFormat(QStringLiteral("%.1f"));
    auto* y_axis = new QValueAxis;
    if (low > high) {
      low = 0;
      high = 1;
    }
    const double pad = std::max(1e-9, 0.08 * (high - low));
    y_axis->setRange(low - pad, high + pad);
    y_axis->setTickCount(5);
    y_axis->applyNiceNumbers();
    y_axis->setLabelFormat(decimals_format);
    y_axis->setTitleText(unit);
    chart->addAxis(x_axis, Qt::AlignBottom);
    chart->addAxis(y_axis, Qt::AlignLeft);
    for (QAbstractSeries* s : chart->series()) {
      s->attachAxis(x_axis);
      s->attachAxis(y_axis);
    }
    chart->legend()->setAlignment(Qt::AlignBottom);
    style_chart(chart, palette());
    QChart* old = view->chart();
    view->setChart(chart);
    delete old;
  };
  draw(rate_, tr("Detected pair rate (pairs/s)"), tr("pairs/s"),
       &DriftPoint::pair_detect_rate_per_s, &DriftPoint::pair_detect_rate_sigma, 1.0,
       QStringLiteral("%.0f"));
  draw(visibility_, tr("Visibility (%)"), tr("%"), &DriftPoint::visibility,
       &DriftPoint::visibility_sigma, 100.0, QStringLiteral("%.1f"));
  QStringList notes;
  if (drift.empty())
    notes << tr(
        "No reference step was counted, so the rig model's pair rate and visibility "
        "were used for every entry.");
  else
    notes << tr(
        "Squares mark drifted reference steps: their pair rate or their visibility "
        "differs from the first reference step's by more than 3 combined σ, so the "
        "same steps are marked in both charts. Between reference steps both are "
        "interpolated in time to calibrate each entry.");
  if (!drift.empty() && !visibility_known)
    notes << tr(
        "This detection scheme cannot separate the visibility from the pair rate: its "
        "values come from the rig model and carry no error bar.");
  if (!bars) notes << tr("Too many reference steps to draw error bars.");
  drift_note_->setText(notes.join(QLatin1Char(' ')));
}

void MeasuredView::fill_outliers() {
  const std::vector<Outlier>& list = run_->result.outliers;
  outliers_->setRowCount(static_cast<int>(list.size()));
  for (std::size_t k = 0; k < list.size(); ++k) {
    const Outlier& o = list[k];
    const int r = static_cast<int>(k);
    outliers_->setItem(r, 0, cell(block_text(o.block), false));
    outliers_->setItem(r, 1, cell(tr("%1, %2").arg(o.row).arg(o.col)));
    outliers_->setItem(r, 2, cell(QString::number(o.step)));
    outliers_->setItem(r, 3, cell(number_text(o.measured, 4)));
    outliers_->setItem(r, 4, cell(number_text(o.predicted, 4)));
    outliers_->setItem(r, 5, cell(number_text(o.z, 2)));
  }
  outliers_->resizeColumnsToContents();
  outliers_->setVisible(!list.empty());  // an empty table only takes room from the histogram
  outliers_caption_->setText(
      list.empty()
          ? tr("<b>Outliers:</b> no entry has |z| above %1.")
                .arg(number_text(IngestOptions{}.outlier_z, 0))
          : tr("<b>Outliers:</b> entries with |z| above %1, in the order they were measured. "
               "Row and column are training points; in the test block the row is a test point.")
                .arg(number_text(IngestOptions{}.outlier_z, 0)));
}

}  // namespace gramline::gui
