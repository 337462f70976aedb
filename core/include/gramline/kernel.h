#pragma once
// Ideal quantum kernel |<psi(x)|psi(x')>|^2 = prod_p |<psi_p(x)|psi_p(x')>|^2
// (docs/conventions.md).
#include <Eigen/Core>
#include <vector>

#include "gramline/encoding.h"
#include "gramline/jones.h"

namespace gramline {

/// Ideal kernel between two feature vectors.
double ideal_kernel(const EncodingMap& encoding, const Eigen::VectorXd& a,
                    const Eigen::VectorXd& b);
/// N x N Gram matrix over the rows of `train` (symmetric, unit diagonal).
Eigen::MatrixXd ideal_gram(const EncodingMap& encoding, const Eigen::MatrixXd& train);
/// M x N block K(test_i, train_j).
Eigen::MatrixXd ideal_cross(const EncodingMap& encoding, const Eigen::MatrixXd& test,
                            const Eigen::MatrixXd& train);

/// Jones state of every photon of every row of `points`: photon p of point i at index i P + p
/// (P photons). Computed once, a Gram matrix then costs one overlap per photon and entry.
std::vector<JonesVector> photon_states(const EncodingMap& encoding, const Eigen::MatrixXd& points);

/// Nearest positive semidefinite matrix in Frobenius norm by clipping negative eigenvalues at
/// zero (Higham, Linear Algebra Appl. 103 (1988) 103-118); with keep_unit_diagonal, then
/// rescaled as D^-1/2 K D^-1/2 so every diagonal entry is 1 again. Returns true when a
/// negative eigenvalue was clipped (the matrix is left untouched otherwise).
bool repair_psd(Eigen::MatrixXd& gram, bool keep_unit_diagonal);

}  // namespace gramline
