#pragma once
// File ▸ Open Recent: the last campaign files opened or saved, kept in the settings.
#include <QObject>
#include <QString>

class QMenu;

namespace gramline::gui {

class RecentFiles : public QObject {
  Q_OBJECT

 public:
  /// Fills `menu` (owned by the caller) from the settings.
  explicit RecentFiles(QMenu* menu, QObject* parent = nullptr);

  QMenu* menu() const { return menu_; }
  /// Puts `path` first in the list.
  void add(const QString& path);

 signals:
  /// The user chose `path` from the menu.
  void open_requested(const QString& path);

 private:
  void rebuild();

  QMenu* menu_;
};

}  // namespace gramline::gui
