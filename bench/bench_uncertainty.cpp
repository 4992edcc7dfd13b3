// SPDX-License-Identifier: MIT
// Uncertainty benchmark (issue target: 10,000 samples of the Tarnbeck Saddle study, each an
// exact 20-year evaluation of the eight profiles' best designs, 80,000 evaluations, physical
// and economic inputs varying: under 60 s on 2 threads). One timed run per thread count: a run
// this long averages its own noise; the figures are printed as they come out.
// Then the re-pricing shortcut (scenario.h, model/repricing.h): the study's variations that
// only change prices, drawn alone, timed with the shortcut and with every sample simulated,
// in the same process; the ratio is the speed-up.
#include "bench_uncertainty.h"

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <string>
#include <vector>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/scenario.h"
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

  std::vector<Variation> prices;
  for (const Variation& v : loaded.variations) {
    if (v.distribution && prices_only(loaded.study, {v.path})) prices.push_back(v);
  }
  if (prices.empty()) {
    std::printf("re-pricing: the study draws no price-only input, nothing to compare\n");
    return;
  }
  const std::size_t n = std::min<std::size_t>(samples, 1000);
  std::printf(
      "\nre-pricing shortcut: %zu samples of the study's %zu price-only inputs, designs held, "
      "2 threads\n| run | time | samples/s |\n|---|---|---|\n",
      n, prices.size());
  double seconds[2] = {0, 0};
  for (bool reprice : {false, true}) {
    UncertaintyOptions options;
    options.samples = n;
    options.seed = 7;
    options.threads = 2;
    options.reprice_when_prices_only = reprice;
    const auto start = std::chrono::steady_clock::now();
    const UncertaintyResult r = run_uncertainty(loaded.study, prices, options);
    const double s =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    seconds[reprice ? 1 : 0] = s;
    std::printf("| %s | %.2f s | %.0f |\n", reprice ? "re-priced" : "simulated", s,
                static_cast<double>(r.samples) / s);
  }
  std::printf("re-priced / simulated time: %.3f (speed-up %.1fx)\n", seconds[1] / seconds[0],
              seconds[0] / seconds[1]);
}

}  // namespace stowage::bench
