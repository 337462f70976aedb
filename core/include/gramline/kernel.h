#pragma once
// Ideal quantum kernel |<psi(x)|psi(x')>|^2 = prod_p |<psi_p(x)|psi_p(x')>|^2
// (docs/conventions.md).
#include <Eigen/Core>

#include "gramline/encoding.h"

namespace gramline {

/// Ideal kernel between two feature vectors.
double ideal_kernel(const EncodingMap& encoding, const Eigen::VectorXd& a,
                    const Eigen::VectorXd& b);
/// N x N Gram matrix over the rows of `train` (symmetric, unit diagonal).
Eigen::MatrixXd ideal_gram(const EncodingMap& encoding, const Eigen::MatrixXd& train);
/// M x N block K(test_i, train_j).
Eigen::MatrixXd ideal_cross(const EncodingMap& encoding, const Eigen::MatrixXd& test,
                            const Eigen::MatrixXd& train);

}  // namespace gramline
