// SPDX-License-Identifier: MIT
// SiteConditions: the place a bank serves, as hourly series for one typical year plus the
// conversion chain and what happens to energy the bank cannot give.
//
// Energy flow each hour (1 h steps, so kW and kWh per hour are the same number):
//   source_kw serves load_kw directly (source_to_load_efficiency of it arrives); the surplus passes
//   the charger (charger_efficiency) into the bank; a deficit is drawn from the bank through the
//   inverter (inverter_efficiency); what the bank cannot give is met by back-up (if
//   backup_price_per_kwh is set) or left unserved.
// The same form covers an off-grid PV site (source = PV output, price 0 or export value) and a
// grid-charged duty (source = grid import allowed in charging hours, priced by the tariff).
// charge_price_per_kwh is the price of source energy used for charging, per hour.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "model/enclosure.h"

namespace stowage {

constexpr int kHoursPerYear = 8760;  // leap day dropped
constexpr double kHoursPerMonth = 730.0;

struct SiteConditions {
  std::string name;
  double bus_voltage_v = 48;
  std::vector<double> load_kw;    // 8760 values >= 0
  std::vector<double> source_kw;  // 8760 values >= 0
  // Battery-space temperature, 8760 values. With an enclosure it is the enclosure's reference
  // series (set_enclosure_reference_temperature()), used for autonomy sizing and the optimiser's
  // estimates; the exact dispatch then integrates the thermal model of enclosure.h instead.
  std::vector<double> temp_c;
  std::vector<double> ambient_c;             // outdoor air, 8760 values; needed by an enclosure
  std::vector<double> irradiance_w_m2;       // for solar gain; empty: none
  std::optional<Enclosure> enclosure;        // unset: temp_c is the battery temperature
  std::vector<double> charge_price_per_kwh;  // 8760 values >= 0
  double autonomy_days = 0;                  // days the bank alone carries the load, >= 0
  double design_margin = 1.0;                // sizing margin on the autonomy energy, >= 1
  double charger_efficiency = 1;             // (0, 1]
  double inverter_efficiency = 1;            // (0, 1]
  // Share of source energy that reaches the load when the source serves it directly: 1 for an
  // AC-coupled source (grid, AC-coupled PV), charger x inverter for DC-coupled PV that feeds
  // the load through the charge controller and the inverter. (0, 1].
  double source_to_load_efficiency = 1;
  std::optional<double> backup_price_per_kwh;     // back-up energy price; unset: no back-up
  std::optional<double> unserved_limit_fraction;  // max unserved / demand over a year
  double unserved_penalty_per_kwh = 0;            // value of lost load, >= 0

  // Checks lengths, finiteness and ranges; throws InvalidValue naming the field.
  void validate() const;

  double annual_demand_kwh() const;
  // Solar heat gain on the enclosure in hour h, kW (0 without irradiance or enclosure).
  double solar_gain_kw(std::size_t h) const {
    return enclosure && !irradiance_w_m2.empty()
               ? enclosure->solar_aperture_m2 * irradiance_w_m2[h] / 1000.0
               : 0.0;
  }
};

// Sets site.temp_c to the enclosure's reference temperature: each hour the steady state
// T_a + (solar gain + standing_kw) / G without the bank's losses, held within the heating and
// cooling temperatures (charge-only heating aside). The exact dispatch integrates the full
// model (enclosure.h); this series only serves autonomy sizing, the first hour's start and the
// optimiser's estimates. Requires an enclosure and 8760 ambient values.
void set_enclosure_reference_temperature(SiteConditions& site);

// What the source does for the load in hour h, before the bank: `direct_kwh` of load served
// straight from the source (source_to_load_efficiency of the source energy used arrives), the
// `surplus_kwh` of source energy left for charging, and the `deficit_kwh` of load left for the
// bank or back-up. At most one of surplus and deficit is positive.
struct HourBalance {
  double direct_kwh = 0;
  double surplus_kwh = 0;
  double deficit_kwh = 0;
};
inline HourBalance hour_balance(const SiteConditions& site, std::size_t h) {
  const double load = site.load_kw[h];
  const double source = site.source_kw[h];
  const double eta = site.source_to_load_efficiency;
  const double used = source * eta >= load ? load / eta : source;
  HourBalance b;
  b.direct_kwh = used * eta;
  b.surplus_kwh = source - used;
  b.deficit_kwh = load - b.direct_kwh;
  if (b.deficit_kwh < 1e-15) b.deficit_kwh = 0;  // rounding of load / eta * eta
  return b;
}

// Monthly means used by autonomy sizing, months of 730 h (hours 0-729 are month 1, ...);
// index 0..11.
struct MonthlyMeans {
  double daily_load_kwh[12];
  double temp_c[12];
};
MonthlyMeans monthly_means(const SiteConditions& site);

}  // namespace stowage
