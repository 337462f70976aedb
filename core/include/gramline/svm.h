#pragma once
// Soft-margin support vector classification (C-SVC) on a precomputed kernel, solved by libsvm
// (Chang & Lin, ACM TIST 2 (2011) 27), with k-fold cross-validation and kernel-target alignment.
// Labels are -1/+1; the decision function is f(x) = sum_i dual_coef_i K(x_i, x) + bias
// (docs/plan-files.md), positive for class +1 whatever the order of the training labels.
#include <Eigen/Core>
#include <cstdint>
#include <string>
#include <vector>

namespace gramline {

struct SvmOptions {
  double C = 1.0;           ///< soft-margin parameter, > 0
  double tolerance = 1e-6;  ///< stopping tolerance on the KKT violation (libsvm eps)
  double cache_mb = 16.0;   ///< libsvm kernel cache, megabytes
  bool shrinking = true;    ///< libsvm shrinking heuristic
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

/// Predicted class of a decision value by libsvm's rule: a decision value votes for the
/// positive side only when it is strictly above 0, so f > 0 gives +1 and f <= 0 (f = 0
/// included) gives -1. Every prediction of the engine uses this rule.
int libsvm_label(double decision);

/// Share of points whose libsvm_label matches their label (-1/+1); NaN when there are none.
/// Throws std::invalid_argument when the sizes differ.
double classification_accuracy(const Eigen::VectorXd& decision, const Eigen::VectorXi& labels);

/// A C-SVC trained on an N x N Gram matrix.
struct SvmModel {
  double C = 1.0;
  Eigen::VectorXd dual_coef;       ///< N values alpha_i y_i (0 for non-support vectors)
  double bias = 0.0;               ///< b of f(x) = sum_i dual_coef_i K(x_i, x) + b
  std::vector<int> support;        ///< indices of the support vectors, ascending
  Eigen::VectorXd decision_train;  ///< f at the training points
  double w_norm_squared = 0.0;     ///< ||w||^2 = a^T K a with a = dual_coef
  double dual_objective = 0.0;     ///< sum_i alpha_i - ||w||^2 / 2 (maximised by training)

  /// Geometric margin 1/||w|| in feature-space units (Vapnik, Statistical Learning Theory,
  /// 1998): half the width of the band |f| <= 1. Infinite when w = 0.
  double geometric_margin() const;
  /// f for each row of `cross` (rows: points, columns: the N training points).
  Eigen::VectorXd decision(const Eigen::MatrixXd& cross) const;
  /// Number of support vectors at the bound |alpha| = C (within a relative 1e-9).
  int bounded_support_count() const;
  std::string report() const;
};

/// Trains a C-SVC on `gram` (N x N, symmetric) with labels -1/+1 (both present).
/// Throws std::invalid_argument on inconsistent sizes or labels, or a non-positive C.
SvmModel train_svm(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels,
                   const SvmOptions& options = {});

struct CrossValidationOptions {
  std::vector<double> C_values = {1.0 / 16, 0.25, 1.0, 4.0, 16.0, 64.0, 256.0, 1024.0};
  int folds = 5;
  std::uint64_t seed = 1;  ///< fold assignment
  SvmOptions svm;          ///< C is taken from C_values
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

struct CrossValidationResult {
  std::vector<double> C_values;
  std::vector<double> accuracy;  ///< fraction of points classified right when held out
  double best_C = 1.0;           ///< highest accuracy; ties go to the smallest C
  double best_accuracy = 0.0;
  int folds = 0;           ///< folds used (cross_validation_folds of the folds asked for)
  std::uint64_t seed = 0;  ///< of the fold assignment
  std::string report() const;
};

/// Folds a k-fold cross-validation over `points` points uses when `requested` are asked for:
/// at most one fold per point. (A fold index beyond the last point would hold no point.)
int cross_validation_folds(int requested, int points);

/// Stratified k-fold assignment: fold index of each point, classes dealt round-robin after a
/// seeded shuffle, so every fold holds both classes when each has at least k points.
std::vector<int> stratified_folds(const Eigen::VectorXi& labels, int folds, std::uint64_t seed);

/// Held-out accuracy of the C-SVC with parameter C over the given folds.
double cross_validated_accuracy(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels,
                                const std::vector<int>& fold_of_point, const SvmOptions& options);

/// Grid search over C by k-fold cross-validation on `gram` (folds: cross_validation_folds).
CrossValidationResult choose_C(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels,
                               const CrossValidationOptions& options = {});

/// The soft-margin parameter of a classifier, fixed or chosen by cross-validation.
struct CChoice {
  double C = 1.0;
  bool from_cross_validation = false;
  CrossValidationResult cross_validation;  ///< filled when chosen by cross-validation
};

/// C = fixed_C when fixed_C > 0; otherwise choose_C on (gram, labels) with `folds` folds and the
/// fold assignment seeded by `seed`, over the default grid of CrossValidationOptions.
CChoice fixed_or_cross_validated_C(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels,
                                   double fixed_C, int folds, std::uint64_t seed);

/// Kernel-target alignment <K, y y^T>_F / (||K||_F ||y y^T||_F) (Cristianini, Shawe-Taylor,
/// Elisseeff & Kandola, "On kernel-target alignment", NIPS 14, 2001). In [-1, 1].
double kernel_target_alignment(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels);

}  // namespace gramline
