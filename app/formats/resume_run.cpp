#include "formats/resume_run.h"

#include <QFileInfo>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <algorithm>
#include <set>
#include <sstream>

#include "formats/input_error.h"
#include "formats/plan_files.h"
#include "formats/text_io.h"

namespace gramline::formats {

ResumeRun plan_resume(const Bundle& bundle, const CountsFile& counts, const WorkHooks& hooks) {
  const Campaign& c = bundle.campaign;
  ResumeRun run;
  run.campaign = c;
  run.campaign.seed = bundle.manifest.seed;
  const CountsCheck check = check_counts(counts, bundle.steps.steps);
  if (!check.consistent())
    throw InputError(check.report() + counts.source + ": the counts do not fit the steps of " +
                     bundle.source + "; nothing was resumed");

  // Earlier bundles' steps stay first; this bundle's counted steps follow in time order, their
  // times shifted onto the same clock as ingest_counts does.
  run.measured_steps = bundle.measured_steps;
  run.measured_records = bundle.measured_records;
  double offset_s = 0.0;
  for (const StepRecord& r : run.measured_records) offset_s = std::max(offset_s, r.end_s);
  std::vector<StepRecord> fresh = check.records;
  std::stable_sort(fresh.begin(), fresh.end(),
                   [](const StepRecord& a, const StepRecord& b) { return a.end_s < b.end_s; });
  for (StepRecord r : fresh) {
    const Step& s = bundle.steps.steps[static_cast<size_t>(r.step)];
    run.measured_steps.push_back(s);
    r.step = static_cast<int>(run.measured_steps.size()) - 1;
    r.start_s += offset_s;
    r.end_s += offset_s;
    run.measured_records.push_back(r);
  }
  if (!fresh.empty()) {
    run.state.start_positions_deg =
        bundle.steps.steps[static_cast<size_t>(fresh.back().step)].position_deg;
  } else if (!bundle.measured_steps.empty()) {
    run.state.start_positions_deg = bundle.measured_steps.back().position_deg;
  }
  // Entries count as measured only when their step has counts.
  std::set<std::pair<int, int>> measured;
  std::set<int> counted;
  for (const StepRecord& r : run.measured_records) counted.insert(r.step);
  for (int k : counted) {
    const Step& s = run.measured_steps[static_cast<size_t>(k)];
    if (s.kind != StepKind::measure) continue;
    measured.insert(
        {std::min(s.prep_point, s.analysis_point), std::max(s.prep_point, s.analysis_point)});
  }
  run.state.measured.assign(measured.begin(), measured.end());
  run.measured_entries = static_cast<int>(measured.size());
  const long n = c.data.train_count(), m = c.data.test_count();
  run.remaining_entries = static_cast<int>(n * (n - 1) / 2 + m * n) - run.measured_entries;
  if (run.remaining_entries <= 0)
    throw InputError(counts.source + ": every entry of " + bundle.source +
                     " is measured; nothing is left to resume (ingest the counts instead)");
  PlanOptions options;
  options.seed = run.campaign.seed;
  options.resume = &run.state;
  options.hooks = hooks;
  try {
    run.plan = plan_campaign(run.campaign, options);
  } catch (const std::invalid_argument& e) {
    throw InputError(bundle.source + ": cannot plan the remaining entries: " + e.what());
  }
  return run;
}

std::string ResumeRun::report() const {
  std::ostringstream o;
  o << measured_entries << " entries measured so far (" << measured_records.size()
    << " counted steps kept); " << remaining_entries << " remain and are planned from the "
    << (state.start_positions_deg.empty() ? "initial" : "last counted") << " motor positions\n";
  o << plan.report();
  return o.str();
}

BundleWritten write_resumed_bundle(const ResumeRun& run, const Bundle& parent,
                                   const QString& parent_path, const QString& path,
                                   Overwrite overwrite, const std::optional<std::string>& lab_key) {
  BundleWriteOptions options;
  options.overwrite = overwrite;
  options.lab_key = lab_key;
  options.parent =
      BundleParent{QFileInfo(parent_path).fileName().toStdString(), parent.manifest_sha256};
  const Rig& rig = run.campaign.rig;
  options.extra_entries[kMeasuredStepsEntry] = format_steps_json(rig, run.measured_steps);
  options.extra_entries[kMeasuredCountsEntry] =
      format_counts_csv(run.measured_records, run.measured_steps, counts_layout(run.campaign));
  QJsonObject positions;
  for (size_t k = 0; k < rig.motors.size() && k < run.state.start_positions_deg.size(); ++k)
    positions[QString::fromStdString(rig.motors[k].name)] = run.state.start_positions_deg[k];
  QJsonArray measured;
  for (const auto& [a, b] : run.state.measured) measured.append(QJsonArray{a, b});
  const QJsonObject resume{
      {"format", "gramline-resume"},
      {"version", 1},
      {"parent_file", QString::fromStdString(options.parent->file_name)},
      {"parent_manifest_sha256", QString::fromStdString(options.parent->manifest_sha256)},
      {"measured_entries", run.measured_entries},
      {"remaining_entries", run.remaining_entries},
      {"start_position_deg", positions},
      {"measured", measured}};
  require_finite_json(resume, "resume.json");
  const QByteArray text = QJsonDocument(resume).toJson(QJsonDocument::Indented);
  options.extra_entries[kResumeEntry] = text.toStdString();
  return write_bundle(run.campaign, run.plan, path, options);
}

}  // namespace gramline::formats
