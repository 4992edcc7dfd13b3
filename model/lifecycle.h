// SPDX-License-Identifier: MIT
// Exact lifecycle evaluation of one bank design (profile, DoD setpoint, strings in parallel) at
// a site over the project life: month-by-month dispatch with the capacity of that month, ageing,
// replacements, cash flows, net present cost and LCOS.
//
// Conventions (docs/method.md gives the derivation and sources):
// - Year 0: investment I0 = capital_per_kwh x nameplate + capital_per_string x strings
//   + installation_fixed. Years 1..N: operating flows, each discounted at the end of its year.
// - Each year runs as 12 months of 730 h; each month with the health its bank has at the
//   month's start (damage so far, the rainflow residue counted as half cycles). When the
//   accumulated damage reaches 1 (or the bank reaches max_service_years) at the end of a month,
//   except the project's last, the bank is replaced then; the replacement is booked in that
//   year at I0 x replacement_share x (1 - price_decline)^y, plus the end-of-life cost of what
//   is removed, and discounted at the year's end with the year's other flows; the new bank
//   starts full. A bank whose damage passed 1 by more than a whole life within the month counts
//   as floor(D) replacements, and the wear beyond them is carried into the new bank.
// - Residual value of the bank in service at project end: the replacement price of year N,
//   I0 x replacement_share x (1 - price_decline)^N, x its remaining life fraction
//   (1 - max(D, age / max_service_years)), credited at N. Its end-of-life flow falls at N + 1
//   (Schmidt et al. 2019) when it is worn out with the project, otherwise when its remaining
//   life runs out at the wear rate it has shown (never before N + 1).
// - LCOS (Schmidt, Melchior, Hawkes & Staffell 2019, Joule 3:81-100) = present value of the
//   storage costs (investment, replacements, O&M, charging energy, end of life, minus residual)
//   / present value of the energy the storage delivers after the inverter. Charging energy is
//   priced where it is drawn, before the charger, so both sides sit at the same boundary.
// - LCOS under Schmidt et al.'s own conventions (lcos_schmidt_per_kwh): the same flows and
//   denominator, but no residual value and the last bank's end of life always at N + 1.
// - NPC = storage costs + back-up energy + unserved-energy penalty (present values): the
//   lifecycle cost of serving the site, which the optimiser minimises.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "model/ageing.h"
#include "model/bank.h"
#include "model/chemistry_profile.h"
#include "model/costs.h"
#include "model/dispatch.h"
#include "model/economics.h"
#include "model/site.h"

namespace stowage {

// Present values, in currency; residual_value is <= 0 (a credit).
struct CostBreakdown {
  double investment = 0;
  double replacements = 0;
  double fixed_om = 0;
  double variable_om = 0;
  double charging = 0;
  double backup = 0;
  double unserved_penalty = 0;
  double end_of_life = 0;
  double residual_value = 0;
  double enclosure = 0;     // the enclosure's capital and O&M (enclosure.h)
  double conditioning = 0;  // energy bought for heating, cooling and the enclosure's standing load

  double storage_total() const {
    return investment + replacements + fixed_om + variable_om + charging + end_of_life +
           residual_value + enclosure + conditioning;
  }
  double total() const { return storage_total() + backup + unserved_penalty; }
};

// One row per project year 1..N (nominal amounts in that year's real currency, undiscounted),
// plus the year-0 investment and the year N+1 end-of-life flow in the result.
struct YearRecord {
  int year = 0;
  double health_start = 1;  // capacity fraction at the start of the year (of its first month)
  // Damage done in the year, summed over the banks that served in it.
  double damage_cycle = 0, damage_calendar = 0, damage_partial_charge = 0;
  double damage_end = 0;   // accumulated damage of the bank that serves on after the year
  double damage_peak = 0;  // most damage a bank reached at a month end of the year (before a
                           // replacement then): the year's lowest health
  int replacements = 0;    // banks replaced in the year (several when the bank wears out more
                           // than once within it)
  std::vector<int> replacement_months;  // the month (1-12) of each, in order
  bool replaced_worn_out = false;       // one of them was worn out (not only too old)
  bool replaced() const { return replacements > 0; }
  YearDispatch dispatch;
  double fixed_om = 0, variable_om = 0, charging = 0, backup = 0, unserved_penalty = 0;
  double replacement = 0, end_of_life = 0, residual_value = 0;
  double enclosure_om = 0;  // the enclosure's O&M
  // Source energy for conditioning at the charging price + its back-up energy at the back-up
  // price (dispatch.h, step 5).
  double conditioning = 0;
  double total() const {
    return fixed_om + variable_om + charging + backup + unserved_penalty + replacement +
           end_of_life + residual_value + enclosure_om + conditioning;
  }
  double discount_factor = 1;  // P/F at the end of this year
};

struct DesignResult {
  std::string profile_id;
  double dod_setpoint = 0;
  BankGeometry bank;
  std::string currency;
  std::string enclosure_id;             // the site's enclosure option; empty without one
  double enclosure_capital = 0;         // year 0, in present_value.enclosure
  std::vector<int> replacement_years;   // project year of each replacement, in order
  std::vector<int> replacement_months;  // its month within that year, 1-12 (parallel list)
  std::vector<YearRecord> years;
  double investment = 0;                   // year 0
  double last_bank_age_years = 0;          // service age of the bank in service at N
  double final_end_of_life = 0;            // end-of-life flow of the last bank, undiscounted
  double final_end_of_life_year = 0;       // N + 1, or later when that bank has life left
  double final_discount_factor = 1;        // P/F at final_end_of_life_year
  double project_end_discount_factor = 1;  // P/F at N + 1
  CostBreakdown present_value;
  double npc = 0;
  // Per kWh delivered; +infinity when the design delivers no energy (see delivers_energy()).
  double lcos_per_kwh = 0;              // storage costs with residual value, docs/method.md 7
  double lcos_schmidt_per_kwh = 0;      // Schmidt et al. (2019) conventions, docs/method.md 7
  double discounted_delivered_kwh = 0;  // LCOS denominator: energy after the inverter
  double unserved_fraction_max = 0;     // worst year unserved / demand
  bool meets_unserved_limit = true;

  // First-year figures quoted in reports.
  double discharged_kwh_first_year() const {
    return years.front().dispatch.discharged_terminal_kwh;
  }
  double unserved_kwh_first_year() const { return years.front().dispatch.unserved_kwh; }
  double backup_kwh_first_year() const { return years.front().dispatch.backup_kwh; }
  double equivalent_full_cycles_first_year() const {
    return years.front().dispatch.equivalent_full_cycles;
  }
  double mean_discharged_kwh_per_year() const;

  // False when no energy reaches the load from the bank over the project: LCOS is undefined.
  bool delivers_energy() const { return discounted_delivered_kwh > 0; }
  // Present value of the storage costs under Schmidt et al.'s conventions: storage_total()
  // without the residual value, the last bank's end of life moved to N + 1.
  double storage_cost_schmidt() const;
  // Sets npc, lcos_per_kwh and lcos_schmidt_per_kwh from present_value, the end-of-life
  // fields and discounted_delivered_kwh: the one place these totals are formed (call it again
  // after changing present_value, as a warranty does).
  void settle_totals();
};

// The pricing of a year, the one definition the lifecycle evaluation and re-pricing
// (repricing.h) share. life_used: the used life fraction of a bank, max(min(1, damage),
// age / max_service_years). price_year: sets the year's money lines from its dispatch, damage
// and replacements (fixed O&M, variable O&M on terminal discharge, the charging cost of the
// dispatch, back-up, penalty, replacements x P(year) and their end of life, and in year N the
// residual value of the bank in service, of age `last_bank_age_years`) and its discount
// factor. add_discounted: adds its present values to the design's breakdown and the discounted
// delivered energy.
double life_used(const ChemistryProfile& profile, double damage, double age_years);
void price_year(YearRecord& rec, const DesignCosts& costs, double investment, double nameplate_kwh,
                const SiteConditions& site, const Economics& economics,
                const ChemistryProfile& profile, double last_bank_age_years);
void add_discounted(const YearRecord& rec, DesignResult& r);

// Holds what is shared by every design of one profile at one site (temperature acceleration),
// so sweeps and the optimiser evaluate many designs cheaply. Not thread-safe: one per thread.
class LifecycleEvaluator {
 public:
  // The references must outlive the evaluator. Inputs must be validated.
  LifecycleEvaluator(const ChemistryProfile& profile, const SiteConditions& site,
                     const Economics& economics);

  // Throws ContractViolation for a DoD setpoint outside (0, 1] or strings < 1. When
  // `first_year_soc` is given it receives the SOC trace of project year 1 (8761 points: the
  // start and the end of each hour; a replacement within the year shows as the new bank's
  // full start at the end of that month).
  DesignResult evaluate(double dod_setpoint, int strings_parallel,
                        std::vector<double>* first_year_soc = nullptr);

  // The design's exact result, unless its NPC must exceed `npc_limit`: then the simulation
  // stops at the first year-end where
  //   PV of the costs so far - largest credits still to come > npc_limit (1e-9 relative margin),
  // the credits being the residual value (at most P(N) x PW(N): remaining fraction <= 1) and a
  // salvage value of the last bank (at most |end of life| x PW(N + 1)). Every other line still
  // to come costs >= 0 (prices, O&M, back-up and penalties are non-negative; the discount rate is
  // >= 0), so this lower bound is rigorous. Where a replacement can net a credit (a trade-in
  // worth more than the replacement bank) nothing is cut short. Same contract as evaluate().
  struct Bounded {
    std::optional<DesignResult> result;  // unset: stopped early, NPC > npc_limit
    double npc_lower_bound = 0;          // the exact NPC when `result` is set
    int years_simulated = 0;
  };
  Bounded evaluate_unless_above(double dod_setpoint, int strings_parallel, double npc_limit,
                                std::vector<double>* first_year_soc = nullptr);

  const ChemistryProfile& profile() const { return *profile_; }
  const AccelerationSeries& acceleration() const { return acceleration_; }

 private:
  // The bank in service: damage accumulated (Miner's sum) and hours in service.
  struct Bank {
    double damage = 0;
    double age_hours = 0;
  };
  // Runs one year month by month (12 x 730 h): each month dispatches at the health the bank
  // has at its start, ages the bank, and replaces it at the month's end when it is worn out or
  // too old (not at the very end of the project). Fills the dispatch, damage and replacement
  // counts of `rec` (price_year prices them), appends replacements to `r`, updates `state`
  // and `bank`.
  void operate_year(DispatchInputs& in, bool last_year, DesignResult& r, YearRecord& rec,
                    DispatchState& state, Bank& bank);

  const ChemistryProfile* profile_;
  const SiteConditions* site_;
  const Economics* economics_;
  AccelerationSeries acceleration_;  // at the site's temp_c (the reference with an enclosure)
  AccelerationSeries working_;       // with an enclosure: the hours of the bank's own temperature
  HourlyFactors factors_;
  std::vector<double> soc_trace_;
  std::vector<double> temp_trace_;  // with an enclosure: battery temperature of each hour
  CycleDamageMeter meter_;
};

}  // namespace stowage
