// The full margin check of a planned campaign: the Monte Carlo at the plan's pairs, the
// smallest budget that passes (uniform and per allocation strategy) and the encoding scale scan.
#include <algorithm>
#include <chrono>
#include <cmath>
#include <functional>
#include <iomanip>
#include <sstream>
#include <stdexcept>

#include "gramline/field_check.h"
#include "gramline/kernel.h"
#include "gramline/margin.h"

namespace gramline {

void BudgetSearchOptions::validate() const {
  FieldCheck("BudgetSearchOptions")
      .positive("low_pairs", low_pairs)
      .positive("high_pairs", high_pairs)
      .require(high_pairs > low_pairs, "high_pairs", "must exceed low_pairs")
      .positive("relative_step", relative_step)
      .throw_if_failed();
}

void MarginCheckOptions::validate() const {
  FieldCheck check("MarginCheckOptions");
  check.at_least("trials", trials, 0)
      .at_least("threads", threads, 0)
      .inside("confidence", confidence, 0.0, 1.0)
      .at_least("search_trials", search_trials, 0);
  for (double f : scale_factors) check.positive("scale_factors", f);
  check.throw_if_failed();
  budget_search.validate();
}

namespace {

// Bisection in log(scale) for the smallest scale in [low, high] whose trials pass, stopping
// when the bracket is narrower than 1 + relative_step. `passes` evaluates one scale with the
// same trial seeds every time (common random numbers), which keeps the pass/fail boundary from
// jittering between evaluations.
BudgetSearch search_scale(const std::function<bool(double)>& passes, double start, double low,
                          double high, double relative_step) {
  BudgetSearch r;
  double lo = 0.0, hi = 0.0;
  double s = std::clamp(start, low, high);
  if (passes(s)) {
    hi = s;
    while (hi > low) {
      const double trial = std::max(low, hi / 4.0);
      if (!passes(trial)) {
        lo = trial;
        break;
      }
      hi = trial;
    }
    if (lo == 0.0) {
      r.found = true;
      r.pairs_per_entry = hi;
      return r;
    }
  } else {
    lo = s;
    while (lo < high) {
      const double trial = std::min(high, lo * 4.0);
      if (passes(trial)) {
        hi = trial;
        break;
      }
      lo = trial;
    }
    if (hi == 0.0) return r;
  }
  while (hi / lo > 1.0 + relative_step) {
    const double mid = std::sqrt(lo * hi);
    (passes(mid) ? hi : lo) = mid;
  }
  r.found = true;
  r.pairs_per_entry = hi;
  r.failing_below = lo;
  return r;
}

// Kernel-target alignment and held-out accuracy of the ideal training Gram matrix with every
// weight of the encoding multiplied by each factor; the advised factor has the best held-out
// accuracy, alignment breaking ties.
void scan_encoding_scale(const Campaign& campaign, const std::vector<double>& factors,
                         const std::vector<int>& folds, const SvmOptions& svm,
                         const WorkHooks& hooks, MarginCheck& check) {
  const DataSet& data = campaign.data;
  double best = -1.0;
  for (double factor : factors) {
    hooks.throw_if_cancelled();
    ScalePoint point;
    point.factor = factor;
    const Eigen::MatrixXd gram = ideal_gram(campaign.encoding.scaled(factor), data.train);
    point.alignment = kernel_target_alignment(gram, data.train_labels);
    point.cv_accuracy = cross_validated_accuracy(gram, data.train_labels, folds, svm);
    check.scale_scan.push_back(point);
    const double score = point.cv_accuracy + 1e-6 * point.alignment;
    if (score > best) {
      best = score;
      check.advised_scale = factor;
    }
  }
}

double time_now_ms() {
  return std::chrono::duration<double, std::milli>(
             std::chrono::steady_clock::now().time_since_epoch())
      .count();
}

// Maps progress of a sub-task onto [from, to] of the whole.
WorkHooks sub_hooks(const WorkHooks& hooks, double from, double to) {
  WorkHooks sub;
  sub.cancel = hooks.cancel;
  if (hooks.progress)
    sub.progress = [progress = hooks.progress, from, to](double f) {
      progress(from + (to - from) * f);
    };
  return sub;
}

}  // namespace

MarginCheck check_margin(const Campaign& campaign, const Plan& plan,
                         const MarginCheckOptions& options) {
  const double t0 = time_now_ms();
  options.validate();
  const DataSet& data = campaign.data;
  if (data.train_count() < 2) throw std::invalid_argument("margin check: too few training points");
  const CheckSettings& settings = campaign.check;
  MarginCheck check;
  MarginProblem problem = make_margin_problem(campaign, plan);
  const std::uint64_t seed = options.seed != 0 ? options.seed : campaign.seed;

  const CChoice choice = fixed_or_cross_validated_C(problem.kernel_train, problem.train_labels,
                                                    settings.C, settings.cv_folds, seed);
  check.C = choice.C;
  check.C_from_cross_validation = choice.from_cross_validation;
  check.cross_validation = choice.cross_validation;
  SvmOptions svm;
  svm.C = check.C;
  check.ideal = train_svm(problem.kernel_train, problem.train_labels, svm);
  check.decision_test = check.ideal.decision(problem.kernel_test);

  TrialOptions trial;
  trial.trials = options.trials > 0 ? options.trials : settings.trials;
  trial.seed = seed;
  trial.threads = options.threads;
  trial.keep_unit_diagonal = settings.keep_unit_diagonal;
  trial.confidence = options.confidence;
  trial.svm = svm;
  const bool extras = options.minimum_budget || options.compare_allocations;
  trial.hooks = sub_hooks(options.hooks, 0.0, extras ? 0.4 : 0.95);
  check.trials = run_margin_trials(problem, check.ideal, trial);
  check.verdict = judge(check.trials, settings, data.train_count());

  const int n = problem.train_count(), m = problem.test_count();
  const double entries = n * (n - 1) / 2.0 + static_cast<double>(m) * n;
  check.pair_detect_rate_per_s = pair_detect_rate_per_s(campaign.rig, problem.photons);
  const double r = check.pair_detect_rate_per_s;
  const double plan_total = total_pairs(problem);
  check.plan_integration_s = plan_total / r;
  check.plan_overhead_s = plan.summary.move_s + plan.summary.reference_s;

  TrialOptions search = trial;
  search.trials =
      options.search_trials > 0 ? std::min(options.search_trials, trial.trials) : trial.trials;
  check.search_trials = search.trials;
  search.hooks = WorkHooks{};
  search.hooks.cancel = options.hooks.cancel;
  const BudgetSearchOptions& limits = options.budget_search;
  int evaluations = 0;
  auto evaluate = [&](const MarginProblem& p) {
    ++evaluations;
    const TrialSummary s = run_margin_trials(p, check.ideal, search);
    return judge(s, settings, n).pass;
  };

  if (options.minimum_budget && entries > 0) {
    MarginProblem p = problem;
    auto passes = [&](double pairs) {
      for (int i = 0; i < n; ++i)
        for (int j = 0; j < n; ++j) p.pairs_train(i, j) = i == j ? 0.0 : pairs;
      p.pairs_test.setConstant(pairs);
      return evaluate(p);
    };
    evaluations = 0;
    check.minimum_uniform = search_scale(passes, plan_total / entries, limits.low_pairs,
                                         limits.high_pairs, limits.relative_step);
    check.minimum_uniform.evaluations = evaluations;
    if (check.minimum_uniform.found) {
      check.minimum_uniform.total_pairs = check.minimum_uniform.pairs_per_entry * entries;
      check.minimum_uniform.integration_s = check.minimum_uniform.total_pairs / r;
    }
    options.hooks.report(0.65);
  }

  if (options.compare_allocations && entries > 0 && plan_total > 0) {
    for (Allocation a : {Allocation::uniform, Allocation::neyman, Allocation::margin_aware}) {
      AllocationOutcome outcome;
      outcome.strategy = a;
      MarginProblem p = problem;
      allocate_pairs(p, a, check.ideal, plan_total);
      const TrialSummary at_plan = run_margin_trials(p, check.ideal, search);
      outcome.flip_probability_max = at_plan.flip_probability_max.value;
      outcome.margin_ratio_median = at_plan.margin_ratio_median.value;
      outcome.pass_at_plan_time = judge(at_plan, settings, n).pass;
      const MarginProblem base = p;
      auto passes = [&](double factor) {
        p.pairs_train = base.pairs_train * factor;
        p.pairs_test = base.pairs_test * factor;
        return evaluate(p);
      };
      evaluations = 0;
      // Factors of the plan's total; the limits mirror the uniform search's pairs per entry.
      const double per_entry = plan_total / entries;
      BudgetSearch s = search_scale(passes, 1.0, limits.low_pairs / per_entry,
                                    limits.high_pairs / per_entry, limits.relative_step);
      s.evaluations = evaluations + 1;
      if (s.found) {
        const double factor = s.pairs_per_entry;
        s.total_pairs = plan_total * factor;
        s.pairs_per_entry = s.total_pairs / entries;
        s.failing_below *= plan_total / entries;
        s.integration_s = s.total_pairs / r;
      }
      outcome.time_for_pass = s;
      check.allocations.push_back(outcome);
    }
    options.hooks.report(0.9);
  }

  if (options.scan_scale) {
    const int folds = cross_validation_folds(settings.cv_folds, n);
    scan_encoding_scale(campaign, options.scale_factors,
                        stratified_folds(data.train_labels, folds, seed), svm, options.hooks,
                        check);
  }

  check.options = options;
  check.options.hooks = WorkHooks{};
  check.options.trials = trial.trials;
  check.options.seed = seed;
  check.options.search_trials = search.trials;
  options.hooks.report(1.0);
  check.check_ms = time_now_ms() - t0;
  return check;
}

std::string MarginCheck::report() const {
  std::ostringstream out;
  out << "Margin check: " << (verdict.pass ? "PASS" : "FAIL") << "\n";
  if (C_from_cross_validation) out << cross_validation.report();
  out << ideal.report();
  out << trials.report();
  for (const std::string& reason : verdict.reasons) out << "  fails: " << reason << "\n";
  out << std::setprecision(4);
  out << "Planned integration " << plan_integration_s / 3600.0 << " h (plus "
      << plan_overhead_s / 3600.0 << " h of moves and reference steps)\n";
  if (minimum_uniform.evaluations > 0 || !allocations.empty()) {
    out << "Budget search and allocations use " << search_trials << " trials per evaluation\n";
    const BudgetSearchOptions& b = options.budget_search;
    out << "  searched from " << b.low_pairs << " to " << b.high_pairs
        << " pairs per entry, to within " << 100 * b.relative_step << "%\n";
  }
  if (minimum_uniform.evaluations > 0) {
    if (minimum_uniform.found)
      out << "Smallest uniform budget that passes: " << minimum_uniform.pairs_per_entry
          << " pairs per entry, " << minimum_uniform.integration_s / 3600.0 << " h of integration ("
          << minimum_uniform.evaluations << " evaluations)\n";
    else
      out << "No uniform budget up to the search limit passes\n";
  }
  for (const AllocationOutcome& a : allocations) {
    out << "  " << to_string(a.strategy) << ": at the planned time "
        << (a.pass_at_plan_time ? "passes" : "fails") << " (largest flip "
        << 100 * a.flip_probability_max << "%, median margin ratio " << a.margin_ratio_median
        << "); ";
    if (a.time_for_pass.found)
      out << "passes from " << a.time_for_pass.integration_s / 3600.0 << " h of integration\n";
    else
      out << "no pass within the search limit\n";
  }
  if (!scale_scan.empty()) {
    out << "Encoding scale (alignment, held-out accuracy):";
    for (const ScalePoint& p : scale_scan)
      out << " x" << p.factor << " (" << p.alignment << ", " << p.cv_accuracy << ")";
    out << "\n  advised scale x" << advised_scale << "\n";
  }
  return out.str();
}

}  // namespace gramline
