#pragma once
// Words and number formats the views share, all through tr(): durations, clock times, and the
// names of the engine's enums as a user reads them.
#include <QDateTime>
#include <QString>

#include "gramline/budget.h"
#include "gramline/campaign.h"
#include "gramline/encoding.h"
#include "gramline/plan.h"
#include "gramline/rig.h"

namespace gramline::gui {

/// "2 h 05 min", "12 min 30 s", "8.4 s".
QString duration_text(double seconds);
/// Local date and time at which a step starting `start_s` after the first night's start
/// begins (night n starts (n - 1) days after the first).
QDateTime step_clock(const NightWindow& nights, double start_s);
/// "Tue 21:43:10".
QString clock_text(const NightWindow& nights, double start_s);
/// When a step `start_s` after night 1's start falls: clock_text within a week of the first
/// night, else with the date ("Mon 12 Jan 23:22:46"), so a long campaign never reads ambiguous.
QString end_text(const NightWindow& nights, double start_s);
/// Number in the user's locale with `decimals` decimals.
QString number_text(double value, int decimals);
/// Count with thousands separators.
QString count_text(double value);

QString kind_text(StepKind kind);
QString block_text(Block block);
QString stage_text(Stage stage);
QString plate_text(Plate plate);
QString backlash_text(Backlash backlash);
QString move_mode_text(MoveMode mode);
QString scheme_text(DetectionScheme scheme);
QString method_text(BudgetMethod method);
QString allocation_text(Allocation allocation);
QString preset_text(EncodingPreset preset);

}  // namespace gramline::gui
