#include "gramline/campaign.h"

#include <sstream>

#include "gramline/enum_names.h"

namespace gramline {

double NightWindow::length_s() const {
  int minutes = end_min - start_min;
  if (minutes <= 0) minutes += 24 * 60;
  return minutes * 60.0;
}

std::string Campaign::check_consistency() const {
  if (auto e = validate(data); !e.empty()) return "data: " + e;
  if (auto e = encoding.check(data.feature_count()); !e.empty()) return e;
  if (auto e = rig.check(encoding.photon_count()); !e.empty()) return e;
  const BudgetOptions& b = precision.budget;
  if (!(b.epsilon > 0 && b.epsilon < 1)) return "precision.epsilon: must lie in (0, 1)";
  if (!(b.confidence > 0 && b.confidence < 1)) return "precision.confidence: must lie in (0, 1)";
  if (!(precision.fixed_pairs >= 0)) return "precision.fixed_pairs: must be >= 0";
  if (nights.start_min < 0 || nights.start_min >= 24 * 60) return "nights.start: not a clock time";
  if (nights.end_min < 0 || nights.end_min >= 24 * 60) return "nights.end: not a clock time";
  if (nights.max_nights < 1) return "nights.max_nights: must be at least 1";
  if (!(schedule.reference_interval_min >= 0))
    return "schedule.reference_interval_min: must be >= 0";
  if (!(schedule.dark_dwell_s >= 0)) return "schedule.dark_dwell_s: must be >= 0";
  if (!(schedule.reference_pairs >= 0)) return "schedule.reference_pairs: must be >= 0";
  if (schedule.search_evaluations < 0) return "schedule.search_evaluations: must be >= 0";
  if (check.trials < 1) return "check.trials: must be at least 1";
  if (check.cv_folds < 2) return "check.cv_folds: must be at least 2";
  return {};
}

namespace {
constexpr EnumNames<Allocation, 3> kAllocationNames{{{Allocation::uniform, "uniform"},
                                                     {Allocation::neyman, "neyman"},
                                                     {Allocation::margin_aware, "margin-aware"}}};
}  // namespace

std::string to_string(Allocation a) { return enum_text(kAllocationNames, a); }
bool from_string(const std::string& t, Allocation& out) {
  return enum_from_text(kAllocationNames, t, out);
}

}  // namespace gramline
