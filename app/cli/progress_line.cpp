#include "cli/progress_line.h"

#include <unistd.h>

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace gramline::cli {

ProgressLine::ProgressLine(std::string label, double delay_s)
    : label_(std::move(label)),
      start_(std::chrono::steady_clock::now()),
      delay_s_(delay_s),
      terminal_(isatty(STDERR_FILENO) == 1) {}

ProgressLine::~ProgressLine() { clear(); }

WorkHooks ProgressLine::hooks() {
  WorkHooks hooks;
  if (terminal_) hooks.progress = [this](double fraction) { draw(fraction); };
  return hooks;
}

void ProgressLine::draw(double fraction) {
  if (!std::isfinite(fraction)) return;
  const int percent = static_cast<int>(std::lround(100.0 * std::clamp(fraction, 0.0, 1.0)));
  const std::lock_guard<std::mutex> lock(mutex_);
  const auto now = std::chrono::steady_clock::now();
  if (std::chrono::duration<double>(now - start_).count() < delay_s_) return;
  // A tenth of a second between redraws is smooth to the eye and cheap.
  if (percent == last_percent_ ||
      (shown_ && percent < 100 && now - last_draw_ < std::chrono::milliseconds(100)))
    return;
  const std::string text = label_ + ": " + std::to_string(percent) + " %";
  std::fprintf(stderr, "\r%s", text.c_str());
  std::fflush(stderr);
  width_ = std::max(width_, text.size());
  shown_ = true;
  last_percent_ = percent;
  last_draw_ = now;
}

void ProgressLine::clear() {
  const std::lock_guard<std::mutex> lock(mutex_);
  if (!shown_) return;
  std::fprintf(stderr, "\r%s\r", std::string(width_, ' ').c_str());
  std::fflush(stderr);
  shown_ = false;
  last_percent_ = -1;
}

}  // namespace gramline::cli
