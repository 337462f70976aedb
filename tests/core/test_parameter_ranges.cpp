// Every physical parameter is bounded to the sane range documented in
// docs/parameter-ranges.md, refused with the field named; Bloch angles that overflow are refused
// naming the photon and the angle; one feature-name rule holds for every data set.
#include <gtest/gtest.h>

#include <cmath>
#include <functional>
#include <limits>
#include <string>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/demo.h"
#include "gramline/plan.h"

using namespace gramline;

namespace {

struct Case {
  const char* field;  // the text the message must hold
  std::function<void(Campaign&)> set;
};

std::string problem_after(const std::function<void(Campaign&)>& set) {
  Campaign c = make_demo_campaign();
  set(c);
  return c.check_consistency();
}

const double kTiny = 4.9e-324;  // the smallest subnormal double
const double kHuge = 1e308;
const double kNaN = std::numeric_limits<double>::quiet_NaN();

}  // namespace

TEST(ParameterRanges, DemoIsInsideEveryRange) {
  EXPECT_EQ(make_demo_campaign().check_consistency(), "");
}

TEST(ParameterRanges, AbsurdValuesAreRefusedNamingTheField) {
  // Each value would plan "successfully" into nonsense without the range: a speed of
  // 4.9e-324 deg/s makes every move infinite, a pair rate of 1e308 leaves 0 pairs per entry.
  const std::vector<Case> cases = {
      {"rig.motors[0].speed_deg_per_s",
       [](Campaign& c) { c.rig.motors[0].speed_deg_per_s = kTiny; }},
      {"rig.motors[1].speed_deg_per_s",
       [](Campaign& c) { c.rig.motors[1].speed_deg_per_s = kHuge; }},
      {"rig.motors[2].accel_deg_per_s2",
       [](Campaign& c) { c.rig.motors[2].accel_deg_per_s2 = kTiny; }},
      {"rig.motors[3].accel_deg_per_s2",
       [](Campaign& c) { c.rig.motors[3].accel_deg_per_s2 = kNaN; }},
      {"rig.motors[0].overshoot_deg", [](Campaign& c) { c.rig.motors[0].overshoot_deg = 1e9; }},
      {"rig.motors[0].initial_deg", [](Campaign& c) { c.rig.motors[0].initial_deg = 1e12; }},
      {"rig.controller.settle_s", [](Campaign& c) { c.rig.controller.settle_s = 1e300; }},
      {"rig.controller.overhead_s", [](Campaign& c) { c.rig.controller.overhead_s = -1.0; }},
      {"rig.source.pair_rate_per_s", [](Campaign& c) { c.rig.source.pair_rate_per_s = kHuge; }},
      {"rig.source.pair_rate_per_s", [](Campaign& c) { c.rig.source.pair_rate_per_s = kTiny; }},
      {"rig.source.visibility", [](Campaign& c) { c.rig.source.visibility = kTiny; }},
      {"rig.detectors[0].efficiency", [](Campaign& c) { c.rig.detectors[0].efficiency = kTiny; }},
      {"rig.detectors[1].dark_rate_per_s",
       [](Campaign& c) { c.rig.detectors[1].dark_rate_per_s = kHuge; }},
      {"rig.coincidence_window_s", [](Campaign& c) { c.rig.coincidence_window_s = 1.0; }},
      {"precision.epsilon", [](Campaign& c) { c.precision.budget.epsilon = 1e-300; }},
      {"precision.confidence", [](Campaign& c) { c.precision.budget.confidence = 1.0 - 1e-16; }},
      {"precision.fixed_pairs", [](Campaign& c) { c.precision.fixed_pairs = kHuge; }},
      {"schedule.reference_interval_min",
       [](Campaign& c) { c.schedule.reference_interval_min = kHuge; }},
      {"schedule.dark_dwell_s", [](Campaign& c) { c.schedule.dark_dwell_s = kHuge; }},
      {"schedule.reference_pairs", [](Campaign& c) { c.schedule.reference_pairs = kHuge; }},
      {"schedule.optimizer_time_cap_s",
       [](Campaign& c) { c.schedule.optimizer_time_cap_s = kHuge; }},
      {"check.C", [](Campaign& c) { c.check.C = kHuge; }},
  };
  for (const Case& k : cases) {
    const std::string message = problem_after(k.set);
    EXPECT_NE(message.find(k.field), std::string::npos) << k.field << " -> " << message;
    EXPECT_NE(message.find(": must "), std::string::npos) << message;
  }
}

TEST(ParameterRanges, RangeEndsAreAccepted) {
  // The documented ends themselves are inside (closed ranges).
  EXPECT_EQ(problem_after([](Campaign& c) {
              for (Motor& m : c.rig.motors) m.speed_deg_per_s = 0.01;
              c.rig.source.pair_rate_per_s = 1e9;
              c.rig.controller.settle_s = 60.0;
              c.precision.budget.epsilon = 0.5;
            }),
            "");
}

TEST(ParameterRanges, OverflowingAnglesAreRefusedNamingPhotonAndAngle) {
  // A feature of 1e308 is finite, but times a weight above 1 it is not: before this check the
  // plan wrote NaN positions.
  const std::string big_feature = problem_after([](Campaign& c) { c.data.train(3, 0) = kHuge; });
  EXPECT_NE(big_feature.find("encoding.photons["), std::string::npos) << big_feature;
  EXPECT_NE(big_feature.find("training point 3"), std::string::npos) << big_feature;
  const std::string big_weight =
      problem_after([](Campaign& c) { c.encoding.photons[0].phi_weights_deg.setConstant(kHuge); });
  EXPECT_NE(big_weight.find("encoding.photons[0].phi"), std::string::npos) << big_weight;
  // plan_campaign refuses the same campaign rather than planning NaN.
  Campaign c = make_demo_campaign();
  c.encoding.photons[0].theta_weights_deg.setConstant(kHuge);
  EXPECT_THROW(plan_campaign(c), std::invalid_argument);
}

TEST(FeatureNames, ReservedBlankAndControlNamesAreRefused) {
  for (const char* name : {"label", "set", " label ", "LABEL", "Set\t", "", "   "})
    EXPECT_NE(feature_name_problem(name), "") << "'" << name << "'";
  EXPECT_NE(feature_name_problem(std::string("a\nb")), "");
  EXPECT_NE(feature_name_problem(std::string("a\0b", 3)), "");
  for (const char* name : {"x0", "labels", "set point", "Λ angle", "settle"})
    EXPECT_EQ(feature_name_problem(name), "") << name;
}

TEST(FeatureNames, ValidateAppliesTheRuleAndRefusesNamesDifferingOnlyInCase) {
  Campaign c = make_demo_campaign();
  c.data.feature_names[1] = " label ";
  EXPECT_NE(validate(c.data).find("feature 1 name"), std::string::npos) << validate(c.data);
  c.data.feature_names = {"Tilt", "tilt"};
  EXPECT_NE(validate(c.data).find("feature 1 name"), std::string::npos) << validate(c.data);
}
