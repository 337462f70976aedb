#include "gramline/encoding.h"

#include <cmath>
#include <sstream>
#include <stdexcept>

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

EncodingMap make_preset(EncodingPreset preset, const Eigen::VectorXd& feature_low,
                        const Eigen::VectorXd& feature_high, AngleSpan theta_span,
                        AngleSpan phi_span) {
  const int d = static_cast<int>(feature_low.size());
  EncodingMap map;
  map.preset = preset;
  switch (preset) {
    case EncodingPreset::one_feature_per_photon_linear: {
      if (d < 1 || d > 4)
        throw std::invalid_argument("encoding: one feature per photon needs 1 to 4 features");
      for (int p = 0; p < d; ++p) {
        PhotonEncoding e;
        e.theta_weights_deg = Eigen::VectorXd::Zero(d);
        e.phi_weights_deg = Eigen::VectorXd::Zero(d);
        span_map(feature_low(p), feature_high(p), theta_span, e.theta_weights_deg(p),
                 e.theta_offset_deg);
        map.photons.push_back(e);
      }
      break;
    }
    case EncodingPreset::two_features_polar_azimuth: {
      if (d != 2)
        throw std::invalid_argument("encoding: polar and azimuth on one photon needs 2 features");
      PhotonEncoding e;
      e.theta_weights_deg = Eigen::VectorXd::Zero(d);
      e.phi_weights_deg = Eigen::VectorXd::Zero(d);
      span_map(feature_low(0), feature_high(0), theta_span, e.theta_weights_deg(0),
               e.theta_offset_deg);
      span_map(feature_low(1), feature_high(1), phi_span, e.phi_weights_deg(1), e.phi_offset_deg);
      map.photons.push_back(e);
      break;
    }
    case EncodingPreset::custom:
      throw std::invalid_argument("encoding: a custom map has no preset weights");
  }
  return map;
}

namespace {
constexpr EnumNames<EncodingPreset, 3> kPresetNames{
    {{EncodingPreset::one_feature_per_photon_linear, "one-feature-per-photon-linear"},
     {EncodingPreset::two_features_polar_azimuth, "two-features-polar-azimuth"},
     {EncodingPreset::custom, "custom"}}};
}  // namespace

std::string to_string(EncodingPreset preset) { return enum_text(kPresetNames, preset); }
bool encoding_preset_from_string(const std::string& text, EncodingPreset& out) {
  return enum_from_text(kPresetNames, text, out);
}

}  // namespace gramline
