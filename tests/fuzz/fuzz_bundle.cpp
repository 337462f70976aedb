// libFuzzer target: the bundle reader (zip, entry names and sizes, manifest, checksums, campaign
// and steps) and the plan rebuilt from an accepted bundle.
#include "formats/bundle.h"
#include "fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  gramline::formats::BundleReadLimits limits;
  limits.entry_bytes = 8 << 20;  // keep each run small; the logic is the same at 512 MiB
  limits.total_bytes = 16 << 20;
  gramline_fuzz::expect_clean([&] {
    const gramline::formats::Bundle b =
        gramline::formats::parse_bundle(gramline_fuzz::text_of(data, size), "fuzz.zip", limits);
    (void)gramline::formats::plan_from_bundle(b);
  });
  return 0;
}
