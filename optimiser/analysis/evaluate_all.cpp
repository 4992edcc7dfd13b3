// SPDX-License-Identifier: MIT
#include "optimiser/analysis/evaluate_all.h"

#include <map>
#include <memory>

namespace stowage {

std::vector<DesignResult> evaluate_all(const Study& study) {
  std::vector<DesignResult> results;
  std::map<std::size_t, std::unique_ptr<LifecycleEvaluator>> evaluators;
  for (const ResolvedDesign& d : resolve_designs(study)) {
    auto& ev = evaluators[d.profile_index];
    if (!ev) {
      ev = std::make_unique<LifecycleEvaluator>(study.profiles[d.profile_index], study.site,
                                                study.economics);
    }
    results.push_back(ev->evaluate(d.dod_setpoint, d.strings_parallel));
  }
  return results;
}

}  // namespace stowage
