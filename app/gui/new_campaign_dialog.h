#pragma once
// File ▸ New Campaign from CSV…: a campaign for one's own data, with the photons, the encoding
// preset and, optionally, a rig file (docs/conventions.md, "New campaigns").
#include <QDialog>
#include <optional>

#include "gramline/campaign.h"

class QComboBox;
class QLabel;
class QLineEdit;
class QSpinBox;

namespace gramline::gui {

class NewCampaignDialog : public QDialog {
  Q_OBJECT

 public:
  explicit NewCampaignDialog(QWidget* parent = nullptr);

  void set_data_path(const QString& path);
  void set_rig_path(const QString& path);
  /// 0: the rig file's photons, else 2.
  void set_photons(int photons);
  /// Index in the preset list: 0 automatic, 1 linear, 2 polar-azimuth, 3 spread.
  void set_preset_index(int index);

  /// The campaign the choices make, or nothing with the reason (naming the file or field) in
  /// the dialog's message line.
  std::optional<Campaign> build();
  QString message() const;

 private:
  QLineEdit* data_path_;
  QLineEdit* rig_path_;
  QSpinBox* photons_;
  QComboBox* preset_;
  QLabel* message_;
  std::optional<Campaign> built_;
};

}  // namespace gramline::gui
