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

/// One point of the progress curve: after the step ending at `end_s`, the share of training
/// Gram entries measured and the Frobenius norm of the per-entry sigma, where an entry not yet
/// measured counts with sigma 1/2 (half the range of a kernel value). At the end of the plan
/// the norm equals the plan's gram_sigma_frobenius.
struct ProgressPoint {
  double end_s = 0.0;
  double share_done = 0.0;
  double sigma_frobenius = 0.0;
  int night = 1;
};
std::vector<ProgressPoint> gram_progress(const Plan& plan, int train_count);

class TimelineView : public QWidget {
  Q_OBJECT

 public:
  explicit TimelineView(QWidget* parent = nullptr);
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);

 private:
  void draw_nights();
  void draw_progress();

  std::shared_ptr<const Plan> plan_;
  Campaign campaign_;
  std::vector<ProgressPoint> progress_;
  QChartView* nights_view_;
  QChartView* progress_view_;
  QComboBox* night_;
  QLabel* note_;
};

}  // namespace gramline::gui
