#pragma once
// A campaign: everything needed to plan a measurement run. Plain value type.
#include <cstdint>
#include <string>

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

/// Nightly observing window. Times are local clock times "HH:MM"; a window whose end is not
/// after its start ends on the next day.
struct NightWindow {
  std::string first_date = "2026-12-01";  ///< date of the first night, YYYY-MM-DD
  int start_min = 20 * 60;                ///< start, minutes after midnight
  int end_min = 6 * 60;                   ///< end, minutes after midnight
  int max_nights = 7;
  double length_s() const;  ///< window length in seconds
};

struct ScheduleSettings {
  double reference_interval_min = 20.0;  ///< a reference step at least this often; 0: none
  double reference_pairs = 0.0;          ///< pairs per reference step; 0: as a measure step
  bool dark_steps = true;                ///< dark (shutter closed) steps at night start and end
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
};

std::string to_string(Allocation);
bool from_string(const std::string&, Allocation&);

}  // namespace gramline
