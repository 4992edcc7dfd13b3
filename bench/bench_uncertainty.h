// SPDX-License-Identifier: MIT
#pragma once

#include <cstddef>

namespace stowage::bench {
// Monte Carlo over the Tarnbeck Saddle study's variations, designs held fixed: `samples`
// samples of the eight profiles' best designs, each an exact 20-year evaluation, on 1 and on 2
// threads. Prints the times, samples per second and the speed-up.
void run_uncertainty_benchmarks(std::size_t samples);
}  // namespace stowage::bench
