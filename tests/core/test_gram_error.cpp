// Predicted Gram-matrix error (gram_error.h) against closed forms and random-matrix theory.
#include <gtest/gtest.h>

#include <Eigen/Eigenvalues>
#include <boost/math/distributions/normal.hpp>
#include <cmath>
#include <random>

#include "gramline/gram_error.h"

namespace {

// Homogeneous per-entry sigma: s off the diagonal, 0 on it (the diagonal is 1 by construction).
Eigen::MatrixXd homogeneous_sigma(int n, double s) {
  Eigen::MatrixXd sigma = Eigen::MatrixXd::Constant(n, n, s);
  sigma.diagonal().setZero();
  return sigma;
}

// Symmetric noise with independent N(0, s^2) entries above the diagonal, zero diagonal.
Eigen::MatrixXd symmetric_noise(int n, double s, std::mt19937_64& rng) {
  std::normal_distribution<double> g(0.0, s);
  Eigen::MatrixXd e = Eigen::MatrixXd::Zero(n, n);
  for (int i = 0; i < n; ++i) {
    for (int j = i + 1; j < n; ++j) e(i, j) = e(j, i) = g(rng);
  }
  return e;
}

// Frobenius norm of the sigma matrix: N(N-1) off-diagonal entries of sigma each, so
// sqrt(sum sigma_ij^2) = sigma sqrt(N (N - 1)) (definition in the header).
TEST(GramError, FrobeniusOfHomogeneousSigma) {
  for (int n : {2, 5, 48}) {
    const double s = 0.013;
    const gramline::GramError e =
        gramline::predict_gram_error(Eigen::MatrixXd::Identity(n, n), homogeneous_sigma(n, s));
    EXPECT_NEAR(e.sigma_frobenius, s * std::sqrt(static_cast<double>(n) * (n - 1)), 1e-14) << n;
    EXPECT_NEAR(e.sigma_max, s, 1e-15);
    EXPECT_NEAR(e.min_eigenvalue, 1.0, 1e-12);
  }
}

// Wigner semicircle law (common practice): a symmetric N x N matrix with independent entries of
// standard deviation s has spectral norm close to 2 s sqrt(N) for large N. The header's
// estimate 2 max_i sqrt(sum_j sigma_ij^2) equals 2 s sqrt(N - 1) here. Compare both with the
// spectral norm of simulated noise (Eigen's SelfAdjointEigenSolver) within 20 %.
TEST(GramError, SpectralEstimateNearSemicircleEdge) {
  const int n = 100;
  const double s = 0.01;
  const gramline::GramError e =
      gramline::predict_gram_error(Eigen::MatrixXd::Identity(n, n), homogeneous_sigma(n, s));
  EXPECT_NEAR(e.spectral_estimate, 2 * s * std::sqrt(n - 1.0), 1e-12);
  EXPECT_NEAR(e.spectral_estimate / (2 * s * std::sqrt(static_cast<double>(n))), 1.0, 0.01);

  std::mt19937_64 rng(4242);
  double mean_norm = 0.0;
  const int trials = 40;
  for (int t = 0; t < trials; ++t) {
    Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(symmetric_noise(n, s, rng),
                                                       Eigen::EigenvaluesOnly);
    mean_norm += eig.eigenvalues().cwiseAbs().maxCoeff() / trials;
  }
  EXPECT_NEAR(e.spectral_estimate / mean_norm, 1.0, 0.2) << "simulated " << mean_norm;
}

// A non-homogeneous case: the estimate follows the row with the largest sum of variances.
TEST(GramError, SpectralEstimateUsesLargestRow) {
  Eigen::MatrixXd sigma = homogeneous_sigma(4, 0.01);
  sigma(0, 3) = sigma(3, 0) = 0.05;
  const gramline::GramError e =
      gramline::predict_gram_error(Eigen::MatrixXd::Identity(4, 4), sigma);
  // Rows 0 and 3: 0.01^2 + 0.01^2 + 0.05^2.
  EXPECT_NEAR(e.spectral_estimate, 2 * std::sqrt(2 * 1e-4 + 25e-4), 1e-12);
  EXPECT_NEAR(e.sigma_max, 0.05, 1e-15);
  EXPECT_NEAR(e.sigma_frobenius, std::sqrt(10 * 1e-4 + 2 * 25e-4), 1e-12);
}

// Well conditioned (identity) with small noise: eigenvalues 1 +- O(sigma sqrt N) stay far from 0.
TEST(GramError, NegativeEigenvalueUnlikelyForWellConditionedMatrix) {
  const gramline::GramError e =
      gramline::predict_gram_error(Eigen::MatrixXd::Identity(10, 10), homogeneous_sigma(10, 0.01));
  EXPECT_LT(e.p_negative_eigenvalue, 1e-6);
  EXPECT_GE(e.p_negative_eigenvalue, 0.0);
}

// Rank deficient (all ones, rank 1: eigenvalues N and N-1 zeros) with sizeable noise: each zero
// eigenvalue moves by a zero-mean Gaussian, so some eigenvalue goes negative with probability
// about 1 - 2^-(N-1).
TEST(GramError, NegativeEigenvalueLikelyForRankDeficientMatrix) {
  const int n = 10;
  const gramline::GramError e =
      gramline::predict_gram_error(Eigen::MatrixXd::Ones(n, n), homogeneous_sigma(n, 0.05));
  EXPECT_NEAR(e.min_eigenvalue, 0.0, 1e-12);
  EXPECT_GT(e.p_negative_eigenvalue, 0.95);
  EXPECT_LE(e.p_negative_eigenvalue, 1.0);
}

// Easy case with an exact answer: K = [[1, c], [c, 1]], noise e on the off-diagonal. The
// eigenvalues are exactly 1 - c - e and 1 + c + e, so P(negative) = P(e > 1 - c)
// = Phi(-(1 - c)/sigma) (normal cdf from Boost.Math). First-order perturbation is exact here
// (v = (1, -1)/sqrt2, variance 4 v1^2 v2^2 sigma^2 = sigma^2), and the Monte Carlo option must
// agree within its interval.
TEST(GramError, MonteCarloAgreesWithAnalyticInEasyCase) {
  const double c = 0.98, s = 0.02;
  Eigen::MatrixXd k(2, 2);
  k << 1.0, c, c, 1.0;
  const Eigen::MatrixXd sigma = homogeneous_sigma(2, s);
  const boost::math::normal_distribution<double> standard(0.0, 1.0);
  const double exact = boost::math::cdf(standard, -(1.0 - c) / s);  // Phi(-1) = 0.1587

  const gramline::GramError analytic = gramline::predict_gram_error(k, sigma);
  EXPECT_NEAR(analytic.min_eigenvalue, 1.0 - c, 1e-12);
  EXPECT_NEAR(analytic.p_negative_eigenvalue, exact, 1e-6);

  gramline::GramErrorOptions mc;
  mc.monte_carlo_trials = 20000;
  mc.seed = 7;
  const gramline::GramError sim = gramline::predict_gram_error(k, sigma, mc);
  const double se = std::sqrt(exact * (1 - exact) / mc.monte_carlo_trials);
  EXPECT_NEAR(sim.p_negative_eigenvalue, exact, 4 * se);
  EXPECT_LE(sim.p_negative_low, sim.p_negative_eigenvalue);
  EXPECT_GE(sim.p_negative_high, sim.p_negative_eigenvalue);
  EXPECT_LE(sim.p_negative_low, exact + 1e-3);
  EXPECT_GE(sim.p_negative_high, exact - 1e-3);
  EXPECT_LT(sim.p_negative_high - sim.p_negative_low, 10 * se);
  // Same seed, same answer.
  EXPECT_EQ(gramline::predict_gram_error(k, sigma, mc).p_negative_eigenvalue,
            sim.p_negative_eigenvalue);
}

// A larger case where the analytic first-order figure and the Monte Carlo count should agree
// roughly: two nearly degenerate points among well separated ones.
TEST(GramError, MonteCarloAndAnalyticAgreeOnModerateMatrix) {
  const int n = 6;
  Eigen::MatrixXd k = Eigen::MatrixXd::Identity(n, n) * 1.0;
  for (int i = 0; i < n; ++i)
    for (int j = 0; j < n; ++j)
      if (i != j) k(i, j) = 0.1;
  k(0, 1) = k(1, 0) = 0.97;
  const Eigen::MatrixXd sigma = homogeneous_sigma(n, 0.015);
  const gramline::GramError analytic = gramline::predict_gram_error(k, sigma);
  gramline::GramErrorOptions mc;
  mc.monte_carlo_trials = 20000;
  mc.seed = 3;
  const gramline::GramError sim = gramline::predict_gram_error(k, sigma, mc);
  EXPECT_GT(analytic.p_negative_eigenvalue, 0.01);
  EXPECT_LT(analytic.p_negative_eigenvalue, 0.99);
  EXPECT_NEAR(sim.p_negative_eigenvalue, analytic.p_negative_eigenvalue, 0.05);
}

TEST(GramError, ReportMentionsFigures) {
  const gramline::GramError e =
      gramline::predict_gram_error(Eigen::MatrixXd::Identity(3, 3), homogeneous_sigma(3, 0.01));
  EXPECT_FALSE(e.report().empty());
}

TEST(GramError, CancelFlagStopsMonteCarlo) {
  gramline::CancelFlag cancel{true};
  gramline::GramErrorOptions mc;
  mc.monte_carlo_trials = 100000;
  mc.hooks.cancel = &cancel;
  EXPECT_THROW(gramline::predict_gram_error(Eigen::MatrixXd::Identity(20, 20),
                                            homogeneous_sigma(20, 0.01), mc),
               gramline::Cancelled);
}

}  // namespace
