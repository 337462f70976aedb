#pragma once
// The five pages of the campaign editor, one class a page over EditorPage's bound controls:
// data, encoding, rig, precision (and schedule), nights.
#include <vector>

#include "editor_page.h"
#include "gramline/margin.h"

class QComboBox;
class QDoubleSpinBox;
class QLabel;
class QLineEdit;
class QPushButton;
class QTableView;
class QTableWidget;

namespace gramline::gui {

class DataModel;
class MotorsModel;

/// The campaign's name and its data set: import, demo, the table of points.
class DataPage : public EditorPage {
  Q_OBJECT

 public:
  explicit DataPage(CampaignDocument* document, QWidget* parent = nullptr);

 signals:
  void import_requested();
  void demo_requested();

 private:
  QLineEdit* name_;
  QLabel* data_info_;
  DataModel* data_model_;
};

/// The map from features to Bloch angles: presets, scaling (with the margin check's advice) and
/// the current weights.
class EncodingPage : public EditorPage {
  Q_OBJECT

 public:
  explicit EncodingPage(CampaignDocument* document, QWidget* parent = nullptr);
  /// Shows the encoding-scale scan of the latest margin check.
  void set_scale_scan(const std::vector<ScalePoint>& scan, double advised);
  void clear_scale_scan();
  /// Sets one cell of the map (column 1 theta weights, 2 theta offset, 3 phi weights, 4 phi
  /// offset; weights separated by ';') as an undoable edit. Refuses, naming the field, text
  /// that is not finite numbers or not one weight per feature.
  bool edit_weight(int photon, int column, const QString& text);

 private:
  void apply_preset();
  void scale_encoding(double factor);
  void refresh_encoding_table();

  QComboBox* preset_;
  QDoubleSpinBox* theta_low_;
  QDoubleSpinBox* theta_high_;
  QDoubleSpinBox* phi_low_;
  QDoubleSpinBox* phi_high_;
  QDoubleSpinBox* scale_;
  QLabel* scale_advice_;
  QPushButton* use_advice_;
  double advised_scale_ = 1.0;
  QTableWidget* weights_;
  QLabel* weights_error_;
};

/// The motors, the controller, the source and the detectors.
class RigPage : public EditorPage {
  Q_OBJECT

 public:
  explicit RigPage(CampaignDocument* document, QWidget* parent = nullptr);
  MotorsModel* motors_model() const { return motors_; }
  /// Replaces the rig by a rig file (one undoable edit; the encoding follows its photons).
  /// Shows the reason and returns false when the file is refused.
  bool load_rig_file(const QString& path);

 private:
  void refresh_detectors();

  MotorsModel* motors_;
  QTableView* motors_view_;
  QTableWidget* detectors_;
};

/// The precision of each kernel entry and the schedule's settings.
class PrecisionPage : public EditorPage {
  Q_OBJECT

 public:
  explicit PrecisionPage(CampaignDocument* document, QWidget* parent = nullptr);
};

/// When the lab is available: first night, window, nights allowed.
class NightsPage : public EditorPage {
  Q_OBJECT

 public:
  explicit NightsPage(CampaignDocument* document, QWidget* parent = nullptr);

 private:
  QLabel* window_info_;
};

}  // namespace gramline::gui
