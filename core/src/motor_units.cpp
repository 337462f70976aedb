#include "gramline/motor_units.h"

#include <algorithm>
#include <cmath>

#include "gramline/jones.h"

namespace gramline {

bool has_motor_units(const Motor& motor) { return motor.steps_per_deg.has_value(); }

bool has_motor_units(const Rig& rig) {
  return std::any_of(rig.motors.begin(), rig.motors.end(),
                     [](const Motor& m) { return has_motor_units(m); });
}

std::int64_t motor_steps(const Motor& motor, double position_deg) {
  return static_cast<std::int64_t>(
      std::llround((position_deg + motor.zero_offset_deg) * motor.steps_per_deg.value()));
}

double position_from_motor_steps(const Motor& motor, std::int64_t steps) {
  return static_cast<double>(steps) / motor.steps_per_deg.value() - motor.zero_offset_deg;
}

std::vector<double> positions_at_whole_steps(const Rig& rig,
                                             const std::vector<double>& position_deg) {
  std::vector<double> out = position_deg;
  for (size_t m = 0; m < rig.motors.size() && m < out.size(); ++m) {
    const Motor& motor = rig.motors[m];
    if (has_motor_units(motor))
      out[m] = position_from_motor_steps(motor, motor_steps(motor, out[m]));
  }
  return out;
}

double kernel_at_positions(const Rig& rig, int photons, const std::vector<double>& position_deg) {
  double kernel = 1.0;
  for (int p = 0; p < photons; ++p) {
    auto at = [&](Stage stage, Plate plate) {
      return position_deg.at(static_cast<size_t>(rig.motor_index(p, stage, plate)));
    };
    const JonesVector prepared =
        prepared_state(at(Stage::prep, Plate::HWP), at(Stage::prep, Plate::QWP));
    kernel *= analysis_pass_probability(at(Stage::analysis, Plate::QWP),
                                        at(Stage::analysis, Plate::HWP), prepared);
  }
  return kernel;
}

double kernel_rounding_max(const Rig& rig, int photons, const std::vector<Step>& steps) {
  if (!has_motor_units(rig)) return 0.0;
  double worst = 0.0;
  for (const Step& s : steps) {
    if (s.kind != StepKind::measure) continue;
    const double planned = kernel_at_positions(rig, photons, s.position_deg);
    const double rounded =
        kernel_at_positions(rig, photons, positions_at_whole_steps(rig, s.position_deg));
    worst = std::max(worst, std::abs(rounded - planned));
  }
  return worst;
}

}  // namespace gramline
