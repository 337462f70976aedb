// Benchmark of the margin check's Monte Carlo: 1000 simulated campaigns at 100 training and 30
// test points (goal: under 10 s on a 2-core machine), with one thread and with all threads.
// Prints figures; never run as a test.
#include <chrono>
#include <cmath>
#include <cstdio>
#include <random>
#include <thread>

#include "gramline/demo.h"
#include "gramline/kernel.h"
#include "gramline/margin.h"

namespace {

// 100 + 30 points on either side of a curve in the unit square, the demo's rig and encoding.
gramline::Campaign bench_campaign() {
  gramline::Campaign c = gramline::make_demo_campaign();
  std::mt19937_64 rng(2026);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  auto fill = [&](Eigen::MatrixXd& x, Eigen::VectorXi& y, int count) {
    x.resize(count, 2);
    y.resize(count);
    for (int i = 0; i < count;) {
      const double a = unit(rng), b = unit(rng);
      const double gap = b - (0.3 + 0.8 * (a - 0.5) * (a - 0.5));
      if (std::abs(gap) < 0.04) continue;
      x(i, 0) = a;
      x(i, 1) = b;
      y(i) = gap > 0 ? 1 : -1;
      ++i;
    }
  };
  fill(c.data.train, c.data.train_labels, 100);
  fill(c.data.test, c.data.test_labels, 30);
  return c;
}

double seconds_since(std::chrono::steady_clock::time_point t0) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
}

}  // namespace

int main() {
  const gramline::Campaign campaign = bench_campaign();
  // The Monte Carlo needs the plan's kernels and pairs only; the step order does not matter.
  gramline::Plan plan;
  plan.kernel_train = gramline::ideal_gram(campaign.encoding, campaign.data.train);
  plan.kernel_test =
      gramline::ideal_cross(campaign.encoding, campaign.data.test, campaign.data.train);
  const double pairs = 3000.0;
  plan.pairs_train = Eigen::MatrixXd::Constant(100, 100, pairs);
  plan.pairs_train.diagonal().setZero();
  plan.pairs_test = Eigen::MatrixXd::Constant(30, 100, pairs);
  const gramline::MarginProblem problem = gramline::make_margin_problem(campaign, plan);
  gramline::SvmOptions svm;
  svm.C = 1.0;
  const gramline::SvmModel ideal =
      gramline::train_svm(problem.kernel_train, problem.train_labels, svm);

  gramline::TrialOptions options;
  options.trials = 1000;
  options.seed = 11;
  options.svm = svm;
  const int cores = static_cast<int>(std::max(1u, std::thread::hardware_concurrency()));
  std::printf(
      "margin check Monte Carlo: %d trials, 100 training + 30 test points, %.0f pairs "
      "per entry, %d cores\n",
      options.trials, pairs, cores);

  options.threads = 1;
  auto t0 = std::chrono::steady_clock::now();
  const gramline::TrialSummary one = gramline::run_margin_trials(problem, ideal, options);
  const double one_s = seconds_since(t0);
  std::printf("  1 thread:  %.2f s (%.2f ms per trial)\n", one_s, 1e3 * one_s / options.trials);

  options.threads = std::max(2, cores);
  t0 = std::chrono::steady_clock::now();
  const gramline::TrialSummary many = gramline::run_margin_trials(problem, ideal, options);
  const double many_s = seconds_since(t0);
  std::printf("  %d threads: %.2f s (%.2f ms per trial)\n", options.threads, many_s,
              1e3 * many_s / options.trials);
  std::printf("  one-thread / %d-thread time ratio: %.2f\n", options.threads, one_s / many_s);
  std::printf("  identical results across thread counts: %s\n",
              one.margin_ratio == many.margin_ratio ? "yes" : "NO");
  std::printf("  goal (< 10 s): %s\n", many_s < 10.0 ? "met" : "missed");
  std::printf("\n%s", many.report().c_str());
  return 0;
}
