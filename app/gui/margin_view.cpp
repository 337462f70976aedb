#include "margin_view.h"

#include <QBarCategoryAxis>
#include <QBarSet>
#include <QChart>
#include <QChartView>
#include <QCoreApplication>
#include <QGridLayout>
#include <QHeaderView>
#include <QLabel>
#include <QMouseEvent>
#include <QPainter>
#include <QPainterPath>
#include <QScrollArea>
#include <QSplitter>
#include <QStackedBarSeries>
#include <QTableWidget>
#include <QToolTip>
#include <QVBoxLayout>
#include <QValueAxis>
#include <algorithm>
#include <cmath>

#include "chart_style.h"
#include "gui_text.h"

namespace gramline::gui {

namespace {

QColor class_colour(int label) {
  return label > 0 ? work_colour::park() : work_colour::reference();
}

QString percent(double fraction, int decimals = 1) {
  return QCoreApplication::translate("gramline::gui", "%1 %")
      .arg(number_text(100.0 * fraction, decimals));
}

}  // namespace

DecisionMap::DecisionMap(QWidget* parent) : QWidget(parent) {
  setMouseTracking(true);
  setMinimumSize(280, 280);
  setAccessibleName(tr("Data and decision boundary"));
}

void DecisionMap::set_content(const Campaign& campaign, std::shared_ptr<const MarginCheck> check,
                              std::shared_ptr<const DecisionGrid> grid) {
  campaign_ = campaign;
  check_ = std::move(check);
  grid_ = std::move(grid);
  const DataSet& d = campaign_.data;
  shade_ = QImage();
  if (grid_ && grid_->size > 1) {
    x_low_ = grid_->x_low;
    x_high_ = grid_->x_high;
    y_low_ = grid_->y_low;
    y_high_ = grid_->y_high;
    const int n = grid_->size;
    shade_ = QImage(n, n, QImage::Format_ARGB32);
    const QColor base = palette().color(QPalette::Base);
    for (int r = 0; r < n; ++r) {
      for (int c = 0; c < n; ++c) {
        const double f = grid_->values(r * n + c);
        QColor tint = class_colour(f > 0 ? 1 : -1);
        const double a = 0.22;
        QColor mixed = QColor::fromRgbF(base.redF() * (1 - a) + tint.redF() * a,
                                        base.greenF() * (1 - a) + tint.greenF() * a,
                                        base.blueF() * (1 - a) + tint.blueF() * a);
        shade_.setPixelColor(c, n - 1 - r, mixed);  // row 0 is y_low: bottom of the image
      }
    }
  } else if (d.train_count() > 0 && d.feature_count() >= 1) {
    const int fy = d.feature_count() >= 2 ? 1 : 0;
    x_low_ = std::min(d.train.col(0).minCoeff(), d.test_count() ? d.test.col(0).minCoeff() : 1e300);
    x_high_ =
        std::max(d.train.col(0).maxCoeff(), d.test_count() ? d.test.col(0).maxCoeff() : -1e300);
    y_low_ =
        std::min(d.train.col(fy).minCoeff(), d.test_count() ? d.test.col(fy).minCoeff() : 1e300);
    y_high_ =
        std::max(d.train.col(fy).maxCoeff(), d.test_count() ? d.test.col(fy).maxCoeff() : -1e300);
    const double px = 0.06 * std::max(1e-9, x_high_ - x_low_),
                 py = 0.06 * std::max(1e-9, y_high_ - y_low_);
    x_low_ -= px;
    x_high_ += px;
    y_low_ -= py;
    y_high_ += py;
  }
  update();
}

QRectF DecisionMap::plot_rect() const {
  const double fh = fontMetrics().height();
  QRectF area = QRectF(rect()).adjusted(fh * 2.2, fh * 0.5, -fh * 0.5, -fh * 2.2);
  const double side = std::min(area.width(), area.height());
  return QRectF(area.left(), area.top(), side, side);
}

QPointF DecisionMap::to_screen(double x, double y) const {
  const QRectF r = plot_rect();
  return {r.left() + (x - x_low_) / (x_high_ - x_low_) * r.width(),
          r.bottom() - (y - y_low_) / (y_high_ - y_low_) * r.height()};
}

void DecisionMap::paintEvent(QPaintEvent*) {
  QPainter p(this);
  p.setRenderHint(QPainter::Antialiasing);
  p.fillRect(rect(), palette().color(QPalette::Base));
  const DataSet& d = campaign_.data;
  if (d.train_count() == 0) return;
  const QRectF r = plot_rect();
  if (!shade_.isNull()) {
    p.drawImage(r,
                shade_.scaled(r.size().toSize(), Qt::IgnoreAspectRatio, Qt::SmoothTransformation));
    // The boundary f = 0: cells whose sign differs from a neighbour's.
    const int n = grid_->size;
    QPen pen(palette().color(QPalette::Text), 2.0);
    p.setPen(pen);
    const double cw = r.width() / (n - 1), ch = r.height() / (n - 1);
    for (int row = 0; row < n; ++row) {
      for (int c = 0; c < n; ++c) {
        const double f = grid_->values(row * n + c);
        // Linear interpolation of the zero crossing along x and along y.
        if (c + 1 < n) {
          const double g = grid_->values(row * n + c + 1);
          if ((f > 0) != (g > 0)) {
            const double t = f / (f - g);
            const QPointF a(r.left() + (c + t) * cw, r.bottom() - row * ch);
            p.drawPoint(a);
          }
        }
        if (row + 1 < n) {
          const double g = grid_->values((row + 1) * n + c);
          if ((f > 0) != (g > 0)) {
            const double t = f / (f - g);
            const QPointF a(r.left() + c * cw, r.bottom() - (row + t) * ch);
            p.drawPoint(a);
          }
        }
      }
    }
  }
  p.setPen(palette().color(QPalette::Mid));
  p.setBrush(Qt::NoBrush);
  p.drawRect(r);
  // Axis labels: feature names and the ends of each range.
  p.setPen(palette().color(QPalette::Text));
  const auto name = [&](int f) {
    return f < static_cast<int>(d.feature_names.size()) ? QString::fromStdString(d.feature_names[f])
                                                        : tr("feature %1").arg(f);
  };
  const double fh = fontMetrics().height();
  p.drawText(QRectF(r.left(), r.bottom() + 2, r.width(), fh), Qt::AlignHCenter, name(0));
  p.drawText(QRectF(r.left(), r.bottom() + 2, r.width(), fh), Qt::AlignLeft,
             number_text(x_low_, 2));
  p.drawText(QRectF(r.left(), r.bottom() + 2, r.width(), fh), Qt::AlignRight,
             number_text(x_high_, 2));
  if (d.feature_count() >= 2) {
    p.save();
    p.translate(r.left() - 4, r.bottom());
    p.rotate(-90);
    p.drawText(QRectF(0, -fh, r.height(), fh), Qt::AlignHCenter, name(1));
    p.drawText(QRectF(0, -fh, r.height(), fh), Qt::AlignLeft, number_text(y_low_, 2));
    p.drawText(QRectF(0, -fh, r.height(), fh), Qt::AlignRight, number_text(y_high_, 2));
    p.restore();
  }
  const int fy = d.feature_count() >= 2 ? 1 : 0;
  // Training points: filled circles (class +1) and squares (class -1).
  for (int i = 0; i < d.train_count(); ++i) {
    const QPointF s = to_screen(d.train(i, 0), d.train(i, fy));
    const QColor col = class_colour(d.train_labels(i));
    p.setPen(QPen(col.darker(150), 1));
    p.setBrush(col);
    if (d.train_labels(i) > 0)
      p.drawEllipse(s, 4.5, 4.5);
    else
      p.drawRect(QRectF(s.x() - 4, s.y() - 4, 8, 8));
  }
  // Test points: diamonds, outline by true class, fill by flip probability.
  const double worst = 0.5;  // a flip probability of 1/2 is a coin toss
  for (int i = 0; i < d.test_count(); ++i) {
    const QPointF s = to_screen(d.test(i, 0), d.test(i, fy));
    QPainterPath diamond;
    diamond.moveTo(s + QPointF(0, -7));
    diamond.lineTo(s + QPointF(7, 0));
    diamond.lineTo(s + QPointF(0, 7));
    diamond.lineTo(s + QPointF(-7, 0));
    diamond.closeSubpath();
    QColor fill = palette().color(QPalette::Base);
    if (check_ && static_cast<std::size_t>(i) < check_->trials.points.size())
      fill =
          heat_colour(1.0 - std::min(1.0, check_->trials.points[i].flip_probability.value / worst));
    p.setPen(QPen(class_colour(d.test_labels(i)).darker(130), 2.0));
    p.setBrush(fill);
    p.drawPath(diamond);
  }
}

void DecisionMap::mouseMoveEvent(QMouseEvent* event) {
  const DataSet& d = campaign_.data;
  const QPointF pos = event->position();
  const int fy = d.feature_count() >= 2 ? 1 : 0;
  for (int i = 0; i < d.test_count(); ++i) {
    const QPointF s = to_screen(d.test(i, 0), d.test(i, fy));
    if (QLineF(s, pos).length() > 8) continue;
    QString text =
        tr("<b>Test point %1</b> (point %2), class %3")
            .arg(i)
            .arg(d.train_count() + i)
            .arg(QString::fromStdString(d.test_labels(i) > 0 ? d.positive_name : d.negative_name));
    if (check_ && static_cast<std::size_t>(i) < check_->trials.points.size()) {
      const TestPointOutcome& o = check_->trials.points[i];
      text += tr("<br>noiseless f = %1<br>flip probability %2 (%3 – %4)")
                  .arg(number_text(o.decision_ideal, 3))
                  .arg(percent(o.flip_probability.value, 2))
                  .arg(percent(o.flip_probability.low, 2))
                  .arg(percent(o.flip_probability.high, 2));
    }
    QToolTip::showText(event->globalPosition().toPoint(), text, this);
    return;
  }
  QToolTip::hideText();
}

MarginView::MarginView(QWidget* parent) : QWidget(parent) {
  map_ = new DecisionMap;
  verdict_ = new QLabel;
  verdict_->setWordWrap(true);
  verdict_->setTextFormat(Qt::RichText);
  verdict_->setAccessibleName(tr("Margin verdict"));
  figures_ = new QLabel;
  figures_->setWordWrap(true);
  figures_->setTextInteractionFlags(Qt::TextSelectableByMouse);
  budget_ = new QLabel;
  budget_->setWordWrap(true);
  budget_->setTextInteractionFlags(Qt::TextSelectableByMouse);
  allocations_ = new QTableWidget;
  allocations_->setAccessibleName(tr("Pairs shared by strategy"));
  allocations_->setEditTriggers(QAbstractItemView::NoEditTriggers);
  allocations_->verticalHeader()->setVisible(false);
  allocations_->horizontalHeader()->setStretchLastSection(true);
  allocations_->setMinimumHeight(fontMetrics().height() * 8);
  allocations_->setMaximumHeight(fontMetrics().height() * 9);
  ratio_view_ = new RatioHistogram;

  auto* legend =
      new QLabel(tr("Circles and squares: training points of each class. Diamonds: "
                    "test points, outlined by class, filled pale when they keep their "
                    "side and dark when noise flips them. The line is the noiseless "
                    "decision boundary."));
  legend->setWordWrap(true);
  legend->setForegroundRole(QPalette::PlaceholderText);
  auto* left = new QWidget;
  auto* ll = new QVBoxLayout(left);
  ll->setContentsMargins(0, 0, 0, 0);
  ll->addWidget(map_, 1);
  ll->addWidget(legend);

  auto* right = new QWidget;
  auto* rl = new QVBoxLayout(right);
  rl->setContentsMargins(0, 0, 0, 0);
  rl->addWidget(verdict_);
  rl->addWidget(figures_);
  rl->addWidget(budget_);
  rl->addWidget(allocations_);
  rl->addWidget(ratio_view_, 1);
  auto* scroll = new QScrollArea;
  scroll->setWidget(right);
  scroll->setWidgetResizable(true);
  scroll->setFrameShape(QFrame::NoFrame);

  auto* split = new QSplitter(Qt::Horizontal);
  split->addWidget(left);
  split->addWidget(scroll);
  split->setStretchFactor(0, 1);
  split->setStretchFactor(1, 1);
  split->setSizes({480, 520});
  scroll->setMinimumWidth(380);
  auto* layout = new QVBoxLayout(this);
  layout->addWidget(split);
  set_status(tr("The margin check runs after each plan."));
}

void MarginView::set_campaign(const Campaign& campaign) {
  campaign_ = campaign;
  if (!check_) map_->set_content(campaign_, nullptr, nullptr);
}

void MarginView::set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign) {
  plan_ = std::move(plan);
  campaign_ = campaign;
  check_.reset();
  map_->set_content(campaign_, nullptr, nullptr);
  figures_->clear();
  budget_->clear();
  allocations_->clear();
  allocations_->setRowCount(0);
  allocations_->hide();
  ratio_view_->set_values({}, campaign_.check.margin_ratio_threshold);
}

void MarginView::set_status(const QString& text) { verdict_->setText(text); }

QString MarginView::verdict_text() const { return verdict_->text(); }

void MarginView::set_check(std::shared_ptr<const MarginCheck> check,
                           std::shared_ptr<const DecisionGrid> grid) {
  check_ = std::move(check);
  map_->set_content(campaign_, check_, grid);
  if (!check_) return;
  const MarginCheck& m = *check_;
  const TrialSummary& t = m.trials;
  QString verdict = m.verdict.pass ? tr("<h3>Pass: the measured kernel keeps every decision.</h3>")
                                   : tr("<h3>Fail: noise would change decisions.</h3>");
  if (!m.verdict.reasons.empty()) {
    verdict += QStringLiteral("<ul>");
    for (const std::string& r : m.verdict.reasons)
      verdict += QStringLiteral("<li>%1</li>").arg(QString::fromStdString(r).toHtmlEscaped());
    verdict += QStringLiteral("</ul>");
  }
  verdict_->setText(verdict);
  figures_->setText(
      tr("Over %1 simulated runs with the planned pairs: largest flip probability of a test "
         "point %2 (allowed %3); median accuracy %4; median margin ratio %5 (required %6); "
         "PSD repair needed in %7 of runs. Classifier C = %8%9.")
          .arg(t.trials)
          .arg(percent(t.flip_probability_max.value, 2))
          .arg(percent(campaign_.check.flip_threshold, 2))
          .arg(percent(t.accuracy_median.value, 1))
          .arg(number_text(t.margin_ratio_median.value, 3))
          .arg(number_text(campaign_.check.margin_ratio_threshold, 2))
          .arg(percent(t.psd_repair_fraction.value, 1))
          .arg(number_text(m.C, 3))
          .arg(m.C_from_cross_validation ? tr(" (chosen by cross-validation)") : QString()));
  if (m.minimum_uniform.found) {
    budget_->setText(
        tr("<b>Minimum budget:</b> %1 pairs per entry, %2 of counting (the plan counts %3).")
            .arg(count_text(m.minimum_uniform.pairs_per_entry))
            .arg(duration_text(m.minimum_uniform.integration_s))
            .arg(duration_text(m.plan_integration_s)));
  } else if (m.minimum_uniform.evaluations > 0) {
    budget_->setText(tr("<b>Minimum budget:</b> no budget in the searched range passes."));
  } else {
    budget_->setText(tr("<b>Minimum budget:</b> not searched."));
  }
  allocations_->clear();
  allocations_->setColumnCount(4);
  allocations_->setHorizontalHeaderLabels(
      {tr("Share pairs"), tr("At the planned time"), tr("Largest flip"), tr("Counting needed")});
  allocations_->setRowCount(static_cast<int>(m.allocations.size()));
  for (std::size_t i = 0; i < m.allocations.size(); ++i) {
    const AllocationOutcome& a = m.allocations[i];
    const int r = static_cast<int>(i);
    const QString names[] = {tr("uniform"), tr("Neyman"), tr("margin-aware")};
    auto* name = new QTableWidgetItem(names[static_cast<int>(a.strategy)]);
    name->setToolTip(allocation_text(a.strategy));
    allocations_->setItem(r, 0, name);
    allocations_->setItem(r, 1,
                          new QTableWidgetItem(a.pass_at_plan_time ? tr("pass") : tr("fail")));
    allocations_->setItem(r, 2, new QTableWidgetItem(percent(a.flip_probability_max, 2)));
    allocations_->setItem(
        r, 3,
        new QTableWidgetItem(a.time_for_pass.found ? duration_text(a.time_for_pass.integration_s)
                                                   : tr("not found")));
  }
  allocations_->resizeColumnsToContents();
  allocations_->setVisible(!m.allocations.empty());
  ratio_view_->set_values(t.margin_ratio, campaign_.check.margin_ratio_threshold);
}

RatioHistogram::RatioHistogram(QWidget* parent) : QWidget(parent) {
  setMinimumHeight(200);
  setAccessibleName(tr("Distribution of the margin ratio"));
}

void RatioHistogram::set_values(std::vector<double> ratios, double threshold) {
  ratios_ = std::move(ratios);
  threshold_ = threshold;
  update();
}

void RatioHistogram::paintEvent(QPaintEvent*) {
  QPainter p(this);
  p.setRenderHint(QPainter::Antialiasing);
  p.fillRect(rect(), palette().color(QPalette::Base));
  const double fh = fontMetrics().height();
  p.setPen(palette().color(QPalette::Text));
  QFont bold = font();
  bold.setBold(true);
  p.setFont(bold);
  p.drawText(QRectF(0, 2, width(), fh + 2), Qt::AlignHCenter,
             tr("Margin ratio per simulated run (noisy margin ÷ noiseless)"));
  p.setFont(font());
  if (ratios_.empty()) {
    p.drawText(rect(), Qt::AlignCenter, tr("No runs yet"));
    return;
  }
  const auto [mn, mx] = std::minmax_element(ratios_.begin(), ratios_.end());
  const double lo = std::min(*mn, threshold_) - 0.01;
  const double hi = std::max(*mx, 1.0) + 0.01;
  const int bins = 30;
  std::vector<int> counts(bins, 0);
  for (double x : ratios_)
    counts[static_cast<std::size_t>(std::clamp(int((x - lo) / (hi - lo) * bins), 0, bins - 1))]++;
  const int top = *std::max_element(counts.begin(), counts.end());
  const QRectF plot = QRectF(rect()).adjusted(fh * 2.5, fh * 1.8, -fh, -fh * 2.6);
  const double bw = plot.width() / bins;
  for (int b = 0; b < bins; ++b) {
    const double centre = lo + (b + 0.5) * (hi - lo) / bins;
    const QColor c = centre < threshold_ ? work_colour::moving() : work_colour::counting();
    const double h = top > 0 ? plot.height() * counts[b] / top : 0.0;
    p.fillRect(QRectF(plot.left() + b * bw + 1, plot.bottom() - h, bw - 2, h), c);
  }
  p.setPen(palette().color(QPalette::Mid));
  p.drawLine(plot.bottomLeft(), plot.bottomRight());
  // The required ratio as a dashed line.
  const double tx = plot.left() + (threshold_ - lo) / (hi - lo) * plot.width();
  QPen dash(palette().color(QPalette::Text), 1.5, Qt::DashLine);
  p.setPen(dash);
  p.drawLine(QPointF(tx, plot.top()), QPointF(tx, plot.bottom()));
  p.setPen(palette().color(QPalette::Text));
  p.drawText(QRectF(tx + 4, plot.top(), plot.width(), fh), Qt::AlignLeft,
             tr("required %1").arg(number_text(threshold_, 2)));
  const QRectF axis(plot.left(), plot.bottom() + 2, plot.width(), fh);
  p.drawText(axis, Qt::AlignLeft, number_text(lo, 2));
  p.drawText(axis, Qt::AlignRight, number_text(hi, 2));
  p.drawText(QRectF(plot.left(), plot.bottom() + fh + 2, plot.width(), fh), Qt::AlignHCenter,
             tr("%1 runs; tallest bar %2").arg(ratios_.size()).arg(top));
}

}  // namespace gramline::gui
