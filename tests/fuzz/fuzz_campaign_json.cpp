// libFuzzer target: gramline_fuzz::campaign_json (fuzz_bodies.h).
#include "fuzz_bodies.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  gramline_fuzz::campaign_json(data, size);
  return 0;
}
