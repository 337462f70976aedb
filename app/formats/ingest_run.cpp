#include "formats/ingest_run.h"

#include <QDir>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>
#include <stdexcept>

#include "formats/file_set.h"
#include "formats/input_error.h"
#include "formats/text_io.h"

namespace gramline::formats {
namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

QString q(const std::string& text) { return QString::fromStdString(text); }

// Matrix as CSV without header; an unmeasured (NaN) entry is an empty field.
std::string matrix_csv(const Eigen::MatrixXd& m) {
  std::string out;
  for (long i = 0; i < m.rows(); ++i) {
    for (long j = 0; j < m.cols(); ++j) {
      if (j) out += ",";
      if (std::isfinite(m(i, j))) out += seventeen_digit_text(m(i, j));
    }
    out += "\n";
  }
  return out;
}

QJsonValue number_or_null(double x) {
  return std::isfinite(x) ? QJsonValue(x) : QJsonValue(QJsonValue::Null);
}

QJsonArray vector_json(const Eigen::VectorXd& v) {
  QJsonArray a;
  for (long i = 0; i < v.size(); ++i) a.append(number_or_null(v(i)));
  return a;
}

}  // namespace

IngestRun ingest_counts(const Bundle& bundle, const CountsFile& counts, const WorkHooks& hooks) {
  const Campaign& c = bundle.campaign;
  IngestRun run;
  run.bundle_source = bundle.source;
  run.counts_source = counts.source;
  run.manifest_sha256 = bundle.manifest_sha256;
  run.simulated_note = counts.simulated_note;
  run.earlier_simulated_note = bundle.measured_simulated_note;
  run.bundle_warning = check_counts_bundle(bundle, counts);
  run.check = check_counts(counts, bundle.steps.steps);
  if (!run.check.consistent())
    throw InputError(run.check.report() + counts.source + ": the counts do not fit the steps of " +
                     bundle.source + "; nothing was ingested");
  hooks.report(0.1);

  // Earlier bundles' measured steps come first; the new counts follow them on one clock.
  std::vector<Step> steps = bundle.measured_steps;
  run.earlier_steps = static_cast<int>(steps.size());
  steps.insert(steps.end(), bundle.steps.steps.begin(), bundle.steps.steps.end());
  std::vector<StepRecord> records = bundle.measured_records;
  double offset_s = 0.0;
  for (const StepRecord& r : records) offset_s = std::max(offset_s, r.end_s);
  for (StepRecord r : run.check.records) {
    r.step += run.earlier_steps;
    r.start_s += offset_s;
    r.end_s += offset_s;
    records.push_back(r);
  }
  run.plan = plan_from_steps(c, std::move(steps));
  IngestOptions options;
  options.keep_unit_diagonal = c.check.keep_unit_diagonal;
  try {
    run.result = ingest_records(c, run.plan, records, options);
  } catch (const std::invalid_argument& e) {
    throw InputError(counts.source + ": " + e.what());
  }
  hooks.report(0.4);
  static_cast<MeasuredClassifier&>(run) =
      train_measured_classifier(c, run.plan, run.result, options);
  hooks.report(0.5);
  for (int k : run.check.missing) {
    const Step& s = bundle.steps.steps[static_cast<size_t>(k)];
    run.saved_s += s.move_s + s.dwell_s;
  }
  const double C = c.check.C > 0 ? c.check.C : run.C;
  if (c.data.train_labels.minCoeff() != c.data.train_labels.maxCoeff())
    run.stop_rule = campaign_stop_rule(c, run.result, C, hooks.scaled(0.5, 1.0));
  hooks.report(1.0);
  return run;
}

std::string IngestRun::report() const {
  std::ostringstream o;
  o.precision(4);
  o << "Bundle " << bundle_source << ", counts " << counts_source << "\n";
  if (!simulated_note.empty())
    o << "These are " << simulated_counts_text(simulated_note) << ", not a rig's\n";
  if (!bundle_warning.empty()) o << "warning: " << bundle_warning << "\n";
  if (earlier_steps > 0)
    o << earlier_steps << " steps carried from earlier bundles are ingested with these counts"
      << (earlier_simulated_note.empty()
              ? std::string()
              : "; they are " + simulated_counts_text(earlier_simulated_note))
      << "\n";
  if (!check.missing.empty()) {
    o << check.missing.size() << " step(s) of the bundle have no counts:";
    for (size_t i = 0; i < std::min<size_t>(check.missing.size(), 20); ++i)
      o << " " << check.missing[i];
    o << (check.missing.size() > 20 ? " ...\n" : "\n");
  }
  o << result.report();
  o << MeasuredClassifier::report();
  o << stop_rule.report();
  if (stop_rule.stop && saved_s > 0)
    o << "  stopping now saves " << saved_s / 3600.0 << " h of planned steps\n";
  return o.str();
}

std::string format_ingest_json(const IngestRun& run, const std::string& set_id,
                               const std::map<std::string, std::string>& set_files) {
  const IngestResult& r = run.result;
  QJsonArray outliers;
  for (const Outlier& x : r.outliers) {
    outliers.append(QJsonObject{{"block", q(to_string(x.block))},
                                {"row", x.row},
                                {"col", x.col},
                                {"step", x.step},
                                {"measured", number_or_null(x.measured)},
                                {"predicted", x.predicted},
                                {"z", number_or_null(x.z)}});
  }
  QJsonArray drift;
  int drifted = 0;
  for (const DriftPoint& d : r.drift) {
    drifted += d.drifted ? 1 : 0;
    drift.append(QJsonObject{{"step", d.step},
                             {"time_s", d.time_s},
                             {"pair_detect_rate_per_s", number_or_null(d.pair_detect_rate_per_s)},
                             {"pair_detect_rate_sigma", number_or_null(d.pair_detect_rate_sigma)},
                             {"visibility", number_or_null(d.visibility)},
                             {"visibility_sigma", number_or_null(d.visibility_sigma)},
                             {"drifted", d.drifted}});
  }
  QJsonArray missing;
  for (int s : run.check.missing) missing.append(s);
  QJsonValue svm(QJsonValue::Null);
  if (run.svm_trained) {
    QJsonArray support;
    for (int s : run.svm.support) support.append(s);
    svm = QJsonObject{{"C", run.C},
                      {"dual_coef", vector_json(run.svm.dual_coef)},
                      {"bias", run.svm.bias},
                      {"support", support},
                      {"decision_train", vector_json(run.svm.decision_train)},
                      {"decision_test", vector_json(run.decision_test)},
                      {"test_accuracy", number_or_null(run.test_accuracy)},
                      {"ideal_test_accuracy", number_or_null(run.ideal_test_accuracy)},
                      {"psd_repaired", run.psd_repaired}};
  }
  QJsonArray holding;
  for (int t : run.stop_rule.holding_points) holding.append(t);
  QJsonObject o{
      {"format", "gramline-ingest"},
      {"version", 1},
      {"bundle", q(run.bundle_source)},
      {"bundle_manifest_sha256", q(run.manifest_sha256)},
      {"counts", q(run.counts_source)},
      {"simulated", !run.simulated_note.empty()},
      {"simulated_note", q(run.simulated_note)},
      {"earlier_simulated", !run.earlier_simulated_note.empty()},
      {"earlier_steps", run.earlier_steps},
      {"measured_entries", r.measured_entries},
      {"expected_entries", r.expected_entries},
      {"unmeasured_train_entries", run.unmeasured_train},
      {"unmeasured_test_entries", run.unmeasured_test},
      {"missing_steps", missing},
      {"z_mean", number_or_null(r.z_mean)},
      {"z_std", number_or_null(r.z_std)},
      {"outliers", outliers},
      {"drift", drift},
      {"drift_flagged", drifted},
      {"svm", svm},
      {"stop", run.stop_rule.stop},
      {"holding_points", holding},
      {"stop_rule",
       QJsonObject{
           {"trials", run.stop_rule.trials.trials},
           {"flip_probability_max",
            number_or_null(run.stop_rule.trials.flip_probability_max.value)},
           {"margin_ratio_median", number_or_null(run.stop_rule.trials.margin_ratio_median.value)},
           {"flip_threshold", run.stop_rule.options.flip_threshold},
           {"margin_ratio_threshold", run.stop_rule.options.margin_ratio_threshold},
           {"unmeasured_entries", run.stop_rule.unmeasured_entries},
           {"saved_s", run.stop_rule.stop ? run.saved_s : 0.0}}},
      {"svm_skipped_reason", q(run.svm_skipped_reason)}};
  if (!set_id.empty()) {
    QJsonObject files;
    for (const auto& [name, bytes] : set_files) files[q(name)] = q(sha256_hex(bytes));
    o[kSetIdKey] = q(set_id);
    o[kSetFilesKey] = files;
  }
  require_finite_json(o, "ingest.json");
  const QByteArray text = QJsonDocument(o).toJson(QJsonDocument::Indented);
  return std::string(text.constData(), static_cast<size_t>(text.size()));
}

std::vector<std::string> ingest_file_names() {
  return {"measured_kernel.csv", "measured_sigma.csv", "test_block.csv", "test_sigma.csv",
          "zscores.csv",         "drift.csv",          "ingest.json"};
}

void write_ingest_files(const IngestRun& run, const QString& dir, Overwrite overwrite) {
  refuse_unusable_output_folder(dir);
  for (const std::string& name : ingest_file_names())
    refuse_existing(QDir(dir).filePath(q(name)), overwrite);
  const IngestResult& r = run.result;
  const Plan& p = run.plan;
  const int n = static_cast<int>(r.gram_measured.rows());
  std::string z = "block,row,col,step,measured,predicted,sigma_measured,z\n";
  auto add = [&](const char* block, long row, long col, int step, double measured, double predicted,
                 double sigma, double zz) {
    const std::string at = "zscores.csv: " + std::string(block) + " entry (" + std::to_string(row) +
                           ", " + std::to_string(col) + "), ";
    z += std::string(block) + "," + std::to_string(row) + "," + std::to_string(col) + "," +
         std::to_string(step) + "," + finite_seventeen_digit_text(measured, at + "measured") + "," +
         finite_seventeen_digit_text(predicted, at + "predicted") + "," +
         finite_seventeen_digit_text(sigma, at + "sigma_measured") + "," +
         finite_seventeen_digit_text(zz, at + "z") + "\n";
  };
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j)
      if (std::isfinite(r.gram_measured(i, j)))
        add("train", i, j, p.step_of_train(i, j), r.gram_measured(i, j), p.kernel_train(i, j),
            r.gram_sigma(i, j), r.gram_z(i, j));
  for (long t = 0; t < r.test_measured.rows(); ++t)
    for (int j = 0; j < n; ++j)
      if (std::isfinite(r.test_measured(t, j)))
        add("test", t, j, p.step_of_test(t, j), r.test_measured(t, j), p.kernel_test(t, j),
            r.test_sigma(t, j), r.test_z(t, j));
  std::string drift =
      "step,time_s,pair_detect_rate_per_s,pair_detect_rate_sigma,visibility,"
      "visibility_sigma,drifted\n";
  // A reference step without an estimate (no counts) leaves its figures empty, as the matrices
  // do for unmeasured entries: no NaN is written.
  auto estimate = [](double v) {
    return std::isfinite(v) ? seventeen_digit_text(v) : std::string();
  };
  for (const DriftPoint& x : r.drift) {
    drift += std::to_string(x.step) + "," +
             finite_seventeen_digit_text(x.time_s,
                                         "drift.csv: step " + std::to_string(x.step) + ", time_s") +
             "," + estimate(x.pair_detect_rate_per_s) + "," + estimate(x.pair_detect_rate_sigma) +
             "," + estimate(x.visibility) + "," + estimate(x.visibility_sigma) + "," +
             (x.drifted ? "1" : "0") + "\n";
  }
  Eigen::MatrixXd sigma = r.gram_sigma;
  for (int i = 0; i < n; ++i)
    for (int j = 0; j < n; ++j)
      if (i != j && !std::isfinite(r.gram_measured(i, j))) sigma(i, j) = kNaN;
  Eigen::MatrixXd test_sigma = r.test_sigma;
  for (long t = 0; t < test_sigma.rows(); ++t)
    for (int j = 0; j < n; ++j)
      if (!std::isfinite(r.test_measured(t, j))) test_sigma(t, j) = kNaN;
  std::map<std::string, std::string> csv = {{"measured_kernel.csv", matrix_csv(r.gram_measured)},
                                            {"measured_sigma.csv", matrix_csv(sigma)},
                                            {"test_block.csv", matrix_csv(r.test_measured)},
                                            {"test_sigma.csv", matrix_csv(test_sigma)},
                                            {"zscores.csv", z},
                                            {"drift.csv", drift}};
  // ingest.json is the set's index: it names the save and fixes the others' SHA-256.
  std::vector<std::string> parts;
  for (const auto& [name, bytes] : csv) parts.push_back(bytes);
  const std::string id = content_set_id(parts);
  std::string index = format_ingest_json(run, id, csv);
  std::vector<SetFile> files;
  for (const std::string& name : ingest_file_names())
    files.push_back({name, name == "ingest.json" ? std::move(index) : std::move(csv[name])});
  save_file_set(dir, files, overwrite);
}

}  // namespace gramline::formats
