#pragma once
// Runs the margin check (a Monte Carlo) on a worker thread after each plan, with progress and
// cancel; a newer plan cancels the check of an older one (JobRunner).
#include <memory>

#include "gramline/campaign.h"
#include "gramline/decision_grid.h"
#include "gramline/margin.h"
#include "gramline/plan.h"
#include "job_runner.h"

namespace gramline::gui {

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

}  // namespace gramline::gui
