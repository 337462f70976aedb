// Predicted Gram-matrix error (gram_error.h) against closed forms and against a Monte Carlo of
// coincidence counts written here from the rig model of docs/conventions.md and the README (user
// guide steps 5 and 6), independent of the engine's own simulators.
#include <gtest/gtest.h>

#include <Eigen/Eigenvalues>
#include <boost/math/distributions/normal.hpp>
#include <cmath>
#include <cstdio>
#include <random>
#include <vector>

#include "gramline/demo.h"
#include "gramline/gram_error.h"
#include "gramline/plan.h"

namespace {

using gramline::Campaign;
using gramline::GramError;
using gramline::GramErrorOptions;
using gramline::GramNoise;

// Homogeneous per-entry sigma: s off the diagonal, 0 on it (the diagonal is 1 by construction).
Eigen::MatrixXd homogeneous_sigma(int n, double s) {
  Eigen::MatrixXd sigma = Eigen::MatrixXd::Constant(n, n, s);
  sigma.diagonal().setZero();
  return sigma;
}

// ---------------------------------------------------------------------------------------------
// Closed forms.

// Frobenius norm of the sigma matrix: N(N-1) off-diagonal entries of sigma each, so
// sqrt(sum sigma_ij^2) = sigma sqrt(N (N - 1)) (definition in the header).
TEST(GramError, FrobeniusOfHomogeneousSigma) {
  for (int n : {2, 5, 48}) {
    const double s = 0.013;
    const GramError e = gramline::describe_gram_noise(Eigen::MatrixXd::Identity(n, n),
                                                      GramNoise{homogeneous_sigma(n, s), {}});
    EXPECT_NEAR(e.sigma_frobenius, s * std::sqrt(static_cast<double>(n) * (n - 1)), 1e-14) << n;
    EXPECT_NEAR(e.sigma_max, s, 1e-15);
    EXPECT_NEAR(e.min_eigenvalue, 1.0, 1e-12);
    EXPECT_FALSE(e.simulated);
    EXPECT_TRUE(std::isnan(e.p_negative_eigenvalue));
  }
}

// A shared component adds its loading's square to each entry's variance: entries (0,1) and
// (0,2) with loadings 0.02 and -0.01 on top of an independent 0.01.
TEST(GramError, SharedComponentAddsToTheEntryVariance) {
  GramNoise noise{homogeneous_sigma(3, 0.01), {{"ref", {{0, 1, 0.02}, {2, 0, -0.01}}}}};
  const GramError e = gramline::describe_gram_noise(Eigen::MatrixXd::Identity(3, 3), noise);
  // Off-diagonal variances: (0,1): 1e-4 + 4e-4, (0,2): 1e-4 + 1e-4, (1,2): 1e-4; both triangles.
  EXPECT_NEAR(e.sigma_frobenius, std::sqrt(2 * (5e-4 + 2e-4 + 1e-4)), 1e-14);
  EXPECT_NEAR(e.sigma_max, std::sqrt(5e-4), 1e-15);
}

TEST(GramError, RefusesBadNoise) {
  const Eigen::MatrixXd k = Eigen::MatrixXd::Identity(3, 3);
  EXPECT_THROW(gramline::describe_gram_noise(k, GramNoise{homogeneous_sigma(2, 0.01), {}}),
               std::invalid_argument);
  EXPECT_THROW(gramline::describe_gram_noise(
                   k, GramNoise{homogeneous_sigma(3, 0.01), {{"x", {{1, 1, 0.1}}}}}),
               std::invalid_argument);
  EXPECT_THROW(gramline::describe_gram_noise(
                   k, GramNoise{homogeneous_sigma(3, 0.01), {{"x", {{0, 3, 0.1}}}}}),
               std::invalid_argument);
  Eigen::MatrixXd inf = homogeneous_sigma(3, 0.01);
  inf(0, 1) = INFINITY;
  EXPECT_THROW(gramline::describe_gram_noise(k, GramNoise{inf, {}}), std::invalid_argument);
}

// Easy case with an exact answer: K = [[1, c], [c, 1]], noise e on the off-diagonal. The
// eigenvalues are exactly 1 - c - e and 1 + c + e, so P(negative) = P(e > 1 - c)
// = Phi(-(1 - c)/sigma) (normal cdf from Boost.Math), and ||E||_2 = |e| with mean
// sigma sqrt(2/pi) (half-normal mean, common practice).
TEST(GramError, TwoByTwoMatchesTheNormalCdf) {
  const double c = 0.98, s = 0.02;
  Eigen::MatrixXd k(2, 2);
  k << 1.0, c, c, 1.0;
  const boost::math::normal_distribution<double> standard(0.0, 1.0);
  const double exact = boost::math::cdf(standard, -(1.0 - c) / s);  // Phi(-1) = 0.1587
  GramErrorOptions o;
  o.draws = 20000;
  o.spectral_draws = 20000;
  o.seed = 7;
  const GramError e = gramline::predict_gram_error(k, homogeneous_sigma(2, s), o);
  // K + E and K - E cannot both turn negative (e > 1 - c and -e > 1 - c), so a draw scores 1/2
  // with probability 2 q and 0 otherwise: standard error sqrt(2 q (1 - 2 q) / 4 / draws).
  const double se = std::sqrt(2 * exact * (1 - 2 * exact) / 4 / o.draws);
  EXPECT_NEAR(e.p_negative_eigenvalue, exact, 4 * se);
  EXPECT_NEAR(e.p_negative_standard_error, se, 0.05 * se);
  EXPECT_LE(e.p_negative_low, exact + 1e-3);
  EXPECT_GE(e.p_negative_high, exact - 1e-3);
  const double half_normal = s * std::sqrt(2.0 / M_PI);
  // sd of |e| is s sqrt(1 - 2/pi); 4 standard errors of the mean.
  EXPECT_NEAR(e.spectral_estimate, half_normal, 4 * s * std::sqrt(1 - 2 / M_PI) / 141.0);
  EXPECT_EQ(e.draws, 20000);
  EXPECT_FALSE(e.reduced);
}

// Wigner semicircle law (common practice): a symmetric N x N matrix with independent entries of
// standard deviation s has spectral norm close to 2 s sqrt(N) for large N; the simulated mean
// must sit within a few per cent, below the rigorous bound sqrt(2 v log 2N), v = (N - 1) s^2.
TEST(GramError, SpectralNormNearSemicircleEdgeAndBelowTheBound) {
  const int n = 200;
  const double s = 0.01;
  GramErrorOptions o;
  o.draws = 20;
  o.spectral_draws = 20;
  const GramError e =
      gramline::predict_gram_error(Eigen::MatrixXd::Identity(n, n), homogeneous_sigma(n, s), o);
  EXPECT_NEAR(e.spectral_estimate / (2 * s * std::sqrt(static_cast<double>(n))), 1.0, 0.03);
  EXPECT_NEAR(e.spectral_upper_bound, std::sqrt(2 * (n - 1) * s * s * std::log(2.0 * n)), 1e-12);
  EXPECT_LT(e.spectral_estimate, e.spectral_upper_bound);
  EXPECT_EQ(e.p_negative_eigenvalue, 0.0);  // eigenvalues 1 +- 0.28 stay positive
}

// Rank deficient (all ones, rank 1: eigenvalues N and N-1 zeros) with noise: the N-1 zero
// eigenvalues spread like those of an (N-1) x (N-1) random matrix, so some eigenvalue goes
// negative all but surely; the old first-order figure 1 - 2^-(N-1) = 0.998 is not what happens.
TEST(GramError, RankDeficientMatrixAlmostSurelyGoesNegative) {
  const int n = 10;
  const GramError e =
      gramline::predict_gram_error(Eigen::MatrixXd::Ones(n, n), homogeneous_sigma(n, 0.05));
  EXPECT_NEAR(e.min_eigenvalue, 0.0, 1e-12);
  EXPECT_EQ(e.p_negative_eigenvalue, 1.0);
}

// No noise at all: nothing can turn negative, even on a singular matrix (the rounding shift).
TEST(GramError, NoNoiseNoNegativeEigenvalue) {
  const GramError e =
      gramline::predict_gram_error(Eigen::MatrixXd::Ones(6, 6), Eigen::MatrixXd::Zero(6, 6));
  EXPECT_EQ(e.p_negative_eigenvalue, 0.0);
  EXPECT_EQ(e.spectral_estimate, 0.0);
}

TEST(GramError, SameResultForAnyThreadCount) {
  Eigen::MatrixXd k = Eigen::MatrixXd::Constant(12, 12, 0.9);
  k.diagonal().setOnes();
  GramNoise noise{homogeneous_sigma(12, 0.03), {{"shared", {{0, 5, 0.02}, {3, 4, -0.01}}}}};
  GramErrorOptions one;
  one.threads = 1;
  one.seed = 99;
  GramErrorOptions three = one;
  three.threads = 3;
  const GramError a = gramline::predict_gram_error(k, noise, one);
  const GramError b = gramline::predict_gram_error(k, noise, three);
  EXPECT_GT(a.p_negative_eigenvalue, 0.0);
  EXPECT_LT(a.p_negative_eigenvalue, 1.0);
  EXPECT_EQ(a.p_negative_eigenvalue, b.p_negative_eigenvalue);
  EXPECT_EQ(a.spectral_estimate, b.spectral_estimate);
  GramErrorOptions other = one;
  other.seed = 100;
  EXPECT_NE(gramline::predict_gram_error(k, noise, other).spectral_estimate, a.spectral_estimate);
}

// Above full_size_limit the draws shrink with (limit/N)^3, never below 100 (10 spectral, which
// may then double while the spectral mean is uncertain), and the result says so.
TEST(GramError, LargeMatricesUseTheLabelledReducedSimulation) {
  GramErrorOptions o;
  o.full_size_limit = 20;
  const GramError e = gramline::predict_gram_error(Eigen::MatrixXd::Identity(40, 40),
                                                   homogeneous_sigma(40, 0.01), o);
  EXPECT_TRUE(e.reduced);
  EXPECT_EQ(e.draws, 125);  // 1000 (20/40)^3
  EXPECT_GE(e.spectral_draws, 13);
  EXPECT_LE(e.spectral_draws, 125);
  EXPECT_NE(e.report().find("approximation"), std::string::npos) << e.report();
  EXPECT_NE(e.method().find("above 20"), std::string::npos) << e.method();
  o.full_size_limit = 5;
  const GramError f = gramline::predict_gram_error(Eigen::MatrixXd::Identity(40, 40),
                                                   homogeneous_sigma(40, 0.01), o);
  EXPECT_EQ(f.draws, 100);
  EXPECT_GE(f.spectral_draws, 10);
  EXPECT_LE(f.spectral_draws, 100);
  EXPECT_LE(f.spectral_standard_error, 0.01 * f.spectral_estimate);
  const GramError g =
      gramline::predict_gram_error(Eigen::MatrixXd::Identity(10, 10), homogeneous_sigma(10, 0.01));
  EXPECT_FALSE(g.reduced);
  EXPECT_EQ(g.draws, 1000);
  EXPECT_GE(g.spectral_draws, 100);
  EXPECT_NE(g.report().find("1000 noise draws"), std::string::npos) << g.report();
}

TEST(GramError, CancelFlagStops) {
  gramline::CancelFlag cancel{true};
  GramErrorOptions o;
  o.hooks.cancel = &cancel;
  EXPECT_THROW(gramline::predict_gram_error(Eigen::MatrixXd::Identity(20, 20),
                                            homogeneous_sigma(20, 0.01), o),
               gramline::Cancelled);
}

// ---------------------------------------------------------------------------------------------
// Against a simulation of the counts of planned campaigns.

struct Bloch {
  double theta_deg, phi_deg;
};

// A campaign on the demo's rig whose features are the Bloch angles themselves: point i has
// features (theta_1, phi_1, ..., theta_P, phi_P) in degrees and photon p reads its own two.
Campaign campaign_for(const std::vector<std::vector<Bloch>>& points, gramline::DetectionScheme s,
                      double epsilon) {
  Campaign c = gramline::make_demo_campaign();
  const int photons = static_cast<int>(points.front().size());
  const int n = static_cast<int>(points.size());
  c.data.feature_names.clear();
  for (int f = 0; f < 2 * photons; ++f) c.data.feature_names.push_back("f" + std::to_string(f));
  c.data.train.resize(n, 2 * photons);
  c.data.train_labels.resize(n);
  for (int i = 0; i < n; ++i) {
    for (int p = 0; p < photons; ++p) {
      c.data.train(i, 2 * p) = points[i][p].theta_deg;
      c.data.train(i, 2 * p + 1) = points[i][p].phi_deg;
    }
    c.data.train_labels(i) = i % 2 == 0 ? 1 : -1;
  }
  c.data.test.resize(0, 2 * photons);
  c.data.test_labels.resize(0);
  c.encoding = {};
  for (int p = 0; p < photons; ++p) {
    gramline::PhotonEncoding e;
    e.theta_weights_deg = Eigen::VectorXd::Unit(2 * photons, 2 * p);
    e.phi_weights_deg = Eigen::VectorXd::Unit(2 * photons, 2 * p + 1);
    c.encoding.photons.push_back(e);
  }
  std::vector<gramline::Motor> motors;
  for (const gramline::Motor& m : c.rig.motors)
    if (m.photon < photons) motors.push_back(m);
  c.rig.motors = motors;
  c.rig.detectors.resize(photons);
  c.rig.scheme = s;
  c.precision.budget = {gramline::BudgetMethod::normal, epsilon, 0.95, false};
  c.nights.max_nights = 30;
  return c;
}

// One photon's ideal overlap |<psi(b)|psi(a)>|^2 = (1 + n_a . n_b)/2 with the Bloch vectors
// n = (cos theta, sin theta cos phi, sin theta sin phi) of docs/conventions.md.
double photon_overlap(const Bloch& a, const Bloch& b) {
  const double d = M_PI / 180.0;
  const double ta = a.theta_deg * d, tb = b.theta_deg * d, pa = a.phi_deg * d, pb = b.phi_deg * d;
  return 0.5 *
         (1.0 + std::cos(ta) * std::cos(tb) + std::sin(ta) * std::sin(tb) * std::cos(pa - pb));
}

// What the counts of one entry look like, from the rig model (README, user guide step 5):
// p = V kappa + (1 - V)/2^P, r = R prod eta, singles S_p = R eta_p (V kappa_p + (1 - V)/2) +
// dark, accidentals a = tau^(P-1) prod S_p (pass) and a_tot = tau^(P-1) prod (R eta_p + 2 dark)
// (all channels); none for one photon.
struct EntryRates {
  double kappa, p, r, a, a_tot;
};

EntryRates entry_rates(const Campaign& c, const std::vector<Bloch>& x,
                       const std::vector<Bloch>& y) {
  const int photons = static_cast<int>(x.size());
  const double v = c.rig.source.visibility, rate = c.rig.source.pair_rate_per_s;
  const double tau = c.rig.coincidence_window_s;
  EntryRates e{1.0, 0.0, rate, std::pow(tau, photons - 1), std::pow(tau, photons - 1)};
  for (int p = 0; p < photons; ++p) {
    const double kp = photon_overlap(x[p], y[p]);
    const gramline::Detector& d = c.rig.detectors[p];
    e.kappa *= kp;
    e.r *= d.efficiency;
    e.a *= rate * d.efficiency * (v * kp + (1 - v) / 2) + d.dark_rate_per_s;
    e.a_tot *= rate * d.efficiency + 2 * d.dark_rate_per_s;
  }
  if (photons < 2) e.a = e.a_tot = 0.0;
  e.p = v * e.kappa + (1 - v) / std::pow(2.0, photons);
  return e;
}

struct CountSimulation {
  double p_negative = 0.0;
  double p_negative_se = 0.0;
  double spectral_mean = 0.0;
  double spectral_se = 0.0;
};

// Monte Carlo of whole campaigns: every training entry counted for pairs / r seconds, Poisson
// counts in the pass channel and in the other channels (so the total is Poisson and the pass
// count binomial given it), turned into kernel estimates by the README's estimators (user guide
// step 6). With `reference_pairs` > 0 (pass port only) the pair rate r is not known but taken,
// in each trial, from one reference step (kernel 1) of that many pairs:
// r_hat = (n_ref / t_ref - a_ref) / p_ref. Eigenvalues by Eigen's SelfAdjointEigenSolver.
CountSimulation simulate_counts(const Campaign& c, const std::vector<std::vector<Bloch>>& points,
                                const Eigen::MatrixXd& pairs, int trials, std::uint64_t seed,
                                double reference_pairs = 0.0) {
  const int n = static_cast<int>(points.size());
  const int photons = static_cast<int>(points.front().size());
  const double v = c.rig.source.visibility, floor = (1 - v) / std::pow(2.0, photons);
  const bool pass_only = c.rig.scheme == gramline::DetectionScheme::pass_only;
  std::vector<std::vector<EntryRates>> rates(n, std::vector<EntryRates>(n));
  Eigen::MatrixXd ideal = Eigen::MatrixXd::Identity(n, n);
  for (int i = 0; i < n; ++i)
    for (int j = 0; j < n; ++j) {
      rates[i][j] = entry_rates(c, points[i], points[j]);
      if (i != j) ideal(i, j) = rates[i][j].kappa;
    }
  const EntryRates ref = entry_rates(c, points[0], points[0]);
  std::mt19937_64 rng(seed);
  int negatives = 0;
  double sum = 0.0, sum_sq = 0.0;
  Eigen::MatrixXd measured(n, n);
  for (int t = 0; t < trials; ++t) {
    double r_hat = ref.r;
    if (reference_pairs > 0) {
      const double t_ref = reference_pairs / ref.r;
      std::poisson_distribution<long long> count((ref.r * ref.p + ref.a) * t_ref);
      r_hat = (static_cast<double>(count(rng)) / t_ref - ref.a) / ref.p;
    }
    measured.setIdentity();
    for (int i = 0; i < n; ++i)
      for (int j = i + 1; j < n; ++j) {
        const EntryRates& e = rates[i][j];
        const double dwell = pairs(i, j) / e.r;
        std::poisson_distribution<long long> pass((e.r * e.p + e.a) * dwell);
        const double n_pass = static_cast<double>(pass(rng));
        double p_hat;
        if (pass_only) {
          p_hat = (n_pass - e.a * dwell) / (r_hat * dwell);
        } else {
          std::poisson_distribution<long long> other((e.r * (1 - e.p) + e.a_tot - e.a) * dwell);
          const double n_total = n_pass + static_cast<double>(other(rng));
          p_hat = (n_pass / n_total * (e.r + e.a_tot) - e.a) / e.r;
        }
        measured(i, j) = measured(j, i) = (p_hat - floor) / v;
      }
    Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> k(measured, Eigen::EigenvaluesOnly);
    if (k.eigenvalues()(0) < 0) ++negatives;
    Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> err(measured - ideal, Eigen::EigenvaluesOnly);
    const double norm = err.eigenvalues().cwiseAbs().maxCoeff();
    sum += norm;
    sum_sq += norm * norm;
  }
  CountSimulation s;
  s.p_negative = static_cast<double>(negatives) / trials;
  s.p_negative_se = std::sqrt(s.p_negative * (1 - s.p_negative) / trials);
  s.spectral_mean = sum / trials;
  s.spectral_se = std::sqrt((sum_sq / trials - s.spectral_mean * s.spectral_mean) / trials);
  return s;
}

// Plans the set, simulates its counts and compares: |P_pred - P_sim| <= 0.03 and the spectral
// estimate within 15 % of the simulated mean (the goals stated in the README, user guide step 12).
// Standard errors, printed with the figures: the prediction's 1000 paired draws about 0.009 at
// most in these sets (0.016 would be the bound for unpaired draws), the reference's 20000
// counts-level trials at most 0.0035.
struct Comparison {
  GramError predicted;
  CountSimulation simulated;
};

Comparison compare(const char* name, const std::vector<std::vector<Bloch>>& points,
                   gramline::DetectionScheme scheme, double epsilon, std::uint64_t seed) {
  const Campaign c = campaign_for(points, scheme, epsilon);
  const gramline::Plan plan = gramline::plan_campaign(c);
  Comparison out{plan.gram_error, simulate_counts(c, points, plan.pairs_train, 20000, seed)};
  std::printf(
      "[%s] N=%d, smallest eigenvalue %.3g: P(negative) predicted %.3f +- %.3f, simulated "
      "%.3f +- %.4f; spectral norm predicted %.4g, simulated %.4g +- %.2g (bound %.4g)\n",
      name, static_cast<int>(points.size()), out.predicted.min_eigenvalue,
      out.predicted.p_negative_eigenvalue, out.predicted.p_negative_standard_error,
      out.simulated.p_negative, out.simulated.p_negative_se, out.predicted.spectral_estimate,
      out.simulated.spectral_mean, out.simulated.spectral_se, out.predicted.spectral_upper_bound);
  EXPECT_TRUE(out.predicted.simulated);
  EXPECT_NEAR(out.predicted.p_negative_eigenvalue, out.simulated.p_negative, 0.03) << name;
  EXPECT_NEAR(out.predicted.spectral_estimate / out.simulated.spectral_mean, 1.0, 0.15) << name;
  EXPECT_GT(out.predicted.spectral_upper_bound, out.simulated.spectral_mean) << name;
  return out;
}

std::vector<std::vector<Bloch>> linear_points(const std::vector<std::vector<double>>& thetas) {
  std::vector<std::vector<Bloch>> out;
  for (const auto& t : thetas) {
    std::vector<Bloch> x;
    for (double th : t) x.push_back({th, 0.0});
    out.push_back(x);
  }
  return out;
}

// Two photons, linear polarization, eight points: the kernel has rank at most 9 and its
// smallest eigenvalues crowd near zero.
TEST(GramErrorAgainstCounts, SmallLinearTwoPhotonSet) {
  const auto points = linear_points(
      {{20, 30}, {45, 150}, {70, 60}, {95, 110}, {120, 20}, {140, 90}, {160, 140}, {35, 100}});
  compare("linear two-photon", points, gramline::DetectionScheme::both_ports, 0.05, 11);
}

// One photon, linear polarization, six points: kernel (1 + cos(theta_a - theta_b))/2 of rank 3,
// so three eigenvalues are exactly zero.
TEST(GramErrorAgainstCounts, RankThreeSet) {
  const auto points = linear_points({{10}, {40}, {70}, {100}, {130}, {160}});
  compare("rank 3", points, gramline::DetectionScheme::both_ports, 0.02, 12);
}

// Two photons, three groups of three: three large eigenvalues and six small ones bunched
// together (5.8e-5 to 0.23).
std::vector<std::vector<Bloch>> clustered_points() {
  return linear_points({{30, 40},
                        {55, 52.5},
                        {17.5, 15},
                        {90, 120},
                        {115, 145},
                        {65, 111.67},
                        {150, 60},
                        {125, 85},
                        {162.5, 72.5}});
}

TEST(GramErrorAgainstCounts, ClusteredSpectrum) {
  compare("clustered", clustered_points(), gramline::DetectionScheme::both_ports, 0.002, 13);
}

// One photon on the vertices of a tetrahedron on the Bloch sphere (overlaps 1/3): eigenvalues
// 2 and 2/3 (three times), far above the noise.
TEST(GramErrorAgainstCounts, WellConditionedSet) {
  const double t = std::acos(-1.0 / 3.0) * 180.0 / M_PI;
  const std::vector<std::vector<Bloch>> points = {{{0, 0}}, {{t, 0}}, {{t, 120}}, {{t, 240}}};
  const Comparison c =
      compare("well conditioned", points, gramline::DetectionScheme::pass_only, 0.02, 14);
  EXPECT_NEAR(c.predicted.min_eigenvalue, 2.0 / 3.0, 1e-9);
  EXPECT_EQ(c.predicted.p_negative_eigenvalue, 0.0);
}

// Pass port only, with the pair rate taken in every simulated campaign from one reference step
// of as many pairs as an entry: the reference's Poisson error moves every entry together. To
// first order kappa_hat = ((n - a t)/(r_hat t) - (1 - V)/2^P)/V shifts by -(p/V) dr/r, and
// Var(r_hat)/r^2 = (p_ref + a_ref/r)/(pairs_ref p_ref^2) (Poisson; README, user guide step 6),
// which is one shared component with loading -(p_ij/V) sd(r_hat)/r on entry (i, j). The plan's
// own estimate_gram_error call must follow the simulated counts with it, and miss the spectral
// norm without it.
TEST(GramErrorAgainstCounts, SharedCalibrationComponent) {
  const auto points = clustered_points();
  const Campaign c = campaign_for(points, gramline::DetectionScheme::pass_only, 0.002);
  gramline::Plan plan = gramline::plan_campaign(c);
  const int n = static_cast<int>(points.size());
  const double pairs_ref = plan.pairs_train(0, 1);
  const EntryRates ref = entry_rates(c, points[0], points[0]);
  const double v = c.rig.source.visibility;
  const double sd_rel = std::sqrt((ref.p + ref.a / ref.r) / pairs_ref) / ref.p;
  gramline::SharedNoiseComponent calibration{"reference step", {}};
  for (int i = 0; i < n; ++i)
    for (int j = i + 1; j < n; ++j)
      calibration.loadings.push_back({i, j, -entry_rates(c, points[i], points[j]).p / v * sd_rel});

  const GramError independent = plan.gram_error;
  plan.shared_noise_train = {calibration};
  gramline::GramErrorOptions o;
  o.seed = 15;
  gramline::estimate_gram_error(plan, o);
  const GramError& shared = plan.gram_error;
  const CountSimulation sim = simulate_counts(c, points, plan.pairs_train, 20000, 16, pairs_ref);
  std::printf(
      "[shared calibration] P(negative) predicted %.3f +- %.3f (independent only %.3f), "
      "simulated %.3f +- %.4f; spectral norm predicted %.4g (independent only %.4g), simulated "
      "%.4g +- %.2g (bound %.4g)\n",
      shared.p_negative_eigenvalue, shared.p_negative_standard_error,
      independent.p_negative_eigenvalue, sim.p_negative, sim.p_negative_se,
      shared.spectral_estimate, independent.spectral_estimate, sim.spectral_mean, sim.spectral_se,
      shared.spectral_upper_bound);
  EXPECT_GT(plan.summary.gram_error_ms, 0.0);
  EXPECT_NEAR(shared.p_negative_eigenvalue, sim.p_negative, 0.03);
  EXPECT_NEAR(shared.spectral_estimate / sim.spectral_mean, 1.0, 0.15);
  EXPECT_GT(shared.spectral_upper_bound, sim.spectral_mean);
  EXPECT_GT(std::abs(independent.spectral_estimate / sim.spectral_mean - 1.0), 0.15);
  EXPECT_GT(shared.sigma_frobenius, independent.sigma_frobenius);
}

}  // namespace
