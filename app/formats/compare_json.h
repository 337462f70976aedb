#pragma once
// The comparison of two plans as JSON and as a table (docs/plan-files.md, "Comparing two
// plans"): `gramline-cli compare` writes them, the app shows the same figures.
#include <string>

#include "gramline/compare.h"
#include "gramline/plan.h"

namespace gramline::formats {

/// {"format": "gramline-comparison", "version": 1, "a": {...}, "b": {...}, "difference": {...}}
/// with each side's campaign name, whether it fits its nights, and every compared figure.
std::string format_compare_json(const std::string& name_a, const Plan& a, const std::string& name_b,
                                const Plan& b);

/// A plain-text table: one row per compared figure with A, B and B - A.
std::string format_compare_table(const std::string& name_a, const Plan& a,
                                 const std::string& name_b, const Plan& b);

}  // namespace gramline::formats
