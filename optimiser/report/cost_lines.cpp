// SPDX-License-Identifier: MIT
#include "optimiser/report/cost_lines.h"

#include <algorithm>
#include <cmath>

namespace stowage::report {

const std::vector<CostLine>& cost_lines() {
  static const std::vector<CostLine> lines = {
      {"investment", "investment (year 0)", "investment", &CostBreakdown::investment},
      {"replacements", "replacements", "replacement", &CostBreakdown::replacements},
      {"fixed_om", "fixed O&M", "O&M", &CostBreakdown::fixed_om},
      {"variable_om", "variable O&M", "O&M", &CostBreakdown::variable_om},
      {"charging", "charging energy (incl. losses)", "charging", &CostBreakdown::charging},
      {"end_of_life", "end of life", "end of life", &CostBreakdown::end_of_life},
      {"residual_value", "residual value (credit)", "residual", &CostBreakdown::residual_value},
      {"enclosure", "enclosure capital and O&M", "enclosure", &CostBreakdown::enclosure},
      {"conditioning", "heating and cooling energy", "enclosure", &CostBreakdown::conditioning},
      {"backup", "back-up energy", "service shortfall", &CostBreakdown::backup},
      {"unserved_penalty", "unserved-energy penalty", "service shortfall",
       &CostBreakdown::unserved_penalty},
  };
  return lines;
}

std::vector<CostDifference> cost_differences(const CostBreakdown& design,
                                             const CostBreakdown& reference, double at_least) {
  std::vector<CostDifference> out;
  for (const CostLine& line : cost_lines()) {
    const double delta = design.*line.member - reference.*line.member;
    if (std::fabs(delta) >= at_least) out.push_back({&line, delta});
  }
  std::stable_sort(out.begin(), out.end(), [](const CostDifference& a, const CostDifference& b) {
    return a.amount > b.amount;
  });
  return out;
}

}  // namespace stowage::report
