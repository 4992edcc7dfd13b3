// SPDX-License-Identifier: MIT
// evaluate_all(): the exact lifecycle (model/lifecycle.h) of every design a study lists, in
// the study's order, with defaults filled in by resolve_designs (an unset DoD takes the
// profile's default, unset strings are sized for autonomy; no designs listed: every profile
// once). One evaluator per profile is shared by that profile's designs.
// Throws InvalidValue for a design that names an unknown profile; the study must be validated.
#pragma once

#include <vector>

#include "model/lifecycle.h"
#include "model/study.h"
#include "optimiser/design_space.h"

namespace stowage {

std::vector<DesignResult> evaluate_all(const Study& study);

// For each result, whether it meets autonomy and the peak discharge by the optimiser's own rule
// (check_requirements in optimiser/design_space.h), in the same order. `optimise` never offers
// a design that fails; `evaluate` shows them, marked. Results must come from `study`.
std::vector<RequirementCheck> requirement_checks(const Study& study,
                                                 const std::vector<DesignResult>& results);

}  // namespace stowage
