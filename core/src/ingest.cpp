#include "gramline/ingest.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>
#include <stdexcept>

#include "gramline/detection.h"
#include "gramline/jones.h"

namespace gramline {

int channel_count(DetectionScheme scheme, int photons) {
  return scheme == DetectionScheme::both_ports ? (1 << photons) : 1;
}

namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

// Model rates of a step: the accidentals need the per-photon overlaps of its two points.
SettingRates model_rates(const Campaign& c, const Step& s) {
  const int photons = c.encoding.photon_count();
  std::vector<double> overlaps(photons, 1.0);
  double kappa = 1.0;
  if (s.prep_point >= 0 && s.analysis_point >= 0) {
    const Eigen::VectorXd a = c.data.point(s.prep_point);
    const Eigen::VectorXd b = c.data.point(s.analysis_point);
    for (int p = 0; p < photons; ++p) {
      const BlochAngles sa = c.encoding.angles(p, a);
      const BlochAngles sb = c.encoding.angles(p, b);
      overlaps[p] =
          overlap(bloch_state(sa.theta_deg, sa.phi_deg), bloch_state(sb.theta_deg, sb.phi_deg));
      kappa *= overlaps[p];
    }
  }
  return setting_rates(c.rig, photons, kappa, overlaps);
}

// Accidental rates from recorded singles when present (S_A S_B tau, common practice), else
// from the rig model.
Calibration accidentals(const Campaign& c, const SettingRates& model, const StepRecord& r) {
  Calibration cal = model_calibration(c.rig, c.encoding.photon_count(), model);
  if (!r.singles_per_s.empty() && c.encoding.photon_count() >= 2) {
    double a = std::pow(c.rig.coincidence_window_s, c.encoding.photon_count() - 1);
    for (double s : r.singles_per_s) a *= s;
    // Scale the all-channel accidentals by the same measured/model ratio.
    const double ratio = model.accidental_rate_per_s > 0 ? a / model.accidental_rate_per_s : 1.0;
    cal.accidental_pass_rate_per_s = a;
    cal.accidental_total_rate_per_s *= ratio;
  }
  return cal;
}

double dwell_of(const StepRecord& r) { return r.end_s - r.start_s; }

DriftPoint reference_point(const Campaign& c, const Step& s, const StepRecord& r) {
  const int photons = c.encoding.photon_count();
  const double t = dwell_of(r);
  const SettingRates model = model_rates(c, s);
  const Calibration cal = accidentals(c, model, r);
  const double floor = 1.0 / std::ldexp(1.0, photons);  // pass probability of a mixed state
  DriftPoint d;
  d.step = r.step;
  d.time_s = 0.5 * (r.start_s + r.end_s);
  const double n_pass = r.channel_counts.at(0);
  if (c.rig.scheme == DetectionScheme::both_ports) {
    double n_total = 0.0;
    for (double n : r.channel_counts) n_total += n;
    const double rate = (n_total - cal.accidental_total_rate_per_s * t) / t;
    d.pair_detect_rate_per_s = rate;
    d.pair_detect_rate_sigma = std::sqrt(n_total) / t;
    const double p_obs = n_total > 0 ? n_pass / n_total : kNaN;
    const double p =
        (p_obs * (rate + cal.accidental_total_rate_per_s) - cal.accidental_pass_rate_per_s) / rate;
    // A reference has kernel 1, so p = V + (1 - V) / 2^P.
    d.visibility = (p - floor) / (1.0 - floor);
    d.visibility_sigma = std::sqrt(p_obs * (1.0 - p_obs) / n_total) *
                         (rate + cal.accidental_total_rate_per_s) / rate / (1.0 - floor);
  } else {
    // One channel cannot separate rate and visibility: take V from the rig model.
    d.visibility = c.rig.source.visibility;
    const double p_ref = pass_probability(1.0, d.visibility, photons);
    d.pair_detect_rate_per_s = (n_pass / t - cal.accidental_pass_rate_per_s) / p_ref;
    d.pair_detect_rate_sigma = std::sqrt(n_pass) / t / p_ref;
  }
  return d;
}

// Linear interpolation of the reference calibrations at time t (nearest outside their span).
void interpolate(const std::vector<DriftPoint>& refs, double t, double& rate, double& v) {
  if (t <= refs.front().time_s) {
    rate = refs.front().pair_detect_rate_per_s;
    v = refs.front().visibility;
    return;
  }
  if (t >= refs.back().time_s) {
    rate = refs.back().pair_detect_rate_per_s;
    v = refs.back().visibility;
    return;
  }
  const auto hi = std::upper_bound(refs.begin(), refs.end(), t,
                                   [](double x, const DriftPoint& d) { return x < d.time_s; });
  const auto lo = hi - 1;
  const double w = (t - lo->time_s) / (hi->time_s - lo->time_s);
  rate = (1 - w) * lo->pair_detect_rate_per_s + w * hi->pair_detect_rate_per_s;
  v = (1 - w) * lo->visibility + w * hi->visibility;
}

}  // namespace

IngestResult ingest_records(const Campaign& campaign, const Plan& plan,
                            const std::vector<StepRecord>& records, const IngestOptions& options) {
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

  IngestResult out;
  out.gram_measured = Eigen::MatrixXd::Constant(n, n, kNaN);
  out.gram_measured.diagonal().setOnes();
  out.gram_sigma = Eigen::MatrixXd::Zero(n, n);
  out.test_measured = Eigen::MatrixXd::Constant(m, n, kNaN);
  out.test_sigma = Eigen::MatrixXd::Zero(m, n);
  out.gram_z = Eigen::MatrixXd::Constant(n, n, kNaN);
  out.test_z = Eigen::MatrixXd::Constant(m, n, kNaN);
  out.expected_entries = static_cast<int>(plan.summary.settings);

  for (const StepRecord& r : records) {
    const Step& s = plan.steps[r.step];
    if (s.kind == StepKind::reference) out.drift.push_back(reference_point(c, s, r));
  }
  std::sort(out.drift.begin(), out.drift.end(),
            [](const DriftPoint& a, const DriftPoint& b) { return a.time_s < b.time_s; });
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

  double z_sum = 0.0, z_sq = 0.0;
  int z_count = 0;
  for (const StepRecord& r : records) {
    const Step& s = plan.steps[r.step];
    if (s.kind != StepKind::measure) continue;
    const SettingRates model = model_rates(c, s);
    Calibration cal = accidentals(c, model, r);
    const double t = dwell_of(r);
    if (!out.drift.empty())
      interpolate(out.drift, 0.5 * (r.start_s + r.end_s), cal.pair_detect_rate_per_s,
                  cal.visibility);
    SettingCounts counts;
    counts.dwell_s = t;
    counts.pass_counts = r.channel_counts[0];
    for (double x : r.channel_counts) counts.total_counts += x;
    const double kappa = estimate_kernel(c.rig.scheme, photons, cal, counts);
    const double pairs = cal.pair_detect_rate_per_s * t;
    const double p_seen = std::clamp(pass_probability(kappa, cal.visibility, photons), 0.0, 1.0);
    const double sigma = std::sqrt(kernel_variance(c.rig.scheme, photons, cal, p_seen, pairs));
    const double sigma_pred =
        std::sqrt(kernel_variance(c.rig.scheme, photons, cal, model.p_pass, pairs));
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
    if (std::isfinite(z)) {
      z_sum += z;
      z_sq += z * z;
      ++z_count;
    }
    if (std::abs(z) > options.outlier_z) {
      o.step = r.step;
      o.measured = kappa;
      o.predicted = s.kernel_ideal;
      o.z = z;
      out.outliers.push_back(o);
    }
  }
  if (z_count > 0) {
    out.z_mean = z_sum / z_count;
    out.z_std =
        z_count > 1
            ? std::sqrt(std::max(0.0, (z_sq - z_count * out.z_mean * out.z_mean) / (z_count - 1)))
            : 0.0;
  }
  return out;
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
  o << outliers.size() << " outlier entries\n";
  for (const Outlier& x : outliers) {
    o << "  " << to_string(x.block) << " (" << x.row << ", " << x.col << ") step " << x.step
      << ": measured " << x.measured << ", predicted " << x.predicted << ", z " << x.z << "\n";
  }
  return o.str();
}

}  // namespace gramline
