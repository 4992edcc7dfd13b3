// SPDX-License-Identifier: MIT
// The one definition of every cost formula of a bank design. The exact simulator
// (model/lifecycle.h), the optimiser's rigorous lower bound and the coefficients of its
// mixed-integer model all price a bank through these functions, so they cannot drift apart.
//
// For a design of n strings with nameplate E kWh (docs/method.md, section "Cash flows"):
//   investment        I0(n)   = capital_per_kwh x E + capital_per_string x n + installation_fixed
//                               (year 0; affine in n: I0 = per_string x n + fixed)
//   replacement price P(y)    = I0 x replacement_share x (1 - price_decline_per_year)^y
//                               (a bank bought at the end of year y)
//   end of life at a replacement  = replacement_end_of_life_per_kwh x E   (when given, else the
//                               end-of-life cost below: a trade-in can differ from disposal)
//   end of life of the last bank  = end_of_life_per_kwh x E   (at N + 1 or later)
//   fixed O&M per year        = fixed_om_per_kwh_year x E
//   variable O&M per year     = variable_om_per_mwh x discharged terminal kWh / 1000
//   residual value at N       = -P(N) x remaining life fraction of the bank in service
//                               (<= 0, a credit): the life left is worth what a bank would
//                               cost in the project's last year, not what was paid for it
// Units: currency of the profile; energy in kWh; years counted from the start of operation.
// The functions do no validation: the loader has checked the inputs (prices >= 0, shares and
// declines in [0, 1)).
#pragma once

#include "model/chemistry_profile.h"

namespace stowage {

// An amount affine in the number of strings: per_string x n + fixed.
struct AffineInStrings {
  double per_string = 0;
  double fixed = 0;
  double at(int strings) const { return per_string * strings + fixed; }
};

class DesignCosts {
 public:
  // `string_nameplate_kwh`: the nameplate of one string on the study's bus (bank.h).
  DesignCosts(const ProfileCosts& costs, double string_nameplate_kwh)
      : c_(costs), string_kwh_(string_nameplate_kwh) {}

  // I0 as per_string x n + fixed, for models linear in n.
  AffineInStrings investment_in_strings() const {
    return {c_.capital_per_kwh * string_kwh_ + c_.capital_per_string, c_.installation_fixed};
  }
  // I0 of a bank of `strings` strings with nameplate `nameplate_kwh` (the bank's own figure,
  // so rounding matches BankGeometry exactly).
  double investment(double nameplate_kwh, int strings) const {
    return c_.capital_per_kwh * nameplate_kwh + c_.capital_per_string * strings +
           c_.installation_fixed;
  }
  // P(y): the price of a replacement bank bought at the end of year y, for a bank whose
  // year-0 investment was `investment`.
  double replacement_price(double investment, double year) const;
  // The fraction P(y) / I0 = replacement_share x (1 - price_decline_per_year)^y.
  double replacement_price_factor(double year) const;
  double replacement_end_of_life_per_kwh() const {
    return c_.replacement_end_of_life_per_kwh.value_or(c_.end_of_life_per_kwh);
  }
  double replacement_end_of_life(double nameplate_kwh) const {
    return replacement_end_of_life_per_kwh() * nameplate_kwh;
  }
  double final_end_of_life(double nameplate_kwh) const {
    return c_.end_of_life_per_kwh * nameplate_kwh;
  }
  double fixed_om_per_year(double nameplate_kwh) const {
    return c_.fixed_om_per_kwh_year * nameplate_kwh;
  }
  double variable_om(double discharged_terminal_kwh) const {
    return c_.variable_om_per_mwh * discharged_terminal_kwh / 1000.0;
  }
  // -P(N) x remaining_fraction: the credit at the end of year `project_years` = N for the life
  // left in the bank then in service, valued at the replacement price of that year for a design
  // whose year-0 investment was `investment` (whichever bank is in service and whatever it
  // cost). remaining_fraction in [0, 1].
  double residual_value(double investment, int project_years, double remaining_fraction) const {
    return -replacement_price(investment, project_years) * remaining_fraction;
  }

  double string_nameplate_kwh() const { return string_kwh_; }
  const ProfileCosts& inputs() const { return c_; }

 private:
  ProfileCosts c_;
  double string_kwh_;
};

}  // namespace stowage
