// The engine's one parallel loop (core/src/parallel.cpp) and the Monte Carlo work built on it:
// the same results whatever the thread count, every iteration run once, errors and cancel.
#include <gtest/gtest.h>

#include <atomic>
#include <random>
#include <stdexcept>
#include <vector>

#include "gramline/gram_error.h"
#include "gramline/parallel.h"
#include "gramline/random.h"

namespace {

// Each iteration draws from its own stream and writes only its own slot.
std::vector<double> seeded_draws(int iterations, int threads, std::uint64_t seed) {
  std::vector<double> out(iterations);
  gramline::parallel_for(iterations, threads, {}, [&](int i) {
    gramline::SplitMix64 rng(gramline::stream_seed(seed, i));
    std::normal_distribution<double> gauss(0.0, 1.0);
    double sum = 0.0;
    for (int k = 0; k < 50; ++k) sum += gauss(rng);
    out[i] = sum;
  });
  return out;
}

TEST(ParallelFor, SameResultsWhateverTheThreadCount) {
  const std::vector<double> one = seeded_draws(500, 1, 42);
  for (int threads : {0, 2, 3, 7, 64}) EXPECT_EQ(seeded_draws(500, threads, 42), one) << threads;
  EXPECT_NE(seeded_draws(500, 2, 43), one);
}

TEST(ParallelFor, EveryIterationRunsExactlyOnce) {
  std::vector<std::atomic<int>> runs(1000);
  gramline::parallel_for(1000, 4, {}, [&](int i) { runs[i].fetch_add(1); });
  for (const auto& r : runs) EXPECT_EQ(r.load(), 1);
}

TEST(ParallelFor, ThreadCountFollowsTheRequestWithinTheWork) {
  EXPECT_EQ(gramline::loop_thread_count(3, 100), 3);
  EXPECT_EQ(gramline::loop_thread_count(8, 2), 2);  // never more threads than iterations
  EXPECT_EQ(gramline::loop_thread_count(1, 0), 1);
  EXPECT_GE(gramline::loop_thread_count(0, 100), 1);  // 0: the machine's cores
}

TEST(ParallelFor, ProgressEndsAtOneOnTheCallingThread) {
  std::vector<double> seen;  // written by the calling thread only
  gramline::WorkHooks hooks;
  hooks.progress = [&](double f) { seen.push_back(f); };
  gramline::parallel_for(40, 1, hooks, [](int) {});
  ASSERT_EQ(seen.size(), 40u);
  EXPECT_DOUBLE_EQ(seen.back(), 1.0);
  for (std::size_t k = 1; k < seen.size(); ++k) EXPECT_GT(seen[k], seen[k - 1]);
}

TEST(ParallelFor, TheFirstErrorIsRethrownAfterTheWorkersStop) {
  EXPECT_THROW(gramline::parallel_for(100, 3, {},
                                      [](int i) {
                                        if (i == 17) throw std::domain_error("iteration 17");
                                      }),
               std::domain_error);
}

TEST(ParallelFor, ARaisedCancelFlagStopsTheLoop) {
  gramline::CancelFlag cancel{false};
  gramline::WorkHooks hooks;
  hooks.cancel = &cancel;
  std::atomic<int> ran{0};
  EXPECT_THROW(gramline::parallel_for(10000, 2, hooks,
                                      [&](int i) {
                                        ran.fetch_add(1);
                                        if (i == 5) cancel = true;
                                      }),
               gramline::Cancelled);
  EXPECT_LT(ran.load(), 10000);
}

// The Gram-error Monte Carlo runs on the same loop: its count of matrices with a negative
// eigenvalue is the same for one thread and for several.
TEST(ParallelFor, GramErrorMonteCarloDoesNotDependOnThreads) {
  Eigen::MatrixXd k = Eigen::MatrixXd::Constant(5, 5, 0.2);
  k.diagonal().setOnes();
  k(0, 1) = k(1, 0) = 0.97;
  const Eigen::MatrixXd sigma = Eigen::MatrixXd::Constant(5, 5, 0.02);
  gramline::GramErrorOptions o;
  o.draws = 3000;
  o.seed = 9;
  o.threads = 1;
  const gramline::GramError one = gramline::predict_gram_error(k, sigma, o);
  ASSERT_GT(one.p_negative_eigenvalue, 0.0);  // the set-up must exercise both outcomes
  ASSERT_LT(one.p_negative_eigenvalue, 1.0);
  for (int threads : {2, 5}) {
    o.threads = threads;
    const gramline::GramError many = gramline::predict_gram_error(k, sigma, o);
    EXPECT_EQ(many.p_negative_eigenvalue, one.p_negative_eigenvalue) << threads;
    EXPECT_EQ(many.spectral_estimate, one.spectral_estimate) << threads;
  }
}

}  // namespace
