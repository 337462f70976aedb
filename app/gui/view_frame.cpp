#include "view_frame.h"

#include <QGraphicsOpacityEffect>
#include <QLabel>
#include <QVBoxLayout>

namespace gramline::gui {

ViewFrame::ViewFrame(QWidget* content, QWidget* parent) : QWidget(parent), content_(content) {
  banner_ = new QLabel;
  banner_->setWordWrap(true);
  banner_->setMargin(6);
  banner_->setAutoFillBackground(true);
  banner_->setTextInteractionFlags(Qt::TextSelectableByMouse);
  banner_->setAccessibleName(tr("View status"));
  banner_->hide();
  auto* layout = new QVBoxLayout(this);
  layout->setContentsMargins(0, 0, 0, 0);
  layout->setSpacing(0);
  layout->addWidget(banner_);
  layout->addWidget(content_, 1);
}

void ViewFrame::set_banner(const QString& message, bool warning) {
  banner_->setText(message);
  banner_->setVisible(!message.isEmpty());
  // Tint the banner from the system palette so light and dark themes both read well.
  QPalette p = palette();
  const QColor base = p.color(QPalette::Window);
  const QColor tint = warning ? QColor(200, 70, 40) : p.color(QPalette::Highlight);
  const auto mix = [](const QColor& a, const QColor& b, double t) {
    return QColor::fromRgbF(a.redF() * (1 - t) + b.redF() * t,
                            a.greenF() * (1 - t) + b.greenF() * t,
                            a.blueF() * (1 - t) + b.blueF() * t);
  };
  p.setColor(QPalette::Window, mix(base, tint, 0.22));
  banner_->setPalette(p);
}

QString ViewFrame::banner() const { return banner_->isHidden() ? QString() : banner_->text(); }

void ViewFrame::set_stale(bool stale) {
  if (stale == stale_) return;
  stale_ = stale;
  if (stale) {
    auto* effect = new QGraphicsOpacityEffect(content_);
    effect->setOpacity(0.55);
    content_->setGraphicsEffect(effect);
  } else {
    content_->setGraphicsEffect(nullptr);
  }
}

}  // namespace gramline::gui
