#pragma once
// Predicted error of the measured Gram matrix.
#include <Eigen/Core>
#include <cstdint>
#include <string>

#include "gramline/progress.h"

namespace gramline {

struct GramErrorOptions {
  int monte_carlo_trials = 0;  ///< 0: analytic estimate only; else also a Monte Carlo check
  std::uint64_t seed = 1;      ///< trial t draws from stream_seed(seed, t) (random.h)
  int threads = 0;             ///< of the Monte Carlo; 0: all cores
  double confidence = 0.95;    ///< of the Monte Carlo interval
  WorkHooks hooks;
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

struct GramError {
  double sigma_frobenius = 0.0;  ///< sqrt(sum_ij sigma_ij^2) over the full N x N matrix
  double sigma_max = 0.0;        ///< largest per-entry sigma
  double spectral_estimate =
      0.0;                      ///< estimate of E||E||_2: 2 max_i sqrt(sum_j sigma_ij^2)
                                ///< (Bandeira & van Handel, Ann. Probab. 44 (2016), leading term)
  double min_eigenvalue = 0.0;  ///< smallest eigenvalue of the ideal Gram matrix
  double p_negative_eigenvalue = 0.0;  ///< probability the measured matrix has one < 0
  double p_negative_low = 0.0, p_negative_high = 1.0;  ///< Monte Carlo interval, if run
  GramErrorOptions options;                            ///< as run, without hooks
  int threads_used = 0;  ///< of the Monte Carlo (0 when it did not run)
  std::string report() const;
};

/// `gram` is the ideal N x N matrix, `sigma` the per-entry standard deviations (symmetric,
/// zero diagonal). The negative-eigenvalue probability uses first-order perturbation of every
/// eigenvalue, lambda_k + v_k^T E v_k with variance 4 sum_{i<j} v_ki^2 v_kj^2 sigma_ij^2, taken as
/// independent Gaussians; with monte_carlo_trials > 0 it is instead counted over simulated
/// matrices (Wilson interval), whatever the thread count the same for a given seed.
GramError predict_gram_error(const Eigen::MatrixXd& gram, const Eigen::MatrixXd& sigma,
                             const GramErrorOptions& options = {});

}  // namespace gramline
