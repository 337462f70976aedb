// The motor time model of docs/motion-model.md. Every move time in Gramline comes from here.
#include "gramline/motion.h"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace gramline {

double travel_time_s(double distance_deg, double speed_deg_per_s, double accel_deg_per_s2) {
  if (!(distance_deg > 0.0)) return 0.0;
  const double v = speed_deg_per_s;
  const double a = accel_deg_per_s2;
  // Trapezoidal profile when the motor reaches full speed, triangular otherwise.
  if (distance_deg >= v * v / a) return distance_deg / v + v / a;
  return 2.0 * std::sqrt(distance_deg / a);
}

double motor_move_s(const Motor& motor, double from_deg, double to_deg) {
  const double v = motor.speed_deg_per_s;
  const double a = motor.accel_deg_per_s2;
  if (motor.backlash == Backlash::shortest || to_deg >= from_deg) {
    return travel_time_s(std::abs(to_deg - from_deg), v, a);
  }
  // from-below: go o past the target (downward), then come back up by o.
  const double o = motor.overshoot_deg;
  return travel_time_s(from_deg - to_deg + o, v, a) + travel_time_s(o, v, a);
}

double combine_motor_times_s(const Controller& controller, const double* motor_times_s, int count,
                             bool any_moved) {
  double t = 0.0;
  for (int m = 0; m < count; ++m) {
    t = controller.moves == MoveMode::simultaneous ? std::max(t, motor_times_s[m])
                                                   : t + motor_times_s[m];
  }
  if (any_moved) t += controller.settle_s;
  return t + controller.overhead_s;
}

double step_move_s(const Rig& rig, const std::vector<double>& from_deg,
                   const std::vector<double>& to_deg) {
  const std::size_t n = rig.motors.size();
  if (from_deg.size() != n || to_deg.size() != n) {
    throw std::invalid_argument("step_move_s: one position per motor is required");
  }
  double times[64];
  std::vector<double> many;
  double* t = times;
  if (n > 64) {
    many.resize(n);
    t = many.data();
  }
  bool moved = false;
  for (std::size_t m = 0; m < n; ++m) {
    moved = moved || from_deg[m] != to_deg[m];
    t[m] = motor_move_s(rig.motors[m], from_deg[m], to_deg[m]);
  }
  return combine_motor_times_s(rig.controller, t, static_cast<int>(n), moved);
}

std::vector<double> equivalent_positions_deg(const Motor& motor, double target_deg,
                                             double near_deg) {
  const double period = motor_period_deg(motor);
  double lo = near_deg - period;
  double hi = near_deg + period;
  if (motor.range) {
    lo = motor.range->low_deg;
    hi = motor.range->high_deg;
  }
  const double k_lo = std::ceil((lo - target_deg) / period);
  const double k_hi = std::floor((hi - target_deg) / period);
  // Counted up front: stepping k one by one never ends where k + 1 == k (huge ranges).
  if (!(k_hi - k_lo < 1e6)) {
    throw std::invalid_argument("motor " + motor.name +
                                ": travel range too wide to list its equivalent positions");
  }
  std::vector<double> out;
  for (double k = k_lo; k <= k_hi; k += 1.0) out.push_back(target_deg + k * period);
  return out;
}

double nearest_equivalent_deg(const Motor& motor, double target_deg, double from_deg) {
  const double period = motor_period_deg(motor);
  if (!motor.range) {
    // The best position is the equivalent just below or just above the current one: any
    // other lies farther in both directions.
    // A target the motor already sits on (up to rounding of k period) is kept exactly, so an
    // unchanged setting never counts as a move.
    const double k = std::round((from_deg - target_deg) / period);
    if (std::abs(target_deg + k * period - from_deg) <= 1e-9) return from_deg;
    const double below = target_deg + std::floor((from_deg - target_deg) / period) * period;
    const double above = below + period;
    return motor_move_s(motor, from_deg, above) < motor_move_s(motor, from_deg, below) ? above
                                                                                       : below;
  }
  const double lo = motor.range->low_deg;
  const double hi = motor.range->high_deg;
  const double k = std::round((from_deg - target_deg) / period);
  if (std::abs(target_deg + k * period - from_deg) <= 1e-9 && from_deg >= lo && from_deg <= hi) {
    return from_deg;
  }
  const double k_lo = std::ceil((lo - target_deg) / period);
  const double k_hi = std::floor((hi - target_deg) / period);
  if (!(k_lo <= k_hi)) {
    throw std::invalid_argument("motor " + motor.name + ": no position equivalent to " +
                                std::to_string(target_deg) + " deg inside its travel range");
  }
  // Moving farther in one direction never takes less time (T grows with distance, and the
  // from-below penalty only depends on the direction), so the best position is the nearest
  // equivalent at or above the motor or the nearest below it, both clamped into the range.
  // Candidates are visited in ascending order: ties go to the lower position.
  const double k_here = std::floor((from_deg - target_deg) / period);
  double best = 0.0;
  double best_s = -1.0;
  for (double dk = -1.0; dk <= 2.0; dk += 1.0) {
    const double y = target_deg + std::clamp(k_here + dk, k_lo, k_hi) * period;
    const double s = motor_move_s(motor, from_deg, y);
    if (best_s < 0.0 || s < best_s) {
      best = y;
      best_s = s;
    }
  }
  return best;
}

}  // namespace gramline
