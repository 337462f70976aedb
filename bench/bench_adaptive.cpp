// Benchmark of the adaptive campaign (docs/adaptive.md): whole campaigns simulated night by
// night, uniform from the start against adaptive re-allocation, on the demo and on an invented
// set with test points close to the boundary. Prints, over the simulated campaigns, the counting
// time until the stop rule fires (every flip probability at most 1% and the margin ratio at
// threshold) and how often the final decisions differ from the noiseless classifier's.
// Each night's measured kernel is drawn at the entries' cumulative pairs (draw_measured_kernels),
// which has the law of pooling every night's counts of an entry (Poisson counts add); the
// belief's sigma is the estimator's predicted sigma at those pairs. Never run as a test.
//   bench_adaptive [campaigns=20] [nights_max=30]
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <random>
#include <string>
#include <vector>

#include "gramline/adaptive.h"
#include "gramline/demo.h"
#include "gramline/detection.h"
#include "gramline/kernel.h"
#include "gramline/margin.h"
#include "gramline/plan.h"
#include "gramline/random.h"

namespace {

using namespace gramline;

// 30 training and 12 test points on either side of a curve in the unit square, four of the
// test points within 0.02 of it (the demo's rig and encoding).
Campaign near_boundary_campaign() {
  Campaign c = make_demo_campaign();
  std::mt19937_64 rng(4242);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  auto fill = [&](Eigen::MatrixXd& x, Eigen::VectorXi& y, int count, int close) {
    x.resize(count, 2);
    y.resize(count);
    for (int i = 0; i < count;) {
      const double a = unit(rng), b = unit(rng);
      const double gap = b - (0.3 + 0.8 * (a - 0.5) * (a - 0.5));
      if (i < close ? std::abs(gap) > 0.02 : std::abs(gap) < 0.06) continue;
      x(i, 0) = a;
      x(i, 1) = b;
      y(i) = gap > 0 ? 1 : -1;
      ++i;
    }
  };
  fill(c.data.train, c.data.train_labels, 30, 0);
  fill(c.data.test, c.data.test_labels, 12, 4);
  c.name = "near-boundary";
  return c;
}

struct Outcome {
  double counting_s = 0.0;
  int nights = 0;
  bool stopped = false;
  bool wrong = false;
};

Eigen::VectorXi labels_of(const Eigen::VectorXd& f) {
  Eigen::VectorXi y(f.size());
  for (int i = 0; i < f.size(); ++i) y[i] = libsvm_label(f[i]);
  return y;
}

Outcome simulate(const Campaign& c, const Plan& plan, bool adaptive, std::uint64_t seed,
                 int nights_max) {
  MarginProblem p = make_margin_problem(c, plan);
  const int n = p.train_count(), m = p.test_count();
  const double rate = pair_detect_rate_per_s(c.rig, p.photons);
  // A night adds one eighth of the plan's pairs.
  const double entries = n * (n - 1) / 2.0 + static_cast<double>(m) * n;
  const double night_pairs = total_pairs(p) / 8.0;
  const double per_entry = night_pairs / entries;
  Eigen::MatrixXd cum_train = Eigen::MatrixXd::Zero(n, n), cum_test = Eigen::MatrixXd::Zero(m, n);
  SvmOptions svm;
  svm.C = c.check.C > 0 ? c.check.C : 1.0;
  const SvmModel ideal = train_svm(p.kernel_train, p.train_labels, svm);
  const Eigen::VectorXi truth = labels_of(ideal.decision(p.kernel_test));
  Outcome out;
  std::vector<double> weight;
  for (int night = 0; night < nights_max; ++night) {
    if (!adaptive || night == 0 || weight.empty()) {
      for (int i = 0; i < n; ++i)
        for (int j = i + 1; j < n; ++j) cum_train(i, j) += per_entry;
      cum_test.array() += per_entry;
    } else {
      std::vector<double> done, sigma;
      for (int i = 0; i < n; ++i)
        for (int j = i + 1; j < n; ++j) {
          done.push_back(cum_train(i, j));
          sigma.push_back(entry_sigma(p.scheme, p.photons, p.noise_train[i * n + j], 1.0));
        }
      for (int t = 0; t < m; ++t)
        for (int j = 0; j < n; ++j) {
          done.push_back(cum_test(t, j));
          sigma.push_back(entry_sigma(p.scheme, p.photons, p.noise_test[t * n + j], 1.0));
        }
      const std::vector<double> add = top_up_pairs(done, weight, sigma, night_pairs);
      size_t e = 0;
      for (int i = 0; i < n; ++i)
        for (int j = i + 1; j < n; ++j) cum_train(i, j) += add[e++];
      for (int t = 0; t < m; ++t)
        for (int j = 0; j < n; ++j) cum_test(t, j) += add[e++];
    }
    out.nights = night + 1;
    out.counting_s += night_pairs / rate;
    p.pairs_train = cum_train + cum_train.transpose();
    p.pairs_test = cum_test;
    KernelBelief b;
    draw_measured_kernels(p, stream_seed(seed, night), b.train_value, b.test_value);
    b.train_sigma = p.sigma_train();
    b.test_sigma = p.sigma_test();
    StopRuleOptions so;
    so.trials = 200;
    so.seed = stream_seed(seed, 1000 + night);
    so.C = svm.C;
    so.flip_threshold = 0.01;
    so.margin_ratio_threshold = c.check.margin_ratio_threshold;
    so.influence = adaptive;
    const StopRuleResult r = evaluate_stop_rule(b, p.train_labels, p.test_labels, so);
    if (adaptive) {
      weight.clear();
      for (int i = 0; i < n; ++i)
        for (int j = i + 1; j < n; ++j) weight.push_back(r.influence.train(i, j));
      for (int t = 0; t < m; ++t)
        for (int j = 0; j < n; ++j) weight.push_back(r.influence.test(t, j));
    }
    if (r.stop || night + 1 == nights_max) {
      Eigen::MatrixXd train, test;
      b.point_estimate(train, test);
      repair_psd(train, c.check.keep_unit_diagonal);
      const SvmModel model = train_svm(train, p.train_labels, svm);
      out.wrong = labels_of(model.decision(test)) != truth;
      out.stopped = r.stop;
      break;
    }
  }
  return out;
}

double quantile(std::vector<double> v, double q) {
  std::sort(v.begin(), v.end());
  const double pos = q * (v.size() - 1);
  const size_t lo = static_cast<size_t>(pos);
  const size_t hi = std::min(lo + 1, v.size() - 1);
  return v[lo] + (pos - lo) * (v[hi] - v[lo]);
}

}  // namespace

int main(int argc, char** argv) {
  const int campaigns = argc > 1 ? std::atoi(argv[1]) : 20;
  const int nights_max = argc > 2 ? std::atoi(argv[2]) : 30;
  for (const Campaign& c : {make_demo_campaign(), near_boundary_campaign()}) {
    PlanOptions po;
    po.simulate_gram_error = false;
    const Plan plan = plan_campaign(c, po);
    std::printf("== %s: %d training, %d test points; the plan counts %.2f h\n", c.name.c_str(),
                c.data.train_count(), c.data.test_count(), plan.summary.integration_s / 3600.0);
    std::vector<double> hours[2];
    int wrong[2] = {0, 0}, unstopped[2] = {0, 0};
    const auto t0 = std::chrono::steady_clock::now();
    for (int k = 0; k < campaigns; ++k)
      for (int a = 0; a < 2; ++a) {
        const Outcome o = simulate(c, plan, a == 1, stream_seed(99, k), nights_max);
        hours[a].push_back(o.counting_s / 3600.0);
        wrong[a] += o.wrong ? 1 : 0;
        unstopped[a] += o.stopped ? 0 : 1;
      }
    for (int a = 0; a < 2; ++a)
      std::printf(
          "  %-8s counting h to stop: median %.2f, quartiles %.2f-%.2f, min %.2f, max %.2f; "
          "wrong verdicts %d of %d; never stopped %d\n",
          a ? "adaptive" : "uniform", quantile(hours[a], 0.5), quantile(hours[a], 0.25),
          quantile(hours[a], 0.75), quantile(hours[a], 0.0), quantile(hours[a], 1.0), wrong[a],
          campaigns, unstopped[a]);
    std::vector<double> ratio;
    for (int k = 0; k < campaigns; ++k) ratio.push_back(hours[1][k] / hours[0][k]);
    std::printf("  adaptive / uniform counting time: median %.2f, quartiles %.2f-%.2f (%.1f s)\n",
                quantile(ratio, 0.5), quantile(ratio, 0.25), quantile(ratio, 0.75),
                std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count());
  }
  return 0;
}
