#include "screenshots.h"

#include <QApplication>
#include <QDir>
#include <QPixmap>
#include <QStringList>
#include <QTabWidget>
#include <QTimer>

#include "editor_panel.h"
#include "hand_off.h"
#include "main_window.h"
#include "margin_runner.h"
#include "plan_runner.h"

namespace gramline::gui {

void take_screenshots(MainWindow& window, const QString& dir,
                      const std::function<void(bool ok)>& done) {
  MainWindow* w = &window;
  const auto shoot = [w, dir, done] {
    QDir().mkpath(dir);
    bool ok = true;
    const QStringList names = {QStringLiteral("summary"),  QStringLiteral("steps"),
                               QStringLiteral("timeline"), QStringLiteral("gram-error"),
                               QStringLiteral("margin"),   QStringLiteral("measured"),
                               QStringLiteral("compare"),  QStringLiteral("cautions")};
    const auto save = [&](const QString& name) {
      QApplication::processEvents();
      ok = w->grab().save(dir + QLatin1Char('/') + name + QStringLiteral(".png")) && ok;
    };
    for (int v = 0; v < MainWindow::kViewCount; ++v) {
      w->views()->setCurrentIndex(v);
      save(QStringLiteral("%1-view-%2").arg(v + 1, 2, 10, QLatin1Char('0')).arg(names[v]));
    }
    const QStringList pages = {QStringLiteral("data"), QStringLiteral("encoding"),
                               QStringLiteral("rig"), QStringLiteral("precision"),
                               QStringLiteral("nights")};
    w->views()->setCurrentIndex(MainWindow::kSummary);
    QTabWidget* editor_pages = w->editor()->pages();
    for (int p = 0; p < editor_pages->count() && p < pages.size(); ++p) {
      editor_pages->setCurrentIndex(p);
      save(QStringLiteral("%1-editor-%2").arg(p + 11, 2, 10, QLatin1Char('0')).arg(pages[p]));
    }
    editor_pages->setCurrentIndex(0);
    done(ok);
  };
  const QString bundle = qEnvironmentVariable("GRAMLINE_SCREENSHOT_BUNDLE");
  const QString counts = qEnvironmentVariable("GRAMLINE_SCREENSHOT_COUNTS");
  if (!bundle.isEmpty() && !counts.isEmpty()) w->hand_off()->ingest_files(bundle, counts);
  // Wait until the plan and its margin check are done, polling so a failed plan also ends.
  auto* poll = new QTimer(w);
  poll->setInterval(200);
  QObject::connect(poll, &QTimer::timeout, w, [w, poll, shoot] {
    if (w->runner()->busy() || w->margin_runner()->busy() || w->hand_off()->busy()) return;
    poll->stop();
    poll->deleteLater();
    shoot();
  });
  poll->start();
}

}  // namespace gramline::gui
