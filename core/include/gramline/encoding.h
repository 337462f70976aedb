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
  two_features_polar_azimuth,     ///< photon p: theta from x_2p, phi from x_2p+1
  spread,  ///< D features over P photons: feature f on photon f mod P, theta and phi in turn
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
/// (D must be 1..4); for two_features_polar_azimuth, P = ceil(D / 2) (D 1..8; an odd last
/// feature sets theta only); spread needs make_encoding (P is free). Weights are set so that
/// each feature's range [lo_f, hi_f] maps onto `theta_span` (polar) or `phi_span` (azimuth).
EncodingMap make_preset(EncodingPreset preset, const Eigen::VectorXd& feature_low,
                        const Eigen::VectorXd& feature_high, AngleSpan theta_span = {0.0, 180.0},
                        AngleSpan phi_span = {0.0, 360.0});

/// Photons a preset uses for D features: D (linear), ceil(D / 2) (polar-azimuth); 0 for spread
/// and custom, whose photon count is free.
int preset_photons(EncodingPreset preset, int features);

/// The preset a new campaign gets for D features on P photons (docs/conventions.md, "Encoding
/// presets"): linear when D = P, polar-azimuth when D = 2P, otherwise spread.
EncodingPreset default_preset(int features, int photons);

/// Any preset on P photons (1 to 4). Throws std::invalid_argument naming the field when the
/// preset cannot give D features P photons (linear needs P = D, polar-azimuth P = ceil(D/2)).
/// spread: feature f goes to photon f mod P; the features a photon receives feed theta, phi,
/// theta, ... in turn, and k features on one angle each get 1/k of its span, so the angle stays
/// inside the span. With fewer features than photons, photon p reads feature p mod D on theta.
EncodingMap make_encoding(EncodingPreset preset, int photons, const Eigen::VectorXd& feature_low,
                          const Eigen::VectorXd& feature_high, AngleSpan theta_span = {0.0, 180.0},
                          AngleSpan phi_span = {0.0, 360.0});

/// Scaling helper: feature ranges of the training points (column min and max).
void feature_ranges(const Eigen::MatrixXd& train, Eigen::VectorXd& low, Eigen::VectorXd& high);

std::string to_string(EncodingPreset preset);
bool encoding_preset_from_string(const std::string& text, EncodingPreset& out);

}  // namespace gramline
