// SPDX-License-Identifier: MIT
// optimise(): the bank design (profile, DoD setpoint, strings in parallel) with the lowest
// lifecycle cost of serving the site, DesignResult::npc, among the admissible designs of
// optimiser/design_space.h that also meet the study's unserved-energy limit.
//
// Methods
//   Exhaustive: every admissible design is evaluated by the exact simulator
//     (LifecycleEvaluator); the answer is the best of them, optimal by enumeration.
//   Bounded: exact search without the model: every admissible design in order of
//     npc_lower_bound(), evaluated until the next bound reaches the best exact NPC found;
//     optimal by the bound (the baseline the guided search has to beat).
//   Milp (default): the mixed-integer model of optimiser/storage_milp.h, decomposed by
//     (profile, setpoint): one sub-model per pair, with one integer variable (strings). The
//     answer is always the best EXACTLY evaluated design; the model only decides where to look:
//     1. bound: pairs are taken in order of npc_lower_bound() at their least admissible bank;
//        a pair whose bound is at or above the best exact value so far is pruned unsolved;
//     2. per profile, the pair with the lowest model estimate is searched exactly (see 4), so
//        every profile gets a best design for the ranking and an observed estimate/exact ratio;
//     3. every other pair, in order of estimate, is pruned when its calibrated estimate
//          estimate x ratio_p x (1 - margin_p) >= best exact value
//        with ratio_p the median observed exact/estimate ratio of its profile and margin_p the
//        larger of `base_margin`, twice the spread of the observed ratios, and `lone_margin`
//        while a profile has fewer than three observations;
//     4. a pair not pruned is searched exactly by local search in strings from the model's
//        choice: step up and down while the exact cost improves, going on `patience` steps past
//        the last improvement (replacement timing makes the cost in n bumpy), never above a
//        bank whose bound already exceeds the best exact value.
//   The ranking lists the best design found for each profile; for the winner's profile it is
//   the optimum, for the others the best found where the model pointed.
// What was proven (OptimiseResult::status), decided after the search by checking every
// admissible design, whatever the method:
//   Proven: every admissible design was either evaluated exactly or has npc_lower_bound() at
//     or above the answer's exact NPC, so no design can beat the answer (or, with no feasible
//     design, every admissible one was evaluated and none meets the unserved limit);
//   VerifiedByEstimate: the search ran to completion but some designs were passed over on the
//     model's calibrated estimate or by the local search's patience rule, not by a proof;
//   TimeLimited: the search stopped at the time limit; the answer is the best found so far.
// The exhaustive method always ends Proven (or TimeLimited).
#pragma once
#pragma once

#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "model/lifecycle.h"
#include "model/study.h"
#include "optimiser/design_space.h"

namespace stowage {

enum class SearchMethod { Milp, Exhaustive, Bounded };

enum class Optimality { Proven, VerifiedByEstimate, TimeLimited };
// "proven_optimal", "verified_by_estimate", "time_limited": the names JSON carries.
const char* to_string(Optimality status);
const char* to_string(SearchMethod method);
// "milp", "exhaustive" or "bounded"; std::nullopt for anything else.
std::optional<SearchMethod> search_method_from_string(std::string_view text);

struct OptimiseProgress {
  const char* phase = "";  // "model", "verify", "exhaustive"
  std::size_t done = 0;    // units of the phase done (designs or sub-models)
  std::size_t total = 0;   // units in the phase (an upper bound for "verify")
  double seconds = 0;      // since the start
  double best_npc = 0;     // best exact value so far; NaN when none yet
};

struct OptimiseOptions {
  SearchMethod method = SearchMethod::Milp;
  std::optional<double> time_limit_s;  // > 0 when set
  int days_per_block = 1;              // representative days per month, 1..28
  double base_margin = 0.03;           // least safety margin on calibrated estimates, [0, 1)
  double lone_margin = 0.15;           // margin while a profile has < 3 observed ratios, [0, 1)
  int patience = 2;                    // local-search steps past the last improvement, >= 1
  // After the guided search, evaluate exactly every design it passed over whose rigorous
  // bound is below the best exact NPC, so the answer ends Proven (see above).
  bool prove = true;
  // Threads for the exhaustive, bounded and proof searches (0: every core). The guided
  // search and the model run on the calling thread. Results are identical for any count.
  int threads = 0;
  std::function<void(const OptimiseProgress&)> progress;  // called now and then; may be empty
  void validate() const;  // throws ContractViolation naming the field
};

struct OptimiseResult {
  SearchMethod method = SearchMethod::Milp;
  // Best design found for each profile that has an admissible one meeting the unserved limit,
  // sorted by npc (ties: profile order). ranking.front() is the answer.
  std::vector<DesignResult> ranking;
  double model_estimate_npc = 0;      // model estimate of the answer's design (NaN if none)
  double model_estimate_per_kwh = 0;  // its LCOS estimate (NaN if none or nothing discharged)
  double gap = 0;                     // (exact npc - estimate) / |exact npc| (NaN if none)
  double solve_seconds = 0;
  double model_seconds = 0;  // of solve_seconds, spent building and solving sub-models
  std::size_t designs_evaluated_exactly = 0;
  std::size_t designs_evaluated_for_proof = 0;  // of those, by the proof step (prove)
  // Of designs_evaluated_exactly, those whose simulation stopped early because their NPC had to
  // exceed the best of their profile so far (LifecycleEvaluator::evaluate_unless_above): settled,
  // but not in the ranking. years_simulated counts the project years simulated over all
  // evaluations (designs_evaluated_exactly x project years without early stops).
  std::size_t designs_stopped_early = 0;
  std::size_t years_simulated = 0;
  std::size_t admissible_designs = 0;  // size of the design space within the constraints
  std::size_t submodels_solved = 0;
  std::size_t pairs_pruned_by_bound = 0;
  std::size_t pairs_pruned_by_estimate = 0;
  Optimality status = Optimality::TimeLimited;
  std::size_t designs_unsettled = 0;  // admissible designs neither evaluated nor bounded out
  bool proven_optimal() const { return status == Optimality::Proven; }
  bool time_limit_reached = false;
  std::vector<UnmetRequirement> unmet;  // why there is no feasible design (ranking empty)
  std::vector<ProfileNote> notes;       // profiles left out or absent from the ranking, and why

  bool feasible() const { return !ranking.empty(); }
  const DesignResult& best() const { return ranking.front(); }  // requires feasible()
};

// Throws ContractViolation for bad options; the study must be validated.
OptimiseResult optimise(const StudyCase& study, const OptimiseOptions& options = {});

// Writes the monolithic model of the study's admissible design space (every admissible pair as
// a binary choice; see storage_milp.h): CPLEX LP when `path` ends in ".lp", free MPS otherwise.
// Returns GLPK's optimal objective value of that model when `solve` is true (else NaN).
// Throws std::runtime_error when no pair is admissible or the file cannot be written.
double export_design_space_model(const StudyCase& study, const std::string& path,
                                 int days_per_block = 1, bool solve = false);

}  // namespace stowage
