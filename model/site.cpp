// SPDX-License-Identifier: MIT
#include "model/site.h"

#include <algorithm>
#include <cmath>
#include <string>

#include "model/invalid_value.h"

namespace stowage {

namespace {
void check_series(const std::vector<double>& values, const char* field, bool non_negative) {
  if (values.size() != static_cast<std::size_t>(kHoursPerYear))
    throw InvalidValue(field, "needs " + std::to_string(kHoursPerYear) + " hourly values, got " +
                                  std::to_string(values.size()));
  for (std::size_t i = 0; i < values.size(); ++i) {
    if (!std::isfinite(values[i]) || (non_negative && values[i] < 0))
      throw InvalidValue(std::string(field) + "[" + std::to_string(i) + "]",
                         non_negative ? "must be a finite number >= 0" : "must be finite");
  }
}
}  // namespace

void SiteConditions::validate() const {
  if (!(bus_voltage_v > 0) || !std::isfinite(bus_voltage_v))
    throw InvalidValue("bus_voltage_v", "must be positive");
  check_series(load_kw, "load_kw", true);
  check_series(source_kw, "source_kw", true);
  check_series(temp_c, "temp_c", false);
  if (enclosure) {
    enclosure->validate();
    check_series(ambient_c, "ambient_c", false);
    if (!irradiance_w_m2.empty()) check_series(irradiance_w_m2, "irradiance_w_m2", true);
  }
  check_series(charge_price_per_kwh, "charging_price", true);
  if (!(autonomy_days >= 0) || !std::isfinite(autonomy_days))
    throw InvalidValue("autonomy_days", "must be >= 0");
  if (!(design_margin >= 1) || !std::isfinite(design_margin))
    throw InvalidValue("design_margin", "must be >= 1");
  if (!(charger_efficiency > 0 && charger_efficiency <= 1))
    throw InvalidValue("charger_efficiency", "must be in (0, 1]");
  if (!(inverter_efficiency > 0 && inverter_efficiency <= 1))
    throw InvalidValue("inverter_efficiency", "must be in (0, 1]");
  if (!(source_to_load_efficiency > 0 && source_to_load_efficiency <= 1))
    throw InvalidValue("source_to_load_efficiency", "must be in (0, 1]");
  if (backup_price_per_kwh && !(*backup_price_per_kwh >= 0))
    throw InvalidValue("backup.price_per_kwh", "must be >= 0");
  if (unserved_limit_fraction && !(*unserved_limit_fraction >= 0 && *unserved_limit_fraction <= 1))
    throw InvalidValue("unserved.limit_fraction", "must be in [0, 1]");
  if (!(unserved_penalty_per_kwh >= 0))
    throw InvalidValue("unserved.penalty_per_kwh", "must be >= 0");
}

void set_enclosure_reference_temperature(SiteConditions& site) {
  const Enclosure& e = *site.enclosure;
  const double g_kw_per_k = e.conductance_w_per_k / 1000.0;
  site.temp_c.resize(site.ambient_c.size());
  for (std::size_t h = 0; h < site.ambient_c.size(); ++h) {
    double t = site.ambient_c[h] + (site.solar_gain_kw(h) + e.standing_kw) / g_kw_per_k;
    if (e.heating && !e.heating->charge_only) t = std::max(t, e.heating->to_c);
    if (e.cooling) t = std::min(t, e.cooling->to_c);
    site.temp_c[h] = t;
  }
}

double SiteConditions::annual_demand_kwh() const {
  double sum = 0;
  for (double v : load_kw) sum += v;
  return sum;
}

MonthlyMeans monthly_means(const SiteConditions& site) {
  MonthlyMeans m{};
  const int per_month = static_cast<int>(kHoursPerMonth);
  for (int month = 0; month < 12; ++month) {
    double load = 0, temp = 0;
    for (int h = month * per_month; h < (month + 1) * per_month; ++h) {
      load += site.load_kw[static_cast<std::size_t>(h)];
      temp += site.temp_c[static_cast<std::size_t>(h)];
    }
    m.daily_load_kwh[month] = load / (kHoursPerMonth / 24.0);
    m.temp_c[month] = temp / kHoursPerMonth;
  }
  return m;
}

}  // namespace stowage
