#include "gramline/margin.h"

#include <algorithm>
#include <cmath>
#include <iomanip>
#include <limits>
#include <random>
#include <sstream>
#include <stdexcept>

#include "gramline/field_check.h"
#include "gramline/parallel.h"
#include "gramline/random.h"

namespace gramline {

// ---------------------------------------------------------------------------------------------
// The problem

Eigen::MatrixXd MarginProblem::sigma_train() const {
  const int n = train_count();
  Eigen::MatrixXd s = Eigen::MatrixXd::Zero(n, n);
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j) {
      const double pairs = pairs_train(i, j);
      if (pairs > 0)
        s(i, j) = s(j, i) = entry_sigma(scheme, photons, noise_train[i * n + j], pairs);
    }
  return s;
}

Eigen::MatrixXd MarginProblem::sigma_test() const {
  const int n = train_count(), m = test_count();
  Eigen::MatrixXd s = Eigen::MatrixXd::Zero(m, n);
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j) {
      const double pairs = pairs_test(t, j);
      if (pairs > 0) s(t, j) = entry_sigma(scheme, photons, noise_test[t * n + j], pairs);
    }
  return s;
}

MarginProblem make_margin_problem(const Campaign& campaign, const Plan& plan) {
  const DataSet& data = campaign.data;
  const int n = data.train_count(), m = data.test_count();
  const EntryStatistics entries(campaign);
  MarginProblem problem;
  problem.scheme = entries.scheme();
  problem.photons = entries.photons();
  problem.kernel_train = plan.kernel_train;
  problem.kernel_test = m > 0 ? plan.kernel_test : Eigen::MatrixXd(0, n);
  problem.train_labels = data.train_labels;
  problem.test_labels = data.test_labels;
  problem.pairs_train = plan.pairs_train;
  problem.pairs_test = m > 0 ? plan.pairs_test : Eigen::MatrixXd(0, n);
  problem.noise_train.resize(static_cast<std::size_t>(n) * n);
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j) problem.noise_train[i * n + j] = entries.noise(i, j);
  problem.noise_test.resize(static_cast<std::size_t>(m) * n);
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j) problem.noise_test[t * n + j] = entries.noise(n + t, j);
  return problem;
}

// ---------------------------------------------------------------------------------------------
// One simulated measurement

namespace {

using PoissonParam = std::poisson_distribution<long long>::param_type;

// Count statistics of one entry at its planned pairs, with the Poisson parameters prepared
// once per run (their set-up costs logarithms and log-gamma calls).
struct EntrySampler {
  bool exact = true;  // pairs <= 0: the ideal value is used
  double ideal = 0.0;
  double dwell_s = 0.0;
  const Calibration* calibration = nullptr;
  PoissonParam pass{1.0};
  PoissonParam other{1.0};  // both_ports: counts in all the other channels
};

// Every entry's sampler, in the order of the random streams: training upper triangle by
// row-major index i N + j, then test entries N^2 + t N + j.
class PreparedDraws {
 public:
  explicit PreparedDraws(const MarginProblem& problem) : problem_(problem) {
    const int n = problem.train_count(), m = problem.test_count();
    train_.resize(static_cast<std::size_t>(n) * n);
    test_.resize(static_cast<std::size_t>(m) * n);
    for (int i = 0; i < n; ++i)
      for (int j = i + 1; j < n; ++j)
        train_[i * n + j] = prepare(problem.noise_train[i * n + j], problem.kernel_train(i, j),
                                    problem.pairs_train(i, j));
    for (int t = 0; t < m; ++t)
      for (int j = 0; j < n; ++j)
        test_[t * n + j] = prepare(problem.noise_test[t * n + j], problem.kernel_test(t, j),
                                   problem.pairs_test(t, j));
  }

  void draw(std::uint64_t trial_seed, Eigen::MatrixXd& train, Eigen::MatrixXd& test) const {
    const int n = problem_.train_count(), m = problem_.test_count();
    train.resize(n, n);
    test.resize(m, n);
    for (int i = 0; i < n; ++i) {
      train(i, i) = problem_.kernel_train(i, i);
      for (int j = i + 1; j < n; ++j) {
        const std::size_t e = static_cast<std::size_t>(i) * n + j;
        train(i, j) = train(j, i) = sample(train_[e], stream_seed(trial_seed, e));
      }
    }
    for (int t = 0; t < m; ++t)
      for (int j = 0; j < n; ++j) {
        const std::size_t e = static_cast<std::size_t>(t) * n + j;
        test(t, j) = sample(test_[e], stream_seed(trial_seed, static_cast<std::size_t>(n) * n + e));
      }
  }

 private:
  EntrySampler prepare(const EntryNoise& noise, double ideal, double pairs) const {
    EntrySampler s;
    s.ideal = ideal;
    if (!(pairs > 0)) return s;
    const Calibration& cal = noise.calibration;
    const double r = cal.pair_detect_rate_per_s;
    s.exact = false;
    s.calibration = &cal;
    s.dwell_s = pairs / r;
    const double pass_rate = r * noise.p_pass + cal.accidental_pass_rate_per_s;
    s.pass = PoissonParam(std::max(pass_rate * s.dwell_s, 1e-300));
    if (problem_.scheme == DetectionScheme::both_ports) {
      const double total_rate = r + cal.accidental_total_rate_per_s;
      s.other = PoissonParam(std::max((total_rate - pass_rate) * s.dwell_s, 1e-300));
    }
    return s;
  }

  double sample(const EntrySampler& s, std::uint64_t seed) const {
    if (s.exact) return s.ideal;
    SplitMix64 rng(seed);
    std::poisson_distribution<long long> poisson;
    SettingCounts counts;
    counts.dwell_s = s.dwell_s;
    counts.pass_counts = static_cast<double>(poisson(rng, s.pass));
    if (problem_.scheme == DetectionScheme::both_ports) {
      // The dwell is fixed, so the total over all channels is Poisson and, given the total, the
      // pass channel is binomial. Drawn here as two independent Poisson counts (pass, rest),
      // which has exactly that joint law (Poisson splitting; Kingman, Poisson Processes, 1993).
      counts.total_counts = counts.pass_counts + static_cast<double>(poisson(rng, s.other));
      // No coincidence at all carries no information: take the uninformative half.
      if (counts.total_counts == 0) {
        counts.total_counts = 2.0;
        counts.pass_counts = 1.0;
      }
    }
    return estimate_kernel(problem_.scheme, problem_.photons, *s.calibration, counts);
  }

  const MarginProblem& problem_;
  std::vector<EntrySampler> train_, test_;
};

}  // namespace

void draw_measured_kernels(const MarginProblem& problem, std::uint64_t trial_seed,
                           Eigen::MatrixXd& train, Eigen::MatrixXd& test) {
  PreparedDraws(problem).draw(trial_seed, train, test);
}

// ---------------------------------------------------------------------------------------------
// The Monte Carlo

void TrialOptions::validate() const {
  FieldCheck("TrialOptions")
      .at_least("trials", trials, 1)
      .at_least("threads", threads, 0)
      .inside("confidence", confidence, 0.0, 1.0)
      .throw_if_failed();
}

namespace {

struct TrialOutcome {
  std::vector<double> decision_test;
  double accuracy = 0.0;
  double margin_ratio = 0.0;
  double jaccard = 0.0;
  bool repaired = false;
};

double jaccard(const std::vector<int>& a, const std::vector<int>& b) {
  std::vector<int> both, either;
  std::set_intersection(a.begin(), a.end(), b.begin(), b.end(), std::back_inserter(both));
  std::set_union(a.begin(), a.end(), b.begin(), b.end(), std::back_inserter(either));
  return either.empty() ? 1.0 : static_cast<double>(both.size()) / either.size();
}

TrialOutcome run_trial(const KernelDraw& draw, const Eigen::VectorXi& train_labels,
                       const Eigen::VectorXi& test_labels, const SvmModel& reference,
                       const TrialOptions& options, std::uint64_t trial_seed) {
  Eigen::MatrixXd train, test;
  draw(trial_seed, train, test);
  TrialOutcome out;
  out.repaired = repair_psd(train, options.keep_unit_diagonal);
  SvmOptions svm = options.svm;
  svm.C = reference.C;
  const SvmModel model = train_svm(train, train_labels, svm);
  const Eigen::VectorXd f = model.decision(test);
  out.decision_test.assign(f.data(), f.data() + f.size());
  out.accuracy = test_labels.size() > 0
                     ? classification_accuracy(f, test_labels)
                     : classification_accuracy(model.decision_train, train_labels);
  out.margin_ratio = model.w_norm_squared > 0
                         ? std::sqrt(reference.w_norm_squared / model.w_norm_squared)
                         : std::numeric_limits<double>::infinity();
  out.jaccard = jaccard(model.support, reference.support);
  return out;
}

}  // namespace

TrialSummary run_margin_trials(const MarginProblem& problem, const SvmModel& ideal,
                               const TrialOptions& options) {
  const PreparedDraws draws(problem);
  return run_kernel_trials([&draws](std::uint64_t seed, Eigen::MatrixXd& train,
                                    Eigen::MatrixXd& test) { draws.draw(seed, train, test); },
                           problem.train_labels, problem.test_labels, problem.kernel_test, ideal,
                           options);
}

TrialSummary run_kernel_trials(const KernelDraw& draw, const Eigen::VectorXi& train_labels,
                               const Eigen::VectorXi& test_labels,
                               const Eigen::MatrixXd& reference_test, const SvmModel& reference,
                               const TrialOptions& options) {
  options.validate();
  const int trials = options.trials;
  std::vector<TrialOutcome> outcomes(trials);
  parallel_for(trials, options.threads, options.hooks, [&](int t) {
    outcomes[t] = run_trial(draw, train_labels, test_labels, reference, options,
                            stream_seed(options.seed, t));
  });

  const double z = normal_quantile_two_sided(options.confidence);
  const int m = static_cast<int>(reference_test.rows());
  const Eigen::VectorXd f0 = reference.decision(reference_test);
  TrialSummary s;
  s.trials = trials;
  s.options = options;
  s.options.hooks = WorkHooks{};
  s.options.svm.C = reference.C;
  s.threads_used = loop_thread_count(options.threads, trials);
  s.decision_trials.resize(trials, m);
  double repaired = 0.0;
  for (int t = 0; t < trials; ++t) {
    const TrialOutcome& o = outcomes[t];
    for (int k = 0; k < m; ++k) s.decision_trials(t, k) = o.decision_test[k];
    s.accuracy.push_back(o.accuracy);
    s.margin_ratio.push_back(o.margin_ratio);
    s.support_jaccard.push_back(o.jaccard);
    repaired += o.repaired;
  }
  for (int t = 0; t < m; ++t) {
    TestPointOutcome p;
    p.test_index = t;
    p.decision_ideal = f0[t];
    p.label = test_labels.size() > t ? test_labels[t] : 0;
    SampleMoments f;
    for (const TrialOutcome& o : outcomes) {
      const double ft = o.decision_test[t];
      p.flips += libsvm_label(ft) != libsvm_label(f0[t]);
      f.add(ft);
    }
    p.decision_sd = f.standard_deviation();
    p.flip_probability = proportion_estimate(p.flips, trials, options.confidence);
    s.points.push_back(p);
  }
  if (!s.points.empty()) {
    const auto worst = std::max_element(
        s.points.begin(), s.points.end(),
        [](const TestPointOutcome& a, const TestPointOutcome& b) { return a.flips < b.flips; });
    s.flip_probability_max = worst->flip_probability;
  }
  s.accuracy_median = median_estimate(s.accuracy, z);
  s.accuracy_mean = mean_estimate(s.accuracy, z);
  s.margin_ratio_median = median_estimate(s.margin_ratio, z);
  s.margin_ratio_mean = mean_estimate(s.margin_ratio, z);
  s.support_jaccard_median = median_estimate(s.support_jaccard, z);
  s.support_jaccard_mean = mean_estimate(s.support_jaccard, z);
  s.psd_repair_fraction = proportion_estimate(repaired, trials, options.confidence);
  return s;
}

namespace {

std::string interval_text(const Estimate& e, int digits = 3) {
  std::ostringstream out;
  out << std::setprecision(digits) << e.value << " [" << e.low << ", " << e.high << "]";
  return out.str();
}

std::string percent_text(const Estimate& e) {
  std::ostringstream out;
  out << std::fixed << std::setprecision(2) << 100 * e.value << "% [" << 100 * e.low << ", "
      << 100 * e.high << "]%";
  return out.str();
}

}  // namespace

std::string TrialSummary::report() const {
  std::ostringstream out;
  out << trials << " simulated campaigns (" << 100 * options.confidence
      << "% intervals unless set otherwise)\n";
  out << "  largest flip probability " << percent_text(flip_probability_max) << "\n";
  out << "  accuracy: median " << interval_text(accuracy_median) << ", mean "
      << interval_text(accuracy_mean) << "\n";
  out << "  margin ratio: median " << interval_text(margin_ratio_median) << ", mean "
      << interval_text(margin_ratio_mean) << "\n";
  out << "  support set Jaccard: median " << interval_text(support_jaccard_median) << ", mean "
      << interval_text(support_jaccard_mean) << "\n";
  out << "  PSD repair needed in " << percent_text(psd_repair_fraction) << " of trials\n";
  out << "  run with seed " << options.seed << " on " << threads_used
      << " thread(s), C = " << options.svm.C << ", PSD repair "
      << (options.keep_unit_diagonal ? "keeping" : "not keeping") << " the unit diagonal\n";
  return out.str();
}

Verdict judge(const TrialSummary& summary, const CheckSettings& settings, int train_count) {
  Verdict v;
  for (const TestPointOutcome& p : summary.points) {
    if (p.flip_probability.value <= settings.flip_threshold) continue;
    std::ostringstream why;
    why << "test point " << p.test_index << " (point " << train_count + p.test_index
        << "): label flips in " << percent_text(p.flip_probability) << " of trials, above "
        << 100 * settings.flip_threshold << "%; noiseless f = " << std::setprecision(4)
        << p.decision_ideal << ", noise sd of f = " << p.decision_sd;
    if (p.decision_sd > 0)
      why << " (" << std::setprecision(3) << std::abs(p.decision_ideal) / p.decision_sd
          << " sd from the boundary)";
    v.reasons.push_back(why.str());
  }
  if (summary.margin_ratio_median.value < settings.margin_ratio_threshold) {
    std::ostringstream why;
    why << "median margin ratio " << interval_text(summary.margin_ratio_median) << " is below "
        << settings.margin_ratio_threshold << ": the measured Gram matrix shrinks the margin";
    v.reasons.push_back(why.str());
  }
  v.pass = v.reasons.empty();
  return v;
}

// ---------------------------------------------------------------------------------------------
// Allocation over the problem's entries

double total_pairs(const MarginProblem& problem) {
  const int n = problem.train_count();
  double total = problem.pairs_test.sum();
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j) total += problem.pairs_train(i, j);
  return total;
}

void allocate_pairs(MarginProblem& problem, Allocation strategy, const SvmModel& ideal,
                    double total) {
  const int n = problem.train_count(), m = problem.test_count();
  AllocationInput in;
  in.scheme = problem.scheme;
  in.photons = problem.photons;
  in.train_count = n;
  in.test_count = m;
  in.entries.reserve(static_cast<std::size_t>(n) * (n - 1) / 2 + static_cast<std::size_t>(m) * n);
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j)
      in.entries.push_back({Block::train, i, j, problem.noise_train[i * n + j]});
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j)
      in.entries.push_back({Block::test, t, j, problem.noise_test[t * n + j]});
  if (strategy == Allocation::margin_aware && ideal.dual_coef.size() == n) {
    in.dual_coef = ideal.dual_coef;
    in.decision_test = ideal.decision(problem.kernel_test);
  }
  const std::vector<double> pairs = allocate_pairs(in, strategy, total);
  problem.pairs_train = Eigen::MatrixXd::Zero(n, n);
  problem.pairs_test = Eigen::MatrixXd::Zero(m, n);
  for (std::size_t k = 0; k < pairs.size(); ++k) {
    const AllocationEntry& e = in.entries[k];
    if (e.block == Block::train)
      problem.pairs_train(e.row, e.col) = problem.pairs_train(e.col, e.row) = pairs[k];
    else
      problem.pairs_test(e.row, e.col) = pairs[k];
  }
}

}  // namespace gramline
