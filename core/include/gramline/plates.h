#pragma once
// Real plates (docs/conventions.md, "Real plates"): retardances off their nominal values,
// uncertain fast-axis zeros, scattering motors and a leaking PBS. The kernel a rig realises at
// given motor positions, its sensitivity to the positions, and plate angles compensated for the
// actual retardances.
#include <string>
#include <vector>

#include "gramline/jones.h"
#include "gramline/rig.h"
#include "gramline/waveplates.h"

namespace gramline {

/// Jones matrix of the motor's plate with its fast axis at position_deg and its actual
/// retardance (Motor::retardance_deg).
JonesMatrix motor_jones(const Motor& motor, double position_deg);

/// Whether any plate of the rig differs from its nominal retardance.
bool has_retardance_errors(const Rig& rig);
/// Whether any motor has a random term (axis_offset_sd_deg or repeatability_sd_deg > 0).
bool has_random_plate_terms(const Rig& rig);

/// The kernel the rig realises at one step's motor positions (one per motor, rig.motors
/// order): the product over photons of (1 - L) |<H|out>|^2 + L |<V|out>|^2, where L is the
/// photon's pbs_leakage and out = HWP_a QWP_a QWP_p HWP_p |H> with the actual plates at those
/// positions. `shift_deg` (empty, or one per motor) is added to every position.
double rig_kernel(const Rig& rig, int photons, const std::vector<double>& position_deg,
                  const std::vector<double>& shift_deg = {});

/// d rig_kernel / d position of each motor (central differences), per degree.
std::vector<double> rig_kernel_gradient(const Rig& rig, int photons,
                                        const std::vector<double>& position_deg);

/// Standard deviation that the motors' random terms add to a kernel with this gradient:
/// sqrt(sum_m g_m^2 (axis_offset_sd_deg^2 + repeatability_sd_deg^2)), to first order.
double kernel_spread_sd(const Rig& rig, const std::vector<double>& gradient_per_deg);

/// Plate angles of one stage (one photon's prep or analysis plates) realising a state.
struct CompensatedStage {
  StageSolutions solutions;
  /// Largest error, over both solutions, of one photon's kernel factor against any partner
  /// state: |s_realised - s_target| / 2 for the Stokes vectors.
  double kernel_error = 0.0;
};

/// Angles that make the actual plates (hwp, qwp: the stage's motors) prepare (Stage::prep) or
/// pass (Stage::analysis) |psi(theta, phi)>: a Gauss-Newton solve on the Stokes vector started
/// from each ideal solution of waveplates.h. HWP angles are wrapped into the HWP motor's period,
/// QWP angles into [0, 180). With exact plates this returns the ideal solutions.
CompensatedStage compensated_stage(const Motor& hwp, const Motor& qwp, Stage stage,
                                   double theta_deg, double phi_deg);

}  // namespace gramline
