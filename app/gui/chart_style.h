#pragma once
// Colours of our own for the charts and heatmaps, and chart styling from the system palette so
// light and dark desktops both read well.
#include <QColor>
#include <QPalette>

#include "formats/palette.h"

class QChart;
class QAbstractAxis;

namespace gramline::gui {

/// Gramline's palette (docs/palette.md, formats/palette.h) as QColor.
QColor to_qcolor(const palette::Rgb& rgb);

/// Work colours used wherever time is split by kind.
namespace work_colour {
inline QColor moving() { return to_qcolor(palette::moving); }
inline QColor counting() { return to_qcolor(palette::counting); }
inline QColor reference() { return to_qcolor(palette::reference); }
inline QColor dark() { return to_qcolor(palette::dark); }
inline QColor park() { return to_qcolor(palette::park); }
}  // namespace work_colour

namespace gramline_colour {
inline QColor pass() { return to_qcolor(palette::pass); }
inline QColor alert() { return to_qcolor(palette::alert); }
/// The colour of a class label (+1 or -1).
inline QColor class_colour(int label) {
  return to_qcolor(label > 0 ? palette::class_positive : palette::class_negative);
}
}  // namespace gramline_colour

/// `colour`, lightened when the palette's base is dark so text in it stays readable.
QColor readable_on(const QColor& colour, const QPalette& palette);

/// Matrix colour for t in [0, 1]: Gramline's ramp, larger values darker.
QColor heat_colour(double t);

/// Background, text and grid colours of `chart` from `palette`.
void style_chart(QChart* chart, const QPalette& palette);
void style_axis(QAbstractAxis* axis, const QPalette& palette);

}  // namespace gramline::gui
