// Encoding map (encoding.h) and ideal kernel / Gram matrix (kernel.h) against closed forms.
#include <gtest/gtest.h>

#include <Eigen/Eigenvalues>
#include <cmath>
#include <numbers>
#include <random>

#include "gramline/encoding.h"
#include "gramline/kernel.h"

namespace {

using gramline::EncodingMap;
using gramline::EncodingPreset;
using gramline::PhotonEncoding;

constexpr double kPi = std::numbers::pi;

double rad(double deg) { return deg * kPi / 180.0; }

// Photon reading feature `f` of D features into theta (1 deg per unit), phi fixed at phi_deg.
PhotonEncoding theta_photon(int features, int f, double theta_offset_deg, double phi_deg) {
  PhotonEncoding e;
  e.theta_weights_deg = Eigen::VectorXd::Zero(features);
  e.theta_weights_deg(f) = 1.0;
  e.theta_offset_deg = theta_offset_deg;
  e.phi_weights_deg = Eigen::VectorXd::Zero(features);
  e.phi_offset_deg = phi_deg;
  return e;
}

EncodingMap custom_map(std::initializer_list<PhotonEncoding> photons) {
  EncodingMap m;
  m.preset = EncodingPreset::custom;
  m.photons = photons;
  return m;
}

// Bloch vector (S1, S2, S3) of psi(theta, phi) in the parametrisation of docs/conventions.md
// (common practice): (cos t, sin t cos f, sin t sin f).
Eigen::Vector3d bloch(double theta_deg, double phi_deg) {
  const double t = rad(theta_deg), f = rad(phi_deg);
  return {std::cos(t), std::sin(t) * std::cos(f), std::sin(t) * std::sin(f)};
}

// Closed form: |<psi(t1, f)|psi(t2, f)>|^2 = cos^2((t1 - t2)/2) for a common phi, since
// cos(t1/2)cos(t2/2) + sin(t1/2)sin(t2/2) = cos((t1 - t2)/2).
TEST(Encoding, OnePhotonThetaKernelIsCosSquaredHalfDifference) {
  const EncodingMap map = custom_map({theta_photon(1, 0, 10.0, 37.0)});
  std::mt19937_64 rng(1);
  std::uniform_real_distribution<double> x(-30.0, 200.0);
  for (int i = 0; i < 500; ++i) {
    Eigen::VectorXd a(1), b(1);
    a << x(rng);
    b << x(rng);
    const double c = std::cos(rad(a(0) - b(0)) / 2.0);
    EXPECT_NEAR(gramline::ideal_kernel(map, a, b), c * c, 1e-12) << a(0) << " " << b(0);
  }
}

// At theta = 90 the overlap is |1 + e^{i dphi}|^2 / 4 = cos^2(dphi / 2).
TEST(Encoding, OnePhotonPhiKernelIsCosSquaredHalfDifference) {
  PhotonEncoding e;
  e.theta_weights_deg = Eigen::VectorXd::Zero(1);
  e.theta_offset_deg = 90.0;
  e.phi_weights_deg = Eigen::VectorXd::Constant(1, 1.0);
  const EncodingMap map = custom_map({e});
  for (double da : {0.0, 30.0, 90.0, 180.0, 250.0}) {
    Eigen::VectorXd a(1), b(1);
    a << 12.0;
    b << 12.0 + da;
    const double c = std::cos(rad(da) / 2.0);
    EXPECT_NEAR(gramline::ideal_kernel(map, a, b), c * c, 1e-12);
  }
}

// Two photons, each reading one feature: the kernel is the product of the one-photon forms.
TEST(Encoding, TwoPhotonKernelIsProduct) {
  const EncodingMap map = custom_map({theta_photon(2, 0, 0.0, 0.0), theta_photon(2, 1, 5.0, 20.0)});
  std::mt19937_64 rng(2);
  std::uniform_real_distribution<double> x(0.0, 180.0);
  for (int i = 0; i < 500; ++i) {
    Eigen::VectorXd a(2), b(2);
    a << x(rng), x(rng);
    b << x(rng), x(rng);
    const double c0 = std::cos(rad(a(0) - b(0)) / 2.0);
    const double c1 = std::cos(rad(a(1) - b(1)) / 2.0);
    EXPECT_NEAR(gramline::ideal_kernel(map, a, b), c0 * c0 * c1 * c1, 1e-12);
  }
}

// General pure states: |<a|b>|^2 = (1 + n_a . n_b) / 2 (common practice, Bloch vectors).
TEST(Encoding, PolarAzimuthKernelMatchesBlochVectorForm) {
  Eigen::VectorXd lo(2), hi(2);
  lo << 0.0, 0.0;
  hi << 1.0, 1.0;
  const EncodingMap map = gramline::make_preset(EncodingPreset::two_features_polar_azimuth, lo, hi);
  ASSERT_EQ(map.photon_count(), 1);
  std::mt19937_64 rng(3);
  std::uniform_real_distribution<double> x(0.0, 1.0);
  for (int i = 0; i < 500; ++i) {
    Eigen::VectorXd a(2), b(2);
    a << x(rng), x(rng);
    b << x(rng), x(rng);
    // Preset contract: [0, 1] -> theta in [0, 180], phi in [0, 360].
    const double expected =
        0.5 * (1.0 + bloch(180.0 * a(0), 360.0 * a(1)).dot(bloch(180.0 * b(0), 360.0 * b(1))));
    EXPECT_NEAR(gramline::ideal_kernel(map, a, b), expected, 1e-12);
  }
}

TEST(Encoding, PresetsMapTrainingRangeOntoSpan) {
  Eigen::VectorXd lo(2), hi(2);
  lo << -2.0, 10.0;
  hi << 3.0, 30.0;
  const EncodingMap lin =
      gramline::make_preset(EncodingPreset::one_feature_per_photon_linear, lo, hi, {20.0, 160.0});
  ASSERT_EQ(lin.photon_count(), 2);
  EXPECT_EQ(lin.feature_count(), 2);
  EXPECT_EQ(lin.check(2), "");
  EXPECT_NE(lin.check(3), "");
  for (int p = 0; p < 2; ++p) {
    EXPECT_NEAR(lin.angles(p, lo).theta_deg, 20.0, 1e-12);
    EXPECT_NEAR(lin.angles(p, hi).theta_deg, 160.0, 1e-12);
    EXPECT_NEAR(lin.angles(p, (lo + hi) / 2).theta_deg, 90.0, 1e-12);
    EXPECT_NEAR(lin.angles(p, hi).phi_deg, 0.0, 1e-12);  // linear states: phi = 0
  }
  // Photon 0 reads feature 0 only.
  Eigen::VectorXd x = lo;
  x(1) = hi(1);
  EXPECT_NEAR(lin.angles(0, x).theta_deg, 20.0, 1e-12);
  EXPECT_NEAR(lin.angles(1, x).theta_deg, 160.0, 1e-12);

  const EncodingMap pa = gramline::make_preset(EncodingPreset::two_features_polar_azimuth, lo, hi,
                                               {0.0, 120.0}, {-90.0, 90.0});
  ASSERT_EQ(pa.photon_count(), 1);
  EXPECT_NEAR(pa.angles(0, lo).theta_deg, 0.0, 1e-12);
  EXPECT_NEAR(pa.angles(0, lo).phi_deg, -90.0, 1e-12);
  EXPECT_NEAR(pa.angles(0, hi).theta_deg, 120.0, 1e-12);
  EXPECT_NEAR(pa.angles(0, hi).phi_deg, 90.0, 1e-12);

  const EncodingMap doubled = lin.scaled(2.0);
  // Scaling multiplies weights, not offsets: photon 0 maps [-2, 3] onto [20, 160], so
  // w = 140 / 5 = 28 deg per unit and b = 20 + 2 w = 76; scaled by 2, x = 1.5 gives 76 + 84.
  const double w = 140.0 / 5.0, b = 20.0 - w * (-2.0);
  Eigen::VectorXd y(2);
  y << 1.5, 12.0;
  EXPECT_NEAR(doubled.angles(0, y).theta_deg, b + 2.0 * w * 1.5, 1e-9);
}

TEST(Encoding, FeatureRangesAreColumnMinMax) {
  Eigen::MatrixXd train(3, 2);
  train << 1.0, -5.0, 4.0, 2.0, -3.0, 0.5;
  Eigen::VectorXd lo, hi;
  gramline::feature_ranges(train, lo, hi);
  ASSERT_EQ(lo.size(), 2);
  ASSERT_EQ(hi.size(), 2);
  EXPECT_EQ(lo(0), -3.0);
  EXPECT_EQ(lo(1), -5.0);
  EXPECT_EQ(hi(0), 4.0);
  EXPECT_EQ(hi(1), 2.0);
}

TEST(Encoding, PresetNamesRoundTrip) {
  for (EncodingPreset p : {EncodingPreset::one_feature_per_photon_linear,
                           EncodingPreset::two_features_polar_azimuth, EncodingPreset::custom}) {
    EncodingPreset back = EncodingPreset::custom;
    ASSERT_TRUE(gramline::encoding_preset_from_string(gramline::to_string(p), back));
    EXPECT_EQ(back, p);
  }
  EncodingPreset out;
  EXPECT_FALSE(gramline::encoding_preset_from_string("no-such-preset", out));
}

// ---------------------------------------------------------------------------------------------
// Gram matrix of pure product states: K_ij = |<psi_i|psi_j>|^2 = <psi_i psi_i*|psi_j psi_j*>, a
// Gram matrix of vectors, hence symmetric, PSD, unit diagonal and in [0, 1] (common practice).
void expect_gram_properties(const EncodingMap& map, const Eigen::MatrixXd& train) {
  const Eigen::MatrixXd k = gramline::ideal_gram(map, train);
  ASSERT_EQ(k.rows(), train.rows());
  ASSERT_EQ(k.cols(), train.rows());
  EXPECT_LT((k - k.transpose()).cwiseAbs().maxCoeff(), 1e-15);
  for (Eigen::Index i = 0; i < k.rows(); ++i) {
    EXPECT_NEAR(k(i, i), 1.0, 1e-12);
    for (Eigen::Index j = 0; j < k.cols(); ++j) {
      EXPECT_GE(k(i, j), -1e-15);
      EXPECT_LE(k(i, j), 1.0 + 1e-12);
      EXPECT_NEAR(k(i, j),
                  gramline::ideal_kernel(map, train.row(i).transpose(), train.row(j).transpose()),
                  1e-14);
    }
  }
  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(k);
  EXPECT_GE(eig.eigenvalues().minCoeff(), -1e-12);
}

TEST(Gram, PropertiesOnRandomTwoPhotonData) {
  std::mt19937_64 rng(10);
  std::uniform_real_distribution<double> x(-1.0, 1.0);
  Eigen::MatrixXd train(40, 2);
  for (Eigen::Index i = 0; i < train.rows(); ++i) train.row(i) << x(rng), x(rng);
  Eigen::VectorXd lo, hi;
  gramline::feature_ranges(train, lo, hi);
  expect_gram_properties(
      gramline::make_preset(EncodingPreset::one_feature_per_photon_linear, lo, hi), train);
  expect_gram_properties(gramline::make_preset(EncodingPreset::two_features_polar_azimuth, lo, hi),
                         train);
}

TEST(Gram, PropertiesOnRandomThreePhotonCustomMap) {
  std::mt19937_64 rng(11);
  std::uniform_real_distribution<double> w(-200.0, 200.0), x(-1.0, 1.0);
  EncodingMap map;
  for (int p = 0; p < 3; ++p) {
    PhotonEncoding e;
    e.theta_weights_deg = Eigen::VectorXd(3);
    e.phi_weights_deg = Eigen::VectorXd(3);
    for (int f = 0; f < 3; ++f) {
      e.theta_weights_deg(f) = w(rng);
      e.phi_weights_deg(f) = w(rng);
    }
    e.theta_offset_deg = w(rng);
    e.phi_offset_deg = w(rng);
    map.photons.push_back(e);
  }
  Eigen::MatrixXd train(30, 3);
  for (Eigen::Index i = 0; i < train.rows(); ++i) train.row(i) << x(rng), x(rng), x(rng);
  expect_gram_properties(map, train);
}

TEST(Gram, CrossBlockMatchesKernel) {
  const EncodingMap map = custom_map({theta_photon(2, 0, 0.0, 0.0), theta_photon(2, 1, 0.0, 0.0)});
  Eigen::MatrixXd train(4, 2), test(3, 2);
  train << 0, 0, 90, 0, 0, 90, 180, 180;
  test << 45, 45, 0, 180, 90, 90;
  const Eigen::MatrixXd c = gramline::ideal_cross(map, test, train);
  ASSERT_EQ(c.rows(), 3);
  ASSERT_EQ(c.cols(), 4);
  for (int i = 0; i < 3; ++i) {
    for (int j = 0; j < 4; ++j) {
      const double c0 = std::cos(rad(test(i, 0) - train(j, 0)) / 2.0);
      const double c1 = std::cos(rad(test(i, 1) - train(j, 1)) / 2.0);
      EXPECT_NEAR(c(i, j), c0 * c0 * c1 * c1, 1e-12) << i << "," << j;
    }
  }
}

}  // namespace
