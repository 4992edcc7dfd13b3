// SPDX-License-Identifier: MIT
// parallel_for(): runs task(i) for i = 0..count-1 on `threads` std::threads that take indices
// from a shared counter. Each task must write only to its own slot of the caller's result, so
// the results do not depend on the thread count or on which thread ran which index.
// An exception thrown by a task stops the hand-out of further indices; after every thread has
// joined, the exception of the lowest failing index is rethrown (the same one for any thread
// count, given that every index below it ran). threads <= 0 means all cores
// (std::thread::hardware_concurrency, at least 1); never more threads than tasks.
// `done`, when given, is called after each task that returned, with the number of tasks
// finished so far, one call at a time (under a lock), from whichever thread ran the task; it
// is for progress display and must not touch the results.
#pragma once

#include <cstddef>
#include <functional>

namespace stowage {

int resolve_threads(int threads);
using DoneCallback = std::function<void(std::size_t done)>;
void parallel_for(std::size_t count, int threads, const std::function<void(std::size_t)>& task,
                  const DoneCallback& done = {});

}  // namespace stowage
