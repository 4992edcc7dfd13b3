// SPDX-License-Identifier: MIT
// Hourly dispatch of one bank over one year (8760 one-hour steps).
//
// State: SOC as a fraction of the charge the bank holds when full, Q = capacity_ah x health.
// Stored charge only changes by charging, discharging, self-discharge and the auxiliary loads
// (step 4), never by temperature. The DoD window of the hour is [1 - reachable_depth, 1] with
// reachable_depth = dod_setpoint x min(1, f_T(T_h) x f_P(I)) (dod_window.h), f_T the profile's
// available-capacity factor: cold makes part of the charge unreachable until the bank warms up,
// heat never takes the bank past its setpoint. Each hour, in this order:
//   1. self-discharge: SOC *= (1 - s_month)^(1/730);
//   2. the source serves the load directly; source_to_load_efficiency of what it gives arrives.
//      Surplus: the charger passes surplus x charger_efficiency to the bank terminals, limited
//      by max_charge_c_rate x rated capacity x V_charge and by the headroom, and above the
//      profile's absorption SOC by the tapering acceptance of the constant-voltage stage
//      (charge_acceptance.h); the stored charge is E_in / V_charge x coulombic_efficiency;
//      source energy not taken is curtailed.
//      Charging only within the profile's charge temperature limits.
//   3. Deficit: the bank gives at its terminals up to deficit / inverter_efficiency, limited by
//      max_discharge_c_rate x rated capacity x V_discharge and by the charge above the window's
//      floor. Peukert's law shortens the window at currents I above the rated current C/H:
//      the cells reach cut-off after C (C / (I H))^(k-1) Ah, so the floor at current I is
//      1 - dod x min(1, f_T x (I_r / I)^(k-1)); the charge drawn is I x 1 h. When the SOC
//      lies below the hour's floor (charge the cold leaves unreachable), the room is taken as 0
//      and the bank gives nothing that hour. Discharge only within the
//      operating temperature limits. The remaining deficit goes to back-up or unserved.
//   4. (after 2 or 3) Auxiliary loads of the profile (chemistry_profile.h), at the terminals:
//      A = standing_kw_per_kwh x nameplate_kwh + pump_kw_per_kw x (terminal kWh charged or
//      discharged this hour). Served first from the surplus the bank did not take, through
//      the charger (A / charger_efficiency of source energy, priced at the hour's charging
//      price like charging energy); the rest from the stored charge, A x 1000 / V_discharge
//      Ah, down to the setpoint floor 1 - dod_setpoint, in any temperature; what neither
//      covers is unmet (the auxiliaries stop) and only counted.
//   5. With an enclosure (site.enclosure, enclosure.h) the hour's battery temperature T_h is the
//      thermal node's state at the hour's start and sets f_T, the charging and the operating
//      limits of steps 2 and 3. The internal heat of the hour is the bank's irreversible loss,
//      the first term of the energy balance of Bernardi, Pawlikowski & Newman (1985, J.
//      Electrochem. Soc. 132:5-12), q = I (V - V_oc), with V_oc taken as the mean of the mean
//      charge and discharge voltages and the entropic term neglected: charging I x (V_charge -
//      coulombic_efficiency x V_oc), discharging I x (V_oc - V_discharge), self-discharge the
//      charge lost x V_oc; over a full cycle these sum to the round-trip loss. With the solar
//      gain and standing_kw it gives the free-running end temperature; heating or cooling to
//      the enclosure's limits then asks for electricity E (enclosure.h), supplied as the
//      auxiliary loads are (surplus through the charger, then the bank down to its setpoint
//      floor) and, unlike them, finally from back-up when the site has it (charge-only heating:
//      from the surplus alone); with E short, the share supplied of the heat is delivered.
//      standing_kw is supplied the same way with E. The end temperature is T_(h+1).
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
  double temp_c = 25;                  // battery temperature at the next hour's start (enclosure)
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
  double equivalent_full_cycles = 0;      // sum of SOC decreases by discharge (fractions of Q)
  double partial_charge_excess_days = 0;  // days beyond the grace period without full charge
  // Hours the bank sat idle because of its temperature limits (inclusive, as above): a surplus
  // arrived outside the charging range while the SOC was below 1, or a deficit outside the
  // operating range while the SOC was above the setpoint floor 1 - dod_setpoint (both SOCs
  // after the hour's self-discharge). That surplus is curtailed, that deficit goes to back-up
  // or unserved.
  double charge_blocked_by_temperature_hours = 0;
  double discharge_blocked_by_temperature_hours = 0;
  // Auxiliary loads (step 4): demand, fed from the source (before the charger), fed from the
  // bank (at its terminals, not in discharged_terminal_kwh nor in the equivalent full cycles),
  // unmet; kWh.
  double auxiliary_kwh = 0, auxiliary_source_kwh = 0, auxiliary_bank_kwh = 0,
         auxiliary_unmet_kwh = 0;
  // Conditioning (step 5): the electricity the heater, the cooler and the enclosure's standing
  // load asked for, kWh; supplied from the source (source energy before the charger, its cost
  // at the hour's charging price), from the bank (at its terminals), from back-up, unmet; the
  // heat delivered and removed (kWh thermal); the hours with heating.
  double conditioning_kwh = 0, conditioning_source_kwh = 0, conditioning_cost = 0,
         conditioning_bank_kwh = 0, conditioning_backup_kwh = 0, conditioning_unmet_kwh = 0;
  double heating_heat_kwh = 0, cooling_heat_kwh = 0, heating_hours = 0;
  double bank_loss_heat_kwh = 0;  // internal heat of the bank's losses (step 5)
  // Adds the sums of `o` (hours that follow or precede these) to these.
  void add(const YearDispatch& o);
  double temperature_idle_hours() const {
    return charge_blocked_by_temperature_hours + discharge_blocked_by_temperature_hours;
  }
};

// Share of the rated capacity the cells give before cut-off at a constant current `amps`
// (Peukert's law in the form C(I) = C (I_r / I)^(k-1), I_r = C / H); 1 at or below I_r.
double peukert_capacity_factor(double amps, double rated_amps, double exponent);

// Per-hour quantities that depend only on the profile and the site, computed once per pair so
// that many designs and years reuse them.
struct HourlyFactors {
  std::vector<double> capacity_factor;       // f_T(T_h), 8760 values
  std::vector<unsigned char> can_charge;     // 1 where the hour is within the charging limits
  std::vector<unsigned char> can_discharge;  // 1 where the hour is within the operating limits
  std::vector<HourBalance> balance;          // hour_balance(site, h), 8760 values
  double demand_kwh = 0;                     // sum of load over the year, in hour order
  double source_to_load_kwh = 0;             // sum of balance[h].direct_kwh, in hour order
};
HourlyFactors hourly_factors(const ChemistryProfile& profile, const SiteConditions& site);

struct DispatchInputs {
  const ChemistryProfile* profile = nullptr;
  const SiteConditions* site = nullptr;
  BankGeometry bank;
  double dod_setpoint = 0.5;
  double health = 1.0;                     // capacity remaining, fraction of rated, (0, 1]
  const HourlyFactors* factors = nullptr;  // optional; computed here when null
  // With an enclosure: receives the battery temperature at the start of each hour dispatched
  // (index h); may be null.
  double* temp_trace = nullptr;
};

// Heat capacity of bank and enclosure, kJ/K: thermal_mass_kj_per_k + the profile's
// heat_capacity_kj_per_k_per_kwh x nameplate. Requires site.enclosure and that profile figure.
double enclosure_heat_capacity_kj_per_k(const ChemistryProfile& profile, const SiteConditions& site,
                                        double nameplate_kwh);

// Dispatches one year. `soc_trace` is resized to 8761: the SOC at the start and after each hour.
// `state` is read as the start and updated to the end of the year.
YearDispatch dispatch_year(const DispatchInputs& in, DispatchState& state,
                           std::vector<double>& soc_trace);

// Dispatches the hours [first, end) of the year (end <= 8760), as dispatch_year does for all of
// them: sets soc_trace[first] = state.soc and soc_trace[h + 1] to the SOC after hour h, which
// the buffer must hold; updates `state`. Returns the sums over these hours, except demand_kwh
// and source_to_load_kwh, which stay 0 (the year's are in HourlyFactors). dispatch_year's
// result equals the add() of consecutive ranges covering the year, to the rounding of the sums.
YearDispatch dispatch_hours(const DispatchInputs& in, DispatchState& state, double* soc_trace,
                            std::size_t first, std::size_t end);

}  // namespace stowage
