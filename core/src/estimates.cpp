#include "gramline/estimates.h"

#include <algorithm>
#include <cmath>

#include "gramline/budget.h"

namespace gramline {

Estimate median_estimate(std::vector<double> values, double z) {
  Estimate e;
  if (values.empty()) return e;
  std::sort(values.begin(), values.end());
  const std::size_t n = values.size();
  e.value = n % 2 ? values[n / 2] : 0.5 * (values[n / 2 - 1] + values[n / 2]);
  const double half = z * std::sqrt(static_cast<double>(n)) / 2.0;
  const long low_rank = std::max(1L, static_cast<long>(std::floor(n / 2.0 - half)));
  const long high_rank =
      std::min(static_cast<long>(n), static_cast<long>(std::ceil(n / 2.0 + half + 1.0)));
  e.low = values[low_rank - 1];
  e.high = values[high_rank - 1];
  return e;
}

Estimate mean_estimate(const std::vector<double>& values, double z) {
  Estimate e;
  if (values.empty()) return e;
  const double n = static_cast<double>(values.size());
  double sum = 0.0, sum_sq = 0.0;
  for (double v : values) sum += v;
  e.value = sum / n;
  for (double v : values) sum_sq += (v - e.value) * (v - e.value);
  const double sd = values.size() > 1 ? std::sqrt(sum_sq / (n - 1)) : 0.0;
  e.low = e.value - z * sd / std::sqrt(n);
  e.high = e.value + z * sd / std::sqrt(n);
  return e;
}

Estimate proportion_estimate(double successes, double trials, double confidence) {
  const Interval w = wilson_interval(successes, trials, confidence);
  return {trials > 0 ? successes / trials : 0.0, w.low, w.high};
}

double SampleMoments::standard_deviation() const {
  if (count < 2) return 0.0;
  const double m = mean();
  return std::sqrt(std::max(0.0, (sum_squares - count * m * m) / (count - 1)));
}

}  // namespace gramline
