// The night timeline: measure steps in the chosen order, reference steps every
// reference_interval_min, dark steps at night start and end, a park at the end of each night;
// no step straddles the end of its window. Also the entry point build_schedule.
#include <algorithm>
#include <chrono>
#include <cmath>
#include <sstream>
#include <stdexcept>

#include "schedule_internal.h"

namespace gramline {
namespace {

using namespace sched;

struct Layout {
  std::vector<Step> steps;
  int nights = 0;
  bool ok = true;  ///< false when a single step cannot fit into an empty night
};

class TimelineBuilder {
 public:
  TimelineBuilder(const MoveModel& model, const std::vector<Code>& order, const RangedPlan& plan)
      : model_(model),
        in_(model.input()),
        rig_(model.rig()),
        order_(order),
        sols_(plan.solutions),
        planned_(plan.positions_deg) {
    initial_ = model_.park_deg();
    double pairs = 0.0;
    for (const EntryRequest& e : in_.entries) pairs += e.pairs;
    mean_pairs_ = in_.entries.empty() ? 0.0 : pairs / static_cast<double>(in_.entries.size());
  }

  Layout run(double scale) const {
    Layout out;
    const ScheduleSettings& set = in_.settings;
    const double window_s = in_.nights.length_s();
    const double ref_every_s = set.reference_interval_min * 60.0;
    // A resumed campaign starts where the motors stopped; parks still return to initial_deg.
    std::vector<double> pos = model_.start_deg();
    int night = 1;
    double t = 0.0;
    double last_ref_s = -1e300;
    int prepared = -1;
    bool night_has_measure = false;
    std::vector<Step> pending;

    // Nights sit on the calendar (skipped dates and weekdays left out, docs/plan-files.md).
    double night_start_s = in_.nights.night_start_s(night);
    auto night_end = [&] { return night_start_s + window_s; };
    auto push = [&](Step s) {
      s.start_s = t;
      s.night = night;
      t += s.move_s + s.dwell_s;
      out.steps.push_back(std::move(s));
    };
    auto closing_s = [&](const std::vector<double>& from) {
      double c = 0.0;
      if (set.dark_steps) c += rig_.controller.overhead_s + set.dark_dwell_s;
      if (set.park) c += step_move_s(rig_, from, initial_);
      return c;
    };
    auto close_night = [&] {
      if (set.dark_steps) push(dark_step(pos));
      if (set.park) {
        push(park_step(pos));
        pos = initial_;
      }
    };
    auto open_night = [&](int next_prep) {
      night_start_s = in_.nights.night_start_s(night);
      t = night_start_s;
      night_has_measure = false;
      if (set.dark_steps) push(dark_step(pos));
      if (ref_every_s > 0.0) {
        last_ref_s = t;
        push(reference_step(next_prep, pos, scale));
      }
    };

    if (!order_.empty()) open_night(model_.prep_point(order_[0]));
    for (std::size_t k = 0; k < order_.size(); ++k) {
      for (int attempt = 0; attempt < 2; ++attempt) {
        pending.clear();
        std::vector<double> p = pos;
        const bool ref_due = ref_every_s > 0.0 && t - last_ref_s >= ref_every_s;
        // A reference due before any measure step of the plan (the night's opening steps
        // outlasted the interval) is taken on the point this measure step prepares.
        if (ref_due) {
          const int ref_point = prepared >= 0 ? prepared : model_.prep_point(order_[k]);
          pending.push_back(reference_step(ref_point, p, scale));
        }
        pending.push_back(measure_step(k, p, scale));
        double dur = 0.0;
        for (const Step& s : pending) dur += s.move_s + s.dwell_s;
        if (t + dur + closing_s(p) <= night_end() + 1e-9) {
          for (Step& s : pending) {
            if (s.kind == StepKind::reference) last_ref_s = t;
            push(std::move(s));
          }
          pos = p;
          prepared = model_.prep_point(order_[k]);
          night_has_measure = true;
          break;
        }
        if (!night_has_measure || attempt == 1) {
          out.ok = false;
          out.nights = night;
          return out;
        }
        close_night();
        ++night;
        open_night(model_.prep_point(order_[k]));
      }
    }
    if (!order_.empty()) close_night();
    out.nights = order_.empty() ? 0 : night;
    return out;
  }

 private:
  Step dark_step(const std::vector<double>& pos) const {
    Step s;
    s.kind = StepKind::dark;
    s.block = Block::none;
    s.position_deg = pos;
    s.dwell_s = in_.settings.dark_dwell_s;
    s.move_s = step_move_s(rig_, pos, pos);
    return s;
  }
  Step park_step(const std::vector<double>& pos) const {
    Step s;
    s.kind = StepKind::park;
    s.block = Block::none;
    s.position_deg = initial_;
    s.move_s = step_move_s(rig_, pos, initial_);
    return s;
  }
  /// Diagonal setting on the currently prepared point: its preparation motors stay put.
  Step reference_step(int point, std::vector<double>& pos, double scale) const {
    Step s;
    s.kind = StepKind::reference;
    s.block = Block::none;
    s.prep_point = point;
    s.analysis_point = point;
    std::vector<double> next = pos;
    for (int g = 0; g < model_.groups(); ++g) place_group(model_, g, point, -1, next);
    s.position_deg = next;
    s.move_s = step_move_s(rig_, pos, next);
    pos = next;
    s.kernel_ideal = 1.0;
    s.p_pass = in_.reference_p_pass;
    s.pairs = in_.reference_pairs > 0.0
                  ? in_.reference_pairs * (in_.reference_pairs_follow_scale ? scale : 1.0)
                  : mean_pairs_ * scale;
    s.dwell_s = in_.pair_detect_rate_per_s > 0.0 ? s.pairs / in_.pair_detect_rate_per_s : 0.0;
    return s;
  }
  Step measure_step(std::size_t k, std::vector<double>& pos, double scale) const {
    const Code c = order_[k];
    const EntryRequest& e = in_.entries[code_entry(c)];
    Step s;
    s.kind = StepKind::measure;
    s.block = e.block;
    s.prep_point = model_.prep_point(c);
    s.analysis_point = model_.analysis_point(c);
    std::vector<double> next = pos;
    place_measure_step(model_, c, k, sols_, planned_, next);
    s.position_deg = next;
    s.move_s = step_move_s(rig_, pos, next);
    pos = std::move(next);
    s.kernel_ideal = e.kernel_ideal;
    s.p_pass = e.p_pass;
    s.pairs = e.pairs * scale;
    s.dwell_s = e.dwell_s * scale;
    return s;
  }

  const MoveModel& model_;
  const ScheduleInput& in_;
  const Rig& rig_;
  const std::vector<Code>& order_;
  const std::vector<std::uint8_t>& sols_;
  const std::vector<double>& planned_;
  std::vector<double> initial_;
  double mean_pairs_ = 0.0;
};

std::vector<NightUse> night_use(const std::vector<Step>& steps, int nights, double window_s) {
  std::vector<NightUse> use(std::max(nights, 0));
  for (int k = 0; k < nights; ++k) {
    use[k].night = k + 1;
    use[k].window_s = window_s;
  }
  for (const Step& s : steps) {
    if (s.night < 1 || s.night > nights) continue;
    NightUse& u = use[s.night - 1];
    u.busy_s += s.move_s + s.dwell_s;
    u.move_s += s.move_s;
    // The parts add up to the busy time: every move once, then the dwell by kind.
    if (s.kind == StepKind::measure) {
      u.integration_s += s.dwell_s;
    } else {
      u.reference_s += s.dwell_s;
    }
  }
  return use;
}

std::string seconds_text(double s) {
  std::ostringstream o;
  o << s << " s";
  return o.str();
}

/// Refuses durations that no night can hold (or that are not numbers at all) with a message
/// naming the campaign field, before any timeline is laid: a step longer than the nightly
/// window can never be placed, and non-finite times would poison every sum after them.
void check_durations(const ScheduleInput& in) {
  const double window_s = in.nights.length_s();
  const std::string longer = " is longer than the nightly window (" + seconds_text(window_s) + ")";
  auto check = [&](const std::string& field, double value_s) {
    if (!(value_s >= 0.0) || !std::isfinite(value_s)) {
      throw std::invalid_argument(field + ": " + seconds_text(value_s) +
                                  " is not a usable duration");
    }
    if (value_s > window_s)
      throw std::invalid_argument(field + ": " + seconds_text(value_s) + longer);
  };
  const Controller& ctl = in.rig->controller;
  check("rig.controller.settle_s", ctl.settle_s);
  check("rig.controller.overhead_s", ctl.overhead_s);
  check("rig.controller: settle_s + overhead_s", ctl.settle_s + ctl.overhead_s);
  if (in.settings.dark_steps) check("schedule.dark_dwell_s", in.settings.dark_dwell_s);
  const double rate = in.pair_detect_rate_per_s;
  const bool counts = rate > 0.0;  // the timeline gives no dwell without a pair rate
  // Fit to nights scales the entries' pairs down, at most by the search's smallest factor.
  const double least_scale = in.settings.fit_to_nights ? 1e-9 : 1.0;
  for (const EntryRequest& e : in.entries) {
    std::ostringstream field;
    field << "precision (the pairs of kernel entry " << e.a << "/" << e.b << ": " << e.pairs
          << " at " << rate << " pairs/s; see precision.fixed_pairs, the precision goal and the "
          << "rig's rates)";
    // Also covers references without pairs of their own: they count the mean entry's pairs.
    check(field.str(), e.dwell_s * least_scale);
  }
  // After the entries: reference pairs chosen by the planner derive from them.
  if (counts && in.settings.reference_interval_min > 0.0 && in.reference_pairs > 0.0) {
    check(in.reference_pairs_origin + " (a reference step's counting time)",
          in.reference_pairs / rate * (in.reference_pairs_follow_scale ? least_scale : 1.0));
  }
}

}  // namespace

ScheduleResult build_schedule(const ScheduleInput& input, const ScheduleOptions& options) {
  ScheduleResult result;
  const MoveModel model(input);
  check_durations(input);
  options.hooks.report(0.0);
  const SideCosts costs = compute_side_costs(model);
  options.hooks.throw_if_cancelled();
  const BoundTerms bound = bound_terms(model, costs);
  result.move_naive_s = realized_order_s(model, naive_order(input), {});
  options.hooks.report(0.1);

  std::vector<Code> order;
  RangedPlan plan;
  if (options.optimize_order) {
    order = optimized_order(model, costs, input.settings.truncation_safe, options);
    const double order_s = plan_positions(model, order, plan);
    if (input.settings.truncation_safe) {
      std::vector<Code> free_order = optimized_order(model, costs, false, options);
      RangedPlan free_plan;
      result.truncation_cost_s = order_s - plan_positions(model, free_order, free_plan);
    }
  } else {
    order = naive_order(input);
  }
  options.hooks.report(0.8);

  const TimelineBuilder builder(model, order, plan);
  const int max_nights = std::max(input.nights.max_nights, 1);
  auto fits = [&](const Layout& l) { return l.ok && l.nights <= max_nights; };
  double scale = 1.0;
  Layout layout = builder.run(scale);
  if (input.settings.fit_to_nights) {
    // Largest common factor on every entry's pairs and dwell that still fits max_nights.
    double lo = 0.0, hi = 0.0;
    if (fits(layout)) {
      lo = 1.0;
      hi = 2.0;
      while (hi < 1e6 && fits(builder.run(hi))) {
        lo = hi;
        hi *= 2.0;
      }
    } else {
      hi = 1.0;
    }
    if (lo > 0.0 || fits(builder.run(1e-9))) {
      for (int it = 0; it < 40 && hi - lo > 1e-6 * hi; ++it) {
        options.hooks.throw_if_cancelled();
        const double mid = 0.5 * (lo + hi);
        (fits(builder.run(mid)) ? lo : hi) = mid;
      }
      if (lo > 0.0) {
        scale = lo;
        layout = builder.run(scale);
      }
    }
  }
  if (!layout.ok) {
    throw std::invalid_argument(
        "nights: the nightly window is too short to hold a single measure step with its "
        "dark and park steps");
  }
  // The bound depends on how often the run of measure steps is broken (schedule_bound.cpp).
  long breaks = 0;
  for (std::size_t k = 0; k < layout.steps.size(); ++k) {
    breaks += layout.steps[k].kind == StepKind::measure &&
              (k + 1 == layout.steps.size() || layout.steps[k + 1].kind != StepKind::measure);
  }
  const auto bound_start = std::chrono::steady_clock::now();
  double measure_move = 0.0;
  for (const Step& s : layout.steps) {
    if (s.kind == StepKind::measure) measure_move += s.move_s;
  }
  result.move_tree_bound_s =
      options.tree_bound
          ? tree_lower_bound_s(model, costs, bound, breaks, measure_move, options.hooks)
          : 0.0;
  result.move_lower_bound_s =
      std::max(measure_lower_bound_s(bound, breaks), result.move_tree_bound_s);
  result.bound_ms =
      std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - bound_start)
          .count();
  result.steps = std::move(layout.steps);
  result.nights = layout.nights;
  result.fits = layout.nights <= max_nights;
  result.pairs_scale = scale;
  result.night_use = night_use(result.steps, result.nights, input.nights.length_s());
  options.hooks.report(1.0);
  return result;
}

std::string ScheduleResult::report() const {
  double measure_move = 0.0;
  long measures = 0;
  for (const Step& s : steps) {
    if (s.kind == StepKind::measure) {
      measure_move += s.move_s;
      ++measures;
    }
  }
  std::ostringstream out;
  out << measures << " settings in " << steps.size() << " steps over " << nights << " night"
      << (nights == 1 ? "" : "s") << (fits ? "" : " (more than allowed)") << "\n";
  out << "measure moves " << measure_move << " s; lower bound " << move_lower_bound_s
      << " s; row-by-row order " << move_naive_s << " s\n";
  if (pairs_scale != 1.0) out << "pairs scaled by " << pairs_scale << " to fit the nights\n";
  if (truncation_cost_s != 0.0) {
    out << "truncation-safe order costs " << truncation_cost_s << " s of extra moves\n";
  }
  return out.str();
}

}  // namespace gramline
