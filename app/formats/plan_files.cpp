#include "formats/plan_files.h"

#include <QDir>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <cmath>
#include <limits>
#include <map>

#include "formats/bundle.h"
#include "formats/file_set.h"
#include "formats/input_error.h"
#include "formats/json_field.h"
#include "formats/limits.h"
#include "formats/rig_json.h"
#include "formats/text_io.h"
#include "gramline/motor_units.h"

namespace gramline::formats {
namespace {

/// Formatted text is handed to a sink once this many bytes have gathered.
constexpr std::size_t kSinkChunk = 1 << 16;

QString q(const std::string& text) { return QString::fromStdString(text); }

// Every JSON file goes through here: no NaN or infinity is ever written (they would become
// null, which our own readers refuse).
std::string json_text(const QJsonObject& object, const std::string& file) {
  require_finite_json(object, file);
  const QByteArray bytes = QJsonDocument(object).toJson(QJsonDocument::Indented);
  return std::string(bytes.constData(), static_cast<size_t>(bytes.size()));
}

int point_from(const JsonField& f, int point_limit) {
  if (f.is_null()) return -1;
  return static_cast<int>(f.integer(0, point_limit));
}

}  // namespace

std::string steps_conventions_text() {
  return "Polarization: Jones vectors in the H/V basis, H = (1, 0), V = (0, 1); global phases "
         "are ignored. A waveplate whose fast axis is at angle t from horizontal with retardance "
         "G acts as R(-t) diag(1, exp(iG)) R(t), R(t) = [[cos t, sin t], [-sin t, cos t]]; G is "
         "the plate's actual retardance: pi for an HWP and pi/2 for a QWP, plus the motor's "
         "retardance_error_deg (listed with the motors below). Every angle in this file is in "
         "degrees. A point's state on photon p is cos(theta/2)|H> + exp(i phi) sin(theta/2)|V>. "
         "Preparation: |H> passes the prep HWP, then the prep QWP. Analysis: the light passes "
         "the analysis QWP, then the analysis HWP, then a polarizing beam splitter whose H "
         "output counts as pass. kernel_ideal is the product over photons of "
         "|<psi(analysis point)|psi(prep point)>|^2. kernel_rig is the product over photons of "
         "(1 - L) |<H|out>|^2 + L |<V|out>|^2, out = HWP(h_an) QWP(q_an) QWP(q_prep) HWP(h_prep) "
         "|H> computed from position_deg with the actual retardances, L the photon's "
         "pbs_leakage (the header's list, one per photon). When the campaign compensates the "
         "plates (rig.compensate_plates, the default) the positions are solved for the actual "
         "retardances, so kernel_rig equals kernel_ideal (apart from leakage) wherever the "
         "plates can reach the state. p_pass adds global depolarization, V kernel + (1 - V) / "
         "2^P for P photons. A QWP at t and at t + 180 k acts alike; an HWP at t and at t + 90 "
         "k only when its retardance error is 0, otherwise only at t + 180 k. "
         "Motion: position_deg is the physical, unwrapped position each motor is commanded to. "
         "A move over distance d takes T(d) = d/v + v/a when d >= v^2/a, else 2 sqrt(d/a), and "
         "T(0) = 0, with v = speed_deg_per_s and a = accel_deg_per_s2. A motor with backlash "
         "'shortest' moving from x to y takes T(|y - x|); with 'from-below' it takes T(y - x) "
         "when y >= x, else T(x - y + o) + T(o), o = overshoot_deg (it passes the target by o "
         "and comes back upward). A step's move_s is the maximum (controller moves "
         "'simultaneous') or the sum ('sequential') of its motors' times, plus settle_s when "
         "any motor moved, plus overhead_s. The first step starts from each motor's "
         "initial_deg; motors return there only in a 'park' step. start_s counts seconds from "
         "the start of the first night to the start of the step's move; the step occupies "
         "[start_s, start_s + move_s + dwell_s]. prep_point and analysis_point index the data "
         "set's points, training points first in file order, then test points; null where the "
         "step measures no pair of points.";
}

void write_steps_json(const Rig& rig, const std::vector<Step>& steps, const TextSink& sink,
                      const std::string& set_id) {
  // The header goes through QJsonDocument; the steps are written one compact object per line
  // by hand, so half a million steps never exist as a JSON tree in memory at once.
  QJsonArray motors;
  for (const Motor& m : rig.motors) motors.append(motor_to_json(m));
  QJsonArray leakage;
  for (const Detector& d : rig.detectors) leakage.append(d.pbs_leakage);
  QJsonObject header{{"format", kStepsFormat},
                     {"version", kStepsVersion},
                     {"conventions", q(steps_conventions_text())},
                     {"motors", motors},
                     {"pbs_leakage", leakage},
                     {"controller", controller_to_json(rig.controller)}};
  if (!set_id.empty()) header[kSetIdKey] = q(set_id);
  std::string head = json_text(header, "steps.json");
  // Drop the closing brace and newline of the header object to append "steps".
  head.erase(head.find_last_of('}'));
  while (!head.empty() && (head.back() == '\n' || head.back() == ' ')) head.pop_back();
  std::vector<std::string> keys;  // "\"name\":" with the name escaped as JSON
  for (const Motor& m : rig.motors) {
    const QByteArray quoted = QJsonDocument(QJsonArray{q(m.name)}).toJson(QJsonDocument::Compact);
    keys.push_back(std::string(quoted.constData() + 1, static_cast<size_t>(quoted.size() - 2)) +
                   ":");
  }
  auto point = [](int index) { return index < 0 ? std::string("null") : std::to_string(index); };
  std::string at;  // "steps.json: steps[i]." for messages about a figure that is not finite
  auto num = [&at](double value, const char* field) {
    return finite_number_text(value, at + field);
  };
  std::string out = std::move(head);
  out += ",\n    \"steps\": [";
  for (size_t i = 0; i < steps.size(); ++i) {
    // Handed on in pieces of about 64 KB: the whole text never sits in memory at once.
    if (out.size() >= kSinkChunk) {
      sink(out);
      out.clear();
    }
    const Step& st = steps[i];
    at = "steps.json: steps[" + std::to_string(i) + "].";
    out += i == 0 ? "\n      {" : ",\n      {";
    out += "\"index\":" + std::to_string(i) + ",\"kind\":\"" + to_string(st.kind) +
           "\",\"block\":\"" + to_string(st.block) + "\",\"prep_point\":" + point(st.prep_point) +
           ",\"analysis_point\":" + point(st.analysis_point) + ",\"position_deg\":{";
    for (size_t m = 0; m < keys.size() && m < st.position_deg.size(); ++m) {
      if (m > 0) out += ",";
      out += keys[m] +
             finite_number_text(st.position_deg[m], at + "position_deg." + rig.motors[m].name);
    }
    out += "},\"kernel_ideal\":" + num(st.kernel_ideal, "kernel_ideal") +
           ",\"kernel_rig\":" + num(st.kernel_rig, "kernel_rig") +
           ",\"p_pass\":" + num(st.p_pass, "p_pass") + ",\"pairs\":" + num(st.pairs, "pairs") +
           ",\"dwell_s\":" + num(st.dwell_s, "dwell_s") +
           ",\"move_s\":" + num(st.move_s, "move_s") +
           ",\"start_s\":" + num(st.start_s, "start_s") + ",\"night\":" + std::to_string(st.night) +
           "}";
  }
  out += steps.empty() ? "]\n}\n" : "\n    ]\n}\n";
  sink(out);
}

std::string format_steps_json(const Rig& rig, const std::vector<Step>& steps,
                              const std::string& set_id) {
  std::string out;
  write_steps_json(
      rig, steps, [&](std::string_view piece) { out += piece; }, set_id);
  return out;
}

void write_steps_csv(const Rig& rig, const std::vector<Step>& steps, const TextSink& sink) {
  std::string out = "index,kind,block,prep_point,analysis_point";
  for (const Motor& m : rig.motors) out += "," + csv_field(m.name + "_deg");
  for (const Motor& m : rig.motors)
    if (has_motor_units(m)) out += "," + csv_field(m.name + "_steps");
  out += ",kernel_ideal,kernel_rig,p_pass,pairs,dwell_s,move_s,start_s,night\n";
  auto point = [](int index) { return index < 0 ? std::string() : std::to_string(index); };
  for (size_t i = 0; i < steps.size(); ++i) {
    if (out.size() >= kSinkChunk) {
      sink(out);
      out.clear();
    }
    const Step& s = steps[i];
    out += std::to_string(i) + "," + to_string(s.kind) + "," + to_string(s.block) + "," +
           point(s.prep_point) + "," + point(s.analysis_point);
    const std::string at = "steps.csv: line " + std::to_string(i + 2) + ", ";
    for (size_t m = 0; m < rig.motors.size(); ++m) {
      out += ",";
      if (m < s.position_deg.size())
        out += finite_number_text(s.position_deg[m], at + rig.motors[m].name + "_deg");
    }
    for (size_t m = 0; m < rig.motors.size(); ++m) {
      if (!has_motor_units(rig.motors[m])) continue;
      out += ",";
      if (m < s.position_deg.size())
        out += std::to_string(motor_steps(rig.motors[m], s.position_deg[m]));
    }
    const std::pair<const char*, double> figures[] = {{"kernel_ideal", s.kernel_ideal},
                                                      {"kernel_rig", s.kernel_rig},
                                                      {"p_pass", s.p_pass},
                                                      {"pairs", s.pairs},
                                                      {"dwell_s", s.dwell_s},
                                                      {"move_s", s.move_s},
                                                      {"start_s", s.start_s}};
    for (const auto& [name, v] : figures) out += "," + finite_number_text(v, at + name);
    out += "," + std::to_string(s.night) + "\n";
  }
  sink(out);
}

std::string format_steps_csv(const Rig& rig, const std::vector<Step>& steps) {
  std::string out;
  write_steps_csv(rig, steps, [&](std::string_view piece) { out += piece; });
  return out;
}

std::string format_summary_json(const Campaign& campaign, const Plan& plan,
                                const std::string& set_id,
                                const std::map<std::string, std::string>& set_files) {
  const PlanSummary& s = plan.summary;
  QJsonArray warnings;
  for (const std::string& w : plan.warnings) warnings.append(QString::fromStdString(w));
  QJsonArray nights;
  for (const NightUse& n : s.night_use) {
    nights.append(QJsonObject{{"night", n.night},
                              {"busy_s", n.busy_s},
                              {"move_s", n.move_s},
                              {"integration_s", n.integration_s},
                              {"reference_s", n.reference_s},
                              {"window_s", n.window_s},
                              {"fill", n.fill()}});
  }
  const GramError& g = plan.gram_error;
  QJsonObject o{{"format", "gramline-summary"},
                {"version", 1},
                {"campaign", q(campaign.name)},
                {"train_points", campaign.data.train_count()},
                {"test_points", campaign.data.test_count()},
                {"photons", campaign.encoding.photon_count()},
                {"settings", static_cast<qint64>(s.settings)},
                {"steps", static_cast<qint64>(s.steps)},
                {"pairs_total", s.pairs_total},
                {"integration_s", s.integration_s},
                {"move_s", s.move_s},
                {"reference_s", s.reference_s},
                {"total_s", s.total_s},
                {"nights", s.nights},
                {"move_lower_bound_s", s.move_lower_bound_s},
                {"move_naive_s", s.move_naive_s},
                {"measure_move_s", s.measure_move_s},
                {"gram_sigma_frobenius", s.gram_sigma_frobenius},
                {"gram_sigma_max", g.sigma_max},
                {"gram_min_eigenvalue", g.min_eigenvalue},
                {"epsilon_reached", s.epsilon_reached},
                {"reference_steps", static_cast<qint64>(s.reference_steps)},
                {"reference_pairs", s.reference_pairs},
                {"reference_interval_min", s.reference_interval_min},
                {"calibration_share_target", s.calibration_share_target},
                {"calibration_share_max", s.calibration_share_max},
                {"truncation_cost_s", s.truncation_cost_s},
                {"kernel_rounding_max",
                 kernel_rounding_max(campaign.rig, campaign.encoding.photon_count(), plan.steps)},
                {"fits", s.fits},
                {"max_nights", campaign.nights.max_nights},
                {"night_use", nights},
                {"plan_ms", s.plan_ms},
                {"bound_ms", s.bound_ms},
                {"gram_error_ms", s.gram_error_ms},
                {"warnings", warnings}};
  // The simulated Gram-error figures exist only when the simulation ran (docs/plan-files.md).
  if (std::isfinite(g.spectral_estimate)) o["gram_spectral_estimate"] = g.spectral_estimate;
  if (std::isfinite(g.p_negative_eigenvalue)) o["p_negative_eigenvalue"] = g.p_negative_eigenvalue;
  // Plate imperfections (docs/plan-files.md).
  o["kernel_bias_max"] = s.kernel_bias_max;
  o["kernel_bias_frobenius"] = s.kernel_bias_frobenius;
  o["kernel_spread_max"] = s.kernel_spread_max;
  o["kernel_spread_frobenius"] = s.kernel_spread_frobenius;
  o["plate_bias_exceeds_target"] = s.plate_bias_exceeds_target();
  QJsonArray unreachable;
  for (const UnreachableSetting& u : s.unreachable)
    unreachable.append(QJsonObject{{"point", u.point},
                                   {"photon", u.photon},
                                   {"stage", q(to_string(u.stage))},
                                   {"kernel_error", u.kernel_error}});
  o["plates_unreachable"] = unreachable;
  if (!set_id.empty()) {
    QJsonObject files;
    for (const auto& [name, bytes] : set_files) files[q(name)] = q(sha256_hex(bytes));
    o[kSetIdKey] = q(set_id);
    o[kSetFilesKey] = files;
  }
  return json_text(o, "summary.json");
}

std::string format_kernel_csv(const Eigen::MatrixXd& kernel) {
  std::string out;
  for (long i = 0; i < kernel.rows(); ++i) {
    for (long j = 0; j < kernel.cols(); ++j) {
      if (j > 0) out += ",";
      out += finite_seventeen_digit_text(kernel(i, j), "kernel.csv: row " + std::to_string(i + 1) +
                                                           ", column " + std::to_string(j + 1));
    }
    out += "\n";
  }
  return out;
}

StepsFile parse_steps_json(const std::string& bytes, const std::string& file) {
  const JsonField root = parse_json_document(bytes, file);
  const std::string format = root["format"].text();
  if (format != kStepsFormat) {
    root["format"].fail("'" + format + "' is not a steps file (expected '" + kStepsFormat + "')");
  }
  const long long version = root["version"].integer(1, std::numeric_limits<int>::max());
  if (version > kStepsVersion) {
    root["version"].fail("the file has version " + std::to_string(version) +
                         ", newer than this program reads (" + std::to_string(kStepsVersion) + ")");
  }
  StepsFile out;
  out.conventions = root.has("conventions") ? root["conventions"].text() : std::string();
  out.set_id = root.has(kSetIdKey) ? root[kSetIdKey].text() : std::string();
  std::map<std::string, size_t> motor_of;
  for (const JsonField& m : root["motors"].items()) {
    Motor motor = motor_from_json(m);
    if (!motor_of.emplace(motor.name, out.rig.motors.size()).second) {
      m["name"].fail("motor name '" + motor.name + "' is used twice");
    }
    out.rig.motors.push_back(std::move(motor));
  }
  out.rig.controller = controller_from_json(root["controller"]);

  const int point_limit = std::numeric_limits<int>::max();
  const std::vector<JsonField> rows = root["steps"].items();
  out.steps.reserve(rows.size());
  for (size_t i = 0; i < rows.size(); ++i) {
    const JsonField& r = rows[i];
    if (r["index"].integer(0, point_limit) != static_cast<long long>(i)) {
      r["index"].fail("expected " + std::to_string(i) + " (the step's place in the list)");
    }
    Step s;
    s.kind =
        r["kind"].choice({StepKind::measure, StepKind::reference, StepKind::dark, StepKind::park});
    s.block = r["block"].choice({Block::train, Block::test, Block::none});
    s.prep_point = point_from(r["prep_point"], point_limit);
    s.analysis_point = point_from(r["analysis_point"], point_limit);
    const JsonField positions = r["position_deg"];
    if (!positions.value().isObject()) positions.fail("expected an object (motor name: degrees)");
    for (const QString& key : positions.value().toObject().keys()) {
      if (!motor_of.count(key.toStdString())) {
        positions.fail("'" + key.toStdString() + "' is not a motor listed in motors");
      }
    }
    s.position_deg.resize(out.rig.motors.size());
    for (size_t m = 0; m < out.rig.motors.size(); ++m) {
      s.position_deg[m] = positions[out.rig.motors[m].name.c_str()].number();
    }
    s.kernel_ideal = r["kernel_ideal"].number();
    // Optional (files written before plates were modelled): recomputed by plan_from_steps.
    if (r.has("kernel_rig")) s.kernel_rig = r["kernel_rig"].number();
    s.p_pass = r["p_pass"].number();
    s.pairs = r["pairs"].number();
    s.dwell_s = r["dwell_s"].number();
    s.move_s = r["move_s"].number();
    s.start_s = r["start_s"].number();
    s.night = static_cast<int>(r["night"].integer(1, point_limit));
    out.steps.push_back(std::move(s));
  }
  return out;
}

StepsFile read_steps_json(const QString& path) {
  return parse_steps_json(read_whole_file(path, limits::kStepsJsonBytes), path_text(path));
}

std::vector<std::string> plan_file_names() {
  return {"steps.json", "steps.csv", "kernel.csv", "summary.json"};
}

void write_plan_files(const Campaign& campaign, const Plan& plan, const QString& dir,
                      Overwrite overwrite) {
  // One id for the set, from its content; summary.json, the index, also fixes the other files'
  // SHA-256, so a folder holding files of two different saves is told apart (read_plan_folder).
  std::map<std::string, std::string> others;
  others["steps.csv"] = format_steps_csv(campaign.rig, plan.steps);
  others["kernel.csv"] = format_kernel_csv(plan.kernel_train);
  const std::string id = content_set_id(
      {format_steps_json(campaign.rig, plan.steps), others["steps.csv"], others["kernel.csv"]});
  others["steps.json"] = format_steps_json(campaign.rig, plan.steps, id);
  std::string summary = format_summary_json(campaign, plan, id, others);
  std::vector<SetFile> files;
  for (const std::string& name : plan_file_names()) {
    files.push_back({name, name == "summary.json" ? std::move(summary) : std::move(others[name])});
  }
  save_file_set(dir, files, overwrite);
}

StepsFile read_plan_folder(const QString& dir) {
  const std::string id = verify_file_set(dir, "summary.json");
  StepsFile steps = read_steps_json(QDir(dir).filePath("steps.json"));
  if (steps.set_id != id)
    throw InputError(path_text(QDir(dir).filePath("steps.json")) + ": belongs to the save " +
                     steps.set_id + ", summary.json to " + id + ": a mixed set; save it again");
  return steps;
}

}  // namespace gramline::formats
