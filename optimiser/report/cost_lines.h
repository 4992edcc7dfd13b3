// SPDX-License-Identifier: MIT
// The one list of cost lines: the key that JSON and CSV carry and the label a person reads,
// for each present-value item of CostBreakdown (model/lifecycle.h), in report order.
#pragma once

#include <vector>

#include "model/lifecycle.h"

namespace stowage::report {

struct CostLine {
  const char* key;    // JSON and CSV name (CSV columns prefix it with "pv_")
  const char* label;  // text label
  double CostBreakdown::*member;
};

const std::vector<CostLine>& cost_lines();

// One line of a comparison: how much more (> 0) or less `design` spends than another.
struct CostDifference {
  const CostLine* line;
  double amount;
};
// The lines where `design` and `reference` differ by at least `at_least`, biggest first.
std::vector<CostDifference> cost_differences(const CostBreakdown& design,
                                             const CostBreakdown& reference, double at_least = 0.5);

}  // namespace stowage::report
