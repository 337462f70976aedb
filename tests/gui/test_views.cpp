// The views after a practitioner's trial: stale and missing figures are never mixed with the
// current campaign's, the Gram error maps group points by class and name the entry under the
// pointer, Ctrl+Z in a field undoes the campaign edit, recovery offers only the file being
// opened, and the Compare view sets a pinned plan beside the current one. Offscreen platform.
#include <QApplication>
#include <QComboBox>
#include <QDir>
#include <QDoubleSpinBox>
#include <QFile>
#include <QLineEdit>
#include <QMessageBox>
#include <QPushButton>
#include <QSettings>
#include <QStandardPaths>
#include <QTabWidget>
#include <QTest>
#include <QTimer>
#include <QUndoStack>

#include "campaign_document.h"
#include "chart_style.h"
#include "compare_view.h"
#include "editor_panel.h"
#include "formats/campaign_json.h"
#include "gram_view.h"
#include "gramline/demo.h"
#include "gramline/plan.h"
#include "gui_text.h"
#include "main_window.h"
#include "margin_runner.h"
#include "plan_runner.h"
#include "summary_view.h"
#include "view_frame.h"
#include "window_helpers.h"

using gramline::gui::MainWindow;

namespace {

using gui_test::kWaitMs;
using gui_test::make_quick;
using gui_test::settled;

const MainWindow::View kPlanViews[] = {MainWindow::kSummary, MainWindow::kSteps,
                                       MainWindow::kTimeline, MainWindow::kGram,
                                       MainWindow::kMargin};

/// The first widget position whose cell is (row, col), scanning the widget.
QPoint position_of(const gramline::gui::HeatmapWidget* map, int row, int col) {
  for (int y = 0; y < map->height(); ++y)
    for (int x = 0; x < map->width(); ++x)
      if (map->cell_at({x, y}) == QPoint(col, row)) return {x + 1, y + 1};
  return {-1, -1};
}

}  // namespace

class ViewsTest : public QObject {
  Q_OBJECT

 private slots:
  void initTestCase() {
    QStandardPaths::setTestModeEnabled(true);
    QCoreApplication::setOrganizationName(QStringLiteral("gramline-tests"));
    QCoreApplication::setApplicationName(QStringLiteral("gramline-views-tests"));
  }

  void stale_views_are_veiled_and_missing_plans_withdrawn() {
    MainWindow w;
    make_quick(w);
    w.resize(1200, 800);
    w.show();
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    for (MainWindow::View v : kPlanViews) {
      QVERIFY(w.frame(v)->content_shown());
      QVERIFY(!w.frame(v)->stale());
      // No graphics effect: each view paints only itself.
      QVERIFY(w.frame(v)->content()->graphicsEffect() == nullptr);
    }
    const QString settings_before = w.summary_view()->figure(QStringLiteral("settings"));
    QVERIFY(!settings_before.isEmpty() && settings_before != QStringLiteral("–"));

    // A new, empty campaign (File > New): nothing of the demo may stay on screen.
    w.document()->replace(gramline::Campaign{}, QString(), true);
    QTRY_VERIFY_WITH_TIMEOUT(!w.runner()->busy(), kWaitMs);
    for (MainWindow::View v : kPlanViews) {
      QVERIFY2(w.frame(v)->withdrawn(), qPrintable(QStringLiteral("view %1").arg(v)));
      QVERIFY(!w.frame(v)->content()->isVisible());
    }
    // Every tab in turn: the demo's figures are hidden on each.
    for (MainWindow::View v : kPlanViews) {
      w.views()->setCurrentIndex(v);
      QApplication::processEvents();
      QVERIFY(!w.frame(v)->content()->isVisible());
    }

    // The demo again: the views come back with the new plan.
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && w.frame(MainWindow::kSummary)->content_shown(), kWaitMs);
    QCOMPARE(w.summary_view()->figure(QStringLiteral("settings")), settings_before);

    // A campaign that cannot be planned: withdrawn too, with the reason in the banner.
    w.document()->edit(QStringLiteral("break it"),
                       [](gramline::Campaign& c) { c.rig.source.visibility = -1.0; });
    QTRY_VERIFY_WITH_TIMEOUT(!w.runner()->busy(), kWaitMs);
    for (MainWindow::View v : kPlanViews) {
      QVERIFY(w.frame(v)->withdrawn());
      QVERIFY(w.frame(v)->banner().contains(QStringLiteral("Cannot plan")));
    }
    w.document()->undo_stack()->undo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && !w.frame(MainWindow::kSummary)->withdrawn(), kWaitMs);

    // While a new plan is computed the old figures stay, veiled, with the banner saying so.
    w.document()->edit(QStringLiteral("slower settle"),
                       [](gramline::Campaign& c) { c.rig.controller.settle_s += 0.5; });
    QVERIFY(w.frame(MainWindow::kSummary)->stale());
    QVERIFY(!w.frame(MainWindow::kSummary)->banner().isEmpty());
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && !w.frame(MainWindow::kSummary)->stale(), kWaitMs);
  }

  void gram_maps_group_by_class_and_name_the_hovered_entry() {
    const gramline::Campaign campaign = gramline::make_demo_campaign();
    gramline::PlanOptions options;
    options.seed = campaign.seed;
    auto plan = std::make_shared<const gramline::Plan>(gramline::plan_campaign(campaign, options));
    gramline::gui::GramView view;
    view.resize(1100, 600);
    view.show();
    QVERIFY(QTest::qWaitForWindowExposed(&view));
    view.set_plan(plan, campaign);
    const Eigen::VectorXi& labels = campaign.data.train_labels;
    const int n = campaign.data.train_count();

    // File order: the identity.
    view.order_box()->setCurrentIndex(0);
    QCOMPARE(static_cast<int>(view.row_order().size()), n);
    for (int i = 0; i < n; ++i) QCOMPARE(view.row_order()[static_cast<std::size_t>(i)], i);
    const QImage file_order = view.kernel_map()->grab().toImage();

    // Grouped: a permutation with every point of class +1 before any of class -1, and within a
    // class the file order kept.
    view.order_box()->setCurrentIndex(1);
    const std::vector<int>& rows = view.row_order();
    QCOMPARE(static_cast<int>(rows.size()), n);
    std::vector<int> sorted = rows;
    std::sort(sorted.begin(), sorted.end());
    for (int i = 0; i < n; ++i) QCOMPARE(sorted[static_cast<std::size_t>(i)], i);
    for (int i = 1; i < n; ++i) {
      const int a = rows[static_cast<std::size_t>(i - 1)], b = rows[static_cast<std::size_t>(i)];
      QVERIFY(labels(a) >= labels(b));
      if (labels(a) == labels(b)) QVERIFY(a < b);
    }
    QVERIFY(view.col_order() == rows);
    // The demo's classes are interleaved in its file, so the grouped map must look different.
    QVERIFY(view.kernel_map()->grab().toImage() != file_order);

    // Each drawn cell has the colour of the kernel entry its order names.
    const QImage grouped = view.kernel_map()->grab().toImage();
    const qreal dpr = grouped.devicePixelRatio();
    for (int r : {0, n / 3, n - 1}) {
      for (int c : {1, n / 2, n - 2}) {
        const QPoint at = position_of(view.kernel_map(), r, c);
        QVERIFY(at.x() >= 0);
        const QColor drawn = grouped.pixelColor(QPoint(int(at.x() * dpr), int(at.y() * dpr)));
        const double k = plan->kernel_train(rows[static_cast<std::size_t>(r)],
                                            rows[static_cast<std::size_t>(c)]);
        const QColor expected = gramline::gui::heat_colour(k);
        QVERIFY2(std::abs(drawn.red() - expected.red()) <= 2 &&
                     std::abs(drawn.green() - expected.green()) <= 2 &&
                     std::abs(drawn.blue() - expected.blue()) <= 2,
                 qPrintable(QStringLiteral("cell %1,%2").arg(r).arg(c)));
      }
    }

    // Hover: the line below names the entry, its step, night and time.
    const int r = 2, c = n - 1;
    const int row = rows[static_cast<std::size_t>(r)], col = rows[static_cast<std::size_t>(c)];
    const QPoint at = position_of(view.kernel_map(), r, c);
    QVERIFY(at.x() >= 0);
    QTest::mouseMove(view.kernel_map(), at);
    QTRY_VERIFY(view.details().contains(QStringLiteral("train %1").arg(row)));
    const int step = plan->step_of_train(row, col);
    QVERIFY(step >= 0);
    const gramline::Step& st = plan->steps[static_cast<std::size_t>(step)];
    // The step the plan says measures the entry does prepare one point and analyse the other.
    QVERIFY((st.prep_point == row && st.analysis_point == col) ||
            (st.prep_point == col && st.analysis_point == row));
    const QString details = view.details();
    QVERIFY2(details.contains(QStringLiteral("train %1").arg(col)), qPrintable(details));
    QVERIFY2(details.contains(QStringLiteral("step %1, night %2").arg(step).arg(st.night)),
             qPrintable(details));
    QVERIFY2(details.contains(gramline::gui::clock_text(campaign.nights, st.start_s)),
             qPrintable(details));
    // Leaving the map brings the hint back instead of a blank line.
    QTest::mouseMove(view.kernel_map(), QPoint(1, 1));
    QEvent leave(QEvent::Leave);
    QApplication::sendEvent(view.kernel_map(), &leave);
    QVERIFY(!view.details().isEmpty());
    QVERIFY(!view.details().contains(QStringLiteral("step %1").arg(step)));
  }

  void ctrl_z_in_a_field_undoes_the_campaign_edit() {
    MainWindow w;
    make_quick(w);
    w.show();
    w.activateWindow();
    QVERIFY(QTest::qWaitForWindowActive(&w));
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    auto* epsilon = w.editor()->findChild<QDoubleSpinBox*>(QStringLiteral("precision/epsilon"));
    QVERIFY(epsilon);
    const double before = w.document()->campaign().precision.budget.epsilon;
    w.editor()->pages()->setCurrentWidget(
        w.editor()->pages()->widget(w.editor()->pages()->count() - 2));  // precision page
    epsilon->setValue(before * 2.0);  // a finished value: one campaign edit
    QCOMPARE(w.document()->campaign().precision.budget.epsilon, before * 2.0);
    epsilon->setFocus();
    QTRY_VERIFY(epsilon->hasFocus() || epsilon->isAncestorOf(QApplication::focusWidget()));
    QWidget* target = QApplication::focusWidget();
    QVERIFY(target);
    QTest::keyClick(target, Qt::Key_Z, Qt::ControlModifier);
    QCOMPARE(w.document()->campaign().precision.budget.epsilon, before);
    QCOMPARE(epsilon->value(), before);  // the field shows the undone value
    QTest::keyClick(QApplication::focusWidget(), Qt::Key_Z,
                    Qt::ControlModifier | Qt::ShiftModifier);
    QCOMPARE(w.document()->campaign().precision.budget.epsilon, before * 2.0);
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
  }

  void recovery_offers_only_the_file_being_opened() {
    const QString dir =
        QStandardPaths::writableLocation(QStandardPaths::AppDataLocation) + "/autosave";
    QVERIFY(QDir().mkpath(dir));
    const QString other = dir + "/session-3999998.json";  // a process id no session has now
    gramline::Campaign left = gramline::make_demo_campaign();
    left.name = "another file's work";
    gramline::formats::save_campaign(left, other);
    QSettings(other + ".ini", QSettings::IniFormat).setValue("original", "/tmp/other.json");

    MainWindow w;
    make_quick(w);
    bool asked = false;
    QTimer::singleShot(0, [&asked] {
      auto* box = qobject_cast<QMessageBox*>(QApplication::activeModalWidget());
      if (box) {
        asked = true;
        box->button(QMessageBox::No)->click();
      }
    });
    w.offer_recovery(QStringLiteral("/tmp/this-one.json"));
    QApplication::processEvents();
    QVERIFY(!asked);
    QVERIFY(QFile::exists(other));  // kept for a start that opens that file
    QVERIFY(QString::fromStdString(w.document()->campaign().name) != "another file's work");
    QFile::remove(other);
    QFile::remove(other + ".ini");
  }

  void compare_view_sets_the_pinned_plan_beside_the_current() {
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    gramline::gui::CompareView* compare = w.compare_view();
    const auto first = w.runner()->plan();
    const QString total_first = w.summary_view()->figure(QStringLiteral("total"));
    QVERIFY(compare->pin());
    QVERIFY(compare->pinned());
    QCOMPARE(compare->cell(QStringLiteral("move_s"), 2),
             gramline::gui::duration_text(0.0));  // the same plan on both sides

    // A looser precision: fewer pairs per entry, so less counting (the shot budget falls as
    // 1/epsilon^2, common practice for a normal interval).
    w.document()->edit(QStringLiteral("looser"),
                       [](gramline::Campaign& c) { c.precision.budget.epsilon *= 2.0; });
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && w.runner()->plan() != first, kWaitMs);
    const auto second = w.runner()->plan();
    // Both columns agree with what the Summary showed for each plan.
    QCOMPARE(compare->cell(QStringLiteral("total_s"), 0), total_first);
    QCOMPARE(compare->cell(QStringLiteral("total_s"), 1),
             w.summary_view()->figure(QStringLiteral("total")));
    QVERIFY(second->summary.integration_s < first->summary.integration_s / 2.0);
    QVERIFY2(compare->cell(QStringLiteral("integration_s"), 2).startsWith(QStringLiteral("−")),
             qPrintable(compare->cell(QStringLiteral("integration_s"), 2)));
    QCOMPARE(compare->cell(QStringLiteral("settings"), 2), QStringLiteral("0"));
    QVERIFY(!compare->cell(QStringLiteral("margin"), 0).isEmpty());
    QVERIFY(!compare->cell(QStringLiteral("margin"), 1).isEmpty());

    // The advice button: margin-aware sharing, an ordinary undoable edit.
    QVERIFY(compare->margin_aware_button()->isEnabled());
    compare->margin_aware_button()->click();
    QCOMPARE(w.document()->campaign().precision.allocation, gramline::Allocation::margin_aware);
    QTRY_VERIFY_WITH_TIMEOUT(settled(w) && w.runner()->plan() != second, kWaitMs);
    QCOMPARE(compare->cell(QStringLiteral("settings"), 0),
             compare->cell(QStringLiteral("settings"), 1));
    w.document()->undo_stack()->undo();
    QCOMPARE(w.document()->campaign().precision.allocation, gramline::Allocation::uniform);
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    compare->clear_pin();
    QVERIFY(!compare->pinned());
    QCOMPARE(compare->cell(QStringLiteral("total_s"), 0), QStringLiteral("–"));
  }
};

QTEST_MAIN(ViewsTest)
#include "test_views.moc"
