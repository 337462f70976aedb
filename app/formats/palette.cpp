#include "formats/palette.h"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>

namespace gramline::palette {

std::string Rgb::hex() const {
  char text[8];
  std::snprintf(text, sizeof text, "#%02x%02x%02x", r & 0xff, g & 0xff, b & 0xff);
  return text;
}

Rgb ramp(double t) {
  if (!std::isfinite(t)) return {0x99, 0x99, 0x99};
  t = std::clamp(t, 0.0, 1.0);
  static constexpr std::array<Rgb, 4> stops = {{
      {0xf7, 0xf1, 0xe3},  // paper
      {0x9f, 0xc6, 0xd9},  // mist
      {0x2f, 0x6f, 0x9f},  // blue
      {0x0b, 0x27, 0x40},  // night
  }};
  const double x = t * 3.0;
  const int i = std::min(2, static_cast<int>(x));
  const double f = x - i;
  const auto mix = [f](int a, int b) { return static_cast<int>(std::lround(a * (1 - f) + b * f)); };
  const Rgb& a = stops[static_cast<std::size_t>(i)];
  const Rgb& b = stops[static_cast<std::size_t>(i + 1)];
  return {mix(a.r, b.r), mix(a.g, b.g), mix(a.b, b.b)};
}

}  // namespace gramline::palette
