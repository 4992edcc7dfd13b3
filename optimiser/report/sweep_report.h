// SPDX-License-Identifier: MIT
// How a sensitivity sweep is shown (optimiser/analysis/sweep.h), and what the robustness
// reports (sweep, break-even, uncertainty) share.
//
// Tornado: the base case's winner, then per variation (largest swing first) the winner, its
// NPC and LCOS at the low and the high end, the swing of the winner's NPC, and a mark where the
// winning profile differs from the base case's; then a one-line verdict. Grid: per point the
// winner and its design, and each profile's NPC; a 2-D grid adds the winner map (rows: first
// axis, columns: second axis, one letter per profile with a legend).
// JSON field names are a stable interface (docs/usage.md): every point is
//   {"settings": [{"path", "value"}], "winner": id|null, "status": str|null,
//    "designs": [{profile, rank (1.. among those meeting the unserved-energy limit, else
//    null), dod_setpoint, cells_series, strings_parallel, nameplate_kwh, npc, lcos_per_kwh,
//    investment, meets_unserved_limit}]}   (designs in study profile order).
// CSV: tornado.csv (one row per end, the base first) or grid.csv (one row per point), with the
// winner's figures and one npc_<profile> column per profile (empty: no design there).
#pragma once

#include <cstddef>
#include <ostream>
#include <string>
#include <vector>

#include "catalog-schema/study_case.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/report/json_writer.h"

namespace stowage::report {

void write_tornado_text(std::ostream& out, const StudyCase& study, const TornadoResult& result);
void write_tornado_json(std::ostream& out, const StudyCase& study, const TornadoResult& result);
void write_tornado_csv(std::ostream& out, const StudyCase& study, const TornadoResult& result);

void write_grid_text(std::ostream& out, const StudyCase& study, const GridResult& result);
void write_grid_json(std::ostream& out, const StudyCase& study, const GridResult& result);
void write_grid_csv(std::ostream& out, const StudyCase& study, const GridResult& result);

// Shared by the robustness reports.
// One point as above (settings may be empty: the base case).
void write_point_json(JsonWriter& json, const std::vector<Setting>& settings,
                      const PointOutcome& point);
// One variation: path, label, unit, source, low, base, high, points.
void write_variation_json(JsonWriter& json, const Variation& variation);
// "240 EUR/kWh": a value of a variation with its unit (up to 6 significant digits).
std::string variation_value_text(const Variation& variation, double value);
// "designs re-optimised at each point" or "the base case's designs held fixed".
std::string point_mode_text(bool hold_designs);
// One line of progress for a terminal: done/total, points per second, time left.
std::string format_run_progress(std::size_t done, std::size_t total, double seconds,
                                const std::string& unit);

}  // namespace stowage::report
