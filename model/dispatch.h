// SPDX-License-Identifier: MIT
// Hourly dispatch of one bank over one year (8760 one-hour steps).
//
// State: SOC as a fraction of the effective capacity Q_eff = capacity_ah x health x f_T(T_h),
// with f_T the profile's available-capacity factor at the hour's temperature; the SOC window is
// [1 - dod_setpoint, 1]. Each hour, in this order:
//   1. self-discharge: SOC *= (1 - s_month)^(1/730);
//   2. net = source - load. Surplus: the charger passes surplus x charger_efficiency to the
//      bank terminals, limited by max_charge_c_rate x Q_eff x V_charge and by headroom; the
//      stored charge is E_in / V_charge x coulombic_efficiency; source energy not taken is
//      curtailed. Charging only within the profile's charge temperature limits.
//   3. Deficit: the bank gives at its terminals up to deficit / inverter_efficiency, limited by
//      max_discharge_c_rate x Q_eff x V_discharge and by the charge above the floor, with the
//      Peukert factor (I H / C)^(k-1) (>= 1) on the charge drawn; discharge only within the
//      operating temperature limits. The remaining deficit goes to back-up or unserved.
// V_charge and V_discharge are the profile's mean cell voltages times cells in series.
// Energy figures are in kWh; "terminal" means at the bank's DC terminals.
#pragma once

#include <vector>

#include "model/bank.h"
#include "model/chemistry_profile.h"
#include "model/site.h"

namespace stowage {

// Carried from one year into the next.
struct DispatchState {
  double soc = 1.0;                    // fraction of effective capacity
  double hours_since_full_charge = 0;  // for partial-state-of-charge stress
};

struct YearDispatch {
  double demand_kwh = 0;               // sum of load
  double source_to_load_kwh = 0;       // load met directly by the source
  double charge_source_kwh = 0;        // source energy drawn for charging (before the charger)
  double charge_cost = 0;              // sum of charge_source_kwh x hourly price
  double charged_terminal_kwh = 0;     // into the bank terminals
  double discharged_terminal_kwh = 0;  // out of the bank terminals
  double delivered_kwh = 0;            // to the load, after the inverter
  double backup_kwh = 0;
  double unserved_kwh = 0;
  double curtailed_kwh = 0;
  double equivalent_full_cycles = 0;      // sum of SOC decrease by discharge (fractions)
  double partial_charge_excess_days = 0;  // days beyond the grace period without full charge
};

// Per-hour quantities that depend only on the profile and the site, computed once per pair so
// that many designs and years reuse them.
struct HourlyFactors {
  std::vector<double> capacity_factor;       // f_T(T_h), 8760 values
  std::vector<unsigned char> can_charge;     // 1 where the hour is within the charging limits
  std::vector<unsigned char> can_discharge;  // 1 where the hour is within the operating limits
};
HourlyFactors hourly_factors(const ChemistryProfile& profile, const SiteConditions& site);

struct DispatchInputs {
  const ChemistryProfile* profile = nullptr;
  const SiteConditions* site = nullptr;
  BankGeometry bank;
  double dod_setpoint = 0.5;
  double health = 1.0;                     // capacity remaining, fraction of rated, (0, 1]
  const HourlyFactors* factors = nullptr;  // optional; computed here when null
};

// Dispatches one year. `soc_trace` is resized to 8761: the SOC at the start and after each hour.
// `state` is read as the start and updated to the end of the year.
YearDispatch dispatch_year(const DispatchInputs& in, DispatchState& state,
                           std::vector<double>& soc_trace);

}  // namespace stowage
