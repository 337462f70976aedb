#include "margin_runner.h"

#include <QThread>
#include <algorithm>

#include "gramline/kernel.h"

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
      out.grid = std::make_shared<const DecisionGrid>(decision_grid(campaign, *out.check, 90));
    return out;
  });
}

DecisionGrid decision_grid(const Campaign& campaign, const MarginCheck& check, int size) {
  const DataSet& d = campaign.data;
  DecisionGrid g;
  g.size = size;
  Eigen::MatrixXd all(d.train_count() + d.test_count(), d.feature_count());
  all << d.train, d.test;
  const Eigen::VectorXd low = all.colwise().minCoeff(), high = all.colwise().maxCoeff();
  const Eigen::VectorXd pad = 0.06 * (high - low).cwiseMax(1e-9);
  g.x_low = low(0) - pad(0);
  g.x_high = high(0) + pad(0);
  g.y_low = low(1) - pad(1);
  g.y_high = high(1) + pad(1);
  Eigen::MatrixXd grid(size * size, 2);
  for (int r = 0; r < size; ++r)
    for (int c = 0; c < size; ++c) {
      grid(r * size + c, 0) = g.x_low + (g.x_high - g.x_low) * c / (size - 1);
      grid(r * size + c, 1) = g.y_low + (g.y_high - g.y_low) * r / (size - 1);
    }
  g.values = check.ideal.decision(ideal_cross(campaign.encoding, grid, d.train));
  return g;
}

}  // namespace gramline::gui
