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
#include "gramline/plates.h"
#include "gramline/random.h"

namespace gramline {

// ---------------------------------------------------------------------------------------------
// The problem

namespace {
// Counts and calibration in quadrature, as the plan computes them (plan.cpp).
double marginal_sigma(const MarginProblem& p, const EntryNoise& noise, double pairs,
                      const std::vector<CalibrationWeights>& weights, std::size_t e) {
  const double own = entry_sigma(p.scheme, p.photons, noise, pairs);
  if (weights.empty() || p.references.empty()) return own;
  std::vector<CalibrationCovariance> covs;
  covs.reserve(p.references.size());
  for (const MarginProblem::Reference& r : p.references) covs.push_back(r.covariance);
  const double cal = calibration_variance(
      kernel_calibration_gradient(p.scheme, p.photons, noise.calibration, noise.p_pass),
      interpolated_covariance(weights.at(e), covs));
  return std::sqrt(own * own + cal);
}
}  // namespace

Eigen::MatrixXd MarginProblem::sigma_train() const {
  const int n = train_count();
  Eigen::MatrixXd s = Eigen::MatrixXd::Zero(n, n);
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j) {
      const double pairs = pairs_train(i, j);
      const std::size_t e = static_cast<std::size_t>(i) * n + j;
      if (pairs > 0)
        s(i, j) = s(j, i) = marginal_sigma(*this, noise_train[e], pairs, weights_train, e);
    }
  return s;
}

Eigen::MatrixXd MarginProblem::sigma_test() const {
  const int n = train_count(), m = test_count();
  Eigen::MatrixXd s = Eigen::MatrixXd::Zero(m, n);
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j) {
      const double pairs = pairs_test(t, j);
      const std::size_t e = static_cast<std::size_t>(t) * n + j;
      if (pairs > 0) s(t, j) = marginal_sigma(*this, noise_test[e], pairs, weights_test, e);
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
  const Rig& rig = campaign.rig;
  const bool leaks = std::any_of(rig.detectors.begin(), rig.detectors.end(),
                                 [](const Detector& d) { return d.pbs_leakage > 0.0; });
  if (has_retardance_errors(rig) || has_random_plate_terms(rig) || leaks) {
    problem.plate_rig = rig;
    problem.positions_train.resize(static_cast<std::size_t>(n) * n);
    problem.positions_test.resize(static_cast<std::size_t>(m) * n);
    for (int i = 0; i < n; ++i)
      for (int j = i + 1; j < n; ++j)
        if (const int k = plan.step_of_train(i, j); k >= 0)
          problem.positions_train[i * n + j] = plan.steps[k].position_deg;
    for (int t = 0; t < m; ++t)
      for (int j = 0; j < n; ++j)
        if (const int k = plan.step_of_test(t, j); k >= 0)
          problem.positions_test[t * n + j] = plan.steps[k].position_deg;
  }
  // The reference steps and the weights each measure step takes from them, by the middle of
  // the counting intervals (the rule of ingest, calibration_weights in entries.h).
  std::vector<std::pair<double, int>> refs;
  auto middle = [](const Step& s) { return s.start_s + s.move_s + 0.5 * s.dwell_s; };
  for (size_t k = 0; k < plan.steps.size(); ++k) {
    const Step& st = plan.steps[k];
    if (st.kind == StepKind::reference && st.pairs > 0)
      refs.push_back({middle(st), static_cast<int>(k)});
  }
  std::stable_sort(refs.begin(), refs.end(),
                   [](const auto& a, const auto& b) { return a.first < b.first; });
  if (refs.empty()) return problem;
  std::vector<double> times;
  for (const auto& [t, k] : refs) {
    const Step& st = plan.steps[k];
    times.push_back(t);
    problem.references.push_back({entries.noise(st.prep_point, st.analysis_point), st.pairs,
                                  entries.reference_covariance(st.pairs)});
  }
  problem.weights_train.assign(static_cast<std::size_t>(n) * n, {});
  problem.weights_test.assign(static_cast<std::size_t>(m) * n, {});
  for (const Step& st : plan.steps) {
    if (st.kind != StepKind::measure) continue;
    const int a = std::min(st.prep_point, st.analysis_point);
    const int b = std::max(st.prep_point, st.analysis_point);
    const CalibrationWeights w = calibration_weights(times, middle(st));
    if (st.block == Block::train)
      problem.weights_train[static_cast<std::size_t>(a) * n + b] = w;
    else
      problem.weights_test[static_cast<std::size_t>(b - n) * n + a] = w;
  }
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
  double pass_rate_per_s = 0.0;                        // at the ideal kernel
  double total_rate_per_s = 0.0;                       // both_ports: all channels
  const std::vector<double>* positions_deg = nullptr;  // plate draws: the entry's positions
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
    for (const MarginProblem::Reference& r : problem.references)
      refs_.push_back(prepare(r.noise, 1.0, r.pairs, {}, 0));
    train_.resize(static_cast<std::size_t>(n) * n);
    test_.resize(static_cast<std::size_t>(m) * n);
    for (int i = 0; i < n; ++i)
      for (int j = i + 1; j < n; ++j)
        train_[i * n + j] = prepare(problem.noise_train[i * n + j], problem.kernel_train(i, j),
                                    problem.pairs_train(i, j), problem.positions_train, i * n + j);
    for (int t = 0; t < m; ++t)
      for (int j = 0; j < n; ++j)
        test_[t * n + j] = prepare(problem.noise_test[t * n + j], problem.kernel_test(t, j),
                                   problem.pairs_test(t, j), problem.positions_test, t * n + j);
  }

  void draw(std::uint64_t trial_seed, Eigen::MatrixXd& train, Eigen::MatrixXd& test) const {
    const int n = problem_.train_count(), m = problem_.test_count();
    const std::size_t entries = static_cast<std::size_t>(n) * n + static_cast<std::size_t>(m) * n;
    // The references' counts, each on its own stream after the entries', and the calibration
    // each gives (reference_calibration, detection.h).
    std::vector<Calibration> cal(refs_.size());
    for (size_t k = 0; k < refs_.size(); ++k) {
      const SettingCounts counts = draw_counts(refs_[k], stream_seed(trial_seed, entries + k),
                                               refs_[k].pass, refs_[k].other);
      cal[k] =
          reference_calibration(problem_.scheme, problem_.photons, *refs_[k].calibration, counts);
    }
    // Plate draws use the streams after the references': one for the axis offsets of the
    // trial, then one per entry for its repeatability.
    const std::uint64_t plates = entries + refs_.size();
    const std::vector<double> offsets = axis_offsets(stream_seed(trial_seed, plates));
    const std::uint64_t repeat_seed = stream_seed(trial_seed, plates + 1);
    train.resize(n, n);
    test.resize(m, n);
    for (int i = 0; i < n; ++i) {
      train(i, i) = problem_.kernel_train(i, i);
      for (int j = i + 1; j < n; ++j) {
        const std::size_t e = static_cast<std::size_t>(i) * n + j;
        train(i, j) = train(j, i) =
            sample(train_[e], stream_seed(trial_seed, e), problem_.weights_train, e, cal, offsets,
                   stream_seed(repeat_seed, e));
      }
    }
    for (int t = 0; t < m; ++t)
      for (int j = 0; j < n; ++j) {
        const std::size_t e = static_cast<std::size_t>(t) * n + j;
        const std::size_t stream = static_cast<std::size_t>(n) * n + e;
        test(t, j) = sample(test_[e], stream_seed(trial_seed, stream), problem_.weights_test, e,
                            cal, offsets, stream_seed(repeat_seed, stream));
      }
  }

 private:
  EntrySampler prepare(const EntryNoise& noise, double ideal, double pairs,
                       const std::vector<std::vector<double>>& positions, std::size_t e) const {
    EntrySampler s;
    s.ideal = ideal;
    if (e < positions.size()) s.positions_deg = &positions[e];
    if (!(pairs > 0)) return s;
    const Calibration& cal = noise.calibration;
    const double r = cal.pair_detect_rate_per_s;
    s.exact = false;
    s.calibration = &cal;
    s.dwell_s = pairs / r;
    const double pass_rate = r * noise.p_pass + cal.accidental_pass_rate_per_s;
    s.pass = PoissonParam(std::max(pass_rate * s.dwell_s, 1e-300));
    s.pass_rate_per_s = pass_rate;
    s.total_rate_per_s = r + cal.accidental_total_rate_per_s;
    if (problem_.scheme == DetectionScheme::both_ports)
      s.other = PoissonParam(std::max((s.total_rate_per_s - pass_rate) * s.dwell_s, 1e-300));
    return s;
  }

  SettingCounts draw_counts(const EntrySampler& s, std::uint64_t seed, const PoissonParam& pass,
                            const PoissonParam& other) const {
    SplitMix64 rng(seed);
    std::poisson_distribution<long long> poisson;
    SettingCounts counts;
    counts.dwell_s = s.dwell_s;
    counts.pass_counts = static_cast<double>(poisson(rng, pass));
    if (problem_.scheme == DetectionScheme::both_ports) {
      // The dwell is fixed, so the total over all channels is Poisson and, given the total, the
      // pass channel is binomial. Drawn here as two independent Poisson counts (pass, rest),
      // which has exactly that joint law (Poisson splitting; Kingman, Poisson Processes, 1993).
      counts.total_counts = counts.pass_counts + static_cast<double>(poisson(rng, other));
      // No coincidence at all carries no information: take the uninformative half.
      if (counts.total_counts == 0) {
        counts.total_counts = 2.0;
        counts.pass_counts = 1.0;
      }
    }
    return counts;
  }

  // One normal draw per motor: its axis offset in this trial (degrees); empty without plates.
  std::vector<double> axis_offsets(std::uint64_t seed) const {
    if (!problem_.plate_rig) return {};
    SplitMix64 rng(seed);
    std::normal_distribution<double> normal;
    std::vector<double> out;
    for (const Motor& mo : problem_.plate_rig->motors)
      out.push_back(mo.axis_offset_sd_deg * normal(rng));
    return out;
  }

  // The pass rate of the entry under the trial's plates: the pass probability moves by
  // V (kernel_rig - kernel_ideal) (p = V kappa + (1 - V) / 2^P, docs/conventions.md).
  double plate_pass_rate(const EntrySampler& s, const std::vector<double>& offsets,
                         std::uint64_t repeat_seed) const {
    const Rig& rig = *problem_.plate_rig;
    SplitMix64 rng(repeat_seed);
    std::normal_distribution<double> normal;
    std::vector<double> shift = offsets;
    for (std::size_t k = 0; k < shift.size(); ++k)
      shift[k] += rig.motors[k].repeatability_sd_deg * normal(rng);
    const double kernel = rig_kernel(rig, problem_.photons, *s.positions_deg, shift);
    const Calibration& cal = *s.calibration;
    return s.pass_rate_per_s + cal.pair_detect_rate_per_s * cal.visibility * (kernel - s.ideal);
  }

  // One entry's estimate: its counts (at the pass rate the trial's plates give), calibrated by
  // the references of its weights when it has some (their rate and visibility interpolated),
  // else by the rig model.
  double sample(const EntrySampler& s, std::uint64_t seed,
                const std::vector<CalibrationWeights>& weights, std::size_t e,
                const std::vector<Calibration>& refs, const std::vector<double>& offsets,
                std::uint64_t repeat_seed) const {
    if (s.exact) return s.ideal;
    PoissonParam pass = s.pass, other = s.other;
    if (problem_.plate_rig && s.positions_deg && !s.positions_deg->empty()) {
      const double rate =
          std::clamp(plate_pass_rate(s, offsets, repeat_seed), 0.0, s.total_rate_per_s);
      pass = PoissonParam(std::max(rate * s.dwell_s, 1e-300));
      other = PoissonParam(std::max((s.total_rate_per_s - rate) * s.dwell_s, 1e-300));
    }
    const SettingCounts counts = draw_counts(s, seed, pass, other);
    const Calibration cal = weights.empty() || refs.empty()
                                ? *s.calibration
                                : interpolated_calibration(*s.calibration, weights[e], refs);
    return estimate_kernel(problem_.scheme, problem_.photons, cal, counts);
  }

  const MarginProblem& problem_;
  std::vector<EntrySampler> train_, test_, refs_;
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

Verdict judge(const TrialSummary& summary, const CheckSettings& settings, int train_count,
              const std::string& reference) {
  Verdict v;
  for (const TestPointOutcome& p : summary.points) {
    if (p.flip_probability.value <= settings.flip_threshold) continue;
    std::ostringstream why;
    why << "test point " << p.test_index << " (point " << train_count + p.test_index
        << "): label flips in " << percent_text(p.flip_probability) << " of trials, above "
        << 100 * settings.flip_threshold << "%; " << reference << " f = " << std::setprecision(4)
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
