#include "timeline_view.h"

#include <QChart>
#include <QChartView>
#include <QComboBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineSeries>
#include <QLogValueAxis>
#include <QMouseEvent>
#include <QPainter>
#include <QScrollArea>
#include <QSplitter>
#include <QToolTip>
#include <QVBoxLayout>
#include <QValueAxis>
#include <algorithm>
#include <array>
#include <cmath>

#include "chart_style.h"
#include "gui_text.h"

namespace gramline::gui {

double NightBreakdown::idle_s() const {
  return std::max(0.0, window_s - moving_s - counting_s - reference_s - dark_s - park_s);
}

std::vector<NightBreakdown> night_breakdown(const Plan& plan, const NightWindow& nights) {
  std::vector<NightBreakdown> out(static_cast<std::size_t>(std::max(0, plan.summary.nights)));
  for (std::size_t i = 0; i < out.size(); ++i) {
    out[i].night = static_cast<int>(i) + 1;
    out[i].window_s = nights.length_s();
  }
  for (const Step& s : plan.steps) {
    if (s.night < 1) continue;
    if (static_cast<std::size_t>(s.night) > out.size()) {
      out.resize(static_cast<std::size_t>(s.night));
      for (std::size_t i = 0; i < out.size(); ++i) {
        out[i].night = static_cast<int>(i) + 1;
        out[i].window_s = nights.length_s();
      }
    }
    NightBreakdown& n = out[static_cast<std::size_t>(s.night - 1)];
    switch (s.kind) {
      case StepKind::measure:
        n.moving_s += s.move_s;
        n.counting_s += s.dwell_s;
        break;
      case StepKind::reference:
        n.reference_s += s.move_s + s.dwell_s;
        break;
      case StepKind::dark:
        n.dark_s += s.move_s + s.dwell_s;
        break;
      case StepKind::park:
        n.park_s += s.move_s + s.dwell_s;
        break;
    }
  }
  return out;
}

namespace {

enum Category { kMoving, kCounting, kReference, kDark, kPark, kCategories };

QColor category_colour(int c) {
  switch (c) {
    case kMoving:
      return work_colour::moving();
    case kCounting:
      return work_colour::counting();
    case kReference:
      return work_colour::reference();
    case kDark:
      return work_colour::dark();
    default:
      return work_colour::park();
  }
}

QString category_text(int c) {
  switch (c) {
    case kMoving:
      return TimelineView::tr("moving");
    case kCounting:
      return TimelineView::tr("counting");
    case kReference:
      return TimelineView::tr("references");
    case kDark:
      return TimelineView::tr("dark");
    case kPark:
      return TimelineView::tr("park");
    default:
      return TimelineView::tr("unused window");
  }
}

int dwell_category(StepKind kind) {
  switch (kind) {
    case StepKind::measure:
      return kCounting;
    case StepKind::reference:
      return kReference;
    case StepKind::dark:
      return kDark;
    case StepKind::park:
      return kPark;
  }
  return kCounting;
}

}  // namespace

NightStrips::NightStrips(QWidget* parent) : QWidget(parent) {
  setMouseTracking(true);
  setAccessibleName(tr("Each night as it runs"));
  setSizePolicy(QSizePolicy::Expanding, QSizePolicy::Preferred);
}

int NightStrips::row_height() const { return fontMetrics().height() * 2; }

int NightStrips::label_width() const {
  int w = 0;
  for (int n = 1; n <= night_count_; ++n) {
    const QString date = QLocale().toString(step_clock(nights_, (n - 1) * 86400.0).date(),
                                            QStringLiteral("ddd d MMM"));
    w = std::max({w, fontMetrics().horizontalAdvance(tr("Night %1").arg(n)),
                  fontMetrics().horizontalAdvance(date)});
  }
  return w + 12;
}

QSize NightStrips::sizeHint() const {
  const int fh = fontMetrics().height();
  return {600, fh * 3 + row_height() * std::max(1, night_count_) + fh * 4};
}

QSize NightStrips::minimumSizeHint() const { return {300, sizeHint().height()}; }

QRect NightStrips::strips_rect() const {
  const int fh = fontMetrics().height();
  const int right_w =
      fontMetrics().horizontalAdvance(tr("%1 % busy").arg(number_text(100, 0))) + 12;
  return QRect(label_width(), fh * 2, std::max(10, width() - label_width() - right_w - 4),
               row_height() * night_count_);
}

void NightStrips::set_plan(std::shared_ptr<const Plan> plan, const NightWindow& nights) {
  plan_ = std::move(plan);
  nights_ = nights;
  night_count_ = plan_ ? plan_->summary.nights : 0;
  if (plan_)
    for (const Step& s : plan_->steps) night_count_ = std::max(night_count_, s.night);
  breakdown_ = plan_ ? night_breakdown(*plan_, nights_) : std::vector<NightBreakdown>{};
  binned_width_ = -1;
  updateGeometry();
  update();
}

void NightStrips::bin(int width) {
  binned_width_ = width;
  pixels_.assign(static_cast<std::size_t>(night_count_), std::vector<signed char>());
  if (!plan_ || width <= 0) return;
  const double window_s = std::max(1.0, nights_.length_s());
  const double px_s = window_s / width;
  // Seconds of each category under each pixel; the pixel shows the category with most.
  std::vector<std::vector<std::array<double, kCategories>>> seconds(
      static_cast<std::size_t>(night_count_),
      std::vector<std::array<double, kCategories>>(static_cast<std::size_t>(width)));
  const auto add = [&](int night, double from_s, double to_s, int category) {
    auto& row = seconds[static_cast<std::size_t>(night - 1)];
    from_s = std::max(0.0, from_s);
    to_s = std::min(window_s, to_s);
    while (from_s < to_s) {
      const int px = std::min(width - 1, static_cast<int>(from_s / px_s));
      const double end = std::min(to_s, (px + 1) * px_s);
      row[static_cast<std::size_t>(px)][static_cast<std::size_t>(category)] += end - from_s;
      if (end <= from_s) break;
      from_s = end;
    }
  };
  for (const Step& s : plan_->steps) {
    if (s.night < 1 || s.night > night_count_) continue;
    const double t0 = s.start_s - (s.night - 1) * 86400.0;  // seconds after the window opens
    add(s.night, t0, t0 + s.move_s, kMoving);
    add(s.night, t0 + s.move_s, t0 + s.move_s + s.dwell_s, dwell_category(s.kind));
  }
  for (int n = 0; n < night_count_; ++n) {
    auto& out = pixels_[static_cast<std::size_t>(n)];
    out.assign(static_cast<std::size_t>(width), -1);
    for (int x = 0; x < width; ++x) {
      const auto& cell = seconds[static_cast<std::size_t>(n)][static_cast<std::size_t>(x)];
      double total = 0.0, best = 0.0;
      int which = -1;
      for (int c = 0; c < kCategories; ++c) {
        total += cell[static_cast<std::size_t>(c)];
        if (cell[static_cast<std::size_t>(c)] > best) {
          best = cell[static_cast<std::size_t>(c)];
          which = c;
        }
      }
      // A pixel mostly idle stays empty.
      if (total >= 0.5 * px_s) out[static_cast<std::size_t>(x)] = static_cast<signed char>(which);
    }
  }
}

int NightStrips::kind_at(const QPoint& pos) const {
  const QRect r = strips_rect();
  if (!r.contains(pos) || binned_width_ != r.width()) return -1;
  const int n = (pos.y() - r.top()) / row_height();
  const int y_in = (pos.y() - r.top()) % row_height();
  if (n < 0 || n >= night_count_ || y_in < row_height() / 5 || y_in > row_height() * 4 / 5)
    return -1;
  const int c = pixels_[static_cast<std::size_t>(n)][static_cast<std::size_t>(pos.x() - r.left())];
  return c < 0 ? kCategories : c;
}

void NightStrips::paintEvent(QPaintEvent*) {
  QPainter p(this);
  p.fillRect(rect(), palette().color(QPalette::Base));
  const QColor text = palette().color(QPalette::Text);
  const int fh = fontMetrics().height();
  QFont bold = font();
  bold.setBold(true);
  p.setFont(bold);
  p.setPen(text);
  p.drawText(QRect(0, 2, width(), fh + 2), Qt::AlignHCenter,
             tr("Each night as it runs: every step at its time, coloured by what the rig does"));
  p.setFont(font());
  if (!plan_ || night_count_ == 0) return;
  const QRect r = strips_rect();
  if (binned_width_ != r.width()) bin(r.width());
  const int rh = row_height();
  QColor idle = text;
  idle.setAlphaF(0.07);
  // Hour grid with the clock time at each full hour.
  const double window_s = std::max(1.0, nights_.length_s());
  const double first_hour_s =
      std::ceil(nights_.start_min / 60.0) * 3600.0 - nights_.start_min * 60.0;
  QColor grid = text;
  grid.setAlphaF(0.18);
  const int label_every = r.width() / std::max(1.0, window_s / 3600.0) < fh * 3 ? 2 : 1;
  int hour_index = 0;
  for (double t = first_hour_s; t <= window_s + 1e-6; t += 3600.0, ++hour_index) {
    const int x = r.left() + static_cast<int>(t / window_s * r.width());
    p.setPen(grid);
    p.drawLine(x, r.top(), x, r.bottom());
    if (hour_index % label_every) continue;
    p.setPen(text);
    const int minutes = (nights_.start_min + static_cast<int>(std::lround(t / 60.0))) % 1440;
    p.drawText(QRect(x - fh * 2, r.bottom() + 3, fh * 4, fh), Qt::AlignHCenter,
               QStringLiteral("%1:%2")
                   .arg(minutes / 60, 2, 10, QLatin1Char('0'))
                   .arg(minutes % 60, 2, 10, QLatin1Char('0')));
  }
  for (int n = 0; n < night_count_; ++n) {
    const int y = r.top() + n * rh;
    const QRect bar(r.left(), y + rh / 5, r.width(), rh * 3 / 5);
    p.fillRect(bar, idle);
    const auto& row = pixels_[static_cast<std::size_t>(n)];
    for (int x = 0; x < r.width();) {
      const int c = row[static_cast<std::size_t>(x)];
      int end = x + 1;
      while (end < r.width() && row[static_cast<std::size_t>(end)] == c) ++end;
      if (c >= 0)
        p.fillRect(QRect(bar.left() + x, bar.top(), end - x, bar.height()), category_colour(c));
      x = end;
    }
    p.setPen(text);
    const QString date =
        QLocale().toString(step_clock(nights_, n * 86400.0).date(), QStringLiteral("ddd d MMM"));
    p.drawText(QRect(0, y, r.left() - 8, rh / 2 + 2), Qt::AlignRight | Qt::AlignBottom,
               tr("Night %1").arg(n + 1));
    QColor faint = text;
    faint.setAlphaF(0.7);
    p.setPen(faint);
    p.drawText(QRect(0, y + rh / 2, r.left() - 8, rh / 2), Qt::AlignRight | Qt::AlignTop, date);
    p.setPen(text);
    if (static_cast<std::size_t>(n) < breakdown_.size()) {
      const NightBreakdown& b = breakdown_[static_cast<std::size_t>(n)];
      const double busy = b.window_s > 0 ? 1.0 - b.idle_s() / b.window_s : 0.0;
      p.drawText(QRect(r.right() + 8, y, width() - r.right() - 8, rh),
                 Qt::AlignLeft | Qt::AlignVCenter,
                 tr("%1 % busy").arg(number_text(100.0 * busy, 0)));
    }
  }
  // Legend: each kind with its share of the busy time over all nights.
  double totals[kCategories] = {};
  for (const NightBreakdown& b : breakdown_) {
    totals[kMoving] += b.moving_s;
    totals[kCounting] += b.counting_s;
    totals[kReference] += b.reference_s;
    totals[kDark] += b.dark_s;
    totals[kPark] += b.park_s;
  }
  double busy_s = 0.0;
  for (double t : totals) busy_s += t;
  int x = r.left();
  int y = r.bottom() + fh + 8;
  for (int c = 0; c < kCategories; ++c) {
    const QString label = tr("%1 %2 %")
                              .arg(category_text(c))
                              .arg(number_text(busy_s > 0 ? 100.0 * totals[c] / busy_s : 0.0, 1));
    const int w = fh + 6 + fontMetrics().horizontalAdvance(label) + fh;
    if (x + w > width() && x > r.left()) {
      x = r.left();
      y += fh + 4;
    }
    p.fillRect(QRect(x, y + 2, fh - 4, fh - 4), category_colour(c));
    p.setPen(text);
    p.drawText(QRect(x + fh, y, w, fh), Qt::AlignLeft | Qt::AlignVCenter, label);
    x += w;
  }
  p.drawText(QRect(r.left(), y + fh + 2, r.width(), fh), Qt::AlignLeft,
             tr("Shares of the busy time; the strips span the window from %1 to %2.")
                 .arg(QStringLiteral("%1:%2")
                          .arg(nights_.start_min / 60, 2, 10, QLatin1Char('0'))
                          .arg(nights_.start_min % 60, 2, 10, QLatin1Char('0')),
                      QStringLiteral("%1:%2")
                          .arg((nights_.end_min / 60) % 24, 2, 10, QLatin1Char('0'))
                          .arg(nights_.end_min % 60, 2, 10, QLatin1Char('0'))));
}

void NightStrips::mouseMoveEvent(QMouseEvent* event) {
  const QPoint pos = event->position().toPoint();
  const int c = kind_at(pos);
  if (c < 0) {
    QToolTip::hideText();
    return;
  }
  const QRect r = strips_rect();
  const int night = (pos.y() - r.top()) / row_height() + 1;
  const double t = double(pos.x() - r.left()) / r.width() * nights_.length_s();
  QToolTip::showText(event->globalPosition().toPoint(),
                     tr("Night %1, %2: %3")
                         .arg(night)
                         .arg(clock_text(nights_, (night - 1) * 86400.0 + t))
                         .arg(category_text(c)),
                     this);
}

TimelineView::TimelineView(QWidget* parent) : QWidget(parent) {
  strips_ = new NightStrips;
  strips_scroll_ = new QScrollArea;
  strips_scroll_->setWidget(strips_);
  strips_scroll_->setWidgetResizable(true);
  strips_scroll_->setFrameShape(QFrame::NoFrame);
  progress_view_ = new QChartView;
  progress_view_->setRenderHint(QPainter::Antialiasing);
  progress_view_->setAccessibleName(tr("Gram matrix progress over the night"));

  night_ = new QComboBox;
  night_->setAccessibleName(tr("Night shown in the progress chart"));
  note_ = new QLabel;
  note_->setWordWrap(true);
  note_->setForegroundRole(QPalette::PlaceholderText);

  auto* lower = new QWidget;
  auto* ll = new QVBoxLayout(lower);
  ll->setContentsMargins(0, 0, 0, 0);
  auto* row = new QHBoxLayout;
  row->addWidget(new QLabel(tr("Progress during")));
  row->addWidget(night_);
  row->addStretch(1);
  ll->addLayout(row);
  ll->addWidget(progress_view_, 1);
  ll->addWidget(note_);

  auto* split = new QSplitter(Qt::Vertical);
  split->addWidget(strips_scroll_);
  split->addWidget(lower);
  split->setStretchFactor(0, 2);
  split->setStretchFactor(1, 3);
  auto* layout = new QVBoxLayout(this);
  layout->addWidget(split);
  connect(night_, &QComboBox::currentIndexChanged, this, [this] { draw_progress(); });
}

void TimelineView::set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign) {
  plan_ = std::move(plan);
  campaign_ = campaign;
  progress_ = plan_ ? gram_progress(*plan_) : std::vector<GramProgressPoint>{};
  {
    const QSignalBlocker block(night_);
    const int keep = std::max(0, night_->currentIndex());
    night_->clear();
    const int nights = plan_ ? plan_->summary.nights : 0;
    for (int n = 1; n <= nights; ++n)
      night_->addItem(tr("night %1 (%2)")
                          .arg(n)
                          .arg(QLocale().toString(
                              step_clock(campaign.nights, campaign.nights.night_start_s(n)).date(),
                              QLocale::ShortFormat)),
                      n);
    night_->setCurrentIndex(std::min(keep, night_->count() - 1));
  }
  drawn_ = false;
  // The first charts are drawn at once all the same: the splitter sizes itself to them when it
  // is first shown.
  if (isVisible() || !ever_drawn_) draw();
}

void TimelineView::showEvent(QShowEvent* event) {
  QWidget::showEvent(event);
  if (!drawn_) draw();
}

void TimelineView::draw() {
  draw_nights();
  draw_progress();
  drawn_plan_ = plan_;
  drawn_ = ever_drawn_ = true;
}

void TimelineView::draw_nights() {
  strips_->set_plan(plan_, campaign_.nights);
  // Every night's strip in view up to a dozen nights; more scroll.
  strips_scroll_->setMinimumHeight(
      std::min(strips_->sizeHint().height(), strips_->fontMetrics().height() * 34) + 4);
}

void TimelineView::draw_progress() {
  auto* chart = new QChart;
  const int night = night_->currentData().toInt();
  if (plan_ && night >= 1 && !progress_.empty()) {
    chart->setTitle(tr("Night %1: share of the training Gram matrix measured, and its predicted "
                       "error")
                        .arg(night));
    const double night_start_s = campaign_.nights.night_start_s(night);
    const double night_end_s = night_start_s + campaign_.nights.length_s();
    auto* share = new QLineSeries;
    share->setName(tr("entries measured (%, left)"));
    share->setColor(work_colour::counting());
    auto* error = new QLineSeries;
    error->setName(tr("predicted Gram error σ_F (right)"));
    error->setColor(work_colour::moving());
    // x: hours after this night's window opens, the same axis as the chart above.
    const auto ms = [night_start_s](double s) { return (s - night_start_s) / 3600.0; };
    // Carry the previous night's end state into this night's start.
    std::size_t first = 0;
    while (first < progress_.size() && progress_[first].night < night) ++first;
    const GramProgressPoint start = first > 0 ? progress_[first - 1] : progress_.front();
    share->append(ms(night_start_s), 100.0 * start.share_done);
    error->append(ms(night_start_s), start.sigma_frobenius);
    std::size_t last = first;
    while (last < progress_.size() && progress_[last].night == night) ++last;
    // At most ~1500 points per series: charts stay quick with hundreds of thousands of steps.
    const std::size_t stride = std::max<std::size_t>(1, (last - first) / 1500);
    for (std::size_t i = first; i < last; i += stride) {
      share->append(ms(progress_[i].end_s), 100.0 * progress_[i].share_done);
      error->append(ms(progress_[i].end_s), progress_[i].sigma_frobenius);
    }
    if (last > first) {
      share->append(ms(progress_[last - 1].end_s), 100.0 * progress_[last - 1].share_done);
      error->append(ms(progress_[last - 1].end_s), progress_[last - 1].sigma_frobenius);
    }
    auto* end_line = new QLineSeries;
    end_line->setName(tr("window closes"));
    chart->legend()->setShowToolTips(true);
    QPen pen(palette().color(QPalette::Text));
    pen.setStyle(Qt::DashLine);
    end_line->setPen(pen);
    end_line->append(ms(night_end_s), 0.0);
    end_line->append(ms(night_end_s), 100.0);
    // The error falls by orders of magnitude: a log axis shows the whole night.
    for (const QPointF& pt : error->points())
      if (!(pt.y() > 0)) error->replace(pt, QPointF(pt.x(), 1e-6));

    chart->addSeries(share);
    chart->addSeries(error);
    chart->addSeries(end_line);
    auto* axis_t = new QValueAxis;
    axis_t->setRange(0.0, (night_end_s - night_start_s) / 3600.0 + 0.25);
    axis_t->setTickType(QValueAxis::TicksDynamic);
    axis_t->setTickAnchor(0.0);
    axis_t->setTickInterval(1.0);
    axis_t->setLabelFormat(QStringLiteral("%.0f"));
    axis_t->setTitleText(tr("hours after the window opens (%1); dashed: the window closes")
                             .arg(QLocale().toString(step_clock(campaign_.nights, night_start_s),
                                                     QStringLiteral("ddd d MMM HH:mm"))));
    auto* axis_share = new QValueAxis;
    axis_share->setRange(0.0, 100.0);
    axis_share->setLabelFormat(QStringLiteral("%.0f %%"));
    axis_share->setTitleText(tr("measured"));
    auto* axis_error = new QLogValueAxis;
    double err_min = progress_.front().sigma_frobenius;
    for (const GramProgressPoint& pp : progress_) err_min = std::min(err_min, pp.sigma_frobenius);
    axis_error->setRange(std::max(1e-6, err_min * 0.5), progress_.front().sigma_frobenius * 1.5);
    axis_error->setLabelFormat(QStringLiteral("%.3g"));
    axis_error->setTitleText(tr("σ_F (log scale)"));
    chart->addAxis(axis_t, Qt::AlignBottom);
    chart->addAxis(axis_share, Qt::AlignLeft);
    chart->addAxis(axis_error, Qt::AlignRight);
    for (QLineSeries* s : {share, end_line}) {
      s->attachAxis(axis_t);
      s->attachAxis(axis_share);
    }
    error->attachAxis(axis_t);
    error->attachAxis(axis_error);
    chart->legend()->setAlignment(Qt::AlignBottom);
    note_->setText(tr("σ_F is the Frobenius norm of the per-entry standard deviation of the "
                      "training Gram matrix if the run stopped at that moment; an entry not yet "
                      "measured counts as ± 0.5. At the end it equals the Summary's Gram error "
                      "(%1).")
                       .arg(number_text(plan_->summary.gram_sigma_frobenius, 4)));
  } else {
    note_->clear();
  }
  style_chart(chart, palette());
  QChart* old = progress_view_->chart();
  progress_view_->setChart(chart);
  delete old;
}

}  // namespace gramline::gui
