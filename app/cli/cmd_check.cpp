// gramline-cli check: the margin check of a planned campaign, written as the check JSON
// (formats/check_json.h).
#include <QString>
#include <iostream>
#include <stdexcept>

#include "cli/commands.h"
#include "cli/progress_line.h"
#include "formats/atomic_file.h"
#include "formats/check_json.h"
#include "formats/input_error.h"
#include "gramline/margin.h"
#include "gramline/plan.h"

namespace gramline::cli {

int run_check(const CheckRequest& request) {
  // Refuse before the check, which takes a while.
  if (request.out_path) {
    formats::refuse_existing(
        QString::fromStdString(*request.out_path),
        request.force ? formats::Overwrite::allow : formats::Overwrite::refuse);
  }
  Campaign campaign = load_campaign_for_command(request.campaign_path, request.data_path);
  const std::uint64_t seed = request.seed.value_or(campaign.seed);
  campaign.seed = seed;
  if (request.trials) campaign.check.trials = *request.trials;
  if (campaign.check.trials < 1)
    throw formats::InputError(request.campaign_path + ": check.trials must be at least 1");

  Plan plan;
  PlanOptions plan_options;
  plan_options.seed = seed;
  try {
    ProgressLine progress("planning", kPlanProgressDelay_s);
    plan_options.hooks = progress.hooks();
    plan = plan_campaign(campaign, plan_options);
  } catch (const std::invalid_argument& e) {
    throw formats::InputError(request.campaign_path + ": " + e.what());
  }
  MarginCheckOptions options;
  options.seed = seed;
  MarginCheck check;
  try {
    ProgressLine progress("margin check", 0.0);
    options.hooks = progress.hooks();
    check = check_margin(campaign, plan, options);
  } catch (const std::invalid_argument& e) {
    throw formats::InputError(request.campaign_path + ": " + e.what());
  }
  if (!request.out_path) {
    // Standard output carries only the JSON, so it can be piped or redirected as it is.
    std::cerr << check.report();
    std::cout << formats::format_check_json(campaign, check, seed, options.confidence);
    return 0;
  }
  formats::write_check_json(campaign, check, seed, options.confidence,
                            QString::fromStdString(*request.out_path));
  std::cout << check.report() << "wrote the margin check to " << *request.out_path << "\n";
  return 0;
}

}  // namespace gramline::cli
