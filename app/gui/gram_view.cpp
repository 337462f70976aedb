#include "gram_view.h"

#include <QComboBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QMouseEvent>
#include <QPainter>
#include <QToolTip>
#include <QVBoxLayout>
#include <algorithm>
#include <cmath>

#include "chart_style.h"
#include "gui_text.h"

namespace gramline::gui {

HeatmapWidget::HeatmapWidget(const QString& title, QWidget* parent)
    : QWidget(parent), title_(title) {
  setMouseTracking(true);
  setMinimumSize(200, 220);
  setAccessibleName(title);
  setSizePolicy(QSizePolicy::Expanding, QSizePolicy::Expanding);
}

void HeatmapWidget::set_matrix(const Eigen::MatrixXd& values, double low, double high,
                               std::function<QString(double)> scale_text, CellText cell_text) {
  rows_ = static_cast<int>(values.rows());
  cols_ = static_cast<int>(values.cols());
  low_ = low;
  high_ = high > low ? high : low + 1.0;
  scale_text_ = std::move(scale_text);
  cell_text_ = std::move(cell_text);
  image_ = QImage(cols_, rows_, QImage::Format_RGB32);
  for (int r = 0; r < rows_; ++r) {
    auto* line = reinterpret_cast<QRgb*>(image_.scanLine(r));
    for (int c = 0; c < cols_; ++c)
      line[c] = heat_colour((values(r, c) - low_) / (high_ - low_)).rgb();
  }
  update();
}

void HeatmapWidget::clear_matrix() {
  rows_ = cols_ = 0;
  image_ = QImage();
  update();
}

QRect HeatmapWidget::map_rect() const {
  const int title_h = fontMetrics().height() + 6;
  const int bar_h = fontMetrics().height() * 2 + 14;
  const QRect area = rect().adjusted(4, title_h, -4, -bar_h);
  if (rows_ == 0 || cols_ == 0 || area.width() <= 0 || area.height() <= 0) return {};
  // Square cells, as large as fit.
  const double cell = std::min(double(area.width()) / cols_, double(area.height()) / rows_);
  const int w = static_cast<int>(cell * cols_);
  const int h = static_cast<int>(cell * rows_);
  return QRect(area.left() + (area.width() - w) / 2, area.top(), w, h);
}

QPoint HeatmapWidget::cell_at(const QPoint& pos) const {
  const QRect r = map_rect();
  if (!r.contains(pos)) return {-1, -1};
  const int col = std::min(cols_ - 1, (pos.x() - r.left()) * cols_ / std::max(1, r.width()));
  const int row = std::min(rows_ - 1, (pos.y() - r.top()) * rows_ / std::max(1, r.height()));
  return {col, row};
}

void HeatmapWidget::paintEvent(QPaintEvent*) {
  QPainter p(this);
  p.fillRect(rect(), palette().color(QPalette::Base));
  p.setPen(palette().color(QPalette::Text));
  QFont bold = font();
  bold.setBold(true);
  p.setFont(bold);
  p.drawText(QRect(0, 2, width(), fontMetrics().height() + 2), Qt::AlignHCenter, title_);
  p.setFont(font());
  const QRect r = map_rect();
  if (r.isEmpty()) return;
  p.drawImage(r, image_);  // nearest-neighbour: one cell per entry stays sharp
  {
    // Class boundaries of a grouped order, in the text colour over a halo of the base.
    const double cw = double(r.width()) / cols_, ch = double(r.height()) / rows_;
    for (const QColor& c : {palette().color(QPalette::Base), palette().color(QPalette::Text)}) {
      p.setPen(QPen(c, c == palette().color(QPalette::Base) ? 3.0 : 1.0));
      for (int b : row_breaks_)
        p.drawLine(QPointF(r.left(), r.top() + b * ch), QPointF(r.right() + 1, r.top() + b * ch));
      for (int b : col_breaks_)
        p.drawLine(QPointF(r.left() + b * cw, r.top()), QPointF(r.left() + b * cw, r.bottom() + 1));
    }
  }
  if (hover_.x() >= 0) {
    const double cw = double(r.width()) / cols_, ch = double(r.height()) / rows_;
    p.setPen(QPen(palette().color(QPalette::Highlight), 2));
    p.setBrush(Qt::NoBrush);
    p.drawRect(QRectF(r.left() + hover_.x() * cw, r.top() + hover_.y() * ch, cw, ch));
  }
  // Colour bar with its two ends labelled.
  const int bar_top = r.bottom() + 8;
  const QRect bar(r.left(), bar_top, r.width(), 10);
  for (int x = 0; x < bar.width(); ++x) {
    p.setPen(heat_colour(double(x) / std::max(1, bar.width() - 1)));
    p.drawLine(bar.left() + x, bar.top(), bar.left() + x, bar.bottom());
  }
  p.setPen(palette().color(QPalette::Text));
  const QRect labels(bar.left(), bar.bottom() + 2, bar.width(), fontMetrics().height());
  if (scale_text_) {
    p.drawText(labels, Qt::AlignLeft, scale_text_(low_));
    p.drawText(labels, Qt::AlignRight, scale_text_(high_));
  }
}

void HeatmapWidget::mouseMoveEvent(QMouseEvent* event) {
  const QPoint cell = cell_at(event->position().toPoint());
  if (cell != hover_) {
    hover_ = cell;
    update();
    if (hover_callback_) hover_callback_(cell.y(), cell.x());
  }
  if (cell.x() >= 0 && cell_text_) {
    QToolTip::showText(event->globalPosition().toPoint(), cell_text_(cell.y(), cell.x()), this);
  } else {
    QToolTip::hideText();
  }
}

void HeatmapWidget::leaveEvent(QEvent*) {
  hover_ = {-1, -1};
  update();
  if (hover_callback_) hover_callback_(-1, -1);
}

void HeatmapWidget::set_breaks(std::vector<int> rows, std::vector<int> cols) {
  row_breaks_ = std::move(rows);
  col_breaks_ = std::move(cols);
  update();
}

GramView::GramView(QWidget* parent) : QWidget(parent) {
  block_ = new QComboBox;
  block_->addItem(tr("Training × training (the Gram matrix)"));
  block_->addItem(tr("Test × training (for predictions)"));
  block_->setAccessibleName(tr("Block of the kernel shown"));
  kernel_ = new HeatmapWidget(tr("Ideal kernel"));
  sigma_ = new HeatmapWidget(tr("Predicted σ per entry"));
  pairs_ = new HeatmapWidget(tr("Planned pairs per entry"));
  order_ = new QComboBox;
  order_->addItem(tr("file order"));
  order_->addItem(tr("grouped by class"));
  order_->setCurrentIndex(1);
  order_->setAccessibleName(tr("Order of the points in the maps"));
  details_ = new QLabel(hover_hint());
  details_->setTextFormat(Qt::RichText);
  details_->setWordWrap(true);
  details_->setAccessibleName(tr("Entry under the pointer"));
  details_->setMinimumHeight(fontMetrics().height() * 3);
  note_ = new QLabel(tr(
      "Rows: the point prepared; columns: the training point analysed. "
      "“Grouped by class” puts all points of one class first, a line between the classes; the pale "
      "diagonal of σ and pairs is not measured (it is 1 by construction). Darker "
      "is larger on every map."));
  note_->setWordWrap(true);
  note_->setForegroundRole(QPalette::PlaceholderText);

  auto* top = new QHBoxLayout;
  top->addWidget(new QLabel(tr("Show")));
  top->addWidget(block_);
  top->addSpacing(12);
  top->addWidget(new QLabel(tr("Points in")));
  top->addWidget(order_);
  top->addStretch(1);
  auto* maps = new QHBoxLayout;
  maps->addWidget(kernel_);
  maps->addWidget(sigma_);
  maps->addWidget(pairs_);
  auto* layout = new QVBoxLayout(this);
  layout->addLayout(top);
  layout->addLayout(maps, 1);
  layout->addWidget(details_);
  layout->addWidget(note_);
  connect(block_, &QComboBox::currentIndexChanged, this, [this] { redraw(); });
  connect(order_, &QComboBox::currentIndexChanged, this, [this] { redraw(); });
  for (HeatmapWidget* h : {kernel_, sigma_, pairs_}) {
    h->set_hover_callback([this](int r, int c) {
      details_->setText(
          r >= 0 ? entry_text(r, c).replace(QStringLiteral("<br>"), QStringLiteral(" · "))
                 : hover_hint());
    });
  }
}

QString GramView::hover_hint() const {
  return tr("Hover over an entry to see its values, the step that measures it and when.");
}

void GramView::set_plan(std::shared_ptr<const Plan> plan, const Campaign& campaign) {
  plan_ = std::move(plan);
  nights_ = campaign.nights;
  train_count_ = campaign.data.train_count();
  train_labels_ = campaign.data.train_labels;
  test_labels_ = campaign.data.test_labels;
  redraw();
}

Eigen::MatrixXd GramView::ordered(const Eigen::MatrixXd& m) const {
  Eigen::MatrixXd out(static_cast<Eigen::Index>(row_order_.size()),
                      static_cast<Eigen::Index>(col_order_.size()));
  for (std::size_t r = 0; r < row_order_.size(); ++r)
    for (std::size_t c = 0; c < col_order_.size(); ++c)
      out(static_cast<Eigen::Index>(r), static_cast<Eigen::Index>(c)) =
          m(row_order_[r], col_order_[c]);
  return out;
}

QString GramView::entry_text(int display_row, int display_col) const {
  if (!plan_ || display_row < 0 || display_col < 0) return {};
  if (static_cast<std::size_t>(display_row) >= row_order_.size() ||
      static_cast<std::size_t>(display_col) >= col_order_.size())
    return {};
  const int row = row_order_[static_cast<std::size_t>(display_row)];
  const int col = col_order_[static_cast<std::size_t>(display_col)];
  const bool train = block_->currentIndex() == 0;
  const Eigen::MatrixXd& k = train ? plan_->kernel_train : plan_->kernel_test;
  const Eigen::MatrixXd& s = train ? plan_->sigma_train : plan_->sigma_test;
  const Eigen::MatrixXd& n = train ? plan_->pairs_train : plan_->pairs_test;
  const Eigen::MatrixXi& step_of = train ? plan_->step_of_train : plan_->step_of_test;
  if (row >= k.rows() || col >= k.cols()) return {};
  const int row_point = train ? row : train_count_ + row;
  QString text = tr("<b>Entry (%1, %2)</b><br>kernel %3<br>σ %4<br>%5 pairs")
                     .arg(train ? tr("train %1").arg(row_point) : tr("test %1").arg(row_point))
                     .arg(tr("train %1").arg(col))
                     .arg(number_text(k(row, col), 4))
                     .arg(number_text(s(row, col), 5))
                     .arg(count_text(n(row, col)));
  const int step = step_of(row, col);
  if (step >= 0 && static_cast<std::size_t>(step) < plan_->steps.size()) {
    const Step& st = plan_->steps[static_cast<std::size_t>(step)];
    text += tr("<br>step %1, night %2, %3")
                .arg(step)
                .arg(st.night)
                .arg(clock_text(nights_, st.start_s));
  } else if (train && row == col) {
    text += tr("<br>diagonal: 1 by construction (reference steps)");
  } else {
    text += tr("<br>not measured");
  }
  return text;
}

void GramView::fill_orders() {
  const bool train = block_->currentIndex() == 0;
  const bool grouped = order_->currentIndex() == 1;
  const int rows = train ? static_cast<int>(plan_->kernel_train.rows())
                         : static_cast<int>(plan_->kernel_test.rows());
  const int cols = static_cast<int>(plan_->kernel_train.cols());
  // Stable: within a class the points keep their file order. Class +1 first.
  const auto order = [grouped](int count, const Eigen::VectorXi& labels) {
    std::vector<int> o(static_cast<std::size_t>(count));
    for (int i = 0; i < count; ++i) o[static_cast<std::size_t>(i)] = i;
    if (grouped && labels.size() == count) {
      std::stable_sort(o.begin(), o.end(),
                       [&labels](int a, int b) { return (labels(a) > 0) && !(labels(b) > 0); });
    }
    return o;
  };
  row_order_ = order(rows, train ? train_labels_ : test_labels_);
  col_order_ = order(cols, train_labels_);
}

std::vector<int> GramView::class_breaks(const std::vector<int>& order,
                                        const Eigen::VectorXi& labels) {
  std::vector<int> out;
  for (std::size_t i = 1; i < order.size(); ++i)
    if (labels.size() > std::max(order[i], order[i - 1]) &&
        (labels(order[i]) > 0) != (labels(order[i - 1]) > 0))
      out.push_back(static_cast<int>(i));
  return out;
}

void GramView::redraw() {
  if (!plan_) {
    row_order_.clear();
    col_order_.clear();
    kernel_->clear_matrix();
    sigma_->clear_matrix();
    pairs_->clear_matrix();
    return;
  }
  fill_orders();
  const bool train = block_->currentIndex() == 0;
  const Eigen::MatrixXd k = ordered(train ? plan_->kernel_train : plan_->kernel_test);
  const Eigen::MatrixXd s = ordered(train ? plan_->sigma_train : plan_->sigma_test);
  const Eigen::MatrixXd n = ordered(train ? plan_->pairs_train : plan_->pairs_test);
  const auto text = [this](int r, int c) { return entry_text(r, c); };
  // Thin lines where the class changes, when the points are grouped.
  std::vector<int> row_breaks, col_breaks;
  if (order_->currentIndex() == 1) {
    row_breaks = class_breaks(row_order_, train ? train_labels_ : test_labels_);
    col_breaks = class_breaks(col_order_, train_labels_);
  }
  for (HeatmapWidget* h : {kernel_, sigma_, pairs_}) h->set_breaks(row_breaks, col_breaks);
  kernel_->set_matrix(
      k, 0.0, 1.0, [](double v) { return number_text(v, 1); }, text);
  const double s_max = s.size() ? s.maxCoeff() : 1.0;
  sigma_->set_matrix(
      s, 0.0, s_max, [](double v) { return number_text(v, 4); }, text);
  // Pairs: the diagonal holds 0 (not measured); start the scale at the smallest measured entry.
  double n_min = 0.0, n_max = n.size() ? n.maxCoeff() : 1.0;
  bool first = true;
  for (Eigen::Index r = 0; r < n.rows(); ++r)
    for (Eigen::Index c = 0; c < n.cols(); ++c)
      if (n(r, c) > 0 && (first || n(r, c) < n_min)) {
        n_min = n(r, c);
        first = false;
      }
  if (n_max <= n_min) n_min = 0.0;
  pairs_->set_matrix(
      n, n_min, n_max, [](double v) { return count_text(v); }, text);
}

QString GramView::details() const { return details_->text(); }

}  // namespace gramline::gui
