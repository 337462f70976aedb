#include "view_frame.h"

#include <QEvent>
#include <QLabel>
#include <QPainter>
#include <QStackedWidget>
#include <QVBoxLayout>

#include "chart_style.h"

namespace gramline::gui {

namespace {

/// Diagonal hatching over a stale view: the figures stay readable, but no one takes them for
/// the current plan. Mouse events pass through so the user can still scroll and hover.
class Veil : public QWidget {
 public:
  explicit Veil(QWidget* parent) : QWidget(parent) {
    setAttribute(Qt::WA_TransparentForMouseEvents);
    setAttribute(Qt::WA_NoSystemBackground);
    setAccessibleName(tr("Out of date"));
  }

 protected:
  void paintEvent(QPaintEvent*) override {
    QPainter p(this);
    QColor wash = palette().color(QPalette::Window);
    wash.setAlphaF(0.45);
    p.fillRect(rect(), wash);
    QColor ink = palette().color(QPalette::Text);
    ink.setAlphaF(0.10);
    p.setPen(QPen(ink, 6));
    const int h = height();
    for (int x = -h; x < width(); x += 28) p.drawLine(x, h, x + h, 0);
  }
};

}  // namespace

ViewFrame::ViewFrame(QWidget* content, QWidget* parent) : QWidget(parent), content_(content) {
  banner_ = new QLabel;
  banner_->setWordWrap(true);
  banner_->setMargin(6);
  banner_->setAutoFillBackground(true);
  banner_->setTextInteractionFlags(Qt::TextSelectableByMouse);
  banner_->setAccessibleName(tr("View status"));
  banner_->hide();
  withdrawn_ = new QLabel;
  withdrawn_->setWordWrap(true);
  withdrawn_->setAlignment(Qt::AlignCenter);
  withdrawn_->setMargin(24);
  withdrawn_->setAutoFillBackground(true);
  withdrawn_->setBackgroundRole(QPalette::Base);
  withdrawn_->setAccessibleName(tr("No figures for this campaign"));
  pages_ = new QStackedWidget;
  pages_->addWidget(content_);
  pages_->addWidget(withdrawn_);
  auto* layout = new QVBoxLayout(this);
  layout->setContentsMargins(0, 0, 0, 0);
  layout->setSpacing(0);
  layout->addWidget(banner_);
  layout->addWidget(pages_, 1);
  veil_ = new Veil(pages_);
  veil_->hide();
  pages_->installEventFilter(this);
}

void ViewFrame::set_banner(const QString& message, bool warning) {
  banner_->setText(message);
  banner_->setVisible(!message.isEmpty());
  // Tint the banner from the system palette so light and dark themes both read well.
  QPalette p = palette();
  const QColor base = p.color(QPalette::Window);
  const QColor tint = warning ? gramline_colour::alert() : p.color(QPalette::Highlight);
  const auto mix = [](const QColor& a, const QColor& b, double t) {
    return QColor::fromRgbF(a.redF() * (1 - t) + b.redF() * t,
                            a.greenF() * (1 - t) + b.greenF() * t,
                            a.blueF() * (1 - t) + b.blueF() * t);
  };
  p.setColor(QPalette::Window, mix(base, tint, 0.22));
  banner_->setPalette(p);
  place_veil();
}

QString ViewFrame::banner() const { return banner_->isHidden() ? QString() : banner_->text(); }

void ViewFrame::set_stale(bool stale) {
  stale_ = stale;
  veil_->setVisible(stale && content_shown());
  place_veil();
}

void ViewFrame::set_withdrawn(const QString& reason) {
  withdrawn_->setText(reason);
  pages_->setCurrentWidget(reason.isEmpty() ? content_ : static_cast<QWidget*>(withdrawn_));
  veil_->setVisible(stale_ && content_shown());
  place_veil();
}

bool ViewFrame::withdrawn() const { return pages_->currentWidget() == withdrawn_; }

bool ViewFrame::content_shown() const { return pages_->currentWidget() == content_; }

bool ViewFrame::eventFilter(QObject* watched, QEvent* event) {
  if (watched == pages_ && event->type() == QEvent::Resize) place_veil();
  return QWidget::eventFilter(watched, event);
}

void ViewFrame::place_veil() {
  veil_->setGeometry(pages_->rect());
  veil_->raise();
}

}  // namespace gramline::gui
