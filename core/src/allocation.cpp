#include "gramline/allocation.h"

#include <algorithm>
#include <stdexcept>

namespace gramline {

std::vector<double> allocate_pairs(const AllocationInput& input, Allocation strategy,
                                   double total) {
  const int n = input.train_count, m = input.test_count;
  // Only the margin-aware strategy reads the classifier; the others accept empty figures.
  const bool aware = strategy == Allocation::margin_aware;
  if (aware && (input.dual_coef.size() != n || input.decision_test.size() != m))
    throw std::invalid_argument("allocate_pairs: the margin-aware strategy needs the ideal SVM");
  const Eigen::VectorXd a =
      aware ? Eigen::VectorXd(input.dual_coef.cwiseAbs()) : Eigen::VectorXd::Zero(n);
  const Eigen::VectorXd f0 =
      aware && m > 0 ? Eigen::VectorXd(input.decision_test.cwiseAbs()) : Eigen::VectorXd::Ones(m);
  const double f_mean = m > 0 ? f0.mean() : 1.0;
  auto unit_sigma = [&](const EntryNoise& noise) {
    return entry_sigma(input.scheme, input.photons, noise, 1.0);
  };

  // Weights laid out as the two Gram blocks (entries not listed weigh nothing), so the sums
  // below run in the same order whichever entries are listed.
  Eigen::MatrixXd w_train = Eigen::MatrixXd::Zero(n, n);
  Eigen::MatrixXd w_test = Eigen::MatrixXd::Zero(m, n);
  for (const AllocationEntry& e : input.entries) {
    if (e.block != Block::train && e.block != Block::test)
      throw std::invalid_argument("allocate_pairs: an entry is neither training nor test");
    const bool train = e.block == Block::train;
    double w = 1.0;
    if (strategy == Allocation::neyman) w = unit_sigma(e.noise);
    if (aware) {
      w = train ? unit_sigma(e.noise) * (a[e.row] + a[e.col])
                : unit_sigma(e.noise) * a[e.col] / std::max(f0[e.row], 0.1 * f_mean);
    }
    (train ? w_train : w_test)(e.row, e.col) = w;
  }
  if (aware) {
    // Entries off the support set still move the solution once noise changes it: a floor.
    const double count = static_cast<double>(input.entries.size());
    const double floor = 0.1 * (w_train.sum() + w_test.sum()) / std::max(1.0, count);
    for (const AllocationEntry& e : input.entries)
      (e.block == Block::train ? w_train : w_test)(e.row, e.col) += floor;
  }
  const double weight_sum = w_train.sum() + w_test.sum();
  const double scale = weight_sum > 0 ? total / weight_sum : 0.0;
  std::vector<double> pairs;
  pairs.reserve(input.entries.size());
  for (const AllocationEntry& e : input.entries)
    pairs.push_back(scale * (e.block == Block::train ? w_train : w_test)(e.row, e.col));
  return pairs;
}

}  // namespace gramline
