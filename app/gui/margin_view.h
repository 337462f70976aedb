#pragma once
// Margin: the data in two dimensions with the noiseless decision boundary (in any other
// dimension: every point at its decision value) and the test points coloured by flip
// probability; the margin-ratio distribution; the verdict and the minimum
// budget. Every figure comes from the engine's margin check.
#include <QStringList>
#include <QWidget>
#include <memory>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/margin.h"
#include "gramline/plan.h"
#include "margin_runner.h"

class QLabel;
class QPainter;
class QTableWidget;

namespace gramline::gui {

/// The points over the sign of the noiseless decision function, drawn with QPainter.
class DecisionMap : public QWidget {
  Q_OBJECT

 public:
  explicit DecisionMap(QWidget* parent = nullptr);
  void set_content(const Campaign& campaign, std::shared_ptr<const MarginCheck> check,
                   std::shared_ptr<const DecisionGrid> grid);
  QSize sizeHint() const override { return {440, 440}; }

 protected:
  void paintEvent(QPaintEvent* event) override;
  void mouseMoveEvent(QMouseEvent* event) override;

 private:
  QRectF plot_rect() const;
  QPointF to_screen(double x, double y) const;
  /// Two features: the plane with the level lines of f. Otherwise the decision values.
  bool plane_mode() const;
  void paint_plane(QPainter& p);
  void paint_decision_values(QPainter& p);
  QColor flip_fill(int test_index) const;

  Campaign campaign_;
  std::shared_ptr<const MarginCheck> check_;
  std::shared_ptr<const DecisionGrid> grid_;
  QImage shade_;
  double x_low_ = 0, x_high_ = 1, y_low_ = 0, y_high_ = 1;
  std::vector<QPointF> test_screen_;  ///< where each test point was drawn last
};

/// Histogram of the per-run margin ratio with the required ratio marked.
class RatioHistogram : public QWidget {
  Q_OBJECT

 public:
  explicit RatioHistogram(QWidget* parent = nullptr);
  void set_values(std::vector<double> ratios, double threshold);
  QSize sizeHint() const override { return {420, 240}; }

 protected:
  void paintEvent(QPaintEvent* event) override;

 private:
  std::vector<double> ratios_;
  double threshold_ = 0.9;
};

class MarginView : public QWidget {
  Q_OBJECT

 public:
  explicit MarginView(QWidget* parent = nullptr);
  void set_campaign(const Campaign& campaign);
  /// A new plan: its margin check is pending.
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  void set_check(std::shared_ptr<const MarginCheck> check,
                 std::shared_ptr<const DecisionGrid> grid);
  void set_status(const QString& text);
  QString verdict_text() const;

 private:
  void update_legend();
  /// The verdict's reasons in the user's language and number format.
  QStringList reason_texts(const MarginCheck& m) const;

  Campaign campaign_;
  std::shared_ptr<const Plan> plan_;
  std::shared_ptr<const MarginCheck> check_;
  DecisionMap* map_;
  QLabel* legend_;
  QLabel* verdict_;
  QLabel* figures_;
  QLabel* budget_;
  QTableWidget* allocations_;
  RatioHistogram* ratio_view_;
};

}  // namespace gramline::gui
