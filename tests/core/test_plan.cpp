// The planner as a whole: allocation of pairs, resume, and the consistency of its summary.
#include <gtest/gtest.h>

#include <cmath>
#include <map>
#include <set>

#include "../shared/one_photon.h"
#include "gramline/budget.h"
#include "gramline/demo.h"
#include "gramline/detection.h"
#include "gramline/motion.h"
#include "gramline/plan.h"

namespace gramline {
namespace {

std::vector<const Step*> measure_steps(const Plan& p) {
  std::vector<const Step*> out;
  for (const Step& s : p.steps)
    if (s.kind == StepKind::measure) out.push_back(&s);
  return out;
}

TEST(Plan, UniformAllocationGivesEveryEntryTheLargestNeedSoAllMeetTheTarget) {
  Campaign c = make_demo_campaign();
  c.precision.allocation = Allocation::uniform;
  const Plan plan = plan_campaign(c);
  const auto steps = measure_steps(plan);
  ASSERT_EQ(steps.size(), 48u * 47u / 2u + 16u * 48u);
  // The largest need is that of an entry whose observed pass fraction is nearest 1/2: with the
  // Wilson interval (Wilson 1927) the half-width at that p must meet epsilon and no more.
  for (const Step* s : steps) EXPECT_EQ(s->pairs, steps.front()->pairs);
  EXPECT_LE(plan.summary.epsilon_reached, c.precision.budget.epsilon * (1 + 1e-9));
  // Dwell is pairs over the detected-pair rate R eta_A eta_B (unit check).
  const double rate = c.rig.source.pair_rate_per_s * 0.15 * 0.15;
  EXPECT_NEAR(steps.front()->dwell_s, steps.front()->pairs / rate, 1e-9);
}

TEST(Plan, NeymanSpendsTheSameTimeAndLowersTheWorstHalfWidth) {
  Campaign c = make_demo_campaign();
  const Plan uniform = plan_campaign(c);
  c.precision.allocation = Allocation::neyman;
  const Plan neyman = plan_campaign(c);
  double total_u = 0, total_n = 0;
  for (const Step* s : measure_steps(uniform)) total_u += s->pairs;
  for (const Step* s : measure_steps(neyman)) total_n += s->pairs;
  // Rounding each entry to whole pairs moves the total by at most half a pair per entry.
  EXPECT_NEAR(total_n, total_u, 0.5 * measure_steps(neyman).size());
  // Neyman (J. R. Stat. Soc. 97 (1934) 558): pairs proportional to the one-pair sigma.
  const auto st = measure_steps(neyman);
  const Step* a = st.front();
  for (const Step* b : st) {
    EntryModel ea, eb;
    ea.p_pass = a->p_pass;
    eb.p_pass = b->p_pass;
    ea.visibility = eb.visibility = c.rig.source.visibility;
    // Ratio of sigmas without accidentals; the demo's accidentals are ~1e-5 of the pairs.
    const double ratio =
        std::sqrt(entry_variance_per_pair(eb, false) / entry_variance_per_pair(ea, false));
    EXPECT_NEAR(b->pairs / a->pairs, ratio, 0.01 * ratio + 1.0 / a->pairs);
  }
  EXPECT_LT(neyman.summary.epsilon_reached, uniform.summary.epsilon_reached);
}

// One photon, one feature as linear polarization (theta = feature, degrees), pass port only, on
// the demo's rig: kernel cos^2((theta_a - theta_b)/2), no accidentals (one detector).
Campaign one_photon_pass_port(const std::vector<double>& thetas) {
  const int n = static_cast<int>(thetas.size());
  Eigen::MatrixXd train(n, 1);
  Eigen::VectorXi labels(n);
  for (int i = 0; i < n; ++i) {
    train(i, 0) = thetas[i];
    labels(i) = i % 2 == 0 ? 1 : -1;
  }
  Campaign c = one_photon_test::one_photon_linear(make_demo_campaign(), train, labels,
                                                  Eigen::MatrixXd(0, 1), Eigen::VectorXi(0));
  c.rig.scheme = DetectionScheme::pass_only;
  return c;
}

// epsilon_reached is the true worst half-width of the plan: every entry's half-width at its own
// predicted p, maximised. With the worst-case option, one photon, V = 0.97, eps = 0.01 and an
// entry of kernel 0.999 (theta 10 and 13.624 deg), the normal half-width of each entry is
// z sigma (README, user guide steps 5-7, no accidentals), p = V kappa + (1 - V)/2, with sigma^2
// the counts' p / (pairs V^2) plus the reference calibration's (p / V)^2 sum_k w_k^2 / (N_k p_ref):
// a Poisson reference count of N_k pairs at p_ref = V + (1 - V)/2 gives the pair rate with
// relative variance 1 / (N_k p_ref), and the entry takes the references around the middle of its
// counting by linear weights w_k (docs/error-budget.md). It must stay within eps, and the
// summary must report its maximum.
TEST(Plan, EpsilonReachedIsTheTrueWorstHalfWidth) {
  Campaign c = one_photon_pass_port({10.0, 13.624, 60.0, 120.0, 170.0});
  c.precision.budget = {BudgetMethod::normal, 0.01, 0.95, true};
  const double v = c.rig.source.visibility, z = 1.959963984540054;  // common practice
  const double p_ref = v + (1 - v) / 2;
  auto middle = [](const Step& s) { return s.start_s + s.move_s + 0.5 * s.dwell_s; };
  for (bool worst : {true, false}) {
    c.precision.budget.worst_case = worst;
    const Plan plan = plan_campaign(c);
    std::vector<const Step*> refs;
    for (const Step& s : plan.steps)
      if (s.kind == StepKind::reference) refs.push_back(&s);
    ASSERT_FALSE(refs.empty());
    double largest = 0.0, largest_kernel = 0.0;
    for (const Step* s : measure_steps(plan)) {
      const double p = v * s->kernel_ideal + (1 - v) / 2;
      const double t = middle(*s);
      double cal = 0.0;  // sum_k w_k^2 / (N_k p_ref)
      const Step* before = nullptr;
      const Step* after = nullptr;
      for (const Step* r : refs) {
        if (middle(*r) <= t) before = r;
        if (middle(*r) > t && !after) after = r;
      }
      if (before && after) {
        const double w = (t - middle(*before)) / (middle(*after) - middle(*before));
        cal = (1 - w) * (1 - w) / (before->pairs * p_ref) + w * w / (after->pairs * p_ref);
      } else {
        const Step* only = before ? before : after;
        cal = 1.0 / (only->pairs * p_ref);
      }
      const double var = p / (s->pairs * v * v) + (p / v) * (p / v) * cal;
      largest = std::max(largest, z * std::sqrt(var));
      largest_kernel = std::max(largest_kernel, s->kernel_ideal);
    }
    EXPECT_NEAR(largest_kernel, 0.999, 1e-4);
    EXPECT_NEAR(plan.summary.epsilon_reached, largest, 1e-9 * largest) << worst;
    EXPECT_LE(plan.summary.epsilon_reached, 0.01 * (1 + 1e-9)) << worst;
  }
}

TEST(Plan, MarginAwareAllocationFavoursSupportVectorRows) {
  Campaign c = make_demo_campaign();
  c.precision.allocation = Allocation::margin_aware;
  const Plan plan = plan_campaign(c);
  // Entries between two points with no dual weight get only the floor; the rows of support
  // vectors get more. So the pairs are not all equal, and the largest exceeds the mean.
  double most = 0, sum = 0;
  const auto st = measure_steps(plan);
  for (const Step* s : st) {
    most = std::max(most, s->pairs);
    sum += s->pairs;
  }
  EXPECT_GT(most, 2.0 * sum / st.size());
}

TEST(Plan, FixedPairsAreUsedAsGiven) {
  Campaign c = make_demo_campaign();
  c.precision.fixed_pairs = 1234;
  const Plan plan = plan_campaign(c);
  for (const Step* s : measure_steps(plan)) EXPECT_EQ(s->pairs, 1234);
}

TEST(Plan, ResumeLeavesOutMeasuredEntriesAndStartsFromTheLastPositions) {
  Campaign c = make_demo_campaign();
  const Plan full = plan_campaign(c);
  const auto st = measure_steps(full);
  ResumeState resume;
  for (size_t k = 0; k < 500; ++k)
    resume.measured.emplace_back(st[k]->analysis_point, st[k]->prep_point);
  resume.start_positions_deg = st[499]->position_deg;
  PlanOptions o;
  o.resume = &resume;
  const Plan rest = plan_campaign(c, o);
  const auto rs = measure_steps(rest);
  EXPECT_EQ(rs.size(), st.size() - 500);
  std::set<std::pair<int, int>> done;
  for (auto [a, b] : resume.measured) done.insert({std::min(a, b), std::max(a, b)});
  for (const Step* s : rs)
    EXPECT_FALSE(done.count(
        {std::min(s->prep_point, s->analysis_point), std::max(s->prep_point, s->analysis_point)}));
  // The first step's move is timed from the given positions (docs/motion-model.md).
  EXPECT_NEAR(rest.steps.front().move_s,
              step_move_s(c.rig, resume.start_positions_deg, rest.steps.front().position_deg),
              1e-12);
}

TEST(Plan, SummaryAddsUpFromTheSteps) {
  const Campaign c = make_demo_campaign();
  const Plan plan = plan_campaign(c);
  double move = 0, dwell = 0, other = 0, end = 0;
  for (const Step& s : plan.steps) {
    move += s.move_s;
    if (s.kind == StepKind::measure)
      dwell += s.dwell_s;
    else
      other += s.dwell_s;  // the moves of reference, dark and park steps are in move_s
    end = std::max(end, s.start_s + s.move_s + s.dwell_s);
  }
  EXPECT_NEAR(plan.summary.move_s, move, 1e-6);
  // The parts add up to the busy time, move and dwell of every step.
  EXPECT_NEAR(plan.summary.integration_s + plan.summary.move_s + plan.summary.reference_s,
              move + dwell + other, 1e-6);
  EXPECT_NEAR(plan.summary.integration_s, dwell, 1e-6);
  EXPECT_NEAR(plan.summary.reference_s, other, 1e-6);
  EXPECT_NEAR(plan.summary.total_s, end, 1e-6);
  EXPECT_LE(plan.summary.move_lower_bound_s, plan.summary.measure_move_s);
  EXPECT_GE(plan.summary.move_naive_s, plan.summary.measure_move_s);
  // Every training entry is mapped to the step that measures it.
  for (int i = 0; i < 48; ++i)
    for (int j = 0; j < 48; ++j) {
      if (i == j) continue;
      const int k = plan.step_of_train(i, j);
      ASSERT_GE(k, 0);
      const Step& s = plan.steps[k];
      EXPECT_EQ(std::min(s.prep_point, s.analysis_point), std::min(i, j));
      EXPECT_EQ(std::max(s.prep_point, s.analysis_point), std::max(i, j));
    }
}

}  // namespace
}  // namespace gramline
