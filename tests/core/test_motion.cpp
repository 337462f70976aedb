// Motor time model, docs/motion-model.md. Expected values are worked by hand beside each check.
#include <gtest/gtest.h>

#include <cmath>
#include <stdexcept>

#include "gramline/motion.h"

using namespace gramline;

namespace {

Motor motor(Plate plate, double v, double a) {
  Motor m;
  m.name = "m";
  m.plate = plate;
  m.speed_deg_per_s = v;
  m.accel_deg_per_s2 = a;
  return m;
}

}  // namespace

TEST(Motion, TravelTimeTrapezoid) {
  // v=10, a=20: d=10 >= v^2/a=5, so T = 10/10 + 10/20 = 1.5 s.
  EXPECT_DOUBLE_EQ(travel_time_s(10.0, 10.0, 20.0), 1.5);
  // d=95: T = 9.5 + 0.5 = 10 s.
  EXPECT_DOUBLE_EQ(travel_time_s(95.0, 10.0, 20.0), 10.0);
}

TEST(Motion, TravelTimeTriangle) {
  // v=10, a=20: d=1.25 < 5, so T = 2 sqrt(1.25/20) = 2 * 0.25 = 0.5 s.
  EXPECT_DOUBLE_EQ(travel_time_s(1.25, 10.0, 20.0), 0.5);
  // At d = v^2/a = 5 both branches give 1.0 s: 5/10 + 10/20 = 1, 2 sqrt(5/20) = 1.
  EXPECT_NEAR(travel_time_s(5.0, 10.0, 20.0), 1.0, 1e-15);
  EXPECT_NEAR(travel_time_s(5.0 - 1e-9, 10.0, 20.0), 1.0, 1e-9);
  EXPECT_EQ(travel_time_s(0.0, 10.0, 20.0), 0.0);
}

TEST(Motion, ShortestIsSymmetric) {
  const Motor m = motor(Plate::HWP, 10.0, 20.0);
  // 30 -> 20 and 20 -> 30: d = 10, T = 1.5 s each way.
  EXPECT_DOUBLE_EQ(motor_move_s(m, 30.0, 20.0), 1.5);
  EXPECT_DOUBLE_EQ(motor_move_s(m, 20.0, 30.0), 1.5);
}

TEST(Motion, FromBelowOvershootsOnTheWayDown) {
  Motor m = motor(Plate::QWP, 10.0, 20.0);
  m.backlash = Backlash::from_below;
  m.overshoot_deg = 2.5;
  // Upward 20 -> 30: plain T(10) = 1.5 s.
  EXPECT_DOUBLE_EQ(motor_move_s(m, 20.0, 30.0), 1.5);
  // Downward 30 -> 20: T(10 + 2.5) + T(2.5) = (12.5/10 + 0.5) + 2 sqrt(2.5/20)
  //                   = 1.75 + 0.7071067811865476 = 2.4571067811865476 s.
  EXPECT_NEAR(motor_move_s(m, 30.0, 20.0), 2.4571067811865476, 1e-12);
  // No move: 0.
  EXPECT_EQ(motor_move_s(m, 20.0, 20.0), 0.0);
}

TEST(Motion, StepCombinesSimultaneousAndSequential) {
  Rig rig;
  rig.motors = {motor(Plate::HWP, 10.0, 20.0), motor(Plate::QWP, 10.0, 20.0)};
  rig.controller = Controller{MoveMode::simultaneous, 0.5, 0.1};
  const std::vector<double> from = {0.0, 0.0};
  const std::vector<double> to = {10.0, 1.25};  // motor times 1.5 s and 0.5 s
  // Simultaneous: max(1.5, 0.5) + settle 0.5 + overhead 0.1 = 2.1 s.
  EXPECT_NEAR(step_move_s(rig, from, to), 2.1, 1e-12);
  rig.controller.moves = MoveMode::sequential;
  // Sequential: 1.5 + 0.5 + 0.5 + 0.1 = 2.6 s.
  EXPECT_NEAR(step_move_s(rig, from, to), 2.6, 1e-12);
  // Nothing moves: overhead only, no settle: 0.1 s.
  EXPECT_NEAR(step_move_s(rig, from, from), 0.1, 1e-15);
  const double times[2] = {0.0, 0.0};
  EXPECT_NEAR(combine_motor_times_s(rig.controller, times, 2, false), 0.1, 1e-15);
}

TEST(Motion, EquivalentPositions) {
  Motor h = motor(Plate::HWP, 10.0, 20.0);
  // Common practice: an exact half-wave plate repeats every 90 deg, a quarter-wave plate every
  // 180 deg; a half-wave plate off its nominal retardance only every 180 deg.
  EXPECT_EQ(motor_period_deg(h), 90.0);
  EXPECT_EQ(motor_period_deg(motor(Plate::QWP, 10.0, 20.0)), 180.0);
  Motor h_off = h;
  h_off.retardance_error_deg = -2.0;
  EXPECT_EQ(motor_period_deg(h_off), 180.0);
  EXPECT_EQ(equivalent_positions_deg(h_off, 10.0, 50.0), (std::vector<double>{10.0, 190.0}));
  // Continuous: 10 + 90k within [50 - 90, 50 + 90] = [-40, 140]: 10 and 100.
  EXPECT_EQ(equivalent_positions_deg(h, 10.0, 50.0), (std::vector<double>{10.0, 100.0}));
  Motor q = motor(Plate::QWP, 10.0, 20.0);
  q.range = TravelRange{0.0, 360.0};
  // Range [0, 360]: 10 and 190 (370 is outside).
  EXPECT_EQ(equivalent_positions_deg(q, 10.0, 0.0), (std::vector<double>{10.0, 190.0}));
}

TEST(Motion, NearestEquivalent) {
  Motor h = motor(Plate::HWP, 10.0, 20.0);
  // From 85 to target 10: 100 is 15 away, 10 is 75 away.
  EXPECT_DOUBLE_EQ(nearest_equivalent_deg(h, 10.0, 85.0), 100.0);
  h.backlash = Backlash::from_below;
  h.overshoot_deg = 5.0;
  // From 12 to target 10: down to 10 costs T(7) + T(5) = (0.7 + 0.5) + 1.0 = 2.2 s, up to 100
  // costs T(88) = 8.8 + 0.5 = 9.3 s: 10 wins.
  EXPECT_DOUBLE_EQ(nearest_equivalent_deg(h, 10.0, 12.0), 10.0);
  Motor q = motor(Plate::QWP, 10.0, 20.0);
  q.range = TravelRange{0.0, 200.0};
  // From 190 to target 170 in [0, 200]: only 170 (350 is outside).
  EXPECT_DOUBLE_EQ(nearest_equivalent_deg(q, 170.0, 190.0), 170.0);
  // A motor already on an equivalent position stays exactly where it is.
  EXPECT_EQ(nearest_equivalent_deg(h, 10.0, 190.0), 190.0);
  Motor narrow = motor(Plate::HWP, 10.0, 20.0);
  narrow.range = TravelRange{10.0, 20.0};
  EXPECT_THROW(nearest_equivalent_deg(narrow, 50.0, 15.0), std::invalid_argument);
}
