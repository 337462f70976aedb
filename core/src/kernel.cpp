#include "gramline/kernel.h"

#include "gramline/jones.h"

namespace gramline {

namespace {
// Per-point, per-photon states, computed once so Gram matrices cost one overlap per entry.
std::vector<JonesVector> states_of(const EncodingMap& encoding, const Eigen::MatrixXd& points) {
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
  const auto s = states_of(encoding, train);
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
  const auto st = states_of(encoding, test);
  const auto sr = states_of(encoding, train);
  Eigen::MatrixXd k(test.rows(), train.rows());
  for (int i = 0; i < test.rows(); ++i) {
    for (int j = 0; j < train.rows(); ++j) {
      k(i, j) =
          product_overlap(&st[static_cast<size_t>(i) * p], &sr[static_cast<size_t>(j) * p], p);
    }
  }
  return k;
}

}  // namespace gramline
