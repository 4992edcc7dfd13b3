// SPDX-License-Identifier: MIT
#pragma once

#include <cstddef>

namespace stowage::bench {
// A re-optimising 1-D sweep of the Tarnbeck Saddle study: `points` grid values of the
// sodium-ion capital price across its variation (low to high), each point optimised afresh,
// on 2 threads; three timed runs, their median, and points per second.
void run_sweep_benchmarks(std::size_t points);
}  // namespace stowage::bench
