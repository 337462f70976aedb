#pragma once
// A campaign for one's own data: a sensible encoding for any number of features and a rig of
// four motors and one detector per photon (docs/conventions.md, "New campaigns").
#include <optional>

#include "gramline/campaign.h"

namespace gramline {

/// Angle spans of the encodings a new campaign gets: theta 10..170 deg keeps the extreme
/// training values apart without reaching the orthogonal poles; phi 0..270 deg keeps the
/// extremes of a feature on phi distinct (0 and 360 would be the same state).
inline constexpr AngleSpan kNewThetaSpan{10.0, 170.0};
inline constexpr AngleSpan kNewPhiSpan{0.0, 270.0};

/// Letter of photon p in motor names: A for photon 0, B for 1, ... (docs/conventions.md).
char photon_letter(int photon);

/// The four motors of photon p with the default mount (15 deg/s, 30 deg/s^2, endless,
/// shortest way, at 0 deg), named "<letter>-prep-HWP", "<letter>-prep-QWP", "<letter>-ana-QWP",
/// "<letter>-ana-HWP".
std::vector<Motor> photon_motors(int photon);

/// The rig a new campaign gets for P photons (1 to 4): photon_motors for each photon, a
/// simultaneous controller (0.5 s settle, 0.1 s overhead), a source of 100000 pairs/s at
/// visibility 0.97, detectors of efficiency 0.15 and 200 dark counts/s, a 2 ns window, both
/// ports detected.
Rig default_rig(int photons);

/// `rig` with exactly `photons` photons (1 to 4): the motors and detectors of photons that stay
/// are kept as they are; a new photon gets the motors of its last photon's kind (mount, speed,
/// range, backlash; its own letter in the names when the names follow the letter scheme, else
/// photon_motors) and a copy of the last detector. Throws std::invalid_argument naming the field
/// for a photon count outside 1 to 4.
Rig resize_rig(const Rig& rig, int photons);

/// The precision, nights and schedule settings the demo and new campaigns share: Wilson
/// half-width 0.01 at 95 %, nights 20:00-06:00, at most 3, a reference every 20 min, dark steps
/// of 30 s and a park step each night (the first date is left as it is).
void set_usual_settings(Campaign& campaign);

struct NewCampaignOptions {
  int photons = 0;                       ///< 0: the rig's photons when a rig is given, else 2
  std::optional<EncodingPreset> preset;  ///< absent: default_preset(D, P)
  std::optional<Rig> rig;                ///< absent: default_rig(P)
  AngleSpan theta_span = kNewThetaSpan;
  AngleSpan phi_span = kNewPhiSpan;
};

/// A campaign for `data` (validated): the encoding by make_encoding on the training points'
/// feature ranges, the rig (resized to P photons when P differs from its own), the demo's
/// precision, nights and schedule settings. Throws std::invalid_argument naming the field.
Campaign make_campaign_for_data(const DataSet& data, const NewCampaignOptions& options = {});

/// The campaign's encoding for `data` with another number of features: the same photons,
/// default_preset(D, P) over the training ranges and the spans of the new campaigns. Returns
/// the old map unchanged when it already reads D features.
EncodingMap encoding_for_features(const EncodingMap& current, const DataSet& data);

/// The encoding for `photons` photons (1 to 4): the old map when it already reads D features on
/// that many photons, else default_preset(D, P) as encoding_for_features builds it.
EncodingMap encoding_for_photons(const EncodingMap& current, const DataSet& data, int photons);

}  // namespace gramline
