// The hand-off from the app: export the demo's bundle through the function File ▸ Export
// Bundle calls, draw counts for it from the rig model, ingest them through the Measured view's
// path (in the background) and read what the view shows; refusals of a tampered bundle and a
// bad counts file; resume from a partial night. Runs on the offscreen platform.
#include <QApplication>
#include <QDialog>
#include <QFile>
#include <QLocale>
#include <QMessageBox>
#include <QStandardPaths>
#include <QTabWidget>
#include <QTemporaryDir>
#include <QTest>
#include <QTimer>
#include <cmath>

#include "campaign_document.h"
#include "formats/bundle.h"
#include "formats/campaign_json.h"
#include "formats/counts_csv.h"
#include "hand_off.h"
#include "handoff_fixtures.h"
#include "main_window.h"
#include "margin_runner.h"
#include "measured_view.h"
#include "plan_runner.h"
#include "view_frame.h"
#include "window_helpers.h"

using gramline::gui::MainWindow;

namespace {

using gui_test::kWaitMs;
using gui_test::make_quick;
using gui_test::settled;

bool write_text(const QString& path, const std::string& text) {
  QFile f(path);
  if (!f.open(QIODevice::WriteOnly)) return false;
  return f.write(text.data(), static_cast<qint64>(text.size())) == static_cast<qint64>(text.size());
}

std::string read_text(const QString& path) {
  QFile f(path);
  if (!f.open(QIODevice::ReadOnly)) return {};
  return f.readAll().toStdString();
}

// Closes the error box the hand-off opened (it does not block) and returns its text.
QString close_error_box() {
  for (QWidget* w : QApplication::topLevelWidgets()) {
    auto* box = qobject_cast<QMessageBox*>(w);
    if (box && box->objectName() == QStringLiteral("hand_off_error") && box->isVisible()) {
      const QString text = box->text();
      box->close();
      return text;
    }
  }
  return {};
}

double figure_number(const MainWindow& w, const char* key) {
  bool ok = false;
  const double x = QLocale().toDouble(w.measured_view()->figure(QString::fromLatin1(key)), &ok);
  return ok ? x : std::nan("");
}

}  // namespace

class HandOffTest : public QObject {
  Q_OBJECT

 private slots:
  void initTestCase() {
    QStandardPaths::setTestModeEnabled(true);
    QCoreApplication::setOrganizationName(QStringLiteral("gramline-tests"));
    QCoreApplication::setApplicationName(QStringLiteral("gramline-tests"));
  }

  // File ▸ Export Bundle shows the cautions before the first export of a session; declining
  // them writes nothing.
  void export_asks_for_the_cautions_first() {
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    QString title;
    QTimer::singleShot(0, &w, [&title] {
      if (auto* dialog = qobject_cast<QDialog*>(QApplication::activeModalWidget())) {
        title = dialog->windowTitle();
        dialog->reject();
      }
    });
    w.hand_off()->export_bundle();
    QCOMPARE(title, QStringLiteral("Before the first export"));
  }

  void export_then_ingest_simulated_counts() {
    QTemporaryDir dir;
    QVERIFY(dir.isValid());
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    const std::string campaign_before =
        gramline::formats::format_campaign(w.document()->campaign());

    const QString bundle_path = dir.filePath(QStringLiteral("demo night.zip"));
    QVERIFY(w.hand_off()->export_bundle_to(bundle_path));
    // The bundle reads back with its checksums, and holds the plan the window shows.
    const gramline::formats::Bundle bundle = gramline::formats::read_bundle(bundle_path);
    QCOMPARE(bundle.steps.steps.size(), w.runner()->plan()->steps.size());

    const auto records = handoff_test::simulate_counts(bundle.campaign, bundle.steps.steps, 11);
    const QString counts_path = dir.filePath(QStringLiteral("night1.csv"));
    QVERIFY(write_text(counts_path, gramline::formats::format_counts_csv(
                                        records, bundle.steps.steps,
                                        gramline::formats::counts_layout(bundle.campaign))));

    QCOMPARE(w.views()->currentIndex(), static_cast<int>(MainWindow::kSummary));
    w.hand_off()->ingest_files(bundle_path, counts_path);
    QVERIFY(w.hand_off()->busy());  // in the background: the call returned at once
    QTRY_VERIFY_WITH_TIMEOUT(!w.hand_off()->busy(), kWaitMs);
    QVERIFY2(w.hand_off()->last_error().isEmpty(), qPrintable(w.hand_off()->last_error()));
    QCOMPARE(w.views()->currentIndex(), static_cast<int>(MainWindow::kMeasured));

    // Every planned entry was counted: all training pairs i < j and every test x training
    // entry of the demo.
    const int n = bundle.campaign.data.train_count(), m = bundle.campaign.data.test_count();
    const qlonglong expected =
        static_cast<qlonglong>(n) * (n - 1) / 2 + static_cast<qlonglong>(m) * n;
    const QString expected_text = QLocale().toString(expected);
    QCOMPARE(w.measured_view()->figure(QStringLiteral("entries")),
             QStringLiteral("%1 of %2").arg(expected_text, expected_text));
    QCOMPARE(w.measured_view()->figure(QStringLiteral("missing")), QStringLiteral("0"));
    QCOMPARE(w.measured_view()->histogram_count(), static_cast<int>(expected));
    // Unbiased estimates with the predicted variance give standard normal z-scores: with ~1900
    // of them the mean is 0 +- 0.023 and the standard deviation 1 +- 0.016 (sampling error,
    // common practice); the limits are about five of those.
    const double z_mean = figure_number(w, "z_mean"), z_sd = figure_number(w, "z_sd");
    QVERIFY2(std::abs(z_mean) < 0.1, qPrintable(QString::number(z_mean)));
    QVERIFY2(std::abs(z_sd - 1.0) < 0.08, qPrintable(QString::number(z_sd)));
    // With no drift simulated, at most a chance flag among the reference steps.
    QVERIFY(w.measured_view()->drift_count() >= 2);
    QVERIFY(w.measured_view()->figure(QStringLiteral("drifted")).startsWith(QStringLiteral("0 ")) ||
            w.measured_view()->figure(QStringLiteral("drifted")).startsWith(QStringLiteral("1 ")));
    // The classifier trained on the measured kernel was scored on the demo's test points.
    QVERIFY(w.measured_view()->figure(QStringLiteral("accuracy")).endsWith(QStringLiteral("%")));
    QVERIFY(w.measured_view()->headline().contains(expected_text));

    // The ingest changed nothing the user made, and the Measured view does not go stale when
    // the campaign is re-planned.
    QVERIFY(!w.document()->modified());
    QCOMPARE(gramline::formats::format_campaign(w.document()->campaign()), campaign_before);
    w.document()->edit(QStringLiteral("slower motor"),
                       [](gramline::Campaign& c) { c.rig.motors[0].speed_deg_per_s /= 2.0; });
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    QVERIFY(!w.frame(MainWindow::kMeasured)->stale());
    QCOMPARE(w.measured_view()->histogram_count(), static_cast<int>(expected));
  }

  // File ▸ Rehearse with a Simulated Rig: the counts file is written beside the bundle, marked
  // as simulated (docs/counts-format.md), and ingested into the Measured view, which says so.
  void rehearse_with_a_simulated_rig() {
    QTemporaryDir dir;
    QVERIFY(dir.isValid());
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    const QString bundle_path = dir.filePath(QStringLiteral("rehearsal.zip"));
    QVERIFY(w.hand_off()->export_bundle_to(bundle_path));
    const QString counts_path = dir.filePath(QStringLiteral("rehearsal-simulated.csv"));
    QVERIFY(w.hand_off()->rehearse_files(bundle_path, counts_path));
    QTRY_VERIFY_WITH_TIMEOUT(!w.hand_off()->busy(), kWaitMs);
    QVERIFY2(w.hand_off()->last_error().isEmpty(), qPrintable(w.hand_off()->last_error()));
    const std::string text = read_text(counts_path);
    QVERIFY(text.rfind("# bundle: ", 0) == 0);
    QVERIFY(text.find("\n# simulated: ") != std::string::npos);
    QCOMPARE(w.views()->currentIndex(), static_cast<int>(MainWindow::kMeasured));
    QVERIFY2(w.measured_view()->sources().contains(QStringLiteral("simulated")),
             qPrintable(w.measured_view()->sources()));
    QCOMPARE(w.measured_view()->figure(QStringLiteral("missing")), QStringLiteral("0"));
    // A bundle that cannot be read writes nothing and says which file.
    const QString nowhere = dir.filePath(QStringLiteral("none.csv"));
    QVERIFY(!w.hand_off()->rehearse_files(dir.filePath(QStringLiteral("missing.zip")), nowhere));
    QVERIFY(!QFile::exists(nowhere));
    QVERIFY(close_error_box().contains(QStringLiteral("missing.zip")));
  }

  void tampered_bundle_and_bad_counts_are_refused_naming_the_file() {
    QTemporaryDir dir;
    QVERIFY(dir.isValid());
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    const QString bundle_path = dir.filePath(QStringLiteral("night.zip"));
    QVERIFY(w.hand_off()->export_bundle_to(bundle_path));
    const gramline::formats::Bundle bundle = gramline::formats::read_bundle(bundle_path);
    const auto records = handoff_test::simulate_counts(bundle.campaign, bundle.steps.steps, 5);
    const std::string csv = gramline::formats::format_counts_csv(
        records, bundle.steps.steps, gramline::formats::counts_layout(bundle.campaign));
    const QString counts_path = dir.filePath(QStringLiteral("good.csv"));
    QVERIFY(write_text(counts_path, csv));
    w.hand_off()->ingest_files(bundle_path, counts_path);
    QTRY_VERIFY_WITH_TIMEOUT(!w.hand_off()->busy(), kWaitMs);
    const auto good_run = w.measured_view()->run();
    QVERIFY(good_run != nullptr);

    // One changed byte in steps.csv, repacked: the manifest's checksum no longer fits.
    auto entries = gramline::formats::unzip_entries(read_text(bundle_path), "night.zip");
    std::string& steps = entries["steps.csv"];
    const auto comma = steps.find(',', steps.find('\n') + 1);
    steps[comma - 1] = steps[comma - 1] == '9' ? '8' : '9';
    const QString tampered = dir.filePath(QStringLiteral("tampered.zip"));
    QVERIFY(write_text(tampered, gramline::formats::zip_entries(entries, QDateTime())));
    w.hand_off()->ingest_files(tampered, counts_path);
    QTRY_VERIFY_WITH_TIMEOUT(!w.hand_off()->busy(), kWaitMs);
    QVERIFY2(w.hand_off()->last_error().contains(QStringLiteral("tampered.zip")),
             qPrintable(w.hand_off()->last_error()));
    QVERIFY(w.hand_off()->last_error().contains(QStringLiteral("steps.csv")));
    QVERIFY(close_error_box().contains(QStringLiteral("tampered.zip")));
    QCOMPARE(w.measured_view()->run(), good_run);  // the earlier result is kept

    // A negative count on line 4 of the counts file (header on line 1), in column 5 (ch0).
    QList<QByteArray> lines = QByteArray::fromStdString(csv).split('\n');
    QVERIFY(lines.size() > 4);
    QList<QByteArray> fields = lines[3].split(',');
    QVERIFY(fields.size() > 4);
    fields[4].prepend('-');
    lines[3] = fields.join(',');
    const std::string bad = lines.join('\n').toStdString();
    const QString bad_path = dir.filePath(QStringLiteral("bad.csv"));
    QVERIFY(write_text(bad_path, bad));
    w.hand_off()->ingest_files(bundle_path, bad_path);
    QTRY_VERIFY_WITH_TIMEOUT(!w.hand_off()->busy(), kWaitMs);
    const QString error = w.hand_off()->last_error();
    QVERIFY2(error.contains(QStringLiteral("bad.csv")) && error.contains(QStringLiteral("line 4")),
             qPrintable(error));
    close_error_box();
    QCOMPARE(w.measured_view()->run(), good_run);
    QVERIFY(!w.document()->modified());
  }

  void resume_from_a_partial_night() {
    QTemporaryDir dir;
    QVERIFY(dir.isValid());
    MainWindow w;
    make_quick(w);
    w.load_demo();
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    const QString bundle_path = dir.filePath(QStringLiteral("first.zip"));
    QVERIFY(w.hand_off()->export_bundle_to(bundle_path));
    const gramline::formats::Bundle bundle = gramline::formats::read_bundle(bundle_path);
    auto records = handoff_test::simulate_counts(bundle.campaign, bundle.steps.steps, 3);
    records.resize(records.size() / 3);  // the night stopped a third of the way in
    const QString counts_path = dir.filePath(QStringLiteral("partial.csv"));
    QVERIFY(write_text(counts_path, gramline::formats::format_counts_csv(
                                        records, bundle.steps.steps,
                                        gramline::formats::counts_layout(bundle.campaign))));
    w.hand_off()->resume_files(bundle_path, counts_path);
    QTRY_VERIFY_WITH_TIMEOUT(!w.hand_off()->busy(), kWaitMs);
    QVERIFY2(w.hand_off()->last_error().isEmpty(), qPrintable(w.hand_off()->last_error()));
    const auto run = w.hand_off()->last_resume();
    QVERIFY(run != nullptr);
    const int n = bundle.campaign.data.train_count(), m = bundle.campaign.data.test_count();
    QVERIFY(run->measured_entries > 0 && run->remaining_entries > 0);
    QCOMPARE(run->measured_entries + run->remaining_entries, n * (n - 1) / 2 + m * n);
    auto* dialog = w.findChild<QDialog*>(QStringLiteral("resume_dialog"));
    QVERIFY(dialog && dialog->isVisible());

    const QString resumed = dir.filePath(QStringLiteral("first-resumed.zip"));
    QVERIFY(w.hand_off()->save_resumed_to(resumed));
    const gramline::formats::Bundle next = gramline::formats::read_bundle(resumed);
    QVERIFY(next.manifest.parent.has_value());
    QCOMPARE(QString::fromStdString(next.manifest.parent->file_name), QStringLiteral("first.zip"));
    QCOMPARE(next.manifest.parent->manifest_sha256, bundle.manifest_sha256);
    dialog->close();
  }
};

QTEST_MAIN(HandOffTest)
#include "test_hand_off.moc"
