// SPDX-License-Identifier: MIT
// Small hand-built inputs for model tests. They are constructed test cases, not demo data and
// not reference values: the expected numbers come from the sources named in each test.
#pragma once

#include <vector>

#include "model/chemistry_profile.h"
#include "model/site.h"

namespace stowage::testing {

// A 2 V cell of `capacity_ah` with no losses, no rate effect, no self-discharge, ageing at a
// flat capacity factor of 1 and the given cycle life / calendar life.
inline ChemistryProfile ideal_cell(double capacity_ah = 100.0) {
  ChemistryProfile p;
  p.id = "ideal";
  p.family = "flooded-lead-acid";
  p.cell_nominal_v = 2.0;
  p.cell_capacity_ah = capacity_ah;
  p.capacity_rate_hours = 10;
  p.coulombic_efficiency = 1.0;
  p.mean_discharge_v = 2.0;
  p.mean_charge_v = 2.0 + 1e-12;  // must exceed the discharge voltage
  p.max_charge_c_rate = 10;
  p.max_discharge_c_rate = 10;
  p.cycle_life = CycleLifeCurve({{0.5, 2e12}, {1.0, 1e12}});
  p.calendar_life_years = 1e9;
  TemperatureSpec t;
  t.reference_temp_c = 25;
  t.capacity_factor = {{25, 1.0}};
  t.law = AgeingLaw::Halving;
  t.halving_interval_k = 10;
  t.operating_min_c = -40;
  t.operating_max_c = 60;
  t.charge_min_c = -40;
  t.charge_max_c = 60;
  p.temperature = TemperatureBehaviour(t);
  p.dod = DodRange{0.1, 1.0, 0.5};
  p.costs.capital_per_kwh = 100;
  return p;
}

// A site with every hour at `temp_c`, no load, no source, free charging, ideal conversion.
inline SiteConditions quiet_site(double bus_voltage_v = 48.0, double temp_c = 25.0) {
  SiteConditions s;
  s.name = "test site";
  s.bus_voltage_v = bus_voltage_v;
  s.load_kw.assign(kHoursPerYear, 0.0);
  s.source_kw.assign(kHoursPerYear, 0.0);
  s.temp_c.assign(kHoursPerYear, temp_c);
  s.charge_price_per_kwh.assign(kHoursPerYear, 0.0);
  s.charger_efficiency = 1.0;
  s.inverter_efficiency = 1.0;
  return s;
}

// Sets `kw` of load (or source) in hours [first, last] of every day.
inline void every_day(std::vector<double>& series, int first_hour, int last_hour, double kw) {
  for (int day = 0; day < kHoursPerYear / 24; ++day)
    for (int h = first_hour; h <= last_hour; ++h)
      series[static_cast<std::size_t>(day * 24 + h)] = kw;
}

}  // namespace stowage::testing
