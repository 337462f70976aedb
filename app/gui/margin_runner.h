#pragma once
// Runs the margin check (a Monte Carlo) on a worker thread after each plan, with progress and
// cancel; a newer plan cancels the check of an older one.
#include <QFutureWatcher>
#include <QObject>
#include <QTimer>
#include <atomic>
#include <memory>
#include <vector>

#include "gramline/campaign.h"
#include "gramline/decision_grid.h"
#include "gramline/margin.h"
#include "gramline/plan.h"

namespace gramline::gui {

struct MarginOutcome {
  std::shared_ptr<const MarginCheck> check;
  std::shared_ptr<const DecisionGrid> grid;
  QString error;
  bool cancelled = false;
};

class MarginRunner : public QObject {
  Q_OBJECT

 public:
  explicit MarginRunner(QObject* parent = nullptr);
  ~MarginRunner() override;

  /// Checks `plan` of `campaign`, cancelling a check still running.
  void start(const Campaign& campaign, std::shared_ptr<const Plan> plan);
  void cancel();
  bool busy() const { return current_ != nullptr; }
  /// Options used for every check (tests lower the trials).
  MarginCheckOptions& options() { return options_; }
  std::shared_ptr<const MarginCheck> check() const { return check_; }
  std::shared_ptr<const DecisionGrid> grid() const { return grid_; }

 signals:
  void started();
  void progress(double fraction_done);
  void finished(std::shared_ptr<const gramline::MarginCheck> check);
  void failed(const QString& message);
  void cancelled();

 private:
  struct Job {
    std::shared_ptr<CancelFlag> cancel;
    std::shared_ptr<std::atomic<double>> fraction;
    QFutureWatcher<MarginOutcome>* watcher = nullptr;
    long generation = 0;
  };

  MarginCheckOptions options_;
  QTimer poll_;
  long generation_ = 0;
  std::shared_ptr<Job> current_;
  std::vector<std::shared_ptr<Job>> alive_;
  std::shared_ptr<const MarginCheck> check_;
  std::shared_ptr<const DecisionGrid> grid_;
};

}  // namespace gramline::gui
