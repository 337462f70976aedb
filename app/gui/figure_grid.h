#pragma once
// A grid of headline figures, each a bold caption, a large value and a small note beneath.
#include <QHash>
#include <QString>
#include <QWidget>

class QGridLayout;
class QLabel;

namespace gramline::gui {

class FigureGrid : public QWidget {
  Q_OBJECT

 public:
  /// `columns` figures to a row; values drawn at `value_scale` times the normal font size.
  FigureGrid(int columns, double value_scale, QWidget* parent = nullptr);
  /// Adds a figure under `key`; `help` becomes its tooltip. Returns the value label.
  QLabel* add(const QString& key, const QString& title, const QString& help);
  /// Sets a figure's value and note; unknown keys are ignored.
  void set(const QString& key, const QString& value, const QString& note = {});
  /// Shows a dash in every value and clears every note.
  void clear_all();
  /// The value text of a figure (empty for an unknown key).
  QString value(const QString& key) const;
  QGridLayout* grid() const { return grid_; }

 private:
  int columns_;
  double value_scale_;
  QGridLayout* grid_;
  QHash<QString, QLabel*> values_;
  QHash<QString, QLabel*> notes_;
};

}  // namespace gramline::gui
