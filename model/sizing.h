// SPDX-License-Identifier: MIT
// Bank sizing for autonomy, after the IEEE Std 1013 approach for stand-alone PV systems:
//   required nameplate = design daily load x autonomy days x design margin
//                        / (inverter_efficiency x DoD setpoint x f_T(coldest month)
//                           x eol_capacity_fraction)
// with the design daily load the largest monthly mean daily load, f_T the profile's available
// capacity factor at the coldest monthly mean temperature, DoD setpoint x f_T read as the
// reachable depth of dod_window.h at the design rate (f_T capped at 1: no credit for heat, as
// IEEE Std 485 advises; the dispatch uses the same rule), and strings = ceil(required Ah / cell Ah)
// at the cells in series that reach the bus voltage.
#pragma once

#include "model/bank.h"
#include "model/chemistry_profile.h"
#include "model/site.h"

namespace stowage {

struct AutonomySizing {
  double design_daily_load_kwh = 0;
  double coldest_month_temp_c = 0;
  double temperature_factor = 1;   // f_T at the coldest month, <= 1
  double required_usable_kwh = 0;  // at the bank terminals
  double required_nameplate_kwh = 0;
  int cells_series = 0;
  int strings_parallel = 0;  // at least 1
};

AutonomySizing size_for_autonomy(const ChemistryProfile& profile, const SiteConditions& site,
                                 double dod_setpoint);

// Usable energy at the terminals that `strings_parallel` strings give in the design condition
// (coldest month, end of life, within the DoD setpoint): what the autonomy rule compares with
// required_usable_kwh.
double design_usable_kwh(const ChemistryProfile& profile, const SiteConditions& site,
                         double dod_setpoint, int strings_parallel);

}  // namespace stowage
