#pragma once
// Counter-based seeding for reproducible parallel Monte Carlo: every trial (and every entry of a
// trial) gets its own stream derived from (seed, index), so results do not depend on which
// thread ran which trial.
#include <cstdint>
#include <limits>

namespace gramline {

/// SplitMix64 finaliser (Steele, Lea & Flood, "Fast splittable pseudorandom number
/// generators", OOPSLA 2014; constants as in Vigna's public-domain splitmix64.c).
constexpr std::uint64_t mix64(std::uint64_t z) {
  z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
  z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
  return z ^ (z >> 31);
}

/// Seed of stream `index` under `seed`: two rounds of mixing so neighbouring indices and
/// neighbouring seeds give unrelated streams.
constexpr std::uint64_t stream_seed(std::uint64_t seed, std::uint64_t index) {
  return mix64(mix64(seed + 0x9e3779b97f4a7c15ULL) ^ (index * 0xd1b54a32d192ed03ULL + 1));
}

/// SplitMix64 generator; satisfies UniformRandomBitGenerator, cheap to seed (one word of state).
class SplitMix64 {
 public:
  using result_type = std::uint64_t;
  explicit SplitMix64(std::uint64_t seed = 0) : state_(seed) {}
  static constexpr result_type min() { return 0; }
  static constexpr result_type max() { return std::numeric_limits<result_type>::max(); }
  result_type operator()() {
    state_ += 0x9e3779b97f4a7c15ULL;
    return mix64(state_);
  }

 private:
  std::uint64_t state_;
};

}  // namespace gramline
