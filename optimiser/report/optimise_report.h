// SPDX-License-Identifier: MIT
// How an optimisation result is shown: the text report (the answer and how it was proven,
// then the best design of each profile with what makes it lose) and the JSON document whose
// field names are a stable interface (docs/usage.md).
#pragma once

#include <ostream>
#include <string>

#include "model/study.h"
#include "optimiser/optimise.h"

namespace stowage::report {

void write_optimise_text(std::ostream& out, const Study& study, const OptimiseResult& result);
void write_optimise_json(std::ostream& out, const Study& study, const OptimiseResult& result);
// One line of progress for a terminal: phase, done/total, best NPC so far, seconds.
std::string format_progress(const OptimiseProgress& progress);
// The note when --export-model finds no admissible design to write.
void write_no_model_exported(std::ostream& err, const std::string& path);

}  // namespace stowage::report
