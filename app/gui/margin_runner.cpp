#include "margin_runner.h"

#include <QThread>
#include <algorithm>

#include "gramline/decision_grid.h"

namespace gramline::gui {

MarginRunner::MarginRunner(QObject* parent) : JobRunner(150, parent) {
  // Leave one core to the GUI and the planner.
  options_.threads = std::max(1, QThread::idealThreadCount() - 1);
}

void MarginRunner::start(const Campaign& campaign, std::shared_ptr<const Plan> plan) {
  run([campaign, plan, options = options_](const WorkHooks& hooks) mutable {
    options.hooks = hooks;
    MarginOutcome out;
    out.check = std::make_shared<const MarginCheck>(check_margin(campaign, *plan, options));
    if (campaign.data.feature_count() == 2)
      out.grid = std::make_shared<const DecisionGrid>(decision_grid(campaign, out.check->ideal));
    return out;
  });
}

}  // namespace gramline::gui
