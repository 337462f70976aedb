#pragma once
// A view with a banner above it that says when its figures are out of date or missing.
// Figures of an older campaign are never mixed with the current one: while a new plan is
// computed they stay under a hatched veil (drawn by a child widget, so each view paints only
// itself), and when there is no plan for the campaign at all they are replaced by a page that
// says why.
#include <QWidget>

class QLabel;
class QStackedWidget;

namespace gramline::gui {

class ViewFrame : public QWidget {
  Q_OBJECT

 public:
  ViewFrame(QWidget* content, QWidget* parent = nullptr);
  QWidget* content() const { return content_; }
  /// Shows `message` in the banner (empty hides it); `warning` uses the stronger colour.
  void set_banner(const QString& message, bool warning = false);
  QString banner() const;
  /// Veils the content while it shows figures of an older campaign (a new plan is coming).
  void set_stale(bool stale);
  bool stale() const { return stale_; }
  /// Replaces the content by a page saying `reason` (there is no plan for this campaign);
  /// an empty reason shows the content again.
  void set_withdrawn(const QString& reason);
  bool withdrawn() const;
  /// True when the content itself is what the user sees (not the withdrawn page).
  bool content_shown() const;

 protected:
  bool eventFilter(QObject* watched, QEvent* event) override;

 private:
  void place_veil();

  QWidget* content_;
  QLabel* banner_;
  QStackedWidget* pages_;
  QLabel* withdrawn_;
  QWidget* veil_;
  bool stale_ = false;
};

}  // namespace gramline::gui
