// SPDX-License-Identifier: MIT
// The study report (`stowage report`, `optimise --report`): what was decided and why, the
// inputs with their units and sources, the fingerprint of every input file, the ranking with
// its cost breakdown, the recommended design over its life, method, limits and the safety
// cautions. Built once as a ReportDocument and written as report.html (html_report.h) and
// report.md (markdown_report.h) with the figures as .svg files beside them, together with the
// data it was made from: result.json (write_optimise_json, the same result object),
// designs.csv, cash-flows.csv and recommended-first-year.csv (the hourly trace the SOC,
// rainflow and temperature figures draw).
// Every number shown is read from the OptimiseResult, the LoadedStudy or the DesignTrace and
// formatted by number_format.h; none is re-derived. Numbers that result.json also carries are
// tagged with their JSON path (report_document.h) so a test can compare them.
// The only line that changes between reruns of the same inputs is the "Generated ..." line.
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/confidence_check.h"
#include "optimiser/analysis/design_trace.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/optimise.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/report_document.h"
#include "optimiser/report/study_hash.h"

namespace stowage::report {

struct ReportInputs {
  const LoadedStudy* loaded = nullptr;     // required
  const OptimiseResult* result = nullptr;  // required
  // First-year trace of result->best(), required when the result is feasible.
  const DesignTrace* trace = nullptr;
  std::string generated_at;  // UTC time stamp, e.g. from report_timestamp()
  // One-at-a-time sensitivity of the study's variations (optimiser/analysis/sweep.h), or null
  // when the study names none: a "Sensitivity" section after the ranking (table and tornado
  // chart) and tornado.json / tornado.csv in the output set (sweep_report.h's writers).
  const TornadoResult* tornado = nullptr;
  // The winner's low-confidence inputs (optimiser/analysis/confidence_check.h), or null: the
  // decision section then says whether one of them could cost the winner its lead, and
  // result.json carries it as `low_confidence`.
  const ConfidenceCheck* confidence = nullptr;
  // Extension point for analyses run on the same study (sensitivity, break-even,
  // uncertainty, tender scoring): each section a caller builds from its own result object is
  // placed after the ranking, in the given order, and written by both renderers like every
  // other section (figures too). Empty when none was run: the report then has no such section.
  std::vector<ReportSection> analysis_sections;
};

// Throws ContractViolation when a required input is missing.
ReportDocument build_study_report(const ReportInputs& inputs);

// Adds report.html, report.md, one .svg per figure and the data files to `set` (not yet
// committed). The inputs must outlive set.commit().
void add_report_files(OutputSet& set, const ReportInputs& inputs);

// Sections every report ends with, shared with the tender report (tender_document.h):
// the tool version and the SHA-256 of every input file with the digest over them (named
// "<digest_name> digest"), and the safety cautions (print_safety_notice's wording).
ReportSection reproduce_section(const StudyHash& hash, const std::string& digest_name);
ReportSection safety_section();
// Sections shared with the robustness reports (robustness_document.h): the sensitivity of a
// tornado run whose numbers are those of the file `json_name` (table and tornado chart;
// requires tornado.base.feasible()), the method and validation summary (saying where the
// search's proof status is read), and the study's assumptions and limits.
ReportSection sensitivity_section(const StudyCase& study, const TornadoResult& tornado,
                                  const std::string& json_name);
ReportSection study_method_section(bool proof_status_shown);  // false: no proof status above
ReportSection study_limits_section();
// Adds report.html, report.md and one .svg per figure of `doc` to `set`; the files share doc.
void add_document_files(OutputSet& set, std::shared_ptr<const ReportDocument> doc);

// "YYYY-MM-DDTHH:MM:SSZ": the time given by SOURCE_DATE_EPOCH when it is set to a number of
// seconds (reproducible builds convention), else now.
std::string report_timestamp();

}  // namespace stowage::report
