#pragma once
// The margin check (README, user guide step 13): with the planned pairs per entry, does the
// classifier trained on the measured Gram matrix still put every test point on the same side, with
// margin? A Monte Carlo over simulated campaigns: counts per setting with the detection scheme's
// statistics, the unbiased kernel estimator of detection.h, PSD repair (kernel.h), retraining.
#include <Eigen/Core>
#include <cstdint>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "gramline/allocation.h"
#include "gramline/budget.h"
#include "gramline/campaign.h"
#include "gramline/detection.h"
#include "gramline/entries.h"
#include "gramline/estimates.h"
#include "gramline/kernel.h"
#include "gramline/plan.h"
#include "gramline/progress.h"
#include "gramline/svm.h"

namespace gramline {

/// Everything one simulated campaign needs. Entries with pairs <= 0 are taken as exact (the
/// diagonal, or an entry fixed on purpose).
struct MarginProblem {
  DetectionScheme scheme = DetectionScheme::both_ports;
  int photons = 2;
  Eigen::MatrixXd kernel_train;         ///< N x N ideal
  Eigen::MatrixXd kernel_test;          ///< M x N ideal
  Eigen::VectorXi train_labels;         ///< -1/+1
  Eigen::VectorXi test_labels;          ///< -1/+1 (may be empty)
  Eigen::MatrixXd pairs_train;          ///< N x N detected pairs per entry (upper triangle used)
  Eigen::MatrixXd pairs_test;           ///< M x N
  std::vector<EntryNoise> noise_train;  ///< N x N, row-major (upper triangle used)
  std::vector<EntryNoise> noise_test;   ///< M x N, row-major
  /// The reference steps that calibrate the entries (docs/error-budget.md): every trial draws
  /// their counts, estimates each one's pair rate and visibility (reference_calibration,
  /// detection.h) and calibrates every entry by those around it, as ingest does.
  struct Reference {
    EntryNoise noise;  ///< rig-model statistics of the diagonal setting
    double pairs = 0.0;
    CalibrationCovariance covariance;  ///< reference_covariance at those pairs
  };
  std::vector<Reference> references;
  /// Each entry's references and weights, same layout as noise_train / noise_test; empty: the
  /// calibration is exact (no references, or a problem made by hand).
  std::vector<CalibrationWeights> weights_train;
  std::vector<CalibrationWeights> weights_test;
  /// Plate imperfections (plates.h, docs/conventions.md "Real plates"). When `plate_rig` has
  /// any, every trial draws each motor's axis offset once (shared by all entries) and each
  /// entry's repeatability, and the counts follow the kernel the rig realises at the entry's
  /// motor positions so shifted (retardance bias and leakage included). Empty: ideal plates.
  std::optional<Rig> plate_rig;
  std::vector<std::vector<double>> positions_train;  ///< N x N, row-major (upper triangle)
  std::vector<std::vector<double>> positions_test;   ///< M x N, row-major

  int train_count() const { return static_cast<int>(kernel_train.rows()); }
  int test_count() const { return static_cast<int>(kernel_test.rows()); }
  /// Predicted standard deviation of each entry's estimate (entry_sigma and the calibration's
  /// variance in quadrature; 0 for an exact entry), same shapes.
  Eigen::MatrixXd sigma_train() const;
  Eigen::MatrixXd sigma_test() const;
};

/// Builds the problem from a campaign and its plan: ideal kernels and pairs from the plan,
/// each entry's count statistics from the rig model (EntryStatistics, entries.h).
MarginProblem make_margin_problem(const Campaign& campaign, const Plan& plan);

/// Draws one simulated measured kernel: counts per entry at a fixed dwell (both_ports: total
/// Poisson and pass binomial given the total, drawn as independent Poisson pass and other-channel
/// counts; pass_only: pass Poisson), then estimate_kernel. Entry e of trial t uses
/// its own stream stream_seed(trial_seed, e), so a given entry sees the same random numbers
/// whatever its pairs (common random numbers across budgets).
void draw_measured_kernels(const MarginProblem& problem, std::uint64_t trial_seed,
                           Eigen::MatrixXd& train, Eigen::MatrixXd& test);

struct TrialOptions {
  int trials = 1000;
  std::uint64_t seed = 1;
  int threads = 0;  ///< 0: all cores
  bool keep_unit_diagonal = true;
  double confidence = 0.95;  ///< of every interval
  SvmOptions svm;            ///< options of the retrained classifiers (C: the ideal one's)
  WorkHooks hooks;
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

/// One test point's outcome over the trials.
struct TestPointOutcome {
  int test_index = 0;           ///< 0-based among test points
  double decision_ideal = 0.0;  ///< f at the point, noiseless classifier
  int label = 0;                ///< true label
  int flips = 0;                ///< trials whose label differs from the noiseless one
  Estimate flip_probability;    ///< flips / trials, Wilson interval (Wilson 1927)
  double decision_sd = 0.0;     ///< standard deviation of the noisy f over trials
};

struct TrialSummary {
  int trials = 0;
  TrialOptions options;  ///< as run (without hooks); svm.C is the C the trials retrained with
  int threads_used = 0;  ///< loop_thread_count of options.threads (parallel.h)
  std::vector<TestPointOutcome> points;
  Estimate flip_probability_max;  ///< largest per-point probability, its own Wilson interval
  Estimate accuracy_median;       ///< per-trial accuracy (test points; training if none)
  Estimate accuracy_mean;         ///< normal interval
  Estimate margin_ratio_median;   ///< noisy 1/||w|| over noiseless
  Estimate margin_ratio_mean;
  Estimate support_jaccard_median;  ///< |S cap S0| / |S cup S0| of the support sets
  Estimate support_jaccard_mean;
  Estimate psd_repair_fraction;  ///< trials that needed clipping, Wilson interval
  std::vector<double> accuracy, margin_ratio, support_jaccard;  ///< per trial
  Eigen::MatrixXd decision_trials;  ///< trials x M: f at each test point in each trial
  std::string report() const;
};

/// Runs the Monte Carlo. Trial t uses stream_seed(seed, t); results do not depend on threads.
/// Throws Cancelled when the cancel flag is raised.
TrialSummary run_margin_trials(const MarginProblem& problem, const SvmModel& ideal,
                               const TrialOptions& options);

/// Draws one noisy kernel pair (training N x N, test M x N) from a trial's seed. Called from
/// several threads at once: it must only read shared state.
using KernelDraw =
    std::function<void(std::uint64_t trial_seed, Eigen::MatrixXd& train, Eigen::MatrixXd& test)>;

/// The Monte Carlo behind run_margin_trials for any source of noisy kernels: each trial draws a
/// kernel, repairs it (repair_psd), retrains with the reference's C and compares with
/// `reference` (the classifier a noiseless or best-estimate kernel gives; its test decisions are
/// reference.decision(reference_test)). Flips, margin ratio and support overlap are counted
/// against that reference. Trial t uses stream_seed(options.seed, t).
TrialSummary run_kernel_trials(const KernelDraw& draw, const Eigen::VectorXi& train_labels,
                               const Eigen::VectorXi& test_labels,
                               const Eigen::MatrixXd& reference_test, const SvmModel& reference,
                               const TrialOptions& options);

/// Verdict of one summary against the campaign's thresholds, with the failing reasons.
struct Verdict {
  bool pass = false;
  std::vector<std::string> reasons;  ///< one line per failing point or figure
};
/// `reference` names the classifier the flips are counted against in the reasons ("noiseless"
/// for the margin check, the best estimate for the stop rule).
Verdict judge(const TrialSummary& summary, const CheckSettings& settings, int train_count,
              const std::string& reference = "noiseless");

/// allocate_pairs (allocation.h) over every measure entry of the problem (training upper
/// triangle and test block); writes problem.pairs_train / pairs_test.
void allocate_pairs(MarginProblem& problem, Allocation strategy, const SvmModel& ideal,
                    double total_pairs);

/// Total detected pairs of the measure entries (upper triangle plus test block).
double total_pairs(const MarginProblem& problem);

struct BudgetSearchOptions {
  double low_pairs = 10.0;      ///< pairs per entry where the search starts
  double high_pairs = 1e9;      ///< give up above this
  double relative_step = 0.05;  ///< stop when high / low < 1 + this
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

/// Smallest budget passing, found by bisection on a log scale with common random numbers.
struct BudgetSearch {
  bool found = false;
  double pairs_per_entry = 0.0;  ///< uniform search: pairs of every entry
  double total_pairs = 0.0;      ///< all measure entries
  double integration_s = 0.0;    ///< total_pairs / r
  double failing_below = 0.0;    ///< the bracket's failing end (same units as pairs_per_entry;
                                 ///< 0 when the lowest budget tried passes)
  int evaluations = 0;
};

/// One factor of the encoding scale scan (README, user guide step 13).
struct ScalePoint {
  double factor = 1.0;
  double alignment = 0.0;    ///< kernel-target alignment of the ideal training Gram
  double cv_accuracy = 0.0;  ///< k-fold held-out accuracy at the check's C
};

struct AllocationOutcome {
  Allocation strategy = Allocation::uniform;
  bool pass_at_plan_time = false;
  double flip_probability_max = 0.0;  ///< at the plan's integration time
  double margin_ratio_median = 0.0;
  BudgetSearch time_for_pass;  ///< smallest integration time passing
};

struct MarginCheckOptions {
  int trials = 0;          ///< 0: campaign.check.trials
  std::uint64_t seed = 0;  ///< 0: campaign.seed
  int threads = 0;         ///< 0: all cores
  double confidence = 0.95;
  /// Trials per evaluation of the budget search and the allocation comparison (at most the
  /// check's trials; 0: as many): a bisection evaluates some ten budgets per strategy.
  int search_trials = 300;
  bool minimum_budget = true;
  bool compare_allocations = true;
  BudgetSearchOptions budget_search;  ///< limits of both searches, in pairs per entry
  bool scan_scale = true;
  std::vector<double> scale_factors = {0.25, 0.5, 0.75, 1.0, 1.25, 1.5, 2.0};
  WorkHooks hooks;
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

struct MarginCheck {
  /// As run, without hooks: trials, seed and search_trials resolved (never 0).
  MarginCheckOptions options;
  double C = 1.0;
  bool C_from_cross_validation = false;
  CrossValidationResult cross_validation;  ///< filled when C was chosen by CV
  SvmModel ideal;                          ///< trained on the ideal kernel
  Eigen::VectorXd decision_test;           ///< ideal f at the test points
  TrialSummary trials;
  Verdict verdict;
  double pair_detect_rate_per_s = 0.0;
  double plan_integration_s = 0.0;
  double plan_overhead_s = 0.0;  ///< plan's moves and reference steps (not pairs)
  int search_trials = 0;         ///< trials per budget-search evaluation
  BudgetSearch minimum_uniform;
  std::vector<AllocationOutcome> allocations;
  std::vector<ScalePoint> scale_scan;
  double advised_scale = 1.0;
  double check_ms = 0.0;
  std::string report() const;
};

/// The full check of a planned campaign. Throws std::invalid_argument for an unusable campaign
/// (one class, no training points) or options, and Cancelled when cancelled.
MarginCheck check_margin(const Campaign& campaign, const Plan& plan,
                         const MarginCheckOptions& options = {});

}  // namespace gramline
