// SPDX-License-Identifier: MIT
#include "model/economics.h"

#include <cmath>

#include "model/invalid_value.h"

namespace stowage {

void Economics::validate() const {
  if (project_years < 1 || project_years > 100)
    throw InvalidValue("project_years", "must be a whole number of years from 1 to 100");
  if (!(real_discount_rate >= 0 && real_discount_rate < 1))
    throw InvalidValue("real_discount_rate", "must be in [0, 1)");
  if (currency.empty()) throw InvalidValue("currency", "must not be empty");
}

double present_worth_factor(double rate, double years) { return std::pow(1.0 + rate, -years); }

double series_present_worth_factor(double rate, int years) {
  if (rate == 0) return years;
  const double g = std::pow(1.0 + rate, years);
  return (g - 1.0) / (rate * g);
}

double capital_recovery_factor(double rate, int years) {
  return 1.0 / series_present_worth_factor(rate, years);
}

}  // namespace stowage
