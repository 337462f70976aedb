#pragma once
// Gram error: heatmaps of the ideal kernel, the predicted sigma and the planned pairs of every
// entry. Hovering names the entry, the step that measures it and when.
#include <QImage>
#include <QWidget>
#include <functional>
#include <memory>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/plan.h"

class QComboBox;
class QLabel;

namespace gramline::gui {

/// A matrix drawn into a QImage, with a colour bar and a hover text per cell.
class HeatmapWidget : public QWidget {
  Q_OBJECT

 public:
  using CellText = std::function<QString(int row, int col)>;
  using CellHover = std::function<void(int row, int col)>;
  explicit HeatmapWidget(const QString& title, QWidget* parent = nullptr);
  /// `low`..`high` maps onto the colour scale; `scale_text` labels a value on the colour bar.
  void set_matrix(const Eigen::MatrixXd& values, double low, double high,
                  std::function<QString(double)> scale_text, CellText cell_text);
  void clear_matrix();
  /// Lines drawn before these display rows and columns (class changes of a grouped order).
  void set_breaks(std::vector<int> rows, std::vector<int> cols);
  /// Called with the hovered cell (matrix indices, after any reordering), or (-1, -1).
  void set_hover_callback(CellHover hover) { hover_callback_ = std::move(hover); }
  /// Cell under a widget position, or (-1, -1).
  QPoint cell_at(const QPoint& pos) const;
  QString cell_text(int row, int col) const {
    return cell_text_ ? cell_text_(row, col) : QString();
  }
  QSize sizeHint() const override { return {320, 340}; }

 protected:
  void paintEvent(QPaintEvent* event) override;
  void mouseMoveEvent(QMouseEvent* event) override;
  void leaveEvent(QEvent* event) override;

 private:
  QRect map_rect() const;

  QString title_;
  QImage image_;
  int rows_ = 0;
  int cols_ = 0;
  double low_ = 0.0;
  double high_ = 1.0;
  std::function<QString(double)> scale_text_;
  CellText cell_text_;
  CellHover hover_callback_;
  QPoint hover_{-1, -1};
  std::vector<int> row_breaks_, col_breaks_;
};

class GramView : public QWidget {
  Q_OBJECT

 public:
  explicit GramView(QWidget* parent = nullptr);
  void set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign);
  HeatmapWidget* kernel_map() const { return kernel_; }
  HeatmapWidget* sigma_map() const { return sigma_; }
  HeatmapWidget* pairs_map() const { return pairs_; }
  QComboBox* order_box() const { return order_; }
  QComboBox* block_box() const { return block_; }
  /// The line under the maps: the hovered entry, or how to get one.
  QString details() const;
  /// Display order -> matrix index of the rows and columns now shown.
  const std::vector<int>& row_order() const { return row_order_; }
  const std::vector<int>& col_order() const { return col_order_; }

 private:
  void redraw();
  /// Fills row_order_ and col_order_ for the block and order chosen.
  void fill_orders();
  static std::vector<int> class_breaks(const std::vector<int>& order,
                                       const Eigen::VectorXi& labels);
  QString hover_hint() const;
  /// Text for the entry drawn at (row, col) of the (possibly class-ordered) map.
  QString entry_text(int row, int col) const;
  /// The matrix with rows and columns in display order.
  Eigen::MatrixXd ordered(const Eigen::MatrixXd& m) const;

  std::shared_ptr<const Plan> plan_;
  NightWindow nights_;
  int train_count_ = 0;
  QComboBox* block_;
  QComboBox* order_;
  std::vector<int> row_order_;  ///< display row -> matrix row
  std::vector<int> col_order_;  ///< display column -> matrix column
  Eigen::VectorXi train_labels_, test_labels_;
  QLabel* details_;
  HeatmapWidget* kernel_;
  HeatmapWidget* sigma_;
  HeatmapWidget* pairs_;
  QLabel* note_;
};

}  // namespace gramline::gui
