// Tests of the C-SVC on a precomputed kernel (core/src/svm.cpp).
//
// Data: tests/data/iris.csv is Fisher's iris data (R. A. Fisher, "The use of multiple
// measurements in taxonomic problems", Annals of Eugenics 7 (1936) 179-188; UCI Machine Learning
// Repository), copied from Debian's python3-sklearn 1.2.1+dfsg-1,
// /usr/lib/python3/dist-packages/sklearn/datasets/data/iris.csv. First line: sample count,
// feature count and class names; then sepal length, sepal width, petal length, petal width (cm)
// and the class index 0/1/2.
#include <gtest/gtest.h>
#include <libsvm/svm.h>

#include <cmath>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "gramline/svm.h"

namespace {

using gramline::SvmModel;
using gramline::SvmOptions;

struct TwoClassData {
  Eigen::MatrixXd x;  // rows: points; columns: sepal length, sepal width (cm)
  Eigen::VectorXi y;  // -1 / +1
};

// Two iris classes on the two sepal features. The class listed first in the file gets label
// `first_label`, so the order of labels seen by libsvm can be chosen.
TwoClassData load_iris(int class_a, int class_b, int first_label) {
  std::ifstream in(std::string(GRAMLINE_CORE_TEST_DATA) + "/iris.csv");
  EXPECT_TRUE(in.good()) << "tests/data/iris.csv missing";
  std::string line;
  std::getline(in, line);  // header
  std::vector<double> a, b;
  std::vector<int> labels;
  while (std::getline(in, line)) {
    std::stringstream row(line);
    std::string cell;
    double v[4];
    for (double& value : v) {
      std::getline(row, cell, ',');
      value = std::stod(cell);
    }
    std::getline(row, cell, ',');
    const int cls = std::stoi(cell);
    if (cls != class_a && cls != class_b) continue;
    a.push_back(v[0]);
    b.push_back(v[1]);
    labels.push_back(cls == class_a ? first_label : -first_label);
  }
  TwoClassData data;
  data.x.resize(static_cast<int>(a.size()), 2);
  data.y.resize(static_cast<int>(a.size()));
  for (std::size_t i = 0; i < a.size(); ++i) {
    data.x(static_cast<int>(i), 0) = a[i];
    data.x(static_cast<int>(i), 1) = b[i];
    data.y[static_cast<int>(i)] = labels[i];
  }
  return data;
}

Eigen::MatrixXd rbf_gram(const Eigen::MatrixXd& x, double gamma) {
  Eigen::MatrixXd k(x.rows(), x.rows());
  for (int i = 0; i < x.rows(); ++i)
    for (int j = 0; j < x.rows(); ++j)
      k(i, j) = std::exp(-gamma * (x.row(i) - x.row(j)).squaredNorm());
  return k;
}

// Decision values of libsvm's own built-in kernel (no precomputed matrix), normalised to
// "positive means +1" with libsvm's documented convention (label[0] is the positive side).
std::vector<double> libsvm_builtin_decisions(const TwoClassData& data, int kernel_type,
                                             double gamma, double C) {
  const int n = static_cast<int>(data.x.rows());
  std::vector<std::vector<svm_node>> nodes(n);
  std::vector<svm_node*> rows(n);
  std::vector<double> y(n);
  for (int i = 0; i < n; ++i) {
    nodes[i] = {{1, data.x(i, 0)}, {2, data.x(i, 1)}, {-1, 0.0}};
    rows[i] = nodes[i].data();
    y[i] = data.y[i];
  }
  svm_problem problem{n, y.data(), rows.data()};
  svm_parameter param{};
  param.svm_type = C_SVC;
  param.kernel_type = kernel_type;
  param.gamma = gamma;
  param.cache_size = 16;
  param.eps = 1e-10;
  param.C = C;
  param.shrinking = 1;
  svm_model* model = svm_train(&problem, &param);
  const double sign = model->label[0] == 1 ? 1.0 : -1.0;
  std::vector<double> out(n);
  for (int i = 0; i < n; ++i) {
    double value = 0.0;
    svm_predict_values(model, rows[i], &value);
    out[i] = sign * value;
  }
  svm_free_and_destroy_model(&model);
  return out;
}

// Karush-Kuhn-Tucker conditions of the C-SVC dual (Vapnik 1998; Platt 1998 states them as the
// SMO stopping rule): alpha = 0 -> y f >= 1; 0 < alpha < C -> y f = 1; alpha = C -> y f <= 1;
// sum_i alpha_i y_i = 0; 0 <= alpha <= C.
void expect_kkt(const SvmModel& model, const Eigen::VectorXi& y, double tol) {
  EXPECT_NEAR(model.dual_coef.sum(), 0.0, 1e-9);
  for (int i = 0; i < y.size(); ++i) {
    const double alpha = model.dual_coef[i] * y[i];
    const double yf = y[i] * model.decision_train[i];
    ASSERT_GE(alpha, -1e-12) << "point " << i;
    ASSERT_LE(alpha, model.C * (1 + 1e-12)) << "point " << i;
    if (alpha <= 1e-12 * model.C) {
      EXPECT_GE(yf, 1.0 - tol) << "point " << i;
    } else if (alpha >= model.C * (1 - 1e-9)) {
      EXPECT_LE(yf, 1.0 + tol) << "point " << i;
    } else {
      EXPECT_NEAR(yf, 1.0, tol) << "point " << i;
    }
  }
}

// Primal objective 1/2 ||w||^2 + C sum hinge(y f); strong duality makes it equal the dual
// objective at the optimum (convex quadratic programme, Slater's condition holds).
double primal_objective(const SvmModel& model, const Eigen::VectorXi& y) {
  double hinge = 0.0;
  for (int i = 0; i < y.size(); ++i) hinge += std::max(0.0, 1.0 - y[i] * model.decision_train[i]);
  return 0.5 * model.w_norm_squared + model.C * hinge;
}

TEST(Svm, IrisLinearPrecomputedMatchesLibsvmBuiltinLinear) {
  // setosa vs versicolor; the file's first class (setosa) gets -1 to exercise the sign flip.
  const TwoClassData data = load_iris(0, 1, -1);
  ASSERT_EQ(data.x.rows(), 100);
  const Eigen::MatrixXd gram = data.x * data.x.transpose();
  SvmOptions options;
  options.C = 1.0;
  options.tolerance = 1e-10;
  const SvmModel model = gramline::train_svm(gram, data.y, options);
  const std::vector<double> reference = libsvm_builtin_decisions(data, LINEAR, 0.0, 1.0);
  for (int i = 0; i < data.y.size(); ++i) EXPECT_NEAR(model.decision_train[i], reference[i], 1e-6);
  // Sign convention of docs/plan-files.md: f > 0 on the +1 side for nearly all points.
  int agree = 0;
  for (int i = 0; i < data.y.size(); ++i) agree += (model.decision_train[i] > 0) == (data.y[i] > 0);
  EXPECT_GE(agree, 98);
}

TEST(Svm, IrisRbfPrecomputedMatchesLibsvmBuiltinRbf) {
  // versicolor vs virginica overlap on the sepal features: many bounded support vectors.
  const TwoClassData data = load_iris(1, 2, 1);
  const double gamma = 0.5;
  for (double C : {0.5, 10.0}) {
    SvmOptions options;
    options.C = C;
    options.tolerance = 1e-10;
    const SvmModel model = gramline::train_svm(rbf_gram(data.x, gamma), data.y, options);
    const std::vector<double> reference = libsvm_builtin_decisions(data, RBF, gamma, C);
    for (int i = 0; i < data.y.size(); ++i)
      EXPECT_NEAR(model.decision_train[i], reference[i], 1e-6) << "C " << C << " point " << i;
    EXPECT_GT(model.bounded_support_count(), 0);
  }
}

TEST(Svm, IrisSolutionSatisfiesKktAndStrongDuality) {
  for (int first_label : {1, -1}) {
    const TwoClassData data = load_iris(1, 2, first_label);
    SvmOptions options;
    options.C = 2.0;
    options.tolerance = 1e-9;
    const Eigen::MatrixXd gram = rbf_gram(data.x, 1.0);
    const SvmModel model = gramline::train_svm(gram, data.y, options);
    expect_kkt(model, data.y, 1e-6);
    const double primal = primal_objective(model, data.y);
    EXPECT_NEAR(primal, model.dual_objective, 1e-6 * std::max(1.0, primal));
    // ||w||^2 = a^T K a, and the margin is its inverse square root.
    EXPECT_NEAR(model.geometric_margin(),
                1.0 / std::sqrt(model.dual_coef.dot(gram * model.dual_coef)), 1e-12);
  }
}

TEST(Svm, SwappingLabelsNegatesTheDecisionFunction) {
  const TwoClassData data = load_iris(0, 1, 1);
  const Eigen::MatrixXd gram = rbf_gram(data.x, 0.3);
  SvmOptions options;
  options.tolerance = 1e-10;
  const SvmModel a = gramline::train_svm(gram, data.y, options);
  const SvmModel b = gramline::train_svm(gram, Eigen::VectorXi(-data.y), options);
  for (int i = 0; i < data.y.size(); ++i)
    EXPECT_NEAR(a.decision_train[i], -b.decision_train[i], 1e-6);
  EXPECT_EQ(a.support, b.support);
}

TEST(Svm, TwoPointsHaveTheTextbookSolution) {
  // Two points with K = [[1, k], [k, 1]], labels +1, -1 and large C: by symmetry b = 0, and
  // y f = 1 at both gives alpha (1 - k) = 1, so dual_coef = (1/(1-k), -1/(1-k)),
  // ||w||^2 = 2/(1-k) (worked by hand). libsvm caches kernel values in single precision
  // (Qfloat is float in svm.cpp), so agreement is to about 1e-7 relative, not 1e-15.
  const double k = 0.4;
  Eigen::MatrixXd gram(2, 2);
  gram << 1, k, k, 1;
  Eigen::VectorXi y(2);
  y << 1, -1;
  SvmOptions options;
  options.C = 100.0;
  options.tolerance = 1e-12;
  const SvmModel model = gramline::train_svm(gram, y, options);
  EXPECT_NEAR(model.dual_coef[0], 1.0 / (1.0 - k), 1e-6);
  EXPECT_NEAR(model.dual_coef[1], -1.0 / (1.0 - k), 1e-6);
  EXPECT_NEAR(model.bias, 0.0, 1e-6);
  EXPECT_NEAR(model.w_norm_squared, 2.0 / (1.0 - k), 1e-6);
  EXPECT_EQ(model.support.size(), 2u);
}

TEST(Svm, RejectsBadInput) {
  Eigen::MatrixXd gram = Eigen::MatrixXd::Identity(3, 3);
  Eigen::VectorXi one_class = Eigen::VectorXi::Ones(3);
  EXPECT_THROW(gramline::train_svm(gram, one_class), std::invalid_argument);
  Eigen::VectorXi y(3);
  y << 1, -1, 2;
  EXPECT_THROW(gramline::train_svm(gram, y), std::invalid_argument);
  y << 1, -1, 1;
  SvmOptions zero;
  zero.C = 0.0;
  EXPECT_THROW(gramline::train_svm(gram, y, zero), std::invalid_argument);
  EXPECT_THROW(gramline::train_svm(Eigen::MatrixXd::Identity(2, 2), y), std::invalid_argument);
}

TEST(Svm, AlignmentOfHandMadeKernels) {
  Eigen::VectorXi y(4);
  y << 1, 1, -1, -1;
  const Eigen::VectorXd yd = y.cast<double>();
  // The ideal kernel y y^T is perfectly aligned; its negative is anti-aligned (definition).
  EXPECT_NEAR(gramline::kernel_target_alignment(yd * yd.transpose(), y), 1.0, 1e-15);
  EXPECT_NEAR(gramline::kernel_target_alignment(-yd * yd.transpose(), y), -1.0, 1e-15);
  // Identity: <I, yy^T> = 4, ||I|| = 2, ||yy^T|| = 4, so 4 / 8 (by hand).
  EXPECT_NEAR(gramline::kernel_target_alignment(Eigen::MatrixXd::Identity(4, 4), y), 0.5, 1e-15);
  // All-ones kernel with balanced classes: <J, yy^T> = (sum y)^2 = 0.
  EXPECT_NEAR(gramline::kernel_target_alignment(Eigen::MatrixXd::Ones(4, 4), y), 0.0, 1e-15);
}

TEST(Svm, StratifiedFoldsHoldBothClassesAndEvenSizes) {
  Eigen::VectorXi y(23);
  for (int i = 0; i < 23; ++i) y[i] = i < 9 ? 1 : -1;
  const std::vector<int> fold = gramline::stratified_folds(y, 4, 11);
  std::vector<int> size(4, 0), positives(4, 0);
  for (int i = 0; i < 23; ++i) {
    ++size[fold[i]];
    positives[fold[i]] += y[i] > 0;
  }
  for (int f = 0; f < 4; ++f) {
    EXPECT_GE(size[f], 5);
    EXPECT_LE(size[f], 6);
    EXPECT_GE(positives[f], 2);
    EXPECT_LE(positives[f], 3);
  }
  EXPECT_EQ(fold, gramline::stratified_folds(y, 4, 11));
}

TEST(Svm, CrossValidationPrefersAUsefulKernelOverNoise) {
  // Iris setosa vs versicolor is linearly separable on sepal features up to one or two points
  // (common practice: the textbook easy pair), so held-out accuracy of an RBF kernel is high.
  const TwoClassData data = load_iris(0, 1, 1);
  gramline::CrossValidationOptions options;
  options.folds = 5;
  const auto cv = gramline::choose_C(rbf_gram(data.x, 0.5), data.y, options);
  EXPECT_GE(cv.best_accuracy, 0.95);
  EXPECT_EQ(cv.accuracy.size(), options.C_values.size());
  // An identity kernel carries no information between points: held-out accuracy near chance.
  const auto chance = gramline::choose_C(Eigen::MatrixXd::Identity(100, 100), data.y, options);
  EXPECT_LE(chance.best_accuracy, 0.6);
}

}  // namespace
