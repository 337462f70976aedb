#include "app_icon.h"

#include <QPainter>
#include <QPainterPath>
#include <QPixmap>

#include "chart_style.h"

namespace gramline::gui {

namespace {

QPixmap draw_icon(int size) {
  QPixmap pm(size, size);
  pm.fill(Qt::transparent);
  QPainter p(&pm);
  p.setRenderHint(QPainter::Antialiasing);
  p.scale(size / 64.0, size / 64.0);
  // Rounded tile in night ink.
  p.setPen(Qt::NoPen);
  p.setBrush(QColor(0x1b, 0x2a, 0x41));
  p.drawRoundedRect(QRectF(2, 2, 60, 60), 12, 12);
  // A 4 x 4 Gram matrix: bright diagonal, shaded off-diagonal cells.
  const double cell = 9.0, origin = 14.0;
  for (int r = 0; r < 4; ++r) {
    for (int c = 0; c < 4; ++c) {
      const double k = r == c ? 1.0 : 0.25 + 0.5 / (1 + std::abs(r - c));
      p.setBrush(heat_colour(k));
      p.drawRoundedRect(
          QRectF(origin + c * cell + 0.8, origin + r * cell + 0.8, cell - 1.6, cell - 1.6), 1.5,
          1.5);
    }
  }
  // Polarization ellipse across the matrix.
  p.setBrush(Qt::NoBrush);
  p.setPen(QPen(QColor(0xfb, 0xf3, 0xd5), 3.0));
  p.translate(32, 32);
  p.rotate(-35);
  p.drawEllipse(QPointF(0, 0), 26, 10);
  return pm;
}

}  // namespace

QIcon app_icon() {
  QIcon icon;
  for (int s : {16, 24, 32, 48, 64, 128, 256}) icon.addPixmap(draw_icon(s));
  return icon;
}

}  // namespace gramline::gui
