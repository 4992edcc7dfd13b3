// SPDX-License-Identifier: MIT
// trace_first_year(): the hour-by-hour picture of one evaluated design in its first project
// year, for the report's charts (SOC heat map, rainflow depth histogram, temperature effects).
// DesignResult keeps only yearly figures, so this re-runs the model's public API with the
// design's own choices and nothing else: the lifecycle evaluation (model/lifecycle.h) of the
// design's bank and setpoint, which hands back its first year's SOC trace (dispatched month by
// month at each month's health), the rainflow count of that SOC trace
// (model/duty_cycles.h, ASTM E1049-85), and the profile's available-capacity factor and
// ageing acceleration at each hour's site temperature (model/temperature_behaviour.h).
// The year's totals equal DesignResult::years.front().dispatch (a test checks this), so the
// trace is the year the lifecycle priced, not another one.
// Throws ContractViolation when the design's profile is not in the study or the design has
// no years.
#pragma once

#include <vector>

#include "model/dispatch.h"
#include "model/duty_cycles.h"
#include "model/lifecycle.h"
#include "model/study.h"

namespace stowage {

struct DesignTrace {
  std::vector<double> soc;                  // 8761 points: start of year 1 and after each hour
  std::vector<double> temp_c;               // site battery-space temperature, 8760 hours
  std::vector<double> capacity_factor;      // available / rated capacity at temp_c, 8760
  std::vector<double> ageing_acceleration;  // a(T) floored at 1, as the ageing uses, 8760
  DutyCycleSummary cycles;                  // rainflow of `soc`, depth bins of 0.05
  YearDispatch first_year;                  // the totals of this dispatch
};

DesignTrace trace_first_year(const Study& study, const DesignResult& design);

}  // namespace stowage
