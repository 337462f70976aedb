// The shipped app's help, preferences and translations, on the offscreen platform: the user
// guide holds the README's sections, the German translation is embedded and loads, the
// language preference survives a restart of the dialog, and the menus reach all of it.
#include <QAction>
#include <QComboBox>
#include <QDialog>
#include <QListWidget>
#include <QMenu>
#include <QMenuBar>
#include <QSettings>
#include <QStandardPaths>
#include <QTest>
#include <QTextBrowser>
#include <QTranslator>

#include "help_view.h"
#include "main_window.h"
#include "preferences.h"

using namespace gramline::gui;

namespace {

QStringList titles(const QList<GuideSection>& sections) {
  QStringList t;
  for (const GuideSection& s : sections) t.append(s.title);
  return t;
}

void remove_translators() {
  for (QTranslator* t : QCoreApplication::instance()->findChildren<QTranslator*>()) {
    QCoreApplication::removeTranslator(t);
    delete t;
  }
}

QAction* menu_action(QMainWindow& w, const QString& menu_text, const QString& action_text) {
  for (QAction* m : w.menuBar()->actions()) {
    if (m->text() != menu_text || m->menu() == nullptr) continue;
    for (QAction* a : m->menu()->actions())
      if (a->text() == action_text) return a;
  }
  return nullptr;
}

}  // namespace

class ShipGuiTest : public QObject {
  Q_OBJECT

 private slots:
  void initTestCase() {
    QStandardPaths::setTestModeEnabled(true);
    QCoreApplication::setOrganizationName(QStringLiteral("gramline-ship-tests"));
    QCoreApplication::setApplicationName(QStringLiteral("gramline-ship-tests"));
    QSettings().clear();
  }

  void cleanup() { remove_translators(); }

  void guide_splits_on_level_two_headings_outside_code() {
    const QString md = QStringLiteral(
        "# Tool\nIntro line.\n\n## Quick start\nbuild it\n\n## Usage\nrun it\n```\n## not a "
        "heading\n```\n### Detail\nmore\n\n## Development\nhack it\n");
    const QList<GuideSection> s = user_guide_sections(md);
    QCOMPARE(titles(s), (QStringList{QStringLiteral("Tool"), QStringLiteral("Usage")}));
    QVERIFY(s[0].markdown.contains(QStringLiteral("Intro line.")));
    QVERIFY(s[1].markdown.contains(QStringLiteral("## not a heading")));
    QVERIFY(s[1].markdown.contains(QStringLiteral("### Detail")));
    QVERIFY(!s[1].markdown.contains(QStringLiteral("hack it")));
  }

  void readme_is_embedded_with_its_guide() {
    const QString readme = embedded_readme();
    QVERIFY2(!readme.isEmpty(), "README.md is not in the resources");
    const QStringList t = titles(user_guide_sections(readme));
    for (const char* wanted : {"Gramline", "Cautions", "Command line", "User guide"})
      QVERIFY2(t.contains(QLatin1String(wanted)), wanted);
    QVERIFY(!t.contains(QStringLiteral("Development")));
  }

  void help_view_renders_and_finds() {
    HelpView view;
    QCOMPARE(view.pages()->count(), user_guide_sections(embedded_readme()).size() + 1);
    // The first page is our own text around the README.
    QVERIFY(view.browser()->toPlainText().contains(QStringLiteral("Cautions")));
    QVERIFY(view.show_page(QStringLiteral("User guide")));
    const QString text = view.browser()->toPlainText();
    // Rendered from Markdown: the heading marks are gone, the words stay.
    QVERIFY(text.contains(QStringLiteral("Margin check")));
    QVERIFY(!text.contains(QStringLiteral("### ")));
    QVERIFY(view.find(QStringLiteral("Hoeffding")));
    QCOMPARE(view.browser()->textCursor().selectedText(), QStringLiteral("Hoeffding"));
    QVERIFY(!view.find(QStringLiteral("no such words here at all")));
    QVERIFY(!view.show_page(QStringLiteral("No such page")));
  }

  void german_translation_is_embedded_and_loads() {
    const QString english = QCoreApplication::translate("gramline::gui::MainWindow", "&File");
    QCOMPARE(english, QStringLiteral("&File"));
    QVERIFY(install_translators(QCoreApplication::instance(), QLocale(QLocale::German)));
    QCOMPARE(QCoreApplication::translate("gramline::gui::MainWindow", "&File"),
             QStringLiteral("&Datei"));
    // Texts built outside a class (context gramline::gui) are translated too.
    QVERIFY(QCoreApplication::translate("gramline::gui", "Laser safety") !=
            QStringLiteral("Laser safety"));
  }

  void english_and_unknown_languages_load_nothing_of_ours() {
    QVERIFY(!install_translators(QCoreApplication::instance(), QLocale(QLocale::English)));
    QVERIFY(QCoreApplication::instance()->findChildren<QTranslator*>().isEmpty());
    QVERIFY(!install_translators(QCoreApplication::instance(), QLocale(QLocale::Japanese)));
    QCOMPARE(QCoreApplication::translate("gramline::gui::MainWindow", "&File"),
             QStringLiteral("&File"));
  }

  void language_preference_round_trip() {
    const QLocale french(QLocale::French, QLocale::France);
    QCOMPARE(ui_locale(UiLanguage::kSystem, french), french);
    QCOMPARE(ui_locale(UiLanguage::kGerman, french).language(), QLocale::German);
    QCOMPARE(ui_locale(UiLanguage::kEnglish, french).language(), QLocale::English);

    QSettings().clear();
    QCOMPARE(saved_language(QSettings()), UiLanguage::kSystem);
    {
      PreferencesDialog dialog;
      QCOMPARE(dialog.language_box()->currentText(), dialog.language_box()->itemText(0));
      dialog.language_box()->setCurrentIndex(
          dialog.language_box()->findText(QStringLiteral("Deutsch")));
      dialog.save();
    }
    QCOMPARE(saved_language(QSettings()), UiLanguage::kGerman);
    PreferencesDialog again;
    QCOMPARE(again.language_box()->currentText(), QStringLiteral("Deutsch"));
    // A value from a newer or damaged settings file falls back to the system language.
    QSettings().setValue(QStringLiteral("interface/language"), QStringLiteral("xx"));
    QCOMPARE(saved_language(QSettings()), UiLanguage::kSystem);
    QSettings().clear();
  }

  void menus_reach_guide_preferences_and_about() {
    MainWindow w;
    QVERIFY(menu_action(w, QStringLiteral("&Edit"), QStringLiteral("&Preferences…")));
    QVERIFY(menu_action(w, QStringLiteral("&Help"), QStringLiteral("&Cautions")));
    QVERIFY(menu_action(w, QStringLiteral("&Help"), QStringLiteral("&About Gramline")));
    QAction* guide = menu_action(w, QStringLiteral("&Help"), QStringLiteral("&User Guide"));
    QVERIFY(guide);
    guide->trigger();
    guide->trigger();  // a second time raises the open window instead of opening another
    const auto windows = w.findChildren<QDialog*>(QStringLiteral("gramline_user_guide"));
    QCOMPARE(windows.size(), 1);
    QVERIFY(windows.first()->isVisible());
    QVERIFY(windows.first()->findChild<HelpView*>());
  }
};

QTEST_MAIN(ShipGuiTest)
#include "test_ship_gui.moc"
