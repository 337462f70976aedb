#include "figure_grid.h"

#include <QGridLayout>
#include <QLabel>

namespace gramline::gui {

FigureGrid::FigureGrid(int columns, double value_scale, QWidget* parent)
    : QWidget(parent), columns_(columns), value_scale_(value_scale) {
  grid_ = new QGridLayout(this);
  grid_->setHorizontalSpacing(18);
}

QLabel* FigureGrid::add(const QString& key, const QString& title, const QString& help) {
  const int index = static_cast<int>(values_.size());
  const int row = (index / columns_) * 3;
  const int col = index % columns_;
  auto* caption = new QLabel(title);
  caption->setToolTip(help);
  QFont bold = caption->font();
  bold.setBold(true);
  caption->setFont(bold);
  auto* value = new QLabel(QStringLiteral("–"));
  QFont big = value->font();
  big.setPointSizeF(big.pointSizeF() * value_scale_);
  value->setFont(big);
  value->setTextInteractionFlags(Qt::TextSelectableByMouse);
  value->setAccessibleName(title);
  value->setToolTip(help);
  auto* note = new QLabel;
  note->setWordWrap(true);
  note->setForegroundRole(QPalette::PlaceholderText);
  grid_->addWidget(caption, row, col);
  grid_->addWidget(value, row + 1, col);
  grid_->addWidget(note, row + 2, col, Qt::AlignTop);
  grid_->setColumnStretch(col, 1);
  values_.insert(key, value);
  notes_.insert(key, note);
  return value;
}

void FigureGrid::set(const QString& key, const QString& value, const QString& note) {
  if (QLabel* v = values_.value(key)) v->setText(value);
  if (QLabel* n = notes_.value(key)) n->setText(note);
}

void FigureGrid::clear_all() {
  for (QLabel* l : values_) l->setText(QStringLiteral("–"));
  for (QLabel* l : notes_) l->clear();
}

QString FigureGrid::value(const QString& key) const {
  const QLabel* l = values_.value(key);
  return l ? l->text() : QString();
}

}  // namespace gramline::gui
