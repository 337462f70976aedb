#include "gramline/units.h"

#include <cmath>

namespace gramline {

double wrap_deg(double angle_deg, double period_deg) {
  double r = std::fmod(angle_deg, period_deg);
  if (r < 0) r += period_deg;
  // fmod of a value just below a multiple can round up to the period itself.
  if (r >= period_deg) r -= period_deg;
  return r;
}

}  // namespace gramline
