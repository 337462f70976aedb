#pragma once
// From a verified bundle and the rig's counts file to the measured kernel, its comparison with
// the prediction, the drift of the night and a classifier trained on what was measured. One
// function for the command line and the app; the files it writes live here too.
#include <Eigen/Core>
#include <QString>
#include <map>
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
  /// The counts file's simulated mark (docs/counts-format.md), empty for counts from a rig; and
  /// that of the counts carried from earlier bundles.
  std::string simulated_note;
  std::string earlier_simulated_note;
  std::string bundle_warning;  ///< check_counts_bundle's warning (counts naming no bundle)
  IngestResult result;
  StopRuleResult stop_rule;  ///< are the test decisions stable enough to end the campaign?
  double saved_s = 0.0;      ///< planned time of the bundle's steps without counts (moves + dwell)
  std::string report() const;
};

/// Ingests `counts` for `bundle`. Throws InputError naming both ids when the counts answer
/// another bundle (check_counts_bundle); throws InputError listing every extra, duplicated and
/// kind-mismatched row (file, line, column) when the counts do not fit the bundle's steps;
/// missing steps are allowed (a partial night) and reported. `hooks` hears the fraction done.
IngestRun ingest_counts(const Bundle& bundle, const CountsFile& counts,
                        const WorkHooks& hooks = {});

/// The names write_ingest_files writes.
std::vector<std::string> ingest_file_names();

/// Writes measured_kernel.csv, measured_sigma.csv, test_block.csv, test_sigma.csv, zscores.csv,
/// drift.csv and ingest.json into `dir` (created if needed) as one set (save_file_set,
/// file_set.h): nothing changes unless all seven are complete. With Overwrite::refuse nothing is
/// written when any of them exists.
void write_ingest_files(const IngestRun& run, const QString& dir, Overwrite overwrite);

/// ingest.json text; with a `set_id`, also the save's id and the SHA-256 of each other file of
/// the set (`set_files`: name -> bytes).
std::string format_ingest_json(const IngestRun& run, const std::string& set_id = {},
                               const std::map<std::string, std::string>& set_files = {});

}  // namespace gramline::formats
