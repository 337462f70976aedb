// Ordering optimizer. The structure of the problem does most of the work: the preparation
// motors depend only on the prepared point and the analysis motors only on the analysed one,
// so holding one point on one side while the other side sweeps a short tour of points makes
// almost every step a move between two neighbouring points on one side only. The tour is
// improved with 2-opt and Or-opt (published local search for the travelling salesman problem).
#include <algorithm>
#include <chrono>
#include <cmath>
#include <limits>
#include <random>

#include "schedule_internal.h"

namespace gramline::sched {
namespace {

using Clock = std::chrono::steady_clock;

struct Budget {
  const WorkHooks* hooks;
  Clock::time_point deadline;
  bool capped;
  bool expired() const {
    hooks->throw_if_cancelled();
    return capped && Clock::now() > deadline;
  }
};

/// Open path over `nodes` minimising the sum of symmetric weights w[i * n + j] (indices into
/// `nodes`): nearest-neighbour construction, then 2-opt and Or-opt until no move improves.
std::vector<int> improve_path(int n, const std::vector<float>& w, int start, const Budget& budget) {
  std::vector<int> path;
  if (n == 0) return path;
  std::vector<char> used(n, 0);
  path.push_back(start);
  used[start] = 1;
  for (int k = 1; k < n; ++k) {
    const int last = path.back();
    int best = -1;
    for (int j = 0; j < n; ++j) {
      if (!used[j] && (best < 0 || w[std::size_t(last) * n + j] < w[std::size_t(last) * n + best]))
        best = j;
    }
    used[best] = 1;
    path.push_back(best);
  }
  auto W = [&](int a, int b) -> double {
    if (a < 0 || b < 0) return 0.0;
    return w[std::size_t(path[a]) * n + path[b]];
  };
  // Weights are symmetric, so every accepted move strictly lowers the path; the pass cap
  // only guards against rounding.
  const double eps = 1e-6;
  bool improved = true;
  for (int pass = 0; improved && pass < 10000; ++pass) {
    improved = false;
    if (budget.expired()) break;
    // 2-opt on an open path: reverse path[i..j].
    for (int i = 0; i < n - 1; ++i) {
      for (int j = i + 1; j < n; ++j) {
        const int before = i - 1;
        const int after = j + 1 < n ? j + 1 : -1;
        const double old_cost = W(before, i) + W(j, after);
        double new_cost = 0.0;
        if (before >= 0) new_cost += w[std::size_t(path[before]) * n + path[j]];
        if (after >= 0) new_cost += w[std::size_t(path[i]) * n + path[after]];
        if (new_cost < old_cost - eps) {
          std::reverse(path.begin() + i, path.begin() + j + 1);
          improved = true;
        }
      }
    }
    // Or-opt: move a segment of 1 to 3 points elsewhere, either way round.
    for (int len = 1; len <= 3; ++len) {
      for (int i = 0; i + len <= n; ++i) {
        const int j = i + len - 1;
        const int before = i - 1;
        const int after = j + 1 < n ? j + 1 : -1;
        double removed = W(before, i) + W(j, after);
        if (before >= 0 && after >= 0) removed -= W(before, after);
        if (removed <= eps) continue;
        // Try inserting between positions p and p+1 (p = -1: at the front; p = n-1: at the end).
        int best_p = -2;
        bool best_rev = false;
        double best_gain = eps;
        for (int p = -1; p < n; ++p) {
          if (p >= before && p <= j) continue;
          const int q = p + 1 < n ? p + 1 : -1;
          const int qq = (q >= i && q <= j) ? (after) : q;
          double base = 0.0;
          if (p >= 0 && qq >= 0) base = W(p, qq);
          for (int rev = 0; rev < 2; ++rev) {
            const int first = rev ? j : i;
            const int last = rev ? i : j;
            double added = -base;
            if (p >= 0) added += W(p, first);
            if (qq >= 0) added += W(last, qq);
            const double gain = removed - added;
            if (gain > best_gain) {
              best_gain = gain;
              best_p = p;
              best_rev = rev != 0;
            }
          }
        }
        if (best_p == -2) continue;
        std::vector<int> seg(path.begin() + i, path.begin() + j + 1);
        if (best_rev) std::reverse(seg.begin(), seg.end());
        std::vector<int> rest;
        rest.reserve(n);
        int insert_at = 0;
        for (int k = 0; k < n; ++k) {
          if (k >= i && k <= j) continue;
          rest.push_back(path[k]);
          if (k == best_p) insert_at = static_cast<int>(rest.size());
        }
        rest.insert(rest.begin() + insert_at, seg.begin(), seg.end());
        path.swap(rest);
        improved = true;
      }
    }
  }
  return path;
}

struct Layout {
  const MoveModel& model;
  std::vector<int> entry_of;  // [u * n + w], unordered, -1 when the pair is not measured
  int n;
  Layout(const MoveModel& m) : model(m), n(m.points()) {
    entry_of.assign(std::size_t(n) * n, -1);
    const auto& entries = m.input().entries;
    for (std::size_t e = 0; e < entries.size(); ++e) {
      entry_of[std::size_t(entries[e].a) * n + entries[e].b] = static_cast<int>(e);
      entry_of[std::size_t(entries[e].b) * n + entries[e].a] = static_cast<int>(e);
    }
  }
};

/// Lays the cells out: rows hold `row_side`'s point fixed while the other side sweeps the
/// training tour back and forth.
std::vector<Code> sweep_order(const Layout& layout, int row_side, const std::vector<int>& tour,
                              const std::vector<int>& test_tour, bool truncation_safe,
                              const SideCosts& costs) {
  const MoveModel& model = layout.model;
  const auto& entries = model.input().entries;
  std::vector<char> used(entries.size(), 0);
  std::vector<Code> order;
  order.reserve(entries.size());
  int last_sweep = -1;
  auto add = [&](int row_point, int sweep_point) {
    const int e = layout.entry_of[std::size_t(row_point) * layout.n + sweep_point];
    if (e < 0 || used[e]) return;
    used[e] = 1;
    const int prep = row_side == 0 ? row_point : sweep_point;
    order.push_back(make_code(e, entries[e].a != prep));
    last_sweep = sweep_point;
  };
  const int N = static_cast<int>(tour.size());
  if (!truncation_safe) {
    for (int k = 0; k + 1 < N; ++k) {
      if (k % 2 == 0) {
        for (int m = k + 1; m < N; ++m) add(tour[k], tour[m]);
      } else {
        for (int m = N - 1; m > k; --m) add(tour[k], tour[m]);
      }
    }
  } else {
    for (int k = 1; k < N; ++k) {
      if (k % 2 == 0) {
        for (int m = 0; m < k; ++m) add(tour[k], tour[m]);
      } else {
        for (int m = k - 1; m >= 0; --m) add(tour[k], tour[m]);
      }
    }
  }
  const int sweep_side = 1 - row_side;
  for (int t : test_tour) {
    bool forward = true;
    if (last_sweep >= 0 && N > 0) {
      forward = costs.at(sweep_side, last_sweep, tour.front()) <=
                costs.at(sweep_side, last_sweep, tour.back());
    }
    if (forward) {
      for (int m = 0; m < N; ++m) add(t, tour[m]);
    } else {
      for (int m = N - 1; m >= 0; --m) add(t, tour[m]);
    }
  }
  // Entries outside the row/sweep pattern (should there be any) go last, in their input order.
  for (std::size_t e = 0; e < entries.size(); ++e) {
    if (!used[e]) order.push_back(make_code(static_cast<int>(e), false));
  }
  return order;
}

/// Multi-start local search on an order's exact cost (`exact_cost`: solutions, and on ranged rigs
/// positions, chosen optimally for the order), for tiny instances. Stops after `max_evaluations`
/// evaluations of the cost, so that a seed gives the same order on any machine.
template <typename Cost>
std::vector<Code> small_search(std::vector<Code> start, std::uint64_t seed, const Budget& budget,
                               const Cost& exact_cost, long max_evaluations) {
  std::mt19937_64 rng(seed);
  const int n = static_cast<int>(start.size());
  std::vector<Code> best = start;
  double best_cost = exact_cost(best);
  long evaluations = 1;
  const double eps = 1e-12;
  for (int restart = 0; restart < 400 && evaluations < max_evaluations; ++restart) {
    std::vector<Code> cur = start;
    if (restart > 0) {
      std::shuffle(cur.begin(), cur.end(), rng);
      for (Code& c : cur) c = make_code(code_entry(c), (rng() & 1u) != 0);
    }
    double cur_cost = exact_cost(cur);
    ++evaluations;
    bool improved = true;
    while (improved && evaluations < max_evaluations) {
      improved = false;
      if (budget.expired()) break;
      auto try_order = [&](std::vector<Code>& cand) {
        ++evaluations;
        const double c = exact_cost(cand);
        if (c < cur_cost - eps) {
          cur.swap(cand);
          cur_cost = c;
          improved = true;
        }
      };
      for (int i = 0; i < n; ++i) {
        std::vector<Code> cand = cur;
        cand[i] ^= 1u;
        try_order(cand);
      }
      for (int i = 0; i < n; ++i) {
        for (int j = 0; j < n; ++j) {
          if (i == j) continue;
          for (int flip = 0; flip < 2; ++flip) {
            std::vector<Code> cand = cur;
            Code c = cand[i] ^ static_cast<Code>(flip);
            cand.erase(cand.begin() + i);
            cand.insert(cand.begin() + j, c);
            try_order(cand);
          }
        }
      }
      for (int i = 0; i < n; ++i) {
        for (int j = i + 1; j < n; ++j) {
          std::vector<Code> cand = cur;
          std::reverse(cand.begin() + i, cand.begin() + j + 1);
          try_order(cand);
        }
      }
    }
    if (cur_cost < best_cost - eps) {
      best = cur;
      best_cost = cur_cost;
    }
  }
  return best;
}

/// Or-opt over the whole sequence of settings (relaxed step costs, which may be asymmetric): a
/// run of 1 to 3 consecutive settings moves next to a setting that shares one of its points on
/// one side and sits near it on the other, in either direction and with or without turning every
/// setting of the run round. The sequence is a doubly linked list over entries, so a move costs
/// O(1) whatever the distance it spans, and a queue of "don't-look" bits revisits only the
/// settings next to a change. Every candidate counts as one evaluation; the search stops when no
/// move improves or after `max_evaluations`, so the result depends on the input alone, never on
/// the machine's speed, and there is no size above which it is switched off.
void or_opt_sequence(const MoveModel& model, const SideCosts& costs, const Layout& layout,
                     std::vector<Code>& order, const Budget& budget, long max_evaluations) {
  const int n = costs.n;
  const int K = static_cast<int>(order.size());
  if (K < 3) return;
  constexpr int kNear = 6;
  std::vector<int> near[2];
  for (int side = 0; side < 2; ++side) {
    near[side].assign(std::size_t(n) * kNear, -1);
    std::vector<std::pair<float, int>> row;
    for (int j = 0; j < n; ++j) {
      row.clear();
      for (int i = 0; i < n; ++i) {
        if (i != j) row.push_back({costs.at(side, i, j) + costs.at(side, j, i), i});
      }
      const int k = std::min<int>(kNear, static_cast<int>(row.size()));
      std::partial_sort(row.begin(), row.begin() + k, row.end());
      for (int m = 0; m < k; ++m) near[side][std::size_t(j) * kNear + m] = row[m].second;
    }
  }
  const auto& entries = model.input().entries;
  const int E = static_cast<int>(entries.size());
  // The points of every code, looked up once: this loop runs the cost many millions of times.
  std::vector<int> prep_of(2 * entries.size()), ana_of(2 * entries.size());
  for (int e = 0; e < E; ++e) {
    for (int flip = 0; flip < 2; ++flip) {
      const Code c = make_code(e, flip != 0);
      prep_of[c] = model.prep_point(c);
      ana_of[c] = model.analysis_point(c);
    }
  }
  // Linked list over entries (-1: none); code[e] holds the entry's orientation. Entries missing
  // from the order (none in practice) stay out of the list.
  std::vector<int> succ(E, -1), pred(E, -1);
  std::vector<Code> code(E, 0);
  std::vector<char> listed(E, 0);
  for (int k = 0; k < K; ++k) {
    const int e = code_entry(order[k]);
    code[e] = order[k];
    listed[e] = 1;
    pred[e] = k > 0 ? code_entry(order[k - 1]) : -1;
    succ[e] = k + 1 < K ? code_entry(order[k + 1]) : -1;
  }
  int head = code_entry(order[0]);
  const std::size_t nn = static_cast<std::size_t>(n);
  const float* cost_p = costs.cost[0].data();
  const float* cost_a = costs.cost[1].data();
  // Same value as relaxed_step_s / relaxed_first_step_s.
  auto step_codes = [&](Code from, Code to) {
    return model.step_s(model.join(cost_p[prep_of[from] * nn + prep_of[to]],
                                   cost_a[ana_of[from] * nn + ana_of[to]]));
  };
  // Step cost into `to` from entry `from_e` (-1: the start positions).
  auto step = [&](int from_e, Code to) {
    return from_e < 0 ? relaxed_first_step_s(model, costs, to) : step_codes(code[from_e], to);
  };
  const double eps = 1e-7;
  const double overhead_s = model.step_s(0.0);
  std::vector<char> queued(E, 0);
  std::vector<int> queue;
  queue.reserve(K);
  for (int k = 0; k < K; ++k) {
    queue.push_back(code_entry(order[k]));
    queued[code_entry(order[k])] = 1;
  }
  auto wake = [&](int e) {
    if (e >= 0 && !queued[e]) {
      queued[e] = 1;
      queue.push_back(e);
    }
  };
  long evaluations = 0;
  std::size_t front = 0;
  int seg[3];
  Code placed[3];
  while (front < queue.size() && evaluations < max_evaluations) {
    if ((front & 4095) == 0 && budget.expired()) break;
    const int h = queue[front++];
    queued[h] = 0;
    for (int len = 1; len <= 3; ++len) {
      // The run h .. t of `len` entries.
      seg[0] = h;
      bool whole = true;
      for (int m = 1; m < len; ++m) {
        seg[m] = succ[seg[m - 1]];
        if (seg[m] < 0) whole = false;
        if (!whole) break;
      }
      if (!whole) break;
      const int t = seg[len - 1];
      const int before = pred[h];
      const int after = succ[t];
      double inner = 0.0;
      for (int m = 0; m + 1 < len; ++m) inner += step_codes(code[seg[m]], code[seg[m + 1]]);
      double removed = step(before, code[h]) + inner;
      if (after >= 0) removed += step_codes(code[t], code[after]) - step(before, code[after]);
      // Inserting a run usually costs at least one more step overhead: skip hopeless cuts.
      if (removed <= eps + overhead_s) continue;
      double best_gain = eps;
      int best_x = -2;  // insert after this entry (-1: at the front)
      int best_variant = 0;
      auto in_run = [&](int e) {
        for (int m = 0; m < len; ++m)
          if (seg[m] == e) return true;
        return false;
      };
      // Variant bit 0: reversed run; bit 1: every setting turned round.
      auto variant_codes = [&](int variant) {
        for (int m = 0; m < len; ++m) {
          const int src = (variant & 1) ? seg[len - 1 - m] : seg[m];
          placed[m] = (variant & 2) ? code[src] ^ 1u : code[src];
        }
      };
      const int variants = len == 1 ? 2 : 4;
      for (int variant = 0; variant < variants; ++variant) {
        const int v = len == 1 ? variant * 2 : variant;
        variant_codes(v);
        double inner_v = 0.0;
        for (int m = 0; m + 1 < len; ++m) inner_v += step_codes(placed[m], placed[m + 1]);
        auto consider = [&](int x) {
          if (x == before || (x >= 0 && in_run(x))) return;
          ++evaluations;
          const int sx = x < 0 ? head : succ[x];
          double added = step(x, placed[0]) + inner_v;
          if (sx >= 0) added += step_codes(placed[len - 1], code[sx]) - step(x, code[sx]);
          const double gain = removed - added;
          if (gain > best_gain) {
            best_gain = gain;
            best_x = x;
            best_variant = v;
          }
        };
        for (int end = 0; end < 2; ++end) {
          const Code c = end == 0 ? placed[0] : placed[len - 1];
          const int p = prep_of[c];
          const int a = ana_of[c];
          for (int side = 0; side < 2; ++side) {
            const int keep = side == 0 ? a : p;  // the point that stays
            const int moved = side == 0 ? p : a;
            for (int m = 0; m < kNear; ++m) {
              const int other = near[side][std::size_t(moved) * kNear + m];
              if (other < 0 || other == keep) continue;
              const int e = layout.entry_of[std::size_t(keep) * n + other];
              if (e < 0 || !listed[e] || in_run(e)) continue;
              // The first setting of the run next after the neighbour, the last one before it.
              if (end == 0) consider(e);
              if (end == 1) consider(pred[e]);
            }
          }
        }
      }
      if (best_x == -2) continue;
      variant_codes(best_variant);
      // Unlink the run.
      if (before >= 0)
        succ[before] = after;
      else
        head = after;
      if (after >= 0) pred[after] = before;
      // Relink it after best_x, in its new direction and orientation.
      int ids[3];
      for (int m = 0; m < len; ++m) {
        ids[m] = code_entry(placed[m]);
        code[ids[m]] = placed[m];
      }
      const int sx = best_x < 0 ? head : succ[best_x];
      for (int m = 0; m < len; ++m) {
        pred[ids[m]] = m == 0 ? best_x : ids[m - 1];
        succ[ids[m]] = m + 1 < len ? ids[m + 1] : sx;
      }
      if (best_x >= 0)
        succ[best_x] = ids[0];
      else
        head = ids[0];
      if (sx >= 0) pred[sx] = ids[len - 1];
      // Don't-look bits: look again around every place that changed.
      for (int m = 0; m < len; ++m) wake(ids[m]);
      wake(before);
      wake(after);
      wake(best_x);
      wake(sx);
      if (before >= 0) wake(pred[before]);
      if (best_x >= 0) wake(pred[best_x]);
      break;
    }
  }
  order.clear();
  for (int e = head; e >= 0; e = succ[e]) order.push_back(code[e]);
  for (int e = 0; e < E; ++e) {
    if (!listed[e]) order.push_back(make_code(e, false));
  }
}

}  // namespace

/// Evaluation budget of the whole-sequence search: the campaign's schedule.search_evaluations,
/// or by default 400 per setting (docs/motion-model.md).
long sequence_evaluations(const ScheduleInput& in, std::size_t settings) {
  if (in.settings.search_evaluations > 0) return static_cast<long>(in.settings.search_evaluations);
  return 400L * static_cast<long>(std::max<std::size_t>(settings, 1));
}

std::vector<Code> optimized_order(const MoveModel& model, const SideCosts& costs,
                                  bool truncation_safe, const ScheduleOptions& options) {
  const ScheduleInput& in = model.input();
  const double cap = in.settings.optimizer_time_cap_s;
  const Budget budget{
      &options.hooks,
      Clock::now() + std::chrono::microseconds(static_cast<long long>(std::max(cap, 0.0) * 1e6)),
      cap > 0.0};
  const Layout layout(model);
  const int train = std::clamp(in.train_count, 0, model.points());
  const int tests = model.points() - train;

  std::vector<Code> best;
  double best_cost = std::numeric_limits<double>::infinity();
  for (int row_side = 0; row_side < 2; ++row_side) {
    const int sweep_side = 1 - row_side;
    // Sweeps run both ways, so the tour weight is the mean of the two directions.
    std::vector<float> w(std::size_t(train) * train);
    for (int i = 0; i < train; ++i) {
      for (int j = 0; j < train; ++j) {
        w[std::size_t(i) * train + j] =
            static_cast<float>(0.5 * (model.step_s(costs.at(sweep_side, i, j)) +
                                      model.step_s(costs.at(sweep_side, j, i))));
      }
    }
    int start = 0;
    for (int i = 1; i < train; ++i) {
      if (costs.start[sweep_side][i] < costs.start[sweep_side][start]) start = i;
    }
    std::vector<int> tour = improve_path(train, w, start, budget);
    options.hooks.report(0.2 + 0.3 * row_side);

    std::vector<float> wt(std::size_t(tests) * tests);
    for (int i = 0; i < tests; ++i) {
      for (int j = 0; j < tests; ++j) {
        wt[std::size_t(i) * tests + j] =
            static_cast<float>(model.step_s(costs.at(row_side, train + i, train + j)));
      }
    }
    std::vector<int> test_tour = improve_path(tests, wt, 0, budget);
    for (int& t : test_tour) t += train;

    for (int dir = 0; dir < 2; ++dir) {
      std::vector<int> tr = tour;
      if (dir) std::reverse(tr.begin(), tr.end());
      for (int tdir = 0; tdir < 2; ++tdir) {
        std::vector<int> tt = test_tour;
        if (tdir) std::reverse(tt.begin(), tt.end());
        std::vector<Code> order = sweep_order(layout, row_side, tr, tt, truncation_safe, costs);
        const double c = relaxed_order_s(model, costs, order);
        // The first candidate is always kept: with every cost infinite (or NaN) no candidate
        // compares smaller, and an empty order would silently drop every entry.
        if (best.empty() || c < best_cost) {
          best_cost = c;
          best.swap(order);
        }
      }
    }
    options.hooks.report(0.35 + 0.3 * row_side);
  }
  if (!truncation_safe) {
    // Whole-sequence search at every size, within a budget counted in evaluations.
    or_opt_sequence(model, costs, layout, best, budget, sequence_evaluations(in, best.size()));
  }
  if (best.size() <= 12 && !truncation_safe) {
    // Tiny instances: exact when the dynamic programme is cheap (up to tens of milliseconds),
    // multi-start local search on the exact cost otherwise. On ranged rigs both work on the
    // commanded positions (schedule_ranged.cpp).
    const ConfigModel configs(model);
    const bool ranged = has_ranged_motor(model);
    const double order_work = ranged ? std::max(configs.order_work(best), 1.0) : 0.0;
    if (ranged && exact_ranged_work(model, configs) <= 1e8) {
      exact_ranged_order(model, configs, &best);
    } else if (ranged && order_work <= 1e6) {
      // About 1e8 inner steps of the dynamic programme in all.
      best = small_search(
          best, options.seed, budget,
          [&](const std::vector<Code>& o) { return configs.order_s(o, nullptr); },
          static_cast<long>(std::clamp(1e8 / order_work, 2000.0, 200000.0)));
    } else if (exact_work(model) <= 4e7) {
      exact_order(model, &best);
    } else {
      best = small_search(
          best, options.seed, budget,
          [&](const std::vector<Code>& o) { return choose_solutions(model, o, nullptr); },
          std::numeric_limits<long>::max());
    }
  }
  return best;
}

}  // namespace gramline::sched
