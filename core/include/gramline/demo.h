#pragma once
// The bundled demo: an invented two-class, two-feature scenario of our own.
#include <cstdint>

#include "gramline/campaign.h"

namespace gramline {

/// Demo campaign: 48 training and 16 test points drawn by a seeded generator on either side of
/// a curved (parabolic) boundary, the one-feature-per-photon linear encoding on two photons, and
/// a two-photon rig of eight stepper-driven rotation mounts (15 deg/s, 0.5 s settle).
Campaign make_demo_campaign(std::uint64_t seed = 7);

}  // namespace gramline
