#pragma once
// Ingest: from the counts a rig recorded for a planned schedule to the measured Gram matrix,
// its uncertainty, the drift of pair rate and visibility, and a comparison with the prediction.
#include <Eigen/Core>
#include <string>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/plan.h"
#include "gramline/svm.h"

namespace gramline {

/// Counts recorded for one step. Channels: for both_ports, 2^P coincidence channels indexed by
/// the bit pattern of the ports (bit p set: photon p left by the PBS reflect port), so channel 0
/// is all-pass; for pass_only, one channel (the pass coincidences).
struct StepRecord {
  int step = 0;          ///< index into the plan's steps
  double start_s = 0.0;  ///< counting start, seconds from the first night's start
  double end_s = 0.0;    ///< counting end
  std::vector<double> channel_counts;
  std::vector<double> singles_per_s;  ///< optional: pass-port singles rate per photon
};

/// Number of coincidence channels a record must hold for the rig's scheme.
int channel_count(DetectionScheme scheme, int photons);

/// Pair rate and visibility from one reference (diagonal) step.
struct DriftPoint {
  int step = 0;
  double time_s = 0.0;  ///< middle of the counting interval
  double pair_detect_rate_per_s = 0.0;
  double pair_detect_rate_sigma = 0.0;
  double visibility = 0.0;
  double visibility_sigma = 0.0;  ///< 0 when the scheme cannot separate V (pass_only)
  bool drifted = false;  ///< differs from the first reference by more than 3 combined sigma
};

struct Outlier {
  Block block = Block::train;
  int row = 0;  ///< training row (train) or test row (test), 0-based within its block
  int col = 0;  ///< training column
  int step = 0;
  double measured = 0.0;
  double predicted = 0.0;
  double z = 0.0;
};

struct IngestOptions {
  double outlier_z = 4.0;  ///< |z| above this is listed as an outlier
  /// The PSD repair of the measured Gram matrix before the classifier is trained on it
  /// (train_measured_classifier) keeps the unit diagonal.
  bool keep_unit_diagonal = true;
  /// Throws std::invalid_argument naming the first unusable field.
  void validate() const;
};

struct IngestResult {
  Eigen::MatrixXd gram_measured;  ///< N x N, unit diagonal; NaN where not measured
  Eigen::MatrixXd gram_sigma;     ///< N x N per-entry sigma from the counts
  Eigen::MatrixXd test_measured;  ///< M x N; NaN where not measured
  Eigen::MatrixXd test_sigma;
  Eigen::MatrixXd gram_z;  ///< (measured - ideal) / predicted sigma; NaN if unmeasured
  Eigen::MatrixXd test_z;
  int measured_entries = 0;
  int expected_entries = 0;
  std::vector<DriftPoint> drift;
  std::vector<Outlier> outliers;
  double z_mean = 0.0;    ///< mean of all z-scores (standard normal expects 0)
  double z_std = 0.0;     ///< their standard deviation (expects 1)
  IngestOptions options;  ///< as run
  std::string report() const;
};

/// Builds the measured kernel from records of the plan's steps. The calibration of each
/// measure step (pair rate, visibility) is interpolated linearly in time between the reference
/// steps around it; without references the rig model is used. Throws std::invalid_argument
/// naming the record for a record whose step index or channel count does not fit the plan.
IngestResult ingest_records(const Campaign& campaign, const Plan& plan,
                            const std::vector<StepRecord>& records,
                            const IngestOptions& options = {});

/// A C-SVC trained on the measured Gram matrix, and its predictions for the test points.
struct MeasuredClassifier {
  int unmeasured_train = 0;   ///< off-diagonal training entries (i < j) without a value
  int unmeasured_test = 0;    ///< test entries without a value
  bool psd_repaired = false;  ///< a negative eigenvalue was clipped before training
  bool svm_trained = false;
  std::string svm_skipped_reason;
  double C = 1.0;
  bool C_from_cross_validation = false;
  SvmModel svm;                      ///< trained on the repaired measured Gram matrix
  Eigen::VectorXd decision_test;     ///< f at the test points with the measured test block
  double test_accuracy = 0.0;        ///< against the test labels (NaN without test decisions)
  double ideal_test_accuracy = 0.0;  ///< same classifier setup on the ideal kernels
  bool keep_unit_diagonal = true;    ///< of the PSD repair, as run (IngestOptions)
  std::string report() const;
};

/// Trains the classifier on result.gram_measured once every training entry has a value: PSD
/// repair (repair_psd, kernel.h; unit diagonal kept as options.keep_unit_diagonal says), C
/// fixed or by cross-validation as the campaign's check settings say (fold assignment seeded by
/// campaign.seed), then the test decisions when the test block is complete. An untrainable
/// matrix is reported in svm_skipped_reason, not thrown.
MeasuredClassifier train_measured_classifier(const Campaign& campaign, const Plan& plan,
                                             const IngestResult& result,
                                             const IngestOptions& options = {});

}  // namespace gramline
