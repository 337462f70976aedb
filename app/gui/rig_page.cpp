#include <QComboBox>
#include <QDoubleSpinBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QHeaderView>
#include <QLabel>
#include <QLocale>
#include <QTableView>
#include <QTableWidget>
#include <QVBoxLayout>

#include "campaign_document.h"
#include "editor_pages.h"
#include "gui_text.h"
#include "rig_tables.h"

namespace gramline::gui {

RigPage::RigPage(CampaignDocument* campaign_document, QWidget* parent)
    : EditorPage(campaign_document, parent) {
  auto* layout = new QVBoxLayout(this);

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
  detectors_->setColumnCount(2);
  detectors_->setHorizontalHeaderLabels({tr("Efficiency (0–1)"), tr("Dark counts (/s)")});
  detectors_->setAccessibleName(tr("Detectors, one per photon"));
  detectors_->horizontalHeader()->setStretchLastSection(true);
  detectors_->setMaximumHeight(fontMetrics().height() * 7);
  sf->addRow(tr("Detectors"), detectors_);
  connect(detectors_, &QTableWidget::itemChanged, this, [this](QTableWidgetItem* item) {
    bool ok = false;
    const double v = QLocale().toDouble(item->text(), &ok);
    const int row = item->row();
    const int col = item->column();
    if (!ok || v < 0 || (col == 0 && v > 1)) {
      refresh_detectors();
      return;
    }
    document()->edit(tr("Edit detector %1").arg(row + 1), [row, col, v](Campaign& c) {
      Detector& d = c.rig.detectors[static_cast<std::size_t>(row)];
      (col == 0 ? d.efficiency : d.dark_rate_per_s) = v;
    });
  });
  on_refresh([this] { refresh_detectors(); });
  layout->addWidget(src_box);
}

void RigPage::refresh_detectors() {
  const QSignalBlocker block(detectors_);
  const auto& dets = document()->campaign().rig.detectors;
  detectors_->setRowCount(static_cast<int>(dets.size()));
  QStringList rows;
  for (std::size_t i = 0; i < dets.size(); ++i) {
    const int r = static_cast<int>(i);
    rows << tr("Photon %1").arg(r + 1);
    detectors_->setItem(r, 0, new QTableWidgetItem(number_text(dets[i].efficiency, 3)));
    detectors_->setItem(r, 1, new QTableWidgetItem(number_text(dets[i].dark_rate_per_s, 0)));
  }
  detectors_->setVerticalHeaderLabels(rows);
}

}  // namespace gramline::gui
