// gramline: the desktop app. `gramline [FILE]` opens a campaign (the demo when none is given);
// `gramline --screenshots DIR [FILE]` renders every view into DIR as PNG files and exits.
#include <QApplication>
#include <QCommandLineParser>
#include <QSettings>
#include <QTimer>

#include "app_icon.h"
#include "main_window.h"
#include "preferences.h"
#include "screenshots.h"

int main(int argc, char** argv) {
  QApplication app(argc, argv);
  QApplication::setOrganizationName(QStringLiteral("Gramline"));
  QApplication::setApplicationName(QStringLiteral("gramline"));
  QApplication::setApplicationDisplayName(QStringLiteral("Gramline"));
  QApplication::setApplicationVersion(QStringLiteral(GRAMLINE_VERSION));
  QGuiApplication::setDesktopFileName(QStringLiteral("io.github.gramline.Gramline"));
  QApplication::setWindowIcon(gramline::gui::app_icon());
  // The language follows the system locale unless the preferences name one; before the
  // command line is parsed so that --help speaks it too.
  gramline::gui::install_translators(
      &app, gramline::gui::ui_locale(gramline::gui::saved_language(QSettings())));

  QCommandLineParser parser;
  parser.setApplicationDescription(QApplication::translate(
      "main", "Plans polarization-encoded quantum-kernel measurements with photon pairs."));
  parser.addHelpOption();
  parser.addVersionOption();
  parser.addPositionalArgument(QStringLiteral("file"),
                               QApplication::translate("main", "Campaign file to open."),
                               QStringLiteral("[FILE]"));
  const QCommandLineOption screenshots(
      QStringLiteral("screenshots"),
      QApplication::translate("main", "Render every view into DIR as PNG files, then exit."),
      QStringLiteral("DIR"));
  parser.addOption(screenshots);
  parser.process(app);

  gramline::gui::MainWindow window;
  const QStringList files = parser.positionalArguments();
  bool opened = false;
  if (!files.isEmpty()) opened = window.open_file(files.first());
  if (!opened) window.load_demo();
  window.show();

  if (parser.isSet(screenshots)) {
    window.resize(1400, 860);
    gramline::gui::take_screenshots(window, parser.value(screenshots),
                                    [](bool ok) { QApplication::exit(ok ? 0 : 1); });
  } else {
    const QString opening = files.isEmpty() ? QString() : files.first();
    QTimer::singleShot(0, &window, [&window, opening] { window.offer_recovery(opening); });
  }
  return app.exec();
}
