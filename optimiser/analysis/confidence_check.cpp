// SPDX-License-Identifier: MIT
#include "optimiser/analysis/confidence_check.h"

#include <algorithm>

#include "catalog-schema/parameter_paths.h"
#include "model/contract.h"
#include "model/invalid_value.h"
#include "model/lifecycle.h"

namespace stowage {

namespace {

// The confidence key of a parameter key: the scale of the cycle-life table is labelled as the
// table.
std::string confidence_field(const std::string& key) {
  return key == "ageing.cycle_life_scale" ? "ageing.cycle_life" : key;
}

// The winner's NPC with `path` set to `value`; nullopt when the value is refused.
std::optional<double> npc_at(const StudyCase& study, std::size_t profile, const DesignResult& best,
                             const std::string& path, double value) {
  StudyCase changed = study;
  try {
    apply_parameter(changed, path, value);
  } catch (const InvalidValue&) {
    return std::nullopt;
  }
  LifecycleEvaluator evaluator(changed.profiles[profile], changed.site, changed.economics);
  return evaluator.evaluate(best.dod_setpoint, best.bank.strings_parallel).npc;
}

}  // namespace

double confidence_spread(ValueConfidence confidence) {
  switch (confidence) {
    case ValueConfidence::Illustrative:
      return 0.25;
    case ValueConfidence::FromMemory:
      return 0.10;
    case ValueConfidence::Sourced:
      return 0;
  }
  return 0;
}

ConfidenceCheck check_low_confidence(const StudyCase& study,
                                     const std::vector<LoadedProfile>& profiles,
                                     const OptimiseResult& result) {
  if (!result.feasible()) throw ContractViolation("result", "needs a feasible design");
  const DesignResult& best = result.best();
  ConfidenceCheck check;
  check.profile_id = best.profile_id;
  if (result.ranking.size() > 1) check.margin = result.ranking[1].npc - best.npc;
  const std::optional<std::size_t> index = study.find_profile(best.profile_id);
  if (!index || *index >= profiles.size()) {
    throw ContractViolation("profiles", "must hold the winner's profile, in study order");
  }
  const LoadedProfile& loaded = profiles[*index];
  const std::string prefix = "profiles." + best.profile_id + ".";
  for (const ParameterInfo& info : parameter_paths(study)) {
    if (info.path.rfind(prefix, 0) != 0 || !info.present || info.unit == "degC") continue;
    const std::optional<ValueConfidence> label =
        confidence_of(loaded, confidence_field(info.path.substr(prefix.size())));
    if (!label || *label == ValueConfidence::Sourced) continue;
    LowConfidenceInput input;
    input.path = info.path;
    input.confidence = *label;
    input.spread = confidence_spread(*label);
    for (double sign : {-1.0, 1.0}) {
      double value = info.base * (1 + sign * input.spread);
      value = std::min(std::max(value, info.min), info.max);
      const std::optional<double> npc = npc_at(study, *index, best, info.path, value);
      if (npc) input.npc_rise = std::max(input.npc_rise, *npc - best.npc);
    }
    check.inputs.push_back(input);
  }
  std::stable_sort(check.inputs.begin(), check.inputs.end(),
                   [](const LowConfidenceInput& a, const LowConfidenceInput& b) {
                     return a.npc_rise > b.npc_rise;
                   });
  return check;
}

}  // namespace stowage
