#include "gramline/plates.h"

#include <Eigen/Cholesky>
#include <algorithm>
#include <cmath>

#include "gramline/units.h"

namespace gramline {

namespace {

// The state a stage prepares (HWP then QWP on |H>) or passes ((HWP QWP)^dagger |H>: the pass
// port projects onto it), both with the actual plates.
JonesVector stage_state(const Motor& hwp, const Motor& qwp, Stage stage, double h_deg,
                        double q_deg) {
  const JonesVector h(1.0, 0.0);
  if (stage == Stage::prep) return motor_jones(qwp, q_deg) * (motor_jones(hwp, h_deg) * h);
  return (motor_jones(hwp, h_deg) * motor_jones(qwp, q_deg)).adjoint() * h;
}

// Gauss-Newton on the Stokes residual over the two angles, Jacobian by central differences.
// Returns the solution and its residual norm.
PlatePair solve_stage(const Motor& hwp, const Motor& qwp, Stage stage, const Eigen::Vector3d& want,
                      PlatePair start, double& residual) {
  auto residual_of = [&](const PlatePair& p) {
    return Eigen::Vector3d(stokes_vector(stage_state(hwp, qwp, stage, p.hwp_deg, p.qwp_deg)) -
                           want);
  };
  PlatePair x = start;
  Eigen::Vector3d r = residual_of(x);
  constexpr double kStepDeg = 1e-5;
  for (int it = 0; it < 60 && r.norm() > 1e-15; ++it) {
    Eigen::Matrix<double, 3, 2> jac;
    for (int k = 0; k < 2; ++k) {
      PlatePair up = x, down = x;
      (k == 0 ? up.hwp_deg : up.qwp_deg) += kStepDeg;
      (k == 0 ? down.hwp_deg : down.qwp_deg) -= kStepDeg;
      jac.col(k) = (residual_of(up) - residual_of(down)) / (2.0 * kStepDeg);
    }
    // Levenberg damping keeps the step finite where the Jacobian loses rank (the poles).
    const Eigen::Matrix2d normal = jac.transpose() * jac + 1e-12 * Eigen::Matrix2d::Identity();
    const Eigen::Vector2d step = normal.ldlt().solve(-jac.transpose() * r);
    // Halve the step until the residual falls (at most a few times).
    double scale = 1.0;
    bool improved = false;
    for (int h = 0; h < 30; ++h, scale /= 2.0) {
      PlatePair trial = x;
      trial.hwp_deg += scale * step(0);
      trial.qwp_deg += scale * step(1);
      const Eigen::Vector3d rt = residual_of(trial);
      if (rt.norm() < r.norm()) {
        x = trial;
        r = rt;
        improved = true;
        break;
      }
    }
    if (!improved) break;
  }
  residual = r.norm();
  return x;
}

}  // namespace

JonesMatrix motor_jones(const Motor& motor, double position_deg) {
  return waveplate(position_deg, deg_to_rad(motor.retardance_deg()));
}

bool has_retardance_errors(const Rig& rig) {
  return std::any_of(rig.motors.begin(), rig.motors.end(),
                     [](const Motor& m) { return m.retardance_error_deg != 0.0; });
}

bool has_random_plate_terms(const Rig& rig) {
  return std::any_of(rig.motors.begin(), rig.motors.end(), [](const Motor& m) {
    return m.axis_offset_sd_deg > 0.0 || m.repeatability_sd_deg > 0.0;
  });
}

double rig_kernel(const Rig& rig, int photons, const std::vector<double>& position_deg,
                  const std::vector<double>& shift_deg) {
  auto at = [&](int m) { return position_deg.at(m) + (shift_deg.empty() ? 0.0 : shift_deg.at(m)); };
  double kernel = 1.0;
  for (int p = 0; p < photons; ++p) {
    const int hp = rig.motor_index(p, Stage::prep, Plate::HWP);
    const int qp = rig.motor_index(p, Stage::prep, Plate::QWP);
    const int qa = rig.motor_index(p, Stage::analysis, Plate::QWP);
    const int ha = rig.motor_index(p, Stage::analysis, Plate::HWP);
    JonesVector out(1.0, 0.0);
    out = motor_jones(rig.motors[hp], at(hp)) * out;
    out = motor_jones(rig.motors[qp], at(qp)) * out;
    out = motor_jones(rig.motors[qa], at(qa)) * out;
    out = motor_jones(rig.motors[ha], at(ha)) * out;
    const double leak =
        p < static_cast<int>(rig.detectors.size()) ? rig.detectors[p].pbs_leakage : 0.0;
    kernel *= (1.0 - leak) * std::norm(out(0)) + leak * std::norm(out(1));
  }
  return kernel;
}

std::vector<double> rig_kernel_gradient(const Rig& rig, int photons,
                                        const std::vector<double>& position_deg) {
  // Step 1e-4 deg: truncation error ~ (1.7e-6 rad)^2, rounding ~ 1e-16 / 1.7e-6.
  constexpr double kStepDeg = 1e-4;
  std::vector<double> out(rig.motors.size(), 0.0);
  std::vector<double> shift(rig.motors.size(), 0.0);
  for (std::size_t m = 0; m < rig.motors.size(); ++m) {
    shift[m] = kStepDeg;
    const double up = rig_kernel(rig, photons, position_deg, shift);
    shift[m] = -kStepDeg;
    const double down = rig_kernel(rig, photons, position_deg, shift);
    shift[m] = 0.0;
    out[m] = (up - down) / (2.0 * kStepDeg);
  }
  return out;
}

double kernel_spread_sd(const Rig& rig, const std::vector<double>& gradient_per_deg) {
  double var = 0.0;
  for (std::size_t m = 0; m < rig.motors.size() && m < gradient_per_deg.size(); ++m) {
    const Motor& mo = rig.motors[m];
    const double sd2 = mo.axis_offset_sd_deg * mo.axis_offset_sd_deg +
                       mo.repeatability_sd_deg * mo.repeatability_sd_deg;
    var += gradient_per_deg[m] * gradient_per_deg[m] * sd2;
  }
  return std::sqrt(var);
}

CompensatedStage compensated_stage(const Motor& hwp, const Motor& qwp, Stage stage,
                                   double theta_deg, double phi_deg) {
  CompensatedStage out;
  out.solutions = stage == Stage::prep ? preparation_solutions(theta_deg, phi_deg)
                                       : analysis_solutions(theta_deg, phi_deg);
  if (hwp.retardance_error_deg == 0.0 && qwp.retardance_error_deg == 0.0) {
    // Exact plates: the closed-form solutions stand (their error is checked by the caller).
    return out;
  }
  const Eigen::Vector3d want = stokes_vector(bloch_state(theta_deg, phi_deg));
  for (PlatePair& s : out.solutions) {
    double residual = 0.0;
    const PlatePair x = solve_stage(hwp, qwp, stage, want, s, residual);
    s.hwp_deg = wrap_deg(x.hwp_deg, motor_period_deg(hwp));
    s.qwp_deg = wrap_deg(x.qwp_deg, motor_period_deg(qwp));
    out.kernel_error = std::max(out.kernel_error, residual / 2.0);
  }
  return out;
}

}  // namespace gramline
