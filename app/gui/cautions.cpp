#include "cautions.h"

#include <QCoreApplication>
#include <QDialog>
#include <QDialogButtonBox>
#include <QTextBrowser>
#include <QVBoxLayout>

#include "formats/cautions_text.h"

namespace gramline::gui {

QString cautions_html() {
  // The text lives once, in formats/cautions_text.cpp; here it is translated and laid out.
  const auto tr = [](const char* t) { return QCoreApplication::translate("gramline::gui", t); };
  QString html;
  bool first = true;
  for (const formats::CautionSection& section : formats::caution_sections()) {
    html += (first ? QStringLiteral("<h2>%1</h2>") : QStringLiteral("<h3>%1</h3>"))
                .arg(tr(section.heading).toHtmlEscaped());
    first = false;
    if (section.listed) html += QStringLiteral("<ul>");
    for (const char* p : section.paragraphs) {
      html += (section.listed ? QStringLiteral("<li>%1</li>") : QStringLiteral("<p>%1</p>"))
                  .arg(tr(p).toHtmlEscaped());
    }
    if (section.listed) html += QStringLiteral("</ul>");
  }
  return html;
}

QWidget* make_cautions_page() {
  auto* browser = new QTextBrowser;
  browser->setHtml(cautions_html());
  browser->setOpenExternalLinks(false);
  browser->setAccessibleName(QCoreApplication::translate("gramline::gui", "Cautions"));
  return browser;
}

bool acknowledge_cautions(QWidget* parent) {
  const auto tr = [](const char* t) { return QCoreApplication::translate("gramline::gui", t); };
  QDialog dialog(parent);
  dialog.setWindowTitle(tr("Before the first export"));
  auto* layout = new QVBoxLayout(&dialog);
  auto* text = new QTextBrowser;
  text->setHtml(cautions_html());
  layout->addWidget(text);
  auto* buttons = new QDialogButtonBox;
  buttons->addButton(tr("I have read this"), QDialogButtonBox::AcceptRole);
  buttons->addButton(QDialogButtonBox::Cancel);
  QObject::connect(buttons, &QDialogButtonBox::accepted, &dialog, &QDialog::accept);
  QObject::connect(buttons, &QDialogButtonBox::rejected, &dialog, &QDialog::reject);
  layout->addWidget(buttons);
  dialog.resize(640, 560);
  return dialog.exec() == QDialog::Accepted;
}

}  // namespace gramline::gui
