#pragma once
// The margin check as JSON, the file `gramline-cli check` writes (keys listed in README.md,
// "Files"): the verdict, C, the dual coefficients, bias and decision values, the flip
// probabilities, accuracy and margin ratio with their intervals, the failing points, the budget
// search, the allocation comparison and the encoding-scale advice.
#include <QJsonObject>
#include <QString>
#include <cstdint>
#include <string>

#include "gramline/campaign.h"
#include "gramline/margin.h"

namespace gramline::formats {

/// The check JSON object of `check`, run on `campaign` with `seed` at `confidence` (the level of
/// every interval). Figures that are not finite are written as null: JSON has no infinities.
QJsonObject check_json(const Campaign& campaign, const MarginCheck& check, std::uint64_t seed,
                       double confidence);

/// check_json as indented JSON text.
std::string format_check_json(const Campaign& campaign, const MarginCheck& check,
                              std::uint64_t seed, double confidence);

/// Writes format_check_json to `path` atomically. Throws InputError naming the file when it
/// cannot be written.
void write_check_json(const Campaign& campaign, const MarginCheck& check, std::uint64_t seed,
                      double confidence, const QString& path);

}  // namespace gramline::formats
