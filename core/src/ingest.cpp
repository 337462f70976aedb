#include "gramline/ingest.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>
#include <stdexcept>

#include "gramline/detection.h"
#include "gramline/entries.h"
#include "gramline/estimates.h"
#include "gramline/field_check.h"
#include "gramline/kernel.h"

namespace gramline {

int channel_count(DetectionScheme scheme, int photons) {
  return scheme == DetectionScheme::both_ports ? (1 << photons) : 1;
}

namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

// Calibration of a step: the rig model's, with the accidentals taken from the recorded singles
// when present (accidental_rate_per_s, detection.h).
Calibration accidentals(const Campaign& c, const EntryNoise& model, const StepRecord& r) {
  Calibration cal = model.calibration;
  if (!r.singles_per_s.empty() && c.encoding.photon_count() >= 2) {
    const double a = accidental_rate_per_s(r.singles_per_s, c.rig.coincidence_window_s);
    // Scale the all-channel accidentals by the same measured/model ratio.
    const double model_a = model.calibration.accidental_pass_rate_per_s;
    const double ratio = model_a > 0 ? a / model_a : 1.0;
    cal.accidental_pass_rate_per_s = a;
    cal.accidental_total_rate_per_s *= ratio;
  }
  return cal;
}

double dwell_of(const StepRecord& r) { return r.end_s - r.start_s; }

DriftPoint reference_point(const Campaign& c, const EntryStatistics& stats, const Step& s,
                           const StepRecord& r, CalibrationCovariance& cov) {
  const int photons = c.encoding.photon_count();
  const double t = dwell_of(r);
  const Calibration model = accidentals(c, stats.noise(s.prep_point, s.analysis_point), r);
  const double floor = 1.0 / std::ldexp(1.0, photons);  // pass probability of a mixed state
  DriftPoint d;
  d.step = r.step;
  d.time_s = 0.5 * (r.start_s + r.end_s);
  SettingCounts counts;
  counts.dwell_s = t;
  counts.pass_counts = r.channel_counts.at(0);
  for (double n : r.channel_counts) counts.total_counts += n;
  const Calibration cal = reference_calibration(c.rig.scheme, photons, model, counts);
  d.pair_detect_rate_per_s = cal.pair_detect_rate_per_s;
  d.visibility = cal.visibility;
  // The calibration's own uncertainty at the pairs this reference detected.
  cov = reference_covariance(c.rig.scheme, photons, cal, cal.pair_detect_rate_per_s * t);
  if (c.rig.scheme == DetectionScheme::both_ports) {
    const double n_total = counts.total_counts;
    const double rate = cal.pair_detect_rate_per_s;
    const double p_obs = n_total > 0 ? counts.pass_counts / n_total : kNaN;
    d.pair_detect_rate_sigma = std::sqrt(n_total) / t;
    d.visibility_sigma = std::sqrt(p_obs * (1.0 - p_obs) / n_total) *
                         (rate + model.accidental_total_rate_per_s) / rate / (1.0 - floor);
  } else {
    const double p_ref = pass_probability(1.0, d.visibility, photons);
    d.pair_detect_rate_sigma = std::sqrt(counts.pass_counts) / t / p_ref;
  }
  return d;
}

}  // namespace

void IngestOptions::validate() const {
  FieldCheck("IngestOptions").positive("outlier_z", outlier_z).throw_if_failed();
}

IngestResult ingest_records(const Campaign& campaign, const Plan& plan,
                            const std::vector<StepRecord>& records, const IngestOptions& options) {
  options.validate();
  const Campaign& c = campaign;
  const int n = c.data.train_count();
  const int m = c.data.test_count();
  const int photons = c.encoding.photon_count();
  const int channels = channel_count(c.rig.scheme, photons);

  for (size_t k = 0; k < records.size(); ++k) {
    const StepRecord& r = records[k];
    std::ostringstream where;
    where << "record " << k + 1 << " (step " << r.step << ")";
    if (r.step < 0 || r.step >= static_cast<int>(plan.steps.size()))
      throw std::invalid_argument(where.str() + ": no such step in the plan");
    if (static_cast<int>(r.channel_counts.size()) != channels)
      throw std::invalid_argument(where.str() + ": expected " + std::to_string(channels) +
                                  " count channels");
    if (!(dwell_of(r) > 0)) throw std::invalid_argument(where.str() + ": end is not after start");
    for (double x : r.channel_counts)
      if (!(x >= 0) || !std::isfinite(x))
        throw std::invalid_argument(where.str() + ": counts must be finite and >= 0");
    if (!r.singles_per_s.empty() && static_cast<int>(r.singles_per_s.size()) != photons)
      throw std::invalid_argument(where.str() + ": expected one singles rate per photon");
  }

  const EntryStatistics stats(c);
  IngestResult out;
  out.options = options;
  out.gram_measured = Eigen::MatrixXd::Constant(n, n, kNaN);
  out.gram_measured.diagonal().setOnes();
  out.gram_sigma = Eigen::MatrixXd::Zero(n, n);
  out.test_measured = Eigen::MatrixXd::Constant(m, n, kNaN);
  out.test_sigma = Eigen::MatrixXd::Zero(m, n);
  out.gram_z = Eigen::MatrixXd::Constant(n, n, kNaN);
  out.test_z = Eigen::MatrixXd::Constant(m, n, kNaN);
  out.expected_entries = static_cast<int>(plan.summary.settings);

  std::vector<std::pair<DriftPoint, CalibrationCovariance>> refs;
  for (const StepRecord& r : records) {
    const Step& s = plan.steps[r.step];
    if (s.kind != StepKind::reference) continue;
    CalibrationCovariance cov;
    const DriftPoint d = reference_point(c, stats, s, r, cov);
    refs.push_back({d, cov});
  }
  std::stable_sort(refs.begin(), refs.end(),
                   [](const auto& a, const auto& b) { return a.first.time_s < b.first.time_s; });
  std::vector<double> ref_times;
  std::vector<CalibrationCovariance> ref_cov;
  std::vector<Calibration> ref_cal;
  for (const auto& [d, cov] : refs) {
    out.drift.push_back(d);
    Calibration rc;
    rc.pair_detect_rate_per_s = d.pair_detect_rate_per_s;
    rc.visibility = d.visibility;
    ref_cal.push_back(rc);
    ref_times.push_back(d.time_s);
    ref_cov.push_back(cov);
  }
  if (!out.drift.empty()) {
    const DriftPoint& first = out.drift.front();
    for (DriftPoint& d : out.drift) {
      const double dr = d.pair_detect_rate_per_s - first.pair_detect_rate_per_s;
      const double sr = std::hypot(d.pair_detect_rate_sigma, first.pair_detect_rate_sigma);
      const double dv = d.visibility - first.visibility;
      const double sv = std::hypot(d.visibility_sigma, first.visibility_sigma);
      d.drifted = (sr > 0 && std::abs(dr) > 3 * sr) || (sv > 0 && std::abs(dv) > 3 * sv);
    }
  }

  SampleMoments z_moments;
  for (const StepRecord& r : records) {
    const Step& s = plan.steps[r.step];
    if (s.kind != StepKind::measure) continue;
    const EntryNoise model = stats.noise(s.prep_point, s.analysis_point);
    Calibration cal = accidentals(c, model, r);
    const double t = dwell_of(r);
    // The calibration interpolated from the references around the step, and its variance
    // (docs/error-budget.md); without references the rig model's, taken as exact.
    const CalibrationWeights w = calibration_weights(ref_times, 0.5 * (r.start_s + r.end_s));
    cal = interpolated_calibration(cal, w, ref_cal);
    const CalibrationCovariance cal_cov = interpolated_covariance(w, ref_cov);
    SettingCounts counts;
    counts.dwell_s = t;
    counts.pass_counts = r.channel_counts[0];
    for (double x : r.channel_counts) counts.total_counts += x;
    const double kappa = estimate_kernel(c.rig.scheme, photons, cal, counts);
    const double pairs = cal.pair_detect_rate_per_s * t;
    const double p_seen = std::clamp(pass_probability(kappa, cal.visibility, photons), 0.0, 1.0);
    // The same entry at the calibration of its night: with the pass probability seen (sigma of
    // the measured value) and with the predicted one (the z-score's yardstick).
    const EntryNoise seen{p_seen, cal}, predicted{model.p_pass, cal};
    const double sigma = std::sqrt(std::pow(stats.sigma(seen, pairs), 2) +
                                   stats.calibration_variance(seen, cal_cov));
    const double sigma_pred = std::sqrt(std::pow(stats.sigma(predicted, pairs), 2) +
                                        stats.calibration_variance(predicted, cal_cov));
    const double z = (kappa - s.kernel_ideal) / sigma_pred;
    const int a = std::min(s.prep_point, s.analysis_point);
    const int b = std::max(s.prep_point, s.analysis_point);
    Outlier o;
    if (s.block == Block::train) {
      out.gram_measured(a, b) = out.gram_measured(b, a) = kappa;
      out.gram_sigma(a, b) = out.gram_sigma(b, a) = sigma;
      out.gram_z(a, b) = out.gram_z(b, a) = z;
      o.block = Block::train;
      o.row = a;
      o.col = b;
    } else {
      out.test_measured(b - n, a) = kappa;
      out.test_sigma(b - n, a) = sigma;
      out.test_z(b - n, a) = z;
      o.block = Block::test;
      o.row = b - n;
      o.col = a;
    }
    ++out.measured_entries;
    if (std::isfinite(z)) z_moments.add(z);
    if (std::abs(z) > options.outlier_z) {
      o.step = r.step;
      o.measured = kappa;
      o.predicted = s.kernel_ideal;
      o.z = z;
      out.outliers.push_back(o);
    }
  }
  out.z_mean = z_moments.mean();
  out.z_std = z_moments.standard_deviation();
  return out;
}

MeasuredClassifier train_measured_classifier(const Campaign& campaign, const Plan& plan,
                                             const IngestResult& result,
                                             const IngestOptions& options) {
  const Campaign& c = campaign;
  const int n = c.data.train_count();
  MeasuredClassifier out;
  out.keep_unit_diagonal = options.keep_unit_diagonal;
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j)
      out.unmeasured_train += std::isfinite(result.gram_measured(i, j)) ? 0 : 1;
  for (Eigen::Index t = 0; t < result.test_measured.rows(); ++t)
    for (int j = 0; j < n; ++j)
      out.unmeasured_test += std::isfinite(result.test_measured(t, j)) ? 0 : 1;

  out.test_accuracy = kNaN;
  out.ideal_test_accuracy = kNaN;
  if (out.unmeasured_train > 0) {
    out.svm_skipped_reason = std::to_string(out.unmeasured_train) +
                             " training entries are not measured; the classifier needs the "
                             "whole Gram matrix";
    return out;
  }
  Eigen::MatrixXd gram = result.gram_measured;
  out.psd_repaired = repair_psd(gram, options.keep_unit_diagonal);
  try {
    const CChoice choice =
        fixed_or_cross_validated_C(gram, c.data.train_labels, c.check.C, c.check.cv_folds, c.seed);
    out.C = choice.C;
    out.C_from_cross_validation = choice.from_cross_validation;
    SvmOptions o;
    o.C = out.C;
    out.svm = train_svm(gram, c.data.train_labels, o);
    out.svm_trained = true;
    const SvmModel ideal = train_svm(plan.kernel_train, c.data.train_labels, o);
    if (c.data.test_count() > 0) {
      out.ideal_test_accuracy =
          classification_accuracy(ideal.decision(plan.kernel_test), c.data.test_labels);
      if (out.unmeasured_test == 0) {
        out.decision_test = out.svm.decision(result.test_measured);
        out.test_accuracy = classification_accuracy(out.decision_test, c.data.test_labels);
      }
    }
  } catch (const std::invalid_argument& e) {
    out.svm_trained = false;
    out.svm_skipped_reason = std::string("the classifier could not be trained: ") + e.what();
  }
  return out;
}

std::string MeasuredClassifier::report() const {
  std::ostringstream o;
  o.precision(4);
  o << "Unmeasured entries: " << unmeasured_train << " training (i < j), " << unmeasured_test
    << " test\n";
  if (svm_trained) {
    o << "Classifier (C = " << C << (C_from_cross_validation ? " by cross-validation" : "")
      << ") trained on the measured Gram matrix"
      << (psd_repaired ? keep_unit_diagonal
                             ? " after clipping negative eigenvalues"
                             : " after clipping negative eigenvalues (diagonal not restored)"
                       : "")
      << ": " << svm.support.size() << " support vectors, bias " << svm.bias << "\n";
    if (std::isfinite(test_accuracy))
      o << "Test accuracy " << test_accuracy << " measured, " << ideal_test_accuracy
        << " with the ideal kernel\n";
    else if (unmeasured_test > 0)
      o << "Test block incomplete: no test decisions\n";
  } else {
    o << "No classifier: " << svm_skipped_reason << "\n";
  }
  return o.str();
}

std::string IngestResult::report() const {
  std::ostringstream o;
  o.precision(4);
  o << "Measured " << measured_entries << " of " << expected_entries << " entries\n";
  o << "z-scores against the prediction: mean " << z_mean << ", standard deviation " << z_std
    << " (a standard normal gives 0 and 1)\n";
  int drifted = 0;
  for (const DriftPoint& d : drift) drifted += d.drifted ? 1 : 0;
  o << drift.size() << " reference steps; " << drifted << " beyond 3 sigma of the first\n";
  o << "Outliers are entries with |z| above " << options.outlier_z << "\n";
  o << outliers.size() << " outlier entries\n";
  for (const Outlier& x : outliers) {
    o << "  " << to_string(x.block) << " (" << x.row << ", " << x.col << ") step " << x.step
      << ": measured " << x.measured << ", predicted " << x.predicted << ", z " << x.z << "\n";
  }
  return o.str();
}

}  // namespace gramline
