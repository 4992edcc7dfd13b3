// SPDX-License-Identifier: MIT
#include "model/costs.h"

#include <cmath>

namespace stowage {

double DesignCosts::replacement_price_factor(double year) const {
  return c_.replacement_share * std::pow(1.0 - c_.price_decline_per_year, year);
}

double DesignCosts::replacement_price(double investment, double year) const {
  return investment * replacement_price_factor(year);
}

}  // namespace stowage
