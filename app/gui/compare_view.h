#pragma once
// What-if comparison: the user pins the current plan, changes the campaign, and sees both
// plans side by side with their differences (compare_plans, gramline/compare.h, the same
// figures as `gramline-cli compare`; docs/plan-files.md). Buttons apply the margin check's
// advice as ordinary, undoable campaign edits.
#include <QWidget>
#include <memory>

#include "gramline/campaign.h"
#include "gramline/margin.h"
#include "gramline/plan.h"

class QLabel;
class QPushButton;
class QTableWidget;

namespace gramline::gui {

class CompareView : public QWidget {
  Q_OBJECT

 public:
  explicit CompareView(QWidget* parent = nullptr);
  /// The newest plan (its margin check pending).
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  /// The margin check of the newest plan.
  void set_check(std::shared_ptr<const MarginCheck> check);
  /// Keeps the current plan (and its check, when done) as the pinned side. False without one.
  bool pin();
  void clear_pin();
  bool pinned() const { return pinned_.plan != nullptr; }

  /// Text of a cell: `key` is a compared figure's key (compare.h) or "margin";
  /// column 0 pinned, 1 current, 2 difference.
  QString cell(const QString& key, int column) const;
  QTableWidget* table() const { return table_; }
  QPushButton* pin_button() const { return pin_; }
  QPushButton* minimum_budget_button() const { return use_minimum_; }
  QPushButton* margin_aware_button() const { return use_margin_aware_; }

 signals:
  /// The user asks for fixed pairs per entry at the margin check's minimum passing budget.
  void minimum_budget_requested(double pairs_per_entry);
  /// The user asks for margin-aware allocation.
  void margin_aware_requested();

 private:
  struct Side {
    std::shared_ptr<const Plan> plan;
    std::shared_ptr<const MarginCheck> check;
    Campaign campaign;
  };
  void refresh();
  void request_advice(bool minimum_budget);
  QString margin_text(const Side& side) const;
  static QString describe(const Campaign& c);

  Side pinned_;
  Side current_;
  QLabel* intro_;
  QLabel* sides_;
  QPushButton* pin_;
  QPushButton* clear_;
  QPushButton* use_minimum_;
  QPushButton* use_margin_aware_;
  QLabel* advice_;
  QTableWidget* table_;
};

}  // namespace gramline::gui
