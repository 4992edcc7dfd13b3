// SPDX-License-Identifier: MIT
// The optimiser's benchmarks (bench_optimise.cpp), run by bench_main.cpp after the model's.
#pragma once

namespace stowage::bench {
void run_optimise_benchmarks();
}  // namespace stowage::bench
