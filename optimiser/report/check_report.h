// SPDX-License-Identifier: MIT
// What `check` says about a study.
//
// Text: a valid study gets "STUDY: valid" and a summary on stdout (the site, the economics,
// each profile with the strings its autonomy needs at its default setpoint, the designs
// listed); a study with problems gets one "stowage: FILE:LINE:COL: FIELD: message" line per
// problem on stderr, then a count. Notes (input read but ignored, such as an extra CSV column)
// go to stderr as "stowage: FILE:LINE:COL: FIELD: note: message" either way.
//
// JSON (docs/usage.md gives the shape): one object on stdout,
//   {"study": path, "valid": bool, "problems": [PROBLEM...], "notes": [PROBLEM...],
//    "summary": SUMMARY or null}
// where PROBLEM is {"file", "line", "column", "field", "message"} (line and column 1-based;
// the text fields escaped as in the text messages) and SUMMARY, null exactly when valid is
// false, is {"title", "site": {"name", "bus_voltage_v", "annual_demand_kwh",
// "autonomy_days"}, "economics": {"project_years", "real_discount_rate", "currency",
// and only when the study gives rates "exchange_rates": [{"currency", "rate", "profiles"}]},
// "profiles": [{"id", "family", "round_trip_efficiency", "dod_min", "dod_default", "dod_max",
// "strings_for_autonomy"}], "designs_listed"}; fractions are fractions (0.062, not 6.2).
#pragma once

#include <ostream>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"
#include "catalog-schema/study_case.h"

namespace stowage::report {

void write_check_text(std::ostream& out, const std::string& study_path, const StudyCase& study);

// Each problem as a failure line, then "stowage: N problems found in STUDY".
void write_check_problems_text(std::ostream& err, const std::string& study_path,
                               const std::vector<InputError>& problems);

// Each note as a "stowage: ...: note: ..." line.
void write_check_notes_text(std::ostream& err, const std::vector<InputNote>& notes);

// `study` is null exactly when `problems` is not empty.
void write_check_json(std::ostream& out, const std::string& study_path, const StudyCase* study,
                      const std::vector<InputError>& problems, const std::vector<InputNote>& notes);

}  // namespace stowage::report
