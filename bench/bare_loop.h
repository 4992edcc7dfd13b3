// SPDX-License-Identifier: MIT
// The bare-loop baseline of the simulator benchmark: the least an hourly storage simulation
// with cycle ageing must do, written as one tight loop so that the simulator's throughput can be
// quoted as a fraction of it on any machine.
//
// Per hour: self-discharge, the SOC update from the hour's surplus or deficit with the three
// clamps every dispatch has (the charge rate, the headroom to full, the room above the hour's
// discharge floor), and a streaming rainflow stack (reversal detection as the SOC is produced,
// the three-point rule of ASTM E1049-85 5.4.4, Miner damage per closed cycle from the profile's
// cycle-life curve). Not in it: efficiencies per conversion, Peukert, charge taper, temperature
// limits, leg attribution of the temperature acceleration, calendar ageing, cash flows.
#pragma once

#include <cstddef>
#include <vector>

#include "model/cycle_life_curve.h"

namespace stowage::bench {

struct BareLoopInputs {
  const std::vector<double>* surplus_kwh = nullptr;  // per hour, >= 0
  const std::vector<double>* deficit_kwh = nullptr;  // per hour, >= 0
  const std::vector<double>* capacity_factor = nullptr;
  const CycleLifeCurve* curve = nullptr;
  double keep_per_hour = 1;       // self-discharge factor
  double charge_soc_per_kwh = 0;  // SOC gained per kWh of surplus
  double discharge_soc_per_kwh = 0;
  double max_charge_soc = 1;  // per hour, from the C-rate limit
  double max_discharge_soc = 1;
  double dod_setpoint = 1;
  int years = 20;
};

// Cycle damage over the years (so the work cannot be optimised away).
double bare_loop_damage(const BareLoopInputs& in);

}  // namespace stowage::bench
