#pragma once
// From a verified bundle and the rig's counts file to the measured kernel, its comparison with
// the prediction, the drift of the night and a classifier trained on what was measured. One
// function for the command line and the app; the files it writes live here too.
#include <Eigen/Core>
#include <QString>
#include <string>
#include <vector>

#include "formats/atomic_file.h"
#include "formats/bundle.h"
#include "formats/counts_csv.h"
#include "gramline/adaptive.h"
#include "gramline/ingest.h"
#include "gramline/plan.h"
#include "gramline/progress.h"
#include "gramline/svm.h"

namespace gramline::formats {

/// The engine's classifier on the measured kernel (train_measured_classifier, ingest.h) with
/// where its counts came from.
struct IngestRun : MeasuredClassifier {
  std::string bundle_source;
  std::string counts_source;
  std::string manifest_sha256;
  Plan plan;              ///< the bundle's steps (after any earlier measured steps), as ingested
  int earlier_steps = 0;  ///< steps carried from earlier bundles (resumed bundle), first in plan
  CountsCheck check;      ///< of the new counts against the bundle's own steps
  IngestResult result;
  StopRuleResult stop_rule;  ///< are the test decisions stable enough to end the campaign?
  double saved_s = 0.0;      ///< planned time of the bundle's steps without counts (moves + dwell)
  std::string report() const;
};

/// Ingests `counts` for `bundle`. Throws InputError listing every extra, duplicated and
/// kind-mismatched row (file, line, column) when the counts do not fit the bundle's steps;
/// missing steps are allowed (a partial night) and reported. `hooks` hears the fraction done.
IngestRun ingest_counts(const Bundle& bundle, const CountsFile& counts,
                        const WorkHooks& hooks = {});

/// The names write_ingest_files writes.
std::vector<std::string> ingest_file_names();

/// Writes measured_kernel.csv, measured_sigma.csv, test_block.csv, test_sigma.csv, zscores.csv,
/// drift.csv and ingest.json into `dir` (created if needed), each atomically. With
/// Overwrite::refuse nothing is written when any of them exists.
void write_ingest_files(const IngestRun& run, const QString& dir, Overwrite overwrite);

/// ingest.json text.
std::string format_ingest_json(const IngestRun& run);

}  // namespace gramline::formats
