#pragma once
// Closed ranges for every physical parameter of a campaign (docs/parameter-ranges.md gives
// each with its reason). A value outside its range is refused with the field named, so that
// no input can drive a move time, a rate or a pair count to zero, infinity or NaN.
namespace gramline {

struct SaneRange {
  double low;
  double high;
  const char* unit;  ///< shown in messages, e.g. "deg/s"; empty for a plain number
};

namespace sane {
// Motors (docs/motion-model.md)
inline constexpr SaneRange speed_deg_per_s{0.01, 1e4, "deg/s"};
inline constexpr SaneRange accel_deg_per_s2{0.01, 1e5, "deg/s^2"};
inline constexpr SaneRange overshoot_deg{0.0, 90.0, "deg"};
inline constexpr SaneRange position_deg{-3600.0, 3600.0, "deg"};  ///< initial and range ends
// Controller
inline constexpr SaneRange settle_s{0.0, 60.0, "s"};
inline constexpr SaneRange overhead_s{0.0, 60.0, "s"};
// Source and detection (docs/conventions.md)
inline constexpr SaneRange pair_rate_per_s{1.0, 1e9, "1/s"};
inline constexpr SaneRange visibility{0.01, 1.0, ""};
inline constexpr SaneRange efficiency{1e-4, 1.0, ""};
inline constexpr SaneRange dark_rate_per_s{0.0, 1e7, "1/s"};
inline constexpr SaneRange coincidence_window_s{0.0, 1e-6, "s"};
// Precision target and schedule
inline constexpr SaneRange epsilon{1e-4, 0.5, ""};
inline constexpr SaneRange confidence{0.5, 0.99999, ""};
inline constexpr SaneRange pairs{0.0, 1e12, "pairs"};  ///< fixed_pairs, reference_pairs
inline constexpr SaneRange dark_dwell_s{0.0, 3600.0, "s"};
inline constexpr SaneRange reference_interval_min{0.0, 1440.0, "min"};
inline constexpr SaneRange optimizer_time_cap_s{0.0, 3600.0, "s"};
// Encoding: every Bloch angle a point maps to, and the SVM soft-margin parameter
inline constexpr SaneRange bloch_angle_deg{-1e6, 1e6, "deg"};
inline constexpr SaneRange svm_C{0.0, 1e6, ""};  ///< 0 or below: chosen by cross-validation
}  // namespace sane

}  // namespace gramline
