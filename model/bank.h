// SPDX-License-Identifier: MIT
// Bank geometry: cells in series reach the DC bus voltage, strings in parallel add capacity.
//   cells_series  = round(bus_voltage_v / cell_nominal_v), at least 1
//   capacity_ah   = strings_parallel x cell_capacity_ah
//   nameplate_kwh = cells_series x cell_nominal_v x capacity_ah / 1000   (V x Ah, common practice)
#pragma once

#include "model/chemistry_profile.h"

namespace stowage {

struct BankGeometry {
  int cells_series = 0;
  int strings_parallel = 0;
  double nominal_voltage_v = 0;  // cells_series x cell_nominal_v
  double capacity_ah = 0;
  double nameplate_kwh = 0;
};

int cells_in_series(const ChemistryProfile& profile, double bus_voltage_v);

// |cells_series x cell_nominal_v - bus_voltage_v| / bus_voltage_v: how far the nearest series
// string is from the bus. Inputs above kMaxBusVoltageMismatch are refused by the loader: such a
// bank cannot work the bus (chargers and inverters keep to a narrow voltage window).
double bus_voltage_mismatch(const ChemistryProfile& profile, double bus_voltage_v);
constexpr double kMaxBusVoltageMismatch = 0.10;
// Throws ContractViolation("strings_parallel", ...) when strings_parallel < 1.
BankGeometry bank_geometry(const ChemistryProfile& profile, double bus_voltage_v,
                           int strings_parallel);

}  // namespace stowage
