// One's own experiment in the app (offscreen): a campaign made from a data CSV in the New
// Campaign dialog, edited on the encoding and rig pages, planned and exported. Three cases: one
// photon and one feature; three photons and five features; a pass-only rig of ranged mounts
// approached from below on a sequential controller, loaded from a rig file.
#include <QApplication>
#include <QFile>
#include <QLabel>
#include <QSpinBox>
#include <QStandardPaths>
#include <QTemporaryDir>
#include <QTest>
#include <random>

#include "campaign_document.h"
#include "editor_pages.h"
#include "editor_panel.h"
#include "formats/bundle.h"
#include "formats/rig_json.h"
#include "gramline/new_campaign.h"
#include "hand_off.h"
#include "main_window.h"
#include "margin_runner.h"
#include "new_campaign_dialog.h"
#include "plan_runner.h"

using gramline::gui::MainWindow;

namespace {

constexpr int kWaitMs = 180000;

void make_quick(MainWindow& w) {
  auto& o = w.margin_runner()->options();
  o.trials = 20;
  o.minimum_budget = false;
  o.compare_allocations = false;
  o.scan_scale = false;
}

bool settled(const MainWindow& w) {
  return !w.runner()->busy() && !w.margin_runner()->busy() && w.runner()->plan() != nullptr;
}

// An invented data set: `features` columns, classes "good" and "bad" alternating.
QString write_csv(const QTemporaryDir& dir, int features, int train, int test) {
  std::mt19937 rng(static_cast<unsigned>(features * 31 + train));
  std::uniform_real_distribution<double> u(0.0, 10.0);
  QString text;
  for (int f = 0; f < features; ++f) text += QStringLiteral("m%1,").arg(f);
  text += QStringLiteral("label,set\n");
  for (int i = 0; i < train + test; ++i) {
    for (int f = 0; f < features; ++f) text += QString::number(u(rng), 'f', 3) + ',';
    text += (i % 2 == 0 ? QStringLiteral("good,") : QStringLiteral("bad,")) +
            (i < train ? QStringLiteral("train\n") : QStringLiteral("test\n"));
  }
  const QString path = dir.filePath(QStringLiteral("own_%1.csv").arg(features));
  QFile file(path);
  if (file.open(QIODevice::WriteOnly)) file.write(text.toUtf8());
  return path;
}

}  // namespace

class OwnCampaignTest : public QObject {
  Q_OBJECT

 private:
  // Plans the window's campaign and exports it; checks the bundle holds `photons` photons with
  // four motors and one detector each, an id and the cautions.
  void plan_and_export(MainWindow& w, const QTemporaryDir& dir, int photons) {
    QTRY_VERIFY_WITH_TIMEOUT(settled(w), kWaitMs);
    const auto plan = w.runner()->plan();
    QVERIFY(!plan->steps.empty());
    const QString bundle_path = dir.filePath(QStringLiteral("own.zip"));
    QVERIFY(w.hand_off()->export_bundle_to(bundle_path));
    const gramline::formats::Bundle b = gramline::formats::read_bundle(bundle_path);
    QCOMPARE(b.campaign.encoding.photon_count(), photons);
    QCOMPARE(static_cast<int>(b.steps.rig.motors.size()), 4 * photons);
    QCOMPARE(static_cast<int>(b.campaign.rig.detectors.size()), photons);
    QCOMPARE(static_cast<int>(b.manifest.bundle_id.size()), 32);
    QVERIFY(b.entries.count("CAUTIONS.txt") == 1);
  }

 private slots:
  void initTestCase() {
    QStandardPaths::setTestModeEnabled(true);
    QCoreApplication::setOrganizationName(QStringLiteral("gramline-tests"));
    QCoreApplication::setApplicationName(QStringLiteral("gramline-tests"));
  }

  void one_photon_one_feature() {
    QTemporaryDir dir;
    MainWindow w;
    make_quick(w);
    gramline::gui::NewCampaignDialog dialog(&w);
    dialog.set_data_path(write_csv(dir, 1, 8, 3));
    dialog.set_photons(1);
    const auto c = dialog.build();
    QVERIFY2(c.has_value(), qPrintable(dialog.message()));
    QCOMPARE(c->encoding.photon_count(), 1);
    QCOMPARE(c->encoding.preset, gramline::EncodingPreset::one_feature_per_photon_linear);
    w.document()->replace(*c, QString(), true);

    // Edit the map on the encoding page: theta offset of photon 0, then a bad weight list.
    auto* encoding = w.editor()->encoding_page();
    QVERIFY(encoding->edit_weight(0, 2, QStringLiteral("12")));
    QCOMPARE(w.document()->campaign().encoding.photons[0].theta_offset_deg, 12.0);
    QCOMPARE(w.document()->campaign().encoding.preset, gramline::EncodingPreset::custom);
    QVERIFY(!encoding->edit_weight(0, 1, QStringLiteral("3; 4")));  // one feature, two weights
    auto* error = encoding->findChild<QLabel*>(QStringLiteral("encoding/weights_error"));
    QVERIFY(error && error->text().contains(
                         QStringLiteral("encoding.photons[0].theta_weights_deg_per_unit")));
    QVERIFY(!encoding->edit_weight(0, 4, QStringLiteral("x")));
    QVERIFY(error->text().contains(QStringLiteral("encoding.photons[0].phi_offset_deg")));
    plan_and_export(w, dir, 1);
  }

  void three_photons_five_features() {
    QTemporaryDir dir;
    MainWindow w;
    make_quick(w);
    gramline::gui::NewCampaignDialog dialog(&w);
    dialog.set_data_path(write_csv(dir, 5, 7, 2));
    dialog.set_photons(3);
    const auto c = dialog.build();
    QVERIFY2(c.has_value(), qPrintable(dialog.message()));
    QCOMPARE(c->encoding.photon_count(), 3);
    QCOMPARE(c->encoding.preset, gramline::EncodingPreset::spread);
    QCOMPARE(static_cast<int>(c->rig.motors.size()), 12);
    w.document()->replace(*c, QString(), true);

    // The rig page adds a fourth photon (its four motors and detector), then removes it again.
    auto* photons = w.editor()->rig_page()->findChild<QSpinBox*>(QStringLiteral("rig/photons"));
    QVERIFY(photons);
    QCOMPARE(photons->value(), 3);
    photons->setValue(4);
    QCOMPARE(w.document()->campaign().encoding.photon_count(), 4);
    QCOMPARE(static_cast<int>(w.document()->campaign().rig.motors.size()), 16);
    QCOMPARE(static_cast<int>(w.document()->campaign().rig.detectors.size()), 4);
    QCOMPARE(w.document()->campaign().rig.motors[12].name, std::string("D-prep-HWP"));
    QCOMPARE(w.document()->campaign().check_consistency(), std::string());
    photons->setValue(3);
    QCOMPARE(static_cast<int>(w.document()->campaign().rig.motors.size()), 12);
    // An edit of the map on photon 2 (0-based, as the files and messages count).
    QVERIFY(w.editor()->encoding_page()->edit_weight(2, 3, QStringLiteral("0; 0; 9; 0; 0")));
    QCOMPARE(w.document()->campaign().encoding.photons[2].phi_weights_deg(2), 9.0);
    plan_and_export(w, dir, 3);
  }

  void pass_only_ranged_from_below_sequential() {
    QTemporaryDir dir;
    gramline::Rig rig = gramline::default_rig(3);
    rig.scheme = gramline::DetectionScheme::pass_only;
    rig.controller.moves = gramline::MoveMode::sequential;
    for (gramline::Motor& m : rig.motors) {
      m.speed_deg_per_s = 5.0;
      m.range = gramline::TravelRange{-5.0, 355.0};
      m.backlash = gramline::Backlash::from_below;
      m.overshoot_deg = 3.0;
    }
    const QString rig_path = dir.filePath(QStringLiteral("lab.rig.json"));
    gramline::formats::save_rig(rig, rig_path);

    MainWindow w;
    make_quick(w);
    gramline::gui::NewCampaignDialog dialog(&w);
    dialog.set_data_path(write_csv(dir, 3, 8, 3));
    dialog.set_rig_path(rig_path);
    const auto c = dialog.build();
    QVERIFY2(c.has_value(), qPrintable(dialog.message()));
    QCOMPARE(c->encoding.photon_count(), 3);  // the rig file's photons
    QCOMPARE(c->rig.scheme, gramline::DetectionScheme::pass_only);
    w.document()->replace(*c, QString(), true);
    // Loading the rig file again on the rig page is one undoable edit that keeps the rig.
    QVERIFY(w.editor()->rig_page()->load_rig_file(rig_path));
    QCOMPARE(w.document()->campaign().rig.controller.moves, gramline::MoveMode::sequential);
    QCOMPARE(w.document()->campaign().rig.motors[4].backlash, gramline::Backlash::from_below);
    plan_and_export(w, dir, 3);
    const gramline::formats::Bundle b =
        gramline::formats::read_bundle(dir.filePath(QStringLiteral("own.zip")));
    QCOMPARE(b.steps.rig.controller.moves, gramline::MoveMode::sequential);
    for (const gramline::Step& s : b.steps.steps)
      for (double p : s.position_deg) QVERIFY(p >= -5.0 - 1e-9 && p <= 355.0 + 1e-9);
  }

  void bad_csv_is_refused_with_its_name() {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("broken.csv"));
    QFile file(path);
    QVERIFY(file.open(QIODevice::WriteOnly));
    file.write("a,b,label\n1,2,x\n3,oops,y\n");
    file.close();
    gramline::gui::NewCampaignDialog dialog;
    dialog.set_data_path(path);
    QVERIFY(!dialog.build().has_value());
    QVERIFY(dialog.message().contains(QStringLiteral("broken.csv")));
  }
};

QTEST_MAIN(OwnCampaignTest)
#include "test_own_campaign.moc"
