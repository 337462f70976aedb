#include "gramline/kernel.h"

#include <Eigen/Cholesky>
#include <Eigen/Eigenvalues>
#include <limits>

namespace gramline {

std::vector<JonesVector> photon_states(const EncodingMap& encoding, const Eigen::MatrixXd& points) {
  const int p_count = encoding.photon_count();
  std::vector<JonesVector> states(static_cast<size_t>(points.rows()) * p_count);
  for (int i = 0; i < points.rows(); ++i) {
    const Eigen::VectorXd x = points.row(i).transpose();
    for (int p = 0; p < p_count; ++p) {
      const BlochAngles a = encoding.angles(p, x);
      states[static_cast<size_t>(i) * p_count + p] = bloch_state(a.theta_deg, a.phi_deg);
    }
  }
  return states;
}

namespace {
double product_overlap(const JonesVector* a, const JonesVector* b, int photons) {
  double k = 1.0;
  for (int p = 0; p < photons; ++p) k *= overlap(a[p], b[p]);
  return k;
}
}  // namespace

double ideal_kernel(const EncodingMap& encoding, const Eigen::VectorXd& a,
                    const Eigen::VectorXd& b) {
  double k = 1.0;
  for (int p = 0; p < encoding.photon_count(); ++p) {
    const BlochAngles sa = encoding.angles(p, a);
    const BlochAngles sb = encoding.angles(p, b);
    k *= overlap(bloch_state(sa.theta_deg, sa.phi_deg), bloch_state(sb.theta_deg, sb.phi_deg));
  }
  return k;
}

Eigen::MatrixXd ideal_gram(const EncodingMap& encoding, const Eigen::MatrixXd& train) {
  const int n = static_cast<int>(train.rows());
  const int p = encoding.photon_count();
  const auto s = photon_states(encoding, train);
  Eigen::MatrixXd k = Eigen::MatrixXd::Identity(n, n);
  for (int i = 0; i < n; ++i) {
    for (int j = i + 1; j < n; ++j) {
      k(i, j) = k(j, i) =
          product_overlap(&s[static_cast<size_t>(i) * p], &s[static_cast<size_t>(j) * p], p);
    }
  }
  return k;
}

Eigen::MatrixXd ideal_cross(const EncodingMap& encoding, const Eigen::MatrixXd& test,
                            const Eigen::MatrixXd& train) {
  const int p = encoding.photon_count();
  const auto st = photon_states(encoding, test);
  const auto sr = photon_states(encoding, train);
  Eigen::MatrixXd k(test.rows(), train.rows());
  for (int i = 0; i < test.rows(); ++i) {
    for (int j = 0; j < train.rows(); ++j) {
      k(i, j) =
          product_overlap(&st[static_cast<size_t>(i) * p], &sr[static_cast<size_t>(j) * p], p);
    }
  }
  return k;
}

bool repair_psd(Eigen::MatrixXd& gram, bool keep_unit_diagonal) {
  // A Cholesky factorisation succeeding proves positive definiteness at a tenth of the cost of
  // the eigendecomposition, so the common well-measured case stays cheap.
  if (Eigen::LLT<Eigen::MatrixXd>(gram).info() == Eigen::Success) return false;
  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(gram);
  const Eigen::VectorXd lambda = eig.eigenvalues();
  if (lambda.minCoeff() >= 0.0) return false;
  const Eigen::MatrixXd& v = eig.eigenvectors();
  gram = v * lambda.cwiseMax(0.0).asDiagonal() * v.transpose();
  if (keep_unit_diagonal) {
    Eigen::VectorXd d = gram.diagonal().cwiseMax(std::numeric_limits<double>::min());
    d = d.cwiseSqrt().cwiseInverse();
    gram = d.asDiagonal() * gram * d.asDiagonal();
  }
  gram = 0.5 * (gram + gram.transpose()).eval();
  return true;
}

}  // namespace gramline
