#include "new_campaign_dialog.h"

#include <QComboBox>
#include <QDialogButtonBox>
#include <QFileDialog>
#include <QFileInfo>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QSpinBox>
#include <QVBoxLayout>
#include <exception>

#include "formats/data_csv.h"
#include "formats/rig_json.h"
#include "gramline/new_campaign.h"
#include "gui_text.h"

namespace gramline::gui {

NewCampaignDialog::NewCampaignDialog(QWidget* parent) : QDialog(parent) {
  setObjectName(QStringLiteral("new_campaign_dialog"));
  setWindowTitle(tr("New Campaign from CSV"));
  auto* layout = new QVBoxLayout(this);
  auto* intro = new QLabel(
      tr("A campaign for your own data: the encoding puts any number of features on 1 to 4 "
         "photons, and the rig has four motors and one detector per photon, or comes from a "
         "rig file."));
  intro->setWordWrap(true);
  layout->addWidget(intro);
  auto* form = new QFormLayout;
  const auto file_row = [this, form](const QString& label, const QString& name,
                                     const QString& filter, bool optional) {
    auto* edit = new QLineEdit;
    edit->setObjectName(name);
    edit->setAccessibleName(label);
    if (optional) edit->setPlaceholderText(tr("none: a rig for the photons"));
    auto* browse = new QPushButton(tr("Browse…"));
    auto* row = new QHBoxLayout;
    row->addWidget(edit, 1);
    row->addWidget(browse);
    form->addRow(label, row);
    connect(browse, &QPushButton::clicked, this, [this, edit, label, filter] {
      const QString path = QFileDialog::getOpenFileName(this, label, edit->text(), filter);
      if (!path.isEmpty()) edit->setText(path);
    });
    return edit;
  };
  data_path_ = file_row(tr("Data CSV"), QStringLiteral("new/data"),
                        tr("CSV files (*.csv);;All files (*)"), false);
  rig_path_ = file_row(tr("Rig file"), QStringLiteral("new/rig"),
                       tr("Rig files (*.rig.json *.json);;All files (*)"), true);
  photons_ = new QSpinBox;
  photons_->setObjectName(QStringLiteral("new/photons"));
  photons_->setRange(0, 4);
  photons_->setSpecialValueText(tr("the rig file's, else 2"));
  photons_->setAccessibleName(tr("Photons"));
  form->addRow(tr("Photons"), photons_);
  preset_ = new QComboBox;
  preset_->setObjectName(QStringLiteral("new/preset"));
  preset_->setAccessibleName(tr("Encoding preset"));
  preset_->addItem(tr("automatic (by features and photons)"), -1);
  for (EncodingPreset p : {EncodingPreset::one_feature_per_photon_linear,
                           EncodingPreset::two_features_polar_azimuth, EncodingPreset::spread})
    preset_->addItem(preset_text(p), static_cast<int>(p));
  form->addRow(tr("Encoding"), preset_);
  layout->addLayout(form);
  message_ = new QLabel;
  message_->setObjectName(QStringLiteral("new/message"));
  message_->setWordWrap(true);
  message_->setStyleSheet(QStringLiteral("color: #b00020"));
  layout->addWidget(message_);
  auto* buttons = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel);
  connect(buttons, &QDialogButtonBox::accepted, this, [this] {
    if (build()) accept();
  });
  connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
  layout->addWidget(buttons);
  resize(620, sizeHint().height());
}

void NewCampaignDialog::set_data_path(const QString& path) { data_path_->setText(path); }
void NewCampaignDialog::set_rig_path(const QString& path) { rig_path_->setText(path); }
void NewCampaignDialog::set_photons(int photons) { photons_->setValue(photons); }
void NewCampaignDialog::set_preset_index(int index) { preset_->setCurrentIndex(index); }
QString NewCampaignDialog::message() const { return message_->text(); }

std::optional<Campaign> NewCampaignDialog::build() {
  built_.reset();
  message_->clear();
  try {
    if (data_path_->text().trimmed().isEmpty()) {
      message_->setText(tr("Choose the data CSV."));
      return std::nullopt;
    }
    const DataSet data = formats::read_data_csv(data_path_->text().trimmed());
    NewCampaignOptions options;
    options.photons = photons_->value();
    if (const int p = preset_->currentData().toInt(); p >= 0)
      options.preset = static_cast<EncodingPreset>(p);
    if (!rig_path_->text().trimmed().isEmpty())
      options.rig = formats::load_rig(rig_path_->text().trimmed());
    Campaign c = make_campaign_for_data(data, options);
    c.name = QFileInfo(data_path_->text().trimmed()).completeBaseName().toStdString();
    built_ = c;
  } catch (const std::exception& e) {
    message_->setText(QString::fromStdString(e.what()));
  }
  return built_;
}

}  // namespace gramline::gui
