#pragma once
// Encoding map: features -> Bloch angles of each photon (docs/conventions.md).
#include <Eigen/Core>
#include <string>
#include <vector>

#include "gramline/jones.h"

namespace gramline {

/// One photon's encoding: theta_deg = theta_offset_deg + theta_weights_deg . x and
/// phi_deg = phi_offset_deg + phi_weights_deg . x (weights in degrees per feature unit).
struct PhotonEncoding {
  Eigen::VectorXd theta_weights_deg;
  double theta_offset_deg = 0.0;
  Eigen::VectorXd phi_weights_deg;
  double phi_offset_deg = 0.0;
};

enum class EncodingPreset {
  one_feature_per_photon_linear,  ///< photon p: theta = w x_p + b, phi = 0 (linear states)
  two_features_polar_azimuth,     ///< one photon: theta from x_0, phi from x_1
  custom,
};

/// Affine encoding of D features on P photons (1 to 4).
struct EncodingMap {
  EncodingPreset preset = EncodingPreset::custom;
  std::vector<PhotonEncoding> photons;

  int photon_count() const { return static_cast<int>(photons.size()); }
  /// Number of features the map reads (length of every weight vector).
  int feature_count() const;
  /// Bloch angles of photon p for feature vector x, degrees.
  BlochAngles angles(int photon, const Eigen::VectorXd& x) const;
  /// Returns an empty string when usable with `features` features, else the reason.
  std::string check(int features) const;
  /// Multiplies every weight by `factor` (the encoding scale scanned by the scale advice).
  EncodingMap scaled(double factor) const;
};

/// Angle span each feature's training range is mapped onto, degrees.
struct AngleSpan {
  double low_deg = 0.0;
  double high_deg = 180.0;
};

/// Preset builder. `features` is D. For one_feature_per_photon_linear, P = D photons
/// (D must be 1..4); for two_features_polar_azimuth, D must be 2. Weights are set so that each
/// feature's range [lo_f, hi_f] maps onto `theta_span` (polar) or `phi_span` (azimuth).
EncodingMap make_preset(EncodingPreset preset, const Eigen::VectorXd& feature_low,
                        const Eigen::VectorXd& feature_high, AngleSpan theta_span = {0.0, 180.0},
                        AngleSpan phi_span = {0.0, 360.0});

/// Scaling helper: feature ranges of the training points (column min and max).
void feature_ranges(const Eigen::MatrixXd& train, Eigen::VectorXd& low, Eigen::VectorXd& high);

std::string to_string(EncodingPreset preset);
bool encoding_preset_from_string(const std::string& text, EncodingPreset& out);

}  // namespace gramline
