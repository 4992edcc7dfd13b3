// SPDX-License-Identifier: MIT
// How an uncertainty run is shown (optimiser/analysis/uncertainty.h): the drawn inputs and
// their distributions, then per profile the probability of being cheapest (with its standard
// error), NPC P10/P50/P90, mean and standard error, LCOS P50, the expected regret and the
// samples in which it breaks the unserved-energy limit; the convergence of the base winner's
// win probability; a verdict on how often the base winner stays cheapest.
// JSON (stable field names, docs/usage.md): samples, seed, latin_hypercube, reoptimise,
// base_winner, drawn (variations with their distribution), profiles (profile, samples,
// win_probability, win_probability_se, npc and lcos_per_kwh as {mean, standard_error, p10,
// p50, p90}, expected_regret, fails_limit), no_winner_probability, convergence. No timing, so
// the document is the same for any thread count.
// CSV: summary.csv (one row per profile) and samples.csv (one row per sample: the drawn values,
// the winner, each profile's NPC).
#pragma once

#include <ostream>
#include <string>

#include "catalog-schema/study_case.h"
#include "optimiser/analysis/uncertainty.h"
#include "optimiser/report/json_writer.h"

namespace stowage::report {

void write_uncertainty_text(std::ostream& out, const StudyCase& study, const UncertaintyResult& r);
void write_uncertainty_json(std::ostream& out, const StudyCase& study, const UncertaintyResult& r);
void write_uncertainty_summary_csv(std::ostream& out, const UncertaintyResult& r);
void write_uncertainty_samples_csv(std::ostream& out, const UncertaintyResult& r);
// "uniform on 240 EUR/kWh .. 380 EUR/kWh": a drawn variation's distribution as the text and
// the uncertainty report state it. Requires v.distribution.
std::string distribution_text(const Variation& v);
// The `drawn` array of an uncertainty or sampled tender JSON: per drawn variation its path,
// label, unit, distribution kind, bounds and target rank correlations (`with`: the other
// input's path, `rho`; empty when drawn independently).
void write_drawn_json(JsonWriter& json, const std::vector<Variation>& drawn);

}  // namespace stowage::report
