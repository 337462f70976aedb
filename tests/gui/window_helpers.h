#pragma once
// What the app's window tests share: a quick margin check and "planning has settled".
#include "main_window.h"
#include "margin_runner.h"
#include "plan_runner.h"

namespace gui_test {

/// Long enough for any plan or check of the demo on a loaded machine.
constexpr int kWaitMs = 120000;

/// Keeps the Monte Carlo small: these tests are about the window, not the statistics.
inline void make_quick(gramline::gui::MainWindow& w) {
  auto& o = w.margin_runner()->options();
  o.trials = 20;
  o.minimum_budget = false;
  o.compare_allocations = false;
  o.scan_scale = false;
}

/// A plan is shown and neither planning nor the margin check runs.
inline bool settled(const gramline::gui::MainWindow& w) {
  return !w.runner()->busy() && !w.margin_runner()->busy() && w.runner()->plan() != nullptr;
}

}  // namespace gui_test
