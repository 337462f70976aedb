#include <QCheckBox>
#include <QDateEdit>
#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QLocale>
#include <QSpinBox>
#include <QTimeEdit>
#include <QVBoxLayout>
#include <algorithm>
#include <vector>

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
  // Nights to skip: weekdays and dates (docs/plan-files.md, "Nights on the calendar").
  auto* weekdays = new QHBoxLayout;
  std::vector<QCheckBox*> day_boxes;
  for (int d = 1; d <= 7; ++d) {
    auto* box = new QCheckBox(QLocale().dayName(d, QLocale::ShortFormat));
    box->setObjectName(QStringLiteral("nights/skip_weekday/%1").arg(d));
    box->setAccessibleName(tr("Skip %1").arg(QLocale().dayName(d)));
    weekdays->addWidget(box);
    day_boxes.push_back(box);
    connect(box, &QCheckBox::toggled, this, [this, d](bool on) {
      document()->edit(tr("Skip weekday"), [d, on](Campaign& c) {
        auto& days = c.nights.skip_weekdays;
        days.erase(std::remove(days.begin(), days.end(), d), days.end());
        if (on) days.push_back(d);
        std::sort(days.begin(), days.end());
      });
    });
  }
  weekdays->addStretch(1);
  form->addRow(tr("Weekdays to skip"), weekdays);
  auto* dates = new QLineEdit;
  dates->setObjectName(QStringLiteral("nights/skip_dates"));
  dates->setPlaceholderText(tr("e.g. 2026-12-24, 2026-12-25"));
  dates->setAccessibleName(tr("Dates to skip"));
  form->addRow(tr("Dates to skip"), dates);
  auto* dates_error = new QLabel;
  dates_error->setWordWrap(true);
  dates_error->setStyleSheet(QStringLiteral("color: #b00020"));
  dates_error->setVisible(false);
  form->addRow(dates_error);
  connect(dates, &QLineEdit::editingFinished, this, [this, dates, dates_error] {
    std::vector<std::string> list;
    QString problem;
    for (const QString& part : dates->text().split(QLatin1Char(','), Qt::SkipEmptyParts)) {
      const std::string text = part.trimmed().toStdString();
      long day = 0;
      if (!parse_civil_date(text, day)) {
        problem = tr("nights.skip_dates: '%1' is not a date YYYY-MM-DD").arg(part.trimmed());
        break;
      }
      list.push_back(text);
    }
    dates_error->setText(problem);
    dates_error->setVisible(!problem.isEmpty());
    if (!problem.isEmpty() || list == document()->campaign().nights.skip_dates) return;
    document()->edit(tr("Change dates to skip"),
                     [list](Campaign& c) { c.nights.skip_dates = list; });
  });

  window_info_ = new QLabel;
  window_info_->setWordWrap(true);
  form->addRow(window_info_);
  on_refresh([this, date, start, end, day_boxes, dates] {
    const NightWindow& n = document()->campaign().nights;
    const QSignalBlocker b1(date), b2(start), b3(end);
    for (int d = 1; d <= 7; ++d) {
      QCheckBox* box = day_boxes[static_cast<std::size_t>(d - 1)];
      const QSignalBlocker b(box);
      box->setChecked(std::find(n.skip_weekdays.begin(), n.skip_weekdays.end(), d) !=
                      n.skip_weekdays.end());
    }
    QStringList skip;
    for (const std::string& d : n.skip_dates) skip << QString::fromStdString(d);
    if (!dates->hasFocus()) dates->setText(skip.join(QStringLiteral(", ")));
    date->setDate(QDate::fromString(QString::fromStdString(n.first_date), Qt::ISODate));
    start->setTime(QTime(n.start_min / 60, n.start_min % 60));
    end->setTime(QTime(n.end_min / 60, n.end_min % 60));
    window_info_->setText(tr("Each night's window lasts %1 of local wall-clock time; a window "
                             "whose close is not after its opening ends the next morning. "
                             "Every night opens at the same clock time, also across a "
                             "daylight-saving change.")
                              .arg(duration_text(n.length_s())));
  });
  layout->addWidget(box);
  layout->addStretch(1);
}

}  // namespace gramline::gui
