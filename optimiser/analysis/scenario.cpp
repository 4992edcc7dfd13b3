// SPDX-License-Identifier: MIT
#include "optimiser/analysis/scenario.h"

#include <algorithm>

#include "catalog-schema/parameter_paths.h"
#include "model/contract.h"

namespace stowage {

StudyCase with_settings(const StudyCase& base, const std::vector<Setting>& settings) {
  StudyCase changed = base;
  for (const Setting& s : settings) apply_parameter(changed, s.path, s.value);
  return changed;
}

DesignSummary summarise(const DesignResult& design) {
  DesignSummary s;
  s.profile_id = design.profile_id;
  s.dod_setpoint = design.dod_setpoint;
  s.cells_series = design.bank.cells_series;
  s.strings_parallel = design.bank.strings_parallel;
  s.nameplate_kwh = design.bank.nameplate_kwh;
  s.npc = design.npc;
  s.lcos_per_kwh = design.lcos_per_kwh;
  s.investment = design.investment;
  s.meets_unserved_limit = design.meets_unserved_limit;
  return s;
}

std::vector<HeldDesign> held_designs(const OptimiseResult& result) {
  std::vector<HeldDesign> held;
  for (const DesignResult& d : result.ranking) {
    held.push_back({d.profile_id, d.dod_setpoint, d.bank.strings_parallel});
  }
  return held;
}

PointOutcome evaluate_point(const StudyCase& changed, const PointOptions& options) {
  PointOutcome outcome;
  outcome.by_profile.resize(changed.profiles.size());
  const auto index_of = [&](const std::string& id) {
    const std::optional<std::size_t> i = changed.find_profile(id);
    if (!i) throw ContractViolation("profile_id", "'" + id + "' is not a profile of the study");
    return *i;
  };
  if (options.hold_designs) {
    for (const HeldDesign& h : options.held) {
      const std::size_t p = index_of(h.profile_id);
      LifecycleEvaluator evaluator(changed.profiles[p], changed.site, changed.economics);
      outcome.by_profile[p] = summarise(evaluator.evaluate(h.dod_setpoint, h.strings_parallel));
    }
  } else {
    const OptimiseResult result = optimise(changed, options.optimise);
    outcome.status = result.status;
    for (const DesignResult& d : result.ranking)
      outcome.by_profile[index_of(d.profile_id)] = summarise(d);
  }
  rank_point(outcome);
  return outcome;
}

void rank_point(PointOutcome& outcome) {
  outcome.ranking.clear();
  for (const std::optional<DesignSummary>& d : outcome.by_profile) {
    if (d && d->meets_unserved_limit) outcome.ranking.push_back(*d);
  }
  // by_profile is in profile order, so a stable sort breaks ties by profile order.
  std::stable_sort(outcome.ranking.begin(), outcome.ranking.end(),
                   [](const DesignSummary& a, const DesignSummary& b) { return a.npc < b.npc; });
}

}  // namespace stowage
