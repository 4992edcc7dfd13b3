// SPDX-License-Identifier: MIT
// Enclosure: the space around the bank as one thermal node, and the conditioning that keeps it
// within limits. The battery temperature T then follows from the outdoor air instead of being
// given as a series.
//
// Thermal model (lumped capacitance: one node, uniform temperature; Incropera, DeWitt, Bergman
// & Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., section 5.1-5.3):
//   C dT/dt = G (T_a - T) + P,   C = thermal_mass_kj_per_k + bank heat capacity (kJ/K),
//                                G = conductance_w_per_k / 1000 (kW/K),
//   P = internal heat of the bank's losses + solar gain (solar_aperture_m2 x irradiance) +
//       standing_kw + heat delivered by the heater - heat removed by the cooler (kW).
// Each hour T_a and P are held constant (zero-order hold), so the exact solution over the hour
// is, with a = exp(-G x 3600 / C) and T_eq = T_a + P / G,
//   T(h + 1) = T_eq + (T(h) - T_eq) a,
// which is stable for every time constant C / G (0 < a < 1) and exact for a step of ambient
// (time constant C / G) and for the steady state T = T_a + P / G.
//
// Conditioning (the hour's thermostat acts on the temperature at the hour's end):
//   the free-running end temperature T_free is the step above without heater or cooler;
//   heating to `to_c`: when T_free < to_c, heat Q = G (to_c - T_free) / (1 - a) kWh in the hour
//     (the constant power that brings the end of the hour to to_c), at most capacity_kw; the
//     heater draws Q / efficiency of electricity (efficiency 1 for a resistive heater, above 1
//     for a heat pump); charge-only heating runs only in hours with source surplus the bank did
//     not take and draws only from that surplus (it warms a bank that may not charge in the
//     cold so that it can charge);
//   cooling to `to_c`: when T_free > to_c, heat removed Q = G (T_free - to_c) / (1 - a), at most
//     capacity_kw, drawing Q / COP(T_a) with COP(T_a) = max(cop_min, cop + cop_per_k x
//     (T_a - cop_reference_ambient_c)) (a cooler loses COP as the outdoor air warms).
// The energy comes from the source surplus, then the bank, then back-up (dispatch.h, step 5).
#pragma once

#include <optional>
#include <string>

namespace stowage {

struct EnclosureHeating {
  double to_c = 5;           // battery temperature the heater holds at least, degC
  double capacity_kw = 1;    // heat it can deliver, kW (thermal), > 0
  double efficiency = 1;     // heat delivered / electricity drawn, > 0
  bool charge_only = false;  // heat only from surplus source energy (see above)
};

struct EnclosureCooling {
  double to_c = 30;                     // battery temperature the cooler holds at most, degC
  double capacity_kw = 1;               // heat it can remove, kW (thermal), > 0
  double cop = 3;                       // at cop_reference_ambient_c, > 0
  double cop_reference_ambient_c = 35;  // degC
  double cop_per_k = 0;                 // change of COP per K of ambient, usually <= 0
  double cop_min = 1;                   // floor of the COP, > 0
  double cop_at(double ambient_c) const;
};

struct Enclosure {
  std::string id;                    // the option's name, as the study lists it
  double thermal_mass_kj_per_k = 0;  // enclosure and fixed contents, without the bank, >= 0
  double conductance_w_per_k = 10;   // to the outdoor air, > 0
  double solar_aperture_m2 = 0;      // solar gain W per W/m2 of irradiance, >= 0
  double standing_kw = 0;            // controls and fans, drawn and turned into heat, >= 0
  std::optional<EnclosureHeating> heating;
  std::optional<EnclosureCooling> cooling;
  double capital = 0;      // year-0 cost, currency, >= 0
  double om_per_year = 0;  // currency per year, >= 0

  // Throws InvalidValue naming the field ("enclosure.conductance_w_per_k").
  void validate() const;
};

// One hour of the thermal node: the end temperature and the conditioning it took.
struct ThermalHour {
  double end_c = 0;
  double heat_kwh = 0;         // heat the heater would deliver (thermal)
  double cool_kwh = 0;         // heat the cooler would remove (thermal)
  double electricity_kwh = 0;  // drawn by heater and cooler for that (not standing_kw)
};

// The step of the header for one hour, for an enclosure of total heat capacity `capacity_kj_per_k`
// (> 0) with `gain_kw` of internal, solar and standing heat; `allow_heating` false leaves the
// heater off (charge-only heating without surplus). The conditioning asked for is not limited
// by supply: the caller scales it with settle_hour() when the supply falls short.
ThermalHour thermal_hour(const Enclosure& e, double capacity_kj_per_k, double start_c,
                         double ambient_c, double gain_kw, bool allow_heating);
// The end temperature when only `share` (in [0, 1]) of the conditioning of `h` was supplied.
double settle_hour(const Enclosure& e, double capacity_kj_per_k, const ThermalHour& h,
                   double share);

}  // namespace stowage
