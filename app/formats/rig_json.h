#pragma once
// JSON of a motor and of the controller (the parameters of docs/motion-model.md), shared by the
// campaign file and steps.json so both spell the motion model the same way.
#include <QJsonObject>

#include "formats/json_field.h"
#include "gramline/rig.h"

namespace gramline::formats {

QJsonObject motor_to_json(const Motor& motor);
Motor motor_from_json(const JsonField& field);
QJsonObject controller_to_json(const Controller& controller);
Controller controller_from_json(const JsonField& field);

}  // namespace gramline::formats
