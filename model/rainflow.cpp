// SPDX-License-Identifier: MIT
#include "model/rainflow.h"

#include "model/invalid_value.h"

namespace stowage {

void find_reversals(const double* series, std::size_t n, std::vector<std::size_t>& out) {
  out.clear();
  if (n == 0) return;
  out.push_back(0);
  int direction = 0;     // +1 rising, -1 falling, 0 not yet known
  std::size_t last = 0;  // latest point that differs from its predecessor
  for (std::size_t i = 1; i < n; ++i) {
    const double step = series[i] - series[last];
    if (step == 0) continue;  // a plateau counts once
    const int s = step > 0 ? 1 : -1;
    if (direction != 0 && s != direction) out.push_back(last);
    direction = s;
    last = i;
  }
  if (last != out.back()) out.push_back(last);
}

std::vector<RainflowCycle> rainflow(const std::vector<double>& series) {
  std::vector<RainflowCycle> cycles;
  RainflowScratch scratch;
  count_cycles(series.data(), series.size(), scratch,
               [&](const RainflowCycle& c) { cycles.push_back(c); });
  return cycles;
}

std::vector<RainflowCycle> rainflow(const std::vector<double>& series,
                                    const std::vector<double>& step_weight) {
  if (!series.empty() && step_weight.size() + 1 != series.size())
    throw InvalidValue("step_weight",
                       "needs one weight per step: " + std::to_string(series.size() - 1) +
                           " values, found " + std::to_string(step_weight.size()));
  std::vector<RainflowCycle> cycles;
  RainflowScratch scratch;
  count_cycles(
      series.data(), series.size(), scratch, [&](const RainflowCycle& c) { cycles.push_back(c); },
      series.empty() ? nullptr : step_weight.data());
  return cycles;
}

}  // namespace stowage
