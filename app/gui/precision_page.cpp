#include <QCheckBox>
#include <QComboBox>
#include <QDoubleSpinBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QSpinBox>
#include <QVBoxLayout>

#include "editor_pages.h"
#include "gui_text.h"

namespace gramline::gui {

PrecisionPage::PrecisionPage(CampaignDocument* campaign_document, QWidget* parent)
    : EditorPage(campaign_document, parent) {
  auto* layout = new QVBoxLayout(this);

  auto* target_box = new QGroupBox(tr("Precision of each kernel entry"));
  auto* tf = new_form(target_box);
  number(
      tf, "precision/epsilon", tr("Half-width ε"),
      tr("Each kernel entry is known to within ± ε at the confidence below"), 0.0001, 0.5, 4,
      QString(), [](const Campaign& c) { return c.precision.budget.epsilon; },
      [](Campaign& c, double v) { c.precision.budget.epsilon = v; });
  number(
      tf, "precision/confidence", tr("Confidence"), tr("1 − δ"), 50.0, 99.999, 3, tr(" %"),
      [](const Campaign& c) { return c.precision.budget.confidence * 100.0; },
      [](Campaign& c, double v) { c.precision.budget.confidence = v / 100.0; });
  choice(
      tf, "precision/method", tr("Interval"), tr("How pairs per entry follow from ε and δ"),
      {method_text(BudgetMethod::normal), method_text(BudgetMethod::wilson),
       method_text(BudgetMethod::hoeffding)},
      [](const Campaign& c) { return static_cast<int>(c.precision.budget.method); },
      [](Campaign& c, int v) { c.precision.budget.method = static_cast<BudgetMethod>(v); });
  flag(
      tf, "precision/worst", tr("Plan for the worst pass probability"),
      tr("Ignore the predicted pass probability; plan every entry for the least favourable one "
         "the detection scheme can produce"),
      [](const Campaign& c) { return c.precision.budget.worst_case; },
      [](Campaign& c, bool v) { c.precision.budget.worst_case = v; });
  auto* fixed = number(
      tf, "precision/fixed", tr("Fixed pairs per entry"),
      tr("When set, every entry gets this many pairs instead of the target above"), 0.0, 1e12, 0,
      QString(), [](const Campaign& c) { return c.precision.fixed_pairs; },
      [](Campaign& c, double v) { c.precision.fixed_pairs = v; });
  fixed->setSpecialValueText(tr("off: use the target"));
  choice(
      tf, "precision/allocation", tr("Share pairs"), tr("How pairs are shared among entries"),
      {allocation_text(Allocation::uniform), allocation_text(Allocation::neyman),
       allocation_text(Allocation::margin_aware)},
      [](const Campaign& c) { return static_cast<int>(c.precision.allocation); },
      [](Campaign& c, int v) { c.precision.allocation = static_cast<Allocation>(v); });
  layout->addWidget(target_box);

  auto* sched_box = new QGroupBox(tr("Schedule"));
  auto* sf = new_form(sched_box);
  auto* ref = number(
      sf, "schedule/ref_interval", tr("Reference every"),
      tr("A reference step at least this often; 0 for none"), 0.0, 1440.0, 1, tr(" min"),
      [](const Campaign& c) { return c.schedule.reference_interval_min; },
      [](Campaign& c, double v) { c.schedule.reference_interval_min = v; });
  ref->setSpecialValueText(tr("never"));
  auto* ref_pairs = number(
      sf, "schedule/ref_pairs", tr("Pairs per reference"), tr("0: as many as a measure step"), 0.0,
      1e12, 0, QString(), [](const Campaign& c) { return c.schedule.reference_pairs; },
      [](Campaign& c, double v) { c.schedule.reference_pairs = v; });
  ref_pairs->setSpecialValueText(tr("as a measure step"));
  flag(
      sf, "schedule/dark", tr("Dark steps at night start and end"),
      tr("Shutter closed, to measure the background"),
      [](const Campaign& c) { return c.schedule.dark_steps; },
      [](Campaign& c, bool v) { c.schedule.dark_steps = v; });
  number(
      sf, "schedule/dark_dwell", tr("Dark step length"), QString(), 0.0, 3600.0, 1, tr(" s"),
      [](const Campaign& c) { return c.schedule.dark_dwell_s; },
      [](Campaign& c, double v) { c.schedule.dark_dwell_s = v; });
  flag(
      sf, "schedule/park", tr("Park the motors at the end of each night"),
      tr("Return every motor to its initial position"),
      [](const Campaign& c) { return c.schedule.park; },
      [](Campaign& c, bool v) { c.schedule.park = v; });
  flag(
      sf, "schedule/fit", tr("Scale pairs to fit the allowed nights"),
      tr("Lower the pairs per entry so the campaign ends within the night limit"),
      [](const Campaign& c) { return c.schedule.fit_to_nights; },
      [](Campaign& c, bool v) { c.schedule.fit_to_nights = v; });
  flag(
      sf, "schedule/truncation", tr("Finish small sub-matrices early"),
      tr("Order steps so the Gram matrix of the first points is complete early, in case the "
         "run is cut short"),
      [](const Campaign& c) { return c.schedule.truncation_safe; },
      [](Campaign& c, bool v) { c.schedule.truncation_safe = v; });
  auto* cap = number(
      sf, "schedule/cap", tr("Optimizer time limit"), tr("0: no limit"), 0.0, 3600.0, 1, tr(" s"),
      [](const Campaign& c) { return c.schedule.optimizer_time_cap_s; },
      [](Campaign& c, double v) { c.schedule.optimizer_time_cap_s = v; });
  cap->setSpecialValueText(tr("no limit"));
  integer(
      sf, "seed", tr("Random seed"), tr("Same seed, same plan"), 0, 2147483647,
      [](const Campaign& c) { return static_cast<int>(c.seed); },
      [](Campaign& c, int v) { c.seed = static_cast<std::uint64_t>(v); });
  layout->addWidget(sched_box);
  layout->addStretch(1);
}

}  // namespace gramline::gui
