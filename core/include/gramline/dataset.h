#pragma once
// The data set: training and test points with two classes. Value type, no file access.
#include <Eigen/Core>
#include <string>
#include <vector>

namespace gramline {

struct DataSet {
  std::vector<std::string> feature_names;  ///< one per column of train/test
  Eigen::MatrixXd train;                   ///< N x D training features (row = point)
  Eigen::MatrixXd test;                    ///< M x D test features
  Eigen::VectorXi train_labels;            ///< N labels, each -1 or +1
  Eigen::VectorXi test_labels;             ///< M labels, each -1 or +1
  std::string positive_name = "+1";        ///< class name shown for label +1
  std::string negative_name = "-1";        ///< class name shown for label -1

  int train_count() const { return static_cast<int>(train.rows()); }
  int test_count() const { return static_cast<int>(test.rows()); }
  int feature_count() const { return static_cast<int>(train.cols()); }
  /// Point by global index: training points first, then test points (docs/plan-files.md).
  Eigen::VectorXd point(int global_index) const;
};

/// The one rule for feature names, applied by every reader (docs/parameter-ranges.md):
/// not blank, no control characters, and, ignoring case and surrounding white space, not
/// `label` or `set` (the data CSV's reserved columns). Returns an empty string when `name` is
/// usable, otherwise the reason.
std::string feature_name_problem(const std::string& name);

/// Checks the invariants every consumer relies on (both classes present among training points,
/// labels +-1, finite features, equal widths, no duplicate training points, usable and
/// distinct feature names). Returns an empty
/// string when valid, otherwise a message naming the offending point and feature.
std::string validate(const DataSet& data);

}  // namespace gramline
