#pragma once
// Angle units. Degrees at every boundary; radians only inside formulas, converted here.
#include <numbers>

namespace gramline {

/// Degrees to radians.
constexpr double deg_to_rad(double deg) { return deg * std::numbers::pi / 180.0; }
/// Radians to degrees.
constexpr double rad_to_deg(double rad) { return rad * 180.0 / std::numbers::pi; }

/// Wraps an angle in degrees into [0, period_deg).
double wrap_deg(double angle_deg, double period_deg);

}  // namespace gramline
