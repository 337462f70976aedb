// Lower bound on the measure steps' move time, and the exact solver for tiny instances.
//
// Notation. A configuration is a (prepared point, analysed point) pair, or the start positions,
// or the park (initial) positions. c(x -> y) is the true step time (docs/motion-model.md) between
// configurations. For a measure setting s = (p, a) (p != a) the relaxed cost of a move from
// (q, r) is l(q, r -> s) = step_s(join(cP(q, p), cA(r, a))), where cP / cA are the side costs
// of compute_side_costs: per group the cheapest pair of discrete solutions, per motor the angle
// distance modulo the plate period (no range can shorten it, no backlash rule can beat it).
// The joined time (max or sum) of all motors is the join of the two sides' joined times, each
// side is at least its relaxed cost, and step_s (overhead always, settle when anything moved)
// grows with the motor part, so c >= l for every move. Side costs are rounded down to float.
//
// (1) In-costs. Every measure step is entered from exactly one configuration: the start
// positions (first step of the plan), the park positions (after a park step), another measure
// setting, or a reference setting (i, i); a dark step keeps the positions before it. None of
// them is s itself (each entry is measured once, p != a). A configuration (q, r) with q != p and
// r != a costs at least both l(q, a -> s) and l(p, r -> s), since join(x, y) >= x, y. So the move
// into s costs at least in_min(s): the least of l from the start, l from the park positions
// (only when park steps are enabled) and l from every single-side neighbour (q, a), q != p, and
// (p, r), r != a, over ALL points q, r (this covers references (p, p) and (a, a)).
//
// (2) Pairs of moves (the degree-two argument of TSP bounds). Let s_1..s_K be the measure steps
// in schedule order and B the set of k whose next step is not a measure step (a reference,
// dark or park step follows, or k = K); |B| >= 1. For k not in B the move of s_{k+1} is an
// "out" move of s_k. Each measure step's move is counted once as an in-move and at most once as
// an out-move, so 2 M >= sum_k in(s_k) + sum_{k not in B} out(s_k). For k not in B the
// predecessor x and the successor y of s_k are different configurations (y is a measure setting
// of another entry; x is the start, the park positions, a reference, or a third measure step),
// and in(s_k) + out(s_k) >= pair_min(s_k) = min over x != y of l(x -> s_k) + l(s_k -> y). By the
// domination in (1), applied to x and to y (if both would be replaced by the same configuration,
// replace one by its other single-side choice), the minimum is reached with x and y among the
// start, park and single-side neighbours, and then among the two cheapest single-side
// neighbours on each side (in and out separately: costs from below are asymmetric) and the
// start and park positions. With symmetric costs this is the sum of the two cheapest
// neighbours, not twice the cheapest.
//
// (3) Per entry e, with both orientations allowed: I_e = min in_min, P_e = min pair_min; then
// P_e >= I_e. Summing, 2 M >= sum_{e not in B} P_e + sum_{e in B} I_e >= sum_e P_e - D(|B|),
// where D(b) is the sum of the b largest values of P_e - I_e over all entries. Hence
//     M >= max( sum_e I_e,  (sum_e P_e - D(|B|)) / 2 ),
// the first term by (1) alone. The bound holds for every order of the same measure steps, with
// any orientation and solutions, in which at most |B| measure steps are followed by a
// non-measure step or end the plan; build_schedule takes |B| from the realized timeline.
#include <algorithm>
#include <array>
#include <cmath>
#include <functional>
#include <limits>
#include <stdexcept>

#include "schedule_internal.h"

namespace gramline::sched {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

/// A neighbour configuration of a setting (p, a), as a label and a relaxed cost. Labels:
/// side * n + point for a single-side neighbour (the other side stays), -1 start, -2 park.
struct Neighbour {
  int label = -3;
  double cost_s = kInf;
};

/// The two cheapest single-side neighbours of `point` on `side`, moving into it (`into`) or
/// out of it, as relaxed step times.
void two_cheapest(const MoveModel& model, const SideCosts& costs, int side, int point, bool into,
                  Neighbour out[2]) {
  out[0] = out[1] = Neighbour{};
  for (int i = 0; i < costs.n; ++i) {
    if (i == point) continue;
    const double c = model.step_s(into ? costs.at(side, i, point) : costs.at(side, point, i));
    const Neighbour nb{side * costs.n + i, c};
    if (c < out[0].cost_s) {
      out[1] = out[0];
      out[0] = nb;
    } else if (c < out[1].cost_s) {
      out[1] = nb;
    }
  }
}

}  // namespace

BoundTerms bound_terms(const MoveModel& model, const SideCosts& costs) {
  const int n = costs.n;
  const bool park = model.input().settings.park;
  // [side][point][rank]
  std::vector<std::array<Neighbour, 2>> in[2], out[2];
  for (int side = 0; side < 2; ++side) {
    in[side].resize(n);
    out[side].resize(n);
    for (int j = 0; j < n; ++j) {
      two_cheapest(model, costs, side, j, true, in[side][j].data());
      two_cheapest(model, costs, side, j, false, out[side][j].data());
    }
  }
  BoundTerms terms;
  const auto& entries = model.input().entries;
  terms.in_min_s.resize(entries.size());
  terms.pair_min_s.resize(entries.size());
  for (std::size_t e = 0; e < entries.size(); ++e) {
    double best_in = kInf, best_pair = kInf;
    for (int flip = 0; flip < 2; ++flip) {
      const int p = flip ? entries[e].b : entries[e].a;
      const int a = flip ? entries[e].a : entries[e].b;
      Neighbour from[6] = {in[0][p][0], in[0][p][1], in[1][a][0], in[1][a][1]};
      from[4] = Neighbour{-1, model.step_s(model.join(costs.start[0][p], costs.start[1][a]))};
      if (park) {
        from[5] = Neighbour{-2, model.step_s(model.join(costs.park[0][p], costs.park[1][a]))};
      }
      const Neighbour to[4] = {out[0][p][0], out[0][p][1], out[1][a][0], out[1][a][1]};
      double in_min = kInf, pair_min = kInf;
      for (const Neighbour& x : from) {
        in_min = std::min(in_min, x.cost_s);
        for (const Neighbour& y : to) {
          if (x.label != y.label) pair_min = std::min(pair_min, x.cost_s + y.cost_s);
        }
      }
      best_in = std::min(best_in, in_min);
      best_pair = std::min(best_pair, pair_min);
    }
    // Two points leave no distinct successor only in degenerate inputs; then use (1) alone.
    terms.in_min_s[e] = best_in;
    terms.pair_min_s[e] = std::isfinite(best_pair) ? std::max(best_pair, best_in) : best_in;
  }
  return terms;
}

double measure_lower_bound_s(const BoundTerms& terms, long breaks) {
  double in_sum = 0.0, pair_sum = 0.0;
  std::vector<double> excess(terms.in_min_s.size());
  for (std::size_t e = 0; e < excess.size(); ++e) {
    in_sum += terms.in_min_s[e];
    pair_sum += terms.pair_min_s[e];
    excess[e] = terms.pair_min_s[e] - terms.in_min_s[e];
  }
  const std::size_t b = std::min<std::size_t>(std::max(breaks, 1L), excess.size());
  std::nth_element(excess.begin(), excess.begin() + b, excess.end(), std::greater<double>());
  double dropped = 0.0;
  for (std::size_t k = 0; k < b; ++k) dropped += excess[k];
  return std::max(in_sum, 0.5 * (pair_sum - dropped));
}

}  // namespace gramline::sched

namespace gramline::sched {

double exact_work(const MoveModel& model) {
  const double n = static_cast<double>(model.input().entries.size());
  const double S = n * 2.0 * static_cast<double>(1 << model.groups());
  return std::ldexp(S * S, static_cast<int>(n));
}

double exact_order(const MoveModel& model, std::vector<Code>* order_out) {
  const ScheduleInput& input = model.input();
  const int n = static_cast<int>(input.entries.size());
  if (order_out) order_out->clear();
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
      t0 = model.join(t0, model.group_from_s(g, model.start_deg(),
                                             model.target(point(u, g), g, ((u % K) >> g) & 1)));
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
  std::vector<int> parent(order_out ? subsets * S : 0, -1);
  for (int u = 0; u < S; ++u) dp[(std::size_t(1) << (u / per_entry)) * S + u] = first[u];
  for (std::size_t set = 1; set < subsets; ++set) {
    for (int u = 0; u < S; ++u) {
      const double here = dp[set * S + u];
      if (here == inf) continue;
      for (int w = 0; w < S; ++w) {
        const std::size_t bit = std::size_t(1) << (w / per_entry);
        if (set & bit) continue;
        double& to = dp[(set | bit) * S + w];
        const double t = here + edge[std::size_t(u) * S + w];
        if (t < to) {
          to = t;
          if (order_out) parent[(set | bit) * S + w] = u;
        }
      }
    }
  }
  int end = 0;
  for (int u = 1; u < S; ++u) {
    if (dp[(subsets - 1) * S + u] < dp[(subsets - 1) * S + end]) end = u;
  }
  const double best = dp[(subsets - 1) * S + end];
  if (order_out) {
    std::size_t set = subsets - 1;
    for (int u = end; u >= 0;) {
      order_out->push_back(make_code(u / per_entry, (u / K) % 2 != 0));
      const int prev = parent[set * S + u];
      set &= ~(std::size_t(1) << (u / per_entry));
      u = prev;
    }
    std::reverse(order_out->begin(), order_out->end());
  }
  return best;
}

}  // namespace gramline::sched

namespace gramline {

double exact_min_move_s(const ScheduleInput& input) {
  const sched::MoveModel model(input);
  if (sched::has_ranged_motor(model)) {
    return sched::exact_ranged_order(model, sched::ConfigModel(model), nullptr);
  }
  return sched::exact_order(model, nullptr);
}

}  // namespace gramline

// Held-Karp 1-tree bound (Held and Karp 1970/71, Lagrangian relaxation with subgradient steps)
// on the relaxed costs, with each entry's orientation relaxed.
//
// Argument. Take the measure steps s_1..s_K of any order with at most b runs (b = |B| above;
// a run ends where a reference, dark or park step follows or the plan ends). Build a graph on
// the K entries plus a hub node h:
//   - entry-entry edge weight w(e, f) = the least relaxed step time between e and f over both
//     orientations of each and both directions; the true move between consecutive measure steps
//     of a run is at least l of their actual orientations in their actual direction, so >= w;
//   - hub edge weight in_min(e) (term (1) above): every run's first step is entered from the
//     start, the park positions, a reference setting or the positions a dark step kept, all
//     covered by in_min.
// The order's measure move time M is at least the weight of the graph H made of the hub edges to
// each run's first entry and the edges along each run. H is a spanning tree of the K + 1 nodes
// (K edges, connected through the hub) in which the hub has degree r <= b and every entry has
// degree at most 2. For multipliers pi_e >= 0 and lambda >= 0,
//   w(H) >= w(H) + sum_e pi_e (deg_H(e) - 2) + lambda (r - b)
//        >= min over spanning trees T of [ w(T) + sum_e pi_e (deg_T(e) - 2) + lambda (deg_T(h) - b)
//        ],
// since each added term is <= 0 for H and H is one of the trees T. The minimum is a minimum
// spanning tree under the weights w(e, f) + pi_e + pi_f and in_min(e) + pi_e + lambda, minus
// 2 sum pi + lambda b. Any multipliers give a valid bound; subgradient steps (deg - 2 for
// entries, deg(h) - b for the hub, projected onto >= 0) search for a large one and the best
// value seen is kept. Weights are rounded down to float, so they stay lower bounds.
namespace gramline::sched {

double tree_lower_bound_s(const MoveModel& model, const SideCosts& costs, const BoundTerms& terms,
                          long breaks, double upper_s, const WorkHooks& hooks) {
  const auto& entries = model.input().entries;
  const int K = static_cast<int>(entries.size());
  if (K < 2 || K > kTreeBoundMaxSettings) return 0.0;
  const long b = std::clamp<long>(breaks, 1, K);
  const std::size_t k = static_cast<std::size_t>(K);
  std::vector<float> w(k * k, 0.0f);
  for (int e = 0; e < K; ++e) {
    if ((e & 63) == 0) hooks.throw_if_cancelled();
    for (int f = e + 1; f < K; ++f) {
      double best = kInf;
      for (int oe = 0; oe < 2; ++oe) {
        for (int of = 0; of < 2; ++of) {
          const Code ce = make_code(e, oe != 0), cf = make_code(f, of != 0);
          best = std::min(
              {best, relaxed_step_s(model, costs, ce, cf), relaxed_step_s(model, costs, cf, ce)});
        }
      }
      float x = static_cast<float>(best);
      if (static_cast<double>(x) > best) x = std::nextafter(x, 0.0f);
      w[e * k + f] = w[f * k + e] = x;
    }
  }
  std::vector<double> pi(k, 0.0), key(k + 1);
  std::vector<int> parent(k + 1), degree(k + 1);
  std::vector<char> in_tree(k + 1);
  double lambda = 0.0;
  double best_bound = 0.0;
  double mu = 2.0;
  int since_improved = 0;
  const int iterations = K <= 200 ? 300 : 50;
  for (int it = 0; it < iterations; ++it) {
    hooks.throw_if_cancelled();
    // Prim's algorithm over the hub (index K) and the entries, dense weights.
    std::fill(in_tree.begin(), in_tree.end(), 0);
    std::fill(degree.begin(), degree.end(), 0);
    double total = 0.0;
    in_tree[K] = 1;
    for (int e = 0; e < K; ++e) {
      key[e] = terms.in_min_s[e] + pi[e] + lambda;
      parent[e] = K;
    }
    for (int added = 0; added < K; ++added) {
      int next = -1;
      for (int e = 0; e < K; ++e) {
        if (!in_tree[e] && (next < 0 || key[e] < key[next])) next = e;
      }
      in_tree[next] = 1;
      total += key[next];
      ++degree[next];
      ++degree[parent[next]];
      const float* row = &w[std::size_t(next) * k];
      for (int e = 0; e < K; ++e) {
        if (in_tree[e]) continue;
        const double c = row[e] + pi[next] + pi[e];
        if (c < key[e]) {
          key[e] = c;
          parent[e] = next;
        }
      }
    }
    double pi_sum = 0.0;
    for (double p : pi) pi_sum += p;
    const double bound = total - 2.0 * pi_sum - lambda * static_cast<double>(b);
    if (bound > best_bound + 1e-9 * std::abs(bound)) {
      best_bound = bound;
      since_improved = 0;
    } else if (++since_improved >= 10) {
      mu *= 0.5;
      since_improved = 0;
    }
    double norm = 0.0;
    for (int e = 0; e < K; ++e) {
      const double g = degree[e] - 2.0;
      if (g > 0.0 || pi[e] > 0.0) norm += g * g;
    }
    const double gh = static_cast<double>(degree[K] - b);
    if (gh > 0.0 || lambda > 0.0) norm += gh * gh;
    if (norm == 0.0 || mu < 1e-4 || !(upper_s > bound)) break;
    const double step = mu * (upper_s - bound) / norm;
    for (int e = 0; e < K; ++e) pi[e] = std::max(0.0, pi[e] + step * (degree[e] - 2.0));
    lambda = std::max(0.0, lambda + step * gh);
  }
  // Sums of many rounded terms: give back a relative millionth so rounding can never lift it.
  return std::max(0.0, best_bound * (1.0 - 1e-6));
}

}  // namespace gramline::sched
