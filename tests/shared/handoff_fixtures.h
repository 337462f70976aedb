#pragma once
// Shared by the hand-off tests of the command line and the app: counts drawn from the rig model
// for a list of steps, by the engine's one simulator (gramline/simulate.h).
#include <cstdint>
#include <vector>

#include "gramline/simulate.h"

namespace handoff_test {

inline std::vector<gramline::StepRecord> simulate_counts(const gramline::Campaign& c,
                                                         const std::vector<gramline::Step>& steps,
                                                         std::uint64_t seed) {
  gramline::CountSimulationOptions options;
  options.seed = seed;
  return gramline::simulate_counts(c, steps, options);
}

}  // namespace handoff_test
