#pragma once
// The body of every fuzz target, shared by the libFuzzer programs (fuzz_*.cpp, clang) and by the
// corpus replay that the normal test run performs (replay_corpus.cpp). Bad input must end in
// formats::InputError; anything else aborts (a finding).
#include <QDateTime>
#include <cstddef>
#include <cstdint>
#include <map>
#include <string>
#include <string_view>
#include <vector>

#include "formats/bundle.h"
#include "formats/campaign_json.h"
#include "formats/counts_csv.h"
#include "formats/data_csv.h"
#include "formats/signature.h"
#include "fuzz_common.h"

namespace gramline_fuzz {

namespace fmt = gramline::formats;

/// The campaign JSON reader, and the writer on whatever it accepts.
inline void campaign_json(const std::uint8_t* data, std::size_t size) {
  expect_clean([&] {
    const gramline::Campaign c = fmt::parse_campaign(text_of(data, size), "fuzz.json");
    // What was accepted must write and read back.
    fmt::parse_campaign(fmt::format_campaign(c), "again.json");
  });
}

/// The data CSV reader, and the writer on whatever it accepts.
inline void data_csv(const std::uint8_t* data, std::size_t size) {
  expect_clean([&] {
    const gramline::DataSet d = fmt::parse_data_csv(text_of(data, size), "fuzz.csv");
    fmt::parse_data_csv(fmt::format_data_csv(d), "again.csv");
  });
}

/// The counts CSV reader and the check of its rows against a plan's steps. The first byte picks
/// the layout (photons 1..4, both ports or pass only).
inline void counts_csv(const std::uint8_t* data, std::size_t size) {
  if (size == 0) return;
  fmt::CountsLayout layout;
  layout.photons = 1 + (data[0] & 3);
  layout.channels = (data[0] & 4) ? 1 : (1 << layout.photons);
  layout.scheme_text = (data[0] & 4) ? "pass-only" : "both-ports";
  std::vector<gramline::Step> steps(12);
  for (size_t k = 0; k < steps.size(); ++k)
    steps[k].kind = k % 4 == 0    ? gramline::StepKind::reference
                    : k % 11 == 0 ? gramline::StepKind::park
                                  : gramline::StepKind::measure;
  expect_clean([&] {
    const fmt::CountsFile f =
        fmt::parse_counts_csv(text_of(data + 1, size - 1), "fuzz.csv", layout);
    const fmt::CountsCheck c = fmt::check_counts(f, steps);
    (void)c.report();
    std::vector<gramline::StepRecord> records;
    for (const auto& row : f.rows) records.push_back(row.record);
    fmt::parse_counts_csv(fmt::format_counts_csv(records, steps, layout), "again.csv", layout);
  });
}

/// Smaller limits than the real reader's keep each run fast; the logic is the same.
inline fmt::BundleReadLimits fuzz_limits() {
  fmt::BundleReadLimits limits;
  limits.entry_bytes = 8 << 20;
  limits.total_bytes = 16 << 20;
  return limits;
}

/// The bundle reader at the archive level (zip, entry names and sizes, manifest, checksums,
/// campaign and steps) and the plan rebuilt from an accepted bundle.
inline void bundle(const std::uint8_t* data, std::size_t size) {
  expect_clean([&] {
    const fmt::Bundle b = fmt::parse_bundle(text_of(data, size), "fuzz.zip", fuzz_limits());
    (void)fmt::plan_from_bundle(b);
  });
}

/// Splits the input into bundle entries: each entry starts with a line "@@ NAME" and runs to
/// the next such line. Text before the first marker is ignored; a later entry of the same name
/// replaces an earlier one; names the bundle could not hold are dropped.
inline std::map<std::string, std::string> split_entries(std::string_view text) {
  constexpr std::string_view marker = "@@ ";
  std::vector<size_t> starts;
  if (text.substr(0, marker.size()) == marker) starts.push_back(0);
  for (size_t p = text.find("\n@@ "); p != std::string_view::npos; p = text.find("\n@@ ", p + 1))
    starts.push_back(p + 1);
  std::map<std::string, std::string> entries;
  for (size_t k = 0; k < starts.size(); ++k) {
    const size_t end = k + 1 < starts.size() ? starts[k + 1] : text.size();
    const std::string_view part =
        text.substr(starts[k] + marker.size(), end - starts[k] - marker.size());
    const size_t newline = part.find('\n');
    const std::string name(part.substr(0, newline));
    const std::string_view body =
        newline == std::string_view::npos ? std::string_view() : part.substr(newline + 1);
    if (fmt::is_safe_entry_name(name) && name != fmt::kManifestEntry)
      entries[name] = std::string(body);
  }
  return entries;
}

/// Bundle entries fuzzed one level up: the input holds the entries themselves (campaign.json,
/// steps.json, measured_*...), and the harness zips them with a correct manifest, so mutations
/// reach the campaign reader, the steps reader, the fit of steps to campaign, the plan rebuilt
/// from steps and the signature check, instead of stopping at the checksums.
inline void bundle_entries(const std::uint8_t* data, std::size_t size) {
  std::map<std::string, std::string> entries = split_entries(text_of(data, size));
  if (entries.empty()) return;
  expect_clean([&] {
    // A signature.json given by the input is kept unlisted, as export writes it.
    std::map<std::string, std::string> listed = entries;
    listed.erase(fmt::kSignatureEntry);
    fmt::BundleWriteOptions options;
    options.created_utc = QDateTime(QDate(2026, 12, 1), QTime(12, 0), Qt::UTC);
    entries[fmt::kManifestEntry] = fmt::format_manifest(listed, 1, options);
    const std::string zip = fmt::zip_entries(entries, options.created_utc);
    const fmt::Bundle b = fmt::parse_bundle(zip, "fuzz.zip", fuzz_limits());
    (void)fmt::plan_from_bundle(b);
    fmt::verify_signature(b.entries, "fuzz lab key of 32 bytes........", b.source);
  });
}

}  // namespace gramline_fuzz
