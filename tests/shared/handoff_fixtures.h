#pragma once
// Shared by the hand-off tests of the command line and the app: counts drawn from the rig model
// for a list of steps.
#include <random>
#include <string>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/detection.h"
#include "gramline/ingest.h"
#include "gramline/jones.h"
#include "gramline/plan.h"

namespace handoff_test {

/// Counts of every measure and reference step, drawn from the rig model (detection.h
/// setting_rates, docs/conventions.md): each of the 2^P channels (or the single pass channel) is an
/// independent Poisson count. Independent Poisson channels make the pass count binomial given
/// the total (Poisson splitting, e.g. Feller, An Introduction to Probability Theory, vol. 1).
/// The counting interval is [start_s + move_s, start_s + move_s + dwell_s].
inline std::vector<gramline::StepRecord> simulate_counts(const gramline::Campaign& c,
                                                         const std::vector<gramline::Step>& steps,
                                                         std::uint64_t seed) {
  using namespace gramline;
  std::mt19937_64 rng(seed);
  const int photons = c.encoding.photon_count();
  const int channels = channel_count(c.rig.scheme, photons);
  std::vector<StepRecord> out;
  for (size_t k = 0; k < steps.size(); ++k) {
    const Step& s = steps[k];
    if (s.kind != StepKind::measure && s.kind != StepKind::reference) continue;
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
    const SettingRates rates = setting_rates(c.rig, photons, kappa, overlaps);
    StepRecord r;
    r.step = static_cast<int>(k);
    r.start_s = s.start_s + s.move_s;
    r.end_s = r.start_s + s.dwell_s;
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

}  // namespace handoff_test
