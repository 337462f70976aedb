// Motor units in the files (docs/plan-files.md, "Motor units"): the campaign keys, the
// `<motor>_steps` columns of steps.csv and kernel_rounding_max in summary.json.
#include <gtest/gtest.h>

#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <cmath>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include "formats/campaign_json.h"
#include "formats/input_error.h"
#include "formats/plan_files.h"
#include "gramline/demo.h"
#include "gramline/plan.h"

namespace {

using namespace gramline;

std::vector<std::string> split(const std::string& line) {
  std::vector<std::string> out;
  std::stringstream s(line);
  for (std::string f; std::getline(s, f, ',');) out.push_back(f);
  return out;
}

Campaign demo_with_units() {
  Campaign c = make_demo_campaign();
  // Invented controller: microstepped motors (6400 steps per turn) on the even motors, a
  // coarse one-count-per-degree encoder on motor 1, degrees on the rest.
  for (size_t k = 0; k < c.rig.motors.size(); k += 2) {
    c.rig.motors[k].steps_per_deg = 6400.0 / 360.0;
    c.rig.motors[k].zero_offset_deg = k == 0 ? 12.5 : -181.0;
  }
  c.rig.motors[1].steps_per_deg = 1.0;
  c.rig.motors[1].zero_offset_deg = -37.25;
  return c;
}

Plan quick_plan(const Campaign& c) {
  PlanOptions o;
  o.simulate_gram_error = false;
  return plan_campaign(c, o);
}

TEST(MotorUnitFiles, CampaignKeysAreOptionalAndRoundTrip) {
  const Campaign plain = make_demo_campaign();
  const std::string plain_text = formats::format_campaign(plain);
  EXPECT_EQ(plain_text.find("steps_per_deg"), std::string::npos);
  EXPECT_EQ(plain_text.find("zero_offset_deg"), std::string::npos);
  const Campaign plain_back = formats::parse_campaign(plain_text, "plain");
  for (const Motor& m : plain_back.rig.motors) {
    EXPECT_FALSE(m.steps_per_deg.has_value());
    EXPECT_EQ(m.zero_offset_deg, 0.0);
  }
  const Campaign units = demo_with_units();
  const Campaign back = formats::parse_campaign(formats::format_campaign(units), "units");
  ASSERT_EQ(back.rig.motors.size(), units.rig.motors.size());
  for (size_t k = 0; k < units.rig.motors.size(); ++k) {
    EXPECT_EQ(back.rig.motors[k].steps_per_deg, units.rig.motors[k].steps_per_deg) << k;
    EXPECT_EQ(back.rig.motors[k].zero_offset_deg, units.rig.motors[k].zero_offset_deg) << k;
  }
}

TEST(MotorUnitFiles, AStepsPerDegreeThatIsNotANumberIsRefusedNamingTheField) {
  QJsonObject root = QJsonDocument::fromJson(
                         QByteArray::fromStdString(formats::format_campaign(make_demo_campaign())))
                         .object();
  QJsonObject rig = root["rig"].toObject();
  QJsonArray motors = rig["motors"].toArray();
  QJsonObject m = motors[3].toObject();
  m["steps_per_deg"] = "ten";
  motors[3] = m;
  rig["motors"] = motors;
  root["rig"] = rig;
  try {
    formats::parse_campaign(QJsonDocument(root).toJson().toStdString(), "bad.json");
    FAIL() << "accepted";
  } catch (const formats::InputError& e) {
    EXPECT_NE(std::string(e.what()).find("rig.motors[3].steps_per_deg"), std::string::npos)
        << e.what();
  }
}

TEST(MotorUnitFiles, StepColumnsReproduceTheDegreePositionsWithinHalfAStep) {
  const Campaign c = demo_with_units();
  const Plan plan = quick_plan(c);
  std::istringstream csv(formats::format_steps_csv(c.rig, plan.steps));
  std::string line;
  std::getline(csv, line);
  const std::vector<std::string> header = split(line);
  std::map<std::string, size_t> column;
  for (size_t i = 0; i < header.size(); ++i) column[header[i]] = i;
  // One _steps column per motor with units, after the last _deg column, in motor order.
  const size_t last_deg = column.at(c.rig.motors.back().name + "_deg");
  size_t next = last_deg + 1;
  for (const Motor& m : c.rig.motors) {
    if (!m.steps_per_deg) {
      EXPECT_EQ(column.count(m.name + "_steps"), 0u) << m.name;
      continue;
    }
    EXPECT_EQ(column.at(m.name + "_steps"), next++) << m.name;
  }
  EXPECT_EQ(header[next], "kernel_ideal");
  size_t rows = 0;
  double worst_steps = 0.0;
  while (std::getline(csv, line)) {
    const std::vector<std::string> f = split(line);
    ASSERT_EQ(f.size(), header.size()) << line;
    for (const Motor& m : c.rig.motors) {
      if (!m.steps_per_deg) continue;
      const std::string& text = f[column.at(m.name + "_steps")];
      ASSERT_EQ(text.find_first_not_of("-0123456789"), std::string::npos) << text;
      const double steps = std::stod(text);
      const double deg = std::stod(f[column.at(m.name + "_deg")]);
      // The documented inverse: steps / steps_per_deg - zero_offset_deg.
      const double error_steps =
          std::abs(steps / *m.steps_per_deg - m.zero_offset_deg - deg) * *m.steps_per_deg;
      EXPECT_LE(error_steps, 0.5 + 1e-9) << m.name << " at " << deg;
      worst_steps = std::max(worst_steps, error_steps);
    }
    ++rows;
  }
  EXPECT_EQ(rows, plan.steps.size());
  // Positions are not whole steps in general: rounding really happened somewhere.
  EXPECT_GT(worst_steps, 0.3);
}

TEST(MotorUnitFiles, SummaryCarriesTheKernelRoundingEffect) {
  const Campaign plain = make_demo_campaign();
  const QJsonObject s0 =
      QJsonDocument::fromJson(
          QByteArray::fromStdString(formats::format_summary_json(plain, quick_plan(plain))))
          .object();
  ASSERT_TRUE(s0.contains("kernel_rounding_max"));
  EXPECT_EQ(s0["kernel_rounding_max"].toDouble(), 0.0);
  const Campaign c = demo_with_units();
  const QJsonObject s1 =
      QJsonDocument::fromJson(
          QByteArray::fromStdString(formats::format_summary_json(c, quick_plan(c))))
          .object();
  // Each plate is off by at most half a step; turning a plate by d moves a photon's kernel
  // factor (1 + s.s')/2 by at most 2d (the Stokes vector after it turns by at most 4d; common
  // practice, Poincare-sphere picture), so the sum over the plates with units bounds the change.
  double bound = 0.0;
  for (const Motor& m : c.rig.motors)
    if (m.steps_per_deg) bound += 2.0 * (0.5 / *m.steps_per_deg) * M_PI / 180.0;
  const double r = s1["kernel_rounding_max"].toDouble();
  EXPECT_GT(r, 0.0);
  EXPECT_LE(r, bound);
}

}  // namespace
