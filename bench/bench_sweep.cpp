// SPDX-License-Identifier: MIT
// Sweep benchmark (issue target: a 100-point re-optimising sweep in under 20 s). The grid is
// the one `stowage sweep --grid PATH --steps 100` runs (run_grid: the base case optimised once,
// then every point optimised on the changed study); the sodium-ion capital price moves every
// profile's ranking at Tarnbeck Saddle, so the points do not all settle alike. Three timed
// runs in one process, the median printed against the target.
#include "bench_sweep.h"

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <string>
#include <vector>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/sweep.h"

namespace stowage::bench {

void run_sweep_benchmarks(std::size_t points) {
  const std::string path = std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml";
  const std::string input = "profiles.sodium-ion.costs.capital_per_kwh";
  const LoadedStudy loaded = load_study_details_file(path);
  const Variation* axis = nullptr;
  for (const Variation& v : loaded.variations) {
    if (v.path == input) axis = &v;
  }
  if (!axis) {
    std::printf("\nsweep: studies/tarnbeck-saddle has no variation of %s, nothing to time\n",
                input.c_str());
    return;
  }
  SweepOptions options;
  options.threads = 2;
  options.steps = static_cast<int>(points);
  const std::size_t n = axis_values(*axis, options.steps).size();
  std::printf(
      "\nsweep: %zu-point 1-D grid of %s (%g to %g) over studies/tarnbeck-saddle, every point "
      "re-optimised, 2 threads\n| run | time | points/s | winner changes along the grid |\n"
      "|---|---|---|---|\n",
      n, input.c_str(), axis->low, axis->high);
  std::vector<double> seconds;
  for (int run = 1; run <= 3; ++run) {
    const auto start = std::chrono::steady_clock::now();
    const GridResult r = run_grid(loaded.study, {*axis}, options);
    const double s =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    seconds.push_back(s);
    int changes = 0;
    for (std::size_t i = 1; i < r.points.size(); ++i) {
      const bool a = r.points[i - 1].feasible(), b = r.points[i].feasible();
      if (a != b || (a && r.points[i - 1].winner().profile_id != r.points[i].winner().profile_id))
        ++changes;
    }
    std::printf("| %d | %.2f s | %.1f | %d |\n", run, s, static_cast<double>(n) / s, changes);
  }
  std::sort(seconds.begin(), seconds.end());
  std::printf("median of 3: %.2f s, %.1f points/s (target: 100 points in under 20 s: %s)\n",
              seconds[1], static_cast<double>(n) / seconds[1],
              n == 100 ? (seconds[1] < 20 ? "met" : "not met") : "another point count");
}

}  // namespace stowage::bench
