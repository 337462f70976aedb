#pragma once
// Plans the campaign on a worker thread as soon as it is asked to, cancelling the plan still
// running; only the newest plan reaches the views (JobRunner).
#include <functional>
#include <memory>

#include "gramline/campaign.h"
#include "gramline/plan.h"
#include "job_runner.h"

namespace gramline::gui {

/// A finished plan and the campaign it was made from.
struct PlannedCampaign {
  Campaign campaign;
  std::shared_ptr<const Plan> plan;
};

class PlanRunner : public JobRunner<PlannedCampaign> {
  Q_OBJECT

 public:
  /// The planning call (plan_campaign); tests wrap it to watch the jobs.
  using Planner = std::function<Plan(const Campaign&, const PlanOptions&)>;

  explicit PlanRunner(QObject* parent = nullptr);

  /// Starts planning `campaign` at once; a plan still running is cancelled and never shown.
  void request(const Campaign& campaign);
  void set_planner(Planner planner) { planner_ = std::move(planner); }

  /// The newest finished plan and the campaign it was made from (null before the first).
  std::shared_ptr<const Plan> plan() const { return result() ? result()->plan : nullptr; }
  const Campaign& planned_campaign() const;

 signals:
  /// A request arrived (and its plan has started): what is shown is now out of date.
  void stale();

 private:
  Planner planner_;
  Campaign none_;  ///< planned_campaign() before the first plan
};

}  // namespace gramline::gui
