#include "gramline/margin.h"

#include <Eigen/Cholesky>
#include <Eigen/Eigenvalues>
#include <algorithm>
#include <atomic>
#include <chrono>
#include <cmath>
#include <exception>
#include <functional>
#include <iomanip>
#include <limits>
#include <mutex>
#include <random>
#include <sstream>
#include <stdexcept>
#include <thread>

#include "gramline/jones.h"
#include "gramline/kernel.h"
#include "gramline/random.h"

namespace gramline {

// ---------------------------------------------------------------------------------------------
// The problem

namespace {

double entry_sigma(const MarginProblem& problem, const EntryNoise& noise, double pairs) {
  if (!(pairs > 0)) return 0.0;
  return std::sqrt(
      kernel_variance(problem.scheme, problem.photons, noise.calibration, noise.p_pass, pairs));
}

}  // namespace

Eigen::MatrixXd MarginProblem::sigma_train() const {
  const int n = train_count();
  Eigen::MatrixXd s = Eigen::MatrixXd::Zero(n, n);
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j)
      s(i, j) = s(j, i) = entry_sigma(*this, noise_train[i * n + j], pairs_train(i, j));
  return s;
}

Eigen::MatrixXd MarginProblem::sigma_test() const {
  const int n = train_count(), m = test_count();
  Eigen::MatrixXd s = Eigen::MatrixXd::Zero(m, n);
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j)
      s(t, j) = entry_sigma(*this, noise_test[t * n + j], pairs_test(t, j));
  return s;
}

MarginProblem make_margin_problem(const Campaign& campaign, const Plan& plan) {
  const DataSet& data = campaign.data;
  const int n = data.train_count(), m = data.test_count();
  const int photons = campaign.encoding.photon_count();
  MarginProblem problem;
  problem.scheme = campaign.rig.scheme;
  problem.photons = photons;
  problem.kernel_train = plan.kernel_train;
  problem.kernel_test = m > 0 ? plan.kernel_test : Eigen::MatrixXd(0, n);
  problem.train_labels = data.train_labels;
  problem.test_labels = data.test_labels;
  problem.pairs_train = plan.pairs_train;
  problem.pairs_test = m > 0 ? plan.pairs_test : Eigen::MatrixXd(0, n);

  // Per-photon states, for the per-photon overlaps that set the singles (and accidentals).
  std::vector<std::vector<JonesVector>> states(n + m);
  for (int i = 0; i < n + m; ++i) {
    const Eigen::VectorXd x = data.point(i);
    for (int p = 0; p < photons; ++p) {
      const BlochAngles a = campaign.encoding.angles(p, x);
      states[i].push_back(bloch_state(a.theta_deg, a.phi_deg));
    }
  }
  auto noise_of = [&](int a, int b) {
    std::vector<double> overlaps(photons);
    double kappa = 1.0;
    for (int p = 0; p < photons; ++p) {
      overlaps[p] = overlap(states[a][p], states[b][p]);
      kappa *= overlaps[p];
    }
    const SettingRates rates = setting_rates(campaign.rig, photons, kappa, overlaps);
    return EntryNoise{rates.p_pass, model_calibration(campaign.rig, photons, rates)};
  };
  problem.noise_train.resize(static_cast<std::size_t>(n) * n);
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j) problem.noise_train[i * n + j] = noise_of(i, j);
  problem.noise_test.resize(static_cast<std::size_t>(m) * n);
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j) problem.noise_test[t * n + j] = noise_of(n + t, j);
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

bool repair_psd(Eigen::MatrixXd& gram, bool keep_unit_diagonal) {
  // A Cholesky factorisation succeeding proves positive definiteness at a tenth of the cost of
  // the eigendecomposition, so the common well-measured case stays cheap.
  if (Eigen::LLT<Eigen::MatrixXd>(gram).info() == Eigen::Success) return false;
  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(gram);
  const Eigen::VectorXd lambda = eig.eigenvalues();
  if (lambda.minCoeff() >= 0.0) return false;
  const Eigen::MatrixXd& v = eig.eigenvectors();
  gram = v * lambda.cwiseMax(0.0).asDiagonal() * v.transpose();
  if (keep_unit_diagonal) {
    Eigen::VectorXd d = gram.diagonal().cwiseMax(std::numeric_limits<double>::min());
    d = d.cwiseSqrt().cwiseInverse();
    gram = d.asDiagonal() * gram * d.asDiagonal();
  }
  gram = 0.5 * (gram + gram.transpose()).eval();
  return true;
}

// ---------------------------------------------------------------------------------------------
// The Monte Carlo

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

int sign_of(double f) { return f > 0 ? 1 : -1; }

TrialOutcome run_trial(const MarginProblem& problem, const PreparedDraws& draws,
                       const SvmModel& ideal, const TrialOptions& options,
                       std::uint64_t trial_seed) {
  Eigen::MatrixXd train, test;
  draws.draw(trial_seed, train, test);
  TrialOutcome out;
  out.repaired = repair_psd(train, options.keep_unit_diagonal);
  SvmOptions svm = options.svm;
  svm.C = ideal.C;
  const SvmModel model = train_svm(train, problem.train_labels, svm);
  const Eigen::VectorXd f = model.decision(test);
  out.decision_test.assign(f.data(), f.data() + f.size());
  int right = 0;
  if (problem.test_count() > 0) {
    for (int t = 0; t < f.size(); ++t) right += sign_of(f[t]) == problem.test_labels[t];
    out.accuracy = static_cast<double>(right) / f.size();
  } else {
    for (int i = 0; i < problem.train_count(); ++i)
      right += sign_of(model.decision_train[i]) == problem.train_labels[i];
    out.accuracy = static_cast<double>(right) / problem.train_count();
  }
  out.margin_ratio = model.w_norm_squared > 0
                         ? std::sqrt(ideal.w_norm_squared / model.w_norm_squared)
                         : std::numeric_limits<double>::infinity();
  out.jaccard = jaccard(model.support, ideal.support);
  return out;
}

// Distribution-free interval for the median from order statistics: ranks n/2 -+ z sqrt(n)/2
// (normal approximation to the binomial(n, 1/2) count below the median; Conover, Practical
// Nonparametric Statistics, 3rd ed., 1999, section 3.2).
Estimate median_estimate(std::vector<double> values, double z) {
  Estimate e;
  if (values.empty()) return e;
  std::sort(values.begin(), values.end());
  const std::size_t n = values.size();
  e.value = n % 2 ? values[n / 2] : 0.5 * (values[n / 2 - 1] + values[n / 2]);
  const double half = z * std::sqrt(static_cast<double>(n)) / 2.0;
  const long low_rank = std::max(1L, static_cast<long>(std::floor(n / 2.0 - half)));
  const long high_rank =
      std::min(static_cast<long>(n), static_cast<long>(std::ceil(n / 2.0 + half + 1.0)));
  e.low = values[low_rank - 1];
  e.high = values[high_rank - 1];
  return e;
}

// Mean with the normal interval mean -+ z s / sqrt(n).
Estimate mean_estimate(const std::vector<double>& values, double z) {
  Estimate e;
  if (values.empty()) return e;
  const double n = static_cast<double>(values.size());
  double sum = 0.0, sum_sq = 0.0;
  for (double v : values) sum += v;
  e.value = sum / n;
  for (double v : values) sum_sq += (v - e.value) * (v - e.value);
  const double sd = values.size() > 1 ? std::sqrt(sum_sq / (n - 1)) : 0.0;
  e.low = e.value - z * sd / std::sqrt(n);
  e.high = e.value + z * sd / std::sqrt(n);
  return e;
}

Estimate proportion_estimate(double successes, double trials, double confidence) {
  const Interval w = wilson_interval(successes, trials, confidence);
  return {trials > 0 ? successes / trials : 0.0, w.low, w.high};
}

}  // namespace

TrialSummary run_margin_trials(const MarginProblem& problem, const SvmModel& ideal,
                               const TrialOptions& options) {
  if (options.trials < 1) throw std::invalid_argument("margin check: trials must be at least 1");
  const int trials = options.trials;
  std::vector<TrialOutcome> outcomes(trials);
  const PreparedDraws draws(problem);
  int threads =
      options.threads > 0 ? options.threads : static_cast<int>(std::thread::hardware_concurrency());
  threads = std::clamp(threads, 1, trials);

  std::atomic<int> next{0}, done{0};
  std::atomic<bool> stop{false};
  std::exception_ptr failure;
  std::mutex failure_mutex;
  // Trials are handed out one at a time; trial t's randomness depends on t alone, so which
  // thread runs it does not matter.
  auto work = [&](bool caller) {
    try {
      for (;;) {
        if (stop.load(std::memory_order_relaxed)) return;
        if (options.hooks.cancelled()) {
          stop = true;
          return;
        }
        const int t = next.fetch_add(1);
        if (t >= trials) return;
        outcomes[t] = run_trial(problem, draws, ideal, options, stream_seed(options.seed, t));
        const int finished = done.fetch_add(1) + 1;
        if (caller) options.hooks.report(static_cast<double>(finished) / trials);
      }
    } catch (...) {
      std::lock_guard<std::mutex> lock(failure_mutex);
      if (!failure) failure = std::current_exception();
      stop = true;
    }
  };
  std::vector<std::thread> pool;
  for (int k = 1; k < threads; ++k) pool.emplace_back(work, false);
  work(true);
  for (std::thread& th : pool) th.join();
  if (failure) std::rethrow_exception(failure);
  options.hooks.throw_if_cancelled();

  const double z = normal_quantile_two_sided(options.confidence);
  const int m = problem.test_count();
  const Eigen::VectorXd f0 = ideal.decision(problem.kernel_test);
  TrialSummary s;
  s.trials = trials;
  double repaired = 0.0;
  for (const TrialOutcome& o : outcomes) {
    s.accuracy.push_back(o.accuracy);
    s.margin_ratio.push_back(o.margin_ratio);
    s.support_jaccard.push_back(o.jaccard);
    repaired += o.repaired;
  }
  for (int t = 0; t < m; ++t) {
    TestPointOutcome p;
    p.test_index = t;
    p.decision_ideal = f0[t];
    p.label = problem.test_labels[t];
    double sum = 0.0, sum_sq = 0.0;
    for (const TrialOutcome& o : outcomes) {
      const double f = o.decision_test[t];
      p.flips += sign_of(f) != sign_of(f0[t]);
      sum += f;
      sum_sq += f * f;
    }
    const double mean = sum / trials;
    p.decision_sd =
        trials > 1 ? std::sqrt(std::max(0.0, (sum_sq - trials * mean * mean) / (trials - 1))) : 0.0;
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
  out << trials << " simulated campaigns (95% intervals unless set otherwise)\n";
  out << "  largest flip probability " << percent_text(flip_probability_max) << "\n";
  out << "  accuracy: median " << interval_text(accuracy_median) << ", mean "
      << interval_text(accuracy_mean) << "\n";
  out << "  margin ratio: median " << interval_text(margin_ratio_median) << ", mean "
      << interval_text(margin_ratio_mean) << "\n";
  out << "  support set Jaccard: median " << interval_text(support_jaccard_median) << ", mean "
      << interval_text(support_jaccard_mean) << "\n";
  out << "  PSD repair needed in " << percent_text(psd_repair_fraction) << " of trials\n";
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
// Allocation and budget search

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
  Eigen::MatrixXd w_train = Eigen::MatrixXd::Zero(n, n);
  Eigen::MatrixXd w_test = Eigen::MatrixXd::Zero(m, n);
  auto unit_sigma = [&](const EntryNoise& noise) {
    return std::sqrt(
        kernel_variance(problem.scheme, problem.photons, noise.calibration, noise.p_pass, 1.0));
  };
  // Only the margin-aware strategy reads the ideal classifier; the others accept an empty one.
  const bool aware = strategy == Allocation::margin_aware;
  if (aware && ideal.dual_coef.size() != n)
    throw std::invalid_argument("allocate_pairs: the margin-aware strategy needs the ideal SVM");
  const Eigen::VectorXd a =
      aware ? Eigen::VectorXd(ideal.dual_coef.cwiseAbs()) : Eigen::VectorXd::Zero(n);
  const Eigen::VectorXd f0 = aware && m > 0
                                 ? Eigen::VectorXd(ideal.decision(problem.kernel_test).cwiseAbs())
                                 : Eigen::VectorXd::Ones(m);
  const double f_mean = m > 0 ? f0.mean() : 1.0;
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j) {
      const EntryNoise& noise = problem.noise_train[i * n + j];
      double w = 1.0;
      if (strategy == Allocation::neyman) w = unit_sigma(noise);
      if (strategy == Allocation::margin_aware) w = unit_sigma(noise) * (a[i] + a[j]);
      w_train(i, j) = w;
    }
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j) {
      const EntryNoise& noise = problem.noise_test[t * n + j];
      double w = 1.0;
      if (strategy == Allocation::neyman) w = unit_sigma(noise);
      if (strategy == Allocation::margin_aware)
        w = unit_sigma(noise) * a[j] / std::max(f0[t], 0.1 * f_mean);
      w_test(t, j) = w;
    }
  if (strategy == Allocation::margin_aware) {
    // Entries off the support set still move the solution once noise changes it: a floor.
    const double count = n * (n - 1) / 2.0 + static_cast<double>(m) * n;
    const double floor = 0.1 * (w_train.sum() + w_test.sum()) / std::max(1.0, count);
    for (int i = 0; i < n; ++i)
      for (int j = i + 1; j < n; ++j) w_train(i, j) += floor;
    w_test.array() += floor;
  }
  const double weight_sum = w_train.sum() + w_test.sum();
  const double scale = weight_sum > 0 ? total / weight_sum : 0.0;
  problem.pairs_train = Eigen::MatrixXd::Zero(n, n);
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j)
      problem.pairs_train(i, j) = problem.pairs_train(j, i) = scale * w_train(i, j);
  problem.pairs_test = scale * w_test;
}

namespace {

// Bisection in log(scale) for the smallest scale whose trials pass. `passes` evaluates one
// scale with the same trial seeds every time (common random numbers), which keeps the pass/fail
// boundary from jittering between evaluations.
BudgetSearch search_scale(const std::function<bool(double)>& passes, double start, double low,
                          double high, double relative_step) {
  BudgetSearch r;
  double lo = 0.0, hi = 0.0;
  double s = std::clamp(start, low, high);
  if (passes(s)) {
    hi = s;
    while (hi > low) {
      const double trial = std::max(low, hi / 4.0);
      if (!passes(trial)) {
        lo = trial;
        break;
      }
      hi = trial;
    }
    if (lo == 0.0) {
      r.found = true;
      r.pairs_per_entry = hi;
      return r;
    }
  } else {
    lo = s;
    while (lo < high) {
      const double trial = std::min(high, lo * 4.0);
      if (passes(trial)) {
        hi = trial;
        break;
      }
      lo = trial;
    }
    if (hi == 0.0) return r;
  }
  while (hi / lo > 1.0 + relative_step) {
    const double mid = std::sqrt(lo * hi);
    (passes(mid) ? hi : lo) = mid;
  }
  r.found = true;
  r.pairs_per_entry = hi;
  r.failing_below = lo;
  return r;
}

double time_now_ms() {
  return std::chrono::duration<double, std::milli>(
             std::chrono::steady_clock::now().time_since_epoch())
      .count();
}

// Maps progress of a sub-task onto [from, to] of the whole.
WorkHooks sub_hooks(const WorkHooks& hooks, double from, double to) {
  WorkHooks sub;
  sub.cancel = hooks.cancel;
  if (hooks.progress)
    sub.progress = [progress = hooks.progress, from, to](double f) {
      progress(from + (to - from) * f);
    };
  return sub;
}

}  // namespace

MarginCheck check_margin(const Campaign& campaign, const Plan& plan,
                         const MarginCheckOptions& options) {
  const double t0 = time_now_ms();
  const DataSet& data = campaign.data;
  if (data.train_count() < 2) throw std::invalid_argument("margin check: too few training points");
  const CheckSettings& settings = campaign.check;
  MarginCheck check;
  MarginProblem problem = make_margin_problem(campaign, plan);
  const std::uint64_t seed = options.seed != 0 ? options.seed : campaign.seed;

  if (settings.C > 0) {
    check.C = settings.C;
  } else {
    CrossValidationOptions cv;
    cv.folds = std::max(2, settings.cv_folds);
    cv.seed = seed;
    check.cross_validation = choose_C(problem.kernel_train, problem.train_labels, cv);
    check.C = check.cross_validation.best_C;
    check.C_from_cross_validation = true;
  }
  SvmOptions svm;
  svm.C = check.C;
  check.ideal = train_svm(problem.kernel_train, problem.train_labels, svm);
  check.decision_test = check.ideal.decision(problem.kernel_test);

  TrialOptions trial;
  trial.trials = options.trials > 0 ? options.trials : settings.trials;
  trial.seed = seed;
  trial.threads = options.threads;
  trial.keep_unit_diagonal = settings.keep_unit_diagonal;
  trial.confidence = options.confidence;
  trial.svm = svm;
  const bool extras = options.minimum_budget || options.compare_allocations;
  trial.hooks = sub_hooks(options.hooks, 0.0, extras ? 0.4 : 0.95);
  check.trials = run_margin_trials(problem, check.ideal, trial);
  check.verdict = judge(check.trials, settings, data.train_count());

  const int n = problem.train_count(), m = problem.test_count();
  const double entries = n * (n - 1) / 2.0 + static_cast<double>(m) * n;
  check.pair_detect_rate_per_s = pair_detect_rate_per_s(campaign.rig, problem.photons);
  const double r = check.pair_detect_rate_per_s;
  const double plan_total = total_pairs(problem);
  check.plan_integration_s = plan_total / r;
  check.plan_overhead_s = plan.summary.measure_move_s + plan.summary.reference_s;

  TrialOptions search = trial;
  search.trials =
      options.search_trials > 0 ? std::min(options.search_trials, trial.trials) : trial.trials;
  check.search_trials = search.trials;
  search.hooks = WorkHooks{};
  search.hooks.cancel = options.hooks.cancel;
  BudgetSearchOptions limits;
  int evaluations = 0;
  auto evaluate = [&](const MarginProblem& p) {
    ++evaluations;
    const TrialSummary s = run_margin_trials(p, check.ideal, search);
    return judge(s, settings, n).pass;
  };

  if (options.minimum_budget && entries > 0) {
    MarginProblem p = problem;
    auto passes = [&](double pairs) {
      for (int i = 0; i < n; ++i)
        for (int j = 0; j < n; ++j) p.pairs_train(i, j) = i == j ? 0.0 : pairs;
      p.pairs_test.setConstant(pairs);
      return evaluate(p);
    };
    evaluations = 0;
    check.minimum_uniform = search_scale(passes, plan_total / entries, limits.low_pairs,
                                         limits.high_pairs, limits.relative_step);
    check.minimum_uniform.evaluations = evaluations;
    if (check.minimum_uniform.found) {
      check.minimum_uniform.total_pairs = check.minimum_uniform.pairs_per_entry * entries;
      check.minimum_uniform.integration_s = check.minimum_uniform.total_pairs / r;
    }
    options.hooks.report(0.65);
  }

  if (options.compare_allocations && entries > 0 && plan_total > 0) {
    for (Allocation a : {Allocation::uniform, Allocation::neyman, Allocation::margin_aware}) {
      AllocationOutcome outcome;
      outcome.strategy = a;
      MarginProblem p = problem;
      allocate_pairs(p, a, check.ideal, plan_total);
      const TrialSummary at_plan = run_margin_trials(p, check.ideal, search);
      outcome.flip_probability_max = at_plan.flip_probability_max.value;
      outcome.margin_ratio_median = at_plan.margin_ratio_median.value;
      outcome.pass_at_plan_time = judge(at_plan, settings, n).pass;
      const MarginProblem base = p;
      auto passes = [&](double factor) {
        p.pairs_train = base.pairs_train * factor;
        p.pairs_test = base.pairs_test * factor;
        return evaluate(p);
      };
      evaluations = 0;
      // Factors of the plan's total; the limits mirror the uniform search's pairs per entry.
      const double per_entry = plan_total / entries;
      BudgetSearch s = search_scale(passes, 1.0, limits.low_pairs / per_entry,
                                    limits.high_pairs / per_entry, limits.relative_step);
      s.evaluations = evaluations + 1;
      if (s.found) {
        const double factor = s.pairs_per_entry;
        s.total_pairs = plan_total * factor;
        s.pairs_per_entry = s.total_pairs / entries;
        s.failing_below *= plan_total / entries;
        s.integration_s = s.total_pairs / r;
      }
      outcome.time_for_pass = s;
      check.allocations.push_back(outcome);
    }
    options.hooks.report(0.9);
  }

  if (options.scan_scale) {
    const std::vector<int> folds =
        stratified_folds(data.train_labels, std::max(2, settings.cv_folds), seed);
    double best = -1.0;
    for (double factor : options.scale_factors) {
      options.hooks.throw_if_cancelled();
      ScalePoint point;
      point.factor = factor;
      const Eigen::MatrixXd gram = ideal_gram(campaign.encoding.scaled(factor), data.train);
      point.alignment = kernel_target_alignment(gram, data.train_labels);
      point.cv_accuracy = cross_validated_accuracy(gram, data.train_labels, folds, svm);
      check.scale_scan.push_back(point);
      // Best held-out accuracy; alignment breaks ties.
      const double score = point.cv_accuracy + 1e-6 * point.alignment;
      if (score > best) {
        best = score;
        check.advised_scale = factor;
      }
    }
  }
  options.hooks.report(1.0);
  check.check_ms = time_now_ms() - t0;
  return check;
}

std::string MarginCheck::report() const {
  std::ostringstream out;
  out << "Margin check: " << (verdict.pass ? "PASS" : "FAIL") << "\n";
  if (C_from_cross_validation) out << cross_validation.report();
  out << ideal.report();
  out << trials.report();
  for (const std::string& reason : verdict.reasons) out << "  fails: " << reason << "\n";
  out << std::setprecision(4);
  out << "Planned integration " << plan_integration_s / 3600.0 << " h (plus "
      << plan_overhead_s / 3600.0 << " h of moves and reference steps)\n";
  if (minimum_uniform.evaluations > 0 || !allocations.empty())
    out << "Budget search and allocations use " << search_trials << " trials per evaluation\n";
  if (minimum_uniform.evaluations > 0) {
    if (minimum_uniform.found)
      out << "Smallest uniform budget that passes: " << minimum_uniform.pairs_per_entry
          << " pairs per entry, " << minimum_uniform.integration_s / 3600.0 << " h of integration ("
          << minimum_uniform.evaluations << " evaluations)\n";
    else
      out << "No uniform budget up to the search limit passes\n";
  }
  for (const AllocationOutcome& a : allocations) {
    out << "  " << to_string(a.strategy) << ": at the planned time "
        << (a.pass_at_plan_time ? "passes" : "fails") << " (largest flip "
        << 100 * a.flip_probability_max << "%, median margin ratio " << a.margin_ratio_median
        << "); ";
    if (a.time_for_pass.found)
      out << "passes from " << a.time_for_pass.integration_s / 3600.0 << " h of integration\n";
    else
      out << "no pass within the search limit\n";
  }
  if (!scale_scan.empty()) {
    out << "Encoding scale (alignment, held-out accuracy):";
    for (const ScalePoint& p : scale_scan)
      out << " x" << p.factor << " (" << p.alignment << ", " << p.cv_accuracy << ")";
    out << "\n  advised scale x" << advised_scale << "\n";
  }
  return out.str();
}

}  // namespace gramline
