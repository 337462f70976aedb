// gramline-cli new for one's own data: campaigns for 1 to 4 photons planned end to end, every
// kernel recomputed from the motor positions by Jones calculus in textbook form; bad CSVs
// refused as plan --data refuses them; counts of another bundle refused; a resume laid on the
// calendar from a new first night, skipping the nights to skip (docs/conventions.md,
// docs/plan-files.md, docs/counts-format.md).
#include <gtest/gtest.h>

#include <QDate>
#include <QDir>
#include <QFile>
#include <QTemporaryDir>
#include <cmath>
#include <complex>
#include <random>
#include <set>
#include <string>
#include <vector>

#include "cli_run.h"
#include "formats/bundle.h"
#include "formats/campaign_json.h"
#include "formats/counts_csv.h"
#include "formats/plan_files.h"
#include "formats/rig_json.h"
#include "handoff_fixtures.h"

namespace {

using namespace gramline;
using cli_test::run_cli;
using C = std::complex<double>;

constexpr double kPi = 3.14159265358979323846;

struct Mat2 {
  C a, b, c, d;  // [[a, b], [c, d]]
};
Mat2 mul(const Mat2& x, const Mat2& y) {
  return {x.a * y.a + x.b * y.c, x.a * y.b + x.b * y.d, x.c * y.a + x.d * y.c,
          x.c * y.b + x.d * y.d};
}
// Textbook retarder (Hecht, Optics, ch. 8; common practice): J(t, G) = R(-t) diag(1, e^{iG})
// R(t) with R(t) = [[cos t, sin t], [-sin t, cos t]], t the fast axis from horizontal.
Mat2 retarder(double t_deg, double retardance) {
  const double t = t_deg * kPi / 180.0;
  const Mat2 r{std::cos(t), std::sin(t), -std::sin(t), std::cos(t)};
  const Mat2 r_back{std::cos(t), -std::sin(t), std::sin(t), std::cos(t)};
  const Mat2 plate{1.0, 0.0, 0.0, std::polar(1.0, retardance)};
  return mul(r_back, mul(plate, r));
}
// |<H| HWP(ha) QWP(qa) QWP(qp) HWP(hp) |H>|^2: prepare H with HWP then QWP, analyse with QWP
// then HWP and a PBS passing H (docs/conventions.md).
double pass_probability(double hp, double qp, double qa, double ha) {
  const Mat2 m = mul(retarder(ha, kPi),
                     mul(retarder(qa, kPi / 2), mul(retarder(qp, kPi / 2), retarder(hp, kPi))));
  return std::norm(m.a);  // <H| M |H> is the top-left element
}
// |<psi_b|psi_a>|^2 = (1 + S_a . S_b) / 2 with S = (cos th, sin th cos ph, sin th sin ph)
// (common practice, Bloch vectors).
double overlap_deg(double th_a, double ph_a, double th_b, double ph_b) {
  const double d = kPi / 180.0;
  const double dot = std::cos(th_a * d) * std::cos(th_b * d) +
                     std::sin(th_a * d) * std::sin(th_b * d) * std::cos((ph_a - ph_b) * d);
  return 0.5 * (1.0 + dot);
}

using cli_test::read_text;
void write_text(const QString& path, const std::string& text) {
  ASSERT_TRUE(cli_test::write_text(path, text)) << path.toStdString();
}

// A data CSV of our own: `features` columns, classes "good" / "bad" by the sign of a seeded
// random direction, `train` training and `test` test points.
std::string data_csv(int features, int train, int test, unsigned seed) {
  std::mt19937 rng(seed);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  std::vector<double> w(static_cast<size_t>(features));
  for (double& x : w) x = u(rng);
  std::string out;
  for (int f = 0; f < features; ++f) out += "f" + std::to_string(f) + ",";
  out += "label,set\n";
  for (int i = 0; i < train + test; ++i) {
    double s = 0.0;
    std::string row;
    for (int f = 0; f < features; ++f) {
      const double x = std::round(u(rng) * 1000.0) / 1000.0;
      s += w[static_cast<size_t>(f)] * x;
      row += std::to_string(x) + ",";
    }
    // Alternate classes so both are present whatever the direction.
    const bool good = i % 2 == 0;
    (void)s;
    out += row + (good ? "good" : "bad") + "," + (i < train ? "train" : "test") + "\n";
  }
  return out;
}

class NewCampaign : public ::testing::Test {
 protected:
  void SetUp() override { ASSERT_TRUE(dir_.isValid()); }
  QString path(const char* name) const { return dir_.filePath(name); }
  QString csv(int features, int train, int test, unsigned seed) {
    const QString p = dir_.filePath(QString("d%1_%2.csv").arg(features).arg(seed));
    write_text(p, data_csv(features, train, test, seed));
    return p;
  }

  /// new, then plan --out; checks every kernel of the steps by Jones calculus.
  void plan_and_check(int features, int photons, const char* preset, EncodingPreset expected) {
    SCOPED_TRACE("D=" + std::to_string(features) + " P=" + std::to_string(photons));
    const QString data = csv(features, 7, 2, static_cast<unsigned>(10 * features + photons));
    const QString campaign_path = dir_.filePath(QString("c%1_%2.json").arg(features).arg(photons));
    QStringList args{
        "new", "--data", data, "--out", campaign_path, "--photons", QString::number(photons)};
    if (preset) args << "--encoding" << preset;
    const cli_test::CliRun made = run_cli(args);
    ASSERT_EQ(made.status, 0) << made.err;
    const Campaign c = formats::load_campaign(campaign_path);
    ASSERT_EQ(c.encoding.photon_count(), photons);
    EXPECT_EQ(c.encoding.feature_count(), features);
    EXPECT_EQ(c.encoding.preset, expected);
    ASSERT_EQ(c.rig.motors.size(), static_cast<size_t>(4 * photons));
    ASSERT_EQ(c.rig.detectors.size(), static_cast<size_t>(photons));
    EXPECT_EQ(c.rig.check(photons), "");

    const QString out = dir_.filePath(QString("plan%1_%2").arg(features).arg(photons));
    const cli_test::CliRun planned = run_cli({"plan", campaign_path, "--out", out});
    ASSERT_EQ(planned.status, 0) << planned.err;
    const formats::StepsFile steps = formats::read_steps_json(QDir(out).filePath("steps.json"));
    int checked = 0;
    for (const Step& s : steps.steps) {
      if (s.kind != StepKind::measure && s.kind != StepKind::reference) continue;
      double from_plates = 1.0, from_states = 1.0;
      for (int p = 0; p < photons; ++p) {
        const int hp = steps.rig.motor_index(p, Stage::prep, Plate::HWP);
        const int qp = steps.rig.motor_index(p, Stage::prep, Plate::QWP);
        const int qa = steps.rig.motor_index(p, Stage::analysis, Plate::QWP);
        const int ha = steps.rig.motor_index(p, Stage::analysis, Plate::HWP);
        ASSERT_TRUE(hp >= 0 && qp >= 0 && qa >= 0 && ha >= 0);
        from_plates *= pass_probability(s.position_deg[hp], s.position_deg[qp], s.position_deg[qa],
                                        s.position_deg[ha]);
        const BlochAngles a = c.encoding.angles(p, c.data.point(s.prep_point));
        const BlochAngles b = c.encoding.angles(p, c.data.point(s.analysis_point));
        from_states *= overlap_deg(a.theta_deg, a.phi_deg, b.theta_deg, b.phi_deg);
      }
      ASSERT_NEAR(from_plates, s.kernel_ideal, 1e-9) << "step at " << s.start_s;
      ASSERT_NEAR(from_states, s.kernel_ideal, 1e-9) << "step at " << s.start_s;
      ++checked;
    }
    // 7 training and 2 test points: 21 + 14 measure steps, and references.
    EXPECT_GE(checked, 35);
  }

  QTemporaryDir dir_;
};

TEST_F(NewCampaign, OnePhotonOneFeatureLinear) {
  plan_and_check(1, 1, nullptr, EncodingPreset::one_feature_per_photon_linear);
}
TEST_F(NewCampaign, OnePhotonTwoFeaturesPolarAzimuth) {
  plan_and_check(2, 1, nullptr, EncodingPreset::two_features_polar_azimuth);
}
TEST_F(NewCampaign, TwoPhotonsThreeFeaturesSpread) {
  plan_and_check(3, 2, nullptr, EncodingPreset::spread);
}
TEST_F(NewCampaign, ThreePhotonsEveryPreset) {
  plan_and_check(3, 3, nullptr, EncodingPreset::one_feature_per_photon_linear);
  plan_and_check(5, 3, nullptr, EncodingPreset::spread);
  plan_and_check(6, 3, "polar-azimuth", EncodingPreset::two_features_polar_azimuth);
  plan_and_check(2, 3, "spread", EncodingPreset::spread);  // fewer features than photons
}
TEST_F(NewCampaign, FourPhotonsEveryPreset) {
  plan_and_check(4, 4, "linear", EncodingPreset::one_feature_per_photon_linear);
  plan_and_check(7, 4, nullptr, EncodingPreset::spread);
  plan_and_check(8, 4, nullptr, EncodingPreset::two_features_polar_azimuth);
}

TEST_F(NewCampaign, SpreadKeepsEveryAngleInsideItsSpan) {
  // The spread preset shares a span among the features on one angle, so over the training
  // box every theta stays in [10, 170] deg and every phi in [0, 270] deg (the new campaign's
  // spans, docs/conventions.md).
  const QString data = csv(5, 12, 0, 3);
  const cli_test::CliRun made =
      run_cli({"new", "--data", data, "--out", path("spread.json"), "--photons", "2"});
  ASSERT_EQ(made.status, 0) << made.err;
  const Campaign c = formats::load_campaign(path("spread.json"));
  for (int i = 0; i < c.data.train_count(); ++i) {
    for (int p = 0; p < 2; ++p) {
      const BlochAngles a = c.encoding.angles(p, c.data.point(i));
      EXPECT_GE(a.theta_deg, 10.0 - 1e-9);
      EXPECT_LE(a.theta_deg, 170.0 + 1e-9);
      EXPECT_GE(a.phi_deg, -1e-9);
      EXPECT_LE(a.phi_deg, 270.0 + 1e-9);
    }
  }
  // Every feature is read by some photon.
  for (int f = 0; f < 5; ++f) {
    double weight = 0.0;
    for (const PhotonEncoding& e : c.encoding.photons)
      weight += std::abs(e.theta_weights_deg(f)) + std::abs(e.phi_weights_deg(f));
    EXPECT_GT(weight, 0.0) << "feature " << f;
  }
}

TEST_F(NewCampaign, RigFileGivesMotorsAndPhotons) {
  // A rig of our own, saved alone: pass-only, slow ranged mounts approached from below, a
  // sequential controller; three photons.
  const QString data = csv(3, 6, 0, 4);
  ASSERT_EQ(run_cli({"new", "--data", data, "--out", path("base.json"), "--photons", "3"}).status,
            0);
  Rig rig = formats::load_campaign(path("base.json")).rig;
  rig.scheme = DetectionScheme::pass_only;
  rig.controller.moves = MoveMode::sequential;
  for (Motor& m : rig.motors) {
    m.speed_deg_per_s = 5.0;
    m.range = TravelRange{-10.0, 350.0};
    m.backlash = Backlash::from_below;
    m.overshoot_deg = 2.0;
  }
  formats::save_rig(rig, path("lab.rig"));
  const cli_test::CliRun made =
      run_cli({"new", "--data", data, "--out", path("lab.json"), "--rig", path("lab.rig")});
  ASSERT_EQ(made.status, 0) << made.err;
  const Campaign c = formats::load_campaign(path("lab.json"));
  EXPECT_EQ(c.encoding.photon_count(), 3);  // the rig file's photons
  EXPECT_EQ(c.rig.scheme, DetectionScheme::pass_only);
  EXPECT_EQ(c.rig.controller.moves, MoveMode::sequential);
  ASSERT_EQ(c.rig.motors.size(), 12u);
  EXPECT_EQ(c.rig.motors[5].backlash, Backlash::from_below);
  EXPECT_EQ(c.rig.motors[5].speed_deg_per_s, 5.0);
  const cli_test::CliRun planned = run_cli({"plan", path("lab.json")});
  EXPECT_EQ(planned.status, 0) << planned.err;
}

TEST_F(NewCampaign, BadChoicesAreRefusedWithStatusTwo) {
  const QString data = csv(3, 6, 0, 5);
  // linear puts three features on three photons, not two.
  cli_test::CliRun r = run_cli(
      {"new", "--data", data, "--out", path("x.json"), "--photons", "2", "--encoding", "linear"});
  EXPECT_EQ(r.status, 2);
  EXPECT_NE(r.err.find("encoding.preset"), std::string::npos) << r.err;
  r = run_cli({"new", "--data", data, "--out", path("x.json"), "--photons", "5"});
  EXPECT_EQ(r.status, 2);
  EXPECT_NE(r.err.find("--photons"), std::string::npos) << r.err;
  r = run_cli({"new", "--data", data, "--out", path("x.json"), "--encoding", "diagonal"});
  EXPECT_EQ(r.status, 2);
  EXPECT_NE(r.err.find("--encoding"), std::string::npos) << r.err;
  r = run_cli({"new", "--data", data, "--out", path("x.json"), "--rig", path("missing.rig")});
  EXPECT_EQ(r.status, 2);
  EXPECT_FALSE(QFile::exists(path("x.json")));
  // An existing campaign stays unless --force.
  ASSERT_EQ(run_cli({"new", "--data", data, "--out", path("y.json")}).status, 0);
  const std::string before = read_text(path("y.json"));
  r = run_cli({"new", "--data", data, "--out", path("y.json"), "--photons", "3"});
  EXPECT_EQ(r.status, 2);
  EXPECT_EQ(read_text(path("y.json")), before);
  EXPECT_EQ(
      run_cli({"new", "--data", data, "--out", path("y.json"), "--photons", "3", "--force"}).status,
      0);
}

TEST_F(NewCampaign, RefusesBadCsvsAsPlanDataDoes) {
  ASSERT_EQ(run_cli({"demo", "--out", path("demo.json")}).status, 0);
  const QDir data_dir(QString(GRAMLINE_TEST_DATA));
  int tried = 0;
  for (const QString& name : data_dir.entryList({"bad_*.csv", "empty.csv"})) {
    SCOPED_TRACE(name.toStdString());
    const QString csv_path = data_dir.filePath(name);
    const cli_test::CliRun planned = run_cli({"plan", path("demo.json"), "--data", csv_path});
    const cli_test::CliRun made = run_cli({"new", "--data", csv_path, "--out", path("bad.json")});
    EXPECT_EQ(planned.status, 2) << planned.err;
    EXPECT_EQ(made.status, 2) << made.err;
    // Both name the file.
    EXPECT_NE(made.err.find(name.toStdString()), std::string::npos) << made.err;
    EXPECT_NE(planned.err.find(name.toStdString()), std::string::npos) << planned.err;
    EXPECT_FALSE(QFile::exists(path("bad.json")));
    ++tried;
  }
  EXPECT_GE(tried, 10);
}

TEST_F(NewCampaign, PlanWithAnotherFeatureCountKeepsRigAndSpreads) {
  ASSERT_EQ(run_cli({"demo", "--out", path("demo.json")}).status, 0);
  const QString data = csv(3, 6, 2, 6);
  const cli_test::CliRun planned =
      run_cli({"plan", path("demo.json"), "--data", data, "--out", path("spread_plan")});
  ASSERT_EQ(planned.status, 0) << planned.err;
  EXPECT_NE(planned.err.find("spread"), std::string::npos) << planned.err;
  const formats::StepsFile steps =
      formats::read_steps_json(QDir(path("spread_plan")).filePath("steps.json"));
  EXPECT_EQ(steps.rig.motors.size(), 8u);  // the demo's two-photon rig stays
  const cli_test::CliRun checked = run_cli(
      {"check", path("demo.json"), "--data", data, "--trials", "20", "--out", path("c.json")});
  EXPECT_EQ(checked.status, 0) << checked.err;
  EXPECT_NE(checked.err.find("spread"), std::string::npos);
}

// ---------------------------------------------------------------------------------------------
// Bundle identity and the calendar of a resume.

class BundleCalendar : public NewCampaign {
 protected:
  static constexpr int kWindowMin = 12;
  void export_short_nights() {
    const QString data = csv(2, 10, 0, 8);
    ASSERT_EQ(run_cli({"new", "--data", data, "--out", path("cal.json")}).status, 0);
    Campaign c = formats::load_campaign(path("cal.json"));
    // Five-minute windows so the plan needs several nights; weekends and one booked date off.
    c.nights.first_date = "2026-12-04";  // a Friday
    c.nights.start_min = 21 * 60;
    c.nights.end_min = 21 * 60 + kWindowMin;
    c.nights.max_nights = 40;
    c.nights.skip_weekdays = {6, 7};
    c.nights.skip_dates = {"2026-12-15"};
    c.precision.budget.epsilon = 0.004;
    formats::save_campaign(c, path("cal.json"));
    const cli_test::CliRun exported = run_cli({"export", path("cal.json"), "--out", path("b.zip")});
    ASSERT_EQ(exported.status, 0) << exported.err;
    EXPECT_NE(exported.out.find("CAUTIONS"), std::string::npos);
    EXPECT_NE(exported.out.find("laser safety officer"), std::string::npos);
    bundle_ = formats::read_bundle(path("b.zip"));
  }
  QString counts(const char* name, const std::vector<StepRecord>& records,
                 const std::string& bundle_id) {
    const QString p = path(name);
    write_text(p, formats::format_counts_csv(records, bundle_.steps.steps,
                                             formats::counts_layout(bundle_.campaign), bundle_id));
    return p;
  }
  formats::Bundle bundle_;
};

TEST_F(BundleCalendar, ManifestCarriesAnIdAndCautions) {
  export_short_nights();
  const std::string& id = bundle_.manifest.bundle_id;
  ASSERT_EQ(id.size(), 32u);
  EXPECT_EQ(id.find_first_not_of("0123456789abcdef"), std::string::npos);
  ASSERT_TRUE(bundle_.entries.count("CAUTIONS.txt"));
  const std::string& cautions = bundle_.entries.at("CAUTIONS.txt");
  for (const char* word : {"laser", "interlock", "overnight", "laser safety officer"})
    EXPECT_NE(cautions.find(word), std::string::npos) << word;
  // Two exports of one campaign are two bundles.
  ASSERT_EQ(run_cli({"export", path("cal.json"), "--out", path("b2.zip")}).status, 0);
  EXPECT_NE(formats::read_bundle(path("b2.zip")).manifest.bundle_id, id);
}

TEST_F(BundleCalendar, NightsSkipWeekendsAndBookedDates) {
  export_short_nights();
  ASSERT_GT(bundle_.steps.steps.back().night, 4);
  // Nights by QDate (Qt's calendar, outside the engine): from Friday 2026-12-04 the nights
  // fall on weekdays only, and not on 2026-12-15.
  const QDate first(2026, 12, 4);
  std::vector<QDate> dates;
  for (QDate d = first; dates.size() < 40; d = d.addDays(1))
    if (d.dayOfWeek() <= 5 && d != QDate(2026, 12, 15)) dates.push_back(d);
  for (const Step& s : bundle_.steps.steps) {
    const QDate night = dates[static_cast<size_t>(s.night - 1)];
    const double night_start_s = first.daysTo(night) * 86400.0;
    ASSERT_GE(s.start_s, night_start_s - 1e-6) << "step at " << s.start_s;
    ASSERT_LE(s.start_s + s.move_s + s.dwell_s, night_start_s + kWindowMin * 60 + 1e-6)
        << "step at " << s.start_s;
  }
}

TEST_F(BundleCalendar, IngestRefusesCountsOfAnotherBundle) {
  export_short_nights();
  const std::vector<StepRecord> records =
      handoff_test::simulate_counts(bundle_.campaign, bundle_.steps.steps, 3);
  const std::string other = "0123456789abcdef0123456789abcdef";
  const QString wrong = counts("wrong.csv", records, other);
  cli_test::CliRun r = run_cli({"ingest", path("b.zip"), wrong, "--out", path("in1")});
  EXPECT_EQ(r.status, 2);
  EXPECT_NE(r.err.find(other), std::string::npos) << r.err;
  EXPECT_NE(r.err.find(bundle_.manifest.bundle_id), std::string::npos) << r.err;
  EXPECT_FALSE(QFile::exists(QDir(path("in1")).filePath("ingest.json")));
  r = run_cli({"resume", path("b.zip"), wrong, "--out", path("r1.zip")});
  EXPECT_EQ(r.status, 2);
  EXPECT_NE(r.err.find(other), std::string::npos) << r.err;
  EXPECT_FALSE(QFile::exists(path("r1.zip")));

  const QString right = counts("right.csv", records, bundle_.manifest.bundle_id);
  r = run_cli({"ingest", path("b.zip"), right, "--out", path("in2")});
  EXPECT_EQ(r.status, 0) << r.err;
  EXPECT_EQ(r.err.find("warning"), std::string::npos) << r.err;
  // An older counts file without the line is read, with a warning.
  const QString old = counts("old.csv", records, "");
  r = run_cli({"ingest", path("b.zip"), old, "--out", path("in3")});
  EXPECT_EQ(r.status, 0) << r.err;
  EXPECT_NE(r.err.find("names no bundle"), std::string::npos) << r.err;
}

TEST_F(BundleCalendar, ResumeLaysTheRestFromTheNewFirstNight) {
  export_short_nights();
  // The rig counted the first two nights only.
  std::vector<StepRecord> records =
      handoff_test::simulate_counts(bundle_.campaign, bundle_.steps.steps, 4);
  std::vector<StepRecord> kept;
  for (const StepRecord& r : records)
    if (bundle_.steps.steps[static_cast<size_t>(r.step)].night <= 2) kept.push_back(r);
  const QString partial = counts("partial.csv", kept, bundle_.manifest.bundle_id);
  const cli_test::CliRun r = run_cli(
      {"resume", path("b.zip"), partial, "--out", path("next.zip"), "--first-night", "2026-12-12"});
  ASSERT_EQ(r.status, 0) << r.err;
  const formats::Bundle next = formats::read_bundle(path("next.zip"));
  EXPECT_EQ(next.campaign.nights.first_date, "2026-12-12");
  EXPECT_EQ(next.campaign.nights.max_nights, 40 - 2);  // the allowance less the nights used
  // 2026-12-12 is a Saturday: the first night of the rest is Monday 2026-12-14, then the 16th
  // (the 15th is booked), 17th, 18th, then Monday 21st ... (QDate, weekends and 15th left out).
  const QDate first(2026, 12, 14);
  std::vector<QDate> dates;
  for (QDate d = first; dates.size() < 40; d = d.addDays(1))
    if (d.dayOfWeek() <= 5 && d != QDate(2026, 12, 15)) dates.push_back(d);
  ASSERT_EQ(dates[1], QDate(2026, 12, 16));
  for (const Step& s : next.steps.steps) {
    const double night_start_s = first.daysTo(dates[static_cast<size_t>(s.night - 1)]) * 86400.0;
    ASSERT_GE(s.start_s, night_start_s - 1e-6) << "step at " << s.start_s;
    ASSERT_LE(s.start_s + s.move_s + s.dwell_s, night_start_s + kWindowMin * 60 + 1e-6);
  }
  const std::string& html = next.entries.at("summary.html");
  EXPECT_NE(html.find("resumes b.zip"), std::string::npos);
  EXPECT_NE(html.find("Gram error of the whole training matrix"), std::string::npos);

  // Without --first-night: the day after the last night counted (night 2 = Monday 2026-12-07,
  // so Tuesday 2026-12-08).
  const cli_test::CliRun d =
      run_cli({"resume", path("b.zip"), partial, "--out", path("next2.zip")});
  ASSERT_EQ(d.status, 0) << d.err;
  EXPECT_EQ(formats::read_bundle(path("next2.zip")).campaign.nights.first_date, "2026-12-08");
  const cli_test::CliRun bad = run_cli(
      {"resume", path("b.zip"), partial, "--out", path("next3.zip"), "--first-night", "12/12"});
  EXPECT_EQ(bad.status, 2);
  EXPECT_NE(bad.err.find("--first-night"), std::string::npos);
}

}  // namespace
