#pragma once
// Planning: settings, their order, their pairs and dwell times, and the night timeline.
#include <Eigen/Core>
#include <cstdint>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/entries.h"
#include "gramline/gram_error.h"
#include "gramline/progress.h"

namespace gramline {

enum class StepKind { measure, reference, dark, park };

/// One step of the schedule. Point indices are global (training first, then test), -1 if none.
struct Step {
  StepKind kind = StepKind::measure;
  Block block = Block::none;
  int prep_point = -1;
  int analysis_point = -1;
  std::vector<double> position_deg;  ///< physical position per motor (rig.motors order)
  double kernel_ideal = 0.0;
  /// The kernel the actual plates and PBS realise at position_deg (rig_kernel, plates.h);
  /// measure and reference steps only, 0 for the others.
  double kernel_rig = 0.0;
  double p_pass = 0.0;
  double pairs = 0.0;
  double dwell_s = 0.0;
  double move_s = 0.0;
  double start_s = 0.0;  ///< seconds from the start of the first night to the move's start
  int night = 1;
};

struct NightUse {
  int night = 1;
  double busy_s = 0.0;  ///< moving + counting in this night
  double move_s = 0.0;
  double integration_s = 0.0;  ///< measure steps' dwell
  double reference_s = 0.0;    ///< dwell of reference, dark and park steps (moves in move_s)
  double window_s = 0.0;
  double fill() const { return window_s > 0 ? busy_s / window_s : 0.0; }
};

/// One stage of one point whose state the actual plates cannot realise (compensation on).
struct UnreachableSetting {
  int point = 0;  ///< global index
  int photon = 0;
  Stage stage = Stage::prep;
  double kernel_error = 0.0;  ///< largest error of the photon's kernel factor it causes
};

struct PlanSummary {
  long settings = 0;
  long steps = 0;
  double pairs_total = 0.0;
  double integration_s = 0.0;  ///< dwell of measure steps
  double move_s = 0.0;         ///< move time of all steps
  /// dwell of reference, dark and park steps; integration_s + move_s + reference_s is the
  /// nights' busy time
  double reference_s = 0.0;
  double total_s = 0.0;  ///< end of the last step, from the start of night 1
  int nights = 0;
  double move_lower_bound_s = 0.0;  ///< proven lower bound, measure steps' moves
  double move_naive_s = 0.0;        ///< row-by-row order, same model
  double measure_move_s = 0.0;      ///< move time of measure steps only
  double gram_sigma_frobenius = 0.0;
  double epsilon_reached = 0.0;    ///< kernel half-width at the planned pairs (fit to nights)
  double truncation_cost_s = 0.0;  ///< extra move time of the truncation-safe order
  double plan_ms = 0.0;
  double bound_ms = 0.0;       ///< wall time of the move lower bound, not part of plan_ms
  double gram_error_ms = 0.0;  ///< wall time of the Gram-error simulation, not part of plan_ms
  bool fits = true;            ///< false when max_nights is not enough
  /// The reference calibration (docs/error-budget.md): reference steps and their pairs (the
  /// largest, if they differ), the interval asked for, the share of each entry's variance the
  /// planner aimed at (0 when the campaign fixes the pairs) and the largest share reached.
  long reference_steps = 0;
  double reference_pairs = 0.0;
  double reference_interval_min = 0.0;
  double calibration_share_target = 0.0;
  double calibration_share_max = 0.0;
  /// Plate imperfections (docs/conventions.md, "Real plates"): the largest |kernel_rig -
  /// kernel_ideal| over measure steps, its Frobenius norm over the training Gram matrix (both
  /// triangles), and the standard deviation the random axis offsets and repeatability add (the
  /// largest over measure steps, and the root mean square Frobenius norm over the training Gram
  /// matrix), to first order.
  double kernel_bias_max = 0.0;
  double kernel_bias_frobenius = 0.0;
  double kernel_spread_max = 0.0;
  double kernel_spread_frobenius = 0.0;
  double target_epsilon = 0.0;  ///< the campaign's target half-width, for the warning below
  /// True when the plate bias exceeds the target precision: more pairs cannot remove it.
  bool plate_bias_exceeds_target() const { return kernel_bias_max > target_epsilon; }
  std::vector<UnreachableSetting> unreachable;  ///< stages compensation could not realise
  std::vector<NightUse> night_use;
};

/// Where an interrupted campaign stands: what was measured and where the motors stopped.
struct ResumeState {
  /// Entries already measured, as pairs of global point indices in either order.
  std::vector<std::pair<int, int>> measured;
  /// Physical position of each motor (rig.motors order) when the run stopped, degrees.
  std::vector<double> start_positions_deg;
};

struct PlanOptions {
  std::uint64_t seed = 1;
  /// When set, plan only the entries not yet measured, starting from the given positions.
  const ResumeState* resume = nullptr;
  bool optimize_order = true;  ///< false: row-by-row order
  /// Compute the 1-tree move bound too (ScheduleOptions::tree_bound); the app plans without it
  /// on every edit and reports the quicker per-entry bound.
  bool tree_bound = true;
  /// Simulate the Gram error (estimate_gram_error) once the plan is made; false leaves only the
  /// quick figures of describe_gram_noise, for a later estimate_gram_error call.
  bool simulate_gram_error = true;
  WorkHooks hooks;
  /// Throws std::invalid_argument naming the first field that does not fit `campaign`.
  void validate(const Campaign& campaign) const;
};

struct Plan {
  /// The options it was planned with (hooks and resume pointer cleared); empty for a plan
  /// rebuilt from a steps file (plan_from_steps).
  std::optional<PlanOptions> options;
  std::vector<Step> steps;
  PlanSummary summary;
  Eigen::MatrixXd kernel_train;  ///< N x N ideal
  Eigen::MatrixXd kernel_test;   ///< M x N ideal
  Eigen::MatrixXd pairs_train;   ///< N x N planned pairs per entry (0 on the diagonal)
  Eigen::MatrixXd pairs_test;    ///< M x N
  /// N x N predicted sigma per entry (0 where not planned): counts and reference calibration
  Eigen::MatrixXd sigma_train;
  Eigen::MatrixXd sigma_test;  ///< M x N
  /// The calibration's part of sigma_train / sigma_test (added in quadrature; shared by the
  /// entries that use the same reference steps, see shared_noise_train).
  Eigen::MatrixXd calibration_sigma_train;
  Eigen::MatrixXd calibration_sigma_test;
  Eigen::MatrixXi step_of_train;  ///< N x N index of the step measuring each entry (-1: none)
  Eigen::MatrixXi step_of_test;   ///< M x N
  /// Noise components shared by several training entries (gram_error.h), beside sigma_train.
  std::vector<SharedNoiseComponent> shared_noise_train;
  GramError gram_error;
  /// Campaign::warnings at planning time (shown in the report and summary.json).
  std::vector<std::string> warnings;
  /// Human-readable summary (a few lines), as printed by the CLI.
  std::string report() const;
};

/// Plans the campaign. Throws std::invalid_argument naming the field for an invalid campaign.
Plan plan_campaign(const Campaign& campaign, const PlanOptions& options = {});

/// Simulates the error of the plan's training Gram matrix (predict_gram_error with sigma_train
/// and shared_noise_train) into plan.gram_error, and its wall time into
/// plan.summary.gram_error_ms. Throws Cancelled when the cancel flag is raised.
void estimate_gram_error(Plan& plan, const GramErrorOptions& options = {});

/// The plan's training Gram noise: each entry's independent part (its counts) and the shared
/// components of the reference calibration.
GramNoise plan_gram_noise(const Plan& plan);

/// One point of the Gram progress curve: after the training measure step ending at end_s, the
/// share of training entries measured and the Frobenius norm of the per-entry sigma of the
/// training Gram matrix if the run stopped there. An entry not yet measured counts with sigma
/// 1/2, the largest standard deviation of a value confined to [0, 1] (Popoviciu's inequality),
/// so the curve starts at sqrt(N(N-1))/2 and ends at summary.gram_sigma_frobenius.
struct GramProgressPoint {
  double end_s = 0.0;  ///< seconds from the first night's start
  double share_done = 0.0;
  double sigma_frobenius = 0.0;
  int night = 1;
};
/// The curve, starting with the point before any step (end_s = 0).
std::vector<GramProgressPoint> gram_progress(const Plan& plan);

/// Rebuilds a plan around steps read back from a steps file: the ideal kernels, the entry ->
/// step maps, each entry's pairs and predicted sigma at those pairs, the Gram error and the
/// summary totals that follow from the steps. Bound and naive figures are left at 0. Throws
/// std::invalid_argument for a step naming a point the data set does not have.
Plan plan_from_steps(const Campaign& campaign, std::vector<Step> steps);

/// Sets kernel_rig of every measure and reference step from its positions (rig_kernel,
/// plates.h) and the plate figures of the summary (kernel_bias_*, kernel_spread_*).
void fill_rig_kernels(const Campaign& campaign, Plan& plan);

/// Recomputes every step's move_s from positions alone (docs/motion-model.md); used by tests and
/// the resume path. Returns the total.
double recompute_moves(const Rig& rig, std::vector<Step>& steps);

std::string to_string(StepKind);
bool from_string(const std::string&, StepKind&);

}  // namespace gramline
