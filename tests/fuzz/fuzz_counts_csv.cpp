// libFuzzer target: the counts CSV reader and the check of its rows against a plan's steps.
// The first byte picks the layout (photons 1..4, both ports or pass only).
#include <vector>

#include "formats/counts_csv.h"
#include "fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  if (size == 0) return 0;
  gramline::formats::CountsLayout layout;
  layout.photons = 1 + (data[0] & 3);
  layout.channels = (data[0] & 4) ? 1 : (1 << layout.photons);
  layout.scheme_text = (data[0] & 4) ? "pass-only" : "both-ports";
  std::vector<gramline::Step> steps(12);
  for (size_t k = 0; k < steps.size(); ++k)
    steps[k].kind = k % 4 == 0    ? gramline::StepKind::reference
                    : k % 11 == 0 ? gramline::StepKind::park
                                  : gramline::StepKind::measure;
  gramline_fuzz::expect_clean([&] {
    const gramline::formats::CountsFile f = gramline::formats::parse_counts_csv(
        gramline_fuzz::text_of(data + 1, size - 1), "fuzz.csv", layout);
    const gramline::formats::CountsCheck c = gramline::formats::check_counts(f, steps);
    (void)c.report();
    std::vector<gramline::StepRecord> records;
    for (const auto& row : f.rows) records.push_back(row.record);
    gramline::formats::parse_counts_csv(
        gramline::formats::format_counts_csv(records, steps, layout), "again.csv", layout);
  });
  return 0;
}
