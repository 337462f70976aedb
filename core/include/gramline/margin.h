#pragma once
// The margin check (README, user guide step 13): with the planned pairs per entry, does the
// classifier trained on the measured Gram matrix still put every test point on the same side, with
// margin? A Monte Carlo over simulated campaigns: counts per setting with the detection scheme's
// statistics, the unbiased kernel estimator of detection.h, PSD repair, retraining.
#include <Eigen/Core>
#include <cstdint>
#include <string>
#include <vector>

#include "gramline/budget.h"
#include "gramline/campaign.h"
#include "gramline/detection.h"
#include "gramline/plan.h"
#include "gramline/progress.h"
#include "gramline/svm.h"

namespace gramline {

/// Count statistics of one kernel entry, independent of its pairs.
struct EntryNoise {
  double p_pass = 0.0;      ///< predicted pass probability of the setting
  Calibration calibration;  ///< pair rate r (per s), visibility, accidentals (per s)
};

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

  int train_count() const { return static_cast<int>(kernel_train.rows()); }
  int test_count() const { return static_cast<int>(kernel_test.rows()); }
  /// Predicted standard deviation of each entry's estimate (kernel_variance), same shapes.
  Eigen::MatrixXd sigma_train() const;
  Eigen::MatrixXd sigma_test() const;
};

/// Builds the problem from a campaign and its plan: ideal kernels and pairs from the plan,
/// rates and calibration per setting from the rig model (setting_rates, model_calibration).
MarginProblem make_margin_problem(const Campaign& campaign, const Plan& plan);

/// Draws one simulated measured kernel: counts per entry at a fixed dwell (both_ports: total
/// Poisson and pass binomial given the total, drawn as independent Poisson pass and other-channel
/// counts; pass_only: pass Poisson), then estimate_kernel. Entry e of trial t uses
/// its own stream stream_seed(trial_seed, e), so a given entry sees the same random numbers
/// whatever its pairs (common random numbers across budgets).
void draw_measured_kernels(const MarginProblem& problem, std::uint64_t trial_seed,
                           Eigen::MatrixXd& train, Eigen::MatrixXd& test);

/// Nearest positive semidefinite matrix in Frobenius norm by clipping negative eigenvalues at
/// zero (Higham, Linear Algebra Appl. 103 (1988) 103-118); with keep_unit_diagonal, then
/// rescaled as D^-1/2 K D^-1/2 so every diagonal entry is 1 again. Returns true when a
/// negative eigenvalue was clipped.
bool repair_psd(Eigen::MatrixXd& gram, bool keep_unit_diagonal);

/// A Monte Carlo figure with its confidence interval.
struct Estimate {
  double value = 0.0;
  double low = 0.0;
  double high = 0.0;
};

struct TrialOptions {
  int trials = 1000;
  std::uint64_t seed = 1;
  int threads = 0;  ///< 0: all cores
  bool keep_unit_diagonal = true;
  double confidence = 0.95;  ///< of every interval
  SvmOptions svm;            ///< C of the retrained classifiers
  WorkHooks hooks;
};

/// One test point's outcome over the trials.
struct TestPointOutcome {
  int test_index = 0;           ///< 0-based among test points
  double decision_ideal = 0.0;  ///< f at the point, noiseless classifier
  int label = 0;                ///< true label
  int flips = 0;                ///< trials whose sign differs from the noiseless one
  Estimate flip_probability;    ///< flips / trials, Wilson interval (Wilson 1927)
  double decision_sd = 0.0;     ///< standard deviation of the noisy f over trials
};

struct TrialSummary {
  int trials = 0;
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
  std::string report() const;
};

/// Runs the Monte Carlo. Trial t uses stream_seed(seed, t); results do not depend on threads.
/// Throws Cancelled when the cancel flag is raised.
TrialSummary run_margin_trials(const MarginProblem& problem, const SvmModel& ideal,
                               const TrialOptions& options);

/// Verdict of one summary against the campaign's thresholds, with the failing reasons.
struct Verdict {
  bool pass = false;
  std::vector<std::string> reasons;  ///< one line per failing point or figure
};
Verdict judge(const TrialSummary& summary, const CheckSettings& settings, int train_count);

/// Pairs per entry under an allocation strategy for a fixed total of detected pairs
/// (time = pairs / r, r the same for every setting):
///  uniform: equal pairs; neyman: pairs proportional to the single-pair sigma of the estimator
///  (sqrt(p(1-p))/V without accidentals; Neyman, J. R. Stat. Soc. 97 (1934) 558);
///  margin_aware: pairs proportional to sigma times the sensitivity of the decision function,
///  |a_i| + |a_j| on training entry (i, j) and |a_j| / max(|f0(t)|, 0.1 mean |f0|) on test entry
///  (t, j), plus a floor of 10% of the mean weight so no entry goes unmeasured.
/// Writes problem.pairs_train / pairs_test.
void allocate_pairs(MarginProblem& problem, Allocation strategy, const SvmModel& ideal,
                    double total_pairs);

/// Total detected pairs of the measure entries (upper triangle plus test block).
double total_pairs(const MarginProblem& problem);

struct BudgetSearchOptions {
  double low_pairs = 10.0;      ///< pairs per entry where the search starts
  double high_pairs = 1e9;      ///< give up above this
  double relative_step = 0.05;  ///< stop when high / low < 1 + this
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

/// Encoding scale scan: the scale advice of the margin check (README, user guide step 13).
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
  bool scan_scale = true;
  std::vector<double> scale_factors = {0.25, 0.5, 0.75, 1.0, 1.25, 1.5, 2.0};
  WorkHooks hooks;
};

struct MarginCheck {
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
/// (one class, no training points) and Cancelled when cancelled.
MarginCheck check_margin(const Campaign& campaign, const Plan& plan,
                         const MarginCheckOptions& options = {});

}  // namespace gramline
