#pragma once
// Timeline: every night as it runs, step by step; over one night, how much of the Gram matrix is
// done and how the predicted Gram error falls.
#include <QWidget>
#include <memory>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/plan.h"

class QChartView;
class QComboBox;
class QLabel;
class QScrollArea;

namespace gramline::gui {

/// Seconds of each kind of work in one night, summed from the plan's steps.
struct NightBreakdown {
  int night = 1;
  double moving_s = 0.0;     ///< moves of measure steps
  double counting_s = 0.0;   ///< dwell of measure steps
  double reference_s = 0.0;  ///< reference steps, move and dwell
  double dark_s = 0.0;       ///< dark steps, move and dwell
  double park_s = 0.0;       ///< park steps, move and dwell
  double window_s = 0.0;
  double idle_s() const;
};

/// Sums the steps of `plan` per night.
std::vector<NightBreakdown> night_breakdown(const Plan& plan, const NightWindow& nights);

/// Every night as it runs: one strip per night across its window, each step drawn where it
/// happens, coloured by what the rig does (moving, counting, references, dark, park); the
/// share of each kind in the legend.
class NightStrips : public QWidget {
  Q_OBJECT

 public:
  explicit NightStrips(QWidget* parent = nullptr);
  void set_plan(std::shared_ptr<const Plan> plan, const NightWindow& nights);
  QSize sizeHint() const override;
  QSize minimumSizeHint() const override;
  /// Category drawn at a widget position (0 moving .. 4 park, 5 idle), -1 outside the strips.
  int kind_at(const QPoint& pos) const;

 protected:
  void paintEvent(QPaintEvent* event) override;
  void mouseMoveEvent(QMouseEvent* event) override;

 private:
  QRect strips_rect() const;
  int row_height() const;
  int label_width() const;
  /// Rebuilds the per-pixel categories for the current width.
  void bin(int width);

  std::shared_ptr<const Plan> plan_;
  NightWindow nights_;
  int night_count_ = 0;
  int binned_width_ = -1;
  std::vector<std::vector<signed char>> pixels_;  ///< per night, per pixel: category or -1
  std::vector<NightBreakdown> breakdown_;
};

class TimelineView : public QWidget {
  Q_OBJECT

 public:
  explicit TimelineView(QWidget* parent = nullptr);
  /// Shows `plan`; while the view is hidden the charts are drawn when it is next shown, so a
  /// new plan reaches the views that are on screen sooner.
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  /// The plan the charts show: the newest one once the view has been shown since.
  std::shared_ptr<const Plan> drawn_plan() const { return drawn_plan_; }
  NightStrips* strips() const { return strips_; }

 protected:
  void showEvent(QShowEvent* event) override;

 private:
  void draw();
  void draw_nights();
  void draw_progress();

  std::shared_ptr<const Plan> plan_;
  Campaign campaign_;
  std::vector<GramProgressPoint> progress_;
  NightStrips* strips_;
  QScrollArea* strips_scroll_;
  QChartView* progress_view_;
  QComboBox* night_;
  QLabel* note_;
  std::shared_ptr<const Plan> drawn_plan_;
  bool drawn_ = true;        ///< the charts show plan_
  bool ever_drawn_ = false;  ///< the charts were drawn for some plan
};

}  // namespace gramline::gui
