// Real plates (plates.h, docs/conventions.md "Real plates"): the Jones matrix of an imperfect
// retarder, the kernel bias it causes, its compensation, and the spread of random axis offsets.
#include <gtest/gtest.h>

#include <cmath>
#include <complex>
#include <iostream>
#include <numbers>
#include <random>

#include "gramline/demo.h"
#include "gramline/margin.h"
#include "gramline/plan.h"
#include "gramline/plates.h"
#include "gramline/random.h"
#include "gramline/units.h"

namespace gramline {
namespace {

// Linear retarder with fast axis at theta and retardance phi, written out element by element as
// in Goldstein, Polarized Light (2nd ed., ch. 4, the rotated retarder) (from memory; up to a
// global phase it is also Hecht, Optics, ch. 8):
//   [[cos^2 t + e^{i phi} sin^2 t, (1 - e^{i phi}) cos t sin t],
//    [(1 - e^{i phi}) cos t sin t, sin^2 t + e^{i phi} cos^2 t]].
JonesMatrix textbook_retarder(double axis_deg, double retardance_deg) {
  const double t = axis_deg * std::numbers::pi / 180.0;
  const std::complex<double> e = std::polar(1.0, retardance_deg * std::numbers::pi / 180.0);
  const double c = std::cos(t), s = std::sin(t);
  JonesMatrix m;
  m << c * c + e * s * s, (1.0 - e) * c * s, (1.0 - e) * c * s, s * s + e * c * c;
  return m;
}

// The kernel of a step recomputed here from the positions, the textbook matrices with the
// actual retardances (nominal 180 / 90 plus the motor's error) and the PBS leakage L:
// prod_p (1 - L) |<H|out>|^2 + L |<V|out>|^2, out = HWP_a QWP_a QWP_p HWP_p |H>
// (docs/conventions.md). `extra_deg` is added to every retardance.
double textbook_kernel(const Rig& rig, int photons, const std::vector<double>& pos,
                       double extra_deg = 0.0, int only_motor = -1) {
  auto plate = [&](int m) {
    const Motor& mo = rig.motors[m];
    const double nominal = mo.plate == Plate::HWP ? 180.0 : 90.0;
    const double extra = only_motor < 0 || only_motor == m ? extra_deg : 0.0;
    return textbook_retarder(pos[m], nominal + mo.retardance_error_deg + extra);
  };
  double k = 1.0;
  for (int p = 0; p < photons; ++p) {
    JonesVector out(1.0, 0.0);
    out = plate(rig.motor_index(p, Stage::prep, Plate::HWP)) * out;
    out = plate(rig.motor_index(p, Stage::prep, Plate::QWP)) * out;
    out = plate(rig.motor_index(p, Stage::analysis, Plate::QWP)) * out;
    out = plate(rig.motor_index(p, Stage::analysis, Plate::HWP)) * out;
    const double leak = rig.detectors[p].pbs_leakage;
    k *= (1.0 - leak) * std::norm(out(0)) + leak * std::norm(out(1));
  }
  return k;
}

bool equal_up_to_phase(const JonesMatrix& a, const JonesMatrix& b, double tol) {
  // Align the global phase on the largest element of b.
  Eigen::Index r = 0, c = 0;
  b.cwiseAbs().maxCoeff(&r, &c);
  const std::complex<double> phase = a(r, c) / b(r, c);
  return std::abs(std::abs(phase) - 1.0) < tol && (a - phase * b).norm() < tol;
}

// Small demo-sized campaign with its plates off their nominal retardances.
Campaign imperfect_demo() {
  Campaign c = make_demo_campaign();
  const double errors[] = {-4.0, 3.0, 5.0, -6.0, 2.5, -3.5, -5.0, 4.0};
  for (std::size_t m = 0; m < c.rig.motors.size(); ++m)
    c.rig.motors[m].retardance_error_deg = errors[m % 8];
  return c;
}

Plan quick_plan(const Campaign& c) {
  PlanOptions o;
  o.simulate_gram_error = false;
  return plan_campaign(c, o);
}

TEST(Plates, ImperfectRetarderMatchesTheTextbookMatrix) {
  Motor hwp;
  hwp.plate = Plate::HWP;
  hwp.retardance_error_deg = -7.0;
  Motor qwp;
  qwp.plate = Plate::QWP;
  qwp.retardance_error_deg = 4.0;
  for (double t : {0.0, 13.0, 31.0, 45.0, 77.5, 120.0, 201.0}) {
    EXPECT_TRUE(equal_up_to_phase(motor_jones(hwp, t), textbook_retarder(t, 173.0), 1e-14)) << t;
    EXPECT_TRUE(equal_up_to_phase(motor_jones(qwp, t), textbook_retarder(t, 94.0), 1e-14)) << t;
    // Unitary (lossless retarder, common practice).
    EXPECT_LT(
        (motor_jones(hwp, t).adjoint() * motor_jones(hwp, t) - Eigen::Matrix2cd::Identity()).norm(),
        1e-14);
    // Turned by 180 deg the plate is the same; by 90 deg its fast and slow axes swap, which
    // only an exact half-wave retardance leaves unchanged (Goldstein, ch. 4, from memory).
    EXPECT_TRUE(equal_up_to_phase(motor_jones(hwp, t + 180.0), motor_jones(hwp, t), 1e-13));
    EXPECT_FALSE(equal_up_to_phase(motor_jones(hwp, t + 90.0), motor_jones(hwp, t), 1e-3));
  }
  EXPECT_EQ(motor_period_deg(hwp), 180.0);
  hwp.retardance_error_deg = 0.0;
  EXPECT_EQ(motor_period_deg(hwp), 90.0);
  EXPECT_TRUE(equal_up_to_phase(motor_jones(hwp, 100.0), motor_jones(hwp, 10.0), 1e-13));
}

TEST(Plates, UncompensatedBiasFollowsTheFiniteDifferenceOfTheKernel) {
  // Ideal angles on plates whose retardances are off by a small delta: to first order the
  // kernel moves by delta times dK/dG, the derivative taken here by a central difference of the
  // textbook kernel in the retardance of all plates at once.
  Campaign c = make_demo_campaign();
  c.rig.compensate_plates = false;
  const double delta_deg = 0.05;
  for (Motor& m : c.rig.motors) m.retardance_error_deg = delta_deg;
  const Plan plan = quick_plan(c);
  Rig exact = c.rig;
  for (Motor& m : exact.motors) m.retardance_error_deg = 0.0;
  const int photons = c.encoding.photon_count();
  int checked = 0;
  double largest = 0.0;
  for (const Step& s : plan.steps) {
    if (s.kind != StepKind::measure) continue;
    const double h = 1e-3;  // degrees
    const double derivative = (textbook_kernel(exact, photons, s.position_deg, h) -
                               textbook_kernel(exact, photons, s.position_deg, -h)) /
                              (2.0 * h);
    const double bias = s.kernel_rig - s.kernel_ideal;
    // Second-order remainder: |K''| <= a few per rad^2, (0.05 deg)^2 ~ 7.6e-7 rad^2.
    EXPECT_NEAR(bias, delta_deg * derivative, 1e-5) << "step " << checked;
    largest = std::max(largest, std::abs(bias));
    ++checked;
  }
  EXPECT_GT(checked, 1000);
  EXPECT_GT(largest, 1e-4);  // the check is not vacuous
  EXPECT_NEAR(plan.summary.kernel_bias_max, largest, 1e-15);
}

TEST(Plates, CompensationReproducesTheIdealKernelOnTheActualPlates) {
  Campaign c = imperfect_demo();
  const Plan plan = quick_plan(c);
  EXPECT_TRUE(plan.summary.unreachable.empty());
  const int photons = c.encoding.photon_count();
  int checked = 0;
  for (const Step& s : plan.steps) {
    if (s.kind != StepKind::measure && s.kind != StepKind::reference) continue;
    // Independent recomputation with the textbook matrices at the actual retardances.
    ASSERT_NEAR(textbook_kernel(c.rig, photons, s.position_deg), s.kernel_ideal, 1e-9)
        << "step " << checked;
    ASSERT_NEAR(s.kernel_rig, s.kernel_ideal, 1e-9);
    ++checked;
  }
  EXPECT_GT(checked, 1000);
  EXPECT_LT(plan.summary.kernel_bias_max, 1e-9);

  // The same plates without compensation: the bias is there, and exceeds 1e-3.
  c.rig.compensate_plates = false;
  const Plan raw = quick_plan(c);
  EXPECT_GT(raw.summary.kernel_bias_max, 1e-3);
  EXPECT_GT(raw.summary.kernel_bias_frobenius, raw.summary.kernel_bias_max);
  for (const Step& s : raw.steps) {
    if (s.kind != StepKind::measure) continue;
    ASSERT_NEAR(textbook_kernel(c.rig, photons, s.position_deg), s.kernel_rig, 1e-12);
  }
}

TEST(Plates, LeakageIsWhatCompensationLeaves) {
  // With a leaking PBS each photon passes with probability L + (1 - 2L) k, k its ideal overlap
  // (docs/conventions.md): compensation cannot remove that, and kernel_rig says so.
  Campaign c = imperfect_demo();
  const double leak[2] = {0.01, 0.02};
  c.rig.detectors[0].pbs_leakage = leak[0];
  c.rig.detectors[1].pbs_leakage = leak[1];
  const Plan plan = quick_plan(c);
  int checked = 0;
  for (const Step& s : plan.steps) {
    if (s.kind != StepKind::measure && s.kind != StepKind::reference) continue;
    ASSERT_NEAR(textbook_kernel(c.rig, 2, s.position_deg), s.kernel_rig, 1e-12);
    // The ideal overlaps straight from the encoding's states.
    double expected = 1.0;
    for (int p = 0; p < 2; ++p) {
      const BlochAngles a = c.encoding.angles(p, c.data.point(s.prep_point));
      const BlochAngles b = c.encoding.angles(p, c.data.point(s.analysis_point));
      const double k =
          overlap(bloch_state(b.theta_deg, b.phi_deg), bloch_state(a.theta_deg, a.phi_deg));
      expected *= leak[p] + (1.0 - 2.0 * leak[p]) * k;
    }
    ASSERT_NEAR(s.kernel_rig, expected, 1e-9) << "step " << checked;
    ++checked;
  }
  EXPECT_GT(checked, 1000);
  EXPECT_GT(plan.summary.kernel_bias_max, 0.005);
}

TEST(Plates, PredictedSpreadFromOffsetsAgreesWithSimulatedSpread) {
  // Seeded simulation: each draw gives every motor an axis offset (sd 0.3 deg) and a
  // repeatability error (sd 0.05 deg); the kernel is recomputed by the textbook matrices at the
  // shifted positions. z = (k_sim - kernel_rig) / kernel_spread_sd over many steps and draws
  // must have standard deviation 1 (first-order propagation).
  Campaign c = imperfect_demo();
  for (Motor& m : c.rig.motors) {
    m.axis_offset_sd_deg = 0.3;
    m.repeatability_sd_deg = 0.05;
  }
  const Plan plan = quick_plan(c);
  EXPECT_GT(plan.summary.kernel_spread_max, 0.0);
  const int photons = c.encoding.photon_count();
  SplitMix64 rng(2024);
  std::normal_distribution<double> normal;
  double sum_z = 0.0, sum_z2 = 0.0;
  long count = 0;
  int steps_used = 0;
  for (std::size_t k = 0; k < plan.steps.size() && steps_used < 40; k += 37) {
    const Step& s = plan.steps[k];
    if (s.kind != StepKind::measure) continue;
    const double sd = kernel_spread_sd(c.rig, rig_kernel_gradient(c.rig, photons, s.position_deg));
    if (sd < 1e-3) continue;  // first order needs a non-vanishing slope
    ++steps_used;
    for (int d = 0; d < 400; ++d) {
      std::vector<double> pos = s.position_deg;
      for (std::size_t m = 0; m < pos.size(); ++m) pos[m] += 0.3 * normal(rng) + 0.05 * normal(rng);
      const double z = (textbook_kernel(c.rig, photons, pos) - s.kernel_rig) / sd;
      sum_z += z;
      sum_z2 += z * z;
      ++count;
    }
  }
  ASSERT_EQ(steps_used, 40);
  const double mean = sum_z / count;
  const double sd_z = std::sqrt(sum_z2 / count - mean * mean);
  // 16000 draws: the standard error of the sd is about 1/sqrt(2 * 16000) = 0.6 %.
  std::cout << "plate offsets: sd of z " << sd_z << ", mean " << mean << " over " << count
            << " draws\n";
  EXPECT_NEAR(sd_z, 1.0, 0.05) << "sd of z " << sd_z;
  EXPECT_NEAR(mean, 0.0, 0.05);
}

TEST(Plates, MarginCheckDrawsTheOffsetsEveryTrial) {
  // With shot noise made negligible (1e12 pairs per entry), the spread of a drawn entry over
  // trials is the plates' spread and its mean is kernel_rig (bias included).
  Campaign c = make_demo_campaign();
  for (Motor& m : c.rig.motors) {
    m.retardance_error_deg = 3.0;
    m.axis_offset_sd_deg = 0.4;
  }
  c.rig.compensate_plates = false;
  const Plan plan = quick_plan(c);
  MarginProblem p = make_margin_problem(c, plan);
  ASSERT_TRUE(p.plate_rig.has_value());
  p.pairs_train = (p.pairs_train.array() > 0).select(1e12, p.pairs_train);
  const int n = p.train_count();
  const int i = 3, j = 17;
  const Step& s = plan.steps[plan.step_of_train(i, j)];
  const double sd = kernel_spread_sd(c.rig, rig_kernel_gradient(c.rig, 2, s.position_deg));
  ASSERT_GT(sd, 1e-3);
  const int trials = 1000;
  double sum = 0.0, sum_sq = 0.0;
  Eigen::MatrixXd train, test;
  for (int t = 0; t < trials; ++t) {
    draw_measured_kernels(p, stream_seed(11, t), train, test);
    sum += train(i, j);
    sum_sq += train(i, j) * train(i, j);
  }
  const double mean = sum / trials;
  const double spread = std::sqrt(sum_sq / trials - mean * mean);
  // 1000 trials: the standard error of the ratio is about 1/sqrt(2000) = 2.2 %.
  std::cout << "margin draws: simulated spread " << spread << ", predicted " << sd << "\n";
  EXPECT_NEAR(spread / sd, 1.0, 0.1) << spread << " vs " << sd;
  EXPECT_NEAR(mean, s.kernel_rig, 4.0 * sd / std::sqrt(trials) + 1e-4);
  EXPECT_GT(std::abs(s.kernel_rig - s.kernel_ideal), 4.0 * sd / std::sqrt(trials));
  (void)n;
}

TEST(Plates, ChecksNameTheField) {
  Campaign c = make_demo_campaign();
  c.rig.motors[2].retardance_error_deg = 45.0;
  EXPECT_NE(c.rig.check(2).find("rig.motors[2].retardance_error_deg"), std::string::npos);
  c = make_demo_campaign();
  c.rig.motors[1].axis_offset_sd_deg = -0.1;
  EXPECT_NE(c.rig.check(2).find("rig.motors[1].axis_offset_sd_deg"), std::string::npos);
  c = make_demo_campaign();
  c.rig.motors[0].repeatability_sd_deg = 3.0;
  EXPECT_NE(c.rig.check(2).find("rig.motors[0].repeatability_sd_deg"), std::string::npos);
  c = make_demo_campaign();
  c.rig.detectors[1].pbs_leakage = 0.5;
  EXPECT_NE(c.rig.check(2).find("rig.detectors[1].pbs_leakage"), std::string::npos);
}

}  // namespace
}  // namespace gramline
