// Gram-error benchmark: wall time of one simulated estimate (estimate_gram_error) for the demo
// (48 training points), for 200 and for 400 random training points (the last above the size
// where the draws are reduced), with one thread and with all, and whether the two agree. Not a
// test.
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <random>
#include <thread>
#include <vector>

#include "gramline/demo.h"
#include "gramline/plan.h"

using namespace gramline;

namespace {

double unit(std::mt19937_64& rng) { return static_cast<double>(rng() >> 11) * 0x1.0p-53; }

/// The demo campaign with `train` uniform random training points and no test points.
Campaign with_points(int train) {
  Campaign c = make_demo_campaign();
  if (train == c.data.train_count()) return c;
  std::mt19937_64 rng(21);
  c.data.train.resize(train, 2);
  c.data.train_labels.resize(train);
  for (int i = 0; i < train; ++i) {
    c.data.train.row(i) << unit(rng), unit(rng);
    c.data.train_labels(i) = i % 2 == 0 ? 1 : -1;
  }
  c.data.test.resize(0, 2);
  c.data.test_labels.resize(0);
  c.nights.max_nights = 1000;
  return c;
}

/// Median wall time of `repeats` estimates, in ms, and the last result.
GramError time_estimate(Plan plan, int threads, int repeats, double& median_ms) {
  std::vector<double> ms;
  GramErrorOptions o;
  o.threads = threads;
  for (int r = 0; r < repeats; ++r) {
    estimate_gram_error(plan, o);
    ms.push_back(plan.summary.gram_error_ms);
  }
  std::sort(ms.begin(), ms.end());
  median_ms = ms[ms.size() / 2];
  return plan.gram_error;
}

void run(const char* name, int train, int repeats) {
  const Campaign c = with_points(train);
  PlanOptions po;
  po.optimize_order = train <= 48;  // the order does not change the Gram error
  po.simulate_gram_error = false;
  const Plan plan = plan_campaign(c, po);
  const int all = static_cast<int>(std::max(1u, std::thread::hardware_concurrency()));
  double one_ms = 0.0, all_ms = 0.0;
  const GramError one = time_estimate(plan, 1, repeats, one_ms);
  const GramError many = time_estimate(plan, all, repeats, all_ms);
  const bool same = one.p_negative_eigenvalue == many.p_negative_eigenvalue &&
                    one.spectral_estimate == many.spectral_estimate;
  std::printf(
      "%-6s N %4d  1 thread %8.1f ms  %d threads %8.1f ms  identical %s\n"
      "       P(negative) %.3f +- %.3f  spectral %.4g +- %.2g (bound %.4g)  smallest eigenvalue "
      "%.3g\n       %s\n",
      name, train, one_ms, all, all_ms, same ? "yes" : "NO", one.p_negative_eigenvalue,
      one.p_negative_standard_error, one.spectral_estimate, one.spectral_standard_error,
      one.spectral_upper_bound, one.min_eigenvalue, one.method().c_str());
  std::fflush(stdout);
}

}  // namespace

int main() {
  run("demo", 48, 5);
  run("n=200", 200, 3);
  run("n=400", 400, 1);
  return 0;
}
