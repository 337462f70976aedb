// How long the app takes from an edit of the campaign to views that show the new plan, on the
// demo campaign, in the window the user sees (offscreen platform). Prints figures; never run as
// a test. Usage: bench_edit_to_views [EDITS_PER_SCENARIO]
//
// Each edit changes the controller's settle time, as its spin box does (CampaignDocument::edit).
// The clock starts just before the edit and stops when the plan of the edited campaign has been
// handed to the views ("updated"), then again after the event loop has repainted them ("painted").
// The plan records the planner's own time (plan_ms); the rest (updated - plan_ms) is the app's
// part: starting the job, handing the plan back and filling the views. Scenarios:
//   idle       nothing runs when the edit arrives (the margin check of the previous plan is
//              stopped first);
//   checking   the edit arrives while the margin check of the previous plan runs;
//   burst      five edits 20 ms apart (an arrow key held on a spin box), timed from the last.
#include <QApplication>
#include <QElapsedTimer>
#include <QFile>
#include <QStandardPaths>
#include <QThread>
#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <vector>

#include "campaign_document.h"
#include "main_window.h"
#include "margin_runner.h"
#include "plan_runner.h"
#include "summary_view.h"

using gramline::gui::MainWindow;

namespace {

struct Timing {
  double updated_ms = 0.0;
  double painted_ms = 0.0;
  double plan_ms = 0.0;     ///< the planner's own time, as the plan records it
  double started_ms = 0.0;  ///< edit -> the (last) planning job started
};

double ms(const QElapsedTimer& t) { return static_cast<double>(t.nsecsElapsed()) / 1e6; }

void wait_until(const std::function<bool()>& done) {
  while (!done()) QCoreApplication::processEvents(QEventLoop::WaitForMoreEvents, 50);
}

bool settled(const MainWindow& w) {
  return w.runner()->plan() != nullptr && !w.runner()->busy() && !w.margin_runner()->busy();
}

void pause_ms(int wait) {
  QElapsedTimer t;
  t.start();
  while (t.elapsed() < wait) QCoreApplication::processEvents(QEventLoop::AllEvents, 5);
}

// Settle times cycle through values none of which equals the one before, so every edit changes
// the plan's moving time.
double next_settle(int& counter) { return 0.1 * (1 + ++counter % 7); }

void edit_settle(MainWindow& w, double settle_s) {
  w.document()->edit(QStringLiteral("Change settle time"),
                     [settle_s](gramline::Campaign& c) { c.rig.controller.settle_s = settle_s; });
}

// Stops the margin check so that nothing runs in the background.
void go_idle(MainWindow& w) {
  wait_until([&] { return w.runner()->plan() != nullptr && !w.runner()->busy(); });
  w.margin_runner()->cancel();
  wait_until([&] { return settled(w); });
}

// Times one edit (or the last of `burst` edits) until the new plan is shown and painted.
Timing time_edit(MainWindow& w, int& counter, int burst) {
  const auto before = w.runner()->plan();
  const QString moving_before = w.summary_view()->figure(QStringLiteral("moving"));
  QElapsedTimer t;
  for (int i = 1; i < burst; ++i) {
    edit_settle(w, next_settle(counter));
    pause_ms(20);
  }
  double settle_s = next_settle(counter);
  if (settle_s == w.document()->campaign().rig.controller.settle_s) settle_s = next_settle(counter);
  double started_ms = -1.0;
  const auto started = QObject::connect(w.runner(), &gramline::gui::PlanRunner::started,
                                        [&] { started_ms = ms(t); });
  t.start();
  edit_settle(w, settle_s);
  wait_until([&] {
    return w.runner()->plan() != before && !w.runner()->busy() &&
           w.runner()->planned_campaign().rig.controller.settle_s == settle_s;
  });
  Timing out;
  out.updated_ms = ms(t);
  QCoreApplication::processEvents();  // paints what changed
  out.painted_ms = ms(t);
  out.plan_ms = w.runner()->plan()->summary.plan_ms;
  out.started_ms = started_ms;
  QObject::disconnect(started);
  if (w.summary_view()->figure(QStringLiteral("moving")) == moving_before)
    std::printf("  (note: the summary's moving time did not change with this edit)\n");
  return out;
}

void report(const char* name, std::vector<Timing> runs) {
  const auto median = [](std::vector<double> v) {
    std::sort(v.begin(), v.end());
    const std::size_t n = v.size();
    return n % 2 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
  };
  std::vector<double> updated, painted, planning, started, rest;
  for (const Timing& r : runs) {
    updated.push_back(r.updated_ms);
    painted.push_back(r.painted_ms);
    planning.push_back(r.plan_ms);
    started.push_back(r.started_ms);
    rest.push_back(r.updated_ms - r.plan_ms);
  }
  std::printf(
      "%-9s %3zu edits  updated: median %6.1f ms, min %6.1f, max %6.1f   "
      "painted: median %6.1f ms, max %6.1f\n"
      "%-9s planning started after: median %6.1f ms; plan_ms median %5.1f; "
      "updated - plan_ms median %5.1f\n",
      name, runs.size(), median(updated), *std::min_element(updated.begin(), updated.end()),
      *std::max_element(updated.begin(), updated.end()), median(painted),
      *std::max_element(painted.begin(), painted.end()), "", median(started), median(planning),
      median(rest));
}

QString load_average() {
  QFile f(QStringLiteral("/proc/loadavg"));
  if (!f.open(QIODevice::ReadOnly)) return QStringLiteral("unknown");
  return QString::fromLatin1(f.readAll()).section(QLatin1Char(' '), 0, 2);
}

}  // namespace

int main(int argc, char** argv) {
  if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) qputenv("QT_QPA_PLATFORM", "offscreen");
  QApplication app(argc, argv);
  // Keep the user's settings and autosaves out of it.
  QStandardPaths::setTestModeEnabled(true);
  QCoreApplication::setOrganizationName(QStringLiteral("gramline-bench"));
  QCoreApplication::setApplicationName(QStringLiteral("gramline-bench"));
  const int edits = argc > 1 ? std::max(1, std::atoi(argv[1])) : 12;

  MainWindow w;
  w.resize(1400, 860);
  w.show();
  w.load_demo();
  go_idle(w);
  std::printf(
      "Edit -> updated views on the demo (%d training points, %zu steps), %d cores, "
      "load average %s\n",
      static_cast<int>(w.document()->campaign().data.train_count()),
      w.runner()->plan()->steps.size(), QThread::idealThreadCount(), qPrintable(load_average()));
  std::printf("planning alone (plan_ms of the first plan): %.1f ms\n",
              w.runner()->plan()->summary.plan_ms);

  int counter = 0;
  std::vector<Timing> idle, checking, burst;
  for (int i = 0; i < edits; ++i) {
    go_idle(w);
    idle.push_back(time_edit(w, counter, 1));
  }
  for (int i = 0; i < edits; ++i) {
    // The check of the plan just shown starts with it; a quick one may be done already.
    wait_until([&] { return settled(w) || w.margin_runner()->busy(); });
    checking.push_back(time_edit(w, counter, 1));
  }
  for (int i = 0; i < edits; ++i) {
    go_idle(w);
    burst.push_back(time_edit(w, counter, 5));
  }
  report("idle", idle);
  report("checking", checking);
  report("burst", burst);
  std::printf("goal: edit -> updated views <= 100 ms\n");
  return 0;
}
