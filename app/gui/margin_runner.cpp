#include "margin_runner.h"

#include <QtConcurrent/QtConcurrentRun>
#include <algorithm>
#include <exception>

#include "gramline/decision_grid.h"

namespace gramline::gui {

MarginRunner::MarginRunner(QObject* parent) : QObject(parent) {
  // Leave one core to the GUI and the planner.
  options_.threads = std::max(1, QThread::idealThreadCount() - 1);
  poll_.setInterval(150);
  connect(&poll_, &QTimer::timeout, this, [this] {
    if (current_) emit progress(current_->fraction->load());
  });
}

MarginRunner::~MarginRunner() {
  for (const auto& job : alive_) job->cancel->store(true);
  for (const auto& job : alive_) job->watcher->waitForFinished();
}

void MarginRunner::cancel() {
  if (current_) current_->cancel->store(true);
}

void MarginRunner::start(const Campaign& campaign, std::shared_ptr<const Plan> plan) {
  if (current_) current_->cancel->store(true);
  auto job = std::make_shared<Job>();
  job->cancel = std::make_shared<CancelFlag>(false);
  job->fraction = std::make_shared<std::atomic<double>>(0.0);
  job->generation = ++generation_;
  job->watcher = new QFutureWatcher<MarginOutcome>(this);
  current_ = job;
  alive_.push_back(job);

  MarginCheckOptions options = options_;
  const auto cancel = job->cancel;
  const auto fraction = job->fraction;
  connect(job->watcher, &QFutureWatcher<MarginOutcome>::finished, this, [this, job] {
    const MarginOutcome outcome = job->watcher->result();
    job->watcher->deleteLater();
    alive_.erase(std::remove(alive_.begin(), alive_.end(), job), alive_.end());
    if (job->generation != generation_) return;
    current_.reset();
    poll_.stop();
    if (outcome.check) {
      check_ = outcome.check;
      grid_ = outcome.grid;
      emit finished(check_);
    } else if (outcome.cancelled) {
      emit cancelled();
    } else {
      emit failed(outcome.error);
    }
  });
  job->watcher->setFuture(QtConcurrent::run([campaign, plan, options, cancel,
                                             fraction]() mutable -> MarginOutcome {
    MarginOutcome out;
    try {
      options.hooks.progress = [fraction](double f) { fraction->store(f); };
      options.hooks.cancel = cancel.get();
      out.check = std::make_shared<const MarginCheck>(check_margin(campaign, *plan, options));
      if (campaign.data.feature_count() == 2)
        out.grid = std::make_shared<const DecisionGrid>(decision_grid(campaign, out.check->ideal));
    } catch (const Cancelled&) {
      out.cancelled = true;
    } catch (const std::exception& e) {
      out.error = QString::fromStdString(e.what());
    }
    return out;
  }));
  poll_.start();
  emit started();
}

}  // namespace gramline::gui
