// SPDX-License-Identifier: MIT
#include "model/ageing.h"

#include "model/site.h"

namespace stowage {

AccelerationSeries acceleration_series(const ChemistryProfile& profile,
                                       const std::vector<double>& temp_c) {
  AccelerationSeries a;
  a.per_hour.resize(temp_c.size());
  a.calendar_per_hour.resize(temp_c.size());
  double sum = 0;
  for (std::size_t h = 0; h < temp_c.size(); ++h) {
    a.per_hour[h] = profile.temperature.ageing_acceleration(temp_c[h]);
    a.calendar_per_hour[h] = profile.temperature.calendar_acceleration(temp_c[h]);
    sum += a.calendar_per_hour[h];
  }
  const double per_hour_life = 1.0 / (profile.calendar_life_years * kHoursPerYear);
  a.calendar_damage_per_year =
      sum / (profile.calendar_life_years * static_cast<double>(kHoursPerYear));
  const std::size_t month_hours = static_cast<std::size_t>(kHoursPerMonth);
  for (std::size_t first = 0; first + month_hours <= a.calendar_per_hour.size();
       first += month_hours) {
    double month = 0;
    for (std::size_t h = first; h < first + month_hours; ++h) month += a.calendar_per_hour[h];
    a.calendar_damage_per_month.push_back(month * per_hour_life);
  }
  return a;
}

void refresh_acceleration_month(const ChemistryProfile& profile, const double* temp_c,
                                std::size_t first, std::size_t end, AccelerationSeries& a) {
  double month = 0;
  for (std::size_t h = first; h < end; ++h) {
    a.per_hour[h] = profile.temperature.ageing_acceleration(temp_c[h]);
    a.calendar_per_hour[h] = profile.temperature.calendar_acceleration(temp_c[h]);
    month += a.calendar_per_hour[h];
  }
  const std::size_t month_hours = static_cast<std::size_t>(kHoursPerMonth);
  a.calendar_damage_per_month[first / month_hours] =
      month / (profile.calendar_life_years * kHoursPerYear);
}

double CycleDamageMeter::depth_damage(const CycleLifeCurve& curve, double depth) {
  // Floor-limited discharges repeat the same depth exactly, day after day: the last value is
  // kept, so the curve's logarithms are worked out once for them (the same number either way).
  if (depth != last_depth_) {
    last_depth_ = depth;
    last_damage_ = curve.damage_per_cycle(depth);
  }
  return last_damage_;
}

void CycleDamageMeter::start(const ChemistryProfile& profile,
                             const AccelerationSeries& acceleration, const double* soc_trace,
                             std::size_t first) {
  profile_ = &profile;
  last_depth_ = -1;  // a new history may be of another profile
  stream_.reset(soc_trace, acceleration.per_hour.data(), first);
  closed_ = 0;
}

void CycleDamageMeter::extend(std::size_t end) {
  const CycleLifeCurve& curve = profile_->cycle_life;
  stream_.extend(end, [&](const RainflowCycle& c) {
    closed_ += c.count * c.leg_weight * depth_damage(curve, c.depth);
  });
}

double CycleDamageMeter::provisional() {
  const CycleLifeCurve& curve = profile_->cycle_life;
  double d = closed_;
  stream_.emit_residue(
      [&](const RainflowCycle& c) { d += c.count * c.leg_weight * depth_damage(curve, c.depth); });
  return d;
}

double CycleDamageMeter::close() {
  const CycleLifeCurve& curve = profile_->cycle_life;
  stream_.close([&](const RainflowCycle& c) {
    closed_ += c.count * c.leg_weight * depth_damage(curve, c.depth);
  });
  return closed_;
}

double calendar_damage(const ChemistryProfile& profile, const AccelerationSeries& acceleration,
                       const double* soc_trace, std::size_t first, std::size_t end) {
  const double per_hour_life = 1.0 / (profile.calendar_life_years * kHoursPerYear);
  const double* a = acceleration.calendar_per_hour.data();
  double sum = 0;
  if (profile.calendar_soc_stress) {
    const CalendarSocStress& stress = *profile.calendar_soc_stress;
    for (std::size_t h = first; h < end; ++h)
      sum += a[h] * stress.multiplier(0.5 * (soc_trace[h] + soc_trace[h + 1]));
  } else {
    const std::size_t month_hours = static_cast<std::size_t>(kHoursPerMonth);
    if (first % month_hours == 0 && end == first + month_hours)
      return acceleration.calendar_damage_per_month[first / month_hours];
    for (std::size_t h = first; h < end; ++h) sum += a[h];
  }
  return sum * per_hour_life;
}

YearDamage year_damage(const ChemistryProfile& profile, const AccelerationSeries& acceleration,
                       const std::vector<double>& soc_trace, double partial_charge_excess_days,
                       RainflowScratch& scratch) {
  YearDamage d;
  const CycleLifeCurve& curve = profile.cycle_life;
  // Trace point i is the state after hour i - 1, so step i of the trace is hour i: each cycle
  // is aged at the acceleration of the hours in which it moved charge.
  count_cycles(
      soc_trace.data(), soc_trace.size(), scratch,
      [&](const RainflowCycle& c) {
        d.cycle += c.count * c.leg_weight * curve.damage_per_cycle(c.depth);
      },
      acceleration.per_hour.data());
  d.calendar = acceleration.calendar_damage_per_year;
  if (profile.calendar_soc_stress) {
    double sum = 0;
    for (std::size_t h = 0; h + 1 < soc_trace.size(); ++h)
      sum += acceleration.calendar_per_hour[h] *
             profile.calendar_soc_stress->multiplier(0.5 * (soc_trace[h] + soc_trace[h + 1]));
    d.calendar = sum / (profile.calendar_life_years * static_cast<double>(kHoursPerYear));
  }
  if (profile.partial_charge)
    d.partial_charge = partial_charge_excess_days * profile.partial_charge->damage_per_extra_day;
  return d;
}

double health_from_damage(const ChemistryProfile& profile, double damage) {
  const double capped = damage < 0 ? 0 : (damage > 1 ? 1 : damage);
  return 1.0 - (1.0 - profile.eol_capacity_fraction) * capped;
}

}  // namespace stowage
