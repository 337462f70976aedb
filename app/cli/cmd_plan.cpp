#include <QDir>
#include <QString>
#include <iostream>

#include "cli/commands.h"
#include "cli/progress_line.h"
#include "formats/atomic_file.h"
#include "formats/campaign_json.h"
#include "formats/data_csv.h"
#include "formats/file_set.h"
#include "formats/input_error.h"
#include "formats/plan_files.h"
#include "gramline/demo.h"
#include "gramline/new_campaign.h"
#include "gramline/plan.h"

namespace gramline::cli {

using formats::InputError;

Campaign load_campaign_for_command(const std::string& campaign_path,
                                   const std::optional<std::string>& data_path) {
  Campaign campaign = formats::load_campaign(QString::fromStdString(campaign_path));
  if (data_path) {
    DataSet data = formats::read_data_csv(QString::fromStdString(*data_path));
    if (!campaign.encoding.check(data.feature_count()).empty()) {
      // Another number of features: keep the rig and its photons, spread the features over them
      // (docs/conventions.md, "Encoding presets").
      const std::string problem = validate(data);
      if (!problem.empty()) throw InputError(*data_path + ": " + problem);
      const int old_features = campaign.encoding.feature_count();
      try {
        campaign.encoding = encoding_for_features(campaign.encoding, data);
      } catch (const std::invalid_argument& e) {
        throw InputError(*data_path + ": " + e.what());
      }
      std::cerr << "gramline-cli: " << *data_path << " has " << data.feature_count()
                << " feature(s), the encoding of " << campaign_path << " read " << old_features
                << "; the features are spread over its " << campaign.encoding.photon_count()
                << " photon(s) with the '" << to_string(campaign.encoding.preset) << "' preset\n";
    }
    campaign.data = std::move(data);
  }
  const std::string problem = campaign.check_consistency();
  if (!problem.empty()) {
    throw InputError(campaign_path + (data_path ? " with " + *data_path : std::string()) + ": " +
                     problem);
  }
  return campaign;
}

int run_demo(const DemoRequest& request) {
  const QString out = QString::fromStdString(request.out_path);
  formats::refuse_existing(out,
                           request.force ? formats::Overwrite::allow : formats::Overwrite::refuse);
  const Campaign campaign = request.seed ? make_demo_campaign(*request.seed) : make_demo_campaign();
  formats::save_campaign(campaign, out);
  std::cout << "wrote the demo campaign '" << campaign.name << "' (" << campaign.data.train_count()
            << " training and " << campaign.data.test_count() << " test points, "
            << campaign.rig.motors.size() << " motors) to " << request.out_path << "\n";
  return 0;
}

int run_plan(const PlanRequest& request) {
  // Refuse before planning: a plan that would be refused should not cost the planning time.
  const formats::Overwrite overwrite =
      request.force ? formats::Overwrite::allow : formats::Overwrite::refuse;
  if (request.out_dir) {
    const QString out = QString::fromStdString(*request.out_dir);
    formats::refuse_unusable_output_folder(out);
    for (const std::string& name : formats::plan_file_names()) {
      formats::refuse_existing(QDir(out).filePath(QString::fromStdString(name)), overwrite);
    }
  }
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
    // The engine names the field; the user needs the file too.
    throw InputError(request.campaign_path + ": " + e.what());
  }
  std::cout << plan.report();
  if (!plan.report().empty() && plan.report().back() != '\n') std::cout << "\n";
  if (request.out_dir) {
    formats::write_plan_files(campaign, plan, QString::fromStdString(*request.out_dir), overwrite);
    std::cout << "wrote steps.json, steps.csv, summary.json and kernel.csv to " << *request.out_dir
              << "\n";
  }
  if (!plan.summary.fits) {
    std::cerr << "the plan does not fit the nights allowed (exit status 3); its files are "
                 "written\n";
    return kExitDoesNotFit;
  }
  return 0;
}

}  // namespace gramline::cli
