#pragma once
// Rehearsing a night without the rig: the counts a rig following a bundle's steps would record,
// drawn by the engine's one simulator (gramline/simulate.h) and written as a counts file that
// names its bundle and marks itself as simulated (docs/counts-format.md, "Simulated counts").
// One function for the command line and the app.
#include <QString>
#include <string>
#include <vector>

#include "formats/atomic_file.h"
#include "formats/bundle.h"
#include "gramline/ingest.h"
#include "gramline/simulate.h"

namespace gramline::formats {

struct SimulatedNight {
  std::string bundle_line;     ///< first line: names the bundle
  std::string simulated_note;  ///< after kSimulatedMark on the second line
  std::vector<StepRecord> records;
  int steps_to_count = 0;  ///< measure and reference steps of the bundle
  CountSimulationOptions options;
  std::string counts_text;  ///< the whole counts file
  std::string report() const;
};

/// Simulates the counts of `bundle`'s own steps, on its own clock (a resumed bundle's earlier
/// steps are not counted again). `bundle_file_name` is the bundle's file name without folder.
/// Throws InputError naming the option for options the simulator refuses.
SimulatedNight simulate_night(const Bundle& bundle, const std::string& bundle_file_name,
                              const CountSimulationOptions& options);

/// Writes the counts file atomically; refuses an existing `path` unless overwriting is allowed.
void write_simulated_counts(const SimulatedNight& night, const QString& path, Overwrite overwrite);

}  // namespace gramline::formats
