// gramline-cli compare: two campaigns planned and set side by side (docs/plan-files.md,
// "Comparing two plans").
#include <QString>
#include <iostream>
#include <stdexcept>

#include "cli/commands.h"
#include "cli/progress_line.h"
#include "formats/atomic_file.h"
#include "formats/compare_json.h"
#include "formats/input_error.h"
#include "gramline/plan.h"

namespace gramline::cli {

namespace {

Plan plan_for_compare(const std::string& path, const Campaign& campaign) {
  PlanOptions options;
  options.seed = campaign.seed;
  try {
    ProgressLine progress("planning " + path, kPlanProgressDelay_s);
    options.hooks = progress.hooks();
    return plan_campaign(campaign, options);
  } catch (const std::invalid_argument& e) {
    throw formats::InputError(path + ": " + e.what());
  }
}

}  // namespace

int run_compare(const CompareRequest& request) {
  if (request.out_path) {
    formats::refuse_existing(
        QString::fromStdString(*request.out_path),
        request.force ? formats::Overwrite::allow : formats::Overwrite::refuse);
  }
  // Both files are read before either is planned: a typo in B is reported at once.
  const Campaign a = load_campaign_for_command(request.path_a, std::nullopt);
  const Campaign b = load_campaign_for_command(request.path_b, std::nullopt);
  const Plan plan_a = plan_for_compare(request.path_a, a);
  const Plan plan_b = plan_for_compare(request.path_b, b);
  std::cout << formats::format_compare_table(a.name, plan_a, b.name, plan_b);
  if (request.out_path) {
    formats::save_atomically(
        QString::fromStdString(*request.out_path),
        formats::format_compare_json(a.name, plan_a, b.name, plan_b),
        request.force ? formats::Overwrite::allow : formats::Overwrite::refuse);
    std::cout << "wrote the comparison to " << *request.out_path << "\n";
  }
  return 0;
}

}  // namespace gramline::cli
