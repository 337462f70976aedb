#pragma once
// Resuming an interrupted campaign: keep what a partial counts file measured, plan the
// remaining entries from where the motors stopped, and hand off a new bundle that names its
// parent and carries every measured step and count so far.
#include <QString>
#include <vector>

#include "formats/bundle.h"
#include "formats/counts_csv.h"
#include "gramline/plan.h"

namespace gramline::formats {

/// How the rest is laid on the calendar.
struct ResumeOptions {
  /// Date of the first night of the rest, YYYY-MM-DD; empty: the calendar day after the last
  /// night the counts cover (the parent's first date when they cover none).
  std::string first_night;
};

struct ResumeRun {
  Campaign campaign;                         ///< first_date and max_nights set for the rest
  ResumeState state;                         ///< measured entries (all bundles) and positions
  std::vector<Step> measured_steps;          ///< every counted step so far, earliest first
  std::vector<StepRecord> measured_records;  ///< their counts, renumbered onto measured_steps
  int measured_entries = 0;
  int remaining_entries = 0;
  int nights_used = 0;         ///< nights of the parent bundle with counted steps
  std::string bundle_warning;  ///< check_counts_bundle's warning (counts naming no bundle)
  /// Frobenius sigma of the whole training Gram matrix: measured entries at the sigma of their
  /// counts, the rest at the sigma this plan predicts.
  double gram_sigma_frobenius_whole = 0.0;
  Plan plan;  ///< the remaining entries only
  /// Simulated mark of the counts kept (this counts file's, else the earlier bundles'); empty
  /// when every kept count came from a rig (docs/counts-format.md).
  std::string simulated_note;
  std::string report() const;
};

/// Plans the rest of `bundle`'s campaign after `counts`, from the first night of `options` for
/// the nights the campaign allows less the nights used (at least one). Throws InputError when
/// the counts answer another bundle (both ids named), do not fit the bundle's steps (every
/// problem listed), when the first night is not a date, or when nothing is left to measure.
/// `hooks` reach the planner (progress of the plan of the rest).
ResumeRun plan_resume(const Bundle& bundle, const CountsFile& counts, const WorkHooks& hooks = {},
                      const ResumeOptions& options = {});

/// Writes the new bundle: the remaining plan plus measured_steps.json, measured_counts.csv and
/// resume.json; its manifest names the parent (file name and manifest SHA-256). With a lab key
/// the new bundle is signed (signature.json).
BundleWritten write_resumed_bundle(const ResumeRun& run, const Bundle& parent,
                                   const QString& parent_path, const QString& path,
                                   Overwrite overwrite,
                                   const std::optional<std::string>& lab_key = std::nullopt);

}  // namespace gramline::formats
