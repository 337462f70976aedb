#pragma once
// The one count simulator: counts a rig following a planned schedule would record, drawn from
// the rig model. Every simulation test, benchmark and command that rehearses a night uses it.
#include <cstdint>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/ingest.h"
#include "gramline/plan.h"

namespace gramline {

struct CountSimulationOptions {
  std::uint64_t seed = 1;
  /// Fractional loss of the pair rate per hour of the plan's clock (0: a steady source). The
  /// rate at time t (s from the first night's start) is R (1 - fade_per_hour)^(t / 3600).
  double fade_per_hour = 0.0;
  /// Stop recording this many seconds after the first step starts, as an interrupted night
  /// would (steps whose counting has not ended by then get no record); negative: no stop.
  double stop_after_s = -1.0;

  /// Refuses a fade outside [0, 1) or a non-finite stop, naming the field.
  void validate() const;
};

/// Counts of every measure and reference step, drawn from the rig model (detection.h
/// setting_rates, docs/conventions.md): each of the 2^P channels (or the single pass channel)
/// is an independent Poisson count. Independent Poisson channels make the pass count binomial
/// given the total (Poisson splitting, e.g. Feller, An Introduction to Probability Theory,
/// vol. 1). The counting interval of a step is [start_s + move_s, start_s + move_s + dwell_s].
std::vector<StepRecord> simulate_counts(const Campaign& campaign, const std::vector<Step>& steps,
                                        const CountSimulationOptions& options);

}  // namespace gramline
