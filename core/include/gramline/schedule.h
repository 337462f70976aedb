#pragma once
// Scheduler: the order of the measure steps, the motor positions of every step, reference,
// dark and park steps, and the night timeline (docs/motion-model.md, docs/plan-files.md).
#include <cstdint>
#include <string>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/plan.h"
#include "gramline/progress.h"
#include "gramline/waveplates.h"

namespace gramline {

/// Target angles of one point: per photon, the two discrete solutions of each stage.
struct PointTargets {
  std::vector<StageSolutions> prep;      ///< [photon]
  std::vector<StageSolutions> analysis;  ///< [photon]
};

/// One kernel entry to measure. `a` and `b` are global point indices (a < b for training
/// pairs; a = test point, b = training point for the test block). The orientation (which
/// point is prepared) is the scheduler's choice: the kernel is symmetric.
struct EntryRequest {
  int a = 0;
  int b = 0;
  Block block = Block::train;
  double kernel_ideal = 0.0;
  double p_pass = 0.0;
  double pairs = 0.0;
  double dwell_s = 0.0;
};

struct ScheduleInput {
  const Rig* rig = nullptr;
  std::vector<PointTargets> points;  ///< by global point index
  std::vector<EntryRequest> entries;
  int train_count = 0;
  double pair_detect_rate_per_s = 1.0;  ///< pairs / dwell_s, used when scaling pairs
  double reference_pairs = 0.0;         ///< pairs of one reference step
  /// true: reference_pairs scale with the entries' pairs when fitting to the nights (pairs
  /// chosen for a calibration share keep that share).
  bool reference_pairs_follow_scale = false;
  /// How error messages name the reference pairs: the campaign field, or where they came from.
  std::string reference_pairs_origin = "schedule.reference_pairs";
  double reference_p_pass = 1.0;  ///< p_pass of a diagonal setting (kernel 1)
  NightWindow nights;
  ScheduleSettings settings;
  /// Physical motor positions where the first step starts (rig.motors order); empty: the
  /// motors' initial_deg. Park steps always return to initial_deg.
  std::vector<double> start_positions_deg;
};

struct ScheduleOptions {
  std::uint64_t seed = 1;
  bool optimize_order = true;  ///< false: the row-by-row order
  WorkHooks hooks;
  /// Also the Held-Karp 1-tree bound (up to seconds on thousands of settings); false: only the
  /// per-entry bound, for a quick plan on every edit.
  bool tree_bound = true;
};

struct ScheduleResult {
  std::vector<Step> steps;
  /// Proven lower bound on the measure steps' total move time (docs/motion-model.md), seconds. It
  /// holds for every order of the same measure steps (any orientations and solutions, from the
  /// same start positions) in which at most as many measure steps as in this schedule are
  /// followed by a reference, dark or park step or end the plan; the argument is in
  /// schedule_bound.cpp.
  double move_lower_bound_s = 0.0;
  /// The Held-Karp 1-tree part of move_lower_bound_s (0 when the plan is too large for it); the
  /// reported bound is the larger of it and the per-entry bound.
  double move_tree_bound_s = 0.0;
  double bound_ms = 0.0;           ///< wall time spent on the lower bound, milliseconds
  double move_naive_s = 0.0;       ///< measure steps in row-by-row order, same model
  double truncation_cost_s = 0.0;  ///< extra move time of the truncation-safe order
  double pairs_scale = 1.0;        ///< factor applied to every entry's pairs (fit to nights)
  int nights = 0;
  bool fits = true;
  std::vector<NightUse> night_use;
  std::string report() const;
};

/// Orders the entries and lays the steps on the nights. Deterministic for a seed.
ScheduleResult build_schedule(const ScheduleInput& input, const ScheduleOptions& options);

/// Exact minimum total move time (seconds, docs/motion-model.md) of the measure steps alone, from
/// the start positions (ScheduleInput::start_positions_deg, else initial_deg), over every order,
/// orientation and choice of discrete solutions: Held-Karp dynamic programming over subsets of
/// entries. With continuous motors only angles modulo the plate period matter; with travel ranges
/// the states also hold every in-range equivalent position of each ranged motor, so the minimum
/// is over orders, orientations, solutions and commanded positions. For tests: at most 12
/// entries; time grows as 2^n S^2 with S the number of states (n 2^(2P+1) without ranges).
double exact_min_move_s(const ScheduleInput& input);

}  // namespace gramline
