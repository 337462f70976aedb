#include "margin_view.h"

#include <QBarCategoryAxis>
#include <QBarSet>
#include <QChart>
#include <QChartView>
#include <QCoreApplication>
#include <QFontMetricsF>
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

QColor class_colour(int label) { return gramline_colour::class_colour(label); }

QString percent(double fraction, int decimals = 1) {
  return QCoreApplication::translate("gramline::gui", "%1 %")
      .arg(number_text(100.0 * fraction, decimals));
}

/// Training marker: a triangle pointing up for class +1 and down for class -1, so the classes
/// differ in shape as well as in colour.
void draw_train_marker(QPainter& p, const QPointF& s, int label) {
  const QColor col = class_colour(label);
  const double k = label > 0 ? -1.0 : 1.0;
  QPainterPath t;
  t.moveTo(s + QPointF(0, 5.5 * k));
  t.lineTo(s + QPointF(5.5, -3.5 * k));
  t.lineTo(s + QPointF(-5.5, -3.5 * k));
  t.closeSubpath();
  p.setPen(QPen(col.darker(160), 1));
  p.setBrush(col);
  p.drawPath(t);
}

/// Test marker: a diamond outlined by the true class and filled on the ramp by the flip
/// probability (pale: keeps its side; dark: a coin toss or worse).
void draw_test_marker(QPainter& p, const QPointF& s, int label, const QColor& fill) {
  QPainterPath diamond;
  diamond.moveTo(s + QPointF(0, -7));
  diamond.lineTo(s + QPointF(7, 0));
  diamond.lineTo(s + QPointF(0, 7));
  diamond.lineTo(s + QPointF(-7, 0));
  diamond.closeSubpath();
  p.setPen(QPen(class_colour(label), 2.2));
  p.setBrush(fill);
  p.drawPath(diamond);
}

}  // namespace

DecisionMap::DecisionMap(QWidget* parent) : QWidget(parent) {
  setMouseTracking(true);
  setMinimumSize(280, 280);
  setAccessibleName(tr("Data and decision boundary"));
}

bool DecisionMap::plane_mode() const { return campaign_.data.feature_count() == 2; }

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
    // A faint wash of each class's colour on its side; the lines carry the decision.
    shade_ = QImage(n, n, QImage::Format_ARGB32);
    const QColor base = palette().color(QPalette::Base);
    for (int r = 0; r < n; ++r) {
      for (int c = 0; c < n; ++c) {
        const double f = grid_->values(r * n + c);
        const QColor tint = class_colour(f > 0 ? 1 : -1);
        const double a = 0.10;
        const QColor mixed = QColor::fromRgbF(base.redF() * (1 - a) + tint.redF() * a,
                                              base.greenF() * (1 - a) + tint.greenF() * a,
                                              base.blueF() * (1 - a) + tint.blueF() * a);
        shade_.setPixelColor(c, n - 1 - r, mixed);  // row 0 is y_low: bottom of the image
      }
    }
  } else if (plane_mode() && d.train_count() > 0) {
    x_low_ = std::min(d.train.col(0).minCoeff(), d.test_count() ? d.test.col(0).minCoeff() : 1e300);
    x_high_ =
        std::max(d.train.col(0).maxCoeff(), d.test_count() ? d.test.col(0).maxCoeff() : -1e300);
    y_low_ = std::min(d.train.col(1).minCoeff(), d.test_count() ? d.test.col(1).minCoeff() : 1e300);
    y_high_ =
        std::max(d.train.col(1).maxCoeff(), d.test_count() ? d.test.col(1).maxCoeff() : -1e300);
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
  if (!plane_mode()) return area;
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
  test_screen_.clear();
  if (campaign_.data.train_count() == 0) return;
  if (plane_mode())
    paint_plane(p);
  else
    paint_decision_values(p);
}

void DecisionMap::paint_plane(QPainter& p) {
  const DataSet& d = campaign_.data;
  const QRectF r = plot_rect();
  if (!shade_.isNull()) {
    p.drawImage(r,
                shade_.scaled(r.size().toSize(), Qt::IgnoreAspectRatio, Qt::SmoothTransformation));
    // Level lines by marching squares: f = 0 (the boundary) solid, f = -1 and +1 (the margin)
    // thin and dashed.
    const int n = grid_->size;
    const double cw = r.width() / (n - 1), ch = r.height() / (n - 1);
    const auto at = [&](int row, int c) { return grid_->values(row * n + c); };
    const auto point = [&](double c, double row) {
      return QPointF(r.left() + c * cw, r.bottom() - row * ch);
    };
    for (double level : {-1.0, 1.0, 0.0}) {
      QPen pen(palette().color(QPalette::Text), level == 0.0 ? 2.4 : 1.0);
      if (level != 0.0) pen.setStyle(Qt::DashLine);
      p.setPen(pen);
      for (int row = 0; row + 1 < n; ++row) {
        for (int c = 0; c + 1 < n; ++c) {
          const double v[4] = {at(row, c) - level, at(row, c + 1) - level,
                               at(row + 1, c + 1) - level, at(row + 1, c) - level};
          const QPointF corner[4] = {point(c, row), point(c + 1, row), point(c + 1, row + 1),
                                     point(c, row + 1)};
          QPointF cut[4];
          int cuts = 0;
          for (int e = 0; e < 4; ++e) {
            const double a = v[e], b = v[(e + 1) % 4];
            if ((a > 0) == (b > 0)) continue;
            const double t = a / (a - b);
            cut[cuts++] = corner[e] + t * (corner[(e + 1) % 4] - corner[e]);
          }
          if (cuts >= 2) p.drawLine(cut[0], cut[1]);
          if (cuts == 4) p.drawLine(cut[2], cut[3]);
        }
      }
    }
  }
  p.setPen(palette().color(QPalette::Mid));
  p.setBrush(Qt::NoBrush);
  p.drawRect(r);
  p.setPen(palette().color(QPalette::Text));
  const auto name = [&](int f) {
    return f < static_cast<int>(d.feature_names.size()) ? QString::fromStdString(d.feature_names[f])
                                                        : tr("feature %1").arg(f);
  };
  const double fh = fontMetrics().height();
  const QRectF below(r.left(), r.bottom() + 2, r.width(), fh);
  p.drawText(below, Qt::AlignHCenter, name(0));
  p.drawText(below, Qt::AlignLeft, number_text(x_low_, 2));
  p.drawText(below, Qt::AlignRight, number_text(x_high_, 2));
  p.save();
  p.translate(r.left() - 4, r.bottom());
  p.rotate(-90);
  p.drawText(QRectF(0, -fh, r.height(), fh), Qt::AlignHCenter, name(1));
  p.drawText(QRectF(0, -fh, r.height(), fh), Qt::AlignLeft, number_text(y_low_, 2));
  p.drawText(QRectF(0, -fh, r.height(), fh), Qt::AlignRight, number_text(y_high_, 2));
  p.restore();
  for (int i = 0; i < d.train_count(); ++i)
    draw_train_marker(p, to_screen(d.train(i, 0), d.train(i, 1)), d.train_labels(i));
  for (int i = 0; i < d.test_count(); ++i) {
    const QPointF s = to_screen(d.test(i, 0), d.test(i, 1));
    test_screen_.push_back(s);
    draw_test_marker(p, s, d.test_labels(i), flip_fill(i));
  }
}

QColor DecisionMap::flip_fill(int test_index) const {
  const double worst = 0.5;  // a flip probability of 1/2 is a coin toss
  if (check_ && static_cast<std::size_t>(test_index) < check_->trials.points.size())
    return heat_colour(std::min(
        1.0, check_->trials.points[static_cast<std::size_t>(test_index)].flip_probability.value /
                 worst));
  return palette().color(QPalette::Base);
}

void DecisionMap::paint_decision_values(QPainter& p) {
  // Any number of features: each point at its noiseless decision value f, one lane per class
  // and set. The boundary is f = 0 and the margin |f| = 1 whatever the dimension.
  const DataSet& d = campaign_.data;
  const QRectF r = plot_rect();
  const double fh = fontMetrics().height();
  if (!check_ || check_->ideal.decision_train.size() != d.train_count()) {
    p.setPen(palette().color(QPalette::Text));
    p.drawText(r, Qt::AlignCenter | Qt::TextWordWrap,
               tr("With %n feature(s) the boundary is not a line in a plane. Each point will be "
                  "placed at its decision value once the margin check is done.",
                  nullptr, d.feature_count()));
    return;
  }
  const Eigen::VectorXd& f_train = check_->ideal.decision_train;
  const Eigen::VectorXd& f_test = check_->decision_test;
  double lo = -1.5, hi = 1.5;
  for (Eigen::Index i = 0; i < f_train.size(); ++i) {
    lo = std::min(lo, f_train(i));
    hi = std::max(hi, f_train(i));
  }
  for (Eigen::Index i = 0; i < f_test.size(); ++i) {
    double sd = 0.0;
    if (static_cast<std::size_t>(i) < check_->trials.points.size())
      sd = check_->trials.points[static_cast<std::size_t>(i)].decision_sd;
    lo = std::min(lo, f_test(i) - 2 * sd);
    hi = std::max(hi, f_test(i) + 2 * sd);
  }
  const double pad = 0.05 * (hi - lo);
  lo -= pad;
  hi += pad;
  const QRectF plot = r.adjusted(fh * 5.5, 0, 0, 0);
  const auto x_of = [&](double f) { return plot.left() + (f - lo) / (hi - lo) * plot.width(); };
  // Four lanes: training +1, test +1, test -1, training -1.
  const double lane = plot.height() / 4.0;
  const auto lane_y = [&](int k, int i, int count) {
    // Spread the points of a lane over its height so equal values stay apart.
    const double t = count > 1 ? double(i % 7) / 6.0 : 0.5;
    return plot.top() + lane * k + lane * (0.2 + 0.6 * t);
  };
  p.setPen(palette().color(QPalette::Mid));
  for (int k = 1; k < 4; ++k)
    p.drawLine(QPointF(plot.left(), plot.top() + k * lane),
               QPointF(plot.right(), plot.top() + k * lane));
  p.drawRect(plot);
  const auto class_name = [&](int label) {
    return QString::fromStdString(label > 0 ? d.positive_name : d.negative_name);
  };
  p.setPen(palette().color(QPalette::Text));
  const QString lanes[4] = {tr("%1, training").arg(class_name(1)),
                            tr("%1, test").arg(class_name(1)), tr("%1, test").arg(class_name(-1)),
                            tr("%1, training").arg(class_name(-1))};
  for (int k = 0; k < 4; ++k)
    p.drawText(QRectF(0, plot.top() + k * lane, plot.left() - 6, lane),
               Qt::AlignRight | Qt::AlignVCenter | Qt::TextWordWrap, lanes[k]);
  // The boundary and the margin.
  p.setPen(QPen(palette().color(QPalette::Text), 2.4));
  p.drawLine(QPointF(x_of(0), plot.top()), QPointF(x_of(0), plot.bottom()));
  QPen dash(palette().color(QPalette::Text), 1.0, Qt::DashLine);
  p.setPen(dash);
  for (double m : {-1.0, 1.0})
    p.drawLine(QPointF(x_of(m), plot.top()), QPointF(x_of(m), plot.bottom()));
  for (int i = 0; i < d.train_count(); ++i) {
    const int label = d.train_labels(i);
    draw_train_marker(p, QPointF(x_of(f_train(i)), lane_y(label > 0 ? 0 : 3, i, d.train_count())),
                      label);
  }
  for (int i = 0; i < d.test_count() && i < f_test.size(); ++i) {
    const int label = d.test_labels(i);
    const QPointF s(x_of(f_test(i)), lane_y(label > 0 ? 1 : 2, i, d.test_count()));
    if (static_cast<std::size_t>(i) < check_->trials.points.size()) {
      const double sd = check_->trials.points[static_cast<std::size_t>(i)].decision_sd;
      p.setPen(QPen(class_colour(label), 1.2));
      p.drawLine(QPointF(x_of(f_test(i) - 2 * sd), s.y()),
                 QPointF(x_of(f_test(i) + 2 * sd), s.y()));
    }
    test_screen_.push_back(s);
    draw_test_marker(p, s, label, flip_fill(i));
  }
  p.setPen(palette().color(QPalette::Text));
  const QRectF axis(plot.left(), plot.bottom() + 2, plot.width(), fh);
  p.drawText(axis, Qt::AlignLeft, number_text(lo, 1));
  p.drawText(axis, Qt::AlignRight, number_text(hi, 1));
  p.drawText(QRectF(x_of(0) - 40, plot.bottom() + 2, 80, fh), Qt::AlignHCenter,
             QStringLiteral("0"));
  p.drawText(QRectF(0, plot.bottom() + fh + 2, width(), fh), Qt::AlignHCenter,
             tr("noiseless decision value f"));
}

void DecisionMap::mouseMoveEvent(QMouseEvent* event) {
  const DataSet& d = campaign_.data;
  const QPointF pos = event->position();
  for (std::size_t k = 0; k < test_screen_.size(); ++k) {
    const int i = static_cast<int>(k);
    if (QLineF(test_screen_[k], pos).length() > 8) continue;
    QString text =
        tr("<b>Test point %1</b> (point %2), class %3")
            .arg(i)
            .arg(d.train_count() + i)
            .arg(QString::fromStdString(d.test_labels(i) > 0 ? d.positive_name : d.negative_name));
    if (check_ && k < check_->trials.points.size()) {
      const TestPointOutcome& o = check_->trials.points[k];
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

  legend_ = new QLabel;
  legend_->setWordWrap(true);
  legend_->setTextFormat(Qt::RichText);
  legend_->setAccessibleName(tr("Legend of the margin plot"));
  auto* legend = legend_;
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

void MarginView::update_legend() {
  const DataSet& d = campaign_.data;
  const auto swatch = [](int label, const QString& shape) {
    return QStringLiteral("<span style=\"color:%1\">%2</span>")
        .arg(gramline_colour::class_colour(label).name(), shape);
  };
  const QString pos = QString::fromStdString(d.positive_name).toHtmlEscaped();
  const QString neg = QString::fromStdString(d.negative_name).toHtmlEscaped();
  QString text = tr("%1 %2 and %3 %4: training points of each class. %5 Test points, outlined "
                    "by their class, filled pale when they keep their side and dark when noise "
                    "flips them.")
                     .arg(swatch(1, QStringLiteral("▲")), pos, swatch(-1, QStringLiteral("▼")), neg,
                          QStringLiteral("◇"));
  if (d.feature_count() == 2)
    text += QLatin1Char(' ') + tr("Solid line: the noiseless decision boundary f = 0; dashed: "
                                  "the margin f = ±1; the faint wash shows each class's side.");
  else
    text += QLatin1Char(' ') +
            tr("With %n feature(s) no plane shows the boundary honestly: every point sits at its "
               "noiseless decision value f, the boundary is f = 0 (solid) and the margin f = ±1 "
               "(dashed); bars on test points span ± 2 noise sd of f.",
               nullptr, d.feature_count());
  legend_->setText(text);
}

void MarginView::set_campaign(const Campaign& campaign) {
  campaign_ = campaign;
  update_legend();
  if (!check_) map_->set_content(campaign_, nullptr, nullptr);
}

void MarginView::set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign) {
  plan_ = std::move(plan);
  campaign_ = campaign;
  update_legend();
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
  const QStringList reasons = reason_texts(m);
  if (!reasons.isEmpty()) {
    verdict += QStringLiteral("<ul>");
    for (const QString& r : reasons)
      verdict += QStringLiteral("<li>%1</li>").arg(r.toHtmlEscaped());
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

QStringList MarginView::reason_texts(const MarginCheck& m) const {
  // The engine's judge() decides; the words and numbers are the user's language and locale.
  QStringList out;
  const CheckSettings& c = campaign_.check;
  const int train = campaign_.data.train_count();
  for (const TestPointOutcome& o : m.trials.points) {
    if (o.flip_probability.value <= c.flip_threshold) continue;
    QString why = tr("test point %1 (point %2): the label flips in %3 of runs (%4 – %5), above "
                     "%6; noiseless f = %7, noise sd of f = %8")
                      .arg(o.test_index)
                      .arg(train + o.test_index)
                      .arg(percent(o.flip_probability.value, 2))
                      .arg(percent(o.flip_probability.low, 2))
                      .arg(percent(o.flip_probability.high, 2))
                      .arg(percent(c.flip_threshold, 2))
                      .arg(number_text(o.decision_ideal, 4))
                      .arg(number_text(o.decision_sd, 4));
    if (o.decision_sd > 0)
      why += tr(" (%1 sd from the boundary)")
                 .arg(number_text(std::abs(o.decision_ideal) / o.decision_sd, 2));
    out << why;
  }
  if (m.trials.margin_ratio_median.value < c.margin_ratio_threshold) {
    out << tr("median margin ratio %1 is below %2: the measured Gram matrix shrinks the margin")
               .arg(number_text(m.trials.margin_ratio_median.value, 3))
               .arg(number_text(c.margin_ratio_threshold, 2));
  }
  // Anything else the engine found (a reason added there later) in its own words.
  if (out.isEmpty() && !m.verdict.reasons.empty())
    for (const std::string& r : m.verdict.reasons) out << QString::fromStdString(r);
  return out;
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
  // The title may wrap (long in some languages): the plot starts below it.
  const QString title = tr("Margin ratio per simulated run (noisy margin ÷ noiseless)");
  const QRectF title_box = QFontMetricsF(bold).boundingRect(
      QRectF(4, 2, width() - 8, 4 * fh), Qt::AlignHCenter | Qt::TextWordWrap, title);
  p.drawText(QRectF(4, 2, width() - 8, title_box.height() + 2), Qt::AlignHCenter | Qt::TextWordWrap,
             title);
  p.setFont(font());
  const double title_h = title_box.height() + 4;
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
  const QRectF plot = QRectF(rect()).adjusted(fh * 2.5, title_h + fh * 0.6, -fh, -fh * 2.6);
  const double bw = plot.width() / bins;
  for (int b = 0; b < bins; ++b) {
    const double centre = lo + (b + 0.5) * (hi - lo) / bins;
    const QColor c = centre < threshold_ ? gramline_colour::alert() : gramline_colour::pass();
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
