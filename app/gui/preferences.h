#pragma once
// The user's preferences (for now the interface language) and the translators that follow them.
#include <QDialog>
#include <QLocale>

class QComboBox;
class QCoreApplication;
class QSettings;

namespace gramline::gui {

/// Interface language: the system locale, or one the user picked.
enum class UiLanguage { kSystem, kEnglish, kGerman };

/// The language stored in `settings` (kSystem when none or an unknown one is stored).
UiLanguage saved_language(const QSettings& settings);
void save_language(QSettings& settings, UiLanguage language);

/// The locale whose translations the app loads for `language`; kSystem gives
/// `system_locale`.
QLocale ui_locale(UiLanguage language, const QLocale& system_locale = QLocale::system());

/// Loads and installs the app's own translation for `locale` (embedded .qm files) and Qt's
/// qtbase translation when the system has one. Returns true when the app's own translation
/// was found; English needs none and returns false. The translators are children of `app`.
bool install_translators(QCoreApplication* app, const QLocale& locale);

/// Edits the preferences; accepting saves them. A changed language applies on the next start.
class PreferencesDialog : public QDialog {
  Q_OBJECT

 public:
  explicit PreferencesDialog(QWidget* parent = nullptr);

  QComboBox* language_box() const { return language_; }
  /// Writes the dialog's choices to the app's settings.
  void save() const;

 private:
  QComboBox* language_;
};

}  // namespace gramline::gui
