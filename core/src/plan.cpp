#include "gramline/plan.h"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <iomanip>
#include <sstream>
#include <stdexcept>

#include "gramline/allocation.h"
#include "gramline/budget.h"
#include "gramline/detection.h"
#include "gramline/entries.h"
#include "gramline/enum_names.h"
#include "gramline/field_check.h"
#include "gramline/kernel.h"
#include "gramline/motion.h"
#include "gramline/parallel.h"
#include "gramline/plates.h"
#include "gramline/schedule.h"
#include "gramline/svm.h"
#include "gramline/waveplates.h"

namespace gramline {

namespace {

// Waveplate settings of every point (training first, then test), each checked by the Jones
// product before it is used. With retardance errors and compensation on, the angles are solved
// for the actual plates (plates.h); stages they cannot realise are listed in `unreachable`.
std::vector<PointTargets> synthesize_points(const Campaign& c,
                                            std::vector<UnreachableSetting>& unreachable) {
  const int total = c.data.train_count() + c.data.test_count();
  const int photons = c.encoding.photon_count();
  const bool compensate = c.rig.compensate_plates && has_retardance_errors(c.rig);
  std::vector<PointTargets> out(total);
  for (int i = 0; i < total; ++i) {
    const Eigen::VectorXd x = c.data.point(i);
    for (int p = 0; p < photons; ++p) {
      const BlochAngles a = c.encoding.angles(p, x);
      if (compensate) {
        for (Stage stage : {Stage::prep, Stage::analysis}) {
          const CompensatedStage cs = compensated_stage(
              c.rig.motors[c.rig.motor_index(p, stage, Plate::HWP)],
              c.rig.motors[c.rig.motor_index(p, stage, Plate::QWP)], stage, a.theta_deg, a.phi_deg);
          (stage == Stage::prep ? out[i].prep : out[i].analysis).push_back(cs.solutions);
          // Reachable: every kernel built from these stages within 1e-10 of the ideal one.
          if (!(cs.kernel_error <= 1e-10 / (2.0 * photons)))
            unreachable.push_back({i, p, stage, cs.kernel_error});
        }
        continue;
      }
      out[i].prep.push_back(preparation_solutions(a.theta_deg, a.phi_deg));
      out[i].analysis.push_back(analysis_solutions(a.theta_deg, a.phi_deg));
      // Every synthesized setting is checked by the Jones product before it is used: any
      // kernel built from these positions stays within 1e-12 of the ideal one (ideal plates).
      const double error = synthesis_kernel_error(a.theta_deg, a.phi_deg);
      if (!(error <= 1e-12 / (2.0 * photons))) {
        std::ostringstream e;
        e << "waveplate synthesis failed for point " << i << ", photon " << p << " (kernel error "
          << error << ")";
        throw std::runtime_error(e.str());
      }
    }
  }
  return out;
}

// Fills the entry -> step maps and the summary totals that follow from the steps alone.
void index_steps(int n, int m, Plan& plan) {
  plan.step_of_train = Eigen::MatrixXi::Constant(n, n, -1);
  plan.step_of_test = Eigen::MatrixXi::Constant(m, n, -1);
  PlanSummary& s = plan.summary;
  for (size_t k = 0; k < plan.steps.size(); ++k) {
    const Step& st = plan.steps[k];
    s.move_s += st.move_s;
    s.pairs_total += st.pairs;
    s.total_s = std::max(s.total_s, st.start_s + st.move_s + st.dwell_s);
    if (st.kind != StepKind::measure) {
      s.reference_s += st.dwell_s;  // its move is in move_s
      continue;
    }
    ++s.settings;
    s.integration_s += st.dwell_s;
    s.measure_move_s += st.move_s;
    const int a = std::min(st.prep_point, st.analysis_point);
    const int b = std::max(st.prep_point, st.analysis_point);
    if (st.block == Block::train) {
      plan.step_of_train(a, b) = plan.step_of_train(b, a) = static_cast<int>(k);
    } else {
      // The test point has the larger global index.
      plan.step_of_test(b - n, a) = static_cast<int>(k);
    }
  }
  s.steps = static_cast<long>(plan.steps.size());
}

// Middle of a step's counting interval: where ingest places its calibration in time.
double counting_middle_s(const Step& s) { return s.start_s + s.move_s + 0.5 * s.dwell_s; }

// Per-entry pairs and sigma from the plan's steps: the counts' variance at the step's pairs plus
// the variance of the calibration interpolated from the reference steps around it
// (docs/error-budget.md), the calibration's shared components of the training block, and the
// summary's reference figures. Returns the largest half-width of an entry under `budget` at its
// own predicted p, widened by the calibration term in quadrature.
double fill_entry_statistics(const Campaign& c, const EntryStatistics& stats, Plan& plan,
                             const BudgetOptions& budget) {
  const int n = c.data.train_count();
  const int m = c.data.test_count();
  plan.pairs_train = Eigen::MatrixXd::Zero(n, n);
  plan.pairs_test = Eigen::MatrixXd::Zero(m, n);
  plan.sigma_train = Eigen::MatrixXd::Zero(n, n);
  plan.sigma_test = Eigen::MatrixXd::Zero(m, n);
  plan.calibration_sigma_train = Eigen::MatrixXd::Zero(n, n);
  plan.calibration_sigma_test = Eigen::MatrixXd::Zero(m, n);
  plan.shared_noise_train.clear();
  PlanSummary& sum = plan.summary;
  sum.reference_steps = 0;
  sum.reference_pairs = 0.0;
  sum.calibration_share_max = 0.0;

  // The reference steps that calibrate: ingest skips none that counted.
  std::vector<double> ref_times;
  std::vector<CalibrationCovariance> ref_cov;
  std::vector<int> ref_step;
  for (size_t k = 0; k < plan.steps.size(); ++k) {
    const Step& st = plan.steps[k];
    if (st.kind != StepKind::reference || !(st.pairs > 0)) continue;
    ref_times.push_back(counting_middle_s(st));
    ref_cov.push_back(stats.reference_covariance(st.pairs));
    ref_step.push_back(static_cast<int>(k));
    sum.reference_pairs = std::max(sum.reference_pairs, st.pairs);
  }
  sum.reference_steps = static_cast<long>(ref_times.size());
  // Ingest sorts the references by time; so does this list, whatever the step order.
  {
    std::vector<size_t> idx(ref_times.size());
    for (size_t k = 0; k < idx.size(); ++k) idx[k] = k;
    std::stable_sort(idx.begin(), idx.end(),
                     [&](size_t a, size_t b) { return ref_times[a] < ref_times[b]; });
    std::vector<double> t2;
    std::vector<CalibrationCovariance> c2;
    std::vector<int> s2;
    for (size_t k : idx) {
      t2.push_back(ref_times[k]);
      c2.push_back(ref_cov[k]);
      s2.push_back(ref_step[k]);
    }
    ref_times.swap(t2);
    ref_cov.swap(c2);
    ref_step.swap(s2);
  }
  // Two shared components per reference (its rate and, for both ports, its visibility): the
  // Cholesky factor of its 2 x 2 covariance, times each entry's gradient and weight.
  std::vector<SharedNoiseComponent> rate_part(ref_times.size()), vis_part(ref_times.size());
  for (size_t k = 0; k < ref_times.size(); ++k) {
    rate_part[k].label = "reference step " + std::to_string(ref_step[k]) + " (pair rate)";
    vis_part[k].label = "reference step " + std::to_string(ref_step[k]) + " (visibility)";
  }

  BudgetOptions at_own_p = budget;  // the true half-width: each entry at its own p
  at_own_p.worst_case = false;
  double worst_half_width = 0.0;
  for (const Step& st : plan.steps) {
    if (st.kind != StepKind::measure) continue;
    const int a = std::min(st.prep_point, st.analysis_point);
    const int b = std::max(st.prep_point, st.analysis_point);
    const EntryNoise noise = stats.noise(a, b);
    const CalibrationWeights w = calibration_weights(ref_times, counting_middle_s(st));
    const CalibrationCovariance cov = interpolated_covariance(w, ref_cov);
    const double own = stats.sigma(noise, st.pairs);
    const double cal_var = stats.calibration_variance(noise, cov);
    const double sigma = std::sqrt(own * own + cal_var);
    const double cal_sigma = std::sqrt(cal_var);
    if (sigma > 0 && std::isfinite(sigma))
      sum.calibration_share_max = std::max(sum.calibration_share_max, cal_var / (sigma * sigma));
    const double half = precision_for_pairs(stats.model(noise), st.pairs, at_own_p);
    worst_half_width = std::max(worst_half_width, own > 0 ? half * sigma / own : half);
    if (st.block == Block::train) {
      plan.pairs_train(a, b) = plan.pairs_train(b, a) = st.pairs;
      plan.sigma_train(a, b) = plan.sigma_train(b, a) = sigma;
      plan.calibration_sigma_train(a, b) = plan.calibration_sigma_train(b, a) = cal_sigma;
      const CalibrationGradient g = stats.calibration_gradient(noise);
      for (const auto& [ref, weight] : {std::pair{w.low, w.w_low}, std::pair{w.high, w.w_high}}) {
        if (ref < 0 || weight == 0.0) continue;
        const CalibrationCovariance& cr = ref_cov[ref];
        const double l00 = std::sqrt(cr.rate_var);
        const double l10 = l00 > 0 ? cr.rate_visibility_cov / l00 : 0.0;
        const double l11 = std::sqrt(std::max(0.0, cr.visibility_var - l10 * l10));
        const double rate_loading = weight * (g.d_rate * l00 + g.d_visibility * l10);
        const double vis_loading = weight * g.d_visibility * l11;
        if (rate_loading != 0.0) rate_part[ref].loadings.push_back({a, b, rate_loading});
        if (vis_loading != 0.0) vis_part[ref].loadings.push_back({a, b, vis_loading});
      }
    } else {
      plan.pairs_test(b - n, a) = st.pairs;
      plan.sigma_test(b - n, a) = sigma;
      plan.calibration_sigma_test(b - n, a) = cal_sigma;
    }
  }
  for (auto* parts : {&rate_part, &vis_part})
    for (SharedNoiseComponent& comp : *parts)
      if (!comp.loadings.empty()) plan.shared_noise_train.push_back(std::move(comp));
  return worst_half_width;
}

// Refuses an entry whose counting alone outlasts the nightly window, naming what makes it long
// and what shortens it: accidentals from a wide coincidence window, a rig that detects few
// pairs, or a precision goal that asks for very many pairs. (With fit_to_nights the scheduler
// shrinks the pairs instead.)
void check_entry_durations(const Campaign& c, const EntryStatistics& stats,
                           const std::vector<EntryRequest>& entries,
                           const std::vector<EntryNoise>& noise, double rate_per_s) {
  if (c.schedule.fit_to_nights || !(rate_per_s > 0)) return;
  const double window_s = c.nights.length_s();
  size_t longest = 0;
  for (size_t k = 1; k < entries.size(); ++k)
    if (entries[k].dwell_s > entries[longest].dwell_s) longest = k;
  if (entries.empty() || entries[longest].dwell_s <= window_s) return;
  const EntryRequest& e = entries[longest];
  const EntryModel model = stats.model(noise[longest]);
  std::ostringstream o;
  o << "kernel entry " << e.a << "/" << e.b << " needs " << e.pairs << " detected pairs, "
    << e.dwell_s << " s of counting at " << rate_per_s
    << " detected pairs/s: longer than the nightly window (" << window_s << " s). ";
  const double accidentals = std::max(model.accidental_ratio, model.accidental_total_ratio);
  std::string field;
  if (accidentals > 0.5) {
    field = "rig.coincidence_window_s";
    o << "Cause: the coincidence window of " << c.rig.coincidence_window_s
      << " s lets accidental coincidences outnumber real pairs " << accidentals
      << " to 1. Fix: a window of a few nanoseconds, or detectors with fewer dark counts.";
  } else if (c.precision.fixed_pairs > 0) {
    field = "precision.fixed_pairs";
    o << "Cause: precision.fixed_pairs. Fix: fewer pairs per entry.";
  } else if (rate_per_s < 100.0) {
    field = "rig.source.pair_rate_per_s";
    o << "Cause: the rig detects only " << rate_per_s
      << " pairs/s (the source's pair rate times the detectors' efficiencies). Fix: a brighter "
         "source or better coupling, a larger precision.epsilon, or schedule.fit_to_nights.";
  } else {
    field = "precision.epsilon";
    o << "Cause: precision.epsilon = " << c.precision.budget.epsilon
      << " (the pairs grow as 1 / epsilon^2). Fix: a larger precision.epsilon, or "
         "schedule.fit_to_nights to spend the nights allowed.";
  }
  (void)stats;
  throw std::invalid_argument(field + ": " + o.str());
}

// Shares the pairs among the entries by the campaign's allocation strategy. The precision
// target fixes the per-entry need; `uniform` gives every entry the largest need (so every entry
// meets the target), and the other strategies spend that same total time differently
// (allocation.h).
void allocate(const Campaign& c, const Plan& plan, const EntryStatistics& stats,
              std::vector<EntryRequest>& entries, const std::vector<EntryNoise>& noise,
              double pair_rate_per_s) {
  if (entries.empty() || c.precision.fixed_pairs > 0) return;
  double most = 0.0;
  for (const EntryRequest& r : entries) most = std::max(most, r.pairs);
  const double total = most * static_cast<double>(entries.size());
  if (c.precision.allocation == Allocation::uniform) {
    for (EntryRequest& r : entries) r.pairs = most;
  } else {
    const int n = c.data.train_count();
    AllocationInput in;
    in.scheme = stats.scheme();
    in.photons = stats.photons();
    in.train_count = n;
    in.test_count = c.data.test_count();
    in.entries.reserve(entries.size());
    for (size_t k = 0; k < entries.size(); ++k) {
      const EntryRequest& r = entries[k];
      const bool train = r.block == Block::train;
      in.entries.push_back({r.block, train ? r.a : r.a - n, r.b, noise[k]});
    }
    if (c.precision.allocation == Allocation::margin_aware) {
      SvmOptions so;
      so.C = fixed_or_cross_validated_C(plan.kernel_train, c.data.train_labels, c.check.C,
                                        c.check.cv_folds, c.seed)
                 .C;
      const SvmModel ideal = train_svm(plan.kernel_train, c.data.train_labels, so);
      in.dual_coef = ideal.dual_coef;
      in.decision_test = ideal.decision(plan.kernel_test);
    }
    const std::vector<double> pairs = allocate_pairs(in, c.precision.allocation, total);
    for (size_t k = 0; k < entries.size(); ++k)
      entries[k].pairs = std::max(1.0, std::round(pairs[k]));
  }
  for (EntryRequest& r : entries) r.dwell_s = r.pairs / pair_rate_per_s;
}

}  // namespace

void PlanOptions::validate(const Campaign& campaign) const {
  FieldCheck check("PlanOptions");
  if (resume) {
    const int points = campaign.data.train_count() + campaign.data.test_count();
    for (const auto& [a, b] : resume->measured)
      check.require(a >= 0 && b >= 0 && a < points && b < points, "resume.measured",
                    "an entry refers to a point that does not exist");
    const std::size_t positions = resume->start_positions_deg.size();
    check.require(positions == 0 || positions == campaign.rig.motors.size(),
                  "resume.start_positions_deg", "one start position per motor is needed");
  }
  check.throw_if_failed();
}

Plan plan_campaign(const Campaign& campaign, const PlanOptions& options) {
  const auto t0 = std::chrono::steady_clock::now();
  if (auto e = campaign.check_consistency(); !e.empty()) throw std::invalid_argument(e);
  options.validate(campaign);
  // Pass-port counts are normalised by the pair rate of the reference steps: without them the
  // entries would rest on the rig model's rate alone.
  if (campaign.rig.scheme == DetectionScheme::pass_only &&
      !(campaign.schedule.reference_interval_min > 0))
    throw std::invalid_argument(
        "schedule.reference_interval_min: 0 (never) leaves pass-only detection nothing to "
        "normalise the counts by; set an interval (20 min is usual) or detect both ports");
  const Campaign& c = campaign;
  const int n = c.data.train_count();
  const int m = c.data.test_count();
  const int photons = c.encoding.photon_count();

  Plan plan;
  plan.warnings = c.warnings();
  const std::vector<PointTargets> targets = synthesize_points(c, plan.summary.unreachable);
  const EntryStatistics stats(c);
  plan.kernel_train = ideal_gram(c.encoding, c.data.train);
  plan.kernel_test =
      m > 0 ? ideal_cross(c.encoding, c.data.test, c.data.train) : Eigen::MatrixXd(0, n);
  options.hooks.throw_if_cancelled();

  // Entries: every unordered training pair, then every (test, training) pair (docs/plan-files.md).
  ScheduleInput in;
  in.rig = &c.rig;
  in.train_count = n;
  in.nights = c.nights;
  in.settings = c.schedule;
  in.pair_detect_rate_per_s = pair_detect_rate_per_s(c.rig, photons);
  in.points = targets;
  in.entries.reserve(static_cast<size_t>(n) * (n - 1) / 2 + static_cast<size_t>(m) * n);
  std::vector<EntryNoise> noise;
  noise.reserve(in.entries.capacity());
  // When the planner chooses the reference pairs, the calibration may take up to
  // schedule.calibration_share of each entry's variance: the counts get the rest
  // (docs/error-budget.md).
  const bool references = c.schedule.reference_interval_min > 0;
  const bool choose_references = references && !(c.schedule.reference_pairs > 0);
  const double share = c.schedule.calibration_share;
  BudgetOptions entry_budget = c.precision.budget;
  if (choose_references) entry_budget.epsilon *= std::sqrt(1.0 - share);
  auto add_entry = [&](int a, int b, Block block, double kappa) {
    const EntryNoise e = stats.noise(a, b);
    EntryRequest r;
    r.a = a;
    r.b = b;
    r.block = block;
    r.kernel_ideal = kappa;
    r.p_pass = e.p_pass;
    r.pairs = c.precision.fixed_pairs > 0 ? c.precision.fixed_pairs
                                          : pairs_for_precision(stats.model(e), entry_budget);
    r.dwell_s = r.pairs / in.pair_detect_rate_per_s;
    in.entries.push_back(r);
    noise.push_back(e);
  };
  // Entries already measured (resume) are left out; the matrix marks them by index.
  Eigen::Matrix<bool, Eigen::Dynamic, Eigen::Dynamic> done =
      Eigen::Matrix<bool, Eigen::Dynamic, Eigen::Dynamic>::Constant(n + m, n + m, false);
  if (options.resume) {
    for (const auto& [a, b] : options.resume->measured) done(a, b) = done(b, a) = true;
    in.start_positions_deg = options.resume->start_positions_deg;
  }
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j)
      if (!done(i, j)) add_entry(i, j, Block::train, plan.kernel_train(i, j));
  for (int t = 0; t < m; ++t)
    for (int j = 0; j < n; ++j)
      if (!done(n + t, j)) add_entry(n + t, j, Block::test, plan.kernel_test(t, j));
  options.hooks.throw_if_cancelled();
  allocate(c, plan, stats, in.entries, noise, in.pair_detect_rate_per_s);

  // A reference step is a diagonal setting (kernel 1). Its pairs are the campaign's, or the
  // fewest that keep the calibration within `share` of every entry's variance: an entry
  // calibrated by one reference alone (the least favourable weight) has calibration variance
  // c_e / pairs_ref, so pairs_ref >= c_e (1 - share) / (share var_e) (docs/error-budget.md).
  check_entry_durations(c, stats, in.entries, noise, in.pair_detect_rate_per_s);
  in.reference_p_pass = pass_probability(1.0, c.rig.source.visibility, photons);
  if (!choose_references) {
    in.reference_pairs = c.schedule.reference_pairs;
  } else {
    const CalibrationCovariance per_pair = stats.reference_covariance(1.0);
    double need = 1.0;
    for (size_t k = 0; k < in.entries.size(); ++k) {
      const double own = stats.sigma(noise[k], in.entries[k].pairs);
      const double c_e = stats.calibration_variance(noise[k], per_pair);
      if (own > 0 && std::isfinite(own))
        need = std::max(need, c_e * (1.0 - share) / (share * own * own));
    }
    in.reference_pairs = std::ceil(need - 1e-9);
    in.reference_pairs_follow_scale = true;
    std::ostringstream origin;
    origin << "the reference steps (" << in.reference_pairs
           << " pairs each, chosen to keep the calibration within schedule.calibration_share = "
           << share << " of each entry's variance; a larger share or schedule.reference_pairs "
           << "shortens them)";
    in.reference_pairs_origin = origin.str();
  }

  ScheduleOptions so;
  so.seed = options.seed;
  so.optimize_order = options.optimize_order;
  so.tree_bound = options.tree_bound;
  so.hooks = options.hooks;
  ScheduleResult sched = build_schedule(in, so);

  plan.steps = std::move(sched.steps);
  index_steps(n, m, plan);
  // Per-entry pairs (after any fit-to-nights scaling) and predicted sigma, references included.
  const double worst_half_width = fill_entry_statistics(c, stats, plan, c.precision.budget);
  PlanSummary& s = plan.summary;
  s.reference_interval_min = c.schedule.reference_interval_min;
  s.calibration_share_target = choose_references ? share : 0.0;
  s.nights = sched.nights;
  s.fits = sched.fits;
  s.night_use = sched.night_use;
  s.move_lower_bound_s = sched.move_lower_bound_s;
  s.move_naive_s = sched.move_naive_s;
  s.truncation_cost_s = sched.truncation_cost_s;
  s.epsilon_reached = worst_half_width;
  fill_rig_kernels(c, plan);

  plan.gram_error = describe_gram_noise(plan.kernel_train, plan_gram_noise(plan));
  s.gram_sigma_frobenius = plan.gram_error.sigma_frobenius;
  plan.options = options;
  plan.options->resume = nullptr;
  plan.options->hooks = WorkHooks{};
  s.bound_ms = sched.bound_ms;
  s.plan_ms =
      std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count() -
      s.bound_ms;
  if (options.simulate_gram_error)
    estimate_gram_error(plan, {.seed = options.seed, .hooks = {{}, options.hooks.cancel}});
  return plan;
}

Plan plan_from_steps(const Campaign& campaign, std::vector<Step> steps) {
  if (auto e = campaign.check_consistency(); !e.empty()) throw std::invalid_argument(e);
  const Campaign& c = campaign;
  const int n = c.data.train_count();
  const int m = c.data.test_count();
  const EntryStatistics stats(c);
  Plan plan;
  plan.steps = std::move(steps);
  for (size_t k = 0; k < plan.steps.size(); ++k) {
    const Step& st = plan.steps[k];
    if (st.prep_point >= n + m || st.analysis_point >= n + m ||
        (st.kind == StepKind::measure && (st.prep_point < 0 || st.analysis_point < 0)))
      throw std::invalid_argument("steps[" + std::to_string(k) +
                                  "]: names a point the data set does not have");
  }
  plan.kernel_train = ideal_gram(c.encoding, c.data.train);
  plan.kernel_test =
      m > 0 ? ideal_cross(c.encoding, c.data.test, c.data.train) : Eigen::MatrixXd(0, n);
  index_steps(n, m, plan);
  fill_rig_kernels(c, plan);
  for (const Step& st : plan.steps) plan.summary.nights = std::max(plan.summary.nights, st.night);
  plan.summary.reference_interval_min = c.schedule.reference_interval_min;
  fill_entry_statistics(c, stats, plan, c.precision.budget);
  plan.gram_error = describe_gram_noise(plan.kernel_train, plan_gram_noise(plan));
  plan.summary.gram_sigma_frobenius = plan.gram_error.sigma_frobenius;
  return plan;
}

std::vector<GramProgressPoint> gram_progress(const Plan& plan) {
  std::vector<GramProgressPoint> out;
  const int n = static_cast<int>(plan.kernel_train.rows());
  const double entries = n * (n - 1) / 2.0;
  if (entries <= 0) return out;
  const double unmeasured_var = 0.25;
  double sum_sq = 2.0 * entries * unmeasured_var;  // both triangles of the matrix
  long done = 0;
  out.push_back({0.0, 0.0, std::sqrt(sum_sq), 1});
  for (const Step& s : plan.steps) {
    if (s.kind != StepKind::measure || s.block != Block::train) continue;
    const double sigma = plan.sigma_train(s.prep_point, s.analysis_point);
    sum_sq += 2.0 * (sigma * sigma - unmeasured_var);
    ++done;
    out.push_back({s.start_s + s.move_s + s.dwell_s, done / entries,
                   std::sqrt(std::max(0.0, sum_sq)), s.night});
  }
  return out;
}

void fill_rig_kernels(const Campaign& campaign, Plan& plan) {
  const Rig& rig = campaign.rig;
  const int photons = campaign.encoding.photon_count();
  const bool random_terms = has_random_plate_terms(rig);
  PlanSummary& s = plan.summary;
  s.target_epsilon = campaign.precision.budget.epsilon;
  s.kernel_bias_max = s.kernel_bias_frobenius = 0.0;
  s.kernel_spread_max = s.kernel_spread_frobenius = 0.0;
  // Each step on its own (a large plan has half a million): kernel_rig, and the first-order
  // spread when the motors have random terms; then the totals in step order.
  std::vector<double> spread(plan.steps.size(), 0.0);
  parallel_for(static_cast<int>(plan.steps.size()), 0, WorkHooks{}, [&](int k) {
    Step& st = plan.steps[static_cast<std::size_t>(k)];
    st.kernel_rig = 0.0;
    if (st.kind != StepKind::measure && st.kind != StepKind::reference) return;
    if (st.position_deg.size() != rig.motors.size()) return;
    st.kernel_rig = rig_kernel(rig, photons, st.position_deg);
    if (st.kind == StepKind::measure && random_terms)
      spread[static_cast<std::size_t>(k)] =
          kernel_spread_sd(rig, rig_kernel_gradient(rig, photons, st.position_deg));
  });
  double bias_sq = 0.0, spread_sq = 0.0;
  for (std::size_t k = 0; k < plan.steps.size(); ++k) {
    const Step& st = plan.steps[k];
    if (st.kind != StepKind::measure) continue;
    const double bias = std::abs(st.kernel_rig - st.kernel_ideal);
    const double sd = spread[k];
    s.kernel_bias_max = std::max(s.kernel_bias_max, bias);
    s.kernel_spread_max = std::max(s.kernel_spread_max, sd);
    if (st.block == Block::train) {
      bias_sq += 2.0 * bias * bias;  // both triangles
      spread_sq += 2.0 * sd * sd;
    }
  }
  s.kernel_bias_frobenius = std::sqrt(bias_sq);
  s.kernel_spread_frobenius = std::sqrt(spread_sq);
}

double recompute_moves(const Rig& rig, std::vector<Step>& steps) {
  std::vector<double> at(rig.motors.size());
  for (size_t k = 0; k < rig.motors.size(); ++k) at[k] = rig.motors[k].initial_deg;
  double total = 0.0;
  for (Step& s : steps) {
    s.move_s = step_move_s(rig, at, s.position_deg);
    total += s.move_s;
    at = s.position_deg;
  }
  return total;
}

namespace {
std::string hours(double seconds) {
  std::ostringstream o;
  o << std::fixed << std::setprecision(2) << seconds / 3600.0 << " h";
  return o.str();
}
}  // namespace

std::string Plan::report() const {
  const PlanSummary& s = summary;
  std::ostringstream o;
  o << std::fixed << std::setprecision(1);
  o << "Settings: " << s.settings << " measure steps, " << s.steps << " steps in all\n";
  o << "Time: " << hours(s.total_s) << " over " << s.nights << " night(s)"
    << (s.fits ? "" : " -- DOES NOT FIT the nights allowed") << "\n";
  o << "  counting " << hours(s.integration_s) << ", moving " << hours(s.move_s)
    << ", references/dark/park " << hours(s.reference_s) << "\n";
  if (s.reference_steps > 0) {
    double cost_s = 0.0;  // what the reference steps take: their moves and their counting
    for (const Step& st : steps)
      if (st.kind == StepKind::reference) cost_s += st.move_s + st.dwell_s;
    o << std::setprecision(0) << "References: " << s.reference_steps << " steps of "
      << s.reference_pairs << " pairs (" << std::setprecision(2) << cost_s / 3600.0
      << " h with their moves), at least every " << std::setprecision(0) << s.reference_interval_min
      << " min; calibration up to " << std::setprecision(1) << 100.0 * s.calibration_share_max
      << " % of an entry's variance";
    if (s.calibration_share_target > 0)
      o << " (planned for at most " << 100.0 * s.calibration_share_target << " %)";
    o << "\n";
  } else {
    o << "References: none; the rig model calibrates\n";
  }
  o << std::setprecision(2);
  o << "Pairs: " << s.pairs_total / 1e6 << " million in all; worst entry half-width "
    << std::setprecision(4) << s.epsilon_reached << "\n";
  o << std::setprecision(1);
  o << "Motor order: measure moves " << s.measure_move_s << " s; lower bound "
    << s.move_lower_bound_s << " s";
  if (s.move_lower_bound_s > 0)
    o << " (gap " << 100.0 * (s.measure_move_s / s.move_lower_bound_s - 1.0) << " %)";
  o << "; row-by-row order " << s.move_naive_s << " s";
  if (s.measure_move_s > 0) o << " (" << s.move_naive_s / s.measure_move_s << "x)";
  o << "\n";
  if (s.kernel_bias_max > 0 || s.kernel_spread_max > 0 || !s.unreachable.empty()) {
    o << std::setprecision(4) << "Plates: kernel bias up to " << s.kernel_bias_max << " (Frobenius "
      << s.kernel_bias_frobenius << "), random offsets add up to " << s.kernel_spread_max
      << " (Frobenius " << s.kernel_spread_frobenius << "); shot noise half-width "
      << s.epsilon_reached << "\n";
    if (s.plate_bias_exceeds_target())
      o << "  WARNING: the plate bias exceeds the target precision " << s.target_epsilon
        << ": more pairs will not help; calibrate the plates\n";
    if (!s.unreachable.empty()) {
      o << "  " << s.unreachable.size()
        << " stage setting(s) the actual plates cannot realise, e.g. point "
        << s.unreachable.front().point << " photon " << s.unreachable.front().photon << " "
        << to_string(s.unreachable.front().stage) << " (kernel error "
        << s.unreachable.front().kernel_error << ")\n";
    }
  }
  o << gram_error.report();
  if (options) {
    o << "Options: seed " << options->seed << ", "
      << (options->optimize_order ? "optimized" : "row-by-row") << " motor order, "
      << (options->simulate_gram_error ? "simulated" : "no simulated") << " Gram error\n";
  }
  for (const std::string& w : warnings) o << "Warning: " << w << "\n";
  o << std::setprecision(0) << "Planned in " << s.plan_ms << " ms\n";
  return o.str();
}

namespace {
constexpr EnumNames<StepKind, 4> kStepKindNames{{{StepKind::measure, "measure"},
                                                 {StepKind::reference, "reference"},
                                                 {StepKind::dark, "dark"},
                                                 {StepKind::park, "park"}}};
}  // namespace

std::string to_string(StepKind k) { return enum_text(kStepKindNames, k); }
bool from_string(const std::string& t, StepKind& out) {
  return enum_from_text(kStepKindNames, t, out);
}

}  // namespace gramline
