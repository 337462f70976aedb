#pragma once
// The commands of gramline-cli. Each returns the exit status (0 success, 2 bad input, 1 internal
// failure); bad input may also be thrown as formats::InputError, which main turns into status 2.
// Every command that writes leaves existing outputs as they are unless `force` is set, and
// refuses before its long work starts.
#include <cstdint>
#include <optional>
#include <string>

#include "gramline/campaign.h"

namespace gramline::cli {

struct DemoRequest {
  std::string out_path;
  std::optional<std::uint64_t> seed;  ///< generator seed of the demo data (default: the demo's)
  bool force = false;                 ///< replace an existing out_path
};

struct PlanRequest {
  std::string campaign_path;
  std::optional<std::string> data_path;
  std::optional<std::string> out_dir;
  std::optional<std::uint64_t> seed;
  bool force = false;  ///< replace plan files already in out_dir
};

struct CheckRequest {
  std::string campaign_path;
  std::optional<std::string> data_path;
  std::optional<int> trials;
  std::optional<std::uint64_t> seed;
  /// Where the check JSON goes; without it the JSON goes to standard output and the report to
  /// standard error.
  std::optional<std::string> out_path;
  bool force = false;  ///< replace an existing out_path
};

struct ExportRequest {
  std::string campaign_path;
  std::optional<std::string> data_path;
  std::string out_path;
  bool force = false;
  std::optional<std::uint64_t> seed;
};

struct IngestRequest {
  std::string bundle_path;
  std::string counts_path;
  std::string out_dir;
  bool force = false;
};

struct ResumeRequest {
  std::string bundle_path;
  std::string counts_path;
  std::string out_path;
  bool force = false;
};

struct CompareRequest {
  std::string path_a;
  std::string path_b;
  std::optional<std::string> out_path;  ///< the comparison JSON (the table always goes to stdout)
  bool force = false;
};

int run_demo(const DemoRequest& request);
int run_plan(const PlanRequest& request);
/// The margin check (cmd_check.cpp).
int run_check(const CheckRequest& request);
/// Hand-off to the rig and back (cmd_export.cpp, cmd_ingest.cpp, cmd_resume.cpp).
int run_export(const ExportRequest& request);
int run_ingest(const IngestRequest& request);
int run_resume(const ResumeRequest& request);
/// Two campaigns planned side by side (cmd_compare.cpp).
int run_compare(const CompareRequest& request);

/// Loads the campaign file and, with `data_path`, replaces its points by the data CSV. Throws
/// formats::InputError naming the file, line or field; also when the campaign's encoding does
/// not accept the CSV's number of features, or the campaign is inconsistent
/// (Campaign::check_consistency).
Campaign load_campaign_for_command(const std::string& campaign_path,
                                   const std::optional<std::string>& data_path);

}  // namespace gramline::cli
