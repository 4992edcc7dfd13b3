// SPDX-License-Identifier: MIT
// The robustness reports: `stowage sweep --report DIR`, `uncertainty --report DIR` and
// `breakeven --report DIR`. Each is built once as a ReportDocument (report_document.h) and
// written by the study report's renderers (study_report.h's add_document_files): report.html,
// report.md and one .svg per figure, together with the data it was made from, the same files
// `--out` writes:
//   sweep (tornado):  sweep.json, tornado.csv
//   sweep --grid:     sweep.json, grid.csv
//   uncertainty:      uncertainty.json, summary.csv, samples.csv
//   breakeven:        breakeven.json, probes.csv
// Content, in order: the decision (what the analysis says about the base case's answer); the
// analysis (tables and figures, robustness_charts.h); the inputs it moved; the study's
// SHA-256 fingerprint and the tool version; how the analysis works with the study report's
// method summary; its limits with the study's; the safety cautions. Sections shared with the
// study report are study_report.h's, not written twice.
// Every number shown is read from the result object and formatted by number_format.h; none is
// re-derived (the counts of grid points per winner are counted, not computed). Cells whose
// number the JSON also carries are tagged with its JSON path (for example
// "profiles[0].npc.p50", "scan[3].gap", "points[4].designs[1].npc"), which
// tests/e2e/robustness_report.sh compares with the JSON. The only line that changes between
// reruns of the same inputs is the "Generated ..." line.
#pragma once

#include <string>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/breakeven.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/analysis/uncertainty.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/report_document.h"

namespace stowage::report {

// `generated_at`: UTC time stamp, e.g. from report_timestamp(). An InputError when an input
// file can no longer be read for its SHA-256.
ReportDocument build_tornado_report(const LoadedStudy& loaded, const TornadoResult& result,
                                    const std::string& generated_at);
ReportDocument build_grid_report(const LoadedStudy& loaded, const GridResult& result,
                                 const std::string& generated_at);
ReportDocument build_uncertainty_report(const LoadedStudy& loaded, const UncertaintyResult& result,
                                        const std::string& generated_at);
ReportDocument build_breakeven_report(const LoadedStudy& loaded, const BreakevenResult& result,
                                      const std::string& generated_at);

// Add the report's files and its data files (above) to `set`, not yet committed. The
// arguments must outlive set.commit().
void add_tornado_report_files(OutputSet& set, const LoadedStudy& loaded,
                              const TornadoResult& result, const std::string& generated_at);
void add_grid_report_files(OutputSet& set, const LoadedStudy& loaded, const GridResult& result,
                           const std::string& generated_at);
void add_uncertainty_report_files(OutputSet& set, const LoadedStudy& loaded,
                                  const UncertaintyResult& result, const std::string& generated_at);
void add_breakeven_report_files(OutputSet& set, const LoadedStudy& loaded,
                                const BreakevenResult& result, const std::string& generated_at);

}  // namespace stowage::report
