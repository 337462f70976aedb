#include "gramline/campaign.h"

#include <sstream>

#include "gramline/enum_names.h"
#include "gramline/field_check.h"

namespace gramline {

namespace {

// Every point's Bloch angles must stay finite and inside a sane range: a feature of 1e308
// times a weight overflows to infinity, and positions derived from it become NaN
// (docs/parameter-ranges.md).
std::string angle_problem(const DataSet& data, const EncodingMap& encoding) {
  const int points = data.train_count() + data.test_count();
  for (int i = 0; i < points; ++i) {
    const Eigen::VectorXd x = data.point(i);
    for (int p = 0; p < encoding.photon_count(); ++p) {
      const BlochAngles a = encoding.angles(p, x);
      const std::string where = "encoding.photons[" + std::to_string(p) + "]";
      const std::string point =
          (i < data.train_count() ? "training point " : "test point ") + std::to_string(i);
      FieldCheck angles(where);
      angles.within("theta", a.theta_deg, sane::bloch_angle_deg)
          .within("phi", a.phi_deg, sane::bloch_angle_deg);
      if (!angles.ok())
        return angles.message() + " at " + point +
               ": its features times the weights overflow; rescale the features or the weights";
    }
  }
  return {};
}

}  // namespace

double NightWindow::length_s() const {
  int minutes = end_min - start_min;
  if (minutes <= 0) minutes += 24 * 60;
  return minutes * 60.0;
}

std::string Campaign::check_consistency() const {
  if (auto e = validate(data); !e.empty()) return "data: " + e;
  if (auto e = encoding.check(data.feature_count()); !e.empty()) return e;
  if (auto e = rig.check(encoding.photon_count()); !e.empty()) return e;
  if (auto e = angle_problem(data, encoding); !e.empty()) return e;
  const BudgetOptions& b = precision.budget;
  // Sane ranges (docs/parameter-ranges.md).
  FieldCheck ranges("precision");
  ranges.within("epsilon", b.epsilon, sane::epsilon)
      .within("confidence", b.confidence, sane::confidence)
      .within("fixed_pairs", precision.fixed_pairs, sane::pairs);
  if (!ranges.ok()) return ranges.message();
  if (nights.start_min < 0 || nights.start_min >= 24 * 60) return "nights.start: not a clock time";
  if (nights.end_min < 0 || nights.end_min >= 24 * 60) return "nights.end: not a clock time";
  if (nights.max_nights < 1) return "nights.max_nights: must be at least 1";
  FieldCheck sched("schedule");
  sched
      .within("reference_interval_min", schedule.reference_interval_min,
              sane::reference_interval_min)
      .within("dark_dwell_s", schedule.dark_dwell_s, sane::dark_dwell_s)
      .within("reference_pairs", schedule.reference_pairs, sane::pairs)
      .within("optimizer_time_cap_s", schedule.optimizer_time_cap_s, sane::optimizer_time_cap_s);
  if (!sched.ok()) return sched.message();
  FieldCheck chk("check");
  chk.require(!(check.C > sane::svm_C.high), "C",
              "must be at most 1e+06 (0 or below: chosen by cross-validation)");
  if (!chk.ok()) return chk.message();
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
