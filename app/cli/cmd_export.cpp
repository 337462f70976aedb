// gramline-cli export: plan a campaign and write the hand-off bundle for the rig.
#include <QString>
#include <iostream>
#include <stdexcept>

#include "cli/commands.h"
#include "cli/progress_line.h"
#include "formats/bundle.h"
#include "formats/cautions_text.h"
#include "formats/input_error.h"
#include "formats/signature.h"
#include "gramline/plan.h"

namespace gramline::cli {

int run_export(const ExportRequest& request) {
  const QString out = QString::fromStdString(request.out_path);
  const formats::Overwrite overwrite =
      request.force ? formats::Overwrite::allow : formats::Overwrite::refuse;
  // Refuse before planning: an export that would be refused should not cost the planning time.
  formats::refuse_existing(out, overwrite);
  formats::BundleWriteOptions bundle;
  bundle.overwrite = overwrite;
  if (request.lab_key_path)
    bundle.lab_key = formats::read_lab_key(QString::fromStdString(*request.lab_key_path));
  Campaign campaign = load_campaign_for_command(request.campaign_path, request.data_path);
  PlanOptions options;
  options.seed = request.seed.value_or(campaign.seed);
  campaign.seed = options.seed;
  Plan plan;
  try {
    ProgressLine progress("planning", kPlanProgressDelay_s);
    options.hooks = progress.hooks();
    plan = plan_campaign(campaign, options);
  } catch (const std::invalid_argument& e) {
    throw formats::InputError(request.campaign_path + ": " + e.what());
  }
  std::cout << plan.report();
  const formats::BundleWritten written = formats::write_bundle(campaign, plan, out, bundle);
  std::cout << "wrote the bundle " << request.out_path << " (" << written.entries.size()
            << " files, " << written.zip_bytes << " bytes; manifest SHA-256 "
            << written.manifest_sha256 << (bundle.lab_key ? "; signed with the lab key" : "")
            << ")\n"
            << "bundle id " << written.bundle_id
            << ": the rig's counts file names it in its first line '# bundle: " << written.bundle_id
            << "'\n\n"
            << formats::cautions_terminal_notice();
  if (!plan.summary.fits) {
    std::cerr << "the plan does not fit the nights allowed (exit status 3); its files are "
                 "written\n";
    return kExitDoesNotFit;
  }
  return 0;
}

}  // namespace gramline::cli
