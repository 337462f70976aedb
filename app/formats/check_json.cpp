#include "formats/check_json.h"

#include <QJsonArray>
#include <QJsonDocument>
#include <cmath>

#include "formats/text_io.h"

namespace gramline::formats {

namespace {

// JSON has no infinities or NaN: such figures become null.
QJsonValue number(double value) {
  return std::isfinite(value) ? QJsonValue(value) : QJsonValue(QJsonValue::Null);
}

QJsonArray numbers(const Eigen::VectorXd& values) {
  QJsonArray out;
  for (double v : values) out.append(number(v));
  return out;
}

QJsonArray interval(const Estimate& e) { return {number(e.low), number(e.high)}; }

QJsonObject budget_json(const BudgetSearch& s) {
  QJsonObject o;
  o["found"] = s.found;
  o["pairs_per_entry"] = s.found ? number(s.pairs_per_entry) : QJsonValue();
  o["pairs_total"] = s.found ? number(s.total_pairs) : QJsonValue();
  o["integration_s"] = s.found ? number(s.integration_s) : QJsonValue();
  o["failing_below"] = s.found ? number(s.failing_below) : QJsonValue();
  o["evaluations"] = s.evaluations;
  return o;
}

}  // namespace

QJsonObject check_json(const Campaign& campaign, const MarginCheck& check, std::uint64_t seed,
                       double confidence) {
  const TrialSummary& t = check.trials;
  const int n = campaign.data.train_count();
  QJsonObject o;
  // The verdict and the figures it rests on.
  o["verdict"] = check.verdict.pass ? "pass" : "fail";
  o["C"] = check.C;
  o["dual_coef"] = numbers(check.ideal.dual_coef);
  o["bias"] = check.ideal.bias;
  o["decision_train"] = numbers(check.ideal.decision_train);
  o["decision_test"] = numbers(check.decision_test);
  QJsonArray flips, flip_intervals, flip_counts;
  for (const TestPointOutcome& p : t.points) {
    flips.append(p.flip_probability.value);
    flip_intervals.append(interval(p.flip_probability));
    flip_counts.append(p.flips);
  }
  o["flip_probability"] = flips;
  o["flip_probability_max"] = t.flip_probability_max.value;
  o["accuracy_median"] = number(t.accuracy_median.value);
  o["margin_ratio_median"] = number(t.margin_ratio_median.value);
  o["trials"] = t.trials;

  // Extras: every Monte Carlo figure with its interval.
  o["seed"] = QString::number(seed);
  o["confidence"] = confidence;
  o["C_source"] = check.C_from_cross_validation ? "cross_validation" : "campaign";
  if (check.C_from_cross_validation) {
    QJsonObject cv;
    cv["folds"] = check.cross_validation.folds;
    QJsonArray cs, acc;
    for (double c : check.cross_validation.C_values) cs.append(c);
    for (double a : check.cross_validation.accuracy) acc.append(a);
    cv["C_values"] = cs;
    cv["accuracy"] = acc;
    o["cross_validation"] = cv;
  }
  QJsonArray support;
  for (int i : check.ideal.support) support.append(i);
  o["support_vectors"] = support;
  o["geometric_margin"] = number(check.ideal.geometric_margin());
  o["flip_counts"] = flip_counts;
  o["flip_probability_interval"] = flip_intervals;
  o["flip_probability_max_interval"] = interval(t.flip_probability_max);
  o["accuracy_median_interval"] = interval(t.accuracy_median);
  o["accuracy_mean"] = number(t.accuracy_mean.value);
  o["accuracy_mean_interval"] = interval(t.accuracy_mean);
  o["margin_ratio_median_interval"] = interval(t.margin_ratio_median);
  o["margin_ratio_mean"] = number(t.margin_ratio_mean.value);
  o["margin_ratio_mean_interval"] = interval(t.margin_ratio_mean);
  o["support_jaccard_median"] = number(t.support_jaccard_median.value);
  o["support_jaccard_median_interval"] = interval(t.support_jaccard_median);
  o["support_jaccard_mean"] = number(t.support_jaccard_mean.value);
  o["support_jaccard_mean_interval"] = interval(t.support_jaccard_mean);
  o["psd_repair_fraction"] = t.psd_repair_fraction.value;
  o["psd_repair_fraction_interval"] = interval(t.psd_repair_fraction);
  o["flip_threshold"] = campaign.check.flip_threshold;
  o["margin_ratio_threshold"] = campaign.check.margin_ratio_threshold;

  QJsonArray failing;
  for (const TestPointOutcome& p : t.points) {
    if (p.flip_probability.value <= campaign.check.flip_threshold) continue;
    QJsonObject f;
    f["test_point"] = p.test_index;
    f["point"] = n + p.test_index;
    f["flip_probability"] = p.flip_probability.value;
    f["decision_ideal"] = p.decision_ideal;
    f["decision_sd"] = p.decision_sd;
    failing.append(f);
  }
  o["failing_points"] = failing;
  QJsonArray reasons;
  for (const std::string& r : check.verdict.reasons) reasons.append(QString::fromStdString(r));
  o["reasons"] = reasons;

  o["pair_detect_rate_per_s"] = check.pair_detect_rate_per_s;
  o["plan_integration_s"] = check.plan_integration_s;
  o["plan_overhead_s"] = check.plan_overhead_s;
  o["search_trials"] = check.search_trials;
  o["minimum_uniform_budget"] = budget_json(check.minimum_uniform);
  QJsonArray allocations;
  for (const AllocationOutcome& a : check.allocations) {
    QJsonObject ao;
    ao["strategy"] = QString::fromStdString(to_string(a.strategy));
    ao["pass_at_plan_time"] = a.pass_at_plan_time;
    ao["flip_probability_max"] = a.flip_probability_max;
    ao["margin_ratio_median"] = number(a.margin_ratio_median);
    ao["time_for_pass"] = budget_json(a.time_for_pass);
    allocations.append(ao);
  }
  o["allocations"] = allocations;
  QJsonArray scan;
  for (const ScalePoint& p : check.scale_scan) {
    QJsonObject so;
    so["factor"] = p.factor;
    so["alignment"] = number(p.alignment);
    so["cv_accuracy"] = p.cv_accuracy;
    scan.append(so);
  }
  QJsonObject scale;
  scale["scan"] = scan;
  scale["advised_factor"] = check.advised_scale;
  o["encoding_scale"] = scale;
  o["check_ms"] = check.check_ms;
  return o;
}

std::string format_check_json(const Campaign& campaign, const MarginCheck& check,
                              std::uint64_t seed, double confidence) {
  const QJsonObject o = check_json(campaign, check, seed, confidence);
  // Figures that may be infinite are already null above; anything else non-finite is refused.
  require_finite_json(o, "check JSON");
  return QJsonDocument(o).toJson(QJsonDocument::Indented).toStdString();
}

void write_check_json(const Campaign& campaign, const MarginCheck& check, std::uint64_t seed,
                      double confidence, const QString& path) {
  write_whole_file(path, format_check_json(campaign, check, seed, confidence));
}

}  // namespace gramline::formats
