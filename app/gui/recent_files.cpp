#include "recent_files.h"

#include <QAction>
#include <QDir>
#include <QMenu>
#include <QSettings>
#include <QStringList>

namespace gramline::gui {

namespace {
constexpr int kMaxRecent = 8;
const QString kKey = QStringLiteral("files/recent");
}  // namespace

RecentFiles::RecentFiles(QMenu* menu, QObject* parent) : QObject(parent), menu_(menu) { rebuild(); }

void RecentFiles::add(const QString& path) {
  QSettings settings;
  QStringList list = settings.value(kKey).toStringList();
  list.removeAll(path);
  list.prepend(path);
  while (list.size() > kMaxRecent) list.removeLast();
  settings.setValue(kKey, list);
  rebuild();
}

void RecentFiles::rebuild() {
  menu_->clear();
  const QStringList list = QSettings().value(kKey).toStringList();
  int n = 0;
  for (const QString& path : list) {
    QAction* a = menu_->addAction(tr("&%1 %2").arg(++n).arg(QDir::toNativeSeparators(path)));
    connect(a, &QAction::triggered, this, [this, path] { emit open_requested(path); });
  }
  menu_->setEnabled(!list.isEmpty());
  if (!list.isEmpty()) {
    menu_->addSeparator();
    connect(menu_->addAction(tr("Clear List")), &QAction::triggered, this, [this] {
      QSettings().remove(kKey);
      rebuild();
    });
  }
}

}  // namespace gramline::gui
