#include "status_indicator.h"

#include <QHBoxLayout>
#include <QLabel>
#include <QProgressBar>
#include <QPushButton>
#include <algorithm>

#include "job_runner.h"

namespace gramline::gui {

namespace {
constexpr int kBarSteps = 1000;
}

StatusIndicator::StatusIndicator(const Look& look, QWidget* parent)
    : QWidget(parent), collapse_(!look.stretch) {
  text_ = new QLabel;
  if (!look.text_name.isEmpty()) text_->setAccessibleName(look.text_name);
  text_->hide();
  bar_ = new QProgressBar;
  bar_->setRange(0, look.measured ? kBarSteps : 0);
  bar_->setMaximumWidth(look.bar_width);
  bar_->setTextVisible(look.percent);
  bar_->setAccessibleName(look.progress_name);
  bar_->hide();
  auto* layout = new QHBoxLayout(this);
  layout->setContentsMargins(0, 0, 0, 0);
  layout->addWidget(text_, look.stretch ? 1 : 0);
  layout->addWidget(bar_);
  if (!look.cancel_text.isEmpty()) {
    cancel_ = new QPushButton(look.cancel_text);
    cancel_->setAccessibleName(look.cancel_name);
    cancel_->hide();
    layout->addWidget(cancel_);
  }
  fit();
}

void StatusIndicator::follow(JobRunnerBase* job) {
  connect(job, &JobRunnerBase::started, this, [this] {
    bar_->setValue(0);
    show_running(true);
  });
  connect(job, &JobRunnerBase::progress, this,
          [this](double f) { bar_->setValue(static_cast<int>(f * kBarSteps)); });
  for (auto end : {&JobRunnerBase::succeeded, &JobRunnerBase::cancelled})
    connect(job, end, this, [this] { show_running(false); });
  connect(job, &JobRunnerBase::failed, this, [this] { show_running(false); });
  if (cancel_) connect(cancel_, &QPushButton::clicked, job, &JobRunnerBase::cancel);
}

void StatusIndicator::set_text(const QString& text) {
  text_->setText(text);
  text_->setVisible(!text.isEmpty());
  fit();
}

QString StatusIndicator::text() const { return text_->text(); }

bool StatusIndicator::running() const { return !bar_->isHidden(); }

QSize StatusIndicator::minimumSizeHint() const {
  QSize size = QWidget::minimumSizeHint();
  for (const QWidget* part : {static_cast<QWidget*>(text_), static_cast<QWidget*>(bar_),
                              static_cast<QWidget*>(cancel_)}) {
    if (!part) continue;
    // What a layout gives the part at the least: its size hint when it may not shrink.
    const bool shrinks = part->sizePolicy().verticalPolicy() & QSizePolicy::ShrinkFlag;
    size.setHeight(std::max(
        size.height(), shrinks ? part->minimumSizeHint().height() : part->sizeHint().height()));
  }
  return size;
}

void StatusIndicator::show_running(bool running) {
  bar_->setVisible(running);
  if (cancel_) cancel_->setVisible(running);
  fit();
}

void StatusIndicator::fit() {
  // A hidden item leaves no gap in the status bar; a shown one, however empty, does.
  if (collapse_) setHidden(text_->isHidden() && bar_->isHidden());
}

}  // namespace gramline::gui
