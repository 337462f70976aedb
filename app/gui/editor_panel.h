#pragma once
// The campaign editor: data, encoding, rig, measurement and nights. Every control writes
// through CampaignDocument::edit (undoable) and is refreshed from the document after any change.
#include <QWidget>
#include <functional>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/margin.h"

class QCheckBox;
class QComboBox;
class QDoubleSpinBox;
class QFormLayout;
class QLabel;
class QLineEdit;
class QPushButton;
class QSpinBox;
class QTabWidget;
class QTableView;
class QTableWidget;

namespace gramline::gui {

class CampaignDocument;
class DataModel;
class MotorsModel;

class EditorPanel : public QWidget {
  Q_OBJECT

 public:
  explicit EditorPanel(CampaignDocument* document, QWidget* parent = nullptr);

  QTabWidget* pages() const { return pages_; }
  MotorsModel* motors_model() const { return motors_; }
  /// Reads every control back from the document's campaign.
  void refresh();
  /// Shows the encoding-scale scan of the latest margin check.
  void set_scale_scan(const std::vector<ScalePoint>& scan, double advised);
  void clear_scale_scan();

 signals:
  void import_requested();
  void demo_requested();

 private:
  QWidget* build_data_page();
  QWidget* build_encoding_page();
  QWidget* build_rig_page();
  QWidget* build_measurement_page();
  QWidget* build_nights_page();

  /// Shared wiring of a spin box: names, undoable edits and refresh from the campaign.
  template <typename Box, typename Value>
  Box* bind_spin(Box* box, QFormLayout* form, const QString& key, const QString& label,
                 const QString& help, std::function<Value(const Campaign&)> get,
                 std::function<void(Campaign&, Value)> set);
  QDoubleSpinBox* number(QFormLayout* form, const QString& key, const QString& label,
                         const QString& help, double min, double max, int decimals,
                         const QString& suffix, std::function<double(const Campaign&)> get,
                         std::function<void(Campaign&, double)> set);
  QSpinBox* integer(QFormLayout* form, const QString& key, const QString& label,
                    const QString& help, int min, int max, std::function<int(const Campaign&)> get,
                    std::function<void(Campaign&, int)> set);
  QCheckBox* flag(QFormLayout* form, const QString& key, const QString& label, const QString& help,
                  std::function<bool(const Campaign&)> get,
                  std::function<void(Campaign&, bool)> set);
  QComboBox* choice(QFormLayout* form, const QString& key, const QString& label,
                    const QString& help, const QStringList& items,
                    std::function<int(const Campaign&)> get,
                    std::function<void(Campaign&, int)> set);
  void apply_preset();
  void scale_encoding(double factor);
  void refresh_encoding_table();
  void refresh_detectors();

  CampaignDocument* document_;
  QTabWidget* pages_;
  std::vector<std::function<void()>> refreshers_;

  DataModel* data_model_;
  QLabel* data_info_;
  QLineEdit* name_;
  MotorsModel* motors_;
  QTableView* motors_view_;
  QTableWidget* detectors_;
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
  QLabel* window_info_;
};

}  // namespace gramline::gui
