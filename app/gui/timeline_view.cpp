#include "timeline_view.h"

#include <QBarCategoryAxis>
#include <QBarSet>
#include <QChart>
#include <QChartView>
#include <QComboBox>
#include <QHBoxLayout>
#include <QHorizontalStackedBarSeries>
#include <QLabel>
#include <QLineSeries>
#include <QLogValueAxis>
#include <QSplitter>
#include <QVBoxLayout>
#include <QValueAxis>
#include <algorithm>
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

TimelineView::TimelineView(QWidget* parent) : QWidget(parent) {
  nights_view_ = new QChartView;
  nights_view_->setRenderHint(QPainter::Antialiasing);
  nights_view_->setAccessibleName(tr("Time use per night"));
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
  split->addWidget(nights_view_);
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
  auto* chart = new QChart;
  chart->setTitle(tr("Where each night's window goes (hours)"));
  if (plan_) {
    const auto nights = night_breakdown(*plan_, campaign_.nights);
    auto* series = new QHorizontalStackedBarSeries;
    struct Part {
      QString name;
      QColor colour;
      double NightBreakdown::*field;
    };
    const Part parts[] = {
        {tr("moving"), work_colour::moving(), &NightBreakdown::moving_s},
        {tr("counting"), work_colour::counting(), &NightBreakdown::counting_s},
        {tr("references"), work_colour::reference(), &NightBreakdown::reference_s},
        {tr("dark"), work_colour::dark(), &NightBreakdown::dark_s},
        {tr("park"), work_colour::park(), &NightBreakdown::park_s},
    };
    QStringList categories;
    for (const NightBreakdown& n : nights) categories << tr("Night %1").arg(n.night);
    for (const Part& p : parts) {
      auto* set = new QBarSet(p.name);
      set->setColor(p.colour);
      set->setBorderColor(p.colour);
      for (const NightBreakdown& n : nights) *set << n.*(p.field) / 3600.0;
      series->append(set);
    }
    auto* idle = new QBarSet(tr("unused window"));
    QColor idle_colour = palette().color(QPalette::Text);
    idle_colour.setAlphaF(0.10);
    idle->setColor(idle_colour);
    idle->setBorderColor(palette().color(QPalette::Mid));
    for (const NightBreakdown& n : nights) *idle << n.idle_s() / 3600.0;
    series->append(idle);
    series->setBarWidth(0.6);
    chart->addSeries(series);
    auto* axis_y = new QBarCategoryAxis;
    // Night 1 on top reads like a calendar.
    std::reverse(categories.begin(), categories.end());
    axis_y->append(categories);
    axis_y->setReverse(true);
    axis_y->setCategories(categories);
    auto* axis_x = new QValueAxis;
    axis_x->setRange(0.0, campaign_.nights.length_s() / 3600.0);
    const int end_min = campaign_.nights.end_min;
    axis_x->setTitleText(tr("hours after the window opens; the bars end where it closes (%1)")
                             .arg(QStringLiteral("%1:%2")
                                      .arg(end_min / 60, 2, 10, QLatin1Char('0'))
                                      .arg(end_min % 60, 2, 10, QLatin1Char('0'))));
    axis_x->setLabelFormat(QStringLiteral("%.0f"));
    axis_x->setTickType(QValueAxis::TicksDynamic);
    axis_x->setTickInterval(1.0);
    axis_x->setTickAnchor(0.0);
    chart->addAxis(axis_x, Qt::AlignBottom);
    chart->addAxis(axis_y, Qt::AlignLeft);
    series->attachAxis(axis_x);
    series->attachAxis(axis_y);
    chart->legend()->setAlignment(Qt::AlignBottom);
  }
  style_chart(chart, palette());
  QChart* old = nights_view_->chart();
  nights_view_->setChart(chart);
  delete old;
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
