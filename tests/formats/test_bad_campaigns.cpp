// Bad campaign files are refused with a message, never planned into a crash: every field of a
// small campaign is removed or given a wrong or unphysical value, then loaded and planned the
// way `gramline-cli plan` does it.
#include <gtest/gtest.h>

#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <cstdlib>
#include <functional>
#include <stdexcept>
#include <string>
#include <vector>

#include "formats/campaign_json.h"
#include "formats/input_error.h"
#include "gramline/demo.h"
#include "gramline/plan.h"

namespace {

using namespace gramline;

/// The demo rig and settings with only six points, so that each plan is quick.
QJsonObject small_campaign() {
  Campaign c = make_demo_campaign();
  c.data.train.conservativeResize(4, Eigen::NoChange);
  c.data.train_labels.conservativeResize(4);
  c.data.train_labels << 1, -1, 1, -1;
  c.data.test.conservativeResize(2, Eigen::NoChange);
  c.data.test_labels.conservativeResize(2);
  return formats::campaign_to_json(c);
}

using Path = std::vector<QJsonValue>;  // object keys (strings) and array indices (numbers)

void leaf_paths(const QJsonValue& value, Path path, std::vector<Path>& out) {
  if (!path.empty()) out.push_back(path);
  if (value.isObject()) {
    const QJsonObject o = value.toObject();
    for (auto it = o.begin(); it != o.end(); ++it) {
      Path p = path;
      p.push_back(it.key());
      leaf_paths(it.value(), p, out);
    }
  } else if (value.isArray()) {
    const QJsonArray a = value.toArray();
    for (qsizetype i = 0; i < a.size() && i < 2; ++i) {  // the first two elements suffice
      Path p = path;
      p.push_back(static_cast<int>(i));
      leaf_paths(a[i], p, out);
    }
  }
}

/// `root` with the value at `path` replaced (or removed when `replacement` is undefined).
QJsonValue changed(const QJsonValue& root, const Path& path, size_t depth,
                   const QJsonValue& replacement) {
  const QJsonValue& step = path[depth];
  const bool last = depth + 1 == path.size();
  if (step.isString()) {
    QJsonObject o = root.toObject();
    const QString key = step.toString();
    if (last && replacement.isUndefined()) {
      o.remove(key);
    } else {
      o[key] = last ? replacement : changed(o[key], path, depth + 1, replacement);
    }
    return o;
  }
  QJsonArray a = root.toArray();
  const int i = step.toInt();
  if (last && replacement.isUndefined()) {
    a.removeAt(i);
  } else {
    a[i] = last ? replacement : changed(a[i], path, depth + 1, replacement);
  }
  return a;
}

std::string path_text(const Path& path) {
  std::string out;
  for (const QJsonValue& step : path) {
    out += step.isString() ? "." + step.toString().toStdString()
                           : "[" + std::to_string(step.toInt()) + "]";
  }
  return out;
}

/// Loads and plans as `gramline-cli plan` does. True when refused with a message or planned.
bool refused_or_planned(const std::string& bytes) {
  try {
    const Campaign c = formats::parse_campaign(bytes, "spoiled.json");
    if (!c.check_consistency().empty()) return true;
    PlanOptions options;
    options.optimize_order = false;
    plan_campaign(c, options);
  } catch (const formats::InputError&) {
  } catch (const std::invalid_argument&) {
  }
  return true;
}

TEST(BadCampaigns, EveryFieldSpoiledIsRefusedOrPlannedNeverCrashes) {
  const QJsonObject root = small_campaign();
  std::vector<Path> paths;
  leaf_paths(root, {}, paths);
  ASSERT_GT(paths.size(), 80u);
  const std::vector<QJsonValue> spoilers = {
      QJsonValue(QJsonValue::Undefined), "text",      -1.0, 0.0,
      QJsonValue(QJsonValue::Null),      QJsonArray{}};
  int refused = 0;
  int planned = 0;
  for (const Path& path : paths) {
    for (const QJsonValue& spoiler : spoilers) {
      const QJsonObject bad = changed(root, path, 0, spoiler).toObject();
      const std::string bytes = QJsonDocument(bad).toJson().toStdString();
      SCOPED_TRACE(path_text(path));
      try {
        const Campaign c = formats::parse_campaign(bytes, "spoiled.json");
        if (!c.check_consistency().empty()) {
          ++refused;
          continue;
        }
        PlanOptions options;
        options.optimize_order = false;
        plan_campaign(c, options);
        ++planned;
      } catch (const formats::InputError& e) {
        EXPECT_NE(std::string(e.what()).find("spoiled.json"), std::string::npos) << e.what();
        ++refused;
      } catch (const std::invalid_argument&) {
        ++refused;
      }
    }
  }
  // Most spoilers break the file; some (a name, a harmless number) still plan.
  EXPECT_GT(refused, planned);
}

}  // namespace

namespace {

// Huge values (steps longer than the reference interval or a whole night, e.g.
// rig.coincidence_window_s = 1000, rig.controller.settle_s = 1e6, precision.fixed_pairs = 1e308)
// once crashed the scheduler; they must be refused with a message or planned. Each value runs
// in a child process, so a crash fails only its own check.
TEST(BadCampaignsDeathTest, HugeNumbersAreRefusedOrPlannedWithoutCrashing) {
  const QJsonObject root = small_campaign();
  std::vector<Path> paths;
  leaf_paths(root, {}, paths);
  for (const Path& path : paths) {
    QJsonValue at = root;
    for (const QJsonValue& step : path) {
      at = step.isString() ? at.toObject()[step.toString()] : at.toArray()[step.toInt()];
    }
    if (!at.isDouble()) continue;
    for (double huge : {1e3, 1e6, 1e308}) {
      SCOPED_TRACE(path_text(path) + " = " + QString::number(huge).toStdString());
      const std::string bytes =
          QJsonDocument(changed(root, path, 0, huge).toObject()).toJson().toStdString();
      EXPECT_EXIT(std::exit(refused_or_planned(bytes) ? 0 : 1), ::testing::ExitedWithCode(0), "");
    }
  }
}

}  // namespace
