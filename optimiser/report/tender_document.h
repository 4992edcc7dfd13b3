// SPDX-License-Identifier: MIT
// The tender report (`stowage tender TENDER --report DIR`): the feasibility-grade document an
// evaluator attaches to a tender decision. Built once as a ReportDocument
// (report_document.h) and written by the same two renderers as the study report: report.html
// (inline CSS and SVG) and report.md with its figure as an .svg file beside it, together with
// the data it was made from: tender.json (write_tender_json, the same result object),
// bids.csv, designs.csv and cash-flows.csv (as `tender --out` writes them).
//
// Content, in order: the decision (recommended bid, NPC, LCOS in both conventions, runner-up
// and margin, where the difference comes from, a near-tie call-out); the scoring table; with
// variations, the sampled NPC and LCOS percentiles and win probabilities; the
// present-value cost breakdown per bid (table and stacked chart); each bid's warranty against
// its modelled life and the claims to question in clarification; the non-compliant bids with
// their shortfalls; the inputs (basis, requirements, weights, site, each bid's offer, prices
// and warranty terms); the SHA-256 of every input file with the tool version
// (study_report.h's reproduce_section); method, limits and the safety cautions.
//
// Every number shown is read from the TenderResult or the TenderCase and formatted by
// number_format.h; none is re-derived except the margins between two shown numbers. Cells
// whose number tender.json also carries are tagged with its JSON path (for example
// "bids[0].npc"), which tests/e2e/tender_report.sh compares with the JSON. The only line that
// changes between reruns of the same inputs is the "Generated ..." line.
#pragma once

#include <string>

#include "catalog-schema/tender_loader.h"
#include "optimiser/analysis/tender.h"
#include "optimiser/analysis/tender_uncertainty.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/report_document.h"

namespace stowage::report {

struct TenderReportInputs {
  const TenderCase* tender = nullptr;    // required
  const TenderResult* result = nullptr;  // required, evaluate_tender(*tender)
  std::string generated_at;              // UTC time stamp, e.g. from report_timestamp()
  // Optional: run_tender_uncertainty() on the tender's variations. When given, the decision's
  // near-tie call is the samples' and an Uncertainty section follows the scoring, and
  // tender.json carries the same "uncertainty" object as `tender --format json`.
  const TenderUncertainty* uncertainty = nullptr;
};

// Throws ContractViolation when a required input is missing; an InputError when an input
// file can no longer be read for its SHA-256.
ReportDocument build_tender_report(const TenderReportInputs& inputs);

// Adds report.html, report.md, the figure's .svg and the data files to `set` (not yet
// committed). The inputs must outlive set.commit().
void add_tender_report_files(OutputSet& set, const TenderReportInputs& inputs);

}  // namespace stowage::report
