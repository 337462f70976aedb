#pragma once
// The motor time model of docs/motion-model.md. One formula, one place: every move time anywhere
// in Gramline is computed by these functions.
#include <vector>

#include "gramline/rig.h"

namespace gramline {

/// T(d) = d/v + v/a if d >= v^2/a, else 2 sqrt(d/a); T(0) = 0. Seconds; d in degrees >= 0.
double travel_time_s(double distance_deg, double speed_deg_per_s, double accel_deg_per_s2);

/// Time for one motor to go from physical position x to y (degrees), honouring its backlash
/// policy (`from-below`: y >= x takes T(y - x), else T(x - y + o) + T(o)).
double motor_move_s(const Motor& motor, double from_deg, double to_deg);

/// Step move time: max (simultaneous) or sum (sequential) of motor times, plus settle_s if any
/// motor moved, plus overhead_s. `from` and `to` hold one physical position per motor.
double step_move_s(const Rig& rig, const std::vector<double>& from_deg,
                   const std::vector<double>& to_deg);

/// Combines per-motor times into a step time (max or sum, settle, overhead). `any_moved` says
/// whether any motor changed position.
double combine_motor_times_s(const Controller& controller, const double* motor_times_s, int count,
                             bool any_moved);

/// Physical positions equivalent to `target_deg` (target + k motor_period_deg, rig.h) inside the
/// motor's range, within one period either side of `near_deg` for continuous motors. Sorted
/// ascending.
std::vector<double> equivalent_positions_deg(const Motor& motor, double target_deg,
                                             double near_deg);

/// The physical position equivalent to `target_deg` (inside the range, if any) that the motor
/// reaches fastest from `from_deg` under motor_move_s; ties go to the lower position. Throws
/// std::invalid_argument when the range holds no equivalent position.
double nearest_equivalent_deg(const Motor& motor, double target_deg, double from_deg);

}  // namespace gramline
