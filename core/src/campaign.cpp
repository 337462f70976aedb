#include "gramline/campaign.h"

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <set>
#include <sstream>
#include <stdexcept>

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

bool parse_civil_date(const std::string& text, long& days) {
  if (text.size() != 10 || text[4] != '-' || text[7] != '-') return false;
  for (size_t i : {0u, 1u, 2u, 3u, 5u, 6u, 8u, 9u})
    if (text[i] < '0' || text[i] > '9') return false;
  const int y = std::stoi(text.substr(0, 4));
  const unsigned m = static_cast<unsigned>(std::stoi(text.substr(5, 2)));
  const unsigned d = static_cast<unsigned>(std::stoi(text.substr(8, 2)));
  const std::chrono::year_month_day date{std::chrono::year{y}, std::chrono::month{m},
                                         std::chrono::day{d}};
  if (!date.ok()) return false;
  days = std::chrono::sys_days(date).time_since_epoch().count();
  return true;
}

std::string civil_date_text(long days) {
  const std::chrono::year_month_day date{std::chrono::sys_days(std::chrono::days(days))};
  char buffer[16];
  std::snprintf(buffer, sizeof buffer, "%04d-%02u-%02u", static_cast<int>(date.year()),
                static_cast<unsigned>(date.month()), static_cast<unsigned>(date.day()));
  return buffer;
}

int iso_weekday(long days) {
  return static_cast<int>(
      std::chrono::weekday(std::chrono::sys_days(std::chrono::days(days))).iso_encoding());
}

namespace {
// Day number (parse_civil_date) of night `night`: the night-th date on or after first_date
// that is neither a skipped date nor on a skipped weekday.
long night_day(const NightWindow& w, int night) {
  long first = 0;
  if (!parse_civil_date(w.first_date, first))
    throw std::invalid_argument("nights.first_date: '" + w.first_date +
                                "' is not a date YYYY-MM-DD");
  std::set<long> skipped;
  for (const std::string& d : w.skip_dates) {
    long day = 0;
    if (!parse_civil_date(d, day))
      throw std::invalid_argument("nights.skip_dates: '" + d + "' is not a date YYYY-MM-DD");
    skipped.insert(day);
  }
  const std::set<int> weekdays(w.skip_weekdays.begin(), w.skip_weekdays.end());
  for (int d : weekdays)
    if (d < 1 || d > 7) throw std::invalid_argument("nights.skip_weekdays: not a weekday");
  if (weekdays.size() >= 7)
    throw std::invalid_argument("nights.skip_weekdays: every weekday is skipped");
  int found = 0;
  for (long day = first;; ++day) {
    if (skipped.count(day) || weekdays.count(iso_weekday(day))) continue;
    if (++found >= night) return day;
  }
}
}  // namespace

int NightWindow::day_offset(int night) const {
  return static_cast<int>(night_day(*this, night) - night_day(*this, 1));
}

std::string NightWindow::night_date(int night) const {
  return civil_date_text(night_day(*this, night));
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
  try {
    nights.day_offset(1);
  } catch (const std::invalid_argument& e) {
    return e.what();
  }
  FieldCheck sched("schedule");
  sched
      .within("reference_interval_min", schedule.reference_interval_min,
              sane::reference_interval_min)
      .within("dark_dwell_s", schedule.dark_dwell_s, sane::dark_dwell_s)
      .within("reference_pairs", schedule.reference_pairs, sane::pairs)
      .within("optimizer_time_cap_s", schedule.optimizer_time_cap_s, sane::optimizer_time_cap_s);
  if (!sched.ok()) return sched.message();
  if (!(schedule.calibration_share > 0 && schedule.calibration_share < 1))
    return "schedule.calibration_share: must lie strictly between 0 and 1";
  if (schedule.search_evaluations < 0) return "schedule.search_evaluations: must be >= 0";
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

std::vector<std::string> Campaign::warnings() const {
  std::vector<std::string> out;
  const int photons = encoding.photon_count();
  for (int p = 0; p < photons && p < static_cast<int>(rig.detectors.size()); ++p) {
    const Detector& d = rig.detectors[p];
    const double singles = rig.source.pair_rate_per_s * d.efficiency;
    if (d.dark_rate_per_s > singles) {
      std::ostringstream o;
      o << "rig.detectors[" << p << "].dark_rate_per_s: " << d.dark_rate_per_s
        << " dark counts/s exceed the " << singles
        << " photon singles/s the detector sees (source rate x efficiency); check the units";
      out.push_back(o.str());
    }
  }
  if (data.train_count() > 0 && data.test_count() > 0) {
    for (int f = 0; f < data.feature_count(); ++f) {
      const double low = data.train.col(f).minCoeff(), high = data.train.col(f).maxCoeff();
      const double width = std::max(high - low, 1e-12);
      for (int t = 0; t < data.test_count(); ++t) {
        const double x = data.test(t, f);
        if (x < low - width || x > high + width) {
          std::ostringstream o;
          o << "data: test point " << t << ", feature "
            << (f < static_cast<int>(data.feature_names.size()) ? data.feature_names[f]
                                                                : std::to_string(f))
            << " = " << x << " lies far outside the training range [" << low << ", " << high
            << "]; its encoded angles wrap around";
          out.push_back(o.str());
          break;
        }
      }
    }
  }
  return out;
}

}  // namespace gramline
