// Jones calculus (jones.h) checked against textbook optics and hand derivations from
// docs/conventions.md. Expected values are derived here, never read back from the engine.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <complex>
#include <numbers>
#include <random>

#include "gramline/jones.h"

namespace {

using gramline::JonesMatrix;
using gramline::JonesVector;
using cd = std::complex<double>;

constexpr double kPi = std::numbers::pi;
constexpr double kTight = 1e-12;
const double kInvSqrt2 = 1.0 / std::sqrt(2.0);

JonesVector make_vec(cd h, cd v) {
  JonesVector out;
  out << h, v;
  return out;
}

const JonesVector kH = make_vec(1.0, 0.0);
const JonesVector kV = make_vec(0.0, 1.0);
const JonesVector kD = make_vec(kInvSqrt2, kInvSqrt2);
const JonesVector kA = make_vec(kInvSqrt2, -kInvSqrt2);
// Our labels for the circular states in the parametrisation of docs/conventions.md:
// R = psi(90, 90), L = psi(90, 270).
const JonesVector kR = make_vec(kInvSqrt2, cd(0.0, kInvSqrt2));
const JonesVector kL = make_vec(kInvSqrt2, cd(0.0, -kInvSqrt2));

// Independent overlap |<a|b>|^2 / (|a|^2 |b|^2), so the checks below do not lean on the engine.
double ref_overlap(const JonesVector& a, const JonesVector& b) {
  return std::norm(a.dot(b)) / (a.squaredNorm() * b.squaredNorm());
}

// True when a = e^{i alpha} b for some alpha (matrices equal up to a global phase).
bool equal_up_to_phase(const JonesMatrix& a, const JonesMatrix& b, double tol) {
  Eigen::Index row = 0, col = 0;
  b.cwiseAbs().maxCoeff(&row, &col);
  if (std::abs(b(row, col)) < tol) return a.norm() < tol;
  const cd phase = a(row, col) / b(row, col);
  if (std::abs(std::abs(phase) - 1.0) > tol) return false;
  return (a - phase * b).norm() < tol;
}

// Textbook Jones matrices (common practice; e.g. Hecht, Optics, ch. 8, written from memory),
// fast axis at t from horizontal, up to a global phase:
//   HWP: [[cos 2t, sin 2t], [sin 2t, -cos 2t]]
//   QWP: [[cos^2 t + i sin^2 t, (1 - i) sin t cos t], [(1 - i) sin t cos t, sin^2 t + i cos^2 t]]
JonesMatrix textbook_hwp(double t_deg) {
  const double t = t_deg * kPi / 180.0;
  JonesMatrix m;
  m << std::cos(2 * t), std::sin(2 * t), std::sin(2 * t), -std::cos(2 * t);
  return m;
}

JonesMatrix textbook_qwp(double t_deg) {
  const double t = t_deg * kPi / 180.0;
  const double c = std::cos(t), s = std::sin(t);
  const cd i(0.0, 1.0);
  JonesMatrix m;
  m << c * c + i * s * s, (1.0 - i) * s * c, (1.0 - i) * s * c, s * s + i * c * c;
  return m;
}

// docs/conventions.md written out by hand: J(t, G) = R(-t) diag(1, e^{iG}) R(t).
JonesMatrix documented_waveplate(double t_deg, double retardance_rad) {
  const double t = t_deg * kPi / 180.0;
  Eigen::Matrix2cd rot, rot_back, retard;
  rot << std::cos(t), std::sin(t), -std::sin(t), std::cos(t);
  rot_back << std::cos(t), -std::sin(t), std::sin(t), std::cos(t);
  retard << 1.0, 0.0, 0.0, std::polar(1.0, retardance_rad);
  return rot_back * retard * rot;
}

JonesVector random_state(std::mt19937_64& rng) {
  std::normal_distribution<double> g(0.0, 1.0);
  JonesVector v = make_vec(cd(g(rng), g(rng)), cd(g(rng), g(rng)));
  return v / v.norm();
}

// Bloch vector (S1, S2, S3) / S0 of a Jones vector in the parametrisation of docs/conventions.md:
// S1 = |h|^2 - |v|^2, S2 = 2 Re(h* v), S3 = 2 Im(h* v) (common practice).
Eigen::Vector3d bloch_vector(const JonesVector& s) {
  const double n = s.squaredNorm();
  const cd hv = std::conj(s(0)) * s(1);
  return Eigen::Vector3d(std::norm(s(0)) - std::norm(s(1)), 2 * hv.real(), 2 * hv.imag()) / n;
}

TEST(Jones, HwpMatchesTextbookMatrix) {
  for (double t : {0.0, 10.0, 22.5, 45.0, 67.5, 90.0, 123.4, -33.0}) {
    EXPECT_TRUE(equal_up_to_phase(gramline::hwp(t), textbook_hwp(t), 1e-12)) << "t=" << t;
  }
}

TEST(Jones, QwpMatchesTextbookMatrix) {
  for (double t : {0.0, 10.0, 22.5, 45.0, 67.5, 90.0, 123.4, -33.0}) {
    EXPECT_TRUE(equal_up_to_phase(gramline::qwp(t), textbook_qwp(t), 1e-12)) << "t=" << t;
  }
}

TEST(Jones, WaveplateFollowsTheDocumentedFormula) {
  std::mt19937_64 rng(11);
  std::uniform_real_distribution<double> angle(-360.0, 360.0), retard(0.0, 2 * kPi);
  for (int i = 0; i < 200; ++i) {
    const double t = angle(rng), g = retard(rng);
    EXPECT_TRUE(equal_up_to_phase(gramline::waveplate(t, g), documented_waveplate(t, g), 1e-12))
        << "t=" << t << " G=" << g;
    // A lossless retarder is unitary (common practice).
    const JonesMatrix w = gramline::waveplate(t, g);
    EXPECT_LT((w.adjoint() * w - JonesMatrix::Identity()).norm(), 1e-12);
  }
  EXPECT_TRUE(equal_up_to_phase(gramline::waveplate(30.0, 0.0), JonesMatrix::Identity(), 1e-12));
  EXPECT_TRUE(equal_up_to_phase(gramline::waveplate(17.0, kPi), gramline::hwp(17.0), 1e-12));
  EXPECT_TRUE(equal_up_to_phase(gramline::waveplate(17.0, kPi / 2), gramline::qwp(17.0), 1e-12));
}

// Hecht, Optics, polarization chapter: an HWP with its fast axis at 22.5 deg rotates horizontal
// light by 45 deg, to the diagonal (H + V)/sqrt2.
TEST(Jones, HwpAt22_5TurnsHIntoDiagonal) {
  const JonesVector out = gramline::hwp(22.5) * kH;
  EXPECT_NEAR(out.norm(), 1.0, kTight);
  EXPECT_GE(gramline::overlap(out, kD), 1.0 - kTight);
  EXPECT_LE(gramline::overlap(out, kA), kTight);
}

// Hecht, Optics, polarization chapter: an HWP at 45 deg rotates H by 90 deg, to V.
TEST(Jones, HwpAt45TurnsHIntoV) {
  const JonesVector out = gramline::hwp(45.0) * kH;
  EXPECT_GE(gramline::overlap(out, kV), 1.0 - kTight);
  EXPECT_LE(gramline::overlap(out, kH), kTight);
}

// Hecht, Optics, polarization chapter: a QWP with its fast axis at 45 deg turns H into circular
// light (equal H and V amplitudes, 90 deg relative phase). Handedness in our matrix, by hand:
// R(45) H = (1, -1)/sqrt2, diag(1, i) -> (1, -i)/sqrt2, R(-45) -> ((1+i)/2, (1-i)/2), i.e.
// (H - iV)/sqrt2 up to phase: psi(90, 270) ("L" in our labels).
TEST(Jones, QwpAt45TurnsHIntoCircular) {
  const JonesVector out = gramline::qwp(45.0) * kH;
  EXPECT_NEAR(std::norm(out(0)), 0.5, kTight);
  EXPECT_NEAR(std::norm(out(1)), 0.5, kTight);
  // Circular: a linear analyser at any angle passes half of it.
  EXPECT_NEAR(gramline::overlap(out, kH), 0.5, kTight);
  EXPECT_NEAR(gramline::overlap(out, kD), 0.5, kTight);
  EXPECT_NEAR(gramline::overlap(out, kA), 0.5, kTight);
  EXPECT_GE(gramline::overlap(out, kL), 1.0 - kTight);
  EXPECT_LE(gramline::overlap(out, kR), kTight);
  // The other diagonal gives the other handedness.
  EXPECT_GE(gramline::overlap(gramline::qwp(-45.0) * kH, kR), 1.0 - kTight);
}

// The parametrisation of docs/conventions.md evaluated by hand at the six cardinal states.
TEST(Jones, BlochStateCardinalPoints) {
  EXPECT_GE(ref_overlap(gramline::bloch_state(0.0, 0.0), kH), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::bloch_state(0.0, 123.0), kH), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::bloch_state(180.0, 0.0), kV), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::bloch_state(90.0, 0.0), kD), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::bloch_state(90.0, 180.0), kA), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::bloch_state(90.0, 90.0), kR), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::bloch_state(90.0, 270.0), kL), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::bloch_state(90.0, -90.0), kL), 1.0 - kTight);
  // Amplitudes exactly as the formula: cos(theta/2), e^{i phi} sin(theta/2).
  const JonesVector s = gramline::bloch_state(70.0, 40.0);
  const double half = 35.0 * kPi / 180.0;
  EXPECT_NEAR(std::abs(s(0)), std::cos(half), kTight);
  EXPECT_NEAR(std::abs(s(1)), std::sin(half), kTight);
  EXPECT_NEAR(std::arg(s(1) / s(0)), 40.0 * kPi / 180.0, kTight);
}

TEST(Jones, BlochAnglesRoundTripUpToGlobalPhase) {
  std::mt19937_64 rng(21);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  for (int i = 0; i < 1000; ++i) {
    const double theta = std::acos(1.0 - 2.0 * u(rng)) * 180.0 / kPi;
    const double phi = 360.0 * u(rng);
    const JonesVector s = gramline::bloch_state(theta, phi) * std::polar(1.0, 2 * kPi * u(rng));
    const gramline::BlochAngles a = gramline::bloch_angles(s);
    EXPECT_GE(a.theta_deg, 0.0);
    EXPECT_LE(a.theta_deg, 180.0);
    EXPECT_GE(a.phi_deg, 0.0);
    EXPECT_LT(a.phi_deg, 360.0);
    EXPECT_NEAR(a.theta_deg, theta, 1e-7);
    if (theta > 1e-3 && theta < 180.0 - 1e-3) {
      double d = std::fmod(std::abs(a.phi_deg - phi), 360.0);
      d = std::min(d, 360.0 - d);
      EXPECT_NEAR(d, 0.0, 1e-6) << "phi=" << phi << " got " << a.phi_deg;
    }
    EXPECT_GE(ref_overlap(gramline::bloch_state(a.theta_deg, a.phi_deg), s), 1.0 - 1e-12);
  }
}

// Closed form |<a|b>|^2 = (1 + n_a . n_b) / 2 with Bloch vectors (common practice), also for
// unnormalised inputs and arbitrary global phases.
TEST(Jones, OverlapMatchesBlochVectorFormula) {
  std::mt19937_64 rng(31);
  std::uniform_real_distribution<double> scale(0.1, 5.0), ph(0.0, 2 * kPi);
  for (int i = 0; i < 1000; ++i) {
    const JonesVector a = random_state(rng), b = random_state(rng);
    const double expected = 0.5 * (1.0 + bloch_vector(a).dot(bloch_vector(b)));
    const double got =
        gramline::overlap(a * std::polar(scale(rng), ph(rng)), b * std::polar(scale(rng), ph(rng)));
    EXPECT_NEAR(got, expected, 1e-12);
  }
  EXPECT_NEAR(gramline::overlap(kH, kV), 0.0, kTight);
  EXPECT_NEAR(gramline::overlap(kR, kL), 0.0, kTight);
  EXPECT_NEAR(gramline::overlap(kH, kD), 0.5, kTight);
}

// Preparation order (docs/conventions.md): HWP(h) first, then QWP(q). By hand: HWP(22.5) H = D,
// then QWP(0) = diag(1, i) gives (H + iV)/sqrt2. The reverse order would give D, so this also pins
// the order.
TEST(Jones, PreparedStateAppliesHwpThenQwp) {
  EXPECT_GE(ref_overlap(gramline::prepared_state(22.5, 0.0), kR), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::prepared_state(45.0, 0.0), kV), 1.0 - kTight);
  EXPECT_GE(ref_overlap(gramline::prepared_state(0.0, 45.0), kL), 1.0 - kTight);
  std::mt19937_64 rng(41);
  std::uniform_real_distribution<double> angle(-200.0, 200.0);
  for (int i = 0; i < 300; ++i) {
    const double h = angle(rng), q = angle(rng);
    const JonesVector expected =
        documented_waveplate(q, kPi / 2) * documented_waveplate(h, kPi) * kH;
    EXPECT_GE(ref_overlap(gramline::prepared_state(h, q), expected), 1.0 - kTight);
    EXPECT_NEAR(gramline::prepared_state(h, q).norm(), 1.0, kTight);
  }
}

// Analysis order (docs/conventions.md): QWP(q) first, then HWP(h), then the PBS pass (H) port.
// By hand: the projected state is QWP(q)^dag HWP(h)^dag H; for q = 0, h = 22.5 this is
// diag(1, -i) D = (H - iV)/sqrt2. The reverse order would project onto D.
TEST(Jones, AnalysisAppliesQwpThenHwp) {
  EXPECT_NEAR(gramline::analysis_pass_probability(0.0, 22.5, kL), 1.0, kTight);
  EXPECT_NEAR(gramline::analysis_pass_probability(0.0, 22.5, kR), 0.0, kTight);
  EXPECT_NEAR(gramline::analysis_pass_probability(0.0, 22.5, kD), 0.5, kTight);
  std::mt19937_64 rng(51);
  std::uniform_real_distribution<double> angle(-200.0, 200.0);
  for (int i = 0; i < 300; ++i) {
    const double h = angle(rng), q = angle(rng);
    const JonesVector in = random_state(rng);
    const JonesVector out = documented_waveplate(h, kPi) * documented_waveplate(q, kPi / 2) * in;
    EXPECT_NEAR(gramline::analysis_pass_probability(q, h, in), std::norm(out(0)), 1e-12);
    // Lossless optics: pass probabilities of a state and its orthogonal add to one.
    const JonesVector orth = make_vec(-std::conj(in(1)), std::conj(in(0)));
    EXPECT_NEAR(gramline::analysis_pass_probability(q, h, in) +
                    gramline::analysis_pass_probability(q, h, orth),
                1.0, 1e-12);
  }
}

// Malus's law (common practice): an HWP at h turns linear light at 0 deg to 2h, so a horizontal
// analyser passes cos^2(2h) of H light.
TEST(Jones, HwpAnalyserFollowsMalusLaw) {
  for (double h = -90.0; h <= 90.0; h += 7.5) {
    const double c = std::cos(2.0 * h * kPi / 180.0);
    EXPECT_NEAR(gramline::analysis_pass_probability(0.0, h, kH), c * c, 1e-12) << "h=" << h;
  }
}

}  // namespace
