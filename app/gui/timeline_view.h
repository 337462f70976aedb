#pragma once
// Timeline: per night, where the time goes; over one night, how much of the Gram matrix is
// done and how the predicted Gram error falls.
#include <QWidget>
#include <memory>

#include "gramline/campaign.h"
#include "gramline/plan.h"

class QChartView;
class QComboBox;
class QLabel;

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

class TimelineView : public QWidget {
  Q_OBJECT

 public:
  explicit TimelineView(QWidget* parent = nullptr);
  /// Shows `plan`; while the view is hidden the charts are drawn when it is next shown, so a
  /// new plan reaches the views that are on screen sooner.
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  /// The plan the charts show: the newest one once the view has been shown since.
  std::shared_ptr<const Plan> drawn_plan() const { return drawn_plan_; }

 protected:
  void showEvent(QShowEvent* event) override;

 private:
  void draw();
  void draw_nights();
  void draw_progress();

  std::shared_ptr<const Plan> plan_;
  Campaign campaign_;
  std::vector<GramProgressPoint> progress_;
  QChartView* nights_view_;
  QChartView* progress_view_;
  QComboBox* night_;
  QLabel* note_;
  std::shared_ptr<const Plan> drawn_plan_;
  bool drawn_ = true;        ///< the charts show plan_
  bool ever_drawn_ = false;  ///< the charts were drawn for some plan
};

}  // namespace gramline::gui
