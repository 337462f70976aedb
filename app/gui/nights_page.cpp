#include <QDateEdit>
#include <QFormLayout>
#include <QGroupBox>
#include <QLabel>
#include <QSpinBox>
#include <QTimeEdit>
#include <QVBoxLayout>

#include "campaign_document.h"
#include "editor_pages.h"
#include "gui_text.h"

namespace gramline::gui {

NightsPage::NightsPage(CampaignDocument* campaign_document, QWidget* parent)
    : EditorPage(campaign_document, parent) {
  auto* layout = new QVBoxLayout(this);
  auto* box = new QGroupBox(tr("When the lab is yours"));
  auto* form = new_form(box);

  auto* date = new QDateEdit;
  date->setCalendarPopup(true);
  date->setDisplayFormat(QStringLiteral("yyyy-MM-dd"));
  date->setAccessibleName(tr("First night"));
  form->addRow(tr("First night"), date);
  connect(date, &QDateEdit::dateChanged, this, [this](const QDate& d) {
    const std::string text = d.toString(Qt::ISODate).toStdString();
    document()->edit(
        tr("Change first night"), [text](Campaign& c) { c.nights.first_date = text; },
        QStringLiteral("nights/date"));
  });
  const auto time_edit = [this, form](const QString& label, const QString& key, bool start) {
    auto* t = new QTimeEdit;
    t->setDisplayFormat(QStringLiteral("HH:mm"));
    t->setAccessibleName(label);
    t->setKeyboardTracking(false);
    form->addRow(label, t);
    connect(t, &QTimeEdit::timeChanged, this, [this, label, key, start](const QTime& v) {
      const int minutes = v.hour() * 60 + v.minute();
      document()->edit(
          tr("Change %1").arg(label),
          [start, minutes](Campaign& c) {
            (start ? c.nights.start_min : c.nights.end_min) = minutes;
          },
          key);
    });
    return t;
  };
  auto* start = time_edit(tr("Window opens"), QStringLiteral("nights/start"), true);
  auto* end = time_edit(tr("Window closes"), QStringLiteral("nights/end"), false);
  integer(
      form, "nights/max", tr("Nights allowed"), tr("Most nights the campaign may take"), 1, 365,
      [](const Campaign& c) { return c.nights.max_nights; },
      [](Campaign& c, int v) { c.nights.max_nights = v; });
  window_info_ = new QLabel;
  window_info_->setWordWrap(true);
  form->addRow(window_info_);
  on_refresh([this, date, start, end] {
    const NightWindow& n = document()->campaign().nights;
    const QSignalBlocker b1(date), b2(start), b3(end);
    date->setDate(QDate::fromString(QString::fromStdString(n.first_date), Qt::ISODate));
    start->setTime(QTime(n.start_min / 60, n.start_min % 60));
    end->setTime(QTime(n.end_min / 60, n.end_min % 60));
    window_info_->setText(tr("Each night's window lasts %1; a window whose close is not after "
                             "its opening ends the next morning.")
                              .arg(duration_text(n.length_s())));
  });
  layout->addWidget(box);
  layout->addStretch(1);
}

}  // namespace gramline::gui
