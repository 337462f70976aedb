#include "steps_view.h"

#include <QComboBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QPushButton>
#include <QSpinBox>
#include <QTableView>
#include <QVBoxLayout>
#include <algorithm>

#include "gui_text.h"

namespace gramline::gui {

StepsModel::StepsModel(QObject* parent) : QAbstractTableModel(parent) {}

void StepsModel::set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign) {
  beginResetModel();
  plan_ = std::move(plan);
  nights_ = campaign.nights;
  motor_names_.clear();
  for (const Motor& m : campaign.rig.motors) motor_names_.push_back(QString::fromStdString(m.name));
  rebuild_rows();
  endResetModel();
}

void StepsModel::set_filter(const StepFilter& filter) {
  beginResetModel();
  filter_ = filter;
  rebuild_rows();
  endResetModel();
}

void StepsModel::rebuild_rows() {
  rows_.clear();
  if (!plan_) return;
  const auto& steps = plan_->steps;
  rows_.reserve(steps.size());
  for (std::size_t i = 0; i < steps.size(); ++i) {
    const Step& s = steps[i];
    if (filter_.kind >= 0 && static_cast<int>(s.kind) != filter_.kind) continue;
    if (filter_.night > 0 && s.night != filter_.night) continue;
    if (filter_.point >= 0 && s.prep_point != filter_.point && s.analysis_point != filter_.point)
      continue;
    rows_.push_back(static_cast<int>(i));
  }
}

int StepsModel::row_of_step(int step) const {
  const auto it = std::lower_bound(rows_.begin(), rows_.end(), step);
  if (it == rows_.end() || *it != step) return -1;
  return static_cast<int>(it - rows_.begin());
}

int StepsModel::total_steps() const { return plan_ ? static_cast<int>(plan_->steps.size()) : 0; }

int StepsModel::rowCount(const QModelIndex& parent) const {
  return parent.isValid() ? 0 : static_cast<int>(rows_.size());
}

int StepsModel::columnCount(const QModelIndex& parent) const {
  return parent.isValid() ? 0 : kFirstMotor + static_cast<int>(motor_names_.size());
}

QVariant StepsModel::data(const QModelIndex& index, int role) const {
  if (!plan_ || !index.isValid()) return {};
  const int step_index = rows_[static_cast<std::size_t>(index.row())];
  const Step& s = plan_->steps[static_cast<std::size_t>(step_index)];
  const int col = index.column();
  if (role == Qt::TextAlignmentRole) {
    if (col == kKind || col == kBlock) return int(Qt::AlignLeft | Qt::AlignVCenter);
    return int(Qt::AlignRight | Qt::AlignVCenter);
  }
  if (role != Qt::DisplayRole) return {};
  const auto point = [](int p) { return p < 0 ? QStringLiteral("–") : QString::number(p); };
  switch (col) {
    case kStep:
      return step_index;
    case kKind:
      return kind_text(s.kind);
    case kBlock:
      return block_text(s.block);
    case kNight:
      return s.night;
    case kClock:
      return clock_text(nights_, s.start_s);
    case kPrep:
      return point(s.prep_point);
    case kAnalysis:
      return point(s.analysis_point);
    case kKernel:
      return s.kind == StepKind::measure || s.kind == StepKind::reference
                 ? number_text(s.kernel_ideal, 4)
                 : QStringLiteral("–");
    case kPairs:
      return count_text(s.pairs);
    case kDwell:
      return number_text(s.dwell_s, 2);
    case kMove:
      return number_text(s.move_s, 2);
    default: {
      const auto m = static_cast<std::size_t>(col - kFirstMotor);
      if (m < s.position_deg.size()) return number_text(s.position_deg[m], 2);
      return {};
    }
  }
}

QVariant StepsModel::headerData(int section, Qt::Orientation orientation, int role) const {
  if (orientation != Qt::Horizontal) return {};
  if (role == Qt::ToolTipRole) {
    if (section == kClock) return tr("Local clock time at which the step's move begins");
    if (section == kPrep) return tr("Point whose state is prepared (training first, then test)");
    if (section == kAnalysis) return tr("Point whose state is analysed");
    if (section == kPairs) return tr("Detected photon pairs planned for this step");
    if (section >= kFirstMotor) return tr("Physical position commanded to this motor");
    return {};
  }
  if (role != Qt::DisplayRole) return {};
  switch (section) {
    case kStep:
      return tr("Step");
    case kKind:
      return tr("Kind");
    case kBlock:
      return tr("Block");
    case kNight:
      return tr("Night");
    case kClock:
      return tr("Clock");
    case kPrep:
      return tr("Prepare");
    case kAnalysis:
      return tr("Analyse");
    case kKernel:
      return tr("Kernel");
    case kPairs:
      return tr("Pairs");
    case kDwell:
      return tr("Dwell (s)");
    case kMove:
      return tr("Move (s)");
    default: {
      const auto m = static_cast<std::size_t>(section - kFirstMotor);
      if (m < motor_names_.size()) return tr("%1 (°)").arg(motor_names_[m]);
      return {};
    }
  }
}

StepsView::StepsView(QWidget* parent) : QWidget(parent) {
  model_ = new StepsModel(this);

  kind_ = new QComboBox;
  kind_->addItem(tr("All kinds"), -1);
  kind_->addItem(tr("Measure"), static_cast<int>(StepKind::measure));
  kind_->addItem(tr("Reference"), static_cast<int>(StepKind::reference));
  kind_->addItem(tr("Dark"), static_cast<int>(StepKind::dark));
  kind_->addItem(tr("Park"), static_cast<int>(StepKind::park));
  kind_->setAccessibleName(tr("Filter by step kind"));

  night_ = new QComboBox;
  night_->addItem(tr("All nights"), 0);
  night_->setAccessibleName(tr("Filter by night"));

  point_ = new QSpinBox;
  point_->setRange(-1, 0);
  point_->setSpecialValueText(tr("Any point"));
  point_->setPrefix(tr("Point "));
  point_->setValue(-1);
  point_->setAccessibleName(tr("Filter by point"));
  point_->setToolTip(tr("Show only the steps that prepare or analyse this point"));

  go_to_ = new QSpinBox;
  go_to_->setRange(0, 0);
  go_to_->setPrefix(tr("Step "));
  go_to_->setAccessibleName(tr("Step to go to"));
  auto* go = new QPushButton(tr("Go"));
  go->setAccessibleName(tr("Go to step"));

  count_ = new QLabel;

  auto* bar = new QHBoxLayout;
  bar->addWidget(new QLabel(tr("Show:")));
  bar->addWidget(kind_);
  bar->addWidget(night_);
  bar->addWidget(point_);
  bar->addSpacing(16);
  bar->addWidget(go_to_);
  bar->addWidget(go);
  bar->addStretch(1);
  bar->addWidget(count_);

  table_ = new QTableView;
  table_->setModel(model_);
  table_->setAccessibleName(tr("Steps of the plan"));
  table_->setSelectionBehavior(QAbstractItemView::SelectRows);
  table_->setSelectionMode(QAbstractItemView::SingleSelection);
  table_->setWordWrap(false);
  table_->setAlternatingRowColors(true);
  table_->verticalHeader()->setVisible(false);
  // Fixed row heights keep scrolling O(1) at any row count.
  table_->verticalHeader()->setSectionResizeMode(QHeaderView::Fixed);
  table_->verticalHeader()->setDefaultSectionSize(fontMetrics().height() + 6);
  table_->horizontalHeader()->setSectionResizeMode(QHeaderView::Interactive);
  table_->horizontalHeader()->setHighlightSections(false);

  auto* layout = new QVBoxLayout(this);
  layout->addLayout(bar);
  layout->addWidget(table_);

  const auto on_filter = [this] { apply_filter(); };
  connect(kind_, &QComboBox::currentIndexChanged, this, on_filter);
  connect(night_, &QComboBox::currentIndexChanged, this, on_filter);
  connect(point_, &QSpinBox::valueChanged, this, on_filter);
  connect(go, &QPushButton::clicked, this, [this] { go_to_step(go_to_->value()); });
  connect(go_to_, &QSpinBox::editingFinished, this, [this] { go_to_step(go_to_->value()); });
}

void StepsView::set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign) {
  const int nights = plan ? plan->summary.nights : 0;
  {
    const QSignalBlocker block(night_);
    const int keep = night_->currentData().toInt();
    night_->clear();
    night_->addItem(tr("All nights"), 0);
    for (int n = 1; n <= nights; ++n) night_->addItem(tr("Night %1").arg(n), n);
    night_->setCurrentIndex(std::max(0, night_->findData(keep)));
  }
  {
    const QSignalBlocker block(point_);
    point_->setMaximum(campaign.data.train_count() + campaign.data.test_count() - 1);
  }
  go_to_->setMaximum(std::max(0, plan ? static_cast<int>(plan->steps.size()) - 1 : 0));
  model_->set_plan(std::move(plan), campaign);
  apply_filter();
  // Size columns from their headers and a typical value, never by scanning every row.
  const QFontMetrics fm(table_->font());
  for (int c = 0; c < model_->columnCount(); ++c) {
    const QString header = model_->headerData(c, Qt::Horizontal, Qt::DisplayRole).toString();
    int width = fm.horizontalAdvance(header) + 24;
    if (c == StepsModel::kClock) width = std::max(width, fm.horizontalAdvance("Wed 00:00:00") + 16);
    if (c == StepsModel::kBlock)
      width = std::max(width, fm.horizontalAdvance(block_text(Block::train)) + 16);
    if (c == StepsModel::kKind)
      width = std::max(width, fm.horizontalAdvance(kind_text(StepKind::reference)) + 16);
    if (c == StepsModel::kPairs) width = std::max(width, fm.horizontalAdvance("1,000,000") + 16);
    table_->setColumnWidth(c, width);
  }
}

void StepsView::apply_filter() {
  StepFilter f;
  f.kind = kind_->currentData().toInt();
  f.night = night_->currentData().toInt();
  f.point = point_->value();
  model_->set_filter(f);
  update_count();
}

void StepsView::update_count() {
  count_->setText(tr("%1 of %2 steps").arg(model_->rowCount()).arg(model_->total_steps()));
}

bool StepsView::go_to_step(int step) {
  if (step < 0 || step >= model_->total_steps()) return false;
  if (model_->row_of_step(step) < 0) {
    const QSignalBlocker b1(kind_), b2(night_), b3(point_);
    kind_->setCurrentIndex(0);
    night_->setCurrentIndex(0);
    point_->setValue(-1);
    apply_filter();
  }
  const int row = model_->row_of_step(step);
  const QModelIndex index = model_->index(row, 0);
  table_->selectionModel()->select(index,
                                   QItemSelectionModel::ClearAndSelect | QItemSelectionModel::Rows);
  table_->setCurrentIndex(index);
  table_->scrollTo(index, QAbstractItemView::PositionAtCenter);
  return true;
}

}  // namespace gramline::gui
