// Source/detector model, kernel estimator and its variance (detection.h), checked against
// counting statistics: expectations derived by hand and Monte Carlo with Poisson and binomial
// counts.
#include <gtest/gtest.h>

#include <cmath>
#include <cstdint>
#include <random>
#include <vector>

#include "gramline/detection.h"
#include "gramline/rig.h"

namespace {

using gramline::Calibration;
using gramline::DetectionScheme;
using gramline::SettingCounts;

gramline::Rig make_rig(int photons) {
  gramline::Rig rig;
  rig.source.pair_rate_per_s = 80000.0;
  rig.source.visibility = 0.97;
  rig.coincidence_window_s = 5e-9;
  const double eff[] = {0.20, 0.25, 0.15, 0.30};
  const double dark[] = {300.0, 500.0, 150.0, 700.0};
  for (int p = 0; p < photons; ++p) {
    gramline::Detector d;
    d.efficiency = eff[p];
    d.dark_rate_per_s = dark[p];
    rig.detectors.push_back(d);
  }
  return rig;
}

// docs/conventions.md: p = V kappa + (1 - V) / 2^P.
TEST(Detection, PassProbabilityGlobalDepolarizing) {
  for (int photons = 1; photons <= 4; ++photons) {
    for (double v : {1.0, 0.97, 0.5, 0.0}) {
      for (double kappa : {0.0, 0.25, 0.8, 1.0}) {
        const double expected = v * kappa + (1.0 - v) / std::pow(2.0, photons);
        EXPECT_NEAR(gramline::pass_probability(kappa, v, photons), expected, 1e-15);
        if (v > 0) {
          EXPECT_NEAR(gramline::kernel_from_pass_probability(expected, v, photons), kappa, 1e-12);
        }
      }
    }
  }
  // Two photons explicitly, as in the README: p = V kappa + (1 - V)/4.
  EXPECT_NEAR(gramline::pass_probability(0.6, 0.9, 2), 0.9 * 0.6 + 0.1 / 4.0, 1e-15);
}

TEST(Detection, TwoPhotonRatesAndAccidentals) {
  const gramline::Rig rig = make_rig(2);
  const double R = rig.source.pair_rate_per_s, V = rig.source.visibility;
  const double tau = rig.coincidence_window_s;
  const std::vector<double> overlaps = {0.7, 0.4};
  const double kappa = overlaps[0] * overlaps[1];
  const gramline::SettingRates r = gramline::setting_rates(rig, 2, kappa, overlaps);

  const double eta_a = rig.detectors[0].efficiency, eta_b = rig.detectors[1].efficiency;
  EXPECT_NEAR(r.p_pass, V * kappa + (1.0 - V) / 4.0, 1e-15);
  EXPECT_NEAR(r.pair_detect_rate_per_s, R * eta_a * eta_b, 1e-9);
  EXPECT_NEAR(gramline::pair_detect_rate_per_s(rig, 2), R * eta_a * eta_b, 1e-9);
  EXPECT_NEAR(r.coincidence_rate_per_s, R * eta_a * eta_b * r.p_pass, 1e-9);

  // Singles of a pass-port detector (common practice): emitted photons that reach it,
  // R eta_p (V kappa_p + (1 - V)/2), plus its dark counts.
  ASSERT_EQ(r.singles_per_s.size(), 2u);
  const double s_a =
      R * eta_a * (V * overlaps[0] + (1.0 - V) / 2.0) + rig.detectors[0].dark_rate_per_s;
  const double s_b =
      R * eta_b * (V * overlaps[1] + (1.0 - V) / 2.0) + rig.detectors[1].dark_rate_per_s;
  EXPECT_NEAR(r.singles_per_s[0], s_a, 1e-9 * s_a);
  EXPECT_NEAR(r.singles_per_s[1], s_b, 1e-9 * s_b);

  // Accidental coincidences of two independent detectors: S_A S_B tau (common practice).
  EXPECT_NEAR(r.accidental_rate_per_s, r.singles_per_s[0] * r.singles_per_s[1] * tau,
              1e-12 * r.accidental_rate_per_s);
  EXPECT_NEAR(r.accidental_rate_per_s, s_a * s_b * tau, 1e-9 * s_a * s_b * tau);
  // All 2^P channels collect at least the pass channel's accidentals.
  EXPECT_GE(r.accidental_total_rate_per_s, r.accidental_rate_per_s);
}

// Without dark counts, and with fail-port detectors like the pass-port ones, the singles of
// both ports of arm p add up to R eta_p, so the all-channel accidentals are
// (R eta_A)(R eta_B) tau (S_A S_B tau summed over the four channels, common practice).
TEST(Detection, AllChannelAccidentalsWithoutDarkCounts) {
  gramline::Rig rig = make_rig(2);
  for (auto& d : rig.detectors) d.dark_rate_per_s = 0.0;
  const std::vector<double> overlaps = {0.3, 0.9};
  const gramline::SettingRates r = gramline::setting_rates(rig, 2, 0.27, overlaps);
  const double R = rig.source.pair_rate_per_s;
  const double expected =
      R * rig.detectors[0].efficiency * R * rig.detectors[1].efficiency * rig.coincidence_window_s;
  EXPECT_NEAR(r.accidental_total_rate_per_s, expected, 1e-9 * expected);
}

TEST(Detection, AccidentalsForOneAndThreePhotons) {
  const gramline::Rig one = make_rig(1);
  EXPECT_EQ(gramline::setting_rates(one, 1, 0.5, {0.5}).accidental_rate_per_s, 0.0);

  const gramline::Rig three = make_rig(3);
  const gramline::SettingRates r =
      gramline::setting_rates(three, 3, 0.5 * 0.8 * 0.9, {0.5, 0.8, 0.9});
  ASSERT_EQ(r.singles_per_s.size(), 3u);
  const double tau = three.coincidence_window_s;
  const double expected = tau * tau * r.singles_per_s[0] * r.singles_per_s[1] * r.singles_per_s[2];
  EXPECT_NEAR(r.accidental_rate_per_s, expected, 1e-12 * expected);
  EXPECT_NEAR(r.p_pass, three.source.visibility * 0.36 + (1.0 - three.source.visibility) / 8.0,
              1e-15);
}

TEST(Detection, ModelCalibrationCarriesRigFigures) {
  const gramline::Rig rig = make_rig(2);
  const gramline::SettingRates r = gramline::setting_rates(rig, 2, 0.42, {0.6, 0.7});
  const Calibration cal = gramline::model_calibration(rig, 2, r);
  EXPECT_NEAR(
      cal.pair_detect_rate_per_s,
      rig.source.pair_rate_per_s * rig.detectors[0].efficiency * rig.detectors[1].efficiency, 1e-9);
  EXPECT_DOUBLE_EQ(cal.visibility, rig.source.visibility);
  EXPECT_NEAR(cal.accidental_pass_rate_per_s, r.accidental_rate_per_s, 1e-15);
  EXPECT_GE(cal.accidental_total_rate_per_s, cal.accidental_pass_rate_per_s);
}

// ---------------------------------------------------------------------------------------------
// Estimator and variance. Counting model (header contract, standard counting statistics):
//  pass_only:  n ~ Poisson((r p + a) t)
//  both_ports: n_tot ~ Poisson((r + a_tot) t), n_pass | n_tot ~ Binomial(n_tot, p_o),
//              p_o = (r p + a_pass) / (r + a_tot)
struct Case {
  int photons;
  double kappa;
  double visibility;
  double r;       // detected pairs per second
  double a_pass;  // accidentals per second in the pass channel
  double a_tot;   // accidentals per second over all channels
  double dwell_s;
};

const std::vector<Case> kCases = {
    {2, 0.05, 0.95, 2000.0, 30.0, 120.0, 5.0}, {2, 0.5, 0.95, 2000.0, 30.0, 120.0, 5.0},
    {2, 0.93, 0.95, 2000.0, 30.0, 120.0, 5.0}, {1, 0.3, 0.9, 5000.0, 0.0, 0.0, 2.0},
    {3, 0.7, 0.85, 400.0, 2.0, 16.0, 20.0},    {2, 0.0, 1.0, 1000.0, 5.0, 20.0, 3.0},
};

Calibration calibration_of(const Case& c) {
  Calibration cal;
  cal.pair_detect_rate_per_s = c.r;
  cal.visibility = c.visibility;
  cal.accidental_pass_rate_per_s = c.a_pass;
  cal.accidental_total_rate_per_s = c.a_tot;
  return cal;
}

double p_of(const Case& c) {
  return c.visibility * c.kappa + (1.0 - c.visibility) / std::pow(2.0, c.photons);
}

// With the counts equal to their expectations, both estimators return kappa exactly.
TEST(Estimator, ExpectedCountsGiveKappa) {
  for (const Case& c : kCases) {
    const double p = p_of(c);
    SettingCounts pass;
    pass.dwell_s = c.dwell_s;
    pass.pass_counts = (c.r * p + c.a_pass) * c.dwell_s;
    EXPECT_NEAR(
        gramline::estimate_kernel(DetectionScheme::pass_only, c.photons, calibration_of(c), pass),
        c.kappa, 1e-12);
    SettingCounts both;
    both.dwell_s = c.dwell_s;
    both.total_counts = (c.r + c.a_tot) * c.dwell_s;
    both.pass_counts = (c.r * p + c.a_pass) * c.dwell_s;
    EXPECT_NEAR(
        gramline::estimate_kernel(DetectionScheme::both_ports, c.photons, calibration_of(c), both),
        c.kappa, 1e-12);
  }
}

// Variance by error propagation from the counting model (exact for pass_only, which is linear
// in a Poisson count; first order in 1/n_tot for both_ports).
TEST(Estimator, VarianceMatchesCountingStatistics) {
  for (const Case& c : kCases) {
    const double p = p_of(c), pairs = c.r * c.dwell_s, V = c.visibility;
    // pass_only: Var n = (r p + a) t; kappa = (n/(r t) - a/r - const)/V.
    const double var_pass = (c.r * p + c.a_pass) * c.dwell_s / std::pow(pairs * V, 2);
    EXPECT_NEAR(gramline::kernel_variance(DetectionScheme::pass_only, c.photons, calibration_of(c),
                                          p, pairs),
                var_pass, 1e-12 * var_pass);
    // both_ports: Var p_obs = p_o (1 - p_o)/n_tot; kappa = (p_obs (r + a_tot)/r - ...)/V.
    const double p_o = (c.r * p + c.a_pass) / (c.r + c.a_tot);
    const double n_tot = (c.r + c.a_tot) * c.dwell_s;
    const double var_both = p_o * (1 - p_o) / n_tot * std::pow((c.r + c.a_tot) / (c.r * V), 2);
    EXPECT_NEAR(gramline::kernel_variance(DetectionScheme::both_ports, c.photons, calibration_of(c),
                                          p, pairs),
                var_both, 1e-12 * var_both + 1e-300);
  }
}

struct SampleStats {
  double mean = 0.0;
  double variance = 0.0;
};

template <typename Draw>
SampleStats simulate(int trials, Draw draw) {
  double sum = 0.0, sum2 = 0.0;
  for (int i = 0; i < trials; ++i) {
    const double k = draw();
    sum += k;
    sum2 += k * k;
  }
  SampleStats s;
  s.mean = sum / trials;
  s.variance = (sum2 - trials * s.mean * s.mean) / (trials - 1);
  return s;
}

// Unbiased within its standard error (4 sigma), and the sample variance agrees with
// kernel_variance within the sampling error of a variance, sqrt(2/(T-1)) relative (4 sigma).
void expect_unbiased(const Case& c, DetectionScheme scheme, std::uint64_t seed) {
  constexpr int kTrials = 20000;
  std::mt19937_64 rng(seed);
  const double p = p_of(c);
  const Calibration cal = calibration_of(c);
  const SampleStats s = simulate(kTrials, [&] {
    SettingCounts counts;
    counts.dwell_s = c.dwell_s;
    if (scheme == DetectionScheme::pass_only) {
      std::poisson_distribution<long long> n((c.r * p + c.a_pass) * c.dwell_s);
      counts.pass_counts = static_cast<double>(n(rng));
    } else {
      std::poisson_distribution<long long> total((c.r + c.a_tot) * c.dwell_s);
      const long long n_tot = total(rng);
      std::binomial_distribution<long long> pass(n_tot, (c.r * p + c.a_pass) / (c.r + c.a_tot));
      counts.total_counts = static_cast<double>(n_tot);
      counts.pass_counts = static_cast<double>(pass(rng));
    }
    return gramline::estimate_kernel(scheme, c.photons, cal, counts);
  });
  const double predicted = gramline::kernel_variance(scheme, c.photons, cal, p, c.r * c.dwell_s);
  const double standard_error = std::sqrt(s.variance / kTrials);
  EXPECT_NEAR(s.mean, c.kappa, 4.0 * standard_error)
      << "photons=" << c.photons << " kappa=" << c.kappa;
  EXPECT_NEAR(s.variance / predicted, 1.0, 4.0 * std::sqrt(2.0 / (kTrials - 1)))
      << "photons=" << c.photons << " kappa=" << c.kappa << " sample " << s.variance
      << " predicted " << predicted;
}

TEST(Estimator, PassOnlyUnbiasedWithPoissonCounts) {
  std::uint64_t seed = 1000;
  for (const Case& c : kCases) expect_unbiased(c, DetectionScheme::pass_only, ++seed);
}

TEST(Estimator, BothPortsUnbiasedWithBinomialCounts) {
  std::uint64_t seed = 2000;
  for (const Case& c : kCases) expect_unbiased(c, DetectionScheme::both_ports, ++seed);
}

// Both-ports with a full multinomial over the 2^P = 4 channels of two photons: the estimator
// only reads the pass channel and the total, so the split of the rest must not matter.
TEST(Estimator, BothPortsUnbiasedWithMultinomialChannels) {
  const Case c = {2, 0.6, 0.9, 1500.0, 10.0, 40.0, 4.0};
  const double p = p_of(c);
  const Calibration cal = calibration_of(c);
  // Real pairs: pass/pass with p, the rest spread over the other three channels; accidentals:
  // a_pass in pass/pass, the rest spread evenly.
  const double rest_real = c.r * (1.0 - p), rest_acc = c.a_tot - c.a_pass;
  const double means[4] = {(c.r * p + c.a_pass) * c.dwell_s,
                           (0.5 * rest_real + rest_acc / 3.0) * c.dwell_s,
                           (0.3 * rest_real + rest_acc / 3.0) * c.dwell_s,
                           (0.2 * rest_real + rest_acc / 3.0) * c.dwell_s};
  std::mt19937_64 rng(31337);
  constexpr int kTrials = 20000;
  const SampleStats s = simulate(kTrials, [&] {
    SettingCounts counts;
    counts.dwell_s = c.dwell_s;
    double total = 0.0;
    for (int ch = 0; ch < 4; ++ch) {
      std::poisson_distribution<long long> n(means[ch]);
      const double k = static_cast<double>(n(rng));
      if (ch == 0) counts.pass_counts = k;
      total += k;
    }
    counts.total_counts = total;
    return gramline::estimate_kernel(DetectionScheme::both_ports, 2, cal, counts);
  });
  EXPECT_NEAR(s.mean, c.kappa, 4.0 * std::sqrt(s.variance / kTrials));
  const double predicted =
      gramline::kernel_variance(DetectionScheme::both_ports, 2, cal, p, c.r * c.dwell_s);
  EXPECT_NEAR(s.variance / predicted, 1.0, 4.0 * std::sqrt(2.0 / (kTrials - 1)));
}

// both_ports uses the information in the fail channels, pass_only does not: for the same
// detected pairs and no accidentals, Var_both = p(1-p)/(n V^2) < Var_pass = p/(n V^2).
TEST(Estimator, BothPortsVarianceSmallerThanPassOnly) {
  const Case c = {2, 0.5, 0.95, 2000.0, 0.0, 0.0, 5.0};
  const double p = p_of(c);
  const double vb =
      gramline::kernel_variance(DetectionScheme::both_ports, 2, calibration_of(c), p, 1e4);
  const double vp =
      gramline::kernel_variance(DetectionScheme::pass_only, 2, calibration_of(c), p, 1e4);
  EXPECT_NEAR(vb / vp, 1.0 - p, 1e-12);
}

}  // namespace
