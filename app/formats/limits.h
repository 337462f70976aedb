#pragma once
// Every size limit of the file layer, derived from one largest supported campaign
// (docs/limits.md): 1000 training and 250 test points on four photons. Readers refuse anything
// beyond these before they allocate for it, and name the limit in the message.
#include <cstdint>

namespace gramline::formats::limits {

// --- The largest supported campaign -------------------------------------------------------
inline constexpr std::int64_t kTrainPoints = 1000;
inline constexpr std::int64_t kTestPoints = 250;
inline constexpr std::int64_t kPoints = kTrainPoints + kTestPoints;
inline constexpr std::int64_t kPhotons = 4;
/// Four motors per photon (prep HWP and QWP, analysis QWP and HWP).
inline constexpr std::int64_t kMotors = 4 * kPhotons;
/// Features a data set may have (spread over the photons by the encoding).
inline constexpr std::int64_t kFeatures = 64;
/// Coincidence channels: both ports of every photon's beam splitter, 2^photons.
inline constexpr std::int64_t kChannels = std::int64_t{1} << kPhotons;
/// Nights a campaign may ask for: one year.
inline constexpr std::int64_t kNights = 366;

// --- Derived counts -----------------------------------------------------------------------
/// Kernel entries to measure: the training pairs above the diagonal and every (test, training)
/// pair.
inline constexpr std::int64_t kEntries =
    kTrainPoints * (kTrainPoints - 1) / 2 + kTestPoints * kTrainPoints;
/// Steps of a plan (measured and remaining together in a resumed bundle): every entry once,
/// half of them once more (top-ups of a resumed campaign), and the reference, dark and park
/// steps, which are far fewer than the entries.
inline constexpr std::int64_t kSteps = kEntries + kEntries / 2;
/// Rows of a counts file: at most one per step.
inline constexpr std::int64_t kCountsRows = kSteps;
/// Monte Carlo trials of the margin check. At 10^5 a pass probability is known to within a
/// standard error of 0.0016 (sqrt(0.25 / 10^5)); no verdict needs finer.
inline constexpr std::int64_t kTrials = 100000;
/// Error lines a message lists before it gives only the count of the rest.
inline constexpr int kListedErrors = 50;

// --- Physical bounds of a counts file -----------------------------------------------------
/// Seconds from the first night's start: every night of the largest campaign.
inline constexpr double kCampaignSeconds = static_cast<double>(kNights) * 86400.0;
/// Shortest counting interval: one microsecond.
inline constexpr double kShortestInterval_s = 1e-6;
/// Fastest singles or coincidence rate a detector can report: 10^9 per second (a detector's
/// dead time of tens of nanoseconds keeps real ones below 10^8; common practice).
inline constexpr double kFastestRate_per_s = 1e9;

// --- Bytes --------------------------------------------------------------------------------
/// One number as the writers print it (17 significant digits, sign, point, exponent) with its
/// separator.
inline constexpr std::int64_t kNumberBytes = 26;
/// The same in indented JSON, where every number of an array has a line of its own.
inline constexpr std::int64_t kIndentedNumberBytes = 48;
/// A name (motor, feature, detector) with its quotes and separator.
inline constexpr std::int64_t kNameBytes = 64;
/// Fixed parts of a file: headers, the conventions text, the rig, the options.
inline constexpr std::int64_t kHeaderBytes = std::int64_t{1} << 20;

/// A campaign file: every point with its features and label, plus the fixed parts.
inline constexpr std::int64_t kCampaignBytes =
    kHeaderBytes + kPoints * (kFeatures * kIndentedNumberBytes + 4 * kNameBytes);
/// A data CSV: one row per point.
inline constexpr std::int64_t kDataCsvBytes =
    kHeaderBytes + kPoints * (kFeatures * kNumberBytes + kNameBytes);
/// One step of steps.json: its fixed fields and one position per motor.
inline constexpr std::int64_t kStepJsonBytes = 256 + kMotors * (kNameBytes + kNumberBytes);
inline constexpr std::int64_t kStepsJsonBytes = kHeaderBytes + kSteps * kStepJsonBytes;
/// One row of steps.csv.
inline constexpr std::int64_t kStepCsvBytes = 2 * kNameBytes + (kMotors + 7) * kNumberBytes;
inline constexpr std::int64_t kStepsCsvBytes = kHeaderBytes + kSteps * kStepCsvBytes;
/// One row of a counts file: step, kind, two times, every channel and every singles rate.
inline constexpr std::int64_t kCountsRowBytes =
    2 * kNameBytes + (2 + kChannels + kPhotons) * kNumberBytes;
inline constexpr std::int64_t kCountsBytes = kHeaderBytes + kCountsRows * kCountsRowBytes;
/// kernel.csv: the training Gram matrix.
inline constexpr std::int64_t kKernelCsvBytes =
    kHeaderBytes + kTrainPoints * kTrainPoints * kNumberBytes;
/// summary.json, resume.json, manifest.json: a few figures per night and per file.
inline constexpr std::int64_t kSmallJsonBytes = kHeaderBytes + kNights * 8 * kIndentedNumberBytes;
/// summary.html: text, a timeline per night and the Gram error maps (one cell per entry).
inline constexpr std::int64_t kSummaryHtmlBytes = 4 * kHeaderBytes + kEntries * kNumberBytes;

/// A bundle's entries together, uncompressed: the steps (measured and remaining share kSteps)
/// in both forms with their counts, plus every fixed-size entry.
inline constexpr std::int64_t kBundleTotalBytes =
    kHeaderBytes * 8 + kSteps * (kStepJsonBytes + kStepCsvBytes + kCountsRowBytes) +
    kCampaignBytes + kDataCsvBytes + kKernelCsvBytes + kSummaryHtmlBytes + 3 * kSmallJsonBytes;
/// A bundle file on disk: compression never makes it larger than its entries plus their zip
/// headers.
inline constexpr std::int64_t kBundleFileBytes = kBundleTotalBytes + kHeaderBytes;
/// Entries in a bundle: manifest.json and the twelve others the format defines (a resumed,
/// signed bundle holds them all; bundle_entry_limit in bundle.cpp lists them).
inline constexpr int kBundleEntries = 13;

}  // namespace gramline::formats::limits
