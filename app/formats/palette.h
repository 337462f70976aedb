#pragma once
// Gramline's colours (docs/palette.md): one set for the app and for summary.html. Plain RGB so
// the file layer can write it into HTML and the app can turn it into QColor.
#include <string>

namespace gramline::palette {

struct Rgb {
  int r = 0, g = 0, b = 0;
  /// "#rrggbb".
  std::string hex() const;
};

// Where time goes. Told apart by lightness as well as by hue, so they read in grey and for
// readers with red-green colour blindness.
inline constexpr Rgb counting{0x1c, 0x5d, 0x99};   ///< deep blue: measure steps' dwell
inline constexpr Rgb moving{0xe6, 0x95, 0x31};     ///< amber: plates moving
inline constexpr Rgb reference{0x7d, 0xb9, 0xde};  ///< sky: reference steps
inline constexpr Rgb dark{0x3d, 0x33, 0x46};       ///< plum black: dark counts
inline constexpr Rgb park{0xbf, 0xae, 0x7c};       ///< sand: parking the plates

// The two classes of the data: the blue-orange pair that every common colour vision keeps
// apart; markers differ in shape as well.
inline constexpr Rgb class_positive{0xc2, 0x5a, 0x1c};  ///< rust
inline constexpr Rgb class_negative{0x1c, 0x5d, 0x99};  ///< deep blue

// Verdicts: never red against green. A pass is blue, a warning rust, and both say it in words.
inline constexpr Rgb pass{0x1c, 0x5d, 0x99};
inline constexpr Rgb alert{0xc2, 0x5a, 0x1c};

/// The matrix ramp for t in [0, 1]: paper white through mist and blue to night, lightness
/// falling steadily so larger values are always darker (also in grey print).
Rgb ramp(double t);

}  // namespace gramline::palette
