#pragma once
// A classifier's decision function sampled over the plane of a two-feature data set, for
// drawing the decision boundary.
#include <Eigen/Core>

#include "gramline/campaign.h"
#include "gramline/svm.h"

namespace gramline {

/// The decision function on a grid over the two features.
struct DecisionGrid {
  int size = 0;                                         ///< size x size samples
  double x_low = 0, x_high = 1, y_low = 0, y_high = 1;  ///< feature 0 (x) and 1 (y) spans
  Eigen::VectorXd values;                               ///< row-major, row 0 at y_low
};

/// Evaluates `classifier` (trained on the ideal Gram matrix of the campaign's training points)
/// on a size x size grid spanning every point of the data set plus a border of 6% of each
/// feature's range, through ideal_cross (kernel.h) and SvmModel::decision. Throws
/// std::invalid_argument unless the data has exactly two features and size >= 2. The default
/// of 90 x 90 samples draws a smooth boundary at screen size.
DecisionGrid decision_grid(const Campaign& campaign, const SvmModel& classifier, int size = 90);

}  // namespace gramline
