#pragma once
// Two plans side by side (docs/plan-files.md, "Comparing two plans"): the figures a user weighs
// when choosing between variants of a campaign, and b - a for each.
#include <string>
#include <vector>

#include "gramline/plan.h"

namespace gramline {

/// One figure of both plans. `key` is the summary.json key where one exists.
struct ComparedFigure {
  std::string key;
  std::string label;  ///< short English label for tables
  std::string unit;   ///< "s", "" (a count or a ratio)
  double a = 0.0;
  double b = 0.0;
  double difference() const { return b - a; }
};

/// Busy time of a plan: the sum of its nights' busy time (moving, counting, references).
double busy_time_s(const PlanSummary& summary);

/// The compared figures in a fixed order: nights, calendar span (total_s), busy time, move
/// time, counting time, reference time, worst kernel half-width (epsilon_reached), Gram error
/// (Frobenius sigma), detected pairs, settings, steps.
std::vector<ComparedFigure> compare_plans(const Plan& a, const Plan& b);

}  // namespace gramline
