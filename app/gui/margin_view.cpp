#include "margin_view.h"

#include <QChart>
#include <QChartView>
#include <QLabel>
#include <QScatterSeries>
#include <QVBoxLayout>
#include <QValueAxis>

#include "chart_style.h"

namespace gramline::gui {

MarginView::MarginView(QWidget* parent) : QWidget(parent) {
  status_ = new QLabel;
  status_->setWordWrap(true);
  status_->setAccessibleName(tr("Margin check status"));
  points_view_ = new QChartView;
  points_view_->setRenderHint(QPainter::Antialiasing);
  points_view_->setAccessibleName(tr("Data in two dimensions"));
  auto* layout = new QVBoxLayout(this);
  layout->addWidget(status_);
  layout->addWidget(points_view_, 1);
  status_->setText(
      tr("<b>Margin check not computed.</b> This build has no margin check yet; "
         "the chart shows the data only. The check will tell whether the "
         "classifier trained on the measured kernel keeps its decisions despite "
         "the predicted noise."));
}

void MarginView::set_campaign(const Campaign& campaign) {
  campaign_ = campaign;
  draw_points();
}

void MarginView::set_plan(std::shared_ptr<const Plan>, const Campaign& campaign) {
  campaign_ = campaign;
  draw_points();
}

QString MarginView::status_text() const { return status_->text(); }

void MarginView::draw_points() {
  auto* chart = new QChart;
  const DataSet& d = campaign_.data;
  if (d.feature_count() >= 1 && d.train_count() > 0) {
    const int fx = 0, fy = d.feature_count() >= 2 ? 1 : 0;
    const QString name_x = QString::fromStdString(
        fx < static_cast<int>(d.feature_names.size()) ? d.feature_names[fx] : "x0");
    const QString name_y = QString::fromStdString(
        fy < static_cast<int>(d.feature_names.size()) ? d.feature_names[fy] : "x1");
    chart->setTitle(d.feature_count() > 2
                        ? tr("Points by their first two features (of %1)").arg(d.feature_count())
                        : tr("Points"));
    const auto series = [](const QString& name, const QColor& colour,
                           QScatterSeries::MarkerShape shape, double size) {
      auto* s = new QScatterSeries;
      s->setName(name);
      s->setColor(colour);
      s->setBorderColor(colour.darker(140));
      s->setMarkerShape(shape);
      s->setMarkerSize(size);
      return s;
    };
    const QString pos = QString::fromStdString(d.positive_name);
    const QString neg = QString::fromStdString(d.negative_name);
    auto* train_pos = series(tr("training, %1").arg(pos), work_colour::park(),
                             QScatterSeries::MarkerShapeCircle, 10);
    auto* train_neg = series(tr("training, %1").arg(neg), work_colour::reference(),
                             QScatterSeries::MarkerShapeRectangle, 9);
    QColor pos_light = work_colour::park(), neg_light = work_colour::reference();
    pos_light.setAlphaF(0.35);
    neg_light.setAlphaF(0.35);
    auto* test_pos =
        series(tr("test, %1").arg(pos), pos_light, QScatterSeries::MarkerShapeTriangle, 12);
    auto* test_neg =
        series(tr("test, %1").arg(neg), neg_light, QScatterSeries::MarkerShapeTriangle, 12);
    double xmin = 1e300, xmax = -1e300, ymin = 1e300, ymax = -1e300;
    const auto add = [&](QScatterSeries* s, double x, double y) {
      s->append(x, y);
      xmin = std::min(xmin, x);
      xmax = std::max(xmax, x);
      ymin = std::min(ymin, y);
      ymax = std::max(ymax, y);
    };
    for (int i = 0; i < d.train_count(); ++i)
      add(d.train_labels(i) > 0 ? train_pos : train_neg, d.train(i, fx), d.train(i, fy));
    for (int i = 0; i < d.test_count(); ++i)
      add(d.test_labels(i) > 0 ? test_pos : test_neg, d.test(i, fx), d.test(i, fy));
    auto* ax = new QValueAxis;
    auto* ay = new QValueAxis;
    const double px = 0.05 * std::max(1e-9, xmax - xmin), py = 0.05 * std::max(1e-9, ymax - ymin);
    ax->setRange(xmin - px, xmax + px);
    ay->setRange(ymin - py, ymax + py);
    ax->setTitleText(name_x);
    ay->setTitleText(name_y);
    chart->addAxis(ax, Qt::AlignBottom);
    chart->addAxis(ay, Qt::AlignLeft);
    for (QScatterSeries* s : {train_pos, train_neg, test_pos, test_neg}) {
      chart->addSeries(s);
      s->attachAxis(ax);
      s->attachAxis(ay);
    }
    chart->legend()->setAlignment(Qt::AlignRight);
  } else {
    chart->setTitle(tr("No data"));
  }
  style_chart(chart, palette());
  QChart* old = points_view_->chart();
  points_view_->setChart(chart);
  delete old;
}

}  // namespace gramline::gui
