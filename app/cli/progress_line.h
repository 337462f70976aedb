#pragma once
// Progress of long work, drawn on one line of standard error while the work runs. Only a person
// watching a terminal gains from it: when standard error is a file or a pipe nothing is written,
// so logs and scripts see the same text as before.
#include <chrono>
#include <mutex>
#include <string>

#include "gramline/progress.h"

namespace gramline::cli {

/// Plans usually take well under a second: their progress shows only when one runs longer.
inline constexpr double kPlanProgressDelay_s = 2.0;

class ProgressLine {
 public:
  /// A line "LABEL: NN %" that appears once the work has run `delay_s` seconds (0: at the first
  /// report), when standard error is a terminal.
  ProgressLine(std::string label, double delay_s);
  /// Clears the line.
  ~ProgressLine();
  ProgressLine(const ProgressLine&) = delete;
  ProgressLine& operator=(const ProgressLine&) = delete;

  /// Hooks whose progress callback draws this line (may be called from any thread); no cancel
  /// flag. Empty when standard error is not a terminal. Valid while this object lives.
  WorkHooks hooks();

  /// Clears the line now (before other text goes to standard error).
  void clear();

 private:
  void draw(double fraction);

  std::string label_;
  std::chrono::steady_clock::time_point start_;
  std::chrono::steady_clock::time_point last_draw_;
  double delay_s_;
  bool terminal_;
  bool shown_ = false;
  int last_percent_ = -1;
  size_t width_ = 0;
  std::mutex mutex_;
};

}  // namespace gramline::cli
