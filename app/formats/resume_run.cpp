#include "formats/resume_run.h"

#include <QFileInfo>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <algorithm>
#include <cmath>
#include <set>
#include <sstream>

#include "formats/input_error.h"
#include "formats/plan_files.h"
#include "formats/text_io.h"

namespace gramline::formats {

namespace {
// Frobenius sigma of the whole training Gram matrix (both triangles): the measured entries at
// the sigma of their counts (ingest_records), the others at the plan's predicted sigma.
double whole_gram_sigma(const ResumeRun& run) {
  Eigen::MatrixXd sigma = run.plan.sigma_train;
  if (!run.measured_records.empty()) {
    const Plan measured = plan_from_steps(run.campaign, run.measured_steps);
    const IngestResult got = ingest_records(run.campaign, measured, run.measured_records);
    for (long i = 0; i < sigma.rows(); ++i)
      for (long j = 0; j < sigma.cols(); ++j)
        if (i != j && std::isfinite(got.gram_measured(i, j)) && std::isfinite(got.gram_sigma(i, j)))
          sigma(i, j) = got.gram_sigma(i, j);
  }
  double sum = 0.0;
  for (long i = 0; i < sigma.rows(); ++i)
    for (long j = 0; j < sigma.cols(); ++j)
      if (i != j) sum += sigma(i, j) * sigma(i, j);
  return std::sqrt(sum);
}
}  // namespace

ResumeRun plan_resume(const Bundle& bundle, const CountsFile& counts, const WorkHooks& hooks,
                      const ResumeOptions& resume_options) {
  const Campaign& c = bundle.campaign;
  ResumeRun run;
  run.campaign = c;
  run.campaign.seed = bundle.manifest.seed;
  run.simulated_note = counts.simulated() ? counts.simulated_note : bundle.measured_simulated_note;
  run.bundle_warning = check_counts_bundle(bundle, counts);
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

  // The calendar of the rest (docs/plan-files.md, "Nights on the calendar"): from the first
  // night given, else the day after the last night counted; the nights allowed less those used.
  std::set<int> nights;
  for (const StepRecord& r : fresh)
    nights.insert(bundle.steps.steps[static_cast<size_t>(r.step)].night);
  run.nights_used = static_cast<int>(nights.size());
  long first_day = 0;
  if (!resume_options.first_night.empty()) {
    if (!parse_civil_date(resume_options.first_night, first_day))
      throw InputError("--first-night: '" + resume_options.first_night +
                       "' is not a date YYYY-MM-DD");
    run.campaign.nights.first_date = resume_options.first_night;
  } else if (!nights.empty()) {
    parse_civil_date(c.nights.night_date(*nights.rbegin()), first_day);
    run.campaign.nights.first_date = civil_date_text(first_day + 1);
  }
  run.campaign.nights.max_nights = std::max(1, c.nights.max_nights - run.nights_used);
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
  run.gram_sigma_frobenius_whole = whole_gram_sigma(run);
  return run;
}

std::string ResumeRun::report() const {
  std::ostringstream o;
  if (!simulated_note.empty())
    o << "The counts kept are " << simulated_counts_text(simulated_note) << ", not a rig's\n";
  if (!bundle_warning.empty()) o << "warning: " << bundle_warning << "\n";
  o << measured_entries << " entries measured so far (" << measured_records.size()
    << " counted steps kept); " << remaining_entries << " remain and are planned from the "
    << (state.start_positions_deg.empty() ? "initial" : "last counted") << " motor positions\n";
  o << nights_used << " night(s) used; the rest may take " << campaign.nights.max_nights
    << " night(s) from " << campaign.nights.night_date(1) << "\n";
  o << "Gram error of the whole training matrix, measured and planned entries (Frobenius "
       "sigma): "
    << gram_sigma_frobenius_whole << "\n";
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
      format_counts_csv(run.measured_records, run.measured_steps, counts_layout(run.campaign),
                        std::string(), run.simulated_note);
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
      {"simulated_counts", !run.simulated_note.empty()},
      {"start_position_deg", positions},
      {"measured", measured}};
  require_finite_json(resume, "resume.json");
  const QByteArray text = QJsonDocument(resume).toJson(QJsonDocument::Indented);
  options.extra_entries[kResumeEntry] = text.toStdString();
  ResumeSummary summary;
  summary.parent_file = options.parent->file_name;
  summary.measured_entries = run.measured_entries;
  summary.remaining_entries = run.remaining_entries;
  summary.measured_steps = static_cast<int>(run.measured_records.size());
  summary.nights_used = run.nights_used;
  summary.gram_sigma_frobenius_whole = run.gram_sigma_frobenius_whole;
  options.resume = summary;
  return write_bundle(run.campaign, run.plan, path, options);
}

}  // namespace gramline::formats
