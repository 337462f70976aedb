#pragma once
// Runs the margin check (a Monte Carlo) on a worker thread after each plan, with progress and
// cancel; a newer plan cancels the check of an older one (JobRunner).
#include <memory>

#include "gramline/campaign.h"
#include "gramline/margin.h"
#include "gramline/plan.h"
#include "job_runner.h"

namespace gramline::gui {

/// The noiseless decision function on a grid over the first two features (only when the data
/// has exactly two features).
struct DecisionGrid {
  int size = 0;  ///< size x size samples
  double x_low = 0, x_high = 1, y_low = 0, y_high = 1;
  Eigen::VectorXd values;  ///< row-major, row 0 at y_low
};

/// What one margin check produced.
struct MarginOutcome {
  std::shared_ptr<const MarginCheck> check;
  std::shared_ptr<const DecisionGrid> grid;  ///< null unless the data has two features
};

class MarginRunner : public JobRunner<MarginOutcome> {
  Q_OBJECT

 public:
  explicit MarginRunner(QObject* parent = nullptr);

  /// Checks `plan` of `campaign`, cancelling a check still running.
  void start(const Campaign& campaign, std::shared_ptr<const Plan> plan);
  /// Options used for every check (tests lower the trials).
  MarginCheckOptions& options() { return options_; }
  /// The newest finished check and its decision grid (null before the first).
  std::shared_ptr<const MarginCheck> check() const { return result() ? result()->check : nullptr; }
  std::shared_ptr<const DecisionGrid> grid() const { return result() ? result()->grid : nullptr; }

 private:
  MarginCheckOptions options_;
};

/// Evaluates the noiseless classifier of `check` on a size x size grid spanning the points of
/// `data` (plus a small border), through the engine's ideal_cross and SvmModel::decision.
DecisionGrid decision_grid(const Campaign& campaign, const MarginCheck& check, int size);

}  // namespace gramline::gui
