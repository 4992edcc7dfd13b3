// SPDX-License-Identifier: MIT
#include "optimiser/analysis/design_trace.h"

#include "model/contract.h"

namespace stowage {

DesignTrace trace_first_year(const Study& study, const DesignResult& design) {
  const std::optional<std::size_t> index = study.find_profile(design.profile_id);
  if (!index) throw ContractViolation("design.profile_id", "not a profile of the study");
  if (design.years.empty()) throw ContractViolation("design.years", "must not be empty");
  const ChemistryProfile& profile = study.profiles[*index];

  // The lifecycle itself re-run for this design: its first year, month by month at the health
  // of each month, is the year that was priced.
  LifecycleEvaluator evaluator(profile, study.site, study.economics);
  DesignTrace trace;
  const DesignResult again =
      evaluator.evaluate(design.dod_setpoint, design.bank.strings_parallel, &trace.soc);
  trace.first_year = again.years.front().dispatch;
  // 20 bins: a 5 %-of-capacity resolution of depth.
  trace.cycles = summarise_cycles(trace.soc, 20);
  trace.temp_c = study.site.temp_c;
  trace.capacity_factor.reserve(trace.temp_c.size());
  trace.ageing_acceleration.reserve(trace.temp_c.size());
  for (double t : trace.temp_c) {
    trace.capacity_factor.push_back(profile.temperature.capacity_factor(t));
    trace.ageing_acceleration.push_back(profile.temperature.ageing_acceleration(t));
  }
  return trace;
}

}  // namespace stowage
