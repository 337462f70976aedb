// Waveplate synthesis (waveplates.h) and the published tomography settings, checked by Jones
// products and by closed forms derived here from the sources named beside each check.
#include <gtest/gtest.h>

#include <algorithm>
#include <array>
#include <cmath>
#include <complex>
#include <numbers>
#include <random>
#include <string>
#include <vector>

#include "gramline/jones.h"
#include "gramline/waveplates.h"

namespace {

using gramline::JonesMatrix;
using gramline::JonesVector;
using cd = std::complex<double>;

constexpr double kPi = std::numbers::pi;
constexpr double kTight = 1e-12;

struct NamedState {
  const char* name;
  double theta_deg;
  double phi_deg;
};

// Parametrisation of docs/conventions.md: H, V, D = (H+V)/sqrt2, A = (H-V)/sqrt2, and our labels
// R = (H + iV)/sqrt2 = psi(90, 90), L = (H - iV)/sqrt2 = psi(90, 270).
const std::vector<NamedState> kCardinal = {{"H", 0.0, 0.0},   {"V", 180.0, 0.0},
                                           {"D", 90.0, 0.0},  {"A", 90.0, 180.0},
                                           {"R", 90.0, 90.0}, {"L", 90.0, 270.0}};

// The state orthogonal to psi(theta, phi) is psi(180 - theta, phi + 180): by the formula of
// docs/conventions.md
// its amplitudes are (sin(theta/2), -e^{i phi} cos(theta/2)), whose inner product with
// (cos(theta/2), e^{i phi} sin(theta/2)) vanishes.
JonesVector orthogonal_state(double theta_deg, double phi_deg) {
  return gramline::bloch_state(180.0 - theta_deg, phi_deg + 180.0);
}

// Distance between two angles modulo `period`, in [0, period/2].
double angle_distance(double a, double b, double period) {
  double d = std::fmod(std::abs(a - b), period);
  return std::min(d, period - d);
}

bool equal_up_to_phase(const JonesMatrix& a, const JonesMatrix& b, double tol) {
  Eigen::Index row = 0, col = 0;
  b.cwiseAbs().maxCoeff(&row, &col);
  const cd phase = a(row, col) / b(row, col);
  return std::abs(std::abs(phase) - 1.0) < tol && (a - phase * b).norm() < tol;
}

// Checks every preparation and analysis solution of psi(theta, phi) by the Jones product.
void expect_synthesis_ok(double theta, double phi) {
  SCOPED_TRACE("theta=" + std::to_string(theta) + " phi=" + std::to_string(phi));
  const JonesVector target = gramline::bloch_state(theta, phi);
  const JonesVector orth = orthogonal_state(theta, phi);
  for (const gramline::PlatePair& s : gramline::preparation_solutions(theta, phi)) {
    EXPECT_GE(gramline::overlap(gramline::prepared_state(s.hwp_deg, s.qwp_deg), target),
              1.0 - kTight)
        << "prep h=" << s.hwp_deg << " q=" << s.qwp_deg;
    EXPECT_GE(s.hwp_deg, 0.0);
    EXPECT_LT(s.hwp_deg, gramline::kHwpPeriodDeg);
    EXPECT_GE(s.qwp_deg, 0.0);
    EXPECT_LT(s.qwp_deg, gramline::kQwpPeriodDeg);
  }
  for (const gramline::PlatePair& s : gramline::analysis_solutions(theta, phi)) {
    EXPECT_GE(gramline::analysis_pass_probability(s.qwp_deg, s.hwp_deg, target), 1.0 - kTight)
        << "analysis h=" << s.hwp_deg << " q=" << s.qwp_deg;
    EXPECT_LE(gramline::analysis_pass_probability(s.qwp_deg, s.hwp_deg, orth), kTight)
        << "analysis h=" << s.hwp_deg << " q=" << s.qwp_deg;
    EXPECT_GE(s.hwp_deg, 0.0);
    EXPECT_LT(s.hwp_deg, gramline::kHwpPeriodDeg);
    EXPECT_GE(s.qwp_deg, 0.0);
    EXPECT_LT(s.qwp_deg, gramline::kQwpPeriodDeg);
  }
  EXPECT_GE(gramline::synthesis_fidelity(theta, phi), 1.0 - kTight);
  EXPECT_LE(gramline::synthesis_fidelity(theta, phi), 1.0 + kTight);
}

// ---------------------------------------------------------------------------------------------
// James, Kwiat, Munro and White, "Measurement of qubits", Phys. Rev. A 64, 052312 (2001).
// Their analyser is QWP, then HWP, then a polarizer; their single-photon projection settings
// (from memory): H: h = 45, q = 0; V: h = 0, q = 0; D: h = 22.5, q = 45; R: h = 22.5, q = 0,
// with the polarizer transmitting V and their R = (H - iV)/sqrt2 (from memory).
//
// Convention difference, worked out by hand with our matrices (and checked below):
//  1. Their polarizer passes V, our PBS pass port is H. A lossless V-pass probability is
//     1 - (H-pass probability); equivalently HWP(h)^dag V = (sin 2h, -cos 2h) equals
//     HWP(h + 45)^dag H up to sign, so V-pass at h is our H-pass at h + 45.
//  2. Their plate angles turn the opposite way to ours: our angle = -(their angle). Flipping
//     every angle is a mirror V -> -V (it swaps D <-> A and R <-> L). Without the flip their
//     D setting would project onto A in our convention: HWP(22.5 + 45) H = A, and A is an
//     eigenstate of QWP(45).
// Map: our_qwp = -q, our_hwp = 45 - h. Under it, the four settings project onto H, V,
// D = (H+V)/sqrt2 and (H - iV)/sqrt2 = psi(90, 270), i.e. their R.
struct JkmwSetting {
  const char* name;
  double h_deg;               // their HWP angle
  double q_deg;               // their QWP angle
  double theta_deg, phi_deg;  // the state it projects onto, our parametrisation
};

const std::vector<JkmwSetting> kJkmw = {{"H", 45.0, 0.0, 0.0, 0.0},
                                        {"V", 0.0, 0.0, 180.0, 0.0},
                                        {"D", 22.5, 45.0, 90.0, 0.0},
                                        {"R", 22.5, 0.0, 90.0, 270.0}};

TEST(Tomography, JamesKwiatMunroWhiteSettingsWithVPassPolarizer) {
  for (const JkmwSetting& s : kJkmw) {
    SCOPED_TRACE(s.name);
    const JonesVector target = gramline::bloch_state(s.theta_deg, s.phi_deg);
    const JonesVector orth = orthogonal_state(s.theta_deg, s.phi_deg);
    // Their V-pass polarizer as 1 - (our H-pass), their angles mirrored.
    const double v_pass_target =
        1.0 - gramline::analysis_pass_probability(-s.q_deg, -s.h_deg, target);
    const double v_pass_orth = 1.0 - gramline::analysis_pass_probability(-s.q_deg, -s.h_deg, orth);
    EXPECT_NEAR(v_pass_target, 1.0, kTight);
    EXPECT_NEAR(v_pass_orth, 0.0, kTight);
  }
}

TEST(Tomography, JamesKwiatMunroWhiteSettingsMappedToOurAnalyser) {
  for (const JkmwSetting& s : kJkmw) {
    SCOPED_TRACE(s.name);
    const double our_qwp = -s.q_deg;
    const double our_hwp = 45.0 - s.h_deg;
    const JonesVector target = gramline::bloch_state(s.theta_deg, s.phi_deg);
    EXPECT_NEAR(gramline::analysis_pass_probability(our_qwp, our_hwp, target), 1.0, kTight);
    EXPECT_NEAR(gramline::analysis_pass_probability(our_qwp, our_hwp,
                                                    orthogonal_state(s.theta_deg, s.phi_deg)),
                0.0, kTight);
    // Canonical equivalents inside the plate periods act the same way.
    const double h_wrapped = std::fmod(std::fmod(our_hwp, 90.0) + 90.0, 90.0);
    const double q_wrapped = std::fmod(std::fmod(our_qwp, 180.0) + 180.0, 180.0);
    EXPECT_NEAR(gramline::analysis_pass_probability(q_wrapped, h_wrapped, target), 1.0, kTight);
  }
}

// The convention difference is real: without the angle flip (V-pass only) the D and R settings
// land on A and (H + iV)/sqrt2 in our convention, as derived in the comment above.
TEST(Tomography, WithoutAngleFlipDiagonalAndCircularSettingsSwap) {
  const double p_d_on_a =
      gramline::analysis_pass_probability(45.0, 22.5 + 45.0, gramline::bloch_state(90.0, 180.0));
  const double p_r_on_r =
      gramline::analysis_pass_probability(0.0, 22.5 + 45.0, gramline::bloch_state(90.0, 90.0));
  EXPECT_NEAR(p_d_on_a, 1.0, kTight);
  EXPECT_NEAR(p_r_on_r, 1.0, kTight);
}

// ---------------------------------------------------------------------------------------------
TEST(Synthesis, CardinalStatesAnalysisSolutionsProject) {
  for (const NamedState& s : kCardinal) {
    SCOPED_TRACE(s.name);
    for (const gramline::PlatePair& a : gramline::analysis_solutions(s.theta_deg, s.phi_deg)) {
      EXPECT_NEAR(gramline::analysis_pass_probability(
                      a.qwp_deg, a.hwp_deg, gramline::bloch_state(s.theta_deg, s.phi_deg)),
                  1.0, kTight);
      EXPECT_NEAR(gramline::analysis_pass_probability(a.qwp_deg, a.hwp_deg,
                                                      orthogonal_state(s.theta_deg, s.phi_deg)),
                  0.0, kTight);
    }
  }
}

TEST(Synthesis, CardinalStatesAllSolutions) {
  for (const NamedState& s : kCardinal) {
    SCOPED_TRACE(s.name);
    expect_synthesis_ok(s.theta_deg, s.phi_deg);
  }
}

// Hand-derived preparations (matrices of docs/conventions.md): H needs no rotation, HWP(45) gives
// V, HWP(22.5) gives D. So (0, 0), (45, 0) and (22.5, 45) must be among the equivalents.
TEST(Synthesis, KnownLinearPreparationsAreFound) {
  auto contains = [](const gramline::StageSolutions& sols, double h, double q) {
    for (const gramline::PlatePair& s : sols) {
      if (angle_distance(s.hwp_deg, h, 90.0) < 1e-9 && angle_distance(s.qwp_deg, q, 180.0) < 1e-9)
        return true;
    }
    return false;
  };
  // For a linear state at angle a the QWP must sit along a or a + 90 (it then leaves the state
  // unchanged), and the HWP at a/2: H -> (h 0, q 0 or 90); V -> (h 45, q 0 or 90);
  // D -> (h 22.5, q 45 or 135).
  EXPECT_TRUE(contains(gramline::preparation_solutions(0.0, 0.0), 0.0, 0.0));
  EXPECT_TRUE(contains(gramline::preparation_solutions(0.0, 0.0), 0.0, 90.0));
  EXPECT_TRUE(contains(gramline::preparation_solutions(180.0, 0.0), 45.0, 0.0));
  EXPECT_TRUE(contains(gramline::preparation_solutions(180.0, 0.0), 45.0, 90.0));
  EXPECT_TRUE(contains(gramline::preparation_solutions(90.0, 0.0), 22.5, 45.0));
  EXPECT_TRUE(contains(gramline::preparation_solutions(90.0, 0.0), 22.5, 135.0));
}

// Circular states: header contract, QWP axis at 0 and 90 degrees.
TEST(Synthesis, CircularStatesUseQwpAtZeroAndNinety) {
  for (double phi : {90.0, 270.0}) {
    for (const auto& sols :
         {gramline::preparation_solutions(90.0, phi), gramline::analysis_solutions(90.0, phi)}) {
      const double q0 = std::min(sols[0].qwp_deg, sols[1].qwp_deg);
      const double q1 = std::max(sols[0].qwp_deg, sols[1].qwp_deg);
      EXPECT_NEAR(q0, 0.0, 1e-9) << "phi=" << phi;
      EXPECT_NEAR(q1, 90.0, 1e-9) << "phi=" << phi;
    }
  }
}

TEST(Synthesis, RandomBlochStatesAllSolutions) {
  std::mt19937_64 rng(20240601);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  for (int i = 0; i < 1200; ++i) {
    // Uniform on the sphere (common practice): cos(theta) uniform in [-1, 1].
    const double theta = std::acos(1.0 - 2.0 * u(rng)) * 180.0 / kPi;
    const double phi = 360.0 * u(rng);
    expect_synthesis_ok(theta, phi);
    if (::testing::Test::HasFailure()) break;  // keep the log readable
  }
}

TEST(Synthesis, StatesNearThePolesAndTheEquator) {
  for (double theta : {1e-12, 1e-9, 1e-6, 1e-3, 0.5, 89.999999, 90.0, 90.000001, 179.5,
                       180.0 - 1e-3, 180.0 - 1e-6, 180.0 - 1e-9, 180.0}) {
    for (double phi : {0.0, 1e-9, 45.0, 90.0, 90.0 + 1e-9, 180.0, 270.0, 359.999999999}) {
      expect_synthesis_ok(theta, phi);
    }
  }
}

// Encoded angles are affine in the features, so test points beyond the training range give
// theta outside [0, 180] and phi outside [0, 360): still valid states that must be synthesized.
TEST(Synthesis, AnglesOutsideTheirPrincipalRanges) {
  std::mt19937_64 rng(77);
  std::uniform_real_distribution<double> theta(-400.0, 400.0), phi(-800.0, 800.0);
  for (int i = 0; i < 200; ++i) {
    expect_synthesis_ok(theta(rng), phi(rng));
    if (::testing::Test::HasFailure()) break;
  }
}

// A QWP turns linear light into an ellipse whose axes lie along the plate's axes (common
// practice), so the QWP axis of every preparation and analysis solution lies along the
// target's ellipse orientation psi = atan2(S2, S1)/2 or perpendicular to it. With the
// parametrisation of docs/conventions.md, S1 = cos theta, S2 = sin theta cos phi. The two solutions
// therefore differ by 90 deg in QWP angle.
TEST(Synthesis, QwpAxisAlongEllipseAxes) {
  std::mt19937_64 rng(99);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  for (int i = 0; i < 500; ++i) {
    const double theta = std::acos(1.0 - 2.0 * u(rng)) * 180.0 / kPi;
    const double phi = 360.0 * u(rng);
    const double t = theta * kPi / 180.0, f = phi * kPi / 180.0;
    const double s1 = std::cos(t), s2 = std::sin(t) * std::cos(f);
    if (std::hypot(s1, s2) < 1e-3) continue;  // near circular: orientation ill defined
    const double psi = 0.5 * std::atan2(s2, s1) * 180.0 / kPi;
    for (const auto& sols :
         {gramline::preparation_solutions(theta, phi), gramline::analysis_solutions(theta, phi)}) {
      for (const gramline::PlatePair& s : sols) {
        EXPECT_LT(angle_distance(s.qwp_deg, psi, 90.0), 1e-6)
            << "theta=" << theta << " phi=" << phi << " q=" << s.qwp_deg << " psi=" << psi;
      }
      EXPECT_NEAR(angle_distance(sols[0].qwp_deg, sols[1].qwp_deg, 180.0), 90.0, 1e-6);
    }
  }
}

// docs/conventions.md: HWP at t and t + 90 k, QWP at t and t + 180 k act alike (up to global
// phase).
TEST(Synthesis, PlatePeriodsGiveSameTransformation) {
  std::mt19937_64 rng(5);
  std::uniform_real_distribution<double> angle(0.0, 180.0);
  for (int i = 0; i < 100; ++i) {
    const double t = angle(rng);
    for (int k : {-2, -1, 1, 3}) {
      EXPECT_TRUE(equal_up_to_phase(gramline::hwp(t + gramline::kHwpPeriodDeg * k),
                                    gramline::hwp(t), 1e-12));
      EXPECT_TRUE(equal_up_to_phase(gramline::qwp(t + gramline::kQwpPeriodDeg * k),
                                    gramline::qwp(t), 1e-12));
    }
    // Half the QWP period is a different plate (fast and slow axes swapped): the check above
    // can tell the difference.
    EXPECT_FALSE(equal_up_to_phase(gramline::qwp(t + 90.0), gramline::qwp(t), 1e-6));
  }
  EXPECT_DOUBLE_EQ(gramline::kHwpPeriodDeg, 90.0);
  EXPECT_DOUBLE_EQ(gramline::kQwpPeriodDeg, 180.0);
}

TEST(Synthesis, SolutionsShiftedByPlatePeriodsStillWork) {
  std::mt19937_64 rng(6);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  for (int i = 0; i < 200; ++i) {
    const double theta = std::acos(1.0 - 2.0 * u(rng)) * 180.0 / kPi;
    const double phi = 360.0 * u(rng);
    const JonesVector target = gramline::bloch_state(theta, phi);
    for (int k : {-1, 1, 2}) {
      for (const gramline::PlatePair& s : gramline::preparation_solutions(theta, phi)) {
        EXPECT_GE(
            gramline::overlap(gramline::prepared_state(s.hwp_deg + 90.0 * k, s.qwp_deg + 180.0 * k),
                              target),
            1.0 - kTight);
        EXPECT_GE(
            gramline::overlap(gramline::prepared_state(s.hwp_deg + 90.0 * k, s.qwp_deg), target),
            1.0 - kTight);
      }
      for (const gramline::PlatePair& s : gramline::analysis_solutions(theta, phi)) {
        EXPECT_GE(gramline::analysis_pass_probability(s.qwp_deg - 180.0 * k, s.hwp_deg + 90.0 * k,
                                                      target),
                  1.0 - kTight);
      }
    }
  }
}

// Near the circular poles S3 is within rounding of 1, and chi = asin(S3)/2 loses half the
// digits: 6e-7 deg from R the plates then realise R itself. Against D the ideal kernel of
// psi(90, 90 + delta) is (1 + cos(90 + delta))/2 = (1 - sin delta)/2 (overlap of Bloch vectors,
// docs/conventions.md), e.g. 0.4999999948 at delta = 6e-7 deg; the kernel recomputed from the
// plate positions by Jones products (prepare with every solution, analyse D with every solution)
// must match it to 1e-12. The same near the other pole, approached in theta as well as in phi.
TEST(Synthesis, KernelFromPositionsNearTheCircularPoles) {
  const double d_rad = kPi / 180.0;
  for (double delta : {1e-2, 1e-4, 6e-7, 1e-8, 1e-10, 1e-12}) {
    struct Near {
      double theta, phi;
      double kernel_against_d;  // (1 + S1 S1' + S2 S2' + S3 S3')/2 with S' = (0, 1, 0)
    };
    const std::vector<Near> cases = {
        {90.0, 90.0 + delta, (1.0 - std::sin(delta * d_rad)) / 2.0},
        {90.0, 270.0 - delta, (1.0 - std::sin(delta * d_rad)) / 2.0},
        {90.0 - delta, 90.0, 0.5},  // S2 = sin theta cos 90 = 0
        {90.0 + delta, 270.0, 0.5},
    };
    for (const Near& c : cases) {
      SCOPED_TRACE("theta=" + std::to_string(c.theta) + " phi=" + std::to_string(c.phi) +
                   " delta=" + std::to_string(delta));
      for (const gramline::PlatePair& prep : gramline::preparation_solutions(c.theta, c.phi)) {
        const JonesVector made = gramline::prepared_state(prep.hwp_deg, prep.qwp_deg);
        for (const gramline::PlatePair& an : gramline::analysis_solutions(90.0, 0.0)) {
          EXPECT_NEAR(gramline::analysis_pass_probability(an.qwp_deg, an.hwp_deg, made),
                      c.kernel_against_d, 1e-12);
        }
      }
      // And the other way round: prepare D, analyse the near-pole state.
      for (const gramline::PlatePair& an : gramline::analysis_solutions(c.theta, c.phi)) {
        for (const gramline::PlatePair& prep : gramline::preparation_solutions(90.0, 0.0)) {
          EXPECT_NEAR(
              gramline::analysis_pass_probability(
                  an.qwp_deg, an.hwp_deg, gramline::prepared_state(prep.hwp_deg, prep.qwp_deg)),
              c.kernel_against_d, 1e-12);
        }
      }
      EXPECT_LE(gramline::synthesis_kernel_error(c.theta, c.phi), 1e-14);
    }
  }
}

// synthesis_kernel_error bounds the kernel error against any partner: on random states, the
// largest |kernel from positions - ideal| against random partners (ideal from the Bloch
// vectors, docs/conventions.md) stays below it plus rounding, and it stays far below 1e-12.
TEST(Synthesis, KernelErrorBoundsEveryPartner) {
  std::mt19937_64 rng(7);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  auto draw = [&] {
    return std::pair{std::acos(1.0 - 2.0 * u(rng)) * 180.0 / kPi, 360.0 * u(rng)};
  };
  auto bloch = [](double theta, double phi) {
    const double t = theta * kPi / 180.0, f = phi * kPi / 180.0;
    return std::array<double, 3>{std::cos(t), std::sin(t) * std::cos(f), std::sin(t) * std::sin(f)};
  };
  for (int i = 0; i < 200; ++i) {
    const auto [theta, phi] = draw();
    const double bound = gramline::synthesis_kernel_error(theta, phi);
    EXPECT_LT(bound, 1e-14);
    const auto s = bloch(theta, phi);
    for (int k = 0; k < 5; ++k) {
      const auto [t2, f2] = draw();
      const auto s2 = bloch(t2, f2);
      const double ideal = (1.0 + s[0] * s2[0] + s[1] * s2[1] + s[2] * s2[2]) / 2.0;
      for (const gramline::PlatePair& p : gramline::preparation_solutions(theta, phi)) {
        const double from_positions =
            gramline::analysis_pass_probability(gramline::analysis_solutions(t2, f2)[0].qwp_deg,
                                                gramline::analysis_solutions(t2, f2)[0].hwp_deg,
                                                gramline::prepared_state(p.hwp_deg, p.qwp_deg));
        EXPECT_LE(std::abs(from_positions - ideal),
                  bound + gramline::synthesis_kernel_error(t2, f2) + 1e-15);
      }
    }
  }
}

}  // namespace
