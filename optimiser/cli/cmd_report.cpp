// SPDX-License-Identifier: MIT
// `stowage report STUDY --out DIR`: optimise the study and write the study report
// (optimiser/report/study_report.h) as an output set: report.html, report.md, the figures as
// .svg files, and the JSON and CSV files the report was made from.
#include <iostream>
#include <memory>
#include <optional>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/confidence_check.h"
#include "optimiser/analysis/design_trace.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/optimise.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/study_report.h"

namespace stowage::cli {

int write_study_report(report::OutputSet& files, const LoadedStudy& loaded,
                       const OptimiseResult& result, const ConfidenceCheck* confidence) {
  std::optional<DesignTrace> trace;
  if (result.feasible()) trace = trace_first_year(loaded.study, result.best());
  // A study that names variations gets its one-at-a-time sensitivity in the report.
  std::optional<TornadoResult> tornado;
  if (result.feasible() && !loaded.variations.empty()) {
    tornado = run_tornado(loaded.study, loaded.variations, SweepOptions{});
  }
  report::ReportInputs inputs;
  inputs.loaded = &loaded;
  inputs.result = &result;
  inputs.trace = trace ? &*trace : nullptr;
  inputs.tornado = tornado ? &*tornado : nullptr;
  inputs.confidence = confidence;
  inputs.generated_at = report::report_timestamp();
  report::add_report_files(files, inputs);
  files.commit();
  return optimise_exit_code(result);
}

namespace {

struct ReportArgs {
  std::string study_path;
  std::string out_dir;
};

}  // namespace

void register_report(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<ReportArgs>();
  auto* cmd = app.add_subcommand(
      "report",
      "Optimise a study and write a report (HTML, Markdown with SVG figures) with the data it "
      "was made from");
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  cmd->add_option("--out", args->out_dir,
                  "Directory for report.html, report.md, the figures and the data files")
      ->type_name("DIR")
      ->required();
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      report::OutputSet files(args->out_dir);  // refuses a bad DIR now
      const LoadedStudy loaded = load_study_details_file(args->study_path);
      const OptimiseResult result = optimise(loaded.study);
      std::optional<ConfidenceCheck> confidence;
      if (result.feasible())
        confidence = check_low_confidence(loaded.study, loaded.profiles, result);
      const int code =
          write_study_report(files, loaded, result, confidence ? &*confidence : nullptr);
      std::cout << "stowage: report written to " << args->out_dir << "/report.html and "
                << args->out_dir << "/report.md\n";
      return code;
    });
  });
}

}  // namespace stowage::cli
