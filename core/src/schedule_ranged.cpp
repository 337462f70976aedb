// Motors with a travel range (docs/motion-model.md, "Travel ranges"). A ranged motor cannot wrap
// round, so the time of a move depends on the physical positions, not only on the angles modulo
// the plate period; the angle model of MoveModel::motor_angle_s is then only a lower bound. Here
// the positions themselves are the optimiser's variables: a configuration of a setting is one
// discrete solution per group plus one in-range equivalent position per ranged motor, and every
// cost below is the step time (motion.cpp) of the positions that will be commanded. Continuous
// motors keep the angle model, which is exact for them.
#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <stdexcept>

#include "schedule_internal.h"

namespace gramline::sched {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

}  // namespace

bool has_ranged_motor(const MoveModel& model) {
  for (int g = 0; g < model.groups(); ++g) {
    if (model.rig().motors[model.hwp_motor(g)].range) return true;
    if (model.rig().motors[model.qwp_motor(g)].range) return true;
  }
  return false;
}

ConfigModel::ConfigModel(const MoveModel& model) : model_(&model) {
  const int P = model.photons();
  for (int side = 0; side < 2; ++side) {
    for (int p = 0; p < P; ++p) {
      const int g = side * P + p;
      motors_[side].push_back(model.hwp_motor(g));
      motors_[side].push_back(model.qwp_motor(g));
    }
    cache_[side].resize(model.points());
  }
}

double ConfigModel::motor_s(int motor, double from_deg, double to_deg) const {
  const Motor& m = model_->rig().motors[motor];
  return m.range ? motor_move_s(m, from_deg, to_deg)
                 : model_->motor_angle_s(motor, from_deg, to_deg);
}

const ConfigModel::SideConfigs& ConfigModel::side(int side, int point) const {
  SideConfigs& out = cache_[side][point];
  if (out.count > 0) return out;
  const MoveModel& model = *model_;
  const int P = model.photons();
  const int width = 2 * P;
  out.width = width;
  // Options of one group: (solution, hwp position, qwp position).
  std::vector<std::vector<std::array<double, 3>>> options(P);
  for (int p = 0; p < P; ++p) {
    const int g = side * P + p;
    const Motor& mh = model.rig().motors[model.hwp_motor(g)];
    const Motor& mq = model.rig().motors[model.qwp_motor(g)];
    for (int sol = 0; sol < 2; ++sol) {
      const PlatePair& t = model.target(point, g, sol);
      const std::vector<double> hs =
          mh.range ? equivalent_positions_deg(mh, t.hwp_deg, 0.0) : std::vector<double>{t.hwp_deg};
      const std::vector<double> qs =
          mq.range ? equivalent_positions_deg(mq, t.qwp_deg, 0.0) : std::vector<double>{t.qwp_deg};
      if (hs.empty() || qs.empty()) {
        throw std::invalid_argument("motor " + (hs.empty() ? mh.name : mq.name) +
                                    ": no position of a target angle inside its travel range");
      }
      for (double h : hs) {
        for (double q : qs) options[p].push_back({static_cast<double>(sol), h, q});
      }
    }
  }
  // Cartesian product over the side's groups.
  std::vector<int> idx(P, 0);
  for (;;) {
    int mask = 0;
    for (int p = 0; p < P; ++p) {
      const auto& o = options[p][idx[p]];
      mask |= static_cast<int>(o[0]) << p;
      out.positions.push_back(o[1]);
      out.positions.push_back(o[2]);
    }
    out.masks.push_back(static_cast<std::uint8_t>(mask));
    ++out.count;
    int p = 0;
    while (p < P && ++idx[p] == static_cast<int>(options[p].size())) idx[p++] = 0;
    if (p == P) break;
  }
  return out;
}

double ConfigModel::side_move_s(int side, const double* from, const double* to) const {
  double t = 0.0;
  const auto& ms = motors_[side];
  for (std::size_t i = 0; i < ms.size(); ++i) {
    t = model_->join(t, motor_s(ms[i], from[i], to[i]));
  }
  return t;
}

double ConfigModel::side_from_s(int side, const std::vector<double>& from_deg,
                                const double* to) const {
  double t = 0.0;
  const auto& ms = motors_[side];
  for (std::size_t i = 0; i < ms.size(); ++i) {
    t = model_->join(t, motor_s(ms[i], from_deg[ms[i]], to[i]));
  }
  return t;
}

double ConfigModel::side_count(int side, int point) const {
  const MoveModel& model = *model_;
  const int P = model.photons();
  double count = 1.0;
  for (int p = 0; p < P; ++p) {
    const int g = side * P + p;
    const Motor& mh = model.rig().motors[model.hwp_motor(g)];
    const Motor& mq = model.rig().motors[model.qwp_motor(g)];
    double options = 0.0;
    for (int sol = 0; sol < 2; ++sol) {
      const PlatePair& t = model.target(point, g, sol);
      const double hs = mh.range ? equivalent_positions_deg(mh, t.hwp_deg, 0.0).size() : 1.0;
      const double qs = mq.range ? equivalent_positions_deg(mq, t.qwp_deg, 0.0).size() : 1.0;
      options += hs * qs;
    }
    count *= options;
  }
  return count;
}

double ConfigModel::configs(Code c) const {
  return side_count(0, model_->prep_point(c)) * side_count(1, model_->analysis_point(c));
}

double ConfigModel::order_s(const std::vector<Code>& order, RangedPlan* plan_out) const {
  const MoveModel& model = *model_;
  const std::size_t n = order.size();
  if (plan_out) {
    plan_out->solutions.assign(n, 0);
    plan_out->positions_deg.assign(n * model.rig().motors.size(),
                                   std::numeric_limits<double>::quiet_NaN());
  }
  if (n == 0) return 0.0;
  // State: (prep config i, analysis config j) as i * Ca + j.
  std::vector<double> cost, next;
  std::vector<std::vector<std::uint32_t>> back(n);
  std::vector<double> tab_p, tab_a;
  {
    const SideConfigs& sp = side(0, model.prep_point(order[0]));
    const SideConfigs& sa = side(1, model.analysis_point(order[0]));
    cost.resize(sp.count * sa.count);
    tab_p.resize(sp.count);
    tab_a.resize(sa.count);
    for (std::size_t i = 0; i < sp.count; ++i)
      tab_p[i] = side_from_s(0, model.start_deg(), sp.at(i));
    for (std::size_t j = 0; j < sa.count; ++j)
      tab_a[j] = side_from_s(1, model.start_deg(), sa.at(j));
    for (std::size_t i = 0; i < sp.count; ++i) {
      for (std::size_t j = 0; j < sa.count; ++j) {
        cost[i * sa.count + j] = model.step_s(model.join(tab_p[i], tab_a[j]));
      }
    }
  }
  for (std::size_t k = 1; k < n; ++k) {
    const SideConfigs& fp = side(0, model.prep_point(order[k - 1]));
    const SideConfigs& fa = side(1, model.analysis_point(order[k - 1]));
    const SideConfigs& tp = side(0, model.prep_point(order[k]));
    const SideConfigs& ta = side(1, model.analysis_point(order[k]));
    tab_p.resize(fp.count * tp.count);
    tab_a.resize(fa.count * ta.count);
    for (std::size_t i = 0; i < fp.count; ++i)
      for (std::size_t u = 0; u < tp.count; ++u)
        tab_p[i * tp.count + u] = side_move_s(0, fp.at(i), tp.at(u));
    for (std::size_t j = 0; j < fa.count; ++j)
      for (std::size_t w = 0; w < ta.count; ++w)
        tab_a[j * ta.count + w] = side_move_s(1, fa.at(j), ta.at(w));
    next.assign(tp.count * ta.count, kInf);
    back[k].assign(next.size(), 0);
    for (std::size_t i = 0; i < fp.count; ++i) {
      for (std::size_t j = 0; j < fa.count; ++j) {
        const double here = cost[i * fa.count + j];
        if (here == kInf) continue;
        for (std::size_t u = 0; u < tp.count; ++u) {
          const double xp = tab_p[i * tp.count + u];
          for (std::size_t w = 0; w < ta.count; ++w) {
            const double t = here + model.step_s(model.join(xp, tab_a[j * ta.count + w]));
            double& to = next[u * ta.count + w];
            if (t < to) {
              to = t;
              back[k][u * ta.count + w] = static_cast<std::uint32_t>(i * fa.count + j);
            }
          }
        }
      }
    }
    std::swap(cost, next);
  }
  std::size_t state =
      static_cast<std::size_t>(std::min_element(cost.begin(), cost.end()) - cost.begin());
  const double total = cost[state];
  if (plan_out) {
    const int P = model.photons();
    const std::size_t motors = model.rig().motors.size();
    for (std::size_t k = n; k-- > 0;) {
      const SideConfigs& sp = side(0, model.prep_point(order[k]));
      const SideConfigs& sa = side(1, model.analysis_point(order[k]));
      const std::size_t i = state / sa.count;
      const std::size_t j = state % sa.count;
      plan_out->solutions[k] = static_cast<std::uint8_t>(sp.masks[i] | (sa.masks[j] << P));
      for (int s = 0; s < 2; ++s) {
        const double* pos = s == 0 ? sp.at(i) : sa.at(j);
        for (std::size_t m = 0; m < motors_[s].size(); ++m) {
          const int motor = motors_[s][m];
          if (model.rig().motors[motor].range) plan_out->positions_deg[k * motors + motor] = pos[m];
        }
      }
      if (k > 0) state = back[k][state];
    }
  }
  return total;
}

double ConfigModel::order_work(const std::vector<Code>& order) const {
  double work = 0.0;
  for (std::size_t k = 1; k < order.size(); ++k) {
    work += configs(order[k - 1]) * configs(order[k]);
  }
  return work;
}

void place_ranged_motors(const MoveModel& model, const std::vector<Code>& order,
                         const std::vector<std::uint8_t>& solutions, RangedPlan& plan) {
  const Rig& rig = model.rig();
  const std::size_t n = order.size();
  const std::size_t motors = rig.motors.size();
  plan.solutions = solutions;
  plan.positions_deg.assign(n * motors, std::numeric_limits<double>::quiet_NaN());
  if (n == 0) return;
  std::vector<std::vector<double>> cand(n);
  std::vector<std::vector<double>> cost(n);
  std::vector<std::vector<int>> back(n);
  for (int g = 0; g < model.groups(); ++g) {
    for (int which = 0; which < 2; ++which) {
      const int m = which == 0 ? model.hwp_motor(g) : model.qwp_motor(g);
      const Motor& motor = rig.motors[m];
      if (!motor.range) continue;
      // Shortest path through the layers of in-range equivalent positions, one layer a step.
      for (std::size_t k = 0; k < n; ++k) {
        const PlatePair& t =
            model.target(model.group_point(order[k], g), g, (solutions[k] >> g) & 1);
        cand[k] = equivalent_positions_deg(motor, which == 0 ? t.hwp_deg : t.qwp_deg, 0.0);
        if (cand[k].empty()) {
          throw std::invalid_argument("motor " + motor.name +
                                      ": no position of a target angle inside its travel range");
        }
        cost[k].assign(cand[k].size(), kInf);
        back[k].assign(cand[k].size(), 0);
        for (std::size_t u = 0; u < cand[k].size(); ++u) {
          if (k == 0) {
            cost[k][u] = motor_move_s(motor, model.start_deg()[m], cand[k][u]);
            continue;
          }
          for (std::size_t i = 0; i < cand[k - 1].size(); ++i) {
            const double c = cost[k - 1][i] + motor_move_s(motor, cand[k - 1][i], cand[k][u]);
            if (c < cost[k][u]) {
              cost[k][u] = c;
              back[k][u] = static_cast<int>(i);
            }
          }
        }
      }
      int u = static_cast<int>(std::min_element(cost[n - 1].begin(), cost[n - 1].end()) -
                               cost[n - 1].begin());
      for (std::size_t k = n; k-- > 0;) {
        plan.positions_deg[k * motors + m] = cand[k][u];
        u = back[k][u];
      }
    }
  }
}

double exact_ranged_order(const MoveModel& model, const ConfigModel& configs,
                          std::vector<Code>* order_out) {
  const ScheduleInput& input = model.input();
  const int n = static_cast<int>(input.entries.size());
  if (order_out) order_out->clear();
  if (n == 0) return 0.0;
  if (n > 12) throw std::invalid_argument("exact_min_move_s: at most 12 entries");
  // States: (code, prep config, analysis config).
  struct State {
    Code code;
    int entry;
    const double* prep;
    const double* analysis;
  };
  std::vector<State> states;
  for (int e = 0; e < n; ++e) {
    for (int flip = 0; flip < 2; ++flip) {
      const Code c = make_code(e, flip != 0);
      const auto& sp = configs.side(0, model.prep_point(c));
      const auto& sa = configs.side(1, model.analysis_point(c));
      for (std::size_t i = 0; i < sp.count; ++i)
        for (std::size_t j = 0; j < sa.count; ++j) states.push_back({c, e, sp.at(i), sa.at(j)});
    }
  }
  const std::size_t S = states.size();
  std::vector<double> edge(S * S), first(S);
  for (std::size_t u = 0; u < S; ++u) {
    first[u] =
        model.step_s(model.join(configs.side_from_s(0, model.start_deg(), states[u].prep),
                                configs.side_from_s(1, model.start_deg(), states[u].analysis)));
    for (std::size_t w = 0; w < S; ++w) {
      edge[u * S + w] =
          model.step_s(model.join(configs.side_move_s(0, states[u].prep, states[w].prep),
                                  configs.side_move_s(1, states[u].analysis, states[w].analysis)));
    }
  }
  const std::size_t subsets = std::size_t(1) << n;
  std::vector<double> dp(subsets * S, kInf);
  std::vector<int> parent(order_out ? subsets * S : 0, -1);
  for (std::size_t u = 0; u < S; ++u) dp[(std::size_t(1) << states[u].entry) * S + u] = first[u];
  for (std::size_t set = 1; set < subsets; ++set) {
    for (std::size_t u = 0; u < S; ++u) {
      const double here = dp[set * S + u];
      if (here == kInf) continue;
      for (std::size_t w = 0; w < S; ++w) {
        const std::size_t bit = std::size_t(1) << states[w].entry;
        if (set & bit) continue;
        double& to = dp[(set | bit) * S + w];
        const double t = here + edge[u * S + w];
        if (t < to) {
          to = t;
          if (order_out) parent[(set | bit) * S + w] = static_cast<int>(u);
        }
      }
    }
  }
  std::size_t end = 0;
  for (std::size_t u = 1; u < S; ++u) {
    if (dp[(subsets - 1) * S + u] < dp[(subsets - 1) * S + end]) end = u;
  }
  const double best = dp[(subsets - 1) * S + end];
  if (order_out) {
    std::size_t set = subsets - 1;
    for (int u = static_cast<int>(end); u >= 0;) {
      order_out->push_back(states[u].code);
      const int prev = parent[set * S + u];
      set &= ~(std::size_t(1) << states[u].entry);
      u = prev;
    }
    std::reverse(order_out->begin(), order_out->end());
  }
  return best;
}

double exact_ranged_work(const MoveModel& model, const ConfigModel& configs) {
  double S = 0.0;
  const int n = static_cast<int>(model.input().entries.size());
  for (int e = 0; e < n; ++e) {
    for (int flip = 0; flip < 2; ++flip) S += configs.configs(make_code(e, flip != 0));
  }
  // The edge table holds S^2 doubles: beyond a few thousand states it is not worth its memory.
  if (S > 3000.0) return std::numeric_limits<double>::infinity();
  return std::ldexp(S * S, n);
}

}  // namespace gramline::sched

namespace gramline::sched {

double plan_positions(const MoveModel& model, const std::vector<Code>& order, RangedPlan& plan) {
  plan.positions_deg.clear();
  choose_solutions(model, order, &plan.solutions);
  double best = realized_order_s(model, order, plan.solutions);
  if (!has_ranged_motor(model)) return best;
  RangedPlan layered;
  place_ranged_motors(model, order, plan.solutions, layered);
  const double layered_s = realized_order_s(model, order, layered.solutions, layered.positions_deg);
  if (layered_s < best) {
    best = layered_s;
    plan = std::move(layered);
  }
  const ConfigModel configs(model);
  // Exact for the order; affordable up to some tens of millions of inner steps.
  if (configs.order_work(order) <= 3e7) {
    RangedPlan joint;
    configs.order_s(order, &joint);
    const double joint_s = realized_order_s(model, order, joint.solutions, joint.positions_deg);
    if (joint_s < best) {
      best = joint_s;
      plan = std::move(joint);
    }
  }
  return best;
}

}  // namespace gramline::sched
