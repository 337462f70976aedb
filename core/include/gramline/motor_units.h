#pragma once
// Motor units (docs/plan-files.md, "Motor units"): a controller that commands its motors in
// whole steps counted from a home position. A motor with steps_per_deg s and zero_offset_deg z
// goes to round((position_deg + z) x s) steps for a plate position position_deg; the plate's
// frame (range_deg, initial_deg, position_deg) stays as it is.
#include <cstdint>
#include <vector>

#include "gramline/plan.h"
#include "gramline/rig.h"

namespace gramline {

/// True when the motor is commanded in motor units (it has steps_per_deg).
bool has_motor_units(const Motor& motor);
/// True when any motor of the rig has motor units.
bool has_motor_units(const Rig& rig);

/// round((position_deg + zero_offset_deg) x steps_per_deg), halves away from zero. Only for a
/// motor with motor units.
std::int64_t motor_steps(const Motor& motor, double position_deg);
/// The plate position, in degrees, that `steps` motor units stand for: steps / steps_per_deg -
/// zero_offset_deg.
double position_from_motor_steps(const Motor& motor, std::int64_t steps);

/// `position_deg` (one per motor, rig order) with every motor that has motor units moved to the
/// plate position of its whole number of steps; the others unchanged.
std::vector<double> positions_at_whole_steps(const Rig& rig,
                                             const std::vector<double>& position_deg);

/// The kernel a step's plate positions realise with ideal plates (docs/conventions.md): the
/// product over photons of |<H| HWP(h_an) QWP(q_an) QWP(q_prep) HWP(h_prep) |H>|^2.
double kernel_at_positions(const Rig& rig, int photons, const std::vector<double>& position_deg);

/// Largest |kernel at whole-step positions - kernel at the planned positions| over the measure
/// steps (0 when no motor has motor units or there is no measure step).
double kernel_rounding_max(const Rig& rig, int photons, const std::vector<Step>& steps);

}  // namespace gramline
