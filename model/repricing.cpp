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
  const double replacement_end_of_life_cost = costs.replacement_end_of_life(nameplate);
  double charge_price = 0;
  const bool flat = flat_price(site, charge_price);

  CostBreakdown& pv = r.present_value;
  pv = CostBreakdown{};
  pv.investment = r.investment;
  r.discounted_delivered_kwh = 0;
  int age_years = 0;  // of the bank in service
  for (YearRecord& rec : r.years) {
    age_years += 1;
    rec.fixed_om = costs.fixed_om_per_year(nameplate);
    rec.variable_om = costs.variable_om(rec.dispatch.discharged_terminal_kwh);
    if (flat) {
      rec.dispatch.charge_cost =
          charge_price * (rec.dispatch.charge_source_kwh + rec.dispatch.auxiliary_source_kwh);
    }
    rec.charging = rec.dispatch.charge_cost;
    rec.backup =
        site.backup_price_per_kwh ? rec.dispatch.backup_kwh * *site.backup_price_per_kwh : 0.0;
    rec.unserved_penalty = rec.dispatch.unserved_kwh * site.unserved_penalty_per_kwh;
    rec.replacement = 0;
    rec.end_of_life = 0;
    rec.residual_value = 0;
    if (rec.replaced_at_end) {
      rec.replacement = rec.replacements * costs.replacement_price(r.investment, rec.year);
      rec.end_of_life = rec.replacements * replacement_end_of_life_cost;
      age_years = 0;
    }
    if (rec.year == economics.project_years) {
      double used = std::min(1.0, rec.damage_end);
      if (profile.max_service_years) {
        used = std::max(used, age_years / *profile.max_service_years);
      }
      const double remaining = 1.0 - used;
      if (remaining > 0) {
        rec.residual_value = costs.residual_value(r.investment, economics.project_years, remaining);
      }
    }
    rec.discount_factor = present_worth_factor(economics.real_discount_rate, rec.year);
    const double df = rec.discount_factor;
    pv.replacements += rec.replacement * df;
    pv.fixed_om += rec.fixed_om * df;
    pv.variable_om += rec.variable_om * df;
    pv.charging += rec.charging * df;
    pv.backup += rec.backup * df;
    pv.unserved_penalty += rec.unserved_penalty * df;
    pv.end_of_life += rec.end_of_life * df;
    pv.residual_value += rec.residual_value * df;
    r.discounted_delivered_kwh += rec.dispatch.delivered_kwh * df;
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
