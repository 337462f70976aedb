#include "gramline/compare.h"

namespace gramline {

double busy_time_s(const PlanSummary& summary) {
  double busy_s = 0.0;
  for (const NightUse& n : summary.night_use) busy_s += n.busy_s;
  return busy_s;
}

std::vector<ComparedFigure> compare_plans(const Plan& a, const Plan& b) {
  const PlanSummary& x = a.summary;
  const PlanSummary& y = b.summary;
  return {
      {"nights", "nights", "", double(x.nights), double(y.nights)},
      {"total_s", "calendar span", "s", x.total_s, y.total_s},
      {"busy_s", "busy time", "s", busy_time_s(x), busy_time_s(y)},
      {"move_s", "move time", "s", x.move_s, y.move_s},
      {"integration_s", "counting time", "s", x.integration_s, y.integration_s},
      {"reference_s", "reference time", "s", x.reference_s, y.reference_s},
      {"epsilon_reached", "worst half-width", "", x.epsilon_reached, y.epsilon_reached},
      {"gram_sigma_frobenius", "Gram error (Frobenius sigma)", "", x.gram_sigma_frobenius,
       y.gram_sigma_frobenius},
      {"pairs_total", "detected pairs", "", x.pairs_total, y.pairs_total},
      {"settings", "settings", "", double(x.settings), double(y.settings)},
      {"steps", "steps", "", double(x.steps), double(y.steps)},
  };
}

}  // namespace gramline
