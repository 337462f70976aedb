#include "chart_style.h"

#include <QAbstractAxis>
#include <QChart>
#include <QLegend>
#include <cmath>

namespace gramline::gui {

QColor to_qcolor(const palette::Rgb& rgb) { return QColor(rgb.r, rgb.g, rgb.b); }

QColor readable_on(const QColor& colour, const QPalette& palette) {
  const bool dark_base = palette.color(QPalette::Base).lightnessF() < 0.5;
  return dark_base && colour.lightnessF() < 0.55 ? colour.lighter(190) : colour;
}

QColor heat_colour(double t) {
  if (!std::isfinite(t)) return QColor(128, 128, 128);
  return to_qcolor(palette::ramp(t));
}

void style_chart(QChart* chart, const QPalette& palette) {
  chart->setBackgroundBrush(palette.color(QPalette::Base));
  chart->setBackgroundRoundness(0);
  chart->setTitleBrush(palette.color(QPalette::Text));
  chart->legend()->setLabelColor(palette.color(QPalette::Text));
  chart->setMargins(QMargins(4, 4, 4, 4));
  for (QAbstractAxis* axis : chart->axes()) style_axis(axis, palette);
}

void style_axis(QAbstractAxis* axis, const QPalette& palette) {
  const QColor text = palette.color(QPalette::Text);
  QColor grid = text;
  grid.setAlphaF(0.15);
  axis->setLabelsColor(text);
  axis->setTitleBrush(text);
  axis->setGridLineColor(grid);
  axis->setLinePenColor(grid);
}

}  // namespace gramline::gui
