// SPDX-License-Identifier: MIT
// The partial result of one shard of an uncertainty run or a sweep, in the line format that
// optimiser/analysis/shards.h defines and reads back (numbers as %.17g, so a merge sees the
// very doubles the shard computed).
#pragma once

#include <ostream>

#include "optimiser/analysis/shards.h"

namespace stowage::report {

void write_uncertainty_part(std::ostream& out, const UncertaintyPart& part);
// The same for one shard of a sweep.
void write_sweep_part(std::ostream& out, const SweepPart& part);

}  // namespace stowage::report
