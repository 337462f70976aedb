#pragma once
// The rig: motorized waveplates, their controller, the photon-pair source and the detectors.
#include <optional>
#include <string>
#include <vector>

namespace gramline {

enum class Stage { prep, analysis };
enum class Plate { HWP, QWP };
enum class Backlash { shortest, from_below };
enum class MoveMode { simultaneous, sequential };

/// Closed travel range of a motor, degrees.
struct TravelRange {
  double low_deg = 0.0;
  double high_deg = 360.0;
};

/// One motorized rotation mount (docs/motion-model.md).
struct Motor {
  std::string name;
  int photon = 0;  ///< photon index, 0-based
  Stage stage = Stage::prep;
  Plate plate = Plate::HWP;
  double speed_deg_per_s = 15.0;     ///< max speed v
  double accel_deg_per_s2 = 30.0;    ///< acceleration a
  std::optional<TravelRange> range;  ///< absent: continuous rotation
  Backlash backlash = Backlash::shortest;
  double overshoot_deg = 0.0;  ///< used by from_below
  double initial_deg = 0.0;    ///< physical position at the start of the campaign
  /// Plate imperfections (docs/conventions.md, "Real plates"). Actual minus nominal retardance
  /// (nominal 180 for an HWP, 90 for a QWP), degrees.
  double retardance_error_deg = 0.0;
  double axis_offset_sd_deg = 0.0;    ///< uncertainty of the calibrated fast-axis zero
  double repeatability_sd_deg = 0.0;  ///< scatter of the reached position from move to move
  /// Actual retardance of the plate, degrees.
  double retardance_deg() const;
  /// Motor units (docs/plan-files.md, "Motor units"): motor steps per degree; absent: the
  /// controller takes degrees and no step column is written.
  std::optional<double> steps_per_deg;
  /// Motor position, in degrees, at which the plate's fast axis is horizontal (default 0).
  double zero_offset_deg = 0.0;
};

/// The period of the motor's plate, degrees: positions x and x + k period act alike. 180 for a
/// QWP and for an HWP whose retardance is not exactly 180 degrees; 90 for an exact HWP (its fast
/// and slow axes swap at x + 90, which only a half-wave retardance leaves unchanged). Every
/// period in Gramline (rig checks, equivalent positions, the scheduler) comes from here.
double motor_period_deg(const Motor& motor);

struct Controller {
  MoveMode moves = MoveMode::simultaneous;
  double settle_s = 0.5;    ///< added once per step when any motor moved
  double overhead_s = 0.1;  ///< added to every step
};

/// Photon-pair source and detection (global depolarizing model, docs/conventions.md).
struct Source {
  double pair_rate_per_s = 50000.0;  ///< pairs emitted per second
  double visibility = 0.98;          ///< V in p = V kappa + (1 - V) / 2^P
};

struct Detector {
  double efficiency = 0.2;       ///< per-arm detection efficiency (coupling x detector), 0..1
  double dark_rate_per_s = 100;  ///< dark counts per second
  /// Fraction of the orthogonal (V) polarization that leaves by the PBS pass port, 0..0.5.
  double pbs_leakage = 0.0;
};

enum class DetectionScheme {
  pass_only,   ///< one detector per photon on the pass port; Poisson statistics, normalised
               ///< by reference settings
  both_ports,  ///< both PBS outputs detected (2^P coincidence channels); binomial statistics
};

struct Rig {
  std::vector<Motor> motors;
  Controller controller;
  Source source;
  std::vector<Detector> detectors;     ///< one per photon (per arm)
  double coincidence_window_s = 2e-9;  ///< full coincidence window tau
  DetectionScheme scheme = DetectionScheme::both_ports;
  /// Synthesise the plate angles for the actual retardances (plates.h); false keeps the angles
  /// of ideal plates, to see the uncompensated bias.
  bool compensate_plates = true;

  /// Index of the motor for (photon, stage, plate), or -1.
  int motor_index(int photon, Stage stage, Plate plate) const;
  /// Returns empty when every photon 0..photons-1 has its four motors and one detector,
  /// and every parameter is physical; otherwise a message naming the field.
  std::string check(int photons) const;
};

std::string to_string(Stage);
std::string to_string(Plate);
std::string to_string(Backlash);
std::string to_string(MoveMode);
std::string to_string(DetectionScheme);
bool from_string(const std::string&, Stage&);
bool from_string(const std::string&, Plate&);
bool from_string(const std::string&, Backlash&);
bool from_string(const std::string&, MoveMode&);
bool from_string(const std::string&, DetectionScheme&);

}  // namespace gramline
