#pragma once
// How the app shows the state of a background job in the status bar: a line of text, a progress
// bar while the job runs and, for jobs the user may stop, a cancel button.
#include <QString>
#include <QWidget>

class QLabel;
class QProgressBar;
class QPushButton;

namespace gramline::gui {

class JobRunnerBase;

class StatusIndicator : public QWidget {
  Q_OBJECT

 public:
  struct Look {
    QString text_name;      ///< accessible name of the text (empty: none)
    QString progress_name;  ///< accessible name of the progress bar
    QString cancel_text;    ///< text of the cancel button; empty: no button
    QString cancel_name;    ///< accessible name of the cancel button
    int bar_width = 180;    ///< widest the progress bar grows, in pixels
    bool percent = false;   ///< print the percentage on the bar
    bool measured = true;   ///< false: the job reports no progress and the bar only moves
    /// The text takes the free width: the status bar's leading item, which stays in place
    /// (the status bar hides it while it shows a message). Any other indicator takes no room
    /// while it shows nothing.
    bool stretch = false;
  };

  explicit StatusIndicator(const Look& look, QWidget* parent = nullptr);

  /// Shows the progress bar and the cancel button while `job` runs (from started() to its
  /// end); the cancel button cancels it. May follow several jobs that never run together.
  void follow(JobRunnerBase* job);
  /// The line of text; empty hides it.
  void set_text(const QString& text);
  QString text() const;
  /// The progress bar is shown.
  bool running() const;
  /// As tall as the tallest part, shown or hidden: the status bar keeps one height whatever
  /// the jobs do.
  QSize minimumSizeHint() const override;

 private:
  void show_running(bool running);
  void fit();

  bool collapse_;
  QLabel* text_;
  QProgressBar* bar_;
  QPushButton* cancel_ = nullptr;
};

}  // namespace gramline::gui
