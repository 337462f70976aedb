#include "plan_runner.h"

#include <QtConcurrent/QtConcurrentRun>
#include <algorithm>
#include <exception>

namespace gramline::gui {

PlanRunner::PlanRunner(QObject* parent) : QObject(parent) {
  debounce_.setSingleShot(true);
  debounce_.setInterval(300);
  connect(&debounce_, &QTimer::timeout, this, &PlanRunner::start);
  poll_.setInterval(100);
  connect(&poll_, &QTimer::timeout, this, [this] {
    if (current_) emit progress(current_->fraction->load());
  });
}

PlanRunner::~PlanRunner() {
  // Worker threads hold copies of everything they use; still, wait so none outlives the app.
  for (const auto& job : alive_) job->cancel->store(true);
  for (const auto& job : alive_) job->watcher->waitForFinished();
}

void PlanRunner::request(const Campaign& campaign) {
  next_ = campaign;
  pending_ = true;
  emit stale();
  debounce_.start();
}

void PlanRunner::request_now(const Campaign& campaign) {
  next_ = campaign;
  pending_ = true;
  emit stale();
  debounce_.stop();
  start();
}

void PlanRunner::cancel() {
  debounce_.stop();
  const bool had_pending = pending_;
  pending_ = false;
  if (current_) current_->cancel->store(true);
  if (had_pending && !current_) emit cancelled();
}

void PlanRunner::start() {
  if (!pending_) return;
  pending_ = false;
  if (current_) current_->cancel->store(true);

  auto job = std::make_shared<Job>();
  job->campaign = next_;
  job->cancel = std::make_shared<CancelFlag>(false);
  job->fraction = std::make_shared<std::atomic<double>>(0.0);
  job->generation = ++generation_;
  job->watcher = new QFutureWatcher<PlanOutcome>(this);
  current_ = job;
  alive_.push_back(job);
  running_ = true;

  const Campaign campaign = job->campaign;
  const auto cancel = job->cancel;
  const auto fraction = job->fraction;
  connect(job->watcher, &QFutureWatcher<PlanOutcome>::finished, this, [this, job] {
    const PlanOutcome outcome = job->watcher->result();
    job->watcher->deleteLater();
    alive_.erase(std::remove(alive_.begin(), alive_.end(), job), alive_.end());
    on_job_done(job->generation, outcome, job->campaign);
  });
  job->watcher->setFuture(QtConcurrent::run([campaign, cancel, fraction]() -> PlanOutcome {
    PlanOutcome out;
    try {
      PlanOptions options;
      options.seed = campaign.seed;
      options.hooks.progress = [fraction](double f) { fraction->store(f); };
      options.hooks.cancel = cancel.get();
      const std::string problem = campaign.check_consistency();
      if (!problem.empty()) {
        out.error = QString::fromStdString(problem);
        return out;
      }
      out.plan = std::make_shared<const Plan>(plan_campaign(campaign, options));
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

void PlanRunner::on_job_done(long generation, const PlanOutcome& outcome,
                             const Campaign& campaign) {
  if (generation != generation_) return;  // a newer job owns the views
  current_.reset();
  running_ = false;
  poll_.stop();
  if (outcome.plan) {
    plan_ = outcome.plan;
    planned_ = campaign;
    emit progress(1.0);
    emit finished(plan_);
  } else if (outcome.cancelled) {
    emit cancelled();
  } else {
    emit failed(outcome.error);
  }
}

}  // namespace gramline::gui
