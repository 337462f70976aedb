#include "gramline/parallel.h"

#include <algorithm>
#include <atomic>
#include <exception>
#include <mutex>
#include <thread>
#include <vector>

namespace gramline {

int loop_thread_count(int requested, int iterations) {
  const int threads =
      requested > 0 ? requested : static_cast<int>(std::thread::hardware_concurrency());
  return std::clamp(threads, 1, std::max(1, iterations));
}

void parallel_for(int iterations, int threads, const WorkHooks& hooks,
                  const std::function<void(int)>& body) {
  parallel_for(iterations, threads, hooks, [&body](int i, int) { body(i); });
}

void parallel_for(int iterations, int threads, const WorkHooks& hooks,
                  const std::function<void(int, int)>& body) {
  if (iterations <= 0) {
    hooks.throw_if_cancelled();
    return;
  }
  const int workers = loop_thread_count(threads, iterations);
  std::atomic<int> next{0}, done{0};
  std::atomic<bool> stop{false};
  std::exception_ptr failure;
  std::mutex failure_mutex;
  auto work = [&](int worker) {
    const bool caller = worker == 0;
    try {
      for (;;) {
        if (stop.load(std::memory_order_relaxed)) return;
        if (hooks.cancelled()) {
          stop = true;
          return;
        }
        const int i = next.fetch_add(1);
        if (i >= iterations) return;
        body(i, worker);
        const int finished = done.fetch_add(1) + 1;
        if (caller) hooks.report(static_cast<double>(finished) / iterations);
      }
    } catch (...) {
      std::lock_guard<std::mutex> lock(failure_mutex);
      if (!failure) failure = std::current_exception();
      stop = true;
    }
  };
  std::vector<std::thread> pool;
  for (int k = 1; k < workers; ++k) pool.emplace_back(work, k);
  work(0);
  for (std::thread& th : pool) th.join();
  if (failure) std::rethrow_exception(failure);
  hooks.throw_if_cancelled();
}

}  // namespace gramline
