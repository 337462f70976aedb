#pragma once
// Predicted error of the measured training Gram matrix (README, user guide step 12): per-entry
// and matrix-norm figures, the expected spectral norm of the error and the probability that the
// measured matrix has a negative eigenvalue.
//
// The noise model is Gaussian: independent per-entry noise (one standard deviation per entry)
// plus any number of shared components, each one standard normal per draw that moves a set of
// entries together (the calibration taken from one reference step, for example). Both the
// negative-eigenvalue probability and the spectral norm come from a seeded simulation of the
// noisy matrix K + E: GramErrorOptions::draws (default 1000) draws of E, each used twice, as
// K + E and K - E (antithetic variates, Hammersley & Morton, Proc. Camb. Phil. Soc. 52 (1956)
// 449), of which GramErrorOptions::spectral_draws (default 100, more while the mean's standard
// error is above 1 %) also solve for the eigenvalues of E. Up to GramErrorOptions::full_size_limit
// (default 250) training points every draw is made; above it the draws shrink with the cube of the
// size (the cost of one draw), down to at least 100 and 10, and the result says it is that
// approximation (GramError::reduced).
#include <Eigen/Core>
#include <cstdint>
#include <string>
#include <vector>

#include "gramline/progress.h"

namespace gramline {

/// One entry's share of a shared noise component, kernel units per unit of the common normal.
struct EntryLoading {
  int row = 0;
  int col = 0;
  double loading = 0.0;  ///< added to entries (row, col) and (col, row); row != col
};

/// A Gaussian noise source common to several entries: each draw takes one standard normal g
/// and adds g * loading to every listed entry.
struct SharedNoiseComponent {
  std::string label;  ///< what it stands for, e.g. "reference step 12"
  std::vector<EntryLoading> loadings;
};

/// Noise of the measured symmetric N x N matrix:
/// E = sum_{i<j} sigma_ij z_ij (e_i e_j^T + e_j e_i^T) + sum_c g_c L_c, with independent
/// standard normals z_ij and g_c, and L_c the symmetric matrix of component c's loadings.
struct GramNoise {
  Eigen::MatrixXd sigma;  ///< N x N independent standard deviation per entry; the diagonal is
                          ///< ignored (it is 1 by construction and not measured)
  std::vector<SharedNoiseComponent> shared;
};

struct GramErrorOptions {
  /// Draws of the noise E for the negative-eigenvalue probability, each scored on K + E and
  /// K - E; the standard error is at most 0.5 / sqrt(draws) (0.016 for 1000) and, with the
  /// pairing, about 0.009 at worst in the sets the tests try.
  int draws = 1000;
  /// Of those draws, how many at least also give the spectral norm of the noise (one
  /// eigenvalue solve each). While the standard error of their mean exceeds
  /// spectral_relative_error of it (shared components make the norm vary), the count doubles,
  /// up to 10 times this and at most `draws`.
  int spectral_draws = 100;
  double spectral_relative_error = 0.01;
  /// Largest N simulated with every draw. Above it the draws scale by (limit / N)^3, at least
  /// 100 (spectral: 10): the labelled approximation GramError::reduced.
  int full_size_limit = 250;
  std::uint64_t seed = 1;
  int threads = 0;  ///< 0: all cores; the result does not depend on the count
  WorkHooks hooks;
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

struct GramError {
  GramErrorOptions options;  ///< what the estimate ran with (hooks cleared)
  int size = 0;              ///< N
  /// sqrt(sum over i != j of Var E_ij), shared components included: the standard deviation of
  /// the whole error in Frobenius norm.
  double sigma_frobenius = 0.0;
  double sigma_max = 0.0;       ///< largest per-entry standard deviation, shared included
  double min_eigenvalue = 0.0;  ///< smallest eigenvalue of the ideal Gram matrix
  /// Upper bound on the expected spectral norm E||E||_2 of a matrix Gaussian series,
  /// sqrt(2 v log(2N)) with v >= ||E[E^2]|| (Tropp, Found. Trends Mach. Learn. 8 (2015) 1,
  /// Theorem 4.1.1); for shared components v uses ||L_c||_2 <= max row sum of |L_c|.
  double spectral_upper_bound = 0.0;

  bool simulated = false;  ///< false: only the figures above (describe_gram_noise)
  bool reduced = false;    ///< N above full_size_limit: fewer draws than asked (approximation)
  int draws = 0;           ///< draws made
  int threads_used = 0;    ///< threads of the simulation (the result does not depend on them)
  int spectral_draws = 0;  ///< draws that solved for the spectral norm (after any doubling)
  /// Share of the simulated matrices (K + E and K - E over all draws) with an eigenvalue
  /// below zero; NaN when not simulated.
  double p_negative_eigenvalue = 0.0;
  /// 95 % Wilson interval (Wilson 1927) over `draws` trials, conservative for the pairing.
  double p_negative_low = 0.0, p_negative_high = 1.0;
  double p_negative_standard_error = 0.0;  ///< from the spread of the pair scores
  /// Mean spectral norm of the simulated noise: the estimate of E||E||_2; NaN when not
  /// simulated.
  double spectral_estimate = 0.0;
  double spectral_standard_error = 0.0;  ///< of that mean
  double elapsed_ms = 0.0;               ///< wall time of the estimate

  /// One line naming the method: draws, seed, and whether the reduced approximation ran.
  std::string method() const;
  std::string report() const;
};

/// The figures that need no simulation: the norms of the noise, the smallest ideal eigenvalue
/// and the spectral upper bound. `gram` is the ideal N x N matrix. Throws std::invalid_argument
/// for mismatched sizes, a loading on the diagonal or outside the matrix, or a non-finite sigma
/// or loading.
GramError describe_gram_noise(const Eigen::MatrixXd& gram, const GramNoise& noise);

/// describe_gram_noise plus the simulation of the noisy matrix. Draw d takes its normals from
/// the stream stream_seed(seed, d) (random.h), shared components first, then the entries
/// column by column of the lower triangle, so the result is the same for every thread count.
/// A matrix K +- E counts as negative when the Cholesky factorisation of K +- E + t I fails,
/// t = 1e-10 (1 + trace K / N) absorbing rounding. Throws Cancelled when the cancel flag is
/// raised.
GramError predict_gram_error(const Eigen::MatrixXd& gram, const GramNoise& noise,
                             const GramErrorOptions& options = {});

/// Same, with independent per-entry noise only.
GramError predict_gram_error(const Eigen::MatrixXd& gram, const Eigen::MatrixXd& sigma,
                             const GramErrorOptions& options = {});

}  // namespace gramline
