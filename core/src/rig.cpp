#include "gramline/rig.h"

#include <cmath>
#include <sstream>

#include "gramline/enum_names.h"
#include "gramline/field_check.h"

namespace gramline {

double Motor::retardance_deg() const {
  return (plate == Plate::HWP ? 180.0 : 90.0) + retardance_error_deg;
}

double motor_period_deg(const Motor& motor) {
  return motor.plate == Plate::HWP && motor.retardance_error_deg == 0.0 ? 90.0 : 180.0;
}

int Rig::motor_index(int photon, Stage stage, Plate plate) const {
  for (size_t m = 0; m < motors.size(); ++m) {
    const Motor& mo = motors[m];
    if (mo.photon == photon && mo.stage == stage && mo.plate == plate) return static_cast<int>(m);
  }
  return -1;
}

std::string Rig::check(int photons) const {
  std::ostringstream err;
  for (size_t m = 0; m < motors.size(); ++m) {
    const Motor& mo = motors[m];
    const std::string where = "rig.motors[" + std::to_string(m) + "]";
    if (mo.name.empty()) return where + ".name: empty";
    for (size_t k = 0; k < m; ++k)
      if (motors[k].name == mo.name) return where + ".name: '" + mo.name + "' used twice";
    if (mo.photon < 0 || mo.photon >= photons) {
      err << where << ".photon: " << mo.photon << " but the encoding has " << photons
          << " photon(s)";
      return err.str();
    }
    // Sane ranges (docs/parameter-ranges.md): no move time may become 0, infinite or NaN.
    FieldCheck motor(where);
    motor.within("speed_deg_per_s", mo.speed_deg_per_s, sane::speed_deg_per_s)
        .within("accel_deg_per_s2", mo.accel_deg_per_s2, sane::accel_deg_per_s2)
        .within("overshoot_deg", mo.overshoot_deg, sane::overshoot_deg)
        .within("initial_deg", mo.initial_deg, sane::position_deg);
    if (mo.range) {
      motor.within("range_deg[0]", mo.range->low_deg, sane::position_deg)
          .within("range_deg[1]", mo.range->high_deg, sane::position_deg);
    }
    if (!motor.ok()) return motor.message();
    // Sane ranges of the imperfections (docs/conventions.md): a plate more than 30 degrees off
    // its nominal retardance, a zero known to worse than 5 degrees or a motor scattering by
    // more than 1 degree is a different instrument, and almost surely a typing error.
    if (!(std::abs(mo.retardance_error_deg) <= 30.0))
      return where + ".retardance_error_deg: must be within -30..30 deg";
    if (!(mo.axis_offset_sd_deg >= 0.0 && mo.axis_offset_sd_deg <= 5.0))
      return where + ".axis_offset_sd_deg: must be within 0..5 deg";
    if (!(mo.repeatability_sd_deg >= 0.0 && mo.repeatability_sd_deg <= 1.0))
      return where + ".repeatability_sd_deg: must be within 0..1 deg";
    if (mo.steps_per_deg && !(*mo.steps_per_deg > 0 && *mo.steps_per_deg <= 1e9))
      return where + ".steps_per_deg: must be positive and at most 1e9";
    if (!(std::abs(mo.zero_offset_deg) <= 1e6))
      return where + ".zero_offset_deg: must be a finite number of degrees (at most 1e6 in size)";
    if (mo.range) {
      const double period = motor_period_deg(mo);
      if (!(mo.range->high_deg - mo.range->low_deg >= period)) {
        err << where << ".range_deg: spans " << mo.range->high_deg - mo.range->low_deg
            << " deg, less than the plate period " << period << " deg";
        return err.str();
      }
      if (mo.initial_deg < mo.range->low_deg || mo.initial_deg > mo.range->high_deg)
        return where + ".initial_deg: outside range_deg";
      if (mo.backlash == Backlash::from_below &&
          mo.range->low_deg + mo.overshoot_deg > mo.range->high_deg - period)
        return where + ".overshoot_deg: leaves no room inside range_deg";
    }
  }
  for (int p = 0; p < photons; ++p) {
    for (Stage s : {Stage::prep, Stage::analysis}) {
      for (Plate pl : {Plate::HWP, Plate::QWP}) {
        if (motor_index(p, s, pl) < 0) {
          err << "rig.motors: no " << to_string(pl) << " on the " << to_string(s)
              << " stage of photon " << p;
          return err.str();
        }
      }
    }
  }
  if (static_cast<int>(motors.size()) != 4 * photons) {
    err << "rig.motors: " << motors.size() << " motors; expected 4 per photon (" << 4 * photons
        << ")";
    return err.str();
  }
  if (static_cast<int>(detectors.size()) != photons) {
    err << "rig.detectors: " << detectors.size() << " detectors; expected one per photon ("
        << photons << ")";
    return err.str();
  }
  for (size_t d = 0; d < detectors.size(); ++d) {
    FieldCheck detector("rig.detectors[" + std::to_string(d) + "]");
    detector.within("efficiency", detectors[d].efficiency, sane::efficiency)
        .within("dark_rate_per_s", detectors[d].dark_rate_per_s, sane::dark_rate_per_s);
    if (!detector.ok()) return detector.message();
    if (!(detectors[d].pbs_leakage >= 0.0 && detectors[d].pbs_leakage < 0.5))
      return "rig.detectors[" + std::to_string(d) + "].pbs_leakage: must be in [0, 0.5)";
  }
  FieldCheck rest("rig");
  rest.within("source.pair_rate_per_s", source.pair_rate_per_s, sane::pair_rate_per_s)
      .within("source.visibility", source.visibility, sane::visibility)
      .within("coincidence_window_s", coincidence_window_s, sane::coincidence_window_s)
      .within("controller.settle_s", controller.settle_s, sane::settle_s)
      .within("controller.overhead_s", controller.overhead_s, sane::overhead_s);
  return rest.message();
}

namespace {
constexpr EnumNames<Stage, 2> kStageNames{{{Stage::prep, "prep"}, {Stage::analysis, "analysis"}}};
constexpr EnumNames<Plate, 2> kPlateNames{{{Plate::HWP, "HWP"}, {Plate::QWP, "QWP"}}};
constexpr EnumNames<Backlash, 2> kBacklashNames{
    {{Backlash::shortest, "shortest"}, {Backlash::from_below, "from-below"}}};
constexpr EnumNames<MoveMode, 2> kMoveModeNames{
    {{MoveMode::simultaneous, "simultaneous"}, {MoveMode::sequential, "sequential"}}};
constexpr EnumNames<DetectionScheme, 2> kSchemeNames{
    {{DetectionScheme::pass_only, "pass-only"}, {DetectionScheme::both_ports, "both-ports"}}};
}  // namespace

std::string to_string(Stage v) { return enum_text(kStageNames, v); }
std::string to_string(Plate v) { return enum_text(kPlateNames, v); }
std::string to_string(Backlash v) { return enum_text(kBacklashNames, v); }
std::string to_string(MoveMode v) { return enum_text(kMoveModeNames, v); }
std::string to_string(DetectionScheme v) { return enum_text(kSchemeNames, v); }
bool from_string(const std::string& t, Stage& o) { return enum_from_text(kStageNames, t, o); }
bool from_string(const std::string& t, Plate& o) { return enum_from_text(kPlateNames, t, o); }
bool from_string(const std::string& t, Backlash& o) { return enum_from_text(kBacklashNames, t, o); }
bool from_string(const std::string& t, MoveMode& o) { return enum_from_text(kMoveModeNames, t, o); }
bool from_string(const std::string& t, DetectionScheme& o) {
  return enum_from_text(kSchemeNames, t, o);
}

}  // namespace gramline
