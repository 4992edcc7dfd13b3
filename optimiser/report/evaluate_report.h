// SPDX-License-Identifier: MIT
// How `evaluate` shows the exact lifecycle of each design: a table per design and a ranking by
// net present cost (text), or one JSON document (field names in docs/usage.md).
#pragma once

#include <ostream>
#include <vector>

#include "model/lifecycle.h"
#include "model/study.h"
#include "optimiser/design_space.h"

namespace stowage::report {

// `checks[i]` is results[i]'s requirement check (requirement_checks in evaluate_all.h); designs
// that fail one are marked in the table and the ranking, and counted in a closing line.
void write_evaluate_text(std::ostream& out, const StudyCase& study,
                         const std::vector<DesignResult>& results,
                         const std::vector<RequirementCheck>& checks);
void write_evaluate_json(std::ostream& out, const StudyCase& study,
                         const std::vector<DesignResult>& results,
                         const std::vector<RequirementCheck>& checks);

}  // namespace stowage::report
