#include "plan_runner.h"

#include <stdexcept>

namespace gramline::gui {

PlanRunner::PlanRunner(QObject* parent)
    : JobRunner(100, parent),
      planner_([](const Campaign& c, const PlanOptions& o) { return plan_campaign(c, o); }) {}

void PlanRunner::request(const Campaign& campaign) {
  run([campaign, planner = planner_](const WorkHooks& hooks) {
    const std::string problem = campaign.check_consistency();
    if (!problem.empty()) throw std::invalid_argument(problem);
    PlanOptions options;
    options.seed = campaign.seed;
    // Planning runs on every edit: the 1-tree bound can take seconds, the per-entry one does not.
    options.tree_bound = false;
    options.hooks = hooks;
    return PlannedCampaign{campaign, std::make_shared<const Plan>(planner(campaign, options))};
  });
  emit stale();  // after the start: the views are marked while the plan runs
}

const Campaign& PlanRunner::planned_campaign() const {
  return result() ? result()->campaign : none_;
}

}  // namespace gramline::gui
