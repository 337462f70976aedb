// libFuzzer target: gramline_fuzz::bundle (fuzz_bodies.h).
#include "fuzz_bodies.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  gramline_fuzz::bundle(data, size);
  return 0;
}
