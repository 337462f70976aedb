// gramline-cli resume: plan the rest of an interrupted campaign and hand off a new bundle.
#include <QString>
#include <iostream>

#include "cli/commands.h"
#include "cli/progress_line.h"
#include "formats/bundle.h"
#include "formats/cautions_text.h"
#include "formats/counts_csv.h"
#include "formats/resume_run.h"
#include "formats/signature.h"

namespace gramline::cli {

int run_resume(const ResumeRequest& request) {
  const QString out = QString::fromStdString(request.out_path);
  const QString parent_path = QString::fromStdString(request.bundle_path);
  const formats::Overwrite overwrite =
      request.force ? formats::Overwrite::allow : formats::Overwrite::refuse;
  formats::refuse_existing(out, overwrite);
  std::optional<std::string> key;
  if (request.lab_key_path)
    key = formats::read_lab_key(QString::fromStdString(*request.lab_key_path));
  const formats::Bundle bundle = formats::read_bundle_checked(parent_path, key);
  const formats::CountsFile counts = formats::read_counts_csv(
      QString::fromStdString(request.counts_path), formats::counts_layout(bundle.campaign));
  formats::ResumeRun run;
  {
    ProgressLine progress("planning the rest", kPlanProgressDelay_s);
    formats::ResumeOptions options;
    options.first_night = request.first_night.value_or("");
    run = formats::plan_resume(bundle, counts, progress.hooks(), options);
  }
  if (!run.bundle_warning.empty())
    std::cerr << "gramline-cli resume: warning: " << run.bundle_warning << "\n";
  std::cout << run.report();
  const formats::BundleWritten written =
      formats::write_resumed_bundle(run, bundle, parent_path, out, overwrite, key);
  std::cout << "wrote the bundle " << request.out_path << " (" << written.entries.size()
            << " files; parent " << bundle.manifest_sha256.substr(0, 12) << "...; manifest SHA-256 "
            << written.manifest_sha256 << "; bundle id " << written.bundle_id << ")\n\n"
            << formats::cautions_terminal_notice();
  if (!run.plan.summary.fits) {
    std::cerr << "the plan does not fit the nights allowed (exit status 3); its files are "
                 "written\n";
    return kExitDoesNotFit;
  }
  return 0;
}

}  // namespace gramline::cli
