#pragma once
// The counts file a rig controller writes back after a night (docs/counts-format.md): a CSV with
// a header, one row per counted step: the step index and kind of the plan's steps.json, the
// counting interval in seconds from the first night's start, the coincidence counts of every
// channel and, optionally, the singles rate of every photon's pass-port detector.
#include <QString>
#include <string>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/ingest.h"
#include "gramline/plan.h"

namespace gramline::formats {

/// What a counts file must hold for a rig: channel columns ch0..ch{channels-1} and, when
/// singles are given, singles0_per_s..singles{photons-1}_per_s.
struct CountsLayout {
  int channels = 4;  ///< gramline::channel_count(scheme, photons)
  int photons = 2;
  std::string scheme_text;  ///< for messages, e.g. "both-ports"
};
CountsLayout counts_layout(const Campaign& campaign);

/// One data row of a counts file.
struct CountsRow {
  StepRecord record;
  StepKind kind = StepKind::measure;
  int line = 0;  ///< 1-based line in the file
};

/// The comment that marks a counts file as drawn from the rig model rather than measured
/// (docs/counts-format.md, "Simulated counts"); it comes before the header.
inline constexpr const char* kSimulatedMark = "# simulated:";

struct CountsFile {
  std::string source;  ///< file name used in messages
  std::vector<CountsRow> rows;
  bool has_singles_columns = false;
  /// Simulated counts: what follows kSimulatedMark, trimmed (never empty for a marked file).
  std::string simulated_note;
  bool simulated() const { return !simulated_note.empty(); }
};

/// "simulated counts (NOTE)" for a marked file, else empty: the words every report uses.
std::string simulated_counts_text(const std::string& simulated_note);

/// Parses counts CSV text. Throws InputError "SOURCE: line L, column C (NAME): ..." for: no
/// header, an unknown, repeated or missing column, channel columns that do not match the
/// layout, a ragged row, a step index that is not a whole number >= 0, an unknown kind, a time
/// that is not a finite number, an end not after the start, a count that is not a whole number
/// >= 0, a singles rate that is not a finite number >= 0, singles given for some photons only.
CountsFile parse_counts_csv(const std::string& text, const std::string& source,
                            const CountsLayout& layout);
CountsFile read_counts_csv(const QString& path, const CountsLayout& layout);

/// How the rows of a counts file fit the plan's steps.
struct CountsCheck {
  struct Problem {
    int line = 0;
    int step = 0;
    std::string message;  ///< "SOURCE: line L, column C (step): ..."
  };
  std::vector<Problem> extra;          ///< a step the plan does not have, or a park step
  std::vector<Problem> duplicated;     ///< a step counted on an earlier line too
  std::vector<Problem> kind_mismatch;  ///< kind differs from the plan's
  std::vector<int> missing;            ///< measure and reference steps without a row
  std::vector<StepRecord> records;     ///< the rows that fit, first row of each step
  bool consistent() const { return extra.empty() && duplicated.empty() && kind_mismatch.empty(); }
  /// Human-readable: every problem on its own line, then the missing steps (shortened).
  std::string report() const;
};

/// Matches the rows with the plan's steps. Measure and reference steps are expected; rows for
/// dark steps are accepted (and unused by the kernel); park steps count nothing.
CountsCheck check_counts(const CountsFile& counts, const std::vector<Step>& steps);

/// Counts CSV text for `records` (writer of the format; used by tests and simulations). With a
/// `simulated_note`, the kSimulatedMark line comes first, before the header.
std::string format_counts_csv(const std::vector<StepRecord>& records,
                              const std::vector<Step>& steps, const CountsLayout& layout,
                              const std::string& simulated_note = {});

}  // namespace gramline::formats
