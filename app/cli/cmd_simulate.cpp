// gramline-cli simulate: rehearse a night without the rig (docs/counts-format.md, "Simulated
// counts").
#include <QFileInfo>
#include <QString>
#include <iostream>

#include "cli/commands.h"
#include "formats/bundle.h"
#include "formats/simulate_run.h"

namespace gramline::cli {

int run_simulate(const SimulateRequest& request) {
  const QString out = QString::fromStdString(request.out_path);
  const QString bundle_path = QString::fromStdString(request.bundle_path);
  const formats::Overwrite overwrite =
      request.force ? formats::Overwrite::allow : formats::Overwrite::refuse;
  formats::refuse_existing(out, overwrite);
  const formats::Bundle bundle = formats::read_bundle(bundle_path);
  CountSimulationOptions options;
  options.seed = request.seed.value_or(bundle.manifest.seed);
  options.fade_per_hour = request.fade_per_hour;
  if (request.stop_after_hours) options.stop_after_s = *request.stop_after_hours * 3600.0;
  const formats::SimulatedNight night =
      formats::simulate_night(bundle, QFileInfo(bundle_path).fileName().toStdString(), options);
  std::cout << night.report();
  formats::write_simulated_counts(night, out, overwrite);
  std::cout << "wrote the counts file " << request.out_path << " (" << night.records.size()
            << " rows)\n";
  return 0;
}

}  // namespace gramline::cli
