#pragma once
// Table models of the editor: the data set (read-only) and the motors (editable, every edit
// handed to the document as an undoable change).
#include <QAbstractTableModel>
#include <QStyledItemDelegate>
#include <functional>
#include <vector>

#include "gramline/campaign.h"

namespace gramline::gui {

/// The points of the data set: global index, set, class, features.
class DataModel : public QAbstractTableModel {
  Q_OBJECT

 public:
  using QAbstractTableModel::QAbstractTableModel;
  void set_data(const DataSet& data);
  int rowCount(const QModelIndex& parent = {}) const override;
  int columnCount(const QModelIndex& parent = {}) const override;
  QVariant data(const QModelIndex& index, int role) const override;
  QVariant headerData(int section, Qt::Orientation orientation, int role) const override;

 private:
  DataSet data_;
};

/// One row per motor, one column per parameter of docs/motion-model.md.
class MotorsModel : public QAbstractTableModel {
  Q_OBJECT

 public:
  enum Column {
    kName,
    kPhoton,
    kStage,
    kPlate,
    kSpeed,
    kAccel,
    kRange,
    kBacklash,
    kOvershoot,
    kInitial,
    kRetardanceError,  ///< plate imperfections (docs/conventions.md, "Real plates")
    kAxisOffsetSd,
    kRepeatabilitySd,
    kColumnCount
  };
  /// Called with the motor row and the edited motor; the owner turns it into an undoable edit.
  using EditFn = std::function<void(int row, int column, const Motor& edited)>;

  explicit MotorsModel(EditFn on_edit, QObject* parent = nullptr);
  void set_motors(const std::vector<Motor>& motors);

  int rowCount(const QModelIndex& parent = {}) const override;
  int columnCount(const QModelIndex& parent = {}) const override;
  QVariant data(const QModelIndex& index, int role) const override;
  bool setData(const QModelIndex& index, const QVariant& value, int role) override;
  QVariant headerData(int section, Qt::Orientation orientation, int role) const override;
  Qt::ItemFlags flags(const QModelIndex& index) const override;

  /// "continuous" or "lo … hi"; parse_range accepts "", "continuous", "lo..hi", "lo to hi",
  /// "lo, hi" and "lo … hi". False on anything else.
  static QString range_text(const std::optional<TravelRange>& range);
  static bool parse_range(const QString& text, std::optional<TravelRange>& out);

 private:
  std::vector<Motor> motors_;
  EditFn on_edit_;
};

/// Editors for the motors table: lists for the named choices, spin boxes with units.
class MotorDelegate : public QStyledItemDelegate {
  Q_OBJECT

 public:
  using QStyledItemDelegate::QStyledItemDelegate;
  QWidget* createEditor(QWidget* parent, const QStyleOptionViewItem& option,
                        const QModelIndex& index) const override;
  void setEditorData(QWidget* editor, const QModelIndex& index) const override;
  void setModelData(QWidget* editor, QAbstractItemModel* model,
                    const QModelIndex& index) const override;
};

}  // namespace gramline::gui
