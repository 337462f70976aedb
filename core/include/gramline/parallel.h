#pragma once
// The one parallel loop of the engine's Monte Carlo work (margin trials, the Gram-error
// simulation). Iteration i must draw from its own random stream (stream_seed(seed, i),
// random.h) and write only its own result slot; then the results are the same whatever the
// thread count and whichever thread ran which iteration.
#include <functional>

#include "gramline/progress.h"

namespace gramline {

/// Threads a loop of `iterations` runs on: `requested`, or every core the machine reports when
/// `requested` is 0; at least 1 and at most `iterations`.
int loop_thread_count(int requested, int iterations);

/// Runs body(i) once for every i in [0, iterations) on loop_thread_count(threads, iterations)
/// threads (the calling thread among them), handing the indices out one at a time. The cancel
/// flag of `hooks` is polled before each iteration; progress (the fraction of iterations done)
/// is reported from the calling thread only. Once the workers have stopped, the first exception
/// a body threw is rethrown, else Cancelled when the flag was raised.
void parallel_for(int iterations, int threads, const WorkHooks& hooks,
                  const std::function<void(int)>& body);

/// The same loop, telling the body which worker runs it: body(i, worker) with worker in
/// [0, loop_thread_count(threads, iterations)), the calling thread being worker 0. A body may
/// keep scratch space per worker (never results: those go to iteration i's own slot).
void parallel_for(int iterations, int threads, const WorkHooks& hooks,
                  const std::function<void(int, int)>& body);

}  // namespace gramline
