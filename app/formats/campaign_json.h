#pragma once
// The campaign file: JSON, {"format": "gramline-campaign", "version": 1, ...}, units in every
// key. Holds the data set (points inline), encoding, rig, precision, nights, schedule and check
// settings and the seed.
#include <QJsonObject>
#include <QString>
#include <string>

#include "gramline/campaign.h"

namespace gramline::formats {

inline constexpr const char* kCampaignFormat = "gramline-campaign";
inline constexpr int kCampaignVersion = 1;

/// The campaign as a JSON object. Doubles keep every bit: Qt writes the shortest text that
/// reads back to the same double.
QJsonObject campaign_to_json(const Campaign& campaign);

/// Reads a campaign object. `file` names the source in messages. Throws InputError naming the
/// file and the field path for a wrong type, a missing required field, an unknown enum text,
/// another format, or a version newer than kCampaignVersion. Sections `schedule` and `check`,
/// and the keys `name`, `notes` and `seed`, may be left out (defaults).
Campaign campaign_from_json(const QJsonObject& object, const std::string& file);

/// Parses campaign JSON text (malformed JSON: the error names line and column).
Campaign parse_campaign(const std::string& bytes, const std::string& file);
/// Indented JSON text of the campaign.
std::string format_campaign(const Campaign& campaign);

/// Loads a campaign file.
Campaign load_campaign(const QString& path);
/// Saves atomically (QSaveFile). Throws InputError when the file cannot be written.
void save_campaign(const Campaign& campaign, const QString& path);

/// English name of an ISO weekday (1 = "Monday" ... 7 = "Sunday"), as the campaign file writes
/// it; empty outside 1..7. weekday_number is the inverse (0 for an unknown name).
std::string weekday_name(int iso_day);
int weekday_number(const std::string& name);

/// "HH:MM" for minutes after midnight, and back (false unless 00:00..23:59).
std::string clock_text(int minutes);
bool parse_clock(const std::string& text, int& minutes);

}  // namespace gramline::formats
