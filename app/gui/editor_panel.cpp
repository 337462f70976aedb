#include "editor_panel.h"

#include <QScrollArea>
#include <QTabWidget>
#include <QVBoxLayout>

#include "campaign_document.h"
#include "editor_pages.h"

namespace gramline::gui {

namespace {

QWidget* scrolled(QWidget* inner) {
  auto* scroll = new QScrollArea;
  scroll->setWidget(inner);
  scroll->setWidgetResizable(true);
  scroll->setFrameShape(QFrame::NoFrame);
  return scroll;
}

}  // namespace

EditorPanel::EditorPanel(CampaignDocument* document, QWidget* parent) : QWidget(parent) {
  auto* data = new DataPage(document);
  encoding_ = new EncodingPage(document);
  rig_ = new RigPage(document);
  auto* precision = new PrecisionPage(document);
  auto* nights = new NightsPage(document);
  editors_ = {data, encoding_, rig_, precision, nights};
  connect(data, &DataPage::import_requested, this, &EditorPanel::import_requested);
  connect(data, &DataPage::demo_requested, this, &EditorPanel::demo_requested);

  pages_ = new QTabWidget;
  pages_->setDocumentMode(true);
  pages_->setAccessibleName(tr("Campaign editor pages"));
  pages_->addTab(data, tr("&Data"));
  pages_->addTab(scrolled(encoding_), tr("&Encoding"));
  pages_->addTab(scrolled(rig_), tr("&Rig"));
  pages_->addTab(scrolled(precision), tr("&Precision"));
  pages_->addTab(scrolled(nights), tr("&Nights"));
  auto* layout = new QVBoxLayout(this);
  layout->setContentsMargins(0, 0, 0, 0);
  layout->addWidget(pages_);
  connect(document, &CampaignDocument::changed, this, &EditorPanel::refresh);
  refresh();
}

MotorsModel* EditorPanel::motors_model() const { return rig_->motors_model(); }

void EditorPanel::refresh() {
  for (EditorPage* page : editors_) page->refresh();
}

void EditorPanel::set_scale_scan(const std::vector<ScalePoint>& scan, double advised) {
  encoding_->set_scale_scan(scan, advised);
}

void EditorPanel::clear_scale_scan() { encoding_->clear_scale_scan(); }

}  // namespace gramline::gui
