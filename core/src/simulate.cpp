#include "gramline/simulate.h"

#include <cmath>
#include <random>

#include "gramline/detection.h"
#include "gramline/field_check.h"
#include "gramline/jones.h"

namespace gramline {

void CountSimulationOptions::validate() const {
  FieldCheck("CountSimulationOptions")
      .require(std::isfinite(fade_per_hour) && fade_per_hour >= 0.0 && fade_per_hour < 1.0,
               "fade_per_hour", "at least 0 and below 1")
      .require(std::isfinite(stop_after_s), "stop_after_s", "a finite number")
      .throw_if_failed();
}

std::vector<StepRecord> simulate_counts(const Campaign& c, const std::vector<Step>& steps,
                                        const CountSimulationOptions& options) {
  options.validate();
  std::mt19937_64 rng(options.seed);
  const int photons = c.encoding.photon_count();
  const int channels = channel_count(c.rig.scheme, photons);
  const double first_start_s = steps.empty() ? 0.0 : steps.front().start_s;
  std::vector<StepRecord> out;
  for (size_t k = 0; k < steps.size(); ++k) {
    const Step& s = steps[k];
    if (s.kind != StepKind::measure && s.kind != StepKind::reference) continue;
    StepRecord r;
    r.step = static_cast<int>(k);
    r.start_s = s.start_s + s.move_s;
    r.end_s = r.start_s + s.dwell_s;
    if (options.stop_after_s >= 0.0 && r.end_s > first_start_s + options.stop_after_s) break;
    std::vector<double> overlaps(photons, 1.0);
    if (s.kind == StepKind::measure) {
      const Eigen::VectorXd a = c.data.point(s.prep_point), b = c.data.point(s.analysis_point);
      for (int p = 0; p < photons; ++p) {
        const BlochAngles x = c.encoding.angles(p, a), y = c.encoding.angles(p, b);
        overlaps[p] =
            overlap(bloch_state(x.theta_deg, x.phi_deg), bloch_state(y.theta_deg, y.phi_deg));
      }
    }
    double kappa = 1.0;
    for (double o : overlaps) kappa *= o;
    Rig rig = c.rig;
    if (options.fade_per_hour > 0.0) {
      const double mid_h = 0.5 * (r.start_s + r.end_s) / 3600.0;
      rig.source.pair_rate_per_s *= std::pow(1.0 - options.fade_per_hour, mid_h);
    }
    const SettingRates rates = setting_rates(rig, photons, kappa, overlaps);
    const double t = s.dwell_s;
    r.channel_counts.assign(channels, 0.0);
    const double pass_mean =
        t * (rates.pair_detect_rate_per_s * rates.p_pass + rates.accidental_rate_per_s);
    r.channel_counts[0] = static_cast<double>(std::poisson_distribution<long>(pass_mean)(rng));
    if (channels > 1) {
      const double rest_mean =
          t * (rates.pair_detect_rate_per_s * (1.0 - rates.p_pass) +
               rates.accidental_total_rate_per_s - rates.accidental_rate_per_s);
      for (int ch = 1; ch < channels; ++ch)
        r.channel_counts[ch] =
            static_cast<double>(std::poisson_distribution<long>(rest_mean / (channels - 1))(rng));
    }
    out.push_back(r);
  }
  return out;
}

}  // namespace gramline
