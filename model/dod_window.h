// SPDX-License-Identifier: MIT
// The depth a bank may reach in an hour: the DoD setpoint is a protective limit.
//
//   reachable_depth = dod_setpoint x min(1, f_T(T) x f_P(I))        (fraction of full, 0..1)
//
// f_T is the profile's available-capacity factor at the battery temperature (temperature
// behaviour, may exceed 1 in the heat), f_P = (I_r / I)^(k-1) the Peukert factor at the
// discharge current I (1 at or below the rated current I_r; dispatch.h). Cold and high current
// narrow what the cells can reach before cut-off, proportionally to the setpoint (the IEEE Std
// 1013 chain derates the DoD limit by the temperature factor); heat that raises the available
// capacity does not let the bank go past its setpoint, as IEEE Std 485 takes no capacity credit
// above 25 degC (from memory). The discharge floor of the hour is 1 - reachable_depth. Sizing
// (sizing.h, at the design rate: f_P = 1) and the hourly dispatch both use this one rule.
// Domain: dod_setpoint in (0, 1], factors > 0; the result lies in (0, dod_setpoint].
#pragma once

#include <algorithm>

namespace stowage {

inline double reachable_depth(double dod_setpoint, double capacity_factor,
                              double peukert_factor = 1.0) {
  return dod_setpoint * std::min(1.0, capacity_factor * peukert_factor);
}

}  // namespace stowage
