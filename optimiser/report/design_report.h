// SPDX-License-Identifier: MIT
// How one evaluated design is shown: the JSON object (field names are a stable interface that
// later work and outside checks read), the readable table, the CSV files, and the safety notice
// every report carries.
#pragma once

#include <ostream>
#include <string>
#include <vector>

#include "model/lifecycle.h"
#include "model/study.h"
#include "optimiser/report/json_writer.h"

namespace stowage::report {

// Writes one design object: profile, dod_setpoint, cells_series, strings_parallel,
// nameplate_kwh, lcos_per_kwh, lcos_schmidt_per_kwh, npc, currency, replacement_years,
// discharged_kwh_per_year, unserved_kwh_first_year, backup_kwh_first_year,
// equivalent_full_cycles_first_year, round_trip_efficiency, meets_unserved_limit,
// unserved_fraction_max, and `breakdown` (present values: investment, replacements, fixed_om,
// variable_om, charging, backup, unserved_penalty, end_of_life, residual_value).
void write_design_json(JsonWriter& json, const DesignResult& design);

// A readable block for one design: bank, energy, ageing, replacements, cost breakdown, LCOS.
void print_design_table(std::ostream& out, const DesignResult& design);

// CSV files: one summary row per design, and the year-by-year cash flows of every design.
void write_designs_csv(std::ostream& out, const std::vector<DesignResult>& designs);
void write_cash_flows_csv(std::ostream& out, const std::vector<DesignResult>& designs);

// The opening fields of a JSON report: stowage_version, study, site, project_years,
// real_discount_rate and currency.
void write_study_json(JsonWriter& json, const Study& study);

// The opening lines of a report: tool and version, what it does, the study, site and economics.
void print_study_header(std::ostream& out, const Study& study, const std::string& what);

// The caution every report and the README carry: planning estimate, hazards, defer to codes.
void print_safety_notice(std::ostream& out);

}  // namespace stowage::report
