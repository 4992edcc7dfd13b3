// SPDX-License-Identifier: MIT
// Representative days: the few hours of the typical year on which the mixed-integer model
// dispatches a bank, weighted so that they stand for the whole year.
//
// The year is cut into 365 days of 24 h and each day belongs to the month (730 h, as in
// model/site.h) that holds its midpoint hour. For every month the block of `days_per_block`
// consecutive days inside it is chosen whose mean daily deficit (load - source)^+ and mean
// daily surplus (source - load)^+ are closest to the month's means (distance relative to the
// year's mean daily load, the first such block on ties); its weight is
// days in the month / days_per_block, so the weights times the block length sum to 365 days.
// The state of charge is cyclic over each block in the model, so a block carries no energy
// into the next; multi-day storage needs are covered by the autonomy rule instead.
#pragma once

#include <vector>

#include "model/site.h"

namespace stowage {

struct RepresentativeBlock {
  int first_hour = 0;  // hour of the year, a multiple of 24
  int hours = 0;       // 24 x days_per_block
  double weight = 0;   // number of such blocks the year holds
  int month = 0;       // 0..11
};

struct RepresentativeDays {
  int days_per_block = 1;
  std::vector<RepresentativeBlock> blocks;  // in the order of the year

  int total_hours() const;
};

// Throws ContractViolation("days_per_block", ...) unless 1 <= days_per_block <= 28.
RepresentativeDays select_representative_days(const SiteConditions& site, int days_per_block);

}  // namespace stowage
