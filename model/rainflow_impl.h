// SPDX-License-Identifier: MIT
// Template body of count_cycles(); see rainflow.h for the contract.
#pragma once

#include <cmath>

namespace stowage {

template <typename Sink>
void count_cycles(const double* series, std::size_t n, RainflowScratch& scratch, Sink&& sink) {
  // The stack holds indices of reversals not yet closed; its bottom element is the current
  // starting point S of clause 5.4.4.
  find_reversals(series, n, scratch.reversals);
  std::vector<std::size_t>& stack = scratch.stack;
  stack.clear();
  auto emit = [&](std::size_t a, std::size_t b, double count) {
    const std::size_t lo = a < b ? a : b, hi = a < b ? b : a;
    RainflowCycle c;
    c.depth = std::fabs(series[a] - series[b]);
    c.mean = 0.5 * (series[a] + series[b]);
    c.count = count;
    c.first_index = lo;
    c.last_index = hi;
    sink(c);
  };
  for (std::size_t r : scratch.reversals) {
    stack.push_back(r);
    while (stack.size() >= 3) {
      const std::size_t k = stack.size();
      const double x = std::fabs(series[stack[k - 1]] - series[stack[k - 2]]);
      const double y = std::fabs(series[stack[k - 2]] - series[stack[k - 3]]);
      if (x < y) break;
      if (k == 3) {
        // Y holds the starting point: half cycle, and the start moves on.
        emit(stack[0], stack[1], 0.5);
        stack.erase(stack.begin());
      } else {
        emit(stack[k - 3], stack[k - 2], 1.0);
        stack[k - 3] = stack[k - 1];
        stack.resize(k - 2);
      }
    }
  }
  for (std::size_t i = 0; i + 1 < stack.size(); ++i) emit(stack[i], stack[i + 1], 0.5);
}

}  // namespace stowage
