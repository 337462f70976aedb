// The Gram-error estimate of a finished plan, kept apart from planning so that it can run after
// the plan is shown; its time is reported on its own (PlanSummary::gram_error_ms).
#include "gramline/gram_error.h"
#include "gramline/plan.h"

namespace gramline {

GramNoise plan_gram_noise(const Plan& plan) {
  // sigma_train holds counts and calibration; the calibration moves entries together through
  // the shared components, so only the counts' part is independent.
  Eigen::MatrixXd independent = plan.sigma_train;
  if (plan.calibration_sigma_train.size() == independent.size())
    independent =
        (plan.sigma_train.array().square() - plan.calibration_sigma_train.array().square())
            .max(0.0)
            .sqrt()
            .matrix();
  return GramNoise{independent, plan.shared_noise_train};
}

void estimate_gram_error(Plan& plan, const GramErrorOptions& options) {
  plan.gram_error = predict_gram_error(plan.kernel_train, plan_gram_noise(plan), options);
  plan.summary.gram_sigma_frobenius = plan.gram_error.sigma_frobenius;
  plan.summary.gram_error_ms = plan.gram_error.elapsed_ms;
}

}  // namespace gramline
