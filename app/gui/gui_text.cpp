#include "gui_text.h"

#include <QCoreApplication>
#include <QLocale>
#include <cmath>
#include <cstdint>
#include <exception>
#include <string>

namespace gramline::gui {

namespace {
QString tr(const char* text) { return QCoreApplication::translate("gramline::gui", text); }
}  // namespace

QString duration_text(double seconds) {
  if (!std::isfinite(seconds)) return QStringLiteral("–");
  if (seconds < 60.0) return tr("%1 s").arg(number_text(seconds, 1));
  const long total = std::lround(seconds);
  const long hours = total / 3600;
  const long minutes = (total % 3600) / 60;
  const long secs = total % 60;
  if (hours == 0) return tr("%1 min %2 s").arg(minutes).arg(secs, 2, 10, QLatin1Char('0'));
  return tr("%1 h %2 min").arg(hours).arg(minutes, 2, 10, QLatin1Char('0'));
}

QDateTime step_clock(const NightWindow& nights, double start_s) {
  // The clock starts with the first night, which a skipped first date moves on.
  std::string first = nights.first_date;
  try {
    first = nights.night_date(1);
  } catch (const std::exception&) {
  }
  QDate date = QDate::fromString(QString::fromStdString(first), Qt::ISODate);
  if (!date.isValid()) date = QDate(2000, 1, 1);
  // Wall-clock time (docs/plan-files.md, "Nights on the calendar"): whole days move the date,
  // the rest is read on the clock from the window's start, whatever daylight saving does.
  const std::int64_t ms =
      std::llround(start_s * 1000.0) + static_cast<std::int64_t>(nights.start_min) * 60000;
  const std::int64_t day_ms = 86400000;
  const std::int64_t days = ms >= 0 ? ms / day_ms : -((-ms + day_ms - 1) / day_ms);
  const QTime clock = QTime(0, 0).addMSecs(static_cast<int>(ms - days * day_ms));
  return QDateTime(date.addDays(days), clock);
}

QString clock_text(const NightWindow& nights, double start_s) {
  return QLocale().toString(step_clock(nights, start_s), QStringLiteral("ddd HH:mm:ss"));
}

QString end_text(const NightWindow& nights, double start_s) {
  if (start_s < 6.0 * 86400.0) return clock_text(nights, start_s);
  return QLocale().toString(step_clock(nights, start_s), QStringLiteral("ddd d MMM HH:mm:ss"));
}

QString number_text(double value, int decimals) { return QLocale().toString(value, 'f', decimals); }

QString count_text(double value) {
  return QLocale().toString(static_cast<qlonglong>(std::llround(value)));
}

QString kind_text(StepKind kind) {
  switch (kind) {
    case StepKind::measure:
      return tr("measure");
    case StepKind::reference:
      return tr("reference");
    case StepKind::dark:
      return tr("dark");
    case StepKind::park:
      return tr("park");
  }
  return {};
}

QString block_text(Block block) {
  switch (block) {
    case Block::train:
      return tr("train × train");
    case Block::test:
      return tr("test × train");
    case Block::none:
      return tr("–");
  }
  return {};
}

QString stage_text(Stage stage) {
  return stage == Stage::prep ? tr("preparation") : tr("analysis");
}

QString plate_text(Plate plate) { return plate == Plate::HWP ? tr("HWP") : tr("QWP"); }

QString backlash_text(Backlash backlash) {
  return backlash == Backlash::shortest ? tr("shortest way") : tr("approach from below");
}

QString move_mode_text(MoveMode mode) {
  return mode == MoveMode::simultaneous ? tr("all motors at once") : tr("one motor at a time");
}

QString scheme_text(DetectionScheme scheme) {
  return scheme == DetectionScheme::pass_only ? tr("pass port only (Poisson)")
                                              : tr("both ports (binomial)");
}

QString method_text(BudgetMethod method) {
  switch (method) {
    case BudgetMethod::normal:
      return tr("normal approximation");
    case BudgetMethod::wilson:
      return tr("Wilson score interval");
    case BudgetMethod::hoeffding:
      return tr("Hoeffding (distribution-free)");
  }
  return {};
}

QString allocation_text(Allocation allocation) {
  switch (allocation) {
    case Allocation::uniform:
      return tr("uniform (same pairs; every entry meets ε)");
    case Allocation::neyman:
      return tr("Neyman (pairs where variance is)");
    case Allocation::margin_aware:
      return tr("margin-aware (pairs where the decision is)");
  }
  return {};
}

QString preset_text(EncodingPreset preset) {
  switch (preset) {
    case EncodingPreset::one_feature_per_photon_linear:
      return tr("one feature per photon, linear polarization");
    case EncodingPreset::two_features_polar_azimuth:
      return tr("two features per photon, polar and azimuth");
    case EncodingPreset::spread:
      return tr("features spread over the photons");
    case EncodingPreset::custom:
      return tr("custom weights");
  }
  return {};
}

}  // namespace gramline::gui
