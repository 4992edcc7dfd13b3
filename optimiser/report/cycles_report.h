// SPDX-License-Identifier: MIT
// How `cycles` shows the rainflow count of a logged SOC series and, against a profile, the
// damage it did and the life left at that duty.
#pragma once

#include <optional>
#include <ostream>
#include <string>

#include "catalog-schema/soc_series.h"
#include "model/chemistry_profile.h"
#include "model/duty_cycles.h"

namespace stowage::report {

struct CyclesInput {
  std::string series_path;
  double hours_per_row = 1.0;
};

void write_cycles_text(std::ostream& out, const CyclesInput& input, const SocSeries& series,
                       const DutyCycleSummary& summary,
                       const std::optional<ChemistryProfile>& profile,
                       const std::optional<DutyDamage>& damage);
void write_cycles_json(std::ostream& out, const CyclesInput& input, const SocSeries& series,
                       const DutyCycleSummary& summary, const std::optional<DutyDamage>& damage);

}  // namespace stowage::report
