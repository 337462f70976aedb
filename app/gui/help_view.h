#pragma once
// Help: the user guide (the README's sections, embedded as a resource) and the About box.
#include <QList>
#include <QString>
#include <QWidget>

class QLineEdit;
class QListWidget;
class QTextBrowser;

namespace gramline::gui {

/// One page of the user guide: a level-two heading of the README and its Markdown.
struct GuideSection {
  QString title;
  QString markdown;
};

/// Splits README Markdown into the pages the user guide shows, in README order: the
/// introduction under the title, then every level-two section except the ones about building
/// from a checkout (quick start, development). Headings inside code blocks do not split.
QList<GuideSection> user_guide_sections(const QString& readme_markdown);

/// The README embedded in the app (empty when the resource is missing).
QString embedded_readme();

/// The user guide: a list of pages on the left, the page rendered from Markdown on the right,
/// and a find field.
class HelpView : public QWidget {
  Q_OBJECT

 public:
  explicit HelpView(QWidget* parent = nullptr);

  QListWidget* pages() const { return pages_; }
  QTextBrowser* browser() const { return browser_; }
  /// Shows the page whose title is `title`; false when there is none.
  bool show_page(const QString& title);
  /// Selects the next occurrence of `text`, wrapping around; false when there is none.
  bool find(const QString& text);

 private:
  void show_index(int index);

  QList<GuideSection> sections_;
  QListWidget* pages_;
  QTextBrowser* browser_;
  QLineEdit* find_;
};

/// Opens the user guide in a window of its own (one per parent, raised when already open).
void show_user_guide(QWidget* parent);
/// The About box: version, licence, Qt version.
void show_about(QWidget* parent);

}  // namespace gramline::gui
