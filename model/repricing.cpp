// SPDX-License-Identifier: MIT
#include "model/repricing.h"

#include <algorithm>

#include "model/contract.h"
#include "model/costs.h"

namespace stowage {

namespace {

// The flat charging price, when the series is one.
bool flat_price(const SiteConditions& site, double& price) {
  if (site.charge_price_per_kwh.empty()) return false;
  price = site.charge_price_per_kwh.front();
  for (double x : site.charge_price_per_kwh) {
    if (x != price) return false;
  }
  return true;
}

}  // namespace

DesignResult reprice(const DesignResult& simulated, const ChemistryProfile& profile,
                     const SiteConditions& site, const Economics& economics) {
  if (simulated.years.empty() ||
      simulated.years.size() != static_cast<std::size_t>(economics.project_years)) {
    throw ContractViolation("simulated", "one record per project year of the economics");
  }
  const DesignCosts costs(profile.costs,
                          bank_geometry(profile, site.bus_voltage_v, 1).nameplate_kwh);
  DesignResult r = simulated;
  r.currency = economics.currency;
  const double nameplate = r.bank.nameplate_kwh;
  r.investment = costs.investment(nameplate, r.bank.strings_parallel);
  const double end_of_life_cost = costs.final_end_of_life(nameplate);
  double charge_price = 0;
  const bool flat = flat_price(site, charge_price);

  CostBreakdown& pv = r.present_value;
  pv = CostBreakdown{};
  pv.investment = r.investment;
  r.enclosure_capital = site.enclosure ? site.enclosure->capital : 0.0;
  pv.enclosure = r.enclosure_capital;
  r.discounted_delivered_kwh = 0;
  for (YearRecord& rec : r.years) {
    if (flat) {
      rec.dispatch.charge_cost =
          charge_price * (rec.dispatch.charge_source_kwh + rec.dispatch.auxiliary_source_kwh);
      rec.dispatch.conditioning_cost = charge_price * rec.dispatch.conditioning_source_kwh;
    }
    price_year(rec, costs, r.investment, nameplate, site, economics, profile,
               simulated.last_bank_age_years);
    add_discounted(rec, r);
  }
  r.final_end_of_life = end_of_life_cost;
  r.final_discount_factor =
      present_worth_factor(economics.real_discount_rate, r.final_end_of_life_year);
  pv.end_of_life += end_of_life_cost * r.final_discount_factor;
  r.project_end_discount_factor =
      present_worth_factor(economics.real_discount_rate, economics.project_years + 1.0);
  r.settle_totals();
  return r;
}

}  // namespace stowage
