#include "summary_view.h"

#include <QFontDatabase>
#include <QFrame>
#include <QGridLayout>
#include <QHash>
#include <QLabel>
#include <QPlainTextEdit>
#include <QScrollArea>
#include <QVBoxLayout>
#include <cmath>

#include "chart_style.h"
#include "figure_grid.h"
#include "gramline/compare.h"
#include "gui_text.h"

namespace gramline::gui {

SummaryView::SummaryView(QWidget* parent) : QWidget(parent) {
  verdict_ = new QLabel;
  verdict_->setWordWrap(true);
  QFont big = font();
  big.setPointSizeF(big.pointSizeF() * 1.35);
  big.setBold(true);
  verdict_->setFont(big);
  verdict_->setAccessibleName(tr("Plan verdict"));
  margin_verdict_ = new QLabel(tr("Margin check: not computed yet."));
  margin_verdict_->setWordWrap(true);
  margin_verdict_->setAccessibleName(tr("Margin verdict"));
  plate_warning_ = new QLabel;
  plate_warning_->setWordWrap(true);
  plate_warning_->setAccessibleName(tr("Plate warning"));
  plate_warning_->setVisible(false);

  figures_ = new FigureGrid(3, 1.6);
  figures_->grid()->setVerticalSpacing(14);

  figures_->add("nights", tr("Nights"), tr("Nights the plan needs, out of the nights allowed"));
  figures_->add("total", tr("Calendar span"),
                tr("From the start of night 1 to the end of the last step, days between the "
                   "nights included"));
  figures_->add("busy", tr("Busy time"),
                tr("Time the rig works: moving, counting and reference steps, over all nights"));
  figures_->add("settings", tr("Settings to measure"),
                tr("Kernel entries measured (training pairs and test × training)"));
  figures_->add("motor_share", tr("Motor share"), tr("Share of the busy time spent moving plates"));
  figures_->add("gain", tr("Gain over naive order"),
                tr("Motor time of the row-by-row order divided by that of this plan"));
  figures_->add("gap", tr("Gap to lower bound"),
                tr("How far the measure steps' motor time is above a proven lower bound"));
  figures_->add("gram", tr("Gram error (Frobenius σ)"),
                tr("Predicted standard deviation of the whole training Gram matrix"));
  figures_->add("negative", tr("Chance of a negative eigenvalue"),
                tr("Probability the measured Gram matrix is not positive semidefinite"));
  figures_->add("pairs", tr("Detected pairs"), tr("Pairs over all steps"));
  figures_->add("plates", tr("Plate bias"),
                tr("Largest difference between the kernel the real plates realise and the ideal "
                   "one; more pairs do not reduce it"));
  figures_->add("counting", tr("Counting time"), tr("Dwell of the measure steps"));
  figures_->add("moving", tr("Moving time"), tr("Motor time of all steps, settle and overhead"));
  figures_->add("plan_ms", tr("Planning took"), tr("Wall time of the last planning run"));

  report_ = new QPlainTextEdit;
  report_->setReadOnly(true);
  report_->setAccessibleName(tr("Engine report"));
  report_->setFont(QFontDatabase::systemFont(QFontDatabase::FixedFont));
  report_->setMaximumHeight(report_->fontMetrics().height() * 14);

  auto* inner = new QWidget;
  auto* layout = new QVBoxLayout(inner);
  layout->addWidget(verdict_);
  layout->addWidget(margin_verdict_);
  layout->addWidget(plate_warning_);
  auto* line = new QFrame;
  line->setFrameShape(QFrame::HLine);
  line->setFrameShadow(QFrame::Sunken);
  layout->addWidget(line);
  layout->addWidget(figures_);
  layout->addWidget(new QLabel(tr("The same report as the command line prints:")));
  layout->addWidget(report_);
  layout->addStretch(1);

  auto* scroll = new QScrollArea;
  scroll->setWidget(inner);
  scroll->setWidgetResizable(true);
  scroll->setFrameShape(QFrame::NoFrame);
  auto* outer = new QVBoxLayout(this);
  outer->setContentsMargins(0, 0, 0, 0);
  outer->addWidget(scroll);
}

void SummaryView::set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign) {
  if (!plan) {
    figures_->clear_all();
    verdict_->setText(tr("No plan yet."));
    report_->clear();
    return;
  }
  const PlanSummary& s = plan->summary;
  const auto set = [this](const char* key, const QString& value, const QString& note = {}) {
    figures_->set(key, value, note);
  };
  const int allowed = campaign.nights.max_nights;
  if (s.fits) {
    const QString end = end_text(campaign.nights, s.total_s);
    verdict_->setText(tr("Fits in %n night(s) (of %1 allowed), done by %2.", nullptr, s.nights)
                          .arg(allowed)
                          .arg(end));
  } else {
    verdict_->setText(
        tr("Does not fit in %n night(s): more nights, fewer pairs or a looser "
           "precision are needed.",
           nullptr, allowed));
  }
  set("nights", tr("%1 of %2").arg(s.nights).arg(allowed));
  set("total", duration_text(s.total_s),
      tr("calendar time from the first night's start; ends %1")
          .arg(end_text(campaign.nights, s.total_s)));
  set("settings", count_text(static_cast<double>(s.settings)),
      tr("%1 steps in all").arg(count_text(static_cast<double>(s.steps))));
  const double busy_s = busy_time_s(s);
  set("busy", duration_text(busy_s),
      tr("%n night(s) at work", nullptr, static_cast<int>(s.night_use.size())));
  set("motor_share",
      busy_s > 0 ? tr("%1 %").arg(number_text(100.0 * s.move_s / busy_s, 1)) : QStringLiteral("–"),
      tr("%1 moving of %2 busy").arg(duration_text(s.move_s), duration_text(busy_s)));
  if (s.measure_move_s > 0 && s.move_naive_s > 0) {
    set("gain", tr("%1 ×").arg(number_text(s.move_naive_s / s.measure_move_s, 2)),
        tr("saves %1 of motor time").arg(duration_text(s.move_naive_s - s.measure_move_s)));
  } else {
    set("gain", QStringLiteral("–"));
  }
  if (s.move_lower_bound_s > 0) {
    set("gap",
        tr("%1 %").arg(number_text(100.0 * (s.measure_move_s / s.move_lower_bound_s - 1.0), 1)),
        tr("bound %1, plan %2")
            .arg(duration_text(s.move_lower_bound_s), duration_text(s.measure_move_s)));
  } else {
    set("gap", QStringLiteral("–"));
  }
  set("gram", number_text(s.gram_sigma_frobenius, 4),
      tr("largest entry σ %1, spectral ≈ %2")
          .arg(number_text(plan->gram_error.sigma_max, 4))
          .arg(number_text(plan->gram_error.spectral_estimate, 4)));
  set("negative", tr("%1 %").arg(number_text(100.0 * plan->gram_error.p_negative_eigenvalue, 2)),
      std::abs(plan->gram_error.min_eigenvalue) < 1e-3
          ? tr("the ideal matrix is nearly singular (smallest eigenvalue %1), so noise almost "
               "surely makes one negative; the margin check repairs this")
                .arg(QLocale().toString(plan->gram_error.min_eigenvalue, 'g', 2))
          : tr("smallest ideal eigenvalue %1")
                .arg(number_text(plan->gram_error.min_eigenvalue, 4)));
  set("pairs", count_text(s.pairs_total),
      s.epsilon_reached > 0
          ? tr("kernel half-width reached ±%1").arg(number_text(s.epsilon_reached, 4))
          : QString());
  set("plates", number_text(s.kernel_bias_max, 4),
      tr("shot noise ±%1; random offsets add σ %2")
          .arg(number_text(s.epsilon_reached, 4), number_text(s.kernel_spread_max, 4)));
  plate_warning_->setVisible(s.plate_bias_exceeds_target());
  plate_warning_->setText(
      tr("The plate bias %1 exceeds the target precision ±%2: more pairs will not help; "
         "calibrate the plates.")
          .arg(number_text(s.kernel_bias_max, 4), number_text(s.target_epsilon, 4)));
  set("counting", duration_text(s.integration_s));
  set("moving", duration_text(s.move_s));
  set("plan_ms", tr("%1 ms").arg(number_text(s.plan_ms, 0)));
  report_->setPlainText(QString::fromStdString(plan->report()));
}

void SummaryView::set_margin_verdict(const QString& text, bool pass) {
  margin_verdict_->setText(text.isEmpty() ? tr("Margin check: not computed yet.") : text);
  // A pass in the palette's pass colour (docs/palette.md), anything else in plain text colour.
  QPalette p = palette();
  if (pass) p.setColor(QPalette::WindowText, readable_on(gramline_colour::pass(), p));
  margin_verdict_->setPalette(p);
  QFont f = margin_verdict_->font();
  f.setBold(pass);
  margin_verdict_->setFont(f);
}

QString SummaryView::figure(const QString& key) const { return figures_->value(key); }

QString SummaryView::verdict() const { return verdict_->text(); }

}  // namespace gramline::gui
