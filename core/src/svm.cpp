#include "gramline/svm.h"

#include <libsvm/svm.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <memory>
#include <mutex>
#include <numeric>
#include <random>
#include <sstream>
#include <stdexcept>

#include "gramline/field_check.h"
#include "gramline/random.h"

namespace gramline {
namespace {

void silent(const char*) {}

// libsvm prints its progress to stdout through one global hook; the engine prints nothing.
void silence_libsvm() {
  static std::once_flag once;
  std::call_once(once, [] { svm_set_print_string_function(&silent); });
}

void check_problem(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels) {
  if (gram.rows() != gram.cols()) throw std::invalid_argument("svm: Gram matrix is not square");
  if (gram.rows() != labels.size())
    throw std::invalid_argument("svm: Gram matrix and labels differ in size");
  bool positive = false, negative = false;
  for (int i = 0; i < labels.size(); ++i) {
    if (labels[i] == 1) {
      positive = true;
    } else if (labels[i] == -1) {
      negative = true;
    } else {
      throw std::invalid_argument("svm: label of point " + std::to_string(i) + " is not -1/+1");
    }
  }
  if (!positive || !negative) throw std::invalid_argument("svm: both classes must be present");
  if (!gram.allFinite()) throw std::invalid_argument("svm: Gram matrix has non-finite entries");
}

struct ModelDeleter {
  void operator()(svm_model* model) const { svm_free_and_destroy_model(&model); }
};

}  // namespace

void SvmOptions::validate() const {
  FieldCheck("SvmOptions")
      .positive("C", C)
      .positive("tolerance", tolerance)
      .positive("cache_mb", cache_mb)
      .throw_if_failed();
}

void CrossValidationOptions::validate() const {
  FieldCheck check("CrossValidationOptions");
  check.require(!C_values.empty(), "C_values", "no C values");
  for (double c : C_values) check.positive("C_values", c);
  check.at_least("folds", folds, 2);
  check.throw_if_failed();
  svm.validate();
}

int libsvm_label(double decision) { return decision > 0 ? 1 : -1; }

double classification_accuracy(const Eigen::VectorXd& decision, const Eigen::VectorXi& labels) {
  if (decision.size() != labels.size())
    throw std::invalid_argument("accuracy: decision values and labels differ in size");
  if (labels.size() == 0) return std::numeric_limits<double>::quiet_NaN();
  int right = 0;
  for (Eigen::Index i = 0; i < labels.size(); ++i) right += libsvm_label(decision[i]) == labels[i];
  return static_cast<double>(right) / static_cast<double>(labels.size());
}

double SvmModel::geometric_margin() const {
  if (w_norm_squared <= 0.0) return std::numeric_limits<double>::infinity();
  return 1.0 / std::sqrt(w_norm_squared);
}

Eigen::VectorXd SvmModel::decision(const Eigen::MatrixXd& cross) const {
  Eigen::VectorXd f = cross * dual_coef;
  f.array() += bias;
  return f;
}

int SvmModel::bounded_support_count() const {
  int count = 0;
  for (int i : support)
    if (std::abs(dual_coef[i]) >= C * (1.0 - 1e-9)) ++count;
  return count;
}

std::string SvmModel::report() const {
  std::ostringstream out;
  out << "C-SVC, C = " << C << ": " << support.size() << " support vectors of " << dual_coef.size()
      << " training points (" << bounded_support_count() << " at the bound C)\n";
  out << "  bias " << bias << ", geometric margin 1/||w|| = " << geometric_margin()
      << ", dual objective " << dual_objective << "\n";
  return out.str();
}

SvmModel train_svm(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels,
                   const SvmOptions& options) {
  check_problem(gram, labels);
  options.validate();
  silence_libsvm();
  const int n = static_cast<int>(gram.rows());

  // Precomputed-kernel layout (libsvm README): node 0 carries the 1-based serial number of the
  // point, node j its kernel value with training point j, then the terminator.
  std::vector<svm_node> nodes(static_cast<std::size_t>(n) * (n + 2));
  std::vector<svm_node*> rows(n);
  std::vector<double> y(n);
  for (int i = 0; i < n; ++i) {
    svm_node* row = nodes.data() + static_cast<std::size_t>(i) * (n + 2);
    row[0] = {0, static_cast<double>(i + 1)};
    for (int j = 0; j < n; ++j) row[j + 1] = {j + 1, gram(i, j)};
    row[n + 1] = {-1, 0.0};
    rows[i] = row;
    y[i] = labels[i];
  }
  svm_problem problem{n, y.data(), rows.data()};
  svm_parameter param{};
  param.svm_type = C_SVC;
  param.kernel_type = PRECOMPUTED;
  param.cache_size = options.cache_mb;
  param.eps = options.tolerance;
  param.C = options.C;
  param.nr_weight = 0;
  param.shrinking = options.shrinking ? 1 : 0;
  param.probability = 0;
  if (const char* error = svm_check_parameter(&problem, &param))
    throw std::invalid_argument(std::string("svm: ") + error);

  std::unique_ptr<svm_model, ModelDeleter> model(svm_train(&problem, &param));
  // libsvm makes the first label it meets the positive side of its decision values;
  // flip so that f > 0 always means class +1.
  const double sign = model->label[0] == 1 ? 1.0 : -1.0;

  SvmModel result;
  result.C = options.C;
  result.dual_coef = Eigen::VectorXd::Zero(n);
  for (int k = 0; k < model->l; ++k) {
    const int index = model->sv_indices[k] - 1;
    result.dual_coef[index] = sign * model->sv_coef[0][k];
  }
  result.bias = -sign * model->rho[0];
  for (int i = 0; i < n; ++i)
    if (result.dual_coef[i] != 0.0) result.support.push_back(i);
  result.decision_train = result.decision(gram);
  result.w_norm_squared = std::max(0.0, result.dual_coef.dot(gram * result.dual_coef));
  result.dual_objective = result.dual_coef.cwiseAbs().sum() - 0.5 * result.w_norm_squared;
  return result;
}

std::vector<int> stratified_folds(const Eigen::VectorXi& labels, int folds, std::uint64_t seed) {
  if (folds < 2) throw std::invalid_argument("cross-validation: folds must be at least 2");
  const int n = static_cast<int>(labels.size());
  std::vector<int> order(n);
  std::iota(order.begin(), order.end(), 0);
  SplitMix64 rng(seed);
  std::shuffle(order.begin(), order.end(), rng);
  // Deal each class round-robin, continuing the deal across classes so fold sizes stay even.
  std::stable_partition(order.begin(), order.end(), [&](int i) { return labels[i] > 0; });
  std::vector<int> fold(n, 0);
  for (int k = 0; k < n; ++k) fold[order[k]] = k % folds;
  return fold;
}

double cross_validated_accuracy(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels,
                                const std::vector<int>& fold_of_point, const SvmOptions& options) {
  check_problem(gram, labels);
  const int n = static_cast<int>(gram.rows());
  if (static_cast<int>(fold_of_point.size()) != n)
    throw std::invalid_argument("cross-validation: one fold index per point is needed");
  const int folds = *std::max_element(fold_of_point.begin(), fold_of_point.end()) + 1;
  int right = 0, held_out_total = 0;
  for (int f = 0; f < folds; ++f) {
    std::vector<int> train, held;
    for (int i = 0; i < n; ++i) (fold_of_point[i] == f ? held : train).push_back(i);
    if (held.empty()) continue;
    Eigen::VectorXi train_labels = labels(train);
    const bool both = (train_labels.array() > 0).any() && (train_labels.array() < 0).any();
    held_out_total += static_cast<int>(held.size());
    if (!both) {
      // A fold without one class leaves a constant classifier: predict the class present.
      for (int i : held)
        if (labels[i] == train_labels[0]) ++right;
      continue;
    }
    const SvmModel model = train_svm(gram(train, train), train_labels, options);
    const Eigen::VectorXd held_f = model.decision(gram(held, train));
    for (std::size_t k = 0; k < held.size(); ++k)
      if (libsvm_label(held_f[static_cast<Eigen::Index>(k)]) == labels[held[k]]) ++right;
  }
  return held_out_total > 0 ? static_cast<double>(right) / held_out_total : 0.0;
}

CrossValidationResult choose_C(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels,
                               const CrossValidationOptions& options) {
  options.validate();
  const int folds = cross_validation_folds(options.folds, static_cast<int>(labels.size()));
  const std::vector<int> fold = stratified_folds(labels, folds, options.seed);
  CrossValidationResult result;
  result.folds = folds;
  result.seed = options.seed;
  std::vector<double> values = options.C_values;
  std::sort(values.begin(), values.end());
  result.best_accuracy = -1.0;
  for (double C : values) {
    SvmOptions svm = options.svm;
    svm.C = C;
    const double accuracy = cross_validated_accuracy(gram, labels, fold, svm);
    result.C_values.push_back(C);
    result.accuracy.push_back(accuracy);
    // Strictly better only: among equals the smallest C keeps the widest margin.
    if (accuracy > result.best_accuracy + 1e-12) {
      result.best_accuracy = accuracy;
      result.best_C = C;
    }
  }
  return result;
}

int cross_validation_folds(int requested, int points) { return std::min(requested, points); }

CChoice fixed_or_cross_validated_C(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels,
                                   double fixed_C, int folds, std::uint64_t seed) {
  CChoice choice;
  if (fixed_C > 0) {
    choice.C = fixed_C;
    return choice;
  }
  CrossValidationOptions cv;
  cv.folds = folds;
  cv.seed = seed;
  choice.cross_validation = choose_C(gram, labels, cv);
  choice.C = choice.cross_validation.best_C;
  choice.from_cross_validation = true;
  return choice;
}

std::string CrossValidationResult::report() const {
  std::ostringstream out;
  out << folds << "-fold cross-validation over C (folds seeded " << seed << "):";
  for (std::size_t k = 0; k < C_values.size(); ++k)
    out << (k ? ", " : " ") << "C " << C_values[k] << " -> " << accuracy[k];
  out << "\n  chosen C = " << best_C << " (held-out accuracy " << best_accuracy << ")\n";
  return out.str();
}

double kernel_target_alignment(const Eigen::MatrixXd& gram, const Eigen::VectorXi& labels) {
  if (gram.rows() != labels.size() || gram.cols() != labels.size())
    throw std::invalid_argument("alignment: Gram matrix and labels differ in size");
  const Eigen::VectorXd y = labels.cast<double>();
  const double norm = gram.norm();
  if (norm == 0.0) return 0.0;
  // ||y y^T||_F = ||y||^2 = N for +-1 labels.
  return y.dot(gram * y) / (norm * y.squaredNorm());
}

}  // namespace gramline
