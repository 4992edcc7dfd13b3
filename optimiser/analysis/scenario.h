// SPDX-License-Identifier: MIT
// One point of a sweep, a break-even search or an uncertainty run: the study with some inputs
// set to given values (each applied by its parameter path to a copy of the base case, in the
// order given), then either
//   re-optimised: optimise() on the changed case; the best design of each profile, or
//   held: the designs given (normally the base case's best design of each profile, from
//     held_designs()) evaluated exactly on the changed case, with their geometry unchanged.
// The outcome ranks, by NPC (ties: profile order), the designs that meet the study's
// unserved-energy limit; `by_profile` gives each profile's design in study profile order
// (held: also when it breaks the limit, so an uncertainty run can still count it).
// Throws InvalidValue when a value is refused by its path (bad input: exit 2).
#pragma once

#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/study_case.h"
#include "model/lifecycle.h"
#include "optimiser/optimise.h"

namespace stowage {

struct Setting {
  std::string path;
  double value = 0;
};

// The base case with every setting applied, each to the result of the ones before.
StudyCase with_settings(const StudyCase& base, const std::vector<Setting>& settings);

// What a report needs of an evaluated design; small, so thousands of points stay cheap.
struct DesignSummary {
  std::string profile_id;
  double dod_setpoint = 0;
  int cells_series = 0;
  int strings_parallel = 0;
  double nameplate_kwh = 0;
  double npc = 0;
  double lcos_per_kwh = 0;
  double investment = 0;
  bool meets_unserved_limit = true;
};
DesignSummary summarise(const DesignResult& design);

struct HeldDesign {
  std::string profile_id;
  double dod_setpoint = 0;
  int strings_parallel = 0;
};
// The designs of an optimise() ranking (one per profile), to hold fixed.
std::vector<HeldDesign> held_designs(const OptimiseResult& result);

// Re-pricing (model/repricing.h): when every path a run changes only prices what a design does
// (ParameterInfo::prices_only: profile costs, the discount rate, back-up, flat charging and
// unserved-energy prices), a held design's dispatch, wear and replacement years are the base
// case's, so it is simulated once and each point re-prices that result, which equals the
// simulation of the point (to rounding). Any other path (project years, efficiencies, weather,
// load, chemistry) needs the simulation.
bool prices_only(const StudyCase& study, const std::vector<std::string>& paths);
// The held designs evaluated exactly on `study`, in the order of `held`.
std::vector<DesignResult> simulate_held(const StudyCase& study,
                                        const std::vector<HeldDesign>& held);

struct PointOptions {
  bool hold_designs = false;
  std::vector<HeldDesign> held;  // used when hold_designs
  // With hold_designs: held design i is re-priced from element i (simulate_held on the base
  // case) instead of simulated. Set only when the points change prices_only paths.
  std::shared_ptr<const std::vector<DesignResult>> priced_from;
  OptimiseOptions optimise;  // used when re-optimising; progress must be empty
};

struct PointOutcome {
  std::vector<DesignSummary> ranking;  // meeting the unserved limit, ascending NPC
  std::vector<std::optional<DesignSummary>> by_profile;  // study profile order
  std::optional<Optimality> status;                      // re-optimised points only
  bool feasible() const { return !ranking.empty(); }
  const DesignSummary& winner() const { return ranking.front(); }  // requires feasible()
};

PointOutcome evaluate_point(const StudyCase& changed, const PointOptions& options);

// Fills outcome.ranking from outcome.by_profile by the rule above (the designs meeting the
// unserved-energy limit, ascending NPC, ties in profile order). evaluate_point() ends with it,
// and a point read back from a partial result (shards.h) is ranked by it again.
void rank_point(PointOutcome& outcome);

}  // namespace stowage
