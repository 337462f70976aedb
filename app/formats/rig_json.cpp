#include "formats/rig_json.h"

#include <QJsonArray>

namespace gramline::formats {

QJsonObject motor_to_json(const Motor& m) {
  QJsonValue range = QJsonValue::Null;
  if (m.range) range = QJsonArray{m.range->low_deg, m.range->high_deg};
  QJsonObject o{{"name", QString::fromStdString(m.name)},
                {"photon", m.photon},
                {"stage", QString::fromStdString(to_string(m.stage))},
                {"plate", QString::fromStdString(to_string(m.plate))},
                {"speed_deg_per_s", m.speed_deg_per_s},
                {"accel_deg_per_s2", m.accel_deg_per_s2},
                {"range_deg", range},
                {"backlash", QString::fromStdString(to_string(m.backlash))},
                {"overshoot_deg", m.overshoot_deg},
                {"initial_deg", m.initial_deg},
                {"retardance_error_deg", m.retardance_error_deg},
                {"axis_offset_sd_deg", m.axis_offset_sd_deg},
                {"repeatability_sd_deg", m.repeatability_sd_deg}};
  // Motor units (docs/plan-files.md): written only when used, so files without them stay as
  // they were.
  if (m.steps_per_deg) o["steps_per_deg"] = *m.steps_per_deg;
  if (m.steps_per_deg || m.zero_offset_deg != 0.0) o["zero_offset_deg"] = m.zero_offset_deg;
  return o;
}

Motor motor_from_json(const JsonField& m) {
  Motor motor;
  motor.name = m["name"].text();
  motor.photon = static_cast<int>(m["photon"].integer(0, 3));
  motor.stage = m["stage"].choice({Stage::prep, Stage::analysis});
  motor.plate = m["plate"].choice({Plate::HWP, Plate::QWP});
  motor.speed_deg_per_s = m["speed_deg_per_s"].number();
  motor.accel_deg_per_s2 = m["accel_deg_per_s2"].number();
  const JsonField range = m["range_deg"];
  if (!range.is_null()) {
    const std::vector<double> lo_hi = range.numbers(2);
    motor.range = TravelRange{lo_hi[0], lo_hi[1]};
  }
  motor.backlash = m["backlash"].choice({Backlash::shortest, Backlash::from_below});
  motor.overshoot_deg = m["overshoot_deg"].number();
  motor.initial_deg = m["initial_deg"].number();
  // Plate imperfections: optional, 0 when absent (docs/plan-files.md).
  if (m.has("retardance_error_deg"))
    motor.retardance_error_deg = m["retardance_error_deg"].number();
  if (m.has("axis_offset_sd_deg")) motor.axis_offset_sd_deg = m["axis_offset_sd_deg"].number();
  if (m.has("repeatability_sd_deg"))
    motor.repeatability_sd_deg = m["repeatability_sd_deg"].number();
  // Optional motor units (docs/plan-files.md): no steps_per_deg, no step column; offset 0.
  // Their limits are checked with the rest of the rig (Rig::check).
  if (m.has("steps_per_deg") && !m["steps_per_deg"].is_null())
    motor.steps_per_deg = m["steps_per_deg"].number();
  if (m.has("zero_offset_deg")) motor.zero_offset_deg = m["zero_offset_deg"].number();
  return motor;
}

QJsonObject controller_to_json(const Controller& c) {
  return QJsonObject{{"moves", QString::fromStdString(to_string(c.moves))},
                     {"settle_s", c.settle_s},
                     {"overhead_s", c.overhead_s}};
}

Controller controller_from_json(const JsonField& c) {
  Controller out;
  out.moves = c["moves"].choice({MoveMode::simultaneous, MoveMode::sequential});
  out.settle_s = c["settle_s"].number();
  out.overhead_s = c["overhead_s"].number();
  return out;
}

}  // namespace gramline::formats
