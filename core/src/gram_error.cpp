#include "gramline/gram_error.h"

#include <Eigen/Eigenvalues>
#include <cmath>
#include <random>
#include <sstream>

#include "gramline/budget.h"

namespace gramline {

namespace {
// log Phi(x) for the standard normal cdf, accurate far in the lower tail.
double log_normal_cdf(double x) { return std::log(0.5 * std::erfc(-x / std::sqrt(2.0))); }
}  // namespace

GramError predict_gram_error(const Eigen::MatrixXd& gram, const Eigen::MatrixXd& sigma,
                             const GramErrorOptions& options) {
  GramError out;
  const int n = static_cast<int>(gram.rows());
  if (n == 0) return out;
  Eigen::MatrixXd variance = sigma.cwiseAbs2();
  variance.diagonal().setZero();
  out.sigma_frobenius = std::sqrt(variance.sum());
  out.sigma_max = std::sqrt(variance.maxCoeff());
  out.spectral_estimate = 2.0 * std::sqrt(variance.rowwise().sum().maxCoeff());

  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(gram);
  const Eigen::VectorXd lambda = eig.eigenvalues();
  out.min_eigenvalue = lambda.minCoeff();
  options.hooks.throw_if_cancelled();

  // First-order perturbation: lambda_k shifts by v_k^T E v_k, whose variance is
  // 2 sum_{i != j} v_ki^2 v_kj^2 sigma_ij^2 = 2 w_k^T S w_k with w_k = v_k o v_k.
  const Eigen::MatrixXd w = eig.eigenvectors().cwiseAbs2();
  const Eigen::VectorXd shift_var = 2.0 * (w.transpose() * variance * w).diagonal();
  double log_all_positive = 0.0;
  for (int k = 0; k < n; ++k) {
    const double s = std::sqrt(std::max(shift_var(k), 0.0));
    if (s > 0) {
      log_all_positive += log_normal_cdf(lambda(k) / s);
    } else if (lambda(k) < 0) {
      log_all_positive = -INFINITY;
    }
  }
  out.p_negative_eigenvalue = 1.0 - std::exp(log_all_positive);
  out.p_negative_low = out.p_negative_high = out.p_negative_eigenvalue;

  if (options.monte_carlo_trials > 0) {
    std::mt19937_64 rng(options.seed);
    std::normal_distribution<double> gauss(0.0, 1.0);
    const Eigen::MatrixXd sd = variance.cwiseSqrt();
    int negatives = 0;
    Eigen::MatrixXd noisy(n, n);
    for (int t = 0; t < options.monte_carlo_trials; ++t) {
      options.hooks.throw_if_cancelled();
      noisy = gram;
      for (int i = 0; i < n; ++i)
        for (int j = i + 1; j < n; ++j) {
          const double e = sd(i, j) * gauss(rng);
          noisy(i, j) += e;
          noisy(j, i) += e;
        }
      Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> es(noisy, Eigen::EigenvaluesOnly);
      if (es.eigenvalues()(0) < 0) ++negatives;
      options.hooks.report(static_cast<double>(t + 1) / options.monte_carlo_trials);
    }
    const Interval ci = wilson_interval(negatives, options.monte_carlo_trials, 0.95);
    out.p_negative_eigenvalue = static_cast<double>(negatives) / options.monte_carlo_trials;
    out.p_negative_low = ci.low;
    out.p_negative_high = ci.high;
  }
  return out;
}

std::string GramError::report() const {
  std::ostringstream o;
  o.precision(3);
  o << "Gram error: Frobenius sigma " << sigma_frobenius << ", spectral ~" << spectral_estimate
    << ", largest entry sigma " << sigma_max << "\n"
    << "Smallest ideal eigenvalue " << min_eigenvalue << "; P(measured Gram has a negative "
    << "eigenvalue) = " << p_negative_eigenvalue << "\n";
  return o.str();
}

}  // namespace gramline
