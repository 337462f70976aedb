// Campaigns for one's own data: the encoding presets for any D and P, the default rig and its
// resizing, and the nights on the calendar (docs/conventions.md, docs/plan-files.md).
#include <gtest/gtest.h>

#include <stdexcept>

#include "gramline/campaign.h"
#include "gramline/kernel.h"
#include "gramline/new_campaign.h"

namespace gramline {
namespace {

DataSet box_data(int features, int points) {
  DataSet d;
  d.train.resize(points, features);
  d.train_labels.resize(points);
  for (int i = 0; i < points; ++i) {
    for (int f = 0; f < features; ++f) d.train(i, f) = (i * (f + 3)) % 7 + 0.5 * f;
    d.train_labels(i) = i % 2 ? 1 : -1;
  }
  for (int f = 0; f < features; ++f) d.feature_names.push_back("f" + std::to_string(f));
  d.test.resize(0, features);
  d.test_labels.resize(0);
  return d;
}

TEST(Presets, DefaultByFeaturesAndPhotons) {
  EXPECT_EQ(default_preset(3, 3), EncodingPreset::one_feature_per_photon_linear);
  EXPECT_EQ(default_preset(6, 3), EncodingPreset::two_features_polar_azimuth);
  EXPECT_EQ(default_preset(5, 3), EncodingPreset::spread);
  EXPECT_EQ(default_preset(1, 2), EncodingPreset::spread);
}

TEST(Presets, SpreadMapsTheTrainingBoxOntoTheSpans) {
  // D = 5 on P = 2: photon 0 reads features 0, 2, 4 (theta, phi, theta), photon 1 features 1, 3
  // (theta, phi). At the low corner every angle is at its span's low end, at the high corner at
  // its high end; in between the shares add up (docs/conventions.md).
  Eigen::VectorXd lo(5), hi(5);
  lo << 0, -1, 2, 10, -5;
  hi << 1, 1, 4, 20, 5;
  const EncodingMap m = make_encoding(EncodingPreset::spread, 2, lo, hi, {10, 170}, {0, 270});
  ASSERT_EQ(m.photon_count(), 2);
  EXPECT_EQ(m.check(5), "");
  for (int p = 0; p < 2; ++p) {
    EXPECT_NEAR(m.angles(p, lo).theta_deg, 10.0, 1e-12);
    EXPECT_NEAR(m.angles(p, hi).theta_deg, 170.0, 1e-12);
    EXPECT_NEAR(m.angles(p, lo).phi_deg, 0.0, 1e-12);
    EXPECT_NEAR(m.angles(p, hi).phi_deg, 270.0, 1e-12);
  }
  // Feature 0 alone at its top moves photon 0's theta by half the span (two features share it).
  Eigen::VectorXd x = lo;
  x(0) = hi(0);
  EXPECT_NEAR(m.angles(0, x).theta_deg, 10.0 + 80.0, 1e-12);
  EXPECT_NEAR(m.angles(1, x).theta_deg, 10.0, 1e-12);
  // Feature 3 is photon 1's only phi feature: the whole span.
  x = lo;
  x(3) = hi(3);
  EXPECT_NEAR(m.angles(1, x).phi_deg, 270.0, 1e-12);
}

TEST(Presets, PhotonCountsThatDoNotFitAreRefusedNamingTheField) {
  Eigen::VectorXd lo = Eigen::VectorXd::Zero(3), hi = Eigen::VectorXd::Ones(3);
  try {
    make_encoding(EncodingPreset::one_feature_per_photon_linear, 2, lo, hi);
    FAIL() << "linear with D = 3 on 2 photons";
  } catch (const std::invalid_argument& e) {
    EXPECT_NE(std::string(e.what()).find("encoding.preset"), std::string::npos);
  }
  EXPECT_THROW(make_encoding(EncodingPreset::spread, 5, lo, hi), std::invalid_argument);
  EXPECT_EQ(make_encoding(EncodingPreset::two_features_polar_azimuth, 2, lo, hi).photon_count(), 2);
}

TEST(NewCampaigns, RigHasFourMotorsAndOneDetectorPerPhoton) {
  for (int p = 1; p <= 4; ++p) {
    const Rig r = default_rig(p);
    EXPECT_EQ(r.check(p), "") << p;
    EXPECT_EQ(r.motors.size(), static_cast<size_t>(4 * p));
    EXPECT_EQ(r.motors[static_cast<size_t>(4 * p - 1)].name,
              std::string(1, static_cast<char>('A' + p - 1)) + "-ana-HWP");
  }
  EXPECT_THROW(default_rig(5), std::invalid_argument);
}

TEST(NewCampaigns, ResizingKeepsTheMountsOfThePhotonsThatStay) {
  Rig r = default_rig(2);
  for (Motor& m : r.motors) {
    m.speed_deg_per_s = 5.0;
    m.range = TravelRange{-5.0, 355.0};
    m.backlash = Backlash::from_below;
    m.overshoot_deg = 2.0;
  }
  r.detectors[1].efficiency = 0.3;
  const Rig three = resize_rig(r, 3);
  EXPECT_EQ(three.check(3), "");
  ASSERT_EQ(three.motors.size(), 12u);
  EXPECT_EQ(three.motors[8].name, "C-prep-HWP");
  EXPECT_EQ(three.motors[8].photon, 2);
  EXPECT_EQ(three.motors[8].backlash, Backlash::from_below);
  EXPECT_EQ(three.motors[8].speed_deg_per_s, 5.0);
  EXPECT_EQ(three.detectors[2].efficiency, 0.3);
  const Rig one = resize_rig(three, 1);
  EXPECT_EQ(one.check(1), "");
  EXPECT_EQ(one.motors.size(), 4u);
}

TEST(NewCampaigns, CampaignForDataPlansWithAnyPhotonCount) {
  const DataSet d = box_data(3, 6);
  for (int p = 1; p <= 4; ++p) {
    NewCampaignOptions o;
    o.photons = p;
    const Campaign c = make_campaign_for_data(d, o);
    EXPECT_EQ(c.check_consistency(), "") << p;
    EXPECT_EQ(c.encoding.photon_count(), p);
  }
  NewCampaignOptions linear;
  linear.preset = EncodingPreset::one_feature_per_photon_linear;
  EXPECT_EQ(make_campaign_for_data(d, linear).encoding.photon_count(), 3);
  NewCampaignOptions from_rig;
  from_rig.rig = default_rig(4);
  EXPECT_EQ(make_campaign_for_data(d, from_rig).encoding.photon_count(), 4);
}

TEST(Calendar, NightsSkipWeekdaysAndDates) {
  // 2026-12-04 is a Friday (Gregorian calendar, checked by hand against a wall calendar).
  NightWindow w;
  w.first_date = "2026-12-04";
  EXPECT_EQ(w.day_offset(1), 0);
  EXPECT_EQ(w.day_offset(3), 2);
  w.skip_weekdays = {6, 7};
  w.skip_dates = {"2026-12-08"};
  EXPECT_EQ(w.night_date(1), "2026-12-04");
  EXPECT_EQ(w.night_date(2), "2026-12-07");  // Monday
  EXPECT_EQ(w.night_date(3), "2026-12-09");  // Tuesday the 8th is booked
  EXPECT_EQ(w.day_offset(2), 3);
  EXPECT_EQ(w.night_start_s(3), 5 * 86400.0);
  // A skipped first date moves the first night, and the clock with it.
  w.first_date = "2026-12-05";
  EXPECT_EQ(w.night_date(1), "2026-12-07");
  EXPECT_EQ(w.day_offset(2), 2);
  // Across a month and a leap day: 2028-02-28 (Monday) to 2028-03-01 (Wednesday).
  NightWindow leap;
  leap.first_date = "2028-02-28";
  EXPECT_EQ(leap.night_date(3), "2028-03-01");
  leap.skip_weekdays = {1, 2, 3, 4, 5, 6, 7};
  EXPECT_THROW(leap.day_offset(1), std::invalid_argument);
  NightWindow bad;
  bad.first_date = "2026-02-30";
  EXPECT_THROW(bad.day_offset(1), std::invalid_argument);
}

}  // namespace
}  // namespace gramline
