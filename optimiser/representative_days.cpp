// SPDX-License-Identifier: MIT
#include "optimiser/representative_days.h"

#include <algorithm>
#include <cmath>
#include <limits>

#include "model/contract.h"

namespace stowage {

int RepresentativeDays::total_hours() const {
  int total = 0;
  for (const RepresentativeBlock& b : blocks) total += b.hours;
  return total;
}

RepresentativeDays select_representative_days(const SiteConditions& site, int days_per_block) {
  if (days_per_block < 1 || days_per_block > 28) {
    throw ContractViolation("days_per_block", "must be between 1 and 28");
  }
  constexpr int kDays = kHoursPerYear / 24;
  std::vector<double> deficit(kDays, 0.0), surplus(kDays, 0.0);
  std::vector<int> month_of(kDays);
  double load_total = 0;
  for (int d = 0; d < kDays; ++d) {
    for (int h = 24 * d; h < 24 * d + 24; ++h) {
      const HourBalance b = hour_balance(site, static_cast<std::size_t>(h));
      surplus[d] += b.surplus_kwh;
      deficit[d] += b.deficit_kwh;
      load_total += site.load_kw[h];
    }
    month_of[d] = std::min(11, static_cast<int>((24 * d + 12) / kHoursPerMonth));
  }
  const double scale = std::max(load_total / kDays, 1e-9);
  RepresentativeDays out;
  out.days_per_block = days_per_block;
  for (int m = 0; m < 12; ++m) {
    int first = kDays, last = -1;
    for (int d = 0; d < kDays; ++d) {
      if (month_of[d] == m) {
        first = std::min(first, d);
        last = std::max(last, d);
      }
    }
    const int days = last - first + 1;
    const int k = std::min(days_per_block, days);
    double mean_deficit = 0, mean_surplus = 0;
    for (int d = first; d <= last; ++d) {
      mean_deficit += deficit[d] / days;
      mean_surplus += surplus[d] / days;
    }
    int best = first;
    double best_distance = std::numeric_limits<double>::infinity();
    for (int start = first; start + k - 1 <= last; ++start) {
      double block_deficit = 0, block_surplus = 0;
      for (int d = start; d < start + k; ++d) {
        block_deficit += deficit[d] / k;
        block_surplus += surplus[d] / k;
      }
      const double distance = std::hypot((block_deficit - mean_deficit) / scale,
                                         (block_surplus - mean_surplus) / scale);
      if (distance < best_distance - 1e-12) {
        best_distance = distance;
        best = start;
      }
    }
    RepresentativeBlock b;
    b.first_hour = 24 * best;
    b.hours = 24 * k;
    b.weight = static_cast<double>(days) / k;
    b.month = m;
    out.blocks.push_back(b);
  }
  return out;
}

}  // namespace stowage
