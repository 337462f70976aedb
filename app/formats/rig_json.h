#pragma once
// JSON of a motor and of the controller (the parameters of docs/motion-model.md), shared by the
// campaign file and steps.json so both spell the motion model the same way; and the rig file, a
// rig on its own to reuse across campaigns (docs/plan-files.md, "Rig files").
#include <QJsonObject>
#include <QString>
#include <string>

#include "formats/json_field.h"
#include "gramline/rig.h"

namespace gramline::formats {

QJsonObject motor_to_json(const Motor& motor);
Motor motor_from_json(const JsonField& field);
QJsonObject controller_to_json(const Controller& controller);
Controller controller_from_json(const JsonField& field);

/// The campaign's `rig` object: motors, controller, source, detectors, window and scheme.
QJsonObject rig_to_json(const Rig& rig);
Rig rig_from_json(const JsonField& field);

inline constexpr const char* kRigFormat = "gramline-rig";
inline constexpr int kRigVersion = 1;

/// Rig file text: {"format": "gramline-rig", "version": 1} and the keys of rig_to_json.
std::string format_rig(const Rig& rig);
/// Reads rig file text; throws InputError naming the file and field (also when Rig::check
/// fails for the photons its motors name).
Rig parse_rig(const std::string& bytes, const std::string& file);
Rig load_rig(const QString& path);
/// Saves atomically; throws InputError when the file cannot be written.
void save_rig(const Rig& rig, const QString& path);
/// Photons a rig is built for: one more than the largest photon index of its motors, at least
/// the number of its detectors.
int rig_photons(const Rig& rig);

}  // namespace gramline::formats
