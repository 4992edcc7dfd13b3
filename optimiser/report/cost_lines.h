// SPDX-License-Identifier: MIT
// The one list of cost lines: the key that JSON and CSV carry and the label a person reads,
// for each present-value item of CostBreakdown (model/lifecycle.h), in report order.
// The order and the terms follow the published LCOS methods (e.g. Schmidt et al. 2019, Joule
// 3(1) 81-100): investment, replacement, operation and maintenance, charging, end of life,
// residual value; the two costs of a shortfall in service (back-up energy, unserved-energy
// penalty) are not storage costs and come last under their own term.
#pragma once

#include <vector>

#include "model/lifecycle.h"

namespace stowage::report {

struct CostLine {
  const char* key;    // JSON and CSV name (CSV columns prefix it with "pv_")
  const char* label;  // text label
  const char* term;   // the LCOS term the line belongs to (lines of one term are adjacent)
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
