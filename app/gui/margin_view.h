#pragma once
// Margin: the data in two dimensions and, once the margin check is computed, the decision
// boundary, the flip probability of each test point, the margin-ratio distribution, the verdict
// and the minimum budget.
#include <QWidget>
#include <memory>

#include "gramline/campaign.h"
#include "gramline/plan.h"

class QChartView;
class QLabel;

namespace gramline::gui {

class MarginView : public QWidget {
  Q_OBJECT

 public:
  explicit MarginView(QWidget* parent = nullptr);
  void set_campaign(const Campaign& campaign);
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  QString status_text() const;

 private:
  void draw_points();

  Campaign campaign_;
  QChartView* points_view_;
  QLabel* status_;
};

}  // namespace gramline::gui
