#include <QComboBox>
#include <QDoubleSpinBox>
#include <QFileDialog>
#include <QFileInfo>
#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLocale>
#include <QMessageBox>
#include <QPushButton>
#include <QTableView>
#include <QTableWidget>
#include <QVBoxLayout>

#include "campaign_document.h"
#include "editor_pages.h"
#include "formats/rig_json.h"
#include "gramline/new_campaign.h"
#include "gui_text.h"
#include "rig_tables.h"

namespace gramline::gui {

RigPage::RigPage(CampaignDocument* campaign_document, QWidget* parent)
    : EditorPage(campaign_document, parent) {
  auto* layout = new QVBoxLayout(this);

  // Photons: each with its four motors and its detector; the encoding follows.
  auto* photons_box = new QGroupBox(tr("Photons"));
  auto* pf = new_form(photons_box);
  integer(
      pf, "rig/photons", tr("Photons"),
      tr("Photons of the rig (numbered from 0, letters A to D in the motor names); adding one "
         "adds its four motors and its detector"),
      1, 4, [](const Campaign& c) { return c.encoding.photon_count(); },
      [](Campaign& c, int v) {
        c.rig = resize_rig(c.rig, v);
        c.encoding = encoding_for_photons(c.encoding, c.data, v);
      });
  auto* rig_buttons = new QHBoxLayout;
  auto* save_rig = new QPushButton(tr("Save Rig…"));
  save_rig->setObjectName(QStringLiteral("rig/save"));
  save_rig->setToolTip(tr("Save the motors, controller, source and detectors as a rig file"));
  auto* load_rig = new QPushButton(tr("Load Rig…"));
  load_rig->setObjectName(QStringLiteral("rig/load"));
  load_rig->setToolTip(tr("Replace the rig by a rig file; the encoding follows its photons"));
  rig_buttons->addWidget(save_rig);
  rig_buttons->addWidget(load_rig);
  rig_buttons->addStretch(1);
  pf->addRow(rig_buttons);
  connect(save_rig, &QPushButton::clicked, this, [this] {
    QString path = QFileDialog::getSaveFileName(this, tr("Save Rig"), QString(),
                                                tr("Rig files (*.rig.json *.json);;All files (*)"));
    if (path.isEmpty()) return;
    if (QFileInfo(path).suffix().isEmpty()) path += QStringLiteral(".rig.json");
    try {
      formats::save_rig(document()->campaign().rig, path);
    } catch (const std::exception& e) {
      QMessageBox::warning(this, tr("Cannot save the rig"), QString::fromStdString(e.what()));
    }
  });
  connect(load_rig, &QPushButton::clicked, this, [this] {
    const QString path = QFileDialog::getOpenFileName(
        this, tr("Load Rig"), QString(), tr("Rig files (*.rig.json *.json);;All files (*)"));
    if (!path.isEmpty()) load_rig_file(path);
  });
  layout->addWidget(photons_box);

  auto* motors_box = new QGroupBox(tr("Motorized waveplates"));
  auto* ml = new QVBoxLayout(motors_box);
  motors_ = new MotorsModel(
      [this](int row, int column, const Motor& edited) {
        document()->edit(
            tr("Edit motor %1").arg(QString::fromStdString(edited.name)),
            [row, edited](Campaign& c) { c.rig.motors[static_cast<std::size_t>(row)] = edited; },
            QStringLiteral("motor/%1/%2").arg(row).arg(column));
      },
      this);
  motors_view_ = new QTableView;
  motors_view_->setModel(motors_);
  motors_view_->setItemDelegate(new MotorDelegate(motors_view_));
  motors_view_->setAccessibleName(tr("Motors"));
  motors_view_->setEditTriggers(QAbstractItemView::DoubleClicked |
                                QAbstractItemView::EditKeyPressed |
                                QAbstractItemView::AnyKeyPressed);
  motors_view_->verticalHeader()->setVisible(false);
  // Units on a second header line keep the ten columns narrow enough for the editor's width.
  motors_view_->horizontalHeader()->setDefaultAlignment(Qt::AlignCenter);
  motors_view_->setMinimumHeight(fontMetrics().height() * 12);
  ml->addWidget(motors_view_);
  auto* motor_hint = new QLabel(tr("Double-click a cell to edit it."));
  motor_hint->setForegroundRole(QPalette::PlaceholderText);
  ml->addWidget(motor_hint);
  auto* plates_form = new QFormLayout;
  ml->addLayout(plates_form);
  flag(
      plates_form, "rig/compensate", tr("Compensate the plates"),
      tr("Solve the plate angles for the actual retardances, so the kernel the rig realises is "
         "the ideal one; off shows the bias of uncompensated plates"),
      [](const Campaign& c) { return c.rig.compensate_plates; },
      [](Campaign& c, bool v) { c.rig.compensate_plates = v; });
  layout->addWidget(motors_box, 1);
  on_refresh([this] {
    motors_->set_motors(document()->campaign().rig.motors);
    motors_view_->resizeColumnsToContents();
  });

  auto* ctrl_box = new QGroupBox(tr("Controller"));
  auto* cf = new_form(ctrl_box);
  choice(
      cf, "rig/moves", tr("Moves"), tr("Whether the controller drives all motors at once"),
      {move_mode_text(MoveMode::simultaneous), move_mode_text(MoveMode::sequential)},
      [](const Campaign& c) { return static_cast<int>(c.rig.controller.moves); },
      [](Campaign& c, int v) { c.rig.controller.moves = static_cast<MoveMode>(v); });
  number(
      cf, "rig/settle", tr("Settle time"), tr("Wait after any motor moved, once per step"), 0.0,
      60.0, 2, tr(" s"), [](const Campaign& c) { return c.rig.controller.settle_s; },
      [](Campaign& c, double v) { c.rig.controller.settle_s = v; });
  number(
      cf, "rig/overhead", tr("Overhead per step"), tr("Command and readout time of every step"),
      0.0, 60.0, 2, tr(" s"), [](const Campaign& c) { return c.rig.controller.overhead_s; },
      [](Campaign& c, double v) { c.rig.controller.overhead_s = v; });
  layout->addWidget(ctrl_box);

  auto* src_box = new QGroupBox(tr("Source and detectors"));
  auto* sf = new_form(src_box);
  number(
      sf, "rig/pair_rate", tr("Pair rate"), tr("Photon pairs emitted per second"), 1.0, 1e9, 0,
      tr(" /s"), [](const Campaign& c) { return c.rig.source.pair_rate_per_s; },
      [](Campaign& c, double v) { c.rig.source.pair_rate_per_s = v; });
  number(
      sf, "rig/visibility", tr("Visibility"), tr("V in p = V·κ + (1 − V)/2^P"), 0.0, 1.0, 4,
      QString(), [](const Campaign& c) { return c.rig.source.visibility; },
      [](Campaign& c, double v) { c.rig.source.visibility = v; });
  number(
      sf, "rig/window", tr("Coincidence window"), tr("Full coincidence window τ"), 0.001, 1000.0, 3,
      tr(" ns"), [](const Campaign& c) { return c.rig.coincidence_window_s * 1e9; },
      [](Campaign& c, double v) { c.rig.coincidence_window_s = v * 1e-9; });
  choice(
      sf, "rig/scheme", tr("Detection"), tr("Which PBS outputs carry detectors"),
      {scheme_text(DetectionScheme::pass_only), scheme_text(DetectionScheme::both_ports)},
      [](const Campaign& c) { return static_cast<int>(c.rig.scheme); },
      [](Campaign& c, int v) { c.rig.scheme = static_cast<DetectionScheme>(v); });
  detectors_ = new QTableWidget;
  detectors_->setColumnCount(3);
  detectors_->setHorizontalHeaderLabels(
      {tr("Efficiency (0–1)"), tr("Dark counts (/s)"), tr("PBS leakage (0–0.5)")});
  detectors_->horizontalHeaderItem(2)->setToolTip(
      tr("Fraction of the orthogonal polarization that leaves by the pass port"));
  detectors_->setAccessibleName(tr("Detectors, one per photon"));
  detectors_->horizontalHeader()->setStretchLastSection(true);
  detectors_->setMaximumHeight(fontMetrics().height() * 7);
  sf->addRow(tr("Detectors"), detectors_);
  connect(detectors_, &QTableWidget::itemChanged, this, [this](QTableWidgetItem* item) {
    bool ok = false;
    const double v = QLocale().toDouble(item->text(), &ok);
    const int row = item->row();
    const int col = item->column();
    if (!ok || v < 0 || (col == 0 && v > 1) || (col == 2 && v >= 0.5)) {
      refresh_detectors();
      return;
    }
    document()->edit(tr("Edit detector %1").arg(row), [row, col, v](Campaign& c) {
      Detector& d = c.rig.detectors[static_cast<std::size_t>(row)];
      (col == 0 ? d.efficiency : col == 1 ? d.dark_rate_per_s : d.pbs_leakage) = v;
    });
  });
  on_refresh([this] { refresh_detectors(); });
  layout->addWidget(src_box);
}

bool RigPage::load_rig_file(const QString& path) {
  try {
    const Rig rig = formats::load_rig(path);
    const int photons = formats::rig_photons(rig);
    document()->edit(tr("Load rig %1").arg(QFileInfo(path).fileName()),
                     [rig, photons](Campaign& c) {
                       c.rig = rig;
                       c.encoding = encoding_for_photons(c.encoding, c.data, photons);
                     });
    return true;
  } catch (const std::exception& e) {
    QMessageBox::warning(this, tr("Cannot load the rig"), QString::fromStdString(e.what()));
    return false;
  }
}

void RigPage::refresh_detectors() {
  const QSignalBlocker block(detectors_);
  const auto& dets = document()->campaign().rig.detectors;
  detectors_->setRowCount(static_cast<int>(dets.size()));
  QStringList rows;
  for (std::size_t i = 0; i < dets.size(); ++i) {
    const int r = static_cast<int>(i);
    rows << tr("Photon %1 (%2)").arg(r).arg(QChar(photon_letter(r)));
    detectors_->setItem(r, 0, new QTableWidgetItem(number_text(dets[i].efficiency, 3)));
    detectors_->setItem(r, 1, new QTableWidgetItem(number_text(dets[i].dark_rate_per_s, 0)));
    detectors_->setItem(r, 2, new QTableWidgetItem(number_text(dets[i].pbs_leakage, 4)));
  }
  detectors_->setVerticalHeaderLabels(rows);
}

}  // namespace gramline::gui
