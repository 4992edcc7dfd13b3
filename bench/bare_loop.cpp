// SPDX-License-Identifier: MIT
#include "bare_loop.h"

#include <algorithm>
#include <cmath>

namespace stowage::bench {

double bare_loop_damage(const BareLoopInputs& in) {
  const double* surplus = in.surplus_kwh->data();
  const double* deficit = in.deficit_kwh->data();
  const double* factor = in.capacity_factor->data();
  const std::size_t hours = in.surplus_kwh->size();
  // Open reversals, bottom = starting point; a history of n reversals never holds more than
  // a few dozen open ones (each closes when a larger range follows), 4096 is ample.
  constexpr std::size_t kCap = 4096;
  double stack[kCap];
  std::size_t size = 0;
  double damage = 0;
  double soc = 1.0, last = 1.0;
  int direction = 0;
  auto push = [&](double reversal) {
    if (size == kCap) return;  // unreachable on a bounded SOC history; keeps the array safe
    stack[size++] = reversal;
    while (size >= 3) {
      const std::size_t k = size;
      const double x = std::fabs(stack[k - 1] - stack[k - 2]);
      const double y = std::fabs(stack[k - 2] - stack[k - 3]);
      if (x < y) break;
      if (k == 3) {
        damage += 0.5 * in.curve->damage_per_cycle(y);
        stack[0] = stack[1];
        stack[1] = stack[2];
        size = 2;
      } else {
        damage += in.curve->damage_per_cycle(y);
        stack[k - 3] = stack[k - 1];
        size = k - 2;
      }
    }
  };
  push(soc);
  for (int year = 0; year < in.years; ++year) {
    for (std::size_t h = 0; h < hours; ++h) {
      soc *= in.keep_per_hour;
      if (surplus[h] > 0) {
        soc += std::min(std::min(surplus[h] * in.charge_soc_per_kwh, in.max_charge_soc), 1.0 - soc);
      } else if (deficit[h] > 0) {
        const double floor_soc = 1.0 - in.dod_setpoint * std::min(1.0, factor[h]);
        const double want = std::min(deficit[h] * in.discharge_soc_per_kwh, in.max_discharge_soc);
        soc -= std::max(0.0, std::min(want, soc - floor_soc));
      }
      const double step = soc - last;
      if (step != 0) {
        const int s = step > 0 ? 1 : -1;
        if (direction != 0 && s != direction) push(last);
        direction = s;
        last = soc;
      }
    }
  }
  push(last);
  for (std::size_t i = 0; i + 1 < size; ++i)
    damage += 0.5 * in.curve->damage_per_cycle(std::fabs(stack[i + 1] - stack[i]));
  return damage;
}

}  // namespace stowage::bench
