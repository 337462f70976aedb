#include <QFormLayout>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QTableView>
#include <QVBoxLayout>

#include "campaign_document.h"
#include "editor_pages.h"
#include "rig_tables.h"

namespace gramline::gui {

DataPage::DataPage(CampaignDocument* campaign_document, QWidget* parent)
    : EditorPage(campaign_document, parent) {
  auto* layout = new QVBoxLayout(this);
  auto* form = new_form(nullptr);
  name_ = new QLineEdit;
  name_->setAccessibleName(tr("Campaign name"));
  form->addRow(tr("Campaign name"), name_);
  connect(name_, &QLineEdit::editingFinished, this, [this] {
    const std::string text = name_->text().trimmed().toStdString();
    if (text == document()->campaign().name) return;
    document()->edit(tr("Rename campaign"), [text](Campaign& c) { c.name = text; });
  });
  on_refresh([this] {
    const QSignalBlocker block(name_);
    name_->setText(QString::fromStdString(document()->campaign().name));
  });
  layout->addLayout(form);

  auto* buttons = new QHBoxLayout;
  auto* import = new QPushButton(tr("Import CSV…"));
  import->setAccessibleName(tr("Import data from a CSV file"));
  import->setToolTip(
      tr("Replace the points with a CSV file: numeric feature columns, a "
         "“label” column with two classes, an optional “set” column "
         "(train or test)"));
  auto* demo = new QPushButton(tr("Use demo data"));
  demo->setAccessibleName(tr("Load the demo campaign"));
  demo->setToolTip(tr("Replace the whole campaign with the bundled demo"));
  buttons->addWidget(import);
  buttons->addWidget(demo);
  buttons->addStretch(1);
  layout->addLayout(buttons);
  connect(import, &QPushButton::clicked, this, &DataPage::import_requested);
  connect(demo, &QPushButton::clicked, this, &DataPage::demo_requested);

  data_info_ = new QLabel;
  data_info_->setWordWrap(true);
  layout->addWidget(data_info_);

  data_model_ = new DataModel(this);
  auto* table = new QTableView;
  table->setModel(data_model_);
  table->setAccessibleName(tr("Points of the data set"));
  table->verticalHeader()->setVisible(false);
  table->verticalHeader()->setSectionResizeMode(QHeaderView::Fixed);
  table->verticalHeader()->setDefaultSectionSize(fontMetrics().height() + 6);
  table->setAlternatingRowColors(true);
  table->horizontalHeader()->setStretchLastSection(true);
  table->horizontalHeader()->setDefaultSectionSize(fontMetrics().horizontalAdvance("0000.0000") +
                                                   12);
  layout->addWidget(table, 1);
  on_refresh([this] {
    const DataSet& d = document()->campaign().data;
    data_model_->set_data(d);
    int positive = 0;
    for (int i = 0; i < d.train_count(); ++i) positive += d.train_labels(i) > 0 ? 1 : 0;
    data_info_->setText(tr("%1 training points (%2 “%3”, %4 “%5”), %6 test points, %7 features.")
                            .arg(d.train_count())
                            .arg(positive)
                            .arg(QString::fromStdString(d.positive_name))
                            .arg(d.train_count() - positive)
                            .arg(QString::fromStdString(d.negative_name))
                            .arg(d.test_count())
                            .arg(d.feature_count()));
  });
}

}  // namespace gramline::gui
