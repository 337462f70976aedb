#pragma once
// Shot budget: how many detected pairs an entry needs for a target kernel precision.
#include <string>

#include "gramline/rig.h"

namespace gramline {

enum class BudgetMethod {
  normal,  ///< normal approximation with the predicted p: n = z^2 var1 / eps^2
  wilson,  ///< score interval: Wilson (both ports) or Poisson score (pass port only)
  /// distribution-free: both ports, Hoeffding (1963), n = ln(2/delta) (1 + a_tot/r) /
  /// (2 (eps V)^2); pass port (a Poisson count, to which Hoeffding does not apply), Bernstein's
  /// inequality for a Poisson count, n = 2 ln(2/delta) (p + a/r + eps V/3) / (eps V)^2
  hoeffding,
};

struct BudgetOptions {
  BudgetMethod method = BudgetMethod::wilson;
  double epsilon = 0.02;     ///< target half-width on the kernel value
  double confidence = 0.95;  ///< 1 - delta
  /// Plan for the least favourable p the scheme can produce (worst_case_pass_probability)
  /// instead of the predicted p.
  bool worst_case = false;
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

/// Inputs that describe one entry's statistics.
struct EntryModel {
  DetectionScheme scheme = DetectionScheme::both_ports;
  int photons = 2;
  double p_pass = 0.5;
  double visibility = 1.0;
  double accidental_ratio = 0.0;        ///< a_pass / r: pass-channel accidentals per pair
  double accidental_total_ratio = 0.0;  ///< a_tot / r: all-channel accidentals per pair
                                        ///< (both_ports)
};

/// The pass probability, among those the scheme can produce for kernels in [0, 1]
/// (p in [(1 - V)/2^P, V + (1 - V)/2^P]), at which an entry's half-width is largest for every
/// method: pass_only, the top of the range (the Poisson variance (p + a/r)/V^2 grows with p);
/// both_ports, the p whose observed pass fraction (p + a/r)/(1 + a_tot/r) is nearest 1/2
/// (binomial variance p_o (1 - p_o)). The both-ports Hoeffding half-width does not depend on p.
double worst_case_pass_probability(const EntryModel& entry);

/// Single-pair variance: Var(kappa_hat) = entry_variance_per_pair / pairs (detection.h), at the
/// predicted p, or with worst_case at worst_case_pass_probability.
double entry_variance_per_pair(const EntryModel& entry, bool worst_case);

/// Two-sided standard normal quantile z for confidence 1 - delta.
double normal_quantile_two_sided(double confidence);

/// Smallest number of detected pairs meeting the target (at least 1).
double pairs_for_precision(const EntryModel& entry, const BudgetOptions& options);

/// Inverse: the half-width on the kernel reached with `pairs` detected pairs.
double precision_for_pairs(const EntryModel& entry, double pairs, const BudgetOptions& options);

/// Wilson score interval for k successes in n trials at `confidence` (Wilson 1927).
struct Interval {
  double low = 0.0;
  double high = 1.0;
};
Interval wilson_interval(double successes, double trials, double confidence);

std::string to_string(BudgetMethod);
bool from_string(const std::string&, BudgetMethod&);

}  // namespace gramline
