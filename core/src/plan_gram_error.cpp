// The Gram-error estimate of a finished plan, kept apart from planning so that it can run after
// the plan is shown; its time is reported on its own (PlanSummary::gram_error_ms).
#include "gramline/gram_error.h"
#include "gramline/plan.h"

namespace gramline {

void estimate_gram_error(Plan& plan, const GramErrorOptions& options) {
  plan.gram_error = predict_gram_error(
      plan.kernel_train, GramNoise{plan.sigma_train, plan.shared_noise_train}, options);
  plan.summary.gram_sigma_frobenius = plan.gram_error.sigma_frobenius;
  plan.summary.gram_error_ms = plan.gram_error.elapsed_ms;
}

}  // namespace gramline
