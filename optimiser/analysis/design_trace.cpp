// SPDX-License-Identifier: MIT
#include "optimiser/analysis/design_trace.h"

#include "model/contract.h"

namespace stowage {

DesignTrace trace_first_year(const Study& study, const DesignResult& design) {
  const std::optional<std::size_t> index = study.find_profile(design.profile_id);
  if (!index) throw ContractViolation("design.profile_id", "not a profile of the study");
  if (design.years.empty()) throw ContractViolation("design.years", "must not be empty");
  const ChemistryProfile& profile = study.profiles[*index];

  DispatchInputs in;
  in.profile = &profile;
  in.site = &study.site;
  in.bank = design.bank;
  in.dod_setpoint = design.dod_setpoint;
  in.health = design.years.front().health_start;
  DispatchState state;  // year 1 starts full, as the lifecycle's does
  DesignTrace trace;
  trace.first_year = dispatch_year(in, state, trace.soc);
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
