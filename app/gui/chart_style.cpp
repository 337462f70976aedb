#include "chart_style.h"

#include <QAbstractAxis>
#include <QChart>
#include <QLegend>
#include <algorithm>
#include <array>
#include <cmath>

namespace gramline::gui {

QColor heat_colour(double t) {
  if (!std::isfinite(t)) return QColor(128, 128, 128);
  t = std::clamp(t, 0.0, 1.0);
  // Stops of our own scale: ink, teal, amber, cream.
  static const std::array<std::array<double, 3>, 4> stops = {{
      {0x1b, 0x2a, 0x41},
      {0x2e, 0x7d, 0x7a},
      {0xe0, 0xa6, 0x3a},
      {0xfb, 0xf3, 0xd5},
  }};
  const double x = t * 3.0;
  const int i = std::min(2, static_cast<int>(x));
  const double f = x - i;
  const auto mix = [&](int k) {
    return static_cast<int>(std::lround(stops[i][k] * (1 - f) + stops[i + 1][k] * f));
  };
  return QColor(mix(0), mix(1), mix(2));
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
