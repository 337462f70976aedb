#pragma once
// Figures of a Monte Carlo sample with their confidence intervals, and running moments.
#include <vector>

namespace gramline {

/// A Monte Carlo figure with its confidence interval.
struct Estimate {
  double value = 0.0;
  double low = 0.0;
  double high = 0.0;
};

/// Median with a distribution-free interval from order statistics: ranks n/2 -+ z sqrt(n)/2
/// (normal approximation to the binomial(n, 1/2) count below the median; Conover, Practical
/// Nonparametric Statistics, 3rd ed., 1999, section 3.2). `z` is the two-sided normal quantile
/// of the confidence (normal_quantile_two_sided, budget.h).
Estimate median_estimate(std::vector<double> values, double z);

/// Mean with the normal interval mean -+ z s / sqrt(n), s the sample standard deviation.
Estimate mean_estimate(const std::vector<double>& values, double z);

/// Proportion successes / trials with its Wilson score interval (Wilson 1927) at `confidence`.
Estimate proportion_estimate(double successes, double trials, double confidence);

/// Running sum and sum of squares of a sample, for its mean and sample standard deviation.
struct SampleMoments {
  double sum = 0.0;
  double sum_squares = 0.0;
  int count = 0;

  void add(double x) {
    sum += x;
    sum_squares += x * x;
    ++count;
  }
  /// 0 for an empty sample.
  double mean() const { return count > 0 ? sum / count : 0.0; }
  /// sqrt((sum x^2 - n mean^2) / (n - 1)), 0 below two values.
  double standard_deviation() const;
};

}  // namespace gramline
