// SPDX-License-Identifier: MIT
#include "model/duty_cycles.h"

#include <algorithm>
#include <cmath>

#include "model/ageing.h"
#include "model/contract.h"
#include "model/site.h"

namespace stowage {

DutyCycleSummary summarise_cycles(const std::vector<double>& soc_fraction, int bins) {
  if (bins < 1) throw ContractViolation("bins", "must be at least 1");
  DutyCycleSummary s;
  s.soc_fraction = soc_fraction;
  s.cycles = rainflow(soc_fraction);
  const double width = 1.0 / bins;
  for (int b = 0; b < bins; ++b) s.histogram.push_back({b * width, (b + 1) * width, 0.0});
  for (const auto& c : s.cycles) {
    const int b = std::min(bins - 1, static_cast<int>(std::floor(c.depth / width)));
    s.histogram[static_cast<std::size_t>(b)].count += c.count;
    s.equivalent_full_cycles += c.count * c.depth;
  }
  return s;
}

DutyDamage duty_damage(const ChemistryProfile& profile, const DutyCycleSummary& summary,
                       const std::vector<double>& temp_c, std::size_t samples,
                       double hours_per_sample) {
  if (!(hours_per_sample > 0)) throw ContractViolation("hours_per_sample", "must be positive");
  if (!temp_c.empty() && temp_c.size() != samples)
    throw ContractViolation("temp_c", "needs one temperature per SOC sample");
  // Sample i stands for the interval that follows it: step i of the series is aged at
  // a(temp_c[i]), and each cycle at the acceleration of the steps in which it moved charge.
  // Calendar ageing of interval i: the calendar law at temp_c[i] times the SOC stress of the
  // interval's mean SOC.
  if (summary.soc_fraction.size() != samples)
    throw ContractViolation("samples", "must equal the length of the summarised SOC series");
  const std::vector<double>& soc = summary.soc_fraction;
  std::vector<double> accel(samples > 0 ? samples - 1 : 0, 1.0);
  double calendar_sum = 0;
  for (std::size_t i = 0; i < accel.size(); ++i) {
    double calendar = 1.0;
    if (!temp_c.empty()) {
      accel[i] = profile.temperature.ageing_acceleration(temp_c[i]);
      calendar = profile.temperature.calendar_acceleration(temp_c[i]);
    }
    if (profile.calendar_soc_stress)
      calendar *= profile.calendar_soc_stress->multiplier(0.5 * (soc[i] + soc[i + 1]));
    calendar_sum += calendar;
  }
  DutyDamage d;
  for (const auto& c : rainflow(summary.soc_fraction, accel))
    d.cycle += c.count * c.leg_weight * profile.cycle_life.damage_per_cycle(c.depth);
  d.series_hours = static_cast<double>(samples > 0 ? samples - 1 : 0) * hours_per_sample;
  // Each sample stands for the interval that follows it; the last closes the log.
  const double mean_calendar =
      accel.empty() ? 1.0 : calendar_sum / static_cast<double>(accel.size());
  d.calendar = d.series_hours * mean_calendar / (profile.calendar_life_years * kHoursPerYear);
  const double total = d.total();
  if (total >= 1.0 || !(total > 0) || !(d.series_hours > 0)) {
    d.remaining_life_years = total >= 1.0 ? 0.0 : INFINITY;
    d.remaining_equivalent_full_cycles = total >= 1.0 ? 0.0 : INFINITY;
  } else {
    const double per_hour = total / d.series_hours;
    d.remaining_life_years = (1.0 - total) / per_hour / kHoursPerYear;
    d.remaining_equivalent_full_cycles = summary.equivalent_full_cycles * (1.0 - total) / total;
  }
  return d;
}

}  // namespace stowage
