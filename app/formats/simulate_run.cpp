#include "formats/simulate_run.h"

#include <sstream>
#include <stdexcept>

#include "formats/counts_csv.h"
#include "formats/input_error.h"
#include "formats/text_io.h"

namespace gramline::formats {

SimulatedNight simulate_night(const Bundle& bundle, const std::string& bundle_file_name,
                              const CountSimulationOptions& options) {
  SimulatedNight night;
  night.options = options;
  try {
    night.records = simulate_counts(bundle.campaign, bundle.steps.steps, options);
  } catch (const std::invalid_argument& e) {
    throw InputError(bundle.source + ": cannot simulate: " + e.what());
  }
  for (const Step& s : bundle.steps.steps)
    night.steps_to_count += (s.kind == StepKind::measure || s.kind == StepKind::reference) ? 1 : 0;
  night.bundle_line =
      "# bundle file: " + bundle_file_name + ", manifest SHA-256 " + bundle.manifest_sha256;
  std::ostringstream note;
  note << "drawn from the rig model by gramline " << GRAMLINE_VERSION << ", seed " << options.seed
       << ", fade_per_hour " << exact_number_text(options.fade_per_hour) << ", stop_after_hours "
       << (options.stop_after_s >= 0.0 ? exact_number_text(options.stop_after_s / 3600.0)
                                       : std::string("none"))
       << "; not measured on a rig";
  night.simulated_note = note.str();
  night.counts_text = night.bundle_line + "\n" +
                      format_counts_csv(night.records, bundle.steps.steps,
                                        counts_layout(bundle.campaign), night.simulated_note);
  return night;
}

std::string SimulatedNight::report() const {
  std::ostringstream o;
  o << "Simulated counts for " << records.size() << " of " << steps_to_count
    << " measure and reference steps (" << simulated_note << ")\n";
  if (static_cast<int>(records.size()) < steps_to_count)
    o << "The night stops early: " << steps_to_count - static_cast<int>(records.size())
      << " step(s) have no counts, as after an interruption; resume plans them\n";
  return o.str();
}

void write_simulated_counts(const SimulatedNight& night, const QString& path, Overwrite overwrite) {
  save_atomically(path, night.counts_text, overwrite);
}

}  // namespace gramline::formats
