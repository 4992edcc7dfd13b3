// SPDX-License-Identifier: MIT
// Re-pricing a simulated design: the same bank, the same hourly energy flows, the same wear and
// the same replacement years, priced with other costs, prices and discount rate.
//
// A design's dispatch and ageing never read a price: the dispatch charges from any surplus and
// asks only whether there is back-up, not what it costs (model/dispatch.h), and wear depends on
// the state of charge and the temperature alone (model/ageing.h). So when only prices change
// (the paths catalog-schema/parameter_paths.h marks prices_only), a design's yearly records
// stay as simulated and only its cash flows change. reprice() recomputes them with the
// lifecycle evaluation's own year pricing (price_year and add_discounted, model/lifecycle.h),
// each line through the one formula of model/costs.h:
//   year 0      I0 = DesignCosts::investment(nameplate, strings)
//   year y      fixed O&M, variable O&M of the year's discharged terminal kWh, back-up kWh x
//               back-up price, unserved kWh x penalty, charging (below), and in a year with
//               replacements (made at month ends, booked in their year): banks x P(y) and
//               banks x replacement end of life
//   year N      residual value -P(N) x the remaining life fraction of the bank in service
//               (from its damage and age, as simulated)
//   N + 1 or later  the last bank's end of life, at the year simulated (it depends on wear only)
// each discounted by present_worth_factor(rate, year) (model/economics.h); then
// DesignResult::settle_totals() forms NPC and both LCOS, as the lifecycle evaluation does.
// Charging: when the site's charging price is one flat price p (the only case in which it can
// be varied, parameter_paths.h), a year costs p x (charge source kWh + auxiliary source kWh),
// and its conditioning p x conditioning source kWh + conditioning back-up kWh x back-up price
// (with the enclosure's capital in year 0 and its O&M each year);
// otherwise the hourly series must be the one simulated and the year's charging cost is kept.
//
// Preconditions (ContractViolation otherwise): `simulated` is a complete evaluation (one record
// per project year) and economics.project_years equals its number of years. The caller makes
// sure that profile and site differ from the simulated ones in prices only.
#pragma once

#include "model/chemistry_profile.h"
#include "model/economics.h"
#include "model/lifecycle.h"
#include "model/site.h"

namespace stowage {

DesignResult reprice(const DesignResult& simulated, const ChemistryProfile& profile,
                     const SiteConditions& site, const Economics& economics);

}  // namespace stowage
