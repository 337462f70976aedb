#include "gramline/decision_grid.h"

#include <stdexcept>

#include "gramline/field_check.h"
#include "gramline/kernel.h"

namespace gramline {

DecisionGrid decision_grid(const Campaign& campaign, const SvmModel& classifier, int size) {
  const DataSet& d = campaign.data;
  FieldCheck("decision grid")
      .at_least("size", size, 2)
      .require(d.feature_count() == 2, "data", "needs exactly two features")
      .throw_if_failed();
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
  g.values = classifier.decision(ideal_cross(campaign.encoding, grid, d.train));
  return g;
}

}  // namespace gramline
