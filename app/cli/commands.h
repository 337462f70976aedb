#pragma once
// The commands of gramline-cli. Each returns the exit status (0 success, 2 bad input, 1 internal
// failure, 3 does not fit); bad input may also be thrown as formats::InputError, which main turns
// into status 2. Every command that writes leaves existing outputs as they are unless `force` is
// set, and refuses before its long work starts.
#include <cstdint>
#include <optional>
#include <string>

#include "gramline/campaign.h"

namespace gramline::cli {

/// Exit status of plan, export and resume when their files are written but the plan needs
/// more nights than the campaign allows (README, "Exit status").
constexpr int kExitDoesNotFit = 3;

struct DemoRequest {
  std::string out_path;
  std::optional<std::uint64_t> seed;  ///< generator seed of the demo data (default: the demo's)
  bool force = false;                 ///< replace an existing out_path
};

struct NewRequest {
  std::string data_path;
  std::string out_path;
  std::optional<int> photons;         ///< 1 to 4; absent: the rig file's, else 2
  std::optional<std::string> preset;  ///< linear, polar-azimuth or spread; absent: by D and P
  std::optional<std::string> rig_path;
  bool force = false;
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
  std::optional<std::string> lab_key_path;  ///< sign the bundle (docs/bundle-integrity.md)
};

struct IngestRequest {
  std::string bundle_path;
  std::string counts_path;
  std::string out_dir;
  bool force = false;
  std::optional<std::string> lab_key_path;  ///< refuse the bundle unless signed with this key
};

struct ResumeRequest {
  std::string bundle_path;
  std::string counts_path;
  std::string out_path;
  bool force = false;
  std::optional<std::string> first_night;  ///< YYYY-MM-DD; absent: the day after the last night
  /// Refuse the bundle unless signed with this key, and sign the new one with it.
  std::optional<std::string> lab_key_path;
};

struct SimulateRequest {
  std::string bundle_path;
  std::string out_path;
  std::optional<std::uint64_t> seed;  ///< default: the bundle's seed
  double fade_per_hour = 0.0;
  std::optional<double> stop_after_hours;
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
/// A campaign for a data CSV (cmd_new.cpp).
int run_new(const NewRequest& request);
/// The preset an --encoding word names; throws formats::InputError for an unknown word.
EncodingPreset preset_from_word(const std::string& word);
/// The margin check (cmd_check.cpp).
int run_check(const CheckRequest& request);
/// Hand-off to the rig and back (cmd_export.cpp, cmd_ingest.cpp, cmd_resume.cpp).
int run_export(const ExportRequest& request);
int run_ingest(const IngestRequest& request);
int run_resume(const ResumeRequest& request);
/// A rehearsal: counts drawn from the rig model for a bundle (cmd_simulate.cpp).
int run_simulate(const SimulateRequest& request);
/// Two campaigns planned side by side (cmd_compare.cpp).
int run_compare(const CompareRequest& request);

/// Loads the campaign file and, with `data_path`, replaces its points by the data CSV. Throws
/// formats::InputError naming the file, line or field; also when the campaign's encoding does
/// not accept the CSV's number of features, or the campaign is inconsistent
/// (Campaign::check_consistency).
Campaign load_campaign_for_command(const std::string& campaign_path,
                                   const std::optional<std::string>& data_path);

}  // namespace gramline::cli
