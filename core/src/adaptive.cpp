#include "gramline/adaptive.h"

#include <Eigen/QR>
#include <algorithm>
#include <cmath>
#include <iomanip>
#include <random>
#include <sstream>
#include <stdexcept>

#include "gramline/field_check.h"
#include "gramline/kernel.h"
#include "gramline/parallel.h"
#include "gramline/random.h"
#include "gramline/svm.h"

namespace gramline {

namespace {

// Calls body(e, row, col, is_test) for every entry in the order of KernelBelief::draw.
template <class Body>
void for_each_entry(int n, int m, Body&& body) {
  int e = 0;
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j) body(e++, i, j, false);
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j) body(e++, t, j, true);
}

}  // namespace

int KernelBelief::unmeasured_entries() const {
  int count = 0;
  for_each_entry(train_count(), test_count(), [&](int, int r, int c, bool test) {
    count += std::isfinite(test ? test_value(r, c) : train_value(r, c)) ? 0 : 1;
  });
  return count;
}

void KernelBelief::validate() const {
  const int n = train_count(), m = test_count();
  FieldCheck("KernelBelief")
      .require(train_value.cols() == n, "train_value", "square (N x N)")
      .require(train_sigma.rows() == n && train_sigma.cols() == n, "train_sigma",
               "the shape of train_value")
      .require(test_value.cols() == n || m == 0, "test_value", "N columns")
      .require(test_sigma.rows() == m && test_sigma.cols() == test_value.cols(), "test_sigma",
               "the shape of test_value")
      .throw_if_failed();
}

void KernelBelief::point_estimate(Eigen::MatrixXd& train, Eigen::MatrixXd& test) const {
  const int n = train_count(), m = test_count();
  train = Eigen::MatrixXd::Identity(n, n);
  test.resize(m, n);
  for_each_entry(n, m, [&](int, int r, int c, bool is_test) {
    const double v = is_test ? test_value(r, c) : train_value(r, c);
    const double value = std::isfinite(v) ? v : 0.5;
    if (is_test) {
      test(r, c) = value;
    } else {
      train(r, c) = train(c, r) = value;
    }
  });
}

void KernelBelief::draw(std::uint64_t trial_seed, Eigen::MatrixXd& train,
                        Eigen::MatrixXd& test) const {
  const int n = train_count(), m = test_count();
  train = Eigen::MatrixXd::Identity(n, n);
  test.resize(m, n);
  for_each_entry(n, m, [&](int e, int r, int c, bool is_test) {
    SplitMix64 rng(stream_seed(trial_seed, static_cast<std::uint64_t>(e)));
    const double v = is_test ? test_value(r, c) : train_value(r, c);
    const double s = is_test ? test_sigma(r, c) : train_sigma(r, c);
    double value;
    if (std::isfinite(v)) {
      value = v + (s > 0 ? s * std::normal_distribution<double>()(rng) : 0.0);
    } else {
      value = std::uniform_real_distribution<double>(0.0, 1.0)(rng);
    }
    if (is_test) {
      test(r, c) = value;
    } else {
      train(r, c) = train(c, r) = value;
    }
  });
}

DecisionDerivatives::DecisionDerivatives(const SvmModel& model, const Eigen::MatrixXd& train,
                                         const Eigen::MatrixXd& test)
    : dual_coef_(model.dual_coef), free_slot_(model.dual_coef.size(), -1) {
  for (int k : model.support)
    if (std::abs(model.dual_coef[k]) < model.C * (1 - 1e-9)) {
      free_slot_[k] = static_cast<int>(free_.size());
      free_.push_back(k);
    }
  const int f = static_cast<int>(free_.size()), m = static_cast<int>(test.rows());
  // KKT matrix of the free coefficients and b: [K_FF 1; 1^T 0].
  Eigen::MatrixXd a = Eigen::MatrixXd::Zero(f + 1, f + 1);
  Eigen::MatrixXd u(f + 1, m);
  for (int r = 0; r < f; ++r) {
    for (int c = 0; c < f; ++c) a(r, c) = train(free_[r], free_[c]);
    a(r, f) = a(f, r) = 1.0;
    for (int t = 0; t < m; ++t) u(r, t) = test(t, free_[r]);
  }
  u.row(f).setOnes();
  z_ = f > 0 ? Eigen::MatrixXd(a.completeOrthogonalDecomposition().solve(u))
             : Eigen::MatrixXd::Zero(1, m);
}

Eigen::VectorXd DecisionDerivatives::train_entry(int i, int j) const {
  // d[a_F; b] = A^-1 v with v_r = -[r = i] a_j - [r = j] a_i (rows of free r only), so
  // df_t = u_t^T A^-1 v = z_t^T v.
  Eigen::VectorXd g = Eigen::VectorXd::Zero(z_.cols());
  if (free_slot_[i] >= 0) g -= dual_coef_[j] * z_.row(free_slot_[i]).transpose();
  if (free_slot_[j] >= 0) g -= dual_coef_[i] * z_.row(free_slot_[j]).transpose();
  return g;
}

void StopRuleOptions::validate() const {
  FieldCheck("StopRuleOptions")
      .at_least("trials", trials, 1)
      .at_least("threads", threads, 0)
      .inside("confidence", confidence, 0.0, 1.0)
      .positive("C", C)
      .inside("flip_threshold", flip_threshold, 0.0, 1.0)
      .positive("margin_ratio_threshold", margin_ratio_threshold)
      .throw_if_failed();
}

namespace {

// Influence weights (EntryInfluence, adaptive.h) from the derivatives of every draw's retrained
// classifier. Draws are handed out in fixed blocks, each summing into its own slot, so the sums
// are the same whatever the thread count.
EntryInfluence estimate_influence(const KernelBelief& belief, const Eigen::VectorXi& labels,
                                  const Eigen::VectorXd& f_best, const StopRuleOptions& options) {
  const int n = belief.train_count(), m = belief.test_count();
  const int trials = options.trials;
  EntryInfluence out;
  if (m == 0) return out;
  constexpr int kBlock = 16;
  const int blocks = (trials + kBlock - 1) / kBlock;
  const double work = static_cast<double>(trials) * n * n * m;
  if (work > influence_limit || static_cast<double>(blocks) * (n * n + m * n) > 5e7) return out;
  const double floor = 0.1 * f_best.cwiseAbs().mean();
  Eigen::VectorXd inv_f2(m);
  for (int t = 0; t < m; ++t)
    inv_f2[t] = 1.0 / std::pow(std::max({std::abs(f_best[t]), floor, 1e-12}), 2);
  std::vector<Eigen::MatrixXd> train_sum(blocks), test_sum(blocks);
  SvmOptions svm;
  svm.C = options.C;
  parallel_for(blocks, options.threads, options.hooks, [&](int block) {
    Eigen::MatrixXd& ts = train_sum[block];
    Eigen::MatrixXd& es = test_sum[block];
    ts = Eigen::MatrixXd::Zero(n, n);
    es = Eigen::MatrixXd::Zero(m, n);
    for (int trial = block * kBlock; trial < std::min(trials, (block + 1) * kBlock); ++trial) {
      Eigen::MatrixXd train, test;
      belief.draw(stream_seed(options.seed, trial), train, test);
      repair_psd(train, options.keep_unit_diagonal);
      const SvmModel model = train_svm(train, labels, svm);
      const DecisionDerivatives d(model, train, test);
      for (int j = 0; j < n; ++j) {
        const double a2 = d.test_entry(j) * d.test_entry(j);
        if (a2 == 0) continue;
        for (int t = 0; t < m; ++t) es(t, j) += a2 * inv_f2[t];
      }
      // Only entries touching a free support vector move the free coefficients.
      for (int i : d.free_support())
        for (int j = 0; j < n; ++j) {
          if (j == i) continue;
          const int lo = std::min(i, j), hi = std::max(i, j);
          if (j < i && d.is_free(j)) continue;  // visited from j's row already
          const Eigen::VectorXd g = d.train_entry(lo, hi);
          ts(lo, hi) += g.cwiseAbs2().dot(inv_f2);
        }
    }
  });
  out.train = Eigen::MatrixXd::Zero(n, n);
  out.test = Eigen::MatrixXd::Zero(m, n);
  for (int b = 0; b < blocks; ++b) {
    out.train += train_sum[b];
    out.test += test_sum[b];
  }
  out.train = (out.train / trials).cwiseSqrt();
  out.test = (out.test / trials).cwiseSqrt();
  return out;
}

}  // namespace

StopRuleResult evaluate_stop_rule(const KernelBelief& belief, const Eigen::VectorXi& train_labels,
                                  const Eigen::VectorXi& test_labels,
                                  const StopRuleOptions& options) {
  options.validate();
  belief.validate();
  if (train_labels.size() != belief.train_count() || test_labels.size() != belief.test_count())
    throw std::invalid_argument("evaluate_stop_rule: labels do not match the kernel's points");
  Eigen::MatrixXd best_train, best_test;
  belief.point_estimate(best_train, best_test);
  repair_psd(best_train, options.keep_unit_diagonal);
  SvmOptions svm;
  svm.C = options.C;
  const SvmModel reference = train_svm(best_train, train_labels, svm);

  TrialOptions trial_options;
  trial_options.trials = options.trials;
  trial_options.seed = options.seed;
  trial_options.threads = options.threads;
  trial_options.keep_unit_diagonal = options.keep_unit_diagonal;
  trial_options.confidence = options.confidence;
  trial_options.svm = svm;
  trial_options.hooks = options.hooks;

  StopRuleResult r;
  r.options = options;
  r.options.hooks = WorkHooks{};
  r.unmeasured_entries = belief.unmeasured_entries();
  r.trials = run_kernel_trials([&belief](std::uint64_t seed, Eigen::MatrixXd& train,
                                         Eigen::MatrixXd& test) { belief.draw(seed, train, test); },
                               train_labels, test_labels, best_test, reference, trial_options);

  CheckSettings thresholds;
  thresholds.flip_threshold = options.flip_threshold;
  thresholds.margin_ratio_threshold = options.margin_ratio_threshold;
  const Verdict verdict = judge(r.trials, thresholds, belief.train_count(), "best-estimate");
  r.stop = verdict.pass;
  r.reasons = verdict.reasons;
  for (const TestPointOutcome& p : r.trials.points)
    if (p.flip_probability.value > options.flip_threshold) r.holding_points.push_back(p.test_index);
  if (options.influence)
    r.influence = estimate_influence(belief, train_labels, reference.decision(best_test), options);
  return r;
}

KernelBelief belief_from_ingest(const IngestResult& ingest) {
  KernelBelief b;
  b.train_value = ingest.gram_measured;
  b.train_sigma = ingest.gram_sigma;
  b.test_value = ingest.test_measured;
  b.test_sigma = ingest.test_sigma;
  return b;
}

StopRuleResult campaign_stop_rule(const Campaign& campaign, const IngestResult& ingest, double C,
                                  const WorkHooks& hooks) {
  StopRuleOptions options;
  options.seed = campaign.seed;
  options.C = C;
  options.keep_unit_diagonal = campaign.check.keep_unit_diagonal;
  options.flip_threshold = campaign.check.flip_threshold;
  options.margin_ratio_threshold = campaign.check.margin_ratio_threshold;
  options.influence = false;
  options.hooks = hooks;
  return evaluate_stop_rule(belief_from_ingest(ingest), campaign.data.train_labels,
                            campaign.data.test_labels, options);
}

std::string StopRuleResult::report() const {
  std::ostringstream o;
  o << "Stop rule: " << trials.trials << " kernels drawn from the counts' uncertainty";
  if (unmeasured_entries > 0)
    o << " (" << unmeasured_entries << " unmeasured entries drawn anywhere in [0, 1])";
  o << "\n";
  o << "  largest flip probability " << std::fixed << std::setprecision(2)
    << 100 * trials.flip_probability_max.value << "% (threshold " << 100 * options.flip_threshold
    << "%), median margin ratio " << std::setprecision(3) << trials.margin_ratio_median.value
    << " (threshold " << options.margin_ratio_threshold << ")\n";
  if (stop) {
    o << "  decisions stable, stop\n";
  } else {
    o << "  not done yet:\n";
    for (const std::string& why : reasons) o << "    " << why << "\n";
  }
  return o.str();
}

std::vector<double> top_up_pairs(const std::vector<double>& done, const std::vector<double>& weight,
                                 const std::vector<double>& unit_sigma, double remaining) {
  const std::size_t count = done.size();
  if (weight.size() != count || unit_sigma.size() != count)
    throw std::invalid_argument("top_up_pairs: done, weight and unit_sigma differ in length");
  if (!(remaining >= 0) || !std::isfinite(remaining))
    throw std::invalid_argument("top_up_pairs: remaining_pairs must be finite and >= 0");
  std::vector<double> share(count);
  double share_sum = 0.0;
  for (std::size_t e = 0; e < count; ++e) {
    share[e] = std::max(0.0, weight[e]) * std::max(0.0, unit_sigma[e]);
    share_sum += share[e];
  }
  std::vector<double> add(count, 0.0);
  if (remaining == 0 || share_sum <= 0) return add;
  // Target n_e = lambda share_e; added pairs max(0, n_e - done_e) grow with lambda, so the lambda
  // that spends exactly `remaining` is found by bisection.
  auto spent = [&](double lambda) {
    double s = 0.0;
    for (std::size_t e = 0; e < count; ++e) s += std::max(0.0, lambda * share[e] - done[e]);
    return s;
  };
  double lo = 0.0, hi = 1.0;
  while (spent(hi) < remaining) hi *= 2.0;
  for (int it = 0; it < 200 && hi - lo > 1e-12 * hi; ++it) {
    const double mid = 0.5 * (lo + hi);
    (spent(mid) < remaining ? lo : hi) = mid;
  }
  double total = 0.0;
  for (std::size_t e = 0; e < count; ++e) {
    add[e] = std::max(0.0, hi * share[e] - done[e]);
    total += add[e];
  }
  if (total > 0)
    for (double& a : add) a *= remaining / total;
  return add;
}

}  // namespace gramline
