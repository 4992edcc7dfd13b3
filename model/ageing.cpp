// SPDX-License-Identifier: MIT
#include "model/ageing.h"

#include "model/site.h"

namespace stowage {

AccelerationSeries acceleration_series(const ChemistryProfile& profile,
                                       const std::vector<double>& temp_c) {
  AccelerationSeries a;
  a.per_hour.resize(temp_c.size());
  a.prefix.resize(temp_c.size() + 1);
  a.prefix[0] = 0;
  for (std::size_t h = 0; h < temp_c.size(); ++h) {
    a.per_hour[h] = profile.temperature.ageing_acceleration(temp_c[h]);
    a.prefix[h + 1] = a.prefix[h] + a.per_hour[h];
  }
  a.calendar_damage_per_year =
      a.prefix.back() / (profile.calendar_life_years * static_cast<double>(kHoursPerYear));
  return a;
}

YearDamage year_damage(const ChemistryProfile& profile, const AccelerationSeries& acceleration,
                       const std::vector<double>& soc_trace, double partial_charge_excess_days,
                       RainflowScratch& scratch) {
  YearDamage d;
  const std::vector<double>& prefix = acceleration.prefix;
  const CycleLifeCurve& curve = profile.cycle_life;
  count_cycles(soc_trace.data(), soc_trace.size(), scratch, [&](const RainflowCycle& c) {
    // Trace point i is the state after hour i - 1, so a cycle between points a < b spans
    // hours a .. b-1; its temperature acceleration is the mean over those hours.
    const std::size_t a = c.first_index, b = c.last_index;
    const double accel = b > a ? (prefix[b] - prefix[a]) / static_cast<double>(b - a) : 1.0;
    d.cycle += c.count * accel * curve.damage_per_cycle(c.depth);
  });
  d.calendar = acceleration.calendar_damage_per_year;
  if (profile.partial_charge)
    d.partial_charge = partial_charge_excess_days * profile.partial_charge->damage_per_extra_day;
  return d;
}

double health_from_damage(const ChemistryProfile& profile, double damage) {
  const double capped = damage < 0 ? 0 : (damage > 1 ? 1 : damage);
  return 1.0 - (1.0 - profile.eol_capacity_fraction) * capped;
}

}  // namespace stowage
