#pragma once
// Colours of our own for the charts and heatmaps, and chart styling from the system palette so
// light and dark desktops both read well.
#include <QColor>
#include <QPalette>

class QChart;
class QAbstractAxis;

namespace gramline::gui {

/// Work colours used wherever time is split by kind.
namespace work_colour {
inline QColor moving() { return QColor(0xc8, 0x55, 0x3d); }     // brick
inline QColor counting() { return QColor(0x2a, 0x7f, 0x62); }   // pine
inline QColor reference() { return QColor(0x5b, 0x7f, 0xb9); }  // slate
inline QColor dark() { return QColor(0x6e, 0x5a, 0x8a); }       // dusk
inline QColor park() { return QColor(0xd9, 0xa4, 0x41); }       // ochre
}  // namespace work_colour

/// Heatmap colour for t in [0, 1]: night ink through teal and amber to cream.
QColor heat_colour(double t);

/// Background, text and grid colours of `chart` from `palette`.
void style_chart(QChart* chart, const QPalette& palette);
void style_axis(QAbstractAxis* axis, const QPalette& palette);

}  // namespace gramline::gui
