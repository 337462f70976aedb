#pragma once
// Plans the campaign on a worker thread: debounced requests, a cancel flag per job, progress
// polled on the GUI thread, and only the newest job's result delivered.
#include <QFutureWatcher>
#include <QObject>
#include <QTimer>
#include <atomic>
#include <memory>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/plan.h"

namespace gramline::gui {

/// What one planning job produced. Exactly one of plan and error is set unless cancelled.
struct PlanOutcome {
  std::shared_ptr<const Plan> plan;
  QString error;
  bool cancelled = false;
};

class PlanRunner : public QObject {
  Q_OBJECT

 public:
  explicit PlanRunner(QObject* parent = nullptr);
  ~PlanRunner() override;

  /// Plans `campaign` after the debounce delay; a newer request replaces an older one and
  /// cancels a job already running.
  void request(const Campaign& campaign);
  /// Starts at once (no debounce).
  void request_now(const Campaign& campaign);
  /// Raises the cancel flag of the running job and drops a pending request.
  void cancel();

  bool busy() const { return pending_ || running_; }
  void set_debounce_ms(int ms) { debounce_.setInterval(ms); }

  /// The newest finished plan and the campaign it was made from (null before the first).
  std::shared_ptr<const Plan> plan() const { return plan_; }
  const Campaign& planned_campaign() const { return planned_; }

 signals:
  /// A request arrived: what is shown is now out of date.
  void stale();
  void started();
  void progress(double fraction_done);
  void finished(std::shared_ptr<const gramline::Plan> plan);
  void failed(const QString& message);
  void cancelled();

 private:
  struct Job {
    Campaign campaign;
    std::shared_ptr<CancelFlag> cancel;
    std::shared_ptr<std::atomic<double>> fraction;
    QFutureWatcher<PlanOutcome>* watcher = nullptr;
    long generation = 0;
  };

  void start();
  void on_job_done(long generation, const PlanOutcome& outcome, const Campaign& campaign);

  QTimer debounce_;
  QTimer poll_;
  Campaign next_;
  bool pending_ = false;
  bool running_ = false;
  long generation_ = 0;
  std::shared_ptr<Job> current_;
  std::vector<std::shared_ptr<Job>> alive_;  ///< jobs whose threads have not returned yet
  std::shared_ptr<const Plan> plan_;
  Campaign planned_;
};

}  // namespace gramline::gui
