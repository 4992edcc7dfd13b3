// SPDX-License-Identifier: MIT
#include "optimiser/analysis/scenario.h"

#include <algorithm>

#include "catalog-schema/parameter_paths.h"
#include "model/contract.h"
#include "model/repricing.h"

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
    if (options.priced_from && options.priced_from->size() != options.held.size()) {
      throw ContractViolation("priced_from", "one simulated design per held design");
    }
    for (std::size_t i = 0; i < options.held.size(); ++i) {
      const HeldDesign& h = options.held[i];
      const std::size_t p = index_of(h.profile_id);
      if (options.priced_from) {
        outcome.by_profile[p] = summarise(reprice((*options.priced_from)[i], changed.profiles[p],
                                                  changed.site, changed.economics));
        continue;
      }
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

bool prices_only(const StudyCase& study, const std::vector<std::string>& paths) {
  for (const std::string& path : paths) {
    if (!find_parameter(study, path).prices_only) return false;
  }
  return true;
}

std::vector<DesignResult> simulate_held(const StudyCase& study,
                                        const std::vector<HeldDesign>& held) {
  std::vector<DesignResult> out;
  for (const HeldDesign& h : held) {
    const std::optional<std::size_t> p = study.find_profile(h.profile_id);
    if (!p) throw ContractViolation("profile_id", "'" + h.profile_id + "' is not a profile");
    LifecycleEvaluator evaluator(study.profiles[*p], study.site, study.economics);
    out.push_back(evaluator.evaluate(h.dod_setpoint, h.strings_parallel));
  }
  return out;
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
