// SPDX-License-Identifier: MIT
// How an optimisation result is shown: the text report (the answer and how it was proven,
// then the best design of each profile with what makes it lose) and the JSON document whose
// field names are a stable interface (docs/usage.md).
#pragma once

#include <ostream>
#include <string>

#include "model/study.h"
#include "optimiser/analysis/confidence_check.h"
#include "optimiser/optimise.h"

namespace stowage::report {

// `confidence` (optional): the winner's low-confidence inputs (optimiser/analysis/
// confidence_check.h); the text then says, under the decision, whether one of them could cost
// the winner its lead, and the JSON carries it as `low_confidence` (null without it).
void write_optimise_text(std::ostream& out, const StudyCase& study, const OptimiseResult& result,
                         const ConfidenceCheck* confidence = nullptr);
void write_optimise_json(std::ostream& out, const StudyCase& study, const OptimiseResult& result,
                         const ConfidenceCheck* confidence = nullptr);
// The sentence under the decision: whether one low-confidence input of the winner, within
// its spread, could cost it more than its lead.
std::string low_confidence_sentence(const ConfidenceCheck& check, const std::string& currency);
// The words for what the optimiser returns as data: the JSON "requirement" key and the
// sentence of an unmet requirement, the note about a profile, the name of a strings cap.
std::string requirement_key(const UnmetRequirement& unmet);
std::string describe_unmet(const UnmetRequirement& unmet, const StudyCase& study);
std::string describe_note(const ProfileNote& note, const StudyCase& study);
std::string cap_name(StringCap cap);
// One line of progress for a terminal: phase, done/total, best NPC so far, seconds.
std::string format_progress(const OptimiseProgress& progress);
// The note when --export-model finds no admissible design to write.
void write_no_model_exported(std::ostream& err, const std::string& path);

}  // namespace stowage::report
