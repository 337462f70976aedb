// libFuzzer target: the campaign JSON reader, and the writer on whatever it accepts.
#include "formats/campaign_json.h"
#include "fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  gramline_fuzz::expect_clean([&] {
    const gramline::Campaign c =
        gramline::formats::parse_campaign(gramline_fuzz::text_of(data, size), "fuzz.json");
    // What was accepted must write and read back.
    gramline::formats::parse_campaign(gramline::formats::format_campaign(c), "again.json");
  });
  return 0;
}
