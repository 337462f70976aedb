#include "editor_panel.h"

#include <QCheckBox>
#include <QComboBox>
#include <QDateEdit>
#include <QDoubleSpinBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLineEdit>
#include <QMessageBox>
#include <QPushButton>
#include <QScrollArea>
#include <QSpinBox>
#include <QTabWidget>
#include <QTableView>
#include <QTableWidget>
#include <QTimeEdit>
#include <QVBoxLayout>
#include <cmath>
#include <utility>

#include "campaign_document.h"
#include "gui_text.h"
#include "rig_tables.h"

namespace gramline::gui {

namespace {

QWidget* scrolled(QWidget* inner) {
  auto* scroll = new QScrollArea;
  scroll->setWidget(inner);
  scroll->setWidgetResizable(true);
  scroll->setFrameShape(QFrame::NoFrame);
  return scroll;
}

QFormLayout* new_form(QWidget* parent) {
  auto* form = new QFormLayout(parent);
  form->setFieldGrowthPolicy(QFormLayout::AllNonFixedFieldsGrow);
  form->setRowWrapPolicy(QFormLayout::DontWrapRows);
  return form;
}

}  // namespace

EditorPanel::EditorPanel(CampaignDocument* document, QWidget* parent)
    : QWidget(parent), document_(document) {
  pages_ = new QTabWidget;
  pages_->setDocumentMode(true);
  pages_->setAccessibleName(tr("Campaign editor pages"));
  pages_->addTab(build_data_page(), tr("&Data"));
  pages_->addTab(build_encoding_page(), tr("&Encoding"));
  pages_->addTab(build_rig_page(), tr("&Rig"));
  pages_->addTab(build_measurement_page(), tr("&Precision"));
  pages_->addTab(build_nights_page(), tr("&Nights"));
  auto* layout = new QVBoxLayout(this);
  layout->setContentsMargins(0, 0, 0, 0);
  layout->addWidget(pages_);
  connect(document_, &CampaignDocument::changed, this, &EditorPanel::refresh);
  refresh();
}

template <typename Box, typename Value>
Box* EditorPanel::bind_spin(Box* box, QFormLayout* form, const QString& key, const QString& label,
                            const QString& help, std::function<Value(const Campaign&)> get,
                            std::function<void(Campaign&, Value)> set) {
  box->setKeyboardTracking(false);  // one edit per finished value, not per keystroke
  box->setAccessibleName(label);
  box->setToolTip(help);
  box->setObjectName(key);
  form->addRow(label, box);
  connect(box, &Box::valueChanged, this, [this, key, label, set](Value v) {
    document_->edit(
        tr("Change %1").arg(label), [set, v](Campaign& c) { set(c, v); }, key);
  });
  refreshers_.push_back([this, box, get] {
    const QSignalBlocker block(box);
    box->setValue(get(document_->campaign()));
  });
  return box;
}

QDoubleSpinBox* EditorPanel::number(QFormLayout* form, const QString& key, const QString& label,
                                    const QString& help, double min, double max, int decimals,
                                    const QString& suffix,
                                    std::function<double(const Campaign&)> get,
                                    std::function<void(Campaign&, double)> set) {
  auto* box = new QDoubleSpinBox;
  box->setRange(min, max);
  box->setDecimals(decimals);
  box->setSuffix(suffix);
  return bind_spin(box, form, key, label, help, std::move(get), std::move(set));
}

QSpinBox* EditorPanel::integer(QFormLayout* form, const QString& key, const QString& label,
                               const QString& help, int min, int max,
                               std::function<int(const Campaign&)> get,
                               std::function<void(Campaign&, int)> set) {
  auto* box = new QSpinBox;
  box->setRange(min, max);
  return bind_spin(box, form, key, label, help, std::move(get), std::move(set));
}

QCheckBox* EditorPanel::flag(QFormLayout* form, const QString& key, const QString& label,
                             const QString& help, std::function<bool(const Campaign&)> get,
                             std::function<void(Campaign&, bool)> set) {
  auto* box = new QCheckBox(label);
  box->setAccessibleName(label);
  box->setToolTip(help);
  box->setObjectName(key);
  form->addRow(QString(), box);
  connect(box, &QCheckBox::toggled, this, [this, label, set](bool v) {
    document_->edit(v ? tr("Turn on %1").arg(label) : tr("Turn off %1").arg(label),
                    [set, v](Campaign& c) { set(c, v); });
  });
  refreshers_.push_back([this, box, get] {
    const QSignalBlocker block(box);
    box->setChecked(get(document_->campaign()));
  });
  return box;
}

QComboBox* EditorPanel::choice(QFormLayout* form, const QString& key, const QString& label,
                               const QString& help, const QStringList& items,
                               std::function<int(const Campaign&)> get,
                               std::function<void(Campaign&, int)> set) {
  auto* box = new QComboBox;
  box->addItems(items);
  box->setAccessibleName(label);
  box->setToolTip(help);
  box->setObjectName(key);
  form->addRow(label, box);
  connect(box, &QComboBox::activated, this, [this, box, label, set, get](int v) {
    if (v == get(document_->campaign())) return;
    document_->edit(tr("Change %1").arg(label), [set, v](Campaign& c) { set(c, v); });
    Q_UNUSED(box);
  });
  refreshers_.push_back([this, box, get] {
    const QSignalBlocker block(box);
    box->setCurrentIndex(get(document_->campaign()));
  });
  return box;
}

QWidget* EditorPanel::build_data_page() {
  auto* page = new QWidget;
  auto* layout = new QVBoxLayout(page);
  auto* form = new_form(nullptr);
  name_ = new QLineEdit;
  name_->setAccessibleName(tr("Campaign name"));
  form->addRow(tr("Campaign name"), name_);
  connect(name_, &QLineEdit::editingFinished, this, [this] {
    const std::string text = name_->text().trimmed().toStdString();
    if (text == document_->campaign().name) return;
    document_->edit(tr("Rename campaign"), [text](Campaign& c) { c.name = text; });
  });
  refreshers_.push_back([this] {
    const QSignalBlocker block(name_);
    name_->setText(QString::fromStdString(document_->campaign().name));
  });
  layout->addLayout(form);

  auto* buttons = new QHBoxLayout;
  auto* import = new QPushButton(tr("Import CSV…"));
  import->setAccessibleName(tr("Import data from a CSV file"));
  import->setToolTip(
      tr("Replace the points with a CSV file: numeric feature columns, a "
         "“label” column with two classes, an optional “set” column "
         "(train or test)"));
  auto* demo = new QPushButton(tr("Use demo data"));
  demo->setAccessibleName(tr("Load the demo campaign"));
  demo->setToolTip(tr("Replace the whole campaign with the bundled demo"));
  buttons->addWidget(import);
  buttons->addWidget(demo);
  buttons->addStretch(1);
  layout->addLayout(buttons);
  connect(import, &QPushButton::clicked, this, &EditorPanel::import_requested);
  connect(demo, &QPushButton::clicked, this, &EditorPanel::demo_requested);

  data_info_ = new QLabel;
  data_info_->setWordWrap(true);
  layout->addWidget(data_info_);

  data_model_ = new DataModel(this);
  auto* table = new QTableView;
  table->setModel(data_model_);
  table->setAccessibleName(tr("Points of the data set"));
  table->verticalHeader()->setVisible(false);
  table->verticalHeader()->setSectionResizeMode(QHeaderView::Fixed);
  table->verticalHeader()->setDefaultSectionSize(fontMetrics().height() + 6);
  table->setAlternatingRowColors(true);
  table->horizontalHeader()->setStretchLastSection(true);
  table->horizontalHeader()->setDefaultSectionSize(fontMetrics().horizontalAdvance("0000.0000") +
                                                   12);
  layout->addWidget(table, 1);
  refreshers_.push_back([this] {
    const DataSet& d = document_->campaign().data;
    data_model_->set_data(d);
    int positive = 0;
    for (int i = 0; i < d.train_count(); ++i) positive += d.train_labels(i) > 0 ? 1 : 0;
    data_info_->setText(tr("%1 training points (%2 “%3”, %4 “%5”), %6 test points, %7 features.")
                            .arg(d.train_count())
                            .arg(positive)
                            .arg(QString::fromStdString(d.positive_name))
                            .arg(d.train_count() - positive)
                            .arg(QString::fromStdString(d.negative_name))
                            .arg(d.test_count())
                            .arg(d.feature_count()));
  });
  return page;
}

QWidget* EditorPanel::build_encoding_page() {
  auto* page = new QWidget;
  auto* layout = new QVBoxLayout(page);
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
  connect(apply, &QPushButton::clicked, this, &EditorPanel::apply_preset);
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
  weights_ = new QTableWidget;
  weights_->setEditTriggers(QAbstractItemView::NoEditTriggers);
  weights_->verticalHeader()->setVisible(false);
  weights_->setAccessibleName(tr("Encoding weights"));
  weights_->horizontalHeader()->setStretchLastSection(true);
  wl->addWidget(weights_);
  layout->addWidget(weights_box, 1);
  refreshers_.push_back([this] { refresh_encoding_table(); });
  return scrolled(page);
}

void EditorPanel::refresh_encoding_table() {
  const EncodingMap& e = document_->campaign().encoding;
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
    for (Eigen::Index i = 0; i < v.size(); ++i) parts << number_text(v(i), 2);
    return parts.join(QStringLiteral(", "));
  };
  for (int p = 0; p < e.photon_count(); ++p) {
    const PhotonEncoding& pe = e.photons[static_cast<std::size_t>(p)];
    weights_->setItem(p, 0, new QTableWidgetItem(QString::number(p + 1)));
    weights_->setItem(p, 1, new QTableWidgetItem(vec(pe.theta_weights_deg)));
    weights_->setItem(p, 2, new QTableWidgetItem(number_text(pe.theta_offset_deg, 2)));
    weights_->setItem(p, 3, new QTableWidgetItem(vec(pe.phi_weights_deg)));
    weights_->setItem(p, 4, new QTableWidgetItem(number_text(pe.phi_offset_deg, 2)));
  }
  weights_->resizeColumnsToContents();
}

void EditorPanel::apply_preset() {
  const Campaign& c = document_->campaign();
  if (c.data.train_count() == 0) {
    QMessageBox::information(this, tr("No data"), tr("Import or load data before encoding it."));
    return;
  }
  const auto preset = static_cast<EncodingPreset>(preset_->currentData().toInt());
  try {
    Eigen::VectorXd low, high;
    feature_ranges(c.data.train, low, high);
    const EncodingMap map =
        make_preset(preset, low, high, {theta_low_->value(), theta_high_->value()},
                    {phi_low_->value(), phi_high_->value()});
    document_->edit(tr("Apply encoding preset"), [map](Campaign& k) { k.encoding = map; });
  } catch (const std::exception& e) {
    QMessageBox::warning(this, tr("Preset does not fit"), QString::fromStdString(e.what()));
  }
}

void EditorPanel::scale_encoding(double factor) {
  document_->edit(tr("Scale encoding by %1").arg(factor),
                  [factor](Campaign& c) { c.encoding = c.encoding.scaled(factor); });
}

void EditorPanel::set_scale_scan(const std::vector<ScalePoint>& scan, double advised) {
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

void EditorPanel::clear_scale_scan() {
  scale_advice_->setText(
      tr("The scale advice appears when the margin check of the current "
         "plan is done."));
  use_advice_->setEnabled(false);
}

QWidget* EditorPanel::build_rig_page() {
  auto* page = new QWidget;
  auto* layout = new QVBoxLayout(page);

  auto* motors_box = new QGroupBox(tr("Motorized waveplates"));
  auto* ml = new QVBoxLayout(motors_box);
  motors_ = new MotorsModel(
      [this](int row, int column, const Motor& edited) {
        document_->edit(
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
  motors_view_->setMinimumHeight(fontMetrics().height() * 12);
  ml->addWidget(motors_view_);
  auto* motor_hint = new QLabel(tr("Double-click a cell to edit it."));
  motor_hint->setForegroundRole(QPalette::PlaceholderText);
  ml->addWidget(motor_hint);
  layout->addWidget(motors_box, 1);
  refreshers_.push_back([this] {
    motors_->set_motors(document_->campaign().rig.motors);
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
    document_->edit(tr("Edit detector %1").arg(row + 1), [row, col, v](Campaign& c) {
      Detector& d = c.rig.detectors[static_cast<std::size_t>(row)];
      (col == 0 ? d.efficiency : d.dark_rate_per_s) = v;
    });
  });
  refreshers_.push_back([this] { refresh_detectors(); });
  layout->addWidget(src_box);
  return scrolled(page);
}

void EditorPanel::refresh_detectors() {
  const QSignalBlocker block(detectors_);
  const auto& dets = document_->campaign().rig.detectors;
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

QWidget* EditorPanel::build_measurement_page() {
  auto* page = new QWidget;
  auto* layout = new QVBoxLayout(page);

  auto* target_box = new QGroupBox(tr("Precision of each kernel entry"));
  auto* tf = new_form(target_box);
  number(
      tf, "precision/epsilon", tr("Half-width ε"),
      tr("Each kernel entry is known to within ± ε at the confidence below"), 0.0001, 0.5, 4,
      QString(), [](const Campaign& c) { return c.precision.budget.epsilon; },
      [](Campaign& c, double v) { c.precision.budget.epsilon = v; });
  number(
      tf, "precision/confidence", tr("Confidence"), tr("1 − δ"), 50.0, 99.999, 3, tr(" %"),
      [](const Campaign& c) { return c.precision.budget.confidence * 100.0; },
      [](Campaign& c, double v) { c.precision.budget.confidence = v / 100.0; });
  choice(
      tf, "precision/method", tr("Interval"), tr("How pairs per entry follow from ε and δ"),
      {method_text(BudgetMethod::normal), method_text(BudgetMethod::wilson),
       method_text(BudgetMethod::hoeffding)},
      [](const Campaign& c) { return static_cast<int>(c.precision.budget.method); },
      [](Campaign& c, int v) { c.precision.budget.method = static_cast<BudgetMethod>(v); });
  flag(
      tf, "precision/worst", tr("Assume the worst case p = 1/2"),
      tr("Ignore the predicted pass probability"),
      [](const Campaign& c) { return c.precision.budget.worst_case; },
      [](Campaign& c, bool v) { c.precision.budget.worst_case = v; });
  auto* fixed = number(
      tf, "precision/fixed", tr("Fixed pairs per entry"),
      tr("When set, every entry gets this many pairs instead of the target above"), 0.0, 1e12, 0,
      QString(), [](const Campaign& c) { return c.precision.fixed_pairs; },
      [](Campaign& c, double v) { c.precision.fixed_pairs = v; });
  fixed->setSpecialValueText(tr("off: use the target"));
  choice(
      tf, "precision/allocation", tr("Share pairs"), tr("How pairs are shared among entries"),
      {allocation_text(Allocation::uniform), allocation_text(Allocation::neyman),
       allocation_text(Allocation::margin_aware)},
      [](const Campaign& c) { return static_cast<int>(c.precision.allocation); },
      [](Campaign& c, int v) { c.precision.allocation = static_cast<Allocation>(v); });
  layout->addWidget(target_box);

  auto* sched_box = new QGroupBox(tr("Schedule"));
  auto* sf = new_form(sched_box);
  auto* ref = number(
      sf, "schedule/ref_interval", tr("Reference every"),
      tr("A reference step at least this often; 0 for none"), 0.0, 1440.0, 1, tr(" min"),
      [](const Campaign& c) { return c.schedule.reference_interval_min; },
      [](Campaign& c, double v) { c.schedule.reference_interval_min = v; });
  ref->setSpecialValueText(tr("never"));
  auto* ref_pairs = number(
      sf, "schedule/ref_pairs", tr("Pairs per reference"), tr("0: as many as a measure step"), 0.0,
      1e12, 0, QString(), [](const Campaign& c) { return c.schedule.reference_pairs; },
      [](Campaign& c, double v) { c.schedule.reference_pairs = v; });
  ref_pairs->setSpecialValueText(tr("as a measure step"));
  flag(
      sf, "schedule/dark", tr("Dark steps at night start and end"),
      tr("Shutter closed, to measure the background"),
      [](const Campaign& c) { return c.schedule.dark_steps; },
      [](Campaign& c, bool v) { c.schedule.dark_steps = v; });
  number(
      sf, "schedule/dark_dwell", tr("Dark step length"), QString(), 0.0, 3600.0, 1, tr(" s"),
      [](const Campaign& c) { return c.schedule.dark_dwell_s; },
      [](Campaign& c, double v) { c.schedule.dark_dwell_s = v; });
  flag(
      sf, "schedule/park", tr("Park the motors at the end of each night"),
      tr("Return every motor to its initial position"),
      [](const Campaign& c) { return c.schedule.park; },
      [](Campaign& c, bool v) { c.schedule.park = v; });
  flag(
      sf, "schedule/fit", tr("Scale pairs to fit the allowed nights"),
      tr("Lower the pairs per entry so the campaign ends within the night limit"),
      [](const Campaign& c) { return c.schedule.fit_to_nights; },
      [](Campaign& c, bool v) { c.schedule.fit_to_nights = v; });
  flag(
      sf, "schedule/truncation", tr("Finish small sub-matrices early"),
      tr("Order steps so the Gram matrix of the first points is complete early, in case the "
         "run is cut short"),
      [](const Campaign& c) { return c.schedule.truncation_safe; },
      [](Campaign& c, bool v) { c.schedule.truncation_safe = v; });
  auto* cap = number(
      sf, "schedule/cap", tr("Optimizer time limit"), tr("0: no limit"), 0.0, 3600.0, 1, tr(" s"),
      [](const Campaign& c) { return c.schedule.optimizer_time_cap_s; },
      [](Campaign& c, double v) { c.schedule.optimizer_time_cap_s = v; });
  cap->setSpecialValueText(tr("no limit"));
  integer(
      sf, "seed", tr("Random seed"), tr("Same seed, same plan"), 0, 2147483647,
      [](const Campaign& c) { return static_cast<int>(c.seed); },
      [](Campaign& c, int v) { c.seed = static_cast<std::uint64_t>(v); });
  layout->addWidget(sched_box);
  layout->addStretch(1);
  return scrolled(page);
}

QWidget* EditorPanel::build_nights_page() {
  auto* page = new QWidget;
  auto* layout = new QVBoxLayout(page);
  auto* box = new QGroupBox(tr("When the lab is yours"));
  auto* form = new_form(box);

  auto* date = new QDateEdit;
  date->setCalendarPopup(true);
  date->setDisplayFormat(QStringLiteral("yyyy-MM-dd"));
  date->setAccessibleName(tr("First night"));
  form->addRow(tr("First night"), date);
  connect(date, &QDateEdit::dateChanged, this, [this](const QDate& d) {
    const std::string text = d.toString(Qt::ISODate).toStdString();
    document_->edit(
        tr("Change first night"), [text](Campaign& c) { c.nights.first_date = text; },
        QStringLiteral("nights/date"));
  });
  const auto time_edit = [this, form](const QString& label, const QString& key, bool start) {
    auto* t = new QTimeEdit;
    t->setDisplayFormat(QStringLiteral("HH:mm"));
    t->setAccessibleName(label);
    t->setKeyboardTracking(false);
    form->addRow(label, t);
    connect(t, &QTimeEdit::timeChanged, this, [this, label, key, start](const QTime& v) {
      const int minutes = v.hour() * 60 + v.minute();
      document_->edit(
          tr("Change %1").arg(label),
          [start, minutes](Campaign& c) {
            (start ? c.nights.start_min : c.nights.end_min) = minutes;
          },
          key);
    });
    return t;
  };
  auto* start = time_edit(tr("Window opens"), QStringLiteral("nights/start"), true);
  auto* end = time_edit(tr("Window closes"), QStringLiteral("nights/end"), false);
  integer(
      form, "nights/max", tr("Nights allowed"), tr("Most nights the campaign may take"), 1, 365,
      [](const Campaign& c) { return c.nights.max_nights; },
      [](Campaign& c, int v) { c.nights.max_nights = v; });
  window_info_ = new QLabel;
  window_info_->setWordWrap(true);
  form->addRow(window_info_);
  refreshers_.push_back([this, date, start, end] {
    const NightWindow& n = document_->campaign().nights;
    const QSignalBlocker b1(date), b2(start), b3(end);
    date->setDate(QDate::fromString(QString::fromStdString(n.first_date), Qt::ISODate));
    start->setTime(QTime(n.start_min / 60, n.start_min % 60));
    end->setTime(QTime(n.end_min / 60, n.end_min % 60));
    window_info_->setText(tr("Each night's window lasts %1; a window whose close is not after "
                             "its opening ends the next morning.")
                              .arg(duration_text(n.length_s())));
  });
  layout->addWidget(box);
  layout->addStretch(1);
  return scrolled(page);
}

void EditorPanel::refresh() {
  for (const auto& r : refreshers_) r();
}

}  // namespace gramline::gui
