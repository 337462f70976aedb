#pragma once
// Shared by the libFuzzer targets: bad input must end in formats::InputError, nothing else.
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <exception>
#include <string>

#include "formats/input_error.h"

namespace gramline_fuzz {

template <class F>
void expect_clean(F&& body) {
  try {
    body();
  } catch (const gramline::formats::InputError&) {
    // The documented refusal of bad input.
  } catch (const std::exception& e) {
    // Anything else would reach the user as an internal failure: a finding.
    std::fprintf(stderr, "unexpected exception: %s\n", e.what());
    std::abort();
  }
}

inline std::string text_of(const std::uint8_t* data, std::size_t size) {
  return std::string(reinterpret_cast<const char*>(data), size);
}

}  // namespace gramline_fuzz
