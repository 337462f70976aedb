#include "rig_tables.h"

#include <QComboBox>
#include <QDoubleSpinBox>
#include <QLineEdit>
#include <QRegularExpression>
#include <QSpinBox>

#include "gui_text.h"

namespace gramline::gui {

void DataModel::set_data(const DataSet& data) {
  beginResetModel();
  data_ = data;
  endResetModel();
}

int DataModel::rowCount(const QModelIndex& parent) const {
  return parent.isValid() ? 0 : data_.train_count() + data_.test_count();
}

int DataModel::columnCount(const QModelIndex& parent) const {
  return parent.isValid() ? 0 : 3 + data_.feature_count();
}

QVariant DataModel::data(const QModelIndex& index, int role) const {
  if (!index.isValid()) return {};
  const int row = index.row();
  const bool train = row < data_.train_count();
  const int local = train ? row : row - data_.train_count();
  if (role == Qt::TextAlignmentRole)
    return int((index.column() >= 3 || index.column() == 0 ? Qt::AlignRight : Qt::AlignLeft) |
               Qt::AlignVCenter);
  if (role != Qt::DisplayRole) return {};
  switch (index.column()) {
    case 0:
      return row;
    case 1:
      return train ? tr("train") : tr("test");
    case 2: {
      const int label = train ? data_.train_labels(local) : data_.test_labels(local);
      return QString::fromStdString(label > 0 ? data_.positive_name : data_.negative_name);
    }
    default: {
      const int f = index.column() - 3;
      return number_text(train ? data_.train(local, f) : data_.test(local, f), 4);
    }
  }
}

QVariant DataModel::headerData(int section, Qt::Orientation orientation, int role) const {
  if (orientation != Qt::Horizontal || role != Qt::DisplayRole) return {};
  if (section == 0) return tr("Point");
  if (section == 1) return tr("Set");
  if (section == 2) return tr("Class");
  const auto f = static_cast<std::size_t>(section - 3);
  if (f < data_.feature_names.size()) return QString::fromStdString(data_.feature_names[f]);
  return tr("feature %1").arg(section - 3);
}

MotorsModel::MotorsModel(EditFn on_edit, QObject* parent)
    : QAbstractTableModel(parent), on_edit_(std::move(on_edit)) {}

void MotorsModel::set_motors(const std::vector<Motor>& motors) {
  if (motors.size() == motors_.size()) {
    // Same shape: refresh in place so an open editor or the selection is not lost.
    motors_ = motors;
    if (!motors_.empty()) emit dataChanged(index(0, 0), index(rowCount() - 1, kColumnCount - 1));
    return;
  }
  beginResetModel();
  motors_ = motors;
  endResetModel();
}

int MotorsModel::rowCount(const QModelIndex& parent) const {
  return parent.isValid() ? 0 : static_cast<int>(motors_.size());
}

int MotorsModel::columnCount(const QModelIndex& parent) const {
  return parent.isValid() ? 0 : kColumnCount;
}

QString MotorsModel::range_text(const std::optional<TravelRange>& range) {
  if (!range) return tr("continuous");
  return tr("%1 … %2").arg(number_text(range->low_deg, 1), number_text(range->high_deg, 1));
}

bool MotorsModel::parse_range(const QString& text, std::optional<TravelRange>& out) {
  const QString t = text.trimmed();
  if (t.isEmpty() || t.compare(tr("continuous"), Qt::CaseInsensitive) == 0 ||
      t.compare(QStringLiteral("continuous"), Qt::CaseInsensitive) == 0) {
    out.reset();
    return true;
  }
  static const QRegularExpression re(QStringLiteral(
      R"(^\s*([-+]?[0-9]*[.,]?[0-9]+)\s*(?:\.\.|…|to|,|;)\s*([-+]?[0-9]*[.,]?[0-9]+)\s*$)"));
  const auto m = re.match(t);
  if (!m.hasMatch()) return false;
  bool ok1 = false, ok2 = false;
  const double lo = QLocale().toDouble(m.captured(1), &ok1);
  const double hi = QLocale().toDouble(m.captured(2), &ok2);
  double lo_c = lo, hi_c = hi;
  if (!ok1) lo_c = m.captured(1).toDouble(&ok1);
  if (!ok2) hi_c = m.captured(2).toDouble(&ok2);
  if (!ok1 || !ok2 || !(hi_c > lo_c)) return false;
  out = TravelRange{lo_c, hi_c};
  return true;
}

QVariant MotorsModel::data(const QModelIndex& index, int role) const {
  if (!index.isValid()) return {};
  const Motor& m = motors_[static_cast<std::size_t>(index.row())];
  const int col = index.column();
  if (role == Qt::TextAlignmentRole) {
    const bool numeric = col == kPhoton || col == kSpeed || col == kAccel || col == kOvershoot ||
                         col == kInitial || col >= kRetardanceError;
    return int((numeric ? Qt::AlignRight : Qt::AlignLeft) | Qt::AlignVCenter);
  }
  if (role == Qt::EditRole) {
    switch (col) {
      case kName:
        return QString::fromStdString(m.name);
      case kPhoton:
        return m.photon;  // 0-based, as in the files and messages (docs/conventions.md)
      case kStage:
        return static_cast<int>(m.stage);
      case kPlate:
        return static_cast<int>(m.plate);
      case kSpeed:
        return m.speed_deg_per_s;
      case kAccel:
        return m.accel_deg_per_s2;
      case kRange:
        return m.range ? range_text(m.range) : QString();
      case kBacklash:
        return static_cast<int>(m.backlash);
      case kOvershoot:
        return m.overshoot_deg;
      case kInitial:
        return m.initial_deg;
      case kRetardanceError:
        return m.retardance_error_deg;
      case kAxisOffsetSd:
        return m.axis_offset_sd_deg;
      case kRepeatabilitySd:
        return m.repeatability_sd_deg;
      default:
        return {};
    }
  }
  if (role != Qt::DisplayRole) return {};
  switch (col) {
    case kName:
      return QString::fromStdString(m.name);
    case kPhoton:
      return m.photon;
    case kStage:  // short words keep the table within the editor's width
      return m.stage == Stage::prep ? tr("prep.") : tr("analysis");
    case kPlate:
      return plate_text(m.plate);
    case kSpeed:
      return number_text(m.speed_deg_per_s, 2);
    case kAccel:
      return number_text(m.accel_deg_per_s2, 2);
    case kRange:
      return range_text(m.range);
    case kBacklash:
      return m.backlash == Backlash::shortest ? tr("shortest") : tr("from below");
    case kOvershoot:
      return m.backlash == Backlash::from_below ? number_text(m.overshoot_deg, 2)
                                                : QStringLiteral("–");
    case kInitial:
      return number_text(m.initial_deg, 2);
    case kRetardanceError:
      return number_text(m.retardance_error_deg, 2);
    case kAxisOffsetSd:
      return number_text(m.axis_offset_sd_deg, 3);
    case kRepeatabilitySd:
      return number_text(m.repeatability_sd_deg, 3);
    default:
      return {};
  }
}

bool MotorsModel::setData(const QModelIndex& index, const QVariant& value, int role) {
  if (!index.isValid() || role != Qt::EditRole) return false;
  Motor m = motors_[static_cast<std::size_t>(index.row())];
  switch (index.column()) {
    case kName:
      if (value.toString().trimmed().isEmpty()) return false;
      m.name = value.toString().trimmed().toStdString();
      break;
    case kPhoton:
      m.photon = value.toInt();
      break;
    case kStage:
      m.stage = static_cast<Stage>(value.toInt());
      break;
    case kPlate:
      m.plate = static_cast<Plate>(value.toInt());
      break;
    case kSpeed:
      m.speed_deg_per_s = value.toDouble();
      break;
    case kAccel:
      m.accel_deg_per_s2 = value.toDouble();
      break;
    case kRange:
      if (!parse_range(value.toString(), m.range)) return false;
      break;
    case kBacklash:
      m.backlash = static_cast<Backlash>(value.toInt());
      break;
    case kOvershoot:
      m.overshoot_deg = value.toDouble();
      break;
    case kInitial:
      m.initial_deg = value.toDouble();
      break;
    case kRetardanceError:
      m.retardance_error_deg = value.toDouble();
      break;
    case kAxisOffsetSd:
      m.axis_offset_sd_deg = value.toDouble();
      break;
    case kRepeatabilitySd:
      m.repeatability_sd_deg = value.toDouble();
      break;
    default:
      return false;
  }
  on_edit_(index.row(), index.column(), m);
  return true;
}

QVariant MotorsModel::headerData(int section, Qt::Orientation orientation, int role) const {
  if (orientation == Qt::Vertical)
    return role == Qt::DisplayRole ? QVariant(section + 1) : QVariant();
  if (role == Qt::ToolTipRole) {
    switch (section) {
      case kSpeed:
        return tr("Largest angular speed of the mount");
      case kAccel:
        return tr("Angular acceleration, used to ramp up and down");
      case kRange:
        return tr(
            "Travel limits in degrees, or continuous rotation. Type e.g. “-10 .. 370”, "
            "or leave empty for continuous.");
      case kBacklash:
        return tr(
            "How a target is approached: the shortest way, or always from below after "
            "going past by the overshoot");
      case kInitial:
        return tr("Physical position at the start of the campaign");
      case kRetardanceError:
        return tr(
            "Actual minus nominal retardance of the plate (nominal 180° for an HWP, 90° for a "
            "QWP)");
      case kAxisOffsetSd:
        return tr("Uncertainty (standard deviation) of the calibrated fast-axis zero");
      case kRepeatabilitySd:
        return tr("Scatter (standard deviation) of the reached position from move to move");
      default:
        return {};
    }
  }
  if (role != Qt::DisplayRole) return {};
  switch (section) {
    case kName:
      return tr("Motor");
    case kPhoton:
      return tr("Photon");
    case kStage:
      return tr("Stage");
    case kPlate:
      return tr("Plate");
    case kSpeed:
      return tr("Speed\n°/s");
    case kAccel:
      return tr("Accel.\n°/s²");
    case kRange:
      return tr("Range\n°");
    case kBacklash:
      return tr("Approach");
    case kOvershoot:
      return tr("Over-\nshoot °");
    case kInitial:
      return tr("Initial\n°");
    case kRetardanceError:
      return tr("Ret. err.\n°");
    case kAxisOffsetSd:
      return tr("Zero sd\n°");
    case kRepeatabilitySd:
      return tr("Repeat sd\n°");
    default:
      return {};
  }
}

Qt::ItemFlags MotorsModel::flags(const QModelIndex& index) const {
  return QAbstractTableModel::flags(index) | Qt::ItemIsEditable;
}

QWidget* MotorDelegate::createEditor(QWidget* parent, const QStyleOptionViewItem&,
                                     const QModelIndex& index) const {
  const auto combo = [parent](const QStringList& items) {
    auto* box = new QComboBox(parent);
    box->addItems(items);
    return box;
  };
  const auto number = [parent](double lo, double hi, int decimals, const QString& suffix) {
    auto* box = new QDoubleSpinBox(parent);
    box->setRange(lo, hi);
    box->setDecimals(decimals);
    box->setSuffix(suffix);
    box->setFrame(false);
    return box;
  };
  switch (index.column()) {
    case MotorsModel::kStage:
      return combo({stage_text(Stage::prep), stage_text(Stage::analysis)});
    case MotorsModel::kPlate:
      return combo({plate_text(Plate::HWP), plate_text(Plate::QWP)});
    case MotorsModel::kBacklash:
      return combo({backlash_text(Backlash::shortest), backlash_text(Backlash::from_below)});
    case MotorsModel::kPhoton: {
      auto* box = new QSpinBox(parent);
      box->setRange(0, 3);
      box->setFrame(false);
      return box;
    }
    case MotorsModel::kSpeed:
      return number(0.01, 1e4, 2, tr(" °/s"));
    case MotorsModel::kAccel:
      return number(0.01, 1e5, 2, tr(" °/s²"));
    case MotorsModel::kOvershoot:
      return number(0.0, 90.0, 2, tr(" °"));
    case MotorsModel::kInitial:
      return number(-3600.0, 3600.0, 2, tr(" °"));
    case MotorsModel::kRetardanceError:
      return number(-30.0, 30.0, 2, tr(" °"));
    case MotorsModel::kAxisOffsetSd:
      return number(0.0, 5.0, 3, tr(" °"));
    case MotorsModel::kRepeatabilitySd:
      return number(0.0, 1.0, 3, tr(" °"));
    default: {
      auto* line = new QLineEdit(parent);
      line->setFrame(false);
      if (index.column() == MotorsModel::kRange)
        line->setPlaceholderText(tr("continuous, or e.g. -10 .. 370"));
      return line;
    }
  }
}

void MotorDelegate::setEditorData(QWidget* editor, const QModelIndex& index) const {
  const QVariant v = index.data(Qt::EditRole);
  if (auto* c = qobject_cast<QComboBox*>(editor)) {
    c->setCurrentIndex(v.toInt());
  } else if (auto* d = qobject_cast<QDoubleSpinBox*>(editor)) {
    d->setValue(v.toDouble());
  } else if (auto* s = qobject_cast<QSpinBox*>(editor)) {
    s->setValue(v.toInt());
  } else if (auto* l = qobject_cast<QLineEdit*>(editor)) {
    l->setText(v.toString());
  }
}

void MotorDelegate::setModelData(QWidget* editor, QAbstractItemModel* model,
                                 const QModelIndex& index) const {
  QVariant v;
  if (auto* c = qobject_cast<QComboBox*>(editor)) {
    v = c->currentIndex();
  } else if (auto* d = qobject_cast<QDoubleSpinBox*>(editor)) {
    v = d->value();
  } else if (auto* s = qobject_cast<QSpinBox*>(editor)) {
    v = s->value();
  } else if (auto* l = qobject_cast<QLineEdit*>(editor)) {
    v = l->text();
  }
  if (v == index.data(Qt::EditRole)) return;  // nothing changed: no undo step
  model->setData(index, v, Qt::EditRole);
}

}  // namespace gramline::gui
