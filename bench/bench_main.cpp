// SPDX-License-Identifier: MIT
// `cmake --build build --target bench`: speed figures of the model and the optimiser.
// `stowage_bench model [FILTER]` runs the model part only (FILTER: designs whose study path and
// profile id contain it), `stowage_bench optimise` the optimiser part, `stowage_bench
// uncertainty [SAMPLES]` the Monte Carlo part (bench_uncertainty.h; default 10,000 samples),
// `stowage_bench sweep [POINTS]` the re-optimising sweep (bench_sweep.h; default 100 points).
//
// Model: for every demo study under studies/ and each of its designs, one 20-year exact
// evaluation (dispatch, rainflow ageing with leg attribution, calendar ageing, replacements,
// cash flows) against the bare-loop baseline (bare_loop.h: the same hour-steps with the SOC
// clamps and a streaming rainflow stack) on the same design, in the same process, on one
// core: the simulator's throughput as a fraction of the baseline's. Medians of 5 timed batches.
// Target (issue of the project): the simulator at >= 50 % of the bare loop.
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <filesystem>
#include <string>
#include <vector>

#include "bare_loop.h"
#include "bench_optimise.h"
#include "bench_sweep.h"
#include "bench_uncertainty.h"
#include "catalog-schema/profile_loader.h"
#include "catalog-schema/study_loader.h"
#include "model/lifecycle.h"

namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point start) {
  return std::chrono::duration<double>(Clock::now() - start).count();
}

// Median over 5 batches, each repeating `body` for at least `batch_seconds`; seconds per call.
template <typename F>
double median_time_per_call(F&& body, double batch_seconds = 0.15) {
  std::vector<double> per_call;
  for (int batch = 0; batch < 5; ++batch) {
    long calls = 0;
    const auto start = Clock::now();
    double elapsed = 0;
    do {
      body();
      ++calls;
      elapsed = seconds_since(start);
    } while (elapsed < batch_seconds);
    per_call.push_back(elapsed / static_cast<double>(calls));
  }
  std::sort(per_call.begin(), per_call.end());
  return per_call[2];
}

volatile double g_sink = 0;  // keeps the optimiser from removing measured work

// The bare loop on the same design: the site's hourly surplus and deficit, the profile's
// self-discharge, efficiencies folded into one SOC gain per kWh, C-rate limits and DoD floor.
stowage::bench::BareLoopInputs bare_inputs(const stowage::ChemistryProfile& p,
                                           const stowage::SiteConditions& site,
                                           const stowage::BankGeometry& bank, double dod,
                                           std::vector<double>& surplus,
                                           std::vector<double>& deficit,
                                           std::vector<double>& factor) {
  surplus.resize(site.load_kw.size());
  deficit.resize(site.load_kw.size());
  factor.resize(site.load_kw.size());
  for (std::size_t h = 0; h < site.load_kw.size(); ++h) {
    const stowage::HourBalance b = stowage::hour_balance(site, h);
    surplus[h] = b.surplus_kwh;
    deficit[h] = b.deficit_kwh;
    factor[h] = p.temperature.capacity_factor(site.temp_c[h]);
  }
  const double charge_kwh_per_soc = bank.capacity_ah * bank.cells_series * p.mean_charge_v / 1000;
  const double discharge_kwh_per_soc =
      bank.capacity_ah * bank.cells_series * p.mean_discharge_v / 1000;
  stowage::bench::BareLoopInputs in;
  in.surplus_kwh = &surplus;
  in.deficit_kwh = &deficit;
  in.capacity_factor = &factor;
  in.curve = &p.cycle_life;
  in.keep_per_hour = std::pow(1.0 - p.self_discharge_per_month, 1.0 / stowage::kHoursPerMonth);
  in.charge_soc_per_kwh = site.charger_efficiency * p.coulombic_efficiency / charge_kwh_per_soc;
  in.discharge_soc_per_kwh = 1.0 / (site.inverter_efficiency * discharge_kwh_per_soc);
  in.max_charge_soc = p.max_charge_c_rate;
  in.max_discharge_soc = p.max_discharge_c_rate;
  in.dod_setpoint = dod;
  in.years = 20;
  return in;
}

void run_model_benchmarks(const std::string& only) {
  const std::filesystem::path studies = std::filesystem::path(STOWAGE_SOURCE_DIR) / "studies";
  std::vector<std::filesystem::path> files;
  for (const auto& entry : std::filesystem::directory_iterator(studies))
    if (std::filesystem::exists(entry.path() / "study.yaml"))
      files.push_back(entry.path() / "study.yaml");
  std::sort(files.begin(), files.end());

  std::printf("model: 20-year exact evaluation of every design each demo study lists, one core\n");
  std::printf("| study | design | evaluation | simulator | bare loop | simulator / bare loop |\n");
  std::printf("|---|---|---|---|---|---|\n");
  std::vector<double> fractions;
  const double hour_steps = 20.0 * stowage::kHoursPerYear;
  for (const auto& file : files) {
    const stowage::Study study = stowage::load_study_file(file.string());
    stowage::Economics econ = study.economics;
    econ.project_years = 20;
    for (const stowage::ResolvedDesign& d : stowage::resolve_designs(study)) {
      const stowage::ChemistryProfile& p = study.profiles[d.profile_index];
      if (!only.empty() && (file.string() + " " + p.id).find(only) == std::string::npos) continue;
      stowage::LifecycleEvaluator evaluator(p, study.site, econ);
      const double eval_s = median_time_per_call(
          [&] { g_sink = g_sink + evaluator.evaluate(d.dod_setpoint, d.strings_parallel).npc; });
      std::vector<double> surplus, deficit, factor;
      const stowage::BankGeometry bank =
          stowage::bank_geometry(p, study.site.bus_voltage_v, d.strings_parallel);
      const stowage::bench::BareLoopInputs bare =
          bare_inputs(p, study.site, bank, d.dod_setpoint, surplus, deficit, factor);
      const double bare_s =
          median_time_per_call([&] { g_sink = g_sink + stowage::bench::bare_loop_damage(bare); });
      fractions.push_back(bare_s / eval_s);
      std::printf("| %s | %s DoD %.2f x%d | %.3f ms | %.1f M hour-steps/s | %.1f M/s | %.0f %% |\n",
                  file.parent_path().filename().string().c_str(), p.id.c_str(), d.dod_setpoint,
                  d.strings_parallel, eval_s * 1e3, hour_steps / eval_s / 1e6,
                  hour_steps / bare_s / 1e6, 100 * bare_s / eval_s);
    }
  }
  if (fractions.empty()) return;
  std::sort(fractions.begin(), fractions.end());
  std::printf(
      "simulator / bare loop over %zu designs: median %.0f %%, range %.0f-%.0f %% "
      "(target >= 50 %%)\n",
      fractions.size(), 100 * fractions[fractions.size() / 2], 100 * fractions.front(),
      100 * fractions.back());
}

}  // namespace

int main(int argc, char** argv) {
  const std::string part = argc > 1 ? argv[1] : "all";
  if (part != "all" && part != "model" && part != "optimise" && part != "uncertainty" &&
      part != "sweep") {
    std::fprintf(stderr,
                 "usage: stowage_bench [all|model [FILTER]|optimise|uncertainty [SAMPLES]|"
                 "sweep [POINTS]]\n");
    return 2;
  }
  // Profile warnings (a demo bid's cycle-life curve, say) are the loader's business, not the
  // bench's: counted once, not printed for every load.
  static int warnings = 0;
  stowage::set_warning_sink([](const std::string&) { ++warnings; });
  std::setvbuf(stdout, nullptr, _IOLBF, 0);  // every figure out as it comes, even to a file
  std::printf("stowage bench\n");
  // A third argument keeps only the model designs whose "study-path profile-id" contains it.
  if (part == "all" || part == "model") run_model_benchmarks(argc > 2 ? argv[2] : "");
  if (part == "all" || part == "optimise") stowage::bench::run_optimise_benchmarks();
  if (part == "all" || part == "uncertainty") {
    const long samples = part == "uncertainty" && argc > 2 ? std::atol(argv[2]) : 10000;
    if (samples < 2) {
      std::fprintf(stderr, "stowage_bench: SAMPLES must be a whole number >= 2\n");
      return 2;
    }
    stowage::bench::run_uncertainty_benchmarks(static_cast<std::size_t>(samples));
  }
  if (part == "all" || part == "sweep") {
    const long points = part == "sweep" && argc > 2 ? std::atol(argv[2]) : 100;
    if (points < 2 || points > 1000) {
      std::fprintf(stderr, "stowage_bench: POINTS must be a whole number from 2 to 1000\n");
      return 2;
    }
    stowage::bench::run_sweep_benchmarks(static_cast<std::size_t>(points));
  }
  if (warnings > 0) std::printf("(%d profile warnings while loading, not shown)\n", warnings);
  return 0;
}
