// libFuzzer target: the data CSV reader, and the writer on whatever it accepts.
#include "formats/data_csv.h"
#include "fuzz_common.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  gramline_fuzz::expect_clean([&] {
    const gramline::DataSet d =
        gramline::formats::parse_data_csv(gramline_fuzz::text_of(data, size), "fuzz.csv");
    gramline::formats::parse_data_csv(gramline::formats::format_data_csv(d), "again.csv");
  });
  return 0;
}
