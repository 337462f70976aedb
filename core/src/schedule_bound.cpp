// Lower bound on the measure steps' move time, and the exact solver for tiny instances.
//
// Why the bound holds. Every measure step s (prepare p, analyse a) is entered from exactly one
// configuration: the initial positions (first step of a night, also after a park), another
// measure step, a reference step (a diagonal setting i/i) or a dark step (which keeps the
// positions of whatever came before it). Whatever it is, its prepared point q and analysed
// point r cannot both equal p and a (each entry is measured once, and p != a), so:
//  - if q = p, the analysis side changes, and the joined motor time is at least the cheapest
//    analysis move into a from any other point, nnA(a);
//  - if r = a, likewise at least nnP(p);
//  - otherwise both sides change and the joined time (max or sum) is at least either one;
//  - from the initial positions it is the move from there.
// Each side's cost is itself a lower bound: every group (one stage of one photon) takes its
// cheapest pair of discrete solutions, and every motor its angle distance modulo the plate
// period, which no range can shorten. The step time (settle if moved, overhead always) grows
// with the joined motor time, so summing the per-step minima over the cheaper orientation of
// each entry bounds any order, with any reference, dark or park steps interleaved.
#include <algorithm>
#include <limits>
#include <stdexcept>

#include "schedule_internal.h"

namespace gramline::sched {

double measure_lower_bound_s(const MoveModel& model, const SideCosts& costs) {
  const int n = costs.n;
  std::vector<double> nn[2];
  for (int side = 0; side < 2; ++side) {
    nn[side].assign(n, std::numeric_limits<double>::infinity());
    for (int j = 0; j < n; ++j) {
      for (int i = 0; i < n; ++i) {
        if (i != j) nn[side][j] = std::min(nn[side][j], costs.at(side, i, j));
      }
    }
  }
  double total = 0.0;
  for (const EntryRequest& e : model.input().entries) {
    double best = std::numeric_limits<double>::infinity();
    for (int flip = 0; flip < 2; ++flip) {
      const int p = flip ? e.b : e.a;
      const int a = flip ? e.a : e.b;
      double c = std::min(nn[0][p], nn[1][a]);
      c = std::min(c, model.join(costs.initial[0][p], costs.initial[1][a]));
      best = std::min(best, model.step_s(c));
    }
    total += best;
  }
  return total;
}

}  // namespace gramline::sched

namespace gramline {

double exact_min_move_s(const ScheduleInput& input) {
  using namespace sched;
  const MoveModel model(input);
  const int n = static_cast<int>(input.entries.size());
  if (n == 0) return 0.0;
  if (n > 12) throw std::invalid_argument("exact_min_move_s: at most 12 entries");
  const int G = model.groups();
  const int K = 1 << G;
  // State: entry, orientation, joint solution mask.
  const int per_entry = 2 * K;
  const int S = n * per_entry;
  auto point = [&](int state, int g) {
    return model.group_point(make_code(state / per_entry, (state / K) % 2 != 0), g);
  };
  std::vector<double> edge(std::size_t(S) * S), first(S);
  for (int u = 0; u < S; ++u) {
    double t0 = 0.0;
    for (int g = 0; g < G; ++g) {
      t0 = model.join(
          t0, model.group_from_initial_s(g, model.target(point(u, g), g, ((u % K) >> g) & 1)));
    }
    first[u] = model.step_s(t0);
    for (int w = 0; w < S; ++w) {
      double t = 0.0;
      for (int g = 0; g < G; ++g) {
        t = model.join(t, model.group_s(g, model.target(point(u, g), g, ((u % K) >> g) & 1),
                                        model.target(point(w, g), g, ((w % K) >> g) & 1)));
      }
      edge[std::size_t(u) * S + w] = model.step_s(t);
    }
  }
  const double inf = std::numeric_limits<double>::infinity();
  const std::size_t subsets = std::size_t(1) << n;
  std::vector<double> dp(subsets * S, inf);
  for (int u = 0; u < S; ++u) dp[(std::size_t(1) << (u / per_entry)) * S + u] = first[u];
  for (std::size_t set = 1; set < subsets; ++set) {
    for (int u = 0; u < S; ++u) {
      const double here = dp[set * S + u];
      if (here == inf) continue;
      for (int w = 0; w < S; ++w) {
        const std::size_t bit = std::size_t(1) << (w / per_entry);
        if (set & bit) continue;
        double& to = dp[(set | bit) * S + w];
        to = std::min(to, here + edge[std::size_t(u) * S + w]);
      }
    }
  }
  double best = inf;
  for (int u = 0; u < S; ++u) best = std::min(best, dp[(subsets - 1) * S + u]);
  return best;
}

}  // namespace gramline
