#pragma once
// Shot budget: how many detected pairs an entry needs for a target kernel precision.
#include <string>

#include "gramline/rig.h"

namespace gramline {

enum class BudgetMethod {
  normal,     ///< normal approximation with the predicted p: n = z^2 var1 / eps^2
  wilson,     ///< score interval: Wilson (both ports) or Poisson score (pass port only)
  hoeffding,  ///< distribution-free: n = ln(2/delta) / (2 (eps V)^2)  (Hoeffding 1963)
};

struct BudgetOptions {
  BudgetMethod method = BudgetMethod::wilson;
  double epsilon = 0.02;     ///< target half-width on the kernel value
  double confidence = 0.95;  ///< 1 - delta
  bool worst_case = false;   ///< use p = 1/2 instead of the predicted p
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

/// Single-pair variance: Var(kappa_hat) = entry_variance_per_pair / pairs (detection.h).
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
