// SPDX-License-Identifier: MIT
// Uncertainty benchmark (issue target: 10,000 samples of the Tarnbeck Saddle study, each an
// exact 20-year evaluation of the eight profiles' best designs, 80,000 evaluations, physical
// and economic inputs varying: under 60 s on 2 threads). One timed run per thread count: a run
// this long averages its own noise; the figures are printed as they come out.
#include "bench_uncertainty.h"

#include <chrono>
#include <cstdio>
#include <string>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/uncertainty.h"

namespace stowage::bench {

void run_uncertainty_benchmarks(std::size_t samples) {
  const std::string path = std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml";
  const LoadedStudy loaded = load_study_details_file(path);
  std::printf(
      "\nuncertainty: %zu Monte Carlo samples of studies/tarnbeck-saddle (%zu inputs "
      "drawn, designs held fixed, %zu profiles: %zu exact evaluations)\n",
      samples, loaded.variations.size(), loaded.study.profiles.size(),
      samples * loaded.study.profiles.size());
  std::printf("| threads | time | samples/s | evaluations/s | speed-up |\n|---|---|---|---|---|\n");
  double one_thread_s = 0;
  for (int threads : {1, 2}) {
    UncertaintyOptions options;
    options.samples = samples;
    options.seed = 7;
    options.threads = threads;
    const auto start = std::chrono::steady_clock::now();
    const UncertaintyResult r = run_uncertainty(loaded.study, loaded.variations, options);
    const double s =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    if (threads == 1) one_thread_s = s;
    std::printf(
        "| %d | %.1f s | %.0f | %.0f | %.2fx |\n", threads, s, static_cast<double>(r.samples) / s,
        static_cast<double>(r.samples * loaded.study.profiles.size()) / s, one_thread_s / s);
  }
  std::printf("(target: 10,000 samples in under 60 s on 2 threads)\n");
}

}  // namespace stowage::bench
