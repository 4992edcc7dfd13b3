// SPDX-License-Identifier: MIT
#include "model/sizing.h"

#include <algorithm>
#include <cmath>

#include "model/contract.h"
#include "model/dod_window.h"
#include "model/invalid_value.h"

namespace stowage {

namespace {

// More strings than this is not a bank but an input mistake (and would overflow an int).
constexpr double kMaxStringsParallel = 1e6;

struct DesignCondition {
  double daily_load_kwh;
  double coldest_temp_c;
  double temperature_factor;
};

DesignCondition design_condition(const ChemistryProfile& profile, const SiteConditions& site) {
  const MonthlyMeans m = monthly_means(site);
  DesignCondition c{m.daily_load_kwh[0], m.temp_c[0], 1.0};
  for (int i = 1; i < 12; ++i) {
    c.daily_load_kwh = std::max(c.daily_load_kwh, m.daily_load_kwh[i]);
    c.coldest_temp_c = std::min(c.coldest_temp_c, m.temp_c[i]);
  }
  // No credit for capacity gained in the heat (IEEE Std 485 sizing practice): the same rule as
  // the dispatch's window, at the design rate (dod_window.h).
  c.temperature_factor =
      reachable_depth(1.0, profile.temperature.capacity_factor(c.coldest_temp_c));
  return c;
}

// Usable terminal kWh per ampere-hour of rated capacity in the design condition.
double usable_kwh_per_ah(const ChemistryProfile& profile, const SiteConditions& site,
                         double dod_setpoint, double temperature_factor) {
  const int cells = cells_in_series(profile, site.bus_voltage_v);
  return cells * profile.mean_discharge_v / 1000.0 *
         reachable_depth(dod_setpoint, temperature_factor) * profile.eol_capacity_fraction;
}

}  // namespace

AutonomySizing size_for_autonomy(const ChemistryProfile& profile, const SiteConditions& site,
                                 double dod_setpoint) {
  require_dod_setpoint(dod_setpoint);
  const DesignCondition c = design_condition(profile, site);
  AutonomySizing s;
  s.design_daily_load_kwh = c.daily_load_kwh;
  s.coldest_month_temp_c = c.coldest_temp_c;
  s.temperature_factor = c.temperature_factor;
  s.required_usable_kwh =
      c.daily_load_kwh * site.autonomy_days * site.design_margin / site.inverter_efficiency;
  const double required_ah =
      s.required_usable_kwh / usable_kwh_per_ah(profile, site, dod_setpoint, c.temperature_factor);
  s.cells_series = cells_in_series(profile, site.bus_voltage_v);
  s.required_nameplate_kwh = required_ah * s.cells_series * profile.cell_nominal_v / 1000.0;
  // The small tolerance keeps an exact fit (e.g. 2.0000000001 strings) from rounding up.
  const double strings = std::ceil(required_ah / profile.cell_capacity_ah - 1e-9);
  if (!(strings <= kMaxStringsParallel))
    throw InvalidValue("site.autonomy_days", "autonomy would need " + std::to_string(strings) +
                                                 " strings in parallel of cells of " +
                                                 std::to_string(profile.cell_capacity_ah) +
                                                 " Ah; check the cell capacity against the load");
  s.strings_parallel = std::max(1, static_cast<int>(strings));
  return s;
}

double design_usable_kwh(const ChemistryProfile& profile, const SiteConditions& site,
                         double dod_setpoint, int strings_parallel) {
  require_dod_setpoint(dod_setpoint);
  const DesignCondition c = design_condition(profile, site);
  return strings_parallel * profile.cell_capacity_ah *
         usable_kwh_per_ah(profile, site, dod_setpoint, c.temperature_factor);
}

}  // namespace stowage
