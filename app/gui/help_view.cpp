#include "help_view.h"

#include <QDialog>
#include <QFile>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QListWidget>
#include <QMessageBox>
#include <QPointer>
#include <QRegularExpression>
#include <QSplitter>
#include <QTextBrowser>
#include <QTextCursor>
#include <QTextDocument>
#include <QVBoxLayout>

namespace gramline::gui {

namespace {

// The sections that tell a developer how to build from a checkout; an installed app has no
// checkout, so the guide leaves them out.
bool is_checkout_section(const QString& title) {
  return title.startsWith(QLatin1String("Quick start"), Qt::CaseInsensitive) ||
         title.startsWith(QLatin1String("Development"), Qt::CaseInsensitive);
}

}  // namespace

QList<GuideSection> user_guide_sections(const QString& readme_markdown) {
  QList<GuideSection> sections;
  GuideSection current;
  bool in_fence = false;
  const auto flush = [&] {
    if (!current.markdown.trimmed().isEmpty() && !is_checkout_section(current.title))
      sections.append(current);
  };
  const QStringList lines = readme_markdown.split(QLatin1Char('\n'));
  for (const QString& line : lines) {
    if (line.startsWith(QLatin1String("```"))) in_fence = !in_fence;
    if (!in_fence && line.startsWith(QLatin1String("# ")) && current.title.isEmpty() &&
        current.markdown.trimmed().isEmpty()) {
      current.title = line.mid(2).trimmed();  // the document title names the introduction
      continue;
    }
    if (!in_fence && line.startsWith(QLatin1String("## "))) {
      flush();
      current = GuideSection{line.mid(3).trimmed(), QString()};
    }
    current.markdown += line + QLatin1Char('\n');
  }
  flush();
  return sections;
}

QString embedded_readme() {
  QFile file(QStringLiteral(":/doc/README.md"));
  if (!file.open(QIODevice::ReadOnly)) return {};
  return QString::fromUtf8(file.readAll());
}

HelpView::HelpView(QWidget* parent)
    : QWidget(parent), sections_(user_guide_sections(embedded_readme())) {
  pages_ = new QListWidget;
  pages_->setAccessibleName(tr("Guide pages"));
  browser_ = new QTextBrowser;
  browser_->setAccessibleName(tr("User guide text"));
  // Links to other files of the checkout lead nowhere in an installed app.
  browser_->setOpenLinks(false);
  find_ = new QLineEdit;
  find_->setPlaceholderText(tr("Find in this page"));
  find_->setClearButtonEnabled(true);
  find_->setAccessibleName(tr("Find in the user guide"));

  pages_->addItem(tr("About this guide"));
  for (const GuideSection& s : sections_) pages_->addItem(s.title);
  connect(pages_, &QListWidget::currentRowChanged, this, &HelpView::show_index);
  connect(find_, &QLineEdit::returnPressed, this, [this] { find(find_->text()); });

  auto* splitter = new QSplitter;
  splitter->addWidget(pages_);
  splitter->addWidget(browser_);
  splitter->setStretchFactor(1, 1);
  splitter->setSizes({200, 700});

  auto* find_row = new QHBoxLayout;
  auto* find_label = new QLabel(tr("&Find:"));
  find_label->setBuddy(find_);
  find_row->addWidget(find_label);
  find_row->addWidget(find_, 1);

  auto* layout = new QVBoxLayout(this);
  layout->addWidget(splitter, 1);
  layout->addLayout(find_row);
  pages_->setCurrentRow(0);
}

void HelpView::show_index(int index) {
  if (index <= 0) {
    // Our own words around the README: what the guide holds and where the cautions live.
    QString text =
        QStringLiteral("<h2>%1</h2><p>%2</p><p>%3</p><p>%4</p>")
            .arg(tr("Gramline user guide"),
                 tr("Gramline plans the measurement of a quantum kernel with polarization-encoded "
                    "photon pairs: the waveplate angles of every setting, the order of the "
                    "settings, the pairs per Gram matrix entry, the nights, the predicted error "
                    "and the margin check."),
                 tr("The pages on the left are the project's README: the job step by step with "
                    "the formulas used and their published sources, the file formats, the "
                    "command line and the cautions. They are written in English whatever the "
                    "interface language."),
                 tr("The cautions on laser safety and unattended operation are also in the "
                    "Cautions view of the main window (Help > Cautions). Read them before the "
                    "first run."));
    if (sections_.isEmpty())
      text += QStringLiteral("<p><b>%1</b></p>")
                  .arg(tr("The guide text is missing from this build of Gramline."));
    browser_->setHtml(text);
    return;
  }
  if (index > sections_.size()) return;
  browser_->setMarkdown(sections_[index - 1].markdown);
}

bool HelpView::show_page(const QString& title) {
  for (int i = 0; i < sections_.size(); ++i) {
    if (sections_[i].title.compare(title, Qt::CaseInsensitive) == 0) {
      pages_->setCurrentRow(i + 1);
      return true;
    }
  }
  return false;
}

bool HelpView::find(const QString& text) {
  if (text.isEmpty()) return false;
  if (browser_->find(text)) return true;
  // Wrap around: search again from the top of the page.
  browser_->moveCursor(QTextCursor::Start);
  return browser_->find(text);
}

void show_user_guide(QWidget* parent) {
  static const char* const kName = "gramline_user_guide";
  if (auto* open = parent->findChild<QDialog*>(QLatin1String(kName))) {
    open->show();
    open->raise();
    open->activateWindow();
    return;
  }
  auto* window = new QDialog(parent);
  window->setObjectName(QLatin1String(kName));
  window->setWindowTitle(HelpView::tr("Gramline User Guide"));
  window->setWindowFlag(Qt::WindowMaximizeButtonHint);
  auto* layout = new QVBoxLayout(window);
  layout->setContentsMargins(0, 0, 0, 0);
  layout->addWidget(new HelpView);
  window->resize(960, 680);
  window->show();
}

void show_about(QWidget* parent) {
  QMessageBox::about(
      parent, HelpView::tr("About Gramline"),
      HelpView::tr("<p><b>Gramline %1</b></p><p>Plans polarization-encoded quantum-kernel "
                   "measurements with photon pairs: which settings, in which order, how long "
                   "each, and how precise the Gram matrix will be.</p><p>Released under the MIT "
                   "licence.</p><p>Built with Qt %2, running on Qt %3.</p>")
          .arg(QStringLiteral(GRAMLINE_VERSION), QStringLiteral(QT_VERSION_STR),
               QString::fromLatin1(qVersion())));
}

}  // namespace gramline::gui
