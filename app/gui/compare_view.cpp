#include "compare_view.h"

#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QPushButton>
#include <QTableWidget>
#include <QVBoxLayout>
#include <cmath>

#include "chart_style.h"
#include "gramline/compare.h"
#include "gui_text.h"

namespace gramline::gui {

namespace {

/// A compared figure in the user's words and number format.
QString figure_text(const ComparedFigure& f, double value, bool difference) {
  QString sign;
  if (difference && value > 0) sign = QStringLiteral("+");
  if (f.unit == "s") {
    if (difference && value < 0) return QStringLiteral("−") + duration_text(-value);
    return sign + duration_text(value);
  }
  if (f.key == "epsilon_reached" || f.key == "gram_sigma_frobenius")
    return sign + number_text(value, 4);
  return sign + count_text(value);
}

QString figure_label(const std::string& key) {
  if (key == "nights") return CompareView::tr("Nights");
  if (key == "total_s") return CompareView::tr("Calendar span");
  if (key == "busy_s") return CompareView::tr("Busy time");
  if (key == "move_s") return CompareView::tr("Move time");
  if (key == "integration_s") return CompareView::tr("Counting time");
  if (key == "reference_s") return CompareView::tr("Reference, dark and park time");
  if (key == "epsilon_reached") return CompareView::tr("Worst half-width");
  if (key == "gram_sigma_frobenius") return CompareView::tr("Gram error (Frobenius σ)");
  if (key == "pairs_total") return CompareView::tr("Detected pairs");
  if (key == "settings") return CompareView::tr("Settings");
  if (key == "steps") return CompareView::tr("Steps");
  return QString::fromStdString(key);
}

}  // namespace

CompareView::CompareView(QWidget* parent) : QWidget(parent) {
  intro_ = new QLabel(
      tr("Pin the current plan, change the campaign (precision, sharing of pairs, rig speed, "
         "nights…), and both plans stand side by side here with their differences."));
  intro_->setWordWrap(true);
  sides_ = new QLabel;
  sides_->setWordWrap(true);
  sides_->setTextFormat(Qt::RichText);
  sides_->setAccessibleName(tr("Plans compared"));
  pin_ = new QPushButton(tr("&Pin the Current Plan"));
  clear_ = new QPushButton(tr("Clear the Pin"));
  use_minimum_ = new QPushButton(tr("Use the Minimum Budget That Passes"));
  use_minimum_->setToolTip(
      tr("Pins the current plan, then sets fixed pairs per entry to the smallest budget the "
         "margin check found passing; the comparison shows the nights it then needs."));
  use_margin_aware_ = new QPushButton(tr("Use Margin-Aware Sharing"));
  use_margin_aware_->setToolTip(
      tr("Pins the current plan, then shares pairs where the decision is (margin-aware "
         "allocation)."));
  advice_ = new QLabel;
  advice_->setWordWrap(true);
  table_ = new QTableWidget;
  table_->setAccessibleName(tr("Pinned and current plan"));
  table_->setEditTriggers(QAbstractItemView::NoEditTriggers);
  table_->setColumnCount(3);
  table_->setHorizontalHeaderLabels({tr("Pinned"), tr("Current"), tr("Current − pinned")});
  table_->horizontalHeader()->setSectionResizeMode(QHeaderView::Stretch);
  table_->verticalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);

  auto* buttons = new QHBoxLayout;
  buttons->addWidget(pin_);
  buttons->addWidget(clear_);
  buttons->addSpacing(18);
  buttons->addWidget(use_minimum_);
  buttons->addWidget(use_margin_aware_);
  buttons->addStretch(1);
  auto* layout = new QVBoxLayout(this);
  layout->addWidget(intro_);
  layout->addLayout(buttons);
  layout->addWidget(advice_);
  layout->addWidget(sides_);
  layout->addWidget(table_, 1);

  connect(pin_, &QPushButton::clicked, this, [this] { pin(); });
  connect(clear_, &QPushButton::clicked, this, [this] { clear_pin(); });
  connect(use_minimum_, &QPushButton::clicked, this, [this] { request_advice(true); });
  connect(use_margin_aware_, &QPushButton::clicked, this, [this] { request_advice(false); });
  refresh();
}

void CompareView::set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign) {
  current_ = {std::move(plan), nullptr, campaign};
  refresh();
}

void CompareView::set_check(std::shared_ptr<const MarginCheck> check) {
  current_.check = std::move(check);
  // The pinned plan's check arrives after the pin when the user pinned early.
  if (pinned_.plan && pinned_.plan == current_.plan) pinned_.check = current_.check;
  refresh();
}

bool CompareView::pin() {
  if (!current_.plan) return false;
  pinned_ = current_;
  refresh();
  return true;
}

void CompareView::clear_pin() {
  pinned_ = Side{};
  refresh();
}

void CompareView::request_advice(bool minimum_budget) {
  if (!current_.plan) return;
  if (minimum_budget) {
    if (!current_.check || !current_.check->minimum_uniform.found) return;
    pin();
    emit minimum_budget_requested(std::ceil(current_.check->minimum_uniform.pairs_per_entry));
  } else {
    pin();
    emit margin_aware_requested();
  }
}

QString CompareView::describe(const Campaign& c) {
  const QString pairs = c.precision.fixed_pairs > 0
                            ? tr("%1 pairs per entry").arg(count_text(c.precision.fixed_pairs))
                            : tr("ε %1").arg(number_text(c.precision.budget.epsilon, 4));
  return tr("%1: %2, %3, up to %n night(s)", nullptr, c.nights.max_nights)
      .arg(QString::fromStdString(c.name).toHtmlEscaped(), pairs,
           allocation_text(c.precision.allocation));
}

QString CompareView::margin_text(const Side& side) const {
  if (!side.plan) return QStringLiteral("–");
  if (!side.check) return tr("not checked yet");
  QString text = side.check->verdict.pass ? tr("pass") : tr("fail");
  return tr("%1 (largest flip %2 %)")
      .arg(text, number_text(100.0 * side.check->trials.flip_probability_max.value, 2));
}

QString CompareView::cell(const QString& key, int column) const {
  for (int r = 0; r < table_->rowCount(); ++r) {
    const QTableWidgetItem* head = table_->verticalHeaderItem(r);
    if (head && head->data(Qt::UserRole).toString() == key) {
      const QTableWidgetItem* item = table_->item(r, column);
      return item ? item->text() : QString();
    }
  }
  return {};
}

void CompareView::refresh() {
  pin_->setEnabled(current_.plan != nullptr);
  clear_->setEnabled(pinned_.plan != nullptr);
  const bool minimum = current_.check && current_.check->minimum_uniform.found;
  use_minimum_->setEnabled(minimum);
  use_margin_aware_->setEnabled(current_.plan != nullptr &&
                                current_.campaign.precision.allocation != Allocation::margin_aware);
  if (minimum) {
    advice_->setText(
        tr("The margin check's advice: %1 pairs per entry pass (%2 of counting); "
           "the current plan counts %3.")
            .arg(count_text(std::ceil(current_.check->minimum_uniform.pairs_per_entry)))
            .arg(duration_text(current_.check->minimum_uniform.integration_s))
            .arg(duration_text(current_.check->plan_integration_s)));
  } else {
    advice_->setText(current_.check ? tr("The margin check found no smaller passing budget.")
                                    : tr("The margin check's advice appears when it is done."));
  }
  QString sides;
  if (pinned_.plan)
    sides += tr("<b>Pinned</b> %1").arg(describe(pinned_.campaign));
  else
    sides += tr("<b>Pinned</b>: nothing yet.");
  if (current_.plan)
    sides += QStringLiteral("<br>") + tr("<b>Current</b> %1").arg(describe(current_.campaign));
  sides_->setText(sides);

  table_->clearContents();
  if (!current_.plan) {
    table_->setRowCount(0);
    return;
  }
  const Plan& now = *current_.plan;
  const Plan& then = pinned_.plan ? *pinned_.plan : now;
  const std::vector<ComparedFigure> figures = compare_plans(then, now);
  table_->setRowCount(static_cast<int>(figures.size()) + 2);
  const QColor better = readable_on(gramline_colour::pass(), palette());
  const QColor worse = readable_on(gramline_colour::alert(), palette());
  int r = 0;
  const auto row_head = [this](int row, const QString& label, const QString& key) {
    auto* head = new QTableWidgetItem(label);
    head->setData(Qt::UserRole, key);
    table_->setVerticalHeaderItem(row, head);
  };
  for (const ComparedFigure& f : figures) {
    row_head(r, figure_label(f.key), QString::fromStdString(f.key));
    auto* a = new QTableWidgetItem(pinned_.plan ? figure_text(f, f.a, false) : QStringLiteral("–"));
    auto* b = new QTableWidgetItem(figure_text(f, f.b, false));
    auto* d = new QTableWidgetItem(pinned_.plan ? figure_text(f, f.difference(), true)
                                                : QStringLiteral("–"));
    // Less is better for every figure here but pairs, settings and steps, which are neutral.
    const bool judged = f.key != "pairs_total" && f.key != "settings" && f.key != "steps";
    if (pinned_.plan && judged && f.difference() != 0.0) {
      d->setForeground(f.difference() < 0 ? better : worse);
      d->setToolTip(f.difference() < 0 ? tr("better than the pinned plan")
                                       : tr("worse than the pinned plan"));
    }
    for (QTableWidgetItem* item : {a, b, d})
      item->setTextAlignment(Qt::AlignRight | Qt::AlignVCenter);
    table_->setItem(r, 0, a);
    table_->setItem(r, 1, b);
    table_->setItem(r, 2, d);
    ++r;
  }
  row_head(r, tr("Fits its nights"), QStringLiteral("fits"));
  const auto yes_no = [](bool v) { return v ? tr("yes") : tr("no"); };
  table_->setItem(
      r, 0, new QTableWidgetItem(pinned_.plan ? yes_no(then.summary.fits) : QStringLiteral("–")));
  table_->setItem(r, 1, new QTableWidgetItem(yes_no(now.summary.fits)));
  table_->setItem(r, 2,
                  new QTableWidgetItem(!pinned_.plan ? QStringLiteral("–")
                                       : then.summary.fits == now.summary.fits ? tr("same")
                                                                               : tr("changed")));
  ++r;
  row_head(r, tr("Margin verdict"), QStringLiteral("margin"));
  table_->setItem(r, 0, new QTableWidgetItem(margin_text(pinned_)));
  table_->setItem(r, 1, new QTableWidgetItem(margin_text(current_)));
  QString change = QStringLiteral("–");
  if (pinned_.check && current_.check)
    change =
        pinned_.check->verdict.pass == current_.check->verdict.pass ? tr("same") : tr("changed");
  table_->setItem(r, 2, new QTableWidgetItem(change));
}

}  // namespace gramline::gui
