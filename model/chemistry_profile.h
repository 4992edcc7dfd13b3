// SPDX-License-Identifier: MIT
// ChemistryProfile: the generic description of one battery technology, as a datasheet or a
// handbook gives it, plus the prices of a bank built from it.
//
// Electrical: a cell of `cell_nominal_v` volts holds `cell_capacity_ah` when discharged over
// `capacity_rate_hours` hours (the Peukert reference rate). Voltaic efficiency = mean discharge
// voltage / mean charge voltage; round-trip efficiency = voltaic x coulombic (common practice).
// Peukert: at a discharge current I above the rated current C/H the charge drawn from the cell
// counts (I H / C)^(k-1) times; below it no credit is taken (factor 1).
// Charge acceptance: optional absorption threshold above which the charge current tapers in
// proportion to the missing charge (constant-voltage stage, charge_acceptance.h).
// Ageing: cycle-life curve (DoD -> cycles at the reference temperature), calendar life at the
// reference temperature, temperature behaviour, end of life at `eol_capacity_fraction` of rated
// capacity (0.80 by default, IEEE 450 practice), optional partial-state-of-charge stress,
// optional SOC dependence of calendar ageing.
// All fractions are 0..1; costs are in the study's currency.
#pragma once

#include <cmath>
#include <optional>
#include <string>

#include "model/cycle_life_curve.h"
#include "model/temperature_behaviour.h"

namespace stowage {

struct ProfileCosts {
  double capital_per_kwh = 0;         // per kWh nameplate, > 0
  double capital_per_string = 0;      // per string in parallel (racks, fusing, BMS), >= 0
  double installation_fixed = 0;      // per bank, >= 0
  double fixed_om_per_kwh_year = 0;   // per kWh nameplate and year, >= 0
  double variable_om_per_mwh = 0;     // per MWh discharged, >= 0
  double replacement_share = 1.0;     // replacement price / initial price (capital + install)
  double price_decline_per_year = 0;  // real annual decline of the replacement price, [0, 1)
  double end_of_life_per_kwh = 0;     // disposal cost (> 0) or salvage value (< 0) per kWh
  // End-of-life cost per kWh of the part removed at a replacement, when it differs from a whole
  // bank's (a flow battery keeps its electrolyte); unset: end_of_life_per_kwh.
  std::optional<double> replacement_end_of_life_per_kwh;
};

// Auxiliary consumption of the storage system itself (docs/method.md 4, step 5), as loads at
// the bank's DC terminals: a standing load (battery management, container climate control) of
// standing_kw_per_kwh x nameplate kWh every hour, and pumps (flow batteries) of pump_kw_per_kw
// x the hour's terminal energy charged or discharged. Both in [0, 1); 0 (the default) is none.
struct AuxiliaryLoads {
  double standing_kw_per_kwh = 0;  // kW per kWh of nameplate energy
  double pump_kw_per_kw = 0;       // kW per kW of terminal throughput
  bool any() const { return standing_kw_per_kwh > 0 || pump_kw_per_kw > 0; }
};

// Extra ageing when a bank goes too long without a full charge (sulfation of lead-acid).
struct PartialChargeStress {
  double full_charge_soc = 0.98;            // SOC that counts as a full charge, (0, 1]
  double max_days_without_full_charge = 7;  // grace period, days > 0
  double damage_per_extra_day = 0;          // Miner damage per day beyond the grace period
};

// SOC dependence of calendar ageing (lithium ages faster kept full): the calendar ageing rate is
// multiplied by m(s) = exp(soc_exponent x (s - reference_soc)), the SOC stress of Xu, Oudalov,
// Ulbig, Andersson & Kirschen (2018), IEEE Trans. Smart Grid 9(2):1131-1140 (k_sigma 1.04,
// sigma_ref 0.5 for their cell). calendar_life_years is then the life at reference_soc.
struct CalendarSocStress {
  double soc_exponent = 0;     // k_sigma, per unit SOC, finite
  double reference_soc = 0.5;  // SOC of the rated calendar life, [0, 1]
  double multiplier(double soc) const { return std::exp(soc_exponent * (soc - reference_soc)); }
};

struct DodRange {
  double min = 0.2, max = 0.8,
         default_setpoint = 0.5;  // fractions in (0, 1], min <= default <= max
};

struct ChemistryProfile {
  std::string id;
  std::string family;
  std::string description;
  double cell_nominal_v = 0;
  double cell_capacity_ah = 0;
  double capacity_rate_hours = 10;      // H of the rated capacity (e.g. 10 for C10)
  double coulombic_efficiency = 1;      // (0, 1]
  double mean_charge_v = 0;             // per cell, > mean_discharge_v
  double mean_discharge_v = 0;          // per cell
  double max_charge_c_rate = 0;         // per hour, > 0
  double max_discharge_c_rate = 0;      // per hour, > 0
  double peukert_exponent = 1;          // [1, 2]
  double self_discharge_per_month = 0;  // fraction of stored charge lost per 730 h, [0, 1)
  // SOC above which charging enters the constant-voltage stage and the accepted current tapers
  // (charge_acceptance.h), (0, 1); unset: the bank accepts the offered current up to full.
  std::optional<double> absorption_soc;
  CycleLifeCurve cycle_life{{{0.5, 2}, {1.0, 1}}};
  double calendar_life_years = 10;          // at the reference temperature, > 0
  std::optional<double> max_service_years;  // hard replacement age regardless of wear
  TemperatureBehaviour temperature{TemperatureSpec{25, {{25, 1}}}};
  double eol_capacity_fraction = 0.80;  // (0, 1)
  std::optional<PartialChargeStress> partial_charge;
  std::optional<CalendarSocStress> calendar_soc_stress;  // unset: calendar ageing ignores SOC
  AuxiliaryLoads auxiliary;
  DodRange dod;
  ProfileCosts costs;
  std::optional<double> cell_mass_kg;
  std::optional<double> cell_volume_l;
  // Heat capacity of the bank per kWh of nameplate, kJ/K per kWh (cells, electrolyte, racks):
  // needed only in an enclosure (enclosure.h).
  std::optional<double> heat_capacity_kj_per_k_per_kwh;

  double voltaic_efficiency() const { return mean_discharge_v / mean_charge_v; }
  double round_trip_efficiency() const { return voltaic_efficiency() * coulombic_efficiency; }
  // The terminal round trip with the pumps running on both legs, fed from the source while
  // charging and from the bank while discharging: eta_RT x (1 - a_p) / (1 + a_p). The standing
  // load is left out: it depends on how long the charge is held.
  double round_trip_with_pumps() const {
    return round_trip_efficiency() * (1 - auxiliary.pump_kw_per_kw) /
           (1 + auxiliary.pump_kw_per_kw);
  }
  double cell_energy_kwh() const { return cell_nominal_v * cell_capacity_ah / 1000.0; }

  // Checks every rule stated above; throws InvalidValue naming the field.
  void validate() const;
};

}  // namespace stowage
