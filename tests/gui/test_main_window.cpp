// The desktop app end to end: open the demo, edit a motor, watch the plan and the summary
// follow; undo; save and open again. Runs on the offscreen platform.
#include <QApplication>
#include <QDir>
#include <QElapsedTimer>
#include <QFile>
#include <QMessageBox>
#include <QPushButton>
#include <QSemaphore>
#include <QSettings>
#include <QSignalSpy>
#include <QStandardPaths>
#include <QTemporaryDir>
#include <QTest>
#include <QTimer>
#include <QUndoStack>
#include <atomic>
#include <chrono>
#include <thread>

#include "campaign_document.h"
#include "editor_panel.h"
#include "formats/campaign_json.h"
#include "gramline/demo.h"
#include "main_window.h"
#include "margin_runner.h"
#include "plan_runner.h"
#include "rig_tables.h"
#include "status_indicator.h"
#include "steps_view.h"
#include "summary_view.h"
#include "timeline_view.h"
#include "view_frame.h"
#include "window_helpers.h"

using gramline::gui::MainWindow;

namespace {

using gui_test::kWaitMs;
using gui_test::make_quick;
using gui_test::settled;

}  // namespace

class MainWindowTest : public QObject {
  Q_OBJECT

 private slots:
  void initTestCase() {
    QStandardPaths::setTestModeEnabled(true);
    QCoreApplication::setOrganizationName(QStringLiteral("gramline-tests"));
    QCoreApplication::setApplicationName(QStringLiteral("gramline-tests"));
  }

  void demo_edit_undo() {
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    const auto before = w.runner()->plan();
    const QString moving_before = w.summary_view()->figure(QStringLiteral("moving"));
    const QString total_before = w.summary_view()->figure(QStringLiteral("total"));
    QVERIFY(!moving_before.isEmpty() && moving_before != QStringLiteral("–"));
    QVERIFY(!w.document()->modified());

    // Slow the first motor down through the motors table, as a user would.
    auto* motors = w.editor()->motors_model();
    const QModelIndex speed = motors->index(0, gramline::gui::MotorsModel::kSpeed);
    const double old_speed = w.document()->campaign().rig.motors[0].speed_deg_per_s;
    QVERIFY(motors->setData(speed, old_speed / 5.0, Qt::EditRole));
    QCOMPARE(w.document()->campaign().rig.motors[0].speed_deg_per_s, old_speed / 5.0);
    QVERIFY(w.document()->modified());
    // The views are marked stale until the new plan arrives.
    QVERIFY(!w.frame(MainWindow::kSummary)->banner().isEmpty());
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && w.runner()->plan() != before, kWaitMs);
    const auto slower = w.runner()->plan();
    QVERIFY(slower->summary.move_s > before->summary.move_s);
    QVERIFY(w.summary_view()->figure(QStringLiteral("moving")) != moving_before);
    QVERIFY(w.frame(MainWindow::kSummary)->banner().isEmpty());

    // Undo restores the campaign, the plan's figures and what the summary shows.
    w.document()->undo_stack()->undo();
    QCOMPARE(w.document()->campaign().rig.motors[0].speed_deg_per_s, old_speed);
    QVERIFY(!w.document()->modified());
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && w.runner()->plan() != slower, kWaitMs);
    const auto restored = w.runner()->plan();
    QCOMPARE(restored->summary.move_s, before->summary.move_s);
    QCOMPARE(restored->summary.total_s, before->summary.total_s);
    QCOMPARE(restored->steps.size(), before->steps.size());
    QCOMPARE(w.summary_view()->figure(QStringLiteral("moving")), moving_before);
    QCOMPARE(w.summary_view()->figure(QStringLiteral("total")), total_before);

    // Redo brings the edit back.
    w.document()->undo_stack()->redo();
    QCOMPARE(w.document()->campaign().rig.motors[0].speed_deg_per_s, old_speed / 5.0);
  }

  // Each edit plans at once; an edit that arrives while a plan runs cancels it, and the views
  // show the plan of the last edit.
  void edits_replan_at_once_and_cancel_the_running_plan() {
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    QSemaphore first_running;
    std::atomic<int> calls{0};
    std::atomic<bool> first_cancelled{false};
    w.runner()->set_planner([&](const gramline::Campaign& c, const gramline::PlanOptions& o) {
      if (calls++ > 0) return gramline::plan_campaign(c, o);
      first_running.release();
      // Held until the next edit raises the flag (or a minute passes, failing below).
      const auto give_up = std::chrono::steady_clock::now() + std::chrono::minutes(1);
      while (!o.hooks.cancelled() && std::chrono::steady_clock::now() < give_up)
        std::this_thread::sleep_for(std::chrono::milliseconds(1));
      try {
        return gramline::plan_campaign(c, o);
      } catch (const gramline::Cancelled&) {
        first_cancelled = true;
        throw;
      }
    });
    QSignalSpy started(w.runner(), &gramline::gui::PlanRunner::started);
    const double settle_s = w.document()->campaign().rig.controller.settle_s;

    w.document()->edit(QStringLiteral("first edit"), [settle_s](gramline::Campaign& c) {
      c.rig.controller.settle_s = settle_s + 0.4;
    });
    QCOMPARE(started.count(), 1);  // planning began within the edit
    QVERIFY(w.plan_status()->running());
    QVERIFY(!w.frame(MainWindow::kSummary)->banner().isEmpty());
    QVERIFY(first_running.tryAcquire(1, kWaitMs));
    w.document()->edit(QStringLiteral("second edit"), [settle_s](gramline::Campaign& c) {
      c.rig.controller.settle_s = settle_s + 0.8;
    });
    QCOMPARE(started.count(), 2);
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && w.runner()->jobs_alive() == 0, kWaitMs);
    QVERIFY(first_cancelled);
    QCOMPARE(calls.load(), 2);
    QCOMPARE(w.runner()->planned_campaign().rig.controller.settle_s, settle_s + 0.8);
    QVERIFY(w.frame(MainWindow::kSummary)->banner().isEmpty());
    QVERIFY(!w.plan_status()->running());
    QVERIFY2(w.plan_status()->text().startsWith(QStringLiteral("Planned ")),
             qPrintable(w.plan_status()->text()));
  }

  // A hidden timeline draws the newest plan when it is shown, not while other views are.
  void timeline_catches_up_when_shown() {
    MainWindow w;
    make_quick(w);
    w.show();
    w.views()->setCurrentIndex(MainWindow::kSummary);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    const auto first = w.runner()->plan();
    QCOMPARE(w.timeline_view()->drawn_plan(), first);  // the first plan is drawn at once
    w.document()->edit(QStringLiteral("slower settle"),
                       [](gramline::Campaign& c) { c.rig.controller.settle_s += 0.3; });
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && w.runner()->plan() != first, kWaitMs);
    QCOMPARE(w.timeline_view()->drawn_plan(), first);
    w.views()->setCurrentIndex(MainWindow::kTimeline);
    QCOMPARE(w.timeline_view()->drawn_plan(), w.runner()->plan());
  }

  void save_and_open_round_trip() {
    QTemporaryDir dir;
    QVERIFY(dir.isValid());
    const QString path = dir.filePath(QStringLiteral("night.json"));
    std::string saved_text;
    double saved_total_s = 0.0;
    {
      MainWindow w;
      make_quick(w);
      w.load_demo();
      w.document()->edit(QStringLiteral("test edit"), [](gramline::Campaign& c) {
        c.rig.controller.settle_s = 0.8;
        c.nights.max_nights = 5;
      });
      QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
      QVERIFY(w.save_to(path));
      QVERIFY(!w.document()->modified());
      QCOMPARE(w.document()->path(), QFileInfo(path).absoluteFilePath());
      saved_text = gramline::formats::format_campaign(w.document()->campaign());
      saved_total_s = w.runner()->plan()->summary.total_s;
    }
    MainWindow w2;
    make_quick(w2);
    QVERIFY(w2.open_file(path));
    QVERIFY(!w2.document()->modified());
    QCOMPARE(gramline::formats::format_campaign(w2.document()->campaign()), saved_text);
    QCOMPARE(w2.document()->campaign().rig.controller.settle_s, 0.8);
    QTRY_VERIFY_WITH_TIMEOUT(settled(w2), kWaitMs);
    QCOMPARE(w2.runner()->plan()->summary.total_s, saved_total_s);
  }

  void steps_filter_and_jump() {
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    auto* steps = w.steps_view();
    auto* model = steps->model();
    const auto plan = w.runner()->plan();
    QCOMPARE(model->rowCount(), static_cast<int>(plan->steps.size()));
    gramline::gui::StepFilter f;
    f.kind = static_cast<int>(gramline::StepKind::reference);
    model->set_filter(f);
    QVERIFY(model->rowCount() > 0);
    for (int r = 0; r < model->rowCount(); ++r)
      QCOMPARE(plan->steps[static_cast<std::size_t>(model->step_at_row(r))].kind,
               gramline::StepKind::reference);
    // Jumping to a measure step clears a filter that hides it.
    int measure = 0;
    while (plan->steps[static_cast<std::size_t>(measure)].kind != gramline::StepKind::measure)
      ++measure;
    QVERIFY(steps->go_to_step(measure));
    QVERIFY(model->row_of_step(measure) >= 0);
  }

  // The steps table reads the plan in place: half a million steps cost one int per shown row.
  void steps_view_with_half_a_million_rows() {
    const gramline::Campaign campaign = gramline::make_demo_campaign();
    auto plan = std::make_shared<gramline::Plan>();
    const int count = 500000;
    plan->steps.resize(count);
    for (int i = 0; i < count; ++i) {
      gramline::Step& s = plan->steps[static_cast<std::size_t>(i)];
      s.kind = i % 50 == 0 ? gramline::StepKind::reference : gramline::StepKind::measure;
      s.night = 1 + i / 100000;
      s.prep_point = i % 48;
      s.analysis_point = (i / 48) % 48;
      s.start_s = i * 2.0;
      s.position_deg.assign(campaign.rig.motors.size(), 1.0);
    }
    plan->summary.nights = 5;
    gramline::gui::StepsView view;
    QElapsedTimer timer;
    timer.start();
    view.set_plan(plan, campaign);
    QCOMPARE(view.model()->rowCount(), count);
    gramline::gui::StepFilter f;
    f.night = 3;
    view.model()->set_filter(f);
    QCOMPARE(view.model()->rowCount(), 100000);
    view.resize(900, 600);
    view.show();
    QVERIFY(view.go_to_step(count - 1));  // clears the night filter that hides it
    QCOMPARE(view.model()->rowCount(), count);
    QCoreApplication::processEvents();
    qInfo("500 000 steps: load, filter, jump and paint in %lld ms", timer.elapsed());
    QVERIFY(view.model()->data(view.model()->index(count - 1, 0), Qt::DisplayRole).toInt() ==
            count - 1);
  }

  void unplannable_campaign_says_why() {
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    w.document()->edit(QStringLiteral("break it"),
                       [](gramline::Campaign& c) { c.rig.source.visibility = -1.0; });
    QTRY_VERIFY_WITH_TIMEOUT(!w.runner()->busy(), kWaitMs);
    QVERIFY(w.frame(MainWindow::kSummary)->banner().contains(QStringLiteral("Cannot plan")));
    w.document()->undo_stack()->undo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && w.frame(MainWindow::kSummary)->banner().isEmpty(),
                             kWaitMs);
  }

  void recovers_the_autosave_of_a_crashed_session() {
    // A session that died leaves its autosave behind and no live lock; the next start offers it.
    const QString dir =
        QStandardPaths::writableLocation(QStandardPaths::AppDataLocation) + "/autosave";
    QVERIFY(QDir().mkpath(dir));
    const QString left = dir + "/session-3999999.json";  // a process id no session has now
    gramline::Campaign crashed = gramline::make_demo_campaign();
    crashed.name = "work of a crashed session";
    crashed.rig.motors[0].speed_deg_per_s = 7.5;
    gramline::formats::save_campaign(crashed, left);
    QSettings(left + ".ini", QSettings::IniFormat).setValue("original", "/tmp/night.gramline.json");

    MainWindow w;
    make_quick(w);
    // Answer the recovery question as a user would.
    QTimer::singleShot(0, [] {
      auto* box = qobject_cast<QMessageBox*>(QApplication::activeModalWidget());
      if (box) box->button(QMessageBox::Yes)->click();
    });
    w.offer_recovery();
    QCOMPARE(QString::fromStdString(w.document()->campaign().name),
             QStringLiteral("work of a crashed session"));
    QCOMPARE(w.document()->campaign().rig.motors[0].speed_deg_per_s, 7.5);
    QVERIFY(w.document()->modified());  // recovered work still needs saving
    QVERIFY(!QFile::exists(left));
  }
};

QTEST_MAIN(MainWindowTest)
#include "test_main_window.moc"
