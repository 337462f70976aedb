#include "formats/rig_json.h"

#include <QJsonArray>
#include <QJsonDocument>
#include <algorithm>

#include "formats/limits.h"
#include "formats/text_io.h"

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

QJsonObject rig_to_json(const Rig& rig) {
  QJsonArray motors;
  for (const Motor& m : rig.motors) motors.append(motor_to_json(m));
  QJsonArray detectors;
  for (const Detector& d : rig.detectors) {
    detectors.append(QJsonObject{{"efficiency", d.efficiency},
                                 {"dark_rate_per_s", d.dark_rate_per_s},
                                 {"pbs_leakage", d.pbs_leakage}});
  }
  return QJsonObject{{"motors", motors},
                     {"controller", controller_to_json(rig.controller)},
                     {"source", QJsonObject{{"pair_rate_per_s", rig.source.pair_rate_per_s},
                                            {"visibility", rig.source.visibility}}},
                     {"detectors", detectors},
                     {"coincidence_window_s", rig.coincidence_window_s},
                     {"scheme", QString::fromStdString(to_string(rig.scheme))},
                     {"compensate_plates", rig.compensate_plates}};
}

Rig rig_from_json(const JsonField& f) {
  Rig rig;
  for (const JsonField& m : f["motors"].items()) rig.motors.push_back(motor_from_json(m));
  rig.controller = controller_from_json(f["controller"]);
  const JsonField s = f["source"];
  rig.source.pair_rate_per_s = s["pair_rate_per_s"].number();
  rig.source.visibility = s["visibility"].number();
  for (const JsonField& d : f["detectors"].items()) {
    rig.detectors.push_back(Detector{d["efficiency"].number(), d["dark_rate_per_s"].number()});
    if (d.has("pbs_leakage")) rig.detectors.back().pbs_leakage = d["pbs_leakage"].number();
  }
  rig.coincidence_window_s = f["coincidence_window_s"].number();
  rig.scheme = f["scheme"].choice({DetectionScheme::pass_only, DetectionScheme::both_ports});
  if (f.has("compensate_plates")) rig.compensate_plates = f["compensate_plates"].boolean();
  return rig;
}

int rig_photons(const Rig& rig) {
  int photons = static_cast<int>(rig.detectors.size());
  for (const Motor& m : rig.motors) photons = std::max(photons, m.photon + 1);
  return photons;
}

std::string format_rig(const Rig& rig) {
  QJsonObject o = rig_to_json(rig);
  o["format"] = kRigFormat;
  o["version"] = kRigVersion;
  const QByteArray bytes = QJsonDocument(o).toJson(QJsonDocument::Indented);
  return std::string(bytes.constData(), static_cast<size_t>(bytes.size()));
}

Rig parse_rig(const std::string& bytes, const std::string& file) {
  const JsonField root = parse_json_document(bytes, file);
  const std::string format = root["format"].text();
  if (format != kRigFormat)
    root["format"].fail("'" + format + "' is not a rig file (expected '" + kRigFormat + "')");
  const long long version = root["version"].integer(1, 1000000);
  if (version > kRigVersion)
    root["version"].fail("version " + std::to_string(version) +
                         " is newer than this Gramline reads (" + std::to_string(kRigVersion) +
                         ")");
  Rig rig = rig_from_json(root);
  if (const std::string problem = rig.check(rig_photons(rig)); !problem.empty())
    throw InputError(file + ": " + problem);
  return rig;
}

Rig load_rig(const QString& path) {
  // A rig is part of a campaign: the campaign file's limit bounds it (docs/limits.md).
  return parse_rig(read_whole_file(path, limits::kCampaignBytes), path_text(path));
}

void save_rig(const Rig& rig, const QString& path) { write_whole_file(path, format_rig(rig)); }

}  // namespace gramline::formats
