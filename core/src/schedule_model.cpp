// Scheduler cost model: the move time of docs/motion-model.md seen through discrete waveplate
// solutions.
#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

#include "schedule_internal.h"

namespace gramline::sched {

MoveModel::MoveModel(const ScheduleInput& input) : input_(&input) {
  if (!input.rig) throw std::invalid_argument("schedule: no rig");
  const Rig& rig = *input.rig;
  photons_ = input.points.empty() ? 0 : static_cast<int>(input.points.front().prep.size());
  if (photons_ > kMaxPhotons) {
    throw std::invalid_argument("schedule: at most " + std::to_string(kMaxPhotons) +
                                " photons are supported");
  }
  simultaneous_ = rig.controller.moves == MoveMode::simultaneous;
  settle_s_ = rig.controller.settle_s;
  overhead_s_ = rig.controller.overhead_s;
  hwp_.resize(2 * photons_);
  qwp_.resize(2 * photons_);
  for (int g = 0; g < 2 * photons_; ++g) {
    const Stage stage = g < photons_ ? Stage::prep : Stage::analysis;
    const int photon = g % photons_;
    hwp_[g] = rig.motor_index(photon, stage, Plate::HWP);
    qwp_[g] = rig.motor_index(photon, stage, Plate::QWP);
    if (hwp_[g] < 0 || qwp_[g] < 0) {
      throw std::invalid_argument("rig.motors: photon " + std::to_string(photon) +
                                  " lacks a motor on its " + to_string(stage) + " stage");
    }
  }
  park_deg_.resize(rig.motors.size());
  for (std::size_t m = 0; m < park_deg_.size(); ++m) park_deg_[m] = rig.motors[m].initial_deg;
  start_deg_ = park_deg_;
  if (!input.start_positions_deg.empty()) {
    if (input.start_positions_deg.size() != rig.motors.size()) {
      throw std::invalid_argument("schedule: start_positions_deg needs one position per motor");
    }
    for (double x : input.start_positions_deg) {
      if (!std::isfinite(x)) throw std::invalid_argument("schedule: start position not finite");
    }
    start_deg_ = input.start_positions_deg;
  }
  for (const PointTargets& p : input.points) {
    if (static_cast<int>(p.prep.size()) != photons_ ||
        static_cast<int>(p.analysis.size()) != photons_) {
      throw std::invalid_argument("schedule: every point needs targets for every photon");
    }
  }
  for (const EntryRequest& e : input.entries) {
    if (e.a < 0 || e.b < 0 || e.a >= points() || e.b >= points() || e.a == e.b) {
      throw std::invalid_argument("schedule: entry with an invalid point index");
    }
  }
}

int MoveModel::prep_point(Code c) const {
  const EntryRequest& e = input_->entries[code_entry(c)];
  return code_flipped(c) ? e.b : e.a;
}

int MoveModel::analysis_point(Code c) const {
  const EntryRequest& e = input_->entries[code_entry(c)];
  return code_flipped(c) ? e.a : e.b;
}

const PlatePair& MoveModel::target(int point, int group, int sol) const {
  const PointTargets& p = input_->points[point];
  return group < photons_ ? p.prep[group][sol] : p.analysis[group - photons_][sol];
}

double MoveModel::motor_angle_s(int motor, double from_deg, double to_deg) const {
  const Motor& m = input_->rig->motors[motor];
  const double period = motor_period_deg(m);
  double up = std::fmod(to_deg - from_deg, period);
  if (up < 0.0) up += period;
  if (up >= period || std::abs(up) <= 1e-9 || std::abs(up - period) <= 1e-9) return 0.0;
  const double v = m.speed_deg_per_s;
  const double a = m.accel_deg_per_s2;
  const double down = period - up;
  if (m.backlash == Backlash::shortest) return travel_time_s(std::min(up, down), v, a);
  return std::min(travel_time_s(up, v, a), travel_time_s(down + m.overshoot_deg, v, a) +
                                               travel_time_s(m.overshoot_deg, v, a));
}

double MoveModel::group_s(int group, const PlatePair& from, const PlatePair& to) const {
  return join(motor_angle_s(hwp_[group], from.hwp_deg, to.hwp_deg),
              motor_angle_s(qwp_[group], from.qwp_deg, to.qwp_deg));
}

double MoveModel::group_from_s(int group, const std::vector<double>& from_deg,
                               const PlatePair& to) const {
  return join(motor_angle_s(hwp_[group], from_deg[hwp_[group]], to.hwp_deg),
              motor_angle_s(qwp_[group], from_deg[qwp_[group]], to.qwp_deg));
}

double MoveModel::side_s(int side, int from_point, int to_point) const {
  if (from_point == to_point) return 0.0;
  double t = 0.0;
  for (int p = 0; p < photons_; ++p) {
    const int g = side * photons_ + p;
    double best = std::numeric_limits<double>::infinity();
    for (int s = 0; s < 2; ++s) {
      for (int u = 0; u < 2; ++u) {
        best = std::min(best, group_s(g, target(from_point, g, s), target(to_point, g, u)));
      }
    }
    t = join(t, best);
  }
  return t;
}

double MoveModel::side_from_s(int side, const std::vector<double>& from_deg, int to_point) const {
  double t = 0.0;
  for (int p = 0; p < photons_; ++p) {
    const int g = side * photons_ + p;
    t = join(t, std::min(group_from_s(g, from_deg, target(to_point, g, 0)),
                         group_from_s(g, from_deg, target(to_point, g, 1))));
  }
  return t;
}

namespace {
/// Rounds toward zero, so that the stored costs stay lower bounds.
float float_below(double x) {
  float f = static_cast<float>(x);
  if (static_cast<double>(f) > x) f = std::nextafter(f, 0.0f);
  return f;
}
}  // namespace

SideCosts compute_side_costs(const MoveModel& model) {
  SideCosts c;
  c.n = model.points();
  const std::size_t n = static_cast<std::size_t>(c.n);
  for (int side = 0; side < 2; ++side) {
    c.cost[side].assign(n * n, 0.0f);
    c.start[side].resize(n);
    c.park[side].resize(n);
    for (int i = 0; i < c.n; ++i) {
      c.start[side][i] = float_below(model.side_from_s(side, model.start_deg(), i));
      c.park[side][i] = float_below(model.side_from_s(side, model.park_deg(), i));
      for (int j = 0; j < c.n; ++j) {
        c.cost[side][i * n + j] = float_below(model.side_s(side, i, j));
      }
    }
  }
  return c;
}

double relaxed_step_s(const MoveModel& model, const SideCosts& costs, Code from, Code to) {
  return model.step_s(
      model.join(costs.at(0, model.prep_point(from), model.prep_point(to)),
                 costs.at(1, model.analysis_point(from), model.analysis_point(to))));
}

double relaxed_first_step_s(const MoveModel& model, const SideCosts& costs, Code to) {
  return model.step_s(
      model.join(costs.start[0][model.prep_point(to)], costs.start[1][model.analysis_point(to)]));
}

double relaxed_order_s(const MoveModel& model, const SideCosts& costs,
                       const std::vector<Code>& order) {
  if (order.empty()) return 0.0;
  double t = relaxed_first_step_s(model, costs, order[0]);
  for (std::size_t k = 1; k < order.size(); ++k) {
    t += relaxed_step_s(model, costs, order[k - 1], order[k]);
  }
  return t;
}

double choose_solutions(const MoveModel& model, const std::vector<Code>& order,
                        std::vector<std::uint8_t>* solutions_out) {
  const int P = model.photons();
  const int G = model.groups();
  if (G > 2 * kMaxPhotons) {
    throw std::invalid_argument("schedule: too many groups for the solution search");
  }
  const int side_states = 1 << P;
  const int K = 1 << G;
  const std::size_t n = order.size();
  if (n == 0) {
    if (solutions_out) solutions_out->clear();
    return 0.0;
  }
  // back[k * K + w]: best predecessor state of state w at step k.
  std::vector<std::uint8_t> back(n * K, 0);
  std::vector<double> cost(K), next(K);
  // side_tab[side][u * side_states + w]: joined side motor time between side states.
  std::vector<double> side_tab[2] = {std::vector<double>(side_states * side_states),
                                     std::vector<double>(side_states * side_states)};
  double group_tab[2 * kMaxPhotons][2][2];

  // Step 0: from the start positions.
  for (int g = 0; g < G; ++g) {
    const int pt = model.group_point(order[0], g);
    for (int w = 0; w < 2; ++w) {
      group_tab[g][0][w] = model.group_from_s(g, model.start_deg(), model.target(pt, g, w));
    }
  }
  for (int w = 0; w < K; ++w) {
    double t = 0.0;
    for (int g = 0; g < G; ++g) t = model.join(t, group_tab[g][0][(w >> g) & 1]);
    cost[w] = model.step_s(t);
  }
  for (std::size_t k = 1; k < n; ++k) {
    for (int g = 0; g < G; ++g) {
      const int from = model.group_point(order[k - 1], g);
      const int to = model.group_point(order[k], g);
      for (int u = 0; u < 2; ++u) {
        for (int w = 0; w < 2; ++w) {
          group_tab[g][u][w] = (from == to && u == w) ? 0.0
                                                      : model.group_s(g, model.target(from, g, u),
                                                                      model.target(to, g, w));
        }
      }
    }
    for (int side = 0; side < 2; ++side) {
      for (int u = 0; u < side_states; ++u) {
        for (int w = 0; w < side_states; ++w) {
          double t = 0.0;
          for (int p = 0; p < P; ++p) {
            t = model.join(t, group_tab[side * P + p][(u >> p) & 1][(w >> p) & 1]);
          }
          side_tab[side][u * side_states + w] = t;
        }
      }
    }
    const int mask = side_states - 1;
    for (int w = 0; w < K; ++w) {
      double best = std::numeric_limits<double>::infinity();
      int arg = 0;
      const int wp = w & mask;
      const int wa = w >> P;
      for (int u = 0; u < K; ++u) {
        const double t =
            cost[u] + model.step_s(model.join(side_tab[0][(u & mask) * side_states + wp],
                                              side_tab[1][(u >> P) * side_states + wa]));
        if (t < best) {
          best = t;
          arg = u;
        }
      }
      next[w] = best;
      back[k * K + w] = static_cast<std::uint8_t>(arg);
    }
    std::swap(cost, next);
  }
  int w = static_cast<int>(std::min_element(cost.begin(), cost.end()) - cost.begin());
  const double total = cost[w];
  if (solutions_out) {
    solutions_out->assign(n, 0);
    for (std::size_t k = n; k-- > 0;) {
      (*solutions_out)[k] = static_cast<std::uint8_t>(w);
      w = back[k * K + w];
    }
  }
  return total;
}

std::vector<Code> naive_order(const ScheduleInput& input) {
  std::vector<int> idx(input.entries.size());
  for (std::size_t e = 0; e < idx.size(); ++e) idx[e] = static_cast<int>(e);
  std::stable_sort(idx.begin(), idx.end(), [&](int x, int y) {
    const EntryRequest& ex = input.entries[x];
    const EntryRequest& ey = input.entries[y];
    const int bx = ex.block == Block::train ? 0 : 1;
    const int by = ey.block == Block::train ? 0 : 1;
    if (bx != by) return bx < by;
    if (ex.a != ey.a) return ex.a < ey.a;
    return ex.b < ey.b;
  });
  std::vector<Code> order;
  order.reserve(idx.size());
  for (int e : idx) order.push_back(make_code(e, false));
  return order;
}

void place_group(const MoveModel& model, int group, int point, int sol,
                 std::vector<double>& positions) {
  const Rig& rig = model.rig();
  const int h = model.hwp_motor(group);
  const int q = model.qwp_motor(group);
  double best_h = 0.0, best_q = 0.0, best_s = std::numeric_limits<double>::infinity();
  for (int s = 0; s < 2; ++s) {
    if (sol >= 0 && s != sol) continue;
    const PlatePair& t = model.target(point, group, s);
    const double yh = nearest_equivalent_deg(rig.motors[h], t.hwp_deg, positions[h]);
    const double yq = nearest_equivalent_deg(rig.motors[q], t.qwp_deg, positions[q]);
    const double time = model.join(motor_move_s(rig.motors[h], positions[h], yh),
                                   motor_move_s(rig.motors[q], positions[q], yq));
    if (time < best_s) {
      best_s = time;
      best_h = yh;
      best_q = yq;
    }
  }
  positions[h] = best_h;
  positions[q] = best_q;
}

void place_measure_step(const MoveModel& model, Code code, std::size_t k,
                        const std::vector<std::uint8_t>& solutions,
                        const std::vector<double>& planned_deg, std::vector<double>& positions) {
  for (int g = 0; g < model.groups(); ++g) {
    const int sol = solutions.empty() ? -1 : (solutions[k] >> g) & 1;
    place_group(model, g, model.group_point(code, g), sol, positions);
  }
  if (planned_deg.empty()) return;
  const std::size_t motors = positions.size();
  for (std::size_t m = 0; m < motors; ++m) {
    const double x = planned_deg[k * motors + m];
    if (!std::isnan(x)) positions[m] = x;
  }
}

double realized_order_s(const MoveModel& model, const std::vector<Code>& order,
                        const std::vector<std::uint8_t>& solutions,
                        const std::vector<double>& planned_deg) {
  const Rig& rig = model.rig();
  std::vector<double> pos = model.start_deg(), next;
  double total = 0.0;
  for (std::size_t k = 0; k < order.size(); ++k) {
    next = pos;
    place_measure_step(model, order[k], k, solutions, planned_deg, next);
    total += step_move_s(rig, pos, next);
    std::swap(pos, next);
  }
  return total;
}

}  // namespace gramline::sched
