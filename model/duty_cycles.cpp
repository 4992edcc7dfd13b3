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
  // Acceleration per sample with prefix sums, as in the yearly ageing.
  std::vector<double> prefix(samples + 1, 0.0);
  for (std::size_t i = 0; i < samples; ++i) {
    const double a = temp_c.empty() ? 1.0 : profile.temperature.ageing_acceleration(temp_c[i]);
    prefix[i + 1] = prefix[i] + a;
  }
  DutyDamage d;
  for (const auto& c : summary.cycles) {
    const std::size_t a = c.first_index, b = c.last_index;
    const double accel = b > a ? (prefix[b] - prefix[a]) / static_cast<double>(b - a) : 1.0;
    d.cycle += c.count * accel * profile.cycle_life.damage_per_cycle(c.depth);
  }
  d.series_hours = static_cast<double>(samples > 0 ? samples - 1 : 0) * hours_per_sample;
  // Each sample stands for the interval that follows it; the last closes the log.
  const double mean_accel =
      samples > 1 ? prefix[samples - 1] / static_cast<double>(samples - 1) : 1.0;
  d.calendar = d.series_hours * mean_accel / (profile.calendar_life_years * kHoursPerYear);
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
