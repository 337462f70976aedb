#pragma once
// A view with a banner above it that says when its figures are out of date or missing.
#include <QWidget>

class QLabel;

namespace gramline::gui {

class ViewFrame : public QWidget {
  Q_OBJECT

 public:
  ViewFrame(QWidget* content, QWidget* parent = nullptr);
  QWidget* content() const { return content_; }
  /// Shows `message` in the banner (empty hides it); `warning` uses the stronger colour.
  void set_banner(const QString& message, bool warning = false);
  QString banner() const;
  /// Greys the content while it shows figures of an older campaign.
  void set_stale(bool stale);
  bool stale() const { return stale_; }

 private:
  QWidget* content_;
  QLabel* banner_;
  bool stale_ = false;
};

}  // namespace gramline::gui
