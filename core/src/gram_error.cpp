#include "gramline/gram_error.h"

#include <Eigen/Cholesky>
#include <Eigen/Eigenvalues>
#include <algorithm>
#include <chrono>
#include <cmath>
#include <limits>
#include <numbers>
#include <sstream>
#include <stdexcept>
#include <tuple>
#include <utility>

#include "gramline/budget.h"
#include "gramline/field_check.h"
#include "gramline/parallel.h"
#include "gramline/random.h"

namespace gramline {

namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();
// Floors of the reduced approximation above full_size_limit.
constexpr int kReducedMinDraws = 100;
constexpr int kReducedMinSpectralDraws = 10;
// The spectral draws grow at most to this many times the number asked.
constexpr int kSpectralGrowth = 10;

// Standard normals by the Box-Muller transform (Box & Muller, Ann. Math. Stat. 29 (1958) 610)
// from a SplitMix64 stream: the same numbers on every standard library.
class NormalStream {
 public:
  explicit NormalStream(std::uint64_t seed) : rng_(seed) {}
  double next() {
    if (has_spare_) {
      has_spare_ = false;
      return spare_;
    }
    const double u1 = (static_cast<double>(rng_() >> 11) + 1.0) * 0x1.0p-53;  // (0, 1]
    const double u2 = static_cast<double>(rng_() >> 11) * 0x1.0p-53;          // [0, 1)
    const double radius = std::sqrt(-2.0 * std::log(u1));
    const double angle = 2.0 * std::numbers::pi * u2;
    spare_ = radius * std::sin(angle);
    has_spare_ = true;
    return radius * std::cos(angle);
  }

 private:
  SplitMix64 rng_;
  double spare_ = 0.0;
  bool has_spare_ = false;
};

void check_noise(const Eigen::MatrixXd& gram, const GramNoise& noise) {
  const long n = gram.rows();
  if (gram.cols() != n) throw std::invalid_argument("Gram error: the Gram matrix is not square");
  if (noise.sigma.rows() != n || noise.sigma.cols() != n)
    throw std::invalid_argument("Gram error: sigma must be " + std::to_string(n) + " x " +
                                std::to_string(n) + " like the Gram matrix");
  for (long j = 0; j < n; ++j)
    for (long i = 0; i < n; ++i)
      if (i != j && !std::isfinite(noise.sigma(i, j)))
        throw std::invalid_argument("Gram error: sigma(" + std::to_string(i) + ", " +
                                    std::to_string(j) + ") is not finite");
  for (const SharedNoiseComponent& c : noise.shared)
    for (const EntryLoading& l : c.loadings)
      if (l.row < 0 || l.col < 0 || l.row >= n || l.col >= n || l.row == l.col ||
          !std::isfinite(l.loading))
        throw std::invalid_argument("Gram error: shared component '" + c.label +
                                    "' has a loading on the diagonal, outside the matrix or not "
                                    "finite");
}

// Per-worker buffers of the simulation.
struct DrawWorkspace {
  Eigen::MatrixXd noise;  // lower triangle holds E
  Eigen::MatrixXd shifted;
  Eigen::LLT<Eigen::MatrixXd> cholesky;
  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eigen;
  std::vector<double> common;  // one normal per shared component
  DrawWorkspace(long n, size_t components)
      : noise(Eigen::MatrixXd::Zero(n, n)),
        shifted(Eigen::MatrixXd::Zero(n, n)),
        cholesky(n),
        eigen(n),
        common(components, 0.0) {}
};

}  // namespace

GramError describe_gram_noise(const Eigen::MatrixXd& gram, const GramNoise& noise) {
  check_noise(gram, noise);
  GramError out;
  const long n = gram.rows();
  out.size = static_cast<int>(n);
  out.p_negative_eigenvalue = out.spectral_estimate = kNaN;
  out.p_negative_low = 0.0;
  out.p_negative_high = 1.0;
  out.p_negative_standard_error = out.spectral_standard_error = kNaN;
  if (n == 0) return out;

  // Marginal variance of every entry: independent part plus the shared components.
  Eigen::MatrixXd variance = noise.sigma.cwiseAbs2();
  variance.diagonal().setZero();
  double shared_v = 0.0;  // sum_c ||L_c||_2^2, each norm bounded by the largest row sum of |L_c|
  Eigen::MatrixXd l = Eigen::MatrixXd::Zero(n, n);  // one component's L_c, cleared after use
  for (const SharedNoiseComponent& c : noise.shared) {
    for (const EntryLoading& e : c.loadings) {
      l(e.row, e.col) += e.loading;
      l(e.col, e.row) += e.loading;
    }
    Eigen::VectorXd row_sum = Eigen::VectorXd::Zero(n);
    for (const EntryLoading& e : c.loadings) {
      const double x = l(e.row, e.col);  // 0 once counted, when an entry is listed twice
      variance(e.row, e.col) += x * x;
      variance(e.col, e.row) += x * x;
      row_sum(e.row) += std::abs(x);
      row_sum(e.col) += std::abs(x);
      l(e.row, e.col) = l(e.col, e.row) = 0.0;
    }
    shared_v += row_sum.maxCoeff() * row_sum.maxCoeff();
  }
  out.sigma_frobenius = std::sqrt(variance.sum());
  out.sigma_max = std::sqrt(variance.maxCoeff());

  // E[E^2] = diag(sum_j sigma_ij^2) + sum_c L_c^2 for the series E = sum_k g_k A_k.
  Eigen::MatrixXd independent = noise.sigma.cwiseAbs2();
  independent.diagonal().setZero();
  const double v = independent.rowwise().sum().maxCoeff() + shared_v;
  out.spectral_upper_bound = std::sqrt(2.0 * v * std::log(2.0 * static_cast<double>(n)));

  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(gram, Eigen::EigenvaluesOnly);
  out.min_eigenvalue = eig.eigenvalues().minCoeff();
  return out;
}

void GramErrorOptions::validate() const {
  FieldCheck("GramErrorOptions")
      .at_least("draws", draws, 1)
      .at_least("spectral_draws", spectral_draws, 0)
      .inside("spectral_relative_error", spectral_relative_error, 0.0, 1.0)
      .at_least("full_size_limit", full_size_limit, 1)
      .at_least("threads", threads, 0)
      .throw_if_failed();
}

GramError predict_gram_error(const Eigen::MatrixXd& gram, const GramNoise& noise,
                             const GramErrorOptions& options) {
  const auto t0 = std::chrono::steady_clock::now();
  options.validate();
  GramError out = describe_gram_noise(gram, noise);
  out.options = options;
  out.options.hooks = {};
  const long n = gram.rows();
  if (n == 0) return out;
  options.hooks.throw_if_cancelled();

  int draws = options.draws;
  int spectral_draws = std::min(options.spectral_draws, options.draws);
  if (n > options.full_size_limit) {
    // One draw costs ~N^3 (Cholesky, eigenvalues): keep the total near that at the limit.
    const double scale = std::pow(static_cast<double>(options.full_size_limit) / n, 3.0);
    draws = std::max(std::min(draws, kReducedMinDraws), static_cast<int>(std::ceil(draws * scale)));
    spectral_draws = std::max(std::min(spectral_draws, kReducedMinSpectralDraws),
                              static_cast<int>(std::ceil(spectral_draws * scale)));
    spectral_draws = std::min(spectral_draws, draws);
    out.reduced = draws < options.draws || spectral_draws < options.spectral_draws;
  }

  // Each shared component's loadings as (lower-triangle index, loading).
  struct Loading {
    long i, j;
    double value;
  };
  std::vector<std::vector<Loading>> shared(noise.shared.size());
  for (size_t c = 0; c < noise.shared.size(); ++c)
    for (const EntryLoading& l : noise.shared[c].loadings)
      shared[c].push_back({std::max<long>(l.row, l.col), std::min<long>(l.row, l.col), l.loading});

  const double shift = 1e-10 * (1.0 + gram.trace() / static_cast<double>(n));
  const int threads = loop_thread_count(options.threads, draws);
  out.threads_used = threads;
  std::vector<DrawWorkspace> workspaces;
  workspaces.reserve(threads);
  for (int k = 0; k < threads; ++k) workspaces.emplace_back(n, shared.size());
  // E of draw d into w.noise (lower triangle): the shared components' normals first, then the
  // independent entries column by column.
  auto draw_noise = [&](int d, DrawWorkspace& w) {
    NormalStream normal(stream_seed(options.seed, static_cast<std::uint64_t>(d)));
    for (double& g : w.common) g = normal.next();
    w.noise.diagonal().setZero();
    for (long j = 0; j < n; ++j)
      for (long i = j + 1; i < n; ++i) w.noise(i, j) = noise.sigma(i, j) * normal.next();
    for (size_t c = 0; c < shared.size(); ++c)
      for (const Loading& l : shared[c]) w.noise(l.i, l.j) += w.common[c] * l.value;
  };
  auto noise_norm = [&](DrawWorkspace& w) {
    w.eigen.compute(w.noise, Eigen::EigenvaluesOnly);  // reads the lower triangle
    const Eigen::VectorXd& lambda = w.eigen.eigenvalues();
    return std::max(std::abs(lambda(0)), std::abs(lambda(n - 1)));
  };

  std::vector<char> negative(draws, 0);
  std::vector<double> spectral(draws, 0.0);
  parallel_for(draws, threads, options.hooks, [&](int d, int worker) {
    DrawWorkspace& w = workspaces[worker];
    draw_noise(d, w);
    if (d < spectral_draws) spectral[d] = noise_norm(w);
    // Antithetic pair: K + E and K - E (the Cholesky reads the lower triangle).
    for (double sign : {1.0, -1.0}) {
      w.shifted.triangularView<Eigen::Lower>() = gram + sign * w.noise;
      w.shifted.diagonal().array() += shift;
      w.cholesky.compute(w.shifted);
      if (w.cholesky.info() != Eigen::Success) ++negative[d];
    }
  });

  // A shared component makes the norm vary from draw to draw: double the spectral draws (the
  // same E of the next draws) until the mean's standard error is small enough.
  auto mean_and_error = [&](int count) {
    double sum = 0.0, sum_sq = 0.0;
    for (int d = 0; d < count; ++d) sum += spectral[d];
    const double mean = sum / count;
    for (int d = 0; d < count; ++d) sum_sq += (spectral[d] - mean) * (spectral[d] - mean);
    return std::pair{mean, count > 1 ? std::sqrt(sum_sq / (count - 1) / count) : kNaN};
  };
  const int spectral_ceiling = std::min(draws, kSpectralGrowth * spectral_draws);
  while (spectral_draws > 0 && spectral_draws < spectral_ceiling) {
    const auto [mean, error] = mean_and_error(spectral_draws);
    if (!(error > options.spectral_relative_error * mean)) break;
    const int first = spectral_draws;
    spectral_draws = std::min(2 * spectral_draws, spectral_ceiling);
    parallel_for(spectral_draws - first, threads, options.hooks, [&](int k, int worker) {
      DrawWorkspace& w = workspaces[worker];
      draw_noise(first + k, w);
      spectral[first + k] = noise_norm(w);
    });
  }

  out.simulated = true;
  out.draws = draws;
  out.spectral_draws = spectral_draws;
  // Each draw scores y_d = (negatives among its pair) / 2; P is their mean. Var y_d is at most
  // that of one Bernoulli draw, so the Wilson interval over `draws` trials is conservative.
  double count = 0.0, sum_sq = 0.0;
  for (char c : negative) count += 0.5 * c;
  out.p_negative_eigenvalue = count / draws;
  for (char c : negative) {
    const double y = 0.5 * c - out.p_negative_eigenvalue;
    sum_sq += y * y;
  }
  out.p_negative_standard_error = draws > 1 ? std::sqrt(sum_sq / (draws - 1) / draws) : kNaN;
  const Interval ci = wilson_interval(count, draws, 0.95);
  out.p_negative_low = ci.low;
  out.p_negative_high = ci.high;
  if (spectral_draws > 0)
    std::tie(out.spectral_estimate, out.spectral_standard_error) = mean_and_error(spectral_draws);
  out.elapsed_ms =
      std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
  return out;
}

GramError predict_gram_error(const Eigen::MatrixXd& gram, const Eigen::MatrixXd& sigma,
                             const GramErrorOptions& options) {
  return predict_gram_error(gram, GramNoise{sigma, {}}, options);
}

std::string GramError::method() const {
  std::ostringstream o;
  if (!simulated) return "not simulated: norms and bound only";
  o << "simulation of " << draws << " noise draws, each as K + E and K - E (" << spectral_draws
    << " also for the spectral norm), seed " << options.seed << ", " << threads_used
    << " thread(s)";
  if (reduced)
    o << "; approximation: N = " << size << " is above " << options.full_size_limit
      << ", so fewer draws than the " << options.draws << " asked";
  return o.str();
}

std::string GramError::report() const {
  std::ostringstream o;
  o.precision(3);
  o << "Gram error: Frobenius sigma " << sigma_frobenius << ", largest entry sigma " << sigma_max;
  if (simulated && spectral_draws > 0)
    o << ", spectral norm ~" << spectral_estimate << " (upper bound " << spectral_upper_bound
      << ")";
  else
    o << ", spectral norm at most " << spectral_upper_bound;
  o << "\n";
  o << "Smallest ideal eigenvalue " << min_eigenvalue << "; P(measured Gram has a negative "
    << "eigenvalue) ";
  if (simulated)
    o << p_negative_eigenvalue << " (95 % interval " << p_negative_low << " to " << p_negative_high
      << ")";
  else
    o << "not estimated";
  o << "\n  by " << method() << "\n";
  return o.str();
}

}  // namespace gramline
