#include "gramline/budget.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include "gramline/detection.h"
#include "gramline/enum_names.h"
#include "gramline/field_check.h"

namespace gramline {

double normal_quantile_two_sided(double confidence) {
  if (!(confidence > 0 && confidence < 1))
    throw std::invalid_argument("confidence must lie strictly between 0 and 1");
  // Planning asks for the same confidence once per entry: remember the last answer.
  thread_local double last_confidence = -1.0, last_z = 0.0;
  if (confidence == last_confidence) return last_z;
  // Solve P(|Z| <= z) = erf(z / sqrt 2) = confidence by bisection: slow but exact to the last
  // bit, and it keeps the engine free of a statistics library.
  double lo = 0.0, hi = 40.0;
  for (int i = 0; i < 200 && hi - lo > 1e-15 * hi; ++i) {
    const double mid = 0.5 * (lo + hi);
    if (std::erf(mid / std::sqrt(2.0)) < confidence)
      lo = mid;
    else
      hi = mid;
  }
  last_confidence = confidence;
  last_z = 0.5 * (lo + hi);
  return last_z;
}

namespace {
// The calibration of an entry with unit pair rate: rates become ratios per detected pair.
Calibration unit_calibration(const EntryModel& e) {
  Calibration c;
  c.pair_detect_rate_per_s = 1.0;
  c.visibility = e.visibility;
  c.accidental_pass_rate_per_s = e.accidental_ratio;
  c.accidental_total_rate_per_s = e.accidental_total_ratio;
  return c;
}

double effective_p(const EntryModel& e, bool worst_case) {
  return worst_case ? worst_case_pass_probability(e) : e.p_pass;
}

// Half-width of the Wilson score interval at observed fraction p after n trials (Wilson 1927).
double wilson_half_width(double p, double n, double z) {
  const double z2 = z * z;
  return z / (1.0 + z2 / n) * std::sqrt(p * (1.0 - p) / n + z2 / (4.0 * n * n));
}

// Kernel half-width for `pairs` with the score interval of the scheme.
double score_precision(const EntryModel& e, double pairs, double z, bool worst_case) {
  const double p = effective_p(e, worst_case);
  if (e.scheme == DetectionScheme::pass_only) {
    // Poisson score interval for the mean mu of a count n: (n - mu)^2 / mu = z^2, half-width
    // z sqrt(n + z^2/4) at n = mu = pairs (p + a/r); divided by pairs V on the kernel scale.
    const double mu = pairs * (p + e.accidental_ratio);
    return z * std::sqrt(mu + z * z / 4.0) / (pairs * e.visibility);
  }
  const double n_total = pairs * (1.0 + e.accidental_total_ratio);
  const double p_obs = (p + e.accidental_ratio) / (1.0 + e.accidental_total_ratio);
  return wilson_half_width(p_obs, n_total, z) * (1.0 + e.accidental_total_ratio) / e.visibility;
}

// Distribution-free half-width on the kernel with `pairs` pairs at confidence 1 - delta.
double hoeffding_precision(const EntryModel& e, double pairs, double delta, bool worst_case) {
  const double log_term = std::log(2.0 / delta);
  if (e.scheme == DetectionScheme::pass_only) {
    // A Poisson count n of mean mu = pairs (p + a/r) is no mean of a fixed number of [0, 1]
    // variables, so Hoeffding's inequality does not hold for it. Bernstein's inequality for a
    // Poisson count does: P(|n - mu| >= x) <= 2 exp(-x^2 / (2 (mu + x/3))) (Boucheron, Lugosi &
    // Massart, Concentration Inequalities, 2013, sec. 2.2 and 2.8). Solved for x, divided by
    // pairs V on the kernel scale.
    const double mu = pairs * (effective_p(e, worst_case) + e.accidental_ratio);
    const double x = log_term / 3.0 + std::sqrt(log_term * log_term / 9.0 + 2.0 * log_term * mu);
    return x / (pairs * e.visibility);
  }
  // Hoeffding (1963): P(|mean - p| >= w) <= 2 exp(-2 n w^2) for n variables in [0, 1]. Given
  // the total n_tot = pairs (1 + a_tot/r) over all channels, each detection (pair or
  // accidental) is one such variable in the observed pass fraction, and the kernel moves by
  // (1 + a_tot/r)/V per unit of that fraction.
  const double n_total = pairs * (1.0 + e.accidental_total_ratio);
  return std::sqrt(log_term / (2.0 * n_total)) * (1.0 + e.accidental_total_ratio) / e.visibility;
}
}  // namespace

double worst_case_pass_probability(const EntryModel& entry) {
  // The scheme reaches p = V kappa + (1 - V)/2^P for kernels in [0, 1] (docs/conventions.md).
  const double p_low = pass_probability(0.0, entry.visibility, entry.photons);
  const double p_high = pass_probability(1.0, entry.visibility, entry.photons);
  if (entry.scheme == DetectionScheme::pass_only) return p_high;
  // Both ports: the half-width follows p_o (1 - p_o), p_o = (p + a/r)/(1 + a_tot/r), which is
  // concave in p with its top at p_o = 1/2.
  const double top = 0.5 * (1.0 + entry.accidental_total_ratio) - entry.accidental_ratio;
  return std::clamp(top, p_low, p_high);
}

double entry_variance_per_pair(const EntryModel& entry, bool worst_case) {
  return kernel_variance(entry.scheme, entry.photons, unit_calibration(entry),
                         effective_p(entry, worst_case), 1.0);
}

double precision_for_pairs(const EntryModel& entry, double pairs, const BudgetOptions& options) {
  if (!(pairs > 0)) return std::numeric_limits<double>::infinity();
  const double z = normal_quantile_two_sided(options.confidence);
  switch (options.method) {
    case BudgetMethod::normal:
      return z * std::sqrt(entry_variance_per_pair(entry, options.worst_case) / pairs);
    case BudgetMethod::wilson:
      return score_precision(entry, pairs, z, options.worst_case);
    case BudgetMethod::hoeffding:
      return hoeffding_precision(entry, pairs, 1.0 - options.confidence, options.worst_case);
  }
  return std::numeric_limits<double>::infinity();
}

void BudgetOptions::validate() const {
  FieldCheck("BudgetOptions")
      .positive("epsilon", epsilon)
      .inside("confidence", confidence, 0.0, 1.0)
      .throw_if_failed();
}

double pairs_for_precision(const EntryModel& entry, const BudgetOptions& options) {
  options.validate();
  const double z = normal_quantile_two_sided(options.confidence);
  const double eps = options.epsilon;
  double pairs = 1.0;
  switch (options.method) {
    case BudgetMethod::normal:
      pairs = z * z * entry_variance_per_pair(entry, options.worst_case) / (eps * eps);
      break;
    case BudgetMethod::hoeffding: {
      const double log_term = std::log(2.0 / (1.0 - options.confidence));
      const double v = entry.visibility;
      if (entry.scheme == DetectionScheme::pass_only) {
        // hoeffding_precision <= eps with x = eps V pairs:
        // pairs >= 2 ln(2/delta) (p + a/r + eps V / 3) / (eps V)^2.
        const double rate = effective_p(entry, options.worst_case) + entry.accidental_ratio;
        pairs = 2.0 * log_term * (rate + eps * v / 3.0) / (eps * v * eps * v);
      } else {
        const double ratio_total = entry.accidental_total_ratio;
        const double w = eps * v / (1.0 + ratio_total);
        pairs = log_term / (2.0 * w * w) / (1.0 + ratio_total);
      }
      break;
    }
    case BudgetMethod::wilson: {
      // The score half-width falls monotonically with n: bisect on log n.
      double lo = 1e-3, hi = 1.0;
      while (score_precision(entry, hi, z, options.worst_case) > eps) {
        hi *= 2.0;
        if (hi > 1e15) throw std::invalid_argument("precision.epsilon is out of reach");
      }
      for (int i = 0; i < 200 && hi - lo > 1e-9 * hi; ++i) {
        const double mid = std::sqrt(lo * hi);
        if (score_precision(entry, mid, z, options.worst_case) > eps)
          lo = mid;
        else
          hi = mid;
      }
      pairs = hi;
      break;
    }
  }
  return std::max(1.0, std::ceil(pairs - 1e-9));
}

Interval wilson_interval(double successes, double trials, double confidence) {
  if (!(trials > 0)) return {0.0, 1.0};
  const double z = normal_quantile_two_sided(confidence);
  const double p = successes / trials;
  const double z2 = z * z;
  const double centre = (p + z2 / (2.0 * trials)) / (1.0 + z2 / trials);
  const double half = wilson_half_width(p, trials, z);
  return {std::max(0.0, centre - half), std::min(1.0, centre + half)};
}

namespace {
constexpr EnumNames<BudgetMethod, 3> kMethodNames{{{BudgetMethod::normal, "normal"},
                                                   {BudgetMethod::wilson, "wilson"},
                                                   {BudgetMethod::hoeffding, "hoeffding"}}};
}  // namespace

std::string to_string(BudgetMethod m) { return enum_text(kMethodNames, m); }
bool from_string(const std::string& t, BudgetMethod& out) {
  return enum_from_text(kMethodNames, t, out);
}

}  // namespace gramline
