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

struct ResumeRun {
  Campaign campaign;
  ResumeState state;                         ///< measured entries (all bundles) and positions
  std::vector<Step> measured_steps;          ///< every counted step so far, earliest first
  std::vector<StepRecord> measured_records;  ///< their counts, renumbered onto measured_steps
  int measured_entries = 0;
  int remaining_entries = 0;
  Plan plan;  ///< the remaining entries only
  std::string report() const;
};

/// Plans the rest of `bundle`'s campaign after `counts`. Throws InputError when the counts do not
/// fit the bundle's steps (every problem listed) or when nothing is left to measure. `hooks`
/// reach the planner (progress of the plan of the rest).
ResumeRun plan_resume(const Bundle& bundle, const CountsFile& counts, const WorkHooks& hooks = {});

/// Writes the new bundle: the remaining plan plus measured_steps.json, measured_counts.csv and
/// resume.json; its manifest names the parent (file name and manifest SHA-256). With a lab key
/// the new bundle is signed (signature.json).
BundleWritten write_resumed_bundle(const ResumeRun& run, const Bundle& parent,
                                   const QString& parent_path, const QString& path,
                                   Overwrite overwrite,
                                   const std::optional<std::string>& lab_key = std::nullopt);

}  // namespace gramline::formats
