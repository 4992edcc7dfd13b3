// SPDX-License-Identifier: MIT
// Compound-interest factors, discrete and end-of-period, with a real rate i per year:
//   P/F = (1 + i)^-n            present worth of a single sum n years ahead
//   P/A = ((1+i)^n - 1) / (i (1+i)^n)   present worth of a uniform series (i = 0: n)
//   A/P = i (1+i)^n / ((1+i)^n - 1)     capital recovery factor (i = 0: 1/n)
// as tabulated in engineering-economics texts.
#pragma once

#include <string>

namespace stowage {

struct Economics {
  int project_years = 20;            // 1..100
  double real_discount_rate = 0.06;  // [0, 1)
  std::string currency = "EUR";

  void validate() const;  // throws InvalidValue
};

double present_worth_factor(double rate, double years);
double series_present_worth_factor(double rate, int years);
double capital_recovery_factor(double rate, int years);

}  // namespace stowage
