// SPDX-License-Identifier: MIT
// Rainflow cycle counting, ASTM E1049-85 (reapproved 2017) clause 5.4.4, for a history that is
// not repeated: the series is first reduced to its reversals (peaks and valleys, with both ends
// kept as reversals), then the three-point rule counts a range Y as a full cycle when it is not
// the one holding the starting point, or as a half cycle when it is; what remains at the end
// (the residue) is counted as half cycles.
// Each cycle reports its depth (range), mean, count (1 or 0.5) and the indices in the input of
// the two reversals that bound it, so callers can look up conditions over the cycle's span.
#pragma once

#include <cstddef>
#include <vector>

namespace stowage {

struct RainflowCycle {
  double depth = 0;             // range |a - b|, in the series' units
  double mean = 0;              // (a + b) / 2
  double count = 0;             // 1.0 full cycle, 0.5 half cycle
  std::size_t first_index = 0;  // index of the earlier bounding reversal in the input
  std::size_t last_index = 0;   // index of the later bounding reversal
};

// Indices of the reversals of `series[0..n)`; plateaus count once, both ends included.
// Writes into `out` (cleared first) to let hot loops reuse the buffer.
void find_reversals(const double* series, std::size_t n, std::vector<std::size_t>& out);

// Working memory for count_cycles(), reused across calls so hot loops do not allocate.
struct RainflowScratch {
  std::vector<std::size_t> reversals;
  std::vector<std::size_t> stack;
};

// Counts the cycles of `series[0..n)` and calls `sink(const RainflowCycle&)` for each, in the
// order they are closed.
template <typename Sink>
void count_cycles(const double* series, std::size_t n, RainflowScratch& scratch, Sink&& sink);

std::vector<RainflowCycle> rainflow(const std::vector<double>& series);

}  // namespace stowage

#include "model/rainflow_impl.h"
