// SPDX-License-Identifier: MIT
// Optimiser benchmarks: the default model-guided search against exhaustive enumeration with
// the exact simulator, on the Tarnbeck Saddle demo study and on a generated study of 8 profiles
// x 17 DoD setpoints x up to 40 strings (5,440 designs), both run in this process so the ratio
// is machine-independent. Target: >= 20x faster with the same answer (or within 0.1 %).
// The decomposed sub-models are also compared with one monolithic GLPK branch and bound over
// the same design space (time-limited; a run stopped by the limit is reported as such).
#include "bench_optimise.h"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <limits>
#include <memory>
#include <string>
#include <vector>

#include "catalog-schema/study_loader.h"
#include "model/lifecycle.h"
#include "optimiser/design_space.h"
#include "optimiser/optimise.h"
#include "optimiser/representative_days.h"
#include "optimiser/storage_milp.h"
#include "support/synthetic_study.h"

namespace stowage::bench {

namespace {

// GLPK checks its time limit only during branch and bound, not in the MIP presolver or the root
// LP, so a stopped run may take longer than this.
constexpr double kMonolithicLimitS = 30;

// GLPK branch and bound on the monolithic model of the whole admissible design space.
SolveReport solve_monolithic(const StudyCase& study, int* columns) {
  const DesignSpace space = build_design_space(study);
  std::vector<std::unique_ptr<LifecycleEvaluator>> evaluators;
  for (const ChemistryProfile& p : study.profiles) {
    evaluators.push_back(std::make_unique<LifecycleEvaluator>(p, study.site, study.economics));
  }
  std::vector<MilpChoice> choices;
  for (const DesignChoice& c : space.choices) {
    if (!c.admissible()) continue;
    choices.push_back({&study.profiles[c.profile_index],
                       &evaluators[c.profile_index]->acceleration(), c.dod_setpoint, c.min_strings,
                       c.max_strings});
  }
  const auto start = std::chrono::steady_clock::now();
  StorageMilp model(study, std::move(choices), select_representative_days(study.site, 1));
  *columns = model.columns();
  MilpOptions options;
  options.time_limit_s = kMonolithicLimitS;
  SolveReport r = model.solve(options);
  r.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  return r;
}

// The least GLPK objective over the decomposed sub-models (one per admissible pair).
double milp_best_submodel_objective(const StudyCase& study) {
  const DesignSpace space = build_design_space(study);
  const RepresentativeDays days = select_representative_days(study.site, 1);
  double best = std::numeric_limits<double>::infinity();
  for (const DesignChoice& c : space.choices) {
    if (!c.admissible()) continue;
    const ChemistryProfile& p = study.profiles[c.profile_index];
    LifecycleEvaluator evaluator(p, study.site, study.economics);
    StorageMilp model(
        study, {{&p, &evaluator.acceleration(), c.dod_setpoint, c.min_strings, c.max_strings}},
        days);
    const SolveReport r = model.solve(MilpOptions{});
    if (r.solution_usable()) best = std::min(best, r.glpk_objective);
  }
  return best;
}

void compare(const char* label, const StudyCase& study) {
  std::printf("\noptimise: %s\n", label);
  OptimiseOptions exhaustive_options;
  exhaustive_options.method = SearchMethod::Exhaustive;
  const OptimiseResult milp = optimise(study);
  const OptimiseResult exhaustive = optimise(study, exhaustive_options);
  if (!milp.feasible() || !exhaustive.feasible()) {
    std::printf("  no feasible design (milp %d, exhaustive %d)\n", milp.feasible(),
                exhaustive.feasible());
    return;
  }
  const DesignResult& a = milp.best();
  const DesignResult& b = exhaustive.best();
  const bool same_design = a.profile_id == b.profile_id &&
                           std::fabs(a.dod_setpoint - b.dod_setpoint) < 1e-9 &&
                           a.bank.strings_parallel == b.bank.strings_parallel;
  const double rel = (a.npc - b.npc) / std::fabs(b.npc);
  std::printf("  design space:       %zu admissible designs\n", exhaustive.admissible_designs);
  std::printf("  exhaustive:         %8.3f s, %zu exact evaluations -> %s DoD %.2f x%d, NPC %.0f\n",
              exhaustive.solve_seconds, exhaustive.designs_evaluated_exactly, b.profile_id.c_str(),
              b.dod_setpoint, b.bank.strings_parallel, b.npc);
  std::printf(
      "  optimise (milp):    %8.3f s, %zu exact evaluations, %zu sub-models (%.3f s) "
      "-> %s DoD %.2f x%d, NPC %.0f\n",
      milp.solve_seconds, milp.designs_evaluated_exactly, milp.submodels_solved, milp.model_seconds,
      a.profile_id.c_str(), a.dod_setpoint, a.bank.strings_parallel, a.npc);
  std::printf("  speed-up:           %8.1f x (target >= 20)\n",
              exhaustive.solve_seconds / milp.solve_seconds);
  std::printf("  same answer:        %s (NPC difference %+.4f %%)\n",
              same_design ? "yes, same design" : (rel <= 1e-3 ? "within 0.1 %" : "NO"), 100 * rel);
  std::printf("  model gap:          estimate %.0f vs exact %.0f (%+.2f %%)\n",
              milp.model_estimate_npc, a.npc, 100 * milp.gap);
  int columns = 0;
  const SolveReport mono = solve_monolithic(study, &columns);
  const bool stopped = mono.outcome != SolveOutcome::Optimal;
  std::printf(
      "  monolithic GLPK:    %8.3f s for %d columns, %s; decomposed sub-models %.3f s "
      "(%s%.1f x faster)\n",
      mono.seconds, columns, to_string(mono.outcome), milp.model_seconds,
      stopped ? "at least " : "", mono.seconds / std::max(milp.model_seconds, 1e-9));
  if (mono.solution_usable()) {
    std::printf("  monolithic optimum: %s\n",
                std::fabs(mono.glpk_objective - milp_best_submodel_objective(study)) <=
                        1e-6 * std::fabs(mono.glpk_objective)
                    ? "equals the best sub-model"
                    : "DIFFERS from the best sub-model");
  }
}

}  // namespace

void run_optimise_benchmarks() {
  const std::string tarnbeck =
      std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml";
  if (std::filesystem::exists(tarnbeck)) {
    compare("Tarnbeck Saddle field station (demo study)", load_study_file(tarnbeck));
  } else {
    std::printf("\noptimise: %s not found, skipped\n", tarnbeck.c_str());
  }
  SyntheticStudySpec spec;
  spec.seed = 2026;
  spec.profiles = 8;
  spec.full_dod_range = true;  // all 17 setpoints 0.20..1.00
  spec.dod_step = 0.05;
  spec.max_strings = 40;
  spec.project_years = 20;
  spec.daily_load_kwh = 14;
  spec.autonomy_days = 1.0;
  compare("generated study, 8 profiles x 17 setpoints x up to 40 strings (seed 2026)",
          make_synthetic_study(spec));
}

}  // namespace stowage::bench
