#include <QComboBox>
#include <QDoubleSpinBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLocale>
#include <QMessageBox>
#include <QPushButton>
#include <QTableWidget>
#include <QVBoxLayout>
#include <cmath>
#include <vector>

#include "campaign_document.h"
#include "editor_pages.h"
#include "gramline/new_campaign.h"
#include "gui_text.h"

namespace gramline::gui {

EncodingPage::EncodingPage(CampaignDocument* campaign_document, QWidget* parent)
    : EditorPage(campaign_document, parent) {
  auto* layout = new QVBoxLayout(this);
  auto* intro =
      new QLabel(tr("Each photon's polarization state is set by the features: the "
                    "polar angle θ and the azimuth φ on the Bloch sphere are affine "
                    "in the features."));
  intro->setWordWrap(true);
  layout->addWidget(intro);

  auto* preset_box = new QGroupBox(tr("Build from a preset"));
  auto* form = new_form(preset_box);
  preset_ = new QComboBox;
  preset_->addItem(preset_text(EncodingPreset::one_feature_per_photon_linear),
                   static_cast<int>(EncodingPreset::one_feature_per_photon_linear));
  preset_->addItem(preset_text(EncodingPreset::two_features_polar_azimuth),
                   static_cast<int>(EncodingPreset::two_features_polar_azimuth));
  preset_->addItem(preset_text(EncodingPreset::spread), static_cast<int>(EncodingPreset::spread));
  preset_->setAccessibleName(tr("Encoding preset"));
  form->addRow(tr("Preset"), preset_);
  const auto span = [form](const QString& label, double lo, double hi, QDoubleSpinBox*& low,
                           QDoubleSpinBox*& high) {
    low = new QDoubleSpinBox;
    high = new QDoubleSpinBox;
    for (QDoubleSpinBox* b : {low, high}) {
      b->setRange(-720.0, 720.0);
      b->setDecimals(1);
      b->setSuffix(QStringLiteral(" °"));
    }
    low->setValue(lo);
    high->setValue(hi);
    low->setAccessibleName(label + tr(" from"));
    high->setAccessibleName(label + tr(" to"));
    auto* row = new QHBoxLayout;
    row->addWidget(low);
    row->addWidget(new QLabel(tr("to")));
    row->addWidget(high);
    form->addRow(label, row);
  };
  span(tr("Polar angle θ spans"), 0.0, 180.0, theta_low_, theta_high_);
  span(tr("Azimuth φ spans"), 0.0, 360.0, phi_low_, phi_high_);
  auto* apply = new QPushButton(tr("Apply preset to the training ranges"));
  apply->setToolTip(tr("Maps each feature's training range onto the chosen angle span"));
  form->addRow(QString(), apply);
  connect(apply, &QPushButton::clicked, this, &EncodingPage::apply_preset);
  layout->addWidget(preset_box);

  auto* scale_box = new QGroupBox(tr("Scale"));
  auto* scale_form = new_form(scale_box);
  scale_ = new QDoubleSpinBox;
  scale_->setRange(0.01, 100.0);
  scale_->setDecimals(2);
  scale_->setValue(1.0);
  scale_->setPrefix(QStringLiteral("× "));
  scale_->setAccessibleName(tr("Scale factor"));
  auto* scale_apply = new QPushButton(tr("Scale all weights"));
  auto* row = new QHBoxLayout;
  row->addWidget(scale_);
  row->addWidget(scale_apply);
  scale_form->addRow(tr("Multiply weights by"), row);
  use_advice_ = new QPushButton(tr("Use the suggested scale"));
  use_advice_->setToolTip(
      tr("The margin check scans scale factors: a scale too small makes "
         "every state alike, too large makes every pair of points look "
         "unrelated"));
  use_advice_->setEnabled(false);
  scale_advice_ = new QLabel;
  scale_advice_->setWordWrap(true);
  scale_advice_->setTextFormat(Qt::RichText);
  scale_form->addRow(scale_advice_);
  scale_form->addRow(use_advice_);
  clear_scale_scan();
  connect(scale_apply, &QPushButton::clicked, this, [this] { scale_encoding(scale_->value()); });
  connect(use_advice_, &QPushButton::clicked, this, [this] { scale_encoding(advised_scale_); });
  layout->addWidget(scale_box);

  auto* weights_box = new QGroupBox(tr("Current map (degrees per feature unit)"));
  auto* wl = new QVBoxLayout(weights_box);
  auto* weights_hint = new QLabel(
      tr("Double-click a cell to edit it: weights are one number per feature, separated by "
         "semicolons; offsets are in degrees."));
  weights_hint->setWordWrap(true);
  weights_hint->setForegroundRole(QPalette::PlaceholderText);
  wl->addWidget(weights_hint);
  weights_ = new QTableWidget;
  weights_->setObjectName(QStringLiteral("encoding/weights"));
  weights_->setEditTriggers(QAbstractItemView::DoubleClicked | QAbstractItemView::EditKeyPressed |
                            QAbstractItemView::AnyKeyPressed);
  connect(weights_, &QTableWidget::itemChanged, this, [this](QTableWidgetItem* item) {
    edit_weight(item->row(), item->column(), item->text());
  });
  weights_->verticalHeader()->setVisible(false);
  weights_->setAccessibleName(tr("Encoding weights"));
  weights_->horizontalHeader()->setStretchLastSection(true);
  wl->addWidget(weights_);
  weights_error_ = new QLabel;
  weights_error_->setObjectName(QStringLiteral("encoding/weights_error"));
  weights_error_->setWordWrap(true);
  weights_error_->setStyleSheet(QStringLiteral("color: #b00020"));
  weights_error_->setVisible(false);
  wl->addWidget(weights_error_);
  layout->addWidget(weights_box, 1);
  on_refresh([this] { refresh_encoding_table(); });
}

void EncodingPage::refresh_encoding_table() {
  const QSignalBlocker block_table(weights_);
  const EncodingMap& e = document()->campaign().encoding;
  {
    const QSignalBlocker block(preset_);
    const int i = preset_->findData(static_cast<int>(e.preset));
    if (i >= 0) preset_->setCurrentIndex(i);
  }
  weights_->clear();
  weights_->setColumnCount(5);
  weights_->setHorizontalHeaderLabels(
      {tr("Photon"), tr("θ weights"), tr("θ offset"), tr("φ weights"), tr("φ offset")});
  weights_->setRowCount(e.photon_count());
  const auto vec = [](const Eigen::VectorXd& v) {
    QStringList parts;
    for (Eigen::Index i = 0; i < v.size(); ++i) parts << QLocale().toString(v(i), 'g', 8);
    return parts.join(QStringLiteral("; "));
  };
  for (int p = 0; p < e.photon_count(); ++p) {
    const PhotonEncoding& pe = e.photons[static_cast<std::size_t>(p)];
    // Photons count from 0, as in the files and messages (docs/conventions.md).
    auto* photon = new QTableWidgetItem(QString::number(p));
    photon->setFlags(photon->flags() & ~Qt::ItemIsEditable);
    weights_->setItem(p, 0, photon);
    weights_->setItem(p, 1, new QTableWidgetItem(vec(pe.theta_weights_deg)));
    weights_->setItem(p, 2, new QTableWidgetItem(QLocale().toString(pe.theta_offset_deg, 'g', 8)));
    weights_->setItem(p, 3, new QTableWidgetItem(vec(pe.phi_weights_deg)));
    weights_->setItem(p, 4, new QTableWidgetItem(QLocale().toString(pe.phi_offset_deg, 'g', 8)));
  }
  weights_->resizeColumnsToContents();
}

bool EncodingPage::edit_weight(int photon, int column, const QString& text) {
  const Campaign& c = document()->campaign();
  const int d = c.data.feature_count();
  static const char* const kFields[] = {"", "theta_weights_deg_per_unit", "theta_offset_deg",
                                        "phi_weights_deg_per_unit", "phi_offset_deg"};
  if (photon < 0 || photon >= c.encoding.photon_count() || column < 1 || column > 4) return false;
  const QString field =
      QStringLiteral("encoding.photons[%1].%2").arg(photon).arg(QLatin1String(kFields[column]));
  std::vector<double> values;
  const QStringList parts = text.split(QLatin1Char(';'), Qt::SkipEmptyParts);
  bool ok = !parts.isEmpty();
  for (const QString& part : parts) {
    bool one = false;
    const double v = QLocale().toDouble(part.trimmed(), &one);
    ok = ok && one && std::isfinite(v);
    values.push_back(v);
  }
  const bool weights = column == 1 || column == 3;
  const int expected = weights ? d : 1;
  QString problem;
  if (!ok) {
    problem = tr("%1: '%2' is not a list of finite numbers").arg(field, text);
  } else if (static_cast<int>(values.size()) != expected) {
    problem = tr("%1: %2 number(s) given, %3 expected (one per feature)")
                  .arg(field)
                  .arg(values.size())
                  .arg(expected);
  }
  weights_error_->setText(problem);
  weights_error_->setVisible(!problem.isEmpty());
  if (!problem.isEmpty()) {
    refresh_encoding_table();
    return false;
  }
  document()->edit(tr("Edit %1").arg(field), [photon, column, values](Campaign& k) {
    PhotonEncoding& e = k.encoding.photons[static_cast<std::size_t>(photon)];
    Eigen::VectorXd v(static_cast<Eigen::Index>(values.size()));
    for (std::size_t i = 0; i < values.size(); ++i) v(static_cast<Eigen::Index>(i)) = values[i];
    if (column == 1) e.theta_weights_deg = v;
    if (column == 2) e.theta_offset_deg = values[0];
    if (column == 3) e.phi_weights_deg = v;
    if (column == 4) e.phi_offset_deg = values[0];
    k.encoding.preset = EncodingPreset::custom;
  });
  return true;
}

void EncodingPage::apply_preset() {
  const Campaign& c = document()->campaign();
  if (c.data.train_count() == 0) {
    QMessageBox::information(this, tr("No data"), tr("Import or load data before encoding it."));
    return;
  }
  const auto preset = static_cast<EncodingPreset>(preset_->currentData().toInt());
  try {
    Eigen::VectorXd low, high;
    feature_ranges(c.data.train, low, high);
    // A preset that fixes the photon count takes it; spread keeps the rig's photons.
    int photons = preset_photons(preset, c.data.feature_count());
    if (photons == 0) photons = c.encoding.photon_count();
    const EncodingMap map =
        make_encoding(preset, photons, low, high, {theta_low_->value(), theta_high_->value()},
                      {phi_low_->value(), phi_high_->value()});
    document()->edit(tr("Apply encoding preset"), [map, photons](Campaign& k) {
      k.encoding = map;
      if (k.rig.check(photons) != "") k.rig = resize_rig(k.rig, photons);
    });
  } catch (const std::exception& e) {
    QMessageBox::warning(this, tr("Preset does not fit"), QString::fromStdString(e.what()));
  }
}

void EncodingPage::scale_encoding(double factor) {
  document()->edit(tr("Scale encoding by %1").arg(factor),
                   [factor](Campaign& c) { c.encoding = c.encoding.scaled(factor); });
}

void EncodingPage::set_scale_scan(const std::vector<ScalePoint>& scan, double advised) {
  advised_scale_ = advised;
  if (scan.empty()) {
    scale_advice_->setText(tr("The margin check found no scale to suggest."));
    use_advice_->setEnabled(false);
    return;
  }
  QStringList rows;
  for (const ScalePoint& p : scan) {
    rows << tr("<tr><td align=right>× %1</td><td align=right>%2</td><td align=right>%3 %</td></tr>")
                .arg(number_text(p.factor, 2))
                .arg(number_text(p.alignment, 3))
                .arg(number_text(100.0 * p.cv_accuracy, 1));
  }
  scale_advice_->setText(
      tr("<p>From the last margin check: the suggested scale is <b>× %1</b> of the current "
         "weights.</p><table cellspacing=6><tr><th>scale</th><th>alignment</th><th>held-out "
         "accuracy</th></tr>%2</table>")
          .arg(number_text(advised, 2))
          .arg(rows.join(QString())));
  use_advice_->setEnabled(std::abs(advised - 1.0) > 1e-9);
}

void EncodingPage::clear_scale_scan() {
  scale_advice_->setText(
      tr("The scale advice appears when the margin check of the current "
         "plan is done."));
  use_advice_->setEnabled(false);
}

}  // namespace gramline::gui
