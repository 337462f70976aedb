#pragma once
// Progress reporting and cancellation shared by every long computation of the engine.
#include <atomic>
#include <functional>
#include <stdexcept>

namespace gramline {

/// Called with a fraction in [0, 1] of the work done. May be empty.
using ProgressFn = std::function<void(double fraction_done)>;

/// Long work polls this flag and stops early (throwing Cancelled) when it becomes true.
using CancelFlag = std::atomic<bool>;

/// Thrown by long work that saw its cancel flag raised.
struct Cancelled : std::runtime_error {
  Cancelled() : std::runtime_error("cancelled") {}
};

/// Bundles the two hooks so options structs can carry them.
struct WorkHooks {
  ProgressFn progress;
  const CancelFlag* cancel = nullptr;
  void report(double fraction) const {
    if (progress) progress(fraction);
  }
  bool cancelled() const { return cancel && cancel->load(std::memory_order_relaxed); }
  void throw_if_cancelled() const {
    if (cancelled()) throw Cancelled();
  }
  /// The same hooks for a part of the work that runs from fraction `from` to `to` of the whole.
  WorkHooks scaled(double from, double to) const {
    WorkHooks part{nullptr, cancel};
    if (progress) part.progress = [p = progress, from, to](double f) { p(from + (to - from) * f); };
    return part;
  }
};

}  // namespace gramline
