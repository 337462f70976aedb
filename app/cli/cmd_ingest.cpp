// gramline-cli ingest: the rig's counts back into the planner.
#include <QDir>
#include <QString>
#include <iostream>

#include "cli/commands.h"
#include "cli/progress_line.h"
#include "formats/bundle.h"
#include "formats/counts_csv.h"
#include "formats/file_set.h"
#include "formats/ingest_run.h"
#include "formats/signature.h"

namespace gramline::cli {

int run_ingest(const IngestRequest& request) {
  const QString out = QString::fromStdString(request.out_dir);
  const formats::Overwrite overwrite =
      request.force ? formats::Overwrite::allow : formats::Overwrite::refuse;
  // Refuse before the work, as every command that writes does.
  formats::refuse_unusable_output_folder(out);
  for (const std::string& name : formats::ingest_file_names()) {
    formats::refuse_existing(QDir(out).filePath(QString::fromStdString(name)), overwrite);
  }
  std::optional<std::string> key;
  if (request.lab_key_path)
    key = formats::read_lab_key(QString::fromStdString(*request.lab_key_path));
  const formats::Bundle bundle =
      formats::read_bundle_checked(QString::fromStdString(request.bundle_path), key);
  const formats::CountsFile counts = formats::read_counts_csv(
      QString::fromStdString(request.counts_path), formats::counts_layout(bundle.campaign));
  formats::IngestRun run;
  {
    ProgressLine progress("ingesting", 0.0);
    run = formats::ingest_counts(bundle, counts, progress.hooks());
  }
  if (!run.bundle_warning.empty())
    std::cerr << "gramline-cli ingest: warning: " << run.bundle_warning << "\n";
  std::cout << run.report();
  formats::write_ingest_files(run, out, overwrite);
  std::cout << "wrote";
  for (const std::string& name : formats::ingest_file_names()) std::cout << " " << name;
  std::cout << " to " << request.out_dir << "\n";
  return 0;
}

}  // namespace gramline::cli
