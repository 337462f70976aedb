#include "gramline/encoding.h"

#include <cmath>
#include <sstream>
#include <stdexcept>
#include <string>
#include <vector>

#include "gramline/enum_names.h"

namespace gramline {

int EncodingMap::feature_count() const {
  if (photons.empty()) return 0;
  return static_cast<int>(photons.front().theta_weights_deg.size());
}

BlochAngles EncodingMap::angles(int photon, const Eigen::VectorXd& x) const {
  const PhotonEncoding& e = photons.at(photon);
  BlochAngles a;
  a.theta_deg = e.theta_offset_deg + e.theta_weights_deg.dot(x);
  a.phi_deg = e.phi_offset_deg + e.phi_weights_deg.dot(x);
  return a;
}

std::string EncodingMap::check(int features) const {
  std::ostringstream err;
  if (photons.empty() || photons.size() > 4) {
    err << "encoding.photons: " << photons.size() << " photons; 1 to 4 are supported";
    return err.str();
  }
  for (size_t p = 0; p < photons.size(); ++p) {
    const PhotonEncoding& e = photons[p];
    if (e.theta_weights_deg.size() != features || e.phi_weights_deg.size() != features) {
      err << "encoding.photons[" << p << "]: weights for " << e.theta_weights_deg.size()
          << " features, but the data set has " << features;
      return err.str();
    }
    if (!e.theta_weights_deg.allFinite() || !e.phi_weights_deg.allFinite() ||
        !std::isfinite(e.theta_offset_deg) || !std::isfinite(e.phi_offset_deg)) {
      err << "encoding.photons[" << p << "]: weights and offsets must be finite";
      return err.str();
    }
  }
  return {};
}

EncodingMap EncodingMap::scaled(double factor) const {
  EncodingMap out = *this;
  for (PhotonEncoding& e : out.photons) {
    e.theta_weights_deg *= factor;
    e.phi_weights_deg *= factor;
  }
  return out;
}

void feature_ranges(const Eigen::MatrixXd& train, Eigen::VectorXd& low, Eigen::VectorXd& high) {
  low = train.colwise().minCoeff().transpose();
  high = train.colwise().maxCoeff().transpose();
}

namespace {
// Weight and offset that map [lo, hi] onto [span.low_deg, span.high_deg].
void span_map(double lo, double hi, AngleSpan span, double& weight, double& offset) {
  const double width = hi - lo;
  weight = width > 0 ? (span.high_deg - span.low_deg) / width : 0.0;
  offset = width > 0 ? span.low_deg - weight * lo : (span.low_deg + span.high_deg) / 2.0;
}
}  // namespace

int preset_photons(EncodingPreset preset, int features) {
  switch (preset) {
    case EncodingPreset::one_feature_per_photon_linear:
      return features;
    case EncodingPreset::two_features_polar_azimuth:
      return (features + 1) / 2;
    case EncodingPreset::spread:
    case EncodingPreset::custom:
      break;
  }
  return 0;
}

EncodingPreset default_preset(int features, int photons) {
  if (features == photons) return EncodingPreset::one_feature_per_photon_linear;
  if (features == 2 * photons) return EncodingPreset::two_features_polar_azimuth;
  return EncodingPreset::spread;
}

EncodingMap make_preset(EncodingPreset preset, const Eigen::VectorXd& feature_low,
                        const Eigen::VectorXd& feature_high, AngleSpan theta_span,
                        AngleSpan phi_span) {
  const int d = static_cast<int>(feature_low.size());
  if (preset == EncodingPreset::spread)
    throw std::invalid_argument("encoding: the spread preset needs a photon count");
  return make_encoding(preset, preset_photons(preset, d), feature_low, feature_high, theta_span,
                       phi_span);
}

EncodingMap make_encoding(EncodingPreset preset, int photons, const Eigen::VectorXd& feature_low,
                          const Eigen::VectorXd& feature_high, AngleSpan theta_span,
                          AngleSpan phi_span) {
  const int d = static_cast<int>(feature_low.size());
  if (preset == EncodingPreset::custom)
    throw std::invalid_argument("encoding: a custom map has no preset weights");
  if (d < 1) throw std::invalid_argument("encoding: the data set has no feature");
  if (feature_high.size() != d)
    throw std::invalid_argument("encoding: feature_low and feature_high differ in length");
  if (photons < 1 || photons > 4) {
    throw std::invalid_argument("encoding.photons: " + std::to_string(photons) +
                                " photons; 1 to 4 are supported");
  }
  const int needed = preset_photons(preset, d);
  if (needed != 0 && needed != photons) {
    throw std::invalid_argument("encoding.preset: '" + to_string(preset) + "' puts " +
                                std::to_string(d) + " feature(s) on " + std::to_string(needed) +
                                " photon(s), not " + std::to_string(photons));
  }
  // (photon, angle) of every feature: angle 0 is theta, 1 is phi.
  std::vector<std::vector<int>> on_angle(static_cast<size_t>(2 * photons));
  auto feed = [&](int photon, int angle, int feature) {
    on_angle[static_cast<size_t>(2 * photon + angle)].push_back(feature);
  };
  switch (preset) {
    case EncodingPreset::one_feature_per_photon_linear:
      for (int p = 0; p < photons; ++p) feed(p, 0, p);
      break;
    case EncodingPreset::two_features_polar_azimuth:
      for (int f = 0; f < d; ++f) feed(f / 2, f % 2, f);
      break;
    case EncodingPreset::spread:
      if (d < photons) {
        for (int p = 0; p < photons; ++p) feed(p, 0, p % d);
      } else {
        for (int f = 0; f < d; ++f) feed(f % photons, (f / photons) % 2, f);
      }
      break;
    case EncodingPreset::custom:
      break;
  }
  EncodingMap map;
  map.preset = preset;
  for (int p = 0; p < photons; ++p) {
    PhotonEncoding e;
    e.theta_weights_deg = Eigen::VectorXd::Zero(d);
    e.phi_weights_deg = Eigen::VectorXd::Zero(d);
    for (int angle = 0; angle < 2; ++angle) {
      const std::vector<int>& features = on_angle[static_cast<size_t>(2 * p + angle)];
      if (features.empty()) continue;
      // k features share the span: each maps its range onto 1/k of the span's width.
      const AngleSpan span = angle == 0 ? theta_span : phi_span;
      const double share = 1.0 / static_cast<double>(features.size());
      const AngleSpan part{0.0, (span.high_deg - span.low_deg) * share};
      Eigen::VectorXd& weights = angle == 0 ? e.theta_weights_deg : e.phi_weights_deg;
      double& offset = angle == 0 ? e.theta_offset_deg : e.phi_offset_deg;
      offset = span.low_deg;
      for (int f : features) {
        double w = 0.0, b = 0.0;
        span_map(feature_low(f), feature_high(f), part, w, b);
        weights(f) += w;
        offset += b;
      }
    }
    map.photons.push_back(e);
  }
  return map;
}

namespace {
constexpr EnumNames<EncodingPreset, 4> kPresetNames{
    {{EncodingPreset::one_feature_per_photon_linear, "one-feature-per-photon-linear"},
     {EncodingPreset::two_features_polar_azimuth, "two-features-polar-azimuth"},
     {EncodingPreset::spread, "spread"},
     {EncodingPreset::custom, "custom"}}};
}  // namespace

std::string to_string(EncodingPreset preset) { return enum_text(kPresetNames, preset); }
bool encoding_preset_from_string(const std::string& text, EncodingPreset& out) {
  return enum_from_text(kPresetNames, text, out);
}

}  // namespace gramline
