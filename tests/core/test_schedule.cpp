// Scheduler: optimum against Held-Karp, the lower bound, the timeline invariants.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <map>
#include <random>
#include <stdexcept>
#include <string>

#include "gramline/motion.h"
#include "gramline/schedule.h"

using namespace gramline;

namespace {

double unit(std::mt19937_64& rng) { return static_cast<double>(rng() >> 11) * 0x1.0p-53; }

struct RigShape {
  int photons = 1;
  Backlash backlash = Backlash::shortest;
  double overshoot_deg = 0.0;
  bool ranged = false;
  MoveMode moves = MoveMode::simultaneous;
};

Rig make_rig(const RigShape& shape) {
  Rig rig;
  for (int p = 0; p < shape.photons; ++p) {
    for (Stage s : {Stage::prep, Stage::analysis}) {
      for (Plate pl : {Plate::HWP, Plate::QWP}) {
        Motor m;
        m.name = "p" + std::to_string(p) + to_string(s) + to_string(pl);
        m.photon = p;
        m.stage = s;
        m.plate = pl;
        m.speed_deg_per_s = 15.0;
        m.accel_deg_per_s2 = 30.0;
        m.backlash = shape.backlash;
        m.overshoot_deg = shape.overshoot_deg;
        if (shape.ranged) m.range = TravelRange{-10.0, 350.0};
        m.initial_deg = 0.0;
        rig.motors.push_back(m);
      }
    }
  }
  rig.controller = Controller{shape.moves, 0.5, 0.1};
  return rig;
}

/// Random canonical solutions for `train + test` points, every training pair and every
/// test x training pair, dwell 1 s. No reference, dark or park steps; a 24 h window.
ScheduleInput make_input(const Rig& rig, int photons, int train, int test, std::uint64_t seed) {
  std::mt19937_64 rng(seed);
  ScheduleInput in;
  in.rig = &rig;
  for (int i = 0; i < train + test; ++i) {
    PointTargets t;
    for (int p = 0; p < photons; ++p) {
      StageSolutions prep, an;
      for (int s = 0; s < 2; ++s) {
        prep[s] = PlatePair{90.0 * unit(rng), 180.0 * unit(rng)};
        an[s] = PlatePair{90.0 * unit(rng), 180.0 * unit(rng)};
      }
      t.prep.push_back(prep);
      t.analysis.push_back(an);
    }
    in.points.push_back(t);
  }
  in.train_count = train;
  auto add = [&](int a, int b, Block block) {
    EntryRequest e;
    e.a = a;
    e.b = b;
    e.block = block;
    e.kernel_ideal = 0.5;
    e.p_pass = 0.5;
    e.pairs = 1000.0;
    e.dwell_s = 1.0;
    in.entries.push_back(e);
  };
  for (int a = 0; a < train; ++a)
    for (int b = a + 1; b < train; ++b) add(a, b, Block::train);
  for (int t = 0; t < test; ++t)
    for (int b = 0; b < train; ++b) add(train + t, b, Block::test);
  in.pair_detect_rate_per_s = 1000.0;
  in.reference_pairs = 1000.0;
  in.nights.start_min = 0;
  in.nights.end_min = 0;  // end not after start: a 24 h window
  in.nights.max_nights = 100;
  in.settings.reference_interval_min = 0.0;
  in.settings.dark_steps = false;
  in.settings.park = false;
  return in;
}

double measure_move_s(const ScheduleResult& r) {
  double t = 0.0;
  for (const Step& s : r.steps)
    if (s.kind == StepKind::measure) t += s.move_s;
  return t;
}

/// Every move_s recomputed from the positions alone, from the start positions on (empty: the
/// initial positions).
void expect_moves_recomputable(const Rig& rig, const std::vector<Step>& steps,
                               std::vector<double> pos = {}) {
  if (pos.empty())
    for (const Motor& m : rig.motors) pos.push_back(m.initial_deg);
  for (std::size_t k = 0; k < steps.size(); ++k) {
    EXPECT_NEAR(steps[k].move_s, step_move_s(rig, pos, steps[k].position_deg), 1e-9)
        << "step " << k;
    pos = steps[k].position_deg;
  }
}

/// The physical positions hit the requested angles: HWP modulo 90, QWP modulo 180.
void expect_positions_on_target(const Rig& rig, const ScheduleInput& in,
                                const std::vector<Step>& steps) {
  for (const Step& s : steps) {
    if (s.kind != StepKind::measure) continue;
    for (std::size_t m = 0; m < rig.motors.size(); ++m) {
      const Motor& mo = rig.motors[m];
      const int point = mo.stage == Stage::prep ? s.prep_point : s.analysis_point;
      const auto& sols = mo.stage == Stage::prep ? in.points[point].prep[mo.photon]
                                                 : in.points[point].analysis[mo.photon];
      const double period = motor_period_deg(mo);
      bool hit = false;
      for (const PlatePair& pp : sols) {
        const double want = mo.plate == Plate::HWP ? pp.hwp_deg : pp.qwp_deg;
        const double k = std::round((s.position_deg[m] - want) / period);
        hit = hit || std::abs(s.position_deg[m] - want - k * period) < 1e-9;
      }
      EXPECT_TRUE(hit) << mo.name;
      if (mo.range) {
        EXPECT_GE(s.position_deg[m], mo.range->low_deg);
        EXPECT_LE(s.position_deg[m], mo.range->high_deg);
      }
    }
  }
}

}  // namespace

TEST(Schedule, OptimizerReachesHeldKarpOptimumOnePhoton) {
  for (std::uint64_t seed = 1; seed <= 4; ++seed) {
    RigShape shape;
    shape.backlash = seed % 2 ? Backlash::shortest : Backlash::from_below;
    shape.overshoot_deg = 3.0;
    shape.moves = seed % 3 ? MoveMode::simultaneous : MoveMode::sequential;
    const Rig rig = make_rig(shape);
    // 4 training points (6 pairs) and 1 test point (4 entries): 10 entries.
    const ScheduleInput in = make_input(rig, 1, 4, 1, seed);
    const double optimum = exact_min_move_s(in);
    const ScheduleResult r = build_schedule(in, ScheduleOptions{seed, true, {}});
    EXPECT_NEAR(measure_move_s(r), optimum, 1e-9) << "seed " << seed;
    EXPECT_LE(r.move_lower_bound_s, optimum + 1e-9) << "seed " << seed;
    EXPECT_GE(r.move_naive_s, optimum - 1e-9) << "seed " << seed;
  }
}

TEST(Schedule, OptimizerReachesHeldKarpOptimumTwoPhotons) {
  for (std::uint64_t seed = 11; seed <= 12; ++seed) {
    const Rig rig = make_rig(RigShape{2});
    const ScheduleInput in = make_input(rig, 2, 4, 0, seed);  // 6 settings
    const double optimum = exact_min_move_s(in);
    const ScheduleResult r = build_schedule(in, ScheduleOptions{seed, true, {}});
    EXPECT_NEAR(measure_move_s(r), optimum, 1e-9) << "seed " << seed;
    EXPECT_LE(r.move_lower_bound_s, optimum + 1e-9) << "seed " << seed;
  }
}

TEST(Schedule, BoundHoldsWithReferencesDarkAndPark) {
  RigShape shape{2, Backlash::from_below, 2.0, true};
  const Rig rig = make_rig(shape);
  ScheduleInput in = make_input(rig, 2, 14, 4, 5);
  for (EntryRequest& e : in.entries) e.dwell_s = 20.0;  // 147 x 20 s, well over 25 min
  in.settings.reference_interval_min = 1.0;
  in.settings.dark_steps = true;
  in.settings.park = true;
  in.nights.start_min = 20 * 60;
  in.nights.end_min = 20 * 60 + 25;  // 25 min windows: several nights
  const ScheduleResult r = build_schedule(in, ScheduleOptions{});
  EXPECT_GT(r.nights, 1);
  EXPECT_LE(r.move_lower_bound_s, measure_move_s(r));
  // The optimized order beats the row-by-row one on random targets.
  EXPECT_LT(measure_move_s(r), r.move_naive_s);
  expect_moves_recomputable(rig, r.steps);
  expect_positions_on_target(rig, in, r.steps);
}

TEST(Schedule, NightsAreNeverStraddledAndEndWithAPark) {
  const Rig rig = make_rig(RigShape{2});
  ScheduleInput in = make_input(rig, 2, 12, 3, 8);
  for (EntryRequest& e : in.entries) e.dwell_s = 15.0;  // 102 x 15 s: over two 600 s nights
  in.settings.reference_interval_min = 5.0;
  in.settings.dark_steps = true;
  in.settings.dark_dwell_s = 20.0;
  in.settings.park = true;
  in.nights.start_min = 22 * 60;
  in.nights.end_min = 22 * 60 + 10;  // 600 s windows
  const double window_s = 600.0;
  const ScheduleResult r = build_schedule(in, ScheduleOptions{});
  ASSERT_GT(r.nights, 2);
  ASSERT_EQ(static_cast<int>(r.night_use.size()), r.nights);
  std::map<int, std::vector<const Step*>> by_night;
  long measures = 0;
  for (const Step& s : r.steps) {
    const double night_start = (s.night - 1) * 86400.0;
    EXPECT_GE(s.start_s, night_start - 1e-9);
    EXPECT_LE(s.start_s + s.move_s + s.dwell_s, night_start + window_s + 1e-9);
    by_night[s.night].push_back(&s);
    measures += s.kind == StepKind::measure;
  }
  EXPECT_EQ(measures, static_cast<long>(in.entries.size()));
  for (const auto& [night, steps] : by_night) {
    EXPECT_EQ(steps.back()->kind, StepKind::park) << "night " << night;
    EXPECT_EQ(steps.front()->kind, StepKind::dark) << "night " << night;
    EXPECT_EQ(steps.back()->position_deg, std::vector<double>(rig.motors.size(), 0.0));
    // Steps follow each other without overlap.
    for (std::size_t k = 1; k < steps.size(); ++k) {
      EXPECT_NEAR(steps[k]->start_s,
                  steps[k - 1]->start_s + steps[k - 1]->move_s + steps[k - 1]->dwell_s, 1e-6);
    }
    // A reference at least every 5 min, give or take the step that was running.
    double last_ref = -1.0;
    for (const Step* s : steps) {
      if (s->kind != StepKind::reference) continue;
      if (last_ref >= 0.0) {
        // The reference waits for the running measure step: 15 s dwell plus at most
        // T(90 deg) + settle + overhead = 6.5 + 0.6 s of move.
        EXPECT_LE(s->start_s - last_ref, 300.0 + 15.0 + 7.1);
      }
      last_ref = s->start_s;
    }
    EXPECT_GE(last_ref, 0.0) << "night " << night << " has no reference";
  }
  for (const NightUse& u : r.night_use) {
    EXPECT_LE(u.fill(), 1.0 + 1e-12);
    EXPECT_GT(u.integration_s, 0.0);
  }
  expect_moves_recomputable(rig, r.steps);
}

TEST(Schedule, DeterministicPerSeed) {
  const Rig rig = make_rig(RigShape{2});
  ScheduleInput in = make_input(rig, 2, 10, 2, 21);
  in.settings.reference_interval_min = 2.0;
  const ScheduleResult a = build_schedule(in, ScheduleOptions{3, true, {}});
  const ScheduleResult b = build_schedule(in, ScheduleOptions{3, true, {}});
  ASSERT_EQ(a.steps.size(), b.steps.size());
  for (std::size_t k = 0; k < a.steps.size(); ++k) {
    EXPECT_EQ(a.steps[k].prep_point, b.steps[k].prep_point);
    EXPECT_EQ(a.steps[k].analysis_point, b.steps[k].analysis_point);
    EXPECT_EQ(a.steps[k].position_deg, b.steps[k].position_deg);
    EXPECT_EQ(a.steps[k].start_s, b.steps[k].start_s);
  }
}

TEST(Schedule, NaiveOrderIsRowByRow) {
  const Rig rig = make_rig(RigShape{1});
  const ScheduleInput in = make_input(rig, 1, 4, 2, 4);
  const ScheduleResult r = build_schedule(in, ScheduleOptions{1, false, {}});
  const std::vector<std::pair<int, int>> want = {
      {0, 1}, {0, 2}, {0, 3}, {1, 2}, {1, 3}, {2, 3},                   // training pairs
      {4, 0}, {4, 1}, {4, 2}, {4, 3}, {5, 0}, {5, 1}, {5, 2}, {5, 3}};  // test rows
  ASSERT_EQ(r.steps.size(), want.size());
  for (std::size_t k = 0; k < want.size(); ++k) {
    EXPECT_EQ(r.steps[k].prep_point, want[k].first);
    EXPECT_EQ(r.steps[k].analysis_point, want[k].second);
  }
  // Same model, same order: the schedule's own total is the naive figure.
  EXPECT_NEAR(measure_move_s(r), r.move_naive_s, 1e-9);
  expect_moves_recomputable(rig, r.steps);
}

TEST(Schedule, FitToNightsScalesPairs) {
  const Rig rig = make_rig(RigShape{1});
  ScheduleInput in = make_input(rig, 1, 10, 0, 2);
  for (EntryRequest& e : in.entries) e.dwell_s = 60.0;  // 45 x 60 s = 45 min of counting
  in.nights.start_min = 0;
  in.nights.end_min = 20;  // 20 min windows
  in.nights.max_nights = 2;
  const ScheduleResult plain = build_schedule(in, ScheduleOptions{});
  EXPECT_GT(plain.nights, 2);
  EXPECT_FALSE(plain.fits);
  in.settings.fit_to_nights = true;
  const ScheduleResult fit = build_schedule(in, ScheduleOptions{});
  EXPECT_TRUE(fit.fits);
  EXPECT_LE(fit.nights, 2);
  EXPECT_LT(fit.pairs_scale, 1.0);
  EXPECT_GT(fit.pairs_scale, 0.3);  // 40 min of window for 45 min of counting plus moves
  for (const Step& s : fit.steps) {
    if (s.kind != StepKind::measure) continue;
    EXPECT_NEAR(s.pairs, 1000.0 * fit.pairs_scale, 1e-6);
    EXPECT_NEAR(s.dwell_s, 60.0 * fit.pairs_scale, 1e-9);
  }
}

TEST(Schedule, TruncationSafeOrderCompletesGramMatricesEarly) {
  const Rig rig = make_rig(RigShape{2});
  ScheduleInput in = make_input(rig, 2, 9, 2, 6);
  in.settings.truncation_safe = true;
  const ScheduleResult r = build_schedule(in, ScheduleOptions{});
  // Rank training points by first appearance; the larger rank of a step's two points must
  // never decrease, so the first m points' Gram matrix is complete before point m+1 starts.
  std::vector<int> rank(in.points.size(), -1);
  int next_rank = 0, last = -1;
  for (const Step& s : r.steps) {
    if (s.kind != StepKind::measure || s.block != Block::train) continue;
    for (int p : {s.prep_point, s.analysis_point})
      if (rank[p] < 0) rank[p] = next_rank++;
    const int top = std::max(rank[s.prep_point], rank[s.analysis_point]);
    EXPECT_GE(top, last);
    last = top;
  }
  EXPECT_EQ(next_rank, 9);
}

TEST(Schedule, CancelThrows) {
  const Rig rig = make_rig(RigShape{2});
  const ScheduleInput in = make_input(rig, 2, 10, 0, 1);
  CancelFlag flag{true};
  ScheduleOptions opt;
  opt.hooks.cancel = &flag;
  EXPECT_THROW(build_schedule(in, opt), Cancelled);
}

TEST(Schedule, ReferenceDueBeforeTheFirstMeasureStepUsesARealPoint) {
  const Rig rig = make_rig(RigShape{2});
  ScheduleInput in = make_input(rig, 2, 5, 1, 3);
  in.settings.reference_interval_min = 1.0;
  in.reference_pairs = 120000.0;  // 120 s per reference at 1000 pairs/s: longer than 1 min
  in.settings.dark_steps = true;
  in.settings.park = true;
  const ScheduleResult r = build_schedule(in, ScheduleOptions{});
  int references = 0;
  for (const Step& s : r.steps) {
    if (s.kind != StepKind::reference) continue;
    ++references;
    ASSERT_GE(s.prep_point, 0);
    EXPECT_EQ(s.prep_point, s.analysis_point);
  }
  // Every measure step is preceded by a due reference, plus the night's opening one.
  EXPECT_EQ(references, static_cast<int>(in.entries.size()) + 1);
  expect_moves_recomputable(rig, r.steps);
}

TEST(Schedule, AbsurdDurationsAreRefusedNamingTheField) {
  auto message = [](const ScheduleInput& in) -> std::string {
    try {
      build_schedule(in, ScheduleOptions{});
    } catch (const std::invalid_argument& e) {
      return e.what();
    }
    return "";
  };
  Rig rig = make_rig(RigShape{1});
  const ScheduleInput in = make_input(rig, 1, 4, 0, 1);
  rig.controller.settle_s = 1e6;  // longer than any night
  EXPECT_NE(message(in).find("rig.controller.settle_s"), std::string::npos) << message(in);
  rig.controller.settle_s = 0.5;
  rig.controller.overhead_s = std::numeric_limits<double>::infinity();
  EXPECT_NE(message(in).find("rig.controller.overhead_s"), std::string::npos) << message(in);
  rig.controller.overhead_s = 0.1;
  ScheduleInput huge = in;
  huge.entries[2].pairs = 1e308;
  huge.entries[2].dwell_s = 1e308 / huge.pair_detect_rate_per_s;
  EXPECT_NE(message(huge).find("precision"), std::string::npos) << message(huge);
  huge = in;
  huge.settings.reference_interval_min = 20.0;
  huge.reference_pairs = 1e308;
  EXPECT_NE(message(huge).find("schedule.reference_pairs"), std::string::npos) << message(huge);
  EXPECT_EQ(message(in), "");
}

TEST(Schedule, ResumedPlanStartsFromTheGivenPositions) {
  for (std::uint64_t seed = 31; seed <= 33; ++seed) {
    RigShape shape;
    shape.backlash = seed % 2 ? Backlash::from_below : Backlash::shortest;
    shape.overshoot_deg = 4.0;
    const Rig rig = make_rig(shape);
    ScheduleInput in = make_input(rig, 1, 4, 0, seed);  // 6 settings
    std::mt19937_64 rng(seed + 100);
    // Where the motors stopped: arbitrary angles, far from initial_deg = 0.
    for (std::size_t m = 0; m < rig.motors.size(); ++m)
      in.start_positions_deg.push_back(20.0 + 140.0 * unit(rng));
    const double optimum = exact_min_move_s(in);
    ScheduleInput from_park = in;
    from_park.start_positions_deg.clear();
    // The start positions matter: otherwise this test could not tell them apart.
    ASSERT_GT(std::abs(optimum - exact_min_move_s(from_park)), 1e-6) << "seed " << seed;
    const ScheduleResult r = build_schedule(in, ScheduleOptions{seed, true, {}});
    EXPECT_NEAR(measure_move_s(r), optimum, 1e-9) << "seed " << seed;
    EXPECT_LE(r.move_lower_bound_s, optimum + 1e-9) << "seed " << seed;
    expect_moves_recomputable(rig, r.steps, in.start_positions_deg);
  }
}

TEST(Schedule, ResumedPlanParksAtTheInitialPositions) {
  const Rig rig = make_rig(RigShape{2, Backlash::from_below, 2.0, true});
  ScheduleInput in = make_input(rig, 2, 6, 2, 9);
  for (std::size_t m = 0; m < rig.motors.size(); ++m)
    in.start_positions_deg.push_back(100.0 + 7.0 * static_cast<double>(m));
  in.settings.reference_interval_min = 0.5;
  in.settings.dark_steps = true;
  in.settings.park = true;
  for (EntryRequest& e : in.entries) e.dwell_s = 30.0;  // 27 x 30 s: several 5 min nights
  in.nights.start_min = 60;
  in.nights.end_min = 65;
  const ScheduleResult r = build_schedule(in, ScheduleOptions{});
  ASSERT_GT(r.nights, 1);
  // The first dark step holds the start positions; every park returns to initial_deg = 0.
  EXPECT_EQ(r.steps.front().kind, StepKind::dark);
  EXPECT_EQ(r.steps.front().position_deg, in.start_positions_deg);
  int parks = 0;
  for (const Step& s : r.steps) {
    if (s.kind != StepKind::park) continue;
    ++parks;
    EXPECT_EQ(s.position_deg, std::vector<double>(rig.motors.size(), 0.0));
  }
  EXPECT_EQ(parks, r.nights);
  EXPECT_LE(r.move_lower_bound_s, measure_move_s(r));
  expect_moves_recomputable(rig, r.steps, in.start_positions_deg);
  expect_positions_on_target(rig, in, r.steps);
}

TEST(Schedule, BoundNeverExceedsHeldKarpOptimum) {
  // Many small random instances, cheap to solve exactly: the naive order keeps build_schedule
  // fast, and the bound (one run of measure steps, no references) does not depend on the order.
  int tight = 0;
  for (std::uint64_t seed = 200; seed < 240; ++seed) {
    std::mt19937_64 rng(seed);
    RigShape shape;
    shape.photons = seed % 5 == 0 ? 2 : 1;
    shape.backlash = seed % 2 ? Backlash::from_below : Backlash::shortest;
    shape.overshoot_deg = 1.0 + 5.0 * unit(rng);
    shape.moves = seed % 3 ? MoveMode::simultaneous : MoveMode::sequential;
    const Rig rig = make_rig(shape);
    const int train = shape.photons == 2 ? 3 : 3 + static_cast<int>(seed % 2);
    ScheduleInput in = make_input(rig, shape.photons, train, 1, seed);
    if (seed % 4 == 1) {
      for (std::size_t m = 0; m < rig.motors.size(); ++m)
        in.start_positions_deg.push_back(180.0 * unit(rng));
    }
    const double optimum = exact_min_move_s(in);
    const ScheduleResult r = build_schedule(in, ScheduleOptions{seed, false, {}});
    EXPECT_LE(r.move_lower_bound_s, optimum + 1e-9) << "seed " << seed;
    EXPECT_GT(r.move_lower_bound_s, 0.0);
    tight += r.move_lower_bound_s > 0.7 * optimum;
  }
  // Not a proof obligation, a sign the bound is more than a formality on these instances.
  EXPECT_GT(tight, 20);
}

namespace {

/// Independent exhaustive optimum of the measure moves (docs/motion-model.md): every order and
/// orientation of the entries (depth-first over prefixes), and for each prefix a table over every
/// joint choice of one solution per group and one physical position per motor. Positions are the
/// target angle plus whole plate periods inside the travel range for a ranged motor; a continuous
/// motor keeps the canonical angle and each move takes its fastest equivalent end (move times
/// depend only on position differences, so the representative does not matter).
/// Step times come from motor_move_s and combine_motor_times_s, the documented formulas.
class Exhaustive {
 public:
  Exhaustive(const Rig& rig, const ScheduleInput& in) : rig_(rig), in_(in) {
    P_ = static_cast<int>(in.points.front().prep.size());
    // Per point and motor: the candidate positions with the solution each belongs to.
    cand_.resize(in.points.size());
    for (std::size_t pt = 0; pt < in.points.size(); ++pt) {
      cand_[pt].resize(rig.motors.size());
      for (std::size_t m = 0; m < rig.motors.size(); ++m) {
        const Motor& mo = rig.motors[m];
        const auto& sols = mo.stage == Stage::prep ? in.points[pt].prep[mo.photon]
                                                   : in.points[pt].analysis[mo.photon];
        const double period = mo.plate == Plate::HWP ? 90.0 : 180.0;  // common practice
        for (int s = 0; s < 2; ++s) {
          const double want = mo.plate == Plate::HWP ? sols[s].hwp_deg : sols[s].qwp_deg;
          for (int k = -6; k <= 6; ++k) {
            const double x = want + k * period;
            const bool ok = mo.range ? (x >= mo.range->low_deg && x <= mo.range->high_deg) : k == 0;
            if (ok) cand_[pt][m].push_back({x, s});
          }
        }
      }
    }
  }

  double optimum() {
    best_ = std::numeric_limits<double>::infinity();
    used_.assign(in_.entries.size(), 0);
    std::vector<std::vector<double>> start_states = {start()};
    std::vector<double> start_cost = {0.0};
    dfs(start_states, start_cost, 0);
    return best_;
  }

 private:
  std::vector<double> start() const {
    if (!in_.start_positions_deg.empty()) return in_.start_positions_deg;
    std::vector<double> pos;
    for (const Motor& m : rig_.motors) pos.push_back(m.initial_deg);
    return pos;
  }

  /// Every joint configuration of a setting: one solution per (photon, stage), one candidate
  /// position per motor consistent with it.
  std::vector<std::vector<double>> configs(int prep, int analysis) const {
    std::vector<std::vector<double>> out = {{}};
    std::vector<std::vector<int>> sol_out = {{}};
    const int G = 2 * P_;
    for (int g = 0; g < G; ++g) {
      const Stage stage = g < P_ ? Stage::prep : Stage::analysis;
      const int photon = g % P_;
      const int pt = stage == Stage::prep ? prep : analysis;
      std::vector<std::vector<double>> next;
      for (const auto& base : out) {
        for (int s = 0; s < 2; ++s) {
          std::vector<std::vector<double>> partial = {base};
          for (std::size_t m = 0; m < rig_.motors.size(); ++m) {
            const Motor& mo = rig_.motors[m];
            if (mo.stage != stage || mo.photon != photon) continue;
            std::vector<std::vector<double>> grown;
            for (const auto& p : partial) {
              for (const auto& [x, sol] : cand_[pt][m]) {
                if (sol != s) continue;
                auto q = p;
                q.push_back(static_cast<double>(m));
                q.push_back(x);
                grown.push_back(q);
              }
            }
            partial.swap(grown);
          }
          for (auto& p : partial) next.push_back(p);
        }
      }
      out.swap(next);
    }
    // Unpack (motor, position) pairs into a full position vector.
    std::vector<std::vector<double>> full;
    for (const auto& c : out) {
      std::vector<double> pos(rig_.motors.size(), 0.0);
      for (std::size_t i = 0; i + 1 < c.size(); i += 2)
        pos[static_cast<std::size_t>(c[i])] = c[i + 1];
      full.push_back(pos);
    }
    return full;
  }

  /// One motor's move time; a continuous motor ends at the fastest equivalent of the target.
  double motor_s(std::size_t m, double from, double to) const {
    const Motor& mo = rig_.motors[m];
    if (mo.range) return motor_move_s(mo, from, to);
    const double period = mo.plate == Plate::HWP ? 90.0 : 180.0;
    double best = std::numeric_limits<double>::infinity();
    for (int k = -3; k <= 3; ++k) best = std::min(best, motor_move_s(mo, from, to + k * period));
    return best;
  }

  void dfs(const std::vector<std::vector<double>>& states, const std::vector<double>& cost,
           std::size_t depth) {
    if (depth == in_.entries.size()) {
      for (double c : cost) best_ = std::min(best_, c);
      return;
    }
    for (std::size_t e = 0; e < in_.entries.size(); ++e) {
      if (used_[e]) continue;
      used_[e] = 1;
      for (int flip = 0; flip < 2; ++flip) {
        const int prep = flip ? in_.entries[e].b : in_.entries[e].a;
        const int analysis = flip ? in_.entries[e].a : in_.entries[e].b;
        std::vector<std::vector<double>> next = configs(prep, analysis);
        // Continuous motors keep one representative per solution.
        std::sort(next.begin(), next.end());
        next.erase(std::unique(next.begin(), next.end()), next.end());
        std::vector<double> next_cost(next.size(), std::numeric_limits<double>::infinity());
        // Per motor, the time between each distinct pair of positions, looked up by index.
        const std::size_t M = rig_.motors.size();
        std::vector<std::vector<double>> from_vals(M), to_vals(M);
        std::vector<std::vector<int>> from_idx(states.size(), std::vector<int>(M)),
            to_idx(next.size(), std::vector<int>(M));
        auto index = [](std::vector<double>& vals, double x) {
          const auto it = std::find(vals.begin(), vals.end(), x);
          if (it != vals.end()) return static_cast<int>(it - vals.begin());
          vals.push_back(x);
          return static_cast<int>(vals.size()) - 1;
        };
        for (std::size_t u = 0; u < states.size(); ++u)
          for (std::size_t m = 0; m < M; ++m) from_idx[u][m] = index(from_vals[m], states[u][m]);
        for (std::size_t w = 0; w < next.size(); ++w)
          for (std::size_t m = 0; m < M; ++m) to_idx[w][m] = index(to_vals[m], next[w][m]);
        std::vector<std::vector<double>> table(M);
        for (std::size_t m = 0; m < M; ++m) {
          for (double x : from_vals[m]) {
            for (double y : to_vals[m]) {
              table[m].push_back(motor_s(m, x, y));
            }
          }
        }
        std::vector<double> t(M);
        for (std::size_t u = 0; u < states.size(); ++u) {
          for (std::size_t w = 0; w < next.size(); ++w) {
            bool moved = false;
            for (std::size_t m = 0; m < M; ++m) {
              t[m] = table[m][from_idx[u][m] * to_vals[m].size() + to_idx[w][m]];
              moved = moved || t[m] > 0.0;
            }
            const double step =
                combine_motor_times_s(rig_.controller, t.data(), static_cast<int>(M), moved);
            next_cost[w] = std::min(next_cost[w], cost[u] + step);
          }
        }
        dfs(next, next_cost, depth + 1);
      }
      used_[e] = 0;
    }
  }

  const Rig& rig_;
  const ScheduleInput& in_;
  int P_ = 1;
  std::vector<std::vector<std::vector<std::pair<double, int>>>> cand_;
  std::vector<char> used_;
  double best_ = 0.0;
};

}  // namespace

TEST(Schedule, RangedTinyInstancesReachTheExhaustiveOptimum) {
  // Cable-limited mounts: 210 deg of travel, so an HWP has two or three places for an angle and
  // a QWP one or two; the plan must pick them along the order, not one step at a time.
  int cases = 0;
  for (std::uint64_t seed = 50; seed < 54; ++seed) {
    RigShape shape;
    shape.backlash = seed % 2 ? Backlash::from_below : Backlash::shortest;
    shape.overshoot_deg = 4.0;
    shape.moves = (seed / 2) % 2 ? MoveMode::sequential : MoveMode::simultaneous;
    Rig rig = make_rig(shape);
    for (Motor& m : rig.motors) {
      m.range = TravelRange{-10.0, 200.0};
      m.initial_deg = 190.0;  // near the top: the greedy nearest choice runs into the end
    }
    // 5 settings: 2 training points and 2 test points.
    const ScheduleInput in = make_input(rig, 1, 2, 2, seed);
    const double optimum = Exhaustive(rig, in).optimum();
    const ScheduleResult r = build_schedule(in, ScheduleOptions{seed, true, {}});
    EXPECT_NEAR(measure_move_s(r), optimum, 1e-9) << "seed " << seed;
    EXPECT_NEAR(exact_min_move_s(in), optimum, 1e-9) << "seed " << seed;
    EXPECT_LE(r.move_lower_bound_s, optimum + 1e-9) << "seed " << seed;
    expect_moves_recomputable(rig, r.steps);
    expect_positions_on_target(rig, in, r.steps);
    ++cases;
  }
  EXPECT_EQ(cases, 4);
}

TEST(Schedule, ThreeAndFourPhotonsReachTheExhaustiveOptimum) {
  // Campaigns allow one to four photons: four motors each, up to 16 motors.
  for (int photons : {3, 4}) {
    for (std::uint64_t seed = 70u + static_cast<std::uint64_t>(photons), last = seed; seed <= last;
         ++seed) {
      RigShape shape{photons};
      shape.backlash = seed % 2 ? Backlash::from_below : Backlash::shortest;
      shape.overshoot_deg = 2.0;
      shape.moves = seed % 2 ? MoveMode::sequential : MoveMode::simultaneous;
      const Rig rig = make_rig(shape);
      const ScheduleInput in = make_input(rig, photons, 3, 0, seed);  // 3 settings
      const double optimum = Exhaustive(rig, in).optimum();
      const ScheduleResult r = build_schedule(in, ScheduleOptions{seed, true, {}});
      EXPECT_NEAR(measure_move_s(r), optimum, 1e-9) << photons << " photons, seed " << seed;
      EXPECT_LE(r.move_lower_bound_s, optimum + 1e-9) << photons << " photons, seed " << seed;
      expect_moves_recomputable(rig, r.steps);
      expect_positions_on_target(rig, in, r.steps);
    }
  }
}

TEST(Schedule, OneThreeAndFourPhotonCampaignsPlanEveryEntry) {
  for (int photons : {1, 3, 4}) {
    RigShape shape{photons};
    shape.ranged = photons == 3;
    shape.backlash = Backlash::from_below;
    shape.overshoot_deg = 3.0;
    const Rig rig = make_rig(shape);
    ScheduleInput in = make_input(rig, photons, 9, 2, 5);  // 36 + 18 settings
    in.settings.reference_interval_min = 10.0;
    in.settings.dark_steps = true;
    in.settings.park = true;
    const ScheduleResult r = build_schedule(in, ScheduleOptions{5, true, {}});
    std::map<std::pair<int, int>, int> seen;
    for (const Step& s : r.steps) {
      if (s.kind != StepKind::measure) continue;
      ++seen[{std::min(s.prep_point, s.analysis_point), std::max(s.prep_point, s.analysis_point)}];
    }
    EXPECT_EQ(seen.size(), in.entries.size()) << photons << " photons";
    for (const auto& [pair, count] : seen) EXPECT_EQ(count, 1);
    EXPECT_LE(r.move_lower_bound_s, measure_move_s(r)) << photons << " photons";
    EXPECT_LE(measure_move_s(r), r.move_naive_s) << photons << " photons";
    expect_moves_recomputable(rig, r.steps);
    expect_positions_on_target(rig, in, r.steps);
  }
}

TEST(Schedule, BoundsNeverExceedTheExhaustiveOptimumWithRanges) {
  // Random small instances, both backlash rules, both controllers, ranged and continuous mounts,
  // references or not: the reported bound and its 1-tree part stay below the exhaustive optimum
  // (for the measure steps alone, which the plan's references can only make dearer).
  int tree_positive = 0;
  for (std::uint64_t seed = 300; seed < 308; ++seed) {
    std::mt19937_64 rng(seed);
    RigShape shape;
    shape.backlash = seed % 2 ? Backlash::from_below : Backlash::shortest;
    shape.overshoot_deg = 1.0 + 5.0 * unit(rng);
    shape.moves = (seed / 2) % 2 ? MoveMode::sequential : MoveMode::simultaneous;
    Rig rig = make_rig(shape);
    if (seed % 4 < 3) {
      for (Motor& m : rig.motors) {
        m.range = TravelRange{-20.0 * unit(rng), 200.0 + 60.0 * unit(rng)};
        m.initial_deg = m.range->low_deg + 150.0 * unit(rng);
      }
    }
    const ScheduleInput in = make_input(rig, 1, 2, 2, seed);  // 5 settings
    const double optimum = Exhaustive(rig, in).optimum();
    const ScheduleResult r = build_schedule(in, ScheduleOptions{seed, seed % 3 != 0, {}});
    EXPECT_LE(r.move_lower_bound_s, optimum + 1e-9) << "seed " << seed;
    EXPECT_LE(r.move_tree_bound_s, optimum + 1e-9) << "seed " << seed;
    EXPECT_GE(r.move_lower_bound_s, r.move_tree_bound_s);
    tree_positive += r.move_tree_bound_s > 0.0;
  }
  // The 1-tree part is computed for every plan of this size.
  EXPECT_EQ(tree_positive, 8);
}

TEST(Schedule, SearchBudgetIsCountedNotTimed) {
  // The same campaign and seed give the same plan; a small evaluation budget still gives a
  // complete, valid plan.
  const Rig rig = make_rig(RigShape{2});
  ScheduleInput in = make_input(rig, 2, 14, 3, 9);
  const ScheduleResult a = build_schedule(in, ScheduleOptions{9, true, {}});
  const ScheduleResult b = build_schedule(in, ScheduleOptions{9, true, {}});
  ASSERT_EQ(a.steps.size(), b.steps.size());
  for (std::size_t k = 0; k < a.steps.size(); ++k) {
    EXPECT_EQ(a.steps[k].position_deg, b.steps[k].position_deg) << "step " << k;
  }
  in.settings.search_evaluations = 10;
  const ScheduleResult c = build_schedule(in, ScheduleOptions{9, true, {}});
  EXPECT_EQ(c.steps.size(), a.steps.size());
  EXPECT_LE(c.move_lower_bound_s, measure_move_s(c));
  expect_moves_recomputable(rig, c.steps);
  expect_positions_on_target(rig, in, c.steps);
}
TEST(Schedule, EveryEntryKeepsItsStepWhenEveryMoveCostIsInfinite) {
  // A motor speed of 4.9e-324 deg/s (refused by Campaign::check_consistency, but the scheduler
  // must not rely on that) makes every move cost infinite; the order search used to keep an
  // empty best order then, and the plan lost all its measure steps while claiming to fit.
  Rig rig = make_rig(RigShape{1});
  for (Motor& m : rig.motors) m.speed_deg_per_s = 4.9e-324;
  const ScheduleInput in = make_input(rig, 1, 5, 2, 3);
  try {
    const ScheduleResult r = build_schedule(in, ScheduleOptions{});
    long measures = 0;
    for (const Step& s : r.steps) measures += s.kind == StepKind::measure ? 1 : 0;
    EXPECT_EQ(measures, static_cast<long>(in.entries.size()));
  } catch (const std::invalid_argument& e) {
    // Refusing is as good as planning every entry; an empty plan is not.
    SUCCEED() << e.what();
  }
}
