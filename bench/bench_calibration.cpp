// Simulated nights against the plan's promise (docs/error-budget.md): for the demo and a
// one-photon campaign with one-hour nights, both detection schemes, plans the campaign, draws
// NIGHTS independent runs with the engine's count simulator, ingests each and prints the
// standard deviation of the pooled z-scores (each entry's z with its own marginal sigma; goal
// [0.95, 1.05]), the share of |z| > 2 and > 4 against the normal tails, the largest calibration
// share and what the references cost.
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <random>
#include <string>

#include "../tests/shared/one_photon.h"
#include "gramline/demo.h"
#include "gramline/estimates.h"
#include "gramline/ingest.h"
#include "gramline/plan.h"
#include "gramline/simulate.h"

using namespace gramline;

namespace {

Campaign one_photon(DetectionScheme scheme) {
  return one_photon_test::one_photon_short_nights(scheme, 30, 10);
}

void run(const char* name, const Campaign& c, int nights) {
  const auto t0 = std::chrono::steady_clock::now();
  PlanOptions po;
  po.simulate_gram_error = false;
  const Plan plan = plan_campaign(c, po);
  SampleMoments z;
  long over2 = 0, over4 = 0;
  for (int k = 0; k < nights; ++k) {
    CountSimulationOptions so;
    so.seed = 500 + k;
    const IngestResult r = ingest_records(c, plan, simulate_counts(c, plan.steps, so));
    auto add = [&](double x) {
      if (!std::isfinite(x)) return;
      z.add(x);
      over2 += std::abs(x) > 2.0;
      over4 += std::abs(x) > 4.0;
    };
    for (int i = 0; i < r.gram_z.rows(); ++i)
      for (int j = i + 1; j < r.gram_z.cols(); ++j) add(r.gram_z(i, j));
    for (int t = 0; t < r.test_z.rows(); ++t)
      for (int j = 0; j < r.test_z.cols(); ++j) add(r.test_z(t, j));
  }
  const double secs = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
  const PlanSummary& s = plan.summary;
  std::printf(
      "%-28s z sd %.4f (mean %+.4f, %d values, %d nights); |z|>2 %.4f (normal %.4f), |z|>4 %ld "
      "(normal expects %.2f); calibration share max %.3f; %ld references of %.0f pairs, "
      "references/dark/park %.2f h of %.2f h busy; %.1f s\n",
      name, z.standard_deviation(), z.mean(), z.count, nights, static_cast<double>(over2) / z.count,
      std::erfc(2.0 / std::sqrt(2.0)), over4, z.count * std::erfc(4.0 / std::sqrt(2.0)),
      s.calibration_share_max, s.reference_steps, s.reference_pairs, s.reference_s / 3600.0,
      (s.integration_s + s.move_s + s.reference_s) / 3600.0, secs);
}

}  // namespace

int main(int argc, char** argv) {
  const int nights = argc > 1 ? std::atoi(argv[1]) : 8;
  for (DetectionScheme scheme : {DetectionScheme::pass_only, DetectionScheme::both_ports}) {
    Campaign demo = make_demo_campaign();
    demo.rig.scheme = scheme;
    run(("demo, " + to_string(scheme)).c_str(), demo, nights);
    run(("one photon, " + to_string(scheme)).c_str(), one_photon(scheme), nights);
  }
  return 0;
}
