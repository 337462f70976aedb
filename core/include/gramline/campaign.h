#pragma once
// A campaign: everything needed to plan a measurement run. Plain value type.
#include <cstdint>
#include <string>
#include <vector>

#include "gramline/budget.h"
#include "gramline/dataset.h"
#include "gramline/encoding.h"
#include "gramline/rig.h"

namespace gramline {

/// How pairs are shared among entries (README, user guide step 8). uniform is the default.
enum class Allocation { uniform, neyman, margin_aware };

struct PrecisionTarget {
  BudgetOptions budget;      ///< epsilon, confidence, method, worst case
  double fixed_pairs = 0.0;  ///< > 0: use this many pairs per entry instead of the target
  Allocation allocation = Allocation::uniform;
};

/// Nightly observing window. Times are local wall-clock times "HH:MM"; a window whose end is
/// not after its start ends on the next day. Nights are laid on the calendar from first_date,
/// leaving out the skipped dates and weekdays (docs/plan-files.md, "Nights on the calendar").
struct NightWindow {
  std::string first_date = "2026-12-01";  ///< date of the first night, YYYY-MM-DD
  int start_min = 20 * 60;                ///< start, minutes after midnight
  int end_min = 6 * 60;                   ///< end, minutes after midnight
  int max_nights = 7;
  std::vector<std::string> skip_dates;  ///< dates without a night, YYYY-MM-DD
  std::vector<int> skip_weekdays;       ///< weekdays without a night, 1 = Monday ... 7 = Sunday
  double length_s() const;              ///< window length in seconds
  /// Days from the first night's date to the date night `night` (1 for the first) begins on.
  /// The first night is on first_date, or on the next date not skipped; night k of a calendar
  /// without skips begins k - 1 days after it. Throws std::invalid_argument for a date
  /// that is not YYYY-MM-DD or when every weekday is skipped.
  int day_offset(int night) const;
  /// Start of night `night` on the steps' clock: day_offset(night) x 86400 s.
  double night_start_s(int night) const { return day_offset(night) * 86400.0; }
  /// Date of night `night`, YYYY-MM-DD.
  std::string night_date(int night) const;
};

/// Days since 1970-01-01 of a date "YYYY-MM-DD"; false when the text is not a valid date.
bool parse_civil_date(const std::string& text, long& days);
/// "YYYY-MM-DD" of a day number of parse_civil_date.
std::string civil_date_text(long days);
/// ISO weekday (1 = Monday ... 7 = Sunday) of a day number of parse_civil_date.
int iso_weekday(long days);

struct ScheduleSettings {
  double reference_interval_min = 20.0;  ///< a reference step at least this often; 0: none
  double reference_pairs = 0.0;          ///< pairs per reference step; 0: chosen for the share
  /// Largest share of an entry's variance the reference calibration may take when the planner
  /// chooses the reference pairs (docs/error-budget.md).
  double calibration_share = 0.10;
  bool dark_steps = true;  ///< dark (shutter closed) steps at night start and end
  double dark_dwell_s = 30.0;
  bool park = true;                   ///< park step at the end of each night
  bool fit_to_nights = false;         ///< scale pairs so the campaign fits max_nights
  bool truncation_safe = false;       ///< complete the Gram matrix of the first m points early
  double optimizer_time_cap_s = 0.0;  ///< 0: no cap
  /// Move evaluations the whole-sequence order search may spend; 0: 400 per measure setting
  /// (docs/motion-model.md). Counted, not timed, so a seed gives the same plan on any machine.
  long long search_evaluations = 0;
};

struct CheckSettings {
  double C = 1.0;  ///< SVM soft-margin parameter; <= 0: choose by CV
  int cv_folds = 5;
  double flip_threshold = 0.01;  ///< largest allowed per-test-point flip probability
  double margin_ratio_threshold = 0.9;
  bool keep_unit_diagonal = true;  ///< PSD repair keeps the unit diagonal
  int trials = 1000;
};

struct Campaign {
  std::string name = "untitled";
  std::string notes;
  DataSet data;
  EncodingMap encoding;
  Rig rig;
  PrecisionTarget precision;
  NightWindow nights;
  ScheduleSettings schedule;
  CheckSettings check;
  std::uint64_t seed = 1;

  /// Empty when the campaign can be planned; otherwise a message naming the field.
  std::string check_consistency() const;
  /// Plannable but doubtful settings, one sentence each naming the field: a detector whose dark
  /// rate exceeds the photon singles it sees, and test features far outside the training range
  /// (more than the range's width beyond it), where the encoded angles wrap around.
  std::vector<std::string> warnings() const;
};

std::string to_string(Allocation);
bool from_string(const std::string&, Allocation&);

}  // namespace gramline
