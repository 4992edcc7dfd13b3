// SPDX-License-Identifier: MIT
// Cycle count and damage of a logged SOC series (an operator's record of an existing bank).
//
// Cycles: ASTM E1049-85 rainflow of the SOC series (fractions), grouped into depth bins of
// equal width over (0, 1]; equivalent full cycles = sum of count x depth (half the total SOC
// travel). Damage, given a profile: cycle damage by Miner's rule, each cycle at the temperature
// acceleration of the samples in which it moved charge (rainflow leg attribution, rainflow.h;
// reference temperature when no temperatures are given), plus calendar damage for the series'
// duration at the calendar law and the SOC stress of each interval (as in ageing.h). Assuming the
// bank was new when the series starts and the same duty goes on, the remaining life is (1 - D) / (D
// per hour).
#pragma once

#include <vector>

#include "model/chemistry_profile.h"
#include "model/rainflow.h"

namespace stowage {

struct DepthBin {
  double depth_from = 0, depth_to = 0;  // [from, to), the last bin includes 1.0
  double count = 0;                     // cycles (half cycles count 0.5)
};

struct DutyCycleSummary {
  std::vector<double> soc_fraction;  // the series summarised
  std::vector<RainflowCycle> cycles;
  std::vector<DepthBin> histogram;
  double equivalent_full_cycles = 0;
};

// `bins` >= 1 equal-width depth bins over [0, 1].
DutyCycleSummary summarise_cycles(const std::vector<double>& soc_fraction, int bins = 10);

struct DutyDamage {
  double cycle = 0;     // Miner damage of the counted cycles
  double calendar = 0;  // calendar damage over the series' duration
  double total() const { return cycle + calendar; }
  double series_hours = 0;
  // At the same duty: remaining life after the series (0 when already worn out), and the
  // equivalent full cycles still to come.
  double remaining_life_years = 0;
  double remaining_equivalent_full_cycles = 0;
};

// `temp_c` is empty or has one value per SOC sample; `hours_per_sample` > 0 is the logging
// interval.
DutyDamage duty_damage(const ChemistryProfile& profile, const DutyCycleSummary& summary,
                       const std::vector<double>& temp_c, std::size_t samples,
                       double hours_per_sample);

}  // namespace stowage
