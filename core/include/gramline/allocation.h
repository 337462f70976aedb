#pragma once
// Sharing a total of detected pairs among the entries of the Gram matrix.
#include <Eigen/Core>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/entries.h"

namespace gramline {

/// One entry to be given pairs: a training entry (row < col, both training indices) or a test
/// entry (row: test index, col: training index), with its count statistics.
struct AllocationEntry {
  Block block = Block::train;
  int row = 0;
  int col = 0;
  EntryNoise noise;
};

struct AllocationInput {
  DetectionScheme scheme = DetectionScheme::both_ports;
  int photons = 2;
  int train_count = 0;  ///< N
  int test_count = 0;   ///< M
  std::vector<AllocationEntry> entries;
  /// Read by the margin-aware strategy only: the noiseless classifier's dual coefficients
  /// (N values) and its decision values at the M test points.
  Eigen::VectorXd dual_coef;
  Eigen::VectorXd decision_test;
};

/// Pairs of each of input.entries (same order) under an allocation strategy for a fixed total
/// of detected pairs (time = pairs / r, r the same for every setting):
///  uniform: equal pairs; neyman: pairs proportional to the single-pair sigma of the estimator
///  (entry_sigma at one pair, sqrt(p(1-p))/V without accidentals; Neyman, J. R. Stat. Soc. 97
///  (1934) 558);
///  margin_aware: pairs proportional to sigma times the sensitivity of the decision function,
///  |a_i| + |a_j| on training entry (i, j) and |a_j| / max(|f0(t)|, 0.1 mean |f0|) on test entry
///  (t, j), plus a floor of 10% of the mean weight so no entry goes unmeasured.
/// Throws std::invalid_argument when the margin-aware strategy lacks the classifier's figures.
std::vector<double> allocate_pairs(const AllocationInput& input, Allocation strategy,
                                   double total_pairs);

}  // namespace gramline
