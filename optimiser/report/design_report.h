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
#include "optimiser/design_space.h"
#include "optimiser/report/json_writer.h"

namespace stowage::report {

// Writes one design object: profile, dod_setpoint, cells_series, strings_parallel,
// nameplate_kwh, lcos_per_kwh, lcos_schmidt_per_kwh, npc, currency, replacement_years,
// discharged_kwh_per_year, unserved_kwh_first_year, backup_kwh_first_year,
// equivalent_full_cycles_first_year, round_trip_efficiency, meets_unserved_limit,
// unserved_fraction_max, and `breakdown` (present values: investment, replacements, fixed_om,
// variable_om, charging, backup, unserved_penalty, end_of_life, residual_value).
// Also auxiliary_{,source_,bank_,unmet_}kwh_first_year (dispatch.h step 4), and
// temperature_idle_hours_first_year (with charge_ and discharge_ parts). A design that
// delivers no energy has no LCOS: lcos_per_kwh and lcos_schmidt_per_kwh are left out and
// `lcos_statement` says why. With `check`: `requirements` {meets_autonomy, required_usable_kwh,
// usable_kwh, autonomy_strings, meets_peak_discharge, peak_discharge_kw, discharge_power_kw,
// peak_strings} and `meets_requirements`.
void write_design_json(JsonWriter& json, const DesignResult& design,
                       const RequirementCheck* check = nullptr);

// A readable block for one design: bank, energy, ageing, replacements, cost breakdown, LCOS;
// with `check`, a FAILS line for each hard requirement the design misses.
void print_design_table(std::ostream& out, const DesignResult& design,
                        const RequirementCheck* check = nullptr);

// The words shown instead of an LCOS for a design that delivers no energy.
const char* no_lcos_statement();
// An LCOS for a table column: 4 decimals, or "none" when the design delivers no energy.
std::string lcos_cell(const DesignResult& design, double lcos_per_kwh);

// What every row of designs.csv and cash-flows.csv repeats, as the JSON reports carry it:
// `study` the study's title and `method` the optimiser's search method ("milp", "exhaustive",
// "bounded"; empty when no search ran, as in `evaluate`).
struct CsvRunColumns {
  std::string study;
  std::string method;
};

// CSV files: one summary row per design, and the year-by-year cash flows of every design.
// designs.csv: lcos_per_kwh and lcos_schmidt_per_kwh are empty when delivers_energy is false;
// the first-year temperature idle hours; meets_autonomy and meets_peak_discharge from
// `checks` (checks[i] for designs[i]), empty without them (optimise offers only designs that
// meet both); then `study` and `method` from `run`.
void write_designs_csv(std::ostream& out, const std::vector<DesignResult>& designs,
                       const std::vector<RequirementCheck>* checks = nullptr,
                       const CsvRunColumns& run = {});
void write_cash_flows_csv(std::ostream& out, const std::vector<DesignResult>& designs,
                          const CsvRunColumns& run = {});

// A text field of a CSV row: as it is, or in double quotes (inner quotes doubled) when it holds
// a comma, a quote or a line break (RFC 4180).
std::string csv_text(const std::string& text);

// The opening fields of a JSON report: stowage_version, study, site, project_years,
// real_discount_rate and currency; then, only when the study gives exchange rates,
// exchange_rates: [{currency, rate, profiles}] (1 currency = rate study-currency units; the
// ids of the profiles whose prices were converted with it).
void write_study_json(JsonWriter& json, const StudyCase& study);

// The opening lines of a report: tool and version, what it does, the study, site and economics
// (with a line per exchange rate the study gives).
void print_study_header(std::ostream& out, const StudyCase& study, const std::string& what);

// "1 USD = 0.92 EUR, applied to the prices of profile lfp-usd" (or "..., not used").
std::string exchange_rate_text(const ExchangeRate& rate, const std::string& study_currency);

// The caution every report and the README carry: planning estimate, hazards, defer to codes.
void print_safety_notice(std::ostream& out);

}  // namespace stowage::report
