#include "formats/campaign_json.h"

#include <QDate>
#include <QJsonArray>
#include <QJsonDocument>
#include <cstdio>
#include <limits>
#include <set>

#include "formats/json_field.h"
#include "formats/limits.h"
#include "formats/rig_json.h"
#include "formats/text_io.h"

namespace gramline::formats {
namespace {

// Seeds above 2^53 do not survive a JSON number; they are written as decimal text.
constexpr std::uint64_t kLargestExactInteger = std::uint64_t{1} << 53;

QString q(const std::string& text) { return QString::fromStdString(text); }

QJsonArray number_array(const double* values, long count) {
  QJsonArray out;
  for (long i = 0; i < count; ++i) out.append(values[i]);
  return out;
}

QJsonObject data_to_json(const DataSet& data) {
  QJsonArray names;
  for (const std::string& n : data.feature_names) names.append(q(n));
  QJsonArray points;
  auto add = [&](const Eigen::MatrixXd& x, const Eigen::VectorXi& y, const char* set) {
    for (long i = 0; i < x.rows(); ++i) {
      const Eigen::VectorXd row = x.row(i).transpose();
      points.append(QJsonObject{
          {"features", number_array(row.data(), row.size())}, {"label", y(i)}, {"set", set}});
    }
  };
  add(data.train, data.train_labels, "train");
  add(data.test, data.test_labels, "test");
  return QJsonObject{{"feature_names", names},
                     {"positive_name", q(data.positive_name)},
                     {"negative_name", q(data.negative_name)},
                     {"points", points}};
}

QJsonObject encoding_to_json(const EncodingMap& encoding) {
  QJsonArray photons;
  for (const PhotonEncoding& p : encoding.photons) {
    photons.append(
        QJsonObject{{"theta_weights_deg_per_unit",
                     number_array(p.theta_weights_deg.data(), p.theta_weights_deg.size())},
                    {"theta_offset_deg", p.theta_offset_deg},
                    {"phi_weights_deg_per_unit",
                     number_array(p.phi_weights_deg.data(), p.phi_weights_deg.size())},
                    {"phi_offset_deg", p.phi_offset_deg}});
  }
  return QJsonObject{{"preset", q(to_string(encoding.preset))}, {"photons", photons}};
}

DataSet data_from_json(const JsonField& f) {
  DataSet data;
  // The largest supported campaign bounds what is read (docs/limits.md).
  const std::vector<JsonField> names = f["feature_names"].items();
  if (static_cast<std::int64_t>(names.size()) > limits::kFeatures)
    f["feature_names"].fail(std::to_string(names.size()) + " features, more than the limit of " +
                            std::to_string(limits::kFeatures) + " (docs/limits.md)");
  for (const JsonField& n : names) {
    data.feature_names.push_back(n.text());
    // The same name rule as the data CSV reader (docs/parameter-ranges.md).
    if (const std::string why = feature_name_problem(data.feature_names.back()); !why.empty())
      n.fail(why);
  }
  data.positive_name = f["positive_name"].text();
  data.negative_name = f["negative_name"].text();
  const long d = static_cast<long>(data.feature_names.size());
  std::vector<std::vector<double>> rows[2];
  std::vector<int> labels[2];
  for (const JsonField& p : f["points"].items()) {
    const std::vector<double> x = p["features"].numbers(d);
    const int label = static_cast<int>(p["label"].integer(-1, 1));
    if (label == 0) p["label"].fail("expected -1 or +1");
    int set = 0;
    if (p.has("set")) {
      const std::string s = p["set"].text();
      if (s == "test") {
        set = 1;
      } else if (s != "train") {
        p["set"].fail("'" + s + "' is neither 'train' nor 'test'");
      }
    }
    const std::int64_t limit = set == 0 ? limits::kTrainPoints : limits::kTestPoints;
    if (static_cast<std::int64_t>(rows[set].size()) >= limit)
      p.fail("more than the limit of " + std::to_string(limit) +
             (set == 0 ? " training" : " test") + " points (docs/limits.md)");
    rows[set].push_back(x);
    labels[set].push_back(label);
  }
  auto fill = [d](const std::vector<std::vector<double>>& r, const std::vector<int>& y,
                  Eigen::MatrixXd& x_out, Eigen::VectorXi& y_out) {
    x_out.resize(static_cast<long>(r.size()), d);
    y_out.resize(static_cast<long>(r.size()));
    for (size_t i = 0; i < r.size(); ++i) {
      for (long c = 0; c < d; ++c) x_out(static_cast<long>(i), c) = r[i][static_cast<size_t>(c)];
      y_out(static_cast<long>(i)) = y[i];
    }
  };
  fill(rows[0], labels[0], data.train, data.train_labels);
  fill(rows[1], labels[1], data.test, data.test_labels);
  return data;
}

Eigen::VectorXd vector_from(const JsonField& f) {
  const std::vector<double> v = f.numbers();
  Eigen::VectorXd out(static_cast<long>(v.size()));
  for (size_t i = 0; i < v.size(); ++i) out(static_cast<long>(i)) = v[i];
  return out;
}

EncodingMap encoding_from_json(const JsonField& f) {
  EncodingMap encoding;
  encoding.preset = f["preset"].choice({EncodingPreset::one_feature_per_photon_linear,
                                        EncodingPreset::two_features_polar_azimuth,
                                        EncodingPreset::spread, EncodingPreset::custom});
  for (const JsonField& p : f["photons"].items()) {
    PhotonEncoding e;
    e.theta_weights_deg = vector_from(p["theta_weights_deg_per_unit"]);
    e.theta_offset_deg = p["theta_offset_deg"].number();
    e.phi_weights_deg = vector_from(p["phi_weights_deg_per_unit"]);
    e.phi_offset_deg = p["phi_offset_deg"].number();
    encoding.photons.push_back(std::move(e));
  }
  return encoding;
}

std::string clock_of(const JsonField& f) {
  const std::string text = f.text();
  int minutes = 0;
  if (!parse_clock(text, minutes)) f.fail("'" + text + "' is not a clock time HH:MM (00:00-23:59)");
  return text;
}

}  // namespace

std::string weekday_name(int iso_day) {
  static const char* const kNames[] = {"Monday", "Tuesday",  "Wednesday", "Thursday",
                                       "Friday", "Saturday", "Sunday"};
  return iso_day >= 1 && iso_day <= 7 ? kNames[iso_day - 1] : "";
}

int weekday_number(const std::string& name) {
  for (int d = 1; d <= 7; ++d)
    if (weekday_name(d) == name) return d;
  return 0;
}

std::string clock_text(int minutes) {
  char buffer[16];
  std::snprintf(buffer, sizeof buffer, "%02d:%02d", (minutes / 60) % 100, minutes % 60);
  return buffer;
}

bool parse_clock(const std::string& text, int& minutes) {
  if (text.size() != 5 || text[2] != ':') return false;
  for (size_t i : {0u, 1u, 3u, 4u}) {
    if (text[i] < '0' || text[i] > '9') return false;
  }
  const int h = (text[0] - '0') * 10 + (text[1] - '0');
  const int m = (text[3] - '0') * 10 + (text[4] - '0');
  if (h > 23 || m > 59) return false;
  minutes = h * 60 + m;
  return true;
}

QJsonObject campaign_to_json(const Campaign& c) {
  QJsonObject o;
  o["format"] = kCampaignFormat;
  o["version"] = kCampaignVersion;
  o["name"] = q(c.name);
  o["notes"] = q(c.notes);
  if (c.seed <= kLargestExactInteger) {
    o["seed"] = static_cast<qint64>(c.seed);
  } else {
    o["seed"] = q(std::to_string(c.seed));
  }
  o["data"] = data_to_json(c.data);
  o["encoding"] = encoding_to_json(c.encoding);
  o["rig"] = rig_to_json(c.rig);
  const BudgetOptions& b = c.precision.budget;
  o["precision"] = QJsonObject{{"method", q(to_string(b.method))},
                               {"epsilon", b.epsilon},
                               {"confidence", b.confidence},
                               {"worst_case", b.worst_case},
                               {"fixed_pairs", c.precision.fixed_pairs},
                               {"allocation", q(to_string(c.precision.allocation))}};
  QJsonObject nights{{"first_date", q(c.nights.first_date)},
                     {"start", q(clock_text(c.nights.start_min))},
                     {"end", q(clock_text(c.nights.end_min))},
                     {"max_nights", c.nights.max_nights}};
  // The calendar keys are optional; a campaign without skips keeps the version-1 layout.
  if (!c.nights.skip_dates.empty()) {
    QJsonArray dates;
    for (const std::string& d : c.nights.skip_dates) dates.append(q(d));
    nights["skip_dates"] = dates;
  }
  if (!c.nights.skip_weekdays.empty()) {
    QJsonArray days;
    for (int d : c.nights.skip_weekdays) days.append(q(weekday_name(d)));
    nights["skip_weekdays"] = days;
  }
  o["nights"] = nights;
  const ScheduleSettings& s = c.schedule;
  o["schedule"] = QJsonObject{{"reference_interval_min", s.reference_interval_min},
                              {"reference_pairs", s.reference_pairs},
                              {"calibration_share", s.calibration_share},
                              {"dark_steps", s.dark_steps},
                              {"dark_dwell_s", s.dark_dwell_s},
                              {"park", s.park},
                              {"fit_to_nights", s.fit_to_nights},
                              {"truncation_safe", s.truncation_safe},
                              {"optimizer_time_cap_s", s.optimizer_time_cap_s},
                              {"search_evaluations", static_cast<qint64>(s.search_evaluations)}};
  const CheckSettings& k = c.check;
  o["check"] = QJsonObject{{"C", k.C},
                           {"cv_folds", k.cv_folds},
                           {"flip_threshold", k.flip_threshold},
                           {"margin_ratio_threshold", k.margin_ratio_threshold},
                           {"keep_unit_diagonal", k.keep_unit_diagonal},
                           {"trials", k.trials}};
  return o;
}

Campaign campaign_from_json(const QJsonObject& object, const std::string& file) {
  const JsonField root(object, "", file);
  const std::string format = root["format"].text();
  if (format != kCampaignFormat) {
    root["format"].fail("'" + format + "' is not a campaign file (expected '" + kCampaignFormat +
                        "')");
  }
  const long long version = root["version"].integer(1, std::numeric_limits<int>::max());
  if (version > kCampaignVersion) {
    root["version"].fail("the file has version " + std::to_string(version) +
                         ", newer than this program reads (" + std::to_string(kCampaignVersion) +
                         "); please update Gramline");
  }

  Campaign c;
  if (root.has("name")) c.name = root["name"].text();
  if (root.has("notes")) c.notes = root["notes"].text();
  if (root.has("seed")) {
    const JsonField seed = root["seed"];
    if (seed.value().isString()) {
      const std::string digits = seed.text();
      std::uint64_t value = 0;
      bool ok = !digits.empty() && digits.size() <= 20;
      for (char ch : digits) {
        if (ch < '0' || ch > '9') ok = false;
      }
      if (ok) {
        try {
          value = std::stoull(digits);
        } catch (const std::exception&) {
          ok = false;
        }
      }
      if (!ok) seed.fail("expected a non-negative integer");
      c.seed = value;
    } else {
      c.seed =
          static_cast<std::uint64_t>(seed.integer(0, static_cast<long long>(kLargestExactInteger)));
    }
  }
  c.data = data_from_json(root["data"]);
  c.encoding = encoding_from_json(root["encoding"]);
  c.rig = rig_from_json(root["rig"]);

  const JsonField p = root["precision"];
  c.precision.budget.method =
      p["method"].choice({BudgetMethod::normal, BudgetMethod::wilson, BudgetMethod::hoeffding});
  c.precision.budget.epsilon = p["epsilon"].number();
  c.precision.budget.confidence = p["confidence"].number();
  c.precision.budget.worst_case = p["worst_case"].boolean();
  if (p.has("fixed_pairs")) c.precision.fixed_pairs = p["fixed_pairs"].number();
  if (p.has("allocation")) {
    c.precision.allocation =
        p["allocation"].choice({Allocation::uniform, Allocation::neyman, Allocation::margin_aware});
  }

  const JsonField n = root["nights"];
  c.nights.first_date = n["first_date"].text();
  if (!QDate::fromString(q(c.nights.first_date), Qt::ISODate).isValid() ||
      c.nights.first_date.size() != 10) {
    n["first_date"].fail("'" + c.nights.first_date + "' is not a date YYYY-MM-DD");
  }
  parse_clock(clock_of(n["start"]), c.nights.start_min);
  parse_clock(clock_of(n["end"]), c.nights.end_min);
  c.nights.max_nights = static_cast<int>(n["max_nights"].integer(1, 100000));
  if (n.has("skip_dates")) {
    for (const JsonField& d : n["skip_dates"].items()) {
      long day = 0;
      const std::string text = d.text();
      if (!parse_civil_date(text, day)) d.fail("'" + text + "' is not a date YYYY-MM-DD");
      c.nights.skip_dates.push_back(text);
    }
  }
  if (n.has("skip_weekdays")) {
    for (const JsonField& d : n["skip_weekdays"].items()) {
      const std::string text = d.text();
      const int day = weekday_number(text);
      if (day == 0) d.fail("'" + text + "' is not a weekday (Monday ... Sunday)");
      c.nights.skip_weekdays.push_back(day);
    }
    if (c.nights.skip_weekdays.size() >= 7 &&
        std::set<int>(c.nights.skip_weekdays.begin(), c.nights.skip_weekdays.end()).size() == 7)
      n["skip_weekdays"].fail("every weekday is skipped; no night is left");
  }

  if (root.has("schedule")) {
    const JsonField s = root["schedule"];
    ScheduleSettings& t = c.schedule;
    t.reference_interval_min = s["reference_interval_min"].number();
    t.reference_pairs = s["reference_pairs"].number();
    if (s.has("calibration_share")) t.calibration_share = s["calibration_share"].number();
    t.dark_steps = s["dark_steps"].boolean();
    t.dark_dwell_s = s["dark_dwell_s"].number();
    t.park = s["park"].boolean();
    t.fit_to_nights = s["fit_to_nights"].boolean();
    t.truncation_safe = s["truncation_safe"].boolean();
    t.optimizer_time_cap_s = s["optimizer_time_cap_s"].number();
    if (s.has("search_evaluations")) {
      t.search_evaluations = s["search_evaluations"].integer(0, std::numeric_limits<int>::max());
    }
  }
  if (root.has("check")) {
    const JsonField k = root["check"];
    CheckSettings& t = c.check;
    t.C = k["C"].number();
    t.cv_folds = static_cast<int>(k["cv_folds"].integer(2, 1000));
    t.flip_threshold = k["flip_threshold"].number();
    t.margin_ratio_threshold = k["margin_ratio_threshold"].number();
    t.keep_unit_diagonal = k["keep_unit_diagonal"].boolean();
    t.trials = static_cast<int>(k["trials"].integer(1, limits::kTrials));
  }
  // Every key this reader knows has been asked for by now; anything else is refused.
  root.refuse_unread_keys();
  return c;
}

Campaign parse_campaign(const std::string& bytes, const std::string& file) {
  const JsonField root = parse_json_document(bytes, file);
  return campaign_from_json(root.value().toObject(), file);
}

std::string format_campaign(const Campaign& campaign) {
  const QJsonObject object = campaign_to_json(campaign);
  require_finite_json(object, "campaign " + campaign.name);
  const QByteArray bytes = QJsonDocument(object).toJson(QJsonDocument::Indented);
  return std::string(bytes.constData(), static_cast<size_t>(bytes.size()));
}

Campaign load_campaign(const QString& path) {
  return parse_campaign(read_whole_file(path, limits::kCampaignBytes), path_text(path));
}

void save_campaign(const Campaign& campaign, const QString& path) {
  write_whole_file(path, format_campaign(campaign));
}

}  // namespace gramline::formats
