// Scheduler benchmark: prints planning wall time, peak memory, and the measure steps' move
// time against the row-by-row order and against the proven lower bound; also the whole planner
// (plan_campaign) on the demo. Not a test.
#include <sys/resource.h>

#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <random>
#include <string>

#include "gramline/demo.h"
#include "gramline/plan.h"
#include "gramline/schedule.h"
#include "gramline/waveplates.h"

using namespace gramline;

namespace {

double unit(std::mt19937_64& rng) { return static_cast<double>(rng() >> 11) * 0x1.0p-53; }

PointTargets targets_of(const EncodingMap& enc, const Eigen::VectorXd& x) {
  PointTargets t;
  for (int p = 0; p < enc.photon_count(); ++p) {
    const BlochAngles b = enc.angles(p, x);
    t.prep.push_back(preparation_solutions(b.theta_deg, b.phi_deg));
    t.analysis.push_back(analysis_solutions(b.theta_deg, b.phi_deg));
  }
  return t;
}

/// Demo rig and encoding; the demo's own points, or `train`/`test` uniform random points.
ScheduleInput make_input(const Campaign& c, int train, int test) {
  ScheduleInput in;
  in.rig = &c.rig;
  Eigen::MatrixXd xs(train + test, 2);
  if (train == c.data.train_count() && test == c.data.test_count()) {
    xs << c.data.train, c.data.test;
  } else {
    std::mt19937_64 rng(11);
    for (int i = 0; i < xs.rows(); ++i) xs.row(i) << unit(rng), unit(rng);
  }
  for (int i = 0; i < xs.rows(); ++i) in.points.push_back(targets_of(c.encoding, xs.row(i)));
  in.train_count = train;
  auto entry = [&](int a, int b, Block block) {
    EntryRequest e;
    e.a = a;
    e.b = b;
    e.block = block;
    e.kernel_ideal = 0.5;
    e.p_pass = 0.5;
    e.pairs = 20000.0;
    e.dwell_s = 2.0;
    in.entries.push_back(e);
  };
  for (int a = 0; a < train; ++a)
    for (int b = a + 1; b < train; ++b) entry(a, b, Block::train);
  for (int t = 0; t < test; ++t)
    for (int b = 0; b < train; ++b) entry(train + t, b, Block::test);
  in.pair_detect_rate_per_s = 10000.0;
  in.reference_pairs = 20000.0;
  in.nights = c.nights;
  in.nights.max_nights = 1000;
  in.settings = c.schedule;
  return in;
}

double peak_rss_mb() {
  rusage ru{};
  getrusage(RUSAGE_SELF, &ru);
  return ru.ru_maxrss / 1024.0;  // kilobytes on Linux; the peak of the whole process so far
}

double ms_since(std::chrono::steady_clock::time_point t0) {
  return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
}

void print_figures(const char* name, long settings, double wall_ms, double move_s, double naive_s,
                   double bound_s, int nights) {
  std::printf(
      "%-10s settings %7ld  wall %9.1f ms  peak RSS %7.1f MB  nights %d\n"
      "           measure moves %10.0f s  naive %10.0f s (%.2fx)  bound %10.0f s (gap %.1f %%)\n",
      name, settings, wall_ms, peak_rss_mb(), nights, move_s, naive_s, naive_s / move_s, bound_s,
      100.0 * (move_s / bound_s - 1.0));
  std::fflush(stdout);
}

void run(const char* name, const Campaign& c, int train, int test) {
  const ScheduleInput in = make_input(c, train, test);
  const auto t0 = std::chrono::steady_clock::now();
  const ScheduleResult r = build_schedule(in, ScheduleOptions{});
  const double wall_ms = ms_since(t0);
  double move = 0.0;
  long settings = 0;
  for (const Step& s : r.steps) {
    if (s.kind == StepKind::measure) {
      move += s.move_s;
      ++settings;
    }
  }
  print_figures(name, settings, wall_ms, move, r.move_naive_s, r.move_lower_bound_s, r.nights);
  std::printf("           1-tree bound %10.0f s, bound time %.1f ms (inside wall)\n",
              r.move_tree_bound_s, r.bound_ms);
}

/// The whole planner on the demo campaign, as the app and the CLI call it.
void run_plan(const Campaign& c) {
  const auto t0 = std::chrono::steady_clock::now();
  const Plan plan = plan_campaign(c);
  const double wall_ms = ms_since(t0);
  const PlanSummary& s = plan.summary;
  std::printf(
      "demo plan  plan_ms %.1f (summary), bound_ms %.1f, then gram_error_ms %.1f, wall %.1f ms\n",
      s.plan_ms, s.bound_ms, s.gram_error_ms, wall_ms);
  print_figures("demo plan", s.settings, wall_ms, s.measure_move_s, s.move_naive_s,
                s.move_lower_bound_s, s.nights);
}

}  // namespace

// bench_schedule [N [T]]: the demo and 200 training points; with N also N training points (and T
// test points); `bench_schedule sweep` runs 25 to 1000 training points instead.
int main(int argc, char** argv) {
  long largest = 0, tests = 0;
  if (argc > 3) {
    std::fprintf(stderr, "usage: bench_schedule [N [T]] | sweep\n");
    return 2;
  }
  if (argc == 2 && std::string(argv[1]) == "sweep") {
    const Campaign demo = make_demo_campaign();
    for (int n : {25, 50, 100, 200, 400, 700, 1000}) {
      const std::string name = "n=" + std::to_string(n);
      run(name.c_str(), demo, n, 0);
    }
    return 0;
  }
  for (int a = 1; a < argc; ++a) {
    char* end = nullptr;
    const long v = std::strtol(argv[a], &end, 10);
    const long low = a == 1 ? 2 : 0;
    if (*argv[a] == '\0' || *end != '\0' || v < low || v > 10000) {
      std::fprintf(stderr,
                   "bench_schedule: %s must be a whole number from %ld to 10000, not '%s'\n",
                   a == 1 ? "N" : "T", low, argv[a]);
      return 2;
    }
    (a == 1 ? largest : tests) = v;
  }
  const Campaign demo = make_demo_campaign();
  run_plan(demo);
  run("demo", demo, demo.data.train_count(), demo.data.test_count());
  run("n=200", demo, 200, 20);
  if (largest > 0) {
    const std::string name = "n=" + std::to_string(largest);
    run(name.c_str(), demo, static_cast<int>(largest), static_cast<int>(tests));
  }
  return 0;
}
