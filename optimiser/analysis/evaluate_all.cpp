// SPDX-License-Identifier: MIT
#include "optimiser/analysis/evaluate_all.h"

#include <map>
#include <memory>

#include "model/invalid_value.h"

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

std::vector<RequirementCheck> requirement_checks(const Study& study,
                                                 const std::vector<DesignResult>& results) {
  std::vector<RequirementCheck> checks;
  checks.reserve(results.size());
  for (const DesignResult& r : results) {
    const ChemistryProfile* profile = nullptr;
    for (const ChemistryProfile& p : study.profiles)
      if (p.id == r.profile_id) profile = &p;
    if (!profile) throw InvalidValue("designs", "unknown profile '" + r.profile_id + "'");
    checks.push_back(
        check_requirements(*profile, study.site, r.dod_setpoint, r.bank.strings_parallel));
  }
  return checks;
}

}  // namespace stowage
