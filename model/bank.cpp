// SPDX-License-Identifier: MIT
#include "model/bank.h"

#include <cmath>

#include "model/contract.h"

namespace stowage {

int cells_in_series(const ChemistryProfile& profile, double bus_voltage_v) {
  const long n = std::lround(bus_voltage_v / profile.cell_nominal_v);
  return n < 1 ? 1 : static_cast<int>(n);
}

double bus_voltage_mismatch(const ChemistryProfile& profile, double bus_voltage_v) {
  const double bank_v = cells_in_series(profile, bus_voltage_v) * profile.cell_nominal_v;
  return std::fabs(bank_v - bus_voltage_v) / bus_voltage_v;
}

BankGeometry bank_geometry(const ChemistryProfile& profile, double bus_voltage_v,
                           int strings_parallel) {
  if (strings_parallel < 1) throw ContractViolation("strings_parallel", "must be at least 1");
  BankGeometry g;
  g.cells_series = cells_in_series(profile, bus_voltage_v);
  g.strings_parallel = strings_parallel;
  g.nominal_voltage_v = g.cells_series * profile.cell_nominal_v;
  g.capacity_ah = strings_parallel * profile.cell_capacity_ah;
  g.nameplate_kwh = g.nominal_voltage_v * g.capacity_ah / 1000.0;
  return g;
}

}  // namespace stowage
