// libFuzzer target: gramline_fuzz::bundle_entries (fuzz_bodies.h).
#include "fuzz_bodies.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  gramline_fuzz::bundle_entries(data, size);
  return 0;
}
