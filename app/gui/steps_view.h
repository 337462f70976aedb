#pragma once
// Steps: every step of the plan in a virtualised table, with filters and "go to step".
#include <QAbstractTableModel>
#include <QWidget>
#include <memory>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/plan.h"

class QComboBox;
class QLabel;
class QSpinBox;
class QTableView;

namespace gramline::gui {

/// Which steps to show. Negative or zero fields mean "any".
struct StepFilter {
  int kind = -1;   ///< StepKind as int, -1: any
  int night = 0;   ///< 1-based night, 0: any
  int point = -1;  ///< global point index appearing as prep or analysis point, -1: any
};

/// Reads the plan's steps directly; a filter keeps a vector of step indices, so even 500 000
/// rows cost one int each and no per-row objects.
class StepsModel : public QAbstractTableModel {
  Q_OBJECT

 public:
  enum Column {
    kStep,
    kKind,
    kBlock,
    kNight,
    kClock,
    kPrep,
    kAnalysis,
    kKernel,
    kPairs,
    kDwell,
    kMove,
    kFirstMotor
  };

  explicit StepsModel(QObject* parent = nullptr);
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  void set_filter(const StepFilter& filter);
  const StepFilter& filter() const { return filter_; }

  /// Row showing step `step`, or -1 when filtered out.
  int row_of_step(int step) const;
  int step_at_row(int row) const { return rows_.at(static_cast<std::size_t>(row)); }
  int total_steps() const;

  int rowCount(const QModelIndex& parent = {}) const override;
  int columnCount(const QModelIndex& parent = {}) const override;
  QVariant data(const QModelIndex& index, int role) const override;
  QVariant headerData(int section, Qt::Orientation orientation, int role) const override;

 private:
  void rebuild_rows();

  std::shared_ptr<const Plan> plan_;
  NightWindow nights_;
  std::vector<QString> motor_names_;
  StepFilter filter_;
  std::vector<int> rows_;
};

class StepsView : public QWidget {
  Q_OBJECT

 public:
  explicit StepsView(QWidget* parent = nullptr);
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  StepsModel* model() { return model_; }
  QTableView* table() { return table_; }
  /// Selects and scrolls to step `step`, clearing filters that hide it. False if no such step.
  bool go_to_step(int step);

 private:
  void apply_filter();
  void update_count();

  StepsModel* model_;
  QTableView* table_;
  QComboBox* kind_;
  QComboBox* night_;
  QSpinBox* point_;
  QSpinBox* go_to_;
  QLabel* count_;
};

}  // namespace gramline::gui
