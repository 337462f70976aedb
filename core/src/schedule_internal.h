#pragma once
// Private pieces of the scheduler shared by its source files (schedule_*.cpp).
#include <cstddef>
#include <cstdint>
#include <vector>

#include "gramline/motion.h"
#include "gramline/schedule.h"

namespace gramline::sched {

/// Photons the scheduler handles: two groups each, so a joint solution mask of all groups fits
/// in one byte.
constexpr int kMaxPhotons = 4;

/// A measure setting in an order: entry index times two, plus 1 when the entry is measured
/// the other way round (prepare b, analyse a).
using Code = std::uint32_t;
inline Code make_code(int entry, bool flipped) {
  return static_cast<Code>(entry) * 2u + (flipped ? 1u : 0u);
}
inline int code_entry(Code c) { return static_cast<int>(c >> 1); }
inline bool code_flipped(Code c) { return (c & 1u) != 0; }

/// Commanded positions along an order: one joint solution mask per step, and for every ranged
/// motor its physical position ([step * motors + motor]; NaN for continuous motors, which go to
/// the nearest equivalent of their solution's angle).
struct RangedPlan {
  std::vector<std::uint8_t> solutions;
  std::vector<double> positions_deg;
};

/// Side 0 holds the preparation motors, side 1 the analysis motors. A group is one stage of
/// one photon (an HWP and a QWP that share one discrete solution): group g = side * P + photon.
class MoveModel {
 public:
  explicit MoveModel(const ScheduleInput& input);

  const ScheduleInput& input() const { return *input_; }
  const Rig& rig() const { return *input_->rig; }
  int photons() const { return photons_; }
  int groups() const { return 2 * photons_; }
  int points() const { return static_cast<int>(input_->points.size()); }
  int hwp_motor(int group) const { return hwp_[group]; }
  int qwp_motor(int group) const { return qwp_[group]; }

  int prep_point(Code c) const;
  int analysis_point(Code c) const;
  /// Point a group of this setting targets.
  int group_point(Code c, int group) const {
    return group < photons_ ? prep_point(c) : analysis_point(c);
  }
  /// Canonical angles of `point`'s solution `sol` for a group.
  const PlatePair& target(int point, int group, int sol) const;

  /// Max (simultaneous) or sum (sequential) of two motor-time parts.
  double join(double x, double y) const { return simultaneous_ ? (x > y ? x : y) : x + y; }
  /// Step time from the joined motor time: settle when anything moved, overhead always.
  double step_s(double motor_part_s) const {
    return overhead_s_ + (motor_part_s > 0.0 ? motor_part_s + settle_s_ : 0.0);
  }

  /// Time of one motor between two angles taken modulo the plate period (docs/motion-model.md).
  /// Exact for a continuously rotating motor (it may stop at any equivalent position); a lower
  /// bound for a motor with a travel range, whose choice of positions is smaller.
  double motor_angle_s(int motor, double from_deg, double to_deg) const;
  /// Joined time of a group's two motors between two plate pairs (angle model above).
  double group_s(int group, const PlatePair& from, const PlatePair& to) const;
  /// Joined time of a group from physical motor positions (one per rig motor).
  double group_from_s(int group, const std::vector<double>& from_deg, const PlatePair& to) const;
  /// Where the first step starts: ScheduleInput::start_positions_deg, or initial_deg.
  const std::vector<double>& start_deg() const { return start_deg_; }
  /// Where a park step leaves the motors: every motor's initial_deg.
  const std::vector<double>& park_deg() const { return park_deg_; }

  /// Lower bound on the joined motor time of one side when its point changes i -> j: each
  /// group takes its best pair of solutions (valid because groups choose independently).
  double side_s(int side, int from_point, int to_point) const;
  double side_from_s(int side, const std::vector<double>& from_deg, int to_point) const;

 private:
  const ScheduleInput* input_;
  int photons_ = 0;
  bool simultaneous_ = true;
  double settle_s_ = 0.0;
  double overhead_s_ = 0.0;
  std::vector<int> hwp_, qwp_;
  std::vector<double> start_deg_, park_deg_;
};

/// Dense point-to-point side costs (motor part only), lower bounds as in MoveModel::side_s.
struct SideCosts {
  int n = 0;
  std::vector<float> cost[2];   ///< [side][from * n + to]
  std::vector<float> start[2];  ///< [side][to]: from the start positions
  std::vector<float> park[2];   ///< [side][to]: from the park (initial) positions
  double at(int side, int from, int to) const { return cost[side][std::size_t(from) * n + to]; }
};
SideCosts compute_side_costs(const MoveModel& model);

/// Relaxed step time between two settings (solutions chosen freely at both ends): a lower
/// bound on the true step time that is exact for continuous motors when the solutions agree.
double relaxed_step_s(const MoveModel& model, const SideCosts& costs, Code from, Code to);
double relaxed_first_step_s(const MoveModel& model, const SideCosts& costs, Code to);
double relaxed_order_s(const MoveModel& model, const SideCosts& costs,
                       const std::vector<Code>& order);

/// Best choice of discrete solutions along a fixed order (dynamic programming over the joint
/// solution of all groups, from the start positions). Returns the total measure move time
/// under the angle model, exact for continuous motors; `solutions_out` gets one bit mask per
/// step (bit g: solution of group g). At most 2 kMaxPhotons groups.
double choose_solutions(const MoveModel& model, const std::vector<Code>& order,
                        std::vector<std::uint8_t>* solutions_out);

/// The row-by-row order: training pairs (0,1), (0,2), ..., (1,2), ..., then the test rows.
std::vector<Code> naive_order(const ScheduleInput& input);

/// Structured order plus local search. `truncation_safe`: training pairs grow the Gram matrix
/// point by point.
std::vector<Code> optimized_order(const MoveModel& model, const SideCosts& costs,
                                  bool truncation_safe, const ScheduleOptions& options);

/// Per-entry terms of the lower bound (schedule_bound.cpp states the argument): the cheapest
/// move into the entry's setting, and the cheapest move in plus move out through it with two
/// different neighbours; both over the better orientation, seconds.
struct BoundTerms {
  std::vector<double> in_min_s;
  std::vector<double> pair_min_s;
};
BoundTerms bound_terms(const MoveModel& model, const SideCosts& costs);

/// Proven lower bound on the measure steps' total move time for any order of them in which
/// at most `breaks` measure steps are followed by a non-measure step or end the plan.
double measure_lower_bound_s(const BoundTerms& terms, long breaks);

/// Settings up to which the 1-tree bound is computed (a dense K x K weight table).
constexpr int kTreeBoundMaxSettings = 3000;

/// Held-Karp 1-tree Lagrangian bound on the measure move time of any order with at most
/// `breaks` runs (argument in schedule_bound.cpp); `upper_s`, the plan's own figure, sets the
/// subgradient steps. 0 when there are more than kTreeBoundMaxSettings settings.
double tree_lower_bound_s(const MoveModel& model, const SideCosts& costs, const BoundTerms& terms,
                          long breaks, double upper_s, const WorkHooks& hooks);

/// Held-Karp dynamic programming over subsets of entries (at most 12): the minimum measure move
/// time under the angle model from the start positions, and (when `order_out` is given) an
/// order reaching it. exact_work estimates its inner-loop count, 2^n S^2.
double exact_order(const MoveModel& model, std::vector<Code>* order_out);
double exact_work(const MoveModel& model);

/// Physical positions along an order from the start positions: each group takes the solution given
/// (or, when `solutions` is empty, the one it reaches fastest), each motor the nearest equivalent.
/// Returns the total move time under step_move_s.
/// `planned_deg` (RangedPlan::positions_deg, may be empty) overrides the ranged motors.
double realized_order_s(const MoveModel& model, const std::vector<Code>& order,
                        const std::vector<std::uint8_t>& solutions,
                        const std::vector<double>& planned_deg = {});

/// Positions of measure step k of an order: place_group for every group with the step's solution,
/// then the planned position of every ranged motor, if any.
void place_measure_step(const MoveModel& model, Code code, std::size_t k,
                        const std::vector<std::uint8_t>& solutions,
                        const std::vector<double>& planned_deg, std::vector<double>& positions);

/// Solutions and ranged positions for an order: choose_solutions, then, on ranged rigs, the best
/// of nearest placement, place_ranged_motors and (when affordable) ConfigModel::order_s, judged by
/// the commanded positions' move time. Returns that move time.
double plan_positions(const MoveModel& model, const std::vector<Code>& order, RangedPlan& plan);

/// Moves one group's motors to `point`'s solution `sol` (or the faster of the two when
/// sol < 0), nearest equivalent positions. Updates `positions` in place.
void place_group(const MoveModel& model, int group, int point, int sol,
                 std::vector<double>& positions);

/// True when any scheduled motor has a travel range.
bool has_ranged_motor(const MoveModel& model);

/// Configurations of a setting for ranged rigs (schedule_ranged.cpp): per side, every choice of
/// one solution per group and one in-range equivalent position per ranged motor (a continuous
/// motor keeps its canonical angle). Costs between configurations are the true step times of
/// the commanded positions (continuous motors: the angle model, exact for them).
class ConfigModel {
 public:
  struct SideConfigs {
    std::size_t count = 0;
    int width = 0;                    ///< motors of the side: hwp, qwp per photon
    std::vector<double> positions;    ///< [config * width + motor]
    std::vector<std::uint8_t> masks;  ///< solution bits of the side's groups
    const double* at(std::size_t i) const { return positions.data() + i * width; }
  };
  explicit ConfigModel(const MoveModel& model);
  /// Materialised on first use; call only when side_count is modest.
  const SideConfigs& side(int side, int point) const;
  /// Number of configurations, counted without listing them.
  double side_count(int side, int point) const;
  double configs(Code c) const;
  double side_move_s(int side, const double* from, const double* to) const;
  double side_from_s(int side, const std::vector<double>& from_deg, const double* to) const;
  /// Least measure move time along a fixed order over every configuration of every step (dynamic
  /// programming); `plan_out` gets the configurations reaching it.
  double order_s(const std::vector<Code>& order, RangedPlan* plan_out) const;
  /// Inner-loop count of order_s.
  double order_work(const std::vector<Code>& order) const;

 private:
  double motor_s(int motor, double from_deg, double to_deg) const;
  const MoveModel* model_;
  std::vector<int> motors_[2];
  mutable std::vector<SideConfigs> cache_[2];
};

/// Ranged motors along a fixed order and fixed solutions: each motor's in-range positions by a
/// shortest path through its layers of equivalent positions (least total travel time of that
/// motor). For large orders, where ConfigModel::order_s is too expensive.
void place_ranged_motors(const MoveModel& model, const std::vector<Code>& order,
                         const std::vector<std::uint8_t>& solutions, RangedPlan& plan);

/// Held-Karp over subsets of entries with configurations as states: the exact minimum measure
/// move time over orders, orientations, solutions and in-range positions (at most 12 entries).
double exact_ranged_order(const MoveModel& model, const ConfigModel& configs,
                          std::vector<Code>* order_out);
double exact_ranged_work(const MoveModel& model, const ConfigModel& configs);

}  // namespace gramline::sched
