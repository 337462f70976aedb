#include "preferences.h"

#include <QComboBox>
#include <QCoreApplication>
#include <QDialogButtonBox>
#include <QFormLayout>
#include <QLabel>
#include <QLibraryInfo>
#include <QSettings>
#include <QTranslator>
#include <QVBoxLayout>

namespace gramline::gui {

namespace {

const QString kLanguageKey = QStringLiteral("interface/language");

// Stored words, not enum numbers, so a settings file stays readable and survives reordering.
QString language_key(UiLanguage language) {
  switch (language) {
    case UiLanguage::kEnglish:
      return QStringLiteral("en");
    case UiLanguage::kGerman:
      return QStringLiteral("de");
    case UiLanguage::kSystem:
      break;
  }
  return QStringLiteral("system");
}

/// English plural forms for texts written with Qt's %n: "%n night(s)" reads "1 night" and
/// "8 nights". Other languages get their forms from their translation file.
class EnglishPlurals : public QTranslator {
 public:
  using QTranslator::QTranslator;
  bool isEmpty() const override { return false; }
  QString translate(const char* context, const char* source, const char* disambiguation,
                    int n) const override {
    Q_UNUSED(context);
    Q_UNUSED(disambiguation);
    if (n < 0 || !source) return {};
    QString text = QString::fromUtf8(source);
    if (!text.contains(QLatin1String("(s)"))) return {};
    return text.replace(QLatin1String("(s)"), n == 1 ? QString() : QStringLiteral("s"));
  }
};

}  // namespace

UiLanguage saved_language(const QSettings& settings) {
  const QString key = settings.value(kLanguageKey).toString();
  if (key == QLatin1String("en")) return UiLanguage::kEnglish;
  if (key == QLatin1String("de")) return UiLanguage::kGerman;
  return UiLanguage::kSystem;
}

void save_language(QSettings& settings, UiLanguage language) {
  settings.setValue(kLanguageKey, language_key(language));
}

QLocale ui_locale(UiLanguage language, const QLocale& system_locale) {
  switch (language) {
    case UiLanguage::kEnglish:
      return QLocale(QLocale::English, QLocale::UnitedStates);
    case UiLanguage::kGerman:
      return QLocale(QLocale::German, QLocale::Germany);
    case UiLanguage::kSystem:
      break;
  }
  return system_locale;
}

bool install_translators(QCoreApplication* app, const QLocale& locale) {
  // English is the source language: only its plural forms need a translator.
  if (locale.language() == QLocale::English || locale.language() == QLocale::C) {
    static EnglishPlurals plurals;  // no file behind it: nothing to load, nothing to own
    QCoreApplication::installTranslator(&plurals);
    return false;
  }
  auto* own = new QTranslator(app);
  // qt_add_translations embeds gramline_<lang>.qm under :/i18n.
  const bool found =
      own->load(locale, QStringLiteral("gramline"), QStringLiteral("_"), QStringLiteral(":/i18n"));
  if (found)
    QCoreApplication::installTranslator(own);
  else
    delete own;
  // Qt's own dialogs and buttons, when the system has Qt's translations installed.
  auto* qt = new QTranslator(app);
  if (qt->load(locale, QStringLiteral("qtbase"), QStringLiteral("_"),
               QLibraryInfo::path(QLibraryInfo::TranslationsPath)))
    QCoreApplication::installTranslator(qt);
  else
    delete qt;
  return found;
}

PreferencesDialog::PreferencesDialog(QWidget* parent) : QDialog(parent) {
  setWindowTitle(tr("Preferences"));
  language_ = new QComboBox;
  language_->addItem(tr("System language"), static_cast<int>(UiLanguage::kSystem));
  // Each language is named in itself, so a user who cannot read the current one finds theirs.
  language_->addItem(QStringLiteral("English"), static_cast<int>(UiLanguage::kEnglish));
  language_->addItem(QStringLiteral("Deutsch"), static_cast<int>(UiLanguage::kGerman));
  language_->setAccessibleName(tr("Interface language"));
  const QSettings settings;
  language_->setCurrentIndex(language_->findData(static_cast<int>(saved_language(settings))));

  auto* note = new QLabel(tr("A new language applies the next time Gramline starts."));
  note->setWordWrap(true);

  auto* form = new QFormLayout;
  form->addRow(tr("&Language:"), language_);
  auto* buttons = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel);
  connect(buttons, &QDialogButtonBox::accepted, this, [this] {
    save();
    accept();
  });
  connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);

  auto* layout = new QVBoxLayout(this);
  layout->addLayout(form);
  layout->addWidget(note);
  layout->addStretch(1);
  layout->addWidget(buttons);
}

void PreferencesDialog::save() const {
  QSettings settings;
  save_language(settings, static_cast<UiLanguage>(language_->currentData().toInt()));
}

}  // namespace gramline::gui
