// The app's one worker pattern (JobRunner) and the planner built on it (PlanRunner): only the
// newest job's end is delivered, cancel and errors come back to the GUI thread, and a new
// request starts planning at once while the plan still running stops at its cancel flag.
// Jobs are held at known points with semaphores, never by waiting a time.
#include <QCoreApplication>
#include <QSemaphore>
#include <QSignalSpy>
#include <QTest>
#include <atomic>
#include <chrono>
#include <stdexcept>
#include <thread>

#include "gramline/demo.h"
#include "job_runner.h"
#include "plan_runner.h"

using gramline::Cancelled;
using gramline::WorkHooks;
using gramline::gui::JobRunner;
using gramline::gui::JobRunnerBase;
using gramline::gui::PlanRunner;

namespace {

constexpr int kWaitMs = 120000;

// Blocks until the job's cancel flag is raised; false if that has not happened within a minute
// (so a broken runner fails the test instead of hanging it).
bool wait_for_cancel(const WorkHooks& hooks) {
  const auto give_up = std::chrono::steady_clock::now() + std::chrono::minutes(1);
  while (!hooks.cancelled()) {
    if (std::chrono::steady_clock::now() > give_up) return false;
    std::this_thread::sleep_for(std::chrono::milliseconds(1));
  }
  return true;
}

struct Spies {
  explicit Spies(JobRunnerBase* runner)
      : started(runner, &JobRunnerBase::started),
        succeeded(runner, &JobRunnerBase::succeeded),
        failed(runner, &JobRunnerBase::failed),
        cancelled(runner, &JobRunnerBase::cancelled),
        progress(runner, &JobRunnerBase::progress) {}
  QSignalSpy started, succeeded, failed, cancelled, progress;
};

}  // namespace

class JobRunnerTest : public QObject {
  Q_OBJECT

 private slots:
  void result_of_a_job_is_delivered() {
    JobRunner<int> runner;
    Spies spy(&runner);
    QVERIFY(runner.result() == nullptr);
    runner.run([](const WorkHooks&) { return 42; });
    QCOMPARE(spy.started.count(), 1);
    QVERIFY(runner.busy());
    QTRY_COMPARE_WITH_TIMEOUT(spy.succeeded.count(), 1, kWaitMs);
    QVERIFY(!runner.busy());
    QVERIFY(runner.result() != nullptr);
    QCOMPARE(*runner.result(), 42);
    QCOMPARE(spy.failed.count() + spy.cancelled.count(), 0);
  }

  void newest_result_wins() {
    JobRunner<int> runner;
    Spies spy(&runner);
    QSemaphore first_running, release_first;
    // The first job ignores its cancel flag and returns after the second has delivered.
    runner.run([&](const WorkHooks&) {
      first_running.release();
      release_first.tryAcquire(1, kWaitMs);
      return 1;
    });
    QVERIFY(first_running.tryAcquire(1, kWaitMs));
    runner.run([](const WorkHooks&) { return 2; });
    QCOMPARE(spy.started.count(), 2);
    QTRY_COMPARE_WITH_TIMEOUT(spy.succeeded.count(), 1, kWaitMs);
    QCOMPARE(*runner.result(), 2);
    QCOMPARE(runner.jobs_alive(), 1);  // the first is still held
    release_first.release();
    QTRY_COMPARE_WITH_TIMEOUT(runner.jobs_alive(), 0, kWaitMs);
    // The older job's value came back after the newer one's and was dropped.
    QCOMPARE(spy.succeeded.count(), 1);
    QCOMPARE(*runner.result(), 2);
    QCOMPARE(spy.failed.count() + spy.cancelled.count(), 0);
    QVERIFY(!runner.busy());
  }

  void a_new_job_raises_the_flag_of_the_running_one() {
    JobRunner<int> runner;
    Spies spy(&runner);
    QSemaphore first_running;
    std::atomic<bool> saw_flag{false};
    runner.run([&](const WorkHooks& hooks) {
      first_running.release();
      saw_flag = wait_for_cancel(hooks);
      hooks.throw_if_cancelled();
      return 1;
    });
    QVERIFY(first_running.tryAcquire(1, kWaitMs));
    runner.run([](const WorkHooks&) { return 2; });
    QTRY_COMPARE_WITH_TIMEOUT(runner.jobs_alive(), 0, kWaitMs);
    QVERIFY(saw_flag);
    // The superseded job's cancellation is not news: only the newest job's end is delivered.
    QCOMPARE(spy.cancelled.count(), 0);
    QCOMPARE(spy.succeeded.count(), 1);
    QCOMPARE(*runner.result(), 2);
  }

  void cancel_stops_the_running_job() {
    JobRunner<int> runner;
    Spies spy(&runner);
    QSemaphore running;
    runner.run([&running](const WorkHooks& hooks) {
      running.release();
      if (!wait_for_cancel(hooks)) return -1;  // never cancelled: the result shows it
      hooks.throw_if_cancelled();
      return 1;
    });
    QVERIFY(running.tryAcquire(1, kWaitMs));
    QVERIFY(runner.busy());
    runner.cancel();
    QTRY_COMPARE_WITH_TIMEOUT(spy.cancelled.count(), 1, kWaitMs);
    QVERIFY(!runner.busy());
    QCOMPARE(spy.succeeded.count(), 0);
    QCOMPARE(spy.failed.count(), 0);
    QVERIFY(runner.result() == nullptr);
  }

  void errors_are_delivered_and_the_last_result_is_kept() {
    JobRunner<int> runner;
    Spies spy(&runner);
    runner.run([](const WorkHooks&) { return 7; });
    QTRY_COMPARE_WITH_TIMEOUT(spy.succeeded.count(), 1, kWaitMs);
    const QString message = QStringLiteral("rig.motors[2].speed_deg_per_s: must be positive");
    runner.run(
        [message](const WorkHooks&) -> int { throw std::invalid_argument(message.toStdString()); });
    QTRY_COMPARE_WITH_TIMEOUT(spy.failed.count(), 1, kWaitMs);
    QCOMPARE(spy.failed.at(0).at(0).toString(), message);
    QCOMPARE(*runner.result(), 7);
    QVERIFY(!runner.busy());
    // Something that is not a std::exception still ends the job with a message.
    runner.run([](const WorkHooks&) -> int { throw 3; });
    QTRY_COMPARE_WITH_TIMEOUT(spy.failed.count(), 2, kWaitMs);
    QVERIFY(!spy.failed.at(1).at(0).toString().isEmpty());
    QCOMPARE(spy.cancelled.count(), 0);
    QCOMPARE(spy.succeeded.count(), 1);
  }

  void progress_is_polled_on_the_gui_thread() {
    JobRunner<int> runner(10);
    Spies spy(&runner);
    QSemaphore release;
    runner.run([&release](const WorkHooks& hooks) {
      hooks.report(0.25);
      release.tryAcquire(1, kWaitMs);
      return 1;
    });
    QTRY_VERIFY_WITH_TIMEOUT(
        !spy.progress.isEmpty() && spy.progress.last().at(0).toDouble() == 0.25, kWaitMs);
    release.release();
    QTRY_COMPARE_WITH_TIMEOUT(spy.succeeded.count(), 1, kWaitMs);
  }

  // An edit starts planning before request() returns, and a second edit cancels the plan of the
  // first: the engine's own plan_campaign stops at the raised flag and only the second plan is
  // delivered.
  void planning_starts_at_once_and_a_new_request_cancels_the_running_plan() {
    PlanRunner runner;
    Spies spy(&runner);
    QSignalSpy stale(&runner, &PlanRunner::stale);
    QSemaphore first_running;
    std::atomic<int> calls{0};
    std::atomic<bool> first_saw_flag{false}, first_cancelled{false};
    runner.set_planner([&](const gramline::Campaign& c, const gramline::PlanOptions& o) {
      if (calls++ > 0) return gramline::plan_campaign(c, o);
      first_running.release();
      first_saw_flag = wait_for_cancel(o.hooks);  // held until the next request
      try {
        return gramline::plan_campaign(c, o);
      } catch (const Cancelled&) {
        first_cancelled = true;
        throw;
      }
    });
    gramline::Campaign first = gramline::make_demo_campaign();
    gramline::Campaign second = first;
    second.rig.controller.settle_s = first.rig.controller.settle_s + 0.5;

    runner.request(first);
    QCOMPARE(stale.count(), 1);
    QCOMPARE(spy.started.count(), 1);  // no wait before planning starts
    QVERIFY(runner.busy());
    QVERIFY(first_running.tryAcquire(1, kWaitMs));
    runner.request(second);
    QCOMPARE(stale.count(), 2);
    QCOMPARE(spy.started.count(), 2);
    QTRY_VERIFY_WITH_TIMEOUT(!runner.busy() && runner.jobs_alive() == 0, kWaitMs);
    QVERIFY(first_saw_flag);
    QVERIFY(first_cancelled);
    QCOMPARE(calls.load(), 2);
    QCOMPARE(spy.succeeded.count(), 1);
    QCOMPARE(spy.cancelled.count() + spy.failed.count(), 0);
    QCOMPARE(runner.planned_campaign().rig.controller.settle_s, second.rig.controller.settle_s);

    // What is delivered is the second campaign's plan, as the engine makes it directly.
    gramline::PlanOptions options;
    options.seed = second.seed;
    const gramline::Plan direct = gramline::plan_campaign(second, options);
    QCOMPARE(runner.plan()->steps.size(), direct.steps.size());
    QCOMPARE(runner.plan()->summary.move_s, direct.summary.move_s);
    QCOMPARE(runner.plan()->summary.total_s, direct.summary.total_s);
  }

  void a_campaign_that_cannot_be_planned_fails_with_the_reason() {
    PlanRunner runner;
    Spies spy(&runner);
    gramline::Campaign broken = gramline::make_demo_campaign();
    broken.rig.source.visibility = -1.0;
    const std::string reason = broken.check_consistency();
    QVERIFY(!reason.empty());
    runner.request(broken);
    QTRY_COMPARE_WITH_TIMEOUT(spy.failed.count(), 1, kWaitMs);
    QCOMPARE(spy.failed.at(0).at(0).toString(), QString::fromStdString(reason));
    QVERIFY(runner.plan() == nullptr);
  }
};

QTEST_GUILESS_MAIN(JobRunnerTest)
#include "test_job_runner.moc"
