#pragma once
// The one worker pattern of the app's background jobs (planning, the margin check, ingesting and
// resuming): each job runs on a thread of the runner's own pool with its own cancel flag; the GUI
// thread polls its progress; starting a job raises the flag of the one still running, and only
// the newest job's end (result, error or cancellation) is delivered.
#include <QFutureWatcher>
#include <QObject>
#include <QThreadPool>
#include <QTimer>
#include <QtConcurrent/QtConcurrentRun>
#include <atomic>
#include <exception>
#include <functional>
#include <memory>
#include <optional>
#include <utility>

#include "gramline/progress.h"

namespace gramline::gui {

/// The untyped half of JobRunner: the job's bookkeeping and the signals (moc takes no class
/// templates).
class JobRunnerBase : public QObject {
  Q_OBJECT

 public:
  ~JobRunnerBase() override;

  /// Raises the cancel flag of the running job; cancelled() follows when the job gives up (a
  /// job that finishes first still delivers its result).
  void cancel();
  /// A job has started and its end has not been delivered yet.
  bool busy() const { return current_ != nullptr; }
  /// Jobs whose end has not come back to the GUI thread: the newest and any superseded ones
  /// still stopping.
  int jobs_alive() const { return alive_; }

 signals:
  void started();
  /// The running job's fraction done, polled on the GUI thread.
  void progress(double fraction_done);
  /// The newest job returned; its result is in JobRunner::result().
  void succeeded();
  /// The newest job threw; `message` is the exception's text.
  void failed(const QString& message);
  /// The newest job stopped at its cancel flag.
  void cancelled();

 protected:
  /// `poll_ms` is how often progress() is emitted while a job runs (0: never).
  explicit JobRunnerBase(int poll_ms, QObject* parent);

  /// What one job shares with its worker thread.
  struct Ticket {
    long generation = 0;
    std::shared_ptr<CancelFlag> cancel = std::make_shared<CancelFlag>(false);
    std::shared_ptr<std::atomic<double>> fraction = std::make_shared<std::atomic<double>>(0.0);
    /// The hooks the job hands to the engine: progress into `fraction`, the cancel flag.
    WorkHooks hooks() const;
  };

  /// Starts the bookkeeping of a new job, raising the flag of the one running.
  Ticket begin();
  /// Job `generation` came back; true when it is still the newest (then nothing runs).
  bool end(long generation);
  /// Text for an exception that is not a std::exception.
  static QString unexpected_error();

  QThreadPool pool_;

 private:
  QTimer poll_;
  long generation_ = 0;
  int alive_ = 0;
  std::shared_ptr<const Ticket> current_;
};

/// Runs jobs that produce a `Result`. A job is a function called on a worker thread with the
/// hooks to pass to the engine; it returns the result or throws: Cancelled ends it as
/// cancelled, any other exception as failed with the exception's text.
template <typename Result>
class JobRunner : public JobRunnerBase {
 public:
  using Work = std::function<Result(const WorkHooks& hooks)>;

  explicit JobRunner(int poll_ms = 100, QObject* parent = nullptr)
      : JobRunnerBase(poll_ms, parent) {}

  /// Starts `work` at once; the job running until now is cancelled and its end never delivered.
  void run(Work work);
  /// The result of the newest job that succeeded (nullptr before the first).
  const Result* result() const { return result_ ? &*result_ : nullptr; }

 private:
  struct Outcome {
    std::optional<Result> result;
    QString error;
    bool cancelled = false;
  };

  std::optional<Result> result_;
};

template <typename Result>
void JobRunner<Result>::run(Work work) {
  const Ticket ticket = begin();
  auto* watcher = new QFutureWatcher<Outcome>(this);
  connect(watcher, &QFutureWatcherBase::finished, this, [this, watcher, g = ticket.generation] {
    Outcome outcome = watcher->result();
    watcher->deleteLater();
    if (!end(g)) return;  // a newer job owns what is shown
    if (outcome.result) {
      result_ = std::move(outcome.result);
      emit succeeded();
    } else if (outcome.cancelled) {
      emit cancelled();
    } else {
      emit failed(outcome.error);
    }
  });
  watcher->setFuture(QtConcurrent::run(&pool_, [work = std::move(work), ticket]() -> Outcome {
    Outcome out;
    try {
      ticket.hooks().throw_if_cancelled();  // superseded before it began
      out.result.emplace(work(ticket.hooks()));
    } catch (const Cancelled&) {
      out.cancelled = true;
    } catch (const std::exception& e) {
      out.error = QString::fromStdString(e.what());
    } catch (...) {
      out.error = unexpected_error();
    }
    return out;
  }));
  emit started();
}

}  // namespace gramline::gui
