#pragma once
// The adaptive campaign: after a night's counts, what the measured kernel says about the test
// decisions (are they stable enough to stop?), which entries still move them, and how the
// remaining pairs are best spent (docs/adaptive.md).
#include <Eigen/Core>
#include <cstdint>
#include <string>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/entries.h"
#include "gramline/ingest.h"
#include "gramline/margin.h"
#include "gramline/progress.h"
#include "gramline/svm.h"

namespace gramline {

/// What the counts so far say about the kernel. Entries are unitless kernel values; NaN marks
/// an entry not measured yet, whose sigma is then ignored.
struct KernelBelief {
  Eigen::MatrixXd train_value;  ///< N x N, symmetric, unit diagonal
  Eigen::MatrixXd train_sigma;  ///< N x N standard deviation of each measured entry
  Eigen::MatrixXd test_value;   ///< M x N
  Eigen::MatrixXd test_sigma;   ///< M x N

  int train_count() const { return static_cast<int>(train_value.rows()); }
  int test_count() const { return static_cast<int>(test_value.rows()); }
  /// Off-diagonal training entries (i < j) and test entries without a value.
  int unmeasured_entries() const;
  /// The best single kernel: measured values, 1/2 (the middle of [0, 1]) where unmeasured.
  void point_estimate(Eigen::MatrixXd& train, Eigen::MatrixXd& test) const;
  /// One kernel consistent with the counts: measured entries value + sigma z (z standard
  /// normal), unmeasured entries uniform on [0, 1] (nothing is known but the kernel's range).
  /// Entry e (training upper triangle row by row, then the test block row by row) draws from
  /// stream_seed(trial_seed, e).
  void draw(std::uint64_t trial_seed, Eigen::MatrixXd& train, Eigen::MatrixXd& test) const;
  /// Throws std::invalid_argument naming the first inconsistent matrix.
  void validate() const;
};

struct StopRuleOptions {
  int trials = 400;  ///< kernels drawn from the belief
  std::uint64_t seed = 1;
  int threads = 0;  ///< 0: all cores
  double confidence = 0.95;
  bool keep_unit_diagonal = true;  ///< of the PSD repair
  double C = 1.0;                  ///< the classifier's soft-margin parameter (> 0)
  double flip_threshold = 0.01;    ///< largest allowed per-test-point flip probability
  double margin_ratio_threshold = 0.9;
  bool influence = true;  ///< also estimate each entry's influence (EntryInfluence)
  WorkHooks hooks;
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

/// Derivatives of a trained C-SVC's test decisions f_t = sum_k a_k K(t, k) + b with respect to
/// single kernel entries, the support set held fixed. A test entry K(t, j) moves only f_t, by
/// a_j. A training entry K(i, j) = K(j, i) moves the free support vectors' dual coefficients and
/// b through their KKT equations sum_k a_k K(r, k) + b = y_r (r free), sum_k a_k = 0
/// (implicit differentiation; the equations as in Chang & Lin, ACM TIST 2 (2011) 27).
class DecisionDerivatives {
 public:
  DecisionDerivatives(const SvmModel& model, const Eigen::MatrixXd& train,
                      const Eigen::MatrixXd& test);
  /// df_t / dK(i, j) for every test point t (M values), i != j training indices.
  Eigen::VectorXd train_entry(int i, int j) const;
  /// df_t / dK(t, j): a_j (only test point t moves).
  double test_entry(int j) const { return dual_coef_[j]; }
  /// Training indices whose coefficient is free (0 < |a| < C).
  const std::vector<int>& free_support() const { return free_; }
  bool is_free(int k) const { return free_slot_[k] >= 0; }

 private:
  Eigen::VectorXd dual_coef_;
  std::vector<int> free_;
  std::vector<int> free_slot_;  ///< N entries: position in free_, or -1
  Eigen::MatrixXd z_;           ///< (|free| + 1) x M: A^-1 [K(t, free); 1]
};

/// How much one entry's remaining uncertainty moves the test decisions.
struct EntryInfluence {
  Eigen::MatrixXd train;  ///< N x N (upper triangle used)
  Eigen::MatrixXd test;   ///< M x N
};

struct StopRuleResult {
  bool stop = false;                ///< every decision stable: the campaign can end
  TrialSummary trials;              ///< flips and margin ratio against the best-estimate classifier
  std::vector<int> holding_points;  ///< test indices whose flip probability is above threshold
  std::vector<std::string> reasons;  ///< why the campaign is not done (empty when stop)
  int unmeasured_entries = 0;
  /// Per-entry weight w_e = sqrt(mean over draws of sum_t (df_t/dK_e)^2 / max(|f_t|, f_floor)^2)
  /// (DecisionDerivatives of each draw's retrained classifier), f_t the best-estimate decision,
  /// f_floor a tenth of the mean |f|. Empty without test points or above influence_limit.
  EntryInfluence influence;
  StopRuleOptions options;  ///< as run (hooks cleared)
  std::string report() const;
};

/// The stop rule: kernels drawn from `belief`, PSD repair, retraining; the campaign is done when
/// every test point's flip probability (against the classifier on the point estimate) is at most
/// flip_threshold and the median margin ratio at least margin_ratio_threshold. Without test
/// points only the margin ratio decides. Deterministic for a seed whatever the threads.
StopRuleResult evaluate_stop_rule(const KernelBelief& belief, const Eigen::VectorXi& train_labels,
                                  const Eigen::VectorXi& test_labels,
                                  const StopRuleOptions& options);

/// The belief an ingest gives: its measured kernel and sigma (NaN where not measured).
KernelBelief belief_from_ingest(const IngestResult& ingest);

/// The stop rule with the campaign's thresholds, PSD-repair rule and seed, at soft-margin `C`,
/// without the influence estimate (what ingest reports).
StopRuleResult campaign_stop_rule(const Campaign& campaign, const IngestResult& ingest, double C,
                                  const WorkHooks& hooks = {});

/// Largest draws x free support vectors x training points x test points the influence
/// estimate does (a few seconds).
inline constexpr double influence_limit = 2e10;

/// Sharing `remaining_pairs` among entries given what each already has: the pairs that minimise
/// sum_e w_e^2 s_e^2 / n_e for a fixed total (n_e proportional to w_e s_e: the Lagrange solution
/// behind Neyman allocation, Neyman, J. R. Stat. Soc. 97 (1934) 558), with entries that already
/// hold more than their share left as they are (water-filling). `done` and `weight` are per
/// entry; `unit_sigma` is each entry's estimator sigma at one pair (entry_sigma at n = 1).
/// Returns the pairs to add to each entry; they sum to remaining_pairs.
std::vector<double> top_up_pairs(const std::vector<double>& done, const std::vector<double>& weight,
                                 const std::vector<double>& unit_sigma, double remaining_pairs);

}  // namespace gramline
