// Motor units: whole steps from plate positions and the kernel change the rounding causes
// (docs/plan-files.md, "Motor units").
#include <gtest/gtest.h>

#include <cmath>
#include <vector>

#include "gramline/demo.h"
#include "gramline/motor_units.h"
#include "gramline/plan.h"

namespace gramline {
namespace {

Motor motor_with_units(double steps_per_deg, double zero_offset_deg) {
  Motor m;
  m.steps_per_deg = steps_per_deg;
  m.zero_offset_deg = zero_offset_deg;
  return m;
}

// One photon, four motors in the order prep HWP, prep QWP, analysis QWP, analysis HWP.
Rig one_photon_rig() {
  Rig rig;
  const Stage stages[] = {Stage::prep, Stage::prep, Stage::analysis, Stage::analysis};
  const Plate plates[] = {Plate::HWP, Plate::QWP, Plate::QWP, Plate::HWP};
  for (int k = 0; k < 4; ++k) {
    Motor m;
    m.name = "m" + std::to_string(k);
    m.stage = stages[k];
    m.plate = plates[k];
    rig.motors.push_back(m);
  }
  rig.detectors.resize(1);
  return rig;
}

TEST(MotorUnits, WholeStepsFollowTheDocumentedFormulaWithHalvesAwayFromZero) {
  // Values chosen exact in binary, worked by hand from round((x + z) s):
  const Motor m = motor_with_units(4.0, 0.5);
  EXPECT_EQ(motor_steps(m, 0.125), 3);    // (0.125 + 0.5) x 4 = 2.5 -> 3
  EXPECT_EQ(motor_steps(m, -0.625), -1);  // -0.125 x 4 = -0.5 -> -1
  EXPECT_EQ(motor_steps(m, 10.0), 42);    // 10.5 x 4 = 42
  EXPECT_EQ(motor_steps(m, 10.1), 42);    // 42.4 -> 42
  EXPECT_DOUBLE_EQ(position_from_motor_steps(m, 42), 10.0);
  EXPECT_DOUBLE_EQ(position_from_motor_steps(m, -1), -0.75);
}

TEST(MotorUnits, RoundedPositionsAreWithinHalfAStepOfTheDegreePositions) {
  const Motor m = motor_with_units(6400.0 / 360.0, -37.25);
  for (double x = -400.0; x <= 400.0; x += 0.7312) {
    const double back = position_from_motor_steps(m, motor_steps(m, x));
    EXPECT_LE(std::abs(back - x) * *m.steps_per_deg, 0.5 + 1e-9) << x;
  }
}

TEST(MotorUnits, RoundingThatTurnsAnHwpByHalfAStepOfFortyFiveDegreesChangesTheKernelByHalf) {
  // A prep HWP at 22.5 deg makes |H> diagonal; the analysis at 0 passes half of it. With one
  // motor step per 45 deg the HWP goes to 45 deg (0.5 step rounds up) and makes |V>, which the
  // analysis blocks: the kernel falls from 1/2 to 0 (an HWP at t turns linear polarization by
  // 2t; Hecht, Optics, ch. 8).
  Rig rig = one_photon_rig();
  rig.motors[0].steps_per_deg = 1.0 / 45.0;
  Step s;
  s.kind = StepKind::measure;
  s.position_deg = {22.5, 0.0, 0.0, 0.0};
  EXPECT_NEAR(kernel_at_positions(rig, 1, s.position_deg), 0.5, 1e-15);
  EXPECT_NEAR(kernel_rounding_max(rig, 1, {s}), 0.5, 1e-15);
  // Reference, dark and park steps do not count; no motor units, no change.
  s.kind = StepKind::reference;
  EXPECT_EQ(kernel_rounding_max(rig, 1, {s}), 0.0);
  rig.motors[0].steps_per_deg.reset();
  s.kind = StepKind::measure;
  EXPECT_EQ(kernel_rounding_max(rig, 1, {s}), 0.0);
}

TEST(MotorUnits, ThePlannedPositionsRealiseTheIdealKernel) {
  // kernel_at_positions agrees with each measure step's kernel_ideal (docs/plan-files.md says
  // they agree up to rounding).
  const Campaign c = make_demo_campaign();
  PlanOptions options;
  options.simulate_gram_error = false;
  const Plan plan = plan_campaign(c, options);
  int measured = 0;
  for (const Step& s : plan.steps) {
    if (s.kind != StepKind::measure) continue;
    EXPECT_NEAR(kernel_at_positions(c.rig, c.encoding.photon_count(), s.position_deg),
                s.kernel_ideal, 1e-9);
    ++measured;
  }
  EXPECT_GT(measured, 100);
}

TEST(MotorUnits, TheRigRefusesStepsPerDegreeThatAreNotPositiveNamingTheField) {
  Campaign c = make_demo_campaign();
  c.rig.motors[2].steps_per_deg = 0.0;
  EXPECT_NE(c.check_consistency().find("rig.motors[2].steps_per_deg"), std::string::npos);
  c.rig.motors[2].steps_per_deg = std::nan("");
  EXPECT_NE(c.check_consistency().find("rig.motors[2].steps_per_deg"), std::string::npos);
  c.rig.motors[2].steps_per_deg = 100.0;
  c.rig.motors[2].zero_offset_deg = INFINITY;
  EXPECT_NE(c.check_consistency().find("rig.motors[2].zero_offset_deg"), std::string::npos);
  c.rig.motors[2].zero_offset_deg = 12.0;
  EXPECT_EQ(c.check_consistency(), "");
}

}  // namespace
}  // namespace gramline
