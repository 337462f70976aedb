#include "job_runner.h"

#include <QThread>
#include <algorithm>

namespace gramline::gui {

JobRunnerBase::JobRunnerBase(int poll_ms, QObject* parent) : QObject(parent) {
  // Two threads at least, so a new job never queues behind the one it has just cancelled.
  pool_.setMaxThreadCount(std::max(2, QThread::idealThreadCount()));
  poll_.setInterval(poll_ms);
  if (poll_ms > 0) {
    connect(&poll_, &QTimer::timeout, this, [this] {
      if (current_) emit progress(current_->fraction->load());
    });
  }
}

JobRunnerBase::~JobRunnerBase() {
  // Earlier jobs had their flags raised when they were superseded. The worker threads hold
  // copies of all they use; still, wait so that none outlives the runner.
  cancel();
  pool_.waitForDone();
}

WorkHooks JobRunnerBase::Ticket::hooks() const {
  WorkHooks hooks;
  hooks.progress = [fraction = fraction](double f) { fraction->store(f); };
  hooks.cancel = cancel.get();
  return hooks;
}

void JobRunnerBase::cancel() {
  if (current_) current_->cancel->store(true);
}

JobRunnerBase::Ticket JobRunnerBase::begin() {
  cancel();
  Ticket ticket;
  ticket.generation = ++generation_;
  ++alive_;
  current_ = std::make_shared<const Ticket>(ticket);
  if (poll_.interval() > 0) poll_.start();
  return ticket;
}

bool JobRunnerBase::end(long generation) {
  --alive_;
  if (generation != generation_) return false;
  current_.reset();
  poll_.stop();
  return true;
}

QString JobRunnerBase::unexpected_error() {
  return tr("The background job stopped with an unexpected error.");
}

}  // namespace gramline::gui
