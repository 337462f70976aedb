#include "gramline/gram_error.h"

#include <Eigen/Eigenvalues>
#include <cmath>
#include <random>
#include <sstream>
#include <vector>

#include "gramline/budget.h"
#include "gramline/field_check.h"
#include "gramline/parallel.h"
#include "gramline/random.h"

namespace gramline {

namespace {
// log Phi(x) for the standard normal cdf, accurate far in the lower tail.
double log_normal_cdf(double x) { return std::log(0.5 * std::erfc(-x / std::sqrt(2.0))); }
}  // namespace

void GramErrorOptions::validate() const {
  FieldCheck("GramErrorOptions")
      .at_least("monte_carlo_trials", monte_carlo_trials, 0)
      .at_least("threads", threads, 0)
      .inside("confidence", confidence, 0.0, 1.0)
      .throw_if_failed();
}

GramError predict_gram_error(const Eigen::MatrixXd& gram, const Eigen::MatrixXd& sigma,
                             const GramErrorOptions& options) {
  options.validate();
  GramError out;
  out.options = options;
  out.options.hooks = WorkHooks{};
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
    const int trials = options.monte_carlo_trials;
    const Eigen::MatrixXd sd = variance.cwiseSqrt();
    std::vector<char> negative(trials, 0);
    parallel_for(trials, options.threads, options.hooks, [&](int t) {
      SplitMix64 rng(stream_seed(options.seed, t));
      std::normal_distribution<double> gauss(0.0, 1.0);
      Eigen::MatrixXd noisy = gram;
      for (int i = 0; i < n; ++i)
        for (int j = i + 1; j < n; ++j) {
          const double e = sd(i, j) * gauss(rng);
          noisy(i, j) += e;
          noisy(j, i) += e;
        }
      Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> es(noisy, Eigen::EigenvaluesOnly);
      negative[t] = es.eigenvalues()(0) < 0;
    });
    int negatives = 0;
    for (char v : negative) negatives += v;
    const Interval ci = wilson_interval(negatives, trials, options.confidence);
    out.p_negative_eigenvalue = static_cast<double>(negatives) / trials;
    out.p_negative_low = ci.low;
    out.p_negative_high = ci.high;
    out.threads_used = loop_thread_count(options.threads, trials);
  }
  return out;
}

std::string GramError::report() const {
  std::ostringstream o;
  o.precision(3);
  o << "Gram error: Frobenius sigma " << sigma_frobenius << ", spectral ~" << spectral_estimate
    << ", largest entry sigma " << sigma_max << "\n"
    << "Smallest ideal eigenvalue " << min_eigenvalue << "; P(measured Gram has a negative "
    << "eigenvalue) = " << p_negative_eigenvalue;
  if (options.monte_carlo_trials > 0) {
    o << " [" << p_negative_low << ", " << p_negative_high << "] at " << 100 * options.confidence
      << "%, counted over " << options.monte_carlo_trials << " simulated matrices (seed "
      << options.seed << ", " << threads_used << " thread(s))";
  } else {
    o << " (first-order perturbation)";
  }
  o << "\n";
  return o.str();
}

}  // namespace gramline
