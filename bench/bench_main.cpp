// SPDX-License-Identifier: MIT
// `cmake --build build --target bench`: speed figures of the model and the optimiser.
//
// Model: hour-steps per second of dispatch plus rainflow ageing on one core, measured on a
// 20-year evaluation of the Tarnbeck Saddle demo study, and the same figure as a ratio to a
// baseline run in the same process (one pass summing the hourly series, the least any hourly
// simulation must do), so the number means something on any machine.
// Target: at least 20 million hour-steps per second (one 20-year design well under 10 ms).
#include <chrono>
#include <cstdio>
#include <string>

#include "bench_optimise.h"
#include "catalog-schema/study_loader.h"
#include "model/lifecycle.h"

namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point start) {
  return std::chrono::duration<double>(Clock::now() - start).count();
}

// Repeats `body` until at least `min_seconds` have passed; returns seconds per call.
template <typename F>
double time_per_call(F&& body, double min_seconds = 1.0) {
  long calls = 0;
  const auto start = Clock::now();
  double elapsed = 0;
  do {
    body();
    ++calls;
    elapsed = seconds_since(start);
  } while (elapsed < min_seconds);
  return elapsed / static_cast<double>(calls);
}

volatile double g_sink = 0;  // keeps the optimiser from removing measured work

}  // namespace

int main() {
  const std::string path = std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml";
  const stowage::Study study = stowage::load_study_file(path);
  const stowage::ChemistryProfile* profile = &study.profiles[study.find_profile("lfp").value_or(0)];
  stowage::Economics econ = study.economics;
  econ.project_years = 20;

  std::printf("stowage bench (one core)\n");
  std::printf("model: 20-year lifecycle of '%s' at DoD %.2f on %s\n", profile->id.c_str(),
              profile->dod.default_setpoint, study.site.name.c_str());

  stowage::LifecycleEvaluator evaluator(*profile, study.site, econ);
  // The design the study itself evaluates for this profile (autonomy-sized by default).
  int design_strings = 1;
  for (const auto& d : stowage::resolve_designs(study))
    if (&study.profiles[d.profile_index] == profile) design_strings = d.strings_parallel;

  const double eval_s = time_per_call([&] {
    g_sink = g_sink + evaluator.evaluate(profile->dod.default_setpoint, design_strings).npc;
  });
  const double hour_steps = 20.0 * stowage::kHoursPerYear;

  // Baseline: one pass over the same hourly series per simulated hour.
  const auto& load = study.site.load_kw;
  const auto& source = study.site.source_kw;
  const auto& temp = study.site.temp_c;
  const double base_s = time_per_call([&] {
    double sum = 0;
    for (int year = 0; year < 20; ++year)
      for (std::size_t h = 0; h < load.size(); ++h) sum += load[h] - source[h] + 1e-3 * temp[h];
    g_sink = g_sink + sum;
  });

  std::printf("  one 20-year evaluation:          %8.3f ms\n", eval_s * 1e3);
  std::printf("  dispatch + rainflow + ageing:    %8.1f million hour-steps/s (target >= 20)\n",
              hour_steps / eval_s / 1e6);
  std::printf("  baseline pass over the series:   %8.1f million hour-steps/s\n",
              hour_steps / base_s / 1e6);
  std::printf("  cost relative to the baseline:   %8.1f x\n", eval_s / base_s);

  stowage::bench::run_optimise_benchmarks();
  return 0;
}
