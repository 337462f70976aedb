// Shot budget (budget.h) against Boost.Math (normal quantile, incomplete-beta inverse, binomial
// Clopper-Pearson bounds), Wilson's and Hoeffding's published formulas, and a units sanity check.
#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/distributions/binomial.hpp>
#include <boost/math/distributions/normal.hpp>
#include <boost/math/special_functions/beta.hpp>
#include <cmath>
#include <random>
#include <string>
#include <vector>

#include "gramline/budget.h"
#include "gramline/detection.h"
#include "gramline/motion.h"
#include "gramline/rig.h"

namespace {

using gramline::BudgetMethod;
using gramline::BudgetOptions;
using gramline::DetectionScheme;
using gramline::EntryModel;

// Two-sided standard normal quantile from Boost.Math: z = Phi^{-1}(1 - delta/2).
double boost_z(double confidence) {
  const boost::math::normal_distribution<double> standard(0.0, 1.0);
  return boost::math::quantile(standard, 1.0 - (1.0 - confidence) / 2.0);
}

struct Bounds {
  double low, high;
};

// Wilson (1927) score interval: centre (p + z^2/2n)/(1 + z^2/n), half-width
// z/(1 + z^2/n) sqrt(p(1-p)/n + z^2/(4 n^2)), z from Boost's normal quantile.
Bounds reference_wilson(double k, double n, double confidence) {
  const double z = boost_z(confidence), p = k / n, z2 = z * z;
  const double centre = (p + z2 / (2 * n)) / (1 + z2 / n);
  const double half = z / (1 + z2 / n) * std::sqrt(p * (1 - p) / n + z2 / (4 * n * n));
  return {centre - half, centre + half};
}

// Exact (Clopper-Pearson 1934) bounds as inverse incomplete beta functions (Boost.Math
// documentation, binomial distribution, "find_lower_bound_on_p"):
// low = I^{-1}_{alpha/2}(k, n - k + 1), high = I^{-1}_{1 - alpha/2}(k + 1, n - k).
Bounds clopper_pearson_ibeta(double k, double n, double confidence) {
  const double alpha = 1.0 - confidence;
  const double low = k == 0 ? 0.0 : boost::math::ibeta_inv(k, n - k + 1, alpha / 2);
  const double high = k == n ? 1.0 : boost::math::ibeta_inv(k + 1, n - k, 1.0 - alpha / 2);
  return {low, high};
}

Bounds clopper_pearson_binomial(double k, double n, double confidence) {
  using B = boost::math::binomial_distribution<double>;
  const double alpha = 1.0 - confidence;
  return {B::find_lower_bound_on_p(n, k, alpha / 2), B::find_upper_bound_on_p(n, k, alpha / 2)};
}

EntryModel both_ports_entry(double p, double v = 1.0) {
  EntryModel e;
  e.scheme = DetectionScheme::both_ports;
  e.photons = 2;
  e.p_pass = p;
  e.visibility = v;
  return e;
}

BudgetOptions options(BudgetMethod m, double eps, double confidence, bool worst = false) {
  BudgetOptions o;
  o.method = m;
  o.epsilon = eps;
  o.confidence = confidence;
  o.worst_case = worst;
  return o;
}

// "Smallest number of detected pairs meeting the target": the result is the first integer at or
// above the continuous requirement.
void expect_smallest_integer_above(double got, double requirement) {
  EXPECT_GE(got, requirement * (1 - 1e-12)) << "requirement " << requirement;
  EXPECT_LT(got, requirement + 1.0 + 1e-9) << "requirement " << requirement;
  EXPECT_EQ(got, std::floor(got)) << "pairs should be a whole number";
}

TEST(Budget, NormalQuantileMatchesBoost) {
  for (double c : {0.5, 0.8, 0.9, 0.95, 0.99, 0.999, 0.999999}) {
    EXPECT_NEAR(gramline::normal_quantile_two_sided(c), boost_z(c), 1e-9 * boost_z(c)) << c;
  }
  // Common practice: z = 1.959964 for 95 %, 2.575829 for 99 %.
  EXPECT_NEAR(gramline::normal_quantile_two_sided(0.95), 1.959964, 1e-6);
  EXPECT_NEAR(gramline::normal_quantile_two_sided(0.99), 2.575829, 1e-6);
}

TEST(Budget, WilsonIntervalMatchesBoostBasedFormula) {
  const std::vector<std::pair<double, double>> cases = {
      {0, 10},   {1, 10},     {5, 10},     {10, 10},        {3, 50},
      {37, 120}, {500, 1000}, {1, 100000}, {99999, 100000}, {123456, 1000000}};
  for (double conf : {0.9, 0.95, 0.99}) {
    for (const auto& [k, n] : cases) {
      const Bounds ref = reference_wilson(k, n, conf);
      const gramline::Interval got = gramline::wilson_interval(k, n, conf);
      EXPECT_NEAR(got.low, ref.low, 1e-12) << k << "/" << n << " @" << conf;
      EXPECT_NEAR(got.high, ref.high, 1e-12) << k << "/" << n << " @" << conf;
      EXPECT_LE(got.low, k / n + 1e-15);
      EXPECT_GE(got.high, k / n - 1e-15);
      EXPECT_GE(got.low, -1e-15);
      EXPECT_LE(got.high, 1 + 1e-15);
    }
  }
  // Edge cases by hand: k = 0 gives low = 0, k = n gives high = 1 (the score interval touches
  // the boundary).
  EXPECT_NEAR(gramline::wilson_interval(0, 25, 0.95).low, 0.0, 1e-15);
  EXPECT_NEAR(gramline::wilson_interval(25, 25, 0.95).high, 1.0, 1e-15);
}

// The two Boost routes to the exact bounds agree (checks our reading of the Boost docs).
TEST(Budget, ClopperPearsonReferencesAgree) {
  for (const auto& [k, n] : std::vector<std::pair<double, double>>{
           {0, 20}, {1, 20}, {7, 20}, {20, 20}, {300, 1000}, {4999, 10000}}) {
    const Bounds a = clopper_pearson_ibeta(k, n, 0.95);
    const Bounds b = clopper_pearson_binomial(k, n, 0.95);
    EXPECT_NEAR(a.low, b.low, 1e-12);
    EXPECT_NEAR(a.high, b.high, 1e-12);
  }
}

// Large n: Wilson and exact intervals have the same width to a few per cent (both tend to
// the normal interval); Wilson is known to be somewhat narrower than the conservative exact
// interval (common practice; Brown, Cai and DasGupta, Stat. Sci. 16 (2001), from memory).
TEST(Budget, WilsonAgreesWithClopperPearsonForLargeN) {
  for (double n : {1e4, 1e5}) {
    for (double frac : {0.05, 0.3, 0.5, 0.9}) {
      const double k = std::round(frac * n);
      const gramline::Interval w = gramline::wilson_interval(k, n, 0.95);
      const Bounds cp = clopper_pearson_ibeta(k, n, 0.95);
      const double ratio = (w.high - w.low) / (cp.high - cp.low);
      EXPECT_NEAR(ratio, 1.0, 0.03) << k << "/" << n;
      EXPECT_LE(ratio, 1.0 + 1e-9) << k << "/" << n;
      EXPECT_NEAR(w.low, cp.low, 0.03 * (cp.high - cp.low));
      EXPECT_NEAR(w.high, cp.high, 0.03 * (cp.high - cp.low));
    }
  }
}

// Exact coverage of the Wilson interval, summed over the binomial distribution (Boost pdf):
// close to nominal for moderate n (Brown, Cai and DasGupta 2001, from memory).
TEST(Budget, WilsonCoverageNearNominal) {
  const double n = 400;
  for (double p : {0.1, 0.3, 0.5, 0.8}) {
    const boost::math::binomial_distribution<double> dist(n, p);
    double coverage = 0.0;
    for (int k = 0; k <= n; ++k) {
      const gramline::Interval w = gramline::wilson_interval(k, n, 0.95);
      if (w.low <= p && p <= w.high) coverage += boost::math::pdf(dist, k);
    }
    EXPECT_NEAR(coverage, 0.95, 0.02) << "p=" << p;
  }
}

// Hoeffding, J. Am. Stat. Assoc. 58 (1963): for n samples in [0, 1],
// P(|mean - mu| >= t) <= 2 exp(-2 n t^2), so n >= ln(2/delta)/(2 t^2); with visibility V the
// kernel error eps needs t = eps V.
TEST(Budget, HoeffdingSampleSize) {
  for (double eps : {0.005, 0.01, 0.02, 0.05}) {
    for (double delta : {0.1, 0.05, 0.01, 0.001}) {
      for (double p : {0.1, 0.5}) {
        const double n_ref = std::log(2.0 / delta) / (2.0 * eps * eps);
        const double got = gramline::pairs_for_precision(
            both_ports_entry(p), options(BudgetMethod::hoeffding, eps, 1.0 - delta));
        expect_smallest_integer_above(got, n_ref);
      }
      const double v = 0.8;
      const double n_ref_v = std::log(2.0 / delta) / (2.0 * eps * eps * v * v);
      expect_smallest_integer_above(
          gramline::pairs_for_precision(both_ports_entry(0.3, v),
                                        options(BudgetMethod::hoeffding, eps, 1.0 - delta)),
          n_ref_v);
    }
  }
  // Inverse of the same inequality: eps = sqrt(ln(2/delta)/(2 n)) / V.
  const double n = 12345;
  EXPECT_NEAR(gramline::precision_for_pairs(both_ports_entry(0.4, 0.9), n,
                                            options(BudgetMethod::hoeffding, 0.02, 0.95)),
              std::sqrt(std::log(2.0 / 0.05) / (2.0 * n)) / 0.9, 1e-12);
}

// A Poisson count n of mean mu obeys Bernstein's inequality
// P(|n - mu| >= x) <= 2 exp(-x^2 / (2 (mu + x/3))) (Boucheron, Lugosi & Massart, Concentration
// Inequalities, 2013, sec. 2.2 and 2.8; from memory). The pass port's distribution-free budget
// is the smallest pairs with x = eps V pairs meeting it at mu = pairs (p + a/r):
// pairs = 2 ln(2/delta) (p + a/r + eps V/3) / (eps V)^2.
TEST(Budget, PassPortDistributionFreeSampleSize) {
  for (double eps : {0.005, 0.02}) {
    for (double delta : {0.05, 0.001}) {
      for (double p : {0.1, 0.9}) {
        EntryModel e = both_ports_entry(p, 0.9);
        e.scheme = DetectionScheme::pass_only;
        e.accidental_ratio = 0.01;
        const double w = eps * 0.9;
        const double n_ref = 2 * std::log(2 / delta) * (p + 0.01 + w / 3) / (w * w);
        const double got =
            gramline::pairs_for_precision(e, options(BudgetMethod::hoeffding, eps, 1 - delta));
        expect_smallest_integer_above(got, n_ref);
        // The inverse: at n_ref the bound's x equals eps V n_ref.
        EXPECT_NEAR(gramline::precision_for_pairs(e, n_ref,
                                                  options(BudgetMethod::hoeffding, eps, 1 - delta)),
                    eps, 1e-12);
      }
    }
  }
}

// Normal approximation (common practice): n = z^2 p (1 - p) / eps^2 for a binomial fraction,
// z from Boost's normal quantile; worst case p = 1/2.
TEST(Budget, NormalApproximationSampleSize) {
  for (double eps : {0.01, 0.02, 0.05}) {
    for (double conf : {0.9, 0.95, 0.99}) {
      const double z = boost_z(conf);
      for (double p : {0.05, 0.3, 0.5, 0.85}) {
        expect_smallest_integer_above(
            gramline::pairs_for_precision(both_ports_entry(p),
                                          options(BudgetMethod::normal, eps, conf)),
            z * z * p * (1 - p) / (eps * eps));
      }
      expect_smallest_integer_above(
          gramline::pairs_for_precision(both_ports_entry(0.1),
                                        options(BudgetMethod::normal, eps, conf, true)),
          z * z * 0.25 / (eps * eps));
    }
  }
}

// Variance per pair from counting statistics (see test_detection.cpp for the derivation):
// pass_only (p + a/r)/V^2, both_ports p_o (1 - p_o)(1 + a_tot/r)/V^2, p_o = (p + a/r)/(1 +
// a_tot/r).
TEST(Budget, EntryVarianceMatchesCountingStatistics) {
  EntryModel pass = both_ports_entry(0.4, 0.9);
  pass.scheme = DetectionScheme::pass_only;
  pass.accidental_ratio = 0.02;
  EXPECT_NEAR(gramline::entry_variance_per_pair(pass, false), (0.4 + 0.02) / 0.81, 1e-12);

  EntryModel both = both_ports_entry(0.4, 0.9);
  both.accidental_ratio = 0.02;
  both.accidental_total_ratio = 0.05;
  const double p_o = (0.4 + 0.02) / 1.05;
  EXPECT_NEAR(gramline::entry_variance_per_pair(both, false), p_o * (1 - p_o) * 1.05 / 0.81, 1e-12);

  // Same figure as kernel_variance (one formula, one place) for r = 1000 pairs/s.
  gramline::Calibration cal;
  cal.pair_detect_rate_per_s = 1000.0;
  cal.visibility = 0.9;
  cal.accidental_pass_rate_per_s = 20.0;
  cal.accidental_total_rate_per_s = 50.0;
  EXPECT_NEAR(gramline::entry_variance_per_pair(both, false) / 5000.0,
              gramline::kernel_variance(DetectionScheme::both_ports, 2, cal, 0.4, 5000.0), 1e-15);
  EXPECT_NEAR(gramline::entry_variance_per_pair(pass, false) / 5000.0,
              gramline::kernel_variance(DetectionScheme::pass_only, 2, cal, 0.4, 5000.0), 1e-15);

  // Normal budget with this variance: n = z^2 var1 / eps^2.
  const double z = boost_z(0.95);
  expect_smallest_integer_above(
      gramline::pairs_for_precision(pass, options(BudgetMethod::normal, 0.02, 0.95)),
      z * z * (0.42 / 0.81) / (0.02 * 0.02));
}

// Wilson budget: the half-width of the Wilson interval at p_hat = p with the budgeted pairs
// reaches eps, and the exact interval there is as wide to a few per cent.
TEST(Budget, WilsonBudgetConsistentWithBoostIntervals) {
  for (double p : {0.1, 0.3, 0.5}) {
    const double eps = 0.01;
    const double n = gramline::pairs_for_precision(both_ports_entry(p),
                                                   options(BudgetMethod::wilson, eps, 0.95));
    const Bounds w = reference_wilson(p * n, n, 0.95);
    EXPECT_NEAR((w.high - w.low) / 2, eps, 0.02 * eps) << "p=" << p << " n=" << n;
    const Bounds cp = clopper_pearson_ibeta(std::round(p * n), n, 0.95);
    EXPECT_NEAR((cp.high - cp.low) / 2, eps, 0.04 * eps) << "p=" << p << " n=" << n;
    // For large n it is within a few per cent of the normal-approximation size.
    const double z = boost_z(0.95);
    EXPECT_NEAR(n / (z * z * p * (1 - p) / (eps * eps)), 1.0, 0.03) << "p=" << p;
    EXPECT_NEAR(gramline::precision_for_pairs(both_ports_entry(p), n,
                                              options(BudgetMethod::wilson, eps, 0.95)),
                (w.high - w.low) / 2, 0.02 * eps);
  }
}

// precision_for_pairs inverts pairs_for_precision: the budget meets eps, one pair fewer does
// not, and more pairs never give a worse precision.
TEST(Budget, PrecisionForPairsIsTheInverse) {
  std::vector<EntryModel> entries = {both_ports_entry(0.5), both_ports_entry(0.07, 0.95),
                                     both_ports_entry(0.93, 0.9)};
  EntryModel pass = both_ports_entry(0.4, 0.97);
  pass.scheme = DetectionScheme::pass_only;
  pass.accidental_ratio = 0.01;
  entries.push_back(pass);
  EntryModel noisy = both_ports_entry(0.3, 0.9);
  noisy.accidental_ratio = 0.01;
  noisy.accidental_total_ratio = 0.04;
  entries.push_back(noisy);
  for (BudgetMethod m : {BudgetMethod::normal, BudgetMethod::wilson, BudgetMethod::hoeffding}) {
    for (const EntryModel& e : entries) {
      for (double eps : {0.005, 0.02, 0.1}) {
        for (bool worst : {false, true}) {
          const BudgetOptions o = options(m, eps, 0.95, worst);
          const double n = gramline::pairs_for_precision(e, o);
          SCOPED_TRACE(gramline::to_string(m) + " eps=" + std::to_string(eps) +
                       " p=" + std::to_string(e.p_pass) + " worst=" + std::to_string(worst));
          EXPECT_GE(n, 1.0);
          EXPECT_LE(gramline::precision_for_pairs(e, n, o), eps * (1 + 1e-9));
          if (n > 1) {
            EXPECT_GT(gramline::precision_for_pairs(e, n - 1, o), eps);
          }
          double previous = gramline::precision_for_pairs(e, 1.0, o);
          for (double k = 2; k < 1e7; k *= 1.7) {
            const double now = gramline::precision_for_pairs(e, k, o);
            EXPECT_LE(now, previous * (1 + 1e-12)) << "pairs " << k;
            previous = now;
          }
        }
      }
    }
  }
}

// The worst case never needs fewer pairs than the predicted p.
TEST(Budget, WorstCaseNeedsAtLeastAsManyPairs) {
  for (BudgetMethod m : {BudgetMethod::normal, BudgetMethod::wilson}) {
    for (double p : {0.02, 0.2, 0.5, 0.7, 0.99}) {
      const double predicted =
          gramline::pairs_for_precision(both_ports_entry(p), options(m, 0.01, 0.95, false));
      const double worst =
          gramline::pairs_for_precision(both_ports_entry(p), options(m, 0.01, 0.95, true));
      EXPECT_GE(worst, predicted) << "p=" << p;
    }
  }
}

EntryModel scheme_entry(DetectionScheme scheme, int photons, double v, double kappa,
                        double accidental = 0.0, double accidental_total = 0.0) {
  EntryModel e;
  e.scheme = scheme;
  e.photons = photons;
  e.visibility = v;
  // Global depolarizing model of docs/conventions.md: p = V kappa + (1 - V)/2^P.
  e.p_pass = v * kappa + (1 - v) / std::pow(2.0, photons);
  e.accidental_ratio = accidental;
  e.accidental_total_ratio = accidental_total;
  return e;
}

// The worst case is the worst over the pass probabilities the scheme can produce, kernels in
// [0, 1]: the worst-case pairs meet the target at every kernel of a fine grid, and are no more
// than the largest need on that grid (the pass port's Poisson variance (p + a/r)/V^2 peaks at
// kappa = 1, the binomial one where the observed fraction is nearest 1/2).
TEST(Budget, WorstCaseCoversEveryKernelOfTheScheme) {
  for (DetectionScheme scheme : {DetectionScheme::pass_only, DetectionScheme::both_ports}) {
    for (int photons : {1, 2, 3}) {
      for (double v : {0.97, 0.8}) {
        for (double acc : {0.0, 0.01}) {
          for (BudgetMethod m :
               {BudgetMethod::normal, BudgetMethod::wilson, BudgetMethod::hoeffding}) {
            SCOPED_TRACE(gramline::to_string(m) + " " + gramline::to_string(scheme) +
                         " P=" + std::to_string(photons) + " V=" + std::to_string(v) +
                         " a/r=" + std::to_string(acc));
            const double eps = 0.01;
            const EntryModel any = scheme_entry(scheme, photons, v, 0.3, acc, 4 * acc);
            const double worst = gramline::pairs_for_precision(any, options(m, eps, 0.95, true));
            double largest_need = 0.0, largest_half_width = 0.0;
            for (int k = 0; k <= 1000; ++k) {
              const EntryModel e = scheme_entry(scheme, photons, v, k / 1000.0, acc, 4 * acc);
              largest_need =
                  std::max(largest_need, gramline::pairs_for_precision(e, options(m, eps, 0.95)));
              largest_half_width =
                  std::max(largest_half_width,
                           gramline::precision_for_pairs(e, worst, options(m, eps, 0.95)));
            }
            EXPECT_LE(largest_half_width, eps * (1 + 1e-9));
            EXPECT_LE(worst, largest_need + 1.0);
            EXPECT_GE(worst, largest_need);
          }
        }
      }
    }
  }
  // Hoeffding's bound for both ports does not depend on p: worst case and predicted p need the
  // same pairs.
  const EntryModel e = scheme_entry(DetectionScheme::both_ports, 1, 0.97, 0.999);
  EXPECT_EQ(gramline::pairs_for_precision(e, options(BudgetMethod::hoeffding, 0.01, 0.95, true)),
            gramline::pairs_for_precision(e, options(BudgetMethod::hoeffding, 0.01, 0.95)));
}

// One photon, pass port only, V = 0.97, eps = 0.01 at 95 %, normal method: p = 1/2 would give
// z^2 0.5 / (eps V)^2 = 20414 pairs, whose true half-width at kappa = 0.999
// (p = 0.97 * 0.999 + 0.015 = 0.98403) is z sqrt(p / 20414) / V = 0.0140. The worst case of
// the scheme is p = V + (1 - V)/2 = 0.985: z^2 0.985 / (eps V)^2 pairs.
TEST(Budget, PassPortWorstCaseIsTheTopOfTheRange) {
  const double z = boost_z(0.95);
  const EntryModel e = scheme_entry(DetectionScheme::pass_only, 1, 0.97, 0.999);
  EXPECT_NEAR(z * z * 0.5 / (0.01 * 0.01 * 0.97 * 0.97), 20413.75, 0.01);
  EXPECT_NEAR(gramline::precision_for_pairs(e, 20414, options(BudgetMethod::normal, 0.01, 0.95)),
              0.0140, 5e-5);
  EXPECT_NEAR(gramline::worst_case_pass_probability(e), 0.985, 1e-15);
  expect_smallest_integer_above(
      gramline::pairs_for_precision(e, options(BudgetMethod::normal, 0.01, 0.95, true)),
      z * z * 0.985 / (0.01 * 0.01 * 0.97 * 0.97));
  // Both ports without accidentals: p_o = p, worst at p = 1/2, inside [(1 - V)/2, V + (1 - V)/2].
  EntryModel b = e;
  b.scheme = DetectionScheme::both_ports;
  EXPECT_NEAR(gramline::worst_case_pass_probability(b), 0.5, 1e-15);
  // Both ports with a visibility so low that 1/2 is out of reach for three photons? The range
  // is [(1 - V)/8, V + (1 - V)/8], which holds 1/2 for every V > 4/7: at V = 0.4 the top,
  // 0.475, is the worst.
  b.photons = 3;
  b.visibility = 0.4;
  EXPECT_NEAR(gramline::worst_case_pass_probability(b), 0.4 + 0.6 / 8, 1e-15);
}

// Seeded simulation of the counts the worst-case budget implies, at the kernels where the
// scheme is least favourable (pass port: kappa = 1 and 0.999; both ports: kappa near 1/2):
// pass port, Poisson n with mean pairs (p + a/r), kappa_hat = (n / pairs - a/r - (1 - V)/2^P)/V;
// both ports, binomial pass count out of n_total = pairs (1 + a_tot/r) with
// p_o = (p + a/r)/(1 + a_tot/r), kappa_hat = (p_hat_o (1 + a_tot/r) - a/r - (1 - V)/2^P)/V
// (README, user guide step 6). The share of estimates within eps of the truth must reach the
// confidence (95 %) within three standard errors of the simulation, and for the normal method
// z times the spread of the estimates must match the half-width the budget reports at that
// entry's own p (within three standard errors of a standard deviation, 1/sqrt(2T)).
TEST(Budget, WorstCaseBudgetCoversSimulatedCounts) {
  const int trials = 4000;
  const double eps = 0.01, z = boost_z(0.95);
  const double coverage_floor = 0.95 - 3 * std::sqrt(0.95 * 0.05 / trials);
  std::mt19937_64 rng(2024);
  struct Case {
    DetectionScheme scheme;
    int photons;
    double v, kappa, acc, acc_total;
  };
  for (const Case& c : std::vector<Case>{{DetectionScheme::pass_only, 1, 0.97, 0.999, 0, 0},
                                         {DetectionScheme::pass_only, 2, 0.9, 1.0, 0.01, 0.04},
                                         {DetectionScheme::both_ports, 2, 0.97, 0.5, 0.0, 0.0},
                                         {DetectionScheme::both_ports, 2, 0.9, 0.45, 0.01, 0.04}}) {
    const EntryModel e = scheme_entry(c.scheme, c.photons, c.v, c.kappa, c.acc, c.acc_total);
    const double floor = (1 - c.v) / std::pow(2.0, c.photons);
    for (BudgetMethod m : {BudgetMethod::normal, BudgetMethod::wilson, BudgetMethod::hoeffding}) {
      SCOPED_TRACE(gramline::to_string(m) + " " + gramline::to_string(c.scheme) +
                   " kappa=" + std::to_string(c.kappa));
      const double pairs = gramline::pairs_for_precision(e, options(m, eps, 0.95, true));
      int inside = 0;
      double sum = 0.0, sum_sq = 0.0;
      for (int t = 0; t < trials; ++t) {
        double kappa_hat;
        if (c.scheme == DetectionScheme::pass_only) {
          std::poisson_distribution<long long> count(pairs * (e.p_pass + c.acc));
          kappa_hat = (static_cast<double>(count(rng)) / pairs - c.acc - floor) / c.v;
        } else {
          const long long total = std::llround(pairs * (1 + c.acc_total));
          std::binomial_distribution<long long> pass(total, (e.p_pass + c.acc) / (1 + c.acc_total));
          const double p_o = static_cast<double>(pass(rng)) / static_cast<double>(total);
          kappa_hat = (p_o * (1 + c.acc_total) - c.acc - floor) / c.v;
        }
        if (std::abs(kappa_hat - c.kappa) <= eps) ++inside;
        sum += kappa_hat;
        sum_sq += kappa_hat * kappa_hat;
      }
      EXPECT_GE(static_cast<double>(inside) / trials, coverage_floor) << pairs << " pairs";
      if (m == BudgetMethod::normal) {
        const double sd = std::sqrt((sum_sq - sum * sum / trials) / (trials - 1));
        const double promised = gramline::precision_for_pairs(e, pairs, options(m, eps, 0.95));
        EXPECT_NEAR(z * sd / promised, 1.0, 3.0 / std::sqrt(2.0 * trials));
        EXPECT_LE(promised, eps * (1 + 1e-9));
      }
    }
  }
}

TEST(Budget, MethodNamesRoundTrip) {
  for (BudgetMethod m : {BudgetMethod::normal, BudgetMethod::wilson, BudgetMethod::hoeffding}) {
    BudgetMethod back = BudgetMethod::normal;
    ASSERT_TRUE(gramline::from_string(gramline::to_string(m), back));
    EXPECT_EQ(back, m);
  }
  BudgetMethod out;
  EXPECT_FALSE(gramline::from_string(std::string("bogus"), out));
}

// Rule of thumb (common practice): a rig needing about 10 s per setting spends about 10^4 s on
// 10^3 settings. A sanity check of units: pairs / (pairs per second) = seconds, and a step's
// move time from the model of docs/motion-model.md adds seconds, not milliseconds or minutes.
TEST(Budget, RuleOfThumbTenSecondsPerSetting) {
  gramline::Rig rig;
  rig.source.pair_rate_per_s = 50000.0;
  rig.source.visibility = 0.98;
  for (int p = 0; p < 2; ++p) rig.detectors.push_back(gramline::Detector{0.2, 100.0});
  const double r = gramline::pair_detect_rate_per_s(rig, 2);
  ASSERT_NEAR(r, 50000.0 * 0.2 * 0.2, 1e-9);  // 2000 detected pairs per second

  // eps = 0.007 at 95 % with p = 1/2 needs z^2/(4 eps^2) = 19600 pairs: about 10 s at 2000/s.
  const double pairs = gramline::pairs_for_precision(both_ports_entry(0.5),
                                                     options(BudgetMethod::normal, 0.007, 0.95));
  const double dwell_s = pairs / r;
  EXPECT_NEAR(dwell_s, 9.8, 0.1);

  for (int p = 0; p < 2; ++p) {
    for (gramline::Stage s : {gramline::Stage::prep, gramline::Stage::analysis}) {
      for (gramline::Plate pl : {gramline::Plate::HWP, gramline::Plate::QWP}) {
        gramline::Motor m;
        m.photon = p;
        m.stage = s;
        m.plate = pl;
        m.speed_deg_per_s = 15.0;
        m.accel_deg_per_s2 = 30.0;
        rig.motors.push_back(m);
      }
    }
  }
  rig.controller.moves = gramline::MoveMode::simultaneous;
  rig.controller.settle_s = 0.5;
  rig.controller.overhead_s = 0.1;
  // By hand (docs/motion-model.md): d = 20 >= v^2/a = 7.5, so T = 20/15 + 15/30 = 1.8333 s; plus
  // settle 0.5 and overhead 0.1.
  const std::vector<double> from(8, 0.0), to(8, 20.0);
  const double move_s = gramline::step_move_s(rig, from, to);
  EXPECT_NEAR(move_s, 20.0 / 15.0 + 0.5 + 0.5 + 0.1, 1e-12);

  const double total_s = 1000.0 * (dwell_s + move_s);
  EXPECT_GT(total_s, 0.5e4);
  EXPECT_LT(total_s, 2e4);
  EXPECT_NEAR(std::log10(total_s), 4.0, 0.15);
}

}  // namespace
