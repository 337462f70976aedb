#pragma once
// The hand-off bundle: one zip file carrying everything a rig controller and a later ingest
// need, with a manifest that fixes the SHA-256 of every other file so tampering is noticed.
//
// Entries (flat, no folders):
//   manifest.json   {"format": "gramline-bundle", "version": 1, "bundle_id", "tool_version",
//                    "created_utc", "conventions", "seed",
//                    "parent": null | {"file", "manifest_sha256"},
//                    "files": [{"name", "bytes", "sha256"}, ...]}
//   campaign.json   the campaign as planned (points inline, seed applied)
//   data.csv        its points in the data CSV format
//   steps.json, steps.csv, summary.json, kernel.csv   as `plan --out` (docs/plan-files.md)
//   summary.html    printable summary with the timeline, Gram error maps and cautions
//   CAUTIONS.txt    the cautions in plain text, for whoever runs the rig
//   signature.json  only when exported with a lab key: HMAC-SHA-256 of manifest.json
//                   (docs/bundle-integrity.md); the one entry the manifest does not list
//   resumed bundles also: measured_steps.json and measured_counts.csv (what earlier bundles
//   measured, counts renumbered onto those steps) and resume.json (where the motors stopped)
#include <QDateTime>
#include <QString>
#include <cstdint>
#include <map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "formats/atomic_file.h"
#include "formats/counts_csv.h"
#include "formats/limits.h"
#include "formats/plan_files.h"
#include "formats/report_html.h"
#include "gramline/campaign.h"
#include "gramline/plan.h"

namespace gramline::formats {

inline constexpr const char* kBundleFormat = "gramline-bundle";
inline constexpr int kBundleVersion = 1;
inline constexpr const char* kManifestEntry = "manifest.json";
inline constexpr const char* kCampaignEntry = "campaign.json";
inline constexpr const char* kDataEntry = "data.csv";
inline constexpr const char* kStepsJsonEntry = "steps.json";
inline constexpr const char* kStepsCsvEntry = "steps.csv";
inline constexpr const char* kSummaryJsonEntry = "summary.json";
inline constexpr const char* kKernelEntry = "kernel.csv";
inline constexpr const char* kSummaryHtmlEntry = "summary.html";
inline constexpr const char* kMeasuredStepsEntry = "measured_steps.json";
inline constexpr const char* kMeasuredCountsEntry = "measured_counts.csv";
inline constexpr const char* kResumeEntry = "resume.json";
inline constexpr const char* kCautionsEntry = "CAUTIONS.txt";

/// Largest uncompressed size of the entry `name` (formats/limits.h, docs/limits.md), or -1 when
/// the bundle format does not define an entry of that name.
std::int64_t bundle_entry_limit(std::string_view name);

/// Lowercase hexadecimal SHA-256 (QCryptographicHash).
std::string sha256_hex(std::string_view bytes);

/// The bundle a resumed bundle continues from.
struct BundleParent {
  std::string file_name;        ///< file name only, no folder
  std::string manifest_sha256;  ///< SHA-256 of the parent's manifest.json
};

struct BundleWriteOptions {
  Overwrite overwrite = Overwrite::refuse;
  std::optional<BundleParent> parent;
  /// Further entries (name -> bytes), listed in the manifest like the others.
  std::map<std::string, std::string> extra_entries;
  /// Creation time written in the manifest; invalid: now.
  QDateTime created_utc;
  /// The bundle's identity (32 lowercase hex digits); empty: new_bundle_id().
  std::string bundle_id;
  /// A resumed bundle: what was measured before, for summary.html (docs/plan-files.md).
  std::optional<ResumeSummary> resume;
  /// With a lab key, signature.json (HMAC-SHA-256 of the manifest, formats/signature.h) is
  /// added; it is the one entry the manifest does not list.
  std::optional<std::string> lab_key;
};

/// 32 random lowercase hexadecimal digits (128 bits from the system's random source).
std::string new_bundle_id();

struct BundleWritten {
  std::string bundle_id;
  std::string manifest_sha256;
  std::vector<std::string> entries;  ///< every entry, manifest included
  std::int64_t zip_bytes = 0;
};

/// The entries of a bundle for a planned campaign (manifest excluded). `resume` describes a
/// resumed bundle's history for summary.html.
std::map<std::string, std::string> bundle_entries(const Campaign& campaign, const Plan& plan,
                                                  const ResumeSummary* resume = nullptr);

/// manifest.json text for `entries` (which must not include the manifest).
std::string format_manifest(const std::map<std::string, std::string>& entries, std::uint64_t seed,
                            const BundleWriteOptions& options);

/// A zip archive (deflate) of `entries`, in memory. Throws std::runtime_error if QuaZip fails.
std::string zip_entries(const std::map<std::string, std::string>& entries, const QDateTime& stamp);

/// Plans nothing: writes the bundle of an already planned campaign to `path`, atomically
/// (temporary file in the same folder, then rename). Throws InputError when `path` exists and
/// overwriting is refused, or when it cannot be written. The function the app calls.
BundleWritten write_bundle(const Campaign& campaign, const Plan& plan, const QString& path,
                           const BundleWriteOptions& options = {});

/// Limits of the bundle reader; the defaults derive from the largest supported campaign.
struct BundleReadLimits {
  /// Per entry, uncompressed, on top of each entry's own limit (bundle_entry_limit); 0: none.
  std::int64_t entry_bytes = 0;
  std::int64_t total_bytes = limits::kBundleTotalBytes;  ///< all entries, uncompressed
  std::int64_t file_bytes = limits::kBundleFileBytes;    ///< the zip file itself
  int entries = limits::kBundleEntries;
};

/// True for a relative entry name that stays inside the folder it would be unpacked into: not
/// empty, no leading '/', no backslash, no drive letter, no '.' or '..' component, no empty
/// component, no control character.
bool is_safe_entry_name(std::string_view name);

/// Every entry of a zip archive held in memory. Throws InputError naming `source` (and the
/// entry) for: a file that is not a zip archive, an unsafe entry name, a name the bundle format
/// does not define, a repeated name, an entry larger than its limit or entries together larger
/// than the total (the declared sizes are checked before anything is inflated, the inflated
/// bytes as they come), a damaged entry (CRC), too many entries.
std::map<std::string, std::string> unzip_entries(const std::string& zip_bytes,
                                                 const std::string& source,
                                                 const BundleReadLimits& limits = {});

struct ManifestFile {
  std::string name;
  std::int64_t bytes = 0;
  std::string sha256;
};

struct BundleManifest {
  std::string bundle_id;  ///< empty for bundles written before bundles carried one
  std::string tool_version;
  std::string created_utc;
  std::string conventions;
  std::uint64_t seed = 1;
  std::optional<BundleParent> parent;
  std::vector<ManifestFile> files;
};

/// A bundle read back and verified.
struct Bundle {
  std::string source;
  BundleManifest manifest;
  std::string manifest_sha256;
  std::map<std::string, std::string> entries;
  Campaign campaign;
  StepsFile steps;  ///< rig motors and controller as in steps.json; source/detectors: campaign's
  /// Resumed bundles: the steps measured by earlier bundles and their counts (renumbered onto
  /// measured_steps, times on one clock). Empty otherwise.
  std::vector<Step> measured_steps;
  std::vector<StepRecord> measured_records;
  /// Resumed bundles whose earlier counts were simulated: the note of measured_counts.csv's
  /// simulated mark (docs/counts-format.md); empty for counts from a rig.
  std::string measured_simulated_note;
};

/// Reads a bundle from memory: unzips it safely, checks that the manifest lists exactly the
/// other entries with the right size and SHA-256, parses campaign.json and steps.json, and
/// checks that the steps fit the campaign (motors, point indices, blocks). Throws InputError
/// naming the bundle and the entry.
Bundle parse_bundle(const std::string& zip_bytes, const std::string& source,
                    const BundleReadLimits& limits = {});
Bundle read_bundle(const QString& path, const BundleReadLimits& limits = {});
/// read_bundle, then with a lab key: refuses the bundle (InputError) unless its signature.json
/// was made with that key over its manifest (docs/bundle-integrity.md). The commands that
/// read bundles (ingest, resume) come through here.
Bundle read_bundle_checked(const QString& path, const std::optional<std::string>& lab_key);

/// Whether `counts` answer `bundle`: throws InputError naming both ids when the counts file
/// names another bundle. Returns a warning when the counts file names no bundle (a file written
/// before counts files named their bundle; it is read), else an empty string.
std::string check_counts_bundle(const Bundle& bundle, const CountsFile& counts);

/// gramline::plan_from_steps (plan.h) of the bundle's campaign and steps.json.
Plan plan_from_bundle(const Bundle& bundle);

}  // namespace gramline::formats
