// SPDX-License-Identifier: MIT
#include "optimiser/analysis/parallel.h"

#include <algorithm>
#include <atomic>
#include <exception>
#include <mutex>
#include <thread>
#include <vector>

namespace stowage {

int resolve_threads(int threads) {
  if (threads > 0) return threads;
  const unsigned cores = std::thread::hardware_concurrency();
  return cores == 0 ? 1 : static_cast<int>(cores);
}

void parallel_for(std::size_t count, int threads, const std::function<void(std::size_t)>& task,
                  const DoneCallback& done) {
  const std::size_t workers =
      std::min<std::size_t>(count, static_cast<std::size_t>(resolve_threads(threads)));
  std::atomic<std::size_t> next{0};
  std::atomic<bool> failed{false};
  std::mutex error_mutex;
  std::size_t error_index = count;
  std::exception_ptr error;
  std::mutex done_mutex;
  std::size_t finished = 0;
  const auto work = [&]() {
    while (!failed.load()) {
      const std::size_t i = next.fetch_add(1);
      if (i >= count) return;
      try {
        task(i);
        if (done) {
          const std::lock_guard<std::mutex> lock(done_mutex);
          done(++finished);
        }
      } catch (...) {
        const std::lock_guard<std::mutex> lock(error_mutex);
        if (i < error_index) {
          error_index = i;
          error = std::current_exception();
        }
        failed.store(true);
      }
    }
  };
  if (workers <= 1) {
    work();
  } else {
    std::vector<std::thread> pool;
    pool.reserve(workers);
    for (std::size_t w = 0; w < workers; ++w) pool.emplace_back(work);
    for (std::thread& t : pool) t.join();
  }
  if (error) std::rethrow_exception(error);
}

}  // namespace stowage
