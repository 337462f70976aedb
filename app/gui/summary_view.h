#pragma once
// Summary: the few figures checked before booking the lab.
#include <QHash>
#include <QWidget>
#include <memory>

#include "gramline/campaign.h"
#include "gramline/plan.h"

class QLabel;
class QGridLayout;
class QPlainTextEdit;

namespace gramline::gui {

class FigureGrid;

class SummaryView : public QWidget {
  Q_OBJECT

 public:
  explicit SummaryView(QWidget* parent = nullptr);
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  /// Margin verdict line; empty: the margin check has not been computed.
  void set_margin_verdict(const QString& text, bool pass);
  /// Text of the figure named `key` (tests read the shown numbers through this).
  QString figure(const QString& key) const;
  QString verdict() const;

 private:
  QLabel* verdict_;
  QLabel* margin_verdict_;
  QLabel* plate_warning_;  // plate bias above the target precision
  FigureGrid* figures_;
  QPlainTextEdit* report_;
};

}  // namespace gramline::gui
